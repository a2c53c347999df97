//! The energy and capacity bought in ("levelling") stream: energy and capacity a
//! candidate falls short of, bought elsewhere at escalating prices.
//!
//! Checks:
//! - its present value against the closed form of NIST Handbook 135
//!   (Fuller & Petersen, 1995): a uniform amount A escalating at e for n
//!   years at discount rate d is worth A · UPV*(d, e, n),
//!   UPV* = ((1+e)/(d−e))(1 − ((1+e)/(1+d))^n); tolerance 1e-12 relative as
//!   for the other streams (see `finance_factors.rs`);
//! - pro rata charging in a partial first year (energy like energy, capacity
//!   like fixed O&M);
//! - zero quantities leave the ledger exactly as it is without the stream;
//! - the levelized cost leaves it out; net savings and operating savings
//!   carry it;
//! - bad values are refused naming the field.

mod finance_support;

use brayfin::finance::factors::modified_uniform_present_value;
use brayfin::finance::{
    bid_factors, build_ledger, compare_summaries, summarize_ledger, BoughtIn, CapacityValue,
    EscalatingPrice, FinanceError, LedgerInputs, Money, RowKind,
};
use finance_support::{busy_inputs, date, dec, empty_inputs};
use rust_decimal::Decimal;

fn assert_close(actual: f64, expected: f64, what: &str) {
    let error = (actual - expected).abs() / expected.abs();
    assert!(
        error < 1e-12,
        "{what}: ledger {actual} vs closed form {expected} (rel {error:e})"
    );
}

fn shortfall(
    energy_mwh: f64,
    energy: &str,
    e_energy: f64,
    kw: f64,
    capacity: &str,
    e_capacity: f64,
) -> BoughtIn {
    BoughtIn {
        energy_mwh_per_year: energy_mwh,
        energy_price: EscalatingPrice {
            price: dec(energy),
            escalation: e_energy,
        },
        capacity_kw: kw,
        capacity_price: EscalatingPrice {
            price: dec(capacity),
            escalation: e_capacity,
        },
    }
}

/// Present value of the bought_in stream and the lifecycle cost, in both
/// number types, as f64.
fn bought_in_pv(inputs: &LedgerInputs) -> [f64; 4] {
    let decimal = summarize_ledger(inputs).expect("decimal ledger");
    let float = summarize_ledger(&inputs.to_f64()).expect("f64 ledger");
    [
        decimal.present_value.bought_in.to_f64(),
        float.present_value.bought_in,
        decimal.lifecycle_cost.to_f64(),
        float.lifecycle_cost,
    ]
}

/// An energy shortfall of 26 400 MWh a year at 95.00 per MWh escalating at
/// e is worth 2 508 000 × UPV*(d, e, n); a capacity shortfall of 3 300 kW at
/// 40.00 per kW-year escalating at e is worth 132 000 × UPV*(d, e, n).
/// Each alone and both together (the sum), 1 January start, end-of-year;
/// 5 × 4 × 4 = 80 combinations.
#[test]
fn bought_in_matches_modified_upv() {
    for d in [0.0, 0.03, 0.08, 0.12, -0.01] {
        for e in [-0.03, 0.0, 0.02, d] {
            for n in [1, 12, 30, 60] {
                let what = format!("d={d} e={e} n={n}");
                let energy = 2_508_000.0 * modified_uniform_present_value(d, e, n);
                let capacity = 132_000.0 * modified_uniform_present_value(d, e, n);
                for (bought_in, expected, part) in [
                    (
                        shortfall(26_400.0, "95.00", e, 0.0, "40.00", e),
                        energy,
                        "energy",
                    ),
                    (
                        shortfall(0.0, "95.00", e, 3_300.0, "40.00", e),
                        capacity,
                        "capacity",
                    ),
                    (
                        shortfall(26_400.0, "95.00", e, 3_300.0, "40.00", e),
                        energy + capacity,
                        "both",
                    ),
                ] {
                    let mut inputs = empty_inputs(n, d);
                    inputs.bought_in = bought_in;
                    let [decimal, float, lcc_decimal, lcc_float] = bought_in_pv(&inputs);
                    assert_close(decimal, expected, &format!("Decimal {part} {what}"));
                    assert_close(float, expected, &format!("f64 {part} {what}"));
                    // The only stream: the lifecycle cost (the sum of the
                    // rows) equals it too.
                    assert_close(lcc_decimal, expected, &format!("LCC Decimal {part} {what}"));
                    assert_close(lcc_float, expected, &format!("LCC f64 {part} {what}"));
                }
            }
        }
    }
}

