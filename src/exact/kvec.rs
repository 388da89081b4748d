//! Vectors and matrices over one number field held as machine integers: every entry is k
//! integer numerators in the field's power basis, and a whole vector (or matrix) shares one
//! positive denominator. The field is Q(ζₙ) (basis powers of ζₙ) or one of its real subfields
//! (basis powers of a primitive element η, see [`super::subfield`]). A product of two entries is
//! an integer convolution reduced with precomputed rows for x^k … x^(2k−2) modulo the minimal
//! polynomial; sums need no gcd at all, and a vector is brought to lowest terms once per
//! operation, not once per number.
//!
//! Every step is checked 128-bit arithmetic and returns `None` on overflow: the caller then does
//! the same work on big integers, so results never depend on which path ran.

use super::cyclo::Cyclo;
use super::poly::{cyclotomic, from_integer_form, totient};
use super::rat::{gcd_u128, gcd_u64};
use super::subfield::{solve_fraction_free, Embedding, FieldSpec};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{One, Signed, Zero};
use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};

/// Integers below this size multiply as 64-bit numbers into a 128-bit product.
const SMALL: u128 = 1 << 60;

/// A number field with what products need: its degree k and x^(k+j) modulo its minimal
/// polynomial for j = 0 … k−2.
#[derive(Debug)]
pub struct KField {
    /// Order of the cyclotomic field the numbers are stored in.
    n: u32,
    /// Degree of this field (φ(n) for Q(ζₙ)).
    phi: usize,
    /// `high[j]` = x^(k+j) reduced modulo the minimal polynomial (k integer coefficients).
    high: Vec<Vec<i128>>,
    /// For a proper subfield: Q(ζₙ) and how this field sits in it.
    emb: Option<(Arc<KField>, Embedding)>,
    /// Power bases of subfields Q(ζₘ) expressed in this one (Q(ζₙ) only), by m.
    lifts: Mutex<HashMap<u32, Arc<Vec<Vec<i128>>>>>,
}

impl KField {
    /// Q(ζₙ), built once per n. n ≡ 2 (mod 4) is not a storage field of [`Cyclo`]; use n/2.
    pub fn get(n: u32) -> Arc<KField> {
        Self::of(&FieldSpec::Cyclotomic(n.max(1))).expect("a cyclotomic field can be built")
    }

    /// The field named by `spec`, built once per process; `None` when a subfield's numbers do
    /// not fit machine integers.
    pub fn of(spec: &FieldSpec) -> Option<Arc<KField>> {
        type Cache = Mutex<HashMap<FieldSpec, Option<Arc<KField>>>>;
        static C: OnceLock<Cache> = OnceLock::new();
        let c = C.get_or_init(|| Mutex::new(HashMap::new()));
        if let Some(f) = c.lock().expect("field cache").get(spec) {
            return f.clone();
        }
        let f = match spec {
            FieldSpec::Cyclotomic(n) => {
                let poly: Vec<i128> = cyclotomic(*n).iter().map(|&p| p as i128).collect();
                Self::build(spec.home(), &poly, None)
            }
            _ => {
                let home = Self::get(spec.home());
                Embedding::new(spec).and_then(|e| {
                    let poly = e.poly.clone();
                    Self::build(spec.home(), &poly, Some((home, e)))
                })
            }
        }
        .map(Arc::new);
        c.lock()
            .expect("field cache")
            .insert(spec.clone(), f.clone());
        f
    }

    /// The field with monic minimal polynomial `poly` (lowest coefficient first), its numbers
    /// stored in Q(ζₙ).
    fn build(n: u32, poly: &[i128], emb: Option<(Arc<KField>, Embedding)>) -> Option<KField> {
        let phi = poly.len() - 1;
        let mut high = Vec::new();
        if phi > 1 {
            // x^k = −Σ_{j<k} p_j x^j
            let mut cur: Vec<i128> = poly[..phi].iter().map(|&p| -p).collect();
            high.push(cur.clone());
            for _ in 1..phi.saturating_sub(1) {
                // multiply by x: shift up, fold the top coefficient back
                let top = cur[phi - 1];
                let mut next = vec![0i128; phi];
                next[1..phi].copy_from_slice(&cur[..(phi - 1)]);
                for j in 0..phi {
                    next[j] = next[j].checked_sub(top.checked_mul(poly[j])?)?;
                }
                cur = next;
                high.push(cur.clone());
            }
        }
        Some(KField {
            n: n.max(1),
            phi,
            high,
            emb,
            lifts: Mutex::new(HashMap::new()),
        })
    }

