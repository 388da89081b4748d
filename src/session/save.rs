//! Atomic saves: the new text goes to a temporary file in the same folder, is flushed to disk,
//! and is renamed over the old file, so a crash or a full disk never leaves half a session.
//! Files that are not readable sessions are never written over.

use super::keep::edit_document;
use super::load::{load_file, parse};
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

/// The text of `session` as a file: `original` (the session file's text as the user wrote it)
/// edited where the session differs from it, comments, order and spacing kept; the fresh
/// layout when there is no original. When `original` already says exactly this session, it
/// is returned unchanged.
pub fn to_toml_keeping(original: Option<&str>, session: &Session) -> String {
    let fresh = to_toml(session);
    match original {
        None => fresh,
        Some(old) if parse("", old).as_ref() == Ok(session) => old.to_string(),
        Some(old) => edit_document(old, &fresh),
    }
}

/// Save a session to `path` atomically. When `path` holds a session already, that file is
/// edited (its comments and layout kept, see [`to_toml_keeping`]); a file there that is not a
/// readable session is never written over.
pub fn save(session: &Session, path: &Path) -> Result<(), SaveError> {
    save_keeping(session, path, path)
}

/// Save as: write `session` to `path`, keeping the comments and layout of the session file
/// `layout_from` (the file it was opened from; usually `path` itself).
pub fn save_keeping(session: &Session, layout_from: &Path, path: &Path) -> Result<(), SaveError> {
    check_save_target(path)?;
    let original = fs::read_to_string(layout_from)
        .ok()
        .filter(|t| parse("", t).is_ok());
    write_atomic(path, &to_toml_keeping(original.as_deref(), session))
}
