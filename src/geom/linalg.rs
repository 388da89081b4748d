//! Small 3×3 linear-algebra helpers for symmetry work: rotations, reflections, improper
//! rotations, a cyclic Jacobi eigensolver for small symmetric matrices (robust for the
//! nearly diagonal, degenerate matrices symmetric molecules produce), best-fit rotation by
//! Horn's quaternion method (B. K. P. Horn, J. Opt. Soc. Am. A 4, 629 (1987)), rotation
//! axis extraction and group closure of generator matrices.

use nalgebra::{Matrix3, Vector3};

pub(crate) type V3 = Vector3<f64>;
pub(crate) type M3 = Matrix3<f64>;

/// Rotation by `angle` (radians, right-handed) about unit-or-not `axis` (Rodrigues).
pub(crate) fn rotation(axis: &V3, angle: f64) -> M3 {
    let u = axis.normalize();
    let (s, c) = angle.sin_cos();
    let k = M3::new(0.0, -u.z, u.y, u.z, 0.0, -u.x, -u.y, u.x, 0.0);
    M3::identity() + k * s + k * k * (1.0 - c)
}

/// Reflection through the plane with normal `normal`.
pub(crate) fn reflection(normal: &V3) -> M3 {
    let n = normal.normalize();
    M3::identity() - 2.0 * n * n.transpose()
}

/// Improper rotation S(angle) = σ(axis) · C(angle) about `axis`.
pub(crate) fn improper(axis: &V3, angle: f64) -> M3 {
    reflection(axis) * rotation(axis, angle)
}

/// Eigenvalues (ascending) and unit eigenvectors of a symmetric N×N matrix, by cyclic
/// Jacobi rotations.
pub(crate) fn jacobi<const N: usize>(m: [[f64; N]; N]) -> ([f64; N], [[f64; N]; N]) {
    let mut a = m;
    let mut v = [[0.0; N]; N];
    for (i, row) in v.iter_mut().enumerate() {
        row[i] = 1.0;
    }
    for _sweep in 0..60 {
        let off: f64 = (0..N)
            .flat_map(|i| (0..N).filter(move |&j| j != i).map(move |j| (i, j)))
            .map(|(i, j)| a[i][j] * a[i][j])
            .sum();
        let scale: f64 = (0..N).map(|i| a[i][i] * a[i][i]).sum::<f64>() + off;
        if off <= 1e-30 * scale.max(1e-300) || !off.is_finite() {
            break;
        }
        for p in 0..N {
            for q in p + 1..N {
                if a[p][q].abs() < 1e-300 {
                    continue;
                }
                let theta = (a[q][q] - a[p][p]) / (2.0 * a[p][q]);
                let t = theta.signum() / (theta.abs() + (theta * theta + 1.0).sqrt());
                let t = if theta == 0.0 { 1.0 } else { t };
                let c = 1.0 / (t * t + 1.0).sqrt();
                let s = t * c;
                for row in a.iter_mut() {
                    let (akp, akq) = (row[p], row[q]);
                    row[p] = c * akp - s * akq;
                    row[q] = s * akp + c * akq;
                }
                let (rp, rq) = (a[p], a[q]);
                for k in 0..N {
                    a[p][k] = c * rp[k] - s * rq[k];
                    a[q][k] = s * rp[k] + c * rq[k];
                }
                for row in v.iter_mut() {
                    let (vp, vq) = (row[p], row[q]);
                    row[p] = c * vp - s * vq;
                    row[q] = s * vp + c * vq;
                }
            }
        }
    }
    let mut idx: [usize; N] = [0; N];
    for (i, x) in idx.iter_mut().enumerate() {
        *x = i;
    }
    idx.sort_by(|&i, &j| a[i][i].total_cmp(&a[j][j]));
    let mut vals = [0.0; N];
    let mut vecs = [[0.0; N]; N];
    for (k, &i) in idx.iter().enumerate() {
        vals[k] = a[i][i];
        for r in 0..N {
            vecs[k][r] = v[r][i];
        }
    }
    (vals, vecs)
}

/// Eigenvalues (ascending) and eigenvectors of a symmetric 3×3 matrix.
pub(crate) fn sym_eigen(m: &M3) -> ([f64; 3], [V3; 3]) {
    let a = [
        [m[(0, 0)], m[(0, 1)], m[(0, 2)]],
        [m[(1, 0)], m[(1, 1)], m[(1, 2)]],
        [m[(2, 0)], m[(2, 1)], m[(2, 2)]],
    ];
    let (vals, vecs) = jacobi(a);
    (vals, vecs.map(|c| V3::new(c[0], c[1], c[2])))
}

