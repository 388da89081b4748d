//! Bases and how the operations of a point group act on them: Cartesian displacements,
//! translations and rotations, bond stretches, angle bends, ligand σ and π vectors, p orbitals
//! of planar π systems and central-atom orbitals.
//!
//! Owns, per basis, the exact sparse action (`images.col(op, member)`), the unmoved grid, the
//! characters and their exact reduction; Γvib and the redundancy of internal coordinates.
//! Refuses to know how SALCs are built (`salc`) or how geometry is read and oriented (`geom`):
//! it starts from a [`Structure`] already standing in the group's standard orientation.

mod action;
mod cartesian;
mod images;
mod internal;
mod ligand;
mod orbitals;
mod pperp;
mod redundancy;
mod structure;

pub use action::{class_representatives, Basis, BasisKind, Column, Member};
pub use cartesian::{
    cartesian, cartesian_character, rotations, translations, vibrations, vibrations_linear,
    Vibrations,
};
pub use images::{check_size, permutation_images, Images, ImagesBuilder, MAX_IMAGES, MAX_MEMBERS};
pub use internal::{all_angles, angle_sets, bends, bond_sets, stretches, Angle, SiteSet};
pub use ligand::{default_ligands, pi, sigma};
pub use orbitals::{
    central_orbitals, irrep_of, orbital_character, orbital_lambda, real_orbitals, shells, Shell,
    LETTERS,
};
pub use pperp::p_perp;
pub use redundancy::{b_matrix, redundancy, Redundancy};
pub use structure::{orbits, Placed, Structure};

/// Why a basis could not be built. Atom, bond and ligand numbers are 1-based as the user wrote them.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum BasisError {
    #[error("{group} is a linear group: build the structure in its finite subgroup {descent}")]
    LinearGroup { group: String, descent: String },
    #[error("the molecule is linear: use the linear group's route ({group} has no 3N−6 count)")]
    LinearMolecule { group: String },
    #[error("a linear molecule must lie along z in the subgroup")]
    NotOnAxis,
    #[error("no atoms")]
    NoAtoms,
    #[error("bond {bond} joins atoms {} and {}; there are {n_atoms} atoms", atoms.0, atoms.1)]
    BadBond {
        bond: usize,
        atoms: (usize, usize),
        n_atoms: usize,
    },
    #[error("atom {atom} does not exist; there are {n_atoms} atoms")]
    NoSuchAtom { atom: usize, n_atoms: usize },
    #[error("{operation} sends atom {atom} ({symbol}) {distance:.3} Å from the nearest {symbol} atom (tolerance {tol} Å): the molecule does not have this symmetry in this orientation")]
    NotSymmetric {
        operation: String,
        atom: usize,
        symbol: String,
        distance: f64,
        tol: f64,
    },
    #[error("the set is not closed under the group: {operation} sends {what} to {image}, which is not in the set")]
    NotClosed {
        what: String,
        operation: String,
        image: String,
    },
    #[error("the central atom {label} (atom {atom}) is not at the centre of symmetry")]
    CentreNotFixed { atom: usize, label: String },
    #[error(
        "the atoms do not lie in a mirror plane of the group: p⊥ orbitals need a planar π system"
    )]
    NotPlanar,
    #[error("angle {angle} is linear: a bend needs a non-straight angle")]
    LinearAngle { angle: String },
    #[error(
        "the {basis} basis would have {members} members under {ops} operations ({columns} \
         images; salcdesk builds at most {max_members} members and {max_images} images): its \
         exact SALCs could not finish within the time and memory ceilings; take a smaller \
         model or fewer sites"
    )]
    TooLarge {
        basis: String,
        members: usize,
        ops: usize,
        columns: usize,
        max_members: usize,
        max_images: usize,
    },
    #[error("the {basis} basis is not made of internal coordinates")]
    NotInternal { basis: String },
    #[error("the characters of the {basis} basis do not reduce: the action is inconsistent")]
    NotARepresentation { basis: String },
    #[error("{what} cannot be written exactly: {message}")]
    Inexact { what: String, message: String },
    #[error("{message}")]
    Linear { message: String },
}
