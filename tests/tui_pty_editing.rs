//! The real binary in a pseudo-terminal (80×24; tests/common/pty.rs kills it by PID if a test
//! fails half-way): observed bands added, changed and deleted, saved, and found as edited by
//! a new process; only the 16 basic colours on the wire; plain ASCII without colour on
//! limited terminals; a mouse click ticks a cell.

#![cfg(unix)]

mod common;

use common::pty::Pty;
use common::{copy_session, TempDir};
use salcdesk::session::{self, Polarization, Technique};
use std::ffi::OsStr;
use std::path::Path;
use std::time::Duration;

fn start(dir: &Path, file: &Path, term: &str) -> Pty {
    let cache = dir.join("cache");
    Pty::spawn(
        dir,
        &[OsStr::new("open"), file.as_os_str()],
        &[
            ("SALCDESK_CACHE_DIR", cache.as_os_str()),
            ("TERM", OsStr::new(term)),
        ],
    )
}

fn quit(run: &mut Pty) {
    run.keys("q");
    let e = run
        .wait_exit(Duration::from_secs(10))
        .unwrap_or_else(|| panic!("salcdesk did not quit; the screen:\n{}", run.text()));
    assert_eq!(e.code, Some(0), "{e:?}");
}

/// Every SGR sequence (`ESC [ … m`) in the output, as its parameter lists.
fn sgr_params(raw: &[u8]) -> Vec<Vec<u32>> {
    let mut out = Vec::new();
    let mut i = 0;
    while i + 1 < raw.len() {
        if raw[i] == 0x1b && raw[i + 1] == b'[' {
            let body = &raw[i + 2..];
            let n = body
                .iter()
                .take_while(|c| c.is_ascii_digit() || **c == b';')
                .count();
            if body.get(n) == Some(&b'm') {
                let params = std::str::from_utf8(&body[..n]).unwrap();
                out.push(
                    params
                        .split(';')
                        .map(|p| p.parse::<u32>().unwrap_or(0))
                        .collect(),
                );
            }
            i += 2 + n;
        } else {
            i += 1;
        }
    }
    out
}

/// SGR colour parameters: the basic 8 and their bright forms, front and back (ECMA-48 and
/// the aixterm bright codes, common practice), and the defaults 39/49; 38 and 48 (indexed
/// or true colour) are the ones that must never appear.
fn colour_param(p: u32) -> bool {
    matches!(p, 30..=49 | 90..=97 | 100..=107)
}

fn basic_colour(p: u32) -> bool {
    matches!(p, 30..=37 | 39 | 40..=47 | 49 | 90..=97 | 100..=107)
}

