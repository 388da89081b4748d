//! Bond perception from covalent radii.

#[path = "geom_molecules.rs"]
mod molecules;

use salcdesk::geom::{perceive_bonds, DEFAULT_BOND_FACTOR};

#[test]
fn water_and_benzene() {
    let b = perceive_bonds(&molecules::water(), DEFAULT_BOND_FACTOR).unwrap();
    assert_eq!(b, vec![(0, 1), (0, 2)]);
    let bz = perceive_bonds(&molecules::benzene(), DEFAULT_BOND_FACTOR).unwrap();
    assert_eq!(bz.len(), 12); // 6 C–C + 6 C–H
}

#[test]
fn c60_has_90_bonds() {
    // Source: C60 has 90 edges (truncated icosahedron).
    let b = perceive_bonds(&molecules::c60(), DEFAULT_BOND_FACTOR).unwrap();
    assert_eq!(b.len(), 90);
}

#[test]
fn ferrocene_fe_c_bonds_found() {
    // Source: Fe–C about 2.05 Å; 1.15·(1.32 + 0.76) = 2.39 Å, so all ten Fe–C bonds count.
    let m = molecules::ferrocene(false);
    let b = perceive_bonds(&m, DEFAULT_BOND_FACTOR).unwrap();
    let fe_c = b.iter().filter(|(i, j)| *i == 0 || *j == 0).count();
    assert_eq!(fe_c, 10);
}

#[test]
fn large_cluster_bonds_match_brute_force() {
    let m = molecules::fcc_cuboctahedron(4, 3.615);
    let fast = perceive_bonds(&m, DEFAULT_BOND_FACTOR).unwrap();
    let mut slow = Vec::new();
    let cut = DEFAULT_BOND_FACTOR * 2.0 * 1.32;
    for i in 0..m.atoms.len() {
        for j in i + 1..m.atoms.len() {
            if (m.atoms[i].position - m.atoms[j].position).norm() <= cut {
                slow.push((i, j));
            }
        }
    }
    assert_eq!(fast, slow);
}

#[test]
fn bad_factor_is_an_error() {
    assert!(perceive_bonds(&molecules::water(), f64::NAN).is_err());
    assert!(perceive_bonds(&molecules::water(), -1.0).is_err());
}
