//! [`Basis`]: a set of members (displacements, internal coordinates, orbitals) and, for every
//! operation, the exact image of every member as a sparse combination of members.
//!
//! Owns the characters of a basis (trace of each operation's matrix), the "unmoved" grid (which
//! sites a class's operation leaves in place, Cotton, 3rd ed., §10.2) and the exact reduction.
//! Members are taken as orthonormal: every action built here is an orthogonal matrix.

use super::images::Images;
use super::BasisError;
use crate::exact::Cyclo;
use crate::group::PointGroup;
use crate::rep::{self, Character};
use std::sync::Arc;

/// The image of one member: a sparse combination `Σ coefficient · member` (one term held
/// inline: permutation bases, the usual case, then need no allocation per image).
pub type Column = smallvec::SmallVec<[(usize, Cyclo); 1]>;

/// What a basis is made of.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum BasisKind {
    Cartesian,
    Translations,
    Rotations,
    Stretch,
    Bend,
    Sigma,
    Pi,
    PPerp,
}

impl BasisKind {
    /// Name on the command line and in JSON.
    pub fn name(self) -> &'static str {
        match self {
            BasisKind::Cartesian => "cartesian",
            BasisKind::Translations => "translations",
            BasisKind::Rotations => "rotations",
            BasisKind::Stretch => "stretch",
            BasisKind::Bend => "bend",
            BasisKind::Sigma => "sigma",
            BasisKind::Pi => "pi",
            BasisKind::PPerp => "pperp",
        }
    }
    pub fn parse(s: &str) -> Option<Self> {
        Some(match s.to_ascii_lowercase().as_str() {
            "cartesian" | "xyz" | "3n" => BasisKind::Cartesian,
            "translations" => BasisKind::Translations,
            "rotations" => BasisKind::Rotations,
            "stretch" | "stretches" | "bond" | "bonds" => BasisKind::Stretch,
            "bend" | "bends" | "angle" | "angles" => BasisKind::Bend,
            "sigma" => BasisKind::Sigma,
            "pi" => BasisKind::Pi,
            "pperp" | "p-perp" | "ppi" => BasisKind::PPerp,
            _ => return None,
        })
    }
}

/// One member of a basis.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Member {
    /// Short name as a report prints it: `r1`, `θ3`, `x2`, `σ4`, `π5a`, `p3`.
    pub name: String,
    /// Atoms it involves (0-based): one for a displacement or orbital, two for a bond, three
    /// for an angle (apex in the middle).
    pub atoms: Vec<usize>,
    /// For Cartesian members and π pairs: which direction (`x`, `y`, `z`, `a`, `b`).
    pub axis: Option<String>,
    /// Index of the site (atom, bond, angle, ligand) the member belongs to.
    pub site: usize,
}

/// A basis and how every operation of the group acts on it.
#[derive(Debug, Clone)]
pub struct Basis {
    pub kind: BasisKind,
    pub group: Arc<PointGroup>,
    pub members: Vec<Member>,
    /// Names of the sites (atoms, bonds, angles, ligands) in the unmoved grid.
    pub sites: Vec<String>,
    /// `site_perm[op][s]` = the site operation `op` carries site `s` onto.
    pub site_perm: Vec<Vec<usize>>,
    /// Operation `op` applied to member `m`: `images.col(op, m)`.
    pub images: Arc<Images>,
    /// How the members' local frames were chosen, where that matters (π pairs).
    pub notes: Vec<String>,
}

/// The first operation of each class (its representative for characters).
pub fn class_representatives(g: &PointGroup) -> Vec<usize> {
    (0..g.n_classes())
        .map(|c| {
            g.ops
                .iter()
                .position(|o| o.class == c)
                .expect("every class has an operation")
        })
        .collect()
}

impl Basis {
    /// Number of members.
    pub fn dim(&self) -> usize {
        self.members.len()
    }

    /// χ per class: the trace of a representative operation's matrix.
    pub fn character(&self) -> Character {
        let reps = class_representatives(&self.group);
        Character(
            reps.iter()
                .map(|&op| {
                    let mut t = Cyclo::zero();
                    for m in 0..self.dim() {
                        for (k, c) in self.images.col(op, m) {
                            if k == m {
                                t += c;
                            }
                        }
                    }
                    t
                })
                .collect(),
        )
    }

