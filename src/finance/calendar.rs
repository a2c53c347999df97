//! The analysis calendar: operating periods labelled by calendar year, and
//! the time axis that discounting and escalation run on.
//!
//! Conventions (chosen here and stated in every ledger):
//! - The base date, time zero, is the commercial-operation date. Cash before
//!   it (construction capital) has negative time and a discount factor above
//!   one on a positive discount rate.
//! - The service life is `N` anniversary years: it ends at the start of the
//!   `N`-th anniversary of commercial operation (`end_of_life`, exclusive). A
//!   29 February start has its anniversaries on 28 February.
//! - Rows are calendar years. The first row runs from commercial operation to
//!   31 December; the last row from 1 January to the day before the end of
//!   life. A 1 January start gives exactly `N` full calendar years.
//! - Time is measured in years by the actual/actual (ISDA) day count: each
//!   day counts 1/366 of a year in a leap year and 1/365 otherwise (ISDA 2006
//!   Definitions, section 4.16(b), from memory). A full calendar year is
//!   therefore exactly one year, and a partial year's share is its days over
//!   the days of its calendar year; annual hours, energy and fuel are
//!   prorated by that share. A mid-year start makes the total span differ
//!   from `N` by at most a few thousandths of a year.

use chrono::{Datelike, Months, NaiveDate};

use super::FinanceError;

/// Longest service life accepted, in years.
pub const MAX_SERVICE_LIFE_YEARS: u32 = 60;

/// Days of calendar `year` in the proleptic Gregorian calendar (chrono's):
/// 366 in a leap year (divisible by 4, centuries only when divisible by
/// 400), else 365. Arithmetic, no date is built.
fn days_in_year(year: i32) -> f64 {
    if year % 4 == 0 && (year % 100 != 0 || year % 400 == 0) {
        366.0
    } else {
        365.0
    }
}

/// Position of `date` in years since 1 January of `reference_year`,
/// actual/actual (ISDA): whole years plus the day of the year over the days
/// of that year.
fn position_years(date: NaiveDate, reference_year: i32) -> f64 {
    f64::from(date.year() - reference_year) + f64::from(date.ordinal0()) / days_in_year(date.year())
}

/// Years from `from` to `to` by the actual/actual (ISDA) day count; negative
/// when `to` is before `from`. Exact whole numbers between 1 January dates.
pub fn years_between(from: NaiveDate, to: NaiveDate) -> f64 {
    let reference_year = from.year();
    position_years(to, reference_year) - position_years(from, reference_year)
}

/// One calendar-year row of operation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Period {
    /// Calendar year that labels the row.
    pub year: i32,
    /// First day of the period.
    pub start: NaiveDate,
    /// Last day of the period (inclusive).
    pub end: NaiveDate,
    /// Share of a full year of operation in this period (days over the days
    /// of the calendar year); exactly 1 for a full calendar year.
    pub fraction_of_year: f64,
    /// Time of the period's start, in years since commercial operation.
    pub time_start_years: f64,
    /// Time of the period's end (the start of the next), in years since
    /// commercial operation.
    pub time_end_years: f64,
}

/// The dates of one analysis: commercial operation and the end of life.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Calendar {
    /// Commercial-operation date: the base date (time zero).
    pub commercial_operation: NaiveDate,
    /// Service life in anniversary years (1 to 60).
    pub service_life_years: u32,
    /// The `N`-th anniversary of commercial operation: the first day after
    /// the service life.
    pub end_of_life: NaiveDate,
}

impl Calendar {
    /// The calendar of a service life of `service_life_years` from
    /// `commercial_operation`.
    pub fn new(
        commercial_operation: NaiveDate,
        service_life_years: u32,
    ) -> Result<Calendar, FinanceError> {
        if !(1..=MAX_SERVICE_LIFE_YEARS).contains(&service_life_years) {
            return Err(FinanceError::ServiceLife {
                value: service_life_years,
            });
        }
        let end_of_life = commercial_operation
            .checked_add_months(Months::new(12 * service_life_years))
            .ok_or(FinanceError::CalendarOverflow {
                commercial_operation,
                years: service_life_years,
            })?;
        Ok(Calendar {
            commercial_operation,
            service_life_years,
            end_of_life,
        })
    }

    /// Time of `date` in years since commercial operation (actual/actual).
    pub fn time_of(&self, date: NaiveDate) -> f64 {
        years_between(self.commercial_operation, date)
    }

    /// Time of the end of life in years since commercial operation.
    pub fn end_of_life_years(&self) -> f64 {
        self.time_of(self.end_of_life)
    }

    /// First and last calendar years with operation.
    pub fn operating_years(&self) -> (i32, i32) {
        let last_day = self.end_of_life.pred_opt().unwrap_or(self.end_of_life);
        (self.commercial_operation.year(), last_day.year())
    }

    /// Number of operating rows (`N`, or `N + 1` for a mid-year start).
    pub fn period_count(&self) -> usize {
        let (first, last) = self.operating_years();
        (last - first + 1) as usize
    }

