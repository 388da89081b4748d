//! [`Cyclo`]: an exact element of a cyclotomic field Q(ζₙ) with big-rational coefficients.
//!
//! Every character of a finite point group lies in some Q(ζₙ) (Serre, *Linear Representations of
//! Finite Groups*, §9.1), and so do the entries of the operation matrices in a standard
//! orientation. An element is stored in the power basis 1, ζ, …, ζ^{φ(n)−1} of Q(ζₙ), reduced
//! modulo Φₙ, which makes the representation unique for a given n. Two elements with different n
//! are compared and combined in Q(ζ_lcm). Rationals are kept with n = 1, the cheap common case.

use super::poly::{
    from_integer_form, gcd, integer_form, lcm, reduce, reduce_int, totient, Coeffs, Ints,
};
use super::rat::Rat;
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{ToPrimitive, Zero};
use smallvec::smallvec;
use std::fmt;
use std::ops::{Add, AddAssign, Div, Mul, Neg, Sub, SubAssign};

/// Identifies a [`Cyclo`] exactly (hashable), for memo tables.
#[derive(Clone, Debug, PartialEq, Eq, Hash)]
pub struct CycloKey(u32, Coeffs);

/// An exact cyclotomic number.
#[derive(Clone)]
pub struct Cyclo {
    n: u32,
    coeffs: Coeffs,
}

impl Cyclo {
    /// 0.
    pub fn zero() -> Self {
        Self::from_rational(BigRational::zero())
    }
    /// 1.
    pub fn one() -> Self {
        Self::from_int(1)
    }
    /// An integer.
    pub fn from_int(i: i64) -> Self {
        Self::from_rat(Rat::int(i))
    }
    /// A fraction p/q (q ≠ 0).
    pub fn frac(p: i64, q: i64) -> Self {
        Self::from_rational(BigRational::new(BigInt::from(p), BigInt::from(q)))
    }
    /// A rational number.
    pub fn from_rational(r: BigRational) -> Self {
        Cyclo {
            n: 1,
            coeffs: smallvec![Rat::from_big(r)],
        }
    }
    fn from_rat(r: Rat) -> Self {
        Cyclo {
            n: 1,
            coeffs: smallvec![r],
        }
    }

    /// ζₙᵏ = exp(2πi k/n).
    pub fn zeta(n: u32, k: i64) -> Self {
        assert!(n > 0, "root of unity of order 0");
        let k = k.rem_euclid(n as i64) as usize;
        let mut dense = vec![Rat::ZERO; n as usize];
        dense[k] = Rat::int(1);
        Self::from_dense_rat(dense, n)
    }

    /// exp(2πi·p/q) for a fraction of a turn.
    pub fn root_of_unity(p: i64, q: i64) -> Self {
        let (p, q) = normalize_fraction(p, q);
        Self::zeta(q as u32, p)
    }

    /// cos(2π·p/q), exactly.
    pub fn cos_turn(p: i64, q: i64) -> Self {
        let z = Self::root_of_unity(p, q);
        (&z + &z.conj()) * Self::frac(1, 2)
    }

    /// sin(2π·p/q), exactly.
    pub fn sin_turn(p: i64, q: i64) -> Self {
        let z = Self::root_of_unity(p, q);
        // (z − z̄)/(2i) = −i(z − z̄)/2
        (&z - &z.conj()) * Self::zeta(4, 3) * Self::frac(1, 2)
    }

    /// The imaginary unit.
    pub fn i() -> Self {
        Self::zeta(4, 1)
    }

    /// Build from a dense polynomial in ζₙ (any length), reducing modulo Φₙ.
    pub fn from_dense(dense: Vec<BigRational>, n: u32) -> Self {
        Self::from_dense_rat(dense.into_iter().map(Rat::from_big).collect(), n)
    }
    fn from_dense_rat(dense: Vec<Rat>, n: u32) -> Self {
        let coeffs = reduce(dense, n);
        let mut c = Cyclo { n, coeffs };
        c.normalize();
        c
    }

