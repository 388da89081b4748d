//! Real irreducible representations with exact matrices, the partner basis SALCs follow.
//!
//! One-dimensional real irreps are their characters. A complex-conjugate pair (¹E, ²E) is taken
//! together as one real two-dimensional irrep with character χ₁ + χ₂. A degenerate irrep's
//! matrices come from the first function tuple the table lists for it, (x, y), (Rx, Ry),
//! (x² − y², xy) …, made orthogonal in the G-invariant inner product B = Σ_R A(R)ᵀA(R) by
//! Gram–Schmidt in the tuple's order (so the first partner still behaves like the first
//! function) and rescaled to equal length where the scale factor is exact (xy → 2xy).
//! Where the table lists no function, the matrices are built from the regular representation:
//! an elementary abelian 2-subgroup H is found whose one-dimensional irrep λ occurs once in Γ,
//! and the vector P^λ_H·P^Γ·e_E generates a single irreducible copy (Serre, *Linear
//! Representations of Finite Groups*, §2.6–2.7).

use crate::exact::{sqrt, Cyclo};
use crate::group::{FunctionTuple, PointGroup};
use crate::rep::pair_label;
use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};

/// A d×d exact matrix, row-major.
pub type Matrix = Vec<Vec<Cyclo>>;

/// Where an irrep's matrices come from.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum MatrixSource {
    /// One-dimensional: the characters.
    Character,
    /// The table's function tuple, e.g. `(x, y)`.
    Functions(String),
    /// A single irreducible copy inside the regular representation.
    Regular,
    /// A complex-conjugate pair of one-dimensional irreps: χ(R) = a + bi acts on the plane as
    /// the rotation [[a, −b], [b, a]].
    ComplexPair,
}

impl MatrixSource {
    pub fn describe(&self) -> String {
        match self {
            MatrixSource::Character => "characters".into(),
            MatrixSource::Functions(t) => format!("partners transform like {t}"),
            MatrixSource::Regular => {
                "partners from an irreducible copy in the regular representation (no function listed)"
                    .into()
            }
            MatrixSource::ComplexPair => {
                "partners are the real and imaginary parts of the complex pair (no function listed)"
                    .into()
            }
        }
    }
}

/// A real irrep and its exact matrices on every operation.
#[derive(Debug, Clone)]
pub struct RealIrrep {
    /// Table row (the first of a complex pair).
    pub row: usize,
    /// The conjugate row of a complex pair.
    pub pair: Option<usize>,
    /// ASCII label (`E` for a ¹E/²E pair).
    pub label: String,
    pub dim: usize,
    /// `mats[op]`: R·sⱼ = Σᵢ sᵢ·mats[op][i][j] for partners s₁ … s_d.
    pub mats: Vec<Matrix>,
    /// Invariant lengths² of the partners; all equal when the matrices are orthogonal.
    pub norms: Vec<Cyclo>,
    pub source: MatrixSource,
}

impl RealIrrep {
    /// Real character on operation `op`.
    pub fn chi(&self, op: usize) -> Cyclo {
        (0..self.dim).map(|i| self.mats[op][i][i].clone()).sum()
    }
    /// Are the matrices orthogonal (partners of equal length)?
    pub fn orthogonal(&self) -> bool {
        self.norms.iter().all(|n| n == &self.norms[0])
    }
}

/// Why irrep matrices could not be built.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum IrrepError {
    #[error(
        "{group}: no real matrices found for {irrep} (no function tuple and no suitable subgroup)"
    )]
    NoMatrices { group: String, irrep: String },
    #[error("{group} is a linear group: SALCs are built in its finite subgroup")]
    Linear { group: String },
}

fn cache() -> &'static Mutex<HashMap<String, Arc<Vec<RealIrrep>>>> {
    static C: OnceLock<Mutex<HashMap<String, Arc<Vec<RealIrrep>>>>> = OnceLock::new();
    C.get_or_init(|| Mutex::new(HashMap::new()))
}

