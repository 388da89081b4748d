//! Ticks against the geometry: members that name their atoms (`[set.atoms]`) get the ticks the
//! session's geometry implies; cells that disagree are counted, drawn with `!` in the Members
//! panel, and one key takes the geometry's ticks (undoably).
//!
//! Geometry used throughout: an invented tetrahedral MX4 already in the Td table's standard
//! orientation (C2/S4 axes along x, y, z; the representative C3 about (1, 1, 1); the
//! representative σd the plane x = y — see tables/Td.toml). Sn–Cl 2.30 Å is a realistic length
//! from memory. Atoms: 1 Sn at the origin; 2 Cl along (1, 1, 1); 3 along (1, −1, −1); 4 along
//! (−1, 1, −1); 5 along (−1, −1, 1). So C3(1,1,1) keeps Cl2; C2(z) swaps Cl2↔Cl5 and Cl3↔Cl4;
//! S4(z) moves every Cl; σd(x = y) keeps Cl2 and Cl5 and swaps Cl3↔Cl4.

use ratatui::backend::TestBackend;
use ratatui::Terminal;
use salcdesk::analysis::{self, SetAnalysis};
use salcdesk::rep::format_sum;
use salcdesk::session::{
    self, Atom, Geometry, GeometrySource, Member, MemberSet, Session, SetKind,
};
use salcdesk::tui::keymap::Key;
use salcdesk::tui::{ui, Action, App, Panel};

fn mx4_atoms() -> Vec<Atom> {
    let c = 2.30 / 3f64.sqrt();
    let mut atoms = vec![Atom {
        element: "Sn".into(),
        xyz: [0.0, 0.0, 0.0],
    }];
    for s in [
        [1.0, 1.0, 1.0],
        [1.0, -1.0, -1.0],
        [-1.0, 1.0, -1.0],
        [-1.0, -1.0, 1.0],
    ] {
        atoms.push(Atom {
            element: "Cl".into(),
            xyz: [c * s[0], c * s[1], c * s[2]],
        });
    }
    atoms
}

fn member(name: &str, ticks: &[&str], atoms: Option<&[usize]>) -> Member {
    Member {
        name: name.into(),
        unmoved_by: ticks.iter().map(|c| c.to_string()).collect(),
        atoms: atoms.map(|a| a.to_vec()),
    }
}

/// The four Sn–Cl stretches, ticked by hand from the atom moves in the header comment:
/// r1 (Sn–Cl2) stays under C3(1,1,1) and σd(x = y); r4 (Sn–Cl5) under σd(x = y).
fn right_stretches() -> MemberSet {
    MemberSet {
        name: "Sn-Cl stretches".into(),
        kind: SetKind::Stretch,
        members: vec![
            member("r1", &["E", "8C3", "6sd"], Some(&[1, 2])),
            member("r2", &["E"], Some(&[1, 3])),
            member("r3", &["E"], Some(&[1, 4])),
            member("r4", &["E", "6sd"], Some(&[1, 5])),
        ],
    }
}

fn mx4_session(group: &str, sets: Vec<MemberSet>) -> Session {
    Session {
        title: "Invented MX4 with a geometry".into(),
        group: Some(group.into()),
        geometry: Some(Geometry::new(GeometrySource::Atoms(mx4_atoms()))),
        sets,
        ..Session::default()
    }
}

fn gamma(a: &analysis::Analysis, s: &SetAnalysis) -> String {
    format_sum(
        &a.group,
        s.multiplicities().expect("a representation"),
        false,
    )
}

/// Column sums of the geometry's expected ticks (members that were compared).
fn expected_counts(s: &SetAnalysis) -> Vec<i64> {
    let rows: Vec<&Vec<bool>> = s
        .geometry_ticks
        .expected
        .iter()
        .map(|r| r.as_ref().expect("every member compared"))
        .collect();
    (0..rows[0].len())
        .map(|c| rows.iter().filter(|r| r[c]).count() as i64)
        .collect()
}