    /// Drop to n = 1 when the element is rational (keeps rationals cheap).
    fn normalize(&mut self) {
        if self.n == 1 {
            return;
        }
        if self.n == 2 {
            // Q(ζ₂) = Q; Φ₂ = x + 1, basis {1}.
            self.n = 1;
            return;
        }
        if self.n % 4 == 2 {
            // Q(ζ₂ₘ) = Q(ζₘ) for odd m, with ζ₂ₘ = −ζₘ^((m+1)/2) (ζ₂ₘᵐ = −1): one field, one
            // form, so products and sums of such numbers need no lifting.
            let m = self.n / 2;
            let e = (m as usize).div_ceil(2);
            let mut dense = vec![Rat::ZERO; m as usize];
            for (k, c) in self.coeffs.iter().enumerate() {
                if c.is_zero() {
                    continue;
                }
                let idx = (k * e) % m as usize;
                dense[idx] = if k % 2 == 1 {
                    &dense[idx] - c
                } else {
                    &dense[idx] + c
                };
            }
            self.n = m;
            self.coeffs = reduce(dense, m);
            if m == 1 {
                return;
            }
        }
        if self.coeffs.iter().skip(1).all(|c| c.is_zero()) {
            let c0 = self.coeffs[0].clone();
            self.n = 1;
            self.coeffs = smallvec![c0];
        }
    }

    /// The order n of the field Q(ζₙ) this element is stored in.
    pub fn field_order(&self) -> u32 {
        self.n
    }

    /// Coefficients in the power basis of Q(ζₙ).
    pub fn coefficients(&self) -> Vec<BigRational> {
        self.coeffs.iter().map(Rat::to_big).collect()
    }

    /// Stored identically (same field, same coefficients): what [`Cyclo::key`] equality says,
    /// without building the keys.
    pub fn same_form(&self, other: &Self) -> bool {
        self.n == other.n && self.coeffs == other.coeffs
    }

    /// A key that identifies the number (its field and coefficients), for memo tables.
    pub fn key(&self) -> CycloKey {
        CycloKey(self.n, self.coeffs.clone())
    }

