//! How the working group acts on 3N Cartesian displacements, in floating point: an operation
//! R carries the displacement eⱼ on atom a to Σᵢ Rᵢⱼ eᵢ on atom R(a) (Wilson, Decius & Cross,
//! *Molecular Vibrations*, ch. 6). Also the float real irreps (characters and matrices, from
//! the exact ones of `salc::real_irreps`), the departure of a Hessian from the group's
//! symmetry and its symmetrization.

use crate::group::PointGroup;
use crate::salc;
use nalgebra::{DMatrix, Matrix3};

/// A real irrep in floating point.
#[derive(Debug, Clone)]
pub struct FloatIrrep {
    /// ASCII label (`E` for a complex-conjugate pair).
    pub label: String,
    pub dim: usize,
    /// Real character per operation.
    pub chi: Vec<f64>,
    /// Matrices per operation (d×d), for the first-partner projector.
    pub mats: Vec<DMatrix<f64>>,
    /// Dimension of one complex component (dim/2 for a pair), for the isotypic projector.
    pub component_dim: usize,
}

/// The group acting on one molecule's displacements.
#[derive(Debug, Clone)]
pub struct Action {
    pub ops: Vec<Matrix3<f64>>,
    /// Atom permutation per operation.
    pub perm: Vec<Vec<usize>>,
    /// Index of each operation's inverse.
    pub inv: Vec<usize>,
    /// First operation of each class.
    pub class_reps: Vec<usize>,
    pub irreps: Vec<FloatIrrep>,
}

impl Action {
    pub fn new(g: &PointGroup, perm: Vec<Vec<usize>>) -> Result<Self, String> {
        let real = salc::real_irreps(g).map_err(|e| e.to_string())?;
        let mut rows: Vec<&salc::RealIrrep> = real.iter().collect();
        rows.sort_by_key(|r| r.row);
        let irreps = rows
            .iter()
            .map(|r| FloatIrrep {
                label: r.label.clone(),
                dim: r.dim,
                chi: (0..g.order()).map(|o| r.chi(o).re_f64()).collect(),
                mats: r
                    .mats
                    .iter()
                    .map(|m| DMatrix::from_fn(r.dim, r.dim, |i, j| m[i][j].re_f64()))
                    .collect(),
                component_dim: if r.pair.is_some() { r.dim / 2 } else { r.dim },
            })
            .collect();
        let class_reps = (0..g.n_classes())
            .map(|c| g.ops.iter().position(|o| o.class == c).unwrap_or(0))
            .collect();
        Ok(Action {
            ops: g.ops.iter().map(|o| o.float).collect(),
            perm,
            inv: (0..g.order()).map(|o| g.inverse(o)).collect(),
            class_reps,
            irreps,
        })
    }

    pub fn order(&self) -> usize {
        self.ops.len()
    }

    /// out += c · O(op) v.
    pub fn apply_add(&self, op: usize, v: &[f64], c: f64, out: &mut [f64]) {
        let r = &self.ops[op];
        for (a, &b) in self.perm[op].iter().enumerate() {
            let x = [v[3 * a], v[3 * a + 1], v[3 * a + 2]];
            if x == [0.0; 3] {
                continue;
            }
            for i in 0..3 {
                out[3 * b + i] += c * (r[(i, 0)] * x[0] + r[(i, 1)] * x[1] + r[(i, 2)] * x[2]);
            }
        }
    }

    /// The isotypic projection P_Γ v = (d/h) Σ_R χ_Γ(R) O(R) v (Cotton, 3rd ed., §5.5).
    pub fn isotypic(&self, irrep: usize, v: &[f64]) -> Vec<f64> {
        let ir = &self.irreps[irrep];
        let f = ir.component_dim as f64 / self.order() as f64;
        let mut out = vec![0.0; v.len()];
        for o in 0..self.order() {
            if ir.chi[o] != 0.0 {
                self.apply_add(o, v, f * ir.chi[o], &mut out);
            }
        }
        out
    }

