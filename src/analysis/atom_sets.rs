//! Member sets tied to atoms: from a surveyed geometry, the sets of symmetry-equivalent bonds
//! (stretches), bond angles (bends), atoms (x, y, z displacements) and ligands around a central
//! atom (σ and π), each offered as a ready member set whose members name their atoms
//! (`[set.atoms]`) and carry the ticks the geometry gives. Also the check of atoms typed for one
//! member. Atom numbers are 1-based in the geometry's own order, as in the session file.
//!
//! A member is left in place by an operation when its atoms go onto themselves (Cotton, 3rd ed.,
//! §10.2: only unshifted bonds contribute to χ); the ticks use the class's first operation, as
//! [`super::ticks`] does when it checks them.

use super::geometry::GeometryAnalysis;
use super::ticks::stays;
use crate::group::PointGroup;
use crate::session::{Member, MemberSet, SetKind};
use crate::survey::Survey;

/// One member set the geometry offers, with a plain description for a picker.
#[derive(Debug, Clone, PartialEq)]
pub struct Offer {
    /// e.g. `C–H stretches (4)`, `H–C–H angles (6)`, `ligand σ on Co1 (6)`.
    pub description: String,
    pub set: MemberSet,
}

/// Atom label as chemists number them: `Co1`, `Cl2` (1-based).
pub fn atom_label(sv: &Survey, a: usize) -> String {
    let sym = sv
        .oriented
        .molecule
        .atoms
        .get(a)
        .map(|x| x.symbol())
        .unwrap_or("?");
    format!("{sym}{}", a + 1)
}

/// What a member is, in words: `Co1–Cl2`, `Cl2–Co1–Cl3`, `H3` (1-based `atoms`).
pub fn member_legend(sv: &Survey, atoms: &[usize]) -> String {
    atoms
        .iter()
        .map(|&a| atom_label(sv, a.wrapping_sub(1)))
        .collect::<Vec<_>>()
        .join("–")
}

/// The surveyed geometry, or why there is none to build from.
pub fn usable(ga: Option<&GeometryAnalysis>) -> Result<&Survey, String> {
    let ga = ga.ok_or_else(|| {
        "this session has no geometry: Molecule panel, b builds one from the group's sites"
            .to_string()
    })?;
    ga.survey
        .as_deref()
        .map_err(|e| format!("the geometry could not be used ({e}): the Molecule panel says more"))
}

/// Ticks (ASCII class names in table order) the geometry gives a member of `kind` on the
/// 1-based `atoms`, when the session's group is the geometry's own (finite) group; else just E.
pub fn ticks_for(sv: &Survey, group: &PointGroup, kind: SetKind, atoms: &[usize]) -> Vec<String> {
    let w = &sv.working;
    let same = w.name() == group.name()
        && sv.group.name() == group.name()
        && !group.is_linear()
        && sv.permutations.len() == w.ops.len();
    let n = sv.permutations.first().map(|p| p.len()).unwrap_or(0);
    if !same || atoms.iter().any(|&a| a == 0 || a > n) {
        return vec!["E".into()];
    }
    let zero: Vec<usize> = atoms.iter().map(|a| a - 1).collect();
    w.table
        .classes
        .iter()
        .enumerate()
        .filter(|(c, _)| {
            w.ops
                .iter()
                .position(|o| o.class == *c)
                .is_some_and(|k| stays(kind, &zero, &sv.permutations[k]))
        })
        .map(|(_, cl)| cl.ascii.clone())
        .collect()
}

/// Orbits of 0-based items under the atom permutations, each sorted, in order of first item.
fn orbits_of<T: Copy + Ord>(
    items: &[T],
    image: impl Fn(&[usize], T) -> T,
    perms: &[Vec<usize>],
) -> Vec<Vec<T>> {
    let mut left: Vec<T> = items.to_vec();
    let mut out = Vec::new();
    while let Some(&first) = left.first() {
        let mut orbit: Vec<T> = perms.iter().map(|p| image(p, first)).collect();
        orbit.push(first);
        orbit.sort();
        orbit.dedup();
        orbit.retain(|t| items.contains(t));
        left.retain(|t| !orbit.contains(t));
        out.push(orbit);
    }
    out
}

