//! Plain-text / Markdown rendering of the spectroscopy reports, for the CLI and the TUI.
//! Tables are Markdown pipe tables, readable as plain text.

use super::activity::ModesReport;
use super::check::BandCheck;
use super::combos::CombinationsReport;
use super::descent::DescentReport;
use std::fmt::Write;

fn yn(b: bool) -> &'static str {
    if b {
        "yes"
    } else {
        "—"
    }
}

/// Activity table and band counts.
pub fn modes_markdown(r: &ModesReport) -> String {
    let mut s = String::new();
    let _ = writeln!(
        s,
        "Γ = {}   ({} modes, {})\n",
        r.gamma, r.n_modes, r.point_group
    );
    let _ = writeln!(s, "| irrep | n | dim | IR | Raman | polarized |");
    let _ = writeln!(s, "|---|---|---|---|---|---|");
    for m in &r.modes {
        let ir = if m.ir {
            m.ir_components.join(", ")
        } else {
            "—".into()
        };
        let _ = writeln!(
            s,
            "| {} | {} | {} | {} | {} | {} |",
            m.irrep,
            m.multiplicity,
            m.dimension,
            ir,
            yn(m.raman),
            if m.raman { yn(m.polarized) } else { "" }
        );
    }
    let _ = writeln!(
        s,
        "\nIR bands: {}   Raman bands: {}   coincident: {}   silent: {}",
        r.ir_bands, r.raman_bands, r.coincident_bands, r.silent_fundamentals
    );
    if let Some(m) = &r.mutual_exclusion {
        let _ = writeln!(s, "{m}");
    }
    s
}

/// Overtone and combination list.
pub fn combinations_markdown(r: &CombinationsReport) -> String {
    let mut s = String::new();
    let funds: Vec<String> = r
        .fundamentals
        .iter()
        .map(|f| {
            let pos = f.position_cm.map(|p| format!(" {p}")).unwrap_or_default();
            format!("{} = {}{pos}", f.name.as_deref().unwrap_or("?"), f.irrep)
        })
        .collect();
    let _ = writeln!(s, "Fundamentals: {}\n", funds.join(", "));
    let _ = writeln!(s, "| level | harmonic / cm⁻¹ | symmetry | IR | Raman |");
    let _ = writeln!(s, "|---|---|---|---|---|");
    for l in &r.levels {
        let pos = l.harmonic_cm.map(|p| format!("{p:.0}")).unwrap_or_default();
        let _ = writeln!(
            s,
            "| {} | {} | {} | {} | {} |",
            l.label,
            pos,
            l.symmetry.text,
            yn(l.ir),
            if l.polarized {
                "yes (p possible)"
            } else {
                yn(l.raman)
            }
        );
    }
    let _ = writeln!(s, "\n{}\n{}", r.note, r.numbering);
    s
}

/// Band check.
pub fn check_markdown(r: &BandCheck) -> String {
    let mut s = String::new();
    let _ = writeln!(s, "{}: Γ = {}\n", r.point_group, r.gamma);
    for c in &r.counts {
        let _ = writeln!(
            s,
            "{}: {} observed, {} predicted — {}",
            c.what, c.observed, c.predicted, c.remark
        );
    }
    let _ = writeln!(s, "\n| # | cm⁻¹ | technique | remarks |");
    let _ = writeln!(s, "|---|---|---|---|");
    for v in &r.bands {
        let pol = match v.band.polarization {
            Some(super::bands::Polarization::P) => " (p)",
            Some(super::bands::Polarization::Dp) => " (dp)",
            None => "",
        };
        let _ = writeln!(
            s,
            "| {} | {} | {}{} | {} |",
            v.index + 1,
            v.band.position_cm,
            v.band.technique.name(),
            pol,
            v.remarks.join("; ")
        );
    }
    if !r.conflicts.is_empty() {
        let _ = writeln!(s, "\nConflicts:");
        for c in &r.conflicts {
            let _ = writeln!(s, "- {}", c.message);
        }
    }
    s
}

/// Correlation table(s), one per embedding.
pub fn descent_markdown(r: &DescentReport) -> String {
    let mut s = String::new();
    for (k, e) in r.embeddings.iter().enumerate() {
        let _ = write!(s, "{} → {}", r.group, r.subgroup);
        if let Some(d) = &e.description {
            let _ = write!(s, "  (embedding {}: {d}", k + 1);
            if !e.contains.is_empty() {
                let _ = write!(s, "; contains {}", e.contains.join(", "));
            }
            s.push(')');
        } else if r.embeddings.len() > 1 || !e.contains.is_empty() {
            let _ = write!(
                s,
                "  (embedding {}: contains {}",
                k + 1,
                e.contains.join(", ")
            );
            let _ = write!(s, "; {} conjugate subgroup(s))", e.conjugates);
        }
        let _ = writeln!(s, "\n");
        if !e.class_map.is_empty() {
            let map: Vec<String> = e
                .class_map
                .iter()
                .map(|l| format!("{} ← {}", l.subgroup_class, l.group_class))
                .collect();
            let _ = writeln!(s, "classes: {}\n", map.join(", "));
        }
        let _ = writeln!(s, "| {} | {} |", r.group, r.subgroup);
        let _ = writeln!(s, "|---|---|");
        for c in &e.correlation {
            let _ = writeln!(s, "| {} | {} |", c.irrep, c.becomes.text);
        }
        if let Some(m) = &e.subgroup_modes {
            let _ = writeln!(s, "\nIn {}:\n", r.subgroup);
            s.push_str(&modes_markdown(m));
        }
        s.push('\n');
    }
    let _ = writeln!(s, "{}", r.note);
    s
}
