//! Recovery files: unsaved edits written aside every few seconds (and when the program is
//! stopped by a signal, loses its terminal or crashes), offered back the next time the session
//! is opened.
//!
//! For `/data/ptcl4.toml` the recovery file is `/data/.ptcl4.toml.recovery`. Sessions without
//! a folder of their own (the built-in demo) keep it in the state folder, and a session whose
//! folder cannot be written falls back there too (named after the session and a hash of its
//! full path, so two `x.toml` in different folders do not meet). The state folder is
//! `$SALCDESK_STATE_DIR` (or the older name `$SALCDESK_CACHE_DIR`), else
//! `$XDG_STATE_HOME/salcdesk`, else `~/.local/state/salcdesk` — the XDG base-directory
//! specification's place for state that should survive a restart.

use super::load::parse;
use super::model::Session;
use super::save::write_atomic;
use super::write::to_toml;
use std::path::{Path, PathBuf};

fn non_empty(var: &str) -> Option<PathBuf> {
    std::env::var_os(var)
        .filter(|v| !v.is_empty())
        .map(PathBuf::from)
}

/// The folder for recovery files that cannot go beside their session (see the module text).
pub fn state_dir() -> PathBuf {
    if let Some(d) = non_empty("SALCDESK_STATE_DIR").or_else(|| non_empty("SALCDESK_CACHE_DIR")) {
        return d;
    }
    // The specification ignores a relative XDG_STATE_HOME.
    if let Some(d) = non_empty("XDG_STATE_HOME").filter(|d| d.is_absolute()) {
        return d.join("salcdesk");
    }
    if let Some(h) = non_empty("HOME") {
        return h.join(".local").join("state").join("salcdesk");
    }
    std::env::temp_dir().join("salcdesk-state")
}

/// Where the demo session's unsaved edits go.
pub fn demo_recovery_path() -> PathBuf {
    state_dir().join("demo.recovery")
}

/// The recovery file beside a session file.
pub fn recovery_path(session: &Path) -> PathBuf {
    let name = session
        .file_name()
        .map(|n| n.to_string_lossy().to_string())
        .unwrap_or_else(|| "session".into());
    let dir = session.parent().unwrap_or(Path::new(""));
    dir.join(format!(".{name}.recovery"))
}

/// FNV-1a (64 bit): a small hash that stays the same from run to run and build to build.
fn fnv1a(bytes: &[u8]) -> u64 {
    bytes.iter().fold(0xcbf2_9ce4_8422_2325, |h, &b| {
        (h ^ b as u64).wrapping_mul(0x0000_0100_0000_01b3)
    })
}

/// The recovery file in the state folder for a session whose own folder cannot be written.
pub fn fallback_recovery_path(session: &Path) -> PathBuf {
    let full = std::path::absolute(session).unwrap_or_else(|_| session.to_path_buf());
    let name = session
        .file_name()
        .map(|n| n.to_string_lossy().to_string())
        .unwrap_or_else(|| "session".into());
    let hash = fnv1a(full.as_os_str().as_encoded_bytes());
    state_dir().join(format!("{name}-{hash:016x}.recovery"))
}

/// One recovery slot: where it lives, and what is in it.
#[derive(Debug, Clone)]
pub struct Recovery {
    pub path: PathBuf,
}

impl Recovery {
    /// The slot for a session file, or for the demo when `None`. A session whose edits went
    /// to the state folder last time (its folder could not be written) finds them there.
    pub fn for_session(session: Option<&Path>) -> Self {
        let path = match session {
            Some(p) => {
                let beside = recovery_path(p);
                let fallback = fallback_recovery_path(p);
                if !beside.exists() && fallback.exists() {
                    fallback
                } else {
                    beside
                }
            }
            None => demo_recovery_path(),
        };
        Recovery { path }
    }

    /// Unsaved edits left by an earlier run, if any differ from `current`.
    pub fn pending(&self, current: &Session) -> Option<Session> {
        let text = std::fs::read_to_string(&self.path).ok()?;
        let s = parse(&self.path.display().to_string(), &text).ok()?;
        (s != *current).then_some(s)
    }

    /// Write the edits aside (atomically), creating folders as needed. Falls back to the state
    /// folder when the session's folder cannot be written; the slot then points there.
    pub fn write(&mut self, s: &Session) -> Result<(), String> {
        self.write_text(&to_toml(s))
    }

    /// Write already-serialized text aside.
    pub fn write_text(&mut self, text: &str) -> Result<(), String> {
        if let Some(dir) = self.path.parent().filter(|d| !d.as_os_str().is_empty()) {
            let _ = std::fs::create_dir_all(dir);
        }
        let first = match write_atomic(&self.path, text) {
            Ok(()) => return Ok(()),
            Err(e) => e,
        };
        let name = self
            .path
            .file_name()
            .map(|n| n.to_string_lossy().trim_start_matches('.').to_string())
            .unwrap_or_else(|| "session.recovery".into());
        let session = self.path.with_file_name(name.trim_end_matches(".recovery"));
        let alt = fallback_recovery_path(&session);
        if self.path.starts_with(state_dir()) {
            return Err(first.to_string());
        }
        if let Err(e) = std::fs::create_dir_all(state_dir()) {
            return Err(format!("{first}; and {}: {e}", state_dir().display()));
        }
        write_atomic(&alt, text).map_err(|e| format!("{first}; and {e}"))?;
        self.path = alt;
        Ok(())
    }

    /// Forget the edits (after a save, or when the user discards them).
    pub fn clear(&self) {
        let _ = std::fs::remove_file(&self.path);
    }
}
