//! The arithmetic behind [`super::isotopes`]: mapping operations between the parent's and
//! the isotopologue's frames, restriction of species by characters, and both sides of the
//! product rule.

use super::isotopes::{ProductRule, SetCorrelation};
use super::solve::orthonormal;
use super::Modes;
use nalgebra::{DVector, Matrix3, Vector3};

/// For each parent set, the multiplicity of each working species of the isotopologue.
pub type PerSet = Vec<Vec<u64>>;

/// Correlate every parent set to the isotopologue's group.
pub fn correlate(parent: &Modes, iso: &Modes) -> Result<(Vec<SetCorrelation>, PerSet), String> {
    let (pf, jf) = (&parent.frame, &iso.frame);
    // iso op M_H (iso frame) ↔ parent frame: R_G R_Hᵀ M_H R_H R_Gᵀ
    let t = pf.rotation * jf.rotation.transpose();
    let map: Vec<usize> = jf
        .action
        .ops
        .iter()
        .map(|m| {
            let mg: Matrix3<f64> = t * m * t.transpose();
            pf.working.op_index(&mg).ok_or_else(|| {
                "an operation of the isotopologue is not one of the parent's in its frame"
                    .to_string()
            })
        })
        .collect::<Result<_, _>>()?;
    let h = jf.action.order() as f64;
    let mut corr = Vec::new();
    let mut per_set = Vec::new();
    for s in &parent.sets {
        // the set's character on each isotopologue operation: sum over its working species
        // (each member once per component; a degenerate working irrep counted once)
        let chi: Vec<f64> = map
            .iter()
            .map(|&o| s.working.iter().map(|&w| pf.action.irreps[w].chi[o]).sum())
            .collect();
        let mut mult = Vec::new();
        for ir in &jf.action.irreps {
            let num: f64 = chi.iter().zip(&ir.chi).map(|(a, b)| a * b).sum();
            let den: f64 = ir.chi.iter().map(|b| b * b).sum();
            let _ = h;
            mult.push((num / den).round().max(0.0) as u64);
        }
        let becomes = jf
            .action
            .irreps
            .iter()
            .zip(&mult)
            .filter(|(_, &m)| m > 0)
            .map(|(ir, &m)| (ir.label.clone(), m))
            .collect();
        corr.push(SetCorrelation {
            parent_index: s.index,
            parent_irrep: s.irrep.clone(),
            becomes,
        });
        per_set.push(mult);
    }
    Ok((corr, per_set))
}

fn inertia(p: &[Vector3<f64>], m: &[f64]) -> Matrix3<f64> {
    let total: f64 = m.iter().sum();
    let com = p
        .iter()
        .zip(m)
        .fold(Vector3::zeros(), |s, (x, w)| s + x * *w)
        / total;
    let mut t = Matrix3::zeros();
    for (x, &w) in p.iter().zip(m) {
        let r = x - com;
        t += (Matrix3::identity() * r.norm_squared() - r * r.transpose()) * w;
    }
    t
}

/// First-partner subspace of species `g` in a 3-vector representation (polar or axial).
fn vector_subspace(action: &super::Action, g: usize, axial: bool) -> Vec<Vector3<f64>> {
    let ir = &action.irreps[g];
    let mut cands = Vec::new();
    for j in 0..3 {
        for k in 0..ir.dim {
            let mut v = Vector3::zeros();
            for o in 0..action.order() {
                let f = ir.mats[action.inv[o]][(k, 0)];
                let r = action.ops[o];
                let d = if axial { r.determinant() } else { 1.0 };
                v += r.column(j) * (f * d);
            }
            cands.push(DVector::from_column_slice(v.as_slice()));
        }
    }
    orthonormal(cands, 1e-6)
        .into_iter()
        .map(|v| Vector3::new(v[0], v[1], v[2]))
        .collect()
}

/// Both sides of the product rule per working species of the isotopologue.
pub fn product_rule(parent: &Modes, iso: &Modes, per_set: &PerSet) -> Vec<ProductRule> {
    let jf = &iso.frame;
    let a = &jf.action;
    // parent positions in the isotopologue's frame
    let t = jf.rotation * parent.frame.rotation.transpose();
    let ppos: Vec<Vector3<f64>> = parent.frame.positions.iter().map(|p| t * p).collect();
    let (pm, im) = (&parent.frame.masses, &jf.masses);
    let (ip, ii) = (inertia(&ppos, pm), inertia(&jf.positions, im));
    let (mp, mi): (f64, f64) = (pm.iter().sum(), im.iter().sum());
    let mut out = Vec::new();
    for (g, ir) in a.irreps.iter().enumerate() {
        // wavenumbers: parent sets (each as often as it contains g), iso sets of species g
        let mut parent_w = Vec::new();
        for (s, mult) in parent.sets.iter().zip(per_set) {
            for _ in 0..mult[g] {
                parent_w.push(s.wavenumber);
            }
        }
        let iso_w: Vec<f64> = iso
            .sets
            .iter()
            .filter(|s| s.working.contains(&g))
            .flat_map(|s| {
                // a linear Π set holds two working species, one member each
                let k = s.working.iter().filter(|&&w| w == g).count();
                std::iter::repeat_n(s.wavenumber, k)
            })
            .collect();
        if iso_w.is_empty() || iso_w.len() != parent_w.len() {
            continue;
        }
        if iso_w.iter().chain(&parent_w).any(|w| *w <= 0.0) {
            continue;
        }
        let lhs: f64 = iso_w.iter().product::<f64>() / parent_w.iter().product::<f64>();
        // masses: s_O per orbit of the isotopologue's group
        let mut rhs2 = 1.0;
        for (idx, _) in a.first_partner_salcs(g) {
            let atom = idx[0] / 3;
            rhs2 *= pm[atom] / im[atom];
        }
        let trans = vector_subspace(a, g, false).len() as i32;
        rhs2 *= (mi / mp).powi(trans);
        let axes = vector_subspace(a, g, true);
        if !axes.is_empty() {
            let moment = |it: &Matrix3<f64>| -> f64 {
                let m = nalgebra::DMatrix::from_fn(axes.len(), axes.len(), |x, y| {
                    (axes[x].transpose() * it * axes[y])[(0, 0)]
                });
                m.determinant()
            };
            let (dp, di) = (moment(&ip), moment(&ii));
            if dp > 1e-9 && di > 1e-9 {
                rhs2 *= di / dp;
            }
        }
        let rhs = rhs2.sqrt();
        out.push(ProductRule {
            species: ir.label.clone(),
            sets: iso_w.len(),
            from_wavenumbers: lhs,
            from_masses: rhs,
            deviation: lhs / rhs - 1.0,
        });
    }
    out
}
