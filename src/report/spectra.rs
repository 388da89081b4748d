//! The spectroscopy reports (activity and band counts, overtones and combinations, the band-list
//! check, descent in symmetry) as aligned text columns, Markdown tables or LaTeX. One set of
//! rows per report; the format only decides how the rows are drawn.

use super::{grid, Format};
use crate::spectra::{BandCheck, CombinationsReport, DescentReport, ModesReport};

fn yn(b: bool) -> &'static str {
    if b {
        "yes"
    } else {
        "—"
    }
}

/// Rows as a table of the format (first row the header).
pub fn table(rows: &[Vec<String>], format: Format, ascii: bool) -> String {
    match format {
        Format::Markdown => grid::markdown(rows),
        Format::Latex => super::latex::from_markdown(&grid::markdown(rows)),
        _ => grid::render(rows, ascii),
    }
}

/// Text after a table or between tables: a blank line, then the line.
fn line(format: Format, s: &str) -> String {
    match format {
        Format::Latex => super::latex::inline(s) + "\n\n",
        // A hard line break, so that consecutive lines stay lines in a Markdown viewer.
        Format::Markdown => format!("{s}  \n"),
        _ => format!("{s}\n"),
    }
}

fn finish(s: String, format: Format, ascii: bool) -> String {
    if ascii && format != Format::Latex {
        super::ascii_prose(&s)
    } else {
        s
    }
}

fn display(label: &str, format: Format, ascii: bool) -> String {
    // Labels and sums arrive in ASCII spelling (A1', 2E''); the display form for Unicode.
    if ascii || format == Format::Latex {
        label.to_string()
    } else {
        label
            .split(" + ")
            .map(|t| {
                let d = t.chars().take_while(|c| c.is_ascii_digit()).count();
                let (n, l) = t.split_at(d);
                format!("{n}{}", crate::group::display_label(l))
            })
            .collect::<Vec<_>>()
            .join(" + ")
    }
}

/// Activity table and band counts.
pub fn modes(r: &ModesReport, format: Format, ascii: bool) -> String {
    let mut s = line(
        format,
        &format!(
            "Γ = {}   ({} modes, {})",
            display(&r.gamma, format, ascii),
            r.n_modes,
            r.point_group
        ),
    );
    s.push('\n');
    let mut rows = vec![vec![
        "irrep".to_string(),
        "n".into(),
        "dim".into(),
        "IR".into(),
        "Raman".into(),
        "polarized".into(),
    ]];
    for m in &r.modes {
        rows.push(vec![
            display(&m.irrep, format, ascii),
            m.multiplicity.to_string(),
            m.dimension.to_string(),
            if m.ir {
                m.ir_components.join(", ")
            } else {
                "—".into()
            },
            yn(m.raman).into(),
            if m.raman { yn(m.polarized) } else { "" }.into(),
        ]);
    }
    s.push_str(&table(&rows, format, ascii));
    s.push('\n');
    s.push_str(&line(
        format,
        &format!(
            "IR bands: {}   Raman bands: {}   coincident: {}   silent: {}",
            r.ir_bands, r.raman_bands, r.coincident_bands, r.silent_fundamentals
        ),
    ));
    if let Some(m) = &r.mutual_exclusion {
        s.push_str(&line(format, m));
    }
    finish(s, format, ascii)
}

/// Overtones and binary combinations.
pub fn combinations(r: &CombinationsReport, format: Format, ascii: bool) -> String {
    let mut rows = vec![vec![
        "level".to_string(),
        "harmonic / cm⁻¹".into(),
        "symmetry".into(),
        "IR".into(),
        "Raman".into(),
    ]];
    for l in &r.levels {
        rows.push(vec![
            l.label.clone(),
            l.harmonic_cm.map(|p| format!("{p:.0}")).unwrap_or_default(),
            display(&l.symmetry.text, format, ascii),
            yn(l.ir).into(),
            if l.polarized {
                "yes (p possible)"
            } else {
                yn(l.raman)
            }
            .into(),
        ]);
    }
    // The fundamentals with their customary numbers first, the numbering convention last.
    let funds: Vec<String> = r
        .fundamentals
        .iter()
        .map(|f| {
            let pos = f.position_cm.map(|p| format!(" {p}")).unwrap_or_default();
            let irrep = display(&f.irrep, format, ascii);
            format!("{} = {irrep}{pos}", f.name.as_deref().unwrap_or("?"))
        })
        .collect();
    let mut s = line(format, &format!("Fundamentals: {}", funds.join(", ")));
    s.push('\n');
    s.push_str(&table(&rows, format, ascii));
    s.push('\n');
    s.push_str(&line(format, &r.note));
    s.push_str(&line(format, &r.numbering));
    finish(s, format, ascii)
}

