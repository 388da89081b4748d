//! Finding symmetry elements: candidate axes and mirror normals are generated from the
//! smallest non-collinear atom class (reference atoms a, a₂; directions a, a₂, a×a₂,
//! a+b, a₂+b, a−b, a₂−b, and normals of triangles a, b, c with |ab| = |bc| for Cn, n ≥ 3),
//! deduplicated, and each candidate operation is checked in O(N) with the spatial hash,
//! failing fast on the small class first. Why this is complete: every operation maps the
//! class onto itself; a C2 either contains a, or a + C2·a ≠ 0 lies on it, or it is ⟂ a and
//! then the same argument with a₂ (or a×a₂) applies; a Cn (n ≥ 3) not through a is normal
//! to the triangle a, Cn·a, Cn²·a; a plane not containing a is normal to a − σ·a, one
//! containing a but not a₂ to a₂ − σ·a₂, one containing both to a×a₂. Improper axes S2n
//! lie on the Cn axes, so they need no candidates of their own.

use std::collections::HashSet;

use super::super::grid::Grid;
use super::super::linalg::{kabsch, reflection, rotation, rotation_axis, sym_eigen, M3, V3};
use super::classes::{classes, Class};
use std::f64::consts::PI;

/// Highest rotation order tried on a candidate axis (orders above the supported 8 are
/// found only to be reported and reduced).
pub(crate) const MAX_TEST_ORDER: usize = 24;

/// Lines closer than this angle (radians) are the same symmetry element.
const SAME_LINE: f64 = 0.05;

/// Positions relative to the trial centre, elements, the spatial hash and the screening
/// tolerance.
pub(crate) struct Ctx {
    pub pos: Vec<V3>,
    pub elem: Vec<u8>,
    pub mass: Vec<f64>,
    pub grid: Grid,
    /// Screening tolerance: an image must land within `s` of an atom of its element.
    pub s: f64,
}

impl Ctx {
    pub(crate) fn new(pos: Vec<V3>, elem: Vec<u8>, mass: Vec<f64>, s: f64) -> Ctx {
        let grid = Grid::new(&pos, (2.0 * s).max(0.5));
        Ctx {
            pos,
            elem,
            mass,
            grid,
            s,
        }
    }

    /// Image partner of atom `i` under `op`, if within `tol`.
    #[inline]
    fn partner(&self, op: &M3, i: usize, tol: f64) -> Option<(usize, f64)> {
        let img = op * self.pos[i];
        let e = self.elem[i];
        self.grid.nearest(&img, tol, |j| self.elem[j] == e)
    }

    /// Whether every atom in `subset` has a partner within `tol`.
    pub(crate) fn maps_subset(&self, op: &M3, subset: &[usize], tol: f64) -> bool {
        subset.iter().all(|&i| self.partner(op, i, tol).is_some())
    }

    /// Partner of every atom within `tol` (not checked for bijectivity), or `None`.
    pub(crate) fn full_at(&self, op: &M3, tol: f64) -> Option<Vec<usize>> {
        (0..self.pos.len())
            .map(|i| self.partner(op, i, tol).map(|(j, _)| j))
            .collect()
    }

    /// Partner of every atom at the screening tolerance, or `None`.
    pub(crate) fn full(&self, op: &M3) -> Option<Vec<usize>> {
        self.full_at(op, self.s)
    }

    /// Whether `op` maps the whole molecule onto itself at the screening tolerance.
    pub(crate) fn passes(&self, op: &M3) -> bool {
        self.full(op).is_some()
    }

    /// Number of atoms within `s` of the line through the centre along `u` (unit).
    pub(crate) fn atoms_on_line(&self, u: &V3) -> usize {
        self.pos
            .iter()
            .filter(|p| (*p - u * u.dot(p)).norm() <= self.s)
            .count()
    }

    /// Number of atoms within `s` of the plane through the centre with normal `n` (unit).
    pub(crate) fn atoms_in_plane(&self, n: &V3) -> usize {
        self.pos.iter().filter(|p| n.dot(p).abs() <= self.s).count()
    }
}

/// A proper rotation axis and its highest order found (≤ [`MAX_TEST_ORDER`]).
#[derive(Debug, Clone)]
pub(crate) struct Axis {
    pub dir: V3,
    pub order: usize,
}

