//! Reduction for the linear groups C∞v and D∞h: the infinite groups are handled by going down
//! to C2v (C∞v) or D2h (D∞h), reducing there, and correlating back (Cotton, 3rd ed., §10.5,
//! "the method of working in a subgroup of finite order").
//!
//! Correlation used: Σ⁺ ↔ A₁ (A_g/B₁u), Σ⁻ ↔ A₂, Π ↔ B₁ + B₂ (and g/u). A₁ + A₂ is read as
//! Σ⁺ + Σ⁻ rather than Δ: the finite subgroup cannot tell them apart, and vibrational and
//! orbital bases of linear molecules carry Σ and Π only (Herzberg, *Infrared and Raman Spectra*).

use super::character::{Character, MemberKind};
use super::reduce::reduce;
use crate::exact::Cyclo;
use crate::group::{load, mat_det, mat_trace, OpSpec, PointGroup, Turn};
use num_bigint::BigInt;
use num_rational::BigRational;

/// Which linear class an operation of the finite subgroup falls in, and the angle φ (as a
/// fraction of a turn) at which to evaluate that class's characters.
fn linear_class_of(linear: &PointGroup, m: &nalgebra::Matrix3<f64>) -> (usize, BigRational) {
    let det = m.determinant();
    let z = nalgebra::Vector3::z();
    let mz = m * z;
    let zero = BigRational::from_integer(BigInt::from(0));
    let half = BigRational::new(BigInt::from(1), BigInt::from(2));
    let find = |pred: &dyn Fn(&OpSpec) -> bool| {
        linear
            .table
            .classes
            .iter()
            .position(|c| pred(&c.op))
            .expect("linear table has the class")
    };
    let is_identity = (m - nalgebra::Matrix3::identity()).abs().max() < 1e-9;
    if is_identity {
        return (find(&|o| matches!(o, OpSpec::Identity)), zero);
    }
    if (m + nalgebra::Matrix3::identity()).abs().max() < 1e-9 {
        return (find(&|o| matches!(o, OpSpec::Inversion)), zero);
    }
    let keeps_z = (mz - z).norm() < 1e-9;
    let flips_z = (mz + z).norm() < 1e-9;
    let angle_turn = || {
        // rotation angle about z of the in-plane part
        let a = m[(1, 0)].atan2(m[(0, 0)]) / (2.0 * std::f64::consts::PI);
        let a = if a < 0.0 { a + 1.0 } else { a };
        // the finite subgroups only have multiples of 1/2 turn about z
        if (a - 0.5).abs() < 1e-6 {
            half.clone()
        } else {
            zero.clone()
        }
    };
    if det > 0.0 && keeps_z {
        let c = find(&|o| {
            matches!(
                o,
                OpSpec::Rotation {
                    turn: Turn::Phi,
                    ..
                }
            )
        });
        return (c, angle_turn());
    }
    if det > 0.0 && flips_z {
        let c = find(&|o| {
            matches!(
                o,
                OpSpec::Rotation {
                    turn: Turn::Fixed(_),
                    ..
                }
            )
        });
        return (c, zero);
    }
    if det < 0.0 && keeps_z {
        let c = find(&|o| matches!(o, OpSpec::Reflection { .. }));
        return (c, zero);
    }
    // det < 0, flips z: σh or S(φ)
    let c = find(&|o| {
        matches!(
            o,
            OpSpec::Improper {
                turn: Turn::Phi,
                ..
            }
        )
    });
    // S(φ) = σh·C(φ); in-plane part of m is the rotation C(φ)
    (c, angle_turn())
}

/// The result of a reduction through the finite subgroup.
#[derive(Debug, Clone)]
pub struct LinearReduction {
    pub subgroup: String,
    /// Multiplicities in the subgroup.
    pub sub_multiplicities: Vec<u64>,
    /// Multiplicities of the linear group's irreps (table order).
    pub multiplicities: Vec<u64>,
    /// Characters in the subgroup (its class order).
    pub sub_chi: Character,
    pub note: String,
}

