//! What if the symmetry were lower: the session's group G lowered to a subgroup H placed in one
//! chosen way. For every member set: Γ before (G) and after (H, reduced), the IR/Raman activity
//! and band counts of the fundamentals it describes, and the ticks carried to H; the session's
//! Γvib (when it is in G) before and after.
//!
//! Ticks are carried through the placement, never by class label: a class of H lies in one
//! class of G ([`crate::spectra::Placement`]), so the number of members its operation leaves in
//! place is G's count there and χ in H is the restriction of χ in G (Wilson, Decius & Cross,
//! *Molecular Vibrations*, Appendix X). When the session's geometry is in G and a member names
//! its atoms, the member is ticked from the geometry instead: the atom permutation of the very
//! operation of G that H's chosen operation lands on.
//!
//! Each way is described from its operations: rotation axes and mirror planes, through which
//! atoms of the geometry they pass, else their directions in G's standard orientation.
//!
//! Owns: [`ways`], [`lower`], [`lowered_session`]. UI-free.

use super::set::{analyze_set, SetAnalysis};
use super::ticks::stays;
use super::{Analysis, Depth};
use crate::exact::Cyclo;
use crate::group::{self, PointGroup};
use crate::rep::{self, Character};
use crate::session::{Member, MemberSet, Session, SetKind};
use crate::spectra::{self, ModesReport, Placement};
use crate::survey::Survey;
use nalgebra::{Matrix3, Vector3};
use std::sync::Arc;

/// One way of lowering G: a subgroup type and one of its placements, in words.
#[derive(Debug, Clone, PartialEq)]
pub struct Way {
    pub subgroup: String,
    pub placement: Placement,
    /// The subgroup's symmetry elements in chemists' words.
    pub description: String,
}

/// One member set before and after.
#[derive(Debug, Clone, PartialEq)]
pub struct SetLowering {
    pub name: String,
    pub kind: SetKind,
    /// Γ in G and in H (ASCII labels), when the set reduces.
    pub before: Option<String>,
    pub after: Option<String>,
    pub modes_before: Option<ModesReport>,
    pub modes_after: Option<ModesReport>,
    /// The members with their ticks in H (ASCII class symbols).
    pub members: Vec<Member>,
    /// How the ticks were carried, in words.
    pub ticks_from: String,
}

/// The whole what-if.
#[derive(Debug, Clone, PartialEq)]
pub struct Lowering {
    pub group: String,
    pub subgroup: String,
    pub description: String,
    pub sets: Vec<SetLowering>,
    /// The session's Γvib (when it is expressed in G) before and after.
    pub vibrations: Option<(ModesReport, ModesReport)>,
    /// Where Γvib comes from.
    pub vibrations_from: Option<String>,
}

/// The geometry's survey, when it is in the session's own finite group (then its atom
/// permutations follow G's operation list).
fn survey_in(a: &Analysis) -> Option<&Survey> {
    let sv = a.geometry.as_ref()?.survey.as_ref().ok()?;
    (sv.group.name() == a.group.name()
        && !a.group.is_linear()
        && sv.working.name() == a.group.name()
        && sv.permutations.len() == a.group.ops.len())
    .then_some(&**sv)
}

/// Every way the session's group can be lowered, smaller groups last.
pub fn ways(a: &Analysis) -> Result<Vec<Way>, String> {
    let g = &a.group;
    if g.is_linear() {
        return Err(format!(
            "{} is linear: lower it with `salcdesk descend` on the command line",
            g.name()
        ));
    }
    let atoms = survey_in(a).map(atoms_of);
    let mut out = Vec::new();
    let types = spectra::subgroup_types(g).map_err(|e| e.to_string())?;
    for t in types.iter().rev() {
        let h = group::load(&t.name).map_err(|e| e.to_string())?;
        for p in spectra::placements(g, &h) {
            let description = describe(g, &h, &p, atoms.as_deref());
            out.push(Way {
                subgroup: t.name.clone(),
                placement: p,
                description,
            });
        }
    }
    Ok(out)
}