#[test]
fn right_stretch_ticks_agree_with_the_geometry_and_span_a1_plus_t2() {
    // Source: Cotton, Chemical Applications of Group Theory, 3rd ed., §10.3 (MX4 stretches in
    // Td): unmoved bonds E 4, C3 1, C2 0, S4 0, σd 2 → Γ = A1 + T2.
    let a = analysis::analyze(&mx4_session("Td", vec![right_stretches()])).unwrap();
    let s = &a.sets[0];
    assert_eq!(s.unmoved, vec![4, 1, 0, 0, 2]);
    assert_eq!(gamma(&a, s), "A1 + T2");
    let gt = &s.geometry_ticks;
    assert_eq!(gt.compared(), 4);
    assert_eq!(gt.disagreements, vec![]);
    assert_eq!(gt.reason, None);
    for (mi, row) in gt.expected.iter().enumerate() {
        assert_eq!(row.as_ref(), Some(&s.grid[mi]), "member {mi}");
    }
}

#[test]
fn one_wrong_tick_is_flagged_at_exactly_that_cell() {
    // r4 (Sn–Cl5) lies in the plane x = y: the representative σd keeps it. Leaving that tick
    // out gives χ(σd) = 1 and n(A1) = 11/12 — not a representation.
    let mut set = right_stretches();
    set.members[3].unmoved_by = vec!["E".into()];
    let a = analysis::analyze(&mx4_session("Td", vec![set.clone()])).unwrap();
    let s = &a.sets[0];
    assert!(s.multiplicities().is_none());
    assert_eq!(s.geometry_ticks.disagreements, vec![(3, 4)]);
    assert!(s.geometry_ticks.disagrees(3, 4));
    assert!(!s.geometry_ticks.disagrees(0, 4));
    // A tick too many: r2 (Sn–Cl3) under C2(z), which sends Cl3 to Cl4.
    set.members[3].unmoved_by = vec!["E".into(), "6sd".into()];
    set.members[1].unmoved_by = vec!["E".into(), "3C2".into()];
    let a = analysis::analyze(&mx4_session("Td", vec![set])).unwrap();
    assert_eq!(a.sets[0].geometry_ticks.disagreements, vec![(1, 2)]);
}

