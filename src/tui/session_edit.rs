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

/// What the notes prompt accepts: a line number to retype, `-N` to remove line N, `+` to
/// type a new line in a field of its own, anything else is a new line as typed (`+ 42` adds
/// a line that is only a number).
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum NoteChoice {
    Add,
    AddLine(String),
    Change(usize),
    Remove(usize),
}

/// The notes as lines (a trailing line break makes no empty last line).
pub fn note_lines(notes: &str) -> Vec<String> {
    notes.lines().map(str::to_string).collect()
}

/// Lines back into the notes text, each ended by a line break (as the file writes them).
pub fn join_notes(lines: &[String]) -> String {
    lines.iter().map(|l| format!("{l}\n")).collect()
}

/// Read the answer to the notes prompt against `n` lines (numbers from 1).
pub fn note_choice(text: &str, n: usize) -> Result<NoteChoice, String> {
    let t = text.trim();
    let number = |s: &str| match s.trim().parse::<usize>() {
        Ok(k) if (1..=n).contains(&k) => Ok(k - 1),
        _ if n == 0 => Err("there are no note lines yet: + adds one".to_string()),
        _ => Err(format!("'{s}' is not a note line (1 to {n})")),
    };
    let is_number = |s: &str| !s.trim().is_empty() && s.trim().chars().all(|c| c.is_ascii_digit());
    if t == "+" {
        Ok(NoteChoice::Add)
    } else if let Some(r) = t.strip_prefix('+') {
        Ok(NoteChoice::AddLine(r.trim().to_string()))
    } else if let Some(r) = t.strip_prefix('-').filter(|r| is_number(r)) {
        number(r).map(NoteChoice::Remove)
    } else if is_number(t) {
        number(t).map(NoteChoice::Change)
    } else {
        Ok(NoteChoice::AddLine(t.to_string()))
    }
}

/// `3 1020` (ν3 at 1020 cm⁻¹) or `3 -` (ν3 without a position); a leading `ν`/`nu` is allowed.
pub fn nu_position(text: &str) -> Result<(usize, Option<f64>), String> {
    const SHAPE: &str = "type the ν number and the position in cm⁻¹, e.g. 3 1020 (3 - clears it)";
    let t = text.trim();
    let t = t
        .strip_prefix('ν')
        .or_else(|| t.strip_prefix("nu"))
        .unwrap_or(t);
    let mut it = t.split_whitespace();
    let (Some(n), Some(p), None) = (it.next(), it.next(), it.next()) else {
        return Err(SHAPE.into());
    };
    let n = match n.parse::<usize>() {
        Ok(k) if k >= 1 => k,
        _ => return Err(format!("'{n}' is not a ν number: {SHAPE}")),
    };
    if p == "-" {
        return Ok((n, None));
    }
    match p.parse::<f64>() {
        Ok(v) if v > 0.0 && v.is_finite() => Ok((n, Some(v))),
        _ => Err(format!("'{p}' is not a positive wavenumber: {SHAPE}")),
    }
}

impl App {
    /// How many fundamentals the Spectra pane numbers now (when it knows).
    fn fundamentals_count(&self) -> Option<usize> {
        let a = self.analysis.as_ref().ok()?;
        let sp = a.spectra.as_ref()?;
        sp.combinations.as_ref().ok().map(|c| c.fundamentals.len())
    }

    pub(super) fn nu_position_prompt(&mut self) {
        let range = match self.fundamentals_count() {
            Some(n) => format!(" (ν1 to ν{n})"),
            None => String::new(),
        };
        self.ask_field(
            FieldPurpose::NuPosition,
            &format!("ν number and position in cm⁻¹ of a fundamental{range}, e.g. 1 1020 (1 - clears it)"),
            String::new(),
        );
    }

    fn nu_position_done(&mut self, text: &str) {
        let (n, p) = match nu_position(text) {
            Ok(v) => v,
            Err(e) => return self.error(format!("not changed: {e}")),
        };
        if let Some(count) = self.fundamentals_count() {
            if n > count {
                return self.error(format!(
                    "not changed: there is no ν{n} (the Spectra pane numbers ν1 to ν{count})"
                ));
            }
        }
        self.edit(|s| {
            s.nu_positions.retain(|(m, _)| *m != n);
            if let Some(p) = p {
                s.nu_positions.push((n, p));
                s.nu_positions.sort_by_key(|(m, _)| *m);
            }
        });
        match p {
            Some(p) => self.status(format!(
                "ν{n} at {p} cm⁻¹: its overtones and combinations are placed (u undoes)"
            )),
            None => self.status(format!("ν{n} has no position now (u undoes)")),
        }
    }

