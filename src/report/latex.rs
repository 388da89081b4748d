//! LaTeX that reads like a paper: escaping of the user's text, the trade's symbols in math mode
//! (Mulliken labels A_{1g}, E'', Σ_g^+; classes 2C_3, σ_h, C_2', S_4^3; groups D_{3h}; Γ_vib,
//! ν_1; cm$^{-1}$), booktabs tables, and the translation of salcdesk's own Markdown (headings,
//! pipe tables, lists, code spans) into LaTeX, so that every part of a report is typeset, none
//! set verbatim.

use super::table::latex_label;

/// Escape text for LaTeX (text mode): the ten special characters and the non-ASCII characters
/// sessions commonly hold.
pub fn escape(s: &str) -> String {
    let mut o = String::new();
    for c in s.chars() {
        match c {
            '\\' => o.push_str("\\textbackslash{}"),
            '{' | '}' | '$' | '&' | '#' | '_' | '%' => {
                o.push('\\');
                o.push(c);
            }
            '^' => o.push_str("\\textasciicircum{}"),
            '~' => o.push_str("\\textasciitilde{}"),
            '<' => o.push_str("\\textless{}"),
            '>' => o.push_str("\\textgreater{}"),
            '|' => o.push_str("\\textbar{}"),
            '–' => o.push_str("--"),
            '—' => o.push_str("---"),
            '−' => o.push_str("$-$"),
            '′' => o.push('\''),
            '″' => o.push_str("''"),
            '“' => o.push_str("``"),
            '”' => o.push_str("''"),
            '‘' => o.push('`'),
            '’' => o.push('\''),
            '×' => o.push_str("$\\times$"),
            '·' => o.push_str("$\\cdot$"),
            '°' => o.push_str("$^\\circ$"),
            '→' => o.push_str("$\\rightarrow$"),
            '←' => o.push_str("$\\leftarrow$"),
            '≤' => o.push_str("$\\le$"),
            '≥' => o.push_str("$\\ge$"),
            '≈' => o.push_str("$\\approx$"),
            '⊥' | '⟂' => o.push_str("$\\perp$"),
            '√' => o.push_str("$\\surd$"),
            '∞' => o.push_str("$\\infty$"),
            'Å' => o.push_str("\\AA{}"),
            'µ' | 'μ' => o.push_str("$\\mu$"),
            '⁻' => o.push_str("$^{-}$"),
            '⁺' => o.push_str("$^{+}$"),
            '₀'..='₉' => o.push_str(&format!("$_{}$", c as u32 - '₀' as u32)),
            '⁰' | '¹' | '²' | '³' | '⁴'..='⁹' => {
                let d = super::ascii_prose(&c.to_string());
                o.push_str(&format!("$^{d}$"));
            }
            'σ' => o.push_str("$\\sigma$"),
            'π' => o.push_str("$\\pi$"),
            'φ' => o.push_str("$\\varphi$"),
            'χ' => o.push_str("$\\chi$"),
            'Γ' => o.push_str("$\\Gamma$"),
            'Σ' => o.push_str("$\\Sigma$"),
            'Π' => o.push_str("$\\Pi$"),
            'Δ' => o.push_str("$\\Delta$"),
            'Φ' => o.push_str("$\\Phi$"),
            'ν' => o.push_str("$\\nu$"),
            'ζ' => o.push_str("$\\zeta$"),
            'θ' => o.push_str("$\\theta$"),
            'ᵥ' => o.push_str("$_v$"),
            'ₕ' => o.push_str("$_h$"),
            'ᵈ' => o.push_str("$_d$"),
            c if c.is_ascii() => o.push(c),
            c => o.push_str(&escape_ascii(&super::ascii_prose(&c.to_string()))),
        }
    }
    o
}

fn escape_ascii(s: &str) -> String {
    if s.chars().all(|c| c.is_ascii_alphanumeric() || c == ' ') {
        s.to_string()
    } else {
        s.chars()
            .map(|c| {
                if c.is_ascii_alphanumeric() {
                    c.to_string()
                } else {
                    escape(&c.to_string())
                }
            })
            .collect()
    }
}

