//! A rendering fixture: a report model filled with invented numbers, shaped
//! like a real one, for checking layout and formatting only. None of these
//! figures is a claimed result of any calculation.

#![allow(dead_code)]

use brayfin::report::model::*;
use rust_decimal::Decimal;

/// Whole currency units as a Decimal.
pub fn dec(v: i64) -> Decimal {
    Decimal::from(v)
}

fn states(t3_k: f64, regenerator: bool) -> Vec<StateRow> {
    let row = |id: &str, name: &str, t: f64, p: f64, s: f64| StateRow {
        id: id.into(),
        name: name.into(),
        temperature_k: t,
        pressure_kpa: p,
        enthalpy_kj_per_kg: 1.005 * t,
        entropy_kj_per_kg_k: s,
    };
    let mut rows = vec![
        row("1", "compressor inlet", 288.15, 100.3, 6.83),
        row("2s", "compressor exit, isentropic", 598.0, 1520.0, 6.83),
        row("2", "compressor exit", 650.0, 1520.0, 6.92),
    ];
    if regenerator {
        rows.push(row("x", "regenerator air exit", 760.0, 1490.0, 7.08));
    }
    rows.push(row("3", "turbine inlet", t3_k, 1450.0, 7.70));
    rows.push(row(
        "4s",
        "turbine exit, isentropic",
        t3_k * 0.52,
        104.0,
        7.70,
    ));
    rows.push(row("4", "turbine exit", t3_k * 0.57, 104.0, 7.80));
    if regenerator {
        rows.push(row("y", "regenerator gas exit", 560.0, 102.0, 7.45));
    }
    rows
}

/// Ledger rows of one candidate over `life` years with the given yearly
/// fuel cost and capital; the money is invented, the arithmetic within a
/// row is kept consistent so the table reads sensibly.
fn ledger(life: u32, capital: i64, fuel: i64) -> Vec<LedgerRowView> {
    (0..=life)
        .map(|i| {
            let df = 1.0 / 1.07f64.powi(i as i32);
            let (cap, fuel_cost, om, residual) = if i == 0 {
                (capital, 0, 0, 0)
            } else if i == life {
                (0, fuel, 900_000, -capital / 10)
            } else {
                (0, fuel, 900_000, 0)
            };
            let overhaul = if i > 0 && i % 8 == 0 { 2_500_000 } else { 0 };
            let total = cap + fuel_cost + om + residual + overhaul + 150_000;
            LedgerRowView {
                label: if i == 0 {
                    "capital at commercial operation".into()
                } else {
                    format!("{} operation", 2027 + i)
                },
                year: 2027 + i as i32,
                period_start: format!("{}-01-01", 2027 + i),
                period_end: format!("{}-12-31", 2027 + i),
                operating_hours: if i == 0 { 0.0 } else { 6500.0 },
                starts: 0.0,
                energy_mwh: if i == 0 { 0.0 } else { 273_000.0 },
                fuel_energy_gj: if i == 0 { 0.0 } else { 2_700_000.0 },
                fuel_cost: dec(fuel_cost),
                carbon_cost: dec(150_000),
                fixed_om: dec(om / 2),
                variable_om: dec(om / 2),
                overhaul: dec(overhaul),
                bought_in: dec(0),
                capital: dec(cap),
                residual: dec(residual),
                guarantee_settlement: dec(0),
                total: dec(total),
                discount_factor: df,
                present_value: Decimal::from_f64_retain((total as f64 * df).round())
                    .unwrap_or_default(),
            }
        })
        .collect()
}

/// Cumulative savings that rise linearly from `-premium` by `per_year`,
/// so the crossing is at `premium / per_year` years exactly.
fn linear_savings(life: u32, premium: i64, per_year: i64) -> Vec<CumulativePoint> {
    (0..=life)
        .map(|i| CumulativePoint {
            years_from_start: f64::from(i),
            year: 2027 + i as i32,
            date: format!("{}-12-31", 2026 + i),
            savings: dec(-premium + per_year * i64::from(i)),
        })
        .collect()
}

