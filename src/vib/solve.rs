//! The harmonic problem: mass-weighting, projection of translations and rotations (five for
//! a linear molecule), and the symmetric eigen-solve — dense, or block by block in the
//! first-partner SALCs of each irrep (Wilson, Decius & Cross, *Molecular Vibrations*, ch. 2
//! and §6-2: the GF problem factors by symmetry species, each degenerate set once).

use super::action::Action;
use nalgebra::{DMatrix, DVector, SymmetricEigen, Vector3};

/// One solution: an eigenvalue of the projected mass-weighted Hessian (hartree/(bohr²·u))
/// standing for `dim` degenerate modes when it comes from a block.
#[derive(Debug, Clone)]
pub struct RawMode {
    pub lambda: f64,
    /// Working-group real irrep, when known from the block.
    pub irrep: Option<usize>,
    /// Share of the mode (dense) or of H·x (blocked) in that irrep.
    pub purity: f64,
    /// Weights per irrep (dense path), else empty.
    pub weights: Vec<f64>,
}

/// Translations and rotations of the molecule in mass-weighted coordinates, orthonormal
/// (rank 5 for a linear molecule, 3 for an atom). Positions in Å, masses in u.
pub fn external_modes(positions: &[Vector3<f64>], masses: &[f64]) -> Vec<DVector<f64>> {
    let n = positions.len();
    let total: f64 = masses.iter().sum();
    let com = positions
        .iter()
        .zip(masses)
        .fold(Vector3::zeros(), |s, (p, m)| s + p * *m)
        / total;
    let mut raw = Vec::new();
    for k in 0..3 {
        let mut v = DVector::zeros(3 * n);
        for a in 0..n {
            v[3 * a + k] = masses[a].sqrt();
        }
        raw.push(v);
    }
    for k in 0..3 {
        let mut axis = Vector3::zeros();
        axis[k] = 1.0;
        let mut v = DVector::zeros(3 * n);
        for a in 0..n {
            let d = axis.cross(&(positions[a] - com)) * masses[a].sqrt();
            for i in 0..3 {
                v[3 * a + i] = d[i];
            }
        }
        raw.push(v);
    }
    // a rotation about the axis of a (nearly) linear molecule is no external mode
    let largest = raw[3..].iter().map(|v| v.norm()).fold(0.0, f64::max);
    raw.retain(|v| v.norm() > 1e-5 * largest);
    orthonormal(raw, 1e-6)
}

/// Gram–Schmidt (twice) keeping vectors whose remainder exceeds `rel` of their length;
/// vectors shorter than 1e-9 are taken as zero (use on vectors of order one).
pub fn orthonormal(vs: Vec<DVector<f64>>, rel: f64) -> Vec<DVector<f64>> {
    let mut out: Vec<DVector<f64>> = Vec::new();
    for mut v in vs {
        let before = v.norm();
        if before < 1e-9 {
            continue;
        }
        for _ in 0..2 {
            for u in &out {
                let p = u.dot(&v);
                v.axpy(-p, u, 1.0);
            }
        }
        let after = v.norm();
        if after > rel * before {
            out.push(v / after);
        }
    }
    out
}

/// M^{-1/2} H M^{-1/2}.
pub fn mass_weighted(h: &DMatrix<f64>, masses: &[f64]) -> DMatrix<f64> {
    let s: Vec<f64> = masses
        .iter()
        .flat_map(|m| std::iter::repeat_n(1.0 / m.sqrt(), 3))
        .collect();
    DMatrix::from_fn(h.nrows(), h.ncols(), |i, j| h[(i, j)] * s[i] * s[j])
}

