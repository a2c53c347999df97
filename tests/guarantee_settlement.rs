//! Settlement of a performance guarantee at the acceptance test, checked in
//! closed form: shortfall, tolerance, rate, cap.
//!
//! The rules (common practice in gas-turbine supply contracts, from memory):
//! a shortfall within the test tolerance (the measurement uncertainty an
//! ASME PTC 22 / ISO 2314 style test assigns) costs nothing; beyond it the
//! vendor pays liquidated damages at a rate per unit, either on the part
//! beyond the band or on the whole shortfall, up to a cap that is a fraction
//! of the contract price. The guarantees and rates below are invented round
//! numbers chosen so that each amount can be worked by hand.

use brayfin::finance::{
    settle, FinanceError, Guarantee, HeatRateRate, MeasuredPerformance, SettlementRates,
    TestTolerance, ToleranceRule,
};
use rust_decimal::Decimal;

fn dec(text: &str) -> Decimal {
    text.parse().expect("test decimals are valid")
}

/// 100 000 kW at 9 500 kJ/kWh; tolerance 1 % on heat rate, 0.5 % on output;
/// damages 250 000 per % of heat rate and 400 per kW; no cap; no bonus.
fn guarantee(rule: ToleranceRule) -> Guarantee {
    Guarantee {
        net_output_kw: 100_000.0,
        heat_rate_kj_per_kwh: 9_500.0,
        tolerance: TestTolerance {
            output_percent: 0.5,
            heat_rate_percent: 1.0,
        },
        rule,
        damages: SettlementRates {
            heat_rate: HeatRateRate::PerPercent(dec("250000")),
            output_per_kw: dec("400"),
            cap_fraction_of_price: None,
        },
        bonus: SettlementRates::NONE,
    }
}

fn measured(net_output_kw: f64, heat_rate_kj_per_kwh: f64) -> MeasuredPerformance {
    MeasuredPerformance {
        net_output_kw,
        heat_rate_kj_per_kwh,
    }
}

const PRICE: &str = "20000000";

/// Heat rate 9 785 kJ/kWh is 285/9 500 = 3 % worse than guaranteed.
/// Beyond the band: 3 % − 1 % = 2 % × 250 000 = 500 000.
/// Whole once beyond: 3 % × 250 000 = 750 000.
#[test]
fn heat_rate_damages_per_percent_by_rule() {
    for (rule, expected) in [
        (ToleranceRule::BeyondBand, "500000"),
        (ToleranceRule::WholeOnceBeyond, "750000"),
    ] {
        let s = settle(&guarantee(rule), dec(PRICE), &measured(100_000.0, 9_785.0)).unwrap();
        assert!((s.heat_rate_shortfall_percent - 3.0).abs() < 1e-12);
        assert_eq!(s.heat_rate_damages, dec(expected), "{rule:?}");
        assert_eq!(s.output_damages, Decimal::ZERO);
        assert_eq!(s.damages, dec(expected));
        assert!(s.beyond_tolerance && !s.damages_capped);
        assert_eq!(s.bonus, Decimal::ZERO);
    }
}

/// Per kJ/kWh at 2 500: beyond the band 9 785 − 9 500 × 1.01 = 190 kJ/kWh →
/// 475 000; whole once beyond 285 kJ/kWh → 712 500.
#[test]
fn heat_rate_damages_per_kj_per_kwh_by_rule() {
    for (rule, expected) in [
        (ToleranceRule::BeyondBand, "475000"),
        (ToleranceRule::WholeOnceBeyond, "712500"),
    ] {
        let mut g = guarantee(rule);
        g.damages.heat_rate = HeatRateRate::PerKjPerKwh(dec("2500"));
        let s = settle(&g, dec(PRICE), &measured(100_000.0, 9_785.0)).unwrap();
        assert_eq!(s.damages, dec(expected), "{rule:?}");
    }
}

/// Output 97 000 kW is 3 % short; band 0.5 %. Beyond the band 2.5 % of
/// 100 000 kW = 2 500 kW × 400 = 1 000 000; whole once beyond 3 000 kW ×
/// 400 = 1 200 000.
#[test]
fn output_damages_by_rule() {
    for (rule, expected) in [
        (ToleranceRule::BeyondBand, "1000000"),
        (ToleranceRule::WholeOnceBeyond, "1200000"),
    ] {
        let s = settle(&guarantee(rule), dec(PRICE), &measured(97_000.0, 9_500.0)).unwrap();
        assert!((s.output_shortfall_percent - 3.0).abs() < 1e-12);
        assert_eq!(s.output_damages, dec(expected), "{rule:?}");
        assert_eq!(s.heat_rate_damages, Decimal::ZERO);
        assert_eq!(s.damages, dec(expected));
    }
}

