//! `modes`, `combos`, `bands`, `descend`: the spectroscopy layer on the command line.
//!
//! Γ comes from a geometry (`modes molecule.xyz`: Γvib of the survey) or is typed
//! (`--group Td --gamma "A1 + E + 2T2"`).

use super::geometry_cmds::{read_molecule, GeometryArgs};
use super::{parse_format, CliError, CliResult};
use crate::group::{self, PointGroup};
use crate::report::Format;
use crate::spectra::{self, CheckOptions, CombinationOptions, Fundamental};
use crate::survey::survey;
use clap::Args;
use std::path::PathBuf;
use std::sync::Arc;

/// A group, Γ of fundamentals (multiplicities per table row) and observed bands.
type Fundamentals = (Arc<PointGroup>, Vec<u64>, Vec<spectra::Band>);

/// Where a Γ of fundamentals comes from.
#[derive(Args, Debug)]
pub struct GammaSource {
    /// An XYZ file (Γvib of its survey) or a session file (.toml: Γvib of its Cartesian set,
    /// or of the set named by --set; its observed bands feed `bands`).
    pub input: Option<PathBuf>,
    /// With a session: the member set whose Γ to use.
    #[arg(long)]
    pub set: Option<String>,
    /// Point group, with --gamma, instead of a file.
    #[arg(long, requires = "gamma")]
    pub group: Option<String>,
    /// Γ of the fundamentals, e.g. "A1 + E + 2T2" (with --group).
    #[arg(long, requires = "group")]
    pub gamma: Option<String>,
    #[command(flatten)]
    pub geometry: GeometryArgs,
}

fn spectra_err(e: spectra::SpectraError) -> CliError {
    CliError::input(e.to_string())
}

impl GammaSource {
    /// The group and Γ (multiplicities per table row).
    fn resolve(&self) -> Result<(Arc<PointGroup>, Vec<u64>), CliError> {
        self.resolve_with_bands().map(|(g, m, _)| (g, m))
    }

    /// Also the observed bands, when the input is a session.
    fn resolve_with_bands(&self) -> Result<Fundamentals, CliError> {
        if let Some(path) = &self.input {
            let ext = path.extension().and_then(|e| e.to_str()).unwrap_or("");
            if ext.eq_ignore_ascii_case("toml") {
                if self.group.is_some() {
                    return Err(CliError::input(
                        "give either a file or --group with --gamma, not both",
                    ));
                }
                return from_session(path, self.set.as_deref());
            }
        }
        let (g, m) = self.resolve_plain()?;
        Ok((g, m, Vec::new()))
    }

    fn resolve_plain(&self) -> Result<(Arc<PointGroup>, Vec<u64>), CliError> {
        match (&self.input, &self.group, &self.gamma) {
            (Some(path), None, None) => {
                let ext = path.extension().and_then(|e| e.to_str()).unwrap_or("");
                if !ext.eq_ignore_ascii_case("xyz") {
                    return Err(CliError::input(format!(
                        "{}: expected an .xyz or session .toml file (or --group with --gamma)",
                        path.display()
                    )));
                }
                let mol =
                    read_molecule(path, &self.geometry.xyz_options()?).map_err(CliError::input)?;
                let mut opts = self.geometry.survey_options();
                opts.near_misses = false;
                opts.internal_coordinates = false;
                let s = survey(&mol, &opts)
                    .map_err(|e| CliError::input(format!("{}: {e}", path.display())))?;
                Ok((s.group.clone(), s.vibrations.vibrations.clone()))
            }
            (None, Some(g), Some(t)) => {
                let g = group::load(g).map_err(|e| CliError::input(e.to_string()))?;
                let rows = spectra::parse_gamma(&g, t).map_err(spectra_err)?;
                Ok((g, rows))
            }
            (Some(_), _, _) => Err(CliError::input(
                "give either a file or --group with --gamma, not both",
            )),
            _ => Err(CliError::input("no Γ given")
                .with_hint("give an .xyz file, or --group G --gamma \"A1 + E\"")),
        }
    }
}

