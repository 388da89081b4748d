//! `[fundamentals]`: positions given to fundamentals by their ν number are read with their
//! place in the file on error, written back, kept through a layout-preserving save, and fill
//! in the harmonic positions of overtones and combinations.

use salcdesk::analysis::{analyze_in, Depth};
use salcdesk::session::{self, parse, to_toml, to_toml_keeping};
use std::path::Path;

fn mx3() -> (String, session::Session) {
    let p = Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions/planar-trigonal-mx3.toml");
    let text = std::fs::read_to_string(&p).unwrap();
    let s = session::load_file(&p).unwrap();
    (text, s)
}

#[test]
fn positions_round_trip_through_both_writers() {
    let (text, mut s) = mx3();
    assert!(s.nu_positions.is_empty());
    s.nu_positions = vec![(1, 330.0), (4, 150.5), (10, 12.0)];
    let fresh = to_toml(&s);
    assert!(fresh.contains("[fundamentals]\nnu1 = 330.0\nnu4 = 150.5\nnu10 = 12.0\n"));
    assert_eq!(parse("fresh", &fresh).unwrap(), s);
    // Saved over the user's file: the comments and notes stay, the table is added.
    let kept = to_toml_keeping(Some(&text), &s);
    assert!(kept.starts_with(&text[..text.find("[geometry]").unwrap()]));
    assert_eq!(parse("kept", &kept).unwrap(), s);
    // One position changed in a file that already has the table: only that line changes.
    let mut t = s.clone();
    t.nu_positions[1].1 = 151.0;
    let again = to_toml_keeping(Some(&kept), &t);
    assert_eq!(parse("again", &again).unwrap(), t);
    let diff: Vec<(&str, &str)> = kept
        .lines()
        .zip(again.lines())
        .filter(|(a, b)| a != b)
        .collect();
    assert_eq!(diff, vec![("nu4 = 150.5", "nu4 = 151.0")]);
    // All positions cleared: the table goes.
    t.nu_positions.clear();
    let gone = to_toml_keeping(Some(&again), &t);
    assert!(!gone.contains("[fundamentals]"));
    assert_eq!(parse("gone", &gone).unwrap(), t);
}

#[test]
fn bad_positions_are_refused_with_their_place() {
    for (body, line, col, words) in [
        ("nu0 = 300.0", 3, 1, "is not a fundamental"),
        ("v1 = 300.0", 3, 1, "is not a fundamental"),
        ("nu2 = -5.0", 3, 7, "positive wavenumber"),
        ("nu2 = \"300\"", 3, 7, ""),
        ("nu1 = 300.0\nnu01 = 310.0", 4, 1, "given twice"),
    ] {
        let text = format!("format = 1\n[fundamentals]\n{body}\n");
        let e = parse("f.toml", &text).expect_err(body);
        assert_eq!((e.line, e.column), (line, col), "{body}: {e}");
        assert!(e.message.contains(words), "{body}: {e}");
    }
}

/// Planar XY3 (D3h): ν1 A₁′, ν2 A₂″, ν3 E′, ν4 E′ (Nakamoto, Part A, planar XY3 molecules;
/// Herzberg 1945 numbering). Harmonic estimates are sums of the fundamentals (Herzberg 1945,
/// ch. II); A₁′ × E′ = E′ (Cotton, direct products in D3h). Positions are test numbers.
#[test]
fn given_positions_place_overtones_and_combinations() {
    let (_, mut s) = mx3();
    s.nu_positions = vec![(1, 330.0), (4, 150.0)];
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions");
    let a = analyze_in(&s, Depth::Full, Some(&dir)).unwrap();
    let c = a.spectra.as_ref().unwrap().combinations.as_ref().unwrap();
    let names: Vec<(&str, &str, Option<f64>)> = c
        .fundamentals
        .iter()
        .map(|f| (f.name.as_deref().unwrap(), f.irrep.as_str(), f.position_cm))
        .collect();
    assert!(names.contains(&("ν1", "A1'", Some(330.0))));
    assert!(names.contains(&("ν2", "A2''", None)));
    assert!(names.contains(&("ν3", "E'", None)));
    assert!(names.contains(&("ν4", "E'", Some(150.0))));
    let level = |l: &str| c.levels.iter().find(|x| x.label == l).unwrap();
    assert_eq!(level("2ν1").harmonic_cm, Some(660.0));
    assert_eq!(level("3ν1").harmonic_cm, Some(990.0));
    assert_eq!(level("2ν4").harmonic_cm, Some(300.0));
    assert_eq!(level("ν1 + ν4").harmonic_cm, Some(480.0));
    assert_eq!(level("ν1 + ν4").symmetry.text, "E'");
    // A mode without a position leaves its levels unplaced.
    assert_eq!(level("ν1 + ν3").harmonic_cm, None);
    assert_eq!(level("2ν2").harmonic_cm, None);
}