/// Within the band nothing is due under either rule: heat rate 9 590
/// (0.947 % worse), output 99 600 kW (0.4 % short); and exactly at the
/// band's edge (9 595 kJ/kWh = 1 %, 99 500 kW = 0.5 %) neither.
#[test]
fn within_and_at_the_tolerance_nothing_is_due() {
    for rule in [ToleranceRule::BeyondBand, ToleranceRule::WholeOnceBeyond] {
        for (output, heat_rate) in [(99_600.0, 9_590.0), (99_500.0, 9_595.0)] {
            let s = settle(&guarantee(rule), dec(PRICE), &measured(output, heat_rate)).unwrap();
            assert_eq!(s.damages, Decimal::ZERO, "{rule:?} {output} {heat_rate}");
            assert!(!s.beyond_tolerance);
        }
    }
}

/// Both short: 500 000 (heat rate) + 1 000 000 (output) = 1 500 000 before
/// the cap; a cap of 5 % of 20 000 000 = 1 000 000 binds. A 10 % cap
/// (2 000 000) does not.
#[test]
fn cap_is_a_fraction_of_the_contract_price() {
    let mut g = guarantee(ToleranceRule::BeyondBand);
    g.damages.cap_fraction_of_price = Some(0.05);
    let s = settle(&g, dec(PRICE), &measured(97_000.0, 9_785.0)).unwrap();
    assert_eq!(s.heat_rate_damages, dec("500000"));
    assert_eq!(s.output_damages, dec("1000000"));
    assert_eq!(s.damages, dec("1000000"));
    assert!(s.damages_capped);
    g.damages.cap_fraction_of_price = Some(0.10);
    let s = settle(&g, dec(PRICE), &measured(97_000.0, 9_785.0)).unwrap();
    assert_eq!(s.damages, dec("1500000"));
    assert!(!s.damages_capped);
}

/// Bonus at 100 000 per % of heat rate and 150 per kW, capped at 1 % of
/// the price (200 000), by the same band rule mirrored. Heat rate 9 310 is
/// 2 % better → 1 % beyond the band → 100 000; output 101 000 kW is 1 %
/// above → 0.5 % beyond the band = 500 kW → 75 000; sum 175 000, under the
/// cap. Output 102 000 kW → 1 500 kW → 225 000; sum 325 000, capped at
/// 200 000.
#[test]
fn bonus_mirrors_the_damages() {
    let mut g = guarantee(ToleranceRule::BeyondBand);
    g.bonus = SettlementRates {
        heat_rate: HeatRateRate::PerPercent(dec("100000")),
        output_per_kw: dec("150"),
        cap_fraction_of_price: Some(0.01),
    };
    let s = settle(&g, dec(PRICE), &measured(101_000.0, 9_310.0)).unwrap();
    assert_eq!(s.heat_rate_bonus, dec("100000"));
    assert_eq!(s.output_bonus, dec("75000"));
    assert_eq!(s.bonus, dec("175000"));
    assert!(!s.bonus_capped);
    assert_eq!(s.damages, Decimal::ZERO);
    let s = settle(&g, dec(PRICE), &measured(102_000.0, 9_310.0)).unwrap();
    assert_eq!(s.bonus, dec("200000"));
    assert!(s.bonus_capped);
}

/// More output at a worse heat rate: damages on the heat rate (500 000) and
/// a bonus on the output (0.5 % beyond the band = 500 kW × 150 = 75 000)
/// are both due; the ledger nets them: 75 000 − 500 000 = −425 000.
#[test]
fn damages_and_bonus_both_due_are_netted_in_the_ledger_amount() {
    let mut g = guarantee(ToleranceRule::BeyondBand);
    g.bonus.output_per_kw = dec("150");
    let s = settle(&g, dec(PRICE), &measured(101_000.0, 9_785.0)).unwrap();
    assert_eq!(s.damages, dec("500000"));
    assert_eq!(s.bonus, dec("75000"));
    let ledger = s.to_ledger();
    assert_eq!(ledger.net_cost(), Some(dec("-425000")));
}

