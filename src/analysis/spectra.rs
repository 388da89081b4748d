//! The session's vibrational picture: which Γvib the spectra are predicted from (the
//! geometry's survey, else the first Cartesian set), its activity and band counts, the
//! symmetry of overtones and binary combinations, and the check of the observed bands.
//! Cached by (group, Γ, bands): keystrokes that change neither cost a lookup.

use crate::group::PointGroup;
use crate::session::{self, Session};
use crate::spectra::{self, BandCheck, CombinationsReport, ModesReport};
use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};

/// Predictions for one Γvib and the check of the session's bands against them.
#[derive(Debug, Clone)]
pub struct SpectraAnalysis {
    /// Where Γvib comes from, in words (`the geometry (CH4, Td)`, `set 'Cartesian'`).
    pub source: String,
    /// The group Γ is expressed in.
    pub group: Arc<PointGroup>,
    /// Γvib per table row.
    pub rows: Vec<u64>,
    pub modes: Result<ModesReport, String>,
    /// Overtones 2ν and binary combinations νi + νj: symmetry and activity.
    pub combinations: Result<CombinationsReport, String>,
    /// `None` when the session records no bands.
    pub check: Option<Result<BandCheck, String>>,
}

type Key = (String, Vec<u64>, String, String);
type Cache = Mutex<HashMap<Key, Arc<SpectraAnalysis>>>;

fn cache() -> &'static Cache {
    static C: OnceLock<Cache> = OnceLock::new();
    C.get_or_init(|| Mutex::new(HashMap::new()))
}

/// The session's bands in the spectroscopy layer's terms.
pub fn observed_bands(s: &Session) -> Vec<spectra::Band> {
    use session::{Polarization as SP, Technique as ST};
    s.bands
        .iter()
        .map(|b| spectra::Band {
            position_cm: b.position,
            technique: match b.technique {
                ST::Ir => spectra::Technique::Ir,
                ST::Raman => spectra::Technique::Raman,
            },
            intensity: if b.intensity.trim().is_empty() {
                None
            } else {
                Some(match b.intensity.trim().parse::<f64>() {
                    Ok(v) => spectra::Intensity::Value(v),
                    Err(_) => spectra::Intensity::Word(b.intensity.clone()),
                })
            },
            polarization: b.polarization.map(|p| match p {
                SP::Polarized => spectra::Polarization::P,
                SP::Depolarized => spectra::Polarization::Dp,
            }),
            note: if b.note.is_empty() {
                None
            } else {
                Some(b.note.clone())
            },
        })
        .collect()
}

/// The fundamentals of Γvib, named ν1, ν2, … in the customary order, with the positions the
/// session gives them (`[fundamentals]`, by ν number; numbers beyond Γvib are ignored here).
/// The names stay those of the unplaced list, so a position never renumbers the modes.
pub fn placed_fundamentals(
    g: &PointGroup,
    rows: &[u64],
    positions: &[(usize, f64)],
) -> Result<Vec<spectra::Fundamental>, spectra::SpectraError> {
    let mut f = spectra::fundamentals_from_gamma(g, rows)?;
    for &(n, p) in positions {
        if let Some(x) = n.checked_sub(1).and_then(|k| f.get_mut(k)) {
            x.position_cm = Some(p);
        }
    }
    Ok(f)
}

/// Predictions for Γvib `rows` of group `g` with the fundamentals' positions, and the check
/// of `bands` (cached).
pub fn predict(
    source: String,
    g: &Arc<PointGroup>,
    rows: &[u64],
    bands: &[spectra::Band],
    positions: &[(usize, f64)],
) -> Arc<SpectraAnalysis> {
    let key = (
        g.name().to_string(),
        rows.to_vec(),
        format!("{bands:?}"),
        format!("{positions:?}"),
    );
    if let Some(hit) = cache().lock().ok().and_then(|c| c.get(&key).cloned()) {
        if hit.source == source {
            return hit;
        }
    }
    let modes = spectra::modes_report(g, rows).map_err(|e| e.to_string());
    let combinations = placed_fundamentals(g, rows, positions)
        .and_then(|f| spectra::predict_combinations(g, &f, Default::default()))
        .map_err(|e| e.to_string());
    let check = (!bands.is_empty()).then(|| {
        spectra::check_bands(g, rows, bands, &[], Default::default()).map_err(|e| e.to_string())
    });
    let out = Arc::new(SpectraAnalysis {
        source,
        group: g.clone(),
        rows: rows.to_vec(),
        modes,
        combinations,
        check,
    });
    if let Ok(mut c) = cache().lock() {
        if c.len() >= 32 {
            c.clear();
        }
        c.insert(key, out.clone());
    }
    out
}
