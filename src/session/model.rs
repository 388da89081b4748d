//! The session as plain data: what the file says, nothing computed.

/// The newest session format this build reads and the one it writes.
pub const FORMAT: u32 = 1;

/// A piece of symmetry work.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Session {
    pub title: String,
    /// ASCII point-group name as the user chose it (`Td`, `D4h`); `None` until chosen.
    pub group: Option<String>,
    /// The user's note on how the molecule sits in the table's axes.
    pub orientation: String,
    pub geometry: Option<Geometry>,
    pub sets: Vec<MemberSet>,
    pub bands: Vec<Band>,
    /// `[fundamentals]`: positions (cm⁻¹) given to fundamentals, by their ν number as the
    /// Spectra pane numbers them (ν1 = 1), in increasing number, each number once.
    pub nu_positions: Vec<(usize, f64)>,
    pub notes: String,
    /// `[vibrations]`: a frequency job's Hessian to label.
    pub vibrations: Option<Vibrations>,
}

/// `[vibrations]`: where the Hessian is and how to treat it.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Vibrations {
    /// QCSchema JSON result, or a plain-text Hessian (relative to the session file).
    pub hessian: String,
    /// Units of a plain-text Hessian (`hartree/bohr2`, `mdyn/angstrom`, …).
    pub units: Option<String>,
    /// XYZ geometry of a plain-text Hessian (default: the `[geometry]` file).
    pub geometry: Option<String>,
    /// Isotopologue replacements (`H=D`, `3=2H`, `Cl=37Cl`).
    pub isotopes: Vec<String>,
    /// Uniform scale factor for band assignment.
    pub scale: Option<f64>,
    /// Assignment tolerance, cm⁻¹.
    pub band_tolerance: Option<f64>,
    /// Average the Hessian over the group's operations.
    pub symmetrize: bool,
    /// Standard atomic weights instead of the most abundant isotopes.
    pub average_masses: bool,
}

/// Where the atoms come from, and the tolerance for symmetry detection.
#[derive(Debug, Clone, PartialEq)]
pub struct Geometry {
    pub source: GeometrySource,
    /// Å.
    pub tolerance: f64,
    /// Bonds the user added to the perceived ones (1-based atom numbers, as written).
    pub add_bonds: Vec<[usize; 2]>,
    /// Perceived bonds the user removed (1-based atom numbers, as written).
    pub remove_bonds: Vec<[usize; 2]>,
}

impl Geometry {
    /// A geometry with the default tolerance and no bond edits.
    pub fn new(source: GeometrySource) -> Self {
        Geometry {
            source,
            tolerance: 0.01,
            add_bonds: Vec::new(),
            remove_bonds: Vec::new(),
        }
    }
}

/// Inline atoms or an XYZ file (path as written, relative to the session file).
#[derive(Debug, Clone, PartialEq)]
pub enum GeometrySource {
    Atoms(Vec<Atom>),
    File(String),
}

/// One atom: element symbol and Cartesian position in Å.
#[derive(Debug, Clone, PartialEq)]
pub struct Atom {
    pub element: String,
    pub xyz: [f64; 3],
}

/// A named set of members (a basis) and which classes leave each member in place.
#[derive(Debug, Clone, PartialEq)]
pub struct MemberSet {
    pub name: String,
    pub kind: SetKind,
    pub members: Vec<Member>,
}

/// One member and its ticks.
#[derive(Debug, Clone, PartialEq)]
pub struct Member {
    pub name: String,
    /// ASCII class symbols (as written; `analysis` resolves them against the table). `E` is
    /// always present after loading.
    pub unmoved_by: Vec<String>,
    /// The atoms the member sits on (numbers from 1, in the geometry's atom order), when
    /// named: one for scalar, cartesian and axial members, two (a bond) for stretch and pi,
    /// three (end, apex, end) for bend. `analysis` compares the ticks with the geometry
    /// through them.
    pub atoms: Option<Vec<usize>>,
}

impl Member {
    /// A member left in place by the identity only.
    pub fn new(name: impl Into<String>) -> Self {
        Member {
            name: name.into(),
            unmoved_by: vec!["E".into()],
            atoms: None,
        }
    }

