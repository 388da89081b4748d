//! Entry points shared by the fuzz targets (`fuzz/`) and the corpus replay test: each takes
//! arbitrary bytes, must never panic, and checks an invariant where one exists.

use crate::exact::{parse, Notation};
use crate::group::PointGroup;

/// Exact-number syntax: anything parses or errors cleanly; what parses prints and re-parses
/// to the same number, in both notations.
pub fn exact_number(data: &[u8]) {
    let Ok(text) = std::str::from_utf8(data) else {
        return;
    };
    if text.len() > 256 {
        return;
    }
    if let Ok(x) = parse(text) {
        for nt in [Notation::Unicode, Notation::Ascii] {
            let printed = x.text(nt);
            let back = parse(&printed)
                .unwrap_or_else(|e| panic!("{text:?} printed as {printed:?} does not parse: {e}"));
            assert!(
                back == x,
                "{text:?} printed as {printed:?} reads back differently"
            );
        }
        let _ = x.decimal();
    }
}

/// Table files: any text loads as a group or gives an error with a location.
pub fn table_file(data: &[u8]) {
    let Ok(text) = std::str::from_utf8(data) else {
        return;
    };
    if text.len() > 64 * 1024 {
        return;
    }
    if let Ok(g) = PointGroup::from_toml("fuzz.toml", text) {
        let _ = crate::group::validate::validate(&g);
    }
}

/// XYZ reader: any bytes read as a molecule or give a located error; what reads writes back
/// and re-reads to the same atoms.
pub fn xyz_file(data: &[u8]) {
    use crate::geom::{read_xyz, write_xyz, XyzOptions};
    if data.len() > 64 * 1024 {
        return;
    }
    let opts = XyzOptions {
        max_atoms: 1000,
        ..XyzOptions::default()
    };
    match read_xyz(data, &opts) {
        Ok(mol) => {
            assert!(mol.atoms.len() <= 1000, "atom cap ignored");
            let text = write_xyz(&mol);
            let back = read_xyz(text.as_bytes(), &opts)
                .unwrap_or_else(|e| panic!("written XYZ does not read back: {e}\n{text}"));
            assert_eq!(back.atoms.len(), mol.atoms.len(), "atom count changed");
            for (a, b) in mol.atoms.iter().zip(&back.atoms) {
                assert_eq!(a.element, b.element, "element changed");
            }
        }
        Err(e) => {
            assert!(e.line >= 1, "error without a line: {}", e.message());
        }
    }
}

/// Session loader: any text loads or gives an error with file, line and column; what loads
/// writes back and reloads identically.
pub fn session_file(data: &[u8]) {
    use crate::session::{parse, to_toml};
    let Ok(text) = std::str::from_utf8(data) else {
        return;
    };
    if text.len() > 64 * 1024 {
        return;
    }
    match parse("fuzz.toml", text) {
        Ok(s) => {
            let written = to_toml(&s);
            let back = parse("fuzz.toml", &written)
                .unwrap_or_else(|e| panic!("written session does not reload: {e}\n{written}"));
            assert!(
                back == s,
                "session changed on a save/reload round trip\n{written}"
            );
            if s.geometry.is_none() {
                // Analysis of the table-level work is cheap; geometry is fuzzed separately.
                let _ = crate::analysis::analyze_to(&s, crate::analysis::Depth::Full);
            }
        }
        Err(e) => {
            assert!(e.line >= 1 && e.column >= 1, "error without location: {e}");
        }
    }
}

/// Band-list import: any text gives bands or an error naming a line; positions are finite.
pub fn band_list(data: &[u8]) {
    let Ok(text) = std::str::from_utf8(data) else {
        return;
    };
    if text.len() > 64 * 1024 {
        return;
    }
    match crate::spectra::parse_bands("fuzz.txt", text) {
        Ok(bands) => {
            for b in &bands {
                assert!(b.position_cm.is_finite(), "non-finite band accepted");
            }
        }
        Err(e) => assert!(e.line >= 1, "error without a line"),
    }
}

/// Survey of a small arbitrary geometry: at most 12 atoms from the bytes (element, three
/// coordinates on a 0.05 Å grid, so that symmetric arrangements are common). Never panics;
/// whatever group is found, Γvib has 3N − 6 (or 3N − 5) modes.
pub fn small_geometry(data: &[u8]) {
    use crate::geom::{Atom, Molecule};
    use crate::survey::{survey, SurveyOptions};
    const ELEMENTS: [u8; 8] = [1, 6, 7, 8, 9, 15, 17, 78];
    let atoms: Vec<Atom> = data
        .chunks_exact(4)
        .take(12)
        .map(|c| {
            let coord = |b: u8| (b as i8) as f64 * 0.05;
            Atom::new(
                ELEMENTS[(c[0] % 8) as usize],
                nalgebra::Vector3::new(coord(c[1]), coord(c[2]), coord(c[3])),
            )
        })
        .collect();
    if atoms.is_empty() {
        return;
    }
    let n = atoms.len();
    let mol = Molecule::new("fuzz", atoms);
    let opts = SurveyOptions {
        near_misses: data.len() % 2 == 0,
        ..SurveyOptions::default()
    };
    if let Ok(s) = survey(&mol, &opts) {
        let modes: u64 = s
            .group
            .table
            .irreps
            .iter()
            .zip(&s.vibrations.vibrations)
            .map(|(irrep, m)| m * irrep.dim() as u64)
            .sum();
        let expected = match n {
            1 => 0,
            2 => 1,
            _ if s.group.is_linear() => 3 * n as u64 - 5,
            _ => 3 * n as u64 - 6,
        };
        assert_eq!(
            modes,
            expected,
            "Γvib has {modes} modes for {n} atoms in {}",
            s.group.name()
        );
    }
}