    pub fn n(&self) -> u32 {
        self.n
    }
    /// Degree of the field (numerators per number).
    pub fn phi(&self) -> usize {
        self.phi
    }

    /// acc += a·b in the field (a, b, acc: φ numerators each).
    #[inline]
    pub fn mul_acc<I: KInt>(&self, acc: &mut [I], a: &[I], b: &[I]) -> Option<()> {
        I::mul_acc(self, acc, a, b)
    }

    /// Multiplication by the fixed number a (numerators) as a k×k integer matrix: column j is
    /// a·x^j reduced, so a·b = M·b with no reduction step (k² products instead of the k²
    /// of the convolution plus (k−1)·k of the reduction). Worth it where one number multiplies
    /// many (a scalar times a vector, a table entry applied to every site).
    pub fn mul_matrix<I: KInt>(&self, a: &[I]) -> Option<MulMatrix<I>> {
        let k = self.phi;
        if a[1..].iter().all(I::is_zero) {
            return Some(MulMatrix::Scalar(a[0].clone()));
        }
        let mut m = vec![I::zero(); k * k];
        let mut e = vec![I::zero(); k];
        let mut col = vec![I::zero(); k];
        for j in 0..k {
            e.iter_mut().for_each(|x| *x = I::zero());
            e[j] = I::from_i128(1);
            col.iter_mut().for_each(|x| *x = I::zero());
            self.mul_acc(&mut col, a, &e)?;
            for (i, c) in col.iter().enumerate() {
                m[i * k + j] = c.clone();
            }
        }
        let small = I::all_small(&m);
        Some(MulMatrix::Full { m, small })
    }

    /// acc += a·b for a given by its [`MulMatrix`].
    #[inline]
    pub fn mul_acc_by<I: KInt>(&self, acc: &mut [I], a: &MulMatrix<I>, b: &[I]) -> Option<()> {
        match a {
            MulMatrix::Scalar(s) => {
                if s.is_zero() {
                    return Some(());
                }
                for (x, y) in acc.iter_mut().zip(b) {
                    if !y.is_zero() {
                        *x = x.add(&s.mul(y)?)?;
                    }
                }
                Some(())
            }
            MulMatrix::Full { m, small } => I::mat_acc(acc, m, *small, b),
        }
    }

    /// The same on big integers (never overflows).
    fn mul_acc_big(&self, acc: &mut [BigInt], a: &[BigInt], b: &[BigInt]) {
        let phi = self.phi;
        let mut conv: Vec<BigInt> = vec![Zero::zero(); 2 * phi - 1];
        for (i, x) in a.iter().enumerate() {
            if Zero::is_zero(x) {
                continue;
            }
            for (j, y) in b.iter().enumerate() {
                if !Zero::is_zero(y) {
                    conv[i + j] += x * y;
                }
            }
        }
        for (x, c) in acc.iter_mut().zip(conv.iter()) {
            *x += c;
        }
        for (j, c) in conv[phi..].iter().enumerate() {
            if Zero::is_zero(c) {
                continue;
            }
            for (x, &r) in acc.iter_mut().zip(&self.high[j]) {
                if r != 0 {
                    *x += c * BigInt::from(r);
                }
            }
        }
    }

