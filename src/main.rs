//! `salcdesk`: parses the command line and hands over to the CLI or the terminal workspace.
//! No chemistry here.

use clap::Parser;
use salcdesk::cli::{preprocess_args, report_error, run, Cli};

fn main() {
    default_sigpipe();
    let cli = Cli::parse_from(preprocess_args(std::env::args().collect()));
    if let Err(e) = run(&cli) {
        std::process::exit(report_error(&e));
    }
}

/// A command whose reader went away (`salcdesk table Oh | head -1`) ends at once and quietly,
/// status 141 in the shell, as shell tools do. Rust starts with SIGPIPE ignored, which turns
/// the next `print!` into a panic; this puts back the default. (The workspace ignores SIGPIPE
/// again: it treats a failed terminal write as a lost terminal and rescues the edits.)
#[cfg(unix)]
fn default_sigpipe() {
    // SAFETY: setting a signal's disposition to the default at start-up, before any thread.
    unsafe {
        libc::signal(libc::SIGPIPE, libc::SIG_DFL);
    }
}

#[cfg(not(unix))]
fn default_sigpipe() {}
