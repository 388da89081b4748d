//! Finite subgroups of the linear groups C∞v and D∞h: every table group H whose operations can
//! be placed so that each keeps the molecular axis (z) as a line — C∞v: each keeps z; D∞h: each
//! sends z to ±z. In H's standard frame such a line is one of H's axes x, y, z (a group with a
//! ≥3-fold axis keeps only that axis; the others are made of twofold operations about H's
//! axes), so each of x, y, z is tried as the molecular axis. Embeddings whose operations meet
//! the same classes of the linear group at the same angles are one embedding (they are
//! conjugate under a rotation about the axis); the first in the order z, y, x is kept, which
//! gives the customary labels (C2v with its C2 across the axis: the molecule in the yz plane
//! with the axis along y, as for bent XY2; Herzberg 1945, ch. II; Mulliken 1955).
//!
//! Each operation is classified by what it does to the axis: rotation by φ about it, a
//! reflection containing it (σv), C2 across it, i, S(φ) = σh·C(φ); a species of Λ = |m|
//! has there 2cos Λφ, 0, 0, ±2, (−1)^Λ·(±2cos Λφ) (Σ: 1, ±1, ±1, ±1, ±1) — the characters of
//! Herzberg's tables of C∞v and D∞h.
//!
//! Owns: [`linear_embeddings`].

use super::descent::{ClassLink, CorrelationRow, Embedding};
use super::error::SpectraError;
use super::lambda::Species;
use super::real::real_irreps;
use super::symmetry::symmetry_of_rows;
use crate::exact::{parse_with_phi, Cyclo};
use crate::group::{OpSpec, PointGroup, Turn};
use crate::rep::{decompose, Character};
use nalgebra::{Matrix3, Vector3};
use num_bigint::BigInt;
use num_rational::BigRational;

const TOL: f64 = 1e-6;
/// Angles of the finite groups' operations are multiples of 1/1680 turn (orders up to 16, 7, 14).
const ANGLE_GRID: i64 = 1680;

/// What an operation does to the molecular axis.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub(crate) enum AxisOp {
    Identity,
    /// Rotation about the axis by `k/1680` of a turn.
    Rotation(i64),
    /// Reflection in a plane containing the axis.
    SigmaV,
    Inversion,
    /// σh·C(φ), φ = k/1680 turn (k = 0: σh).
    Improper(i64),
    /// Twofold rotation about a line across the axis.
    C2Across,
}

fn turn_of(m: &Matrix3<f64>) -> Option<i64> {
    let a = m[(1, 0)].atan2(m[(0, 0)]) / (2.0 * std::f64::consts::PI);
    let a = if a < -TOL { a + 1.0 } else { a.max(0.0) };
    let k = (a * ANGLE_GRID as f64).round();
    ((a * ANGLE_GRID as f64 - k).abs() < 1e-4).then_some(k as i64 % ANGLE_GRID)
}

/// Classify `m` against the axis z; None if it moves the axis (or, `polar`, reverses it).
pub(crate) fn classify(m: &Matrix3<f64>, polar: bool) -> Option<AxisOp> {
    let z = Vector3::z();
    let mz = m * z;
    let keeps = (mz - z).norm() < TOL;
    let flips = (mz + z).norm() < TOL;
    if !(keeps || flips) || (polar && flips) {
        return None;
    }
    let det = m.determinant();
    if (m - Matrix3::identity()).abs().max() < TOL {
        return Some(AxisOp::Identity);
    }
    if (m + Matrix3::identity()).abs().max() < TOL {
        return Some(AxisOp::Inversion);
    }
    Some(match (det > 0.0, keeps) {
        (true, true) => AxisOp::Rotation(turn_of(m)?),
        (true, false) => AxisOp::C2Across,
        (false, true) => AxisOp::SigmaV,
        (false, false) => AxisOp::Improper(turn_of(m)?),
    })
}

fn turn(k: i64) -> BigRational {
    BigRational::new(BigInt::from(k), BigInt::from(ANGLE_GRID))
}

