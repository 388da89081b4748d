//! A molecule standing in its point group's standard orientation: atoms, bonds and, for every
//! operation of the group, the permutation it makes of the atoms.
//!
//! Owns the link between floating-point geometry and the exact group: an operation's float
//! matrix is applied to each position and the image matched to an atom of the same element
//! within a stated tolerance (Å). Everything downstream of the permutation is exact.

use super::BasisError;
use crate::geom::grid::Grid;
use crate::group::PointGroup;
use nalgebra::Vector3;
use std::sync::Arc;

/// One atom as the basis layer sees it.
#[derive(Debug, Clone)]
pub struct Placed {
    /// Element symbol, e.g. `C`, `Cl`; atoms only match atoms with the same symbol.
    pub symbol: String,
    /// Position in Å in the group's standard orientation (centre of symmetry at the origin).
    pub position: Vector3<f64>,
}

/// A molecule in standard orientation with the atom permutation of every operation.
#[derive(Debug, Clone)]
pub struct Structure {
    pub group: Arc<PointGroup>,
    pub atoms: Vec<Placed>,
    /// Bonds as pairs of atom indices (0-based), smaller index first.
    pub bonds: Vec<(usize, usize)>,
    /// `perm[op][a]` = the atom that operation `op` carries atom `a` onto.
    pub perm: Vec<Vec<usize>>,
    /// Matching tolerance in Å.
    pub tol: f64,
}

impl Structure {
    /// A molecule already in the group's standard orientation (`geom::orient`), matched with a
    /// slack that covers the detection's largest deviation: max(tol, 2·deviation + tol) Å.
    pub fn from_oriented(
        group: Arc<PointGroup>,
        molecule: &crate::geom::Molecule,
        bonds: Vec<(usize, usize)>,
        tolerance: f64,
        max_deviation: f64,
    ) -> Result<Self, BasisError> {
        let atoms = molecule
            .atoms
            .iter()
            .map(|a| Placed {
                symbol: a.symbol().to_string(),
                position: a.position,
            })
            .collect();
        let slack = tolerance.max(2.0 * max_deviation + tolerance);
        Self::new(group, atoms, bonds, slack)
    }

    /// Place atoms in a finite group and find every operation's permutation.
    pub fn new(
        group: Arc<PointGroup>,
        atoms: Vec<Placed>,
        bonds: Vec<(usize, usize)>,
        tol: f64,
    ) -> Result<Self, BasisError> {
        if group.is_linear() {
            return Err(BasisError::LinearGroup {
                group: group.name().to_string(),
                descent: group.table.descent.clone().unwrap_or_default(),
            });
        }
        if atoms.is_empty() {
            return Err(BasisError::NoAtoms);
        }
        let mut clean = Vec::with_capacity(bonds.len());
        for (k, &(a, b)) in bonds.iter().enumerate() {
            if a >= atoms.len() || b >= atoms.len() || a == b {
                return Err(BasisError::BadBond {
                    bond: k + 1,
                    atoms: (a + 1, b + 1),
                    n_atoms: atoms.len(),
                });
            }
            clean.push((a.min(b), a.max(b)));
        }
        // each image looked up in a spatial grid (a scan over all atoms per image took
        // minutes for a 100,000-atom cluster); the operations side by side
        let points: Vec<Vector3<f64>> = atoms.iter().map(|a| a.position).collect();
        let grid = Grid::new(&points, tol.max(0.5));
        use rayon::prelude::*;
        let perm = group
            .ops
            .par_iter()
            .map(|op| -> Result<Vec<usize>, BasisError> {
                let mut p = Vec::with_capacity(atoms.len());
                for (a, atom) in atoms.iter().enumerate() {
                    let image = op.float * atom.position;
                    // the first atom (lowest number) of the element within tol
                    let mut hit: Option<usize> = None;
                    grid.for_each_within(&image, tol, |b, d| {
                        if d < tol && atoms[b].symbol == atom.symbol && hit.is_none_or(|h| b < h) {
                            hit = Some(b);
                        }
                    });
                    match hit {
                        Some(b) => p.push(b),
                        None => {
                            let nearest = atoms
                                .iter()
                                .filter(|b| b.symbol == atom.symbol)
                                .map(|b| (b.position - image).norm())
                                .fold(f64::INFINITY, f64::min);
                            return Err(BasisError::NotSymmetric {
                                operation: op.name.clone(),
                                atom: a + 1,
                                symbol: atom.symbol.clone(),
                                distance: nearest,
                                tol,
                            });
                        }
                    }
                }
                Ok(p)
            })
            .collect::<Vec<_>>()
            .into_iter()
            .collect::<Result<Vec<_>, _>>()?; // (the first failing operation in table order)
        Ok(Structure {
            group,
            atoms,
            bonds: clean,
            perm,
            tol,
        })
    }

    /// Number of atoms N.
    pub fn len(&self) -> usize {
        self.atoms.len()
    }
    pub fn is_empty(&self) -> bool {
        self.atoms.is_empty()
    }

    /// Chemist's label of atom `a` (0-based in, 1-based out): `C1`, `H5`.
    pub fn label(&self, a: usize) -> String {
        format!("{}{}", self.atoms[a].symbol, a + 1)
    }

    /// Is every atom on a straight line through the origin (a linear molecule)?
    pub fn is_linear_molecule(&self) -> bool {
        let far = self
            .atoms
            .iter()
            .map(|a| a.position)
            .max_by(|p, q| p.norm().total_cmp(&q.norm()));
        let Some(dir) = far.filter(|d| d.norm() > self.tol) else {
            return self.atoms.len() <= 1;
        };
        let u = dir.normalize();
        self.atoms
            .iter()
            .all(|a| (a.position - u * a.position.dot(&u)).norm() < self.tol)
    }

    /// Index of the atom sitting at the origin (the central atom of a complex), if any.
    pub fn atom_at_origin(&self) -> Option<usize> {
        self.atoms.iter().position(|a| a.position.norm() < self.tol)
    }

    /// Orbits of atoms under the group (each sorted, orbits ordered by first atom).
    pub fn atom_orbits(&self) -> Vec<Vec<usize>> {
        orbits(self.atoms.len(), |op, a| self.perm[op][a], self.perm.len())
    }
}

/// Orbits of `n` points under `n_ops` operations acting by `image(op, point)`.
pub fn orbits(n: usize, image: impl Fn(usize, usize) -> usize, n_ops: usize) -> Vec<Vec<usize>> {
    let mut seen = vec![false; n];
    let mut out = Vec::new();
    for start in 0..n {
        if seen[start] {
            continue;
        }
        let mut orbit: Vec<usize> = (0..n_ops).map(|op| image(op, start)).collect();
        orbit.push(start);
        orbit.sort_unstable();
        orbit.dedup();
        for &m in &orbit {
            seen[m] = true;
        }
        out.push(orbit);
    }
    out
}
