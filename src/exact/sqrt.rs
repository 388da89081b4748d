//! Exact square roots inside cyclotomic fields.
//!
//! √q for rational q: √p of an odd prime p is a quadratic Gauss sum in Q(ζₚ) (or Q(ζ₄ₚ) when
//! p ≡ 3 mod 4), √2 = ζ₈ + ζ₈⁻¹ (Ireland & Rosen, *A Classical Introduction to Modern Number
//! Theory*, ch. 6). For an irrational real x the root, if it is cyclotomic at all, is found by
//! trying sign patterns of √ over the real embeddings of a small field, rounding the solved
//! coordinates to rationals and verifying y² = x exactly — a result is never returned unverified.

use super::cyclo::Cyclo;
use super::poly::{lcm, totient};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{One, Signed, ToPrimitive, Zero};

/// Largest field order we allow a square root to need (keeps arithmetic cheap).
pub const MAX_SQRT_FIELD: u32 = 2000;

/// Why a square root could not be taken exactly.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum SqrtError {
    #[error("the square root of {0} needs a field larger than salcdesk handles")]
    TooLarge(String),
    #[error("the square root of {0} is not a cyclotomic number salcdesk can write exactly")]
    NotCyclotomic(String),
}

/// √q for a rational q (negative q gives i·√|q|).
pub fn sqrt_rational(q: &BigRational) -> Result<Cyclo, SqrtError> {
    if q.is_zero() {
        return Ok(Cyclo::zero());
    }
    let neg = q.is_negative();
    let q = q.abs();
    // √(a/b) = √(ab)/b
    let ab = q.numer() * q.denom();
    let (square, free) = split_square(&ab).ok_or_else(|| SqrtError::TooLarge(q.to_string()))?;
    // The root lives in Q(ζ_c) for the conductor c = m or 4m of the square-free part m; every
    // prime may be small while their product is huge (2·3·5·7·11·13·… ): refuse before
    // building Gauss sums in an enormous field.
    let m: u64 = free.iter().map(|&p| p as u64).product();
    let conductor = if m % 4 == 1 { m } else { 4 * m };
    if m > 1 && conductor > MAX_SQRT_FIELD as u64 {
        return Err(SqrtError::TooLarge(q.to_string()));
    }
    let mut root = Cyclo::from_rational(BigRational::new(square, q.denom().clone()));
    for p in free {
        root = root * sqrt_prime(p);
    }
    if neg {
        root = root * Cyclo::i();
    }
    Ok(root)
}

/// The n of the smallest Q(ζₙ) holding √q (its conductor), found without building it: for the
/// square-free part m of q, n = m when m ≡ 1 (mod 4), else 4m; `None` when q is too large to
/// factor here (the root itself is then refused too).
pub fn sqrt_conductor(q: &BigRational) -> Option<u64> {
    if q.is_zero() {
        return Some(1);
    }
    let q = q.abs();
    let (_, free) = split_square(&(q.numer() * q.denom()))?;
    let m: u64 = free.iter().map(|&p| p as u64).product();
    // A negative q adds i: Q(ζ₄) joins the field.
    let base = if m % 4 == 1 { m } else { 4 * m };
    Some(if base == 1 { 1 } else { base })
}

/// n = s²·(p₁·p₂·…), distinct primes pᵢ; `None` if a factor is too large to handle.
fn split_square(n: &BigInt) -> Option<(BigInt, Vec<u32>)> {
    let mut n = n.clone();
    let mut square = BigInt::one();
    let mut free = Vec::new();
    let mut p: u32 = 2;
    while BigInt::from(p) * BigInt::from(p) <= n {
        let bp = BigInt::from(p);
        let mut e = 0;
        while (&n % &bp).is_zero() {
            n /= &bp;
            e += 1;
        }
        for _ in 0..e / 2 {
            square *= &bp;
        }
        if e % 2 == 1 {
            free.push(p);
        }
        p += 1;
        if p > MAX_SQRT_FIELD {
            return None;
        }
    }
    if n > BigInt::one() {
        let last = n.to_u32().filter(|v| *v <= MAX_SQRT_FIELD)?;
        free.push(last);
    }
    Some((square, free))
}

