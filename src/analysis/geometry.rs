//! The session's geometry: atoms (inline or from an XYZ file) → survey (detected group, near
//! misses, bonds, bond sets with Γ, Γ3N/Γvib, redundancies) and, on the full depth, the exact
//! stretch SALCs of each bond set. Both are cached by geometry and tolerance, so keystrokes
//! that do not touch the geometry cost a lookup. Bad input becomes a located message.

use crate::basis::{self, Structure};
use crate::geom::{self, Molecule};
use crate::salc::{self, SalcSet};
use crate::session::{Geometry, GeometrySource, Session};
use crate::survey::{self, Survey, SurveyOptions};
use std::collections::HashMap;
use std::path::{Path, PathBuf};
use std::sync::{Arc, Mutex, OnceLock};

/// Exact stretch SALCs of one bond set of the geometry.
#[derive(Debug, Clone)]
pub struct BondSalcs {
    /// The set's name as the basis layer gives it.
    pub name: String,
    pub result: Result<SalcSet, String>,
    /// The set's basis (how every operation moves each bond), for worked projections.
    pub basis: Option<Arc<basis::Basis>>,
}

/// What the geometry layer gave for the session.
#[derive(Debug, Clone)]
pub struct GeometryAnalysis {
    /// Where the atoms come from, in words (`inline atoms`, `XYZ file mx4.xyz`).
    pub source: String,
    /// Å.
    pub tolerance: f64,
    /// The survey, or why there is none (located: atom number, or file line and column).
    pub survey: Result<Arc<Survey>, String>,
    /// Stretch SALCs per bond set; `None` until the full analysis has computed them.
    pub salcs: Option<Arc<Result<Vec<BondSalcs>, String>>>,
}

/// (source, tolerance bits, file stamp + bond edits).
type Key = (String, u64, String);

const LIMIT: usize = 64;

type SurveyCache = Mutex<HashMap<Key, Result<Arc<Survey>, String>>>;
type SalcCache = Mutex<HashMap<Key, Arc<Result<Vec<BondSalcs>, String>>>>;

fn surveys() -> &'static SurveyCache {
    static C: OnceLock<SurveyCache> = OnceLock::new();
    C.get_or_init(|| Mutex::new(HashMap::new()))
}

fn salc_cache() -> &'static SalcCache {
    static C: OnceLock<SalcCache> = OnceLock::new();
    C.get_or_init(|| Mutex::new(HashMap::new()))
}

fn remember<V: Clone>(m: &Mutex<HashMap<Key, V>>, key: Key, v: V) {
    if let Ok(mut c) = m.lock() {
        if c.len() >= LIMIT {
            c.clear();
        }
        c.insert(key, v);
    }
}

fn resolve(file: &str, base: Option<&Path>) -> PathBuf {
    let p = PathBuf::from(file);
    match base {
        Some(b) if p.is_relative() => b.join(p),
        _ => p,
    }
}

fn key_of(g: &Geometry, base: Option<&Path>) -> Key {
    let (src, stamp) = match &g.source {
        GeometrySource::Atoms(atoms) => (format!("{atoms:?}"), String::new()),
        GeometrySource::File(f) => {
            let p = resolve(f, base);
            let stamp = std::fs::metadata(&p)
                .map(|m| format!("{:?} {}", m.modified().ok(), m.len()))
                .unwrap_or_else(|_| "missing".into());
            (p.display().to_string(), stamp)
        }
    };
    let edits = format!("{stamp} +{:?} -{:?}", g.add_bonds, g.remove_bonds);
    (src, g.tolerance.to_bits(), edits)
}

pub(super) fn molecule(g: &Geometry, base: Option<&Path>) -> Result<Molecule, String> {
    match &g.source {
        GeometrySource::Atoms(atoms) => {
            if atoms.is_empty() {
                return Err("[geometry] `atoms` is empty: give at least one atom".into());
            }
            let mut out = Vec::with_capacity(atoms.len());
            for (k, a) in atoms.iter().enumerate() {
                let z = geom::atomic_number(&a.element).ok_or_else(|| {
                    format!(
                        "[geometry] atom {}: '{}' is not an element symbol",
                        k + 1,
                        a.element
                    )
                })?;
                if a.xyz.iter().any(|c| !c.is_finite()) {
                    return Err(format!(
                        "[geometry] atom {} ({}): coordinates must be finite numbers",
                        k + 1,
                        a.element
                    ));
                }
                out.push(geom::Atom::new(
                    z,
                    nalgebra::Vector3::new(a.xyz[0], a.xyz[1], a.xyz[2]),
                ));
            }
            Ok(Molecule::new("session geometry", out))
        }
        GeometrySource::File(f) => {
            let p = resolve(f, base);
            let bytes =
                std::fs::read(&p).map_err(|e| format!("[geometry] file {}: {e}", p.display()))?;
            geom::read_xyz(bytes, &geom::XyzOptions::default())
                .map_err(|e| format!("[geometry] file {}: {e}", p.display()))
        }
    }
}

