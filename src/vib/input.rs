//! Reading a Hessian: a QCSchema AtomicResult (MolSSI's open JSON standard; `driver =
//! "hessian"`, `molecule.symbols`, `molecule.geometry` in bohr, `return_result` the 3N×3N
//! Hessian in hartree/bohr², row-major, flat or nested), or a plain-text matrix (full or lower
//! triangle, whitespace separated) beside a geometry, in stated units.

use super::constants::{to_hartree_per_bohr2, HessianUnits, BOHR_ANGSTROM};
use super::error::VibError;
use crate::geom::{elements, Molecule};
use nalgebra::{DMatrix, Vector3};
use serde_json::Value;

/// Largest accepted number of atoms (a 3N×3N dense matrix of f64: 3,000 atoms is 648 MB).
pub const MAX_ATOMS: usize = 3_000;

/// Allowed |H_ij − H_ji| before the matrix is refused (hartree/bohr²); below it the matrix
/// is averaged with its transpose. Finite-difference Hessians are customarily symmetric to
/// 1e-5 or better (common practice).
pub const ASYMMETRY_TOLERANCE: f64 = 1e-4;

/// A geometry and its Cartesian Hessian.
#[derive(Debug, Clone)]
pub struct HessianInput {
    pub title: String,
    /// Atomic numbers in input order.
    pub elements: Vec<u8>,
    /// Positions, Å.
    pub positions: Vec<Vector3<f64>>,
    /// 3N×3N, hartree/bohr², atom-major (x1 y1 z1 x2 …), symmetric.
    pub hessian: DMatrix<f64>,
    /// Largest |H_ij − H_ji| found before averaging (hartree/bohr²).
    pub asymmetry: f64,
    /// File names, for messages.
    pub source: String,
}

impl HessianInput {
    pub fn n_atoms(&self) -> usize {
        self.elements.len()
    }
    /// The geometry as a molecule (Å).
    pub fn molecule(&self) -> Molecule {
        Molecule::new(
            self.title.clone(),
            self.elements
                .iter()
                .zip(&self.positions)
                .map(|(&z, p)| crate::geom::Atom::new(z, *p))
                .collect(),
        )
    }
}

/// Does this text look like JSON (QCSchema)?
pub fn looks_like_json(text: &str) -> bool {
    text.trim_start().starts_with('{')
}

fn jerr(file: &str, path: &str, message: impl Into<String>) -> VibError {
    VibError::Json {
        file: file.into(),
        path: path.into(),
        message: message.into(),
    }
}

/// Read a QCSchema AtomicResult with a Hessian.
pub fn read_qcschema(file: &str, text: &str) -> Result<HessianInput, VibError> {
    let v: Value = serde_json::from_str(text).map_err(|e| VibError::At {
        file: file.into(),
        line: e.line(),
        column: e.column(),
        message: format!("not valid JSON: {e}"),
    })?;
    match v.get("driver").and_then(Value::as_str) {
        Some("hessian") => {}
        Some(other) => {
            return Err(jerr(
                file,
                "driver",
                format!("is \"{other}\"; a frequency job's result has driver \"hessian\""),
            ))
        }
        None => return Err(jerr(file, "driver", "missing (expected \"hessian\")")),
    }
    let mol = v
        .get("molecule")
        .ok_or_else(|| jerr(file, "molecule", "missing"))?;
    let symbols = mol
        .get("symbols")
        .and_then(Value::as_array)
        .ok_or_else(|| jerr(file, "molecule.symbols", "missing or not a list"))?;
    let mut elements_z = Vec::with_capacity(symbols.len());
    for (k, s) in symbols.iter().enumerate() {
        let path = format!("molecule.symbols[{k}]");
        let s = s
            .as_str()
            .ok_or_else(|| jerr(file, &path, "not a string"))?;
        let z = elements::atomic_number(s)
            .ok_or_else(|| jerr(file, &path, format!("`{s}` is not an element symbol")))?;
        elements_z.push(z);
    }
    let n = elements_z.len();
    if n == 0 {
        return Err(jerr(file, "molecule.symbols", "no atoms"));
    }
    if n > MAX_ATOMS {
        return Err(jerr(
            file,
            "molecule.symbols",
            format!("{n} atoms: more than the {MAX_ATOMS} a dense Hessian is read for"),
        ));
    }
    let geom = flat_numbers(
        file,
        "molecule.geometry",
        mol.get("geometry")
            .ok_or_else(|| jerr(file, "molecule.geometry", "missing"))?,
    )?;
    if geom.len() != 3 * n {
        return Err(VibError::Size {
            file: file.into(),
            message: format!(
                "molecule.geometry has {} numbers; {n} symbols need {}",
                geom.len(),
                3 * n
            ),
        });
    }
    let positions = (0..n)
        .map(|a| Vector3::new(geom[3 * a], geom[3 * a + 1], geom[3 * a + 2]) * BOHR_ANGSTROM)
        .collect();
    let h = flat_numbers(
        file,
        "return_result",
        v.get("return_result")
            .ok_or_else(|| jerr(file, "return_result", "missing"))?,
    )?;
    let dim = 3 * n;
    if h.len() != dim * dim {
        let guess = ((h.len() as f64).sqrt() / 3.0).round() as usize;
        return Err(if guess * guess * 9 == h.len() {
            VibError::AtomsMismatch {
                file: file.into(),
                hessian: guess,
                rows: 3 * guess,
                geometry: n,
            }
        } else {
            VibError::Size {
                file: file.into(),
                message: format!(
                    "return_result has {} numbers; {n} atoms need {dim}×{dim} = {}",
                    h.len(),
                    dim * dim
                ),
            }
        });
    }
    let title = mol
        .get("name")
        .and_then(Value::as_str)
        .unwrap_or(file)
        .to_string();
    let (hessian, asymmetry) = symmetric(file, DMatrix::from_row_slice(dim, dim, &h))?;
    Ok(HessianInput {
        title,
        elements: elements_z,
        positions,
        hessian,
        asymmetry,
        source: file.into(),
    })
}

