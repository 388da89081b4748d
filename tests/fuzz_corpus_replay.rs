//! Replays every committed fuzz corpus input (and every crash input kept as a regression)
//! through the same entry points the fuzz targets use, as an ordinary test.

use std::path::Path;

fn replay(target: &str, f: fn(&[u8])) {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("fuzz/corpus")
        .join(target);
    let mut n = 0;
    for entry in std::fs::read_dir(&dir).unwrap_or_else(|e| panic!("{}: {e}", dir.display())) {
        let p = entry.unwrap().path();
        if p.is_file() {
            let data = std::fs::read(&p).unwrap();
            f(&data);
            n += 1;
        }
    }
    assert!(n > 0, "empty corpus for {target}");
}

#[test]
fn exact_number_corpus() {
    replay("exact_number", salcdesk::robustness::exact_number);
}

#[test]
fn table_file_corpus() {
    replay("table_file", salcdesk::robustness::table_file);
}

#[test]
fn xyz_file_corpus() {
    replay("xyz_file", salcdesk::robustness::xyz_file);
}

#[test]
fn session_file_corpus() {
    replay("session_file", salcdesk::robustness::session_file);
}

#[test]
fn band_list_corpus() {
    replay("band_list", salcdesk::robustness::band_list);
}

#[test]
fn small_geometry_corpus() {
    replay("small_geometry", salcdesk::robustness::small_geometry);
}
