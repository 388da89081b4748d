//! Physical constants, CODATA 2018 (E. Tiesinga, P. J. Mohr, D. B. Newell, B. N. Taylor,
//! Rev. Mod. Phys. 93, 025010 (2021)), and the unit conversions of Hessians.

/// Hartree energy, J.
pub const HARTREE_J: f64 = 4.359_744_722_207_1e-18;
/// Bohr radius, m.
pub const BOHR_M: f64 = 5.291_772_109_03e-11;
/// Bohr radius, Å.
pub const BOHR_ANGSTROM: f64 = 0.529_177_210_903;
/// Atomic mass constant (1 u), kg.
pub const AMU_KG: f64 = 1.660_539_066_60e-27;
/// Speed of light in vacuum, m/s (exact).
pub const LIGHT_M_S: f64 = 299_792_458.0;
/// Avogadro constant, 1/mol (exact).
pub const AVOGADRO: f64 = 6.022_140_76e23;
/// Electron volt, J (exact).
pub const EV_J: f64 = 1.602_176_634e-19;
/// Thermochemical calorie, J (exact by definition).
pub const CAL_J: f64 = 4.184;

/// Wavenumber (cm⁻¹) of an eigenvalue λ of the mass-weighted Hessian in hartree/(bohr²·u):
/// ν̃ = √(λ·Eh/(a0²·u)) / (2πc), in cm⁻¹; negative λ gives a negative (imaginary) wavenumber.
pub fn wavenumber_cm(lambda: f64) -> f64 {
    let scale = (HARTREE_J / (BOHR_M * BOHR_M * AMU_KG)).sqrt()
        / (2.0 * std::f64::consts::PI * LIGHT_M_S * 100.0);
    lambda.signum() * lambda.abs().sqrt() * scale
}

/// Factor from a force-constant unit to hartree/bohr².
pub fn to_hartree_per_bohr2(units: HessianUnits) -> f64 {
    let per_angstrom2_to_per_bohr2 = BOHR_ANGSTROM * BOHR_ANGSTROM;
    match units {
        HessianUnits::HartreePerBohr2 => 1.0,
        // 1 mdyn/Å = 1e-8 N / 1e-10 m = 100 N/m = 100 J/m²
        HessianUnits::MdynPerAngstrom => 100.0 * BOHR_M * BOHR_M / HARTREE_J,
        HessianUnits::KcalPerMolPerAngstrom2 => {
            1000.0 * CAL_J / AVOGADRO / HARTREE_J * per_angstrom2_to_per_bohr2
        }
        HessianUnits::EvPerAngstrom2 => EV_J / HARTREE_J * per_angstrom2_to_per_bohr2,
    }
}

/// Units a plain-text Hessian may be given in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
pub enum HessianUnits {
    HartreePerBohr2,
    MdynPerAngstrom,
    KcalPerMolPerAngstrom2,
    EvPerAngstrom2,
}

impl HessianUnits {
    /// The accepted spellings.
    pub const NAMES: &'static str =
        "hartree/bohr2 | mdyn/angstrom | kcal/mol/angstrom2 | eV/angstrom2";

    pub fn parse(s: &str) -> Option<Self> {
        let t = s
            .trim()
            .to_ascii_lowercase()
            .replace(['²', ' '], "2")
            .replace('å', "angstrom");
        match t.as_str() {
            "hartree/bohr2" | "eh/bohr2" | "hartree/bohr^2" => Some(Self::HartreePerBohr2),
            "mdyn/angstrom" | "mdyn/a" => Some(Self::MdynPerAngstrom),
            "kcal/mol/angstrom2" | "kcal/mol/angstrom^2" | "kcal/mol/a2" => {
                Some(Self::KcalPerMolPerAngstrom2)
            }
            "ev/angstrom2" | "ev/angstrom^2" | "ev/a2" => Some(Self::EvPerAngstrom2),
            _ => None,
        }
    }

    pub fn name(self) -> &'static str {
        match self {
            Self::HartreePerBohr2 => "hartree/bohr2",
            Self::MdynPerAngstrom => "mdyn/angstrom",
            Self::KcalPerMolPerAngstrom2 => "kcal/mol/angstrom2",
            Self::EvPerAngstrom2 => "eV/angstrom2",
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn mdyn_per_angstrom_in_atomic_units() {
        // from memory: 1 hartree/bohr² = 15.569 mdyn/Å (common practice conversion)
        let f = to_hartree_per_bohr2(HessianUnits::MdynPerAngstrom);
        assert!((1.0 / f - 15.5689).abs() < 1e-3, "{}", 1.0 / f);
    }

    #[test]
    fn unit_names_round_trip() {
        for u in [
            HessianUnits::HartreePerBohr2,
            HessianUnits::MdynPerAngstrom,
            HessianUnits::KcalPerMolPerAngstrom2,
            HessianUnits::EvPerAngstrom2,
        ] {
            assert_eq!(HessianUnits::parse(u.name()), Some(u));
        }
        assert_eq!(HessianUnits::parse("furlongs"), None);
    }
}
