//! Speed of the PDF briefing: laying out and writing the invented
//! three-candidate rendering fixture (25-year ledgers, sensitivity and
//! risk sections). The whole `report` command has a 1 s wall-time budget
//! (release build); rendering is the part this crate's code controls.

use brayfin::report::pdf::{Paper, PdfRenderer};
use brayfin::report::wording::Wording;
use brayfin::report::Renderer;
use criterion::{black_box, criterion_group, criterion_main, BenchmarkId, Criterion, Throughput};
use std::time::{Duration, Instant};

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

/// A title of `chars` characters: words of six letters and a space.
fn long_title(chars: usize) -> String {
    "Kestra ".chars().cycle().take(chars).collect()
}

/// Mean layout time of `model` over `runs` runs.
fn mean_layout(
    renderer: &PdfRenderer,
    model: &brayfin::report::model::Model,
    runs: u32,
) -> Duration {
    let start = Instant::now();
    for _ in 0..runs {
        let _ = black_box(renderer.layout(black_box(model)));
    }
    start.elapsed() / runs
}

/// Layout time against title length. Linear layout: the time per title
/// character stays flat or falls as the title grows (criterion's throughput
/// column), and a title 16 times longer costs at most 16 times the time
/// (less, as the rest of the layout does not grow). Before text layout was
/// made linear, `report` took 0.15 s at 1k characters and 34 s at 16k, a
/// ratio of about 230; the check fails above 16.
fn title_length(c: &mut Criterion) {
    let renderer = PdfRenderer {
        paper: Paper::A4,
        wording: Wording::builtin().expect("built-in templates load"),
    };
    let mut group = c.benchmark_group("report/title_length");
    for chars in [1_000usize, 4_000, 16_000] {
        let mut model = report_support::model(false, false);
        model.meta.title = long_title(chars);
        group.throughput(Throughput::Elements(chars as u64));
        group.bench_with_input(BenchmarkId::from_parameter(chars), &model, |b, m| {
            b.iter(|| renderer.layout(black_box(m)))
        });
    }
    group.finish();

    let timed = |chars: usize| {
        let mut model = report_support::model(false, false);
        model.meta.title = long_title(chars);
        mean_layout(&renderer, &model, 20)
    };
    let ratio = timed(16_000).as_secs_f64() / timed(1_000).as_secs_f64();
    println!(
        "report/title_length: layout time 16k vs 1k title characters = {ratio:.2} \
         (linear at most 16; quadratic about 256)"
    );
    assert!(
        ratio < 16.0,
        "layout time grows faster than linear: ratio {ratio:.1}"
    );
}

criterion_group!(benches, bench, title_length);
criterion_main!(benches);
