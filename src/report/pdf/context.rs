//! The values the report templates may use, built from the model. Money is
//! passed already formatted (as printed elsewhere in the report), so a
//! template cannot print a figure differently from the tables.

use crate::report::format;
use crate::report::model::{CandidateView, Model, VerdictKind};
use minijinja::{context, Value};
use rust_decimal::Decimal;

/// Money as the report prints it, keeping the code with the amount on one
/// line (no-break space).
pub fn money(value: Decimal, currency: &str) -> String {
    format::money(value, currency).replacen(' ', "\u{a0}", 1)
}

/// A unit price (per MWh, per kW-year) to the cent, code and amount on one
/// line.
fn unit_price(value: Decimal, currency: &str) -> String {
    format!("{currency}\u{a0}{}", format::grouped(value, 2))
}

/// Optional money as the report prints it ("n/a" when absent).
pub fn money_opt(value: Option<Decimal>, currency: &str) -> String {
    value.map_or_else(|| format::money_opt(None, currency), |v| money(v, currency))
}

fn method(model: &Model) -> Value {
    let m = &model.method;
    let currency = &model.meta.currency;
    context! {
        gas_models => m.gas_models.clone(),
        rate_basis => m.rate_basis.clone(),
        discount_rate => m.discount_rate,
        discount_rate_percent => format::percent(m.discount_rate, 2),
        inflation => m.inflation,
        inflation_percent => format::percent(m.inflation, 2),
        timing => m.timing.clone(),
        service_life_years => m.service_life_years,
        fuel_price_basis => m.fuel_price_basis.clone(),
        hhv_over_lhv => m.hhv_over_lhv,
        hhv_over_lhv_text => format!("{:.4}", m.hhv_over_lhv),
        rounding => m.rounding.clone(),
        levelled => m.levelled,
        energy_value => unit_price(m.energy_value_per_mwh, currency),
        capacity_value => unit_price(m.capacity_value_per_kw_year, currency),
    }
}

fn decision(model: &Model) -> Value {
    let d = &model.decision;
    let currency = &model.meta.currency;
    let baseline_label = model
        .candidates
        .iter()
        .find(|c| c.is_baseline)
        .map_or_else(|| model.meta.baseline_id.clone(), |c| c.label.clone());
    context! {
        preferred_id => d.preferred_id.clone(),
        preferred_label => d.preferred_label.clone(),
        preferred_is_baseline => d.preferred_is_baseline,
        break_even_premium => money(d.break_even_premium, currency),
        premium_asked => money(d.premium_asked, currency),
        net_savings => money(d.net_savings, currency),
        margin => money(d.break_even_premium - d.premium_asked, currency),
        baseline_id => model.meta.baseline_id.clone(),
        baseline_label => baseline_label,
    }
}

/// Values every template may use: `meta`, `method`, `decision`.
pub fn base(model: &Model) -> Value {
    context! {
        meta => Value::from_serialize(&model.meta),
        method => method(model),
        decision => decision(model),
    }
}

/// The base values plus `candidate` (for `verdict.j2`).
pub fn with_candidate(model: &Model, c: &CandidateView) -> Value {
    let currency = &model.meta.currency;
    let e = &c.economics;
    let kind = match c.verdict.kind {
        VerdictKind::Baseline => "baseline",
        VerdictKind::WorthPremium => "worth_premium",
        VerdictKind::NotWorthPremium => "not_worth_premium",
    };
    context! {
        meta => Value::from_serialize(&model.meta),
        method => method(model),
        decision => decision(model),
        candidate => context! {
            id => c.id.clone(),
            label => c.label.clone(),
            kind => kind,
            is_baseline => c.is_baseline,
            capital_cost => money(e.capital_cost, currency),
            lifecycle_cost => money(e.lifecycle_cost, currency),
            net_savings => money_opt(e.net_savings_vs_baseline, currency),
            break_even_premium => money_opt(e.break_even_premium, currency),
            premium_asked => money_opt(e.premium_asked, currency),
            margin => money(c.verdict.margin, currency),
            shortfall => money(-c.verdict.margin, currency),
            discounted_payback => format::payback(e.discounted_payback),
            simple_payback => format::payback(e.simple_payback),
        },
    }
}

/// Values of `footer.j2`: `page`, `pages` and the base values.
pub fn footer(model: &Model, page: usize, pages: usize) -> Value {
    context! {
        meta => Value::from_serialize(&model.meta),
        page => page,
        pages => pages,
    }
}
