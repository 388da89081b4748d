//! Γvib from unmoved-atom counts for molecules with published symmetry species.
//! Counts are per class in the table's customary class order. Sources are named per molecule;
//! the species are quoted from memory.

use salcdesk::group;
use salcdesk::rep::{format_sum, parse_gamma, vibrations_from_unmoved};

fn check(group_name: &str, unmoved: &[i64], want: &str, n_modes: usize) {
    let g = group::load(group_name).unwrap();
    let v = vibrations_from_unmoved(&g, unmoved).unwrap();
    let want_m = parse_gamma(&g, want).unwrap();
    assert_eq!(
        v.vibrations,
        want_m,
        "{group_name}: got {}, want {want}",
        format_sum(&g, &v.vibrations, false)
    );
    assert_eq!(v.n_modes, n_modes, "{group_name} mode count");
}

#[test]
fn bent_ab2_water() {
    // Source: Cotton, 3rd ed., §10.2 (H2O in the xz plane): Γvib = 2A1 + B1.
    check("C2v", &[3, 1, 3, 1], "2A1 + B1", 3);
}

#[test]
fn pyramidal_ab3() {
    // Source: Nakamoto, Part A, pyramidal XY3 (NH3): 2A1 + 2E.
    check("C3v", &[4, 1, 2], "2A1 + 2E", 6);
}

#[test]
fn planar_ab3() {
    // Source: Nakamoto, Part A, planar XY3 (BF3): A1' + A2'' + 2E'.
    check("D3h", &[4, 1, 2, 4, 1, 2], "A1' + A2'' + 2E'", 6);
}

#[test]
fn tetrahedral_ab4() {
    // Source: Nakamoto, Part A, tetrahedral XY4 (CH4): A1 + E + 2T2.
    check("Td", &[5, 2, 1, 1, 3], "A1 + E + 2T2", 9);
}

#[test]
fn square_planar_ab4() {
    // Source: Nakamoto, Part A, square-planar XY4 (XeF4, PtCl4 2−): A1g + B1g + B2g + A2u + B2u + 2Eu.
    check(
        "D4h",
        &[5, 1, 1, 3, 1, 1, 1, 5, 3, 1],
        "A1g + B1g + B2g + A2u + B2u + 2Eu",
        9,
    );
}

#[test]
fn octahedral_ab6() {
    // Source: Nakamoto, Part A, octahedral XY6 (SF6): A1g + Eg + 2T1u + T2g + T2u.
    // Unmoved atoms: the 6C2 axes bisect edges and pass through S only.
    check(
        "Oh",
        &[7, 1, 1, 3, 3, 1, 1, 1, 5, 3],
        "A1g + Eg + 2T1u + T2g + T2u",
        15,
    );
}

#[test]
fn trigonal_bipyramidal_ab5() {
    // Source: Nakamoto, Part A, trigonal-bipyramidal XY5 (PF5): 2A1' + 2A2'' + 3E' + E''.
    check("D3h", &[6, 3, 2, 4, 1, 4], "2A1' + 2A2'' + 3E' + E''", 12);
}

#[test]
fn pentagonal_bipyramidal_ab7() {
    // Source: Nakamoto, Part A, XY7 (IF7): 2A1' + 2A2'' + 3E1' + E1'' + 2E2' + E2''.
    check(
        "D5h",
        &[8, 3, 3, 2, 6, 1, 1, 4],
        "2A1' + 2A2'' + 3E1' + E1'' + 2E2' + E2''",
        18,
    );
}

#[test]
fn linear_ab2_through_d2h() {
    // Source: Herzberg, Infrared and Raman Spectra (1945), CO2: Σg+ + Σu+ + Πu.
    // Classes: E, 2C∞φ, ∞σv, i, 2S∞φ, ∞C2 — all three atoms on the axis.
    check("Dinfh", &[3, 3, 3, 1, 1, 1], "Sigma+g + Sigma+u + Piu", 4);
}

#[test]
fn linear_abc_through_c2v() {
    // Source: Herzberg (1945), HCN / N2O: 2Σ+ + Π.
    check("Cinfv", &[3, 3, 3], "2Sigma+ + Pi", 4);
}

#[test]
fn dichloromethane() {
    // Source: Herzberg (1945), CH2Cl2-type XY2Z2 (C2v): 4A1 + A2 + 2B1 + 2B2.
    check("C2v", &[5, 1, 3, 3], "4A1 + A2 + 2B1 + 2B2", 9);
}

#[test]
fn chloroform() {
    // Source: Herzberg (1945), CHCl3 (C3v): 3A1 + 3E.
    check("C3v", &[5, 2, 3], "3A1 + 3E", 9);
}

#[test]
fn staggered_ethane() {
    // Source: Herzberg (1945), C2H6 (D3d): 3A1g + A1u + 2A2u + 3Eg + 3Eu.
    check(
        "D3d",
        &[8, 2, 0, 0, 0, 4],
        "3A1g + A1u + 2A2u + 3Eg + 3Eu",
        18,
    );
}

#[test]
fn allene() {
    // Source: Herzberg (1945), allene (D2d): 3A1 + B1 + 3B2 + 4E.
    check("D2d", &[7, 1, 3, 1, 5], "3A1 + B1 + 3B2 + 4E", 15);
}

#[test]
fn white_phosphorus() {
    // Source: Nakamoto, Part A, tetrahedral X4 (P4): A1 + E + T2.
    check("Td", &[4, 1, 0, 0, 2], "A1 + E + T2", 6);
}

#[test]
fn cyclopropane() {
    // Source: Herzberg (1945), C3H6 (D3h): 3A1' + A2' + 4E' + A1'' + 2A2'' + 3E''.
    check(
        "D3h",
        &[9, 0, 1, 3, 0, 3],
        "3A1' + A2' + 4E' + A1'' + 2A2'' + 3E''",
        21,
    );
}

#[test]
fn seesaw_sf4() {
    // Source: Nakamoto, Part A, SF4 (C2v): 4A1 + A2 + 2B1 + 2B2.
    check("C2v", &[5, 1, 3, 3], "4A1 + A2 + 2B1 + 2B2", 9);
}

#[test]
fn benzene() {
    // Source: Wilson, Decius & Cross (1955), benzene (D6h, C2' through atoms):
    // 2A1g + A2g + 2B2g + E1g + 4E2g + A2u + 2B1u + 2B2u + 3E1u + 2E2u.
    // Classes: E 2C6 2C3 C2 3C2' 3C2'' i 2S3 2S6 σh 3σd 3σv; σv contains the C2' axes.
    check(
        "D6h",
        &[12, 0, 0, 0, 4, 0, 0, 0, 0, 12, 0, 4],
        "2A1g + A2g + 2B2g + E1g + 4E2g + A2u + 2B1u + 2B2u + 3E1u + 2E2u",
        30,
    );
}
