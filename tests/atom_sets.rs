//! Member sets made from a geometry (bond, angle, atom and ligand sets with `[set.atoms]`), and
//! the SALCs of a session's set of every kind, checked against textbook results.

use salcdesk::analysis::{self, atom_sets, set_salcs, Analysis};
use salcdesk::geom::SiteKind;
use salcdesk::rep::format_sum;
use salcdesk::session::{self, Atom, Geometry, GeometrySource, MemberSet, Session, SetKind};
use std::path::Path;

/// The name of the first site type of `group` on an axis with `mult` sites.
fn axis_site(group: &str, mult: usize) -> String {
    let g = salcdesk::group::load(group).unwrap();
    let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
    let types = salcdesk::geom::site_types(&ops).unwrap();
    let names = salcdesk::geom::site_names(&types);
    let k = types
        .iter()
        .position(|t| t.kind == SiteKind::Axis && t.multiplicity == mult)
        .unwrap();
    names[k].clone()
}

/// A session on a central atom and `mult` ligands on an axis site of `group`.
fn complex(group: &str, centre: &str, ligand: &str, mult: usize, r: f64) -> Session {
    let sites = format!("{centre}@origin {ligand}@{}:{r}", axis_site(group, mult));
    let g = salcdesk::group::load(group).unwrap();
    let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
    let atoms = salcdesk::geom::build_from_sites(&ops, &sites).unwrap();
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

fn analysed(s: &Session, base: Option<&Path>) -> Analysis {
    analysis::analyze_in(s, analysis::Depth::Full, base).unwrap()
}

fn offers(s: &Session, base: Option<&Path>) -> Vec<atom_sets::Offer> {
    let a = analysed(s, base);
    let sv = atom_sets::usable(a.geometry.as_ref()).unwrap();
    atom_sets::offers(sv, &a.group)
}

fn offer(s: &Session, starts: &str) -> MemberSet {
    offers(s, None)
        .into_iter()
        .find(|o| o.description.starts_with(starts))
        .unwrap_or_else(|| panic!("no offer starting with {starts}"))
        .set
}

/// Γ of one offered set, from its ticks (the session's own reduction).
fn gamma(s: &Session, set: MemberSet) -> String {
    let mut s = s.clone();
    s.sets.push(set);
    let a = analysed(&s, None);
    let sa = a.sets.last().unwrap();
    assert!(
        sa.geometry_ticks.disagreements.is_empty(),
        "offered ticks agree with the geometry"
    );
    format_sum(&a.group, sa.multiplicities().unwrap(), false)
}

#[test]
fn offered_sets_reduce_as_the_textbooks_say() {
    let oh = complex("Oh", "Co", "Cl", 6, 2.3);
    // Octahedral ML6: M–L stretches A1g + Eg + T1u (Cotton, 3rd ed., §10.6; Nakamoto, Part A).
    assert_eq!(gamma(&oh, offer(&oh, "Co–Cl stretches")), "A1g + Eg + T1u");
    // Ligand σ the same; ligand π T1g + T2g + T1u + T2u (Cotton, 3rd ed., §8.5).
    assert_eq!(gamma(&oh, offer(&oh, "ligand σ")), "A1g + Eg + T1u");
    assert_eq!(gamma(&oh, offer(&oh, "ligand π")), "T1g + T2g + T1u + T2u");
    // The 12 cis L–M–L angles: A1g + Eg + T2g + T1u + T2u (Nakamoto, Part A, ML6 bends;
    // the trans angles are straight and left out).
    assert_eq!(
        gamma(&oh, offer(&oh, "Cl–Co–Cl angles")),
        "A1g + Eg + T2g + T1u + T2u"
    );
    // Tetrahedral CH4: C–H stretches A1 + T2, H–C–H angles A1 + E + T2 (Cotton, 3rd ed.,
    // §10.6; Herzberg II, methane).
    let td = complex("Td", "C", "H", 4, 1.09);
    assert_eq!(gamma(&td, offer(&td, "C–H stretches")), "A1 + T2");
    assert_eq!(gamma(&td, offer(&td, "H–C–H angles")), "A1 + E + T2");
    // Square-planar ML4: M–L stretches A1g + B1g + Eu (Cotton, 3rd ed., §10.6).
    let d4h = complex("D4h", "Pt", "Cl", 4, 2.3);
    assert_eq!(
        gamma(&d4h, offer(&d4h, "Pt–Cl stretches")),
        "A1g + B1g + Eu"
    );
}

/// Every shipped session with a geometry and several built molecules: the offered sets cover
/// every bond, every bent angle and every atom once, with one member per bond / angle / atom
/// of its set, and survive a save and a load with their atoms.
#[test]
fn offered_sets_cover_the_molecule_and_round_trip() {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions");
    let mut cases: Vec<(String, Session)> = Vec::new();
    for f in std::fs::read_dir(&dir).unwrap() {
        let p = f.unwrap().path();
        let s = session::load_file(&p).unwrap();
        if s.geometry.is_some() {
            cases.push((p.display().to_string(), s));
        }
    }
    assert!(cases.len() >= 2, "the shipped sessions with a geometry");
    for (g, c, l, m) in [
        ("Oh", "Co", "Cl", 6),
        ("Td", "C", "H", 4),
        ("D4h", "Pt", "Cl", 4),
        ("D3h", "B", "F", 3),
        ("D6h", "Ru", "H", 6),
    ] {
        cases.push((format!("{g} {c}{l}{m}"), complex(g, c, l, m, 1.5)));
    }
    for (what, s) in cases {
        let a = analysed(&s, Some(&dir));
        let sv = atom_sets::usable(a.geometry.as_ref()).unwrap();
        let offers = atom_sets::offers(sv, &a.group);
        let of = |k: SetKind, word: &str| -> Vec<&MemberSet> {
            offers
                .iter()
                .filter(|o| o.set.kind == k && o.description.contains(word))
                .map(|o| &o.set)
                .collect()
        };
        // Bonds: the stretch sets are the survey's bond sets, each bond once.
        let stretch = of(SetKind::Stretch, "stretches");
        let bonds: usize = stretch.iter().map(|s| s.members.len()).sum();
        assert_eq!(bonds, sv.bonds.len(), "{what}: every bond once");
        for (set, bs) in stretch.iter().zip(&sv.bond_sets) {
            assert_eq!(
                set.members.len(),
                bs.set.bonds.len(),
                "{what}: {}",
                set.name
            );
        }
        let angles: usize = of(SetKind::Bend, "angles")
            .iter()
            .map(|s| s.members.len())
            .sum();
        let bent: usize = sv.angle_sets.iter().map(|s| s.set.angles.len()).sum();
        assert_eq!(angles, bent, "{what}: every bent angle once");
        let atoms: usize = of(SetKind::Cartesian, "atoms")
            .iter()
            .map(|s| s.members.len())
            .sum();
        assert_eq!(
            atoms,
            sv.oriented.molecule.atoms.len(),
            "{what}: every atom once"
        );
        // Members name as many atoms as their kind needs, and [set.atoms] round-trips.
        let mut s2 = s.clone();
        for o in &offers {
            assert!(o.set.members.iter().all(|m| m.atoms_fit(o.set.kind)));
            let mut set = o.set.clone();
            set.name = format!("{} #{}", set.name, s2.sets.len());
            s2.sets.push(set);
        }
        let text = session::to_toml(&s2);
        let back = session::parse("round trip", &text).unwrap();
        assert_eq!(
            back.sets, s2.sets,
            "{what}: sets with their atoms after save and load"
        );
    }
}

fn salcs_of(s: &Session, set: &MemberSet) -> set_salcs::SetSalcs {
    let a = analysed(s, None);
    let sv = atom_sets::usable(a.geometry.as_ref()).unwrap();
    set_salcs::compute_salcs(sv, set).unwrap()
}

/// Irrep label → number of SALCs.
fn counts(ss: &set_salcs::SetSalcs) -> Vec<(String, usize)> {
    let mut out: Vec<(String, usize)> = Vec::new();
    for sc in &ss.salcs.salcs {
        match out.iter_mut().find(|(l, _)| *l == sc.label) {
            Some((_, n)) => *n += 1,
            None => out.push((sc.label.clone(), 1)),
        }
    }
    out
}

fn orthonormal(ss: &set_salcs::SetSalcs) {
    let v: Vec<Vec<f64>> = ss.salcs.salcs.iter().map(|s| s.floats()).collect();
    for i in 0..v.len() {
        for j in 0..v.len() {
            let d: f64 = v[i].iter().zip(&v[j]).map(|(a, b)| a * b).sum();
            let want = if i == j { 1.0 } else { 0.0 };
            assert!((d - want).abs() < 1e-9, "SALCs {i} and {j}: {d}");
        }
    }
}

#[test]
fn square_planar_sigma_salcs_are_the_textbook_ones() {
    // Cotton, 3rd ed., §8.5 (ML4 σ): A1g ½(σ1+σ2+σ3+σ4), B1g ½(σ1−σ2+σ3−σ4) with σ1…σ4 going
    // round the square, Eu the pair 1/√2(σ1−σ3), 1/√2(σ2−σ4). Written without a numbering:
    // A1g all ½; B1g ½·sign(cos 2φ) of each ligand's angle φ from x; Eu in the span of
    // (cos φ) and (sin φ).
    let s = complex("D4h", "Pt", "Cl", 4, 2.3);
    let set = offer(&s, "ligand σ");
    let ss = salcs_of(&s, &set);
    assert_eq!(
        counts(&ss),
        vec![("A1g".into(), 1), ("B1g".into(), 1), ("Eu".into(), 2)]
    );
    orthonormal(&ss);
    let a = analysed(&s, None);
    let sv = atom_sets::usable(a.geometry.as_ref()).unwrap();
    let phi: Vec<f64> = set
        .members
        .iter()
        .map(|m| {
            let p = sv.oriented.molecule.atoms[m.atoms.as_ref().unwrap()[1] - 1].position;
            p.y.atan2(p.x)
        })
        .collect();
    for sc in &ss.salcs.salcs {
        let c = sc.floats();
        match sc.label.as_str() {
            "A1g" => assert!(c.iter().all(|x| (x - 0.5).abs() < 1e-12), "{c:?}"),
            "B1g" => {
                let s0 = c[0].signum();
                for (x, f) in c.iter().zip(&phi) {
                    assert!((x.abs() - 0.5).abs() < 1e-12);
                    assert_eq!(
                        x.signum() * s0,
                        (2.0 * f).cos().signum() * (2.0 * phi[0]).cos().signum()
                    );
                }
            }
            "Eu" => {
                // Remove the projections on the normalized cos φ and sin φ vectors.
                let cs: Vec<f64> = phi.iter().map(|f| f.cos() / 2f64.sqrt()).collect();
                let sn: Vec<f64> = phi.iter().map(|f| f.sin() / 2f64.sqrt()).collect();
                let dot = |a: &[f64], b: &[f64]| a.iter().zip(b).map(|(x, y)| x * y).sum::<f64>();
                let (p, q) = (dot(&c, &cs), dot(&c, &sn));
                assert!(
                    (p * p + q * q - 1.0).abs() < 1e-9,
                    "Eu SALC in the (x, y) span"
                );
            }
            other => panic!("unexpected irrep {other}"),
        }
    }
}

#[test]
fn salcs_of_every_kind_on_an_octahedral_complex() {
    let s = complex("Oh", "Co", "Cl", 6, 2.3);
    let n = |v: &[(&str, usize)]| -> Vec<(String, usize)> {
        v.iter().map(|(l, k)| (l.to_string(), *k)).collect()
    };
    // π: T1g + T2g + T1u + T2u, three partners each (Cotton, 3rd ed., §8.5).
    let pi = salcs_of(&s, &offer(&s, "ligand π"));
    assert_eq!(
        counts(&pi),
        n(&[("T1g", 3), ("T2g", 3), ("T1u", 3), ("T2u", 3)])
    );
    orthonormal(&pi);
    // Stretches: A1g + Eg + T1u (Cotton, 3rd ed., §10.6).
    let st = salcs_of(&s, &offer(&s, "Co–Cl stretches"));
    assert_eq!(counts(&st), n(&[("A1g", 1), ("Eg", 2), ("T1u", 3)]));
    // Bends (cis angles): A1g + Eg + T2g + T1u + T2u (Nakamoto, Part A).
    let be = salcs_of(&s, &offer(&s, "Cl–Co–Cl angles"));
    assert_eq!(
        counts(&be),
        n(&[("A1g", 1), ("Eg", 2), ("T2g", 3), ("T1u", 3), ("T2u", 3)])
    );
    orthonormal(&be);
    // Cartesian x, y, z of the metal: T1u; as an axial triple (Rx, Ry, Rz): T1g (Cotton,
    // 3rd ed., Oh character table).
    let mut metal = offer(&s, "Co atoms");
    assert_eq!(counts(&salcs_of(&s, &metal)), n(&[("T1u", 3)]));
    metal.kind = SetKind::Axial;
    assert_eq!(counts(&salcs_of(&s, &metal)), n(&[("T1g", 3)]));
    // Scalar members on the six Cl atoms: A1g + Eg + T1u, the σ result (Cotton, 3rd ed., §8.5).
    let mut cl = offer(&s, "Cl atoms");
    cl.kind = SetKind::Scalar;
    let sc = salcs_of(&s, &cl);
    assert_eq!(counts(&sc), n(&[("A1g", 1), ("Eg", 2), ("T1u", 3)]));
    orthonormal(&sc);
    // Cartesian on the Cl atoms: 18 displacements, A1g + Eg + T1g + 2T1u + T2g + T2u
    // (Cotton, 3rd ed., §10.3, Γ of the ligand displacements; from memory).
    cl.kind = SetKind::Cartesian;
    assert_eq!(
        counts(&salcs_of(&s, &cl)),
        n(&[
            ("A1g", 1),
            ("Eg", 2),
            ("T1g", 3),
            ("T2g", 3),
            ("T1u", 6),
            ("T2u", 3)
        ])
    );
}

#[test]
fn missing_atoms_or_geometry_are_explained() {
    // The demo's π set has ticks but no geometry: the reason names what to do.
    let demo = session::demo();
    let pi = demo.sets.iter().find(|s| s.kind == SetKind::Pi).unwrap();
    let r = set_salcs::set_salcs(pi, None, true).unwrap();
    let why = r.as_ref().as_ref().unwrap_err();
    assert!(
        why.contains("No geometry") && why.contains("Molecule panel, b"),
        "{why}"
    );
    // With a geometry, members without atoms are named and the keys given.
    let s = complex("Oh", "Co", "Cl", 6, 2.3);
    let a = analysed(&s, None);
    let mut set = offer(&s, "ligand π");
    set.members[2].atoms = None;
    let r = set_salcs::set_salcs(&set, a.geometry.as_ref(), true).unwrap();
    let why = r.as_ref().as_ref().unwrap_err();
    assert!(
        why.contains("π3 name no atoms") && why.contains("@"),
        "{why}"
    );
    // A set that is not closed under the group says so.
    let mut set = offer(&s, "Co–Cl stretches");
    set.members.truncate(3);
    let r = set_salcs::set_salcs(&set, a.geometry.as_ref(), true).unwrap();
    let why = r.as_ref().as_ref().unwrap_err();
    assert!(why.contains("not closed"), "{why}");
}

#[test]
fn typed_member_atoms_are_checked_against_the_geometry() {
    let s = complex("Oh", "Co", "Cl", 6, 2.3);
    let a = analysed(&s, None);
    let sv = atom_sets::usable(a.geometry.as_ref()).unwrap();
    let check = |k, t: &str| {
        atom_sets::parse_atoms(t).and_then(|v| atom_sets::check_member_atoms(sv, k, &v))
    };
    assert!(check(SetKind::Stretch, "1-2").is_ok());
    assert!(check(SetKind::Bend, "2-1-3").is_ok());
    assert!(check(SetKind::Stretch, "1-9")
        .unwrap_err()
        .contains("atom 9 does not exist"));
    assert!(check(SetKind::Stretch, "2-3")
        .unwrap_err()
        .contains("not bonded"));
    assert!(check(SetKind::Bend, "1-2")
        .unwrap_err()
        .contains("three atoms"));
    assert!(check(SetKind::Stretch, "1-1")
        .unwrap_err()
        .contains("twice"));
    assert!(check(SetKind::Stretch, "1-x")
        .unwrap_err()
        .contains("not an atom number"));
    assert_eq!(atom_sets::member_legend(sv, &[2, 1, 3]), "Cl2–Co1–Cl3");
}