/// Numbers of a flat list or a list of lists, row-major; NaN/inf and non-numbers located.
fn flat_numbers(file: &str, path: &str, v: &Value) -> Result<Vec<f64>, VibError> {
    let mut out = Vec::new();
    let list = v
        .as_array()
        .ok_or_else(|| jerr(file, path, "not a list of numbers"))?;
    for (i, x) in list.iter().enumerate() {
        match x {
            Value::Array(row) => {
                for (j, y) in row.iter().enumerate() {
                    out.push(number(file, &format!("{path}[{i}][{j}]"), y)?);
                }
            }
            _ => out.push(number(file, &format!("{path}[{i}]"), x)?),
        }
    }
    Ok(out)
}

fn number(file: &str, path: &str, v: &Value) -> Result<f64, VibError> {
    // serde_json refuses NaN literals; strings such as "NaN" are named as such
    match v {
        Value::Number(n) => n
            .as_f64()
            .filter(|x| x.is_finite())
            .ok_or_else(|| jerr(file, path, "not a finite number")),
        Value::String(s) => Err(jerr(file, path, format!("\"{s}\" is not a number (NaN?)"))),
        _ => Err(jerr(file, path, "not a number")),
    }
}

/// Check symmetry (refuse beyond [`ASYMMETRY_TOLERANCE`], naming the worst pair) and average.
fn symmetric(file: &str, h: DMatrix<f64>) -> Result<(DMatrix<f64>, f64), VibError> {
    let n = h.nrows();
    let (mut worst, mut at) = (0.0f64, (0, 0));
    for i in 0..n {
        for j in 0..i {
            let d = (h[(i, j)] - h[(j, i)]).abs();
            if d > worst {
                worst = d;
                at = (i, j);
            }
        }
    }
    if worst > ASYMMETRY_TOLERANCE {
        return Err(VibError::NotSymmetric {
            file: file.into(),
            row: at.0 + 1,
            col: at.1 + 1,
            a: h[at],
            b: h[(at.1, at.0)],
            diff: worst,
            tolerance: ASYMMETRY_TOLERANCE,
        });
    }
    let s = (&h + h.transpose()) * 0.5;
    Ok((s, worst))
}

/// Units a plain-text Hessian declares on a comment line (`# units: mdyn/angstrom`).
pub fn declared_units(text: &str) -> Option<Result<HessianUnits, String>> {
    for line in text.lines() {
        let t = line.trim();
        if let Some(rest) = t.strip_prefix('#') {
            if let Some(u) = rest.trim().strip_prefix("units:") {
                return Some(
                    HessianUnits::parse(u).ok_or_else(|| format!("unknown units `{}`", u.trim())),
                );
            }
        } else if !t.is_empty() {
            break;
        }
    }
    None
}

