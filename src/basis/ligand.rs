//! Ligand σ vectors (one per ligand, pointing at the central atom) and ligand π pairs (two
//! vectors perpendicular to each central–ligand bond).
//!
//! σ: R carries σ_L to σ_R(L) (Cotton, 3rd ed., §8.3). π: the frame is defined exactly on one
//! ligand L₀ per set of equivalent ligands and carried to the others, F_L = g_L·F₀ with g_L a
//! fixed operation taking L₀ to L. Then R·F_L = F_R(L)·D(s) with s = g_R(L)⁻¹·R·g_L in the
//! site group of L₀, and D(s) is computed exactly from s's matrix: the site group is Cₙ or Cₙᵥ
//! about the bond, and the frame is built from its exact rotation axis and mirror normal.

use super::action::{Basis, BasisKind, Member};
use super::images::{check_size, permutation_images, ImagesBuilder};
use super::structure::{orbits, Structure};
use super::BasisError;
use crate::exact::{sqrt, Cyclo};
use crate::group::{Mat3, PointGroup};
use std::sync::Arc;

type Vec3 = [Cyclo; 3];

fn check_centre(s: &Structure, centre: usize) -> Result<(), BasisError> {
    if centre >= s.len() {
        return Err(BasisError::NoSuchAtom {
            atom: centre + 1,
            n_atoms: s.len(),
        });
    }
    if s.atoms[centre].position.norm() > s.tol {
        return Err(BasisError::CentreNotFixed {
            atom: centre + 1,
            label: s.label(centre),
        });
    }
    Ok(())
}

/// The ligands of a centre: atoms bonded to it, or every other atom if the structure has no bonds.
pub fn default_ligands(s: &Structure, centre: usize) -> Vec<usize> {
    let bonded: Vec<usize> = s
        .bonds
        .iter()
        .filter_map(|&(a, b)| {
            if a == centre {
                Some(b)
            } else if b == centre {
                Some(a)
            } else {
                None
            }
        })
        .collect();
    if bonded.is_empty() {
        (0..s.len()).filter(|&a| a != centre).collect()
    } else {
        bonded
    }
}

fn ligand_perm(s: &Structure, ligands: &[usize]) -> Result<Vec<Vec<usize>>, BasisError> {
    let mut out = Vec::with_capacity(s.group.order());
    for (o, op) in s.group.ops.iter().enumerate() {
        let mut row = Vec::with_capacity(ligands.len());
        for &l in ligands {
            let img = s.perm[o][l];
            let k =
                ligands
                    .iter()
                    .position(|&x| x == img)
                    .ok_or_else(|| BasisError::NotClosed {
                        what: format!("ligand {}", s.label(l)),
                        operation: op.name.clone(),
                        image: s.label(img),
                    })?;
            row.push(k);
        }
        out.push(row);
    }
    Ok(out)
}

/// σ vectors of `ligands` pointing at `centre` (the atom at the origin).
pub fn sigma(s: &Structure, centre: usize, ligands: &[usize]) -> Result<Basis, BasisError> {
    check_centre(s, centre)?;
    check_size(BasisKind::Sigma, ligands.len(), s.group.order())?;
    let site_perm = ligand_perm(s, ligands)?;
    let members = ligands
        .iter()
        .enumerate()
        .map(|(k, &l)| Member {
            name: format!("σ{}", k + 1),
            atoms: vec![l],
            axis: None,
            site: k,
        })
        .collect();
    let images = Arc::new(permutation_images(ligands.len(), &site_perm));
    Ok(Basis {
        kind: BasisKind::Sigma,
        group: s.group.clone(),
        members,
        sites: ligands.iter().map(|&l| s.label(l)).collect(),
        site_perm,
        images,
        notes: Vec::new(),
    })
}

fn dot(a: &Vec3, b: &Vec3) -> Cyclo {
    (0..3).map(|i| &a[i] * &b[i]).sum()
}
fn cross(a: &Vec3, b: &Vec3) -> Vec3 {
    [
        &a[1] * &b[2] - &a[2] * &b[1],
        &a[2] * &b[0] - &a[0] * &b[2],
        &a[0] * &b[1] - &a[1] * &b[0],
    ]
}
fn scale(a: &Vec3, k: &Cyclo) -> Vec3 {
    std::array::from_fn(|i| &a[i] * k)
}
fn apply(m: &Mat3, v: &Vec3) -> Vec3 {
    std::array::from_fn(|i| (0..3).map(|j| &m[i][j] * &v[j]).sum())
}
fn is_zero(v: &Vec3) -> bool {
    v.iter().all(|x| x.is_zero())
}
fn column(m: &Mat3, j: usize) -> Vec3 {
    std::array::from_fn(|i| m[i][j].clone())
}
fn float(v: &Vec3) -> nalgebra::Vector3<f64> {
    nalgebra::Vector3::new(v[0].re_f64(), v[1].re_f64(), v[2].re_f64())
}