/// All symmetry elements found.
#[derive(Debug, Clone, Default)]
pub(crate) struct Found {
    pub axes: Vec<Axis>,
    pub mirrors: Vec<V3>,
    pub inversion: bool,
}

fn same_line(a: &V3, b: &V3) -> bool {
    a.dot(b).abs() >= SAME_LINE.cos()
}

/// Canonical sign: first clearly non-zero component positive.
fn canonical(u: &V3) -> V3 {
    for k in 0..3 {
        if u[k].abs() > 1e-6 {
            return if u[k] < 0.0 { -u } else { *u };
        }
    }
    *u
}

struct Candidates {
    axes: Vec<(V3, f64)>,
    mirrors: Vec<(V3, f64)>,
    /// The class used (checked first for fast rejection).
    small: Vec<usize>,
}

fn push(list: &mut Vec<(V3, f64)>, v: V3, weight: f64) {
    let n = v.norm();
    if n > 1e-9 && n.is_finite() {
        list.push((v / n, weight));
    }
}

/// Principal axes of the inertia tensor about the centre.
pub(crate) fn inertia_axes(ctx: &Ctx) -> [V3; 3] {
    let mut t = M3::zeros();
    for (p, m) in ctx.pos.iter().zip(&ctx.mass) {
        t += (M3::identity() * p.norm_squared() - p * p.transpose()) * *m;
    }
    sym_eigen(&t).1
}

fn candidates(ctx: &Ctx, classes: &[Class]) -> Candidates {
    let s = ctx.s;
    let p = &ctx.pos;
    let mut axes = Vec::new();
    let mut mirrors = Vec::new();
    for u in inertia_axes(ctx) {
        push(&mut axes, u, 2.0);
        push(&mut mirrors, u, 2.0);
    }
    let mut off: Vec<&Class> = classes.iter().filter(|c| c.radius > s).collect();
    off.sort_by(|a, b| {
        a.members
            .len()
            .cmp(&b.members.len())
            .then(a.radius.total_cmp(&b.radius))
    });
    // Perpendicular distance of q from the line along a.
    let perp = |a: &V3, q: &V3| (q - a * (a.dot(q) / a.norm_squared())).norm();
    let non_collinear = off.iter().find_map(|c| {
        let a = c.members[0];
        let (a2, d) = c
            .members
            .iter()
            .map(|&b| (b, perp(&p[a], &p[b])))
            .max_by(|x, y| x.1.total_cmp(&y.1))?;
        (d > 2.0 * s).then_some((*c, a, a2))
    });
    match non_collinear {
        Some((class, a, a2)) => {
            let (pa, pa2) = (p[a], p[a2]);
            let m = &class.members;
            for v in [pa, pa2] {
                push(&mut axes, v, 1.0);
            }
            let w = pa.cross(&pa2);
            let wr = w.norm() / (pa.norm() * pa2.norm());
            push(&mut axes, w, wr);
            push(&mut mirrors, w, wr);
            for &b in m {
                let pb = p[b];
                for r in [pa, pa2] {
                    let scale = r.norm() + pb.norm();
                    push(&mut axes, r + pb, (r + pb).norm() / scale);
                    push(&mut mirrors, r - pb, (r - pb).norm() / scale);
                }
            }
            // Cn, n >= 3, not through a: normal of the triangle a, b = Cn a, c = Cn b.
            for &b in m {
                if b == a {
                    continue;
                }
                let ab = p[b] - pa;
                let lab = ab.norm();
                if lab <= 2.0 * s {
                    continue;
                }
                for &c in m {
                    if c == a || c == b {
                        continue;
                    }
                    let bc = p[c] - p[b];
                    let lbc = bc.norm();
                    if (lab - lbc).abs() > 2.0 * s {
                        continue;
                    }
                    let u = ab.cross(&bc);
                    let wt = u.norm() / (lab * lbc);
                    if wt > 0.05 {
                        push(&mut axes, u, wt);
                    }
                }
            }
            Candidates {
                axes,
                mirrors,
                small: m.clone(),
            }
        }
        None => {
            // Every class lies on a line through the centre: elements must keep two
            // non-parallel such lines, so they lie along a, c or a×c.
            let mut small = Vec::new();
            if let Some(first) = off.first() {
                let a = p[first.members[0]];
                small.extend(&first.members);
                if let Some(c) = off
                    .iter()
                    .map(|cl| p[cl.members[0]])
                    .find(|c| perp(&a, c) > 2.0 * s)
                {
                    for v in [a, c, a.cross(&c)] {
                        push(&mut axes, v, 1.0);
                        push(&mut mirrors, v, 1.0);
                    }
                }
            }
            Candidates {
                axes,
                mirrors,
                small,
            }
        }
    }
}

