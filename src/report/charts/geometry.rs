//! The drawing vocabulary shared by the charts and the PDF pages: points,
//! boxes, colours, line styles, marker shapes and the marks made of them.
//! Plain data in page coordinates (mm from the bottom-left corner of the
//! page, y up), so tests can check where things are without a PDF.

/// A point on the page, mm from the bottom-left corner.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Pt {
    /// Distance from the left edge, mm.
    pub x_mm: f32,
    /// Distance from the bottom edge, mm.
    pub y_mm: f32,
}

impl Pt {
    /// A point at (`x_mm`, `y_mm`).
    pub fn new(x_mm: f32, y_mm: f32) -> Self {
        Pt { x_mm, y_mm }
    }
}

/// An axis-aligned box on the page, mm; (`x_mm`, `y_mm`) is its
/// bottom-left corner; width and height are not negative.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Rect {
    /// Left edge, mm.
    pub x_mm: f32,
    /// Bottom edge, mm.
    pub y_mm: f32,
    /// Width, mm.
    pub width_mm: f32,
    /// Height, mm.
    pub height_mm: f32,
}

impl Rect {
    /// A box from its bottom-left corner and size; a negative size is
    /// flipped so the box stays the same region.
    pub fn new(x_mm: f32, y_mm: f32, width_mm: f32, height_mm: f32) -> Self {
        Rect {
            x_mm: x_mm.min(x_mm + width_mm),
            y_mm: y_mm.min(y_mm + height_mm),
            width_mm: width_mm.abs(),
            height_mm: height_mm.abs(),
        }
    }

    /// Right edge, mm.
    pub fn right_mm(&self) -> f32 {
        self.x_mm + self.width_mm
    }

    /// Top edge, mm.
    pub fn top_mm(&self) -> f32 {
        self.y_mm + self.height_mm
    }

    /// Whether `p` lies inside or on the edge of the box, with `slack_mm`
    /// of tolerance.
    pub fn contains(&self, p: Pt, slack_mm: f32) -> bool {
        p.x_mm >= self.x_mm - slack_mm
            && p.x_mm <= self.right_mm() + slack_mm
            && p.y_mm >= self.y_mm - slack_mm
            && p.y_mm <= self.top_mm() + slack_mm
    }
}

/// An RGB colour, each channel 0..=1.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Colour {
    /// Red.
    pub r: f32,
    /// Green.
    pub g: f32,
    /// Blue.
    pub b: f32,
}

impl Colour {
    /// Black text and axes.
    pub const BLACK: Colour = Colour::grey(0.0);
    /// White.
    pub const WHITE: Colour = Colour::grey(1.0);

    /// A colour from channels 0..=1.
    pub const fn rgb(r: f32, g: f32, b: f32) -> Self {
        Colour { r, g, b }
    }

    /// A grey, 0 = black, 1 = white.
    pub const fn grey(level: f32) -> Self {
        Colour {
            r: level,
            g: level,
            b: level,
        }
    }
}

/// How a line is stroked; with colour, this tells series apart in print.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum LineStyle {
    /// Continuous.
    Solid,
    /// Long dashes.
    Dashed,
    /// Dots.
    Dotted,
    /// Dash, dot, dash.
    DashDot,
}

/// Marker shape; with colour, this tells series apart in print.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum MarkerShape {
    /// Circle (drawn as an octagon).
    Circle,
    /// Square.
    Square,
    /// Triangle, point up.
    Triangle,
    /// Diamond.
    Diamond,
}

/// Where a label's anchor point sits on the text.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Anchor {
    /// Anchor at the start of the baseline.
    Left,
    /// Anchor at the middle of the baseline.
    Centre,
    /// Anchor at the end of the baseline.
    Right,
}

/// Text weight of a label.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Weight {
    /// Regular.
    Regular,
    /// Bold.
    Bold,
    /// Fixed pitch.
    Mono,
}