/// The atom at the centre of symmetry (the oriented origin), if any.
pub fn central_atom(sv: &Survey) -> Option<usize> {
    let slack = 1e-3_f64.max(2.0 * sv.detection.max_deviation + sv.detection.tolerance);
    sv.oriented
        .molecule
        .atoms
        .iter()
        .position(|a| a.position.norm() < slack)
}

fn plural(n: usize, one: &str, many: &str) -> String {
    format!("{n} {}", if n == 1 { one } else { many })
}

/// Every member set the geometry offers: its bond sets, angle sets, atom sets and, around an
/// atom at the centre, ligand σ and π sets (one per set of equivalent ligands). Ticks follow
/// the geometry when `group` is the geometry's own.
pub fn offers(sv: &Survey, group: &PointGroup) -> Vec<Offer> {
    let mut out = Vec::new();
    let label = |a: usize| atom_label(sv, a);
    let sym = |a: usize| {
        sv.oriented
            .molecule
            .atoms
            .get(a)
            .map(|x| x.symbol())
            .unwrap_or("?")
    };
    let mk = |kind: SetKind, prefix: &dyn Fn(usize, &[usize]) -> String, items: Vec<Vec<usize>>| {
        items
            .iter()
            .enumerate()
            .map(|(k, atoms)| {
                let one: Vec<usize> = atoms.iter().map(|a| a + 1).collect();
                Member {
                    name: prefix(k, atoms),
                    unmoved_by: ticks_for(sv, group, kind, &one),
                    atoms: Some(one),
                }
            })
            .collect::<Vec<Member>>()
    };
    let pos = |a: usize| sv.oriented.molecule.atoms[a].position;
    let numbered = |p: &'static str| move |k: usize, _: &[usize]| format!("{p}{}", k + 1);
    // Bond sets (Wilson–Decius–Cross §6-2: one stretch per bond).
    for bs in &sv.bond_sets {
        let items: Vec<Vec<usize>> = bs.set.bonds.iter().map(|&(a, b)| vec![a, b]).collect();
        let n = items.len();
        let (a, b) = bs.set.bonds[0];
        let name = format!(
            "{} stretches, {:.2} Å",
            bs.set.label,
            pos(b).metric_distance(&pos(a))
        );
        out.push(Offer {
            description: format!("{name} ({n})"),
            set: MemberSet {
                name,
                kind: SetKind::Stretch,
                members: mk(SetKind::Stretch, &numbered("r"), items),
            },
        });
    }
    // Angle sets: end, apex, end.
    for asg in &sv.angle_sets {
        let items: Vec<Vec<usize>> = asg
            .set
            .angles
            .iter()
            .map(|&(i, j, k)| vec![i, j, k])
            .collect();
        let n = items.len();
        let (i, j, k) = asg.set.angles[0];
        let deg = (pos(i) - pos(j)).angle(&(pos(k) - pos(j))).to_degrees();
        let name = format!("{} angles, {deg:.1}°", asg.set.label);
        out.push(Offer {
            description: format!("{name} ({n})"),
            set: MemberSet {
                name,
                kind: SetKind::Bend,
                members: mk(SetKind::Bend, &numbered("α"), items),
            },
        });
    }
    // Atom sets: x, y, z displacements of each set of equivalent atoms (Cotton §10.2).
    let n_atoms = sv.oriented.molecule.atoms.len();
    let atoms: Vec<usize> = (0..n_atoms).collect();
    let atom_orbits = orbits_of(&atoms, |p, a| p[a], &sv.permutations);
    for orbit in &atom_orbits {
        let n = orbit.len();
        let name = format!("{} atoms, x y z", sym(orbit[0]));
        let items: Vec<Vec<usize>> = orbit.iter().map(|&a| vec![a]).collect();
        out.push(Offer {
            description: format!("{} atoms: x, y, z displacements ({n})", sym(orbit[0])),
            set: MemberSet {
                name,
                kind: SetKind::Cartesian,
                members: mk(SetKind::Cartesian, &|_, a| label(a[0]), items),
            },
        });
    }
    // Ligands around the central atom: σ (one per ligand, along the bond) and π (a pair of
    // vectors perpendicular to it) — Cotton ch. 8 (ligand group orbitals).
    if let Some(c) = central_atom(sv) {
        let ligands: Vec<usize> = sv
            .bonds
            .iter()
            .filter_map(|&(a, b)| {
                if a == c {
                    Some(b)
                } else if b == c {
                    Some(a)
                } else {
                    None
                }
            })
            .collect();
        let mut ligands = ligands;
        ligands.sort();
        for orbit in orbits_of(&ligands, |p, a| p[a], &sv.permutations) {
            let n = orbit.len();
            let el = sym(orbit[0]);
            let d = (sv.oriented.molecule.atoms[orbit[0]].position
                - sv.oriented.molecule.atoms[c].position)
                .norm();
            let at = format!("{el} at {d:.2} Å");
            let items: Vec<Vec<usize>> = orbit.iter().map(|&l| vec![c, l]).collect();
            let centre = label(c);
            out.push(Offer {
                description: format!("ligand σ on {centre}: {at} ({n})"),
                set: MemberSet {
                    name: format!("ligand σ on {centre} ({el})"),
                    kind: SetKind::Stretch,
                    members: mk(SetKind::Stretch, &numbered("σ"), items.clone()),
                },
            });
            out.push(Offer {
                description: format!("ligand π on {centre}: {at} ({} pairs)", n),
                set: MemberSet {
                    name: format!("ligand π on {centre} ({el})"),
                    kind: SetKind::Pi,
                    members: mk(SetKind::Pi, &numbered("π"), items),
                },
            });
        }
    }
    out
}

