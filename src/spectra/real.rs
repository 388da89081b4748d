//! The real view of a group's irreps: a complex-conjugate pair of rows (¹E + ²E) is one
//! physically real degenerate representation E (Cotton, *Chemical Applications of Group
//! Theory*, 3rd ed., §4.4: the pair is bracketed and its functions span both rows together).
//!
//! Owns: merging pairs, multiplicities in the real view, which irrep is totally symmetric,
//! whether the group is centrosymmetric, and reading a Γ written as `A1 + E + 2T2`.

use super::error::SpectraError;
use crate::exact::Cyclo;
use crate::group::{OpSpec, PointGroup};
pub use crate::rep::ascii_label;
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

/// Index of a real irrep by label: ASCII or Unicode, a pair by its real label (`E`) or by
/// either row (`1E`).
pub fn real_index(g: &PointGroup, label: &str) -> Option<usize> {
    let rows = crate::rep::label_rows(g, label)?;
    real_irreps(g)
        .iter()
        .position(|r| r.rows.contains(&rows[0]))
}

/// Read a Γ written as `A1 + E + 2T2`, `2A1' + 3E'`, `Sigma+g + Piu`, `2 E`, `3*T2`;
/// multiplicities per table row (a pair label `E` counts once on each of its rows). The shared
/// rules of `rep::gamma_text`: `1E`, `2E` are the rows of a pair; a glued count that could
/// be read two ways is an error.
pub fn parse_gamma(g: &PointGroup, text: &str) -> Result<Vec<u64>, SpectraError> {
    crate::rep::gamma_text::parse_gamma(g, text).map_err(SpectraError::from)
}