#[test]
fn bands_added_changed_and_deleted_are_saved_and_found_by_a_new_process() {
    let dir = TempDir::new("pty-bands");
    let p = copy_session("degenerate-puzzle.toml", dir.path(), "puzzle.toml");
    let mut run = start(dir.path(), &p, "xterm-256color");
    run.wait_for("not a representation of C3v");
    run.keys("5G");
    run.wait_for("Observed bands (0)");
    for (typed, done) in [
        ("505 Raman vs p", "band 1 added"),
        ("320 IR m", "band 2 added"),
        ("1020.5 Raman w dp ring breathing", "band 3 added"),
    ] {
        run.keys("+");
        run.wait_for("New band");
        run.keys(&format!("{typed}\r"));
        run.wait_for(done);
    }
    run.keys("G");
    run.wait_for("Observed bands (3)");
    // Change band 1: the field starts from the band as typed; Ctrl-u clears it.
    run.keys("c");
    run.wait_for("Change band number");
    run.keys("1\r");
    run.wait_for("> 505 Raman vs p");
    run.keys("\x15480 IR s\r");
    run.wait_for("band 1 is now 480 IR s");
    // Delete band 2.
    run.keys("x");
    run.wait_for("Remove band number");
    run.keys("2\r");
    run.wait_for("band 2 removed: 320 IR m");
    run.wait_for("Observed bands (2)");
    run.keys("s");
    run.wait_for("saved");
    quit(&mut run);
    let raw = run.all_output();
    drop(run);

    // Only the 16 basic colours went over the wire, and some did.
    let sgr = sgr_params(&raw);
    for params in &sgr {
        for p in params.iter().filter(|p| colour_param(**p)) {
            assert!(basic_colour(*p), "SGR {params:?} is not a basic colour");
        }
    }
    assert!(
        sgr.iter().flatten().any(|p| *p == 36),
        "no basic colour at all"
    );

    let saved = session::load_file(&p).unwrap();
    assert_eq!(saved.bands.len(), 2);
    let (a, b) = (&saved.bands[0], &saved.bands[1]);
    assert_eq!((a.position, a.technique), (480.0, Technique::Ir));
    assert_eq!((a.intensity.as_str(), a.polarization), ("s", None));
    assert_eq!((b.position, b.technique), (1020.5, Technique::Raman));
    assert_eq!(b.polarization, Some(Polarization::Depolarized));
    assert_eq!(
        (b.intensity.as_str(), b.note.as_str()),
        ("w", "ring breathing")
    );

    let mut again = start(dir.path(), &p, "xterm-256color");
    again.wait_for("not a representation of C3v");
    again.keys("5G");
    again.wait_for("Observed bands (2)");
    let text = again.text();
    assert!(text.contains("480") && text.contains("1020.5"), "{text}");
    assert!(!text.contains("320"), "{text}");
    assert!(!text.contains("[modified]"), "{text}");
    quit(&mut again);
}

/// `dumb`, `vt100` and the Linux console: not one byte outside ASCII and no colour code
/// (bold and reverse attributes may stay).
#[test]
fn limited_terminals_get_plain_ascii_without_colour() {
    for term in ["dumb", "vt100", "linux"] {
        let dir = TempDir::new(&format!("pty-{term}"));
        let p = copy_session("demo-octahedral-centre.toml", dir.path(), "oh.toml");
        let mut run = start(dir.path(), &p, term);
        run.wait_for("Members");
        run.keys("3");
        run.wait_for("chi");
        run.keys("?");
        run.wait_for("Everywhere");
        run.keys("\x1b");
        std::thread::sleep(Duration::from_millis(300));
        quit(&mut run);
        let raw = run.all_output();
        if let Some(b) = raw.iter().position(|b| !b.is_ascii()) {
            let from = b.saturating_sub(40);
            panic!(
                "{term}: a byte outside ASCII at {b}: {:?}",
                String::from_utf8_lossy(&raw[from..(b + 8).min(raw.len())])
            );
        }
        for params in sgr_params(&raw) {
            assert!(
                !params
                    .iter()
                    .any(|p| colour_param(*p) && *p != 39 && *p != 49),
                "{term}: colour in SGR {params:?}"
            );
        }
    }
}

/// A left click on a cell of the tick grid ticks it: the puzzle's missing σv tick of r1
/// (C3v: the stretches then span A1 + E; Cotton, §4.3 reduction formula).
#[test]
fn a_mouse_click_ticks_a_cell() {
    let dir = TempDir::new("pty-mouse");
    let p = copy_session("degenerate-puzzle.toml", dir.path(), "puzzle.toml");
    let mut run = start(dir.path(), &p, "xterm-256color");
    run.wait_for("not a representation of C3v");
    // Members pane at 80x24: first member row at y = 5, the 3σv column at x = 20 (0-based;
    // tests/tui_state.rs measures the same cell); SGR mouse reports count from 1.
    run.keys("\x1b[<0;21;6M\x1b[<0;21;6m");
    run.wait_for_without("A₁ + E", "not a representation");
    run.keys("q");
    run.wait_for("Unsaved edits");
    run.keys("d");
    let e = run.wait_exit(Duration::from_secs(10)).expect("an exit");
    assert_eq!(e.code, Some(0));
}
