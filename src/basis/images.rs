//! [`Images`]: how every operation acts on every member of a basis, held compactly. The image
//! of a member is a short list of (member, number) pairs, where the number is an index into the
//! few distinct exact coefficients the action uses: a Cartesian basis uses its operations'
//! matrix entries (C60: 64,800 terms over a dozen numbers), a permutation basis (bonds,
//! angles, σ orbitals) only 1. Each number is stored once instead of once per term.

use super::action::{BasisKind, Column};
use super::BasisError;
use crate::exact::{Cyclo, CycloKey, QuickMap};

/// Most images (members × operations) a basis is built with. Beyond this the basis alone
/// takes hundreds of MB (C60's Cartesian basis has 21,600; a 1,415-atom icosahedron's 509,400;
/// a 97,556-atom fcc cube's bonds 28.8 million), and its exact SALCs could not finish within
/// the ceilings anyway (`salc::EXACT_CEILING`, `salc::MEMORY_CEILING_MB`).
pub const MAX_IMAGES: usize = 8_000_000;

/// Most members a basis is built with (each has a name and its atoms: about 100 bytes).
pub const MAX_MEMBERS: usize = 500_000;

/// Refuses a basis of `members` members under `ops` operations beyond [`MAX_IMAGES`] images
/// or [`MAX_MEMBERS`] members, before anything is built.
pub fn check_size(kind: BasisKind, members: usize, ops: usize) -> Result<(), BasisError> {
    let columns = members.saturating_mul(ops);
    if columns > MAX_IMAGES || members > MAX_MEMBERS {
        return Err(BasisError::TooLarge {
            basis: kind.name().to_string(),
            members,
            ops,
            columns,
            max_members: MAX_MEMBERS,
            max_images: MAX_IMAGES,
        });
    }
    Ok(())
}

/// Distinct numbers looked up without hashing (an operation's matrix uses at most 9).
const RECENT: usize = 12;

/// The sparse action of every operation on every member.
#[derive(Debug, Clone, PartialEq)]
pub struct Images {
    numbers: Vec<Cyclo>,
    /// (member, index into `numbers`) of every term; 32 bits each: a basis held in memory is
    /// far below 4·10⁹ members or distinct numbers.
    pairs: Vec<(u32, u32)>,
    /// `start[op·dim + m]` … `start[op·dim + m + 1]`: the terms of R_op·e_m.
    start: Vec<usize>,
    dim: usize,
    ops: usize,
}

impl Images {
    /// Number of operations.
    pub fn ops(&self) -> usize {
        self.ops
    }

    /// Number of members.
    pub fn dim(&self) -> usize {
        self.dim
    }

    /// The distinct numbers the terms refer to.
    pub fn numbers(&self) -> &[Cyclo] {
        &self.numbers
    }

    /// The terms of R_op·e_m as (member, index into [`Images::numbers`]).
    #[inline]
    pub fn raw(&self, op: usize, m: usize) -> &[(u32, u32)] {
        let at = op * self.dim + m;
        &self.pairs[self.start[at]..self.start[at + 1]]
    }

    /// The terms of R_op·e_m as (member, coefficient).
    #[inline]
    pub fn col(&self, op: usize, m: usize) -> impl Iterator<Item = (usize, &Cyclo)> + Clone {
        self.raw(op, m)
            .iter()
            .map(|&(k, i)| (k as usize, &self.numbers[i as usize]))
    }

    /// R_op·e_m as an owned column (a worked projection's line).
    pub fn column(&self, op: usize, m: usize) -> Column {
        self.col(op, m).map(|(k, c)| (k, c.clone())).collect()
    }

    /// The action on the members `keep` only (renumbered 0, 1, …; `new_index[old]` is the new
    /// number of a kept member). The kept members must be closed under the group.
    pub fn restricted(&self, keep: &[usize], new_index: &[usize]) -> Images {
        let mut b = ImagesBuilder::new(keep.len());
        let ids: Vec<u32> = self.numbers.iter().map(|c| b.number(c)).collect();
        for op in 0..self.ops {
            for &m in keep {
                for &(k, i) in self.raw(op, m) {
                    b.push(new_index[k as usize], ids[i as usize]);
                }
                b.end_column();
            }
            b.end_op();
        }
        b.finish()
    }

    /// The direct sum with `other` (its members numbered after these).
    pub fn joined(&self, other: &Images) -> Images {
        let mut b = ImagesBuilder::new(self.dim + other.dim);
        let ids: Vec<u32> = self.numbers.iter().map(|c| b.number(c)).collect();
        let other_ids: Vec<u32> = other.numbers.iter().map(|c| b.number(c)).collect();
        for op in 0..self.ops.min(other.ops) {
            for m in 0..self.dim {
                for &(k, i) in self.raw(op, m) {
                    b.push(k as usize, ids[i as usize]);
                }
                b.end_column();
            }
            for m in 0..other.dim {
                for &(k, i) in other.raw(op, m) {
                    b.push(self.dim + k as usize, other_ids[i as usize]);
                }
                b.end_column();
            }
            b.end_op();
        }
        b.finish()
    }

    /// Every coefficient of operation `op`'s images multiplied by `factor(op)` (an axial
    /// vector's determinant).
    pub fn scaled_per_op(&self, factor: impl Fn(usize) -> Cyclo) -> Images {
        let mut b = ImagesBuilder::new(self.dim);
        for op in 0..self.ops {
            let f = factor(op);
            let ids: Vec<u32> = self.numbers.iter().map(|c| b.number(&(c * &f))).collect();
            for m in 0..self.dim {
                for &(k, i) in self.raw(op, m) {
                    b.push(k as usize, ids[i as usize]);
                }
                b.end_column();
            }
            b.end_op();
        }
        b.finish()
    }
}

