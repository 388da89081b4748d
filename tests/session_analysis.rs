//! `analysis::analyze` on sessions: ticks → unmoved counts → χ → reduction, checked against
//! hand calculations with their sources.

use salcdesk::analysis::{self, resolve_class, Outcome};
use salcdesk::group;
use salcdesk::rep::format_sum;
use salcdesk::session::{self, Member, MemberSet, Session, SetKind};

fn set(kind: SetKind, ticks: &[&[&str]]) -> MemberSet {
    MemberSet {
        name: "s".into(),
        kind,
        members: ticks
            .iter()
            .enumerate()
            .map(|(k, t)| Member {
                name: format!("m{}", k + 1),
                unmoved_by: t.iter().map(|c| c.to_string()).collect(),
                atoms: None,
            })
            .collect(),
    }
}

fn gamma(group: &str, s: MemberSet) -> String {
    let sess = Session {
        group: Some(group.into()),
        sets: vec![s],
        ..Session::default()
    };
    let a = analysis::analyze(&sess).unwrap();
    let m = a.sets[0]
        .multiplicities()
        .expect("a representation")
        .to_vec();
    format_sum(&a.group, &m, false)
}

#[test]
fn tetrahedral_stretches_span_a1_plus_t2() {
    // Source: Cotton, Chemical Applications of Group Theory, 3rd ed., §10.3 (MX4 stretches
    // in Td: Γ = A1 + T2). Counts by hand: E 4, C3 1, C2 0, S4 0, σd 2.
    let s = set(
        SetKind::Stretch,
        &[&["E", "8C3", "6sd"], &["E"], &["E"], &["E", "6sd"]],
    );
    assert_eq!(gamma("Td", s), "A1 + T2");
}

#[test]
fn octahedral_stretches_and_ligand_pi() {
    // Source: Cotton, 3rd ed., §8.6 (σ bonding in ML6: A1g + Eg + T1u) and §8.7 (π: T1g + T2g
    // + T1u + T2u).
    let ax = ["E", "6C4", "3C2", "6sd"];
    let eq = ["E", "3sh"];
    let ticks: Vec<&[&str]> = vec![&eq, &eq, &eq, &eq, &ax, &ax];
    assert_eq!(gamma("Oh", set(SetKind::Stretch, &ticks)), "A1g + Eg + T1u");
    assert_eq!(
        gamma("Oh", set(SetKind::Pi, &ticks)),
        "T1g + T2g + T1u + T2u"
    );
}

#[test]
fn a_name_without_count_must_be_unambiguous() {
    // from memory: Oh has two classes of C2 (6C2 and 3C2 = C4²), so "C2" names neither.
    let g = group::load("Oh").unwrap();
    assert_eq!(resolve_class(&g.table, "C2"), None);
    assert!(resolve_class(&g.table, "3C2").is_some());
    assert!(resolve_class(&g.table, "6C2").is_some());
    assert_ne!(
        resolve_class(&g.table, "3C2"),
        resolve_class(&g.table, "6C2")
    );
    assert_eq!(
        resolve_class(&g.table, "C4"),
        resolve_class(&g.table, "6C4")
    );
    // a wrong count names no class
    assert_eq!(resolve_class(&g.table, "2C4"), None);
}

#[test]
fn the_puzzle_is_impossible_and_the_fix_is_suggested() {
    // Hand calculation (C3v, h = 6): χ = (3, 0, 0) gives n(A1) = n(A2) = 1/2, n(E) = 1; one
    // more σv tick gives χ = (3, 0, 1) → A1 + E (from memory: three equivalent bonds of a C3v
    // pyramid, Cotton 3rd ed. §10.3).
    let p =
        std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions/degenerate-puzzle.toml");
    let s = session::load_file(&p).unwrap();
    let a = analysis::analyze(&s).unwrap();
    let st = &a.sets[0];
    assert_eq!(st.unmoved, vec![3, 0, 0]);
    match &*st.outcome {
        Outcome::Finite {
            result: Err(inv), ..
        } => {
            assert_eq!(inv.offending.len(), 2);
            assert!(inv
                .suggestions
                .iter()
                .any(|sg| sg.class == 2
                    && format_sum(&a.group, &sg.multiplicities, false) == "A1 + E"));
        }
        other => panic!("expected an impossible χ, got {other:?}"),
    }
}

#[test]
fn cartesian_sets_give_the_vibrations() {
    // Source: Nakamoto, Infrared and Raman Spectra of Inorganic and Coordination Compounds,
    // Part A (tetrahedral XY4: Γvib = A1 + E + 2T2).
    let p = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions/tetrahedral-mx4.toml");
    let a = analysis::analyze(&session::load_file(&p).unwrap()).unwrap();
    let v = a.sets[0].vibrations.clone().unwrap().unwrap();
    assert_eq!(format_sum(&a.group, &v.vibrations, false), "A1 + E + 2T2");
    assert_eq!(v.n_modes, 9);
}

#[test]
fn no_group_is_a_clear_error() {
    let e = analysis::analyze(&Session::default()).unwrap_err();
    assert!(e.to_string().contains("no point group chosen"));
}

