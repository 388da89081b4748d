//! Formulas and bond labels as chemists write them.
//!
//! Source: IUPAC, *Nomenclature of Inorganic Chemistry — IUPAC Recommendations 2005* (the Red
//! Book): IR-4.4.2.1 (the electropositive constituent first, by the element sequence of
//! Table VI: groups walked from the bottom up, noble gases first, H between groups 15 and 16,
//! F last) and IR-4.4.3/IR-9.2 (coordination entities in square brackets, central atom first,
//! ligands alphabetically); carbon compounds in Hill order (C, H, then alphabetical), as CAS
//! writes them. The expected formulas are the ones printed in textbooks (Greenwood &
//! Earnshaw; Cotton & Wilkinson), from memory.

use salcdesk::geom::formula::{bond_label, formula, subscripts, table_vi_rank, TABLE_VI};
use salcdesk::geom::{self, Molecule};

fn f(atoms: &[&str]) -> String {
    formula(atoms.iter().copied())
}

fn many(el: &str, n: usize) -> Vec<&str> {
    vec![el; n]
}

#[test]
fn table_vi_holds_every_element_once_from_the_noble_gases_to_fluorine() {
    assert_eq!(TABLE_VI.len(), 118);
    for z in 1..=118u8 {
        let s = geom::symbol(z).unwrap();
        assert_eq!(
            TABLE_VI.iter().filter(|x| **x == s).count(),
            1,
            "{s} must appear exactly once"
        );
    }
    assert_eq!(TABLE_VI.last(), Some(&"F"));
    // IR-4.4.2.1: H sits between the pnictogens and the chalcogens.
    assert!(table_vi_rank("N") < table_vi_rank("H"));
    assert!(table_vi_rank("H") < table_vi_rank("O"));
    // Each group from the bottom up; the halogens after the chalcogens.
    assert!(table_vi_rank("Bi") < table_vi_rank("P"));
    assert!(table_vi_rank("O") < table_vi_rank("Cl"));
    assert!(table_vi_rank("Xe") < table_vi_rank("Cs"));
}

#[test]
fn binary_inorganic_formulas_put_the_electropositive_element_first() {
    let sf6 = [vec!["S"], many("F", 6)].concat();
    let pcl5 = [many("Cl", 5), vec!["P"]].concat();
    let xef4 = [many("F", 4), vec!["Xe"]].concat();
    let cases: Vec<(Vec<&str>, &str)> = vec![
        (sf6, "SF6"),
        (pcl5, "PCl5"),
        (xef4, "XeF4"),
        (vec!["F", "F", "Kr"], "KrF2"),
        ([many("Cl", 5), vec!["Sb"]].concat(), "SbCl5"),
        ([many("Br", 3), vec!["Ga"]].concat(), "GaBr3"),
        (vec!["H", "H", "O"], "H2O"),
        (vec!["H", "N", "H", "H"], "NH3"),
        (vec!["H", "H", "S"], "H2S"),
        (vec!["Cl", "H"], "HCl"),
        (vec!["F", "O", "F"], "OF2"),
        (vec!["Cl", "O", "Cl"], "OCl2"),
        ([vec!["F", "F", "F"], vec!["Cl"]].concat(), "ClF3"),
        ([many("F", 7), vec!["I"]].concat(), "IF7"),
        ([many("H", 6), vec!["B", "B"]].concat(), "B2H6"),
        ([many("H", 4), vec!["Si"]].concat(), "SiH4"),
        (vec!["Cl", "Cl", "Cl", "O", "P"], "POCl3"),
        (vec!["N", "N"], "N2"),
    ];
    for (atoms, want) in cases {
        assert_eq!(f(&atoms), want, "{atoms:?}");
    }
}

#[test]
fn a_single_d_block_centre_is_a_bracketed_coordination_entity() {
    assert_eq!(f(&["Cl", "Pt", "Cl", "Cl", "Cl"]), "[PtCl4]");
    assert_eq!(f(&["F", "F", "F", "F", "F", "F", "W"]), "[WF6]");
    assert_eq!(f(&["Cl", "Cl", "Cl", "Cl", "Co"]), "[CoCl4]");
}

#[test]
fn carbon_compounds_are_in_hill_order() {
    assert_eq!(f(&["H", "C", "H", "H", "H"]), "CH4");
    assert_eq!(f(&["O", "C", "O"]), "CO2");
    assert_eq!(f(&["Cl", "C", "Cl", "Cl", "Cl"]), "CCl4");
    assert_eq!(f(&["H", "C", "Cl", "Cl", "Cl"]), "CHCl3");
    let fc = [many("C", 10), many("H", 10), vec!["Fe"]].concat();
    assert_eq!(f(&fc), "C10H10Fe", "ferrocene as CAS writes it");
    let feco = [vec!["Fe"], many("C", 5), many("O", 5)].concat();
    assert_eq!(f(&feco), "C5FeO5");
}

#[test]
fn unicode_subscripts_for_display() {
    assert_eq!(subscripts("SF6"), "SF₆");
    assert_eq!(subscripts("[PtCl4]"), "[PtCl₄]");
    assert_eq!(subscripts("C10H10Fe"), "C₁₀H₁₀Fe");
}

#[test]
fn bond_labels_put_the_central_atom_first() {
    // Degree first: the atom with more bonds is the centre.
    assert_eq!(bond_label(("F", 1), ("P", 5), "–"), "P–F");
    assert_eq!(bond_label(("P", 5), ("F", 1), "–"), "P–F");
    assert_eq!(bond_label(("H", 1), ("C", 4), "–"), "C–H");
    assert_eq!(bond_label(("Cl", 1), ("Pt", 4), "-"), "Pt-Cl");
    // A tie: the more electropositive atom by Table VI.
    assert_eq!(bond_label(("F", 1), ("Cl", 1), "–"), "Cl–F");
    assert_eq!(bond_label(("Cl", 1), ("H", 1), "–"), "H–Cl");
    assert_eq!(bond_label(("C", 3), ("C", 3), "–"), "C–C");
}

fn octahedron(centre: &str, ligand: &str, r: f64) -> Molecule {
    let mut text = format!("7\n{centre}{ligand}6\n{centre} 0 0 0\n");
    for v in [
        [r, 0.0, 0.0],
        [-r, 0.0, 0.0],
        [0.0, r, 0.0],
        [0.0, -r, 0.0],
        [0.0, 0.0, r],
        [0.0, 0.0, -r],
    ] {
        text.push_str(&format!("{ligand} {} {} {}\n", v[0], v[1], v[2]));
    }
    geom::read_xyz(text.as_bytes(), &Default::default()).unwrap()
}

#[test]
fn the_survey_names_sf6_and_its_s_f_bonds_the_chemists_way() {
    // S–F 1.561 Å, from memory.
    let mol = octahedron("S", "F", 1.561);
    let s = salcdesk::survey::survey(&mol, &Default::default()).unwrap();
    assert_eq!(salcdesk::report::survey::formula(&mol), "SF6");
    assert_eq!(s.bond_sets.len(), 1);
    assert_eq!(s.bond_sets[0].set.label, "S–F");
    let text =
        salcdesk::report::survey::render("sf6", &mol, &s, salcdesk::report::Format::Text, false);
    assert!(text.contains("SF₆ (7 atoms)"), "{text}");
    assert!(text.contains("S–F ×6"), "{text}");
    let ascii =
        salcdesk::report::survey::render("sf6", &mol, &s, salcdesk::report::Format::Text, true);
    assert!(
        ascii.contains("SF6 (7 atoms)") && ascii.is_ascii(),
        "{ascii}"
    );
}