    /// Whether the named atoms fit a member of `kind`: as many as it sits on
    /// ([`SetKind::atoms_per_member`]), numbered from 1 (and small enough to write), no atom
    /// twice.
    pub fn atoms_fit(&self, kind: SetKind) -> bool {
        match &self.atoms {
            None => true,
            Some(a) => {
                a.len() == kind.atoms_per_member()
                    && a.iter().all(|&n| n >= 1 && i64::try_from(n).is_ok())
                    && a.iter()
                        .enumerate()
                        .all(|(i, x)| a[..i].iter().all(|y| y != x))
            }
        }
    }
}

/// What one unmoved member contributes to the character.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum SetKind {
    /// A bond vector (stretch): 1.
    Stretch,
    /// An interbond angle: 1.
    Bend,
    /// Any scalar member, e.g. an s orbital or a σ lone pair: 1.
    Scalar,
    /// An x, y, z displacement triple on an atom: the trace of the operation.
    Cartesian,
    /// Two vectors perpendicular to a bond: trace − 1.
    Pi,
    /// An infinitesimal-rotation triple: det · trace.
    Axial,
}

impl SetKind {
    pub const ALL: [SetKind; 6] = [
        SetKind::Stretch,
        SetKind::Bend,
        SetKind::Scalar,
        SetKind::Cartesian,
        SetKind::Pi,
        SetKind::Axial,
    ];
    /// The word used in files and on screen.
    pub fn name(self) -> &'static str {
        match self {
            SetKind::Stretch => "stretch",
            SetKind::Bend => "bend",
            SetKind::Scalar => "scalar",
            SetKind::Cartesian => "cartesian",
            SetKind::Pi => "pi",
            SetKind::Axial => "axial",
        }
    }
    pub fn parse(s: &str) -> Option<Self> {
        SetKind::ALL
            .into_iter()
            .find(|k| k.name().eq_ignore_ascii_case(s.trim()))
    }
    /// What one unmoved member contributes, in words.
    pub fn contribution(self) -> &'static str {
        match self {
            SetKind::Stretch | SetKind::Bend | SetKind::Scalar => "1 per unmoved member",
            SetKind::Cartesian => "trace of R per unmoved atom (1+2cos θ, or −1+2cos θ)",
            SetKind::Pi => "trace of R − 1 per unmoved bond",
            SetKind::Axial => "det R · trace R per unmoved atom",
        }
    }
    /// How many atoms one member sits on: 2 for a bond (stretch, pi), 3 for an angle (bend:
    /// end, apex, end), 1 otherwise.
    pub fn atoms_per_member(self) -> usize {
        match self {
            SetKind::Stretch | SetKind::Pi => 2,
            SetKind::Bend => 3,
            SetKind::Scalar | SetKind::Cartesian | SetKind::Axial => 1,
        }
    }
    /// The atoms of one member, in words (for messages).
    pub fn atoms_shape(self) -> &'static str {
        match self {
            SetKind::Stretch | SetKind::Pi => "two atoms (a bond, e.g. [1, 2])",
            SetKind::Bend => "three atoms (end, apex, end, e.g. [2, 1, 3])",
            SetKind::Scalar | SetKind::Cartesian | SetKind::Axial => "one atom (e.g. [1])",
        }
    }
    /// The next kind, for cycling through them.
    pub fn next(self) -> Self {
        let i = SetKind::ALL.iter().position(|k| *k == self).unwrap_or(0);
        SetKind::ALL[(i + 1) % SetKind::ALL.len()]
    }
}

/// Infrared or Raman.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Technique {
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

/// Raman polarization: polarized or depolarized.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Polarization {
    Polarized,
    Depolarized,
}

impl Polarization {
    pub fn name(self) -> &'static str {
        match self {
            Polarization::Polarized => "p",
            Polarization::Depolarized => "dp",
        }
    }
}

/// One observed band.
#[derive(Debug, Clone, PartialEq)]
pub struct Band {
    /// cm⁻¹.
    pub position: f64,
    pub technique: Technique,
    pub intensity: String,
    pub polarization: Option<Polarization>,
    pub note: String,
}
