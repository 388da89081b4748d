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

/// Positions relative to the centre, elements, the spatial hash and the largest
/// screening tolerance the context serves.
pub(crate) struct Ctx {
    pub pos: Vec<V3>,
    pub elem: Vec<u8>,
    pub mass: Vec<f64>,
    pub grid: Grid,
    /// Largest screening tolerance: an image must land within `s` of an atom of its
    /// element for an element to be recorded at all.
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

    /// The permutation of `op` (nearest partner of each atom within `tol`) and the
    /// largest partner distance: the element's deviation. `None` if an atom has no
    /// partner or two atoms share one.
    pub(crate) fn matches(&self, op: &M3, tol: f64) -> Option<(Vec<usize>, f64)> {
        let n = self.pos.len();
        let mut perm = Vec::with_capacity(n);
        let mut taken = vec![false; n];
        let mut worst = 0.0f64;
        for i in 0..n {
            let (j, d) = self.partner(op, i, tol)?;
            if std::mem::replace(&mut taken[j], true) {
                return None;
            }
            worst = worst.max(d);
            perm.push(j);
        }
        Some((perm, worst))
    }

    /// Whether `op` maps the whole molecule onto itself within `s`.
    pub(crate) fn passes_at(&self, op: &M3, s: f64) -> bool {
        self.matches(op, s).is_some()
    }

    /// Number of atoms within `s` of the line through the centre along `u` (unit).
    pub(crate) fn atoms_on_line(&self, u: &V3, s: f64) -> usize {
        self.pos
            .iter()
            .filter(|p| (*p - u * u.dot(p)).norm() <= s)
            .count()
    }

