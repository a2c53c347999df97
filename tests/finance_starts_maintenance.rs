//! Starts, start fuel, service-agreement fees and overhauls due on
//! equivalent operating hours or starts, checked against hand-worked
//! examples and identities.
//!
//! Equivalent operating hours (EOH) = fired hours + starts × hours per start,
//! an overhaul falling due at the EOH interval or the starts interval,
//! whichever comes first, is common practice in gas-turbine maintenance
//! contracts (the counting rule; the figures below are invented and worked
//! by hand in each test).

mod finance_support;

use brayfin::finance::{
    build_ledger, summarize_ledger, Degradation, EscalatingPrice, FuelPrice, LedgerInputs,
    Overhaul, PriceBasis, RowKind,
};
use finance_support::{busy_inputs, dec, empty_inputs};
use rust_decimal::Decimal;

/// A peaker: 500 fired hours and 150 starts a year, calendar-year rows
/// (commercial operation on 1 January), 20 years, an overhaul interval of
/// 24 000 EOH at 20 EOH per start.
fn peaker(overhaul_starts: Option<f64>) -> LedgerInputs {
    let mut inputs = empty_inputs(20, 0.07);
    inputs.operation.operating_hours = 500.0;
    inputs.operation.starts_per_year = 150.0;
    inputs.operation.energy_mwh = 500.0 * 40.0;
    inputs.operation.fuel_energy_gj_lhv = 500.0 * 40.0 * 10.0;
    inputs.operation.net_output_kw = 40_000.0;
    inputs.overhaul = Some(Overhaul {
        interval_hours: 24_000.0,
        hours_per_start: 20.0,
        interval_starts: overhaul_starts,
        outage_days: 0.0,
        outage_capacity_kw: 0.0,
        cost: dec("1000000.00"),
        escalation: 0.0,
    });
    inputs
}

/// Overhauls per operating row, in row order.
fn overhauls(inputs: &LedgerInputs) -> Vec<u32> {
    build_ledger(inputs)
        .expect("ledger")
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Operation)
        .map(|r| r.overhaul_count)
        .collect()
}

/// Years (1-based) in which an overhaul is done.
fn overhaul_years(inputs: &LedgerInputs) -> Vec<usize> {
    overhauls(inputs)
        .iter()
        .enumerate()
        .flat_map(|(i, n)| std::iter::repeat_n(i + 1, *n as usize))
        .collect()
}

/// Hand-worked: 500 h + 150 starts × 20 h = 3 500 EOH a year. 24 000 EOH are
/// reached after 24 000 / 3 500 = 6.86 years (in year 7), then at 13.71
/// (year 14) and 20.57 years (beyond the 20-year life). Without the starts
/// the 500 fired hours a year would need 48 years.
#[test]
fn equivalent_hours_bring_the_overhaul_forward_to_year_seven() {
    assert_eq!(overhaul_years(&peaker(None)), vec![7, 14]);
    let mut no_starts = peaker(None);
    no_starts.operation.starts_per_year = 0.0;
    assert_eq!(overhaul_years(&no_starts), Vec::<usize>::new());
}

/// Hand-worked: a limit of 900 starts at 150 starts a year falls due after 6
/// years, before the 6.86 years of the EOH limit, so it governs: years 6, 12
/// and 18. A limit of 1 200 starts (8 years) leaves the EOH limit first.
#[test]
fn the_starts_limit_governs_when_it_comes_first() {
    assert_eq!(overhaul_years(&peaker(Some(900.0))), vec![6, 12, 18]);
    assert_eq!(overhaul_years(&peaker(Some(1200.0))), vec![7, 14]);
}

