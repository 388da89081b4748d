//! Γvib of standard molecules from their geometry, and central-atom orbital characters.

#[path = "salc_support.rs"]
mod support;

use salcdesk::basis;
use salcdesk::rep::format_sum;
use support::*;

fn gamma_vib(s: &basis::Structure) -> String {
    let v = basis::vibrations(s).unwrap();
    format_sum(&s.group, &v.multiplicities, false)
}

#[test]
fn ammonia_methane_sf6() {
    // Source: Herzberg, Infrared and Raman Spectra of Polyatomic Molecules (1945); Nakamoto,
    // Infrared and Raman Spectra of Inorganic and Coordination Compounds, Part A — from memory.
    let nh3 = orbit_molecule("C3v", &[("N", [0.0, 0.0, 0.1]), ("H", [0.94, 0.0, -0.28])]);
    assert_eq!(gamma_vib(&nh3), "2A1 + 2E");
    let ch4 = orbit_molecule("Td", &[("C", [0.0; 3]), ("H", [0.63, 0.63, 0.63])]);
    assert_eq!(gamma_vib(&ch4), "A1 + E + 2T2");
    let sf6 = orbit_molecule("Oh", &[("S", [0.0; 3]), ("F", [0.0, 0.0, 1.56])]);
    assert_eq!(gamma_vib(&sf6), "A1g + Eg + T2g + 2T1u + T2u");
}

#[test]
fn water_and_benzene_counts() {
    // Source: Herzberg (1945), from memory: H2O has 2A1 + one B vibration; benzene has 30
    // vibrations, 2A1g, and ten doubly degenerate pairs.
    let h2o = orbit_molecule("C2v", &[("O", [0.0, 0.0, 0.12]), ("H", [0.0, 0.76, -0.47])]);
    let v = basis::vibrations(&h2o).unwrap();
    assert_eq!(v.count, 3);
    let a1 = h2o.group.table.irrep_index("A1").unwrap();
    assert_eq!(v.multiplicities[a1], 2);
    let c6h6 = orbit_molecule("D6h", &[("C", [1.39, 0.0, 0.0]), ("H", [2.48, 0.0, 0.0])]);
    let v = basis::vibrations(&c6h6).unwrap();
    assert_eq!(v.count, 30);
    let g = &c6h6.group;
    assert_eq!(v.multiplicities[g.table.irrep_index("A1g").unwrap()], 2);
    let e_pairs: u64 = g
        .table
        .irreps
        .iter()
        .zip(&v.multiplicities)
        .filter(|(ir, _)| ir.dim() == 2)
        .map(|(_, m)| m)
        .sum();
    assert_eq!(e_pairs, 10);
}

#[test]
fn c60_gamma_vib() {
    // from memory: the 46 distinct C60 modes, 2Ag + 3T1g + 4T2g + 6Gg + 8Hg + Au + 4T1u + 5T2u
    // + 6Gu + 7Hu (10 Raman-active, 4 IR-active), as widely cited since the 1990s.
    let phi = (1.0 + 5f64.sqrt()) / 2.0;
    // a truncated icosahedron: the orbit of (0, 1, 3φ) under Ih
    let s = orbit_molecule("Ih", &[("C", [0.0, 1.0, 3.0 * phi])]);
    assert_eq!(s.len(), 60);
    assert_eq!(
        gamma_vib(&s),
        "2Ag + 3T1g + 4T2g + 6Gg + 8Hg + Au + 4T1u + 5T2u + 6Gu + 7Hu"
    );
}

#[test]
fn carbon_dioxide_through_d2h() {
    // Source: Herzberg (1945): CO2 Γvib = Σg+ + Σu+ + Πu (3N − 5 = 4).
    let s = explicit(
        "D2h",
        &[
            ("C", [0.0; 3]),
            ("O", [0.0, 0.0, 1.16]),
            ("O", [0.0, 0.0, -1.16]),
        ],
        &[],
    );
    let dinfh = salcdesk::group::load("Dinfh").unwrap();
    let v = basis::vibrations_linear(&s, &dinfh).unwrap();
    assert_eq!(v.count, 4);
    assert_eq!(
        format_sum(&dinfh, &v.multiplicities, false),
        "Sigma+g + Sigma+u + Piu"
    );
}

#[test]
fn orbital_characters_from_the_angle_formula() {
    // Source: Cotton, 3rd ed., §9.4: in Oh, d splits into Eg + T2g and f into A2u + T1u + T2u;
    // in Td, p → T2 and d → E + T2 (from memory).
    let oh = salcdesk::group::load("Oh").unwrap();
    let sh = basis::shells(&oh, 3);
    assert_eq!(format_sum(&oh, &sh[2].multiplicities, false), "Eg + T2g");
    assert_eq!(
        format_sum(&oh, &sh[3].multiplicities, false),
        "A2u + T1u + T2u"
    );
    let td = salcdesk::group::load("Td").unwrap();
    let sh = basis::shells(&td, 2);
    assert_eq!(format_sum(&td, &sh[1].multiplicities, false), "T2");
    assert_eq!(format_sum(&td, &sh[2].multiplicities, false), "E + T2");
    // χ_l(E) = 2l + 1 in every group
    for (l, s) in sh.iter().enumerate() {
        assert_eq!(s.character.0[0].to_i64(), Some(2 * l as i64 + 1));
    }
}

#[test]
fn tetrahedral_bends_carry_one_redundant_a1() {
    // Source: Nakamoto, Part A, §1.10 (from memory): the six angle bends of a tetrahedral XY4
    // span A1 + E + T2, and the A1 combination is redundant.
    let s = with_bonds(
        orbit_molecule("Td", &[("C", [0.0; 3]), ("H", [0.63, 0.63, 0.63])]),
        1.2,
    );
    let st = basis::stretches(&s, &s.bonds).unwrap();
    let be = basis::bends(&s, &basis::all_angles(&s)).unwrap();
    let vib = basis::vibrations(&s).unwrap();
    let r = basis::redundancy(&st, &be, &vib).unwrap();
    assert_eq!(format_sum(&s.group, &r.bend, false), "A1 + E + T2");
    assert_eq!(format_sum(&s.group, &r.redundant, false), "A1");
    assert!(r.missing.iter().all(|m| *m == 0));
    assert_eq!(format_sum(&s.group, &r.vib_stretch, false), "A1 + T2");
    assert_eq!(format_sum(&s.group, &r.vib_bend, false), "E + T2");
    let set = salcdesk::salc::internal_coordinates(&s, &st, &be).unwrap();
    let red: Vec<_> = set
        .salcs
        .iter()
        .filter(|c| c.role == salcdesk::salc::Role::Redundant)
        .collect();
    assert_eq!(red.len(), 1);
    assert_eq!(red[0].label, "A1");
}
