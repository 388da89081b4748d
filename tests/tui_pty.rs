//! End to end: the real binary in a pseudo-terminal. Open a session, tick a cell, see the
//! reduction change, save, quit, open it again and find the edit; the terminal is given back
//! (alternate screen left) when the program ends. (The pty harness is in tests/common/pty.rs;
//! losing the terminal and signals are in tests/tui_hangup.rs.)

#![cfg(unix)]

mod common;

use common::pty::Pty;
use common::{copy_session, TempDir};
use std::path::Path;
use std::time::Duration;

fn start(dir: &TempDir, session: &Path) -> Pty {
    Pty::spawn(
        dir.path(),
        &["open".as_ref(), session.as_os_str()],
        &[("SALCDESK_STATE_DIR", dir.join("state").as_os_str())],
    )
}

/// Wait for the exit; the exit status.
fn exit_code(run: &mut Pty) -> Option<u32> {
    let e = run.wait_exit(Duration::from_secs(10));
    e.unwrap_or_else(|| panic!("salcdesk did not quit; the screen:\n{}", run.text()))
        .code
}

#[test]
fn tick_save_quit_reopen_in_a_real_terminal() {
    let dir = TempDir::new("pty-save");
    let p = copy_session("degenerate-puzzle.toml", dir.path(), "puzzle.toml");
    let mut run = start(&dir, &p);
    run.wait_for("not a representation of C3v");
    // r1, column 3σv: two steps right, then Space.
    run.keys("ll");
    run.keys(" ");
    // Hand calculation: χ = (3, 0, 1) → A1 + E (see tests/tui_state.rs).
    run.wait_for("Γ = A₁ + E");
    run.wait_for("[modified]");
    run.keys("s");
    run.wait_for("saved");
    run.keys("q");
    assert_eq!(exit_code(&mut run), Some(0));
    let raw = run.all_output();
    let tail = String::from_utf8_lossy(&raw[raw.len().saturating_sub(200)..]).to_string();
    assert!(
        tail.contains("\x1b[?1049l"),
        "the alternate screen was left: {tail:?}"
    );

    let saved = salcdesk::session::load_file(&p).unwrap();
    assert_eq!(saved.sets[0].members[0].unmoved_by, vec!["E", "3sv"]);

    let mut again = start(&dir, &p);
    again.wait_for("Γ = A₁ + E");
    assert!(!again.text().contains("[modified]"));
    again.keys("q");
    assert_eq!(exit_code(&mut again), Some(0));
}

#[test]
fn a_hangup_keeps_the_edits_and_the_next_start_offers_them() {
    let dir = TempDir::new("pty-hangup");
    let p2 = copy_session("degenerate-puzzle.toml", dir.path(), "hangup.toml");
    let mut run = start(&dir, &p2);
    run.wait_for("not a representation of C3v");
    run.keys("ll ");
    run.wait_for("Γ = A₁ + E");
    // The SSH connection drops: SIGHUP; the status says so (128 + 1).
    run.signal(libc::SIGHUP);
    assert_eq!(exit_code(&mut run), Some(129));
    let raw = run.all_output();
    let tail = String::from_utf8_lossy(&raw[raw.len().saturating_sub(300)..]).to_string();
    assert!(tail.contains("\x1b[?1049l"), "terminal restored: {tail:?}");
    // The session file is untouched; the edit waits in the recovery file beside it.
    let on_disk = salcdesk::session::load_file(&p2).unwrap();
    assert_eq!(on_disk.sets[0].members[0].unmoved_by, vec!["E"]);
    let rec = p2.with_file_name(".hangup.toml.recovery");
    assert!(rec.exists(), "recovery file written");

    let mut again = start(&dir, &p2);
    again.wait_for("Unsaved edits found");
    again.keys("r");
    again.wait_for("Γ = A₁ + E");
    again.keys("s");
    again.wait_for("saved");
    again.keys("q");
    assert_eq!(exit_code(&mut again), Some(0));
    assert!(!rec.exists(), "a save clears the recovery file");
}
