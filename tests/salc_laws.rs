//! Laws every SALC set obeys, on many groups and bases: counts n·d, exact orthonormality, each
//! partner tuple transforming by the irrep's matrices, idempotent projectors with Σ P^Γ = 1.
// Source: Cotton, Chemical Applications of Group Theory, 3rd ed., §4.5 and ch. 8 (projection and
// transfer operators); Serre, Linear Representations of Finite Groups, §2.6–2.7.

#[path = "salc_support.rs"]
mod support;

use salcdesk::basis;
use salcdesk::salc;
use support::*;

fn all_bases(s: &salcdesk::basis::Structure, centre: Option<usize>) {
    let c = basis::cartesian(s).unwrap();
    check_laws(&c, &salc::salcs(&c).unwrap());
    if !s.bonds.is_empty() {
        let st = basis::stretches(s, &s.bonds).unwrap();
        check_laws(&st, &salc::salcs(&st).unwrap());
        let angles = basis::all_angles(s);
        if !angles.is_empty() {
            let be = basis::bends(s, &angles).unwrap();
            check_laws(&be, &salc::salcs(&be).unwrap());
        }
    }
    if let Some(c) = centre {
        let l = basis::default_ligands(s, c);
        let sg = basis::sigma(s, c, &l).unwrap();
        check_laws(&sg, &salc::salcs(&sg).unwrap());
        let pi = basis::pi(s, c, &l).unwrap();
        check_laws(&pi, &salc::salcs(&pi).unwrap());
    }
}

#[test]
fn c3v_ammonia_like() {
    let s = with_bonds(
        orbit_molecule("C3v", &[("N", [0.0, 0.0, 0.0]), ("H", [0.94, 0.0, -0.38])]),
        1.2,
    );
    all_bases(&s, None);
}

#[test]
fn td_methane_like() {
    let s = with_bonds(
        orbit_molecule("Td", &[("C", [0.0; 3]), ("H", [0.63, 0.63, 0.63])]),
        1.2,
    );
    all_bases(&s, Some(0));
}

#[test]
fn oh_octahedral_complex() {
    let s = with_bonds(
        orbit_molecule("Oh", &[("Co", [0.0; 3]), ("Cl", [0.0, 0.0, 2.3])]),
        2.5,
    );
    all_bases(&s, Some(0));
}

#[test]
fn d4h_square_planar_and_d3h() {
    let s = with_bonds(
        orbit_molecule("D4h", &[("Pt", [0.0; 3]), ("Cl", [2.3, 0.0, 0.0])]),
        2.5,
    );
    all_bases(&s, Some(0));
    let s = with_bonds(
        orbit_molecule(
            "D3h",
            &[
                ("P", [0.0; 3]),
                ("F", [1.55, 0.0, 0.0]),
                ("F", [0.0, 0.0, 1.6]),
            ],
        ),
        1.7,
    );
    all_bases(&s, Some(0));
}

#[test]
fn complex_pairs_c3h_and_t() {
    // ¹E/²E pairs taken together as real two-dimensional irreps.
    let s = with_bonds(
        orbit_molecule(
            "C3h",
            &[
                ("B", [0.0; 3]),
                ("O", [1.36, 0.0, 0.0]),
                ("H", [1.7, 0.9, 0.0]),
            ],
        ),
        1.45,
    );
    all_bases(&s, Some(0));
    let s = orbit_molecule("T", &[("X", [0.0; 3]), ("Y", [1.0, 0.3, 0.2])]);
    let l: Vec<usize> = (1..s.len()).collect();
    let sg = basis::sigma(&s, 0, &l).unwrap();
    check_laws(&sg, &salc::salcs(&sg).unwrap());
    let c = basis::cartesian(&s).unwrap();
    check_laws(&c, &salc::salcs(&c).unwrap());
}

#[test]
fn icosahedral_sigma_and_dodecahedral_sets() {
    // 12 ligands on the C5 axes and 20 on the C3 axes: G and H irreps, some without functions.
    let phi = (1.0 + 5f64.sqrt()) / 2.0;
    let s = orbit_molecule(
        "Ih",
        &[
            ("B", [0.0; 3]),
            ("H", [0.0, 1.0, phi]),
            ("C", [1.0, 1.0, 1.0]),
        ],
    );
    let l: Vec<usize> = (1..13).collect();
    let sg = basis::sigma(&s, 0, &l).unwrap();
    check_laws(&sg, &salc::salcs(&sg).unwrap());
    let l: Vec<usize> = (13..33).collect();
    let sg = basis::sigma(&s, 0, &l).unwrap();
    check_laws(&sg, &salc::salcs(&sg).unwrap());
}

#[test]
fn symmetry_coordinates_separate_translations_and_rotations() {
    use salc::Role;
    let s = with_bonds(
        orbit_molecule("C3v", &[("N", [0.0, 0.0, 0.1]), ("H", [0.94, 0.0, -0.28])]),
        1.2,
    );
    let set = salc::symmetry_coordinates(&s).unwrap();
    check_laws(&basis::cartesian(&s).unwrap(), &set);
    let count = |r: Role| set.salcs.iter().filter(|c| c.role == r).count();
    assert_eq!(
        (
            count(Role::Translation),
            count(Role::Rotation),
            count(Role::Plain)
        ),
        (3, 3, 6)
    );
}
