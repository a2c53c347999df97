//! Did-you-mean suggestions for misspelt keys and names.

/// The candidate closest to `word` by Jaro–Winkler similarity, if it is
/// close enough (≥ 0.8) to be a likely misspelling.
pub(crate) fn closest<'a>(
    word: &str,
    candidates: impl IntoIterator<Item = &'a str>,
) -> Option<&'a str> {
    let lower = word.to_ascii_lowercase();
    candidates
        .into_iter()
        .map(|c| (strsim::jaro_winkler(&lower, &c.to_ascii_lowercase()), c))
        .filter(|(score, _)| *score >= 0.8)
        .max_by(|a, b| a.0.total_cmp(&b.0))
        .map(|(_, c)| c)
}

/// `" (did you mean X?)"` or an empty string.
pub(crate) fn did_you_mean<'a>(
    word: &str,
    candidates: impl IntoIterator<Item = &'a str>,
) -> String {
    closest(word, candidates).map_or_else(String::new, |c| format!(" (did you mean {c}?)"))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn finds_typos_and_ignores_strangers() {
        let keys = [
            "compressor_efficiency",
            "turbine_efficiency",
            "pressure_ratio",
        ];
        assert_eq!(
            closest("compresor_efficiency", keys),
            Some("compressor_efficiency")
        );
        assert_eq!(closest("Pressure_Ratio", keys), Some("pressure_ratio"));
        assert_eq!(closest("colour", keys), None);
    }
}