/// Γ of fundamentals and the observed bands of a session.
fn from_session(path: &std::path::Path, set: Option<&str>) -> Result<Fundamentals, CliError> {
    let session = crate::session::load_file(path).map_err(|e| CliError::input(e.to_string()))?;
    let a = crate::analysis::analyze(&session)
        .map_err(|e| CliError::input(format!("{}: {e}", path.display())))?;
    if set.is_none() {
        if let Some(sp) = &a.spectra {
            return Ok((
                sp.group.clone(),
                sp.rows.clone(),
                crate::analysis::observed_bands(&session),
            ));
        }
    }
    let pick = match set {
        Some(name) => a.sets.iter().find(|s| s.name == name).ok_or_else(|| {
            let names: Vec<&str> = a.sets.iter().map(|s| s.name.as_str()).collect();
            CliError::input(format!(
                "{}: no member set '{name}' ({})",
                path.display(),
                names.join(", ")
            ))
        })?,
        None => a
            .sets
            .iter()
            .find(|s| matches!(s.vibrations, Some(Ok(_))))
            .or_else(|| a.sets.iter().find(|s| s.multiplicities().is_some()))
            .ok_or_else(|| {
                CliError::input(format!(
                    "{}: no member set reduces to a representation",
                    path.display()
                ))
            })?,
    };
    let rows = match &pick.vibrations {
        Some(Ok(v)) => v.vibrations.clone(),
        Some(Err(e)) => {
            return Err(CliError::input(format!(
                "{}: set '{}': {e}",
                path.display(),
                pick.name
            )))
        }
        None => pick
            .multiplicities()
            .ok_or_else(|| {
                CliError::input(format!(
                    "{}: set '{}' is not a representation",
                    path.display(),
                    pick.name
                ))
            })?
            .to_vec(),
    };
    let bands = crate::analysis::observed_bands(&session);
    Ok((a.group.clone(), rows, bands))
}

fn print_json<T: serde::Serialize>(v: &T) {
    println!("{}", serde_json::to_string_pretty(v).unwrap_or_default());
}

#[derive(Args, Debug)]
pub struct ModesArgs {
    #[command(flatten)]
    pub source: GammaSource,
    /// Output format: text (aligned columns), md, latex, json.
    #[arg(long, short, default_value = "text", value_parser = parse_format)]
    pub format: Format,
}

pub fn modes(a: &ModesArgs, ascii: bool) -> CliResult {
    let (g, rows) = a.source.resolve()?;
    let r = spectra::modes_report(&g, &rows).map_err(spectra_err)?;
    match a.format {
        Format::Json => print_json(&r),
        _ => print!("{}", crate::report::spectra::modes(&r, a.format, ascii)),
    }
    Ok(())
}

fn fundamentals(
    g: &PointGroup,
    rows: &[u64],
    nu: &Option<String>,
    file: &Option<PathBuf>,
) -> Result<Vec<Fundamental>, CliError> {
    if let Some(p) = file {
        let text = std::fs::read_to_string(p)
            .map_err(|e| CliError::input(format!("{}: {e}", p.display())))?;
        return spectra::parse_fundamentals(&p.display().to_string(), &text)
            .map_err(|e| CliError::input(e.to_string()));
    }
    if let Some(t) = nu {
        return spectra::parse_fundamentals("--nu", t).map_err(|e| CliError::input(e.to_string()));
    }
    spectra::fundamentals_from_gamma(g, rows).map_err(spectra_err)
}

#[derive(Args, Debug)]
pub struct CombosArgs {
    #[command(flatten)]
    pub source: GammaSource,
    /// Fundamentals with positions, e.g. "A1 2917 ν1; T2 3019 ν3" (irrep, cm⁻¹, optional name).
    #[arg(long)]
    pub nu: Option<String>,
    /// A file of fundamentals, one "irrep position [name]" per line.
    #[arg(long, conflicts_with = "nu")]
    pub fundamentals: Option<PathBuf>,
    /// Leave out second overtones 3ν.
    #[arg(long)]
    pub no_second_overtones: bool,
    /// Drop levels above this harmonic position (cm⁻¹).
    #[arg(long)]
    pub max_cm: Option<f64>,
    /// Output format: text (aligned columns), md, latex, json.
    #[arg(long, short, default_value = "text", value_parser = parse_format)]
    pub format: Format,
}

