//! Sessions: one TOML file that holds a piece of symmetry work — the group (or a geometry),
//! the sets of members whose representations are wanted, the bands observed, and notes.
//!
//! Owns the file schema (versioned), reading it with precise error locations, writing it back
//! in a stable layout, atomic saves, and recovery files. Refuses to know any chemistry beyond
//! names: which class leaves which member in place is *recorded* here and *interpreted* by
//! `analysis`.
//!
//! # Session files (format 1)
//!
//! ```toml
//! format = 1                      # required; files from a newer salcdesk are refused
//! title = "Square-planar PtCl4 centre"
//! group = "D4h"                   # ASCII point-group name (case does not matter)
//! orientation = "Pt–Cl bonds along x and y"   # optional: how the molecule sits in the
//!                                             # table's axes, shown beside the table's own
//!                                             # convention
//! notes = """
//! Free text, kept as written.
//! """
//!
//! [geometry]                      # optional: the molecule itself
//! tolerance = 0.01                # Å, for symmetry detection
//! file = "ptcl4.xyz"              # an XYZ file, relative to this session file …
//! atoms = [                       # … or the atoms inline (one of the two)
//!   { element = "Pt", xyz = [0.0, 0.0, 0.0] },
//!   { element = "Cl", xyz = [2.3, 0.0, 0.0] },
//! ]
//! add_bonds = [[1, 5]]           # optional: bonds added to the perceived ones and perceived
//! remove_bonds = [[2, 3]]         # bonds taken away (atom numbers from 1, in atom order)
//!
//! [[set]]                         # one block per member set (a basis of your choosing)
//! name = "Pt–Cl stretches"
//! kind = "stretch"                # stretch | bend | scalar | cartesian | pi | axial
//! members = ["r1", "r2", "r3", "r4"]
//!
//! [set.unmoved]                   # the ticks: for each member, the classes whose chosen
//! r1 = ["E", "C2'", "sh", "sv"]   # operation leaves it in place (ASCII class symbols,
//! r2 = ["E", "sh"]                # with or without the count: "2C4" or "C4")
//!
//! [set.atoms]                     # optional: the atoms a member sits on (numbers from 1, in
//! r1 = [1, 2]                     # the geometry's atom order): one for scalar, cartesian
//! r2 = [1, 3]                     # and axial; two (a bond) for stretch and pi; three (end,
//!                                 # apex, end) for bend. Members may be left out.
//!
//! [[band]]                        # observed bands, any number
//! position = 330.0                # cm⁻¹
//! technique = "Raman"             # IR | Raman
//! intensity = "vs"                # free text (vs, s, m, w, vw, sh, a number …)
//! polarization = "p"              # Raman only: p (polarized) | dp (depolarized)
//! note = "sharp"
//!
//! [fundamentals]                  # optional: positions of fundamentals, cm⁻¹, by their ν
//! nu1 = 330.0                     # number as the Spectra pane numbers them; overtone and
//! nu3 = 312.0                     # combination positions are then filled in (harmonic sums)
//! ```
//!
//! A tick in column *c* means: take one operation of class *c* (the same one for every member,
//! e.g. the representative the table describes) — it leaves this member where it was. The
//! number of ticks in a column is the unmoved count of that class. `E` leaves every member in
//! place; it is always counted, written or not.
//!
//! With a `[geometry]` whose detected group is the session's group, the ticks of every member
//! that names its atoms are compared with the geometry: the chosen operation of a class (the
//! first of the class in the table's operation list, in the table's standard orientation)
//! leaves a bond in place when it maps its two atoms onto themselves (either way round for a
//! stretch, each onto itself for pi), an angle when it keeps the apex and maps the two ends onto
//! themselves, a one-atom member when it keeps the atom. Whether the atoms exist is checked
//! then, against the geometry.
//!
//! Kinds say what one unmoved member contributes to χ: `stretch`, `bend` and `scalar` 1 (a bond
//! vector, an angle, an s-type orbital); `cartesian` the trace of the operation's matrix (an
//! x, y, z displacement triple on an atom); `pi` trace − 1 (two vectors perpendicular to a
//! bond); `axial` det·trace (an infinitesimal-rotation triple).

mod demo;
mod keep;
mod load;
mod model;
mod recovery;
mod save;
mod vib_section;
mod write;

pub use demo::{demo, DEMO_NAME};
pub use load::{load_file, parse, LoadError};
pub use model::{
    Atom, Band, Geometry, GeometrySource, Member, MemberSet, Polarization, Session, SetKind,
    Technique, Vibrations, FORMAT,
};
pub use recovery::{
    demo_recovery_path, fallback_recovery_path, recovery_path, state_dir, Recovery,
};
pub use save::{
    check_save_target, save, save_keeping, to_toml_keeping, write_atomic, SaveError, SaveTarget,
};
pub use write::to_toml;
