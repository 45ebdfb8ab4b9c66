//! A task's numbers in detail: the task through every option (best first),
//! its verdict, the local power, the accommodation it takes and its share,
//! the blur and acuity loss, the head posture, and the near PD with the
//! convergence. The app shows it beside the mark it was chosen from.

use super::html::Html;
use super::marks::verdict_mark;
use crate::plan::Plan;

/// The heading and the table of the task at input index `t` of `plan`;
/// `None` when the plan has no such task.
pub fn task_detail(plan: &Plan, t: usize) -> Option<(String, String)> {
    let ctx = plan.tasks.iter().find(|c| c.task.index == t)?;
    let mut html = Html::new();
    html.open("div", &[("class", "table-scroll")])
        .open("table", &[])
        .column_heads(&[
            "Option",
            "Verdict",
            "Local power",
            "Accommodation (share)",
            "Blur, acuity loss",
            "Head posture",
            "Near PD, convergence",
        ])
        .open("tbody", &[]);
    for o in &plan.options {
        let Some(tp) = o.tasks.iter().find(|tp| tp.task.index == t) else {
            continue;
        };
        let (symbol, class, words) = verdict_mark(tp.verdict);
        let share = tp
            .share_of_amplitude
            .map_or_else(|| "n/a".into(), |s| format!("{:.0} %", s * 100.0));
        html.open("tr", &[])
            .element(
                "th",
                &[("scope", "row")],
                &format!("#{} {}", o.rank, o.option.label),
            )
            .open("td", &[("class", &format!("verdict {class}"))])
            .element("span", &[("aria-hidden", "true")], symbol)
            .text(" ")
            .text(words)
            .close("td")
            .element("td", &[], &tp.local_power.to_string())
            .element("td", &[], &format!("{} ({share})", tp.accommodation))
            .element(
                "td",
                &[],
                &format!(
                    "{:.1}′, −{:.2} logMAR",
                    tp.blur.blur_disc_arcmin, tp.blur.acuity_loss_logmar
                ),
            )
            .element("td", &[], &tp.posture.to_string())
            .element(
                "td",
                &[],
                &format!(
                    "{:.1} mm, {:.1} Δ",
                    tp.near_vision.near_pd.0, tp.near_vision.convergence.0
                ),
            )
            .close("tr");
    }
    html.close("tbody").close("table").close("div");
    Some((
        format!("{}. {} in detail", t + 1, ctx.task.name),
        html.finish(),
    ))
}
