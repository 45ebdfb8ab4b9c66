//! Lens families as maps from a point on the lens to a local addition and a
//! named zone, with the inverse question "where on the lens is this
//! addition?". Every design is a small `Copy` value built from checked
//! parameters, so a planner can evaluate it in a hot loop without allocating.
//!
//! Lens coordinates: millimetres from the fitting point, `x` positive
//! **nasal** (towards the nose, for either eye, so one design serves both
//! lenses) and `y` positive **up**. The fitting point lies on the line of
//! sight in the primary position.
//!
//! The additions are those of the models documented in each family's file;
//! the mean addition is modelled as constant along each horizontal line of a
//! zone, and the lateral limit that unwanted astigmatism sets on progressive
//! and degressive corridors is computed by [`crate::core::astigmatism`].

mod bifocal;
mod catalogue;
mod choice;
mod degressive;
mod double_segment;
mod error;
mod limits;
mod parameter;
mod progressive;
mod ramp;
mod segment;
mod single_vision;
mod trifocal;

#[cfg(test)]
mod tests;

pub use bifocal::Bifocal;
pub use catalogue::{
    combination, combination_count, option_axes, with_values, Axis, Candidates, Grid,
    ADDITION_GRID, DEGRESSION_GRID, INTERMEDIATE_RATIO_GRID, PROGRESSION_LENGTH_GRID,
    SEGMENT_TOP_GRID, SINGLE_VISION_ADDITION_GRID, UPPER_BOTTOM_GRID,
};
pub use choice::FamilyChoice;
pub use degressive::{Degressive, DEGRESSION_HEIGHT_MM, NEAR_REFERENCE_MM};
pub use double_segment::DoubleSegment;
pub use error::LensError;
pub(crate) use error::NamedBounds;
pub use parameter::Parameter;
pub use progressive::{
    Progressive, DEFAULT_NEAR_INSET_MM, NEAR_ZONE_BELOW_NRP_MM, PROGRESSION_START_MM,
};
pub use ramp::{PowerGradient, Ramp};
pub use segment::SegmentShape;
pub use single_vision::SingleVision;
pub use trifocal::{Trifocal, DEFAULT_BAND_HEIGHT_MM, DEFAULT_INTERMEDIATE_RATIO};

use crate::core::units::{Dioptres, Millimetres};
use serde::Serialize;
use std::fmt;

/// A point on the lens, in millimetres from the fitting point: `x` nasal
/// positive, `y` up positive.
#[derive(Debug, Clone, Copy, PartialEq, Default, Serialize)]
pub struct LensPoint {
    /// Horizontal position, millimetres, positive towards the nose.
    pub x: Millimetres,
    /// Vertical position, millimetres, positive upwards.
    pub y: Millimetres,
}

impl LensPoint {
    /// The point `x` mm nasal and `y` mm above the fitting point.
    pub fn new(x: f64, y: f64) -> LensPoint {
        LensPoint {
            x: Millimetres(x),
            y: Millimetres(y),
        }
    }
}

/// The named region of a lens a point belongs to. It is also the zone name
/// the plan reports (as `plan::ZoneKind`), serialized in snake case.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Zone {
    /// One power over the whole lens (single vision).
    SingleVision,
    /// The distance portion: no addition.
    Distance,
    /// A trifocal's intermediate band, or the upper zone of a degressive lens.
    Intermediate,
    /// The near segment or near portion: the full addition.
    Near,
    /// The corridor of a progressive lens, or the degression zone of a
    /// degressive lens, where the addition changes with height.
    Progression,
    /// The upper segment of a double-segment lens, for work overhead.
    UpperSegment,
}

impl fmt::Display for Zone {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            Zone::SingleVision => "single vision",
            Zone::Distance => "distance",
            Zone::Intermediate => "intermediate",
            Zone::Near => "near",
            Zone::Progression => "corridor",
            Zone::UpperSegment => "upper segment",
        })
    }
}

/// What a design gives at one lens point.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LensSample {
    /// The local addition over the distance power, in dioptres.
    pub addition: Dioptres,
    /// The zone the point belongs to.
    pub zone: Zone,
}

