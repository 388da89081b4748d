//! The text renderings carry the report's content.

use salcdesk::group::load;
use salcdesk::spectra::render::{
    check_markdown, combinations_markdown, descent_markdown, modes_markdown,
};
use salcdesk::spectra::{
    check_bands, descend_names, fundamentals_from_gamma, modes_from_text, parse_bands, parse_gamma,
    predict_combinations, CheckOptions, CombinationOptions,
};

#[test]
fn renderings_carry_the_numbers() {
    // Γ: Nakamoto, Part A, octahedral XY6.
    let r = modes_from_text("Oh", "A1g + Eg + 2T1u + T2g + T2u").unwrap();
    let t = modes_markdown(&r);
    assert!(t.contains("IR bands: 2   Raman bands: 3   coincident: 0   silent: 1"));
    assert!(t.contains("mutual exclusion"));
    assert!(t.contains("| T1u | 2 | 3 | x, y, z |"));

    let g = load("Oh").unwrap();
    let rows = parse_gamma(&g, "A1g + Eg + 2T1u + T2g + T2u").unwrap();
    let f = fundamentals_from_gamma(&g, &rows).unwrap();
    assert_eq!(f.len(), 6);
    let c = predict_combinations(&g, &f, CombinationOptions::default()).unwrap();
    let t = combinations_markdown(&c);
    assert!(t.contains("| 2ν1 |  | A1g |"));
    assert!(t.contains("slightly below"));

    let d = descend_names("Oh", "D4h", None, Some("A1g + Eg + 2T1u + T2g + T2u")).unwrap();
    let t = descent_markdown(&d);
    assert!(t.contains("| T1u | A2u + Eu |"));
    assert!(t.contains("In D4h"));

    let bands = parse_bands("b", "459 Raman p\n").unwrap();
    let td = load("Td").unwrap();
    let rows = parse_gamma(&td, "A1 + E + 2T2").unwrap();
    let b = check_bands(&td, &rows, &bands, &[], CheckOptions::default()).unwrap();
    assert!(check_markdown(&b).contains("could be a fundamental of A1"));
}
