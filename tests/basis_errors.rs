//! Bad input gives typed errors naming the place, never a panic.

#[path = "salc_support.rs"]
mod support;

use nalgebra::Vector3;
use salcdesk::basis::{self, BasisError, Placed, Structure};
use support::*;

#[test]
fn asymmetric_geometry_names_operation_and_atom() {
    let g = salcdesk::group::load("C3v").unwrap();
    let atoms = vec![
        Placed {
            symbol: "N".into(),
            position: Vector3::zeros(),
        },
        Placed {
            symbol: "H".into(),
            position: Vector3::new(0.94, 0.0, -0.38),
        },
    ];
    let e = Structure::new(g, atoms, vec![], 0.01).unwrap_err();
    assert!(matches!(e, BasisError::NotSymmetric { atom: 2, .. }), "{e}");
}

#[test]
fn bad_bond_open_set_centre_and_plane() {
    let s = orbit_molecule("C3v", &[("N", [0.0; 3]), ("H", [0.94, 0.0, -0.38])]);
    let g = s.group.clone();
    let e = Structure::new(g, s.atoms.clone(), vec![(0, 9)], 0.01).unwrap_err();
    assert!(matches!(e, BasisError::BadBond { bond: 1, .. }));
    let e = basis::stretches(&s, &[(0, 1)]).unwrap_err();
    assert!(matches!(e, BasisError::NotClosed { .. }), "{e}");
    let e = basis::sigma(&s, 1, &[0]).unwrap_err();
    assert!(matches!(e, BasisError::CentreNotFixed { atom: 2, .. }));
    let e = basis::p_perp(&s, &[1, 2, 3]).unwrap_err();
    assert_eq!(e, BasisError::NotPlanar);
    let e = basis::sigma(&s, 7, &[1]).unwrap_err();
    assert!(matches!(e, BasisError::NoSuchAtom { atom: 8, .. }));
}

#[test]
fn linear_group_and_linear_molecule() {
    let g = salcdesk::group::load("Dinfh").unwrap();
    let atoms = vec![Placed {
        symbol: "C".into(),
        position: Vector3::zeros(),
    }];
    assert!(matches!(
        Structure::new(g, atoms, vec![], 0.01),
        Err(BasisError::LinearGroup { .. })
    ));
    let s = explicit(
        "D2h",
        &[
            ("C", [0.0; 3]),
            ("O", [0.0, 0.0, 1.16]),
            ("O", [0.0, 0.0, -1.16]),
        ],
        &[],
    );
    assert!(matches!(
        basis::vibrations(&s),
        Err(BasisError::LinearMolecule { .. })
    ));
}