    /// The positive rational c such that c·v has coprime integer coordinates (the lcm of the
    /// coefficient denominators over the gcd of the numerators); `None` for the zero vector.
    pub fn primitive_factor(v: &[Cyclo]) -> Option<BigRational> {
        let mut l: i64 = 1;
        let mut g: i64 = 0;
        let mut small = true;
        'scan: for c in v {
            for q in &c.coeffs {
                match q {
                    Rat::S(0, _) => {}
                    Rat::S(n, d) => {
                        let Some(nl) = l.checked_mul(d / super::rat::gcd_i64(l, *d)) else {
                            small = false;
                            break 'scan;
                        };
                        l = nl;
                        g = if g == 0 {
                            n.unsigned_abs().min(i64::MAX as u64) as i64
                        } else {
                            super::rat::gcd_i64(g, n.unsigned_abs().min(i64::MAX as u64) as i64)
                        };
                        if *n == i64::MIN {
                            small = false;
                            break 'scan;
                        }
                    }
                    Rat::B(_) => {
                        small = false;
                        break 'scan;
                    }
                }
            }
        }
        if small {
            return (g != 0).then(|| BigRational::new(BigInt::from(l), BigInt::from(g)));
        }
        let mut l = BigInt::from(1);
        let mut g = BigInt::zero();
        for c in v {
            for q in c.coefficients() {
                if q.is_zero() {
                    continue;
                }
                l = num_integer::Integer::lcm(&l, q.denom());
                g = num_integer::Integer::gcd(&g, q.numer());
            }
        }
        (!g.is_zero()).then(|| BigRational::new(l, num_traits::Signed::abs(&g)))
    }

    /// Express in Q(ζₘ) for a multiple m of n: dense coefficient vector of length φ(m).
    pub fn lift(&self, m: u32) -> Vec<BigRational> {
        self.lift_rat(m).iter().map(Rat::to_big).collect()
    }
    /// The coefficients in Q(ζₘ)'s power basis, or `None` when m is not a multiple of the
    /// element's storage field.
    pub(super) fn coeffs_in(&self, m: u32) -> Option<Coeffs> {
        (self.n <= 1 || m % self.n == 0).then(|| self.lift_rat(m))
    }
    /// Writes φ(m) integer numerators (in Q(ζₘ)'s power basis, m a multiple of the storage
    /// field) into `out` and returns their common denominator, when every part fits machine
    /// integers.
    pub(super) fn int_form_into(&self, m: u32, out: &mut [i128]) -> Option<i128> {
        out.iter_mut().for_each(|x| *x = 0);
        let lifted;
        let c: &[Rat] = if self.n <= 1 || self.n == m {
            &self.coeffs
        } else {
            lifted = self.coeffs_in(m)?;
            &lifted
        };
        let (nums, den) = integer_form(c)?;
        out[..nums.len()].copy_from_slice(&nums);
        Some(den)
    }
    /// The element with these coefficients in Q(ζₙ)'s power basis (φ(n) of them).
    pub(super) fn from_parts(n: u32, coeffs: Coeffs) -> Cyclo {
        let mut c = Cyclo { n, coeffs };
        c.normalize();
        c
    }
    fn lift_rat(&self, m: u32) -> Coeffs {
        if m == self.n {
            return self.coeffs.clone();
        }
        let n_eff = if self.n == 1 { 1 } else { self.n };
        assert!(
            m % n_eff == 0,
            "lift to a field that does not contain the element"
        );
        let step = (m / n_eff) as usize;
        let mut dense = vec![Rat::ZERO; m as usize];
        for (k, c) in self.coeffs.iter().enumerate() {
            if !c.is_zero() {
                dense[k * step] = &dense[k * step] + c;
            }
        }
        reduce(dense, m)
    }

    fn common(&self, other: &Self) -> u32 {
        lcm(self.n.max(1), other.n.max(1))
    }

    pub fn is_zero(&self) -> bool {
        self.coeffs.iter().all(|c| c.is_zero())
    }
    pub fn is_one(&self) -> bool {
        self.n == 1 && self.coeffs[0].is_one()
    }
    /// Is this −1?
    pub fn is_minus_one(&self) -> bool {
        self.n == 1 && self.coeffs[0] == Rat::int(-1)
    }
    /// Is this a rational number?
    pub fn is_rational(&self) -> bool {
        self.n == 1
    }
    /// The rational value, if rational.
    pub fn to_rational(&self) -> Option<BigRational> {
        if self.n == 1 {
            Some(self.coeffs[0].to_big())
        } else {
            None
        }
    }
    /// Is this a rational integer?
    pub fn is_integer(&self) -> bool {
        self.n == 1
            && match &self.coeffs[0] {
                Rat::S(_, d) => *d == 1,
                Rat::B(b) => b.is_integer(),
            }
    }
    /// The integer value, if a rational integer.
    pub fn to_integer(&self) -> Option<BigInt> {
        if self.is_integer() {
            Some(self.coeffs[0].to_big().to_integer())
        } else {
            None
        }
    }
    /// The integer value as i64, if it is one and fits.
    pub fn to_i64(&self) -> Option<i64> {
        match self.coeffs.first() {
            Some(Rat::S(n, 1)) if self.n == 1 => Some(*n),
            _ => self.to_integer().and_then(|i| i.to_i64()),
        }
    }

    /// Galois automorphism σₖ: ζ ↦ ζᵏ (k coprime to n).
    pub fn galois(&self, k: i64) -> Self {
        if self.n == 1 {
            return self.clone();
        }
        let n = self.n as i64;
        let mut dense = vec![Rat::ZERO; self.n as usize];
        for (j, c) in self.coeffs.iter().enumerate() {
            if !c.is_zero() {
                let idx = ((j as i64) * k).rem_euclid(n) as usize;
                dense[idx] = &dense[idx] + c;
            }
        }
        Self::from_dense_rat(dense, self.n)
    }

    /// Complex conjugate.
    pub fn conj(&self) -> Self {
        self.galois(-1)
    }

    /// Is this number real?
    pub fn is_real(&self) -> bool {
        self.n == 1 || *self == self.conj()
    }

    /// Multiplicative inverse; `None` for zero.
    pub fn inv(&self) -> Option<Self> {
        if self.is_zero() {
            return None;
        }
        if self.n == 1 {
            return Some(Self::from_rat(self.coeffs[0].recip()));
        }
        // x⁻¹ = (Π_{σ ≠ id} σ(x)) / N(x), N(x) = Π_σ σ(x) ∈ Q.
        let n = self.n as i64;
        let mut others = Self::one();
        for k in 2..n {
            if gcd(k as u64, n as u64) == 1 {
                others = &others * &self.galois(k);
            }
        }
        let norm = (&others * self)
            .to_rational()
            .expect("field norm is rational");
        Some(others * Self::from_rational(norm.recip()))
    }

    /// Integer power (negative powers invert; `None` for 0 to a negative power).
    pub fn pow(&self, e: i64) -> Option<Self> {
        let base = if e < 0 { self.inv()? } else { self.clone() };
        let mut e = e.unsigned_abs();
        let mut acc = Self::one();
        let mut b = base;
        while e > 0 {
            if e & 1 == 1 {
                acc = &acc * &b;
            }
            b = &b * &b;
            e >>= 1;
        }
        Some(acc)
    }

    /// Value as a complex number (re, im) in floating point.
    pub fn to_c64(&self) -> (f64, f64) {
        let n = self.n as f64;
        let mut re = 0.0;
        let mut im = 0.0;
        for (k, c) in self.coeffs.iter().enumerate() {
            if c.is_zero() {
                continue;
            }
            let v = c.to_f64();
            let a = 2.0 * std::f64::consts::PI * k as f64 / n;
            re += v * a.cos();
            im += v * a.sin();
        }
        (re, im)
    }
    /// Real part as f64.
    pub fn re_f64(&self) -> f64 {
        self.to_c64().0
    }
    /// Imaginary part as f64.
    pub fn im_f64(&self) -> f64 {
        self.to_c64().1
    }
    /// Real part (x + x̄)/2, exactly.
    pub fn re(&self) -> Self {
        (self + &self.conj()) * Self::frac(1, 2)
    }
    /// Imaginary part (x − x̄)/(2i), exactly.
    pub fn im(&self) -> Self {
        (self - &self.conj()) * Self::zeta(4, 3) * Self::frac(1, 2)
    }
    /// |x|², exactly.
    pub fn norm_sqr(&self) -> Self {
        self * &self.conj()
    }

    /// Sign of a real number (−1, 0, 1), decided exactly for rationals and numerically otherwise
    /// (the float value of a nonzero algebraic number of this size is far from 0).
    pub fn signum_real(&self) -> i32 {
        if self.is_zero() {
            return 0;
        }
        if self.n == 1 {
            return if self.coeffs[0].is_negative() { -1 } else { 1 };
        }
        if self.re_f64() > 0.0 {
            1
        } else {
            -1
        }
    }

    fn combine(&self, other: &Self, sign: bool) -> Self {
        if other.is_zero() {
            return self.clone();
        }
        if self.is_zero() {
            return if sign { other.clone() } else { -other };
        }
        // a rational plus an element of Q(ζₙ): only the coefficient of 1 = ζ⁰ changes
        if self.n == 1 && other.n != 1 {
            let mut c = if sign { other.clone() } else { -other };
            c.coeffs[0] = &c.coeffs[0] + &self.coeffs[0];
            return c;
        }
        if other.n == 1 && self.n != 1 {
            let mut c = self.clone();
            c.coeffs[0] = if sign {
                &c.coeffs[0] + &other.coeffs[0]
            } else {
                &c.coeffs[0] - &other.coeffs[0]
            };
            return c;
        }
        if self.n == other.n {
            let coeffs: Coeffs = self
                .coeffs
                .iter()
                .zip(&other.coeffs)
                .map(|(a, b)| if sign { a + b } else { a - b })
                .collect();
            let mut c = Cyclo { n: self.n, coeffs };
            c.normalize();
            return c;
        }
        let m = self.common(other);
        let a = self.lift_rat(m);
        let b = other.lift_rat(m);
        let coeffs = a
            .iter()
            .zip(&b)
            .map(|(x, y)| if sign { x + y } else { x - y })
            .collect();
        let mut c = Cyclo { n: m, coeffs };
        c.normalize();
        c
    }

    fn multiply(&self, other: &Self) -> Self {
        if self.n == 1 {
            return other.scale_rat(&self.coeffs[0]);
        }
        if other.n == 1 {
            return self.scale_rat(&other.coeffs[0]);
        }
        let m = self.common(other);
        let (la, lb);
        let a: &[Rat] = if self.n == m {
            &self.coeffs
        } else {
            la = self.lift_rat(m);
            &la
        };
        let b: &[Rat] = if other.n == m {
            &other.coeffs
        } else {
            lb = other.lift_rat(m);
            &lb
        };
        if let Some(c) = multiply_small(a, b, m) {
            let mut c = Cyclo { n: m, coeffs: c };
            c.normalize();
            return c;
        }
        let mut c = Cyclo {
            n: m,
            coeffs: multiply_general(a, b, m),
        };
        c.normalize();
        c
    }

    /// The rational r with self = r·other, if there is one (other ≠ 0). In the power basis of
    /// one field the representation is unique, so this is proportionality of coefficient
    /// vectors — no inverse needed.
    pub fn rational_ratio(&self, other: &Self) -> Option<BigRational> {
        if self.is_zero() {
            return Some(BigRational::zero());
        }
        let m = self.common(other);
        let a = self.lift_rat(m);
        let b = other.lift_rat(m);
        let k = b.iter().position(|c| !c.is_zero())?;
        let r = &a[k] * &b[k].recip();
        a.iter()
            .zip(&b)
            .all(|(x, y)| *x == y * &r)
            .then(|| r.to_big())
    }

    /// Multiply by a rational.
    pub fn scale(&self, r: &BigRational) -> Self {
        self.scale_rat(&Rat::from_big(r.clone()))
    }
    fn scale_rat(&self, r: &Rat) -> Self {
        if r.is_zero() {
            return Self::zero();
        }
        Cyclo {
            n: self.n,
            coeffs: self.coeffs.iter().map(|c| c * r).collect(),
        }
    }

    /// Smallest m dividing n such that the element lies in Q(ζₘ) (tries dropping prime factors).
    pub fn minimal_field(&self) -> Self {
        let mut cur = self.clone();
        loop {
            let n = cur.n;
            let mut shrunk = false;
            for p in prime_factors(n) {
                let m = n / p;
                if m == 0 {
                    continue;
                }
                if let Some(c) = cur.restrict(m) {
                    cur = c;
                    shrunk = true;
                    break;
                }
            }
            if !shrunk {
                return cur;
            }
        }
    }

    /// The same element expressed in Q(ζₘ) (m | n), if it lies there.
    fn restrict(&self, m: u32) -> Option<Self> {
        if self.n % m != 0 || m == self.n {
            return None;
        }
        if m <= 2 {
            // rationals are always stored with n = 1 (see `normalize`)
            return None;
        }
        // Coordinates in the power basis of Q(ζₘ) lifted to Q(ζₙ) (independent), prepared once
        // per (n, m); membership is decided exactly by the same solve.
        let span = super::linsolve::Span::cached(("power basis", self.n, vec![m]), || {
            Some(
                (0..totient(m))
                    .map(|k| Cyclo::zeta(m, k as i64).lift_rat(self.n).to_vec())
                    .collect(),
            )
        })?;
        let sol = span.coords(&self.coeffs)?;
        let mut c = Cyclo {
            n: m,
            coeffs: sol.into_iter().collect(),
        };
        if m <= 2 {
            c = Cyclo {
                n: 1,
                coeffs: smallvec![c.coeffs[0].clone()],
            };
        }
        c.normalize();
        Some(c)
    }
}

