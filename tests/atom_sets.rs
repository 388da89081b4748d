//! Member sets made from a geometry (bond, angle, atom and ligand sets with `[set.atoms]`), and
//! the SALCs of a session's set of every kind, checked against textbook results.

use salcdesk::analysis::{self, atom_sets, set_salcs};
use salcdesk::session::{self, Atom, Geometry, GeometrySource, MemberSet, Session, SetKind};

/// A session on atoms built from the group's sites (our site syntax).
fn built(group: &str, sites: &str) -> Session {
    let g = salcdesk::group::load(group).unwrap();
    let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
    let atoms = salcdesk::geom::build_from_sites(&ops, sites).unwrap();
    let atoms = atoms
        .iter()
        .map(|a| Atom {
            element: a.symbol().to_string(),
            xyz: [a.position.x, a.position.y, a.position.z],
        })
        .collect();
    Session {
        group: Some(group.into()),
        geometry: Some(Geometry::new(GeometrySource::Atoms(atoms))),
        ..Session::default()
    }
}

fn analysed(s: &Session) -> analysis::Analysis {
    analysis::analyze_in(s, analysis::Depth::Full, None).unwrap()
}

fn offers(s: &Session) -> Vec<atom_sets::Offer> {
    let a = analysed(s);
    let sv = atom_sets::usable(a.geometry.as_ref()).unwrap();
    atom_sets::offers(sv, &a.group)
}

#[test]
fn print_offers() {
    for (g, sites) in [
        ("Oh", "Co@origin Cl@axis1:2.3"),
        ("D4h", "Pt@origin Cl@axis2:2.3"),
        ("Td", "C@origin H@axis1:1.09"),
    ] {
        let s = built(g, sites);
        for o in offers(&s) {
            println!(
                "{g}: {} {:?}",
                o.description,
                o.set
                    .members
                    .iter()
                    .map(|m| (&m.name, &m.atoms, &m.unmoved_by))
                    .collect::<Vec<_>>()
            );
        }
    }
}
