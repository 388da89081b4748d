//! Recovery files: unsaved edits written aside every few seconds (and when the program is
//! stopped by a signal or a crash), offered back the next time the session is opened.
//!
//! For `/data/ptcl4.toml` the recovery file is `/data/.ptcl4.toml.recovery`; the demo session,
//! which has no folder of its own, keeps it in the cache folder (`$SALCDESK_CACHE_DIR`, else
//! `$XDG_CACHE_HOME/salcdesk`, else `~/.cache/salcdesk`). A folder that cannot be written
//! falls back to the cache folder too.

use super::load::parse;
use super::model::Session;
use super::save::write_atomic;
use super::write::to_toml;
use std::path::{Path, PathBuf};

fn cache_dir() -> PathBuf {
    if let Some(d) = std::env::var_os("SALCDESK_CACHE_DIR") {
        return PathBuf::from(d);
    }
    if let Some(d) = std::env::var_os("XDG_CACHE_HOME") {
        return PathBuf::from(d).join("salcdesk");
    }
    if let Some(h) = std::env::var_os("HOME") {
        return PathBuf::from(h).join(".cache").join("salcdesk");
    }
    std::env::temp_dir().join("salcdesk")
}

/// Where the demo session's unsaved edits go.
pub fn demo_recovery_path() -> PathBuf {
    cache_dir().join("demo.recovery")
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

/// One recovery slot: where it lives, and what is in it.
#[derive(Debug, Clone)]
pub struct Recovery {
    pub path: PathBuf,
}

impl Recovery {
    /// The slot for a session file, or for the demo when `None`.
    pub fn for_session(session: Option<&Path>) -> Self {
        Recovery {
            path: match session {
                Some(p) => recovery_path(p),
                None => demo_recovery_path(),
            },
        }
    }

    /// Unsaved edits left by an earlier run, if any differ from `current`.
    pub fn pending(&self, current: &Session) -> Option<Session> {
        let text = std::fs::read_to_string(&self.path).ok()?;
        let s = parse(&self.path.display().to_string(), &text).ok()?;
        (s != *current).then_some(s)
    }

    /// Write the edits aside (atomically). Falls back to the cache folder when the session's
    /// folder cannot be written; the slot then points there.
    pub fn write(&mut self, s: &Session) -> Result<(), String> {
        self.write_text(&to_toml(s))
    }

    /// Write already-serialized text aside.
    pub fn write_text(&mut self, text: &str) -> Result<(), String> {
        if let Some(dir) = self.path.parent() {
            let _ = std::fs::create_dir_all(dir);
        }
        match write_atomic(&self.path, text) {
            Ok(()) => Ok(()),
            Err(first) => {
                let name = self
                    .path
                    .file_name()
                    .map(|n| n.to_string_lossy().trim_start_matches('.').to_string())
                    .unwrap_or_else(|| "session.recovery".into());
                let alt = cache_dir().join(name);
                if alt == self.path {
                    return Err(first.to_string());
                }
                let _ = std::fs::create_dir_all(cache_dir());
                write_atomic(&alt, text).map_err(|e| e.to_string())?;
                self.path = alt;
                Ok(())
            }
        }
    }

    /// Forget the edits (after a save, or when the user discards them).
    pub fn clear(&self) {
        let _ = std::fs::remove_file(&self.path);
    }
}
