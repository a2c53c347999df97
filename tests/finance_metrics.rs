//! Metrics of a candidate against a baseline, each against an outside
//! definition or a hand-checked case.

mod finance_support;

use brayfin::finance::factors::uniform_present_value;
use brayfin::finance::{
    bid_factors, build_ledger, compare_ledgers, compare_summaries, summarize_ledger, CapacityValue,
    Capital, FinanceError, FuelPrice, LedgerInputs, Money, Payback, RowKind,
};
use finance_support::{busy_baseline, busy_inputs, dec, empty_inputs};
use rust_decimal::Decimal;

/// A pair over `years` at discount rate `d`: the baseline pays `base_cost`
/// a year; the candidate invests `investment` at commercial operation and
/// pays `base_cost − saving` a year (yearly amounts through a price on
/// 1 GJ a year).
fn pair(
    years: u32,
    d: f64,
    investment: &str,
    base_cost: &str,
    saving: &str,
) -> (LedgerInputs, LedgerInputs) {
    let yearly = |amount: Decimal| {
        let mut inputs = empty_inputs(years, d);
        inputs.operation.fuel_energy_gj_lhv = 1.0;
        inputs.fuel.price = FuelPrice::Escalating {
            price_per_gj: amount,
            escalation: 0.0,
        };
        inputs
    };
    let baseline = yearly(dec(base_cost));
    let mut candidate = yearly(dec(base_cost) - dec(saving));
    candidate.capital = Capital::AtCommercialOperation(dec(investment));
    (candidate, baseline)
}

/// ASTM E1057 (from memory): AIRR is the rate at which the investment grows
/// to the terminal value of the savings reinvested at the discount rate,
/// AIRR = (TV / I)^(1/n) − 1 with TV = Σ S_t (1 + r)^(n − t). brayfin uses
/// the equivalent closed form (1 + r)·SIR^(1/n) − 1; here the terminal value
/// is compounded row by row from the ledger's undiscounted savings.
#[test]
fn airr_matches_terminal_value_definition() {
    for (years, d, investment, saving) in [
        (10, 0.05, "5000.00", "900.00"),
        (25, 0.03, "120000.00", "7300.00"),
        (40, 0.08, "1.00", "0.05"),
    ] {
        let (candidate, baseline) = pair(years, d, investment, "10000.00", saving);
        let candidate = build_ledger(&candidate).expect("candidate");
        let baseline = build_ledger(&baseline).expect("baseline");
        let comparison = compare_ledgers(&candidate, &baseline).expect("comparable");
        let terminal_value: f64 = candidate
            .rows
            .iter()
            .zip(&baseline.rows)
            .filter(|(c, _)| c.kind == RowKind::Operation)
            .map(|(c, b)| {
                (b.total - c.total).to_f64() * (1.0 + d).powf(f64::from(years) - c.cash_time_years)
            })
            .sum();
        let investment = dec(investment).to_f64();
        let expected = (terminal_value / investment).powf(1.0 / f64::from(years)) - 1.0;
        let airr = comparison.savings.adjusted_irr.expect("positive SIR");
        assert!(
            (airr - expected).abs() < 1e-12,
            "n={years}: AIRR {airr} vs {expected}"
        );
        // SIR (ASTM E964) for level savings: S · UPV(d, n) / I.
        let sir = comparison
            .savings
            .savings_to_investment
            .expect("investment added")
            .to_f64();
        let expected_sir = dec(saving).to_f64() * uniform_present_value(d, years) / investment;
        assert!(
            (sir - expected_sir).abs() < 1e-12 * expected_sir,
            "SIR {sir} vs {expected_sir}"
        );
    }
}

