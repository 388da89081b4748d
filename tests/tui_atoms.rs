//! The workspace keys for members tied to atoms (`A`, `@` in Members) and the site-builder
//! picker (`b` in Molecule), driven through `App` without a terminal: each edit is undoable,
//! saved, and every prompt fits 80 columns.

use salcdesk::analysis::set_salcs;
use salcdesk::session::{self, Session, SetKind};
use salcdesk::tui::app::Mode;
use salcdesk::tui::keymap::{Code, Key};
use salcdesk::tui::text::width;
use salcdesk::tui::{Action, App, Panel};
use std::path::{Path, PathBuf};

fn tmpdir(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("salcdesk-atoms-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap();
    std::env::set_var(
        "SALCDESK_CACHE_DIR",
        std::env::temp_dir().join(format!("salcdesk-atoms-cache-{}", std::process::id())),
    );
    d
}

fn mx5(name: &str) -> (App, PathBuf) {
    let dir = tmpdir(name);
    let p = dir.join("mx5.toml");
    std::fs::copy(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions/bipyramidal-mx5-geometry.toml"),
        &p,
    )
    .unwrap();
    let s = session::load_file(&p).unwrap();
    let mut app = App::new(s, Some(p.clone()), false, false);
    app.finish_analysis();
    (app, p)
}

fn typed(app: &mut App, text: &str) {
    app.handle_key(Key::ctrl('u'));
    for c in text.chars() {
        app.handle_key(Key::ch(c));
    }
    app.handle_key(Key::plain(Code::Enter));
}

/// Move the picker's cursor to the first line containing `what` and take it.
fn pick(app: &mut App, what: &str) {
    let Mode::Pick(p) = &app.mode else {
        panic!("no picker: {:?}", app.mode)
    };
    let k = p
        .items
        .iter()
        .position(|i| i.contains(what))
        .unwrap_or_else(|| panic!("no '{what}' in {:?}", p.items));
    let from = p.cursor;
    for _ in from..k {
        app.handle_key(Key::plain(Code::Down));
    }
    app.handle_key(Key::plain(Code::Enter));
}

#[test]
fn a_set_from_the_geometry_is_made_undone_and_saved() {
    let (mut app, p) = mx5("offer");
    app.apply(Action::GoPanel(Panel::Members));
    let before = app.session.sets.len();
    app.handle_key(Key::ch('A'));
    assert!(matches!(app.mode, Mode::Pick(_)));
    pick(&mut app, "ligand π");
    assert_eq!(app.session.sets.len(), before + 1);
    let set = app.session.sets.last().unwrap().clone();
    assert_eq!(set.kind, SetKind::Pi);
    assert_eq!(app.members_ui.set, before, "the cursor is on the new set");
    // The axial pair of D3h MX5 comes first (its atoms 2 and 3 sit on C3, the z axis).
    assert_eq!(set.members.len(), 2);
    assert!(set
        .members
        .iter()
        .all(|m| m.atoms.as_ref().unwrap()[0] == 1));
    // Two axial π pairs in D3h: E' + E'' — four SALCs (Cotton, 3rd ed., §8.5, the axial
    // ligands of a trigonal bipyramid; from memory).
    app.finish_analysis();
    let a = app.analysis.as_ref().unwrap().clone();
    let r = set_salcs::set_salcs(&set, a.geometry.as_ref(), false).unwrap();
    let ss = r.as_ref().as_ref().unwrap();
    let labels: Vec<&str> = ss.salcs.salcs.iter().map(|s| s.label.as_str()).collect();
    assert_eq!(labels, ["E'", "E'", "E''", "E''"]);
    // Saved with its atoms; undo takes it away.
    app.handle_key(Key::ch('s'));
    let back = session::load_file(&p).unwrap();
    assert_eq!(back.sets.last(), Some(&set));
    app.handle_key(Key::ch('u'));
    assert_eq!(app.session.sets.len(), before);
    // Esc leaves the picker without a change.
    app.handle_key(Key::ch('A'));
    app.handle_key(Key::plain(Code::Esc));
    assert_eq!(app.mode, Mode::Normal);
    assert_eq!(app.session.sets.len(), before);
}

#[test]
fn a_members_atoms_are_changed_in_place_and_checked() {
    let (mut app, _) = mx5("atoms");
    app.apply(Action::GoPanel(Panel::Members));
    // Set 1 is the axial pair: r1 = [1, 2]. Move it onto the equatorial Cl on +x (atom 4):
    // its ticks become those of an equatorial bond, E, C2, σh, σv (Cotton, D3h table: the C2
    // and σv through +x are the class's chosen operations, as the session notes say).
    app.handle_key(Key::ch('@'));
    let Mode::Field(f) = &app.mode else {
        panic!("no field")
    };
    assert_eq!(f.text, "1-2", "starts from the member's atoms");
    assert!(width(&f.label) <= 78, "{}", f.label);
    typed(&mut app, "1-4");
    let m = &app.session.sets[0].members[0];
    assert_eq!(m.atoms, Some(vec![1, 4]));
    assert_eq!(m.unmoved_by, ["E", "3C2", "sh", "3sv"]);
    // Bad atoms keep the member as it was, with a message.
    app.handle_key(Key::ch('@'));
    typed(&mut app, "1-9");
    assert_eq!(app.session.sets[0].members[0].atoms, Some(vec![1, 4]));
    let st = app.status.clone().unwrap();
    assert!(
        st.error && st.text.contains("atom 9 does not exist"),
        "{}",
        st.text
    );
    app.handle_key(Key::ch('@'));
    typed(&mut app, "2-3");
    assert!(app.status.clone().unwrap().text.contains("not bonded"));
    // Undo brings the old atoms and ticks back.
    app.handle_key(Key::ch('u'));
    let m = &app.session.sets[0].members[0];
    assert_eq!(m.atoms, Some(vec![1, 2]));
    assert_eq!(m.unmoved_by, ["E", "2C3", "3sv"]);
}

#[test]
fn the_site_picker_builds_several_site_sets_at_once() {
    let s = Session {
        group: Some("D4h".into()),
        ..Session::default()
    };
    let _ = tmpdir("sites");
    let mut app = App::new(s, None, false, false);
    app.apply(Action::GoPanel(Panel::Molecule));
    app.handle_key(Key::ch('b'));
    // Esc cancels.
    app.handle_key(Key::plain(Code::Esc));
    assert_eq!(app.mode, Mode::Normal);
    app.handle_key(Key::ch('b'));
    let Mode::Pick(p) = &app.mode else { panic!() };
    // D4h: the square set of four on the C2 axes in σh (Cotton, D4h ML4).
    assert!(
        p.items
            .iter()
            .any(|i| i.contains("4 sites: square in the σh plane")),
        "{:?}",
        p.items
    );
    pick(&mut app, "origin");
    typed(&mut app, "Pt");
    pick(&mut app, "square");
    typed(&mut app, "Cl 2.3");
    assert!(app.session.geometry.is_none(), "nothing built before asked");
    pick(&mut app, "build the molecule now");
    let Some(session::Geometry {
        source: session::GeometrySource::Atoms(atoms),
        ..
    }) = &app.session.geometry
    else {
        panic!("built")
    };
    assert_eq!(atoms.len(), 5);
    app.handle_key(Key::ch('u'));
    assert!(app.session.geometry.is_none(), "u undoes the build");
}

#[test]
fn site_prompts_fit_80_columns_in_every_group_with_sites() {
    for g in ["C1", "C2v", "D3h", "D4h", "Td", "Oh", "Ih", "D6h", "C3v"] {
        let s = Session {
            group: Some(g.into()),
            ..Session::default()
        };
        let mut app = App::new(s, None, false, false);
        app.apply(Action::GoPanel(Panel::Molecule));
        app.handle_key(Key::ch('b'));
        let Mode::Pick(p) = app.mode.clone() else {
            panic!("{g}: no picker")
        };
        if ["D3h", "D4h", "C2v", "C3v"].contains(&g) {
            // Each site type reads differently (the two C2 triangles of D3h point opposite
            // ways; the two squares of D4h lie on the axes and between them — common practice).
            let mut seen: Vec<&str> = p
                .items
                .iter()
                .map(|i| i.split_once(" — ").unwrap().1)
                .collect();
            seen.sort();
            seen.dedup();
            assert_eq!(seen.len(), p.items.len(), "{g}: {:?}", p.items);
        }
        for k in 0..p.items.len() {
            app.mode = Mode::Pick(p.clone());
            pick(&mut app, &p.items[k].clone());
            let Mode::Field(f) = &app.mode else {
                panic!("{g}: no field for {}", p.items[k])
            };
            // The question takes the status line: it must fit 80 columns with its colon.
            assert!(width(&f.label) < 80, "{g}: {}", f.label);
            app.handle_key(Key::plain(Code::Esc));
        }
    }
}

fn screen(app: &mut App, w: u16, h: u16) -> String {
    use ratatui::{backend::TestBackend, Terminal};
    app.screen = (w, h);
    let mut t = Terminal::new(TestBackend::new(w, h)).unwrap();
    t.draw(|f| salcdesk::tui::ui::draw(f, app)).unwrap();
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

#[test]
fn the_legend_the_picker_and_the_set_salcs_are_on_screen_at_80x24() {
    let (mut app, _) = mx5("screen");
    app.apply(Action::GoPanel(Panel::Members));
    // The legend says what each member is: r1 joins Sb1 and the axial Cl2.
    let s = screen(&mut app, 80, 24);
    assert!(s.contains("r1 = Sb1–Cl2"), "{s}");
    app.handle_key(Key::ch('A'));
    let s = screen(&mut app, 80, 24);
    assert!(s.contains("New member set from the geometry"), "{s}");
    assert!(s.contains("Sb–Cl stretches, 2.34 Å (2)"), "{s}");
    pick(&mut app, "ligand σ");
    app.finish_analysis();
    app.apply(Action::GoPanel(Panel::Combinations));
    let s = screen(&mut app, 80, 24);
    // Two axial σ ligands of D3h: A1′ 1/√2(σ1 + σ2) and A2″ 1/√2(σ1 − σ2) (Cotton, 3rd ed.,
    // §8.5, trigonal bipyramid; from memory).
    assert!(s.contains("SALCs of set 3/3"), "{s}");
    assert!(s.contains("A₁′") && s.contains("A₂″"), "{s}");
    assert!(
        s.contains("1/√2 (σ₁ + σ₂)") && s.contains("1/√2 (σ₁ − σ₂)"),
        "{s}"
    );
}
