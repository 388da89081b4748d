//! The session's `[vibrations]`: its Hessian read (relative to the session file), the normal
//! modes labelled, the session's bands assigned. Errors become a message for the faces.

use crate::session::Session;
use crate::vib::{self, AssignOptions, Assignment, HessianUnits, MassModel, NormalModes, Options};
use std::path::{Path, PathBuf};
use std::sync::Arc;

/// What the faces show about the session's Hessian.
#[derive(Debug, Clone)]
pub struct VibrationAnalysis {
    pub modes: NormalModes,
    pub assignments: Vec<Assignment>,
    pub scale: Option<f64>,
}

fn resolve(base: Option<&Path>, p: &str) -> PathBuf {
    let path = PathBuf::from(p);
    match base {
        Some(b) if path.is_relative() => b.join(path),
        _ => path,
    }
}

/// Analyse the session's Hessian, when it names one.
pub fn analyze(s: &Session, base: Option<&Path>) -> Option<Result<Arc<VibrationAnalysis>, String>> {
    let v = s.vibrations.as_ref()?;
    Some(run(s, v, base).map(Arc::new))
}

fn run(
    s: &Session,
    v: &crate::session::Vibrations,
    base: Option<&Path>,
) -> Result<VibrationAnalysis, String> {
    let hessian = resolve(base, &v.hessian);
    let units = v.units.as_deref().and_then(HessianUnits::parse);
    let head = std::fs::read(&hessian)
        .map(|b| b.iter().copied().find(|c| !c.is_ascii_whitespace()))
        .map_err(|e| format!("{}: {e}", hessian.display()))?;
    let input = if head == Some(b'{') {
        vib::load(&hessian, None, units)
    } else {
        let geometry = v.geometry.clone().or_else(|| match s.geometry.as_ref().map(|g| &g.source) {
            Some(crate::session::GeometrySource::File(f)) => Some(f.clone()),
            _ => None,
        });
        let g = geometry.ok_or_else(|| {
            format!(
                "{}: a plain-text Hessian needs an XYZ geometry: [vibrations] geometry = \"….xyz\" or a [geometry] file",
                hessian.display()
            )
        })?;
        vib::load(&resolve(base, &g), Some(&hessian), units)
    }
    .map_err(|e| e.to_string())?;
    let isotopes = v
        .isotopes
        .iter()
        .map(|i| vib::parse_isotope(i))
        .collect::<Result<Vec<_>, _>>()?;
    let opts = Options {
        tolerance: s
            .geometry
            .as_ref()
            .map_or(crate::geom::DEFAULT_TOLERANCE, |g| g.tolerance),
        mass_model: if v.average_masses {
            MassModel::Average
        } else {
            MassModel::MostAbundant
        },
        isotopes,
        symmetrize: v.symmetrize,
        ..Options::default()
    };
    let mut modes = vib::normal_modes(&input, &opts).map_err(|e| e.to_string())?;
    // A job without a name is titled by its file: as the session names it, not the full path.
    if modes.title == hessian.display().to_string() {
        modes.title = v.hessian.clone();
    }
    let bands = super::observed_bands(s);
    let assignments = if bands.is_empty() {
        Vec::new()
    } else {
        let g = crate::group::load(&modes.parent.point_group).map_err(|e| e.to_string())?;
        vib::assign_bands(
            &g,
            &modes.parent.sets,
            &bands,
            AssignOptions {
                scale: v.scale.unwrap_or(1.0),
                tolerance: v
                    .band_tolerance
                    .unwrap_or(AssignOptions::default().tolerance),
            },
        )
    };
    Ok(VibrationAnalysis {
        modes,
        assignments,
        scale: v.scale,
    })
}
