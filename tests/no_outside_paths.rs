//! No test, bench, fuzz target or library code may read anything outside the repository
//! except temporary files it makes itself: a fresh clone must pass `cargo test` anywhere. This
//! scans every `.rs` file under src/, tests/, benches/ and fuzz/ for string literals holding
//! an absolute path (a quoted literal that starts with a slash and names a folder such as work,
//! tmp or home, raw strings included) and fails naming file:line.
//!
//! Allowed, because they must be absolute: `/dev/null`; `/dev/tty` (the workspace's terminal
//! when standard input is not one); `/proc/…` (the pty tests read the CPU time of their own
//! child process); and paths under `/nonexistent/` that the bad-input tests use precisely
//! because they do not exist (checked below). A path fragment
//! joined to a directory from `env!` inside `concat!` (`concat!(env!("OUT_DIR"), "/x.rs")`)
//! is relative to that directory. Comments are not code and are skipped.

use std::path::{Path, PathBuf};

/// Literals that may be absolute: exact strings, and prefixes of deliberately missing paths.
const ALLOWED_EXACT: &[&str] = &["/dev/null", "/dev/tty"];
const ALLOWED_MISSING_PREFIX: &str = "/nonexistent/";
/// The kernel's view of a process (the pty tests read the CPU time of their own child).
const ALLOWED_PROC_PREFIX: &str = "/proc/";

/// One string literal: its text (escapes left as written) and the line it starts on.
#[derive(Debug)]
struct Literal {
    text: String,
    line: usize,
    /// The code just before it on its line (to recognise `concat!(env!(…), "/…")`).
    before: String,
}

/// The string literals of Rust source, skipping comments, char literals and lifetimes.
fn literals(src: &str) -> Vec<Literal> {
    let b: Vec<char> = src.chars().collect();
    let mut out = Vec::new();
    let mut i = 0;
    let mut line = 1;
    let mut line_start = 0;
    while i < b.len() {
        let c = b[i];
        let next = b.get(i + 1).copied();
        if c == '\n' {
            line += 1;
            i += 1;
            line_start = i;
            continue;
        }
        if c == '/' && next == Some('/') {
            while i < b.len() && b[i] != '\n' {
                i += 1;
            }
            continue;
        }
        if c == '/' && next == Some('*') {
            let mut depth = 0;
            while i < b.len() {
                if b[i] == '/' && b.get(i + 1) == Some(&'*') {
                    depth += 1;
                    i += 2;
                } else if b[i] == '*' && b.get(i + 1) == Some(&'/') {
                    depth -= 1;
                    i += 2;
                    if depth == 0 {
                        break;
                    }
                } else {
                    if b[i] == '\n' {
                        line += 1;
                        line_start = i + 1;
                    }
                    i += 1;
                }
            }
            continue;
        }
        if c == '\'' {
            // 'x', '\n', '\u{…}' are char literals; 'a (no closing quote) is a lifetime.
            if next == Some('\\') {
                i += 2;
                while i < b.len() && b[i] != '\'' {
                    i += 1;
                }
                i += 1;
            } else if b.get(i + 2) == Some(&'\'') {
                i += 3;
            } else {
                i += 1;
            }
            continue;
        }
        // Raw strings: r"…", r#"…"#, br"…" (a `r` that is not the end of an identifier).
        let ident_before = i > 0 && (b[i - 1].is_alphanumeric() || b[i - 1] == '_');
        let raw_at = if c == 'r' && !ident_before {
            Some(i + 1)
        } else if c == 'b' && next == Some('r') && !ident_before {
            Some(i + 2)
        } else {
            None
        };
        if let Some(mut j) = raw_at {
            let mut hashes = 0;
            while b.get(j) == Some(&'#') {
                hashes += 1;
                j += 1;
            }
            if b.get(j) == Some(&'"') {
                let start_line = line;
                let before: String = b[line_start..i].iter().collect();
                let mut text = String::new();
                j += 1;
                loop {
                    if j >= b.len() {
                        break;
                    }
                    if b[j] == '"' && (0..hashes).all(|k| b.get(j + 1 + k) == Some(&'#')) {
                        j += 1 + hashes;
                        break;
                    }
                    if b[j] == '\n' {
                        line += 1;
                        line_start = j + 1;
                    }
                    text.push(b[j]);
                    j += 1;
                }
                out.push(Literal {
                    text,
                    line: start_line,
                    before,
                });
                i = j;
                continue;
            }
        }
        if c == '"' {
            let start_line = line;
            let before: String = b[line_start..i].iter().collect();
            let mut text = String::new();
            i += 1;
            while i < b.len() && b[i] != '"' {
                if b[i] == '\\' && i + 1 < b.len() {
                    text.push(b[i]);
                    text.push(b[i + 1]);
                    if b[i + 1] == '\n' {
                        line += 1;
                        line_start = i + 2;
                    }
                    i += 2;
                    continue;
                }
                if b[i] == '\n' {
                    line += 1;
                    line_start = i + 1;
                }
                text.push(b[i]);
                i += 1;
            }
            i += 1;
            out.push(Literal {
                text,
                line: start_line,
                before,
            });
            continue;
        }
        i += 1;
    }
    out
}

