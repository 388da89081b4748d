//! A process-wide cache of reductions keyed by (group, kind, unmoved counts): ticking a cell
//! back and forth, undo and redo, and re-analysing unchanged sets cost a lookup.

use super::set::Outcome;
use super::Depth;
use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};

/// (group name, kind name, depth, unmoved counts per class).
type Key = (String, &'static str, Depth, Vec<i64>);

const LIMIT: usize = 4096;

fn cache() -> &'static Mutex<HashMap<Key, Arc<Outcome>>> {
    static C: OnceLock<Mutex<HashMap<Key, Arc<Outcome>>>> = OnceLock::new();
    C.get_or_init(|| Mutex::new(HashMap::new()))
}

/// The cached outcome, if there is one.
pub fn peek(key: &Key) -> Option<Arc<Outcome>> {
    cache().lock().ok()?.get(key).cloned()
}

/// The cached outcome, or compute and remember it.
pub fn get_or(key: Key, compute: impl FnOnce() -> Outcome) -> Arc<Outcome> {
    if let Ok(c) = cache().lock() {
        if let Some(o) = c.get(&key) {
            return o.clone();
        }
    }
    let o = Arc::new(compute());
    if let Ok(mut c) = cache().lock() {
        if c.len() >= LIMIT {
            c.clear();
        }
        c.insert(key, o.clone());
    }
    o
}
