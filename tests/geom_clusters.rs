//! Large clusters: the generators used by the bench give the expected groups and atom
//! counts (timing lives in benches/geom_detect.rs, not here).

#[path = "geom_molecules.rs"]
mod molecules;

use salcdesk::geom::detect;

#[test]
fn mackay_icosahedron_is_ih() {
    // Source: Au–Au 2.88 Å, from memory.
    let m = molecules::mackay_icosahedron(7, 2.88);
    assert_eq!(m.atoms.len(), 1415);
    let d = detect(&molecules::scramble(&m, 3, 0.0), 0.01).unwrap();
    assert_eq!(d.group, "Ih");
    assert_eq!(d.operations.len(), 120);
}

#[test]
fn fcc_clusters_are_oh() {
    // Source: Cu lattice constant 3.615 Å, from memory.
    let m = molecules::fcc_cuboctahedron(7, 3.615);
    assert_eq!(m.atoms.len(), 1415);
    assert_eq!(
        detect(&molecules::scramble(&m, 4, 0.0), 0.01)
            .unwrap()
            .group,
        "Oh"
    );
    let cube = molecules::fcc_cube(6, 3.615);
    assert!(cube.atoms.len() >= 1000);
    assert_eq!(
        detect(&molecules::scramble(&cube, 5, 0.0), 0.01)
            .unwrap()
            .group,
        "Oh"
    );
}
