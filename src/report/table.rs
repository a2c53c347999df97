//! Terminal renderer: a performance table, an economics table and one
//! verdict line per candidate, aligned, units in headers.

use super::format::{self, money, money_opt};
use super::model::{CandidateView, Model, Units, VerdictKind};
use super::Renderer;
use tabled::builder::Builder;
use tabled::settings::{object::Columns, Alignment, Style};

/// Renders the comparison for people at a terminal.
pub struct TableRenderer;

impl Renderer for TableRenderer {
    fn render(&self, model: &Model) -> crate::Result<Vec<u8>> {
        let mut out = String::new();
        let meta = &model.meta;
        out.push_str(&format!("{}\n", meta.title));
        out.push_str(&format!(
            "Baseline: {}   Currency: {}   Scenario: {} (sha256 {})\n",
            meta.baseline_id,
            meta.currency,
            meta.scenario_file,
            &meta.scenario_sha256[..meta.scenario_sha256.len().min(12)]
        ));
        let m = &model.method;
        out.push_str(&format!(
            "Fuel price: {}\n\n",
            format::fuel_price_echo(
                m.fuel_price_per_gj,
                m.fuel_price_written.as_deref(),
                &meta.currency,
                &m.fuel_price_basis,
                &m.fuel_price_unit,
                meta.units,
            )
        ));
        out.push_str("Performance at site, new and clean, full load (heat rate on LHV)\n");
        out.push_str(&performance_table(model));
        out.push_str("\n\nEconomics over the service life (present values)\n");
        out.push_str(&format!("{}\n", m.present_value_note));
        out.push_str(&economics_table(model));
        out.push_str(
            "\n\nEvaluation factors: what one unit more of each figure is worth over the life \
             (present values; heat rate at full load)\n",
        );
        out.push_str(&factors_table(model));
        out.push_str("\n\nVerdict\n");
        for c in &model.candidates {
            out.push_str(&format!("  {}\n", verdict_line(c, &meta.currency)));
        }
        if !model.sensitivity.is_empty() {
            out.push_str("\nSensitivity of net savings (largest swing first)\n");
            out.push_str(&sensitivity_table(model));
            out.push('\n');
        }
        if !model.information.is_empty() {
            out.push_str("\nInformation\n");
            for n in &model.information {
                out.push_str(&format!("  - {n}\n"));
            }
        }
        if !model.warnings.is_empty() {
            out.push_str("\nWarnings\n");
            for w in &model.warnings {
                out.push_str(&format!("  - {w}\n"));
            }
        }
        out.push_str(
            "\nScreening-level estimate: not a substitute for vendor guarantees, acceptance \
             testing, or licensed engineering and financial advice.\n",
        );
        Ok(out.into_bytes())
    }
}

fn finish(mut builder_table: tabled::Table) -> String {
    builder_table
        .with(Style::psql())
        .modify(Columns::new(1..), Alignment::right());
    builder_table.to_string()
}

fn performance_table(model: &Model) -> String {
    use format::Quantity as Q;
    let units = model.meta.units;
    let mut b = Builder::default();
    b.push_record([
        "candidate".to_string(),
        "net output MW".to_string(),
        format!("heat rate {}", format::unit(Q::HeatRate, units)),
        "efficiency %".to_string(),
        format!("exhaust {}", format::unit(Q::Temperature, units)),
        format!("air flow {}", format::unit(Q::MassFlow, units)),
        format!("fuel flow {}", format::unit(Q::FuelMassFlow, units)),
    ]);
    for c in &model.candidates {
        let p = &c.performance;
        let fuel_decimals = match units {
            Units::Si => 3,
            Units::Us => 0,
        };
        b.push_record([
            c.id.clone(),
            format::number(p.net_output_kw / 1000.0, 2),
            format::number(
                format::in_units(Q::HeatRate, p.heat_rate_kj_per_kwh, units),
                0,
            ),
            format!("{:.2}", p.thermal_efficiency * 100.0),
            format::value(Q::Temperature, p.exhaust_temperature_k, units, 1),
            format::value(Q::MassFlow, p.air_flow_kg_per_s, units, 2),
            format::number(
                format::in_units(Q::FuelMassFlow, p.fuel_flow_kg_per_s, units),
                fuel_decimals,
            ),
        ]);
    }
    finish(b.build())
}

fn economics_table(model: &Model) -> String {
    let cur = &model.meta.currency;
    // The settlement column only when some candidate settles a guarantee,
    // so capital + settlement is what the buyer pays net at the test.
    let settled = model.settled();
    let mut b = Builder::default();
    let mut header = vec!["candidate", "capital"];
    if settled {
        header.push("guarantee settlement (PV)");
    }
    header.extend([
        "lifecycle cost",
        "LCOE /MWh",
        "net savings",
        "break-even premium",
        "premium asked",
        "SIR",
        "AIRR %",
        "disc. payback",
    ]);
    b.push_record(header);
    for c in &model.candidates {
        let e = &c.economics;
        let mut record = vec![c.id.clone(), money(e.capital_cost, cur)];
        if settled {
            record.push(money(c.cost_breakdown.guarantee_settlement, cur));
        }
        record.extend([
            money(e.lifecycle_cost, cur),
            format!("{} {}", cur, format::grouped(e.levelized_cost_per_mwh, 2)),
            money_opt(e.net_savings_vs_baseline, cur),
            money_opt(e.break_even_premium, cur),
            money_opt(e.premium_asked, cur),
            sir_cell(e),
            e.adjusted_irr
                .map_or_else(|| "n/a".into(), |v| format!("{:.2}", v * 100.0)),
            format::payback(e.discounted_payback),
        ]);
        b.push_record(record);
    }
    let mut text = finish(b.build());
    if settled {
        text.push_str(
            "\nGuarantee settlement: damages received from the vendor (negative) or bonus paid \
             (positive) at the acceptance test, already in the lifecycle cost.",
        );
    }
    text
}

