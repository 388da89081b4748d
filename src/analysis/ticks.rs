//! Ticks against the geometry: for members that name their atoms (`[set.atoms]`), the tick each
//! class should have according to the session's geometry, and the cells where the user's tick
//! differs.
//!
//! The class's chosen operation is the first operation of the class in the group's operation
//! list — the one the survey orients the molecule by — and the survey's atom permutation of that
//! operation decides: a stretch stays when its two atoms go onto themselves (either way round),
//! a pi pair when each of its two atoms stays, a bend when its apex stays and its two ends go
//! onto themselves, a one-atom member when its atom stays. Only compared when the survey
//! succeeded and found the session's own (finite) group, so that the classes are the same table
//! columns. Uses the cached survey; costs one lookup per member and class.

use super::geometry::GeometryAnalysis;
use super::set::SetAnalysis;
use crate::group::PointGroup;
use crate::session::{MemberSet, Session, SetKind};
use crate::survey::Survey;

/// How one set's ticks compare with the geometry.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct GeometryTicks {
    /// Per member, per class: the tick the geometry expects; `None` for members that were not
    /// compared (no atoms named, or no comparison possible at all).
    pub expected: Vec<Option<Vec<bool>>>,
    /// (member, class) cells where the tick differs from the geometry's, in row order.
    pub disagreements: Vec<(usize, usize)>,
    /// Why some members — or all — were not compared (`None` when every member was).
    pub reason: Option<String>,
}

impl GeometryTicks {
    /// Nothing compared, for the given reason.
    pub fn none(members: usize, reason: impl Into<String>) -> Self {
        GeometryTicks {
            expected: vec![None; members],
            disagreements: Vec::new(),
            reason: Some(reason.into()),
        }
    }
    /// Members whose ticks were compared.
    pub fn compared(&self) -> usize {
        self.expected.iter().filter(|e| e.is_some()).count()
    }
    /// Does the cell (member, class) differ from the geometry?
    pub fn disagrees(&self, member: usize, class: usize) -> bool {
        self.disagreements.contains(&(member, class))
    }
}

/// Fill in [`SetAnalysis::geometry_ticks`] for every set of the session.
pub(super) fn check_sets(
    g: &PointGroup,
    session: &Session,
    geometry: Option<&GeometryAnalysis>,
    mut sets: Vec<SetAnalysis>,
) -> Vec<SetAnalysis> {
    let survey = match usable_survey(g, geometry) {
        Ok(sv) => Some(sv),
        Err(reason) => {
            for sa in &mut sets {
                sa.geometry_ticks = GeometryTicks::none(sa.members.len(), reason.clone());
            }
            None
        }
    };
    if let Some(sv) = survey {
        for (sa, set) in sets.iter_mut().zip(&session.sets) {
            sa.geometry_ticks = check_set(sv, set, &sa.grid);
        }
    }
    sets
}

/// The survey, when the ticks can be compared with it; otherwise why not.
fn usable_survey<'a>(
    g: &PointGroup,
    geometry: Option<&'a GeometryAnalysis>,
) -> Result<&'a Survey, String> {
    let Some(ga) = geometry else {
        return Err("this session has no geometry to check the ticks against".into());
    };
    let sv =
        match &ga.survey {
            Ok(sv) => sv,
            Err(_) => return Err(
                "the geometry could not be used (the Molecule panel says why): ticks not checked"
                    .into(),
            ),
        };
    if sv.group.name() != g.name() {
        return Err(format!(
            "the geometry is {}, not {}: ticks are checked only in the geometry's own group",
            sv.group.name(),
            g.name()
        ));
    }
    if g.is_linear() || sv.working.name() != g.name() {
        return Err(format!(
            "{} is linear: ticks are not checked against the geometry",
            g.name()
        ));
    }
    let w = &sv.working;
    if w.table.classes.len() != g.table.classes.len() || sv.permutations.len() != w.ops.len() {
        // Cannot happen for the same table; refuse rather than compare the wrong columns.
        return Err(format!(
            "the geometry's {} table does not line up with the session's: ticks not checked",
            w.name()
        ));
    }
    Ok(sv)
}

