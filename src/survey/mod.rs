//! Survey of a molecule: its point group and standard orientation, the atom permutation of
//! every operation, Γ3N and Γvib, the representation of each symmetry-equivalent bond set and
//! angle set, the bend remainder and the redundancies of the internal coordinates.
//!
//! Owns the path from a geometry to reduced representations; uses `geom` for detection and
//! orientation, `group` for operations and `rep` for reductions. Characters are built from
//! unmoved counts (Cotton, 3rd ed., §10.2–10.3), so everything exact stays exact. Linear
//! molecules are worked in C2v/D2h and correlated back (see `rep::linear`).

mod internal;
mod run;

pub use internal::{angle_sets, bond_sets, AngleSet, BondSet};
pub use run::{survey, SetGamma, Survey, SurveyError, SurveyOptions, MAX_ANGLES, MAX_BOND_SETS};