/// All real irreps of a finite group, in table order (pairs once), cached per group.
pub fn real_irreps(g: &PointGroup) -> Result<Arc<Vec<RealIrrep>>, IrrepError> {
    if g.is_linear() {
        return Err(IrrepError::Linear {
            group: g.name().into(),
        });
    }
    if let Some(v) = cache().lock().expect("irrep cache").get(g.name()) {
        return Ok(v.clone());
    }
    // First the irreps with their own function tuples (or of dimension 1), then the others,
    // which may reuse those (X = Y ⊗ L) before falling back to the regular representation.
    let rows: Vec<usize> = (0..g.table.irreps.len())
        .filter(|&i| !matches!(g.table.irreps[i].pair, Some(p) if p < i))
        .collect();
    // (independent of one another: built side by side)
    use rayon::prelude::*;
    let own: Vec<Option<RealIrrep>> = rows.par_iter().map(|&i| build_own(g, i)).collect();
    let mut out: Vec<RealIrrep> = Vec::new();
    let mut rest = Vec::new();
    for (&i, r) in rows.iter().zip(own) {
        match r {
            Some(r) => out.push(r),
            None => rest.push(i),
        }
    }
    for i in rest {
        let r = build(g, i, &out)?;
        out.push(r);
    }
    out.sort_by_key(|r| r.row);
    let out = Arc::new(out);
    cache()
        .lock()
        .expect("irrep cache")
        .insert(g.name().to_string(), out.clone());
    Ok(out)
}

fn real_chars(g: &PointGroup, row: usize) -> Vec<Cyclo> {
    let ir = &g.table.irreps[row];
    g.ops
        .iter()
        .map(|op| match ir.pair {
            Some(p) => &ir.chars[op.class] + &g.table.irreps[p].chars[op.class],
            None => ir.chars[op.class].clone(),
        })
        .collect()
}

fn build_own(g: &PointGroup, row: usize) -> Option<RealIrrep> {
    let chars = real_chars(g, row);
    let dim = chars[0].to_i64().unwrap_or(1) as usize;
    let ir = &g.table.irreps[row];
    if dim != 1 && !ir.functions.all().any(|t| t.dim() == dim) {
        return None;
    }
    build(g, row, &[])
        .ok()
        .filter(|r| !matches!(r.source, MatrixSource::Regular))
}

fn build(g: &PointGroup, row: usize, built: &[RealIrrep]) -> Result<RealIrrep, IrrepError> {
    let ir = &g.table.irreps[row];
    let chars = real_chars(g, row);
    let dim = chars[0].to_i64().unwrap_or(1) as usize;
    let label = if ir.pair.is_some() {
        pair_label(&ir.label)
    } else {
        ir.label.clone()
    };
    let mk = |mats: Vec<Matrix>, norms: Vec<Cyclo>, source| RealIrrep {
        row,
        pair: ir.pair,
        label: label.clone(),
        dim,
        mats,
        norms,
        source,
    };
    if dim == 1 {
        let mats = chars.iter().map(|c| vec![vec![c.clone()]]).collect();
        return Ok(mk(mats, vec![Cyclo::one()], MatrixSource::Character));
    }
    for t in ir.functions.all().filter(|t| t.dim() == dim) {
        if let Some((gen_mats, b)) = from_tuple(g, t, &chars) {
            let (mats, norms) = {
                // the new basis's matrices on the generators, the rest by products
                let gens = &generation(g).0;
                let (new, norms) = orthogonalize(gen_mats, &b);
                (extend_from_generators(g, gens, new), norms)
            };
            return Ok(mk(mats, norms, MatrixSource::Functions(t.text.clone())));
        }
    }
    // X = Y ⊗ L for a one-dimensional L and an irrep Y that has functions (e.g. T2g = T2u ⊗ Au
    // in Ih): D_X(R) = χ_L(R)·D_Y(R), exact and cheap.
    if let Some((mats, norms, from)) = from_product_with_1d(g, row, &chars, built) {
        return Ok(mk(
            mats,
            norms,
            MatrixSource::Functions(format!("{from} (times a one-dimensional irrep)")),
        ));
    }
    if let Some(mats) = from_complex_pair(g, row) {
        return Ok(mk(mats, vec![Cyclo::one(); 2], MatrixSource::ComplexPair));
    }
    if let Some((mats, norms)) = from_regular(g, &chars, dim) {
        return Ok(mk(mats, norms, MatrixSource::Regular));
    }
    Err(IrrepError::NoMatrices {
        group: g.name().into(),
        irrep: label,
    })
}

