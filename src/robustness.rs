//! Entry points shared by the fuzz targets (`fuzz/`) and the corpus replay test: each takes
//! arbitrary bytes, must never panic, and checks an invariant where one exists.

use crate::exact::{parse, Notation};
use crate::group::PointGroup;

/// Exact-number syntax: anything parses or errors cleanly; what parses prints and re-parses
/// to the same number, in both notations.
pub fn exact_number(data: &[u8]) {
    let Ok(text) = std::str::from_utf8(data) else {
        return;
    };
    if text.len() > 256 {
        return;
    }
    if let Ok(x) = parse(text) {
        for nt in [Notation::Unicode, Notation::Ascii] {
            let printed = x.text(nt);
            let back = parse(&printed)
                .unwrap_or_else(|e| panic!("{text:?} printed as {printed:?} does not parse: {e}"));
            assert!(
                back == x,
                "{text:?} printed as {printed:?} reads back differently"
            );
        }
        let _ = x.decimal();
    }
}

/// Table files: any text loads as a group or gives an error with a location.
pub fn table_file(data: &[u8]) {
    let Ok(text) = std::str::from_utf8(data) else {
        return;
    };
    if text.len() > 64 * 1024 {
        return;
    }
    if let Ok(g) = PointGroup::from_toml("fuzz.toml", text) {
        let _ = crate::group::validate::validate(&g);
    }
}
