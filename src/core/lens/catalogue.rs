//! What is usually made: the grids of additions, degressions, progression
//! lengths and segment placements a planner iterates over when the user
//! leaves a parameter open, the one mapping of a saved lens option
//! ([`FamilyChoice`]) to its parameter axes (which parameter, which grid,
//! which range) that both [`Candidates`] and the planner's solver walk, and
//! the translation of a lens option into designs.

use super::error::{LensError, NamedBounds};
use super::limits::{
    ADDITION, DEGRESSION, INTERMEDIATE_RATIO, NEAR_ADDITION, PROGRESSION_LENGTH, SEGMENT_TOP,
    UPPER_BOTTOM,
};
use super::progressive::DEFAULT_NEAR_INSET_MM;
use super::trifocal::DEFAULT_BAND_HEIGHT_MM;
use super::FamilyChoice;
use super::{
    Bifocal, Degressive, DoubleSegment, Family, LensDesign, Parameter, Progressive, SegmentShape,
    SingleVision, Trifocal,
};
use crate::core::units::{Dioptres, Millimetres};

/// Evenly spaced values from `first` to `last` inclusive, `step` apart, in
/// the unit of the parameter it belongs to (stated on each grid).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Grid {
    /// The smallest value.
    pub first: f64,
    /// The largest value.
    pub last: f64,
    /// The spacing between values.
    pub step: f64,
}

impl Grid {
    /// Number of values on the grid.
    pub fn len(&self) -> usize {
        ((self.last - self.first) / self.step).round() as usize + 1
    }

    /// Whether the grid holds no value (never for the grids defined here).
    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }

    /// The `i`-th value, or `None` past the end.
    pub fn get(&self, i: usize) -> Option<f64> {
        (i < self.len()).then_some(self.first + i as f64 * self.step)
    }

    /// All values, smallest first, without allocating.
    pub fn iter(&self) -> impl Iterator<Item = f64> + '_ {
        (0..self.len()).map(move |i| self.first + i as f64 * self.step)
    }
}

/// Additions of multifocal lenses as made, in dioptres: +0.75 to +3.50 D in
/// 0.25 D steps (common practice).
pub const ADDITION_GRID: Grid = Grid {
    first: 0.75,
    last: 3.5,
    step: 0.25,
};

/// Additions of single-vision task lenses, in dioptres: 0 (distance) to
/// +4.00 D in 0.25 D steps, the whole range the scenario gate allows (near
/// lenses are made well beyond it; common practice).
pub const SINGLE_VISION_ADDITION_GRID: Grid = Grid {
    first: 0.0,
    last: crate::core::limits::ADDITION.max,
    step: 0.25,
};

/// Degressions of occupational lenses as made, in dioptres: 0.50 to 2.00 D
/// in 0.25 D steps (common practice).
pub const DEGRESSION_GRID: Grid = Grid {
    first: 0.5,
    last: 2.0,
    step: 0.25,
};

/// Progression lengths of progressive lenses, in millimetres: short designs
/// from about 11 mm to long ones of about 20 mm, in 1 mm steps (common practice).
pub const PROGRESSION_LENGTH_GRID: Grid = Grid {
    first: 11.0,
    last: 20.0,
    step: 1.0,
};

/// Segment top heights tried for bifocals, trifocals and the lower segment of
/// double-segment lenses, in millimetres from the fitting point: from 8 mm
/// below to level with it, in 1 mm steps. Segment tops are usually fitted at
/// the lower lid margin, a few millimetres below the pupil centre (common practice).
pub const SEGMENT_TOP_GRID: Grid = Grid {
    first: -8.0,
    last: 0.0,
    step: 1.0,
};

/// Heights of the upper segment's bottom edge tried for double-segment
/// lenses, in millimetres above the fitting point (a fitting choice; common practice).
pub const UPPER_BOTTOM_GRID: Grid = Grid {
    first: 6.0,
    last: 16.0,
    step: 2.0,
};

/// Trifocal intermediate ratios tried: 0.5 is conventional, higher shares
/// are also made (from memory).
pub const INTERMEDIATE_RATIO_GRID: Grid = Grid {
    first: 0.5,
    last: 0.7,
    step: 0.1,
};

/// One parameter of a lens option: which it is, the user's value if fixed,
/// and the grid of values made (in the parameter's unit: dioptres for
/// powers, millimetres for heights and lengths, none for the ratio).
#[derive(Debug, Clone, Copy)]
pub struct Axis {
    /// Which parameter.
    pub kind: Parameter,
    /// The user's value, or `None` to choose from `grid`.
    pub fixed: Option<f64>,
    /// The values made.
    pub grid: Grid,
    /// The range the lens models accept.
    bounds: NamedBounds,
}

impl Axis {
    /// The number of values to try: one when fixed, else the grid's length.
    pub fn len(&self) -> usize {
        if self.fixed.is_some() {
            1
        } else {
            self.grid.len()
        }
    }

