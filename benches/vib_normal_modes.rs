//! Normal modes of force-field Hessians built here: C60 (180×180, target ≤ 50 ms labelled)
//! and a 1,099-atom fcc cube (Oh, 3,297×3,297) solved blocked by symmetry. The dense solve of
//! the cluster takes minutes, so it is timed once, only with SALCDESK_BENCH_DENSE=1.

#[path = "../tests/geom_molecules.rs"]
mod molecules;

use criterion::{criterion_group, criterion_main, Criterion};
use nalgebra::DMatrix;
use salcdesk::geom::Molecule;
use salcdesk::vib::{self, HessianInput, Options, Solver};
use std::time::{Duration, Instant};

/// Bond-stretch springs (0.5 hartree/bohr²) between atoms closer than `cut` Å.
fn spring_hessian(m: &Molecule, cut: f64) -> HessianInput {
    let n = m.atoms.len();
    let p: Vec<_> = m.atoms.iter().map(|a| a.position).collect();
    let mut h = DMatrix::zeros(3 * n, 3 * n);
    for a in 0..n {
        for b in a + 1..n {
            let d = p[b] - p[a];
            if d.norm() < cut {
                let u = d.normalize();
                let blk = u * u.transpose() * 0.5;
                for (i, j, s) in [(a, a, 1.0), (b, b, 1.0), (a, b, -1.0), (b, a, -1.0)] {
                    let mut v = h.fixed_view_mut::<3, 3>(3 * i, 3 * j);
                    v += blk * s;
                }
            }
        }
    }
    HessianInput {
        title: m.title.clone(),
        elements: m.atoms.iter().map(|a| a.element).collect(),
        positions: p,
        hessian: h,
        asymmetry: 0.0,
        source: "bench".into(),
    }
}

/// The C60 Hessian as a QCSchema result in target/, for timing the whole `normal-modes`
/// process (README performance table).
fn write_qcschema(h: &HessianInput) -> std::path::PathBuf {
    let bohr = 0.529_177_210_903; // Å per bohr, CODATA 2018
    let geometry: Vec<f64> = h
        .positions
        .iter()
        .flat_map(|p| p.iter().map(|x| x / bohr))
        .collect();
    let symbols: Vec<&str> = h
        .elements
        .iter()
        .map(|z| salcdesk::geom::elements::symbol(*z).unwrap_or("X"))
        .collect();
    let v = serde_json::json!({
        "schema_name": "qcschema_output",
        "driver": "hessian",
        "molecule": {"symbols": symbols, "geometry": geometry},
        "return_result": h.hessian.transpose().as_slice(),
    });
    let out = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("target/c60_hessian.json");
    std::fs::write(&out, v.to_string()).unwrap();
    out
}

fn bench(c: &mut Criterion) {
    let c60 = spring_hessian(&molecules::c60(), 1.5);
    if std::env::var_os("SALCDESK_BENCH_WRITE_C60").is_some() {
        eprintln!("wrote {}", write_qcschema(&c60).display());
        return;
    }
    let opts = Options::default();
    let nm = vib::normal_modes(&c60, &opts).unwrap();
    assert_eq!(nm.parent.point_group, "Ih");
    assert_eq!(nm.parent.solver, "blocked");
    c.bench_function("vib_c60_labelled_blocked", |b| {
        b.iter(|| vib::normal_modes(&c60, &opts).unwrap())
    });
    let dense = Options {
        solver: Solver::Dense,
        ..Options::default()
    };
    c.bench_function("vib_c60_labelled_dense", |b| {
        b.iter(|| vib::normal_modes(&c60, &dense).unwrap())
    });

    let cube = spring_hessian(&molecules::fcc_cube(6, 3.615), 2.6);
    let blocked = Options {
        solver: Solver::Blocked,
        ..Options::default()
    };
    let mut g = c.benchmark_group("vib_cluster");
    g.sample_size(10).measurement_time(Duration::from_secs(20));
    g.bench_function("vib_fcc_cube_1099_blocked", |b| {
        b.iter(|| vib::normal_modes(&cube, &blocked).unwrap())
    });
    g.finish();
    if std::env::var_os("SALCDESK_BENCH_DENSE").is_some() {
        let t = Instant::now();
        let d = vib::normal_modes(
            &cube,
            &Options {
                solver: Solver::Dense,
                ..Options::default()
            },
        )
        .unwrap();
        eprintln!(
            "vib_fcc_cube_1099_dense (one run): {:.1} s, {} sets",
            t.elapsed().as_secs_f64(),
            d.parent.sets.len()
        );
    }
}

criterion_group!(benches, bench);
criterion_main!(benches);
