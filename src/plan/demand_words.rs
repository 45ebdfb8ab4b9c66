//! The task-demand sheet's figures in words, as the browser shows and
//! prints them: focusing needed against what is available, the head
//! posture, and the detail size against the character-height guidance for
//! displays with its source. Only wording: every figure comes from
//! [`super::demands`] as it is.

use super::demands::{DemandSheet, Reason, TaskDemand};
use super::ergonomics::{
    CHARACTER_HEIGHT_MIN_ARCMIN, CHARACTER_HEIGHT_PREFERRED_ARCMIN, CHARACTER_HEIGHT_SOURCE,
};
use super::Strain;

impl TaskDemand {
    /// Focusing needed against what is available for sustained work, with
    /// the shortfall the flag gives: "needs 1.54 D, has 1.25 D comfortably,
    /// short by 0.29 D" (ocular dioptres).
    pub fn focus_words(&self) -> String {
        let needs = if self.accommodation_needed.0 <= 0.005 {
            "needs none".to_string()
        } else {
            format!("needs {:.2} D", self.accommodation_needed.0)
        };
        let has = format!("has {:.2} D comfortably", self.accommodation_comfortable.0);
        let tail = self.flag.reasons().iter().find_map(|r| match *r {
            Reason::ShortOfFocus { short_by, .. } => {
                Some(format!(", short by {:.2} D", short_by.0))
            }
            Reason::TooMuchPlus { excess } => Some(format!(
                "; the glasses give {:.2} D too much plus here",
                excess.0
            )),
            _ => None,
        });
        format!("{needs}, {has}{}", tail.unwrap_or_default())
    }

    /// The head posture the glasses force and how sustainable it is, with
    /// its angles: "chin up 23°: not sustainable", "head turned 14°, a
    /// further 6° to sweep across it: tiring", "head upright: comfortable".
    /// A driving task's head turn (to a door mirror) is a glance, part of
    /// driving, and is said so: "head turned 21°: a glance while driving,
    /// not a held posture".
    pub fn posture_words(&self) -> String {
        let tilt = self.chin_up.0;
        let mut parts = Vec::new();
        if tilt > 0.5 {
            parts.push(format!("chin up {tilt:.0}°"));
        } else if tilt < -0.5 {
            parts.push(format!("chin down {:.0}°", -tilt));
        }
        let turned = self.head_turn.0 > 0.5 || self.head_sweep.0 > 0.5;
        if self.head_turn.0 > 0.5 {
            parts.push(format!("head turned {:.0}°", self.head_turn.0));
        }
        if self.head_sweep.0 > 0.5 {
            parts.push(format!(
                "a further {:.0}° to sweep across it",
                self.head_sweep.0
            ));
        }
        if parts.is_empty() {
            parts.push("head upright".to_string());
        }
        let how = parts.join(", ");
        if self.driving && turned && self.posture == Strain::Comfortable {
            format!("{how}: a glance while driving, not a held posture")
        } else {
            format!("{how}: {}", self.posture)
        }
    }

    /// The detail size as an angle, against the character-height guidance
    /// when the task is display text: "14.9′; display text: at least 16′,
    /// 20′ or more preferred (ISO 9241-3:1992)".
    pub fn detail_words(&self) -> String {
        if self.screen {
            format!(
                "{:.1}′; display text: at least {:.0}′, {:.0}′ or more preferred ({})",
                self.detail_arcmin,
                CHARACTER_HEIGHT_MIN_ARCMIN,
                CHARACTER_HEIGHT_PREFERRED_ARCMIN,
                CHARACTER_HEIGHT_SOURCE
            )
        } else {
            format!("{:.1}′ (not display text)", self.detail_arcmin)
        }
    }
}

impl DemandSheet {
    /// The age norm beside a measured amplitude, and whether the
    /// measurement lies far below it; `None` when the amplitude came from age.
    pub fn age_norm_words(&self) -> Option<String> {
        let norm = self.age_norm_minimum?;
        let verdict = if self.amplitude_below_norm {
            ": far below it, so every task not fine as it is is referred for an eye examination"
        } else {
            ""
        };
        Some(format!(
            "Measured {:.2} D against {:.2} D, the minimum expected at this age (Hofstetter){verdict}.",
            self.amplitude.stated.0, norm.0
        ))
    }
}
