//! Reports: plain text, Markdown, LaTeX and JSON renderings of what the core computed.
//!
//! Owns presentation only; never computes chemistry (that is `rep`, `group`, …).

pub mod grid;
pub mod latex;
pub mod molecule;
pub mod reduction;
pub mod session;
pub mod spectra;
pub mod survey;
pub mod table;
pub mod vibrations;

/// Output format of a rendering.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Format {
    #[default]
    Text,
    Markdown,
    Latex,
    Json,
}

impl Format {
    pub fn parse(s: &str) -> Option<Self> {
        Some(match s.to_ascii_lowercase().as_str() {
            "text" | "txt" | "plain" => Format::Text,
            "md" | "markdown" => Format::Markdown,
            "latex" | "tex" => Format::Latex,
            "json" => Format::Json,
            _ => return None,
        })
    }

    /// The usual file extension of the format.
    pub fn extension(self) -> &'static str {
        match self {
            Format::Text => "txt",
            Format::Markdown => "md",
            Format::Latex => "tex",
            Format::Json => "json",
        }
    }
}

/// The file extensions a report can be written to, and what each writes.
pub const EXPORT_EXTENSIONS: &str = ".md (Markdown), .tex or .latex (LaTeX), .json, .txt or .text";

/// Why an export target was refused: its extension names no format salcdesk writes.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("cannot tell what to write to {path}: {what} (salcdesk writes {EXPORT_EXTENSIONS})")]
pub struct UnknownExtension {
    pub path: String,
    pub what: String,
}

/// The format of an export: the one asked for (`--format`) wins; otherwise the file's
/// extension decides (`.md`, `.tex`/`.latex`, `.json`, `.txt`/`.text`, any case); standard
/// output (no file) gets Markdown. Anything else — `.pdf`, `.docx`, no extension — is refused
/// rather than filled with text of another kind.
pub fn export_format(
    explicit: Option<Format>,
    path: Option<&std::path::Path>,
) -> Result<Format, UnknownExtension> {
    if let Some(f) = explicit {
        return Ok(f);
    }
    let Some(path) = path else {
        return Ok(Format::Markdown);
    };
    let ext = path.extension().and_then(|e| e.to_str());
    let found = ext.and_then(|e| match e.to_ascii_lowercase().as_str() {
        "md" | "markdown" => Some(Format::Markdown),
        "tex" | "latex" => Some(Format::Latex),
        "json" => Some(Format::Json),
        "txt" | "text" => Some(Format::Text),
        _ => None,
    });
    found.ok_or_else(|| UnknownExtension {
        path: path.display().to_string(),
        what: match path.extension() {
            Some(e) => format!("'.{}' is not a report format", e.to_string_lossy()),
            None => "the name has no extension".into(),
        },
    })
}

/// Transliterate prose (orientation notes, messages) for ASCII-only terminals.
pub fn ascii_prose(s: &str) -> String {
    let mut out = String::with_capacity(s.len());
    for c in s.chars() {
        if c.is_ascii() {
            out.push(c);
            continue;
        }
        let rep: &str = match c {
            'σ' => "sigma",
            'φ' => "phi",
            'π' => "pi",
            'Σ' => "Sigma",
            'Π' => "Pi",
            'Δ' => "Delta",
            'Φ' => "Phi",
            'Γ' => "Gamma",
            'Λ' => "Lambda",
            'χ' => "chi",
            'ε' => "eps",
            'θ' => "theta",
            'ν' => "nu",
            'ζ' => "zeta",
            '∞' => "inf",
            '′' => "'",
            '″' => "''",
            '−' | '–' | '—' => "-",
            '·' | '×' | '⊗' => "*",
            '±' => "+-",
            '√' => "sqrt",
            '≤' => "<=",
            '≥' => ">=",
            '≈' => "~",
            '⊥' | '⟂' => " perp ",
            '→' | '⟶' | '↦' => "->",
            '←' | '⟵' => "<-",
            '°' => " deg",
            'Å' => "A",
            'µ' | 'μ' => "u",
            'ᵥ' => "v",
            'ₕ' => "h",
            'ᵈ' => "d",
            '⁺' => "+",
            '⁻' => "-",
            '“' | '”' => "\"",
            '‘' | '’' => "'",
            _ => {
                if let Some(d) = subscript_digit(c) {
                    out.push(d);
                    continue;
                }
                "?"
            }
        };
        out.push_str(rep);
    }
    out
}

fn subscript_digit(c: char) -> Option<char> {
    let sub = ('₀'..='₉').position(|x| x == c);
    let sup = "⁰¹²³⁴⁵⁶⁷⁸⁹".chars().position(|x| x == c);
    sub.or(sup).and_then(|k| char::from_digit(k as u32, 10))
}
