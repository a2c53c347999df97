//! Study → report model: the one place where results are chosen, labelled
//! and rounded for presentation (money to the currency's minor unit with the
//! finance layer's midpoint rule).

use super::compare::{run_study, CandidateOutcome, Study};
use super::evaluate::Solved;
use super::implied::{implied_bids, verdict_warning, ImpliedBid};
use super::sensitivity::{rank, RangeSource, Swing};
use super::site::Basis;
use super::warnings::cycle_warnings;
use crate::finance::{
    compare_summaries, round_for_presentation, summarize_ledger, BreakEvenFuelPrice, Payback,
    RowKind, DEFAULT_MINOR_UNIT_DECIMALS,
};
use crate::report::model::*;
use crate::scenario::{
    engineering_warnings, information_notes, LoadedScenario, PriceBasis, RateBasis, Timing,
};
use rust_decimal::Decimal;

/// What to include in the model.
#[derive(Debug, Clone)]
pub struct ModelOptions {
    /// Display unit system.
    pub units: Units,
    /// Include the sensitivity ranking in the model's tables (the briefing's
    /// key assumptions are always computed).
    pub sensitivity: bool,
}

/// Money for presentation: rounded once to the minor unit and always
/// written with its two decimals (`"0.00"`, not `"0"`).
fn money(value: Decimal) -> Decimal {
    let mut rounded = round_for_presentation(value, DEFAULT_MINOR_UNIT_DECIMALS);
    rounded.rescale(DEFAULT_MINOR_UNIT_DECIMALS);
    rounded
}

fn payback_view(p: Payback) -> PaybackView {
    match p {
        Payback::Years(y) => PaybackView::Years(y),
        Payback::NeverWithinLife => PaybackView::NeverWithinLife,
    }
}

/// Unique labels of a ledger's rows: capital payments by year
/// (`"2026 construction"`, or by date when two fall in one year; one paid on
/// the commercial-operation date is `"capital at commercial operation"`),
/// `"acceptance test"`, operating rows by calendar year (`"2027
/// operation"`), and `"end of life"` for the residual credit. Capital dates
/// strictly ascend and there is one operating row per calendar year, so no
/// two labels are equal.
pub fn ledger_row_labels(
    rows: &[crate::finance::LedgerRow],
    commercial_operation: chrono::NaiveDate,
) -> Vec<String> {
    let capital_in = |year: i32| {
        rows.iter()
            .filter(|r| r.kind == RowKind::Capital && r.year == year)
            .count()
    };
    rows.iter()
        .map(|r| match r.kind {
            RowKind::Capital if r.period_start == commercial_operation => {
                "capital at commercial operation".to_string()
            }
            RowKind::Capital if capital_in(r.year) > 1 => {
                format!("{} construction", r.period_start)
            }
            RowKind::Capital => format!("{} construction", r.year),
            RowKind::Settlement => "acceptance test".to_string(),
            RowKind::Operation => format!("{} operation", r.year),
            RowKind::Residual => "end of life".to_string(),
        })
        .collect()
}

fn ledger_rows(outcome: &CandidateOutcome) -> Vec<LedgerRowView> {
    let rows = &outcome.ledger.rows;
    let commercial_operation = outcome
        .ledger
        .summary
        .analysis
        .calendar
        .commercial_operation;
    ledger_row_labels(rows, commercial_operation)
        .into_iter()
        .zip(rows)
        .map(|(label, r)| LedgerRowView {
            label,
            year: r.year,
            period_start: r.period_start.to_string(),
            period_end: r.period_end.to_string(),
            operating_hours: r.operating_hours,
            starts: r.starts,
            energy_mwh: r.energy_mwh,
            fuel_energy_gj: r.fuel_energy_gj,
            fuel_cost: money(r.fuel_cost),
            carbon_cost: money(r.carbon_cost),
            fixed_om: money(r.fixed_om),
            variable_om: money(r.variable_om),
            overhaul: money(r.overhaul),
            bought_in: money(r.bought_in),
            capital: money(r.capital),
            residual: money(r.residual),
            guarantee_settlement: money(r.guarantee_settlement),
            total: money(r.total),
            discount_factor: crate::finance::Money::to_f64(r.discount_factor),
            present_value: money(r.present_value),
        })
        .collect()
}

