//! Assigning observed bands to computed modes: each band to the nearest (optionally scaled)
//! fundamental active in its technique, else to an overtone 2νᵢ or binary combination
//! νᵢ + νⱼ whose symmetry is active (`spectra::overtone`, `spectra::combination`), within a
//! tolerance. A band nearest an inactive fundamental is never given to it silently: the
//! proposal says so. A uniform scale factor for harmonic wavenumbers is common practice
//! (e.g. ≈ 0.9 for HF, 0.96 for hybrid functionals).

use super::label::ModeSet;
use crate::group::PointGroup;
use crate::spectra::{self, Band, Technique};

/// Settings of an assignment.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AssignOptions {
    /// Uniform factor applied to harmonic wavenumbers.
    pub scale: f64,
    /// Largest |observed − predicted|, cm⁻¹.
    pub tolerance: f64,
}

impl Default for AssignOptions {
    fn default() -> Self {
        AssignOptions {
            scale: 1.0,
            tolerance: 30.0,
        }
    }
}

/// The proposal for one band.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct Assignment {
    pub position: f64,
    pub technique: String,
    /// `ν3`, `2ν2`, `ν1 + ν4`, or none.
    pub assigned: Option<String>,
    /// Predicted (scaled) position of the assignment, cm⁻¹.
    pub predicted: Option<f64>,
    pub symmetry: Option<String>,
    /// Fundamental, overtone or combination.
    pub kind: Option<String>,
    pub remark: Option<String>,
}

fn active(t: Technique, ir: bool, raman: bool) -> bool {
    match t {
        Technique::Ir => ir,
        Technique::Raman => raman,
    }
}

/// Assign every band.
pub fn assign_bands(
    g: &PointGroup,
    sets: &[ModeSet],
    bands: &[Band],
    opts: AssignOptions,
) -> Vec<Assignment> {
    let reals = spectra::real_irreps(g);
    let idx = |s: &ModeSet| reals.iter().position(|r| r.label == s.irrep);
    let fundamentals: Vec<(&ModeSet, f64)> = sets
        .iter()
        .filter(|s| s.wavenumber > 0.0)
        .map(|s| (s, s.wavenumber * opts.scale))
        .collect();
    // overtones and binary combinations with their symmetry and activity
    let mut levels: Vec<(String, f64, String, bool, bool, &'static str)> = Vec::new();
    for (a, (sa, wa)) in fundamentals.iter().enumerate() {
        for (sb, wb) in fundamentals.iter().skip(a) {
            let (Some(ia), Some(ib)) = (idx(sa), idx(sb)) else {
                continue;
            };
            let (name, sym, kind) = if sa.index == sb.index {
                (
                    format!("2ν{}", sa.nu),
                    spectra::overtone(g, ia, 2),
                    "overtone",
                )
            } else {
                let (x, y) = if sa.nu < sb.nu { (sa, sb) } else { (sb, sa) };
                (
                    format!("ν{} + ν{}", x.nu, y.nu),
                    spectra::combination(g, ia, ib),
                    "combination",
                )
            };
            if let Ok(sym) = sym {
                levels.push((name, wa + wb, sym.text.clone(), sym.ir(), sym.raman(), kind));
            }
        }
    }
    bands
        .iter()
        .map(|b| {
            let tech = b.technique;
            let near = |w: f64| (w - b.position_cm).abs() <= opts.tolerance;
            let best_f = fundamentals
                .iter()
                .filter(|(s, w)| near(*w) && active(tech, s.ir, s.raman))
                .min_by(|x, y| {
                    (x.1 - b.position_cm)
                        .abs()
                        .total_cmp(&(y.1 - b.position_cm).abs())
                });
            let inactive = fundamentals
                .iter()
                .filter(|(s, w)| near(*w) && !active(tech, s.ir, s.raman))
                .min_by(|x, y| {
                    (x.1 - b.position_cm)
                        .abs()
                        .total_cmp(&(y.1 - b.position_cm).abs())
                });
            let mut out = Assignment {
                position: b.position_cm,
                technique: tech.name().to_string(),
                assigned: None,
                predicted: None,
                symmetry: None,
                kind: None,
                remark: None,
            };
            if let Some((s, w)) = best_f {
                out.assigned = Some(format!("ν{}", s.nu));
                out.predicted = Some(*w);
                out.symmetry = Some(s.irrep.clone());
                out.kind = Some("fundamental".into());
                if let Some((t, tw)) = inactive {
                    if (tw - b.position_cm).abs() < (w - b.position_cm).abs() {
                        out.remark = Some(format!(
                            "ν{} ({}, {:.0}) is nearer but inactive in {}",
                            t.nu,
                            t.irrep,
                            tw,
                            tech.name()
                        ));
                    }
                }
                return out;
            }
            let best_l = levels
                .iter()
                .filter(|l| near(l.1) && active(tech, l.3, l.4))
                .min_by(|x, y| {
                    (x.1 - b.position_cm)
                        .abs()
                        .total_cmp(&(y.1 - b.position_cm).abs())
                });
            if let Some(l) = best_l {
                out.assigned = Some(l.0.clone());
                out.predicted = Some(l.1);
                out.symmetry = Some(l.2.clone());
                out.kind = Some(l.5.into());
            }
            if let Some((t, tw)) = inactive {
                out.remark = Some(format!(
                    "nearest fundamental ν{} ({}, {:.0}) is inactive in {}: not assigned to it{}",
                    t.nu,
                    t.irrep,
                    tw,
                    tech.name(),
                    if out.assigned.is_some() {
                        ""
                    } else {
                        "; nothing active within the tolerance"
                    }
                ));
            } else if out.assigned.is_none() {
                out.remark = Some(format!(
                    "nothing active in {} within {} cm⁻¹",
                    tech.name(),
                    opts.tolerance
                ));
            }
            out
        })
        .collect()
}
