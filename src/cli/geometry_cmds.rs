//! `analyze`, `detect`, `symmetrize`: molecules from XYZ files.
//!
//! `analyze` takes many files, folders or a list on standard input and surveys them in
//! parallel (rayon); output keeps input order; a failed file becomes an error object and the
//! batch goes on; the exit code is 1 when any file failed. This is how salcdesk composes with
//! a cluster scheduler's job arrays.

use super::{parse_format, CliError, CliResult};
use crate::geom::{self, FrameSelect, Molecule, XyzOptions};
use crate::report::{self, Format};
use crate::survey::{survey, SurveyOptions};
use clap::Args;
use rayon::prelude::*;
use std::io::{BufRead, IsTerminal, Write};
use std::path::{Path, PathBuf};
use std::sync::atomic::{AtomicUsize, Ordering};

/// Output formats of `analyze` (the report formats plus one JSON object per line).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum BatchFormat {
    One(Format),
    JsonLines,
}

fn parse_batch_format(s: &str) -> Result<BatchFormat, String> {
    if s.eq_ignore_ascii_case("jsonl") {
        return Ok(BatchFormat::JsonLines);
    }
    parse_format(s)
        .map(BatchFormat::One)
        .map_err(|_| format!("unknown format '{s}' (text, md, json, jsonl)"))
}

#[derive(Args, Debug, Clone)]
pub struct GeometryArgs {
    /// Symmetry tolerance in Å.
    #[arg(long, default_value_t = geom::DEFAULT_TOLERANCE)]
    pub tol: f64,
    /// Frame of a multi-frame XYZ file: first, last or a 1-based number.
    #[arg(long, default_value = "last")]
    pub frame: String,
    /// Largest atom count accepted per frame.
    #[arg(long, default_value_t = 100_000)]
    pub max_atoms: usize,
    /// Bond perception factor: bonded if d ≤ factor × (r₁ + r₂) (covalent radii).
    #[arg(long, default_value_t = geom::DEFAULT_BOND_FACTOR)]
    pub bond_factor: f64,
    /// Use the other customary x/y convention (planar C2v/D2h molecules).
    #[arg(long)]
    pub swap_xy: bool,
    /// Skip bonds, bond sets and angle sets (group, orientation, Γ3N and Γvib only).
    #[arg(long)]
    pub no_internal: bool,
}

impl GeometryArgs {
    pub fn xyz_options(&self) -> Result<XyzOptions, CliError> {
        let frame = match self.frame.to_ascii_lowercase().as_str() {
            "first" => FrameSelect::First,
            "last" => FrameSelect::Last,
            n => {
                let k: usize = n.parse().map_err(|_| {
                    CliError::input(format!(
                        "--frame: expected first, last or a number, found '{n}'"
                    ))
                })?;
                if k == 0 {
                    return Err(CliError::input("--frame counts from 1"));
                }
                FrameSelect::Index(k - 1)
            }
        };
        Ok(XyzOptions {
            frame,
            max_atoms: self.max_atoms,
        })
    }
    pub fn survey_options(&self) -> SurveyOptions {
        SurveyOptions {
            tolerance: self.tol,
            bond_factor: self.bond_factor,
            swap_xy: self.swap_xy,
            internal_coordinates: !self.no_internal,
            ..SurveyOptions::default()
        }
    }
}

/// Read one XYZ file with a message naming file, line and column on failure.
pub fn read_molecule(path: &Path, opts: &XyzOptions) -> Result<Molecule, String> {
    let meta = std::fs::metadata(path).map_err(|e| format!("{}: {e}", path.display()))?;
    // ~80 bytes per atom line is generous; refuse absurd files before reading them.
    let cap = (opts.max_atoms as u64)
        .saturating_mul(200)
        .saturating_add(1 << 20);
    if meta.len() > cap {
        return Err(format!(
            "{}: {} bytes is too large for {} atoms (raise --max-atoms)",
            path.display(),
            meta.len(),
            opts.max_atoms
        ));
    }
    let bytes = std::fs::read(path).map_err(|e| format!("{}: {e}", path.display()))?;
    geom::read_xyz(&bytes, opts).map_err(|e| {
        format!(
            "{}:{}:{}: {}",
            path.display(),
            e.line,
            e.column,
            e.message()
        )
    })
}

