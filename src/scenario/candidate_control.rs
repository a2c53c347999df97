//! A candidate's part-load control (`[candidate.control]`): its keys, its
//! typed value and its reader. The defaults are those of
//! `offdesign::Control::default()`.

use super::candidate::Candidate;
use super::context::Context;
use super::declare::{keys_in, Key, Presence, Shape};
use super::error::ScenarioError;
use super::reader::TableReader;
use super::tree::{Node, NodeValue};
use crate::units::Kind;

use super::ranges::Range;

type Read<T> = Result<T, ScenarioError>;
/// Candidate declarations are keys into one [`Candidate`].
type K = Key<Candidate>;

/// How a fixed machine is held away from base load.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ControlStrategy {
    /// Close the inlet guide vanes (exhaust temperature held at its limit)
    /// down to the minimum airflow, then lower the firing temperature.
    GuideVanes,
    /// Fixed air flow; the firing temperature falls with load.
    FiringTemperature,
}

/// `[candidate.control]`: the part-load control of a candidate's machine.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ControlSpec {
    /// The strategy.
    pub strategy: ControlStrategy,
    /// Fewest the guide vanes may pass, a fraction of rated corrected flow.
    pub minimum_airflow: f64,
    /// Turbine exit temperature limit, K; `None`: the rated exhaust
    /// temperature.
    pub exhaust_temperature_limit_k: Option<f64>,
    /// Lowest load, a fraction of the base-load output at the ambient.
    pub minimum_load: f64,
}

impl Default for ControlSpec {
    /// Guide vanes to 70 % airflow, exhaust limit at the rated exhaust
    /// temperature, minimum load 30 % (as `offdesign::Control::default`).
    fn default() -> Self {
        ControlSpec {
            strategy: ControlStrategy::GuideVanes,
            minimum_airflow: 0.7,
            exhaust_temperature_limit_k: None,
            minimum_load: 0.3,
        }
    }
}

/// The words of `control.strategy`, in the order the docs list them.
const STRATEGIES: &[&str] = &["guide-vanes", "firing-temperature"];

/// The keys of a candidate's `control` table (paths relative to the
/// candidate; the table itself is declared in `candidate.rs`).
pub(crate) const KEYS: &[Key<Candidate>] = &[
    K::plain("control.strategy", Shape::Choice(STRATEGIES), Presence::Default { text: "guide-vanes", value: 0.0 }, "`guide-vanes`: close the inlet guide vanes down to `minimum_airflow` holding the exhaust at its limit, then lower the firing temperature; `firing-temperature`: fixed air flow, firing temperature falls with load"),
    K::number(
        "control.minimum_airflow",
        Kind::Fraction,
        Range::Efficiency,
        Presence::Default { text: "70 %", value: 0.7 },
        "fewest the guide vanes pass, fraction of rated corrected air flow (guide-vanes only)",
        |c| Some(c.control.minimum_airflow),
        |c, v| {
            c.control.minimum_airflow = v;
            Ok(())
        },
    )
    .within(0.5, 1.0, "", "variable inlet guide vanes of heavy-duty machines close to about 70 to 80 % of rated flow (common practice); the generic compressor characteristic is not meant for less than half the flow"),
    K::number(
        "control.exhaust_temperature_limit",
        Kind::Temperature,
        Range::Positive,
        Presence::Optional { text: "the rated exhaust temperature" },
        "turbine exit temperature the control holds at or below (a regenerator's material limit where one applies)",
        |c| c.control.exhaust_temperature_limit_k,
        |c, v| {
            c.control.exhaust_temperature_limit_k = Some(v);
            Ok(())
        },
    )
    .within(400.0, 1400.0, "K", "gas-turbine exhausts run about 700 to 900 K (common practice); below 400 K or above 1400 K no turbine exit or exhaust duct material is meant"),
    K::number(
        "control.minimum_load",
        Kind::Fraction,
        Range::Efficiency,
        Presence::Default { text: "30 %", value: 0.3 },
        "turndown: lowest load, fraction of the base-load output at the ambient",
        |c| Some(c.control.minimum_load),
        |c, v| {
            c.control.minimum_load = v;
            Ok(())
        },
    )
    .within(0.05, 1.0, "", "heavy-duty machines turn down to about 30 to 50 % within emission limits (common practice); below 5 % no combustor holds a stable flame at a useful output"),
];

/// Read `control` of the candidate being read by `r` into `candidate`
/// (a missing table is all defaults).
pub(crate) fn read_control(
    ctx: &mut Context,
    r: &TableReader,
    candidate: &mut Candidate,
) -> Read<()> {
    let empty = Node {
        span: r.span.clone(),
        value: NodeValue::Table(Vec::new()),
    };
    let node = r.node(ctx, "control").unwrap_or(&empty);
    let t = TableReader::new(ctx, &r.field("control"), node, &keys_in(KEYS, "control"))?;
    candidate.control.strategy = match t.choice(ctx, "strategy", STRATEGIES, "guide-vanes")? {
        "firing-temperature" => ControlStrategy::FiringTemperature,
        _ => ControlStrategy::GuideVanes,
    };
    t.declared_into(ctx, KEYS, "control", candidate)?;
    if candidate.control.exhaust_temperature_limit_k.is_none() {
        t.default(
            ctx,
            "exhaust_temperature_limit",
            "the rated exhaust temperature",
        );
    }
    Ok(())
}
