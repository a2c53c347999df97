//! A candidate's block of the Inputs sheet: its costs as named inputs, its
//! figures from brayfin's cycle model and operating year as computed
//! constants, its operating points, and its output shortfall as formulas.

use super::super::{xlsx_error, Names};
use super::writer::{source_of, Origin, Shown, Writer};
use crate::analysis::compare::Study;
use crate::finance::{Capital, ResidualValue};
use crate::scenario::LoadedScenario;
use crate::Result;
use rust_decimal::Decimal;

const COMPUTED_NOTE: &str = "computed by brayfin's cycle model and operating year (a constant: it does not follow edits of other cells)";

/// Write the block of candidate `index`.
pub(super) fn write(
    w: &mut Writer,
    loaded: &LoadedScenario,
    study: &Study,
    names: &Names,
    index: usize,
) -> Result<()> {
    let scenario = &loaded.scenario;
    let currency = &scenario.meta.currency;
    let outcome = &study.outcomes[index];
    let candidate = &scenario.candidates[index];
    let n = names.candidate(index);
    let key = |field: &str| format!("candidate[{}].{field}", candidate.id);
    let inputs = &outcome.inputs;
    let role = if index == study.baseline_index {
        " (baseline)"
    } else {
        ""
    };
    w.heading(&format!(
        "Candidate `{}`{role}: {}",
        candidate.id, candidate.label
    ))?;
    w.named(
        "Capital cost",
        &n.name("CapitalCost"),
        Shown::Money(candidate.capital_cost),
        currency,
        &source_of(loaded, &key("capital_cost")),
        Origin::Input,
    )?;
    match &inputs.capital {
        Capital::AtCommercialOperation(_) => {
            w.named(
                "Share of capital paid at commercial operation",
                &n.name("Share1"),
                Shown::Percent(1.0),
                "of capital cost",
                "no construction schedule: all paid at commercial operation",
                Origin::Input,
            )?;
        }
        Capital::Schedule(_) => {
            for (k, (date, fraction)) in candidate.costs.construction_schedule.iter().enumerate() {
                w.named(
                    &format!("Share of capital paid {date}"),
                    &n.name(&format!("Share{}", k + 1)),
                    Shown::Percent(*fraction),
                    "of capital cost",
                    &source_of(loaded, &key("costs.construction")),
                    Origin::Input,
                )?;
            }
        }
    }
    w.named(
        "Fixed O&M",
        &n.name("FixedOm"),
        Shown::Money(inputs.fixed_om.price),
        &format!("{currency}/kW-yr"),
        &source_of(loaded, &key("costs.fixed_om")),
        Origin::Input,
    )?;
    w.named(
        "Variable O&M",
        &n.name("VariableOm"),
        Shown::Money(inputs.variable_om.price),
        &format!("{currency}/MWh"),
        &source_of(loaded, &key("costs.variable_om")),
        Origin::Input,
    )?;
    w.named(
        "Starts per year",
        &n.name("StartsPerYear"),
        Shown::Number(inputs.operation.starts_per_year),
        "starts",
        &source_of(loaded, "operation.starts_per_year"),
        Origin::Input,
    )?;
    w.named(
        "Start fuel (LHV)",
        &n.name("StartFuelGj"),
        Shown::Number(inputs.starts.fuel_gj_lhv_per_start),
        "GJ per start",
        &format!(
            "{}; priced like the fuel",
            source_of(loaded, &key("costs.start_fuel"))
        ),
        Origin::Input,
    )?;
    w.named(
        "Start cost",
        &n.name("StartCost"),
        Shown::Money(inputs.starts.cost_per_start.price),
        &format!("{currency} per start"),
        &format!(
            "{}; counted in variable O&M",
            source_of(loaded, &key("costs.start_cost"))
        ),
        Origin::Input,
    )?;
    w.named(
        "Service fee per fired hour",
        &n.name("ServicePerHour"),
        Shown::Money(inputs.service.per_fired_hour.price),
        &format!("{currency}/h"),
        &format!(
            "{}; counted in variable O&M",
            source_of(loaded, &key("costs.service_per_fired_hour"))
        ),
        Origin::Input,
    )?;
    w.named(
        "Service fee per start",
        &n.name("ServicePerStart"),
        Shown::Money(inputs.service.per_start.price),
        &format!("{currency} per start"),
        &format!(
            "{}; counted in variable O&M",
            source_of(loaded, &key("costs.service_per_start"))
        ),
        Origin::Input,
    )?;
    let (interval, cost) = inputs
        .overhaul
        .map_or((0.0, Decimal::ZERO), |o| (o.interval_hours, o.cost));
    let (hours_per_start, interval_starts) = inputs.overhaul.map_or((0.0, 0.0), |o| {
        (o.hours_per_start, o.interval_starts.unwrap_or(0.0))
    });
    w.named(
        "Overhaul cost (each)",
        &n.name("OverhaulCost"),
        Shown::Money(cost),
        currency,
        &source_of(loaded, &key("costs.overhaul_cost")),
        Origin::Input,
    )?;
    w.named(
        "Overhaul interval",
        &n.name("OverhaulInterval"),
        Shown::Number(interval),
        "equivalent operating hours",
        &format!(
            "{}; sets the overhaul counts in the ledger (computed constants)",
            source_of(loaded, &key("costs.overhaul_interval"))
        ),
        Origin::Input,
    )?;
    w.named(
        "Equivalent hours per start",
        &n.name("HoursPerStart"),
        Shown::Number(hours_per_start),
        "h per start",
        &format!(
            "{}; equivalent hours = fired hours + starts × this; sets the overhaul counts (computed constants)",
            source_of(loaded, &key("costs.hours_per_start"))
        ),
        Origin::Input,
    )?;
    w.named(
        "Starts between overhauls",
        &n.name("OverhaulStarts"),
        Shown::Number(interval_starts),
        "starts (0: no limit)",
        &format!(
            "{}; an overhaul falls due on equivalent hours or starts, whichever comes first; sets the overhaul counts (computed constants)",
            source_of(loaded, &key("costs.overhaul_starts"))
        ),
        Origin::Input,
    )?;
    w.named(
        "Heat-rate degradation",
        &n.name("Degradation"),
        Shown::Percent(inputs.degradation.heat_rate_fraction_per_year),
        "per year of operation",
        &format!(
            "{}; enters the ledger through the heat-rate multipliers (computed constants)",
            source_of(loaded, &key("costs.degradation_per_year"))
        ),
        Origin::Input,
    )?;
    w.named(
        "Output degradation",
        &n.name("OutputDegradation"),
        Shown::Percent(inputs.degradation.output_fraction_per_year),
        "per year of operation",
        &format!(
            "{}; enters the ledger through the output-lost column (computed constants); the energy lost is bought in at EnergyValue",
            source_of(loaded, &key("costs.output_degradation_per_year"))
        ),
        Origin::Input,
    )?;
    w.named(
        "Outage per overhaul",
        &n.name("OutageDays"),
        Shown::Number(inputs.overhaul.map_or(0.0, |o| o.outage_days)),
        "days",
        &format!(
            "{}; enters the ledger through the share-in-service column (computed constants: 1 − overhauls × days ÷ 365 ÷ share of the year); the energy and capacity lost are bought in",
            source_of(loaded, &key("costs.overhaul_outage_days"))
        ),
        Origin::Input,
    )?;
    w.named(
        "Degradation recovered at overhaul",
        &n.name("Recoverable"),
        Shown::Percent(inputs.degradation.recoverable_fraction),
        "of degradation",
        &source_of(loaded, &key("costs.recoverable_fraction")),
        Origin::Input,
    )?;
    let (fraction, amount) = match inputs.residual.value {
        ResidualValue::FractionOfCapital(f) => (f, Decimal::ZERO),
        ResidualValue::Amount(a) => (0.0, a),
    };
    w.named(
        "Residual value, share of capital",
        &n.name("ResidualShare"),
        Shown::Percent(fraction),
        "of capital paid",
        &source_of(loaded, &key("costs.residual_value")),
        Origin::Input,
    )?;
    w.named(
        "Residual value, amount",
        &n.name("ResidualAmount"),
        Shown::Money(amount),
        currency,
        "used when the residual value is stated as an amount (else 0)",
        Origin::Input,
    )?;
    w.named(
        "Rated net output",
        &n.name("NetOutputKw"),
        Shown::Number(inputs.operation.net_output_kw),
        "kW",
        &source_of(loaded, &key("net_output")),
        Origin::Input,
    )?;
    let site = &outcome.solved.site;
    w.named(
        "Base-load net output at the site",
        &n.name("SiteOutputKw"),
        Shown::Number(site.net_output_kw),
        "kW",
        &format!("{COMPUTED_NOTE}; the fixed machine at the site's ambient"),
        Origin::Computed,
    )?;
    w.named(
        "Capacity credited (base-load output at the capacity temperature)",
        &n.name("CapacityKw"),
        Shown::Number(site.capacity_output_kw),
        "kW",
        &format!("{COMPUTED_NOTE}; the fixed machine at economics.capacity_temperature (else at the site)"),
        Origin::Computed,
    )?;
    w.named(
        "Base-load heat rate at the site (LHV)",
        &n.name("HeatRate"),
        Shown::Number(site.heat_rate_kj_per_kwh),
        "kJ/kWh",
        COMPUTED_NOTE,
        Origin::Computed,
    )?;
    w.named(
        "Base-load thermal efficiency at the site (LHV)",
        &n.name("Efficiency"),
        Shown::Percent(3600.0 / site.heat_rate_kj_per_kwh),
        "",
        COMPUTED_NOTE,
        Origin::Computed,
    )?;
    let op = &inputs.operation;
    w.named(
        "Operating hours per full year",
        &n.name("AnnualHours"),
        Shown::Number(op.operating_hours),
        "h",
        COMPUTED_NOTE,
        Origin::Computed,
    )?;
    w.named(
        "Net energy per full year",
        &n.name("AnnualEnergy"),
        Shown::Number(op.energy_mwh),
        "MWh",
        COMPUTED_NOTE,
        Origin::Computed,
    )?;
    w.named(
        "Fuel energy per full year, new and clean",
        &n.name("AnnualFuelGj"),
        Shown::Number(op.fuel_energy_gj_lhv),
        "GJ LHV",
        &format!("{COMPUTED_NOTE}; dispatch × part-load heat rate"),
        Origin::Computed,
    )?;
    bins(w, scenario, site)?;
    let energies = names.all("AnnualEnergy");
    let outputs = names.all("CapacityKw");
    w.formula(
        "Energy shortfall bought elsewhere",
        &n.name("EnergyShortfall"),
        &format!("=MAX(0,MAX({energies})-{})", n.name("AnnualEnergy")),
        inputs.bought_in.energy_mwh_per_year,
        "MWh per full year",
        "levelling: the most any candidate delivers, less this candidate's",
    )?;
    w.formula(
        "Capacity shortfall bought elsewhere",
        &n.name("CapacityShortfall"),
        &format!("=MAX(0,MAX({outputs})-{})", n.name("CapacityKw")),
        inputs.bought_in.capacity_kw,
        "kW",
        "levelling: the largest capacity credited, less this candidate's",
    )?;
    // Energy bought in (shortfall, outages, output degradation) is priced
    // at economics.energy_value, or, with an hourly profile that prices its
    // hours, at this candidate's hour-weighted shortfall price (computed).
    let hourly = scenario
        .operation
        .profile
        .as_ref()
        .is_some_and(|p| p.has_prices());
    let price = inputs.bought_in.energy_price.price;
    if hourly {
        w.named(
            "Price of energy bought in (hour-weighted)",
            &n.name("BoughtInEnergyPrice"),
            Shown::Money(price),
            &format!("{currency}/MWh"),
            &format!(
                "{COMPUTED_NOTE}; the profile's hourly prices weighted by this candidate's hourly shortfall against the candidate that makes most energy"
            ),
            Origin::Computed,
        )?;
    } else {
        w.formula(
            "Price of energy bought in",
            &n.name("BoughtInEnergyPrice"),
            "=EnergyValue",
            super::writer::money_f64(price),
            &format!("{currency}/MWh"),
            "economics.energy_value",
        )?;
    }
    Ok(())
}

