//! Bond and angle sets: orbits of bonds and bond angles under the atom permutations, and how
//! many members each class leaves in place.

use crate::exact::QuickMap;

/// A set of symmetry-equivalent bonds.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct BondSet {
    /// Bonds as 0-based atom pairs (a < b).
    pub bonds: Vec<(usize, usize)>,
    /// e.g. `C–H`.
    pub label: String,
}

/// A set of symmetry-equivalent bond angles i–j–k (j the apex, i < k).
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct AngleSet {
    pub angles: Vec<(usize, usize, usize)>,
    pub label: String,
}

fn norm_pair(a: usize, b: usize) -> (usize, usize) {
    if a < b {
        (a, b)
    } else {
        (b, a)
    }
}

/// Orbits of generic items under the permutations (those of a generating set suffice),
/// by union–find over images.
fn orbits<T: Copy + Eq + std::hash::Hash + Ord>(
    items: &[T],
    image: impl Fn(&[usize], T) -> T,
    perms: &[Vec<usize>],
) -> Vec<Vec<T>> {
    let index: QuickMap<T, usize> = items.iter().enumerate().map(|(k, t)| (*t, k)).collect();
    let mut parent: Vec<usize> = (0..items.len()).collect();
    fn find(p: &mut [usize], x: usize) -> usize {
        let mut r = x;
        while p[r] != r {
            r = p[r];
        }
        let mut y = x;
        while p[y] != r {
            let n = p[y];
            p[y] = r;
            y = n;
        }
        r
    }
    for perm in perms {
        for (k, t) in items.iter().enumerate() {
            if let Some(&j) = index.get(&image(perm, *t)) {
                let (a, b) = (find(&mut parent, k), find(&mut parent, j));
                if a != b {
                    parent[a] = b;
                }
            }
        }
    }
    let mut groups: QuickMap<usize, Vec<T>> = QuickMap::default();
    for (k, t) in items.iter().enumerate() {
        let r = find(&mut parent, k);
        groups.entry(r).or_default().push(*t);
    }
    let mut out: Vec<Vec<T>> = groups.into_values().collect();
    for g in &mut out {
        g.sort();
    }
    out.sort();
    out
}

/// Bonds grouped into symmetry-equivalent sets, labelled central atom first (`P–F`).
pub fn bond_sets(
    bonds: &[(usize, usize)],
    perms: &[Vec<usize>],
    symbol: impl Fn(usize) -> String,
) -> Vec<BondSet> {
    let items: Vec<(usize, usize)> = bonds.iter().map(|&(a, b)| norm_pair(a, b)).collect();
    // bonds at each atom, counted once (a scan per set took 19 s for a 97,556-atom cube)
    let mut degrees: QuickMap<usize, usize> = QuickMap::default();
    for &(a, b) in &items {
        *degrees.entry(a).or_default() += 1;
        *degrees.entry(b).or_default() += 1;
    }
    let degree = |x: usize| degrees.get(&x).copied().unwrap_or(0);
    orbits(&items, |p, (a, b)| norm_pair(p[a], p[b]), perms)
        .into_iter()
        .map(|bonds| {
            let (a, b) = bonds[0];
            let label = crate::geom::formula::bond_label(
                (&symbol(a), degree(a)),
                (&symbol(b), degree(b)),
                "–",
            );
            BondSet { bonds, label }
        })
        .collect()
}

/// Every bond angle i–j–k between two bonds at j, grouped into equivalent sets. Angles within
/// `linear_cutoff_deg` of 180° are left out (a linear bend is a degenerate pair, not one angle).
pub fn angle_sets(
    bonds: &[(usize, usize)],
    positions: &[nalgebra::Vector3<f64>],
    perms: &[Vec<usize>],
    symbol: impl Fn(usize) -> String,
    linear_cutoff_deg: f64,
) -> (Vec<AngleSet>, usize) {
    let mut nbrs: QuickMap<usize, Vec<usize>> = QuickMap::default();
    for &(a, b) in bonds {
        nbrs.entry(a).or_default().push(b);
        nbrs.entry(b).or_default().push(a);
    }
    let mut items = Vec::new();
    let mut skipped = 0;
    for (&j, ns) in &nbrs {
        for x in 0..ns.len() {
            for y in x + 1..ns.len() {
                let (i, k) = norm_pair(ns[x], ns[y]);
                let u = positions[i] - positions[j];
                let v = positions[k] - positions[j];
                let cos = u.dot(&v) / (u.norm() * v.norm());
                let ang = cos.clamp(-1.0, 1.0).acos().to_degrees();
                if ang > 180.0 - linear_cutoff_deg {
                    skipped += 1;
                    continue;
                }
                items.push((i, j, k));
            }
        }
    }
    items.sort();
    let sets = orbits(
        &items,
        |p, (i, j, k)| {
            let (a, b) = norm_pair(p[i], p[k]);
            (a, p[j], b)
        },
        perms,
    )
    .into_iter()
    .map(|angles| {
        let (i, j, k) = angles[0];
        let label = format!("{}–{}–{}", symbol(i), symbol(j), symbol(k));
        AngleSet { angles, label }
    })
    .collect();
    (sets, skipped)
}

/// How many bonds of a set each operation leaves in place (as unordered pairs).
pub fn unmoved_bonds(set: &[(usize, usize)], perm: &[usize]) -> i64 {
    set.iter()
        .filter(|&&(a, b)| norm_pair(perm[a], perm[b]) == (a, b))
        .count() as i64
}

/// How many angles of a set each operation leaves in place.
pub fn unmoved_angles(set: &[(usize, usize, usize)], perm: &[usize]) -> i64 {
    set.iter()
        .filter(|&&(i, j, k)| perm[j] == j && norm_pair(perm[i], perm[k]) == (i, k))
        .count() as i64
}
