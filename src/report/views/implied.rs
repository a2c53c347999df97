//! What each bid's vendor figures imply, as `check` prints it: the implied
//! components, the energy-balance remainder, the verdict with its reasons,
//! the calibration's assumptions and the stated component values the fit
//! does not bear out (both values).

use crate::analysis::implied::ImpliedBid;
use crate::datasheet::Verdict;
use crate::report::format::{self, Quantity as Q};
use crate::report::model::Units;
use std::fmt::Write;

/// The verdict as one word.
pub fn verdict_word(verdict: Verdict) -> &'static str {
    match verdict {
        Verdict::Plausible => "plausible",
        Verdict::Optimistic => "optimistic",
        Verdict::Impossible => "impossible",
    }
}

/// The section `check` prints for the bids that state a datasheet; empty
/// when none does.
pub fn implied_text(bids: &[ImpliedBid], units: Units) -> String {
    let mut out = String::new();
    if bids.is_empty() {
        return out;
    }
    out.push_str("\nWhat each bid's datasheet implies:\n");
    for bid in bids {
        let i = &bid.assessment.implied;
        let _ = writeln!(
            out,
            "  {}: {} (loss remainder {:.2} % of fuel energy)",
            bid.candidate_id,
            verdict_word(i.verdict),
            i.loss_remainder_fraction * 100.0
        );
        let temperature = |t: Option<f64>| {
            t.map_or("not fitted".to_string(), |t| {
                format::with_unit(Q::Temperature, t, units, 1)
            })
        };
        let number = |v: Option<f64>, decimals: usize| {
            v.map_or("not fitted".to_string(), |v| format!("{v:.decimals$}"))
        };
        let _ = writeln!(
            out,
            "    implied: compressor polytropic {}, turbine polytropic {}, firing {}, \
             cooling {}, pressure ratio {}, air flow {}",
            number(i.compressor_polytropic_efficiency, 4),
            number(i.turbine_polytropic_efficiency, 4),
            temperature(i.firing_temperature_k),
            i.turbine_cooling
                .map_or("not fitted".to_string(), |c| format!("{:.1} %", c * 100.0)),
            number(i.pressure_ratio, 2),
            format::with_unit(Q::MassFlow, i.air_flow_kg_per_s, units, 2),
        );
        for reason in &i.reasons {
            let _ = writeln!(out, "    - {reason}");
        }
        for d in &bid.assessment.disagreements {
            let _ = writeln!(
                out,
                "    - disagrees with the stated components: {}",
                d.describe()
            );
        }
        if let Some(c) = &bid.assessment.calibration {
            let _ = writeln!(out, "    assumptions of the fit:");
            for a in &c.assumptions {
                let _ = writeln!(out, "      · {a}");
            }
        }
    }
    out
}
