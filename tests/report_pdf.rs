//! The PDF briefing read back with a PDF library: pages, headings, key
//! figures as printed, traceability, paper sizes, templates, and chart
//! geometry. The model is an invented rendering fixture (see
//! `report_support`), so these tests check formatting and layout only.
//!
//! Set `BRAYFIN_FIXTURE_PDF=<path>` to keep the rendered fixture for a look.

mod report_support;

use brayfin::report::charts::geometry::{Anchor, Mark, Weight};
use brayfin::report::format;
use brayfin::report::model::Model;
use brayfin::report::pdf::context::short_money;
use brayfin::report::pdf::document::Page;
use brayfin::report::pdf::fonts::{text_width_mm, Face};
use brayfin::report::pdf::{Paper, PdfRenderer};
use brayfin::report::wording::Wording;
use brayfin::report::Renderer;
use lopdf::Document;
use rust_decimal::Decimal;
use std::str::FromStr;

fn renderer(paper: Paper) -> PdfRenderer {
    PdfRenderer {
        paper,
        wording: Wording::builtin().expect("built-in templates load"),
    }
}

fn render(model: &Model, paper: Paper) -> (Vec<u8>, Document) {
    let bytes = renderer(paper).render(model).expect("renders");
    if let Ok(path) = std::env::var("BRAYFIN_FIXTURE_PDF") {
        std::fs::write(path, &bytes).expect("fixture written");
    }
    let doc = Document::load_mem(&bytes).expect("the output is a PDF lopdf can read");
    (bytes, doc)
}

fn page_text(doc: &Document, page: u32) -> String {
    doc.extract_text(&[page]).expect("text extracts")
}

/// Every string drawn with Tj on any page, as raw (WinAnsi) bytes.
fn raw_strings(doc: &Document) -> Vec<Vec<u8>> {
    let mut out = Vec::new();
    for id in doc.get_pages().values() {
        let content = doc.get_page_content(*id).expect("page content");
        let ops = lopdf::content::Content::decode(&content).expect("content decodes");
        for op in ops.operations.iter().filter(|o| o.operator == "Tj") {
            for operand in &op.operands {
                if let lopdf::Object::String(bytes, _) = operand {
                    out.push(bytes.clone());
                }
            }
        }
    }
    out
}

fn all_text(doc: &Document) -> String {
    let pages: Vec<u32> = doc.get_pages().keys().copied().collect();
    doc.extract_text(&pages).expect("text extracts")
}

#[test]
fn page_count_matches_the_layout_and_every_page_is_numbered() {
    let model = report_support::model(true, true);
    let pages = renderer(Paper::A4).layout(&model).expect("lays out");
    let (_, doc) = render(&model, Paper::A4);
    let count = doc.get_pages().len();
    assert_eq!(count, pages.len());
    assert!(
        count >= 8,
        "briefing, charts, performance, ledger…: {count} pages"
    );
    for n in 1..=count as u32 {
        let text = page_text(&doc, n);
        assert!(
            text.contains(&format!("page {n} of {count}")),
            "page {n}: {text}"
        );
        assert!(text.contains(&model.meta.title), "page {n} lacks the title");
    }
}

#[test]
fn every_section_heading_is_present() {
    let model = report_support::model(true, true);
    let (_, doc) = render(&model, Paper::A4);
    let text = all_text(&doc);
    for heading in [
        "Gas-turbine purchase briefing",
        "Recommendation",
        "Key figures",
        "The three inputs that move the recommended bid most",
        "Charts",
        "Cumulative discounted savings against the baseline",
        "Break-even premium against fuel price",
        "Lifecycle cost by stream (present value)",
        "Temperature-entropy diagram",
        "Sensitivity of net savings",
        "Risk: Monte Carlo simulation",
        "Performance at site conditions",
        "Assumptions",
        "Year-by-year ledger",
        "Method",
        "References",
        "Cautions",
        "Traceability",
    ] {
        assert!(text.contains(heading), "missing heading {heading:?}");
    }
}

/// Parse money as the briefing page prints it ("USD 12.5 M", "USD -950",
/// "USD 4.20 k") back to a number.
fn parse_money(printed: &str, currency: &str) -> Decimal {
    let rest = printed.trim_start_matches(currency).trim();
    let (digits, factor) = match rest.rsplit_once(' ') {
        Some((d, "k")) => (d, Decimal::from(1_000)),
        Some((d, "M")) => (d, Decimal::from(1_000_000)),
        Some((d, "bn")) => (d, Decimal::from(1_000_000_000)),
        _ => (rest, Decimal::ONE),
    };
    Decimal::from_str(digits).expect("printed money parses") * factor
}

