//! Vectors and matrices over one cyclotomic field Q(ζₙ) held as machine integers: every entry
//! is φ(n) integer numerators in the power basis, and a whole vector (or matrix) shares one
//! positive denominator. A product of two entries is an integer convolution reduced modulo Φₙ
//! with precomputed rows for ζ^φ … ζ^(2φ−2); sums need no gcd at all, and a vector is brought
//! to lowest terms once per operation, not once per number.
//!
//! Every step is checked 128-bit arithmetic and returns `None` on overflow: the caller then does
//! the same work on [`Cyclo`] (big rationals), so results never depend on which path ran.

use super::cyclo::Cyclo;
use super::poly::{cyclotomic, from_integer_form, totient};
use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};

/// The field Q(ζₙ) with what products need: φ(n) and ζ^(φ+j) mod Φₙ for j = 0 … φ−2.
#[derive(Debug)]
pub struct KField {
    n: u32,
    phi: usize,
    /// `high[j]` = ζ^(φ+j) reduced modulo Φₙ (φ integer coefficients).
    high: Vec<Vec<i128>>,
    /// Power bases of subfields Q(ζₘ) expressed in this one, by m.
    lifts: Mutex<HashMap<u32, Arc<Vec<Vec<i128>>>>>,
}

impl KField {
    /// Q(ζₙ), built once per n. n ≡ 2 (mod 4) is not a storage field of [`Cyclo`]; use n/2.
    pub fn get(n: u32) -> Arc<KField> {
        static C: OnceLock<Mutex<HashMap<u32, Arc<KField>>>> = OnceLock::new();
        let c = C.get_or_init(|| Mutex::new(HashMap::new()));
        if let Some(f) = c.lock().expect("field cache").get(&n) {
            return f.clone();
        }
        let f = Arc::new(KField::build(n));
        c.lock().expect("field cache").insert(n, f.clone());
        f
    }

    fn build(n: u32) -> KField {
        let n = n.max(1);
        let phi = totient(n);
        let poly = cyclotomic(n); // monic, degree φ, lowest coefficient first
        let mut high = Vec::new();
        if phi > 1 {
            // ζ^φ = −Σ_{j<φ} p_j ζ^j
            let mut cur: Vec<i128> = poly[..phi].iter().map(|&p| -(p as i128)).collect();
            high.push(cur.clone());
            for _ in 1..phi.saturating_sub(1) {
                // multiply by ζ: shift up, fold the top coefficient back
                let top = cur[phi - 1];
                let mut next = vec![0i128; phi];
                next[1..phi].copy_from_slice(&cur[..(phi - 1)]);
                for j in 0..phi {
                    next[j] -= top * poly[j] as i128;
                }
                cur = next;
                high.push(cur.clone());
            }
        }
        KField {
            n,
            phi,
            high,
            lifts: Mutex::new(HashMap::new()),
        }
    }

    pub fn n(&self) -> u32 {
        self.n
    }
    pub fn phi(&self) -> usize {
        self.phi
    }

    /// acc += a·b in the field (a, b, acc: φ numerators each).
    #[inline]
    pub fn mul_acc(&self, acc: &mut [i128], a: &[i128], b: &[i128]) -> Option<()> {
        let phi = self.phi;
        if phi == 1 {
            acc[0] = acc[0].checked_add(a[0].checked_mul(b[0])?)?;
            return Some(());
        }
        let a_rat = a[1..].iter().all(|&x| x == 0);
        if a_rat {
            let s = a[0];
            if s == 0 {
                return Some(());
            }
            for (x, &y) in acc.iter_mut().zip(b) {
                if y != 0 {
                    *x = x.checked_add(s.checked_mul(y)?)?;
                }
            }
            return Some(());
        }
        if b[1..].iter().all(|&x| x == 0) {
            return self.mul_acc(acc, b, a);
        }
        let mut conv = [0i128; 64];
        let conv = if 2 * phi - 1 <= 64 {
            &mut conv[..2 * phi - 1]
        } else {
            return self.mul_acc_long(acc, a, b);
        };
        for (i, &x) in a.iter().enumerate() {
            if x == 0 {
                continue;
            }
            for (j, &y) in b.iter().enumerate() {
                if y != 0 {
                    conv[i + j] = conv[i + j].checked_add(x.checked_mul(y)?)?;
                }
            }
        }
        for (x, &c) in acc.iter_mut().zip(conv.iter()) {
            *x = x.checked_add(c)?;
        }
        for (j, &c) in conv[phi..].iter().enumerate() {
            if c == 0 {
                continue;
            }
            for (x, &r) in acc.iter_mut().zip(&self.high[j]) {
                if r != 0 {
                    *x = x.checked_add(c.checked_mul(r)?)?;
                }
            }
        }
        Some(())
    }

