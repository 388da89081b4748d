//! Parser for salcdesk's exact-number notation.
//!
//! Grammar (whitespace ignored except inside names):
//! ```text
//! expr   := term (('+' | '-' | '−') term)*
//! term   := unary (('*' | '·' | '/' | <juxtaposition>) unary)*
//! unary  := ('-' | '−' | '+') unary | power
//! power  := atom ('^' integer)?
//! atom   := integer | decimal | 'i' | 'pi' | 'π' | 'phi' | 'φ'
//!         | ('sqrt' | 'cos' | 'sin' | 'exp') '(' expr ')' | '√' atom | '(' expr ')'
//! ```
//! `pi` may only appear inside the argument of cos/sin (as a rational multiple of π) and exp (as
//! a rational multiple of πi); `phi` only where a caller supplies its value (the rotation angle
//! of the linear groups). Decimals like `0.5` are read as the exact fraction they denote.

use super::cyclo::Cyclo;
use super::sqrt::sqrt;
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{One, Zero};

/// A parse error with the 1-based character column where it was found.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("column {column}: {message}")]
pub struct ParseError {
    pub column: usize,
    pub message: String,
}

/// A value during parsing: c + a·π + b·πi (a, b rational), so angles can be formed.
#[derive(Clone)]
struct Val {
    c: Cyclo,
    pi: BigRational,
    pii: BigRational,
}

impl Val {
    fn num(c: Cyclo) -> Self {
        Val {
            c,
            pi: BigRational::zero(),
            pii: BigRational::zero(),
        }
    }
    fn is_plain(&self) -> bool {
        self.pi.is_zero() && self.pii.is_zero()
    }
}

struct Parser<'a> {
    chars: Vec<char>,
    pos: usize,
    phi: Option<&'a BigRational>,
}

/// Parse an exact number.
pub fn parse(s: &str) -> Result<Cyclo, ParseError> {
    parse_with_phi(s, None)
}

/// Parse, letting `phi` stand for the given fraction of a full turn (linear groups).
pub fn parse_with_phi(s: &str, phi_turn: Option<&BigRational>) -> Result<Cyclo, ParseError> {
    let mut p = Parser {
        chars: s.chars().collect(),
        pos: 0,
        phi: phi_turn,
    };
    p.skip_ws();
    if p.at_end() {
        return Err(p.err("expected a number, found nothing"));
    }
    let v = p.expr()?;
    p.skip_ws();
    if !p.at_end() {
        return Err(p.err(&format!("unexpected '{}'", p.chars[p.pos])));
    }
    if !v.is_plain() {
        return Err(ParseError {
            column: 1,
            message: "π may only appear inside cos(…), sin(…) or exp(…)".into(),
        });
    }
    Ok(v.c)
}

