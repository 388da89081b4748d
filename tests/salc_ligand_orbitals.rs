//! σ ligand group orbitals of common coordination geometries, checked against the textbook
//! combinations, and the central-atom orbitals that match them.

#[path = "salc_support.rs"]
mod support;

use salcdesk::basis;
use salcdesk::exact::Notation;
use salcdesk::salc::{self, SalcSet};
use support::*;

/// SALCs of one irrep as printed in ASCII, partner order.
fn texts(set: &SalcSet, label: &str) -> Vec<String> {
    set.salcs
        .iter()
        .filter(|s| s.label == label)
        .map(|s| salc::salc_text(s, &set.members, Notation::Ascii))
        .collect()
}

/// The same tuple with the overall sign of the copy reversed (a SALC's overall sign is free).
fn flipped(set: &SalcSet, label: &str) -> Vec<String> {
    set.salcs
        .iter()
        .filter(|s| s.label == label)
        .map(|s| {
            let mut t = s.clone();
            t.coefficients = t.coefficients.iter().map(|c| -c.clone()).collect();
            salc::salc_text(&t, &set.members, Notation::Ascii)
        })
        .collect()
}

/// The irrep's SALCs equal `expected`, up to one overall sign per copy.
fn assert_tuple(set: &SalcSet, label: &str, expected: &[&str]) {
    let t = texts(set, label);
    assert!(
        t == expected || flipped(set, label) == expected,
        "{label}: {t:?} vs {expected:?}"
    );
}

fn sigma_set(group: &str, atoms: &[(&str, [f64; 3])]) -> SalcSet {
    let s = explicit(group, atoms, &[]);
    let l: Vec<usize> = (1..s.len()).collect();
    salc::salcs(&basis::sigma(&s, 0, &l).unwrap()).unwrap()
}

#[test]
fn octahedral_sigma() {
    // Source: Cotton, Chemical Applications of Group Theory, 3rd ed., ch. 8 (octahedral σ LGOs;
    // ligands 1–4 on +x, +y, −x, −y, 5 and 6 on ±z), values from memory.
    let set = sigma_set(
        "Oh",
        &[
            ("Co", [0.0; 3]),
            ("Cl", [2.3, 0.0, 0.0]),
            ("Cl", [0.0, 2.3, 0.0]),
            ("Cl", [-2.3, 0.0, 0.0]),
            ("Cl", [0.0, -2.3, 0.0]),
            ("Cl", [0.0, 0.0, 2.3]),
            ("Cl", [0.0, 0.0, -2.3]),
        ],
    );
    assert_eq!(
        texts(&set, "A1g"),
        ["1/sqrt(6) (sigma1 + sigma2 + sigma3 + sigma4 + sigma5 + sigma6)"]
    );
    assert_tuple(
        &set,
        "Eg",
        &[
            "1/sqrt(12) (-sigma1 - sigma2 - sigma3 - sigma4 + 2sigma5 + 2sigma6)",
            "1/2 (sigma1 - sigma2 + sigma3 - sigma4)",
        ],
    );
    assert_eq!(
        texts(&set, "T1u"),
        [
            "1/sqrt(2) (sigma1 - sigma3)",
            "1/sqrt(2) (sigma2 - sigma4)",
            "1/sqrt(2) (sigma5 - sigma6)"
        ]
    );
    // Source: Cotton, 3rd ed., ch. 8: metal s (a1g), dz², dx²−y² (eg), p (t1u) match the σ LGOs.
    let m = salc::central_matches(&set);
    let eg = set.irreps.iter().position(|i| i.label == "Eg").unwrap();
    let eg = m.iter().find(|x| x.irrep == eg).unwrap();
    assert_eq!(eg.central, ["dz2", "dx2-y2"]);
}

