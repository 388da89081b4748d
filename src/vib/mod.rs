//! Normal modes from a frequency job: a Cartesian Hessian (QCSchema or plain text) and a
//! geometry become harmonic wavenumbers, each degenerate set labelled by its irrep with a
//! purity figure, IR/Raman activity and its ν number; isotopologues (with the Teller–Redlich
//! product rule per species) and the assignment of observed bands ride on top.
//!
//! Owns: Hessian input, masses and isotopes, mass-weighting and the projection of
//! translations/rotations, the symmetry-blocked eigen-solve, mode labelling, the product
//! rule, band assignment. Uses `survey` for the group, orientation and atom permutations,
//! `salc::real_irreps` for irrep matrices, `spectra` for activity and descent. Knows no
//! terminal and no file system beyond parsing text it is handed.

mod action;
mod assign;
mod constants;
mod error;
mod files;
mod input;
mod isotopes;
mod isotopes_impl;
mod label;
mod masses;
mod masses_data;
mod solve;

pub use action::{Action, FloatIrrep};
pub use assign::{assign_bands, AssignOptions, Assignment};
pub use constants::{to_hartree_per_bohr2, wavenumber_cm, HessianUnits};
pub use error::VibError;
pub use files::load;
pub use input::{
    looks_like_json, read_qcschema, read_text_hessian, HessianInput, ASYMMETRY_TOLERANCE, MAX_ATOMS,
};
pub use isotopes::{Isotopologue, ProductRule, SetCorrelation};
pub use label::{ModeSet, PURITY_FLAG};
pub use masses::{
    atomic_weight, isotope_mass, masses_of, most_abundant, parse_isotope, Isotope, IsotopeTarget,
    MassModel,
};
pub use solve::{external_modes, mass_weighted, RawMode};

use crate::group::PointGroup;
use crate::survey::{self, SurveyOptions};
use nalgebra::{DMatrix, Matrix3, Vector3};
use std::sync::Arc;

/// Relative departure of the Hessian from the group's symmetry below which the blocked
/// solve is exact to well under 0.001 cm⁻¹ (second order in the departure).
pub const BLOCK_DEPARTURE: f64 = 1e-6;

/// How to solve.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, serde::Serialize)]
pub enum Solver {
    /// Blocked when the Hessian is symmetric (or symmetrized), dense otherwise.
    #[default]
    Auto,
    Dense,
    Blocked,
}

/// Settings of a normal-mode analysis.
#[derive(Debug, Clone, PartialEq)]
pub struct Options {
    /// Symmetry tolerance, Å (the session's).
    pub tolerance: f64,
    pub mass_model: MassModel,
    /// Replacements that make the isotopologue (none: no isotopologue).
    pub isotopes: Vec<Isotope>,
    /// Average the Hessian over the group's operations first.
    pub symmetrize: bool,
    pub solver: Solver,
}

impl Default for Options {
    fn default() -> Self {
        Options {
            tolerance: crate::geom::DEFAULT_TOLERANCE,
            mass_model: MassModel::MostAbundant,
            isotopes: Vec::new(),
            symmetrize: false,
            solver: Solver::Auto,
        }
    }
}

/// The labelled modes of one set of masses.
#[derive(Debug, Clone, serde::Serialize)]
pub struct Modes {
    pub point_group: String,
    /// Group the work was done in (D2h/C2v for linear molecules).
    pub working_group: String,
    /// Number of vibrations (3N − 6 or 3N − 5), degenerate partners counted.
    pub n_modes: usize,
    pub sets: Vec<ModeSet>,
    /// Masses used, u, input order.
    pub masses: Vec<f64>,
    /// "blocked" or "dense".
    pub solver: String,
    pub symmetrized: bool,
    /// ‖O H Oᵀ − H‖/‖H‖, largest over the classes, before any symmetrization.
    pub departure: f64,
    /// Largest distance of an atom from its symmetry image (Å).
    pub geometry_deviation: f64,
    pub notes: Vec<String>,
    #[serde(skip)]
    pub(crate) frame: Frame,
}

/// The working frame of one analysis, kept for correlation and the product rule.
#[derive(Debug, Clone)]
pub(crate) struct Frame {
    pub working: Arc<PointGroup>,
    pub action: Action,
    /// oriented = rotation · (input − centre)
    pub rotation: Matrix3<f64>,
    /// Oriented (symmetrized) positions, Å.
    pub positions: Vec<Vector3<f64>>,
    pub masses: Vec<f64>,
}

/// Everything about one Hessian: the parent's modes and, when isotopes were given, the
/// isotopologue's with correlation and product rule.
#[derive(Debug, Clone, serde::Serialize)]
pub struct NormalModes {
    pub title: String,
    pub parent: Modes,
    pub isotopologue: Option<Isotopologue>,
}

/// Analyse a Hessian.
pub fn normal_modes(input: &HessianInput, opts: &Options) -> Result<NormalModes, VibError> {
    let parent_masses =
        masses_of(&input.elements, opts.mass_model, &[]).map_err(VibError::Isotope)?;
    let parent = modes_for(input, &parent_masses, opts)?;
    let isotopologue = if opts.isotopes.is_empty() {
        None
    } else {
        let m = masses_of(&input.elements, opts.mass_model, &opts.isotopes)
            .map_err(VibError::Isotope)?;
        let iso = modes_for(input, &m, opts)?;
        Some(isotopes::compare(&parent, iso, &opts.isotopes)?)
    };
    Ok(NormalModes {
        title: input.title.clone(),
        parent,
        isotopologue,
    })
}

