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

/// Bonds the user adds to or removes from the perceived list, as 1-based atom numbers (the
/// order of the XYZ file or the session's atoms).
#[derive(Debug, Clone, Default, PartialEq, Eq, Hash)]
pub struct BondEdits {
    pub add: Vec<[usize; 2]>,
    pub remove: Vec<[usize; 2]>,
}

impl BondEdits {
    pub fn is_empty(&self) -> bool {
        self.add.is_empty() && self.remove.is_empty()
    }

    /// Apply the edits to `bonds` (0-based, sorted) of a molecule of `n_atoms` atoms. Adding a
    /// bond already present or removing one not present is an error (it usually means the atom
    /// numbers are off by one), as is an atom number outside 1..=n or a bond of an atom to itself.
    pub fn apply(
        &self,
        bonds: &[(usize, usize)],
        n_atoms: usize,
    ) -> Result<Vec<(usize, usize)>, String> {
        let pair = |what: &str, p: [usize; 2]| -> Result<(usize, usize), String> {
            for a in p {
                if a == 0 || a > n_atoms {
                    return Err(format!(
                        "{what} {}-{}: atom {a} does not exist (atoms are numbered 1 to {n_atoms})",
                        p[0], p[1]
                    ));
                }
            }
            if p[0] == p[1] {
                return Err(format!(
                    "{what} {}-{}: an atom cannot bond to itself",
                    p[0], p[1]
                ));
            }
            Ok((p[0].min(p[1]) - 1, p[0].max(p[1]) - 1))
        };
        let mut out: Vec<(usize, usize)> = bonds.to_vec();
        for &p in &self.remove {
            let b = pair("removed bond", p)?;
            let k = out.iter().position(|&x| x == b).ok_or_else(|| {
                format!(
                    "removed bond {}-{}: atoms {} and {} are not bonded",
                    p[0], p[1], p[0], p[1]
                )
            })?;
            out.remove(k);
        }
        for &p in &self.add {
            let b = pair("added bond", p)?;
            if out.contains(&b) {
                return Err(format!(
                    "added bond {}-{}: atoms {} and {} are already bonded",
                    p[0], p[1], p[0], p[1]
                ));
            }
            out.push(b);
        }
        out.sort_unstable();
        Ok(out)
    }
}

/// Read a bond written as `i-j` (1-based atom numbers), e.g. on the command line.
pub fn parse_bond(s: &str) -> Result<[usize; 2], String> {
    let (a, b) = s
        .split_once(['-', ','])
        .ok_or_else(|| format!("bond '{s}': expected two atom numbers as i-j, e.g. 1-5"))?;
    let num = |t: &str| {
        t.trim()
            .parse::<usize>()
            .map_err(|_| format!("bond '{s}': '{}' is not an atom number", t.trim()))
    };
    Ok([num(a)?, num(b)?])
}
