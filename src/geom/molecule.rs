//! The molecule model: atoms (element, position in Å, optional label), a title and an
//! optional bond list, plus centroid / centre-of-mass helpers and input validation.

use nalgebra::Vector3;

use super::elements;
use super::GeomError;

/// One atom: atomic number, Cartesian position in Å, optional label from the input file.
#[derive(Debug, Clone, PartialEq)]
pub struct Atom {
    /// Atomic number Z (1..=118).
    pub element: u8,
    /// Position in Å.
    pub position: Vector3<f64>,
    /// Free label (e.g. `"C1"` from an input file).
    pub label: Option<String>,
}

impl Atom {
    /// An unlabelled atom.
    pub fn new(element: u8, position: Vector3<f64>) -> Self {
        Atom {
            element,
            position,
            label: None,
        }
    }

    /// The element symbol, or `"?"` for an invalid atomic number.
    pub fn symbol(&self) -> &'static str {
        elements::symbol(self.element).unwrap_or("?")
    }
}

/// A molecule: title, atoms and (possibly empty) bonds as pairs of atom indices.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct Molecule {
    /// Title (the XYZ comment line).
    pub title: String,
    /// The atoms.
    pub atoms: Vec<Atom>,
    /// Bonds as 0-based index pairs `(i, j)` with `i < j`.
    pub bonds: Vec<(usize, usize)>,
}

/// Coordinates beyond this distance from the origin (Å) are refused by the symmetry code.
pub const MAX_COORDINATE: f64 = 1.0e6;

impl Molecule {
    /// A molecule without bonds.
    pub fn new(title: impl Into<String>, atoms: Vec<Atom>) -> Self {
        Molecule {
            title: title.into(),
            atoms,
            bonds: Vec::new(),
        }
    }

    /// Number of atoms.
    pub fn len(&self) -> usize {
        self.atoms.len()
    }

    /// True when there are no atoms.
    pub fn is_empty(&self) -> bool {
        self.atoms.is_empty()
    }

    /// Unweighted mean position (origin for an empty molecule).
    pub fn centroid(&self) -> Vector3<f64> {
        if self.atoms.is_empty() {
            return Vector3::zeros();
        }
        let sum: Vector3<f64> = self.atoms.iter().map(|a| a.position).sum();
        sum / self.atoms.len() as f64
    }

    /// Mass-weighted mean position using standard atomic masses (centroid if the
    /// masses are unknown or the molecule is empty).
    pub fn centre_of_mass(&self) -> Vector3<f64> {
        let mut total = 0.0;
        let mut sum = Vector3::zeros();
        for a in &self.atoms {
            let m = elements::mass(a.element).unwrap_or(1.0);
            total += m;
            sum += a.position * m;
        }
        if total > 0.0 {
            sum / total
        } else {
            self.centroid()
        }
    }

    /// Total mass in u (unknown elements count as 0).
    pub fn total_mass(&self) -> f64 {
        self.atoms
            .iter()
            .map(|a| elements::mass(a.element).unwrap_or(0.0))
            .sum()
    }

    /// A copy moved by `shift`.
    pub fn translated(&self, shift: &Vector3<f64>) -> Molecule {
        let mut m = self.clone();
        for a in &mut m.atoms {
            a.position += shift;
        }
        m
    }

    /// Checks that the molecule is usable for geometry work: non-empty, valid elements,
    /// finite coordinates within [`MAX_COORDINATE`] Å of the origin.
    pub fn validate(&self) -> Result<(), GeomError> {
        if self.atoms.is_empty() {
            return Err(GeomError::Empty);
        }
        for (i, a) in self.atoms.iter().enumerate() {
            if elements::symbol(a.element).is_none() {
                return Err(GeomError::UnknownElement {
                    atom: i,
                    z: a.element,
                });
            }
            if !a.position.iter().all(|c| c.is_finite()) {
                return Err(GeomError::NonFiniteCoordinate { atom: i });
            }
            let d = a.position.norm();
            if d > MAX_COORDINATE {
                return Err(GeomError::CoordinateOutOfRange {
                    atom: i,
                    distance: d,
                });
            }
        }
        Ok(())
    }
}

/// Checks a tolerance-like parameter: positive and finite.
pub(crate) fn check_positive(what: &'static str, value: f64) -> Result<(), GeomError> {
    if value.is_finite() && value > 0.0 {
        Ok(())
    } else {
        Err(GeomError::InvalidParameter { what, value })
    }
}