/// A class named in ASCII (`sh`, `2C4`) in the table's own symbol (σₕ, 2C₄) unless ASCII or
/// LaTeX output is asked for; a name the table does not know is kept as given.
fn class_display(group: &str, class: &str, format: Format, ascii: bool) -> String {
    if ascii || format == Format::Latex {
        return class.to_string();
    }
    crate::group::load(group)
        .ok()
        .and_then(|g| {
            g.table
                .classes
                .iter()
                .find(|c| c.ascii == class)
                .map(|c| c.symbol.clone())
        })
        .unwrap_or_else(|| class.to_string())
}

/// The band-list check.
pub fn check(r: &BandCheck, format: Format, ascii: bool) -> String {
    let mut s = line(
        format,
        &format!(
            "{}: Γ = {}",
            r.point_group,
            display(&r.gamma, format, ascii)
        ),
    );
    s.push('\n');
    for c in &r.counts {
        s.push_str(&line(
            format,
            &format!(
                "{}: {} observed, {} predicted — {}",
                c.what, c.observed, c.predicted, c.remark
            ),
        ));
    }
    s.push('\n');
    let mut rows = vec![vec![
        "#".to_string(),
        "cm⁻¹".into(),
        "technique".into(),
        "remarks".into(),
    ]];
    for v in &r.bands {
        let pol = match v.band.polarization {
            Some(crate::spectra::Polarization::P) => " (p)",
            Some(crate::spectra::Polarization::Dp) => " (dp)",
            None => "",
        };
        rows.push(vec![
            (v.index + 1).to_string(),
            v.band.position_cm.to_string(),
            format!("{}{pol}", v.band.technique.name()),
            v.remarks.join("; "),
        ]);
    }
    s.push_str(&table(&rows, format, ascii));
    if !r.conflicts.is_empty() {
        s.push('\n');
        s.push_str(&line(format, "Conflicts:"));
        match format {
            Format::Latex => {
                let items: String = r
                    .conflicts
                    .iter()
                    .map(|c| format!("- {}\n", c.message))
                    .collect();
                s.push_str(&super::latex::from_markdown(&items));
            }
            _ => {
                for c in &r.conflicts {
                    s.push_str(&format!("- {}\n", c.message));
                }
            }
        }
    }
    finish(s, format, ascii)
}

/// Correlation table(s), one per embedding, and the activity below when Γ was given.
pub fn descent(r: &DescentReport, format: Format, ascii: bool) -> String {
    let mut s = String::new();
    for (k, e) in r.embeddings.iter().enumerate() {
        let mut head = format!("{} → {}", r.group, r.subgroup);
        let contains: Vec<String> = e
            .contains
            .iter()
            .map(|c| class_display(&r.group, c, format, ascii))
            .collect();
        if let Some(d) = &e.description {
            // Linear groups: the embedding in the chemist's words (axis along or across).
            head.push_str(&format!("  (embedding {}: {d}", k + 1));
            if !contains.is_empty() {
                head.push_str(&format!("; contains {}", contains.join(", ")));
            }
            head.push(')');
        } else if r.embeddings.len() > 1 || !contains.is_empty() {
            head.push_str(&format!(
                "  (embedding {}: contains {}; {} conjugate subgroup(s))",
                k + 1,
                contains.join(", "),
                e.conjugates
            ));
        }
        s.push_str(&line(format, &head));
        s.push('\n');
        if !e.class_map.is_empty() {
            let map: Vec<String> = e
                .class_map
                .iter()
                .map(|l| {
                    format!(
                        "{} ← {}",
                        class_display(&r.subgroup, &l.subgroup_class, format, ascii),
                        class_display(&r.group, &l.group_class, format, ascii)
                    )
                })
                .collect();
            s.push_str(&line(format, &format!("classes: {}", map.join(", "))));
            s.push('\n');
        }
        let mut rows = vec![vec![r.group.clone(), r.subgroup.clone()]];
        for c in &e.correlation {
            rows.push(vec![
                display(&c.irrep, format, ascii),
                display(&c.becomes.text, format, ascii),
            ]);
        }
        s.push_str(&table(&rows, format, ascii));
        if let Some(m) = &e.subgroup_modes {
            s.push('\n');
            s.push_str(&line(format, &format!("In {}:", r.subgroup)));
            s.push('\n');
            s.push_str(&modes(m, format, ascii));
        }
        s.push('\n');
    }
    s.push_str(&line(format, &r.note));
    finish(s, format, ascii)
}
