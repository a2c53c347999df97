//! `brayfin check`: the normalised summary of a valid scenario, its
//! warnings and a one-line verdict, in SI or US customary units (money in
//! the scenario currency per internal unit: per GJ or per MMBtu of fuel, per
//! t of CO2, per kW-yr of capacity).

use crate::analysis::implied::ImpliedBid;
use crate::analysis::maintenance::StartsMaintenance;
use crate::report::format::{self, Quantity as Q};
use crate::report::model::Units;

use crate::scenario::{
    self, FuelComposition, GasModelSpec, HeatRateDamages, LoadedScenario, PriceBasis, RateBasis,
    Timing, ToleranceReading,
};
use std::fmt::Write;

/// What `check` prints for a scenario that loaded and solved.
pub struct CheckView<'a> {
    loaded: &'a LoadedScenario,
    extra_warnings: Vec<String>,
    extra_information: Vec<String>,
    implied: &'a [ImpliedBid],
    maintenance: &'a [StartsMaintenance],
    present_value_date: Option<chrono::NaiveDate>,
    units: Units,
}

impl<'a> CheckView<'a> {
    /// The view of `loaded` with the warnings found beyond the scenario
    /// alone (e.g. from solving the cycle), printed in `units`.
    pub fn new(loaded: &'a LoadedScenario, extra_warnings: Vec<String>, units: Units) -> Self {
        CheckView {
            loaded,
            extra_warnings,
            extra_information: Vec::new(),
            implied: &[],
            maintenance: &[],
            present_value_date: None,
            units,
        }
    }

    /// The same view with information lines found beyond the scenario
    /// alone (e.g. how each candidate's site performance is priced).
    pub fn with_information(mut self, information: Vec<String>) -> Self {
        self.extra_information = information;
        self
    }

    /// The same view with what each bid's datasheet implies
    /// ([`crate::analysis::implied::implied_bids`]), printed after the
    /// summary.
    pub fn with_implied(mut self, implied: &'a [ImpliedBid]) -> Self {
        self.implied = implied;
        self
    }

    /// The same view with each candidate's starts and maintenance as
    /// priced ([`crate::analysis::maintenance::starts_and_maintenance`]),
    /// printed after the candidates, and the date its present values are
    /// stated at ([`crate::analysis::maintenance::present_value_date`]),
    /// printed with the economics.
    pub fn with_maintenance(
        mut self,
        maintenance: &'a [StartsMaintenance],
        present_value_date: Option<chrono::NaiveDate>,
    ) -> Self {
        self.maintenance = maintenance;
        self.present_value_date = present_value_date;
        self
    }

    /// The text `check` prints.
    pub fn table(&self) -> String {
        let mut warnings = scenario::engineering_warnings(&self.loaded.scenario);
        warnings.extend(self.extra_warnings.iter().cloned());
        let mut out = summary(self.loaded, self.units, self);
        out.push_str(&super::implied::implied_text(self.implied, self.units));
        out.push_str(&closing(self.loaded, warnings, &self.extra_information));
        out
    }
}

/// What `check` prints after the summary: the information lines, the
/// `warnings` (from the scenario alone, then e.g. from solving the cycle),
/// then a one-line verdict.
fn closing(loaded: &LoadedScenario, warnings: Vec<String>, extra_information: &[String]) -> String {
    let mut out = String::new();
    let mut notes = scenario::information_notes(&loaded.scenario);
    notes.extend(extra_information.iter().cloned());
    if !notes.is_empty() {
        out.push_str("\nInformation:\n");
        for n in &notes {
            let _ = writeln!(out, "  - {n}");
        }
    }
    if warnings.is_empty() {
        out.push_str("\nWarnings: none\n");
    } else {
        let _ = writeln!(out, "\nWarnings ({}):", warnings.len());
        for w in &warnings {
            let _ = writeln!(out, "  - {w}");
        }
    }
    let _ = writeln!(
        out,
        "\n{}: valid; {}, {}, {}",
        loaded.file_label,
        count(loaded.scenario.candidates.len(), "candidate"),
        count(
            loaded.applied_defaults.len(),
            "default applied|defaults applied"
        ),
        count(warnings.len(), "warning")
    );
    out
}