/// The totals row of a ledger: each column of the unrounded rows summed
/// in row order, then rounded once like every other figure. The present
/// value column sums to the lifecycle cost (the ledger's own definition of
/// it).
fn ledger_total(outcome: &CandidateOutcome) -> LedgerTotalView {
    let rows = &outcome.ledger.rows;
    let sum = |pick: fn(&crate::finance::LedgerRow) -> Decimal| {
        money(rows.iter().map(pick).fold(Decimal::ZERO, |a, b| a + b))
    };
    let physics = |pick: fn(&crate::finance::LedgerRow) -> f64| rows.iter().map(pick).sum();
    LedgerTotalView {
        label: "total".to_string(),
        period_start: rows
            .first()
            .map(|r| r.period_start.to_string())
            .unwrap_or_default(),
        period_end: rows
            .last()
            .map(|r| r.period_end.to_string())
            .unwrap_or_default(),
        operating_hours: physics(|r| r.operating_hours),
        starts: physics(|r| r.starts),
        energy_mwh: physics(|r| r.energy_mwh),
        fuel_energy_gj: physics(|r| r.fuel_energy_gj),
        fuel_cost: sum(|r| r.fuel_cost),
        carbon_cost: sum(|r| r.carbon_cost),
        fixed_om: sum(|r| r.fixed_om),
        variable_om: sum(|r| r.variable_om),
        overhaul: sum(|r| r.overhaul),
        bought_in: sum(|r| r.bought_in),
        capital: sum(|r| r.capital),
        residual: sum(|r| r.residual),
        guarantee_settlement: sum(|r| r.guarantee_settlement),
        total: sum(|r| r.total),
        present_value: sum(|r| r.present_value),
    }
}

/// The sentence that states the present-value date and the money basis.
fn present_value_note(scenario: &crate::scenario::Scenario, date: chrono::NaiveDate) -> String {
    let e = &scenario.economics;
    let which = match e.present_value_date {
        crate::scenario::PresentValueDate::CommercialOperation => "the commercial operation date",
        crate::scenario::PresentValueDate::Study => "the study date",
    };
    let money = match e.rate_basis {
        crate::scenario::RateBasis::Real => format!(
            "real money (constant money of {}, general inflation taken out)",
            scenario.meta.date
        ),
        crate::scenario::RateBasis::Nominal => {
            "nominal money (then-current, general inflation included)".to_string()
        }
    };
    format!(
        "Present values are stated at {date}, {which}: construction payments made before it are compounded to it and later cash is discounted to it; all amounts are in {money}."
    )
}

/// When a ledger row's cash counts on the savings curve, and which rows of
/// two ledgers are the same event: capital payments by payment date,
/// operating rows by their period, the residual credit at the end of life.
/// Ordered by time, then capital before operation before residual.
fn event_key(row: &crate::finance::LedgerRow) -> (u8, chrono::NaiveDate, chrono::NaiveDate) {
    let rank = match row.kind {
        // A guarantee settlement is capital-like: paid once, at the
        // acceptance test (commercial operation).
        RowKind::Capital | RowKind::Settlement => 0,
        RowKind::Operation => 1,
        RowKind::Residual => 2,
    };
    (rank, row.period_start, row.period_end)
}