/// A word of prose in the ASCII spelling of the notation: subscripts, primes and signs of the
/// Unicode display turned back (`A₁′` → `A1'`, `σₕ` → `σh`).
fn normalize(word: &str) -> String {
    let mut o = String::new();
    for c in word.chars() {
        match c {
            '₀'..='₉' => o.push(char::from_digit(c as u32 - '₀' as u32, 10).unwrap_or('0')),
            '′' => o.push('\''),
            '″' => o.push_str("''"),
            'ₕ' => o.push('h'),
            'ᵥ' => o.push('v'),
            'ᵈ' => o.push('d'),
            '⁺' => o.push('+'),
            '⁻' => o.push('-'),
            '¹' => o.push('1'),
            '²' => o.push('2'),
            c => o.push(c),
        }
    }
    o
}

fn split_count(w: &str) -> (&str, &str) {
    let n = w.chars().take_while(|c| c.is_ascii_digit()).count();
    w.split_at(n)
}

/// A Mulliken label in ASCII spelling (`A1g`, `E''`, `T2u`, `Sigmag+`, `Σu+`, `Πg`), without
/// multiplicity.
fn is_label(l: &str) -> bool {
    let l = l
        .replace('Σ', "Sigma")
        .replace('Π', "Pi")
        .replace('Δ', "Delta")
        .replace('Φ', "Phi");
    for greek in ["Sigma", "Pi", "Delta", "Phi"] {
        if let Some(r) = l.strip_prefix(greek) {
            let r = r.trim_end_matches(['+', '-']);
            return r.is_empty() || r == "g" || r == "u";
        }
    }
    let mut cs = l.chars();
    let Some(first) = cs.next() else {
        return false;
    };
    if !matches!(first, 'A' | 'B' | 'E' | 'T' | 'G' | 'H') {
        return false;
    }
    let rest: String = cs.collect();
    let body = rest.trim_end_matches('\'');
    let primes = rest.len() - body.len();
    let digits = body.chars().take_while(|c| c.is_ascii_digit()).count();
    let tail = &body[digits..];
    let ok_tail = tail.is_empty() || tail == "g" || tail == "u";
    let decorated = digits > 0 || !tail.is_empty() || primes > 0;
    ok_tail && primes <= 2 && (decorated || first == 'E' || first == 'T')
}

/// A point-group name: `C2v`, `D3h`, `Td`, `Oh`, `Ih`, `Cs`, `Ci`, `S4`, `Dinfh`, `C∞v`.
fn is_group(g: &str) -> bool {
    let g = g.replace('∞', "inf");
    let mut cs = g.chars();
    match cs.next() {
        Some('T' | 'O' | 'I') => matches!(cs.as_str(), "h" | "d"),
        Some('C' | 'D' | 'S') => {
            let r = cs.as_str();
            if r == "s" || r == "i" {
                return true;
            }
            let n = r.strip_prefix("inf").map(|x| ("inf", x)).or_else(|| {
                let d = r.chars().take_while(|c| c.is_ascii_digit()).count();
                (d > 0).then(|| r.split_at(d))
            });
            matches!(n, Some((_, "" | "h" | "v" | "d")))
        }
        _ => false,
    }
}

/// A class symbol: `2C3`, `C2'`, `3C2''`, `S4^3`, `σh`, `3σv`, `6σd`.
fn class_math(w: &str) -> Option<String> {
    let (n, rest) = split_count(w);
    if let Some(r) = rest.strip_prefix('σ') {
        let body = r.trim_end_matches('\'');
        let primes = &r[body.len()..];
        if matches!(body, "h" | "v" | "d" | "") {
            let sub = if body.is_empty() {
                String::new()
            } else {
                format!("_{body}")
            };
            return Some(format!("{n}\\sigma{sub}{primes}"));
        }
        return None;
    }
    let mut cs = rest.chars();
    let op = cs.next().filter(|c| *c == 'C' || *c == 'S')?;
    let r = cs.as_str();
    let d = r.chars().take_while(|c| c.is_ascii_digit()).count();
    if d == 0 {
        return None;
    }
    let (order, tail) = r.split_at(d);
    let (power, tail) = match tail.strip_prefix('^') {
        Some(t) => {
            let k = t.chars().take_while(|c| c.is_ascii_digit()).count();
            if k == 0 {
                return None;
            }
            (format!("^{{{}}}", &t[..k]), &t[k..])
        }
        None => (String::new(), tail),
    };
    if !tail.chars().all(|c| c == '\'') || tail.len() > 2 {
        return None;
    }
    Some(format!("{n}{op}_{{{order}}}{power}{tail}"))
}

