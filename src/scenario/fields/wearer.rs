//! The wearer's numbers in the field table: age or measured amplitude, each
//! eye's prescription, the fitting measurements, pupil and blur tolerance,
//! and the limits the plan is judged against.

use super::{Field, Help, Scope, Unit};
use crate::core::limits;
use crate::scenario::model::{BlurTolerance, Correction, Prescription, PupilSource, Scenario};

/// The prescription of eye `index` (0 right, 1 left).
fn eye(s: &Scenario, index: usize) -> &Prescription {
    if index == 0 {
        &s.wearer.right
    } else {
        &s.wearer.left
    }
}

/// The prescription of eye `index` (0 right, 1 left), to write.
fn eye_mut(s: &mut Scenario, index: usize) -> &mut Prescription {
    if index == 0 {
        &mut s.wearer.right
    } else {
        &mut s.wearer.left
    }
}

/// The wearer's age.
pub const AGE: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.age_years",
    label: "Age",
    unit: Unit::Years,
    bounds: limits::AGE,
    default: Some(50.0),
    optional: false,
    help: Help {
        what: "The wearer's age in years.",
        how: "It sets the amplitude of accommodation (Hofstetter's age lines) and the pupil size when neither is measured.",
        usual: "Near work needs planning from about 40 years, when presbyopia begins (common practice).",
    },
    get: |s, _| Some(s.wearer.age_years),
    set: |s, _, v| {
        if let Some(v) = v {
            s.wearer.age_years = v;
        }
    },
};

/// A measured amplitude of accommodation.
pub const MEASURED_AMPLITUDE: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.measured_amplitude.dioptres",
    label: "Measured amplitude",
    unit: Unit::Dioptres,
    bounds: limits::AMPLITUDE,
    default: Some(4.0),
    optional: false,
    help: Help {
        what: "How much focusing power the eyes can add for near, as measured at the examination.",
        how: "Push-up: 1 divided by the near-point distance in metres, with the distance correction worn; minus lens: the minus power added before a fixed near target blurs.",
        usual: "About 12 D at 20 years, 6.5 D at 40 and 2 D at 55 (Hofstetter's mean line).",
    },
    get: |s, _| s.wearer.measured_amplitude.map(|m| m.dioptres),
    set: |s, _, v| {
        if let (Some(m), Some(v)) = (s.wearer.measured_amplitude.as_mut(), v) {
            m.dioptres = v;
        }
    },
};

/// Sphere of each eye's prescription.
pub const SPHERE: Field = Field {
    scope: Scope::Eye,
    key: "sphere_d",
    label: "Sphere",
    unit: Unit::Dioptres,
    bounds: limits::SPHERE,
    default: Some(0.0),
    optional: false,
    help: Help {
        what: "The spherical power of this eye's distance prescription: minus for short sight, plus for long sight.",
        how: "Copied from the prescription: the spectacle power, or the contact lens power when contact lenses are worn.",
        usual: "Most lie between −6.00 and +4.00 D, in 0.25 D steps (common practice).",
    },
    get: |s, i| Some(eye(s, i).sphere_d),
    set: |s, i, v| {
        if let Some(v) = v {
            eye_mut(s, i).sphere_d = v;
        }
    },
};

/// Cylinder of each eye's prescription.
pub const CYLINDER: Field = Field {
    scope: Scope::Eye,
    key: "cylinder_d",
    label: "Cylinder",
    unit: Unit::Dioptres,
    bounds: limits::CYLINDER,
    default: Some(0.0),
    optional: false,
    help: Help {
        what: "The cylindrical power that corrects this eye's astigmatism; 0 when there is none.",
        how: "Copied from the prescription, in the sign it is written (plus or minus cylinder).",
        usual: "Usually up to 2.00 D either sign, in 0.25 D steps (common practice).",
    },
    get: |s, i| Some(eye(s, i).cylinder_d),
    set: |s, i, v| {
        if let Some(v) = v {
            eye_mut(s, i).cylinder_d = v;
        }
    },
};

/// Cylinder axis of each eye's prescription.
pub const AXIS: Field = Field {
    scope: Scope::Eye,
    key: "axis_deg",
    label: "Axis",
    unit: Unit::Degrees,
    bounds: limits::AXIS,
    default: Some(0.0),
    optional: false,
    help: Help {
        what: "The direction of the cylinder's axis; it does not matter when the cylinder is 0.",
        how: "Copied from the prescription: degrees counted anticlockwise from the horizontal, 0° on the examiner's right.",
        usual: "Any value from 0 to 180° (the TABO scale; common practice).",
    },
    get: |s, i| Some(eye(s, i).axis_deg),
    set: |s, i, v| {
        if let Some(v) = v {
            eye_mut(s, i).axis_deg = v;
        }
    },
};