/// ASTM E1121 payback on a hand-checked case: 1 000 invested, 300 saved a
/// year, 10 % discount rate, 10-year life.
/// Simple: 3 years recover 900; the remaining 100 of year 4's 300 takes
/// 1/3 year → 3.3333 years.
/// Discounted: four years recover 300 · UPV(10 %, 4) = 300 · 3.169865 =
/// 950.9596; year 5 brings 300 / 1.1^5 = 186.2764; the remaining 49.0404
/// takes 0.263266 of it → 4.263266 years.
#[test]
fn payback_hand_checked_case() {
    let (candidate, baseline) = pair(10, 0.10, "1000.00", "1000.00", "300.00");
    let comparison = compare_ledgers(
        &build_ledger(&candidate).unwrap(),
        &build_ledger(&baseline).unwrap(),
    )
    .unwrap();
    let Payback::Years(simple) = comparison.simple_payback else {
        panic!("simple payback within life")
    };
    let Payback::Years(discounted) = comparison.discounted_payback else {
        panic!("discounted payback within life")
    };
    assert!((simple - (3.0 + 1.0 / 3.0)).abs() < 1e-9, "simple {simple}");
    assert!(
        (discounted - 4.263266).abs() < 1e-6,
        "discounted {discounted}"
    );
}

/// Savings too small to recover the investment: never within life; no
/// added investment: payback at once (zero years).
#[test]
fn payback_edges() {
    let (candidate, baseline) = pair(10, 0.10, "1000.00", "1000.00", "50.00");
    let comparison = compare_ledgers(
        &build_ledger(&candidate).unwrap(),
        &build_ledger(&baseline).unwrap(),
    )
    .unwrap();
    assert_eq!(comparison.simple_payback, Payback::NeverWithinLife);
    assert_eq!(comparison.discounted_payback, Payback::NeverWithinLife);
    let (candidate, baseline) = pair(10, 0.10, "0.00", "1000.00", "50.00");
    let comparison = compare_ledgers(
        &build_ledger(&candidate).unwrap(),
        &build_ledger(&baseline).unwrap(),
    )
    .unwrap();
    assert_eq!(comparison.simple_payback, Payback::Years(0.0));
    assert_eq!(
        comparison.savings.savings_to_investment, None,
        "no added investment: SIR undefined"
    );
    assert_eq!(comparison.savings.adjusted_irr, None);
}

/// Break-even premium: giving the candidate the baseline's capital plus the
/// premium (schedule scaled, residual a fraction of capital) makes net
/// savings zero to within a cent. Break-even fuel price: scaling both fuel
/// prices by the multiplier makes the lifecycle costs equal within a cent.
#[test]
fn break_even_premium_and_fuel_price_close_the_gap() {
    let candidate = busy_inputs();
    let baseline = busy_baseline();
    let base = summarize_ledger(&baseline).unwrap();
    let savings = compare_summaries(&summarize_ledger(&candidate).unwrap(), &base).unwrap();
    assert_eq!(savings.premium_asked, dec("7500000.00"));
    let premium = savings.break_even_premium.expect("capital moves LCC");
    let mut at_break_even = candidate.clone();
    at_break_even.capital = candidate
        .capital
        .with_total(base.capital_total + premium)
        .unwrap();
    let gap = compare_summaries(&summarize_ledger(&at_break_even).unwrap(), &base)
        .unwrap()
        .net_savings;
    assert!(
        gap.abs() <= dec("0.01"),
        "net savings at break-even premium: {gap}"
    );

    let multiplier = savings.break_even_fuel_price.expect("fuel bills differ");
    let mut cand = candidate.clone();
    let mut base_inputs = baseline.clone();
    cand.fuel.price = multiplier.apply(&candidate.fuel.price).unwrap();
    base_inputs.fuel.price = multiplier.apply(&baseline.fuel.price).unwrap();
    let gap = summarize_ledger(&base_inputs).unwrap().lifecycle_cost
        - summarize_ledger(&cand).unwrap().lifecycle_cost;
    assert!(
        gap.abs() <= dec("0.01"),
        "LCC gap at break-even fuel price: {gap}"
    );
}

/// Net savings (ASTM E1074) equal operating savings less added investment.
#[test]
fn net_savings_split_into_operating_and_investment() {
    let savings = compare_summaries(
        &summarize_ledger(&busy_inputs()).unwrap(),
        &summarize_ledger(&busy_baseline()).unwrap(),
    )
    .unwrap();
    let split = savings.operating_savings - savings.added_investment;
    assert!(
        (split - savings.net_savings).abs() < dec("0.001"),
        "{split} vs {}",
        savings.net_savings
    );
}

