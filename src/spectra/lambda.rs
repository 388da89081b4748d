//! Products of the species of the linear groups C∞v and D∞h, where the tables have no finite
//! list of operations: a species is (Λ, Σ⁺/Σ⁻, g/u).
//!
//! Derived from the characters χ(C_φ) = 2cos Λφ (Λ > 0), χ(σᵥ) = 0 (Λ > 0) or ±1 (Σ±), and
//! 2cos aφ · 2cos bφ = 2cos(a+b)φ + 2cos(a−b)φ; the symmetric square and cube follow from the
//! formulas of `rep::product`: [Λ²] = Σ⁺ + (2Λ), [Λ³] = Λ + (3Λ) for Λ > 0; g⊗g = u⊗u = g.
//! Agrees with Herzberg, *Molecular Spectra and Molecular Structure II* (1945), ch. II,
//! products of species of linear molecules (from memory).

/// A species of C∞v or D∞h.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub struct Species {
    /// |Λ|: 0 Σ, 1 Π, 2 Δ, 3 Φ, 4 Γ …
    pub lambda: u32,
    /// Σ⁻ (only meaningful for Λ = 0).
    pub minus: bool,
    /// `Some(true)` = g, `Some(false)` = u, `None` in C∞v.
    pub gerade: Option<bool>,
}

const NAMES: [&str; 5] = ["Sigma", "Pi", "Delta", "Phi", "Gamma"];

impl Species {
    /// Read an ASCII table label: `Sigma+`, `Sigma-g`, `Pi`, `Piu`, `Deltag` …
    pub fn parse(label: &str) -> Option<Species> {
        let (base, gerade) = if let Some(b) = label.strip_suffix('g') {
            (b, Some(true))
        } else if let Some(b) = label.strip_suffix('u') {
            (b, Some(false))
        } else {
            (label, None)
        };
        if let Some(sign) = base.strip_prefix("Sigma") {
            let minus = match sign {
                "+" => false,
                "-" => true,
                _ => return None,
            };
            return Some(Species {
                lambda: 0,
                minus,
                gerade,
            });
        }
        let lambda = NAMES.iter().position(|n| *n == base)? as u32;
        (lambda > 0).then_some(Species {
            lambda,
            minus: false,
            gerade,
        })
    }

    /// ASCII label in the tables' style; Λ ≥ 5 as `Lambda5`.
    pub fn label(&self) -> String {
        let base = match self.lambda {
            0 if self.minus => "Sigma-".to_string(),
            0 => "Sigma+".to_string(),
            l if (l as usize) < NAMES.len() => NAMES[l as usize].to_string(),
            l => format!("Lambda{l}"),
        };
        match self.gerade {
            Some(true) => base + "g",
            Some(false) => base + "u",
            None => base,
        }
    }

    pub fn dim(&self) -> usize {
        if self.lambda == 0 {
            1
        } else {
            2
        }
    }

    fn with(lambda: u32, minus: bool, gerade: Option<bool>) -> Species {
        Species {
            lambda,
            minus: minus && lambda == 0,
            gerade,
        }
    }
}

fn parity(a: Option<bool>, b: Option<bool>) -> Option<bool> {
    Some(a? == b?)
}

/// Γa ⊗ Γb.
pub fn product(a: Species, b: Species) -> Vec<Species> {
    let p = parity(a.gerade, b.gerade);
    match (a.lambda, b.lambda) {
        (0, 0) => vec![Species::with(0, a.minus != b.minus, p)],
        (0, l) | (l, 0) => vec![Species::with(l, false, p)],
        (x, y) if x == y => vec![
            Species::with(0, false, p),
            Species::with(0, true, p),
            Species::with(2 * x, false, p),
        ],
        (x, y) => vec![
            Species::with(x.abs_diff(y), false, p),
            Species::with(x + y, false, p),
        ],
    }
}

/// Symmetric power [Γⁿ] for n = 1, 2, 3 (overtones nν).
pub fn symmetric_power(a: Species, n: u32) -> Vec<Species> {
    match (n, a.lambda) {
        (1, _) => vec![a],
        (2, 0) => vec![Species::with(0, false, a.gerade.map(|_| true))],
        (2, l) => vec![
            Species::with(0, false, a.gerade.map(|_| true)),
            Species::with(2 * l, false, a.gerade.map(|_| true)),
        ],
        (_, 0) => vec![a],
        (_, l) => vec![
            Species::with(l, false, a.gerade),
            Species::with(3 * l, false, a.gerade),
        ],
    }
}

/// Antisymmetric square {Γ²}: nothing for Σ±, Σ⁻ (g in D∞h) for Λ > 0, since
/// (2cos Λφ)² − 2cos 2Λφ = 2 and the σᵥ character (0² − 1)/2 = −1.
pub fn antisymmetric_square(a: Species) -> Vec<Species> {
    if a.lambda == 0 {
        Vec::new()
    } else {
        vec![Species::with(0, true, a.gerade.map(|_| true))]
    }
}
