//! p orbitals perpendicular to the plane of a planar π system (the pπ basis of Hückel work).
//!
//! The molecular plane is a mirror of the group; with n its exact normal, every operation maps
//! the plane onto itself, so R·n = ±n and R carries p_a to ±p_R(a) (Cotton, 3rd ed., §10.4).

use super::action::{Basis, BasisKind, Member};
use super::images::{check_size, ImagesBuilder};
use super::structure::Structure;
use super::BasisError;
use crate::exact::Cyclo;
use std::sync::Arc;

/// p⊥ orbitals on `atoms` (all must lie in one plane through the origin).
pub fn p_perp(s: &Structure, atoms: &[usize]) -> Result<Basis, BasisError> {
    let g = &s.group;
    check_size(BasisKind::PPerp, atoms.len(), g.order())?;
    for &a in atoms {
        if a >= s.len() {
            return Err(BasisError::NoSuchAtom {
                atom: a + 1,
                n_atoms: s.len(),
            });
        }
    }
    // The molecular plane: a mirror that leaves every atom of the π system in place.
    let plane = g
        .ops
        .iter()
        .enumerate()
        .filter(|(_, op)| !op.is_proper() && (op.float.trace() - 1.0).abs() < 1e-9)
        .find(|(o, _)| atoms.iter().all(|&a| s.perm[*o][a] == a))
        .map(|(o, _)| o)
        .ok_or(BasisError::NotPlanar)?;
    let m = &g.ops[plane].matrix;
    // exact normal: a nonzero column of I − σ
    let n: [Cyclo; 3] = (0..3)
        .map(|j| -> [Cyclo; 3] {
            std::array::from_fn(|i| {
                let delta = Cyclo::from_int((i == j) as i64);
                &delta - &m[i][j]
            })
        })
        .find(|c| c.iter().any(|x| !x.is_zero()))
        .expect("a mirror has a normal");
    let nn: Cyclo = n.iter().map(|x| x * x).sum();
    let mut site_perm = Vec::with_capacity(g.order());
    let mut images = ImagesBuilder::new(atoms.len());
    for (o, op) in g.ops.iter().enumerate() {
        // ε = n·(R n)/|n|²
        let rn: Vec<Cyclo> = (0..3)
            .map(|i| (0..3).map(|j| &op.matrix[i][j] * &n[j]).sum())
            .collect();
        let eps = &(0..3).map(|i| &n[i] * &rn[i]).sum::<Cyclo>() / &nn;
        let mut row = Vec::with_capacity(atoms.len());
        let e = images.number(&eps);
        for &a in atoms {
            let img = s.perm[o][a];
            let k = atoms
                .iter()
                .position(|&x| x == img)
                .ok_or_else(|| BasisError::NotClosed {
                    what: format!("atom {}", s.label(a)),
                    operation: op.name.clone(),
                    image: s.label(img),
                })?;
            row.push(k);
            images.push(k, e);
            images.end_column();
        }
        site_perm.push(row);
        images.end_op();
    }
    Ok(Basis {
        kind: BasisKind::PPerp,
        group: g.clone(),
        members: atoms
            .iter()
            .enumerate()
            .map(|(k, &a)| Member {
                name: format!("p{}", k + 1),
                atoms: vec![a],
                axis: None,
                site: k,
            })
            .collect(),
        sites: atoms.iter().map(|&a| s.label(a)).collect(),
        site_perm,
        images: Arc::new(images.finish()),
        notes: vec![format!(
            "p orbitals along the normal of the molecular plane {}",
            g.ops[plane].name
        )],
    })
}
