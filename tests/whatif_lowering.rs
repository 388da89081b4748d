//! What-if descent of a session (analysis::whatif) and substitution (analysis::substitute).
//!
//! Molecules are our own: square-planar PtCl4 (Pt–Cl 2.31 Å, from memory), tetrahedral SnCl4
//! (2.30 Å, from memory) and octahedral ML6 (2.40 Å, invented), each built in its table's
//! standard orientation (ligands along the axes; Td ligands on the (±1,±1,±1) diagonals).

use salcdesk::analysis::{self, substitute, whatif, Analysis, Depth};
use salcdesk::group;
use salcdesk::rep::{Character, MemberKind};
use salcdesk::session::{Atom, Geometry, GeometrySource, Member, MemberSet, Session, SetKind};

fn atom(e: &str, xyz: [f64; 3]) -> Atom {
    Atom {
        element: e.into(),
        xyz,
    }
}

fn planar_ml4() -> Vec<Atom> {
    let d = 2.31;
    vec![
        atom("Pt", [0.0, 0.0, 0.0]),
        atom("Cl", [d, 0.0, 0.0]),
        atom("Cl", [0.0, d, 0.0]),
        atom("Cl", [-d, 0.0, 0.0]),
        atom("Cl", [0.0, -d, 0.0]),
    ]
}

fn tetrahedral_ml4() -> Vec<Atom> {
    let c = 2.30 / 3f64.sqrt();
    let mut v = vec![atom("Sn", [0.0; 3])];
    for s in [
        [1.0, 1.0, 1.0],
        [1.0, -1.0, -1.0],
        [-1.0, 1.0, -1.0],
        [-1.0, -1.0, 1.0],
    ] {
        v.push(atom("Cl", [c * s[0], c * s[1], c * s[2]]));
    }
    v
}

fn octahedral_ml6() -> Vec<Atom> {
    let d = 2.40;
    let mut v = vec![atom("Mo", [0.0; 3])];
    for k in 0..3 {
        for s in [1.0, -1.0] {
            let mut p = [0.0; 3];
            p[k] = s * d;
            v.push(atom("F", p));
        }
    }
    v
}

/// A session in `group` with the geometry and one stretch set, one member per M–L bond
/// (atoms named), ticked from the geometry; `named` = false drops the atoms afterwards, so
/// that only the ticks are left.
fn session(group: &str, atoms: Vec<Atom>, named: bool) -> Session {
    let n = atoms.len();
    let mut s = Session {
        title: "what-if test".into(),
        group: Some(group.into()),
        geometry: Some(Geometry::new(GeometrySource::Atoms(atoms))),
        ..Session::default()
    };
    s.sets.push(MemberSet {
        name: "M-L stretches".into(),
        kind: SetKind::Stretch,
        members: (2..=n)
            .map(|k| Member {
                name: format!("r{}", k - 1),
                unmoved_by: vec!["E".into()],
                atoms: Some(vec![1, k]),
            })
            .collect(),
    });
    let a = analysis::analyze_to(&s, Depth::Quick).expect("analysis");
    let g = &a.group;
    let expected = a.sets[0].geometry_ticks.expected.clone();
    for (m, row) in s.sets[0].members.iter_mut().zip(expected) {
        let row = row.expect("member compared with the geometry");
        m.unmoved_by = g
            .table
            .classes
            .iter()
            .zip(row)
            .filter(|(_, on)| *on)
            .map(|(c, _)| c.ascii.clone())
            .collect();
        if !named {
            m.atoms = None;
        }
    }
    s
}

fn full(s: &Session) -> Analysis {
    analysis::analyze(s).expect("analysis")
}

fn ways_to(a: &Analysis, h: &str) -> Vec<whatif::Way> {
    whatif::ways(a)
        .expect("ways")
        .into_iter()
        .filter(|w| w.subgroup == h)
        .collect()
}

/// The one way whose description has every one of `words`.
fn way_with(ways: &[whatif::Way], words: &[&str]) -> whatif::Way {
    let hits: Vec<_> = ways
        .iter()
        .filter(|w| words.iter().all(|x| w.description.contains(x)))
        .collect();
    assert_eq!(
        hits.len(),
        1,
        "{words:?} among {:?}",
        ways.iter().map(|w| &w.description).collect::<Vec<_>>()
    );
    hits[0].clone()
}

