//! The session's own records edited in the workspace, no terminal: note lines (add, retype,
//! remove), positions of fundamentals, a new empty session, each undoable and saved; and the
//! 80×24 details — long prompts wrap, Ctrl-u clears every prompt, the Representation pane
//! scrolls its class columns sideways under fixed row labels, Spectra speaks in the same
//! symbols as the rest.

mod common;

use common::{copy_session, TempDir};
use ratatui::backend::TestBackend;
use ratatui::Terminal;
use salcdesk::session;
use salcdesk::tui::app::{Mode, Question};
use salcdesk::tui::keymap::{Code, Key};
use salcdesk::tui::{ui, Action, App, Panel};
use std::path::PathBuf;

fn open(dir: &TempDir, example: &str) -> (App, PathBuf) {
    std::env::set_var("SALCDESK_CACHE_DIR", dir.join("cache"));
    let p = copy_session(example, dir.path(), "work.toml");
    let s = session::load_file(&p).unwrap();
    let mut app = App::new(s, Some(p.clone()), false, false);
    app.finish_analysis();
    (app, p)
}

fn type_text(app: &mut App, text: &str) {
    for c in text.chars() {
        app.handle_key(Key::ch(c));
    }
}

/// Open a field with `open`, clear it, type `text`, Enter.
fn field(app: &mut App, open: Action, text: &str) {
    app.apply(open);
    app.handle_key(Key::ctrl('u'));
    type_text(app, text);
    app.handle_key(Key::plain(Code::Enter));
}

fn screen(app: &mut App, w: u16, h: u16) -> String {
    app.screen = (w, h);
    let mut t = Terminal::new(TestBackend::new(w, h)).unwrap();
    t.draw(|f| ui::draw(f, app)).unwrap();
    let buf = t.backend().buffer().clone();
    let mut out = String::new();
    for y in 0..h {
        for x in 0..w {
            out.push_str(buf[(x, y)].symbol());
        }
        out.push('\n');
    }
    out
}

fn error_shown(app: &App) -> bool {
    app.status.as_ref().is_some_and(|s| s.error)
}

#[test]
fn note_lines_are_added_retyped_removed_undone_and_saved() {
    let dir = TempDir::new("notes");
    let (mut app, p) = open(&dir, "degenerate-puzzle.toml");
    let before = app.session.notes.lines().count();
    // Anything that is not a line number is a new line as typed.
    field(
        &mut app,
        Action::EditNotes,
        "bands from our own test spectrum",
    );
    field(&mut app, Action::EditNotes, "+ 42");
    let lines: Vec<String> = app.session.notes.lines().map(str::to_string).collect();
    assert_eq!(lines.len(), before + 2);
    assert_eq!(lines[before], "bands from our own test spectrum");
    assert_eq!(lines[before + 1], "42");
    // A number opens that line, as written, for retyping.
    field(&mut app, Action::EditNotes, &(before + 1).to_string());
    let Mode::Field(f) = &app.mode else {
        panic!("no note field")
    };
    assert_eq!(f.text, "bands from our own test spectrum");
    app.handle_key(Key::ctrl('u'));
    type_text(&mut app, "bands retyped");
    app.handle_key(Key::plain(Code::Enter));
    assert_eq!(
        app.session.notes.lines().nth(before).unwrap(),
        "bands retyped"
    );
    // -N removes line N; a number beyond the notes is refused, nothing changed.
    field(&mut app, Action::EditNotes, &format!("-{}", before + 2));
    assert_eq!(app.session.notes.lines().count(), before + 1);
    let snapshot = app.session.clone();
    field(&mut app, Action::EditNotes, "-99");
    assert!(error_shown(&app));
    assert_eq!(app.session, snapshot);
    // Saved and read again.
    app.apply(Action::Save);
    assert_eq!(session::load_file(&p).unwrap().notes, app.session.notes);
    // Undo walks back: the removal, the retyping, the two additions.
    for _ in 0..4 {
        app.apply(Action::Undo);
    }
    assert_eq!(app.session.notes.lines().count(), before);
    // Shown in the Spectra pane, numbered.
    app.apply(Action::Redo);
    app.apply(Action::GoPanel(Panel::Spectra));
    app.apply(Action::End);
    let s = screen(&mut app, 80, 24);
    assert!(
        s.contains(&format!(
            "{:<4}bands from our own test spectrum",
            before + 1
        )),
        "{s}"
    );
}

