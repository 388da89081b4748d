//! Bonds the user adds or removes: applied on top of perception, saved in the session,
//! accepted by `analyze`, and refused clearly when they break the molecule's symmetry.

use salcdesk::analysis;
use salcdesk::geom::{parse_bond, BondEdits};
use salcdesk::session::{self, Atom, Geometry, GeometrySource, Session};
use std::process::Command;

/// Diborane, B2H6 (D2h). Geometry from memory: B–B 1.77 Å, B–H(bridge) 1.33 Å,
/// B–H(terminal) 1.19 Å, Ht–B–Ht 120°. With Cordero radii (B 0.84, H 0.31 Å) and the default
/// factor 1.15 the bridging B–H bonds (1.33 Å > 1.32 Å) are not perceived and a B–B bond is:
/// exactly the case where a chemist edits the bond list. Textbook fact (Cotton & Wilkinson,
/// Advanced Inorganic Chemistry, boranes): four terminal and four bridging B–H bonds, no
/// two-centre B–B bond.
fn diborane() -> Vec<Atom> {
    let yb = (1.33f64 * 1.33 - 0.885 * 0.885).sqrt();
    let (tx, tz) = (0.885 + 1.19 * 0.5, 1.19 * 3f64.sqrt() / 2.0);
    let mut atoms = vec![
        Atom {
            element: "B".into(),
            xyz: [0.885, 0.0, 0.0],
        },
        Atom {
            element: "B".into(),
            xyz: [-0.885, 0.0, 0.0],
        },
        Atom {
            element: "H".into(),
            xyz: [0.0, yb, 0.0],
        },
        Atom {
            element: "H".into(),
            xyz: [0.0, -yb, 0.0],
        },
    ];
    for (sx, sz) in [(1.0, 1.0), (1.0, -1.0), (-1.0, 1.0), (-1.0, -1.0)] {
        atoms.push(Atom {
            element: "H".into(),
            xyz: [sx * tx, 0.0, sz * tz],
        });
    }
    atoms
}

fn session_with(add: Vec<[usize; 2]>, remove: Vec<[usize; 2]>) -> Session {
    let mut g = Geometry::new(GeometrySource::Atoms(diborane()));
    g.add_bonds = add;
    g.remove_bonds = remove;
    Session {
        group: Some("D2h".into()),
        geometry: Some(g),
        ..Session::default()
    }
}

const BRIDGES: [[usize; 2]; 4] = [[1, 3], [1, 4], [2, 3], [2, 4]];

#[test]
fn perception_alone_gives_the_b_b_bond_and_misses_the_bridges() {
    let a = analysis::analyze(&session_with(vec![], vec![])).unwrap();
    let s = a.geometry.unwrap().survey.unwrap();
    assert_eq!(s.group.name(), "D2h");
    assert!(s.bonds.contains(&(0, 1)), "{:?}", s.bonds);
    assert_eq!(s.bonds.len(), 5, "{:?}", s.bonds);
}

#[test]
fn edited_bonds_give_terminal_and_bridging_sets() {
    let a = analysis::analyze(&session_with(BRIDGES.to_vec(), vec![[1, 2]])).unwrap();
    let ga = a.geometry.unwrap();
    let s = ga.survey.unwrap();
    assert_eq!(s.bonds.len(), 8);
    assert!(!s.bonds.contains(&(0, 1)));
    assert_eq!(s.bond_sets.len(), 2, "terminal and bridging B–H");
    for set in &s.bond_sets {
        assert_eq!(set.set.bonds.len(), 4);
        // One totally symmetric combination per set of equivalent bonds (Cotton, 3rd ed.,
        // §10.3), and the set spans as many dimensions as it has bonds.
        assert_eq!(set.gamma[0], 1, "Ag once");
        let dims: u64 = set.gamma.iter().sum(); // D2h: every irrep has dimension 1
        assert_eq!(dims, 4);
    }
    // The SALCs follow the edited bonds too.
    let salcs = ga.salcs.unwrap();
    let sets = salcs.as_ref().as_ref().unwrap();
    assert_eq!(sets.len(), 2);
}