/// A first partial year (commercial operation 1 October 2026): the energy
/// part is charged by the row's share of a year of operation, exactly like
/// the candidate's own energy, and the capacity part like fixed O&M.
/// Constant prices, so each row's charge is price × quantity × the same
/// share the row applies to energy or to fixed O&M (hand-checkable:
/// 92 days of 365 in the first row).
#[test]
fn partial_years_are_charged_pro_rata() {
    let mut inputs = empty_inputs(3, 0.05);
    inputs.commercial_operation = date(2026, 10, 1);
    inputs.operation.operating_hours = 8000.0;
    inputs.operation.energy_mwh = 200_000.0;
    inputs.operation.net_output_kw = 25_000.0;
    inputs.fixed_om.price = dec("20.00");

    inputs.bought_in = shortfall(10_000.0, "90.00", 0.0, 0.0, "0", 0.0);
    let ledger = build_ledger(&inputs).unwrap();
    let rows: Vec<_> = ledger
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Operation)
        .collect();
    assert_eq!(rows.len(), 4, "2026 partial, 2027, 2028, 2029 partial");
    let first_share = rows[0].energy_mwh / 200_000.0;
    assert!((first_share - 92.0 / 365.0).abs() < 1e-12, "{first_share}");
    for row in &rows {
        let share = row.energy_mwh / 200_000.0;
        let expected = 900_000.0 * share;
        assert!(
            (row.bought_in.to_f64() - expected).abs() < 1e-6,
            "{}: {} vs {expected}",
            row.year,
            row.bought_in
        );
    }

    inputs.bought_in = shortfall(0.0, "0", 0.0, 5_000.0, "40.00", 0.0);
    let ledger = build_ledger(&inputs).unwrap();
    for row in ledger.rows.iter().filter(|r| r.kind == RowKind::Operation) {
        // Fixed O&M is 25 000 kW × 20.00 = 500 000 a year; bought_in
        // 5 000 kW × 40.00 = 200 000 a year: the ratio holds in every row.
        let ratio = row.bought_in.to_f64() / row.fixed_om.to_f64();
        assert!((ratio - 0.4).abs() < 1e-12, "{}: ratio {ratio}", row.year);
    }
}

/// Zero quantities (at any price) leave every row and total exactly as the
/// ledger without the stream; a positive quantity at a zero price adds
/// nothing either.
#[test]
fn zero_quantities_leave_the_ledger_unchanged() {
    let mut without = busy_inputs();
    without.bought_in = BoughtIn::default();
    let reference = build_ledger(&without).unwrap();
    for bought_in in [
        shortfall(0.0, "95.00", 0.02, 0.0, "40.00", 0.01),
        shortfall(12_000.0, "0", 0.02, 2_000.0, "0", 0.0),
    ] {
        let mut inputs = without.clone();
        inputs.bought_in = bought_in;
        let ledger = build_ledger(&inputs).unwrap();
        assert_eq!(ledger, reference, "{bought_in:?}");
        assert!(ledger.rows.iter().all(|r| r.bought_in.is_zero()));
        let float = build_ledger(&inputs.to_f64()).unwrap();
        assert_eq!(float, build_ledger(&without.to_f64()).unwrap());
    }
}

/// The levelized cost is the candidate's own cost per MWh: adding a
/// shortfall raises the lifecycle cost by the stream's present value and
/// leaves the levelized cost as it was (to the last digit of the division).
#[test]
fn levelized_cost_leaves_bought_in_out() {
    let mut without = busy_inputs();
    without.bought_in = BoughtIn::default();
    let with = busy_inputs();
    let (a, b) = (
        summarize_ledger(&without).unwrap(),
        summarize_ledger(&with).unwrap(),
    );
    assert!(b.present_value.bought_in > Decimal::ZERO);
    let added = b.lifecycle_cost - a.lifecycle_cost;
    let gap = (added - b.present_value.bought_in).abs();
    assert!(
        gap < dec("0.000001"),
        "added {added} vs stream {}",
        b.present_value.bought_in
    );
    let (lcoe_a, lcoe_b) = (
        a.levelized_cost_per_mwh().unwrap(),
        b.levelized_cost_per_mwh().unwrap(),
    );
    assert!(
        (lcoe_a - lcoe_b).abs() < dec("1e-12"),
        "{lcoe_a} vs {lcoe_b}"
    );
}