#[allow(clippy::too_many_arguments)]
fn candidate(
    id: &str,
    label: &str,
    baseline: bool,
    capital: i64,
    heat_rate: f64,
    premium: i64,
    per_year: i64,
    regenerator: bool,
) -> CandidateView {
    let life = 25;
    let lcc = 180_000_000 - if baseline { 0 } else { per_year * 12 - premium };
    let (kind, margin, payback) = if baseline {
        (VerdictKind::Baseline, dec(0), PaybackView::NotApplicable)
    } else if per_year * 12 > premium {
        (
            VerdictKind::WorthPremium,
            dec(per_year * 12 - premium),
            PaybackView::Years(premium as f64 / per_year as f64),
        )
    } else {
        let payback = if per_year * i64::from(life) > premium {
            PaybackView::Years(premium as f64 / per_year as f64)
        } else {
            PaybackView::NeverWithinLife
        };
        (
            VerdictKind::NotWorthPremium,
            dec(per_year * 12 - premium),
            payback,
        )
    };
    CandidateView {
        id: id.into(),
        label: label.into(),
        is_baseline: baseline,
        gas_model: "products".into(),
        performance: PerformanceView {
            net_output_kw: 42_000.0,
            heat_rate_kj_per_kwh: heat_rate,
            heat_rate_btu_per_kwh: heat_rate / 1.055056,
            thermal_efficiency: 3600.0 / heat_rate,
            exhaust_temperature_k: 780.0,
            air_flow_kg_per_s: 121.5,
            fuel_flow_kg_per_s: 2.41,
            co2_kg_per_mwh: 512.3,
            implied: None,
            site_year: SiteYearView {
                run_hours: 3000.0,
                energy_mwh: 126_000.0,
                fuel_energy_gj_lhv: 126_000.0 * heat_rate / 1000.0,
                mean_heat_rate_kj_per_kwh: heat_rate,
                capacity_output_kw: 42_000.0,
                capacity_temperature_k: None,
            },
        },
        cycle: CycleView {
            states: states(1500.0, regenerator),
            compressor_work_kj_per_kg: 365.2,
            turbine_work_kj_per_kg: 712.9,
            net_work_kj_per_kg: 347.7,
            heat_input_kj_per_kg: 955.0,
            heat_rejected_kj_per_kg: 607.3,
            back_work_ratio: 0.512,
            energy_balance_residual_kj_per_kg: 3.2e-9,
            fuel_air_ratio: Some(0.0191),
        },
        economics: EconomicsView {
            capital_cost: dec(capital),
            lifecycle_cost: dec(lcc),
            levelized_cost_per_mwh: Decimal::new(6_512, 2),
            net_savings_vs_baseline: (!baseline).then(|| dec(per_year * 12 - premium)),
            break_even_premium: (!baseline).then(|| dec(per_year * 12)),
            premium_asked: (!baseline).then(|| dec(premium)),
            savings_to_investment_ratio: (!baseline).then_some(1.4),
            adjusted_irr: (!baseline).then_some(0.091),
            simple_payback: payback,
            discounted_payback: payback,
            break_even_fuel_price: (!baseline).then(|| Decimal::new(412, 2)),
            value_per_point: ValuePerPoint {
                compressor_efficiency: dec(1_250_000),
                turbine_efficiency: dec(1_900_000),
                regenerator_effectiveness: regenerator.then(|| dec(800_000)),
            },
            value_per_kj_per_kwh: dec(4_100),
            value_per_kj_per_kwh_full_load: dec(4_200),
            dispatch_heat_rate_ratio: 4_200.0 / 4_100.0,
            value_per_kw: dec(1_350),
        },
        verdict: Verdict { kind, margin },
        cost_breakdown: CostBreakdown {
            capital: dec(capital),
            fuel: dec(lcc - capital - 20_000_000),
            operation_and_maintenance: dec(11_000_000),
            overhauls: dec(6_000_000),
            carbon: dec(4_500_000),
            bought_in: dec(0),
            residual: dec(-1_500_000),
            guarantee_settlement: dec(0),
        },
        cost_difference: (!baseline).then(|| CostBreakdown {
            capital: dec(premium),
            fuel: dec(-8 * per_year),
            operation_and_maintenance: dec(0),
            overhauls: dec(250_000),
            carbon: dec(-300_000),
            bought_in: dec(0),
            residual: dec(-100_000),
            guarantee_settlement: dec(0),
        }),
        cumulative_savings: if baseline {
            Vec::new()
        } else {
            linear_savings(life, premium, per_year)
        },
        ledger_total: total_of(&ledger(life, capital, 11_000_000 - per_year)),
        ledger: ledger(life, capital, 11_000_000 - per_year),
    }
}

