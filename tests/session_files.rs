//! Session files: every example loads, analyses, and survives save → reload unchanged; bad
//! input gives file, line, column and what was expected; saves are atomic and never write
//! over a file that is not a session; recovery files are offered back.

use salcdesk::analysis;
use salcdesk::session::{self, check_save_target, parse, Recovery, SaveTarget};
use std::path::{Path, PathBuf};

fn examples() -> Vec<PathBuf> {
    let mut v: Vec<PathBuf> =
        std::fs::read_dir(Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions"))
            .expect("sessions folder")
            .flatten()
            .map(|e| e.path())
            .filter(|p| p.extension().and_then(|e| e.to_str()) == Some("toml"))
            .collect();
    v.sort();
    v
}

fn tmpdir(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("salcdesk-test-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap();
    d
}

#[test]
fn every_example_session_loads_and_analyses_without_error() {
    let files = examples();
    assert!(files.len() >= 3, "at least three example sessions");
    for f in files {
        let s = session::load_file(&f).unwrap_or_else(|e| panic!("{e}"));
        let a = analysis::analyze(&s).unwrap_or_else(|e| panic!("{}: {e}", f.display()));
        assert_eq!(a.sets.len(), s.sets.len());
        for set in &a.sets {
            assert!(
                set.unknown_ticks.is_empty(),
                "{}: {:?}",
                f.display(),
                set.unknown_ticks
            );
        }
    }
}

#[test]
fn every_example_round_trips_through_save_and_reload() {
    let dir = tmpdir("roundtrip");
    for f in examples() {
        let s = session::load_file(&f).unwrap();
        let out = dir.join(f.file_name().unwrap());
        session::save(&s, &out).unwrap();
        let again = session::load_file(&out).unwrap();
        assert_eq!(s, again, "{}", f.display());
        // and the text is stable: saving the reloaded session gives the same bytes
        assert_eq!(session::to_toml(&s), session::to_toml(&again));
    }
}

#[test]
fn the_demo_is_embedded_and_is_the_octahedral_example() {
    let d = session::demo();
    assert_eq!(d.group.as_deref(), Some("Oh"));
    assert!(!d.sets.is_empty());
}

#[test]
fn malformed_toml_names_file_line_and_column() {
    let e = parse(
        "bad.toml",
        "format = 1\ngroup = \"Td\"\ntitle = \"unclosed\n",
    )
    .unwrap_err();
    assert_eq!(e.file, "bad.toml");
    assert_eq!(e.line, 3);
    assert!(e.column > 1, "{e}");
    assert!(e.to_string().starts_with("bad.toml:3:"), "{e}");
}

#[test]
fn a_newer_format_is_refused_with_a_clear_message() {
    let e = parse("new.toml", "format = 7\nfuture_field = 1\n").unwrap_err();
    assert_eq!((e.line, e.column), (1, 10));
    assert!(e.message.contains("newer"), "{e}");
    assert!(e.message.contains("update salcdesk"), "{e}");
}

#[test]
fn a_missing_format_line_is_named() {
    let e = parse("x.toml", "group = \"C3v\"\n").unwrap_err();
    assert!(e.message.contains("format = 1"), "{e}");
}

#[test]
fn unknown_kind_points_at_the_value_and_lists_the_kinds() {
    let text = "format = 1\ngroup = \"C3v\"\n[[set]]\nname = \"a\"\nkind = \"wiggle\"\nmembers = [\"r1\"]\n";
    let e = parse("k.toml", text).unwrap_err();
    assert_eq!((e.line, e.column), (5, 8));
    assert!(
        e.message
            .contains("stretch, bend, scalar, cartesian, pi, axial"),
        "{e}"
    );
}

#[test]
fn unknown_group_and_typo_fields_are_located() {
    let e = parse("g.toml", "format = 1\ngroup = \"Q7\"\n").unwrap_err();
    assert_eq!(e.line, 2);
    assert!(e.message.contains("unknown point group 'Q7'"), "{e}");
    let e = parse("f.toml", "format = 1\ngrup = \"Td\"\n").unwrap_err();
    assert_eq!(e.line, 2);
    assert!(e.message.contains("unknown field `grup`"), "{e}");
}

#[test]
fn ticks_for_a_member_not_in_the_set_are_refused() {
    let text = "format = 1\ngroup = \"C3v\"\n[[set]]\nname = \"a\"\nkind = \"stretch\"\nmembers = [\"r1\"]\n[set.unmoved]\nr9 = [\"E\"]\n";
    let e = parse("m.toml", text).unwrap_err();
    assert_eq!(e.line, 8);
    assert!(e.message.contains("'r9' is not a member"), "{e}");
}

#[test]
fn polarization_is_for_raman_bands_only() {
    let text = "format = 1\n[[band]]\nposition = 1000\ntechnique = \"IR\"\npolarization = \"p\"\n";
    let e = parse("b.toml", text).unwrap_err();
    assert_eq!(e.line, 5);
    assert!(e.message.contains("Raman bands only"), "{e}");
}

#[test]
fn no_input_makes_the_loader_panic() {
    // A handful of hostile inputs: each gives an error or a session, never a panic.
    for text in [
        "",
        "format = \"one\"",
        "format = 1\n[[set]]\n",
        "format = 1\n[geometry]\n",
        "format = 1\n[geometry]\nfile = \"a.xyz\"\natoms = []\n",
        "format = 1\n[[band]]\nposition = -3\ntechnique = \"IR\"\n",
        "format = 1\n[[set]]\nname=\"x\"\nkind=\"pi\"\nmembers=[\"a\",\"a\"]\n",
        "format = 1\ntitle = \"\u{1F600}\"\n[[set]]\nname=\"\u{3c3}\"\nkind=\"stretch\"\nmembers=[\"\u{3c3}1\"]\n[set.unmoved]\n\"\u{3c3}1\" = [\"E\", \"x\"]\n",
        "format = -1",
        "format = 99999999999999999999",
    ] {
        let _ = parse("h.toml", text);
    }
}

#[test]
fn saving_is_atomic_and_leaves_no_temporary_file() {
    let dir = tmpdir("atomic");
    let p = dir.join("s.toml");
    let s = session::demo();
    session::save(&s, &p).unwrap();
    session::save(&s, &p).unwrap();
    let names: Vec<String> = std::fs::read_dir(&dir)
        .unwrap()
        .flatten()
        .map(|e| e.file_name().to_string_lossy().to_string())
        .collect();
    assert_eq!(names, vec!["s.toml".to_string()]);
}

#[test]
fn a_file_that_is_not_a_session_is_never_a_save_target() {
    let dir = tmpdir("target");
    let xyz = dir.join("molecule.xyz");
    std::fs::write(&xyz, "3\nwater\nO 0 0 0\n").unwrap();
    assert!(check_save_target(&xyz).is_err());
    assert_eq!(
        std::fs::read_to_string(&xyz).unwrap(),
        "3\nwater\nO 0 0 0\n"
    );
    assert_eq!(
        check_save_target(&dir.join("new.toml")).unwrap(),
        SaveTarget::New
    );
    let good = dir.join("good.toml");
    session::save(&session::demo(), &good).unwrap();
    assert_eq!(
        check_save_target(&good).unwrap(),
        SaveTarget::ExistingSession
    );
}

#[test]
fn recovery_files_are_offered_back_only_when_they_differ() {
    let dir = tmpdir("recovery");
    let p = dir.join("work.toml");
    let s = session::demo();
    session::save(&s, &p).unwrap();
    let mut rec = Recovery::for_session(Some(&p));
    assert_eq!(rec.path, dir.join(".work.toml.recovery"));
    assert!(rec.pending(&s).is_none());
    let mut edited = s.clone();
    edited.title = "edited".into();
    rec.write(&edited).unwrap();
    assert_eq!(rec.pending(&s), Some(edited.clone()));
    assert!(rec.pending(&edited).is_none());
    rec.clear();
    assert!(rec.pending(&s).is_none());
}
