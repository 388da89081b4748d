//! The workspace state as plain data, and what every action does to it. No terminal here:
//! tests drive [`App`] with keys and actions and look at the result.

use super::action::{Action, Panel};
use super::keymap::{self, Code, Key};
use crate::analysis::{self, Analysis, Depth, GroupEntry};
use crate::report::session as session_report;
use crate::session::{
    self, check_save_target, Member, MemberSet, Recovery, SaveTarget, Session, SetKind,
};
use std::path::{Path, PathBuf};
use std::sync::Arc;

/// How many edits `u` can take back.
const UNDO_DEPTH: usize = 500;

/// What a text field is for.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum FieldPurpose {
    SaveAs,
    Export,
    AddMember,
    RenameMember,
    AddSet,
    RenameSet,
    AddBonds,
    RemoveBonds,
    Sites,
    AddBand,
    RemoveBandWhich,
    ChangeBandWhich,
    /// The band with this index, retyped.
    ChangeBand(usize),
    Title,
    Orientation,
    /// A fundamental's ν number and position.
    NuPosition,
    /// Which note line to retype, add or remove.
    NoteWhich,
    AddNote,
    /// The note line with this index, retyped.
    ChangeNote(usize),
    /// What if: an atom number and its new element.
    ReplaceAtom,
    /// The atoms of the member under the cursor (Members, `@`).
    MemberAtoms,
    /// Element and numbers for one site set of the site builder (site type index, state).
    SiteItem(usize, super::site_picker::SiteState),
}

/// A one-line text field at the bottom of the screen.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Field {
    pub purpose: FieldPurpose,
    pub label: String,
    pub text: String,
}

/// A question that waits for one key.
#[derive(Debug, Clone, PartialEq)]
pub enum Question {
    /// Unsaved edits at quit: s = save and quit, d = discard and quit.
    Quit,
    /// Edits left by an earlier run: r = restore, d = discard.
    Recover(Box<Session>),
    /// Replace an existing session file with this one?
    OverwriteSession(PathBuf),
    /// Replace an existing report file?
    OverwriteExport(PathBuf),
    /// Unsaved edits before a new session: s = save first, d = discard.
    NewSession,
}

/// What the screen is doing besides showing the panel.
#[derive(Debug, Clone, PartialEq)]
pub enum Mode {
    Normal,
    Help {
        scroll: u16,
    },
    Field(Field),
    Ask(Question),
    /// The What-if overlay (lower the symmetry, replace an atom).
    WhatIf(Box<super::whatif::WhatIfView>),
    /// A list to choose from (`picker`).
    Pick(super::picker::Picker),
}

/// A message in the status line.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Status {
    pub text: String,
    pub error: bool,
}

/// Cursor and search in the Point group panel.
#[derive(Debug, Clone, Default)]
pub struct GroupUi {
    pub query: String,
    pub typing: bool,
    /// Index into the filtered list.
    pub cursor: usize,
    pub table_scroll: u16,
}

/// Cursor in the Members panel (also chooses the set the other panels show).
#[derive(Debug, Clone, Default)]
pub struct MembersUi {
    pub set: usize,
    pub row: usize,
    pub col: usize,
    /// First member row shown.
    pub scroll: usize,
}

/// The whole workspace.
pub struct App {
    pub session: Session,
    /// Where the session is saved; `None` for the demo and new sessions.
    pub path: Option<PathBuf>,
    /// The session as last saved or loaded.
    pub saved: Session,
    pub recovery: Recovery,
    /// Generation of `session`: bumped by every edit.
    pub gen: u64,
    /// Generation the shown analysis belongs to, and its depth.
    pub analysis_gen: u64,
    pub analysis: Result<Arc<Analysis>, analysis::Error>,
    pub catalogue: Vec<GroupEntry>,
    pub panel: Panel,
    pub mode: Mode,
    pub status: Option<Status>,
    pub group_ui: GroupUi,
    pub members_ui: MembersUi,
    /// Scroll of each text pane (Representation, Combinations, Spectra, Molecule), by panel
    /// index: every pane keeps its own place.
    pub scrolls: [u16; Panel::ALL.len()],
    /// Show the focused pane alone although the screen could tile.
    pub zoom: bool,
    pub undo: Vec<Session>,
    pub redo: Vec<Session>,
    pub ascii: bool,
    pub color: bool,
    pub quit: bool,
    /// Generation last written to the recovery file.
    pub autosaved_gen: u64,
    /// Size of the last drawn frame (for paging and mouse hits).
    pub screen: (u16, u16),
    /// Generating member and irrep of the worked projection (Combinations).
    pub combos_ui: super::molecule_edit::CombosUi,
    /// Class columns of the Representation pane scrolled off to the left.
    pub rep_hscroll: u16,
}