fn sqrt_prime(p: u32) -> Cyclo {
    if p == 2 {
        return Cyclo::zeta(8, 1) + Cyclo::zeta(8, 7);
    }
    // Gauss sum g = Σ (k/p) ζₚᵏ; g² = (−1)^((p−1)/2)·p.
    let mut g = Cyclo::zero();
    for k in 1..p {
        let leg = legendre(k as u64, p as u64);
        g = g + Cyclo::zeta(p, k as i64) * Cyclo::from_int(leg);
    }
    let mut root = if p % 4 == 1 {
        g
    } else {
        // g = i√p  ⇒  √p = −i·g
        -(Cyclo::i() * g)
    };
    if root.re_f64() < 0.0 {
        root = -root;
    }
    root
}

fn legendre(a: u64, p: u64) -> i64 {
    let mut result = 1u64;
    let mut base = a % p;
    let mut e = (p - 1) / 2;
    while e > 0 {
        if e & 1 == 1 {
            result = result * base % p;
        }
        base = base * base % p;
        e >>= 1;
    }
    if result == 1 {
        1
    } else {
        -1
    }
}

/// Exact √x of a cyclotomic number: rational x directly, an irrational positive real x by a
/// verified search in small fields.
pub fn sqrt(x: &Cyclo) -> Result<Cyclo, SqrtError> {
    if let Some(q) = x.to_rational() {
        return sqrt_rational(&q);
    }
    if !x.is_real() || x.re_f64() < 0.0 {
        return Err(SqrtError::NotCyclotomic(format!("{x:?}")));
    }
    // The search below is costly and callers ask for the same few roots again and again
    // (norms of SALCs), so results are remembered per process.
    let key = (x.field_order(), x.coefficients());
    if let Some(r) = irrational_cache().lock().expect("sqrt cache").get(&key) {
        return r.clone();
    }
    let r = if kummer_refutes(x) {
        Err(SqrtError::NotCyclotomic(format!("{x:?}")))
    } else {
        search_sqrt(x)
    };
    irrational_cache()
        .lock()
        .expect("sqrt cache")
        .insert(key, r.clone());
    r
}

type SqrtCache = std::collections::HashMap<(u32, Vec<BigRational>), Result<Cyclo, SqrtError>>;

fn irrational_cache() -> &'static std::sync::Mutex<SqrtCache> {
    static CACHE: std::sync::OnceLock<std::sync::Mutex<SqrtCache>> = std::sync::OnceLock::new();
    CACHE.get_or_init(|| std::sync::Mutex::new(SqrtCache::new()))
}

/// A cheap exact proof that √x is not cyclotomic, where one exists.
///
/// Let x lie in K = Q(ζₙ). If √x lay in some cyclotomic field, L = K(√x) would be abelian, hence
/// normal, over Q; then for every automorphism σ of K, √σ(x) ∈ L, and writing √σ(x) = a + b√x
/// (a, b ∈ K) shows σ(x) or σ(x)/x is a square in K — in both cases x·σ(x) is a square in K
/// (Kummer theory; Lang, *Algebra*, VI §8). When x·σ(x) is rational, that square root is √r
/// whose smallest field Q(ζ_c) is known from r alone, so the test is: c must divide n.
/// Example: x = 3 + √2, σ: √2 ↦ −√2, x·σ(x) = 7, √7 needs Q(ζ₂₈) ⊄ Q(ζ₈): no cyclotomic root.
fn kummer_refutes(x: &Cyclo) -> bool {
    let n = x.field_order();
    if n <= 2 {
        return false;
    }
    // Q(ζₙ) = Q(ζ₂ₙ) for odd n.
    let n_full = if n % 2 == 1 { 2 * n as u64 } else { n as u64 };
    for k in 2..n as i64 {
        if super::poly::gcd(k as u64, n as u64) != 1 {
            continue;
        }
        let z = x * &x.galois(k);
        let Some(r) = z.to_rational() else { continue };
        // a negative r adds i = ζ₄ to the root's field
        let need = sqrt_conductor(&r).map(|c| {
            if r.is_negative() {
                super::poly::lcm(c as u32, 4) as u64
            } else {
                c
            }
        });
        match need {
            Some(c) if n_full % c != 0 => return true,
            _ => {}
        }
    }
    false
}

fn search_sqrt(x: &Cyclo) -> Result<Cyclo, SqrtError> {
    let n = x.field_order();
    for extra in [1u32, 2, 4, 8, 16, 3, 6, 12, 24, 5, 10, 20, 40] {
        let m = lcm(n, extra);
        if totient(m) / 2 > 10 {
            continue;
        }
        if let Some(y) = search_real_root(x, m) {
            return Ok(y);
        }
    }
    Err(SqrtError::NotCyclotomic(format!("{x:?}")))
}