/// One thing drawn on a page.
#[derive(Debug, Clone, PartialEq)]
pub enum Mark {
    /// An open or closed stroked line.
    Polyline {
        /// Vertices in order.
        points: Vec<Pt>,
        /// Stroke style.
        style: LineStyle,
        /// Stroke width, pt.
        width_pt: f32,
        /// Stroke colour.
        colour: Colour,
    },
    /// A filled polygon, optionally outlined and hatched.
    Area {
        /// Vertices in order (closed implicitly).
        points: Vec<Pt>,
        /// Fill colour.
        fill: Colour,
        /// Outline colour, if any.
        outline: Option<Colour>,
        /// Diagonal hatch lines drawn over the fill (already clipped to the
        /// area's bounding box; only rectangles are hatched).
        hatch: Vec<(Pt, Pt)>,
    },
    /// A point marker centred on `at`.
    Marker {
        /// Centre.
        at: Pt,
        /// Shape.
        shape: MarkerShape,
        /// Overall size (width), mm.
        size_mm: f32,
        /// Colour.
        colour: Colour,
        /// Filled (true) or outline only.
        filled: bool,
    },
    /// A line of text.
    Label {
        /// Anchor point on the baseline.
        at: Pt,
        /// The text (transliterated to the font encoding when drawn).
        text: String,
        /// Font size, pt.
        size_pt: f32,
        /// Where the anchor sits on the text.
        anchor: Anchor,
        /// Weight.
        weight: Weight,
        /// Colour.
        colour: Colour,
        /// Rotated 90 degrees counter-clockwise (reads bottom to top).
        vertical: bool,
    },
}

impl Mark {
    /// A horizontal, black, regular-weight label.
    pub fn text(at: Pt, text: impl Into<String>, size_pt: f32, anchor: Anchor) -> Mark {
        Mark::Label {
            at,
            text: text.into(),
            size_pt,
            anchor,
            weight: Weight::Regular,
            colour: Colour::BLACK,
            vertical: false,
        }
    }

    /// A solid black line between two points.
    pub fn rule(from: Pt, to: Pt, width_pt: f32) -> Mark {
        Mark::Polyline {
            points: vec![from, to],
            style: LineStyle::Solid,
            width_pt,
            colour: Colour::BLACK,
        }
    }

    /// A filled rectangle without outline or hatch.
    pub fn fill(rect: Rect, fill: Colour) -> Mark {
        Mark::Area {
            points: rect_corners(rect),
            fill,
            outline: None,
            hatch: Vec::new(),
        }
    }
}

/// The four corners of `rect`, anticlockwise from bottom-left.
pub fn rect_corners(rect: Rect) -> Vec<Pt> {
    vec![
        Pt::new(rect.x_mm, rect.y_mm),
        Pt::new(rect.right_mm(), rect.y_mm),
        Pt::new(rect.right_mm(), rect.top_mm()),
        Pt::new(rect.x_mm, rect.top_mm()),
    ]
}

/// 45-degree hatch lines across `rect`, `spacing_mm` apart, each clipped to
/// the rectangle.
pub fn hatch_lines(rect: Rect, spacing_mm: f32) -> Vec<(Pt, Pt)> {
    let mut lines = Vec::new();
    if rect.width_mm <= 0.0 || rect.height_mm <= 0.0 || spacing_mm <= 0.0 {
        return lines;
    }
    // Lines y - x = c for c across the box; clip each to the rectangle.
    let c_min = rect.y_mm - rect.right_mm();
    let c_max = rect.top_mm() - rect.x_mm;
    let mut c = c_min + spacing_mm / 2.0;
    while c < c_max {
        let x0 = rect.x_mm.max(rect.y_mm - c);
        let x1 = rect.right_mm().min(rect.top_mm() - c);
        if x1 > x0 {
            lines.push((Pt::new(x0, x0 + c), Pt::new(x1, x1 + c)));
        }
        c += spacing_mm;
    }
    lines
}