/// (symbol, position) of each atom of the oriented molecule (G's standard orientation).
fn atoms_of(sv: &Survey) -> Vec<(String, Vector3<f64>)> {
    sv.oriented
        .molecule
        .atoms
        .iter()
        .map(|a| (a.symbol().to_string(), a.position))
        .collect()
}

const ON: f64 = 0.05; // Å: an atom this close to an axis or plane lies on it

#[derive(Debug, Clone)]
enum Element {
    Rotation(u32, Vector3<f64>),
    Mirror(Vector3<f64>),
    Improper(u32, Vector3<f64>),
    Inversion,
}

/// Axis of det·R (None for E and i) and the order of its turn.
fn element_of(m: &Matrix3<f64>) -> Option<Element> {
    let det = m.determinant().signum();
    let p = m * det;
    if (p - Matrix3::identity()).abs().max() < 1e-6 {
        return (det < 0.0).then_some(Element::Inversion);
    }
    let cos = ((p.trace() - 1.0) / 2.0).clamp(-1.0, 1.0);
    let angle = cos.acos();
    let n = (2.0 * std::f64::consts::PI / angle).round() as u32;
    let skew = Vector3::new(
        p[(2, 1)] - p[(1, 2)],
        p[(0, 2)] - p[(2, 0)],
        p[(1, 0)] - p[(0, 1)],
    );
    let axis = if skew.norm() > 1e-6 {
        skew.normalize()
    } else {
        let s = (p + Matrix3::identity()) * 0.5;
        let k = (0..3)
            .max_by(|&a, &b| s[(a, a)].total_cmp(&s[(b, b)]))
            .unwrap_or(0);
        s.column(k).normalize()
    };
    Some(if det > 0.0 {
        Element::Rotation(n, axis)
    } else if n == 2 {
        Element::Mirror(axis)
    } else {
        // det·R turns by 2π/n; the improper operation itself is S(2n) when n is odd.
        Element::Improper(if n % 2 == 1 { 2 * n } else { n }, axis)
    })
}

fn parallel(a: &Vector3<f64>, b: &Vector3<f64>) -> bool {
    a.cross(b).norm() < 1e-4
}

/// G has one principal axis (z in its standard orientation): not the cubic groups.
fn has_principal_axis(g: &PointGroup) -> bool {
    let n = g.name();
    !(n.starts_with('T') || n.starts_with('O') || n.starts_with('I'))
        && g.ops.iter().any(|o| {
            matches!(element_of(&o.float), Some(Element::Rotation(k, _)) if k > 2)
                || matches!(element_of(&o.float), Some(Element::Improper(k, _)) if k > 2)
        })
}

/// A direction of the standard orientation in words.
fn direction(u: &Vector3<f64>) -> String {
    let names = [
        (Vector3::x(), "x"),
        (Vector3::y(), "y"),
        (Vector3::z(), "z"),
        (Vector3::new(1.0, 1.0, 0.0), "between x and y"),
        (Vector3::new(1.0, -1.0, 0.0), "between x and −y"),
        (Vector3::new(1.0, 1.0, 1.0), "the (1,1,1) diagonal"),
        (Vector3::new(1.0, 1.0, -1.0), "the (1,1,−1) diagonal"),
        (Vector3::new(1.0, -1.0, 1.0), "the (1,−1,1) diagonal"),
        (Vector3::new(-1.0, 1.0, 1.0), "the (−1,1,1) diagonal"),
    ];
    for (v, n) in names {
        if parallel(&v, u) {
            return n.to_string();
        }
    }
    format!("({:.2}, {:.2}, {:.2})", u.x, u.y, u.z)
}

/// The atoms (1-based) off the centre that lie on the line along `u`, or in the plane normal
/// to `n`, and the centre atom's symbol.
fn atoms_on(atoms: &[(String, Vector3<f64>)], test: impl Fn(&Vector3<f64>) -> bool) -> Vec<usize> {
    atoms
        .iter()
        .enumerate()
        .filter(|(_, (_, p))| p.norm() > ON && test(p))
        .map(|(i, _)| i + 1)
        .collect()
}

fn list(v: &[usize]) -> String {
    v.iter()
        .map(|i| i.to_string())
        .collect::<Vec<_>>()
        .join(", ")
}

