//! Reductions rendered with their worked arithmetic, in every format.
//!
//! Text form of one line: `n(A₁) = 1/6 [1·3·1 + 2·0·1 + 3·1·1] = 1`, the terms being
//! g_c · χ(c) · χᵢ(c)* in class order.

use super::table::{latex_label, latex_number};
use super::Format;
use crate::exact::{Cyclo, Notation};
use crate::group::PointGroup;
use crate::rep::{format_sum, suggest_reduction, Reduction};
use serde_json::{json, Map, Value};

fn num(v: &Cyclo, nt: Notation) -> String {
    let s = v.text(nt);
    let tail: String = s.chars().skip(1).collect();
    if s.contains(['+', ' ']) || tail.contains(['-', '−']) {
        format!("({s})")
    } else {
        s
    }
}

/// One worked line per irrep.
pub fn worked_lines(g: &PointGroup, r: &Reduction, nt: Notation) -> Vec<String> {
    let dot = if nt == Notation::Ascii { "*" } else { "·" };
    r.lines
        .iter()
        .map(|l| {
            let ir = &g.table.irreps[l.irrep];
            let label = if nt == Notation::Ascii {
                ir.label.clone()
            } else {
                ir.display()
            };
            let terms: Vec<String> = l
                .terms
                .iter()
                .map(|t| {
                    format!(
                        "{}{dot}{}{dot}{}",
                        t.size,
                        num(&t.chi, nt),
                        num(&t.chi_irrep_conj, nt)
                    )
                })
                .collect();
            format!(
                "n({label}) = 1/{} [{}] = {}",
                r.order,
                terms.join(" + "),
                l.value.text(nt)
            )
        })
        .collect()
}

/// The result line, e.g. `Γ = A₁ + E`, or the diagnosis of impossible characters.
pub fn summary(g: &PointGroup, r: &Reduction, nt: Notation) -> String {
    let unicode = nt == Notation::Unicode;
    match r.multiplicities() {
        Ok(m) => format!(
            "{} = {}",
            if unicode { "Γ" } else { "Gamma" },
            format_sum(g, &m, unicode)
        ),
        Err(inv) => {
            let bad: Vec<String> = inv
                .offending
                .iter()
                .map(|(i, v)| format!("n({}) = {}", g.table.irreps[*i].label, v.text(nt)))
                .collect();
            let mut s = format!(
                "not a representation of {}: {} (multiplicities must be whole numbers ≥ 0)",
                g.name(),
                bad.join(", ")
            );
            for sg in suggest_reduction(g, r) {
                s.push_str(&format!(
                    "\n  hint: {}({}) = {} instead of {} would give {}",
                    if unicode { "χ" } else { "chi" },
                    g.table.classes[sg.class].ascii,
                    sg.to.text(nt),
                    sg.from.text(nt),
                    format_sum(g, &sg.multiplicities, unicode)
                ));
            }
            s
        }
    }
}

/// Full rendering of a reduction.
pub fn render(g: &PointGroup, r: &Reduction, format: Format, ascii: bool) -> String {
    let nt = if ascii {
        Notation::Ascii
    } else {
        Notation::Unicode
    };
    match format {
        Format::Json => serde_json::to_string_pretty(&to_json(g, r)).unwrap_or_default() + "\n",
        Format::Text => {
            let chi: Vec<String> = r.chi.0.iter().map(|v| v.text(nt)).collect();
            let classes: Vec<String> = g
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
                .collect();
            let rows = vec![classes, chi];
            let mut out = format!("{}\n", g.name());
            out.push_str(&super::grid::render(&rows, ascii));
            for l in worked_lines(g, r, nt) {
                out.push_str(&l);
                out.push('\n');
            }
            out.push_str(&summary(g, r, nt));
            out.push('\n');
            out
        }
        Format::Markdown => {
            let mut out = format!("**{}** reduction\n\n", g.table.symbol);
            for l in worked_lines(g, r, nt) {
                out.push_str(&format!("- {l}\n"));
            }
            out.push_str(&format!("\n{}\n", summary(g, r, nt)));
            out
        }
        Format::Latex => {
            let mut out = String::from("\\begin{align*}\n");
            for l in &r.lines {
                let terms: Vec<String> = l
                    .terms
                    .iter()
                    .map(|t| {
                        format!(
                            "{}\\cdot({})\\cdot({})",
                            t.size,
                            latex_number(&t.chi),
                            latex_number(&t.chi_irrep_conj)
                        )
                    })
                    .collect();
                out.push_str(&format!(
                    "n({}) &= \\tfrac{{1}}{{{}}}\\left[{}\\right] = {} \\\\\n",
                    latex_label(&g.table.irreps[l.irrep].label),
                    r.order,
                    terms.join(" + "),
                    latex_number(&l.value)
                ));
            }
            out.push_str("\\end{align*}\n");
            out
        }
    }
}

/// `{"group", "multiplicities", "valid"}` plus `"error"`/`"suggestions"` when invalid.
pub fn to_json(g: &PointGroup, r: &Reduction) -> Value {
    let mut out = Map::new();
    out.insert("group".into(), json!(g.name()));
    out.insert(
        "characters".into(),
        json!(r
            .chi
            .0
            .iter()
            .map(|v| v.text(Notation::Ascii))
            .collect::<Vec<_>>()),
    );
    match r.multiplicities() {
        Ok(m) => {
            let mut mm = Map::new();
            for (i, n) in m.iter().enumerate() {
                mm.insert(g.table.irreps[i].label.clone(), json!(n));
            }
            out.insert("multiplicities".into(), Value::Object(mm));
            out.insert("valid".into(), json!(true));
        }
        Err(inv) => {
            let mut mm = Map::new();
            for l in &r.lines {
                mm.insert(
                    g.table.irreps[l.irrep].label.clone(),
                    json!(l.value.text(Notation::Ascii)),
                );
            }
            out.insert("multiplicities".into(), Value::Object(mm));
            out.insert("valid".into(), json!(false));
            let bad: Vec<String> = inv
                .offending
                .iter()
                .map(|(i, v)| {
                    format!(
                        "n({}) = {}",
                        g.table.irreps[*i].label,
                        v.text(Notation::Ascii)
                    )
                })
                .collect();
            out.insert(
                "error".into(),
                json!(format!(
                    "not a representation of {}: {}",
                    g.name(),
                    bad.join(", ")
                )),
            );
            let sug: Vec<Value> = suggest_reduction(g, r)
                .iter()
                .map(|s| {
                    json!({
                        "class": g.table.classes[s.class].ascii,
                        "from": s.from.text(Notation::Ascii),
                        "to": s.to.text(Notation::Ascii),
                        "result": format_sum(g, &s.multiplicities, false),
                    })
                })
                .collect();
            out.insert("suggestions".into(), json!(sug));
        }
    }
    Value::Object(out)
}
