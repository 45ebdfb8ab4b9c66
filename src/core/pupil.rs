//! Pupil diameter from the adapting luminance, the size of the adapting
//! field and the wearer's age, for the depth-of-field estimate when no
//! measured pupil is given.
//!
//! The main formula is the unified formula of Watson & Yellott (2012, "A
//! unified formula for light-adapted pupil size", Journal of Vision 12(10):12),
//! which starts from Stanley & Davies (1995) written in terms of the corneal
//! flux density (luminance x field area), multiplies it by 0.1 when only one
//! eye is adapted, and adds a linear age effect fitted to Winn et al. (1994)
//! for ages 20 to 83 around a reference age of 28.58 years. Moon & Spencer
//! (1944) is kept for comparison.
//!
//! **Units trap.** Older pupil formulas take luminance in blondels
//! (apostilbs; 1 blondel = 1/π cd/m²), millilamberts (10/π cd/m²) or
//! foot-lamberts (1/π cd/ft²), not cd/m². A luminance entered in cd/m² and
//! fed to such a formula unconverted shifts the curve by a factor of π or
//! more, and the constant inside a formula belongs to its unit: Moon &
//! Spencer's tanh carries -0.5 with blondels, +0.5 with millilamberts and
//! almost nothing (-0.00285) with cd/m². [`Luminance`] holds cd/m² and
//! converts only through named methods.

use super::error::OpticsError;
use super::units::{Degrees, Millimetres};
use std::f64::consts::PI;

/// Metres per international foot (exact by definition, 1959).
const METRES_PER_FOOT: f64 = 0.3048;
/// Smallest luminance accepted, in cd/m² (deep scotopic).
const MIN_LUMINANCE: f64 = 1e-5;
/// Largest luminance accepted, in cd/m² (sunlit snow is about 10^4).
const MAX_LUMINANCE: f64 = 1e6;

/// An adapting luminance in candelas per square metre.
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd)]
pub struct Luminance(f64);

impl Luminance {
    /// A luminance of `cd_m2` candelas per square metre; an error outside 10^-5 to 10^6 cd/m².
    pub fn cd_per_m2(cd_m2: f64) -> Result<Luminance, OpticsError> {
        OpticsError::in_range("luminance", cd_m2, MIN_LUMINANCE, MAX_LUMINANCE, "cd/m²")
            .map(Luminance)
    }

    /// A luminance given in foot-lamberts (1 fL = 1/π cd/ft² = 3.426 cd/m²).
    pub fn foot_lamberts(fl: f64) -> Result<Luminance, OpticsError> {
        let fl = OpticsError::finite("luminance in foot-lamberts", fl)?;
        Luminance::cd_per_m2(fl / (PI * METRES_PER_FOOT * METRES_PER_FOOT))
    }

    /// A luminance given in blondels (apostilbs; 1 blondel = 1/π cd/m²).
    pub fn blondels(b: f64) -> Result<Luminance, OpticsError> {
        let b = OpticsError::finite("luminance in blondels", b)?;
        Luminance::cd_per_m2(b / PI)
    }

    /// The luminance in cd/m².
    pub fn in_cd_per_m2(self) -> f64 {
        self.0
    }

    /// The luminance in blondels (π x cd/m²).
    pub fn in_blondels(self) -> f64 {
        self.0 * PI
    }
}

/// Whether one eye or both are adapted to the field.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum AdaptedEyes {
    /// One eye open (the other occluded).
    One,
    /// Both eyes open, the normal case for a working task.
    Both,
}

/// Ages in years covered by the age effect of Watson & Yellott (2012).
pub const WATSON_YELLOTT_AGES: (f64, f64) = (20.0, 83.0);
/// Reference age of the unified formula, in years (Watson & Yellott 2012).
const REFERENCE_AGE: f64 = 28.58;

/// Stanley & Davies (1995) pupil diameter in mm for a corneal flux density
/// `flux` in cd/m² x deg²: 7.75 - 5.75 (F/846)^0.41 / ((F/846)^0.41 + 2).
fn stanley_davies_mm(flux: f64) -> f64 {
    let x = (flux / 846.0).powf(0.41);
    7.75 - 5.75 * x / (x + 2.0)
}

fn field_area_deg2(field_diameter: Degrees) -> Result<f64, OpticsError> {
    let d = OpticsError::in_range("adapting field diameter", field_diameter.0, 0.1, 180.0, "°")?;
    Ok(PI * (d / 2.0) * (d / 2.0))
}

/// Stanley & Davies (1995) pupil diameter, as written by Watson & Yellott
/// (2012), for a field of `field_diameter` degrees at `luminance`, both eyes
/// adapted and no age effect (their observers' mean age was 28.58 years).
pub fn stanley_davies(
    luminance: Luminance,
    field_diameter: Degrees,
) -> Result<Millimetres, OpticsError> {
    let area = field_area_deg2(field_diameter)?;
    Ok(Millimetres(stanley_davies_mm(luminance.0 * area)))
}

