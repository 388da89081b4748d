//! C60 (Ih, 60 atoms, 90 bonds): exact stretch SALCs against the float path of the same
//! algorithm (target: exact ≤ 3× float) and the 174 exact symmetry coordinates (engine part of
//! the ≤ 100 ms whole-process target; the whole process is timed as in README → Performance).

#[path = "../tests/salc_support.rs"]
mod support;

use criterion::{criterion_group, criterion_main, Criterion};
use salcdesk::basis;
use salcdesk::salc;
use std::time::Duration;
use support::c60;

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