fn count(gamma: &str, label: &str) -> u64 {
    gamma
        .split(" + ")
        .map(|t| {
            let d: String = t.chars().take_while(|c| c.is_ascii_digit()).collect();
            let rest = &t[d.len()..];
            (d.parse().unwrap_or(1), rest.to_string())
        })
        .filter(|(_, l)| l == label)
        .map(|(n, _)| n)
        .sum()
}

/// Square-planar ML4 stretches: A1g + B1g + Eu in D4h (Nakamoto, Part A, planar XY4; Cotton,
/// ch. 10). D4h holds C2v four ways; the correlation depends on which (Wilson, Decius & Cross,
/// Appendix X, D4h correlation table): with the C2 along z and the σ through the bonds, B1g
/// goes to A1 (2A1 + B1 + B2); through the bisectors, B1g goes to A2 (A1 + A2 + B1 + B2). With
/// the C2 along one M–L bond (a ligand replaced, ML3L′): 3A1 + B; between the bonds (cis-ML2L′2):
/// 2A1 + 2B (Nakamoto: cis-MX2Y2 stretches 2A1 + 2B2 in the molecular plane).
#[test]
fn planar_ml4_to_c2v_depends_on_the_way() {
    for named in [true, false] {
        let s = session("D4h", planar_ml4(), named);
        let a = full(&s);
        let before = a.sets[0].multiplicities().unwrap().to_vec();
        let g = group::load("D4h").unwrap();
        assert_eq!(
            salcdesk::rep::format_sum(&g, &before, false),
            "A1g + B1g + Eu"
        );
        let ways = ways_to(&a, "C2v");
        assert_eq!(ways.len(), 4, "D4h holds C2v four ways (WDC Appendix X)");
        let cases: [(&[&str], u64, u64); 4] = [
            (
                &[
                    "C2 along the principal axis",
                    "σ containing the principal axis and atoms 2, 4",
                ],
                2,
                0,
            ),
            (
                &["C2 along the principal axis", "no atom off the centre"],
                1,
                1,
            ),
            (
                &["perpendicular to the principal axis, along the Pt–Cl bond"],
                3,
                0,
            ),
            (
                &["perpendicular to the principal axis, between the bonds"],
                2,
                0,
            ),
        ];
        for (words, a1, a2) in cases {
            let w = way_with(&ways, words);
            let l = whatif::lower(&s, &a, &w).unwrap();
            let before = l.sets[0].before.clone().unwrap();
            let after = l.sets[0].after.clone().unwrap();
            assert_eq!(before, "A1g + B1g + Eu");
            assert_eq!(count(&after, "A1"), a1, "{words:?}: {after}");
            assert_eq!(count(&after, "A2"), a2, "{words:?}: {after}");
            // Four stretches stay four; in C2v every A1, B1, B2 is IR and Raman active
            // (Cotton, Appendix IIA), A2 Raman only.
            let m = l.sets[0].modes_after.clone().unwrap();
            assert_eq!(m.n_modes, 4);
            assert_eq!(m.ir_bands, 4 - a2, "{words:?}");
            assert_eq!(m.raman_bands, 4, "{words:?}");
            // Before: one IR band (Eu), two Raman (A1g, B1g) — mutual exclusion (Nakamoto).
            let mb = l.sets[0].modes_before.clone().unwrap();
            assert_eq!((mb.ir_bands, mb.raman_bands), (1, 2));
            if named {
                assert!(l.sets[0].ticks_from.contains("geometry"));
            } else {
                assert!(l.sets[0].ticks_from.contains("through the classes"));
            }
        }
    }
}

