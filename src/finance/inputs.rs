//! What the ledger of one candidate needs: plain typed values, money in the
//! ledger's number type `M` (`Decimal` by default), physics in `f64`.
//!
//! Every escalation rate is a fraction per year on the analysis basis
//! ([`Rates::basis`]); 0 keeps a price constant in that basis's money. Prices
//! are stated at the base date (commercial operation) and escalate to the
//! time each cash flow is counted (see [`Timing`]).

use chrono::NaiveDate;
use rust_decimal::Decimal;

use super::guarantee::AcceptanceSettlement;
use super::money::Money;
use super::rates::{Rates, Timing};

/// Everything one candidate's ledger is built from.
#[derive(Debug, Clone, PartialEq)]
pub struct LedgerInputs<M: Money = Decimal> {
    /// Commercial-operation date: the base date of discounting and escalation.
    pub commercial_operation: NaiveDate,
    /// Service life in anniversary years, 1 to 60.
    pub service_life_years: u32,
    /// Discount rate, its basis and inflation.
    pub rates: Rates,
    /// When within a year cash flows are counted.
    pub timing: Timing,
    /// The date present values are stated at; `None`: commercial operation.
    /// Every discount factor is to this date (a cash flow before it is
    /// compounded to it). Prices stay stated at commercial operation and
    /// escalate from there; only the discounting base moves, so every
    /// present value is the commercial-operation one times
    /// `(1 + d)^-(years from this date to commercial operation)`.
    pub present_value_date: Option<NaiveDate>,
    /// Capital cost and when it is paid.
    pub capital: Capital<M>,
    /// A full year of new-and-clean operation, from the physics layer.
    pub operation: Operation,
    /// Fuel price and its heating-value basis.
    pub fuel: Fuel<M>,
    /// Carbon emissions and their price.
    pub carbon: Carbon<M>,
    /// Fixed O&M: price per kW of net output per year, escalating.
    pub fixed_om: EscalatingPrice<M>,
    /// Variable O&M: price per MWh generated, escalating.
    pub variable_om: EscalatingPrice<M>,
    /// Starts: fuel and cost per start (the count is
    /// [`Operation::starts_per_year`]). Zero, the default: nothing charged.
    pub starts: Starts<M>,
    /// Service-agreement fees per fired hour and per start (zero, the
    /// default: none).
    pub service: ServiceFees<M>,
    /// Major overhauls, if any are charged.
    pub overhaul: Option<Overhaul<M>>,
    /// Heat-rate degradation and its recovery at overhauls.
    pub degradation: Degradation,
    /// Value left at the end of the service life, credited.
    pub residual: Residual<M>,
    /// Output levelling: the energy and capacity this candidate falls short
    /// of the reference output and must buy elsewhere (zero: no stream).
    pub bought_in: BoughtIn<M>,
    /// Damages and bonus settled at the acceptance test, paid once on the
    /// commercial-operation date (zero, the default: no row).
    pub acceptance_settlement: AcceptanceSettlement<M>,
}

/// When capital is paid.
#[derive(Debug, Clone, PartialEq)]
pub enum Capital<M: Money = Decimal> {
    /// One payment on the commercial-operation date.
    AtCommercialOperation(M),
    /// Payments over construction, in strictly increasing date order, none
    /// after commercial operation.
    Schedule(Vec<CapitalPayment<M>>),
}

/// One dated capital payment.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CapitalPayment<M: Money = Decimal> {
    /// Date of payment (on or before commercial operation).
    pub date: NaiveDate,
    /// Amount, in the analysis basis's money at that date.
    pub amount: M,
}

/// A full year of new-and-clean operation at the candidate's rating.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Operation {
    /// Operating (fired) hours per full year, 0 to 8784.
    pub operating_hours: f64,
    /// Net electricity generated per full year, MWh.
    pub energy_mwh: f64,
    /// Fuel energy burned per full year when new and clean, GJ on the lower
    /// heating value basis.
    pub fuel_energy_gj_lhv: f64,
    /// Net electrical output, kW (the basis of fixed O&M).
    pub net_output_kw: f64,
    /// Starts per full year, 0 or more (spread evenly over the year like the
    /// operating hours).
    pub starts_per_year: f64,
}

