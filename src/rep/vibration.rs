//! Γ3N, Γtrans, Γrot and Γvib from the number of atoms each class leaves unmoved.
//!
//! Γ3N(R) = (unmoved atoms)·(±1 + 2cos θ); Γtrans carries x, y, z (χ = trace R); Γrot carries
//! Rx, Ry, Rz (χ = det R · trace R); Γvib = Γ3N − Γtrans − Γrot (Cotton, 3rd ed., §10.2;
//! Wilson, Decius & Cross, *Molecular Vibrations*, ch. 6). Linear molecules go through C2v/D2h
//! and lose only two rotations (the Π pair carrying Rx, Ry).

use super::character::{Character, MemberKind};
use super::linear::reduce_linear_unmoved;
use super::reduce::reduce;
use crate::group::PointGroup;

/// Γ3N, Γtrans, Γrot and Γvib as multiplicities in the group's irreps (table order).
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Vibrations {
    pub gamma_3n: Vec<u64>,
    pub translations: Vec<u64>,
    pub rotations: Vec<u64>,
    pub vibrations: Vec<u64>,
    /// Number of vibrational modes Σ n·d (3N − 6, or 3N − 5 when linear).
    pub n_modes: usize,
}

/// Multiplicities of the irreps listed (once per tuple) in a function column.
fn column(g: &PointGroup, pick: impl Fn(&crate::group::Irrep) -> usize) -> Vec<u64> {
    g.table.irreps.iter().map(|ir| pick(ir) as u64).collect()
}

fn dims(g: &PointGroup, m: &[u64]) -> usize {
    m.iter()
        .zip(&g.table.irreps)
        .map(|(n, ir)| *n as usize * ir.dim())
        .sum()
}

fn subtract(a: &[u64], b: &[u64]) -> Result<Vec<u64>, String> {
    a.iter()
        .zip(b)
        .map(|(x, y)| {
            x.checked_sub(*y).ok_or_else(|| {
                "translations/rotations exceed Γ3N: the counts are inconsistent".to_string()
            })
        })
        .collect()
}

/// Γvib from unmoved-atom counts per class.
pub fn vibrations_from_unmoved(g: &PointGroup, unmoved: &[i64]) -> Result<Vibrations, String> {
    if g.is_linear() {
        let lr = reduce_linear_unmoved(g, unmoved, MemberKind::Cartesian)?;
        return vibrations_from_gamma_3n(g, lr.multiplicities);
    }
    let chi =
        Character::from_unmoved(g, unmoved, MemberKind::Cartesian).map_err(|e| e.to_string())?;
    let g3n = reduce(g, &chi).multiplicities().map_err(|_| {
        "the unmoved counts do not give a representation (check them per class)".to_string()
    })?;
    vibrations_from_gamma_3n(g, g3n)
}

/// Γvib = Γ3N − Γtrans − Γrot, given Γ3N as multiplicities in g (a linear group's irreps for
/// C∞v/D∞h).
pub fn vibrations_from_gamma_3n(g: &PointGroup, g3n: Vec<u64>) -> Result<Vibrations, String> {
    // Translations: irreps (pairs counted on their first row) carrying x, y, z.
    let trans = column(g, |ir| ir.functions.linear.len());
    if g.is_linear() {
        let lr_multiplicities = g3n;
        // Rotations of a linear molecule: only the tuple (Rx, Ry).
        let rot = column(g, |ir| {
            ir.functions
                .rotation
                .iter()
                .filter(|t| t.dim() == 2)
                .count()
        });
        let after_t = subtract(&lr_multiplicities, &trans)?;
        let vib = subtract(&after_t, &rot)?;
        let n_modes = dims(g, &vib);
        return Ok(Vibrations {
            gamma_3n: lr_multiplicities,
            translations: trans,
            rotations: rot,
            vibrations: vib,
            n_modes,
        });
    }
    // A complex pair's functions are listed on its first row; both rows count.
    let with_pairs = |m: Vec<u64>| -> Vec<u64> {
        let mut out = m.clone();
        for (i, ir) in g.table.irreps.iter().enumerate() {
            if let Some(p) = ir.pair {
                if m[i] > 0 {
                    out[p] = out[p].max(m[i]);
                }
            }
        }
        out
    };
    let trans = with_pairs(trans);
    let rot = with_pairs(column(g, |ir| ir.functions.rotation.len()));
    let vib = subtract(&subtract(&g3n, &trans)?, &rot)?;
    let n_modes = dims(g, &vib);
    Ok(Vibrations {
        gamma_3n: g3n,
        translations: trans,
        rotations: rot,
        vibrations: vib,
        n_modes,
    })
}
