//! Descent in symmetry: correlating the irreps of G with those of a subgroup type H, computed
//! from the operations (never typed in). The subgroups of type H are found among G's own
//! operations, grouped into conjugacy classes (one class = one way of embedding H), placed in
//! H's standard orientation, and every irrep of G is restricted and reduced in H. This is how
//! printed correlation tables are made (Wilson, Decius & Cross, *Molecular Vibrations*,
//! Appendix X; Herzberg 1945, ch. II).
//!
//! Linear groups go through `rep::restrictions` (D∞h → D2h, C∞v → C2v and their standard
//! subgroups with z along the molecular axis) and D∞h → C∞v by comparing characters.
//!
//! Owns: [`descend`], [`DescentReport`] and its parts.

use super::activity::{modes_report, ModesReport};
use super::embed::classes_in_subgroup;
use super::error::SpectraError;
use super::real::{is_centrosymmetric, real_character, real_irreps, to_real};
use super::subgroups::{conjugacy_classes, signature, subgroups_of_order};
use super::symmetry::{symmetry_of_rows, Symmetry};
use crate::exact::Cyclo;
use crate::group::{strip_count, OpSpec, PointGroup, Turn};
use crate::rep::{decompose, Character};
use num_bigint::BigInt;
use num_rational::BigRational;
use serde::Serialize;

/// Which class of G the operations of one class of H come from.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct ClassLink {
    pub subgroup_class: String,
    pub group_class: String,
}

/// One irrep of G and what it becomes in H.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct CorrelationRow {
    pub irrep: String,
    pub dimension: usize,
    pub becomes: Symmetry,
}

/// One fundamental set of Γ in G and what it becomes in H, with activity on both sides.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct ModeSplit {
    pub irrep: String,
    pub multiplicity: u64,
    pub dimension: usize,
    pub ir: bool,
    pub raman: bool,
    /// Symmetry in H of one mode set of this irrep.
    pub becomes: Symmetry,
    /// A degenerate set that splits into several levels in H.
    pub splits: bool,
}

/// One way of embedding H in G (a conjugacy class of subgroups).
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct Embedding {
    /// Number of subgroups of G in this conjugacy class.
    pub conjugates: usize,
    /// Classes of G met by the subgroup's operations (identity left out).
    pub contains: Vec<String>,
    pub class_map: Vec<ClassLink>,
    pub correlation: Vec<CorrelationRow>,
    /// With a Γ: how each fundamental set splits.
    pub modes: Vec<ModeSplit>,
    /// With a Γ: the full activity report in H.
    pub subgroup_modes: Option<ModesReport>,
    /// Linear groups: the embedding in words (which axis of H lies along the molecular axis).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub description: Option<String>,
    /// Linear groups: H's axis (x, y or z) that lies along the molecular axis.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub molecular_axis: Option<String>,
}

/// The correlation of G with H.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct DescentReport {
    pub group: String,
    pub subgroup: String,
    pub embeddings: Vec<Embedding>,
    pub note: String,
}

/// Correlate G with subgroup type H. `via` names a class of G whose operations the subgroup
/// must contain (`"sd"`, `"σd"`, `"C2''"`), or several separated by commas (`"C2,sd"`), all of
/// which must be met; `gamma` (multiplicities per row of G) adds how each
/// fundamental splits and the activity report in H.
pub fn descend(
    g: &PointGroup,
    h: &PointGroup,
    via: Option<&str>,
    gamma: Option<&[u64]>,
) -> Result<DescentReport, SpectraError> {
    if h.is_linear() && !g.is_linear() {
        return Err(not_sub(g, h, "a finite group has no linear subgroup"));
    }
    let mut report = if g.is_linear() {
        descend_linear(g, h, via)?
    } else {
        descend_finite(g, h, via)?
    };
    if let Some(rows) = gamma {
        let real = to_real(g, rows)?;
        let reals = real_irreps(g);
        let activity = super::activity::activity_table(g);
        let h_reals = real_irreps(h);
        for e in &mut report.embeddings {
            let mut total = vec![0u64; h.table.irreps.len()];
            for (((r, row), n), act) in reals.iter().zip(&e.correlation).zip(&real).zip(&activity) {
                if *n == 0 {
                    continue;
                }
                for t in &row.becomes.terms {
                    let hr = super::real::real_index(h, &t.irrep)
                        .ok_or_else(|| internal(g, "subgroup label not found"))?;
                    for &i in &h_reals[hr].rows {
                        total[i] += n * t.multiplicity;
                    }
                }
                e.modes.push(ModeSplit {
                    irrep: r.label.clone(),
                    multiplicity: *n,
                    dimension: r.dim,
                    ir: act.ir,
                    raman: act.raman,
                    splits: row.becomes.terms.len() > 1
                        || row.becomes.terms.iter().any(|t| t.multiplicity > 1),
                    becomes: row.becomes.clone(),
                });
            }
            e.subgroup_modes = Some(modes_report(h, &total)?);
        }
    }
    Ok(report)
}