impl LensSample {
    /// The distance portion of a segment lens: no addition.
    pub(crate) const DISTANCE: LensSample = LensSample {
        addition: Dioptres(0.0),
        zone: Zone::Distance,
    };
}

/// The lens families the product models.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Family {
    /// One power everywhere.
    SingleVision,
    /// A near segment below a distance portion.
    Bifocal,
    /// An intermediate band above a near segment.
    Trifocal,
    /// A progressive-power lens.
    Progressive,
    /// A degressive-power (occupational) lens.
    Degressive,
    /// A near segment below and an add segment at the top.
    DoubleSegment,
}

/// The vertical extent of the lens in the frame, in millimetres from the
/// fitting point: the bottom is below it (negative), the top above it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct VerticalExtent {
    bottom: f64,
    top: f64,
}

/// Least lens above the fitting point, in millimetres: a fitting point on
/// the rim leaves nothing to look through (a product choice).
pub const MIN_LENS_ABOVE_FITTING_MM: f64 = 1.0;

impl VerticalExtent {
    /// The extent of a lens of height `lens_height` whose fitting point is
    /// `fitting_height` above its lowest point (both in millimetres), at
    /// least [`MIN_LENS_ABOVE_FITTING_MM`] below its top.
    pub fn from_frame(
        fitting_height: Millimetres,
        lens_height: Millimetres,
    ) -> Result<VerticalExtent, LensError> {
        let lens_height = NamedBounds::of("lens height", crate::core::limits::LENS_HEIGHT)
            .check(lens_height.0)?;
        let fitting_height = NamedBounds::new(
            "fitting height",
            1.0,
            lens_height - MIN_LENS_ABOVE_FITTING_MM,
            "mm",
        )
        .check(fitting_height.0)?;
        Ok(VerticalExtent {
            bottom: -fitting_height,
            top: lens_height - fitting_height,
        })
    }

    /// Lowest lens height, in millimetres from the fitting point (negative).
    pub fn bottom(&self) -> Millimetres {
        Millimetres(self.bottom)
    }

    /// Highest lens height, in millimetres from the fitting point (positive).
    pub fn top(&self) -> Millimetres {
        Millimetres(self.top)
    }

    /// Whether the height `y` (millimetres from the fitting point) lies on the lens.
    pub fn contains(&self, y: Millimetres) -> bool {
        y.0 >= self.bottom && y.0 <= self.top
    }
}

/// A range of lens heights over which a design gives an addition, in
/// millimetres from the fitting point.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct HeightBand {
    /// Lowest height of the band.
    pub bottom: Millimetres,
    /// Highest height of the band.
    pub top: Millimetres,
    /// The zone the band lies in.
    pub zone: Zone,
}

impl HeightBand {
    pub(crate) fn new(bottom: Millimetres, top: Millimetres, zone: Zone) -> HeightBand {
        HeightBand { bottom, top, zone }
    }
}

/// Up to five height bands, held inline so no allocation is needed. Five is
/// the most any family yields: a double-segment lens has its distance
/// portion below, between and above its two segments, and with a zero
/// addition its segments match as well.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct HeightBands {
    items: [Option<HeightBand>; 5],
}

impl HeightBands {
    /// Adds `band` cut to the lens extent; drops it when nothing is left.
    pub(crate) fn push_clipped(&mut self, band: HeightBand, extent: VerticalExtent) {
        let bottom = band.bottom.0.max(extent.bottom);
        let top = band.top.0.min(extent.top);
        if bottom > top {
            return;
        }
        if let Some(slot) = self.items.iter_mut().find(|s| s.is_none()) {
            *slot = Some(HeightBand::new(
                Millimetres(bottom),
                Millimetres(top),
                band.zone,
            ));
        }
    }

    /// The bands, from the first found.
    pub fn iter(&self) -> impl Iterator<Item = &HeightBand> {
        self.items.iter().flatten()
    }

    /// Whether no part of the lens gives the addition.
    pub fn is_empty(&self) -> bool {
        self.items.iter().all(Option::is_none)
    }
}

/// A search for the lens heights where a design's addition lies within
/// `tolerance` dioptres of `wanted`. Each family with zones of constant power
/// offers every zone's addition with the height bands it covers; the search
/// keeps the bands of the matching zones, cut to the lens extent, in the
/// order they were offered.
pub(crate) struct BandSearch {
    wanted: f64,
    tolerance: f64,
    extent: VerticalExtent,
    bands: HeightBands,
}

