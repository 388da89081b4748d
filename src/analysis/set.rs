//! One member set: ticks → grid → unmoved counts → χ → reduction.

use super::cache;
use super::classes::resolve_class;
use super::ticks::GeometryTicks;
use super::Depth;
use crate::exact::Cyclo;
use crate::group::{mat_det, mat_trace, PointGroup};
use crate::rep::{self, Character, Invalid, LinearReduction, MemberKind, Reduction, Vibrations};
use crate::session::{MemberSet, SetKind};
use std::sync::Arc;

/// What the reduction of one set gave.
#[derive(Debug, Clone)]
pub enum Outcome {
    /// The set has no members yet.
    Empty,
    /// A finite group: χ, the worked reduction, and the multiplicities or the diagnosis
    /// (with suggestions) when χ is not a representation.
    Finite {
        chi: Character,
        reduction: Reduction,
        result: Result<Vec<u64>, Invalid>,
    },
    /// A linear group, reduced through its finite subgroup.
    Linear(Result<LinearReduction, String>),
    /// The counts could not be turned into characters (should not happen with ticks).
    Failed(String),
}

/// The analysis of one member set.
#[derive(Debug, Clone)]
pub struct SetAnalysis {
    pub name: String,
    pub kind: SetKind,
    pub members: Vec<String>,
    /// members × classes: does the chosen operation of the class leave the member in place?
    pub grid: Vec<Vec<bool>>,
    /// Ticks per class (the unmoved counts).
    pub unmoved: Vec<i64>,
    /// What one unmoved member contributes to χ, per class (empty for the linear groups).
    pub per_member: Vec<Cyclo>,
    /// Ticks naming no class of the group: (member index, class name as written).
    pub unknown_ticks: Vec<(usize, String)>,
    pub outcome: Arc<Outcome>,
    /// For Cartesian sets (one member per atom): Γ3N split into translations, rotations and
    /// vibrations — meaningful when the set holds every atom of the molecule.
    pub vibrations: Option<Result<Vibrations, String>>,
    /// IR/Raman activity and band counts (spectra layer) of the fundamentals this set
    /// describes: Γvib for a Cartesian set, Γ itself for internal coordinates (stretches,
    /// bends); `None` for orbital-type sets (scalar, pi, axial) and impossible χ.
    pub modes: Option<Result<crate::spectra::ModesReport, String>>,
    /// The ticks the session's geometry expects for members that name their atoms, and the
    /// cells that differ (see `ticks`).
    pub geometry_ticks: GeometryTicks,
}

impl SetAnalysis {
    /// Multiplicities, when the reduction gave a representation.
    pub fn multiplicities(&self) -> Option<&[u64]> {
        match &*self.outcome {
            Outcome::Finite { result: Ok(m), .. } => Some(m),
            Outcome::Linear(Ok(lr)) => Some(&lr.multiplicities),
            _ => None,
        }
    }
}

/// The core's member kind for a session kind.
pub fn member_kind(k: SetKind) -> MemberKind {
    match k {
        SetKind::Stretch | SetKind::Bend | SetKind::Scalar => MemberKind::Stretch,
        SetKind::Cartesian => MemberKind::Cartesian,
        SetKind::Pi => MemberKind::Pi,
        SetKind::Axial => MemberKind::Axial,
    }
}

pub(super) fn analyze_set(g: &Arc<PointGroup>, s: &MemberSet, depth: Depth) -> SetAnalysis {
    let t = &g.table;
    let nc = t.classes.len();
    let identity = t.classes.iter().position(|c| c.ascii == "E").unwrap_or(0);
    let mut grid = vec![vec![false; nc]; s.members.len()];
    let mut unknown_ticks = Vec::new();
    for (mi, m) in s.members.iter().enumerate() {
        grid[mi][identity] = true;
        for c in &m.unmoved_by {
            match resolve_class(t, c) {
                Some(ci) => grid[mi][ci] = true,
                None => unknown_ticks.push((mi, c.clone())),
            }
        }
    }
    let unmoved: Vec<i64> = (0..nc)
        .map(|c| grid.iter().filter(|row| row[c]).count() as i64)
        .collect();
    let kind = member_kind(s.kind);
    let per_member: Vec<Cyclo> = if g.is_linear() {
        Vec::new()
    } else {
        (0..nc)
            .map(|c| {
                let op = g.ops.iter().find(|o| o.class == c).expect("class op");
                kind.per_member(&mat_trace(&op.matrix), &mat_det(&op.matrix))
            })
            .collect()
    };
    let outcome = if s.members.is_empty() {
        Arc::new(Outcome::Empty)
    } else {
        let full = (
            g.name().to_string(),
            kind.name(),
            Depth::Full,
            unmoved.clone(),
        );
        match cache::peek(&full) {
            Some(o) => o,
            None => {
                let key = (g.name().to_string(), kind.name(), depth, unmoved.clone());
                cache::get_or(key, || reduce(g, &unmoved, kind, depth))
            }
        }
    };
    let vibrations = (s.kind == SetKind::Cartesian && !s.members.is_empty())
        .then(|| rep::vibrations_from_unmoved(g, &unmoved));
    let modes = match (&vibrations, s.kind) {
        (Some(Ok(v)), _) => {
            Some(crate::spectra::modes_report(g, &v.vibrations).map_err(|e| e.to_string()))
        }
        (_, SetKind::Stretch | SetKind::Bend) => match &*outcome {
            Outcome::Finite { result: Ok(m), .. } => {
                Some(crate::spectra::modes_report(g, m).map_err(|e| e.to_string()))
            }
            _ => None,
        },
        _ => None,
    };
    SetAnalysis {
        modes,
        vibrations,
        name: s.name.clone(),
        kind: s.kind,
        members: s.members.iter().map(|m| m.name.clone()).collect(),
        grid,
        unmoved,
        per_member,
        unknown_ticks,
        outcome,
        // Filled in by `ticks::check_sets`, which knows the geometry.
        geometry_ticks: GeometryTicks::none(s.members.len(), "not checked"),
    }
}

fn reduce(g: &PointGroup, unmoved: &[i64], kind: MemberKind, depth: Depth) -> Outcome {
    if g.is_linear() {
        return Outcome::Linear(rep::reduce_linear_unmoved(g, unmoved, kind));
    }
    let chi = match Character::from_unmoved(g, unmoved, kind) {
        Ok(c) => c,
        // Counts come from ticks: never negative, always one per class.
        Err(e) => return Outcome::Failed(e.to_string()),
    };
    let mut reduction = rep::reduce(g, &chi);
    reduction.unmoved = Some((unmoved.to_vec(), kind));
    let result = match depth {
        Depth::Full => rep::decompose_unmoved(g, unmoved, kind),
        Depth::Quick => reduction.multiplicities(),
    };
    Outcome::Finite {
        chi,
        reduction,
        result,
    }
}
