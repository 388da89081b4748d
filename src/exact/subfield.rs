//! Real subfields of Q(ζₙ) as fields of their own: the numbers of a real irrep and a real basis
//! of an icosahedral molecule lie in Q(√3, √5) (degree 4) although their storage field is
//! Q(ζ₆₀) (degree 16), so products there cost 16 integer multiplications instead of 256.
//!
//! A subfield K = Q(η) is held in the power basis 1, η, …, η^(k−1) of a primitive element η
//! (an algebraic integer of Q(ζₙ)); its minimal polynomial gives the reduction rows for
//! products, exactly as Φₙ does for Q(ζₙ). A number enters K through its coordinates in
//! Q(ζₙ): k independent coordinates give the η-coordinates, and the remaining ones check that
//! the number really lies in K (an exact test, so a wrong field is never used silently).
//!
//! The candidates, smallest first: the real multi-quadratic field Q(√d₁, …, √d_r) of Q(ζₙ)
//! (η = Σ√dᵢ, which generates it; e.g. Lang, *Algebra*, VI §1), the maximal real subfield
//! Q(ζₙ + ζₙ⁻¹) (degree φ(n)/2), and Q(ζₙ) itself.

use super::cyclo::Cyclo;
use super::kvec::KInt;
use super::linsolve::{solve, Span};
use super::poly::totient;
use super::rat::Rat;
use super::sqrt::sqrt_rational;
use num_bigint::BigInt;
use num_integer::Integer;
use num_rational::BigRational;
use num_traits::{One, ToPrimitive};

/// Which field a [`super::KField`] is.
#[derive(Debug, Clone, PartialEq, Eq, Hash)]
pub enum FieldSpec {
    /// Q(ζₙ) in its power basis.
    Cyclotomic(u32),
    /// Q(ζₙ + ζₙ⁻¹), the largest real subfield of Q(ζₙ).
    RealPart(u32),
    /// Q(√d₁, …, √d_r) inside Q(ζₙ): (n, the dᵢ).
    Roots(u32, Vec<u32>),
}

impl FieldSpec {
    /// The cyclotomic field the numbers are stored in.
    pub fn home(&self) -> u32 {
        match self {
            FieldSpec::Cyclotomic(n) | FieldSpec::RealPart(n) | FieldSpec::Roots(n, _) => *n,
        }
    }
}

/// Fields to try for numbers stored in Q(ζₙ), smallest degree first; the last is Q(ζₙ).
/// A smaller field is worth trying only when every number may be real (they are checked
/// exactly when entered).
pub fn candidates(n: u32) -> Vec<FieldSpec> {
    let n = n.max(1);
    let phi = totient(n);
    let mut out = Vec::new();
    if phi > 2 {
        let gens = quadratic_generators(n);
        let deg = 1usize << gens.len();
        if !gens.is_empty() && deg <= phi / 2 {
            out.push(FieldSpec::Roots(n, gens));
        }
        if deg < phi / 2 {
            out.push(FieldSpec::RealPart(n));
        }
    }
    out.push(FieldSpec::Cyclotomic(n));
    out
}

/// Conductor of Q(√d) for squarefree d > 1 (d ≡ 1 mod 4: d, else 4d): the smallest n with
/// √d ∈ Q(ζₙ).
pub(super) fn conductor(d: u32) -> u32 {
    if d % 4 == 1 {
        d
    } else {
        4 * d
    }
}

/// Is d > 1 free of square factors?
pub(super) fn squarefree(d: u32) -> bool {
    let mut p = 2;
    while p * p <= d {
        if d % (p * p) == 0 {
            return false;
        }
        p += 1;
    }
    d > 1
}

/// Squarefree d₁ < d₂ < … whose roots generate every real quadratic subfield of Q(ζₙ):
/// independent over F₂ by their prime exponents.
fn quadratic_generators(n: u32) -> Vec<u32> {
    let n_even = if n % 2 == 1 { 2 * n } else { n };
    if n_even > 600 {
        return Vec::new(); // no molecular table comes near; keeps the prime masks in 128 bits
    }
    let ds: Vec<u32> = (2..=n_even)
        .filter(|&d| squarefree(d) && n_even % conductor(d) == 0)
        .collect();
    // F₂ elimination on the sets of prime factors, as bit masks over the primes up to n
    let primes: Vec<u32> = (2..=n_even)
        .filter(|&p| (2..p).all(|q| p % q != 0))
        .collect();
    let mask = |d: u32| -> u128 {
        primes
            .iter()
            .take(128)
            .enumerate()
            .filter(|(_, &p)| d % p == 0)
            .fold(0u128, |m, (i, _)| m | (1 << i))
    };
    let mut basis: Vec<u128> = Vec::new();
    let mut gens = Vec::new();
    for d in ds {
        let mut m = mask(d);
        for b in &basis {
            let top = 127 - b.leading_zeros();
            if m & (1 << top) != 0 {
                m ^= b;
            }
        }
        if m != 0 {
            basis.push(m);
            basis.sort_by_key(|b| std::cmp::Reverse(*b));
            gens.push(d);
        }
    }
    gens
}

