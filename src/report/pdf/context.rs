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

/// Money to three significant figures with k, M or bn, for prose and key
/// figures, where a figure to the unit would be false precision for a
/// screening estimate: `37111370.52` → `"EUR 37.1 M"`, `-1453686` →
/// `"EUR -1.45 M"`, `950` → `"EUR 950"`. Code and amount stay on one line.
/// The ledger and the JSON keep the full figures.
pub fn short_money(value: Decimal, currency: &str) -> String {
    let magnitude = value.abs().round_sf(3).unwrap_or_else(|| value.abs());
    let (divisor, suffix) = if magnitude >= Decimal::from(1_000_000_000) {
        (Decimal::from(1_000_000_000), "\u{a0}bn")
    } else if magnitude >= Decimal::from(1_000_000) {
        (Decimal::from(1_000_000), "\u{a0}M")
    } else if magnitude >= Decimal::from(1_000) {
        (Decimal::from(1_000), "\u{a0}k")
    } else {
        (Decimal::ONE, "")
    };
    let scaled = magnitude / divisor;
    // Three significant figures: as many decimals as the integer part
    // leaves (9.40, 37.1, 950); large amounts in bn keep their digits.
    let integer_digits = scaled.trunc().to_string().len();
    // Below a thousand, whole currency units.
    let decimals = if suffix.is_empty() {
        0
    } else {
        3usize.saturating_sub(integer_digits)
    };
    let sign = if value.is_sign_negative() && !magnitude.is_zero() {
        "-"
    } else {
        ""
    };
    format!("{currency}\u{a0}{sign}{scaled:.decimals$}{suffix}")
}

/// A unit price (per MWh, per kW-year, per GJ) to the cent, code and
/// amount on one line.
pub fn unit_price(value: Decimal, currency: &str) -> String {
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
        present_value_date => m.present_value_date.clone(),
        present_value_base => m.present_value_base.clone(),
        present_value_note => m.present_value_note.clone(),
    }
}

/// The chance that candidate `id` beats the baseline in the risk
/// section, as printed ("83 %"), when the risk section was run.
fn chance(model: &Model, id: &str) -> Option<String> {
    let risk = model.risk.as_ref()?;
    let c = risk.candidates.iter().find(|c| c.candidate_id == id)?;
    Some(format::percent(c.probability_beats_baseline, 0))
}

fn runner_up(model: &Model) -> Value {
    let currency = &model.meta.currency;
    match &model.decision.runner_up {
        None => Value::from(()),
        Some(r) => context! {
            id => r.id.clone(),
            label => r.label.clone(),
            net_savings => short_money(r.net_savings, currency),
            headroom => short_money(r.headroom, currency),
            discounted_payback => format::payback(r.discounted_payback),
            chance => chance(model, &r.id),
        },
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
        net_savings_short => short_money(d.net_savings, currency),
        headroom_short => short_money(d.break_even_premium - d.premium_asked, currency),
        break_even_premium_short => short_money(d.break_even_premium, currency),
        premium_asked_short => short_money(d.premium_asked.abs(), currency),
        cheaper_to_buy => d.premium_asked.is_sign_negative() && !d.premium_asked.is_zero(),
        discounted_payback => format::payback(d.discounted_payback),
        chance => chance(model, &d.preferred_id),
        runner_up => runner_up(model),
        preferred_id => d.preferred_id.clone(),
        preferred_label => d.preferred_label.clone(),
        preferred_is_baseline => d.preferred_is_baseline,
        preferred_datasheet_verdict => model
            .candidates
            .iter()
            .find(|c| c.id == d.preferred_id)
            .and_then(|c| c.performance.implied.as_ref())
            .map(|i| i.verdict.clone())
            .filter(|v| v != "plausible"),
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
            net_savings_short => e.net_savings_vs_baseline.map(|v| short_money(v.abs(), currency)),
            break_even_premium_short => e.break_even_premium.map(|v| short_money(v.abs(), currency)),
            premium_asked_short => e.premium_asked.map(|v| short_money(v.abs(), currency)),
            margin_short => short_money(c.verdict.margin.abs(), currency),
            costs_more_at_no_premium => e.break_even_premium.is_some_and(|v| v.is_sign_negative() && !v.is_zero()),
            cheaper_to_buy => e.premium_asked.is_some_and(|v| v.is_sign_negative() && !v.is_zero()),
            chance => chance(model, &c.id),
            discounted_payback => format::payback(e.discounted_payback),
            simple_payback => format::payback(e.simple_payback),
            datasheet_verdict => c.performance.implied.as_ref().map(|i| i.verdict.clone()),
            datasheet_reason => c.performance.implied.as_ref().and_then(|i| i.reasons.first().cloned()),
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

#[cfg(test)]
mod tests {
    use super::short_money;
    use rust_decimal::Decimal;
    use std::str::FromStr;

    #[test]
    fn money_in_prose_has_three_significant_figures() {
        // Three significant figures, half away from zero on the third
        // (rust_decimal's round_sf, common practice for quoted figures).
        let d = |s: &str| Decimal::from_str(s).unwrap_or_default();
        let cases = [
            ("37111370.52", "EUR 37.1 M"),
            ("-1453686", "EUR -1.45 M"),
            ("999600", "EUR 1.00 M"),
            ("9400000", "EUR 9.40 M"),
            ("45915", "EUR 45.9 k"),
            ("950", "EUR 950"),
            ("0", "EUR 0"),
            ("163000000", "EUR 163 M"),
            ("2540000000", "EUR 2.54 bn"),
        ];
        for (value, printed) in cases {
            assert_eq!(short_money(d(value), "EUR").replace('\u{a0}', " "), printed);
        }
    }
}
