//! Character-table files (`tables/*.toml`): the schema, and parsing into exact form.
//!
//! A table names its classes in the customary order, gives one representative operation per
//! class geometrically, and lists the irreps with exact characters and function columns. The
//! file format is salcdesk's own; DEVELOPERS.md documents it field by field.

use super::functions::{parse_tuple, FunctionTuple};
use crate::exact::{parse, parse_with_phi, Cyclo};
use num_bigint::BigInt;
use num_rational::BigRational;
use serde::Deserialize;
use toml::Spanned;

/// Error in a table file, with its location.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("{file}:{line}:{column}: {message}")]
pub struct TableError {
    pub file: String,
    pub line: usize,
    pub column: usize,
    pub message: String,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct TableFile {
    format: u32,
    name: String,
    symbol: String,
    family: String,
    #[serde(default)]
    order: Option<usize>,
    orientation: String,
    #[serde(default)]
    descent: Option<String>,
    #[serde(rename = "class")]
    classes: Vec<ClassFile>,
    #[serde(rename = "irrep")]
    irreps: Vec<IrrepFile>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct ClassFile {
    symbol: String,
    ascii: String,
    #[serde(default)]
    size: usize,
    op: Spanned<OpFile>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct OpFile {
    kind: String,
    #[serde(default)]
    axis: Option<Vec<String>>,
    #[serde(default)]
    normal: Option<Vec<String>>,
    #[serde(default)]
    turn: Option<String>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct IrrepFile {
    label: String,
    chars: Vec<Spanned<String>>,
    #[serde(default)]
    linear: Vec<Spanned<String>>,
    #[serde(default)]
    rotation: Vec<Spanned<String>>,
    #[serde(default)]
    quadratic: Vec<Spanned<String>>,
    #[serde(default)]
    cubic: Vec<Spanned<String>>,
    #[serde(default)]
    pair: Option<String>,
}

/// The family of a point group.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize)]
pub enum Family {
    Nonaxial,
    Cn,
    Cnv,
    Cnh,
    Dn,
    Dnh,
    Dnd,
    S2n,
    Cubic,
    Icosahedral,
    Linear,
}

impl Family {
    fn parse(s: &str) -> Option<Family> {
        Some(match s {
            "nonaxial" => Family::Nonaxial,
            "Cn" => Family::Cn,
            "Cnv" => Family::Cnv,
            "Cnh" => Family::Cnh,
            "Dn" => Family::Dn,
            "Dnh" => Family::Dnh,
            "Dnd" => Family::Dnd,
            "S2n" => Family::S2n,
            "cubic" => Family::Cubic,
            "icosahedral" => Family::Icosahedral,
            "linear" => Family::Linear,
            _ => return None,
        })
    }
    /// Name as written in the tables and on the command line.
    pub fn name(self) -> &'static str {
        match self {
            Family::Nonaxial => "nonaxial",
            Family::Cn => "Cn",
            Family::Cnv => "Cnv",
            Family::Cnh => "Cnh",
            Family::Dn => "Dn",
            Family::Dnh => "Dnh",
            Family::Dnd => "Dnd",
            Family::S2n => "S2n",
            Family::Cubic => "cubic",
            Family::Icosahedral => "icosahedral",
            Family::Linear => "linear",
        }
    }
}

/// A fraction of a full turn, or the free angle φ of the linear groups.
#[derive(Debug, Clone, PartialEq)]
pub enum Turn {
    Fixed(BigRational),
    Phi,
}

/// A representative operation as the table gives it.
#[derive(Debug, Clone, PartialEq)]
pub enum OpSpec {
    Identity,
    Inversion,
    Reflection { normal: [Cyclo; 3] },
    Rotation { axis: [Cyclo; 3], turn: Turn },
    Improper { axis: [Cyclo; 3], turn: Turn },
}

/// One class column.
#[derive(Debug, Clone)]
pub struct ClassInfo {
    /// Unicode symbol, e.g. `2C₃`, `3σᵥ`.
    pub symbol: String,
    /// ASCII symbol, e.g. `2C3`, `3sv`.
    pub ascii: String,
    /// Number of operations (0 for the infinite classes of the linear groups).
    pub size: usize,
    pub op: OpSpec,
}

/// The function columns of one irrep.
#[derive(Debug, Clone, Default)]
pub struct Functions {
    pub linear: Vec<FunctionTuple>,
    pub rotation: Vec<FunctionTuple>,
    pub quadratic: Vec<FunctionTuple>,
    pub cubic: Vec<FunctionTuple>,
}

impl Functions {
    /// All tuples, linear first.
    pub fn all(&self) -> impl Iterator<Item = &FunctionTuple> {
        self.linear
            .iter()
            .chain(&self.rotation)
            .chain(&self.quadratic)
            .chain(&self.cubic)
    }
}

/// One irreducible representation (row).
#[derive(Debug, Clone)]
pub struct Irrep {
    /// ASCII Mulliken label as in the file: `A1`, `B2g`, `E'`, `1E`, `Sigma+g`.
    pub label: String,
    /// Exact characters in class order (finite groups; empty for the linear groups).
    pub chars: Vec<Cyclo>,
    /// Characters as written in the file.
    pub char_text: Vec<String>,
    pub functions: Functions,
    /// Index of the complex-conjugate partner row, for separably degenerate pairs.
    pub pair: Option<usize>,
}

impl Irrep {
    /// Dimension (character of E). For linear groups, read from the text.
    pub fn dim(&self) -> usize {
        if let Some(c) = self.chars.first() {
            return c.to_i64().unwrap_or(1) as usize;
        }
        self.char_text
            .first()
            .and_then(|t| t.trim().parse().ok())
            .unwrap_or(1)
    }
    /// Unicode form of the label: `A₁`, `B₂g`, `E′`, `¹E`, `Σg⁺`.
    pub fn display(&self) -> String {
        display_label(&self.label)
    }
}

/// Unicode form of an ASCII Mulliken label.
pub fn display_label(label: &str) -> String {
    let mut s = label.to_string();
    for (a, u) in [
        ("Sigma", "Σ"),
        ("Pi", "Π"),
        ("Delta", "Δ"),
        ("Phi", "Φ"),
        ("Gamma", "Γ"),
    ] {
        s = s.replace(a, u);
    }
    let mut out = String::new();
    let mut sign = None;
    let chars: Vec<char> = s.chars().collect();
    for (i, c) in chars.iter().enumerate() {
        match c {
            '0'..='9' if i == 0 => out.push(superscript(*c)),
            '0'..='9' => out.push(subscript(*c)),
            '\'' if chars.get(i + 1) == Some(&'\'') => {}
            '\'' if i > 0 && chars[i - 1] == '\'' => out.push('″'),
            '\'' => out.push('′'),
            '+' => sign = Some('⁺'),
            '-' => sign = Some('⁻'),
            c => out.push(*c),
        }
    }
    if let Some(sg) = sign {
        out.push(sg);
    }
    out
}

fn subscript(c: char) -> char {
    char::from_u32('₀' as u32 + c.to_digit(10).unwrap_or(0)).unwrap_or(c)
}

fn superscript(c: char) -> char {
    match c {
        '1' => '¹',
        '2' => '²',
        '3' => '³',
        d => char::from_u32('⁰' as u32 + d.to_digit(10).unwrap_or(0)).unwrap_or(d),
    }
}

/// A parsed character table.
#[derive(Debug, Clone)]
pub struct CharacterTable {
    pub name: String,
    pub symbol: String,
    pub family: Family,
    /// Group order (None for the linear groups).
    pub order: Option<usize>,
    pub orientation: String,
    /// For the linear groups: the finite subgroup used for reduction (`C2v` or `D2h`).
    pub descent: Option<String>,
    pub classes: Vec<ClassInfo>,
    pub irreps: Vec<Irrep>,
}

impl CharacterTable {
    pub fn is_linear(&self) -> bool {
        self.family == Family::Linear
    }
    /// Index of an irrep by ASCII or Unicode label.
    pub fn irrep_index(&self, label: &str) -> Option<usize> {
        let l = label.trim();
        self.irreps
            .iter()
            .position(|ir| ir.label == l || ir.display() == l)
            .or_else(|| {
                self.irreps
                    .iter()
                    .position(|ir| ir.label.eq_ignore_ascii_case(l))
            })
    }
    /// Characters of the linear groups evaluated at φ = 2π·turn.
    pub fn chars_at(&self, irrep: usize, phi_turn: &BigRational) -> Result<Vec<Cyclo>, String> {
        self.irreps[irrep]
            .char_text
            .iter()
            .map(|t| parse_with_phi(t, Some(phi_turn)).map_err(|e| e.to_string()))
            .collect()
    }
}

fn line_col(text: &str, offset: usize) -> (usize, usize) {
    let before = &text[..offset.min(text.len())];
    let line = before.matches('\n').count() + 1;
    let col = before
        .rsplit('\n')
        .next()
        .map(|s| s.chars().count())
        .unwrap_or(0)
        + 1;
    (line, col)
}

/// Parse a table file's text.
pub fn parse_table(file: &str, text: &str) -> Result<CharacterTable, TableError> {
    let err_at = |offset: usize, message: String| {
        let (line, column) = line_col(text, offset);
        TableError {
            file: file.to_string(),
            line,
            column,
            message,
        }
    };
    let raw: TableFile = toml::from_str(text).map_err(|e| {
        let off = e.span().map(|s| s.start).unwrap_or(0);
        err_at(off, e.message().to_string())
    })?;
    if raw.format != 1 {
        return Err(err_at(
            0,
            format!(
                "table format {} is newer than this salcdesk understands (1)",
                raw.format
            ),
        ));
    }
    let family = Family::parse(&raw.family)
        .ok_or_else(|| err_at(0, format!("unknown family '{}'", raw.family)))?;
    let linear = family == Family::Linear;
    let mut classes = Vec::new();
    for c in &raw.classes {
        let off = c.op.span().start;
        let op = parse_op(c.op.get_ref(), linear).map_err(|m| err_at(off, m))?;
        classes.push(ClassInfo {
            symbol: c.symbol.clone(),
            ascii: c.ascii.clone(),
            size: c.size,
            op,
        });
    }
    let mut irreps = Vec::new();
    for ir in &raw.irreps {
        if ir.chars.len() != classes.len() {
            let off = ir.chars.first().map(|c| c.span().start).unwrap_or(0);
            return Err(err_at(
                off,
                format!(
                    "irrep {} has {} characters but the table has {} classes",
                    ir.label,
                    ir.chars.len(),
                    classes.len()
                ),
            ));
        }
        let mut chars = Vec::new();
        if !linear {
            for c in &ir.chars {
                let v = parse(c.get_ref()).map_err(|e| {
                    err_at(
                        c.span().start + e.column,
                        format!("character of {}: {}", ir.label, e.message),
                    )
                })?;
                chars.push(v);
            }
        } else {
            // Check that characters parse for a sample angle.
            let probe = BigRational::new(BigInt::from(1), BigInt::from(7));
            for c in &ir.chars {
                parse_with_phi(c.get_ref(), Some(&probe)).map_err(|e| {
                    err_at(
                        c.span().start + e.column,
                        format!("character of {}: {}", ir.label, e.message),
                    )
                })?;
            }
        }
        let tuples = |list: &[Spanned<String>]| -> Result<Vec<FunctionTuple>, TableError> {
            list.iter()
                .map(|s| {
                    parse_tuple(s.get_ref())
                        .map_err(|m| err_at(s.span().start, format!("{}: {m}", ir.label)))
                })
                .collect()
        };
        irreps.push(Irrep {
            label: ir.label.clone(),
            chars,
            char_text: ir.chars.iter().map(|c| c.get_ref().clone()).collect(),
            functions: Functions {
                linear: tuples(&ir.linear)?,
                rotation: tuples(&ir.rotation)?,
                quadratic: tuples(&ir.quadratic)?,
                cubic: tuples(&ir.cubic)?,
            },
            pair: None,
        });
    }
    for (k, ir) in raw.irreps.iter().enumerate() {
        if let Some(p) = &ir.pair {
            let idx = irreps
                .iter()
                .position(|x| &x.label == p)
                .ok_or_else(|| err_at(0, format!("{}: pair partner {p} not found", ir.label)))?;
            irreps[k].pair = Some(idx);
        }
    }
    Ok(CharacterTable {
        name: raw.name,
        symbol: raw.symbol,
        family,
        order: raw.order.filter(|o| *o > 0),
        orientation: raw.orientation,
        descent: raw.descent,
        classes,
        irreps,
    })
}

fn vec3(v: &Option<Vec<String>>, what: &str) -> Result<[Cyclo; 3], String> {
    let v = v
        .as_ref()
        .ok_or_else(|| format!("operation needs an {what}"))?;
    if v.len() != 3 {
        return Err(format!("{what} needs 3 components, found {}", v.len()));
    }
    let mut out: [Cyclo; 3] = Default::default();
    for (k, s) in v.iter().enumerate() {
        out[k] = parse(s).map_err(|e| format!("{what} component {}: {e}", k + 1))?;
    }
    Ok(out)
}

fn parse_turn(t: &Option<String>, linear: bool) -> Result<Turn, String> {
    let t = t.as_ref().ok_or("rotation needs a turn")?;
    if t.trim() == "phi" {
        if !linear {
            return Err("turn = \"phi\" is only allowed in the linear groups".into());
        }
        return Ok(Turn::Phi);
    }
    let v = parse(t).map_err(|e| format!("turn: {e}"))?;
    let q = v
        .to_rational()
        .ok_or("turn must be a rational fraction of a full turn")?;
    Ok(Turn::Fixed(q))
}

fn parse_op(op: &OpFile, linear: bool) -> Result<OpSpec, String> {
    Ok(match op.kind.as_str() {
        "identity" => OpSpec::Identity,
        "inversion" => OpSpec::Inversion,
        "reflection" => OpSpec::Reflection {
            normal: vec3(&op.normal, "normal")?,
        },
        "rotation" => OpSpec::Rotation {
            axis: vec3(&op.axis, "axis")?,
            turn: parse_turn(&op.turn, linear)?,
        },
        "improper" => OpSpec::Improper {
            axis: vec3(&op.axis, "axis")?,
            turn: parse_turn(&op.turn, linear)?,
        },
        k => {
            return Err(format!(
                "unknown operation kind '{k}' (identity, inversion, reflection, rotation, improper)"
            ))
        }
    })
}
