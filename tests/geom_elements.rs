//! Element table: symbols ↔ atomic numbers, covalent radii, masses.

use salcdesk::geom::{atomic_number, covalent_radius, mass, symbol};

#[test]
fn all_118_symbols_round_trip() {
    for z in 1..=118u8 {
        let s = symbol(z).unwrap();
        assert_eq!(atomic_number(s), Some(z), "{s}");
        assert_eq!(atomic_number(&s.to_uppercase()), Some(z));
        assert_eq!(atomic_number(&s.to_lowercase()), Some(z));
        assert_eq!(atomic_number(&z.to_string()), Some(z));
        assert!(mass(z).unwrap() > 0.0);
    }
    assert_eq!(symbol(0), None);
    assert_eq!(symbol(119), None);
    assert_eq!(atomic_number("Xx"), None);
    assert_eq!(atomic_number("0"), None);
    assert_eq!(atomic_number("119"), None);
    assert_eq!(atomic_number(""), None);
    assert_eq!(atomic_number(" fe "), Some(26));
}

#[test]
fn known_symbols_and_values() {
    // Source: periodic table (IUPAC), from memory.
    assert_eq!(symbol(6), Some("C"));
    assert_eq!(symbol(26), Some("Fe"));
    assert_eq!(symbol(74), Some("W"));
    assert_eq!(symbol(92), Some("U"));
    assert_eq!(symbol(118), Some("Og"));
    // Source: Cordero et al., Dalton Trans. 2008, 2832 (values from memory).
    assert_eq!(covalent_radius(1), Some(0.31));
    assert_eq!(covalent_radius(6), Some(0.76));
    assert_eq!(covalent_radius(17), Some(1.02));
    assert_eq!(covalent_radius(96), Some(1.69));
    assert_eq!(covalent_radius(97), None);
    // Source: IUPAC standard atomic weights, from memory.
    assert!((mass(1).unwrap() - 1.008).abs() < 1e-9);
    assert!((mass(6).unwrap() - 12.011).abs() < 1e-9);
    assert!((mass(79).unwrap() - 196.97).abs() < 1e-9);
}

#[test]
fn radii_cover_z_1_to_96() {
    for z in 1..=96u8 {
        let r = covalent_radius(z).unwrap();
        assert!((0.2..=2.7).contains(&r), "Z={z} r={r}");
    }
}
