//! The one key map: every binding is one line of [`BINDINGS`] — key, where it works, what it
//! does and how to describe it. The help overlay and the footer are generated from it, so
//! they cannot drift from what the keys really do.
//!
//! Text fields (group search, file names, member names) and yes/no questions take typed keys
//! directly; [`FIELD_KEYS`] describes them for the help overlay.

use super::action::{Action, Panel};

/// A key, independent of the terminal library.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Code {
    Char(char),
    Tab,
    BackTab,
    Enter,
    Esc,
    Up,
    Down,
    Left,
    Right,
    PageUp,
    PageDown,
    Home,
    End,
    Backspace,
    Delete,
}

/// A key with its Ctrl modifier (Shift is in the character itself).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub struct Key {
    pub code: Code,
    pub ctrl: bool,
}

impl Key {
    pub const fn plain(code: Code) -> Self {
        Key { code, ctrl: false }
    }
    pub const fn ch(c: char) -> Self {
        Key {
            code: Code::Char(c),
            ctrl: false,
        }
    }
    pub const fn ctrl(c: char) -> Self {
        Key {
            code: Code::Char(c),
            ctrl: true,
        }
    }
    /// How the key is written in help and footer.
    pub fn label(&self, ascii: bool) -> String {
        let base = match self.code {
            Code::Char(' ') => "Space".to_string(),
            Code::Char(c) => c.to_string(),
            Code::Tab => "Tab".into(),
            Code::BackTab => "Shift-Tab".into(),
            Code::Enter => "Enter".into(),
            Code::Esc => "Esc".into(),
            Code::Up => if ascii { "Up" } else { "↑" }.into(),
            Code::Down => if ascii { "Down" } else { "↓" }.into(),
            Code::Left => if ascii { "Left" } else { "←" }.into(),
            Code::Right => if ascii { "Right" } else { "→" }.into(),
            Code::PageUp => "PgUp".into(),
            Code::PageDown => "PgDn".into(),
            Code::Home => "Home".into(),
            Code::End => "End".into(),
            Code::Backspace => "Backspace".into(),
            Code::Delete => "Del".into(),
        };
        if self.ctrl {
            format!("Ctrl-{base}")
        } else {
            base
        }
    }
}

/// Where a binding works.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Scope {
    Everywhere,
    In(Panel),
}

/// One line of the key map.
#[derive(Debug, Clone, Copy)]
pub struct Binding {
    pub keys: &'static [Key],
    pub scope: Scope,
    pub action: Action,
    /// Short words for the footer; `None` keeps it out of the footer.
    pub footer: Option<&'static str>,
    /// The description in the help overlay.
    pub help: &'static str,
}

use Code::*;
use Scope::*;

const fn b(
    keys: &'static [Key],
    scope: Scope,
    action: Action,
    footer: Option<&'static str>,
    help: &'static str,
) -> Binding {
    Binding {
        keys,
        scope,
        action,
        footer,
        help,
    }
}