/// Cumulative discounted savings against the baseline, the rows of the two
/// ledgers paired by date (two candidates may pay their capital on
/// different dates and in a different number of instalments). Points:
/// after each capital payment date (at its cash time, before commercial
/// operation), at commercial operation (all capital counted, the start of
/// the payback count), at the end of each operating period, and after the
/// residual credit. Between points the savings accrue evenly, as
/// `finance::payback` assumes, so the curve crosses zero at the discounted
/// payback. The rows' present values are summed as the ledger prints them
/// (rounded to the minor unit), so the curve reconciles with the printed
/// ledger to the cent.
fn cumulative(outcome: &CandidateOutcome, baseline: &CandidateOutcome) -> Vec<CumulativePoint> {
    use std::collections::BTreeMap;
    // Key → (x position in years, year label, baseline PV − candidate PV).
    type Event = (f64, i32, Decimal);
    let mut events: BTreeMap<(u8, chrono::NaiveDate, chrono::NaiveDate), Event> = BTreeMap::new();
    let rows = outcome
        .ledger
        .rows
        .iter()
        .map(|r| (r, -money(r.present_value)))
        .chain(
            baseline
                .ledger
                .rows
                .iter()
                .map(|r| (r, money(r.present_value))),
        );
    for (row, signed) in rows {
        let x = match row.kind {
            RowKind::Capital | RowKind::Settlement => row.cash_time_years.min(0.0),
            RowKind::Operation | RowKind::Residual => row.time_end_years,
        };
        let entry = events
            .entry(event_key(row))
            .or_insert((x, row.year, Decimal::ZERO));
        entry.2 += signed;
    }
    let mut running = Decimal::ZERO;
    let mut points = Vec::with_capacity(events.len() + 1);
    let mut opened = false;
    for ((rank, start, end), (x, year, delta)) in events {
        if rank > 0 && !opened {
            opened = true;
            points.push(CumulativePoint {
                years_from_start: 0.0,
                year,
                date: start.to_string(),
                savings: running,
            });
        }
        running += delta;
        points.push(CumulativePoint {
            years_from_start: x,
            year,
            date: end.to_string(),
            savings: running,
        });
    }
    points
}

/// Break-even premium of each candidate against first-year fuel price, from
/// a quarter to twice the scenario's price, by re-running both ledgers with
/// every fuel price scaled.
fn fuel_price_curves(loaded: &LoadedScenario, study: &Study) -> FuelPriceCurves {
    const MULTIPLIERS: [i64; 8] = [25, 50, 75, 100, 125, 150, 175, 200];
    let scenario_price = loaded.scenario.fuel.price_per_gj;
    let multipliers: Vec<Decimal> = MULTIPLIERS
        .iter()
        .map(|pct| Decimal::new(*pct, 2))
        .collect();
    // Every fuel price (base price or whole path) scaled by `m`, through the
    // finance layer's own scaling of a fuel price.
    let summary_at = |o: &CandidateOutcome, m: Decimal| {
        let mut inputs = o.inputs.clone();
        inputs.fuel.price = BreakEvenFuelPrice { multiplier: m }.apply(&inputs.fuel.price)?;
        summarize_ledger(&inputs).ok()
    };
    let baseline = &study.outcomes[study.baseline_index];
    let baseline_at: Vec<_> = multipliers
        .iter()
        .map(|m| summary_at(baseline, *m))
        .collect();
    let series = study
        .outcomes
        .iter()
        .enumerate()
        .filter(|(i, _)| *i != study.baseline_index)
        .map(|(i, o)| FuelPriceSeries {
            candidate_id: loaded.scenario.candidates[i].id.clone(),
            points: multipliers
                .iter()
                .zip(&baseline_at)
                .filter_map(|(m, b)| {
                    let c = summary_at(o, *m)?;
                    let premium = compare_summaries(&c, b.as_ref()?)
                        .ok()?
                        .break_even_premium?;
                    Some((money(scenario_price * *m), money(premium)))
                })
                .collect(),
        })
        .collect();
    FuelPriceCurves {
        scenario_price_per_gj: money(scenario_price),
        series,
    }
}

