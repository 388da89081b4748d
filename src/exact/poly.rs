//! Cyclotomic polynomials Φₙ and reduction of polynomials in ζₙ modulo Φₙ.
//!
//! Φₙ is computed from xⁿ − 1 = Π_{d | n} Φ_d by exact integer division and cached.
//! Source: Lang, *Algebra*, VI §3 (standard facts about cyclotomic polynomials).

use super::rat::Rat;
use smallvec::SmallVec;

/// Power-basis coefficients of one number: four fit inline (Q, Q(√2), Q(√3), Q(√5), Q(i) and
/// Q(ζ₃…₁₂) — the fields of most point groups), so most numbers need no heap allocation.
pub type Coeffs = SmallVec<[Rat; 4]>;
/// Integer numerators on the integer form.
pub type Ints = SmallVec<[i128; 8]>;
use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};

/// Euler's totient φ(n) = degree of Φₙ.
pub fn totient(n: u32) -> usize {
    let mut result = n as u64;
    let mut m = n as u64;
    let mut p = 2u64;
    while p * p <= m {
        if m % p == 0 {
            while m % p == 0 {
                m /= p;
            }
            result -= result / p;
        }
        p += 1;
    }
    if m > 1 {
        result -= result / m;
    }
    result as usize
}

pub fn gcd(a: u64, b: u64) -> u64 {
    if b == 0 {
        a
    } else {
        gcd(b, a % b)
    }
}

pub fn lcm(a: u32, b: u32) -> u32 {
    let g = gcd(a as u64, b as u64);
    ((a as u64 / g) * b as u64) as u32
}

fn cache() -> &'static Mutex<HashMap<u32, Arc<Vec<i64>>>> {
    static CACHE: OnceLock<Mutex<HashMap<u32, Arc<Vec<i64>>>>> = OnceLock::new();
    CACHE.get_or_init(|| Mutex::new(HashMap::new()))
}

/// Φₙ for small n without a lock: arithmetic reduces modulo Φₙ on every product, so the
/// lookup must be cheap (a shared table filled once per n).
const SMALL: usize = 512;
fn small() -> &'static [OnceLock<Arc<Vec<i64>>>] {
    static T: OnceLock<Vec<OnceLock<Arc<Vec<i64>>>>> = OnceLock::new();
    T.get_or_init(|| (0..SMALL).map(|_| OnceLock::new()).collect())
}

/// Coefficients of Φₙ, lowest degree first (monic, integer, length φ(n)+1).
pub fn cyclotomic(n: u32) -> Arc<Vec<i64>> {
    if (n as usize) < SMALL {
        return small()[n as usize]
            .get_or_init(|| compute_cyclotomic(n))
            .clone();
    }
    if let Some(p) = cache().lock().expect("cyclotomic cache").get(&n) {
        return p.clone();
    }
    let arc = compute_cyclotomic(n);
    cache()
        .lock()
        .expect("cyclotomic cache")
        .insert(n, arc.clone());
    arc
}

fn compute_cyclotomic(n: u32) -> Arc<Vec<i64>> {
    // Start from xⁿ − 1 and divide by Φ_d for every proper divisor d.
    let mut num: Vec<i64> = vec![0; n as usize + 1];
    num[0] = -1;
    num[n as usize] = 1;
    for d in 1..n {
        if n % d == 0 {
            let phi_d = cyclotomic(d);
            num = divide_exact(&num, &phi_d);
        }
    }
    Arc::new(num)
}

/// Exact division of integer polynomials by a monic divisor (remainder must be zero).
fn divide_exact(num: &[i64], den: &[i64]) -> Vec<i64> {
    let mut rem = num.to_vec();
    let dd = den.len() - 1;
    let nd = rem.len() - 1;
    let mut quot = vec![0i64; nd - dd + 1];
    for k in (0..=nd - dd).rev() {
        let c = rem[k + dd];
        quot[k] = c;
        if c != 0 {
            for (j, dj) in den.iter().enumerate() {
                rem[k + j] -= c * dj;
            }
        }
    }
    debug_assert!(rem.iter().all(|c| *c == 0));
    quot
}

/// Reduce a dense polynomial in ζₙ (any length) modulo Φₙ; returns φ(n) coefficients.
pub fn reduce(coeffs: Vec<Rat>, n: u32) -> Coeffs {
    if let Some((nums, den)) = integer_form(&coeffs) {
        if let Some(r) = reduce_int(nums, n) {
            return from_integer_form(&r, den);
        }
    }
    reduce_general(coeffs, n).into_iter().collect()
}

