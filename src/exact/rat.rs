//! [`Rat`]: a rational number that stays in machine integers while it fits and moves to big
//! integers when it does not. Every operation is exact; overflow is detected with checked
//! 128-bit arithmetic, never wrapped (the num-rational overflow discipline, with a fast path).

use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{Signed, ToPrimitive};
use std::ops::{Add, Mul, Neg, Sub};

/// An exact rational. Invariant: `S(n, d)` has d > 0 and gcd(n, d) = 1; `B` is used only when
/// the value does not fit `S`.
#[derive(Clone, Debug, PartialEq, Eq, Hash)]
pub enum Rat {
    S(i64, i64),
    B(Box<BigRational>),
}

/// gcd of two positive 64-bit integers.
pub(super) fn gcd_i64(a: i64, b: i64) -> i64 {
    gcd_u64(a.unsigned_abs(), b.unsigned_abs()) as i64
}

/// Binary (Stein) gcd: shifts and subtractions, no division.
macro_rules! binary_gcd {
    ($name:ident, $t:ty) => {
        pub(super) fn $name(mut a: $t, mut b: $t) -> $t {
            if a == 0 {
                return b;
            }
            if b == 0 {
                return a;
            }
            let shift = (a | b).trailing_zeros();
            a >>= a.trailing_zeros();
            loop {
                b >>= b.trailing_zeros();
                if a > b {
                    std::mem::swap(&mut a, &mut b);
                }
                b -= a;
                if b == 0 {
                    return a << shift;
                }
            }
        }
    };
}
binary_gcd!(gcd_u64, u64);
binary_gcd!(gcd_u128, u128);

impl Rat {
    pub const ZERO: Rat = Rat::S(0, 1);
    pub fn int(i: i64) -> Rat {
        Rat::S(i, 1)
    }
    /// n/d from 128-bit parts (d ≠ 0), reduced; big when it does not fit.
    pub(super) fn from_i128(n: i128, d: i128) -> Rat {
        let (n, d) = if d < 0 { (-n, -d) } else { (n, d) };
        // The common case: both parts fit 64 bits, where a binary gcd is far cheaper than
        // 128-bit division.
        if let (Ok(nu), Ok(du)) = (u64::try_from(n.unsigned_abs()), u64::try_from(d)) {
            let g = gcd_u64(nu, du).max(1);
            let (nu, du) = (nu / g, du / g);
            if let (Ok(a), Ok(b)) = (i64::try_from(nu), i64::try_from(du)) {
                return Rat::S(if n < 0 { -a } else { a }, b);
            }
        }
        let g = gcd_u128(n.unsigned_abs(), d as u128).max(1) as i128;
        let (n, d) = (n / g, d / g);
        match (i64::try_from(n), i64::try_from(d)) {
            (Ok(a), Ok(b)) => Rat::S(a, b),
            _ => Rat::B(Box::new(BigRational::new(BigInt::from(n), BigInt::from(d)))),
        }
    }
    /// From a big rational, shrinking to machine integers when possible.
    pub fn from_big(r: BigRational) -> Rat {
        match (r.numer().to_i64(), r.denom().to_i64()) {
            (Some(a), Some(b)) => Rat::S(a, b),
            _ => Rat::B(Box::new(r)),
        }
    }
    pub fn to_big(&self) -> BigRational {
        match self {
            Rat::S(n, d) => BigRational::new_raw(BigInt::from(*n), BigInt::from(*d)),
            Rat::B(b) => (**b).clone(),
        }
    }
    pub fn is_zero(&self) -> bool {
        matches!(self, Rat::S(0, _))
    }
    pub fn is_one(&self) -> bool {
        matches!(self, Rat::S(1, 1))
    }
    pub fn to_f64(&self) -> f64 {
        match self {
            Rat::S(n, d) => *n as f64 / *d as f64,
            Rat::B(b) => super::cyclo::rational_to_f64(b),
        }
    }
    pub fn recip(&self) -> Rat {
        match self {
            Rat::S(n, d) => Rat::from_i128(*d as i128, *n as i128),
            Rat::B(b) => Rat::from_big(b.recip()),
        }
    }
    pub fn is_negative(&self) -> bool {
        match self {
            Rat::S(n, _) => *n < 0,
            Rat::B(b) => b.is_negative(),
        }
    }
}

