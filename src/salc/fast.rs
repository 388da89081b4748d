//! The SALC engine's arithmetic on machine integers: the basis images and an irrep's matrices
//! are put over one field Q(ζₙ) and one denominator each ([`KTable`]), and the vectors the
//! engine builds are [`KVec`]s. The steps are those of `build` (projection of one site's
//! members, Gram–Schmidt, partners from d operations), so the results are the same numbers;
//! generic over the integers ([`KInt`]): on i128 any overflow returns `None` and `build` redoes
//! the irrep on big integers.

use super::irreps::{Matrix, RealIrrep};
use crate::basis::Images;
use crate::exact::{Cyclo, CycloKey, FieldSpec, KField, KInt, KTable, KVec, MulMatrix, QuickMap};
use crate::group::PointGroup;
use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};

/// Largest field degree φ(n) worth the integer form (every molecular table is far below).
pub(super) const MAX_PHI: usize = 24;

/// A basis's operation images over one field: the terms of `images.raw(op, m)` index the
/// distinct numbers of `table` (and `mats`).
pub(super) struct FastBasis<I = i128> {
    pub f: Arc<KField>,
    table: KTable<I>,
    /// Each distinct number of `table` as a multiplication matrix.
    mats: Vec<MulMatrix<I>>,
    images: Arc<Images>,
    dim: usize,
}

/// The index of `c` among the distinct numbers `entries` (added when new).
fn distinct_index<'a>(
    seen: &mut QuickMap<CycloKey, usize>,
    entries: &mut Vec<&'a Cyclo>,
    c: &'a Cyclo,
) -> usize {
    *seen.entry(c.key()).or_insert_with(|| {
        entries.push(c);
        entries.len() - 1
    })
}

/// The smallest storage field holding every number (lcm of the fields), if small enough.
pub(super) fn common_field<'a>(nums: impl Iterator<Item = &'a Cyclo>) -> Option<u32> {
    nums.map(|c| c.field_order()).try_fold(1, field_lcm)
}

/// The smallest field Q(ζ_l) holding Q(ζ_a) and Q(ζ_b), if small enough to be worth it.
pub(super) fn field_lcm(a: u32, b: u32) -> Option<u32> {
    let (a, b) = (a.max(1), b.max(1));
    if a % b == 0 {
        return Some(a);
    }
    let (mut x, mut y) = (a, b);
    while y != 0 {
        (x, y) = (y, x % y);
    }
    Some(a.checked_mul(b / x)?).filter(|&l| l <= 10_000)
}

impl<I: KInt> FastBasis<I> {
    /// The basis over a field holding every image entry (`None` if one is not in it).
    pub fn new(images: &Arc<Images>, spec: &FieldSpec) -> Option<FastBasis<I>> {
        let f = KField::of(spec)?;
        if f.phi() > MAX_PHI {
            return None;
        }
        let table = KTable::from_cyclos(&f, images.numbers().iter())?;
        let phi = f.phi();
        let mats = (0..images.numbers().len())
            .map(|i| f.mul_matrix(table.at(i, phi)))
            .collect::<Option<_>>()?;
        Some(FastBasis {
            f,
            table,
            mats,
            images: images.clone(),
            dim: images.dim(),
        })
    }

    /// R_op·v over the denominator (table denominator)·(v's), not brought to lowest terms.
    fn apply_unreduced(&self, op: usize, v: &KVec<I>) -> Option<KVec<I>> {
        let phi = self.f.phi();
        let mut out = KVec::zero(self.dim, phi);
        for m in 0..self.dim {
            let x = v.entry(m, phi);
            if x.iter().all(I::is_zero) {
                continue;
            }
            self.add_image(&mut out.num, op, m, x)?;
        }
        out.den = self.table.den.mul(&v.den)?;
        Some(out)
    }

    /// acc += x·R_op·e_m for a field number x (numerators; the table's denominator is the
    /// caller's to apply).
    #[inline]
    fn add_image(&self, acc: &mut [I], op: usize, m: usize, x: &[I]) -> Option<()> {
        let phi = self.f.phi();
        for &(k, i) in self.images.raw(op, m) {
            let k = k as usize;
            self.f
                .mul_acc_by(&mut acc[k * phi..(k + 1) * phi], &self.mats[i as usize], x)?;
        }
        Some(())
    }
}

/// An irrep's matrices over one field: entry (op, i, j) at op·d² + i·d + j; and the inverse
/// matrix of its partner recipe (`build::PartnerRecipe`).
pub(super) struct FastIrrep<I = i128> {
    table: KTable<I>,
    d: usize,
    pub minv: KTable<I>,
    /// Each entry of `minv` as a multiplication matrix.
    minv_mats: Vec<MulMatrix<I>>,
}

impl FastIrrep<i128> {
    /// The irrep over the field `spec`, converted once per process (`None`: a number is not in
    /// that field).
    pub fn cached(
        g: &PointGroup,
        ir: &RealIrrep,
        minv: &Matrix,
        spec: &FieldSpec,
    ) -> Option<Arc<FastIrrep<i128>>> {
        type Key = (String, usize, FieldSpec);
        type Cache = Mutex<HashMap<Key, Option<Arc<FastIrrep<i128>>>>>;
        static C: OnceLock<Cache> = OnceLock::new();
        let c = C.get_or_init(|| Mutex::new(HashMap::new()));
        let key = (g.name().to_string(), ir.row, spec.clone());
        if let Some(v) = c.lock().expect("irrep table cache").get(&key) {
            return v.clone();
        }
        let v = KField::of(spec)
            .and_then(|f| FastIrrep::new(&f, ir, minv))
            .map(Arc::new);
        c.lock().expect("irrep table cache").insert(key, v.clone());
        v
    }
}