/// Refines an operation's axis from the atom pairs it matched (Kabsch fit); for a
/// mirror the fit is of −x_i → x_j, a C2 about the normal.
fn refine(ctx: &Ctx, perm: &[usize], improper: bool, hint: &V3) -> V3 {
    let sign = if improper { -1.0 } else { 1.0 };
    let src: Vec<V3> = ctx.pos.iter().map(|p| p * sign).collect();
    let dst: Vec<V3> = perm.iter().map(|&j| ctx.pos[j]).collect();
    let r = kabsch(&src, &dst);
    rotation_axis(&r, hint)
}

/// Checks the operation `make(u)` for a candidate direction `u`: quick rejection on the
/// small class, a loose match (2·s) to refine the direction (candidate directions built
/// from a few noisy atoms can be off by several mrad), then the strict match at `s` on
/// the refined direction (or, failing that, on `u` itself). Returns the refined direction.
fn test_op(
    ctx: &Ctx,
    u: &V3,
    improper: bool,
    small: &[usize],
    make: impl Fn(&V3) -> M3,
) -> Option<V3> {
    let loose = 2.0 * ctx.s;
    let op = make(u);
    if !ctx.maps_subset(&op, small, loose) {
        return None;
    }
    let perm = ctx.full_at(&op, loose)?;
    let u1 = refine(ctx, &perm, improper, u);
    let (perm, base) = match ctx.full(&make(&u1)) {
        Some(p) => (p, u1),
        None => (ctx.full(&op)?, *u),
    };
    Some(refine(ctx, &perm, improper, &base))
}

/// Tests rotation orders on direction `u` (highest first) from `min_order` up; returns the
/// highest passing order with the refined axis.
fn best_order(ctx: &Ctx, u: &V3, small: &[usize], min_order: usize) -> Option<(usize, V3)> {
    let off = small
        .iter()
        .filter(|&&i| (ctx.pos[i] - u * u.dot(&ctx.pos[i])).norm() > ctx.s)
        .count();
    for n in (min_order.max(2)..=MAX_TEST_ORDER).rev() {
        if off > 0 && off % n != 0 {
            continue;
        }
        let angle = 2.0 * PI / n as f64;
        if let Some(dir) = test_op(ctx, u, false, small, |d| rotation(d, angle)) {
            return Some((n, dir));
        }
    }
    None
}

/// Searches all symmetry elements at the context's screening tolerance.
pub(crate) fn find_elements(ctx: &Ctx) -> Found {
    let cls = classes(&ctx.elem, &ctx.pos, 2.0 * ctx.s);
    let mut cand = candidates(ctx, &cls);
    let mut found = Found::default();
    let by_weight = |a: &(V3, f64), b: &(V3, f64)| b.1.total_cmp(&a.1);
    cand.axes.sort_by(by_weight);
    cand.mirrors.sort_by(by_weight);
    let key = |u: &V3| {
        let c = canonical(u) * 40.0;
        (c.x.round() as i64, c.y.round() as i64, c.z.round() as i64)
    };
    let mut tried = HashSet::new();
    for (u, _) in &cand.axes {
        if !tried.insert(key(u)) || found.axes.iter().any(|a| same_line(&a.dir, u)) {
            continue;
        }
        if let Some((n, dir)) = best_order(ctx, u, &cand.small, 2) {
            // Retry higher orders on the refined axis.
            let (n, dir) = best_order(ctx, &dir, &cand.small, n + 1).unwrap_or((n, dir));
            if !found.axes.iter().any(|a| same_line(&a.dir, &dir)) {
                found.axes.push(Axis {
                    dir: canonical(&dir),
                    order: n,
                });
            }
        }
    }
    tried.clear();
    for (u, _) in &cand.mirrors {
        if !tried.insert(key(u)) || found.mirrors.iter().any(|m| same_line(m, u)) {
            continue;
        }
        if let Some(n) = test_op(ctx, u, true, &cand.small, reflection) {
            if !found.mirrors.iter().any(|m| same_line(m, &n)) {
                found.mirrors.push(canonical(&n));
            }
        }
    }
    found.inversion = ctx.passes(&(-M3::identity()));
    found
}
