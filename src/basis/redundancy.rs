//! Redundancy of an internal-coordinate set (stretches + bends) against Γvib.
//!
//! Per irrep, an internal set carrying more copies than Γvib has redundant combinations (the six
//! bends at a tetrahedral centre carry one redundant A₁); fewer copies means the set fails to
//! cover that irrep (Wilson, Decius & Cross, *Molecular Vibrations*, §4-4; Nakamoto, *Infrared
//! and Raman Spectra of Inorganic and Coordination Compounds*, Part A, §1.10). Which combination
//! is redundant is geometry: the Wilson B matrix (here, floating point) has it in its left null
//! space.

use super::action::{Basis, BasisKind};
use super::cartesian::Vibrations;
use super::structure::Structure;
use super::BasisError;
use nalgebra::Vector3;

/// Irrep-by-irrep comparison of an internal set with Γvib.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Redundancy {
    pub stretch: Vec<u64>,
    pub bend: Vec<u64>,
    pub internal: Vec<u64>,
    pub vib: Vec<u64>,
    /// Copies of each irrep the internal set carries beyond Γvib.
    pub redundant: Vec<u64>,
    /// Copies of each irrep of Γvib the internal set fails to cover.
    pub missing: Vec<u64>,
    /// Γvib split into stretching and deformation parts (stretch part = Γstretch where the
    /// stretches are not themselves redundant).
    pub vib_stretch: Vec<u64>,
    pub vib_bend: Vec<u64>,
}

/// Compare stretches and bends with Γvib.
pub fn redundancy(
    stretch: &Basis,
    bend: &Basis,
    vib: &Vibrations,
) -> Result<Redundancy, BasisError> {
    let st = stretch.multiplicities()?;
    let be = bend.multiplicities()?;
    let v = &vib.multiplicities;
    let internal: Vec<u64> = st.iter().zip(&be).map(|(a, b)| a + b).collect();
    let redundant = internal
        .iter()
        .zip(v)
        .map(|(i, v)| i.saturating_sub(*v))
        .collect();
    let missing = internal
        .iter()
        .zip(v)
        .map(|(i, v)| v.saturating_sub(*i))
        .collect();
    let vib_stretch: Vec<u64> = st.iter().zip(v).map(|(s, v)| (*s).min(*v)).collect();
    let vib_bend = v.iter().zip(&vib_stretch).map(|(v, s)| v - s).collect();
    Ok(Redundancy {
        stretch: st,
        bend: be,
        internal,
        vib: v.clone(),
        redundant,
        missing,
        vib_stretch,
        vib_bend,
    })
}

/// Wilson B-matrix rows (one per member, 3N columns) for stretches and bends, in Å-based units.
pub fn b_matrix(s: &Structure, basis: &Basis) -> Result<Vec<Vec<f64>>, BasisError> {
    let n3 = 3 * s.len();
    let pos = |a: usize| s.atoms[a].position;
    let put = |row: &mut Vec<f64>, a: usize, v: Vector3<f64>| {
        for i in 0..3 {
            row[3 * a + i] += v[i];
        }
    };
    let mut rows = Vec::with_capacity(basis.dim());
    for m in &basis.members {
        let mut row = vec![0.0; n3];
        match basis.kind {
            BasisKind::Stretch => {
                let (a, b) = (m.atoms[0], m.atoms[1]);
                let u = (pos(a) - pos(b)).normalize();
                put(&mut row, a, u);
                put(&mut row, b, -u);
            }
            BasisKind::Bend => {
                let (i, j, k) = (m.atoms[0], m.atoms[1], m.atoms[2]);
                let (d1, d2) = (pos(i) - pos(j), pos(k) - pos(j));
                let (r1, r2) = (d1.norm(), d2.norm());
                let (e1, e2) = (d1 / r1, d2 / r2);
                let c = e1.dot(&e2);
                let sn = (1.0 - c * c).max(0.0).sqrt();
                if sn < 1e-6 {
                    return Err(BasisError::LinearAngle {
                        angle: m.name.clone(),
                    });
                }
                let si = (e1 * c - e2) / (r1 * sn);
                let sk = (e2 * c - e1) / (r2 * sn);
                put(&mut row, i, si);
                put(&mut row, k, sk);
                put(&mut row, j, -si - sk);
            }
            _ => {
                return Err(BasisError::NotInternal {
                    basis: basis.kind.name().into(),
                })
            }
        }
        rows.push(row);
    }
    Ok(rows)
}
