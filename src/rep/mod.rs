//! Representations: characters of reducible representations, the exact reduction formula with
//! its worked arithmetic, diagnosis of impossible characters, direct products and symmetric
//! powers, and the linear groups' route through a finite subgroup.
//!
//! Knows groups (from `group`) but not molecules: bases that produce characters live in `basis`.

mod character;
pub mod gamma_text;
mod linear;
mod product;
mod reduce;
mod vibration;

pub use character::{Character, CharacterError, MemberKind};
pub use gamma_text::{
    ascii_label, label_rows, pair_label, parse_irrep, write_term, GammaTerm, GammaTextError,
};
pub use linear::{reduce_linear_unmoved, reduce_via_subgroup, restrictions, LinearReduction};
pub use product::{
    antisymmetric_square, class_power, direct_product, direct_sum, from_multiplicities,
    irrep_character, symmetric_cube, symmetric_square,
};
pub use reduce::{
    decompose, decompose_unmoved, format_sum, parse_gamma, real_terms, reduce, reduce_unmoved,
    suggest, suggest_reduction, suggest_unmoved, Invalid, Line, RealTerm, Reduction, Suggestion,
    Term,
};
pub use vibration::{vibrations_from_gamma_3n, vibrations_from_unmoved, Vibrations};
