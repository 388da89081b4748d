//! Descent in symmetry: correlations computed from the operations, checked against printed
//! correlation tables.

use salcdesk::group::load;
use salcdesk::spectra::{descend, descend_names, parse_gamma, DescentReport, SpectraError};

/// irrep of G → its correlation text, for one embedding.
fn row(r: &DescentReport, e: usize, irrep: &str) -> String {
    r.embeddings[e]
        .correlation
        .iter()
        .find(|c| c.irrep == irrep)
        .unwrap_or_else(|| panic!("{irrep} missing"))
        .becomes
        .text
        .clone()
}

fn check(r: &DescentReport, e: usize, expected: &[(&str, &str)]) {
    for (g, h) in expected {
        assert_eq!(row(r, e, g), *h, "{} → {}: {g}", r.group, r.subgroup);
    }
}

#[test]
fn td_to_c3v() {
    // Source: Wilson, Decius & Cross, Molecular Vibrations, Appendix X (correlation table for
    // Td), from memory: A1→A1, A2→A2, E→E, T1→A2+E, T2→A1+E.
    let r = descend_names("Td", "C3v", None, None).unwrap();
    assert_eq!(r.embeddings.len(), 1);
    assert_eq!(r.embeddings[0].conjugates, 4);
    check(
        &r,
        0,
        &[
            ("A1", "A1"),
            ("A2", "A2"),
            ("E", "E"),
            ("T1", "A2 + E"),
            ("T2", "A1 + E"),
        ],
    );
}

#[test]
fn td_to_c2v() {
    // Source: Wilson, Decius & Cross, Appendix X, from memory: E→A1+A2, T1→A2+B1+B2,
    // T2→A1+B1+B2.
    let r = descend_names("Td", "C2v", None, None).unwrap();
    assert_eq!(r.embeddings.len(), 1);
    check(
        &r,
        0,
        &[
            ("A1", "A1"),
            ("A2", "A2"),
            ("E", "A1 + A2"),
            ("T1", "A2 + B1 + B2"),
            ("T2", "A1 + B1 + B2"),
        ],
    );
}

#[test]
fn oh_to_d4h() {
    // Source: Wilson, Decius & Cross, Appendix X (Oh), from memory: A2g→B1g, Eg→A1g+B1g,
    // T1g→A2g+Eg, T2g→B2g+Eg, T1u→A2u+Eu, T2u→B2u+Eu.
    let r = descend_names("Oh", "D4h", None, None).unwrap();
    assert_eq!(r.embeddings.len(), 1);
    assert_eq!(r.embeddings[0].conjugates, 3);
    check(
        &r,
        0,
        &[
            ("A1g", "A1g"),
            ("A2g", "B1g"),
            ("Eg", "A1g + B1g"),
            ("T1g", "A2g + Eg"),
            ("T2g", "B2g + Eg"),
            ("A1u", "A1u"),
            ("A2u", "B1u"),
            ("Eu", "A1u + B1u"),
            ("T1u", "A2u + Eu"),
            ("T2u", "B2u + Eu"),
        ],
    );
}

#[test]
fn oh_to_d3d() {
    // Source: Wilson, Decius & Cross, Appendix X (Oh), from memory: Eg→Eg, T1g→A2g+Eg,
    // T2g→A1g+Eg, T1u→A2u+Eu, T2u→A1u+Eu.
    let r = descend_names("Oh", "D3d", None, None).unwrap();
    assert_eq!(r.embeddings.len(), 1);
    check(
        &r,
        0,
        &[
            ("A1g", "A1g"),
            ("A2g", "A2g"),
            ("Eg", "Eg"),
            ("T1g", "A2g + Eg"),
            ("T2g", "A1g + Eg"),
            ("A1u", "A1u"),
            ("A2u", "A2u"),
            ("Eu", "Eu"),
            ("T1u", "A2u + Eu"),
            ("T2u", "A1u + Eu"),
        ],
    );
}