/// Watson & Yellott (2012) unified pupil diameter, in mm:
/// D = D_SD(F) + (age - 28.58)(0.021323 - 0.0095623 D_SD(F)) with
/// F = luminance x field area (deg²) x M, M = 1 for both eyes, 0.1 for one.
/// An error for ages outside 20 to 83 years, the range of the age data.
///
/// ```
/// use clearspan::core::pupil::{watson_yellott, AdaptedEyes, Luminance};
/// use clearspan::core::units::Degrees;
/// // 100 cd/m², 60° field, both eyes, age 28.58: F = 100 x 900π = 282 743;
/// // (F/846)^0.41 = 10.8355; D = 7.75 - 5.75 x 10.8355 / 12.8355 = 2.896 mm.
/// let d = watson_yellott(Luminance::cd_per_m2(100.0).unwrap(), Degrees(60.0), 28.58, AdaptedEyes::Both).unwrap();
/// assert!((d.0 - 2.896).abs() < 1e-3);
/// ```
pub fn watson_yellott(
    luminance: Luminance,
    field_diameter: Degrees,
    age_years: f64,
    eyes: AdaptedEyes,
) -> Result<Millimetres, OpticsError> {
    let (min, max) = WATSON_YELLOTT_AGES;
    let age =
        OpticsError::in_model_range("Watson & Yellott 2012", "age", age_years, min, max, "years")?;
    let monocular = match eyes {
        AdaptedEyes::One => 0.1,
        AdaptedEyes::Both => 1.0,
    };
    let d_sd = stanley_davies_mm(luminance.0 * field_area_deg2(field_diameter)? * monocular);
    Ok(Millimetres(
        d_sd + (age - REFERENCE_AGE) * (0.021323 - 0.0095623 * d_sd),
    ))
}

/// Moon & Spencer (1944, "On the Stiles-Crawford effect", J. Opt. Soc. Am.
/// 34:319) pupil diameter in mm, for comparison: a fit to earlier data for
/// both eyes viewing a large field, from 7.9 mm in the dark to 1.9 mm in
/// bright light. With B the luminance in blondels,
/// D = 4.9 - 3 tanh[0.4 (log10 B - 0.5)], the blondel form given by Pamplona,
/// Oliveira & Baranoski (2009, ACM Trans. Graph. 28(4):106). The same curve
/// reads 4.9 - 3 tanh[0.4 (log10 B_mL + 0.5)] in millilamberts and
/// 4.9 - 3 tanh(0.4 log10 L - 0.00114) in cd/m² (Watson & Yellott 2012).
/// Dropping the -0.5 while keeping blondels, as an earlier version of this
/// function did, gives pupils 0.3 to 0.6 mm too small between 0.01 and
/// 100 cd/m². Shown only beside the unified formula, never used by default.
pub fn moon_spencer(luminance: Luminance) -> Millimetres {
    let log_blondels = luminance.in_blondels().log10();
    Millimetres(4.9 - 3.0 * (0.4 * (log_blondels - 0.5)).tanh())
}

#[cfg(test)]
mod tests {
    use super::*;

    fn lum(cd: f64) -> Luminance {
        Luminance::cd_per_m2(cd).unwrap()
    }

    fn check(actual: Millimetres, expected: f64, tol: f64) {
        assert!(
            (actual.0 - expected).abs() <= tol,
            "got {}, expected {expected} ± {tol}",
            actual.0
        );
    }

    #[test]
    fn unified_formula_worked_by_hand() {
        // Watson & Yellott (2012), unified formula; worked by hand for 100 cd/m²,
        // 60° field (area 900π = 2827.43 deg²), both eyes:
        // F = 282 743; F/846 = 334.212; ^0.41 = e^(0.41 x 5.81178) = 10.8355;
        // D_SD = 7.75 - 5.75 x 10.8355 / 12.8355 = 2.89595 mm.
        // Age 60: slope 0.021323 - 0.0095623 x 2.89595 = -0.0063690;
        // D = 2.89595 + 31.42 x (-0.0063690) = 2.69584 mm.
        let field = Degrees(60.0);
        check(
            watson_yellott(lum(100.0), field, 28.58, AdaptedEyes::Both).unwrap(),
            2.895_95,
            1e-4,
        );
        check(
            watson_yellott(lum(100.0), field, 60.0, AdaptedEyes::Both).unwrap(),
            2.695_84,
            1e-4,
        );
        check(stanley_davies(lum(100.0), field).unwrap(), 2.895_95, 1e-4);
    }

    #[test]
    fn unified_formula_matches_its_simplified_form() {
        // Watson & Yellott (2012) also give the unified formula for ages 20-83
        // in closed form, with f = F^0.41:
        // D = (18.5172 + 0.122165 f - 0.105569 y + 0.000138645 f y) / (2 + 0.0630635 f)
        // (their appendix, as reproduced in public implementations of the paper).
        for (l, age, diameter) in [
            (0.01, 25.0, 10.0),
            (1.0, 45.0, 30.0),
            (300.0, 70.0, 20.0),
            (5000.0, 83.0, 60.0),
        ] {
            let area = PI * (diameter / 2.0) * (diameter / 2.0);
            let f = (l * area).powf(0.41);
            let closed = (18.5172 + 0.122165 * f - 0.105569 * age + 0.000138645 * f * age)
                / (2.0 + 0.0630635 * f);
            let full = watson_yellott(lum(l), Degrees(diameter), age, AdaptedEyes::Both).unwrap();
            check(full, closed, 2e-3);
        }
    }