    /// Whether there is no value to try (never: a fixed axis has one).
    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }

    /// The `i`-th value to try: the fixed value, else the grid's `i`-th
    /// (its first past the end).
    pub fn value(&self, i: usize) -> f64 {
        self.fixed
            .or_else(|| self.grid.get(i))
            .unwrap_or(self.grid.first)
    }
}

fn axis(kind: Parameter, fixed: Option<f64>, grid: Grid, bounds: NamedBounds) -> Axis {
    Axis {
        kind,
        fixed,
        grid,
        bounds,
    }
}

/// The number of values to try on an axis slot; an unused slot has one (zero).
fn slot_len(a: &Option<Axis>) -> usize {
    a.map_or(1, |a| a.len())
}

/// The value of an axis slot at grid index `i`; an unused slot gives zero.
fn slot_value(a: &Option<Axis>, i: usize) -> f64 {
    a.map_or(0.0, |a| a.value(i))
}

/// The family a lens option describes and its parameters, in the order
/// [`with_values`] takes them; the slots a family does not use (always the
/// last ones) are `None`. The grids are the ones [`Candidates`] iterates over.
pub fn option_axes(choice: &FamilyChoice) -> (Family, [Option<Axis>; 3]) {
    use Parameter as P;
    match *choice {
        FamilyChoice::SingleVision { addition_d } => (
            Family::SingleVision,
            [
                Some(axis(
                    P::Addition,
                    addition_d,
                    SINGLE_VISION_ADDITION_GRID,
                    ADDITION,
                )),
                None,
                None,
            ],
        ),
        FamilyChoice::Bifocal {
            addition_d,
            segment_top_mm,
        } => (
            Family::Bifocal,
            [
                Some(axis(P::Addition, addition_d, ADDITION_GRID, ADDITION)),
                Some(axis(
                    P::SegmentTop,
                    segment_top_mm,
                    SEGMENT_TOP_GRID,
                    SEGMENT_TOP,
                )),
                None,
            ],
        ),
        FamilyChoice::Trifocal {
            addition_d,
            intermediate_ratio,
            segment_top_mm,
        } => (
            Family::Trifocal,
            [
                Some(axis(P::Addition, addition_d, ADDITION_GRID, ADDITION)),
                Some(axis(
                    P::IntermediateRatio,
                    intermediate_ratio,
                    INTERMEDIATE_RATIO_GRID,
                    INTERMEDIATE_RATIO,
                )),
                Some(axis(
                    P::SegmentTop,
                    segment_top_mm,
                    SEGMENT_TOP_GRID,
                    SEGMENT_TOP,
                )),
            ],
        ),
        FamilyChoice::Progressive {
            addition_d,
            progression_length_mm,
        } => (
            Family::Progressive,
            [
                Some(axis(P::Addition, addition_d, ADDITION_GRID, ADDITION)),
                Some(axis(
                    P::ProgressionLength,
                    progression_length_mm,
                    PROGRESSION_LENGTH_GRID,
                    PROGRESSION_LENGTH,
                )),
                None,
            ],
        ),
        FamilyChoice::Degressive {
            near_addition_d,
            degression_d,
        } => (
            Family::Degressive,
            [
                Some(axis(
                    P::NearAddition,
                    near_addition_d,
                    ADDITION_GRID,
                    NEAR_ADDITION,
                )),
                Some(axis(
                    P::Degression,
                    degression_d,
                    DEGRESSION_GRID,
                    DEGRESSION,
                )),
                None,
            ],
        ),
        FamilyChoice::DoubleSegment {
            addition_d,
            lower_top_mm,
            upper_bottom_mm,
        } => (
            Family::DoubleSegment,
            [
                Some(axis(P::Addition, addition_d, ADDITION_GRID, ADDITION)),
                Some(axis(
                    P::LowerSegmentTop,
                    lower_top_mm,
                    SEGMENT_TOP_GRID,
                    SEGMENT_TOP,
                )),
                Some(axis(
                    P::UpperSegmentBottom,
                    upper_bottom_mm,
                    UPPER_BOTTOM_GRID,
                    UPPER_BOTTOM,
                )),
            ],
        ),
    }
}

impl FamilyChoice {
    /// The parameters of this specification's family, in the order of
    /// [`option_axes`] (fixed or open alike).
    pub fn parameters(&self) -> impl Iterator<Item = Parameter> {
        option_axes(self).1.into_iter().flatten().map(|a| a.kind)
    }
}

