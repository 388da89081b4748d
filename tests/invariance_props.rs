//! Property tests over random inputs: projection-operator laws for random member sets built
//! from random sites of random groups, and invariance of group, Γvib and the SALC count per
//! irrep under random rotation, translation and renumbering of a molecule's atoms.
// Source: Cotton, Chemical Applications of Group Theory, 3rd ed., §4.5 and ch. 8 (projection
// operators: idempotent, mutually orthogonal, summing to the identity); symmetry is a property
// of the molecule, not of its coordinates or atom numbering (common practice).

#[path = "geom_molecules.rs"]
mod molecules;
#[path = "salc_support.rs"]
mod support;

use nalgebra::{Rotation3, Unit, Vector3};
use proptest::prelude::*;
use salcdesk::analysis;
use salcdesk::basis::{self, Placed, Structure};
use salcdesk::geom;
use salcdesk::session::{Atom, Geometry, GeometrySource, Session};

const GROUPS: [&str; 10] = [
    "C2v", "C3v", "C4v", "D2h", "D3h", "D3d", "D2d", "C3h", "Td", "D4h",
];

/// A centre at the origin and one orbit of ligands on a random site type of the group.
fn centre_and_orbit(group: &str, site: usize, r: f64, theta: f64, phi: f64) -> Option<Structure> {
    let g = salcdesk::group::load(group).unwrap();
    let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
    let types = geom::site_types(&ops).unwrap();
    let t = &types[1 + site % (types.len() - 1)];
    if t.multiplicity > 24 {
        return None;
    }
    let placed = geom::place(
        17,
        t,
        &geom::SiteParams {
            distance: r,
            theta_deg: theta,
            phi_deg: phi,
        },
    )
    .ok()?;
    let mut atoms = vec![Placed {
        symbol: "Pt".into(),
        position: Vector3::zeros(),
    }];
    atoms.extend(placed.iter().map(|a| Placed {
        symbol: "Cl".into(),
        position: a.position,
    }));
    let bonds = (1..atoms.len()).map(|k| (0, k)).collect();
    Structure::new(g, atoms, bonds, 1e-4).ok()
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(24))]

    #[test]
    fn projection_laws_hold_for_random_member_sets(
        gi in 0usize..GROUPS.len(),
        site in 0usize..8,
        r in 1.5f64..2.5,
        theta in 5.0f64..85.0,
        phi in 5.0f64..85.0,
        which in 0usize..3,
    ) {
        let Some(s) = centre_and_orbit(GROUPS[gi], site, r, theta, phi) else {
            return Ok(());
        };
        let b = match which {
            0 => basis::cartesian(&s).unwrap(),
            1 => basis::stretches(&s, &s.bonds).unwrap(),
            _ => basis::sigma(&s, 0, &basis::default_ligands(&s, 0)).unwrap(),
        };
        let set = salcdesk::salc::salcs(&b).unwrap();
        support::check_laws(&b, &set);
    }
}

const MOLECULES: [&str; 5] = ["H2O", "NH3", "benzene", "allene", "B(OH)3"];

/// Group, Γvib and stretch-SALC count per irrep (summed over bond sets) of inline atoms.
fn fingerprint(atoms: Vec<Atom>) -> (String, String, Vec<u64>) {
    let s = Session {
        geometry: Some(Geometry::new(GeometrySource::Atoms(atoms))),
        ..Session::default()
    };
    let a = analysis::analyze(&s).unwrap();
    let ga = a.geometry.unwrap();
    let sv = ga.survey.unwrap();
    let gamma = salcdesk::rep::format_sum(&sv.group, &sv.vibrations.vibrations, false);
    let salcs = ga.salcs.unwrap();
    let sets = salcs.as_ref().as_ref().unwrap();
    let mut counts: Vec<u64> = Vec::new();
    for bs in sets {
        let set = bs.result.as_ref().unwrap();
        if counts.is_empty() {
            counts = vec![0; set.multiplicities.len()];
        }
        for (c, m) in counts.iter_mut().zip(&set.multiplicities) {
            *c += m;
        }
    }
    (sv.group.name().to_string(), gamma, counts)
}

fn as_atoms(m: &geom::Molecule) -> Vec<Atom> {
    m.atoms
        .iter()
        .map(|a| Atom {
            element: a.symbol().to_string(),
            xyz: [a.position.x, a.position.y, a.position.z],
        })
        .collect()
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(16))]

    #[test]
    fn rotation_translation_and_renumbering_keep_group_gamma_vib_and_salc_counts(
        which in 0usize..MOLECULES.len(),
        ax in (-1.0f64..1.0, -1.0f64..1.0, -1.0f64..1.0),
        angle in 0.0f64..std::f64::consts::TAU,
        shift in (-20.0f64..20.0, -20.0f64..20.0, -20.0f64..20.0),
        keys in proptest::collection::vec(any::<u32>(), 16),
    ) {
        let case = molecules::all().into_iter().find(|c| c.name == MOLECULES[which]).unwrap();
        let axis = Vector3::new(ax.0, ax.1, ax.2);
        prop_assume!(axis.norm() > 1e-3);
        let rot = Rotation3::from_axis_angle(&Unit::new_normalize(axis), angle);
        let t = Vector3::new(shift.0, shift.1, shift.2);
        let mut idx: Vec<usize> = (0..case.mol.atoms.len()).collect();
        idx.sort_by_key(|&i| keys[i % keys.len()].wrapping_mul(i as u32 + 1));
        let moved = geom::Molecule::new(
            "moved",
            idx.iter()
                .map(|&i| {
                    let mut a = case.mol.atoms[i].clone();
                    a.position = rot * a.position + t;
                    a
                })
                .collect(),
        );
        let before = fingerprint(as_atoms(&case.mol));
        let after = fingerprint(as_atoms(&moved));
        prop_assert_eq!(&before.0, case.group);
        prop_assert_eq!(before, after);
    }
}