fn check_set(sv: &Survey, set: &MemberSet, grid: &[Vec<bool>]) -> GeometryTicks {
    let w = &sv.working;
    let n_atoms = sv.permutations.first().map(|p| p.len()).unwrap_or(0);
    let class_ops: Vec<Option<&[usize]>> = (0..w.table.classes.len())
        .map(|c| {
            w.ops
                .iter()
                .position(|o| o.class == c)
                .map(|k| sv.permutations[k].as_slice())
        })
        .collect();
    let mut expected = Vec::with_capacity(set.members.len());
    let mut disagreements = Vec::new();
    let mut unnamed: Vec<&str> = Vec::new();
    let mut problems: Vec<String> = Vec::new();
    for (mi, m) in set.members.iter().enumerate() {
        let Some(atoms) = &m.atoms else {
            unnamed.push(&m.name);
            expected.push(None);
            continue;
        };
        let want = set.kind.atoms_per_member();
        if atoms.len() != want {
            problems.push(format!(
                "set '{}', member '{}': a {} member sits on {}, {} named",
                set.name,
                m.name,
                set.kind.name(),
                set.kind.atoms_shape(),
                atoms.len()
            ));
            expected.push(None);
            continue;
        }
        if let Some(&bad) = atoms.iter().find(|&&a| a == 0 || a > n_atoms) {
            problems.push(format!(
                "set '{}', member '{}': atom {bad} does not exist (the geometry has {n_atoms} \
                 atoms, numbered from 1)",
                set.name, m.name
            ));
            expected.push(None);
            continue;
        }
        let zero: Vec<usize> = atoms.iter().map(|a| a - 1).collect();
        let row: Option<Vec<bool>> = class_ops
            .iter()
            .map(|p| p.map(|p| stays(set.kind, &zero, p)))
            .collect();
        let Some(row) = row else {
            problems.push("a class of the table has no operation: ticks not checked".into());
            expected.push(None);
            continue;
        };
        if let Some(have) = grid.get(mi) {
            for (ci, (&e, &h)) in row.iter().zip(have).enumerate() {
                if e != h {
                    disagreements.push((mi, ci));
                }
            }
        }
        expected.push(Some(row));
    }
    if !unnamed.is_empty() {
        let what = if unnamed.len() == set.members.len() {
            "no member names its atoms ([set.atoms] in the session file): ticks not checked"
                .to_string()
        } else {
            format!(
                "{} name{} no atoms: not checked",
                unnamed.join(", "),
                if unnamed.len() == 1 { "s" } else { "" }
            )
        };
        problems.insert(0, what);
    }
    GeometryTicks {
        expected,
        disagreements,
        reason: (!problems.is_empty()).then(|| problems.join("; ")),
    }
}

/// Does the operation with atom permutation `p` leave the member on the (0-based, in-range)
/// `atoms` in place?
pub(super) fn stays(kind: SetKind, atoms: &[usize], p: &[usize]) -> bool {
    let img = |a: usize| p.get(a).copied();
    match (kind, atoms) {
        (SetKind::Stretch, &[a, b]) => {
            let (x, y) = (img(a), img(b));
            (x == Some(a) && y == Some(b)) || (x == Some(b) && y == Some(a))
        }
        (SetKind::Pi, &[a, b]) => img(a) == Some(a) && img(b) == Some(b),
        (SetKind::Bend, &[i, j, k]) => {
            let (x, z) = (img(i), img(k));
            img(j) == Some(j) && ((x == Some(i) && z == Some(k)) || (x == Some(k) && z == Some(i)))
        }
        (SetKind::Scalar | SetKind::Cartesian | SetKind::Axial, &[a]) => img(a) == Some(a),
        _ => false,
    }
}
