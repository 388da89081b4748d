//! Formulas and bond labels as chemists write them.
//!
//! Source: IUPAC, *Nomenclature of Inorganic Chemistry* (Recommendations 2005, the "Red Book"):
//! IR-4.4.2.1 — in the formula of a compound the more electropositive constituent is cited
//! first, "electropositive" meaning earlier in the element sequence of Table VI (which walks
//! the periodic table group by group, each group from its heaviest member up, with hydrogen
//! placed between groups 15 and 16); IR-4.4.3 / IR-9.2 — a coordination entity is enclosed in
//! square brackets, central atom first, then the ligands alphabetically. Carbon compounds
//! follow the Hill order (C, H, then the other elements alphabetically; CAS practice).
//!
//! Bond labels put the central atom first (P–F, not F–P): the atom with more bonds, or on a tie
//! the more electropositive one by the same Table VI sequence (common practice).

use std::collections::BTreeMap;

/// The element sequence of IUPAC 2005 Table VI (IR-4.4.2.1), from the most electropositive
/// end: noble gases, groups 1–17 each from the bottom up, H between groups 15 and 16.
pub const TABLE_VI: &[&str] = &[
    "Og", "Rn", "Xe", "Kr", "Ar", "Ne", "He", // 18
    "Fr", "Cs", "Rb", "K", "Na", "Li", // 1
    "Ra", "Ba", "Sr", "Ca", "Mg", "Be", // 2
    "Lr", "No", "Md", "Fm", "Es", "Cf", "Bk", "Cm", "Am", "Pu", "Np", "U", "Pa", "Th",
    "Ac", // 3
    "Lu", "Yb", "Tm", "Er", "Ho", "Dy", "Tb", "Gd", "Eu", "Sm", "Pm", "Nd", "Pr", "Ce", "La", "Y",
    "Sc", //
    "Rf", "Hf", "Zr", "Ti", // 4
    "Db", "Ta", "Nb", "V", // 5
    "Sg", "W", "Mo", "Cr", // 6
    "Bh", "Re", "Tc", "Mn", // 7
    "Hs", "Os", "Ru", "Fe", // 8
    "Mt", "Ir", "Rh", "Co", // 9
    "Ds", "Pt", "Pd", "Ni", // 10
    "Rg", "Au", "Ag", "Cu", // 11
    "Cn", "Hg", "Cd", "Zn", // 12
    "Nh", "Tl", "In", "Ga", "Al", "B", // 13
    "Fl", "Pb", "Sn", "Ge", "Si", "C", // 14
    "Mc", "Bi", "Sb", "As", "P", "N", // 15
    "H", //
    "Lv", "Po", "Te", "Se", "S", "O", // 16
    "Ts", "At", "I", "Br", "Cl", "F", // 17
];

/// Place of an element in Table VI (unknown symbols after every element).
pub fn table_vi_rank(symbol: &str) -> usize {
    TABLE_VI
        .iter()
        .position(|s| *s == symbol)
        .unwrap_or(TABLE_VI.len())
}

/// Metals of the d and f blocks (groups 3–12, lanthanoids, actinoids): the central atoms a
/// formula puts in square brackets.
fn d_or_f_block(symbol: &str) -> bool {
    let i = table_vi_rank(symbol);
    let first = table_vi_rank("Lr");
    let last = table_vi_rank("Zn");
    (first..=last).contains(&i)
}

/// The formula of a set of atoms, ASCII digits (`SF6`, `PCl5`, `[PtCl4]`, `CH4`, `H2O`).
pub fn formula<'a>(symbols: impl IntoIterator<Item = &'a str>) -> String {
    let mut counts: BTreeMap<&str, usize> = BTreeMap::new();
    for s in symbols {
        *counts.entry(s).or_default() += 1;
    }
    let part = |k: &str| match counts[k] {
        1 => k.to_string(),
        n => format!("{k}{n}"),
    };
    let mut keys: Vec<&str> = counts.keys().copied().collect();
    if counts.contains_key("C") {
        // Hill: C, H, then alphabetical (BTreeMap order).
        keys.sort_by_key(|k| match *k {
            "C" => 0,
            "H" => 1,
            _ => 2,
        });
        return keys.iter().map(|k| part(k)).collect();
    }
    let metals: Vec<&str> = keys.iter().copied().filter(|k| d_or_f_block(k)).collect();
    if metals.len() == 1 && counts[metals[0]] == 1 && keys.len() > 1 {
        // A coordination entity: [central atom, then the ligand atoms alphabetically].
        let rest: String = keys
            .iter()
            .filter(|k| **k != metals[0])
            .map(|k| part(k))
            .collect();
        return format!("[{}{rest}]", part(metals[0]));
    }
    keys.sort_by_key(|k| (table_vi_rank(k), *k));
    keys.iter().map(|k| part(k)).collect()
}

/// Digits as Unicode subscripts: `SF6` → `SF₆`.
pub fn subscripts(s: &str) -> String {
    s.chars()
        .map(|c| match c.to_digit(10) {
            Some(d) => char::from_u32('₀' as u32 + d).unwrap_or(c),
            None => c,
        })
        .collect()
}

/// A bond label, central atom first: the atom with more bonds (`degree`), else the more
/// electropositive by Table VI. `dash` joins them (`–` or `-`).
pub fn bond_label(a: (&str, usize), b: (&str, usize), dash: &str) -> String {
    let key = |(s, n): (&str, usize)| (std::cmp::Reverse(n), table_vi_rank(s), s.to_string());
    let (x, y) = if key(a) <= key(b) { (a, b) } else { (b, a) };
    format!("{}{dash}{}", x.0, y.0)
}