/// The normalised summary: every figure in `units` (K, kPa, m or °F, psia,
/// ft; kW and h in both) and money in the scenario currency per GJ (SI) or
/// per MMBtu (US) of fuel, per t, per kW-yr; with the present-value date
/// and each candidate's starts and maintenance from `view`.
fn summary(loaded: &LoadedScenario, units: Units, view: &CheckView) -> String {
    let s = &loaded.scenario;
    let cur = &s.meta.currency;
    let mut out = String::new();
    let _ = writeln!(out, "Scenario  {}", s.meta.title);
    let _ = writeln!(
        out,
        "          for {}, by {}, dated {}; currency {cur}; baseline {}",
        s.meta.prepared_for, s.meta.prepared_by, s.meta.date, s.meta.baseline
    );
    let _ = writeln!(out, "          file sha256 {}", loaded.sha256_hex);
    let site = &s.site;
    let elevation = site.elevation_m.map_or(String::new(), |z| {
        format!(
            " (ISO 2533 at {})",
            format::with_unit(Q::Length, z, units, 1)
        )
    });
    let _ = writeln!(
        out,
        "Site      {}ambient {}, {}{elevation}",
        site.name
            .as_ref()
            .map_or(String::new(), |n| format!("{n}: ")),
        format::with_unit(Q::Temperature, site.ambient_temperature_k, units, 2),
        format::with_unit(Q::Pressure, site.ambient_pressure_kpa, units, 3)
    );
    let fuel = &s.fuel;
    let basis = match fuel.price_basis {
        PriceBasis::Hhv => "HHV",
        PriceBasis::Lhv => "LHV",
    };
    let composition = match &fuel.composition {
        FuelComposition::Named(name) => name.clone(),
        FuelComposition::MoleFractions(x) => x
            .iter()
            .map(|(species, f)| format!("{species} {f}"))
            .collect::<Vec<_>>()
            .join(", "),
        FuelComposition::HeatingValues {
            lhv_kj_per_kg,
            hhv_kj_per_kg,
            co2_kg_per_gj_lhv,
        } => format!(
            "LHV {lhv_kj_per_kg} kJ/kg, HHV {hhv_kj_per_kg} kJ/kg, CO2 {co2_kg_per_gj_lhv} kg/GJ LHV"
        ),
    };
    let _ = writeln!(out, "Fuel      {} ({composition})", fuel.name);
    let path = if fuel.price_path.is_empty() {
        String::new()
    } else {
        format!("; price path {} years", fuel.price_path.len())
    };
    let _ = writeln!(
        out,
        "          {}, escalating {}/yr{path}",
        format::fuel_price_echo(
            fuel.price_per_gj,
            format::scenario_price_written(fuel, cur).as_deref(),
            cur,
            basis,
            &format::scenario_price_unit(loaded),
            units
        ),
        percent(fuel.escalation)
    );
    let e = &s.economics;
    let _ = writeln!(
        out,
        "Economics operation from {}, {} years, discount {} {}, inflation {}, {}",
        e.commercial_operation,
        e.service_life_years,
        percent(e.discount_rate),
        match e.rate_basis {
            RateBasis::Real => "real",
            RateBasis::Nominal => "nominal",
        },
        percent(e.inflation),
        match e.timing {
            Timing::EndOfYear => "end-of-year",
            Timing::MidYear => "mid-year",
        }
    );
    let _ = writeln!(
        out,
        "          carbon {} {cur}/t escalating {}/yr; capacity value {} {cur}/kW-yr",
        e.carbon_price_per_tonne,
        percent(e.carbon_escalation),
        e.capacity_value_per_kw_year
    );
    if let Some(date) = view.present_value_date {
        out.push_str(&super::check_maintenance::present_value_line(s, date));
    }
    let op = &s.operation;
    let profile = if op.dispatch.is_empty() {
        "all at full load".to_string()
    } else {
        op.dispatch
            .iter()
            .map(|b| format!("{} h at {}", b.hours, percent(b.load_fraction)))
            .collect::<Vec<_>>()
            .join(", ")
    };
    let _ = writeln!(out, "Operation {} h/yr: {profile}", op.hours_per_year);
    out.push_str(&candidate_table(loaded, units));
    out.push_str(&super::check_maintenance::section(
        view.maintenance,
        cur,
        units,
    ));
    out.push_str(&guarantees(loaded, units));
    out.push_str(&correlations(loaded));
    out
}

/// Each candidate's `[candidate.guarantee]`: the guaranteed figures (or
/// what they default to), the acceptance test's tolerance and how it is
/// read, the damages and bonus rates with their caps, the contract price
/// the caps refer to, and the as-built figures `compare` settles. Empty
/// when no candidate has a guarantee.
fn guarantees(loaded: &LoadedScenario, units: Units) -> String {
    let s = &loaded.scenario;
    let cur = &s.meta.currency;
    let mut out = String::new();
    for c in &s.candidates {
        let Some(g) = &c.guarantee else {
            continue;
        };
        if out.is_empty() {
            out.push_str("Guarantees (settled at the acceptance test)\n");
        }
        let output = g.net_output_kw.map_or_else(
            || {
                format!(
                    "{} (net_output)",
                    format::with_unit(Q::Power, c.net_output_kw, units, 0)
                )
            },
            |kw| format::with_unit(Q::Power, kw, units, 0),
        );
        let heat_rate = g.heat_rate_kj_per_kwh.map_or_else(
            || "the rated heat rate at the site".to_string(),
            |hr| format::with_unit(Q::HeatRate, hr, units, 0),
        );
        let rule = match g.reading {
            ToleranceReading::BeyondTolerance => "only the shortfall beyond it counts",
            ToleranceReading::WholeShortfall => "the whole shortfall counts once beyond it",
        };
        let _ = writeln!(
            out,
            "  {}: guaranteed net output {output}, heat rate {heat_rate} (LHV)",
            c.id
        );
        let _ = writeln!(out, "    tolerance {} ({rule})", percent(g.tolerance));
        let heat_rate_damages = match g.damages_heat_rate {
            HeatRateDamages::PerPercent(rate) => format!("{rate} {cur} per % of heat rate"),
            HeatRateDamages::PerKjPerKwh(rate) => format!("{rate} {cur} per kJ/kWh of heat rate"),
        };
        let _ = writeln!(
            out,
            "    damages {heat_rate_damages}, {} {cur} per kW of output; {}",
            g.damages_per_kw,
            cap(g.damages_cap)
        );
        if g.bonus_per_heat_rate_percent.is_zero() && g.bonus_per_kw.is_zero() {
            out.push_str("    no bonus\n");
        } else {
            let _ = writeln!(
                out,
                "    bonus {} {cur} per % of heat rate, {} {cur} per kW of output; {}",
                g.bonus_per_heat_rate_percent,
                g.bonus_per_kw,
                cap(g.bonus_cap)
            );
        }
        let price = g.contract_price.map_or_else(
            || format!("{} {cur} (capital_cost)", c.capital_cost),
            |p| format!("{p} {cur}"),
        );
        let _ = writeln!(
            out,
            "    contract price {price}; as built: heat rate {} and net output {} of the guarantee",
            percent(g.as_built_heat_rate),
            percent(g.as_built_output)
        );
    }
    out
}