/// "along Pt–Cl (atoms 2, 4)" or "through atoms 2, 4" or "through no atom".
fn through(atoms: &[(String, Vector3<f64>)], on: &[usize]) -> String {
    if on.is_empty() {
        return "between the bonds (no atom on it)".into();
    }
    let centre = atoms.iter().find(|(_, p)| p.norm() <= ON).map(|(s, _)| s);
    let first = &atoms[on[0] - 1].0;
    match centre {
        Some(c) if on.iter().all(|&i| &atoms[i - 1].0 == first) => {
            format!("along the {c}–{first} bond (atoms {})", list(on))
        }
        _ => format!("through atoms {}", list(on)),
    }
}

fn phrase(e: &Element, principal: bool, atoms: Option<&[(String, Vector3<f64>)]>) -> String {
    let z = Vector3::z();
    let line = |u: &Vector3<f64>| -> String {
        let rel = if principal && parallel(u, &z) {
            "the principal axis"
        } else if principal && u.dot(&z).abs() < 1e-4 {
            "perpendicular to the principal axis"
        } else {
            ""
        };
        match atoms {
            Some(at) => {
                let on = atoms_on(at, |p| p.cross(u).norm() < ON);
                let where_ = if rel == "the principal axis" && on.is_empty() {
                    String::new()
                } else {
                    through(at, &on)
                };
                match (rel, where_.is_empty()) {
                    ("", _) => where_,
                    ("the principal axis", true) => "along the principal axis".into(),
                    ("the principal axis", false) => format!("along the principal axis, {where_}"),
                    (r, _) => format!("{r}, {where_}"),
                }
            }
            None => {
                let d = direction(u);
                let along = if d.starts_with("between") {
                    d
                } else {
                    format!("along {d}")
                };
                match rel {
                    "the principal axis" => format!("{along} (the principal axis)"),
                    "" => along,
                    r => format!("{along}, {r}"),
                }
            }
        }
    };
    match e {
        Element::Inversion => "inversion centre".into(),
        Element::Rotation(n, u) => format!("C{n} {}", line(u)),
        Element::Improper(n, u) => format!("S{n} {}", line(u)),
        Element::Mirror(n) => {
            let contains_z = principal && n.dot(&z).abs() < 1e-4;
            let perp_z = principal && parallel(n, &z);
            match atoms {
                Some(at) => {
                    let on = atoms_on(at, |p| p.dot(n).abs() < ON);
                    let what = if on.is_empty() {
                        "no atom off the centre (between the bonds)".to_string()
                    } else {
                        format!("atoms {}", list(&on))
                    };
                    if perp_z {
                        format!("σ perpendicular to the principal axis, containing {what}")
                    } else if contains_z {
                        format!("σ containing the principal axis and {what}")
                    } else {
                        format!("σ containing {what}")
                    }
                }
                None => {
                    let side = if principal {
                        " (containing the principal axis)"
                    } else {
                        ""
                    };
                    if parallel(n, &z) {
                        let perp = if principal {
                            " (perpendicular to the principal axis)"
                        } else {
                            ""
                        };
                        format!("σ in the xy plane{perp}")
                    } else if n.dot(&z).abs() < 1e-4 {
                        let d = z.cross(n).normalize();
                        if parallel(&d, &Vector3::x()) {
                            format!("σ in the xz plane{side}")
                        } else if parallel(&d, &Vector3::y()) {
                            format!("σ in the yz plane{side}")
                        } else {
                            format!("σ containing z and the line {}{side}", direction(&d))
                        }
                    } else {
                        format!("σ normal to {}", direction(n))
                    }
                }
            }
        }
    }
}

