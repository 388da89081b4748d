//! Band assignment through `salcdesk normal-modes --bands --scale`: bands made in the test
//! from the PySCF fixtures' own computed wavenumbers (tests/fixtures/vib) times a scale factor
//! go to the mode they were made from; a band on an inactive fundamental is not given to it
//! silently; a band far from every level stays unassigned.

use serde_json::Value;
use std::path::{Path, PathBuf};
use std::process::Command;

/// A uniform factor of the size used for HF harmonic wavenumbers (common practice).
const SCALE: f64 = 0.9;

fn fixture(name: &str) -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join(format!("tests/fixtures/vib/{name}.json"))
}

fn run(name: &str, bands: Option<&Path>) -> Value {
    let mut c = Command::new(env!("CARGO_BIN_EXE_salcdesk"));
    c.arg("normal-modes").arg(fixture(name)).args([
        "--scale",
        &SCALE.to_string(),
        "--format",
        "json",
    ]);
    if let Some(b) = bands {
        c.arg("--bands").arg(b);
    }
    let out = c.output().unwrap();
    assert!(out.status.success(), "{name}: {out:?}");
    serde_json::from_slice(&out.stdout).unwrap()
}

struct Mode {
    nu: u64,
    w: f64,
    ir: bool,
    raman: bool,
}

fn modes(v: &Value) -> Vec<Mode> {
    v["modes"]
        .as_array()
        .unwrap()
        .iter()
        .map(|m| Mode {
            nu: m["nu"].as_u64().unwrap(),
            w: m["wavenumber"].as_f64().unwrap(),
            ir: m["ir"].as_bool().unwrap(),
            raman: m["raman"].as_bool().unwrap(),
        })
        .collect()
}

/// Every fixture: one band per fundamental at its scaled wavenumber, in a technique where it
/// is active, plus a band at 40 cm⁻¹, below every fundamental and so far from every level.
/// For molecules with a fundamental inactive in IR, a band in IR 5 cm⁻¹ above the first.
#[test]
fn scaled_bands_go_to_their_modes_and_inactive_or_far_ones_are_not_assigned() {
    let dir = std::env::temp_dir().join(format!("salcdesk-assign-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    for name in [
        "water", "ammonia", "methane", "ethylene", "bf3", "co2", "benzene", "sf6",
    ] {
        let ms = modes(&run(name, None));
        let mut lines = Vec::new();
        let mut expect: Vec<(f64, Option<u64>)> = Vec::new();
        for m in ms.iter().filter(|m| m.w > 0.0 && (m.ir || m.raman)) {
            let pos = (m.w * SCALE * 100.0).round() / 100.0;
            // a band only where no other fundamental's scaled position is within 1 cm⁻¹
            if ms
                .iter()
                .any(|o| o.nu != m.nu && (o.w * SCALE - pos).abs() < 1.0)
            {
                continue;
            }
            lines.push(format!("{pos} {}", if m.ir { "IR" } else { "Raman" }));
            expect.push((pos, Some(m.nu)));
        }
        let inactive = ms
            .iter()
            .filter(|m| m.w > 0.0 && !m.ir)
            .min_by_key(|m| m.nu);
        if let Some(m) = inactive {
            lines.push(format!("{:.2} IR", m.w * SCALE + 5.0));
        }
        lines.push("40 Raman".into());
        let file = dir.join(format!("{name}.bands"));
        std::fs::write(&file, lines.join("\n") + "\n").unwrap();
        let v = run(name, Some(&file));
        let got = v["bands"].as_array().unwrap();
        assert_eq!(got.len(), lines.len(), "{name}");
        for (g, (pos, nu)) in got.iter().zip(&expect) {
            assert!((g["position"].as_f64().unwrap() - pos).abs() < 1e-9);
            let want = format!("ν{}", nu.unwrap());
            assert_eq!(g["assigned"].as_str(), Some(want.as_str()), "{name}: {g}");
            assert_eq!(g["kind"], "fundamental", "{name}: {g}");
            let pred = g["predicted"].as_f64().unwrap();
            assert!((pred - pos).abs() < 0.01, "{name}: {g}");
        }
        if inactive.is_some() {
            let g = &got[expect.len()];
            // the remark names the IR-inactive fundamental nearest the band (SF6: ν2 lies
            // within 10 cm⁻¹ of ν1), and the band is given to no inactive fundamental
            let pos = g["position"].as_f64().unwrap();
            let nearest = ms
                .iter()
                .filter(|o| o.w > 0.0 && !o.ir)
                .min_by(|a, b| {
                    (a.w * SCALE - pos)
                        .abs()
                        .total_cmp(&(b.w * SCALE - pos).abs())
                })
                .unwrap();
            for o in ms.iter().filter(|o| !o.ir) {
                let name_o = format!("ν{}", o.nu);
                assert_ne!(g["assigned"].as_str(), Some(name_o.as_str()), "{name}: {g}");
            }
            let own = format!("ν{} ", nearest.nu);
            let remark = g["remark"].as_str().unwrap_or("");
            assert!(
                remark.contains(&own) && remark.contains("inactive"),
                "{name}: {g}"
            );
        }
        let far = got.last().unwrap();
        assert!(far["assigned"].is_null(), "{name}: {far}");
        assert!(
            far["remark"]
                .as_str()
                .unwrap_or("")
                .contains("nothing active"),
            "{name}: {far}"
        );
        // Textbook species with IR-inactive fundamentals (Herzberg 1945; Nakamoto): the
        // totally symmetric stretch ν1 of CO2 (Σg⁺), CH4 (A1), BF3 (A1′), benzene (A1g),
        // SF6 (A1g), ethylene (Ag); water and ammonia have none (every fundamental IR active).
        let inactive_nu = inactive.map(|m| m.nu);
        match name {
            "water" | "ammonia" => assert_eq!(inactive_nu, None, "{name}"),
            _ => assert_eq!(inactive_nu, Some(1), "{name}"),
        }
    }
    let _ = std::fs::remove_dir_all(&dir);
}
