//! Writes the timing clusters as XYZ files into a folder, for the whole-process timings in
//! README (Performance): each as built (`NAME.xyz`) and randomly turned and moved
//! (`NAME_turned.xyz`). Built by the same code as the benches (tests/geom_molecules.rs).
//!
//! A bench target only so that it lives in `benches/` (the top level holds no `examples/`); it
//! measures nothing itself. Without a folder it writes into `target/clusters`.
//!
//! ```sh
//! cargo bench --bench cluster_files -- DIR
//! ```

#[path = "../tests/geom_molecules.rs"]
mod molecules;

use salcdesk::geom::write_xyz;
use std::path::PathBuf;

fn main() {
    // `cargo bench` passes flags such as `--bench`; the first other argument is the folder.
    let dir = std::env::args()
        .skip(1)
        .find(|a| !a.starts_with("--"))
        .map(PathBuf::from)
        .unwrap_or_else(|| PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("target/clusters"));
    if let Err(e) = std::fs::create_dir_all(&dir) {
        eprintln!("{}: {e}", dir.display());
        std::process::exit(1);
    }
    let mut all = molecules::timing_clusters();
    // C60 for the whole-process SALC timings (salc c60.xyz --basis stretch / cartesian)
    all.push(("c60", molecules::c60(), "Ih"));
    for (name, mol, group) in all {
        let turned = molecules::scramble(&mol, 11, 0.0);
        for (file, m) in [
            (format!("{name}.xyz"), &mol),
            (format!("{name}_turned.xyz"), &turned),
        ] {
            let path = dir.join(&file);
            if let Err(e) = std::fs::write(&path, write_xyz(m)) {
                eprintln!("{}: {e}", path.display());
                std::process::exit(1);
            }
            println!("{} ({} atoms, {group})", path.display(), m.atoms.len());
        }
    }
}