impl Default for Rat {
    fn default() -> Self {
        Rat::ZERO
    }
}

impl Add for &Rat {
    type Output = Rat;
    fn add(self, o: &Rat) -> Rat {
        match (self, o) {
            (Rat::S(0, _), x) | (x, Rat::S(0, _)) => x.clone(),
            (Rat::S(a, b), Rat::S(c, d)) => {
                if b == d {
                    if *b == 1 {
                        if let Some(s) = a.checked_add(*c) {
                            return Rat::S(s, 1);
                        }
                    }
                    return Rat::from_i128(*a as i128 + *c as i128, *b as i128);
                }
                let (a, b, c, d) = (*a as i128, *b as i128, *c as i128, *d as i128);
                match a.checked_mul(d).zip(c.checked_mul(b)) {
                    Some((x, y)) => Rat::from_i128(x + y, b * d),
                    None => Rat::from_big(self.to_big() + o.to_big()),
                }
            }
            _ => Rat::from_big(self.to_big() + o.to_big()),
        }
    }
}

impl Neg for &Rat {
    type Output = Rat;
    fn neg(self) -> Rat {
        match self {
            Rat::S(n, d) => match n.checked_neg() {
                Some(m) => Rat::S(m, *d),
                None => Rat::from_big(-self.to_big()),
            },
            Rat::B(b) => Rat::from_big(-(**b).clone()),
        }
    }
}

impl Sub for &Rat {
    type Output = Rat;
    fn sub(self, o: &Rat) -> Rat {
        self + &(-o)
    }
}

impl Mul for &Rat {
    type Output = Rat;
    fn mul(self, o: &Rat) -> Rat {
        match (self, o) {
            (Rat::S(0, _), _) | (_, Rat::S(0, _)) => Rat::ZERO,
            (Rat::S(1, 1), x) | (x, Rat::S(1, 1)) => x.clone(),
            (Rat::S(a, b), Rat::S(c, d)) => {
                if *b == 1 && *d == 1 {
                    if let Some(p) = a.checked_mul(*c) {
                        return Rat::S(p, 1);
                    }
                }
                // Cross-cancel first (gcd(a, d), gcd(c, b)): the result is then already in
                // lowest terms and usually fits 64 bits without a 128-bit gcd.
                let g1 = gcd_u64(a.unsigned_abs(), *d as u64).max(1) as i128;
                let g2 = gcd_u64(c.unsigned_abs(), *b as u64).max(1) as i128;
                let (a, b, c, d) = (*a as i128, *b as i128, *c as i128, *d as i128);
                let (n, m) = ((a / g1) * (c / g2), (b / g2) * (d / g1));
                match (i64::try_from(n), i64::try_from(m)) {
                    (Ok(x), Ok(y)) => Rat::S(x, y),
                    _ => Rat::from_i128(n, m),
                }
            }
            _ => Rat::from_big(self.to_big() * o.to_big()),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    #[test]
    fn overflow_moves_to_big_integers() {
        let big = Rat::int(i64::MAX);
        let s = &big + &big;
        assert_eq!(
            s.to_big(),
            BigRational::from_integer(BigInt::from(i64::MAX) * 2)
        );
        let p = &big * &big;
        assert_eq!(
            p.to_big(),
            BigRational::from_integer(BigInt::from(i64::MAX).pow(2))
        );
        let back = &p * &big.recip();
        assert_eq!(back, big);
        let m = Rat::int(i64::MIN);
        assert_eq!(
            (-&m).to_big(),
            BigRational::from_integer(-BigInt::from(i64::MIN))
        );
    }
    #[test]
    fn fractions_reduce() {
        let a = Rat::from_i128(2, 4);
        assert_eq!(a, Rat::S(1, 2));
        assert_eq!(&a + &a, Rat::int(1));
        assert_eq!(&Rat::S(1, 3) - &Rat::S(1, 2), Rat::S(-1, 6));
    }
}
