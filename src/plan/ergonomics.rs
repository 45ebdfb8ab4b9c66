//! Reference values of occupational ergonomics that the task-demand sheet
//! judges against, each with its source, and the angle a detail subtends.
//! The sheet is a planning aid for occupational health: it screens and
//! documents, and leaves examination and prescription to licensed practice.

/// Smallest character height for reading text on a display, in minutes of
/// arc: ISO 9241-3:1992 ("the minimum character height shall be 16 minutes
/// of arc"), as quoted in a display maker's published ergonomics pages; the
/// same figure carried into ISO 9241-303:2011 is from memory.
pub const CHARACTER_HEIGHT_MIN_ARCMIN: f64 = 16.0;

/// Lower end of the preferred character height for display text, in minutes
/// of arc: ISO 9241-3:1992, "20 to 22 minutes of arc are preferred for most
/// tasks" (same source as [`CHARACTER_HEIGHT_MIN_ARCMIN`]).
pub const CHARACTER_HEIGHT_PREFERRED_ARCMIN: f64 = 20.0;

/// Where the character heights above come from, as the sheet names them.
pub const CHARACTER_HEIGHT_SOURCE: &str = "ISO 9241-3:1992";

/// How far a measured amplitude of accommodation may fall below Hofstetter's
/// minimum for the age before the sheet suggests an eye examination, in
/// dioptres: an amplitude 2 D or more below the age minimum is the usual
/// sign of accommodative insufficiency (from memory, clinical texts on
/// binocular vision).
pub const AMPLITUDE_BELOW_NORM_REFER_D: f64 = 2.0;

/// Largest change of a task's distance the sheet offers as a workstation
/// change, in metres (a product choice: a screen or a document can usually
/// be moved this far on a desk; more is a different workstation).
pub const MAX_DISTANCE_CHANGE_M: f64 = 0.4;

/// Nearest distance the sheet moves a task to, in metres (a product choice:
/// closer than a short forearm's reach is no workstation).
pub const NEAREST_WORKING_DISTANCE_M: f64 = 0.25;

/// The display-screen rule the sheet names: workers are entitled to an eye
/// and eyesight test before display work, at regular intervals and when
/// they have visual difficulties, and to special corrective appliances for
/// the work when their normal ones do not serve (EU Council Directive
/// 90/270/EEC, Article 9).
pub const DISPLAY_SCREEN_RULE: &str = "Display-screen rules in many countries entitle \
workers to an eye and eyesight test, and to special glasses for the work where their \
usual ones do not serve (in the EU: Council Directive 90/270/EEC, Article 9). Local rules \
differ; this sheet is a planning aid for occupational health, not an examination or a \
prescription. Powers and designs are for a licensed eye-care practitioner to decide.";

/// The angle a detail of `size_mm` millimetres subtends at `distance_m`
/// metres, in minutes of arc (full angle, 2 atan(h / 2d)).
///
/// ```
/// use clearspan::plan::ergonomics::subtended_arcmin;
/// // 2.9 mm at 50 cm is very nearly 20 minutes of arc
/// // (tan 20' = 0.005818, times 500 mm = 2.909 mm).
/// assert!((subtended_arcmin(2.909, 0.5) - 20.0).abs() < 0.01);
/// ```
pub fn subtended_arcmin(size_mm: f64, distance_m: f64) -> f64 {
    2.0 * (size_mm / 1000.0 / (2.0 * distance_m)).atan().to_degrees() * 60.0
}

/// The size, in millimetres, that subtends `arcmin` minutes of arc at
/// `distance_m` metres (the inverse of [`subtended_arcmin`]).
pub fn size_for_arcmin(arcmin: f64, distance_m: f64) -> f64 {
    2.0 * distance_m * 1000.0 * (arcmin / 60.0 / 2.0).to_radians().tan()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn angles_and_sizes_invert_each_other() {
        // NUREG-0700 gives height = 2 pi D MA / 21600 for small angles: 16'
        // at 65 cm is 3.03 mm; the exact full-angle form agrees to 0.01 mm.
        let h = size_for_arcmin(16.0, 0.65);
        assert!((h - 2.0 * std::f64::consts::PI * 650.0 * 16.0 / 21600.0).abs() < 0.01);
        assert!((subtended_arcmin(h, 0.65) - 16.0).abs() < 1e-9);
    }
}
