//! Normal modes in text, Markdown and JSON: the table of mode sets (ν, wavenumber, irrep,
//! dimension, purity, activity), flags, the isotopologue with its correlation and the
//! product rule per species, and band assignments. Presentation only (the numbers come
//! from `vib`).

use super::grid;
use crate::group::display_label;
use crate::vib::{wavenumber_text, Assignment, Modes, NormalModes};
use serde_json::{json, Value};

fn label(l: &str, ascii: bool) -> String {
    if ascii {
        l.to_string()
    } else {
        display_label(l)
    }
}

fn yes(b: bool) -> &'static str {
    if b {
        "yes"
    } else {
        "—"
    }
}

/// Rows of the mode table (header first).
pub fn mode_rows(m: &Modes, scale: Option<f64>, ascii: bool) -> Vec<Vec<String>> {
    let mut head: Vec<String> = ["#", "ν", "cm⁻¹", "irrep", "dim", "purity", "IR", "Raman"]
        .iter()
        .map(|s| s.to_string())
        .collect();
    if let Some(s) = scale {
        head.insert(3, format!("×{s}"));
    }
    let mut rows = vec![head];
    for s in &m.sets {
        let mut r = vec![
            s.index.to_string(),
            format!("ν{}", s.nu),
            wavenumber_text(s.wavenumber, 1),
            label(&s.irrep, ascii),
            s.dimension.to_string(),
            format!("{:.1} %", 100.0 * s.purity),
            yes(s.ir).into(),
            yes(s.raman).into(),
        ];
        if let Some(f) = scale {
            r.insert(3, wavenumber_text(s.wavenumber * f, 1));
        }
        if s.flag.is_some() {
            r[5].push_str(" !");
        }
        rows.push(r);
    }
    rows
}

fn summary(m: &Modes) -> String {
    format!(
        "{} vibrations in {}; solved {} ({}), Hessian departs from the group's symmetry by {:.1e}{}",
        m.n_modes,
        m.point_group,
        m.solver,
        if m.solver == "blocked" {
            "by irrep, first-partner SALCs"
        } else {
            "one dense eigen-solve, labels by projection"
        },
        m.departure,
        if m.symmetrized { " (symmetrized)" } else { "" }
    )
}

fn flags(m: &Modes) -> Vec<String> {
    m.sets
        .iter()
        .filter_map(|s| {
            s.flag
                .as_ref()
                .map(|f| format!("#{} ({}): {f}", s.index, s.irrep))
        })
        .collect()
}

/// Plain text (`markdown = false`) or Markdown.
pub fn render(
    nm: &NormalModes,
    bands: &[Assignment],
    scale: Option<f64>,
    markdown: bool,
    ascii: bool,
) -> String {
    let mut out = String::new();
    let table = |rows: &[Vec<String>]| {
        if markdown {
            markdown_table(rows)
        } else {
            grid::render(rows, ascii)
        }
    };
    let h = |t: &str| {
        if markdown {
            format!("### {t}\n\n")
        } else {
            format!("{t}\n")
        }
    };
    out.push_str(&h(&format!("Normal modes — {}", nm.title)));
    out.push_str(&summary(&nm.parent));
    out.push_str("\n\n");
    out.push_str(&table(&mode_rows(&nm.parent, scale, ascii)));
    for f in flags(&nm.parent) {
        out.push_str(&format!("! {f}\n"));
    }
    for n in &nm.parent.notes {
        out.push_str(&format!("note: {n}\n"));
    }
    if let Some(iso) = &nm.isotopologue {
        out.push('\n');
        out.push_str(&h(&format!(
            "Isotopologue {} — {}{}",
            iso.isotopes.join(", "),
            iso.modes.point_group,
            if iso.lowered {
                format!(" (lowered from {})", nm.parent.point_group)
            } else {
                String::new()
            }
        )));
        out.push_str(&table(&mode_rows(&iso.modes, scale, ascii)));
        if !iso.correlation.is_empty() && iso.lowered {
            out.push_str("\ncorrelation:\n");
            for c in &iso.correlation {
                let b: Vec<String> = c
                    .becomes
                    .iter()
                    .map(|(l, n)| {
                        if *n > 1 {
                            format!("{n}{}", label(l, ascii))
                        } else {
                            label(l, ascii)
                        }
                    })
                    .collect();
                out.push_str(&format!(
                    "  #{} {} → {}\n",
                    c.parent_index,
                    label(&c.parent_irrep, ascii),
                    b.join(" + ")
                ));
            }
        }
        if !iso.product_rule.is_empty() {
            out.push_str("\nTeller–Redlich product rule (Redlich 1935; Wilson, Decius & Cross):\n");
            let mut rows = vec![vec![
                "species".to_string(),
                "sets".into(),
                "Πν′/ν".into(),
                "masses".into(),
                "Πν/ν′".into(),
                "masses".into(),
                "deviation".into(),
            ]];
            for p in &iso.product_rule {
                rows.push(vec![
                    label(&p.species, ascii),
                    p.sets.to_string(),
                    format!("{:.6}", p.from_wavenumbers),
                    format!("{:.6}", p.from_masses),
                    format!("{:.6}", 1.0 / p.from_wavenumbers),
                    format!("{:.6}", 1.0 / p.from_masses),
                    format!("{:.1e}", p.deviation),
                ]);
            }
            out.push_str(&table(&rows));
        }
        for f in flags(&iso.modes) {
            out.push_str(&format!("! {f}\n"));
        }
        for n in iso.notes.iter().chain(&iso.modes.notes) {
            out.push_str(&format!("note: {n}\n"));
        }
    }
    if !bands.is_empty() {
        out.push('\n');
        out.push_str(&h("Observed bands"));
        let mut rows = vec![vec![
            "cm⁻¹".to_string(),
            "technique".into(),
            "assigned".into(),
            "predicted".into(),
            "symmetry".into(),
            "remark".into(),
        ]];
        for b in bands {
            rows.push(vec![
                format!("{:.1}", b.position),
                b.technique.clone(),
                b.assigned.clone().unwrap_or_else(|| "—".into()),
                b.predicted.map(|p| format!("{p:.1}")).unwrap_or_default(),
                b.symmetry.clone().unwrap_or_default(),
                b.remark.clone().unwrap_or_default(),
            ]);
        }
        out.push_str(&table(&rows));
    }
    if ascii {
        super::ascii_prose(&out)
    } else {
        out
    }
}

