//! A reader that goes away (`salcdesk table Oh | head -1`) never makes a command panic: every
//! subcommand with output, its standard output a pipe whose reader has gone, stops quietly —
//! killed by SIGPIPE (status 141 in a shell) or exit 0 — with no panic message and no
//! "Broken pipe" on stderr.
//!
//! Two pipes per case: one whose reader is closed before the command starts (so the very
//! first write hits it: deterministic), and one read for one line and then closed, as `head -1`
//! does. The cases are checked against clap's own list of subcommands, so a new command fails
//! this test until it has a case here.

#![cfg(unix)]

mod common;

use clap::CommandFactory;
use common::TempDir;
use std::collections::BTreeSet;
use std::io::{BufRead, BufReader, Read};
use std::os::fd::{FromRawFd, OwnedFd};
use std::os::unix::process::ExitStatusExt;
use std::path::Path;
use std::process::{Command, ExitStatus, Stdio};

/// Subcommands that do not write a stream of output: `open` is the terminal workspace (its
/// endings are tested in tests/tui_hangup.rs).
const NO_STREAM: &[&str] = &["open"];

/// (subcommand, arguments after it). `{dir}` is the folder of test inputs made below.
const CASES: &[(&str, &[&str])] = &[
    ("groups", &[]),
    ("table", &["Oh"]),
    ("table", &["Ih", "--format", "json"]),
    ("table", &["D6h", "--format", "latex"]),
    (
        "reduce",
        &["Oh", "6", "0", "0", "2", "2", "0", "0", "0", "4", "2"],
    ),
    (
        "reduce",
        &[
            "Ih",
            "--unmoved",
            "12",
            "2",
            "2",
            "0",
            "0",
            "0",
            "0",
            "0",
            "0",
            "4",
            "--format",
            "md",
        ],
    ),
    ("product", &["Ih", "Hg", "--sym"]),
    ("product", &["Oh", "T1u", "T2g", "--format", "json"]),
    ("check-table", &["{repo}/tables/Ih.toml"]),
    ("report", &["{repo}/sessions/demo-octahedral-centre.toml"]),
    (
        "report",
        &[
            "{repo}/sessions/demo-octahedral-centre.toml",
            "--format",
            "latex",
        ],
    ),
    (
        "report",
        &["{repo}/sessions/tetrahedral-mx4.toml", "--format", "json"],
    ),
    ("analyze", &["{dir}"]),
    ("analyze", &["{dir}", "--format", "jsonl"]),
    (
        "analyze",
        &["{dir}/cocl6.xyz", "{dir}/ch4.xyz", "--format", "md"],
    ),
    ("detect", &["{dir}/cluster.xyz"]),
    ("detect", &["{dir}/cocl6.xyz", "--format", "json"]),
    ("symmetrize", &["{dir}/cluster.xyz"]),
    ("modes", &["{dir}/cocl6.xyz"]),
    ("normal-modes", &["{repo}/tests/fixtures/vib/sf6.json"]),
    (
        "normal-modes",
        &["{repo}/tests/fixtures/vib/benzene.json", "--format", "json"],
    ),
    (
        "modes",
        &[
            "--group",
            "Oh",
            "--gamma",
            "A1g + Eg + 2T1u + T2g + T2u",
            "--format",
            "json",
        ],
    ),
    ("combos", &["{dir}/ch4.xyz"]),
    (
        "combos",
        &[
            "--group",
            "Ih",
            "--gamma",
            "2Ag + 4Hg + 3T1u",
            "--format",
            "md",
        ],
    ),
    (
        "bands",
        &[
            "--group",
            "Td",
            "--gamma",
            "A1 + E + 2T2",
            "--bands",
            "{dir}/bands.txt",
        ],
    ),
    (
        "descend",
        &["Oh", "C2v", "--gamma", "A1g + Eg + 2T1u + T2g + T2u"],
    ),
    (
        "salc",
        &["Oh", "--sites", "Co@origin Cl@axis1:2.3", "--basis", "pi"],
    ),
    ("salc", &["{dir}/cocl6.xyz", "--format", "json"]),
    (
        "salc",
        &["{dir}/ch4.xyz", "--basis", "cartesian", "--format", "latex"],
    ),
    (
        "build",
        &["Oh", "--sites", "C@general1:3.1,20,10 N@general1:4.2,35,25"],
    ),
];

fn salcdesk() -> Command {
    let mut c = Command::new(env!("CARGO_BIN_EXE_salcdesk"));
    c.stdin(Stdio::null()).stderr(Stdio::piped());
    c
}

