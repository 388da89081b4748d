//! Table validation: the checks every shipped table must pass (run by the test-suite for every
//! file, and by `salcdesk check-table FILE` for a new one).
//!
//! Σ d² = h; row and column orthogonality (Cotton, 3rd ed., §4.3, the "great orthogonality
//! theorem" consequences); the traces of the 3×3 matrices against the x, y, z entries; det·trace
//! against Rx, Ry, Rz; the symmetric square and cube of the vector representation against the
//! quadratic and cubic columns; and each function tuple transforming with the listed characters.

use super::functions::tuple_matrix;
use super::matrix::{det, mul, trace};
use super::PointGroup;
use crate::exact::Cyclo;

/// All problems found (empty when the table is consistent).
pub fn validate(g: &PointGroup) -> Vec<String> {
    let mut problems = Vec::new();
    if g.is_linear() {
        return validate_linear(g);
    }
    let t = &g.table;
    let h = g.order();
    let sizes = g.class_sizes();
    let n_classes = t.classes.len();
    if t.irreps.len() != n_classes {
        problems.push(format!(
            "{} irreps but {} classes (they must be equal)",
            t.irreps.len(),
            n_classes
        ));
    }
    if t.order != Some(h) {
        problems.push(format!("order {:?} but {h} operations", t.order));
    }
    let dsq: usize = t.irreps.iter().map(|i| i.dim() * i.dim()).sum();
    if dsq != h {
        problems.push(format!("Σ d² = {dsq}, not the order {h}"));
    }
    // Row orthogonality: Σ_c g_c χ_i(c) χ_j(c)* = h δ_ij.
    for (a, ia) in t.irreps.iter().enumerate() {
        for (b, ib) in t.irreps.iter().enumerate().skip(a) {
            let s: Cyclo = (0..n_classes)
                .map(|c| &(&ia.chars[c] * &ib.chars[c].conj()) * &Cyclo::from_int(sizes[c] as i64))
                .sum();
            let want = Cyclo::from_int(if a == b { h as i64 } else { 0 });
            if s != want {
                problems.push(format!(
                    "rows {} and {} are not orthogonal (sum {s:?})",
                    ia.label, ib.label
                ));
            }
        }
    }
    // Column orthogonality: Σ_i χ_i(c) χ_i(c')* = (h/g_c) δ_cc'.
    for c in 0..n_classes {
        for c2 in c..n_classes {
            let s: Cyclo = t
                .irreps
                .iter()
                .map(|ir| &ir.chars[c] * &ir.chars[c2].conj())
                .sum();
            let want = if c == c2 {
                Cyclo::frac(h as i64, sizes[c].max(1) as i64)
            } else {
                Cyclo::zero()
            };
            if s != want {
                problems.push(format!(
                    "columns {} and {} are not orthogonal",
                    t.classes[c].symbol, t.classes[c2].symbol
                ));
            }
        }
    }
    // Characters of the class representatives must be consistent with the matrices: the
    // function-column checks below use every operation.
    let reps: Vec<usize> = (0..n_classes)
        .map(|c| g.ops.iter().position(|o| o.class == c).unwrap_or(0))
        .collect();
    // Sum over irreps of (#tuples in column) × χ must equal the expected character.
    let column_char = |pick: &dyn Fn(&super::Irrep) -> usize, c: usize| -> Cyclo {
        t.irreps
            .iter()
            .map(|ir| {
                let k = pick(ir) as i64;
                let chi = match ir.pair {
                    Some(p) => &ir.chars[c] + &t.irreps[p].chars[c],
                    None => ir.chars[c].clone(),
                };
                &chi * &Cyclo::from_int(k)
            })
            .sum()
    };
    for (c, &r) in reps.iter().enumerate() {
        let m = &g.ops[r].matrix;
        let tr = trace(m);
        let m2 = mul(m, m);
        let m3 = mul(&m2, m);
        let (t1, t2, t3) = (tr.clone(), trace(&m2), trace(&m3));
        // Symmetric square: (χ(R)² + χ(R²))/2; cube: (χ³ + 3χ(R²)χ(R) + 2χ(R³))/6.
        let sym2 = (&(&t1 * &t1) + &t2) * Cyclo::frac(1, 2);
        let sym3 = (&(&(&t1 * &t1) * &t1)
            + &(&(&t2 * &t1) * &Cyclo::from_int(3))
            + (&t3 * &Cyclo::from_int(2)))
            * Cyclo::frac(1, 6);
        type Column = fn(&super::Irrep) -> &[super::FunctionTuple];
        let checks: [(&str, Cyclo, Column); 4] = [
            ("x, y, z", tr.clone(), |ir| &ir.functions.linear),
            ("Rx, Ry, Rz", &det(m) * &tr, |ir| &ir.functions.rotation),
            ("quadratic", sym2, |ir| &ir.functions.quadratic),
            ("cubic", sym3, |ir| &ir.functions.cubic),
        ];
        for (what, want, column) in checks {
            // Copies of the irrep in the column = listed dimensions / irrep dimension.
            let got = column_char(
                &|ir: &super::Irrep| {
                    let d = ir.dim() * if ir.pair.is_some() { 2 } else { 1 };
                    count_dims(column(ir)) / d.max(1)
                },
                c,
            );
            if got != want {
                problems.push(format!(
                    "{what} column: at {} the listed functions give χ = {got:?}, the matrices give {want:?}",
                    t.classes[c].symbol
                ));
            }
        }
    }
    // Each tuple transforms with its irrep's characters (pairs: with the sum).
    for ir in &t.irreps {
        let want_dim = ir.dim() * if ir.pair.is_some() { 2 } else { 1 };
        for tuple in ir.functions.all() {
            if tuple.dim() != want_dim {
                problems.push(format!(
                    "{}: '{}' has {} partner(s), the irrep needs {want_dim}",
                    ir.label,
                    tuple.text,
                    tuple.dim()
                ));
                continue;
            }
            for op in &g.ops {
                let Some(d) = tuple_matrix(&op.matrix, tuple) else {
                    problems.push(format!(
                        "{}: '{}' is not closed under {}",
                        ir.label, tuple.text, op.name
                    ));
                    break;
                };
                let tr: Cyclo = (0..d.len()).map(|k| d[k][k].clone()).sum();
                let want = match ir.pair {
                    Some(p) => &ir.chars[op.class] + &t.irreps[p].chars[op.class],
                    None => ir.chars[op.class].clone(),
                };
                if tr != want {
                    problems.push(format!(
                        "{}: '{}' has character {tr:?} under {}, the table says {want:?}",
                        ir.label, tuple.text, op.name
                    ));
                    break;
                }
            }
        }
    }
    problems
}

fn count_dims(list: &[super::FunctionTuple]) -> usize {
    list.iter().map(|t| t.dim()).sum()
}

fn validate_linear(g: &PointGroup) -> Vec<String> {
    let mut problems = Vec::new();
    let t = &g.table;
    match t.descent.as_deref() {
        Some("C2v") | Some("D2h") => {}
        other => problems.push(format!(
            "linear group needs descent = \"C2v\" or \"D2h\", found {other:?}"
        )),
    }
    if t.irreps.is_empty() {
        problems.push("no irreps".into());
    }
    problems
}
