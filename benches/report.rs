//! Speed of the PDF briefing: laying out and writing the invented
//! three-candidate rendering fixture (25-year ledgers, sensitivity and
//! risk sections). The whole `report` command has a 1 s wall-time budget
//! (release build); rendering is the part this crate's code controls.

use brayfin::report::pdf::{Paper, PdfRenderer};
use brayfin::report::wording::Wording;
use brayfin::report::Renderer;
use criterion::{black_box, criterion_group, criterion_main, Criterion};

#[path = "../tests/report_support/mod.rs"]
mod report_support;

fn bench(c: &mut Criterion) {
    let model = report_support::model(true, true);
    let renderer = PdfRenderer {
        paper: Paper::A4,
        wording: Wording::builtin().expect("built-in templates load"),
    };
    c.bench_function("report/layout", |b| {
        b.iter(|| renderer.layout(black_box(&model)))
    });
    c.bench_function("report/layout_and_pdf_bytes", |b| {
        b.iter(|| renderer.render(black_box(&model)))
    });
    c.bench_function("report/load_templates", |b| b.iter(Wording::builtin));
}

criterion_group!(benches, bench);
criterion_main!(benches);
