//! Character tables rendered as plain text, Markdown, LaTeX and JSON.
//!
//! The JSON shape is a stable interface for other tools (documented in README):
//! `{"group", "order", "classes": [{"symbol", "size", "representative", "elements"}],
//!   "irreps": [{"label", "characters", "characters_float", "functions"}]}`.

use super::{grid, Format};
use crate::exact::{Cyclo, Notation};
use crate::group::{CharacterTable, PointGroup};
use serde_json::{json, Value};

/// Function texts of an irrep, linear first.
fn functions(t: &CharacterTable, i: usize, ascii: bool) -> Vec<String> {
    t.irreps[i]
        .functions
        .all()
        .map(|f| {
            if ascii {
                f.text.clone()
            } else {
                pretty_function(&f.text)
            }
        })
        .collect()
}

/// `x^2-y^2` → `x²−y²`, `Rx` → `Rₓ` is left alone (Rx is customary).
pub fn pretty_function(s: &str) -> String {
    s.replace("^2", "²").replace("^3", "³").replace('-', "−")
}

fn char_text(g: &PointGroup, i: usize, c: usize, nt: Notation) -> String {
    let ir = &g.table.irreps[i];
    match ir.chars.get(c) {
        Some(v) => v.text(nt),
        None => {
            let t = ir.char_text[c].clone();
            match nt {
                Notation::Unicode => t.replace("phi", "φ").replace('-', "−"),
                Notation::Ascii => t,
            }
        }
    }
}

/// Render a group's character table.
pub fn render(g: &PointGroup, format: Format, ascii: bool) -> String {
    let nt = if ascii {
        Notation::Ascii
    } else {
        Notation::Unicode
    };
    match format {
        Format::Json => serde_json::to_string_pretty(&to_json(g)).unwrap_or_default() + "\n",
        Format::Text => text(g, nt, ascii),
        Format::Markdown => markdown(g, nt, ascii),
        Format::Latex => latex(g),
    }
}

fn header(g: &PointGroup, ascii: bool) -> Vec<String> {
    let t = &g.table;
    let mut h = vec![if ascii {
        t.name.clone()
    } else {
        t.symbol.clone()
    }];
    for c in &t.classes {
        h.push(if ascii {
            c.ascii.clone()
        } else {
            c.symbol.clone()
        });
    }
    h.push("functions".into());
    h
}

fn label(g: &PointGroup, i: usize, ascii: bool) -> String {
    let ir = &g.table.irreps[i];
    if ascii {
        ir.label.clone()
    } else {
        ir.display()
    }
}

fn text(g: &PointGroup, nt: Notation, ascii: bool) -> String {
    let t = &g.table;
    let mut rows = vec![header(g, ascii)];
    for i in 0..t.irreps.len() {
        let mut r = vec![label(g, i, ascii)];
        for c in 0..t.classes.len() {
            r.push(char_text(g, i, c, nt));
        }
        r.push(functions(t, i, ascii).join("; "));
        rows.push(r);
    }
    let order = t
        .order
        .map(|o| format!("order {o}"))
        .unwrap_or_else(|| "infinite order".into());
    format!(
        "{} ({}, {})\n{}\n{}",
        if ascii { &t.name } else { &t.symbol },
        t.family.name(),
        order,
        grid::render(&rows, ascii),
        wrap(&if ascii {
            super::ascii_prose(&t.orientation)
        } else {
            t.orientation.clone()
        })
    )
}

fn wrap(s: &str) -> String {
    let mut out = String::new();
    let mut line = String::new();
    for w in s.split_whitespace() {
        if line.chars().count() + w.chars().count() + 1 > 78 && !line.is_empty() {
            out.push_str(&line);
            out.push('\n');
            line.clear();
        }
        if !line.is_empty() {
            line.push(' ');
        }
        line.push_str(w);
    }
    out.push_str(&line);
    out.push('\n');
    out
}

fn markdown(g: &PointGroup, nt: Notation, ascii: bool) -> String {
    let t = &g.table;
    format!(
        "# {}\n\n{}",
        if ascii { &t.name } else { &t.symbol },
        markdown_body(g, nt, ascii)
    )
}

/// The Markdown table and the table's orientation note, without a heading (for reports that
/// put the table under a heading of their own).
pub fn markdown_body(g: &PointGroup, nt: Notation, ascii: bool) -> String {
    let t = &g.table;
    let mut rows = vec![header(g, ascii)];
    for i in 0..t.irreps.len() {
        let mut r = vec![label(g, i, ascii)];
        for c in 0..t.classes.len() {
            r.push(char_text(g, i, c, nt));
        }
        r.push(functions(t, i, ascii).join("; "));
        rows.push(r);
    }
    let mut out = grid::markdown(&rows);
    let orientation = if ascii {
        super::ascii_prose(&t.orientation)
    } else {
        t.orientation.clone()
    };
    out.push_str(&format!("\n{}\n", orientation.trim()));
    out
}

