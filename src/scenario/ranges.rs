//! Valid ranges of scenario values: one rule per field, used when a file is
//! loaded and again when a value is set through a key path.

/// Hours in a leap year, the most a year can operate (366 × 24).
pub const HOURS_PER_LEAP_YEAR: f64 = 8784.0;

/// Yearly rates (discount, inflation, escalations): lowest sensible value.
pub(crate) const RATE_LOW: f64 = -0.5;
/// Yearly rates: highest sensible value.
pub(crate) const RATE_HIGH: f64 = 1.0;
/// Why yearly rates are bounded so.
pub(crate) const RATE_REASON: &str = "a planning rate per year; beyond −50 % or +100 % a year the discounting of a multi-year ledger says nothing (common practice)";
/// Money per unit (per kW-yr, per MWh, per t): highest sensible value in
/// any currency.
pub(crate) const PRICE_HIGH: f64 = 1e7;
/// Why prices per unit are bounded so.
pub(crate) const PRICE_REASON: &str = "a price per unit in any currency; larger is a unit slip";
/// Amounts of money (capital, an overhaul): highest sensible value.
pub(crate) const AMOUNT_HIGH: f64 = 1e13;
/// Why amounts are bounded so.
pub(crate) const AMOUNT_REASON: &str = "an amount in any currency; larger is a unit slip";
/// Ambient air temperature: lowest and highest sensible values, K.
pub(crate) const AMBIENT_T_K: (f64, f64) = (180.0, 340.0);
/// Why ambient temperatures are bounded so.
pub(crate) const AMBIENT_T_REASON: &str = "the coldest and hottest air temperatures recorded on Earth, about 184 K and 330 K (from memory), with margin";
/// Ambient pressure: lowest and highest sensible values, kPa.
pub(crate) const AMBIENT_P_KPA: (f64, f64) = (30.0, 120.0);
/// Why ambient pressures are bounded so.
pub(crate) const AMBIENT_P_REASON: &str = "from above the highest sites anything is built (about 50 kPa at 5.5 km, ISO 2533) to below-sea-level sites in a strong high (about 108 kPa), with margin";

/// A number as a message shows it: as Rust prints it, except very large
/// or very small magnitudes in exponent form (`1e308`, not 309 digits).
pub(crate) fn shown(value: f64) -> String {
    let magnitude = value.abs();
    if value.is_finite() && value != 0.0 && !(1e-4..1e9).contains(&magnitude) {
        format!("{value:e}")
    } else {
        format!("{value}")
    }
}

/// The valid range of a numeric value.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) enum Range {
    /// An efficiency or load fraction: (0, 1].
    Efficiency,
    /// A pressure loss or auxiliary load: [0, 1).
    Loss,
    /// A fraction: [0, 1].
    Fraction,
    /// An effectiveness that cannot be perfect: (0, 1).
    OpenFraction,
    /// Strictly positive.
    Positive,
    /// Zero or more.
    NonNegative,
    /// Greater than one (a pressure ratio, a specific-heat ratio).
    AboveOne,
    /// A yearly rate above −100 %.
    Rate,
    /// Operating hours in a year: (0, 8784].
    HoursPerYear,
    /// A whole number from `.0` to `.1` inclusive.
    Whole(u32, u32),
}

impl Range {
    /// Check `value`; on failure return (what is wrong, what would be valid).
    pub fn check(self, value: f64) -> Result<(), (String, String)> {
        if !value.is_finite() {
            return Err((format!("{value} is not a finite number"), self.valid()));
        }
        let wrong = match self {
            Range::Efficiency if value <= 0.0 => Some("is not above 0"),
            Range::Efficiency | Range::Fraction if value > 1.0 => Some("is above 1"),
            Range::Loss if value >= 1.0 => Some("is not below 1"),
            Range::OpenFraction if value >= 1.0 => Some("is not below 1"),
            Range::OpenFraction | Range::Positive if value <= 0.0 => Some("is not above 0"),
            Range::Loss | Range::Fraction | Range::NonNegative if value < 0.0 => {
                Some("is negative")
            }
            Range::AboveOne if value <= 1.0 => Some("is not above 1"),
            Range::Rate if value <= -1.0 => Some("is not above -1 (-100 %)"),
            Range::HoursPerYear if value <= 0.0 => Some("is not above 0"),
            Range::HoursPerYear if value > HOURS_PER_LEAP_YEAR => {
                Some("is more than the 8784 hours of a leap year")
            }
            Range::Whole(..) if value.fract() != 0.0 => Some("is not a whole number"),
            Range::Whole(low, _) if value < f64::from(low) => Some("is too small"),
            Range::Whole(_, high) if value > f64::from(high) => Some("is too large"),
            _ => None,
        };
        match wrong {
            Some(why) => Err((format!("{} {why}", shown(value)), self.valid())),
            None => Ok(()),
        }
    }

