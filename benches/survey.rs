//! Timing of whole-molecule surveys: C60 (detect, orient, Γ3N/Γvib, bond and angle sets,
//! near misses), and the timing clusters of tests/geom_molecules.rs both lean (detect +
//! orient + Γ3N/Γvib) and with everything `salcdesk analyze` does by default (bonds, bond
//! and angle sets, redundancies, near misses). The whole process, file reading and
//! printing included, is timed as documented in README (Performance).

#[path = "../tests/geom_molecules.rs"]
mod molecules;

use criterion::{black_box, criterion_group, criterion_main, Criterion};
use salcdesk::survey::{survey, SurveyOptions};

fn surveys(c: &mut Criterion) {
    let c60 = molecules::c60();
    c.bench_function("survey_c60_full", |b| {
        b.iter(|| survey(black_box(&c60), &SurveyOptions::default()).unwrap())
    });
    let lean = SurveyOptions {
        internal_coordinates: false,
        near_misses: false,
        ..SurveyOptions::default()
    };
    for (name, mol, _) in molecules::timing_clusters() {
        let turned = molecules::scramble(&mol, 11, 0.0);
        c.bench_function(&format!("survey_lean_{name}_turned"), |b| {
            b.iter(|| survey(black_box(&turned), &lean).unwrap())
        });
        c.bench_function(&format!("survey_default_{name}_turned"), |b| {
            b.iter(|| survey(black_box(&turned), &SurveyOptions::default()).unwrap())
        });
    }
}

criterion_group! {
    name = benches;
    config = Criterion::default().sample_size(20);
    targets = surveys
}
criterion_main!(benches);
