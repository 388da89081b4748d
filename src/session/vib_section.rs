//! `[vibrations]`: reading (with located errors) and writing the section that names a
//! frequency job's Hessian.

use super::load::{At, LoadError, Num, RawVibrations};
use super::model::Vibrations;
use toml::Spanned;

pub(super) fn vibrations(v: &Spanned<RawVibrations>, at: &At) -> Result<Vibrations, LoadError> {
    let raw = v.get_ref();
    if raw.hessian.trim().is_empty() {
        return Err(at(
            v.span().start,
            "[vibrations] hessian: give the file of the Hessian".into(),
        ));
    }
    if let Some(u) = &raw.units {
        if crate::vib::HessianUnits::parse(u.get_ref()).is_none() {
            return Err(at(
                u.span().start,
                format!(
                    "unknown Hessian units '{}' ({})",
                    u.get_ref(),
                    crate::vib::HessianUnits::NAMES
                ),
            ));
        }
    }
    for i in &raw.isotopes {
        crate::vib::parse_isotope(i.get_ref()).map_err(|m| at(i.span().start, m))?;
    }
    let positive = |n: &Option<Spanned<Num>>, what: &str| -> Result<Option<f64>, LoadError> {
        match n {
            None => Ok(None),
            Some(x) => {
                let f = x.get_ref().get();
                if f.is_finite() && f > 0.0 {
                    Ok(Some(f))
                } else {
                    Err(at(
                        x.span().start,
                        format!("{what} must be a positive number"),
                    ))
                }
            }
        }
    };
    Ok(Vibrations {
        hessian: raw.hessian.clone(),
        units: raw.units.as_ref().map(|u| u.get_ref().clone()),
        geometry: raw.geometry.clone(),
        isotopes: raw.isotopes.iter().map(|i| i.get_ref().clone()).collect(),
        scale: positive(&raw.scale, "scale")?,
        band_tolerance: positive(&raw.band_tolerance, "band_tolerance")?,
        symmetrize: raw.symmetrize,
        average_masses: raw.average_masses,
    })
}

/// The section as TOML (after the bands).
pub(super) fn to_toml(v: &Vibrations, q: fn(&str) -> String, num: fn(f64) -> String) -> String {
    let mut o = String::from("\n[vibrations]\n");
    o.push_str(&format!("hessian = {}\n", q(&v.hessian)));
    if let Some(u) = &v.units {
        o.push_str(&format!("units = {}\n", q(u)));
    }
    if let Some(g) = &v.geometry {
        o.push_str(&format!("geometry = {}\n", q(g)));
    }
    if !v.isotopes.is_empty() {
        let items: Vec<String> = v.isotopes.iter().map(|i| q(i)).collect();
        o.push_str(&format!("isotopes = [{}]\n", items.join(", ")));
    }
    if let Some(s) = v.scale {
        o.push_str(&format!("scale = {}\n", num(s)));
    }
    if let Some(t) = v.band_tolerance {
        o.push_str(&format!("band_tolerance = {}\n", num(t)));
    }
    if v.symmetrize {
        o.push_str("symmetrize = true\n");
    }
    if v.average_masses {
        o.push_str("average_masses = true\n");
    }
    o
}
