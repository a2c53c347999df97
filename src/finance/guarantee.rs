//! Performance guarantees and their settlement at the acceptance test.
//!
//! A vendor guarantees a net output and a heat rate. The acceptance test
//! (ASME PTC 22 / ISO 2314 style, from memory) measures both, corrects them
//! to the guarantee's reference conditions and compares them with the
//! guarantee. A shortfall counts only once it lies beyond the test's
//! tolerance, the measurement uncertainty the test code assigns, stated as a
//! percentage of the guaranteed value. Counted shortfall is paid by the
//! vendor as liquidated damages at a rate per unit (heat rate: per % or per
//! kJ/kWh; output: per kW), up to a cap that is a fraction of the contract
//! price. A contract may also pay the vendor a bonus for performance better
//! than guaranteed, with its own rates and cap.
//!
//! # How the tolerance is applied
//!
//! [`ToleranceRule::BeyondBand`] (the default) counts only the part of the
//! shortfall beyond the band: a heat rate 2 % worse than guaranteed with a
//! 1 % tolerance is charged for 1 %. This is how contracts read that credit
//! the measured result with the test uncertainty ("the guarantee is met if
//! the measured value lies within the uncertainty of the guarantee"; damages
//! run from the guarantee plus the tolerance); it is continuous in the
//! measured value. [`ToleranceRule::WholeOnceBeyond`] counts the whole
//! shortfall once it lies beyond the band: the same test is charged for 2 %.
//! This is how contracts read that treat the tolerance as a threshold
//! ("damages are due if the shortfall exceeds the tolerance, calculated from
//! the guarantee"); damages jump at the band's edge. Both readings occur in
//! practice (common practice, from memory); the first is the default because
//! it is the one that follows from treating the tolerance as measurement
//! uncertainty. A shortfall exactly at the band's edge is within it (to
//! 1e-9 percentage points, so that floating-point rounding of the
//! percentage never charges an edge result).
//!
//! The bonus is settled by the same rule, mirrored: only betterment beyond
//! the band (or all of it once beyond) counts.
//!
//! Heat-rate and output damages add up before the damages cap; heat-rate and
//! output bonuses add up before the bonus cap. Damages and a bonus may both
//! be due (e.g. more output at a worse heat rate); both are kept and the
//! ledger nets them in one column ([`AcceptanceSettlement`]).

use rust_decimal::Decimal;

use super::money::Money;
use super::FinanceError;

/// How the acceptance test's tolerance band enters the counted shortfall
/// (see the module documentation).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum ToleranceRule {
    /// Only the part of the shortfall beyond the band counts (the default).
    #[default]
    BeyondBand,
    /// The whole shortfall counts once it lies beyond the band.
    WholeOnceBeyond,
}

/// The acceptance test's tolerance on each guaranteed figure, in percent of
/// the guaranteed value.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TestTolerance {
    /// Tolerance on net output, % of the guaranteed output (0 to 50).
    pub output_percent: f64,
    /// Tolerance on heat rate, % of the guaranteed heat rate (0 to 50).
    pub heat_rate_percent: f64,
}

impl TestTolerance {
    /// The same tolerance, in percent, on output and heat rate.
    pub fn uniform(percent: f64) -> TestTolerance {
        TestTolerance {
            output_percent: percent,
            heat_rate_percent: percent,
        }
    }
}

/// A rate of money per unit of counted heat-rate deviation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum HeatRateRate<M: Money = Decimal> {
    /// Money per percent of the guaranteed heat rate.
    PerPercent(M),
    /// Money per kJ/kWh.
    PerKjPerKwh(M),
}

/// Rates and cap of one direction of settlement: damages (performance worse
/// than guaranteed) or bonus (performance better than guaranteed).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SettlementRates<M: Money = Decimal> {
    /// Money per unit of counted heat-rate deviation (zero: none).
    pub heat_rate: HeatRateRate<M>,
    /// Money per kW of counted output deviation (zero: none).
    pub output_per_kw: M,
    /// Cap on the sum of heat-rate and output amounts, as a fraction of the
    /// contract price (0 to 1); `None`: no cap.
    pub cap_fraction_of_price: Option<f64>,
}

