//! Molecules and their geometry: elements ([`elements`]), the molecule model
//! ([`molecule`]), XYZ files ([`xyz`]), bond perception ([`bonds`]), point-group detection
//! and the near-miss report ([`symmetry`]), standard orientation ([`orient`]), atom
//! permutations and symmetrization ([`permute`]) and the site builder ([`sites`]).
//!
//! Float geometry in ångström throughout. Nothing here depends on the exact character
//! tables; group names are the tables' ASCII names (`C2v`, `D6h`, `Td`, `Cinfv`, …).

pub mod bonds;
pub mod elements;
mod error;
pub mod formula;
pub(crate) mod grid;
mod linalg;
pub mod molecule;
pub mod orient;
pub mod permute;
pub mod site_spec;
pub mod sites;
pub mod symmetry;
pub mod xyz;

pub use bonds::{parse_bond, perceive_bonds, BondEdits, DEFAULT_BOND_FACTOR};
pub use elements::{atomic_number, covalent_radius, mass, symbol};
pub use error::GeomError;
pub use molecule::{Atom, Molecule};
pub use orient::{orient, orient_with, OrientOptions, Oriented};
pub use permute::{generator_indices, permutation, permutations, symmetrize};
pub use site_spec::{build_from_sites, site_list, site_names, BuildError, SiteSpecError};
pub use sites::{place, site_types, SiteKind, SiteParams, SiteType};
pub use symmetry::{
    contains, detect, group_order, near_miss_detections, near_miss_summary, near_misses,
    near_misses_from, supported_groups, Detection, Family, NearMiss, DEFAULT_TOLERANCE,
    NEAR_MISS_TOLERANCES,
};
pub use xyz::{
    read_xyz, read_xyz_frames, write_xyz, FrameSelect, XyzError, XyzErrorKind, XyzOptions,
};