/// Absolute paths inside a literal: a `/` at the start or after a space, quote, `=`, `(`,
/// `[` or `,`, followed by a path character (so `"/ to find"`, `"{}/{}"`, `"a/b"`, `"1/2"`
/// and `"//"` are not paths). A `~/` path is the user's home: also outside.
fn absolute_paths(text: &str) -> Vec<String> {
    let t: Vec<char> = text.chars().collect();
    let mut found = Vec::new();
    for (i, &c) in t.iter().enumerate() {
        let starts = match c {
            '/' => {
                i == 0
                    || " \t\"'=([,".contains(t[i - 1])
                    || (i >= 2 && t[i - 2] == '\\' && t[i - 1] == 'n')
            }
            '~' => (i == 0 || " \t\"'=([,".contains(t[i - 1])) && t.get(i + 1) == Some(&'/'),
            _ => false,
        };
        if !starts {
            continue;
        }
        let first = if c == '~' { t.get(i + 2) } else { t.get(i + 1) };
        if !first.is_some_and(|f| f.is_alphanumeric() || "_.-".contains(*f)) {
            continue;
        }
        let end = t[i..]
            .iter()
            .position(|x| x.is_whitespace() || "\"'),;]{}".contains(*x) || *x == '\\')
            .map_or(t.len(), |p| i + p);
        found.push(t[i..end].iter().collect());
    }
    found
}

fn allowed(path: &str, lit: &Literal) -> bool {
    if ALLOWED_EXACT.contains(&path)
        || path.starts_with(ALLOWED_MISSING_PREFIX)
        || path.starts_with(ALLOWED_PROC_PREFIX)
    {
        return true;
    }
    // concat!(env!("OUT_DIR"), "/file.rs"): relative to the env! directory.
    let code = lit.before.trim_end();
    code.contains("concat!(env!(") && code.ends_with("),") && lit.text.starts_with(path)
}

/// file:line: path, for every absolute path in the string literals of `src`.
fn offences(file: &str, src: &str) -> Vec<String> {
    let mut out = Vec::new();
    for lit in literals(src) {
        for p in absolute_paths(&lit.text) {
            if !allowed(&p, &lit) {
                out.push(format!("{file}:{}: {p}", lit.line));
            }
        }
    }
    out
}

fn rust_files(dir: &Path, out: &mut Vec<PathBuf>) {
    let Ok(entries) = std::fs::read_dir(dir) else {
        return;
    };
    for e in entries.flatten() {
        let p = e.path();
        let name = e.file_name();
        if p.is_dir() {
            // Build output and fuzzing data are not source.
            if name != "target" && name != "corpus" && name != "artifacts" {
                rust_files(&p, out);
            }
        } else if p.extension().is_some_and(|x| x == "rs") {
            out.push(p);
        }
    }
}

#[test]
fn no_absolute_paths_in_source_tests_benches_or_fuzz_targets() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let mut files = Vec::new();
    for d in ["src", "tests", "benches", "fuzz"] {
        rust_files(&root.join(d), &mut files);
    }
    files.sort();
    assert!(
        files
            .iter()
            .any(|f| f.ends_with("tests/no_outside_paths.rs")),
        "the scan reaches this file"
    );
    assert!(files.len() > 50, "only {} files found", files.len());
    let mut bad = Vec::new();
    let mut missing = Vec::new();
    for f in &files {
        let src = std::fs::read_to_string(f).unwrap();
        let rel = f.strip_prefix(root).unwrap().display().to_string();
        bad.extend(offences(&rel, &src));
        for lit in literals(&src) {
            for p in absolute_paths(&lit.text) {
                if p.starts_with(ALLOWED_MISSING_PREFIX) {
                    missing.push(p);
                }
            }
        }
    }
    assert!(
        bad.is_empty(),
        "absolute paths outside the repository (use a temporary folder the test makes, or \
         env!(\"CARGO_MANIFEST_DIR\")):\n{}",
        bad.join("\n")
    );
    // The allowed missing paths are really missing here (else the bad-input tests they
    // serve would read something).
    for p in missing {
        assert!(!Path::new(&p).exists(), "{p} exists on this machine");
    }
}

#[test]
fn the_scan_catches_a_planted_path_and_nothing_else() {
    // `@` stands for the `/` and `%` for the `~` that start a path, so that this file passes
    // its own scan.
    let planted = concat!(
        "fn f() {\n",
        "    let ok = format!(\"{}/{}\", a, b); // \"@work/in/a/comment\"\n",
        "    /* \"@tmp/in/a/block\" */ let c = '\"'; let l: &'static str = \"a/b 1/2 / to find //\";\n",
        "    let bad = std::fs::read(\"@work/main/tables/C3v.toml\");\n",
        "    let raw = r#\"see \"@home/me/x\"\"#;\n",
        "    let null = \"/dev/null\"; let gone = \"/nonexistent/dir/none.xyz\";\n",
        "    let home = \"%/.cache/thing\"; let t = \"@tmp\";\n",
        "    include!(concat!(env!(\"OUT_DIR\"), \"@generated.rs\"));\n",
        "    let s = \"two\\nlines @etc/passwd\";\n",
        "}\n",
    )
    .replace('@', "/")
    .replace('%', "~");
    let found = offences("planted.rs", &planted);
    let want = [
        "planted.rs:4: @work/main/tables/C3v.toml",
        "planted.rs:5: @home/me/x",
        "planted.rs:7: %/.cache/thing",
        "planted.rs:7: @tmp",
        "planted.rs:9: @etc/passwd",
    ]
    .map(|w| w.replace('@', "/").replace('%', "~"));
    assert_eq!(found, want);
}
