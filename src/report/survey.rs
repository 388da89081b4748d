//! A molecule survey rendered as text, Markdown or JSON (the `analyze` and `detect` output).

use super::{grid, Format};
use crate::geom::Molecule;
use crate::rep::{format_sum, real_terms};
use crate::survey::Survey;
use serde_json::{json, Value};

/// The molecule's formula as chemists write it (`SF6`, `PCl5`, `[PtCl4]`, `CH4`; ASCII digits):
/// see [`crate::geom::formula`].
pub fn formula(mol: &Molecule) -> String {
    crate::geom::formula::formula(mol.atoms.iter().map(|a| a.symbol()))
}

/// The formula for display: Unicode subscripts unless `ascii`.
pub fn formula_text(mol: &Molecule, ascii: bool) -> String {
    let f = formula(mol);
    if ascii {
        f
    } else {
        crate::geom::formula::subscripts(&f)
    }
}

fn gamma(s: &Survey, m: &[u64], ascii: bool) -> String {
    format_sum(&s.group, m, !ascii)
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
        "gamma_bend_remainder": format_sum(g, &s.bend_remainder.iter().map(|&n| n.max(0) as u64).collect::<Vec<_>>(), false),
        "stretch_beyond_vib": format_sum(g, &s.bend_remainder.iter().map(|&n| n.min(0).unsigned_abs()).collect::<Vec<_>>(), false),
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

/// What Γvib − Γstretch says, in words, never with a negative count: the part the bends and
/// other deformations must span, and (when the bond set spans more than the vibrations of some
/// irrep) what the stretches contain beyond Γvib and why.
pub fn remainder_lines(s: &Survey, ascii: bool) -> Vec<String> {
    let g = &s.group;
    let gam = if ascii { "Gamma" } else { "Γ" };
    let pos: Vec<u64> = s.bend_remainder.iter().map(|&n| n.max(0) as u64).collect();
    let neg: Vec<u64> = s
        .bend_remainder
        .iter()
        .map(|&n| n.min(0).unsigned_abs())
        .collect();
    let mut out = Vec::new();
    if neg.iter().all(|&n| n == 0) {
        out.push(format!(
            "{gam}vib − {gam}stretch (bends and other deformations) = {}",
            format_sum(g, &pos, !ascii)
        ));
    } else {
        out.push(format!(
            "the bond stretches span more than {gam}vib: beyond it they contain {} — \
             combinations of the bonds that are not vibrations (more bonds than the molecule \
             has independent stretching freedoms in these symmetries, e.g. a closed ring or \
             cage, or bonds added by hand), i.e. redundant stretch coordinates",
            format_sum(g, &neg, !ascii)
        ));
        out.push(format!(
            "bends and other deformations span at least {}",
            format_sum(g, &pos, !ascii)
        ));
    }
    out.into_iter()
        .map(|l| if ascii { super::ascii_prose(&l) } else { l })
        .collect()
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
            format!("\n## {t}\n\n")
        } else {
            format!("\n{t}\n")
        }
    };
    // One line of a list: a Markdown item, or the line itself in text.
    let item = |t: &str| {
        if md {
            format!("- {t}\n")
        } else {
            format!("{t}\n")
        }
    };
    out.push_str(&format!(
        "{}{name}: {} ({} atoms), point group {gname}\n",
        if md { "# " } else { "" },
        formula_text(mol, ascii),
        mol.atoms.len()
    ));
    if md {
        out.push('\n');
    }
    out.push_str(&item(&near_miss_line(s, ascii)));
    let r = &s.oriented.rotation;
    // Four decimals, and no "-0.0000" for a value that rounds to zero.
    let f = |v: f64| {
        let t = format!("{v:.4}");
        if t == "-0.0000" {
            "0.0000".to_string()
        } else {
            t
        }
    };
    let c = &s.oriented.centre;
    out.push_str(&item(&format!(
        "standard orientation: rotation [{} {} {}; {} {} {}; {} {} {}] about centre ({}, {}, {})",
        f(r[(0, 0)]),
        f(r[(0, 1)]),
        f(r[(0, 2)]),
        f(r[(1, 0)]),
        f(r[(1, 1)]),
        f(r[(1, 2)]),
        f(r[(2, 0)]),
        f(r[(2, 1)]),
        f(r[(2, 2)]),
        f(c.x),
        f(c.y),
        f(c.z)
    )));
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
    out.push_str(&if md {
        grid::markdown(&rows)
    } else {
        grid::render(&rows, ascii)
    });
    let gam = if ascii { "Gamma" } else { "Γ" };
    out.push_str(&h("representations"));
    out.push_str(&item(&format!(
        "{gam}3N  = {}",
        gamma(s, &s.vibrations.gamma_3n, ascii)
    )));
    out.push_str(&item(&format!(
        "{gam}vib = {}   ({} modes)",
        gamma(s, &s.vibrations.vibrations, ascii),
        s.vibrations.n_modes
    )));
    out.push_str(&h("bond sets"));
    for b in &s.bond_sets {
        let label = if ascii {
            super::ascii_prose(&b.set.label)
        } else {
            b.set.label.clone()
        };
        out.push_str(&item(
            &format!(
                "{label} ×{}: {}",
                b.set.bonds.len(),
                gamma(s, &b.gamma, ascii)
            )
            .replace('×', if ascii { "x" } else { "×" }),
        ));
    }
    out.push_str(&item(&format!(
        "{gam}stretch = {}",
        gamma(s, &s.stretches, ascii)
    )));
    for l in remainder_lines(s, ascii) {
        out.push_str(&item(&l));
    }
    if !s.angle_sets.is_empty() {
        out.push_str(&h("angle sets"));
        for a in &s.angle_sets {
            let label = if ascii {
                super::ascii_prose(&a.set.label)
            } else {
                a.set.label.clone()
            };
            out.push_str(&item(
                &format!(
                    "{label} ×{}: {}",
                    a.set.angles.len(),
                    gamma(s, &a.gamma, ascii)
                )
                .replace('×', if ascii { "x" } else { "×" }),
            ));
        }
        out.push_str(&item(&format!(
            "redundant combinations (stretches + bends beyond {gam}vib): {}",
            gamma(s, &s.redundant, ascii)
        )));
        out.push_str(&item(&format!(
            "not covered by stretches + bends (torsions, out-of-plane): {}",
            gamma(s, &s.uncovered, ascii)
        )));
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
