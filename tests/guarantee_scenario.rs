//! `[candidate.guarantee]` end to end: the contract settled through
//! `compare` (the as-built figures the file states) and through `risk`
//! (each sample's draw), checked against amounts worked by hand from the
//! contract's terms.
//!
//! Hand arithmetic (the settlement rule of `finance::guarantee`, tolerance
//! read as test uncertainty: only the shortfall past the band counts):
//! premium of the demo, 50 000 kW, capital USD 50 200 000; heat rate 3 %
//! worse with a 1 % tolerance counts 2 %; output 2 % short counts 1 % =
//! 500 kW.

use brayfin::analysis::compare::{run_study, Study};
use brayfin::analysis::risk::{run_risk, RiskRun};
use brayfin::finance::RowKind;
use brayfin::scenario::{parse, LoadedScenario};
use rust_decimal::prelude::ToPrimitive;
use rust_decimal::Decimal;

const DEMO: &str = include_str!("fixtures/corvel-bay-blocks.toml");
const PREMIUM: usize = 1;

/// The demo with `table` as the premium bid's `[candidate.guarantee]` and
/// its `[[uncertainty]]` entries replaced by `entries` (kept when `None`).
fn demo_with(table: &str, entries: Option<&str>) -> LoadedScenario {
    let at = DEMO
        .find("[[candidate]]\nid = \"regenerated\"")
        .unwrap_or(DEMO.len());
    let mut text = format!(
        "{}[candidate.guarantee]\n{table}\n{}",
        &DEMO[..at],
        &DEMO[at..]
    );
    if let Some(entries) = entries {
        let cut = text.find("[[uncertainty]]").unwrap_or(text.len());
        text = format!("{}{entries}", &text[..cut]);
    }
    match parse(&text, "guarantee-demo.toml") {
        Ok(loaded) => loaded,
        Err(e) => panic!("the edited demo must load: {e}"),
    }
}

fn study(loaded: &LoadedScenario) -> Study {
    match run_study(loaded) {
        Ok(s) => s,
        Err(e) => panic!("compare must run: {e}"),
    }
}

/// The premium bid's settlement row (bonus − damages), if any, to the cent:
/// the shortfall percentages are computed in `f64` from the as-built
/// ratios (measured: 2.5e-9 off on 1 100 000), so the hand amounts are
/// compared as the report prints them.
fn settlement_row(study: &Study) -> Option<Decimal> {
    let rows: Vec<Decimal> = study.outcomes[PREMIUM]
        .ledger
        .rows
        .iter()
        .filter(|r| r.kind == RowKind::Settlement)
        .map(|r| r.total)
        .collect();
    assert!(rows.len() <= 1, "at most one settlement row");
    rows.first().map(|d| d.round_dp(2))
}

const CLAUSE: &str = "tolerance = \"1 %\"\n\
    damages_per_heat_rate_percent = \"250000 USD\"\n\
    damages_per_kw = \"1200 USD\"\n\
    damages_cap = \"10 %\"\n";

#[test]
fn a_machine_exactly_at_its_guarantee_settles_nothing_and_changes_nothing() {
    // Default as-built figures are 100 %: compare is the deterministic
    // case, no damages, no row, every figure as without the clause.
    let plain = study(&demo_with("", None));
    let clause = study(&demo_with(CLAUSE, None));
    assert_eq!(settlement_row(&clause), None);
    for (a, b) in plain.outcomes.iter().zip(&clause.outcomes) {
        assert_eq!(
            a.ledger.summary.lifecycle_cost,
            b.ledger.summary.lifecycle_cost
        );
        assert_eq!(a.ledger.rows.len(), b.ledger.rows.len());
        let savings = |o: &brayfin::analysis::compare::CandidateOutcome| {
            o.versus_baseline.as_ref().map(|v| v.savings.net_savings)
        };
        assert_eq!(savings(a), savings(b));
    }
}

