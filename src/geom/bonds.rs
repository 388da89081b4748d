//! Bond perception from covalent radii: atoms i, j are bonded when
//! d(i, j) ≤ factor · (r_i + r_j), with Cordero radii (see [`super::elements`]). The
//! default factor 1.15 follows common practice in molecular viewers and converters (a
//! 10–20 % margin over the sum of covalent radii). A spatial hash keeps the cost about
//! linear in the number of atoms.

use super::elements;
use super::grid::Grid;
use super::linalg::V3;
use super::molecule::{check_positive, Molecule};
use super::GeomError;

/// Default tolerance factor on the sum of covalent radii.
pub const DEFAULT_BOND_FACTOR: f64 = 1.15;

/// Radius used for elements without a Cordero radius (Z > 96), Å.
pub const FALLBACK_RADIUS: f64 = 1.5;

/// Bonds as sorted pairs `(i, j)`, `i < j`, ordered by `i` then `j`.
pub fn perceive_bonds(mol: &Molecule, factor: f64) -> Result<Vec<(usize, usize)>, GeomError> {
    check_positive("bond factor", factor)?;
    if mol.atoms.is_empty() {
        return Ok(Vec::new());
    }
    mol.validate()?;
    let radius: Vec<f64> = mol
        .atoms
        .iter()
        .map(|a| elements::covalent_radius(a.element).unwrap_or(FALLBACK_RADIUS))
        .collect();
    let rmax = radius.iter().cloned().fold(0.0, f64::max);
    let cutoff = factor * 2.0 * rmax;
    let pos: Vec<V3> = mol.atoms.iter().map(|a| a.position).collect();
    let grid = Grid::new(&pos, cutoff.max(0.5));
    let mut bonds = Vec::new();
    for (i, p) in pos.iter().enumerate() {
        grid.for_each_within(p, cutoff, |j, d| {
            if j > i && d <= factor * (radius[i] + radius[j]) {
                bonds.push((i, j));
            }
        });
    }
    bonds.sort_unstable();
    Ok(bonds)
}
