//! Atom permutations induced by an operation, and symmetrization (idealising a
//! geometry by averaging over a group). Operations act about the molecule's centre of
//! mass (for an oriented molecule, the origin).

use super::elements;
use super::grid::Grid;
use super::linalg::{close, closure, is_orthogonal, M3, V3};
use super::molecule::{check_positive, Molecule};
use super::GeomError;

fn centred(mol: &Molecule) -> (V3, Vec<V3>) {
    let c = mol.centre_of_mass();
    (c, mol.atoms.iter().map(|a| a.position - c).collect())
}

fn perm_in(
    mol: &Molecule,
    pos: &[V3],
    grid: &Grid,
    op: &M3,
    tol: f64,
) -> Result<Vec<usize>, GeomError> {
    let n = pos.len();
    let mut perm = Vec::with_capacity(n);
    let mut failed = Vec::new();
    for (i, p) in pos.iter().enumerate() {
        let img = op * p;
        let e = mol.atoms[i].element;
        match grid.nearest(&img, tol, |j| mol.atoms[j].element == e) {
            Some((j, _)) => perm.push(j),
            None => {
                failed.push((i, img));
                perm.push(usize::MAX);
            }
        }
    }
    if !failed.is_empty() {
        // Error path only: nearest same-element atom by brute force.
        let (atom, dev) = failed
            .iter()
            .map(|(i, img)| {
                let e = mol.atoms[*i].element;
                let d = pos
                    .iter()
                    .zip(&mol.atoms)
                    .filter(|(_, a)| a.element == e)
                    .map(|(q, _)| (q - img).norm())
                    .fold(f64::INFINITY, f64::min);
                (*i, d)
            })
            .max_by(|a, b| a.1.total_cmp(&b.1))
            .unwrap_or((0, f64::INFINITY));
        let sym = elements::symbol(mol.atoms[atom].element).unwrap_or("?");
        return Err(GeomError::NotSymmetric {
            atom,
            deviation: dev,
            tolerance: tol,
            detail: format!(
                "the image of atom {atom} ({sym}) lies {dev:.4} Å from the nearest {sym} atom \
                 ({} atom(s) fail)",
                failed.len()
            ),
        });
    }
    let mut owner = vec![usize::MAX; n];
    for (i, &j) in perm.iter().enumerate() {
        if owner[j] != usize::MAX {
            let sym = elements::symbol(mol.atoms[i].element).unwrap_or("?");
            return Err(GeomError::NotSymmetric {
                atom: i,
                deviation: 0.0,
                tolerance: tol,
                detail: format!(
                    "atoms {} and {i} ({sym}) both map onto atom {j}; the tolerance is too \
                     loose for this geometry",
                    owner[j]
                ),
            });
        }
        owner[j] = i;
    }
    Ok(perm)
}

/// The permutation `p` with `op·(x_i − c) ≈ x_{p[i]} − c` (c = centre of mass), matching
/// within `tol` Å; an error names the worst atom otherwise. O(N) with a spatial hash.
pub fn permutation(mol: &Molecule, op: &M3, tol: f64) -> Result<Vec<usize>, GeomError> {
    check_positive("tolerance", tol)?;
    mol.validate()?;
    if !is_orthogonal(op, 1e-6) {
        return Err(GeomError::NotOrthogonal { index: 0 });
    }
    let (_, pos) = centred(mol);
    let grid = Grid::new(&pos, (2.0 * tol).max(0.5));
    perm_in(mol, &pos, &grid, op, tol)
}

/// The permutation of every operation in `ops` (each as in [`permutation`]), with one
/// spatial hash for all. When `ops` is a group, only a generating set is matched in space
/// (O(N) each) and every other permutation is composed along the group's closure tree,
/// O(N) array lookups; otherwise each operation is matched on its own.
pub fn permutations(mol: &Molecule, ops: &[M3], tol: f64) -> Result<Vec<Vec<usize>>, GeomError> {
    check_positive("tolerance", tol)?;
    mol.validate()?;
    for (k, op) in ops.iter().enumerate() {
        if !is_orthogonal(op, 1e-6) {
            return Err(GeomError::NotOrthogonal { index: k });
        }
    }
    let (_, pos) = centred(mol);
    let grid = Grid::new(&pos, (2.0 * tol).max(0.5));
    let direct = |g: &M3| perm_in(mol, &pos, &grid, g, tol);
    let Some((gens, tree)) = generated(ops) else {
        return ops.iter().map(direct).collect();
    };
    let gperms = gens
        .iter()
        .map(|&k| direct(&ops[k]))
        .collect::<Result<Vec<_>, _>>()?;
    let n = pos.len();
    let mut perms: Vec<Vec<usize>> = vec![Vec::new(); ops.len()];
    for &(k, parent, g) in &tree {
        perms[k] = match parent {
            None => (0..n).collect(),
            Some(p) => perms[p].iter().map(|&a| gperms[g][a]).collect(),
        };
    }
    Ok(perms)
}

