//! `modes`, `combos`, `bands`, `descend` on the command line.

use serde_json::Value;
use std::process::Command;

fn run(args: &[&str]) -> (i32, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_salcdesk"))
        .args(args)
        .output()
        .unwrap();
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

fn json(args: &[&str]) -> Value {
    let (code, out, err) = run(args);
    assert_eq!(code, 0, "{args:?}: {err}");
    serde_json::from_str(&out).unwrap()
}

#[test]
fn modes_json_shape_for_a_tetrahedral_centre() {
    // Nakamoto, Part A, tetrahedral XY4: IR 2 (T2), Raman 4, coincident 2, none silent.
    let v = json(&[
        "modes",
        "--group",
        "Td",
        "--gamma",
        "A1 + E + 2T2",
        "--format",
        "json",
    ]);
    assert_eq!(v["point_group"], "Td");
    assert_eq!(v["n_modes"], 9);
    assert_eq!(v["ir_bands"], 2);
    assert_eq!(v["raman_bands"], 4);
    assert_eq!(v["coincident_bands"], 2);
    assert_eq!(v["silent_fundamentals"], 0);
    let t2 = v["modes"]
        .as_array()
        .unwrap()
        .iter()
        .find(|m| m["irrep"] == "T2")
        .unwrap();
    assert_eq!(t2["multiplicity"], 2);
    assert_eq!(t2["dimension"], 3);
    assert_eq!(t2["ir"], true);
    assert_eq!(t2["raman"], true);
    assert_eq!(t2["polarized"], false);
}

#[test]
fn modes_from_a_geometry() {
    let d = std::env::temp_dir().join(format!("salcdesk-spec-{}", std::process::id()));
    std::fs::create_dir_all(&d).unwrap();
    // SF6, S–F 1.561 Å from memory. Nakamoto: IR 2, Raman 3, one silent (T2u), mutual exclusion.
    let r = 1.561;
    let xyz = format!(
        "7\nSF6\nS 0 0 0\nF {r} 0 0\nF -{r} 0 0\nF 0 {r} 0\nF 0 -{r} 0\nF 0 0 {r}\nF 0 0 -{r}\n"
    );
    let p = d.join("sf6.xyz");
    std::fs::write(&p, xyz).unwrap();
    let v = json(&["modes", p.to_str().unwrap(), "--format", "json"]);
    assert_eq!(v["point_group"], "Oh");
    assert_eq!(v["ir_bands"], 2);
    assert_eq!(v["raman_bands"], 3);
    assert_eq!(v["silent_fundamentals"], 1);
    assert_eq!(v["coincident_bands"], 0);
}

#[test]
fn overtone_of_a_degenerate_mode() {
    // Wilson, Decius & Cross §7-3: 2ν of an E mode in C3v is A1 + E.
    let (code, out, err) = run(&[
        "combos", "--group", "C3v", "--gamma", "E", "--nu", "E 1000", "--ascii",
    ]);
    assert_eq!(code, 0, "{err}");
    assert!(out.contains("A1 + E"), "{out}");
    assert!(out.contains("2000"), "{out}");
}

#[test]
fn band_list_check() {
    // CCl4 Raman (Herzberg 1945, from memory): 218 (E), 314 (T2), 459 p (A1), 762/790 (T2 in
    // Fermi resonance with ν1 + ν4 ≈ 773). The polarized band can only be A1.
    let d = std::env::temp_dir().join(format!("salcdesk-bands-{}", std::process::id()));
    std::fs::create_dir_all(&d).unwrap();
    let p = d.join("ccl4.txt");
    std::fs::write(&p, "# position technique intensity\n218 Raman\n314 Raman\n459 Raman 10 p\n762 Raman\n790 Raman\n").unwrap();
    let v = json(&[
        "bands",
        "--group",
        "Td",
        "--gamma",
        "A1 + E + 2T2",
        "--bands",
        p.to_str().unwrap(),
        "--format",
        "json",
    ]);
    let text = v.to_string();
    assert!(text.contains("459"), "{text}");
    let (code, _, err) = run(&[
        "bands",
        "--group",
        "Td",
        "--gamma",
        "A1 + E + 2T2",
        "--bands",
        "/nonexistent/x.txt",
    ]);
    assert_eq!(code, 2);
    assert!(err.contains("x.txt"), "{err}");
}

#[test]
fn descent_td_to_c3v() {
    // Wilson, Decius & Cross, Appendix X (from memory): T2 → A1 + E, T1 → A2 + E, E → E.
    let v = json(&["descend", "Td", "C3v", "--format", "json"]);
    let s = v.to_string();
    assert!(s.contains("A1 + E") && s.contains("A2 + E"), "{s}");
    let (code, _, err) = run(&["descend", "Td", "D4h"]);
    assert_eq!(code, 2, "{err}");
}

#[test]
fn modes_and_bands_from_a_session() {
    let dir = env!("CARGO_MANIFEST_DIR");
    let s = format!("{dir}/sessions/tetrahedral-mx4.toml");
    // The Cartesian set of a tetrahedral MX4 gives Γvib = A1 + E + 2T2 (Nakamoto, Part A):
    // IR 2, Raman 4.
    let v = json(&["modes", &s, "--format", "json"]);
    assert_eq!(v["point_group"], "Td");
    assert_eq!(v["n_modes"], 9);
    assert_eq!(v["ir_bands"], 2);
    assert_eq!(v["raman_bands"], 4);
    // The session's own band list is checked without --bands.
    let (code, out, err) = run(&["bands", &s]);
    assert_eq!(code, 0, "{err}");
    assert!(out.contains("could be"), "{out}");
    let (code, _, err) = run(&["modes", &s, "--set", "nope"]);
    assert_eq!(code, 2);
    assert!(err.contains("no member set"), "{err}");
}

#[test]
fn linear_descent_text_names_each_embedding_in_words() {
    // Herzberg 1945 (bent symmetric XY2 from linear XY2): with C2 across the molecular axis,
    // Σu⁺ → B2 and Πu → A1 + B1; the text must say which placement each table is for and
    // write the classes as the tables do (σᵥ, C₂), not by internal ASCII names.
    let (code, out, err) = run(&["descend", "Dinfh", "C2v"]);
    assert_eq!(code, 0, "{err}");
    assert!(out.contains("C2 along the molecular axis"), "{out}");
    assert!(out.contains("C2 across the molecular axis"), "{out}");
    assert!(out.contains("σᵥ(xz) ←"), "{out}");
    assert!(!out.contains("sv(xz)"), "{out}");
    let (code, out, _) = run(&["descend", "Dinfh", "C2v", "--ascii"]);
    assert_eq!(code, 0);
    assert!(out.contains("sv(xz) <-") && out.is_ascii(), "{out}");
}