#[test]
fn an_edit_that_breaks_symmetry_is_refused_with_the_missing_image() {
    let a = analysis::analyze(&session_with(vec![[1, 3]], vec![])).unwrap();
    let e = a.geometry.unwrap().survey.unwrap_err();
    assert!(e.contains("not symmetric in D2h"), "{e}");
    assert!(e.contains("1-3"), "{e}");
}

#[test]
fn bad_atom_numbers_and_impossible_edits_are_named() {
    for (add, remove, want) in [
        (vec![[1, 99]], vec![], "atom 99 does not exist"),
        (vec![[5, 5]], vec![], "cannot bond to itself"),
        (vec![[1, 2]], vec![], "already bonded"),
        (vec![], vec![[3, 4]], "not bonded"),
    ] {
        let a = analysis::analyze(&session_with(add, remove)).unwrap();
        let e = a.geometry.unwrap().survey.unwrap_err();
        assert!(e.contains(want), "{e}");
        assert!(e.starts_with("[geometry]"), "{e}");
    }
}

#[test]
fn edits_round_trip_through_the_session_file() {
    let s = session_with(BRIDGES.to_vec(), vec![[1, 2]]);
    let text = session::to_toml(&s);
    assert!(
        text.contains("add_bonds = [[1, 3], [1, 4], [2, 3], [2, 4]]"),
        "{text}"
    );
    assert!(text.contains("remove_bonds = [[1, 2]]"), "{text}");
    let back = session::parse("b2h6.toml", &text).unwrap();
    assert_eq!(back, s);
}

#[test]
fn malformed_bond_pairs_are_located() {
    let text = "format = 1\n[geometry]\natoms = [{ element = \"H\", xyz = [0, 0, 0] }]\nadd_bonds = [[1, 2, 3]]\n";
    let e = session::parse("x.toml", text).unwrap_err();
    assert_eq!(e.line, 4, "{e}");
    assert!(e.message.contains("two atom numbers"), "{e}");
    let text = "format = 1\n[geometry]\natoms = [{ element = \"H\", xyz = [0, 0, 0] }]\nremove_bonds = [[0, 1]]\n";
    let e = session::parse("x.toml", text).unwrap_err();
    assert!(e.message.contains("count from 1"), "{e}");
}

#[test]
fn bond_syntax() {
    assert_eq!(parse_bond("1-5").unwrap(), [1, 5]);
    assert_eq!(parse_bond(" 12 , 3").unwrap(), [12, 3]);
    assert!(parse_bond("15").is_err());
    assert!(parse_bond("a-b").is_err());
    let e = BondEdits {
        add: vec![[2, 1]],
        remove: vec![],
    };
    assert_eq!(e.apply(&[], 2).unwrap(), vec![(0, 1)]);
}

#[test]
fn analyze_takes_bond_edits_on_the_command_line() {
    let d = std::env::temp_dir().join(format!("salcdesk-bonds-{}", std::process::id()));
    std::fs::create_dir_all(&d).unwrap();
    let mut xyz = String::from("8\ndiborane\n");
    for a in diborane() {
        xyz.push_str(&format!(
            "{} {} {} {}\n",
            a.element, a.xyz[0], a.xyz[1], a.xyz[2]
        ));
    }
    let f = d.join("b2h6.xyz");
    std::fs::write(&f, xyz).unwrap();
    let mut cmd = Command::new(env!("CARGO_BIN_EXE_salcdesk"));
    cmd.args(["analyze", "--format", "json", "--remove-bond", "1-2"]);
    for b in BRIDGES {
        cmd.arg("--add-bond").arg(format!("{}-{}", b[0], b[1]));
    }
    let out = cmd.arg(&f).output().unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    assert_eq!(v["bonds"].as_array().unwrap().len(), 8);
    assert_eq!(v["bond_sets"].as_array().unwrap().len(), 2);
    let out = Command::new(env!("CARGO_BIN_EXE_salcdesk"))
        .args(["analyze", "--add-bond", "1-3"])
        .arg(&f)
        .output()
        .unwrap();
    assert!(!out.status.success());
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(
        err.contains("b2h6.xyz") && err.contains("not symmetric"),
        "{err}"
    );
}
