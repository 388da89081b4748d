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
        // Real solid harmonics of l = 4 (unnormalized): r⁴·Y₄ₘ for m = 0, ±1 … ±4, e.g.
        // 35z⁴ − 30z²r² + 3r⁴ = 8z⁴ − 24(x²+y²)z² + 3(x²+y²)² (Tinkham, §5-4, from memory).
        4 => vec![
            ("gz4", "8z^4-24x^2z^2-24y^2z^2+3x^4+6x^2y^2+3y^4"),
            ("gxz3", "4xz^3-3x^3z-3xy^2z"),
            ("gyz3", "4yz^3-3x^2yz-3y^3z"),
            ("gz2(x2-y2)", "6x^2z^2-6y^2z^2-x^4+y^4"),
            ("gxyz2", "6xyz^2-x^3y-xy^3"),
            ("gxz(x2-3y2)", "x^3z-3xy^2z"),
            ("gyz(3x2-y2)", "3x^2yz-y^3z"),
            ("g(x4-6x2y2+y4)", "x^4-6x^2y^2+y^4"),
            ("gxy(x2-y2)", "x^3y-xy^3"),
        ],
        _ => Vec::new(),
    }
}

/// |m| about z of a real orbital of [`real_orbitals`]: its species σ (0), π (1), δ (2), φ (3),
/// γ (4) along a linear molecule's axis z. The listed orders follow m = 0, ±1, ±2 … in each
/// shell (px, py: π; pz: σ).
pub fn orbital_lambda(name: &str) -> Option<u32> {
    (0..=4).find_map(|l| {
        let list = real_orbitals(l);
        let k = list.iter().position(|(n, _)| *n == name)?;
        Some(if l == 1 {
            [1, 1, 0][k]
        } else {
            k.div_ceil(2) as u32
        })
    })
}

/// The central-atom orbitals of shells s … `l_max` with the symmetry of one real irrep (first
/// table row `row`, real dimension `dim`). Orbitals are named when the shell's part in the
/// irrep is spanned by named real orbitals, otherwise `2×d`. `axial` = Some(Λ) for a linear
/// molecule along z: only orbitals of that |m| (σ 0, π 1, …) are listed — the others have
/// zero overlap with a ligand combination of species Λ however the finite subgroup labels
/// them (Herzberg 1966, *Electronic Spectra*, ch. I; the D∞h table's functions).
pub fn central_orbitals(
    g: &PointGroup,
    l_max: usize,
    row: usize,
    dim: usize,
    axial: Option<u32>,
) -> Vec<String> {
    let mut central = Vec::new();
    for sh in shells(g, l_max) {
        let count = sh.multiplicities[row];
        if count == 0 {
            continue;
        }
        let named: Vec<String> = sh
            .orbitals
            .iter()
            .filter(|(_, i)| *i == row)
            .map(|(n, _)| n.clone())
            .collect();
        if let Some(lambda) = axial {
            central.extend(
                named
                    .into_iter()
                    .filter(|n| orbital_lambda(n) == Some(lambda)),
            );
            continue;
        }
        if named.len() as u64 == count * dim as u64 {
            central.extend(named);
        } else if named.is_empty() {
            central.push(if count == 1 {
                format!("{} (one set)", sh.letter)
            } else {
                format!("{count}×{}", sh.letter)
            });
        } else {
            central.extend(named);
            central.push(format!("more of {}", sh.letter));
        }
    }
    central
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

/// Shells s … up to l_max (≤ 4) of a central atom at the origin of a finite group; real
/// orbitals are named up to g.
pub fn shells(g: &PointGroup, l_max: usize) -> Vec<Shell> {
    // Every irrep of a ligand set asks for the same shells: work them out once per group and
    // shell (acting on the f and g polynomials with every operation of Ih is not free).
    use std::collections::HashMap;
    use std::sync::{Arc, Mutex, OnceLock};
    type Memo = Mutex<HashMap<(String, usize), Arc<Vec<Shell>>>>;
    static MEMO: OnceLock<Memo> = OnceLock::new();
    let memo = MEMO.get_or_init(|| Mutex::new(HashMap::new()));
    let key = (g.name().to_string(), l_max.min(4));
    if let Some(v) = memo.lock().expect("shell memo").get(&key) {
        return (**v).clone();
    }
    let v = Arc::new(compute_shells(g, l_max));
    memo.lock().expect("shell memo").insert(key, v.clone());
    (*v).clone()
}

fn compute_shells(g: &PointGroup, l_max: usize) -> Vec<Shell> {
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
        // P = Σ_rows (d_row/h) Σ_R χ_row(R)* R; the two rows of a pair have d = 1 each, so
        // the pair's projector is (1/h) Σ_R (χ₁ + χ₂)* R (Cotton, 3rd ed., eq. 8.2-1).
        let dim = Cyclo::from_int(ir.dim() as i64);
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
