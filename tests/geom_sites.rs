//! Site builder: orbit types of point groups and generation of equivalent atoms.

use salcdesk::geom::{detect, place, site_types, Family, Molecule, SiteKind, SiteParams, SiteType};

fn sites(group: &str) -> Vec<SiteType> {
    site_types(&Family::parse(group).unwrap().operations()).unwrap()
}

fn summary(s: &[SiteType]) -> Vec<(SiteKind, usize, usize)> {
    s.iter()
        .map(|t| (t.kind, t.multiplicity, t.site_order))
        .collect()
}

#[test]
fn c2v_sites() {
    use SiteKind::*;
    let s = sites("C2v");
    assert_eq!(
        summary(&s),
        vec![
            (Origin, 1, 4),
            (Axis, 1, 4),
            (Axis, 1, 4),
            (Plane, 2, 2),
            (Plane, 2, 2),
            (General, 4, 1)
        ]
    );
    assert_eq!(s[1].label, "C2 axis along +z");
    assert_eq!(s[2].label, "C2 axis along -z");
}

#[test]
fn td_oh_ih_sites() {
    use SiteKind::*;
    // Td: C3 rays (1,1,1) and (−1,−1,−1) are different orbits of 4; S4/C2 rays one orbit
    // of 6; one class of σd (12); general 24.
    let td = summary(&sites("Td"));
    assert_eq!(
        td,
        vec![
            (Origin, 1, 24),
            (Axis, 6, 4),
            (Axis, 4, 6),
            (Axis, 4, 6),
            (Plane, 12, 2),
            (General, 24, 1)
        ]
    );
    let oh = summary(&sites("Oh"));
    let mults: Vec<usize> = oh.iter().map(|t| t.1).collect();
    assert_eq!(mults, vec![1, 6, 12, 8, 24, 24, 48]);
    let ih = summary(&sites("Ih"));
    let mults: Vec<usize> = ih.iter().map(|t| t.1).collect();
    // Source: the orbits of Ih are 1, 12 (C5), 20 (C3), 30 (C2), 60 (mirror), 120.
    let mut sorted = mults.clone();
    sorted.sort();
    assert_eq!(sorted, vec![1, 12, 20, 30, 60, 120]);
}

#[test]
fn place_builds_methane_and_sf6() {
    let td = sites("Td");
    let c3 = td
        .iter()
        .find(|t| t.kind == SiteKind::Axis && t.multiplicity == 4)
        .unwrap();
    // Source: C–H 1.087 Å, from memory.
    let mut atoms = place(
        1,
        c3,
        &SiteParams {
            distance: 1.087,
            ..Default::default()
        },
    )
    .unwrap();
    atoms.extend(place(6, &td[0], &SiteParams::default()).unwrap());
    let m = Molecule::new("CH4", atoms);
    assert_eq!(m.atoms.len(), 5);
    assert_eq!(detect(&m, 0.01).unwrap().group, "Td");

    let oh = sites("Oh");
    let c4 = oh.iter().find(|t| t.multiplicity == 6).unwrap();
    let mut atoms = place(
        9,
        c4,
        &SiteParams {
            distance: 1.561,
            ..Default::default()
        },
    )
    .unwrap();
    atoms.extend(place(16, &oh[0], &SiteParams::default()).unwrap());
    assert_eq!(
        detect(&Molecule::new("SF6", atoms), 0.01).unwrap().group,
        "Oh"
    );
}

#[test]
fn plane_and_general_positions() {
    let d3h = sites("D3h");
    for t in &d3h {
        let p = SiteParams {
            distance: 1.5,
            theta_deg: 37.0,
            phi_deg: 11.0,
        };
        if t.kind == SiteKind::Origin {
            continue;
        }
        let atoms = place(9, t, &p).unwrap();
        assert_eq!(atoms.len(), t.multiplicity, "{}", t.label);
        for a in &atoms {
            assert!((a.position.norm() - 1.5).abs() < 1e-9);
        }
        // Every equivalent set alone has at least the site's symmetry; with a centre it
        // is D3h unless it is too symmetric on its own (a single pair on z).
        let mut all = atoms.clone();
        all.push(salcdesk::geom::Atom::new(5, nalgebra::Vector3::zeros()));
        let g = detect(&Molecule::new("x", all), 0.01).unwrap().group;
        assert!(g == "D3h" || g == "Dinfh" || g == "D6h", "{}: {g}", t.label);
    }
}

#[test]
fn special_parameters_are_refused() {
    let c2v = sites("C2v");
    let general = c2v.last().unwrap();
    // θ = 0 puts the atom on the C2 axis.
    let e = place(
        1,
        general,
        &SiteParams {
            distance: 1.0,
            theta_deg: 0.0,
            phi_deg: 0.0,
        },
    );
    assert!(e.is_err());
    assert!(place(1, &c2v[1], &SiteParams::default()).is_err());
    assert!(place(
        1,
        &c2v[1],
        &SiteParams {
            distance: f64::NAN,
            ..Default::default()
        }
    )
    .is_err());
    assert!(site_types(&[]).is_err());
}
