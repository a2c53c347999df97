//! The short texts of the briefing (headings, table headers, axis titles)
//! read from the `headings.j2` template, one field per key, so a missing or
//! misspelt key is caught when the template is loaded, not on the page.

use crate::report::wording::key_lines;
use crate::{Error, Result};

macro_rules! labels {
    ($($key:ident),+ $(,)?) => {
        /// Every short text of the briefing, by key of `headings.j2`.
        #[derive(Debug, Clone, Default)]
        pub struct Labels {
            $(
                #[doc = concat!("Text of the `", stringify!($key), "` key.")]
                pub $key: String,
            )+
        }

        impl Labels {
            /// The keys `headings.j2` must define, in order.
            pub const KEYS: &'static [&'static str] = &[$(stringify!($key)),+];

            /// Read the rendered `headings.j2` (`origin` names it in
            /// messages). Every key must be present exactly as listed in
            /// [`Labels::KEYS`]; an unknown key is an error too.
            pub fn parse(origin: &str, text: &str) -> Result<Self> {
                let mut map = key_lines(origin, text)?;
                let mut labels = Labels::default();
                $(
                    labels.$key = map.remove(stringify!($key)).ok_or_else(|| {
                        Error::Input(format!(
                            "template {origin} lacks the key `{}`; it must define: {}",
                            stringify!($key),
                            Self::KEYS.join(", ")
                        ))
                    })?;
                )+
                if let Some(unknown) = map.keys().next() {
                    return Err(Error::Input(format!(
                        "template {origin} defines the unknown key `{unknown}`; valid keys: {}",
                        Self::KEYS.join(", ")
                    )));
                }
                Ok(labels)
            }
        }
    };
}

labels! {
    report_title,
    prepared_for,
    prepared_by,
    study_date,
    site,
    scenario_file,
    fuel_price,
    recommendation,
    key_figures,
    figure,
    candidate,
    capital_cost,
    heat_rate,
    lifecycle_cost,
    net_savings,
    break_even_premium,
    premium_asked,
    discounted_payback,
    rated_output,
    break_even_fuel_price,
    headroom,
    verdicts,
    key_assumptions,
    assumption,
    base_value,
    swing,
    no_key_assumptions,
    evaluation_factors,
    factor_heat_rate,
    factor_heat_rate_us,
    factor_output,
    factor_compressor,
    factor_turbine,
    factor_regenerator,
    factor_dispatch_ratio,
    factors_note,
    charts,
    savings_chart,
    savings_axis,
    years_axis,
    payback_marker,
    fuel_price_chart,
    fuel_price_axis,
    premium_axis,
    scenario_price,
    asked_marker,
    breakdown_chart,
    difference_chart,
    difference_axis,
    present_value_axis,
    capital,
    fuel,
    operation_and_maintenance,
    overhauls,
    carbon,
    bought_in,
    residual,
    guarantee_settlement,
    ts_chart,
    temperature_axis,
    entropy_axis,
    ts_note,
    sensitivity,
    sensitivity_axis,
    low_value,
    high_value,
    default_range_note,
    risk,
    risk_axis,
    samples_axis,
    risk_table_mean,
    risk_probability,
    risk_samples,
    risk_note,
    risk_contract,
    briefing_damages,
    briefing_bonus,
    risk_seed,
    risk_redraws,
    performance,
    state,
    state_name,
    temperature,
    pressure,
    enthalpy,
    entropy,
    net_output,
    thermal_efficiency,
    exhaust_temperature,
    air_flow,
    fuel_flow,
    co2_intensity,
    gas_model,
    compressor_work,
    turbine_work,
    net_work,
    heat_input,
    heat_rejected,
    back_work_ratio,
    energy_residual,
    fuel_air_ratio,
    levelized_cost,
    appendix,
    appendix_note,
    assumptions,
    inputs,
    input_key,
    input_value,
    input_unit,
    input_source,
    not_stated,
    sources_note,
    capital_payments,
    every_candidate,
    defaults,
    no_defaults,
    warnings,
    no_warnings,
    ledger,
    ledger_note,
    continued,
    ledger_year,
    ledger_hours,
    ledger_energy,
    ledger_fuel_energy,
    ledger_fuel_cost,
    ledger_carbon,
    ledger_fixed_om,
    ledger_variable_om,
    ledger_overhaul,
    ledger_bought_in,
    ledger_capital,
    ledger_residual,
    ledger_settlement,
    ledger_settlement_note,
    ledger_total,
    ledger_discount_factor,
    ledger_present_value,
    method,
    references,
    cautions,
    traceability,
    version,
    scenario_sha256,
    generated_at,
    implied,
    implied_note,
    implied_verdict,
    implied_compressor,
    implied_turbine,
    implied_firing,
    implied_cooling,
    implied_air_flow,
    implied_remainder,
    implied_assumptions,
    site_performance,
    site_note,
    site_output_chart,
    site_heat_rate_chart,
    site_part_load_chart,
    site_temperature_axis,
    site_output_axis,
    site_heat_rate_axis,
    site_load_axis,
    site_mean_marker,
    site_year_table,
    site_energy,
    site_fuel,
    site_run_hours,
    site_starts,
    site_starts_not_modelled,
    site_hours_by_temperature,
    site_temperature_bin,
    site_profile_note,
    site_part_load_table_note,
    site_not_fixed,
    pricing,
}