impl App {
    /// A workspace on `session`, saved at `path` (or nowhere yet).
    pub fn new(session: Session, path: Option<PathBuf>, ascii: bool, color: bool) -> Self {
        let recovery = Recovery::for_session(path.as_deref());
        let panel = if session.group.is_some() && !session.sets.is_empty() {
            Panel::Members
        } else {
            Panel::Group
        };
        let mut app = App {
            saved: session.clone(),
            session,
            path,
            recovery,
            gen: 0,
            analysis_gen: 0,
            analysis: Err(analysis::Error::NoGroup),
            catalogue: Vec::new(),
            panel,
            mode: Mode::Normal,
            status: None,
            group_ui: GroupUi::default(),
            members_ui: MembersUi::default(),
            combos_ui: Default::default(),
            scrolls: [0; Panel::ALL.len()],
            zoom: false,
            undo: Vec::new(),
            redo: Vec::new(),
            ascii,
            color,
            quit: false,
            autosaved_gen: 0,
            screen: (80, 24),
            rep_hscroll: 0,
        };
        app.quick_analysis();
        if let Some(rec) = app.recovery.pending(&app.session) {
            app.mode = Mode::Ask(Question::Recover(Box::new(rec)));
        }
        app
    }

    /// The directory relative XYZ paths of the session are read from.
    pub fn base_dir(&self) -> Option<PathBuf> {
        self.path
            .as_ref()
            .and_then(|p| p.parent())
            .map(|d| d.to_path_buf())
    }

    /// The scroll of a text pane.
    pub fn scroll_of(&self, p: Panel) -> u16 {
        self.scrolls[p.index()]
    }

    /// The panes on screen now and where they are (the same for drawing and clicks).
    pub fn tiles(&self) -> Vec<super::layout::Tile> {
        let size = ratatui::layout::Rect::new(0, 0, self.screen.0, self.screen.1);
        let body = super::ui::areas(size).body;
        super::layout::tiles(body, self.screen, self.panel, self.zoom, self.grid_rows())
    }

    /// Rows the tick grid would like: its members and the lines above and below them.
    pub fn grid_rows(&self) -> u16 {
        let members = self
            .session
            .sets
            .get(self.members_ui.set)
            .map(|s| s.members.len())
            .unwrap_or(0);
        let geometry = u16::from(self.session.geometry.is_some());
        (members.min(200) as u16).max(1) + 10 + geometry
    }

    /// Whether the screen shows several panes.
    pub fn tiled(&self) -> bool {
        self.tiles().len() > 1
    }

    /// Whether there are edits not yet saved.
    pub fn dirty(&self) -> bool {
        self.session != self.saved
    }

    /// Name to show for the session.
    pub fn file_label(&self) -> String {
        match &self.path {
            Some(p) => p.display().to_string(),
            None => format!("{} (demo, not saved)", session::DEMO_NAME),
        }
    }

    /// The shown analysis is older than the session (the full one is still being computed).
    pub fn analysis_pending(&self) -> bool {
        match &self.analysis {
            Ok(a) => self.analysis_gen != self.gen || a.depth != Depth::Full,
            Err(_) => self.analysis_gen != self.gen,
        }
    }

    /// Analyse at once, to the quick depth (fast enough for every keystroke).
    pub fn quick_analysis(&mut self) {
        self.analysis =
            analysis::analyze_in(&self.session, Depth::Quick, self.base_dir().as_deref())
                .map(Arc::new);
        self.analysis_gen = self.gen;
        self.clamp_cursors();
    }

    /// Take a finished full analysis (from the background worker) if it is still current.
    pub fn accept_analysis(&mut self, gen: u64, result: Result<Analysis, analysis::Error>) {
        if gen == self.gen {
            self.analysis = result.map(Arc::new);
            self.analysis_gen = gen;
            self.clamp_cursors();
        }
    }

    /// Compute the full analysis here and now (tests; the terminal uses the worker).
    pub fn finish_analysis(&mut self) {
        let r = analysis::analyze_in(&self.session, Depth::Full, self.base_dir().as_deref());
        self.accept_analysis(self.gen, r);
    }

    /// Fill the group list (slow the first time: every table is loaded).
    pub fn load_catalogue(&mut self) {
        if self.catalogue.is_empty() {
            self.catalogue = analysis::catalogue();
        }
    }

    /// Groups matching the search, best first (customary order when not searching).
    pub fn group_matches(&self) -> Vec<&GroupEntry> {
        let q = self.group_ui.query.trim();
        let mut v: Vec<(u32, usize, &GroupEntry)> = self
            .catalogue
            .iter()
            .enumerate()
            .filter_map(|(i, e)| analysis::fit(e, q).map(|s| (s, i, e)))
            .collect();
        v.sort_by(|a, b| b.0.cmp(&a.0).then(a.1.cmp(&b.1)));
        v.into_iter().map(|(_, _, e)| e).collect()
    }

