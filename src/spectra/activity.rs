//! Infrared and Raman activity of fundamentals, from the table's function columns.
//!
//! A fundamental of symmetry Γᵢ is IR active when Γᵢ contains a component of the dipole
//! (x, y or z), Raman active when it contains a component of the polarizability (a quadratic
//! function); Raman bands of totally symmetric modes are polarized, all others depolarized; in
//! a group with an inversion centre no fundamental is both (rule of mutual exclusion).
//! Source: Nakamoto, *Infrared and Raman Spectra of Inorganic and Coordination Compounds*,
//! Part A, ch. 1; Herzberg, *Infrared and Raman Spectra* (1945), ch. III.
//!
//! Owns: per-irrep activity ([`IrrepActivity`]) and the report for a Γ ([`ModesReport`]).

use super::error::SpectraError;
use super::real::{is_centrosymmetric, is_totally_symmetric, real_irreps, to_real, RealIrrep};
use crate::group::PointGroup;
use serde::Serialize;

/// Spectroscopic activity of one real irrep.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct IrrepActivity {
    /// ASCII label (a complex pair under its real label, e.g. `E`).
    pub irrep: String,
    pub dimension: usize,
    /// Which dipole components (`x`, `y`, `z`) transform in it; IR active if any.
    pub ir_components: Vec<String>,
    /// The quadratic functions (polarizability components) in it; Raman active if any.
    pub raman_functions: Vec<String>,
    pub ir: bool,
    pub raman: bool,
    /// Totally symmetric (its Raman bands are polarized).
    pub totally_symmetric: bool,
}

impl IrrepActivity {
    /// Raman active and totally symmetric.
    pub fn polarized(&self) -> bool {
        self.raman && self.totally_symmetric
    }
    pub fn silent(&self) -> bool {
        !self.ir && !self.raman
    }
}

/// Activity of every real irrep of a group, in table order.
pub fn activity_table(g: &PointGroup) -> Vec<IrrepActivity> {
    real_irreps(g)
        .iter()
        .map(|r| irrep_activity(g, r))
        .collect()
}

fn irrep_activity(g: &PointGroup, r: &RealIrrep) -> IrrepActivity {
    // Functions are listed on the first row of a pair.
    let f = &g.table.irreps[r.rows[0]].functions;
    let mut axes = [false; 3];
    for t in &f.linear {
        for p in &t.parts {
            for e in p.keys() {
                for (k, &pw) in e.iter().enumerate() {
                    axes[k] |= pw > 0;
                }
            }
        }
    }
    let ir_components: Vec<String> = ["x", "y", "z"]
        .iter()
        .zip(axes)
        .filter(|(_, on)| *on)
        .map(|(n, _)| n.to_string())
        .collect();
    let raman_functions: Vec<String> = f.quadratic.iter().map(|t| t.text.clone()).collect();
    IrrepActivity {
        irrep: r.label.clone(),
        dimension: r.dim,
        ir: !ir_components.is_empty(),
        raman: !raman_functions.is_empty(),
        ir_components,
        raman_functions,
        totally_symmetric: r.rows.iter().all(|&i| is_totally_symmetric(g, i)),
    }
}

/// One irrep of Γ with its activity.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct ModeLine {
    pub irrep: String,
    pub multiplicity: u64,
    pub dimension: usize,
    pub ir: bool,
    pub raman: bool,
    /// Raman active and totally symmetric: its Raman bands are polarized.
    pub polarized: bool,
    pub silent: bool,
    pub ir_components: Vec<String>,
    pub raman_functions: Vec<String>,
}

/// Activity report for a Γ of fundamentals.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct ModesReport {
    pub point_group: String,
    /// Σ n·d: the number of vibrational degrees of freedom in Γ.
    pub n_modes: u64,
    pub modes: Vec<ModeLine>,
    /// Expected fundamentals in the IR (a degenerate set counted once).
    pub ir_bands: u64,
    pub raman_bands: u64,
    /// Fundamentals active in both.
    pub coincident_bands: u64,
    pub silent_fundamentals: u64,
    pub centrosymmetric: bool,
    /// The mutual-exclusion statement, for groups with an inversion centre.
    pub mutual_exclusion: Option<String>,
    /// Γ as text, e.g. `A1 + E + 2T2`.
    pub gamma: String,
}

/// The sentence stated for centrosymmetric groups.
pub const MUTUAL_EXCLUSION: &str = "The group contains the inversion centre i: no fundamental \
is both IR and Raman active (rule of mutual exclusion); IR-active modes are u, Raman-active \
modes are g.";

/// Activity and band counts for Γ given as multiplicities per table row (as `rep::decompose`
/// returns them). A complex pair 1E + 2E counts as one real E.
pub fn modes_report(g: &PointGroup, rows: &[u64]) -> Result<ModesReport, SpectraError> {
    let real = to_real(g, rows)?;
    let table = activity_table(g);
    let mut rep = ModesReport {
        point_group: g.name().to_string(),
        n_modes: 0,
        modes: Vec::new(),
        ir_bands: 0,
        raman_bands: 0,
        coincident_bands: 0,
        silent_fundamentals: 0,
        centrosymmetric: is_centrosymmetric(g),
        mutual_exclusion: None,
        gamma: String::new(),
    };
    let mut parts = Vec::new();
    for (a, &n) in table.iter().zip(&real) {
        if n == 0 {
            continue;
        }
        rep.n_modes += n * a.dimension as u64;
        rep.ir_bands += if a.ir { n } else { 0 };
        rep.raman_bands += if a.raman { n } else { 0 };
        rep.coincident_bands += if a.ir && a.raman { n } else { 0 };
        rep.silent_fundamentals += if a.silent() { n } else { 0 };
        parts.push(crate::rep::write_term(g, n, &a.irrep));
        rep.modes.push(ModeLine {
            irrep: a.irrep.clone(),
            multiplicity: n,
            dimension: a.dimension,
            ir: a.ir,
            raman: a.raman,
            polarized: a.polarized(),
            silent: a.silent(),
            ir_components: a.ir_components.clone(),
            raman_functions: a.raman_functions.clone(),
        });
    }
    rep.gamma = if parts.is_empty() {
        "0".into()
    } else {
        parts.join(" + ")
    };
    if rep.centrosymmetric {
        rep.mutual_exclusion = Some(MUTUAL_EXCLUSION.to_string());
    }
    Ok(rep)
}

/// Convenience: load the group and read Γ from text (`"A1 + E + 2T2"`).
pub fn modes_from_text(group: &str, gamma: &str) -> Result<ModesReport, SpectraError> {
    let g = crate::group::load(group)?;
    let rows = super::real::parse_gamma(&g, gamma)?;
    modes_report(&g, &rows)
}