/// The product of two elements of Q(ζₘ), coefficient by coefficient (big rationals where a
/// part does not fit machine integers): the general path the integer form falls back to.
pub(super) fn multiply_general(a: &[Rat], b: &[Rat], m: u32) -> Coeffs {
    let mut dense = vec![Rat::ZERO; a.len() + b.len()];
    for (i, x) in a.iter().enumerate() {
        if x.is_zero() {
            continue;
        }
        for (j, y) in b.iter().enumerate() {
            if !y.is_zero() {
                dense[i + j] = &dense[i + j] + &(x * y);
            }
        }
    }
    super::poly::reduce_general(dense, m).into_iter().collect()
}

/// The product of two elements of Q(ζₘ) on the integer form (one common denominator each):
/// an integer convolution and an integer reduction modulo Φₘ. `None` when a part does not fit
/// (the caller then multiplies coefficient by coefficient with big rationals where needed).
pub(super) fn multiply_small(a: &[Rat], b: &[Rat], m: u32) -> Option<Coeffs> {
    let (na, da) = integer_form(a)?;
    let (nb, db) = integer_form(b)?;
    // |Σ xᵢyⱼ| ≤ len·max|x|·max|y|: keep 2⁹⁶ of the 2¹²⁷ for that, the rest for the reduction
    let ma = na.iter().map(|x| x.unsigned_abs()).max().unwrap_or(0);
    let mb = nb.iter().map(|x| x.unsigned_abs()).max().unwrap_or(0);
    let bound = ma
        .checked_mul(mb)?
        .checked_mul(na.len().min(nb.len()) as u128)?;
    if bound >= 1u128 << 96 {
        return None;
    }
    let mut dense: Ints = smallvec![0i128; na.len() + nb.len()];
    for (i, &x) in na.iter().enumerate() {
        if x == 0 {
            continue;
        }
        for (j, &y) in nb.iter().enumerate() {
            dense[i + j] += x * y;
        }
    }
    let r = reduce_int(dense, m)?;
    Some(from_integer_form(&r, da.checked_mul(db)?))
}