#[test]
fn stated_as_built_figures_settle_the_hand_worked_damages() {
    // 2 % × 250 000 + 500 kW × 1 200 = 500 000 + 600 000 = 1 100 000,
    // below the cap (10 % of 50 200 000 = 5 020 000): the vendor pays, so
    // the row is −1 100 000.
    let table = format!("{CLAUSE}as_built_heat_rate = \"103 %\"\nas_built_output = \"98 %\"\n");
    let s = study(&demo_with(&table, None));
    assert_eq!(settlement_row(&s), Some(Decimal::from(-1_100_000)));
    // The whole shortfall once past the band: 3 % × 250 000 + 1 000 kW ×
    // 1 200 = 750 000 + 1 200 000 = 1 950 000.
    let whole = format!("{table}tolerance_rule = \"whole-shortfall\"\n");
    let s = study(&demo_with(&whole, None));
    assert_eq!(settlement_row(&s), Some(Decimal::from(-1_950_000)));
    // A cap of 1 % of the contract price (the capital cost, 50 200 000)
    // binds at 502 000.
    let capped = table.replace("damages_cap = \"10 %\"", "damages_cap = \"1 %\"");
    let s = study(&demo_with(&capped, None));
    assert_eq!(settlement_row(&s), Some(Decimal::from(-502_000)));
    // ... or of a stated contract price of 40 000 000: 400 000.
    let priced = format!("{capped}contract_price = \"40000000 USD\"\n");
    let s = study(&demo_with(&priced, None));
    assert_eq!(settlement_row(&s), Some(Decimal::from(-400_000)));
}

#[test]
fn damages_per_kj_per_kwh_count_the_shortfall_in_kj_per_kwh() {
    // Guaranteed 10 000 kJ/kWh, as built 103 %: 10 300 kJ/kWh; the 1 %
    // band ends at 10 100, so 200 kJ/kWh count × 2 000 = 400 000.
    let table = "heat_rate = \"10000 kJ/kWh\"\ntolerance = \"1 %\"\n\
                 damages_per_heat_rate_kj_per_kwh = \"2000 USD\"\n\
                 as_built_heat_rate = \"103 %\"\n";
    let s = study(&demo_with(table, None));
    assert_eq!(settlement_row(&s), Some(Decimal::from(-400_000)));
}

#[test]
fn the_machine_as_built_burns_more_fuel() {
    // Heat rate 3 % worse as built: the same energy at 1.03 times the fuel
    // (the year's fuel energy is energy × heat rate; operation is linear).
    let plain = study(&demo_with(CLAUSE, None));
    let table = format!("{CLAUSE}as_built_heat_rate = \"103 %\"\n");
    let worse = study(&demo_with(&table, None));
    let fuel = |s: &Study| s.outcomes[PREMIUM].inputs.operation.fuel_energy_gj_lhv;
    let ratio = fuel(&worse) / fuel(&plain);
    assert!((ratio - 1.03).abs() < 1e-12, "{ratio}");
}

fn run(loaded: &LoadedScenario, samples: usize) -> RiskRun {
    match run_risk(loaded, samples, 11, &mut |_, _| {}) {
        Ok(r) => r,
        Err(e) => panic!("risk must run: {e}"),
    }
}

/// The demo's distributions, each collapsed to the file's value.
const COLLAPSED: &str = r#"
[[uncertainty]]
key = "fuel.price"
distribution = "lognormal"
median = "3.85 USD/MMBtu"
sigma = 0

[[uncertainty]]
key = "candidate[premium].turbine_efficiency"
distribution = "normal"
mean = "91.5 %"
sigma = 0
"#;

