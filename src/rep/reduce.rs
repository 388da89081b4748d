//! The reduction formula, exactly, with its worked arithmetic:
//! nᵢ = (1/h) Σ_c g_c χ(c) χᵢ(c)*   (Cotton, 3rd ed., §4.3, eq. 4.3-11).
//!
//! Impossible characters (a fractional or negative nᵢ) give an error naming the offending
//! irreps, plus the single-class changes of χ that would give a valid decomposition.

use super::character::{Character, MemberKind};
use super::gamma_text::pair_label;
use crate::exact::Cyclo;
use crate::group::PointGroup;
use num_traits::Signed;

/// One term g_c·χ(c)·χᵢ(c)* of the sum.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Term {
    pub class: usize,
    pub size: usize,
    pub chi: Cyclo,
    pub chi_irrep_conj: Cyclo,
    pub product: Cyclo,
}

/// The worked reduction for one irrep.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Line {
    pub irrep: usize,
    pub terms: Vec<Term>,
    pub sum: Cyclo,
    /// sum / h.
    pub value: Cyclo,
}

/// Result of reducing χ.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Reduction {
    pub group: String,
    pub order: usize,
    pub chi: Character,
    pub lines: Vec<Line>,
    /// When χ came from unmoved counts of a set of one kind: the counts and the kind, so that
    /// suggestions stay within what such a set can give (see [`suggest_unmoved`]).
    pub unmoved: Option<(Vec<i64>, MemberKind)>,
}

/// A single-class change that makes χ valid.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Suggestion {
    pub class: usize,
    pub from: Cyclo,
    pub to: Cyclo,
    pub multiplicities: Vec<u64>,
    /// For a set given by unmoved counts: the count before and after.
    pub unmoved: Option<(i64, i64)>,
}

/// Why a character is not a representation.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Invalid {
    /// (irrep index, its non-integer or negative value)
    pub offending: Vec<(usize, Cyclo)>,
    pub suggestions: Vec<Suggestion>,
}

impl Reduction {
    /// Multiplicities if all are non-negative integers.
    pub fn multiplicities(&self) -> Result<Vec<u64>, Invalid> {
        let bad: Vec<(usize, Cyclo)> = self
            .lines
            .iter()
            .filter(|l| !is_count(&l.value))
            .map(|l| (l.irrep, l.value.clone()))
            .collect();
        if bad.is_empty() {
            Ok(self
                .lines
                .iter()
                .map(|l| l.value.to_i64().unwrap_or(0) as u64)
                .collect())
        } else {
            Err(Invalid {
                offending: bad,
                suggestions: Vec::new(),
            })
        }
    }
    pub fn is_valid(&self) -> bool {
        self.multiplicities().is_ok()
    }
}

fn is_count(v: &Cyclo) -> bool {
    v.to_integer().map(|i| !i.is_negative()).unwrap_or(false)
}

/// Reduce χ in the group g, with the worked sum for every irrep.
pub fn reduce(g: &PointGroup, chi: &Character) -> Reduction {
    let h = g.order();
    let sizes = g.class_sizes();
    let lines = g
        .table
        .irreps
        .iter()
        .enumerate()
        .map(|(i, ir)| {
            let terms: Vec<Term> = (0..sizes.len())
                .map(|c| {
                    let conj = ir.chars[c].conj();
                    let product = &(&chi.0[c] * &conj) * &Cyclo::from_int(sizes[c] as i64);
                    Term {
                        class: c,
                        size: sizes[c],
                        chi: chi.0[c].clone(),
                        chi_irrep_conj: conj,
                        product,
                    }
                })
                .collect();
            let sum: Cyclo = terms.iter().map(|t| t.product.clone()).sum();
            let value = &sum * &Cyclo::frac(1, h as i64);
            Line {
                irrep: i,
                terms,
                sum,
                value,
            }
        })
        .collect();
    Reduction {
        group: g.name().to_string(),
        order: h,
        chi: chi.clone(),
        lines,
        unmoved: None,
    }
}

