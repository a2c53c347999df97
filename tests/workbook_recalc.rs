//! Recalculation by a real spreadsheet application: LibreOffice Calc opens
//! the workbook headless, evaluates every formula and saves it again; the
//! recalculated figures must equal `compare --format json` to the cent.
//!
//! These tests need `soffice` (Debian package `libreoffice-calc`; `.ci/run`
//! installs it). Without it they FAIL, unless `BRAYFIN_SKIP_LIBREOFFICE=1`
//! is set (a developer opt-out, see DEVELOPERS.md). LibreOffice runs with a
//! throw-away profile that tells it to recalculate every formula on load
//! (by default it trusts the cached values of an .xlsx file), one process
//! at a time (a profile in use is locked).

mod workbook_support;

use brayfin::analysis::compare::run_study;
use brayfin::workbook::build_workbook;
use std::path::{Path, PathBuf};
use std::process::Command;
use std::sync::Mutex;
use workbook_support::{
    assert_no_error_cells, check_ledgers, check_summary, compare_json, hourly_priced_variant,
    json_money, nominal_variant, price_path_variant, study_date_variant, write_workbook, DEMOS,
};

/// One LibreOffice process at a time.
static SOFFICE: Mutex<()> = Mutex::new(());

/// Settings of the throw-away profile: recalculate OOXML and ODF files
/// always on load (0 = always, 1 = never, 2 = ask).
const RECALCULATE_ON_LOAD: &str = r#"<?xml version="1.0" encoding="UTF-8"?>
<oor:items xmlns:oor="http://openoffice.org/2001/registry" xmlns:xs="http://www.w3.org/2001/XMLSchema" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="OOXMLRecalcMode" oor:op="fuse"><value>0</value></prop></item>
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="ODFRecalcMode" oor:op="fuse"><value>0</value></prop></item>
</oor:items>
"#;

/// Whether the LibreOffice checks may be skipped: only when asked for.
fn skipped() -> bool {
    if std::env::var("BRAYFIN_SKIP_LIBREOFFICE").is_ok_and(|v| v == "1") {
        eprintln!("BRAYFIN_SKIP_LIBREOFFICE=1: recalculation by LibreOffice not checked");
        return true;
    }
    false
}

/// `workbook` opened, recalculated and saved again by LibreOffice Calc; the
/// path of the recalculated copy.
fn recalculate(workbook: &Path, dir: &Path) -> PathBuf {
    let _one_at_a_time = SOFFICE
        .lock()
        .unwrap_or_else(|poisoned| poisoned.into_inner());
    let profile = dir.join("profile");
    std::fs::create_dir_all(profile.join("user")).expect("profile folder");
    std::fs::write(
        profile.join("user/registrymodifications.xcu"),
        RECALCULATE_ON_LOAD,
    )
    .expect("profile settings");
    let out = dir.join("recalculated");
    std::fs::create_dir_all(&out).expect("output folder");
    let status = Command::new("soffice")
        .env("HOME", dir)
        .arg(format!("-env:UserInstallation=file://{}", profile.display()))
        .args(["--headless", "--norestore", "--convert-to", "xlsx", "--outdir"])
        .arg(&out)
        .arg(workbook)
        .output()
        .unwrap_or_else(|e| {
            panic!("soffice could not be run ({e}); install libreoffice-calc, or set BRAYFIN_SKIP_LIBREOFFICE=1 to skip this check")
        });
    assert!(
        status.status.success(),
        "soffice failed: {}",
        String::from_utf8_lossy(&status.stderr)
    );
    let recalculated = out.join(workbook.file_name().expect("a file name"));
    assert!(
        recalculated.exists(),
        "soffice wrote no file: {}",
        String::from_utf8_lossy(&status.stdout)
    );
    recalculated
}

#[test]
fn libreoffice_recalculates_both_demos_to_the_cent() {
    if skipped() {
        return;
    }
    for demo in DEMOS {
        let dir = tempfile::tempdir().expect("temp dir");
        let scenario = Path::new(demo);
        let book = dir.path().join("book.xlsx");
        write_workbook(scenario, &book);
        let recalculated = recalculate(&book, dir.path());
        let json = compare_json(scenario);
        assert_no_error_cells(&recalculated, demo);
        check_summary(&recalculated, &json, &format!("{demo} recalculated"));
        check_ledgers(&recalculated, &json, &format!("{demo} recalculated"));
    }
}

/// A fuel price given year by year (each ledger row looks its price up in
/// the path on the Inputs sheet), and a nominal analysis whose baseline has
/// no overhauls, a payback never reached and a negative SIR.
#[test]
fn libreoffice_recalculates_the_variants_to_the_cent() {
    if skipped() {
        return;
    }
    let dir = tempfile::tempdir().expect("temp dir");
    for (scenario, label) in [
        (price_path_variant(dir.path()), "price path"),
        (nominal_variant(dir.path()), "nominal"),
        (
            study_date_variant(dir.path()),
            "present values at the study date",
        ),
        (
            hourly_priced_variant(dir.path()),
            "hourly year with priced hours",
        ),
    ] {
        let book = dir.path().join("book.xlsx");
        write_workbook(&scenario, &book);
        let recalculated = recalculate(&book, dir.path());
        let json = compare_json(&scenario);
        assert_no_error_cells(&recalculated, label);
        check_summary(&recalculated, &json, &format!("{label} recalculated"));
        check_ledgers(&recalculated, &json, &format!("{label} recalculated"));
    }
}

