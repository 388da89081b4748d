//! The list of every group this build has a table for, with what a picker needs to show and
//! to search: name, symbol, family, order.

use crate::group;

/// One group in the catalogue.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct GroupEntry {
    /// ASCII name, e.g. `D4h`.
    pub name: String,
    /// Unicode symbol, e.g. `D₄ₕ`.
    pub symbol: String,
    /// Family as the tables name it (`Dnh`, `cubic`, …).
    pub family: String,
    /// Group order; `None` for the linear groups.
    pub order: Option<usize>,
}

/// Every embedded group in customary order (tables that fail to load are left out).
pub fn catalogue() -> Vec<GroupEntry> {
    group::names()
        .into_iter()
        .filter_map(|n| group::load(n).ok())
        .map(|g| GroupEntry {
            name: g.table.name.clone(),
            symbol: g.table.symbol.clone(),
            family: g.table.family.name().to_string(),
            order: g.table.order,
        })
        .collect()
}

/// How well `query` fits a group: higher is better, `None` is no fit. Matches the name
/// (prefix, then letters in order, case ignored), the family, and the order (`48`).
pub fn fit(e: &GroupEntry, query: &str) -> Option<u32> {
    let q = query.trim().to_ascii_lowercase();
    if q.is_empty() {
        return Some(1);
    }
    let name = e.name.to_ascii_lowercase();
    if name == q {
        return Some(100);
    }
    if name.starts_with(&q) {
        return Some(80);
    }
    if e.order.map(|o| o.to_string()) == Some(q.clone()) {
        return Some(60);
    }
    if e.family.to_ascii_lowercase() == q {
        return Some(50);
    }
    if e.family.to_ascii_lowercase().starts_with(&q) && q.len() >= 3 {
        return Some(40);
    }
    // letters in order
    let mut it = name.chars();
    if q.chars().all(|c| it.any(|n| n == c)) {
        return Some(20);
    }
    None
}
