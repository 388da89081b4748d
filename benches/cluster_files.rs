//! Writes the timing clusters as XYZ files into a folder, for the whole-process timings in
//! README (Performance): each as built (`NAME.xyz`) and randomly turned and moved
//! (`NAME_turned.xyz`). Built by the same code as the benches (tests/geom_molecules.rs).
//! Also the large inputs of `benches/large_inputs_process.sh`: `large_fcc_oh.xyz` (a
//! 92,597-atom fcc cube, Oh), `large_fcc_c1.xyz` (the same with 0.05 Å of noise: C1) and
//! `large_cloud_c1.xyz` (30,000 atoms at random in a 150 Å box).
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
    // Source: the Cu lattice constant 3.615 Å, from memory.
    let cube = molecules::fcc_cube(28, 3.615);
    let noisy = molecules::scramble(&cube, 5, 0.05);
    let cloud = random_cloud(30_000, 150.0);
    for (file, m, group) in [
        ("large_fcc_oh.xyz", &cube, "Oh"),
        ("large_fcc_c1.xyz", &noisy, "C1"),
        ("large_cloud_c1.xyz", &cloud, "C1"),
    ] {
        let path = dir.join(file);
        if let Err(e) = std::fs::write(&path, write_xyz(m)) {
            eprintln!("{}: {e}", path.display());
            std::process::exit(1);
        }
        println!("{} ({} atoms, {group})", path.display(), m.atoms.len());
    }
}

/// `n` carbon atoms at random in a cube of edge `edge` Å (a fixed seed: the same file each time).
fn random_cloud(n: usize, edge: f64) -> salcdesk::geom::Molecule {
    let mut seed = 11u64;
    let mut next = || {
        seed = seed
            .wrapping_mul(6364136223846793005)
            .wrapping_add(1442695040888963407);
        edge * ((seed >> 11) as f64 / (1u64 << 53) as f64)
    };
    let atoms = (0..n)
        .map(|_| {
            let p = nalgebra::Vector3::new(next(), next(), next());
            salcdesk::geom::Atom::new(6, p)
        })
        .collect();
    salcdesk::geom::Molecule::new("random cloud", atoms)
}
