//! Performance of each candidate at site conditions: headline figures,
//! specific works and heat, the first-law residual, and the state table;
//! then what each bid's datasheet implies.

use super::{pdf_units, Ctx};
use crate::report::format;
use crate::report::model::{CandidateView, ImpliedView, Units};
use crate::report::pdf::document::Composer;
use crate::report::pdf::fonts::Face;
use crate::report::pdf::table::{draw_table, Column, TableStyle};

/// kJ/kg per Btu/lb: 2.326 exactly, by the definition of the International
/// Table Btu (NIST SP 811, 2008, Appendix B.8).
const KJ_PER_KG_PER_BTU_PER_LB: f64 = 2.326;

/// kJ/(kg·K) per Btu/(lb·°R): 4.1868 exactly (NIST SP 811, 2008, Appendix
/// B.8).
const KJ_PER_KG_K_PER_BTU_PER_LB_R: f64 = 4.1868;

/// Unit of specific energy in `units`.
fn specific_energy_unit(units: Units) -> &'static str {
    match units {
        Units::Si => "kJ/kg",
        Units::Us => "Btu/lb",
    }
}

/// Unit of specific entropy in `units`.
fn specific_entropy_unit(units: Units) -> &'static str {
    match units {
        Units::Si => "kJ/(kg·K)",
        Units::Us => "Btu/(lb·°R)",
    }
}

/// A specific energy given in kJ/kg, in the display unit system.
fn specific_energy(kj_per_kg: f64, units: Units) -> f64 {
    match units {
        Units::Si => kj_per_kg,
        Units::Us => kj_per_kg / KJ_PER_KG_PER_BTU_PER_LB,
    }
}

/// A specific entropy given in kJ/(kg·K), in the display unit system.
fn specific_entropy(kj_per_kg_k: f64, units: Units) -> f64 {
    match units {
        Units::Si => kj_per_kg_k,
        Units::Us => kj_per_kg_k / KJ_PER_KG_K_PER_BTU_PER_LB_R,
    }
}

/// Specific energy (given in kJ/kg) with its unit, in the display unit
/// system.
fn specific_energy_text(value: f64, units: Units) -> String {
    format!(
        "{} {}",
        format::number(specific_energy(value, units), 1),
        specific_energy_unit(units)
    )
}

/// The headline rows (name, value) of one candidate.
fn headline(ctx: &Ctx, c: &CandidateView) -> Vec<(String, String)> {
    let l = ctx.labels;
    let units = ctx.model.meta.units;
    let p = &c.performance;
    let k = &c.cycle;
    let mut rows = vec![
        (l.gas_model.clone(), c.gas_model.clone()),
        (
            l.net_output.clone(),
            format!("{} kW", format::number(p.net_output_kw, 0)),
        ),
        (
            l.heat_rate.clone(),
            pdf_units(format::heat_rate(
                p.heat_rate_kj_per_kwh,
                p.heat_rate_btu_per_kwh,
                units,
            )),
        ),
        (
            l.thermal_efficiency.clone(),
            format::percent(p.thermal_efficiency, 2),
        ),
        (
            l.exhaust_temperature.clone(),
            pdf_units(format::temperature(p.exhaust_temperature_k, units)),
        ),
        (
            l.air_flow.clone(),
            format::mass_flow(p.air_flow_kg_per_s, units),
        ),
        (
            l.fuel_flow.clone(),
            // kg/s (SI) or lb/h (US), as the trade quotes fuel.
            format::with_unit(
                format::Quantity::FuelMassFlow,
                p.fuel_flow_kg_per_s,
                units,
                match units {
                    Units::Si => 3,
                    Units::Us => 0,
                },
            ),
        ),
        (
            l.co2_intensity.clone(),
            format!("{} kg/MWh", format::number(p.co2_kg_per_mwh, 1)),
        ),
        (
            l.compressor_work.clone(),
            specific_energy_text(k.compressor_work_kj_per_kg, units),
        ),
        (
            l.turbine_work.clone(),
            specific_energy_text(k.turbine_work_kj_per_kg, units),
        ),
        (
            l.net_work.clone(),
            specific_energy_text(k.net_work_kj_per_kg, units),
        ),
        (
            l.heat_input.clone(),
            specific_energy_text(k.heat_input_kj_per_kg, units),
        ),
        (
            l.heat_rejected.clone(),
            specific_energy_text(k.heat_rejected_kj_per_kg, units),
        ),
        (
            l.back_work_ratio.clone(),
            format::back_work_ratio(k.back_work_ratio),
        ),
        (
            l.energy_residual.clone(),
            format!(
                "{:.2e} {}",
                specific_energy(k.energy_balance_residual_kj_per_kg, units),
                specific_energy_unit(units)
            ),
        ),
    ];
    if let Some(far) = k.fuel_air_ratio {
        rows.push((l.fuel_air_ratio.clone(), format!("{far:.5}")));
    }
    rows.push((
        l.levelized_cost.clone(),
        format!(
            "{} {}/MWh",
            format::grouped(c.economics.levelized_cost_per_mwh, 2),
            ctx.model.meta.currency
        ),
    ));
    rows
}