/// What is priced for a candidate: its fixed machine at the site at base
/// load (or its rated figures when the fixed-machine model refuses it).
/// Heat rate in Btu/kWh and CO2 per MWh scale with the heat rate from the
/// design cycle's own conversions (same fuel, same units).
fn performance_view(solved: &Solved, capacity_temperature_k: Option<f64>) -> PerformanceView {
    let cycle = &solved.cycle;
    let site = &solved.site;
    let flows = cycle.flows.as_ref();
    let scale = if cycle.heat_rate_kj_per_kwh > 0.0 {
        site.heat_rate_kj_per_kwh / cycle.heat_rate_kj_per_kwh
    } else {
        1.0
    };
    let common = PerformanceView {
        net_output_kw: site.net_output_kw,
        heat_rate_kj_per_kwh: site.heat_rate_kj_per_kwh,
        heat_rate_btu_per_kwh: cycle.heat_rate_btu_per_kwh * scale,
        thermal_efficiency: cycle.thermal_efficiency,
        exhaust_temperature_k: cycle.exhaust_temperature_k,
        air_flow_kg_per_s: flows.map_or(0.0, |f| f.air_flow_kg_per_s),
        fuel_flow_kg_per_s: flows.map_or(0.0, |f| f.fuel_flow_kg_per_s),
        co2_kg_per_mwh: cycle.co2_kg_per_mwh.unwrap_or(0.0) * scale,
        implied: None,
        site_year: SiteYearView {
            run_hours: solved.year.operating_hours,
            energy_mwh: solved.year.energy_mwh,
            fuel_energy_gj_lhv: solved.year.fuel_energy_gj_lhv,
            mean_heat_rate_kj_per_kwh: if solved.year.energy_mwh > 0.0 {
                solved.year.fuel_energy_gj_lhv * 1000.0 / solved.year.energy_mwh
            } else {
                0.0
            },
            capacity_output_kw: site.capacity_output_kw,
            capacity_temperature_k,
        },
    };
    match &site.basis {
        Basis::Machine(point) => PerformanceView {
            thermal_efficiency: point.thermal_efficiency,
            exhaust_temperature_k: point.stack_temperature_k,
            air_flow_kg_per_s: point.air_flow_kg_per_s,
            fuel_flow_kg_per_s: point.fuel_flow_kg_per_s,
            ..common
        },
        Basis::Rated(_) => common,
    }
}

/// The model's view of what a bid's datasheet implies: the implied values,
/// the verdict, its reasons followed by each disagreement with a stated
/// component value (both values), and the fit's assumptions.
fn implied_view(bid: &ImpliedBid) -> ImpliedView {
    let i = &bid.assessment.implied;
    let mut reasons = i.reasons.clone();
    reasons.extend(
        bid.assessment
            .disagreements
            .iter()
            .map(|d| format!("disagrees with the stated components: {}", d.describe())),
    );
    ImpliedView {
        compressor_polytropic_efficiency: i.compressor_polytropic_efficiency,
        turbine_polytropic_efficiency: i.turbine_polytropic_efficiency,
        firing_temperature_k: i.firing_temperature_k,
        turbine_cooling: i.turbine_cooling,
        air_flow_kg_per_s: i.air_flow_kg_per_s,
        loss_remainder_fraction: i.loss_remainder_fraction,
        verdict: crate::report::views::implied::verdict_word(i.verdict).to_string(),
        reasons,
        assumptions: bid
            .assessment
            .calibration
            .as_ref()
            .map_or_else(Vec::new, |c| c.assumptions.clone()),
    }
}