/// A pair ¹E/²E of one-dimensional complex irreps as one real irrep: with χ(R) = a + bi on the
/// first row, R ↦ [[a, −b], [b, a]] is multiplication by χ(R) on C = R² (a homomorphism because
/// χ is), orthogonal because |χ(R)| = 1, and of trace 2a = χ + χ̄ (Serre, *Linear Representations
/// of Finite Groups*, §13.2, real representations of complex type).
fn from_complex_pair(g: &PointGroup, row: usize) -> Option<Vec<Matrix>> {
    let ir = &g.table.irreps[row];
    ir.pair?;
    if ir.dim() != 1 {
        return None;
    }
    Some(
        g.ops
            .iter()
            .map(|op| {
                let c = &ir.chars[op.class];
                let (a, b) = (c.re(), c.im());
                vec![vec![a.clone(), -&b], vec![b, a]]
            })
            .collect(),
    )
}

/// Matrices of `row` as (one-dimensional irrep L) × (an already built irrep Y from functions).
fn from_product_with_1d(
    g: &PointGroup,
    row: usize,
    chars: &[Cyclo],
    built: &[RealIrrep],
) -> Option<(Vec<Matrix>, Vec<Cyclo>, String)> {
    for l in 0..g.table.irreps.len() {
        let lir = &g.table.irreps[l];
        if lir.dim() != 1 || lir.pair.is_some() || lir.chars.iter().any(|c| !c.is_rational()) {
            continue;
        }
        let lchars = real_chars(g, l);
        for y in built {
            if y.row == row || y.dim != chars[0].to_i64().unwrap_or(0) as usize {
                continue;
            }
            let MatrixSource::Functions(text) = &y.source else {
                continue;
            };
            let ychars = real_chars(g, y.row);
            if (0..chars.len()).any(|o| chars[o] != &lchars[o] * &ychars[o]) {
                continue;
            }
            let mats = y
                .mats
                .iter()
                .zip(&lchars)
                .map(|(m, s)| {
                    m.iter()
                        .map(|r| r.iter().map(|x| x * s).collect())
                        .collect()
                })
                .collect();
            return Some((mats, y.norms.clone(), format!("{text} of {}", y.label)));
        }
    }
    None
}

/// A generating set of the group and, for every operation, how to reach it: `steps[k] =
/// (o, s, p)` with ops[o] = ops[s]·ops[p], s a generator and p reached before (breadth-first
/// from the identity, operation 0).
/// Generators and the breadth-first steps that reach every operation from them.
type Generation = (Vec<usize>, Vec<(usize, usize, usize)>);

fn generation(g: &PointGroup) -> Arc<Generation> {
    type Steps = Arc<Generation>;
    static C: OnceLock<Mutex<HashMap<String, Steps>>> = OnceLock::new();
    let c = C.get_or_init(|| Mutex::new(HashMap::new()));
    if let Some(v) = c.lock().expect("generation cache").get(g.name()) {
        return v.clone();
    }
    let v = Arc::new(compute_generation(g));
    c.lock()
        .expect("generation cache")
        .insert(g.name().to_string(), v.clone());
    v
}

fn compute_generation(g: &PointGroup) -> Generation {
    let h = g.order();
    let close = |gens: &[usize]| -> Vec<(usize, usize, usize)> {
        let mut seen = vec![false; h];
        seen[0] = true;
        let mut queue = vec![0usize];
        let mut steps = Vec::with_capacity(h);
        let mut k = 0;
        while k < queue.len() {
            let x = queue[k];
            k += 1;
            for &s in gens {
                // (the generators' products only: the whole table, 14,400 products for Ih,
                // is not needed here)
                let y = g
                    .op_index(&(g.ops[s].float * g.ops[x].float))
                    .expect("group is closed");
                if !seen[y] {
                    seen[y] = true;
                    queue.push(y);
                    steps.push((y, s, x));
                }
            }
        }
        steps
    };
    let mut gens: Vec<usize> = Vec::new();
    let mut steps = Vec::new();
    for o in 1..h {
        if steps.len() + 1 == h {
            break;
        }
        if !steps.iter().any(|&(y, _, _)| y == o) {
            gens.push(o);
            steps = close(&gens);
        }
    }
    (gens, steps)
}

fn mat_mul(a: &Matrix, b: &Matrix) -> Matrix {
    let d = a.len();
    (0..d)
        .map(|i| {
            (0..d)
                .map(|j| {
                    let mut s = Cyclo::zero();
                    for k in 0..d {
                        if !a[i][k].is_zero() && !b[k][j].is_zero() {
                            s += &(&a[i][k] * &b[k][j]);
                        }
                    }
                    s
                })
                .collect()
        })
        .collect()
}

