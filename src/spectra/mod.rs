//! Vibrational spectroscopy on top of the group and representation layers: IR/Raman activity
//! and band counts for a Γ of fundamentals, overtone and combination levels, checking observed
//! band lists against a prediction, and descent in symmetry (correlation with a subgroup).
//!
//! Owns the spectroscopic rules and their report structures (serde-serializable). Knows no
//! terminal: text rendering helpers in [`render`] return strings.
//!
//! Entry points for the faces:
//! - modes: [`modes_from_text`] or [`parse_gamma`] + [`modes_report`] (Γ per table row, as
//!   `rep::decompose` gives it) → [`ModesReport`]; [`render::modes_markdown`].
//! - combos: [`fundamentals_from_gamma`] or [`parse_fundamentals`] + [`predict_combinations`]
//!   → [`CombinationsReport`]; single levels with [`combination`] and [`overtone`].
//! - bands: [`load_bands`] / [`parse_bands`] + [`check_bands`] → [`BandCheck`].
//! - descend: [`descend_names`] / [`descend`] → [`DescentReport`]; [`subgroup_types`] lists
//!   what a group can descend to.

mod activity;
mod bands;
mod check;
mod combos;
mod descent;
mod embed;
mod error;
mod lambda;
mod linear_embed;
mod placement;
mod real;
pub mod render;
mod subgroups;
mod symmetry;

pub use activity::{
    activity_table, modes_from_text, modes_report, IrrepActivity, ModeLine, ModesReport,
    MUTUAL_EXCLUSION,
};
pub use bands::{load_bands, parse_bands, Band, BandFileError, Intensity, Polarization, Technique};
pub use check::{
    check_bands, BandCheck, BandVerdict, CheckOptions, Conflict, CountCheck, LevelMatch,
};
pub use combos::{
    customary_ranks, fundamentals_from_gamma, parse_fundamentals, predict_combinations,
    CombinationBand, CombinationOptions, CombinationsReport, Fundamental, FundamentalsError,
    LevelKind, ANHARMONIC_NOTE, NUMBERING_NOTE,
};
pub use descent::{
    descend, descend_names, subgroup_types, ClassLink, CorrelationRow, DescentReport, Embedding,
    ModeSplit, SubgroupType,
};
pub use error::SpectraError;
pub use lambda::Species;
pub use placement::{placements, Placement};
pub use real::{
    ascii_label, is_centrosymmetric, is_totally_symmetric, parse_gamma, real_character, real_index,
    real_irreps, to_real, to_rows, RealIrrep,
};
pub use subgroups::{conjugacy_classes, subgroups_of_order, OpSet};
pub use symmetry::{
    combination, linear_product, overtone, symmetry_of_real, symmetry_of_rows, ProductKind,
    SymTerm, Symmetry,
};
