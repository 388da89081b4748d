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

/// Fixed independent vectors prepared for many coordinate solves: k independent rows and the
/// inverse of the k×k matrix they form, so coordinates cost one k×k product and a check of the
/// other rows (which also decides membership in the span exactly).
pub(super) struct Span {
    cols: Vec<Vec<Rat>>,
    rows: Vec<usize>,
    /// `inv[j][r]`: coordinate j = Σᵣ inv[j][r]·x[rows[r]].
    inv: Vec<Vec<Rat>>,
}

/// Names a prepared [`Span`]: what kind of basis, its field, its parameters.
type SpanKey = (&'static str, u32, Vec<u32>);

impl Span {
    /// The span named by `key`, prepared once per process from the vectors `build` gives
    /// (`None`: they could not be built, or are dependent).
    pub fn cached(
        key: SpanKey,
        build: impl FnOnce() -> Option<Vec<Vec<Rat>>>,
    ) -> Option<std::sync::Arc<Span>> {
        use std::collections::HashMap;
        use std::sync::{Arc, Mutex, OnceLock};
        type Cache = Mutex<HashMap<SpanKey, Option<Arc<Span>>>>;
        static C: OnceLock<Cache> = OnceLock::new();
        let cache = C.get_or_init(|| Mutex::new(HashMap::new()));
        if let Some(s) = cache.lock().expect("span cache").get(&key) {
            return s.clone();
        }
        let s = build().and_then(Span::new).map(Arc::new);
        cache.lock().expect("span cache").insert(key, s.clone());
        s
    }

    /// `None` when the vectors are dependent.
    pub fn new(cols: Vec<Vec<Rat>>) -> Option<Span> {
        let k = cols.len();
        let len = cols.first().map_or(0, Vec::len);
        let row = |r: usize| -> Vec<Rat> { cols.iter().map(|c| c[r].clone()).collect() };
        let mut rows: Vec<usize> = Vec::new();
        let mut chosen: Vec<Vec<Rat>> = Vec::new();
        for r in 0..len {
            if rows.len() == k {
                break;
            }
            let mine = row(r);
            if mine.iter().all(Rat::is_zero) {
                continue;
            }
            if chosen.is_empty() || solve_rat(&chosen, &mine).is_none() {
                rows.push(r);
                chosen.push(mine);
            }
        }
        if rows.len() != k {
            return None;
        }
        // S[r][j] = cols[j][rows[r]]; column c of S⁻¹ solves S·y = e_c
        let s_cols: Vec<Vec<Rat>> = (0..k)
            .map(|j| rows.iter().map(|&r| cols[j][r].clone()).collect())
            .collect();
        let inv_cols: Vec<Vec<Rat>> = (0..k)
            .map(|c| {
                let e: Vec<Rat> = (0..k).map(|i| Rat::int((i == c) as i64)).collect();
                solve_rat(&s_cols, &e)
            })
            .collect::<Option<_>>()?;
        let inv = (0..k)
            .map(|j| (0..k).map(|c| inv_cols[c][j].clone()).collect())
            .collect();
        Some(Span { cols, rows, inv })
    }

    /// The k coordinates that determine a vector of the span.
    pub fn rows(&self) -> &[usize] {
        &self.rows
    }

    /// `inverse()[j][r]`: coordinate j = Σᵣ inverse()[j][r]·x[rows()[r]].
    pub fn inverse(&self) -> &[Vec<Rat>] {
        &self.inv
    }

    /// Coordinates of x in the span, or `None` when x is not in it.
    pub fn coords(&self, x: &[Rat]) -> Option<Vec<Rat>> {
        let y: Vec<Rat> = self
            .inv
            .iter()
            .map(|row| {
                row.iter()
                    .zip(&self.rows)
                    .filter(|(a, &r)| !a.is_zero() && !x[r].is_zero())
                    .fold(Rat::ZERO, |acc, (a, &r)| &acc + &(a * &x[r]))
            })
            .collect();
        for (t, xt) in x.iter().enumerate() {
            let v = self
                .cols
                .iter()
                .zip(&y)
                .filter(|(c, yj)| !c[t].is_zero() && !yj.is_zero())
                .fold(Rat::ZERO, |acc, (c, yj)| &acc + &(&c[t] * yj));
            if &v != xt {
                return None;
            }
        }
        Some(y)
    }
}
