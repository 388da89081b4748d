//! C60 (Ih, 60 atoms, 90 bonds): exact stretch SALCs (target ≤ 200 ms) and the 174 exact
//! symmetry coordinates (target ≤ 1 s), against the float path of the same algorithm.

use criterion::{criterion_group, criterion_main, Criterion};
use nalgebra::Vector3;
use salcdesk::basis::{self, Placed, Structure};
use salcdesk::salc;
use std::time::Duration;

/// C60 from its two bond lengths.
// from memory: C60 bond lengths 1.45 Å (pentagon edges) and 1.40 Å (hexagon–hexagon edges).
fn c60() -> Structure {
    let g = salcdesk::group::load("Ih").unwrap();
    let phi = (1.0 + 5f64.sqrt()) / 2.0;
    let a1 = Vector3::new(0.0, 1.0, phi).normalize();
    let a2 = Vector3::new(0.0, -1.0, phi).normalize();
    let r5 = 1.45 / (2.0 * (std::f64::consts::PI / 5.0).sin());
    let u = (a2 - a1 * a2.dot(&a1)).normalize();
    let atom = |h: f64| a1 * h + u * r5;
    let n = (a2 - a1).normalize();
    let mirror = |p: Vector3<f64>| p - n * 2.0 * p.dot(&n);
    let (mut lo, mut hi) = (1.0, 10.0);
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if (atom(mid) - mirror(atom(mid))).norm() > 1.40 {
            hi = mid;
        } else {
            lo = mid;
        }
    }
    let p = atom(0.5 * (lo + hi));
    let mut pts: Vec<Vector3<f64>> = Vec::new();
    for op in &g.ops {
        let q = op.float * p;
        if pts.iter().all(|x| (x - q).norm() > 1e-6) {
            pts.push(q);
        }
    }
    let mut bonds = Vec::new();
    for i in 0..pts.len() {
        for j in i + 1..pts.len() {
            if (pts[i] - pts[j]).norm() < 1.5 {
                bonds.push((i, j));
            }
        }
    }
    let atoms = pts
        .into_iter()
        .map(|position| Placed {
            symbol: "C".into(),
            position,
        })
        .collect();
    Structure::new(g, atoms, bonds, 1e-3).unwrap()
}

fn bench(c: &mut Criterion) {
    let s = c60();
    let st = basis::stretches(&s, &s.bonds).unwrap();
    // irrep matrices are built once per group and cached; keep them out of the timings
    salc::real_irreps(&s.group).unwrap();
    let mut g = c.benchmark_group("c60");
    g.sample_size(10).measurement_time(Duration::from_secs(20));
    g.bench_function("stretch_salcs_exact", |b| {
        b.iter(|| salc::salcs(&st).unwrap())
    });
    g.bench_function("stretch_salcs_float", |b| {
        b.iter(|| salc::float_salcs(&st).unwrap())
    });
    g.bench_function("symmetry_coordinates_exact", |b| {
        b.iter(|| salc::symmetry_coordinates(&s).unwrap())
    });
    g.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
