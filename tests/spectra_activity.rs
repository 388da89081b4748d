//! IR/Raman activity and band counts for Γvib of textbook molecules.

use salcdesk::group::load;
use salcdesk::spectra::{modes_from_text, modes_report, parse_gamma, SpectraError};

fn counts(group: &str, gamma: &str) -> (u64, u64, u64, u64, u64, bool) {
    let r = modes_from_text(group, gamma).unwrap();
    (
        r.n_modes,
        r.ir_bands,
        r.raman_bands,
        r.coincident_bands,
        r.silent_fundamentals,
        r.mutual_exclusion.is_some(),
    )
}

#[test]
fn tetrahedral_ab4() {
    // Source: Nakamoto, Infrared and Raman Spectra of Inorganic and Coordination Compounds,
    // Part A, tetrahedral XY4: Γ = A1 + E + 2T2, IR 2 (T2), Raman 4.
    assert_eq!(counts("Td", "A1 + E + 2T2"), (9, 2, 4, 2, 0, false));
}

#[test]
fn methane() {
    // from memory: Herzberg, Infrared and Raman Spectra (1945), CH4: ν1(a1), ν2(e), ν3(f2),
    // ν4(f2); ν3 and ν4 in the infrared, all four in the Raman effect.
    let r = modes_from_text("Td", "A1 + E + 2T2").unwrap();
    let t2 = r.modes.iter().find(|m| m.irrep == "T2").unwrap();
    assert!(t2.ir && t2.raman && !t2.polarized);
    assert_eq!(t2.ir_components, vec!["x", "y", "z"]);
    let a1 = r.modes.iter().find(|m| m.irrep == "A1").unwrap();
    assert!(!a1.ir && a1.raman && a1.polarized);
    let e = r.modes.iter().find(|m| m.irrep == "E").unwrap();
    assert!(!e.ir && e.raman && !e.polarized);
}

#[test]
fn octahedral_ab6() {
    // Source: Nakamoto, Part A, octahedral XY6: Γ = A1g + Eg + 2T1u + T2g + T2u; IR 2 (T1u),
    // Raman 3 (A1g, Eg, T2g), T2u inactive in both; mutual exclusion.
    assert_eq!(
        counts("Oh", "A1g + Eg + 2T1u + T2g + T2u"),
        (15, 2, 3, 0, 1, true)
    );
}

#[test]
fn planar_ab3() {
    // Source: Nakamoto, Part A, planar XY3 (D3h): Γ = A1' + A2'' + 2E'; IR: A2'' + 2E' (3),
    // Raman: A1' + 2E' (3).
    assert_eq!(counts("D3h", "A1' + A2'' + 2E'"), (6, 3, 3, 2, 0, false));
}

#[test]
fn square_planar_ab4() {
    // Source: Nakamoto, Part A, square-planar XY4 (D4h): Γ = A1g + B1g + B2g + A2u + B2u + 2Eu;
    // IR 3 (A2u + 2Eu), Raman 3 (A1g, B1g, B2g), B2u inactive; mutual exclusion.
    assert_eq!(
        counts("D4h", "A1g + B1g + B2g + A2u + B2u + 2Eu"),
        (9, 3, 3, 0, 1, true)
    );
}

#[test]
fn trigonal_bipyramidal_ab5() {
    // Source: Nakamoto, Part A, trigonal-bipyramidal XY5 (D3h): Γ = 2A1' + 2A2'' + 3E' + E'';
    // IR 5 (2A2'' + 3E'), Raman 6 (2A1' + 3E' + E'').
    assert_eq!(
        counts("D3h", "2A1' + 2A2'' + 3E' + E''"),
        (12, 5, 6, 3, 0, false)
    );
}

#[test]
fn benzene() {
    // from memory: Herzberg, Infrared and Raman Spectra (1945), benzene (D6h): 30 modes, 20
    // fundamentals; 4 IR active (a2u + 3e1u), 7 Raman active (2a1g + e1g + 4e2g), the rest
    // inactive; mutual exclusion. (The b1u/b2u names depend on the axis convention; the counts
    // do not.)
    assert_eq!(
        counts(
            "D6h",
            "2A1g + A2g + 2B2g + E1g + 4E2g + A2u + 2B1u + 2B2u + 3E1u + 2E2u"
        ),
        (30, 4, 7, 0, 9, true)
    );
}

#[test]
fn ethylene() {
    // from memory: Herzberg (1945) / Shimanouchi's tables, ethylene (D2h, z along C=C, x ⟂
    // plane): 3ag + au + 2b1g + b1u + b2g + 2b2u + 2b3u; IR 5 (the b_u), Raman 6 (ag, b_g),
    // ν4 (au) inactive in both; mutual exclusion.
    assert_eq!(
        counts("D2h", "3Ag + Au + 2B1g + B1u + B2g + 2B2u + 2B3u"),
        (12, 5, 6, 0, 1, true)
    );
}