    /// The unmoved grid: `grid[site][class]` is true when the class's operations leave the site
    /// in place.
    pub fn unmoved(&self) -> Vec<Vec<bool>> {
        let reps = class_representatives(&self.group);
        (0..self.sites.len())
            .map(|s| reps.iter().map(|&op| self.site_perm[op][s] == s).collect())
            .collect()
    }

    /// Number of unmoved sites per class.
    pub fn unmoved_counts(&self) -> Vec<usize> {
        let grid = self.unmoved();
        (0..self.group.n_classes())
            .map(|c| grid.iter().filter(|row| row[c]).count())
            .collect()
    }

    /// The worked exact reduction of the basis's character.
    pub fn reduction(&self) -> rep::Reduction {
        rep::reduce(&self.group, &self.character())
    }

    /// Multiplicity of each irrep (table order).
    pub fn multiplicities(&self) -> Result<Vec<u64>, BasisError> {
        rep::decompose(&self.group, &self.character()).map_err(|_| BasisError::NotARepresentation {
            basis: self.kind.name().to_string(),
        })
    }

    /// Apply operation `op` to a dense coefficient vector over the members.
    pub fn apply(&self, op: usize, v: &[Cyclo]) -> Vec<Cyclo> {
        let mut out = vec![Cyclo::zero(); v.len()];
        for (m, x) in v.iter().enumerate() {
            if x.is_zero() {
                continue;
            }
            for (k, c) in self.images.col(op, m) {
                out[k] += &(c * x);
            }
        }
        out
    }

    /// Orbits of sites under the group, each sorted; the first site of each is its representative.
    pub fn site_orbits(&self) -> Vec<Vec<usize>> {
        super::structure::orbits(
            self.sites.len(),
            |op, s| self.site_perm[op][s],
            self.site_perm.len(),
        )
    }

    /// Members belonging to site `s`.
    pub fn members_of(&self, s: usize) -> Vec<usize> {
        (0..self.members.len())
            .filter(|&m| self.members[m].site == s)
            .collect()
    }

    /// Restrict to the members of some sites (e.g. one symmetry-equivalent set), keeping the action.
    /// The sites must be closed under the group.
    pub fn restricted(&self, keep_sites: &[usize]) -> Basis {
        let keep_members: Vec<usize> = (0..self.members.len())
            .filter(|&m| keep_sites.contains(&self.members[m].site))
            .collect();
        let mut new_member = vec![usize::MAX; self.members.len()];
        for (i, &m) in keep_members.iter().enumerate() {
            new_member[m] = i;
        }
        let mut new_site = vec![usize::MAX; self.sites.len()];
        for (i, &s) in keep_sites.iter().enumerate() {
            new_site[s] = i;
        }
        let members = keep_members
            .iter()
            .map(|&m| Member {
                site: new_site[self.members[m].site],
                ..self.members[m].clone()
            })
            .collect();
        let images = Arc::new(self.images.restricted(&keep_members, &new_member));
        let site_perm = self
            .site_perm
            .iter()
            .map(|p| keep_sites.iter().map(|&s| new_site[p[s]]).collect())
            .collect();
        Basis {
            kind: self.kind,
            group: self.group.clone(),
            members,
            sites: keep_sites.iter().map(|&s| self.sites[s].clone()).collect(),
            site_perm,
            images,
            notes: self.notes.clone(),
        }
    }

    /// Direct sum of two bases of the same group (members of `other` follow those of `self`).
    pub fn joined(&self, other: &Basis) -> Basis {
        let ns = self.sites.len();
        let mut members = self.members.clone();
        members.extend(other.members.iter().map(|m| Member {
            site: m.site + ns,
            ..m.clone()
        }));
        let images = Arc::new(self.images.joined(&other.images));
        let site_perm = self
            .site_perm
            .iter()
            .zip(&other.site_perm)
            .map(|(a, b)| {
                let mut p = a.clone();
                p.extend(b.iter().map(|s| s + ns));
                p
            })
            .collect();
        let mut sites = self.sites.clone();
        sites.extend(other.sites.iter().cloned());
        let mut notes = self.notes.clone();
        notes.extend(other.notes.iter().cloned());
        Basis {
            kind: self.kind,
            group: self.group.clone(),
            members,
            sites,
            site_perm,
            images,
            notes,
        }
    }
}
