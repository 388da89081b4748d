//! Point-group detection on reference molecules (see `geom_molecules.rs` for the sources
//! of every geometry): ideal coordinates, and randomly rotated, translated and noised
//! copies (0.002 Å Gaussian noise must still give the ideal group at 0.01 Å).

#[path = "geom_molecules.rs"]
mod molecules;

use salcdesk::geom::{detect, group_order};

#[test]
fn there_are_enough_reference_molecules() {
    let cases = molecules::all();
    assert!(cases.len() >= 30, "{} cases", cases.len());
}

#[test]
fn ideal_geometries_give_their_groups() {
    let mut failures = Vec::new();
    for c in molecules::all() {
        match detect(&c.mol, 0.01) {
            Ok(d) if d.group == c.group => {
                if let Some(n) = group_order(&d.group) {
                    assert_eq!(d.operations.len(), n, "{}", c.name);
                }
                assert!(d.max_deviation < 1e-6, "{}: {}", c.name, d.max_deviation);
            }
            Ok(d) => failures.push(format!("{}: expected {}, got {}", c.name, c.group, d.group)),
            Err(e) => failures.push(format!("{}: error {e}", c.name)),
        }
    }
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}

#[test]
fn rotated_translated_noisy_geometries_give_their_groups() {
    let mut failures = Vec::new();
    for c in molecules::all() {
        for seed in 1..=4u64 {
            let m = molecules::scramble(&c.mol, seed * 7919 + c.mol.atoms.len() as u64, 0.002);
            match detect(&m, 0.01) {
                Ok(d) if d.group == c.group => {
                    assert!(d.max_deviation <= 0.01, "{}", c.name);
                }
                Ok(d) => failures.push(format!(
                    "{} seed {seed}: expected {}, got {} (dev {:.4})",
                    c.name, c.group, d.group, d.max_deviation
                )),
                Err(e) => failures.push(format!("{} seed {seed}: error {e}", c.name)),
            }
        }
    }
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}