/// Matrices of every operation from those of the generators (D(s·p) = D(s)·D(p)).
fn extend_from_generators(g: &PointGroup, gens: &[usize], gen_mats: Vec<Matrix>) -> Vec<Matrix> {
    let gen_steps = generation(g);
    let steps = &gen_steps.1;
    if let Some(m) = super::fast_mats::extend(g.order(), gens, &gen_mats, steps) {
        return m;
    }
    extend_on_numbers(g, gens, gen_mats, steps)
}

/// [`extend_from_generators`] on exact numbers (the path when no small field applies).
fn extend_on_numbers(
    g: &PointGroup,
    gens: &[usize],
    gen_mats: Vec<Matrix>,
    steps: &[(usize, usize, usize)],
) -> Vec<Matrix> {
    let d = gen_mats[0].len();
    let identity: Matrix = (0..d)
        .map(|i| (0..d).map(|j| Cyclo::from_int((i == j) as i64)).collect())
        .collect();
    let mut mats: Vec<Option<Matrix>> = vec![None; g.order()];
    mats[0] = Some(identity);
    for (&o, m) in gens.iter().zip(gen_mats) {
        mats[o] = Some(m);
    }
    for &(o, s, p) in steps {
        if mats[o].is_none() {
            let m = mat_mul(
                mats[s].as_ref().expect("generator"),
                mats[p].as_ref().expect("reached before"),
            );
            mats[o] = Some(m);
        }
    }
    mats.into_iter()
        .map(|m| m.expect("generators reach every operation"))
        .collect()
}

/// A tuple's matrices on the generators and the invariant form Σ AᵀA over every operation, if
/// the tuple carries the irrep: real matrices (products of the generators' real ones are real)
/// with the irrep's character on every operation. Only the generators' matrices are read from
/// the functions; the rest are their products (the tuple's action is a homomorphism).
fn from_tuple(g: &PointGroup, t: &FunctionTuple, chars: &[Cyclo]) -> Option<(Vec<Matrix>, Matrix)> {
    let gen_steps = generation(g);
    let (gens, steps) = (&gen_steps.0, &gen_steps.1);
    let gen_mats = crate::group::tuple_matrices(gens.iter().map(|&o| &g.ops[o].matrix), t)?;
    if gen_mats.iter().flatten().flatten().any(|x| !x.is_real()) {
        return None;
    }
    if let Some(form) = super::fast_mats::checked_form(g.order(), gens, &gen_mats, steps, chars) {
        return form.map(|b| (gen_mats, b));
    }
    let mats = extend_on_numbers(g, gens, gen_mats.clone(), steps);
    for (o, m) in mats.iter().enumerate() {
        let tr: Cyclo = (0..m.len()).map(|i| m[i][i].clone()).sum();
        if tr != chars[o] {
            return None;
        }
    }
    Some((gen_mats, invariant_form_from(&mats)))
}

/// B = Σ_R A(R)ᵀ A(R): positive definite and invariant.
fn invariant_form_from(mats: &[Matrix]) -> Matrix {
    if let Some(b) = super::fast_mats::invariant_form(mats) {
        return b;
    }
    invariant_form_on_numbers(mats)
}

/// [`invariant_form_from`] on exact numbers.
fn invariant_form_on_numbers(mats: &[Matrix]) -> Matrix {
    let d = mats[0].len();
    let mut b = vec![vec![Cyclo::zero(); d]; d];
    for a in mats {
        for i in 0..d {
            for j in 0..d {
                let s: Cyclo = (0..d).map(|k| &a[k][i] * &a[k][j]).sum();
                b[i][j] += &s;
            }
        }
    }
    b
}

fn form(b: &Matrix, u: &[Cyclo], v: &[Cyclo]) -> Cyclo {
    let d = u.len();
    let mut s = Cyclo::zero();
    for i in 0..d {
        if u[i].is_zero() {
            continue;
        }
        for j in 0..d {
            if !v[j].is_zero() && !b[i][j].is_zero() {
                s += &(&(&u[i] * &b[i][j]) * &v[j]);
            }
        }
    }
    s
}

