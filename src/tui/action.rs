//! Everything the user can ask the workspace to do, as plain data. Keys and mouse clicks are
//! translated into these (see `keymap`), and `app::App::apply` carries them out.

/// The panels, in Tab order.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Panel {
    Group,
    Members,
    Representation,
    Combinations,
    Spectra,
    Molecule,
    /// Normal modes of the session's Hessian (`[vibrations]`); only in the Tab order when the
    /// session names one.
    Vibrations,
}

impl Panel {
    pub const ALL: [Panel; 7] = [
        Panel::Group,
        Panel::Members,
        Panel::Representation,
        Panel::Combinations,
        Panel::Spectra,
        Panel::Molecule,
        Panel::Vibrations,
    ];
    /// The panel's title: plain chemistry words.
    pub fn title(self) -> &'static str {
        match self {
            Panel::Group => "Point group",
            Panel::Members => "Members",
            Panel::Representation => "Representation",
            Panel::Combinations => "Combinations",
            Panel::Spectra => "Spectra",
            Panel::Molecule => "Molecule",
            Panel::Vibrations => "Normal modes",
        }
    }
    pub fn index(self) -> usize {
        Panel::ALL.iter().position(|p| *p == self).unwrap_or(0)
    }
    pub fn next(self) -> Self {
        Panel::ALL[(self.index() + 1) % Panel::ALL.len()]
    }
    pub fn prev(self) -> Self {
        Panel::ALL[(self.index() + Panel::ALL.len() - 1) % Panel::ALL.len()]
    }
}

/// One thing to do.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Action {
    NextPanel,
    PrevPanel,
    GoPanel(Panel),
    Up,
    Down,
    Left,
    Right,
    PageUp,
    PageDown,
    Home,
    End,
    /// Choose / confirm what is under the cursor.
    Enter,
    /// Tick or untick the cell under the cursor.
    Toggle,
    /// Start typing a group name (fuzzy search).
    Search,
    Help,
    Quit,
    Undo,
    Redo,
    Save,
    SaveAs,
    Export,
    NextSet,
    PrevSet,
    AddMember,
    RemoveMember,
    RenameMember,
    AddSet,
    RemoveSet,
    RenameSet,
    CycleKind,
    /// Molecule: add bonds (with their symmetry images).
    AddBond,
    /// Molecule: remove bonds (with their symmetry images).
    RemoveBond,
    /// Molecule: build the geometry from the group's sites.
    BuildSites,
    /// Combinations: next generating member of the worked projection.
    NextGenerator,
    /// Combinations: next irrep of the worked projection.
    NextIrrep,
    /// Replace the current set's ticks with the geometry's (members that name their atoms).
    TakeGeometryTicks,
    /// Members: a new member set from the geometry's bond, angle, atom or ligand sets.
    NewSetFromGeometry,
    /// Members: give or change the atoms of the member under the cursor.
    MemberAtoms,
    /// Spectra: add an observed band.
    AddBand,
    /// Spectra: remove an observed band (asks its number).
    RemoveBand,
    /// Spectra: retype an observed band (asks its number).
    ChangeBand,
    /// Retype the session's title.
    EditTitle,
    /// Retype the session's orientation note.
    EditOrientation,
    /// Spectra: give a fundamental (ν number) its position, or clear it.
    SetNuPosition,
    /// Add, retype or remove a line of the session's notes.
    EditNotes,
    /// Start a new, empty session (asks about unsaved edits first).
    NewSession,
    /// Show the focused pane alone, or all panes again (tiled screens).
    Zoom,
    /// What if: lower the session's symmetry (pick the subgroup and the way).
    LowerSymmetry,
    /// What if: replace one atom of the geometry (asks number and element).
    ReplaceAtom,
    /// Leave a dialog, search or overlay.
    Cancel,
    /// A character typed into a text field.
    Char(char),
    Backspace,
    /// A mouse click at a screen cell.
    Click {
        x: u16,
        y: u16,
    },
    ScrollUp,
    ScrollDown,
}
