//! XYZ files: a reader (single- and multi-frame, frame selection, a size cap checked
//! before allocating) and a writer. Every malformed input gives an [`XyzError`] with a
//! 1-based line and column; no input bytes make the reader panic.
//!
//! Format accepted per frame: a line holding the atom count, a comment line (the title),
//! then one line per atom `El x y z [ignored columns…]`. `El` is a symbol (any case), an
//! atomic number, or a symbol followed by a non-letter suffix such as `C12` (kept as the
//! atom's label). Fortran `D` exponents (`1.0D-3`) are accepted. Blank lines between
//! frames and at the end of the file are ignored.

use nalgebra::Vector3;
use thiserror::Error;

use super::elements;
use super::molecule::{Atom, Molecule};

/// Default cap on the atom count of one frame.
pub const DEFAULT_MAX_ATOMS: usize = 100_000;

/// Which frame of a multi-frame file to return.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum FrameSelect {
    /// The first frame.
    First,
    /// The last frame (the default: the end of an optimisation trajectory).
    #[default]
    Last,
    /// The frame with this 0-based index.
    Index(usize),
}

/// Reader options.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct XyzOptions {
    /// Frame to return.
    pub frame: FrameSelect,
    /// Largest accepted atom count per frame; larger counts are refused before any
    /// allocation.
    pub max_atoms: usize,
}

impl Default for XyzOptions {
    fn default() -> Self {
        XyzOptions {
            frame: FrameSelect::Last,
            max_atoms: DEFAULT_MAX_ATOMS,
        }
    }
}

/// A parse error at a 1-based line and column (columns count Unicode characters).
#[derive(Debug, Clone, PartialEq, Eq, Error)]
#[error("line {line}, column {column}: {kind}")]
pub struct XyzError {
    /// 1-based line number.
    pub line: usize,
    /// 1-based column (character) number.
    pub column: usize,
    /// What went wrong.
    pub kind: XyzErrorKind,
}

impl XyzError {
    /// The message without the position.
    pub fn message(&self) -> String {
        self.kind.to_string()
    }
}

/// The kinds of XYZ errors.
#[derive(Debug, Clone, PartialEq, Eq, Error)]
pub enum XyzErrorKind {
    /// Bytes that are not UTF-8.
    #[error("the file is not valid UTF-8")]
    NotUtf8,
    /// Nothing but blank lines.
    #[error("the file holds no frames")]
    NoFrames,
    /// The count line is not a single non-negative integer.
    #[error("expected an atom count (one non-negative integer), found {found:?}")]
    BadCount {
        /// The line's text.
        found: String,
    },
    /// The count exceeds the configured cap.
    #[error("atom count {count} exceeds the limit of {limit} atoms")]
    TooManyAtoms {
        /// The count as written.
        count: String,
        /// The cap.
        limit: usize,
    },
    /// An atom line lacks a field.
    #[error("atom line is missing its {what}")]
    MissingField {
        /// `"x coordinate"`, …
        what: &'static str,
    },
    /// The element field is not a known element.
    #[error("unknown element {0:?}")]
    UnknownElement(String),
    /// A coordinate is not a number.
    #[error("{axis} coordinate {text:?} is not a number")]
    BadNumber {
        /// `'x'`, `'y'` or `'z'`.
        axis: char,
        /// The token.
        text: String,
    },
    /// A coordinate is NaN or infinite.
    #[error("{axis} coordinate {text:?} is not finite")]
    NonFinite {
        /// `'x'`, `'y'` or `'z'`.
        axis: char,
        /// The token.
        text: String,
    },
    /// The file ends inside a frame.
    #[error("file ends after {found} of {count} atoms of frame {frame}")]
    Truncated {
        /// 1-based frame number.
        frame: usize,
        /// Atom lines found.
        found: usize,
        /// Atom count promised.
        count: usize,
    },
    /// The file ends before a frame's comment line.
    #[error("file ends before the comment line of frame {frame}")]
    MissingComment {
        /// 1-based frame number.
        frame: usize,
    },
    /// The atom lines do not match the count line.
    #[error("count mismatch in frame {frame}: the count line says {count} atoms, {detail}")]
    CountMismatch {
        /// 1-based frame number.
        frame: usize,
        /// Atom count promised.
        count: usize,
        /// What was found instead.
        detail: String,
    },
    /// The requested frame does not exist.
    #[error("frame {requested} requested (0-based) but the file has {available} frame(s)")]
    NoSuchFrame {
        /// Requested 0-based index.
        requested: usize,
        /// Number of frames present.
        available: usize,
    },
}

fn err(line: usize, column: usize, kind: XyzErrorKind) -> XyzError {
    XyzError { line, column, kind }
}

/// Whitespace-separated tokens with their 1-based character columns.
fn tokens(line: &str) -> Vec<(usize, &str)> {
    let mut out = Vec::new();
    let mut start: Option<(usize, usize)> = None; // (byte, column)
    let mut col = 0;
    for (b, ch) in line.char_indices() {
        col += 1;
        if ch.is_whitespace() {
            if let Some((sb, sc)) = start.take() {
                out.push((sc, &line[sb..b]));
            }
        } else if start.is_none() {
            start = Some((b, col));
        }
    }
    if let Some((sb, sc)) = start {
        out.push((sc, &line[sb..]));
    }
    out
}

