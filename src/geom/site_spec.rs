//! Our site syntax for what-if molecules: items separated by spaces or `;`, each
//! `ELEMENT@SITE[:r[,θ[,φ]]]` with SITE one of `origin`, `axisN`, `planeN`, `generalN` (the
//! N-th site type of that kind, from 1), r in Å, θ and φ in degrees (defaults r = 1 Å,
//! θ = 30°, φ = 20°). Example, an octahedral complex in Oh: `Co@origin Cl@axis1:2.3`.

use super::molecule::Atom;
use super::sites::{place, site_types, SiteKind, SiteParams, SiteType};
use super::{atomic_number, GeomError};
use nalgebra::Matrix3;

/// A site item that could not be placed: which item, what was written, why.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
#[error("site item {item} ('{token}'): {why}")]
pub struct SiteSpecError {
    /// 1-based item number.
    pub item: usize,
    pub token: String,
    pub why: String,
}

fn kind_name(k: SiteKind) -> &'static str {
    match k {
        SiteKind::Origin => "origin",
        SiteKind::Axis => "axis",
        SiteKind::Plane => "plane",
        SiteKind::General => "general",
    }
}

/// The name each site type goes by in the syntax (`origin`, `axis1`, `plane2`, `general1`),
/// in the order of `types`.
pub fn site_names(types: &[SiteType]) -> Vec<String> {
    let mut seen: Vec<SiteKind> = Vec::new();
    types
        .iter()
        .map(|t| {
            let n = seen.iter().filter(|k| **k == t.kind).count() + 1;
            seen.push(t.kind);
            if t.kind == SiteKind::Origin {
                "origin".to_string()
            } else {
                format!("{}{n}", kind_name(t.kind))
            }
        })
        .collect()
}

/// One line per site type: `axis1: C4 axis along +z (6 atoms)`.
pub fn site_list(types: &[SiteType]) -> Vec<String> {
    site_names(types)
        .into_iter()
        .zip(types)
        .map(|(name, t)| {
            format!(
                "{name}: {} ({} atom{})",
                t.label,
                t.multiplicity,
                if t.multiplicity == 1 { "" } else { "s" }
            )
        })
        .collect()
}

/// Atoms of the molecule a site text describes, for the group with operations `ops` (standard
/// orientation). Two items that put atoms on the same spot are refused.
pub fn build_from_sites(ops: &[Matrix3<f64>], text: &str) -> Result<Vec<Atom>, BuildError> {
    let types = site_types(ops).map_err(BuildError::Group)?;
    let mut atoms: Vec<Atom> = Vec::new();
    let items: Vec<&str> = text
        .split(|c: char| c.is_whitespace() || c == ';')
        .filter(|t| !t.is_empty())
        .collect();
    if items.is_empty() {
        return Err(BuildError::Empty);
    }
    for (k, tok) in items.into_iter().enumerate() {
        let bad = |why: String| {
            BuildError::Item(SiteSpecError {
                item: k + 1,
                token: tok.to_string(),
                why,
            })
        };
        let (el, rest) = tok
            .split_once('@')
            .ok_or_else(|| bad("write ELEMENT@SITE[:r[,theta[,phi]]]".into()))?;
        let z = atomic_number(el).ok_or_else(|| bad(format!("unknown element '{el}'")))?;
        let (site, nums) = rest.split_once(':').unwrap_or((rest, ""));
        let stem: String = site
            .chars()
            .take_while(|c| c.is_ascii_alphabetic())
            .collect();
        let kind = match stem.to_ascii_lowercase().as_str() {
            "origin" => SiteKind::Origin,
            "axis" => SiteKind::Axis,
            "plane" => SiteKind::Plane,
            "general" => SiteKind::General,
            _ => return Err(bad("site must be origin, axisN, planeN or generalN".into())),
        };
        let n: usize = match &site[stem.len()..] {
            "" => 1,
            d => d
                .parse()
                .map_err(|_| bad(format!("'{d}' is not a site number")))?,
        };
        let t = types
            .iter()
            .filter(|t| t.kind == kind)
            .nth(n.saturating_sub(1))
            .ok_or_else(|| bad(format!("there is no {site} site in this group")))?;
        let v: Vec<f64> = if nums.is_empty() {
            Vec::new()
        } else {
            nums.split(',')
                .map(|x| x.trim().parse::<f64>())
                .collect::<Result<_, _>>()
                .map_err(|_| bad("r, theta, phi must be numbers".into()))?
        };
        if v.len() > 3 {
            return Err(bad(format!(
                "{} numbers given; at most r, theta, phi",
                v.len()
            )));
        }
        let params = SiteParams {
            distance: v.first().copied().unwrap_or(1.0),
            theta_deg: v.get(1).copied().unwrap_or(30.0),
            phi_deg: v.get(2).copied().unwrap_or(20.0),
        };
        for a in place(z, t, &params).map_err(|e| bad(e.to_string()))? {
            if let Some(j) = atoms
                .iter()
                .position(|b| (b.position - a.position).norm() < 0.1)
            {
                return Err(bad(format!(
                    "puts an atom where atom {} already is (closer than 0.1 Å)",
                    j + 1
                )));
            }
            atoms.push(a);
        }
    }
    Ok(atoms)
}

/// Why a site text gave no molecule.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum BuildError {
    #[error("no site items: write e.g. \"Co@origin Cl@axis1:2.3\"")]
    Empty,
    #[error(transparent)]
    Item(SiteSpecError),
    #[error(transparent)]
    Group(GeomError),
}
