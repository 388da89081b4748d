//! The typed errors of the spectroscopy layer. Every error names where the problem is: the
//! column of a Γ text, the line of a band file, the group and class of a descent.

use crate::group::PointGroupError;

/// Errors of `spectra`.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum SpectraError {
    #[error(transparent)]
    Group(#[from] PointGroupError),
    #[error("{group} has {expected} irreps; {found} multiplicities given")]
    WrongLength {
        group: String,
        expected: usize,
        found: usize,
    },
    #[error(
        "{group}: {first} and {second} are a complex-conjugate pair and form one real \
         representation; their multiplicities must be equal ({m1} ≠ {m2})"
    )]
    UnpairedComplex {
        group: String,
        first: String,
        second: String,
        m1: u64,
        m2: u64,
    },
    #[error("column {column}: '{label}' is not an irrep of {group} (irreps: {known})")]
    UnknownIrrep {
        group: String,
        label: String,
        column: usize,
        known: String,
    },
    #[error("column {column}: {message}")]
    BadTerm { column: usize, message: String },
    #[error("{group}: {message}")]
    Unsupported { group: String, message: String },
    #[error("{group} has no subgroup of type {subgroup}: {reason}")]
    NotASubgroup {
        group: String,
        subgroup: String,
        reason: String,
    },
    #[error("{group} has no class '{via}' (classes: {known})")]
    NoSuchClass {
        group: String,
        via: String,
        known: String,
    },
    #[error("'{via}' matches several classes of {group}: {matches}; write one of them in full")]
    AmbiguousClass {
        group: String,
        via: String,
        matches: String,
    },
    #[error("fundamental {index} ({irrep} at {position} cm⁻¹): {message}")]
    BadFundamental {
        index: usize,
        irrep: String,
        position: String,
        message: String,
    },
    #[error(
        "{fundamentals} fundamentals give {levels} overtone and combination levels, more than \
         the {limit} listed at once: give the fundamentals' positions and an upper wavenumber \
         limit to keep the low-lying levels, or list fewer fundamentals"
    )]
    TooManyLevels {
        fundamentals: usize,
        levels: usize,
        limit: usize,
    },
    #[error("{group}: internal inconsistency: {message}")]
    Internal { group: String, message: String },
}

impl From<crate::rep::GammaTextError> for SpectraError {
    fn from(e: crate::rep::GammaTextError) -> Self {
        use crate::rep::GammaTextError as G;
        match e {
            G::Unknown {
                group,
                label,
                column,
                known,
            } => SpectraError::UnknownIrrep {
                group,
                label,
                column,
                known,
            },
            G::Empty => SpectraError::BadTerm {
                column: 1,
                message: e.to_string(),
            },
            G::EmptyTerm { column } | G::BadCount { column, .. } | G::Ambiguous { column, .. } => {
                let full = e.to_string();
                let prefix = format!("column {column}: ");
                SpectraError::BadTerm {
                    column,
                    message: full.strip_prefix(&prefix).unwrap_or(&full).to_string(),
                }
            }
        }
    }
}
