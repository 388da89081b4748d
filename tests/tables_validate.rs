//! Every shipped table passes every validation rule (group::validate), generates its group, and
//! renders in every format. A wrong character or function entry fails here.

use salcdesk::group::{self, validate::validate};
use salcdesk::report::{table, Format};

/// Groups the issue requires, by ASCII name.
fn required() -> Vec<String> {
    let mut v: Vec<String> = [
        "C1", "Cs", "Ci", "S4", "S6", "S8", "S10", "S12", "T", "Td", "Th", "O", "Oh", "I", "Ih",
        "Cinfv", "Dinfh",
    ]
    .iter()
    .map(|s| s.to_string())
    .collect();
    for n in 2..=8 {
        for f in ["C{}", "C{}v", "C{}h", "D{}", "D{}h", "D{}d"] {
            v.push(f.replace("{}", &n.to_string()));
        }
    }
    v
}

#[test]
fn every_required_group_is_shipped() {
    let names = group::names();
    for r in required() {
        assert!(names.contains(&r.as_str()), "missing table {r}");
    }
    assert!(names.len() >= 59);
}

#[test]
fn every_table_validates() {
    let mut failures = Vec::new();
    for name in group::names() {
        match group::load(name) {
            Ok(g) => {
                let p = validate(&g);
                if !p.is_empty() {
                    failures.push(format!("{name}: {}", p.join("; ")));
                }
                if !g.is_linear() {
                    assert_eq!(Some(g.order()), g.table.order, "{name}");
                }
            }
            Err(e) => failures.push(format!("{name}: {e}")),
        }
    }
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}

#[test]
fn every_table_renders_in_every_format() {
    for name in group::names() {
        let g = group::load(name).unwrap();
        for f in [Format::Text, Format::Markdown, Format::Latex, Format::Json] {
            for ascii in [false, true] {
                let s = table::render(&g, f, ascii);
                let ok = match f {
                    Format::Latex => s.contains("\\begin{tabular}") && s.contains("\\bottomrule"),
                    _ => {
                        s.contains(&g.table.irreps[0].label)
                            || s.contains(&g.table.irreps[0].display())
                    }
                };
                assert!(ok, "{name} {f:?} ascii={ascii}\n{s}");
            }
        }
        let j = table::to_json(&g);
        assert_eq!(j["group"], name);
        assert_eq!(j["irreps"].as_array().unwrap().len(), g.table.irreps.len());
        assert_eq!(
            j["classes"].as_array().unwrap().len(),
            g.table.classes.len()
        );
    }
}

#[test]
fn ascii_output_is_ascii() {
    for name in ["C3v", "Ih", "D8d", "C5h", "Dinfh"] {
        let g = group::load(name).unwrap();
        let s = table::render(&g, Format::Text, true);
        assert!(s.is_ascii(), "{name}: {s}");
    }
}

#[test]
fn a_corrupted_character_fails_validation() {
    // Mutation check: the validator must catch a single wrong entry.
    let text = include_str!("../tables/Td.toml");
    // Change one character of T1 (the χ(C2) = −1 entry) to +1.
    let line = text
        .lines()
        .skip_while(|l| !l.contains("label = \"T1\""))
        .find(|l| l.trim_start().starts_with("chars"))
        .unwrap();
    let bad = text.replacen(line, &line.replacen("\"-1\"", "\"1\"", 1), 1);
    assert_ne!(bad, text);
    let g = group::PointGroup::from_toml("Td-bad.toml", &bad).unwrap();
    assert!(!validate(&g).is_empty());
}

#[test]
fn a_wrong_function_fails_validation() {
    let text = include_str!("../tables/C4v.toml");
    let bad = text.replacen("\"z\"", "\"x\"", 1);
    let g = group::PointGroup::from_toml("C4v-bad.toml", &bad).unwrap();
    assert!(!validate(&g).is_empty());
}
