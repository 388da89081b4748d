//! `salcdesk`: parses the command line and hands over to the CLI or the terminal workspace.
//! No chemistry here.

use clap::Parser;
use salcdesk::cli::{report_error, run, Cli};

fn main() {
    let cli = Cli::parse();
    if let Err(e) = run(&cli) {
        std::process::exit(report_error(&e));
    }
}