impl Parser<'_> {
    fn err(&self, msg: &str) -> ParseError {
        ParseError {
            column: self.pos + 1,
            message: msg.to_string(),
        }
    }
    fn at_end(&self) -> bool {
        self.pos >= self.chars.len()
    }
    fn skip_ws(&mut self) {
        while !self.at_end() && self.chars[self.pos].is_whitespace() {
            self.pos += 1;
        }
    }
    fn peek(&mut self) -> Option<char> {
        self.skip_ws();
        self.chars.get(self.pos).copied()
    }
    fn starts_with(&mut self, word: &str) -> bool {
        self.skip_ws();
        let w: Vec<char> = word.chars().collect();
        self.chars.len() >= self.pos + w.len() && self.chars[self.pos..self.pos + w.len()] == w[..]
    }

    fn expr(&mut self) -> Result<Val, ParseError> {
        let mut acc = self.term()?;
        loop {
            match self.peek() {
                Some('+') => {
                    let col = self.pos;
                    self.pos += 1;
                    let t = self.term()?;
                    acc = add(acc, t, false).map_err(|m| self.err_at(col, &m))?;
                }
                Some('-') | Some('−') => {
                    let col = self.pos;
                    self.pos += 1;
                    let t = self.term()?;
                    acc = add(acc, t, true).map_err(|m| self.err_at(col, &m))?;
                }
                _ => return Ok(acc),
            }
        }
    }

    fn starts_atom(&mut self) -> bool {
        match self.peek() {
            Some(c) if c.is_ascii_digit() || c == '(' || c == '√' || c == 'π' || c == 'φ' => {
                true
            }
            Some('i') => true,
            Some(_) => ["pi", "phi", "sqrt", "cos", "sin", "exp"]
                .iter()
                .any(|w| self.starts_with(w)),
            None => false,
        }
    }

    fn term(&mut self) -> Result<Val, ParseError> {
        let mut acc = self.unary()?;
        loop {
            let col = self.pos;
            match self.peek() {
                Some('*') | Some('·') | Some('×') => {
                    self.pos += 1;
                    let r = self.unary()?;
                    acc = mul(acc, r).map_err(|m| self.err_at(col, &m))?;
                }
                Some('/') => {
                    self.pos += 1;
                    let r = self.unary()?;
                    acc = div(acc, r).map_err(|m| self.err_at(col, &m))?;
                }
                _ if self.starts_atom() => {
                    let r = self.power()?;
                    acc = mul(acc, r).map_err(|m| self.err_at(col, &m))?;
                }
                _ => return Ok(acc),
            }
        }
    }

    fn err_at(&self, pos: usize, msg: &str) -> ParseError {
        ParseError {
            column: pos + 1,
            message: msg.to_string(),
        }
    }

    fn unary(&mut self) -> Result<Val, ParseError> {
        match self.peek() {
            Some('-') | Some('−') => {
                self.pos += 1;
                let v = self.unary()?;
                Ok(neg(v))
            }
            Some('+') => {
                self.pos += 1;
                self.unary()
            }
            _ => self.power(),
        }
    }

    fn power(&mut self) -> Result<Val, ParseError> {
        let base = self.atom()?;
        if self.peek() == Some('^') {
            self.pos += 1;
            let col = self.pos;
            let negative = matches!(self.peek(), Some('-') | Some('−'));
            if negative {
                self.pos += 1;
            }
            let e = self.integer()?;
            if e > 64 {
                return Err(self.err_at(col, "exponent too large (at most 64)"));
            }
            let e = if negative { -e } else { e };
            if !base.is_plain() {
                return Err(self.err_at(col, "cannot raise an angle to a power"));
            }
            check_size(&base.c).map_err(|m| self.err_at(col, &m))?;
            let v = base
                .c
                .pow(e)
                .ok_or_else(|| self.err_at(col, "zero to a negative power"))?;
            check_size(&v).map_err(|m| self.err_at(col, &m))?;
            return Ok(Val::num(v));
        }
        Ok(base)
    }

    fn integer(&mut self) -> Result<i64, ParseError> {
        self.skip_ws();
        let start = self.pos;
        while !self.at_end() && self.chars[self.pos].is_ascii_digit() {
            self.pos += 1;
        }
        if start == self.pos {
            return Err(self.err("expected an integer"));
        }
        let s: String = self.chars[start..self.pos].iter().collect();
        s.parse::<i64>()
            .map_err(|_| self.err_at(start, "integer too large"))
    }

    fn atom(&mut self) -> Result<Val, ParseError> {
        let Some(c) = self.peek() else {
            return Err(self.err("expected a number, found the end"));
        };
        if c.is_ascii_digit() {
            return self.number();
        }
        if c == '(' {
            self.pos += 1;
            let v = self.expr()?;
            if self.peek() != Some(')') {
                return Err(self.err("expected ')'"));
            }
            self.pos += 1;
            return Ok(v);
        }
        if c == '√' {
            self.pos += 1;
            let col = self.pos;
            let v = self.atom()?;
            return self.apply("sqrt", v, col);
        }
        if c == 'π' || self.starts_with("pi") && !self.starts_with("phi") {
            self.pos += if c == 'π' { 1 } else { 2 };
            return Ok(Val {
                c: Cyclo::zero(),
                pi: BigRational::one(),
                pii: BigRational::zero(),
            });
        }
        if c == 'φ' || self.starts_with("phi") {
            let col = self.pos;
            self.pos += if c == 'φ' { 1 } else { 3 };
            let Some(turn) = self.phi else {
                return Err(self.err_at(col, "'phi' is only allowed in the linear groups' tables"));
            };
            return Ok(Val {
                c: Cyclo::zero(),
                pi: turn * BigRational::from_integer(BigInt::from(2)),
                pii: BigRational::zero(),
            });
        }
        for f in ["sqrt", "cos", "sin", "exp"] {
            if self.starts_with(f) {
                self.pos += f.len();
                if self.peek() != Some('(') {
                    return Err(self.err(&format!("expected '(' after {f}")));
                }
                self.pos += 1;
                let col = self.pos;
                let v = self.expr()?;
                if self.peek() != Some(')') {
                    return Err(self.err("expected ')'"));
                }
                self.pos += 1;
                return self.apply(f, v, col);
            }
        }
        if c == 'i' {
            self.pos += 1;
            return Ok(Val::num(Cyclo::i()));
        }
        Err(self.err(&format!("unexpected '{c}'")))
    }

    fn number(&mut self) -> Result<Val, ParseError> {
        let start = self.pos;
        while !self.at_end() && self.chars[self.pos].is_ascii_digit() {
            self.pos += 1;
        }
        let mut digits: String = self.chars[start..self.pos].iter().collect();
        let mut scale = 0u32;
        if !self.at_end() && self.chars[self.pos] == '.' {
            self.pos += 1;
            let fs = self.pos;
            while !self.at_end() && self.chars[self.pos].is_ascii_digit() {
                self.pos += 1;
            }
            let frac: String = self.chars[fs..self.pos].iter().collect();
            scale = frac.len() as u32;
            digits.push_str(&frac);
        }
        if digits.len() > 1000 {
            return Err(self.err_at(start, "number too long (more than 1000 digits)"));
        }
        let n: BigInt = digits
            .parse()
            .map_err(|_| self.err_at(start, "malformed number"))?;
        let q = BigRational::new(n, BigInt::from(10u32).pow(scale));
        Ok(Val::num(Cyclo::from_rational(q)))
    }

    /// A turn p/q with q small enough for the fields we read, or a located error.
    fn turn_of(&self, turn: &BigRational, col: usize) -> Result<(i64, i64), ParseError> {
        small_fraction(turn).ok_or_else(|| {
            self.err_at(
                col,
                &format!(
                    "angle too complicated: a rational multiple of pi with a denominator up \
                     to {MAX_INPUT_FIELD}, like 2pi/7"
                ),
            )
        })
    }

    fn apply(&self, f: &str, v: Val, col: usize) -> Result<Val, ParseError> {
        match f {
            "sqrt" => {
                if !v.is_plain() {
                    return Err(self.err_at(col, "sqrt of an angle"));
                }
                if !v.c.is_real() {
                    return Err(self.err_at(col, "sqrt of a complex number is not supported"));
                }
                if let Some(q) = v.c.to_rational() {
                    if let Some(n) = super::sqrt::sqrt_conductor(&q) {
                        if n > MAX_INPUT_FIELD as u64 {
                            return Err(self.err_at(col, &field_error(n)));
                        }
                    }
                }
                let r = sqrt(&v.c)
                    .map_err(|e| self.err_at(col, &e.to_string()))?
                    .minimal_field();
                if r.field_order() > MAX_INPUT_FIELD {
                    return Err(self.err_at(col, &field_error(r.field_order() as u64)));
                }
                Ok(Val::num(r))
            }
            "cos" | "sin" => {
                if !v.c.is_zero() || !v.pii.is_zero() {
                    return Err(self.err_at(
                        col,
                        &format!("{f}(…) needs a rational multiple of pi, like {f}(2pi/5)"),
                    ));
                }
                let turn = &v.pi / BigRational::from_integer(BigInt::from(2));
                let (p, q) = self.turn_of(&turn, col)?;
                Ok(Val::num(if f == "cos" {
                    Cyclo::cos_turn(p, q)
                } else {
                    Cyclo::sin_turn(p, q)
                }))
            }
            "exp" => {
                if !v.c.is_zero() || !v.pi.is_zero() {
                    return Err(self.err_at(
                        col,
                        "exp(…) needs a rational multiple of pi·i, like exp(2pi i/3)",
                    ));
                }
                let turn = &v.pii / BigRational::from_integer(BigInt::from(2));
                let (p, q) = self.turn_of(&turn, col)?;
                Ok(Val::num(Cyclo::root_of_unity(p, q)))
            }
            _ => unreachable!("unknown function"),
        }
    }
}