/// Without a bonus clause, better performance earns nothing.
#[test]
fn no_bonus_clause_pays_nothing_for_better_performance() {
    let s = settle(
        &guarantee(ToleranceRule::BeyondBand),
        dec(PRICE),
        &measured(110_000.0, 9_000.0),
    )
    .unwrap();
    assert_eq!(s.damages, Decimal::ZERO);
    assert_eq!(s.bonus, Decimal::ZERO);
    assert!(s.to_ledger().is_zero());
}

/// The same settlement in `f64` money (the sampling ledger's type) equals
/// the decimal one to rounding.
#[test]
fn f64_settlement_matches_decimal() {
    let g = guarantee(ToleranceRule::BeyondBand);
    let g64 = Guarantee::<f64> {
        net_output_kw: g.net_output_kw,
        heat_rate_kj_per_kwh: g.heat_rate_kj_per_kwh,
        tolerance: g.tolerance,
        rule: g.rule,
        damages: SettlementRates {
            heat_rate: HeatRateRate::PerPercent(250_000.0),
            output_per_kw: 400.0,
            cap_fraction_of_price: None,
        },
        bonus: SettlementRates::NONE,
    };
    let m = measured(97_000.0, 9_785.0);
    let exact = settle(&g, dec(PRICE), &m).unwrap().damages;
    let fast = settle(&g64, 20_000_000.0, &m).unwrap().damages;
    assert!((fast - 1_500_000.0).abs() < 1e-6, "{fast}");
    assert_eq!(exact, dec("1500000"));
}

/// Bad inputs are refused with the field named, never a panic.
#[test]
fn bad_inputs_name_the_field() {
    let price = dec(PRICE);
    let ok = measured(100_000.0, 9_500.0);
    let field_of = |result: Result<_, FinanceError>| match result {
        Err(FinanceError::OutOfRange { field, .. }) => field.to_string(),
        Err(FinanceError::NegativeMoney { field, .. }) => field,
        other => panic!("expected a field error, got {other:?}"),
    };
    let mut g = guarantee(ToleranceRule::BeyondBand);
    g.net_output_kw = 0.0;
    assert_eq!(field_of(settle(&g, price, &ok)), "guarantee.net_output_kw");
    let mut g = guarantee(ToleranceRule::BeyondBand);
    g.heat_rate_kj_per_kwh = f64::NAN;
    assert_eq!(
        field_of(settle(&g, price, &ok)),
        "guarantee.heat_rate_kj_per_kwh"
    );
    let mut g = guarantee(ToleranceRule::BeyondBand);
    g.tolerance.heat_rate_percent = -1.0;
    assert_eq!(
        field_of(settle(&g, price, &ok)),
        "guarantee.tolerance.heat_rate_percent"
    );
    let mut g = guarantee(ToleranceRule::BeyondBand);
    g.damages.output_per_kw = dec("-1");
    assert_eq!(
        field_of(settle(&g, price, &ok)),
        "guarantee.damages.output_per_kw"
    );
    let mut g = guarantee(ToleranceRule::BeyondBand);
    g.bonus.cap_fraction_of_price = Some(1.5);
    assert_eq!(
        field_of(settle(&g, price, &ok)),
        "guarantee.bonus.cap_fraction_of_price"
    );
    let g = guarantee(ToleranceRule::BeyondBand);
    assert_eq!(field_of(settle(&g, dec("-1"), &ok)), "contract_price");
    assert_eq!(
        field_of(settle(&g, price, &measured(f64::INFINITY, 9_500.0))),
        "measured.net_output_kw"
    );
    assert_eq!(
        field_of(settle(&g, price, &measured(100_000.0, 0.0))),
        "measured.heat_rate_kj_per_kwh"
    );
}

/// Amounts beyond the decimal range are an overflow error naming the
/// stream, not a panic.
#[test]
fn overflow_is_an_error() {
    let mut g = guarantee(ToleranceRule::BeyondBand);
    g.damages.output_per_kw = Decimal::MAX;
    let result = settle(&g, dec(PRICE), &measured(50_000.0, 9_500.0));
    assert_eq!(
        result,
        Err(FinanceError::SettlementOverflow {
            stream: "guarantee damages"
        })
    );
}