#[derive(Args, Debug)]
pub struct AnalyzeArgs {
    /// XYZ files or folders (all *.xyz inside); `-` or nothing reads a list of paths from stdin.
    pub inputs: Vec<PathBuf>,
    #[command(flatten)]
    pub geometry: GeometryArgs,
    /// Output format: text, md, json, jsonl (one object per file, in input order).
    #[arg(long, short, default_value = "text", value_parser = parse_batch_format)]
    pub format: BatchFormat,
    /// Add a bond to the perceived ones: atom numbers from 1 in file order, e.g. 1-5
    /// (repeatable).
    #[arg(long = "add-bond", value_name = "I-J", value_parser = geom::parse_bond)]
    pub add_bond: Vec<[usize; 2]>,
    /// Remove a perceived bond, e.g. 2-3 (repeatable).
    #[arg(long = "remove-bond", value_name = "I-J", value_parser = geom::parse_bond)]
    pub remove_bond: Vec<[usize; 2]>,
}

fn collect_inputs(inputs: &[PathBuf]) -> Result<Vec<PathBuf>, CliError> {
    let mut out = Vec::new();
    let from_stdin = inputs.is_empty() || inputs.iter().any(|p| p.as_os_str() == "-");
    if inputs.is_empty() && std::io::stdin().is_terminal() {
        return Err(CliError::input("no input files")
            .with_hint("give XYZ files, a folder, or pipe a list of paths"));
    }
    for p in inputs {
        if p.as_os_str() == "-" {
            continue;
        }
        if p.is_dir() {
            let mut files: Vec<PathBuf> = std::fs::read_dir(p)
                .map_err(|e| CliError::input(format!("{}: {e}", p.display())))?
                .flatten()
                .map(|e| e.path())
                .filter(|f| {
                    f.extension()
                        .and_then(|e| e.to_str())
                        .is_some_and(|e| e.eq_ignore_ascii_case("xyz"))
                })
                .collect();
            files.sort();
            out.extend(files);
        } else {
            out.push(p.clone());
        }
    }
    if from_stdin {
        for line in std::io::stdin().lock().lines() {
            let line = line.map_err(|e| CliError::input(format!("stdin: {e}")))?;
            let t = line.trim();
            if !t.is_empty() && !t.starts_with('#') {
                out.push(PathBuf::from(t));
            }
        }
    }
    if out.is_empty() {
        return Err(CliError::input("no XYZ files found in the inputs"));
    }
    Ok(out)
}

/// Survey one file into a rendering or an error message.
fn analyze_one(
    path: &Path,
    a: &AnalyzeArgs,
    opts: &XyzOptions,
    ascii: bool,
) -> Result<(String, serde_json::Value), String> {
    let mut mol = read_molecule(path, opts)?;
    let mut sopts = a.geometry.survey_options();
    let edits = geom::BondEdits {
        add: a.add_bond.clone(),
        remove: a.remove_bond.clone(),
    };
    if !edits.is_empty() {
        let perceived = geom::perceive_bonds(&mol, sopts.bond_factor)
            .map_err(|e| format!("{}: {e}", path.display()))?;
        mol.bonds = edits
            .apply(&perceived, mol.atoms.len())
            .map_err(|e| format!("{}: {e}", path.display()))?;
        sopts.perceive_bonds = false;
    }
    let s = survey(&mol, &sopts).map_err(|e| format!("{}: {e}", path.display()))?;
    let name = path.display().to_string();
    // Only the rendering asked for (JSON of a 1,000-atom cluster costs more than its text).
    let (text, json) = match a.format {
        BatchFormat::One(f) if f != Format::Json => (
            report::survey::render(&name, &mol, &s, f, ascii),
            serde_json::Value::Null,
        ),
        _ => (String::new(), report::survey::to_json(&name, &mol, &s)),
    };
    Ok((text, json))
}

