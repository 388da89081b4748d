//! A set of SALCs as text, Markdown, LaTeX or JSON: members, Γ, then per irrep each SALC as a
//! normalization factor times a short combination with decimals alongside.

use super::build::{Role, Salc, SalcSet};
use super::coords::Matching;
use super::display::{coefficient_strings, combination, member_name, norm_factor, salc_text};
use super::project::Worked;
use crate::exact::{Cyclo, Notation};
use crate::group::display_label;
use crate::report::Format;
use rayon::prelude::*;
use serde_json::{json, Value};

/// What a rendering needs besides the SALCs.
pub struct View<'a> {
    pub set: &'a SalcSet,
    /// `stretch`, `cartesian`, …
    pub basis: &'a str,
    /// Site names per member (`C1–H2`), same order as members.
    pub sites: Vec<String>,
    /// Only this real irrep (index), if chosen.
    pub only: Option<usize>,
    pub central: Vec<Matching>,
    pub worked: Option<Worked>,
    pub notes: Vec<String>,
}

fn role_name(r: Role) -> &'static str {
    match r {
        Role::Plain => "",
        Role::Translation => "translation",
        Role::Rotation => "rotation",
        Role::Redundant => "redundant",
    }
}

fn label(l: &str, nt: Notation) -> String {
    if nt == Notation::Unicode {
        display_label(l)
    } else {
        l.to_string()
    }
}

fn decimals(v: &[f64], members: &[String]) -> String {
    v.iter()
        .zip(members)
        .filter(|(x, _)| x.abs() > 1e-12)
        .map(|(x, m)| format!("{x:+.4}·{m}"))
        .collect::<Vec<_>>()
        .join(" ")
}

/// Render in the chosen format.
pub fn render(v: &View, format: Format, ascii: bool) -> String {
    let nt = if ascii {
        Notation::Ascii
    } else {
        Notation::Unicode
    };
    match format {
        Format::Json => serde_json::to_string_pretty(&to_json(v)).unwrap_or_default() + "\n",
        Format::Text => text(v, nt, false),
        Format::Markdown => text(v, nt, true),
        Format::Latex => latex(v),
    }
}

fn gamma(v: &View, nt: Notation) -> String {
    let parts: Vec<String> = v
        .set
        .irreps
        .iter()
        .zip(&v.set.multiplicities)
        .filter(|(_, m)| **m > 0)
        .map(|(ir, m)| {
            let l = label(&ir.label, nt);
            if *m == 1 {
                l
            } else {
                format!("{m}{l}")
            }
        })
        .collect();
    parts.join(" + ")
}

fn text(v: &View, nt: Notation, md: bool) -> String {
    let set = v.set;
    let g = if nt == Notation::Unicode {
        set.group.table.symbol.clone()
    } else {
        set.group.name().to_string()
    };
    let names: Vec<String> = set.members.iter().map(|m| member_name(m, nt)).collect();
    let mut out = String::new();
    let h = if md { "## " } else { "" };
    out += &format!(
        "{h}SALCs of the {} basis in {g} ({} members)\n\n",
        v.basis,
        set.members.len()
    );
    out += "Members: ";
    out += &names
        .iter()
        .zip(&v.sites)
        .map(|(n, s)| format!("{n} = {s}"))
        .collect::<Vec<_>>()
        .join(", ");
    out += &format!("\n\nΓ = {}\n", gamma(v, nt));
    if let Some(w) = &v.worked {
        out += &worked_text(w, &names, nt, md);
    }
    for (x, ir) in set.irreps.iter().enumerate() {
        if set.multiplicities[x] == 0 || v.only.is_some_and(|o| o != x) {
            continue;
        }
        out += &format!("\n{h}{}", label(&ir.label, nt));
        if let Some(m) = v.central.iter().find(|m| m.irrep == x) {
            if !m.central.is_empty() {
                out += &format!("   (central atom: {})", m.central.join(", "));
            }
        }
        out += "\n";
        let lines: Vec<(&Salc, String)> = set
            .salcs
            .par_iter()
            .filter(|s| s.irrep == x)
            .map(|s| (s, salc_text(s, &set.members, nt)))
            .collect();
        for (s, line) in lines {
            let tag = role_name(s.role);
            let tag = if tag.is_empty() {
                String::new()
            } else {
                format!(" [{tag}]")
            };
            let which = if ir.dim > 1 || set.multiplicities[x] > 1 {
                format!("({}.{}) ", s.copy, s.partner)
            } else {
                String::new()
            };
            if md {
                out += &format!("- {which}`{line}`{tag}\n");
            } else {
                out += &format!("  {which}{line}{tag}\n");
                out += &format!("      ≈ {}\n", decimals(&s.floats(), &names));
            }
        }
    }
    let notes: Vec<&String> = set.notes.iter().chain(&v.notes).collect();
    if !notes.is_empty() {
        out += "\nNotes:\n";
        for n in notes {
            out += &format!("  - {n}\n");
        }
    }
    if nt == Notation::Ascii {
        out = out
            .replace('Γ', "Gamma")
            .replace('≈', "~")
            .replace('·', "*")
            .replace('–', "-");
    }
    out
}

/// The worked projection as lines: a heading, one line per operation (image and χ), the sum.
pub fn worked_lines(w: &Worked, names: &[String], nt: Notation) -> Vec<String> {
    worked_text(w, names, nt, false)
        .lines()
        .filter(|l| !l.is_empty())
        .map(str::to_string)
        .collect()
}