/// Levelized cost, hand-checked: 1 000 000 at commercial operation,
/// 10 000 MWh a year for 10 years at 5 %: 1e6 / (10 000 · UPV(5 %, 10))
/// = 1e6 / 77 217.35 = 12.9505 per MWh.
#[test]
fn levelized_cost_hand_checked() {
    let mut inputs = empty_inputs(10, 0.05);
    inputs.capital = Capital::AtCommercialOperation(dec("1000000.00"));
    inputs.operation.energy_mwh = 10_000.0;
    let lcoe = summarize_ledger(&inputs)
        .unwrap()
        .levelized_cost_per_mwh()
        .unwrap()
        .to_f64();
    let expected = 1e6 / (10_000.0 * uniform_present_value(0.05, 10));
    assert!((lcoe - expected).abs() < 1e-9, "LCOE {lcoe} vs {expected}");
    assert!((lcoe - 12.9505).abs() < 1e-4);
}

/// Bid factors from reruns of the ledger against their analytic values:
/// fuel and carbon costs are proportional to fuel energy, so 1 kJ/kWh is
/// worth (PV fuel + PV carbon) / heat rate; one kW costs fixed O&M × UPV
/// and is worth the capacity value × UPV (constant prices, 1 January start).
#[test]
fn bid_factors_match_analytic_values() {
    let mut inputs = busy_inputs();
    inputs.commercial_operation = finance_support::date(2027, 1, 1);
    inputs.capital = Capital::AtCommercialOperation(dec("38500000.00"));
    inputs.fixed_om.escalation = 0.0;
    let summary = summarize_ledger(&inputs).unwrap();
    let capacity = CapacityValue {
        per_kw_year: dec("45.00"),
        escalation: 0.0,
    };
    let factors = bid_factors(&inputs, &capacity).unwrap();
    let heat_rate = inputs.operation.fuel_energy_gj_lhv * 1000.0 / inputs.operation.energy_mwh;
    let fuel_and_carbon =
        (summary.present_value.fuel_cost + summary.present_value.carbon_cost).to_f64();
    let per_kj = factors.pv_per_kj_per_kwh.unwrap().to_f64();
    assert!(
        (per_kj - fuel_and_carbon / heat_rate).abs() < 1e-9 * per_kj,
        "{per_kj}"
    );
    let upv = uniform_present_value(0.07, 30);
    assert!((factors.pv_fixed_om_per_kw.to_f64() - 18.5 * upv).abs() < 1e-6);
    assert!((factors.pv_capacity_value_per_kw.to_f64() - 45.0 * upv).abs() < 1e-6);
    assert!((factors.pv_per_kw_net_output.to_f64() - 26.5 * upv).abs() < 1e-6);
}

/// A candidate against itself: nothing saved, nothing asked, and the
/// break-even premium is zero.
#[test]
fn self_comparison_is_neutral() {
    let summary = summarize_ledger(&busy_inputs()).unwrap();
    let savings = compare_summaries(&summary, &summary).unwrap();
    assert_eq!(savings.net_savings, Decimal::ZERO);
    assert_eq!(savings.premium_asked, Decimal::ZERO);
    assert_eq!(savings.break_even_premium, Some(Decimal::ZERO));
    assert_eq!(savings.savings_to_investment, None);
    assert_eq!(savings.break_even_fuel_price, None);
}

/// Ledgers on different rates cannot be compared.
#[test]
fn different_analyses_are_not_compared() {
    let mut other = busy_baseline();
    other.rates.discount_rate = 0.05;
    let error = compare_summaries(
        &summarize_ledger(&busy_inputs()).unwrap(),
        &summarize_ledger(&other).unwrap(),
    )
    .unwrap_err();
    assert!(matches!(error, FinanceError::Incomparable { .. }));
    assert!(error.to_string().contains("discount rate"), "{error}");
}
