//! Characters of a broad sample of groups against the printed standard tables.
//! Source for every row below: Cotton, *Chemical Applications of Group Theory*, 3rd ed.,
//! Appendix IIA — values from memory, in the customary class order.

use salcdesk::exact::{parse, Cyclo};
use salcdesk::group::{self, PointGroup};

fn row(g: &PointGroup, label: &str) -> Vec<Cyclo> {
    let i = g
        .table
        .irrep_index(label)
        .unwrap_or_else(|| panic!("{}: no irrep {label}", g.name()));
    g.table.irreps[i].chars.clone()
}

fn check(name: &str, rows: &[(&str, &[&str])]) {
    let g = group::load(name).unwrap();
    for (label, want) in rows {
        let want: Vec<Cyclo> = want.iter().map(|s| parse(s).unwrap()).collect();
        assert_eq!(row(&g, label), want, "{name} {label}");
    }
}

#[test]
fn c2v_c3v_c4v() {
    check(
        "C2v",
        &[
            ("A1", &["1", "1", "1", "1"]),
            ("A2", &["1", "1", "-1", "-1"]),
            ("B1", &["1", "-1", "1", "-1"]),
            ("B2", &["1", "-1", "-1", "1"]),
        ],
    );
    check(
        "C3v",
        &[
            ("A1", &["1", "1", "1"]),
            ("A2", &["1", "1", "-1"]),
            ("E", &["2", "-1", "0"]),
        ],
    );
    check(
        "C4v",
        &[
            ("B1", &["1", "-1", "1", "1", "-1"]),
            ("B2", &["1", "-1", "1", "-1", "1"]),
            ("E", &["2", "0", "-2", "0", "0"]),
        ],
    );
}

#[test]
fn d3h_and_d4h() {
    check(
        "D3h",
        &[
            ("A1'", &["1", "1", "1", "1", "1", "1"]),
            ("A2'", &["1", "1", "-1", "1", "1", "-1"]),
            ("E'", &["2", "-1", "0", "2", "-1", "0"]),
            ("A1''", &["1", "1", "1", "-1", "-1", "-1"]),
            ("A2''", &["1", "1", "-1", "-1", "-1", "1"]),
            ("E''", &["2", "-1", "0", "-2", "1", "0"]),
        ],
    );
    check(
        "D4h",
        &[
            (
                "B2g",
                &["1", "-1", "1", "-1", "1", "1", "-1", "1", "-1", "1"],
            ),
            ("Eg", &["2", "0", "-2", "0", "0", "2", "0", "-2", "0", "0"]),
            (
                "A2u",
                &["1", "1", "1", "-1", "-1", "-1", "-1", "-1", "1", "1"],
            ),
            ("Eu", &["2", "0", "-2", "0", "0", "-2", "0", "2", "0", "0"]),
        ],
    );
}

#[test]
fn td_and_oh() {
    check(
        "Td",
        &[
            ("E", &["2", "-1", "2", "0", "0"]),
            ("T1", &["3", "0", "-1", "1", "-1"]),
            ("T2", &["3", "0", "-1", "-1", "1"]),
        ],
    );
    check(
        "Oh",
        &[
            (
                "A2g",
                &["1", "1", "-1", "-1", "1", "1", "-1", "1", "1", "-1"],
            ),
            ("Eg", &["2", "-1", "0", "0", "2", "2", "0", "-1", "2", "0"]),
            (
                "T1g",
                &["3", "0", "-1", "1", "-1", "3", "1", "0", "-1", "-1"],
            ),
            (
                "T2g",
                &["3", "0", "1", "-1", "-1", "3", "-1", "0", "-1", "1"],
            ),
            (
                "T1u",
                &["3", "0", "-1", "1", "-1", "-3", "-1", "0", "1", "1"],
            ),
            (
                "T2u",
                &["3", "0", "1", "-1", "-1", "-3", "1", "0", "1", "-1"],
            ),
        ],
    );
}

#[test]
fn golden_ratio_groups() {
    check(
        "C5v",
        &[
            ("E1", &["2", "2cos(2pi/5)", "2cos(4pi/5)", "0"]),
            ("E2", &["2", "2cos(4pi/5)", "2cos(2pi/5)", "0"]),
        ],
    );
    check(
        "Ih",
        &[
            (
                "T1g",
                &[
                    "3",
                    "(1+sqrt(5))/2",
                    "(1-sqrt(5))/2",
                    "0",
                    "-1",
                    "3",
                    "(1-sqrt(5))/2",
                    "(1+sqrt(5))/2",
                    "0",
                    "-1",
                ],
            ),
            (
                "Gg",
                &["4", "-1", "-1", "1", "0", "4", "-1", "-1", "1", "0"],
            ),
            ("Hg", &["5", "0", "0", "-1", "1", "5", "0", "0", "-1", "1"]),
            ("Hu", &["5", "0", "0", "-1", "1", "-5", "0", "0", "1", "-1"]),
        ],
    );
}

#[test]
fn d2d_and_s4() {
    check(
        "D2d",
        &[
            ("B1", &["1", "-1", "1", "1", "-1"]),
            ("B2", &["1", "-1", "1", "-1", "1"]),
            ("E", &["2", "0", "-2", "0", "0"]),
        ],
    );
    let g = group::load("S4").unwrap();
    // The E pair of S4: (1, i, −1, −i) and its conjugate, in some order.
    let rows: Vec<Vec<Cyclo>> = g
        .table
        .irreps
        .iter()
        .filter(|i| i.pair.is_some())
        .map(|i| i.chars.clone())
        .collect();
    let a: Vec<Cyclo> = ["1", "i", "-1", "-i"]
        .iter()
        .map(|s| parse(s).unwrap())
        .collect();
    let b: Vec<Cyclo> = a.iter().map(|c| c.conj()).collect();
    assert_eq!(rows.len(), 2);
    assert!(rows.contains(&a) && rows.contains(&b));
}

#[test]
fn c3_complex_pair() {
    let g = group::load("C3").unwrap();
    let e = parse("exp(2pi i/3)").unwrap();
    let rows: Vec<Vec<Cyclo>> = g
        .table
        .irreps
        .iter()
        .filter(|i| i.pair.is_some())
        .map(|i| i.chars.clone())
        .collect();
    let a = vec![Cyclo::one(), e.clone(), e.conj()];
    let b = vec![Cyclo::one(), e.conj(), e];
    assert!(rows.contains(&a) && rows.contains(&b));
}

#[test]
fn group_orders() {
    // Source: Cotton, 3rd ed., Appendix IIA (orders of the point groups).
    for (name, h) in [
        ("C2v", 4),
        ("D3h", 12),
        ("Td", 24),
        ("Oh", 48),
        ("Ih", 120),
        ("D8d", 32),
        ("S12", 12),
        ("C7h", 14),
        ("D6h", 24),
        ("Th", 24),
        ("I", 60),
    ] {
        assert_eq!(group::load(name).unwrap().order(), h, "{name}");
    }
}
