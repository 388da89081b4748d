//! Function columns: polynomials in x, y, z (and rotations Rx, Ry, Rz) and how symmetry
//! operations act on them.
//!
//! (R·f)(r) = f(R⁻¹r); rotations transform as an axial vector, R·Rₖ = det(R)·Σ Rⱼₖ Rⱼ
//! (Cotton, *Chemical Applications of Group Theory*, 3rd ed., §4.3). A tuple of partners spans an
//! invariant space; its matrices are read off by solving in the tuple's own basis.

use super::matrix::{det, transpose, Mat3};
use crate::exact::{solve_field, Cyclo};
use num_bigint::BigInt;
use num_rational::BigRational;
use std::collections::BTreeMap;

/// A polynomial: exponents (x, y, z) ↦ coefficient.
pub type Poly = BTreeMap<[u8; 3], Cyclo>;

/// One entry of a function column: a single function or a tuple of partners.
#[derive(Debug, Clone)]
pub struct FunctionTuple {
    /// Text as written in the table, e.g. `(x^2-y^2, xy)`.
    pub text: String,
    pub parts: Vec<Poly>,
    /// True for Rx, Ry, Rz (axial vectors).
    pub axial: bool,
}

impl FunctionTuple {
    pub fn dim(&self) -> usize {
        self.parts.len()
    }
    pub fn degree(&self) -> usize {
        self.parts
            .first()
            .and_then(|p| p.keys().next())
            .map(|e| e.iter().map(|&v| v as usize).sum())
            .unwrap_or(0)
    }
}

/// Parse `z`, `(x, y)`, `x^2-y^2`, `(Rx, Ry)`, `x(x^2-3y^2)`.
pub fn parse_tuple(text: &str) -> Result<FunctionTuple, String> {
    let t = text.trim();
    let inner = if t.starts_with('(') && t.ends_with(')') && top_level_comma(&t[1..t.len() - 1]) {
        &t[1..t.len() - 1]
    } else {
        t
    };
    let pieces = split_top(inner);
    let axial = pieces.iter().any(|p| p.trim().starts_with('R'));
    let mut parts = Vec::new();
    for p in &pieces {
        let p = p.trim();
        let poly = if axial {
            match p {
                "Rx" => linear_poly(0),
                "Ry" => linear_poly(1),
                "Rz" => linear_poly(2),
                _ => return Err(format!("'{p}': rotations are written Rx, Ry, Rz")),
            }
        } else {
            PolyParser::new(p).parse()?
        };
        if poly.is_empty() {
            return Err(format!("'{p}' is the zero polynomial"));
        }
        parts.push(poly);
    }
    Ok(FunctionTuple {
        text: t.to_string(),
        parts,
        axial,
    })
}

fn top_level_comma(s: &str) -> bool {
    split_top(s).len() > 1
}

fn split_top(s: &str) -> Vec<String> {
    let mut out = Vec::new();
    let mut depth = 0;
    let mut cur = String::new();
    for c in s.chars() {
        match c {
            '(' => depth += 1,
            ')' => depth -= 1,
            ',' if depth == 0 => {
                out.push(std::mem::take(&mut cur));
                continue;
            }
            _ => {}
        }
        cur.push(c);
    }
    out.push(cur);
    out
}

fn linear_poly(axis: usize) -> Poly {
    let mut e = [0u8; 3];
    e[axis] = 1;
    Poly::from([(e, Cyclo::one())])
}

fn add_into(acc: &mut Poly, e: [u8; 3], c: Cyclo) {
    let entry = acc.entry(e).or_insert_with(Cyclo::zero);
    *entry = &*entry + &c;
    if entry.is_zero() {
        acc.remove(&e);
    }
}

pub fn poly_add(a: &Poly, b: &Poly, sign: i64) -> Poly {
    let mut out = a.clone();
    for (e, c) in b {
        add_into(&mut out, *e, c * &Cyclo::from_int(sign));
    }
    out
}

pub fn poly_mul(a: &Poly, b: &Poly) -> Poly {
    let mut out = Poly::new();
    for (ea, ca) in a {
        for (eb, cb) in b {
            let e = [ea[0] + eb[0], ea[1] + eb[1], ea[2] + eb[2]];
            add_into(&mut out, e, ca * cb);
        }
    }
    out
}

struct PolyParser {
    chars: Vec<char>,
    pos: usize,
}

impl PolyParser {
    fn new(s: &str) -> Self {
        PolyParser {
            chars: s.chars().filter(|c| !c.is_whitespace()).collect(),
            pos: 0,
        }
    }
    fn parse(mut self) -> Result<Poly, String> {
        let p = self.sum()?;
        if self.pos != self.chars.len() {
            return Err(format!(
                "unexpected '{}' in a function",
                self.chars[self.pos]
            ));
        }
        Ok(p)
    }
    /// Length of a `sqrt(…)`/`cos(…)`/`sin(…)` call starting here, if any.
    fn exact_call_len(&self) -> Option<usize> {
        let rest: String = self.chars[self.pos..].iter().collect();
        let name = ["sqrt(", "cos(", "sin("]
            .into_iter()
            .find(|n| rest.starts_with(n))?;
        let mut depth = 0;
        for (k, ch) in rest.chars().enumerate().skip(name.len() - 1) {
            match ch {
                '(' => depth += 1,
                ')' => {
                    depth -= 1;
                    if depth == 0 {
                        return Some(k + 1);
                    }
                }
                _ => {}
            }
        }
        None
    }

