//! XYZ reader and writer: round trip, frame selection, and every error kind with its line
//! and column; arbitrary bytes never panic.

use proptest::prelude::*;
use salcdesk::geom::{read_xyz, read_xyz_frames, write_xyz, FrameSelect, XyzErrorKind, XyzOptions};

fn opts() -> XyzOptions {
    XyzOptions::default()
}

fn err_of(text: &str) -> salcdesk::geom::XyzError {
    read_xyz(text, &opts()).expect_err("should fail")
}

#[test]
fn reads_a_simple_file_with_extra_columns_and_labels() {
    let text = "3\nwater\nO 0.0 0.0 0.1173 extra 5\nh1 0.0 0.7572 -0.4692\n1 0.0 -0.7572 -0.4692\n";
    let m = read_xyz(text, &opts()).unwrap();
    assert_eq!(m.title, "water");
    assert_eq!(m.atoms.len(), 3);
    assert_eq!(m.atoms[0].element, 8);
    assert_eq!(m.atoms[1].element, 1);
    assert_eq!(m.atoms[1].label.as_deref(), Some("h1"));
    assert_eq!(m.atoms[2].element, 1);
    assert!((m.atoms[1].position.y - 0.7572).abs() < 1e-12);
}

#[test]
fn accepts_crlf_and_fortran_exponents() {
    let m = read_xyz("1\r\nx\r\nCl 1.5D+00 0 -2.0d-1\r\n", &opts()).unwrap();
    assert_eq!(m.atoms[0].element, 17);
    assert!((m.atoms[0].position.x - 1.5).abs() < 1e-12);
    assert!((m.atoms[0].position.z + 0.2).abs() < 1e-12);
}

#[test]
fn round_trip() {
    let text = "2\nHF molecule\nH 0 0 0\nF 0 0 0.917\n";
    let m = read_xyz(text, &opts()).unwrap();
    let again = read_xyz(write_xyz(&m), &opts()).unwrap();
    assert_eq!(again.title, m.title);
    for (a, b) in m.atoms.iter().zip(&again.atoms) {
        assert_eq!(a.element, b.element);
        assert!((a.position - b.position).norm() < 1e-9);
    }
}

#[test]
fn frames_default_last_and_selectable() {
    let text = "1\nfirst\nH 0 0 0\n1\nsecond\nHe 0 0 0\n\n1\nthird\nLi 0 0 0\n\n\n";
    assert_eq!(read_xyz(text, &opts()).unwrap().title, "third");
    let first = XyzOptions {
        frame: FrameSelect::First,
        ..opts()
    };
    assert_eq!(read_xyz(text, &first).unwrap().title, "first");
    let idx = XyzOptions {
        frame: FrameSelect::Index(1),
        ..opts()
    };
    assert_eq!(read_xyz(text, &idx).unwrap().atoms[0].element, 2);
    assert_eq!(read_xyz_frames(text.as_bytes(), &opts()).unwrap().len(), 3);
    let missing = XyzOptions {
        frame: FrameSelect::Index(7),
        ..opts()
    };
    let e = read_xyz(text, &missing).unwrap_err();
    assert!(matches!(
        e.kind,
        XyzErrorKind::NoSuchFrame {
            requested: 7,
            available: 3
        }
    ));
}

#[test]
fn nan_and_infinity_are_refused_with_position() {
    let e = err_of("1\nt\nC 0.0 nan 1.0\n");
    assert_eq!((e.line, e.column), (3, 7));
    assert!(matches!(e.kind, XyzErrorKind::NonFinite { axis: 'y', .. }));
    assert!(e.to_string().starts_with("line 3, column 7:"), "{e}");
    let e = err_of("1\nt\nC 0.0 1.0 -inf\n");
    assert_eq!((e.line, e.column), (3, 11));
    assert!(matches!(e.kind, XyzErrorKind::NonFinite { axis: 'z', .. }));
}

#[test]
fn bad_numbers_and_missing_fields() {
    let e = err_of("1\nt\nC 0.0 1.x 1.0\n");
    assert_eq!((e.line, e.column), (3, 7));
    assert!(matches!(e.kind, XyzErrorKind::BadNumber { axis: 'y', .. }));
    let e = err_of("1\nt\nC 0.0 1.0\n");
    assert_eq!((e.line, e.column), (3, 10));
    assert!(matches!(
        e.kind,
        XyzErrorKind::MissingField {
            what: "z coordinate"
        }
    ));
}

#[test]
fn unknown_element() {
    let e = err_of("2\nt\nC 0 0 0\n  Xx 1 0 0\n");
    assert_eq!((e.line, e.column), (4, 3));
    assert_eq!(e.kind, XyzErrorKind::UnknownElement("Xx".into()));
    let e = err_of("1\nt\n119 0 0 0\n");
    assert!(matches!(e.kind, XyzErrorKind::UnknownElement(_)));
}