/// Gram–Schmidt in B in the given order, exact rescaling to equal length where possible;
/// returns the matrices in the new basis and the partners' lengths².
fn orthogonalize(mats: Vec<Matrix>, b: &Matrix) -> (Vec<Matrix>, Vec<Cyclo>) {
    let d = b.len();
    let mut basis: Vec<Vec<Cyclo>> = Vec::new();
    let mut norms: Vec<Cyclo> = Vec::new();
    for k in 0..d {
        let mut v: Vec<Cyclo> = (0..d).map(|i| Cyclo::from_int((i == k) as i64)).collect();
        for (c, n) in basis.iter().zip(&norms) {
            let f = &form(b, &v, c) / n;
            if !f.is_zero() {
                for i in 0..d {
                    v[i] -= &(&f * &c[i]);
                }
            }
        }
        let mut n = form(b, &v, &v);
        if let Some(n0) = norms.first() {
            if let Ok(s) = sqrt(&(n0 / &n)) {
                for x in v.iter_mut() {
                    *x = &*x * &s;
                }
                n = n0.clone();
            }
        }
        basis.push(v);
        norms.push(n);
    }
    let new = mats
        .iter()
        .map(|a| {
            // A'_ij = B(c_i, A c_j) / n_i
            let images: Vec<Vec<Cyclo>> = basis
                .iter()
                .map(|c| {
                    (0..d)
                        .map(|i| (0..d).map(|k| &a[i][k] * &c[k]).sum())
                        .collect()
                })
                .collect();
            (0..d)
                .map(|i| {
                    (0..d)
                        .map(|j| &form(b, &basis[i], &images[j]) / &norms[i])
                        .collect()
                })
                .collect()
        })
        .collect();
    (new, norms)
}

/// Elementary abelian 2-subgroups generated by up to three commuting involutions.
fn involution_subgroups(g: &PointGroup) -> Vec<Vec<usize>> {
    let e = 0;
    let inv: Vec<usize> = (1..g.order()).filter(|&o| g.product(o, o) == e).collect();
    let mut out: Vec<Vec<usize>> = inv.iter().map(|&t| vec![t]).collect();
    let commute = |a: usize, b: usize| g.product(a, b) == g.product(b, a);
    for (x, &a) in inv.iter().enumerate() {
        for &b in &inv[x + 1..] {
            if commute(a, b) && g.product(a, b) != e {
                out.push(vec![a, b]);
                for &c in &inv {
                    let ab = g.product(a, b);
                    if c != a && c != b && c != ab && commute(a, c) && commute(b, c) {
                        out.push(vec![a, b, c]);
                    }
                }
            }
        }
    }
    out
}

/// Elements of ⟨gens⟩ with their sign under the character λ = signs on the generators.
fn signed_elements(g: &PointGroup, gens: &[usize], signs: &[i64]) -> Vec<(usize, i64)> {
    let mut els = vec![(0usize, 1i64)];
    for (&t, &s) in gens.iter().zip(signs) {
        let more: Vec<(usize, i64)> = els
            .iter()
            .map(|&(x, sx)| (g.product(t, x), s * sx))
            .collect();
        els.extend(more);
    }
    els
}

fn from_regular(g: &PointGroup, chars: &[Cyclo], dim: usize) -> Option<(Vec<Matrix>, Vec<Cyclo>)> {
    let h = g.order();
    for gens in involution_subgroups(g) {
        for mask in 0..(1u32 << gens.len()) {
            let signs: Vec<i64> = (0..gens.len())
                .map(|k| if mask >> k & 1 == 1 { -1 } else { 1 })
                .collect();
            let els = signed_elements(g, &gens, &signs);
            let mult: Cyclo = els
                .iter()
                .map(|&(o, s)| &chars[o] * &Cyclo::from_int(s))
                .sum::<Cyclo>();
            if mult != Cyclo::from_int(els.len() as i64) {
                continue; // λ must occur exactly once
            }
            // v = P^λ_H P^Γ e_E in the regular representation (R·e_g = e_{Rg}).
            let mut w = vec![Cyclo::zero(); h];
            for (o, c) in chars.iter().enumerate() {
                w[o] = c.conj();
            }
            let mut v = vec![Cyclo::zero(); h];
            for &(t, s) in &els {
                for x in 0..h {
                    if !w[x].is_zero() {
                        let y = g.product(t, x);
                        v[y] += &(&w[x] * &Cyclo::from_int(s));
                    }
                }
            }
            if v.iter().all(Cyclo::is_zero) {
                continue;
            }
            return Some(irreducible_span(g, &v, dim));
        }
    }
    None
}