impl<M: Money> SettlementRates<M> {
    /// Nothing is paid: zero rates, no cap.
    pub const NONE: SettlementRates<M> = SettlementRates {
        heat_rate: HeatRateRate::PerPercent(M::ZERO),
        output_per_kw: M::ZERO,
        cap_fraction_of_price: None,
    };
}

/// A performance guarantee with its acceptance-test tolerance, damages and
/// optional bonus.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Guarantee<M: Money = Decimal> {
    /// Guaranteed net output, kW, at the guarantee's reference conditions.
    pub net_output_kw: f64,
    /// Guaranteed net heat rate, kJ/kWh (LHV), at the same conditions.
    pub heat_rate_kj_per_kwh: f64,
    /// The acceptance test's tolerance.
    pub tolerance: TestTolerance,
    /// How the tolerance enters the counted shortfall.
    pub rule: ToleranceRule,
    /// Liquidated damages the vendor pays for performance worse than
    /// guaranteed beyond the tolerance.
    pub damages: SettlementRates<M>,
    /// Bonus the buyer pays for performance better than guaranteed beyond
    /// the tolerance ([`SettlementRates::NONE`]: no bonus clause).
    pub bonus: SettlementRates<M>,
}

/// The acceptance test's result, corrected to the guarantee's reference
/// conditions (the as-built machine).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MeasuredPerformance {
    /// Measured net output, kW.
    pub net_output_kw: f64,
    /// Measured net heat rate, kJ/kWh (LHV).
    pub heat_rate_kj_per_kwh: f64,
}

/// The money of a settlement as the ledger takes it: paid once, at the
/// acceptance test, on the commercial-operation date.
///
/// The ledger shows it as one row ([`RowKind::Settlement`]) with its own
/// column, `bonus − damages`: negative capital when the vendor pays. It
/// counts as investment in the comparison metrics. It is a fixed amount:
/// the break-even premium holds it fixed (a cap proportional to the contract
/// price is not followed as the premium varies). Zero damages and zero bonus
/// (the default) add no row and leave the ledger unchanged.
///
/// [`RowKind::Settlement`]: super::RowKind::Settlement
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AcceptanceSettlement<M: Money = Decimal> {
    /// Damages received from the vendor (zero or more).
    pub damages: M,
    /// Bonus paid to the vendor (zero or more).
    pub bonus: M,
}

impl<M: Money> Default for AcceptanceSettlement<M> {
    /// Nothing settled.
    fn default() -> Self {
        AcceptanceSettlement {
            damages: M::ZERO,
            bonus: M::ZERO,
        }
    }
}

impl<M: Money> AcceptanceSettlement<M> {
    /// Whether nothing is settled (no ledger row).
    pub fn is_zero(&self) -> bool {
        self.damages == M::ZERO && self.bonus == M::ZERO
    }

    /// The ledger column: `bonus − damages` (a cost to the buyer when
    /// positive); `None` on overflow.
    pub fn net_cost(&self) -> Option<M> {
        self.bonus.sub_checked(self.damages)
    }
}

/// The settlement of a guarantee against a measured performance.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Settlement<M: Money = Decimal> {
    /// Heat rate worse than guaranteed, % of the guarantee (negative when
    /// better).
    pub heat_rate_shortfall_percent: f64,
    /// Output below the guarantee, % of the guarantee (negative when above).
    pub output_shortfall_percent: f64,
    /// Whether either shortfall lies beyond its tolerance (damages are due
    /// when there is a damages rate).
    pub beyond_tolerance: bool,
    /// Heat-rate damages before the cap.
    pub heat_rate_damages: M,
    /// Output damages before the cap.
    pub output_damages: M,
    /// Damages due: the sum, capped.
    pub damages: M,
    /// Whether the cap reduced the damages.
    pub damages_capped: bool,
    /// Heat-rate bonus before the cap.
    pub heat_rate_bonus: M,
    /// Output bonus before the cap.
    pub output_bonus: M,
    /// Bonus due: the sum, capped.
    pub bonus: M,
    /// Whether the cap reduced the bonus.
    pub bonus_capped: bool,
}