    fn mul_acc_long(&self, acc: &mut [i128], a: &[i128], b: &[i128]) -> Option<()> {
        let phi = self.phi;
        let mut conv = vec![0i128; 2 * phi - 1];
        for (i, &x) in a.iter().enumerate() {
            for (j, &y) in b.iter().enumerate() {
                conv[i + j] = conv[i + j].checked_add(x.checked_mul(y)?)?;
            }
        }
        for (x, &c) in acc.iter_mut().zip(conv.iter()) {
            *x = x.checked_add(c)?;
        }
        for (j, &c) in conv[phi..].iter().enumerate() {
            for (x, &r) in acc.iter_mut().zip(&self.high[j]) {
                *x = x.checked_add(c.checked_mul(r)?)?;
            }
        }
        Some(())
    }

    /// The φ numerators and the denominator of `c` in this field (c must lie in it).
    pub fn elem(&self, c: &Cyclo) -> Option<(Vec<i128>, i128)> {
        let mut nums = vec![0i128; self.phi];
        let den = self.elem_into(c, &mut nums)?;
        Some((nums, den))
    }

    /// Writes the φ numerators of `c` into `out`; returns the denominator.
    pub fn elem_into(&self, c: &Cyclo, out: &mut [i128]) -> Option<i128> {
        let m = c.field_order();
        if m <= 1 || m == self.n {
            return c.int_form_into(self.n, out);
        }
        if self.n % m != 0 {
            return None;
        }
        let mut src = [0i128; 64];
        let pm = totient(m);
        if pm > 64 {
            return None;
        }
        let den = c.int_form_into(m, &mut src[..pm])?;
        let map = self.lift_map(m);
        out.iter_mut().for_each(|x| *x = 0);
        for (x, row) in src[..pm].iter().zip(map.iter()) {
            if *x == 0 {
                continue;
            }
            for (t, r) in out.iter_mut().zip(row) {
                if *r != 0 {
                    *t = t.checked_add(x.checked_mul(*r)?)?;
                }
            }
        }
        Some(den)
    }

    /// Row k: ζₘᵏ (m dividing n) in this field's power basis, ζₘ = ζₙ^(n/m).
    fn lift_map(&self, m: u32) -> Arc<Vec<Vec<i128>>> {
        if let Some(v) = self.lifts.lock().expect("lift cache").get(&m) {
            return v.clone();
        }
        let step = (self.n / m) as usize;
        let rows: Vec<Vec<i128>> = (0..totient(m))
            .map(|k| {
                let mut nums = vec![0i128; self.phi];
                Cyclo::zeta(self.n, (k * step) as i64)
                    .int_form_into(self.n, &mut nums)
                    .expect("a root of unity has integer coefficients");
                nums
            })
            .collect();
        let v = Arc::new(rows);
        self.lifts.lock().expect("lift cache").insert(m, v.clone());
        v
    }

    /// The number nums/den of this field.
    pub fn cyclo(&self, nums: &[i128], den: i128) -> Cyclo {
        Cyclo::from_parts(self.n, from_integer_form(nums, den))
    }
}

