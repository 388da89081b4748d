//! Reading and writing a Γ as text (`A1 + 2E`, `Sigma+g + Piu`, `1E + 2E`): the one parser
//! every command, file and panel uses, and the writer whose output it reads back.
//!
//! Multiplicities. Complex-conjugate pairs carry labels that begin with a digit (¹E, ²E₁ —
//! typed `1E`, `2E1`), so a leading number is not always a count. The rule:
//! - a multiplicity is written `2 E` (space), `2*E` (or `2×E`), or `2E` glued to the label;
//! - a glued form that is itself the name of an irrep of the group is that irrep (`2E` in C3
//!   is the row ²E; two E pairs are `2 E`);
//! - a glued form that can be split into a count and a label in more than one way (`12E` in C3:
//!   12 × E or 1 × ²E) is an error naming every reading.
//!
//! Labels: the table's ASCII label, its Unicode display, loose spellings (`Σg⁺`, `Sigmag+`,
//! `A₁′`), any case; the real label of a pair (`E` for ¹E + ²E) stands for both rows.

use crate::group::{display_label, PointGroup};

/// One term of a Γ text.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct GammaTerm {
    pub count: u64,
    /// Table rows it stands for (two for the real label of a complex pair).
    pub rows: Vec<usize>,
    /// 1-based column (in characters) where the term starts.
    pub column: usize,
}

/// Why a Γ text cannot be read; every variant names its column.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum GammaTextError {
    #[error("no irreps given")]
    Empty,
    #[error("column {column}: empty term (expected e.g. 2A1)")]
    EmptyTerm { column: usize },
    #[error("column {column}: '{label}' is not an irrep of {group} (irreps: {known})")]
    Unknown {
        group: String,
        label: String,
        column: usize,
        known: String,
    },
    #[error("column {column}: multiplicity '{text}' is not a whole number")]
    BadCount { column: usize, text: String },
    #[error(
        "column {column}: '{text}' is ambiguous in {group}: it reads as {readings}; write the \
         multiplicity with a space or '*' (e.g. '{example}')"
    )]
    Ambiguous {
        group: String,
        text: String,
        column: usize,
        readings: String,
        example: String,
    },
}

/// Unicode or loose spellings of a label in the tables' ASCII: `Σg⁺`, `Σ+g`, `Sigmag+` →
/// `Sigma+g`; `A₁′` → `A1'`; `E″` → `E''`; `¹E₁` → `1E1`.
pub fn ascii_label(label: &str) -> String {
    let mut s = String::new();
    for c in label.trim().chars() {
        match c {
            'Σ' => s.push_str("Sigma"),
            'Π' => s.push_str("Pi"),
            'Δ' => s.push_str("Delta"),
            'Φ' => s.push_str("Phi"),
            'Γ' => s.push_str("Gamma"),
            '⁺' => s.push('+'),
            '⁻' | '−' => s.push('-'),
            '′' => s.push('\''),
            '″' => s.push_str("''"),
            '₀'..='₉' => {
                s.push(char::from_u32(c as u32 - '₀' as u32 + '0' as u32).unwrap_or(c))
            }
            '¹' => s.push('1'),
            '²' => s.push('2'),
            '³' => s.push('3'),
            _ => s.push(c),
        }
    }
    // Sigma: the sign goes right after the name (`Sigmag+` → `Sigma+g`).
    if let Some(rest) = s.strip_prefix("Sigma") {
        let sign: String = rest.chars().filter(|c| *c == '+' || *c == '-').collect();
        let other: String = rest.chars().filter(|c| *c != '+' && *c != '-').collect();
        s = format!("Sigma{sign}{other}");
    }
    s
}

/// `1E1` → `E1`: the real label of a complex-conjugate pair.
pub fn pair_label(label: &str) -> String {
    label
        .trim_start_matches(|c: char| c.is_ascii_digit())
        .to_string()
}

/// The table rows a single label names (no multiplicity): one row, or both rows of a pair when
/// the pair's real label is given.
pub fn label_rows(g: &PointGroup, label: &str) -> Option<Vec<usize>> {
    let l = label.trim();
    if l.is_empty() {
        return None;
    }
    let a = ascii_label(l);
    let irreps = &g.table.irreps;
    let rows_of = |i: usize| -> Vec<usize> { vec![i] };
    let pair_of = |i: usize| -> Vec<usize> {
        let p = irreps[i].pair.expect("pair");
        let mut v = vec![i, p];
        v.sort();
        v
    };
    let exact = |eq: &dyn Fn(&str) -> bool| -> Option<Vec<usize>> {
        if let Some(i) = irreps
            .iter()
            .position(|ir| eq(&ir.label) || eq(&ir.display()))
        {
            return Some(rows_of(i));
        }
        irreps
            .iter()
            .position(|ir| {
                ir.pair.is_some() && {
                    let real = pair_label(&ir.label);
                    eq(&real) || eq(&display_label(&real))
                }
            })
            .map(pair_of)
    };
    exact(&|x| x == l || x == a)
        .or_else(|| exact(&|x| x.eq_ignore_ascii_case(l) || x.eq_ignore_ascii_case(&a)))
}

/// Split a Γ text into its terms at `+`, keeping the sign of Σ± (`Sigma+g`, `Σ+`) inside the
/// label. Returns (column of the term's first character, raw text).
fn split_terms(text: &str) -> Vec<(usize, String)> {
    let mut out = Vec::new();
    let mut start = 0;
    let mut cur = String::new();
    for (k, c) in text.chars().enumerate() {
        let lower = cur.to_lowercase();
        let sigma_sign = c == '+'
            && ["sigma", "sigmag", "sigmau", "σ", "σg", "σu"]
                .iter()
                .any(|s| lower.ends_with(s));
        if c == '+' && !sigma_sign {
            out.push((start, std::mem::take(&mut cur)));
            start = k + 1;
        } else {
            cur.push(c);
        }
    }
    out.push((start, cur));
    out
}

