//! Isotopologues: the parent's modes correlated to the isotopologue's group (an isotope that
//! breaks the symmetry lowers the group of the mass-weighted problem), and the Teller–Redlich
//! product rule per species (O. Redlich, Z. Phys. Chem. B 28, 371 (1935); Wilson, Decius &
//! Cross, *Molecular Vibrations*, §8-? "product rule"):
//!
//!   Π ω′ᵢ/ωᵢ = [ Π_O (m_O/m′_O)^{s_O} · (M′/M)^t · Π (I′/I) ]^{1/2}
//!
//! per species γ, over one member of each degenerate set; s_O is the number of first-partner
//! Cartesian SALCs of γ on the set of equivalent atoms O, t the translations and the moments
//! those of the rotations in γ (here the determinant of the inertia tensor on the rotation
//! axes of γ).

use super::isotopes_impl as imp;
use super::{Isotope, Modes, VibError};

/// How one parent set splits in the isotopologue's group.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct SetCorrelation {
    /// Parent set index (1-based, ascending order).
    pub parent_index: usize,
    pub parent_irrep: String,
    /// Species in the isotopologue's group, with multiplicities (`A′ + A″`).
    pub becomes: Vec<(String, u64)>,
}

/// The product rule for one species of the isotopologue's (working) group.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct ProductRule {
    pub species: String,
    /// Number of sets in the product.
    pub sets: usize,
    /// Π ν′/ν from the wavenumbers.
    pub from_wavenumbers: f64,
    /// The same from masses and moments of inertia.
    pub from_masses: f64,
    /// from_wavenumbers / from_masses − 1.
    pub deviation: f64,
}

/// An isotopologue beside its parent.
#[derive(Debug, Clone, serde::Serialize)]
pub struct Isotopologue {
    pub isotopes: Vec<String>,
    pub modes: Modes,
    /// The isotopologue's group is a proper subgroup of the parent's.
    pub lowered: bool,
    pub correlation: Vec<SetCorrelation>,
    pub product_rule: Vec<ProductRule>,
    pub notes: Vec<String>,
}

/// Correlate and check the product rule.
pub(crate) fn compare(
    parent: &Modes,
    iso: Modes,
    isotopes: &[Isotope],
) -> Result<Isotopologue, VibError> {
    let mut notes = Vec::new();
    let (correlation, per_set) = match imp::correlate(parent, &iso) {
        Ok(x) => x,
        Err(m) => {
            notes.push(format!("no correlation: {m}"));
            (Vec::new(), Vec::new())
        }
    };
    let product_rule = if per_set.is_empty() {
        Vec::new()
    } else {
        imp::product_rule(parent, &iso, &per_set)
    };
    let lowered = iso.frame.working.order() < parent.frame.working.order()
        || (iso.point_group != parent.point_group);
    Ok(Isotopologue {
        isotopes: isotopes.iter().map(|i| i.text.clone()).collect(),
        lowered,
        correlation,
        product_rule,
        notes,
        modes: iso,
    })
}
