//! Properties every ledger must have, over generated inputs (proptest):
//! - a candidate against itself saves exactly nothing;
//! - adding the break-even premium to the candidate's capital brings net
//!   savings to zero within one minor unit (0.01);
//! - lifecycle cost rises with the fuel price and with operating hours;
//! - real and nominal statements of the same cash flows (Fisher relation)
//!   give the same lifecycle cost;
//! - the Decimal and f64 ledgers agree to 1e-9 relative.
//!
//! Generated ranges are plausible plant inputs (invented, not check values).

mod finance_support;

use brayfin::finance::{
    build_ledger, compare_summaries, summarize_ledger, AcceptanceSettlement, BoughtIn, Capital,
    CapitalPayment, Carbon, Degradation, EscalatingPrice, Fuel, FuelPrice, LedgerInputs, Money,
    Operation, Overhaul, PriceBasis, RateBasis, Rates, Residual, ResidualValue, ServiceFees,
    Starts, Timing,
};
use chrono::{Days, Months};
use finance_support::date;
use proptest::prelude::*;
use rust_decimal::Decimal;

fn cents(value: i64) -> Decimal {
    Decimal::new(value, 2)
}

prop_compose! {
    fn rates_and_calendar()(
        service_life_years in 1u32..=60,
        start_offset_days in 0u64..3650,
        discount_rate in -0.02f64..0.15,
        inflation in -0.01f64..0.05,
        mid_year in any::<bool>(),
    ) -> (u32, chrono::NaiveDate, Rates, Timing) {
        let start = date(2025, 1, 1) + Days::new(start_offset_days);
        let rates = Rates { discount_rate, basis: RateBasis::Real, inflation };
        let timing = if mid_year { Timing::MidYear } else { Timing::EndOfYear };
        (service_life_years, start, rates, timing)
    }
}

prop_compose! {
    fn inputs()(
        (service_life_years, commercial_operation, rates, timing) in rates_and_calendar(),
        fuel_price in 100i64..2000,
        escalations in prop::array::uniform5(-0.03f64..0.06),
        carbon_price in 0i64..15_000,
        om_prices in (0i64..5000, 0i64..1000),
        operating_hours in 500.0f64..8700.0,
        heat_rate_kj_per_kwh in 8000.0f64..14_000.0,
        net_output_kw in 1000.0f64..500_000.0,
        degradation in (0.0f64..0.01, 0.0f64..1.0),
        overhaul_interval in prop::option::of(8000.0f64..50_000.0),
        overhaul_cost in 100_000i64..1_000_000_000,
        capital in 100_000_000i64..50_000_000_000,
        construction_years in 0u32..3,
        residual_fraction in 0.0f64..0.3,
        hhv_priced in any::<bool>(),
        shortfall in (0.0f64..100_000.0, 0i64..20_000, 0.0f64..50_000.0, 0i64..15_000),
        bought_in_escalations in prop::array::uniform2(-0.03f64..0.06),
    ) -> LedgerInputs {
        let energy_mwh = net_output_kw * operating_hours / 1000.0;
        let payments = (0..=construction_years)
            .rev()
            .filter_map(|years_before| {
                Some(CapitalPayment {
                    date: commercial_operation.checked_sub_months(Months::new(12 * years_before))?,
                    amount: cents(capital / i64::from(construction_years + 1)),
                })
            })
            .collect();
        LedgerInputs {
            commercial_operation,
            service_life_years,
            rates,
            timing,
            present_value_date: None,
            capital: Capital::Schedule(payments),
            operation: Operation {
                operating_hours,
                energy_mwh,
                fuel_energy_gj_lhv: energy_mwh * heat_rate_kj_per_kwh / 1000.0,
                net_output_kw,
                starts_per_year: 0.0,
            },
            fuel: Fuel {
                price: FuelPrice::Escalating { price_per_gj: cents(fuel_price), escalation: escalations[0] },
                basis: if hhv_priced { PriceBasis::Hhv } else { PriceBasis::Lhv },
                hhv_over_lhv: 1.108,
            },
            carbon: Carbon { co2_kg_per_gj_lhv: 56.1, price_per_tonne: cents(carbon_price), escalation: escalations[1] },
            fixed_om: EscalatingPrice { price: cents(om_prices.0), escalation: escalations[2] },
            variable_om: EscalatingPrice { price: cents(om_prices.1), escalation: escalations[3] },
            starts: Starts::default(),
            service: ServiceFees::default(),
            overhaul: overhaul_interval.map(|interval_hours| Overhaul {
                interval_hours,
                hours_per_start: 0.0,
                interval_starts: None,
                outage_days: 0.0,
                outage_capacity_kw: 0.0,
                cost: cents(overhaul_cost),
                escalation: escalations[4],
            }),
            degradation: Degradation { heat_rate_fraction_per_year: degradation.0, output_fraction_per_year: 0.0, recoverable_fraction: degradation.1 },
            residual: Residual { value: ResidualValue::FractionOfCapital(residual_fraction), escalation: 0.0 },
            bought_in: BoughtIn {
                energy_mwh_per_year: shortfall.0,
                energy_price: EscalatingPrice { price: cents(shortfall.1), escalation: bought_in_escalations[0] },
                capacity_kw: shortfall.2,
                capacity_price: EscalatingPrice { price: cents(shortfall.3), escalation: bought_in_escalations[1] },
            },
            acceptance_settlement: AcceptanceSettlement::default(),
        }
    }
}