fn known(g: &PointGroup) -> String {
    g.table
        .irreps
        .iter()
        .map(|i| i.label.as_str())
        .collect::<Vec<_>>()
        .join(", ")
}

fn parse_count(t: &str, column: usize) -> Result<u64, GammaTextError> {
    let t = t.trim();
    if t.is_empty() || !t.chars().all(|c| c.is_ascii_digit()) {
        return Err(GammaTextError::BadCount {
            column,
            text: t.to_string(),
        });
    }
    t.parse().map_err(|_| GammaTextError::BadCount {
        column,
        text: t.to_string(),
    })
}

/// Read one term (`2A1`, `2 E`, `3*T2`, `1E`, `Sigma+g`).
pub fn parse_term(g: &PointGroup, term: &str, column: usize) -> Result<GammaTerm, GammaTextError> {
    let t = term.trim();
    if t.is_empty() {
        return Err(GammaTextError::EmptyTerm { column });
    }
    let unknown = |label: &str| GammaTextError::Unknown {
        group: g.name().into(),
        label: label.to_string(),
        column,
        known: known(g),
    };
    let labelled = |count: u64, label: &str| -> Result<GammaTerm, GammaTextError> {
        let rows = label_rows(g, label).ok_or_else(|| unknown(label.trim()))?;
        Ok(GammaTerm {
            count,
            rows,
            column,
        })
    };
    // Explicit forms: `2*E`, `2×E`, `2 E`.
    if let Some(k) = t.find(['*', '×']) {
        let sep = t[k..].chars().next().map_or(1, char::len_utf8);
        return labelled(parse_count(&t[..k], column)?, &t[k + sep..]);
    }
    if let Some(k) = t.find(char::is_whitespace) {
        let (n, rest) = (&t[..k], &t[k..]);
        if n.chars().all(|c| c.is_ascii_digit()) {
            return labelled(parse_count(n, column)?, rest);
        }
        return Err(unknown(t));
    }
    // A whole label wins: `1E`, `2E1` are rows of a pair.
    if let Some(rows) = label_rows(g, t) {
        return Ok(GammaTerm {
            count: 1,
            rows,
            column,
        });
    }
    // Glued count: every way of splitting the leading digits.
    let digits = t.chars().take_while(|c| c.is_ascii_digit()).count();
    let mut readings: Vec<(u64, Vec<usize>, String)> = Vec::new();
    for k in 1..=digits {
        let (n, label) = (&t[..k], &t[k..]);
        if let Some(rows) = label_rows(g, label) {
            readings.push((parse_count(n, column)?, rows, label.to_string()));
        }
    }
    match readings.len() {
        0 => Err(unknown(if digits == 0 { t } else { &t[digits..] })),
        1 => {
            let (count, rows, _) = readings.remove(0);
            Ok(GammaTerm {
                count,
                rows,
                column,
            })
        }
        _ => Err(GammaTextError::Ambiguous {
            group: g.name().into(),
            text: t.to_string(),
            column,
            readings: readings
                .iter()
                .map(|(n, _, l)| format!("{n} × {l}"))
                .collect::<Vec<_>>()
                .join(" or "),
            example: format!("{} {}", readings[0].0, readings[0].2),
        }),
    }
}

/// Read a whole Γ into its terms.
pub fn parse_gamma_terms(g: &PointGroup, text: &str) -> Result<Vec<GammaTerm>, GammaTextError> {
    if text.trim().is_empty() {
        return Err(GammaTextError::Empty);
    }
    split_terms(text)
        .into_iter()
        .map(|(start, raw)| {
            let lead = raw.chars().take_while(|c| c.is_whitespace()).count();
            parse_term(g, &raw, start + lead + 1)
        })
        .collect()
}

/// Read a Γ into multiplicities per table row (a pair's real label counts on both rows).
pub fn parse_gamma(g: &PointGroup, text: &str) -> Result<Vec<u64>, GammaTextError> {
    let mut m = vec![0u64; g.table.irreps.len()];
    for t in parse_gamma_terms(g, text)? {
        for r in t.rows {
            m[r] = m[r].saturating_add(t.count);
        }
    }
    Ok(m)
}

/// Read a single irrep label (no multiplicity), e.g. a fundamental's species.
pub fn parse_irrep(g: &PointGroup, label: &str) -> Result<Vec<usize>, GammaTextError> {
    label_rows(g, label).ok_or_else(|| GammaTextError::Unknown {
        group: g.name().into(),
        label: label.trim().to_string(),
        column: 1,
        known: known(g),
    })
}

/// `n` times `label` written so that [`parse_term`] reads it back: glued (`2A1`, `2E₁`)
/// unless the label starts with a digit or the glued text names an irrep of its own (`2 E` in
/// C3, where `2E` is the row ²E; `2 ¹E`).
pub fn write_term(g: &PointGroup, n: u64, label: &str) -> String {
    if n == 1 {
        return label.to_string();
    }
    let starts_with_digit = label
        .chars()
        .next()
        .is_some_and(|c| c.is_ascii_digit() || "⁰¹²³⁴⁵⁶⁷⁸⁹".contains(c));
    let glued = format!("{n}{label}");
    if starts_with_digit || label_rows(g, &glued).is_some() {
        format!("{n} {label}")
    } else {
        glued
    }
}
