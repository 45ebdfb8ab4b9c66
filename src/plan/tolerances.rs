//! The verification tolerances a made pair must meet, chosen for the
//! ordered powers: the tolerance tables of ANSI Z80.1-2020 (prescription
//! ophthalmic lenses; recalled from memory, check the current edition
//! before relying on a value). ISO 21987 sets similar limits for mounted
//! lenses.

use super::outcome::{OrderSummary, SpectaclePower, VerificationTolerance};
use crate::scenario::FamilyChoice;

/// The tolerances for the order `o`, one line per checked quantity.
pub fn for_order(o: &OrderSummary) -> Vec<VerificationTolerance> {
    let mut out = Vec::new();
    let strongest = [o.right, o.left]
        .iter()
        .map(highest_meridian)
        .fold(0.0, f64::max);
    out.push(tolerance(
        "sphere (highest meridian)",
        if strongest <= 6.5 {
            "±0.13 D".to_string()
        } else {
            "±2 % of the power".to_string()
        },
    ));
    let cylinder = [o.right, o.left]
        .iter()
        .map(|p| p.cylinder.0.abs())
        .fold(0.0, f64::max);
    if cylinder > 0.0 {
        out.push(tolerance(
            "cylinder",
            if cylinder <= 2.0 {
                "±0.13 D"
            } else if cylinder <= 4.5 {
                "±0.15 D"
            } else {
                "±4 % of the cylinder"
            }
            .to_string(),
        ));
        let smallest = [o.right, o.left]
            .iter()
            .map(|p| p.cylinder.0.abs())
            .filter(|c| *c > 0.0)
            .fold(f64::INFINITY, f64::min);
        out.push(tolerance(
            "cylinder axis",
            format!("±{}° (for the weaker cylinder)", axis_tolerance(smallest)),
        ));
    }
    if let Some(add) = o.addition {
        out.push(tolerance(
            "addition",
            if add.0 <= 4.0 { "±0.12 D" } else { "±0.18 D" }.to_string(),
        ));
    }
    out.push(tolerance(
        "vertical prism imbalance",
        "at most 0.33 Δ at the prism reference point".to_string(),
    ));
    out.push(tolerance(
        "horizontal prism",
        "at most 0.67 Δ in total (or the distance PD within ±2.5 mm)".to_string(),
    ));
    let segmented = matches!(
        o.design,
        FamilyChoice::Bifocal { .. }
            | FamilyChoice::Trifocal { .. }
            | FamilyChoice::DoubleSegment { .. }
    );
    if segmented {
        out.push(tolerance(
            "segment height",
            "±1.0 mm, and within 1.0 mm between the eyes".to_string(),
        ));
    }
    if matches!(
        o.design,
        FamilyChoice::Progressive { .. } | FamilyChoice::Degressive { .. }
    ) {
        out.push(tolerance(
            "fitting cross",
            "±1.0 mm in height and in each monocular PD".to_string(),
        ));
    }
    out
}

fn tolerance(quantity: &str, limit: String) -> VerificationTolerance {
    VerificationTolerance {
        quantity: quantity.to_string(),
        limit,
    }
}

/// The larger absolute power of a sphero-cylinder's two principal meridians.
fn highest_meridian(p: &SpectaclePower) -> f64 {
    p.sphere.0.abs().max((p.sphere.0 + p.cylinder.0).abs())
}

/// The axis tolerance in degrees for a cylinder of `cylinder` dioptres.
fn axis_tolerance(cylinder: f64) -> u32 {
    if cylinder <= 0.25 {
        14
    } else if cylinder <= 0.5 {
        7
    } else if cylinder <= 0.75 {
        5
    } else if cylinder <= 1.5 {
        3
    } else {
        2
    }
}
