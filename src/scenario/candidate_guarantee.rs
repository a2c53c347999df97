//! A candidate's performance guarantee (`[candidate.guarantee]`): the
//! guaranteed net output and heat rate, the acceptance test's tolerance,
//! liquidated damages and an optional bonus, and the as-built machine
//! relative to the guarantee. Its keys and reader.
//!
//! The as-built figures are plain numbers (default 100 %: the machine meets
//! its guarantee exactly, so nothing is settled). `compare` uses the
//! figures as written; `risk` draws them like any other key when an
//! `[[uncertainty]]` entry names them
//! (`candidate[<id>].guarantee.as_built_heat_rate`).

use super::candidate::Candidate;
use super::context::Context;
use super::declare::{keys_in, money_from_f64, money_to_f64, Key, Presence, Shape};
use super::error::ScenarioError;
use super::ranges::{Range, AMOUNT_HIGH, AMOUNT_REASON};
use super::reader::TableReader;
use super::values::money;
use crate::units::{self, Kind};
use rust_decimal::Decimal;

type Read<T> = Result<T, ScenarioError>;
/// Candidate declarations are keys into one [`Candidate`].
type K = Key<Candidate>;

/// How the acceptance test's tolerance enters the counted shortfall.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum ToleranceReading {
    /// Only the shortfall beyond the tolerance counts (`"beyond-tolerance"`).
    #[default]
    BeyondTolerance,
    /// The whole shortfall counts once it passes the tolerance
    /// (`"whole-shortfall"`).
    WholeShortfall,
}

/// Damages (or bonus) per unit of counted heat-rate deviation, in the
/// scenario currency.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum HeatRateDamages {
    /// Per percent of the guaranteed heat rate.
    PerPercent(Decimal),
    /// Per kJ/kWh.
    PerKjPerKwh(Decimal),
}

/// `[candidate.guarantee]` as read; amounts in the scenario currency.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CandidateGuarantee {
    /// Guaranteed net output, kW; `None`: the candidate's `net_output`.
    pub net_output_kw: Option<f64>,
    /// Guaranteed net heat rate, kJ/kWh (LHV); `None`: the rated heat rate
    /// (the candidate's cycle at the site).
    pub heat_rate_kj_per_kwh: Option<f64>,
    /// The acceptance test's tolerance on both figures, fraction of the
    /// guaranteed value (0 to 0.5).
    pub tolerance: f64,
    /// How the tolerance enters the counted shortfall.
    pub reading: ToleranceReading,
    /// Damages per unit of heat rate worse than guaranteed.
    pub damages_heat_rate: HeatRateDamages,
    /// Damages per kW of output short of the guarantee.
    pub damages_per_kw: Decimal,
    /// Cap on damages, fraction of the contract price; `None`: no cap.
    pub damages_cap: Option<f64>,
    /// Bonus per percent of heat rate better than guaranteed.
    pub bonus_per_heat_rate_percent: Decimal,
    /// Bonus per kW of output above the guarantee.
    pub bonus_per_kw: Decimal,
    /// Cap on the bonus, fraction of the contract price; `None`: no cap.
    pub bonus_cap: Option<f64>,
    /// Contract price the caps refer to; `None`: the candidate's capital
    /// cost.
    pub contract_price: Option<Decimal>,
    /// As-built heat rate divided by the guaranteed heat rate (1: as
    /// guaranteed; above 1: worse).
    pub as_built_heat_rate: f64,
    /// As-built net output divided by the guaranteed net output (1: as
    /// guaranteed; below 1: short).
    pub as_built_output: f64,
}

/// Set a field of the guarantee, or say that the candidate has none.
fn set_guarantee(
    c: &mut Candidate,
    value: f64,
    set: impl FnOnce(&mut CandidateGuarantee, f64) -> Result<(), String>,
) -> Result<(), String> {
    match c.guarantee.as_mut() {
        Some(g) => set(g, value),
        None => Err("this candidate has no guarantee".into()),
    }
}

const TOLERANCE_REASON: &str = "acceptance-test uncertainties of net output and heat rate are of the order of 1 % (ASME PTC 22, from memory); beyond 50 % a guarantee guarantees nothing";
const CAP_REASON: &str = "a fraction of the contract price; damages above the price itself are not a cap (common practice: caps of 5 % to 30 %, from memory)";
const AS_BUILT_REASON: &str =
    "a machine half or twice as good as its guarantee is another machine, not a test result";

