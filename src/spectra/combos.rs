//! Overtone and combination bands of a set of fundamentals: which levels exist, their
//! symmetry and activity, and the harmonic estimate of their positions.
//!
//! The estimate is the harmonic sum; in common practice anharmonicity puts overtones and
//! combinations at or slightly below it (Herzberg, *Infrared and Raman Spectra* (1945),
//! ch. II; Nakamoto, Part A, ch. 1).
//!
//! Owns: [`Fundamental`], [`CombinationBand`], [`CombinationsReport`], [`predict_combinations`].

use super::error::SpectraError;
use super::real::{real_index, real_irreps, to_real};
use super::symmetry::{combination, overtone, Symmetry};
use crate::group::PointGroup;
use serde::{Deserialize, Serialize};

/// A fundamental: its irrep and, if known, its position.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Fundamental {
    /// Label of a real irrep (`A1`, `E`, `T2g`, `Piu`).
    pub irrep: String,
    /// Observed or assigned wavenumber, cm⁻¹.
    #[serde(default)]
    pub position_cm: Option<f64>,
    /// Name such as `ν3`; numbered by [`customary_ranks`] when absent.
    #[serde(default)]
    pub name: Option<String>,
}

/// Overtone or combination.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum LevelKind {
    Overtone,
    Combination,
}

/// One overtone or binary combination level.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CombinationBand {
    pub kind: LevelKind,
    /// `2ν1`, `3ν2`, `ν1 + ν3`.
    pub label: String,
    /// Indices into the fundamentals list (repeated for overtones).
    pub of: Vec<usize>,
    /// Harmonic sum, cm⁻¹, when the fundamentals have positions.
    pub harmonic_cm: Option<f64>,
    pub symmetry: Symmetry,
    pub ir: bool,
    pub raman: bool,
    /// Has a totally symmetric Raman-active part (a polarized band is possible).
    pub polarized: bool,
}

/// Options for [`predict_combinations`].
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct CombinationOptions {
    /// Include second overtones 3ν.
    pub second_overtones: bool,
    /// Drop levels above this harmonic position (cm⁻¹).
    pub max_cm: Option<f64>,
}

impl Default for CombinationOptions {
    fn default() -> Self {
        CombinationOptions {
            second_overtones: true,
            max_cm: None,
        }
    }
}

/// The list of levels for a set of fundamentals.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CombinationsReport {
    pub point_group: String,
    pub fundamentals: Vec<Fundamental>,
    /// Sorted by harmonic position when known, otherwise in list order.
    pub levels: Vec<CombinationBand>,
    pub note: String,
    /// The convention by which unnamed fundamentals are numbered.
    pub numbering: String,
}

/// The note printed with every prediction.
pub const ANHARMONIC_NOTE: &str = "Positions are harmonic sums. In common practice \
anharmonicity puts overtones and combinations at or slightly below the sum (Herzberg 1945, \
ch. II). Activity follows the symmetry of the level; such bands are usually weak unless \
enhanced by Fermi resonance.";

/// One fundamental per degenerate set of Γ (per table row multiplicities), without positions,
/// named ν1, ν2, … by [`customary_ranks`].
pub fn fundamentals_from_gamma(
    g: &PointGroup,
    rows: &[u64],
) -> Result<Vec<Fundamental>, SpectraError> {
    let real = to_real(g, rows)?;
    let reals = real_irreps(g);
    let mut irreps = Vec::new();
    for (i, n) in real.iter().enumerate() {
        irreps.extend(std::iter::repeat_n(i, *n as usize));
    }
    let ranks = customary_ranks(g, &irreps, &vec![None; irreps.len()]);
    let mut out: Vec<(usize, Fundamental)> = irreps
        .iter()
        .zip(ranks)
        .map(|(&i, r)| {
            (
                r,
                Fundamental {
                    irrep: reals[i].label.clone(),
                    position_cm: None,
                    name: Some(format!("ν{}", r + 1)),
                },
            )
        })
        .collect();
    out.sort_by_key(|(r, _)| *r);
    Ok(out.into_iter().map(|(_, f)| f).collect())
}

/// How fundamentals without a name are numbered, stated with every prediction.
pub const NUMBERING_NOTE: &str = "ν numbering: by symmetry species in the character table's \
order, non-degenerate species before degenerate ones, and within a species by decreasing \
wavenumber when positions are given (Mulliken 1955, as applied by Herzberg 1945); independent \
of the order typed.";

