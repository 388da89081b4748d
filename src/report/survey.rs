//! A molecule survey rendered as text, Markdown or JSON (the `analyze` and `detect` output).

use super::{grid, Format};
use crate::geom::Molecule;
use crate::rep::{format_sum, real_terms};
use crate::survey::Survey;
use serde_json::{json, Value};

/// Hill-order formula (C, H, then alphabetical), e.g. `CH4`, `H2O`.
pub fn formula(mol: &Molecule) -> String {
    let mut counts: std::collections::BTreeMap<String, usize> = Default::default();
    for a in &mol.atoms {
        *counts.entry(a.symbol().to_string()).or_default() += 1;
    }
    let mut keys: Vec<String> = counts.keys().cloned().collect();
    let has_c = counts.contains_key("C");
    keys.sort_by_key(|k| match (has_c, k.as_str()) {
        (true, "C") => (0, k.clone()),
        (true, "H") => (1, k.clone()),
        _ => (2, k.clone()),
    });
    keys.iter()
        .map(|k| {
            let n = counts[k];
            if n == 1 {
                k.clone()
            } else {
                format!("{k}{n}")
            }
        })
        .collect()
}

fn gamma(s: &Survey, m: &[u64], ascii: bool) -> String {
    format_sum(&s.group, m, !ascii)
}

fn signed(s: &Survey, m: &[i64], ascii: bool) -> String {
    let parts: Vec<String> = m
        .iter()
        .enumerate()
        .filter(|(_, n)| **n != 0)
        .map(|(i, n)| {
            let ir = &s.group.table.irreps[i];
            let l = if ascii {
                ir.label.clone()
            } else {
                ir.display()
            };
            match *n {
                1 => l,
                -1 => format!("−{l}").replace('−', if ascii { "-" } else { "−" }),
                k => format!("{k}{l}"),
            }
        })
        .collect();
    if parts.is_empty() {
        "0".into()
    } else {
        parts.join(" + ").replace("+ −", "− ").replace("+ -", "- ")
    }
}

/// JSON object of a survey (`"point_group"`, `"n_atoms"`, `"gamma_vib"`, `"n_modes"`, …).
pub fn to_json(name: &str, mol: &Molecule, s: &Survey) -> Value {
    let g = &s.group;
    let terms = |m: &[u64]| -> Vec<Value> {
        real_terms(g, m)
            .into_iter()
            .map(|t| json!({"irrep": t.label, "multiplicity": t.multiplicity, "dimension": t.dimension}))
            .collect()
    };
    let classes: Vec<String> = s
        .working
        .table
        .classes
        .iter()
        .map(|c| c.ascii.clone())
        .collect();
    let r = &s.oriented.rotation;
    json!({
        "file": name,
        "point_group": g.name(),
        "formula": formula(mol),
        "n_atoms": mol.atoms.len(),
        "tolerance": s.detection.tolerance,
        "max_deviation": s.detection.max_deviation,
        "near_misses": s.near_misses.iter().map(|n| json!({"tolerance": n.tolerance, "group": n.group, "max_deviation": n.max_deviation})).collect::<Vec<_>>(),
        "orientation": {
            "rotation": (0..3).map(|i| (0..3).map(|j| r[(i, j)]).collect::<Vec<_>>()).collect::<Vec<_>>(),
            "centre": [s.oriented.centre.x, s.oriented.centre.y, s.oriented.centre.z],
        },
        "working_group": s.working.name(),
        "classes": classes,
        "unmoved_atoms": s.unmoved_atoms,
        "bonds": s.bonds.iter().map(|(a, b)| [a + 1, b + 1]).collect::<Vec<_>>(),
        "gamma_3n": terms(&s.vibrations.gamma_3n),
        "gamma_vib": terms(&s.vibrations.vibrations),
        "n_modes": s.vibrations.n_modes,
        "bond_sets": s.bond_sets.iter().map(|b| json!({
            "label": b.set.label,
            "bonds": b.set.bonds.iter().map(|(x, y)| [x + 1, y + 1]).collect::<Vec<_>>(),
            "unmoved": b.unmoved,
            "gamma": format_sum(g, &b.gamma, false),
        })).collect::<Vec<_>>(),
        "angle_sets": s.angle_sets.iter().map(|a| json!({
            "label": a.set.label,
            "angles": a.set.angles.iter().map(|(x, y, z)| [x + 1, y + 1, z + 1]).collect::<Vec<_>>(),
            "unmoved": a.unmoved,
            "gamma": format_sum(g, &a.gamma, false),
        })).collect::<Vec<_>>(),
        "gamma_stretch": format_sum(g, &s.stretches, false),
        "gamma_bend_remainder": signed(s, &s.bend_remainder, true),
        "gamma_bend": format_sum(g, &s.bends, false),
        "redundant": format_sum(g, &s.redundant, false),
        "uncovered": format_sum(g, &s.uncovered, false),
        "notes": s.notes,
    })
}

