//! Sensitivity ranking: each uncertain input swung to a low and a high
//! value, the whole chain re-solved, and the change in each candidate's net
//! savings against the baseline recorded; ranked by the largest swing.
//!
//! The range of an input is, in order of preference: the `swing` the
//! scenario states; the 10th and 90th percentiles of its distribution
//! (uniform and triangular: their closed-form quantiles; normal and
//! lognormal: mean ± 1.2816 σ, z(0.90) = 1.281 55 from standard normal
//! tables), clipped to its truncation; or ±20 % of the base value, stated as
//! a default. Without an `[uncertainty]` section the fuel price, escalation,
//! operating hours, discount rate, carbon price and energy value (the price
//! of output bought elsewhere) are swung ±20 % (those whose base value is
//! not zero).

use super::compare::Study;
use super::engine::fuel_of;
use super::evaluate::{ledger_inputs, output_reference_of, solve, year_of, Solved};
use super::operation::conditions;
use crate::finance::{compare_summaries, summarize_ledger};
use crate::scenario::{Distribution, LoadedScenario, Scenario, UncertainInput};
use rust_decimal::Decimal;

/// z such that Φ(z) = 0.90 (standard normal tables).
const Z_90: f64 = 1.281_551_565_545;

/// Keys swung ±20 % when the scenario has no `[uncertainty]` section.
pub const DEFAULT_KEYS: [&str; 6] = [
    "fuel.price",
    "fuel.escalation",
    "operation.hours_per_year",
    "economics.discount_rate",
    "economics.carbon_price",
    "economics.energy_value",
];

/// Where a swing range came from.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum RangeSource {
    /// The scenario's `swing`.
    Stated,
    /// The 10th–90th percentiles of the input's distribution.
    Distribution,
    /// ±20 % of the base value (nothing stated).
    DefaultTwentyPercent,
}

/// One input's swing and the change it makes to each candidate.
#[derive(Debug, Clone)]
pub struct Swing {
    /// Dotted scenario key.
    pub key: String,
    /// Base value, internal unit.
    pub base: f64,
    /// Low value, internal unit.
    pub low: f64,
    /// High value, internal unit.
    pub high: f64,
    /// Where the range came from.
    pub source: RangeSource,
    /// Per non-baseline candidate: (id, change in net savings at low, at high).
    pub deltas: Vec<(String, Decimal, Decimal)>,
}

impl Swing {
    /// The largest absolute change over all candidates.
    pub fn magnitude(&self) -> Decimal {
        self.deltas
            .iter()
            .map(|(_, l, h)| l.abs().max(h.abs()))
            .max()
            .unwrap_or_default()
    }

    /// The largest one-sided change (at the low or at the high value,
    /// whichever moves more) in the net savings of candidate `id`; zero for
    /// a candidate the input does not move (the baseline, or another
    /// candidate's own key).
    pub fn magnitude_for(&self, id: &str) -> Decimal {
        if !self.moves(id) {
            return Decimal::ZERO;
        }
        self.deltas
            .iter()
            .filter(|(who, _, _)| who == id)
            .map(|(_, l, h)| l.abs().max(h.abs()))
            .max()
            .unwrap_or_default()
    }

    /// Whether the input can move candidate `id`: a key that belongs to one
    /// candidate (`candidate[ID].…`) moves only that one.
    pub fn moves(&self, id: &str) -> bool {
        self.key
            .strip_prefix("candidate[")
            .and_then(|rest| rest.split_once(']'))
            .is_none_or(|(owner, _)| owner == id)
    }
}