/// A cap as a fraction of the contract price, or its absence.
fn cap(fraction: Option<f64>) -> String {
    fraction.map_or_else(
        || "no cap".to_string(),
        |f| format!("capped at {} of the contract price", percent(f)),
    )
}

/// The `[[correlation]]` pairs with their target rank correlations; empty
/// when there are none.
fn correlations(loaded: &LoadedScenario) -> String {
    let pairs = &loaded.scenario.correlation;
    if pairs.is_empty() {
        return String::new();
    }
    let mut out = String::from(
        "Correlations (rank, imposed on risk draws by Iman-Conover; unlisted pairs 0)\n",
    );
    for p in pairs {
        let _ = writeln!(out, "  {} ~ {}: {}", p.first, p.second, p.rank_correlation);
    }
    out
}

fn candidate_table(loaded: &LoadedScenario, units: Units) -> String {
    let s = &loaded.scenario;
    let mut rows = vec![[
        "id".to_string(),
        format!("capital {}", s.meta.currency),
        "net kW".into(),
        "gas".into(),
        "PR".into(),
        format!("TIT {}", format::unit(Q::Temperature, units)),
        "eta_c".into(),
        "eta_t".into(),
        "parts".into(),
    ]];
    for c in &s.candidates {
        let mut parts = Vec::new();
        if let Some(r) = c.regenerator {
            parts.push(format!("regenerator {}", percent(r.effectiveness)));
        }
        if c.intercooler.is_some() {
            parts.push("intercooler".to_string());
        }
        if c.reheat.is_some() {
            parts.push("reheat".to_string());
        }
        let basis = match c.efficiency_basis {
            scenario::EfficiencyBasis::Isentropic => "",
            scenario::EfficiencyBasis::Polytropic => " poly",
        };
        rows.push([
            c.id.clone(),
            c.capital_cost.to_string(),
            format!("{:.0}", c.net_output_kw),
            match c.gas_model {
                GasModelSpec::Air => "air".into(),
                GasModelSpec::Products => "products".into(),
                GasModelSpec::ColdAir { .. } => "cold-air".into(),
            },
            format!("{}", c.pressure_ratio),
            format::value(Q::Temperature, c.turbine_inlet_temperature_k, units, 1),
            format!("{}{basis}", c.compressor_efficiency),
            format!("{}{basis}", c.turbine_efficiency),
            if parts.is_empty() {
                "simple cycle".into()
            } else {
                parts.join(", ")
            },
        ]);
    }
    let widths: Vec<usize> = (0..9)
        .map(|i| rows.iter().map(|r| r[i].chars().count()).max().unwrap_or(0))
        .collect();
    let mut out = String::from("Candidates\n");
    for row in &rows {
        let cells: Vec<String> = row
            .iter()
            .zip(&widths)
            .map(|(cell, w)| format!("{cell:<w$}"))
            .collect();
        let _ = writeln!(out, "  {}", cells.join("  ").trim_end());
    }
    out
}

/// `n` with the singular or plural noun (`"x|ys"` gives both forms, a
/// single word takes an `s`).
fn count(n: usize, noun: &str) -> String {
    let (one, many) = match noun.split_once('|') {
        Some((one, many)) => (one.to_string(), many.to_string()),
        None => (noun.to_string(), format!("{noun}s")),
    };
    format!("{n} {}", if n == 1 { one } else { many })
}

/// A fraction as a percentage with up to three decimals, e.g. `7 %`.
fn percent(fraction: f64) -> String {
    let p = (fraction * 100.0 * 1000.0).round() / 1000.0;
    format!("{p} %")
}
