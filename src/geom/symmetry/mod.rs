//! Point-group detection on float geometries, and the near-miss report.
//!
//! Meaning of the tolerance `tol` (Å): the molecule has group G at `tol` when there is a
//! G-symmetric structure (same atoms, found by group averaging about the centre of mass in
//! a fitted frame) from which no atom is more than `tol` away; that largest displacement is
//! [`Detection::max_deviation`], and [`crate::geom::symmetrize`] to the detected
//! operations moves no atom further. Candidate elements are searched once, each recorded
//! with the deviation it needs (an image must land within 2·tol of an atom of its
//! element), then the group is fitted and verified; if the fit exceeds `tol` the
//! screening is tightened by reading the same catalogue at a smaller deviation, without a
//! new search. Cost is about linear in the number of atoms (see [`search`]).
//!
//! Near misses go up, never down: from the group at the tightest tolerance, each looser
//! tolerance keeps it or finds a group containing it (same operations, same frame up to the
//! refit), read from one element search at the loosest tolerance.
//!
//! Files: [`groups`] (names, orders, standard generators), [`classes`] (atom classes),
//! [`search`] (elements), [`classify`] (flow chart and frame), [`fit`] (fit and verify).

pub mod groups;

mod classes;
mod classify;
mod fit;
mod search;

use nalgebra::{Matrix3, Vector3};
use serde::{Deserialize, Serialize};

use super::elements;
use super::linalg::{perpendicular, sym_eigen, M3, V3};
use super::molecule::{check_positive, Molecule};
use super::GeomError;
pub use groups::{group_order, supported_groups, Family};
pub(crate) use search::Ctx;

/// Default detection tolerance, Å.
pub const DEFAULT_TOLERANCE: f64 = 0.01;

/// Tolerances tried by default in the near-miss report, Å.
pub const NEAR_MISS_TOLERANCES: [f64; 4] = [0.01, 0.03, 0.1, 0.3];

/// The result of point-group detection.
#[derive(Debug, Clone, PartialEq)]
pub struct Detection {
    /// Table name of the group (`"C2v"`, `"Dinfh"`, …).
    pub group: String,
    /// The fixed point of the group, in input coordinates (Å).
    pub centre: Vector3<f64>,
    /// Rows = the new x, y, z axes in input coordinates: new = frame · (old − centre).
    pub frame: Matrix3<f64>,
    /// Largest displacement of an atom from the fitted symmetric structure, Å.
    pub max_deviation: f64,
    /// The tolerance the detection ran at, Å.
    pub tolerance: f64,
    /// All operations in the new frame, identity first (for Cinfv/Dinfh the finite
    /// stand-ins C2v/D2h).
    pub operations: Vec<Matrix3<f64>>,
    /// Remarks for the user (reduced axis orders, linear stand-ins, single atoms).
    pub notes: Vec<String>,
}

impl Detection {
    /// The group as a [`Family`] value.
    pub fn family(&self) -> Option<Family> {
        Family::parse(&self.group)
    }

    /// The operations expressed in input coordinates (acting about [`Detection::centre`]).
    pub fn input_operations(&self) -> Vec<Matrix3<f64>> {
        let f = self.frame;
        self.operations
            .iter()
            .map(|g| f.transpose() * g * f)
            .collect()
    }

    /// The molecule moved to the detected centre and frame (new = frame · (old − centre)).
    pub fn apply_frame(&self, mol: &Molecule) -> Molecule {
        let mut m = mol.clone();
        for a in &mut m.atoms {
            a.position = self.frame * (a.position - self.centre);
        }
        m
    }
}

/// One line of the near-miss report.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct NearMiss {
    /// Tolerance tried, Å.
    pub tolerance: f64,
    /// Group found at that tolerance.
    pub group: String,
    /// Its largest atom displacement, Å.
    pub max_deviation: f64,
}

fn prepare(mol: &Molecule, centre: &V3, s: f64) -> Ctx {
    let pos = mol.atoms.iter().map(|a| a.position - centre).collect();
    let elem = mol.atoms.iter().map(|a| a.element).collect();
    let mass = mol
        .atoms
        .iter()
        .map(|a| elements::mass(a.element).unwrap_or(1.0))
        .collect();
    Ctx::new(pos, elem, mass, s)
}

fn make(
    family: Family,
    centre: V3,
    frame: M3,
    dev: f64,
    tol: f64,
    notes: Vec<String>,
) -> Detection {
    Detection {
        group: family.name(),
        centre,
        frame,
        max_deviation: dev,
        tolerance: tol,
        operations: family.operations(),
        notes,
    }
}