/// Planar XY3 (D3h) numbering ν1 A₁′, ν2 A₂″, ν3 E′, ν4 E′ (Nakamoto, Part A); harmonic
/// sums (Herzberg 1945, ch. II). Positions are test numbers.
#[test]
fn a_fundamental_given_a_position_places_its_overtones() {
    let dir = TempDir::new("nu");
    let (mut app, p) = open(&dir, "planar-trigonal-mx3.toml");
    app.apply(Action::GoPanel(Panel::Spectra));
    app.handle_key(Key::ch('v'));
    let Mode::Field(f) = &app.mode else {
        panic!("v opens no field in Spectra")
    };
    assert!(f.label.contains("ν1 to ν4"), "{}", f.label);
    app.handle_key(Key::plain(Code::Esc));
    field(&mut app, Action::SetNuPosition, "1 330");
    field(&mut app, Action::SetNuPosition, "ν4 150");
    assert_eq!(app.session.nu_positions, vec![(1, 330.0), (4, 150.0)]);
    // (The full analysis, which numbers the fundamentals, follows every edit.)
    app.finish_analysis();
    // Refused, nothing changed: a ν the pane does not have, a bad number, a missing one.
    for bad in ["5 100", "1 -3", "1", "x 300"] {
        field(&mut app, Action::SetNuPosition, bad);
        assert!(error_shown(&app), "{bad} accepted");
        assert_eq!(app.session.nu_positions.len(), 2, "{bad}");
    }
    app.finish_analysis();
    let s = screen(&mut app, 200, 50);
    let row = s
        .lines()
        .find(|l| l.contains("ν1 + ν4"))
        .expect("the combination row");
    assert!(row.contains("480"), "{row}");
    // Retyping replaces; "-" clears; both undoable.
    field(&mut app, Action::SetNuPosition, "4 151");
    assert_eq!(app.session.nu_positions, vec![(1, 330.0), (4, 151.0)]);
    field(&mut app, Action::SetNuPosition, "1 -");
    assert_eq!(app.session.nu_positions, vec![(4, 151.0)]);
    app.apply(Action::Undo);
    app.apply(Action::Save);
    assert_eq!(
        session::load_file(&p).unwrap().nu_positions,
        vec![(1, 330.0), (4, 151.0)]
    );
}

#[test]
fn a_new_session_asks_about_unsaved_edits_and_never_loses_saved_work() {
    let dir = TempDir::new("new");
    let (mut app, p) = open(&dir, "degenerate-puzzle.toml");
    let on_disk = std::fs::read_to_string(&p).unwrap();
    // Nothing unsaved: at once.
    app.handle_key(Key::ctrl('n'));
    assert_eq!(app.mode, Mode::Normal);
    assert_eq!(app.session, session::Session::default());
    assert_eq!(app.path, None);
    assert!(!app.dirty());
    // The old session is one u away (as unsaved edits, its file untouched).
    app.apply(Action::Undo);
    assert_eq!(app.session.title, session::load_file(&p).unwrap().title);
    assert!(app.dirty());
    // With unsaved edits it asks; Esc stays.
    app.handle_key(Key::ctrl('n'));
    assert_eq!(app.mode, Mode::Ask(Question::NewSession));
    app.handle_key(Key::plain(Code::Esc));
    assert_eq!(app.mode, Mode::Normal);
    assert_ne!(app.session, session::Session::default());
    // Reopen the file and edit it: s saves first, then starts the new session.
    let s = session::load_file(&p).unwrap();
    let mut app = App::new(s, Some(p.clone()), false, false);
    field(&mut app, Action::EditTitle, "Saved before the new one");
    app.handle_key(Key::ctrl('n'));
    app.handle_key(Key::ch('s'));
    assert_eq!(app.session, session::Session::default());
    assert_eq!(
        session::load_file(&p).unwrap().title,
        "Saved before the new one"
    );
    // d discards the edits: the file stays as it was saved.
    let saved = std::fs::read_to_string(&p).unwrap();
    assert_ne!(saved, on_disk);
    let s = session::load_file(&p).unwrap();
    let mut app = App::new(s, Some(p.clone()), false, false);
    field(&mut app, Action::EditTitle, "Thrown away");
    app.handle_key(Key::ctrl('n'));
    app.handle_key(Key::ch('d'));
    assert_eq!(app.session, session::Session::default());
    assert_eq!(std::fs::read_to_string(&p).unwrap(), saved);
    // The new session is saved under a name of its own.
    field(&mut app, Action::EditTitle, "Fresh");
    let q = dir.join("fresh.toml");
    field(&mut app, Action::SaveAs, q.to_str().unwrap());
    assert_eq!(session::load_file(&q).unwrap().title, "Fresh");
    assert_eq!(std::fs::read_to_string(&p).unwrap(), saved);
}