    pub(super) fn status(&mut self, text: impl Into<String>) {
        self.status = Some(Status {
            text: text.into(),
            error: false,
        });
    }
    pub(super) fn error(&mut self, text: impl Into<String>) {
        self.status = Some(Status {
            text: text.into(),
            error: true,
        });
    }

    /// Make an edit: remember the old session for undo, change, re-analyse.
    pub(super) fn edit(&mut self, f: impl FnOnce(&mut Session)) {
        let before = self.session.clone();
        f(&mut self.session);
        if self.session == before {
            return;
        }
        self.undo.push(before);
        if self.undo.len() > UNDO_DEPTH {
            self.undo.remove(0);
        }
        self.redo.clear();
        self.changed();
    }

    fn changed(&mut self) {
        self.gen += 1;
        self.quick_analysis();
    }

    fn clamp_cursors(&mut self) {
        let nsets = self.session.sets.len();
        let m = &mut self.members_ui;
        if m.set >= nsets {
            m.set = nsets.saturating_sub(1);
        }
        let nrows = self
            .session
            .sets
            .get(m.set)
            .map(|s| s.members.len())
            .unwrap_or(0);
        if m.row >= nrows {
            m.row = nrows.saturating_sub(1);
        }
        let ncols = self
            .analysis
            .as_ref()
            .map(|a| a.group.table.classes.len())
            .unwrap_or(1);
        if m.col >= ncols {
            m.col = ncols.saturating_sub(1);
        }
    }

    /// The analysis of the set the cursor is in.
    pub fn current_set(&self) -> Option<(&Analysis, &analysis::SetAnalysis)> {
        let a = self.analysis.as_ref().ok()?;
        let s = a.sets.get(self.members_ui.set)?;
        Some((a, s))
    }

    /// Handle one key: text fields and questions take it first, then the key map.
    pub fn handle_key(&mut self, key: Key) {
        match self.mode.clone() {
            Mode::Field(f) => return self.field_key(f, key),
            Mode::Ask(q) => return self.answer(q, key),
            Mode::WhatIf(v) => return self.whatif_key(*v, key),
            Mode::Pick(p) => return self.pick_key(p, key),
            Mode::Help { scroll } => {
                let s = match key.code {
                    Code::Down | Code::Char('j') => scroll.saturating_add(1),
                    Code::Up | Code::Char('k') => scroll.saturating_sub(1),
                    Code::PageDown | Code::Char(' ') => scroll.saturating_add(10),
                    Code::PageUp => scroll.saturating_sub(10),
                    // The drawing stops at the last page, so "very far" is the bottom.
                    Code::End | Code::Char('G') => u16::MAX,
                    Code::Home | Code::Char('g') => 0,
                    _ => {
                        self.mode = Mode::Normal;
                        return;
                    }
                };
                let size = ratatui::layout::Rect::new(0, 0, self.screen.0, self.screen.1);
                let th = super::theme::Theme::new(self.color, self.ascii);
                let max = super::panels::help::max_scroll(super::ui::areas(size).body, &th);
                self.mode = Mode::Help { scroll: s.min(max) };
                return;
            }
            Mode::Normal => {}
        }
        if self.panel == Panel::Group && self.group_ui.typing {
            match key.code {
                Code::Char(c) if !key.ctrl => {
                    self.group_ui.query.push(c);
                    self.group_ui.cursor = 0;
                    return;
                }
                Code::Backspace => {
                    self.group_ui.query.pop();
                    self.group_ui.cursor = 0;
                    return;
                }
                Code::Char('u') if key.ctrl => {
                    self.group_ui.query.clear();
                    self.group_ui.cursor = 0;
                    return;
                }
                Code::Esc => {
                    self.group_ui.typing = false;
                    self.group_ui.query.clear();
                    return;
                }
                Code::Enter => {
                    self.group_ui.typing = false;
                    self.apply(Action::Enter);
                    return;
                }
                _ => {}
            }
        }
        if let Some(a) = keymap::lookup(key, self.panel) {
            self.apply(a);
        }
    }