    #[inline]
    fn mul_acc_i128(&self, acc: &mut [i128], a: &[i128], b: &[i128]) -> Option<()> {
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
            return self.mul_acc_i128(acc, b, a);
        }
        // a product buffer no longer than needed (zeroing 64 entries for a degree-2 field cost
        // more than the product itself)
        match 2 * phi - 1 {
            0..=3 => self.mul_acc_buf::<3>(acc, a, b),
            4..=7 => self.mul_acc_buf::<7>(acc, a, b),
            8..=15 => self.mul_acc_buf::<15>(acc, a, b),
            16..=31 => self.mul_acc_buf::<31>(acc, a, b),
            32..=63 => self.mul_acc_buf::<63>(acc, a, b),
            _ => self.mul_acc_long(acc, a, b),
        }
    }

    /// acc += a·b with a product buffer of N ≥ 2φ − 1 entries.
    #[inline]
    fn mul_acc_buf<const N: usize>(&self, acc: &mut [i128], a: &[i128], b: &[i128]) -> Option<()> {
        let phi = self.phi;
        let mut buf = [0i128; N];
        let conv = &mut buf[..2 * phi - 1];
        // Parts below 2⁶⁰ (the usual case): each product is one 64×64 → 128-bit multiply and
        // below 2¹²⁰, and at most 63 of them sum below 2¹²⁶, so no step can overflow.
        if a.iter().chain(b).all(|x| x.unsigned_abs() < SMALL) {
            for (i, &x) in a.iter().enumerate() {
                if x == 0 {
                    continue;
                }
                let x = x as i64 as i128;
                for (c, &y) in conv[i..].iter_mut().zip(b) {
                    *c += x * (y as i64 as i128);
                }
            }
        } else {
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

    /// The numerators and the denominator of `c` in this field (`None`: not in the field, or
    /// too large for machine integers).
    pub fn elem(&self, c: &Cyclo) -> Option<(Vec<i128>, i128)> {
        let mut nums = vec![0i128; self.phi];
        let den = self.elem_of(c, &mut nums)?;
        Some((nums, den))
    }

    /// Writes the numerators of `c` into `out` (k of them); returns the denominator. `None`
    /// when `c` is not in the field or (on i128) a number outgrows 128 bits.
    pub fn elem_of<I: KInt>(&self, c: &Cyclo, out: &mut [I]) -> Option<I> {
        match &self.emb {
            None => I::cyc_elem_into(self, c, out),
            Some((home, e)) => {
                let mut x = vec![I::zero(); home.phi];
                let den = I::cyc_elem_into(home, c, &mut x)?;
                e.coords(&x, &den, out)
            }
        }
    }

    /// The number nums/den of this field.
    pub fn cyclo_of<I: KInt>(&self, nums: &[I], den: &I) -> Cyclo {
        match &self.emb {
            None => I::cyc_cyclo(self, nums, den),
            Some((home, e)) => {
                let mut x = vec![I::zero(); home.phi];
                if e.expand(nums, &mut x).is_some() {
                    return I::cyc_cyclo(home, &x, den);
                }
                // 128 bits overflowed on the way back: the same on big integers
                let big: Vec<BigInt> = nums.iter().map(I::to_big).collect();
                let mut x = vec![<BigInt as Zero>::zero(); home.phi];
                e.expand(&big, &mut x)
                    .expect("big integers do not overflow");
                BigInt::cyc_cyclo(home, &x, &den.to_big())
            }
        }
    }

    /// The order n of the Q(ζₙ) this field's numbers are stored in as [`Cyclo`]s.
    pub fn home_order(&self) -> u32 {
        self.n
    }

    /// The degree of that Q(ζₙ).
    pub fn home_degree(&self) -> usize {
        self.emb.as_ref().map_or(self.phi, |(home, _)| home.phi)
    }

    /// The numerators of nums/den in the power basis of Q(ζₙ) (same denominator), written to
    /// `out` ([`Self::home_degree`] long); `None` on overflow.
    pub fn home_nums<I: KInt>(&self, nums: &[I], out: &mut [I]) -> Option<()> {
        match &self.emb {
            None => {
                out.clone_from_slice(nums);
                Some(())
            }
            Some((_, e)) => e.expand(nums, out),
        }
    }

    /// The number nums/den of Q(ζₙ) given by its numerators there ([`Self::home_nums`]).
    pub fn home_cyclo<I: KInt>(&self, nums: &[I], den: &I) -> Cyclo {
        match &self.emb {
            None => I::cyc_cyclo(self, nums, den),
            Some((home, _)) => I::cyc_cyclo(home, nums, den),
        }
    }

    /// a·b for numbers a = an/ad and b = bn/bd of the field, in lowest terms.
    pub fn mul<I: KInt>(&self, an: &[I], ad: &I, bn: &[I], bd: &I) -> Option<(Vec<I>, I)> {
        let mut out = vec![I::zero(); self.phi];
        self.mul_acc(&mut out, an, bn)?;
        Some(lowest_scalar(out, ad.mul(bd)?))
    }

    /// 1/a for a nonzero number a = an/ad of the field: a·x = 1 solved as a linear system (the
    /// columns of a's multiplication matrix are a·x^j), fraction-free, after dividing out the
    /// numerators' common factor g: (an/ad)⁻¹ = (ad/g)·(an/g)⁻¹. Where that outgrows 128 bits,
    /// the inverse is taken on exact numbers and brought back.
    pub fn inverse<I: KInt>(&self, an: &[I], ad: &I) -> Option<(Vec<I>, I)> {
        let k = self.phi;
        let g = an
            .iter()
            .filter(|x| !x.is_zero())
            .fold(I::zero(), |g, x| g.gcd(x));
        let g = if g.is_zero() { I::from_i128(1) } else { g };
        let prim: Vec<I> = an.iter().map(|x| x.div_exact(&g)).collect();
        let solved = (|| {
            let mut m = vec![vec![I::zero(); k]; k];
            let mut unit = vec![I::zero(); k];
            for j in 0..k {
                unit.iter_mut().for_each(|u| *u = I::zero());
                unit[j] = I::from_i128(1);
                let mut col = vec![I::zero(); k];
                self.mul_acc(&mut col, &prim, &unit)?;
                for (i, c) in col.into_iter().enumerate() {
                    m[i][j] = c;
                }
            }
            let mut e0 = vec![I::zero(); k];
            e0[0] = I::from_i128(1);
            let (xn, xd) = solve_fraction_free(m, &e0)?;
            let xn = xn.iter().map(|x| x.mul(ad)).collect::<Option<Vec<I>>>()?;
            Some(lowest_scalar(xn, xd.mul(&g)?))
        })();
        if solved.is_some() {
            return solved;
        }
        let inv = self.cyclo_of(an, ad).inv()?;
        let mut out = vec![I::zero(); k];
        let den = self.elem_of(&inv, &mut out)?;
        Some(lowest_scalar(out, den))
    }

    /// Writes the φ numerators of `c` (stored in a subfield Q(ζₘ) of this Q(ζₙ)) into `out`;
    /// returns the denominator.
    fn cyc_elem_into(&self, c: &Cyclo, out: &mut [i128]) -> Option<i128> {
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

    /// The number nums/den of this Q(ζₙ).
    fn cyc_cyclo(&self, nums: &[i128], den: i128) -> Cyclo {
        Cyclo::from_parts(self.n, from_integer_form(nums, den))
    }
}

/// A field number nums/den with the numerators' and the denominator's gcd divided out.
fn lowest_scalar<I: KInt>(mut nums: Vec<I>, den: I) -> (Vec<I>, I) {
    let g = gcd_of(std::iter::once(&den).chain(&nums));
    if g.is_one() || g.is_zero() {
        return (nums, den);
    }
    I::div_exact_all(&mut nums, &g);
    (nums, den.div_exact(&g))
}

/// gcd of the nonzero integers (0 when there are none), stopping once it reaches 1.
pub fn gcd_of<'a, I: KInt + 'a>(xs: impl IntoIterator<Item = &'a I>) -> I {
    let mut g = I::zero();
    for t in xs {
        if !t.is_zero() {
            g = g.gcd(t);
            if g.is_one() {
                break;
            }
        }
    }
    g
}

/// A vector of `len` entries of one field over one positive denominator.
#[derive(Clone, Debug)]
pub struct KVec<I = i128> {
    pub num: Vec<I>,
    pub den: I,
}

impl<I: KInt> KVec<I> {
    /// The zero vector of `len` entries of a field of degree φ.
    pub fn zero(len: usize, phi: usize) -> KVec<I> {
        KVec {
            num: vec![I::zero(); len * phi],
            den: I::from_i128(1),
        }
    }

    /// Entry `i` (φ numerators).
    #[inline]
    pub fn entry(&self, i: usize, phi: usize) -> &[I] {
        &self.num[i * phi..(i + 1) * phi]
    }

    pub fn is_zero(&self) -> bool {
        self.num.iter().all(I::is_zero)
    }

    /// From exact numbers, all in the field.
    pub fn from_cyclos(f: &KField, v: &[Cyclo]) -> Option<KVec<I>> {
        Self::from_iter(f, v.iter())
    }

    /// From exact numbers, all in the field, in order.
    pub fn from_iter<'a>(f: &KField, v: impl Iterator<Item = &'a Cyclo>) -> Option<KVec<I>> {
        let phi = f.phi;
        let mut num: Vec<I> = Vec::with_capacity(v.size_hint().0 * phi);
        let mut dens: Vec<I> = Vec::with_capacity(v.size_hint().0);
        let mut den = I::from_i128(1);
        for c in v {
            let at = num.len();
            num.resize(at + phi, I::zero());
            let d = f.elem_of(c, &mut num[at..])?;
            den = den.lcm(&d)?;
            dens.push(d);
        }
        for (chunk, d) in num.chunks_mut(phi).zip(&dens) {
            let s = den.div_exact(d);
            if !s.is_one() {
                for x in chunk {
                    *x = x.mul(&s)?;
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
                if c.iter().all(I::is_zero) {
                    Cyclo::zero()
                } else {
                    f.cyclo_of(c, &self.den)
                }
            })
            .collect()
    }

    /// Divide numerators and denominator by their gcd.
    pub fn lowest_terms(&mut self) {
        let g = gcd_of(std::iter::once(&self.den).chain(&self.num));
        if !g.is_one() && !g.is_zero() {
            I::div_exact_all(&mut self.num, &g);
            self.den = self.den.div_exact(&g);
        }
    }

    /// Σ aᵢbᵢ (no conjugation) as an exact number.
    pub fn dot(&self, other: &KVec<I>, f: &KField) -> Option<Cyclo> {
        let (n, d) = self.dot_in(other, f)?;
        Some(f.cyclo_of(&n, &d))
    }

    /// Σ aᵢbᵢ as a number of the field (numerators, denominator), in lowest terms: the sum
    /// shares a large factor with the product of denominators (half its bits in Gram–Schmidt
    /// of the chiral icosahedral model), and dividing it out here keeps the next product
    /// within 128 bits.
    pub fn dot_in(&self, other: &KVec<I>, f: &KField) -> Option<(Vec<I>, I)> {
        let phi = f.phi;
        let mut acc = vec![I::zero(); phi];
        for (a, b) in self.num.chunks(phi).zip(other.num.chunks(phi)) {
            if a.iter().all(I::is_zero) || b.iter().all(I::is_zero) {
                continue;
            }
            f.mul_acc(&mut acc, a, b)?;
        }
        Some(lowest_scalar(acc, self.den.mul(&other.den)?))
    }

    /// self − s·other for a field number s.
    pub fn sub_scaled(&mut self, s: &Cyclo, other: &KVec<I>, f: &KField) -> Option<()> {
        let mut sn = vec![I::zero(); f.phi];
        let sd = f.elem_of(s, &mut sn)?;
        self.sub_scaled_in(&sn, &sd, other, f)
    }

    /// self − s·other for s = sn/sd of the field.
    pub fn sub_scaled_in(&mut self, sn: &[I], sd: &I, other: &KVec<I>, f: &KField) -> Option<()> {
        let phi = f.phi;
        let od = sd.mul(&other.den)?;
        let den = self.den.lcm(&od)?;
        let ks = den.div_exact(&self.den);
        let ko = den.div_exact(&od);
        let mut prod = vec![I::zero(); phi];
        // s multiplies every entry: as a matrix once
        let s = f.mul_matrix(sn)?;
        for (i, o) in other.num.chunks(phi).enumerate() {
            let mine = &mut self.num[i * phi..(i + 1) * phi];
            if o.iter().all(I::is_zero) {
                if !ks.is_one() {
                    for x in mine {
                        *x = x.mul(&ks)?;
                    }
                }
                continue;
            }
            prod.iter_mut().for_each(|x| *x = I::zero());
            f.mul_acc_by(&mut prod, &s, o)?;
            for (x, p) in mine.iter_mut().zip(&prod) {
                *x = x.mul(&ks)?.sub(&p.mul(&ko)?)?;
            }
        }
        self.den = den;
        self.lowest_terms();
        Some(())
    }
}

/// The integers vectors are made of: i128 with every step checked (`None` on overflow), or
/// big integers (never `None`).
pub trait KInt: Clone + std::fmt::Debug + PartialEq + Send + Sync {
    fn zero() -> Self;
    fn from_i128(x: i128) -> Self;
    fn is_zero(&self) -> bool;
    fn is_one(&self) -> bool;
    fn add(&self, o: &Self) -> Option<Self>;
    fn sub(&self, o: &Self) -> Option<Self>;
    fn mul(&self, o: &Self) -> Option<Self>;
    /// gcd(|a|, |b|).
    fn gcd(&self, o: &Self) -> Self;
    /// a / b where b divides a.
    fn div_exact(&self, o: &Self) -> Self;
    /// lcm of two positive integers.
    fn lcm(&self, o: &Self) -> Option<Self> {
        if self == o || o.is_one() {
            return Some(self.clone());
        }
        self.div_exact(&self.gcd(o)).mul(o)
    }
    fn is_negative(&self) -> bool;
    fn to_big(&self) -> BigInt;
    /// acc += a·b in the field.
    fn mul_acc(f: &KField, acc: &mut [Self], a: &[Self], b: &[Self]) -> Option<()>;
    /// Writes the numerators of `c` in the cyclotomic field `f` into `out`; returns the
    /// denominator.
    fn cyc_elem_into(f: &KField, c: &Cyclo, out: &mut [Self]) -> Option<Self>;
    /// The number nums/den of the cyclotomic field `f`.
    fn cyc_cyclo(f: &KField, nums: &[Self], den: &Self) -> Cyclo;
    /// out += Σⱼ y[j]·rows[j] (rows of machine integers).
    fn combine_rows(out: &mut [Self], y: &[Self], rows: &[Vec<i128>]) -> Option<()> {
        for (yj, row) in y.iter().zip(rows) {
            if yj.is_zero() {
                continue;
            }
            for (o, &p) in out.iter_mut().zip(row) {
                if p != 0 {
                    *o = o.add(&yj.mul(&Self::from_i128(p))?)?;
                }
            }
        }
        Some(())
    }
    /// The number as a 64-bit integer, if it fits.
    fn to_i64(&self) -> Option<i64> {
        self.to_big().try_into().ok()
    }
    /// x / g for every x, each a multiple of g > 0.
    fn div_exact_all(xs: &mut [Self], g: &Self) {
        for x in xs {
            *x = x.div_exact(g);
        }
    }
    /// Every entry below 2⁶⁰ in size (machine integers' fast path; never for big integers).
    fn all_small(_xs: &[Self]) -> bool {
        false
    }
    /// acc += M·b for a row-major k×k matrix M (k = acc's length).
    fn mat_acc(acc: &mut [Self], m: &[Self], _small: bool, b: &[Self]) -> Option<()> {
        let k = acc.len();
        for (x, row) in acc.iter_mut().zip(m.chunks(k)) {
            for (r, y) in row.iter().zip(b) {
                if !r.is_zero() && !y.is_zero() {
                    *x = x.add(&r.mul(y)?)?;
                }
            }
        }
        Some(())
    }
}

impl KInt for i128 {
    fn zero() -> Self {
        0
    }
    fn from_i128(x: i128) -> Self {
        x
    }
    #[inline]
    fn is_zero(&self) -> bool {
        *self == 0
    }
    fn is_one(&self) -> bool {
        *self == 1
    }
    fn add(&self, o: &Self) -> Option<Self> {
        self.checked_add(*o)
    }
    fn sub(&self, o: &Self) -> Option<Self> {
        self.checked_sub(*o)
    }
    fn mul(&self, o: &Self) -> Option<Self> {
        self.checked_mul(*o)
    }
    #[inline]
    fn gcd(&self, o: &Self) -> Self {
        let (a, b) = (self.unsigned_abs(), o.unsigned_abs());
        // both below 2⁶⁴ (the usual case): the 64-bit gcd is about twice as fast
        if (a | b) >> 64 == 0 {
            return gcd_u64(a as u64, b as u64) as i128;
        }
        gcd_u128(a, b) as i128
    }
    #[inline]
    fn div_exact(&self, o: &Self) -> Self {
        // 128-bit division is a library call; 64-bit is one instruction
        match (i64::try_from(*self), i64::try_from(*o)) {
            (Ok(a), Ok(b)) if b != -1 => (a / b) as i128,
            _ => self / o,
        }
    }
    #[inline]
    fn mul_acc(f: &KField, acc: &mut [Self], a: &[Self], b: &[Self]) -> Option<()> {
        f.mul_acc_i128(acc, a, b)
    }
    fn is_negative(&self) -> bool {
        *self < 0
    }
    fn to_big(&self) -> BigInt {
        BigInt::from(*self)
    }
    fn cyc_elem_into(f: &KField, c: &Cyclo, out: &mut [Self]) -> Option<Self> {
        f.cyc_elem_into(c, out)
    }
    fn cyc_cyclo(f: &KField, nums: &[Self], den: &Self) -> Cyclo {
        f.cyc_cyclo(nums, *den)
    }
    fn all_small(xs: &[Self]) -> bool {
        xs.iter().all(|x| x.unsigned_abs() < SMALL)
    }
    fn to_i64(&self) -> Option<i64> {
        i64::try_from(*self).ok()
    }
    fn combine_rows(out: &mut [Self], y: &[Self], rows: &[Vec<i128>]) -> Option<()> {
        // parts below 2⁶⁰: 64×64 → 128-bit products, at most 64 of them below 2¹²⁶ in all
        let small = y.len() <= 64
            && y.iter().all(|v| v.unsigned_abs() < SMALL)
            && rows.iter().flatten().all(|p| p.unsigned_abs() < SMALL)
            && out.iter().all(|v| v.unsigned_abs() < SMALL);
        if !small {
            for (&yj, row) in y.iter().zip(rows) {
                if yj == 0 {
                    continue;
                }
                for (o, &p) in out.iter_mut().zip(row) {
                    if p != 0 {
                        *o = o.checked_add(yj.checked_mul(p)?)?;
                    }
                }
            }
            return Some(());
        }
        for (&yj, row) in y.iter().zip(rows) {
            if yj == 0 {
                continue;
            }
            let yj = yj as i64 as i128;
            for (o, &p) in out.iter_mut().zip(row) {
                *o += yj * (p as i64 as i128);
            }
        }
        Some(())
    }
    fn div_exact_all(xs: &mut [Self], g: &Self) {
        // Exact division as a multiplication (Granlund & Montgomery, PLDI 1994, §9): with
        // g = 2ˢ·u, u odd, x/g = (x >> s)·u⁻¹ mod 2⁶⁴ when g divides x and the quotient fits
        // 64 bits; a division instruction costs far more than a multiply.
        let small =
            *g > 0 && *g <= i64::MAX as i128 && xs.iter().all(|x| i64::try_from(*x).is_ok());
        if !small {
            for x in xs {
                *x /= *g;
            }
            return;
        }
        let s = g.trailing_zeros();
        let u = (*g as u64) >> s;
        // Newton's iteration for u⁻¹ mod 2⁶⁴: each step doubles the correct low bits (u·u ≡ 1
        // mod 8 for odd u gives 3 bits to start)
        let mut inv = u;
        for _ in 0..5 {
            inv = inv.wrapping_mul(2u64.wrapping_sub(u.wrapping_mul(inv)));
        }
        for x in xs {
            let shifted = (*x as i64) >> s;
            *x = (shifted as u64).wrapping_mul(inv) as i64 as i128;
        }
    }
    #[inline]
    fn mat_acc(acc: &mut [Self], m: &[Self], small: bool, b: &[Self]) -> Option<()> {
        let k = acc.len();
        // Entries of M and b below 2⁶⁰: each product is one 64×64 → 128-bit multiply below
        // 2¹²⁰, and a row of at most 64 of them sums below 2¹²⁶.
        if small && k <= 64 && b.iter().all(|y| y.unsigned_abs() < SMALL) {
            for (x, row) in acc.iter_mut().zip(m.chunks(k)) {
                let mut t = 0i128;
                for (&r, &y) in row.iter().zip(b) {
                    t += (r as i64 as i128) * (y as i64 as i128);
                }
                *x = x.checked_add(t)?;
            }
            return Some(());
        }
        for (x, row) in acc.iter_mut().zip(m.chunks(k)) {
            for (&r, &y) in row.iter().zip(b) {
                if r != 0 && y != 0 {
                    *x = x.checked_add(r.checked_mul(y)?)?;
                }
            }
        }
        Some(())
    }
}

impl KInt for BigInt {
    fn zero() -> Self {
        Zero::zero()
    }
    fn from_i128(x: i128) -> Self {
        BigInt::from(x)
    }
    fn is_zero(&self) -> bool {
        Zero::is_zero(self)
    }
    fn is_one(&self) -> bool {
        One::is_one(self)
    }
    fn add(&self, o: &Self) -> Option<Self> {
        Some(self + o)
    }
    fn sub(&self, o: &Self) -> Option<Self> {
        Some(self - o)
    }
    fn mul(&self, o: &Self) -> Option<Self> {
        Some(self * o)
    }
    fn gcd(&self, o: &Self) -> Self {
        num_integer::Integer::gcd(self, o)
    }
    fn div_exact(&self, o: &Self) -> Self {
        self / o
    }
    fn mul_acc(f: &KField, acc: &mut [Self], a: &[Self], b: &[Self]) -> Option<()> {
        f.mul_acc_big(acc, a, b);
        Some(())
    }
    fn is_negative(&self) -> bool {
        Signed::is_negative(self)
    }
    fn to_big(&self) -> BigInt {
        self.clone()
    }
    fn cyc_elem_into(f: &KField, c: &Cyclo, out: &mut [Self]) -> Option<Self> {
        if c.field_order() > 1 && f.n % c.field_order() != 0 {
            return None;
        }
        let coeffs = c.lift(f.n.max(1));
        let mut den = BigInt::from(1);
        for q in &coeffs {
            den = num_integer::Integer::lcm(&den, q.denom());
        }
        for (x, q) in out.iter_mut().zip(&coeffs) {
            *x = q.numer() * (&den / q.denom());
        }
        Some(den)
    }
    fn cyc_cyclo(f: &KField, nums: &[Self], den: &Self) -> Cyclo {
        let dense = nums
            .iter()
            .map(|x| BigRational::new(x.clone(), den.clone()))
            .collect();
        Cyclo::from_dense(dense, f.n)
    }
}

/// A family of exact numbers held over one common denominator: irrep matrices, operation
/// images of a basis. `num` holds φ numerators per number in the caller's order.
#[derive(Clone, Debug)]
pub struct KTable<I = i128> {
    pub num: Vec<I>,
    pub den: I,
}

/// Multiplication by one number of a field ([`KField::mul_matrix`]).
#[derive(Debug, Clone)]
pub enum MulMatrix<I = i128> {
    /// A rational number: its numerator times each coordinate.
    Scalar(I),
    /// Row-major k×k matrix; `small`: every entry below 2⁶⁰ in size.
    Full { m: Vec<I>, small: bool },
}

impl<I: KInt> KTable<I> {
    /// From numbers in the field, in order.
    pub fn from_cyclos<'a>(f: &KField, v: impl Iterator<Item = &'a Cyclo>) -> Option<KTable<I>> {
        let v = KVec::from_iter(f, v)?;
        Some(KTable {
            num: v.num,
            den: v.den,
        })
    }
    /// Number `i` (φ numerators over `den`).
    #[inline]
    pub fn at(&self, i: usize, phi: usize) -> &[I] {
        &self.num[i * phi..(i + 1) * phi]
    }
}
