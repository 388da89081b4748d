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
