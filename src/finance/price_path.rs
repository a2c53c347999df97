//! A year-by-year fuel price path, checked against the operating years.

use super::money::Money;
use super::validate::check_money_named;
use super::FinanceError;

/// Prices indexed by calendar year from `first_year`, one per operating
/// year. Errors on a duplicate year anywhere in `path`, a negative price, or
/// a missing year in `first_year..=last_year`; years outside that span are
/// ignored.
pub(crate) fn resolve_price_path<M: Money>(
    path: &[(i32, M)],
    first_year: i32,
    last_year: i32,
) -> Result<Vec<M>, FinanceError> {
    let span = (last_year - first_year + 1).max(0) as usize;
    let mut prices: Vec<Option<M>> = vec![None; span];
    let mut outside: Vec<i32> = Vec::new();
    for &(year, price) in path {
        check_money_named(price, || format!("fuel.price_path[{year}]"))?;
        let slot = usize::try_from(year - first_year)
            .ok()
            .and_then(|index| prices.get_mut(index));
        match slot {
            Some(Some(_)) => return Err(FinanceError::PricePathDuplicateYear { year }),
            Some(entry) => *entry = Some(price),
            None if outside.contains(&year) => {
                return Err(FinanceError::PricePathDuplicateYear { year })
            }
            None => outside.push(year),
        }
    }
    prices
        .into_iter()
        .zip(first_year..)
        .map(|(price, year)| {
            price.ok_or(FinanceError::PricePathMissingYear {
                year,
                first: first_year,
                last: last_year,
            })
        })
        .collect()
}