#[test]
fn a_c60_sized_cartesian_set_gives_the_known_vibrations() {
    // from memory (the standard C60 mode count, e.g. Dresselhaus, Dresselhaus & Eklund,
    // Science of Fullerenes and Carbon Nanotubes, ch. 11): 174 modes in 46 frequencies,
    // Γvib = 2Ag + 3T1g + 4T2g + 6Gg + 8Hg + Au + 4T1u + 5T2u + 6Gu + 7Hu. Each of the 15
    // mirror planes holds 4 atoms; no atom lies on a rotation axis.
    let members = (1..=60)
        .map(|k| Member {
            name: format!("C{k}"),
            unmoved_by: if k <= 4 {
                vec!["E".into(), "15s".into()]
            } else {
                vec!["E".into()]
            },
            atoms: None,
        })
        .collect();
    let s = Session {
        group: Some("Ih".into()),
        sets: vec![MemberSet {
            name: "c".into(),
            kind: SetKind::Cartesian,
            members,
        }],
        ..Session::default()
    };
    let a = analysis::analyze(&s).unwrap();
    let v = a.sets[0].vibrations.clone().unwrap().unwrap();
    assert_eq!(
        format_sum(&a.group, &v.vibrations, false),
        "2Ag + 3T1g + 4T2g + 6Gg + 8Hg + Au + 4T1u + 5T2u + 6Gu + 7Hu"
    );
    assert_eq!(v.n_modes, 174);
}

/// An invented tetrahedral MX4 (Sn–Cl 2.30 Å, a realistic length from memory), inline.
fn mx4_with_geometry(group: &str) -> Session {
    let c = 2.30 / 3f64.sqrt();
    let mut atoms = vec![session::Atom {
        element: "Sn".into(),
        xyz: [0.0, 0.0, 0.0],
    }];
    for s in [
        [1.0, 1.0, 1.0],
        [1.0, -1.0, -1.0],
        [-1.0, 1.0, -1.0],
        [-1.0, -1.0, 1.0],
    ] {
        atoms.push(session::Atom {
            element: "Cl".into(),
            xyz: [c * s[0], c * s[1], c * s[2]],
        });
    }
    Session {
        group: Some(group.into()),
        geometry: Some(session::Geometry::new(session::GeometrySource::Atoms(
            atoms,
        ))),
        ..Session::default()
    }
}

#[test]
fn an_inline_tetrahedral_geometry_is_surveyed_to_td() {
    // Source: Nakamoto, Infrared and Raman Spectra of Inorganic and Coordination Compounds,
    // Part A (tetrahedral XY4): Γvib = A1 + E + 2T2. Geometry invented, from memory.
    let a = analysis::analyze(&mx4_with_geometry("Td")).unwrap();
    let ga = a.geometry.as_ref().expect("geometry analysed");
    let sv = ga.survey.as_ref().expect("survey");
    assert_eq!(sv.group.name(), "Td");
    assert_eq!(
        format_sum(&sv.group, &sv.vibrations.vibrations, false),
        "A1 + E + 2T2"
    );
    assert_eq!(sv.bonds.len(), 4);
    assert!(a.notes.is_empty(), "{:?}", a.notes);
    // Stretch SALCs: A1 + T2 (Cotton, 3rd ed., §10.3; from memory), one bond set of four.
    let salcs = ga.salcs.as_ref().expect("full depth computes SALCs");
    let sets = salcs.as_ref().as_ref().expect("SALCs");
    assert_eq!(sets.len(), 1);
    let set = sets[0].result.as_ref().expect("SALC set");
    assert_eq!(set.salcs.len(), 4);
    let mut labels: Vec<&str> = set.salcs.iter().map(|s| s.label.as_str()).collect();
    labels.dedup();
    assert_eq!(labels, ["A1", "T2"]);
}

#[test]
fn a_chosen_group_that_differs_from_the_geometry_is_said_plainly() {
    let a = analysis::analyze(&mx4_with_geometry("C3v")).unwrap();
    assert_eq!(a.group.name(), "C3v", "the user's group is kept");
    assert_eq!(a.notes.len(), 1);
    assert!(
        a.notes[0].contains("Td") && a.notes[0].contains("C3v"),
        "{}",
        a.notes[0]
    );
}

#[test]
fn bad_geometry_becomes_a_located_message() {
    let mut s = mx4_with_geometry("Td");
    if let Some(session::Geometry {
        source: session::GeometrySource::Atoms(atoms),
        ..
    }) = &mut s.geometry
    {
        atoms[2].element = "Qq".into();
    }
    let a = analysis::analyze(&s).unwrap();
    let e = a.geometry.unwrap().survey.unwrap_err();
    assert!(e.contains("atom 3") && e.contains("Qq"), "{e}");
    let mut s = mx4_with_geometry("Td");
    s.geometry.as_mut().unwrap().source =
        session::GeometrySource::File("/nonexistent/dir/none.xyz".into());
    let a = analysis::analyze(&s).unwrap();
    let e = a.geometry.unwrap().survey.unwrap_err();
    assert!(e.contains("none.xyz"), "{e}");
}
