//! End to end: the real binary in a pseudo-terminal. Open a session, tick a cell, see the
//! reduction change, save, quit, open it again and find the edit; the terminal is given back
//! (alternate screen left) when the program ends.

#![cfg(unix)]

use portable_pty::{native_pty_system, CommandBuilder, PtySize};
use std::io::{Read, Write};
use std::path::{Path, PathBuf};
use std::sync::{Arc, Mutex};
use std::time::{Duration, Instant};

struct Run {
    screen: Arc<Mutex<vt100::Parser>>,
    raw: Arc<Mutex<Vec<u8>>>,
    writer: Box<dyn Write + Send>,
    child: Box<dyn portable_pty::Child + Send + Sync>,
}

impl Run {
    fn start(session: &Path, cache: &Path) -> Run {
        let pty = native_pty_system()
            .openpty(PtySize {
                rows: 24,
                cols: 80,
                pixel_width: 0,
                pixel_height: 0,
            })
            .expect("a pseudo-terminal");
        let mut cmd = CommandBuilder::new(env!("CARGO_BIN_EXE_salcdesk"));
        cmd.arg("open");
        cmd.arg(session);
        cmd.env("TERM", "xterm-256color");
        cmd.env("SALCDESK_CACHE_DIR", cache);
        cmd.env_remove("NO_COLOR");
        let child = pty.slave.spawn_command(cmd).expect("spawn salcdesk");
        drop(pty.slave);
        let mut reader = pty.master.try_clone_reader().unwrap();
        let writer = pty.master.take_writer().unwrap();
        let screen = Arc::new(Mutex::new(vt100::Parser::new(24, 80, 0)));
        let raw = Arc::new(Mutex::new(Vec::new()));
        let (s2, r2) = (screen.clone(), raw.clone());
        std::thread::spawn(move || {
            let _keep = pty.master;
            let mut buf = [0u8; 4096];
            while let Ok(n) = reader.read(&mut buf) {
                if n == 0 {
                    break;
                }
                s2.lock().unwrap().process(&buf[..n]);
                r2.lock().unwrap().extend_from_slice(&buf[..n]);
            }
        });
        Run {
            screen,
            raw,
            writer,
            child,
        }
    }
    fn text(&self) -> String {
        self.screen.lock().unwrap().screen().contents()
    }
    fn wait_for(&self, what: &str) {
        let t0 = Instant::now();
        while t0.elapsed() < Duration::from_secs(20) {
            if self.text().contains(what) {
                return;
            }
            std::thread::sleep(Duration::from_millis(50));
        }
        panic!("'{what}' never appeared; the screen:\n{}", self.text());
    }
    fn keys(&mut self, s: &str) {
        self.writer.write_all(s.as_bytes()).unwrap();
        self.writer.flush().unwrap();
        std::thread::sleep(Duration::from_millis(150));
    }
    fn wait_exit(&mut self) {
        let t0 = Instant::now();
        while t0.elapsed() < Duration::from_secs(10) {
            if let Ok(Some(st)) = self.child.try_wait() {
                assert!(st.success(), "exit status {st:?}");
                return;
            }
            std::thread::sleep(Duration::from_millis(50));
        }
        let _ = self.child.kill();
        panic!("salcdesk did not quit; the screen:\n{}", self.text());
    }
}

fn setup(name: &str) -> (PathBuf, PathBuf) {
    let dir = std::env::temp_dir().join(format!("salcdesk-pty-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    let p = dir.join("puzzle.toml");
    std::fs::copy(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions/degenerate-puzzle.toml"),
        &p,
    )
    .unwrap();
    (p, dir.join("cache"))
}

#[test]
fn tick_save_quit_reopen_in_a_real_terminal() {
    let (p, cache) = setup("save");
    let mut run = Run::start(&p, &cache);
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
    run.wait_exit();
    let raw = run.raw.lock().unwrap().clone();
    let tail = String::from_utf8_lossy(&raw[raw.len().saturating_sub(200)..]).to_string();
    assert!(
        tail.contains("\x1b[?1049l"),
        "the alternate screen was left: {tail:?}"
    );

    let saved = salcdesk::session::load_file(&p).unwrap();
    assert_eq!(saved.sets[0].members[0].unmoved_by, vec!["E", "3sv"]);

    let mut again = Run::start(&p, &cache);
    again.wait_for("Γ = A₁ + E");
    assert!(!again.text().contains("[modified]"));
    again.keys("q");
    again.wait_exit();
}

#[test]
fn a_hangup_keeps_the_edits_and_the_next_start_offers_them() {
    let (p, cache) = setup("hangup");
    let p2 = p.with_file_name("hangup.toml");
    std::fs::copy(&p, &p2).unwrap();
    let mut run = Run::start(&p2, &cache);
    run.wait_for("not a representation of C3v");
    run.keys("ll ");
    run.wait_for("Γ = A₁ + E");
    // The SSH connection drops: SIGHUP (portable-pty's killer sends exactly that).
    run.child.clone_killer().kill().unwrap();
    run.wait_exit();
    let raw = run.raw.lock().unwrap().clone();
    let tail = String::from_utf8_lossy(&raw[raw.len().saturating_sub(300)..]).to_string();
    assert!(tail.contains("\x1b[?1049l"), "terminal restored: {tail:?}");
    // The session file is untouched; the edit waits in the recovery file beside it.
    let on_disk = salcdesk::session::load_file(&p2).unwrap();
    assert_eq!(on_disk.sets[0].members[0].unmoved_by, vec!["E"]);
    let rec = p2.with_file_name(".hangup.toml.recovery");
    assert!(rec.exists(), "recovery file written");

    let mut again = Run::start(&p2, &cache);
    again.wait_for("Unsaved edits found");
    again.keys("r");
    again.wait_for("Γ = A₁ + E");
    again.keys("s");
    again.wait_for("saved");
    again.keys("q");
    again.wait_exit();
    assert!(!rec.exists(), "a save clears the recovery file");
}