/// Reduce the character of `counts` unmoved members of `kind` per class, remembering them.
pub fn reduce_unmoved(
    g: &PointGroup,
    counts: &[i64],
    kind: MemberKind,
) -> Result<Reduction, super::CharacterError> {
    let chi = Character::from_unmoved(g, counts, kind)?;
    let mut r = reduce(g, &chi);
    r.unmoved = Some((counts.to_vec(), kind));
    Ok(r)
}

/// The suggestions fitting a reduction: by unmoved counts when it came from a set of one kind,
/// otherwise single-class changes of χ.
pub fn suggest_reduction(g: &PointGroup, r: &Reduction) -> Vec<Suggestion> {
    match &r.unmoved {
        Some((counts, kind)) => suggest_unmoved(g, counts, *kind),
        None => suggest(g, &r.chi),
    }
}

/// Multiplicities, or the diagnosis with suggestions that respect the set's kind.
pub fn decompose_unmoved(
    g: &PointGroup,
    counts: &[i64],
    kind: MemberKind,
) -> Result<Vec<u64>, Invalid> {
    let chi = Character::from_unmoved(g, counts, kind).map_err(|_| Invalid {
        offending: Vec::new(),
        suggestions: Vec::new(),
    })?;
    reduce(g, &chi).multiplicities().map_err(|mut inv| {
        inv.suggestions = suggest_unmoved(g, counts, kind);
        inv
    })
}

/// Single-class changes of the unmoved counts of a set of `kind` that give a representation.
/// A set of n members leaves 0 … n of them in place under any operation and all n under E, so
/// only counts 0 ≤ k ≤ n of a class other than E are tried; the character is then k times the
/// kind's per-member contribution (1 for a permutation set — stretches, bends, scalars —, the
/// trace for Cartesian triples, trace − 1 for π pairs, det·trace for axial triples; Cotton,
/// 3rd ed., §10.2), so every character suggested is one such a set can have.
pub fn suggest_unmoved(g: &PointGroup, counts: &[i64], kind: MemberKind) -> Vec<Suggestion> {
    let Some(&n) = counts.first() else {
        return Vec::new();
    };
    let Ok(chi) = Character::from_unmoved(g, counts, kind) else {
        return Vec::new();
    };
    let mut out = Vec::new();
    for c in 1..counts.len() {
        let mut trial_counts = counts.to_vec();
        for k in 0..=n.max(0) {
            if k == counts[c] {
                continue;
            }
            trial_counts[c] = k;
            let Ok(trial) = Character::from_unmoved(g, &trial_counts, kind) else {
                continue;
            };
            if trial.0[c] == chi.0[c] {
                continue; // this class contributes 0 per member: the count does not show
            }
            if let Ok(m) = reduce(g, &trial).multiplicities() {
                out.push(Suggestion {
                    class: c,
                    from: chi.0[c].clone(),
                    to: trial.0[c].clone(),
                    multiplicities: m,
                    unmoved: Some((counts[c], k)),
                });
            }
        }
    }
    out.sort_by_key(|s| s.unmoved.map(|(a, b)| (a - b).abs()).unwrap_or(0));
    out.truncate(8);
    out
}

/// Multiplicities, or the full diagnosis with suggestions.
pub fn decompose(g: &PointGroup, chi: &Character) -> Result<Vec<u64>, Invalid> {
    let red = reduce(g, chi);
    red.multiplicities().map_err(|mut inv| {
        inv.suggestions = suggest(g, chi);
        inv
    })
}