/// The keys of a candidate's `guarantee` table (paths relative to the
/// candidate).
pub(crate) const KEYS: &[Key<Candidate>] = &[
    K::plain("guarantee", Shape::Table, Presence::Optional { text: "no guarantee clause: nothing settled" }, "guaranteed figures, acceptance-test tolerance, damages and bonus (below)"),
    K::number(
        "guarantee.net_output",
        Kind::Power,
        Range::Positive,
        Presence::Optional { text: "the candidate's net_output" },
        "guaranteed net output at the rating",
        |c| c.guarantee.and_then(|g| g.net_output_kw),
        |c, v| set_guarantee(c, v, |g, v| {
            g.net_output_kw = Some(v);
            Ok(())
        }),
    )
    .within(1.0, 1e7, "kW", "1 kW to 10 GW: from a micro-turbine to beyond the largest single shaft"),
    K::number(
        "guarantee.heat_rate",
        Kind::HeatRate,
        Range::Positive,
        Presence::Optional { text: "the rated heat rate (the candidate's cycle at the site)" },
        "guaranteed net heat rate (LHV) at the rating",
        |c| c.guarantee.and_then(|g| g.heat_rate_kj_per_kwh),
        |c, v| set_guarantee(c, v, |g, v| {
            g.heat_rate_kj_per_kwh = Some(v);
            Ok(())
        }),
    )
    .within(3600.0, 36000.0, "kJ/kWh", "from 100 % efficiency (3600 kJ/kWh, the first law) to 10 %"),
    K::number(
        "guarantee.tolerance",
        Kind::Fraction,
        Range::Fraction,
        Presence::Default { text: "0 %", value: 0.0 },
        "acceptance-test tolerance on output and heat rate, % of the guaranteed value",
        |c| c.guarantee.map(|g| g.tolerance),
        |c, v| set_guarantee(c, v, |g, v| {
            g.tolerance = v;
            Ok(())
        }),
    )
    .within(0.0, 0.5, "", TOLERANCE_REASON),
    K::plain("guarantee.tolerance_rule", Shape::Choice(&["beyond-tolerance", "whole-shortfall"]), Presence::Default { text: "beyond-tolerance", value: 0.0 }, "`beyond-tolerance`: only the shortfall past the tolerance counts; `whole-shortfall`: all of it, once past the tolerance"),
    K::number(
        "guarantee.damages_per_heat_rate_percent",
        Kind::Money,
        Range::NonNegative,
        Presence::Optional { text: "0 (or per kJ/kWh)" },
        "damages per % of heat rate worse than guaranteed (beyond the tolerance); not with the per-kJ/kWh rate",
        |c| match c.guarantee.map(|g| g.damages_heat_rate) {
            Some(HeatRateDamages::PerPercent(m)) => Some(money_to_f64(m)),
            _ => None,
        },
        |c, v| set_guarantee(c, v, |g, v| match g.damages_heat_rate {
            HeatRateDamages::PerPercent(_) => {
                g.damages_heat_rate = HeatRateDamages::PerPercent(money_from_f64(v)?);
                Ok(())
            }
            HeatRateDamages::PerKjPerKwh(_) => Err("this guarantee's heat-rate damages are per kJ/kWh".into()),
        }),
    )
    .within(0.0, AMOUNT_HIGH, "", AMOUNT_REASON),
    K::number(
        "guarantee.damages_per_heat_rate_kj_per_kwh",
        Kind::Money,
        Range::NonNegative,
        Presence::Optional { text: "per % instead" },
        "damages per kJ/kWh of heat rate worse than guaranteed (beyond the tolerance); not with the per-% rate",
        |c| match c.guarantee.map(|g| g.damages_heat_rate) {
            Some(HeatRateDamages::PerKjPerKwh(m)) => Some(money_to_f64(m)),
            _ => None,
        },
        |c, v| set_guarantee(c, v, |g, v| match g.damages_heat_rate {
            HeatRateDamages::PerKjPerKwh(_) => {
                g.damages_heat_rate = HeatRateDamages::PerKjPerKwh(money_from_f64(v)?);
                Ok(())
            }
            HeatRateDamages::PerPercent(_) => Err("this guarantee's heat-rate damages are per %".into()),
        }),
    )
    .within(0.0, AMOUNT_HIGH, "", AMOUNT_REASON),
    K::number(
        "guarantee.damages_per_kw",
        Kind::Money,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "damages per kW of net output short of the guarantee (beyond the tolerance)",
        |c| c.guarantee.map(|g| money_to_f64(g.damages_per_kw)),
        |c, v| set_guarantee(c, v, |g, v| {
            g.damages_per_kw = money_from_f64(v)?;
            Ok(())
        }),
    )
    .within(0.0, AMOUNT_HIGH, "", AMOUNT_REASON),
    K::number(
        "guarantee.damages_cap",
        Kind::Fraction,
        Range::Fraction,
        Presence::Optional { text: "no cap" },
        "most damages paid, fraction of the contract price",
        |c| c.guarantee.and_then(|g| g.damages_cap),
        |c, v| set_guarantee(c, v, |g, v| {
            g.damages_cap = Some(v);
            Ok(())
        }),
    )
    .within(0.0, 1.0, "", CAP_REASON),
    K::number(
        "guarantee.bonus_per_heat_rate_percent",
        Kind::Money,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "bonus per % of heat rate better than guaranteed (beyond the tolerance); 0: no bonus",
        |c| c.guarantee.map(|g| money_to_f64(g.bonus_per_heat_rate_percent)),
        |c, v| set_guarantee(c, v, |g, v| {
            g.bonus_per_heat_rate_percent = money_from_f64(v)?;
            Ok(())
        }),
    )
    .within(0.0, AMOUNT_HIGH, "", AMOUNT_REASON),
    K::number(
        "guarantee.bonus_per_kw",
        Kind::Money,
        Range::NonNegative,
        Presence::Default { text: "0", value: 0.0 },
        "bonus per kW of net output above the guarantee (beyond the tolerance); 0: no bonus",
        |c| c.guarantee.map(|g| money_to_f64(g.bonus_per_kw)),
        |c, v| set_guarantee(c, v, |g, v| {
            g.bonus_per_kw = money_from_f64(v)?;
            Ok(())
        }),
    )
    .within(0.0, AMOUNT_HIGH, "", AMOUNT_REASON),
    K::number(
        "guarantee.bonus_cap",
        Kind::Fraction,
        Range::Fraction,
        Presence::Optional { text: "no cap" },
        "most bonus paid, fraction of the contract price",
        |c| c.guarantee.and_then(|g| g.bonus_cap),
        |c, v| set_guarantee(c, v, |g, v| {
            g.bonus_cap = Some(v);
            Ok(())
        }),
    )
    .within(0.0, 1.0, "", CAP_REASON),
    K::number(
        "guarantee.contract_price",
        Kind::Money,
        Range::Positive,
        Presence::Optional { text: "the candidate's capital_cost" },
        "contract price the caps are fractions of",
        |c| c.guarantee.and_then(|g| g.contract_price.map(money_to_f64)),
        |c, v| set_guarantee(c, v, |g, v| {
            g.contract_price = Some(money_from_f64(v)?);
            Ok(())
        }),
    )
    .within(0.0, AMOUNT_HIGH, "", AMOUNT_REASON),
    K::number(
        "guarantee.as_built_heat_rate",
        Kind::Fraction,
        Range::Positive,
        Presence::Default { text: "100 %", value: 1.0 },
        "as-built heat rate relative to the guarantee (102 % = 2 % worse); give it a distribution in [[uncertainty]] for risk",
        |c| c.guarantee.map(|g| g.as_built_heat_rate),
        |c, v| set_guarantee(c, v, |g, v| {
            g.as_built_heat_rate = v;
            Ok(())
        }),
    )
    .within(0.5, 2.0, "", AS_BUILT_REASON),
    K::number(
        "guarantee.as_built_output",
        Kind::Fraction,
        Range::Positive,
        Presence::Default { text: "100 %", value: 1.0 },
        "as-built net output relative to the guarantee (97 % = 3 % short); give it a distribution in [[uncertainty]] for risk",
        |c| c.guarantee.map(|g| g.as_built_output),
        |c, v| set_guarantee(c, v, |g, v| {
            g.as_built_output = v;
            Ok(())
        }),
    )
    .within(0.5, 2.0, "", AS_BUILT_REASON),
];