#[test]
fn d6h_to_d3h() {
    // Source: Wilson, Decius & Cross, Appendix X (D6h), from memory; the rows that do not
    // depend on which set of C2 axes D3h keeps: A1g→A1', A2g→A2', E1g→E'', E2g→E', A1u→A1'',
    // A2u→A2'', E1u→E', E2u→E''. The B species go to A1''/A2'' (g) and A1'/A2' (u), swapping
    // with the choice.
    let r = descend_names("D6h", "D3h", None, None).unwrap();
    assert_eq!(r.embeddings.len(), 2);
    for e in 0..2 {
        check(
            &r,
            e,
            &[
                ("A1g", "A1'"),
                ("A2g", "A2'"),
                ("E1g", "E''"),
                ("E2g", "E'"),
                ("A1u", "A1''"),
                ("A2u", "A2''"),
                ("E1u", "E'"),
                ("E2u", "E''"),
            ],
        );
    }
    let b1g: Vec<String> = (0..2).map(|e| row(&r, e, "B1g")).collect();
    assert!(b1g.contains(&"A1''".to_string()) && b1g.contains(&"A2''".to_string()));
    // `via` picks one: the embedding keeping the C2' axes.
    let one = descend_names("D6h", "D3h", Some("C2'"), None).unwrap();
    assert_eq!(one.embeddings.len(), 1);
    assert!(one.embeddings[0].contains.iter().any(|c| c == "3C2'"));
}

#[test]
fn dinfh_to_d2h() {
    // Source: Herzberg, Infrared and Raman Spectra (1945), correlation of D∞h with D2h, from
    // memory: Σg+→Ag, Σu+→B1u, Σg−→B1g, Σu−→Au, Πg→B2g+B3g, Πu→B2u+B3u.
    let r = descend_names("Dinfh", "D2h", None, None).unwrap();
    check(
        &r,
        0,
        &[
            ("Sigma+g", "Ag"),
            ("Sigma+u", "B1u"),
            ("Sigma-g", "B1g"),
            ("Sigma-u", "Au"),
            ("Pig", "B2g + B3g"),
            ("Piu", "B2u + B3u"),
        ],
    );
}

#[test]
fn dinfh_to_cinfv() {
    // from memory: Herzberg (1945): on losing the centre of symmetry g and u merge:
    // Σg+, Σu+ → Σ+; Πg, Πu → Π.
    let r = descend_names("Dinfh", "Cinfv", None, None).unwrap();
    check(
        &r,
        0,
        &[
            ("Sigma+g", "Sigma+"),
            ("Sigma+u", "Sigma+"),
            ("Sigma-g", "Sigma-"),
            ("Piu", "Pi"),
            ("Pig", "Pi"),
        ],
    );
}

#[test]
fn d4h_embeddings_of_c2v_and_c2() {
    // D4h (Cotton, Chemical Applications of Group Theory, 3rd ed., D4h table: classes C2,
    // 2C2', 2C2'', 2σv, 2σd): C2v with the C2 along z via σv or via σd, or with C2' / C2''
    // and σh; C2 along z, C2' or C2''.
    let g = load("D4h").unwrap();
    let c2v = load("C2v").unwrap();
    let r = descend(&g, &c2v, None, None).unwrap();
    assert_eq!(r.embeddings.len(), 4);
    let r = descend(&g, &load("C2").unwrap(), None, None).unwrap();
    assert_eq!(r.embeddings.len(), 3);
    // via σd / sd / the ASCII class name select the embeddings containing σd (C2 ∥ z with
    // 2σd, and C2'' with σh and σd).
    for via in ["σd", "sd", "2sd"] {
        let r = descend(&g, &c2v, Some(via), None).unwrap();
        assert!(!r.embeddings.is_empty());
        assert!(r
            .embeddings
            .iter()
            .all(|e| e.contains.iter().any(|c| c == "2sd")));
    }
    let r = descend(&g, &load("C2").unwrap(), Some("C2''"), None).unwrap();
    assert_eq!(r.embeddings.len(), 1);
}

#[test]
fn modes_split_on_descent() {
    // Γ of octahedral XY6 (Nakamoto, Part A): A1g + Eg + 2T1u + T2g + T2u. In D4h (WDC
    // Appendix X correlation, from memory) T1u → A2u + Eu and T2u → B2u + Eu, so each T1u set
    // splits in two and the silent T2u gains an IR-active Eu: IR count 2 → 5 (2A2u + 3Eu).
    let g = load("Oh").unwrap();
    let rows = parse_gamma(&g, "A1g + Eg + 2T1u + T2g + T2u").unwrap();
    let r = descend(&g, &load("D4h").unwrap(), None, Some(&rows)).unwrap();
    let e = &r.embeddings[0];
    let t1u = e.modes.iter().find(|m| m.irrep == "T1u").unwrap();
    assert!(t1u.splits && t1u.ir);
    assert_eq!(t1u.becomes.text, "A2u + Eu");
    let sub = e.subgroup_modes.as_ref().unwrap();
    assert_eq!(sub.n_modes, 15);
    assert_eq!(sub.ir_bands, 5);
    let t2u = e.modes.iter().find(|m| m.irrep == "T2u").unwrap();
    assert!(!t2u.ir && t2u.becomes.ir());
    assert!(sub.mutual_exclusion.is_some());
}

