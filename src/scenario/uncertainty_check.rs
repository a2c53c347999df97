//! Checks of one `[[uncertainty]]` entry: parameters in order, a truncation
//! that leaves something, and every bound a valid value of its key.

use super::context::Context;
use super::error::ScenarioError;
use super::reader::TableReader;
use super::types::Scenario;
use super::uncertainty::{Distribution, UncertainInput};

type Read<T> = Result<T, ScenarioError>;

/// Check `input` (read by `r`) against the scenario it belongs to.
pub(crate) fn check_entry(
    ctx: &Context,
    r: &TableReader,
    scenario: &Scenario,
    input: &UncertainInput,
) -> Read<()> {
    if let Some(d) = input.distribution {
        check_parameters(ctx, r, d)?;
    }
    let (mut low, mut high) = input
        .distribution
        .map_or((f64::NEG_INFINITY, f64::INFINITY), |d| d.support());
    if let Some((t_low, t_high)) = input.truncate {
        let point = input.distribution.is_some_and(|d| {
            let (a, b) = d.support();
            a == b
        });
        let leaves_something = if point {
            t_low <= low && low <= t_high
        } else {
            t_low.max(low) < t_high.min(high)
        };
        if input.distribution.is_some() && !leaves_something {
            return Err(r.error(
                ctx,
                "truncate",
                format!("[{t_low}, {t_high}] leaves nothing of the distribution, whose values lie in [{low}, {high}]"),
                "expected a truncation range that overlaps the distribution",
            ));
        }
        low = low.max(t_low);
        high = high.min(t_high);
    }
    if input.distribution.is_some() {
        for (bound, value, key) in [("low end", low, "low"), ("high end", high, "high")] {
            let at = if input.truncate.is_some() {
                "truncate"
            } else {
                key
            };
            // A lognormal never reaches the 0 of its support.
            let lognormal_zero =
                matches!(input.distribution, Some(Distribution::LogNormal { .. })) && value <= 0.0;
            if value.is_finite() && !lognormal_zero {
                check_value(ctx, r, scenario, &input.key, value, at, bound)?;
            }
        }
    }
    if let (Some(low), Some(high)) = (input.low, input.high) {
        check_value(ctx, r, scenario, &input.key, low, "swing", "low end")?;
        check_value(ctx, r, scenario, &input.key, high, "swing", "high end")?;
    }
    Ok(())
}

fn check_parameters(ctx: &Context, r: &TableReader, d: Distribution) -> Read<()> {
    match d {
        Distribution::Uniform { low, high } if low > high => Err(r.error(
            ctx,
            "low",
            format!("{low} is above high {high}"),
            "expected low ≤ high",
        )),
        Distribution::Triangular { low, mode, high } if !(low <= mode && mode <= high) => Err(r
            .error(
                ctx,
                "mode",
                format!("low {low}, mode {mode}, high {high} are not in order"),
                "expected low ≤ mode ≤ high",
            )),
        Distribution::Normal { sigma, .. } | Distribution::LogNormal { sigma, .. }
            if !(sigma >= 0.0 && sigma.is_finite()) =>
        {
            Err(r.error(
                ctx,
                "sigma",
                format!("{sigma} is negative"),
                "expected a standard deviation of 0 or more",
            ))
        }
        Distribution::LogNormal { mu, .. } if !mu.is_finite() => Err(r.error(
            ctx,
            "mu",
            format!("{mu} is not finite"),
            "expected a finite mean of ln x",
        )),
        _ => Ok(()),
    }
}

/// `value` must be a valid setting of `key` (its range and cross rules).
fn check_value(
    ctx: &Context,
    r: &TableReader,
    scenario: &Scenario,
    key: &str,
    value: f64,
    at: &str,
    bound: &str,
) -> Read<()> {
    let mut trial = scenario.clone();
    trial.set_numeric(key, value).map_err(|e| {
        r.error(
            ctx,
            at,
            format!("its {bound} is not a valid value: {e}"),
            "expected every value it can take to be valid for the key",
        )
    })
}