/// Td → C3v: ML4 stretches A1 + T2 become 2A1 + E, Γvib A1 + E + 2T2 becomes 3A1 + 3E
/// (Herzberg 1945, CH3X-type molecules; Nakamoto, ML3L′ of C3v); one way only.
#[test]
fn tetrahedral_to_c3v() {
    let s = session("Td", tetrahedral_ml4(), true);
    let a = full(&s);
    let ways = ways_to(&a, "C3v");
    assert_eq!(ways.len(), 1);
    assert!(
        ways[0].description.contains("C3 along the Sn–Cl bond"),
        "{}",
        ways[0].description
    );
    let l = whatif::lower(&s, &a, &ways[0]).unwrap();
    assert_eq!(l.sets[0].before.as_deref(), Some("A1 + T2"));
    assert_eq!(l.sets[0].after.as_deref(), Some("2A1 + E"));
    let (vb, va) = l.vibrations.clone().expect("Γvib from the geometry");
    assert_eq!(vb.gamma, "A1 + E + 2T2");
    assert_eq!(va.gamma, "3A1 + 3E");
    // C3v: A1 and E both IR and Raman active: six bands each (Herzberg, CH3Cl).
    assert_eq!((va.ir_bands, va.raman_bands), (6, 6));
}

/// Oh → D4h (ML6 → trans-ML4L′2): stretches A1g + Eg + T1u become 2A1g + B1g + A2u + Eu;
/// Γvib A1g + Eg + 2T1u + T2g + T2u becomes 2A1g + B1g + B2g + Eg + 2A2u + B2u + 3Eu:
/// 5 IR bands (2A2u + 3Eu), 5 Raman (Nakamoto, trans-MX4Y2; from memory for the full list).
#[test]
fn octahedral_to_d4h() {
    let s = session("Oh", octahedral_ml6(), true);
    let a = full(&s);
    let ways = ways_to(&a, "D4h");
    assert_eq!(ways.len(), 1, "one way, three alike");
    assert!(ways[0].description.contains("one of 3 alike"));
    let l = whatif::lower(&s, &a, &ways[0]).unwrap();
    assert_eq!(l.sets[0].before.as_deref(), Some("A1g + Eg + T1u"));
    assert_eq!(l.sets[0].after.as_deref(), Some("2A1g + B1g + A2u + Eu"));
    let m = l.sets[0].modes_after.clone().unwrap();
    assert_eq!((m.ir_bands, m.raman_bands), (2, 3));
    let (_, va) = l.vibrations.clone().unwrap();
    assert_eq!(va.gamma, "2A1g + B1g + B2g + Eg + 2A2u + B2u + 3Eu");
    assert_eq!((va.ir_bands, va.raman_bands), (5, 5));
}

/// Applying a lowering gives a session in H whose reduction is the what-if's "after".
#[test]
fn lowered_session_reduces_to_the_after_column() {
    let s = session("D4h", planar_ml4(), false);
    let a = full(&s);
    for w in ways_to(&a, "C2v") {
        let l = whatif::lower(&s, &a, &w).unwrap();
        let s2 = whatif::lowered_session(&s, &l);
        assert_eq!(s2.group.as_deref(), Some("C2v"));
        let a2 = full(&s2);
        let h = group::load("C2v").unwrap();
        let got = salcdesk::spectra::symmetry_of_rows(&h, a2.sets[0].multiplicities().unwrap())
            .unwrap()
            .text;
        assert_eq!(Some(got), l.sets[0].after.clone());
    }
}