/// Largest cyclotomic field (n of Q(ζₙ)) a typed number may need. Characters of the tables
/// need n ≤ 60; the cap keeps hostile input (`exp(2πi/997)·exp(2πi/991)`, `sqrt(1999)`)
/// from asking for fields whose arithmetic and printing take minutes and gigabytes.
pub const MAX_INPUT_FIELD: u32 = 180;

fn field_error(n: u64) -> String {
    format!(
        "this needs the {n}th roots of unity; salcdesk reads numbers that need at most the \
         {MAX_INPUT_FIELD}th"
    )
}

/// Largest size of a computed value's rational parts, in bits (about 400 decimal digits). Typed
/// numbers may have up to 1000 digits, so that whatever is accepted prints in a form that
/// reads back (the printer may combine parts).
const MAX_VALUE_BITS: u64 = 1330;

fn check_size(c: &Cyclo) -> Result<(), String> {
    for q in c.coefficients() {
        if q.numer().bits() > MAX_VALUE_BITS || q.denom().bits() > MAX_VALUE_BITS {
            return Err("number too large (more than about 400 digits)".into());
        }
    }
    Ok(())
}

/// Refuse a sum or product whose field would exceed [`MAX_INPUT_FIELD`] before computing it.
fn check_fields(a: &Cyclo, b: &Cyclo) -> Result<(), String> {
    let (x, y) = (a.field_order() as u64, b.field_order() as u64);
    let l = x / num_integer::gcd(x, y) * y;
    if l > MAX_INPUT_FIELD as u64 {
        return Err(field_error(l));
    }
    Ok(())
}