fn candidate_view(
    loaded: &LoadedScenario,
    study: &Study,
    implied: &[ImpliedBid],
    index: usize,
) -> CandidateView {
    let candidate = &loaded.scenario.candidates[index];
    let outcome = &study.outcomes[index];
    let baseline = &study.outcomes[study.baseline_index];
    let cycle = &outcome.solved.cycle;
    let versus = outcome.versus_baseline.as_ref();
    let savings = versus.map(|v| &v.savings);
    let pv = &outcome.ledger.summary.present_value;
    let break_even = savings.and_then(|s| s.break_even_premium).map(money);
    let asked = savings.map(|s| money(s.premium_asked));
    let verdict = match (break_even, asked) {
        (Some(be), Some(ask)) => Verdict {
            kind: if be >= ask {
                VerdictKind::WorthPremium
            } else {
                VerdictKind::NotWorthPremium
            },
            margin: be - ask,
        },
        _ => Verdict {
            kind: VerdictKind::Baseline,
            margin: Decimal::ZERO,
        },
    };
    let [compressor, turbine, regenerator] = outcome.value_per_point;
    // Dispatch-weighted over base-load heat rate at the site: the year's
    // fuel energy (GJ · 1e6 kJ/GJ) over its energy (MWh · 1e3 kWh/MWh),
    // divided by the base-load heat rate the part-load ratios multiply.
    let operation = &outcome.inputs.operation;
    let site_hr = outcome.solved.site.heat_rate_kj_per_kwh;
    let dispatch_ratio = if operation.energy_mwh > 0.0 && site_hr > 0.0 {
        operation.fuel_energy_gj_lhv * 1000.0 / operation.energy_mwh / site_hr
    } else {
        1.0
    };
    CandidateView {
        id: candidate.id.clone(),
        label: candidate.label.clone(),
        is_baseline: index == study.baseline_index,
        gas_model: cycle.gas_model.to_string(),
        performance: PerformanceView {
            implied: implied.iter().find(|b| b.index == index).map(implied_view),
            ..performance_view(
                &outcome.solved,
                loaded.scenario.economics.capacity_temperature_k,
            )
        },
        cycle: CycleView {
            states: cycle
                .states
                .iter()
                .map(|s| StateRow {
                    id: s.id.to_string(),
                    name: s.name.to_string(),
                    temperature_k: s.temperature_k,
                    pressure_kpa: s.pressure_kpa,
                    enthalpy_kj_per_kg: s.enthalpy_kj_per_kg,
                    entropy_kj_per_kg_k: s.entropy_kj_per_kg_k,
                })
                .collect(),
            compressor_work_kj_per_kg: cycle.compressor_work_kj_per_kg,
            turbine_work_kj_per_kg: cycle.turbine_work_kj_per_kg,
            net_work_kj_per_kg: cycle.net_work_kj_per_kg,
            heat_input_kj_per_kg: cycle.heat_input_kj_per_kg,
            heat_rejected_kj_per_kg: cycle.heat_rejected_kj_per_kg,
            back_work_ratio: cycle.back_work_ratio,
            energy_balance_residual_kj_per_kg: cycle.energy_balance_residual_kj_per_kg,
            fuel_air_ratio: cycle.fuel_air_ratio,
        },
        economics: EconomicsView {
            capital_cost: money(candidate.capital_cost),
            lifecycle_cost: money(outcome.ledger.summary.lifecycle_cost),
            levelized_cost_per_mwh: money(
                outcome
                    .ledger
                    .summary
                    .levelized_cost_per_mwh()
                    .unwrap_or_default(),
            ),
            net_savings_vs_baseline: savings.map(|s| money(s.net_savings)),
            break_even_premium: break_even,
            premium_asked: asked,
            // A ratio to the added investment means something only when
            // there is one: a bid cheaper to buy than the baseline has no
            // added investment, and its ratio (negative) is left out.
            savings_to_investment_ratio: savings
                .filter(|s| s.premium_asked > Decimal::ZERO)
                .and_then(|s| s.savings_to_investment)
                .map(crate::finance::Money::to_f64),
            adjusted_irr: savings
                .filter(|s| s.premium_asked > Decimal::ZERO)
                .and_then(|s| s.adjusted_irr),
            simple_payback: versus.map_or(PaybackView::NotApplicable, |v| {
                payback_view(v.simple_payback)
            }),
            discounted_payback: versus.map_or(PaybackView::NotApplicable, |v| {
                payback_view(v.discounted_payback)
            }),
            break_even_fuel_price: savings
                .and_then(|s| s.break_even_fuel_price)
                .map(|b| money(loaded.scenario.fuel.price_per_gj * b.multiplier)),
            value_per_point: ValuePerPoint {
                compressor_efficiency: money(compressor.unwrap_or_default()),
                turbine_efficiency: money(turbine.unwrap_or_default()),
                regenerator_effectiveness: regenerator.map(money),
            },
            value_per_kj_per_kwh: money(outcome.bid.pv_per_kj_per_kwh.unwrap_or_default()),
            value_per_kj_per_kwh_full_load: money(
                outcome.bid.pv_per_kj_per_kwh.unwrap_or_default()
                    * Decimal::from_f64_retain(dispatch_ratio).unwrap_or(Decimal::ONE),
            ),
            dispatch_heat_rate_ratio: dispatch_ratio,
            value_per_kw: money(outcome.bid.pv_per_kw_net_output),
        },
        verdict,
        cost_breakdown: CostBreakdown {
            capital: money(pv.capital),
            fuel: money(pv.fuel_cost),
            operation_and_maintenance: money(pv.fixed_om + pv.variable_om),
            overhauls: money(pv.overhaul),
            carbon: money(pv.carbon_cost),
            bought_in: money(pv.bought_in),
            residual: money(pv.residual),
            guarantee_settlement: money(pv.guarantee_settlement),
        },
        cost_difference: (index != study.baseline_index).then(|| {
            let b = &baseline.ledger.summary.present_value;
            CostBreakdown {
                capital: money(pv.capital - b.capital),
                fuel: money(pv.fuel_cost - b.fuel_cost),
                operation_and_maintenance: money(
                    pv.fixed_om + pv.variable_om - b.fixed_om - b.variable_om,
                ),
                overhauls: money(pv.overhaul - b.overhaul),
                carbon: money(pv.carbon_cost - b.carbon_cost),
                bought_in: money(pv.bought_in - b.bought_in),
                residual: money(pv.residual - b.residual),
                guarantee_settlement: money(pv.guarantee_settlement - b.guarantee_settlement),
            }
        }),
        cumulative_savings: if index == study.baseline_index {
            Vec::new()
        } else {
            cumulative(outcome, baseline)
        },
        ledger: ledger_rows(outcome),
        ledger_total: ledger_total(outcome),
    }
}