/// Near-miss line, e.g. `D3h at 0.01 Å; D6h if 0.1 Å is allowed (largest deviation 0.08 Å)`.
pub fn near_miss_line(s: &Survey, ascii: bool) -> String {
    let ang = if ascii { "A" } else { "Å" };
    let mut parts = vec![format!(
        "{} at {} {ang} (largest deviation {:.4} {ang})",
        s.group.name(),
        s.detection.tolerance,
        s.detection.max_deviation
    )];
    let mut last = s.group.name().to_string();
    for n in &s.near_misses {
        if n.group != last && n.tolerance > s.detection.tolerance {
            parts.push(format!(
                "{} if {} {ang} is allowed (largest deviation {:.4} {ang})",
                n.group, n.tolerance, n.max_deviation
            ));
            last = n.group.clone();
        }
    }
    parts.join("; ")
}

/// Text or Markdown rendering.
pub fn render(name: &str, mol: &Molecule, s: &Survey, format: Format, ascii: bool) -> String {
    if format == Format::Json {
        return serde_json::to_string_pretty(&to_json(name, mol, s)).unwrap_or_default() + "\n";
    }
    let md = format == Format::Markdown;
    let g = &s.group;
    let gname = if ascii {
        g.name().to_string()
    } else {
        g.table.symbol.clone()
    };
    let mut out = String::new();
    let h = |t: &str| {
        if md {
            format!("\n### {t}\n\n")
        } else {
            format!("\n{t}\n")
        }
    };
    out.push_str(&format!(
        "{}{name}: {} ({} atoms), point group {gname}\n",
        if md { "## " } else { "" },
        formula(mol),
        mol.atoms.len()
    ));
    out.push_str(&format!("{}\n", near_miss_line(s, ascii)));
    let r = &s.oriented.rotation;
    out.push_str(&format!(
        "standard orientation: rotation [{:.4} {:.4} {:.4}; {:.4} {:.4} {:.4}; {:.4} {:.4} {:.4}] about centre ({:.4}, {:.4}, {:.4})\n",
        r[(0, 0)], r[(0, 1)], r[(0, 2)], r[(1, 0)], r[(1, 1)], r[(1, 2)], r[(2, 0)], r[(2, 1)], r[(2, 2)],
        s.oriented.centre.x, s.oriented.centre.y, s.oriented.centre.z
    ));
    out.push_str(&h("unmoved atoms per class"));
    let w = &s.working;
    let mut rows = vec![w
        .table
        .classes
        .iter()
        .map(|c| {
            if ascii {
                c.ascii.clone()
            } else {
                c.symbol.clone()
            }
        })
        .collect::<Vec<_>>()];
    rows.push(s.unmoved_atoms.iter().map(|n| n.to_string()).collect());
    out.push_str(&grid::render(&rows, ascii));
    let gam = if ascii { "Gamma" } else { "Γ" };
    out.push_str(&h("representations"));
    out.push_str(&format!(
        "{gam}3N  = {}\n",
        gamma(s, &s.vibrations.gamma_3n, ascii)
    ));
    out.push_str(&format!(
        "{gam}vib = {}   ({} modes)\n",
        gamma(s, &s.vibrations.vibrations, ascii),
        s.vibrations.n_modes
    ));
    out.push_str(&h("bond sets"));
    for b in &s.bond_sets {
        let label = if ascii {
            super::ascii_prose(&b.set.label)
        } else {
            b.set.label.clone()
        };
        out.push_str(
            &format!(
                "{label} ×{}: {}\n",
                b.set.bonds.len(),
                gamma(s, &b.gamma, ascii)
            )
            .replace('×', if ascii { "x" } else { "×" }),
        );
    }
    out.push_str(&format!(
        "{gam}stretch = {}\n",
        gamma(s, &s.stretches, ascii)
    ));
    out.push_str(
        &format!(
            "{gam}vib − {gam}stretch (bends and other deformations) = {}\n",
            signed(s, &s.bend_remainder, ascii)
        )
        .replace('−', if ascii { "-" } else { "−" }),
    );
    if !s.angle_sets.is_empty() {
        out.push_str(&h("angle sets"));
        for a in &s.angle_sets {
            let label = if ascii {
                super::ascii_prose(&a.set.label)
            } else {
                a.set.label.clone()
            };
            out.push_str(
                &format!(
                    "{label} ×{}: {}\n",
                    a.set.angles.len(),
                    gamma(s, &a.gamma, ascii)
                )
                .replace('×', if ascii { "x" } else { "×" }),
            );
        }
        out.push_str(&format!(
            "redundant combinations (stretches + bends beyond {gam}vib): {}\n",
            gamma(s, &s.redundant, ascii)
        ));
        out.push_str(&format!(
            "not covered by stretches + bends (torsions, out-of-plane): {}\n",
            gamma(s, &s.uncovered, ascii)
        ));
    }
    if !s.notes.is_empty() {
        out.push_str(&h("notes"));
        for n in &s.notes {
            out.push_str(&format!(
                "- {}\n",
                if ascii {
                    super::ascii_prose(n)
                } else {
                    n.clone()
                }
            ));
        }
    }
    out
}
