//! ν numbering of fundamentals by the customary convention (Mulliken, J. Chem. Phys. 23, 1997
//! (1955), as Herzberg applies it): species in the table's order with non-degenerate species
//! before degenerate ones, within a species by decreasing wavenumber; independent of the order
//! typed.

use salcdesk::group::{load, names};
use salcdesk::spectra::{
    fundamentals_from_gamma, predict_combinations, real_irreps, CombinationOptions, Fundamental,
    NUMBERING_NOTE,
};

fn permutations(n: usize) -> Vec<Vec<usize>> {
    if n == 0 {
        return vec![vec![]];
    }
    let mut out = Vec::new();
    for p in permutations(n - 1) {
        for k in 0..=p.len() {
            let mut q = p.clone();
            q.insert(k, n - 1);
            out.push(q);
        }
    }
    out
}

/// (irrep, position) typed in every order → the name each position gets.
fn check_all_orders(group: &str, data: &[(&str, f64, &str)]) {
    let g = load(group).unwrap();
    let perms = permutations(data.len());
    let step = (perms.len() / 200).max(1);
    for p in perms.iter().step_by(step) {
        let typed: Vec<Fundamental> = p
            .iter()
            .map(|&k| Fundamental {
                irrep: data[k].0.to_string(),
                position_cm: Some(data[k].1),
                name: None,
            })
            .collect();
        let r = predict_combinations(&g, &typed, CombinationOptions::default()).unwrap();
        assert_eq!(r.numbering, NUMBERING_NOTE);
        for (irrep, pos, want) in data {
            let f = r
                .fundamentals
                .iter()
                .find(|f| f.position_cm == Some(*pos))
                .unwrap();
            assert_eq!(
                f.name.as_deref(),
                Some(*want),
                "{group} {irrep} {pos}: {p:?}"
            );
        }
        // Listed in numbering order.
        let listed: Vec<&str> = r
            .fundamentals
            .iter()
            .map(|f| f.name.as_deref().unwrap())
            .collect();
        let want: Vec<String> = (1..=data.len()).map(|k| format!("ν{k}")).collect();
        assert_eq!(listed, want);
    }
}

#[test]
fn tetrahedral_xy4() {
    // Source: Nakamoto, Infrared and Raman Spectra of Inorganic and Coordination Compounds,
    // Part A, tetrahedral XY4 table (from memory): CCl4 ν1(A1) 459, ν2(E) 218, ν3(T2) 776,
    // ν4(T2) 314. Herzberg (1945), CH4: ν1(A1) 2917, ν2(E) 1534, ν3(T2) 3019, ν4(T2) 1306.
    check_all_orders(
        "Td",
        &[
            ("A1", 459.0, "ν1"),
            ("E", 218.0, "ν2"),
            ("T2", 776.0, "ν3"),
            ("T2", 314.0, "ν4"),
        ],
    );
    check_all_orders(
        "Td",
        &[
            ("A1", 2917.0, "ν1"),
            ("E", 1534.0, "ν2"),
            ("T2", 3019.0, "ν3"),
            ("T2", 1306.0, "ν4"),
        ],
    );
}

#[test]
fn trigonal_bipyramidal_xy5() {
    // Source: Nakamoto, Part A, trigonal-bipyramidal XY5 (PF5, from memory): ν1, ν2 A1′
    // (817, 640), ν3, ν4 A2″ (944, 575), ν5–ν7 E′ (1026, 533, 174), ν8 E″ (520). The A2″
    // species come before E′ although E′ precedes A1″ in the D3h table (Mulliken 1955).
    check_all_orders(
        "D3h",
        &[
            ("A1'", 817.0, "ν1"),
            ("A1'", 640.0, "ν2"),
            ("A2''", 944.0, "ν3"),
            ("A2''", 575.0, "ν4"),
            ("E'", 1026.0, "ν5"),
            ("E'", 533.0, "ν6"),
            ("E'", 174.0, "ν7"),
            ("E''", 520.0, "ν8"),
        ],
    );
}

#[test]
fn every_group_numbers_nondegenerate_species_first() {
    // One fundamental of every real species of every group: ν numbers follow the table's
    // order with the one-dimensional (real) species first (Mulliken 1955).
    for name in names() {
        let g = load(name).unwrap();
        if g.is_linear() {
            continue;
        }
        let reals = real_irreps(&g);
        let rows = vec![1u64; g.table.irreps.len()];
        let f = fundamentals_from_gamma(&g, &rows).unwrap();
        let mut want: Vec<&str> = reals
            .iter()
            .filter(|r| r.dim == 1)
            .map(|r| r.label.as_str())
            .collect();
        want.extend(reals.iter().filter(|r| r.dim > 1).map(|r| r.label.as_str()));
        let got: Vec<&str> = f.iter().map(|x| x.irrep.as_str()).collect();
        assert_eq!(got, want, "{name}");
        for (k, x) in f.iter().enumerate() {
            assert_eq!(x.name.as_deref(), Some(format!("ν{}", k + 1).as_str()));
        }
    }
}

#[test]
fn the_convention_is_stated_in_the_output() {
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_salcdesk"))
        .args([
            "combos",
            "--group",
            "Td",
            "--gamma",
            "A1 + E + 2T2",
            "--nu",
            "T2 314; A1 459; T2 776; E 218",
        ])
        .output()
        .unwrap();
    assert!(out.status.success());
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains("Mulliken 1955"), "{text}");
    assert!(
        text.contains("ν1 = A₁ 459, ν2 = E 218, ν3 = T₂ 776, ν4 = T₂ 314"),
        "{text}"
    );
}