pub fn analyze(a: &AnalyzeArgs, ascii: bool) -> CliResult {
    if !(a.geometry.tol.is_finite() && a.geometry.tol > 0.0) {
        return Err(CliError::input("--tol must be a positive number of Å"));
    }
    let opts = a.geometry.xyz_options()?;
    let files = collect_inputs(&a.inputs)?;
    let total = files.len();
    let done = AtomicUsize::new(0);
    let progress = total > 1 && std::io::stderr().is_terminal();
    let results: Vec<Result<(String, serde_json::Value), String>> = files
        .par_iter()
        .map(|f| {
            let r = analyze_one(f, a, &opts, ascii);
            let k = done.fetch_add(1, Ordering::Relaxed) + 1;
            if progress {
                eprint!("\ranalyze: {k}/{total} files");
                let _ = std::io::stderr().flush();
            }
            r
        })
        .collect();
    if progress {
        eprintln!();
    }
    let failed = results.iter().filter(|r| r.is_err()).count();
    let mut out = std::io::stdout().lock();
    let single = total == 1;
    match a.format {
        BatchFormat::JsonLines => {
            for (f, r) in files.iter().zip(&results) {
                let v = match r {
                    Ok((_, j)) => j.clone(),
                    Err(e) => serde_json::json!({"file": f.display().to_string(), "error": e}),
                };
                let _ = writeln!(out, "{}", serde_json::to_string(&v).unwrap_or_default());
            }
        }
        BatchFormat::One(Format::Json) => {
            let vals: Vec<serde_json::Value> = files
                .iter()
                .zip(&results)
                .map(|(f, r)| match r {
                    Ok((_, j)) => j.clone(),
                    Err(e) => serde_json::json!({"file": f.display().to_string(), "error": e}),
                })
                .collect();
            let v = if single {
                vals[0].clone()
            } else {
                serde_json::Value::Array(vals)
            };
            let _ = writeln!(
                out,
                "{}",
                serde_json::to_string_pretty(&v).unwrap_or_default()
            );
        }
        BatchFormat::One(_) => {
            for r in &results {
                match r {
                    Ok((t, _)) => {
                        let _ = writeln!(out, "{t}");
                    }
                    Err(e) if !single => eprintln!("salcdesk: {e}"),
                    Err(_) => {}
                }
            }
        }
    }
    if failed == 0 {
        Ok(())
    } else if single {
        let msg = results
            .into_iter()
            .find_map(|r| r.err())
            .unwrap_or_default();
        Err(CliError {
            message: msg,
            hint: None,
            code: 2,
        })
    } else {
        Err(CliError {
            message: format!("{failed} of {total} files failed"),
            hint: None,
            code: 1,
        })
    }
}

#[derive(Args, Debug)]
pub struct DetectArgs {
    /// An XYZ file.
    pub file: PathBuf,
    #[command(flatten)]
    pub geometry: GeometryArgs,
    /// Output format: text or json.
    #[arg(long, short, default_value = "text", value_parser = parse_format)]
    pub format: Format,
}

pub fn detect(a: &DetectArgs, ascii: bool) -> CliResult {
    let mol = read_molecule(&a.file, &a.geometry.xyz_options()?).map_err(CliError::input)?;
    let d = geom::detect(&mol, a.geometry.tol)
        .map_err(|e| CliError::input(format!("{}: {e}", a.file.display())))?;
    let nm = geom::near_misses(&mol, &geom::NEAR_MISS_TOLERANCES)
        .map_err(|e| CliError::input(e.to_string()))?;
    if a.format == Format::Json {
        let v = serde_json::json!({
            "file": a.file.display().to_string(),
            "point_group": d.group,
            "tolerance": d.tolerance,
            "max_deviation": d.max_deviation,
            "near_misses": nm.iter().map(|n| serde_json::json!({"tolerance": n.tolerance, "group": n.group, "max_deviation": n.max_deviation})).collect::<Vec<_>>(),
            "notes": d.notes,
        });
        println!("{}", serde_json::to_string_pretty(&v).unwrap_or_default());
    } else {
        let ang = if ascii { "A" } else { "Å" };
        println!(
            "{}: {} at {} {ang} (largest deviation {:.4} {ang})",
            a.file.display(),
            d.group,
            d.tolerance,
            d.max_deviation
        );
        for n in &nm {
            println!(
                "  at {:>5} {ang}: {:<6} (largest deviation {:.4} {ang})",
                n.tolerance, n.group, n.max_deviation
            );
        }
        for n in &d.notes {
            println!(
                "  note: {}",
                if ascii {
                    report::ascii_prose(n)
                } else {
                    n.to_string()
                }
            );
        }
    }
    Ok(())
}

#[derive(Args, Debug)]
pub struct SymmetrizeArgs {
    /// An XYZ file.
    pub file: PathBuf,
    /// Where to write the idealized geometry (XYZ); standard output if omitted.
    #[arg(long, short)]
    pub output: Option<PathBuf>,
    /// Symmetrize to this group instead of the one detected (must be found at --tol).
    #[arg(long)]
    pub group: Option<String>,
    #[command(flatten)]
    pub geometry: GeometryArgs,
}