impl BandSearch {
    fn new(wanted: f64, tolerance: f64, extent: VerticalExtent) -> BandSearch {
        BandSearch {
            wanted,
            tolerance,
            extent,
            bands: HeightBands::default(),
        }
    }

    /// The vertical extent of the lens the bands are cut to.
    pub(crate) fn extent(&self) -> VerticalExtent {
        self.extent
    }

    /// Keeps `bands` when `addition` (dioptres) lies within the tolerance of
    /// the wanted addition.
    pub(crate) fn offer(&mut self, addition: f64, bands: &[HeightBand]) {
        if (self.wanted - addition).abs() <= self.tolerance {
            for band in bands {
                self.bands.push_clipped(*band, self.extent);
            }
        }
    }

    fn found(self) -> HeightBands {
        self.bands
    }
}

/// One lens design with checked parameters: any of the families.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum LensDesign {
    /// One power everywhere.
    SingleVision(SingleVision),
    /// A near segment below a distance portion.
    Bifocal(Bifocal),
    /// An intermediate band above a near segment.
    Trifocal(Trifocal),
    /// A progressive-power lens.
    Progressive(Progressive),
    /// A degressive-power (occupational) lens.
    Degressive(Degressive),
    /// A near segment below and an add segment at the top.
    DoubleSegment(DoubleSegment),
}

impl LensDesign {
    /// The family of this design.
    pub fn family(&self) -> Family {
        match self {
            LensDesign::SingleVision(_) => Family::SingleVision,
            LensDesign::Bifocal(_) => Family::Bifocal,
            LensDesign::Trifocal(_) => Family::Trifocal,
            LensDesign::Progressive(_) => Family::Progressive,
            LensDesign::Degressive(_) => Family::Degressive,
            LensDesign::DoubleSegment(_) => Family::DoubleSegment,
        }
    }

    /// The local addition (dioptres) and the zone at a lens point.
    pub fn evaluate(&self, point: LensPoint) -> LensSample {
        match self {
            LensDesign::SingleVision(d) => d.evaluate(point),
            LensDesign::Bifocal(d) => d.evaluate(point),
            LensDesign::Trifocal(d) => d.evaluate(point),
            LensDesign::Progressive(d) => d.evaluate(point),
            LensDesign::Degressive(d) => d.evaluate(point),
            LensDesign::DoubleSegment(d) => d.evaluate(point),
        }
    }

    /// The local addition at a lens point, in dioptres.
    pub fn addition_at(&self, point: LensPoint) -> Dioptres {
        self.evaluate(point).addition
    }

    /// Whether the design fits a frame of vertical `extent`: a progressive
    /// lens needs `NEAR_ZONE_BELOW_NRP_MM` of lens below its
    /// near reference point; other designs fit any frame the scenario allows.
    pub fn fits(&self, extent: VerticalExtent) -> bool {
        match self {
            LensDesign::Progressive(p) => -extent.bottom().0 + 1e-9 >= p.minimum_fitting_height().0,
            _ => true,
        }
    }

    /// The largest addition anywhere on the lens, in dioptres.
    pub fn max_addition(&self) -> Dioptres {
        match self {
            LensDesign::SingleVision(d) => d.max_addition(),
            LensDesign::Bifocal(d) => d.addition(),
            LensDesign::Trifocal(d) => d.addition(),
            LensDesign::Progressive(d) => d.addition(),
            LensDesign::Degressive(d) => d.near_addition(),
            LensDesign::DoubleSegment(d) => d.addition(),
        }
    }

    /// The power ramp of a progressive or degressive corridor; `None` for the
    /// families whose zones have constant power.
    pub fn ramp(&self) -> Option<&Ramp> {
        match self {
            LensDesign::Progressive(d) => Some(d.ramp()),
            LensDesign::Degressive(d) => Some(d.ramp()),
            _ => None,
        }
    }

