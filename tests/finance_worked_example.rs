//! A worked life-cycle-cost example reproduced to the cent.
//!
//! Source: a hand-computed example constructed for this test (not taken from
//! a published document; no published example could be recalled faithfully
//! enough to quote to the cent). The arithmetic is written out below and was
//! cross-checked with exact rational arithmetic.
//!
//! Inputs: service from 1 January 2026 for 3 years; real discount rate 3 %;
//! end-of-year timing; capital 100 000.00 at commercial operation; fuel
//! 10 000 GJ (LHV) a year at 4.00 per GJ (LHV) escalating 2 % a year; fixed
//! O&M 10.00 per kW-year on 1 000 kW; residual value 10 % of capital.
//!
//! Year 1: fuel 40 000 × 1.02 = 40 800.00; fixed 10 000.00; total 50 800.00;
//!         PV = 50 800 / 1.03 = 49 320.388 → 49 320.39
//! Year 2: fuel 40 000 × 1.0404 = 41 616.00; total 51 616.00;
//!         PV = 51 616 / 1.0609 = 48 653.030 → 48 653.03
//! Year 3: fuel 40 000 × 1.061208 = 42 448.32; total 52 448.32;
//!         PV = 52 448.32 / 1.092727 = 47 997.643 → 47 997.64
//! Residual: −10 000.00 at year 3; PV = −10 000 / 1.092727 = −9 151.417
//!         → −9 151.42
//! Lifecycle cost = 100 000 + 49 320.388 + 48 653.030 + 47 997.643
//!         − 9 151.417 = 236 819.645 → 236 819.64

mod finance_support;

use brayfin::finance::{
    build_ledger, round_for_presentation, Capital, FuelPrice, Residual, ResidualValue, RowKind,
};
use finance_support::{dec, empty_inputs};

#[test]
fn hand_computed_three_year_example_to_the_cent() {
    let mut inputs = empty_inputs(3, 0.03);
    inputs.capital = Capital::AtCommercialOperation(dec("100000.00"));
    inputs.operation.fuel_energy_gj_lhv = 10_000.0;
    inputs.operation.net_output_kw = 1000.0;
    inputs.fuel.price = FuelPrice::Escalating {
        price_per_gj: dec("4.00"),
        escalation: 0.02,
    };
    inputs.fixed_om.price = dec("10.00");
    inputs.residual = Residual {
        value: ResidualValue::FractionOfCapital(0.1),
        escalation: 0.0,
    };
    let ledger = build_ledger(&inputs).expect("ledger");
    let cents = |value| round_for_presentation(value, 2);

    let operating: Vec<_> = ledger
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Operation)
        .collect();
    assert_eq!(operating.len(), 3);
    let expected = [
        (2026, "40800.00", "50800.00", "49320.39"),
        (2027, "41616.00", "51616.00", "48653.03"),
        (2028, "42448.32", "52448.32", "47997.64"),
    ];
    for (row, (year, fuel, total, pv)) in operating.iter().zip(expected) {
        assert_eq!(row.year, year);
        assert_eq!(cents(row.fuel_cost), dec(fuel), "fuel {year}");
        assert_eq!(cents(row.fixed_om), dec("10000.00"), "fixed O&M {year}");
        assert_eq!(cents(row.total), dec(total), "total {year}");
        assert_eq!(cents(row.present_value), dec(pv), "present value {year}");
    }
    let residual = ledger.rows.last().expect("residual row");
    assert_eq!(residual.kind, RowKind::Residual);
    assert_eq!(cents(residual.residual), dec("-10000.00"));
    assert_eq!(cents(residual.present_value), dec("-9151.42"));
    assert_eq!(cents(ledger.summary.lifecycle_cost), dec("236819.64"));
}