fn declared(ctx: &mut Context, t: &TableReader, path: &str) -> Read<Option<f64>> {
    let Some(key) = KEYS.iter().find(|k| k.path == path) else {
        return Err(t.error(
            ctx,
            path.rsplit('.').next().unwrap_or(path),
            "is not declared (a fault in brayfin)",
            "expected a declared key",
        ));
    };
    t.declared(ctx, key)
}

/// Read `guarantee` of the candidate being read by `r`; `None` when the
/// candidate has no such table.
pub(crate) fn read_guarantee(
    ctx: &mut Context,
    r: &TableReader,
) -> Read<Option<CandidateGuarantee>> {
    let Some(node) = r.node(ctx, "guarantee") else {
        return Ok(None);
    };
    let t = TableReader::new(
        ctx,
        &r.field("guarantee"),
        node,
        &keys_in(KEYS, "guarantee"),
    )?;
    let net_output_kw = declared(ctx, &t, "guarantee.net_output")?;
    let heat_rate_kj_per_kwh = declared(ctx, &t, "guarantee.heat_rate")?;
    let tolerance = declared(ctx, &t, "guarantee.tolerance")?.unwrap_or(f64::NAN);
    let reading = match t.choice(
        ctx,
        "tolerance_rule",
        &["beyond-tolerance", "whole-shortfall"],
        "beyond-tolerance",
    )? {
        "whole-shortfall" => ToleranceReading::WholeShortfall,
        _ => ToleranceReading::BeyondTolerance,
    };
    let per_percent = money(ctx, &t, "damages_per_heat_rate_percent", units::money)?;
    let per_kj = money(ctx, &t, "damages_per_heat_rate_kj_per_kwh", units::money)?;
    let damages_heat_rate = match (per_percent, per_kj) {
        (Some(_), Some(_)) => {
            return Err(t.error(
                ctx,
                "damages_per_heat_rate_kj_per_kwh",
                "is given together with damages_per_heat_rate_percent",
                "expected at most one heat-rate damages rate: per % or per kJ/kWh",
            ))
        }
        (None, Some(m)) => HeatRateDamages::PerKjPerKwh(m),
        (Some(m), None) => HeatRateDamages::PerPercent(m),
        (None, None) => {
            t.default(ctx, "damages_per_heat_rate_percent", "0");
            HeatRateDamages::PerPercent(Decimal::ZERO)
        }
    };
    let amount = |ctx: &mut Context, key: &str| -> Read<Decimal> {
        match money(ctx, &t, key, units::money)? {
            Some(m) => Ok(m),
            None => {
                t.default(ctx, key, "0");
                Ok(Decimal::ZERO)
            }
        }
    };
    let damages_per_kw = amount(ctx, "damages_per_kw")?;
    let bonus_per_heat_rate_percent = amount(ctx, "bonus_per_heat_rate_percent")?;
    let bonus_per_kw = amount(ctx, "bonus_per_kw")?;
    let damages_cap = declared(ctx, &t, "guarantee.damages_cap")?;
    let bonus_cap = declared(ctx, &t, "guarantee.bonus_cap")?;
    let contract_price = money(ctx, &t, "contract_price", units::money)?;
    if contract_price.is_some_and(|p| p.is_zero()) {
        return Err(t.error(
            ctx,
            "contract_price",
            "is 0",
            "expected a contract price above 0 (or leave it out: the capital cost)",
        ));
    }
    let as_built_heat_rate = declared(ctx, &t, "guarantee.as_built_heat_rate")?.unwrap_or(f64::NAN);
    let as_built_output = declared(ctx, &t, "guarantee.as_built_output")?.unwrap_or(f64::NAN);
    Ok(Some(CandidateGuarantee {
        net_output_kw,
        heat_rate_kj_per_kwh,
        tolerance,
        reading,
        damages_heat_rate,
        damages_per_kw,
        damages_cap,
        bonus_per_heat_rate_percent,
        bonus_per_kw,
        bonus_cap,
        contract_price,
        as_built_heat_rate,
        as_built_output,
    }))
}
