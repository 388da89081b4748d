//! `[vibrations]` in a session: loading with located errors, saving back, the analysis the
//! faces share, the report section, the workspace pane, and band assignment. The Hessian is
//! the PySCF water fixture (tests/fixtures/vib), copied next to a session in a temporary
//! folder this test makes.

use salcdesk::analysis::{analyze_in, Depth};
use salcdesk::report::{session::render, Format};
use salcdesk::session::{parse, to_toml};
use std::path::PathBuf;

fn scratch(tag: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("salcdesk-vib-{tag}-{}", std::process::id()));
    std::fs::create_dir_all(&d).unwrap();
    let src = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("tests/fixtures/vib/water.json");
    std::fs::copy(src, d.join("water.json")).unwrap();
    d
}

const SESSION: &str = r#"format = 1
title = "Water frequency job"

[[band]]
position = 3657.0
technique = "Raman"

[[band]]
position = 1595.0
technique = "IR"

[vibrations]
hessian = "water.json"
isotopes = ["H=D"]
scale = 0.883
band_tolerance = 80
"#;

#[test]
fn session_names_a_hessian_and_every_face_shows_it() {
    let d = scratch("faces");
    let s = parse("water.toml", SESSION).unwrap();
    let v = s.vibrations.as_ref().unwrap();
    assert_eq!(v.hessian, "water.json");
    assert_eq!(v.isotopes, vec!["H=D".to_string()]);
    // saving writes the section back; reading it again gives the same session
    let again = parse("water.toml", &to_toml(&s)).unwrap();
    assert_eq!(again, s);

    let a = analyze_in(&s, Depth::Full, Some(&d));
    let an = a.as_ref().unwrap();
    let vib = an.vibrations.as_ref().unwrap().as_ref().unwrap();
    assert_eq!(vib.modes.parent.point_group, "C2v");
    // Source: Herzberg (1945): H2O has 2A1 + B2; D2O the same species
    let labels: Vec<&str> = vib
        .modes
        .parent
        .sets
        .iter()
        .map(|s| s.irrep.as_str())
        .collect();
    assert_eq!(labels, ["A1", "A1", "B2"]);
    // bands: HF harmonic × 0.883 ≈ 3656 and 1916 for ν1, ν2 (PySCF fixture); 3657 Raman is
    // assigned to ν1 (A1, Raman active)
    let a1 = &vib.assignments[0];
    assert_eq!(a1.assigned.as_deref(), Some("ν1"), "{a1:?}");
    // 1595 IR: nothing within 80 cm⁻¹ of the scaled bend (1916): not assigned, said so
    let a2 = &vib.assignments[1];
    assert!(a2.assigned.is_none() && a2.remark.is_some(), "{a2:?}");

    let text = render(&s, &a, Format::Text, false);
    assert!(text.contains("Normal modes"), "{text}");
    assert!(text.contains("Teller–Redlich"), "{text}");
    let md = render(&s, &a, Format::Markdown, false);
    assert!(md.contains("| # | ν | cm⁻¹ |"), "{md}");
    // LaTeX: the mode table as a real tabular, no Markdown pipes left.
    let tex = render(&s, &a, Format::Latex, false);
    assert!(tex.contains("Normal modes"), "{tex}");
    assert!(tex.contains("\\toprule") && !tex.contains("| # |"), "{tex}");
    let json: serde_json::Value =
        serde_json::from_str(&render(&s, &a, Format::Json, false)).unwrap();
    let modes = &json["vibrations"]["modes"];
    assert_eq!(modes.as_array().unwrap().len(), 3);
    assert_eq!(json["vibrations"]["isotopologue"]["point_group"], "C2v");
    let _ = std::fs::remove_dir_all(&d);
}

#[test]
fn a_missing_or_broken_hessian_is_a_message_not_a_failure() {
    let d = scratch("broken");
    std::fs::write(d.join("bad.json"), r#"{"driver": "hessian", "molecule": {"symbols": ["O"], "geometry": [0, 0, 0]}, "return_result": [1, 2]}"#).unwrap();
    for (file, expect) in [("nothere.json", "nothere.json"), ("bad.json", "wrong size")] {
        let text = SESSION
            .replace("water.json", file)
            .replace("title", "group = \"C2v\"\ntitle");
        let s = parse("w.toml", &text).unwrap();
        let a = analyze_in(&s, Depth::Full, Some(&d)).unwrap();
        let e = a.vibrations.as_ref().unwrap().as_ref().unwrap_err();
        assert!(e.contains(expect), "{e}");
        let text = render(&s, &Ok(a), Format::Text, false);
        assert!(text.contains(expect));
    }
    let _ = std::fs::remove_dir_all(&d);
}

#[test]
fn bad_vibrations_sections_are_located() {
    for (old, bad, line, what) in [
        ("band_tolerance = 80", "units = \"furlongs\"", 16, "units"),
        ("isotopes = [\"H=D\"]", "isotopes = [\"H=99H\"]", 14, "99H"),
        ("scale = 0.883", "scale = -1", 15, "scale"),
    ] {
        let text = SESSION.replace(old, bad);
        let e = parse("w.toml", &text).unwrap_err();
        assert_eq!(e.line, line, "{e:?}");
        assert!(e.message.contains(what), "{e:?}");
    }
    let e = parse("w.toml", &SESSION.replace("scale = 0.883", "colour = 1")).unwrap_err();
    assert!(e.message.contains("colour"), "{e:?}");
}

#[cfg(feature = "tui")]
#[test]
fn the_pane_draws_the_mode_table() {
    use ratatui::{backend::TestBackend, Terminal};
    use salcdesk::tui::{panels::vibrations, theme::Theme};
    let d = scratch("pane");
    let s = parse("water.toml", SESSION).unwrap();
    let a = analyze_in(&s, Depth::Full, Some(&d)).unwrap();
    assert!(vibrations::wanted(&a));
    let mut t = Terminal::new(TestBackend::new(90, 30)).unwrap();
    let th = Theme::new(false, true);
    t.draw(|f| vibrations::draw(f, f.area(), &a, 0, &th))
        .unwrap();
    let screen: String = t
        .backend()
        .buffer()
        .content()
        .iter()
        .map(|c| c.symbol())
        .collect();
    assert!(screen.contains("Normal modes"), "{screen}");
    assert!(screen.contains("B2"), "{screen}");
    assert!(screen.contains("nu1"), "{screen}");
    let _ = std::fs::remove_dir_all(&d);
}