#[test]
fn every_key_figure_on_the_briefing_page_is_the_model_figure_as_printed() {
    let model = report_support::model(true, false);
    let (_, doc) = render(&model, Paper::A4);
    let first = page_text(&doc, 1);
    let lines: Vec<&str> = first.lines().map(str::trim).collect();
    let currency = &model.meta.currency;
    let mut checked = 0;
    for c in &model.candidates {
        let e = &c.economics;
        let money_figures = [
            Some(e.capital_cost),
            Some(e.lifecycle_cost),
            e.net_savings_vs_baseline,
            e.break_even_premium,
            e.premium_asked,
        ];
        for value in money_figures.into_iter().flatten() {
            let printed = short_money(value, currency).replace('\u{a0}', " ");
            assert!(lines.contains(&printed.as_str()), "{printed} not on page 1");
            // Printed to three significant figures: within half a unit of
            // the third figure, i.e. 0.5 % of the model figure (and exact
            // below 1000).
            let tolerance = (value.abs() * Decimal::new(5, 3)).max(Decimal::new(5, 1));
            assert!((parse_money(&printed, currency) - value).abs() <= tolerance);
            checked += 1;
        }
        let heat_rate = format::heat_rate(
            c.performance.heat_rate_kj_per_kwh,
            c.performance.heat_rate_btu_per_kwh,
            model.meta.units,
        );
        assert!(
            lines.contains(&heat_rate.as_str()),
            "{heat_rate} not on page 1"
        );
        let payback = format::payback(e.discounted_payback);
        assert!(lines.contains(&payback.as_str()), "{payback} not on page 1");
        checked += 2;
    }
    // Baseline: capital and lifecycle cost; bids: five money figures each;
    // every candidate: heat rate and payback.
    assert_eq!(checked, 2 + 5 + 5 + 3 * 2);
    for k in model.key_assumptions.iter().take(3) {
        let printed = short_money(k.swing, currency).replace('\u{a0}', " ");
        assert!(first.contains(&printed), "{printed} not on page 1");
    }
    let fourth = &model.key_assumptions[3];
    assert!(!first.contains(&fourth.label), "only three key assumptions");
}

#[test]
fn the_last_page_traces_the_scenario_version_and_time() {
    let model = report_support::model(false, false);
    let (_, doc) = render(&model, Paper::Letter);
    let last = doc.get_pages().len() as u32;
    let text = page_text(&doc, last);
    assert!(text.contains(&model.meta.scenario_sha256), "{text}");
    assert!(text.contains(&model.meta.brayfin_version));
    assert!(text.contains(&model.meta.generated_at));
}

#[test]
fn without_sensitivity_or_risk_those_sections_are_left_out_and_said_so() {
    let model = report_support::model(false, false);
    let (_, doc) = render(&model, Paper::A4);
    let text = all_text(&doc);
    assert!(!text.contains("Sensitivity of net savings"));
    assert!(!text.contains("Risk: Monte Carlo simulation"));
    assert!(text.contains("No sensitivity ranking was made"));
}

fn media_box(doc: &Document, page: u32) -> Vec<f32> {
    let id = doc.get_pages()[&page];
    let dict = doc.get_dictionary(id).expect("page dictionary");
    dict.get(b"MediaBox")
        .and_then(|o| o.as_array().cloned())
        .expect("MediaBox")
        .iter()
        .map(|o| {
            o.as_float()
                .or_else(|_| o.as_i64().map(|i| i as f32))
                .unwrap_or(-1.0)
        })
        .collect()
}

#[test]
fn paper_sizes_are_a4_and_us_letter_with_a_landscape_ledger() {
    // ISO 216 A4 = 210 × 297 mm = 595.28 × 841.89 pt; US Letter =
    // 8.5 × 11 in = 612 × 792 pt (1 in = 72 pt).
    let model = report_support::model(false, false);
    for (paper, w, h) in [(Paper::A4, 595.28, 841.89), (Paper::Letter, 612.0, 792.0)] {
        let (_, doc) = render(&model, paper);
        let first = media_box(&doc, 1);
        assert!(
            (first[2] - w).abs() < 0.5 && (first[3] - h).abs() < 0.5,
            "{first:?}"
        );
        let landscape = doc
            .get_pages()
            .keys()
            .filter(|n| {
                let b = media_box(&doc, **n);
                (b[2] - h).abs() < 0.5 && (b[3] - w).abs() < 0.5
            })
            .count();
        assert!(
            landscape >= model.candidates.len(),
            "one ledger page per candidate"
        );
    }
}

/// Left and right extent of a label, mm.
fn extent(mark: &Mark) -> Option<(f32, f32, f32, bool)> {
    match mark {
        Mark::Label {
            at,
            text,
            size_pt,
            anchor,
            weight,
            vertical,
            ..
        } => {
            let face = match weight {
                Weight::Regular => Face::Regular,
                Weight::Bold => Face::Bold,
                Weight::Mono => Face::Mono,
            };
            let width = text_width_mm(text, face, *size_pt);
            let shift = match anchor {
                Anchor::Left => 0.0,
                Anchor::Centre => width / 2.0,
                Anchor::Right => width,
            };
            let along = if *vertical { at.y_mm } else { at.x_mm };
            Some((along - shift, along - shift + width, *size_pt, *vertical))
        }
        _ => None,
    }
}

