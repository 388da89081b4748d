//! The one entry point every face uses: [`analyze`] turns a [`Session`] into everything that
//! is shown or exported — the group and its table, per member set the tick grid, the unmoved
//! counts, χ, and the exact reduction with its worked arithmetic (or why χ is impossible and
//! which single changes would fix it).
//!
//! Owns the interpretation of ticks (class names → table columns) and the cache of reductions.
//! Refuses to know about terminals or output formats. Layers that are not in this build yet
//! (geometry, SALCs, spectra) are reported as such in [`Layers`], never imitated.

pub mod atom_sets;
mod cache;
mod catalogue;
mod classes;
mod geometry;
mod layers;
mod set;
pub mod set_salcs;
mod spectra;
pub mod substitute;
mod ticks;
pub mod vibrations;
pub mod whatif;

pub use catalogue::{catalogue, fit, GroupEntry};
pub use classes::{class_label, resolve_class};
pub use geometry::{BondSalcs, GeometryAnalysis};
pub use layers::{LayerStatus, Layers};
pub use set::{Outcome, SetAnalysis};
pub use spectra::{observed_bands, predict, SpectraAnalysis};
pub use ticks::GeometryTicks;
pub use vibrations::VibrationAnalysis;

use crate::group::{self, PointGroup};
use crate::session::Session;
use std::path::Path;
use std::sync::Arc;

/// Why a session could not be analysed at all.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum Error {
    #[error("no point group chosen yet: pick one in the Point group panel (or add `group = \"…\"` to the session file)")]
    NoGroup,
    #[error("{0}")]
    Group(String),
}

/// Everything a face shows about a session.
#[derive(Debug, Clone)]
pub struct Analysis {
    pub group: Arc<PointGroup>,
    /// One entry per member set, in session order.
    pub sets: Vec<SetAnalysis>,
    /// Which later layers exist in this build.
    pub layers: Layers,
    pub depth: Depth,
    /// The geometry layer, when the session has a `[geometry]`.
    pub geometry: Option<GeometryAnalysis>,
    /// Remarks on the session as a whole (e.g. the chosen group differs from the geometry's).
    pub notes: Vec<String>,
    /// Activity, band counts, overtones/combinations and the band check of the session's
    /// Γvib (from the geometry, else the first Cartesian set); full depth only.
    pub spectra: Option<Arc<SpectraAnalysis>>,
    /// The normal modes of the session's `[vibrations]` Hessian.
    pub vibrations: Option<Result<Arc<vibrations::VibrationAnalysis>, String>>,
}

impl Analysis {
    /// Class symbols in table order, Unicode or ASCII.
    pub fn class_symbols(&self, ascii: bool) -> Vec<String> {
        self.group
            .table
            .classes
            .iter()
            .map(|c| class_label(c, ascii))
            .collect()
    }
}

/// How much to compute.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Depth {
    /// Everything, including the single-class corrections for impossible characters (which
    /// can take a while for large sets in large groups).
    Full,
    /// Everything but those corrections: fast enough for every keystroke.
    Quick,
}

/// Analyse a session completely. Cheap to call again: reductions are cached by
/// (group, kind, unmoved counts).
pub fn analyze(session: &Session) -> Result<Analysis, Error> {
    analyze_to(session, Depth::Full)
}

/// Analyse a session to the given depth (the terminal workspace shows a quick analysis at
/// once and the full one when it is ready). A relative XYZ path is read from the current
/// directory; [`analyze_in`] names the session file's directory instead.
pub fn analyze_to(session: &Session, depth: Depth) -> Result<Analysis, Error> {
    analyze_in(session, depth, None)
}