/// Exact rotation axis of a proper rotation ≠ E.
fn rotation_axis(m: &Mat3) -> Vec3 {
    let a = [
        &m[2][1] - &m[1][2],
        &m[0][2] - &m[2][0],
        &m[1][0] - &m[0][1],
    ];
    if !is_zero(&a) {
        return a;
    }
    // a half turn: M + I has rank 1, its nonzero columns lie along the axis
    let one = Cyclo::one();
    (0..3)
        .map(|j| {
            let mut c = column(m, j);
            c[j] += &one;
            c
        })
        .find(|c| !is_zero(c))
        .expect("a half turn has an axis")
}

/// Exact normal of a mirror: a nonzero column of I − σ.
fn mirror_normal(m: &Mat3) -> Vec3 {
    let one = Cyclo::one();
    (0..3)
        .map(|j| {
            let mut c = scale(&column(m, j), &Cyclo::from_int(-1));
            c[j] += &one;
            c
        })
        .find(|c| !is_zero(c))
        .expect("a mirror has a normal")
}

fn is_identity(g: &PointGroup, o: usize) -> bool {
    (g.ops[o].float - nalgebra::Matrix3::identity()).abs().max() < 1e-9
}

/// The 2×2 action of every site-group operation on the π frame of one ligand.
struct SiteFrame {
    /// (op index, D(op)) for the operations of the site group.
    action: Vec<(usize, [[Cyclo; 2]; 2])>,
    note: String,
    /// The frame's a and b as unit vectors (for stating every ligand's frame).
    a: nalgebra::Vector3<f64>,
    b: nalgebra::Vector3<f64>,
}

fn unit_f(v: &Vec3) -> nalgebra::Vector3<f64> {
    let f = float(v);
    f / f.norm()
}

/// a, b for a site without a rotation axis: a in the mirror plane (⟂ the bond), b along the
/// mirror's normal; without a mirror, a ⟂ the bond and a Cartesian axis, b = bond × a.
fn loose_frame(
    d: nalgebra::Vector3<f64>,
    normal: Option<nalgebra::Vector3<f64>>,
) -> [nalgebra::Vector3<f64>; 2] {
    let u = d / d.norm();
    let b = match normal {
        Some(n) => n / n.norm(),
        None => {
            let e = [nalgebra::Vector3::z(), nalgebra::Vector3::x()]
                .into_iter()
                .find(|e| u.cross(e).norm() > 1e-6)
                .unwrap_or_else(nalgebra::Vector3::y);
            let a = u.cross(&e).normalize();
            u.cross(&a).normalize()
        }
    };
    [b.cross(&u).normalize(), b]
}

fn site_frame(s: &Structure, l0: usize, stab: &[usize]) -> Result<SiteFrame, BasisError> {
    let g = &s.group;
    let rot = stab
        .iter()
        .copied()
        .find(|&o| g.ops[o].is_proper() && !is_identity(g, o));
    let mirror = stab.iter().copied().find(|&o| !g.ops[o].is_proper());
    let d = s.atoms[l0].position;
    let label = s.label(l0);
    let Some(r) = rot else {
        // Site group C1 or Cs: a lies in the mirror plane, b along its normal.
        let action = stab
            .iter()
            .map(|&o| {
                let sign = if g.ops[o].is_proper() { 1 } else { -1 };
                (
                    o,
                    [
                        [Cyclo::one(), Cyclo::zero()],
                        [Cyclo::zero(), Cyclo::from_int(sign)],
                    ],
                )
            })
            .collect();
        let [fa, fb] = loose_frame(d, mirror.map(|m| float(&mirror_normal(&g.ops[m].matrix))));
        let note = match mirror {
            Some(m) => format!(
                "π frame on {label}: a in the mirror plane {}, b along its normal",
                g.ops[m].name
            ),
            None => {
                format!("π frame on {label}: any two perpendicular directions (no site symmetry)")
            }
        };
        return Ok(SiteFrame {
            action,
            note,
            a: fa,
            b: fb,
        });
    };
    let mut axis = rotation_axis(&g.ops[r].matrix);
    if float(&axis).dot(&d) < 0.0 {
        axis = scale(&axis, &Cyclo::from_int(-1));
    }
    let len = sqrt(&dot(&axis, &axis)).map_err(|e| BasisError::Inexact {
        what: format!("the length of the site axis at {label}"),
        message: e.to_string(),
    })?;
    let unit = scale(&axis, &len.inv().expect("axis is nonzero"));
    let (a, b, note) = match mirror {
        Some(m) => {
            let n = mirror_normal(&g.ops[m].matrix);
            (
                cross(&unit, &n),
                n,
                format!(
                    "π frame on {label}: a in the mirror plane {}, b along its normal",
                    g.ops[m].name
                ),
            )
        }
        None => {
            let e = (0..3)
                .map(|k| std::array::from_fn(|i| Cyclo::from_int((i == k) as i64)))
                .find(|e: &Vec3| !is_zero(&cross(&unit, e)))
                .expect("some axis is not parallel");
            let a = cross(&unit, &e);
            let b = cross(&unit, &a);
            (
                a,
                b,
                format!("π frame on {label}: a, b perpendicular to the site axis"),
            )
        }
    };
    let na = dot(&a, &a);
    let frame = [a, b];
    let action = stab
        .iter()
        .map(|&o| {
            let m = &g.ops[o].matrix;
            let d2: [[Cyclo; 2]; 2] = std::array::from_fn(|i| {
                std::array::from_fn(|j| &dot(&frame[i], &apply(m, &frame[j])) / &na)
            });
            (o, d2)
        })
        .collect();
    let (fa, fb) = (unit_f(&frame[0]), unit_f(&frame[1]));
    Ok(SiteFrame {
        action,
        note,
        a: fa,
        b: fb,
    })
}

