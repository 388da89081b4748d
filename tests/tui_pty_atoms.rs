//! End to end in a pseudo-terminal: a member set made from the molecule (`A` in Members) is
//! saved with its atoms, and the site-builder picker (`b` in Molecule) builds a molecule that
//! `u` takes back. The harness is in tests/common/pty.rs; the binary is ended by PID there.

#![cfg(unix)]

mod common;

use common::pty::Pty;
use common::{copy_session, TempDir};
use std::time::Duration;

#[test]
fn a_set_from_the_molecule_and_the_site_picker_in_a_real_terminal() {
    let dir = TempDir::new("pty-atoms");
    let p = copy_session("bipyramidal-mx5-geometry.toml", dir.path(), "mx5.toml");
    let mut run = Pty::spawn(
        dir.path(),
        &["open".as_ref(), p.as_os_str()],
        &[("SALCDESK_STATE_DIR", dir.join("state").as_os_str())],
    );
    run.wait_for("axial M-X stretches");
    run.keys("A");
    run.wait_for("New member set from the geometry");
    // The first line is the axial pair: Sb–Cl stretches, 2.34 Å (2).
    run.keys("\r");
    run.wait_for("r1 = Sb1–Cl2");
    run.keys("s");
    run.wait_for("saved");
    // Molecule: b opens the site picker; origin takes only an element.
    run.keys("6b");
    run.wait_for("Build a molecule in D3h");
    run.keys("\r");
    run.wait_for("origin: element");
    run.keys("Sb\r");
    run.wait_for("build the molecule now");
    run.keys("\r");
    run.wait_for("built 1 atoms");
    run.keys("u");
    run.wait_for("undone");
    run.keys("q");
    let e = run.wait_exit(Duration::from_secs(10));
    let code = e
        .unwrap_or_else(|| panic!("salcdesk did not quit; the screen:\n{}", run.text()))
        .code;
    assert_eq!(code, Some(0), "nothing unsaved after the undo");
    let saved = salcdesk::session::load_file(&p).unwrap();
    let set = saved.sets.last().unwrap();
    assert!(set.name.starts_with("Sb–Cl stretches"), "{}", set.name);
    assert_eq!(set.members[0].atoms, Some(vec![1, 2]));
    assert_eq!(set.members[1].atoms, Some(vec![1, 3]));
}