/// Dense: eigen-solve P H P (P removes the external modes), drop the external eigenvectors,
/// weigh each vibration on every irrep of `action` (when given).
pub fn dense(hmw: &DMatrix<f64>, ext: &[DVector<f64>], action: Option<&Action>) -> Vec<RawMode> {
    let n = hmw.nrows();
    let mut p = DMatrix::identity(n, n);
    for d in ext {
        p -= d * d.transpose();
    }
    let k = &p * hmw * &p;
    let eig = SymmetricEigen::new(k);
    // the external modes: the eigenvectors lying most in their span
    let mut overlap: Vec<(f64, usize)> = (0..n)
        .map(|i| {
            let v = eig.eigenvectors.column(i);
            (ext.iter().map(|d| d.dot(&v).powi(2)).sum(), i)
        })
        .collect();
    overlap.sort_by(|a, b| b.0.total_cmp(&a.0));
    let drop: std::collections::HashSet<usize> =
        overlap.iter().take(ext.len()).map(|t| t.1).collect();
    let mut out = Vec::new();
    for i in 0..n {
        if drop.contains(&i) {
            continue;
        }
        let v: Vec<f64> = eig.eigenvectors.column(i).iter().copied().collect();
        let (irrep, purity, weights) = match action {
            Some(a) => {
                let w: Vec<f64> = (0..a.irreps.len())
                    .map(|g| a.isotypic(g, &v).iter().map(|x| x * x).sum())
                    .collect();
                let best = (0..w.len()).max_by(|&x, &y| w[x].total_cmp(&w[y]));
                (best, best.map_or(1.0, |b| w[b]), w)
            }
            None => (None, 1.0, Vec::new()),
        };
        out.push(RawMode {
            lambda: eig.eigenvalues[i],
            irrep,
            purity,
            weights,
        });
    }
    out.sort_by(|a, b| a.lambda.total_cmp(&b.lambda));
    out
}

/// Blocked: per irrep, the first-partner SALCs B (sparse), the external modes removed inside
/// the block, K = Qᵀ Bᵀ H B Q solved; each eigenvalue stands for a degenerate set. Purity:
/// the share of H·x (external part removed) that stays in the block.
pub fn blocked(hmw: &DMatrix<f64>, ext: &[DVector<f64>], action: &Action) -> Vec<RawMode> {
    let n = hmw.nrows();
    let mut out = Vec::new();
    for g in 0..action.irreps.len() {
        let b = action.first_partner_salcs(g);
        if b.is_empty() {
            continue;
        }
        let k = b.len();
        // Y = H B (n×k), using the sparsity of B
        let mut y = DMatrix::zeros(n, k);
        for (c, (idx, val)) in b.iter().enumerate() {
            let mut col = y.column_mut(c);
            for (&t, &x) in idx.iter().zip(val) {
                col.axpy(x, &hmw.column(t), 1.0);
            }
        }
        let bt = |m: &DMatrix<f64>| -> DMatrix<f64> {
            DMatrix::from_fn(k, m.ncols(), |r, c| {
                b[r].0
                    .iter()
                    .zip(&b[r].1)
                    .map(|(&t, &x)| x * m[(t, c)])
                    .sum()
            })
        };
        let kb = bt(&y);
        // external modes inside the block
        let dm = DMatrix::from_columns(ext);
        let c = if ext.is_empty() {
            DMatrix::zeros(k, 0)
        } else {
            bt(&dm)
        };
        let cols: Vec<DVector<f64>> = c.column_iter().map(|x| x.into_owned()).collect();
        let u = orthonormal(cols, 1e-6);
        let units: Vec<DVector<f64>> = (0..k)
            .map(|i| {
                let mut e = DVector::zeros(k);
                e[i] = 1.0;
                e
            })
            .collect();
        let mut all = u.clone();
        all.extend(units);
        let q: Vec<DVector<f64>> = orthonormal(all, 1e-6).into_iter().skip(u.len()).collect();
        if q.is_empty() {
            continue;
        }
        let q = DMatrix::from_columns(&q);
        let kk = q.transpose() * &kb * &q;
        let kk = (&kk + kk.transpose()) * 0.5;
        let eig = SymmetricEigen::new(kk);
        for i in 0..eig.eigenvalues.len() {
            let coeff = &q * eig.eigenvectors.column(i); // in B
            let mut hx = &y * &coeff; // H x, x = B coeff
            for d in ext {
                let p = d.dot(&hx);
                hx.axpy(-p, d, 1.0);
            }
            let inside = q.transpose() * bt(&DMatrix::from_column_slice(n, 1, hx.as_slice()));
            let total = hx.norm_squared();
            let purity = if total < 1e-30 {
                1.0
            } else {
                (inside.norm_squared() / total).min(1.0)
            };
            out.push(RawMode {
                lambda: eig.eigenvalues[i],
                irrep: Some(g),
                purity,
                weights: Vec::new(),
            });
        }
    }
    out.sort_by(|a, b| a.lambda.total_cmp(&b.lambda));
    out
}