/// The action of a permutation basis: operation `op` carries member `m` onto member
/// `perm[op][m]` with coefficient 1 (bonds, angles, σ orbitals).
pub fn permutation_images(dim: usize, perm: &[Vec<usize>]) -> Images {
    let mut b = ImagesBuilder::new(dim);
    b.reserve(perm.len(), 1);
    let one = b.number(&Cyclo::one());
    for p in perm {
        for &k in p {
            b.push(k, one);
            b.end_column();
        }
        b.end_op();
    }
    b.finish()
}

/// Builds [`Images`] operation by operation, member by member: `push` the terms of a member's
/// image, `end_column`; after the last member, `end_op`.
pub struct ImagesBuilder {
    numbers: Vec<Cyclo>,
    seen: QuickMap<CycloKey, u32>,
    recent: Vec<u32>,
    pairs: Vec<(u32, u32)>,
    start: Vec<usize>,
    dim: usize,
    ops: usize,
}

impl ImagesBuilder {
    /// A builder for a basis of `dim` members.
    pub fn new(dim: usize) -> ImagesBuilder {
        ImagesBuilder {
            numbers: Vec::new(),
            seen: QuickMap::default(),
            recent: Vec::with_capacity(RECENT),
            pairs: Vec::new(),
            start: vec![0],
            dim,
            ops: 0,
        }
    }

    /// Room for `ops` operations of `terms` terms per image (one allocation instead of growth).
    pub fn reserve(&mut self, ops: usize, terms: usize) {
        self.pairs.reserve(ops * self.dim * terms);
        self.start.reserve(ops * self.dim);
    }

    /// The index of a number (added when new).
    pub fn number(&mut self, c: &Cyclo) -> u32 {
        if let Some(&i) = self
            .recent
            .iter()
            .find(|&&i| self.numbers[i as usize].same_form(c))
        {
            return i;
        }
        let next = self.numbers.len() as u32;
        let i = *self.seen.entry(c.key()).or_insert(next);
        if i == next {
            self.numbers.push(c.clone());
        }
        if self.recent.len() == RECENT {
            self.recent.remove(0);
        }
        self.recent.push(i);
        i
    }

    /// A term `coefficient · e_k` of the current image (`number` from [`ImagesBuilder::number`]).
    #[inline]
    pub fn push(&mut self, k: usize, number: u32) {
        self.pairs.push((k as u32, number));
    }

    /// A term with its coefficient given as a number.
    pub fn push_number(&mut self, k: usize, c: &Cyclo) {
        let i = self.number(c);
        self.push(k, i);
    }

    /// The current member's image is complete.
    #[inline]
    pub fn end_column(&mut self) {
        self.start.push(self.pairs.len());
    }

    /// The current operation's images (one per member) are complete.
    pub fn end_op(&mut self) {
        self.ops += 1;
        debug_assert_eq!(self.start.len() - 1, self.ops * self.dim);
    }

    pub fn finish(self) -> Images {
        debug_assert_eq!(self.start.len() - 1, self.ops * self.dim);
        Images {
            numbers: self.numbers,
            pairs: self.pairs,
            start: self.start,
            dim: self.dim,
            ops: self.ops,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn c(i: i64) -> Cyclo {
        Cyclo::from_int(i)
    }

    /// Two operations on two members: identity, and a swap with a sign.
    fn small() -> Images {
        let mut b = ImagesBuilder::new(2);
        let one = b.number(&c(1));
        b.push(0, one);
        b.end_column();
        b.push(1, one);
        b.end_column();
        b.end_op();
        b.push_number(1, &c(-1));
        b.end_column();
        b.push(0, one);
        b.end_column();
        b.end_op();
        b.finish()
    }

    #[test]
    fn terms_read_back_with_numbers_stored_once() {
        let im = small();
        assert_eq!(im.ops(), 2);
        assert_eq!(im.dim(), 2);
        assert_eq!(im.numbers().len(), 2, "1 and −1, each once");
        let col: Vec<(usize, Cyclo)> = im.col(1, 0).map(|(k, x)| (k, x.clone())).collect();
        assert_eq!(col, vec![(1, c(-1))]);
        assert_eq!(im.column(1, 1).to_vec(), vec![(0, c(1))]);
    }

    #[test]
    fn joined_restricted_and_scaled_keep_the_action() {
        let im = small();
        let j = im.joined(&im);
        assert_eq!((j.ops(), j.dim()), (2, 4));
        let col: Vec<(usize, Cyclo)> = j.col(1, 2).map(|(k, x)| (k, x.clone())).collect();
        assert_eq!(
            col,
            vec![(3, c(-1))],
            "second copy's members follow the first's"
        );
        // keep the second copy only: back to the original action
        let r = j.restricted(&[2, 3], &[usize::MAX, usize::MAX, 0, 1]);
        for op in 0..2 {
            for m in 0..2 {
                assert_eq!(r.column(op, m), im.column(op, m));
            }
        }
        let s = im.scaled_per_op(|op| c(if op == 1 { -2 } else { 1 }));
        assert_eq!(s.column(1, 0).to_vec(), vec![(1, c(2))]);
        assert_eq!(s.column(1, 1).to_vec(), vec![(0, c(-2))]);
        assert_eq!(s.column(0, 1).to_vec(), vec![(1, c(1))]);
    }
}
