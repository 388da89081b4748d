//! The real view of a group's irreps: a complex-conjugate pair of rows (¹E + ²E) is one
//! physically real degenerate representation E (Cotton, *Chemical Applications of Group
//! Theory*, 3rd ed., §4.4: the pair is bracketed and its functions span both rows together).
//!
//! Owns: merging pairs, multiplicities in the real view, which irrep is totally symmetric,
//! whether the group is centrosymmetric, and reading a Γ written as `A1 + E + 2T2`.

use super::error::SpectraError;
use crate::exact::Cyclo;
use crate::group::{OpSpec, PointGroup};
use crate::rep::{pair_label, Character};

/// One real irreducible representation: a table row, or a complex-conjugate pair of rows.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct RealIrrep {
    /// Table rows (one, or the two rows of a pair; the first carries the functions).
    pub rows: Vec<usize>,
    /// ASCII label (`E` for the pair `1E` + `2E`).
    pub label: String,
    /// Dimension of the real representation (2 for a pair of 1-dimensional rows).
    pub dim: usize,
}

/// The real irreps of a group, in table order of their first row.
pub fn real_irreps(g: &PointGroup) -> Vec<RealIrrep> {
    let irreps = &g.table.irreps;
    let mut out = Vec::new();
    for (i, ir) in irreps.iter().enumerate() {
        match ir.pair {
            Some(p) if p < i => continue,
            Some(p) => out.push(RealIrrep {
                rows: vec![i, p],
                label: pair_label(&ir.label),
                dim: ir.dim() + irreps[p].dim(),
            }),
            None => out.push(RealIrrep {
                rows: vec![i],
                label: ir.label.clone(),
                dim: ir.dim(),
            }),
        }
    }
    out
}

/// Multiplicities per table row → per real irrep. A pair needs equal multiplicities.
pub fn to_real(g: &PointGroup, rows: &[u64]) -> Result<Vec<u64>, SpectraError> {
    if rows.len() != g.table.irreps.len() {
        return Err(SpectraError::WrongLength {
            group: g.name().into(),
            expected: g.table.irreps.len(),
            found: rows.len(),
        });
    }
    real_irreps(g)
        .iter()
        .map(|r| {
            let m = rows[r.rows[0]];
            if let Some(&other) = r.rows.get(1) {
                if rows[other] != m {
                    return Err(SpectraError::UnpairedComplex {
                        group: g.name().into(),
                        first: g.table.irreps[r.rows[0]].label.clone(),
                        second: g.table.irreps[other].label.clone(),
                        m1: m,
                        m2: rows[other],
                    });
                }
            }
            Ok(m)
        })
        .collect()
}

/// Multiplicities per real irrep → per table row.
pub fn to_rows(g: &PointGroup, real: &[u64]) -> Vec<u64> {
    let mut rows = vec![0; g.table.irreps.len()];
    for (r, m) in real_irreps(g).iter().zip(real) {
        for &i in &r.rows {
            rows[i] = *m;
        }
    }
    rows
}

/// Character of a real irrep (sum of its rows), finite groups only.
pub fn real_character(g: &PointGroup, r: &RealIrrep) -> Character {
    let n = g.n_classes();
    let mut out = vec![Cyclo::zero(); n];
    for &i in &r.rows {
        for c in 0..n {
            out[c] = &out[c] + &g.table.irreps[i].chars[c];
        }
    }
    Character(out)
}

/// Is this table row the totally symmetric irrep (character 1 on every class)?
pub fn is_totally_symmetric(g: &PointGroup, row: usize) -> bool {
    let ir = &g.table.irreps[row];
    if g.is_linear() {
        ir.char_text.iter().all(|t| t.trim() == "1")
    } else {
        ir.chars.iter().all(|c| c.is_one())
    }
}

/// Does the group contain the inversion centre i?
pub fn is_centrosymmetric(g: &PointGroup) -> bool {
    g.table
        .classes
        .iter()
        .any(|c| matches!(c.op, OpSpec::Inversion))
}

/// Unicode or loose spellings of a label in the tables' ASCII: `Σg⁺`, `Σ+g`, `Sigmag+` →
/// `Sigma+g`; `A₁′` → `A1'`; `E″` → `E''`.
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

/// Index of a real irrep by label: ASCII or Unicode, a pair by its real label (`E`) or by
/// either row (`1E`).
pub fn real_index(g: &PointGroup, label: &str) -> Option<usize> {
    let reals = real_irreps(g);
    let ascii = ascii_label(label);
    let l = ascii.as_str();
    let by_real = |eq: &dyn Fn(&str) -> bool| reals.iter().position(|r| eq(&r.label));
    by_real(&|x| x == l)
        .or_else(|| by_real(&|x| crate::group::display_label(x) == l))
        .or_else(|| {
            let row = g.table.irrep_index(l)?;
            reals.iter().position(|r| r.rows.contains(&row))
        })
        .or_else(|| {
            let row = g.table.irrep_index(label.trim())?;
            reals.iter().position(|r| r.rows.contains(&row))
        })
        .or_else(|| by_real(&|x| x.eq_ignore_ascii_case(l)))
}

/// Read a Γ written as `A1 + E + 2T2`, `2A1' + 3E'`, `Sigma+g + Piu`; multiplicities per
/// table row (a pair label `E` counts once on each of its rows). A `+` directly after
/// `Sigma`/`Σ` belongs to the label; `2E` means two E, not the row `2E`.
pub fn parse_gamma(g: &PointGroup, text: &str) -> Result<Vec<u64>, SpectraError> {
    let reals = real_irreps(g);
    let mut m = vec![0u64; reals.len()];
    let chars: Vec<char> = text.chars().collect();
    let mut terms: Vec<(usize, String)> = Vec::new();
    let mut start = 0;
    let mut cur = String::new();
    for (k, &c) in chars.iter().enumerate() {
        let sigma_sign = c == '+'
            && ["Sigma", "Sigmag", "Sigmau", "Σ", "Σg", "Σu"]
                .iter()
                .any(|s| cur.ends_with(s));
        if c == '+' && !sigma_sign {
            terms.push((start, std::mem::take(&mut cur)));
            start = k + 1;
        } else {
            cur.push(c);
        }
    }
    terms.push((start, cur));
    for (col, raw) in terms {
        let lead = raw.len() - raw.trim_start().len();
        let column = col + raw[..lead].chars().count() + 1;
        let t = raw.trim();
        if t.is_empty() {
            return Err(SpectraError::BadTerm {
                column,
                message: "empty term (expected e.g. 2A1)".into(),
            });
        }
        let digits: String = t.chars().take_while(|c| c.is_ascii_digit()).collect();
        let mut label = t[digits.len()..].trim();
        let mut count: u64 = if digits.is_empty() {
            1
        } else {
            digits.parse().map_err(|_| SpectraError::BadTerm {
                column,
                message: format!("multiplicity '{digits}' is too large"),
            })?
        };
        // `1E`, `2E` are row labels of a pair, not a count.
        let mut idx = real_index(g, label);
        if idx.is_none() && !digits.is_empty() {
            if let Some(i) = real_index(g, t) {
                idx = Some(i);
                count = 1;
                label = t;
            }
        }
        let i = idx.ok_or_else(|| SpectraError::UnknownIrrep {
            group: g.name().into(),
            label: label.to_string(),
            column,
            known: reals
                .iter()
                .map(|r| r.label.as_str())
                .collect::<Vec<_>>()
                .join(" "),
        })?;
        m[i] += count;
    }
    Ok(to_rows(g, &m))
}
