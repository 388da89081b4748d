//! Every panel of the workspace on the demo session, drawn with ratatui's TestBackend at
//! 80×24 (one pane), 120×32 (tiled in two columns) and 200×50 (three columns), in Unicode
//! and in ASCII: insta snapshots (review the `.snap` files by
//! reading them). Also the help overlay and the quit question.

use ratatui::backend::TestBackend;
use ratatui::Terminal;
use salcdesk::session;
use salcdesk::tui::app::{Mode, Question};
use salcdesk::tui::{ui, Action, App, Panel};

fn app(ascii: bool) -> App {
    std::env::set_var(
        "SALCDESK_CACHE_DIR",
        std::env::temp_dir().join(format!("salcdesk-snap-cache-{}", std::process::id())),
    );
    let mut a = App::new(session::demo(), None, ascii, false);
    a.load_catalogue();
    a.finish_analysis();
    a
}

fn screen(app: &mut App, w: u16, h: u16) -> String {
    app.screen = (w, h);
    let mut t = Terminal::new(TestBackend::new(w, h)).unwrap();
    t.draw(|f| ui::draw(f, app)).unwrap();
    let buf = t.backend().buffer().clone();
    let mut out = String::new();
    for y in 0..h {
        let mut line = String::new();
        for x in 0..w {
            line.push_str(buf[(x, y)].symbol());
        }
        out.push_str(line.trim_end());
        out.push('\n');
    }
    out
}

fn slug(p: Panel) -> &'static str {
    match p {
        Panel::Group => "group",
        Panel::Members => "members",
        Panel::Representation => "representation",
        Panel::Combinations => "combinations",
        Panel::Spectra => "spectra",
        Panel::Molecule => "molecule",
        Panel::Vibrations => "normal_modes",
    }
}

#[test]
fn every_panel_at_both_sizes_in_both_modes() {
    for ascii in [false, true] {
        let mut a = app(ascii);
        // the demo names no Hessian, so Normal modes is not among its panes
        assert!(!a.panels().contains(&Panel::Vibrations));
        for p in a.panels() {
            a.apply(Action::GoPanel(p));
            for (w, h) in [(80, 24), (120, 32), (200, 50)] {
                let name = format!(
                    "{}_{}x{}_{}",
                    slug(p),
                    w,
                    h,
                    if ascii { "ascii" } else { "unicode" }
                );
                let s = screen(&mut a, w, h);
                // A cut is an ellipsis, never a tilde (which reads as "approximately").
                assert!(!s.contains('~'), "{name} marks a cut with ~:\n{s}");
                if ascii {
                    assert!(s.is_ascii(), "{name} has non-ASCII text:\n{s}");
                }
                insta::assert_snapshot!(name, s);
            }
        }
    }
}

#[test]
fn an_impossible_character_shows_the_error_and_the_suggestions() {
    let mut a = app(false);
    a.apply(Action::GoPanel(Panel::Members));
    a.apply(Action::Right);
    a.apply(Action::Right);
    a.apply(Action::Right);
    a.apply(Action::Toggle); // r1 under 6C4: χ(C4) 2 → 3
    a.finish_analysis();
    a.apply(Action::GoPanel(Panel::Representation));
    insta::assert_snapshot!("representation_impossible_120x40", screen(&mut a, 120, 40));
}

#[test]
fn the_help_overlay_and_the_quit_question() {
    let mut a = app(false);
    a.apply(Action::Help);
    insta::assert_snapshot!("help_120x40", screen(&mut a, 120, 40));
    // At 80 columns the descriptions wrap under themselves instead of being cut.
    let small = screen(&mut a, 80, 24);
    assert!(
        !small.lines().any(|l| l.starts_with('│') && l.contains('…')),
        "help cut at 80 columns:\n{small}"
    );
    insta::assert_snapshot!("help_80x24", small);
    a.mode = Mode::Ask(Question::Quit);
    insta::assert_snapshot!("quit_question_80x24", screen(&mut a, 80, 24));
}

/// An invented tetrahedral MX4 with inline atoms (Sn–Cl 2.30 Å, from memory).
fn mx4_app(ascii: bool) -> App {
    let c = 2.30 / 3f64.sqrt();
    let mut atoms = vec![session::Atom {
        element: "Sn".into(),
        xyz: [0.0, 0.0, 0.0],
    }];
    for s in [
        [1.0, 1.0, 1.0],
        [1.0, -1.0, -1.0],
        [-1.0, 1.0, -1.0],
        [-1.0, -1.0, 1.0],
    ] {
        atoms.push(session::Atom {
            element: "Cl".into(),
            xyz: [c * s[0], c * s[1], c * s[2]],
        });
    }
    let s = session::Session {
        title: "Invented MX4 with a geometry".into(),
        group: Some("Td".into()),
        geometry: Some(session::Geometry::new(session::GeometrySource::Atoms(
            atoms,
        ))),
        ..session::Session::default()
    };
    let mut a = App::new(s, None, ascii, false);
    a.finish_analysis();
    a
}

#[test]
fn a_session_with_a_geometry_shows_the_survey_and_the_salcs() {
    for ascii in [false, true] {
        let mut a = mx4_app(ascii);
        for p in [Panel::Molecule, Panel::Combinations] {
            a.apply(Action::GoPanel(p));
            let name = format!(
                "geometry_{}_80x24_{}",
                slug(p),
                if ascii { "ascii" } else { "unicode" }
            );
            let s = screen(&mut a, 80, 24);
            if ascii {
                assert!(s.is_ascii(), "{name} has non-ASCII text:\n{s}");
            }
            insta::assert_snapshot!(name, s);
        }
    }
}

/// The water frequency job (PySCF fixture, tests/fixtures/vib) next to a session naming it,
/// in a temporary folder this test makes; the Normal modes pane focused at 120×32.
#[test]
fn a_session_with_a_hessian_shows_its_normal_modes_pane() {
    std::env::set_var(
        "SALCDESK_CACHE_DIR",
        std::env::temp_dir().join(format!("salcdesk-snap-cache-{}", std::process::id())),
    );
    let d = std::env::temp_dir().join(format!("salcdesk-snap-vib-{}", std::process::id()));
    std::fs::create_dir_all(&d).unwrap();
    let fixture =
        std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/fixtures/vib/water.json");
    std::fs::copy(fixture, d.join("water.json")).unwrap();
    let p = d.join("water.toml");
    std::fs::write(
        &p,
        "format = 1\ntitle = \"Water frequency job\"\n\n[[band]]\nposition = 3657.0\n\
         technique = \"Raman\"\n\n[vibrations]\nhessian = \"water.json\"\n\
         isotopes = [\"H=D\"]\nscale = 0.883\nband_tolerance = 80\n",
    )
    .unwrap();
    let s = session::load_file(&p).unwrap();
    let mut a = App::new(s, Some(p), false, false);
    a.finish_analysis();
    a.apply(Action::GoPanel(Panel::Vibrations));
    assert_eq!(a.panel, Panel::Vibrations);
    let s = screen(&mut a, 120, 32);
    assert!(
        s.contains("Normal modes — water.json") && s.contains("B₂"),
        "{s}"
    );
    insta::assert_snapshot!("normal_modes_water_120x32_unicode", s);
    let _ = std::fs::remove_dir_all(&d);
}