#[test]
fn descent_errors() {
    assert!(matches!(
        descend_names("C3v", "C2v", None, None),
        Err(SpectraError::NotASubgroup { .. })
    ));
    assert!(matches!(
        descend_names("D4h", "C2v", Some("S7"), None),
        Err(SpectraError::NoSuchClass { .. })
    ));
    assert!(matches!(
        descend_names("Oh", "C2v", Some("C2"), None),
        Err(SpectraError::AmbiguousClass { .. })
    ));
    assert!(matches!(
        descend_names("Td", "Cinfv", None, None),
        Err(SpectraError::NotASubgroup { .. })
    ));
}

#[test]
fn cinfv_to_c2v() {
    // from memory: Herzberg (1945), correlation of C∞v with C2v: Σ+→A1, Σ−→A2, Π→B1+B2.
    let r = descend_names("Cinfv", "C2v", None, None).unwrap();
    check(
        &r,
        0,
        &[("Sigma+", "A1"), ("Sigma-", "A2"), ("Pi", "B1 + B2")],
    );
}

#[test]
fn every_correlation_keeps_dimension_and_total_symmetry() {
    // Structural checks only (no chemistry): restriction keeps the dimension, and the totally
    // symmetric irrep of G goes to the totally symmetric irrep of H.
    let subs = [
        "C1", "Cs", "Ci", "C2", "C3", "C2v", "C3v", "C2h", "D2", "D3", "S4", "T",
    ];
    for name in salcdesk::group::names() {
        let g = load(name).unwrap();
        if g.is_linear() {
            continue;
        }
        for s in subs {
            let h = load(s).unwrap();
            if g.order() % h.order() != 0 {
                continue;
            }
            let r = match descend(&g, &h, None, None) {
                Ok(r) => r,
                Err(SpectraError::NotASubgroup { .. }) => continue,
                Err(e) => panic!("{name} → {s}: {e}"),
            };
            for e in &r.embeddings {
                for c in &e.correlation {
                    let d: usize = c
                        .becomes
                        .terms
                        .iter()
                        .map(|t| t.multiplicity as usize * t.dimension)
                        .sum();
                    assert_eq!(d, c.dimension, "{name} → {s}: {}", c.irrep);
                }
                let first = &e.correlation[0].becomes.terms;
                assert_eq!(first.len(), 1, "{name} → {s}");
                assert_eq!(first[0].irrep, h.table.irreps[0].label, "{name} → {s}");
            }
        }
    }
}

#[test]
fn via_several_classes_selects_one_embedding() {
    // D4h (Cotton, 3rd ed., D4h table): the C2v whose C2 is the principal C2 and whose
    // mirrors are the σd planes.
    let r = descend_names("D4h", "C2v", Some("C2, σd"), None).unwrap();
    assert_eq!(r.embeddings.len(), 1);
    let e = &r.embeddings[0];
    assert!(e.contains.contains(&"C2".to_string()) && e.contains.contains(&"2sd".to_string()));
}

#[test]
fn subgroup_types_of_td() {
    // from memory: Cotton, Chemical Applications of Group Theory, 3rd ed. (descent in
    // symmetry): the subgroups of Td are T, D2d, C3v, C2v, S4, D2, C3, C2, Cs and C1, each
    // type once up to conjugacy.
    let g = load("Td").unwrap();
    let t = salcdesk::spectra::subgroup_types(&g).unwrap();
    let mut names: Vec<&str> = t.iter().map(|s| s.name.as_str()).collect();
    names.sort();
    let mut want = vec!["C1", "C2", "C2v", "C3", "C3v", "Cs", "D2", "D2d", "S4", "T"];
    want.sort();
    assert_eq!(names, want);
    assert!(t.iter().all(|s| s.embeddings == 1));
}

#[test]
fn linear_group_to_itself_and_not_upwards() {
    let r = descend_names("Dinfh", "Dinfh", None, None).unwrap();
    assert!(r.embeddings[0]
        .correlation
        .iter()
        .all(|c| c.becomes.text == c.irrep));
    assert!(matches!(
        descend_names("Cinfv", "Dinfh", None, None),
        Err(SpectraError::NotASubgroup { .. })
    ));
    assert!(matches!(
        descend_names("Cinfv", "C2h", None, None),
        Err(SpectraError::NotASubgroup { .. })
    ));
}
