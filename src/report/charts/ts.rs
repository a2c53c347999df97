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

/// Largest relative pressure change between two states still drawn as one
/// constant-pressure process (a combustor, regenerator side or exhaust
/// loses a few per cent; compression and expansion change the pressure
/// many times over).
const ISOBAR_PRESSURE_CHANGE: f64 = 0.15;

/// Points per constant-pressure curve.
const ISOBAR_POINTS: usize = 24;

/// The path from state `a` to state `b` as (entropy kJ/(kg·K), temperature
/// K) points. Heat addition and rejection happen at (nearly) constant
/// pressure, where an ideal gas with a constant specific heat over the
/// segment follows T = T_a·exp((s − s_a)/c_p) (Gibbs relation with dp = 0,
/// T ds = c_p dT; e.g. Cengel & Boles, Thermodynamics, ch. 7, from memory);
/// with c_p fitted to the two end states this is
/// T = T_a·(T_b/T_a)^((s − s_a)/(s_b − s_a)). Compression and expansion are
/// not drawn as paths: their end states are joined by a straight line.
pub fn segment(a: &StateRow, b: &StateRow) -> Vec<(f64, f64)> {
    let (sa, ta, sb, tb) = (
        a.entropy_kj_per_kg_k,
        a.temperature_k,
        b.entropy_kj_per_kg_k,
        b.temperature_k,
    );
    let isobar = a.pressure_kpa > 0.0
        && (b.pressure_kpa / a.pressure_kpa - 1.0).abs() <= ISOBAR_PRESSURE_CHANGE
        && ta > 0.0
        && tb > 0.0
        && (sb - sa).abs() > 1e-9;
    if !isobar {
        return vec![(sa, ta), (sb, tb)];
    }
    (0..=ISOBAR_POINTS)
        .map(|i| {
            let f = i as f64 / ISOBAR_POINTS as f64;
            (sa + f * (sb - sa), ta * (tb / ta).powf(f))
        })
        .collect()
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
    let to_page = |(s_si, t_k): (f64, f64)| {
        Pt::new(
            frame.x.map(entropy(s_si, units)),
            frame.y.map(temperature(t_k, units)),
        )
    };
    let mut path: Vec<Pt> = Vec::new();
    for pair in actual.windows(2) {
        let points = segment(pair[0], pair[1]);
        // Each segment starts where the previous one ended.
        let skip = usize::from(!path.is_empty());
        path.extend(points.into_iter().skip(skip).map(to_page));
    }
    if path.is_empty() {
        path.extend(actual.iter().map(|s| at(s)));
    }
    marks.push(Mark::Polyline {
        points: path,
        style: LineStyle::Solid,
        width_pt: 1.3,
        colour,
    });
    if let (Some(first), Some(last)) = (actual.first(), actual.last()) {
        marks.push(Mark::Polyline {
            points: segment(last, first).into_iter().map(to_page).collect(),
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
