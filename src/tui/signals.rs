//! SIGHUP (the SSH connection dropped) and SIGTERM (the cluster's job killer): note that one
//! arrived, so the main loop can write the recovery file, restore the terminal and leave.
//!
//! The handler only stores to an atomic flag, which is all a signal handler may safely do.
//! `signal` comes from the C library the Rust standard library already links on Unix, so no
//! extra dependency is needed.

use std::sync::atomic::{AtomicI32, Ordering};

static CAUGHT: AtomicI32 = AtomicI32::new(0);

/// The signal that arrived, if any.
pub fn caught() -> Option<i32> {
    match CAUGHT.load(Ordering::SeqCst) {
        0 => None,
        s => Some(s),
    }
}

#[cfg(unix)]
mod imp {
    use super::CAUGHT;
    use std::sync::atomic::Ordering;

    const SIGHUP: i32 = 1;
    const SIGTERM: i32 = 15;

    extern "C" {
        fn signal(signum: i32, handler: usize) -> usize;
    }

    extern "C" fn on_signal(sig: i32) {
        CAUGHT.store(sig, Ordering::SeqCst);
    }

    pub fn install() {
        let h = on_signal as extern "C" fn(i32) as usize;
        // SAFETY: `on_signal` is async-signal-safe (one atomic store) and lives for the
        // whole program; `signal` is the C library's, with the C ABI declared above.
        unsafe {
            signal(SIGHUP, h);
            signal(SIGTERM, h);
        }
    }
}

#[cfg(not(unix))]
mod imp {
    pub fn install() {}
}

/// Start noting SIGHUP and SIGTERM.
pub fn install() {
    imp::install();
}

/// For tests: pretend a signal arrived.
pub fn raise_for_test(sig: i32) {
    CAUGHT.store(sig, Ordering::SeqCst);
}