/// Plain-words name of a scenario key for the briefing page.
pub fn key_label(key: &str) -> String {
    const NAMES: [(&str, &str); 10] = [
        ("fuel.price", "fuel price"),
        ("fuel.escalation", "fuel price escalation"),
        ("operation.hours_per_year", "operating hours per year"),
        ("economics.discount_rate", "discount rate"),
        ("economics.inflation", "general inflation"),
        ("economics.carbon_price", "carbon price"),
        ("economics.carbon_escalation", "carbon price escalation"),
        ("economics.capacity_value", "capacity value"),
        ("economics.energy_value", "energy value"),
        ("site.ambient_temperature", "ambient temperature"),
    ];
    if let Some((_, name)) = NAMES.iter().find(|(k, _)| *k == key) {
        return name.to_string();
    }
    let (who, field) = match key.split_once("].") {
        Some((head, field)) => (head.trim_start_matches("candidate[").to_string(), field),
        None => (String::new(), key.strip_prefix("candidate.").unwrap_or(key)),
    };
    let words = field.replace(['_', '.'], " ");
    if who.is_empty() {
        words
    } else {
        format!("{words} ({who})")
    }
}

/// A key's value as shown, with its unit (values are in the scenario's
/// internal units: fractions of one, K, h, currency per GJ / t / kW-yr /
/// MWh).
fn show(key: &str, value: f64, loaded: &LoadedScenario) -> String {
    let scenario = &loaded.scenario;
    let currency = &scenario.meta.currency;
    let basis = match scenario.fuel.price_basis {
        PriceBasis::Hhv => "HHV",
        PriceBasis::Lhv => "LHV",
    };
    let fraction_like = key.contains("rate")
        || key.contains("escalation")
        || key.contains("inflation")
        || key.contains("efficiency")
        || key.contains("effectiveness")
        || key.contains("loss")
        || key.contains("fraction")
        || key.contains("degradation");
    if key == "fuel.price" {
        // In the unit the file wrote its price in (a conversion for
        // display, in the one units module).
        let unit = crate::report::format::scenario_price_unit(loaded);
        <Decimal as rust_decimal::prelude::FromPrimitive>::from_f64(value).map_or_else(
            || format!("{value:.3} {currency}/GJ {basis}"),
            |per_gj| crate::report::format::fuel_price_as(per_gj, currency, basis, &unit),
        )
    } else if key == "economics.carbon_price" {
        format!("{currency} {value:.2}/t CO2")
    } else if key == "economics.capacity_value" {
        format!("{currency} {value:.2}/kW-yr")
    } else if key == "economics.energy_value" {
        format!("{currency} {value:.2}/MWh")
    } else if key.ends_with("hours_per_year") {
        format!("{value:.0} h")
    } else if key.ends_with("temperature") {
        format!("{value:.1} K")
    } else if fraction_like && value.abs() <= 2.0 {
        format!("{:.2} %", value * 100.0)
    } else {
        format!("{value:.4}")
    }
}