/// A fraction whose denominator is small enough for a cyclotomic field we handle.
fn small_fraction(q: &BigRational) -> Option<(i64, i64)> {
    let p: i64 = q.numer().try_into().ok()?;
    let d: i64 = q.denom().try_into().ok()?;
    if d > MAX_INPUT_FIELD as i64 {
        return None;
    }
    Some((p.rem_euclid(d), d))
}

fn neg(v: Val) -> Val {
    Val {
        c: -v.c,
        pi: -v.pi,
        pii: -v.pii,
    }
}

fn add(a: Val, b: Val, subtract: bool) -> Result<Val, String> {
    check_fields(&a.c, &b.c)?;
    let b = if subtract { neg(b) } else { b };
    let c = a.c + b.c;
    check_size(&c)?;
    Ok(Val {
        c,
        pi: a.pi + b.pi,
        pii: a.pii + b.pii,
    })
}

/// If c = q or c = q·i for rational q, return (q, is_imaginary).
fn rational_or_imaginary(c: &Cyclo) -> Option<(BigRational, bool)> {
    if let Some(q) = c.to_rational() {
        return Some((q, false));
    }
    let q = (c * &(-Cyclo::i())).to_rational()?;
    Some((q, true))
}

fn mul(a: Val, b: Val) -> Result<Val, String> {
    if a.is_plain() && b.is_plain() {
        check_fields(&a.c, &b.c)?;
        let v = a.c * b.c;
        check_size(&v)?;
        return Ok(Val::num(v));
    }
    let (k, ang) = if a.is_plain() {
        (a, b)
    } else if b.is_plain() {
        (b, a)
    } else {
        return Err("cannot multiply two angles".into());
    };
    if !ang.c.is_zero() {
        return Err("cannot mix a number and π in one sum".into());
    }
    let (q, imag) =
        rational_or_imaginary(&k.c).ok_or("an angle may only be scaled by a rational or i")?;
    Ok(if imag {
        Val {
            c: Cyclo::zero(),
            pi: -(&ang.pii * &q),
            pii: &ang.pi * &q,
        }
    } else {
        Val {
            c: Cyclo::zero(),
            pi: &ang.pi * &q,
            pii: &ang.pii * &q,
        }
    })
}

fn div(a: Val, b: Val) -> Result<Val, String> {
    if !b.is_plain() {
        return Err("cannot divide by an angle".into());
    }
    let inv = b.c.inv().ok_or("division by zero")?;
    mul(a, Val::num(inv))
}