fn p10_p90(d: &Distribution) -> (f64, f64) {
    match *d {
        Distribution::Uniform { low, high } => (low + 0.1 * (high - low), low + 0.9 * (high - low)),
        Distribution::Triangular { low, mode, high } => {
            // Inverse CDF of the triangular distribution (closed form).
            let width = high - low;
            let split = if width > 0.0 {
                (mode - low) / width
            } else {
                0.5
            };
            let quantile = |p: f64| {
                if p < split {
                    low + (p * width * (mode - low)).sqrt()
                } else {
                    high - ((1.0 - p) * width * (high - mode)).sqrt()
                }
            };
            (quantile(0.1), quantile(0.9))
        }
        Distribution::Normal { mean, sigma } => (mean - Z_90 * sigma, mean + Z_90 * sigma),
        Distribution::LogNormal { mu, sigma } => {
            ((mu - Z_90 * sigma).exp(), (mu + Z_90 * sigma).exp())
        }
    }
}

fn range_of(input: &UncertainInput, base: f64) -> (f64, f64, RangeSource) {
    if let (Some(low), Some(high)) = (input.low, input.high) {
        return (low, high, RangeSource::Stated);
    }
    if let Some(d) = &input.distribution {
        let (mut low, mut high) = p10_p90(d);
        if let Some((t_low, t_high)) = input.truncate {
            low = low.clamp(t_low, t_high);
            high = high.clamp(t_low, t_high);
        }
        return (low, high, RangeSource::Distribution);
    }
    (0.8 * base, 1.2 * base, RangeSource::DefaultTwentyPercent)
}

/// Net savings of every non-baseline candidate (id, savings), or `None` if
/// any candidate cannot be solved or costed at these inputs.
pub fn net_savings(scenario: &Scenario, baseline: &str) -> Option<Vec<(String, Decimal)>> {
    net_savings_from(scenario, baseline, None)
}

/// Whether candidate `i` of `scenario` is, physically, the one of `base`:
/// same candidate, site, fuel composition, part-load table, year
/// conditions (ambient, humidity, load) and capacity temperature. Its
/// cycle and site performance can then be reused; only the year's hours
/// (and the money) may differ.
fn same_physics(scenario: &Scenario, base: &Scenario, i: usize) -> bool {
    let key = |s: &Scenario| {
        conditions(s)
            .iter()
            .map(|c| (c.temperature_k, c.relative_humidity, c.load_fraction))
            .collect::<Vec<_>>()
    };
    scenario.candidates.get(i) == base.candidates.get(i)
        && scenario.site == base.site
        && scenario.fuel.composition == base.fuel.composition
        && scenario.economics.capacity_temperature_k == base.economics.capacity_temperature_k
        && key(scenario) == key(base)
}

/// [`net_savings`], reusing the base study's solved candidates whose
/// physics the swing leaves alone (a money key, the hours, another
/// candidate's efficiency): the same numbers without re-solving each
/// machine over the year.
fn net_savings_from(
    scenario: &Scenario,
    baseline: &str,
    base: Option<(&Scenario, &Study)>,
) -> Option<Vec<(String, Decimal)>> {
    let fuel = fuel_of(&scenario.fuel).ok()?;
    let solved_all = scenario
        .candidates
        .iter()
        .enumerate()
        .map(|(i, c)| match base {
            Some((b, study)) if same_physics(scenario, b, i) => {
                let solved = &study.outcomes.get(i)?.solved;
                Some(Solved {
                    cycle: solved.cycle.clone(),
                    site: solved.site.clone(),
                    year: year_of(scenario, &solved.site),
                })
            }
            _ => solve(scenario, c, &fuel).ok(),
        })
        .collect::<Option<Vec<_>>>()?;
    let reference = output_reference_of(scenario, solved_all.iter().map(Some));
    let mut summaries = Vec::with_capacity(scenario.candidates.len());
    for (candidate, solved) in scenario.candidates.iter().zip(&solved_all) {
        let inputs = ledger_inputs(
            scenario,
            candidate,
            &fuel,
            (&solved.year, solved.site.capacity_output_kw),
            &reference,
        )
        .ok()?;
        summaries.push((candidate.id.clone(), summarize_ledger(&inputs).ok()?));
    }
    let base = summaries.iter().find(|(id, _)| id == baseline)?.1;
    summaries
        .iter()
        .filter(|(id, _)| id != baseline)
        .map(|(id, s)| Some((id.clone(), compare_summaries(s, &base).ok()?.net_savings)))
        .collect()
}

