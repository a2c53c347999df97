//! Chart geometry from known data: where the payback crossing, the
//! scenario's fuel price, the stacked cost streams, the cycle states and the
//! histogram bars land on the page. The model is the invented rendering
//! fixture, built so the expected positions are known exactly (e.g. savings
//! rising linearly from −4 000 000 by 800 000 a year cross zero at 5 years).

mod report_support;

use brayfin::report::charts::breakdown::breakdown_chart;
use brayfin::report::charts::fuel_price::fuel_price_chart;
use brayfin::report::charts::geometry::Colour;
use brayfin::report::charts::geometry::{Anchor, Mark, MarkerShape, Pt, Rect};
use brayfin::report::charts::histogram::histogram_chart;
use brayfin::report::charts::savings::savings_chart;
use brayfin::report::charts::scale::money_f64;
use brayfin::report::charts::tornado::tornado_chart;
use brayfin::report::charts::ts::{is_isentropic, ts_chart};
use brayfin::report::model::{Model, PaybackView};
use brayfin::report::pdf::context;
use brayfin::report::pdf::labels::Labels;
use brayfin::report::wording::Wording;

fn labels(model: &Model) -> Labels {
    let wording = Wording::builtin().expect("templates");
    let text = wording
        .render("headings.j2", &context::base(model))
        .expect("headings render");
    Labels::parse("headings.j2", &text).expect("headings parse")
}

fn area() -> Rect {
    Rect::new(20.0, 40.0, 170.0, 110.0)
}

/// y of `polyline` at `x`, by linear interpolation between its vertices.
fn y_at(points: &[Pt], x: f32) -> Option<f32> {
    points.windows(2).find_map(|w| {
        let (a, b) = (w[0], w[1]);
        (a.x_mm <= x && x <= b.x_mm && b.x_mm > a.x_mm)
            .then(|| a.y_mm + (b.y_mm - a.y_mm) * (x - a.x_mm) / (b.x_mm - a.x_mm))
    })
}

#[test]
fn the_payback_marker_sits_where_the_savings_line_crosses_zero() {
    let model = report_support::model(false, false);
    let chart = savings_chart(&model, &labels(&model), area()).expect("a chart");
    let frame = chart.chart.frame;
    // Bid B pays back at 5.0 years; Bid C never does within the life.
    assert_eq!(chart.payback_markers.len(), 1);
    let marker = &chart.payback_markers[0];
    assert_eq!(marker.candidate_id, "hx");
    let bid = model
        .candidates
        .iter()
        .find(|c| c.id == "hx")
        .expect("bid B");
    assert_eq!(bid.economics.discounted_payback, PaybackView::Years(5.0));
    assert!((frame.x.invert(marker.at.x_mm) - 5.0).abs() < 1e-3);
    assert!((marker.at.y_mm - frame.y.map(0.0)).abs() < 1e-3);
    // The drawn savings line of Bid B passes through the marker: the ledger
    // years 4 and 6 bracket the crossing, the line is straight between them.
    let first_savings_line = chart
        .chart
        .marks
        .iter()
        .find_map(|m| match m {
            Mark::Polyline { points, .. } if points.len() == bid.cumulative_savings.len() => {
                Some(points.clone())
            }
            _ => None,
        })
        .expect("the savings polyline");
    let y = y_at(&first_savings_line, marker.at.x_mm).expect("line spans the marker");
    assert!(
        (y - marker.at.y_mm).abs() < 0.01,
        "{y} vs {}",
        marker.at.y_mm
    );
    // Every drawn point is the ledger's cumulative savings on the scales.
    for (p, point) in bid.cumulative_savings.iter().zip(&first_savings_line) {
        assert!((frame.x.map(p.years_from_start) - point.x_mm).abs() < 1e-3);
        assert!((frame.y.map(money_f64(p.savings)) - point.y_mm).abs() < 1e-3);
    }
}

#[test]
fn the_scenario_fuel_price_and_premiums_asked_are_marked_at_that_price() {
    let model = report_support::model(false, false);
    let chart = fuel_price_chart(&model, &labels(&model), area()).expect("a chart");
    let frame = chart.frame;
    let price_x = frame
        .x
        .map(money_f64(model.fuel_price_curves.scenario_price_per_gj));
    let vertical = chart.marks.iter().any(|m| match m {
        Mark::Polyline { points, .. } => {
            points.len() == 2
                && (points[0].x_mm - price_x).abs() < 1e-3
                && (points[1].x_mm - price_x).abs() < 1e-3
                && (points[0].y_mm - frame.plot.y_mm).abs() < 1e-3
                && (points[1].y_mm - frame.plot.top_mm()).abs() < 1e-3
        }
        _ => false,
    });
    assert!(vertical, "a full-height line at the scenario's price");
    let hollow: Vec<Pt> = chart
        .marks
        .iter()
        .filter_map(|m| match m {
            Mark::Marker {
                at,
                shape: MarkerShape::Square,
                filled: false,
                ..
            } => Some(*at),
            _ => None,
        })
        .collect();
    for c in model.candidates.iter().filter(|c| !c.is_baseline) {
        let asked = c.economics.premium_asked.expect("a bid asks a premium");
        let expected = Pt::new(price_x, frame.y.map(money_f64(asked)));
        assert!(
            hollow
                .iter()
                .any(|p| (p.x_mm - expected.x_mm).abs() < 1e-3
                    && (p.y_mm - expected.y_mm).abs() < 1e-3),
            "premium asked of {} marked",
            c.id
        );
    }
}

