//! Editing the session's own words and records in place: the title, the orientation note,
//! and the observed band list (add, change, remove). Typed bands are read by the same reader
//! as band-list files (`spectra::bands`), so the workspace accepts exactly what a file may
//! say. Every change is one undoable edit and is saved with the session.

use super::app::{App, FieldPurpose};
use crate::session::{Band, Polarization, Technique};
use crate::spectra as reader;

/// A band as typed (`505 Raman vs p totally symmetric`), as the session stores it.
pub fn parse_band(text: &str) -> Result<Band, String> {
    let bands = reader::parse_bands("typed band", text).map_err(|e| e.to_string())?;
    let [b] = bands.as_slice() else {
        return Err("type one band: position technique [intensity] [p|dp] [note]".into());
    };
    Ok(Band {
        position: b.position_cm,
        technique: match b.technique {
            reader::Technique::Ir => Technique::Ir,
            reader::Technique::Raman => Technique::Raman,
        },
        intensity: match &b.intensity {
            None => String::new(),
            Some(reader::Intensity::Value(v)) => format!("{v}"),
            Some(reader::Intensity::Word(w)) => w.clone(),
        },
        polarization: b.polarization.map(|p| match p {
            reader::Polarization::P => Polarization::Polarized,
            reader::Polarization::Dp => Polarization::Depolarized,
        }),
        note: b.note.clone().unwrap_or_default(),
    })
}

/// A band written back the way it is typed (the field starts from this when changing it).
pub fn band_text(b: &Band) -> String {
    let mut t = format!("{} {}", b.position, b.technique.name());
    for part in [
        b.intensity.as_str(),
        b.polarization.map(|p| p.name()).unwrap_or(""),
        b.note.as_str(),
    ] {
        if !part.is_empty() {
            t.push(' ');
            t.push_str(part);
        }
    }
    t
}

const BAND_SHAPE: &str = "position technique [intensity] [p|dp] [note]";

impl App {
    pub(super) fn add_band_prompt(&mut self) {
        self.ask_field(
            FieldPurpose::AddBand,
            &format!("New band: {BAND_SHAPE}, e.g. 505 Raman vs p"),
            String::new(),
        );
    }

    pub(super) fn band_number_prompt(&mut self, purpose: FieldPurpose, verb: &str) {
        let n = self.session.bands.len();
        if n == 0 {
            return self.status("no observed bands yet: + adds one");
        }
        let first = if n == 1 {
            "1".to_string()
        } else {
            String::new()
        };
        self.ask_field(purpose, &format!("{verb} band number (1 to {n})"), first);
    }

    pub(super) fn title_prompt(&mut self) {
        let t = self.session.title.clone();
        self.ask_field(FieldPurpose::Title, "Title of the session", t);
    }

    pub(super) fn orientation_prompt(&mut self) {
        let t = self.session.orientation.clone();
        self.ask_field(
            FieldPurpose::Orientation,
            "Orientation (where the axes and members lie)",
            t,
        );
    }

    /// The number typed for a band, checked against the list.
    fn band_number(&mut self, text: &str) -> Option<usize> {
        let n = self.session.bands.len();
        match text.trim().trim_start_matches('#').parse::<usize>() {
            Ok(k) if (1..=n).contains(&k) => Some(k - 1),
            _ => {
                self.error(format!("'{text}' is not a band number (1 to {n})"));
                None
            }
        }
    }

    pub(super) fn band_field_done(&mut self, purpose: FieldPurpose, text: &str) {
        match purpose {
            FieldPurpose::AddBand => match parse_band(text) {
                Ok(b) => {
                    let line = band_text(&b);
                    self.edit(|s| s.bands.push(b));
                    let n = self.session.bands.len();
                    self.status(format!("band {n} added: {line} (u undoes)"));
                }
                Err(e) => self.error(format!("not added: {e}")),
            },
            FieldPurpose::RemoveBandWhich => {
                if let Some(k) = self.band_number(text) {
                    let line = band_text(&self.session.bands[k]);
                    self.edit(|s| {
                        s.bands.remove(k);
                    });
                    self.status(format!("band {} removed: {line} (u brings it back)", k + 1));
                }
            }
            FieldPurpose::ChangeBandWhich => {
                if let Some(k) = self.band_number(text) {
                    let line = band_text(&self.session.bands[k]);
                    self.ask_field(
                        FieldPurpose::ChangeBand(k),
                        &format!("Band {}: {BAND_SHAPE}", k + 1),
                        line,
                    );
                }
            }
            FieldPurpose::ChangeBand(k) => match parse_band(text) {
                Ok(b) if k < self.session.bands.len() => {
                    let line = band_text(&b);
                    self.edit(|s| s.bands[k] = b);
                    self.status(format!("band {} is now {line} (u undoes)", k + 1));
                }
                Ok(_) => self.error("that band is gone"),
                Err(e) => self.error(format!("not changed: {e}")),
            },
            FieldPurpose::Title => {
                let t = text.trim().to_string();
                self.edit(|s| s.title = t);
                self.status("title changed (u undoes)");
            }
            FieldPurpose::Orientation => {
                let t = text.trim().to_string();
                self.edit(|s| s.orientation = t);
                self.status("orientation changed (u undoes)");
            }
            _ => {}
        }
    }
}