/// Elements for symmetry detection: atoms of one element with different masses become
/// different "elements" (unused atomic numbers from 118 down), so an isotope that breaks the
/// symmetry lowers the group.
fn detection_codes(elements: &[u8], masses: &[f64]) -> Vec<u8> {
    let mut kinds: Vec<(u8, u64)> = Vec::new();
    let mut codes = Vec::with_capacity(elements.len());
    let mut next = 118u8;
    let mut assigned: Vec<((u8, u64), u8)> = Vec::new();
    for (&z, &m) in elements.iter().zip(masses) {
        let key = (z, m.to_bits());
        if !kinds.iter().any(|k| k.0 == z) {
            kinds.push(key);
            assigned.push((key, z));
        }
        let code = match assigned.iter().find(|a| a.0 == key) {
            Some(a) => a.1,
            None => {
                while elements.contains(&next) {
                    next -= 1;
                }
                let c = next;
                next -= 1;
                assigned.push((key, c));
                c
            }
        };
        codes.push(code);
    }
    codes
}

fn rotate_hessian(h: &DMatrix<f64>, r: &Matrix3<f64>) -> DMatrix<f64> {
    let n = h.nrows() / 3;
    let mut out = DMatrix::zeros(h.nrows(), h.ncols());
    for a in 0..n {
        for b in 0..n {
            let m = r * h.fixed_view::<3, 3>(3 * a, 3 * b) * r.transpose();
            out.fixed_view_mut::<3, 3>(3 * a, 3 * b).copy_from(&m);
        }
    }
    out
}

/// Positions averaged over their symmetry images: p_a = (1/h) Σ_R Rᵀ p_{R(a)}.
fn symmetrized_positions(action: &Action, p: &[Vector3<f64>]) -> Vec<Vector3<f64>> {
    (0..p.len())
        .map(|a| {
            let s = (0..action.order()).fold(Vector3::zeros(), |s, o| {
                s + action.ops[o].transpose() * p[action.perm[o][a]]
            });
            s / action.order() as f64
        })
        .collect()
}

/// Modes of the input Hessian with these masses.
pub(crate) fn modes_for(
    input: &HessianInput,
    masses: &[f64],
    opts: &Options,
) -> Result<Modes, VibError> {
    let mut mol = input.molecule();
    for (a, z) in mol
        .atoms
        .iter_mut()
        .zip(detection_codes(&input.elements, masses))
    {
        a.element = z;
    }
    let s = survey::survey(
        &mol,
        &SurveyOptions {
            tolerance: opts.tolerance,
            near_misses: false,
            internal_coordinates: false,
            perceive_bonds: false,
            ..SurveyOptions::default()
        },
    )
    .map_err(|e| VibError::Symmetry(format!("{}: {e}", input.source)))?;
    let rotation = s.oriented.rotation;
    let oriented: Vec<Vector3<f64>> = s
        .oriented
        .molecule
        .atoms
        .iter()
        .map(|a| a.position)
        .collect();
    let action = Action::new(&s.working, s.permutations.clone()).map_err(VibError::Symmetry)?;
    let h = rotate_hessian(&input.hessian, &rotation);
    let departure = action.departure(&h);
    let h = if opts.symmetrize {
        action.symmetrize(&h)
    } else {
        h
    };
    let blocked = match opts.solver {
        Solver::Dense => false,
        Solver::Blocked => true,
        Solver::Auto => opts.symmetrize || departure <= BLOCK_DEPARTURE,
    };
    let positions = symmetrized_positions(&action, &oriented);
    let geometry_deviation = s.detection.max_deviation;
    let hmw = mass_weighted(&h, masses);
    let raw = if blocked {
        let ext = external_modes(&positions, masses);
        solve::blocked(&hmw, &ext, &action)
    } else {
        // the geometry as given, as a quantum-chemistry program's own analysis does
        let ext = external_modes(&oriented, masses);
        solve::dense(&hmw, &ext, Some(&action))
    };
    let reason = format!(
        "the Hessian departs from {} symmetry by {:.1e} (relative) and the geometry by {:.1e} Å",
        s.group.name(),
        departure,
        geometry_deviation
    );
    let sets = label::label_sets(&s.group, &s.working, &action, &raw, blocked, &reason)
        .map_err(VibError::Symmetry)?;
    let mut notes = Vec::new();
    if opts.symmetrize {
        notes.push(format!(
            "Hessian symmetrized over the {} operations of {} (it departed by {:.1e})",
            action.order(),
            s.working.name(),
            departure
        ));
    }
    if s.group.is_linear() {
        notes.push(format!(
            "linear molecule: solved in {} and correlated back to {}",
            s.working.name(),
            s.group.name()
        ));
    }
    let imaginary = sets.iter().filter(|x| x.wavenumber < 0.0).count();
    if imaginary > 0 {
        notes.push(format!(
            "{imaginary} imaginary set(s): not a minimum (a transition state or a loose optimization)"
        ));
    }
    let n_modes = sets.iter().map(|x| x.dimension).sum();
    Ok(Modes {
        point_group: s.group.name().to_string(),
        working_group: s.working.name().to_string(),
        n_modes,
        sets,
        masses: masses.to_vec(),
        solver: if blocked { "blocked" } else { "dense" }.into(),
        symmetrized: opts.symmetrize,
        departure,
        geometry_deviation,
        notes,
        frame: Frame {
            working: s.working.clone(),
            action,
            rotation,
            positions,
            masses: masses.to_vec(),
        },
    })
}

/// Text form of a wavenumber: `1234.5`, imaginary as `123.4i`.
pub fn wavenumber_text(w: f64, decimals: usize) -> String {
    if w < 0.0 {
        format!("{:.*}i", decimals, -w)
    } else {
        format!("{w:.decimals$}")
    }
}