/// Character of a species at an operation (exact).
pub(crate) fn species_character(s: Species, op: AxisOp) -> Result<Cyclo, String> {
    let dim = if s.lambda == 0 { 1 } else { 2 };
    let p: i64 = match s.gerade {
        Some(false) => -1,
        _ => 1,
    };
    let sigma_v: i64 = if s.minus { -1 } else { 1 };
    let cos = |k: i64| -> Result<Cyclo, String> {
        parse_with_phi(&format!("2cos({}phi)", s.lambda), Some(&turn(k))).map_err(|e| e.to_string())
    };
    Ok(match op {
        AxisOp::Identity => Cyclo::from_int(dim),
        AxisOp::Rotation(k) if s.lambda > 0 => cos(k)?,
        AxisOp::Rotation(_) => Cyclo::one(),
        AxisOp::SigmaV if s.lambda > 0 => Cyclo::zero(),
        AxisOp::SigmaV => Cyclo::from_int(sigma_v),
        AxisOp::Inversion => Cyclo::from_int(p * dim),
        // S(φ) = i·C(φ + π): χ = p·χ(C(φ+π)).
        AxisOp::Improper(k) if s.lambda > 0 => {
            let sign = if s.lambda % 2 == 0 { p } else { -p };
            &cos(k)? * &Cyclo::from_int(sign)
        }
        AxisOp::Improper(_) => Cyclo::from_int(p),
        // C2 across = i·σv (the plane ⟂ the C2 axis contains z).
        AxisOp::C2Across if s.lambda > 0 => Cyclo::zero(),
        AxisOp::C2Across => Cyclo::from_int(p * sigma_v),
    })
}

/// The linear group's class an axis operation falls in, written with its angle.
fn class_name(g: &PointGroup, op: AxisOp) -> String {
    let find = |pred: &dyn Fn(&OpSpec) -> bool| {
        g.table
            .classes
            .iter()
            .find(|c| pred(&c.op))
            .map(|c| c.ascii.clone())
            .unwrap_or_default()
    };
    let at = |k: i64| {
        let t = turn(k);
        format!(" (phi = {t} turn)")
    };
    match op {
        AxisOp::Identity => "E".into(),
        AxisOp::Inversion => "i".into(),
        AxisOp::SigmaV => find(&|o| matches!(o, OpSpec::Reflection { .. })),
        AxisOp::C2Across => find(&|o| {
            matches!(
                o,
                OpSpec::Rotation {
                    turn: Turn::Fixed(_),
                    ..
                }
            )
        }),
        AxisOp::Rotation(k) => {
            find(&|o| {
                matches!(
                    o,
                    OpSpec::Rotation {
                        turn: Turn::Phi,
                        ..
                    }
                )
            }) + &at(k)
        }
        AxisOp::Improper(0) => "sh (Sinf^phi at phi = 0)".into(),
        AxisOp::Improper(k) => {
            find(&|o| {
                matches!(
                    o,
                    OpSpec::Improper {
                        turn: Turn::Phi,
                        ..
                    }
                )
            }) + &at(k)
        }
    }
}

/// The species of a linear group's table row (ASCII label).
pub(crate) fn row_species(g: &PointGroup, label: &str) -> Result<Species, SpectraError> {
    Species::parse(label).ok_or_else(|| SpectraError::Internal {
        group: g.name().into(),
        message: format!("'{label}' is not a species Σ±, Π, Δ, Φ, Γ"),
    })
}

/// Species correlated: the table's rows, then Γ (Λ = 4) which the tables do not list.
fn species_rows(g: &PointGroup) -> Result<Vec<(String, usize, Species)>, SpectraError> {
    let mut out = Vec::new();
    for r in real_irreps(g) {
        out.push((r.label.clone(), r.dim, row_species(g, &r.label)?));
    }
    let parities: Vec<Option<bool>> = if super::real::is_centrosymmetric(g) {
        vec![Some(true), Some(false)]
    } else {
        vec![None]
    };
    for gerade in parities {
        let s = Species {
            lambda: 4,
            minus: false,
            gerade,
        };
        if !out.iter().any(|(_, _, t)| *t == s) {
            out.push((s.label(), 2, s));
        }
    }
    Ok(out)
}

/// H's x, y, z → the molecular axis z: Q with Q·d = z (a cyclic permutation, det +1).
fn frame_for(axis: usize) -> Matrix3<f64> {
    match axis {
        // x → z: (X, Y, Z) = (y, z, x)
        0 => Matrix3::new(0.0, 1.0, 0.0, 0.0, 0.0, 1.0, 1.0, 0.0, 0.0),
        // y → z: (X, Y, Z) = (z, x, y)
        1 => Matrix3::new(0.0, 0.0, 1.0, 1.0, 0.0, 0.0, 0.0, 1.0, 0.0),
        _ => Matrix3::identity(),
    }
}

