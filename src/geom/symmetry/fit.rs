//! Fitting a chosen group to the molecule: atom permutations for the generators (found
//! with the spatial hash, O(N) each) and for every other operation by composition along
//! the closure tree; the closest symmetric structure is the group average
//! yᵢ = (1/|G|) Σ_g g⁻¹·x_{P_g(i)} about the centre of mass (which the average keeps in
//! place); the frame is then re-fitted to it (Kabsch, rotation only) and the largest
//! displacement |xᵢ − yᵢ| is the detection's deviation — exactly what symmetrizing the
//! molecule to that group in that frame moves an atom.

use super::super::linalg::{closure, kabsch, M3, V3};
use super::groups::Family;
use super::search::Ctx;

/// Refinement rounds before the final evaluation.
const ROUNDS: usize = 2;

pub(crate) struct FitResult {
    pub frame: M3,
    pub ops: Vec<M3>,
    pub max_dev: f64,
}

fn is_permutation(p: &[usize]) -> bool {
    let mut seen = vec![false; p.len()];
    for &j in p {
        if j >= p.len() || std::mem::replace(&mut seen[j], true) {
            return false;
        }
    }
    true
}

/// Permutations of all operations: `perms[k][i] = j` with `ops[k]·xᵢ ≈ x_j` (frame
/// coordinates), or `None` if a generator does not map the molecule onto itself.
pub(crate) fn permutations(
    ctx: &Ctx,
    gens: &[M3],
    tree: &[Option<(usize, usize)>],
    frame: &M3,
    s: f64,
) -> Option<Vec<Vec<usize>>> {
    let n = ctx.pos.len();
    let mut gperm = Vec::with_capacity(gens.len());
    for g in gens {
        let m = frame.transpose() * g * frame;
        let mut p = Vec::with_capacity(n);
        for i in 0..n {
            let img = m * ctx.pos[i];
            let e = ctx.elem[i];
            let (j, _) = ctx.grid.nearest(&img, s, |j| ctx.elem[j] == e)?;
            p.push(j);
        }
        if !is_permutation(&p) {
            return None;
        }
        gperm.push(p);
    }
    let mut perms: Vec<Vec<usize>> = Vec::with_capacity(tree.len());
    for node in tree {
        let p = match node {
            None => (0..n).collect(),
            Some((parent, gi)) => perms[*parent].iter().map(|&k| gperm[*gi][k]).collect(),
        };
        perms.push(p);
    }
    Some(perms)
}

/// Group average of frame coordinates `q` under `ops` with `perms`.
pub(crate) fn group_average(q: &[V3], ops: &[M3], perms: &[Vec<usize>]) -> Vec<V3> {
    let inv = 1.0 / ops.len() as f64;
    (0..q.len())
        .map(|i| {
            let mut acc = V3::zeros();
            for (g, p) in ops.iter().zip(perms) {
                acc += g.transpose() * q[p[i]];
            }
            acc * inv
        })
        .collect()
}

/// Fits `family` starting from `frame`, matching atoms within `s`; `None` if some
/// generator fails.
pub(crate) fn fit(ctx: &Ctx, family: Family, frame: M3, s: f64) -> Option<FitResult> {
    let gens = family.generators();
    let cl = closure(&gens, 240)?;
    let mut frame = frame;
    for round in 0..=ROUNDS {
        let perms = permutations(ctx, &gens, &cl.tree, &frame, s)?;
        let q: Vec<V3> = ctx.pos.iter().map(|p| frame * p).collect();
        let y = group_average(&q, &cl.ops, &perms);
        let max_dev = q
            .iter()
            .zip(&y)
            .map(|(a, b)| (a - b).norm())
            .fold(0.0, f64::max);
        if round == ROUNDS || max_dev <= 1e-9 {
            return Some(FitResult {
                frame,
                ops: cl.ops,
                max_dev,
            });
        }
        // q ≈ r·y: the symmetric structure sits rotated by r.
        let r = kabsch(&y, &q);
        frame = r.transpose() * frame;
    }
    None
}