/// Single-class changes of χ that give a valid non-negative integer decomposition.
pub fn suggest(g: &PointGroup, chi: &Character) -> Vec<Suggestion> {
    let dim = chi.0[0].re_f64().abs().round() as i64;
    let bound = dim.max(1) + 2;
    let mut out = Vec::new();
    for c in 0..chi.0.len() {
        let mut candidates: Vec<Cyclo> = (-bound..=bound).map(Cyclo::from_int).collect();
        // Values the irreps themselves take there (irrational classes).
        for ir in &g.table.irreps {
            let v = &ir.chars[c];
            if !v.is_rational() && !candidates.contains(v) {
                for k in -2..=2i64 {
                    candidates.push(v + &Cyclo::from_int(k));
                }
            }
        }
        for v in candidates {
            if v == chi.0[c] {
                continue;
            }
            // |χ(R)| ≤ χ(E) for every representation (a sum of χ(E) roots of unity).
            if c != 0 && {
                let (re, im) = v.to_c64();
                re.hypot(im) > dim as f64 + 1e-9
            } {
                continue;
            }
            let mut trial = chi.clone();
            trial.0[c] = v.clone();
            if let Ok(m) = reduce(g, &trial).multiplicities() {
                if m.iter().sum::<u64>() > 0 {
                    out.push(Suggestion {
                        class: c,
                        from: chi.0[c].clone(),
                        to: v,
                        multiplicities: m,
                        unmoved: None,
                    });
                }
            }
        }
    }
    // Smallest changes first.
    out.sort_by(|a, b| {
        let da = (&a.to - &a.from).re_f64().abs();
        let db = (&b.to - &b.from).re_f64().abs();
        da.total_cmp(&db)
    });
    out.truncate(8);
    out
}

/// `A1 + 2E` style text of multiplicities. A complex-conjugate pair with equal multiplicities
/// (1E + 2E) is written as the single real label E, as tables bracket them.
pub fn format_sum(g: &PointGroup, m: &[u64], unicode: bool) -> String {
    let mut parts: Vec<String> = Vec::new();
    for (i, n) in m.iter().enumerate() {
        if *n == 0 {
            continue;
        }
        let ir = &g.table.irreps[i];
        let mut label = ir.label.clone();
        if let Some(p) = ir.pair {
            if m.get(p) == Some(n) {
                if p < i {
                    continue;
                }
                label = pair_label(&label);
            }
        }
        let l = if unicode {
            crate::group::display_label(&label)
        } else {
            label
        };
        parts.push(super::gamma_text::write_term(g, *n, &l));
    }
    if parts.is_empty() {
        "0".into()
    } else {
        parts.join(" + ")
    }
}

/// Parse `A1 + 2E`, `T2`, `E'+A2''`, `Sigma+g + Piu` (ASCII or Unicode labels; `E` also names a
/// 1E+2E pair) into multiplicities in table order; the rules for multiplicities are those of
/// [`super::gamma_text`].
pub fn parse_gamma(g: &PointGroup, text: &str) -> Result<Vec<u64>, String> {
    super::gamma_text::parse_gamma(g, text).map_err(|e| e.to_string())
}

/// One term of a decomposition as a chemist reads it: label, multiplicity, dimension. A
/// complex-conjugate pair with equal multiplicities becomes one real degenerate term (E, dim 2).
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct RealTerm {
    pub label: String,
    pub multiplicity: u64,
    pub dimension: usize,
    /// Irrep indices the term stands for (two for a pair).
    pub irreps: Vec<usize>,
}

/// The non-zero terms of multiplicities `m`, pairs merged.
pub fn real_terms(g: &PointGroup, m: &[u64]) -> Vec<RealTerm> {
    let mut out = Vec::new();
    for (i, &n) in m.iter().enumerate() {
        if n == 0 {
            continue;
        }
        let ir = &g.table.irreps[i];
        match ir.pair {
            Some(p) if m.get(p) == Some(&n) => {
                if p < i {
                    continue;
                }
                out.push(RealTerm {
                    label: pair_label(&ir.label),
                    multiplicity: n,
                    dimension: 2 * ir.dim(),
                    irreps: vec![i, p],
                });
            }
            _ => out.push(RealTerm {
                label: ir.label.clone(),
                multiplicity: n,
                dimension: ir.dim(),
                irreps: vec![i],
            }),
        }
    }
    out
}
