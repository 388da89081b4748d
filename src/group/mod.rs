//! Point groups: character tables loaded from `tables/`, every operation generated as an exact
//! 3×3 matrix, conjugacy classes checked against the table.
//!
//! Owns the table schema, the operations and their classes, and table validation. Refuses to
//! know about molecules, bases or reduction (see `rep`).

mod functions;
mod generate;
mod matrix;
mod registry;
mod table;
pub mod validate;

pub use functions::{act, parse_tuple, tuple_matrices, tuple_matrix, FunctionTuple, Poly};
pub use generate::{op_matrix, strip_count, SymOp};
pub use matrix::{det as mat_det, mul as mat_mul, to_float, trace as mat_trace, Mat3};
pub use registry::{canonical_name, load, names};
pub use table::{
    display_label, parse_table, CharacterTable, ClassInfo, Family, Functions, Irrep, OpSpec,
    TableError, Turn,
};

use crate::exact::QuickMap;
use nalgebra::Matrix3;
use std::sync::OnceLock;

/// Errors when loading a group.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum PointGroupError {
    #[error("unknown point group '{name}': {hint}")]
    Unknown { name: String, hint: String },
    #[error(transparent)]
    Table(#[from] TableError),
    #[error("{file}: the table does not describe a group: {message}")]
    Inconsistent { file: String, message: String },
}

/// A point group: its character table and all its operations.
#[derive(Debug)]
pub struct PointGroup {
    pub table: CharacterTable,
    /// Operations sorted by class (identity first). Empty for the linear groups.
    pub ops: Vec<SymOp>,
    products: OnceLock<Vec<Vec<usize>>>,
    inverses: OnceLock<Vec<usize>>,
    by_key: OnceLock<OpLookup>,
}

/// A hash key for an operation matrix: entries rounded to 1/1000 (the entries of point-group
/// operations are cosines and sines of whole fractions of a turn, never near a rounding
/// boundary of this grid in practice; a miss falls back to a full search).
fn op_key(m: &Matrix3<f64>) -> [i32; 9] {
    std::array::from_fn(|k| (m[(k / 3, k % 3)] * 1000.0).round() as i32)
}

/// Operations by their rounded matrices ([`op_key`]): a lookup instead of a scan of every
/// operation; a key miss next to a rounding boundary falls back to the scan, so nothing is
/// ever missed. Used for a group's operations and while generating them.
#[derive(Debug, Default)]
pub(crate) struct OpLookup(QuickMap<[i32; 9], usize>);

impl OpLookup {
    /// Record operation `at` (the first one recorded wins a key).
    pub(crate) fn add(&mut self, m: &Matrix3<f64>, at: usize) {
        self.0.entry(op_key(m)).or_insert(at);
    }
    /// The index of the operation within 1e-6 of `m` among the `n` operations `float(i)`.
    pub(crate) fn find(
        &self,
        m: &Matrix3<f64>,
        n: usize,
        float: impl Fn(usize) -> Matrix3<f64>,
    ) -> Option<usize> {
        let near = |i: usize| (float(i) - m).abs().max() < 1e-6;
        match self.0.get(&op_key(m)) {
            Some(&i) if near(i) => Some(i),
            _ => (0..n).find(|&i| near(i)),
        }
    }
}

impl PointGroup {
    /// Parse and generate a group from table text.
    pub fn from_toml(file: &str, text: &str) -> Result<Self, PointGroupError> {
        let table = parse_table(file, text)?;
        let ops = if table.is_linear() {
            Vec::new()
        } else {
            generate::generate(&table).map_err(|message| PointGroupError::Inconsistent {
                file: file.to_string(),
                message,
            })?
        };
        Ok(PointGroup {
            table,
            ops,
            products: OnceLock::new(),
            inverses: OnceLock::new(),
            by_key: OnceLock::new(),
        })
    }

    /// ASCII name, e.g. `C3v`.
    pub fn name(&self) -> &str {
        &self.table.name
    }
    /// Group order h (0 for the linear groups).
    pub fn order(&self) -> usize {
        self.ops.len()
    }
    pub fn is_linear(&self) -> bool {
        self.table.is_linear()
    }
    pub fn n_classes(&self) -> usize {
        self.table.classes.len()
    }
    pub fn class_sizes(&self) -> Vec<usize> {
        self.table.classes.iter().map(|c| c.size).collect()
    }
    /// Index of the operation with this floating-point matrix (tolerance 1e-6).
    pub fn op_index(&self, m: &Matrix3<f64>) -> Option<usize> {
        let lookup = self.by_key.get_or_init(|| {
            let mut map = OpLookup::default();
            for (i, o) in self.ops.iter().enumerate() {
                map.add(&o.float, i);
            }
            map
        });
        lookup.find(m, self.ops.len(), |i| self.ops[i].float)
    }
    /// Multiplication table: `product(a, b)` = index of ops[a]·ops[b].
    pub fn product(&self, a: usize, b: usize) -> usize {
        self.products.get_or_init(|| {
            self.ops
                .iter()
                .map(|x| {
                    self.ops
                        .iter()
                        .map(|y| {
                            self.op_index(&(x.float * y.float))
                                .expect("group is closed")
                        })
                        .collect()
                })
                .collect()
        })[a][b]
    }
    /// Index of the inverse of ops[a].
    pub fn inverse(&self, a: usize) -> usize {
        self.inverses.get_or_init(|| {
            (0..self.ops.len())
                .map(|x| {
                    self.op_index(&self.ops[x].float.transpose())
                        .expect("group contains inverses")
                })
                .collect()
        })[a]
    }
    /// The character of irrep `i` on operation `op`.
    pub fn character(&self, irrep: usize, op: usize) -> &crate::exact::Cyclo {
        &self.table.irreps[irrep].chars[self.ops[op].class]
    }
}
#[cfg(test)]
mod tests;
