//! Projection and transfer operators on a basis, exactly.
//!
//! P^Γ = (d/h) Σ_R χ^Γ(R)* R projects onto Γ's isotypic part; the transfer operators
//! P_ij = (d/h) Σ_R D(R⁻¹)_ji R satisfy P_ij s_k = δ_jk s_i for partners transforming by D
//! (Cotton, 3rd ed., §4.5 and §8.2; valid for any, not only unitary, irrep matrices by Schur's
//! orthogonality). The worked projection prints, per operation, the image of one generating
//! member times the character, as it is done by hand.

use super::irreps::RealIrrep;
use crate::basis::{Basis, Column};
use crate::exact::Cyclo;

/// Index of each operation's inverse.
pub fn inverses(b: &Basis) -> Vec<usize> {
    let g = &b.group;
    (0..g.order()).map(|o| g.inverse(o)).collect()
}

/// P_ij applied to a dense vector, without the factor d/h (SALCs are normalized afterwards).
pub fn transfer(
    b: &Basis,
    ir: &RealIrrep,
    inv: &[usize],
    i: usize,
    j: usize,
    v: &[Cyclo],
) -> Vec<Cyclo> {
    let mut out = vec![Cyclo::zero(); v.len()];
    for o in 0..b.images.ops() {
        let f = &ir.mats[inv[o]][j][i];
        if f.is_zero() {
            continue;
        }
        for (m, x) in v.iter().enumerate() {
            if x.is_zero() {
                continue;
            }
            let fx = f * x;
            for (k, c) in b.images.col(o, m) {
                out[k] += &(c * &fx);
            }
        }
    }
    out
}

/// P_1k e_m for k = 1 … d: the partner-1 vectors a member generates (without d/h).
pub fn partner_one_images(b: &Basis, ir: &RealIrrep, inv: &[usize], m: usize) -> Vec<Vec<Cyclo>> {
    let n = b.dim();
    let mut out = vec![vec![Cyclo::zero(); n]; ir.dim];
    for o in 0..b.images.ops() {
        let a = &ir.mats[inv[o]];
        for (k, acc) in out.iter_mut().enumerate() {
            let f = &a[k][0];
            if f.is_zero() {
                continue;
            }
            for (t, c) in b.images.col(o, m) {
                acc[t] += &(c * f);
            }
        }
    }
    out
}

/// One line of a worked projection.
#[derive(Debug, Clone)]
pub struct WorkedLine {
    pub operation: String,
    pub image: Column,
    pub chi: Cyclo,
}

/// The worked projection of one member onto one irrep with its character.
#[derive(Debug, Clone)]
pub struct Worked {
    pub member: usize,
    pub irrep: String,
    pub lines: Vec<WorkedLine>,
    /// Σ_R χ(R) R·member, unnormalized.
    pub sum: Vec<Cyclo>,
}

/// Σ_R χ(R)·R·m, line by line.
pub fn worked_projection(b: &Basis, ir: &RealIrrep, m: usize) -> Worked {
    let mut sum = vec![Cyclo::zero(); b.dim()];
    let mut lines = Vec::with_capacity(b.group.order());
    for (o, op) in b.group.ops.iter().enumerate() {
        let chi = ir.chi(o);
        let image = b.images.column(o, m);
        if !chi.is_zero() {
            for (k, c) in &image {
                sum[*k] += &(c * &chi);
            }
        }
        lines.push(WorkedLine {
            operation: op.name.clone(),
            image,
            chi,
        });
    }
    Worked {
        member: m,
        irrep: ir.label.clone(),
        lines,
        sum,
    }
}