/// Customary rank (0-based) of each fundamental: (degenerate?, species in table order,
/// decreasing position, unknown positions last, then typing order).
pub fn customary_ranks(g: &PointGroup, irreps: &[usize], positions: &[Option<f64>]) -> Vec<usize> {
    let reals = real_irreps(g);
    let mut order: Vec<usize> = (0..irreps.len()).collect();
    order.sort_by(|&a, &b| {
        let key = |k: usize| (reals[irreps[k]].dim > 1, irreps[k]);
        key(a)
            .cmp(&key(b))
            .then_with(|| match (positions[a], positions[b]) {
                (Some(p), Some(q)) => q.total_cmp(&p),
                (Some(_), None) => std::cmp::Ordering::Less,
                (None, Some(_)) => std::cmp::Ordering::Greater,
                (None, None) => a.cmp(&b),
            })
    });
    let mut rank = vec![0; irreps.len()];
    for (r, &k) in order.iter().enumerate() {
        rank[k] = r;
    }
    rank
}

/// Resolve fundamentals' irreps to real-irrep indices, with their names (given, or νk by
/// [`customary_ranks`]).
pub(crate) fn resolve(
    g: &PointGroup,
    fundamentals: &[Fundamental],
) -> Result<Vec<(usize, String)>, SpectraError> {
    fundamentals
        .iter()
        .enumerate()
        .map(|(k, f)| {
            let bad = |message: String| SpectraError::BadFundamental {
                index: k + 1,
                irrep: f.irrep.clone(),
                position: f.position_cm.map(|p| p.to_string()).unwrap_or("?".into()),
                message,
            };
            if let Some(p) = f.position_cm {
                if !p.is_finite() || p <= 0.0 {
                    return Err(bad("position must be a positive number".into()));
                }
            }
            let i = crate::rep::parse_irrep(g, &f.irrep)
                .ok()
                .and_then(|_| real_index(g, &f.irrep))
                .ok_or_else(|| bad(format!("not an irrep of {}", g.name())))?;
            Ok(i)
        })
        .collect::<Result<Vec<usize>, SpectraError>>()
        .map(|irreps| {
            let positions: Vec<Option<f64>> = fundamentals.iter().map(|f| f.position_cm).collect();
            let ranks = customary_ranks(g, &irreps, &positions);
            irreps
                .iter()
                .zip(fundamentals)
                .zip(ranks)
                .map(|((&i, f), r)| (i, f.name.clone().unwrap_or_else(|| format!("ν{}", r + 1))))
                .collect()
        })
}

/// Most overtone and combination levels listed at once (about 445 fundamentals with second
/// overtones). Beyond that a list is of no use to read, and it would cost seconds and hundreds
/// of MB: the caller is asked to narrow it by position instead.
pub const MAX_LEVELS: usize = 100_000;