/// Read a plain-text Hessian (full 3N×3N or lower triangle by rows) for `mol`, in `units`
/// (or the units the file declares; neither is an error).
pub fn read_text_hessian(
    file: &str,
    text: &str,
    mol: &Molecule,
    units: Option<HessianUnits>,
) -> Result<HessianInput, VibError> {
    let declared = match declared_units(text) {
        Some(Ok(u)) => Some(u),
        Some(Err(m)) => return Err(VibError::read(file, m)),
        None => None,
    };
    let units = units
        .or(declared)
        .ok_or_else(|| VibError::UnitsMissing { file: file.into() })?;
    let mut values = Vec::new();
    for (ln, line) in text.lines().enumerate() {
        let body = line.split('#').next().unwrap_or("");
        let mut col = 0;
        for tok in body.split(|c: char| c.is_whitespace() || c == ',') {
            let start = col;
            col += tok.len() + 1;
            if tok.is_empty() {
                continue;
            }
            let x: f64 = tok
                .replace(['D', 'd'], "e")
                .parse()
                .map_err(|_| VibError::At {
                    file: file.into(),
                    line: ln + 1,
                    column: start + 1,
                    message: format!("`{tok}` is not a number"),
                })?;
            if !x.is_finite() {
                return Err(VibError::At {
                    file: file.into(),
                    line: ln + 1,
                    column: start + 1,
                    message: format!("`{tok}` is not a finite number"),
                });
            }
            values.push(x);
        }
    }
    let n = mol.atoms.len();
    let dim = 3 * n;
    let full = dim * dim;
    let tri = dim * (dim + 1) / 2;
    let f = to_hartree_per_bohr2(units);
    let h = if values.len() == full {
        DMatrix::from_row_slice(dim, dim, &values) * f
    } else if values.len() == tri {
        let mut h = DMatrix::zeros(dim, dim);
        let mut k = 0;
        for i in 0..dim {
            for j in 0..=i {
                h[(i, j)] = values[k] * f;
                h[(j, i)] = values[k] * f;
                k += 1;
            }
        }
        h
    } else {
        // which atom count would the numbers fit?
        let as_full = ((values.len() as f64).sqrt() / 3.0).round() as usize;
        let d = 3 * as_full;
        if as_full > 0 && (d * d == values.len() || d * (d + 1) / 2 == values.len()) {
            return Err(VibError::AtomsMismatch {
                file: file.into(),
                hessian: as_full,
                rows: d,
                geometry: n,
            });
        }
        return Err(VibError::Size {
            file: file.into(),
            message: format!(
                "{} numbers; {n} atoms need {full} (3N×3N = {dim}×{dim}) or {tri} (lower triangle)",
                values.len()
            ),
        });
    };
    let (hessian, asymmetry) = symmetric(file, h)?;
    Ok(HessianInput {
        title: mol.title.clone(),
        elements: mol.atoms.iter().map(|a| a.element).collect(),
        positions: mol.atoms.iter().map(|a| a.position).collect(),
        hessian,
        asymmetry,
        source: file.into(),
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn diatomic() -> Molecule {
        Molecule::new(
            "HCl",
            vec![
                crate::geom::Atom::new(1, Vector3::new(0.0, 0.0, 0.0)),
                crate::geom::Atom::new(17, Vector3::new(0.0, 0.0, 1.27)),
            ],
        )
    }

    #[test]
    fn text_errors_are_located() {
        let m = diatomic();
        let e = read_text_hessian("h.txt", "1 2 3", &m, Some(HessianUnits::HartreePerBohr2));
        assert!(matches!(e, Err(VibError::Size { .. })), "{e:?}");
        let mut t = vec!["0"; 21];
        t[4] = "NaN";
        let e = read_text_hessian(
            "h.txt",
            &t.join(" "),
            &m,
            Some(HessianUnits::HartreePerBohr2),
        )
        .unwrap_err();
        assert!(e.to_string().starts_with("h.txt:1:9:"), "{e}");
        let e = read_text_hessian("h.txt", &vec!["0"; 21].join(" "), &m, None).unwrap_err();
        assert!(matches!(e, VibError::UnitsMissing { .. }));
        // a 3-atom full matrix for a 2-atom geometry
        let e = read_text_hessian(
            "h.txt",
            &vec!["0"; 81].join(" "),
            &m,
            Some(HessianUnits::HartreePerBohr2),
        )
        .unwrap_err();
        assert!(
            matches!(
                e,
                VibError::AtomsMismatch {
                    hessian: 3,
                    geometry: 2,
                    ..
                }
            ),
            "{e:?}"
        );
    }

    #[test]
    fn asymmetry_is_measured() {
        let m = diatomic();
        let mut v = vec![0.0; 36];
        v[1] = 0.5; // H[0][1]
        let text: Vec<String> = v.iter().map(|x| x.to_string()).collect();
        let e = read_text_hessian(
            "h.txt",
            &text.join(" "),
            &m,
            Some(HessianUnits::HartreePerBohr2),
        )
        .unwrap_err();
        assert!(e.to_string().contains("difference 5.000e-1"), "{e}");
        // lower triangle is symmetric by construction; declared units are read
        let tri = format!("# units: mdyn/angstrom\n{}", vec!["1"; 21].join(" "));
        let h = read_text_hessian("h.txt", &tri, &m, None).unwrap();
        assert_eq!(h.asymmetry, 0.0);
        assert!((h.hessian[(5, 0)] - 1.0 / 15.569).abs() < 1e-3);
    }

    #[test]
    fn qcschema_errors() {
        let e = read_qcschema("r.json", r#"{"driver": "energy"}"#).unwrap_err();
        assert!(e.to_string().contains("driver"), "{e}");
        let e = read_qcschema(
            "r.json",
            r#"{"driver": "hessian", "molecule": {"symbols": ["H", "Xx"], "geometry": [0,0,0,0,0,1]}, "return_result": []}"#,
        )
        .unwrap_err();
        assert!(e.to_string().contains("molecule.symbols[1]"), "{e}");
        let e = read_qcschema(
            "r.json",
            r#"{"driver": "hessian", "molecule": {"symbols": ["H", "H"], "geometry": [0,0,0,0,0,1.4]}, "return_result": [1, 2]}"#,
        )
        .unwrap_err();
        assert!(matches!(e, VibError::Size { .. }), "{e:?}");
    }
}
