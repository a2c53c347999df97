//! Present-value factors in closed form, as published in NIST Handbook 135
//! (Fuller & Petersen, "Life-Cycle Costing Manual for the Federal Energy
//! Management Program", 1995), section on discounting.
//!
//! The ledger does not call these: it discounts row by row. Tests check that
//! the ledger's row-by-row discounting reproduces these closed forms, so the
//! two are independent computations of the same quantity.
//! All rates are fractions per year (0.03 = 3 %); periods are whole years;
//! cash flows fall at the end of each year.

/// Single present value factor: the present value of 1 paid `t` years from
/// now, `SPV = 1 / (1 + d)^t`.
pub fn single_present_value(discount_rate: f64, years: f64) -> f64 {
    (1.0 + discount_rate).powf(-years)
}

/// Uniform present value factor: the present value of 1 paid at the end of
/// each of `n` years, `UPV = ((1 + d)^n - 1) / (d (1 + d)^n)`; equal to `n`
/// when `d = 0`.
pub fn uniform_present_value(discount_rate: f64, years: u32) -> f64 {
    let n = f64::from(years);
    if discount_rate == 0.0 {
        return n;
    }
    let growth = (1.0 + discount_rate).powf(n);
    (growth - 1.0) / (discount_rate * growth)
}

/// Modified uniform present value factor: the present value of a yearly
/// amount that is 1 at the base date and escalates at `e` per year, paid at
/// the end of each of `n` years,
/// `UPV* = ((1 + e) / (d - e)) (1 - ((1 + e) / (1 + d))^n)`; equal to `n`
/// when `e = d` (every term is then 1).
pub fn modified_uniform_present_value(discount_rate: f64, escalation: f64, years: u32) -> f64 {
    let n = f64::from(years);
    if escalation == discount_rate {
        return n;
    }
    let ratio = (1.0 + escalation) / (1.0 + discount_rate);
    ((1.0 + escalation) / (discount_rate - escalation)) * (1.0 - ratio.powf(n))
}
