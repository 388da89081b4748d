//! `salcdesk`: parses the command line and hands over to the CLI or the terminal workspace.
//! No chemistry here.

use clap::Parser;
use salcdesk::cli::{preprocess_args, report_error, run, Cli};

fn main() {
    let cli = Cli::parse_from(preprocess_args(std::env::args().collect()));
    if let Err(e) = run(&cli) {
        std::process::exit(report_error(&e));
    }
}