#[test]
fn ctrl_u_clears_every_prompt() {
    let dir = TempDir::new("ctrlu");
    let (mut app, _) = open(&dir, "planar-trigonal-mx3.toml");
    let prompts = [
        (Panel::Members, Action::AddMember),
        (Panel::Members, Action::RenameMember),
        (Panel::Members, Action::AddSet),
        (Panel::Members, Action::RenameSet),
        (Panel::Spectra, Action::AddBand),
        (Panel::Spectra, Action::SetNuPosition),
        (Panel::Molecule, Action::AddBond),
        (Panel::Molecule, Action::RemoveBond),
        (Panel::Members, Action::EditTitle),
        (Panel::Members, Action::EditOrientation),
        (Panel::Members, Action::EditNotes),
        (Panel::Members, Action::SaveAs),
        (Panel::Members, Action::Export),
    ];
    for (panel, a) in prompts {
        app.apply(Action::GoPanel(panel));
        app.apply(a);
        type_text(&mut app, "abc");
        let Mode::Field(f) = &app.mode else {
            panic!("{a:?} opens no field")
        };
        assert!(f.text.ends_with("abc"), "{a:?}");
        app.handle_key(Key::ctrl('u'));
        let Mode::Field(f) = &app.mode else {
            panic!("{a:?}: Ctrl-u closed the field")
        };
        assert_eq!(f.text, "", "{a:?}");
        app.handle_key(Key::plain(Code::Esc));
    }
}

/// A question longer than the screen is wide is shown whole, wrapped upwards, not cut.
#[test]
fn a_long_prompt_wraps_at_80_columns() {
    let dir = TempDir::new("wrap");
    let (mut app, _) = open(&dir, "planar-trigonal-mx3.toml");
    app.apply(Action::GoPanel(Panel::Spectra));
    app.apply(Action::SetNuPosition);
    let Mode::Field(f) = app.mode.clone() else {
        panic!("no field")
    };
    assert!(f.label.chars().count() > 80);
    let s = screen(&mut app, 80, 24);
    let words: String = s
        .lines()
        .rev()
        .skip(1)
        .take(3)
        .collect::<Vec<_>>()
        .into_iter()
        .rev()
        .map(str::trim)
        .collect::<Vec<_>>()
        .join(" ");
    assert!(words.contains(&format!("{}:", f.label)), "{s}");
    assert!(!s.contains('…'), "{s}");
}

/// Sideways, the class columns move and the row labels (unmoved, each, χ) stay.
#[test]
fn the_representation_scrolls_its_classes_sideways_under_fixed_labels() {
    let dir = TempDir::new("side");
    let (mut app, _) = open(&dir, "planar-trigonal-mx3.toml");
    app.apply(Action::GoPanel(Panel::Representation));
    let th = ui::theme(&app);
    let text = |app: &App| -> Vec<String> {
        salcdesk::tui::panels::representation::lines(app, &th, 30)
            .iter()
            .map(|l| l.spans.iter().map(|s| s.content.as_ref()).collect())
            .collect()
    };
    let row = |ls: &[String], head: &str| ls.iter().find(|l| l.starts_with(head)).cloned();
    let before = text(&app);
    assert!(
        before.iter().any(|l| l.starts_with("classes 1–")),
        "{before:?}"
    );
    let unmoved0 = row(&before, "unmoved").unwrap();
    // D3h classes in table order: E, 2C3, 3C2, σh, 2S3, 3σv (Cotton, Appendix IIA).
    let header0 = before.iter().find(|l| l.contains("2C₃")).unwrap().clone();
    assert!(header0.trim_start().starts_with('E'));
    app.handle_key(Key::ch('l'));
    app.handle_key(Key::ch('l'));
    let after = text(&app);
    assert!(
        after.iter().any(|l| l.starts_with("classes 3–")),
        "{after:?}"
    );
    let header = after.iter().find(|l| l.contains("3C₂")).unwrap();
    assert!(!header.contains("2C₃") && header.starts_with("            "));
    let unmoved = row(&after, "unmoved").unwrap();
    assert!(unmoved.starts_with("unmoved     "));
    assert_ne!(unmoved, unmoved0);
    // Back to the first column.
    app.handle_key(Key::ch('h'));
    app.handle_key(Key::ch('h'));
    app.handle_key(Key::ch('h'));
    assert_eq!(row(&text(&app), "unmoved").unwrap(), unmoved0);
}

/// Spectra uses the workspace's symbols: A₁′, 2E′ and box rules in Unicode, plain ASCII
/// throughout with --ascii.
#[test]
fn spectra_speaks_the_same_symbols_as_the_rest() {
    let dir = TempDir::new("symbols");
    let (mut app, _) = open(&dir, "planar-trigonal-mx3.toml");
    app.apply(Action::GoPanel(Panel::Spectra));
    let s = screen(&mut app, 80, 24);
    assert!(s.contains("A₁′ + 2E′ + A₂″"), "{s}");
    for ascii_bit in ["A1'", "2E'", "E'", "----", "A2''"] {
        assert!(!s.contains(ascii_bit), "{ascii_bit} in Unicode mode:\n{s}");
    }
    app.ascii = true;
    let s = screen(&mut app, 80, 24);
    assert!(s.is_ascii(), "{s}");
    assert!(s.contains("A1' + 2E' + A2''"), "{s}");
}
