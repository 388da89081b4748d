//! Observed band lists: the [`Band`] record and reading it from a text or CSV file.
//!
//! File layout (salcdesk's own): one band per line, `position technique [intensity]
//! [polarization] [note…]`, fields separated by commas, tabs or spaces; `#` starts a comment;
//! a first line naming the columns (containing `position` or `cm`) is skipped. Technique:
//! `IR`, `Raman` (or `R`); a Raman technique may carry the polarization as `Raman-p`,
//! `Raman-dp`. Intensity: a number or a word (`vs`, `s`, `m`, `w`, `sh` …). Polarization: `p`
//! or `dp`.

use serde::{Deserialize, Serialize};

/// IR or Raman.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Technique {
    #[serde(rename = "IR")]
    Ir,
    Raman,
}

impl Technique {
    pub fn name(self) -> &'static str {
        match self {
            Technique::Ir => "IR",
            Technique::Raman => "Raman",
        }
    }
}

/// Raman depolarization: polarized (ρ < 3/4) or depolarized (ρ = 3/4).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum Polarization {
    P,
    Dp,
}

/// A band intensity: a number or a descriptive word.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(untagged)]
pub enum Intensity {
    Value(f64),
    Word(String),
}

/// One observed band.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Band {
    pub position_cm: f64,
    pub technique: Technique,
    #[serde(default)]
    pub intensity: Option<Intensity>,
    #[serde(default)]
    pub polarization: Option<Polarization>,
    #[serde(default)]
    pub note: Option<String>,
}

/// An error in a band file, with its line and field.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("{file}:{line}: field {field}: {message}")]
pub struct BandFileError {
    pub file: String,
    pub line: usize,
    /// 1-based field (column) number on the line.
    pub field: usize,
    pub message: String,
}

fn technique(t: &str) -> Option<(Technique, Option<Polarization>)> {
    let l = t.to_ascii_lowercase();
    let (base, pol) = match l.split_once(['-', '(']) {
        Some((b, p)) => (b.to_string(), Some(p.trim_end_matches(')').to_string())),
        None => (l.clone(), None),
    };
    let tech = match base.as_str() {
        "ir" | "infrared" => Technique::Ir,
        "raman" | "r" => Technique::Raman,
        _ => return None,
    };
    let pol = match pol.as_deref() {
        None => None,
        Some(p) if tech == Technique::Raman => Some(polarization(p)?),
        Some(_) => return None,
    };
    Some((tech, pol))
}

fn polarization(p: &str) -> Option<Polarization> {
    match p.to_ascii_lowercase().as_str() {
        "p" | "pol" | "polarized" => Some(Polarization::P),
        "dp" | "depol" | "depolarized" => Some(Polarization::Dp),
        _ => None,
    }
}

fn split_fields(line: &str) -> Vec<&str> {
    line.split([',', '\t', ' ', ';'])
        .map(str::trim)
        .filter(|s| !s.is_empty())
        .collect()
}

/// Read a band list. `file` names the source in error messages.
pub fn parse_bands(file: &str, text: &str) -> Result<Vec<Band>, BandFileError> {
    let mut out = Vec::new();
    let mut seen_data = false;
    for (k, raw) in text.lines().enumerate() {
        let line_no = k + 1;
        let err = |field: usize, message: String| BandFileError {
            file: file.to_string(),
            line: line_no,
            field,
            message,
        };
        let content = raw.split('#').next().unwrap_or("");
        let fields = split_fields(content);
        if fields.is_empty() {
            continue;
        }
        let first_data = !seen_data;
        seen_data = true;
        let lower = fields[0].to_ascii_lowercase();
        if first_data && (lower.contains("position") || lower.contains("cm")) {
            continue; // a header line
        }
        let position_cm: f64 = fields[0]
            .parse()
            .map_err(|_| err(1, format!("'{}' is not a position in cm⁻¹", fields[0])))?;
        if !position_cm.is_finite() || position_cm <= 0.0 {
            return Err(err(1, format!("position {position_cm} must be positive")));
        }
        let t = fields
            .get(1)
            .ok_or_else(|| err(2, "missing technique (IR or Raman)".into()))?;
        let (technique, mut pol) = technique(t).ok_or_else(|| {
            err(
                2,
                format!("unknown technique '{t}' (IR, Raman, Raman-p, Raman-dp)"),
            )
        })?;
        // `459 Raman p`: a polarization in the third field, no intensity.
        if let Some(p) = fields.get(2).and_then(|s| polarization(s)) {
            if technique != Technique::Raman {
                return Err(err(3, "a polarization is given for an IR band".into()));
            }
            let note = (fields.len() > 3).then(|| fields[3..].join(" "));
            out.push(Band {
                position_cm,
                technique,
                intensity: None,
                polarization: Some(p),
                note,
            });
            continue;
        }
        let intensity = fields.get(2).map(|s| match s.parse::<f64>() {
            Ok(v) if v.is_finite() => Intensity::Value(v),
            _ => Intensity::Word(s.to_string()),
        });
        let mut rest = 3;
        if let Some(p) = fields.get(3).and_then(|s| polarization(s)) {
            if technique != Technique::Raman {
                return Err(err(4, "a polarization is given for an IR band".into()));
            }
            if pol.is_some_and(|q| q != p) {
                return Err(err(4, "two different polarizations for one band".into()));
            }
            pol = Some(p);
            rest = 4;
        }
        let note = (fields.len() > rest).then(|| fields[rest..].join(" "));
        out.push(Band {
            position_cm,
            technique,
            intensity,
            polarization: pol,
            note,
        });
    }
    Ok(out)
}

/// Read a band list from a file; an unreadable file is reported at line 0.
pub fn load_bands(path: &std::path::Path) -> Result<Vec<Band>, BandFileError> {
    let file = path.display().to_string();
    let text = std::fs::read_to_string(path).map_err(|e| BandFileError {
        file: file.clone(),
        line: 0,
        field: 0,
        message: e.to_string(),
    })?;
    parse_bands(&file, &text)
}