/// LaTeX for an exact number (math mode body).
pub fn latex_number(v: &Cyclo) -> String {
    latex_text(&v.text(Notation::Ascii))
}

/// Turn ASCII notation into LaTeX math: sqrt(5) → \sqrt{5}, pi → \pi, exp(...) → e^{...}.
pub fn latex_text(s: &str) -> String {
    let mut out = String::new();
    let chars: Vec<char> = s.chars().collect();
    let mut i = 0;
    while i < chars.len() {
        let rest: String = chars[i..].iter().collect();
        if rest.starts_with("sqrt(") || rest.starts_with("exp(") {
            let is_sqrt = rest.starts_with("sqrt(");
            let start = i + if is_sqrt { 5 } else { 4 };
            let mut depth = 1;
            let mut j = start;
            while j < chars.len() && depth > 0 {
                match chars[j] {
                    '(' => depth += 1,
                    ')' => depth -= 1,
                    _ => {}
                }
                j += 1;
            }
            let inner: String = chars[start..j.saturating_sub(1)].iter().collect();
            let inner = latex_text(&inner);
            if is_sqrt {
                out.push_str(&format!("\\sqrt{{{inner}}}"));
            } else {
                out.push_str(&format!("e^{{{}}}", inner.replace(" i", "i")));
            }
            i = j;
        } else if rest.starts_with("pi") {
            out.push_str("\\pi ");
            i += 2;
        } else if rest.starts_with("cos(") {
            out.push_str("\\cos(");
            i += 4;
        } else if rest.starts_with("phi") {
            out.push_str("\\varphi ");
            i += 3;
        } else if chars[i] == '*' {
            out.push_str("\\cdot ");
            i += 1;
        } else {
            out.push(chars[i]);
            i += 1;
        }
    }
    out
}

/// LaTeX form of a Mulliken label (math mode): A1g → \mathrm{A}_{1g}, E'' → \mathrm{E}'',
/// 1E → {}^{1}\mathrm{E}, Sigmag+ → \Sigma_{g}^+, Piu → \Pi_{u} (Mulliken 1955 notation).
pub fn latex_label(label: &str) -> String {
    let mut s = label;
    let mut prefix = String::new();
    let d = s.chars().take_while(|c| c.is_ascii_digit()).count();
    if d > 0 {
        prefix = format!("{{}}^{{{}}}", &s[..d]);
        s = &s[d..];
    }
    let greek = [
        ("Sigma", "\\Sigma"),
        ("Pi", "\\Pi"),
        ("Delta", "\\Delta"),
        ("Phi", "\\Phi"),
        ("Gamma", "\\Gamma"),
    ];
    let (head, rest) = match greek.iter().find(|(a, _)| s.starts_with(a)) {
        Some((a, b)) => (b.to_string(), &s[a.len()..]),
        None => {
            let n = s.chars().next().map(|c| c.len_utf8()).unwrap_or(0);
            (format!("\\mathrm{{{}}}", &s[..n]), &s[n..])
        }
    };
    let sign = if rest.contains('+') {
        "^+"
    } else if rest.contains('-') {
        "^-"
    } else {
        ""
    };
    let primes: String = rest.chars().filter(|c| *c == '\'').collect();
    let sub: String = rest
        .chars()
        .filter(|c| !matches!(c, '\'' | '+' | '-'))
        .collect();
    let sub = if sub.is_empty() {
        String::new()
    } else {
        format!("_{{{sub}}}")
    };
    format!("{prefix}{head}{sub}{primes}{sign}")
}

