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
    /// Output format: text, md, latex (a standalone document), json. Default: from the
    /// extension of --output (.md, .tex/.latex, .json, .txt/.text), else md.
    #[arg(long, short, value_parser = parse_format)]
    pub format: Option<Format>,
    /// Write to this file instead of standard output.
    #[arg(long, short)]
    pub output: Option<PathBuf>,
    /// LaTeX only: write just the tables, for \input into a document of your own.
    #[arg(long)]
    pub fragment: bool,
}

/// Print (or write) the report of a session.
pub fn report(a: &ReportArgs, ascii: bool) -> CliResult {
    let format = report::export_format(a.format, a.output.as_deref()).map_err(|e| {
        CliError::input(e.to_string())
            .with_hint("give --format md|latex|json|text to choose one whatever the name")
    })?;
    if a.fragment && format != Format::Latex {
        return Err(CliError::input(format!(
            "--fragment is a LaTeX option; this report would be written as {}",
            format.extension()
        ))
        .with_hint("add --format latex, or write to a .tex file"));
    }
    let s = session::load_file(&a.session).map_err(|e| CliError::input(e.to_string()))?;
    let an = analysis::analyze(&s);
    let text = if a.fragment {
        report::session::latex_fragment(&s, &an)
    } else {
        report::session::render(&s, &an, format, ascii)
    };
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
