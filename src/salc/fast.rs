//! The SALC engine's arithmetic on machine integers: the basis images and an irrep's matrices
//! are put over one field Q(ζₙ) and one denominator each ([`KTable`]), and the vectors the
//! engine builds are [`KVec`]s. The steps are those of `build` (projection of one site's
//! members, Gram–Schmidt, partners from d operations), so the results are the same numbers;
//! generic over the integers ([`KInt`]): on i128 any overflow returns `None` and `build` redoes
//! the irrep on big integers.

use super::irreps::{Matrix, RealIrrep};
use crate::basis::Basis;
use crate::exact::{Cyclo, CycloKey, FieldSpec, KField, KInt, KTable, KVec, MulMatrix, QuickMap};
use crate::group::PointGroup;
use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};

/// Largest field degree φ(n) worth the integer form (every molecular table is far below).
pub(super) const MAX_PHI: usize = 24;

/// Distinct numbers per operation looked up without hashing.
const RECENT: usize = 12;

/// The (k, index of the number) pairs of R_op·e_m for every operation and member, held in one
/// flat list (one allocation per basis, not one per image).
pub(super) struct ImageIndex {
    pairs: Vec<(usize, usize)>,
    /// `start[op·dim + m]` … `start[op·dim + m + 1]`: the pairs of R_op·e_m.
    start: Vec<usize>,
    dim: usize,
}

impl ImageIndex {
    /// The pairs of R_op·e_m.
    #[inline]
    fn col(&self, op: usize, m: usize) -> &[(usize, usize)] {
        let at = op * self.dim + m;
        &self.pairs[self.start[at]..self.start[at + 1]]
    }

    /// The images R_op·e_m of every member m, in order.
    fn op(&self, op: usize) -> impl Iterator<Item = &[(usize, usize)]> {
        (0..self.dim).map(move |m| self.col(op, m))
    }

    fn ops(&self) -> usize {
        (self.start.len() - 1).checked_div(self.dim).unwrap_or(0)
    }
}

/// A basis's operation images over one field: `cols.col(op, m)` lists (k, index into `table`).
pub(super) struct FastBasis<I = i128> {
    pub f: Arc<KField>,
    table: KTable<I>,
    /// Each distinct number of `table` as a multiplication matrix.
    mats: Vec<MulMatrix<I>>,
    cols: Arc<ImageIndex>,
    dim: usize,
}

/// A basis's operation images as indices into their distinct numbers, worked out once per
/// basis and shared by its [`FastBasis`] over each field tried: the images repeat a few numbers
/// (an operation's matrix entries, ±1) many times, and each is converted once.
pub(super) struct Images<'a> {
    entries: Vec<&'a Cyclo>,
    cols: Arc<ImageIndex>,
    dim: usize,
}

impl<'a> Images<'a> {
    pub fn new(b: &'a Basis) -> Images<'a> {
        let mut entries: Vec<&Cyclo> = Vec::new();
        let mut seen: QuickMap<CycloKey, usize> = QuickMap::default();
        // one operation's images hold few distinct numbers (a Cartesian basis: its 3×3 matrix
        // entries): those are looked up in a short list first, the map only when new
        let mut recent: Vec<(&Cyclo, usize)> = Vec::with_capacity(RECENT);
        let dim = b.dim();
        let mut pairs = Vec::with_capacity(b.images.len() * dim);
        let mut start = Vec::with_capacity(b.images.len() * dim + 1);
        start.push(0);
        for op in &b.images {
            recent.clear();
            for col in op {
                for (k, c) in col {
                    let i = match recent.iter().find(|(x, _)| x.same_form(c)) {
                        Some(&(_, i)) => i,
                        None => {
                            let i = distinct_index(&mut seen, &mut entries, c);
                            if recent.len() < RECENT {
                                recent.push((c, i));
                            }
                            i
                        }
                    };
                    pairs.push((*k, i));
                }
                start.push(pairs.len());
            }
        }
        Images {
            entries,
            cols: Arc::new(ImageIndex { pairs, start, dim }),
            dim,
        }
    }
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
    pub fn new(im: &Images, spec: &FieldSpec) -> Option<FastBasis<I>> {
        let f = KField::of(spec)?;
        if f.phi() > MAX_PHI {
            return None;
        }
        let table = KTable::from_cyclos(&f, im.entries.iter().copied())?;
        let phi = f.phi();
        let mats = (0..im.entries.len())
            .map(|i| f.mul_matrix(table.at(i, phi)))
            .collect::<Option<_>>()?;
        Some(FastBasis {
            f,
            table,
            mats,
            cols: im.cols.clone(),
            dim: im.dim,
        })
    }

    /// R_op·v over the denominator (table denominator)·(v's), not brought to lowest terms.
    fn apply_unreduced(&self, op: usize, v: &KVec<I>) -> Option<KVec<I>> {
        let phi = self.f.phi();
        let mut out = KVec::zero(self.dim, phi);
        for (m, col) in self.cols.op(op).enumerate() {
            let x = v.entry(m, phi);
            if x.iter().all(I::is_zero) {
                continue;
            }
            for &(k, i) in col {
                self.f
                    .mul_acc_by(&mut out.num[k * phi..(k + 1) * phi], &self.mats[i], x)?;
            }
        }
        out.den = self.table.den.mul(&v.den)?;
        Some(out)
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
        for o in 0..fb.cols.ops() {
            for (k, acc) in out.iter_mut().enumerate() {
                let f = self.at(inv[o], k, 0, phi);
                if f.iter().all(I::is_zero) {
                    continue;
                }
                for &(t, i) in fb.cols.col(o, m) {
                    fb.f.mul_acc_by(&mut acc.num[t * phi..(t + 1) * phi], &fb.mats[i], f)?;
                }
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
        for o in 0..fb.cols.ops() {
            let f = self.at(inv[o], 0, 0, phi);
            if f.iter().all(I::is_zero) {
                continue;
            }
            for (m, col) in fb.cols.op(o).enumerate() {
                let x = v.entry(m, phi);
                if x.iter().all(I::is_zero) {
                    continue;
                }
                fx.iter_mut().for_each(|a| *a = I::zero());
                fb.f.mul_acc(&mut fx, f, x)?;
                for &(k, i) in col {
                    fb.f.mul_acc_by(&mut out.num[k * phi..(k + 1) * phi], &fb.mats[i], &fx)?;
                }
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
