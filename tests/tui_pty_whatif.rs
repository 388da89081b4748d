//! End to end in a pseudo-terminal (80x24): the What-if overlay of the real binary on a
//! square-planar PtCl4 session (our own; Pt–Cl 2.31 Å from memory). Replacing one Cl by Br
//! gives C2v with its Γvib and band counts beside D4h's (Nakamoto, Part A: planar XY4 has
//! 3 IR and 3 Raman fundamentals; planar ML3L′ in C2v has nine, all IR and Raman active —
//! Cotton, Appendix IIA, no A2 among them). Lowering the group is a separate key, saved like
//! any edit and undone with `u`. The process is killed by its PID on failure (`Pty`'s Drop).

#![cfg(unix)]

mod common;

use common::pty::Pty;
use common::TempDir;
use std::time::Duration;

const SESSION: &str = r#"format = 1
title = "Square-planar PtCl4"
group = "D4h"

[geometry]
tolerance = 0.01
atoms = [
  { element = "Pt", xyz = [0.0, 0.0, 0.0] },
  { element = "Cl", xyz = [2.31, 0.0, 0.0] },
  { element = "Cl", xyz = [0.0, 2.31, 0.0] },
  { element = "Cl", xyz = [-2.31, 0.0, 0.0] },
  { element = "Cl", xyz = [0.0, -2.31, 0.0] },
]

[[set]]
name = "Pt-Cl stretches"
kind = "stretch"
members = ["r1", "r2", "r3", "r4"]

[set.unmoved]
r1 = ["E", "2C2'", "sh", "2sv"]
r2 = ["E", "sh"]
r3 = ["E", "2C2'", "sh", "2sv"]
r4 = ["E", "sh"]

[set.atoms]
r1 = [1, 2]
r2 = [1, 3]
r3 = [1, 4]
r4 = [1, 5]
"#;

/// The screen line that contains `what`.
fn line_with(text: &str, what: &str) -> String {
    text.lines()
        .find(|l| l.contains(what))
        .unwrap_or_else(|| panic!("no line with '{what}':\n{text}"))
        .to_string()
}

#[test]
fn replace_one_ligand_then_lower_apply_save_and_undo() {
    let dir = TempDir::new("pty-whatif");
    let p = dir.join("ptcl4.toml");
    std::fs::write(&p, SESSION).unwrap();
    let mut run = Pty::spawn(
        dir.path(),
        &["open".as_ref(), p.as_os_str()],
        &[("SALCDESK_STATE_DIR", dir.join("state").as_os_str())],
    );
    run.wait_for("D4h");

    // Replace atom 2 (Cl) by Br; Ctrl-u first clears a wrong start.
    run.keys("R");
    run.wait_for("Replace atom: number and new element");
    run.keys("3 I\x152 Br\r");
    run.wait_for("What if: replace an atom");
    let t = run.text();
    assert!(t.contains("atom 2 Cl → Br"), "{t}");
    let group = line_with(&t, "│group");
    assert!(group.contains("D4h") && group.contains("C2v"), "{group}");
    let ir = line_with(&t, "IR bands");
    let raman = line_with(&t, "Raman bands");
    // D4h: 3 and 3 (A2u + 2Eu; A1g + B1g + B2g); C2v: 9 and 9.
    let nums = |l: &str| -> Vec<String> {
        l.split(|c: char| !c.is_ascii_digit())
            .filter(|s| !s.is_empty())
            .map(String::from)
            .collect()
    };
    assert_eq!(nums(&ir), ["3", "9"], "{ir}");
    assert_eq!(nums(&raman), ["3", "9"], "{raman}");
    let gamma = line_with(&t, "Γvib");
    assert!(gamma.contains("4A₁"), "{gamma}");
    run.keys("\x1b");
    run.wait_for("the session is unchanged");

    // Lower the symmetry: the first way offered, shown, then applied with `a`.
    run.keys("L");
    run.wait_for("What if: lower the symmetry");
    run.keys("\r");
    run.wait_for("apply to the session");
    let t = run.text();
    assert!(t.contains("Before (D4h)"), "{t}");
    run.keys("a");
    run.wait_for("group lowered to");
    let status = line_with(&run.text(), "group lowered to");
    let sub = status
        .split("group lowered to ")
        .nth(1)
        .and_then(|s| s.split(':').next())
        .unwrap()
        .trim()
        .to_string();
    assert_ne!(sub, "D4h");
    run.keys("s");
    run.wait_for("saved");
    let saved = std::fs::read_to_string(&p).unwrap();
    assert!(
        saved.contains(&format!("group = \"{sub}\"")),
        "saved file:\n{saved}"
    );
    run.keys("u");
    run.wait_for("undone");
    assert!(line_with(&run.text(), "salcdesk").contains("D4h"));
    run.keys("q");
    run.wait_for("Unsaved edits");
    run.keys("d");
    let e = run.wait_exit(Duration::from_secs(10));
    assert_eq!(
        e.unwrap_or_else(|| panic!("did not quit:\n{}", run.text()))
            .code,
        Some(0)
    );
}
