//! Class names as users write them in ticks (`2C3`, `C3`, `3sv`, `σh`) → table columns.

use crate::group::{CharacterTable, ClassInfo};

/// (count, bare symbol): `3C2(=C4^2)` → (Some(3), `C2`), `C3` → (None, `C3`).
fn split(s: &str) -> (Option<usize>, &str) {
    let s = s.trim();
    let s = s.split('(').next().unwrap_or(s).trim();
    let digits = s.len() - s.trim_start_matches(|c: char| c.is_ascii_digit()).len();
    (s[..digits].parse().ok(), &s[digits..])
}

/// Column of a class named by its ASCII or Unicode symbol, with or without the count
/// (`2C3` or `C3`). A count, when written, must be the class's. A name that fits two classes
/// (Oh's `6C2` and `3C2`) must be written with its count; otherwise it names no class.
pub fn resolve_class(t: &CharacterTable, name: &str) -> Option<usize> {
    let n = name.trim();
    if let Some(i) = t.classes.iter().position(|c| c.ascii == n || c.symbol == n) {
        return Some(i);
    }
    let (count, bare) = split(n);
    let hits: Vec<usize> = t
        .classes
        .iter()
        .enumerate()
        .filter(|(_, c)| {
            [&c.ascii, &c.symbol].iter().any(|sym| {
                let (k, b) = split(sym);
                b == bare && (count.is_none() || count == Some(k.unwrap_or(1)))
            })
        })
        .map(|(i, _)| i)
        .collect();
    (hits.len() == 1).then(|| hits[0])
}

/// Display form of a class symbol.
pub fn class_label(c: &ClassInfo, ascii: bool) -> String {
    if ascii {
        c.ascii.clone()
    } else {
        c.symbol.clone()
    }
}
