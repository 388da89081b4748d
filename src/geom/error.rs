//! The error type shared by the molecule/geometry layer (everything except XYZ parsing,
//! which has its own [`XyzError`] carrying a line and a column).

use thiserror::Error;

use super::xyz::XyzError;

/// Everything that can go wrong in `geom` outside of XYZ parsing.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum GeomError {
    /// The molecule has no atoms.
    #[error("the molecule has no atoms")]
    Empty,
    /// A coordinate is NaN or infinite.
    #[error("atom {atom} has a non-finite coordinate")]
    NonFiniteCoordinate {
        /// 0-based atom index.
        atom: usize,
    },
    /// A coordinate is absurdly large for a molecule (more than 10⁶ Å from the origin).
    #[error("atom {atom} lies {distance:e} Å from the origin; coordinates must be within 1e6 Å")]
    CoordinateOutOfRange {
        /// 0-based atom index.
        atom: usize,
        /// Distance from the origin in Å.
        distance: f64,
    },
    /// An atom carries an atomic number outside 1..=118.
    #[error("atom {atom} has atomic number {z}, outside 1..=118")]
    UnknownElement {
        /// 0-based atom index.
        atom: usize,
        /// The offending atomic number.
        z: u8,
    },
    /// A tolerance or factor is not a positive finite number.
    #[error("{what} must be a positive finite number, got {value}")]
    InvalidParameter {
        /// Which parameter.
        what: &'static str,
        /// The value given.
        value: f64,
    },
    /// An operation does not map the molecule onto itself at the tolerance.
    #[error("not symmetric at {tolerance} Å: {detail}")]
    NotSymmetric {
        /// 0-based index of the worst atom.
        atom: usize,
        /// Distance from that atom's image to the nearest atom of the same element
        /// (infinite if there is no other atom of that element).
        deviation: f64,
        /// The tolerance used, Å.
        tolerance: f64,
        /// Human-readable explanation naming the atom.
        detail: String,
    },
    /// A matrix given as a symmetry operation is not orthogonal (or not finite).
    #[error("operation {index} is not an orthogonal matrix")]
    NotOrthogonal {
        /// 0-based index in the list given.
        index: usize,
    },
    /// A list of operations given as a point group is not one.
    #[error("the operations do not form a point group: {0}")]
    NotAGroup(String),
    /// No candidate rotation puts the molecule in the table's standard orientation.
    #[error("no standard orientation found for {group}: {reason}")]
    OrientationNotFound {
        /// The detected group.
        group: String,
        /// Why it failed.
        reason: String,
    },
    /// Site parameters that do not describe a point of the requested site type.
    #[error("invalid site parameters: {0}")]
    InvalidSite(String),
    /// An XYZ parse error.
    #[error(transparent)]
    Xyz(#[from] XyzError),
}
