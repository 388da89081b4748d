//! Point-group names used by the character tables (ASCII: `C2v`, `D6h`, `S4`, `Td`, `Ih`,
//! `Cinfv`, `Dinfh`, …), their orders, and generator matrices in this crate's standard
//! orientation (principal axis z; C2' along x in Dn/Dnh/Dnd; σv(xz) in Cnv; σh = xy;
//! cubic: C2/C4 along x, y, z and C3 along (1,1,1); icosahedral: C2 along x, y, z and a C5
//! along (0, 1, φ)). The exact tables live elsewhere; nothing here depends on them.

use super::super::linalg::{closure, improper, reflection, rotation, M3, V3};
use std::f64::consts::PI;

/// Largest rotation order of the supported axial groups.
pub const MAX_ORDER: usize = 8;

/// A point group of the supported list.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Family {
    /// C1
    C1,
    /// Cs
    Cs,
    /// Ci
    Ci,
    /// Cn, n = 2..=8
    Cn(usize),
    /// Cnv
    Cnv(usize),
    /// Cnh
    Cnh(usize),
    /// Dn
    Dn(usize),
    /// Dnh
    Dnh(usize),
    /// Dnd
    Dnd(usize),
    /// S2n, holding 2n (4, 6, 8, 10, 12)
    S(usize),
    /// T
    T,
    /// Td
    Td,
    /// Th
    Th,
    /// O
    O,
    /// Oh
    Oh,
    /// I
    I,
    /// Ih
    Ih,
    /// C∞v
    Cinfv,
    /// D∞h
    Dinfh,
}

impl Family {
    /// The table name, e.g. `"D3h"`, `"Cinfv"`.
    pub fn name(&self) -> String {
        match self {
            Family::C1 => "C1".into(),
            Family::Cs => "Cs".into(),
            Family::Ci => "Ci".into(),
            Family::Cn(n) => format!("C{n}"),
            Family::Cnv(n) => format!("C{n}v"),
            Family::Cnh(n) => format!("C{n}h"),
            Family::Dn(n) => format!("D{n}"),
            Family::Dnh(n) => format!("D{n}h"),
            Family::Dnd(n) => format!("D{n}d"),
            Family::S(n) => format!("S{n}"),
            Family::T => "T".into(),
            Family::Td => "Td".into(),
            Family::Th => "Th".into(),
            Family::O => "O".into(),
            Family::Oh => "Oh".into(),
            Family::I => "I".into(),
            Family::Ih => "Ih".into(),
            Family::Cinfv => "Cinfv".into(),
            Family::Dinfh => "Dinfh".into(),
        }
    }

    /// Parses a supported table name.
    pub fn parse(name: &str) -> Option<Family> {
        let fixed = match name {
            "C1" => Some(Family::C1),
            "Cs" => Some(Family::Cs),
            "Ci" => Some(Family::Ci),
            "T" => Some(Family::T),
            "Td" => Some(Family::Td),
            "Th" => Some(Family::Th),
            "O" => Some(Family::O),
            "Oh" => Some(Family::Oh),
            "I" => Some(Family::I),
            "Ih" => Some(Family::Ih),
            "Cinfv" => Some(Family::Cinfv),
            "Dinfh" => Some(Family::Dinfh),
            _ => None,
        };
        if fixed.is_some() {
            return fixed;
        }
        let mut chars = name.chars();
        let head = chars.next()?;
        let rest: String = chars.collect();
        let digits: String = rest.chars().take_while(|c| c.is_ascii_digit()).collect();
        let suffix = &rest[digits.len()..];
        let n: usize = digits.parse().ok()?;
        let f = match (head, suffix) {
            ('C', "") => Family::Cn(n),
            ('C', "v") => Family::Cnv(n),
            ('C', "h") => Family::Cnh(n),
            ('D', "") => Family::Dn(n),
            ('D', "h") => Family::Dnh(n),
            ('D', "d") => Family::Dnd(n),
            ('S', "") => Family::S(n),
            _ => return None,
        };
        f.is_supported().then_some(f)
    }

    /// Whether this is one of the names the tables provide.
    pub fn is_supported(&self) -> bool {
        match *self {
            Family::Cn(n) | Family::Cnv(n) | Family::Cnh(n) => (2..=MAX_ORDER).contains(&n),
            Family::Dn(n) | Family::Dnh(n) | Family::Dnd(n) => (2..=MAX_ORDER).contains(&n),
            Family::S(n) => matches!(n, 4 | 6 | 8 | 10 | 12),
            _ => true,
        }
    }

