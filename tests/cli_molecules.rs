//! `analyze`, `detect`, `symmetrize` on XYZ files: shapes, batch order, failures, exit codes.

use serde_json::Value;
use std::path::PathBuf;
use std::process::{Command, Stdio};

fn bin() -> Command {
    Command::new(env!("CARGO_BIN_EXE_salcdesk"))
}

fn scratch(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("salcdesk-cli-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap();
    d
}

// Geometries from memory: O–H 0.957 Å, HOH 104.5°; C–H 1.087 Å tetrahedral; C=O 1.160 Å.
const WATER: &str = "3\nwater\nO 0 0 0.1173\nH 0 0.7572 -0.4692\nH 0 -0.7572 -0.4692\n";
const METHANE: &str = "5\nmethane\nC 0 0 0\nH 0.6276 0.6276 0.6276\nH -0.6276 -0.6276 0.6276\nH -0.6276 0.6276 -0.6276\nH 0.6276 -0.6276 -0.6276\n";
const CO2: &str = "3\ncarbon dioxide\nO 0 0 -1.16\nC 0 0 0\nO 0 0 1.16\n";

#[test]
fn analyze_json_has_the_documented_fields() {
    let d = scratch("json");
    std::fs::write(d.join("ch4.xyz"), METHANE).unwrap();
    let out = bin()
        .args(["analyze", "--format", "json"])
        .arg(d.join("ch4.xyz"))
        .output()
        .unwrap();
    assert!(out.status.success());
    let v: Value = serde_json::from_slice(&out.stdout).unwrap();
    assert_eq!(v["point_group"], "Td");
    assert_eq!(v["n_atoms"], 5);
    assert_eq!(v["n_modes"], 9);
    // Γvib(CH4) = A1 + E + 2T2 (Nakamoto, Part A).
    assert_eq!(
        v["gamma_vib"],
        serde_json::json!([
            {"irrep": "A1", "multiplicity": 1, "dimension": 1},
            {"irrep": "E", "multiplicity": 1, "dimension": 2},
            {"irrep": "T2", "multiplicity": 2, "dimension": 3}
        ])
    );
    assert_eq!(v["redundant"], "A1");
}

#[test]
fn batch_keeps_input_order_and_reports_failures() {
    let d = scratch("batch");
    std::fs::write(d.join("a_water.xyz"), WATER).unwrap();
    std::fs::write(
        d.join("b_broken.xyz"),
        "3\nbroken\nO 0 0 0\nH 0 nan 0\nH 0 0 1\n",
    )
    .unwrap();
    std::fs::write(d.join("c_co2.xyz"), CO2).unwrap();
    std::fs::write(d.join("d_ch4.xyz"), METHANE).unwrap();
    let out = bin()
        .args(["analyze", "--format", "jsonl"])
        .arg(&d)
        .output()
        .unwrap();
    assert_eq!(
        out.status.code(),
        Some(1),
        "a failed file makes the exit code 1"
    );
    let lines: Vec<Value> = String::from_utf8(out.stdout)
        .unwrap()
        .lines()
        .map(|l| serde_json::from_str(l).unwrap())
        .collect();
    assert_eq!(lines.len(), 4);
    assert_eq!(lines[0]["point_group"], "C2v");
    assert!(
        lines[1]["error"]
            .as_str()
            .unwrap()
            .contains("b_broken.xyz:4:"),
        "{}",
        lines[1]
    );
    assert_eq!(lines[2]["point_group"], "Dinfh");
    assert_eq!(lines[3]["point_group"], "Td");
}

#[test]
fn file_list_on_stdin() {
    let d = scratch("stdin");
    std::fs::write(d.join("w.xyz"), WATER).unwrap();
    std::fs::write(d.join("m.xyz"), METHANE).unwrap();
    let mut child = bin()
        .args(["analyze", "--format", "jsonl", "-"])
        .stdin(Stdio::piped())
        .stdout(Stdio::piped())
        .spawn()
        .unwrap();
    use std::io::Write;
    let list = format!(
        "{}\n{}\n",
        d.join("m.xyz").display(),
        d.join("w.xyz").display()
    );
    child
        .stdin
        .take()
        .unwrap()
        .write_all(list.as_bytes())
        .unwrap();
    let out = child.wait_with_output().unwrap();
    assert!(out.status.success());
    let text = String::from_utf8(out.stdout).unwrap();
    let groups: Vec<String> = text
        .lines()
        .map(|l| {
            serde_json::from_str::<Value>(l).unwrap()["point_group"]
                .as_str()
                .unwrap()
                .to_string()
        })
        .collect();
    assert_eq!(groups, ["Td", "C2v"]);
}

#[test]
fn single_bad_file_exits_2_with_location() {
    let d = scratch("bad");
    std::fs::write(d.join("bad.xyz"), "2\nx\nC 0 0 0\nQq 1 0 0\n").unwrap();
    let out = bin()
        .arg("analyze")
        .arg(d.join("bad.xyz"))
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2));
    let err = String::from_utf8(out.stderr).unwrap();
    assert!(err.contains("bad.xyz:4:"), "{err}");
}

#[test]
fn detect_reports_near_misses() {
    // A water molecule with one O–H stretched by 0.05 Å: Cs at 0.01 Å, C2v when 0.1 Å is allowed.
    let d = scratch("detect");
    std::fs::write(
        d.join("w.xyz"),
        "3\nw\nO 0 0 0.1173\nH 0 0.7972 -0.4692\nH 0 -0.7572 -0.4692\n",
    )
    .unwrap();
    let out = bin()
        .args(["detect", "--format", "json"])
        .arg(d.join("w.xyz"))
        .output()
        .unwrap();
    assert!(out.status.success());
    let v: Value = serde_json::from_slice(&out.stdout).unwrap();
    assert_eq!(v["point_group"], "Cs");
    let nm = v["near_misses"].as_array().unwrap();
    assert!(nm.iter().any(|n| n["group"] == "C2v"), "{v}");
}

#[test]
fn symmetrize_writes_an_ideal_geometry() {
    let d = scratch("sym");
    // Slightly distorted methane (0.004 Å off): Td at the default tolerance.
    std::fs::write(
        d.join("m.xyz"),
        "5\nm\nC 0 0 0\nH 0.6290 0.6276 0.6276\nH -0.6276 -0.6266 0.6276\nH -0.6276 0.6276 -0.6276\nH 0.6276 -0.6276 -0.6286\n",
    )
    .unwrap();
    let out = bin()
        .arg("symmetrize")
        .arg(d.join("m.xyz"))
        .arg("-o")
        .arg(d.join("ideal.xyz"))
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let out = bin()
        .args(["detect", "--tol", "0.00001", "--format", "json"])
        .arg(d.join("ideal.xyz"))
        .output()
        .unwrap();
    let v: Value = serde_json::from_slice(&out.stdout).unwrap();
    assert_eq!(v["point_group"], "Td");
    assert!(v["max_deviation"].as_f64().unwrap() < 1e-6);
}
