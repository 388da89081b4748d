//! Checking observed bands against a prediction: counts per technique, which irreps each band
//! could be a fundamental of, coincidences, and overtones/combinations within a tolerance.
//!
//! Rules used (Nakamoto, Part A, ch. 1; Herzberg 1945, ch. III): a band seen in the IR can
//! only be a fundamental of an IR-active irrep, a Raman band of a Raman-active one; a polarized
//! Raman band only of the totally symmetric irrep (ρ < 3/4), a depolarized one of the others
//! (ρ = 3/4); in a centrosymmetric molecule no fundamental appears in both (mutual
//! exclusion), so an IR/Raman coincidence is flagged. Results are candidates, never
//! assignments: the wording is "could be" and "consistent with".
//!
//! Owns: [`CheckOptions`], [`BandCheck`] and [`check_bands`].

use super::activity::{activity_table, modes_report};
use super::bands::{Band, Polarization, Technique};
use super::combos::{predict_combinations, resolve, CombinationOptions, Fundamental};
use super::error::SpectraError;
use super::real::{is_centrosymmetric, to_real};
use crate::group::PointGroup;
use serde::{Deserialize, Serialize};

/// Tolerance for "sits at": max(relative × position, absolute).
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct CheckOptions {
    /// Relative tolerance (default 0.01 = 1 %).
    pub relative: f64,
    /// Absolute tolerance, cm⁻¹ (default 10).
    pub absolute_cm: f64,
}

impl Default for CheckOptions {
    fn default() -> Self {
        CheckOptions {
            relative: 0.01,
            absolute_cm: 10.0,
        }
    }
}

impl CheckOptions {
    pub fn tolerance_at(&self, position_cm: f64) -> f64 {
        (self.relative * position_cm).max(self.absolute_cm)
    }
}

/// An overtone or combination level a band sits near.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LevelMatch {
    pub label: String,
    pub symmetry: String,
    pub harmonic_cm: f64,
    /// observed − harmonic, cm⁻¹ (usually ≤ 0 from anharmonicity).
    pub deviation_cm: f64,
}

/// What one band could be.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct BandVerdict {
    /// Index in the input list.
    pub index: usize,
    pub band: Band,
    /// Irreps of Γ this band could be a fundamental of.
    pub fundamental_candidates: Vec<String>,
    /// Bands of the other technique within tolerance.
    pub coincident_with: Vec<usize>,
    /// Name of a user-listed fundamental at this position (within 1 cm⁻¹).
    pub listed_fundamental: Option<String>,
    /// Overtones/combinations of listed fundamentals within tolerance, allowed for this band.
    pub level_candidates: Vec<LevelMatch>,
    /// Sentences: "could be …", "consistent with …".
    pub remarks: Vec<String>,
}

/// Observed vs predicted count for one technique.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct CountCheck {
    /// `IR`, `Raman`, `Raman polarized`.
    pub what: String,
    pub observed: u64,
    pub predicted: u64,
    pub remark: String,
}

/// A conflict between the data, the prediction and the user's assignments.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct Conflict {
    /// Band indices involved.
    pub bands: Vec<usize>,
    pub message: String,
}

/// The full check.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct BandCheck {
    pub point_group: String,
    pub gamma: String,
    pub options: CheckOptions,
    pub counts: Vec<CountCheck>,
    pub bands: Vec<BandVerdict>,
    pub conflicts: Vec<Conflict>,
}

/// Listed fundamentals closer than this to a band are taken as that band.
const SAME_BAND_CM: f64 = 1.0;