/// Rationals over one common denominator: (numerators, denominator), when every part fits
/// 64 bits. Most numbers salcdesk meets (characters, matrix entries, SALC coefficients) have
/// small common denominators, so arithmetic on this form needs one gcd per result instead of
/// one per coefficient and no big integers.
pub fn integer_form(c: &[Rat]) -> Option<(Ints, i128)> {
    let mut den: i64 = 1;
    for r in c {
        match r {
            Rat::S(_, d) => {
                if *d != 1 && den % d != 0 {
                    let g = super::rat::gcd_i64(den, *d);
                    den = den.checked_mul(d / g)?;
                }
            }
            Rat::B(_) => return None,
        }
    }
    let nums = c
        .iter()
        .map(|r| match r {
            Rat::S(n, d) => (*n as i128).checked_mul((den / d) as i128),
            Rat::B(_) => None,
        })
        .collect::<Option<Ints>>()?;
    Some((nums, den as i128))
}

/// Back from the integer form, each coefficient in lowest terms.
pub fn from_integer_form(nums: &[i128], den: i128) -> Coeffs {
    nums.iter()
        .map(|&x| {
            if x == 0 {
                Rat::ZERO
            } else {
                Rat::from_i128(x, den)
            }
        })
        .collect()
}

/// Integer numerators of a dense polynomial in ζₙ reduced modulo Φₙ (monic, integer), with
/// checked arithmetic: `None` on overflow (the caller then takes the general path).
pub fn reduce_int(mut coeffs: Ints, n: u32) -> Option<Ints> {
    let phi = cyclotomic(n);
    let deg = phi.len() - 1;
    let nn = n as usize;
    if coeffs.len() > nn {
        for k in nn..coeffs.len() {
            let c = coeffs[k];
            if c != 0 {
                coeffs[k % nn] = coeffs[k % nn].checked_add(c)?;
            }
        }
        coeffs.truncate(nn);
    }
    for top in (deg..coeffs.len()).rev() {
        let c = std::mem::replace(&mut coeffs[top], 0);
        if c == 0 {
            continue;
        }
        let shift = top - deg;
        for (j, &pj) in phi.iter().enumerate().take(deg) {
            match pj {
                0 => {}
                1 => coeffs[shift + j] = coeffs[shift + j].checked_sub(c)?,
                -1 => coeffs[shift + j] = coeffs[shift + j].checked_add(c)?,
                p => {
                    coeffs[shift + j] = coeffs[shift + j].checked_sub(c.checked_mul(p as i128)?)?
                }
            }
        }
    }
    coeffs.resize(deg, 0);
    Some(coeffs)
}

/// The general reduction, coefficient by coefficient (big rationals where needed).
pub(super) fn reduce_general(mut coeffs: Vec<Rat>, n: u32) -> Vec<Rat> {
    let phi = cyclotomic(n);
    let deg = phi.len() - 1;
    // First fold exponents ≥ n using ζⁿ = 1.
    if coeffs.len() > n as usize {
        let extra: Vec<Rat> = coeffs.drain(n as usize..).collect();
        for (k, c) in extra.into_iter().enumerate() {
            let idx = k % n as usize;
            coeffs[idx] = &coeffs[idx] + &c;
        }
    }
    for top in (deg..coeffs.len()).rev() {
        if coeffs[top].is_zero() {
            continue;
        }
        let c = std::mem::replace(&mut coeffs[top], Rat::ZERO);
        let shift = top - deg;
        let neg = -&c;
        for (j, pj) in phi.iter().enumerate().take(deg) {
            match *pj {
                0 => {}
                1 => coeffs[shift + j] = &coeffs[shift + j] + &neg,
                -1 => coeffs[shift + j] = &coeffs[shift + j] + &c,
                p => coeffs[shift + j] = &coeffs[shift + j] - &(&c * &Rat::int(p)),
            }
        }
    }
    coeffs.truncate(deg);
    while coeffs.len() < deg {
        coeffs.push(Rat::ZERO);
    }
    coeffs
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn known_cyclotomic_polynomials() {
        // Source: standard table of cyclotomic polynomials (e.g. Lang, Algebra).
        assert_eq!(*cyclotomic(1), vec![-1, 1]);
        assert_eq!(*cyclotomic(3), vec![1, 1, 1]);
        assert_eq!(*cyclotomic(4), vec![1, 0, 1]);
        assert_eq!(*cyclotomic(8), vec![1, 0, 0, 0, 1]);
        assert_eq!(*cyclotomic(12), vec![1, 0, -1, 0, 1]);
        assert_eq!(*cyclotomic(5), vec![1, 1, 1, 1, 1]);
        assert_eq!(totient(16), 8);
        assert_eq!(totient(60), 16);
    }
}