/// The scenario text with its fuel price line replaced.
fn with_fuel_price(text: &str, price: &str) -> String {
    let lines: Vec<&str> = text.lines().collect();
    let at: Vec<usize> = (0..lines.len())
        .filter(|i| lines[*i].starts_with("price = "))
        .collect();
    assert_eq!(at.len(), 1, "one fuel price line in the demo");
    let mut out: Vec<String> = lines.iter().map(|l| l.to_string()).collect();
    out[at[0]] = format!("price = \"{price}\"");
    out.join("\n") + "\n"
}

/// Change the fuel-price cell and recalculate: the ledgers and summary
/// follow, and equal `compare` on the scenario with that price, to the cent
/// (the fuel energy does not depend on the price, so nothing is held
/// constant that `compare` would change). The workbook's cached values are
/// those of the original price, so only a real recalculation passes.
#[test]
fn a_changed_fuel_price_recalculates_to_compare_at_that_price() {
    if skipped() {
        return;
    }
    for (demo, new_price) in [(DEMOS[0], "5.10 USD/MMBtu"), (DEMOS[1], "41.5 EUR/MWh")] {
        let dir = tempfile::tempdir().expect("temp dir");
        let original = brayfin::scenario::load(Path::new(demo)).expect("demo loads");
        let study = run_study(&original).expect("demo runs");
        let changed_path = dir.path().join("changed.toml");
        std::fs::write(
            &changed_path,
            with_fuel_price(&original.source_text, new_price),
        )
        .expect("scenario written");
        let changed = brayfin::scenario::load(&changed_path).expect("changed scenario loads");
        assert_ne!(
            changed.scenario.fuel.price_per_gj,
            original.scenario.fuel.price_per_gj
        );

        // The original workbook with only the fuel-price input cell changed.
        let mut edited = original.clone();
        edited.scenario.fuel.price_per_gj = changed.scenario.fuel.price_per_gj;
        let book = dir.path().join("edited.xlsx");
        std::fs::write(&book, build_workbook(&edited, &study).expect("workbook")).expect("written");

        let json = compare_json(&changed_path);
        let stale = study.outcomes[0]
            .ledger
            .summary
            .lifecycle_cost
            .to_string()
            .parse::<f64>()
            .expect("number");
        let fresh = json_money(&json["candidates"][0]["economics"]["lifecycle_cost"]);
        assert!(
            (stale - fresh).abs() > 1000.0,
            "the price change must move the lifecycle cost"
        );

        let recalculated = recalculate(&book, dir.path());
        check_summary(&recalculated, &json, &format!("{demo} at {new_price}"));
        check_ledgers(&recalculated, &json, &format!("{demo} at {new_price}"));
    }
}

/// Change the discount-rate cell and recalculate: every discount factor,
/// present value, metric and verdict follows, and equals `compare` on the
/// scenario at that rate, to the cent (the rate does not touch the
/// physics). The cached values are those of the original rate; at 9.25 %
/// the regenerated bid's verdict turns, so the verdict formula is tried.
#[test]
fn a_changed_discount_rate_recalculates_to_compare_at_that_rate() {
    if skipped() {
        return;
    }
    let (demo, from, to) = (
        DEMOS[0],
        "discount_rate = \"6.5 %\"",
        "discount_rate = \"9.25 %\"",
    );
    let dir = tempfile::tempdir().expect("temp dir");
    let original = brayfin::scenario::load(Path::new(demo)).expect("demo loads");
    let study = run_study(&original).expect("demo runs");
    assert_eq!(
        original.source_text.matches(from).count(),
        1,
        "one discount rate line"
    );
    let changed_path = dir.path().join("changed.toml");
    std::fs::write(&changed_path, original.source_text.replace(from, to)).expect("written");
    let changed = brayfin::scenario::load(&changed_path).expect("changed scenario loads");

    // The original workbook with only the discount-rate input cell changed.
    let mut edited = original.clone();
    edited.scenario.economics.discount_rate = changed.scenario.economics.discount_rate;
    let book = dir.path().join("edited.xlsx");
    std::fs::write(&book, build_workbook(&edited, &study).expect("workbook")).expect("written");

    let json = compare_json(&changed_path);
    let verdicts = |j: &serde_json::Value| -> Vec<String> {
        j["candidates"]
            .as_array()
            .expect("candidates")
            .iter()
            .map(|c| c["verdict"]["kind"].to_string())
            .collect()
    };
    assert_ne!(
        verdicts(&json),
        verdicts(&compare_json(Path::new(demo))),
        "a verdict turns at 9.25 %"
    );
    let recalculated = recalculate(&book, dir.path());
    check_summary(&recalculated, &json, &format!("{demo} at 9.25 %"));
    check_ledgers(&recalculated, &json, &format!("{demo} at 9.25 %"));
}