/// The fired-hours interval the two limits imply, worked by hand:
/// 24 000 EOH / (1 + 150/500 × 20) = 3 428.571 h; 900 starts / (150/500) =
/// 3 000 h.
#[test]
fn the_limits_become_an_interval_of_fired_hours() {
    let inputs = peaker(None);
    let overhaul = inputs.overhaul.expect("overhaul");
    let between = overhaul
        .operating_hours_between(&inputs.operation)
        .expect("the unit runs");
    assert!((between - 24_000.0 / 7.0).abs() < 1e-9, "{between}");
    let starts = peaker(Some(900.0));
    let between = starts
        .overhaul
        .expect("overhaul")
        .operating_hours_between(&starts.operation)
        .expect("the unit runs");
    assert!((between - 3_000.0).abs() < 1e-9, "{between}");
    let mut idle = peaker(None);
    idle.operation.operating_hours = 0.0;
    assert_eq!(overhaul.operating_hours_between(&idle.operation), None);
}

/// Identity: heat-rate degradation, fully recoverable, is restored at each
/// overhaul the starts bring forward, exactly as if the same fired-hours
/// interval had been stated with no starts.
#[test]
fn degradation_recovers_at_the_overhauls_starts_bring_forward() {
    let mut with_starts = peaker(None);
    with_starts.degradation = Degradation {
        heat_rate_fraction_per_year: 0.01,
        output_fraction_per_year: 0.0,
        recoverable_fraction: 1.0,
    };
    let mut plain = with_starts.clone();
    plain.operation.starts_per_year = 0.0;
    plain.overhaul = Some(Overhaul {
        interval_hours: 24_000.0 / 7.0,
        hours_per_start: 0.0,
        interval_starts: None,
        outage_days: 0.0,
        outage_capacity_kw: 0.0,
        cost: dec("1000000.00"),
        escalation: 0.0,
    });
    let a = build_ledger(&with_starts).expect("ledger");
    let b = build_ledger(&plain).expect("ledger");
    for (x, y) in a.rows.iter().zip(&b.rows) {
        assert_eq!(x.overhaul_count, y.overhaul_count, "year {}", x.year);
        assert_eq!(x.fuel_energy_gj, y.fuel_energy_gj, "year {}", x.year);
        assert_eq!(x.fuel_cost, y.fuel_cost, "year {}", x.year);
    }
    // With 100 % recoverable the year after an overhaul starts clean again:
    // year 8's mean multiplier is below year 7's.
    let fuel: Vec<f64> = a
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Operation)
        .map(|r| r.fuel_energy_gj)
        .collect();
    assert!(fuel[7] < fuel[6], "{fuel:?}");
}

/// Start fuel is priced like fuel: 120 starts × 60 GJ = 7 200 GJ (LHV) a
/// year gives exactly the ledger of a machine burning 7 200 GJ more a year
/// without degradation: the same HHV basis factor, price path and carbon.
#[test]
fn start_fuel_is_priced_like_fuel() {
    for path in [false, true] {
        let mut inputs = busy_inputs();
        inputs.degradation = Degradation::default();
        inputs.fuel.basis = PriceBasis::Hhv;
        if path {
            inputs.fuel.price = FuelPrice::Path(
                (2020..2060)
                    .map(|y| (y, dec("4.00") + Decimal::from(y - 2020) / dec("10")))
                    .collect(),
            );
        }
        let mut reference = inputs.clone();
        inputs.operation.starts_per_year = 120.0;
        inputs.starts.fuel_gj_lhv_per_start = 60.0;
        reference.operation.fuel_energy_gj_lhv += 7_200.0;
        let with_starts = build_ledger(&inputs).expect("ledger");
        let expected = build_ledger(&reference).expect("ledger");
        for (x, y) in with_starts.rows.iter().zip(&expected.rows) {
            assert!(
                (x.fuel_energy_gj - y.fuel_energy_gj).abs() <= 1e-9 * y.fuel_energy_gj.max(1.0),
                "{} vs {}",
                x.fuel_energy_gj,
                y.fuel_energy_gj
            );
            assert_eq!(x.fuel_cost, y.fuel_cost, "year {} (path {path})", x.year);
            assert_eq!(x.carbon_cost, y.carbon_cost, "year {}", x.year);
        }
        assert_eq!(
            with_starts.summary.lifecycle_cost,
            expected.summary.lifecycle_cost
        );
    }
}

