//! Reports: plain text, Markdown, LaTeX and JSON renderings of what the core computed.
//!
//! Owns presentation only; never computes chemistry (that is `rep`, `group`, …).

pub mod grid;
pub mod reduction;
pub mod session;
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
