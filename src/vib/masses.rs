//! Atomic masses: the most abundant isotope of each element by default, isotopes on request
//! (`3=2H`, `H=D`, `Cl=37Cl`, `C=13C`), or standard atomic weights. Values from the
//! `periodictable` package (see `masses_data.rs`: AME 2020 isotope masses, IUPAC CIAAW
//! abundances and atomic weights).

use super::masses_data::{ATOMIC_WEIGHTS, ISOTOPES};
use crate::geom::elements;

/// How the masses of the parent molecule are chosen.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, serde::Serialize)]
pub enum MassModel {
    /// The most abundant isotope of each element.
    #[default]
    MostAbundant,
    /// Standard atomic weights (natural isotope mixture).
    Average,
}

/// Mass (u) of isotope `a` of element `z`.
pub fn isotope_mass(z: u8, a: u16) -> Option<f64> {
    ISOTOPES
        .iter()
        .find(|(zz, aa, _, _)| *zz == z && *aa == a)
        .map(|t| t.2)
}

/// The most abundant isotope of element `z`: (mass number, mass in u).
pub fn most_abundant(z: u8) -> Option<(u16, f64)> {
    ISOTOPES
        .iter()
        .filter(|t| t.0 == z)
        .max_by(|a, b| a.3.total_cmp(&b.3))
        .map(|t| (t.1, t.2))
}

/// Standard atomic weight of element `z` (u).
pub fn atomic_weight(z: u8) -> Option<f64> {
    ATOMIC_WEIGHTS.iter().find(|t| t.0 == z).map(|t| t.1)
}

/// Default mass of element `z` under a model.
pub fn default_mass(z: u8, model: MassModel) -> Option<f64> {
    match model {
        MassModel::MostAbundant => most_abundant(z).map(|t| t.1),
        MassModel::Average => atomic_weight(z),
    }
}

/// Which atoms an isotope replacement applies to.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub enum IsotopeTarget {
    /// One atom, numbered from 1 in the input order.
    Atom(usize),
    /// Every atom of an element.
    Element(u8),
}

/// One replacement such as `3=2H`, `H=D`, `Cl=37Cl`.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct Isotope {
    pub target: IsotopeTarget,
    pub element: u8,
    pub mass_number: u16,
    pub mass: f64,
    /// As written.
    pub text: String,
}

/// Parse `TARGET=ISOTOPE`: TARGET an atom number from 1 or an element symbol; ISOTOPE a mass
/// number and symbol (`2H`, `37Cl`, `13C`), or `D` / `T` for ²H / ³H.
pub fn parse_isotope(text: &str) -> Result<Isotope, String> {
    let (t, i) = text.split_once('=').ok_or_else(|| {
        format!("isotope `{text}`: expected TARGET=ISOTOPE, e.g. 3=2H, H=D or Cl=37Cl")
    })?;
    let (t, i) = (t.trim(), i.trim());
    let (element, mass_number) = match i {
        "D" => (1, 2),
        "T" => (1, 3),
        _ => {
            let digits: String = i.chars().take_while(|c| c.is_ascii_digit()).collect();
            let sym = &i[digits.len()..];
            let z = elements::atomic_number(sym)
                .ok_or_else(|| format!("isotope `{text}`: `{sym}` is not an element symbol"))?;
            let a: u16 = digits.parse().map_err(|_| {
                format!("isotope `{text}`: give the mass number before the symbol, e.g. 37Cl")
            })?;
            (z, a)
        }
    };
    let mass = isotope_mass(element, mass_number).ok_or_else(|| {
        format!(
            "isotope `{text}`: no mass known for {mass_number}{} (natural isotopes, 2H and 3H are tabulated)",
            elements::symbol(element).unwrap_or("?")
        )
    })?;
    let target = if let Ok(n) = t.parse::<usize>() {
        if n == 0 {
            return Err(format!("isotope `{text}`: atoms are numbered from 1"));
        }
        IsotopeTarget::Atom(n)
    } else {
        let z = match t {
            "D" | "T" => 1,
            _ => elements::atomic_number(t).ok_or_else(|| {
                format!("isotope `{text}`: `{t}` is neither an atom number nor an element")
            })?,
        };
        IsotopeTarget::Element(z)
    };
    Ok(Isotope {
        target,
        element,
        mass_number,
        mass,
        text: text.trim().to_string(),
    })
}

