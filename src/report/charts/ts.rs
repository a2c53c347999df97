//! Temperature–entropy diagram of one candidate's cycle, drawn from its
//! solved state table: actual states joined in flow order, isentropic end
//! states hollow, the cycle closed through the atmosphere with a dashed line.

use super::frame::{draw_frame, Axis, LegendEntry, Swatch, SMALL_PT};
use super::geometry::{Anchor, Colour, LineStyle, Mark, MarkerShape, Pt, Rect};
use super::scale::tight_ticks;
use super::Chart;
use crate::report::model::{CandidateView, StateRow, Units};
use crate::report::pdf::labels::Labels;

/// kJ/(kg·K) per Btu/(lb·°R): 4.1868 exactly, by the definition of the
/// International Table Btu and calorie (NIST SP 811, 2008, Appendix B.8).
const KJ_PER_KG_K_PER_BTU_PER_LB_R: f64 = 4.1868;

/// Whether a state is an ideal (isentropic) end state: its id ends in "s".
pub fn is_isentropic(state: &StateRow) -> bool {
    state.id.ends_with('s')
}

/// Display value of a temperature in K.
fn temperature(kelvin: f64, units: Units) -> f64 {
    match units {
        Units::Si => kelvin,
        // °F = K × 9/5 − 459.67 (NIST SP 811, 4.2.1.1).
        Units::Us => kelvin * 1.8 - 459.67,
    }
}

fn entropy(kj_per_kg_k: f64, units: Units) -> f64 {
    match units {
        Units::Si => kj_per_kg_k,
        Units::Us => kj_per_kg_k / KJ_PER_KG_K_PER_BTU_PER_LB_R,
    }
}

/// The diagram of `candidate` inside `area`, with the series drawn in
/// `colour`; `None` when it has fewer than two states.
pub fn ts_chart(
    candidate: &CandidateView,
    units: Units,
    labels: &Labels,
    area: Rect,
    colour: Colour,
) -> Option<Chart> {
    let states = &candidate.cycle.states;
    if states.len() < 2 {
        return None;
    }
    let point = |s: &StateRow| {
        (
            entropy(s.entropy_kj_per_kg_k, units),
            temperature(s.temperature_k, units),
        )
    };
    let (s_min, s_max, t_min, t_max) = states.iter().map(point).fold(
        (
            f64::INFINITY,
            f64::NEG_INFINITY,
            f64::INFINITY,
            f64::NEG_INFINITY,
        ),
        |(a, b, c, d), (s, t)| (a.min(s), b.max(s), c.min(t), d.max(t)),
    );
    let x_ticks = tight_ticks(s_min, s_max, 6, 0.08);
    let y_ticks = tight_ticks(t_min, t_max, 6, 0.08);
    let (s_unit, t_unit) = match units {
        Units::Si => ("kJ/(kg·K)", "K"),
        Units::Us => ("Btu/(lb·°R)", "°F"),
    };
    let x_axis = Axis::numeric(format!("{}, {s_unit}", labels.entropy_axis), &x_ticks, 1.0);
    let y_axis = Axis::numeric(
        format!("{}, {t_unit}", labels.temperature_axis),
        &y_ticks,
        1.0,
    );
    let legend = [LegendEntry {
        label: format!("{} ({})", candidate.label, candidate.gas_model),
        swatch: Swatch::Line {
            style: LineStyle::Solid,
            colour,
            marker: Some(MarkerShape::Circle),
        },
    }];
    let mut marks = Vec::new();
    let title = format!("{}: {}", labels.ts_chart, candidate.label);
    let frame = draw_frame(area, &title, &x_axis, &y_axis, &legend, &mut marks);
    let at = |s: &StateRow| {
        let (x, y) = point(s);
        Pt::new(frame.x.map(x), frame.y.map(y))
    };
    let actual: Vec<&StateRow> = states.iter().filter(|s| !is_isentropic(s)).collect();
    let path: Vec<Pt> = actual.iter().map(|s| at(s)).collect();
    marks.push(Mark::Polyline {
        points: path.clone(),
        style: LineStyle::Solid,
        width_pt: 1.3,
        colour,
    });
    if let (Some(first), Some(last)) = (path.first(), path.last()) {
        marks.push(Mark::Polyline {
            points: vec![*last, *first],
            style: LineStyle::Dashed,
            width_pt: 0.9,
            colour: Colour::grey(0.4),
        });
    }
    let mut previous_actual: Option<Pt> = None;
    for s in states {
        let p = at(s);
        let ideal = is_isentropic(s);
        if ideal {
            if let Some(from) = previous_actual {
                marks.push(Mark::Polyline {
                    points: vec![from, p],
                    style: LineStyle::Dotted,
                    width_pt: 0.9,
                    colour: Colour::grey(0.3),
                });
            }
        } else {
            previous_actual = Some(p);
        }
        marks.push(Mark::Marker {
            at: p,
            shape: MarkerShape::Circle,
            size_mm: 2.0,
            colour,
            filled: !ideal,
        });
        let (dx, anchor) = if ideal {
            (-1.8, Anchor::Right)
        } else {
            (1.8, Anchor::Left)
        };
        marks.push(Mark::text(
            Pt::new(p.x_mm + dx, p.y_mm + 1.0),
            s.id.clone(),
            SMALL_PT,
            anchor,
        ));
    }
    Some(Chart { marks, frame })
}
