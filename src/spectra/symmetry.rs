//! Symmetry of overtone and combination levels: νa + νb transforms as Γa ⊗ Γb, the overtone
//! 2ν of a degenerate mode as the symmetric square [Γ²] and 3ν as the symmetric cube [Γ³] —
//! not the plain product (Herzberg, *Infrared and Raman Spectra* (1945), ch. II, §5; Wilson,
//! Decius & Cross, *Molecular Vibrations*, §7-3).
//!
//! Owns: [`Symmetry`] (a reduced Γ with the activity of each part) and the three products on
//! real irreps; the linear groups go through `lambda`.

use super::activity::activity_table;
use super::error::SpectraError;
use super::lambda::{self, Species};
use super::real::{real_character, real_irreps, to_real};
use crate::group::PointGroup;
use crate::rep::{decompose, direct_product, symmetric_cube, symmetric_square, Character};
use serde::Serialize;

/// One irrep in a reduced Γ, with its activity.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct SymTerm {
    pub irrep: String,
    pub multiplicity: u64,
    pub dimension: usize,
    pub ir: bool,
    pub raman: bool,
    pub polarized: bool,
}

/// A reduced Γ (real irreps) and its activity.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct Symmetry {
    /// `A1 + E`.
    pub text: String,
    pub terms: Vec<SymTerm>,
}

impl Symmetry {
    pub fn ir(&self) -> bool {
        self.terms.iter().any(|t| t.ir)
    }
    pub fn raman(&self) -> bool {
        self.terms.iter().any(|t| t.raman)
    }
    /// Contains a Raman-active totally symmetric part (can give a polarized band).
    pub fn polarized(&self) -> bool {
        self.terms.iter().any(|t| t.polarized)
    }
    /// Multiplicity of a real irrep by label.
    pub fn count(&self, label: &str) -> u64 {
        self.terms
            .iter()
            .filter(|t| t.irrep == label)
            .map(|t| t.multiplicity)
            .sum()
    }

    fn from_terms(g: &PointGroup, terms: Vec<SymTerm>) -> Symmetry {
        let text = if terms.is_empty() {
            "0".to_string()
        } else {
            terms
                .iter()
                .map(|t| crate::rep::write_term(g, t.multiplicity, &t.irrep))
                .collect::<Vec<_>>()
                .join(" + ")
        };
        Symmetry { text, terms }
    }
}

/// Γ given per real irrep, as a [`Symmetry`].
pub fn symmetry_of_real(g: &PointGroup, real: &[u64]) -> Symmetry {
    let terms = activity_table(g)
        .into_iter()
        .zip(real)
        .filter(|(_, n)| **n > 0)
        .map(|(a, n)| SymTerm {
            polarized: a.polarized(),
            irrep: a.irrep,
            multiplicity: *n,
            dimension: a.dimension,
            ir: a.ir,
            raman: a.raman,
        })
        .collect();
    Symmetry::from_terms(g, terms)
}

/// Γ given per table row, as a [`Symmetry`].
pub fn symmetry_of_rows(g: &PointGroup, rows: &[u64]) -> Result<Symmetry, SpectraError> {
    Ok(symmetry_of_real(g, &to_real(g, rows)?))
}

fn check_index(g: &PointGroup, i: usize) -> Result<(), SpectraError> {
    let n = real_irreps(g).len();
    if i >= n {
        return Err(SpectraError::Unsupported {
            group: g.name().into(),
            message: format!("irrep index {i} out of range (0..{n})"),
        });
    }
    Ok(())
}

fn reduce_real(g: &PointGroup, chi: &Character) -> Result<Symmetry, SpectraError> {
    let rows = decompose(g, chi).map_err(|_| SpectraError::Internal {
        group: g.name().into(),
        message: "a product of irreps did not reduce".into(),
    })?;
    symmetry_of_rows(g, &rows)
}

/// Symmetry of the combination level νa + νb (a, b: real-irrep indices): Γa ⊗ Γb.
pub fn combination(g: &PointGroup, a: usize, b: usize) -> Result<Symmetry, SpectraError> {
    check_index(g, a)?;
    check_index(g, b)?;
    if g.is_linear() {
        let (sa, sb) = (species(g, a)?, species(g, b)?);
        return Ok(linear_symmetry(g, lambda::product(sa, sb)));
    }
    let reals = real_irreps(g);
    let chi = direct_product(&real_character(g, &reals[a]), &real_character(g, &reals[b]));
    reduce_real(g, &chi)
}