/// Every finite group of the shipped tables, every subgroup type and way: the ticks carried
/// through the classes give χ in H equal to the restriction of χ in G (the definition of the
/// restriction; Wilson, Decius & Cross, Appendix X), for members ticked in a varied pattern
/// and every kind of member.
#[test]
fn carried_ticks_restrict_the_character_everywhere() {
    let kinds = [
        SetKind::Stretch,
        SetKind::Cartesian,
        SetKind::Pi,
        SetKind::Axial,
    ];
    let mut checked = 0;
    for name in group::names() {
        let g = group::load(name).unwrap();
        if g.is_linear() {
            continue;
        }
        let nc = g.table.classes.len();
        // Member k is ticked at class c when (k·c + k + c) is odd or k = 0 (every class).
        let member = |k: usize| Member {
            name: format!("m{k}"),
            unmoved_by: g
                .table
                .classes
                .iter()
                .enumerate()
                .filter(|(c, _)| k == 0 || (k * c + k + c) % 2 == 1 || *c == 0)
                .map(|(_, cl)| cl.ascii.clone())
                .collect(),
            atoms: None,
        };
        let s = Session {
            group: Some(name.to_string()),
            sets: kinds
                .iter()
                .map(|&kind| MemberSet {
                    name: kind.name().into(),
                    kind,
                    members: (0..4).map(member).collect(),
                })
                .collect(),
            ..Session::default()
        };
        let a = analysis::analyze_to(&s, Depth::Quick).unwrap();
        for w in whatif::ways(&a).unwrap() {
            let h = group::load(&w.subgroup).unwrap();
            let l = whatif::lower(&s, &a, &w).unwrap();
            for ((sl, sa), kind) in l.sets.iter().zip(&a.sets).zip(kinds) {
                let mk = analysis_kind(kind);
                let chi_g = Character::from_unmoved(&g, &sa.unmoved, mk).unwrap();
                let counts_h: Vec<i64> = (0..h.table.classes.len())
                    .map(|c| {
                        sl.members
                            .iter()
                            .filter(|m| {
                                m.unmoved_by
                                    .iter()
                                    .any(|t| analysis::resolve_class(&h.table, t) == Some(c))
                            })
                            .count() as i64
                    })
                    .collect();
                let chi_h = Character::from_unmoved(&h, &counts_h, mk).unwrap();
                let restricted: Vec<_> = w
                    .placement
                    .link
                    .iter()
                    .map(|&c| chi_g.0[c].clone())
                    .collect();
                assert_eq!(chi_h.0, restricted, "{name} → {} ({kind:?})", w.subgroup);
                assert_eq!(w.placement.link.len(), h.table.classes.len());
                assert!(w.placement.link.iter().all(|&c| c < nc));
                checked += 1;
            }
        }
    }
    assert!(checked > 500, "only {checked} checks");
}

fn analysis_kind(k: SetKind) -> MemberKind {
    match k {
        SetKind::Stretch | SetKind::Bend | SetKind::Scalar => MemberKind::Stretch,
        SetKind::Cartesian => MemberKind::Cartesian,
        SetKind::Pi => MemberKind::Pi,
        SetKind::Axial => MemberKind::Axial,
    }
}

/// Changing the group by hand: D4h → C2v is ambiguous (four ways): ticks cleared and said so;
/// D4h → C4v is one way: ticks carried, A1g + B1g + Eu → A1 + B1 + E (WDC Appendix X);
/// C2v → D4h is not a descent: ticks cleared, never matched by label.
#[test]
fn changing_the_group_by_hand_carries_only_what_is_determined() {
    let s = session("D4h", planar_ml4(), false);
    let a = analysis::analyze_to(&s, Depth::Quick).unwrap();
    let c2v = group::load("C2v").unwrap();
    let (s2, msg) = whatif::regroup(&s, Some(&a), &c2v, None);
    assert!(msg.contains("4 ways") && msg.contains("cleared"), "{msg}");
    assert!(s2.sets[0]
        .members
        .iter()
        .all(|m| m.unmoved_by == vec!["E".to_string()]));

    let c4v = group::load("C4v").unwrap();
    let (s3, msg) = whatif::regroup(&s, Some(&a), &c4v, None);
    assert!(msg.contains("carried"), "{msg}");
    let a3 = analysis::analyze_to(&s3, Depth::Quick).unwrap();
    assert_eq!(
        salcdesk::rep::format_sum(&c4v, a3.sets[0].multiplicities().unwrap(), false),
        "A1 + B1 + E"
    );

    // Up again from C2v (ticked through the σ-through-bonds way) to D4h.
    let ways = ways_to(&full(&s), "C2v");
    let w = way_with(&ways, &["C2 along the principal axis", "and atoms 2, 4"]);
    let low = whatif::lowered_session(&s, &whatif::lower(&s, &full(&s), &w).unwrap());
    let al = analysis::analyze_to(&low, Depth::Quick).unwrap();
    let d4h = group::load("D4h").unwrap();
    let (up, msg) = whatif::regroup(&low, Some(&al), &d4h, None);
    assert!(msg.contains("not a subgroup"), "{msg}");
    assert!(up.sets[0]
        .members
        .iter()
        .all(|m| m.unmoved_by == vec!["E".to_string()]));
}

