//! Γ texts: every label the tool prints reads back as that irrep, in every group with
//! complex-conjugate pairs (labels ¹E, ²E₁ … typed `1E`, `2E1`), and multiplicities never
//! collide with them. Products are checked against characters multiplied here.

use salcdesk::exact::Cyclo;
use salcdesk::group::{load, names, PointGroup};
use salcdesk::rep::{self, Character};
use salcdesk::spectra;
use std::process::Command;

fn pair_groups() -> Vec<std::sync::Arc<PointGroup>> {
    names()
        .iter()
        .map(|n| load(n).unwrap())
        .filter(|g| g.table.irreps.iter().any(|i| i.pair.is_some()))
        .collect()
}

fn one_row(g: &PointGroup, i: usize) -> Vec<u64> {
    let mut m = vec![0; g.table.irreps.len()];
    m[i] = 1;
    m
}

#[test]
fn nineteen_groups_have_complex_pairs() {
    // Source: Cotton, 3rd ed., Appendix IIA: the groups with bracketed complex-conjugate pairs
    // are C3–C8, C3h–C8h, S4, S6, S8, S10, S12, T, Th (from memory: 19 in the tables here).
    let got: Vec<String> = pair_groups().iter().map(|g| g.name().to_string()).collect();
    assert_eq!(got.len(), 19, "{got:?}");
}

#[test]
fn every_printed_label_reads_back_as_its_irrep() {
    for g in pair_groups() {
        let json = salcdesk::report::table::to_json(&g);
        for (i, ir) in g.table.irreps.iter().enumerate() {
            let want = one_row(&g, i);
            let json_label = json["irreps"][i]["label"].as_str().unwrap().to_string();
            let printed = [
                ir.label.clone(),
                ir.display(),
                json_label,
                rep::format_sum(&g, &want, false),
                rep::format_sum(&g, &want, true),
                salcdesk::report::ascii_prose(&rep::format_sum(&g, &want, true)),
            ];
            for text in printed {
                assert_eq!(
                    rep::parse_gamma(&g, &text).as_ref(),
                    Ok(&want),
                    "{}: '{text}'",
                    g.name()
                );
                assert_eq!(
                    spectra::parse_gamma(&g, &text).as_ref(),
                    Ok(&want),
                    "{}: '{text}'",
                    g.name()
                );
            }
        }
    }
}

#[test]
fn sums_with_multiplicities_read_back_in_every_group() {
    // Every group, every row with multiplicity 1..3, pairs merged and unmerged: what
    // format_sum prints (ASCII, Unicode, and Unicode passed through the --ascii filter) reads
    // back as the same multiplicities.
    for name in names() {
        let g = load(name).unwrap();
        if g.is_linear() {
            continue;
        }
        let n = g.table.irreps.len();
        let mut cases: Vec<Vec<u64>> = Vec::new();
        for k in 1..=3u64 {
            cases.push((0..n).map(|i| (i as u64 + k) % 4).collect());
            cases.push(vec![k; n]);
            cases.push((0..n).map(|i| if i % 2 == 0 { k + 1 } else { 0 }).collect());
            for i in 0..n {
                let mut m = vec![0; n];
                m[i] = k;
                if let Some(p) = g.table.irreps[i].pair {
                    cases.push(m.clone());
                    m[p] = k;
                }
                cases.push(m);
            }
        }
        for m in cases.iter().filter(|m| m.iter().any(|v| *v > 0)) {
            for unicode in [false, true] {
                let text = rep::format_sum(&g, m, unicode);
                assert_eq!(
                    rep::parse_gamma(&g, &text).as_ref(),
                    Ok(m),
                    "{name}: '{text}'"
                );
                let filtered = salcdesk::report::ascii_prose(&text);
                assert_eq!(
                    rep::parse_gamma(&g, &filtered).as_ref(),
                    Ok(m),
                    "{name}: '{filtered}'"
                );
            }
        }
    }
}

#[test]
fn explicit_multiplicity_forms_and_ambiguity() {
    // Multiplicity written `2 E`, `2*E`, `2×E`, or glued where no irrep has the glued name.
    let c3 = load("C3").unwrap();
    let pair = rep::parse_gamma(&c3, "E").unwrap();
    let two_pairs: Vec<u64> = pair.iter().map(|v| v * 2).collect();
    for t in ["2 E", "2*E", "2 * E", "2×E", "E + E"] {
        assert_eq!(rep::parse_gamma(&c3, t).unwrap(), two_pairs, "{t}");
    }
    // `2E` is the row ²E in C3, not two E.
    let row_2e = c3.table.irrep_index("2E").unwrap();
    assert_eq!(rep::parse_gamma(&c3, "2E").unwrap(), one_row(&c3, row_2e));
    // `12E`: 12 × E or 1 × ²E — an error that names both readings.
    let err = rep::parse_gamma(&c3, "A + 12E").unwrap_err();
    assert!(
        err.contains("1 × 2E") && err.contains("12 × E") && err.contains("column 5"),
        "{err}"
    );
    assert!(spectra::parse_gamma(&c3, "12E").is_err());
    // In Td no irrep starts with a digit: `2T2` is two T2.
    let td = load("Td").unwrap();
    let t2 = td.table.irrep_index("T2").unwrap();
    let mut m = vec![0; td.table.irreps.len()];
    m[t2] = 2;
    for t in ["2T2", "2 T2", "2*T2"] {
        assert_eq!(rep::parse_gamma(&td, t).unwrap(), m);
    }
    assert!(rep::parse_gamma(&td, "2 Q").is_err());
    assert!(rep::parse_gamma(&td, "x*T2").is_err());
}

