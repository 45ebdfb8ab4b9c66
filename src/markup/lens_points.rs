//! The task points on the lens map: where each task of the option shown
//! crosses the lens, labelled with the task's number and the local
//! addition found there, labels placed clear of each other and of the
//! fitting cross (`chart::lens_map`). Each point is a mark that opens the
//! task's detail (`data-mark`); hovering shows the task's numbers.

use super::html::{number, Html};
use super::marks::Mark;
use crate::chart::coord::Coord;
use crate::chart::lens_map::{label_places, LensFrame};
use crate::plan::OptionPlan;

/// Radius of the circle that takes a tap or a click on a task point, in SVG
/// units: 44 px across or more where the map is drawn at its full width
/// (touch-target size, WCAG 2.5.5).
const HIT: f64 = 20.0;

/// An SVG coordinate rounded to a tenth (below a pixel at every width the
/// map is drawn), as written.
fn at(value: f64) -> String {
    Coord::of(value).written()
}

/// The task points of `option` on the lens drawn in `frame`, one group of
/// SVG text per point, the point of the task at input index `open` (whose
/// detail is shown, if any) expanded.
pub fn lens_points(frame: &LensFrame, option: &OptionPlan, open: Option<usize>) -> Vec<String> {
    let labels: Vec<String> = option
        .tasks
        .iter()
        .map(|t| format!("{} {}", t.task.index + 1, t.local_power.addition))
        .collect();
    let dots: Vec<(f64, f64, usize)> = option
        .tasks
        .iter()
        .zip(&labels)
        .map(|(t, l)| {
            let (x, y) = (frame.x(t.lens_point.x.0), frame.y(t.lens_point.y.0));
            (x, y, l.chars().count())
        })
        .collect();
    let places = label_places(&dots, (frame.x(0.0), frame.y(0.0)));
    let mut points = Vec::with_capacity(labels.len());
    for ((t, &(x, y, _)), ((lx, ly), label)) in option
        .tasks
        .iter()
        .zip(&dots)
        .zip(places.into_iter().zip(&labels))
    {
        let mut html = Html::new();
        let index = t.task.index;
        let tooltip = format!(
            "{}. {}: {} zone, addition {}, {}",
            index + 1,
            t.task.name,
            t.zone,
            t.local_power.addition,
            t.verdict
        );
        let (x, y) = (at(x), at(y));
        html.open(
            "g",
            &[
                ("class", "lens-point"),
                ("tabindex", "0"),
                ("role", "button"),
                ("aria-label", &tooltip),
                ("aria-haspopup", "dialog"),
                ("aria-expanded", Mark::expanded(index, open)),
                ("data-mark", &Mark::Point.id(index)),
            ],
        )
        .element("title", &[], &tooltip)
        .shape(
            "circle",
            &[
                ("class", "hit"),
                ("cx", &x),
                ("cy", &y),
                ("r", &number(HIT)),
            ],
        )
        .shape(
            "circle",
            &[("class", "dot"), ("cx", &x), ("cy", &y), ("r", "5")],
        )
        .element("text", &[("x", &at(lx)), ("y", &at(ly))], label)
        .close("g");
        points.push(html.finish());
    }
    points
}