    /// O H Oᵀ for one operation (3×3 atom blocks moved and rotated).
    pub fn conjugate(&self, op: usize, h: &DMatrix<f64>) -> DMatrix<f64> {
        let n = self.perm[op].len();
        let r = self.ops[op];
        let mut out = DMatrix::zeros(3 * n, 3 * n);
        for a in 0..n {
            let pa = self.perm[op][a];
            for b in 0..n {
                let pb = self.perm[op][b];
                let blk = h.fixed_view::<3, 3>(3 * a, 3 * b);
                let m = r * blk * r.transpose();
                out.fixed_view_mut::<3, 3>(3 * pa, 3 * pb).copy_from(&m);
            }
        }
        out
    }

    /// Departure of H from the group's symmetry: max over class representatives of
    /// ‖O H Oᵀ − H‖_F / ‖H‖_F (commuting with one operation of every class is commuting with
    /// the group, since no proper subgroup meets every class).
    pub fn departure(&self, h: &DMatrix<f64>) -> f64 {
        let norm = h.norm().max(f64::MIN_POSITIVE);
        self.class_reps
            .iter()
            .map(|&o| (self.conjugate(o, h) - h).norm() / norm)
            .fold(0.0, f64::max)
    }

    /// (1/h) Σ_R O(R) H O(R)ᵀ: the totally symmetric part of H.
    pub fn symmetrize(&self, h: &DMatrix<f64>) -> DMatrix<f64> {
        let mut s = DMatrix::zeros(h.nrows(), h.ncols());
        for o in 0..self.order() {
            s += self.conjugate(o, h);
        }
        s / self.order() as f64
    }

    /// Atom orbits (each sorted, by first atom).
    pub fn orbits(&self) -> Vec<Vec<usize>> {
        let n = self.perm.first().map_or(0, |p| p.len());
        let mut seen = vec![false; n];
        let mut out = Vec::new();
        for a in 0..n {
            if seen[a] {
                continue;
            }
            let mut orbit: Vec<usize> = self.perm.iter().map(|p| p[a]).collect();
            orbit.sort_unstable();
            orbit.dedup();
            for &b in &orbit {
                seen[b] = true;
            }
            out.push(orbit);
        }
        out
    }

    /// Orthonormal first-partner SALCs of irrep Γ on the 3N displacements: vectors
    /// P^Γ_{k1} e for each orbit's first atom and axis (the transfer operators with the
    /// irrep's matrices, Wigner; here as in `salc::float_salcs`), Gram–Schmidt per orbit.
    /// Returned sparse: (indices, values) per column.
    pub fn first_partner_salcs(&self, irrep: usize) -> Vec<(Vec<usize>, Vec<f64>)> {
        let ir = &self.irreps[irrep];
        let n = self.perm.first().map_or(0, |p| p.len());
        let mut out = Vec::new();
        for orbit in self.orbits() {
            let a = orbit[0];
            let mut found: Vec<Vec<f64>> = Vec::new();
            for j in 0..3 {
                let mut e = vec![0.0; 3 * n];
                e[3 * a + j] = 1.0;
                for k in 0..ir.dim {
                    let mut v = vec![0.0; 3 * n];
                    for o in 0..self.order() {
                        let f = ir.mats[self.inv[o]][(k, 0)];
                        if f != 0.0 {
                            self.apply_add(o, &e, f, &mut v);
                        }
                    }
                    let before = v.iter().map(|x| x * x).sum::<f64>().sqrt();
                    if before < 1e-12 {
                        continue;
                    }
                    for u in &found {
                        let p: f64 = orbit
                            .iter()
                            .flat_map(|&b| 3 * b..3 * b + 3)
                            .map(|t| v[t] * u[t])
                            .sum();
                        for &b in &orbit {
                            for t in 3 * b..3 * b + 3 {
                                v[t] -= p * u[t];
                            }
                        }
                    }
                    let after = v.iter().map(|x| x * x).sum::<f64>().sqrt();
                    if after > 1e-7 * before {
                        v.iter_mut().for_each(|x| *x /= after);
                        found.push(v);
                    }
                }
            }
            for v in found {
                let idx: Vec<usize> = orbit.iter().flat_map(|&b| 3 * b..3 * b + 3).collect();
                let val = idx.iter().map(|&t| v[t]).collect();
                out.push((idx, val));
            }
        }
        out
    }
}
