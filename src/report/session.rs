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
            o.push_str(&crate::spectra::render::modes_markdown(m));
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

fn md_row(cells: &[String]) -> String {
    format!(
        "| {} |\n",
        cells
            .iter()
            .map(|c| c.replace('|', "\\|"))
            .collect::<Vec<_>>()
            .join(" | ")
    )
}

fn md_table(rows: &[Vec<String>]) -> String {
    let mut o = String::new();
    if let Some(h) = rows.first() {
        o.push_str(&md_row(h));
        o.push_str(&format!("|{}\n", "---|".repeat(h.len())));
        for r in &rows[1..] {
            o.push_str(&md_row(r));
        }
    }
    o
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
    o.push_str(&table::render(&a.group, Format::Markdown, ascii));
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

/// Escape text for LaTeX, spelling out the non-ASCII characters sessions commonly hold.
pub fn latex_escape(s: &str) -> String {
    let mut o = String::new();
    for c in s.chars() {
        match c {
            '\\' => o.push_str("\\textbackslash{}"),
            '{' | '}' | '$' | '&' | '#' | '_' | '%' => {
                o.push('\\');
                o.push(c);
            }
            '^' => o.push_str("\\^{}"),
            '~' => o.push_str("\\~{}"),
            '–' => o.push_str("--"),
            '—' => o.push_str("---"),
            '′' => o.push('\''),
            '″' => o.push_str("''"),
            '×' => o.push_str("$\\times$"),
            '·' => o.push_str("$\\cdot$"),
            'Å' => o.push_str("\\AA{}"),
            '⁻' => o.push_str("$^{-}$"),
            '¹' => o.push_str("$^{1}$"),
            '²' => o.push_str("$^{2}$"),
            '³' => o.push_str("$^{3}$"),
            '₀'..='₉' => o.push_str(&format!("$_{}$", c as u32 - '₀' as u32)),
            'σ' => o.push_str("$\\sigma$"),
            'π' => o.push_str("$\\pi$"),
            'χ' => o.push_str("$\\chi$"),
            'Γ' => o.push_str("$\\Gamma$"),
            'ν' => o.push_str("$\\nu$"),
            'ᵥ' => o.push_str("$_v$"),
            'ₕ' => o.push_str("$_h$"),
            'ᵈ' => o.push_str("$_d$"),
            c if c.is_ascii() => o.push(c),
            _ => o.push('?'),
        }
    }
    o
}

fn latex_table(rows: &[Vec<String>], math: bool) -> String {
    let n = rows.first().map(|r| r.len()).unwrap_or(0);
    let cell = |c: &String, k: usize| {
        if math && k > 0 {
            format!("${}$", table::latex_text(c))
        } else {
            latex_escape(c)
        }
    };
    let mut o = format!(
        "\\begin{{tabular}}{{l{}}}\n\\toprule\n",
        "c".repeat(n.saturating_sub(1))
    );
    for (i, r) in rows.iter().enumerate() {
        let cells: Vec<String> = r
            .iter()
            .enumerate()
            .map(|(k, c)| if i == 0 { latex_escape(c) } else { cell(c, k) })
            .collect();
        o.push_str(&cells.join(" & "));
        o.push_str(" \\\\\n");
        if i == 0 {
            o.push_str("\\midrule\n");
        }
    }
    o.push_str("\\bottomrule\n\\end{tabular}\n");
    o
}

fn latex(s: &Session, a: &Result<Analysis, Error>) -> String {
    let mut o = String::from(
        "\\documentclass[11pt]{article}\n\\usepackage[T1]{fontenc}\n\\usepackage{amsmath}\n\
         \\usepackage{booktabs}\n\\usepackage[margin=2cm,landscape]{geometry}\n\
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
                table::latex_label(&a.group.table.name)
            ));
            o.push_str("\\begin{center}\n");
            o.push_str(&table::render(&a.group, Format::Latex, true));
            o.push_str("\\end{center}\n");
            o.push_str(&format!(
                "\\noindent Axes: {}\n\n",
                latex_escape(a.group.table.orientation.trim())
            ));
            if !s.orientation.is_empty() {
                o.push_str(&format!(
                    "\\noindent This molecule: {}\n\n",
                    latex_escape(&s.orientation)
                ));
            }
            for set in &a.sets {
                o.push_str(&format!(
                    "\\subsection*{{{} ({}, {} members)}}\n",
                    latex_escape(&set.name),
                    set.kind.name(),
                    set.members.len()
                ));
                let mut rows = set_rows(a, set, true);
                rows[0][0] = String::new();
                o.push_str("\\begin{center}\n");
                o.push_str(&latex_table(&rows, true));
                o.push_str("\\end{center}\n");
                match &*set.outcome {
                    Outcome::Finite { reduction: r, .. } => {
                        o.push_str(&reduction::render(&a.group, r, Format::Latex, true));
                        let res = match r.multiplicities() {
                            Ok(m) => format!("$\\Gamma = {}$", latex_sum(a, &m)),
                            Err(_) => latex_escape(&set_result(a, set, true)),
                        };
                        o.push_str(&format!("\\noindent {res}\n\n"));
                    }
                    _ => o.push_str(&format!("{}\n\n", latex_escape(&set_result(a, set, true)))),
                }
                for l in vibration_lines(a, set, true) {
                    o.push_str(&format!("\\noindent {}\n\n", latex_escape(l.trim_start())));
                }
                if let Some(Ok(m)) = &set.modes {
                    let act: Vec<String> = m
                        .modes
                        .iter()
                        .map(|l| {
                            let what = match (l.ir, l.raman) {
                                (true, true) => "IR, Raman",
                                (true, false) => "IR",
                                (false, true) => "Raman",
                                _ => "silent",
                            };
                            let pol = if l.raman && l.polarized { ", p" } else { "" };
                            format!("{} {} ({what}{pol})", l.multiplicity, l.irrep)
                        })
                        .collect();
                    o.push_str(&format!(
                        "\\noindent Activity: {}. IR bands: {}; Raman bands: {}; coincident: {}; silent: {}.\n\n",
                        latex_escape(&act.join("; ")),
                        m.ir_bands,
                        m.raman_bands,
                        m.coincident_bands,
                        m.silent_fundamentals
                    ));
                }
            }
            o.push_str(&super::molecule::render(a, Format::Latex, true));
            for (name, m) in missing(a) {
                o.push_str(&format!("\\subsection*{{{name}}}\n{}.\n", latex_escape(m)));
            }
        }
    }
    if !s.bands.is_empty() {
        o.push_str("\\subsection*{Observed bands}\n\\begin{center}\n");
        let mut rows = band_rows(&s.bands);
        rows[0][0] = "cm^-1".into();
        o.push_str(&latex_table(&rows, false));
        o.push_str("\\end{center}\n");
    }
    if !s.notes.trim().is_empty() {
        o.push_str("\\subsection*{Notes}\n");
        for para in s.notes.trim().split("\n\n") {
            o.push_str(&latex_escape(para));
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
