//! Near misses go up, never down: over every reference geometry of tests/geom_molecules.rs,
//! ideal and with noise of several sizes, each group of the near-miss report contains the
//! one before it, both as a type (a subgroup type in the group tables' own subgroup
//! lattice, `spectra::subgroup_types`) and by its operations in the input frame; and the
//! deviation it states is what symmetrizing the molecule to that group really moves an
//! atom (`geom::symmetrize` with the detection's frame and operations). Source of truth:
//! the definitions (a subgroup's operations are operations of the group; Lagrange's
//! theorem for the orders), computed in the test.

#[path = "geom_molecules.rs"]
mod molecules;

use nalgebra::{Matrix3, Vector3};
use salcdesk::geom::{
    detect, near_miss_detections, near_misses, symmetrize, Detection, Molecule,
    NEAR_MISS_TOLERANCES,
};
use std::collections::HashMap;

fn linear(d: &Detection) -> bool {
    matches!(d.group.as_str(), "Cinfv" | "Dinfh")
}

/// Every operation of `small` is an operation of `big` (input coordinates; the two frames
/// are each refitted, so within a loose entrywise bound well below the distance between
/// two different operations of one group).
fn operations_contained(small: &Detection, big: &Detection) -> bool {
    let theirs = big.input_operations();
    small.input_operations().iter().all(|g| {
        theirs
            .iter()
            .any(|h| (g - h).iter().all(|x| x.abs() <= 0.15))
    })
}

/// Largest distance of an atom from the line through `d.centre` along the frame's z.
fn off_axis(mol: &Molecule, d: &Detection) -> f64 {
    let e: Vector3<f64> = d.frame.row(2).transpose();
    mol.atoms
        .iter()
        .map(|a| {
            let p = a.position - d.centre;
            (p - e * e.dot(&p)).norm()
        })
        .fold(0.0, f64::max)
}

fn check(name: &str, mol: &Molecule, subgroups: &mut HashMap<String, Vec<String>>) -> usize {
    let start = detect(mol, NEAR_MISS_TOLERANCES[0]).unwrap();
    let report = near_miss_detections(mol, &start, &NEAR_MISS_TOLERANCES).unwrap();
    assert_eq!(report.len(), NEAR_MISS_TOLERANCES.len(), "{name}");
    assert_eq!(report[0], start, "{name}");
    let mut rises = 0;
    for (prev, next) in report.iter().zip(&report[1..]) {
        let what = format!(
            "{name}: {} at {} then {} at {}",
            prev.group, prev.tolerance, next.group, next.tolerance
        );
        assert!(
            next.max_deviation <= next.tolerance + 1e-12,
            "{what}: deviation {}",
            next.max_deviation
        );
        if next.group == prev.group {
            // Kept: the same group, the same frame and deviation.
            assert_eq!(next.max_deviation, prev.max_deviation, "{what}");
            assert_eq!(next.frame, prev.frame, "{what}");
            continue;
        }
        rises += 1;
        if linear(next) {
            // D∞h/C∞v contain exactly the operations keeping the axis (C∞v: its direction).
            let e: Vector3<f64> = next.frame.row(2).transpose();
            for g in prev.input_operations() {
                let ge = g * e;
                let kept =
                    (ge - e).norm() < 0.15 || (next.group == "Dinfh" && (ge + e).norm() < 0.15);
                assert!(kept, "{what}: an operation moves the axis");
            }
            assert!(off_axis(mol, next) <= next.max_deviation + 1e-9, "{what}");
            continue;
        }
        assert!(!linear(prev), "{what}: a linear group inside a finite one");
        let types = subgroups.entry(next.group.clone()).or_insert_with(|| {
            let g = salcdesk::group::load(&next.group).unwrap();
            salcdesk::spectra::subgroup_types(&g)
                .unwrap()
                .into_iter()
                .map(|t| t.name)
                .collect()
        });
        assert!(types.contains(&prev.group), "{what}: not a subgroup type");
        assert_eq!(
            next.operations.len() % prev.operations.len(),
            0,
            "{what}: Lagrange"
        );
        assert!(
            operations_contained(prev, next),
            "{what}: operations not contained"
        );
        // The stated deviation is what symmetrizing to this group moves an atom.
        let framed = next.apply_frame(mol);
        let ops: Vec<Matrix3<f64>> = next.operations.clone();
        let (_, moved) = symmetrize(&framed, &ops, 2.0 * next.tolerance).unwrap();
        assert!(
            (moved - next.max_deviation).abs() <= 1e-9,
            "{what}: states {} but symmetrizing moves {moved}",
            next.max_deviation
        );
    }
    // The deviation of every finite group of the report, not only of those that rise.
    for d in &report {
        if !linear(d) {
            let (_, moved) =
                symmetrize(&d.apply_frame(mol), &d.operations, 2.0 * d.tolerance).unwrap();
            assert!(
                (moved - d.max_deviation).abs() <= 1e-9,
                "{name}: {} states {} but symmetrizing moves {moved}",
                d.group,
                d.max_deviation
            );
        }
    }
    rises
}

#[test]
fn near_misses_go_up_with_the_deviation_of_their_own_group() {
    let mut subgroups = HashMap::new();
    let mut rises = 0;
    let mut count = 0;
    for case in molecules::all() {
        for (k, sigma) in [0.0, 0.004, 0.02, 0.06].into_iter().enumerate() {
            let m = molecules::scramble(&case.mol, 100 + k as u64, sigma);
            rises += check(
                &format!("{} (noise {sigma} Å)", case.name),
                &m,
                &mut subgroups,
            );
            count += 1;
        }
    }
    // The set must exercise the rising case, not only reports that keep their group.
    assert!(count >= 150, "{count} geometries");
    assert!(rises >= 20, "only {rises} rises over {count} geometries");
}

/// Methane (C–H 1.09 Å): Td at 0.01 Å stays Td at every looser tolerance (Td is not
/// contained in D2d; a report going down to D2d would be wrong).
#[test]
fn methane_stays_td() {
    // Source: r(C–H) 1.09 Å, tetrahedral, from memory.
    let r = 1.09 / 3f64.sqrt();
    let m = molecules::mol(
        "CH4",
        &[
            ("C", Vector3::zeros()),
            ("H", Vector3::new(r, r, r)),
            ("H", Vector3::new(-r, -r, r)),
            ("H", Vector3::new(-r, r, -r)),
            ("H", Vector3::new(r, -r, -r)),
        ],
    );
    for nm in near_misses(&m, &NEAR_MISS_TOLERANCES).unwrap() {
        assert_eq!(nm.group, "Td", "at {} Å", nm.tolerance);
        assert!(nm.max_deviation < 1e-9);
    }
}