fn sensitivity_bars(swings: &[Swing], loaded: &LoadedScenario) -> Vec<SensitivityBar> {
    swings
        .iter()
        .flat_map(|s| {
            s.deltas
                .iter()
                // A key that belongs to one candidate moves only that one.
                .filter(move |(id, _, _)| s.moves(id))
                .map(move |(id, low, high)| SensitivityBar {
                    candidate_id: id.clone(),
                    key: s.key.clone(),
                    label: key_label(&s.key),
                    low_value: show(&s.key, s.low, loaded),
                    high_value: show(&s.key, s.high, loaded),
                    default_range: s.source == RangeSource::DefaultTwentyPercent,
                    delta_at_low: money(*low),
                    delta_at_high: money(*high),
                })
        })
        .collect()
}

/// The cheapest other candidate to own, baseline aside, whose break-even
/// premium covers the premium it asks.
fn runner_up(candidates: &[CandidateView], preferred_id: &str) -> Option<RunnerUp> {
    candidates
        .iter()
        .filter(|c| {
            !c.is_baseline && c.id != preferred_id && c.verdict.kind == VerdictKind::WorthPremium
        })
        .min_by_key(|c| c.economics.lifecycle_cost)
        .map(|c| RunnerUp {
            id: c.id.clone(),
            label: c.label.clone(),
            net_savings: c.economics.net_savings_vs_baseline.unwrap_or_default(),
            headroom: c.verdict.margin,
            discounted_payback: c.economics.discounted_payback,
        })
}

/// The inputs that move the recommended candidate's net savings most,
/// largest one-sided change first; when the baseline itself is recommended,
/// the largest change of any candidate.
fn key_assumptions(
    swings: &[Swing],
    decision: &Decision,
    loaded: &LoadedScenario,
) -> Vec<KeyAssumption> {
    let of = (!decision.preferred_is_baseline).then_some(decision.preferred_id.as_str());
    let mut rows: Vec<KeyAssumption> = swings
        .iter()
        .map(|s| KeyAssumption {
            key: s.key.clone(),
            label: key_label(&s.key),
            base_value: show(&s.key, s.base, loaded),
            swing: money(of.map_or_else(|| s.magnitude(), |id| s.magnitude_for(id))),
            candidate_id: of.map(str::to_string),
        })
        .filter(|k| !k.swing.is_zero())
        .collect();
    rows.sort_by_key(|k| std::cmp::Reverse(k.swing));
    rows
}

