//! The session's spectra (Γvib from the geometry or a Cartesian set, activity, band check,
//! overtones and combinations), the group offered by a geometry when none is chosen, and the
//! report's molecule part in every format (LaTeX compiled when pdflatex is installed).

use salcdesk::analysis;
use salcdesk::report::{self, Format};
use salcdesk::session::{self, Session};
use std::path::Path;

fn example(name: &str) -> Session {
    session::load_file(
        &Path::new(env!("CARGO_MANIFEST_DIR"))
            .join("sessions")
            .join(name),
    )
    .unwrap()
}

#[test]
fn the_bipyramid_example_predicts_from_its_geometry() {
    let s = example("bipyramidal-mx5-geometry.toml");
    let a = analysis::analyze(&s).unwrap();
    let sp = a.spectra.as_ref().expect("spectra at full depth");
    assert!(sp.source.contains("geometry"), "{}", sp.source);
    let m = sp.modes.as_ref().unwrap();
    // Trigonal-bipyramidal XY5 (Nakamoto, Part A, XY5 D3h): Γvib = 2A1' + 3E' + 2A2'' + E'',
    // IR active A2'' and E' (5 fundamentals), Raman active A1', E', E'' (6).
    assert_eq!(m.gamma, "2A1' + 3E' + 2A2'' + E''");
    assert_eq!(m.ir_bands, 5);
    assert_eq!(m.raman_bands, 6);
    assert_eq!(m.coincident_bands, 3);
    let check = sp.check.as_ref().expect("bands recorded").as_ref().unwrap();
    assert_eq!(check.bands.len(), s.bands.len());
    let combos = sp.combinations.as_ref().unwrap();
    // 8 fundamentals: 8 first overtones, 8 second overtones, 28 binary combinations.
    assert_eq!(combos.levels.len(), 8 + 8 + 28);
    // [E'²] = A1' + E' in D3h (symmetric square of a doubly degenerate irrep; Herzberg,
    // Infrared and Raman Spectra, ch. II, Table 33 — from memory).
    let over = combos.levels.iter().find(|l| l.label == "2ν5").expect(
        "2ν5 (ν5 is the first E' fundamental: A1', A1', A2'', A2'' come first, Mulliken 1955)",
    );
    assert_eq!(over.symmetry.text, "A1' + E'");
}

#[test]
fn without_a_group_the_geometry_offers_its_own() {
    let mut s = example("bipyramidal-mx5-geometry.toml");
    s.group = None;
    let a = analysis::analyze(&s).expect("the geometry's group is used");
    assert_eq!(a.group.name(), "D3h");
    assert!(
        a.notes.iter().any(|n| n.contains("no group chosen")),
        "{:?}",
        a.notes
    );
    // Without a geometry the error stays.
    s.geometry = None;
    assert!(matches!(
        analysis::analyze(&s),
        Err(analysis::Error::NoGroup)
    ));
}

#[test]
fn a_cartesian_set_feeds_the_spectra_when_there_is_no_geometry() {
    // The tetrahedral example has a Cartesian set: Γvib(MX4) = A1 + E + 2T2 (Nakamoto, Part A).
    let s = example("tetrahedral-mx4.toml");
    let a = analysis::analyze(&s).unwrap();
    let sp = a.spectra.as_ref().unwrap();
    assert!(sp.source.contains("set"), "{}", sp.source);
    assert_eq!(sp.modes.as_ref().unwrap().gamma, "A1 + E + 2T2");
    // Quick depth (every keystroke) leaves the spectra for the full pass.
    let q = analysis::analyze_to(&s, analysis::Depth::Quick).unwrap();
    assert!(q.spectra.is_none());
}

#[test]
fn the_report_holds_the_molecule_salcs_and_spectra_in_every_format() {
    let s = example("bipyramidal-mx5-geometry.toml");
    let a = analysis::analyze(&s);
    let md = report::session::render(&s, &a, Format::Markdown, false);
    for want in [
        "## Molecule",
        "Stretch SALCs",
        "1/√3 (r₃ + r₄ + r₅)",
        "Band-list check",
        "Overtones and binary combinations",
        "IR bands: 5",
    ] {
        assert!(md.contains(want), "markdown lacks {want}");
    }
    let text = report::session::render(&s, &a, Format::Text, true);
    assert!(text.is_ascii(), "ASCII mode prints only ASCII");
    assert!(text.contains("1/sqrt(3) (r3 + r4 + r5)"), "{text}");
    let json: serde_json::Value =
        serde_json::from_str(&report::session::render(&s, &a, Format::Json, false)).unwrap();
    assert_eq!(json["spectra"]["activity"]["ir_bands"], 5);
    assert_eq!(json["geometry"]["point_group"], "D3h");
    assert_eq!(json["salcs"].as_array().unwrap().len(), 2);
    let tex = report::session::render(&s, &a, Format::Latex, false);
    assert!(tex.starts_with("\\documentclass"));
    assert!(tex.contains("\\usepackage{booktabs}") && tex.trim_end().ends_with("\\end{document}"));
    assert_eq!(
        tex.matches("\\begin{").count(),
        tex.matches("\\end{").count(),
        "environments balance"
    );
}

/// Every example session's LaTeX report compiles with pdflatex, when it is installed (the
/// structural checks above run everywhere).
#[test]
fn latex_reports_compile() {
    let Ok(out) = std::process::Command::new("pdflatex")
        .arg("--version")
        .output()
    else {
        eprintln!("pdflatex not installed: compile check skipped");
        return;
    };
    assert!(out.status.success());
    let dir = std::env::temp_dir().join(format!("salcdesk-latex-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let sessions = Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions");
    for e in std::fs::read_dir(&sessions).unwrap() {
        let p = e.unwrap().path();
        let s = session::load_file(&p).unwrap();
        let a = analysis::analyze_in(&s, analysis::Depth::Full, Some(&sessions));
        let tex = report::session::render(&s, &a, Format::Latex, false);
        let f = dir.join("report.tex");
        std::fs::write(&f, tex).unwrap();
        let out = std::process::Command::new("pdflatex")
            .args(["-interaction=nonstopmode", "-halt-on-error", "report.tex"])
            .current_dir(&dir)
            .output()
            .unwrap();
        assert!(
            out.status.success(),
            "{}: pdflatex failed:\n{}",
            p.display(),
            String::from_utf8_lossy(&out.stdout)
        );
    }
}