    /// Carry out an action.
    pub fn apply(&mut self, action: Action) {
        if !matches!(
            action,
            Action::Click { .. } | Action::ScrollUp | Action::ScrollDown
        ) {
            self.status = None;
        }
        match action {
            Action::NextPanel => self.go(self.step_panel(1)),
            Action::PrevPanel => self.go(self.step_panel(-1)),
            Action::GoPanel(p) => self.go(p),
            Action::Up => self.move_by(0, -1),
            Action::Down => self.move_by(0, 1),
            Action::Left => self.move_by(-1, 0),
            Action::Right => self.move_by(1, 0),
            Action::PageUp => self.move_by(0, -(self.page() as i64)),
            Action::PageDown => self.move_by(0, self.page() as i64),
            Action::Home => self.move_by(0, -1_000_000),
            Action::End => self.move_by(0, 1_000_000),
            Action::ScrollUp => self.move_by(0, -3),
            Action::ScrollDown => self.move_by(0, 3),
            Action::Enter => match self.panel {
                Panel::Group => self.choose_group(),
                Panel::Members => self.toggle(),
                _ => {}
            },
            Action::Toggle => {
                if self.panel == Panel::Members {
                    self.toggle()
                }
            }
            Action::Search => {
                self.go(Panel::Group);
                self.group_ui.typing = true;
                self.group_ui.query.clear();
                self.group_ui.cursor = 0;
            }
            Action::Help => self.mode = Mode::Help { scroll: 0 },
            Action::Quit => {
                if self.dirty() {
                    self.mode = Mode::Ask(Question::Quit);
                } else {
                    self.quit = true;
                }
            }
            Action::Undo => match self.undo.pop() {
                Some(s) => {
                    self.redo.push(std::mem::replace(&mut self.session, s));
                    self.changed();
                    self.status("undone");
                }
                None => self.status("nothing to undo"),
            },
            Action::Redo => match self.redo.pop() {
                Some(s) => {
                    self.undo.push(std::mem::replace(&mut self.session, s));
                    self.changed();
                    self.status("redone");
                }
                None => self.status("nothing to redo"),
            },
            Action::Save => match self.path.clone() {
                Some(p) => {
                    self.save_to(&p);
                }
                None => self.ask_field(FieldPurpose::SaveAs, "Save as", "session.toml".into()),
            },
            Action::SaveAs => {
                let d = self
                    .path
                    .as_ref()
                    .map(|p| p.display().to_string())
                    .unwrap_or_else(|| "session.toml".into());
                self.ask_field(FieldPurpose::SaveAs, "Save as", d)
            }
            Action::Export => {
                let stem = self
                    .path
                    .as_ref()
                    .map(|p| p.with_extension("md").display().to_string())
                    .unwrap_or_else(|| "report.md".into());
                self.ask_field(
                    FieldPurpose::Export,
                    "Export report (.md .tex .json .txt)",
                    stem,
                )
            }
            Action::Zoom => self.toggle_zoom(),
            Action::NextSet => self.switch_set(1),
            Action::PrevSet => self.switch_set(-1),
            Action::AddMember => self.add_member_prompt(),
            Action::RemoveMember => self.remove_member(),
            Action::RenameMember => {
                if let Some(m) = self.cursor_member() {
                    let name = m.name.clone();
                    self.ask_field(FieldPurpose::RenameMember, "Rename member", name)
                } else {
                    self.status("this set has no members yet: a adds one")
                }
            }
            Action::AddSet => {
                let n = self.session.sets.len() + 1;
                self.ask_field(
                    FieldPurpose::AddSet,
                    "Name of the new set",
                    format!("Set {n}"),
                )
            }
            Action::RemoveSet => self.remove_set(),
            Action::RenameSet => match self.session.sets.get(self.members_ui.set) {
                Some(s) => {
                    let name = s.name.clone();
                    self.ask_field(FieldPurpose::RenameSet, "Rename set", name)
                }
                None => self.status("no set yet: n starts one"),
            },
            Action::CycleKind => {
                let i = self.members_ui.set;
                if i < self.session.sets.len() {
                    self.edit(|s| s.sets[i].kind = s.sets[i].kind.next());
                    let k = self.session.sets[i].kind;
                    self.status(format!("kind: {} — {}", k.name(), k.contribution()));
                }
            }
            Action::TakeGeometryTicks => {
                if self.panel == Panel::Members {
                    self.take_geometry_ticks()
                }
            }
            Action::Cancel => {
                if self.group_ui.typing {
                    self.group_ui.typing = false;
                }
                self.mode = Mode::Normal;
            }
            Action::AddBond => self.bond_prompt(true),
            Action::RemoveBond => self.bond_prompt(false),
            Action::BuildSites => self.site_picker(Vec::new()),
            Action::NewSetFromGeometry => self.member_set_picker(),
            Action::MemberAtoms => self.member_atoms_prompt(),
            Action::AddBand => self.add_band_prompt(),
            Action::RemoveBand => self.band_number_prompt(FieldPurpose::RemoveBandWhich, "Remove"),
            Action::ChangeBand => self.band_number_prompt(FieldPurpose::ChangeBandWhich, "Change"),
            Action::EditTitle => self.title_prompt(),
            Action::EditOrientation => self.orientation_prompt(),
            Action::SetNuPosition => self.nu_position_prompt(),
            Action::EditNotes => self.notes_prompt(),
            Action::NewSession => self.new_session_asked(),
            Action::NextGenerator => self.next_generator(),
            Action::NextIrrep => self.next_irrep(),
            Action::LowerSymmetry => self.lower_symmetry_picker(),
            Action::ReplaceAtom => self.replace_atom_prompt(),
            Action::Char(_) | Action::Backspace => {}
            Action::Click { x, y } => super::ui::click(self, x, y),
        }
    }

