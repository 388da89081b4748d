//! Running a survey: detect → orient → permutations → unmoved counts → reductions.

use super::internal::{angle_sets, bond_sets, unmoved_angles, unmoved_bonds, AngleSet, BondSet};
use crate::exact::Cyclo;
use crate::geom::{self, Detection, Molecule, NearMiss, OrientOptions, Oriented};
use crate::group::{self, mat_trace, PointGroup};
use crate::rep::{self, Character, Vibrations};
use std::sync::Arc;

/// Settings of a survey.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SurveyOptions {
    /// Symmetry tolerance, Å.
    pub tolerance: f64,
    /// Bond perception factor (bonded if d ≤ factor·(r₁ + r₂)).
    pub bond_factor: f64,
    /// Take the other customary x/y convention (planar C2v/D2h molecules).
    pub swap_xy: bool,
    /// Also report what looser tolerances would give.
    pub near_misses: bool,
    /// Angles closer than this to 180° are not counted as single bends (degrees).
    pub linear_angle_cutoff: f64,
    /// Perceive bonds and reduce bond and angle sets (off: group, orientation, Γ3N, Γvib only).
    pub internal_coordinates: bool,
    /// Perceive bonds when the molecule has none (off: the molecule's bond list is taken as
    /// it is, even empty — the user's edited list).
    pub perceive_bonds: bool,
}

/// Above this many bond angles the angle sets are skipped (a note says so): clusters and
/// solids have far more angles than a chemist reads one by one.
pub const MAX_ANGLES: usize = 20_000;

/// Above this many bond sets the sets are not listed (a note says so; Γ of all stretches is
/// still given): a 97,556-atom cube has 24,000 sets, and listing them took 2.7 GB in C1.
pub const MAX_BOND_SETS: usize = 5_000;

impl Default for SurveyOptions {
    fn default() -> Self {
        SurveyOptions {
            tolerance: geom::DEFAULT_TOLERANCE,
            bond_factor: geom::DEFAULT_BOND_FACTOR,
            swap_xy: false,
            near_misses: true,
            linear_angle_cutoff: 1.0,
            internal_coordinates: true,
            perceive_bonds: true,
        }
    }
}

/// What can go wrong.
#[derive(Debug, thiserror::Error)]
pub enum SurveyError {
    #[error(transparent)]
    Geometry(#[from] geom::GeomError),
    #[error(transparent)]
    Group(#[from] group::PointGroupError),
    #[error("{0}")]
    Reduction(String),
    #[error(
        "atoms {a} and {b} are {distance:.2e} Å apart (closer than {limit} Å): duplicated atoms?"
    )]
    AtomsTooClose {
        a: usize,
        b: usize,
        distance: f64,
        limit: f64,
    },
    #[error(
        "the bond list is not symmetric in {group}: atoms {a}-{b} are bonded but their image \
         {c}-{d} under {op} is not; add or remove whole sets of equivalent bonds"
    )]
    BondsNotSymmetric {
        group: String,
        op: String,
        a: usize,
        b: usize,
        c: usize,
        d: usize,
    },
    #[error("bond {a}-{b} names an atom that does not exist ({n} atoms)")]
    BondOutOfRange { a: usize, b: usize, n: usize },
}

/// Every operation must map the bond list onto itself; otherwise a bond set is no basis of a
/// representation (a perceived bond at the edge of the radius criterion, or a user's edit).
fn check_bonds_symmetric(
    bonds: &[(usize, usize)],
    n_atoms: usize,
    w: &PointGroup,
    permutations: &[(usize, &Vec<usize>)],
) -> Result<(), SurveyError> {
    let set: crate::exact::QuickSet<(usize, usize)> =
        bonds.iter().map(|&(a, b)| (a.min(b), a.max(b))).collect();
    for &(a, b) in bonds {
        if a >= n_atoms || b >= n_atoms {
            return Err(SurveyError::BondOutOfRange {
                a: a + 1,
                b: b + 1,
                n: n_atoms,
            });
        }
    }
    for &(k, perm) in permutations {
        for &(a, b) in bonds {
            let (c, d) = (perm[a], perm[b]);
            if !set.contains(&(c.min(d), c.max(d))) {
                let class = &w.table.classes[w.ops[k].class];
                return Err(SurveyError::BondsNotSymmetric {
                    group: w.name().to_string(),
                    op: class
                        .ascii
                        .trim_start_matches(|c: char| c.is_ascii_digit())
                        .to_string(),
                    a: a + 1,
                    b: b + 1,
                    c: c.min(d) + 1,
                    d: c.max(d) + 1,
                });
            }
        }
    }
    Ok(())
}