fn chi_of(g: &PointGroup, m: &[u64]) -> Character {
    rep::from_multiplicities(g, m)
}

#[test]
fn products_of_typed_pair_rows_match_explicit_characters() {
    // Source: explicit characters. χ_{a⊗b}(R) = χa(R)χb(R) (Cotton, 3rd ed., §5.2); for the two
    // rows of a pair χ₂ = χ₁* and χ₁χ₁* = |χ₁|² = 1 on every class (one-dimensional rows), so
    // ¹E ⊗ ²E is the totally symmetric irrep. Every ordered pair of rows of the 19 groups,
    // typed in ASCII: the reduced product reproduces the product of the table characters.
    for g in pair_groups() {
        let n = g.table.irreps.len();
        for i in 0..n {
            for j in 0..n {
                let (li, lj) = (&g.table.irreps[i].label, &g.table.irreps[j].label);
                let a = rep::parse_gamma(&g, li).unwrap();
                let b = rep::parse_gamma(&g, lj).unwrap();
                let explicit: Vec<Cyclo> = (0..g.n_classes())
                    .map(|c| &g.table.irreps[i].chars[c] * &g.table.irreps[j].chars[c])
                    .collect();
                let prod = rep::direct_product(&chi_of(&g, &a), &chi_of(&g, &b));
                assert_eq!(prod.0, explicit, "{}: {li} x {lj}", g.name());
                let m = rep::decompose(&g, &prod).unwrap();
                assert_eq!(chi_of(&g, &m).0, explicit, "{}: {li} x {lj}", g.name());
                if g.table.irreps[i].pair == Some(j) {
                    assert_eq!(m, one_row(&g, 0), "{}: {li} x {lj}", g.name());
                }
            }
        }
    }
}

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

fn gamma_line(out: &str) -> String {
    out.lines()
        .rev()
        .find(|l| l.starts_with("Gamma =") || l.starts_with("Γ ="))
        .unwrap_or_else(|| panic!("no Γ line in {out}"))
        .to_string()
}

#[test]
fn cli_product_of_pair_rows() {
    // Source: explicit characters (see above): ¹E ⊗ ²E = A in C3; ¹E₁ ⊗ ²E₁ = A in C5.
    for (g, a, b) in [
        ("C3", "1E", "2E"),
        ("C5", "1E1", "2E1"),
        ("S8", "1E3", "2E3"),
    ] {
        let (code, out, err) = run(&["product", g, a, b, "--ascii"]);
        assert_eq!(code, 0, "{err}");
        assert!(gamma_line(&out).ends_with("= A"), "{g}: {out}");
    }
    let (code, _, err) = run(&["product", "C3", "12E", "A"]);
    assert_ne!(code, 0);
    assert!(err.contains("12 × E") && err.contains("1 × 2E"), "{err}");
}

#[test]
fn combos_and_descend_read_pair_rows() {
    // `--gamma "1E + 2E"` in C3 is one real E (Cotton, 3rd ed., §4.4); `2 E` two of them.
    let (code, out, err) = run(&[
        "modes",
        "--group",
        "C3",
        "--gamma",
        "A + 1E + 2E",
        "--format",
        "json",
    ]);
    assert_eq!(code, 0, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    assert_eq!(v["n_modes"], 3);
    let (code, out, err) = run(&[
        "modes", "--group", "C3", "--gamma", "A + 2 E", "--format", "json",
    ]);
    assert_eq!(code, 0, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    assert_eq!(v["n_modes"], 5);
    // A lone row of a pair is not a real representation: a clear error, not a guess.
    let (code, _, err) = run(&["modes", "--group", "C3", "--gamma", "A + 2E"]);
    assert_ne!(code, 0);
    assert!(err.contains("pair"), "{err}");
    // `--nu` takes row labels of pairs as the pair.
    let (code, _, err) = run(&[
        "combos",
        "--group",
        "C3",
        "--gamma",
        "A + E",
        "--nu",
        "A 1000; 1E 500",
    ]);
    assert_eq!(code, 0, "{err}");
}
