//! The workspace ends cleanly when its terminal goes away or a signal asks it to, through a
//! real pseudo-terminal: the process is gone quickly, burns no CPU on the way out, rescues the
//! unsaved edits into the recovery file, gives the terminal back when it is still there, and
//! exits with 128 + the signal (a closed terminal counts as a hang-up: 129).
//!
//! Closing the pty's master is what a dropped SSH link or a killed multiplexer does: the
//! kernel hangs the terminal up (SIGHUP, then every read returns 0).
//!
//! The recovery file is also written every 2 s by the autosave, which would hide a broken
//! rescue. So the runs that check the rescue make one edit, wait for the autosave to write it
//! (its 2 s clock starts again there), make a second edit and end the process; when it ended
//! well within 2 s of that autosave, only the rescue on the way out can have written the
//! second edit. On a very busy machine a run can be too slow to tell; it is then repeated.

#![cfg(unix)]

mod common;

use common::pty::{rfind, Exit, Pty};
use common::{copy_session, TempDir};
use std::ffi::OsStr;
use std::path::{Path, PathBuf};
use std::time::{Duration, Instant};

/// The ticks of member `m` of the first set in the session file at `p`, if it loads.
fn ticks(p: &Path, m: usize) -> Option<Vec<String>> {
    let s = salcdesk::session::load_file(p).ok()?;
    Some(s.sets.first()?.members.get(m)?.unmoved_by.clone())
}

/// Wait until the file at `p` holds `want` as the ticks of member `m`; when that happened.
fn wait_ticks(p: &Path, m: usize, want: &[&str]) -> Instant {
    let t0 = Instant::now();
    loop {
        if ticks(p, m).is_some_and(|t| t == want) {
            return Instant::now();
        }
        assert!(
            t0.elapsed() < Duration::from_secs(20),
            "{} never held {want:?} for member {m}",
            p.display()
        );
        std::thread::sleep(Duration::from_millis(5));
    }
}

/// What a run opens.
enum Opened {
    /// A temporary copy of the puzzle session; the recovery file goes beside it.
    Puzzle,
    /// The built-in demo; the recovery file goes to `$XDG_STATE_HOME/salcdesk/`.
    Demo,
}

struct Case {
    dir: TempDir,
    run: Pty,
    /// Where the recovery file must appear.
    rec: PathBuf,
    /// The session file, when there is one.
    file: Option<PathBuf>,
}

/// Keys and screens of the two first edits of each session (hand-checked on the tables):
/// puzzle (C3v): r1 column 3σv → χ = (3, 0, 1) = A₁ + E; then r2 too → (3, 0, 2), not a
/// representation. Demo (Oh, χ = (6,0,0,2,2,0,0,0,4,2) = A₁g + Eg + T₁u): r1 column 8C₃ →
/// χ(8C₃) = 1, n(A₁g) = (48 + 8)/48 = 7/6; then r2 too → χ(8C₃) = 2, n(A₁g) = 4/3.
fn start(what: Opened) -> Case {
    let dir = TempDir::new("hangup");
    let state = dir.join("state");
    let home = dir.join("home");
    std::fs::create_dir_all(&home).unwrap();
    let (args, rec, file): (Vec<PathBuf>, PathBuf, Option<PathBuf>) = match what {
        Opened::Puzzle => {
            let p = copy_session("degenerate-puzzle.toml", dir.path(), "puzzle.toml");
            (
                vec!["open".into(), p.clone()],
                dir.join(".puzzle.toml.recovery"),
                Some(p),
            )
        }
        Opened::Demo => (vec![], state.join("salcdesk").join("demo.recovery"), None),
    };
    let args: Vec<&OsStr> = args.iter().map(|a| a.as_os_str()).collect();
    let run = Pty::spawn_with(dir.path(), &args, |cmd| {
        cmd.env("XDG_STATE_HOME", &state);
        cmd.env("HOME", &home);
        cmd.env_remove("SALCDESK_STATE_DIR");
        cmd.env_remove("SALCDESK_CACHE_DIR");
    });
    Case {
        dir,
        run,
        rec,
        file,
    }
}

