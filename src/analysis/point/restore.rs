//! Copying a section of the base scenario back over a worker's copy without
//! allocating: plain fields are copied, and text and lists reuse the memory
//! they already have (`clone_from`). Every struct is destructured in full,
//! so a field added to the scenario types stops the build here until it is
//! copied too.

use crate::scenario::{Candidate, CandidateCosts, FuelSpec, Operation, Site};

/// `dst` becomes equal to `src`.
pub(super) fn site(dst: &mut Site, src: &Site) {
    let Site {
        name,
        ambient_temperature_k,
        ambient_pressure_kpa,
        elevation_m,
        relative_humidity,
        weather,
    } = src;
    dst.name.clone_from(name);
    dst.ambient_temperature_k = *ambient_temperature_k;
    dst.ambient_pressure_kpa = *ambient_pressure_kpa;
    dst.relative_humidity = *relative_humidity;
    dst.elevation_m = *elevation_m;
    dst.weather.clone_from(weather);
}

/// `dst` becomes equal to `src`.
pub(super) fn fuel(dst: &mut FuelSpec, src: &FuelSpec) {
    let FuelSpec {
        name,
        composition,
        price_per_gj,
        price_basis,
        escalation,
        price_path,
        price_written,
    } = src;
    dst.name.clone_from(name);
    if dst.composition != *composition {
        dst.composition.clone_from(composition);
    }
    dst.price_per_gj = *price_per_gj;
    dst.price_basis = *price_basis;
    dst.escalation = *escalation;
    dst.price_path.clone_from(price_path);
    dst.price_written.clone_from(price_written);
}

/// `dst` becomes equal to `src`.
pub(super) fn operation(dst: &mut Operation, src: &Operation) {
    let Operation {
        hours_per_year,
        starts_per_year,
        dispatch,
        profile,
    } = src;
    dst.hours_per_year = *hours_per_year;
    dst.starts_per_year = *starts_per_year;
    dst.dispatch.clone_from(dispatch);
    dst.profile.clone_from(profile);
}

fn costs(dst: &mut CandidateCosts, src: &CandidateCosts) {
    let CandidateCosts {
        fixed_om_per_kw_year,
        variable_om_per_mwh,
        overhaul_interval_hours,
        overhaul_cost,
        hours_per_start,
        overhaul_starts,
        overhaul_outage_days,
        output_degradation_per_year,
        start_fuel_gj,
        start_cost,
        service_fee_per_fired_hour,
        service_fee_per_start,
        degradation_per_year,
        recoverable_fraction,
        residual_value,
        construction_schedule,
    } = src;
    dst.fixed_om_per_kw_year = *fixed_om_per_kw_year;
    dst.variable_om_per_mwh = *variable_om_per_mwh;
    dst.overhaul_interval_hours = *overhaul_interval_hours;
    dst.overhaul_cost = *overhaul_cost;
    dst.hours_per_start = *hours_per_start;
    dst.overhaul_starts = *overhaul_starts;
    dst.overhaul_outage_days = *overhaul_outage_days;
    dst.output_degradation_per_year = *output_degradation_per_year;
    dst.start_fuel_gj = *start_fuel_gj;
    dst.start_cost = *start_cost;
    dst.service_fee_per_fired_hour = *service_fee_per_fired_hour;
    dst.service_fee_per_start = *service_fee_per_start;
    dst.degradation_per_year = *degradation_per_year;
    dst.recoverable_fraction = *recoverable_fraction;
    dst.residual_value = *residual_value;
    dst.construction_schedule.clone_from(construction_schedule);
}

/// `dst` becomes equal to `src`.
pub(super) fn candidate(dst: &mut Candidate, src: &Candidate) {
    let Candidate {
        id,
        label,
        capital_cost,
        net_output_kw,
        gas_model,
        pressure_ratio,
        turbine_inlet_temperature_k,
        compressor_efficiency,
        turbine_efficiency,
        efficiency_basis,
        inlet_pressure_loss,
        exhaust_pressure_loss,
        combustor_pressure_loss,
        combustion_efficiency,
        mechanical_efficiency,
        generator_efficiency,
        auxiliary_load_fraction,
        regenerator,
        intercooler,
        reheat,
        turbine_cooling,
        rating,
        control,
        part_load,
        ambient_correction,
        fitted,
        costs: src_costs,
        guarantee,
    } = src;
    dst.id.clone_from(id);
    dst.label.clone_from(label);
    dst.capital_cost = *capital_cost;
    dst.net_output_kw = *net_output_kw;
    dst.gas_model = *gas_model;
    dst.pressure_ratio = *pressure_ratio;
    dst.turbine_inlet_temperature_k = *turbine_inlet_temperature_k;
    dst.compressor_efficiency = *compressor_efficiency;
    dst.turbine_efficiency = *turbine_efficiency;
    dst.efficiency_basis = *efficiency_basis;
    dst.inlet_pressure_loss = *inlet_pressure_loss;
    dst.exhaust_pressure_loss = *exhaust_pressure_loss;
    dst.combustor_pressure_loss = *combustor_pressure_loss;
    dst.combustion_efficiency = *combustion_efficiency;
    dst.mechanical_efficiency = *mechanical_efficiency;
    dst.generator_efficiency = *generator_efficiency;
    dst.auxiliary_load_fraction = *auxiliary_load_fraction;
    dst.regenerator = *regenerator;
    dst.intercooler = *intercooler;
    dst.reheat = *reheat;
    dst.turbine_cooling = *turbine_cooling;
    dst.rating = *rating;
    dst.control = *control;
    dst.part_load.clone_from(part_load);
    dst.ambient_correction.clone_from(ambient_correction);
    dst.fitted.clone_from(fitted);
    costs(&mut dst.costs, src_costs);
    dst.guarantee = *guarantee;
}

#[cfg(test)]
mod tests {
    use crate::scenario::parse;

    #[test]
    fn restored_sections_equal_the_base() {
        let text = include_str!("../../../tests/fixtures/corvel-bay-blocks.toml");
        let Ok(loaded) = parse(text, "demo.toml") else {
            panic!("the demo must load");
        };
        let base = &loaded.scenario;
        let mut changed = base.clone();
        for (key, value) in [
            ("fuel.price", 9.0),
            ("operation.hours_per_year", 1234.0),
            ("site.ambient_temperature", 300.0),
            ("candidate[premium].turbine_efficiency", 0.8),
            ("candidate.costs.fixed_om", 20.0),
        ] {
            assert!(changed.set_numeric(key, value).is_ok(), "{key}");
        }
        assert_ne!(&changed, base);
        super::site(&mut changed.site, &base.site);
        super::fuel(&mut changed.fuel, &base.fuel);
        super::operation(&mut changed.operation, &base.operation);
        for (dst, src) in changed.candidates.iter_mut().zip(&base.candidates) {
            super::candidate(dst, src);
        }
        assert_eq!(&changed, base);
    }
}
