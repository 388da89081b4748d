//! Candidate equivalence classes of atoms: same element and the same distance from the
//! centre (within a gap). Every symmetry operation maps each class onto itself, so
//! candidate axes and planes can be read off one small class instead of all atom pairs.

use super::super::linalg::V3;

/// Atoms that may be symmetry-equivalent.
pub(crate) struct Class {
    /// Atom indices, by increasing distance from the centre.
    pub members: Vec<usize>,
    /// Common distance from the centre (the smallest of the members), Å.
    pub radius: f64,
}

/// Groups atoms by element, then chains them by distance from the centre: a new class
/// starts where consecutive distances differ by more than `gap`.
pub(crate) fn classes(elements: &[u8], centred: &[V3], gap: f64) -> Vec<Class> {
    let r: Vec<f64> = centred.iter().map(|p| p.norm()).collect();
    let mut idx: Vec<usize> = (0..centred.len()).collect();
    idx.sort_by(|&a, &b| elements[a].cmp(&elements[b]).then(r[a].total_cmp(&r[b])));
    let mut out: Vec<Class> = Vec::new();
    let mut prev: Option<usize> = None;
    for i in idx {
        let new_class = match prev {
            None => true,
            Some(p) => elements[p] != elements[i] || r[i] - r[p] > gap,
        };
        if new_class {
            out.push(Class {
                members: vec![i],
                radius: r[i],
            });
        } else if let Some(c) = out.last_mut() {
            c.members.push(i);
        }
        prev = Some(i);
    }
    out
}