/// The totals row of a fixture ledger: each column summed.
fn total_of(rows: &[LedgerRowView]) -> LedgerTotalView {
    let sum = |pick: fn(&LedgerRowView) -> Decimal| rows.iter().map(pick).sum::<Decimal>();
    LedgerTotalView {
        label: "total".into(),
        period_start: rows
            .first()
            .map(|r| r.period_start.clone())
            .unwrap_or_default(),
        period_end: rows
            .last()
            .map(|r| r.period_end.clone())
            .unwrap_or_default(),
        operating_hours: rows.iter().map(|r| r.operating_hours).sum(),
        starts: 0.0,
        energy_mwh: rows.iter().map(|r| r.energy_mwh).sum(),
        fuel_energy_gj: rows.iter().map(|r| r.fuel_energy_gj).sum(),
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

/// The fixture: a baseline and two bids (the last with a long label), with
/// or without the sensitivity and risk parts. All three have the same net
/// output, so nothing is charged for energy and capacity bought in (see [`levelled`]).
pub fn model(with_sensitivity: bool, with_risk: bool) -> Model {
    let candidates = vec![
        candidate("base", "Base bid: simple cycle", true, 30_000_000, 10_300.0, 0, 0, false),
        candidate(
            "hx",
            "Bid B: improved compressor and turbine",
            false,
            34_000_000,
            9_900.0,
            4_000_000,
            800_000,
            false,
        ),
        candidate(
            "regen",
            "Bid C: recuperated machine with a deliberately long label that has to wrap inside its column",
            false,
            39_500_000,
            9_100.0,
            9_500_000,
            300_000,
            true,
        ),
    ];
    let sensitivity = if with_sensitivity {
        [
            "fuel.price",
            "operation.hours_per_year",
            "economics.discount_rate",
        ]
        .iter()
        .enumerate()
        .flat_map(|(i, key)| {
            ["hx", "regen"].into_iter().map(move |id| SensitivityBar {
                candidate_id: id.into(),
                key: (*key).into(),
                label: key.replace(['.', '_'], " "),
                low_value: format!("low {i}"),
                high_value: format!("high {i}"),
                default_range: i == 2,
                delta_at_low: dec(-3_000_000 / (i as i64 + 1)),
                delta_at_high: dec(2_600_000 / (i as i64 + 1)),
            })
        })
        .collect()
    } else {
        Vec::new()
    };
    let risk = with_risk.then(|| RiskView {
        samples: 2000,
        seed: 1,
        redraws: 0,
        first_redraw_reason: None,
        route_note: "Route: invented fixture text.".into(),
        candidates: ["hx", "regen"]
            .iter()
            .map(|id| RiskCandidate {
                candidate_id: (*id).into(),
                net_savings: Percentiles {
                    mean: dec(5_500_000),
                    p10: dec(1_000_000),
                    p50: dec(5_400_000),
                    p90: dec(9_900_000),
                },
                break_even_premium: Percentiles {
                    mean: dec(9_500_000),
                    p10: dec(5_000_000),
                    p50: dec(9_400_000),
                    p90: dec(13_900_000),
                },
                probability_beats_baseline: 0.93,
                histogram: Histogram {
                    low: dec(-2_000_000),
                    bin_width: dec(1_000_000),
                    counts: vec![10, 40, 120, 250, 380, 420, 360, 230, 120, 50, 20],
                },
                contract: None,
            })
            .collect(),
    });
    Model {
        meta: Meta {
            title: "Northmere Energy Park: bought_in gas turbine".into(),
            prepared_for: "Northmere Municipal Power Cooperative".into(),
            prepared_by: "Plant engineering office".into(),
            date: "2026-11-30".into(),
            currency: "USD".into(),
            baseline_id: "base".into(),
            scenario_file: "scenarios/northmere.toml".into(),
            scenario_sha256: "3f5a0c1e9b7d2a4c6e8f0a1b2c3d4e5f60718293a4b5c6d7e8f90a1b2c3d4e5f".into(),
            brayfin_version: "0.1.0".into(),
            generated_at: "2026-12-02T08:00:00Z".into(),
            units: Units::Si,
            site_name: Some("Northmere, 120 m above sea level".into()),
        },
        decision: Decision {
            preferred_id: "hx".into(),
            preferred_label: "Bid B: improved compressor and turbine".into(),
            preferred_is_baseline: false,
            break_even_premium: dec(9_600_000),
            premium_asked: dec(4_000_000),
            net_savings: dec(5_600_000),
            discounted_payback: PaybackView::Years(4.2),
            runner_up: None,
        },
        candidates,
        key_assumptions: if with_sensitivity {
            vec![
                KeyAssumption {
                    key: "fuel.price".into(),
                    label: "Fuel price".into(),
                    base_value: "5.20 USD/GJ (HHV)".into(),
                    swing: dec(5_600_000),
                    candidate_id: Some("hx".into()),
                },
                KeyAssumption {
                    key: "operation.hours_per_year".into(),
                    label: "Operating hours".into(),
                    base_value: "6500 h".into(),
                    swing: dec(2_800_000),
                    candidate_id: Some("hx".into()),
                },
                KeyAssumption {
                    key: "economics.discount_rate".into(),
                    label: "Discount rate".into(),
                    base_value: "7 %".into(),
                    swing: dec(1_866_667),
                    candidate_id: Some("hx".into()),
                },
                KeyAssumption {
                    key: "candidate.turbine_efficiency".into(),
                    label: "Turbine efficiency".into(),
                    base_value: "0.89".into(),
                    swing: dec(900_000),
                    candidate_id: Some("hx".into()),
                },
            ]
        } else {
            Vec::new()
        },
        inputs: (0..40)
            .map(|i| InputView {
                key: format!("section.input_{i}"),
                value: format!("{}", 100 + i),
                unit: if i % 3 == 0 { String::new() } else { "kPa".into() },
                source: (i % 4 != 0).then(|| {
                    "Vendor data sheet, revision C, table 4 (bid clarification of 2026-10-14)".into()
                }),
            })
            .collect(),
        applied_defaults: vec![DefaultView {
            key: "site.relative_humidity".into(),
            value: "60 %".into(),
        }],
        warnings: vec!["Turbine inlet temperature of Bid C is above 1600 K; check the vendor's cooling assumptions.".into()],
        information: Vec::new(),
        pricing: Vec::new(),
        method: MethodView {
            gas_models: vec!["products".into()],
            rate_basis: "real".into(),
            discount_rate: 0.07,
            inflation: 0.025,
            timing: "end-of-year".into(),
            service_life_years: 25,
            fuel_price_basis: "HHV".into(),
            fuel_price_unit: brayfin::report::model::FuelPriceUnit::gj(),
            fuel_price_written: Some("5.20 USD/GJ".into()),
            fuel_price_per_gj: Decimal::new(520, 2),
            hhv_over_lhv: 1.108,
            rounding: "rounded to cents, half away from zero".into(),
            levelled: false,
            energy_value_per_mwh: dec(0),
            capacity_value_per_kw_year: dec(0),
            present_value_date: "2027-01-01".into(),
            present_value_base: "commercial-operation".into(),
            present_value_note: "Present values are stated at 2027-01-01, the commercial operation date: construction payments made before it are compounded to it and later cash is discounted to it; all amounts are in real money (constant money of 2025-03-14, general inflation taken out).".into(),
        },
        fuel_price_curves: FuelPriceCurves {
            scenario_price_per_gj: Decimal::new(520, 2),
            series: ["hx", "regen"]
                .iter()
                .enumerate()
                .map(|(k, id)| FuelPriceSeries {
                    candidate_id: (*id).into(),
                    points: (2..=10)
                        .map(|p| (dec(p), dec(p * (1_500_000 + 400_000 * k as i64))))
                        .collect(),
                })
                .collect(),
        },
        sensitivity,
        risk,
        site_performance: Default::default(),
    }
}

/// The fixture levelled on output: the baseline is taken as 1.2 MW short
/// of the others and pays 900 000 a year (invented) for the energy and
/// capacity it lacks, moved out of its fuel so its lifecycle cost holds.
pub fn levelled(with_sensitivity: bool, with_risk: bool) -> Model {
    let mut model = model(with_sensitivity, with_risk);
    model.method.levelled = true;
    model.method.energy_value_per_mwh = Decimal::new(9500, 2);
    model.method.capacity_value_per_kw_year = Decimal::new(4000, 2);
    let base = &mut model.candidates[0];
    base.cost_breakdown.bought_in = dec(9_000_000);
    base.cost_breakdown.fuel -= dec(9_000_000);
    for row in base.ledger.iter_mut().filter(|r| r.operating_hours > 0.0) {
        row.bought_in = dec(900_000);
        row.fuel_cost -= dec(900_000);
    }
    model
}