/// Horizontal prism of each eye's prescription.
pub const PRISM_HORIZONTAL: Field = Field {
    scope: Scope::Eye,
    key: "prism.horizontal_pd",
    label: "Horizontal prism",
    unit: Unit::PrismDioptres,
    bounds: limits::PRISM,
    default: Some(0.0),
    optional: false,
    help: Help {
        what: "Prism prescribed for this eye in the horizontal direction; 0 when none.",
        how: "Copied from the prescription, with its base (in or out) chosen beside it.",
        usual: "Rarely more than 4 Δ per eye (common practice).",
    },
    get: |s, i| Some(eye(s, i).prism.horizontal_pd),
    set: |s, i, v| {
        if let Some(v) = v {
            eye_mut(s, i).prism.horizontal_pd = v;
        }
    },
};

/// Vertical prism of each eye's prescription.
pub const PRISM_VERTICAL: Field = Field {
    scope: Scope::Eye,
    key: "prism.vertical_pd",
    label: "Vertical prism",
    unit: Unit::PrismDioptres,
    bounds: limits::PRISM,
    default: Some(0.0),
    optional: false,
    help: Help {
        what: "Prism prescribed for this eye in the vertical direction; 0 when none.",
        how: "Copied from the prescription, with its base (up or down) chosen beside it.",
        usual: "Rarely more than 2 Δ per eye (common practice).",
    },
    get: |s, i| Some(eye(s, i).prism.vertical_pd),
    set: |s, i, v| {
        if let Some(v) = v {
            eye_mut(s, i).prism.vertical_pd = v;
        }
    },
};

/// The near addition of the prescription, if any.
pub const PRESCRIBED_ADDITION: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.prescribed_addition_d",
    label: "Prescribed addition",
    unit: Unit::Dioptres,
    bounds: limits::ADDITION,
    default: None,
    optional: true,
    help: Help {
        what: "The near addition found at the eye examination: the plus power added to the distance power for reading.",
        how: "Copied from the prescription; leave it empty when none was given.",
        usual: "+0.75 to +3.00 D, rising with age from about 45 years (common practice).",
    },
    get: |s, _| s.wearer.prescribed_addition_d,
    set: |s, _, v| s.wearer.prescribed_addition_d = v,
};

/// Vertex distance of spectacles.
pub const VERTEX: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.correction.vertex_mm",
    label: "Vertex distance",
    unit: Unit::Millimetres,
    bounds: limits::VERTEX,
    default: Some(12.0),
    optional: false,
    help: Help {
        what: "The distance from the back of the spectacle lens to the front of the eye.",
        how: "Measured from the side with a distometer or a ruler, with the frame fitted.",
        usual: "Usually 12 to 14 mm (common practice).",
    },
    get: |s, _| match s.wearer.correction {
        Correction::Spectacles { vertex_mm } => Some(vertex_mm),
        Correction::ContactLenses => None,
    },
    set: |s, _, v| {
        if let Some(vertex_mm) = v {
            s.wearer.correction = Correction::Spectacles { vertex_mm };
        }
    },
};

/// The help of both monocular pupillary distances.
const PD_HELP: Help = Help {
    what: "Monocular pupillary distance: from the middle of the nose bridge to the pupil centre of this eye, for distance vision.",
    how: "Measured with a pupillometer or a PD ruler while the wearer looks into the distance.",
    usual: "Usually 28 to 36 mm per eye for adults (common practice).",
};

/// Monocular PD of the right eye.
pub const PD_RIGHT: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.pd_right_mm",
    label: "PD right",
    unit: Unit::Millimetres,
    bounds: limits::PD,
    default: Some(32.0),
    optional: false,
    help: PD_HELP,
    get: |s, _| Some(s.wearer.pd_right_mm),
    set: |s, _, v| {
        if let Some(v) = v {
            s.wearer.pd_right_mm = v;
        }
    },
};

/// Monocular PD of the left eye.
pub const PD_LEFT: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.pd_left_mm",
    label: "PD left",
    unit: Unit::Millimetres,
    bounds: limits::PD,
    default: Some(32.0),
    optional: false,
    help: PD_HELP,
    get: |s, _| Some(s.wearer.pd_left_mm),
    set: |s, _, v| {
        if let Some(v) = v {
            s.wearer.pd_left_mm = v;
        }
    },
};

