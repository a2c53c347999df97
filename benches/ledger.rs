//! Speed of the finance layer: a 30-year ledger with every stream active,
//! its totals alone (`summary_30y`, what sampling and sweeps run), the full
//! ledger, and the ledger with all metrics against a baseline, in `Decimal`
//! (the printed ledger) and `f64` (sampling and sweeps). Target: ledger plus
//! all metrics against a baseline ≤ 25 µs median in `Decimal`.

use brayfin::finance::{
    build_ledger, compare_ledgers, compare_summaries, summarize_ledger, LedgerInputs, Money,
};
use criterion::{black_box, criterion_group, criterion_main, Criterion};

#[path = "../tests/finance_support/mod.rs"]
mod finance_support;

fn bench_number_type<M: Money>(
    c: &mut Criterion,
    label: &str,
    candidate: &LedgerInputs<M>,
    baseline: &LedgerInputs<M>,
) {
    let baseline_ledger = build_ledger(baseline).expect("baseline builds");
    let baseline_summary = baseline_ledger.summary;
    c.bench_function(&format!("{label}/summary_30y"), |b| {
        b.iter(|| summarize_ledger(black_box(candidate)))
    });
    c.bench_function(&format!("{label}/ledger_30y"), |b| {
        b.iter(|| build_ledger(black_box(candidate)))
    });
    c.bench_function(
        &format!("{label}/ledger_30y_plus_all_metrics_vs_built_baseline"),
        |b| {
            b.iter(|| {
                let ledger = build_ledger(black_box(candidate))?;
                compare_ledgers(&ledger, &baseline_ledger)
            })
        },
    );
    c.bench_function(&format!("{label}/both_ledgers_plus_all_metrics"), |b| {
        b.iter(|| {
            let ledger = build_ledger(black_box(candidate))?;
            let base = build_ledger(black_box(baseline))?;
            compare_ledgers(&ledger, &base)
        })
    });
    c.bench_function(
        &format!("{label}/summary_plus_savings_vs_built_baseline"),
        |b| {
            b.iter(|| {
                let summary = summarize_ledger(black_box(candidate))?;
                compare_summaries(&summary, &baseline_summary)
            })
        },
    );
}

fn ledger_benches(c: &mut Criterion) {
    let candidate = finance_support::busy_inputs();
    let baseline = finance_support::busy_baseline();
    bench_number_type(c, "decimal", &candidate, &baseline);
    bench_number_type(c, "f64", &candidate.to_f64(), &baseline.to_f64());
}

criterion_group!(benches, ledger_benches);
criterion_main!(benches);