    #[test]
    fn pupils_shrink_with_light_with_age_and_with_both_eyes_open() {
        let field = Degrees(40.0);
        let d = |l: f64, age: f64, eyes| watson_yellott(lum(l), field, age, eyes).unwrap().0;
        assert!(d(1.0, 40.0, AdaptedEyes::Both) > d(100.0, 40.0, AdaptedEyes::Both));
        assert!(d(1.0, 30.0, AdaptedEyes::Both) > d(1.0, 70.0, AdaptedEyes::Both));
        assert!(d(10.0, 40.0, AdaptedEyes::One) > d(10.0, 40.0, AdaptedEyes::Both));
    }

    #[test]
    fn unit_conversions() {
        // 1 fL = 1/π cd/ft² = 1 / (π x 0.3048²) = 3.42626 cd/m² (definitions of
        // the foot-lambert and of the international foot).
        assert!((Luminance::foot_lamberts(1.0).unwrap().in_cd_per_m2() - 3.426_26).abs() < 1e-5);
        // 1 blondel (apostilb) = 1/π cd/m² (Wolfram Units package reference,
        // `Apostilb`: "equivalent to Candela/(Meter2 Pi)").
        assert!((Luminance::blondels(PI).unwrap().in_cd_per_m2() - 1.0).abs() < 1e-12);
    }

    #[test]
    fn moon_spencer_matches_the_cd_per_m2_restatement() {
        // Watson & Yellott (2012) restate Moon & Spencer in cd/m² as
        // D = 4.9 - 3 tanh(0.4 log10 L - 0.00114) (as transcribed in the R
        // package CVD, `lightAdaptedPupilSize.MoonAndSpencer`, which cites them;
        // CVD writes R's natural `log`, but the constant 0.00114 =
        // 0.4 x (log10(10/π) - 0.5) shows the paper's log is base 10).
        // Worked by hand from that form, which takes cd/m² and no blondels:
        // L = 0.01: tanh(-0.80114) = -0.664674, D = 6.89402 mm;
        // L = 1: tanh(-0.00114) = -0.00114, D = 4.90342 mm;
        // L = 100: tanh(0.79886) = 0.663399, D = 2.90980 mm;
        // L = 10^4: tanh(1.59886) = 0.921497, D = 2.13551 mm.
        for (l, expected) in [
            (0.01, 6.894_02),
            (1.0, 4.903_42),
            (100.0, 2.909_80),
            (1e4, 2.135_51),
        ] {
            check(moon_spencer(lum(l)), expected, 2e-5);
        }
    }

    #[test]
    fn moon_spencer_matches_the_millilambert_restatement() {
        // Frisvad (2019, "Pupillary hippus for glare simulation", DTU web
        // page) writes Moon & Spencer as 7.9 - 3 (1 + tanh[0.4 (log(L π/10) + 0.5)])
        // with L in cd/m², so L π/10 is the luminance in millilamberts (1 mL =
        // 10/π cd/m²); the page writes ln, but at 1 mL the logarithm is 0 in any
        // base: 7.9 - 3 (1 + tanh 0.2) = 4.9 - 3 x 0.197375 = 4.307874 mm,
        // worked by hand.
        let one_millilambert = lum(10.0 / PI);
        check(moon_spencer(one_millilambert), 4.307_874, 1e-6);
        // The same source gives the limits 7.9 mm (dark) and 1.9 mm (bright).
        assert!(moon_spencer(lum(MIN_LUMINANCE)).0 < 7.9);
        assert!(moon_spencer(lum(MAX_LUMINANCE)).0 > 1.9);
    }

    #[test]
    fn invalid_entries_are_errors() {
        assert!(Luminance::cd_per_m2(-1.0).is_err());
        assert!(Luminance::cd_per_m2(f64::NAN).is_err());
        assert!(matches!(
            watson_yellott(lum(10.0), Degrees(30.0), 10.0, AdaptedEyes::Both),
            Err(OpticsError::OutsideModel { .. })
        ));
        assert!(watson_yellott(lum(10.0), Degrees(0.0), 30.0, AdaptedEyes::Both).is_err());
    }

    mod properties {
        use super::*;
        use proptest::prelude::*;

        proptest! {
            #[test]
            fn unified_diameter_is_physiological(
                log_l in -5.0..6.0f64, d in 0.1..180.0f64, age in 20.0..83.0f64, one in any::<bool>(),
            ) {
                let eyes = if one { AdaptedEyes::One } else { AdaptedEyes::Both };
                let p = watson_yellott(lum(10f64.powf(log_l)), Degrees(d), age, eyes).unwrap().0;
                prop_assert!(p.is_finite() && p > 1.0 && p < 9.0, "{p}");
            }
        }
    }
}