/// Convenience: load both groups by name and read Γ from text.
pub fn descend_names(
    group: &str,
    subgroup: &str,
    via: Option<&str>,
    gamma: Option<&str>,
) -> Result<DescentReport, SpectraError> {
    let g = crate::group::load(group)?;
    let h = crate::group::load(subgroup)?;
    let rows = gamma.map(|t| super::real::parse_gamma(&g, t)).transpose()?;
    descend(&g, &h, via, rows.as_deref())
}

fn not_sub(g: &PointGroup, h: &PointGroup, reason: &str) -> SpectraError {
    SpectraError::NotASubgroup {
        group: g.name().into(),
        subgroup: h.name().into(),
        reason: reason.into(),
    }
}

fn internal(g: &PointGroup, message: &str) -> SpectraError {
    SpectraError::Internal {
        group: g.name().into(),
        message: message.into(),
    }
}

const FINITE_NOTE: &str = "Computed from the operations: each subgroup of this type among the \
group's operations is placed in the subgroup's standard orientation (its table's axes), so its \
labels mean what its table means. Where the subgroup's own symmetry allows two orientations \
(e.g. σv(xz) vs σv'(yz)), labels such as B1/B2 swap with that choice.";

fn descend_finite(
    g: &PointGroup,
    h: &PointGroup,
    via: Option<&str>,
) -> Result<DescentReport, SpectraError> {
    let want = signature(h.ops.iter().map(|o| &o.float));
    let subs: Vec<_> = subgroups_of_order(g, h.order())
        .into_iter()
        .filter(|k| signature(k.iter().map(|&i| &g.ops[i].float)) == want)
        .collect();
    if subs.is_empty() {
        return Err(not_sub(g, h, "no set of its operations forms that group"));
    }
    // `via` may name several classes, comma-separated: all must be met.
    let via_classes: Vec<Vec<usize>> = via
        .map(|v| v.split(',').map(|p| resolve_class(g, p)).collect())
        .transpose()?
        .unwrap_or_default();
    let g_reals = real_irreps(g);
    let g_chars: Vec<Character> = g_reals.iter().map(|r| real_character(g, r)).collect();
    let mut embeddings = Vec::new();
    for class in conjugacy_classes(g, &subs) {
        let k = &class[0];
        let Some(h_class_of) = classes_in_subgroup(g, h, k) else {
            continue;
        };
        if !via_classes
            .iter()
            .all(|vc| k.iter().any(|&i| vc.contains(&g.ops[i].class)))
        {
            continue;
        }
        // For each class of H, the class of G its operations come from.
        let mut link = vec![usize::MAX; h.n_classes()];
        for (j, &gi) in k.iter().enumerate() {
            link[h_class_of[j]] = g.ops[gi].class;
        }
        if link.contains(&usize::MAX) {
            return Err(internal(g, "a class of the subgroup got no operation"));
        }
        let mut correlation = Vec::new();
        for (r, chi) in g_reals.iter().zip(&g_chars) {
            let restricted = Character(link.iter().map(|&c| chi.0[c].clone()).collect());
            let rows = decompose(h, &restricted)
                .map_err(|_| internal(g, "a restricted irrep did not reduce"))?;
            correlation.push(CorrelationRow {
                irrep: r.label.clone(),
                dimension: r.dim,
                becomes: symmetry_of_rows(h, &rows)?,
            });
        }
        let mut contains: Vec<usize> = k.iter().map(|&i| g.ops[i].class).collect();
        contains.sort();
        contains.dedup();
        embeddings.push(Embedding {
            conjugates: class.len(),
            contains: contains
                .into_iter()
                .filter(|&c| c != 0)
                .map(|c| g.table.classes[c].ascii.clone())
                .collect(),
            class_map: link
                .iter()
                .enumerate()
                .map(|(hc, &gc)| ClassLink {
                    subgroup_class: h.table.classes[hc].ascii.clone(),
                    group_class: g.table.classes[gc].ascii.clone(),
                })
                .collect(),
            correlation,
            modes: Vec::new(),
            subgroup_modes: None,
            description: None,
            molecular_axis: None,
        });
    }
    if embeddings.is_empty() {
        return Err(not_sub(
            g,
            h,
            &match via {
                Some(v) => format!("no such subgroup contains operations of class(es) '{v}'"),
                None => "no orientation of its standard operations fits".to_string(),
            },
        ));
    }
    Ok(DescentReport {
        group: g.name().into(),
        subgroup: h.name().into(),
        embeddings,
        note: FINITE_NOTE.into(),
    })
}

