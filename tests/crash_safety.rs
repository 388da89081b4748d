//! SIGKILL in the middle of saves. `salcdesk build … -o s.toml --force` saves a session through
//! `session::write_atomic` (temporary file beside the target, fsync, rename). The real binary is
//! killed at chosen moments during 100 saves; after every kill the session file must be, byte
//! for byte, either the old or the new text (never empty, never a mix) and must load.
//!
//! Most of a run is start-up and building the molecule; the write itself is a few
//! milliseconds. So most kill times are aimed at the moment the file changes: the aim moves
//! later after a kill that left the old file and earlier after one that left the new file, with
//! jitter, and every fifth kill time is spread over the whole run instead.

#![cfg(unix)]

use std::os::unix::process::ExitStatusExt;
use std::path::{Path, PathBuf};
use std::process::{Child, Command, Stdio};
use std::time::{Duration, Instant};

const SAVES: usize = 100;

/// Two clearly different sessions: a small CoCl6 octahedron (7 atoms) and a large cluster of
/// five general-position orbits of Oh (5 × 48 = 240 atoms), so the write is not instantaneous.
const SMALL: &str = "Co@origin Cl@axis1:2.3";
const LARGE: &str = "C@general1:3.1,20,10 N@general1:4.2,35,25 O@general1:5.3,50,40 \
                     S@general1:6.4,15,70 P@general1:7.5,65,55";

fn spawn_save(sites: &str, out: &Path) -> Child {
    Command::new(env!("CARGO_BIN_EXE_salcdesk"))
        .args(["build", "Oh", "--sites", sites, "-o"])
        .arg(out)
        .arg("--force")
        .stdin(Stdio::null())
        .stdout(Stdio::null())
        .stderr(Stdio::null())
        .spawn()
        .expect("spawn salcdesk")
}

