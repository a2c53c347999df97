//! Properties of the settlement over many guarantees and measured results:
//! what the closed-form rules imply for every input, not just the worked
//! examples (common practice of liquidated-damages clauses, from memory:
//! nothing within the tolerance, never negative, never above the cap, worse
//! performance never pays less).

use brayfin::finance::{
    settle, Guarantee, HeatRateRate, MeasuredPerformance, Money, SettlementRates, TestTolerance,
    ToleranceRule,
};
use proptest::prelude::*;
use rust_decimal::Decimal;

fn guarantee(
    tolerance: f64,
    rule: ToleranceRule,
    per_percent: i64,
    per_kw: i64,
    cap: Option<f64>,
) -> Guarantee {
    Guarantee {
        net_output_kw: 80_000.0,
        heat_rate_kj_per_kwh: 9_800.0,
        tolerance: TestTolerance::uniform(tolerance),
        rule,
        damages: SettlementRates {
            heat_rate: HeatRateRate::PerPercent(Decimal::new(per_percent, 0)),
            output_per_kw: Decimal::new(per_kw, 0),
            cap_fraction_of_price: cap,
        },
        bonus: SettlementRates {
            heat_rate: HeatRateRate::PerKjPerKwh(Decimal::new(per_percent / 50, 0)),
            output_per_kw: Decimal::new(per_kw / 2, 0),
            cap_fraction_of_price: cap,
        },
    }
}

fn measured(output_shortfall: f64, heat_rate_shortfall: f64) -> MeasuredPerformance {
    MeasuredPerformance {
        net_output_kw: 80_000.0 * (1.0 - output_shortfall / 100.0),
        heat_rate_kj_per_kwh: 9_800.0 * (1.0 + heat_rate_shortfall / 100.0),
    }
}

fn rule() -> impl Strategy<Value = ToleranceRule> {
    prop_oneof![
        Just(ToleranceRule::BeyondBand),
        Just(ToleranceRule::WholeOnceBeyond)
    ]
}

proptest! {
    /// Damages and bonus are zero or more and never above their cap; a
    /// bonus and damages on the same figure never both arise.
    #[test]
    fn amounts_are_bounded(
        tolerance in 0.0f64..3.0,
        rule in rule(),
        per_percent in 0i64..1_000_000,
        per_kw in 0i64..2_000,
        cap in prop::option::of(0.0f64..0.3),
        output in -10.0f64..20.0,
        heat_rate in -10.0f64..20.0,
    ) {
        let price = Decimal::new(40_000_000, 0);
        let g = guarantee(tolerance, rule, per_percent, per_kw, cap);
        let s = settle(&g, price, &measured(output, heat_rate)).unwrap();
        prop_assert!(s.damages >= Decimal::ZERO && s.bonus >= Decimal::ZERO);
        if let Some(cap) = cap {
            let limit = Decimal::from_factor(cap).unwrap() * price;
            prop_assert!(s.damages <= limit && s.bonus <= limit);
        }
        prop_assert!(s.heat_rate_damages == Decimal::ZERO || s.heat_rate_bonus == Decimal::ZERO);
        prop_assert!(s.output_damages == Decimal::ZERO || s.output_bonus == Decimal::ZERO);
        // Within the band on both figures nothing is due either way.
        if output.abs() < tolerance && heat_rate.abs() < tolerance {
            prop_assert_eq!(s.damages, Decimal::ZERO);
            prop_assert_eq!(s.bonus, Decimal::ZERO);
        }
    }

    /// A worse heat rate never pays less damages; counting the whole
    /// shortfall never pays less than counting the part beyond the band.
    #[test]
    fn worse_performance_never_pays_less(
        tolerance in 0.0f64..3.0,
        per_percent in 1i64..1_000_000,
        heat_rate in -5.0f64..15.0,
        extra in 0.0f64..5.0,
    ) {
        let price = Decimal::new(40_000_000, 0);
        for rule in [ToleranceRule::BeyondBand, ToleranceRule::WholeOnceBeyond] {
            let g = guarantee(tolerance, rule, per_percent, 0, None);
            let a = settle(&g, price, &measured(0.0, heat_rate)).unwrap().damages;
            let b = settle(&g, price, &measured(0.0, heat_rate + extra)).unwrap().damages;
            prop_assert!(b >= a, "{:?}: {} then {}", rule, a, b);
        }
        let band = settle(&guarantee(tolerance, ToleranceRule::BeyondBand, per_percent, 0, None), price, &measured(0.0, heat_rate)).unwrap();
        let whole = settle(&guarantee(tolerance, ToleranceRule::WholeOnceBeyond, per_percent, 0, None), price, &measured(0.0, heat_rate)).unwrap();
        prop_assert!(whole.damages >= band.damages);
        // Beyond the band the two differ by exactly the tolerance's worth:
        // rate × tolerance % (to the 15 significant digits of the crossing).
        if band.damages > Decimal::ZERO {
            let difference = (whole.damages - band.damages).to_f64();
            let expected = per_percent as f64 * tolerance;
            prop_assert!((difference - expected).abs() <= 1e-6 * expected.max(1.0), "{} vs {}", difference, expected);
        }
    }

    /// The f64 settlement (for sampling) agrees with the decimal one.
    #[test]
    fn f64_agrees_with_decimal(
        tolerance in 0.0f64..3.0,
        rule in rule(),
        per_percent in 0i64..1_000_000,
        per_kw in 0i64..2_000,
        cap in prop::option::of(0.0f64..0.3),
        output in -10.0f64..20.0,
        heat_rate in -10.0f64..20.0,
    ) {
        let g = guarantee(tolerance, rule, per_percent, per_kw, cap);
        let convert = |r: &SettlementRates| SettlementRates {
            heat_rate: match r.heat_rate {
                HeatRateRate::PerPercent(x) => HeatRateRate::PerPercent(x.to_f64()),
                HeatRateRate::PerKjPerKwh(x) => HeatRateRate::PerKjPerKwh(x.to_f64()),
            },
            output_per_kw: r.output_per_kw.to_f64(),
            cap_fraction_of_price: r.cap_fraction_of_price,
        };
        let g64 = Guarantee::<f64> {
            net_output_kw: g.net_output_kw,
            heat_rate_kj_per_kwh: g.heat_rate_kj_per_kwh,
            tolerance: g.tolerance,
            rule: g.rule,
            damages: convert(&g.damages),
            bonus: convert(&g.bonus),
        };
        let m = measured(output, heat_rate);
        let exact = settle(&g, Decimal::new(40_000_000, 0), &m).unwrap();
        let fast = settle(&g64, 40_000_000.0, &m).unwrap();
        for (a, b) in [(exact.damages, fast.damages), (exact.bonus, fast.bonus)] {
            prop_assert!((a.to_f64() - b).abs() <= 1e-6 * b.abs().max(1.0), "{} vs {}", a, b);
        }
    }
}
