//! Reports: plain text, Markdown, LaTeX and JSON renderings of what the core computed.
//!
//! Owns presentation only; never computes chemistry (that is `rep`, `group`, …).

pub mod grid;
pub mod molecule;
pub mod reduction;
pub mod session;
pub mod survey;
pub mod table;

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
