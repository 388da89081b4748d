//! A whole session as a report: the group and its table, each member set with its unmoved
//! counts, χ and worked reduction, what the later layers give (or that they are not in this
//! build), the observed bands and the notes. Text, Markdown, standalone LaTeX (booktabs) and
//! JSON.
//!
//! Presentation only: everything shown comes from `analysis::analyze`.

use super::{reduction, table, Format};
use crate::analysis::{Analysis, Error, LayerStatus, Outcome, SetAnalysis};
use crate::exact::Notation;
use crate::group::display_label;
use crate::session::{Band, Session};
use serde_json::{json, Value};

/// Render a session report.
pub fn render(s: &Session, a: &Result<Analysis, Error>, format: Format, ascii: bool) -> String {
    match format {
        Format::Json => serde_json::to_string_pretty(&to_json(s, a)).unwrap_or_default() + "\n",
        Format::Latex => latex(s, a),
        // ASCII mode promises only ASCII, the user's own notes included.
        Format::Markdown if ascii => super::ascii_prose(&markdown(s, a, ascii)),
        Format::Markdown => markdown(s, a, ascii),
        Format::Text if ascii => super::ascii_prose(&text(s, a, ascii)),
        Format::Text => text(s, a, ascii),
    }
}

fn nt(ascii: bool) -> Notation {
    if ascii {
        Notation::Ascii
    } else {
        Notation::Unicode
    }
}

/// Header row and rows of the unmoved-count/χ table of a set.
fn set_rows(a: &Analysis, s: &SetAnalysis, ascii: bool) -> Vec<Vec<String>> {
    let mut head = vec![String::new()];
    head.extend(a.class_symbols(ascii));
    let mut unmoved = vec!["unmoved".to_string()];
    unmoved.extend(s.unmoved.iter().map(|v| v.to_string()));
    let mut rows = vec![head, unmoved];
    if !s.per_member.is_empty() {
        let mut each = vec!["each".to_string()];
        each.extend(s.per_member.iter().map(|v| v.text(nt(ascii))));
        rows.push(each);
    }
    if let Outcome::Finite { chi, .. } = &*s.outcome {
        let mut c = vec![if ascii { "chi" } else { "χ" }.to_string()];
        c.extend(chi.0.iter().map(|v| v.text(nt(ascii))));
        rows.push(c);
    }
    rows
}

/// The result of a set in words: `Γ = A₁ + E`, or why there is none.
pub fn set_result(a: &Analysis, s: &SetAnalysis, ascii: bool) -> String {
    let g = &a.group;
    match &*s.outcome {
        Outcome::Empty => "no members yet".into(),
        Outcome::Finite { result: Ok(m), .. } => format!(
            "{} = {}",
            if ascii { "Gamma" } else { "Γ" },
            crate::rep::format_sum(g, m, !ascii)
        ),
        Outcome::Finite {
            result: Err(inv), ..
        } => invalid_text(a, inv, ascii),
        Outcome::Linear(Ok(lr)) => format!(
            "{} = {}  ({})",
            if ascii { "Gamma" } else { "Γ" },
            crate::rep::format_sum(g, &lr.multiplicities, !ascii),
            lr.note
        ),
        Outcome::Linear(Err(e)) | Outcome::Failed(e) => format!("no reduction: {e}"),
    }
}

/// Why χ is not a representation, and the single-class fixes the analysis found (none at the
/// quick depth). Uses what the analysis computed; never searches again.
pub fn invalid_text(a: &Analysis, inv: &crate::rep::Invalid, ascii: bool) -> String {
    let g = &a.group;
    let bad: Vec<String> = inv
        .offending
        .iter()
        .map(|(i, v)| {
            format!(
                "n({}) = {}",
                label(&g.table.irreps[*i].label, ascii),
                v.text(nt(ascii))
            )
        })
        .collect();
    let mut s = format!(
        "not a representation of {}: {} (multiplicities must be whole numbers {} 0)",
        g.name(),
        bad.join(", "),
        if ascii { ">=" } else { "≥" }
    );
    for sg in &inv.suggestions {
        s.push_str(&format!(
            "\n  hint: {}({}) = {} instead of {} would give {}",
            if ascii { "chi" } else { "χ" },
            crate::analysis::class_label(&g.table.classes[sg.class], ascii),
            sg.to.text(nt(ascii)),
            sg.from.text(nt(ascii)),
            crate::rep::format_sum(g, &sg.multiplicities, !ascii)
        ));
    }
    s
}