#[test]
fn tetrahedral_sigma() {
    // Source: Cotton, 3rd ed., ch. 8 (tetrahedral AB4 σ bonding): Γσ = A1 + T2, from memory.
    let a = 1.0;
    let set = sigma_set(
        "Td",
        &[
            ("C", [0.0; 3]),
            ("H", [a, a, a]),
            ("H", [a, -a, -a]),
            ("H", [-a, a, -a]),
            ("H", [-a, -a, a]),
        ],
    );
    assert_eq!(
        texts(&set, "A1"),
        ["1/2 (sigma1 + sigma2 + sigma3 + sigma4)"]
    );
    // T2 partners like x, y, z: the sign of each ligand's coordinate.
    assert_eq!(
        texts(&set, "T2"),
        [
            "1/2 (sigma1 + sigma2 - sigma3 - sigma4)",
            "1/2 (sigma1 - sigma2 + sigma3 - sigma4)",
            "1/2 (sigma1 - sigma2 - sigma3 + sigma4)"
        ]
    );
}

#[test]
fn square_planar_sigma() {
    // Source: Cotton, 3rd ed., ch. 8 (square-planar σ: A1g + B1g + Eu), values from memory.
    let set = sigma_set(
        "D4h",
        &[
            ("Pt", [0.0; 3]),
            ("Cl", [2.3, 0.0, 0.0]),
            ("Cl", [0.0, 2.3, 0.0]),
            ("Cl", [-2.3, 0.0, 0.0]),
            ("Cl", [0.0, -2.3, 0.0]),
        ],
    );
    assert_eq!(
        texts(&set, "A1g"),
        ["1/2 (sigma1 + sigma2 + sigma3 + sigma4)"]
    );
    assert_eq!(
        texts(&set, "B1g"),
        ["1/2 (sigma1 - sigma2 + sigma3 - sigma4)"]
    );
    assert_eq!(
        texts(&set, "Eu"),
        ["1/sqrt(2) (sigma1 - sigma3)", "1/sqrt(2) (sigma2 - sigma4)"]
    );
}

#[test]
fn trigonal_planar_and_bipyramidal_sigma() {
    // Source: Cotton, 3rd ed., ch. 8 (BF3-type σ: A1' + E'; PF5-type: 2A1' + A2'' + E'), from memory.
    let c = (2.0 * std::f64::consts::PI / 3.0).cos();
    let s = (2.0 * std::f64::consts::PI / 3.0).sin();
    let eq = [
        ("F", [1.3, 0.0, 0.0]),
        ("F", [1.3 * c, 1.3 * s, 0.0]),
        ("F", [1.3 * c, -1.3 * s, 0.0]),
    ];
    let mut atoms = vec![("B", [0.0; 3])];
    atoms.extend(eq);
    let set = sigma_set("D3h", &atoms);
    assert_eq!(texts(&set, "A1'"), ["1/sqrt(3) (sigma1 + sigma2 + sigma3)"]);
    assert_eq!(
        texts(&set, "E'"),
        [
            "1/sqrt(6) (2sigma1 - sigma2 - sigma3)",
            "1/sqrt(2) (sigma2 - sigma3)"
        ]
    );
    atoms.push(("F", [0.0, 0.0, 1.6]));
    atoms.push(("F", [0.0, 0.0, -1.6]));
    let set = sigma_set("D3h", &atoms);
    let a1 = texts(&set, "A1'");
    assert_eq!(a1.len(), 2);
    assert!(a1.contains(&"1/sqrt(3) (sigma1 + sigma2 + sigma3)".to_string()));
    assert!(a1.contains(&"1/sqrt(2) (sigma4 + sigma5)".to_string()));
    assert_eq!(texts(&set, "A2''"), ["1/sqrt(2) (sigma4 - sigma5)"]);
}

#[test]
fn worked_projection_of_a_stretch() {
    // Source: Cotton, 3rd ed., ch. 8: projecting r1 of NH3 onto E with characters gives
    // 2r1 − r2 − r3, from memory.
    let s = with_bonds(
        orbit_molecule("C3v", &[("N", [0.0; 3]), ("H", [0.94, 0.0, -0.38])]),
        1.2,
    );
    let b = basis::stretches(&s, &s.bonds).unwrap();
    let irreps = salc::real_irreps(&s.group).unwrap();
    let e = irreps.iter().find(|i| i.label == "E").unwrap();
    let w = salc::worked_projection(&b, e, 0);
    assert_eq!(w.lines.len(), 6);
    let sum: Vec<String> = w.sum.iter().map(|c| c.text(Notation::Ascii)).collect();
    assert_eq!(sum, ["2", "-1", "-1"]);
}
