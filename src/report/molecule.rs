//! The molecule part of a session report: remarks on the session as a whole, what the survey
//! of the geometry found, the exact stretch SALCs of each bond set, and the spectra of Γvib
//! (activity and band counts, the band-list check, overtones and combinations).
//!
//! Presentation only: everything comes from `analysis::analyze`.

use super::Format;
use crate::analysis::{Analysis, BondSalcs};
use crate::salc::{self, View};
use serde_json::{json, Value};

fn view(b: &BondSalcs) -> Option<View<'_>> {
    let set = b.result.as_ref().ok()?;
    let sites = match &b.basis {
        Some(basis) => basis
            .members
            .iter()
            .map(|m| basis.sites[m.site].clone())
            .collect(),
        None => set.members.iter().map(|m| m.name.clone()).collect(),
    };
    Some(View {
        set,
        basis: "stretch",
        sites,
        only: None,
        central: Vec::new(),
        worked: None,
        notes: Vec::new(),
    })
}

fn heading(title: &str, format: Format) -> String {
    match format {
        Format::Markdown => format!("\n## {title}\n\n"),
        _ => format!("\n{title}\n{}\n", "-".repeat(title.chars().count())),
    }
}

/// Markdown of a part rendered on its own, its headings shifted so that its top level is
/// `level` (headings never jump a level inside the report).
fn demote_to(md: &str, level: usize) -> String {
    let depth = |l: &str| l.chars().take_while(|c| *c == '#').count();
    let top = md
        .lines()
        .filter(|l| l.starts_with('#'))
        .map(depth)
        .min()
        .unwrap_or(level);
    md.lines()
        .map(|l| {
            if l.starts_with('#') {
                let d = depth(l) - top + level;
                format!("{}{}\n", "#".repeat(d), &l[depth(l)..])
            } else {
                format!("{l}\n")
            }
        })
        .collect()
}

/// Text, Markdown or LaTeX for the molecule part (empty when the session has neither
/// remarks, a geometry nor a Γvib). LaTeX is typeset from the Markdown: headings, real tables,
/// lists and the notation in math mode.
pub fn render(a: &Analysis, format: Format, ascii: bool) -> String {
    match format {
        Format::Latex => super::latex::from_markdown(&render(a, Format::Markdown, false)),
        Format::Json => serde_json::to_string_pretty(&to_json(a)).unwrap_or_default() + "\n",
        _ => parts(a, format, ascii),
    }
}

fn parts(a: &Analysis, format: Format, ascii: bool) -> String {
    let md = format == Format::Markdown;
    let mut o = String::new();
    let body = |s: String| -> String {
        if ascii {
            super::ascii_prose(&s)
        } else {
            s
        }
    };
    if !a.notes.is_empty() {
        o.push_str(&heading("Remarks", format));
        let text: String = a.notes.iter().map(|n| format!("- {n}.\n")).collect();
        o.push_str(&body(text));
    }
    if let Some(ga) = &a.geometry {
        o.push_str(&heading("Molecule", format));
        match &ga.survey {
            Ok(sv) => {
                let part =
                    super::survey::render(&ga.source, &sv.oriented.molecule, sv, format, ascii);
                o.push_str(&body(if md { demote_to(&part, 3) } else { part }));
            }
            Err(e) => o.push_str(&body(format!("No survey: {e}\n"))),
        }
        if let Some(res) = &ga.salcs {
            match &**res {
                Ok(sets) => {
                    for b in sets {
                        o.push_str(&heading(&format!("Stretch SALCs: {}", b.name), format));
                        match view(b) {
                            Some(v) => {
                                let part = salc::render(&v, format, ascii);
                                o.push_str(&if md { demote_to(&part, 3) } else { part });
                            }
                            None => o.push_str(&body(format!(
                                "No SALCs: {}\n",
                                b.result.as_ref().err().cloned().unwrap_or_default()
                            ))),
                        }
                    }
                }
                Err(e) => o.push_str(&body(format!("No SALCs: {e}\n"))),
            }
        }
    }
    if let Some(sp) = &a.spectra {
        o.push_str(&heading(&format!("Spectra: Γvib of {}", sp.source), format));
        match &sp.modes {
            Ok(m) => o.push_str(&super::spectra::modes(m, format, ascii)),
            Err(e) => o.push_str(&body(format!("{e}\n"))),
        }
        if let Some(c) = &sp.check {
            o.push_str(&heading(
                "Band-list check (candidates, not assignments)",
                format,
            ));
            match c {
                Ok(c) => o.push_str(&super::spectra::check(c, format, ascii)),
                Err(e) => o.push_str(&body(format!("{e}\n"))),
            }
        }
        o.push_str(&heading("Overtones and binary combinations", format));
        match &sp.combinations {
            Ok(c) => o.push_str(&super::spectra::combinations(c, format, ascii)),
            Err(e) => o.push_str(&body(format!("{e}\n"))),
        }
    }
    if ascii {
        super::ascii_prose(&o)
    } else {
        o
    }
}

/// The same as JSON fields: `remarks`, `geometry`, `salcs`, `spectra`.
pub fn to_json(a: &Analysis) -> Value {
    let mut out = json!({ "remarks": a.notes });
    if let Some(ga) = &a.geometry {
        out["geometry"] = match &ga.survey {
            Ok(sv) => super::survey::to_json(&ga.source, &sv.oriented.molecule, sv),
            Err(e) => json!({ "error": e }),
        };
        if let Some(res) = &ga.salcs {
            out["salcs"] = match &**res {
                Ok(sets) => Value::Array(
                    sets.iter()
                        .map(|b| match view(b) {
                            Some(v) => {
                                let mut j: Value =
                                    serde_json::from_str(&salc::render(&v, Format::Json, true))
                                        .unwrap_or(Value::Null);
                                j["set"] = json!(b.name);
                                j
                            }
                            None => json!({ "set": b.name, "error": b.result.as_ref().err() }),
                        })
                        .collect(),
                ),
                Err(e) => json!({ "error": e }),
            };
        }
    }
    if let Some(sp) = &a.spectra {
        let v = |r: Result<Value, &String>| r.unwrap_or_else(|e| json!({ "error": e }));
        out["spectra"] = json!({
            "source": sp.source,
            "point_group": sp.group.name(),
            "activity": v(sp.modes.as_ref().map(|m| serde_json::to_value(m).unwrap_or(Value::Null))),
            "band_check": sp.check.as_ref().map(|c| v(c.as_ref().map(|c| serde_json::to_value(c).unwrap_or(Value::Null)))),
            "combinations": v(sp.combinations.as_ref().map(|c| serde_json::to_value(c).unwrap_or(Value::Null))),
        });
    }
    out
}
