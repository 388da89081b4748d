//! Exact linear algebra over Q for coordinate vectors: solve Σ aⱼ·basisⱼ = target.

use super::rat::Rat;
use num_rational::BigRational;

/// Rational coefficients a with Σ aⱼ basisⱼ = target, or `None` if target is not in the span.
/// Basis vectors must be linearly independent and all of the target's length.
pub fn solve(basis: &[Vec<BigRational>], target: &[BigRational]) -> Option<Vec<BigRational>> {
    let basis: Vec<Vec<Rat>> = basis
        .iter()
        .map(|b| b.iter().cloned().map(Rat::from_big).collect())
        .collect();
    let target: Vec<Rat> = target.iter().cloned().map(Rat::from_big).collect();
    solve_rat(&basis, &target).map(|v| v.iter().map(Rat::to_big).collect())
}

/// [`solve`] on machine-integer rationals where they fit (the common case).
pub(super) fn solve_rat(basis: &[Vec<Rat>], target: &[Rat]) -> Option<Vec<Rat>> {
    let rows = target.len();
    let cols = basis.len();
    // Augmented matrix rows × (cols + 1).
    let mut m: Vec<Vec<Rat>> = (0..rows)
        .map(|r| {
            let mut row: Vec<Rat> = basis.iter().map(|b| b[r].clone()).collect();
            row.push(target[r].clone());
            row
        })
        .collect();
    let mut pivot_cols = Vec::new();
    let mut r = 0;
    for c in 0..cols {
        let Some(p) = (r..rows).find(|&i| !m[i][c].is_zero()) else {
            continue;
        };
        m.swap(r, p);
        let inv = m[r][c].recip();
        for x in m[r].iter_mut() {
            *x = &*x * &inv;
        }
        for i in 0..rows {
            if i != r && !m[i][c].is_zero() {
                let f = m[i][c].clone();
                for j in c..=cols {
                    if m[r][j].is_zero() {
                        continue;
                    }
                    let v = &m[r][j] * &f;
                    m[i][j] = &m[i][j] - &v;
                }
            }
        }
        pivot_cols.push(c);
        r += 1;
        if r == rows {
            break;
        }
    }
    // Inconsistent if a zero row has a nonzero right-hand side.
    if m[r..].iter().any(|row| !row[cols].is_zero()) {
        return None;
    }
    let mut sol = vec![Rat::ZERO; cols];
    for (i, &c) in pivot_cols.iter().enumerate() {
        sol[c] = m[i][cols].clone();
    }
    Some(sol)
}

/// Coefficients a (field elements) with Σ aⱼ basisⱼ = target, or `None` if not in the span.
pub fn solve_field(
    basis: &[Vec<super::Cyclo>],
    target: &[super::Cyclo],
) -> Option<Vec<super::Cyclo>> {
    use super::Cyclo;
    let rows = target.len();
    let cols = basis.len();
    let mut m: Vec<Vec<Cyclo>> = (0..rows)
        .map(|r| {
            let mut row: Vec<Cyclo> = basis.iter().map(|b| b[r].clone()).collect();
            row.push(target[r].clone());
            row
        })
        .collect();
    let mut pivot_cols = Vec::new();
    let mut r = 0;
    for c in 0..cols {
        let Some(p) = (r..rows).find(|&i| !m[i][c].is_zero()) else {
            continue;
        };
        m.swap(r, p);
        let inv = m[r][c].inv()?;
        for x in m[r].iter_mut() {
            *x = &*x * &inv;
        }
        for i in 0..rows {
            if i != r && !m[i][c].is_zero() {
                let f = m[i][c].clone();
                for j in c..=cols {
                    let v = &m[r][j] * &f;
                    m[i][j] -= &v;
                }
            }
        }
        pivot_cols.push(c);
        r += 1;
        if r == rows {
            break;
        }
    }
    if m[r..].iter().any(|row| !row[cols].is_zero()) {
        return None;
    }
    let mut sol = vec![Cyclo::zero(); cols];
    for (i, &c) in pivot_cols.iter().enumerate() {
        sol[c] = m[i][cols].clone();
    }
    Some(sol)
}
