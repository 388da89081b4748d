//! Band lists: reading files (with line-numbered errors) and checking observed bands against
//! a prediction.

use salcdesk::group::load;
use salcdesk::spectra::{
    check_bands, parse_bands, parse_gamma, Band, CheckOptions, Fundamental, Intensity,
    Polarization, Technique,
};

// from memory: Herzberg, Infrared and Raman Spectra (1945), Raman spectrum of liquid CCl4:
// 218 dp, 314 dp, 459 p, and the Fermi doublet 762/791 dp (ν3 with ν1 + ν4).
const CCL4_RAMAN: &str = "\
# CCl4, Raman (liquid)
position, technique, intensity, polarization
218, Raman, m, dp
314, Raman, m, dp
459, Raman, vs, p
762\tRaman-dp\tw
791   Raman(dp)   w   # upper member of the doublet
";

#[test]
fn reads_commas_tabs_spaces_comments_and_header() {
    let b = parse_bands("ccl4.txt", CCL4_RAMAN).unwrap();
    assert_eq!(b.len(), 5);
    assert_eq!(b[2].position_cm, 459.0);
    assert_eq!(b[2].technique, Technique::Raman);
    assert_eq!(b[2].polarization, Some(Polarization::P));
    assert_eq!(b[2].intensity, Some(Intensity::Word("vs".into())));
    assert_eq!(b[3].polarization, Some(Polarization::Dp));
    assert_eq!(b[4].polarization, Some(Polarization::Dp));
    assert_eq!(b[4].note, None);
}

#[test]
fn two_and_three_columns_numeric_intensity_and_note() {
    let b = parse_bands("x", "1000 IR\n1200 ir 0.35\n900 R 12 p shoulder band\n").unwrap();
    assert_eq!(b[0].intensity, None);
    assert_eq!(b[1].intensity, Some(Intensity::Value(0.35)));
    assert_eq!(b[2].polarization, Some(Polarization::P));
    assert_eq!(b[2].note.as_deref(), Some("shoulder band"));
}

#[test]
fn errors_name_line_and_field() {
    let e = parse_bands("f.csv", "# c\n100, IR\n1O0, IR\n").unwrap_err();
    assert_eq!((e.line, e.field), (3, 1));
    assert!(e.to_string().starts_with("f.csv:3: field 1"), "{e}");
    let e = parse_bands("f.csv", "100, IR\n\n200\n").unwrap_err();
    assert_eq!((e.line, e.field), (3, 2));
    let e = parse_bands("f.csv", "100, UV\n").unwrap_err();
    assert_eq!((e.line, e.field), (1, 2));
    let e = parse_bands("f.csv", "100 IR s p\n").unwrap_err();
    assert_eq!((e.line, e.field), (1, 4));
    let e = parse_bands("f.csv", "100 IR\n-5 Raman\n").unwrap_err();
    assert_eq!((e.line, e.field), (2, 1));
}

#[test]
fn band_json_round_trip() {
    let b = Band {
        position_cm: 459.0,
        technique: Technique::Raman,
        intensity: Some(Intensity::Value(100.0)),
        polarization: Some(Polarization::P),
        note: None,
    };
    let s = serde_json::to_string(&b).unwrap();
    assert_eq!(serde_json::from_str::<Band>(&s).unwrap(), b);
}

fn fundamental(irrep: &str, p: f64, name: &str) -> Fundamental {
    Fundamental {
        irrep: irrep.into(),
        position_cm: Some(p),
        name: Some(name.into()),
    }
}

