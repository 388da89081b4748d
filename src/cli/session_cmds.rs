//! `report` and `open`: sessions from the command line.

use super::{parse_format, CliError, CliResult};
use crate::analysis;
use crate::report::{self, Format};
use crate::session;
use clap::Args;
use std::path::PathBuf;

#[derive(Args, Debug)]
pub struct ReportArgs {
    /// The session file (.toml).
    pub session: PathBuf,
    /// Output format: text, md, latex (a standalone document), json.
    #[arg(long, short, default_value = "md", value_parser = parse_format)]
    pub format: Format,
    /// Write to this file instead of standard output.
    #[arg(long, short)]
    pub output: Option<PathBuf>,
}

/// Print (or write) the report of a session.
pub fn report(a: &ReportArgs, ascii: bool) -> CliResult {
    let s = session::load_file(&a.session).map_err(|e| CliError::input(e.to_string()))?;
    let an = analysis::analyze(&s);
    let text = report::session::render(&s, &an, a.format, ascii);
    match &a.output {
        Some(p) => session::write_atomic(p, &text).map_err(|e| CliError {
            message: e.to_string(),
            hint: None,
            code: 1,
        })?,
        None => print!("{text}"),
    }
    match an {
        // The report is written either way; a geometry that could not be used is also an
        // error of the run, so that batch scripts notice.
        Ok(an) => match an.geometry.as_ref().map(|g| &g.survey) {
            Some(Err(e)) => Err(CliError::input(format!("{}: {e}", a.session.display()))
                .with_hint("the report was written without the molecule")),
            _ => Ok(()),
        },
        Err(e) => Err(CliError::input(format!("{}: {e}", a.session.display()))),
    }
}

#[derive(Args, Debug)]
pub struct OpenArgs {
    /// The session file; a name that does not exist yet starts a new session saved there.
    pub session: PathBuf,
    /// No colour (also when NO_COLOR is set).
    #[arg(long)]
    pub mono: bool,
}

/// Open the terminal workspace on a session file.
pub fn open(a: &OpenArgs, ascii: bool) -> CliResult {
    workspace(Some(a.session.clone()), ascii, a.mono)
}

/// The terminal workspace (the demo when `path` is `None`).
#[cfg(feature = "tui")]
pub fn workspace(path: Option<PathBuf>, ascii: bool, mono: bool) -> CliResult {
    crate::tui::run(crate::tui::Options { path, ascii, mono })
        .map_err(|m| CliError::input(m).with_hint("the session file was left untouched"))
}

/// Without the `tui` feature there is no workspace.
#[cfg(not(feature = "tui"))]
pub fn workspace(_path: Option<PathBuf>, _ascii: bool, _mono: bool) -> CliResult {
    Err(
        CliError::input("this salcdesk was built without the terminal workspace (feature `tui`)")
            .with_hint("use `salcdesk report FILE` or rebuild with default features"),
    )
}
