//! Point-group detection on float geometries, and the near-miss report.
//!
//! Meaning of the tolerance `tol` (Å): the molecule has group G at `tol` when there is a
//! G-symmetric structure (same atoms, found by group averaging in a fitted frame) from
//! which no atom is more than `tol` away; that largest displacement is
//! [`Detection::max_deviation`]. Candidate elements are screened at twice the tolerance
//! (an image must land within 2·tol of an atom of its element), then the group is fitted
//! and verified; if the fit exceeds `tol` the screening is tightened and the search
//! repeated. Cost is about linear in the number of atoms (see [`search`]).
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
    let centro = ctx.full(&(-M3::identity())).and_then(|p| {
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

/// One search at screening tolerance `s`; `None` if the group found does not fit at `tol`.
fn attempt(mol: &Molecule, centre: &V3, tol: f64, s: f64) -> Option<Detection> {
    let ctx = prepare(mol, centre, s);
    let found = search::find_elements(&ctx);
    let cl = classify::classify(&ctx, &found)?;
    let fitted = fit::fit(&ctx, cl.family, cl.frame)?;
    if fitted.max_dev > tol {
        return None;
    }
    Some(Detection {
        group: cl.family.name(),
        centre: centre + fitted.shift,
        frame: fitted.frame,
        max_deviation: fitted.max_dev,
        tolerance: tol,
        operations: fitted.ops,
        notes: cl.notes,
    })
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
    let centre = mol.centre_of_mass();
    let mut s = 2.0 * tol;
    for _ in 0..16 {
        if let Some(d) = attempt(mol, &centre, tol, s) {
            return Ok(d);
        }
        s *= 0.7;
    }
    Ok(make(Family::C1, centre, M3::identity(), 0.0, tol, vec![]))
}

/// The group at each tolerance in `tolerances` (ascending order is kept as given), with
/// its largest deviation — e.g. for "D3h at 0.01 Å; D6h if 0.08 Å is allowed".
pub fn near_misses(mol: &Molecule, tolerances: &[f64]) -> Result<Vec<NearMiss>, GeomError> {
    let mut out: Vec<NearMiss> = Vec::with_capacity(tolerances.len());
    for &t in tolerances {
        // Ih and D∞h contain every other group a molecule can have: once reached, a looser
        // tolerance cannot find more (and the search at large tolerances is the costly part).
        if let Some(last) = out.last() {
            if (last.group == "Ih" || last.group == "Dinfh") && t >= last.tolerance {
                out.push(NearMiss {
                    tolerance: t,
                    ..last.clone()
                });
                continue;
            }
        }
        let d = detect(mol, t)?;
        out.push(NearMiss {
            tolerance: t,
            group: d.group,
            max_deviation: d.max_deviation,
        });
    }
    Ok(out)
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
