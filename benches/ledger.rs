//! Speed of the finance layer: a 30-year ledger with every stream active,
//! its totals alone (`summary_30y`, what sampling and sweeps run), the full
//! ledger, and the ledger with all metrics against a baseline, in `Decimal`
//! (the printed ledger) and `f64` (sampling and sweeps). Target: ledger plus
//! all metrics against a baseline ≤ 25 µs median in `Decimal`. The
//! `*_maintenance` groups add starts (start fuel, start cost, service fees),
//! an equivalent-hours and starts overhaul limit, outages and output
//! degradation to both ledgers.

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
    let (candidate, baseline) = (with_maintenance(candidate), with_maintenance(baseline));
    bench_number_type(c, "decimal_maintenance", &candidate, &baseline);
    bench_number_type(
        c,
        "f64_maintenance",
        &candidate.to_f64(),
        &baseline.to_f64(),
    );
}

/// The busy inputs with every starts and maintenance stream on (invented
/// figures).
fn with_maintenance(mut inputs: LedgerInputs) -> LedgerInputs {
    let price = |text: &str| brayfin::finance::EscalatingPrice {
        price: finance_support::dec(text),
        escalation: 0.0,
    };
    inputs.operation.starts_per_year = 150.0;
    inputs.starts.fuel_gj_lhv_per_start = 110.0;
    inputs.starts.cost_per_start = price("900.00");
    inputs.service.per_fired_hour = price("40.00");
    inputs.service.per_start = price("400.00");
    inputs.degradation.output_fraction_per_year = 0.002;
    if let Some(overhaul) = inputs.overhaul.as_mut() {
        overhaul.hours_per_start = 10.0;
        overhaul.interval_starts = Some(1_200.0);
        overhaul.outage_days = 21.0;
        overhaul.outage_capacity_kw = 48_000.0;
    }
    inputs
}

criterion_group!(benches, ledger_benches);
criterion_main!(benches);