/// XYZ files (built by salcdesk itself) and a band list in a folder of their own.
fn inputs(dir: &Path) {
    for (name, group, sites) in [
        ("cocl6.xyz", "Oh", "Co@origin Cl@axis1:2.3"),
        ("ch4.xyz", "Td", "C@origin H@axis3:1.09"),
        (
            "cluster.xyz",
            "Oh",
            "C@general1:3.1,20,10 N@general1:4.2,35,25",
        ),
    ] {
        let out = salcdesk()
            .args(["build", group, "--sites", sites, "-o"])
            .arg(dir.join(name))
            .output()
            .unwrap();
        assert!(out.status.success(), "build {name}: {out:?}");
    }
    // Invented band positions: only the output's length matters here.
    std::fs::write(
        dir.join("bands.txt"),
        "2917 Raman vs\n1534 Raman m\n3019 IR s\n1306 IR s\n3020 Raman w\n",
    )
    .unwrap();
}

fn args(case: &[&str], dir: &Path) -> Vec<String> {
    let repo = env!("CARGO_MANIFEST_DIR");
    let dir = dir.to_string_lossy();
    case.iter()
        .map(|a| a.replace("{dir}", &dir).replace("{repo}", repo))
        .collect()
}

/// A pipe; (read end, write end).
fn pipe() -> (OwnedFd, OwnedFd) {
    let mut fds = [0; 2];
    // SAFETY: pipe fills two new descriptors, each then owned exactly once.
    unsafe {
        assert_eq!(libc::pipe(fds.as_mut_ptr()), 0);
        (OwnedFd::from_raw_fd(fds[0]), OwnedFd::from_raw_fd(fds[1]))
    }
}

/// Quiet end for a command whose reader went away: SIGPIPE, 141 or 0, nothing alarming on
/// stderr.
fn assert_quiet(what: &str, status: ExitStatus, stderr: &[u8]) {
    let err = String::from_utf8_lossy(stderr);
    assert!(
        status.signal() == Some(libc::SIGPIPE) || matches!(status.code(), Some(0 | 141)),
        "{what}: {status:?}; stderr: {err}"
    );
    for bad in ["panicked", "Broken pipe", "broken pipe", "RUST_BACKTRACE"] {
        assert!(!err.contains(bad), "{what}: stderr has {bad:?}: {err}");
    }
}

#[test]
fn every_subcommand_has_a_case() {
    let cli = salcdesk::cli::Cli::command();
    let all: BTreeSet<&str> = cli
        .get_subcommands()
        .map(|c| c.get_name())
        .filter(|n| !NO_STREAM.contains(n))
        .collect();
    let covered: BTreeSet<&str> = CASES.iter().map(|c| c.0).collect();
    assert_eq!(all, covered, "subcommands and closed-pipe cases differ");
}

#[test]
fn every_subcommand_stops_quietly_when_its_reader_goes_away() {
    let dir = TempDir::new("pipe");
    inputs(dir.path());
    for (cmd, case) in CASES {
        let a = args(case, dir.path());
        let what = format!("salcdesk {cmd} {}", a.join(" "));

        // The case is valid and has output: read in full, it succeeds.
        let full = salcdesk().arg(cmd).args(&a).output().unwrap();
        assert!(full.status.success(), "{what}: {full:?}");
        assert!(!full.stdout.is_empty(), "{what}: no output");

        // Reader closed before the start: the first write meets a closed pipe.
        let (read, write) = pipe();
        drop(read);
        let out = salcdesk()
            .arg(cmd)
            .args(&a)
            .stdout(Stdio::from(write))
            .output()
            .unwrap();
        assert_quiet(&format!("{what} (reader closed)"), out.status, &out.stderr);
        assert_eq!(
            out.status.signal(),
            Some(libc::SIGPIPE),
            "{what}: a write to a closed pipe ends the command by SIGPIPE"
        );

        // `| head -1`: one line read, then the reader goes away.
        let mut child = salcdesk()
            .arg(cmd)
            .args(&a)
            .stdout(Stdio::piped())
            .spawn()
            .unwrap();
        let mut stdout = BufReader::new(child.stdout.take().unwrap());
        let mut line = String::new();
        stdout.read_line(&mut line).unwrap();
        drop(stdout);
        let mut err = Vec::new();
        child.stderr.take().unwrap().read_to_end(&mut err).unwrap();
        let status = child.wait().unwrap();
        assert!(!line.is_empty(), "{what}: a first line");
        assert_quiet(&format!("{what} (| head -1)"), status, &err);
    }
}
