//! What if one atom of the session's geometry were another element (or isotope): the copy is
//! surveyed again with the session's tolerance and bond edits, and the group, Γvib and the
//! IR/Raman band counts are given before and after. An isotope of the same element changes the
//! masses only — the group and the counts stay, the frequencies shift (Herzberg 1945, ch. II:
//! the potential and so the symmetry of the equilibrium geometry do not depend on the masses).
//!
//! Owns: [`parse_replacement`], [`substitute`], [`Substitution`]. UI-free.

use super::geometry::{analyze_geometry, molecule, survey_molecule};
use crate::geom;
use crate::session::Session;
use crate::spectra::{self, ModesReport};
use crate::survey::Survey;
use std::path::Path;
use std::sync::Arc;

/// What was asked: atom number (from 1), element, and the mass number when an isotope was named.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Replacement {
    pub atom: usize,
    pub element: u8,
    pub mass_number: Option<u16>,
}

/// One side of the comparison.
#[derive(Debug, Clone, PartialEq)]
pub struct Side {
    /// Formula with the group, e.g. `PtCl4`.
    pub formula: String,
    pub group: String,
    /// Largest deviation from the group's symmetry, Å.
    pub deviation: f64,
    pub vibrations: Result<ModesReport, String>,
}

/// Before and after.
#[derive(Debug, Clone, PartialEq)]
pub struct Substitution {
    /// In words: `atom 2 Cl → Br`.
    pub change: String,
    pub before: Side,
    pub after: Side,
    pub tolerance: f64,
    /// Remarks (an isotope changes masses only; the group did not change; …).
    pub notes: Vec<String>,
}

/// Read `3 Br`, `3 37Cl`, `3 D` (atom number, then element or isotope).
pub fn parse_replacement(text: &str) -> Result<Replacement, String> {
    let mut parts = text.split_whitespace();
    let (Some(n), Some(e), None) = (parts.next(), parts.next(), parts.next()) else {
        return Err(format!(
            "'{text}': type the atom number and the new element, e.g. 2 Br (or 2 37Cl)"
        ));
    };
    let atom: usize = n
        .trim_start_matches('#')
        .parse()
        .ok()
        .filter(|&k| k >= 1)
        .ok_or_else(|| format!("'{n}' is not an atom number (atoms are numbered from 1)"))?;
    let (element, mass_number) = match e {
        "D" => (1, Some(2)),
        "T" => (1, Some(3)),
        _ => {
            let digits: String = e.chars().take_while(|c| c.is_ascii_digit()).collect();
            let sym = &e[digits.len()..];
            let z = geom::atomic_number(sym)
                .ok_or_else(|| format!("'{sym}' is not an element symbol"))?;
            let a = if digits.is_empty() {
                None
            } else {
                Some(
                    digits
                        .parse::<u16>()
                        .map_err(|_| format!("'{digits}' is not a mass number"))?,
                )
            };
            (z, a)
        }
    };
    Ok(Replacement {
        atom,
        element,
        mass_number,
    })
}

fn side(sv: &Survey) -> Side {
    let formula = geom::formula::formula(sv.oriented.molecule.atoms.iter().map(|a| a.symbol()));
    Side {
        formula,
        group: sv.group.name().to_string(),
        deviation: sv.detection.max_deviation,
        vibrations: spectra::modes_report(&sv.group, &sv.vibrations.vibrations)
            .map_err(|e| e.to_string()),
    }
}

/// The what-if of replacing one atom of the session's geometry.
pub fn substitute(
    session: &Session,
    base: Option<&Path>,
    r: &Replacement,
) -> Result<Substitution, String> {
    let Some(g) = session.geometry.as_ref() else {
        return Err("this session has no geometry: build one in the Molecule panel (b)".into());
    };
    let before: Arc<Survey> = analyze_geometry(session, base, false)
        .map(|ga| ga.survey)
        .unwrap_or_else(|| Err("no geometry".into()))?;
    let mut mol = molecule(g, base)?;
    let n = mol.atoms.len();
    if r.atom > n {
        return Err(format!(
            "atom {} does not exist (the geometry has {n} atoms, numbered from 1)",
            r.atom
        ));
    }
    let old = mol.atoms[r.atom - 1].element;
    let old_sym = geom::symbol(old).unwrap_or("?");
    let new_sym = geom::symbol(r.element).unwrap_or("?");
    let mut notes = Vec::new();
    let shown_new = match r.mass_number {
        Some(a) => format!("{a}{new_sym}"),
        None => new_sym.to_string(),
    };
    let change = format!("atom {} {old_sym} → {shown_new}", r.atom);
    if r.element == old {
        if let Some(a) = r.mass_number {
            if crate::vib::isotope_mass(r.element, a).is_none() {
                return Err(format!("no mass known for {a}{new_sym}"));
            }
        }
        notes.push(format!(
            "same element: another isotope changes the masses only, not the symmetry — the \
             group stays {} and so do the band counts; the frequencies shift",
            before.group.name()
        ));
        return Ok(Substitution {
            change,
            before: side(&before),
            after: side(&before),
            tolerance: g.tolerance,
            notes,
        });
    }
    mol.atoms[r.atom - 1].element = r.element;
    mol.atoms[r.atom - 1].label = None;
    let after = survey_molecule(mol, g)?;
    if after.group.name() == before.group.name() {
        notes.push(format!(
            "the group stays {}: atom {} sits alone in its set of equivalent atoms",
            after.group.name(),
            r.atom
        ));
    }
    if r.mass_number.is_some() {
        notes.push("the mass number only changes the masses: the group follows the element".into());
    }
    Ok(Substitution {
        change,
        before: side(&before),
        after: side(&after),
        tolerance: g.tolerance,
        notes,
    })
}
