//! Subgroups of a point group found among its own operations, with the multiplication table:
//! cyclic subgroups first, then one more generator at a time (every point group needs at most
//! three generators), keeping only subgroups whose order divides the target (Lagrange), and
//! grouping them into conjugacy classes under the whole group.
//!
//! Owns: subgroup enumeration and conjugacy. Knows nothing of irreps.

use crate::group::PointGroup;
use std::collections::{BTreeSet, HashSet};

/// A subgroup: sorted indices into `g.ops`.
pub type OpSet = Vec<usize>;

/// ⟨gens⟩ by closing under right multiplication by the generators.
fn closure(g: &PointGroup, gens: &[usize]) -> OpSet {
    let identity = 0; // ops are sorted by class, identity first
    let mut seen: BTreeSet<usize> = BTreeSet::from([identity]);
    let mut queue = vec![identity];
    while let Some(x) = queue.pop() {
        for &s in gens {
            let y = g.product(x, s);
            if seen.insert(y) {
                queue.push(y);
            }
        }
    }
    seen.into_iter().collect()
}

/// All subgroups of `g` of the given order.
pub fn subgroups_of_order(g: &PointGroup, order: usize) -> Vec<OpSet> {
    let h = g.order();
    if order == 0 || h % order != 0 {
        return Vec::new();
    }
    let mut all: HashSet<OpSet> = HashSet::new();
    // (subgroup, its generators)
    let mut level: Vec<(OpSet, Vec<usize>)> = Vec::new();
    for a in 0..h {
        let s = closure(g, &[a]);
        if order % s.len() == 0 && all.insert(s.clone()) {
            level.push((s, vec![a]));
        }
    }
    while !level.is_empty() {
        let mut next = Vec::new();
        for (s, gens) in &level {
            if s.len() == order {
                continue;
            }
            for b in 0..h {
                if s.binary_search(&b).is_ok() {
                    continue;
                }
                let mut gb = gens.clone();
                gb.push(b);
                let t = closure(g, &gb);
                if order % t.len() == 0 && all.insert(t.clone()) {
                    next.push((t, gb));
                }
            }
        }
        level = next;
    }
    let mut out: Vec<OpSet> = all.into_iter().filter(|s| s.len() == order).collect();
    out.sort();
    out
}

/// x·s·x⁻¹ for every s.
fn conjugate(g: &PointGroup, s: &OpSet, x: usize) -> OpSet {
    let xi = g.inverse(x);
    let mut t: OpSet = s.iter().map(|&a| g.product(g.product(x, a), xi)).collect();
    t.sort();
    t
}

/// Split subgroups into conjugacy classes under `g`; each class sorted, classes in order of
/// their first member.
pub fn conjugacy_classes(g: &PointGroup, subgroups: &[OpSet]) -> Vec<Vec<OpSet>> {
    let mut done: HashSet<OpSet> = HashSet::new();
    let mut out = Vec::new();
    for s in subgroups {
        if done.contains(s) {
            continue;
        }
        let mut class: Vec<OpSet> = (0..g.order()).map(|x| conjugate(g, s, x)).collect();
        class.sort();
        class.dedup();
        for c in &class {
            done.insert(c.clone());
        }
        out.push(class);
    }
    out
}

/// Type signature of an operation: (det, trace) — together they fix the kind and angle.
pub fn op_signature(m: &nalgebra::Matrix3<f64>) -> (i8, i64) {
    let det = if m.determinant() > 0.0 { 1 } else { -1 };
    (det, (m.trace() * 1000.0).round() as i64)
}

/// Sorted signatures of a set of matrices (a quick test of "same type").
pub fn signature<'a>(mats: impl Iterator<Item = &'a nalgebra::Matrix3<f64>>) -> Vec<(i8, i64)> {
    let mut v: Vec<(i8, i64)> = mats.map(op_signature).collect();
    v.sort();
    v
}