/// The subgroup's elements in words: one entry per rotation axis (its highest order), per
/// mirror plane, the centre of inversion and improper axes not along a rotation axis.
fn describe(
    g: &PointGroup,
    h: &PointGroup,
    p: &Placement,
    atoms: Option<&[(String, Vector3<f64>)]>,
) -> String {
    let mut rot: Vec<(u32, Vector3<f64>)> = Vec::new();
    let mut mirrors: Vec<Vector3<f64>> = Vec::new();
    let mut improper: Vec<(u32, Vector3<f64>)> = Vec::new();
    let mut inversion = false;
    for &gi in &p.ops {
        match element_of(&g.ops[gi].float) {
            Some(Element::Rotation(n, u)) => match rot.iter_mut().find(|(_, v)| parallel(v, &u)) {
                Some(r) => r.0 = r.0.max(n),
                None => rot.push((n, u)),
            },
            Some(Element::Mirror(n)) if !mirrors.iter().any(|m| parallel(m, &n)) => mirrors.push(n),
            Some(Element::Mirror(_)) => {}
            Some(Element::Improper(n, u)) => {
                match improper.iter_mut().find(|(_, v)| parallel(v, &u)) {
                    Some(r) => r.0 = r.0.max(n),
                    None => improper.push((n, u)),
                }
            }
            Some(Element::Inversion) => inversion = true,
            None => {}
        }
    }
    if h.order() == 1 {
        return "no symmetry left (only E)".into();
    }
    rot.sort_by_key(|r| std::cmp::Reverse(r.0));
    let principal = has_principal_axis(g);
    // An improper axis of higher order than the rotation along it (S4 over C2) is named instead.
    let higher = |n: u32, u: &Vector3<f64>| {
        improper
            .iter()
            .find(|(k, v)| *k > n && parallel(u, v))
            .copied()
    };
    let mut parts: Vec<String> = rot
        .iter()
        .map(|(n, u)| match higher(*n, u) {
            Some((k, v)) => phrase(&Element::Improper(k, v), principal, atoms),
            None => phrase(&Element::Rotation(*n, *u), principal, atoms),
        })
        .collect();
    parts.extend(
        improper
            .iter()
            .filter(|(_, u)| !rot.iter().any(|(_, v)| parallel(u, v)))
            .map(|(n, u)| phrase(&Element::Improper(*n, *u), principal, atoms)),
    );
    parts.extend(
        mirrors
            .iter()
            .map(|n| phrase(&Element::Mirror(*n), principal, atoms)),
    );
    if inversion {
        parts.push("inversion centre".into());
    }
    // The same words twice (two σ between the bonds) are said once, counted.
    let mut counted: Vec<(String, usize)> = Vec::new();
    for p in parts {
        match counted.iter_mut().find(|(q, _)| *q == p) {
            Some(c) => c.1 += 1,
            None => counted.push((p, 1)),
        }
    }
    let mut parts: Vec<String> = counted
        .into_iter()
        .map(|(p, n)| if n > 1 { format!("{n} × {p}") } else { p })
        .collect();
    const MOST: usize = 4;
    let more = parts.len().saturating_sub(MOST);
    parts.truncate(MOST);
    let mut text = parts.join("; ");
    if more > 0 {
        text.push_str(&format!("; and {more} more"));
    }
    if p.conjugates > 1 {
        text.push_str(&format!(" (one of {} alike)", p.conjugates));
    }
    text
}

/// χ in G of a Γ given per table row.
fn character_of_rows(g: &PointGroup, rows: &[u64]) -> Character {
    let nc = g.table.classes.len();
    let mut chi = vec![Cyclo::from_int(0); nc];
    for (r, &n) in g.table.irreps.iter().zip(rows) {
        if n == 0 {
            continue;
        }
        for (c, x) in chi.iter_mut().enumerate() {
            *x = &*x + &(&r.chars[c] * &Cyclo::from_int(n as i64));
        }
    }
    Character(chi)
}

/// A Γ of G (per table row) restricted to H through the placement and reduced.
pub fn restrict_rows(
    g: &PointGroup,
    h: &PointGroup,
    p: &Placement,
    rows: &[u64],
) -> Result<Vec<u64>, String> {
    let chi = character_of_rows(g, rows);
    let restricted = Character(p.link.iter().map(|&c| chi.0[c].clone()).collect());
    rep::decompose(h, &restricted).map_err(|_| {
        format!(
            "internal: a Γ of {} did not reduce in {}",
            g.name(),
            h.name()
        )
    })
}