#[test]
fn cost_streams_stack_from_zero_and_the_residual_hangs_below() {
    let model = report_support::model(false, false);
    let chart = breakdown_chart(&model, &labels(&model), area()).expect("a chart");
    let y = chart.chart.frame.y;
    for c in &model.candidates {
        let segments: Vec<_> = chart
            .segments
            .iter()
            .filter(|s| s.candidate_id == c.id)
            .collect();
        let b = &c.cost_breakdown;
        let positive = [
            b.capital,
            b.fuel,
            b.operation_and_maintenance,
            b.overhauls,
            b.carbon,
        ]
        .iter()
        .map(|d| money_f64(*d))
        .sum::<f64>();
        let top = segments
            .iter()
            .filter(|s| s.stream < 5)
            .map(|s| s.rect.top_mm())
            .fold(f32::MIN, f32::max);
        assert!((top - y.map(positive)).abs() < 1e-2, "{}: stack top", c.id);
        let capital = segments.iter().find(|s| s.stream == 0).expect("capital");
        assert!(
            (capital.rect.y_mm - y.map(0.0)).abs() < 1e-3,
            "capital starts at zero"
        );
        let residual = segments.iter().find(|s| s.stream == 5).expect("residual");
        assert!((residual.rect.top_mm() - y.map(0.0)).abs() < 1e-3);
        assert!((residual.rect.y_mm - y.map(money_f64(b.residual))).abs() < 1e-3);
    }
}

#[test]
fn the_ts_diagram_draws_each_state_and_hollows_the_isentropic_ones() {
    let model = report_support::model(false, false);
    let candidate = &model.candidates[2];
    let chart = ts_chart(
        candidate,
        model.meta.units,
        &labels(&model),
        area(),
        Colour::BLACK,
    )
    .expect("a chart");
    let frame = chart.frame;
    let markers: Vec<(Pt, bool)> = chart
        .marks
        .iter()
        .filter_map(|m| match m {
            Mark::Marker {
                at,
                filled,
                shape: MarkerShape::Circle,
                size_mm,
                ..
            } if *size_mm > 1.9 => Some((*at, *filled)),
            _ => None,
        })
        .collect();
    assert_eq!(markers.len(), candidate.cycle.states.len());
    for (state, (at, filled)) in candidate.cycle.states.iter().zip(&markers) {
        assert!((frame.x.map(state.entropy_kj_per_kg_k) - at.x_mm).abs() < 1e-3);
        assert!((frame.y.map(state.temperature_k) - at.y_mm).abs() < 1e-3);
        assert_eq!(*filled, !is_isentropic(state), "state {}", state.id);
        assert!(
            frame.plot.contains(*at, 1e-3),
            "state {} inside the plot",
            state.id
        );
    }
}

#[test]
fn tornado_bars_start_at_the_base_case_and_end_at_each_change() {
    let model = report_support::model(true, false);
    let bars: Vec<_> = model
        .sensitivity
        .iter()
        .filter(|b| b.candidate_id == "hx")
        .collect();
    let chart = tornado_chart(&bars, "Bid B", "USD", &labels(&model), area()).expect("a chart");
    let x = chart.frame.x;
    let zero = x.map(0.0);
    let areas: Vec<Rect> = chart
        .marks
        .iter()
        .filter_map(|m| match m {
            Mark::Area { points, .. } if points.len() == 4 => {
                let xs: Vec<f32> = points.iter().map(|p| p.x_mm).collect();
                let ys: Vec<f32> = points.iter().map(|p| p.y_mm).collect();
                let (x0, x1) = (
                    xs.iter().copied().fold(f32::MAX, f32::min),
                    xs.iter().copied().fold(f32::MIN, f32::max),
                );
                let (y0, y1) = (
                    ys.iter().copied().fold(f32::MAX, f32::min),
                    ys.iter().copied().fold(f32::MIN, f32::max),
                );
                Some(Rect::new(x0, y0, x1 - x0, y1 - y0))
            }
            _ => None,
        })
        .filter(|r| chart.frame.plot.contains(Pt::new(r.x_mm, r.y_mm), 1e-3))
        .collect();
    assert_eq!(areas.len(), 2 * bars.len());
    for bar in &bars {
        for delta in [bar.delta_at_low, bar.delta_at_high] {
            let end = x.map(money_f64(delta));
            let found = areas.iter().any(|r| {
                let (a, b) = (r.x_mm, r.right_mm());
                ((a - zero).abs() < 1e-3 && (b - end).abs() < 1e-3)
                    || ((b - zero).abs() < 1e-3 && (a - end).abs() < 1e-3)
            });
            assert!(found, "{} bar to {delta}", bar.key);
        }
    }
}