/// Linear molecules: all atoms within `tol` of the least-squares line (through the
/// unweighted centroid, along the principal axis of the coordinate covariance).
fn linear(mol: &Molecule, tol: f64) -> Option<Detection> {
    let centre = mol.centroid();
    let ctx = prepare(mol, &centre, 2.0 * tol);
    let cov: M3 = ctx.pos.iter().map(|p| p * p.transpose()).sum();
    let e: V3 = sym_eigen(&cov).1[2].normalize();
    let perp = ctx
        .pos
        .iter()
        .map(|p| (p - e * e.dot(p)).norm())
        .fold(0.0, f64::max);
    if perp > tol {
        return None;
    }
    let x = perpendicular(&e, &V3::x());
    let centro = ctx.matches(&(-M3::identity()), ctx.s).and_then(|(p, _)| {
        let dev = ctx
            .pos
            .iter()
            .zip(&p)
            .map(|(a, &j)| {
                let y = e * 0.5 * (e.dot(a) - e.dot(&ctx.pos[j]));
                (a - y).norm()
            })
            .fold(0.0, f64::max);
        (dev <= tol).then_some(dev)
    });
    let (family, z, dev) = match centro {
        Some(dev) => (Family::Dinfh, e, dev),
        None => {
            let t: f64 = ctx
                .pos
                .iter()
                .zip(&ctx.mass)
                .map(|(p, m)| m * e.dot(p).powi(3))
                .sum();
            (Family::Cinfv, if t < 0.0 { -e } else { e }, perp)
        }
    };
    let y = z.cross(&x);
    let frame = M3::from_rows(&[x.transpose(), y.transpose(), z.transpose()]);
    let stand_in = if family == Family::Dinfh {
        "D2h"
    } else {
        "C2v"
    };
    let notes = vec![format!(
        "linear molecule: the operations listed are those of the finite subgroup {stand_in} \
         customarily used in place of {}",
        family.name()
    )];
    Some(make(family, centre, frame, dev, tol, notes))
}

/// The elements of a molecule searched once, up to the screening tolerance `ctx.s`.
struct Searched {
    ctx: Ctx,
    cat: search::Catalogue,
    centre: V3,
}

fn search_elements(mol: &Molecule, s_max: f64) -> Searched {
    let centre = mol.centre_of_mass();
    let ctx = prepare(mol, &centre, s_max);
    let cat = search::catalogue(&ctx);
    Searched { ctx, cat, centre }
}

/// The group at `tol` read from the catalogue: screening from 2·tol down (×0.7 per step),
/// the first classification whose fit stays within `tol` and that `accept` takes.
fn group_at(sr: &Searched, tol: f64, accept: impl Fn(&Detection) -> bool) -> Option<Detection> {
    let mut s = (2.0 * tol).min(sr.ctx.s);
    for _ in 0..16 {
        let found = sr.cat.at(s);
        if let Some(cl) = classify::classify(&sr.ctx, &found, s) {
            if let Some(f) = fit::fit(&sr.ctx, cl.family, cl.frame, s) {
                if f.max_dev <= tol {
                    let d = Detection {
                        group: cl.family.name(),
                        centre: sr.centre,
                        frame: f.frame,
                        max_deviation: f.max_dev,
                        tolerance: tol,
                        operations: f.ops,
                        notes: cl.notes,
                    };
                    if accept(&d) {
                        return Some(d);
                    }
                }
            }
        }
        s *= 0.7;
    }
    None
}

/// Detects the point group of `mol` at tolerance `tol` (Å; [`DEFAULT_TOLERANCE`] is
/// 0.01). Works on any orientation and position; see the module docs for the meaning of
/// the tolerance.
pub fn detect(mol: &Molecule, tol: f64) -> Result<Detection, GeomError> {
    check_positive("tolerance", tol)?;
    mol.validate()?;
    if mol.atoms.len() == 1 {
        let notes = vec![
            "single atom: full spherical symmetry; reported as Ih, the largest supported \
             finite group"
                .to_string(),
        ];
        return Ok(make(
            Family::Ih,
            mol.atoms[0].position,
            M3::identity(),
            0.0,
            tol,
            notes,
        ));
    }
    if let Some(d) = linear(mol, tol) {
        return Ok(d);
    }
    let sr = search_elements(mol, 2.0 * tol);
    Ok(group_at(&sr, tol, |_| true)
        .unwrap_or_else(|| make(Family::C1, sr.centre, M3::identity(), 0.0, tol, vec![])))
}

/// Groups no supported group contains: a looser tolerance cannot find more.
fn is_maximal(group: &str) -> bool {
    matches!(group, "Oh" | "Ih" | "Dinfh")
}

