//! The command line for tables, reductions and products: output shapes, exit codes, messages.

use serde_json::Value;
use std::process::Command;

fn run(args: &[&str]) -> (i32, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_salcdesk"))
        .args(args)
        .output()
        .expect("binary runs");
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

fn json(args: &[&str]) -> Value {
    let (code, out, err) = run(args);
    assert_eq!(code, 0, "{args:?}: {err}");
    serde_json::from_str(&out).unwrap_or_else(|e| panic!("{args:?}: {e}\n{out}"))
}

#[test]
fn table_json_for_every_listed_group() {
    let (code, out, _) = run(&["groups", "--ascii"]);
    assert_eq!(code, 0);
    let names: Vec<String> = out
        .lines()
        .skip(2)
        .filter_map(|l| l.split_whitespace().next().map(str::to_string))
        .collect();
    assert!(names.len() >= 59, "{names:?}");
    for n in &names {
        let v = json(&["table", n, "--format", "json"]);
        assert_eq!(v["group"], n.as_str());
        let classes = v["classes"].as_array().unwrap();
        for ir in v["irreps"].as_array().unwrap() {
            assert_eq!(ir["characters"].as_array().unwrap().len(), classes.len());
            assert!(ir["label"].is_string());
            assert!(ir["functions"].is_array());
        }
        if n != "Cinfv" && n != "Dinfh" {
            let order = v["order"].as_u64().unwrap() as usize;
            let total: usize = classes
                .iter()
                .map(|c| c["elements"].as_array().unwrap().len())
                .sum();
            assert_eq!(total, order, "{n}");
            for c in classes {
                assert_eq!(c["representative"].as_array().unwrap().len(), 3);
                assert_eq!(
                    c["size"].as_u64().unwrap() as usize,
                    c["elements"].as_array().unwrap().len()
                );
            }
        }
    }
}

#[test]
fn c3v_json_shape() {
    let v = json(&["table", "C3v", "--format", "json"]);
    assert_eq!(v["order"], 6);
    assert_eq!(v["classes"][1]["symbol"], "2C3");
    assert_eq!(v["classes"][1]["size"], 2);
    assert_eq!(v["irreps"][0]["label"], "A1");
    assert_eq!(
        v["irreps"][0]["characters"],
        serde_json::json!(["1", "1", "1"])
    );
    assert_eq!(
        v["irreps"][0]["characters_float"],
        serde_json::json!([1.0, 1.0, 1.0])
    );
    // complex characters as {re, im}
    let c3 = json(&["table", "C3", "--format", "json"]);
    let has_complex = c3["irreps"]
        .as_array()
        .unwrap()
        .iter()
        .any(|ir| ir["characters_float"][1].is_object());
    assert!(has_complex);
}

#[test]
fn reduce_json_matches_the_documented_shape() {
    // Γ3N of H2O in the xz plane: χ = (9, −1, 3, 1) → 3A1 + A2 + 3B1 + 2B2 (Cotton, 3rd ed., §10.2).
    let v = json(&["reduce", "C2v", "9", "-1", "3", "1", "--format", "json"]);
    assert_eq!(v["group"], "C2v");
    assert_eq!(v["valid"], true);
    assert_eq!(
        v["multiplicities"],
        serde_json::json!({"A1": 3, "A2": 1, "B1": 3, "B2": 2})
    );
}

#[test]
fn reduce_from_unmoved_counts() {
    // CH4: unmoved atoms 5 2 1 1 3 → Γ3N = A1 + E + T1 + 3T2 (Cotton, 3rd ed., §10.2).
    let v = json(&[
        "reduce",
        "Td",
        "--unmoved",
        "5",
        "2",
        "1",
        "1",
        "3",
        "--kind",
        "cartesian",
        "--format",
        "json",
    ]);
    assert_eq!(
        v["multiplicities"],
        serde_json::json!({"A1": 1, "A2": 0, "E": 1, "T1": 1, "T2": 3})
    );
    // Stretches of CH4's four C–H bonds: 4 1 0 0 2 → A1 + T2 (Cotton, 3rd ed., §10.3).
    let v = json(&[
        "reduce",
        "Td",
        "--unmoved",
        "4",
        "1",
        "0",
        "0",
        "2",
        "--format",
        "json",
    ]);
    assert_eq!(
        v["multiplicities"],
        serde_json::json!({"A1": 1, "A2": 0, "E": 0, "T1": 0, "T2": 1})
    );
}

#[test]
fn impossible_characters_exit_2_with_suggestions() {
    let (code, out, err) = run(&["reduce", "C3v", "3", "0", "2", "--format", "json"]);
    assert_eq!(code, 2, "{err}");
    let v: Value = serde_json::from_str(&out).unwrap();
    assert_eq!(v["valid"], false);
    assert!(v["error"].as_str().unwrap().contains("A1"));
    assert!(!v["suggestions"].as_array().unwrap().is_empty());
    let (code, out, _) = run(&["reduce", "C3v", "3", "0", "2"]);
    assert_eq!(code, 2);
    assert!(out.contains("hint:"), "{out}");
}

#[test]
fn bad_input_is_refused_cleanly() {
    let (code, _, err) = run(&["table", "C9v"]);
    assert_eq!(code, 2);
    assert!(err.contains("unknown point group"), "{err}");
    let (code, _, err) = run(&["reduce", "C2v", "1", "2", "3"]);
    assert_eq!(code, 2);
    assert!(err.contains("4 classes"), "{err}");
    let (code, _, err) = run(&["reduce", "C2v", "1", "x", "3", "4"]);
    assert_eq!(code, 2);
    assert!(err.contains("value 2"), "{err}");
    let (code, _, err) = run(&["product", "C3v", "E", "Q"]);
    assert_eq!(code, 2);
    assert!(err.contains("not an irrep"), "{err}");
}

#[test]
fn linear_groups_reduce_through_their_subgroup() {
    // CO2: Γ3N = Σg+ + 2Σu+ + Πg + 2Πu (Herzberg 1945), via D2h.
    let v = json(&[
        "reduce",
        "Dinfh",
        "--unmoved",
        "3",
        "3",
        "3",
        "1",
        "1",
        "1",
        "--kind",
        "cartesian",
        "--format",
        "json",
    ]);
    assert_eq!(v["via"], "D2h");
    let m = &v["multiplicities"];
    assert_eq!(m["Sigma+g"], 1);
    assert_eq!(m["Sigma+u"], 2);
    assert_eq!(m["Pig"], 1);
    assert_eq!(m["Piu"], 2);
}

#[test]
fn products_and_squares() {
    // C3v: E⊗E = A1 + A2 + E; [E²] = A1 + E (Wilson, Decius & Cross, §7-3).
    let (code, out, _) = run(&["product", "C3v", "E", "E", "--ascii"]);
    assert_eq!(code, 0);
    assert!(out.contains("Gamma = A1 + A2 + E"), "{out}");
    let (_, out, _) = run(&["product", "C3v", "E", "--sym", "--ascii"]);
    assert!(out.contains("Gamma = A1 + E"), "{out}");
    let (_, out, _) = run(&["product", "C3v", "E", "--antisym", "--ascii"]);
    assert!(out.contains("Gamma = A2"), "{out}");
    // Oh: T1u ⊗ T1u = A1g + Eg + T1g + T2g (Cotton, 3rd ed., Appendix IIA, direct products).
    let (_, out, _) = run(&["product", "Oh", "T1u", "T1u", "--ascii"]);
    assert!(out.contains("Gamma = A1g + Eg + T1g + T2g"), "{out}");
}

#[test]
fn every_command_has_help() {
    for c in ["groups", "table", "reduce", "product", "check-table"] {
        let (code, out, _) = run(&[c, "--help"]);
        assert_eq!(code, 0, "{c}");
        assert!(out.contains("Usage"), "{c}");
    }
}