impl<I: KInt> FastIrrep<I> {
    pub fn new(f: &KField, ir: &RealIrrep, minv: &Matrix) -> Option<FastIrrep<I>> {
        // the matrices repeat few numbers: each distinct one is converted once
        let mut entries: Vec<&Cyclo> = Vec::new();
        let mut seen: QuickMap<CycloKey, usize> = QuickMap::default();
        let index: Vec<usize> = ir
            .mats
            .iter()
            .flatten()
            .flatten()
            .map(|c| distinct_index(&mut seen, &mut entries, c))
            .collect();
        let distinct = KTable::from_cyclos(f, entries.into_iter())?;
        let phi = f.phi();
        let mut num = Vec::with_capacity(index.len() * phi);
        for &i in &index {
            num.extend_from_slice(distinct.at(i, phi));
        }
        let table = KTable {
            num,
            den: distinct.den,
        };
        let minv = KTable::from_cyclos(f, minv.iter().flatten())?;
        let minv_mats = (0..ir.dim * ir.dim)
            .map(|i| f.mul_matrix(minv.at(i, phi)))
            .collect::<Option<_>>()?;
        Some(FastIrrep {
            table,
            d: ir.dim,
            minv,
            minv_mats,
        })
    }
    #[inline]
    fn at(&self, op: usize, i: usize, j: usize, phi: usize) -> &[I] {
        self.table.at(op * self.d * self.d + i * self.d + j, phi)
    }

    /// P_1k e_m for k = 1 … d (without d/h), as in `project::partner_one_images`.
    pub fn partner_one_images(
        &self,
        fb: &FastBasis<I>,
        inv: &[usize],
        m: usize,
    ) -> Option<Vec<KVec<I>>> {
        let phi = fb.f.phi();
        let mut out = vec![KVec::zero(fb.dim, phi); self.d];
        for o in 0..fb.images.ops() {
            for (k, acc) in out.iter_mut().enumerate() {
                let f = self.at(inv[o], k, 0, phi);
                if f.iter().all(I::is_zero) {
                    continue;
                }
                fb.add_image(&mut acc.num, o, m, f)?;
            }
        }
        let den = self.table.den.mul(&fb.table.den)?;
        for v in &mut out {
            v.den = den.clone();
            v.lowest_terms();
        }
        Some(out)
    }

    /// P_11 v (without d/h), as in `project::transfer(…, 0, 0, v)`.
    pub fn transfer_11(&self, fb: &FastBasis<I>, inv: &[usize], v: &KVec<I>) -> Option<KVec<I>> {
        let phi = fb.f.phi();
        let mut out = KVec::zero(fb.dim, phi);
        let mut fx = vec![I::zero(); phi];
        for o in 0..fb.images.ops() {
            let f = self.at(inv[o], 0, 0, phi);
            if f.iter().all(I::is_zero) {
                continue;
            }
            for m in 0..fb.dim {
                let x = v.entry(m, phi);
                if x.iter().all(I::is_zero) {
                    continue;
                }
                fx.iter_mut().for_each(|a| *a = I::zero());
                fb.f.mul_acc(&mut fx, f, x)?;
                fb.add_image(&mut out.num, o, m, &fx)?;
            }
        }
        out.den = self.table.den.mul(&fb.table.den)?.mul(&v.den)?;
        out.lowest_terms();
        Some(out)
    }
}

/// sᵢ = Σ_k minv[i][k]·R_k·s₁ over the field (see `build::PartnerRecipe`).
pub(super) fn partners<I: KInt>(
    fb: &FastBasis<I>,
    ops: &[usize],
    fi: &FastIrrep<I>,
    s1: &KVec<I>,
) -> Option<Vec<KVec<I>>> {
    let minv = &fi.minv;
    let d = ops.len();
    if d == 1 {
        return Some(vec![s1.clone()]);
    }
    let phi = fb.f.phi();
    // the images share one denominator (the table's times s₁'s): only the results are
    // brought to lowest terms
    let images: Vec<KVec<I>> = ops
        .iter()
        .map(|&o| fb.apply_unreduced(o, s1))
        .collect::<Option<_>>()?;
    let den = fb.table.den.mul(&s1.den)?;
    let mut out = Vec::with_capacity(d);
    for i in 0..d {
        let mut v = KVec::zero(fb.dim, phi);
        for (k, img) in images.iter().enumerate() {
            if minv.at(i * d + k, phi).iter().all(I::is_zero) {
                continue;
            }
            let f = &fi.minv_mats[i * d + k];
            for (acc, x) in v.num.chunks_mut(phi).zip(img.num.chunks(phi)) {
                if x.iter().all(I::is_zero) {
                    continue;
                }
                fb.f.mul_acc_by(acc, f, x)?;
            }
        }
        v.den = minv.den.mul(&den)?;
        v.lowest_terms();
        out.push(v);
    }
    Some(out)
}

/// Σ vᵢ² on integers over the vector's own field: machine integers, or big integers where
/// those overflow (`None`: fields too big; the caller then uses Cyclo arithmetic).
pub(super) fn self_dot(v: &[Cyclo]) -> Option<Cyclo> {
    let f = KField::get(common_field(v.iter())?);
    if f.phi() > MAX_PHI {
        return None;
    }
    if let Some(d) = KVec::<i128>::from_cyclos(&f, v).and_then(|k| k.dot(&k, &f)) {
        return Some(d);
    }
    let k = KVec::<num_bigint::BigInt>::from_cyclos(&f, v)?;
    k.dot(&k, &f)
}
