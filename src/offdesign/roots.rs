//! A safeguarded secant search for the one-dimensional control problems:
//! find x in a bracket where an increasing function crosses zero. Points
//! where the machine cannot run (no net work, a turbine inlet below the
//! compressor delivery) count as "below zero" without a value, so the
//! search bisects towards the valid side.

/// One evaluation: `Some((value, payload))`, or `None` where the function
/// is not defined (taken as below zero).
pub(crate) type Eval<T> = Option<(f64, T)>;

/// Outcome of a search.
pub(crate) enum Found<T> {
    /// The root, with the payload of its evaluation.
    Root(T),
    /// The bracket closed on the edge of the valid region without the
    /// function reaching zero: no root exists where it is defined.
    Undefined,
}

/// Find x in (`lo`, `hi`) with `f(x) = 0` to |f| ≤ `f_tol` (or the bracket
/// narrowed to `x_tol`), given `f(hi) = f_hi > 0`, `f` increasing, and a
/// first guess `x0`. `f(lo)` is not evaluated: it is taken as below zero.
pub(crate) fn increasing_root<T, E>(
    mut f: impl FnMut(f64) -> Result<Eval<T>, E>,
    lo: f64,
    hi: (f64, f64, T),
    x0: f64,
    f_tol: f64,
    x_tol: f64,
) -> Result<Found<T>, E> {
    let (mut b, mut fb, mut best) = hi;
    let mut a = lo;
    let mut fa: Option<f64> = None;
    // The last two valued points, for the secant.
    let mut last: (f64, f64) = (b, fb);
    let mut prev: Option<(f64, f64)> = None;
    let mut x = x0;
    // Consecutive moves of the same end: a secant that keeps landing on one
    // side is replaced by a bisection, so the bracket always shrinks.
    let mut same_end = 0u32;
    let mut moved_b = true;
    for _ in 0..200 {
        if !(x > a && x < b) {
            x = 0.5 * (a + b);
        }
        match f(x)? {
            Some((v, payload)) => {
                if v.abs() <= f_tol {
                    return Ok(Found::Root(payload));
                }
                let to_b = v > 0.0;
                same_end = if to_b == moved_b { same_end + 1 } else { 0 };
                moved_b = to_b;
                if to_b {
                    (b, fb) = (x, v);
                    best = payload;
                } else {
                    (a, fa) = (x, Some(v));
                }
                prev = Some(last);
                last = (x, v);
            }
            None => {
                a = x;
                fa = None;
                same_end = 0;
                moved_b = false;
            }
        }
        if b - a <= x_tol {
            return Ok(match fa {
                Some(_) => Found::Root(best),
                None => Found::Undefined,
            });
        }
        // Next guess: secant through the two latest valued points, else
        // regula falsi on the bracket, else bisection (a bad guess is
        // caught at the top of the loop).
        x = match (prev, fa) {
            (Some((x1, v1)), _) if v1 != last.1 => last.0 - last.1 * (last.0 - x1) / (last.1 - v1),
            (_, Some(va)) => a - va * (b - a) / (fb - va),
            _ => 0.5 * (a + b),
        };
        if same_end >= 3 {
            x = 0.5 * (a + b);
            same_end = 0;
        }
    }
    Ok(Found::Undefined)
}
