//! Overtone and combination levels: symmetric powers versus plain products, activity, and
//! harmonic positions.

use salcdesk::group::load;
use salcdesk::spectra::{
    combination, overtone, predict_combinations, real_index, CombinationOptions, Fundamental,
    LevelKind, ANHARMONIC_NOTE,
};

fn idx(g: &salcdesk::group::PointGroup, l: &str) -> usize {
    real_index(g, l).unwrap()
}

#[test]
fn overtone_of_e_in_c3v_is_symmetric_square() {
    // from memory: Herzberg, Infrared and Raman Spectra (1945), ch. II: the first overtone of
    // a doubly degenerate vibration of a C3v molecule has species A1 + E (not A1 + A2 + E,
    // which is E × E for a combination of two different e vibrations).
    let g = load("C3v").unwrap();
    let e = idx(&g, "E");
    assert_eq!(overtone(&g, e, 2).unwrap().text, "A1 + E");
    assert_eq!(combination(&g, e, e).unwrap().text, "A1 + A2 + E");
}

#[test]
fn overtones_in_td() {
    // from memory: Herzberg (1945), ch. II, Td: (f2)² = a1 + e + f2 for an overtone, and
    // e × f2 = f1 + f2 for a combination; 2ν of an e vibration: a1 + e.
    let g = load("Td").unwrap();
    let t2 = idx(&g, "T2");
    let e = idx(&g, "E");
    assert_eq!(overtone(&g, t2, 2).unwrap().text, "A1 + E + T2");
    assert_eq!(combination(&g, e, t2).unwrap().text, "T1 + T2");
    assert_eq!(overtone(&g, e, 2).unwrap().text, "A1 + E");
    // Plain product T2 × T2 = A1 + E + T1 + T2 (same source): differs from the overtone.
    assert_eq!(combination(&g, t2, t2).unwrap().text, "A1 + E + T1 + T2");
}

#[test]
fn second_overtone_of_e_in_c3v() {
    // from memory: Herzberg (1945), ch. II, C3v: 3ν of an e vibration has species A1 + A2 + E.
    let g = load("C3v").unwrap();
    assert_eq!(overtone(&g, idx(&g, "E"), 3).unwrap().text, "A1 + A2 + E");
}

#[test]
fn linear_overtones() {
    // from memory: Herzberg (1945), ch. II, linear molecules: 2ν2 of a π vibration is
    // Σ+ + Δ (g for D∞h), 3ν2 is Π + Φ; π × π = Σ+ + Σ− + Δ.
    let g = load("Dinfh").unwrap();
    let piu = idx(&g, "Piu");
    assert_eq!(overtone(&g, piu, 2).unwrap().text, "Sigma+g + Deltag");
    assert_eq!(overtone(&g, piu, 3).unwrap().text, "Piu + Phiu");
    let c = load("Cinfv").unwrap();
    let pi = idx(&c, "Pi");
    assert_eq!(
        combination(&c, pi, pi).unwrap().text,
        "Sigma+ + Sigma- + Delta"
    );
}

#[test]
fn methane_combinations() {
    // from memory: Herzberg (1945), CH4 fundamentals ν1 2914 (a1), ν2 1526 (e), ν3 3020 (f2),
    // ν4 1306 (f2) cm⁻¹. ν2 + ν4 (e × f2 = f1 + f2) is infrared active; 2ν4 contains f2.
    let g = load("Td").unwrap();
    let f = |irrep: &str, p: f64| Fundamental {
        irrep: irrep.into(),
        position_cm: Some(p),
        name: None,
    };
    let list = vec![
        f("A1", 2914.0),
        f("E", 1526.0),
        f("T2", 3020.0),
        f("T2", 1306.0),
    ];
    let r = predict_combinations(&g, &list, CombinationOptions::default()).unwrap();
    let l = r.levels.iter().find(|l| l.label == "ν2 + ν4").unwrap();
    assert_eq!(l.kind, LevelKind::Combination);
    assert_eq!(l.harmonic_cm, Some(2832.0));
    assert_eq!(l.symmetry.text, "T1 + T2");
    assert!(l.ir && l.raman);
    let o = r.levels.iter().find(|l| l.label == "2ν4").unwrap();
    assert_eq!(o.harmonic_cm, Some(2612.0));
    assert!(o.ir && o.polarized);
    // 4 overtones 2ν, 4 of 3ν, 6 binary combinations.
    assert_eq!(r.levels.len(), 14);
    assert_eq!(r.note, ANHARMONIC_NOTE);
    // Sorted by position.
    assert!(r
        .levels
        .windows(2)
        .all(|w| w[0].harmonic_cm <= w[1].harmonic_cm));
}

