//! Cartesian displacements (the 3N basis), translations, rotations and Γvib = Γ3N − Γtrans − Γrot.
//!
//! An operation R carries the displacement eⱼ on atom a to Σᵢ Rᵢⱼ eᵢ on atom R(a); translations
//! transform as x, y, z and rotations as the axial vector det(R)·R (Cotton, 3rd ed., §10.2;
//! Wilson, Decius & Cross, *Molecular Vibrations*, ch. 6). Linear molecules have 3N − 5
//! vibrations and are reduced in C2v/D2h, then correlated back to C∞v/D∞h.

use super::action::{class_representatives, Basis, BasisKind, Member};
use super::images::{check_size, ImagesBuilder};
use super::structure::Structure;
use super::BasisError;
use crate::exact::Cyclo;
use crate::group::{mat_det, mat_trace, PointGroup};
use crate::rep::{self, Character};
use std::sync::Arc;

const AXES: [&str; 3] = ["x", "y", "z"];

/// The 3N Cartesian displacements: members `x1 y1 z1 x2 …` in atom order (refused beyond
/// [`super::MAX_IMAGES`] images).
pub fn cartesian(s: &Structure) -> Result<Basis, BasisError> {
    check_size(BasisKind::Cartesian, 3 * s.len(), s.group.order())?;
    let mut members = Vec::with_capacity(3 * s.len());
    for a in 0..s.len() {
        for ax in AXES {
            members.push(Member {
                name: format!("{ax}{}", a + 1),
                atoms: vec![a],
                axis: Some(ax.to_string()),
                site: a,
            });
        }
    }
    // each operation's matrix entries are numbered once; the images are then integer pairs
    let mut b = ImagesBuilder::new(3 * s.len());
    b.reserve(s.group.order(), 1);
    for (o, op) in s.group.ops.iter().enumerate() {
        let ids: [[Option<u32>; 3]; 3] = std::array::from_fn(|i| {
            std::array::from_fn(|j| {
                (!op.matrix[i][j].is_zero()).then(|| b.number(&op.matrix[i][j]))
            })
        });
        for a in 0..s.len() {
            let to = s.perm[o][a];
            for j in 0..3 {
                for (i, row) in ids.iter().enumerate() {
                    if let Some(x) = row[j] {
                        b.push(3 * to + i, x);
                    }
                }
                b.end_column();
            }
        }
        b.end_op();
    }
    let images = Arc::new(b.finish());
    Ok(Basis {
        kind: BasisKind::Cartesian,
        group: s.group.clone(),
        members,
        sites: (0..s.len()).map(|a| s.label(a)).collect(),
        site_perm: s.perm.clone(),
        images,
        notes: Vec::new(),
    })
}

/// Γ3N without building the basis: χ(R) = (atoms R leaves in place) × tr R (Cotton, 3rd ed.,
/// §10.2).
pub fn cartesian_character(s: &Structure) -> Character {
    Character(
        class_representatives(&s.group)
            .iter()
            .map(|&o| {
                let unmoved = (0..s.len()).filter(|&a| s.perm[o][a] == a).count();
                &mat_trace(&s.group.ops[o].matrix) * &Cyclo::from_int(unmoved as i64)
            })
            .collect(),
    )
}

fn triple(s: &Structure, kind: BasisKind, prefix: &str, axial: bool) -> Basis {
    let members = AXES
        .iter()
        .map(|ax| Member {
            name: format!("{prefix}{ax}"),
            atoms: Vec::new(),
            axis: Some(ax.to_string()),
            site: 0,
        })
        .collect();
    let mut b = ImagesBuilder::new(3);
    for op in &s.group.ops {
        let d = if axial {
            mat_det(&op.matrix)
        } else {
            Cyclo::one()
        };
        for j in 0..3 {
            for i in 0..3 {
                if !op.matrix[i][j].is_zero() {
                    b.push_number(i, &(&op.matrix[i][j] * &d));
                }
            }
            b.end_column();
        }
        b.end_op();
    }
    let images = Arc::new(b.finish());
    Basis {
        kind,
        group: s.group.clone(),
        members,
        sites: vec!["molecule".into()],
        site_perm: vec![vec![0]; s.group.order()],
        images,
        notes: Vec::new(),
    }
}

/// Translations Tx, Ty, Tz (transform as x, y, z).
pub fn translations(s: &Structure) -> Basis {
    triple(s, BasisKind::Translations, "T", false)
}

/// Rotations Rx, Ry, Rz (transform as an axial vector).
pub fn rotations(s: &Structure) -> Basis {
    triple(s, BasisKind::Rotations, "R", true)
}

/// Γvib and its parts.
#[derive(Debug, Clone)]
pub struct Vibrations {
    pub gamma_3n: Character,
    pub gamma_trans: Character,
    pub gamma_rot: Character,
    pub gamma_vib: Character,
    /// Multiplicities of Γvib in the group's irreps (for a linear molecule: in C∞v/D∞h).
    pub multiplicities: Vec<u64>,
    /// 3N − 6, or 3N − 5 for a linear molecule.
    pub count: usize,
    pub linear: bool,
    /// How a linear molecule was reduced.
    pub note: Option<String>,
}

fn minus(a: &Character, b: &Character) -> Character {
    Character(a.0.iter().zip(&b.0).map(|(x, y)| x - y).collect())
}

/// Γvib of a nonlinear molecule in its (finite) point group.
pub fn vibrations(s: &Structure) -> Result<Vibrations, BasisError> {
    if s.is_linear_molecule() {
        return Err(BasisError::LinearMolecule {
            group: s.group.name().to_string(),
        });
    }
    let g3n = cartesian_character(s);
    let gt = translations(s).character();
    let gr = rotations(s).character();
    let gv = minus(&minus(&g3n, &gt), &gr);
    let m = rep::decompose(&s.group, &gv).map_err(|_| BasisError::NotARepresentation {
        basis: "vibrations".into(),
    })?;
    Ok(Vibrations {
        gamma_3n: g3n,
        gamma_trans: gt,
        gamma_rot: gr,
        gamma_vib: gv,
        multiplicities: m,
        count: 3 * s.len() - 6,
        linear: false,
        note: None,
    })
}

/// Γvib of a linear molecule. `s` must stand in the finite subgroup the linear table names
/// (C2v for C∞v, D2h for D∞h) with the molecule along z; only Rx, Ry count as rotations.
pub fn vibrations_linear(s: &Structure, linear: &PointGroup) -> Result<Vibrations, BasisError> {
    let on_z = s
        .atoms
        .iter()
        .all(|a| a.position.x.abs() < s.tol && a.position.y.abs() < s.tol);
    if !on_z {
        return Err(BasisError::NotOnAxis);
    }
    let g3n = cartesian_character(s);
    let gt = translations(s).character();
    // Rz is not a rotation of a linear molecule: χ_rot = det·(tr R − R_zz).
    let gr = Character(
        class_representatives(&s.group)
            .iter()
            .map(|&o| {
                let m = &s.group.ops[o].matrix;
                &mat_det(m) * &(mat_trace(m) - m[2][2].clone())
            })
            .collect(),
    );
    let gv = minus(&minus(&g3n, &gt), &gr);
    let red = rep::reduce_via_subgroup(linear, &s.group, gv.clone())
        .map_err(|message| BasisError::Linear { message })?;
    Ok(Vibrations {
        gamma_3n: g3n,
        gamma_trans: gt,
        gamma_rot: gr,
        gamma_vib: gv,
        multiplicities: red.multiplicities,
        count: 3 * s.len() - 5,
        linear: true,
        note: Some(red.note),
    })
}