/// Closest distance two atoms of a real molecule may have (shortest bonds are ~0.74 Å).
pub const MIN_ATOM_DISTANCE: f64 = 0.1;

/// Refuse atoms closer than `limit` (a spatial hash keeps this linear in atom count).
fn check_close_atoms(mol: &Molecule, limit: f64) -> Result<(), SurveyError> {
    use std::collections::HashMap;
    let key = |p: &nalgebra::Vector3<f64>| {
        (
            (p.x / limit).floor() as i64,
            (p.y / limit).floor() as i64,
            (p.z / limit).floor() as i64,
        )
    };
    let mut cells: HashMap<(i64, i64, i64), Vec<usize>> = HashMap::new();
    for (i, a) in mol.atoms.iter().enumerate() {
        let (x, y, z) = key(&a.position);
        for dx in -1..=1 {
            for dy in -1..=1 {
                for dz in -1..=1 {
                    if let Some(list) = cells.get(&(x + dx, y + dy, z + dz)) {
                        for &j in list {
                            let d = (mol.atoms[j].position - a.position).norm();
                            if d < limit {
                                return Err(SurveyError::AtomsTooClose {
                                    a: j + 1,
                                    b: i + 1,
                                    distance: d,
                                    limit,
                                });
                            }
                        }
                    }
                }
            }
        }
        cells.entry((x, y, z)).or_default().push(i);
    }
    Ok(())
}

/// A reduced representation of one bond or angle set.
#[derive(Debug, Clone)]
pub struct SetGamma<T> {
    pub set: T,
    /// Unmoved members per class of the working group.
    pub unmoved: Vec<i64>,
    /// Multiplicities in the molecule's group.
    pub gamma: Vec<u64>,
}

/// Everything the faces show about a molecule.
#[derive(Debug, Clone)]
pub struct Survey {
    pub detection: Detection,
    /// The molecule's group.
    pub group: Arc<PointGroup>,
    /// The finite group the work is done in (the group itself, or C2v/D2h for linear ones).
    pub working: Arc<PointGroup>,
    pub oriented: Oriented,
    pub near_misses: Vec<NearMiss>,
    pub bonds: Vec<(usize, usize)>,
    /// Atom permutation of each operation of the working group (ops order).
    pub permutations: Vec<Vec<usize>>,
    /// Unmoved atoms per class of the working group.
    pub unmoved_atoms: Vec<i64>,
    pub vibrations: Vibrations,
    pub bond_sets: Vec<SetGamma<BondSet>>,
    pub angle_sets: Vec<SetGamma<AngleSet>>,
    /// Γ of all stretches.
    pub stretches: Vec<u64>,
    /// Γ of all angle bends.
    pub bends: Vec<u64>,
    /// Γvib − Γstretch (negative where the stretches exceed the modes of an irrep).
    pub bend_remainder: Vec<i64>,
    /// Γstretch + Γbend − Γvib where positive: redundant combinations per irrep.
    pub redundant: Vec<u64>,
    /// Γvib − Γstretch − Γbend where positive: what the internal set fails to cover.
    pub uncovered: Vec<u64>,
    pub notes: Vec<String>,
}

fn first_op_of_class(g: &PointGroup, c: usize) -> usize {
    g.ops
        .iter()
        .position(|o| o.class == c)
        .expect("class has an operation")
}

