//! `brayfin offdesign`'s computation: each candidate's fixed machine over a
//! grid of ambient temperatures and loads at one ambient pressure and
//! humidity. Every point is solved before anything is returned, so a
//! refusal anywhere leaves nothing printed.

use super::machine::{humidity_for, machine_of};
use crate::fuel::Fuel;
use crate::offdesign::{Ambient, Load, OffDesignError, OffDesignPoint};
use crate::scenario::Scenario;

/// Default ambient temperatures: −10 °C to 45 °C in 5 K steps, K.
pub fn default_temperatures_k() -> Vec<f64> {
    (0..12).map(|i| 263.15 + 5.0 * f64::from(i)).collect()
}

/// Default loads of a machine: 100 % down to its minimum load in 10 %
/// steps; the minimum load itself closes the list when it is not on a
/// step (so the turndown end is always shown).
pub fn default_loads(minimum_load: f64) -> Vec<f64> {
    let mut loads: Vec<f64> = (0..10)
        .map(|i| 1.0 - 0.1 * f64::from(i))
        .filter(|l| *l >= minimum_load - 1e-9)
        .map(|l| (l * 1e9).round() / 1e9)
        .collect();
    if loads.last().is_none_or(|l| (l - minimum_load).abs() > 1e-9) {
        loads.push(minimum_load);
    }
    loads
}

/// What to solve.
#[derive(Debug, Clone, PartialEq)]
pub struct GridRequest {
    /// Only the candidate with this id (default: every candidate).
    pub candidate: Option<String>,
    /// Ambient temperatures, K (default [`default_temperatures_k`]).
    pub temperatures_k: Option<Vec<f64>>,
    /// Loads, fractions of base load at each ambient (default
    /// [`default_loads`] of each candidate's minimum load).
    pub loads: Option<Vec<f64>>,
    /// Ambient pressure, kPa.
    pub pressure_kpa: f64,
    /// Relative humidity, 0 to 1 (a cold-air candidate runs dry, see
    /// [`humidity_for`]).
    pub relative_humidity: f64,
}

/// One candidate's grid, temperature-major (every load at the first
/// temperature, then the next).
#[derive(Debug, Clone, PartialEq)]
pub struct CandidateGrid {
    /// Candidate id.
    pub id: String,
    /// Candidate label.
    pub label: String,
    /// Rated net output, kW, at the candidate's rating condition.
    pub rated_net_output_kw: f64,
    /// The solved points.
    pub points: Vec<OffDesignPoint>,
}

/// Why the grid could not be given.
#[derive(Debug, Clone, PartialEq)]
pub enum GridError {
    /// `--candidate` names no candidate; the valid ids.
    UnknownCandidate {
        /// The id asked for.
        id: String,
        /// The scenario's ids.
        valid: Vec<String>,
    },
    /// Candidate `index` cannot be built as a fixed machine.
    Calibration {
        /// Index of the candidate in the scenario.
        index: usize,
        /// The refusal (boxed: the error type is large).
        error: Box<OffDesignError>,
    },
    /// Candidate `index` has no operating point at one grid point.
    Point {
        /// Index of the candidate in the scenario.
        index: usize,
        /// The ambient of the point.
        ambient: Ambient,
        /// The load of the point.
        load: f64,
        /// The refusal (boxed: the error type is large).
        error: Box<OffDesignError>,
    },
}

/// Solve the grid of `request` for the scenario's candidates.
pub fn solve_grid(
    scenario: &Scenario,
    fuel: &Fuel,
    request: &GridRequest,
) -> Result<Vec<CandidateGrid>, GridError> {
    let indices: Vec<usize> = match &request.candidate {
        None => (0..scenario.candidates.len()).collect(),
        Some(id) => match scenario.candidates.iter().position(|c| &c.id == id) {
            Some(i) => vec![i],
            None => {
                return Err(GridError::UnknownCandidate {
                    id: id.clone(),
                    valid: scenario.candidates.iter().map(|c| c.id.clone()).collect(),
                })
            }
        },
    };
    let temperatures = request
        .temperatures_k
        .clone()
        .unwrap_or_else(default_temperatures_k);
    let mut grids = Vec::with_capacity(indices.len());
    for index in indices {
        let candidate = &scenario.candidates[index];
        let machine = machine_of(candidate, &scenario.site, fuel).map_err(|error| {
            GridError::Calibration {
                index,
                error: Box::new(error),
            }
        })?;
        let loads = request
            .loads
            .clone()
            .unwrap_or_else(|| default_loads(candidate.control.minimum_load));
        let mut points = Vec::with_capacity(temperatures.len() * loads.len());
        for &temperature_k in &temperatures {
            let ambient = Ambient {
                temperature_k,
                pressure_kpa: request.pressure_kpa,
                relative_humidity: humidity_for(candidate, request.relative_humidity),
            };
            for &load in &loads {
                let point =
                    machine
                        .solve(ambient, Load(load))
                        .map_err(|error| GridError::Point {
                            index,
                            ambient,
                            load,
                            error: Box::new(error),
                        })?;
                points.push(point);
            }
        }
        grids.push(CandidateGrid {
            id: candidate.id.clone(),
            label: candidate.label.clone(),
            rated_net_output_kw: candidate.net_output_kw,
            points,
        });
    }
    Ok(grids)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn default_grid_is_twelve_temperatures_by_eight_loads_at_thirty_percent() {
        let t = default_temperatures_k();
        assert_eq!(t.len(), 12);
        assert!((t[0] - 263.15).abs() < 1e-9 && (t[11] - 318.15).abs() < 1e-9);
        let l = default_loads(0.3);
        assert_eq!(l, vec![1.0, 0.9, 0.8, 0.7, 0.6, 0.5, 0.4, 0.3]);
        assert_eq!(default_loads(0.35).last(), Some(&0.35));
        assert_eq!(default_loads(1.0), vec![1.0]);
    }
}