fn markdown_table(rows: &[Vec<String>]) -> String {
    let mut out = String::new();
    for (i, r) in rows.iter().enumerate() {
        out.push_str(&format!("| {} |\n", r.join(" | ")));
        if i == 0 {
            out.push_str(&format!("|{}\n", "---|".repeat(r.len())));
        }
    }
    out
}

fn modes_json(m: &Modes, scale: Option<f64>) -> Value {
    json!({
        "point_group": m.point_group,
        "n_modes": m.n_modes,
        "modes": m.sets.iter().map(|s| {
            let mut v = json!({
                "index": s.index,
                "wavenumber": s.wavenumber,
                "irrep": s.irrep,
                "dimension": s.dimension,
                "purity": s.purity,
                "ir": s.ir,
                "raman": s.raman,
                "nu": s.nu,
            });
            if let Some(f) = scale {
                v["scaled"] = json!(s.wavenumber * f);
            }
            if s.dimension > 1 {
                v["members"] = json!(s.members);
            }
            if let Some(f) = &s.flag {
                v["flag"] = json!(f);
            }
            v
        }).collect::<Vec<_>>(),
        "solver": m.solver,
        "symmetrized": m.symmetrized,
        "departure": m.departure,
        "geometry_deviation": m.geometry_deviation,
        "masses": m.masses,
        "notes": m.notes,
    })
}

/// The JSON shape of `normal-modes --format json`.
pub fn json(nm: &NormalModes, bands: &[Assignment], scale: Option<f64>) -> Value {
    let mut v = modes_json(&nm.parent, scale);
    v["isotopologue"] = match &nm.isotopologue {
        None => Value::Null,
        Some(iso) => {
            let mut j = modes_json(&iso.modes, scale);
            j["isotopes"] = json!(iso.isotopes);
            j["lowered"] = json!(iso.lowered);
            j["correlation"] = json!(iso.correlation);
            j["product_rule"] = json!(iso.product_rule);
            j["notes"] = json!(iso.notes);
            j
        }
    };
    if !bands.is_empty() {
        v["bands"] = json!(bands);
    }
    v
}

/// The session report's section: the table of the session's `[vibrations]` Hessian, or why
/// there is none (empty when the session names no Hessian).
pub fn session_section(a: &crate::analysis::Analysis, markdown: bool, ascii: bool) -> String {
    match &a.vibrations {
        None => String::new(),
        Some(Err(e)) => format!("\nNormal modes: {e}\n"),
        Some(Ok(v)) => format!(
            "\n{}",
            render(&v.modes, &v.assignments, v.scale, markdown, ascii)
        ),
    }
}

/// The session report's JSON member `vibrations` (None when the session names no Hessian).
pub fn session_json(a: &crate::analysis::Analysis) -> Option<Value> {
    a.vibrations.as_ref().map(|r| match r {
        Err(e) => json!({ "error": e }),
        Ok(v) => json(&v.modes, &v.assignments, v.scale),
    })
}
