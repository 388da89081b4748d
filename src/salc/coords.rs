//! Symmetry coordinates (SALCs of the 3N Cartesian displacements with translations and rotations
//! separated), SALCs of internal coordinates with their redundant combinations marked, and
//! ligand group orbitals beside the central-atom orbitals of the same irrep.
//!
//! Rotations depend on the geometry: each set of equivalent atoms is idealized exactly — the
//! representative position is written in an exact basis of its site group's fixed space, its
//! coordinates rounded to a common grid (each atom moves by at most 0.005 Å), and carried to the other atoms by
//! exact operations — so the rotation vectors eᵢ × r_a are exact (Wilson, Decius & Cross,
//! *Molecular Vibrations*, §2-6 and ch. 6).

use super::build::{salcs, salcs_with_presets, Preset, Role, SalcError, SalcSet};
use super::irreps::real_irreps;
use crate::basis::{self, Basis, Structure};
use crate::exact::{solve_field, Cyclo};
use num_bigint::BigInt;
use num_rational::BigRational;

type Vec3 = [Cyclo; 3];

/// A fraction within `tol` of v with the smallest denominator found by continued fractions.
pub fn nearby_fraction(v: f64, tol: f64) -> BigRational {
    let (mut h0, mut h1, mut k0, mut k1) = (0i128, 1i128, 1i128, 0i128);
    let mut x = v;
    for _ in 0..60 {
        let a = x.floor() as i128;
        let (h2, k2) = (a * h1 + h0, a * k1 + k0);
        (h0, h1, k0, k1) = (h1, h2, k1, k2);
        if ((h1 as f64) / (k1 as f64) - v).abs() <= tol || k1 > 1 << 40 {
            break;
        }
        let f = x - x.floor();
        if f < 1e-300 {
            break;
        }
        x = 1.0 / f;
    }
    BigRational::new(BigInt::from(h1), BigInt::from(k1))
}

/// Exact idealized positions of every atom (see the module docs).
pub fn exact_positions(s: &Structure) -> Result<Vec<Vec3>, SalcError> {
    let g = &s.group;
    let mut out: Vec<Option<Vec3>> = vec![None; s.len()];
    for orbit in s.atom_orbits() {
        let r = orbit[0];
        let stab: Vec<usize> = (0..g.order()).filter(|&o| s.perm[o][r] == r).collect();
        // columns of Σ_stab s span the fixed space
        let mut sum: [[Cyclo; 3]; 3] =
            std::array::from_fn(|_| std::array::from_fn(|_| Cyclo::zero()));
        for &o in &stab {
            for i in 0..3 {
                for j in 0..3 {
                    sum[i][j] += &g.ops[o].matrix[i][j];
                }
            }
        }
        let mut basis: Vec<Vec<Cyclo>> = Vec::new();
        for j in 0..3 {
            let c: Vec<Cyclo> = (0..3).map(|i| sum[i][j].clone()).collect();
            if c.iter().all(Cyclo::is_zero) {
                continue;
            }
            if basis.is_empty() || solve_field(&basis, &c).is_none() {
                basis.push(c);
            }
        }
        let p = s.atoms[r].position;
        let p0: Vec3 = if basis.is_empty() {
            std::array::from_fn(|_| Cyclo::zero())
        } else {
            let bf = nalgebra::DMatrix::from_fn(3, basis.len(), |i, k| basis[k][i].re_f64());
            let pv = nalgebra::DVector::from_column_slice(p.as_slice());
            let alpha = bf
                .clone()
                .svd(true, true)
                .solve(&pv, 1e-12)
                .map_err(|e| SalcError::Other(e.to_string()))?;
            // One grid for every coordinate: steps of 1/(100·⌈|b|⌉) along b, so each position
            // moves by at most 0.005 Å and all positions share a few small denominators. Finer
            // or per-number fractions make the rotation vectors' denominators multiply across
            // atoms, and the exact orthogonalization against them blow up in size and time.
            let steps: Vec<i64> = basis
                .iter()
                .map(|b| {
                    let len = b.iter().map(|x| x.re_f64().powi(2)).sum::<f64>().sqrt();
                    100 * (len.ceil() as i64).max(1)
                })
                .collect();
            std::array::from_fn(|i| {
                basis
                    .iter()
                    .zip(alpha.iter())
                    .zip(&steps)
                    .map(|((b, a), &k)| {
                        let q = BigRational::new(
                            BigInt::from((a * k as f64).round() as i64),
                            BigInt::from(k),
                        );
                        b[i].scale(&q)
                    })
                    .sum()
            })
        };
        for &a in &orbit {
            let o = (0..g.order())
                .find(|&o| s.perm[o][r] == a)
                .expect("orbit member is reached");
            let m = &g.ops[o].matrix;
            out[a] = Some(std::array::from_fn(|i| {
                (0..3).map(|j| &m[i][j] * &p0[j]).sum()
            }));
        }
    }
    Ok(out
        .into_iter()
        .map(|p| p.expect("every atom is in an orbit"))
        .collect())
}

