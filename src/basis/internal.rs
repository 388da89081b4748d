//! Internal coordinates: bond stretches and angle bends, for any set closed under the group.
//!
//! An operation carries the stretch of bond a–b to the stretch of bond R(a)–R(b), and the bend
//! of angle i–j–k to the bend of R(i)–R(j)–R(k), each with coefficient +1 (Wilson, Decius &
//! Cross, *Molecular Vibrations*, §6-2). Default sets: every bond, grouped into sets of
//! symmetry-equivalent bonds; every angle between two bonds sharing an atom.

use super::action::{Basis, BasisKind, Member};
use super::images::{check_size, permutation_images};
use super::structure::{orbits, Structure};
use super::BasisError;
use crate::exact::QuickMap;
use std::sync::Arc;

/// A named set of symmetry-equivalent sites (bonds or angles).
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct SiteSet {
    /// e.g. `C-H`, `C-C(2)`, `H-C-H`.
    pub name: String,
    /// Indices into the full list (bonds of the structure, or angles given).
    pub items: Vec<usize>,
}

fn bond_name(s: &Structure, (a, b): (usize, usize)) -> String {
    format!("{}–{}", s.label(a), s.label(b))
}

/// Stretches of the given bonds (0-based atom pairs); the set must be closed under the group.
pub fn stretches(s: &Structure, bonds: &[(usize, usize)]) -> Result<Basis, BasisError> {
    check_size(BasisKind::Stretch, bonds.len(), s.group.order())?;
    let bonds: Vec<(usize, usize)> = bonds.iter().map(|&(a, b)| (a.min(b), a.max(b))).collect();
    let index = first_index(&bonds);
    let mut site_perm = Vec::with_capacity(s.group.order());
    for (o, op) in s.group.ops.iter().enumerate() {
        let mut p = Vec::with_capacity(bonds.len());
        for &(a, b) in &bonds {
            let (x, y) = (s.perm[o][a], s.perm[o][b]);
            let img = (x.min(y), x.max(y));
            let k = index
                .get(&img)
                .copied()
                .ok_or_else(|| BasisError::NotClosed {
                    what: format!("bond {}", bond_name(s, (a, b))),
                    operation: op.name.clone(),
                    image: bond_name(s, img),
                })?;
            p.push(k);
        }
        site_perm.push(p);
    }
    let members = bonds
        .iter()
        .enumerate()
        .map(|(k, &(a, b))| Member {
            name: format!("r{}", k + 1),
            atoms: vec![a, b],
            axis: None,
            site: k,
        })
        .collect();
    Ok(scalar_basis(
        s,
        BasisKind::Stretch,
        members,
        bonds.iter().map(|&q| bond_name(s, q)).collect(),
        site_perm,
    ))
}

/// Each item's position in the list (the first, where an item repeats): a lookup per image
/// instead of a scan (C60's 180 angles under 120 operations took 2 ms by scanning).
fn first_index<T: Copy + Eq + std::hash::Hash>(items: &[T]) -> QuickMap<T, usize> {
    let mut index = QuickMap::default();
    for (i, &t) in items.iter().enumerate() {
        index.entry(t).or_insert(i);
    }
    index
}

/// A basis whose members are scalars permuted by the sites (coefficient +1).
fn scalar_basis(
    s: &Structure,
    kind: BasisKind,
    members: Vec<Member>,
    sites: Vec<String>,
    site_perm: Vec<Vec<usize>>,
) -> Basis {
    let images = Arc::new(permutation_images(members.len(), &site_perm));
    Basis {
        kind,
        group: s.group.clone(),
        members,
        sites,
        site_perm,
        images,
        notes: Vec::new(),
    }
}

/// The bonds of the structure grouped into sets of symmetry-equivalent bonds.
pub fn bond_sets(s: &Structure) -> Vec<SiteSet> {
    let bonds = &s.bonds;
    let index = first_index(bonds);
    let find = |q: (usize, usize)| index.get(&(q.0.min(q.1), q.0.max(q.1))).copied();
    let orbs = orbits(
        bonds.len(),
        |o, k| {
            let (a, b) = bonds[k];
            find((s.perm[o][a], s.perm[o][b])).unwrap_or(k)
        },
        s.group.order(),
    );
    // bonds at each atom, counted once (not once per set: minutes for 600,000 bonds)
    let mut degrees = vec![0usize; s.len()];
    for &(p, q) in bonds {
        degrees[p] += 1;
        degrees[q] += 1;
    }
    name_sets(orbs, |k| {
        let (a, b) = bonds[k];
        let degree = |x: usize| degrees[x];
        crate::geom::formula::bond_label(
            (&s.atoms[a].symbol, degree(a)),
            (&s.atoms[b].symbol, degree(b)),
            "-",
        )
    })
}