/// Γ3N split into translations, rotations and vibrations, for a Cartesian set.
pub fn vibration_lines(a: &Analysis, s: &SetAnalysis, ascii: bool) -> Vec<String> {
    let g = &a.group;
    let sum = |m: &[u64]| crate::rep::format_sum(g, m, !ascii);
    match &s.vibrations {
        None => Vec::new(),
        Some(Err(e)) => vec![format!("no vibrational analysis: {e}")],
        Some(Ok(v)) => {
            let gm = if ascii { "Gamma" } else { "Γ" };
            vec![
                format!("If these are all the atoms: {gm}3N = {}", sum(&v.gamma_3n)),
                format!(
                    "  {gm}trans = {}, {gm}rot = {}",
                    sum(&v.translations),
                    sum(&v.rotations)
                ),
                format!("  {gm}vib = {}  ({} modes)", sum(&v.vibrations), v.n_modes),
            ]
        }
    }
}

fn missing(a: &Analysis) -> Vec<(&'static str, &'static str)> {
    let mut v = Vec::new();
    for (name, l) in [
        ("Geometry", &a.layers.geometry),
        ("SALCs", &a.layers.salc),
        ("Spectra", &a.layers.spectra),
    ] {
        if let LayerStatus::Missing(m) = l {
            v.push((name, *m));
        }
    }
    v
}

fn band_rows(bands: &[Band]) -> Vec<Vec<String>> {
    let mut rows = vec![vec![
        "cm-1".to_string(),
        "technique".into(),
        "intensity".into(),
        "polarization".into(),
        "note".into(),
    ]];
    for b in bands {
        rows.push(vec![
            format!("{}", b.position),
            b.technique.name().into(),
            b.intensity.clone(),
            b.polarization.map(|p| p.name()).unwrap_or("").into(),
            b.note.clone(),
        ]);
    }
    rows
}

fn text(s: &Session, a: &Result<Analysis, Error>, ascii: bool) -> String {
    let mut o = String::new();
    let title = if s.title.is_empty() {
        "salcdesk session"
    } else {
        &s.title
    };
    o.push_str(&format!(
        "{title}\n{}\n\n",
        "=".repeat(title.chars().count())
    ));
    let a = match a {
        Ok(a) => a,
        Err(e) => {
            o.push_str(&format!("No analysis: {e}\n"));
            return o;
        }
    };
    o.push_str(&table::render(&a.group, Format::Text, ascii));
    if !s.orientation.is_empty() {
        o.push_str(&format!("This molecule: {}\n", s.orientation));
    }
    for set in &a.sets {
        o.push_str(&format!(
            "\n{} ({}, {} members)\n",
            set.name,
            set.kind.name(),
            set.members.len()
        ));
        o.push_str(&super::grid::render(&set_rows(a, set, ascii), ascii));
        if let Outcome::Finite { reduction: r, .. } = &*set.outcome {
            for l in reduction::worked_lines(&a.group, r, nt(ascii)) {
                o.push_str(&l);
                o.push('\n');
            }
        }
        o.push_str(&set_result(a, set, ascii));
        o.push('\n');
        for l in vibration_lines(a, set, ascii) {
            o.push_str(&l);
            o.push('\n');
        }
        if let Some(Ok(m)) = &set.modes {
            o.push('\n');
            o.push_str(&super::spectra::modes(m, Format::Text, ascii));
        }
    }
    o.push_str(&super::molecule::render(a, Format::Text, ascii));
    o.push_str(&super::vibrations::session_section(a, false, ascii));
    for (name, m) in missing(a) {
        o.push_str(&format!("\n{name}: {m}.\n"));
    }
    if !s.bands.is_empty() {
        o.push_str("\nObserved bands\n");
        o.push_str(&super::grid::render(&band_rows(&s.bands), ascii));
    }
    if !s.notes.trim().is_empty() {
        o.push_str(&format!("\nNotes\n{}\n", s.notes.trim_end()));
    }
    o
}