/// Parse atoms typed for one member: `1-2`, `2-1-3`, `4` (also spaces or commas between).
pub fn parse_atoms(text: &str) -> Result<Vec<usize>, String> {
    let parts: Vec<&str> = text
        .split(|c: char| c == '-' || c == ',' || c.is_whitespace() || c == '–')
        .filter(|t| !t.is_empty())
        .collect();
    if parts.is_empty() {
        return Err(
            "type atom numbers, e.g. 1-2 (a bond) or 2-1-3 (an angle, apex in the middle)".into(),
        );
    }
    parts
        .iter()
        .map(|t| {
            t.parse::<usize>()
                .map_err(|_| format!("'{t}' is not an atom number (numbers from 1, e.g. 1-2)"))
        })
        .collect()
}

/// Check atoms (1-based) for one member of `kind` against the geometry: the right count, atoms
/// that exist, no atom twice, and for bonds and angles, atoms that are bonded.
pub fn check_member_atoms(sv: &Survey, kind: SetKind, atoms: &[usize]) -> Result<(), String> {
    let want = kind.atoms_per_member();
    if atoms.len() != want {
        return Err(format!(
            "a {} member sits on {}; {} typed",
            kind.name(),
            kind.atoms_shape(),
            plural(atoms.len(), "atom", "atoms")
        ));
    }
    let n = sv.oriented.molecule.atoms.len();
    if let Some(&bad) = atoms.iter().find(|&&a| a == 0 || a > n) {
        return Err(format!(
            "atom {bad} does not exist: the geometry has {n} atoms, numbered from 1"
        ));
    }
    for (i, a) in atoms.iter().enumerate() {
        if atoms[..i].contains(a) {
            return Err(format!("atom {a} is named twice"));
        }
    }
    let bonded = |a: usize, b: usize| {
        let (x, y) = (a.min(b) - 1, a.max(b) - 1);
        sv.bonds.contains(&(x, y))
    };
    let pairs: Vec<(usize, usize)> = match kind {
        SetKind::Stretch | SetKind::Pi => vec![(atoms[0], atoms[1])],
        SetKind::Bend => vec![(atoms[0], atoms[1]), (atoms[1], atoms[2])],
        _ => Vec::new(),
    };
    for (a, b) in pairs {
        if !bonded(a, b) {
            return Err(format!(
                "{} and {} are not bonded in the geometry (Molecule panel: + adds a bond)",
                atom_label(sv, a - 1),
                atom_label(sv, b - 1)
            ));
        }
    }
    Ok(())
}