fn worked_text(w: &Worked, names: &[String], nt: Notation, md: bool) -> String {
    let mut out = format!(
        "\nWorked projection of {} onto {} (Σ χ(R)·R{}):\n",
        names[w.member],
        label(&w.irrep, nt),
        names[w.member]
    );
    for l in &w.lines {
        let img = column_text(&l.image, names, nt);
        let line = format!("{:>10} → {:<24} χ = {}", l.operation, img, l.chi.text(nt));
        out += &if md {
            format!("    {line}\n")
        } else {
            format!("  {line}\n")
        };
    }
    let sum: Vec<(usize, Cyclo)> = w
        .sum
        .iter()
        .enumerate()
        .filter(|(_, c)| !c.is_zero())
        .map(|(k, c)| (k, c.clone()))
        .collect();
    out += &format!("  sum: {}\n", column_text(&sum, names, nt));
    out
}

/// A combination of members as text (`r₁ − r₂`, `0`), as in the worked projection.
pub fn column_text(col: &[(usize, Cyclo)], names: &[String], nt: Notation) -> String {
    if col.is_empty() {
        return "0".into();
    }
    col.iter()
        .enumerate()
        .map(|(i, (k, c))| {
            let t = c.text(nt);
            let (sign, mag) = if c.is_real() && c.signum_real() < 0 {
                ("−", (-c.clone()).text(nt))
            } else {
                ("+", t)
            };
            let coef = if mag == "1" {
                String::new()
            } else if mag.contains(['+', '-', '−', '/']) {
                format!("({mag})")
            } else {
                mag
            };
            let sign = if nt == Notation::Ascii && sign == "−" {
                "-"
            } else {
                sign
            };
            if i == 0 {
                format!("{}{coef}{}", if sign == "+" { "" } else { sign }, names[*k])
            } else {
                format!(" {sign} {coef}{}", names[*k])
            }
        })
        .collect()
}

fn latex(v: &View) -> String {
    let set = v.set;
    let names: Vec<String> = set
        .members
        .iter()
        .map(|m| {
            let n = member_name(m, Notation::Ascii);
            let split = n.find(|c: char| c.is_ascii_digit()).unwrap_or(n.len());
            let (stem, rest) = n.split_at(split);
            let stem = match stem {
                "theta" => "\\theta",
                "sigma" => "\\sigma",
                "pi" => "\\pi",
                s => s,
            };
            let digits: String = rest.chars().take_while(|c| c.is_ascii_digit()).collect();
            let tail: String = rest.chars().skip(digits.len()).collect();
            format!("{stem}_{{{digits}{tail}}}")
        })
        .collect();
    let mut out = String::from("\\begin{align*}\n");
    for (x, ir) in set.irreps.iter().enumerate() {
        if set.multiplicities[x] == 0 || v.only.is_some_and(|o| o != x) {
            continue;
        }
        for s in set.salcs.iter().filter(|s| s.irrep == x) {
            let f = norm_factor(&s.norm2, Notation::Ascii);
            let f = latex_factor(&f);
            let mut comb = combination(s, &set.members, Notation::Ascii);
            for (m, n) in set.members.iter().zip(&names).rev() {
                comb = comb.replace(&member_name(m, Notation::Ascii), n);
            }
            out += &format!(
                "  {}&: {f}\\left({}\\right) \\\\\n",
                crate::report::table::latex_label(&ir.label),
                comb.replace('*', "")
            );
        }
    }
    out += "\\end{align*}\n";
    out
}

fn latex_factor(f: &str) -> String {
    if f.is_empty() {
        return String::new();
    }
    if let Some(n) = f.strip_prefix("1/sqrt(").and_then(|r| r.strip_suffix(')')) {
        return format!("\\frac{{1}}{{\\sqrt{{{n}}}}}");
    }
    if let Some(n) = f.strip_prefix("1/") {
        return format!("\\frac{{1}}{{{n}}}");
    }
    f.to_string()
}

fn to_json(v: &View) -> Value {
    let set = v.set;
    let members: Vec<Value> = set
        .members
        .iter()
        .map(|m| {
            let mut o = json!({
                "name": member_name(m, Notation::Ascii),
                "atoms": m.atoms.iter().map(|a| a + 1).collect::<Vec<_>>(),
            });
            if let Some(ax) = &m.axis {
                o["axis"] = json!(ax);
            }
            o
        })
        .collect();
    // the exact strings of thousands of coefficients are the slow part: SALCs side by side
    let shown: Vec<&Salc> = set
        .salcs
        .iter()
        .filter(|s| v.only.is_none_or(|o| o == s.irrep))
        .collect();
    let salcs: Vec<Value> = shown
        .par_iter()
        .map(|s| {
            let mut o = json!({
                "irrep": s.label,
                "copy": s.copy,
                "partner": s.partner,
                "coefficients": coefficient_strings(s),
                "coefficients_float": s.floats(),
            });
            if s.role != Role::Plain {
                o["role"] = json!(role_name(s.role));
            }
            o
        })
        .collect();
    let notes: Vec<&String> = set.notes.iter().chain(&v.notes).collect();
    json!({
        "point_group": set.group.name(),
        "basis": v.basis,
        "members": members,
        "salcs": salcs,
        "notes": notes,
    })
}
