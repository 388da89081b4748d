//! Placing a subgroup type H in its standard orientation onto a concrete subgroup K of G: an
//! orthogonal Q with Q·h·Qᵀ ∈ K for every standard operation h of H. Through Q each element
//! of K gets H's class, so H's labels (B1 vs B2, C2' vs C2'') mean what H's table means.
//!
//! Q is built from two non-parallel symmetry axes: the first axis u₁ of H (an operation of
//! highest order) and the first axis u₂ not parallel to it are sent to axes of K's operations of
//! the same kind (det, trace) at the same angle. When all of H's operations share one axis,
//! any frame around that axis does. Q = 1 is tried first, so a subgroup already standing in
//! H's orientation keeps G's own x, y, z. Geometry is in floating point (entries ≤ 1, matched
//! to 1e-6); characters stay exact.
//!
//! Owns: finding Q and the class of each element of K in H.

use super::subgroups::op_signature;
use crate::group::PointGroup;
use nalgebra::{Matrix3, Vector3};

const TOL: f64 = 1e-6;

/// The axis of an operation (rotation axis of det·R), or None for E and i.
fn axis(m: &Matrix3<f64>) -> Option<Vector3<f64>> {
    let p = m * m.determinant().signum();
    if (p - Matrix3::identity()).abs().max() < TOL {
        return None;
    }
    let skew = Vector3::new(
        p[(2, 1)] - p[(1, 2)],
        p[(0, 2)] - p[(2, 0)],
        p[(1, 0)] - p[(0, 1)],
    );
    if skew.norm() > TOL {
        return Some(skew.normalize());
    }
    // A half-turn: p = 2nnᵀ − 1.
    let s = (p + Matrix3::identity()) * 0.5;
    let k = (0..3)
        .max_by(|&a, &b| s[(a, a)].total_cmp(&s[(b, b)]))
        .unwrap_or(0);
    Some(s.column(k).normalize())
}

fn frame(u1: &Vector3<f64>, u2: Option<&Vector3<f64>>) -> Matrix3<f64> {
    let e1 = u1.normalize();
    let helper = match u2 {
        Some(v) => *v,
        None if e1.x.abs() < 0.9 => Vector3::x(),
        None => Vector3::y(),
    };
    let e2 = (helper - e1 * helper.dot(&e1)).normalize();
    let e3 = e1.cross(&e2);
    Matrix3::from_columns(&[e1, e2, e3])
}

/// Indices into `h.ops` of its operations' images in G under Q, if all land in `k`.
fn images(g: &PointGroup, h: &PointGroup, k: &[usize], q: &Matrix3<f64>) -> Option<Vec<usize>> {
    h.ops
        .iter()
        .map(|o| {
            let m = q * o.float * q.transpose();
            g.op_index(&m).filter(|i| k.binary_search(i).is_ok())
        })
        .collect()
}

/// For each element of `k` (same order), its class in H; None if no Q is found.
pub fn classes_in_subgroup(g: &PointGroup, h: &PointGroup, k: &[usize]) -> Option<Vec<usize>> {
    if h.order() != k.len() {
        return None;
    }
    let q = find_q(g, h, k)?;
    let img = images(g, h, k, &q)?;
    // img[j] = index in G of Q·h_j·Qᵀ; invert.
    k.iter()
        .map(|gi| img.iter().position(|x| x == gi).map(|j| h.ops[j].class))
        .collect()
}

/// For each operation of H (`h.ops` order), the operation of G it is placed on inside `k`;
/// None if no Q is found.
pub(crate) fn place(g: &PointGroup, h: &PointGroup, k: &[usize]) -> Option<Vec<usize>> {
    if h.order() != k.len() {
        return None;
    }
    images(g, h, k, &find_q(g, h, k)?)
}

fn find_q(g: &PointGroup, h: &PointGroup, k: &[usize]) -> Option<Matrix3<f64>> {
    let id = Matrix3::identity();
    if images(g, h, k, &id).is_some() {
        return Some(id);
    }
    // H's reference axes, the smallest turn of det·R (the highest order) first.
    let mut h_axes: Vec<(Vector3<f64>, (i8, i64))> = h
        .ops
        .iter()
        .filter_map(|o| axis(&o.float).map(|a| (a, op_signature(&o.float))))
        .collect();
    if h_axes.is_empty() {
        return None; // C1, Ci: Q = 1 would have worked
    }
    h_axes.sort_by_key(|(_, (det, tr))| -(*det as i64) * tr);
    let (u1, s1) = h_axes[0];
    let second = h_axes
        .iter()
        .find(|(a, _)| a.cross(&u1).norm() > 1e-4)
        .copied();
    let e = frame(&u1, second.as_ref().map(|(a, _)| a));
    let k_axes: Vec<(Vector3<f64>, (i8, i64))> = k
        .iter()
        .filter_map(|&i| {
            let m = &g.ops[i].float;
            axis(m).map(|a| (a, op_signature(m)))
        })
        .collect();
    for (v1, t1) in &k_axes {
        if *t1 != s1 {
            continue;
        }
        for v1 in [*v1, -*v1] {
            match second {
                None => {
                    let q = frame(&v1, None) * e.transpose();
                    if images(g, h, k, &q).is_some() {
                        return Some(q);
                    }
                }
                Some((u2, s2)) => {
                    let cos = u1.dot(&u2);
                    for (v2, t2) in &k_axes {
                        if *t2 != s2 {
                            continue;
                        }
                        for v2 in [*v2, -*v2] {
                            if (v1.dot(&v2) - cos).abs() > 1e-6 {
                                continue;
                            }
                            let q = frame(&v1, Some(&v2)) * e.transpose();
                            if images(g, h, k, &q).is_some() {
                                return Some(q);
                            }
                        }
                    }
                }
            }
        }
    }
    None
}