/// The LaTeX math of one word of the notation, when it is one: `2A1'` → `2\mathrm{A}_{1}'`,
/// `D3h` → `D_{3h}`, `σh` → `\sigma_h`, `Γvib` → `\Gamma_{\mathrm{vib}}`, `ν1` → `\nu_{1}`.
pub fn word_math(word: &str) -> Option<String> {
    let w = normalize(word);
    if w.is_empty() {
        return None;
    }
    if let Some(r) = w.strip_prefix('Γ') {
        return Some(if r.is_empty() {
            "\\Gamma".into()
        } else if r.chars().all(|c| c.is_ascii_alphabetic()) {
            format!("\\Gamma_{{\\mathrm{{{r}}}}}")
        } else if r.chars().all(|c| c.is_ascii_alphanumeric()) {
            format!("\\Gamma_{{{r}}}")
        } else {
            return None;
        });
    }
    let (n, rest) = split_count(&w);
    if let Some(r) = rest.strip_prefix('ν') {
        if !r.is_empty() && r.chars().all(|c| c.is_ascii_digit()) {
            return Some(format!("{n}\\nu_{{{r}}}"));
        }
    }
    if is_group(&w) {
        return Some(group_math(&w));
    }
    if let Some(c) = class_math(&w) {
        return Some(c);
    }
    // A leading number in prose is a multiplicity (2E' is two E', not a pair label).
    if is_label(rest) {
        let rest = rest
            .replace('Σ', "Sigma")
            .replace('Π', "Pi")
            .replace('Δ', "Delta")
            .replace('Φ', "Phi");
        return Some(format!("{n}{}", latex_label(&rest)));
    }
    None
}

/// LaTeX math of a point-group name: `D3h` → `D_{3h}`, `Td` → `T_{d}`, `Dinfh` → `D_{\infty h}`.
pub fn group_math(name: &str) -> String {
    let name = name.replace('∞', "inf");
    let mut cs = name.chars();
    let head = cs.next().map(|c| c.to_string()).unwrap_or_default();
    let sub = cs.as_str().replace("inf", "\\infty ");
    if sub.is_empty() {
        head
    } else {
        format!("{head}_{{{}}}", sub.trim_end())
    }
}

fn word_char(c: char) -> bool {
    c.is_alphanumeric()
        || matches!(
            c,
            '\'' | '′' | '″' | '₀'..='₉' | '⁺' | '⁻' | 'ₕ' | 'ᵥ' | 'ᵈ' | '¹' | '²' | '^' | '∞'
        )
}

/// Prose with the notation in it, as LaTeX: the words that are labels, classes, groups, Γ or ν
/// go into math mode, `cm⁻¹` becomes cm$^{-1}$, everything else is escaped.
pub fn inline(s: &str) -> String {
    let chars: Vec<char> = s.chars().collect();
    let mut o = String::new();
    let mut i = 0;
    while i < chars.len() {
        if word_char(chars[i]) {
            let mut j = i;
            while j < chars.len() && word_char(chars[j]) {
                j += 1;
            }
            // A sign right after a Σ/Π label belongs to it (Σg+).
            if j < chars.len() && matches!(chars[j], '+' | '-') {
                let w: String = chars[i..=j].iter().collect();
                let after_ok = chars.get(j + 1).is_none_or(|c| !word_char(*c));
                if after_ok && word_math(&w).is_some() && w.contains(['Σ', 'Π', 'S', 'P']) {
                    j += 1;
                }
            }
            let mut w: String = chars[i..j].iter().collect();
            if w == "cm"
                && chars[j..].starts_with(&['-', '1'])
                && chars.get(j + 2).is_none_or(|c| !c.is_alphanumeric())
            {
                j += 2;
                w = "cm-1".into();
            }
            if w == "cm⁻¹" || w == "cm-1" {
                o.push_str("cm$^{-1}$");
            } else {
                match word_math(&w) {
                    Some(m) => o.push_str(&format!("${m}$")),
                    None => o.push_str(&escape(&w)),
                }
            }
            i = j;
        } else {
            if chars[i] == 'c'
                && chars[i..].starts_with(&['c', 'm', '-', '1'])
                && chars.get(i + 4).is_none_or(|c| !c.is_alphanumeric())
            {
                o.push_str("cm$^{-1}$");
                i += 4;
                continue;
            }
            o.push_str(&escape(&chars[i].to_string()));
            i += 1;
        }
    }
    // Neighbouring symbols joined by a sign form one formula: $\Gamma = A_1 + E$.
    o.replace("$ $-$ $", " - ")
        .replace("$ + $", " + ")
        .replace("$ = $", " = ")
        .replace("$  = $", " = ")
}

