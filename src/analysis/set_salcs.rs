//! SALCs of a session's own member set, whatever its kind: the members name their atoms
//! (`[set.atoms]`), the session's geometry says how every operation moves those atoms, and the
//! basis of the kind is built the way `salcdesk salc --basis …` builds it (stretches, bends,
//! ligand π pairs, Cartesian triples; scalar members as a permutation basis; axial triples as
//! Cartesian ones times det R — Cotton, 3rd ed., §10.3 on R_x, R_y, R_z). The exact normalized
//! SALCs then come from `salc::salcs`, with partners for the degenerate irreps.
//!
//! Ticks alone cannot give SALCs: they say which operations leave a member in place, not where
//! the others send it. When something is missing, [`SetSalcs`] is an `Err` that says what and
//! how to supply it. Results are cached by geometry and set, so drawing costs a lookup.

use super::atom_sets;
use super::geometry::GeometryAnalysis;
use crate::basis::{self, Basis, BasisKind, Member as BMember, Structure};
use crate::exact::Cyclo;
use crate::group::mat_det;
use crate::salc::{self, SalcSet};
use crate::session::{MemberSet, SetKind};
use crate::survey::Survey;
use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};

/// The SALCs of one session set: the basis they are written in (members named as the session
/// names them; π pairs and x, y, z triples get suffixes) and the set of combinations.
#[derive(Debug, Clone)]
pub struct SetSalcs {
    /// The group the SALCs are in (the geometry's working group).
    pub group: String,
    pub basis: Arc<Basis>,
    pub salcs: SalcSet,
}

/// The SALCs or why there are none (with the way to get them).
pub type SetSalcsResult = Result<SetSalcs, String>;

type Cache = Mutex<HashMap<String, Arc<SetSalcsResult>>>;

fn cache() -> &'static Cache {
    static C: OnceLock<Cache> = OnceLock::new();
    C.get_or_init(|| Mutex::new(HashMap::new()))
}

/// Key of a computation: the oriented atoms, bonds and group, and the set's kind and atoms.
fn key_of(sv: &Survey, set: &MemberSet) -> String {
    let atoms: Vec<(u8, [i64; 3])> = sv
        .oriented
        .molecule
        .atoms
        .iter()
        .map(|a| {
            let r = |x: f64| (x * 1e6).round() as i64;
            (
                a.element,
                [r(a.position.x), r(a.position.y), r(a.position.z)],
            )
        })
        .collect();
    let members: Vec<(&str, &Option<Vec<usize>>)> = set
        .members
        .iter()
        .map(|m| (m.name.as_str(), &m.atoms))
        .collect();
    format!(
        "{} {:?} {:?} {} {:?}",
        sv.working.name(),
        atoms,
        sv.bonds,
        set.kind.name(),
        members
    )
}

/// Why a set's SALCs cannot be shown without atoms tied to its members, and how to fix it.
fn needs_atoms(set: &MemberSet, geometry: bool) -> String {
    let what = match set.kind {
        SetKind::Pi => "π pairs sit on bonds and turn with them",
        SetKind::Cartesian => "x, y, z displacements sit on atoms and turn with them",
        SetKind::Axial => "rotation triples sit on atoms and turn with them",
        SetKind::Bend => "bends sit on angles",
        SetKind::Stretch => "stretches sit on bonds",
        SetKind::Scalar => "scalar members sit on atoms",
    };
    let base = format!(
        "{} SALCs need where each operation sends each member; ticks only say which leave it \
         in place ({what}).",
        set.kind.name()
    );
    if geometry {
        format!(
            "{base} Tie the members to atoms in Members: A makes a set from the molecule, @ \
             gives the member under the cursor {}.",
            set.kind.atoms_shape()
        )
    } else {
        format!(
            "{base} No geometry yet: build one (Molecule panel, b), then tie the members to \
             atoms (Members: A makes a set from the molecule, @ names a member's atoms)."
        )
    }
}

/// The SALCs of `set` in the session's geometry, or what is missing. `compute` false only
/// looks in the cache (the quick analysis); `Ok(None)` then means "not computed yet".
pub fn set_salcs(
    set: &MemberSet,
    geometry: Option<&GeometryAnalysis>,
    compute: bool,
) -> Option<Arc<SetSalcsResult>> {
    if set.members.is_empty() {
        return Some(Arc::new(Err(
            "the set has no members yet: a adds one".into()
        )));
    }
    let unnamed = set.members.iter().filter(|m| m.atoms.is_none()).count();
    if geometry.is_none() || unnamed > 0 {
        let mut why = needs_atoms(set, geometry.is_some());
        if geometry.is_some() && unnamed < set.members.len() {
            let names: Vec<&str> = set
                .members
                .iter()
                .filter(|m| m.atoms.is_none())
                .map(|m| m.name.as_str())
                .collect();
            why = format!("{} name no atoms yet. {why}", names.join(", "));
        }
        return Some(Arc::new(Err(why)));
    }
    let sv = match atom_sets::usable(geometry) {
        Ok(sv) => sv,
        Err(e) => return Some(Arc::new(Err(e))),
    };
    let key = key_of(sv, set);
    if let Some(r) = cache().lock().ok().and_then(|c| c.get(&key).cloned()) {
        return Some(r);
    }
    if !compute {
        return None;
    }
    let r = Arc::new(compute_salcs(sv, set));
    if let Ok(mut c) = cache().lock() {
        if c.len() >= 64 {
            c.clear();
        }
        c.insert(key, r.clone());
    }
    Some(r)
}