/// Build the report model of a loaded scenario.
pub fn build_model(loaded: &LoadedScenario, options: &ModelOptions) -> crate::Result<Model> {
    let scenario = &loaded.scenario;
    let study = run_study(loaded)?;
    let implied = implied_bids(loaded, &study.fuel)?;
    let candidates: Vec<CandidateView> = (0..scenario.candidates.len())
        .map(|i| candidate_view(loaded, &study, &implied, i))
        .collect();
    let preferred = candidates
        .iter()
        .min_by_key(|c| c.economics.lifecycle_cost)
        .ok_or_else(|| crate::Error::Internal("a scenario without candidates".into()))?;
    let decision = Decision {
        preferred_id: preferred.id.clone(),
        preferred_label: preferred.label.clone(),
        preferred_is_baseline: preferred.is_baseline,
        break_even_premium: preferred.economics.break_even_premium.unwrap_or_default(),
        premium_asked: preferred.economics.premium_asked.unwrap_or_default(),
        net_savings: preferred
            .economics
            .net_savings_vs_baseline
            .unwrap_or_default(),
        discounted_payback: preferred.economics.discounted_payback,
        runner_up: runner_up(&candidates, &preferred.id),
    };
    let swings = rank(loaded, &study)?;
    let key_assumptions = key_assumptions(&swings, &decision, loaded);
    let mut warnings = engineering_warnings(scenario);
    warnings.extend(cycle_warnings(loaded, &study));
    warnings.extend(implied.iter().filter_map(verdict_warning));
    warnings.extend(super::implied::curve_warnings(scenario, &study.fuel));
    // What priced each bid (vendor curves or its machine; a fitted one).
    let sites: Vec<_> = study
        .outcomes
        .iter()
        .map(|o| o.solved.site.clone())
        .collect();
    let mut pricing = super::site::pricing_notes(scenario, &sites);
    pricing.extend(super::implied::fitted_notes(scenario));
    let e = &scenario.economics;
    let present_value_date = match e.present_value_date {
        crate::scenario::PresentValueDate::CommercialOperation => e.commercial_operation,
        crate::scenario::PresentValueDate::Study => scenario.meta.date,
    };
    let mut gas_models: Vec<String> = candidates.iter().map(|c| c.gas_model.clone()).collect();
    gas_models.dedup();
    Ok(Model {
        meta: Meta {
            title: scenario.meta.title.clone(),
            prepared_for: scenario.meta.prepared_for.clone(),
            prepared_by: scenario.meta.prepared_by.clone(),
            date: scenario.meta.date.to_string(),
            currency: scenario.meta.currency.clone(),
            baseline_id: scenario.meta.baseline.clone(),
            scenario_file: loaded.file_label.clone(),
            scenario_sha256: loaded.sha256_hex.clone(),
            brayfin_version: env!("CARGO_PKG_VERSION").to_string(),
            generated_at: chrono::Utc::now().to_rfc3339_opts(chrono::SecondsFormat::Secs, true),
            units: options.units,
            site_name: scenario.site.name.clone(),
        },
        decision,
        key_assumptions,
        inputs: loaded
            .inputs
            .iter()
            .map(|i| InputView {
                key: i.key.clone(),
                value: i.value_text.clone(),
                unit: i.unit.clone(),
                source: i.source.clone(),
            })
            .collect(),
        applied_defaults: loaded
            .applied_defaults
            .iter()
            .map(|d| DefaultView {
                key: d.key.clone(),
                value: d.value.clone(),
            })
            .collect(),
        warnings,
        information: information_notes(scenario)
            .into_iter()
            .chain(pricing.iter().cloned())
            .collect(),
        pricing,
        method: MethodView {
            gas_models,
            rate_basis: match e.rate_basis {
                RateBasis::Real => "real",
                RateBasis::Nominal => "nominal",
            }
            .to_string(),
            discount_rate: e.discount_rate,
            inflation: e.inflation,
            timing: match e.timing {
                Timing::EndOfYear => "end-of-year",
                Timing::MidYear => "mid-year",
            }
            .to_string(),
            service_life_years: e.service_life_years,
            fuel_price_basis: match scenario.fuel.price_basis {
                PriceBasis::Hhv => "HHV",
                PriceBasis::Lhv => "LHV",
            }
            .to_string(),
            fuel_price_unit: crate::report::format::scenario_price_unit(loaded),
            fuel_price_written: crate::report::format::scenario_price_written(
                &scenario.fuel,
                &scenario.meta.currency,
            ),
            fuel_price_per_gj: scenario.fuel.price_per_gj,
            hhv_over_lhv: study.fuel.hhv_over_lhv(),
            rounding: "money rounded once, for presentation, to the minor unit; midpoints to \
                       even (banker's rounding)"
                .to_string(),
            levelled: study
                .outcomes
                .iter()
                .any(|o| !o.ledger.summary.present_value.bought_in.is_zero()),
            energy_value_per_mwh: money(e.energy_value_per_mwh),
            capacity_value_per_kw_year: money(e.capacity_value_per_kw_year),
            present_value_date: present_value_date.to_string(),
            present_value_base: match e.present_value_date {
                crate::scenario::PresentValueDate::CommercialOperation => "commercial-operation",
                crate::scenario::PresentValueDate::Study => "study",
            }
            .to_string(),
            present_value_note: present_value_note(scenario, present_value_date),
        },
        fuel_price_curves: fuel_price_curves(loaded, &study),
        sensitivity: if options.sensitivity {
            sensitivity_bars(&swings, loaded)
        } else {
            Vec::new()
        },
        risk: None,
        site_performance: super::site_curves::site_performance_view(scenario, &study),
        candidates,
    })
}