#[test]
fn ccl4_raman_check() {
    // Γ: Nakamoto, Part A, tetrahedral XY4, A1 + E + 2T2 (4 Raman fundamentals).
    // Bands and ν1 459 (a1), ν2 218 (e), ν4 314 (f2): from memory, Herzberg (1945), CCl4.
    let g = load("Td").unwrap();
    let rows = parse_gamma(&g, "A1 + E + 2T2").unwrap();
    let bands = parse_bands("ccl4.txt", CCL4_RAMAN).unwrap();
    let fundamentals = vec![
        fundamental("A1", 459.0, "ν1"),
        fundamental("E", 218.0, "ν2"),
        fundamental("T2", 314.0, "ν4"),
    ];
    let r = check_bands(&g, &rows, &bands, &[], CheckOptions::default()).unwrap();
    let raman = r.counts.iter().find(|c| c.what == "Raman").unwrap();
    assert_eq!((raman.observed, raman.predicted), (5, 4));
    // The polarized band can only be the totally symmetric A1.
    assert_eq!(r.bands[2].fundamental_candidates, vec!["A1"]);
    // Depolarized bands: E or T2, never A1.
    assert_eq!(r.bands[0].fundamental_candidates, vec!["E", "T2"]);
    assert!(r.conflicts.is_empty());
    assert!(r.bands[2].remarks[0].starts_with("could be"));

    // With 3 % tolerance the doublet sits near ν1 + ν4 = 773 (f2, Raman active) — the Fermi
    // resonance partner named by Herzberg.
    let opts = CheckOptions {
        relative: 0.03,
        absolute_cm: 10.0,
    };
    let r = check_bands(&g, &rows, &bands, &fundamentals, opts).unwrap();
    for k in [3, 4] {
        let l = &r.bands[k].level_candidates;
        assert_eq!(l[0].label, "ν1 + ν4", "band {k}: {l:?}");
        assert_eq!(l[0].harmonic_cm, 773.0);
        assert_eq!(l[0].symmetry, "T2");
    }
    assert_eq!(r.bands[2].listed_fundamental.as_deref(), Some("ν1"));
    // Default tolerance (max(1 %, 10 cm⁻¹) = 10 at 773): 762 is 11 away, not offered.
    let r = check_bands(&g, &rows, &bands, &fundamentals, CheckOptions::default()).unwrap();
    assert!(r.bands[3].level_candidates.is_empty());
    // Once ν3 (f2, 776 cm⁻¹ — Nakamoto, Part A, CCl4, from memory) is also listed, every E and
    // T2 fundamental has a place: the doublet is no longer offered as a fundamental.
    let mut all = fundamentals.clone();
    all.push(fundamental("T2", 776.0, "ν3"));
    let r = check_bands(&g, &rows, &bands, &all, CheckOptions::default()).unwrap();
    assert!(
        r.bands[4].remarks[0].starts_with("symmetry also allows"),
        "{:?}",
        r.bands[4]
    );
    assert!(!r.bands[4]
        .remarks
        .iter()
        .any(|m| m.starts_with("could be a fundamental")));
}

// from memory: Herzberg, Infrared and Raman Spectra (1945), N2O: 589 (IR), 1285 (IR and
// Raman), 2224 (IR and Raman) — the coincidences show that N2O is not centrosymmetric (NNO).
const N2O: &str = "589 IR\n1285 IR\n2224 IR\n1285 Raman\n2224 Raman\n";

#[test]
fn coincidences_conflict_in_centrosymmetric_group() {
    let bands = parse_bands("n2o", N2O).unwrap();
    // As if symmetric NON (D∞h, Γ = Σg+ + Σu+ + Πu, Herzberg 1945): mutual exclusion broken.
    let g = load("Dinfh").unwrap();
    let rows = parse_gamma(&g, "Sigma+g + Sigma+u + Piu").unwrap();
    let r = check_bands(&g, &rows, &bands, &[], CheckOptions::default()).unwrap();
    assert_eq!(r.conflicts.len(), 2);
    assert!(r.conflicts[0].message.contains("mutual exclusion"));
    // As NNO (C∞v, 2Σ+ + Π): no conflict; coincidences consistent with one fundamental.
    let g = load("Cinfv").unwrap();
    let rows = parse_gamma(&g, "2Sigma+ + Pi").unwrap();
    let r = check_bands(&g, &rows, &bands, &[], CheckOptions::default()).unwrap();
    assert!(r.conflicts.is_empty(), "{:?}", r.conflicts);
    assert!(r.bands[1]
        .remarks
        .iter()
        .any(|m| m.starts_with("seen in both IR and Raman: consistent with")));
}

#[test]
fn listed_fundamental_of_inactive_irrep_is_a_conflict() {
    // Rule: an IR band cannot be a fundamental of an IR-inactive irrep (Nakamoto, Part A,
    // ch. 1). CCl4's ν1 (a1, 459 cm⁻¹, Herzberg 1945, from memory) is Raman-only; a user who
    // lists it at an IR band is told so.
    let g = load("Td").unwrap();
    let rows = parse_gamma(&g, "A1 + E + 2T2").unwrap();
    let bands = parse_bands("x", "459 IR\n").unwrap();
    let r = check_bands(
        &g,
        &rows,
        &bands,
        &[fundamental("A1", 459.0, "ν1")],
        Default::default(),
    )
    .unwrap();
    assert_eq!(r.conflicts.len(), 1);
    assert!(r.bands[0].fundamental_candidates == vec!["T2"]);
}

#[test]
fn load_from_file_and_missing_file() {
    let dir = std::env::temp_dir().join(format!("salcdesk-spectra-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join("ccl4.csv");
    std::fs::write(&path, CCL4_RAMAN).unwrap();
    let b = salcdesk::spectra::load_bands(&path).unwrap();
    assert_eq!(b.len(), 5);
    std::fs::remove_file(&path).unwrap();
    let e = salcdesk::spectra::load_bands(&path).unwrap_err();
    assert_eq!(e.line, 0);
    let _ = std::fs::remove_dir(&dir);
}