/// `σd` → `sd`, `C₂″` → `C2''`, `2S₄` → `2S4`.
fn normalize(s: &str) -> String {
    let mut out = String::new();
    for c in s.chars() {
        match c {
            '₀'..='₉' => {
                out.push(char::from_u32(c as u32 - '₀' as u32 + '0' as u32).unwrap_or(c))
            }
            'σ' => out.push('s'),
            'ᵥ' => out.push('v'),
            'ₕ' => out.push('h'),
            'ᵈ' => out.push('d'),
            '′' => out.push('\''),
            '″' => out.push_str("''"),
            '∞' => out.push_str("inf"),
            '_' | ' ' => {}
            c => out.push(c),
        }
    }
    out
}

/// Classes of G named by `via`: a full class name (`3C2`, `2sd`) or one without its count
/// (`C2''`, `σd`); a parenthesised remark in a class name (`3C2(=C4^2)`) is optional.
fn resolve_class(g: &PointGroup, via: &str) -> Result<Vec<usize>, SpectraError> {
    let v = normalize(via.trim());
    let forms = |s: &str| -> Vec<String> {
        let n = normalize(s);
        let short = n.split('(').next().unwrap_or("").to_string();
        vec![n, short]
    };
    let names: Vec<Vec<String>> = g
        .table
        .classes
        .iter()
        .flat_map(|c| [forms(&c.ascii), forms(&c.symbol)])
        .collect::<Vec<_>>()
        .chunks(2)
        .map(|p| p.concat())
        .collect();
    let pick = |eq: &dyn Fn(&str) -> bool| -> Vec<usize> {
        (0..names.len())
            .filter(|&i| names[i].iter().any(|n| eq(n)))
            .collect()
    };
    let tries: [&dyn Fn(&str) -> bool; 3] = [&|n| n == v, &|n| strip_count(n) == v, &|n| {
        strip_count(n).eq_ignore_ascii_case(&v)
    }];
    for eq in tries {
        let found = pick(eq);
        match found.len() {
            0 => continue,
            1 => return Ok(found),
            _ => {
                return Err(SpectraError::AmbiguousClass {
                    group: g.name().into(),
                    via: via.into(),
                    matches: found
                        .iter()
                        .map(|&i| g.table.classes[i].ascii.clone())
                        .collect::<Vec<_>>()
                        .join(", "),
                })
            }
        }
    }
    Err(SpectraError::NoSuchClass {
        group: g.name().into(),
        via: via.into(),
        known: g
            .table
            .classes
            .iter()
            .map(|c| c.ascii.as_str())
            .collect::<Vec<_>>()
            .join(" "),
    })
}

fn descend_linear(
    g: &PointGroup,
    h: &PointGroup,
    via: Option<&str>,
) -> Result<DescentReport, SpectraError> {
    if via.is_some() {
        return Err(SpectraError::Unsupported {
            group: g.name().into(),
            message: "`via` is not used for the linear groups: the subgroup stands with z along \
                      the molecular axis"
                .into(),
        });
    }
    if !h.is_linear() {
        let embeddings = super::linear_embed::linear_embeddings(g, h)?;
        if embeddings.is_empty() {
            return Err(not_sub(
                g,
                h,
                if is_centrosymmetric(g) {
                    "no placement of its operations keeps the molecular axis as a line"
                } else {
                    "no placement of its operations keeps the molecular axis and its direction"
                },
            ));
        }
        return Ok(DescentReport {
            group: g.name().into(),
            subgroup: h.name().into(),
            embeddings,
            note: LINEAR_NOTE.into(),
        });
    }
    Ok(DescentReport {
        group: g.name().into(),
        subgroup: h.name().into(),
        embeddings: vec![Embedding {
            conjugates: 1,
            contains: Vec::new(),
            class_map: Vec::new(),
            correlation: linear_to_linear(g, h)?,
            modes: Vec::new(),
            subgroup_modes: None,
            description: None,
            molecular_axis: None,
        }],
        note: "Computed by comparing the characters of the two linear groups.".into(),
    })
}