    /// The panes this session has, in Tab order: Normal modes only when it names a Hessian.
    pub fn panels(&self) -> Vec<Panel> {
        Panel::ALL
            .into_iter()
            .filter(|p| *p != Panel::Vibrations || self.session.vibrations.is_some())
            .collect()
    }

    /// The pane `d` steps along the Tab order from the focused one.
    fn step_panel(&self, d: i64) -> Panel {
        let ps = self.panels();
        let i = ps.iter().position(|p| *p == self.panel).unwrap_or(0) as i64;
        ps[(i + d).rem_euclid(ps.len() as i64) as usize]
    }

    fn go(&mut self, p: Panel) {
        if !self.panels().contains(&p) {
            return self.status(
                "no Hessian in this session: add [vibrations] hessian = \"job.json\" to the \
                 session file (a QCSchema result, or a plain Hessian with units) to see its \
                 normal modes",
            );
        }
        self.panel = p;
        if p == Panel::Group {
            self.load_catalogue();
            if let Some(g) = &self.session.group {
                if self.group_ui.query.is_empty() {
                    if let Some(i) = self.group_matches().iter().position(|e| &e.name == g) {
                        self.group_ui.cursor = i;
                    }
                }
            }
        }
    }

    /// Rows that fit in one page of the focused pane.
    fn page(&self) -> usize {
        let h = self
            .tiles()
            .iter()
            .find(|t| t.panel == self.panel)
            .map(|t| t.area.height)
            .unwrap_or(self.screen.1);
        (h as usize).saturating_sub(6).max(1)
    }

    fn toggle_zoom(&mut self) {
        let size = (self.screen.0, self.screen.1);
        if super::layout::arrangement(size.0, size.1) == super::layout::Arrangement::Single {
            self.zoom = false;
            let (w, h) = super::layout::TILED;
            return self.status(format!(
                "one pane already fills the screen (panes tile from {w}x{h} up)"
            ));
        }
        self.zoom = !self.zoom;
        if self.zoom {
            self.status(format!(
                "{} alone; z again shows all panes",
                self.panel.title()
            ));
        } else {
            self.status("all panes");
        }
    }

    fn move_by(&mut self, dx: i64, dy: i64) {
        let clampi = |v: i64, n: usize| -> usize {
            if n == 0 {
                0
            } else {
                v.clamp(0, n as i64 - 1) as usize
            }
        };
        match self.panel {
            Panel::Group => {
                if dx != 0 {
                    self.group_ui.table_scroll =
                        (self.group_ui.table_scroll as i64 + dx).clamp(0, 200) as u16;
                    return;
                }
                let n = self.group_matches().len();
                self.group_ui.cursor = clampi(self.group_ui.cursor as i64 + dy, n);
            }
            Panel::Members => {
                let nrows = self
                    .session
                    .sets
                    .get(self.members_ui.set)
                    .map(|s| s.members.len())
                    .unwrap_or(0);
                let ncols = self
                    .analysis
                    .as_ref()
                    .map(|a| a.group.table.classes.len())
                    .unwrap_or(0);
                self.members_ui.row = clampi(self.members_ui.row as i64 + dy, nrows);
                self.members_ui.col = clampi(self.members_ui.col as i64 + dx, ncols);
            }
            Panel::Representation if dx != 0 => {
                let ncols = self
                    .analysis
                    .as_ref()
                    .map(|a| a.group.table.classes.len())
                    .unwrap_or(1);
                self.rep_hscroll = clampi(self.rep_hscroll as i64 + dx, ncols) as u16;
            }
            p => {
                let s = &mut self.scrolls[p.index()];
                *s = (*s as i64 + dy).clamp(0, 10_000) as u16;
            }
        }
    }

    fn switch_set(&mut self, d: i64) {
        let n = self.session.sets.len();
        if n == 0 {
            self.status("no member sets yet: n in the Members panel starts one");
            return;
        }
        self.members_ui.set = ((self.members_ui.set as i64 + d).rem_euclid(n as i64)) as usize;
        self.members_ui.row = 0;
        self.members_ui.scroll = 0;
        self.clamp_cursors();
        let name = self.session.sets[self.members_ui.set].name.clone();
        self.status(format!("set {}/{}: {name}", self.members_ui.set + 1, n));
    }

