//! Subgroups of a point group found among its own operations, with the multiplication table:
//! cyclic subgroups first, then one more generator at a time until nothing new appears (every
//! point group needs at most three generators), cached per group; and grouping them into
//! conjugacy classes under the whole group.
//!
//! Owns: subgroup enumeration and conjugacy. Knows nothing of irreps.

use crate::group::PointGroup;
use std::collections::{BTreeSet, HashMap, HashSet};
use std::sync::{Arc, Mutex, OnceLock};

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

/// Every subgroup of `g` (computed once per group and cached).
pub fn all_subgroups(g: &PointGroup) -> Arc<Vec<OpSet>> {
    static CACHE: OnceLock<Mutex<HashMap<String, Arc<Vec<OpSet>>>>> = OnceLock::new();
    let cache = CACHE.get_or_init(|| Mutex::new(HashMap::new()));
    let key = format!("{}/{}", g.name(), g.order());
    if let Some(v) = cache.lock().ok().and_then(|c| c.get(&key).cloned()) {
        return v;
    }
    let v = Arc::new(enumerate(g));
    if let Ok(mut c) = cache.lock() {
        c.insert(key, v.clone());
    }
    v
}

fn enumerate(g: &PointGroup) -> Vec<OpSet> {
    let h = g.order();
    let mut all: HashSet<OpSet> = HashSet::new();
    // (subgroup, its generators)
    let mut level: Vec<(OpSet, Vec<usize>)> = Vec::new();
    for a in 0..h {
        let s = closure(g, &[a]);
        if all.insert(s.clone()) {
            level.push((s, vec![a]));
        }
    }
    while !level.is_empty() {
        let mut next = Vec::new();
        for (s, gens) in &level {
            if s.len() == h {
                continue;
            }
            for b in 0..h {
                if s.binary_search(&b).is_ok() {
                    continue;
                }
                let mut gb = gens.clone();
                gb.push(b);
                let t = closure(g, &gb);
                if all.insert(t.clone()) {
                    next.push((t, gb));
                }
            }
        }
        level = next;
    }
    let mut out: Vec<OpSet> = all.into_iter().collect();
    out.sort_by(|a, b| a.len().cmp(&b.len()).then(a.cmp(b)));
    out
}

/// All subgroups of `g` of the given order.
pub fn subgroups_of_order(g: &PointGroup, order: usize) -> Vec<OpSet> {
    all_subgroups(g)
        .iter()
        .filter(|s| s.len() == order)
        .cloned()
        .collect()
}

/// x·s·x⁻¹ for every s.
fn conjugate(g: &PointGroup, s: &OpSet, x: usize, xi: usize) -> OpSet {
    let mut t: OpSet = s.iter().map(|&a| g.product(g.product(x, a), xi)).collect();
    t.sort();
    t
}

/// Split subgroups into conjugacy classes under `g`; each class sorted, classes in order of
/// their first member.
pub fn conjugacy_classes(g: &PointGroup, subgroups: &[OpSet]) -> Vec<Vec<OpSet>> {
    let inverses: Vec<usize> = (0..g.order()).map(|x| g.inverse(x)).collect();
    let mut done: HashSet<OpSet> = HashSet::new();
    let mut out = Vec::new();
    for s in subgroups {
        if done.contains(s) {
            continue;
        }
        let mut class: Vec<OpSet> = (0..g.order())
            .map(|x| conjugate(g, s, x, inverses[x]))
            .collect();
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
