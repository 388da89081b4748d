//! The command line: one subcommand per job, each a thin call into the library core.
//!
//! Exit codes: 0 success, 2 bad input (message on stderr), 1 other failures.

mod build_cmds;
mod geometry_cmds;
mod molecule_cmds;
mod session_cmds;
mod spectra_cmds;
mod table_cmds;
mod vib_cmds;

use clap::{Parser, Subcommand};

/// A failure to report to the user: message, optional hint, exit code.
#[derive(Debug)]
pub struct CliError {
    pub message: String,
    pub hint: Option<String>,
    pub code: i32,
}

impl CliError {
    pub fn input(message: impl Into<String>) -> Self {
        CliError {
            message: message.into(),
            hint: None,
            code: 2,
        }
    }
    pub fn with_hint(mut self, hint: impl Into<String>) -> Self {
        self.hint = Some(hint.into());
        self
    }
}

pub type CliResult = Result<(), CliError>;

#[derive(Parser, Debug)]
#[command(
    name = "salcdesk",
    version,
    about = "Molecular symmetry workspace: point groups, representations, SALCs, vibrational activity",
    long_about = "salcdesk finds point groups, reduces representations exactly, builds SALCs and \
predicts IR/Raman activity. Without a command it opens the terminal workspace on the demo session.\n\
Results are predictions: they support, not replace, experiment and the judgement of the chemist."
)]
pub struct Cli {
    /// Plain ASCII output (no Unicode subscripts, Greek letters or √).
    #[arg(long, global = true)]
    pub ascii: bool,
    #[command(subcommand)]
    pub command: Option<Command>,
}

#[derive(Subcommand, Debug)]
pub enum Command {
    /// List every point group salcdesk has a table for.
    Groups(table_cmds::GroupsArgs),
    /// Print a character table.
    Table(table_cmds::TableArgs),
    /// Reduce a representation given by characters or unmoved counts.
    Reduce(table_cmds::ReduceArgs),
    /// Direct product, symmetric or antisymmetric square of representations.
    Product(table_cmds::ProductArgs),
    /// Check a table file against every rule the shipped tables obey.
    CheckTable(table_cmds::CheckTableArgs),
    /// Report of a session file: group, table, worked reductions, bands, notes.
    Report(session_cmds::ReportArgs),
    /// Open a session file in the terminal workspace.
    Open(session_cmds::OpenArgs),
    /// Survey molecules from XYZ files: group, orientation, Γ3N, Γvib, bond and angle sets.
    Analyze(geometry_cmds::AnalyzeArgs),
    /// Point group of an XYZ file, and what looser tolerances would give.
    Detect(geometry_cmds::DetectArgs),
    /// Idealize a geometry to exact symmetry and write it as XYZ.
    Symmetrize(geometry_cmds::SymmetrizeArgs),
    /// IR/Raman activity, polarization and band counts of the fundamentals.
    Modes(spectra_cmds::ModesArgs),
    /// Overtones and binary combinations: symmetry, activity, harmonic positions.
    Combos(spectra_cmds::CombosArgs),
    /// Hold an observed band list against the prediction.
    Bands(spectra_cmds::BandsArgs),
    /// Descent in symmetry: correlate a group's irreps with a subgroup's.
    Descend(spectra_cmds::DescendArgs),
    /// SALCs of a basis on a molecule (XYZ file) or a what-if molecule (group + --sites).
    Salc(molecule_cmds::SalcArgs),
    /// Build a what-if molecule from a group's sites; write it as XYZ or as a new session.
    Build(build_cmds::BuildArgs),
    /// Normal modes of a frequency job's Hessian: wavenumbers, irreps, activity, isotopologues.
    NormalModes(vib_cmds::NormalModesArgs),
}