/// Indices of a generating set of the group `ops` (chosen greedily, in order), or of all
/// operations when `ops` is not exactly a group. Orbits and invariance under a group need
/// only its generators.
pub fn generator_indices(ops: &[M3]) -> Vec<usize> {
    match generated(ops) {
        Some((gens, _)) => gens,
        None => (0..ops.len()).collect(),
    }
}

/// A generating set of `ops` (indices, chosen greedily) and, for every operation, how it
/// is reached: `(index, parent index, generator)` with `ops[index] = gens[generator] ·
/// ops[parent]`, parents before children. `None` if `ops` is not exactly the group the set
/// generates.
#[allow(clippy::type_complexity)]
fn generated(ops: &[M3]) -> Option<(Vec<usize>, Vec<(usize, Option<usize>, usize)>)> {
    let find = |m: &M3| ops.iter().position(|o| close(o, m, 1e-6));
    let mut gens: Vec<usize> = Vec::new();
    loop {
        let mats: Vec<M3> = gens.iter().map(|&k| ops[k]).collect();
        let cl = closure(&mats, ops.len())?;
        if cl.ops.len() == ops.len() {
            // Map the closure onto `ops`; each element must be found exactly once.
            let idx: Vec<usize> = cl.ops.iter().map(find).collect::<Option<_>>()?;
            let mut seen = vec![false; ops.len()];
            for &k in &idx {
                if std::mem::replace(&mut seen[k], true) {
                    return None;
                }
            }
            let tree = cl
                .tree
                .iter()
                .enumerate()
                .map(|(i, node)| match node {
                    None => (idx[i], None, 0),
                    Some((parent, g)) => (idx[i], Some(idx[*parent]), *g),
                })
                .collect();
            return Some((gens, tree));
        }
        let next = ops
            .iter()
            .position(|o| !cl.ops.iter().any(|c| close(c, o, 1e-6)))?;
        gens.push(next);
    }
}

/// Idealises `mol` under the group `ops` (all operations, acting about the centre of
/// mass): xᵢ' = c + (1/|G|) Σ_g g⁻¹·(x_{P_g(i)} − c). Returns the symmetrized molecule
/// and the largest atom displacement (Å). Fails if `ops` is not a group or some operation
/// does not map the molecule onto itself within `tol`.
pub fn symmetrize(mol: &Molecule, ops: &[M3], tol: f64) -> Result<(Molecule, f64), GeomError> {
    check_positive("tolerance", tol)?;
    mol.validate()?;
    check_group(ops)?;
    let (c, pos) = centred(mol);
    let grid = Grid::new(&pos, (2.0 * tol).max(0.5));
    let perms = ops
        .iter()
        .map(|g| perm_in(mol, &pos, &grid, g, tol))
        .collect::<Result<Vec<_>, _>>()?;
    let inv = 1.0 / ops.len() as f64;
    let mut out = mol.clone();
    let mut worst = 0.0f64;
    for (i, atom) in out.atoms.iter_mut().enumerate() {
        let mut acc = V3::zeros();
        for (g, p) in ops.iter().zip(&perms) {
            acc += g.transpose() * pos[p[i]];
        }
        let new = c + acc * inv;
        worst = worst.max((new - atom.position).norm());
        atom.position = new;
    }
    Ok((out, worst))
}

/// Checks that `ops` are orthogonal, distinct and closed under multiplication.
pub(crate) fn check_group(ops: &[M3]) -> Result<(), GeomError> {
    if ops.is_empty() {
        return Err(GeomError::NotAGroup("no operations given".into()));
    }
    for (k, g) in ops.iter().enumerate() {
        if !is_orthogonal(g, 1e-6) {
            return Err(GeomError::NotOrthogonal { index: k });
        }
    }
    for (a, ga) in ops.iter().enumerate() {
        if ops[..a].iter().any(|gb| close(ga, gb, 1e-6)) {
            return Err(GeomError::NotAGroup(format!(
                "operation {a} is listed twice"
            )));
        }
    }
    match closure(ops, ops.len()) {
        Some(c) if c.ops.len() == ops.len() => Ok(()),
        _ => Err(GeomError::NotAGroup(
            "products of the operations are missing from the list".into(),
        )),
    }
}