fn swung(
    loaded: &LoadedScenario,
    study: &Study,
    key: &str,
    value: f64,
) -> crate::Result<Vec<(String, Decimal)>> {
    let mut scenario = loaded.scenario.clone();
    scenario
        .set_numeric(key, value)
        .map_err(|e| loaded.error_at("uncertainty", &format!("sensitivity of `{key}`: {e}")))?;
    net_savings_from(
        &scenario,
        &loaded.scenario.meta.baseline,
        Some((&loaded.scenario, study)),
    )
    .ok_or_else(|| {
        loaded.error_at(
            "uncertainty",
            &format!(
                "sensitivity of `{key}`: at {value} a candidate's cycle or ledger cannot be \
                 solved; narrow the swing"
            ),
        )
    })
}

/// Rank the scenario's uncertain inputs by their swing in net savings.
pub fn rank(loaded: &LoadedScenario, study: &Study) -> crate::Result<Vec<Swing>> {
    let scenario = &loaded.scenario;
    let inputs: Vec<UncertainInput> = if scenario.uncertainty.is_empty() {
        DEFAULT_KEYS
            .iter()
            .map(|key| UncertainInput {
                key: key.to_string(),
                distribution: None,
                truncate: None,
                low: None,
                high: None,
            })
            .collect()
    } else {
        scenario.uncertainty.clone()
    };
    let base: Vec<(String, Decimal)> = study
        .outcomes
        .iter()
        .enumerate()
        .filter_map(|(i, o)| {
            let c = o.versus_baseline.as_ref()?;
            Some((scenario.candidates[i].id.clone(), c.savings.net_savings))
        })
        .collect();
    let mut swings = Vec::new();
    for input in &inputs {
        let Ok(base_value) = scenario.get_numeric(&input.key) else {
            continue;
        };
        let (low, high, source) = range_of(input, base_value);
        if source == RangeSource::DefaultTwentyPercent && base_value == 0.0 {
            continue;
        }
        let at_low = swung(loaded, study, &input.key, low)?;
        let at_high = swung(loaded, study, &input.key, high)?;
        let deltas = base
            .iter()
            .zip(at_low.iter().zip(at_high.iter()))
            .map(|((id, b), ((_, l), (_, h)))| (id.clone(), *l - *b, *h - *b))
            .collect();
        swings.push(Swing {
            key: input.key.clone(),
            base: base_value,
            low,
            high,
            source,
            deltas,
        });
    }
    swings.sort_by_key(|s| std::cmp::Reverse(s.magnitude()));
    Ok(swings)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn triangular_quantiles_match_the_closed_form() {
        // Symmetric triangular on [0, 2], mode 1: F(x) = x²/2 for x ≤ 1, so
        // the 10th percentile is sqrt(0.2) (closed form of the CDF).
        let (p10, p90) = p10_p90(&Distribution::Triangular {
            low: 0.0,
            mode: 1.0,
            high: 2.0,
        });
        assert!((p10 - 0.2f64.sqrt()).abs() < 1e-12);
        assert!((p90 - (2.0 - 0.2f64.sqrt())).abs() < 1e-12);
    }

    #[test]
    fn normal_p10_p90_use_the_tabled_z() {
        // z(0.90) = 1.2816 (standard normal table, any statistics text).
        let (p10, p90) = p10_p90(&Distribution::Normal {
            mean: 10.0,
            sigma: 2.0,
        });
        assert!((p10 - (10.0 - 2.5631)).abs() < 1e-3);
        assert!((p90 - (10.0 + 2.5631)).abs() < 1e-3);
    }
}