/// What each start costs besides the fired hours.
///
/// Start fuel is fuel: it is priced on the fuel's basis and price (path or
/// escalation) and carries its carbon, and it is not degraded (it is a
/// quantity per start, not per MWh). The start cost is an O&M charge,
/// counted in the variable O&M column.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Starts<M: Money = Decimal> {
    /// Fuel energy burned per start, GJ on the lower heating value basis
    /// (≥ 0).
    pub fuel_gj_lhv_per_start: f64,
    /// Cost per start at the base date, and its escalation.
    pub cost_per_start: EscalatingPrice<M>,
}

impl<M: Money> Default for Starts<M> {
    /// No start fuel and no start cost.
    fn default() -> Self {
        Starts {
            fuel_gj_lhv_per_start: 0.0,
            cost_per_start: EscalatingPrice::ZERO,
        }
    }
}

/// Fees of a long-term service agreement, counted in the variable O&M
/// column: a fee per fired (operating) hour and a fee per start.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ServiceFees<M: Money = Decimal> {
    /// Fee per fired hour at the base date, and its escalation.
    pub per_fired_hour: EscalatingPrice<M>,
    /// Fee per start at the base date, and its escalation.
    pub per_start: EscalatingPrice<M>,
}

impl<M: Money> Default for ServiceFees<M> {
    /// No fees.
    fn default() -> Self {
        ServiceFees {
            per_fired_hour: EscalatingPrice::ZERO,
            per_start: EscalatingPrice::ZERO,
        }
    }
}

/// Heating-value basis on which a fuel price is quoted.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PriceBasis {
    /// Price per GJ of higher (gross) heating value, as gas is often sold.
    Hhv,
    /// Price per GJ of lower (net) heating value, the basis of heat rates.
    Lhv,
}

/// How the fuel price evolves.
#[derive(Debug, Clone, PartialEq)]
pub enum FuelPrice<M: Money = Decimal> {
    /// A base-date price per GJ escalating at a rate per year.
    Escalating {
        /// Price per GJ (on the fuel's price basis) at the base date.
        price_per_gj: M,
        /// Escalation per year on the analysis basis.
        escalation: f64,
    },
    /// A price per GJ for each calendar year: `(year, price)`. Every year
    /// with operation needs exactly one entry; extra years are ignored. Each
    /// price is in the analysis basis's money of its year and is not
    /// escalated further.
    Path(Vec<(i32, M)>),
}

/// The fuel's price and heating-value basis.
#[derive(Debug, Clone, PartialEq)]
pub struct Fuel<M: Money = Decimal> {
    /// The price and how it changes.
    pub price: FuelPrice<M>,
    /// Heating-value basis of the price.
    pub basis: PriceBasis,
    /// Ratio of higher to lower heating value, 1 to 2 (about 1.11 for
    /// pipeline natural gas, common practice). Used only for an HHV price:
    /// cost = fuel energy (GJ LHV) × `hhv_over_lhv` × price per GJ HHV.
    pub hhv_over_lhv: f64,
}

/// Carbon emissions and their price.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Carbon<M: Money = Decimal> {
    /// kg of CO2 per GJ of fuel energy (LHV).
    pub co2_kg_per_gj_lhv: f64,
    /// Price per tonne of CO2 at the base date.
    pub price_per_tonne: M,
    /// Escalation per year on the analysis basis.
    pub escalation: f64,
}

/// A unit price at the base date and its escalation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct EscalatingPrice<M: Money = Decimal> {
    /// Price per unit at the base date.
    pub price: M,
    /// Escalation per year on the analysis basis (0 = constant).
    pub escalation: f64,
}

impl<M: Money> EscalatingPrice<M> {
    /// A zero price that does not escalate.
    pub const ZERO: EscalatingPrice<M> = EscalatingPrice {
        price: M::ZERO,
        escalation: 0.0,
    };
}