/// Run a parsed command line (everything but the terminal workspace).
pub fn run(cli: &Cli) -> CliResult {
    let ascii = cli.ascii;
    // A command answers within 2 s: exact SALC work counts its ceiling from the start of the
    // command (the workspace, a long-lived process, counts it per computation).
    if !matches!(cli.command, None | Some(Command::Open(_))) {
        crate::salc::count_ceiling_from(std::time::Instant::now());
    }
    match &cli.command {
        Some(Command::Groups(a)) => table_cmds::groups(a, ascii),
        Some(Command::Table(a)) => table_cmds::table(a, ascii),
        Some(Command::Reduce(a)) => table_cmds::reduce(a, ascii),
        Some(Command::Product(a)) => table_cmds::product(a, ascii),
        Some(Command::CheckTable(a)) => table_cmds::check_table(a),
        Some(Command::Report(a)) => session_cmds::report(a, ascii),
        Some(Command::Open(a)) => session_cmds::open(a, ascii),
        Some(Command::Analyze(a)) => geometry_cmds::analyze(a, ascii),
        Some(Command::Detect(a)) => geometry_cmds::detect(a, ascii),
        Some(Command::Symmetrize(a)) => geometry_cmds::symmetrize(a, ascii),
        Some(Command::Modes(a)) => spectra_cmds::modes(a, ascii),
        Some(Command::Combos(a)) => spectra_cmds::combos(a, ascii),
        Some(Command::Bands(a)) => spectra_cmds::bands(a, ascii),
        Some(Command::Descend(a)) => spectra_cmds::descend(a, ascii),
        Some(Command::Salc(a)) => molecule_cmds::salc(a, ascii),
        Some(Command::Build(a)) => build_cmds::build(a),
        Some(Command::NormalModes(a)) => vib_cmds::normal_modes(a, ascii),
        None => session_cmds::workspace(None, ascii, false),
    }
}

/// Write a file atomically: a temporary file in the same folder, fsync, rename.
pub fn write_atomic(path: &std::path::Path, bytes: &[u8]) -> std::io::Result<()> {
    use std::io::Write;
    let dir = path
        .parent()
        .filter(|d| !d.as_os_str().is_empty())
        .unwrap_or(std::path::Path::new("."));
    let name = path
        .file_name()
        .map(|n| n.to_string_lossy().into_owned())
        .unwrap_or_default();
    let tmp = dir.join(format!(".{name}.{}.salcdesk-tmp", std::process::id()));
    {
        let mut f = std::fs::File::create(&tmp)?;
        f.write_all(bytes)?;
        f.sync_all()?;
    }
    std::fs::rename(&tmp, path)?;
    if let Ok(d) = std::fs::File::open(dir) {
        let _ = d.sync_all();
    }
    Ok(())
}

/// Parse `--format` values.
pub fn parse_format(s: &str) -> Result<crate::report::Format, String> {
    crate::report::Format::parse(s)
        .ok_or_else(|| format!("unknown format '{s}' (text, md, latex, json)"))
}

/// Let negative exact numbers (`-1`, `-1/2`, `-sqrt(2)`) pass as values: a lone-dash argument that
/// is not a known short flag but parses as a number gets a Unicode minus, which the number
/// syntax reads the same way.
pub fn preprocess_args(args: Vec<String>) -> Vec<String> {
    args.into_iter()
        .map(|a| {
            let is_short_flag = matches!(a.as_str(), "-f" | "-h" | "-V" | "-o");
            if a.starts_with('-')
                && !a.starts_with("--")
                && !is_short_flag
                && crate::exact::parse(&a).is_ok()
            {
                format!("−{}", &a[1..])
            } else {
                a
            }
        })
        .collect()
}

/// Print a CliError the friendly way and return its exit code. A stderr that is gone is not
/// a reason to panic (`eprintln!` would).
pub fn report_error(e: &CliError) -> i32 {
    use std::io::Write;
    let mut err = std::io::stderr().lock();
    let _ = writeln!(err, "salcdesk: {}", e.message);
    if let Some(h) = &e.hint {
        let _ = writeln!(err, "  hint: {h}");
    }
    e.code
}