    pub(super) fn notes_prompt(&mut self) {
        let n = note_lines(&self.session.notes).len();
        if n == 0 {
            return self.ask_field(FieldPurpose::AddNote, "New note line", String::new());
        }
        self.ask_field(
            FieldPurpose::NoteWhich,
            &format!("Notes ({n} lines): type a new line, or N to retype line N, -N to remove it"),
            String::new(),
        );
    }

    fn note_which_done(&mut self, text: &str) {
        let lines = note_lines(&self.session.notes);
        match note_choice(text, lines.len()) {
            Ok(NoteChoice::Add) => {
                self.ask_field(FieldPurpose::AddNote, "New note line", String::new())
            }
            Ok(NoteChoice::AddLine(t)) => self.note_line_done(None, &t),
            Ok(NoteChoice::Change(k)) => self.ask_field(
                FieldPurpose::ChangeNote(k),
                &format!("Note line {}", k + 1),
                lines[k].clone(),
            ),
            Ok(NoteChoice::Remove(k)) => {
                let mut v = lines;
                let gone = v.remove(k);
                self.edit(|s| s.notes = join_notes(&v));
                self.status(format!(
                    "note line {} removed: {gone} (u brings it back)",
                    k + 1
                ));
            }
            Err(e) => self.error(e),
        }
    }

    fn note_line_done(&mut self, at: Option<usize>, text: &str) {
        let mut v = note_lines(&self.session.notes);
        let t = text.trim_end().to_string();
        let k = match at {
            None => {
                v.push(t);
                v.len() - 1
            }
            Some(k) if k < v.len() => {
                v[k] = t;
                k
            }
            Some(_) => return self.error("that note line is gone"),
        };
        self.edit(|s| s.notes = join_notes(&v));
        self.status(format!("note line {} written (u undoes)", k + 1));
    }

    /// Ctrl-n: a blank session; unsaved edits are asked about first.
    pub(super) fn new_session_asked(&mut self) {
        if self.dirty() {
            self.mode = super::app::Mode::Ask(super::app::Question::NewSession);
        } else {
            self.start_new_session();
        }
    }

    /// The answer to "unsaved edits: start a new session?".
    pub(super) fn new_session_answer(&mut self, c: char) {
        match c {
            's' | 'y' => match self.path.clone() {
                Some(p) => {
                    if self.save_to(&p) {
                        self.start_new_session();
                    }
                }
                None => {
                    self.ask_field(FieldPurpose::SaveAs, "Save as", "session.toml".into());
                    self.status("save this session first; then Ctrl-n starts the new one");
                }
            },
            'd' => {
                self.recovery.clear();
                self.start_new_session();
            }
            _ => self.status("no new session: this one stays open"),
        }
    }

    /// Replace the session with a blank one, not saved anywhere yet. The old one stays one
    /// `u` away (its file, if any, is untouched).
    fn start_new_session(&mut self) {
        let blank = crate::session::Session::default();
        let old = std::mem::replace(&mut self.session, blank.clone());
        self.undo.push(old);
        self.redo.clear();
        self.saved = blank;
        self.path = None;
        self.recovery = crate::session::Recovery::for_session(None);
        self.members_ui = Default::default();
        self.combos_ui = Default::default();
        self.scrolls = Default::default();
        self.rep_hscroll = 0;
        self.gen += 1;
        self.quick_analysis();
        self.load_catalogue();
        self.panel = super::action::Panel::Group;
        self.group_ui.cursor = 0;
        self.status("new session: choose a point group (Enter), then add member sets; s saves it");
    }

    /// Text fields of this file, once accepted.
    pub(super) fn record_field_done(&mut self, purpose: FieldPurpose, text: &str) {
        match purpose {
            FieldPurpose::NuPosition => self.nu_position_done(text),
            FieldPurpose::NoteWhich => self.note_which_done(text),
            FieldPurpose::AddNote => self.note_line_done(None, text),
            FieldPurpose::ChangeNote(k) => self.note_line_done(Some(k), text),
            other => self.band_field_done(other, text),
        }
    }
}

/// The question before a new session replaces unsaved edits: title, words, keys.
pub fn new_session_question() -> (&'static str, String, &'static str) {
    (
        "Unsaved edits",
        "This session has edits that are not saved. Start a new, empty session?".into(),
        "s save, then new · d discard, then new · Esc stay",
    )
}