fn run_survey(g: &Geometry, base: Option<&Path>) -> Result<Arc<Survey>, String> {
    if !(g.tolerance.is_finite() && g.tolerance > 0.0) {
        return Err(format!(
            "[geometry] tolerance {} Å: it must be a positive number",
            g.tolerance
        ));
    }
    survey_molecule(molecule(g, base)?, g)
}

/// Survey a molecule with the geometry's tolerance and bond edits (also for what-if copies).
pub(super) fn survey_molecule(mut mol: Molecule, g: &Geometry) -> Result<Arc<Survey>, String> {
    let mut opts = SurveyOptions {
        tolerance: g.tolerance,
        ..SurveyOptions::default()
    };
    let edits = geom::BondEdits {
        add: g.add_bonds.clone(),
        remove: g.remove_bonds.clone(),
    };
    if !edits.is_empty() {
        mol.bonds = with_edits(&mol, &edits, opts.bond_factor)?;
        opts.perceive_bonds = false;
    }
    survey::survey(&mol, &opts)
        .map(Arc::new)
        .map_err(|e| format!("[geometry] {e}"))
}

/// Perceived bonds with the user's edits applied (located message on a bad atom number).
fn with_edits(
    mol: &Molecule,
    edits: &geom::BondEdits,
    factor: f64,
) -> Result<Vec<(usize, usize)>, String> {
    let perceived =
        geom::perceive_bonds(mol, factor).map_err(|e| format!("[geometry] bonds: {e}"))?;
    edits
        .apply(&perceived, mol.atoms.len())
        .map_err(|e| format!("[geometry] {e}"))
}

/// Stretch SALCs of every bond set of a surveyed geometry.
fn bond_salcs(s: &Survey) -> Result<Vec<BondSalcs>, String> {
    if s.bonds.is_empty() {
        return Ok(Vec::new());
    }
    let st = Structure::from_oriented(
        s.working.clone(),
        &s.oriented.molecule,
        s.bonds.clone(),
        s.detection.tolerance,
        s.detection.max_deviation,
    )
    .map_err(|e| e.to_string())?;
    let all = basis::stretches(&st, &st.bonds).map_err(|e| e.to_string())?;
    Ok(basis::bond_sets(&st)
        .into_iter()
        .map(|set| {
            let b = all.restricted(&set.items);
            BondSalcs {
                result: salc::salcs(&b).map_err(|e| e.to_string()),
                name: set.name,
                basis: Some(Arc::new(b)),
            }
        })
        .collect())
}

/// The geometry layer for a session, if it has a geometry. `salcs_too` computes the SALCs
/// (slow for large molecules); otherwise they are taken from the cache when there.
pub fn analyze_geometry(
    session: &Session,
    base: Option<&Path>,
    salcs_too: bool,
) -> Option<GeometryAnalysis> {
    let g = session.geometry.as_ref()?;
    let key = key_of(g, base);
    let cached = surveys().lock().ok().and_then(|c| c.get(&key).cloned());
    let survey = match cached {
        Some(s) => s,
        None => {
            let s = run_survey(g, base);
            remember(surveys(), key.clone(), s.clone());
            s
        }
    };
    let mut salcs = salc_cache().lock().ok().and_then(|c| c.get(&key).cloned());
    if salcs.is_none() && salcs_too {
        if let Ok(s) = &survey {
            let r = Arc::new(bond_salcs(s));
            remember(salc_cache(), key, r.clone());
            salcs = Some(r);
        }
    }
    let source = match &g.source {
        GeometrySource::Atoms(a) => format!("{} inline atoms", a.len()),
        GeometrySource::File(f) => format!("XYZ file {f}"),
    };
    Some(GeometryAnalysis {
        source,
        tolerance: g.tolerance,
        survey,
        salcs,
    })
}