/// Whether the group of `big` contains that of `small` in a compatible orientation:
/// every operation of `small` is (up to the frames' refits) an operation of `big`; for a
/// linear `big`, every operation of `small` keeps its axis (C∞v: pointing the same way).
pub fn contains(big: &Detection, small: &Detection) -> bool {
    const SAME: f64 = 0.15;
    let axis = |d: &Detection| -> V3 { d.frame.row(2).transpose() };
    let linear = |d: &Detection| matches!(d.group.as_str(), "Cinfv" | "Dinfh");
    if linear(small) {
        return linear(big)
            && axis(big).dot(&axis(small)).abs() >= 1.0 - SAME
            && (big.group == "Dinfh" || small.group == "Cinfv");
    }
    let ops = small.input_operations();
    if linear(big) {
        let e = axis(big);
        let both_ways = big.group == "Dinfh";
        return ops.iter().all(|g| {
            let ge = g * e;
            (ge - e).norm() <= SAME || (both_ways && (ge + e).norm() <= SAME)
        });
    }
    let theirs = big.input_operations();
    ops.iter().all(|g| {
        theirs
            .iter()
            .any(|h| (g - h).iter().all(|x| x.abs() <= SAME))
    })
}

/// The detections of the near-miss report: `start`, then one for each tolerance in
/// `tolerances` above `start.tolerance` (ascending), each the largest group found at that
/// tolerance that contains the previous one (or the previous one kept, with its
/// deviation). One element search at the loosest tolerance serves them all, and none is
/// needed once a group no other contains (Oh, Ih, D∞h) is reached.
pub fn near_miss_detections(
    mol: &Molecule,
    start: &Detection,
    tolerances: &[f64],
) -> Result<Vec<Detection>, GeomError> {
    mol.validate()?;
    let mut tols: Vec<f64> = tolerances
        .iter()
        .copied()
        .filter(|t| t.is_finite() && *t > start.tolerance)
        .collect();
    tols.sort_by(f64::total_cmp);
    tols.dedup();
    let mut out = vec![start.clone()];
    let mut searched: Option<Searched> = None;
    let t_max = tols.last().copied().unwrap_or(start.tolerance);
    for t in tols {
        let prev = out.last().cloned().unwrap_or_else(|| start.clone());
        let mut next = None;
        if !is_maximal(&prev.group) && mol.atoms.len() > 1 {
            next = linear(mol, t).filter(|d| contains(d, &prev));
            if next.is_none() {
                let sr = searched.get_or_insert_with(|| search_elements(mol, 2.0 * t_max));
                next = group_at(sr, t, |d| contains(d, &prev));
            }
        }
        let mut d = match next {
            Some(d) if d.group != prev.group => d,
            _ => prev,
        };
        d.tolerance = t;
        out.push(d);
    }
    Ok(out)
}

/// The near-miss report of `start` (see [`near_miss_detections`]).
pub fn near_misses_from(
    mol: &Molecule,
    start: &Detection,
    tolerances: &[f64],
) -> Result<Vec<NearMiss>, GeomError> {
    Ok(near_miss_detections(mol, start, tolerances)?
        .into_iter()
        .map(|d| NearMiss {
            tolerance: d.tolerance,
            group: d.group,
            max_deviation: d.max_deviation,
        })
        .collect())
}

/// The group at each tolerance in `tolerances` (ascending, duplicates dropped), with its
/// largest deviation — e.g. for "D3h at 0.01 Å; D6h if 0.08 Å is allowed". Detects at the
/// smallest tolerance, then goes up (see [`near_miss_detections`]).
pub fn near_misses(mol: &Molecule, tolerances: &[f64]) -> Result<Vec<NearMiss>, GeomError> {
    let Some(t0) = tolerances.iter().copied().min_by(f64::total_cmp) else {
        return Ok(Vec::new());
    };
    let start = detect(mol, t0)?;
    near_misses_from(mol, &start, tolerances)
}
/// A one-line summary of a near-miss report: the first group, then each different group
/// with the displacement it needs, e.g. `"D3h at 0.01 Å; D6h if 0.080 Å is allowed"`.
pub fn near_miss_summary(report: &[NearMiss]) -> String {
    let mut out = String::new();
    let mut last: Option<&str> = None;
    for nm in report {
        match last {
            None => out.push_str(&format!("{} at {} Å", nm.group, nm.tolerance)),
            Some(g) if g != nm.group => out.push_str(&format!(
                "; {} if {:.3} Å is allowed",
                nm.group, nm.max_deviation
            )),
            _ => {}
        }
        last = Some(&nm.group);
    }
    out
}
