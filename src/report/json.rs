//! JSON renderer: one object, money as decimal strings, other figures as
//! numbers, always in SI units (the key names carry the unit).

use super::model::{CandidateView, Model, PaybackView, PerformanceView};
use super::Renderer;
use serde_json::{json, Value};

/// Renders the comparison as one JSON object (see the README for the keys).
pub struct JsonRenderer;

impl Renderer for JsonRenderer {
    fn render(&self, model: &Model) -> crate::Result<Vec<u8>> {
        let mut text = serde_json::to_string_pretty(&to_value(model))
            .map_err(|e| crate::Error::Internal(format!("JSON encoding failed: {e}")))?;
        text.push('\n');
        Ok(text.into_bytes())
    }
}

/// The JSON document of a comparison.
pub fn to_value(model: &Model) -> Value {
    let mut document = json!({
        "scenario": {
            "title": model.meta.title,
            "baseline": model.meta.baseline_id,
            "currency": model.meta.currency,
            "file": model.meta.scenario_file,
            "sha256": model.meta.scenario_sha256,
            "brayfin_version": model.meta.brayfin_version,
        },
        "decision": model.decision,
        "candidates": model.candidates.iter().map(candidate).collect::<Vec<_>>(),
        "warnings": model.warnings,
        "information": model.information,
        "method": model.method,
    });
    if !model.sensitivity.is_empty() {
        document["sensitivity"] = json!(model.sensitivity);
    }
    if let Some(risk) = &model.risk {
        document["risk"] = json!(risk);
    }
    document
}

fn payback_years(payback: PaybackView) -> Value {
    match payback {
        PaybackView::Years(years) => json!(years),
        PaybackView::NeverWithinLife => json!("never within life"),
        PaybackView::NotApplicable => Value::Null,
    }
}

/// A candidate's `performance`; `implied` only for a bid that states a
/// datasheet, so the JSON of a scenario without one is unchanged.
fn performance(p: &PerformanceView) -> Value {
    let mut value = json!({
            "net_output_kw": p.net_output_kw,
            "heat_rate_kj_per_kwh": p.heat_rate_kj_per_kwh,
            "heat_rate_btu_per_kwh": p.heat_rate_btu_per_kwh,
            "heat_rate_basis": "LHV",
            "thermal_efficiency": p.thermal_efficiency,
            "exhaust_temperature_k": p.exhaust_temperature_k,
            "air_flow_kg_per_s": p.air_flow_kg_per_s,
            "fuel_flow_kg_per_s": p.fuel_flow_kg_per_s,
            "co2_kg_per_mwh": p.co2_kg_per_mwh,
            "site_year": {
                "run_hours": p.site_year.run_hours,
                "energy_mwh": p.site_year.energy_mwh,
                "fuel_energy_gj_lhv": p.site_year.fuel_energy_gj_lhv,
                "mean_heat_rate_kj_per_kwh": p.site_year.mean_heat_rate_kj_per_kwh,
                "capacity_output_kw": p.site_year.capacity_output_kw,
                "capacity_temperature_k": p.site_year.capacity_temperature_k,
            },
    });
    if let (Some(implied), Value::Object(map)) = (&p.implied, &mut value) {
        map.insert(
            "implied".into(),
            json!({
                "compressor_polytropic_efficiency": implied.compressor_polytropic_efficiency,
                "turbine_polytropic_efficiency": implied.turbine_polytropic_efficiency,
                "firing_temperature_k": implied.firing_temperature_k,
                "turbine_cooling": implied.turbine_cooling,
                "air_flow_kg_per_s": implied.air_flow_kg_per_s,
                "loss_remainder_fraction": implied.loss_remainder_fraction,
                "verdict": implied.verdict,
                "reasons": implied.reasons,
                "assumptions": implied.assumptions,
            }),
        );
    }
    value
}

fn candidate(c: &CandidateView) -> Value {
    let p = &c.performance;
    let e = &c.economics;
    json!({
        "id": c.id,
        "label": c.label,
        "is_baseline": c.is_baseline,
        "gas_model": c.gas_model,
        "performance": performance(p),
        "economics": {
            "capital_cost": e.capital_cost,
            "lifecycle_cost": e.lifecycle_cost,
            "levelized_cost_per_mwh": e.levelized_cost_per_mwh,
            "net_savings_vs_baseline": e.net_savings_vs_baseline,
            "break_even_premium": e.break_even_premium,
            "premium_asked": e.premium_asked,
            "savings_to_investment_ratio": e.savings_to_investment_ratio,
            "adjusted_irr": e.adjusted_irr,
            "simple_payback_years": payback_years(e.simple_payback),
            "discounted_payback_years": payback_years(e.discounted_payback),
            "break_even_fuel_price_per_gj": e.break_even_fuel_price,
            "value_per_point": e.value_per_point,
            "value_per_kj_per_kwh": e.value_per_kj_per_kwh,
            "value_per_kj_per_kwh_full_load": e.value_per_kj_per_kwh_full_load,
            "dispatch_heat_rate_ratio": e.dispatch_heat_rate_ratio,
            "value_per_kw": e.value_per_kw,
        },
        "verdict": c.verdict,
        "cost_breakdown": c.cost_breakdown,
        "cycle": c.cycle,
        "ledger": c.ledger,
        "ledger_total": c.ledger_total,
    })
}
