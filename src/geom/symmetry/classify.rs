//! From the symmetry elements found to a point group of the supported list and a frame
//! (rows = new x, y, z) in this crate's standard orientation (see [`super::groups`]).
//!
//! Decision order (the usual flow chart of the textbooks, e.g. F. A. Cotton, Chemical
//! Applications of Group Theory, 3rd ed. (1990), ch. 3.14): two or more axes of order ≥ 3
//! → cubic/icosahedral (C5 → I, C4 → O, else T; then i, σ); otherwise the principal axis
//! Cn; perpendicular C2 → Dn family (σh → Dnh, S2n → Dnd); otherwise σh → Cnh, σv → Cnv,
//! S2n → S2n, else Cn; with no axis: σ → Cs, i → Ci, else C1.
//!
//! Axis-frame conventions where the group leaves a choice, after R. S. Mulliken,
//! J. Chem. Phys. 23, 1997 (1955): in C2v, x is normal to the mirror plane holding more
//! atoms (a planar C2v molecule lies in yz); in D2/D2h, z is the C2 axis through most
//! atoms and x is normal to the mirror plane holding most atoms of the other two (a
//! planar D2h molecule has x normal to its plane). Other free choices keep the input
//! x axis as far as possible. The sign of a polar z axis makes Σ m z³ ≥ 0.

use super::super::linalg::{improper, perpendicular, reflection, M3, V3};
use super::groups::{Family, MAX_ORDER};
use super::search::{Axis, Ctx, Found};
use std::f64::consts::PI;

/// The chosen group, its frame and remarks for the user.
pub(crate) struct Classified {
    pub family: Family,
    /// Rows = new x, y, z axes in the input frame.
    pub frame: M3,
    pub notes: Vec<String>,
}

const PERP: f64 = 0.05;

fn frame_from(x: V3, z: V3) -> M3 {
    let z = z.normalize();
    let x = (x - z * z.dot(&x)).normalize();
    let y = z.cross(&x);
    M3::from_rows(&[x.transpose(), y.transpose(), z.transpose()])
}

fn largest_divisor_at_most(n: usize, cap: usize) -> usize {
    (1..=cap.min(n))
        .rev()
        .find(|d| n.is_multiple_of(*d))
        .unwrap_or(1)
}

/// Flips `z` so that the mass-weighted third moment along it is non-negative.
fn polar_sign(ctx: &Ctx, z: V3) -> V3 {
    let t: f64 = ctx
        .pos
        .iter()
        .zip(&ctx.mass)
        .map(|(p, m)| m * z.dot(p).powi(3))
        .sum();
    if t < -1e-9 {
        -z
    } else {
        z
    }
}

fn argmax_by<T: Copy>(items: &[T], score: impl Fn(&T) -> usize) -> Option<T> {
    let mut best: Option<(T, usize)> = None;
    for it in items {
        let sc = score(it);
        if best.is_none_or(|(_, b)| sc > b) {
            best = Some((*it, sc));
        }
    }
    best.map(|(t, _)| t)
}

/// Cubic and icosahedral groups. `None` when the elements are inconsistent.
fn cubic(found: &Found) -> Option<Classified> {
    let of_order = |k: usize| -> Vec<V3> {
        found
            .axes
            .iter()
            .filter(|a| a.order == k)
            .map(|a| a.dir)
            .collect()
    };
    let triple = |dirs: &[V3]| -> Option<(V3, V3)> {
        let x = *dirs.first()?;
        let y = dirs.iter().find(|d| d.dot(&x).abs() < PERP)?;
        Some((x, *y))
    };
    let has = |k: usize| found.axes.iter().any(|a| a.order % k == 0 && a.order >= k);
    if has(5) {
        let (x, y) = triple(&of_order(2))?;
        let mut f = frame_from(x, x.cross(&y));
        // Setting: a C5 axis should read (0, ±1, ±φ) up to cyclic permutation.
        let v = found.axes.iter().find(|a| a.order % 5 == 0)?.dir;
        let w = f * v;
        let k = (0..3).min_by(|&a, &b| w[a].abs().total_cmp(&w[b].abs()))?;
        if w[(k + 1) % 3].abs() > w[(k + 2) % 3].abs() {
            // Other setting: swap x and y, reverse z.
            let r = M3::new(0.0, 1.0, 0.0, 1.0, 0.0, 0.0, 0.0, 0.0, -1.0);
            f = r * f;
        }
        let family = if found.inversion {
            Family::Ih
        } else {
            Family::I
        };
        return Some(Classified {
            family,
            frame: f,
            notes: vec![],
        });
    }
    if has(4) {
        let (x, y) = triple(&of_order(4))?;
        let family = if found.inversion {
            Family::Oh
        } else {
            Family::O
        };
        return Some(Classified {
            family,
            frame: frame_from(x, x.cross(&y)),
            notes: vec![],
        });
    }
    let (x, y) = triple(&of_order(2))?;
    let family = if found.inversion {
        Family::Th
    } else if !found.mirrors.is_empty() {
        Family::Td
    } else {
        Family::T
    };
    Some(Classified {
        family,
        frame: frame_from(x, x.cross(&y)),
        notes: vec![],
    })
}