fn assert_no_text_leaves_the_page(pages: &[Page]) {
    for (n, page) in pages.iter().enumerate() {
        let margin = 5.0;
        for mark in &page.marks {
            if let Some((from, to, _, vertical)) = extent(mark) {
                let limit = if vertical {
                    page.height_mm
                } else {
                    page.width_mm
                };
                assert!(
                    from >= margin && to <= limit - margin,
                    "page {}: {mark:?} runs off the page",
                    n + 1
                );
            }
        }
    }
}

#[test]
fn no_text_runs_off_any_page_on_either_paper() {
    let model = report_support::model(true, true);
    for paper in [Paper::A4, Paper::Letter] {
        let pages = renderer(paper).layout(&model).expect("lays out");
        assert_no_text_leaves_the_page(&pages);
    }
}

#[test]
fn long_labels_are_wrapped_not_dropped() {
    let model = report_support::model(false, false);
    let (_, doc) = render(&model, Paper::A4);
    let first = page_text(&doc, 1);
    // The long label is wrapped over lines of its column; its first and
    // last words are both on the page.
    assert!(first.contains("Bid C:"));
    assert!(first.contains("deliberately") || first.contains('…'));
}

#[test]
fn us_units_print_btu_per_kwh_and_degrees_fahrenheit() {
    let mut model = report_support::model(false, false);
    model.meta.units = brayfin::report::model::Units::Us;
    let (_, doc) = render(&model, Paper::Letter);
    let text = all_text(&doc);
    let bid = &model.candidates[1].performance;
    // 9,900 kJ/kWh / 1.055056 kJ/Btu = 9,383 Btu/kWh (NIST SP 811 Btu_IT).
    assert!(bid.heat_rate_btu_per_kwh.round() == 9383.0);
    assert!(text.contains("9,383 Btu/kWh"), "heat rate in Btu/kWh");
    // 780 K = 944.3 °F (°F = K × 9/5 − 459.67); the degree sign survives.
    // The text extractor of the PDF library drops some WinAnsi characters,
    // so the degree sign (WinAnsi 0xB0) and middle dot (0xB7) are checked
    // in the raw strings the page draws.
    let strings = raw_strings(&doc);
    assert!(
        strings.contains(&b"944.3 \xB0F".to_vec()),
        "exhaust temperature in °F"
    );
    assert!(
        strings.iter().any(|s| s.ends_with(b"Btu/(lb\xB7\xB0R)")),
        "T-s entropy axis in US units"
    );
    // The state table and the specific works follow the same units: no
    // kJ/kg anywhere. The fixture's compressor inlet has h = 1.005 × 288.15
    // = 289.6 kJ/kg = 124.5 Btu/lb (1 Btu/lb = 2.326 kJ/kg exactly, NIST
    // SP 811 Appendix B.8).
    assert!(!text.contains("kJ/kg"), "SI specific energy in a US report");
    assert!(!text.contains("kJ/(kg"), "SI entropy in a US report");
    assert!(
        text.contains("124.5"),
        "compressor inlet enthalpy in Btu/lb"
    );
    assert!(
        // The header may wrap after "Entropy,".
        strings
            .iter()
            .any(|s| s == b"Entropy, Btu/(lb\xB7\xB0R)" || s == b"Btu/(lb\xB7\xB0R)"),
        "state table entropy header in US units"
    );
}

#[test]
fn many_candidates_and_very_long_texts_stay_on_the_page() {
    let mut model = report_support::model(true, true);
    model.meta.title =
        "A very long scenario title that goes on and on to test wrapping, ".repeat(4);
    model.meta.prepared_for = "An organisation with an exceptionally long name ".repeat(5);
    let template = model.candidates[2].clone();
    for i in 0..5 {
        let mut extra = template.clone();
        extra.id = format!("extra{i}");
        extra.label = format!("Extra bid {i}: {}", "long-winded-description-".repeat(4));
        model.candidates.push(extra);
    }
    for paper in [Paper::A4, Paper::Letter] {
        let pages = renderer(paper).layout(&model).expect("lays out");
        assert_no_text_leaves_the_page(&pages);
        let (_, doc) = render(&model, paper);
        assert_eq!(doc.get_pages().len(), pages.len());
    }
}

/// The ledger's bought-in column and the method's levelling paragraph
/// appear only when some candidate is charged for an output shortfall, and
/// the landscape ledger with the extra column stays inside the page.
#[test]
fn output_bought_in_shows_only_when_charged() {
    let (_, plain) = render(&report_support::model(false, false), Paper::A4);
    let text = all_text(&plain);
    assert!(!text.contains("Bought in"), "no bought-in column");
    assert!(!text.contains("levelled on output"));

    let model = report_support::levelled(false, false);
    let (bytes, doc) = render(&model, Paper::A4);
    if let Ok(path) = std::env::var("BRAYFIN_LEVELLED_PDF") {
        std::fs::write(path, &bytes).expect("levelled fixture written");
    }
    let text = all_text(&doc);
    assert!(text.contains("Bought in"), "bought-in column header");
    assert!(text.contains("levelled on output"), "method paragraph");
    assert!(text.contains("95.00 per MWh"), "energy value as printed");
    // The bought-in figure as printed in the baseline's ledger.
    assert!(text.contains("900,000"));
}
