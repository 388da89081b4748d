//! `salcdesk symmetrize` on every reference geometry of tests/geom_molecules.rs, turned,
//! moved and with noise: the result has its centre of mass at the origin (within 1e-10 Å),
//! its principal axis on z (the z rotation of the group maps the printed atoms onto each
//! other; linear molecules lie on z), prints no negative zero, and is a fixed point:
//! symmetrizing it again gives the same file byte for byte, comment line included.
//! Source of truth: the definitions (centre of mass Σ m r / Σ m with the crate's masses),
//! computed in the test.

#[path = "geom_molecules.rs"]
mod molecules;

use nalgebra::{Rotation3, Vector3};
use salcdesk::geom::{mass, read_xyz, write_xyz, Family, XyzOptions};
use std::path::{Path, PathBuf};
use std::process::Command;

fn scratch() -> PathBuf {
    let d = std::env::temp_dir().join(format!("salcdesk-symmetrize-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap();
    d
}

fn symmetrize(input: &Path, output: &Path) -> String {
    let out = Command::new(env!("CARGO_BIN_EXE_salcdesk"))
        .arg("symmetrize")
        .arg(input)
        .arg("-o")
        .arg(output)
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{}: {}",
        input.display(),
        String::from_utf8_lossy(&out.stderr)
    );
    let err = String::from_utf8_lossy(&out.stderr);
    err.split_whitespace()
        .nth(2)
        .unwrap_or("")
        .trim_end_matches(':')
        .to_string()
}

#[test]
fn symmetrized_files_are_centred_on_z_and_fixed_points() {
    let dir = scratch();
    let mut count = 0;
    for (k, case) in molecules::all().into_iter().enumerate() {
        let m = molecules::scramble(&case.mol, 300 + k as u64, 0.002);
        let input = dir.join(format!("in{k}.xyz"));
        std::fs::write(&input, write_xyz(&m)).unwrap();
        let (once, twice) = (dir.join(format!("a{k}.xyz")), dir.join(format!("b{k}.xyz")));
        let group = symmetrize(&input, &once);
        symmetrize(&once, &twice);
        let a = std::fs::read_to_string(&once).unwrap();
        let b = std::fs::read_to_string(&twice).unwrap();
        let name = case.name;
        assert_eq!(a, b, "{name}: symmetrizing again changed the file");
        assert!(!a.contains("-0.0000000000"), "{name}: negative zero\n{a}");
        let title = a.lines().nth(1).unwrap();
        assert_eq!(
            title.matches("symmetrized to").count(),
            1,
            "{name}: {title}"
        );
        let mol = read_xyz(a.as_bytes(), &XyzOptions::default()).unwrap();
        let total: f64 = mol.atoms.iter().map(|x| mass(x.element).unwrap()).sum();
        let com: Vector3<f64> = mol
            .atoms
            .iter()
            .map(|x| x.position * mass(x.element).unwrap())
            .sum::<Vector3<f64>>()
            / total;
        assert!(com.norm() <= 1e-10, "{name}: centre of mass at {com:?}");
        let family = Family::parse(&group).unwrap_or_else(|| panic!("{name}: group '{group}'"));
        let n = family.principal_order();
        let on_axis = |p: &Vector3<f64>| p.x.abs() < 1e-9 && p.y.abs() < 1e-9;
        if n == 0 {
            assert!(
                mol.atoms.iter().all(|x| on_axis(&x.position)),
                "{name}: off z"
            );
        } else if n >= 2 {
            let c = Rotation3::from_axis_angle(
                &Vector3::z_axis(),
                2.0 * std::f64::consts::PI / n as f64,
            );
            for x in &mol.atoms {
                let img = c * x.position;
                assert!(
                    mol.atoms
                        .iter()
                        .any(|y| y.element == x.element && (y.position - img).norm() < 1e-8),
                    "{name} ({group}): C{n} about z does not map the atoms onto each other"
                );
            }
        }
        count += 1;
    }
    assert!(count >= 40);
    let _ = std::fs::remove_dir_all(&dir);
}