/// Classifies the elements found. `None` if they are inconsistent (the caller then
/// tightens the screening tolerance).
pub(crate) fn classify(ctx: &Ctx, found: &Found, s: f64) -> Option<Classified> {
    let x_in = V3::x();
    let high: Vec<&Axis> = found.axes.iter().filter(|a| a.order >= 3).collect();
    if high.len() >= 2 {
        return cubic(found);
    }
    let mut notes = Vec::new();
    if found.axes.is_empty() {
        if let Some(n) = found.mirrors.first() {
            let z = *n;
            let x = perpendicular(&z, &x_in);
            return Some(Classified {
                family: Family::Cs,
                frame: frame_from(x, z),
                notes,
            });
        }
        let family = if found.inversion {
            Family::Ci
        } else {
            Family::C1
        };
        return Some(Classified {
            family,
            frame: M3::identity(),
            notes,
        });
    }
    // Principal axis.
    let dirs: Vec<V3> = found.axes.iter().map(|a| a.dir).collect();
    let principal: Axis = if let Some(a) = high.first() {
        (*a).clone()
    } else if found.axes.len() >= 3 {
        // Three C2 axes: D2d if one carries an S4, else D2/D2h with Mulliken's z.
        match found
            .axes
            .iter()
            .find(|a| ctx.passes_at(&improper(&a.dir, PI / 2.0), s))
        {
            Some(a) => a.clone(),
            None => {
                let z = argmax_by(&dirs, |d| ctx.atoms_on_line(d, s))?;
                Axis { dir: z, order: 2 }
            }
        }
    } else {
        found.axes[0].clone()
    };
    let n_true = principal.order;
    let n = if n_true > MAX_ORDER {
        let n = largest_divisor_at_most(n_true, MAX_ORDER);
        notes.push(format!(
            "the principal axis has order {n_true}, above the supported {MAX_ORDER}; \
             reporting the largest supported subgroup, built on its C{n} subaxis"
        ));
        n
    } else {
        n_true
    };
    let z = polar_sign(ctx, principal.dir);
    let perp_c2: Vec<V3> = found
        .axes
        .iter()
        .filter(|a| a.order % 2 == 0 && a.dir.dot(&z).abs() < PERP)
        .map(|a| a.dir)
        .collect();
    let sigma_h = ctx.passes_at(&reflection(&z), s);
    let s2n = ctx.passes_at(&improper(&z, PI / n as f64), s);
    let vertical: Vec<V3> = found
        .mirrors
        .iter()
        .filter(|m| m.dot(&z).abs() < PERP)
        .copied()
        .collect();
    if !perp_c2.is_empty() {
        let (family, x) = if n == 2 && !s2n {
            // D2 / D2h: x normal to the plane (⟂ a C2 axis) holding most atoms.
            let x = argmax_by(&perp_c2, |d| ctx.atoms_in_plane(d, s))?;
            let f = if sigma_h {
                Family::Dnh(2)
            } else {
                Family::Dn(2)
            };
            (f, x)
        } else {
            let x = argmax_by(&perp_c2, |d| ctx.atoms_on_line(d, s))?;
            let f = if sigma_h {
                Family::Dnh(n)
            } else if s2n {
                Family::Dnd(n)
            } else {
                Family::Dn(n)
            };
            (f, x)
        };
        return Some(Classified {
            family,
            frame: frame_from(x, z),
            notes,
        });
    }
    if sigma_h {
        let x = perpendicular(&z, &x_in);
        return Some(Classified {
            family: Family::Cnh(n),
            frame: frame_from(x, z),
            notes,
        });
    }
    if !vertical.is_empty() {
        let best = argmax_by(&vertical, |m| ctx.atoms_in_plane(m, s))?;
        // C2v: x normal to that plane (Mulliken); n ≥ 3: x inside it (σv(xz)).
        let x = if n == 2 { best } else { z.cross(&best) };
        return Some(Classified {
            family: Family::Cnv(n),
            frame: frame_from(x, z),
            notes,
        });
    }
    let x = perpendicular(&z, &x_in);
    let family = if s2n {
        let f = Family::S(2 * n);
        if f.is_supported() {
            f
        } else {
            notes.push(format!(
                "the molecule has an S{} axis, not among the supported groups; \
                 reporting its rotation subgroup C{n}",
                2 * n
            ));
            Family::Cn(n)
        }
    } else {
        Family::Cn(n)
    };
    Some(Classified {
        family,
        frame: frame_from(x, z),
        notes,
    })
}