    fn choose_group(&mut self) {
        let Some(entry) = self
            .group_matches()
            .get(self.group_ui.cursor)
            .map(|e| (*e).clone())
        else {
            self.status("no group matches the search");
            return;
        };
        if self.session.group.as_deref() == Some(entry.name.as_str()) {
            self.status(format!(
                "{} is already the group of this session",
                entry.name
            ));
            return;
        }
        let new_group = match crate::group::load(&entry.name) {
            Ok(g) => g,
            Err(e) => return self.error(e.to_string()),
        };
        // Ticks carry over only where the classes (or the geometry) determine them.
        let (regrouped, extra) = crate::analysis::whatif::regroup(
            &self.session,
            self.analysis.as_deref().ok(),
            &new_group,
            self.base_dir().as_deref(),
        );
        self.edit(|s| *s = regrouped);
        self.group_ui.query.clear();
        self.group_ui.typing = false;
        if let Some(i) = self
            .group_matches()
            .iter()
            .position(|e| e.name == entry.name)
        {
            self.group_ui.cursor = i;
        }
        self.status(format!("group: {}{extra}", entry.name));
    }

    fn cursor_member(&self) -> Option<&Member> {
        self.session
            .sets
            .get(self.members_ui.set)?
            .members
            .get(self.members_ui.row)
    }

    /// Tick or untick the cell under the cursor.
    pub fn toggle(&mut self) {
        let Ok(a) = self.analysis.clone() else {
            return self.error("choose a point group first (Point group panel, Enter)");
        };
        let (si, mi, ci) = (
            self.members_ui.set,
            self.members_ui.row,
            self.members_ui.col,
        );
        if self.cursor_member().is_none() {
            return self.status("this set has no members yet: a adds one");
        }
        let t = &a.group.table;
        let Some(class) = t.classes.get(ci) else {
            return;
        };
        if class.ascii == "E" {
            return self.status("E leaves every member in place: that tick is always there");
        }
        let ascii = class.ascii.clone();
        self.edit(|s| {
            let m = &mut s.sets[si].members[mi];
            let had = m
                .unmoved_by
                .iter()
                .any(|c| analysis::resolve_class(t, c) == Some(ci));
            if had {
                m.unmoved_by
                    .retain(|c| analysis::resolve_class(t, c) != Some(ci));
            } else {
                m.unmoved_by.push(ascii);
            }
            // Keep ticks in table order (unknown names last) so files stay tidy.
            m.unmoved_by
                .sort_by_key(|c| analysis::resolve_class(t, c).unwrap_or(usize::MAX));
        });
    }

    /// Replace the ticks of the current set's members that name their atoms with the ones the
    /// geometry gives (one undoable edit).
    pub fn take_geometry_ticks(&mut self) {
        let Some((a, s)) = self.current_set() else {
            return self.status("no member set yet: n starts one");
        };
        let gt = &s.geometry_ticks;
        if gt.compared() == 0 {
            let why = gt.reason.clone().unwrap_or_default();
            return self.status(format!("nothing to take from the geometry: {why}"));
        }
        let n = gt.disagreements.len();
        if n == 0 {
            return self.status("the ticks already agree with the geometry");
        }
        let classes: Vec<String> = a
            .group
            .table
            .classes
            .iter()
            .map(|c| c.ascii.clone())
            .collect();
        // Only the rows that disagree are rewritten (in table order, like ticking does).
        let rows: Vec<(usize, Vec<bool>)> = gt
            .expected
            .iter()
            .enumerate()
            .filter(|(mi, _)| gt.disagreements.iter().any(|(m, _)| m == mi))
            .filter_map(|(mi, row)| row.clone().map(|r| (mi, r)))
            .collect();
        let si = self.members_ui.set;
        self.edit(|s| {
            for (mi, row) in &rows {
                if let Some(m) = s.sets[si].members.get_mut(*mi) {
                    m.unmoved_by = classes
                        .iter()
                        .zip(row)
                        .filter(|(_, &on)| on)
                        .map(|(c, _)| c.clone())
                        .collect();
                }
            }
        });
        self.status(format!(
            "took the geometry's ticks: {n} cell(s) changed in {} member(s) (u undoes)",
            rows.len()
        ));
    }

    fn add_member_prompt(&mut self) {
        if self.session.sets.is_empty() {
            self.edit(|s| {
                s.sets.push(MemberSet {
                    name: "Set 1".into(),
                    kind: SetKind::Stretch,
                    members: Vec::new(),
                })
            });
            self.members_ui.set = 0;
        }
        let set = &self.session.sets[self.members_ui.set];
        let name = next_name(set);
        self.ask_field(FieldPurpose::AddMember, "Name of the new member", name);
    }