#[test]
fn bends_and_cartesians_get_the_textbook_counts_from_the_geometry() {
    // Bends (from memory, the standard tetrahedral MX4 count): the six X–M–X angles are left
    // in place E 6, C3 0, C2 2, S4 0, σd 2 → A1 + E + T2 (the A1 combination is redundant).
    // Cartesians (from memory; the same counts as `salcdesk reduce Td --unmoved 5 2 1 1 3`):
    // unmoved atoms E 5, C3 2, C2 1, S4 1, σd 3 → Γ3N = A1 + E + T1 + 3T2.
    let only_e = |names: &[(&str, &[usize])]| -> Vec<Member> {
        names
            .iter()
            .map(|(n, at)| member(n, &["E"], Some(at)))
            .collect()
    };
    let bends = MemberSet {
        name: "bends".into(),
        kind: SetKind::Bend,
        members: only_e(&[
            ("a23", &[2, 1, 3]),
            ("a24", &[2, 1, 4]),
            ("a25", &[2, 1, 5]),
            ("a34", &[3, 1, 4]),
            ("a35", &[3, 1, 5]),
            ("a45", &[4, 1, 5]),
        ]),
    };
    let cart = MemberSet {
        name: "xyz".into(),
        kind: SetKind::Cartesian,
        members: only_e(&[
            ("Sn", &[1]),
            ("Cl2", &[2]),
            ("Cl3", &[3]),
            ("Cl4", &[4]),
            ("Cl5", &[5]),
        ]),
    };
    let sess = mx4_session("Td", vec![bends, cart]);
    let a = analysis::analyze(&sess).unwrap();
    assert_eq!(expected_counts(&a.sets[0]), vec![6, 0, 2, 0, 2]);
    assert_eq!(expected_counts(&a.sets[1]), vec![5, 2, 1, 1, 3]);
    // The two angles bisected by z and lying in x = y: a25 (Cl2–Sn–Cl5, ends swapped by C2,
    // both kept by σd) and a34 (ends swapped by both).
    let e = &a.sets[0].geometry_ticks.expected;
    assert_eq!(e[2], Some(vec![true, false, true, false, true]));
    assert_eq!(e[3], Some(vec![true, false, true, false, true]));
    assert_eq!(e[0], Some(vec![true, false, false, false, false]));
    // Only E ticked: every other expected tick is a disagreement.
    assert_eq!(a.sets[0].geometry_ticks.disagreements.len(), 4);
    assert_eq!(a.sets[1].geometry_ticks.disagreements.len(), 7);
    // Taking the geometry's ticks (through the workspace) gives the textbook Γ.
    let mut app = App::new(sess, None, false, false);
    app.apply(Action::GoPanel(Panel::Members));
    app.apply(Action::TakeGeometryTicks);
    app.apply(Action::NextSet);
    app.apply(Action::TakeGeometryTicks);
    app.finish_analysis();
    let a = app.analysis.as_ref().unwrap();
    assert_eq!(gamma(a, &a.sets[0]), "A1 + E + T2");
    let v = a.sets[1].vibrations.clone().unwrap().unwrap();
    assert_eq!(
        format_sum(&a.group, &v.gamma_3n, false),
        "A1 + E + T1 + 3T2"
    );
    // from memory: Γvib of a tetrahedral MX4 is A1 + E + 2T2 (9 modes)
    assert_eq!(format_sum(&a.group, &v.vibrations, false), "A1 + E + 2T2");
}

/// An invented H2O2-like molecule of exact C2 symmetry about z (coordinates made up, O–O
/// 1.48 Å and O–H about 0.94 Å from memory): atoms 1 O, 2 O, 3 H (on O1), 4 H (on O2).
fn c2_peroxide(sets: Vec<MemberSet>) -> Session {
    let atoms = [
        ("O", [0.74, 0.0, 0.0]),
        ("O", [-0.74, 0.0, 0.0]),
        ("H", [0.95, 0.85, 0.35]),
        ("H", [-0.95, -0.85, 0.35]),
    ]
    .iter()
    .map(|(e, x)| Atom {
        element: e.to_string(),
        xyz: *x,
    })
    .collect();
    Session {
        group: Some("C2".into()),
        geometry: Some(Geometry::new(GeometrySource::Atoms(atoms))),
        sets,
        ..Session::default()
    }
}

#[test]
fn a_stretch_may_have_its_ends_swapped_but_a_pi_pair_may_not() {
    // C2 swaps the two O atoms: the O–O bond vector stays (a stretch is unmoved, common
    // practice: the bond is mapped onto itself), but the π pair on it is moved (the kinds'
    // rules in src/session/mod.rs). Γ(stretch) = A; Γ(π) has χ = (2, 0) → A + B.
    let stretch = MemberSet {
        name: "O-O".into(),
        kind: SetKind::Stretch,
        members: vec![member("oo", &["E"], Some(&[1, 2]))],
    };
    let pi = MemberSet {
        name: "pi on O-O".into(),
        kind: SetKind::Pi,
        members: vec![member("p", &["E"], Some(&[2, 1]))],
    };
    let scalar = MemberSet {
        name: "s on O".into(),
        kind: SetKind::Scalar,
        members: vec![member("s1", &["E"], Some(&[1]))],
    };
    let a = analysis::analyze(&c2_peroxide(vec![stretch, pi, scalar])).unwrap();
    let sv = a.geometry.as_ref().unwrap().survey.as_ref().unwrap();
    assert_eq!(sv.group.name(), "C2", "the invented geometry is exactly C2");
    assert_eq!(a.sets[0].geometry_ticks.expected[0], Some(vec![true, true]));
    assert_eq!(a.sets[0].geometry_ticks.disagreements, vec![(0, 1)]);
    assert_eq!(
        a.sets[1].geometry_ticks.expected[0],
        Some(vec![true, false])
    );
    assert_eq!(a.sets[1].geometry_ticks.disagreements, vec![]);
    assert_eq!(gamma(&a, &a.sets[1]), "A + B");
    assert_eq!(
        a.sets[2].geometry_ticks.expected[0],
        Some(vec![true, false])
    );
}

