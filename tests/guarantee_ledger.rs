//! The acceptance-test settlement in the ledger: one row on the
//! commercial-operation date with its own column, counted as investment
//! (damages received are negative capital), and nothing at all when nothing
//! is settled. Checked by ledger identities and hand-worked metrics.

mod finance_support;

use brayfin::finance::factors::uniform_present_value;
use brayfin::finance::{
    build_ledger, compare_ledgers, summarize_ledger, AcceptanceSettlement, Capital, FinanceError,
    FuelPrice, LedgerInputs, Money, Payback, RowKind,
};
use finance_support::{busy_baseline, busy_inputs, dec, empty_inputs};
use rust_decimal::Decimal;

fn with_settlement(mut inputs: LedgerInputs, damages: &str, bonus: &str) -> LedgerInputs {
    inputs.acceptance_settlement = AcceptanceSettlement {
        damages: dec(damages),
        bonus: dec(bonus),
    };
    inputs
}

/// Nothing settled: no settlement row, a zero stream, and the summary
/// equals the fast path's (the existing ledgers are untouched: their own
/// tests run on the default, which is this).
#[test]
fn nothing_settled_adds_no_row() {
    let inputs = busy_inputs();
    assert!(inputs.acceptance_settlement.is_zero());
    let ledger = build_ledger(&inputs).unwrap();
    assert!(ledger.rows.iter().all(|r| r.kind != RowKind::Settlement));
    assert!(ledger
        .rows
        .iter()
        .all(|r| r.guarantee_settlement == Decimal::ZERO));
    assert_eq!(
        ledger.summary.present_value.guarantee_settlement,
        Decimal::ZERO
    );
    assert_eq!(summarize_ledger(&inputs).unwrap(), ledger.summary);
    let fast = summarize_ledger(&inputs.to_f64()).unwrap();
    assert_eq!(fast, build_ledger(&inputs.to_f64()).unwrap().summary);
}

/// Damages D = 1 234 567.89 on the busy ledger: one row dated commercial
/// operation (time 0, discount factor 1) whose only money is −D in its own
/// column; every other row as before; lifecycle cost and investment lower
/// by exactly D; operating costs unchanged.
#[test]
fn damages_are_one_row_of_negative_capital_at_commercial_operation() {
    let plain = build_ledger(&busy_inputs()).unwrap();
    let inputs = with_settlement(busy_inputs(), "1234567.89", "0");
    let ledger = build_ledger(&inputs).unwrap();
    let settlement: Vec<_> = ledger
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Settlement)
        .collect();
    assert_eq!(settlement.len(), 1);
    let row = settlement[0];
    assert_eq!(row.period_start, inputs.commercial_operation);
    assert_eq!(row.cash_time_years, 0.0);
    assert_eq!(row.discount_factor, Decimal::ONE);
    assert_eq!(row.guarantee_settlement, dec("-1234567.89"));
    assert_eq!(row.capital, Decimal::ZERO);
    assert_eq!(row.total, dec("-1234567.89"));
    assert_eq!(row.present_value, dec("-1234567.89"));

    // Row order: capital rows, the settlement, then operation as before.
    let position = ledger
        .rows
        .iter()
        .position(|r| r.kind == RowKind::Settlement)
        .unwrap();
    assert!(ledger.rows[..position]
        .iter()
        .all(|r| r.kind == RowKind::Capital));
    let mut others = ledger.rows.clone();
    others.remove(position);
    assert_eq!(others, plain.rows);

    let (with, without) = (ledger.summary, plain.summary);
    assert_eq!(
        with.lifecycle_cost,
        without.lifecycle_cost - dec("1234567.89")
    );
    assert_eq!(
        with.present_value.investment().unwrap(),
        without.present_value.investment().unwrap() - dec("1234567.89")
    );
    assert_eq!(
        with.present_value.operating(),
        without.present_value.operating()
    );
    assert_eq!(with.capital_total, without.capital_total);
    // The identities every row keeps, with the new column.
    let mut sum = Decimal::ZERO;
    for row in &ledger.rows {
        let columns = row.fuel_cost
            + row.carbon_cost
            + row.fixed_om
            + row.variable_om
            + row.overhaul
            + row.bought_in
            + row.capital
            + row.guarantee_settlement
            + row.residual;
        assert_eq!(row.total, columns);
        sum += row.present_value;
    }
    assert_eq!(with.lifecycle_cost, sum);
    // The fast path and the f64 ledger agree.
    assert_eq!(summarize_ledger(&inputs).unwrap(), with);
    let fast = summarize_ledger(&inputs.to_f64()).unwrap();
    assert!(
        (fast.lifecycle_cost - with.lifecycle_cost.to_f64()).abs() < 1e-6 * fast.lifecycle_cost
    );
}

/// A bonus paid is positive capital; bonus and damages net in one column.
#[test]
fn bonus_is_positive_and_nets_with_damages() {
    let ledger = build_ledger(&with_settlement(busy_inputs(), "100000", "250000")).unwrap();
    let row = ledger
        .rows
        .iter()
        .find(|r| r.kind == RowKind::Settlement)
        .unwrap();
    assert_eq!(row.guarantee_settlement, dec("150000"));
    assert_eq!(
        ledger.summary.present_value.guarantee_settlement,
        dec("150000")
    );
}

