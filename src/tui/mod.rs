//! The terminal workspace: panels over one session, redrawn after every key.
//!
//! Split three ways: state and what actions do to it (`app`, `action`, no terminal library),
//! the one key map that also writes the help and the footer (`keymap`), and drawing as pure
//! functions of the state (`ui`, one file per panel in `panels`, styles in `theme`). Only this
//! module imports ratatui and crossterm; `reader` (input, read with poll(2)/read(2) and decoded
//! by `input`) and `terminal` (output) are the only files that touch the terminal itself.
//! Chemistry comes from `analysis::analyze`, run quickly after every edit and fully on a
//! background thread (`worker`). Signals and a lost terminal end the workspace in order
//! (`signals`; see `run`).

pub mod action;
pub mod app;
mod atoms_edit;
mod input;
pub mod keymap;
pub mod layout;
pub mod molecule_edit;
pub mod panels;
pub mod picker;
mod reader;
pub mod session_edit;
pub mod sgr16;
pub mod signals;
pub mod site_picker;
mod terminal;
pub mod text;
pub mod theme;
pub mod ui;
pub mod whatif;
mod worker;

pub use action::{Action, Panel};
pub use app::App;

use crate::session::{self, Session};
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

/// What a terminal type lacks: (colour, the Unicode glyphs). `dumb`, `vt100` and the Linux
/// console get plain ASCII without colour: the first two have neither (terminfo), and the
/// console's default font lacks the subscripts and box glyphs (common practice), so it gets
/// the same plain screen as the others.
pub fn limited_terminal(term: &str) -> (bool, bool) {
    let t = term.trim();
    let base = t.split('-').next().unwrap_or("");
    match base {
        "dumb" | "vt100" | "vt102" | "vt52" | "linux" => (true, true),
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

/// Longest wait for input before the loop looks at the worker, the signals and the autosave.
const TICK: Duration = Duration::from_millis(50);

/// How long the event loop has, after an ending signal, before the watchdog ends the process.
const GRACE: Duration = Duration::from_millis(500);

/// Why the event loop ended.
#[derive(Debug)]
enum Ending {
    /// The user quit.
    Quit,
    /// SIGHUP, SIGTERM or SIGINT arrived.
    Signal(i32),
    /// The terminal is gone: end of input, a read or write error, a hang-up. Counts as SIGHUP.
    Lost(String),
}

/// Run the workspace until the user quits. Errors are messages for the user.
///
/// When a signal or the loss of the terminal ends it, the unsaved edits are written to the
/// recovery file, the terminal is given back and the process exits here with 128 + the
/// signal (129 for a hang-up or end of input, 130 for SIGINT, 143 for SIGTERM).
pub fn run(opts: Options) -> Result<(), String> {
    let s = open_session(opts.path.as_deref())?;
    let (color, ascii) = look(&opts);
    let mut app = App::new(s, opts.path.clone(), ascii, color);
    signals::install();
    signals::watchdog(GRACE, terminal::emergency_exit);
    // The group list loads every table: do it off the main thread.
    let (cat_tx, cat_rx) = std::sync::mpsc::channel();
    std::thread::spawn(move || {
        let _ = cat_tx.send(crate::analysis::catalogue());
    });
    let worker = worker::Worker::start();
    let mut input = reader::Reader::open().map_err(|e| format!("cannot use this terminal: {e}"))?;
    let mut term = terminal::enter().map_err(|e| format!("cannot use this terminal: {e}"))?;
    let ending = event_loop(&mut term, &mut input, &mut app, &worker, &cat_rx);
    let (sig, why) = match ending {
        Ending::Quit => {
            terminal::restore();
            return Ok(());
        }
        Ending::Signal(sig) => (sig, format!("stopped by {}", signals::name(sig))),
        Ending::Lost(why) => (signals::SIGHUP, format!("lost the terminal ({why})")),
    };
    // Edits first, then the terminal (if it is still there).
    let rescued = rescue(&mut app);
    terminal::restore();
    // Its Drop would write to the terminal and print (panicking) when that fails.
    std::mem::forget(term);
    let what = match rescued {
        None => "nothing was unsaved".to_string(),
        Some(Ok(p)) => format!("unsaved edits written to {}", p.display()),
        Some(Err(e)) => format!("the unsaved edits could NOT be written: {e}"),
    };
    say(&format!("salcdesk: {why}; {what}"));
    std::process::exit(signals::exit_status(sig));
}

/// A line on stderr; a stderr that is gone (the terminal hung up) is not an error.
fn say(line: &str) {
    use std::io::Write;
    let _ = writeln!(std::io::stderr(), "{line}");
}

/// Write the unsaved edits to the recovery file now: `None` when there are none.
fn rescue(app: &mut App) -> Option<Result<PathBuf, String>> {
    if !app.dirty() {
        return None;
    }
    let written = terminal::rescue_with(|| app.recovery.write(&app.session));
    Some(written.map(|()| app.recovery.path.clone()))
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

fn draw(term: &mut terminal::Term, app: &mut App) -> std::io::Result<()> {
    let size = term.size()?;
    app.screen = (size.width, size.height);
    term.draw(|f| ui::draw(f, app))?;
    Ok(())
}

fn event_loop(
    term: &mut terminal::Term,
    input: &mut reader::Reader,
    app: &mut App,
    worker: &worker::Worker,
    cat_rx: &std::sync::mpsc::Receiver<Vec<crate::analysis::GroupEntry>>,
) -> Ending {
    let mut redraw = true;
    let mut requested = u64::MAX;
    let mut last_autosave = Instant::now();
    let mut rescue_gen = u64::MAX;
    loop {
        if let Some(sig) = signals::caught() {
            return Ending::Signal(sig);
        }
        if signals::take_resize() {
            redraw = true;
        }
        if redraw {
            if let Err(e) = draw(term, app) {
                return Ending::Lost(format!("writing to it: {e}"));
            }
            redraw = false;
        }
        if app.quit {
            if !app.dirty() {
                app.recovery.clear();
            }
            return Ending::Quit;
        }
        if app.gen != requested {
            requested = app.gen;
            worker.request(app.gen, app.session.clone(), app.base_dir());
        }
        if rescue_gen != app.gen {
            rescue_gen = app.gen;
            terminal::set_rescue(rescue_copy(app));
        }
        match input.wait(TICK) {
            reader::Wait::Input(inputs) => {
                for i in inputs {
                    match i {
                        input::Input::Key(k) => {
                            panic_on_test_key(k);
                            app.handle_key(k)
                        }
                        input::Input::Action(a) => app.apply(a),
                        input::Input::Nothing => {}
                    }
                    redraw = true;
                    if app.quit {
                        break;
                    }
                }
            }
            reader::Wait::Idle | reader::Wait::Interrupted => {}
            reader::Wait::End(why) => return Ending::Lost(why),
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
            terminal::rescue_with(|| app.autosave());
        }
    }
}

#[cfg(test)]
mod tests {
    use super::limited_terminal;

    /// Terminal types by what they lack (common practice: terminfo's dumb and vt100 entries
    /// have no colour; the Linux console font has no subscripts or box glyphs beyond its own,
    /// and it is given the same plain screen).
    #[test]
    fn limited_terminals_get_ascii_and_the_dumb_ones_no_colour() {
        for (t, want) in [
            ("dumb", (true, true)),
            ("vt100", (true, true)),
            ("vt102", (true, true)),
            ("linux", (true, true)),
            ("xterm-256color", (false, false)),
            ("screen", (false, false)),
            ("tmux-256color", (false, false)),
            ("", (false, false)),
        ] {
            assert_eq!(limited_terminal(t), want, "{t}");
        }
    }
}
