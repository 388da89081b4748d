//! What can go wrong reading a Hessian or working out normal modes. Every input error names
//! its file and where in it.

/// Errors of the normal-mode analysis.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum VibError {
    #[error("{file}: {message}")]
    Read { file: String, message: String },
    #[error("{file}:{line}:{column}: {message}")]
    At {
        file: String,
        line: usize,
        column: usize,
        message: String,
    },
    #[error("{file}: {path}: {message}")]
    Json {
        file: String,
        path: String,
        message: String,
    },
    #[error("{file}: wrong size: {message}")]
    Size { file: String, message: String },
    #[error(
        "{file}: the Hessian is not symmetric: H[{row}][{col}] = {a:e} but H[{col}][{row}] = {b:e} \
         (difference {diff:.3e} hartree/bohr², more than the {tolerance:e} allowed)"
    )]
    NotSymmetric {
        file: String,
        row: usize,
        col: usize,
        a: f64,
        b: f64,
        diff: f64,
        tolerance: f64,
    },
    #[error(
        "{file}: units missing: say which with --hessian-units ({}) or a first line `# units: …`",
        super::HessianUnits::NAMES
    )]
    UnitsMissing { file: String },
    #[error(
        "{file}: the Hessian has {hessian} atoms ({rows}×{rows}) but the geometry has {geometry}"
    )]
    AtomsMismatch {
        file: String,
        hessian: usize,
        rows: usize,
        geometry: usize,
    },
    #[error("{0}")]
    Isotope(String),
    #[error("{0}")]
    Symmetry(String),
    #[error("{0}")]
    Input(String),
}

impl VibError {
    pub(crate) fn read(file: &str, message: impl Into<String>) -> Self {
        VibError::Read {
            file: file.to_string(),
            message: message.into(),
        }
    }
}
