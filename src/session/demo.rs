//! The demo session built into the binary: what `salcdesk` opens without a file.

use super::load::parse;
use super::model::Session;

/// Name shown for the demo session.
pub const DEMO_NAME: &str = "sessions/demo-octahedral-centre.toml";

const DEMO_TEXT: &str = include_str!("../../sessions/demo-octahedral-centre.toml");

/// The demo session. Falls back to an empty session should the embedded file not parse with
/// the tables of this build (a test keeps that from shipping).
pub fn demo() -> Session {
    parse(DEMO_NAME, DEMO_TEXT).unwrap_or_default()
}
