//! Reading session files: TOML → [`Session`], every problem reported with file, line, column
//! and what was expected there. Never panics on any input.

use super::model::*;
use serde::Deserialize;
use std::collections::BTreeMap;
use std::path::Path;
use toml::Spanned;

/// A session file that could not be read.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("{file}:{line}:{column}: {message}")]
pub struct LoadError {
    pub file: String,
    pub line: usize,
    pub column: usize,
    pub message: String,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawSession {
    format: Spanned<i64>,
    #[serde(default)]
    title: String,
    #[serde(default)]
    group: Option<Spanned<String>>,
    #[serde(default)]
    orientation: String,
    #[serde(default)]
    notes: String,
    #[serde(default)]
    geometry: Option<Spanned<RawGeometry>>,
    #[serde(default, rename = "set")]
    sets: Vec<RawSet>,
    #[serde(default, rename = "band")]
    bands: Vec<RawBand>,
    #[serde(default)]
    fundamentals: Option<BTreeMap<Spanned<String>, Spanned<Num>>>,
    #[serde(default)]
    vibrations: Option<Spanned<RawVibrations>>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
pub(super) struct RawVibrations {
    pub hessian: String,
    #[serde(default)]
    pub units: Option<Spanned<String>>,
    #[serde(default)]
    pub geometry: Option<String>,
    #[serde(default)]
    pub isotopes: Vec<Spanned<String>>,
    #[serde(default)]
    pub scale: Option<Spanned<Num>>,
    #[serde(default)]
    pub band_tolerance: Option<Spanned<Num>>,
    #[serde(default)]
    pub symmetrize: bool,
    #[serde(default)]
    pub average_masses: bool,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawGeometry {
    #[serde(default)]
    tolerance: Option<Spanned<Num>>,
    #[serde(default)]
    file: Option<String>,
    #[serde(default)]
    atoms: Option<Vec<RawAtom>>,
    #[serde(default)]
    add_bonds: Vec<Spanned<Vec<Spanned<i64>>>>,
    #[serde(default)]
    remove_bonds: Vec<Spanned<Vec<Spanned<i64>>>>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawAtom {
    element: Spanned<String>,
    xyz: Spanned<Vec<Num>>,
}

#[derive(Deserialize, Clone, Copy)]
#[serde(untagged)]
pub(super) enum Num {
    I(i64),
    F(f64),
}

impl Num {
    pub(super) fn get(self) -> f64 {
        match self {
            Num::I(i) => i as f64,
            Num::F(f) => f,
        }
    }
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawSet {
    name: Spanned<String>,
    kind: Spanned<String>,
    #[serde(default)]
    members: Vec<Spanned<String>>,
    #[serde(default)]
    unmoved: BTreeMap<String, Spanned<Vec<Spanned<String>>>>,
    #[serde(default)]
    atoms: BTreeMap<Spanned<String>, Spanned<Vec<Spanned<i64>>>>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawBand {
    position: Spanned<Num>,
    technique: Spanned<String>,
    #[serde(default)]
    intensity: String,
    #[serde(default)]
    polarization: Option<Spanned<String>>,
    #[serde(default)]
    note: String,
}

/// Line and column (1-based, columns in characters) of a byte offset.
fn line_col(text: &str, offset: usize) -> (usize, usize) {
    let mut off = offset.min(text.len());
    while !text.is_char_boundary(off) {
        off -= 1;
    }
    let before = &text[..off];
    let line = before.matches('\n').count() + 1;
    let col = before
        .rsplit('\n')
        .next()
        .map(|s| s.chars().count())
        .unwrap_or(0)
        + 1;
    (line, col)
}

/// Read a session file from disk.
pub fn load_file(path: &Path) -> Result<Session, LoadError> {
    let file = path.display().to_string();
    let bytes = std::fs::read(path).map_err(|e| LoadError {
        file: file.clone(),
        line: 0,
        column: 0,
        message: format!("cannot read the file: {e}"),
    })?;
    let text = String::from_utf8(bytes).map_err(|e| {
        let (line, column) = {
            let ok = &e.as_bytes()[..e.utf8_error().valid_up_to()];
            let s = String::from_utf8_lossy(ok);
            line_col(&s, s.len())
        };
        LoadError {
            file: file.clone(),
            line,
            column,
            message: "the file is not UTF-8 text (expected a TOML session file)".into(),
        }
    })?;
    parse(&file, &text)
}

/// Parse session text; `file` names it in error messages.
pub fn parse(file: &str, text: &str) -> Result<Session, LoadError> {
    let at = |offset: usize, message: String| {
        let (line, column) = line_col(text, offset);
        LoadError {
            file: file.to_string(),
            line,
            column,
            message,
        }
    };
    // The format is checked first, on its own, so that a newer file is refused with the right
    // message even when its other fields are unknown to this build.
    #[derive(Deserialize)]
    struct FormatOnly {
        format: Option<Spanned<toml::Value>>,
    }
    if let Ok(FormatOnly { format: Some(f) }) = toml::from_str::<FormatOnly>(text) {
        if let toml::Value::Integer(n) = f.get_ref() {
            if *n > FORMAT as i64 {
                return Err(at(
                    f.span().start,
                    format!(
                        "session format {n} is newer than this salcdesk understands ({FORMAT}); \
                         update salcdesk to open it"
                    ),
                ));
            }
        }
    }
    let raw: RawSession = toml::from_str(text).map_err(|e| {
        let off = e.span().map(|s| s.start).unwrap_or(0);
        let msg = e.message().trim_end().to_string();
        let msg = if msg.contains("missing field `format`") {
            "missing `format = 1` (the first line of every session file)".to_string()
        } else {
            msg
        };
        at(off, msg)
    })?;
    let fmt = *raw.format.get_ref();
    if fmt < 1 {
        return Err(at(
            raw.format.span().start,
            format!("session format {fmt} does not exist (expected {FORMAT})"),
        ));
    }
    let group = match &raw.group {
        None => None,
        Some(g) => {
            let name = g.get_ref().trim();
            if name.is_empty() {
                None
            } else {
                Some(
                    crate::group::canonical_name(name)
                        .map(str::to_string)
                        .ok_or_else(|| {
                            at(
                                g.span().start,
                                format!(
                                    "unknown point group '{name}' (expected an ASCII name such as \
                                     C2v, D4h, Td; `salcdesk groups` lists all)"
                                ),
                            )
                        })?,
                )
            }
        }
    };
    let geometry = match &raw.geometry {
        None => None,
        Some(g) => Some(geometry(g, &at)?),
    };
    let mut sets = Vec::new();
    for s in &raw.sets {
        sets.push(member_set(s, &at)?);
    }
    let mut bands = Vec::new();
    for b in &raw.bands {
        bands.push(band(b, &at)?);
    }
    let nu_positions = match &raw.fundamentals {
        None => Vec::new(),
        Some(f) => nu_positions(f, &at)?,
    };
    let vibrations = match &raw.vibrations {
        None => None,
        Some(v) => Some(super::vib_section::vibrations(v, &at)?),
    };
    Ok(Session {
        title: raw.title,
        group,
        orientation: raw.orientation,
        geometry,
        sets,
        bands,
        nu_positions,
        notes: raw.notes,
        vibrations,
    })
}

pub(super) type At<'a> = dyn Fn(usize, String) -> LoadError + 'a;

fn geometry(g: &Spanned<RawGeometry>, at: &At) -> Result<Geometry, LoadError> {
    let raw = g.get_ref();
    let tolerance = match &raw.tolerance {
        None => 0.01,
        Some(t) => {
            let v = t.get_ref().get();
            if !(v > 0.0 && v.is_finite()) {
                return Err(at(
                    t.span().start,
                    format!("tolerance must be a positive length in Å, found {v}"),
                ));
            }
            v
        }
    };
    let source = match (&raw.file, &raw.atoms) {
        (Some(_), Some(_)) => {
            return Err(at(
                g.span().start,
                "[geometry] has both `file` and `atoms`; expected one of them".into(),
            ))
        }
        (None, None) => {
            return Err(at(
                g.span().start,
                "[geometry] needs `file = \"molecule.xyz\"` or `atoms = [...]`".into(),
            ))
        }
        (Some(f), None) => GeometrySource::File(f.clone()),
        (None, Some(atoms)) => {
            let mut out = Vec::new();
            for a in atoms {
                let el = a.element.get_ref().trim();
                if el.is_empty() || !el.chars().all(|c| c.is_ascii_alphabetic()) {
                    return Err(at(
                        a.element.span().start,
                        format!("'{el}' is not an element symbol (expected e.g. C, Cl, Pt)"),
                    ));
                }
                let v = a.xyz.get_ref();
                if v.len() != 3 {
                    return Err(at(
                        a.xyz.span().start,
                        format!("xyz needs 3 coordinates in Å, found {}", v.len()),
                    ));
                }
                out.push(Atom {
                    element: el.to_string(),
                    xyz: [v[0].get(), v[1].get(), v[2].get()],
                });
            }
            GeometrySource::Atoms(out)
        }
    };
    let add_bonds = bond_pairs("add_bonds", &raw.add_bonds, at)?;
    let remove_bonds = bond_pairs("remove_bonds", &raw.remove_bonds, at)?;
    Ok(Geometry {
        source,
        tolerance,
        add_bonds,
        remove_bonds,
    })
}

/// `[[1, 5], [2, 3]]`: pairs of 1-based atom numbers. Whether the atoms exist is checked by
/// the analysis, which knows the atoms (they may come from a file).
fn bond_pairs(
    key: &str,
    raw: &[Spanned<Vec<Spanned<i64>>>],
    at: &At,
) -> Result<Vec<[usize; 2]>, LoadError> {
    let mut out = Vec::with_capacity(raw.len());
    for p in raw {
        let v = p.get_ref();
        if v.len() != 2 {
            return Err(at(
                p.span().start,
                format!(
                    "{key}: each bond is two atom numbers like [1, 5], found {} number(s)",
                    v.len()
                ),
            ));
        }
        let mut pair = [0usize; 2];
        for (k, n) in v.iter().enumerate() {
            let x = *n.get_ref();
            if x < 1 {
                return Err(at(
                    n.span().start,
                    format!("{key}: atom numbers count from 1, found {x}"),
                ));
            }
            pair[k] = usize::try_from(x).unwrap_or(usize::MAX);
        }
        out.push(pair);
    }
    Ok(out)
}

fn member_set(s: &RawSet, at: &At) -> Result<MemberSet, LoadError> {
    let kind = SetKind::parse(s.kind.get_ref()).ok_or_else(|| {
        let names: Vec<&str> = SetKind::ALL.iter().map(|k| k.name()).collect();
        at(
            s.kind.span().start,
            format!(
                "unknown kind '{}' (expected one of: {})",
                s.kind.get_ref(),
                names.join(", ")
            ),
        )
    })?;
    let mut members: Vec<Member> = Vec::new();
    for m in &s.members {
        let name = m.get_ref().trim();
        if name.is_empty() {
            return Err(at(m.span().start, "a member needs a name".into()));
        }
        if members.iter().any(|x| x.name == name) {
            return Err(at(
                m.span().start,
                format!(
                    "member '{name}' appears twice in set '{}'",
                    s.name.get_ref()
                ),
            ));
        }
        members.push(Member::new(name));
    }
    for (name, classes) in &s.unmoved {
        let Some(m) = members.iter_mut().find(|m| &m.name == name) else {
            return Err(at(
                classes.span().start,
                format!(
                    "'{name}' is not a member of set '{}' (expected one of: {})",
                    s.name.get_ref(),
                    s.members
                        .iter()
                        .map(|m| m.get_ref().as_str())
                        .collect::<Vec<_>>()
                        .join(", ")
                ),
            ));
        };
        for c in classes.get_ref() {
            let c = c.get_ref().trim();
            if c.is_empty() {
                continue;
            }
            if c == "E" || m.unmoved_by.iter().any(|x| x == c) {
                continue;
            }
            m.unmoved_by.push(c.to_string());
        }
    }
    member_atoms(s, kind, &mut members, at)?;
    Ok(MemberSet {
        name: s.name.get_ref().clone(),
        kind,
        members,
    })
}

/// `[set.atoms]`: per member, the atoms it sits on (1-based; as many as the kind needs, no atom
/// twice). Whether the atoms exist is checked by the analysis, which knows the geometry.
fn member_atoms(
    s: &RawSet,
    kind: SetKind,
    members: &mut [Member],
    at: &At,
) -> Result<(), LoadError> {
    let set = s.name.get_ref();
    // In file order, so that the first problem in the file is the one reported.
    let mut named: Vec<_> = s.atoms.iter().collect();
    named.sort_by_key(|(k, _)| k.span().start);
    for (name, list) in named {
        let name_str = name.get_ref();
        let Some(m) = members.iter_mut().find(|m| &m.name == name_str) else {
            return Err(at(
                name.span().start,
                format!(
                    "[set.atoms]: '{name_str}' is not a member of set '{set}' (expected one of: {})",
                    s.members
                        .iter()
                        .map(|m| m.get_ref().as_str())
                        .collect::<Vec<_>>()
                        .join(", ")
                ),
            ));
        };
        let v = list.get_ref();
        let want = kind.atoms_per_member();
        if v.len() != want {
            return Err(at(
                list.span().start,
                format!(
                    "member '{name_str}' of set '{set}': a {} member sits on {}, found {} atom \
                     number(s)",
                    kind.name(),
                    kind.atoms_shape(),
                    v.len()
                ),
            ));
        }
        let mut atoms: Vec<usize> = Vec::with_capacity(want);
        for n in v {
            let x = *n.get_ref();
            if x < 1 {
                return Err(at(
                    n.span().start,
                    format!(
                        "member '{name_str}' of set '{set}': atom numbers count from 1, found {x}"
                    ),
                ));
            }
            let x = usize::try_from(x).unwrap_or(usize::MAX);
            if atoms.contains(&x) {
                return Err(at(
                    n.span().start,
                    format!("member '{name_str}' of set '{set}': atom {x} is named twice"),
                ));
            }
            atoms.push(x);
        }
        m.atoms = Some(atoms);
    }
    Ok(())
}

/// `[fundamentals]`: `nu3 = 1020.0` gives ν3 a position in cm⁻¹ (numbers from 1, as the
/// Spectra pane numbers the fundamentals; whether ν3 exists is for the analysis to say).
fn nu_positions(
    raw: &BTreeMap<Spanned<String>, Spanned<Num>>,
    at: &At,
) -> Result<Vec<(usize, f64)>, LoadError> {
    let mut out: Vec<(usize, f64)> = Vec::with_capacity(raw.len());
    // In file order, so that the first problem in the file is the one reported.
    let mut named: Vec<_> = raw.iter().collect();
    named.sort_by_key(|(k, _)| k.span().start);
    for (k, v) in named {
        let n = k
            .get_ref()
            .strip_prefix("nu")
            .and_then(|d| d.parse::<usize>().ok())
            .filter(|&n| n >= 1);
        let Some(n) = n else {
            return Err(at(
                k.span().start,
                format!(
                    "[fundamentals]: '{}' is not a fundamental (expected nu1, nu2, … as the \
                     Spectra pane numbers them)",
                    k.get_ref()
                ),
            ));
        };
        if out.iter().any(|(m, _)| *m == n) {
            return Err(at(
                k.span().start,
                format!("[fundamentals]: nu{n} is given twice"),
            ));
        }
        let p = v.get_ref().get();
        if !(p > 0.0 && p.is_finite()) {
            return Err(at(
                v.span().start,
                format!("[fundamentals]: nu{n} must be a positive wavenumber in cm⁻¹, found {p}"),
            ));
        }
        out.push((n, p));
    }
    out.sort_by_key(|(n, _)| *n);
    Ok(out)
}

fn band(b: &RawBand, at: &At) -> Result<Band, LoadError> {
    let position = b.position.get_ref().get();
    if !(position > 0.0 && position.is_finite()) {
        return Err(at(
            b.position.span().start,
            format!("band position must be a positive wavenumber in cm⁻¹, found {position}"),
        ));
    }
    let technique = match b.technique.get_ref().trim().to_ascii_lowercase().as_str() {
        "ir" | "infrared" => Technique::Ir,
        "raman" => Technique::Raman,
        other => {
            return Err(at(
                b.technique.span().start,
                format!("unknown technique '{other}' (expected IR or Raman)"),
            ))
        }
    };
    let polarization = match &b.polarization {
        None => None,
        Some(p) => {
            let v = match p.get_ref().trim().to_ascii_lowercase().as_str() {
                "" => None,
                "p" | "polarized" | "polarised" => Some(Polarization::Polarized),
                "dp" | "depolarized" | "depolarised" => Some(Polarization::Depolarized),
                other => {
                    return Err(at(
                        p.span().start,
                        format!("unknown polarization '{other}' (expected p or dp)"),
                    ))
                }
            };
            if v.is_some() && technique == Technique::Ir {
                return Err(at(
                    p.span().start,
                    "polarization (p/dp) applies to Raman bands only".into(),
                ));
            }
            v
        }
    };
    Ok(Band {
        position,
        technique,
        intensity: b.intensity.clone(),
        polarization,
        note: b.note.clone(),
    })
}
