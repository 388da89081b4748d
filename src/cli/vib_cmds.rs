//! `normal-modes`: a frequency job's Hessian (QCSchema JSON, or XYZ + plain-text Hessian)
//! labelled by symmetry, with an optional isotopologue and band assignment.

use super::{CliError, CliResult};
use crate::report::{vibrations, Format};
use crate::spectra;
use crate::vib::{self, AssignOptions, HessianUnits, MassModel, Options, Solver};
use clap::Args;
use std::path::PathBuf;

#[derive(Args, Debug)]
pub struct NormalModesArgs {
    /// QCSchema AtomicResult JSON (driver "hessian"), or an XYZ file with --hessian.
    pub file: PathBuf,
    /// Plain-text 3N×3N Hessian (full or lower triangle) for an XYZ geometry.
    #[arg(long)]
    pub hessian: Option<PathBuf>,
    /// Units of the plain-text Hessian: hartree/bohr2 | mdyn/angstrom | kcal/mol/angstrom2 |
    /// eV/angstrom2 (required unless the file has a `# units: …` line).
    #[arg(long, value_parser = parse_units)]
    pub hessian_units: Option<HessianUnits>,
    /// Isotopologue: TARGET=ISOTOPE, e.g. 3=2H, H=D, Cl=37Cl (repeatable).
    #[arg(long)]
    pub isotope: Vec<String>,
    /// Standard atomic weights instead of the most abundant isotopes.
    #[arg(long)]
    pub average_masses: bool,
    /// Uniform scale factor for the wavenumbers (assignment and a scaled column).
    #[arg(long)]
    pub scale: Option<f64>,
    /// Observed bands (the `bands` command's file format) to assign.
    #[arg(long)]
    pub bands: Option<PathBuf>,
    /// Largest |observed − predicted| for an assignment, cm⁻¹.
    #[arg(long, default_value_t = 30.0)]
    pub band_tolerance: f64,
    /// Symmetry tolerance, Å.
    #[arg(long, default_value_t = crate::geom::DEFAULT_TOLERANCE)]
    pub tolerance: f64,
    /// Average the Hessian over the group's operations before solving.
    #[arg(long)]
    pub symmetrize: bool,
    /// auto (blocked by symmetry when the Hessian is symmetric) | dense | blocked.
    #[arg(long, default_value = "auto", value_parser = parse_solver)]
    pub solver: Solver,
    /// Output format: text, md, json.
    #[arg(long, short, default_value = "text", value_parser = super::parse_format)]
    pub format: Format,
}

fn parse_units(s: &str) -> Result<HessianUnits, String> {
    HessianUnits::parse(s).ok_or_else(|| format!("unknown units '{s}' ({})", HessianUnits::NAMES))
}

fn parse_solver(s: &str) -> Result<Solver, String> {
    match s {
        "auto" => Ok(Solver::Auto),
        "dense" => Ok(Solver::Dense),
        "blocked" => Ok(Solver::Blocked),
        _ => Err(format!("unknown solver '{s}' (auto, dense, blocked)")),
    }
}

pub fn normal_modes(a: &NormalModesArgs, ascii: bool) -> CliResult {
    let scale = match a.scale {
        Some(s) if !(s.is_finite() && s > 0.0 && s < 10.0) => {
            return Err(CliError::input(format!(
                "--scale {s}: expected a factor such as 0.96"
            )))
        }
        s => s,
    };
    if !(a.band_tolerance.is_finite() && a.band_tolerance > 0.0) {
        return Err(CliError::input(
            "--band-tolerance must be a positive number of cm⁻¹",
        ));
    }
    let input = vib::load(&a.file, a.hessian.as_deref(), a.hessian_units)
        .map_err(|e| CliError::input(e.to_string()))?;
    let isotopes = a
        .isotope
        .iter()
        .map(|t| vib::parse_isotope(t))
        .collect::<Result<Vec<_>, _>>()
        .map_err(CliError::input)?;
    let opts = Options {
        tolerance: a.tolerance,
        mass_model: if a.average_masses {
            MassModel::Average
        } else {
            MassModel::MostAbundant
        },
        isotopes,
        symmetrize: a.symmetrize,
        solver: a.solver,
    };
    let nm = vib::normal_modes(&input, &opts).map_err(|e| CliError::input(e.to_string()))?;
    let assignments = match &a.bands {
        None => Vec::new(),
        Some(p) => {
            let bands = spectra::load_bands(p).map_err(|e| CliError::input(e.to_string()))?;
            let g = crate::group::load(&nm.parent.point_group)
                .map_err(|e| CliError::input(e.to_string()))?;
            vib::assign_bands(
                &g,
                &nm.parent.sets,
                &bands,
                AssignOptions {
                    scale: scale.unwrap_or(1.0),
                    tolerance: a.band_tolerance,
                },
            )
        }
    };
    match a.format {
        Format::Json => println!(
            "{}",
            serde_json::to_string_pretty(&vibrations::json(&nm, &assignments, scale))
                .unwrap_or_default()
        ),
        Format::Markdown => print!(
            "{}",
            vibrations::render(&nm, &assignments, scale, true, ascii)
        ),
        Format::Text => print!(
            "{}",
            vibrations::render(&nm, &assignments, scale, false, ascii)
        ),
        Format::Latex => {
            return Err(CliError::input("normal-modes writes text, md or json"));
        }
    }
    Ok(())
}