/// The chemist's words for an embedding: where H's highest rotation axis or its mirror stands.
fn describe(h: &PointGroup, axis: usize, ops: &[AxisOp]) -> String {
    let name = ["x", "y", "z"][axis];
    let mut best: Option<(i64, bool)> = None; // (order, along)
    for (o, op) in h.ops.iter().zip(ops) {
        if o.float.determinant() < 0.0 || *op == AxisOp::Identity {
            continue;
        }
        let order = match op {
            AxisOp::Rotation(k) => ANGLE_GRID / gcd(*k, ANGLE_GRID),
            _ => 2,
        };
        let along = matches!(op, AxisOp::Rotation(_));
        if best.is_none_or(|(n, a)| order > n || (order == n && along && !a)) {
            best = Some((order, along));
        }
    }
    let words = match best {
        Some((n, true)) => format!("C{n} along the molecular axis"),
        Some((_, false)) if ops.contains(&AxisOp::Inversion) => {
            "C2 across the molecular axis (e.g. trans-bent X2Y2)".to_string()
        }
        Some((_, false)) if ops.contains(&AxisOp::SigmaV) => {
            "C2 across the molecular axis (e.g. bent symmetric XY2)".to_string()
        }
        Some((_, false)) => "C2 across the molecular axis (e.g. a skew chain)".to_string(),
        None if ops.contains(&AxisOp::SigmaV) => {
            "mirror plane containing the molecular axis (e.g. a bent HCN)".into()
        }
        None if ops.contains(&AxisOp::Improper(0)) => {
            "mirror plane across the molecular axis (σh)".into()
        }
        None if ops.contains(&AxisOp::Inversion) => "only the centre of symmetry kept".into(),
        None => "no symmetry operation kept besides E".into(),
    };
    format!("{words}; the molecular axis is {name} of {}", h.name())
}

fn gcd(a: i64, b: i64) -> i64 {
    if b == 0 {
        a.abs().max(1)
    } else {
        gcd(b, a % b)
    }
}

/// Every inequivalent embedding of the finite group `h` in the linear group `g`.
pub fn linear_embeddings(g: &PointGroup, h: &PointGroup) -> Result<Vec<Embedding>, SpectraError> {
    let polar = !super::real::is_centrosymmetric(g);
    let rows = species_rows(g)?;
    let mut seen: Vec<Vec<(usize, AxisOp)>> = Vec::new();
    let mut out = Vec::new();
    for axis in [2, 1, 0] {
        let q = frame_for(axis);
        let ops: Option<Vec<AxisOp>> = h
            .ops
            .iter()
            .map(|o| classify(&(q * o.float * q.transpose()), polar))
            .collect();
        let Some(ops) = ops else { continue };
        // Conjugacy invariant: which class of H meets which operation kind, angles up to ±φ.
        let norm = |op: AxisOp| match op {
            AxisOp::Rotation(k) => AxisOp::Rotation(k.min(ANGLE_GRID - k)),
            AxisOp::Improper(k) => AxisOp::Improper(k.min(ANGLE_GRID - k)),
            o => o,
        };
        let mut key: Vec<(usize, AxisOp)> = h
            .ops
            .iter()
            .zip(&ops)
            .map(|(o, op)| (o.class, norm(*op)))
            .collect();
        key.sort();
        let mut kinds: Vec<AxisOp> = key.iter().map(|(_, k)| *k).collect();
        kinds.sort();
        if seen.iter().any(|s| {
            let mut k2: Vec<AxisOp> = s.iter().map(|(_, k)| *k).collect();
            k2.sort();
            k2 == kinds
        }) {
            continue;
        }
        seen.push(key);
        // One representative operation per class of H.
        let rep_op: Vec<AxisOp> = (0..h.n_classes())
            .map(|c| {
                h.ops
                    .iter()
                    .zip(&ops)
                    .find(|(o, _)| o.class == c)
                    .map(|(_, op)| *op)
                    .expect("every class has an operation")
            })
            .collect();
        let mut correlation = Vec::new();
        for (label, dim, s) in &rows {
            let chi: Vec<Cyclo> = rep_op
                .iter()
                .map(|op| species_character(*s, *op))
                .collect::<Result<_, _>>()
                .map_err(|m| SpectraError::Internal {
                    group: g.name().into(),
                    message: m,
                })?;
            let m = decompose(h, &Character(chi)).map_err(|_| SpectraError::Internal {
                group: g.name().into(),
                message: format!("{label} does not restrict to {}", h.name()),
            })?;
            correlation.push(CorrelationRow {
                irrep: label.clone(),
                dimension: *dim,
                becomes: symmetry_of_rows(h, &m)?,
            });
        }
        let mut contains: Vec<String> = ops
            .iter()
            .filter(|o| **o != AxisOp::Identity)
            .map(|o| class_name(g, norm(*o)))
            .collect();
        contains.sort();
        contains.dedup();
        out.push(Embedding {
            conjugates: 0,
            contains,
            class_map: rep_op
                .iter()
                .enumerate()
                .map(|(c, op)| ClassLink {
                    subgroup_class: h.table.classes[c].ascii.clone(),
                    group_class: class_name(g, norm(*op)),
                })
                .collect(),
            correlation,
            modes: Vec::new(),
            subgroup_modes: None,
            description: Some(describe(h, axis, &ops)),
            molecular_axis: Some(["x", "y", "z"][axis].to_string()),
        });
    }
    Ok(out)
}