const NOT_REP: &str = "not a representation";

/// The first edit, drawn.
fn first_edit(c: &mut Case, demo: bool) {
    if demo {
        c.run.wait_for_without("Γ = A₁g + Eg + T₁u", NOT_REP);
        c.run.keys("l ");
        c.run.wait_for("n(A₁g) = 7/6");
    } else {
        c.run.wait_for("not a representation of C3v");
        c.run.keys("ll ");
        c.run.wait_for_without("Γ = A₁ + E", NOT_REP);
    }
}

/// The second edit, drawn; the ticks of (member, expected) it leaves.
fn second_edit(c: &mut Case, demo: bool) -> (usize, Vec<&'static str>) {
    if demo {
        c.run.keys("j ");
        c.run.wait_for("n(A₁g) = 4/3");
        (1, vec!["E", "8C3", "3sh"])
    } else {
        c.run.keys("j ");
        c.run
            .wait_for_without("not a representation of C3v", "Γ = A₁ + E");
        (1, vec!["E", "3sv"])
    }
}

/// Wait up to `limit` for the exit, with the process killed (by the Drop) if it stays.
fn gone_within(c: &mut Case, limit: Duration, what: &str) -> Exit {
    match c.run.wait_exit(limit) {
        Some(e) => e,
        None => panic!(
            "salcdesk still running {limit:?} after {what}; the screen:\n{}",
            c.run.text()
        ),
    }
}

/// One run that ends by `end` after two edits. Returns whether it was quick enough after the
/// autosave that the second edit can only have come from the rescue on the way out.
fn rescue_run(what: Opened, end: &str, sig: Option<i32>, want_status: u32) -> bool {
    let demo = matches!(what, Opened::Demo);
    let mut c = start(what);
    first_edit(&mut c, demo);
    let first = if demo {
        (0, vec!["E", "8C3", "3sh"])
    } else {
        (0, vec!["E", "3sv"])
    };
    let autosaved = wait_ticks(&c.rec, first.0, &first.1);
    let (m, want) = second_edit(&mut c, demo);
    let cpu_before = c.run.cpu();
    let t_end = Instant::now();
    match sig {
        None => c.run.close_master(),
        Some(s) => c.run.signal(s),
    }
    let limit = if sig.is_none() {
        Duration::from_secs(2)
    } else {
        Duration::from_secs(1)
    };
    let exit = gone_within(&mut c, limit, end);
    let quick = exit.at.duration_since(autosaved) < Duration::from_millis(1500);
    eprintln!(
        "{end}: gone after {:?}, {:?} of CPU after the end",
        exit.at.duration_since(t_end),
        exit.cpu.saturating_sub(cpu_before)
    );

    assert_eq!(exit.signal, None, "{end}: ended by itself, not killed");
    assert_eq!(exit.code, Some(want_status), "{end}: exit status");
    assert!(exit.at.duration_since(t_end) <= limit);
    let after = exit.cpu.saturating_sub(cpu_before);
    assert!(
        after < Duration::from_millis(500),
        "{end}: {after:?} of CPU after the end"
    );
    // The edits are in the recovery file; the session file (if any) is untouched.
    assert!(c.rec.exists(), "{end}: recovery file {}", c.rec.display());
    if quick {
        assert_eq!(
            ticks(&c.rec, m).unwrap(),
            want,
            "{end}: second edit rescued"
        );
    }
    if let Some(f) = &c.file {
        assert_eq!(ticks(f, 0).unwrap(), ["E"], "{end}: session file untouched");
        assert_eq!(ticks(f, 1).unwrap(), ["E"], "{end}: session file untouched");
    }
    if sig.is_some() {
        // The terminal is still there: it is given back.
        let raw = c.run.all_output();
        let enter = rfind(&raw, b"\x1b[?1049h").expect("the alternate screen was used");
        let leave = rfind(&raw, b"\x1b[?1049l").expect("the alternate screen was left");
        assert!(enter < leave, "{end}: terminal restored");
        assert!(!c.run.screen().screen().alternate_screen());
        let text = c.run.text();
        assert!(text.contains("unsaved edits written to"), "{end}: {text}");
    }
    drop(c.dir);
    quick
}