fn factors_table(model: &Model) -> String {
    let cur = &model.meta.currency;
    let units = model.meta.units;
    let m = &model.method;
    let mut b = Builder::default();
    b.push_record([
        "candidate".to_string(),
        format!(
            "1 {} lower heat rate",
            format::unit(format::Quantity::HeatRate, units)
        ),
        "1 kW more output".to_string(),
        "1 pt compressor".to_string(),
        "1 pt turbine".to_string(),
        "1 pt regenerator".to_string(),
        "break-even fuel price".to_string(),
    ]);
    for c in &model.candidates {
        let e = &c.economics;
        let fuel = match e.break_even_fuel_price {
            None => "n/a".to_string(),
            Some(p) if p.is_sign_negative() => "none above zero".to_string(),
            Some(p) => format::fuel_price_as(p, cur, &m.fuel_price_basis, &m.fuel_price_unit),
        };
        b.push_record([
            c.id.clone(),
            money(
                format::per_heat_rate_unit(e.value_per_kj_per_kwh_full_load, units),
                cur,
            ),
            money(e.value_per_kw, cur),
            money(e.value_per_point.compressor_efficiency, cur),
            money(e.value_per_point.turbine_efficiency, cur),
            money_opt(e.value_per_point.regenerator_effectiveness, cur),
            fuel,
        ]);
    }
    finish(b.build())
}

fn sensitivity_table(model: &Model) -> String {
    let cur = &model.meta.currency;
    let mut b = Builder::default();
    b.push_record([
        "candidate",
        "input",
        "low",
        "high",
        "change at low",
        "change at high",
    ]);
    for bar in &model.sensitivity {
        let mut key = bar.key.clone();
        if bar.default_range {
            key.push_str(" (±20 % default)");
        }
        b.push_record([
            bar.candidate_id.clone(),
            key,
            bar.low_value.clone(),
            bar.high_value.clone(),
            money(bar.delta_at_low, cur),
            money(bar.delta_at_high, cur),
        ]);
    }
    finish(b.build())
}

/// One verdict line in plain words.
pub fn verdict_line(c: &CandidateView, currency: &str) -> String {
    let e = &c.economics;
    let negative =
        |v: Option<rust_decimal::Decimal>| v.is_some_and(|v| v < rust_decimal::Decimal::ZERO);
    // Negative amounts are worded the way the briefing words them
    // (templates/report/verdict.j2), never printed with a minus sign.
    let cheaper_to_buy = negative(e.premium_asked);
    let costs_more_at_no_premium = negative(e.break_even_premium);
    let abs = |v: Option<rust_decimal::Decimal>| money_opt(v.map(|v| v.abs()), currency);
    let head = format!("{} ({})", c.id, c.label);
    match c.verdict.kind {
        VerdictKind::Baseline => format!("{head}: the baseline."),
        VerdictKind::WorthPremium if cheaper_to_buy => format!(
            "{head}: cheaper to buy, by {}, and cheaper to own: it saves {} over the life.",
            abs(e.premium_asked),
            money_opt(e.net_savings_vs_baseline, currency)
        ),
        VerdictKind::WorthPremium => format!(
            "{head}: worth its premium. It asks {} over the baseline and would break even at {}, \
             leaving {} of headroom.",
            money_opt(e.premium_asked, currency),
            money_opt(e.break_even_premium, currency),
            money(c.verdict.margin, currency)
        ),
        VerdictKind::NotWorthPremium if cheaper_to_buy && costs_more_at_no_premium => format!(
            "{head}: cheaper to buy, by {}, but costs more to own: to break even it would have \
             to be {} cheaper than the baseline, {} more than it is.",
            abs(e.premium_asked),
            abs(e.break_even_premium),
            money(c.verdict.margin.abs(), currency)
        ),
        VerdictKind::NotWorthPremium if cheaper_to_buy => format!(
            "{head}: cheaper to buy, by {}, but costs {} more to own over the life.",
            abs(e.premium_asked),
            abs(e.net_savings_vs_baseline)
        ),
        VerdictKind::NotWorthPremium if costs_more_at_no_premium => format!(
            "{head}: costs more to own than the baseline even at no premium, by {} in present \
             value, and its bid asks {} more.",
            abs(e.break_even_premium),
            money_opt(e.premium_asked, currency)
        ),
        VerdictKind::NotWorthPremium => format!(
            "{head}: not worth its premium. It asks {} over the baseline but breaks even at {}, \
             {} too much.",
            money_opt(e.premium_asked, currency),
            money_opt(e.break_even_premium, currency),
            money(-c.verdict.margin, currency)
        ),
    }
}

/// The savings-to-investment ratio as the table prints it: a negative
/// ratio (the bid asks a premium and saves nothing on running costs) is
/// worded as the briefing words it.
fn sir_cell(e: &super::model::EconomicsView) -> String {
    match e.savings_to_investment_ratio {
        None => "n/a".into(),
        Some(v) if v < 0.0 => "none: costs more to own even at no premium".into(),
        Some(v) => format!("{v:.2}"),
    }
}
