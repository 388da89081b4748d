//! Timing of point-group detection on large clusters (the timing clusters of
//! tests/geom_molecules.rs: a 1139-atom fcc truncated octahedron and a 1415-atom fcc
//! cuboctahedron (Oh), 1415- and 147-atom Mackay icosahedra (Ih)) plus a 1099-atom fcc
//! cube, each as built and randomly turned and moved; and the near-miss report that
//! follows a detection. Needs in Cargo.toml:
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
use salcdesk::geom::{detect, near_misses_from, NEAR_MISS_TOLERANCES};

fn clusters(c: &mut Criterion) {
    let mut cases = molecules::timing_clusters();
    // Source: the Cu lattice constant 3.615 Å, from memory.
    cases.push(("fcc_cube_oh_1099", molecules::fcc_cube(6, 3.615), "Oh"));
    for (name, mol, group) in cases {
        let turned = molecules::scramble(&mol, 11, 0.0);
        for (label, m) in [
            (name.to_string(), &mol),
            (format!("{name}_turned"), &turned),
        ] {
            assert_eq!(
                detect(m, 0.01).map(|d| d.group).ok().as_deref(),
                Some(group)
            );
            c.bench_function(&format!("detect_{label}"), |b| {
                b.iter(|| detect(black_box(m), 0.01))
            });
        }
    }
}

/// The near-miss report after a detection: reading looser tolerances from one element
/// search (benzene with a Kekulé distortion: D3h at 0.01 Å, D6h at 0.1 Å) and a noisy
/// C60 (Ih reached: nothing more to search).
fn near_misses(c: &mut Criterion) {
    let mut kekule = molecules::benzene();
    for (k, a) in kekule.atoms.iter_mut().enumerate().take(6) {
        // Alternate ring atoms turned ±0.8° about z: bonds alternate by about 0.04 Å.
        let t: f64 = if k % 2 == 0 { 0.014 } else { -0.014 };
        let (s, co) = t.sin_cos();
        let p = a.position;
        a.position = nalgebra::Vector3::new(co * p.x - s * p.y, s * p.x + co * p.y, p.z);
    }
    let noisy_c60 = molecules::scramble(&molecules::c60(), 7, 0.002);
    for (name, m) in [("kekule_benzene", kekule), ("noisy_c60", noisy_c60)] {
        let d = detect(&m, 0.01).unwrap();
        c.bench_function(&format!("near_misses_{name}"), |b| {
            b.iter(|| near_misses_from(black_box(&m), &d, &NEAR_MISS_TOLERANCES))
        });
    }
}

criterion_group!(benches, clusters, near_misses);
criterion_main!(benches);
