//! Standard orientation: turn a detected molecule so that the class representatives of a
//! character table (given as matrices in the table's standard orientation) are symmetry
//! operations of the oriented molecule. The search runs over a finite candidate set on
//! top of the detected frame: the 24 proper signed permutations of the axes, each
//! followed by rotations about z by multiples of π/(2n) (n = principal order). That covers
//! the customary differences between conventions: which C2'/σv class lies on x, which
//! cubic/icosahedral setting, which way z points.

use nalgebra::{Matrix3, Vector3};

use super::grid::Grid;
use super::linalg::{is_orthogonal, rotation, M3, V3};
use super::molecule::Molecule;
use super::symmetry::Detection;
use super::GeomError;
use std::f64::consts::PI;

/// Options for [`orient_with`].
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct OrientOptions {
    /// Prefer the orientation turned by 90° about z: for planar C2v and D2h molecules this
    /// exchanges the two customary conventions (molecular plane yz ↔ xz).
    pub swap_xy: bool,
    /// Matching tolerance (Å); default 2·max_deviation + the detection tolerance.
    pub tolerance: Option<f64>,
}

/// A molecule in standard orientation.
#[derive(Debug, Clone, PartialEq)]
pub struct Oriented {
    /// The oriented molecule (centre at the origin).
    pub molecule: Molecule,
    /// Rotation used: oriented = rotation · (input − centre).
    pub rotation: Matrix3<f64>,
    /// Centre used, input coordinates.
    pub centre: Vector3<f64>,
}

/// [`orient_with`] with default options.
pub fn orient(
    mol: &Molecule,
    detection: &Detection,
    reps: &[(usize, Matrix3<f64>)],
) -> Result<Oriented, GeomError> {
    orient_with(mol, detection, reps, &OrientOptions::default())
}

/// The 24 proper signed permutation matrices, identity first.
fn signed_permutations() -> Vec<M3> {
    let perms = [
        [0, 1, 2],
        [1, 2, 0],
        [2, 0, 1],
        [1, 0, 2],
        [0, 2, 1],
        [2, 1, 0],
    ];
    let mut out = Vec::with_capacity(24);
    for p in perms {
        for signs in 0..8u8 {
            let mut m = M3::zeros();
            for (row, &col) in p.iter().enumerate() {
                m[(row, col)] = if signs >> row & 1 == 1 { -1.0 } else { 1.0 };
            }
            if m.determinant() > 0.0 {
                out.push(m);
            }
        }
    }
    out
}

/// Finds the standard orientation for the table whose class representatives are `reps`
/// (class index, matrix in the table's standard orientation).
pub fn orient_with(
    mol: &Molecule,
    detection: &Detection,
    reps: &[(usize, Matrix3<f64>)],
    options: &OrientOptions,
) -> Result<Oriented, GeomError> {
    mol.validate()?;
    for (k, (_, r)) in reps.iter().enumerate() {
        if !is_orthogonal(r, 1e-4) {
            return Err(GeomError::NotOrthogonal { index: k });
        }
    }
    let tol = options
        .tolerance
        .unwrap_or(2.0 * detection.max_deviation + detection.tolerance);
    if !(tol.is_finite() && tol > 0.0) {
        return Err(GeomError::InvalidParameter {
            what: "orientation tolerance",
            value: tol,
        });
    }
    let q: Vec<V3> = mol
        .atoms
        .iter()
        .map(|a| detection.frame * (a.position - detection.centre))
        .collect();
    let grid = Grid::new(&q, (2.0 * tol).max(0.5));
    let maps = |m: &M3| {
        q.iter().enumerate().all(|(i, p)| {
            let e = mol.atoms[i].element;
            grid.nearest(&(m * p), tol, |j| mol.atoms[j].element == e)
                .is_some()
        })
    };
    let n = detection
        .family()
        .map(|f| f.principal_order())
        .unwrap_or(1)
        .max(1);
    let mut cands = Vec::new();
    for p in signed_permutations() {
        for k in 0..4 * n {
            cands.push(rotation(&V3::z(), k as f64 * PI / (2 * n) as f64) * p);
        }
    }
    if options.swap_xy {
        let quarter = rotation(&V3::z(), PI / 2.0);
        cands = cands
            .iter()
            .map(|t| quarter * t)
            .chain(cands.clone())
            .collect();
    }
    let mut worst: Option<usize> = None;
    for t in &cands {
        // rep·(t·q) ≈ t·q  ⇔  tᵀ·rep·t maps q onto itself.
        match reps
            .iter()
            .position(|(_, r)| !maps(&(t.transpose() * r * t)))
        {
            None => {
                // Of the orientations this one is equivalent to, keep the one closest to
                // the input's own axes, so that an input already in standard orientation
                // stays as it is. Equivalent: turned by a rotation r that commutes with
                // every representative (r·t is then a solution too, with the same
                // convention, e.g. C3v turned by C2(z)), and with the atoms permuted by an
                // operation g of the group.
                let commutes = |r: &M3| {
                    reps.iter()
                        .all(|(_, m)| (r * m - m * r).iter().all(|x| x.abs() <= 1e-6))
                };
                // T and Th: their two settings (turned by 90° about z) are both standard
                // and no class tells them apart; any r mapping the group onto itself
                // keeps the convention.
                let std_ops: Vec<M3> = detection
                    .operations
                    .iter()
                    .map(|g| t * g * t.transpose())
                    .collect();
                let normalizes = |r: &M3| {
                    matches!(detection.group.as_str(), "T" | "Th")
                        && std_ops.iter().all(|g| {
                            let h = r * g * r.transpose();
                            std_ops
                                .iter()
                                .any(|o| (o - h).iter().all(|x| x.abs() <= 1e-6))
                        })
                };
                let rotation = cands
                    .iter()
                    .map(|c| c * t.transpose())
                    .filter(|r| commutes(r) || normalizes(r))
                    .flat_map(|r| {
                        detection
                            .operations
                            .iter()
                            .map(move |g| r * t * g * detection.frame)
                    })
                    .filter(|r| r.determinant() > 0.0)
                    .max_by(|a, b| a.trace().total_cmp(&b.trace()))
                    .unwrap_or(t * detection.frame);
                let mut m = mol.clone();
                for a in &mut m.atoms {
                    a.position = rotation * (a.position - detection.centre);
                }
                return Ok(Oriented {
                    molecule: m,
                    rotation,
                    centre: detection.centre,
                });
            }
            Some(k) => worst = Some(worst.map_or(k, |w: usize| w.max(k))),
        }
    }
    let reason = match worst {
        Some(k) => format!(
            "no candidate rotation makes the representative of class {} a symmetry \
             operation at {tol:.4} Å (are the representatives from the {} table?)",
            reps[k].0, detection.group
        ),
        None => "no candidate rotations".into(),
    };
    Err(GeomError::OrientationNotFound {
        group: detection.group.clone(),
        reason,
    })
}