    /// The horizontal position of the corridor centre line at height `y`,
    /// in millimetres (nasal positive): it moves nasally with the progress of
    /// the ramp, reaching the near inset at the near reference point. `None`
    /// for families without a corridor.
    pub fn corridor_x(&self, y: Millimetres) -> Option<Millimetres> {
        match self {
            LensDesign::Progressive(d) => Some(d.corridor_x(y)),
            LensDesign::Degressive(d) => Some(d.corridor_x(y)),
            _ => None,
        }
    }

    /// The point on the corridor centre line where a progressive or
    /// degressive design delivers exactly `wanted` (the inverse of its
    /// profile); `None` when the addition lies outside the corridor's range
    /// or the design has no corridor.
    pub fn corridor_point_for(&self, wanted: Dioptres) -> Option<LensPoint> {
        let ramp = self.ramp()?;
        let y = ramp.height_for(wanted)?;
        let x = self.corridor_x(y)?;
        Some(LensPoint { x, y })
    }

    /// The bands of lens height where the design delivers an addition within
    /// `tolerance` dioptres of `wanted`, cut to the lens `extent`. For the
    /// corridor families the band follows the inverse of the profile; for
    /// segment families it is the segment's (or the distance portion's)
    /// height range. Empty when the lens has no such addition.
    pub fn bands_for_addition(
        &self,
        wanted: Dioptres,
        tolerance: Dioptres,
        extent: VerticalExtent,
    ) -> HeightBands {
        if !wanted.0.is_finite() || !tolerance.0.is_finite() || tolerance.0 < 0.0 {
            return HeightBands::default();
        }
        let (w, t) = (wanted.0, tolerance.0);
        let mut search = BandSearch::new(w, t, extent);
        match self {
            LensDesign::SingleVision(d) => d.offer_bands(&mut search),
            LensDesign::Bifocal(d) => d.offer_bands(&mut search),
            LensDesign::Trifocal(d) => d.offer_bands(&mut search),
            LensDesign::DoubleSegment(d) => d.offer_bands(&mut search),
            LensDesign::Progressive(d) => {
                return ramp_bands(d.ramp(), w, t, extent, Zone::Distance)
            }
            LensDesign::Degressive(d) => {
                return ramp_bands(d.ramp(), w, t, extent, Zone::Intermediate)
            }
        }
        search.found()
    }

    /// The design a lens option describes when every parameter is fixed;
    /// [`LensError::MissingParameter`] when one is left to the planner (use
    /// [`Candidates`] to iterate over the manufactured choices instead).
    pub fn from_choice(choice: &FamilyChoice) -> Result<LensDesign, LensError> {
        catalogue::design_from_choice(choice)
    }
}

/// The height band over which a ramp's addition lies within `tolerance` of
/// `wanted`. Both corridor families carry more addition lower down, so the
/// band's bottom is where the ramp reaches `wanted + tolerance` (or the lens
/// bottom when the near zone itself is within tolerance) and its top where it
/// reaches `wanted - tolerance` (or the lens top). `above` names the zone
/// over the ramp.
fn ramp_bands(
    ramp: &Ramp,
    wanted: f64,
    tolerance: f64,
    extent: VerticalExtent,
    above: Zone,
) -> HeightBands {
    let mut bands = HeightBands::default();
    let (least, most) = ramp.value_range();
    let low = (wanted - tolerance).max(least);
    let high = (wanted + tolerance).min(most);
    if low > high {
        return bands;
    }
    let bottom = if high >= most {
        extent.bottom()
    } else {
        ramp.height_for(Dioptres(high)).unwrap_or(extent.bottom())
    };
    let top = if low <= least {
        extent.top()
    } else {
        ramp.height_for(Dioptres(low)).unwrap_or(extent.top())
    };
    let centre = ramp
        .height_for(Dioptres(wanted.clamp(least, most)))
        .unwrap_or(bottom);
    let zone = corridor_zone(ramp, centre, above);
    bands.push_clipped(HeightBand::new(bottom, top, zone), extent);
    bands
}

/// The zone of a height on a corridor lens: `above` over the ramp, near below
/// it, progression inside it.
pub(crate) fn corridor_zone(ramp: &Ramp, y: Millimetres, above: Zone) -> Zone {
    if y.0 >= ramp.top().0 {
        above
    } else if y.0 <= ramp.bottom().0 {
        Zone::Near
    } else {
        Zone::Progression
    }
}
