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
mod layers;
mod set;

pub use catalogue::{catalogue, fit, GroupEntry};
pub use classes::{class_label, resolve_class};
pub use layers::{LayerStatus, Layers};
pub use set::{Outcome, SetAnalysis};

use crate::group::{self, PointGroup};
use crate::session::Session;
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
/// once and the full one when it is ready).
pub fn analyze_to(session: &Session, depth: Depth) -> Result<Analysis, Error> {
    let name = session.group.as_deref().ok_or(Error::NoGroup)?;
    let g = group::load(name).map_err(|e| Error::Group(e.to_string()))?;
    let sets = session
        .sets
        .iter()
        .map(|s| set::analyze_set(&g, s, depth))
        .collect();
    Ok(Analysis {
        group: g,
        sets,
        layers: Layers::of_this_build(),
        depth,
    })
}