    fn sum(&mut self) -> Result<Poly, String> {
        let mut acc = Poly::new();
        let mut sign = 1;
        if let Some('-') = self.chars.get(self.pos) {
            sign = -1;
            self.pos += 1;
        }
        loop {
            let t = self.product()?;
            acc = poly_add(&acc, &t, sign);
            match self.chars.get(self.pos) {
                Some('+') => sign = 1,
                Some('-') => sign = -1,
                _ => return Ok(acc),
            }
            self.pos += 1;
        }
    }
    fn product(&mut self) -> Result<Poly, String> {
        let mut acc = Poly::from([([0, 0, 0], Cyclo::one())]);
        let mut any = false;
        while let Some(&c) = self.chars.get(self.pos) {
            let factor = if c.is_ascii_digit() {
                let start = self.pos;
                while self.pos < self.chars.len() && self.chars[self.pos].is_ascii_digit() {
                    self.pos += 1;
                }
                let s: String = self.chars[start..self.pos].iter().collect();
                let n: BigInt = s.parse().map_err(|_| "bad coefficient".to_string())?;
                Poly::from([(
                    [0, 0, 0],
                    Cyclo::from_rational(BigRational::from_integer(n)),
                )])
            } else if let Some(len) = self.exact_call_len() {
                // An exact-number coefficient such as sqrt(5) or 2cos(2pi/5).
                let text: String = self.chars[self.pos..self.pos + len].iter().collect();
                self.pos += len;
                let v = crate::exact::parse(&text).map_err(|e| format!("'{text}': {e}"))?;
                Poly::from([([0, 0, 0], v)])
            } else if c == 'x' || c == 'y' || c == 'z' {
                self.pos += 1;
                linear_poly((c as u8 - b'x') as usize)
            } else if c == '(' {
                self.pos += 1;
                let inner = self.sum()?;
                if self.chars.get(self.pos) != Some(&')') {
                    return Err("expected ')' in a function".into());
                }
                self.pos += 1;
                inner
            } else {
                break;
            };
            let factor = if self.chars.get(self.pos) == Some(&'^') {
                self.pos += 1;
                let d = self
                    .chars
                    .get(self.pos)
                    .and_then(|c| c.to_digit(10))
                    .ok_or("expected a digit after '^'")?;
                self.pos += 1;
                let mut p = Poly::from([([0, 0, 0], Cyclo::one())]);
                for _ in 0..d {
                    p = poly_mul(&p, &factor);
                }
                p
            } else {
                factor
            };
            acc = poly_mul(&acc, &factor);
            any = true;
        }
        if !any {
            return Err(match self.chars.get(self.pos) {
                Some(c) => format!("unexpected '{c}' in a function"),
                None => "a function ends too early".into(),
            });
        }
        Ok(acc)
    }
}

/// R·f for an operation matrix R (R⁻¹ = Rᵀ for the orthogonal matrices of point groups).
pub fn act(r: &Mat3, f: &Poly, axial: bool) -> Poly {
    let rinv = transpose(r);
    // x'_i = Σ_j (R⁻¹)_ij x_j
    let lin: Vec<Poly> = (0..3)
        .map(|i| {
            let mut p = Poly::new();
            for j in 0..3 {
                if !rinv[i][j].is_zero() {
                    let mut e = [0u8; 3];
                    e[j] = 1;
                    add_into(&mut p, e, rinv[i][j].clone());
                }
            }
            p
        })
        .collect();
    let mut out = Poly::new();
    for (e, c) in f {
        let mut term = Poly::from([([0, 0, 0], c.clone())]);
        for (axis, &pw) in e.iter().enumerate() {
            for _ in 0..pw {
                term = poly_mul(&term, &lin[axis]);
            }
        }
        out = poly_add(&out, &term, 1);
    }
    if axial {
        let d = det(r);
        out = out.into_iter().map(|(e, c)| (e, &c * &d)).collect();
    }
    out
}

/// The matrix D(R) of R on the tuple's span: R·fₖ = Σⱼ D[j][k] fⱼ; `None` if the span is not
/// invariant under R (a wrong table entry).
pub fn tuple_matrix(r: &Mat3, t: &FunctionTuple) -> Option<Vec<Vec<Cyclo>>> {
    let keys: Vec<[u8; 3]> = {
        let mut k: Vec<[u8; 3]> = t.parts.iter().flat_map(|p| p.keys().copied()).collect();
        let images: Vec<Poly> = t.parts.iter().map(|p| act(r, p, t.axial)).collect();
        k.extend(images.iter().flat_map(|p| p.keys().copied()));
        k.sort();
        k.dedup();
        k
    };
    let coords = |p: &Poly| -> Vec<Cyclo> {
        keys.iter()
            .map(|k| p.get(k).cloned().unwrap_or_else(Cyclo::zero))
            .collect()
    };
    let basis: Vec<Vec<Cyclo>> = t.parts.iter().map(coords).collect();
    let d = t.parts.len();
    let mut m = vec![vec![Cyclo::zero(); d]; d];
    for (k, f) in t.parts.iter().enumerate() {
        let img = act(r, f, t.axial);
        let sol = solve_field(&basis, &coords(&img))?;
        for j in 0..d {
            m[j][k] = sol[j].clone();
        }
    }
    Some(m)
}