    /// The operating periods in order. Times are accumulated from each
    /// period's share so that full years step by exactly 1.
    pub fn periods(&self) -> impl Iterator<Item = Period> + '_ {
        self.spans().filter_map(move |span| {
            let (start, end) = self.period_dates(span.year)?;
            Some(Period {
                year: span.year,
                start,
                end,
                fraction_of_year: span.fraction_of_year,
                time_start_years: span.time_start_years,
                time_end_years: span.time_end_years,
            })
        })
    }

    /// The operating periods' places on the time axis without their dates,
    /// the same sequence as [`Calendar::periods`]. Only the first and last
    /// periods take date arithmetic (once, here); every year between them is
    /// a full calendar year, share exactly 1.
    pub(crate) fn spans(&self) -> Spans {
        let (first_year, last_year) = self.operating_years();
        Spans {
            next_year: first_year,
            first_year,
            last_year,
            first_fraction: self.edge_fraction(first_year),
            last_fraction: self.edge_fraction(last_year),
            time_years: 0.0,
        }
    }

    /// First and last day (inclusive) of the period labelled `year`: from
    /// 1 January or commercial operation, whichever is later, to 31 December
    /// or the day before the end of life, whichever is earlier. `None` where
    /// a bound is not a representable date.
    pub(crate) fn period_dates(&self, year: i32) -> Option<(NaiveDate, NaiveDate)> {
        let year_start = NaiveDate::from_ymd_opt(year, 1, 1)?;
        let next_year_start = NaiveDate::from_ymd_opt(year + 1, 1, 1)?;
        let start = year_start.max(self.commercial_operation);
        let next_start = next_year_start.min(self.end_of_life);
        Some((start, next_start.pred_opt()?))
    }

    /// Share of a full year in the period labelled `year`: its days over the
    /// days of the calendar year. `None` where the period has no
    /// representable dates (it is then not a period).
    fn edge_fraction(&self, year: i32) -> Option<f64> {
        let (start, end) = self.period_dates(year)?;
        // Both dates lie in `year`: their days of the year give the count.
        let days = (i64::from(end.ordinal()) - i64::from(start.ordinal()) + 1) as f64;
        Some(days / days_in_year(year))
    }
}

/// An operating period's place on the time axis: a [`Period`] without its
/// dates.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Span {
    /// Calendar year that labels the period.
    pub(crate) year: i32,
    /// Share of a full year of operation (exactly 1 for a full year).
    pub(crate) fraction_of_year: f64,
    /// Start of the period in years since commercial operation.
    pub(crate) time_start_years: f64,
    /// End of the period in years since commercial operation.
    pub(crate) time_end_years: f64,
}

/// The spans of a calendar in order (see [`Calendar::spans`]).
pub(crate) struct Spans {
    next_year: i32,
    first_year: i32,
    last_year: i32,
    /// Share of the first year; `None` if that period is not representable.
    first_fraction: Option<f64>,
    /// Share of the last year; `None` if that period is not representable.
    last_fraction: Option<f64>,
    /// Time reached so far, the sum of the shares before `next_year`.
    time_years: f64,
}

impl Iterator for Spans {
    type Item = Span;

    fn next(&mut self) -> Option<Span> {
        while self.next_year <= self.last_year {
            let year = self.next_year;
            self.next_year += 1;
            let fraction = if year == self.first_year {
                self.first_fraction
            } else if year == self.last_year {
                self.last_fraction
            } else {
                Some(1.0)
            };
            let Some(fraction_of_year) = fraction else {
                continue;
            };
            let time_start_years = self.time_years;
            self.time_years += fraction_of_year;
            return Some(Span {
                year,
                fraction_of_year,
                time_start_years,
                time_end_years: self.time_years,
            });
        }
        None
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use chrono::Days;

    /// Each period by date arithmetic alone, year by year: the reference
    /// the spans (date arithmetic at the two edges only) must equal.
    fn periods_by_dates(calendar: &Calendar) -> Vec<Period> {
        let (first, last) = calendar.operating_years();
        let mut time = 0.0;
        (first..=last)
            .filter_map(|year| {
                let start = NaiveDate::from_ymd_opt(year, 1, 1)?.max(calendar.commercial_operation);
                let next_start = NaiveDate::from_ymd_opt(year + 1, 1, 1)?.min(calendar.end_of_life);
                let leap = NaiveDate::from_ymd_opt(year, 2, 29).is_some();
                let fraction_of_year =
                    (next_start - start).num_days() as f64 / if leap { 366.0 } else { 365.0 };
                let time_start_years = time;
                time += fraction_of_year;
                Some(Period {
                    year,
                    start,
                    end: next_start.pred_opt()?,
                    fraction_of_year,
                    time_start_years,
                    time_end_years: time,
                })
            })
            .collect()
    }

    /// Starts on every fifth day over three years (a leap year among them,
    /// 1 January and 29 February included), lives from 1 to 60 years, and a
    /// life ending in the last representable year: the same periods, times
    /// equal to the bit.
    #[test]
    fn periods_equal_date_arithmetic_year_by_year() {
        let first_day = NaiveDate::from_ymd_opt(2027, 1, 1).unwrap();
        let mut starts: Vec<NaiveDate> = (0..220).map(|n| first_day + Days::new(5 * n)).collect();
        starts.push(NaiveDate::from_ymd_opt(2028, 2, 29).unwrap());
        for start in starts {
            for life in [1, 2, 3, 7, 30, 59, 60] {
                let calendar = Calendar::new(start, life).unwrap();
                let periods: Vec<Period> = calendar.periods().collect();
                assert_eq!(periods, periods_by_dates(&calendar), "{start} + {life}");
                assert_eq!(periods.len(), calendar.period_count());
            }
        }
        let last_year = NaiveDate::MAX.year();
        let near_the_end = NaiveDate::from_ymd_opt(last_year - 10, 6, 1).unwrap();
        let calendar = Calendar::new(near_the_end, 10).unwrap();
        let periods: Vec<Period> = calendar.periods().collect();
        assert_eq!(periods, periods_by_dates(&calendar));
    }
}
