//! Where a subgroup type H sits among G's own operations, one placement per way of embedding
//! (conjugacy class of subgroups, in the order [`super::descend`] lists them): which operation
//! of G each operation of H lands on, and so which class of G each class of H lies in. Within
//! a conjugacy class the subgroup whose classes' chosen operations are most often G's own
//! chosen operations is taken, so that ticks (which speak of the chosen operation of a class)
//! carry over member by member as far as possible.
//!
//! Owns: [`Placement`] and [`placements`]. Finite groups only (the linear groups have no
//! operation list to place on).

use super::embed::place;
use super::subgroups::{conjugacy_classes, signature, subgroups_of_order};
use crate::group::PointGroup;

/// One way H sits in G.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Placement {
    /// Subgroups of G alike to this one (its conjugacy class).
    pub conjugates: usize,
    /// For each operation of H (`h.ops` order), the index in `g.ops` it is placed on.
    pub ops: Vec<usize>,
    /// For each class of H, the class of G it lies in.
    pub link: Vec<usize>,
    /// For each class of H: its chosen (first) operation is also G's chosen operation of the
    /// class it lies in.
    pub same_chosen: Vec<bool>,
}

fn chosen(g: &PointGroup, class: usize) -> Option<usize> {
    g.ops.iter().position(|o| o.class == class)
}

fn placement(g: &PointGroup, h: &PointGroup, k: &[usize], conjugates: usize) -> Option<Placement> {
    let ops = place(g, h, k)?;
    let mut link = vec![usize::MAX; h.n_classes()];
    let mut same_chosen = vec![false; h.n_classes()];
    for (c, l) in link.iter_mut().enumerate() {
        let j = chosen(h, c)?;
        let gi = ops[j];
        *l = g.ops[gi].class;
        same_chosen[c] = chosen(g, *l) == Some(gi);
    }
    Some(Placement {
        conjugates,
        ops,
        link,
        same_chosen,
    })
}

/// Every way H sits in G (empty when H is not a subgroup of G, or either is linear).
pub fn placements(g: &PointGroup, h: &PointGroup) -> Vec<Placement> {
    if g.is_linear() || h.is_linear() || h.order() > g.order() {
        return Vec::new();
    }
    let want = signature(h.ops.iter().map(|o| &o.float));
    let subs: Vec<_> = subgroups_of_order(g, h.order())
        .into_iter()
        .filter(|k| signature(k.iter().map(|&i| &g.ops[i].float)) == want)
        .collect();
    let mut out = Vec::new();
    for class in conjugacy_classes(g, &subs) {
        // `descend` lists a class when its first subgroup can be placed: the same test here.
        let Some(first) = placement(g, h, &class[0], class.len()) else {
            continue;
        };
        let score = |p: &Placement| p.same_chosen.iter().filter(|&&s| s).count();
        let best = class[1..]
            .iter()
            .filter_map(|k| placement(g, h, k, class.len()))
            .fold(first, |a, b| if score(&b) > score(&a) { b } else { a });
        out.push(best);
    }
    out
}
