//! Timing of whole-molecule surveys: C60 (detect, orient, Γ3N/Γvib, bond and angle sets,
//! near misses) and the large clusters (detect + orient + Γ3N/Γvib).

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
    // Source: Au–Au 2.88 Å and the Cu lattice constant 3.615 Å, from memory.
    let clusters = [
        (
            "survey_mackay_ih_1415",
            molecules::mackay_icosahedron(7, 2.88),
        ),
        (
            "survey_cubocta_oh_1415",
            molecules::fcc_cuboctahedron(7, 3.615),
        ),
        ("survey_fcc_cube_oh_1099", molecules::fcc_cube(6, 3.615)),
    ];
    for (name, mol) in clusters {
        let turned = molecules::scramble(&mol, 11, 0.0);
        c.bench_function(name, |b| {
            b.iter(|| survey(black_box(&turned), &lean).unwrap())
        });
    }
}

criterion_group! {
    name = benches;
    config = Criterion::default().sample_size(20);
    targets = surveys
}
criterion_main!(benches);
