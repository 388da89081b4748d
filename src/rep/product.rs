//! Direct products, symmetric and antisymmetric squares, symmetric cubes.
//!
//! χ_{Γ⊗Γ'}(R) = χ_Γ(R)·χ_Γ'(R); [Γ²](R) = (χ(R)² + χ(R²))/2, {Γ²}(R) = (χ(R)² − χ(R²))/2;
//! [Γ³](R) = (χ(R)³ + 3χ(R²)χ(R) + 2χ(R³))/6 (Wilson, Decius & Cross, *Molecular Vibrations*,
//! §7-3; Herzberg, *Infrared and Raman Spectra*, ch. II). Overtones of degenerate modes use
//! the symmetric powers, not the plain product.

use super::character::Character;
use crate::exact::Cyclo;
use crate::group::PointGroup;

/// Class of Rᵏ for R in class c.
pub fn class_power(g: &PointGroup, class: usize, k: u32) -> usize {
    let op = g
        .ops
        .iter()
        .find(|o| o.class == class)
        .expect("class has an operation");
    let mut m = nalgebra::Matrix3::identity();
    for _ in 0..k {
        m *= op.float;
    }
    let idx = g.op_index(&m).expect("powers stay in the group");
    g.ops[idx].class
}

/// Character of an irrep.
pub fn irrep_character(g: &PointGroup, irrep: usize) -> Character {
    Character(g.table.irreps[irrep].chars.clone())
}

/// χ₁·χ₂.
pub fn direct_product(a: &Character, b: &Character) -> Character {
    Character(a.0.iter().zip(&b.0).map(|(x, y)| x * y).collect())
}

/// Symmetric square [Γ²].
pub fn symmetric_square(g: &PointGroup, a: &Character) -> Character {
    square(g, a, true)
}

/// Antisymmetric square {Γ²}.
pub fn antisymmetric_square(g: &PointGroup, a: &Character) -> Character {
    square(g, a, false)
}

fn square(g: &PointGroup, a: &Character, sym: bool) -> Character {
    Character(
        (0..a.0.len())
            .map(|c| {
                let c2 = class_power(g, c, 2);
                let sq = &a.0[c] * &a.0[c];
                let s = if sym { &sq + &a.0[c2] } else { &sq - &a.0[c2] };
                &s * &Cyclo::frac(1, 2)
            })
            .collect(),
    )
}

/// Symmetric cube [Γ³] (second overtone 3ν of a degenerate mode).
pub fn symmetric_cube(g: &PointGroup, a: &Character) -> Character {
    Character(
        (0..a.0.len())
            .map(|c| {
                let c2 = class_power(g, c, 2);
                let c3 = class_power(g, c, 3);
                let x = &a.0[c];
                let t = &(&(x * x) * x)
                    + &(&(&a.0[c2] * x) * &Cyclo::from_int(3))
                    + (&a.0[c3] * &Cyclo::from_int(2));
                &t * &Cyclo::frac(1, 6)
            })
            .collect(),
    )
}

/// Sum of characters (direct sum).
pub fn direct_sum(a: &Character, b: &Character) -> Character {
    Character(a.0.iter().zip(&b.0).map(|(x, y)| x + y).collect())
}

/// Σ nᵢ χᵢ for multiplicities in table order.
pub fn from_multiplicities(g: &PointGroup, m: &[u64]) -> Character {
    let n = g.n_classes();
    let mut out = vec![Cyclo::zero(); n];
    for (i, k) in m.iter().enumerate() {
        if *k == 0 {
            continue;
        }
        for c in 0..n {
            out[c] = &out[c] + &(&g.table.irreps[i].chars[c] * &Cyclo::from_int(*k as i64));
        }
    }
    Character(out)
}