/// Every key binding. Panel bindings come first so that they win over the general ones.
pub const BINDINGS: &[Binding] = &[
    // Point group
    b(
        &[Key::plain(Enter)],
        In(Panel::Group),
        Action::Enter,
        Some("use group"),
        "use the highlighted group for this session",
    ),
    b(
        &[Key::ch('/')],
        In(Panel::Group),
        Action::Search,
        Some("find"),
        "type to find a group by name, family or order",
    ),
    // Members
    b(
        &[Key::ch(' '), Key::plain(Enter)],
        In(Panel::Members),
        Action::Toggle,
        Some("tick"),
        "tick/untick: the class's chosen operation leaves this member in place",
    ),
    b(
        &[Key::ch('a')],
        In(Panel::Members),
        Action::AddMember,
        Some("add"),
        "add a member to this set",
    ),
    b(
        &[Key::ch('d')],
        In(Panel::Members),
        Action::RemoveMember,
        None,
        "remove the member under the cursor",
    ),
    b(
        &[Key::ch('r')],
        In(Panel::Members),
        Action::RenameMember,
        None,
        "rename the member under the cursor",
    ),
    b(
        &[Key::ch('t')],
        In(Panel::Members),
        Action::CycleKind,
        Some("kind"),
        "change the kind of this set (stretch, bend, scalar, cartesian, pi, axial)",
    ),
    b(
        &[Key::ch('m')],
        In(Panel::Members),
        Action::TakeGeometryTicks,
        None,
        "take the molecule's ticks for this set (members that name their atoms; u undoes)",
    ),
    b(
        &[Key::ch('n')],
        In(Panel::Members),
        Action::AddSet,
        None,
        "start a new member set",
    ),
    b(
        &[Key::ch('N')],
        In(Panel::Members),
        Action::RenameSet,
        None,
        "rename this set",
    ),
    b(
        &[Key::ch('D')],
        In(Panel::Members),
        Action::RemoveSet,
        None,
        "delete this set (u brings it back)",
    ),
    b(
        &[Key::ch('A')],
        In(Panel::Members),
        Action::NewSetFromGeometry,
        None,
        "new set from the molecule: its bonds, angles, atoms or ligand σ/π (a picker)",
    ),
    b(
        &[Key::ch('@')],
        In(Panel::Members),
        Action::MemberAtoms,
        None,
        "give or change the atoms of the member under the cursor (1-2, 2-1-3; none unties)",
    ),
    // Sets, wherever sets are shown
    // Combinations
    b(
        &[Key::ch('m')],
        In(Panel::Combinations),
        Action::NextGenerator,
        Some("member"),
        "worked projection: next generating member",
    ),
    b(
        &[Key::ch('i')],
        In(Panel::Combinations),
        Action::NextIrrep,
        Some("irrep"),
        "worked projection: next irrep",
    ),
    // Molecule
    b(
        &[Key::ch('+')],
        In(Panel::Molecule),
        Action::AddBond,
        Some("add bond"),
        "add bonds (atom numbers i-j); their symmetry images are added too",
    ),
    b(
        &[Key::ch('x')],
        In(Panel::Molecule),
        Action::RemoveBond,
        None,
        "remove bonds (atom numbers i-j) with their symmetry images",
    ),
    b(
        &[Key::ch('b')],
        In(Panel::Molecule),
        Action::BuildSites,
        Some("build"),
        "build the molecule from the group's sites: pick site types, type element and r",
    ),
    // Spectra
    b(
        &[Key::ch('+')],
        In(Panel::Spectra),
        Action::AddBand,
        Some("add band"),
        "add an observed band: position technique [intensity] [p|dp] [note]",
    ),
    b(
        &[Key::ch('c')],
        In(Panel::Spectra),
        Action::ChangeBand,
        Some("change band"),
        "retype an observed band (asks its number)",
    ),
    b(
        &[Key::ch('x')],
        In(Panel::Spectra),
        Action::RemoveBand,
        None,
        "remove an observed band (asks its number; u brings it back)",
    ),
    b(
        &[Key::ch('v')],
        In(Panel::Spectra),
        Action::SetNuPosition,
        Some("position"),
        "give a fundamental (ν number) its position in cm⁻¹: overtones and combinations fill in",
    ),
    b(
        &[Key::ch(']')],
        Everywhere,
        Action::NextSet,
        Some("set"),
        "next member set",
    ),
    b(
        &[Key::ch('[')],
        Everywhere,
        Action::PrevSet,
        None,
        "previous member set",
    ),
    // Everywhere
    b(
        &[Key::plain(Tab)],
        Everywhere,
        Action::NextPanel,
        Some("panel"),
        "next panel",
    ),
    b(
        &[Key::ch('z')],
        Everywhere,
        Action::Zoom,
        Some("zoom"),
        "show the focused pane alone, or all panes again (screens from 120x32 tile)",
    ),
    b(
        &[Key::plain(BackTab)],
        Everywhere,
        Action::PrevPanel,
        None,
        "previous panel",
    ),
    b(
        &[Key::ch('1')],
        Everywhere,
        Action::GoPanel(Panel::Group),
        None,
        "Point group panel",
    ),
    b(
        &[Key::ch('2')],
        Everywhere,
        Action::GoPanel(Panel::Members),
        None,
        "Members panel",
    ),
    b(
        &[Key::ch('3')],
        Everywhere,
        Action::GoPanel(Panel::Representation),
        None,
        "Representation panel",
    ),
    b(
        &[Key::ch('4')],
        Everywhere,
        Action::GoPanel(Panel::Combinations),
        None,
        "Combinations panel",
    ),
    b(
        &[Key::ch('5')],
        Everywhere,
        Action::GoPanel(Panel::Spectra),
        None,
        "Spectra panel",
    ),
    b(
        &[Key::ch('6')],
        Everywhere,
        Action::GoPanel(Panel::Molecule),
        None,
        "Molecule panel",
    ),
    b(
        &[Key::ch('7')],
        Everywhere,
        Action::GoPanel(Panel::Vibrations),
        None,
        "Normal modes panel (when the session names a Hessian)",
    ),
    b(
        &[Key::plain(Up), Key::ch('k')],
        Everywhere,
        Action::Up,
        None,
        "move up / scroll up",
    ),
    b(
        &[Key::plain(Down), Key::ch('j')],
        Everywhere,
        Action::Down,
        None,
        "move down / scroll down",
    ),
    b(
        &[Key::plain(Left), Key::ch('h')],
        Everywhere,
        Action::Left,
        None,
        "move left",
    ),
    b(
        &[Key::plain(Right), Key::ch('l')],
        Everywhere,
        Action::Right,
        None,
        "move right",
    ),
    b(
        &[Key::plain(PageUp)],
        Everywhere,
        Action::PageUp,
        None,
        "page up",
    ),
    b(
        &[Key::plain(PageDown)],
        Everywhere,
        Action::PageDown,
        None,
        "page down",
    ),
    b(
        &[Key::plain(Home), Key::ch('g')],
        Everywhere,
        Action::Home,
        None,
        "to the top",
    ),
    b(
        &[Key::plain(End), Key::ch('G')],
        Everywhere,
        Action::End,
        None,
        "to the bottom",
    ),
    b(
        &[Key::ch('/')],
        Everywhere,
        Action::Search,
        None,
        "find a point group (opens the Point group panel)",
    ),
    b(
        &[Key::ch('T')],
        Everywhere,
        Action::EditTitle,
        None,
        "retype the session's title",
    ),
    b(
        &[Key::ch('O')],
        Everywhere,
        Action::EditOrientation,
        None,
        "retype the orientation note (where the axes and members lie)",
    ),
    b(
        &[Key::ch('W')],
        Everywhere,
        Action::EditNotes,
        None,
        "write the session's notes: add a line, retype one, or remove one (shown in Spectra)",
    ),
    b(
        &[Key::ctrl('n')],
        Everywhere,
        Action::NewSession,
        None,
        "start a new, empty session (asks first when there are unsaved edits)",
    ),
    b(
        &[Key::ch('L')],
        Everywhere,
        Action::LowerSymmetry,
        None,
        "what if: lower the symmetry (pick subgroup and way; a applies it)",
    ),
    b(
        &[Key::ch('R')],
        Everywhere,
        Action::ReplaceAtom,
        None,
        "what if: replace one atom of the geometry (new group, Γvib, band counts)",
    ),
    b(
        &[Key::ch('u')],
        Everywhere,
        Action::Undo,
        Some("undo"),
        "undo the last edit",
    ),
    b(&[Key::ctrl('r')], Everywhere, Action::Redo, None, "redo"),
    b(
        &[Key::ch('s')],
        Everywhere,
        Action::Save,
        Some("save"),
        "save the session (atomically)",
    ),
    b(
        &[Key::ch('S')],
        Everywhere,
        Action::SaveAs,
        None,
        "save the session under another name",
    ),
    b(
        &[Key::ch('e')],
        Everywhere,
        Action::Export,
        Some("report"),
        "export a report (.md, .tex, .json or .txt)",
    ),
    b(
        &[Key::ch('?')],
        Everywhere,
        Action::Help,
        Some("help"),
        "this help",
    ),
    b(
        &[Key::plain(Esc)],
        Everywhere,
        Action::Cancel,
        None,
        "close help, search or a question",
    ),
    b(
        &[Key::ch('q'), Key::ctrl('c')],
        Everywhere,
        Action::Quit,
        Some("quit"),
        "quit (asks first when there are unsaved edits)",
    ),
];

