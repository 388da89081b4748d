//! Writing SALCs as a chemist does: a normalization factor times a short combination,
//! `1/√6 (2r₁ − r₂ − r₃)`, in Unicode or ASCII, with exact coefficient strings for JSON.

use super::build::Salc;
use crate::basis::Member;
use crate::exact::{sqrt, Cyclo, Notation};

/// `r1` → `r₁`, `π2a` → `π₂a` (Unicode); `θ1` → `theta1`, `σ1` → `sigma1`, `π1a` → `pi1a` (ASCII).
pub fn member_name(m: &Member, nt: Notation) -> String {
    match nt {
        Notation::Unicode => m
            .name
            .chars()
            .map(|c| match c {
                '0'..='9' => char::from_u32('₀' as u32 + (c as u32 - '0' as u32)).unwrap_or(c),
                c => c,
            })
            .collect(),
        Notation::Ascii => m
            .name
            .replace('θ', "theta")
            .replace('σ', "sigma")
            .replace('π', "pi"),
    }
}

fn is_atomic(s: &str) -> bool {
    let body = s.strip_prefix(['-', '−']).unwrap_or(s);
    !body.contains(['+', '-', '−', '/', ' ', '*'])
}

/// `1/√6`, `1/2`, `` (for 1), `1/√((5+√5)/2)`.
pub fn norm_factor(norm2: &Cyclo, nt: Notation) -> String {
    if norm2.is_one() {
        return String::new();
    }
    let root = if nt == Notation::Unicode {
        "√"
    } else {
        "sqrt"
    };
    if let Some(q) = norm2.to_rational() {
        if let Ok(s) = sqrt(&Cyclo::from_rational(q.clone())) {
            if s.is_rational() {
                return format!("1/{}", s.text(nt));
            }
        }
        if q.is_integer() {
            return if nt == Notation::Unicode {
                format!("1/√{}", q)
            } else {
                format!("1/sqrt({})", q)
            };
        }
    }
    format!("1/{root}({})", norm2.text(nt))
}

/// The combination without its factor: `2r₁ − r₂ − r₃`.
pub fn combination(s: &Salc, members: &[Member], nt: Notation) -> String {
    let minus = if nt == Notation::Unicode { "−" } else { "-" };
    let mut out = String::new();
    for (c, m) in s.coefficients.iter().zip(members) {
        if c.is_zero() {
            continue;
        }
        let name = member_name(m, nt);
        let neg = c.signum_real() < 0 && c.is_real();
        let mag = if neg { -c.clone() } else { c.clone() };
        let coef = if mag.is_one() {
            String::new()
        } else {
            let t = mag.text(nt);
            if is_atomic(&t) {
                t
            } else {
                format!("({t})")
            }
        };
        let sep = if nt == Notation::Unicode
            && !coef.is_empty()
            && !coef.ends_with(')')
            && coef.chars().last().is_some_and(|ch| !ch.is_ascii_digit())
        {
            "·"
        } else if nt == Notation::Ascii
            && !coef.is_empty()
            && !coef.chars().last().is_some_and(|ch| ch.is_ascii_digit())
        {
            "*"
        } else {
            ""
        };
        let term = format!("{coef}{sep}{name}");
        if out.is_empty() {
            if neg {
                out.push_str(minus);
            }
        } else {
            out.push_str(&format!(" {} ", if neg { minus } else { "+" }));
        }
        out.push_str(&term);
    }
    if out.is_empty() {
        "0".into()
    } else {
        out
    }
}

/// The whole SALC: `1/√6 (2r₁ − r₂ − r₃)`.
pub fn salc_text(s: &Salc, members: &[Member], nt: Notation) -> String {
    let f = norm_factor(&s.norm2, nt);
    let c = combination(s, members, nt);
    if f.is_empty() {
        c
    } else {
        format!("{f} ({c})")
    }
}

/// Exact normalized coefficient strings (ASCII): `1/2`, `-1/sqrt(6)`, `2/sqrt(6)`.
pub fn coefficient_strings(s: &Salc) -> Vec<String> {
    // A rational √norm² is divided out; otherwise coefficients are written as c/sqrt(N).
    let exact_root = s
        .norm2
        .to_rational()
        .and_then(|q| crate::exact::sqrt_rational(&q).ok())
        .filter(|r| r.is_rational());
    let n = s.norm2.text(Notation::Ascii);
    let n = if s.norm2.is_rational() && s.norm2.to_rational().is_some_and(|q| q.is_integer()) {
        n
    } else {
        format!("({n})")
    };
    s.coefficients
        .iter()
        .map(|c| {
            if c.is_zero() {
                return "0".into();
            }
            if let Some(r) = exact_root.as_ref() {
                return (c / r).text(Notation::Ascii);
            }
            let t = c.text(Notation::Ascii);
            let t = if is_atomic(&t) { t } else { format!("({t})") };
            format!("{t}/sqrt({n})")
        })
        .collect()
}

/// Central-atom orbitals of shells s … `l_max` beside every irrep the ligand SALCs span;
/// `axial` = Some(Λ) for the ligands of a linear molecule (σ: 0, π: 1), so that only orbitals
/// of the same species along the axis are listed (see `basis::central_orbitals`).
pub fn central_orbital_matches(
    set: &super::SalcSet,
    l_max: usize,
    axial: Option<u32>,
) -> Vec<super::Matching> {
    set.irreps
        .iter()
        .enumerate()
        .filter(|(x, _)| set.multiplicities[*x] > 0)
        .map(|(x, ir)| super::Matching {
            irrep: x,
            central: crate::basis::central_orbitals(&set.group, l_max, ir.row, ir.dim, axial),
        })
        .collect()
}