/// SplitMix64: a small deterministic generator, seeded per save so a failure can be replayed.
fn splitmix(state: &mut u64) -> u64 {
    *state = state.wrapping_add(0x9E37_79B9_7F4A_7C15);
    let mut z = *state;
    z = (z ^ (z >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
    z = (z ^ (z >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
    z ^ (z >> 31)
}

fn unit(state: &mut u64) -> f64 {
    (splitmix(state) >> 11) as f64 / (1u64 << 53) as f64
}

/// A temporary file of one save into `target` by process `pid`. `session::write_atomic` names
/// it `.NAME.tmp-PID`; `cli::write_atomic` uses `.NAME.PID.salcdesk-tmp`. Both are accepted.
fn is_temp_of(file: &str, target: &str, pid: u32) -> bool {
    file == format!(".{target}.tmp-{pid}") || file == format!(".{target}.{pid}.salcdesk-tmp")
}

/// A complete, uninterrupted save: the reference text and how long a whole run takes.
fn reference(sites: &str, dir: &Path, name: &str) -> (String, Duration) {
    let out = dir.join(name);
    let t0 = Instant::now();
    let status = spawn_save(sites, &out).wait().unwrap();
    let took = t0.elapsed();
    assert!(status.success(), "build --sites {sites:?}: {status:?}");
    let text = std::fs::read_to_string(&out).unwrap();
    let loaded = salcdesk::session::load_file(&out).expect("the reference session loads");
    assert_eq!(loaded, salcdesk::session::parse(name, &text).unwrap());
    (text, took)
}

fn scratch() -> PathBuf {
    let dir = std::env::temp_dir().join(format!("salcdesk-crash-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(dir.join("ref")).unwrap();
    std::fs::create_dir_all(dir.join("work")).unwrap();
    dir
}

#[test]
fn sigkill_during_saves_leaves_the_old_or_the_new_session() {
    let dir = scratch();
    let (small, t_small) = reference(SMALL, &dir.join("ref"), "small.toml");
    let (large, t_large) = reference(LARGE, &dir.join("ref"), "large.toml");
    assert_ne!(small, large);
    let texts = [small.as_str(), large.as_str()];
    let sites = [SMALL, LARGE];
    let sessions = texts.map(|t| salcdesk::session::parse("expected", t).unwrap());
    let atoms = |s: &salcdesk::session::Session| match s.geometry.as_ref().map(|g| &g.source) {
        Some(salcdesk::session::GeometrySource::Atoms(a)) => a.len(),
        _ => 0,
    };
    assert_eq!(atoms(&sessions[0]), 7);
    assert_eq!(atoms(&sessions[1]), 240);

    let work = dir.join("work");
    let target = work.join("s.toml");
    std::fs::write(&target, small.as_bytes()).unwrap();
    let full = [t_small.as_secs_f64(), t_large.as_secs_f64()];
    // Where the file changes, per text: first guess just before the end of a whole run.
    let mut aim = [0.9 * full[0], 0.9 * full[1]];
    let (mut killed_old, mut killed_mid, mut killed_new, mut finished) = (0, 0, 0, 0);
    let started = Instant::now();

    for i in 0..SAVES {
        let on_disk = std::fs::read_to_string(&target).unwrap();
        let old = texts
            .iter()
            .position(|t| *t == on_disk)
            .expect("a known text");
        let new = 1 - old;
        let seed = 0x5A1C_DE5C_u64 ^ (i as u64).wrapping_mul(0x1000_0001);
        let mut rng = seed;
        let delay = if i % 5 == 0 {
            1.1 * full[new] * unit(&mut rng)
        } else {
            aim[new] * (0.85 + 0.3 * unit(&mut rng))
        };

        let mut child = spawn_save(sites[new], &target);
        let pid = child.id();
        std::thread::sleep(Duration::from_secs_f64(delay));
        // SIGKILL; an error only means the save had already finished.
        let _ = child.kill();
        let status = child.wait().unwrap();
        let ctx = format!(
            "save {i} (seed {seed:#x}, kill after {:.1} ms)",
            delay * 1e3
        );
        assert!(
            status.success() || status.signal() == Some(9),
            "{ctx}: the save failed on its own: {status:?}"
        );

        // The target is exactly one of the two texts, never empty, never a mix …
        let bytes = std::fs::read(&target).unwrap_or_else(|e| panic!("{ctx}: target gone: {e}"));
        let now = if bytes == texts[old].as_bytes() {
            old
        } else if bytes == texts[new].as_bytes() {
            new
        } else {
            panic!(
                "{ctx}: the session file is neither the old nor the new text ({} bytes; old {}, \
                 new {}):\n{}",
                bytes.len(),
                texts[old].len(),
                texts[new].len(),
                String::from_utf8_lossy(&bytes[..bytes.len().min(300)])
            );
        };
        // … and loads as that session.
        let loaded = salcdesk::session::load_file(&target)
            .unwrap_or_else(|e| panic!("{ctx}: the session file does not load: {e}"));
        assert_eq!(loaded, sessions[now], "{ctx}");
        if status.success() {
            assert_eq!(now, new, "{ctx}: a finished save left the old text");
        }

        // A kill between creating the temporary file and renaming it leaves that file behind
        // (the next save has another PID, so it is not reused or cleaned up; that is
        // accepted). It must be this save's, hold a prefix of the new text, and must not have
        // taken the target's place (checked above). Removed here so each save starts clean.
        let mut temp = false;
        for entry in std::fs::read_dir(&work).unwrap() {
            let name = entry.unwrap().file_name().to_string_lossy().into_owned();
            if name == "s.toml" {
                continue;
            }
            assert!(
                is_temp_of(&name, "s.toml", pid),
                "{ctx}: unexpected file {name} beside the session"
            );
            let partial = std::fs::read(work.join(&name)).unwrap();
            assert!(
                texts[new].as_bytes().starts_with(&partial),
                "{ctx}: the temporary file {name} is not a prefix of the new text"
            );
            assert_eq!(now, old, "{ctx}: temporary file left after the rename");
            std::fs::remove_file(work.join(&name)).unwrap();
            temp = true;
        }

        match (status.success(), now == new, temp) {
            (true, _, _) => finished += 1,
            (false, true, _) => killed_new += 1,
            (false, false, true) => killed_mid += 1,
            (false, false, false) => killed_old += 1,
        }
        if i % 5 != 0 && !temp {
            aim[new] *= if now == new { 0.94 } else { 1.06 };
        }
    }

    eprintln!(
        "{SAVES} saves in {:.1} s (whole runs {:.0} ms small, {:.0} ms large): killed before \
         the write {killed_old}, during it (temporary file left) {killed_mid}, after the rename \
         {killed_new}; finished {finished}",
        started.elapsed().as_secs_f64(),
        full[0] * 1e3,
        full[1] * 1e3,
    );
    // The kills must straddle the moment of the save, or the test checked nothing.
    assert!(
        killed_old + killed_mid > 0,
        "no kill landed before the rename"
    );
    assert!(killed_new + finished > 0, "no save ever completed");
    let _ = std::fs::remove_dir_all(&dir);
}