fn name_sets(orbs: Vec<Vec<usize>>, name: impl Fn(usize) -> String) -> Vec<SiteSet> {
    let names: Vec<String> = orbs.iter().map(|o| name(o[0])).collect();
    // how many sets share each name, and each set's place among them (1-based)
    let mut count: QuickMap<&str, usize> = QuickMap::default();
    let place: Vec<usize> = names
        .iter()
        .map(|n| {
            let c = count.entry(n.as_str()).or_default();
            *c += 1;
            *c
        })
        .collect();
    orbs.into_iter()
        .enumerate()
        .map(|(i, items)| {
            let name = if count[names[i].as_str()] > 1 {
                format!("{}({})", names[i], place[i])
            } else {
                names[i].clone()
            };
            SiteSet { name, items }
        })
        .collect()
}

/// An angle i–j–k (apex j), stored with i < k.
pub type Angle = (usize, usize, usize);

fn angle_key(i: usize, j: usize, k: usize) -> Angle {
    (i.min(k), j, i.max(k))
}

fn angle_name(s: &Structure, (i, j, k): Angle) -> String {
    format!("{}–{}–{}", s.label(i), s.label(j), s.label(k))
}

/// Every angle between two bonds that share an atom, apex-major order.
pub fn all_angles(s: &Structure) -> Vec<Angle> {
    // each atom's neighbours in bond-list order, gathered once (a scan of every bond per
    // atom took 34 s for a 97,556-atom cube)
    let mut adjacent: Vec<Vec<usize>> = vec![Vec::new(); s.len()];
    for &(a, b) in &s.bonds {
        adjacent[a].push(b);
        adjacent[b].push(a);
    }
    let mut out = Vec::new();
    for (j, nbrs) in adjacent.iter().enumerate() {
        for x in 0..nbrs.len() {
            for y in x + 1..nbrs.len() {
                out.push(angle_key(nbrs[x], j, nbrs[y]));
            }
        }
    }
    out
}

/// Bends of the given angles; the set must be closed under the group.
pub fn bends(s: &Structure, angles: &[Angle]) -> Result<Basis, BasisError> {
    check_size(BasisKind::Bend, angles.len(), s.group.order())?;
    let angles: Vec<Angle> = angles.iter().map(|&(i, j, k)| angle_key(i, j, k)).collect();
    let index = first_index(&angles);
    let mut site_perm = Vec::with_capacity(s.group.order());
    for (o, op) in s.group.ops.iter().enumerate() {
        let p = &s.perm[o];
        let mut row = Vec::with_capacity(angles.len());
        for &q in &angles {
            let img = angle_key(p[q.0], p[q.1], p[q.2]);
            let k = index
                .get(&img)
                .copied()
                .ok_or_else(|| BasisError::NotClosed {
                    what: format!("angle {}", angle_name(s, q)),
                    operation: op.name.clone(),
                    image: angle_name(s, img),
                })?;
            row.push(k);
        }
        site_perm.push(row);
    }
    let members = angles
        .iter()
        .enumerate()
        .map(|(n, &(i, j, k))| Member {
            name: format!("θ{}", n + 1),
            atoms: vec![i, j, k],
            axis: None,
            site: n,
        })
        .collect();
    Ok(scalar_basis(
        s,
        BasisKind::Bend,
        members,
        angles.iter().map(|&q| angle_name(s, q)).collect(),
        site_perm,
    ))
}

/// Angles grouped into sets of symmetry-equivalent angles (`H-C-H`, `C-C-C(2)`).
pub fn angle_sets(s: &Structure, angles: &[Angle]) -> Vec<SiteSet> {
    let index = first_index(angles);
    let find = |q: Angle| index.get(&q).copied();
    let orbs = orbits(
        angles.len(),
        |o, n| {
            let (i, j, k) = angles[n];
            let p = &s.perm[o];
            find(angle_key(p[i], p[j], p[k])).unwrap_or(n)
        },
        s.group.order(),
    );
    name_sets(orbs, |n| {
        let (i, j, k) = angles[n];
        let (a, b) = (&s.atoms[i].symbol, &s.atoms[k].symbol);
        let (a, b) = if a <= b { (a, b) } else { (b, a) };
        format!("{a}-{}-{b}", s.atoms[j].symbol)
    })
}
