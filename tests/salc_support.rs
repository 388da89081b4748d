//! Shared helpers for the salc_* and basis_* tests: molecules built as orbits of points in a
//! group's standard orientation, and the laws every SALC set must obey. No tests of its own.
#![allow(dead_code)]

use nalgebra::Vector3;
use salcdesk::basis::{Basis, Placed, Structure};
use salcdesk::exact::Cyclo;
use salcdesk::salc::{RealIrrep, SalcSet};

/// Atoms: each item generates its whole orbit under the group, in order.
pub fn orbit_molecule(group: &str, items: &[(&str, [f64; 3])]) -> Structure {
    let g = salcdesk::group::load(group).unwrap();
    let mut atoms: Vec<Placed> = Vec::new();
    for (sym, p) in items {
        let p = Vector3::new(p[0], p[1], p[2]);
        for op in &g.ops {
            let q = op.float * p;
            if atoms.iter().all(|a| (a.position - q).norm() > 1e-6) {
                atoms.push(Placed {
                    symbol: sym.to_string(),
                    position: q,
                });
            }
        }
    }
    let bonds = (1..atoms.len()).filter(|_| false).map(|a| (0, a)).collect();
    Structure::new(g, atoms, bonds, 1e-4).unwrap()
}

/// Atoms given explicitly (already symmetric), bonds from atom 1 to all others when `centre`.
pub fn explicit(group: &str, atoms: &[(&str, [f64; 3])], bonds: &[(usize, usize)]) -> Structure {
    let g = salcdesk::group::load(group).unwrap();
    let atoms = atoms
        .iter()
        .map(|(s, p)| Placed {
            symbol: s.to_string(),
            position: Vector3::new(p[0], p[1], p[2]),
        })
        .collect();
    Structure::new(g, atoms, bonds.to_vec(), 1e-4).unwrap()
}

/// Bonds from a centre to every ligand, and bonds by distance below `cut` Å.
pub fn with_bonds(mut s: Structure, cut: f64) -> Structure {
    let mut bonds = Vec::new();
    for i in 0..s.len() {
        for j in i + 1..s.len() {
            if (s.atoms[i].position - s.atoms[j].position).norm() < cut {
                bonds.push((i, j));
            }
        }
    }
    let g = s.group.clone();
    s = Structure::new(g, s.atoms, bonds, 1e-4).unwrap();
    s
}

fn dot(a: &[Cyclo], b: &[Cyclo]) -> Cyclo {
    a.iter().zip(b).map(|(x, y)| x * y).sum()
}

/// Σ_R χ(R) R v (the character projector without d/h).
pub fn char_project(b: &Basis, ir: &RealIrrep, v: &[Cyclo]) -> Vec<Cyclo> {
    let mut out = vec![Cyclo::zero(); v.len()];
    for o in 0..b.group.order() {
        let chi = ir.chi(o);
        if chi.is_zero() {
            continue;
        }
        for (k, x) in b.apply(o, v).iter().enumerate() {
            out[k] += &(x * &chi);
        }
    }
    out
}

/// The laws: counts, orthonormality, exact transformation of every partner tuple by the
/// irrep's matrices, idempotent projectors summing to the identity.
pub fn check_laws(b: &Basis, set: &SalcSet) {
    let h = Cyclo::from_int(b.group.order() as i64);
    // counts: n·d per irrep, all together the basis dimension
    for (x, ir) in set.irreps.iter().enumerate() {
        let c = set.salcs.iter().filter(|s| s.irrep == x).count();
        assert_eq!(
            c as u64,
            set.multiplicities[x] * ir.dim as u64,
            "count of {}",
            ir.label
        );
    }
    assert_eq!(set.salcs.len(), b.dim());
    // orthonormality (exact): distinct SALCs orthogonal, stored norm² right
    for (i, s) in set.salcs.iter().enumerate() {
        assert_eq!(dot(&s.coefficients, &s.coefficients), s.norm2);
        for t in &set.salcs[i + 1..] {
            assert!(
                dot(&s.coefficients, &t.coefficients).is_zero(),
                "{} ⟂ {}",
                s.label,
                t.label
            );
        }
    }
    // transformation: ⟨ŝᵢ, R ŝⱼ⟩ = D(R)ᵢⱼ, checked squared with signs (no square roots needed)
    for (x, ir) in set.irreps.iter().enumerate() {
        assert!(ir.orthogonal(), "{} matrices orthogonal", ir.label);
        for copy in 1..=set.multiplicities[x] as usize {
            let tuple: Vec<_> = set
                .salcs
                .iter()
                .filter(|s| s.irrep == x && s.copy == copy)
                .collect();
            for o in 0..b.group.order() {
                for (j, sj) in tuple.iter().enumerate() {
                    let img = b.apply(o, &sj.coefficients);
                    for (i, si) in tuple.iter().enumerate() {
                        let g = dot(&si.coefficients, &img);
                        let a = &ir.mats[o][i][j];
                        assert_eq!(
                            &g * &g,
                            &(&(a * a) * &si.norm2) * &sj.norm2,
                            "{} op {o}",
                            ir.label
                        );
                        assert_eq!(g.signum_real(), a.signum_real(), "{} op {o} sign", ir.label);
                    }
                }
            }
        }
    }
    // projectors: idempotent, and Σ_Γ P^Γ = 1, on a lopsided test vector
    let v: Vec<Cyclo> = (0..b.dim())
        .map(|k| Cyclo::from_int((k * k % 7) as i64 + 1))
        .collect();
    let mut total = vec![Cyclo::zero(); b.dim()];
    for ir in set.irreps.iter() {
        let f = &Cyclo::from_int(ir.dim as i64) / &h;
        // a complex pair combined: P = (1/h)Σ(χ₁+χ₂) with d = 1 each
        let f = if ir.pair.is_some() {
            &f / &Cyclo::from_int(2)
        } else {
            f
        };
        let p1: Vec<Cyclo> = char_project(b, ir, &v).iter().map(|c| c * &f).collect();
        let p2: Vec<Cyclo> = char_project(b, ir, &p1).iter().map(|c| c * &f).collect();
        assert_eq!(p1, p2, "P^{} idempotent", ir.label);
        for (t, c) in total.iter_mut().zip(&p1) {
            *t += c;
        }
    }
    assert_eq!(total, v, "Σ P^Γ = 1");
}