/// Output levelling ("bought in") stream: what a candidate that delivers
/// less than the reference output pays to buy the shortfall elsewhere, so
/// that candidates of different output are compared on equal deliveries
/// (common practice in bid evaluation).
///
/// Charged in each operating row pro rata like the candidate's own streams:
/// the energy shortfall by the row's fraction of a year of operation (like
/// energy and variable O&M), the capacity shortfall by the row's fraction of
/// a year (like fixed O&M). Both quantities are zero or more; zero
/// quantities (the default) add nothing to the ledger. The stream is an
/// operating cost but not the candidate's own generation cost, so the
/// levelized cost of electricity leaves it out
/// ([`LedgerSummary::levelized_cost_per_mwh`]).
///
/// [`LedgerSummary::levelized_cost_per_mwh`]: super::LedgerSummary::levelized_cost_per_mwh
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct BoughtIn<M: Money = Decimal> {
    /// Energy to be bought per full year of operation, MWh (≥ 0).
    pub energy_mwh_per_year: f64,
    /// Price of that energy per MWh at the base date, and its escalation.
    pub energy_price: EscalatingPrice<M>,
    /// Capacity to be bought, kW (≥ 0).
    pub capacity_kw: f64,
    /// Price of that capacity per kW-year at the base date, and its
    /// escalation.
    pub capacity_price: EscalatingPrice<M>,
}

impl<M: Money> Default for BoughtIn<M> {
    /// No shortfall: zero quantities at zero prices.
    fn default() -> Self {
        let zero = EscalatingPrice {
            price: M::ZERO,
            escalation: 0.0,
        };
        BoughtIn {
            energy_mwh_per_year: 0.0,
            energy_price: zero,
            capacity_kw: 0.0,
            capacity_price: zero,
        }
    }
}

/// Major overhauls, triggered by equivalent operating hours or by starts,
/// whichever comes first.
///
/// Equivalent operating hours (EOH) = operating hours + starts ×
/// `hours_per_start` (common practice in gas-turbine maintenance
/// contracts). Hours and starts both accrue evenly over the year, so the
/// two limits fall due at fixed intervals of operating time, and the
/// earlier governs: an overhaul every
/// `min(interval_hours / (H + S·hours_per_start), interval_starts / S)`
/// years at `H` hours and `S` starts a year (see
/// [`Overhaul::operating_hours_between`]); each overhaul resets both counts.
/// With no starts this is the plain operating-hours interval.
///
/// One is charged each time accumulated operating hours reach a whole
/// multiple of that interval strictly before the end of the service life; an
/// overhaul falling exactly at the end of life is not charged (the unit
/// retires instead).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Overhaul<M: Money = Decimal> {
    /// Equivalent operating hours between overhauls; must be positive.
    pub interval_hours: f64,
    /// Equivalent operating hours counted per start (0 or more; 0: starts
    /// add nothing to the hours).
    pub hours_per_start: f64,
    /// Starts between overhauls, if starts limit them (positive).
    pub interval_starts: Option<f64>,
    /// Days out of service per overhaul (0 or more). The row's operation
    /// (fired hours, starts, energy and fuel) falls by the outage's share of
    /// the year, and the energy and capacity lost are bought in at the
    /// [`BoughtIn`] prices.
    pub outage_days: f64,
    /// Capacity lost while out of service, kW (the base-load output at the
    /// site; 0 or more).
    pub outage_capacity_kw: f64,
    /// Cost of one overhaul at the base date.
    pub cost: M,
    /// Escalation per year on the analysis basis.
    pub escalation: f64,
}

