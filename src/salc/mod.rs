//! Symmetry-adapted linear combinations: projection and transfer operators, exact orthonormal
//! SALCs with degenerate partners, symmetry coordinates, SALCs of internal coordinates with
//! their redundancies, ligand group orbitals, and their display.
//!
//! Owns everything from a [`crate::basis::Basis`] to printed SALCs. Refuses to know how a basis
//! acts (that is `basis`) or how a report is laid out beyond one SALC's text.

mod build;
mod coords;
mod display;
mod fast;
mod fast_mats;
mod float;
mod irreps;
mod project;
mod render;

pub use build::{
    count_ceiling_from, display_form, real_multiplicities, salcs, salcs_on, salcs_with_presets,
    Arithmetic, Preset, Role, Salc, SalcError, SalcSet, EXACT_CEILING, MEMORY_CEILING_MB,
};
pub use coords::{
    central_matches, exact_positions, internal_coordinates, nearby_fraction, symmetry_coordinates,
    Matching,
};
pub use display::{
    central_orbital_matches, coefficient_strings, combination, member_name, norm_factor, salc_text,
};
pub use float::float_salcs;
pub use irreps::{real_irreps, IrrepError, Matrix, MatrixSource, RealIrrep};
pub use project::{inverses, partner_one_images, transfer, worked_projection, Worked, WorkedLine};
pub use render::{column_text, render, worked_lines, View};