#[test]
fn carbon_dioxide_linear() {
    // from memory: Herzberg (1945), CO2 (D∞h): ν1 σg+ Raman only (polarized), ν2 πu and ν3 σu+
    // infrared only; mutual exclusion.
    let r = modes_from_text("Dinfh", "Sigma+g + Sigma+u + Piu").unwrap();
    assert_eq!(r.n_modes, 4);
    assert_eq!((r.ir_bands, r.raman_bands, r.coincident_bands), (2, 1, 0));
    assert!(r.mutual_exclusion.is_some());
    let s = r.modes.iter().find(|m| m.irrep == "Sigma+g").unwrap();
    assert!(s.polarized && !s.ir);
    let p = r.modes.iter().find(|m| m.irrep == "Piu").unwrap();
    assert_eq!(p.ir_components, vec!["x", "y"]);
}

#[test]
fn nitrous_oxide_linear_unsymmetric() {
    // from memory: Herzberg (1945), N2O (NNO, C∞v): ν1 and ν3 (σ+) and ν2 (π) all active in
    // both the infrared and the Raman effect.
    let r = modes_from_text("Cinfv", "2Sigma+ + Pi").unwrap();
    assert_eq!(r.n_modes, 4);
    assert_eq!((r.ir_bands, r.raman_bands, r.coincident_bands), (3, 3, 3));
    assert!(r.mutual_exclusion.is_none());
}

#[test]
fn complex_pair_counts_once() {
    // from memory: Cotton, Chemical Applications of Group Theory, 3rd ed., C3 table: the
    // pair {1E, 2E} is one real E transforming as (x, y). Here E + E (rows) = one E set.
    let g = load("C3").unwrap();
    let rows = parse_gamma(&g, "A + E").unwrap();
    let r = modes_report(&g, &rows).unwrap();
    assert_eq!(r.n_modes, 3);
    assert_eq!(r.ir_bands, 2);
    let e = r.modes.iter().find(|m| m.irrep == "E").unwrap();
    assert_eq!((e.multiplicity, e.dimension), (1, 2));
    assert_eq!(e.ir_components, vec!["x", "y"]);
}

#[test]
fn unequal_complex_pair_is_an_error() {
    let g = load("C3").unwrap();
    let mut rows = vec![0; g.table.irreps.len()];
    let first = g
        .table
        .irreps
        .iter()
        .position(|i| i.pair.is_some())
        .unwrap();
    rows[first] = 1;
    assert!(matches!(
        modes_report(&g, &rows),
        Err(SpectraError::UnpairedComplex { .. })
    ));
}

#[test]
fn unknown_label_reports_its_column() {
    let err = modes_from_text("Td", "A1 + Q7").unwrap_err();
    match err {
        SpectraError::UnknownIrrep { label, column, .. } => {
            assert_eq!(label, "Q7");
            assert_eq!(column, 6);
        }
        e => panic!("unexpected {e}"),
    }
    assert!(matches!(
        modes_from_text("Td", "A1 + + E"),
        Err(SpectraError::BadTerm { column: 6, .. })
    ));
}

#[test]
fn json_shape() {
    // Shape only; the numbers are Nakamoto's tetrahedral XY4 (Part A).
    let r = modes_from_text("Td", "A1 + E + 2T2").unwrap();
    let v: serde_json::Value = serde_json::to_value(&r).unwrap();
    assert_eq!(v["point_group"], "Td");
    assert_eq!(v["n_modes"], 9);
    assert_eq!(v["ir_bands"], 2);
    assert_eq!(v["raman_bands"], 4);
    assert_eq!(v["coincident_bands"], 2);
    assert_eq!(v["silent_fundamentals"], 0);
    let t2 = v["modes"]
        .as_array()
        .unwrap()
        .iter()
        .find(|m| m["irrep"] == "T2")
        .unwrap();
    assert_eq!(t2["multiplicity"], 2);
    assert_eq!(t2["dimension"], 3);
    assert_eq!(t2["ir"], true);
    assert_eq!(t2["raman"], true);
    assert_eq!(t2["polarized"], false);
}

#[test]
fn unicode_and_loose_linear_labels() {
    // from memory: Herzberg (1945), CO2: Σg+ + Σu+ + Πu, written three ways.
    for text in [
        "Σg⁺ + Σu⁺ + Πu",
        "Σ+g + Σ+u + Πu",
        "Sigmag+ + Sigmau+ + Piu",
    ] {
        let r = modes_from_text("Dinfh", text).unwrap();
        assert_eq!(r.gamma, "Sigma+g + Sigma+u + Piu", "{text}");
    }
    // D3h labels with Unicode primes and subscripts: Nakamoto, Part A, planar XY3.
    let r = modes_from_text("D3h", "A₁′ + A₂″ + 2E′").unwrap();
    assert_eq!(r.gamma, "A1' + 2E' + A2''");
}
