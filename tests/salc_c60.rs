//! C60 (Ih): exact stretch SALCs and symmetry coordinates of buckminsterfullerene.

use nalgebra::Vector3;
use salcdesk::basis::{self, Placed, Structure};
use salcdesk::salc::{self, Role};
use std::time::Instant;

/// C60 from its two bond lengths: 1.45 Å in the pentagons, 1.40 Å between them.
// from memory: C60 bond lengths 1.45 Å (5:6) and 1.40 Å (6:6), e.g. neutron/electron diffraction.
pub fn c60() -> Structure {
    let g = salcdesk::group::load("Ih").unwrap();
    let phi = (1.0 + 5f64.sqrt()) / 2.0;
    let a1 = Vector3::new(0.0, 1.0, phi).normalize(); // a C5 axis of the table's setting
    let a2 = Vector3::new(0.0, -1.0, phi).normalize(); // a neighbouring C5 axis
    let r5 = 1.45 / (2.0 * (std::f64::consts::PI / 5.0).sin());
    // pentagon atom on a1's pentagon pointing toward a2, at height h along a1
    let u = (a2 - a1 * a2.dot(&a1)).normalize();
    let atom = |h: f64| a1 * h + u * r5;
    let mirror = |p: Vector3<f64>| {
        let n = (a2 - a1).normalize();
        p - n * 2.0 * p.dot(&n)
    };
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

#[test]
fn c60_has_60_atoms_and_90_bonds() {
    // Source: Kroto et al., Nature 318, 162 (1985): truncated icosahedron, 60 vertices, 90 edges.
    let s = c60();
    assert_eq!(s.len(), 60);
    assert_eq!(s.bonds.len(), 90);
}

#[test]
fn c60_stretch_salcs() {
    let s = c60();
    let st = basis::stretches(&s, &s.bonds).unwrap();
    let t = Instant::now();
    salc::real_irreps(&s.group).unwrap();
    eprintln!("Ih real irreps: {:?}", t.elapsed());
    let t = Instant::now();
    let set = salc::salcs(&st).unwrap();
    eprintln!("C60 stretch SALCs: {:?}", t.elapsed());
    assert_eq!(set.salcs.len(), 90);
}

#[test]
fn c60_symmetry_coordinates() {
    let s = c60();
    let t = Instant::now();
    let set = salc::symmetry_coordinates(&s).unwrap();
    eprintln!("C60 symmetry coordinates: {:?}", t.elapsed());
    let vib = set.salcs.iter().filter(|c| c.role == Role::Plain).count();
    // Source: Herzberg-style count 3N − 6 = 174 for C60.
    assert_eq!(vib, 174);
}
