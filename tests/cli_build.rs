//! `salcdesk build`: what-if molecules from a group's sites, written as XYZ or as a session
//! that opens and analyses.

use salcdesk::{analysis, rep::format_sum, session};
use std::process::Command;

fn bin() -> Command {
    Command::new(env!("CARGO_BIN_EXE_salcdesk"))
}

fn scratch(name: &str) -> std::path::PathBuf {
    let d = std::env::temp_dir().join(format!("salcdesk-build-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap();
    d
}

#[test]
fn an_octahedral_complex_written_as_a_session_analyses_to_oh() {
    let d = scratch("oh");
    let f = d.join("mx6.toml");
    let out = bin()
        .args(["build", "Oh", "--sites", "Co@origin Cl@axis1:2.3", "-o"])
        .arg(&f)
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let s = session::load_file(&f).unwrap();
    assert_eq!(s.group.as_deref(), Some("Oh"));
    assert!(s.notes.contains("Co@origin Cl@axis1:2.3"), "{}", s.notes);
    let a = analysis::analyze(&s).unwrap();
    let sv = a.geometry.unwrap().survey.unwrap();
    assert_eq!(sv.group.name(), "Oh");
    // Octahedral XY6: Γvib = A1g + Eg + 2T1u + T2g + T2u (Nakamoto, Part A, XY6), printed in
    // table order (g before u).
    assert_eq!(
        format_sum(&sv.group, &sv.vibrations.vibrations, false),
        "A1g + Eg + T2g + 2T1u + T2u"
    );
    assert_eq!(sv.bonds.len(), 6);
    // Never overwrite without --force.
    let again = bin()
        .args(["build", "Oh", "--sites", "Co@origin", "-o"])
        .arg(&f)
        .output()
        .unwrap();
    assert!(!again.status.success());
    assert!(String::from_utf8_lossy(&again.stderr).contains("--force"));
    assert_eq!(session::load_file(&f).unwrap(), s, "the file is untouched");
}

#[test]
fn xyz_output_and_the_higher_symmetry_note() {
    // Atoms only on the axes of D4h at equal distances make an octahedron: the builder says
    // the molecule has Oh symmetry (geometric fact).
    let out = bin()
        .args([
            "build",
            "D4h",
            "--sites",
            "Co@origin Cl@axis1:2.3 Cl@axis2:2.3",
        ])
        .output()
        .unwrap();
    assert!(out.status.success());
    let xyz = String::from_utf8(out.stdout).unwrap();
    assert!(xyz.starts_with("7\n"), "{xyz}");
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("Oh symmetry"), "{err}");
}

#[test]
fn site_mistakes_name_the_item_and_list_the_sites() {
    for (sites, want) in [
        ("Co@origin Cl@axis9:2", "item 2"),
        ("Qq@origin", "unknown element"),
        ("Cl@axis1:2 Cl@axis1:2", "already is"),
        ("Cl@axis1:x", "must be numbers"),
        ("", "no site items"),
    ] {
        let out = bin()
            .args(["build", "Oh", "--sites", sites])
            .output()
            .unwrap();
        assert_eq!(out.status.code(), Some(2), "{sites}");
        let err = String::from_utf8_lossy(&out.stderr);
        assert!(err.contains(want), "{sites}: {err}");
    }
    let out = bin()
        .args(["build", "Oh", "--sites", "list"])
        .output()
        .unwrap();
    let list = String::from_utf8_lossy(&out.stdout);
    // Oh site multiplicities 1, 6, 8, 12, 24, 24, 48 (International Tables, Vol. A, m-3m
    // Wyckoff positions, as point-group orbits; from memory).
    for m in [
        "(1 atom",
        "(6 atoms",
        "(8 atoms",
        "(12 atoms",
        "(24 atoms",
        "(48 atoms",
    ] {
        assert!(list.contains(m), "{m}: {list}");
    }
}