fn md_table(rows: &[Vec<String>]) -> String {
    super::grid::markdown(rows)
}

fn markdown(s: &Session, a: &Result<Analysis, Error>, ascii: bool) -> String {
    let mut o = String::new();
    let title = if s.title.is_empty() {
        "salcdesk session"
    } else {
        &s.title
    };
    o.push_str(&format!("# {title}\n\n"));
    let a = match a {
        Ok(a) => a,
        Err(e) => {
            o.push_str(&format!("No analysis: {e}\n"));
            return o;
        }
    };
    o.push_str(&format!(
        "## Point group {}\n\n",
        if ascii {
            a.group.name()
        } else {
            &a.group.table.symbol
        }
    ));
    o.push_str(&table::markdown_body(&a.group, nt(ascii), ascii));
    if !s.orientation.is_empty() {
        o.push_str(&format!("\nThis molecule: {}\n", s.orientation));
    }
    for set in &a.sets {
        o.push_str(&format!(
            "\n## {} ({}, {} members)\n\n",
            set.name,
            set.kind.name(),
            set.members.len()
        ));
        o.push_str(&md_table(&set_rows(a, set, ascii)));
        o.push('\n');
        if let Outcome::Finite { reduction: r, .. } = &*set.outcome {
            for l in reduction::worked_lines(&a.group, r, nt(ascii)) {
                o.push_str(&format!("- {l}\n"));
            }
            o.push('\n');
        }
        o.push_str(&format!(
            "**{}**\n",
            set_result(a, set, ascii).replace('\n', "  \n")
        ));
    }
    o.push_str(&super::molecule::render(a, Format::Markdown, ascii));
    o.push_str(&super::vibrations::session_section(a, true, ascii));
    for (name, m) in missing(a) {
        o.push_str(&format!("\n## {name}\n\n{m}.\n"));
    }
    if !s.bands.is_empty() {
        o.push_str("\n## Observed bands\n\n");
        o.push_str(&md_table(&band_rows(&s.bands)));
    }
    if !s.notes.trim().is_empty() {
        o.push_str(&format!("\n## Notes\n\n{}\n", s.notes.trim_end()));
    }
    o
}

/// Escape text for LaTeX (see [`super::latex::escape`]).
pub fn latex_escape(s: &str) -> String {
    super::latex::escape(s)
}

/// The unmoved-count/χ table of a set as LaTeX cells: classes and numbers in math mode.
fn latex_set_rows(a: &Analysis, set: &SetAnalysis) -> Vec<Vec<String>> {
    let rows = set_rows(a, set, true);
    let mut head = vec![String::new()];
    head.extend(
        a.group
            .table
            .classes
            .iter()
            .map(|c| format!("${}$", table::latex_class(&c.ascii))),
    );
    let mut out = vec![head];
    for r in &rows[1..] {
        let mut row = vec![latex_escape(&r[0])];
        if r[0] == "chi" {
            row[0] = "$\\chi$".into();
        }
        row.extend(r[1..].iter().map(|c| format!("${}$", table::latex_text(c))));
        out.push(row);
    }
    out
}