/// π pairs on `ligands` (two vectors ⟂ each centre–ligand bond): members `π1a π1b π2a …`.
pub fn pi(s: &Structure, centre: usize, ligands: &[usize]) -> Result<Basis, BasisError> {
    check_centre(s, centre)?;
    check_size(BasisKind::Pi, 2 * ligands.len(), s.group.order())?;
    let g = &s.group;
    let site_perm = ligand_perm(s, ligands)?;
    let n = ligands.len();
    // carrier[k] = an operation taking the orbit representative onto ligand k
    let mut carrier = vec![0usize; n];
    let mut rep_of = vec![0usize; n];
    let mut frames: Vec<Option<SiteFrame>> = (0..n).map(|_| None).collect();
    let mut notes = Vec::new();
    for orbit in orbits(n, |o, k| site_perm[o][k], g.order()) {
        let r = orbit[0];
        for &k in &orbit {
            carrier[k] = (0..g.order())
                .find(|&o| site_perm[o][r] == k)
                .expect("orbit member is reached");
            rep_of[k] = r;
        }
        let stab: Vec<usize> = (0..g.order()).filter(|&o| site_perm[o][r] == r).collect();
        let f = site_frame(s, ligands[r], &stab)?;
        notes.push(f.note.clone());
        frames[r] = Some(f);
    }
    // Every ligand's frame, carried from its orbit's representative (a_k = R·a_r), so each
    // coefficient can be read against explicit directions.
    for k in 0..n {
        let f = frames[rep_of[k]].as_ref().expect("frame of representative");
        let r = &g.ops[carrier[k]].float;
        let (a, b) = (r * f.a, r * f.b);
        let v = |x: nalgebra::Vector3<f64>| {
            let c = |t: f64| if t.abs() < 5e-4 { 0.0 } else { t };
            format!("({:.3}, {:.3}, {:.3})", c(x.x), c(x.y), c(x.z))
        };
        notes.push(format!(
            "π frame on {} (π{}a, π{}b): a = {}, b = {}",
            s.label(ligands[k]),
            k + 1,
            k + 1,
            v(a),
            v(b)
        ));
    }
    let mut images = ImagesBuilder::new(2 * n);
    for o in 0..g.order() {
        for k in 0..n {
            let k2 = site_perm[o][k];
            let sop = g.product(g.inverse(carrier[k2]), g.product(o, carrier[k]));
            let frame = frames[rep_of[k]].as_ref().expect("frame of representative");
            let d = &frame
                .action
                .iter()
                .find(|(x, _)| *x == sop)
                .expect("s lies in the site group")
                .1;
            for j in 0..2 {
                for i in 0..2 {
                    if !d[i][j].is_zero() {
                        images.push_number(2 * k2 + i, &d[i][j]);
                    }
                }
                images.end_column();
            }
        }
        images.end_op();
    }
    let images = Arc::new(images.finish());
    let mut members = Vec::with_capacity(2 * n);
    for (k, &l) in ligands.iter().enumerate() {
        for ax in ["a", "b"] {
            members.push(Member {
                name: format!("π{}{ax}", k + 1),
                atoms: vec![l],
                axis: Some(ax.to_string()),
                site: k,
            });
        }
    }
    Ok(Basis {
        kind: BasisKind::Pi,
        group: g.clone(),
        members,
        sites: ligands.iter().map(|&l| s.label(l)).collect(),
        site_perm,
        images,
        notes,
    })
}
