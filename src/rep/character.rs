//! Reducible representations given by their characters, one per class in table order, and how
//! to build them from "unmoved" counts.
//!
//! For a basis whose members sit on atoms or bonds, only members left in place by an operation
//! contribute to its character (Cotton, 3rd ed., §10.2): per unmoved member, 1 for a scalar or a
//! bond-stretch vector, the trace of R (1 + 2cos θ proper, −1 + 2cos θ improper) for a Cartesian
//! triple, trace − 1 for a ligand π pair (two vectors ⟂ the fixed bond), det(R)·trace for an
//! axial triple.

use crate::exact::{parse, Cyclo};
use crate::group::{mat_det, mat_trace, PointGroup};

/// Characters of a (usually reducible) representation, one per class.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Character(pub Vec<Cyclo>);

/// What each unmoved member contributes.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum MemberKind {
    /// A scalar member or a vector along a fixed bond (stretches, σ orbitals, s orbitals).
    Stretch,
    /// A Cartesian displacement triple on an atom.
    Cartesian,
    /// A pair of vectors perpendicular to a fixed bond (ligand π orbitals).
    Pi,
    /// An axial-vector triple (infinitesimal rotations).
    Axial,
}

impl MemberKind {
    pub fn parse(s: &str) -> Option<Self> {
        Some(match s.to_ascii_lowercase().as_str() {
            "stretch" | "sigma" | "scalar" | "bond" => MemberKind::Stretch,
            "cartesian" | "xyz" | "displacement" => MemberKind::Cartesian,
            "pi" => MemberKind::Pi,
            "axial" | "rotation" => MemberKind::Axial,
            _ => return None,
        })
    }
    pub fn name(self) -> &'static str {
        match self {
            MemberKind::Stretch => "stretch",
            MemberKind::Cartesian => "cartesian",
            MemberKind::Pi => "pi",
            MemberKind::Axial => "axial",
        }
    }
    /// Contribution of one unmoved member to the character of an operation with matrix trace
    /// `tr` and determinant `det`.
    pub fn per_member(self, tr: &Cyclo, det: &Cyclo) -> Cyclo {
        match self {
            MemberKind::Stretch => Cyclo::one(),
            MemberKind::Cartesian => tr.clone(),
            MemberKind::Pi => tr - &Cyclo::one(),
            MemberKind::Axial => det * tr,
        }
    }
}

/// Errors building a character.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum CharacterError {
    #[error("{group} has {expected} classes ({classes}); {found} value(s) given")]
    WrongCount {
        group: String,
        expected: usize,
        found: usize,
        classes: String,
    },
    #[error("value {index} ('{text}'): {message}")]
    NotANumber {
        index: usize,
        text: String,
        message: String,
    },
    #[error("an unmoved count cannot be negative (value {index}: {value})")]
    Negative { index: usize, value: i64 },
    #[error(
        "{group} is a linear group: give unmoved counts, salcdesk reduces them through {descent}"
    )]
    Linear { group: String, descent: String },
}

fn class_list(g: &PointGroup) -> String {
    g.table
        .classes
        .iter()
        .map(|c| c.ascii.as_str())
        .collect::<Vec<_>>()
        .join(" ")
}

impl Character {
    /// Parse characters written in the exact notation, in class order.
    pub fn parse(g: &PointGroup, texts: &[String]) -> Result<Self, CharacterError> {
        if g.is_linear() {
            return Err(CharacterError::Linear {
                group: g.name().into(),
                descent: g.table.descent.clone().unwrap_or_default(),
            });
        }
        check_count(g, texts.len())?;
        texts
            .iter()
            .enumerate()
            .map(|(k, t)| {
                parse(t).map_err(|e| CharacterError::NotANumber {
                    index: k + 1,
                    text: t.clone(),
                    message: e.to_string(),
                })
            })
            .collect::<Result<Vec<_>, _>>()
            .map(Character)
    }

    /// χ from unmoved counts per class.
    pub fn from_unmoved(
        g: &PointGroup,
        counts: &[i64],
        kind: MemberKind,
    ) -> Result<Self, CharacterError> {
        check_count(g, counts.len())?;
        if let Some((k, &v)) = counts.iter().enumerate().find(|(_, v)| **v < 0) {
            return Err(CharacterError::Negative {
                index: k + 1,
                value: v,
            });
        }
        let chars = (0..g.n_classes())
            .map(|c| {
                let op = g
                    .ops
                    .iter()
                    .find(|o| o.class == c)
                    .expect("every class has an operation");
                let tr = mat_trace(&op.matrix);
                let det = mat_det(&op.matrix);
                &kind.per_member(&tr, &det) * &Cyclo::from_int(counts[c])
            })
            .collect();
        Ok(Character(chars))
    }

    /// Dimension χ(E).
    pub fn dim(&self) -> Cyclo {
        self.0.first().cloned().unwrap_or_else(Cyclo::zero)
    }
}

fn check_count(g: &PointGroup, n: usize) -> Result<(), CharacterError> {
    if n != g.n_classes() {
        return Err(CharacterError::WrongCount {
            group: g.name().into(),
            expected: g.n_classes(),
            found: n,
            classes: class_list(g),
        });
    }
    Ok(())
}
