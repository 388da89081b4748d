//! The one entry point every face uses: [`analyze`] turns a [`Session`] into everything that
//! is shown or exported — the group and its table, per member set the tick grid, the unmoved
//! counts, χ, and the exact reduction with its worked arithmetic (or why χ is impossible and
//! which single changes would fix it).
//!
//! Owns the interpretation of ticks (class names → table columns) and the cache of reductions.
//! Refuses to know about terminals or output formats. Layers that are not in this build yet
//! (geometry, SALCs, spectra) are reported as such in [`Layers`], never imitated.

mod cache;
mod catalogue;
mod classes;
mod geometry;
mod layers;
mod set;
mod ticks;

pub use catalogue::{catalogue, fit, GroupEntry};
pub use classes::{class_label, resolve_class};
pub use geometry::{BondSalcs, GeometryAnalysis};
pub use layers::{LayerStatus, Layers};
pub use set::{Outcome, SetAnalysis};
pub use ticks::GeometryTicks;

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
    let name = session.group.as_deref().ok_or(Error::NoGroup)?;
    let g = group::load(name).map_err(|e| Error::Group(e.to_string()))?;
    let sets = session
        .sets
        .iter()
        .map(|s| set::analyze_set(&g, s, depth))
        .collect();
    let geometry = geometry::analyze_geometry(session, base, depth == Depth::Full);
    let sets = ticks::check_sets(&g, session, geometry.as_ref(), sets);
    let mut notes = Vec::new();
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
    Ok(Analysis {
        group: g,
        sets,
        layers: Layers::of_this_build(),
        depth,
        geometry,
        notes,
    })
}