/// How a proper subfield K = Q(η) sits in Q(ζₙ).
#[derive(Debug)]
pub struct Embedding {
    /// Monic minimal polynomial of η, lowest coefficient first (k + 1 entries).
    pub poly: Vec<i128>,
    /// `powers[j]`: η^j in Q(ζₙ)'s power basis (φ(n) integers), j < k.
    pub powers: Vec<Vec<i128>>,
    /// k coordinates of Q(ζₙ) that determine a number of K …
    pub rows: Vec<usize>,
    /// … and η-coordinate j = Σᵣ inv[j][r]·x[rows[r]] / inv_den.
    pub inv: Vec<Vec<i128>>,
    pub inv_den: i128,
}

impl Embedding {
    /// The subfield named by `spec` (not `Cyclotomic`), if its numbers fit machine integers.
    pub fn new(spec: &FieldSpec) -> Option<Embedding> {
        let n = spec.home();
        let eta: Cyclo = match spec {
            FieldSpec::Cyclotomic(_) => return None,
            FieldSpec::RealPart(n) => Cyclo::zeta(*n, 1) + Cyclo::zeta(*n, -1),
            FieldSpec::Roots(n, ds) => {
                let mut s = Cyclo::zero();
                for &d in ds {
                    if n % conductor(d) != 0 && (2 * n) % conductor(d) != 0 {
                        return None;
                    }
                    s += &sqrt_rational(&BigRational::from_integer(BigInt::from(d))).ok()?;
                }
                s
            }
        };
        let phi = totient(n);
        // powers of η until one depends on the others: that gives the minimal polynomial
        let lifted = |c: &Cyclo| -> Vec<BigRational> { c.lift(n) };
        let mut powers: Vec<Cyclo> = vec![Cyclo::one()];
        let poly = loop {
            let next = powers.last().expect("nonempty") * &eta;
            let cols: Vec<Vec<BigRational>> = powers.iter().map(lifted).collect();
            if let Some(c) = solve(&cols, &lifted(&next)) {
                // η^k = Σ cⱼ ηʲ: the cⱼ are integers (η is an algebraic integer)
                let mut p: Vec<i128> = c
                    .iter()
                    .map(|q| q.is_integer().then(|| (-q.to_integer()).to_i128())?)
                    .collect::<Option<_>>()?;
                p.push(1);
                break p;
            }
            if powers.len() >= phi {
                return None;
            }
            powers.push(next);
        };
        let cols: Vec<Vec<BigRational>> = powers.iter().map(lifted).collect();
        // k independent rows of the φ × k matrix [η⁰ … η^(k−1)] and their inverse, over one
        // integer denominator
        let span = Span::new(
            cols.iter()
                .map(|c| c.iter().cloned().map(Rat::from_big).collect())
                .collect(),
        )?;
        let rows = span.rows().to_vec();
        let mut den = BigInt::one();
        for q in span.inverse().iter().flatten() {
            den = Integer::lcm(&den, q.to_big().denom());
        }
        let inv: Vec<Vec<i128>> = span
            .inverse()
            .iter()
            .map(|row| {
                row.iter()
                    .map(|q| {
                        (q.to_big() * BigRational::from_integer(den.clone()))
                            .to_integer()
                            .to_i128()
                    })
                    .collect::<Option<_>>()
            })
            .collect::<Option<_>>()?;
        let powers: Vec<Vec<i128>> = cols
            .iter()
            .map(|c| {
                c.iter()
                    .map(|q| q.is_integer().then(|| q.to_integer().to_i128())?)
                    .collect::<Option<_>>()
            })
            .collect::<Option<_>>()?;
        Some(Embedding {
            poly,
            powers,
            rows,
            inv,
            inv_den: den.to_i128()?,
        })
    }

    /// η-coordinates (numerators over `den·inv_den`) of the number with Q(ζₙ) numerators `x`
    /// over `den`, when it lies in K; `None` when it does not (or on overflow).
    pub fn coords<I: KInt>(&self, x: &[I], den: &I, out: &mut [I]) -> Option<I> {
        for (j, o) in out.iter_mut().enumerate() {
            let mut acc = I::zero();
            for (r, &row) in self.rows.iter().enumerate() {
                let a = self.inv[j][r];
                if a != 0 && !x[row].is_zero() {
                    acc = acc.add(&x[row].mul(&I::from_i128(a))?)?;
                }
            }
            *o = acc;
        }
        // check every coordinate: Σⱼ outⱼ·η^j = inv_den·x
        let d = I::from_i128(self.inv_den);
        for (t, xt) in x.iter().enumerate() {
            let mut acc = I::zero();
            for (j, o) in out.iter().enumerate() {
                let p = self.powers[j][t];
                if p != 0 && !o.is_zero() {
                    acc = acc.add(&o.mul(&I::from_i128(p))?)?;
                }
            }
            if acc != xt.mul(&d)? {
                return None;
            }
        }
        den.mul(&d)
    }

