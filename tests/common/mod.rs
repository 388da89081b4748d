//! Helpers shared by the integration tests (`mod common;`): temporary folders that remove
//! themselves, and the real binary in a pseudo-terminal (`pty`).

#![allow(dead_code)]

#[cfg(unix)]
pub mod pty;

use std::path::{Path, PathBuf};

/// A fresh folder under the system's temporary folder, removed when dropped.
pub struct TempDir(PathBuf);

impl TempDir {
    pub fn new(name: &str) -> TempDir {
        use std::sync::atomic::{AtomicUsize, Ordering};
        static N: AtomicUsize = AtomicUsize::new(0);
        let n = N.fetch_add(1, Ordering::SeqCst);
        let dir = std::env::temp_dir().join(format!("salcdesk-{name}-{}-{n}", std::process::id()));
        let _ = std::fs::remove_dir_all(&dir);
        std::fs::create_dir_all(&dir).expect("a temporary folder");
        TempDir(dir)
    }
    pub fn path(&self) -> &Path {
        &self.0
    }
    pub fn join(&self, p: impl AsRef<Path>) -> PathBuf {
        self.0.join(p)
    }
}

impl Drop for TempDir {
    fn drop(&mut self) {
        let _ = std::fs::remove_dir_all(&self.0);
    }
}

/// A shipped example session copied into `dir` under `name`.
pub fn copy_session(example: &str, dir: &Path, name: &str) -> PathBuf {
    let p = dir.join(name);
    std::fs::copy(
        Path::new(env!("CARGO_MANIFEST_DIR"))
            .join("sessions")
            .join(example),
        &p,
    )
    .expect("copy an example session");
    p
}