/// Start cost and service fees are variable O&M, by hand for a full year:
/// 40 000 MWh × 3.00 + 200 starts × (1 500.00 + 2 500.00) + 2 000 h ×
/// 120.00 = 120 000 + 800 000 + 240 000 = 1 160 000.00.
#[test]
fn start_cost_and_service_fees_are_variable_om() {
    let mut inputs = empty_inputs(3, 0.07);
    inputs.operation.operating_hours = 2_000.0;
    inputs.operation.energy_mwh = 40_000.0;
    inputs.operation.starts_per_year = 200.0;
    inputs.variable_om = EscalatingPrice {
        price: dec("3.00"),
        escalation: 0.0,
    };
    inputs.starts.cost_per_start = EscalatingPrice {
        price: dec("1500.00"),
        escalation: 0.0,
    };
    inputs.service.per_start = EscalatingPrice {
        price: dec("2500.00"),
        escalation: 0.0,
    };
    inputs.service.per_fired_hour = EscalatingPrice {
        price: dec("120.00"),
        escalation: 0.0,
    };
    let ledger = build_ledger(&inputs).expect("ledger");
    let rows: Vec<_> = ledger
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Operation)
        .collect();
    assert_eq!(rows.len(), 3);
    for row in &rows {
        assert_eq!(row.variable_om, dec("1160000"), "year {}", row.year);
        assert_eq!(row.starts, 200.0);
    }
    // The stream's present value is the sum of the rows': 1 160 000 ×
    // (1.07^-1 + 1.07^-2 + 1.07^-3) = 1 160 000 × 2.624316 = 3 044 206.5.
    let pv = ledger.summary.present_value.variable_om;
    let by_hand = 1_160_000.0 * (1.07f64.powi(-1) + 1.07f64.powi(-2) + 1.07f64.powi(-3));
    let pv: f64 = pv.to_string().parse().expect("decimal");
    assert!((pv - by_hand).abs() < 0.01, "{pv} vs {by_hand}");
}

/// The sampled (`f64`) ledger runs the same code: its totals equal the
/// decimal ledger's within 1e-9 relative, and the summary alone equals the
/// full ledger's, with starts, fees and the starts limit all on.
#[test]
fn f64_and_summary_agree_with_starts_on() {
    let mut inputs = busy_inputs();
    inputs.operation.starts_per_year = 180.0;
    inputs.starts.fuel_gj_lhv_per_start = 45.0;
    inputs.starts.cost_per_start.price = dec("900.00");
    inputs.service.per_fired_hour.price = dec("85.00");
    inputs.service.per_start.price = dec("3100.00");
    if let Some(overhaul) = inputs.overhaul.as_mut() {
        overhaul.hours_per_start = 10.0;
        overhaul.interval_starts = Some(1_200.0);
    }
    let decimal = build_ledger(&inputs).expect("ledger");
    assert_eq!(summarize_ledger(&inputs).expect("summary"), decimal.summary);
    let sampled = summarize_ledger(&inputs.to_f64()).expect("summary");
    let exact: f64 = decimal
        .summary
        .lifecycle_cost
        .to_string()
        .parse()
        .expect("decimal");
    assert!(
        (sampled.lifecycle_cost - exact).abs() <= 1e-9 * exact.abs(),
        "{} vs {exact}",
        sampled.lifecycle_cost
    );
}

/// Nothing about starts set: the ledger is exactly the one without the new
/// inputs (starts alone, with no prices, change nothing either).
#[test]
fn zero_starts_leave_the_ledger_unchanged() {
    let inputs = busy_inputs();
    let mut with_starts = inputs.clone();
    with_starts.operation.starts_per_year = 250.0;
    assert_eq!(
        build_ledger(&inputs)
            .expect("ledger")
            .summary
            .lifecycle_cost,
        build_ledger(&with_starts)
            .expect("ledger")
            .summary
            .lifecycle_cost
    );
}

