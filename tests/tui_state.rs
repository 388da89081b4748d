//! The workspace state driven by keys and actions, no terminal: ticking a cell changes Γ and
//! the worked reduction as a hand calculation says; undo/redo, group changes, saving, quitting,
//! recovery, search, mouse clicks; and the key map documents every binding it has.

use salcdesk::analysis::Outcome;
use salcdesk::rep::format_sum;
use salcdesk::session::{self, Recovery};
use salcdesk::tui::app::{Mode, Question};
use salcdesk::tui::keymap::{self, Code, Key};
use salcdesk::tui::{Action, App, Panel};
use std::path::{Path, PathBuf};

fn tmpdir(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("salcdesk-state-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap();
    std::env::set_var(
        "SALCDESK_CACHE_DIR",
        std::env::temp_dir().join(format!("salcdesk-state-cache-{}", std::process::id())),
    );
    d
}

/// The puzzle session copied to a folder of its own, opened.
fn puzzle(name: &str) -> (App, PathBuf) {
    let dir = tmpdir(name);
    let p = dir.join("puzzle.toml");
    std::fs::copy(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions/degenerate-puzzle.toml"),
        &p,
    )
    .unwrap();
    let s = session::load_file(&p).unwrap();
    let mut app = App::new(s, Some(p.clone()), false, false);
    app.finish_analysis();
    (app, p)
}

fn keys(app: &mut App, ks: &[Key]) {
    for k in ks {
        app.handle_key(*k);
    }
}

fn gamma(app: &App) -> Option<String> {
    let (a, s) = app.current_set()?;
    s.multiplicities().map(|m| format_sum(&a.group, m, false))
}

#[test]
fn ticking_the_missing_mirror_makes_the_stretches_a1_plus_e() {
    // Hand calculation (C3v, h = 6; Cotton, 3rd ed., §4.3 reduction formula): χ = (3, 0, 1)
    // n(A1) = (3 + 0 + 3)/6 = 1, n(A2) = (3 + 0 − 3)/6 = 0, n(E) = (6 + 0 + 0)/6 = 1.
    let (mut app, _) = puzzle("tick");
    assert_eq!(app.panel, Panel::Members);
    assert_eq!(gamma(&app), None, "the puzzle starts impossible");
    keys(&mut app, &[Key::ch('l'), Key::ch('l'), Key::ch(' ')]);
    let (_, s) = app.current_set().unwrap();
    assert_eq!(s.unmoved, vec![3, 0, 1]);
    assert_eq!(gamma(&app).as_deref(), Some("A1 + E"));
    match &*s.outcome {
        Outcome::Finite { reduction, .. } => {
            let v: Vec<String> = reduction
                .lines
                .iter()
                .map(|l| l.value.text(Default::default()))
                .collect();
            assert_eq!(v, vec!["1", "0", "1"]);
            assert_eq!(reduction.lines[0].terms[2].product.to_i64(), Some(3));
        }
        o => panic!("{o:?}"),
    }
    assert!(app.dirty());
}

#[test]
fn undo_and_redo_walk_the_edits() {
    let (mut app, _) = puzzle("undo");
    keys(&mut app, &[Key::ch('l'), Key::ch('l'), Key::ch(' ')]);
    assert_eq!(gamma(&app).as_deref(), Some("A1 + E"));
    app.handle_key(Key::ch('u'));
    assert_eq!(gamma(&app), None);
    assert!(!app.dirty());
    app.handle_key(Key::ctrl('r'));
    assert_eq!(gamma(&app).as_deref(), Some("A1 + E"));
}

#[test]
fn the_identity_column_cannot_be_unticked() {
    let (mut app, _) = puzzle("identity");
    app.apply(Action::Toggle);
    assert!(!app.dirty());
    assert!(app
        .status
        .as_ref()
        .unwrap()
        .text
        .contains("E leaves every member in place"));
}

#[test]
fn saving_writes_the_edit_and_reloading_finds_it() {
    let (mut app, p) = puzzle("save");
    keys(
        &mut app,
        &[Key::ch('l'), Key::ch('l'), Key::ch(' '), Key::ch('s')],
    );
    assert!(!app.dirty());
    let again = session::load_file(&p).unwrap();
    assert_eq!(again.sets[0].members[0].unmoved_by, vec!["E", "3sv"]);
    assert_eq!(again, app.session);
}

#[test]
fn quitting_with_unsaved_edits_asks_first() {
    let (mut app, p) = puzzle("quit");
    app.handle_key(Key::ch('q'));
    assert!(app.quit, "nothing to lose: quits at once");
    let (mut app, _) = puzzle("quit2");
    keys(
        &mut app,
        &[Key::ch('l'), Key::ch('l'), Key::ch(' '), Key::ch('q')],
    );
    assert!(!app.quit);
    assert_eq!(app.mode, Mode::Ask(Question::Quit));
    app.handle_key(Key::plain(Code::Esc));
    assert!(!app.quit);
    app.handle_key(Key::ch('q'));
    app.handle_key(Key::ch('d'));
    assert!(app.quit);
    // the file on disk was not touched
    let s = session::load_file(&p).unwrap();
    assert_eq!(s.sets[0].members[0].unmoved_by, vec!["E"]);
}

#[test]
fn unsaved_edits_of_an_earlier_run_are_offered_back() {
    let (app, p) = puzzle("recover");
    let mut edited = app.session.clone();
    edited.sets[0].members[0].unmoved_by.push("3sv".into());
    Recovery::for_session(Some(&p)).write(&edited).unwrap();
    let mut again = App::new(
        session::load_file(&p).unwrap(),
        Some(p.clone()),
        false,
        false,
    );
    assert!(matches!(again.mode, Mode::Ask(Question::Recover(_))));
    again.handle_key(Key::ch('r'));
    again.finish_analysis();
    assert_eq!(gamma(&again).as_deref(), Some("A1 + E"));
    assert!(again.dirty(), "restored edits still need saving");
}

#[test]
fn adding_a_member_through_the_name_field() {
    let (mut app, _) = puzzle("add");
    app.handle_key(Key::ch('a'));
    assert!(matches!(&app.mode, Mode::Field(f) if f.text == "r4"));
    app.handle_key(Key::plain(Code::Enter));
    let (_, s) = app.current_set().unwrap();
    assert_eq!(s.members.len(), 4);
    assert_eq!(s.unmoved[0], 4);
    assert_eq!(app.members_ui.row, 3);
}

#[test]
fn finding_and_choosing_a_group_keeps_only_ticks_it_has() {
    let (mut app, _) = puzzle("group");
    keys(&mut app, &[Key::ch('l'), Key::ch('l'), Key::ch(' ')]);
    app.handle_key(Key::ch('/'));
    assert_eq!(app.panel, Panel::Group);
    keys(&mut app, &[Key::ch('c'), Key::ch('3'), Key::ch('h')]);
    assert_eq!(app.group_matches()[0].name, "C3h");
    app.handle_key(Key::plain(Code::Enter));
    assert_eq!(app.session.group.as_deref(), Some("C3h"));
    // 3sv is not a class of C3h: the tick went, E stayed
    assert_eq!(app.session.sets[0].members[0].unmoved_by, vec!["E"]);
    app.handle_key(Key::ch('u'));
    assert_eq!(app.session.group.as_deref(), Some("C3v"));
    assert_eq!(app.session.sets[0].members[0].unmoved_by, vec!["E", "3sv"]);
}

#[test]
fn search_matches_order_and_family_too() {
    let (mut app, _) = puzzle("search");
    app.load_catalogue();
    app.apply(Action::Search);
    for c in "48".chars() {
        app.handle_key(Key::ch(c));
    }
    assert_eq!(app.group_matches()[0].name, "Oh");
    app.apply(Action::Search);
    for c in "cubic".chars() {
        app.handle_key(Key::ch(c));
    }
    let names: Vec<&str> = app
        .group_matches()
        .iter()
        .map(|e| e.name.as_str())
        .collect();
    assert_eq!(&names[..5], &["T", "Td", "Th", "O", "Oh"]);
}

#[test]
fn a_click_on_a_cell_ticks_it_and_a_click_on_a_tab_opens_it() {
    let (mut app, _) = puzzle("click");
    app.screen = (80, 24);
    // Members panel: body starts at row 2, border, set line, header → first member at y = 5.
    // Columns: name 9 wide + border 1; E (4 wide), 2C3 (4 wide), 3sv at x = 1 + 9 + 4 + 4.
    app.apply(Action::Click {
        x: 1 + 9 + 8 + 2,
        y: 5,
    });
    assert_eq!((app.members_ui.row, app.members_ui.col), (0, 2));
    assert_eq!(gamma(&app).as_deref(), Some("A1 + E"));
    app.apply(Action::Click { x: 30, y: 1 });
    assert_eq!(app.panel, Panel::Representation);
}

#[test]
fn every_binding_is_in_the_help_and_keys_are_not_bound_twice_in_one_panel() {
    let th_help = keymap::help(false);
    let all: Vec<&str> = th_help
        .iter()
        .flat_map(|(_, v)| v.iter().map(|(_, d)| *d))
        .collect();
    for b in keymap::BINDINGS {
        assert!(all.contains(&b.help), "{} missing from help", b.help);
    }
    for p in Panel::ALL {
        let mut seen = std::collections::HashSet::new();
        for b in keymap::BINDINGS.iter().filter(|b| match b.scope {
            keymap::Scope::Everywhere => true,
            keymap::Scope::In(q) => q == p,
        }) {
            for k in b.keys {
                if !seen.insert(*k) {
                    // a panel binding may shadow a general one, but only that way round
                    assert_eq!(
                        keymap::lookup(*k, p),
                        Some(
                            keymap::BINDINGS
                                .iter()
                                .find(|x| x.keys.contains(k) && x.scope == keymap::Scope::In(p))
                                .unwrap()
                                .action
                        ),
                        "{k:?} in {p:?}"
                    );
                }
            }
        }
    }
}

/// The tick grid's cell (member, class) on screen, wherever the layout put the Members pane.
fn cell_xy(app: &App, row: usize, class: usize) -> Option<(u16, u16)> {
    let tile = app
        .tiles()
        .into_iter()
        .find(|t| t.panel == Panel::Members)?;
    let a = app.analysis.as_ref().ok()?;
    let s = a.sets.get(app.members_ui.set)?;
    let g = salcdesk::tui::panels::members::grid(tile.area, app, a, s);
    let (_, x0, w) = g.cols.iter().find(|(c, _, _)| *c == class)?;
    let y = g.inner.y + g.row_y + (row - g.first_row) as u16;
    Some((g.inner.x + x0 + w / 2, y))
}

/// Mouse ticking at every size the workspace is laid out for (one pane, two and three
/// columns): a click on each visible cell of the first member flips that cell only (E stays,
/// it is always ticked), from whichever pane had the focus.
#[test]
fn a_click_ticks_each_cell_in_every_layout() {
    for (w, h) in [(80, 24), (120, 32), (200, 50)] {
        let (mut app, _) = puzzle(&format!("click-{w}"));
        app.screen = (w, h);
        let classes = app.analysis.as_ref().unwrap().group.table.classes.len();
        for c in 0..classes {
            // Start from another pane where the Members pane is on screen with it.
            let start = if app.tiled() {
                Panel::Combinations
            } else {
                Panel::Members
            };
            app.apply(Action::GoPanel(start));
            app.members_ui.col = c;
            let Some((x, y)) = cell_xy(&app, 0, c) else {
                panic!("{w}x{h}: class {c} not on screen");
            };
            let before = app.analysis.as_ref().unwrap().sets[0].grid[0].clone();
            app.apply(Action::Click { x, y });
            assert_eq!(
                app.panel,
                Panel::Members,
                "{w}x{h}: the click focuses the grid"
            );
            let after = app.analysis.as_ref().unwrap().sets[0].grid[0].clone();
            for k in 0..classes {
                let flipped = before[k] != after[k];
                let want = k == c && c != 0;
                assert_eq!(flipped, want, "{w}x{h}: click on class {c}, class {k}");
            }
            app.apply(Action::Undo);
        }
    }
}

/// Tiles from 120x32 up, one pane below; z zooms the focused pane and back; the layout
/// follows the screen size (a resize is a new size on the next frame).
#[test]
fn zoom_and_resize_choose_the_panes() {
    let (mut app, _) = puzzle("zoom");
    app.apply(Action::GoPanel(Panel::Members));
    app.screen = (80, 24);
    assert_eq!(app.tiles().len(), 1);
    app.apply(Action::Zoom);
    assert!(!app.zoom, "nothing to zoom on one pane");
    app.screen = (120, 32);
    let panes: Vec<Panel> = app.tiles().iter().map(|t| t.panel).collect();
    assert_eq!(
        panes,
        [Panel::Members, Panel::Representation, Panel::Combinations]
    );
    app.screen = (200, 50);
    assert_eq!(app.tiles().len(), 4);
    app.apply(Action::Zoom);
    assert_eq!(app.tiles().len(), 1);
    assert_eq!(app.tiles()[0].panel, Panel::Members);
    app.apply(Action::Zoom);
    assert_eq!(app.tiles().len(), 4);
    // A focused pane outside the usual tiles comes on screen in the last column.
    app.apply(Action::GoPanel(Panel::Molecule));
    assert!(app.tiles().iter().any(|t| t.panel == Panel::Molecule));
    app.screen = (119, 50);
    assert_eq!(app.tiles().len(), 1);
}

/// Each text pane keeps its own place when the focus moves on and comes back.
#[test]
fn every_pane_keeps_its_own_scroll() {
    let (mut app, _) = puzzle("scroll");
    app.screen = (80, 24);
    app.apply(Action::GoPanel(Panel::Representation));
    app.apply(Action::Down);
    app.apply(Action::Down);
    app.apply(Action::GoPanel(Panel::Spectra));
    app.apply(Action::Down);
    assert_eq!(app.scroll_of(Panel::Spectra), 1);
    app.apply(Action::GoPanel(Panel::Representation));
    assert_eq!(app.scroll_of(Panel::Representation), 2);
}

/// G in the help goes to its last page and k comes back from there at once; Ctrl-u clears
/// the group search.
#[test]
fn help_scrolls_to_the_end_and_ctrl_u_clears_the_search() {
    let (mut app, _) = puzzle("help");
    app.screen = (80, 24);
    app.apply(Action::Help);
    app.handle_key(Key::ch('G'));
    let Mode::Help { scroll: end } = app.mode else {
        panic!("help closed")
    };
    assert!(end > 0, "the help is longer than 80x24");
    app.handle_key(Key::ch('k'));
    assert_eq!(app.mode, Mode::Help { scroll: end - 1 });
    app.handle_key(Key::ch('g'));
    assert_eq!(app.mode, Mode::Help { scroll: 0 });
    app.handle_key(Key::plain(Code::Esc));
    app.apply(Action::Search);
    for c in "D4h".chars() {
        app.handle_key(Key::ch(c));
    }
    assert_eq!(app.group_ui.query, "D4h");
    app.handle_key(Key::ctrl('u'));
    assert_eq!(app.group_ui.query, "");
}

/// Type a whole field: the keys that open it, the text, Enter.
fn type_field(app: &mut App, open: Action, text: &str) {
    app.apply(open);
    app.handle_key(Key::ctrl('u'));
    for c in text.chars() {
        app.handle_key(Key::ch(c));
    }
    app.handle_key(Key::plain(Code::Enter));
}

/// Bands are added, changed and removed in the Spectra pane, each one undoable edit; a
/// typed band is read like a band-list file line (bad ones refused with the reader's
/// message, nothing changed); the list survives save and reload; title and orientation too.
#[test]
fn bands_title_and_orientation_are_edited_in_place_and_saved() {
    let (mut app, path) = puzzle("bands");
    app.apply(Action::GoPanel(Panel::Spectra));
    let n0 = app.session.bands.len();
    type_field(&mut app, Action::AddBand, "1020.5 Raman s p ring breathing");
    assert_eq!(app.session.bands.len(), n0 + 1);
    let b = app.session.bands.last().unwrap().clone();
    assert_eq!(b.position, 1020.5);
    assert_eq!(b.technique, session::Technique::Raman);
    assert_eq!(b.intensity, "s");
    assert_eq!(b.polarization, Some(session::Polarization::Polarized));
    assert_eq!(b.note, "ring breathing");
    for bad in ["Raman 300", "300 UV", "-5 IR", "300 IR p"] {
        type_field(&mut app, Action::AddBand, bad);
        assert_eq!(app.session.bands.len(), n0 + 1, "{bad} was accepted");
        assert!(
            app.status.as_ref().is_some_and(|s| s.error),
            "{bad}: no message"
        );
    }
    // Change it: the field starts from the band as typed.
    let k = app.session.bands.len();
    app.apply(Action::ChangeBand);
    app.handle_key(Key::ctrl('u'));
    for c in k.to_string().chars() {
        app.handle_key(Key::ch(c));
    }
    app.handle_key(Key::plain(Code::Enter));
    let Mode::Field(f) = &app.mode else {
        panic!("no band field")
    };
    assert_eq!(f.text, "1020.5 Raman s p ring breathing");
    app.handle_key(Key::ctrl('u'));
    for c in "1018 IR m".chars() {
        app.handle_key(Key::ch(c));
    }
    app.handle_key(Key::plain(Code::Enter));
    let b = app.session.bands[k - 1].clone();
    assert_eq!((b.position, b.technique), (1018.0, session::Technique::Ir));
    type_field(&mut app, Action::EditTitle, "Puzzle, retitled");
    type_field(&mut app, Action::EditOrientation, "C3 along z");
    app.apply(Action::Save);
    let back = session::load_file(&path).unwrap();
    assert_eq!(back.bands, app.session.bands);
    assert_eq!(back.title, "Puzzle, retitled");
    assert_eq!(back.orientation, "C3 along z");
    // Undo walks back: orientation, title, the change, the add.
    for _ in 0..4 {
        app.apply(Action::Undo);
    }
    assert_eq!(app.session.bands.len(), n0);
    // Remove the first band (when the puzzle has one), and bring it back.
    type_field(&mut app, Action::AddBand, "300 IR w");
    type_field(&mut app, Action::RemoveBand, "99");
    assert!(app.status.as_ref().is_some_and(|s| s.error));
    assert_eq!(app.session.bands.len(), n0 + 1);
    type_field(&mut app, Action::RemoveBand, "1");
    assert_eq!(app.session.bands.len(), n0);
    app.apply(Action::Undo);
    assert_eq!(app.session.bands.len(), n0 + 1);
}

/// Save-as writes the new file in the layout of the file the session came from: the user's
/// comments survive (session::save_keeping; the library side is tests/session_keep_layout.rs).
#[test]
fn save_as_keeps_the_comments_of_the_opened_file() {
    let (_, path) = puzzle("save-as-layout");
    // A hand-edited file: the user's own comment lines.
    let original = format!(
        "# kept by hand: bands from the 2026 Raman run\n{}\n# end of file note\n",
        std::fs::read_to_string(&path).unwrap()
    );
    std::fs::write(&path, &original).unwrap();
    let mut app = App::new(
        session::load_file(&path).unwrap(),
        Some(path.clone()),
        false,
        false,
    );
    app.finish_analysis();
    let comments: Vec<&str> = original
        .lines()
        .filter(|l| l.trim_start().starts_with('#'))
        .collect();
    assert_eq!(comments.len(), 2);
    type_field(&mut app, Action::EditTitle, "Puzzle, saved elsewhere");
    let to = path.with_file_name("copy.toml");
    assert!(app.save_to(&to));
    let written = std::fs::read_to_string(&to).unwrap();
    for c in comments {
        assert!(written.contains(c), "comment lost on save-as: {c}");
    }
    assert_eq!(
        session::load_file(&to).unwrap().title,
        "Puzzle, saved elsewhere"
    );
}

/// The water frequency job (PySCF HF/STO-3G Hessian, tests/fixtures/vib) next to a session
/// naming it: the Normal modes pane is in the Tab order and key 7 reaches it; it shows every
/// mode with its species. A session without a Hessian skips the pane and says how to add one.
#[test]
fn a_session_with_a_hessian_has_a_normal_modes_pane() {
    let dir = tmpdir("vib");
    std::fs::copy(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/fixtures/vib/water.json"),
        dir.join("water.json"),
    )
    .unwrap();
    let p = dir.join("water.toml");
    std::fs::write(
        &p,
        "format = 1\ntitle = \"Water\"\n\n[vibrations]\nhessian = \"water.json\"\nscale = 0.883\n",
    )
    .unwrap();
    let s = session::load_file(&p).unwrap();
    let mut app = App::new(s, Some(p), false, false);
    app.finish_analysis();
    assert_eq!(app.panels(), Panel::ALL.to_vec());
    // Tab visits every pane once, Normal modes among them, and comes back
    let start = app.panel;
    let mut seen = vec![];
    for _ in 0..Panel::ALL.len() {
        keys(&mut app, &[Key::plain(Code::Tab)]);
        seen.push(app.panel);
    }
    assert_eq!(app.panel, start);
    assert!(seen.contains(&Panel::Vibrations), "{seen:?}");
    keys(&mut app, &[Key::ch('7')]);
    assert_eq!(app.panel, Panel::Vibrations);
    // the pane's text: one row per mode set, species of water (Herzberg 1945: 2A1 + B2)
    let a = app.analysis.as_ref().unwrap();
    let th = salcdesk::tui::theme::Theme::new(false, true);
    let text: Vec<String> = salcdesk::tui::panels::vibrations::lines(a, &th, 110)
        .iter()
        .map(|l| l.to_string())
        .collect();
    let rows = |irrep: &str| {
        text.iter()
            .filter(|l| l.split_whitespace().any(|w| w == irrep))
            .filter(|l| l.contains("nu"))
            .count()
    };
    assert_eq!((rows("A1"), rows("B2")), (2, 1), "{text:#?}");
    for nu in ["nu1", "nu2", "nu3"] {
        assert!(text.iter().any(|l| l.contains(nu)), "{nu}: {text:#?}");
    }
    // down scrolls the pane
    keys(&mut app, &[Key::plain(Code::Down)]);
    assert_eq!(app.scroll_of(Panel::Vibrations), 1);

    // no Hessian: Tab never lands on the pane, 7 stays put and says how to add one
    let (mut app, _) = puzzle("novib");
    assert!(!app.panels().contains(&Panel::Vibrations));
    for _ in 0..2 * Panel::ALL.len() {
        keys(&mut app, &[Key::plain(Code::BackTab)]);
        assert_ne!(app.panel, Panel::Vibrations);
    }
    let before = app.panel;
    keys(&mut app, &[Key::ch('7')]);
    assert_eq!(app.panel, before);
    let st = app
        .status
        .as_ref()
        .map(|s| s.text.clone())
        .unwrap_or_default();
    assert!(st.contains("[vibrations] hessian"), "{st}");
}
