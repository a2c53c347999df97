//! Expected damages by sampling the settlement, against the hand
//! calculation, for an as-built heat rate spread uniformly about the
//! guarantee, linear damages and no cap.
//!
//! Model (stated here, no data): the as-built heat rate deviation `D` (% of
//! the guarantee, positive = worse) is uniform on `[a, b] = [−1, 4]`; the
//! tolerance is `t = 1 %`; damages are `r = 100 000` per counted %, no cap.
//! Closed form (integrals of a uniform density, 1/(b − a)):
//! - beyond the band, counted `X = max(0, D − t)`:
//!   `E[X] = (b − t)² / (2(b − a)) = 0.9`, `E[X²] = (b − t)³ / (3(b − a)) = 1.8`;
//! - whole once beyond, `X = D` when `D > t`:
//!   `E[X] = (b² − t²) / (2(b − a)) = 1.5`, `E[X²] = (b³ − t³) / (3(b − a)) = 4.2`;
//! - probability beyond the band `(b − t)/(b − a) = 0.6`.
//!
//! Sampling error: the standard error of a mean of `n` independent draws is
//! `σ/√n` with `σ² = E[X²] − E[X]²` from the same closed form; a sample mean
//! within 4 standard errors is required (a false alarm about 6 in 100 000).

use brayfin::analysis::sampling::{Sampler, Streams};
use brayfin::finance::{
    settle, Guarantee, HeatRateRate, MeasuredPerformance, SettlementRates, TestTolerance,
    ToleranceRule,
};

const N: usize = 40_000;
const RATE: f64 = 100_000.0;
const GUARANTEED_HEAT_RATE: f64 = 9_000.0;

fn guarantee(rule: ToleranceRule) -> Guarantee<f64> {
    Guarantee {
        net_output_kw: 50_000.0,
        heat_rate_kj_per_kwh: GUARANTEED_HEAT_RATE,
        tolerance: TestTolerance::uniform(1.0),
        rule,
        damages: SettlementRates {
            heat_rate: HeatRateRate::PerPercent(RATE),
            output_per_kw: 0.0,
            cap_fraction_of_price: None,
        },
        bonus: SettlementRates::NONE,
    }
}

/// Mean damages and share of samples beyond the band, over `N` seeded
/// draws of the as-built heat rate.
fn sample(rule: ToleranceRule) -> (f64, f64) {
    let deviation = Sampler::Uniform {
        low: -1.0,
        high: 4.0,
    };
    let streams = Streams::new(7);
    let g = guarantee(rule);
    let (mut total, mut beyond) = (0.0, 0usize);
    for i in 0..N {
        let d = deviation.quantile(streams.sample(i as u64).next_unit());
        let measured = MeasuredPerformance {
            net_output_kw: 50_000.0,
            heat_rate_kj_per_kwh: GUARANTEED_HEAT_RATE * (1.0 + d / 100.0),
        };
        let s = settle(&g, 30_000_000.0, &measured).expect("valid draw");
        total += s.damages;
        beyond += usize::from(s.beyond_tolerance);
    }
    (total / N as f64, beyond as f64 / N as f64)
}

fn check(rule: ToleranceRule, mean_counted: f64, mean_square_counted: f64) {
    let (mean, share) = sample(rule);
    let expected = RATE * mean_counted;
    let sigma = RATE * (mean_square_counted - mean_counted * mean_counted).sqrt();
    let bound = 4.0 * sigma / (N as f64).sqrt();
    assert!(
        (mean - expected).abs() < bound,
        "{rule:?}: mean damages {mean:.0}, hand {expected:.0}, bound {bound:.0}"
    );
    let p = 0.6;
    let share_bound = 4.0 * (p * (1.0 - p) / N as f64).sqrt();
    assert!(
        (share - p).abs() < share_bound,
        "{rule:?}: {share} beyond the band"
    );
}

#[test]
fn expected_damages_beyond_the_band() {
    check(ToleranceRule::BeyondBand, 0.9, 1.8);
}

#[test]
fn expected_damages_whole_once_beyond() {
    check(ToleranceRule::WholeOnceBeyond, 1.5, 4.2);
}