    fn remove_member(&mut self) {
        let (si, mi) = (self.members_ui.set, self.members_ui.row);
        let Some(name) = self.cursor_member().map(|m| m.name.clone()) else {
            return self.status("no member to remove");
        };
        self.edit(|s| {
            s.sets[si].members.remove(mi);
        });
        self.clamp_cursors();
        self.status(format!("removed {name} (u brings it back)"));
    }

    fn remove_set(&mut self) {
        let si = self.members_ui.set;
        let Some(name) = self.session.sets.get(si).map(|s| s.name.clone()) else {
            return self.status("no set to delete");
        };
        self.edit(|s| {
            s.sets.remove(si);
        });
        self.clamp_cursors();
        self.status(format!("deleted set {name} (u brings it back)"));
    }

    pub(super) fn ask_field(&mut self, purpose: FieldPurpose, label: &str, text: String) {
        self.mode = Mode::Field(Field {
            purpose,
            label: label.into(),
            text,
        });
    }

    fn field_key(&mut self, mut f: Field, key: Key) {
        match key.code {
            Code::Esc => {
                self.mode = Mode::Normal;
                self.status("left unchanged");
            }
            Code::Enter => {
                self.mode = Mode::Normal;
                self.field_done(f);
            }
            Code::Backspace => {
                f.text.pop();
                self.mode = Mode::Field(f);
            }
            Code::Char('u') if key.ctrl => {
                f.text.clear();
                self.mode = Mode::Field(f);
            }
            Code::Char(c) if !key.ctrl => {
                f.text.push(c);
                self.mode = Mode::Field(f);
            }
            _ => self.mode = Mode::Field(f),
        }
    }

    fn field_done(&mut self, f: Field) {
        let text = f.text.trim().to_string();
        if text.is_empty() {
            return self.status("empty: nothing done");
        }
        let si = self.members_ui.set;
        match f.purpose {
            FieldPurpose::SaveAs => {
                let p = PathBuf::from(&text);
                if Some(&p) == self.path.as_ref() {
                    self.save_to(&p);
                    return;
                }
                match check_save_target(&p) {
                    Ok(SaveTarget::New) => {
                        self.save_to(&p);
                    }
                    Ok(SaveTarget::ExistingSession) => {
                        self.mode = Mode::Ask(Question::OverwriteSession(p))
                    }
                    Err(e) => self.error(e.to_string()),
                }
            }
            FieldPurpose::Export => {
                let p = PathBuf::from(&text);
                if p.extension().and_then(|e| e.to_str()) == Some("toml") {
                    return self.error("a report is not a session: use .md, .tex, .json or .txt");
                }
                if p.exists() {
                    self.mode = Mode::Ask(Question::OverwriteExport(p));
                } else {
                    self.export_to(&p);
                }
            }
            FieldPurpose::AddMember => {
                if self.session.sets[si].members.iter().any(|m| m.name == text) {
                    return self.error(format!("there is already a member called {text}"));
                }
                self.edit(|s| s.sets[si].members.push(Member::new(text.clone())));
                self.members_ui.row = self.session.sets[si].members.len() - 1;
                self.status(format!(
                    "added {text}; Space ticks the classes that leave it in place"
                ));
            }
            FieldPurpose::RenameMember => {
                let mi = self.members_ui.row;
                let set = &self.session.sets[si];
                if set
                    .members
                    .iter()
                    .enumerate()
                    .any(|(k, m)| k != mi && m.name == text)
                {
                    return self.error(format!("there is already a member called {text}"));
                }
                self.edit(|s| s.sets[si].members[mi].name = text.clone());
            }
            FieldPurpose::AddSet => {
                self.edit(|s| {
                    s.sets.push(MemberSet {
                        name: text.clone(),
                        kind: SetKind::Stretch,
                        members: Vec::new(),
                    })
                });
                self.members_ui.set = self.session.sets.len() - 1;
                self.members_ui.row = 0;
                self.status(format!(
                    "new set {text} (kind stretch; t changes it); a adds members"
                ));
            }
            FieldPurpose::RenameSet => {
                self.edit(|s| s.sets[si].name = text.clone());
            }
            FieldPurpose::AddBonds => self.bonds_done(true, &text),
            FieldPurpose::RemoveBonds => self.bonds_done(false, &text),
            FieldPurpose::Sites => self.sites_done(&text),
            FieldPurpose::ReplaceAtom => self.replace_atom_done(&text),
            FieldPurpose::MemberAtoms => self.member_atoms_done(&text),
            FieldPurpose::SiteItem(i, st) => self.site_item_done(i, st, &text),
            p @ (FieldPurpose::AddBand
            | FieldPurpose::RemoveBandWhich
            | FieldPurpose::ChangeBandWhich
            | FieldPurpose::ChangeBand(_)
            | FieldPurpose::Title
            | FieldPurpose::Orientation
            | FieldPurpose::NuPosition
            | FieldPurpose::NoteWhich
            | FieldPurpose::AddNote
            | FieldPurpose::ChangeNote(_)) => self.record_field_done(p, &text),
        }
    }