/// The candidate's operating conditions of the year (dispatch blocks,
/// weather records or bins, profile hours): load, output and heat rate of
/// its fixed machine there (part load from the machine or the scenario's
/// part-load table) and hours, as computed constants.
fn bins(
    w: &mut Writer,
    scenario: &crate::scenario::Scenario,
    site: &crate::analysis::site::SitePerformance,
) -> Result<()> {
    let conditions = crate::analysis::operation::conditions(scenario);
    let points: Vec<(f64, f64, f64, f64)> = conditions
        .iter()
        .zip(site.points.iter())
        .map(|(c, p)| {
            (
                c.load_fraction,
                c.load_fraction * p.available_kw,
                p.heat_rate_kj_per_kwh,
                c.hours,
            )
        })
        .collect();
    let s = w.styles;
    let header = [
        "Load",
        "Net output, kW",
        "Heat rate, kJ/kWh LHV",
        "Hours per year",
    ];
    w.sheet
        .write_string_with_format(w.row, 0, "Operating points of the year (computed)", &s.text)
        .map_err(xlsx_error)?;
    for (k, text) in header.iter().enumerate() {
        w.sheet
            .write_string_with_format(w.row, 1 + k as u16, *text, &s.header)
            .map_err(xlsx_error)?;
    }
    w.row += 1;
    for (load, output_kw, heat_rate, hours) in points {
        w.sheet
            .write_number_with_format(w.row, 1, load, &s.percent.computed)
            .and_then(|x| x.write_number_with_format(w.row, 2, output_kw, &s.number.computed))
            .and_then(|x| x.write_number_with_format(w.row, 3, heat_rate, &s.number.computed))
            .and_then(|x| x.write_number_with_format(w.row, 4, hours, &s.number.computed))
            .map_err(xlsx_error)?;
        w.row += 1;
    }
    Ok(())
}
