//! Exact matrix products for building irrep matrices, on machine integers over the smallest
//! field holding the numbers (see `exact::subfield`): an Ih irrep's 120 matrices are products of
//! two generators' matrices, 15,000 number products for H, which on [`Cyclo`] numbers cost more
//! than all SALC work after them. Each matrix is held as integer numerators over one
//! denominator; `None` (a number outside every small field, or 128-bit overflow) sends the
//! caller to its [`Cyclo`] path, which gives the same numbers.

use super::fast::{common_field, MAX_PHI};
use super::irreps::Matrix;
use crate::exact::{field_candidates, Cyclo, KField, KInt, KTable, KVec};
use std::sync::Arc;

/// One d×d matrix over a field: entry (i, j) at (i·d + j)·k, over `den`.
type KMat = KTable<i128>;

/// The first candidate field holding every number, with the numbers converted.
fn field_for(mats: &[&Matrix]) -> Option<(Arc<KField>, Vec<KMat>)> {
    let n = common_field(mats.iter().flat_map(|m| m.iter().flatten()))?;
    for spec in field_candidates(n) {
        let Some(f) = KField::of(&spec) else { continue };
        if f.phi() > MAX_PHI {
            return None;
        }
        let conv: Option<Vec<KMat>> = mats
            .iter()
            .map(|m| KTable::from_cyclos(&f, m.iter().flatten()))
            .collect();
        if let Some(c) = conv {
            return Some((f, c));
        }
    }
    None
}

fn mul(f: &KField, d: usize, a: &KMat, b: &KMat) -> Option<KMat> {
    let k = f.phi();
    let mut num = vec![0i128; d * d * k];
    for i in 0..d {
        for l in 0..d {
            let x = &a.num[(i * d + l) * k..(i * d + l + 1) * k];
            if x.iter().all(|v| *v == 0) {
                continue;
            }
            for j in 0..d {
                let y = &b.num[(l * d + j) * k..(l * d + j + 1) * k];
                if y.iter().all(|v| *v == 0) {
                    continue;
                }
                f.mul_acc(&mut num[(i * d + j) * k..(i * d + j + 1) * k], x, y)?;
            }
        }
    }
    let mut v = KVec {
        num,
        den: a.den.checked_mul(b.den)?,
    };
    v.lowest_terms();
    Some(KMat {
        num: v.num,
        den: v.den,
    })
}

fn to_matrix(f: &KField, d: usize, m: &KMat) -> Matrix {
    let k = f.phi();
    (0..d)
        .map(|i| {
            (0..d)
                .map(|j| {
                    let e = &m.num[(i * d + j) * k..(i * d + j + 1) * k];
                    if e.iter().all(|v| *v == 0) {
                        Cyclo::zero()
                    } else {
                        f.cyclo_of(e, &m.den)
                    }
                })
                .collect()
        })
        .collect()
}

/// Every operation's matrix from the generators' (`steps`: (o, s, p) with D(o) = D(s)·D(p),
/// in an order where D(s) and D(p) are known), or `None` to take the exact-number path.
pub(super) fn extend(
    h: usize,
    gens: &[usize],
    gen_mats: &[Matrix],
    steps: &[(usize, usize, usize)],
) -> Option<Vec<Matrix>> {
    let (f, d, mats) = extend_in_field(h, gens, gen_mats, steps)?;
    mats.iter().map(|m| Some(to_matrix(&f, d, m))).collect()
}

/// For matrices of a function tuple on the generators: do their products have the characters
/// `chars` (`Some(None)` when not), and if so the invariant form Σ AᵀA over every operation,
/// all on integers (the operations' matrices are never turned into exact numbers here: the
/// caller keeps only the form). `None` to take the exact-number path.
pub(super) fn checked_form(
    h: usize,
    gens: &[usize],
    gen_mats: &[Matrix],
    steps: &[(usize, usize, usize)],
    chars: &[Cyclo],
) -> Option<Option<Matrix>> {
    let (f, d, mats) = extend_in_field(h, gens, gen_mats, steps)?;
    let k = f.phi();
    let mut trace = vec![0i128; k];
    for (m, chi) in mats.iter().zip(chars) {
        trace.iter_mut().for_each(|t| *t = 0);
        for i in 0..d {
            for (t, x) in trace
                .iter_mut()
                .zip(&m.num[(i * d + i) * k..(i * d + i + 1) * k])
            {
                *t = t.checked_add(*x)?;
            }
        }
        if f.cyclo_of(&trace, &m.den) != *chi {
            return Some(None);
        }
    }
    Some(Some(form_of(&f, d, &mats)?))
}

/// The generators' matrices over their field and every product.
fn extend_in_field(
    h: usize,
    gens: &[usize],
    gen_mats: &[Matrix],
    steps: &[(usize, usize, usize)],
) -> Option<(Arc<KField>, usize, Vec<KMat>)> {
    let d = gen_mats.first()?.len();
    let refs: Vec<&Matrix> = gen_mats.iter().collect();
    let (f, conv) = field_for(&refs)?;
    let k = f.phi();
    let mut id = vec![0i128; d * d * k];
    for i in 0..d {
        id[(i * d + i) * k] = 1;
    }
    let mut mats: Vec<Option<KMat>> = vec![None; h];
    mats[0] = Some(KMat { num: id, den: 1 });
    for (&o, m) in gens.iter().zip(conv) {
        mats[o] = Some(m);
    }
    for &(o, s, p) in steps {
        if mats[o].is_none() {
            let m = mul(&f, d, mats[s].as_ref()?, mats[p].as_ref()?)?;
            mats[o] = Some(m);
        }
    }
    let mats = mats.into_iter().collect::<Option<Vec<KMat>>>()?;
    Some((f, d, mats))
}

/// B = Σ_R A(R)ᵀ A(R), or `None` to take the exact-number path.
pub(super) fn invariant_form(mats: &[Matrix]) -> Option<Matrix> {
    let d = mats.first()?.len();
    let refs: Vec<&Matrix> = mats.iter().collect();
    let (f, conv) = field_for(&refs)?;
    form_of(&f, d, &conv)
}

/// Σ AᵀA over integer-form matrices.
fn form_of(f: &KField, d: usize, conv: &[KMat]) -> Option<Matrix> {
    let k = f.phi();
    // Σ over matrices with different denominators: bring every term to the lcm
    let mut den: i128 = 1;
    for m in conv {
        let sq = m.den.checked_mul(m.den)?;
        den = den.lcm(&sq)?;
    }
    let mut num = vec![0i128; d * d * k];
    let mut t = vec![0i128; k];
    for m in conv {
        let scale = den / (m.den * m.den);
        for i in 0..d {
            for j in 0..d {
                t.iter_mut().for_each(|x| *x = 0);
                for l in 0..d {
                    let x = &m.num[(l * d + i) * k..(l * d + i + 1) * k];
                    let y = &m.num[(l * d + j) * k..(l * d + j + 1) * k];
                    if x.iter().all(|v| *v == 0) || y.iter().all(|v| *v == 0) {
                        continue;
                    }
                    f.mul_acc(&mut t, x, y)?;
                }
                for (acc, v) in num[(i * d + j) * k..(i * d + j + 1) * k].iter_mut().zip(&t) {
                    *acc = acc.checked_add(v.checked_mul(scale)?)?;
                }
            }
        }
    }
    let mut v = KVec { num, den };
    v.lowest_terms();
    Some(to_matrix(
        f,
        d,
        &KMat {
            num: v.num,
            den: v.den,
        },
    ))
}