/// Fitting-point height.
pub const FITTING_HEIGHT: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.fitting_height_mm",
    label: "Fitting height",
    unit: Unit::Millimetres,
    bounds: limits::FITTING_HEIGHT,
    default: Some(20.0),
    optional: false,
    help: Help {
        what: "The height of the fitting point (the pupil centre looking straight ahead) above the lowest point of the lens.",
        how: "Marked on the frame's demonstration lens with the head upright and the eyes looking straight ahead, then measured with a ruler.",
        usual: "Usually 16 to 24 mm; a progressive lens needs at least its minimum fitting height (common practice).",
    },
    get: |s, _| Some(s.wearer.fitting_height_mm),
    set: |s, _, v| {
        if let Some(v) = v {
            s.wearer.fitting_height_mm = v;
        }
    },
};

/// Lens height of the frame.
pub const LENS_HEIGHT: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.lens_height_mm",
    label: "Lens height",
    unit: Unit::Millimetres,
    bounds: limits::LENS_HEIGHT,
    default: Some(34.0),
    optional: false,
    help: Help {
        what: "The height of the lens shape in the frame (the boxed B dimension).",
        how: "Measured between horizontal lines touching the top and the bottom of the lens shape (the boxing system).",
        usual: "Usually 28 to 45 mm (common practice).",
    },
    get: |s, _| Some(s.wearer.lens_height_mm),
    set: |s, _, v| {
        if let Some(v) = v {
            s.wearer.lens_height_mm = v;
        }
    },
};

/// Pantoscopic tilt of the frame.
pub const TILT: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.pantoscopic_tilt_deg",
    label: "Pantoscopic tilt",
    unit: Unit::Degrees,
    bounds: limits::TILT,
    default: Some(8.0),
    optional: false,
    help: Help {
        what: "How far the frame front leans, its lower rims towards the cheeks.",
        how: "Measured from the side against the vertical, head upright, with a protractor or a fitting gauge.",
        usual: "Usually 6 to 12° (common practice).",
    },
    get: |s, _| Some(s.wearer.pantoscopic_tilt_deg),
    set: |s, _, v| {
        if let Some(v) = v {
            s.wearer.pantoscopic_tilt_deg = v;
        }
    },
};

/// Share of the amplitude used for sustained work.
pub const USABLE_FRACTION: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.usable_fraction",
    label: "Usable share of amplitude",
    unit: Unit::Share,
    bounds: limits::USABLE_FRACTION,
    default: Some(0.5),
    optional: false,
    help: Help {
        what: "The share of the amplitude of accommodation the wearer can use for hours at a time.",
        how: "Not measured: a planning rule that keeps the rest in reserve against fatigue.",
        usual: "50 % is the usual rule; some keep only a third in reserve, 67 % (common practice).",
    },
    get: |s, _| Some(s.wearer.usable_fraction),
    set: |s, _, v| {
        if let Some(v) = v {
            s.wearer.usable_fraction = v;
        }
    },
};

/// A measured pupil diameter.
pub const PUPIL_DIAMETER: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.pupil.diameter_mm",
    label: "Pupil diameter",
    unit: Unit::Millimetres,
    bounds: limits::PUPIL,
    default: Some(4.0),
    optional: false,
    help: Help {
        what: "The diameter of the pupil under the working light; it sets how much blur a defocus gives.",
        how: "Measured with a pupil gauge or ruler while the wearer looks at the task in its usual lighting.",
        usual: "Usually 3 to 5 mm indoors, smaller with age (common practice).",
    },
    get: |s, _| match s.wearer.pupil {
        PupilSource::Measured { diameter_mm } => Some(diameter_mm),
        PupilSource::FromLighting { .. } => None,
    },
    set: |s, _, v| {
        if let Some(diameter_mm) = v {
            s.wearer.pupil = PupilSource::Measured { diameter_mm };
        }
    },
};