/// Ticks of one member in H: from the geometry when it names usable atoms, else through the
/// placement (G's tick of the class each class of H lies in).
fn carried_member(
    g: &PointGroup,
    h: &PointGroup,
    p: &Placement,
    kind: SetKind,
    member: &Member,
    grid_row: &[bool],
    survey: Option<&Survey>,
) -> (Member, bool) {
    let n_atoms = survey.map_or(0, |sv| sv.oriented.molecule.atoms.len());
    let geometric = match (survey, &member.atoms) {
        (Some(sv), Some(at))
            if at.len() == kind.atoms_per_member()
                && at.iter().all(|&a| a >= 1 && a <= n_atoms) =>
        {
            let zero: Vec<usize> = at.iter().map(|a| a - 1).collect();
            Some(
                (0..h.n_classes())
                    .map(|c| {
                        let j = h.ops.iter().position(|o| o.class == c).unwrap_or(0);
                        stays(kind, &zero, &sv.permutations[p.ops[j]])
                    })
                    .collect::<Vec<bool>>(),
            )
        }
        _ => None,
    };
    let from_geometry = geometric.is_some();
    let row: Vec<bool> = geometric.unwrap_or_else(|| {
        p.link
            .iter()
            .map(|&gc| grid_row.get(gc).copied().unwrap_or(false))
            .collect()
    });
    let _ = g;
    let mut unmoved_by: Vec<String> = h
        .table
        .classes
        .iter()
        .zip(&row)
        .filter(|(_, &on)| on)
        .map(|(c, _)| c.ascii.clone())
        .collect();
    if !unmoved_by.iter().any(|c| c == "E") {
        unmoved_by.insert(0, "E".into());
    }
    (
        Member {
            name: member.name.clone(),
            unmoved_by,
            atoms: member.atoms.clone(),
        },
        from_geometry,
    )
}

fn modes_of(sa: &SetAnalysis) -> Option<ModesReport> {
    sa.modes.as_ref().and_then(|m| m.as_ref().ok()).cloned()
}

fn gamma_of(g: &PointGroup, sa: &SetAnalysis) -> Option<String> {
    sa.multiplicities()
        .map(|m| spectra::symmetry_of_rows(g, m).map(|s| s.text))
        .and_then(|r| r.ok())
}

/// The what-if of lowering the session's group to `way`.
pub fn lower(session: &Session, a: &Analysis, way: &Way) -> Result<Lowering, String> {
    let g = &a.group;
    let h = group::load(&way.subgroup).map_err(|e| e.to_string())?;
    let p = &way.placement;
    let survey = survey_in(a);
    let mut sets = Vec::new();
    for (set, sa) in session.sets.iter().zip(&a.sets) {
        let mut geo = 0;
        let members: Vec<Member> = set
            .members
            .iter()
            .enumerate()
            .map(|(mi, m)| {
                let (m2, from_geo) = carried_member(
                    g,
                    &h,
                    p,
                    set.kind,
                    m,
                    sa.grid.get(mi).map(|r| r.as_slice()).unwrap_or(&[]),
                    survey,
                );
                geo += usize::from(from_geo);
                m2
            })
            .collect();
        let lowered = MemberSet {
            name: set.name.clone(),
            kind: set.kind,
            members: members.clone(),
        };
        let after = analyze_set(&h, &lowered, Depth::Full);
        let n = members.len();
        let ticks_from = if n == 0 {
            "no members".to_string()
        } else if geo == n {
            "every member from the geometry (its atoms)".to_string()
        } else if geo == 0 {
            format!(
                "through the classes: each class of {} lies in one class of {}",
                h.name(),
                g.name()
            )
        } else {
            format!("{geo} of {n} members from the geometry, the rest through the classes")
        };
        sets.push(SetLowering {
            name: set.name.clone(),
            kind: set.kind,
            before: gamma_of(g, sa),
            after: gamma_of(&h, &after),
            modes_before: modes_of(sa),
            modes_after: modes_of(&after),
            members,
            ticks_from,
        });
    }
    let mut vibrations = None;
    let mut vibrations_from = None;
    if let Some(sp) = &a.spectra {
        if sp.group.name() == g.name() {
            if let Ok(before) = &sp.modes {
                let rows = restrict_rows(g, &h, p, &sp.rows)?;
                let after = spectra::modes_report(&h, &rows).map_err(|e| e.to_string())?;
                vibrations = Some((before.clone(), after));
                vibrations_from = Some(sp.source.clone());
            }
        }
    }
    Ok(Lowering {
        group: g.name().to_string(),
        subgroup: h.name().to_string(),
        description: way.description.clone(),
        sets,
        vibrations,
        vibrations_from,
    })
}