/// An exact expression or combination as printed in a code span (`1/√2 (r₁ − r₂)`), as math.
pub fn code_math(s: &str) -> String {
    let mut o = String::new();
    let chars: Vec<char> = s.chars().collect();
    let mut i = 0;
    while i < chars.len() {
        let c = chars[i];
        match c {
            '√' => {
                let mut j = i + 1;
                while j < chars.len() && (chars[j].is_ascii_digit() || chars[j] == '.') {
                    j += 1;
                }
                let arg: String = chars[i + 1..j].iter().collect();
                o.push_str(&format!("\\sqrt{{{arg}}}"));
                i = j;
                continue;
            }
            '₀'..='₉' => {
                let mut j = i;
                let mut d = String::new();
                while j < chars.len() && ('₀'..='₉').contains(&chars[j]) {
                    d.push(char::from_digit(chars[j] as u32 - '₀' as u32, 10).unwrap_or('0'));
                    j += 1;
                }
                o.push_str(&format!("_{{{d}}}"));
                i = j;
                continue;
            }
            '−' => o.push('-'),
            '·' => o.push_str("\\cdot "),
            'π' => o.push_str("\\pi "),
            'φ' => o.push_str("\\varphi "),
            'ζ' => o.push_str("\\zeta "),
            'i' if i > 0 && chars[i - 1] == 'π' => o.push('i'),
            ' ' => o.push_str("\\,"),
            c if c.is_ascii_alphanumeric() || "+-/().,=[]".contains(c) => o.push(c),
            c => {
                let e = escape(&c.to_string());
                o.push_str(&format!("\\text{{{e}}}"));
            }
        }
        i += 1;
    }
    o
}

/// Inline Markdown (`**bold**`, `` `code` ``) with the notation, as LaTeX.
fn md_inline(s: &str) -> String {
    let mut o = String::new();
    let mut rest = s;
    loop {
        let tick = rest.find('`');
        let bold = rest.find("**");
        match (tick, bold) {
            (Some(t), b) if b.is_none_or(|b| t < b) => {
                o.push_str(&inline(&rest[..t]));
                let after = &rest[t + 1..];
                match after.find('`') {
                    Some(e) => {
                        o.push_str(&format!("${}$", code_math(&after[..e])));
                        rest = &after[e + 1..];
                    }
                    None => {
                        o.push_str(&inline(after));
                        break;
                    }
                }
            }
            (_, Some(b)) => {
                o.push_str(&inline(&rest[..b]));
                let after = &rest[b + 2..];
                match after.find("**") {
                    Some(e) => {
                        o.push_str(&format!("\\textbf{{{}}}", md_inline(&after[..e])));
                        rest = &after[e + 2..];
                    }
                    None => {
                        o.push_str(&inline(after));
                        break;
                    }
                }
            }
            _ => {
                o.push_str(&inline(rest));
                break;
            }
        }
    }
    o
}

/// The cells of a Markdown table row (`| a | b \| c |`), unescaped.
fn md_cells(line: &str) -> Vec<String> {
    let inner = line.trim().trim_start_matches('|');
    let inner = inner.strip_suffix('|').unwrap_or(inner);
    let mut cells = Vec::new();
    let mut cur = String::new();
    let mut chars = inner.chars().peekable();
    while let Some(c) = chars.next() {
        if c == '\\' && chars.peek() == Some(&'|') {
            cur.push('|');
            chars.next();
        } else if c == '|' {
            cells.push(cur.trim().to_string());
            cur.clear();
        } else {
            cur.push(c);
        }
    }
    cells.push(cur.trim().to_string());
    cells
}

/// A booktabs table from rows of LaTeX cells (the first row is the header).
pub fn tabular(rows: &[Vec<String>]) -> String {
    let n = rows.iter().map(|r| r.len()).max().unwrap_or(0);
    let mut o = format!(
        "\\begin{{center}}\n\\begin{{tabular}}{{l{}}}\n\\toprule\n",
        "l".repeat(n.saturating_sub(1))
    );
    for (i, r) in rows.iter().enumerate() {
        let mut cells = r.clone();
        cells.resize(n, String::new());
        o.push_str(&cells.join(" & "));
        o.push_str(" \\\\\n");
        if i == 0 {
            o.push_str("\\midrule\n");
        }
    }
    o.push_str("\\bottomrule\n\\end{tabular}\n\\end{center}\n");
    o
}