#[test]
fn no_comparison_says_why_and_never_panics() {
    // No geometry at all.
    let mut sess = mx4_session("Td", vec![right_stretches()]);
    sess.geometry = None;
    let a = analysis::analyze(&sess).unwrap();
    let gt = &a.sets[0].geometry_ticks;
    assert_eq!(gt.compared(), 0);
    assert!(
        gt.reason.as_deref().unwrap().contains("no geometry"),
        "{gt:?}"
    );
    // The session's group is not the geometry's.
    let a = analysis::analyze(&mx4_session("D2d", vec![right_stretches()])).unwrap();
    let r = a.sets[0].geometry_ticks.reason.clone().unwrap();
    assert!(r.contains("Td") && r.contains("D2d"), "{r}");
    assert_eq!(a.sets[0].geometry_ticks.compared(), 0);
    // Members without atoms, an atom that does not exist, a count that does not fit the kind.
    let mut set = right_stretches();
    set.members[1].atoms = None;
    set.members[2].atoms = Some(vec![1, 9]);
    set.members[3].atoms = Some(vec![1, 5, 2]);
    let a = analysis::analyze(&mx4_session("Td", vec![set])).unwrap();
    let gt = &a.sets[0].geometry_ticks;
    assert_eq!(gt.compared(), 1);
    assert!(gt.expected[0].is_some());
    let r = gt.reason.clone().unwrap();
    assert!(r.contains("r2 names no atoms"), "{r}");
    assert!(
        r.contains("set 'Sn-Cl stretches', member 'r3': atom 9 does not exist")
            && r.contains("5 atoms"),
        "{r}"
    );
    assert!(r.contains("member 'r4'") && r.contains("3 named"), "{r}");
    // Atom 0 (only possible from code, the loader refuses it) is out of range too.
    let mut set = right_stretches();
    set.members[0].atoms = Some(vec![0, 2]);
    let a = analysis::analyze(&mx4_session("Td", vec![set])).unwrap();
    let r = a.sets[0].geometry_ticks.reason.clone().unwrap();
    assert!(r.contains("member 'r1': atom 0 does not exist"), "{r}");
}

fn screen(app: &mut App, w: u16, h: u16) -> String {
    app.screen = (w, h);
    let mut t = Terminal::new(TestBackend::new(w, h)).unwrap();
    t.draw(|f| ui::draw(f, app)).unwrap();
    let buf = t.backend().buffer().clone();
    let mut out = String::new();
    for y in 0..h {
        for x in 0..w {
            out.push_str(buf[(x, y)].symbol());
        }
        out.push('\n');
    }
    out
}

/// The workspace on the MX4 session with r4's σd tick missing.
fn wrong_app(ascii: bool) -> App {
    std::env::set_var(
        "SALCDESK_CACHE_DIR",
        std::env::temp_dir().join(format!("salcdesk-ticks-cache-{}", std::process::id())),
    );
    let mut set = right_stretches();
    set.members[3].unmoved_by = vec!["E".into()];
    // Monochrome (color = false): the contradicted cells must differ by glyph.
    let mut app = App::new(mx4_session("Td", vec![set]), None, ascii, false);
    app.finish_analysis();
    app
}