#[test]
fn count_mismatch_both_ways() {
    // More atom lines than promised.
    let e = err_of("1\nt\nC 0 0 0\nH 1 0 0\n");
    assert_eq!((e.line, e.column), (4, 1));
    assert!(matches!(
        e.kind,
        XyzErrorKind::CountMismatch {
            frame: 1,
            count: 1,
            ..
        }
    ));
    // Fewer atom lines than promised, then another frame.
    let e = err_of("3\nt\nC 0 0 0\n1\nu\nH 0 0 0\n");
    assert_eq!(e.line, 4);
    assert!(matches!(
        e.kind,
        XyzErrorKind::CountMismatch {
            frame: 1,
            count: 3,
            ..
        }
    ));
    // A blank line inside the atom block.
    let e = err_of("2\nt\nC 0 0 0\n\nH 1 0 0\n");
    assert_eq!(e.line, 4);
    assert!(matches!(e.kind, XyzErrorKind::CountMismatch { .. }));
}

#[test]
fn truncated_files() {
    let e = err_of("3\nt\nC 0 0 0\n");
    assert_eq!(e.line, 4);
    assert!(matches!(
        e.kind,
        XyzErrorKind::Truncated {
            frame: 1,
            found: 1,
            count: 3
        }
    ));
    let e = err_of("3");
    assert_eq!((e.line, e.column), (2, 1));
    assert!(matches!(e.kind, XyzErrorKind::MissingComment { frame: 1 }));
    let e = err_of("\n\n  \n");
    assert!(matches!(e.kind, XyzErrorKind::NoFrames));
}

#[test]
fn bad_count_line() {
    let e = err_of("three\nt\n");
    assert_eq!((e.line, e.column), (1, 1));
    assert!(matches!(e.kind, XyzErrorKind::BadCount { .. }));
    let e = err_of("  -3\nt\n");
    assert_eq!((e.line, e.column), (1, 3));
    let e = err_of("3 4\nt\n");
    assert_eq!((e.line, e.column), (1, 3));
}

#[test]
fn count_cap_is_checked_before_allocating() {
    // A count this large would abort the process if it were allocated.
    let e = err_of("999999999999999999999999\nt\n");
    assert!(matches!(e.kind, XyzErrorKind::TooManyAtoms { .. }));
    let e = err_of("100001\nt\n");
    assert!(matches!(
        e.kind,
        XyzErrorKind::TooManyAtoms { limit: 100_000, .. }
    ));
    let small = XyzOptions {
        max_atoms: 2,
        ..opts()
    };
    let e = read_xyz("3\nt\nH 0 0 0\nH 1 0 0\nH 2 0 0\n", &small).unwrap_err();
    assert_eq!((e.line, e.column), (1, 1));
    assert!(matches!(
        e.kind,
        XyzErrorKind::TooManyAtoms { limit: 2, .. }
    ));
}

#[test]
fn non_utf8_reports_position() {
    let mut bytes = b"1\ntitle\nC 0 ".to_vec();
    bytes.push(0xff);
    bytes.extend_from_slice(b" 0\n");
    let e = read_xyz(&bytes, &opts()).unwrap_err();
    assert_eq!((e.line, e.column), (3, 5));
    assert_eq!(e.kind, XyzErrorKind::NotUtf8);
}

#[test]
fn columns_count_characters_not_bytes() {
    // U+00A0 (no-break space) separates fields like any whitespace.
    assert!(read_xyz("1\nt\nC\u{00a0}0 0 0\n", &opts()).is_ok());
    let e = err_of("1\nt\nÅ 0 0 0\n");
    assert_eq!((e.line, e.column), (3, 1));
    let e = err_of("1\nt\nC é 0 0\n");
    assert_eq!((e.line, e.column), (3, 3));
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(512))]

    #[test]
    fn arbitrary_bytes_never_panic(bytes in proptest::collection::vec(any::<u8>(), 0..400)) {
        let _ = read_xyz(&bytes, &opts());
        let _ = read_xyz_frames(&bytes, &opts());
    }

    #[test]
    fn mutated_valid_files_never_panic(
        pos in 0usize..60,
        ins in proptest::collection::vec(any::<u8>(), 0..6),
        cut in 0usize..70,
    ) {
        let base = b"3\nwater\nO 0 0 0.1173\nH 0 0.7572 -0.4692\nH 0 -0.7572 -0.4692\n".to_vec();
        let mut b = base.clone();
        let p = pos.min(b.len());
        b.splice(p..p, ins);
        b.truncate(cut.max(1).min(b.len()));
        let _ = read_xyz(&b, &opts());
        if let Err(e) = read_xyz(&b, &opts()) {
            prop_assert!(e.line >= 1 && e.column >= 1);
        }
    }
}
