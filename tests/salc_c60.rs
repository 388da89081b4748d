//! C60 (Ih): exact stretch SALCs and symmetry coordinates of buckminsterfullerene.

#[path = "salc_support.rs"]
mod support;

use salcdesk::basis;
use salcdesk::salc::{self, Role};
use std::time::Instant;
use support::c60;

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