    /// What would be valid, for messages.
    pub fn valid(self) -> String {
        match self {
            Range::Efficiency => "expected a fraction in (0, 1]".into(),
            Range::Loss => "expected a fraction in [0, 1)".into(),
            Range::Fraction => "expected a fraction in [0, 1]".into(),
            Range::OpenFraction => "expected a fraction in (0, 1)".into(),
            Range::Positive => "expected a value above 0".into(),
            Range::NonNegative => "expected a value of 0 or more".into(),
            Range::AboveOne => "expected a value above 1".into(),
            Range::Rate => "expected a yearly rate above -100 %, e.g. 7 % or 0.07".into(),
            Range::HoursPerYear => "expected hours in (0, 8784]".into(),
            Range::Whole(low, high) => format!("expected a whole number from {low} to {high}"),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn edges_of_each_range() {
        assert!(Range::Efficiency.check(1.0).is_ok());
        assert!(Range::Efficiency.check(0.0).is_err());
        assert_eq!(
            Range::Efficiency.check(1.3),
            Err((
                "1.3 is above 1".into(),
                "expected a fraction in (0, 1]".into()
            ))
        );
        assert!(Range::Loss.check(0.0).is_ok());
        assert!(Range::Loss.check(1.0).is_err());
        assert!(Range::Fraction.check(1.0).is_ok());
        assert!(Range::Fraction.check(-0.01).is_err());
        assert!(Range::OpenFraction.check(0.999).is_ok());
        assert!(Range::OpenFraction.check(1.0).is_err());
        assert!(Range::AboveOne.check(1.0).is_err());
        assert!(Range::Rate.check(-0.99).is_ok());
        assert!(Range::Rate.check(-1.0).is_err());
        assert!(Range::HoursPerYear.check(8784.0).is_ok());
        assert!(Range::HoursPerYear.check(8784.5).is_err());
        assert!(Range::Whole(1, 60).check(30.0).is_ok());
        assert!(Range::Whole(1, 60).check(30.5).is_err());
        assert!(Range::Whole(1, 60).check(61.0).is_err());
        assert!(Range::Positive.check(f64::NAN).is_err());
        assert_eq!(shown(1e308), "1e308");
        assert_eq!(shown(1.3), "1.3");
        assert_eq!(shown(2e6), "2000000");
    }
}

/// Physically sensible bounds of a value in its internal unit, inclusive,
/// with the reason they are where they are. Checked after the [`Range`]
/// (which keeps its sign and openness messages), so a value that passes
/// the sign rule but makes no physical sense is still refused at load.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Limits {
    /// Lowest valid value, internal unit.
    pub low: f64,
    /// Highest valid value, internal unit.
    pub high: f64,
    /// The internal unit as printed after a number (`"K"`, `""`).
    pub unit: &'static str,
    /// Why the bounds are where they are (shown in messages and the docs).
    pub reason: &'static str,
}

impl Limits {
    /// Check `value`; on failure return (what is wrong, what would be valid).
    pub fn check(&self, value: f64) -> Result<(), (String, String)> {
        let unit = if self.unit.is_empty() {
            String::new()
        } else {
            format!(" {}", self.unit)
        };
        let wrong = if !value.is_finite() {
            Some("is not a finite number")
        } else if value < self.low {
            Some("is below the sensible range")
        } else if value > self.high {
            Some("is above the sensible range")
        } else {
            None
        };
        match wrong {
            Some(why) => Err((format!("{}{unit} {why}", shown(value)), self.valid())),
            None => Ok(()),
        }
    }

    /// What would be valid, for messages: the bounds and the reason.
    pub fn valid(&self) -> String {
        let unit = if self.unit.is_empty() {
            String::new()
        } else {
            format!(" {}", self.unit)
        };
        format!(
            "expected {}{unit} to {}{unit} ({})",
            shown(self.low),
            shown(self.high),
            self.reason
        )
    }
}