    fn answer(&mut self, q: Question, key: Key) {
        let c = match key.code {
            Code::Char(c) => c.to_ascii_lowercase(),
            Code::Esc => '\u{1b}',
            Code::Enter => '\n',
            _ => return,
        };
        self.mode = Mode::Normal;
        match (q, c) {
            (Question::Quit, 's' | 'y') => {
                let ok = match self.path.clone() {
                    Some(p) => self.save_to(&p),
                    None => {
                        self.ask_field(FieldPurpose::SaveAs, "Save as", "session.toml".into());
                        false
                    }
                };
                if ok {
                    self.quit = true;
                }
            }
            (Question::Quit, 'd') => {
                self.recovery.clear();
                self.quit = true;
            }
            (Question::Quit, 'n' | '\u{1b}') => self.status("not quitting"),
            (Question::Recover(s), 'r' | 'y') => {
                let before = std::mem::replace(&mut self.session, *s);
                self.undo.push(before);
                self.changed();
                self.status("restored the unsaved edits of the earlier run (s saves them)");
            }
            (Question::Recover(_), 'd') => {
                self.recovery.clear();
                self.status("discarded the edits of the earlier run");
            }
            (Question::Recover(_), 'n' | '\u{1b}') => {
                self.status("kept the recovery file for later; opening the saved session")
            }
            (Question::OverwriteSession(p), 'y') => {
                self.save_to(&p);
            }
            (Question::OverwriteExport(p), 'y') => self.export_to(&p),
            (Question::NewSession, c @ ('s' | 'y' | 'd' | 'n' | '\u{1b}')) => {
                self.new_session_answer(c)
            }
            (Question::OverwriteSession(_) | Question::OverwriteExport(_), 'n' | '\u{1b}') => {
                self.status("not written")
            }
            (q, _) => self.mode = Mode::Ask(q),
        }
    }

    /// Save atomically; on success the path becomes the session's home. Returns success.
    pub fn save_to(&mut self, p: &Path) -> bool {
        // Save-as keeps the comments and layout of the file the session came from.
        let layout_from = self.path.clone().unwrap_or_else(|| p.to_path_buf());
        match session::save_keeping(&self.session, &layout_from, p) {
            Ok(()) => {
                if self.path.as_deref() != Some(p) {
                    self.recovery.clear();
                    self.recovery = Recovery::for_session(Some(p));
                }
                self.recovery.clear();
                self.path = Some(p.to_path_buf());
                self.saved = self.session.clone();
                self.autosaved_gen = self.gen;
                self.status(format!("saved {}", p.display()));
                true
            }
            Err(e) => {
                self.error(format!("not saved: {e}"));
                false
            }
        }
    }

    fn export_to(&mut self, p: &Path) {
        let fmt = match crate::report::export_format(None, Some(p)) {
            Ok(f) => f,
            Err(e) => return self.error(format!("report not written: {e}")),
        };
        let r = analysis::analyze_in(&self.session, Depth::Full, self.base_dir().as_deref());
        let text = session_report::render(&self.session, &r, fmt, self.ascii);
        match session::write_atomic(p, &text) {
            Ok(()) => self.status(format!("report written to {}", p.display())),
            Err(e) => self.error(format!("report not written: {e}")),
        }
    }

    /// Write the unsaved edits aside if they changed since the last time.
    pub fn autosave(&mut self) {
        if self.autosaved_gen == self.gen {
            return;
        }
        self.autosaved_gen = self.gen;
        if !self.dirty() {
            self.recovery.clear();
            return;
        }
        if let Err(e) = self.recovery.write(&self.session) {
            self.error(format!("could not write the recovery file: {e}"));
        }
    }
}

/// A fresh member name following the set's pattern (`r6` → `r7`).
fn next_name(set: &MemberSet) -> String {
    let base = set
        .members
        .last()
        .map(|m| {
            m.name
                .trim_end_matches(|c: char| c.is_ascii_digit())
                .to_string()
        })
        .filter(|b| !b.is_empty())
        .unwrap_or_else(|| match set.kind {
            SetKind::Cartesian | SetKind::Axial => "A".into(),
            SetKind::Pi => "L".into(),
            SetKind::Bend => "a".into(),
            _ => "r".into(),
        });
    (1..)
        .map(|k| format!("{base}{k}"))
        .find(|n| !set.members.iter().any(|m| &m.name == n))
        .unwrap_or_else(|| "member".into())
}