/// Rotation R minimising Σ |R·src_i − dst_i|² (points already centred), Horn's method.
pub(crate) fn kabsch(src: &[V3], dst: &[V3]) -> M3 {
    let mut s = M3::zeros();
    for (a, b) in src.iter().zip(dst) {
        s += a * b.transpose();
    }
    let (xx, xy, xz) = (s[(0, 0)], s[(0, 1)], s[(0, 2)]);
    let (yx, yy, yz) = (s[(1, 0)], s[(1, 1)], s[(1, 2)]);
    let (zx, zy, zz) = (s[(2, 0)], s[(2, 1)], s[(2, 2)]);
    let n = [
        [xx + yy + zz, yz - zy, zx - xz, xy - yx],
        [yz - zy, xx - yy - zz, xy + yx, zx + xz],
        [zx - xz, xy + yx, -xx + yy - zz, yz + zy],
        [xy - yx, zx + xz, yz + zy, -xx - yy + zz],
    ];
    let (_, vecs) = jacobi(n);
    let q = vecs[3];
    let norm = q.iter().map(|x| x * x).sum::<f64>().sqrt();
    if !(norm.is_finite() && norm > 0.5) {
        return M3::identity();
    }
    let [w, x, y, z] = q.map(|c| c / norm);
    M3::new(
        w * w + x * x - y * y - z * z,
        2.0 * (x * y - w * z),
        2.0 * (x * z + w * y),
        2.0 * (x * y + w * z),
        w * w - x * x + y * y - z * z,
        2.0 * (y * z - w * x),
        2.0 * (x * z - w * y),
        2.0 * (y * z + w * x),
        w * w - x * x - y * y + z * z,
    )
}

/// Axis of a proper rotation with the sign of `hint`: from the antisymmetric part when
/// the angle is clearly below π, else from (R + Rᵀ)/2 − cos θ·I = (1 − cos θ)·u·uᵀ.
pub(crate) fn rotation_axis(r: &M3, hint: &V3) -> V3 {
    let w = V3::new(
        r[(2, 1)] - r[(1, 2)],
        r[(0, 2)] - r[(2, 0)],
        r[(1, 0)] - r[(0, 1)],
    );
    let c = ((r.trace() - 1.0) / 2.0).clamp(-1.0, 1.0);
    let u = if w.norm() > 0.5 {
        w
    } else {
        let b = (r + r.transpose()) * 0.5 - M3::identity() * c;
        let k = (0..3)
            .max_by(|&i, &j| b.column(i).norm().total_cmp(&b.column(j).norm()))
            .unwrap_or(0);
        b.column(k).into_owned()
    };
    let u = if u.dot(hint) < 0.0 { -u } else { u };
    if u.iter().all(|x| x.is_finite()) && u.norm() > 1e-9 {
        u.normalize()
    } else {
        hint.normalize()
    }
}

/// Some unit vector perpendicular to `v`, preferring the projection of `prefer`.
pub(crate) fn perpendicular(v: &V3, prefer: &V3) -> V3 {
    let z = v.normalize();
    for cand in [*prefer, V3::x(), V3::y(), V3::z()] {
        let p = cand - z * z.dot(&cand);
        if p.norm() > 0.3 {
            return p.normalize();
        }
    }
    V3::x()
}

/// Whether two matrices agree entrywise within `eps`.
pub(crate) fn close(a: &M3, b: &M3, eps: f64) -> bool {
    (a - b).iter().all(|x| x.abs() <= eps)
}

/// Whether `m` is orthogonal within `eps` (and finite).
pub(crate) fn is_orthogonal(m: &M3, eps: f64) -> bool {
    m.iter().all(|x| x.is_finite()) && close(&(m.transpose() * m), &M3::identity(), eps)
}

/// One element of a generated group: the matrix and how it was reached
/// (`parent` index, `generator` index; the identity has neither).
pub(crate) struct Closure {
    pub ops: Vec<M3>,
    /// `(parent, generator)` with `ops[i] = gens[generator] * ops[parent]`.
    pub tree: Vec<Option<(usize, usize)>>,
}

/// The group generated by `gens` (breadth-first, identity first), or `None` if it grows
/// beyond `cap` elements (the generators are then not a finite point group).
pub(crate) fn closure(gens: &[M3], cap: usize) -> Option<Closure> {
    let mut ops = vec![M3::identity()];
    let mut tree = vec![None];
    let mut i = 0;
    while i < ops.len() {
        for (gi, g) in gens.iter().enumerate() {
            let m = g * ops[i];
            if !ops.iter().any(|o| close(o, &m, 1e-6)) {
                if ops.len() >= cap {
                    return None;
                }
                ops.push(m);
                tree.push(Some((i, gi)));
            }
        }
        i += 1;
    }
    Some(Closure { ops, tree })
}