/// C60 from its two bond lengths: 1.45 Å in the pentagons, 1.40 Å between them.
// from memory: C60 bond lengths 1.45 Å (5:6) and 1.40 Å (6:6), e.g. neutron/electron diffraction.
pub fn c60() -> Structure {
    let g = salcdesk::group::load("Ih").unwrap();
    let phi = (1.0 + 5f64.sqrt()) / 2.0;
    let a1 = nalgebra::Vector3::new(0.0, 1.0, phi).normalize(); // a C5 axis of the table's setting
    let a2 = nalgebra::Vector3::new(0.0, -1.0, phi).normalize(); // a neighbouring C5 axis
    let r5 = 1.45 / (2.0 * (std::f64::consts::PI / 5.0).sin());
    // pentagon atom on a1's pentagon pointing toward a2, at height h along a1
    let u = (a2 - a1 * a2.dot(&a1)).normalize();
    let atom = |h: f64| a1 * h + u * r5;
    let mirror = |p: nalgebra::Vector3<f64>| {
        let n = (a2 - a1).normalize();
        p - n * 2.0 * p.dot(&n)
    };
    let (mut lo, mut hi) = (1.0, 10.0);
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if (atom(mid) - mirror(atom(mid))).norm() > 1.40 {
            hi = mid;
        } else {
            lo = mid;
        }
    }
    let p = atom(0.5 * (lo + hi));
    let mut pts: Vec<Vector3<f64>> = Vec::new();
    for op in &g.ops {
        let q = op.float * p;
        if pts.iter().all(|x| (x - q).norm() > 1e-6) {
            pts.push(q);
        }
    }
    let mut bonds = Vec::new();
    for i in 0..pts.len() {
        for j in i + 1..pts.len() {
            if (pts[i] - pts[j]).norm() < 1.5 {
                bonds.push((i, j));
            }
        }
    }
    let atoms = pts
        .into_iter()
        .map(|position| Placed {
            symbol: "C".into(),
            position,
        })
        .collect();
    Structure::new(g, atoms, bonds, 1e-3).unwrap()
}

/// A centre at the origin and one orbit of ligands on the given site type, or why the builder
/// refused it (shared by tests/salc_every_site.rs and benches/salc_sites.rs).
pub fn centre_and_site(
    g: &std::sync::Arc<salcdesk::group::PointGroup>,
    site: &str,
) -> Result<Structure, String> {
    let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
    // angles away from every axis and plane of the group (the builder refuses atoms that fall
    // together, e.g. 37° lies 1° from a C2 axis of D5h)
    let atoms = [(37.0, 13.0), (8.3, 71.0), (53.0, 4.9)]
        .iter()
        .find_map(|(t, p)| {
            salcdesk::geom::build_from_sites(&ops, &format!("Co@origin H@{site}:2.0,{t},{p}")).ok()
        })
        .ok_or_else(|| "no placement".to_string())?;
    let atoms: Vec<Placed> = atoms
        .into_iter()
        .map(|a| Placed {
            symbol: a.symbol().to_string(),
            position: a.position,
        })
        .collect();
    let bonds = (1..atoms.len()).map(|a| (0, a)).collect();
    Structure::new(g.clone(), atoms, bonds, 1e-4).map_err(|e| e.to_string())
}

/// Calls `f(group, site, structure)` for a centre and one orbit of H on every site type (but
/// the origin) of every finite group; returns how many cases there were.
pub fn for_every_site_case(mut f: impl FnMut(&str, &str, &Structure)) -> usize {
    let mut cases = 0;
    for name in salcdesk::group::names() {
        let g = salcdesk::group::load(name).unwrap();
        if g.is_linear() {
            continue;
        }
        let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
        let types = salcdesk::geom::site_types(&ops).unwrap();
        for site in salcdesk::geom::site_names(&types) {
            if site == "origin" {
                continue;
            }
            let s = centre_and_site(&g, &site).unwrap_or_else(|e| panic!("{name} {site}: {e}"));
            f(name, &site, &s);
            cases += 1;
        }
    }
    cases
}
