//! Small text helpers for drawing: display width, padding, truncation, wrapping.

use ratatui::text::Span;

/// Columns a string takes on screen.
pub fn width(s: &str) -> usize {
    Span::raw(s).width()
}

/// Pad on the right to `w` columns (or cut to fit).
pub fn pad(s: &str, w: usize) -> String {
    let t = trunc(s, w);
    let n = width(&t);
    format!("{t}{}", " ".repeat(w.saturating_sub(n)))
}

/// Pad on the left to `w` columns (numbers in a column).
pub fn pad_left(s: &str, w: usize) -> String {
    let t = trunc(s, w);
    let n = width(&t);
    format!("{}{t}", " ".repeat(w.saturating_sub(n)))
}

/// Cut to at most `w` columns, marking the cut with `…` (or `~` in ASCII mode callers pass).
pub fn trunc(s: &str, w: usize) -> String {
    if width(s) <= w {
        return s.to_string();
    }
    if w == 0 {
        return String::new();
    }
    let mut out = String::new();
    for c in s.chars() {
        let next = format!("{out}{c}");
        if width(&next) + 1 > w {
            break;
        }
        out = next;
    }
    out.push('~');
    out
}

/// Greedy word wrap to `w` columns.
pub fn wrap(s: &str, w: usize) -> Vec<String> {
    let w = w.max(8);
    let mut out = Vec::new();
    for para in s.split('\n') {
        let mut line = String::new();
        for word in para.split_whitespace() {
            if !line.is_empty() && width(&line) + 1 + width(word) > w {
                out.push(std::mem::take(&mut line));
            }
            if !line.is_empty() {
                line.push(' ');
            }
            line.push_str(word);
        }
        out.push(line);
    }
    out
}

/// Replace the few non-ASCII characters of our own wording for ASCII mode.
pub fn ascii_fold(s: &str) -> String {
    s.replace(['—', '–', '−', '⁻'], "-")
        .replace('…', "...")
        .replace('χ', "chi")
        .replace('Γ', "Gamma")
        .replace('·', "*")
        .replace('¹', "1")
        .replace('θ', "theta")
        .replace('σ', "s")
        .replace('π', "pi")
        .replace('Å', "A")
        .replace('→', "->")
        .replace('↑', "Up")
        .replace('↓', "Down")
}
