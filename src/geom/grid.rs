//! A spatial hash over 3-D points (cells keyed by integer coordinates, a small FxHash-style
//! hasher) so that "which points lie within r of p" costs O(1) per query for molecular
//! densities. Used by bond perception and by every symmetry check.

use std::collections::HashMap;
use std::hash::{BuildHasherDefault, Hasher};

use nalgebra::Vector3;

/// Multiply-rotate hasher (the scheme popularised by Firefox's FxHash); fine for integer
/// cell keys, far cheaper than SipHash.
#[derive(Default)]
pub(crate) struct FxHasher(u64);

impl FxHasher {
    #[inline]
    fn add(&mut self, w: u64) {
        self.0 = (self.0.rotate_left(5) ^ w).wrapping_mul(0x51_7c_c1_b7_27_22_0a_95);
    }
}

impl Hasher for FxHasher {
    fn write(&mut self, bytes: &[u8]) {
        for b in bytes {
            self.add(*b as u64);
        }
    }
    fn write_i64(&mut self, i: i64) {
        self.add(i as u64);
    }
    fn finish(&self) -> u64 {
        self.0
    }
}

type Key = (i64, i64, i64);

/// Points bucketed into cubic cells of edge `cell`.
pub(crate) struct Grid {
    inv: f64,
    points: Vec<Vector3<f64>>,
    /// cell -> (start, len) into `order`
    cells: HashMap<Key, (u32, u32), BuildHasherDefault<FxHasher>>,
    order: Vec<u32>,
}

#[inline]
fn cell_of(x: f64, inv: f64) -> i64 {
    // `as` saturates for huge values and maps NaN to 0: never panics.
    (x * inv).floor() as i64
}

impl Grid {
    /// Buckets `points` into cells of edge `cell` (> 0).
    pub(crate) fn new(points: &[Vector3<f64>], cell: f64) -> Grid {
        let cell = if cell.is_finite() && cell > 0.0 {
            cell
        } else {
            1.0
        };
        let inv = 1.0 / cell;
        let mut keyed: Vec<(Key, u32)> = points
            .iter()
            .enumerate()
            .map(|(i, p)| {
                (
                    (cell_of(p.x, inv), cell_of(p.y, inv), cell_of(p.z, inv)),
                    i as u32,
                )
            })
            .collect();
        keyed.sort_unstable();
        let mut cells = HashMap::with_capacity_and_hasher(keyed.len(), Default::default());
        let mut start = 0usize;
        while start < keyed.len() {
            let k = keyed[start].0;
            let mut end = start + 1;
            while end < keyed.len() && keyed[end].0 == k {
                end += 1;
            }
            cells.insert(k, (start as u32, (end - start) as u32));
            start = end;
        }
        Grid {
            inv,
            points: points.to_vec(),
            cells,
            order: keyed.into_iter().map(|(_, i)| i).collect(),
        }
    }

    /// Calls `f(index, distance)` for every point within `r` of `p`.
    pub(crate) fn for_each_within(&self, p: &Vector3<f64>, r: f64, mut f: impl FnMut(usize, f64)) {
        let lo = [
            cell_of(p.x - r, self.inv),
            cell_of(p.y - r, self.inv),
            cell_of(p.z - r, self.inv),
        ];
        let hi = [
            cell_of(p.x + r, self.inv),
            cell_of(p.y + r, self.inv),
            cell_of(p.z + r, self.inv),
        ];
        let span = |d: usize| hi[d].checked_sub(lo[d]).unwrap_or(i64::MAX);
        if (0..3).any(|d| span(d) > 4) {
            // Query radius far above the cell size: scan everything (still correct).
            for (i, q) in self.points.iter().enumerate() {
                let d = (q - p).norm();
                if d <= r {
                    f(i, d);
                }
            }
            return;
        }
        for kx in lo[0]..=hi[0] {
            for ky in lo[1]..=hi[1] {
                for kz in lo[2]..=hi[2] {
                    if let Some(&(s, n)) = self.cells.get(&(kx, ky, kz)) {
                        for &i in &self.order[s as usize..(s + n) as usize] {
                            let d = (self.points[i as usize] - p).norm();
                            if d <= r {
                                f(i as usize, d);
                            }
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