/// Look for real y in Q(ζₘ) with y² = x, y > 0.
fn search_real_root(x: &Cyclo, m: u32) -> Option<Cyclo> {
    // Real subfield basis e₀ = 1, eⱼ = 2cos(2πj/m), j < d; real embeddings k coprime to m, k < m/2.
    let d = totient(m) / 2;
    let d = d.max(1);
    let ks: Vec<u32> = (1..m.max(2))
        .filter(|k| super::poly::gcd(*k as u64, m as u64) == 1 && 2 * k <= m)
        .take(d)
        .collect();
    if ks.len() != d {
        return None;
    }
    let basis_val = |j: usize, k: u32| -> f64 {
        if j == 0 {
            1.0
        } else {
            2.0 * (2.0 * std::f64::consts::PI * (j as f64) * (k as f64) / m as f64).cos()
        }
    };
    // x under each embedding σ_k (ζ ↦ ζᵏ).
    let xk: Vec<f64> = ks.iter().map(|&k| x.galois(k as i64).re_f64()).collect();
    if xk.iter().any(|v| *v < -1e-9) {
        return None; // a negative conjugate has no real root in a real field
    }
    let roots: Vec<f64> = xk.iter().map(|v| v.max(0.0).sqrt()).collect();
    let a: Vec<Vec<f64>> = ks
        .iter()
        .map(|&k| (0..d).map(|j| basis_val(j, k)).collect())
        .collect();
    for pattern in 0u32..(1 << (d - 1)) {
        let rhs: Vec<f64> = roots
            .iter()
            .enumerate()
            .map(|(i, r)| {
                if i > 0 && pattern >> (i - 1) & 1 == 1 {
                    -r
                } else {
                    *r
                }
            })
            .collect();
        let Some(c) = solve_f64(&a, &rhs) else {
            continue;
        };
        let mut y = Cyclo::zero();
        let mut ok = true;
        for (j, cj) in c.iter().enumerate() {
            let Some(r) = rationalize(*cj) else {
                ok = false;
                break;
            };
            let ej = if j == 0 {
                Cyclo::one()
            } else {
                Cyclo::cos_turn(j as i64, m as i64) * Cyclo::from_int(2)
            };
            y = y + ej * Cyclo::from_rational(r);
        }
        if ok && y.re_f64() > 0.0 && &(&y * &y) == x {
            return Some(y);
        }
    }
    None
}

fn solve_f64(a: &[Vec<f64>], b: &[f64]) -> Option<Vec<f64>> {
    let n = b.len();
    let mut m: Vec<Vec<f64>> = a
        .iter()
        .zip(b)
        .map(|(row, v)| {
            let mut r = row.clone();
            r.push(*v);
            r
        })
        .collect();
    for c in 0..n {
        let p = (c..n).max_by(|&i, &j| m[i][c].abs().total_cmp(&m[j][c].abs()))?;
        if m[p][c].abs() < 1e-12 {
            return None;
        }
        m.swap(c, p);
        for i in 0..n {
            if i != c {
                let f = m[i][c] / m[c][c];
                for j in c..=n {
                    m[i][j] -= f * m[c][j];
                }
            }
        }
    }
    Some((0..n).map(|i| m[i][n] / m[i][i]).collect())
}

/// Nearest fraction with a small denominator (continued fractions), if close enough.
pub fn rationalize(v: f64) -> Option<BigRational> {
    if !v.is_finite() {
        return None;
    }
    let (mut h0, mut h1) = (0i64, 1i64);
    let (mut k0, mut k1) = (1i64, 0i64);
    let mut x = v;
    for _ in 0..40 {
        let a = x.floor();
        if a.abs() > 1e12 {
            break;
        }
        let a = a as i64;
        let h2 = a.checked_mul(h1)?.checked_add(h0)?;
        let k2 = a.checked_mul(k1)?.checked_add(k0)?;
        h0 = h1;
        h1 = h2;
        k0 = k1;
        k1 = k2;
        if k1 > 10_000_000 {
            return None;
        }
        if ((h1 as f64) / (k1 as f64) - v).abs() < 1e-9 {
            return Some(BigRational::new(BigInt::from(h1), BigInt::from(k1)));
        }
        let frac = x - x.floor();
        if frac < 1e-15 {
            break;
        }
        x = 1.0 / frac;
    }
    if k1 != 0 && ((h1 as f64) / (k1 as f64) - v).abs() < 1e-9 {
        Some(BigRational::new(BigInt::from(h1), BigInt::from(k1)))
    } else {
        None
    }
}
