//! Laws of the reduction formula, exactly, in every finite group (property tests).

use proptest::prelude::*;
use salcdesk::group;
use salcdesk::rep::{
    antisymmetric_square, decompose, direct_product, from_multiplicities, irrep_character, reduce,
    symmetric_square,
};

fn finite_groups() -> Vec<&'static str> {
    group::names()
        .into_iter()
        .filter(|n| !group::load(n).unwrap().is_linear())
        .collect()
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(64))]
    /// Reducing Σ nᵢ χᵢ returns the nᵢ (orthogonality, Cotton 3rd ed. §4.3).
    #[test]
    fn reduction_inverts_sums(gi in 0usize..57, seed in proptest::collection::vec(0u64..4, 48)) {
        let names = finite_groups();
        let g = group::load(names[gi % names.len()]).unwrap();
        let mut m: Vec<u64> = seed.iter().take(g.table.irreps.len()).cloned().collect();
        // complex pairs must come together to keep the sum real — not needed for the law itself
        m.resize(g.table.irreps.len(), 0);
        let chi = from_multiplicities(&g, &m);
        prop_assert_eq!(decompose(&g, &chi).unwrap(), m);
    }

    /// Γ⊗Γ' has dimension d·d', and [Γ²] + {Γ²} = Γ⊗Γ.
    #[test]
    fn squares_split_the_product(gi in 0usize..57, i in 0usize..48) {
        let names = finite_groups();
        let g = group::load(names[gi % names.len()]).unwrap();
        let i = i % g.table.irreps.len();
        let x = irrep_character(&g, i);
        let full = decompose(&g, &direct_product(&x, &x)).unwrap();
        let s = decompose(&g, &symmetric_square(&g, &x)).unwrap();
        let a = decompose(&g, &antisymmetric_square(&g, &x)).unwrap();
        let sum: Vec<u64> = s.iter().zip(&a).map(|(p, q)| p + q).collect();
        prop_assert_eq!(full, sum);
        let d = g.table.irreps[i].dim() as u64;
        let dim: u64 = s.iter().zip(&g.table.irreps).map(|(n, ir)| n * ir.dim() as u64).sum();
        prop_assert_eq!(dim, d * (d + 1) / 2);
    }
}

#[test]
fn e_overtone_in_c3v_is_a1_plus_e() {
    // Source: Wilson, Decius & Cross, §7-3: the first overtone of an E fundamental in C3v is
    // A1 + E (symmetric square), not the plain product A1 + A2 + E.
    let g = group::load("C3v").unwrap();
    let e = g.table.irrep_index("E").unwrap();
    let x = irrep_character(&g, e);
    let s = decompose(&g, &symmetric_square(&g, &x)).unwrap();
    assert_eq!(salcdesk::rep::format_sum(&g, &s, false), "A1 + E");
    let p = decompose(&g, &direct_product(&x, &x)).unwrap();
    assert_eq!(salcdesk::rep::format_sum(&g, &p, false), "A1 + A2 + E");
}

#[test]
fn impossible_characters_are_diagnosed_with_suggestions() {
    // C3v with χ = (3, 0, 2): n(A1) = 3/2 is not whole; changing χ(3σv) to 1 gives A1 + E
    // (hand calculation with Cotton's C3v table).
    let g = group::load("C3v").unwrap();
    let chi = salcdesk::rep::Character::parse(&g, &["3".into(), "0".into(), "2".into()]).unwrap();
    let r = reduce(&g, &chi);
    assert!(!r.is_valid());
    let err = decompose(&g, &chi).unwrap_err();
    assert!(!err.offending.is_empty());
    assert!(err
        .suggestions
        .iter()
        .any(|s| s.class == 2 && s.to == salcdesk::exact::Cyclo::from_int(1)));
}