/// The peaker with an energy value of 80.00 per MWh and a capacity value of
/// 90.00 per kW-year to buy in what it loses (invented figures).
fn peaker_buying_losses() -> LedgerInputs {
    let mut inputs = peaker(None);
    inputs.bought_in.energy_price = EscalatingPrice {
        price: dec("80.00"),
        escalation: 0.0,
    };
    inputs.bought_in.capacity_price = EscalatingPrice {
        price: dec("90.00"),
        escalation: 0.0,
    };
    inputs
}

fn operating_rows(inputs: &LedgerInputs) -> Vec<brayfin::finance::LedgerRow> {
    build_ledger(inputs)
        .expect("ledger")
        .rows
        .into_iter()
        .filter(|r| r.kind == RowKind::Operation)
        .collect()
}

/// Hand-worked outage: 36.5 days per overhaul is 10 % of a 365-day year.
/// In the overhaul years (7 and 14) the peaker runs 450 of its 500 hours,
/// 135 of its 150 starts, and delivers 18 000 of its 20 000 MWh on 90 % of
/// its fuel; it buys the 2 000 MWh lost at 80.00 (160 000.00) and 10 % of a
/// year of its 40 000 kW at 90.00 per kW-year (360 000.00): 520 000.00.
/// Other years are untouched.
#[test]
fn an_outage_buys_the_energy_and_capacity_lost() {
    let mut inputs = peaker_buying_losses();
    if let Some(overhaul) = inputs.overhaul.as_mut() {
        overhaul.outage_days = 36.5;
        overhaul.outage_capacity_kw = 40_000.0;
    }
    let plain = operating_rows(&peaker_buying_losses());
    let rows = operating_rows(&inputs);
    for (i, (row, base)) in rows.iter().zip(&plain).enumerate() {
        if i == 6 || i == 13 {
            assert_eq!(row.overhaul_count, 1);
            assert!((row.operating_hours - 450.0).abs() < 1e-9);
            assert!((row.starts - 135.0).abs() < 1e-9);
            assert!((row.energy_mwh - 18_000.0).abs() < 1e-9);
            assert!((row.fuel_energy_gj - 0.9 * base.fuel_energy_gj).abs() < 1e-6);
            assert_eq!(row.bought_in, dec("520000"), "year {}", i + 1);
            assert!((row.in_service - 0.9).abs() < 1e-12);
        } else {
            assert_eq!(row.energy_mwh, base.energy_mwh);
            assert_eq!(row.fuel_energy_gj, base.fuel_energy_gj);
            assert_eq!(row.bought_in, base.bought_in, "year {}", i + 1);
        }
    }
    // No outage days: the ledger is the one without outages.
    let mut none = peaker_buying_losses();
    if let Some(overhaul) = none.overhaul.as_mut() {
        overhaul.outage_capacity_kw = 40_000.0;
    }
    assert_eq!(
        build_ledger(&none).expect("ledger"),
        build_ledger(&peaker_buying_losses()).expect("ledger")
    );
}