/// Keys inside text fields and questions, for the help overlay.
pub const FIELD_KEYS: &[(&str, &str)] = &[
    ("letters, digits", "type into a search or name field"),
    ("Backspace", "delete the last character"),
    ("Ctrl-u", "clear the whole field or search"),
    ("Enter", "accept the field"),
    ("Esc", "leave the field unchanged"),
    (
        "Up/Down Enter Esc",
        "in a picker: choose, take the line, cancel",
    ),
    (
        "j/k g/G PgUp/PgDn",
        "in this help: scroll (any other key closes it)",
    ),
    (
        "What if: ↑/↓ Enter a",
        "pick a way and show it; a applies the lowering; Esc closes",
    ),
    (
        "y / n",
        "answer a question (other letters are named in the question)",
    ),
];

/// The action a key has in a panel, if any.
pub fn lookup(key: Key, panel: Panel) -> Option<Action> {
    BINDINGS
        .iter()
        .filter(|b| match b.scope {
            Everywhere => true,
            In(p) => p == panel,
        })
        .find(|b| b.keys.contains(&key))
        .map(|b| b.action)
}

/// Keys of a binding joined for display, e.g. `Space/Enter`.
pub fn keys_label(b: &Binding, ascii: bool) -> String {
    b.keys
        .iter()
        .map(|k| k.label(ascii))
        .collect::<Vec<_>>()
        .join("/")
}