fn prime_factors(mut n: u32) -> Vec<u32> {
    let mut out = Vec::new();
    let mut p = 2;
    while p * p <= n {
        if n % p == 0 {
            out.push(p);
            while n % p == 0 {
                n /= p;
            }
        }
        p += 1;
    }
    if n > 1 {
        out.push(n);
    }
    out
}

fn normalize_fraction(p: i64, q: i64) -> (i64, i64) {
    assert!(q != 0, "zero denominator in a turn fraction");
    let (p, q) = if q < 0 { (-p, -q) } else { (p, q) };
    let g = gcd(p.unsigned_abs(), q as u64) as i64;
    let g = g.max(1);
    (p / g, q / g)
}

/// A rational as f64 (exact enough for display; big values saturate gracefully).
pub fn rational_to_f64(r: &BigRational) -> f64 {
    match (r.numer().to_f64(), r.denom().to_f64()) {
        (Some(a), Some(b)) if a.is_finite() && b.is_finite() => a / b,
        _ => {
            // Scale down both parts to avoid overflow.
            let shift = r.numer().bits().max(r.denom().bits()).saturating_sub(900);
            let a = (r.numer() >> shift).to_f64().unwrap_or(0.0);
            let b = (r.denom() >> shift).to_f64().unwrap_or(1.0);
            a / b
        }
    }
}