/// Hand-worked output degradation of 1 % a year, all of it recoverable, at
/// the peaker's overhauls (at 48/7 = 6.857 and 13.714 years):
/// - year 7 (6 to 7 years): worn time runs 6 → 6.857 and, after the
///   overhaul, 0 → 0.143 years; mean (6.857² − 6² + 0.143²) / 2 = 5.5204
///   years, so 5.5204 % is lost;
/// - year 8 (7 to 8): 0.143 → 1.143 years since the overhaul, mean 0.6429:
///   0.6429 % lost, where 7.5 % would be lost without the recovery.
///
/// The energy lost is bought at 80.00 per MWh, delivered plus lost is the
/// new-and-clean 20 000 MWh in every year, and the fuel per MWh delivered
/// stays the new-and-clean 10 GJ/MWh (no heat-rate degradation).
#[test]
fn output_degradation_is_restored_at_overhaul_and_bought_in() {
    let t: f64 = 48.0 / 7.0;
    let year7 = (t * t - 36.0 + (7.0 - t) * (7.0 - t)) / 2.0 * 0.01;
    let year8 = ((7.0 - t) + (8.0 - t)) / 2.0 * 0.01;
    assert!((year7 - 0.055_204).abs() < 1e-6, "{year7}");
    assert!((year8 - 0.006_429).abs() < 1e-6, "{year8}");
    let mut inputs = peaker_buying_losses();
    inputs.degradation = Degradation {
        heat_rate_fraction_per_year: 0.0,
        output_fraction_per_year: 0.01,
        recoverable_fraction: 1.0,
    };
    let rows = operating_rows(&inputs);
    assert!((rows[6].energy_mwh - 20_000.0 * (1.0 - year7)).abs() < 1e-6);
    assert!((rows[7].energy_mwh - 20_000.0 * (1.0 - year8)).abs() < 1e-6);
    for row in &rows {
        let lost = 20_000.0 - row.energy_mwh;
        let bought: f64 = row.bought_in.to_string().parse().expect("decimal");
        assert!((bought - lost * 80.0).abs() < 0.005, "year {}", row.year);
        assert!((row.fuel_energy_gj / row.energy_mwh - 10.0).abs() < 1e-9);
    }
    // Nothing recoverable: year 8 loses the 7.5 % accrued since new.
    inputs.degradation.recoverable_fraction = 0.0;
    let rows = operating_rows(&inputs);
    assert!((rows[7].energy_mwh - 20_000.0 * (1.0 - 0.075)).abs() < 1e-6);
}

/// The scenario keys reach the ledger inputs: starts from `[operation]`,
/// start fuel converted from MMBtu (1 MMBtu = 1.055056 GJ, NIST SP 811
/// B.8 as the trade rounds it), the starts limit, outage days and output
/// degradation from `[candidate.costs]`.
#[test]
fn scenario_keys_reach_the_ledger_inputs() {
    let text = std::fs::read_to_string("scenarios/corvel-bay-peaker.toml").expect("demo");
    let text = text
        .replacen("start_fuel = \"110 GJ\"", "start_fuel = \"100 MMBtu\"\noverhaul_outage_days = 12\noutput_degradation_per_year = \"0.4 %\"", 1);
    let loaded = brayfin::scenario::parse_in(
        &text,
        "corvel.toml",
        Some(std::path::Path::new("scenarios")),
    )
    .expect("scenario");
    let study = brayfin::analysis::compare::run_study(&loaded).expect("study");
    let standard = &study.outcomes[0].inputs;
    assert_eq!(standard.operation.starts_per_year, 120.0);
    assert!((standard.starts.fuel_gj_lhv_per_start - 105.5056).abs() < 1e-9);
    assert_eq!(standard.starts.cost_per_start.price, dec("900"));
    assert!((standard.degradation.output_fraction_per_year - 0.004).abs() < 1e-15);
    let overhaul = standard.overhaul.expect("overhauls");
    assert_eq!(overhaul.hours_per_start, 10.0);
    assert_eq!(overhaul.interval_starts, None);
    assert_eq!(overhaul.outage_days, 12.0);
    // The capacity lost in an outage is the capacity credited: the
    // machine's base-load output at the capacity temperature (95 degF).
    let capacity_kw = study.outcomes[0].solved.site.capacity_output_kw;
    assert_eq!(overhaul.outage_capacity_kw, capacity_kw);
    assert!(capacity_kw < study.outcomes[0].solved.site.net_output_kw);
    let premium = study.outcomes[1].inputs.overhaul.expect("overhauls");
    assert_eq!(premium.interval_starts, Some(1_000.0));
    assert_eq!(study.outcomes[1].inputs.service.per_start.price, dec("400"));
}