fn repeat_until_quick(what: fn() -> Opened, end: &str, sig: Option<i32>, status: u32) {
    for attempt in 0..3 {
        if rescue_run(what(), end, sig, status) {
            return;
        }
        eprintln!("{end}, run {attempt}: ended too long after the autosave to tell; again");
    }
    panic!("{end}: three runs too slow to tell the rescue from the autosave");
}

#[test]
fn closing_the_terminal_of_a_session_rescues_the_edits_and_exits_129() {
    repeat_until_quick(|| Opened::Puzzle, "closing the pty", None, 129);
}

#[test]
fn closing_the_terminal_of_the_demo_rescues_into_the_state_folder() {
    repeat_until_quick(|| Opened::Demo, "closing the pty (demo)", None, 129);
}

#[test]
fn sigterm_sighup_sigint_end_the_session_with_128_plus_the_signal() {
    for (sig, name, status) in [
        (libc::SIGTERM, "SIGTERM", 143),
        (libc::SIGHUP, "SIGHUP", 129),
        (libc::SIGINT, "SIGINT", 130),
    ] {
        repeat_until_quick(|| Opened::Puzzle, name, Some(sig), status);
    }
}

#[test]
fn sigterm_while_idle_and_nothing_unsaved_ends_within_a_second() {
    let mut c = start(Opened::Puzzle);
    c.run.wait_for("not a representation of C3v");
    std::thread::sleep(Duration::from_millis(300));
    let t0 = Instant::now();
    c.run.signal(libc::SIGTERM);
    let exit = gone_within(&mut c, Duration::from_secs(1), "SIGTERM");
    assert!(exit.at.duration_since(t0) <= Duration::from_secs(1));
    assert_eq!(exit.code, Some(143));
    assert!(!c.rec.exists(), "nothing unsaved, no recovery file");
    c.run.all_output(); // everything it wrote, read to the end
    assert!(
        c.run.text().contains("nothing was unsaved"),
        "{}",
        c.run.text()
    );
}

/// A terminal that takes no output (frozen, or a link that stalls): the program blocks in a
/// write to it and cannot look at its signal flag; SIGTERM still ends it within a second (the
/// watchdog), with the unsaved edit rescued.
#[test]
fn sigterm_ends_a_workspace_blocked_on_a_frozen_terminal() {
    let mut c = start(Opened::Puzzle);
    first_edit(&mut c, false);
    c.run.pause_reading(true);
    // Panel switches (whole screens redrawn) until the pty's buffer is full and a draw blocks.
    let t0 = Instant::now();
    let mut blocked = false;
    let mut n = 0;
    while t0.elapsed() < Duration::from_secs(10) && !blocked {
        n += 1;
        c.run.keys(if n % 2 == 0 { "2" } else { "3" });
        std::thread::sleep(Duration::from_millis(20));
        let wchan = std::fs::read_to_string(format!("/proc/{}/wchan", c.run.pid));
        let stat = std::fs::read_to_string(format!("/proc/{}/stat", c.run.pid));
        // Sleeping in the terminal's write (n_tty_write waits in wait_woken).
        blocked = wchan.is_ok_and(|w| w.contains("wait_woken") || w.contains("tty_write"))
            && stat.is_ok_and(|s| s.contains(") S "));
    }
    eprintln!(
        "blocked in a terminal write: {blocked}; wchan {:?}, {} bytes read",
        std::fs::read_to_string(format!("/proc/{}/wchan", c.run.pid)),
        c.run.raw().len()
    );
    let rescued_before = c.rec.exists();
    let t_end = Instant::now();
    c.run.signal(libc::SIGTERM);
    let exit = gone_within(
        &mut c,
        Duration::from_secs(1),
        "SIGTERM on a frozen terminal",
    );
    eprintln!(
        "frozen terminal: gone after {:?} (recovery file there before: {rescued_before})",
        exit.at.duration_since(t_end)
    );
    assert_eq!(exit.code, Some(143));
    assert_eq!(ticks(&c.rec, 0).unwrap(), ["E", "3sv"], "edit rescued");
    c.run.pause_reading(false);
}

