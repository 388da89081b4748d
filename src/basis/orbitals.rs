//! Central-atom orbitals s, p, d, f, g: their characters computed from the rotation angle, and
//! which real orbitals belong to which irrep.
//!
//! χ_l(C_θ) = sin((l+½)θ)/sin(θ/2) = 1 + 2Σ_{m=1..l} cos mθ; an improper operation is i·C_θ′ with
//! C_θ′ = −R, contributing parity (−1)^l, so S_θ = i·C_{θ+π} (Cotton, 3rd ed., §9.4; Tinkham,
//! *Group Theory and Quantum Mechanics*, §5-4). cos mθ is reached from the exact trace
//! 1 + 2cos θ by the Chebyshev recurrence, so every character is exact.

use super::action::class_representatives;
use crate::exact::Cyclo;
use crate::group::{act, mat_det, mat_trace, parse_tuple, PointGroup, Poly};
use crate::rep::{self, Character};

/// Orbital letters by l.
pub const LETTERS: [char; 5] = ['s', 'p', 'd', 'f', 'g'];

/// χ_l of every class.
pub fn orbital_character(g: &PointGroup, l: usize) -> Character {
    Character(
        class_representatives(g)
            .iter()
            .map(|&o| {
                let m = &g.ops[o].matrix;
                let det = mat_det(m);
                // proper part det·R has trace det·tr R = 1 + 2cos θ
                let t = &(&det * &mat_trace(m)) - &Cyclo::one(); // 2cos θ
                let mut prev = Cyclo::from_int(2); // 2cos 0θ
                let mut cur = t.clone(); // 2cos 1θ
                let mut chi = Cyclo::one();
                for _ in 1..=l {
                    chi += &cur;
                    let next = &(&t * &cur) - &prev;
                    prev = cur;
                    cur = next;
                }
                let parity = if l % 2 == 1 { det } else { Cyclo::one() };
                &parity * &chi
            })
            .collect(),
    )
}

/// The real orbitals of shell l with the polynomials that define them (up to normalization).
pub fn real_orbitals(l: usize) -> Vec<(&'static str, &'static str)> {
    match l {
        0 => vec![("s", "1")],
        1 => vec![("px", "x"), ("py", "y"), ("pz", "z")],
        2 => vec![
            ("dz2", "2z^2-x^2-y^2"),
            ("dxz", "xz"),
            ("dyz", "yz"),
            ("dx2-y2", "x^2-y^2"),
            ("dxy", "xy"),
        ],
        3 => vec![
            ("fz3", "2z^3-3x^2z-3y^2z"),
            ("fxz2", "4xz^2-x^3-xy^2"),
            ("fyz2", "4yz^2-x^2y-y^3"),
            ("fxyz", "xyz"),
            ("fz(x2-y2)", "x^2z-y^2z"),
            ("fx(x2-3y2)", "x^3-3xy^2"),
            ("fy(3x2-y2)", "3x^2y-y^3"),
        ],
        _ => Vec::new(),
    }
}

/// One shell of the central atom.
#[derive(Debug, Clone)]
pub struct Shell {
    pub l: usize,
    pub letter: char,
    pub character: Character,
    /// Multiplicity of each irrep (table order).
    pub multiplicities: Vec<u64>,
    /// Real orbitals lying wholly in one irrep: (name, irrep index). For a complex pair the
    /// first member of the pair is named.
    pub orbitals: Vec<(String, usize)>,
}

/// Shells s … up to l_max (≤ 4) of a central atom at the origin of a finite group.
pub fn shells(g: &PointGroup, l_max: usize) -> Vec<Shell> {
    (0..=l_max.min(4))
        .map(|l| {
            let character = orbital_character(g, l);
            let multiplicities =
                rep::decompose(g, &character).expect("χ_l is a representation of every group");
            let orbitals = real_orbitals(l)
                .into_iter()
                .filter_map(|(name, poly)| {
                    let f = parse_poly(poly);
                    irrep_of(g, &f).map(|i| (name.to_string(), i))
                })
                .collect();
            Shell {
                l,
                letter: LETTERS[l],
                character,
                multiplicities,
                orbitals,
            }
        })
        .collect()
}

fn parse_poly(text: &str) -> Poly {
    if text == "1" {
        return Poly::from([([0, 0, 0], Cyclo::one())]);
    }
    parse_tuple(text)
        .expect("built-in orbital polynomial parses")
        .parts
        .remove(0)
}

/// The irrep (real-combined for complex pairs) whose projector leaves f unchanged, if any.
pub fn irrep_of(g: &PointGroup, f: &Poly) -> Option<usize> {
    let h = Cyclo::from_int(g.order() as i64);
    let images: Vec<Poly> = g.ops.iter().map(|op| act(&op.matrix, f, false)).collect();
    for (i, ir) in g.table.irreps.iter().enumerate() {
        if let Some(p) = ir.pair {
            if p < i {
                continue;
            }
        }
        let partner = ir.pair;
        let dim = Cyclo::from_int(ir.dim() as i64 * if partner.is_some() { 2 } else { 1 });
        let mut acc = Poly::new();
        for (o, img) in images.iter().enumerate() {
            let c = g.ops[o].class;
            let mut chi = ir.chars[c].conj();
            if let Some(p) = partner {
                chi += &g.table.irreps[p].chars[c].conj();
            }
            if chi.is_zero() {
                continue;
            }
            for (e, x) in img {
                let v = acc.entry(*e).or_insert_with(Cyclo::zero);
                *v += &(x * &chi);
            }
        }
        let factor = &dim / &h;
        acc.retain(|_, v| {
            *v = &*v * &factor;
            !v.is_zero()
        });
        if &acc == f {
            return Some(i);
        }
    }
    None
}
