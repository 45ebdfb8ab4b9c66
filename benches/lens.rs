//! Speed of the lens and gaze core in the planner's hot loop: a full map of
//! each lens family sampled on a 60 x 40 grid of lens points, one gaze
//! crossing, one usable-width estimate and one head-posture search.

use clearspan::core::astigmatism::usable_width;
use clearspan::core::gaze::{
    ComfortRange, Eye, Fitting, FittingParams, TaskPosition, TaskVertical, COR_BEHIND_CORNEA_MM,
};
use clearspan::core::lens::{
    Bifocal, Degressive, DoubleSegment, LensDesign, LensPoint, Progressive, SegmentShape,
    SingleVision, Trifocal, VerticalExtent,
};
use clearspan::core::units::{Degrees, Dioptres, Metres, Millimetres};
use criterion::{black_box, criterion_main, Criterion, Throughput};

const COLUMNS: usize = 60;
const ROWS: usize = 40;

/// Demo designs, one per family (fictional parameters within the usual ranges).
fn designs() -> Vec<(&'static str, LensDesign)> {
    let shape = SegmentShape::STRAIGHT_TOP_28;
    let mm = Millimetres;
    let d = Dioptres;
    vec![
        (
            "single_vision",
            LensDesign::SingleVision(SingleVision::new(d(1.0)).unwrap()),
        ),
        (
            "bifocal",
            LensDesign::Bifocal(Bifocal::new(d(2.0), mm(-4.0), shape).unwrap()),
        ),
        (
            "trifocal",
            LensDesign::Trifocal(Trifocal::new(d(2.0), 0.5, mm(-2.0), mm(7.0), shape).unwrap()),
        ),
        (
            "progressive",
            LensDesign::Progressive(Progressive::new(d(2.0), mm(18.0), mm(2.5)).unwrap()),
        ),
        (
            "degressive",
            LensDesign::Degressive(Degressive::new(d(1.75), d(1.0)).unwrap()),
        ),
        (
            "double_segment",
            LensDesign::DoubleSegment(
                DoubleSegment::new(d(2.0), mm(-5.0), mm(10.0), shape).unwrap(),
            ),
        ),
    ]
}

fn lens_maps(c: &mut Criterion) {
    let mut group = c.benchmark_group("lens_map_60x40");
    group.throughput(Throughput::Elements((COLUMNS * ROWS) as u64));
    for (name, design) in designs() {
        group.bench_function(name, |b| {
            b.iter(|| {
                let mut total = 0.0;
                for i in 0..COLUMNS {
                    for j in 0..ROWS {
                        let x = -30.0 + i as f64;
                        let y = -22.0 + j as f64;
                        total += black_box(&design).evaluate(LensPoint::new(x, y)).addition.0;
                    }
                }
                total
            })
        });
    }
    group.finish();
}

fn gaze(c: &mut Criterion) {
    let fitting = Fitting::new(FittingParams {
        pd_right: Millimetres(32.0),
        pd_left: Millimetres(31.0),
        vertex: Millimetres(13.0),
        cor_behind_cornea: Millimetres(COR_BEHIND_CORNEA_MM),
        pantoscopic_tilt: Degrees(8.0),
        face_form: Degrees(5.0),
        extent: VerticalExtent::from_frame(Millimetres(22.0), Millimetres(38.0)).unwrap(),
    })
    .unwrap();
    let task = fitting
        .locate(&TaskPosition {
            distance: Metres(0.65),
            vertical: TaskVertical::GazeAngle(Degrees(-15.0)),
            sideways: Metres(0.1),
        })
        .unwrap();
    let design = LensDesign::Progressive(
        Progressive::new(Dioptres(2.0), Millimetres(18.0), Millimetres(2.5)).unwrap(),
    );
    c.bench_function("gaze_crossing", |b| {
        b.iter(|| fitting.crossing(black_box(Eye::Right), black_box(&task), Degrees(0.0)))
    });
    c.bench_function("usable_width", |b| {
        b.iter(|| {
            usable_width(
                black_box(&design),
                Millimetres(-10.0),
                Dioptres(0.5),
                Millimetres(27.0),
            )
        })
    });
    c.bench_function("head_posture", |b| {
        b.iter(|| {
            fitting.posture_for(
                black_box(&design),
                black_box(&task),
                Dioptres(1.0),
                Dioptres(0.25),
                ComfortRange::default(),
            )
        })
    });
}

/// The group lives in a private module so that the function the macro
/// generates is not a public, undocumented item of the bench crate.
mod group {
    criterion::criterion_group!(benches, super::lens_maps, super::gaze);
}

criterion_main!(group::benches);
