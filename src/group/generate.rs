//! From a table's class representatives to the whole group: every operation as an exact and a
//! floating-point 3×3 matrix, partitioned into conjugacy classes in the table's class order.
//!
//! Closure is found by multiplying floating-point matrices (entries ≤ 1, so a 1e-6 match is
//! unambiguous) while the exact matrices are carried along; classes are conjugacy orbits
//! g·x·g⁻¹. A table whose representatives do not close to `order` operations, or whose classes
//! do not match, is refused.

use super::matrix::{self, Mat3};
use super::table::{CharacterTable, OpSpec, Turn};
use super::OpLookup;
use crate::exact::Cyclo;
use nalgebra::Matrix3;

/// One operation of a point group.
#[derive(Debug, Clone)]
pub struct SymOp {
    /// Exact matrix in the standard orientation.
    pub matrix: Mat3,
    /// The same matrix in floating point.
    pub float: Matrix3<f64>,
    /// Index of its class in the table.
    pub class: usize,
    /// A readable name, e.g. `C₃`, `C₃²`, `σᵥ(2)`.
    pub name: String,
}

impl SymOp {
    /// Proper rotation (det = +1)?
    pub fn is_proper(&self) -> bool {
        self.float.determinant() > 0.0
    }
}

/// Build the exact matrix of a representative (finite groups only).
pub fn op_matrix(spec: &OpSpec) -> Result<Mat3, String> {
    let fixed = |t: &Turn| match t {
        Turn::Fixed(q) => Ok(q.clone()),
        Turn::Phi => Err("φ-rotations have no single matrix".to_string()),
    };
    let m = match spec {
        OpSpec::Identity => matrix::identity(),
        OpSpec::Inversion => matrix::scale(&matrix::identity(), &Cyclo::from_int(-1)),
        OpSpec::Reflection { normal } => matrix::reflection(normal).map_err(|e| e.to_string())?,
        OpSpec::Rotation { axis, turn } => {
            matrix::rotation(axis, &fixed(turn)?).map_err(|e| e.to_string())?
        }
        OpSpec::Improper { axis, turn } => {
            matrix::improper(axis, &fixed(turn)?).map_err(|e| e.to_string())?
        }
    };
    Ok(matrix::shrink(&m))
}

/// Generate all operations and their classes. Errors describe what does not match the table.
pub fn generate(table: &CharacterTable) -> Result<Vec<SymOp>, String> {
    let order = table
        .order
        .ok_or("the linear groups have no finite operation list")?;
    let reps: Vec<Mat3> = table
        .classes
        .iter()
        .map(|c| op_matrix(&c.op).map_err(|e| format!("class {}: {e}", c.symbol)))
        .collect::<Result<_, _>>()?;
    let rep_f: Vec<Matrix3<f64>> = reps.iter().map(matrix::to_float).collect();
    // Closure.
    let mut exact: Vec<Mat3> = vec![matrix::identity()];
    let mut float: Vec<Matrix3<f64>> = vec![Matrix3::identity()];
    let mut keys = OpLookup::default();
    keys.add(&float[0], 0);
    let mut frontier = 0;
    while frontier < float.len() {
        let (fx, ex) = (float[frontier], exact[frontier].clone());
        for (g, ge) in rep_f.iter().zip(&reps) {
            let p = g * fx;
            if keys.find(&p, float.len(), |i| float[i]).is_none() {
                keys.add(&p, float.len());
                float.push(p);
                exact.push(matrix::shrink(&matrix::mul(ge, &ex)));
                if float.len() > order {
                    return Err(format!(
                        "the representatives generate more than {order} operations"
                    ));
                }
            }
        }
        frontier += 1;
    }
    if float.len() != order {
        return Err(format!(
            "the representatives generate {} operations, the table says {order}",
            float.len()
        ));
    }
    // Conjugacy classes.
    let find = |m: &Matrix3<f64>| keys.find(m, float.len(), |i| float[i]);
    let mut class_of = vec![usize::MAX; order];
    for (k, rf) in rep_f.iter().enumerate() {
        let idx = find(rf).ok_or("a representative is not in the group")?;
        if class_of[idx] != usize::MAX {
            return Err(format!(
                "classes {} and {} have conjugate representatives",
                table.classes[class_of[idx]].symbol, table.classes[k].symbol
            ));
        }
        let mut size = 0;
        for g in &float {
            let c = g * rf * g.transpose();
            let j = find(&c).ok_or("conjugate outside the group")?;
            if class_of[j] == usize::MAX {
                class_of[j] = k;
                size += 1;
            } else if class_of[j] != k {
                return Err(format!(
                    "classes {} and {} overlap",
                    table.classes[class_of[j]].symbol, table.classes[k].symbol
                ));
            }
        }
        if size != table.classes[k].size {
            return Err(format!(
                "class {} has {size} operations, the table says {}",
                table.classes[k].symbol, table.classes[k].size
            ));
        }
    }
    if let Some(j) = class_of.iter().position(|c| *c == usize::MAX) {
        return Err(format!(
            "operation {:?} belongs to no listed class",
            float[j].as_slice()
        ));
    }
    // Order: by class, identity first; name within a class.
    let mut ops: Vec<SymOp> = float
        .into_iter()
        .zip(exact)
        .zip(class_of)
        .map(|((f, e), class)| SymOp {
            matrix: e,
            float: f,
            class,
            name: String::new(),
        })
        .collect();
    ops.sort_by_key(|o| o.class);
    name_operations(table, &mut ops);
    Ok(ops)
}

/// `C₃`, `C₃²` for rotations about one axis; otherwise the class symbol with a running number.
fn name_operations(table: &CharacterTable, ops: &mut [SymOp]) {
    let mut k = 0;
    while k < ops.len() {
        let class = ops[k].class;
        let end = ops[k..]
            .iter()
            .position(|o| o.class != class)
            .map(|p| k + p)
            .unwrap_or(ops.len());
        let base = strip_count(&table.classes[class].symbol);
        let n = end - k;
        for (j, op) in ops[k..end].iter_mut().enumerate() {
            op.name = if n == 1 {
                base.clone()
            } else {
                format!("{base}({})", j + 1)
            };
        }
        k = end;
    }
}

/// `3σᵥ` → `σᵥ`, `2C₃²` → `C₃²`.
pub fn strip_count(symbol: &str) -> String {
    symbol
        .trim_start_matches(|c: char| c.is_ascii_digit())
        .to_string()
}