/// Heat-rate and output degradation.
///
/// Model: degradation accrues in proportion to operating hours (`g` per year
/// of operation at the stated annual hours); each overhaul recovers the
/// recoverable share of what accrued since the previous overhaul, the rest
/// accumulates for the life. A row's fuel energy is the new-and-clean fuel
/// energy times the mean of `1 + degradation` over the row's hours, times
/// `1 − output loss`. Output degradation lowers the energy delivered (the
/// heat rate of what is delivered is set by heat-rate degradation alone);
/// the energy lost is bought in at the [`BoughtIn`] energy price.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Degradation {
    /// Heat-rate increase per year of operation at the stated annual hours,
    /// as a fraction of the new-and-clean heat rate (0.005 = 0.5 % per year),
    /// 0 to below 1.
    pub heat_rate_fraction_per_year: f64,
    /// Output loss per year of operation at the stated annual hours, as a
    /// fraction of the new-and-clean output, 0 to below 1.
    pub output_fraction_per_year: f64,
    /// Share of the degradation that each overhaul recovers, 0 to 1 (heat
    /// rate and output alike).
    pub recoverable_fraction: f64,
}

/// The value left at the end of life.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum ResidualValue<M: Money = Decimal> {
    /// A fraction (0 to 1) of the total capital cost.
    FractionOfCapital(f64),
    /// An amount at the base date.
    Amount(M),
}

/// Residual value, credited at the end of life (a negative cost).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Residual<M: Money = Decimal> {
    /// How the value is stated.
    pub value: ResidualValue<M>,
    /// Escalation per year on the analysis basis from the base date to the
    /// end of life (0 = the value holds in the basis's money).
    pub escalation: f64,
}

impl<M: Money> Capital<M> {
    /// The payments as a list (one payment on `commercial_operation` for
    /// [`Capital::AtCommercialOperation`]).
    pub fn payments(&self, commercial_operation: NaiveDate) -> Vec<CapitalPayment<M>> {
        match self {
            Capital::AtCommercialOperation(amount) => vec![CapitalPayment {
                date: commercial_operation,
                amount: *amount,
            }],
            Capital::Schedule(payments) => payments.clone(),
        }
    }

    /// Sum of all payments, undiscounted; `None` on overflow.
    pub fn total(&self) -> Option<M> {
        match self {
            Capital::AtCommercialOperation(amount) => Some(*amount),
            Capital::Schedule(payments) => payments
                .iter()
                .try_fold(M::ZERO, |sum, p| sum.add_checked(p.amount)),
        }
    }

    /// The same schedule scaled so that its payments sum to `new_total`
    /// (each payment keeps its share). A schedule summing to zero, or a
    /// single payment, puts `new_total` on its last date. `None` on overflow.
    pub fn with_total(&self, new_total: M) -> Option<Capital<M>> {
        match self {
            Capital::AtCommercialOperation(_) => Some(Capital::AtCommercialOperation(new_total)),
            Capital::Schedule(payments) => {
                let total = self.total()?;
                let last = payments.last()?;
                if total == M::ZERO {
                    let mut scaled = payments.clone();
                    let tail = scaled.last_mut()?;
                    *tail = CapitalPayment {
                        date: last.date,
                        amount: new_total,
                    };
                    return Some(Capital::Schedule(scaled));
                }
                let scaled = payments
                    .iter()
                    .map(|p| {
                        let amount = p.amount.mul_checked(new_total)?.div_checked(total)?;
                        Some(CapitalPayment {
                            date: p.date,
                            amount,
                        })
                    })
                    .collect::<Option<Vec<_>>>()?;
                Some(Capital::Schedule(scaled))
            }
        }
    }
}

impl<M: Money> Overhaul<M> {
    /// Operating (fired) hours between overhauls for a year of `operation`:
    /// the equivalent-hours interval over the equivalent hours per fired
    /// hour, or the starts interval over the starts per fired hour, whichever
    /// is shorter. `None` when the unit does not run (no hours, so nothing
    /// wears).
    ///
    /// Example (hand-worked): 500 h and 150 starts a year at 20 h per start
    /// is 3 500 EOH a year; a 24 000 EOH interval falls every 6.857 years,
    /// i.e. every 3 428.6 fired hours. A 900-start limit falls every 6 years
    /// (3 000 fired hours) and governs.
    pub fn operating_hours_between(&self, operation: &Operation) -> Option<f64> {
        let hours = operation.operating_hours;
        if hours <= 0.0 {
            return None;
        }
        let starts_per_hour = operation.starts_per_year / hours;
        let by_hours = self.interval_hours / (1.0 + starts_per_hour * self.hours_per_start);
        let by_starts = match self.interval_starts {
            Some(starts) if starts_per_hour > 0.0 => starts / starts_per_hour,
            _ => f64::INFINITY,
        };
        Some(by_hours.min(by_starts))
    }
}