/// The session with its group lowered: group H, every set's ticks as carried.
pub fn lowered_session(session: &Session, l: &Lowering) -> Session {
    let mut s = session.clone();
    s.group = Some(l.subgroup.clone());
    for (set, sl) in s.sets.iter_mut().zip(&l.sets) {
        set.members = sl.members.clone();
    }
    s
}

/// The session's group changed by hand to `new`: ticks are kept only where they are
/// determined — through the one way `new` sits in the old group, or from the geometry for
/// members that name their atoms when the geometry is in `new` — and cleared (E only)
/// otherwise. Returns the new session and what was done, in words.
pub fn regroup(
    session: &Session,
    a: Option<&Analysis>,
    new: &Arc<PointGroup>,
    base: Option<&std::path::Path>,
) -> (Session, String) {
    let ticked = session
        .sets
        .iter()
        .flat_map(|s| &s.members)
        .any(|m| m.unmoved_by.iter().any(|c| c != "E"));
    // No group before: the ticks were typed for no table; keep those naming classes of `new`.
    let Some(a) = a.filter(|a| session.group.as_deref() == Some(a.group.name())) else {
        let mut s = session.clone();
        s.group = Some(new.name().to_string());
        for m in s.sets.iter_mut().flat_map(|s| &mut s.members) {
            m.unmoved_by
                .retain(|c| c == "E" || new.table.classes.iter().any(|k| &k.ascii == c));
        }
        return (s, String::new());
    };
    let g = &a.group;
    if !ticked {
        let mut s = session.clone();
        s.group = Some(new.name().to_string());
        return (s, String::new());
    }
    let ways = if !g.is_linear() && !new.is_linear() && g.order() % new.order() == 0 {
        spectra::placements(g, new)
    } else {
        Vec::new()
    };
    if ways.len() == 1 && new.order() < g.order() {
        let way = Way {
            subgroup: new.name().to_string(),
            placement: ways[0].clone(),
            description: String::new(),
        };
        if let Ok(l) = lower(session, a, &way) {
            return (
                lowered_session(session, &l),
                format!(
                    "; ticks carried: {} sits in {} one way only",
                    new.name(),
                    g.name()
                ),
            );
        }
    }
    // Not determined by the classes: clear, then take the geometry's ticks where it can give them.
    let mut s = session.clone();
    s.group = Some(new.name().to_string());
    for m in s.sets.iter_mut().flat_map(|s| &mut s.members) {
        m.unmoved_by = vec!["E".into()];
    }
    let mut from_geometry = 0;
    if let Ok(after) = super::analyze_in(&s, Depth::Quick, base) {
        for (set, sa) in s.sets.iter_mut().zip(&after.sets) {
            for (m, exp) in set.members.iter_mut().zip(&sa.geometry_ticks.expected) {
                if let Some(row) = exp {
                    m.unmoved_by = new
                        .table
                        .classes
                        .iter()
                        .zip(row)
                        .filter(|(_, &on)| on)
                        .map(|(c, _)| c.ascii.clone())
                        .collect();
                    from_geometry += 1;
                }
            }
        }
    }
    let why = if ways.len() > 1 {
        format!(
            "{} sits in {} {} ways (L lowers one way)",
            new.name(),
            g.name(),
            ways.len()
        )
    } else {
        format!("{} is not a subgroup of {}", new.name(), g.name())
    };
    let took = if from_geometry > 0 {
        format!("; {from_geometry} member(s) ticked from the geometry")
    } else {
        String::new()
    };
    (s, format!("; ticks cleared: {why}{took} (u undoes)"))
}
