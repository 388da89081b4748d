//! A small text grid: columns padded by display width, used by the plain-text renderings.

/// Render rows as aligned columns (first row is the header, underlined).
pub fn render(rows: &[Vec<String>], ascii: bool) -> String {
    let ncol = rows.iter().map(|r| r.len()).max().unwrap_or(0);
    let width = |s: &str| s.chars().count();
    let mut w = vec![0usize; ncol];
    for r in rows {
        for (k, c) in r.iter().enumerate() {
            w[k] = w[k].max(width(c));
        }
    }
    let mut out = String::new();
    for (i, r) in rows.iter().enumerate() {
        let mut line = String::new();
        for (k, c) in r.iter().enumerate() {
            if k > 0 {
                line.push_str("  ");
            }
            line.push_str(c);
            if k + 1 < r.len() {
                line.push_str(&" ".repeat(w[k] - width(c)));
            }
        }
        out.push_str(line.trim_end());
        out.push('\n');
        if i == 0 && rows.len() > 1 {
            let total: usize = w.iter().sum::<usize>() + 2 * ncol.saturating_sub(1);
            out.push_str(&(if ascii { "-" } else { "─" }).repeat(total));
            out.push('\n');
        }
    }
    out
}

/// Render rows as a Markdown table: header, separator row, one row per line; a `|` inside a
/// cell is escaped and an empty header cell stays a cell.
pub fn markdown(rows: &[Vec<String>]) -> String {
    let ncol = rows.iter().map(|r| r.len()).max().unwrap_or(0);
    let row = |r: &[String]| {
        let mut cells: Vec<String> = r
            .iter()
            .map(|c| c.replace('|', "\\|").replace('\n', " "))
            .collect();
        cells.resize(ncol, String::new());
        format!("| {} |\n", cells.join(" | "))
            .replace("|  |", "| |")
            .replace("|  |", "| |")
    };
    let mut out = String::new();
    if let Some(h) = rows.first() {
        out.push_str(&row(h));
        out.push_str(&format!("|{}\n", "---|".repeat(ncol)));
        for r in &rows[1..] {
            out.push_str(&row(r));
        }
    }
    out
}
