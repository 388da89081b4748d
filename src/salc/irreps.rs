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
use crate::group::{tuple_matrix, FunctionTuple, PointGroup};
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
    let mut out = Vec::new();
    for (i, ir) in g.table.irreps.iter().enumerate() {
        if matches!(ir.pair, Some(p) if p < i) {
            continue;
        }
        out.push(build(g, i)?);
    }
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

fn build(g: &PointGroup, row: usize) -> Result<RealIrrep, IrrepError> {
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
        if let Some(mats) = from_tuple(g, t, &chars) {
            let (mats, norms) = {
                let b = invariant_form_from(&mats);
                orthogonalize(mats, &b)
            };
            return Ok(mk(mats, norms, MatrixSource::Functions(t.text.clone())));
        }
    }
    if let Some((mats, norms)) = from_regular(g, &chars, dim) {
        return Ok(mk(mats, norms, MatrixSource::Regular));
    }
    Err(IrrepError::NoMatrices {
        group: g.name().into(),
        irrep: label,
    })
}

/// Matrices of a tuple, if they have the irrep's character.
fn from_tuple(g: &PointGroup, t: &FunctionTuple, chars: &[Cyclo]) -> Option<Vec<Matrix>> {
    let mut out = Vec::with_capacity(g.order());
    for (o, op) in g.ops.iter().enumerate() {
        let m = tuple_matrix(&op.matrix, t)?;
        let tr: Cyclo = (0..m.len()).map(|i| m[i][i].clone()).sum();
        if tr != chars[o] || m.iter().flatten().any(|x| !x.is_real()) {
            return None;
        }
        out.push(m);
    }
    Some(out)
}

/// B = Σ_R A(R)ᵀ A(R): positive definite and invariant.
fn invariant_form_from(mats: &[Matrix]) -> Matrix {
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