/// Task luminance, for the pupil estimate.
pub const LUMINANCE: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.pupil.luminance_cd_m2",
    label: "Task luminance",
    unit: Unit::CandelasPerSquareMetre,
    bounds: limits::LUMINANCE,
    default: Some(100.0),
    optional: false,
    help: Help {
        what: "How bright the tasks look; with the age it gives the pupil size (Watson and Yellott's formula).",
        how: "Read with a luminance meter, or estimated: white paper under office lighting is about 100 cd/m².",
        usual: "About 50 to 200 cd/m² indoors, thousands outdoors by day (common practice).",
    },
    get: |s, _| match s.wearer.pupil {
        PupilSource::FromLighting { luminance_cd_m2 } => Some(luminance_cd_m2),
        PupilSource::Measured { .. } => None,
    },
    set: |s, _, v| {
        if let Some(luminance_cd_m2) = v {
            s.wearer.pupil = PupilSource::FromLighting { luminance_cd_m2 };
        }
    },
};

/// A clinical half depth of field.
pub const HALF_DEPTH: Field = Field {
    scope: Scope::Scenario,
    key: "wearer.blur_tolerance.half_depth_d",
    label: "Half depth of field",
    unit: Unit::Dioptres,
    bounds: limits::HALF_DEPTH,
    default: Some(0.25),
    optional: false,
    help: Help {
        what: "The defocus every task tolerates either side of sharp focus.",
        how: "A clinical choice, not a measurement; it replaces the estimate from each task's detail size.",
        usual: "0.25 D is strict, 0.50 D lenient (common practice).",
    },
    get: |s, _| match s.wearer.blur_tolerance {
        BlurTolerance::Clinical { half_depth_d } => Some(half_depth_d),
        BlurTolerance::FromDetail => None,
    },
    set: |s, _, v| {
        if let Some(half_depth_d) = v {
            s.wearer.blur_tolerance = BlurTolerance::Clinical { half_depth_d };
        }
    },
};

/// The driving acuity standard.
pub const DRIVING_ACUITY: Field = Field {
    scope: Scope::Scenario,
    key: "settings.driving_acuity_decimal",
    label: "Driving acuity standard (decimal)",
    unit: Unit::Ratio,
    bounds: limits::DRIVING_ACUITY,
    default: Some(0.5),
    optional: false,
    help: Help {
        what: "The least visual acuity with both eyes that driving must leave, as a decimal (1.0 is 6/6 or 20/20).",
        how: "Set by the licensing rules where the wearer drives.",
        usual: "0.5, about 6/12 or 20/40, for ordinary licences in the EU (Directive 2006/126/EC, Annex III).",
    },
    get: |s, _| Some(s.settings.driving_acuity_decimal),
    set: |s, _, v| {
        if let Some(v) = v {
            s.settings.driving_acuity_decimal = v;
        }
    },
};

/// The vertical prism difference limit.
pub const IMBALANCE_LIMIT: Field = Field {
    scope: Scope::Scenario,
    key: "settings.vertical_imbalance_limit_pd",
    label: "Vertical prism limit",
    unit: Unit::PrismDioptres,
    bounds: limits::IMBALANCE_LIMIT,
    default: Some(1.0),
    optional: false,
    help: Help {
        what: "The vertical prism difference between the eyes above which a long task counts as tiring.",
        how: "A planning limit; the plan works out the difference at each task from both prescriptions (Prentice's rule).",
        usual: "About 1 Δ (common practice).",
    },
    get: |s, _| Some(s.settings.vertical_imbalance_limit_pd),
    set: |s, _, v| {
        if let Some(v) = v {
            s.settings.vertical_imbalance_limit_pd = v;
        }
    },
};

/// The eye fields, in the order of a prescription.
pub const EYE: [&Field; 5] = [
    &SPHERE,
    &CYLINDER,
    &AXIS,
    &PRISM_HORIZONTAL,
    &PRISM_VERTICAL,
];

/// The fitting measurements, in the order a dispenser takes them.
pub const FITTING: [&Field; 5] = [&PD_RIGHT, &PD_LEFT, &FITTING_HEIGHT, &LENS_HEIGHT, &TILT];

/// Every number of the wearer and the plan's limits, in the order the gate checks them.
pub const WEARER: [&Field; 20] = [
    &DRIVING_ACUITY,
    &IMBALANCE_LIMIT,
    &AGE,
    &MEASURED_AMPLITUDE,
    &SPHERE,
    &CYLINDER,
    &AXIS,
    &PRISM_HORIZONTAL,
    &PRISM_VERTICAL,
    &PRESCRIBED_ADDITION,
    &VERTEX,
    &PD_RIGHT,
    &PD_LEFT,
    &FITTING_HEIGHT,
    &LENS_HEIGHT,
    &TILT,
    &PUPIL_DIAMETER,
    &LUMINANCE,
    &USABLE_FRACTION,
    &HALF_DEPTH,
];
