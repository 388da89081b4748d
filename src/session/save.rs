//! Atomic saves: the new text goes to a temporary file in the same folder, is flushed to disk,
//! and is renamed over the old file, so a crash or a full disk never leaves half a session.
//! Files that are not readable sessions are never written over.

use super::load::load_file;
use super::model::Session;
use super::write::to_toml;
use std::fs;
use std::io::Write;
use std::path::{Path, PathBuf};

/// Why a save did not happen.
#[derive(Debug, thiserror::Error)]
pub enum SaveError {
    #[error("{path}: {source}")]
    Io {
        path: String,
        #[source]
        source: std::io::Error,
    },
    #[error("{path} exists and is not a salcdesk session ({reason}); it was left untouched — choose another name")]
    NotASession { path: String, reason: String },
}

/// What is at a path the user wants to save to.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum SaveTarget {
    /// Nothing there yet.
    New,
    /// A readable session that would be replaced.
    ExistingSession,
}

/// Check a save-as target: refuse anything that exists and is not a session.
pub fn check_save_target(path: &Path) -> Result<SaveTarget, SaveError> {
    if !path.exists() {
        return Ok(SaveTarget::New);
    }
    if path.is_dir() {
        return Err(SaveError::NotASession {
            path: path.display().to_string(),
            reason: "it is a folder".into(),
        });
    }
    match load_file(path) {
        Ok(_) => Ok(SaveTarget::ExistingSession),
        Err(e) => Err(SaveError::NotASession {
            path: path.display().to_string(),
            reason: e.message,
        }),
    }
}

/// Write text to `path` atomically (temporary file beside it, fsync, rename, fsync folder).
pub fn write_atomic(path: &Path, text: &str) -> Result<(), SaveError> {
    let io = |source| SaveError::Io {
        path: path.display().to_string(),
        source,
    };
    let dir: PathBuf = match path.parent() {
        Some(p) if !p.as_os_str().is_empty() => p.to_path_buf(),
        _ => PathBuf::from("."),
    };
    let name = path
        .file_name()
        .map(|n| n.to_string_lossy().to_string())
        .unwrap_or_else(|| "session".into());
    let tmp = dir.join(format!(".{name}.tmp-{}", std::process::id()));
    let result = (|| {
        let mut f = fs::File::create(&tmp)?;
        f.write_all(text.as_bytes())?;
        f.sync_all()?;
        if let Ok(meta) = fs::metadata(path) {
            let _ = fs::set_permissions(&tmp, meta.permissions());
        }
        fs::rename(&tmp, path)?;
        if let Ok(d) = fs::File::open(&dir) {
            let _ = d.sync_all();
        }
        Ok(())
    })();
    if result.is_err() {
        let _ = fs::remove_file(&tmp);
    }
    result.map_err(io)
}

/// Save a session to `path` atomically.
pub fn save(session: &Session, path: &Path) -> Result<(), SaveError> {
    write_atomic(path, &to_toml(session))
}
