//! A uniform spatial grid over 3-D points (a dense array of cells over the bounding box,
//! filled by counting sort) so that "which points lie within r of p" costs O(1) per query
//! for molecular densities. Used by bond perception and by every symmetry check.
//!
//! The cell edge is the one asked for, enlarged when the box would need more than about
//! 8 cells per point (sparse or far-flung inputs): a larger cell only makes queries scan
//! more points, never miss one.

use nalgebra::Vector3;

/// Points bucketed into cubic cells of edge `1 / inv`.
pub(crate) struct Grid {
    inv: f64,
    /// Lower corner of the box.
    origin: [f64; 3],
    /// Cells per axis.
    dims: [usize; 3],
    points: Vec<Vector3<f64>>,
    /// `start[c]..start[c + 1]` indexes `order` for cell `c`.
    start: Vec<u32>,
    order: Vec<u32>,
}

/// Cell coordinate of `t = (x − origin)·inv`, or `None` outside `0..dim` (NaN included).
#[inline]
fn cell_in(t: f64, dim: usize) -> Option<usize> {
    // `as` truncates toward zero, which is floor for t ≥ 0.
    (t >= 0.0 && t < dim as f64).then_some(t as usize)
}

impl Grid {
    /// Buckets `points` into cells of edge `cell` (> 0; enlarged for sparse inputs).
    pub(crate) fn new(points: &[Vector3<f64>], cell: f64) -> Grid {
        let mut cell = if cell.is_finite() && cell > 0.0 {
            cell
        } else {
            1.0
        };
        let mut lo = [f64::INFINITY; 3];
        let mut hi = [f64::NEG_INFINITY; 3];
        for p in points {
            for d in 0..3 {
                if p[d].is_finite() {
                    lo[d] = lo[d].min(p[d]);
                    hi[d] = hi[d].max(p[d]);
                }
            }
        }
        if lo.iter().any(|x| !x.is_finite()) {
            lo = [0.0; 3];
            hi = [0.0; 3];
        }
        let limit = (8 * points.len()).max(4096) as f64;
        let count = |c: f64| -> f64 {
            (0..3)
                .map(|d| ((hi[d] - lo[d]) / c).floor() + 1.0)
                .product()
        };
        while count(cell) > limit {
            cell *= 1.5;
        }
        let inv = 1.0 / cell;
        let dims = [0, 1, 2].map(|d| ((hi[d] - lo[d]) * inv) as usize + 1);
        let n_cells = dims[0] * dims[1] * dims[2];
        let index = |p: &Vector3<f64>| -> usize {
            let c = [0, 1, 2].map(|d| cell_in((p[d] - lo[d]) * inv, dims[d]).unwrap_or(0));
            (c[0] * dims[1] + c[1]) * dims[2] + c[2]
        };
        let mut start = vec![0u32; n_cells + 1];
        let cells: Vec<usize> = points.iter().map(index).collect();
        for &c in &cells {
            start[c + 1] += 1;
        }
        for c in 0..n_cells {
            start[c + 1] += start[c];
        }
        let mut fill = start.clone();
        let mut order = vec![0u32; points.len()];
        for (i, &c) in cells.iter().enumerate() {
            order[fill[c] as usize] = i as u32;
            fill[c] += 1;
        }
        Grid {
            inv,
            origin: lo,
            dims,
            points: points.to_vec(),
            start,
            order,
        }
    }

    /// Calls `f(index, distance)` for every point within `r` of `p`.
    pub(crate) fn for_each_within(&self, p: &Vector3<f64>, r: f64, mut f: impl FnMut(usize, f64)) {
        if r.is_nan() || r < 0.0 {
            return;
        }
        let mut lo = [0usize; 3];
        let mut hi = [0usize; 3];
        for d in 0..3 {
            let a = (p[d] - r - self.origin[d]) * self.inv;
            let b = (p[d] + r - self.origin[d]) * self.inv;
            let top = self.dims[d] as f64;
            if !(b >= 0.0 && a < top) {
                return; // the query box misses the grid (or NaN)
            }
            lo[d] = if a <= 0.0 { 0 } else { a as usize };
            hi[d] = if b >= top {
                self.dims[d] - 1
            } else {
                b as usize
            };
        }
        let r2 = r * r;
        for kx in lo[0]..=hi[0] {
            for ky in lo[1]..=hi[1] {
                let row = (kx * self.dims[1] + ky) * self.dims[2];
                let (s, e) = (
                    self.start[row + lo[2]] as usize,
                    self.start[row + hi[2] + 1] as usize,
                );
                for &i in &self.order[s..e] {
                    let d2 = (self.points[i as usize] - p).norm_squared();
                    if d2 <= r2 * (1.0 + 1e-9) {
                        let d = d2.sqrt();
                        if d <= r {
                            f(i as usize, d);
                        }
                    }
                }
            }
        }
    }

    /// The nearest point within `r` of `p` accepted by `accept`, with its distance.
    pub(crate) fn nearest(
        &self,
        p: &Vector3<f64>,
        r: f64,
        accept: impl Fn(usize) -> bool,
    ) -> Option<(usize, f64)> {
        let mut best: Option<(usize, f64)> = None;
        self.for_each_within(p, r, |i, d| {
            if accept(i) && best.is_none_or(|(_, bd)| d < bd) {
                best = Some((i, d));
            }
        });
        best
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Every query answer equals a brute-force scan (random points, radii and centres,
    /// including far-flung and coincident points).
    #[test]
    fn matches_brute_force() {
        let mut seed = 12345u64;
        let mut rnd = || {
            seed = seed
                .wrapping_mul(6364136223846793005)
                .wrapping_add(1442695040888963407);
            ((seed >> 11) as f64 / (1u64 << 53) as f64) * 2.0 - 1.0
        };
        for case in 0..40 {
            let n = 1 + case * 7;
            let spread = [0.5, 5.0, 50.0, 1e5][case % 4];
            let mut pts: Vec<Vector3<f64>> = (0..n)
                .map(|_| Vector3::new(rnd(), rnd(), rnd()) * spread)
                .collect();
            pts.push(pts[0]);
            let cell = [0.1, 0.5, 2.0][case % 3];
            let g = Grid::new(&pts, cell);
            for _ in 0..50 {
                let q = Vector3::new(rnd(), rnd(), rnd()) * spread * 1.2;
                let r = rnd().abs() * spread * 0.5;
                let mut got = Vec::new();
                g.for_each_within(&q, r, |i, _| got.push(i));
                got.sort_unstable();
                let want: Vec<usize> = (0..pts.len())
                    .filter(|&i| (pts[i] - q).norm() <= r)
                    .collect();
                assert_eq!(got, want, "case {case}");
            }
        }
    }
}
