//! The cumulative-savings curve of the briefing against the ledgers it is
//! made of, on the Kestrel Point demo scenario, whose candidates pay their
//! capital on different schedules (the regenerator in two instalments, the
//! hot-section upgrade in one, the baseline nothing). Each point must equal
//! the candidate's savings summed over every ledger row, of either ledger,
//! dated on or before the point (a year-by-year difference, not a
//! row-by-row one), and the curve must cross zero at the discounted payback
//! the finance layer reports (ASTM E1121 payback: capital counted at
//! commercial operation, savings accruing evenly through each operating
//! period).

use brayfin::analysis::model::{build_model, ModelOptions};
use brayfin::report::model::{CandidateView, Model, PaybackView, Units};
use rust_decimal::Decimal;
use std::path::Path;

const KESTREL: &str = "scenarios/kestrel-point-retrofit.toml";

fn model() -> Model {
    let loaded = brayfin::scenario::load(Path::new(KESTREL)).expect("demo scenario loads");
    build_model(
        &loaded,
        &ModelOptions {
            units: Units::Si,
            sensitivity: false,
        },
    )
    .expect("demo scenario evaluates")
}

/// Σ present value of the rows of `c` whose period ends on or before `date`.
fn pv_until(c: &CandidateView, date: &str) -> Decimal {
    c.ledger
        .iter()
        .filter(|r| r.period_end.as_str() <= date)
        .map(|r| r.present_value)
        .sum()
}

#[test]
fn the_demo_candidates_pay_their_capital_on_different_schedules() {
    // The premise of the next checks: without it they would not test the
    // pairing by date.
    let model = model();
    let capital_rows = |c: &CandidateView| {
        c.ledger
            .iter()
            .filter(|r| !r.capital.is_zero() && r.operating_hours == 0.0)
            .count()
    };
    let counts: Vec<usize> = model.candidates.iter().map(capital_rows).collect();
    assert!(
        counts.windows(2).any(|w| w[0] != w[1]),
        "capital instalments per candidate: {counts:?}"
    );
}

#[test]
fn each_point_is_the_difference_of_the_ledgers_up_to_its_date() {
    let model = model();
    let baseline = model
        .candidates
        .iter()
        .find(|c| c.is_baseline)
        .expect("a baseline");
    for c in model.candidates.iter().filter(|c| !c.is_baseline) {
        assert!(!c.cumulative_savings.is_empty());
        for p in &c.cumulative_savings {
            let expected = pv_until(baseline, &p.date) - pv_until(c, &p.date);
            // Each row's present value is already rounded to the cent, so the
            // sums agree to the cent.
            assert_eq!(
                p.savings, expected,
                "{} at {} ({} years)",
                c.id, p.date, p.years_from_start
            );
        }
        // The curve ends at the net savings. The net savings are the
        // unrounded present values summed, then rounded once; the curve sums
        // the rows as printed, so they may differ by half a cent per row.
        let last = c.cumulative_savings.last().expect("points");
        let net = c.economics.net_savings_vs_baseline.expect("net savings");
        let rows = Decimal::from(c.ledger.len() + baseline.ledger.len());
        assert!(
            (last.savings - net).abs() <= rows * Decimal::new(5, 3),
            "{}: the curve ends at {}, net savings {net}",
            c.id,
            last.savings
        );
        // Time runs forward along the curve.
        assert!(c
            .cumulative_savings
            .windows(2)
            .all(|w| w[0].years_from_start <= w[1].years_from_start));
    }
}

#[test]
fn the_curve_crosses_zero_at_the_discounted_payback() {
    let model = model();
    let mut checked = 0;
    for c in model.candidates.iter().filter(|c| !c.is_baseline) {
        let PaybackView::Years(payback) = c.economics.discounted_payback else {
            continue;
        };
        let points: Vec<(f64, f64)> = c
            .cumulative_savings
            .iter()
            .filter(|p| p.years_from_start >= 0.0)
            .map(|p| (p.years_from_start, p.savings.try_into().unwrap_or(f64::NAN)))
            .collect();
        let crossing = points.windows(2).find_map(|w| {
            let ((x0, y0), (x1, y1)) = (w[0], w[1]);
            (y0 < 0.0 && y1 >= 0.0).then(|| x0 + (0.0 - y0) / (y1 - y0) * (x1 - x0))
        });
        let crossing = crossing.unwrap_or_else(|| panic!("{}: the curve never crosses", c.id));
        // Tolerance: the points are rounded to the cent; a cent in a year's
        // savings of millions moves the crossing by far less than 1e-6 year.
        assert!(
            (crossing - payback).abs() < 1e-6,
            "{}: crossing {crossing} years, payback {payback} years",
            c.id
        );
        checked += 1;
    }
    assert!(checked >= 1, "no candidate of the demo pays back");
}

#[test]
fn stream_differences_add_up_to_the_net_savings() {
    // Lifecycle cost is the sum of its streams, so the streams' differences
    // from the baseline add up to minus the net savings (to a cent per
    // stream, as each is rounded on its own).
    let model = model();
    for c in model.candidates.iter().filter(|c| !c.is_baseline) {
        let d = c.cost_difference.as_ref().expect("a difference");
        let sum = d.capital
            + d.fuel
            + d.operation_and_maintenance
            + d.overhauls
            + d.carbon
            + d.bought_in
            + d.residual;
        let net = c.economics.net_savings_vs_baseline.expect("net savings");
        assert!(
            (sum + net).abs() <= Decimal::new(7, 2),
            "{}: streams {sum}, net savings {net}",
            c.id
        );
    }
    assert!(model
        .candidates
        .iter()
        .filter(|c| c.is_baseline)
        .all(|c| c.cost_difference.is_none()));
}
