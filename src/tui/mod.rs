//! The terminal workspace: panels over one session, redrawn after every key.
//!
//! Split three ways: state and what actions do to it (`app`, `action`, no terminal library),
//! the one key map that also writes the help and the footer (`keymap`), and drawing as pure
//! functions of the state (`ui`, one file per panel in `panels`, styles in `theme`). Only this
//! module imports ratatui and crossterm; `input` and `terminal` are the only files that touch
//! the terminal itself. Chemistry comes from `analysis::analyze`, run quickly after every edit
//! and fully on a background thread (`worker`).

pub mod action;
pub mod app;
mod input;
pub mod keymap;
pub mod layout;
pub mod molecule_edit;
pub mod panels;
pub mod session_edit;
pub mod sgr16;
pub mod signals;
mod terminal;
pub mod text;
pub mod theme;
pub mod ui;
mod worker;

pub use action::{Action, Panel};
pub use app::App;

use crate::session::{self, Session};
use crossterm::event;
use std::path::PathBuf;
use std::time::{Duration, Instant};

/// How the workspace should look and what it opens.
#[derive(Debug, Clone, Default)]
pub struct Options {
    /// The session file; `None` opens the built-in demo.
    pub path: Option<PathBuf>,
    /// Plain ASCII: no box drawing, subscripts or Greek.
    pub ascii: bool,
    /// No colour (also when NO_COLOR is set or TERM is dumb).
    pub mono: bool,
}

/// Colour and ASCII settings after looking at the environment.
pub fn look(opts: &Options) -> (bool, bool) {
    let no_color = std::env::var_os("NO_COLOR").is_some_and(|v| !v.is_empty());
    let term = std::env::var("TERM").unwrap_or_default();
    let (plain, no_glyphs) = limited_terminal(&term);
    let color = !(opts.mono || no_color || plain);
    let ascii = opts.ascii || no_glyphs;
    (color, ascii)
}

/// What a terminal type lacks: (colour, the Unicode glyphs). `dumb` and `vt100` have
/// neither; the Linux console has the 16 colours but not the subscripts and box glyphs of its
/// default font (common practice).
pub fn limited_terminal(term: &str) -> (bool, bool) {
    let t = term.trim();
    let base = t.split('-').next().unwrap_or("");
    match base {
        "dumb" | "vt100" | "vt102" | "vt52" => (true, true),
        "linux" => (false, true),
        _ => (false, false),
    }
}

/// The session to open: the file, a new session for a file that does not exist yet, or the
/// demo. A file that exists but cannot be read is an error (and is never written over).
pub fn open_session(path: Option<&std::path::Path>) -> Result<Session, String> {
    match path {
        None => Ok(session::demo()),
        Some(p) if !p.exists() => Ok(Session {
            title: p
                .file_stem()
                .map(|s| s.to_string_lossy().to_string())
                .unwrap_or_default(),
            ..Session::default()
        }),
        Some(p) => session::load_file(p).map_err(|e| e.to_string()),
    }
}

/// Autosave interval for the recovery file.
const AUTOSAVE: Duration = Duration::from_secs(2);

/// Run the workspace until the user quits. Errors are messages for the user.
pub fn run(opts: Options) -> Result<(), String> {
    let s = open_session(opts.path.as_deref())?;
    let (color, ascii) = look(&opts);
    let mut app = App::new(s, opts.path.clone(), ascii, color);
    signals::install();
    // The group list loads every table: do it off the main thread.
    let (cat_tx, cat_rx) = std::sync::mpsc::channel();
    std::thread::spawn(move || {
        let _ = cat_tx.send(crate::analysis::catalogue());
    });
    let worker = worker::Worker::start();
    let mut term = terminal::enter().map_err(|e| format!("cannot use this terminal: {e}"))?;
    let result = event_loop(&mut term, &mut app, &worker, &cat_rx);
    terminal::restore();
    if let Err(e) = &result {
        eprintln!("salcdesk: {e}");
    }
    if let Some(sig) = signals::caught() {
        eprintln!(
            "salcdesk: stopped by signal {sig}; unsaved edits are in {}",
            app.recovery.path.display()
        );
    }
    result
}