#[test]
fn histogram_bars_are_as_tall_as_their_counts() {
    let model = report_support::model(false, true);
    let risk = &model.risk.as_ref().expect("risk").candidates[0];
    let chart = histogram_chart(risk, "Bid B", "USD", &labels(&model), area()).expect("a chart");
    let y = chart.frame.y;
    let x = chart.frame.x;
    let bars: Vec<Rect> = chart
        .marks
        .iter()
        .filter_map(|m| match m {
            Mark::Area { points, .. } if points.len() == 4 => Some(Rect::new(
                points[0].x_mm,
                points[0].y_mm,
                points[2].x_mm - points[0].x_mm,
                points[2].y_mm - points[0].y_mm,
            )),
            _ => None,
        })
        .filter(|r| chart.frame.plot.contains(Pt::new(r.x_mm, r.y_mm), 1e-3))
        .collect();
    let h = &risk.histogram;
    let nonzero: Vec<(usize, u64)> = h
        .counts
        .iter()
        .copied()
        .enumerate()
        .filter(|(_, c)| *c > 0)
        .collect();
    assert_eq!(bars.len(), nonzero.len());
    for ((i, count), bar) in nonzero.iter().zip(&bars) {
        let left = money_f64(h.low) + money_f64(h.bin_width) * *i as f64;
        assert!((bar.x_mm - x.map(left)).abs() < 1e-3);
        assert!((bar.top_mm() - y.map(*count as f64)).abs() < 1e-3);
    }
}

/// Labels drawn anywhere in a chart.
fn label_texts(marks: &[Mark]) -> Vec<String> {
    marks
        .iter()
        .filter_map(|m| match m {
            Mark::Label { text, .. } => Some(text.clone()),
            _ => None,
        })
        .collect()
}

#[test]
fn output_bought_in_is_a_category_only_when_charged() {
    let plain = report_support::model(false, false);
    let names = labels(&plain);
    let chart = breakdown_chart(&plain, &names, area()).expect("a chart");
    assert!(chart.segments.iter().all(|s| s.stream != 6));
    assert!(!label_texts(&chart.chart.marks).contains(&names.bought_in));

    let model = report_support::levelled(false, false);
    let chart = breakdown_chart(&model, &labels(&model), area()).expect("a chart");
    assert!(label_texts(&chart.chart.marks).contains(&names.bought_in));
    let y = chart.chart.frame.y;
    let base = &model.candidates[0];
    let b = &base.cost_breakdown;
    let own = [
        b.capital,
        b.fuel,
        b.operation_and_maintenance,
        b.overhauls,
        b.carbon,
    ]
    .iter()
    .map(|d| money_f64(*d))
    .sum::<f64>();
    let segment = chart
        .segments
        .iter()
        .find(|s| s.candidate_id == base.id && s.stream == 6)
        .expect("the baseline's bought_in is drawn");
    // Stacked on top of the candidate's own costs, up to own + bought_in.
    assert!((segment.rect.y_mm - y.map(own)).abs() < 1e-2);
    assert!((segment.rect.top_mm() - y.map(own + money_f64(b.bought_in))).abs() < 1e-2);
    // The others are charged nothing and draw no bought_in segment.
    assert_eq!(chart.segments.iter().filter(|s| s.stream == 6).count(), 1);
}

