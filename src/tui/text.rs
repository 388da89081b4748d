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

/// Cut to at most `w` columns, marking the cut with `…` (never `~`, which reads as
/// "approximately"); in ASCII mode the screen's last pass spells it `...`.
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
    out.push('…');
    out
}

/// Greedy word wrap to `w` columns.
pub fn wrap(s: &str, w: usize) -> Vec<String> {
    let w = w.max(8);
    let mut out = Vec::new();
    for para in s.split('\n') {
        if width(para) <= w {
            // Fits: kept as written (aligned columns stay aligned).
            out.push(para.trim_end().to_string());
            continue;
        }
        // A paragraph's leading spaces indent all its lines; continuation lines of an indented
        // paragraph hang two further spaces in, so a wrapped entry stays visibly one entry.
        let lead: String = para.chars().take_while(|c| *c == ' ').collect();
        let lead = if width(&lead) + 12 > w {
            String::new()
        } else {
            lead
        };
        let hang = if lead.is_empty() {
            String::new()
        } else {
            format!("{lead}  ")
        };
        let mut line = lead.clone();
        let mut empty = true;
        for word in para.split_whitespace() {
            if !empty && width(&line) + 1 + width(word) > w {
                out.push(std::mem::replace(&mut line, hang.clone()));
                empty = true;
            }
            if !empty {
                line.push(' ');
            }
            line.push_str(word);
            empty = false;
        }
        out.push(if empty {
            line.trim_end().to_string()
        } else {
            line
        });
    }
    out
}

/// Spell our own wording and the tables' prose in ASCII (ASCII mode); anything left that is
/// not ASCII becomes `?`, so a limited terminal never sees a byte it cannot show.
pub fn ascii_fold(s: &str) -> String {
    let mut o = String::with_capacity(s.len());
    for c in s.chars() {
        match c {
            c if c.is_ascii() => o.push(c),
            '—' | '–' | '−' | '⁻' => o.push('-'),
            '…' => o.push_str("..."),
            'χ' => o.push_str("chi"),
            'Γ' => o.push_str("Gamma"),
            '·' => o.push('*'),
            '×' => o.push('x'),
            '°' => o.push_str(" deg"),
            'θ' => o.push_str("theta"),
            'φ' => o.push_str("phi"),
            'σ' => o.push('s'),
            'π' => o.push_str("pi"),
            'ν' => o.push_str("nu"),
            'Σ' => o.push_str("Sum"),
            'Å' => o.push('A'),
            '→' => o.push_str("->"),
            '←' => o.push_str("<-"),
            '↑' => o.push_str("Up"),
            '↓' => o.push_str("Down"),
            '≥' => o.push_str(">="),
            '≤' => o.push_str("<="),
            '√' => o.push_str("sqrt"),
            '∞' => o.push_str("inf"),
            '′' => o.push('\''),
            '″' => o.push_str("''"),
            '▸' => o.push('>'),
            'ᵥ' => o.push('v'),
            'ₕ' => o.push('h'),
            '₀'..='₉' => o.push(char::from(b'0' + (c as u32 - '₀' as u32) as u8)),
            '¹' => o.push('1'),
            '²' => o.push_str("^2"),
            '³' => o.push_str("^3"),
            _ => o.push('?'),
        }
    }
    o
}

/// Markdown pipe tables as aligned plain columns (header, then rows; the `|---|` rule becomes a
/// line of dashes), everything else unchanged: the reports' tables, readable in a panel.
pub fn align_md_tables(md: &str) -> String {
    let mut out = String::new();
    let lines: Vec<&str> = md.lines().collect();
    let mut k = 0;
    while k < lines.len() {
        if !lines[k].trim_start().starts_with('|') {
            out.push_str(lines[k]);
            out.push('\n');
            k += 1;
            continue;
        }
        let start = k;
        while k < lines.len() && lines[k].trim_start().starts_with('|') {
            k += 1;
        }
        let rows: Vec<Option<Vec<String>>> = lines[start..k]
            .iter()
            .map(|l| {
                let t = l.trim().trim_start_matches('|').trim_end_matches('|');
                if t.chars().all(|c| matches!(c, '-' | '|' | ':' | ' ')) {
                    None
                } else {
                    Some(t.split('|').map(|c| c.trim().to_string()).collect())
                }
            })
            .collect();
        let ncol = rows.iter().flatten().map(|r| r.len()).max().unwrap_or(0);
        let mut widths = vec![0usize; ncol];
        for r in rows.iter().flatten() {
            for (i, c) in r.iter().enumerate() {
                widths[i] = widths[i].max(width(c));
            }
        }
        let total: usize = widths.iter().sum::<usize>() + 2 * ncol.saturating_sub(1);
        for r in &rows {
            match r {
                None => out.push_str(&"-".repeat(total)),
                Some(cells) => {
                    let mut line = String::new();
                    for (i, c) in cells.iter().enumerate() {
                        if i + 1 < cells.len() {
                            line.push_str(&pad(c, widths[i] + 2));
                        } else {
                            line.push_str(c);
                        }
                    }
                    out.push_str(line.trim_end());
                }
            }
            out.push('\n');
        }
    }
    out
}