/// Overtones 2ν (and 3ν) of every fundamental and all binary combinations νi + νj (at most
/// [`MAX_LEVELS`] of them).
pub fn predict_combinations(
    g: &PointGroup,
    fundamentals: &[Fundamental],
    opts: CombinationOptions,
) -> Result<CombinationsReport, SpectraError> {
    let resolved = resolve(g, fundamentals)?;
    // List the fundamentals in their customary order (ν1, ν2, … when unnamed).
    let irreps: Vec<usize> = resolved.iter().map(|(i, _)| *i).collect();
    let positions: Vec<Option<f64>> = fundamentals.iter().map(|f| f.position_cm).collect();
    let ranks = customary_ranks(g, &irreps, &positions);
    let mut order: Vec<usize> = (0..fundamentals.len()).collect();
    order.sort_by_key(|&k| ranks[k]);
    let fundamentals: Vec<Fundamental> = order
        .iter()
        .map(|&k| Fundamental {
            name: Some(resolved[k].1.clone()),
            ..fundamentals[k].clone()
        })
        .collect();
    let resolved: Vec<(usize, String)> = order.iter().map(|&k| resolved[k].clone()).collect();
    let fundamentals = &fundamentals[..];
    let nf = fundamentals.len();
    let per_mode = if opts.second_overtones { 2 } else { 1 };
    let all = nf * per_mode + nf * nf.saturating_sub(1) / 2;
    let too_many = |levels: usize| SpectraError::TooManyLevels {
        fundamentals: nf,
        levels,
        limit: MAX_LEVELS,
    };
    let filtered = opts.max_cm.is_some() && fundamentals.iter().all(|f| f.position_cm.is_some());
    if all > MAX_LEVELS && !filtered {
        return Err(too_many(all));
    }
    // The symmetry of a level depends only on the irreps: each reduced once (a cluster's
    // thousand fundamentals repeat a dozen irreps).
    let nr = real_irreps(g).len();
    let mut products: Vec<Option<Symmetry>> = vec![None; nr * nr];
    let mut powers: Vec<Option<Symmetry>> = vec![None; nr * 4];
    let mut levels = Vec::new();
    let pos = |k: usize| fundamentals[k].position_cm;
    let kept = |of: &[usize]| -> Option<Option<f64>> {
        let harmonic_cm = of.iter().map(|&k| pos(k)).sum::<Option<f64>>();
        match (opts.max_cm, harmonic_cm) {
            (Some(max), Some(h)) if h > max => None,
            _ => Some(harmonic_cm),
        }
    };
    let mut push = |kind, label: String, of: Vec<usize>, harmonic_cm, symmetry: &Symmetry| {
        if levels.len() == MAX_LEVELS {
            return Err(too_many(all));
        }
        levels.push(CombinationBand {
            kind,
            label,
            of,
            harmonic_cm,
            ir: symmetry.ir(),
            raman: symmetry.raman(),
            polarized: symmetry.polarized(),
            symmetry: symmetry.clone(),
        });
        Ok(())
    };
    for (k, (irrep, name)) in resolved.iter().enumerate() {
        for n in 2..=if opts.second_overtones { 3 } else { 2 } {
            let of = vec![k; n as usize];
            let Some(h) = kept(&of) else { continue };
            let sym = reduced_once(&mut powers[irrep * 4 + n as usize], || {
                overtone(g, *irrep, n)
            })?;
            push(LevelKind::Overtone, format!("{n}{name}"), of, h, sym)?;
        }
    }
    for (a, (ia, na)) in resolved.iter().enumerate() {
        for (b, (ib, nb)) in resolved.iter().enumerate().skip(a + 1) {
            let Some(h) = kept(&[a, b]) else { continue };
            let sym = reduced_once(&mut products[ia.min(ib) * nr + ia.max(ib)], || {
                combination(g, *ia, *ib)
            })?;
            push(
                LevelKind::Combination,
                format!("{na} + {nb}"),
                vec![a, b],
                h,
                sym,
            )?;
        }
    }
    levels.sort_by(|x, y| match (x.harmonic_cm, y.harmonic_cm) {
        (Some(p), Some(q)) => p.total_cmp(&q),
        _ => std::cmp::Ordering::Equal,
    });
    Ok(CombinationsReport {
        point_group: g.name().to_string(),
        fundamentals: fundamentals.to_vec(),
        levels,
        note: ANHARMONIC_NOTE.to_string(),
        numbering: NUMBERING_NOTE.to_string(),
    })
}

/// The symmetry held in `slot`, reduced by `make` the first time.
fn reduced_once(
    slot: &mut Option<Symmetry>,
    make: impl FnOnce() -> Result<Symmetry, SpectraError>,
) -> Result<&Symmetry, SpectraError> {
    if slot.is_none() {
        *slot = Some(make()?);
    }
    Ok(slot.as_ref().expect("just reduced"))
}

/// An error in a list of fundamentals, with its line and field.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("{file}:{line}: field {field}: {message}")]
pub struct FundamentalsError {
    pub file: String,
    pub line: usize,
    pub field: usize,
    pub message: String,
}

/// Read fundamentals, one per line or separated by `;`: `irrep [position] [name]`, e.g.
/// `A1 459 ν1`, `T2, 314`; `#` starts a comment. Irreps are checked later against the group
/// (see [`predict_combinations`]); here only the shape of each line.
pub fn parse_fundamentals(file: &str, text: &str) -> Result<Vec<Fundamental>, FundamentalsError> {
    let mut out = Vec::new();
    for (k, raw) in text.lines().enumerate() {
        let content = raw.split('#').next().unwrap_or("");
        for entry in content.split(';') {
            let fields: Vec<&str> = entry
                .split([',', '\t', ' '])
                .map(str::trim)
                .filter(|s| !s.is_empty())
                .collect();
            let Some(irrep) = fields.first() else {
                continue;
            };
            let position_cm = match fields.get(1) {
                None => None,
                Some(p) => match p.parse::<f64>() {
                    Ok(v) if v.is_finite() && v > 0.0 => Some(v),
                    _ => {
                        return Err(FundamentalsError {
                            file: file.to_string(),
                            line: k + 1,
                            field: 2,
                            message: format!("'{p}' is not a positive position in cm⁻¹"),
                        })
                    }
                },
            };
            out.push(Fundamental {
                irrep: irrep.to_string(),
                position_cm,
                name: (fields.len() > 2).then(|| fields[2..].join(" ")),
            });
        }
    }
    Ok(out)
}