#[test]
fn collapsed_risk_equals_compare_with_and_without_a_damages_clause() {
    // Equal within a millionth of a currency unit: the decimal ledger
    // against the f64 one (see tests/risk_run.rs for the measured gap).
    let as_built = "\n[[uncertainty]]\nkey = \"candidate[premium].guarantee.as_built_heat_rate\"\n\
                    distribution = \"uniform\"\nlow = \"103 %\"\nhigh = \"103 %\"\n";
    for (table, entries) in [
        ("", COLLAPSED.to_string()),
        (CLAUSE, COLLAPSED.to_string()),
        (
            "tolerance = \"1 %\"\ndamages_per_heat_rate_percent = \"250000 USD\"\n\
             as_built_heat_rate = \"103 %\"\n",
            format!("{COLLAPSED}{as_built}"),
        ),
    ] {
        let loaded = demo_with(table, Some(&entries));
        let s = study(&loaded);
        let r = run(&loaded, 16);
        let Some(versus) = s.outcomes[PREMIUM].versus_baseline.as_ref() else {
            panic!("premium must be set against the baseline");
        };
        let expected = versus.savings.net_savings.to_f64().unwrap_or(f64::NAN);
        let c = &r.candidates[0];
        assert_eq!(c.candidate_id, "premium");
        for value in [c.net_savings.mean, c.net_savings.p10, c.net_savings.p90] {
            assert!((value - expected).abs() <= 1e-6, "{value} vs {expected}");
        }
        let row = settlement_row(&s).and_then(|d| d.to_f64()).unwrap_or(0.0);
        match &c.contract {
            Some(k) => {
                assert!(
                    (k.damages.mean + row).abs() <= 1e-6,
                    "{:?} {row}",
                    k.damages
                );
                let short = if row < 0.0 { 1.0 } else { 0.0 };
                assert_eq!(k.probability_shortfall, short);
            }
            None => assert!(table.is_empty()),
        }
    }
}

#[test]
fn expected_damages_of_a_uniform_shortfall_match_the_hand_integral() {
    // As-built heat rate uniform on [99 %, 104 %], tolerance 1 %, 250 000
    // per counted %, no cap, no output damages. Counted c = max(0, x − 101)
    // %: P(c > 0) = 3/5 = 0.6; E[damages] = 250 000 · (1/5)∫₀³ t dt =
    // 250 000 · 0.9 = 225 000; E[c²] = (1/5)∫₀³ t² dt = 1.8, so the
    // standard deviation of damages is 250 000 · √(1.8 − 0.81) ≈ 248 747.
    // With n = 4 000 samples the standard errors are 248 747/√n ≈ 3 933 and
    // √(0.6 · 0.4/n) ≈ 0.0077; the checks allow 4 of them.
    let table = "tolerance = \"1 %\"\ndamages_per_heat_rate_percent = \"250000 USD\"\n";
    let entries = "[[uncertainty]]\nkey = \"candidate[premium].guarantee.as_built_heat_rate\"\n\
                   distribution = \"uniform\"\nlow = \"99 %\"\nhigh = \"104 %\"\n";
    let n = 4000;
    let r = run(&demo_with(table, Some(entries)), n);
    let Some(k) = r.candidates[0].contract else {
        panic!("premium has a guarantee");
    };
    let se_damages = 250_000.0 * (1.8f64 - 0.81).sqrt() / (n as f64).sqrt();
    assert!(
        (k.damages.mean - 225_000.0).abs() <= 4.0 * se_damages,
        "{} vs 225 000 ± {}",
        k.damages.mean,
        4.0 * se_damages
    );
    let se_p = (0.6f64 * 0.4 / n as f64).sqrt();
    assert!(
        (k.probability_shortfall - 0.6).abs() <= 4.0 * se_p,
        "{}",
        k.probability_shortfall
    );
    // The median sample lies past the band: x₅₀ = 101.5 %, 0.5 % counted.
    assert!(
        (k.damages.p50 - 125_000.0).abs() <= 12_500.0,
        "{}",
        k.damages.p50
    );
    assert!(r.candidates[1].contract.is_none());
}
