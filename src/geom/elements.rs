//! Chemical elements Z = 1..=118: symbols, covalent radii and standard atomic masses.
//!
//! Covalent radii: B. Cordero, V. Gómez, A. E. Platero-Prats, M. Revés, J. Echeverría,
//! E. Cremades, F. Barragán and S. Alvarez, "Covalent radii revisited",
//! Dalton Trans. 2008, 2832–2838. The paper covers Z = 1..=96; the values below are
//! typed from memory of its Table 2 (C is the sp³ value, Mn/Fe/Co the low-spin values).
//! Heavier elements have no radius ([`covalent_radius`] returns `None`).
//!
//! Masses: IUPAC standard atomic weights (abridged, conventional values for elements with
//! an interval), from memory; for elements without stable isotopes the mass number of the
//! longest-lived (or best-known) isotope is used, as periodic tables customarily print it.

/// Largest supported atomic number.
pub const MAX_Z: u8 = 118;

const SYMBOLS: [&str; 119] = [
    "", "H", "He", "Li", "Be", "B", "C", "N", "O", "F", "Ne", "Na", "Mg", "Al", "Si", "P", "S",
    "Cl", "Ar", "K", "Ca", "Sc", "Ti", "V", "Cr", "Mn", "Fe", "Co", "Ni", "Cu", "Zn", "Ga", "Ge",
    "As", "Se", "Br", "Kr", "Rb", "Sr", "Y", "Zr", "Nb", "Mo", "Tc", "Ru", "Rh", "Pd", "Ag", "Cd",
    "In", "Sn", "Sb", "Te", "I", "Xe", "Cs", "Ba", "La", "Ce", "Pr", "Nd", "Pm", "Sm", "Eu", "Gd",
    "Tb", "Dy", "Ho", "Er", "Tm", "Yb", "Lu", "Hf", "Ta", "W", "Re", "Os", "Ir", "Pt", "Au", "Hg",
    "Tl", "Pb", "Bi", "Po", "At", "Rn", "Fr", "Ra", "Ac", "Th", "Pa", "U", "Np", "Pu", "Am", "Cm",
    "Bk", "Cf", "Es", "Fm", "Md", "No", "Lr", "Rf", "Db", "Sg", "Bh", "Hs", "Mt", "Ds", "Rg", "Cn",
    "Nh", "Fl", "Mc", "Lv", "Ts", "Og",
];

/// Cordero et al. (2008) covalent radii in Å, index = Z, 0.0 = not covered (Z > 96).
/// Values from memory of the paper's Table 2.
const RADII: [f64; 97] = [
    0.0, // placeholder for Z = 0
    0.31, 0.28, // H He
    1.28, 0.96, 0.84, 0.76, 0.71, 0.66, 0.57, 0.58, // Li..Ne (C: sp3)
    1.66, 1.41, 1.21, 1.11, 1.07, 1.05, 1.02, 1.06, // Na..Ar
    2.03, 1.76, 1.70, 1.60, 1.53, 1.39, 1.39, 1.32, 1.26, 1.24, 1.32,
    1.22, // K..Zn (Mn, Fe, Co low spin)
    1.22, 1.20, 1.19, 1.20, 1.20, 1.16, // Ga..Kr
    2.20, 1.95, 1.90, 1.75, 1.64, 1.54, 1.47, 1.46, 1.42, 1.39, 1.45, 1.44, // Rb..Cd
    1.42, 1.39, 1.39, 1.38, 1.39, 1.40, // In..Xe
    2.44, 2.15, // Cs Ba
    2.07, 2.04, 2.03, 2.01, 1.99, 1.98, 1.98, 1.96, 1.94, 1.92, 1.92, 1.89, 1.90, 1.87,
    1.87, // La..Lu
    1.75, 1.70, 1.62, 1.51, 1.44, 1.41, 1.36, 1.36, 1.32, // Hf..Hg
    1.45, 1.46, 1.48, 1.40, 1.50, 1.50, // Tl..Rn
    2.60, 2.21, // Fr Ra
    2.15, 2.06, 2.00, 1.96, 1.90, 1.87, 1.80, 1.69, // Ac..Cm
];

/// Standard atomic masses in u, index = Z (from memory, see module docs).
const MASSES: [f64; 119] = [
    0.0, 1.008, 4.0026, // H He
    6.94, 9.0122, 10.81, 12.011, 14.007, 15.999, 18.998, 20.180, // Li..Ne
    22.990, 24.305, 26.982, 28.085, 30.974, 32.06, 35.45, 39.948, // Na..Ar
    39.098, 40.078, 44.956, 47.867, 50.942, 51.996, 54.938, 55.845, 58.933, 58.693, 63.546,
    65.38, // K..Zn
    69.723, 72.630, 74.922, 78.971, 79.904, 83.798, // Ga..Kr
    85.468, 87.62, 88.906, 91.224, 92.906, 95.95, 98.0, 101.07, 102.91, 106.42, 107.87,
    112.41, // Rb..Cd
    114.82, 118.71, 121.76, 127.60, 126.90, 131.29, // In..Xe
    132.91, 137.33, // Cs Ba
    138.91, 140.12, 140.91, 144.24, 145.0, 150.36, 151.96, 157.25, 158.93, 162.50, 164.93, 167.26,
    168.93, 173.05, 174.97, // La..Lu
    178.49, 180.95, 183.84, 186.21, 190.23, 192.22, 195.08, 196.97, 200.59, // Hf..Hg
    204.38, 207.2, 208.98, 209.0, 210.0, 222.0, // Tl..Rn
    223.0, 226.0, // Fr Ra
    227.0, 232.04, 231.04, 238.03, 237.0, 244.0, 243.0, 247.0, 247.0, 251.0, 252.0, 257.0, 258.0,
    259.0, 262.0, // Ac..Lr
    267.0, 268.0, 269.0, 270.0, 269.0, 278.0, 281.0, 282.0, 285.0, // Rf..Cn
    286.0, 289.0, 290.0, 293.0, 294.0, 294.0, // Nh..Og
];

/// The element symbol for atomic number `z` (1..=118), e.g. `symbol(6) == Some("C")`.
pub fn symbol(z: u8) -> Option<&'static str> {
    if (1..=MAX_Z).contains(&z) {
        Some(SYMBOLS[z as usize])
    } else {
        None
    }
}

/// The atomic number for a symbol (case-insensitive: `"C"`, `"cl"`, `"CL"`) or for a
/// decimal atomic number (`"6"`). Surrounding whitespace is ignored.
pub fn atomic_number(text: &str) -> Option<u8> {
    let t = text.trim();
    if t.is_empty() || t.len() > 3 {
        return None;
    }
    if t.bytes().all(|b| b.is_ascii_digit()) {
        let z: u8 = t.parse().ok()?;
        return symbol(z).map(|_| z);
    }
    SYMBOLS
        .iter()
        .enumerate()
        .skip(1)
        .find(|(_, s)| s.eq_ignore_ascii_case(t))
        .map(|(z, _)| z as u8)
}

/// Cordero et al. (2008) covalent radius in Å, `None` for Z > 96 or invalid Z.
pub fn covalent_radius(z: u8) -> Option<f64> {
    RADII.get(z as usize).copied().filter(|r| *r > 0.0)
}

/// Standard atomic mass in u (see module docs), `None` for invalid Z.
pub fn mass(z: u8) -> Option<f64> {
    symbol(z).map(|_| MASSES[z as usize])
}