fn char_len(s: &str) -> usize {
    s.chars().count()
}

/// Element from a token: symbol, number, or symbol + non-letter suffix (label).
fn parse_element(tok: &str) -> Option<(u8, Option<String>)> {
    if let Some(z) = elements::atomic_number(tok) {
        return Some((z, None));
    }
    let letters = tok.chars().take_while(|c| c.is_ascii_alphabetic()).count();
    if (1..=3).contains(&letters) && letters < tok.len() {
        // `letters` counts ASCII chars, so it is a valid byte index.
        let z = elements::atomic_number(&tok[..letters])?;
        return Some((z, Some(tok.to_string())));
    }
    None
}

fn parse_coord(tok: &str, axis: char) -> Result<f64, XyzErrorKind> {
    let parsed = tok.parse::<f64>().or_else(|_| {
        if tok.contains(['d', 'D']) {
            tok.replace(['d', 'D'], "e").parse::<f64>()
        } else {
            tok.parse::<f64>()
        }
    });
    match parsed {
        Ok(v) if v.is_finite() => Ok(v),
        Ok(_) => Err(XyzErrorKind::NonFinite {
            axis,
            text: tok.to_string(),
        }),
        Err(_) => Err(XyzErrorKind::BadNumber {
            axis,
            text: tok.to_string(),
        }),
    }
}

/// Does this line look like an atom line (element then three numbers)?
fn looks_like_atom_line(line: &str) -> bool {
    let t = tokens(line);
    t.len() >= 4
        && parse_element(t[0].1).is_some()
        && t[1..4].iter().all(|(_, s)| parse_coord(s, 'x').is_ok())
}

fn parse_count(line_no: usize, line: &str, limit: usize) -> Result<usize, XyzError> {
    let t = tokens(line);
    let bad = |col| {
        err(
            line_no,
            col,
            XyzErrorKind::BadCount {
                found: line.trim().chars().take(60).collect(),
            },
        )
    };
    if t.len() != 1 {
        return Err(bad(t.get(1).map_or(1, |x| x.0)));
    }
    let (col, tok) = t[0];
    let digits = tok.strip_prefix('+').unwrap_or(tok);
    if digits.is_empty() || !digits.bytes().all(|b| b.is_ascii_digit()) {
        return Err(bad(col));
    }
    let too_many = || {
        err(
            line_no,
            col,
            XyzErrorKind::TooManyAtoms {
                count: tok.chars().take(40).collect(),
                limit,
            },
        )
    };
    let significant = digits.trim_start_matches('0');
    if significant.len() > 18 {
        return Err(too_many());
    }
    let n: u64 = if significant.is_empty() {
        0
    } else {
        significant.parse().map_err(|_| too_many())?
    };
    if n > limit as u64 {
        return Err(too_many());
    }
    Ok(n as usize)
}

/// Reads all frames (each must pass the cap in `opts.max_atoms`; `opts.frame` is ignored).
pub fn read_xyz_frames(bytes: &[u8], opts: &XyzOptions) -> Result<Vec<Molecule>, XyzError> {
    let mut frames = Vec::new();
    parse(bytes, opts, |_, m| {
        frames.push(m);
        true
    })?;
    Ok(frames)
}

/// Reads one frame (by default the last) of an XYZ file given as raw bytes.
pub fn read_xyz(bytes: impl AsRef<[u8]>, opts: &XyzOptions) -> Result<Molecule, XyzError> {
    let bytes = bytes.as_ref();
    let mut chosen: Option<Molecule> = None;
    let want = opts.frame;
    let total = parse(bytes, opts, |index, m| {
        let keep = match want {
            FrameSelect::First => index == 0,
            FrameSelect::Last => true,
            FrameSelect::Index(i) => i == index,
        };
        if keep {
            chosen = Some(m);
        }
        keep
    })?;
    match chosen {
        Some(m) => Ok(m),
        None => {
            let requested = match want {
                FrameSelect::Index(i) => i,
                _ => 0,
            };
            let lines = bytes.iter().filter(|b| **b == b'\n').count() + 1;
            Err(err(
                lines,
                1,
                XyzErrorKind::NoSuchFrame {
                    requested,
                    available: total,
                },
            ))
        }
    }
}

