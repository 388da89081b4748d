//! Standard orientation, atom permutations and symmetrization.

#[path = "geom_molecules.rs"]
mod molecules;

use nalgebra::{Matrix3, Rotation3, Vector3};
use salcdesk::geom::{
    detect, orient, orient_with, permutation, symmetrize, Family, GeomError, OrientOptions,
};

/// Class representatives stand-in: every operation of the group, conjugated by `turn`
/// (a table whose standard orientation differs from the detector's by `turn`).
fn reps(group: &str, turn: Matrix3<f64>) -> Vec<(usize, Matrix3<f64>)> {
    Family::parse(group)
        .unwrap()
        .operations()
        .into_iter()
        .enumerate()
        .map(|(k, g)| (k, turn * g * turn.transpose()))
        .collect()
}

fn rz(deg: f64) -> Matrix3<f64> {
    Rotation3::from_axis_angle(&Vector3::z_axis(), deg.to_radians()).into_inner()
}

fn assert_reps_hold(m: &salcdesk::geom::Molecule, reps: &[(usize, Matrix3<f64>)], tol: f64) {
    for (k, r) in reps {
        permutation(m, r, tol).unwrap_or_else(|e| panic!("class {k}: {e}"));
    }
}

#[test]
fn orients_every_reference_molecule_to_its_own_convention() {
    for c in molecules::all() {
        let m = molecules::scramble(&c.mol, 21, 0.002);
        let d = detect(&m, 0.01).unwrap();
        let r = reps(&d.group, Matrix3::identity());
        let o = orient(&m, &d, &r).unwrap_or_else(|e| panic!("{}: {e}", c.name));
        assert_reps_hold(&o.molecule, &r, 0.03);
        assert!((o.rotation.determinant() - 1.0).abs() < 1e-9);
    }
}

#[test]
fn finds_other_conventions() {
    // Tables that put C2' on y (D3h), σv on the bisector (C4v) or the other icosahedral
    // setting (Ih turned 90° about z).
    for (name, turn) in [
        ("BF3", rz(90.0)),
        ("PF5", rz(30.0)),
        ("SF5Cl", rz(45.0)),
        ("C60", rz(90.0)),
        ("ferrocene staggered", rz(18.0)),
        ("benzene", rz(30.0)),
        (
            "cubane",
            rz(45.0) * Rotation3::from_axis_angle(&Vector3::x_axis(), 0.0).into_inner(),
        ),
    ] {
        let c = molecules::all()
            .into_iter()
            .find(|c| c.name == name)
            .unwrap();
        let m = molecules::scramble(&c.mol, 5, 0.001);
        let d = detect(&m, 0.01).unwrap();
        let r = reps(&d.group, turn);
        match orient(&m, &d, &r) {
            Ok(o) => assert_reps_hold(&o.molecule, &r, 0.03),
            // A 45° turn of Oh is not an Oh setting: the reps are then not those of any
            // orientation of the molecule and orientation must fail cleanly.
            Err(GeomError::OrientationNotFound { .. }) => assert_eq!(name, "cubane"),
            Err(e) => panic!("{name}: {e}"),
        }
    }
}

#[test]
fn planar_c2v_swap_option() {
    let m = molecules::water();
    let d = detect(&m, 0.01).unwrap();
    let r = reps("C2v", Matrix3::identity());
    // Default (Mulliken 1955): molecular plane yz.
    let o = orient(&m, &d, &r).unwrap();
    assert!(o.molecule.atoms.iter().all(|a| a.position.x.abs() < 1e-9));
    let swapped = orient_with(
        &m,
        &d,
        &r,
        &OrientOptions {
            swap_xy: true,
            tolerance: None,
        },
    )
    .unwrap();
    assert!(swapped
        .molecule
        .atoms
        .iter()
        .all(|a| a.position.y.abs() < 1e-9));
}

#[test]
fn permutation_of_water_c2_and_error_naming_the_atom() {
    let m = molecules::water();
    let d = detect(&m, 0.01).unwrap();
    let o = d.apply_frame(&m);
    let c2 = d.operations[1..]
        .iter()
        .find(|g| g.determinant() > 0.0)
        .copied()
        .unwrap();
    assert_eq!(permutation(&o, &c2, 0.01).unwrap(), vec![0, 2, 1]);
    let c3 = rz(120.0);
    match permutation(&o, &c3, 0.01) {
        Err(GeomError::NotSymmetric { atom, detail, .. }) => {
            assert!(atom == 1 || atom == 2, "{detail}");
            assert!(detail.contains(&format!("atom {atom} (H)")), "{detail}");
        }
        other => panic!("{other:?}"),
    }
}

#[test]
fn symmetrize_removes_noise() {
    let c = molecules::all()
        .into_iter()
        .find(|c| c.name == "ferrocene staggered")
        .unwrap();
    let noisy = molecules::scramble(&c.mol, 9, 0.003);
    let d = detect(&noisy, 0.02).unwrap();
    assert_eq!(d.group, "D5d");
    let oriented = d.apply_frame(&noisy);
    let (ideal, moved) = symmetrize(&oriented, &d.operations, 0.03).unwrap();
    assert!(moved > 0.0 && moved < 0.02, "{moved}");
    let again = detect(&ideal, 1e-6).unwrap();
    assert_eq!(again.group, "D5d");
    // Input-frame operations act about the detected centre of the input molecule.
    let ops_in = d.input_operations();
    assert_eq!(ops_in.len(), 20);
}

#[test]
fn symmetrize_refuses_a_non_group() {
    let m = molecules::water();
    let ops = [Matrix3::identity(), rz(120.0)];
    assert!(matches!(
        symmetrize(&m, &ops, 0.01),
        Err(GeomError::NotAGroup(_))
    ));
}