/// Symmetry of the overtone level nν (n = 1, 2, 3) of a mode of real irrep `a`: Γ, [Γ²], [Γ³].
pub fn overtone(g: &PointGroup, a: usize, n: u32) -> Result<Symmetry, SpectraError> {
    check_index(g, a)?;
    if !(1..=3).contains(&n) {
        return Err(SpectraError::Unsupported {
            group: g.name().into(),
            message: format!("overtone {n}ν: only ν, 2ν and 3ν are provided"),
        });
    }
    if g.is_linear() {
        return Ok(linear_symmetry(
            g,
            lambda::symmetric_power(species(g, a)?, n),
        ));
    }
    let chi = real_character(g, &real_irreps(g)[a]);
    let chi = match n {
        1 => chi,
        2 => symmetric_square(g, &chi),
        _ => symmetric_cube(g, &chi),
    };
    reduce_real(g, &chi)
}

fn species(g: &PointGroup, a: usize) -> Result<Species, SpectraError> {
    let label = &real_irreps(g)[a].label;
    Species::parse(label).ok_or_else(|| SpectraError::Unsupported {
        group: g.name().into(),
        message: format!("linear-group label '{label}' is not Σ±, Π, Δ, Φ or Γ"),
    })
}

/// Species of a linear group → Symmetry; species beyond the table (e.g. Γ, Λ = 4) are inactive.
fn linear_symmetry(g: &PointGroup, list: Vec<Species>) -> Symmetry {
    let table = activity_table(g);
    let mut sorted = list;
    sorted.sort();
    let mut terms: Vec<SymTerm> = Vec::new();
    for s in sorted {
        let label = s.label();
        if let Some(t) = terms.iter_mut().find(|t| t.irrep == label) {
            t.multiplicity += 1;
            continue;
        }
        let act = table.iter().find(|a| a.irrep == label);
        terms.push(SymTerm {
            irrep: label,
            multiplicity: 1,
            dimension: s.dim(),
            ir: act.is_some_and(|a| a.ir),
            raman: act.is_some_and(|a| a.raman),
            polarized: act.is_some_and(|a| a.polarized()),
        });
    }
    // Keep the table's order where possible.
    terms.sort_by_key(|t| {
        table
            .iter()
            .position(|a| a.irrep == t.irrep)
            .unwrap_or(usize::MAX)
    });
    Symmetry::from_terms(g, terms)
}

/// Which product [`linear_product`] takes.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ProductKind {
    /// Γa ⊗ Γb.
    Direct,
    /// Symmetric square [Γ²].
    Symmetric,
    /// Antisymmetric square {Γ²}.
    Antisymmetric,
    /// Symmetric cube [Γ³] (a single species only).
    Cube,
}

/// Products of Γs of C∞v or D∞h given per real irrep (table order), by the species rules of
/// `lambda` (Herzberg 1945, ch. II): Γ⊗Γ' term by term; [(Σ mᵢΓᵢ)²] = Σ mᵢ[Γᵢ²] +
/// Σ C(mᵢ,2) Γᵢ⊗Γᵢ + Σ_{i<j} mᵢmⱼ Γᵢ⊗Γⱼ, and the same with {Γᵢ²} for the antisymmetric square
/// ({Λ²} = Σ⁻ for Λ > 0, nothing for Σ).
pub fn linear_product(
    g: &PointGroup,
    a: &[u64],
    b: Option<&[u64]>,
    kind: ProductKind,
) -> Result<Symmetry, SpectraError> {
    let list = |m: &[u64]| -> Result<Vec<(Species, u64)>, SpectraError> {
        m.iter()
            .enumerate()
            .filter(|(_, n)| **n > 0)
            .map(|(i, n)| Ok((species(g, i)?, *n)))
            .collect()
    };
    let xs = list(a)?;
    let mut out: Vec<Species> = Vec::new();
    let mut add = |v: Vec<Species>, times: u64| {
        for _ in 0..times {
            out.extend(v.iter().copied());
        }
    };
    match kind {
        ProductKind::Direct => {
            let ys = list(b.ok_or_else(|| SpectraError::Unsupported {
                group: g.name().into(),
                message: "a direct product needs two representations".into(),
            })?)?;
            for (sa, ma) in &xs {
                for (sb, mb) in &ys {
                    add(lambda::product(*sa, *sb), ma * mb);
                }
            }
        }
        ProductKind::Symmetric | ProductKind::Antisymmetric => {
            for (k, (s, m)) in xs.iter().enumerate() {
                let own = if kind == ProductKind::Symmetric {
                    lambda::symmetric_power(*s, 2)
                } else {
                    lambda::antisymmetric_square(*s)
                };
                add(own, *m);
                add(lambda::product(*s, *s), m * (m - 1) / 2);
                for (t, n) in &xs[k + 1..] {
                    add(lambda::product(*s, *t), m * n);
                }
            }
        }
        ProductKind::Cube => match xs.as_slice() {
            [(s, 1)] => add(lambda::symmetric_power(*s, 3), 1),
            _ => {
                return Err(SpectraError::Unsupported {
                    group: g.name().into(),
                    message: "the symmetric cube is provided for a single species".into(),
                })
            }
        },
    }
    Ok(linear_symmetry(g, out))
}
