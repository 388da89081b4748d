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

/// A Td session whose stretches and one bend name their atoms (atoms of an MX4, 1 = M).
const WITH_ATOMS: &str = r#"format = 1
group = "Td"

[[set]]
name = "M-X stretches"
kind = "stretch"
members = ["r1", "r2", "r3", "r4"]

[set.unmoved]
r1 = ["E", "8C3", "6sd"]
r2 = ["E"]
r3 = ["E"]
r4 = ["E", "6sd"]

[set.atoms]
r1 = [1, 2]
r2 = [1, 3]
r4 = [1, 5]

[[set]]
name = "bends"
kind = "bend"
members = ["a 1", "a2"]

[set.atoms]
"a 1" = [2, 1, 3]
"#;

#[test]
fn member_atoms_load_and_round_trip_through_save_and_reload() {
    let s = parse("atoms.toml", WITH_ATOMS).unwrap_or_else(|e| panic!("{e}"));
    let m = &s.sets[0].members;
    assert_eq!(m[0].atoms, Some(vec![1, 2]));
    assert_eq!(m[2].atoms, None, "r3 names no atoms");
    assert_eq!(m[3].atoms, Some(vec![1, 5]));
    assert_eq!(s.sets[1].members[0].atoms, Some(vec![2, 1, 3]));
    assert_eq!(s.sets[1].members[1].atoms, None);
    let text = session::to_toml(&s);
    assert!(
        text.contains("[set.atoms]\nr1 = [1, 2]\nr2 = [1, 3]\nr4 = [1, 5]\n"),
        "{text}"
    );
    assert!(text.contains("\"a 1\" = [2, 1, 3]"), "{text}");
    let again = parse("again.toml", &text).unwrap_or_else(|e| panic!("{e}\n{text}"));
    assert_eq!(again, s);
    assert_eq!(session::to_toml(&again), text);
    // and through a file on disk
    let dir = tmpdir("atoms");
    let p = dir.join("atoms.toml");
    session::save(&s, &p).unwrap();
    assert_eq!(session::load_file(&p).unwrap(), s);
}

#[test]
fn member_atoms_that_do_not_fit_are_located() {
    let with = |atoms: &str| WITH_ATOMS.replace("r1 = [1, 2]\n", atoms);
    // wrong count for a stretch: the list is pointed at (line 17, column 6)
    let e = parse("c.toml", &with("r1 = [1, 2, 3]\n")).unwrap_err();
    assert_eq!((e.line, e.column), (16, 6), "{e}");
    assert!(
        e.message.contains("member 'r1' of set 'M-X stretches'"),
        "{e}"
    );
    assert!(
        e.message.contains("two atoms") && e.message.contains("found 3"),
        "{e}"
    );
    // atom 0: the number itself
    let e = parse("z.toml", &with("r1 = [1, 0]\n")).unwrap_err();
    assert_eq!((e.line, e.column), (16, 10), "{e}");
    assert!(e.message.contains("count from 1, found 0"), "{e}");
    // the same atom twice
    let e = parse("d.toml", &with("r1 = [2, 2]\n")).unwrap_err();
    assert_eq!((e.line, e.column), (16, 10), "{e}");
    assert!(e.message.contains("atom 2 is named twice"), "{e}");
    // a name that is no member: the key
    let e = parse("n.toml", &with("r9 = [1, 2]\n")).unwrap_err();
    assert_eq!((e.line, e.column), (16, 1), "{e}");
    assert!(
        e.message
            .contains("'r9' is not a member of set 'M-X stretches'"),
        "{e}"
    );
    // a bend needs three atoms
    let e = parse("b.toml", &WITH_ATOMS.replace("[2, 1, 3]", "[2, 1]")).unwrap_err();
    assert_eq!(e.line, 26, "{e}");
    assert!(
        e.message.contains("a bend member sits on three atoms"),
        "{e}"
    );
    // not numbers
    let e = parse("s.toml", &with("r1 = [\"Sn\", 2]\n")).unwrap_err();
    assert_eq!(e.line, 16, "{e}");
}

#[test]
fn atoms_that_no_longer_fit_the_kind_are_not_written() {
    // Changing a set's kind in the workspace keeps the members' atoms in memory; a save must
    // still give a file that loads, so atoms that do not fit the new kind are left out.
    let mut s = parse("atoms.toml", WITH_ATOMS).unwrap();
    s.sets[0].kind = session::SetKind::Bend;
    let text = session::to_toml(&s);
    let again = parse("again.toml", &text).unwrap_or_else(|e| panic!("{e}\n{text}"));
    assert!(again.sets[0].members.iter().all(|m| m.atoms.is_none()));
    assert_eq!(again.sets[1].members[0].atoms, Some(vec![2, 1, 3]));
    // back to stretch: they fit again and are written
    s.sets[0].kind = session::SetKind::Stretch;
    assert_eq!(parse("x.toml", &session::to_toml(&s)).unwrap(), s);
}