#[test]
fn tornado_value_labels_stay_inside_the_plot_even_with_long_values() {
    // Values as wide as a fuel price with its unit and basis, on the
    // longest bars: their labels must not run past the frame.
    let mut model = report_support::model(true, false);
    for b in &mut model.sensitivity {
        b.low_value = "USD 2.600/GJ HHV".into();
        b.high_value = "USD 6.273/GJ HHV".into();
    }
    let bars: Vec<_> = model
        .sensitivity
        .iter()
        .filter(|b| b.candidate_id == "hx")
        .collect();
    let chart = tornado_chart(&bars, "Bid B", "USD", &labels(&model), area()).expect("a chart");
    let plot = chart.frame.plot;
    let mut checked = 0;
    for mark in &chart.marks {
        let Mark::Label {
            at,
            text,
            size_pt,
            anchor,
            ..
        } = mark
        else {
            continue;
        };
        if !text.contains("USD 2.600") && !text.contains("USD 6.273") {
            continue;
        }
        let width = brayfin::report::pdf::fonts::text_width_mm(
            text,
            brayfin::report::pdf::fonts::Face::Regular,
            *size_pt,
        );
        let (left, right) = match anchor {
            Anchor::Left => (at.x_mm, at.x_mm + width),
            Anchor::Right => (at.x_mm - width, at.x_mm),
            Anchor::Centre => (at.x_mm - width / 2.0, at.x_mm + width / 2.0),
        };
        assert!(
            left >= plot.x_mm - 1e-3 && right <= plot.right_mm() + 1e-3,
            "{text:?} spans {left}..{right} mm, plot {}..{} mm",
            plot.x_mm,
            plot.right_mm()
        );
        checked += 1;
    }
    assert_eq!(checked, 2 * bars.len());
}

#[test]
fn heat_addition_is_drawn_as_a_constant_pressure_curve() {
    // Along an isobar of an ideal gas with constant c_p, T ds = c_p dT, so
    // T = T_a (T_b/T_a)^((s - s_a)/(s_b - s_a)) between two states (Gibbs
    // relation; e.g. Cengel & Boles, Thermodynamics, ch. 7, from memory).
    let model = report_support::model(false, false);
    let c = &model.candidates[1];
    let states = &c.cycle.states;
    let two = states.iter().find(|s| s.id == "2").expect("state 2");
    let three = states.iter().find(|s| s.id == "3").expect("state 3");
    let points = brayfin::report::charts::ts::segment(two, three);
    assert!(points.len() > 2, "a curve, not a chord");
    for (s, t) in &points {
        let f =
            (s - two.entropy_kj_per_kg_k) / (three.entropy_kj_per_kg_k - two.entropy_kj_per_kg_k);
        let expected = two.temperature_k * (three.temperature_k / two.temperature_k).powf(f);
        assert!((t - expected).abs() < 1e-9 * expected, "{s}, {t}");
        // The isobar bows below the chord (T is convex in s).
        let chord = two.temperature_k + f * (three.temperature_k - two.temperature_k);
        assert!(*t <= chord + 1e-9);
    }
    // Compression changes the pressure many times over: a straight line.
    let one = states.iter().find(|s| s.id == "1").expect("state 1");
    assert_eq!(brayfin::report::charts::ts::segment(one, two).len(), 2);
    // The drawn path carries the curve's midpoint.
    let chart =
        ts_chart(c, model.meta.units, &labels(&model), area(), Colour::BLACK).expect("a chart");
    let (s_mid, t_mid) = points[points.len() / 2];
    let mid = Pt::new(chart.frame.x.map(s_mid), chart.frame.y.map(t_mid));
    let on_path = chart.marks.iter().any(|m| match m {
        Mark::Polyline { points, .. } => points
            .iter()
            .any(|p| (p.x_mm - mid.x_mm).abs() < 1e-3 && (p.y_mm - mid.y_mm).abs() < 1e-3),
        _ => false,
    });
    assert!(on_path, "the curve's midpoint is on the drawn path");
}

#[test]
fn stream_difference_bars_run_from_zero_to_each_difference() {
    use brayfin::report::charts::difference::{difference_chart, stream_values};
    let model = report_support::model(false, false);
    let chart = difference_chart(&model, &labels(&model), area()).expect("a chart");
    let x = chart.chart.frame.x;
    let zero = x.map(0.0);
    let bids: Vec<_> = model.candidates.iter().filter(|c| !c.is_baseline).collect();
    let mut drawn = 0;
    for c in &bids {
        let d = c.cost_difference.as_ref().expect("a difference");
        for (stream, value) in stream_values(d).into_iter().enumerate() {
            // A stream where no candidate differs is left out.
            let shown = bids.iter().any(|o| {
                stream_values(o.cost_difference.as_ref().expect("a difference"))[stream] != 0.0
            });
            let bar = chart
                .bars
                .iter()
                .find(|b| b.candidate_id == c.id && b.stream == stream);
            assert_eq!(bar.is_some(), shown, "{} stream {stream}", c.id);
            if let Some(bar) = bar {
                assert_eq!(bar.value, value);
                let end = x.map(value);
                let (a, b) = (bar.rect.x_mm, bar.rect.right_mm());
                assert!((a - zero.min(end)).abs() < 1e-3 && (b - zero.max(end)).abs() < 1e-3);
                drawn += 1;
            }
        }
    }
    // Capital, fuel, overhauls, carbon and residual differ in the fixture.
    assert_eq!(drawn, 5 * bids.len());
    // The baseline has no bars of its own.
    assert!(chart
        .bars
        .iter()
        .all(|b| b.candidate_id != model.candidates[0].id));
}
