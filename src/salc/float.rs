//! The same SALC algorithm in floating point, kept only to measure what exactness costs
//! (`benches/salc_c60.rs`); the exact engine is the default everywhere.

use super::build::{real_multiplicities, SalcError};
use super::irreps::real_irreps;
use super::project::inverses;
use crate::basis::Basis;

/// Orthonormal SALCs as float vectors, per real irrep in order (tolerance 1e-9).
pub fn float_salcs(b: &Basis) -> Result<Vec<Vec<f64>>, SalcError> {
    let irreps = real_irreps(&b.group)?;
    let mult = real_multiplicities(b, &irreps)?;
    let inv = inverses(b);
    let n = b.dim();
    let images: Vec<Vec<Vec<(usize, f64)>>> = (0..b.images.ops())
        .map(|o| {
            (0..n)
                .map(|m| b.images.col(o, m).map(|(k, x)| (k, x.re_f64())).collect())
                .collect()
        })
        .collect();
    let apply = |o: usize, v: &[f64]| {
        let mut out = vec![0.0; n];
        for (m, x) in v.iter().enumerate() {
            if *x != 0.0 {
                for (k, c) in &images[o][m] {
                    out[*k] += c * x;
                }
            }
        }
        out
    };
    let reps: Vec<usize> = b.site_orbits().iter().map(|o| o[0]).collect();
    let mut out = Vec::new();
    for (x, ir) in irreps.iter().enumerate() {
        if mult[x] == 0 {
            continue;
        }
        let d = ir.dim;
        let mats: Vec<Vec<Vec<f64>>> = ir
            .mats
            .iter()
            .map(|m| {
                m.iter()
                    .map(|r| r.iter().map(|c| c.re_f64()).collect())
                    .collect()
            })
            .collect();
        let mut found: Vec<Vec<f64>> = Vec::new();
        'sites: for &site in &reps {
            for m in b.members_of(site) {
                for k in 0..d {
                    // P_1k e_m, then partners P_i1 by the full sum (simple float path)
                    let mut v = vec![0.0; n];
                    for (o, cols) in images.iter().enumerate() {
                        let f = mats[inv[o]][k][0];
                        if f != 0.0 {
                            for (t, c) in &cols[m] {
                                v[*t] += c * f;
                            }
                        }
                    }
                    for u in &found {
                        let p: f64 = v.iter().zip(u).map(|(a, b)| a * b).sum();
                        for (a, b) in v.iter_mut().zip(u) {
                            *a -= p * b;
                        }
                    }
                    let norm = v.iter().map(|a| a * a).sum::<f64>().sqrt();
                    if norm > 1e-9 {
                        found.push(v.iter().map(|a| a / norm).collect());
                    }
                    if found.len() as u64 == mult[x] {
                        break 'sites;
                    }
                }
            }
        }
        for s1 in &found {
            out.push(s1.clone());
            for i in 1..d {
                let mut v = vec![0.0; n];
                for o in 0..b.group.order() {
                    let f = mats[inv[o]][0][i];
                    if f != 0.0 {
                        for (a, c) in v.iter_mut().zip(apply(o, s1)) {
                            *a += f * c;
                        }
                    }
                }
                let norm = v.iter().map(|a| a * a).sum::<f64>().sqrt();
                out.push(v.iter().map(|a| a / norm).collect());
            }
        }
    }
    Ok(out)
}