impl PartialEq for Cyclo {
    fn eq(&self, other: &Self) -> bool {
        if self.n == other.n {
            return self.coeffs == other.coeffs;
        }
        (self - other).is_zero()
    }
}
impl Eq for Cyclo {}

impl Default for Cyclo {
    fn default() -> Self {
        Self::zero()
    }
}

impl From<i64> for Cyclo {
    fn from(i: i64) -> Self {
        Self::from_int(i)
    }
}
impl From<BigRational> for Cyclo {
    fn from(r: BigRational) -> Self {
        Self::from_rational(r)
    }
}

macro_rules! binop {
    ($tr:ident, $f:ident, $body:expr) => {
        impl<'a> $tr<&'a Cyclo> for &'a Cyclo {
            type Output = Cyclo;
            fn $f(self, o: &'a Cyclo) -> Cyclo {
                $body(self, o)
            }
        }
        impl $tr<Cyclo> for Cyclo {
            type Output = Cyclo;
            fn $f(self, o: Cyclo) -> Cyclo {
                $body(&self, &o)
            }
        }
        impl<'a> $tr<&'a Cyclo> for Cyclo {
            type Output = Cyclo;
            fn $f(self, o: &'a Cyclo) -> Cyclo {
                $body(&self, o)
            }
        }
        impl<'a> $tr<Cyclo> for &'a Cyclo {
            type Output = Cyclo;
            fn $f(self, o: Cyclo) -> Cyclo {
                $body(self, &o)
            }
        }
    };
}
binop!(Add, add, |a: &Cyclo, b: &Cyclo| a.combine(b, true));
binop!(Sub, sub, |a: &Cyclo, b: &Cyclo| a.combine(b, false));
binop!(Mul, mul, |a: &Cyclo, b: &Cyclo| a.multiply(b));
binop!(Div, div, |a: &Cyclo, b: &Cyclo| a.multiply(
    &b.inv().expect("division of a cyclotomic number by zero")
));

impl Neg for Cyclo {
    type Output = Cyclo;
    fn neg(self) -> Cyclo {
        self.scale_rat(&Rat::int(-1))
    }
}
impl Neg for &Cyclo {
    type Output = Cyclo;
    fn neg(self) -> Cyclo {
        self.scale_rat(&Rat::int(-1))
    }
}
impl AddAssign<&Cyclo> for Cyclo {
    fn add_assign(&mut self, o: &Cyclo) {
        *self = self.combine(o, true);
    }
}
impl SubAssign<&Cyclo> for Cyclo {
    fn sub_assign(&mut self, o: &Cyclo) {
        *self = self.combine(o, false);
    }
}
impl std::iter::Sum for Cyclo {
    fn sum<I: Iterator<Item = Cyclo>>(iter: I) -> Cyclo {
        iter.fold(Cyclo::zero(), |a, b| a + b)
    }
}

impl fmt::Debug for Cyclo {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}", super::print::format(self, super::Notation::Ascii))
    }
}
impl fmt::Display for Cyclo {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(
            f,
            "{}",
            super::print::format(self, super::Notation::Unicode)
        )
    }
}
