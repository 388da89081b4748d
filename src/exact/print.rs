//! Printing exact numbers readably: `−1/2`, `(1+√5)/2`, `√2/2`, `2cos(2π/7)`, `exp(2πi/3)`.
//!
//! A real number is written in the nicest basis found, in this order: rational; 1 and one square
//! root √d; 1, √d₁, √d₂, √(d₁d₂); else 1 and the cosines 2cos(2πj/n). A root of unity is written
//! as `exp(2πi·p/q)` (with a leading minus when that makes the order odd, as tables write −ε).
//! Other complex numbers are written re + im·i. Every printed form parses back to the same number.

use super::cyclo::Cyclo;
use super::sqrt::sqrt_rational;
use super::subfield::{conductor, squarefree};
use super::Notation;
use num_bigint::BigInt;
use num_integer::Integer;
use num_rational::BigRational;
use num_traits::{One, Signed, Zero};

/// Exact text of a number.
pub fn format(x: &Cyclo, nt: Notation) -> String {
    if let Some(q) = x.to_rational() {
        return format_rational(&q, nt);
    }
    // Finding the nicest form costs a few linear solves; tables and SALC lists print the same
    // few values many times, so irrational results are remembered (bounded).
    use std::sync::{Mutex, OnceLock};
    type Key = (super::CycloKey, bool);
    static MEMO: OnceLock<Mutex<super::QuickMap<Key, String>>> = OnceLock::new();
    let memo = MEMO.get_or_init(|| Mutex::new(super::QuickMap::default()));
    let key = (x.key(), nt == Notation::Ascii);
    if let Some(s) = memo.lock().expect("print memo").get(&key) {
        return s.clone();
    }
    let s = format_irrational(x, nt);
    let mut m = memo.lock().expect("print memo");
    if m.len() > 20_000 {
        m.clear();
    }
    m.insert(key, s.clone());
    s
}

fn format_irrational(x: &Cyclo, nt: Notation) -> String {
    let x = x.minimal_field();
    if x.is_real() {
        return format_real(&x, nt);
    }
    if let Some(s) = format_root_of_unity(&x, nt) {
        return s;
    }
    let re = x.re();
    let im = x.im();
    let im_s = format(&im, nt);
    let im_part = if im.is_one() {
        "i".to_string()
    } else if is_atomic(&im_s) {
        format!("{im_s}i")
    } else {
        format!("({im_s})i")
    };
    if re.is_zero() {
        return im_part;
    }
    format!("{} + {}", format(&re, nt), im_part)
}

/// Decimal approximation, e.g. `0.618034` or `-0.5+0.866025i`.
pub fn decimal(x: &Cyclo) -> String {
    let (re, im) = x.to_c64();
    let f = |v: f64| {
        let s = format!("{:.6}", v);
        let s = s.trim_end_matches('0').trim_end_matches('.').to_string();
        if s == "-0" {
            "0".to_string()
        } else {
            s
        }
    };
    if im.abs() < 1e-12 {
        f(re)
    } else if re.abs() < 1e-12 {
        format!("{}i", f(im))
    } else {
        format!("{}{}{}i", f(re), if im < 0.0 { "" } else { "+" }, f(im))
    }
}

fn is_atomic(s: &str) -> bool {
    let body = s
        .strip_prefix('−')
        .or_else(|| s.strip_prefix('-'))
        .unwrap_or(s);
    !body.contains(['+', '-', '−', '/', ' '])
}

fn minus(nt: Notation) -> &'static str {
    match nt {
        Notation::Unicode => "−",
        Notation::Ascii => "-",
    }
}

/// `3`, `−1/2`.
pub fn format_rational(q: &BigRational, nt: Notation) -> String {
    let sign = if q.is_negative() { minus(nt) } else { "" };
    let a = q.abs();
    if a.is_integer() {
        format!("{sign}{}", a.numer())
    } else {
        format!("{sign}{}/{}", a.numer(), a.denom())
    }
}

