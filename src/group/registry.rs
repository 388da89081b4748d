//! The tables shipped with salcdesk, embedded in the binary at build time (see build.rs), and
//! a cache of loaded groups.

use super::{PointGroup, PointGroupError};
use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};

include!(concat!(env!("OUT_DIR"), "/embedded_tables.rs"));

/// (name, file text) of every embedded table, in a customary order.
pub fn embedded() -> Vec<(&'static str, &'static str)> {
    let mut v: Vec<(&str, &str)> = EMBEDDED_TABLES.to_vec();
    v.sort_by_key(|(name, _)| sort_key(name));
    v
}

/// Family order, then n.
fn sort_key(name: &str) -> (usize, usize, String) {
    let fam = |n: &str| -> usize {
        match n {
            "C1" | "Cs" | "Ci" => 0,
            "T" | "Td" | "Th" | "O" | "Oh" => 9,
            "I" | "Ih" => 10,
            "Cinfv" | "Dinfh" => 11,
            _ if n.starts_with('S') => 8,
            _ if n.starts_with('C') && n.ends_with('v') => 2,
            _ if n.starts_with('C') && n.ends_with('h') => 3,
            _ if n.starts_with('C') => 1,
            _ if n.starts_with('D') && n.ends_with('h') => 5,
            _ if n.starts_with('D') && n.ends_with('d') => 6,
            _ => 4,
        }
    };
    let digits: String = name.chars().filter(|c| c.is_ascii_digit()).collect();
    let n = digits.parse().unwrap_or(0);
    let within = match name {
        "C1" => 0,
        "Cs" => 1,
        "Ci" => 2,
        "T" => 0,
        "Td" => 1,
        "Th" => 2,
        "O" => 3,
        "Oh" => 4,
        _ => n,
    };
    (fam(name), within, name.to_string())
}

/// Names of all embedded groups.
pub fn names() -> Vec<&'static str> {
    embedded().into_iter().map(|(n, _)| n).collect()
}

/// Canonical ASCII name for user input: case-insensitive, Unicode subscripts and ∞ accepted.
pub fn canonical_name(input: &str) -> Option<&'static str> {
    let mut s: String = input
        .trim()
        .chars()
        .map(|c| match c {
            '₀'..='₉' => char::from_u32(c as u32 - '₀' as u32 + '0' as u32).unwrap_or(c),
            'ᵥ' => 'v',
            'ₕ' => 'h',
            _ => c,
        })
        .collect();
    s = s.replace('∞', "inf").replace("infinity", "inf");
    let lower = s.to_ascii_lowercase();
    names()
        .into_iter()
        .find(|n| n.to_ascii_lowercase() == lower)
}

fn cache() -> &'static Mutex<HashMap<String, Arc<PointGroup>>> {
    static CACHE: OnceLock<Mutex<HashMap<String, Arc<PointGroup>>>> = OnceLock::new();
    CACHE.get_or_init(|| Mutex::new(HashMap::new()))
}

/// Load an embedded group by name (cached; cheap after the first call).
pub fn load(name: &str) -> Result<Arc<PointGroup>, PointGroupError> {
    let canon = canonical_name(name).ok_or_else(|| PointGroupError::Unknown {
        name: name.to_string(),
        hint: suggestion(name),
    })?;
    if let Some(g) = cache().lock().expect("group cache").get(canon) {
        return Ok(g.clone());
    }
    let text = EMBEDDED_TABLES
        .iter()
        .find(|(n, _)| *n == canon)
        .map(|(_, t)| *t)
        .expect("canonical name is embedded");
    let g = Arc::new(PointGroup::from_toml(
        &format!("tables/{canon}.toml"),
        text,
    )?);
    cache()
        .lock()
        .expect("group cache")
        .insert(canon.to_string(), g.clone());
    Ok(g)
}

fn suggestion(name: &str) -> String {
    let lower = name.to_ascii_lowercase();
    let close: Vec<&str> = names()
        .into_iter()
        .filter(|n| {
            let l = n.to_ascii_lowercase();
            l.starts_with(&lower[..lower.len().min(2)]) || lower.starts_with(&l)
        })
        .take(6)
        .collect();
    if close.is_empty() {
        "run `salcdesk groups` for the list".into()
    } else {
        format!(
            "did you mean {}? (`salcdesk groups` lists all)",
            close.join(", ")
        )
    }
}
