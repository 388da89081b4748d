//! End to end in a pseudo-terminal: observed bands added and retyped in the Spectra pane of
//! the real binary, saved, and found again after reopening — at 80x24 (one pane) and 120x32
//! (tiled) — and what goes over the wire uses the 16 basic colour codes only. The harness is a
//! copy of the one in tests/tui_pty.rs, with the terminal size as a parameter.

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
    fn start(session: &Path, cache: &Path, cols: u16, rows: u16) -> Run {
        let pty = native_pty_system()
            .openpty(PtySize {
                rows,
                cols,
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
        let screen = Arc::new(Mutex::new(vt100::Parser::new(rows, cols, 0)));
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
fn bands_typed_in_the_workspace_are_saved_and_found_again() {
    for (cols, rows) in [(80u16, 24u16), (120, 32)] {
        let (p, cache) = setup(&format!("bands-{cols}"));
        let mut run = Run::start(&p, &cache, cols, rows);
        run.wait_for("not a representation of C3v");
        run.keys("5G");
        run.wait_for("Observed bands (0)");
        run.keys("+");
        run.wait_for("New band");
        run.keys("505 Raman vs p\r");
        run.wait_for("band 1 added");
        run.wait_for("Observed bands (1)");
        run.keys("c");
        run.wait_for("Change band number");
        run.keys("\r");
        run.wait_for("505 Raman vs p");
        // Ctrl-u clears the field, then the band is retyped.
        run.keys("\x15480 IR s\r");
        run.wait_for("band 1 is now 480 IR s");
        run.keys("s");
        run.wait_for("saved");
        run.keys("q");
        run.wait_exit();
        let raw = run.raw.lock().unwrap().clone();
        let wire = String::from_utf8_lossy(&raw).to_string();
        assert!(
            !wire.contains("38;5;") && !wire.contains("48;5;"),
            "{cols}x{rows}: 256-colour codes on the wire"
        );
        // Some basic colour code is there (cyan keys, the footer's): SGR 36 in any position.
        let basic = wire.split("\x1b[").any(|seq| {
            seq.split_once('m')
                .is_some_and(|(params, _)| params.split(';').any(|p| p == "36"))
        });
        assert!(basic, "{cols}x{rows}: no basic colour code at all");

        let saved = salcdesk::session::load_file(&p).unwrap();
        assert_eq!(saved.bands.len(), 1);
        let b = &saved.bands[0];
        assert_eq!(b.position, 480.0);
        assert_eq!(b.technique, salcdesk::session::Technique::Ir);
        assert_eq!(b.intensity, "s");
        assert_eq!(b.polarization, None);

        let mut again = Run::start(&p, &cache, cols, rows);
        again.wait_for("not a representation of C3v");
        again.keys("5G");
        again.wait_for("Observed bands (1)");
        assert!(!again.text().contains("[modified]"));
        again.keys("q");
        again.wait_exit();
    }
}