/// `choice` with every parameter set from `v` (in the order of [`option_axes`]).
pub fn with_values(choice: &FamilyChoice, v: [f64; 3]) -> FamilyChoice {
    match choice {
        FamilyChoice::SingleVision { .. } => FamilyChoice::SingleVision {
            addition_d: Some(v[0]),
        },
        FamilyChoice::Bifocal { .. } => FamilyChoice::Bifocal {
            addition_d: Some(v[0]),
            segment_top_mm: Some(v[1]),
        },
        FamilyChoice::Trifocal { .. } => FamilyChoice::Trifocal {
            addition_d: Some(v[0]),
            intermediate_ratio: Some(v[1]),
            segment_top_mm: Some(v[2]),
        },
        FamilyChoice::Progressive { .. } => FamilyChoice::Progressive {
            addition_d: Some(v[0]),
            progression_length_mm: Some(v[1]),
        },
        FamilyChoice::Degressive { .. } => FamilyChoice::Degressive {
            near_addition_d: Some(v[0]),
            degression_d: Some(v[1]),
        },
        FamilyChoice::DoubleSegment { .. } => FamilyChoice::DoubleSegment {
            addition_d: Some(v[0]),
            lower_top_mm: Some(v[1]),
            upper_bottom_mm: Some(v[2]),
        },
    }
}

/// The parameter values of combination number `n` of `axes`, the first axis
/// varying fastest, as [`Candidates`] and the planner's solver enumerate them.
pub fn combination(axes: &[Option<Axis>; 3], mut n: usize) -> [f64; 3] {
    let mut values = [0.0; 3];
    for (value, a) in values.iter_mut().zip(axes.iter()) {
        let len = slot_len(a);
        *value = slot_value(a, n % len);
        n /= len;
    }
    values
}

/// The number of parameter combinations of `axes`.
pub fn combination_count(axes: &[Option<Axis>; 3]) -> usize {
    axes.iter().map(slot_len).product()
}

/// Builds a design of `family` from its parameter values, with the defaults
/// this product uses for what a lens option does not say (a 28 mm
/// straight-top segment, a 7 mm trifocal band, a 2.5 mm near inset).
fn build(family: Family, v: [f64; 3]) -> Result<LensDesign, LensError> {
    let shape = SegmentShape::STRAIGHT_TOP_28;
    Ok(match family {
        Family::SingleVision => LensDesign::SingleVision(SingleVision::new(Dioptres(v[0]))?),
        Family::Bifocal => {
            LensDesign::Bifocal(Bifocal::new(Dioptres(v[0]), Millimetres(v[1]), shape)?)
        }
        Family::Trifocal => LensDesign::Trifocal(Trifocal::new(
            Dioptres(v[0]),
            v[1],
            Millimetres(v[2]),
            Millimetres(DEFAULT_BAND_HEIGHT_MM),
            shape,
        )?),
        Family::Progressive => LensDesign::Progressive(Progressive::new(
            Dioptres(v[0]),
            Millimetres(v[1]),
            Millimetres(DEFAULT_NEAR_INSET_MM),
        )?),
        Family::Degressive => {
            LensDesign::Degressive(Degressive::new(Dioptres(v[0]), Dioptres(v[1]))?)
        }
        Family::DoubleSegment => LensDesign::DoubleSegment(DoubleSegment::new(
            Dioptres(v[0]),
            Millimetres(v[1]),
            Millimetres(v[2]),
            shape,
        )?),
    })
}

pub(super) fn design_from_choice(choice: &FamilyChoice) -> Result<LensDesign, LensError> {
    let (family, axes) = option_axes(choice);
    let mut values = [0.0; 3];
    for (value, a) in values.iter_mut().zip(axes.iter()) {
        *value = match a {
            Some(Axis { fixed: Some(v), .. }) => *v,
            Some(Axis { bounds, .. }) => {
                return Err(LensError::MissingParameter {
                    parameter: bounds.parameter,
                })
            }
            None => 0.0,
        };
    }
    build(family, values)
}

/// Every manufactured design a lens option allows: the user's fixed
/// parameters combined with the grid of each open one. Combinations the
/// family forbids (a degression larger than the near addition) are skipped.
/// Iterating allocates nothing.
#[derive(Debug, Clone)]
pub struct Candidates {
    family: Family,
    axes: [Option<Axis>; 3],
    next: usize,
    total: usize,
}

impl Candidates {
    /// The candidates of `choice`; an error when a fixed parameter is out of
    /// range, or when every parameter is fixed and the design is invalid.
    pub fn new(choice: &FamilyChoice) -> Result<Candidates, LensError> {
        let (family, axes) = option_axes(choice);
        for a in axes.iter().flatten() {
            if let Some(v) = a.fixed {
                a.bounds.check(v)?;
            }
        }
        if axes.iter().flatten().all(|a| a.fixed.is_some()) {
            design_from_choice(choice)?;
        }
        let total = combination_count(&axes);
        Ok(Candidates {
            family,
            axes,
            next: 0,
            total,
        })
    }

    /// The number of parameter combinations (an upper bound on the designs yielded).
    pub fn combinations(&self) -> usize {
        self.total
    }
}

impl Iterator for Candidates {
    type Item = LensDesign;

    fn next(&mut self) -> Option<LensDesign> {
        while self.next < self.total {
            let values = combination(&self.axes, self.next);
            self.next += 1;
            if let Ok(design) = build(self.family, values) {
                return Some(design);
            }
        }
        None
    }
}