/// Masses of a molecule (elements per atom) under a model, then the replacements applied.
/// A replacement must keep the element of the atom it names.
pub fn masses_of(
    elements_z: &[u8],
    model: MassModel,
    isotopes: &[Isotope],
) -> Result<Vec<f64>, String> {
    let mut m: Vec<f64> = elements_z
        .iter()
        .map(|&z| {
            default_mass(z, model).ok_or_else(|| format!("no mass tabulated for element {z}"))
        })
        .collect::<Result<_, _>>()?;
    for iso in isotopes {
        let mut hit = false;
        for (k, &z) in elements_z.iter().enumerate() {
            let applies = match iso.target {
                IsotopeTarget::Atom(n) => n == k + 1,
                IsotopeTarget::Element(e) => e == z,
            };
            if applies {
                if z != iso.element {
                    return Err(format!(
                        "isotope `{}`: atom {} is {}, not {}",
                        iso.text,
                        k + 1,
                        elements::symbol(z).unwrap_or("?"),
                        elements::symbol(iso.element).unwrap_or("?")
                    ));
                }
                m[k] = iso.mass;
                hit = true;
            }
        }
        if !hit {
            return Err(match iso.target {
                IsotopeTarget::Atom(n) => format!(
                    "isotope `{}`: there is no atom {n} ({} atoms)",
                    iso.text,
                    elements_z.len()
                ),
                IsotopeTarget::Element(_) => {
                    format!("isotope `{}`: the molecule has no such atom", iso.text)
                }
            });
        }
    }
    Ok(m)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn most_abundant_isotopes() {
        // Source: AME 2020 via the periodictable package; 12C is 12 u by definition.
        assert_eq!(most_abundant(6), Some((12, 12.0)));
        assert_eq!(most_abundant(17).unwrap().0, 35);
        assert_eq!(most_abundant(1).unwrap().0, 1);
        assert!((most_abundant(8).unwrap().1 - 15.994_914_62).abs() < 1e-7);
        // every element the XYZ reader knows up to Bi has a default mass
        for z in 1..=83u8 {
            assert!(most_abundant(z).is_some(), "Z = {z}");
            assert!(atomic_weight(z).is_some(), "Z = {z}");
        }
    }

    #[test]
    fn isotope_syntax() {
        let d = parse_isotope("H=D").unwrap();
        assert_eq!(d.target, IsotopeTarget::Element(1));
        assert_eq!(d.mass_number, 2);
        let c = parse_isotope("3=37Cl").unwrap();
        assert_eq!(c.target, IsotopeTarget::Atom(3));
        assert!((c.mass - 36.965_902_6).abs() < 1e-6);
        assert!(parse_isotope("H=99H").is_err());
        assert!(parse_isotope("0=2H").is_err());
        assert!(parse_isotope("HD").is_err());
        let m = masses_of(
            &[8, 1, 1],
            MassModel::MostAbundant,
            &[parse_isotope("2=2H").unwrap()],
        )
        .unwrap();
        assert!((m[1] - 2.014_101_78).abs() < 1e-6 && (m[2] - 1.007_825).abs() < 1e-5);
        assert!(masses_of(
            &[8, 1, 1],
            MassModel::MostAbundant,
            &[parse_isotope("1=2H").unwrap()]
        )
        .is_err());
        assert!(masses_of(
            &[8, 1, 1],
            MassModel::MostAbundant,
            &[parse_isotope("Cl=37Cl").unwrap()]
        )
        .is_err());
    }
}