fn gcd_u128(mut a: u128, mut b: u128) -> u128 {
    if a == 0 {
        return b;
    }
    if b == 0 {
        return a;
    }
    // binary gcd: no 128-bit division
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

fn lcm_i128(a: i128, b: i128) -> Option<i128> {
    if a == b || b == 1 {
        return Some(a);
    }
    let g = gcd_u128(a.unsigned_abs(), b.unsigned_abs()) as i128;
    (a / g).checked_mul(b)
}

/// A vector of `len` entries of one field over one positive denominator.
#[derive(Clone, Debug)]
pub struct KVec {
    pub num: Vec<i128>,
    pub den: i128,
}

impl KVec {
    /// The zero vector of `len` entries of a field of degree φ.
    pub fn zero(len: usize, phi: usize) -> KVec {
        KVec {
            num: vec![0; len * phi],
            den: 1,
        }
    }

    /// Entry `i` (φ numerators).
    #[inline]
    pub fn entry(&self, i: usize, phi: usize) -> &[i128] {
        &self.num[i * phi..(i + 1) * phi]
    }

    pub fn is_zero(&self) -> bool {
        self.num.iter().all(|&x| x == 0)
    }

    /// From exact numbers, all in the field.
    pub fn from_cyclos(f: &KField, v: &[Cyclo]) -> Option<KVec> {
        Self::from_iter(f, v.iter())
    }

    /// From exact numbers, all in the field, in order.
    pub fn from_iter<'a>(f: &KField, v: impl Iterator<Item = &'a Cyclo>) -> Option<KVec> {
        let phi = f.phi;
        let mut num: Vec<i128> = Vec::with_capacity(v.size_hint().0 * phi);
        let mut dens: Vec<i128> = Vec::with_capacity(v.size_hint().0);
        let mut den = 1i128;
        for c in v {
            let at = num.len();
            num.resize(at + phi, 0);
            let d = f.elem_into(c, &mut num[at..])?;
            den = lcm_i128(den, d)?;
            dens.push(d);
        }
        for (chunk, d) in num.chunks_mut(phi).zip(&dens) {
            let s = den / d;
            if s != 1 {
                for x in chunk {
                    *x = x.checked_mul(s)?;
                }
            }
        }
        let mut out = KVec { num, den };
        out.lowest_terms();
        Some(out)
    }

    /// Back to exact numbers.
    pub fn to_cyclos(&self, f: &KField) -> Vec<Cyclo> {
        self.num
            .chunks(f.phi)
            .map(|c| {
                if c.iter().all(|&x| x == 0) {
                    Cyclo::zero()
                } else {
                    f.cyclo(c, self.den)
                }
            })
            .collect()
    }

    /// Divide numerators and denominator by their gcd.
    pub fn lowest_terms(&mut self) {
        let mut g = self.den.unsigned_abs();
        for &x in &self.num {
            if g == 1 {
                return;
            }
            if x != 0 {
                g = gcd_u128(g, x.unsigned_abs());
            }
        }
        if g > 1 {
            let g = g as i128;
            for x in &mut self.num {
                *x /= g;
            }
            self.den /= g;
        }
    }

    /// Σ aᵢbᵢ (no conjugation) as an exact number.
    pub fn dot(&self, other: &KVec, f: &KField) -> Option<Cyclo> {
        let phi = f.phi;
        let mut acc = vec![0i128; phi];
        for (a, b) in self.num.chunks(phi).zip(other.num.chunks(phi)) {
            if a.iter().all(|&x| x == 0) || b.iter().all(|&x| x == 0) {
                continue;
            }
            f.mul_acc(&mut acc, a, b)?;
        }
        Some(f.cyclo(&acc, self.den.checked_mul(other.den)?))
    }

    /// self − s·other for a field number s.
    pub fn sub_scaled(&mut self, s: &Cyclo, other: &KVec, f: &KField) -> Option<()> {
        let (sn, sd) = f.elem(s)?;
        let od = sd.checked_mul(other.den)?;
        let den = lcm_i128(self.den, od)?;
        let ks = den / self.den;
        let ko = den / od;
        let phi = f.phi;
        let mut prod = vec![0i128; phi];
        for (i, o) in other.num.chunks(phi).enumerate() {
            if o.iter().all(|&x| x == 0) {
                if ks != 1 {
                    for x in &mut self.num[i * phi..(i + 1) * phi] {
                        *x = x.checked_mul(ks)?;
                    }
                }
                continue;
            }
            prod.iter_mut().for_each(|x| *x = 0);
            f.mul_acc(&mut prod, &sn, o)?;
            for (x, p) in self.num[i * phi..(i + 1) * phi].iter_mut().zip(&prod) {
                *x = x.checked_mul(ks)?.checked_sub(p.checked_mul(ko)?)?;
            }
        }
        self.den = den;
        self.lowest_terms();
        Some(())
    }
}

/// A family of exact numbers held over one common denominator: irrep matrices, operation
/// images of a basis. `num` holds φ numerators per number in the caller's order.
#[derive(Clone, Debug)]
pub struct KTable {
    pub num: Vec<i128>,
    pub den: i128,
}

impl KTable {
    /// From numbers in the field, in order.
    pub fn from_cyclos<'a>(f: &KField, v: impl Iterator<Item = &'a Cyclo>) -> Option<KTable> {
        let v = KVec::from_iter(f, v)?;
        Some(KTable {
            num: v.num,
            den: v.den,
        })
    }
    /// Number `i` (φ numerators over `den`).
    #[inline]
    pub fn at(&self, i: usize, phi: usize) -> &[i128] {
        &self.num[i * phi..(i + 1) * phi]
    }
}
