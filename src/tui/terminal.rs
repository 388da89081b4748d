//! Taking over the terminal and always giving it back: on quit, on a panic (a hook restores
//! the screen before the message is printed) and after a signal. Before giving it back after
//! a panic, the unsaved edits are written to the recovery file.

use crossterm::event::{DisableMouseCapture, EnableMouseCapture};
use crossterm::terminal::{
    disable_raw_mode, enable_raw_mode, EnterAlternateScreen, LeaveAlternateScreen,
};
use crossterm::{cursor, execute};
use std::io::{stdout, Stdout};
use std::path::PathBuf;
use std::sync::Mutex;

/// The latest unsaved session text and where its recovery file goes, for the panic hook.
static RESCUE: Mutex<Option<(PathBuf, String)>> = Mutex::new(None);

/// Keep the rescue copy up to date (`None` when there is nothing unsaved).
pub fn set_rescue(copy: Option<(PathBuf, String)>) {
    if let Ok(mut r) = RESCUE.lock() {
        *r = copy;
    }
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

/// Give the terminal back as it was. Safe to call more than once.
pub fn restore() {
    let _ = execute!(
        stdout(),
        DisableMouseCapture,
        LeaveAlternateScreen,
        cursor::Show
    );
    let _ = disable_raw_mode();
}
