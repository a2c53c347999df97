//! Shared inputs for the finance tests. Each test binary uses a subset, so
//! unused-item warnings are silenced for this module only.
#![allow(dead_code)]

use brayfin::finance::{
    AcceptanceSettlement, BoughtIn, Capital, Carbon, Degradation, EscalatingPrice, Fuel, FuelPrice,
    LedgerInputs, Operation, PriceBasis, RateBasis, Rates, Residual, ResidualValue, ServiceFees,
    Starts, Timing,
};
use chrono::NaiveDate;
use rust_decimal::Decimal;

/// A date that is known to exist.
pub fn date(year: i32, month: u32, day: u32) -> NaiveDate {
    NaiveDate::from_ymd_opt(year, month, day).expect("test dates are valid")
}

/// Decimal from text, for exact money literals.
pub fn dec(text: &str) -> Decimal {
    text.parse().expect("test decimals are valid")
}

/// A ledger with every stream zero: 1 January start, real 3 %, end-of-year,
/// no capital, no fuel, no carbon, no O&M, no overhauls, no residual, no
/// energy and capacity bought in. Tests switch on only what they check.
pub fn empty_inputs(service_life_years: u32, discount_rate: f64) -> LedgerInputs {
    LedgerInputs {
        commercial_operation: date(2026, 1, 1),
        service_life_years,
        rates: Rates {
            discount_rate,
            basis: RateBasis::Real,
            inflation: 0.02,
        },
        timing: Timing::EndOfYear,
        present_value_date: None,
        capital: Capital::AtCommercialOperation(Decimal::ZERO),
        operation: Operation {
            operating_hours: 0.0,
            energy_mwh: 0.0,
            fuel_energy_gj_lhv: 0.0,
            net_output_kw: 0.0,
            starts_per_year: 0.0,
        },
        fuel: Fuel {
            price: FuelPrice::Escalating {
                price_per_gj: Decimal::ZERO,
                escalation: 0.0,
            },
            basis: PriceBasis::Lhv,
            hhv_over_lhv: 1.11,
        },
        carbon: Carbon {
            co2_kg_per_gj_lhv: 0.0,
            price_per_tonne: Decimal::ZERO,
            escalation: 0.0,
        },
        fixed_om: EscalatingPrice {
            price: Decimal::ZERO,
            escalation: 0.0,
        },
        variable_om: EscalatingPrice {
            price: Decimal::ZERO,
            escalation: 0.0,
        },
        starts: Starts::default(),
        service: ServiceFees::default(),
        overhaul: None,
        degradation: Degradation::default(),
        residual: Residual {
            value: ResidualValue::Amount(Decimal::ZERO),
            escalation: 0.0,
        },
        bought_in: BoughtIn::default(),
        acceptance_settlement: AcceptanceSettlement::default(),
    }
}

/// An invented 50 MW-class candidate with every stream active (demo data, not
/// a check value): mid-year start, construction capital over two years,
/// HHV-priced escalating gas, carbon, O&M, overhauls, degradation, residual,
/// and an output shortfall (4 MW, 24 000 MWh a year) bought elsewhere.
pub fn busy_inputs() -> LedgerInputs {
    use brayfin::finance::{CapitalPayment, Overhaul};
    LedgerInputs {
        commercial_operation: date(2027, 7, 1),
        service_life_years: 30,
        rates: Rates {
            discount_rate: 0.07,
            basis: RateBasis::Real,
            inflation: 0.025,
        },
        timing: Timing::EndOfYear,
        present_value_date: None,
        capital: Capital::Schedule(vec![
            CapitalPayment {
                date: date(2025, 7, 1),
                amount: dec("12000000.00"),
            },
            CapitalPayment {
                date: date(2026, 7, 1),
                amount: dec("18000000.00"),
            },
            CapitalPayment {
                date: date(2027, 7, 1),
                amount: dec("8500000.00"),
            },
        ]),
        operation: Operation {
            operating_hours: 6000.0,
            energy_mwh: 300_000.0,
            fuel_energy_gj_lhv: 2_850_000.0,
            net_output_kw: 50_000.0,
            starts_per_year: 0.0,
        },
        fuel: Fuel {
            price: FuelPrice::Escalating {
                price_per_gj: dec("4.35"),
                escalation: 0.012,
            },
            basis: PriceBasis::Hhv,
            hhv_over_lhv: 1.108,
        },
        carbon: Carbon {
            co2_kg_per_gj_lhv: 56.1,
            price_per_tonne: dec("35.00"),
            escalation: 0.03,
        },
        fixed_om: EscalatingPrice {
            price: dec("18.50"),
            escalation: 0.005,
        },
        variable_om: EscalatingPrice {
            price: dec("3.20"),
            escalation: 0.004,
        },
        starts: Starts::default(),
        service: ServiceFees::default(),
        overhaul: Some(Overhaul {
            interval_hours: 24_000.0,
            hours_per_start: 0.0,
            interval_starts: None,
            outage_days: 0.0,
            outage_capacity_kw: 0.0,
            cost: dec("2400000.00"),
            escalation: 0.01,
        }),
        degradation: Degradation {
            heat_rate_fraction_per_year: 0.004,
            output_fraction_per_year: 0.0,
            recoverable_fraction: 0.7,
        },
        residual: Residual {
            value: ResidualValue::FractionOfCapital(0.1),
            escalation: 0.0,
        },
        bought_in: BoughtIn {
            energy_mwh_per_year: 24_000.0,
            energy_price: EscalatingPrice {
                price: dec("92.00"),
                escalation: 0.008,
            },
            capacity_kw: 4_000.0,
            capacity_price: EscalatingPrice {
                price: dec("45.00"),
                escalation: 0.0,
            },
        },
        acceptance_settlement: AcceptanceSettlement::default(),
    }
}

/// The baseline for [`busy_inputs`] (invented demo data): cheaper, paid at
/// commercial operation, with a worse heat rate and shorter overhaul interval.
pub fn busy_baseline() -> LedgerInputs {
    use brayfin::finance::Overhaul;
    let mut inputs = busy_inputs();
    inputs.capital = Capital::AtCommercialOperation(dec("31000000.00"));
    inputs.operation.fuel_energy_gj_lhv = 3_120_000.0;
    inputs.overhaul = Some(Overhaul {
        interval_hours: 20_000.0,
        hours_per_start: 0.0,
        interval_starts: None,
        outage_days: 0.0,
        outage_capacity_kw: 0.0,
        cost: dec("2100000.00"),
        escalation: 0.01,
    });
    inputs
}
