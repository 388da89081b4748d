//! Exact 3×3 matrices of symmetry operations, built from the geometric description in a table
//! (rotation axis and fraction of a turn, mirror normal, inversion, rotation–reflection).
//!
//! Rotation by θ about a (not necessarily unit) axis a — Rodrigues' formula:
//! R = cos θ·I + (1 − cos θ)·aaᵀ/|a|² + (sin θ/|a|)·[a]×, with sin θ/|a| taken as an exact
//! square root (Goldstein, *Classical Mechanics*, §4.7). Reflection: I − 2nnᵀ/|n|².

use crate::exact::{sqrt, Cyclo};
use nalgebra::Matrix3;
use num_rational::BigRational;

/// An exact 3×3 matrix, row-major.
pub type Mat3 = [[Cyclo; 3]; 3];

pub fn identity() -> Mat3 {
    std::array::from_fn(|i| std::array::from_fn(|j| Cyclo::from_int((i == j) as i64)))
}

pub fn mul(a: &Mat3, b: &Mat3) -> Mat3 {
    std::array::from_fn(|i| {
        std::array::from_fn(|j| (0..3).map(|k| &a[i][k] * &b[k][j]).sum::<Cyclo>())
    })
}

pub fn transpose(a: &Mat3) -> Mat3 {
    std::array::from_fn(|i| std::array::from_fn(|j| a[j][i].clone()))
}

pub fn trace(a: &Mat3) -> Cyclo {
    &(&a[0][0] + &a[1][1]) + &a[2][2]
}

pub fn det(a: &Mat3) -> Cyclo {
    let m = |i: usize, j: usize| &a[i][j];
    m(0, 0) * &(m(1, 1) * m(2, 2) - m(1, 2) * m(2, 1))
        - m(0, 1) * &(m(1, 0) * m(2, 2) - m(1, 2) * m(2, 0))
        + m(0, 2) * &(m(1, 0) * m(2, 1) - m(1, 1) * m(2, 0))
}

pub fn to_float(a: &Mat3) -> Matrix3<f64> {
    Matrix3::from_fn(|i, j| a[i][j].re_f64())
}

pub fn scale(a: &Mat3, s: &Cyclo) -> Mat3 {
    std::array::from_fn(|i| std::array::from_fn(|j| &a[i][j] * s))
}

fn dot(a: &[Cyclo; 3], b: &[Cyclo; 3]) -> Cyclo {
    (0..3).map(|k| &a[k] * &b[k]).sum()
}

/// Why an operation could not be built exactly.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum MatrixError {
    #[error("the axis or normal is the zero vector")]
    ZeroAxis,
    #[error("sin θ/|axis| is not a number salcdesk can write exactly: {0}")]
    NotExact(String),
}

/// Mirror through the plane with normal n.
pub fn reflection(n: &[Cyclo; 3]) -> Result<Mat3, MatrixError> {
    let nn = dot(n, n);
    let inv = nn.inv().ok_or(MatrixError::ZeroAxis)?;
    let two = Cyclo::from_int(2);
    Ok(std::array::from_fn(|i| {
        std::array::from_fn(|j| {
            let id = Cyclo::from_int((i == j) as i64);
            id - &two * &(&(&n[i] * &n[j]) * &inv)
        })
    }))
}

/// Proper rotation by 2π·turn about axis a (right-handed).
pub fn rotation(a: &[Cyclo; 3], turn: &BigRational) -> Result<Mat3, MatrixError> {
    let aa = dot(a, a);
    let inv = aa.inv().ok_or(MatrixError::ZeroAxis)?;
    let p: i64 = turn.numer().try_into().map_err(|_| MatrixError::ZeroAxis)?;
    let q: i64 = turn.denom().try_into().map_err(|_| MatrixError::ZeroAxis)?;
    let c = Cyclo::cos_turn(p, q);
    let sin = Cyclo::sin_turn(p, q);
    // s = sin θ / |a|, exactly: √(sin²θ/|a|²) with the sign of sin θ.
    let s_sq = &(&sin * &sin) * &inv;
    let mut s = sqrt(&s_sq).map_err(|e| MatrixError::NotExact(e.to_string()))?;
    if sin.re_f64() < 0.0 {
        s = -s;
    }
    let one_c = Cyclo::one() - &c;
    let cross = [
        [Cyclo::zero(), -&a[2], a[1].clone()],
        [a[2].clone(), Cyclo::zero(), -&a[0]],
        [-&a[1], a[0].clone(), Cyclo::zero()],
    ];
    Ok(std::array::from_fn(|i| {
        std::array::from_fn(|j| {
            let id = if i == j { c.clone() } else { Cyclo::zero() };
            id + &(&one_c * &(&(&a[i] * &a[j]) * &inv)) + &(&s * &cross[i][j])
        })
    }))
}

/// Rotation by 2π·turn about a followed by reflection in the plane ⟂ a (Sₙ).
pub fn improper(a: &[Cyclo; 3], turn: &BigRational) -> Result<Mat3, MatrixError> {
    Ok(mul(&reflection(a)?, &rotation(a, turn)?))
}

/// Make every entry as small a field as possible (keeps later arithmetic cheap).
pub fn shrink(a: &Mat3) -> Mat3 {
    std::array::from_fn(|i| std::array::from_fn(|j| a[i][j].minimal_field()))
}