impl<M: Money> LedgerInputs<M> {
    /// The same inputs with every money value converted by `convert`, e.g.
    /// `Decimal` inputs to `f64` for sampling (see [`LedgerInputs::to_f64`]).
    pub fn map_money<N: Money>(&self, convert: impl Fn(M) -> N) -> LedgerInputs<N> {
        let capital = match &self.capital {
            Capital::AtCommercialOperation(amount) => {
                Capital::AtCommercialOperation(convert(*amount))
            }
            Capital::Schedule(payments) => Capital::Schedule(
                payments
                    .iter()
                    .map(|p| CapitalPayment {
                        date: p.date,
                        amount: convert(p.amount),
                    })
                    .collect(),
            ),
        };
        let price = match &self.fuel.price {
            FuelPrice::Escalating {
                price_per_gj,
                escalation,
            } => FuelPrice::Escalating {
                price_per_gj: convert(*price_per_gj),
                escalation: *escalation,
            },
            FuelPrice::Path(path) => {
                FuelPrice::Path(path.iter().map(|(year, p)| (*year, convert(*p))).collect())
            }
        };
        let escalating = |p: &EscalatingPrice<M>| EscalatingPrice {
            price: convert(p.price),
            escalation: p.escalation,
        };
        LedgerInputs {
            commercial_operation: self.commercial_operation,
            service_life_years: self.service_life_years,
            rates: self.rates,
            timing: self.timing,
            present_value_date: self.present_value_date,
            capital,
            operation: self.operation,
            fuel: Fuel {
                price,
                basis: self.fuel.basis,
                hhv_over_lhv: self.fuel.hhv_over_lhv,
            },
            carbon: Carbon {
                co2_kg_per_gj_lhv: self.carbon.co2_kg_per_gj_lhv,
                price_per_tonne: convert(self.carbon.price_per_tonne),
                escalation: self.carbon.escalation,
            },
            fixed_om: escalating(&self.fixed_om),
            variable_om: escalating(&self.variable_om),
            starts: Starts {
                fuel_gj_lhv_per_start: self.starts.fuel_gj_lhv_per_start,
                cost_per_start: escalating(&self.starts.cost_per_start),
            },
            service: ServiceFees {
                per_fired_hour: escalating(&self.service.per_fired_hour),
                per_start: escalating(&self.service.per_start),
            },
            overhaul: self.overhaul.map(|o| Overhaul {
                interval_hours: o.interval_hours,
                hours_per_start: o.hours_per_start,
                interval_starts: o.interval_starts,
                outage_days: o.outage_days,
                outage_capacity_kw: o.outage_capacity_kw,
                cost: convert(o.cost),
                escalation: o.escalation,
            }),
            degradation: self.degradation,
            residual: Residual {
                value: match self.residual.value {
                    ResidualValue::FractionOfCapital(f) => ResidualValue::FractionOfCapital(f),
                    ResidualValue::Amount(amount) => ResidualValue::Amount(convert(amount)),
                },
                escalation: self.residual.escalation,
            },
            bought_in: BoughtIn {
                energy_mwh_per_year: self.bought_in.energy_mwh_per_year,
                energy_price: escalating(&self.bought_in.energy_price),
                capacity_kw: self.bought_in.capacity_kw,
                capacity_price: escalating(&self.bought_in.capacity_price),
            },
            acceptance_settlement: AcceptanceSettlement {
                damages: convert(self.acceptance_settlement.damages),
                bonus: convert(self.acceptance_settlement.bonus),
            },
        }
    }
}

impl LedgerInputs<Decimal> {
    /// The same inputs in `f64` money, for the fast sampling ledger.
    pub fn to_f64(&self) -> LedgerInputs<f64> {
        self.map_money(f64::from_decimal)
    }
}