/// Reduce unmoved counts given per class of a linear group.
pub fn reduce_linear_unmoved(
    linear: &PointGroup,
    counts: &[i64],
    kind: MemberKind,
) -> Result<LinearReduction, String> {
    if counts.len() != linear.n_classes() {
        return Err(format!(
            "{} has {} classes; {} counts given",
            linear.name(),
            linear.n_classes(),
            counts.len()
        ));
    }
    let sub = load(linear.table.descent.as_deref().unwrap_or("C2v")).map_err(|e| e.to_string())?;
    let chi: Vec<Cyclo> = (0..sub.n_classes())
        .map(|c| {
            let op = sub.ops.iter().find(|o| o.class == c).expect("class op");
            let (lc, _) = linear_class_of(linear, &op.float);
            let per = kind.per_member(&mat_trace(&op.matrix), &mat_det(&op.matrix));
            &per * &Cyclo::from_int(counts[lc])
        })
        .collect();
    reduce_via_subgroup(linear, &sub, Character(chi))
}

/// Reduce a character of the finite subgroup and correlate back.
pub fn reduce_via_subgroup(
    linear: &PointGroup,
    sub: &PointGroup,
    chi: Character,
) -> Result<LinearReduction, String> {
    let red = reduce(sub, &chi);
    let sub_m = red
        .multiplicities()
        .map_err(|_| format!("the characters are not a representation of {}", sub.name()))?;
    let restricted = restrictions(linear, sub)?;
    // Greedy: degenerate (Π-like) irreps first, then the one-dimensional ones, lowest Λ first.
    let mut left: Vec<i64> = sub_m.iter().map(|v| *v as i64).collect();
    let mut m = vec![0u64; linear.table.irreps.len()];
    let mut order: Vec<usize> = (0..linear.table.irreps.len()).collect();
    order.sort_by_key(|&i| {
        let d = linear.table.irreps[i].dim();
        (if d == 2 { 0 } else { 1 }, i)
    });
    for &i in &order {
        let r = &restricted[i];
        loop {
            if left.iter().zip(r).all(|(l, x)| *l >= *x as i64) && r.iter().any(|x| *x > 0) {
                for (l, x) in left.iter_mut().zip(r) {
                    *l -= *x as i64;
                }
                m[i] += 1;
            } else {
                break;
            }
        }
    }
    if left.iter().any(|l| *l != 0) {
        return Err("the result does not correlate back to the linear group".into());
    }
    Ok(LinearReduction {
        subgroup: sub.name().to_string(),
        sub_multiplicities: sub_m,
        multiplicities: m,
        sub_chi: chi,
        note: format!(
            "reduced in {} and correlated back to {} (Σ⁺↔A₁-type, Σ⁻↔A₂-type, Π↔B₁+B₂-type; A₁+A₂ is read as Σ⁺+Σ⁻, not Δ)",
            sub.name(),
            linear.table.symbol
        ),
    })
}

/// Restriction of each linear irrep to the subgroup, as subgroup multiplicities.
pub fn restrictions(linear: &PointGroup, sub: &PointGroup) -> Result<Vec<Vec<u64>>, String> {
    let mut out = Vec::new();
    for i in 0..linear.table.irreps.len() {
        let chi: Vec<Cyclo> = (0..sub.n_classes())
            .map(|c| {
                let op = sub.ops.iter().find(|o| o.class == c).expect("class op");
                let (lc, phi) = linear_class_of(linear, &op.float);
                linear.table.chars_at(i, &phi).map(|v| v[lc].clone())
            })
            .collect::<Result<_, _>>()?;
        let red = reduce(sub, &Character(chi));
        out.push(red.multiplicities().map_err(|_| {
            format!(
                "irrep {} does not restrict to {}",
                linear.table.irreps[i].label,
                sub.name()
            )
        })?);
    }
    Ok(out)
}