/// A rival on the same analysis: other capital, heat rate and overhauls.
fn rival(candidate: &LedgerInputs, capital_scale: Decimal, fuel_scale: f64) -> LedgerInputs {
    let mut baseline = candidate.clone();
    let total = candidate.capital.total().expect("capital sums");
    baseline.capital = Capital::AtCommercialOperation(total * capital_scale);
    baseline.operation.fuel_energy_gj_lhv *= fuel_scale;
    baseline.residual.value = ResidualValue::Amount(Decimal::ZERO);
    baseline
}

fn relative_difference(a: f64, b: f64) -> f64 {
    (a - b).abs() / a.abs().max(b.abs()).max(1.0)
}

proptest! {
    #[test]
    fn self_comparison_saves_nothing(inputs in inputs()) {
        let summary = summarize_ledger(&inputs).unwrap();
        let savings = compare_summaries(&summary, &summary).unwrap();
        prop_assert_eq!(savings.net_savings, Decimal::ZERO);
        prop_assert_eq!(savings.premium_asked, Decimal::ZERO);
        prop_assert_eq!(savings.break_even_premium, Some(Decimal::ZERO));
    }

    #[test]
    fn break_even_premium_zeroes_net_savings(
        candidate in inputs(),
        capital_scale in 50i64..95,
        fuel_scale in 1.0f64..1.3,
    ) {
        let baseline = rival(&candidate, Decimal::new(capital_scale, 2), fuel_scale);
        let base = summarize_ledger(&baseline).unwrap();
        let savings = compare_summaries(&summarize_ledger(&candidate).unwrap(), &base).unwrap();
        let premium = savings.break_even_premium.expect("capital moves the lifecycle cost");
        let mut at_break_even = candidate.clone();
        at_break_even.capital = candidate.capital.with_total(base.capital_total + premium).unwrap();
        let gap = compare_summaries(&summarize_ledger(&at_break_even).unwrap(), &base).unwrap().net_savings;
        prop_assert!(gap.abs() <= Decimal::new(1, 2), "net savings at break-even premium {}", gap);
    }

    #[test]
    fn lifecycle_cost_rises_with_fuel_price_and_hours(inputs in inputs(), more in 1.001f64..1.2) {
        let lcc = summarize_ledger(&inputs).unwrap().lifecycle_cost;
        let mut dearer = inputs.clone();
        if let FuelPrice::Escalating { price_per_gj, .. } = &mut dearer.fuel.price {
            *price_per_gj += Decimal::new(1, 2);
        }
        prop_assert!(summarize_ledger(&dearer).unwrap().lifecycle_cost > lcc);
        // More hours bring hour-driven overhauls earlier; with escalation
        // above the discount rate an earlier overhaul can cost less, enough
        // to offset the extra fuel (a found case: 0 % discount, overhaul
        // every 8 000 h escalating 3.66 %/yr). The property holds for the
        // streams that scale with hours, so compare without overhauls.
        let mut base = inputs.clone();
        base.overhaul = None;
        let lcc = summarize_ledger(&base).unwrap().lifecycle_cost;
        let mut longer = base.clone();
        let op = &mut longer.operation;
        let scale = more.min(8784.0 / op.operating_hours);
        // min: the scaled hours may round one ulp above 8784.
        op.operating_hours = (op.operating_hours * scale).min(8784.0);
        op.energy_mwh *= scale;
        op.fuel_energy_gj_lhv *= scale;
        prop_assume!(scale > 1.0);
        prop_assert!(summarize_ledger(&longer).unwrap().lifecycle_cost > lcc);
    }

    #[test]
    fn real_and_nominal_give_the_same_lifecycle_cost(inputs in inputs()) {
        let mut real = inputs.clone();
        real.capital = Capital::AtCommercialOperation(inputs.capital.total().unwrap());
        let i = real.rates.inflation;
        let nominal_rate = |e: f64| (1.0 + e) * (1.0 + i) - 1.0;
        let mut nominal = real.clone();
        nominal.rates = real.rates.restated(RateBasis::Nominal);
        if let FuelPrice::Escalating { escalation, .. } = &mut nominal.fuel.price {
            *escalation = nominal_rate(*escalation);
        }
        nominal.carbon.escalation = nominal_rate(real.carbon.escalation);
        nominal.fixed_om.escalation = nominal_rate(real.fixed_om.escalation);
        nominal.variable_om.escalation = nominal_rate(real.variable_om.escalation);
        if let Some(overhaul) = &mut nominal.overhaul {
            overhaul.escalation = nominal_rate(overhaul.escalation);
        }
        nominal.residual.escalation = nominal_rate(real.residual.escalation);
        nominal.bought_in.energy_price.escalation = nominal_rate(real.bought_in.energy_price.escalation);
        nominal.bought_in.capacity_price.escalation = nominal_rate(real.bought_in.capacity_price.escalation);
        let real_lcc = summarize_ledger(&real).unwrap().lifecycle_cost.to_f64();
        let nominal_lcc = summarize_ledger(&nominal).unwrap().lifecycle_cost.to_f64();
        prop_assert!(relative_difference(real_lcc, nominal_lcc) < 1e-9, "real {} nominal {}", real_lcc, nominal_lcc);
    }

    #[test]
    fn decimal_and_f64_ledgers_agree(candidate in inputs(), fuel_scale in 1.0f64..1.3) {
        let baseline = rival(&candidate, Decimal::new(80, 2), fuel_scale);
        let decimal = build_ledger(&candidate).unwrap();
        let float = build_ledger(&candidate.to_f64()).unwrap();
        prop_assert_eq!(decimal.rows.len(), float.rows.len());
        let scale = decimal.summary.lifecycle_cost.to_f64().abs();
        for (d, f) in decimal.rows.iter().zip(&float.rows) {
            prop_assert!((d.total.to_f64() - f.total).abs() <= 1e-9 * d.total.to_f64().abs().max(1.0));
            prop_assert!((d.present_value.to_f64() - f.present_value).abs() <= 1e-9 * scale);
        }
        prop_assert!(relative_difference(decimal.summary.lifecycle_cost.to_f64(), float.summary.lifecycle_cost) < 1e-9);
        let decimal_savings = compare_summaries(&decimal.summary, &summarize_ledger(&baseline).unwrap()).unwrap();
        let float_savings = compare_summaries(&float.summary, &summarize_ledger(&baseline.to_f64()).unwrap()).unwrap();
        prop_assert!((decimal_savings.net_savings.to_f64() - float_savings.net_savings).abs() <= 1e-9 * scale);
    }
}