/// Replacing one Cl of square-planar PtCl4 by Br: D4h → C2v. Γvib of planar XY4 (D4h):
/// A1g + B1g + B2g + A2u + B2u + 2Eu, 3 IR and 3 Raman bands (Nakamoto, Part A); of planar
/// ML3L′ (C2v): 4A1 + 2B1 + 3B2 or with B1/B2 swapped by the orientation, nine modes all IR
/// and Raman active (Cotton, Appendix IIA: no A2). An isotope of Cl keeps D4h.
#[test]
fn replacing_one_ligand_of_planar_ml4() {
    let s = session("D4h", planar_ml4(), true);
    let r = substitute::parse_replacement("2 Br").unwrap();
    let sub = substitute::substitute(&s, None, &r).unwrap();
    assert_eq!(sub.before.group, "D4h");
    assert_eq!(sub.after.group, "C2v");
    let vb = sub.before.vibrations.clone().unwrap();
    let va = sub.after.vibrations.clone().unwrap();
    assert_eq!(vb.gamma, "A1g + B1g + B2g + A2u + B2u + 2Eu");
    assert_eq!((vb.ir_bands, vb.raman_bands), (3, 3));
    assert_eq!(count(&va.gamma, "A1"), 4);
    assert_eq!(count(&va.gamma, "A2"), 0);
    assert_eq!((va.ir_bands, va.raman_bands), (9, 9));
    assert!(sub.change.contains("Cl → Br"));

    let iso = substitute::parse_replacement("2 37Cl").unwrap();
    let sub = substitute::substitute(&s, None, &iso).unwrap();
    assert_eq!(sub.after.group, "D4h");
    assert!(sub.notes.iter().any(|n| n.contains("masses only")));

    // Bad input: located messages, no panic.
    assert!(substitute::parse_replacement("2").is_err());
    assert!(substitute::parse_replacement("0 Br").is_err());
    assert!(substitute::parse_replacement("2 Xx").is_err());
    let far = substitute::parse_replacement("9 Br").unwrap();
    let e = substitute::substitute(&s, None, &far).unwrap_err();
    assert!(e.contains("5 atoms"), "{e}");
}

/// D2d in D4h keeps the S4 about the principal axis (Cotton, ch. 3: D2d = E, 2S4, C2, 2C2',
/// 2σd); the description names the S4, not only the C2 inside it, and the two ways differ in
/// whether the C2′ axes run along the bonds or between them.
#[test]
fn d2d_in_d4h_is_described_by_its_s4() {
    let s = session("D4h", planar_ml4(), true);
    let a = full(&s);
    let ways = ways_to(&a, "D2d");
    assert_eq!(ways.len(), 2);
    for w in &ways {
        assert!(
            w.description.starts_with("S4 along the principal axis"),
            "{}",
            w.description
        );
    }
    way_with(
        &ways,
        &["C2 perpendicular to the principal axis, along the Pt–Cl bond"],
    );
    way_with(
        &ways,
        &["C2 perpendicular to the principal axis, between the bonds"],
    );
}

/// Without a geometry the ways are told by directions in the table's standard orientation
/// (tables/D4h.toml: C4 along z, a C2′ along x, σv the xz plane, σd the plane x = y); the
/// ticks go through the classes and give the same Γ as with the geometry.
#[test]
fn without_a_geometry_the_ways_are_told_by_direction() {
    let mut s = session("D4h", planar_ml4(), false);
    s.geometry = None;
    let a = full(&s);
    let ways = ways_to(&a, "C2v");
    let sv = way_with(
        &ways,
        &["C2 along z (the principal axis)", "σ in the xz plane"],
    );
    let sd = way_with(
        &ways,
        &["C2 along z", "σ containing z and the line between x"],
    );
    way_with(&ways, &["C2 along x, perpendicular to the principal axis"]);
    way_with(
        &ways,
        &["C2 between x and", "perpendicular to the principal axis"],
    );
    let after = |w: &whatif::Way| whatif::lower(&s, &a, w).unwrap().sets[0].after.clone();
    // As in planar_ml4_to_c2v_depends_on_the_way (WDC Appendix X).
    assert_eq!(after(&sv).map(|g| count(&g, "A1")), Some(2));
    assert_eq!(after(&sd).map(|g| count(&g, "A2")), Some(1));
}