#[test]
fn the_members_panel_marks_the_cell_and_names_the_key() {
    for ascii in [false, true] {
        let mut app = wrong_app(ascii);
        assert_eq!(app.panel, Panel::Members);
        let s = screen(&mut app, 100, 24);
        if ascii {
            assert!(s.is_ascii(), "{s}");
        }
        let bad = if ascii { "!." } else { "!·" };
        assert_eq!(s.matches(bad).count(), 2, "the cell and the legend:\n{s}");
        let row = s.lines().find(|l| l.contains("r4")).unwrap();
        assert!(
            row.trim_end()
                .trim_end_matches(['│', '|'])
                .trim_end()
                .ends_with(bad),
            "{row}"
        );
        assert!(
            !s.lines().any(|l| l.contains("r1") && l.contains('!')),
            "{s}"
        );
        assert!(
            s.contains(
                "1 cell disagrees with the geometry (marked !): m takes the geometry's ticks"
            ),
            "{s}"
        );
    }
    // Once the ticks are right the line says so and no cell is marked.
    let mut app = wrong_app(false);
    app.handle_key(Key::ch('m'));
    let s = screen(&mut app, 100, 24);
    assert!(!s.contains("!·") && !s.contains("!●"), "{s}");
    assert!(
        s.contains("ticks agree with the geometry (4 members checked)"),
        "{s}"
    );
}

#[test]
fn the_take_key_fixes_the_tick_and_u_undoes_it() {
    let mut app = wrong_app(false);
    let (_, s) = app.current_set().unwrap();
    assert_eq!(s.geometry_ticks.disagreements, vec![(3, 4)]);
    assert!(!app.dirty());
    app.handle_key(Key::ch('m'));
    app.finish_analysis();
    let (a, s) = app.current_set().unwrap();
    assert_eq!(s.geometry_ticks.disagreements, vec![]);
    assert_eq!(gamma(a, s), "A1 + T2");
    assert_eq!(app.session.sets[0].members[3].unmoved_by, vec!["E", "6sd"]);
    // the other members' ticks are untouched, text and all
    assert_eq!(
        app.session.sets[0].members[0].unmoved_by,
        vec!["E", "8C3", "6sd"]
    );
    assert!(app.dirty());
    assert!(app
        .status
        .as_ref()
        .unwrap()
        .text
        .contains("1 cell(s) changed"));
    // A second press has nothing to change and makes no edit.
    let undo_depth = app.undo.len();
    app.handle_key(Key::ch('m'));
    assert_eq!(app.undo.len(), undo_depth);
    app.handle_key(Key::ch('u'));
    let (_, s) = app.current_set().unwrap();
    assert_eq!(s.geometry_ticks.disagreements, vec![(3, 4)]);
    assert!(!app.dirty());
}

#[test]
fn the_take_key_without_atoms_explains_and_changes_nothing() {
    let mut set = right_stretches();
    for m in &mut set.members {
        m.atoms = None;
    }
    set.members[0].unmoved_by = vec!["E".into()];
    let mut app = App::new(mx4_session("Td", vec![set]), None, false, false);
    app.handle_key(Key::ch('m'));
    assert!(!app.dirty());
    let st = app.status.clone().unwrap().text;
    assert!(st.contains("no member names its atoms"), "{st}");
}

#[test]
fn atoms_survive_a_save_and_a_reload_through_the_workspace() {
    let dir = std::env::temp_dir().join(format!("salcdesk-ticks-save-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    let p = dir.join("mx4.toml");
    let mut app = wrong_app(false);
    app.handle_key(Key::ch('m'));
    assert!(app.save_to(&p));
    let again = session::load_file(&p).unwrap();
    assert_eq!(again, app.session);
    assert_eq!(again.sets[0].members[2].atoms, Some(vec![1, 4]));
    let a = analysis::analyze(&again).unwrap();
    assert_eq!(a.sets[0].geometry_ticks.disagreements, vec![]);
}
