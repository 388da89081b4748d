//! Signals that end the workspace: SIGHUP (the terminal or the SSH link went away), SIGTERM
//! (a job killer, `kill`) and SIGINT (`kill -INT`; Ctrl-C itself is a key in raw mode). The
//! handler only stores the signal number in an atomic, which is all a signal handler may
//! safely do; the signal also interrupts the event loop's wait, which then writes the recovery
//! file, gives the terminal back and exits with 128 + the signal number. A watchdog thread
//! ends the process anyway if the loop has not done so shortly after (a draw blocked on a
//! stopped terminal, a long computation).
//!
//! SIGWINCH only marks the screen for a redraw. SIGPIPE is ignored while the workspace runs:
//! a terminal write that fails is a lost terminal, handled like a hang-up, never a silent death
//! that would lose the edits.

use std::sync::atomic::{AtomicBool, AtomicI32, Ordering};
use std::time::Duration;

pub const SIGHUP: i32 = libc::SIGHUP;
pub const SIGINT: i32 = libc::SIGINT;
pub const SIGTERM: i32 = libc::SIGTERM;

static CAUGHT: AtomicI32 = AtomicI32::new(0);
static RESIZED: AtomicBool = AtomicBool::new(false);

/// The first ending signal that arrived, if any.
pub fn caught() -> Option<i32> {
    match CAUGHT.load(Ordering::SeqCst) {
        0 => None,
        s => Some(s),
    }
}

/// Whether the terminal was resized since the last call.
pub fn take_resize() -> bool {
    RESIZED.swap(false, Ordering::SeqCst)
}

/// The exit status for an ending signal (the shell's convention: 128 + number).
pub fn exit_status(sig: i32) -> i32 {
    128 + sig
}

/// A name for messages.
pub fn name(sig: i32) -> &'static str {
    match sig {
        SIGHUP => "SIGHUP (hang-up)",
        SIGINT => "SIGINT (interrupt)",
        SIGTERM => "SIGTERM (terminate)",
        _ => "a signal",
    }
}

extern "C" fn on_signal(sig: i32) {
    if sig == libc::SIGWINCH {
        RESIZED.store(true, Ordering::SeqCst);
    } else {
        // Keep the first: a SIGTERM after a SIGHUP does not change the reason.
        let _ = CAUGHT.compare_exchange(0, sig, Ordering::SeqCst, Ordering::SeqCst);
    }
}

fn set(sig: i32, handler: libc::sighandler_t) {
    // SAFETY: a zeroed sigaction with an empty mask is valid; `on_signal` is
    // async-signal-safe (atomic stores only) and lives for the whole program.
    unsafe {
        let mut sa: libc::sigaction = std::mem::zeroed();
        sa.sa_sigaction = handler;
        sa.sa_flags = libc::SA_RESTART;
        libc::sigemptyset(&mut sa.sa_mask);
        libc::sigaction(sig, &sa, std::ptr::null_mut());
    }
}

/// Start noting SIGHUP, SIGTERM, SIGINT and SIGWINCH; ignore SIGPIPE.
pub fn install() {
    let h = on_signal as extern "C" fn(i32) as libc::sighandler_t;
    for sig in [SIGHUP, SIGTERM, SIGINT, libc::SIGWINCH] {
        set(sig, h);
    }
    set(libc::SIGPIPE, libc::SIG_IGN);
}

/// After an ending signal, give the event loop `grace` to end in order; if the process is
/// still there, call `emergency` (which must not return).
pub fn watchdog(grace: Duration, emergency: fn(i32)) {
    std::thread::spawn(move || loop {
        std::thread::sleep(Duration::from_millis(50));
        if let Some(sig) = caught() {
            std::thread::sleep(grace);
            emergency(sig);
        }
    });
}

/// For tests: pretend a signal arrived.
pub fn raise_for_test(sig: i32) {
    CAUGHT.store(sig, Ordering::SeqCst);
}