/// Build the basis of the set's kind on the geometry and its SALCs.
pub fn compute_salcs(sv: &Survey, set: &MemberSet) -> SetSalcsResult {
    for m in &set.members {
        let atoms = m.atoms.as_deref().unwrap_or(&[]);
        atom_sets::check_member_atoms(sv, set.kind, atoms)
            .map_err(|e| format!("member {}: {e}", m.name))?;
    }
    let st = Structure::from_oriented(
        sv.working.clone(),
        &sv.oriented.molecule,
        sv.bonds.clone(),
        sv.detection.tolerance,
        sv.detection.max_deviation,
    )
    .map_err(|e| e.to_string())?;
    let b = basis_of(&st, set)?;
    let salcs = salc::salcs(&b).map_err(|e| e.to_string())?;
    Ok(SetSalcs {
        group: sv.working.name().to_string(),
        basis: Arc::new(b),
        salcs,
    })
}

/// 0-based atoms of every member.
fn atoms0(set: &MemberSet) -> Vec<Vec<usize>> {
    set.members
        .iter()
        .map(|m| {
            m.atoms
                .as_deref()
                .unwrap_or(&[])
                .iter()
                .map(|a| a - 1)
                .collect()
        })
        .collect()
}

/// The set's atoms must go onto the set's atoms under every operation.
fn closed_atoms(st: &Structure, atoms: &[usize], set: &MemberSet) -> Result<(), String> {
    for (o, op) in st.group.ops.iter().enumerate() {
        for &a in atoms {
            let b = st.perm[o][a];
            if !atoms.contains(&b) {
                return Err(format!(
                    "set '{}' is not closed under the group: {} sends {} to {}, which no member \
                     sits on (add a member on it, or use A for a whole set of equivalent atoms)",
                    set.name,
                    op.name,
                    st.label(a),
                    st.label(b)
                ));
            }
        }
    }
    Ok(())
}

fn basis_of(st: &Structure, set: &MemberSet) -> Result<Basis, String> {
    let at = atoms0(set);
    let names: Vec<&str> = set.members.iter().map(|m| m.name.as_str()).collect();
    let with_names = |mut b: Basis, suffix: bool| {
        for m in &mut b.members {
            let base = names[m.site];
            m.name = match (&m.axis, suffix) {
                (Some(ax), true) => format!("{base}{ax}"),
                _ => base.to_string(),
            };
        }
        b
    };
    let closed = |e: basis::BasisError| match e {
        basis::BasisError::NotClosed { .. } => format!(
            "set '{}' is not closed under the group: {e} (A makes a whole set of equivalent \
             members from the geometry)",
            set.name
        ),
        e => e.to_string(),
    };
    match set.kind {
        SetKind::Stretch => {
            let bonds: Vec<(usize, usize)> = at.iter().map(|a| (a[0], a[1])).collect();
            let b = basis::stretches(st, &bonds).map_err(closed)?;
            Ok(with_names(b, false))
        }
        SetKind::Bend => {
            let angles: Vec<basis::Angle> = at.iter().map(|a| (a[0], a[1], a[2])).collect();
            let b = basis::bends(st, &angles).map_err(closed)?;
            Ok(with_names(b, false))
        }
        SetKind::Pi => {
            // The centre is the atom every member shares (else the one at the origin).
            let shared: Vec<usize> = at[0]
                .iter()
                .copied()
                .filter(|x| at.iter().all(|a| a.contains(x)))
                .collect();
            let centre = match shared.as_slice() {
                [c] => *c,
                _ => central_atom_of(st, &at).ok_or_else(|| {
                    format!(
                        "π pairs are built around one central atom: the members of '{}' share \
                         no atom (give each member as centre-ligand, e.g. 1-2)",
                        set.name
                    )
                })?,
            };
            let ligands: Vec<usize> = at
                .iter()
                .map(|a| if a[0] == centre { a[1] } else { a[0] })
                .collect();
            let b = basis::pi(st, centre, &ligands).map_err(closed)?;
            Ok(with_names(b, true))
        }
        SetKind::Cartesian | SetKind::Axial => {
            let atoms: Vec<usize> = at.iter().map(|a| a[0]).collect();
            closed_atoms(st, &atoms, set)?;
            let mut b = basis::cartesian(st).map_err(closed)?.restricted(&atoms);
            if set.kind == SetKind::Axial {
                let det = |o: usize| -> Cyclo { mat_det(&st.group.ops[o].matrix) };
                b.images = std::sync::Arc::new(b.images.scaled_per_op(det));
                b.kind = BasisKind::Rotations;
                for m in &mut b.members {
                    if let Some(ax) = &mut m.axis {
                        *ax = format!("R{ax}");
                    }
                }
            }
            Ok(with_names(b, true))
        }
        SetKind::Scalar => {
            let atoms: Vec<usize> = at.iter().map(|a| a[0]).collect();
            closed_atoms(st, &atoms, set)?;
            let site_perm: Vec<Vec<usize>> = st
                .perm
                .iter()
                .map(|p| {
                    atoms
                        .iter()
                        .map(|&a| atoms.iter().position(|&x| x == p[a]).unwrap_or(0))
                        .collect()
                })
                .collect();
            let images = std::sync::Arc::new(basis::permutation_images(atoms.len(), &site_perm));
            Ok(Basis {
                kind: BasisKind::Sigma,
                group: st.group.clone(),
                members: atoms
                    .iter()
                    .enumerate()
                    .map(|(k, &a)| BMember {
                        name: names[k].to_string(),
                        atoms: vec![a],
                        axis: None,
                        site: k,
                    })
                    .collect(),
                sites: atoms.iter().map(|&a| st.label(a)).collect(),
                site_perm,
                images,
                notes: Vec::new(),
            })
        }
    }
}

fn central_atom_of(st: &Structure, at: &[Vec<usize>]) -> Option<usize> {
    let c = st.atom_at_origin()?;
    at.iter().all(|a| a.contains(&c)).then_some(c)
}