/// salcdesk's Markdown (headings, pipe tables, `-` lists, fenced blocks, paragraphs) as LaTeX.
/// Heading level 1–2 become `\subsection*`, 3 `\subsubsection*`, deeper `\paragraph*`.
pub fn from_markdown(md: &str) -> String {
    let lines: Vec<&str> = md.lines().collect();
    let mut o = String::new();
    let mut i = 0;
    let mut in_list = false;
    let close_list = |o: &mut String, in_list: &mut bool| {
        if *in_list {
            o.push_str("\\end{itemize}\n");
            *in_list = false;
        }
    };
    while i < lines.len() {
        let l = lines[i];
        let t = l.trim_start();
        if t.starts_with("```") {
            close_list(&mut o, &mut in_list);
            let mut body = String::new();
            i += 1;
            while i < lines.len() && !lines[i].trim_start().starts_with("```") {
                body.push_str(lines[i]);
                body.push('\n');
                i += 1;
            }
            o.push_str("\\begin{verbatim}\n");
            o.push_str(&super::ascii_prose(&body).replace("\\end{verbatim}", "\\end {verbatim}"));
            o.push_str("\\end{verbatim}\n");
        } else if t.starts_with('|') {
            close_list(&mut o, &mut in_list);
            let mut rows = Vec::new();
            while i < lines.len() && lines[i].trim_start().starts_with('|') {
                let cells = md_cells(lines[i]);
                let separator = cells
                    .iter()
                    .all(|c| !c.is_empty() && c.chars().all(|x| matches!(x, '-' | ':')));
                if !separator {
                    rows.push(cells.iter().map(|c| md_inline(c)).collect());
                }
                i += 1;
            }
            o.push_str(&tabular(&rows));
            continue;
        } else if let Some(h) = t.strip_prefix('#') {
            close_list(&mut o, &mut in_list);
            let level = 1 + h.chars().take_while(|c| *c == '#').count();
            let text = h.trim_start_matches('#').trim();
            let cmd = match level {
                1 | 2 => "subsection*",
                3 => "subsubsection*",
                _ => "paragraph*",
            };
            o.push_str(&format!("\\{cmd}{{{}}}\n", md_inline(text)));
        } else if let Some(item) = t.strip_prefix("- ") {
            if !in_list {
                o.push_str("\\begin{itemize}\n");
                in_list = true;
            }
            o.push_str(&format!("\\item {}\n", md_inline(item)));
        } else if t.is_empty() {
            close_list(&mut o, &mut in_list);
            o.push('\n');
        } else {
            close_list(&mut o, &mut in_list);
            let text = l.trim_end().trim_end_matches('\\');
            o.push_str(&md_inline(text.trim()));
            // A hard break only between two lines of text (never at a paragraph's end).
            let next_is_text = lines.get(i + 1).is_some_and(|n| {
                let n = n.trim_start();
                !n.is_empty() && !n.starts_with(['|', '#', '-']) && !n.starts_with("```")
            });
            o.push_str(if l.ends_with("  ") && next_is_text {
                "\\\\\n"
            } else {
                "\n"
            });
        }
        i += 1;
    }
    close_list(&mut o, &mut in_list);
    o
}

/// Only the tables of a LaTeX document, each after a comment naming the heading it stood under.
pub fn tables_only(doc: &str) -> String {
    let mut o = String::from(
        "% salcdesk tables: \\input this file into a document that loads booktabs and amsmath\n",
    );
    let mut heading = String::new();
    let mut inside = false;
    for l in doc.lines() {
        if l.starts_with("\\section*")
            || l.starts_with("\\subsection*")
            || l.starts_with("\\subsubsection*")
            || l.starts_with("\\paragraph*")
        {
            heading = l.to_string();
        }
        if l == "\\begin{tabular}" || l.starts_with("\\begin{tabular}{") {
            inside = true;
            o.push_str(&format!("\n% {heading}\n"));
        }
        if inside {
            o.push_str(l);
            o.push('\n');
        }
        if l == "\\end{tabular}" {
            inside = false;
        }
    }
    o
}