/// Analyse a session to the given depth, reading a relative XYZ path from `base`.
pub fn analyze_in(session: &Session, depth: Depth, base: Option<&Path>) -> Result<Analysis, Error> {
    let geometry = geometry::analyze_geometry(session, base, depth == Depth::Full);
    let vibrations = vibrations::analyze(session, base);
    let mut notes = Vec::new();
    let g = match session.group.as_deref() {
        Some(name) => group::load(name).map_err(|e| Error::Group(e.to_string()))?,
        // No group chosen: a geometry that was surveyed offers its own.
        None => match geometry.as_ref().map(|ga| &ga.survey) {
            Some(Ok(sv)) => {
                notes.push(format!(
                    "no group chosen: using the geometry's {} (pick another in the Point group panel)",
                    sv.group.name()
                ));
                sv.group.clone()
            }
            Some(Err(e)) => {
                return Err(Error::Group(format!(
                    "no point group chosen, and the geometry that would give one could not be used: {e}"
                )))
            }
            // nor a geometry: the Hessian's geometry offers its group
            None => match &vibrations {
                Some(Ok(v)) => {
                    notes.push(format!(
                        "no group chosen: using the Hessian's geometry's {}",
                        v.modes.parent.point_group
                    ));
                    group::load(&v.modes.parent.point_group)
                        .map_err(|e| Error::Group(e.to_string()))?
                }
                _ => return Err(Error::NoGroup),
            },
        },
    };
    let sets: Vec<SetAnalysis> = session
        .sets
        .iter()
        .map(|s| set::analyze_set(&g, s, depth))
        .collect();
    let sets = ticks::check_sets(&g, session, geometry.as_ref(), sets);
    if depth == Depth::Full {
        // Work out the SALCs of every set tied to atoms now (the worker's thread), so that the
        // Combinations panel only looks them up.
        for s in &session.sets {
            let _ = set_salcs::set_salcs(s, geometry.as_ref(), true);
        }
    }
    if let Some(ga) = &geometry {
        match &ga.survey {
            Ok(sv) if sv.group.name() != g.name() => notes.push(format!(
                "the geometry has {} symmetry (largest deviation {:.3} Å at tolerance {} Å) \
                 but this session's group is {}: the ticks and reductions use {}, as chosen; \
                 pick {} in the Point group panel to follow the geometry",
                sv.group.name(),
                sv.detection.max_deviation,
                ga.tolerance,
                g.name(),
                g.name(),
                sv.group.name()
            )),
            Ok(_) => {}
            Err(e) => notes.push(format!("the geometry could not be used: {e}")),
        }
    }
    let spectra = (depth == Depth::Full)
        .then(|| vibrational_source(&g, &sets, geometry.as_ref()))
        .flatten()
        .map(|(source, group, rows)| {
            spectra::predict(
                source,
                &group,
                &rows,
                &observed_bands(session),
                &session.nu_positions,
            )
        });
    Ok(Analysis {
        group: g,
        sets,
        layers: Layers::of_this_build(),
        depth,
        geometry,
        notes,
        spectra,
        vibrations,
    })
}

/// Γvib for the spectra: the geometry's survey (in the geometry's group), else the first
/// Cartesian set whose Γ3N splits into vibrations.
fn vibrational_source(
    g: &Arc<PointGroup>,
    sets: &[SetAnalysis],
    geometry: Option<&GeometryAnalysis>,
) -> Option<(String, Arc<PointGroup>, Vec<u64>)> {
    if let Some(Ok(sv)) = geometry.map(|ga| &ga.survey) {
        return Some((
            format!(
                "the geometry ({}, {})",
                crate::geom::formula::subscripts(&crate::geom::formula::formula(
                    sv.oriented.molecule.atoms.iter().map(|a| a.symbol())
                )),
                sv.group.name()
            ),
            sv.group.clone(),
            sv.vibrations.vibrations.clone(),
        ));
    }
    sets.iter().find_map(|s| match &s.vibrations {
        Some(Ok(v)) => Some((format!("set '{}'", s.name), g.clone(), v.vibrations.clone())),
        _ => None,
    })
}