/// LaTeX math of a class symbol (ASCII spelling): `2C3` → `2C_{3}`, `C2'` → `C_{2}'`,
/// `S4^3` → `S_{4}^{3}`, `3sv` → `3\sigma_{v}`, `S10` → `S_{10}`, `2Cinf^phi` →
/// `2C_{\infty}^{\varphi}`, `infsv` → `\infty\sigma_{v}`.
pub fn latex_class(ascii: &str) -> String {
    let chars: Vec<char> = ascii.chars().collect();
    let at = |k: usize, w: &str| {
        chars[k.min(chars.len())..]
            .iter()
            .collect::<String>()
            .starts_with(w)
    };
    // A run of digits, `inf` or `phi` at k: its LaTeX and where it ends.
    let script = |k: usize| -> Option<(String, usize)> {
        if at(k, "inf") {
            return Some(("\\infty".into(), k + 3));
        }
        if at(k, "phi") {
            return Some(("\\varphi".into(), k + 3));
        }
        let mut j = k;
        while j < chars.len() && chars[j].is_ascii_digit() {
            j += 1;
        }
        (j > k).then(|| (chars[k..j].iter().collect(), j))
    };
    let mut out = String::new();
    let mut k = 0;
    while k < chars.len() {
        let c = chars[k];
        if c == 's' && matches!(chars.get(k + 1), Some('h' | 'v' | 'd')) {
            out.push_str(&format!("\\sigma_{{{}}}", chars[k + 1]));
            k += 2;
        } else if let (true, Some((sub, end))) = (c == 'C' || c == 'S', script(k + 1)) {
            out.push_str(&format!("{c}_{{{sub}}}"));
            k = end;
        } else if let (true, Some((sup, end))) = (c == '^', script(k + 1)) {
            out.push_str(&format!("^{{{sup}}}"));
            k = end;
        } else if at(k, "inf") {
            out.push_str("\\infty ");
            k += 3;
        } else {
            out.push(c);
            k += 1;
        }
    }
    out.replace("\\infty \\sigma", "\\infty\\sigma")
}

fn latex(g: &PointGroup) -> String {
    let t = &g.table;
    let ncol = t.classes.len() + 2;
    let mut out = String::new();
    out.push_str(&format!(
        "\\begin{{tabular}}{{l{}l}}\n\\toprule\n",
        "c".repeat(ncol - 2)
    ));
    let mut h = vec![format!("${}$", super::latex::group_math(&t.name))];
    h.extend(
        t.classes
            .iter()
            .map(|c| format!("${}$", latex_class(&c.ascii))),
    );
    h.push("functions".into());
    out.push_str(&h.join(" & "));
    out.push_str(" \\\\\n\\midrule\n");
    for i in 0..t.irreps.len() {
        let mut r = vec![format!("${}$", latex_label(&t.irreps[i].label))];
        for c in 0..t.classes.len() {
            r.push(format!(
                "${}$",
                latex_text(&char_text(g, i, c, Notation::Ascii))
            ));
        }
        let f = functions(t, i, true)
            .iter()
            .map(|s| {
                format!(
                    "${}$",
                    s.replace("Rx", "R_x")
                        .replace("Ry", "R_y")
                        .replace("Rz", "R_z")
                )
            })
            .collect::<Vec<_>>()
            .join("; ");
        r.push(f);
        out.push_str(&r.join(" & "));
        out.push_str(" \\\\\n");
    }
    out.push_str("\\bottomrule\n\\end{tabular}\n");
    out
}

fn matrix_json(m: &nalgebra::Matrix3<f64>) -> Value {
    let clean = |v: f64| if v.abs() < 1e-15 { 0.0 } else { v };
    json!((0..3)
        .map(|i| (0..3).map(|j| clean(m[(i, j)])).collect::<Vec<_>>())
        .collect::<Vec<_>>())
}

/// The JSON form of a table.
pub fn to_json(g: &PointGroup) -> Value {
    let t = &g.table;
    let classes: Vec<Value> = t
        .classes
        .iter()
        .enumerate()
        .map(|(c, cl)| {
            let elements: Vec<Value> = g
                .ops
                .iter()
                .filter(|o| o.class == c)
                .map(|o| matrix_json(&o.float))
                .collect();
            let rep = crate::group::op_matrix(&cl.op)
                .ok()
                .map(|m| matrix_json(&crate::group::to_float(&m)));
            json!({
                "symbol": cl.ascii,
                "size": if t.is_linear() && cl.size == 0 { Value::Null } else { json!(cl.size) },
                "representative": rep,
                "elements": elements,
            })
        })
        .collect();
    let irreps: Vec<Value> = t
        .irreps
        .iter()
        .enumerate()
        .map(|(i, ir)| {
            let chars: Vec<String> = (0..t.classes.len())
                .map(|c| char_text(g, i, c, Notation::Ascii))
                .collect();
            let floats: Vec<Value> = ir
                .chars
                .iter()
                .map(|v| {
                    let (re, im) = v.to_c64();
                    if im.abs() < 1e-12 {
                        json!(re)
                    } else {
                        json!({"re": re, "im": im})
                    }
                })
                .collect();
            json!({
                "label": ir.label,
                "characters": chars,
                "characters_float": if t.is_linear() { Value::Null } else { json!(floats) },
                "functions": functions(t, i, true),
            })
        })
        .collect();
    json!({
        "group": t.name,
        "order": t.order,
        "family": t.family.name(),
        "orientation": t.orientation,
        "classes": classes,
        "irreps": irreps,
    })
}