fn state_rows(c: &CandidateView, units: Units) -> Vec<Vec<String>> {
    c.cycle
        .states
        .iter()
        .map(|s| {
            vec![
                s.id.clone(),
                s.name.clone(),
                pdf_units(format::temperature(s.temperature_k, units)),
                format::pressure(s.pressure_kpa, units),
                format::number(specific_energy(s.enthalpy_kj_per_kg, units), 1),
                format!("{:.4}", specific_entropy(s.entropy_kj_per_kg_k, units)),
            ]
        })
        .collect()
}

/// The table "What each bid implies": one row per bid that states a
/// datasheet (verdict, implied polytropic efficiencies, firing temperature,
/// cooling, air flow, loss remainder), each reason as a bullet, then the
/// fit's assumptions once each. Nothing for a scenario without datasheets.
fn implied_table(ctx: &Ctx, composer: &mut Composer) {
    let l = ctx.labels;
    let units = ctx.model.meta.units;
    let bids: Vec<(&CandidateView, &ImpliedView)> = ctx
        .model
        .candidates
        .iter()
        .filter_map(|c| c.performance.implied.as_ref().map(|i| (c, i)))
        .collect();
    if bids.is_empty() {
        return;
    }
    composer.heading(&l.implied, 2, 50.0);
    composer.paragraph(&l.implied_note, 9.0, Face::Regular, 0.0);
    let columns = vec![
        Column::left(l.candidate.clone()),
        Column::left(l.implied_verdict.clone()),
        Column::right(l.implied_compressor.clone()),
        Column::right(l.implied_turbine.clone()),
        Column::right(l.implied_firing.clone()),
        Column::right(l.implied_cooling.clone()),
        Column::right(l.implied_air_flow.clone()),
        Column::right(l.implied_remainder.clone()),
    ];
    let dash = || "–".to_string();
    let rows: Vec<Vec<String>> = bids
        .iter()
        .map(|(c, i)| {
            vec![
                c.label.clone(),
                i.verdict.clone(),
                i.compressor_polytropic_efficiency
                    .map_or_else(dash, |v| format!("{v:.3}")),
                i.turbine_polytropic_efficiency
                    .map_or_else(dash, |v| format!("{v:.3}")),
                i.firing_temperature_k
                    .map_or_else(dash, |t| pdf_units(format::temperature(t, units))),
                i.turbine_cooling
                    .map_or_else(dash, |v| format!("{:.1} %", v * 100.0)),
                format::with_unit(format::Quantity::MassFlow, i.air_flow_kg_per_s, units, 1),
                format!("{:.2} %", i.loss_remainder_fraction * 100.0),
            ]
        })
        .collect();
    let style = TableStyle {
        size_pt: 8.0,
        max_lines: 2,
        bold_first_column: true,
        header: true,
    };
    draw_table(composer, &columns, &rows, &style);
    for (c, i) in &bids {
        for reason in &i.reasons {
            composer.bullet(&pdf_units(format!("{}: {reason}", c.label)), 8.0);
        }
    }
    let mut assumptions: Vec<&String> = Vec::new();
    for (_, i) in &bids {
        for a in &i.assumptions {
            if !assumptions.contains(&a) {
                assumptions.push(a);
            }
        }
    }
    if !assumptions.is_empty() {
        composer.paragraph(&l.implied_assumptions, 8.0, Face::Bold, 0.0);
        for a in assumptions {
            composer.bullet(&pdf_units(a.clone()), 8.0);
        }
    }
}

/// Lay out the performance section.
pub fn performance(ctx: &Ctx, composer: &mut Composer) {
    let l = ctx.labels;
    // The appendix flows on under the cautions that end the briefing (a
    // page of its own would leave the cautions nearly alone on theirs).
    composer.heading(&l.appendix, 1, 80.0);
    composer.paragraph(&l.appendix_note, 9.0, Face::Regular, 0.0);
    composer.heading(&l.performance, 1, 60.0);
    for c in &ctx.model.candidates {
        composer.heading(&c.label, 2, 50.0);
        let pairs = headline(ctx, c);
        let half = pairs.len().div_ceil(2);
        let rows: Vec<Vec<String>> = (0..half)
            .map(|i| {
                let (a, b) = &pairs[i];
                let (c2, d) = pairs.get(i + half).cloned().unwrap_or_default();
                vec![a.clone(), b.clone(), c2, d]
            })
            .collect();
        let columns = vec![
            Column::left(String::new()),
            Column::right(String::new()),
            Column::left(String::new()),
            Column::right(String::new()),
        ];
        let pairs_style = TableStyle {
            header: false,
            ..TableStyle::default()
        };
        draw_table(composer, &columns, &rows, &pairs_style);
        let columns = vec![
            Column::left(l.state.clone()),
            Column::left(l.state_name.clone()),
            Column::right(l.temperature.clone()),
            Column::right(l.pressure.clone()),
            Column::right(format!(
                "{}, {}",
                l.enthalpy,
                specific_energy_unit(ctx.model.meta.units)
            )),
            Column::right(format!(
                "{}, {}",
                l.entropy,
                specific_entropy_unit(ctx.model.meta.units)
            )),
        ];
        draw_table(
            composer,
            &columns,
            &state_rows(c, ctx.model.meta.units),
            &TableStyle::default(),
        );
    }
    implied_table(ctx, composer);
    if !ctx.model.pricing.is_empty() {
        composer.heading(&ctx.labels.pricing, 2, 30.0);
        for line in &ctx.model.pricing {
            composer.bullet(&pdf_units(line.clone()), 8.0);
        }
    }
}