/// Reduce a character of the working group, correlating back for linear groups.
fn reduce_in(g: &PointGroup, w: &PointGroup, chi: Character) -> Result<Vec<u64>, SurveyError> {
    if g.is_linear() {
        Ok(rep::reduce_via_subgroup(g, w, chi)
            .map_err(SurveyError::Reduction)?
            .multiplicities)
    } else {
        rep::decompose(g, &chi).map_err(|_| {
            SurveyError::Reduction(format!(
                "internal error: a geometric representation did not reduce in {}",
                g.name()
            ))
        })
    }
}

/// Number of bond angles (pairs of bonds sharing an atom).
fn count_angles(bonds: &[(usize, usize)], n_atoms: usize) -> usize {
    let mut degree = vec![0usize; n_atoms];
    for &(a, b) in bonds {
        degree[a] += 1;
        degree[b] += 1;
    }
    degree.iter().map(|d| d * d.saturating_sub(1) / 2).sum()
}

/// Survey a molecule.
pub fn survey(mol: &Molecule, opts: &SurveyOptions) -> Result<Survey, SurveyError> {
    mol.validate()?;
    check_close_atoms(mol, MIN_ATOM_DISTANCE)?;
    let detection = geom::detect(mol, opts.tolerance)?;
    let g = group::load(&detection.group)?;
    let w = if g.is_linear() {
        group::load(g.table.descent.as_deref().unwrap_or("C2v"))?
    } else {
        g.clone()
    };
    let reps: Vec<(usize, nalgebra::Matrix3<f64>)> = (0..w.n_classes())
        .map(|c| (c, w.ops[first_op_of_class(&w, c)].float))
        .collect();
    let oriented = geom::orient_with(
        mol,
        &detection,
        &reps,
        &OrientOptions {
            swap_xy: opts.swap_xy,
            tolerance: None,
        },
    )?;
    let perm_tol = 2.0 * detection.max_deviation + detection.tolerance;
    let floats: Vec<nalgebra::Matrix3<f64>> = w.ops.iter().map(|op| op.float).collect();
    let permutations = geom::permutations(&oriented.molecule, &floats, perm_tol)?;
    // Invariance and orbits under the group need only its generators.
    let generators: Vec<usize> = geom::generator_indices(&floats);
    let gen_perms: Vec<(usize, &Vec<usize>)> =
        generators.iter().map(|&k| (k, &permutations[k])).collect();
    let gen_only: Vec<Vec<usize>> = generators
        .iter()
        .map(|&k| permutations[k].clone())
        .collect();
    let class_ops: Vec<usize> = (0..w.n_classes())
        .map(|c| first_op_of_class(&w, c))
        .collect();
    let unmoved_atoms: Vec<i64> = class_ops
        .iter()
        .map(|&k| {
            permutations[k]
                .iter()
                .enumerate()
                .filter(|(i, j)| i == *j)
                .count() as i64
        })
        .collect();
    // Γ3N: unmoved atoms × trace (Cotton, 3rd ed., §10.2).
    let chi3n = Character(
        class_ops
            .iter()
            .zip(&unmoved_atoms)
            .map(|(&k, &n)| &mat_trace(&w.ops[k].matrix) * &Cyclo::from_int(n))
            .collect(),
    );
    let g3n = reduce_in(&g, &w, chi3n)?;
    let vibrations = rep::vibrations_from_gamma_3n(&g, g3n).map_err(SurveyError::Reduction)?;

    let mut notes = detection.notes.clone();
    let bonds = if !opts.internal_coordinates {
        Vec::new()
    } else if mol.bonds.is_empty() && opts.perceive_bonds {
        geom::perceive_bonds(&oriented.molecule, opts.bond_factor)?
    } else {
        mol.bonds.clone()
    };
    check_bonds_symmetric(&bonds, mol.atoms.len(), &w, &gen_perms)?;
    let symbol = |i: usize| oriented.molecule.atoms[i].symbol().to_string();
    let class_perms: Vec<&Vec<usize>> = class_ops.iter().map(|&k| &permutations[k]).collect();
    let mut bond_out = Vec::new();
    let all_bond_sets = bond_sets(&bonds, &gen_only, symbol);
    // Γ of all stretches at once (the sets' Γ add up to it)
    let stretches_all = {
        let pairs: Vec<(usize, usize)> = bonds.iter().map(|&(a, b)| (a.min(b), a.max(b))).collect();
        let chi = Character(
            class_perms
                .iter()
                .map(|p| Cyclo::from_int(unmoved_bonds(&pairs, p)))
                .collect(),
        );
        reduce_in(&g, &w, chi)?
    };
    let listed_bond_sets = if all_bond_sets.len() > MAX_BOND_SETS {
        notes.push(format!(
            "{} bond sets ({} bonds): sets not listed (more than {MAX_BOND_SETS}); Γ of all \
             stretches given",
            all_bond_sets.len(),
            bonds.len()
        ));
        Vec::new()
    } else {
        all_bond_sets
    };
    for set in listed_bond_sets {
        let unmoved: Vec<i64> = class_perms
            .iter()
            .map(|p| unmoved_bonds(&set.bonds, p))
            .collect();
        let chi = Character(unmoved.iter().map(|&n| Cyclo::from_int(n)).collect());
        let gamma = reduce_in(&g, &w, chi)?;
        bond_out.push(SetGamma {
            set,
            unmoved,
            gamma,
        });
    }
    let positions: Vec<_> = oriented.molecule.atoms.iter().map(|a| a.position).collect();
    let n_angles = count_angles(&bonds, positions.len());
    let (angle_list, skipped_linear) = if n_angles > MAX_ANGLES {
        notes.push(format!(
            "{n_angles} bond angles: angle sets not reduced (more than {MAX_ANGLES})"
        ));
        (Vec::new(), 0)
    } else {
        angle_sets(
            &bonds,
            &positions,
            &gen_only,
            symbol,
            opts.linear_angle_cutoff,
        )
    };
    let mut angle_out = Vec::new();
    for set in angle_list {
        let unmoved: Vec<i64> = class_perms
            .iter()
            .map(|p| unmoved_angles(&set.angles, p))
            .collect();
        let chi = Character(unmoved.iter().map(|&n| Cyclo::from_int(n)).collect());
        let gamma = reduce_in(&g, &w, chi)?;
        angle_out.push(SetGamma {
            set,
            unmoved,
            gamma,
        });
    }
    let n_irreps = g.table.irreps.len();
    let total = |sets: &dyn Fn(usize) -> u64| (0..n_irreps).map(sets).collect::<Vec<u64>>();
    let stretches = stretches_all;
    let bends = total(&|i| angle_out.iter().map(|s| s.gamma[i]).sum());
    let vib = &vibrations.vibrations;
    let bend_remainder: Vec<i64> = (0..n_irreps)
        .map(|i| vib[i] as i64 - stretches[i] as i64)
        .collect();
    let internal: Vec<i64> = (0..n_irreps)
        .map(|i| (stretches[i] + bends[i]) as i64)
        .collect();
    let redundant: Vec<u64> = (0..n_irreps)
        .map(|i| (internal[i] - vib[i] as i64).max(0) as u64)
        .collect();
    let uncovered: Vec<u64> = (0..n_irreps)
        .map(|i| (vib[i] as i64 - internal[i]).max(0) as u64)
        .collect();

    if g.is_linear() {
        notes.push(format!(
            "linear molecule: representations reduced in {} and correlated back to {}",
            w.name(),
            g.name()
        ));
    }
    if skipped_linear > 0 {
        notes.push(format!(
            "{skipped_linear} angle(s) within {}° of 180° left out: a linear bend is a degenerate pair of coordinates",
            opts.linear_angle_cutoff
        ));
    }
    let near_misses = if opts.near_misses {
        geom::near_misses_from(mol, &detection, &geom::NEAR_MISS_TOLERANCES).unwrap_or_default()
    } else {
        Vec::new()
    };
    Ok(Survey {
        detection,
        group: g,
        working: w,
        oriented,
        near_misses,
        bonds,
        permutations,
        unmoved_atoms,
        vibrations,
        bond_sets: bond_out,
        angle_sets: angle_out,
        stretches,
        bends,
        bend_remainder,
        redundant,
        uncovered,
        notes,
    })
}
