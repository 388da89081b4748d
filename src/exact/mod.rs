//! Exact numbers: the cyclotomic field elements that characters, operation matrices and SALC
//! coefficients are made of, with salcdesk's text notation for them.
//!
//! Owns: arithmetic in Q(ζₙ) over big rationals ([`Cyclo`]), exact square roots where they are
//! cyclotomic, parsing ([`parse`]) and printing ([`Cyclo::text`]). Knows nothing of groups.
//!
//! Notation (documented in README): `-1`, `1/2`, `sqrt(5)` or `√5`, `2cos(2pi/5)`, `sin(pi/4)`,
//! `exp(2pi i/3)` or `exp(2πi/3)`, `i`, with `+ - * / ^` and parentheses; a number written
//! directly before a function or parenthesis multiplies it.

mod cyclo;
mod kvec;
mod linsolve;
mod parse;
mod poly;
mod print;
mod quickhash;
mod rat;
mod sqrt;
mod subfield;

pub use cyclo::{rational_to_f64, Cyclo, CycloKey};
pub use kvec::{gcd_of, KField, KInt, KTable, KVec, MulMatrix};
pub use linsolve::{solve as solve_rational, solve_field};
pub use parse::{parse, parse_with_phi, ParseError};
pub use print::{decimal, format_rational};
pub use quickhash::{QuickMap, QuickSet};
pub use sqrt::{rationalize, sqrt, sqrt_rational, SqrtError};
pub use subfield::{candidates as field_candidates, FieldSpec};

/// How to write numbers: Unicode (√, π, −, subscripts) or plain ASCII.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Notation {
    #[default]
    Unicode,
    Ascii,
}

impl Cyclo {
    /// Exact text in the given notation; `parse` reads it back to the same number.
    pub fn text(&self, nt: Notation) -> String {
        print::format(self, nt)
    }
    /// Decimal approximation for display beside the exact form.
    pub fn decimal(&self) -> String {
        print::decimal(self)
    }
}

#[cfg(test)]
mod tests;