/// A recovery file that cannot be written is said on stderr (here the terminal) on the way out.
#[test]
fn a_rescue_that_cannot_be_written_is_said_and_does_not_panic() {
    let dir = TempDir::new("hangup-unwritable");
    let blocker = dir.join("not-a-folder");
    std::fs::write(&blocker, "a file").unwrap();
    let mut run = Pty::spawn_with(dir.path(), &[], |cmd| {
        cmd.env("XDG_STATE_HOME", blocker.join("state"));
        cmd.env("HOME", blocker.join("home"));
        cmd.env_remove("SALCDESK_STATE_DIR");
        cmd.env_remove("SALCDESK_CACHE_DIR");
    });
    run.wait_for_without("Γ = A₁g + Eg + T₁u", NOT_REP);
    run.keys("l ");
    run.wait_for("n(A₁g) = 7/6");
    run.signal(libc::SIGTERM);
    let exit = run
        .wait_exit(Duration::from_secs(1))
        .expect("gone within 1 s");
    assert_eq!(exit.code, Some(143));
    run.all_output(); // everything it wrote, read to the end
    let text = run.text();
    assert!(text.contains("could NOT be written"), "{text}");
    assert!(!text.contains("panicked"), "{text}");
}

/// The next start of the demo says where the rescued edits are and offers them back.
#[test]
fn the_next_start_of_the_demo_offers_the_rescued_edits() {
    let mut c = start(Opened::Demo);
    first_edit(&mut c, true);
    c.run.close_master();
    let exit = gone_within(&mut c, Duration::from_secs(2), "closing the pty (demo)");
    assert_eq!(exit.code, Some(129));
    assert!(c.rec.exists());
    let state = c.dir.join("state");
    let home = c.dir.join("home");
    let mut again = Pty::spawn_with(c.dir.path(), &[], |cmd| {
        cmd.env("XDG_STATE_HOME", &state);
        cmd.env("HOME", &home);
        cmd.env_remove("SALCDESK_STATE_DIR");
        cmd.env_remove("SALCDESK_CACHE_DIR");
    });
    again.wait_for("Unsaved edits found");
    // The dialog names the folder (the path may be wrapped across lines).
    assert!(again.text().contains("demo.recovery"), "{}", again.text());
    again.keys("r");
    again.wait_for("n(A₁g) = 7/6");
    again.keys("q");
    again.wait_for("Unsaved edits");
    again.keys("d");
    let e = again.wait_exit(Duration::from_secs(5)).expect("quit");
    assert_eq!(e.code, Some(0));
}

/// (a) twenty times over: every process is gone within 2 s, none survives.
#[test]
fn twenty_hangups_leave_no_process_behind() {
    let mut pids = Vec::new();
    for round in 0..20 {
        let mut c = start(Opened::Puzzle);
        first_edit(&mut c, false);
        let before = c.run.cpu();
        c.run.close_master();
        let exit = gone_within(&mut c, Duration::from_secs(2), &format!("hang-up {round}"));
        assert_eq!(exit.code, Some(129), "round {round}");
        assert!(
            exit.cpu.saturating_sub(before) < Duration::from_millis(500),
            "round {round}: CPU after the close"
        );
        assert!(c.rec.exists(), "round {round}: recovery file");
        pids.push(c.run.pid);
    }
    // None of them is a process any more: each was seen to exit and was reaped, so /proc
    // has no salcdesk under that number (unless the number was reused by another program).
    for pid in &pids {
        let cmd = std::fs::read_to_string(format!("/proc/{pid}/cmdline")).unwrap_or_default();
        assert!(!cmd.contains("salcdesk"), "pid {pid} survived: {cmd:?}");
    }
}