fn rescue_copy(app: &App) -> Option<(PathBuf, String)> {
    app.dirty()
        .then(|| (app.recovery.path.clone(), session::to_toml(&app.session)))
}

/// Test hook (tests/tui_panic_restore.rs): when `SALCDESK_TEST_PANIC_ON_KEY` holds one
/// character, pressing that key panics, so the panic path (rescue file, terminal given back)
/// can be tested on the real binary. Unset, it does nothing.
fn panic_on_test_key(k: keymap::Key) {
    if let (keymap::Code::Char(c), false) = (k.code, k.ctrl) {
        if std::env::var("SALCDESK_TEST_PANIC_ON_KEY").is_ok_and(|v| v.chars().eq([c])) {
            panic!("test panic: key {c:?} pressed with SALCDESK_TEST_PANIC_ON_KEY set");
        }
    }
}

fn event_loop(
    term: &mut terminal::Term,
    app: &mut App,
    worker: &worker::Worker,
    cat_rx: &std::sync::mpsc::Receiver<Vec<crate::analysis::GroupEntry>>,
) -> Result<(), String> {
    let mut redraw = true;
    let mut requested = u64::MAX;
    let mut last_autosave = Instant::now();
    let mut rescue_gen = u64::MAX;
    loop {
        if redraw {
            let size = term.size().map_err(|e| e.to_string())?;
            app.screen = (size.width, size.height);
            term.draw(|f| ui::draw(f, app)).map_err(|e| e.to_string())?;
            redraw = false;
        }
        if app.quit {
            if !app.dirty() {
                app.recovery.clear();
            }
            return Ok(());
        }
        if signals::caught().is_some() {
            app.autosave();
            return Ok(());
        }
        if app.gen != requested {
            requested = app.gen;
            worker.request(app.gen, app.session.clone(), app.base_dir());
        }
        if rescue_gen != app.gen {
            rescue_gen = app.gen;
            terminal::set_rescue(rescue_copy(app));
        }
        let ready = event::poll(Duration::from_millis(50));
        match ready {
            Ok(true) => loop {
                let ev = match event::read() {
                    Ok(ev) => ev,
                    Err(e) => {
                        // The terminal went away (e.g. the SSH connection dropped).
                        app.autosave();
                        return Err(format!("lost the terminal: {e}"));
                    }
                };
                match input::translate(ev) {
                    input::Input::Key(k) => {
                        panic_on_test_key(k);
                        app.handle_key(k)
                    }
                    input::Input::Action(a) => app.apply(a),
                    input::Input::Resize => {
                        let _ = term.autoresize();
                    }
                    input::Input::Nothing => {}
                }
                redraw = true;
                if app.quit || !matches!(event::poll(Duration::ZERO), Ok(true)) {
                    break;
                }
            },
            Ok(false) => {}
            Err(e) => {
                app.autosave();
                return Err(format!("lost the terminal: {e}"));
            }
        }
        if let Some(done) = worker.poll() {
            app.accept_analysis(done.gen, done.result);
            redraw = true;
        }
        if app.catalogue.is_empty() {
            if let Ok(c) = cat_rx.try_recv() {
                app.catalogue = c;
                redraw = true;
            }
        }
        if last_autosave.elapsed() >= AUTOSAVE {
            last_autosave = Instant::now();
            app.autosave();
        }
    }
}

#[cfg(test)]
mod tests {
    use super::limited_terminal;

    /// Terminal types by what they lack (common practice: terminfo's dumb and vt100 entries
    /// have no colour; the Linux console font has no subscripts or box glyphs beyond its own).
    #[test]
    fn limited_terminals_get_ascii_and_the_dumb_ones_no_colour() {
        for (t, want) in [
            ("dumb", (true, true)),
            ("vt100", (true, true)),
            ("vt102", (true, true)),
            ("linux", (false, true)),
            ("xterm-256color", (false, false)),
            ("screen", (false, false)),
            ("tmux-256color", (false, false)),
            ("", (false, false)),
        ] {
            assert_eq!(limited_terminal(t), want, "{t}");
        }
    }
}