#[test]
fn unknown_fundamental_irrep_is_an_error() {
    let g = load("Td").unwrap();
    let bad = vec![Fundamental {
        irrep: "B7".into(),
        position_cm: Some(100.0),
        name: None,
    }];
    let e = predict_combinations(&g, &bad, CombinationOptions::default()).unwrap_err();
    assert!(e.to_string().contains("fundamental 1"), "{e}");
}

#[test]
fn fundamentals_from_text() {
    // from memory: Herzberg (1945), CH4: ν1 2914 (a1), ν2 1526 (e), ν3 3020 (f2), ν4 1306 (f2).
    let text = "# CH4\nA1 2914 ν1\nE, 1526, ν2\nT2 3020 ν3; T2 1306 ν4\n";
    let f = salcdesk::spectra::parse_fundamentals("ch4", text).unwrap();
    assert_eq!(f.len(), 4);
    assert_eq!(f[3].irrep, "T2");
    assert_eq!(f[3].position_cm, Some(1306.0));
    assert_eq!(f[3].name.as_deref(), Some("ν4"));
    let g = load("Td").unwrap();
    let r = predict_combinations(&g, &f, CombinationOptions::default()).unwrap();
    assert!(r.levels.iter().any(|l| l.label == "ν2 + ν4"));
    let e = salcdesk::spectra::parse_fundamentals("f", "A1 2914\nE x1526\n").unwrap_err();
    assert_eq!((e.line, e.field), (2, 2));
}

#[test]
fn every_level_has_the_symmetry_of_its_own_product_in_every_group() {
    // Each level's symmetry is reduced once per pair of irreps and reused; every level must
    // still carry the symmetry of its own fundamentals, computed directly (overtone: the
    // symmetric power; combination: the plain product — Herzberg (1945), ch. II). Every
    // group, every real irrep twice (so equal and swapped pairs both occur).
    for name in salcdesk::group::names() {
        let g = load(name).unwrap();
        let reals = salcdesk::spectra::real_irreps(&g);
        let fundamentals: Vec<Fundamental> = reals
            .iter()
            .rev()
            .chain(reals.iter())
            .map(|r| Fundamental {
                irrep: r.label.clone(),
                position_cm: None,
                name: None,
            })
            .collect();
        let r = predict_combinations(&g, &fundamentals, CombinationOptions::default()).unwrap();
        let n = fundamentals.len();
        assert_eq!(r.levels.len(), 2 * n + n * (n - 1) / 2, "{name}");
        let irrep_of = |k: usize| idx(&g, &r.fundamentals[k].irrep);
        for l in &r.levels {
            let direct = match l.kind {
                LevelKind::Overtone => overtone(&g, irrep_of(l.of[0]), l.of.len() as u32),
                LevelKind::Combination => combination(&g, irrep_of(l.of[0]), irrep_of(l.of[1])),
            }
            .unwrap();
            assert_eq!(l.symmetry, direct, "{name} {}", l.label);
        }
    }
}

#[test]
fn too_many_levels_are_refused_unless_narrowed_by_position() {
    // 450 fundamentals: 900 overtones + 101,025 combinations, beyond the listed maximum.
    let g = load("C1").unwrap();
    let many = |position: Option<f64>| -> Vec<Fundamental> {
        (0..450)
            .map(|k| Fundamental {
                irrep: "A".into(),
                position_cm: position.map(|p| p + k as f64),
                name: None,
            })
            .collect()
    };
    let err = predict_combinations(&g, &many(None), CombinationOptions::default()).unwrap_err();
    let text = err.to_string();
    assert!(text.contains("450 fundamentals give 101925"), "{text}");
    assert!(text.contains("upper wavenumber limit"), "{text}");
    // positions from 1000 to 1449 cm⁻¹ and a limit of 2010 cm⁻¹: only the combinations of
    // the lowest fundamentals remain (νa + νb ≤ 2010 with a + b ≤ 10 over 1000 + offsets)
    let opts = CombinationOptions {
        second_overtones: true,
        max_cm: Some(2010.0),
    };
    let r = predict_combinations(&g, &many(Some(1000.0)), opts).unwrap();
    assert!(!r.levels.is_empty());
    assert!(r.levels.iter().all(|l| l.harmonic_cm.unwrap() <= 2010.0));
    // without the limit, the same positioned list is refused too
    let open = CombinationOptions {
        second_overtones: true,
        max_cm: None,
    };
    assert!(predict_combinations(&g, &many(Some(1000.0)), open).is_err());
}
