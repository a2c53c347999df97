//! The verdicts read as a buyer would say them when a result is negative:
//! a bid cheaper to buy is called so, a bid that costs more to own even at
//! no premium is called so, and no "worth up to" a negative amount appears.
//! The model is the invented rendering fixture with its economics changed.

mod report_support;

use brayfin::report::model::{Model, VerdictKind};
use brayfin::report::pdf::context::with_candidate;
use brayfin::report::wording::Wording;
use rust_decimal::Decimal;

fn verdict(model: &Model, index: usize) -> String {
    let wording = Wording::builtin().expect("templates load");
    wording
        .render(
            "verdict.j2",
            &with_candidate(model, &model.candidates[index]),
        )
        .expect("verdict renders")
        .split_whitespace()
        .collect::<Vec<_>>()
        .join(" ")
        .replace('\u{a0}', " ")
}

fn with_economics(break_even: i64, asked: i64) -> Model {
    let mut model = report_support::model(false, false);
    let c = &mut model.candidates[1];
    let (be, ask) = (Decimal::from(break_even), Decimal::from(asked));
    c.economics.break_even_premium = Some(be);
    c.economics.premium_asked = Some(ask);
    c.economics.net_savings_vs_baseline = Some(be - ask);
    c.verdict.kind = if be >= ask {
        VerdictKind::WorthPremium
    } else {
        VerdictKind::NotWorthPremium
    };
    c.verdict.margin = be - ask;
    model
}

#[test]
fn a_bid_that_costs_more_even_at_no_premium_is_called_so() {
    let text = verdict(&with_economics(-1_453_686, 6_100_000), 1);
    assert!(
        text.contains("costs more to own than the baseline even at no premium"),
        "{text}"
    );
    assert!(!text.contains("worth up to"), "{text}");
    assert!(!text.contains("USD -"), "{text}");
}

#[test]
fn a_cheaper_bid_is_called_cheaper_to_buy() {
    // Cheaper to buy by 8 M and cheaper to own.
    let text = verdict(&with_economics(2_000_000, -8_000_000), 1);
    assert!(text.contains("cheaper to buy, by USD 8.00 M"), "{text}");
    assert!(text.contains("cheaper to own"), "{text}");
    assert!(!text.contains("USD -"), "{text}");
    // Cheaper to buy by 8 M but costing more to own: it would have to be
    // 10 M cheaper to break even.
    let text = verdict(&with_economics(-10_000_000, -8_000_000), 1);
    assert!(text.contains("but costs more to own"), "{text}");
    assert!(
        text.contains("USD 10.0 M cheaper than the baseline"),
        "{text}"
    );
    assert!(!text.contains("USD -"), "{text}");
}

#[test]
fn a_bid_that_covers_its_premium_states_its_headroom() {
    let text = verdict(&with_economics(9_600_000, 4_000_000), 1);
    assert!(text.contains("covers its premium"), "{text}");
    assert!(text.contains("USD 5.60 M of headroom"), "{text}");
}

/// The terminal table's verdict line and SIR cell, as `compare` prints
/// them, with the economics of `with_economics`.
fn table_text(model: &Model) -> String {
    use brayfin::report::Renderer;
    let bytes = brayfin::report::table::TableRenderer
        .render(model)
        .expect("table renders");
    String::from_utf8(bytes).expect("utf-8")
}

#[test]
fn the_table_words_negative_results_as_the_briefing_does() {
    // Costs more to own even at no premium: a negative savings-to-
    // investment ratio is worded, never printed as a number.
    let mut model = with_economics(-1_453_686, 6_100_000);
    model.candidates[1].economics.savings_to_investment_ratio = Some(-0.24);
    let text = table_text(&model);
    assert!(
        text.contains("costs more to own than the baseline even at no premium"),
        "{text}"
    );
    assert!(
        text.contains("none: costs more to own even at no premium"),
        "{text}"
    );
    assert!(!text.contains("-0.24"), "{text}");
    // Cheaper to buy, cheaper to own; and cheaper to buy, dearer to own.
    let text = table_text(&with_economics(2_000_000, -8_000_000));
    assert!(text.contains("cheaper to buy, by USD 8,000,000"), "{text}");
    assert!(!text.contains("asks USD -"), "{text}");
    let text = table_text(&with_economics(-10_000_000, -8_000_000));
    assert!(
        text.contains("to be USD 10,000,000 cheaper than the baseline, USD 2,000,000 more"),
        "{text}"
    );
    // A positive ratio is still a number.
    let mut model = with_economics(9_600_000, 4_000_000);
    model.candidates[1].economics.savings_to_investment_ratio = Some(2.4);
    assert!(table_text(&model).contains(" 2.40 "));
}