/// Two candidates alike but for their shortfall: the one short of output
/// saves nothing in operation and loses exactly the present value of its
/// bought_in, which counts as an operating cost (ASTM E1074 split).
#[test]
fn bought_in_is_an_operating_cost_in_savings() {
    let mut full = busy_inputs();
    full.bought_in = BoughtIn::default();
    let short = busy_inputs();
    let savings = compare_summaries(
        &summarize_ledger(&short).unwrap(),
        &summarize_ledger(&full).unwrap(),
    )
    .unwrap();
    let stream = summarize_ledger(&short).unwrap().present_value.bought_in;
    assert!((savings.net_savings + stream).abs() < dec("0.000001"));
    assert!((savings.operating_savings + stream).abs() < dec("0.000001"));
    assert_eq!(savings.added_investment, Decimal::ZERO);
}

/// The bid factor's capacity value is the same stream: one kW less
/// shortfall lowers the lifecycle cost by exactly the present value of one
/// kW of capacity value (same price, same escalation).
#[test]
fn capacity_value_per_kw_is_one_kw_of_bought_in() {
    let inputs = busy_inputs();
    let capacity = CapacityValue {
        per_kw_year: inputs.bought_in.capacity_price.price,
        escalation: inputs.bought_in.capacity_price.escalation,
    };
    let factors = bid_factors(&inputs, &capacity).unwrap();
    let mut less = inputs.clone();
    less.bought_in.capacity_kw -= 1.0;
    let saved = summarize_ledger(&inputs).unwrap().lifecycle_cost
        - summarize_ledger(&less).unwrap().lifecycle_cost;
    assert!(
        (saved - factors.pv_capacity_value_per_kw).abs() < dec("0.000001"),
        "{saved} vs {}",
        factors.pv_capacity_value_per_kw
    );
}

fn refusal(inputs: &LedgerInputs) -> String {
    let decimal = build_ledger(inputs).expect_err("Decimal ledger refuses");
    let float = build_ledger(&inputs.to_f64()).expect_err("f64 ledger refuses");
    assert_eq!(decimal.to_string(), float.to_string());
    decimal.to_string()
}

/// A way to spoil one bought_in input.
type Spoil = fn(&mut BoughtIn);

#[test]
fn bad_bought_in_inputs_are_refused_by_name() {
    let cases: [(Spoil, &str, &str); 6] = [
        (
            |r| r.energy_mwh_per_year = -1.0,
            "bought_in.energy_mwh_per_year",
            "zero or more",
        ),
        (
            |r| r.energy_mwh_per_year = f64::NAN,
            "bought_in.energy_mwh_per_year",
            "finite",
        ),
        (
            |r| r.capacity_kw = f64::INFINITY,
            "bought_in.capacity_kw",
            "finite",
        ),
        (
            |r| r.energy_price.price = dec("-0.01"),
            "bought_in.energy_price.price",
            "zero or more",
        ),
        (
            |r| r.capacity_price.price = dec("-5"),
            "bought_in.capacity_price.price",
            "zero or more",
        ),
        (
            |r| r.capacity_price.escalation = -1.0,
            "bought_in.capacity_price.escalation",
            "greater than -1",
        ),
    ];
    for (spoil, field, valid) in cases {
        let mut inputs = busy_inputs();
        spoil(&mut inputs.bought_in);
        let message = refusal(&inputs);
        assert!(message.contains(field), "{message:?} lacks {field}");
        assert!(message.contains(valid), "{message:?} lacks {valid}");
    }
    let mut inputs = busy_inputs();
    inputs.bought_in.energy_price.escalation = f64::NAN;
    assert!(matches!(
        build_ledger(&inputs),
        Err(FinanceError::OutOfRange {
            field: "bought_in.energy_price.escalation",
            ..
        })
    ));
}
