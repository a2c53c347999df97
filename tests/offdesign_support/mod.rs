//! Machines for the off-design tests: the demo candidates, mapped to
//! engine configurations the way `analysis::engine` maps a candidate.

#![allow(dead_code)]

use brayfin::analysis::engine::{engine_config_of, fuel_of, gas_model_of};
use brayfin::cycle::{EngineConfig, GasModel};
use brayfin::fuel::Fuel;
use brayfin::offdesign::{Ambient, Control, Machine};
use brayfin::scenario;
use std::path::Path;

/// Each candidate of a demo scenario: id, engine, gas model, fuel.
pub fn demo_candidates(file: &str) -> Vec<(String, EngineConfig, GasModel, Fuel)> {
    let path = Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("scenarios")
        .join(file);
    let loaded = scenario::load(&path).expect("demo scenario loads");
    let s = &loaded.scenario;
    let fuel = fuel_of(&s.fuel).expect("demo fuel");
    s.candidates
        .iter()
        .map(|c| {
            (
                c.id.clone(),
                engine_config_of(c, &s.site),
                gas_model_of(&c.gas_model),
                fuel.clone(),
            )
        })
        .collect()
}

/// A demo candidate fixed at the dry ISO rating with `control`.
pub fn demo_machine(file: &str, id: &str, control: Control) -> Machine {
    let (_, config, gas, fuel) = demo_candidates(file)
        .into_iter()
        .find(|(cid, ..)| cid == id)
        .expect("candidate present");
    Machine::calibrate(&config, 0.0, dry_iso(), control, gas, &fuel).expect("calibrates")
}

/// ISO 3977-2 temperature and pressure, dry air.
pub fn dry_iso() -> Ambient {
    Ambient::dry(288.15, 101.325)
}