fn latex(s: &Session, a: &Result<Analysis, Error>) -> String {
    use super::latex::{inline, tabular};
    let mut o = String::from(
        "\\documentclass[11pt]{article}\n\\usepackage[T1]{fontenc}\n\\usepackage[utf8]{inputenc}\n\
         \\usepackage{amsmath}\n\\usepackage{booktabs}\n\\usepackage[margin=2cm,landscape]{geometry}\n\
         \\begin{document}\n",
    );
    let title = if s.title.is_empty() {
        "salcdesk session"
    } else {
        &s.title
    };
    o.push_str(&format!("\\section*{{{}}}\n", latex_escape(title)));
    match a {
        Err(e) => o.push_str(&format!("No analysis: {}\n", latex_escape(&e.to_string()))),
        Ok(a) => {
            o.push_str(&format!(
                "\\subsection*{{Point group ${}$}}\n",
                super::latex::group_math(&a.group.table.name)
            ));
            o.push_str("\\begin{center}\n");
            o.push_str(&table::render(&a.group, Format::Latex, true));
            o.push_str("\\end{center}\n");
            o.push_str(&format!(
                "\\noindent Axes: {}\n\n",
                inline(a.group.table.orientation.trim())
            ));
            if !s.orientation.is_empty() {
                o.push_str(&format!(
                    "\\noindent This molecule: {}\n\n",
                    super::latex::inline(&s.orientation)
                ));
            }
            for set in &a.sets {
                o.push_str(&format!(
                    "\\subsection*{{{} ({}, {} members)}}\n",
                    latex_escape(&set.name),
                    set.kind.name(),
                    set.members.len()
                ));
                o.push_str(&tabular(&latex_set_rows(a, set)));
                match &*set.outcome {
                    Outcome::Finite { reduction: r, .. } => {
                        o.push_str(&reduction::render(&a.group, r, Format::Latex, true));
                        let res = match r.multiplicities() {
                            Ok(m) => format!("$\\Gamma = {}$", latex_sum(a, &m)),
                            Err(_) => inline(&set_result(a, set, false)),
                        };
                        o.push_str(&format!("\\noindent {res}\n\n"));
                    }
                    _ => o.push_str(&format!("{}\n\n", inline(&set_result(a, set, false)))),
                }
                for l in vibration_lines(a, set, false) {
                    o.push_str(&format!("\\noindent {}\n\n", inline(l.trim_start())));
                }
                if let Some(Ok(m)) = &set.modes {
                    o.push_str(&super::spectra::modes(m, Format::Latex, false));
                }
            }
            o.push_str(&super::molecule::render(a, Format::Latex, false));
            // Normal modes: the same Markdown section as the Markdown report, typeset.
            let vib = super::vibrations::session_section(a, true, false);
            if !vib.trim().is_empty() {
                o.push_str(&super::latex::from_markdown(&vib));
            }
            for (name, m) in missing(a) {
                o.push_str(&format!("\\subsection*{{{name}}}\n{}.\n", latex_escape(m)));
            }
        }
    }
    if !s.bands.is_empty() {
        o.push_str("\\subsection*{Observed bands}\n");
        let rows = band_rows(&s.bands);
        let mut cells: Vec<Vec<String>> = vec![rows[0]
            .iter()
            .map(|h| {
                if h == "cm-1" {
                    "cm$^{-1}$".to_string()
                } else {
                    latex_escape(h)
                }
            })
            .collect()];
        cells.extend(
            rows[1..]
                .iter()
                .map(|r| r.iter().map(|c| latex_escape(c)).collect()),
        );
        o.push_str(&tabular(&cells));
    }
    if !s.notes.trim().is_empty() {
        o.push_str("\\subsection*{Notes}\n");
        for para in s.notes.trim().split("\n\n") {
            o.push_str(&super::latex::inline(para));
            o.push_str("\n\n");
        }
    }
    o.push_str("\\end{document}\n");
    o
}

fn latex_sum(a: &Analysis, m: &[u64]) -> String {
    let ascii = crate::rep::format_sum(&a.group, m, false);
    ascii
        .split(" + ")
        .map(|t| {
            let digits: String = t.chars().take_while(|c| c.is_ascii_digit()).collect();
            let label = &t[digits.len()..];
            // A leading number is a multiplicity unless the label itself starts with one
            // (1E/2E pairs are written by their real label here).
            format!("{digits}{}", table::latex_label(label))
        })
        .collect::<Vec<_>>()
        .join(" + ")
}

