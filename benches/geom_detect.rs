//! Timing of point-group detection on large clusters: a 1415-atom Mackay icosahedron (Ih),
//! a 1415-atom fcc cuboctahedron (Oh) and a 1099-atom fcc cube (Oh), each also randomly
//! rotated and translated. Needs in Cargo.toml:
//!
//! ```toml
//! [[bench]]
//! name = "geom_detect"
//! harness = false
//! ```
//!
//! Without that entry Cargo builds this file with the default harness; the attribute
//! below keeps that build warning-free.
#![cfg_attr(test, allow(dead_code, unused_imports))]

#[path = "../tests/geom_molecules.rs"]
mod molecules;

use criterion::{black_box, criterion_group, criterion_main, Criterion};
use salcdesk::geom::detect;

fn clusters(c: &mut Criterion) {
    // Source: Au–Au 2.88 Å and the Cu lattice constant 3.615 Å, from memory.
    let cases = [
        (
            "mackay_ih_1415",
            molecules::mackay_icosahedron(7, 2.88),
            "Ih",
        ),
        (
            "cubocta_oh_1415",
            molecules::fcc_cuboctahedron(7, 3.615),
            "Oh",
        ),
        ("fcc_cube_oh_1099", molecules::fcc_cube(6, 3.615), "Oh"),
    ];
    for (name, mol, group) in cases {
        let turned = molecules::scramble(&mol, 11, 0.0);
        for (label, m) in [
            (name.to_string(), &mol),
            (format!("{name}_rotated"), &turned),
        ] {
            assert_eq!(
                detect(m, 0.01).map(|d| d.group).ok().as_deref(),
                Some(group)
            );
            c.bench_function(&label, |b| b.iter(|| detect(black_box(m), 0.01)));
        }
    }
}

criterion_group!(benches, clusters);
criterion_main!(benches);