/// Real irreps of a basis, each repeated once per copy.
fn irreps_of(b: &Basis, irreps: &[super::irreps::RealIrrep]) -> Result<Vec<usize>, SalcError> {
    let m = super::build::real_multiplicities(b, irreps)?;
    Ok((0..m.len())
        .flat_map(|x| std::iter::repeat_n(x, m[x] as usize))
        .collect())
}

/// Symmetry coordinates: SALCs of the Cartesian displacements, translations and rotations first
/// in their irreps (roles `Translation`, `Rotation`), 3N − 6 vibrational ones (`Plain`).
pub fn symmetry_coordinates(s: &Structure) -> Result<SalcSet, SalcError> {
    let cart = basis::cartesian(s)?;
    let irreps = real_irreps(&s.group)?;
    let trans_irreps = irreps_of(&basis::translations(s), &irreps)?;
    let rot_irreps = irreps_of(&basis::rotations(s), &irreps)?;
    let pos = exact_positions(s)?;
    let n3 = 3 * s.len();
    let mut presets = Vec::new();
    for i in 0..3 {
        let mut v = vec![Cyclo::zero(); n3];
        for a in 0..s.len() {
            v[3 * a + i] = Cyclo::one();
        }
        presets.push(Preset {
            vector: v,
            role: Role::Translation,
            irreps: trans_irreps.clone(),
        });
    }
    for i in 0..3 {
        // displacement eᵢ × r_a on every atom
        let mut v = vec![Cyclo::zero(); n3];
        let (j, k) = ((i + 1) % 3, (i + 2) % 3);
        for (a, p) in pos.iter().enumerate() {
            v[3 * a + k] = p[j].clone();
            v[3 * a + j] = -p[k].clone();
        }
        presets.push(Preset {
            vector: v,
            role: Role::Rotation,
            irreps: rot_irreps.clone(),
        });
    }
    let mut set = salcs_with_presets(&cart, &presets, None)?;
    set.notes.push(
        "rotations use positions idealized to exact symmetric values (on a grid of 0.01 Å or finer)"
            .into(),
    );
    Ok(set)
}

/// SALCs of an internal-coordinate set (stretches followed by bends), with the combinations
/// that are redundant by the geometry marked `Redundant`, and notes for redundancies that mix
/// several SALCs.
pub fn internal_coordinates(
    s: &Structure,
    stretch: &Basis,
    bend: &Basis,
) -> Result<SalcSet, SalcError> {
    let joined = stretch.joined(bend);
    let mut set = salcs(&joined)?;
    let vib = basis::vibrations(s)?;
    let red = basis::redundancy(stretch, bend, &vib)?;
    let b_s = basis::b_matrix(s, stretch)?;
    let b_b = basis::b_matrix(s, bend)?;
    let rows: Vec<&Vec<f64>> = b_s.iter().chain(&b_b).collect();
    let n3 = 3 * s.len();
    for (x, ir) in set.irreps.clone().iter().enumerate() {
        let want = red.redundant[ir.row] as usize;
        if want == 0 {
            continue;
        }
        // copies whose partner-1 SALC produces no Cartesian displacement: Σ_m c_m B_m = 0
        let mut hits = Vec::new();
        for sc in set.salcs.iter().filter(|c| c.irrep == x && c.partner == 1) {
            let f = sc.floats();
            let mut disp = vec![0.0; n3];
            for (c, row) in f.iter().zip(&rows) {
                for (d, b) in disp.iter_mut().zip(row.iter()) {
                    *d += c * b;
                }
            }
            if disp.iter().map(|d| d * d).sum::<f64>().sqrt() < 1e-6 {
                hits.push(sc.copy);
            }
        }
        for sc in set.salcs.iter_mut() {
            if sc.irrep == x && hits.contains(&sc.copy) {
                sc.role = Role::Redundant;
            }
        }
        if hits.len() != want {
            set.notes.push(format!(
                "{}: {} redundant combination(s) mix several SALCs; {} marked",
                ir.label,
                want,
                hits.len()
            ));
        }
    }
    for ir in set.irreps.iter() {
        if red.missing[ir.row] > 0 {
            set.notes.push(format!(
                "the set does not cover {} copy(ies) of {} in Γvib",
                red.missing[ir.row], ir.label
            ));
        }
    }
    Ok(set)
}

/// A ligand SALC irrep with the central-atom orbitals of the same symmetry.
#[derive(Debug, Clone)]
pub struct Matching {
    /// Index into the real irreps.
    pub irrep: usize,
    /// Orbitals named by their real function (`dz2`), or `s`, `p`, `d`, `f` with a count when
    /// the shell's part in the irrep is no single named orbital.
    pub central: Vec<String>,
}

/// Central-atom orbitals (s, p, d, f) beside every irrep the ligand SALCs span.
pub fn central_matches(set: &SalcSet) -> Vec<Matching> {
    super::display::central_orbital_matches(set, 3, None)
}