fn sqrt_text(d: u32, nt: Notation) -> String {
    match nt {
        Notation::Unicode => format!("√{d}"),
        Notation::Ascii => format!("sqrt({d})"),
    }
}

fn cos_text(j: u32, n: u32, nt: Notation) -> String {
    let r = BigRational::new(BigInt::from(2 * j), BigInt::from(n));
    let (num, den) = (r.numer().clone(), r.denom().clone());
    let pi = match nt {
        Notation::Unicode => "π",
        Notation::Ascii => "pi",
    };
    let num_s = if num.is_one() {
        pi.to_string()
    } else {
        format!("{num}{pi}")
    };
    if den.is_one() {
        format!("2cos({num_s})")
    } else {
        format!("2cos({num_s}/{den})")
    }
}

fn format_real(x: &Cyclo, nt: Notation) -> String {
    let n = x.field_order();
    let n_even = if n % 2 == 1 { 2 * n } else { n };
    let ds: Vec<u32> = (2..=210)
        .filter(|d| squarefree(*d) && n_even % conductor(*d) == 0)
        .collect();
    let root = cached_root;
    // 1 and √d.
    for &d in &ds {
        let Some(r) = root(d) else { continue };
        if let Some(c) = coords(x, &[d], &[Cyclo::one(), r]) {
            return join_terms(&c, &["".into(), sqrt_text(d, nt)], nt);
        }
    }
    // 1, √d₁, √d₂, √(d₁d₂).
    for (i, &d1) in ds.iter().enumerate() {
        for &d2 in &ds[i + 1..] {
            let d12 = d1 * d2;
            let g = num_integer::gcd(d1, d2);
            let d3 = d12 / (g * g);
            let (Some(r1), Some(r2), Some(r3)) = (root(d1), root(d2), root(d3)) else {
                continue;
            };
            if let Some(c) = coords(x, &[d1, d2, d3], &[Cyclo::one(), r1, r2, r3.clone()]) {
                // √(d₁d₂) = g·√d₃
                let names = [
                    String::new(),
                    sqrt_text(d1, nt),
                    sqrt_text(d2, nt),
                    sqrt_text(d3, nt),
                ];
                return join_terms(&c, &names, nt);
            }
        }
    }
    // 1 and 2cos(2πj/n).
    let d = super::poly::totient(n_even) / 2;
    let mut basis = vec![Cyclo::one()];
    let mut names = vec![String::new()];
    for j in 1..d as u32 {
        basis.push(Cyclo::cos_turn(j as i64, n_even as i64) * Cyclo::from_int(2));
        names.push(cos_text(j, n_even, nt));
    }
    if let Some(c) = coords(x, &[0, n_even], &basis) {
        return join_terms(&c, &names, nt);
    }
    // Should not happen for a real cyclotomic number; fall back to the decimal value.
    decimal(x)
}

/// √d for small squarefree d, computed once per process (printing asks for them often).
fn cached_root(d: u32) -> Option<Cyclo> {
    use std::collections::HashMap;
    use std::sync::{Mutex, OnceLock};
    static ROOTS: OnceLock<Mutex<HashMap<u32, Option<Cyclo>>>> = OnceLock::new();
    let cache = ROOTS.get_or_init(|| Mutex::new(HashMap::new()));
    if let Some(r) = cache.lock().expect("root cache").get(&d) {
        return r.clone();
    }
    let r = sqrt_rational(&BigRational::from_integer(BigInt::from(d))).ok();
    cache.lock().expect("root cache").insert(d, r.clone());
    r
}

/// Rational coordinates of x in the given (independent) basis, if x lies in its span. `tag`
/// names the basis (the same tag, the same basis): each basis is prepared once per field.
fn coords(x: &Cyclo, tag: &[u32], basis: &[Cyclo]) -> Option<Vec<BigRational>> {
    let m = basis
        .iter()
        .fold(x.field_order(), |m, b| super::poly::lcm(m, b.field_order()));
    let span = super::linsolve::Span::cached(("print", m, tag.to_vec()), || {
        basis
            .iter()
            .map(|b| b.coeffs_in(m).map(|c| c.to_vec()))
            .collect()
    })?;
    let y = span.coords(&x.coeffs_in(m)?)?;
    Some(y.iter().map(|r| r.to_big()).collect())
}