/// Check observed bands against Γ (multiplicities per table row), with optional
/// fundamentals (irrep, position) the user proposes.
pub fn check_bands(
    g: &PointGroup,
    rows: &[u64],
    bands: &[Band],
    fundamentals: &[Fundamental],
    opts: CheckOptions,
) -> Result<BandCheck, SpectraError> {
    let report = modes_report(g, rows)?;
    let real = to_real(g, rows)?;
    let table = activity_table(g);
    let centro = is_centrosymmetric(g);
    let resolved = resolve(g, fundamentals)?;
    // Names follow the user's list (ν1 = first listed), also for those without a position.
    let positioned: Vec<Fundamental> = fundamentals
        .iter()
        .zip(&resolved)
        .filter(|(f, _)| f.position_cm.is_some())
        .map(|(f, (_, name))| Fundamental {
            name: Some(name.clone()),
            ..f.clone()
        })
        .collect();
    let levels = predict_combinations(g, &positioned, CombinationOptions::default())?.levels;
    let mut conflicts = Vec::new();

    // Listed fundamentals must be irreps present in Γ.
    for (k, (i, name)) in resolved.iter().enumerate() {
        if real[*i] == 0 {
            conflicts.push(Conflict {
                bands: vec![],
                message: format!(
                    "{name} is listed as {} but Γ = {} has no {} fundamental",
                    fundamentals[k].irrep, report.gamma, table[*i].irrep
                ),
            });
        }
    }

    let mut verdicts = Vec::new();
    for (bi, band) in bands.iter().enumerate() {
        let tol = opts.tolerance_at(band.position_cm);
        let allowed = |a: &super::activity::IrrepActivity| match band.technique {
            Technique::Ir => a.ir,
            Technique::Raman => {
                a.raman
                    && match band.polarization {
                        Some(Polarization::P) => a.totally_symmetric,
                        Some(Polarization::Dp) => !a.totally_symmetric,
                        None => true,
                    }
            }
        };
        let fundamental_candidates: Vec<String> = table
            .iter()
            .zip(&real)
            .filter(|(a, n)| **n > 0 && allowed(a))
            .map(|(a, _)| a.irrep.clone())
            .collect();
        let coincident_with: Vec<usize> = bands
            .iter()
            .enumerate()
            .filter(|(j, o)| {
                *j != bi
                    && o.technique != band.technique
                    && (o.position_cm - band.position_cm).abs() <= tol
            })
            .map(|(j, _)| j)
            .collect();
        let mut remarks = Vec::new();
        let listed = resolved.iter().enumerate().find(|(k, _)| {
            fundamentals[*k]
                .position_cm
                .is_some_and(|p| (p - band.position_cm).abs() <= SAME_BAND_CM)
        });
        let mut level_candidates = Vec::new();
        if let Some((k, (i, name))) = listed {
            let a = &table[*i];
            if allowed(a) {
                remarks.push(format!(
                    "consistent with {name} ({}) as listed",
                    fundamentals[k].irrep
                ));
            } else {
                conflicts.push(Conflict {
                    bands: vec![bi],
                    message: format!(
                        "band {} ({} cm⁻¹, {}{}) is listed as {name} of {}, which cannot give \
                         such a band as a fundamental",
                        bi + 1,
                        band.position_cm,
                        band.technique.name(),
                        pol_text(band.polarization),
                        a.irrep
                    ),
                });
            }
        } else {
            for l in &levels {
                let Some(h) = l.harmonic_cm else { continue };
                let ok = match band.technique {
                    Technique::Ir => l.ir,
                    Technique::Raman => match band.polarization {
                        Some(Polarization::P) => l.polarized,
                        _ => l.raman,
                    },
                };
                if ok && (band.position_cm - h).abs() <= tol {
                    level_candidates.push(LevelMatch {
                        label: l.label.clone(),
                        symmetry: l.symmetry.text.clone(),
                        harmonic_cm: h,
                        deviation_cm: band.position_cm - h,
                    });
                }
            }
            level_candidates.sort_by(|a, b| a.deviation_cm.abs().total_cmp(&b.deviation_cm.abs()));
            // Irreps whose fundamentals the user has all placed at other positions.
            let (free, taken): (Vec<&String>, Vec<&String>) =
                fundamental_candidates.iter().partition(|label| {
                    let i = table.iter().position(|a| &a.irrep == *label).unwrap_or(0);
                    let listed = resolved
                        .iter()
                        .zip(fundamentals)
                        .filter(|((j, _), f)| *j == i && f.position_cm.is_some())
                        .count() as u64;
                    listed < real[i]
                });
            let any_free = !free.is_empty();
            if any_free {
                let free: Vec<&str> = free.iter().map(|s| s.as_str()).collect();
                remarks.push(format!("could be a fundamental of {}", free.join(" or ")));
            }
            if !taken.is_empty() {
                let taken: Vec<&str> = taken.iter().map(|s| s.as_str()).collect();
                remarks.push(format!(
                    "symmetry also allows a fundamental of {}, but all of those are listed at \
                     other positions",
                    taken.join(" or ")
                ));
            }
            if !level_candidates.is_empty() {
                let list: Vec<String> = level_candidates
                    .iter()
                    .map(|m| {
                        format!(
                            "{} ({}, harmonic {:.0})",
                            m.label, m.symmetry, m.harmonic_cm
                        )
                    })
                    .collect();
                remarks.push(format!("could be {}", list.join(" or ")));
            }
            if !any_free && level_candidates.is_empty() {
                remarks.push(format!(
                    "not explained by a fundamental of Γ{} within ±{tol:.0} cm⁻¹: could be an \
                     impurity, a lattice or site effect, or a level not considered",
                    if positioned.is_empty() {
                        ""
                    } else {
                        " or a listed overtone/combination"
                    }
                ));
            }
        }
        if !coincident_with.is_empty() {
            let both: Vec<String> = table
                .iter()
                .zip(&real)
                .filter(|(a, n)| **n > 0 && a.ir && a.raman)
                .map(|(a, _)| a.irrep.clone())
                .collect();
            if centro {
                // Report each pair once, from the IR side.
                if band.technique == Technique::Ir {
                    for &j in &coincident_with {
                        conflicts.push(Conflict {
                            bands: vec![bi, j],
                            message: format!(
                                "IR band {} ({} cm⁻¹) and Raman band {} ({} cm⁻¹) coincide \
                                 within tolerance, but {} is centrosymmetric: they cannot be \
                                 the same fundamental (mutual exclusion); could be two modes \
                                 at nearly the same position, or the molecule may not be \
                                 centrosymmetric",
                                bi + 1,
                                band.position_cm,
                                j + 1,
                                bands[j].position_cm,
                                g.name()
                            ),
                        });
                    }
                }
            } else if both.is_empty() {
                remarks.push(
                    "seen in both IR and Raman, but no irrep of Γ is active in both: could be \
                     two different modes"
                        .into(),
                );
            } else {
                remarks.push(format!(
                    "seen in both IR and Raman: consistent with one fundamental of {}",
                    both.join(" or ")
                ));
            }
        }
        verdicts.push(BandVerdict {
            index: bi,
            band: band.clone(),
            fundamental_candidates,
            coincident_with,
            listed_fundamental: listed.map(|(_, (_, n))| n.clone()),
            level_candidates,
            remarks,
        });
    }

    let count = |f: &dyn Fn(&Band) -> bool| bands.iter().filter(|b| f(b)).count() as u64;
    let mut counts = vec![
        count_check(
            "IR",
            count(&|b| b.technique == Technique::Ir),
            report.ir_bands,
        ),
        count_check(
            "Raman",
            count(&|b| b.technique == Technique::Raman),
            report.raman_bands,
        ),
    ];
    if bands.iter().any(|b| b.polarization.is_some()) {
        let predicted: u64 = report
            .modes
            .iter()
            .filter(|m| m.polarized)
            .map(|m| m.multiplicity)
            .sum();
        counts.push(count_check(
            "Raman polarized",
            count(&|b| b.polarization == Some(Polarization::P)),
            predicted,
        ));
    }
    Ok(BandCheck {
        point_group: g.name().to_string(),
        gamma: report.gamma,
        options: opts,
        counts,
        bands: verdicts,
        conflicts,
    })
}

fn pol_text(p: Option<Polarization>) -> &'static str {
    match p {
        Some(Polarization::P) => ", polarized",
        Some(Polarization::Dp) => ", depolarized",
        None => "",
    }
}

fn count_check(what: &str, observed: u64, predicted: u64) -> CountCheck {
    let remark = if observed == predicted {
        "consistent with the number of fundamentals".to_string()
    } else if observed > predicted {
        format!(
            "{} more than predicted fundamentals: the extra bands could be overtones, \
             combinations, site or lattice effects, or impurities",
            observed - predicted
        )
    } else {
        format!(
            "{} fewer than predicted fundamentals: some could be too weak, outside the measured \
             range, or accidentally coincident",
            predicted - observed
        )
    };
    CountCheck {
        what: what.to_string(),
        observed,
        predicted,
        remark,
    }
}