/// Parses every frame, validating all of them; `sink(index, molecule)` receives each frame
/// (it returns whether the molecule was wanted; unwanted frames are still validated).
/// Returns the number of frames.
fn parse(
    bytes: &[u8],
    opts: &XyzOptions,
    mut sink: impl FnMut(usize, Molecule) -> bool,
) -> Result<usize, XyzError> {
    let text = match std::str::from_utf8(bytes) {
        Ok(t) => t,
        Err(e) => {
            let valid = &bytes[..e.valid_up_to()];
            // The prefix is valid UTF-8 by construction.
            let prefix = std::str::from_utf8(valid).unwrap_or("");
            let line = prefix.matches('\n').count() + 1;
            let last = prefix.rsplit('\n').next().unwrap_or("");
            return Err(err(line, char_len(last) + 1, XyzErrorKind::NotUtf8));
        }
    };
    let lines: Vec<&str> = text
        .split('\n')
        .map(|l| l.strip_suffix('\r').unwrap_or(l))
        .collect();
    let blank = |l: &str| l.trim().is_empty();
    // Index of the last non-blank line + 1.
    let content_end = lines.iter().rposition(|l| !blank(l)).map_or(0, |i| i + 1);

    let mut i = 0;
    let mut frame = 0usize; // frames read so far
    let mut prev_count = 0usize;
    loop {
        while i < content_end && blank(lines[i]) {
            i += 1;
        }
        if i >= content_end {
            break;
        }
        let count_line = i + 1; // 1-based
        if frame > 0 && looks_like_atom_line(lines[i]) {
            return Err(err(
                count_line,
                1,
                XyzErrorKind::CountMismatch {
                    frame,
                    count: prev_count,
                    detail: "but more atom lines follow".into(),
                },
            ));
        }
        let count = parse_count(count_line, lines[i], opts.max_atoms)?;
        let fno = frame + 1;
        if i + 1 >= lines.len() {
            return Err(err(
                count_line + 1,
                1,
                XyzErrorKind::MissingComment { frame: fno },
            ));
        }
        let title = lines[i + 1].trim().to_string();
        let mut atoms = Vec::with_capacity(count);
        for k in 0..count {
            let idx = i + 2 + k;
            let line_no = idx + 1;
            if idx >= content_end {
                return Err(err(
                    line_no.min(lines.len() + 1),
                    1,
                    XyzErrorKind::Truncated {
                        frame: fno,
                        found: k,
                        count,
                    },
                ));
            }
            let line = lines[idx];
            let t = tokens(line);
            let mismatch = |detail: String| {
                err(
                    line_no,
                    1,
                    XyzErrorKind::CountMismatch {
                        frame: fno,
                        count,
                        detail,
                    },
                )
            };
            if t.is_empty() {
                return Err(mismatch(format!(
                    "but line {line_no} is blank (after {k} atoms)"
                )));
            }
            if t.len() == 1 && t[0].1.bytes().all(|b| b.is_ascii_digit()) {
                return Err(mismatch(format!(
                    "but a new count line follows after only {k} atoms"
                )));
            }
            let end_col = char_len(line) + 1;
            let (ecol, etok) = t[0];
            let (element, label) = parse_element(etok).ok_or_else(|| {
                err(
                    line_no,
                    ecol,
                    XyzErrorKind::UnknownElement(etok.chars().take(40).collect()),
                )
            })?;
            let mut xyz = [0.0f64; 3];
            for (a, axis) in ['x', 'y', 'z'].into_iter().enumerate() {
                let Some(&(col, tok)) = t.get(a + 1) else {
                    let what = ["x coordinate", "y coordinate", "z coordinate"][a];
                    return Err(err(line_no, end_col, XyzErrorKind::MissingField { what }));
                };
                xyz[a] = parse_coord(tok, axis).map_err(|k| err(line_no, col, k))?;
            }
            atoms.push(Atom {
                element,
                position: Vector3::new(xyz[0], xyz[1], xyz[2]),
                label,
            });
        }
        sink(frame, Molecule::new(title, atoms));
        prev_count = count;
        frame += 1;
        i += 2 + count;
    }
    if frame == 0 {
        return Err(err(1, 1, XyzErrorKind::NoFrames));
    }
    Ok(frame)
}

/// Writes a molecule as one XYZ frame (symbols, coordinates with 10 decimals). Line
/// breaks in the title are replaced by spaces.
pub fn write_xyz(mol: &Molecule) -> String {
    use std::fmt::Write;
    let mut s = String::with_capacity(64 * (mol.atoms.len() + 2));
    let title: String = mol
        .title
        .chars()
        .map(|c| if c == '\n' || c == '\r' { ' ' } else { c })
        .collect();
    let _ = writeln!(s, "{}", mol.atoms.len());
    let _ = writeln!(s, "{title}");
    for a in &mol.atoms {
        let p = a.position;
        let _ = writeln!(
            s,
            "{:<3} {:>17} {:>17} {:>17}",
            a.symbol(),
            coordinate(p.x),
            coordinate(p.y),
            coordinate(p.z)
        );
    }
    s
}

/// A coordinate with 10 decimals; a value that prints as zero is written without a sign
/// (no `-0.0000000000`, whether from negative zero or a tiny negative value).
fn coordinate(x: f64) -> String {
    let t = format!("{x:.10}");
    match t.strip_prefix('-') {
        Some(rest) if rest.bytes().all(|b| b == b'0' || b == b'.') => rest.to_string(),
        _ => t,
    }
}