fn to_json(s: &Session, a: &Result<Analysis, Error>) -> Value {
    let bands: Vec<Value> = s
        .bands
        .iter()
        .map(|b| {
            json!({
                "position": b.position,
                "technique": b.technique.name(),
                "intensity": b.intensity,
                "polarization": b.polarization.map(|p| p.name()),
                "note": b.note,
            })
        })
        .collect();
    let mut out = json!({
        "title": s.title,
        "orientation": s.orientation,
        "notes": s.notes,
        "bands": bands,
    });
    match a {
        Err(e) => out["error"] = json!(e.to_string()),
        Ok(a) => {
            out["group"] = json!(a.group.name());
            out["table"] = table::to_json(&a.group);
            let sets: Vec<Value> = a
                .sets
                .iter()
                .map(|set| {
                    let red = match &*set.outcome {
                        Outcome::Finite { reduction: r, .. } => reduction::to_json(&a.group, r),
                        Outcome::Linear(Ok(lr)) => {
                            let mut mm = serde_json::Map::new();
                            for (i, n) in lr.multiplicities.iter().enumerate() {
                                mm.insert(a.group.table.irreps[i].label.clone(), json!(n));
                            }
                            json!({"multiplicities": mm, "valid": true, "via": lr.subgroup})
                        }
                        Outcome::Empty => json!(null),
                        Outcome::Linear(Err(e)) | Outcome::Failed(e) => {
                            json!({"valid": false, "error": e})
                        }
                    };
                    let ticks: Vec<Value> = set
                        .members
                        .iter()
                        .zip(&set.grid)
                        .map(|(m, row)| {
                            let classes: Vec<&str> = row
                                .iter()
                                .enumerate()
                                .filter(|(_, t)| **t)
                                .map(|(c, _)| a.group.table.classes[c].ascii.as_str())
                                .collect();
                            json!({"member": m, "unmoved_by": classes})
                        })
                        .collect();
                    let vib = match &set.vibrations {
                        Some(Ok(v)) => {
                            let f = |m: &[u64]| crate::rep::format_sum(&a.group, m, false);
                            json!({
                                "gamma_3n": f(&v.gamma_3n),
                                "translations": f(&v.translations),
                                "rotations": f(&v.rotations),
                                "vibrations": f(&v.vibrations),
                                "modes": v.n_modes,
                            })
                        }
                        Some(Err(e)) => json!({"error": e}),
                        None => json!(null),
                    };
                    let modes = match &set.modes {
                        Some(Ok(m)) => serde_json::to_value(m).unwrap_or(Value::Null),
                        Some(Err(e)) => json!({"error": e}),
                        None => Value::Null,
                    };
                    json!({
                        "activity": modes,
                        "vibrations": vib,
                        "name": set.name,
                        "kind": set.kind.name(),
                        "members": ticks,
                        "unmoved": set.unmoved,
                        "reduction": red,
                    })
                })
                .collect();
            out["sets"] = json!(sets);
            if let Some(v) = super::vibrations::session_json(a) {
                out["vibrations"] = v;
            }
            if let Value::Object(extra) = super::molecule::to_json(a) {
                for (k, v) in extra {
                    out[k.as_str()] = v;
                }
            }
            let miss: Vec<Value> = missing(a)
                .iter()
                .map(|(n, m)| json!({"layer": n, "status": "not in this build", "note": m}))
                .collect();
            out["missing_layers"] = json!(miss);
        }
    }
    out
}

/// Unicode form of a label (re-exported for faces that build their own lines).
pub fn label(l: &str, ascii: bool) -> String {
    if ascii {
        l.to_string()
    } else {
        display_label(l)
    }
}

/// The tables of the LaTeX report alone, for `\input` into a document of one's own (which
/// loads `booktabs`); each table follows a comment naming the heading it stood under.
pub fn latex_fragment(s: &Session, a: &Result<Analysis, Error>) -> String {
    super::latex::tables_only(&latex(s, a))
}