/// Footer entries for a panel: (keys, words), panel ones first.
pub fn footer(panel: Panel, ascii: bool) -> Vec<(String, &'static str)> {
    BINDINGS
        .iter()
        .filter(|b| b.scope == In(panel) || b.scope == Everywhere)
        .filter(|b| !(b.scope == Everywhere && lookup(b.keys[0], panel) != Some(b.action)))
        .filter_map(|b| b.footer.map(|f| (keys_label(b, ascii), f)))
        .collect()
}

/// Help lines grouped by scope: (heading, [(keys, description)]).
pub fn help(ascii: bool) -> Vec<(String, Vec<(String, &'static str)>)> {
    let mut out: Vec<(String, Vec<(String, &'static str)>)> = Vec::new();
    let mut scopes: Vec<Scope> = Vec::new();
    for bd in BINDINGS {
        if !scopes.contains(&bd.scope) {
            scopes.push(bd.scope);
        }
    }
    scopes.sort_by_key(|s| match s {
        Everywhere => 0,
        In(p) => 1 + p.index(),
    });
    for s in scopes {
        let heading = match s {
            Everywhere => "Everywhere".to_string(),
            In(p) => format!("In {}", p.title()),
        };
        let lines = BINDINGS
            .iter()
            .filter(|bd| bd.scope == s)
            .map(|bd| (keys_label(bd, ascii), bd.help))
            .collect();
        out.push((heading, lines));
    }
    out.push((
        "In text fields and questions".into(),
        FIELD_KEYS
            .iter()
            .map(|(k, d)| (k.to_string(), *d))
            .collect(),
    ));
    out.push((
        "Mouse".into(),
        vec![
            ("click a tab".into(), "open that panel"),
            (
                "click a cell".into(),
                "move there; in the tick grid, tick/untick it",
            ),
            ("click a group".into(), "highlight it (Enter uses it)"),
            ("wheel".into(), "scroll"),
        ],
    ));
    out
}
