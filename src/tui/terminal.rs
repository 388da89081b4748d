//! Taking over the terminal and always giving it back: on quit, on a panic (a hook restores
//! the screen before the message is printed), after a signal and when the terminal is gone.
//! Before giving it back after a panic or in an emergency exit, the unsaved edits are written
//! to the recovery file.
//!
//! A terminal that is gone (hung up) fails every write at once (EIO); the restore sequences
//! are written with errors ignored, so giving back a gone terminal neither blocks nor panics.

use crossterm::event::{DisableMouseCapture, EnableMouseCapture};
use crossterm::terminal::{
    disable_raw_mode, enable_raw_mode, EnterAlternateScreen, LeaveAlternateScreen,
};
use crossterm::{cursor, execute};
use std::io::{stdout, Stdout};
use std::path::PathBuf;
use std::sync::Mutex;
use std::time::{Duration, Instant};

/// The latest unsaved session text and where its recovery file goes, for the panic hook and
/// the watchdog. Its lock is also held while the event loop writes the recovery file itself,
/// so two writers never meet.
static RESCUE: Mutex<Option<(PathBuf, String)>> = Mutex::new(None);

/// Keep the rescue copy up to date (`None` when there is nothing unsaved).
pub fn set_rescue(copy: Option<(PathBuf, String)>) {
    if let Ok(mut r) = RESCUE.lock() {
        *r = copy;
    }
}

/// Run `write` (the event loop's own rescue) holding the rescue lock; afterwards there is
/// nothing left for the watchdog to write.
pub fn rescue_with<R>(write: impl FnOnce() -> R) -> R {
    let mut guard = RESCUE.lock().unwrap_or_else(|p| p.into_inner());
    let r = write();
    *guard = None;
    r
}

fn write_rescue() {
    if let Ok(r) = RESCUE.try_lock() {
        if let Some((path, text)) = r.as_ref() {
            let _ = crate::session::write_atomic(path, text);
        }
    }
}

/// Frames go out through [`super::sgr16::BasicColours`]: the 16 basic colour codes only.
pub type Term =
    ratatui::Terminal<ratatui::backend::CrosstermBackend<super::sgr16::BasicColours<Stdout>>>;

/// Raw mode, alternate screen, mouse; and the panic hook.
pub fn enter() -> std::io::Result<Term> {
    let prev = std::panic::take_hook();
    std::panic::set_hook(Box::new(move |info| {
        write_rescue();
        restore();
        prev(info);
    }));
    enable_raw_mode()?;
    execute!(
        stdout(),
        EnterAlternateScreen,
        EnableMouseCapture,
        cursor::Hide
    )?;
    ratatui::Terminal::new(ratatui::backend::CrosstermBackend::new(
        super::sgr16::BasicColours::new(stdout()),
    ))
}

/// Give the terminal back as it was. Safe to call more than once, and on a terminal that is
/// gone (errors are ignored).
pub fn restore() {
    let _ = execute!(
        stdout(),
        DisableMouseCapture,
        LeaveAlternateScreen,
        cursor::Show
    );
    let _ = disable_raw_mode();
}

/// The watchdog's way out when the event loop did not end in time after a signal: write the
/// rescue copy (unless the loop is writing it right now: then wait briefly for it), take the
/// terminal out of raw mode (no escape sequences: writing may be what is stuck) and exit
/// with 128 + the signal, without running anything else that might block.
pub fn emergency_exit(sig: i32) {
    let t0 = Instant::now();
    while t0.elapsed() < Duration::from_millis(200) {
        if let Ok(r) = RESCUE.try_lock() {
            if let Some((path, text)) = r.as_ref() {
                let _ = crate::session::write_atomic(path, text);
            }
            break;
        }
        std::thread::sleep(Duration::from_millis(10));
    }
    let _ = disable_raw_mode();
    // SAFETY: _exit ends the process at once; nothing is left in an inconsistent state that
    // outlives it (files were written atomically above).
    unsafe { libc::_exit(super::signals::exit_status(sig)) }
}
