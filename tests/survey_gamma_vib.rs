//! Γvib from real geometries (detect → orient → permutations → reduction) against the
//! published symmetry species. Geometries and their sources: `geom_molecules.rs`.

#[path = "geom_molecules.rs"]
mod molecules;

use salcdesk::rep::{format_sum, parse_gamma};
use salcdesk::survey::{survey, SurveyOptions};

fn expect(name: &str, want: &str, n_modes: usize) {
    let case = molecules::all()
        .into_iter()
        .find(|c| c.name == name)
        .unwrap_or_else(|| panic!("no reference molecule {name}"));
    for (k, mol) in [case.mol.clone(), molecules::scramble(&case.mol, 7, 0.002)]
        .iter()
        .enumerate()
    {
        let s = survey(mol, &SurveyOptions::default()).unwrap_or_else(|e| panic!("{name}: {e}"));
        let g = &s.group;
        let want_m = parse_gamma(g, want).unwrap();
        assert_eq!(
            s.vibrations.vibrations,
            want_m,
            "{name} (copy {k}): got {}, want {want}",
            format_sum(g, &s.vibrations.vibrations, false)
        );
        assert_eq!(s.vibrations.n_modes, n_modes, "{name}");
        assert_eq!(
            n_modes,
            3 * mol.atoms.len() - if g.is_linear() { 5 } else { 6 }
        );
    }
}

// Sources: Herzberg, Infrared and Raman Spectra (1945) [H]; Nakamoto, Infrared and Raman
// Spectra of Inorganic and Coordination Compounds, Part A [N]; Cotton, 3rd ed. [C]. Species
// quoted from memory.

#[test]
fn triatomics_and_tetratomics() {
    expect("H2O", "2A1 + B2", 3); // [H], molecule in the yz plane (Mulliken 1955)
    expect("NH3", "2A1 + 2E", 6); // [N]
    expect("BF3", "A1' + A2'' + 2E'", 6); // [N]
    expect("P4", "A1 + E + T2", 6); // [N]
    expect("H2O2", "4A + 2B", 6); // [H]
    expect("HOCl", "3A'", 3); // [H]
    expect("trans-N2F2", "3Ag + Au + 2Bu", 6); // [H], planar trans X2Y2
}

#[test]
fn five_to_seven_atoms() {
    expect("CH4", "A1 + E + 2T2", 9); // [N]
    expect("CH3Cl", "3A1 + 3E", 9); // [H]
    expect("CH2Cl2", "4A1 + A2 + 2B1 + 2B2", 9); // [H]
    expect("CHFClBr", "9A", 9); // C1: every mode is A
    expect("XeF4", "A1g + B1g + B2g + A2u + B2u + 2Eu", 9); // [N]
    expect("PtCl4 2-", "A1g + B1g + B2g + A2u + B2u + 2Eu", 9); // [N]
    expect("PF5", "2A1' + 2A2'' + 3E' + E''", 12); // [N]
    expect("SF6", "A1g + Eg + 2T1u + T2g + T2u", 15); // [N]
    expect("SF5Cl", "4A1 + 2B1 + B2 + 4E", 15); // [N], XY5Z
    expect("allene", "3A1 + B1 + 3B2 + 4E", 15); // [H]
}

#[test]
fn larger_molecules() {
    expect("IF7", "2A1' + 2A2'' + 3E1' + E1'' + 2E2' + E2''", 18); // [N]
    expect(
        "C60",
        "2Ag + 3T1g + 4T2g + 6Gg + 8Hg + Au + 4T1u + 5T2u + 6Gu + 7Hu",
        174,
    ); // Weeks & Harter, Chem. Phys. Lett. 144, 366 (1988), from memory
}

#[test]
fn linear_molecules_through_their_finite_subgroups() {
    expect("CO2", "Sigma+g + Sigma+u + Piu", 4); // [H]
    expect("C2H2", "2Sigma+g + Sigma+u + Pig + Piu", 7); // [H]
    expect("HCN", "2Sigma+ + Pi", 4); // [H]
}

#[test]
fn benzene_with_c2_prime_through_atoms() {
    // Wilson, Decius & Cross (1955), benzene in D6h with C2' through the atoms.
    expect(
        "benzene",
        "2A1g + A2g + 2B2g + E1g + 4E2g + A2u + 2B1u + 2B2u + 3E1u + 2E2u",
        30,
    );
}

#[test]
fn internal_coordinates_of_methane() {
    // Six H–C–H bends of a tetrahedral centre carry one redundant A1 (Wilson, Decius & Cross,
    // §6-5); stretches A1 + T2 (Cotton, 3rd ed., §10.3).
    let case = molecules::all()
        .into_iter()
        .find(|c| c.name == "CH4")
        .unwrap();
    let s = survey(&case.mol, &SurveyOptions::default()).unwrap();
    let g = &s.group;
    assert_eq!(format_sum(g, &s.stretches, false), "A1 + T2");
    assert_eq!(format_sum(g, &s.bends, false), "A1 + E + T2");
    assert_eq!(format_sum(g, &s.redundant, false), "A1");
    assert_eq!(format_sum(g, &s.uncovered, false), "0");
}
