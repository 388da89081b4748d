//! salcdesk — a terminal workspace for molecular symmetry work.
//!
//! The library core knows no terminal: exact numbers ([`exact`]), point groups and their
//! character tables ([`group`]), representations and reduction ([`rep`]), molecules and
//! point-group detection ([`geom`]). The command line and the terminal workspace are thin
//! faces over it.

pub mod analysis;
pub mod basis;
pub mod cli;
pub mod exact;
pub mod geom;
pub mod group;
pub mod rep;
pub mod report;
#[doc(hidden)]
pub mod robustness;
pub mod salc;
pub mod session;
pub mod spectra;
pub mod survey;
#[cfg(feature = "tui")]
pub mod tui;
pub mod vib;