    /// Group order (`None` for the infinite linear groups).
    pub fn order(&self) -> Option<usize> {
        Some(match *self {
            Family::C1 => 1,
            Family::Cs | Family::Ci => 2,
            Family::Cn(n) => n,
            Family::Cnv(n) | Family::Cnh(n) | Family::Dn(n) => 2 * n,
            Family::Dnh(n) | Family::Dnd(n) => 4 * n,
            Family::S(n) => n,
            Family::T => 12,
            Family::Td | Family::Th | Family::O => 24,
            Family::Oh => 48,
            Family::I => 60,
            Family::Ih => 120,
            Family::Cinfv | Family::Dinfh => return None,
        })
    }

    /// Order of the principal (z) axis, 1 when there is none, 0 for the linear groups.
    pub fn principal_order(&self) -> usize {
        match *self {
            Family::Cn(n) | Family::Cnv(n) | Family::Cnh(n) => n,
            Family::Dn(n) | Family::Dnh(n) | Family::Dnd(n) => n,
            Family::S(n) => n / 2,
            Family::T | Family::Td | Family::Th => 2,
            Family::O | Family::Oh => 4,
            Family::I | Family::Ih => 2,
            Family::Cinfv | Family::Dinfh => 0,
            _ => 1,
        }
    }

    /// Generators in the standard orientation. The linear groups get the generators of
    /// their customary finite stand-ins C2v and D2h.
    pub(crate) fn generators(&self) -> Vec<M3> {
        let z = V3::z();
        let cz = |n: usize| rotation(&z, 2.0 * PI / n as f64);
        let c2x = rotation(&V3::x(), PI);
        let sigma_h = reflection(&z);
        let sigma_xz = reflection(&V3::y());
        let c3_111 = rotation(&V3::new(1.0, 1.0, 1.0), 2.0 * PI / 3.0);
        let inv = -M3::identity();
        let phi = (1.0 + 5f64.sqrt()) / 2.0;
        match *self {
            Family::C1 => vec![],
            Family::Cs => vec![sigma_h],
            Family::Ci => vec![inv],
            Family::Cn(n) => vec![cz(n)],
            Family::Cnv(n) => vec![cz(n), sigma_xz],
            Family::Cnh(n) => vec![cz(n), sigma_h],
            Family::Dn(n) => vec![cz(n), c2x],
            Family::Dnh(n) => vec![cz(n), c2x, sigma_h],
            Family::Dnd(n) => vec![improper(&z, PI / n as f64), c2x],
            Family::S(n) => vec![improper(&z, 2.0 * PI / n as f64)],
            Family::T => vec![cz(2), c3_111],
            Family::Td => vec![cz(2), c3_111, improper(&z, PI / 2.0)],
            Family::Th => vec![cz(2), c3_111, inv],
            Family::O => vec![cz(4), c3_111],
            Family::Oh => vec![cz(4), c3_111, inv],
            Family::I | Family::Ih => {
                let mut g = vec![
                    cz(2),
                    c3_111,
                    rotation(&V3::new(0.0, 1.0, phi), 2.0 * PI / 5.0),
                ];
                if *self == Family::Ih {
                    g.push(inv);
                }
                g
            }
            Family::Cinfv => vec![cz(2), sigma_xz],
            Family::Dinfh => vec![cz(2), c2x, sigma_h],
        }
    }

    /// All operations in the standard orientation, identity first (finite stand-ins for
    /// the linear groups).
    pub fn operations(&self) -> Vec<M3> {
        closure(&self.generators(), 240)
            .map(|c| c.ops)
            .unwrap_or_else(|| vec![M3::identity()])
    }
}

/// Order of the group with this table name (`None` for unknown names and for the
/// infinite linear groups).
pub fn group_order(name: &str) -> Option<usize> {
    Family::parse(name)?.order()
}

/// All supported table names.
pub fn supported_groups() -> Vec<String> {
    let mut v: Vec<String> = ["C1", "Cs", "Ci"].iter().map(|s| s.to_string()).collect();
    for n in 2..=MAX_ORDER {
        for f in [Family::Cn(n), Family::Cnv(n), Family::Cnh(n)] {
            v.push(f.name());
        }
        for f in [Family::Dn(n), Family::Dnh(n), Family::Dnd(n)] {
            v.push(f.name());
        }
    }
    for n in [4, 6, 8, 10, 12] {
        v.push(Family::S(n).name());
    }
    for s in ["T", "Td", "Th", "O", "Oh", "I", "Ih", "Cinfv", "Dinfh"] {
        v.push(s.to_string());
    }
    v
}