    /// Number of atoms within `s` of the plane through the centre with normal `n` (unit).
    pub(crate) fn atoms_in_plane(&self, n: &V3, s: f64) -> usize {
        self.pos.iter().filter(|p| n.dot(p).abs() <= s).count()
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
            // Images of a lie at its distance from the centre (within the screening).
            let ra = pa.norm();
            let near = |k: f64| -> Vec<usize> {
                m.iter()
                    .copied()
                    .filter(|&b| (p[b].norm() - ra).abs() <= k * s)
                    .collect()
            };
            let (w2, w4) = (near(2.0), near(4.0));
            // C2 axes and mirrors carrying a (or a2) onto b: b at its distance from the centre
            // (within 4·s; a long chain of nearly equal radii, as in a large random cloud, is
            // one class but far from one orbit)
            for r in [pa, pa2] {
                let rr = r.norm();
                for &b in m {
                    let pb = p[b];
                    if (pb.norm() - rr).abs() > 4.0 * s {
                        continue;
                    }
                    let scale = rr + pb.norm();
                    push(&mut axes, r + pb, (r + pb).norm() / scale);
                    push(&mut mirrors, r - pb, (r - pb).norm() / scale);
                }
            }
            // Cn, n >= 3, not through a: normal of the triangle a, b = Cn a, c = Cn b.
            for &b in &w2 {
                if b == a {
                    continue;
                }
                let ab = p[b] - pa;
                let lab = ab.norm();
                if lab <= 2.0 * s {
                    continue;
                }
                for &c in &w4 {
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

/// Deviations at or below this (Å) are rounding: such an element is exact, its
/// direction needs no refinement and its powers are exact too.
pub(crate) const EXACT: f64 = 1e-8;

/// Checks the operation `make(u)` for a candidate direction `u` and returns the best
/// direction found with its deviation (≤ the context's `s`): quick rejection on the
/// small class, the match on `u` itself, and unless that is exact a refinement of the
/// direction from the pairs matched loosely (2·s; candidate directions built from a few
/// noisy atoms can be off by several mrad), twice.
fn test_op(
    ctx: &Ctx,
    u: &V3,
    improper: bool,
    small: &[usize],
    make: impl Fn(&V3) -> M3,
) -> Option<(V3, f64)> {
    let loose = 2.0 * ctx.s;
    let op = make(u);
    if !ctx.maps_subset(&op, small, loose) {
        return None;
    }
    let mut best: Option<(V3, Vec<usize>, f64)> = ctx.matches(&op, ctx.s).map(|(p, d)| (*u, p, d));
    if best.as_ref().is_some_and(|b| b.2 <= EXACT) {
        return best.map(|(v, _, d)| (v, d));
    }
    let first = match &best {
        Some((_, p, _)) => p.clone(),
        None => ctx.full_at(&op, loose)?,
    };
    let mut perm = first;
    let mut base = *u;
    for _ in 0..2 {
        let v = refine(ctx, &perm, improper, &base);
        if let Some((p, d)) = ctx.matches(&make(&v), ctx.s) {
            if best.as_ref().is_none_or(|b| d < b.2) {
                best = Some((v, p.clone(), d));
            }
        }
        match &best {
            Some((v, p, _)) => {
                base = *v;
                perm = p.clone();
            }
            None => return None,
        }
    }
    best.map(|(v, _, d)| (v, d))
}

/// A line through the centre carrying rotation axes: each order found with its
/// deviation (orders descending).
#[derive(Debug, Clone)]
pub(crate) struct Line {
    pub dir: V3,
    pub orders: Vec<(usize, f64)>,
}

/// Every symmetry element found up to the context's screening tolerance, each with the
/// deviation it needs; [`Catalogue::at`] reads off the elements at a smaller screening
/// tolerance without searching again.
#[derive(Debug, Clone, Default)]
pub(crate) struct Catalogue {
    pub lines: Vec<Line>,
    pub mirrors: Vec<(V3, f64)>,
    pub inversion: Option<f64>,
}

impl Catalogue {
    /// The elements whose deviation is at most `s`.
    pub(crate) fn at(&self, s: f64) -> Found {
        let axes = self
            .lines
            .iter()
            .filter_map(|l| {
                l.orders
                    .iter()
                    .filter(|(_, d)| *d <= s)
                    .map(|(n, _)| *n)
                    .max()
                    .map(|order| Axis { dir: l.dir, order })
            })
            .collect();
        let mirrors = self
            .mirrors
            .iter()
            .filter(|(_, d)| *d <= s)
            .map(|(n, _)| *n)
            .collect();
        Found {
            axes,
            mirrors,
            inversion: self.inversion.is_some_and(|d| d <= s),
        }
    }
}

/// Rotation orders on the line along `u`: every order from 2 to [`MAX_TEST_ORDER`] that
/// passes, with its deviation, on the direction refined for the highest one. Powers of an
/// exact rotation are exact and not tested again.
fn line_orders(ctx: &Ctx, u: &V3, small: &[usize]) -> Option<Line> {
    // atoms of the small class off the line: a Cn permutes them in cycles of n (counted once
    // per direction, not once per order)
    let off_line = |dir: &V3| {
        small
            .iter()
            .filter(|&&i| (ctx.pos[i] - dir * dir.dot(&ctx.pos[i])).norm() > ctx.s)
            .count()
    };
    let mut counted: (V3, usize) = (*u, off_line(u));
    let mut try_order = |dir: &V3, n: usize| -> Option<(V3, f64)> {
        if counted.0 != *dir {
            counted = (*dir, off_line(dir));
        }
        let off = counted.1;
        if off > 0 && off % n != 0 {
            return None;
        }
        let angle = 2.0 * PI / n as f64;
        test_op(ctx, dir, false, small, |x| rotation(x, angle))
    };
    // The highest order on the candidate direction, then higher ones on the refined axis.
    let (mut top, (mut dir, mut dev)) = (2..=MAX_TEST_ORDER)
        .rev()
        .find_map(|n| try_order(u, n).map(|r| (n, r)))?;
    if (dir - u).norm() > 1e-9 {
        if let Some((n, r)) = (top + 1..=MAX_TEST_ORDER)
            .rev()
            .find_map(|n| try_order(&dir, n).map(|r| (n, r)))
        {
            top = n;
            (dir, dev) = r;
        }
    }
    let mut orders = vec![(top, dev)];
    for n in (2..top).rev() {
        let inferred = orders
            .iter()
            .find(|(m, d)| m % n == 0 && *d * (m / n) as f64 <= EXACT)
            .map(|(m, d)| *d * (m / n) as f64);
        if let Some(d) = inferred {
            orders.push((n, d));
        } else if let Some((_, d)) = try_order(&dir, n) {
            orders.push((n, d));
        }
    }
    Some(Line {
        dir: canonical(&dir),
        orders,
    })
}

/// Searches all symmetry elements up to the context's screening tolerance.
pub(crate) fn catalogue(ctx: &Ctx) -> Catalogue {
    let cls = classes(&ctx.elem, &ctx.pos, 2.0 * ctx.s);
    let mut cand = candidates(ctx, &cls);
    let mut cat = Catalogue::default();
    let by_weight = |a: &(V3, f64), b: &(V3, f64)| b.1.total_cmp(&a.1);
    cand.axes.sort_by(by_weight);
    cand.mirrors.sort_by(by_weight);
    let key = |u: &V3| {
        let c = canonical(u) * 40.0;
        (c.x.round() as i64, c.y.round() as i64, c.z.round() as i64)
    };
    // A line already known exactly needs no further candidates.
    let settled_line = |lines: &[Line], u: &V3| {
        lines
            .iter()
            .any(|l| same_line(&l.dir, u) && l.orders.iter().all(|o| o.1 <= EXACT))
    };
    let mut tried = HashSet::new();
    for (u, _) in &cand.axes {
        if !tried.insert(key(u)) || settled_line(&cat.lines, u) {
            continue;
        }
        if let Some(line) = line_orders(ctx, u, &cand.small) {
            match cat.lines.iter_mut().find(|l| same_line(&l.dir, &line.dir)) {
                Some(old) => merge_line(old, line),
                None => cat.lines.push(line),
            }
        }
    }
    tried.clear();
    for (u, _) in &cand.mirrors {
        if !tried.insert(key(u))
            || cat
                .mirrors
                .iter()
                .any(|(m, d)| *d <= EXACT && same_line(m, u))
        {
            continue;
        }
        if let Some((n, d)) = test_op(ctx, u, true, &cand.small, reflection) {
            match cat.mirrors.iter_mut().find(|(m, _)| same_line(m, &n)) {
                Some(old) if d < old.1 => *old = (canonical(&n), d),
                Some(_) => {}
                None => cat.mirrors.push((canonical(&n), d)),
            }
        }
    }
    cat.inversion = ctx.matches(&(-M3::identity()), ctx.s).map(|(_, d)| d);
    cat
}

/// Keeps the better deviation of each order; the direction of the better highest order.
fn merge_line(old: &mut Line, new: Line) {
    let best_top = |l: &Line| l.orders.first().map(|o| (o.0, -o.1));
    if best_top(&new) > best_top(old) {
        old.dir = new.dir;
    }
    for (n, d) in new.orders {
        match old.orders.iter_mut().find(|o| o.0 == n) {
            Some(o) => o.1 = o.1.min(d),
            None => old.orders.push((n, d)),
        }
    }
    old.orders.sort_by_key(|o| std::cmp::Reverse(o.0));
}
