//! Speed of the optics core's hot path: one task evaluated through one local
//! lens power (the planner calls this for every task at every candidate lens
//! point), and the range of clear vision of one zone.

use clearspan::core::accommodation::UsableShare;
use clearspan::core::clear_range::{evaluate_task, range_of_clear_vision, Viewer};
use clearspan::core::units::{Dioptres, Metres};
use clearspan::core::vergence::CorrectedEye;
use criterion::{criterion_main, Criterion};
use std::hint::black_box;

/// Demo wearer (fictional): -2.50 D at 13 mm, 1.25 D ocular amplitude, half usable.
fn demo_viewer() -> Viewer {
    let eye = CorrectedEye::new(Dioptres(-2.5), Metres(0.013)).expect("valid demo eye");
    Viewer::new(eye, Dioptres(1.25), UsableShare::HALF).expect("valid demo viewer")
}

fn optics(c: &mut Criterion) {
    let viewer = demo_viewer();
    c.bench_function("evaluate_task (one task, one local power)", |b| {
        b.iter(|| {
            evaluate_task(
                black_box(&viewer),
                black_box(Metres(0.65)),
                black_box(Dioptres(-1.25)),
                black_box(Dioptres(0.3)),
            )
        })
    });
    c.bench_function("range_of_clear_vision (one zone)", |b| {
        b.iter(|| {
            range_of_clear_vision(
                black_box(&viewer),
                black_box(Dioptres(-1.25)),
                black_box(Dioptres(0.3)),
            )
        })
    });
}

/// The group lives in a private module so that the function the macro
/// generates is not a public, undocumented item of the bench crate.
mod group {
    criterion::criterion_group!(benches, super::optics);
}

criterion_main!(group::benches);