/// Σ cⱼ·termⱼ over a common denominator: `(1+√5)/2`, `−√3/2`, `2cos(2π/7)`.
fn join_terms(c: &[BigRational], names: &[String], nt: Notation) -> String {
    let den = c.iter().fold(BigInt::one(), |acc, q| acc.lcm(q.denom()));
    let mut parts: Vec<(bool, String)> = Vec::new();
    for (q, name) in c.iter().zip(names) {
        if q.is_zero() {
            continue;
        }
        let k = (q * BigRational::from_integer(den.clone())).to_integer();
        let neg = k.is_negative();
        let k = k.abs();
        let body = if name.is_empty() {
            k.to_string()
        } else if k.is_one() {
            name.clone()
        } else if name.starts_with('2') {
            let dot = match nt {
                Notation::Unicode => "·",
                Notation::Ascii => "*",
            };
            format!("{k}{dot}{name}")
        } else {
            format!("{k}{name}")
        };
        parts.push((neg, body));
    }
    let mut s = String::new();
    for (i, (neg, body)) in parts.iter().enumerate() {
        if i == 0 {
            if *neg {
                s.push_str(minus(nt));
            }
        } else {
            s.push_str(if *neg { minus(nt) } else { "+" });
        }
        s.push_str(body);
    }
    if den.is_one() {
        s
    } else if parts.len() == 1 {
        format!("{s}/{den}")
    } else {
        format!("({s})/{den}")
    }
}

fn format_root_of_unity(x: &Cyclo, nt: Notation) -> Option<String> {
    let (re, im) = x.to_c64();
    if ((re * re + im * im) - 1.0).abs() > 1e-9 {
        return None;
    }
    let n = x.field_order().max(1) as i64;
    let n2 = 2 * n;
    let turn = im.atan2(re) / (2.0 * std::f64::consts::PI);
    let k = (turn * n2 as f64).round() as i64;
    let cand = Cyclo::root_of_unity(k, n2);
    if &cand != x {
        return None;
    }
    let q = BigRational::new(BigInt::from(k), BigInt::from(n2));
    if q.denom() == &BigInt::from(4) {
        // ±i
        let sign = if q.numer().is_one() { "" } else { minus(nt) };
        return Some(format!("{sign}i"));
    }
    // Order of x is the denominator of q; prefer −exp(…) when that gives an odd order.
    let (neg, q) = if q.denom() % 2u32 == BigInt::zero()
        && (q.denom() / 2u32) % 2u32 == BigInt::one()
        && q.denom() > &BigInt::from(2)
    {
        let half = BigRational::new(BigInt::one(), BigInt::from(2));
        let mut r = q - half;
        if r <= -BigRational::new(BigInt::one(), BigInt::from(2)) {
            r += BigRational::one();
        }
        (true, r)
    } else {
        (false, q)
    };
    // exp(2πi·q) with q = a/b ⇒ angle (2a/b)πi
    let two_q = q * BigRational::from_integer(BigInt::from(2));
    let a = two_q.numer().clone();
    let b = two_q.denom().clone();
    let (pi, ii) = match nt {
        Notation::Unicode => ("π", "i"),
        Notation::Ascii => ("pi", " i"),
    };
    let sign = if a.is_negative() { minus(nt) } else { "" };
    let a_abs = a.abs();
    let num = if a_abs.is_one() {
        format!("{sign}{pi}{ii}")
    } else {
        format!("{sign}{a_abs}{pi}{ii}")
    };
    let body = if b.is_one() {
        format!("exp({num})")
    } else {
        format!("exp({num}/{b})")
    };
    Some(if neg {
        format!("{}{body}", minus(nt))
    } else {
        body
    })
}