pub fn combos(a: &CombosArgs, ascii: bool) -> CliResult {
    let (g, rows) = a.source.resolve()?;
    let f = fundamentals(&g, &rows, &a.nu, &a.fundamentals)?;
    let r = spectra::predict_combinations(
        &g,
        &f,
        CombinationOptions {
            second_overtones: !a.no_second_overtones,
            max_cm: a.max_cm,
        },
    )
    .map_err(spectra_err)?;
    match a.format {
        Format::Json => print_json(&r),
        _ => print!(
            "{}",
            crate::report::spectra::combinations(&r, a.format, ascii)
        ),
    }
    Ok(())
}

#[derive(Args, Debug)]
pub struct BandsArgs {
    #[command(flatten)]
    pub source: GammaSource,
    /// Observed bands: position, technique (IR/Raman), intensity per line (comma, tab or spaces).
    /// Optional with a session file, whose bands are used.
    #[arg(long)]
    pub bands: Option<PathBuf>,
    /// Proposed fundamentals with positions, e.g. "A1 459; T2 776".
    #[arg(long)]
    pub nu: Option<String>,
    /// A file of proposed fundamentals.
    #[arg(long, conflicts_with = "nu")]
    pub fundamentals: Option<PathBuf>,
    /// Relative matching tolerance in percent.
    #[arg(long, default_value_t = 1.0)]
    pub tol_percent: f64,
    /// Absolute matching tolerance in cm⁻¹ (the larger of the two applies).
    #[arg(long, default_value_t = 10.0)]
    pub tol_cm: f64,
    /// Output format: text (aligned columns), md, latex, json.
    #[arg(long, short, default_value = "text", value_parser = parse_format)]
    pub format: Format,
}

pub fn bands(a: &BandsArgs, ascii: bool) -> CliResult {
    let (g, rows, session_bands) = a.source.resolve_with_bands()?;
    let observed = match &a.bands {
        Some(p) => spectra::load_bands(p).map_err(|e| CliError::input(e.to_string()))?,
        None if !session_bands.is_empty() => session_bands,
        None => {
            return Err(CliError::input("no observed bands")
                .with_hint("give --bands FILE, or a session file with [[band]] entries"))
        }
    };
    let f = match (&a.nu, &a.fundamentals) {
        (None, None) => Vec::new(),
        _ => fundamentals(&g, &rows, &a.nu, &a.fundamentals)?,
    };
    if !(a.tol_percent.is_finite()
        && a.tol_percent >= 0.0
        && a.tol_cm.is_finite()
        && a.tol_cm >= 0.0)
    {
        return Err(CliError::input("tolerances must be non-negative numbers"));
    }
    let r = spectra::check_bands(
        &g,
        &rows,
        &observed,
        &f,
        CheckOptions {
            relative: a.tol_percent / 100.0,
            absolute_cm: a.tol_cm,
        },
    )
    .map_err(spectra_err)?;
    match a.format {
        Format::Json => print_json(&r),
        _ => print!("{}", crate::report::spectra::check(&r, a.format, ascii)),
    }
    Ok(())
}

#[derive(Args, Debug)]
pub struct DescendArgs {
    /// The group, e.g. Td.
    pub group: String,
    /// The subgroup type, e.g. C3v.
    pub subgroup: String,
    /// A class of the group the subgroup must contain (σd, sd, C2'' …; comma-separated for several).
    #[arg(long)]
    pub via: Option<String>,
    /// Γ of fundamentals in the group, to show how each set splits and the activity below.
    #[arg(long)]
    pub gamma: Option<String>,
    /// Output format: text (aligned columns), md, latex, json.
    #[arg(long, short, default_value = "text", value_parser = parse_format)]
    pub format: Format,
}

pub fn descend(a: &DescendArgs, ascii: bool) -> CliResult {
    let r = spectra::descend_names(&a.group, &a.subgroup, a.via.as_deref(), a.gamma.as_deref())
        .map_err(spectra_err)?;
    match a.format {
        Format::Json => print_json(&r),
        _ => print!("{}", crate::report::spectra::descent(&r, a.format, ascii)),
    }
    Ok(())
}