/// Against the baseline, damages D raise net savings by D and lower the
/// added investment by D; the break-even premium rises by D divided by the
/// candidate's present value per unit of capital (the settlement is held
/// fixed as capital varies).
#[test]
fn damages_in_the_comparison() {
    let baseline = build_ledger(&busy_baseline()).unwrap();
    let plain = build_ledger(&busy_inputs()).unwrap();
    let damaged = build_ledger(&with_settlement(busy_inputs(), "2000000", "0")).unwrap();
    let a = compare_ledgers(&plain, &baseline).unwrap().savings;
    let b = compare_ledgers(&damaged, &baseline).unwrap().savings;
    assert_eq!(b.net_savings, a.net_savings + dec("2000000"));
    assert_eq!(b.added_investment, a.added_investment - dec("2000000"));
    assert_eq!(b.operating_savings, a.operating_savings);
    assert_eq!(b.premium_asked, a.premium_asked);
    let shift = (b.break_even_premium.unwrap() - a.break_even_premium.unwrap()).to_f64();
    let expected = 2_000_000.0 / plain.summary.pv_per_unit_capital.to_f64();
    assert!((shift - expected).abs() < 1e-6, "{shift} vs {expected}");
}

/// The pair of the payback check in `finance_metrics`: 1 000 invested, 300
/// saved a year, 10 % discount, 10 years; now with 100 of damages received
/// at commercial operation, so 900 is to be recovered (ASTM E1121 payback,
/// net of damages).
/// Simple: 3 years × 300 = 900 → exactly 3 years.
/// Discounted: 300 · UPV(10 %, 3) recovered after 3 years; the rest over
/// year 4's 300 / 1.1⁴.
/// IRR: 900 = 300 · UPV(x, 10), checked by the closed-form UPV at the rate
/// found.
#[test]
fn payback_and_rate_of_return_net_of_damages() {
    let yearly = |amount: &str| {
        let mut inputs = empty_inputs(10, 0.10);
        inputs.operation.fuel_energy_gj_lhv = 1.0;
        inputs.fuel.price = FuelPrice::Escalating {
            price_per_gj: dec(amount),
            escalation: 0.0,
        };
        inputs
    };
    let baseline = build_ledger(&yearly("1000.00")).unwrap();
    let mut candidate = yearly("700.00");
    candidate.capital = Capital::AtCommercialOperation(dec("1000.00"));
    let candidate = build_ledger(&with_settlement(candidate, "100.00", "0")).unwrap();
    let comparison = compare_ledgers(&candidate, &baseline).unwrap();
    let Payback::Years(simple) = comparison.simple_payback else {
        panic!("simple payback within life")
    };
    let Payback::Years(discounted) = comparison.discounted_payback else {
        panic!("discounted payback within life")
    };
    assert!((simple - 3.0).abs() < 1e-9, "simple {simple}");
    let recovered = 300.0 * uniform_present_value(0.10, 3);
    let expected = 3.0 + (900.0 - recovered) / (300.0 / 1.1f64.powi(4));
    assert!(
        (discounted - expected).abs() < 1e-9,
        "discounted {discounted} vs {expected}"
    );
    let irr = comparison.internal_rate_of_return.expect("a root");
    let npv = 300.0 * uniform_present_value(irr, 10) - 900.0;
    assert!(npv.abs() < 1e-6, "IRR {irr}: NPV {npv}");
}

/// Negative damages or bonus are refused with the field named.
#[test]
fn negative_settlement_is_refused() {
    for (damages, bonus, field) in [
        ("-1", "0", "acceptance_settlement.damages"),
        ("0", "-0.01", "acceptance_settlement.bonus"),
    ] {
        let error = build_ledger(&with_settlement(empty_inputs(5, 0.03), damages, bonus))
            .expect_err("negative settlement");
        assert!(
            matches!(&error, FinanceError::NegativeMoney { field: f, .. } if f == field),
            "{error:?}"
        );
    }
}

/// From the settlement to the ledger: a heat rate 3 % worse than a
/// 9 500 kJ/kWh guarantee with a 1 % tolerance and 250 000 per counted %
/// settles 500 000 of damages (2 % beyond the band); the ledger's
/// lifecycle cost falls by exactly that.
#[test]
fn settled_damages_flow_into_the_ledger() {
    use brayfin::finance::{
        settle, Guarantee, HeatRateRate, MeasuredPerformance, SettlementRates, TestTolerance,
        ToleranceRule,
    };
    let guarantee = Guarantee {
        net_output_kw: 100_000.0,
        heat_rate_kj_per_kwh: 9_500.0,
        tolerance: TestTolerance::uniform(1.0),
        rule: ToleranceRule::BeyondBand,
        damages: SettlementRates {
            heat_rate: HeatRateRate::PerPercent(dec("250000")),
            output_per_kw: Decimal::ZERO,
            cap_fraction_of_price: Some(0.1),
        },
        bonus: SettlementRates::NONE,
    };
    let measured = MeasuredPerformance {
        net_output_kw: 100_000.0,
        heat_rate_kj_per_kwh: 9_785.0,
    };
    let inputs = busy_inputs();
    let price = inputs.capital.total().unwrap();
    let settlement = settle(&guarantee, price, &measured).unwrap();
    assert_eq!(settlement.damages, dec("500000"));
    let mut settled = inputs.clone();
    settled.acceptance_settlement = settlement.to_ledger();
    let with = summarize_ledger(&settled).unwrap().lifecycle_cost;
    let without = summarize_ledger(&inputs).unwrap().lifecycle_cost;
    assert_eq!(with, without - dec("500000"));
}