    /// Q(ζₙ) numerators of the number with η-coordinates `y` (same denominator).
    pub fn expand<I: KInt>(&self, y: &[I], out: &mut [I]) -> Option<()> {
        out.iter_mut().for_each(|o| *o = I::zero());
        I::combine_rows(out, y, &self.powers)
    }
}

/// x with M·x = rhs·det(M) up to sign, by fraction-free (Bareiss) elimination; returns
/// (numerators, denominator > 0) of the solution, `None` if M is singular or on overflow.
pub fn solve_fraction_free<I: KInt>(mut m: Vec<Vec<I>>, rhs: &[I]) -> Option<(Vec<I>, I)> {
    let n = m.len();
    for (row, r) in m.iter_mut().zip(rhs) {
        row.push(r.clone());
    }
    let mut prev = I::from_i128(1);
    for k in 0..n {
        let p = (k..n).find(|&i| !m[i][k].is_zero())?;
        m.swap(k, p);
        for i in k + 1..n {
            for j in k + 1..=n {
                let v = m[k][k].mul(&m[i][j])?.sub(&m[i][k].mul(&m[k][j])?)?;
                m[i][j] = v.div_exact(&prev);
            }
            m[i][k] = I::zero();
        }
        prev = m[k][k].clone();
    }
    let det = prev;
    // back substitution: xᵢ·det = (rhsᵢ·det − Σ_{j>i} m[i][j]·xⱼ·det) / m[i][i]
    let mut x: Vec<I> = vec![I::zero(); n];
    for i in (0..n).rev() {
        let mut acc = m[i][n].mul(&det)?;
        for j in i + 1..n {
            if !m[i][j].is_zero() && !x[j].is_zero() {
                acc = acc.sub(&m[i][j].mul(&x[j])?)?;
            }
        }
        x[i] = acc.div_exact(&m[i][i]);
    }
    if det.is_negative() {
        let x = x
            .iter()
            .map(|v| I::zero().sub(v))
            .collect::<Option<Vec<I>>>()?;
        return Some((x, I::zero().sub(&det)?));
    }
    Some((x, det))
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Real quadratic subfields of Q(ζₙ): Q(√d) ⊂ Q(ζₙ) iff the conductor of Q(√d) divides n
    /// (Kronecker–Weber for quadratic fields; e.g. Washington, *Introduction to Cyclotomic
    /// Fields*, §2; √5 ∈ Q(ζ₅), √2 ∈ Q(ζ₈), √3 ∈ Q(ζ₁₂)).
    #[test]
    fn quadratic_generators_follow_conductors() {
        assert_eq!(quadratic_generators(5), vec![5]);
        assert_eq!(quadratic_generators(8), vec![2]);
        assert_eq!(quadratic_generators(12), vec![3]);
        assert_eq!(quadratic_generators(60), vec![3, 5]);
        assert_eq!(quadratic_generators(24), vec![2, 3]);
        assert!(quadratic_generators(7).is_empty());
        assert!(quadratic_generators(3).is_empty());
        assert!(quadratic_generators(15).len() == 1);
    }

    /// Minimal polynomials (textbook facts): √3+√5 has x⁴ − 16x² + 4; 2cos(2π/7) has
    /// x³ + x² − 2x − 1; 2cos(2π/5) has x² + x − 1.
    #[test]
    fn minimal_polynomials() {
        let e = Embedding::new(&FieldSpec::Roots(60, vec![3, 5])).unwrap();
        assert_eq!(e.poly, vec![4, 0, -16, 0, 1]);
        let e = Embedding::new(&FieldSpec::RealPart(7)).unwrap();
        assert_eq!(e.poly, vec![-1, -2, 1, 1]);
        let e = Embedding::new(&FieldSpec::RealPart(5)).unwrap();
        assert_eq!(e.poly, vec![-1, 1, 1]);
    }

    #[test]
    fn fraction_free_solve() {
        // [[2,1],[1,3]] x = [1,0] → x = (3,−1)/5
        let m = vec![vec![2i128, 1], vec![1, 3]];
        assert_eq!(solve_fraction_free(m, &[1, 0]), Some((vec![3, -1], 5)));
        let singular = vec![vec![1i128, 2], vec![2, 4]];
        assert_eq!(solve_fraction_free(singular, &[1, 0]), None);
    }
}
