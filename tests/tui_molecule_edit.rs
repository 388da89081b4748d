//! The workspace's molecule edits driven by keys: bonds removed and added with their symmetry
//! images, a molecule built from the group's sites, and the worked projection's member/irrep
//! choice in Combinations.

use salcdesk::session::{self, GeometrySource};
use salcdesk::tui::keymap::{Code, Key};
use salcdesk::tui::{App, Panel};
use std::path::Path;

fn mx5() -> App {
    std::env::set_var(
        "SALCDESK_CACHE_DIR",
        std::env::temp_dir().join(format!("salcdesk-moledit-{}", std::process::id())),
    );
    let s = session::load_file(
        &Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions/bipyramidal-mx5-geometry.toml"),
    )
    .unwrap();
    let mut app = App::new(s, None, false, false);
    app.finish_analysis();
    app
}

fn typed(app: &mut App, text: &str) {
    for c in text.chars() {
        app.handle_key(Key::ch(c));
    }
    app.handle_key(Key::plain(Code::Enter));
    app.finish_analysis();
}

fn survey_bonds(app: &App) -> usize {
    let a = app.analysis.as_ref().unwrap();
    a.geometry
        .as_ref()
        .unwrap()
        .survey
        .as_ref()
        .unwrap()
        .bonds
        .len()
}

#[test]
fn removing_one_axial_bond_removes_its_image_and_undo_brings_both_back() {
    let mut app = mx5();
    app.handle_key(Key::ch('6'));
    assert_eq!(app.panel, Panel::Molecule);
    assert_eq!(survey_bonds(&app), 5);
    app.handle_key(Key::ch('x'));
    typed(&mut app, "1-2");
    // The two axial bonds are one symmetry-equivalent set in D3h (σh exchanges them).
    let g = app.session.geometry.as_ref().unwrap();
    assert_eq!(g.remove_bonds, vec![[1, 2], [1, 3]]);
    assert_eq!(survey_bonds(&app), 3);
    app.handle_key(Key::ch('u'));
    app.finish_analysis();
    assert!(app
        .session
        .geometry
        .as_ref()
        .unwrap()
        .remove_bonds
        .is_empty());
    assert_eq!(survey_bonds(&app), 5);
    // Adding back what was removed cancels the removal instead of recording both.
    app.handle_key(Key::ch('x'));
    typed(&mut app, "1-4");
    assert_eq!(
        survey_bonds(&app),
        2,
        "the three equatorial bonds went together"
    );
    app.handle_key(Key::ch('+'));
    typed(&mut app, "1-5");
    let g = app.session.geometry.as_ref().unwrap();
    assert!(g.add_bonds.is_empty() && g.remove_bonds.is_empty(), "{g:?}");
    assert_eq!(survey_bonds(&app), 5);
}

#[test]
fn a_bad_bond_is_refused_with_a_message_and_no_edit() {
    let mut app = mx5();
    app.handle_key(Key::ch('6'));
    let before = app.session.clone();
    app.handle_key(Key::ch('+'));
    typed(&mut app, "1to2");
    assert_eq!(app.session, before);
    let st = app.status.as_ref().expect("a message");
    assert!(st.error && st.text.contains("1to2"), "{:?}", st);
}

/// Take the first line of the open picker that contains `what`.
fn pick(app: &mut App, what: &str) {
    let salcdesk::tui::app::Mode::Pick(p) = &app.mode else {
        panic!("no picker: {:?}", app.mode)
    };
    let k = p.items.iter().position(|i| i.contains(what)).unwrap();
    for _ in p.cursor..k {
        app.handle_key(Key::plain(Code::Down));
    }
    app.handle_key(Key::plain(Code::Enter));
}

#[test]
fn building_from_sites_replaces_the_geometry_undoably() {
    let mut app = mx5();
    app.handle_key(Key::ch('6'));
    app.handle_key(Key::ch('b'));
    pick(&mut app, "origin");
    typed(&mut app, "Sb");
    pick(&mut app, "axis1 ");
    typed(&mut app, "F 1.9");
    pick(&mut app, "axis2 ");
    typed(&mut app, "F 1.85");
    pick(&mut app, "build the molecule now");
    app.finish_analysis();
    let Some(GeometrySource::Atoms(atoms)) = app.session.geometry.as_ref().map(|g| &g.source)
    else {
        panic!("inline atoms expected")
    };
    assert_eq!(atoms.len(), 6);
    assert!(atoms.iter().skip(1).all(|a| a.element == "F"));
    assert!(app
        .session
        .notes
        .contains("Sb@origin F@axis1:1.9 F@axis2:1.85"));
    let a = app.analysis.as_ref().unwrap();
    let sv = a.geometry.as_ref().unwrap().survey.as_ref().unwrap();
    assert_eq!(sv.group.name(), "D3h");
    app.handle_key(Key::ch('u'));
    let Some(GeometrySource::Atoms(atoms)) = app.session.geometry.as_ref().map(|g| &g.source)
    else {
        panic!("inline atoms expected")
    };
    assert_eq!(atoms[1].element, "Cl", "undo restores the old geometry");
    // An axis site without its distance, or a word that is no element, says so and changes
    // nothing (the question stays open with what was typed).
    let before = app.session.clone();
    app.handle_key(Key::ch('b'));
    pick(&mut app, "axis1 ");
    typed(&mut app, "F");
    assert_eq!(app.session, before);
    assert!(app.status.as_ref().unwrap().error);
    app.handle_key(Key::ctrl('u'));
    typed(&mut app, "Qq 2");
    assert!(app.status.as_ref().unwrap().text.contains("not an element"));
    app.handle_key(Key::plain(Code::Esc));
    assert_eq!(app.session, before);
}

#[test]
fn m_and_i_walk_the_generating_members_and_irreps() {
    let mut app = mx5();
    app.handle_key(Key::ch('4'));
    assert_eq!(app.panel, Panel::Combinations);
    // Two bond sets of 2 and 3 members: five generating members in all.
    assert_eq!(app.generators().len(), 5);
    for k in 1..=5 {
        app.handle_key(Key::ch('m'));
        assert_eq!(app.combos_ui.member, k % 5);
        assert_eq!(
            app.combos_ui.irrep, 0,
            "a new member starts at its first irrep"
        );
    }
    app.handle_key(Key::ch('i'));
    assert_eq!(app.combos_ui.irrep, 1);
}