const LINEAR_NOTE: &str = "Computed from the operations: each placement of the subgroup's \
operations that keeps the molecular axis is classified (rotation by φ about the axis, σv \
containing it, C2 across it, i, S(φ)) and every species restricted by its characters there \
(2cos Λφ at rotations; Herzberg 1945, ch. II). Γ (Λ = 4) is added though the table stops at Φ.";

/// D∞h → C∞v: C∞v's classes (E, C∞^φ, σv) are classes of D∞h (matched by kind of operation);
/// compare characters exactly at several angles. (Also G → G.)
fn linear_to_linear(g: &PointGroup, h: &PointGroup) -> Result<Vec<CorrelationRow>, SpectraError> {
    let kind = |o: &OpSpec| match o {
        OpSpec::Identity => 0,
        OpSpec::Rotation {
            turn: Turn::Phi, ..
        } => 1,
        OpSpec::Reflection { .. } => 2,
        OpSpec::Inversion => 3,
        OpSpec::Improper {
            turn: Turn::Phi, ..
        } => 4,
        OpSpec::Rotation { .. } => 5,
        OpSpec::Improper { .. } => 6,
    };
    let link: Vec<usize> = h
        .table
        .classes
        .iter()
        .map(|hc| {
            g.table
                .classes
                .iter()
                .position(|gc| kind(&gc.op) == kind(&hc.op))
        })
        .collect::<Option<_>>()
        .ok_or_else(|| not_sub(g, h, "its classes are not classes of the group"))?;
    let angles: Vec<BigRational> = [(1, 7), (2, 7), (1, 5), (1, 12)]
        .iter()
        .map(|&(p, q)| BigRational::new(BigInt::from(p), BigInt::from(q)))
        .collect();
    let eval = |grp: &PointGroup, i: usize| -> Result<Vec<Vec<Cyclo>>, SpectraError> {
        angles
            .iter()
            .map(|a| grp.table.chars_at(i, a).map_err(|m| internal(grp, &m)))
            .collect()
    };
    let h_vals: Vec<Vec<Vec<Cyclo>>> = (0..h.table.irreps.len())
        .map(|j| eval(h, j))
        .collect::<Result<_, _>>()?;
    real_irreps(g)
        .iter()
        .map(|r| {
            let gv = eval(g, r.rows[0])?;
            let restricted: Vec<Vec<Cyclo>> = gv
                .iter()
                .map(|v| link.iter().map(|&c| v[c].clone()).collect())
                .collect();
            let j = h_vals
                .iter()
                .position(|hv| *hv == restricted)
                .ok_or_else(|| internal(g, &format!("{} restricts to no irrep", r.label)))?;
            let mut rows = vec![0u64; h.table.irreps.len()];
            rows[j] = 1;
            Ok(CorrelationRow {
                irrep: r.label.clone(),
                dimension: r.dim,
                becomes: symmetry_of_rows(h, &rows)?,
            })
        })
        .collect()
}

/// A subgroup type of G and how many inequivalent ways it sits in G.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct SubgroupType {
    pub name: String,
    pub order: usize,
    /// Conjugacy classes of such subgroups (ways of embedding).
    pub embeddings: usize,
}

/// Every table group that occurs as a proper subgroup of G, with its number of embeddings,
/// found among G's operations (order, then table order). For the linear groups: the finite
/// standard subgroups the route through `rep::restrictions` supports, and C∞v in D∞h.
pub fn subgroup_types(g: &PointGroup) -> Result<Vec<SubgroupType>, SpectraError> {
    let mut out = Vec::new();
    for name in crate::group::names() {
        let h = crate::group::load(name)?;
        if name == g.name() || (h.is_linear() && !g.is_linear()) {
            continue;
        }
        if !g.is_linear() && (h.order() >= g.order() || g.order() % h.order() != 0) {
            continue;
        }
        match descend(g, &h, None, None) {
            Ok(r) => out.push(SubgroupType {
                name: name.to_string(),
                order: h.order(),
                embeddings: r.embeddings.len(),
            }),
            Err(SpectraError::NotASubgroup { .. }) => {}
            Err(e) => return Err(e),
        }
    }
    out.sort_by_key(|t| t.order);
    Ok(out)
}