impl<M: Money> Settlement<M> {
    /// What the ledger records.
    pub fn to_ledger(&self) -> AcceptanceSettlement<M> {
        AcceptanceSettlement {
            damages: self.damages,
            bonus: self.bonus,
        }
    }
}

fn check(
    field: &'static str,
    value: f64,
    ok: bool,
    valid: &'static str,
) -> Result<(), FinanceError> {
    if value.is_finite() && ok {
        Ok(())
    } else {
        Err(FinanceError::OutOfRange {
            field,
            value,
            valid,
        })
    }
}

fn check_money<M: Money>(field: &'static str, value: M) -> Result<(), FinanceError> {
    super::validate::check_money_named(value, || field.to_string())
}

const POSITIVE: &str = "a finite number greater than 0";

impl<M: Money> SettlementRates<M> {
    fn validate(&self, fields: [&'static str; 3]) -> Result<(), FinanceError> {
        let heat_rate = match self.heat_rate {
            HeatRateRate::PerPercent(rate) | HeatRateRate::PerKjPerKwh(rate) => rate,
        };
        check_money(fields[0], heat_rate)?;
        check_money(fields[1], self.output_per_kw)?;
        if let Some(cap) = self.cap_fraction_of_price {
            check(
                fields[2],
                cap,
                (0.0..=1.0).contains(&cap),
                "0 to 1 of the contract price",
            )?;
        }
        Ok(())
    }
}

impl<M: Money> Guarantee<M> {
    /// Check every field; errors name the field and the valid range.
    pub fn validate(&self) -> Result<(), FinanceError> {
        check(
            "guarantee.net_output_kw",
            self.net_output_kw,
            self.net_output_kw > 0.0,
            POSITIVE,
        )?;
        check(
            "guarantee.heat_rate_kj_per_kwh",
            self.heat_rate_kj_per_kwh,
            self.heat_rate_kj_per_kwh > 0.0,
            POSITIVE,
        )?;
        let band = |p: f64| (0.0..=50.0).contains(&p);
        check(
            "guarantee.tolerance.output_percent",
            self.tolerance.output_percent,
            band(self.tolerance.output_percent),
            "0 to 50 %",
        )?;
        check(
            "guarantee.tolerance.heat_rate_percent",
            self.tolerance.heat_rate_percent,
            band(self.tolerance.heat_rate_percent),
            "0 to 50 %",
        )?;
        self.damages.validate([
            "guarantee.damages.heat_rate",
            "guarantee.damages.output_per_kw",
            "guarantee.damages.cap_fraction_of_price",
        ])?;
        self.bonus.validate([
            "guarantee.bonus.heat_rate",
            "guarantee.bonus.output_per_kw",
            "guarantee.bonus.cap_fraction_of_price",
        ])
    }
}

/// A deviation this close (in percentage points) beyond the band's edge
/// counts as at the edge: the percentage is computed in floating point, and
/// a measured value exactly at the edge (e.g. 9 595 against 9 500 kJ/kWh
/// with 1 %) must never be charged, least of all in full by
/// [`ToleranceRule::WholeOnceBeyond`].
const EDGE_SLACK_PERCENT: f64 = 1e-9;

/// The counted deviation, in percent of the guarantee, of a `deviation`
/// (percent, positive in the direction being settled) against a tolerance
/// band of `tolerance` percent.
fn counted_percent(deviation: f64, tolerance: f64, rule: ToleranceRule) -> f64 {
    if deviation <= tolerance + EDGE_SLACK_PERCENT {
        return 0.0;
    }
    match rule {
        ToleranceRule::BeyondBand => deviation - tolerance,
        ToleranceRule::WholeOnceBeyond => deviation,
    }
}

/// Counted deviations of one direction, in the units the rates are stated
/// in: heat rate in % and in kJ/kWh, output in kW.
struct Counted {
    heat_rate_percent: f64,
    heat_rate_kj_per_kwh: f64,
    output_kw: f64,
}

/// Amounts of one direction: heat rate, output, capped sum, whether capped.
fn amounts<M: Money>(
    rates: &SettlementRates<M>,
    counted: &Counted,
    contract_price: M,
    stream: &'static str,
) -> Result<(M, M, M, bool), FinanceError> {
    let overflow = || FinanceError::SettlementOverflow { stream };
    let money = |quantity: f64| M::from_physics(quantity).ok_or_else(overflow);
    let heat_rate = match rates.heat_rate {
        HeatRateRate::PerPercent(rate) => rate.mul_checked(money(counted.heat_rate_percent)?),
        HeatRateRate::PerKjPerKwh(rate) => rate.mul_checked(money(counted.heat_rate_kj_per_kwh)?),
    }
    .ok_or_else(overflow)?;
    let output = rates
        .output_per_kw
        .mul_checked(money(counted.output_kw)?)
        .ok_or_else(overflow)?;
    let sum = heat_rate.add_checked(output).ok_or_else(overflow)?;
    let Some(fraction) = rates.cap_fraction_of_price else {
        return Ok((heat_rate, output, sum, false));
    };
    let cap = M::from_factor(fraction)
        .and_then(|f| f.mul_checked(contract_price))
        .ok_or_else(overflow)?;
    Ok(if sum > cap {
        (heat_rate, output, cap, true)
    } else {
        (heat_rate, output, sum, false)
    })
}

/// Settle `guarantee` against the `measured` performance for a contract of
/// `contract_price`: the damages the vendor pays and the bonus the buyer
/// pays, each capped (see the module documentation for the rule).
///
/// Counted deviations: heat rate in % is `shortfall % − tolerance %` (or the
/// whole shortfall %, by the rule); in kJ/kWh that times the guaranteed heat
/// rate / 100; output in kW is the counted % times the guaranteed output /
/// 100. Quantities become money at [`Money::from_physics`].
///
/// Errors name the field when the guarantee, the measured values or the
/// price are out of range, and the stream when an amount overflows.
pub fn settle<M: Money>(
    guarantee: &Guarantee<M>,
    contract_price: M,
    measured: &MeasuredPerformance,
) -> Result<Settlement<M>, FinanceError> {
    guarantee.validate()?;
    check_money("contract_price", contract_price)?;
    check(
        "measured.net_output_kw",
        measured.net_output_kw,
        measured.net_output_kw >= 0.0,
        "a finite number, zero or more",
    )?;
    check(
        "measured.heat_rate_kj_per_kwh",
        measured.heat_rate_kj_per_kwh,
        measured.heat_rate_kj_per_kwh > 0.0,
        POSITIVE,
    )?;
    let heat_rate_shortfall_percent = (measured.heat_rate_kj_per_kwh
        - guarantee.heat_rate_kj_per_kwh)
        / guarantee.heat_rate_kj_per_kwh
        * 100.0;
    let output_shortfall_percent =
        (guarantee.net_output_kw - measured.net_output_kw) / guarantee.net_output_kw * 100.0;
    let tolerance = guarantee.tolerance;
    let counted = |heat_rate: f64, output: f64| {
        let heat_rate_percent =
            counted_percent(heat_rate, tolerance.heat_rate_percent, guarantee.rule);
        let output_percent = counted_percent(output, tolerance.output_percent, guarantee.rule);
        Counted {
            heat_rate_percent,
            heat_rate_kj_per_kwh: heat_rate_percent * guarantee.heat_rate_kj_per_kwh / 100.0,
            output_kw: output_percent * guarantee.net_output_kw / 100.0,
        }
    };
    let worse = counted(heat_rate_shortfall_percent, output_shortfall_percent);
    let better = counted(-heat_rate_shortfall_percent, -output_shortfall_percent);
    let (heat_rate_damages, output_damages, damages, damages_capped) = amounts(
        &guarantee.damages,
        &worse,
        contract_price,
        "guarantee damages",
    )?;
    let (heat_rate_bonus, output_bonus, bonus, bonus_capped) =
        amounts(&guarantee.bonus, &better, contract_price, "guarantee bonus")?;
    Ok(Settlement {
        heat_rate_shortfall_percent,
        output_shortfall_percent,
        beyond_tolerance: worse.heat_rate_percent > 0.0 || worse.output_kw > 0.0,
        heat_rate_damages,
        output_damages,
        damages,
        damages_capped,
        heat_rate_bonus,
        output_bonus,
        bonus,
        bonus_capped,
    })
}