pub fn symmetrize(a: &SymmetrizeArgs, ascii: bool) -> CliResult {
    let mol = read_molecule(&a.file, &a.geometry.xyz_options()?).map_err(CliError::input)?;
    let mut opts = a.geometry.survey_options();
    opts.near_misses = false;
    let s =
        survey(&mol, &opts).map_err(|e| CliError::input(format!("{}: {e}", a.file.display())))?;
    if let Some(g) = &a.group {
        let want = crate::group::canonical_name(g)
            .ok_or_else(|| CliError::input(format!("unknown point group '{g}'")))?;
        if want != s.group.name() {
            return Err(CliError::input(format!(
                "the geometry has {} symmetry at {} Å, not {want}",
                s.group.name(),
                a.geometry.tol
            ))
            .with_hint("raise --tol to reach a higher group, see `salcdesk detect`"));
        }
    }
    let ops: Vec<nalgebra::Matrix3<f64>> = s.working.ops.iter().map(|o| o.float).collect();
    let tol = 2.0 * s.detection.max_deviation + s.detection.tolerance;
    let (ideal, shift) = geom::symmetrize(&s.oriented.molecule, &ops, tol)
        .map_err(|e| CliError::input(e.to_string()))?;
    let mut ideal = ideal;
    // Averaging about the centre of mass keeps it on every element; put it at the origin
    // exactly, so the axes of the standard orientation run through it.
    let com = ideal.centre_of_mass();
    for atom in &mut ideal.atoms {
        atom.position -= com;
    }
    // An input that already is such a result (symmetric, centred and in standard
    // orientation to well below the 10 printed decimals) is written back as it is, so
    // that symmetrizing again changes nothing, byte for byte.
    const SETTLED: f64 = 1e-9;
    let unturned = (s.oriented.rotation - nalgebra::Matrix3::identity())
        .iter()
        .all(|x| x.abs() <= SETTLED);
    if shift <= SETTLED && unturned && s.oriented.centre.norm() <= SETTLED {
        ideal.atoms.clone_from(&mol.atoms);
    }
    ideal.title = symmetrized_title(&mol.title, s.group.name(), shift);
    let text = geom::write_xyz(&ideal);
    match &a.output {
        Some(p) => {
            crate::cli::write_atomic(p, text.as_bytes())
                .map_err(|e| CliError::input(format!("{}: {e}", p.display())))?;
        }
        None => print!("{text}"),
    }
    let ang = if ascii { "A" } else { "Å" };
    eprintln!(
        "symmetrized to {}: largest atom displacement {shift:.5} {ang}",
        s.group.name()
    );
    Ok(())
}

/// The comment line of a symmetrized file: the original comment, the group and the largest
/// shift. A comment that already says so (the file is the output of an earlier pass) is
/// kept as it is when the group is the same and nothing moved at print precision, and
/// otherwise replaced, never extended: symmetrizing again does not grow the comment.
fn symmetrized_title(title: &str, group: &str, shift: f64) -> String {
    const MARK: &str = "symmetrized to ";
    let title = title.trim();
    let (original, earlier) = match title.find(MARK) {
        Some(k) => (title[..k].trim_end(), Some(&title[k + MARK.len()..])),
        None => (title, None),
    };
    if let Some(rest) = earlier {
        let same_group = rest.split_whitespace().next() == Some(group);
        if same_group && shift < 5e-6 {
            return title.to_string();
        }
    }
    let line = format!("{MARK}{group} (largest shift {shift:.5} A)");
    if original.is_empty() {
        line
    } else {
        format!("{original} {line}")
    }
}

#[cfg(test)]
mod tests {
    use super::symmetrized_title;

    #[test]
    fn the_comment_does_not_grow() {
        let once = symmetrized_title("water", "C2v", 0.0123);
        assert_eq!(once, "water symmetrized to C2v (largest shift 0.01230 A)");
        assert_eq!(symmetrized_title(&once, "C2v", 0.0), once);
        assert_eq!(
            symmetrized_title(&once, "C2v", 0.002),
            "water symmetrized to C2v (largest shift 0.00200 A)"
        );
        assert_eq!(
            symmetrized_title(&once, "D2h", 0.0),
            "water symmetrized to D2h (largest shift 0.00000 A)"
        );
        assert_eq!(
            symmetrized_title("", "Td", 0.1),
            "symmetrized to Td (largest shift 0.10000 A)"
        );
    }
}