/// Orthogonal basis of the cyclic module of v (which is irreducible of dimension `dim`) and the
/// matrices of every operation in it.
fn irreducible_span(g: &PointGroup, v: &[Cyclo], dim: usize) -> (Vec<Matrix>, Vec<Cyclo>) {
    let h = g.order();
    let act = |o: usize, u: &[Cyclo]| -> Vec<Cyclo> {
        let mut out = vec![Cyclo::zero(); h];
        for x in 0..h {
            if !u[x].is_zero() {
                out[g.product(o, x)] = u[x].clone();
            }
        }
        out
    };
    let dot = |a: &[Cyclo], b: &[Cyclo]| -> Cyclo {
        a.iter()
            .zip(b)
            .filter(|(x, y)| !x.is_zero() && !y.is_zero())
            .map(|(x, y)| x * &y.conj())
            .sum()
    };
    let mut basis: Vec<Vec<Cyclo>> = Vec::new();
    let mut norms: Vec<Cyclo> = Vec::new();
    for o in 0..h {
        if basis.len() == dim {
            break;
        }
        let mut u = act(o, v);
        for (c, n) in basis.iter().zip(&norms) {
            let f = &dot(&u, c) / n;
            if !f.is_zero() {
                for i in 0..h {
                    if !c[i].is_zero() {
                        u[i] -= &(&f * &c[i]);
                    }
                }
            }
        }
        if u.iter().all(Cyclo::is_zero) {
            continue;
        }
        let mut n = dot(&u, &u);
        if let Some(n0) = norms.first() {
            if let Ok(s) = sqrt(&(n0 / &n)) {
                u = u.iter().map(|x| x * &s).collect();
                n = n0.clone();
            }
        }
        basis.push(u);
        norms.push(n);
    }
    let mats = (0..h)
        .map(|o| {
            let images: Vec<Vec<Cyclo>> = basis.iter().map(|c| act(o, c)).collect();
            (0..dim)
                .map(|i| {
                    (0..dim)
                        .map(|j| &dot(&images[j], &basis[i]) / &norms[i])
                        .collect()
                })
                .collect()
        })
        .collect();
    (mats, norms)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The integer-form matrix products (`fast_mats`) give the same matrices as products of
    /// exact numbers, for every irrep of every finite group in the tables: all operations from
    /// the generators, and the invariant form Σ AᵀA.
    // Reference: the crate's Cyclo arithmetic (differential testing, common practice).
    #[test]
    fn integer_products_agree_with_exact_numbers() {
        let mut compared = 0;
        for name in crate::group::names() {
            let g = crate::group::load(name).unwrap();
            if g.is_linear() {
                continue;
            }
            let (gens, steps) = {
                let gs = generation(&g);
                (gs.0.clone(), gs.1.clone())
            };
            for ir in real_irreps(&g).unwrap().iter().filter(|ir| ir.dim > 1) {
                let gen_mats: Vec<Matrix> = gens.iter().map(|&o| ir.mats[o].clone()).collect();
                let exact = extend_on_numbers(&g, &gens, gen_mats.clone(), &steps);
                let fast = super::super::fast_mats::extend(g.order(), &gens, &gen_mats, &steps)
                    .expect("molecular irreps fit the integer form");
                assert!(fast == exact, "{name} {}", ir.label);
                assert!(exact == ir.mats, "{name} {}", ir.label);
                let b = super::super::fast_mats::invariant_form(&ir.mats).expect("fits");
                assert!(
                    b == invariant_form_on_numbers(&ir.mats),
                    "{name} {}",
                    ir.label
                );
                // the character check and form on integers: the irrep's own characters pass
                // with the same form; any other character (the trace with one operation's
                // value changed) is refused
                let chars = real_chars(&g, ir.row);
                let checked = super::super::fast_mats::checked_form(
                    g.order(),
                    &gens,
                    &gen_mats,
                    &steps,
                    &chars,
                )
                .expect("fits");
                assert!(checked == Some(b), "{name} {}", ir.label);
                let mut wrong = chars.clone();
                let last = wrong.len() - 1;
                wrong[last] = &wrong[last] + &Cyclo::one();
                let refused = super::super::fast_mats::checked_form(
                    g.order(),
                    &gens,
                    &gen_mats,
                    &steps,
                    &wrong,
                );
                assert!(refused == Some(None), "{name} {}", ir.label);
                compared += 1;
            }
        }
        assert!(compared > 100, "{compared} irreps compared");
    }
}
