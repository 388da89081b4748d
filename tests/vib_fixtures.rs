//! Normal modes of HF/STO-3G Hessians made with PySCF (tests/fixtures/vib/make_hessians.py;
//! versions in each file's `extras.versions`) against PySCF's own harmonic analysis with the
//! same masses, and the species of every fundamental against the textbooks.

use nalgebra::{DMatrix, Matrix3, Rotation3, Vector3};
use rand::{rngs::StdRng, seq::SliceRandom, Rng, SeedableRng};
use salcdesk::vib::{self, HessianInput, NormalModes, Options, Solver};
use serde_json::Value;
use std::collections::BTreeMap;
use std::path::PathBuf;

fn path(name: &str) -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR")).join(format!("tests/fixtures/vib/{name}.json"))
}

fn fixture(name: &str) -> (HessianInput, Value) {
    let p = path(name);
    let input = vib::load(&p, None, None).unwrap();
    let v: Value = serde_json::from_str(&std::fs::read_to_string(&p).unwrap()).unwrap();
    (input, v["extras"].clone())
}

fn members(nm: &vib::Modes) -> Vec<f64> {
    let mut w: Vec<f64> = nm.sets.iter().flat_map(|s| s.members.clone()).collect();
    w.sort_by(f64::total_cmp);
    w
}

fn numbers(v: &Value) -> Vec<f64> {
    let mut w: Vec<f64> = v
        .as_array()
        .unwrap()
        .iter()
        .map(|x| x.as_f64().unwrap())
        .collect();
    w.sort_by(f64::total_cmp);
    w
}

fn species(nm: &vib::Modes) -> BTreeMap<String, usize> {
    let mut m = BTreeMap::new();
    for s in &nm.sets {
        *m.entry(s.irrep.clone()).or_insert(0) += 1;
    }
    m
}

fn expect(list: &[(&str, usize)]) -> BTreeMap<String, usize> {
    list.iter().map(|(l, n)| (l.to_string(), *n)).collect()
}

/// Textbook species of the fundamentals (one entry per degenerate set).
fn textbook() -> Vec<(&'static str, &'static str, BTreeMap<String, usize>)> {
    vec![
        // Source: Herzberg, Infrared and Raman Spectra (1945), Table 55 (H2O: 2A1 + B2 with
        // the molecule in the yz plane, the table's C2v convention).
        ("water", "C2v", expect(&[("A1", 2), ("B2", 1)])),
        // Source: Herzberg (1945), ch. II (pyramidal XY3: 2A1 + 2E); Nakamoto, Part A, §2.6.
        ("ammonia", "C3v", expect(&[("A1", 2), ("E", 2)])),
        // Source: Herzberg (1945), ch. II (tetrahedral XY4: A1 + E + 2F2); Nakamoto, Part A, §2.8.
        ("methane", "Td", expect(&[("A1", 1), ("E", 1), ("T2", 2)])),
        // Source: Herzberg (1945), ch. II (C2H4); the species as in Shimanouchi's tables
        // (3ag + au + 2b1g + b1u + b2g + 2b2u + 2b3u, z ⊥ plane, x along C=C, from memory),
        // turned to the table's Mulliken axes (x ⊥ plane, z along C=C: B1 ↔ B3).
        (
            "ethylene",
            "D2h",
            expect(&[
                ("Ag", 3),
                ("Au", 1),
                ("B3g", 2),
                ("B3u", 1),
                ("B2g", 1),
                ("B2u", 2),
                ("B1u", 2),
            ]),
        ),
        // Source: Herzberg (1945), ch. II (planar XY3: A1′ + A2″ + 2E′); Nakamoto, Part A, §2.5.
        ("bf3", "D3h", expect(&[("A'1", 1), ("A''2", 1), ("E'", 2)])),
        // Source: Herzberg (1945), ch. II (linear symmetric XY2: Σg+ + Πu + Σu+).
        (
            "co2",
            "Dinfh",
            expect(&[("Sigma+g", 1), ("Piu", 1), ("Sigma+u", 1)]),
        ),
        // Source: Herzberg (1945), ch. II, benzene: 2A1g + A2g + 2B2g + E1g + 4E2g + A2u +
        // 2B1u + 2B2u + 3E1u + 2E2u (20 sets, 30 modes).
        (
            "benzene",
            "D6h",
            expect(&[
                ("A1g", 2),
                ("A2g", 1),
                ("B2g", 2),
                ("E1g", 1),
                ("E2g", 4),
                ("A2u", 1),
                ("B1u", 2),
                ("B2u", 2),
                ("E1u", 3),
                ("E2u", 2),
            ]),
        ),
        // Source: Nakamoto, Part A, §2.10 (octahedral XY6: A1g + Eg + 2F1u + F2g + F2u).
        (
            "sf6",
            "Oh",
            expect(&[("A1g", 1), ("Eg", 1), ("T1u", 2), ("T2g", 1), ("T2u", 1)]),
        ),
    ]
}

fn table_label(g: &str, l: &str) -> String {
    // the tables write A1′ as "A'1"; compare through the table's own label list
    let pg = salcdesk::group::load(g).unwrap();
    pg.table
        .irreps
        .iter()
        .map(|i| i.label.clone())
        .find(|x| {
            x.replace(['\''], "") == l.replace(['\''], "")
                && x.matches('\'').count() == l.matches('\'').count()
        })
        .unwrap_or_else(|| l.to_string())
}

#[test]
fn wavenumbers_match_pyscf_and_species_match_the_textbooks() {
    for (name, group, species_expected) in textbook() {
        let (input, extras) = fixture(name);
        let pyscf = numbers(&extras["harmonic"]["wavenumbers_cm"]);
        for solver in [Solver::Auto, Solver::Dense, Solver::Blocked] {
            let nm = vib::normal_modes(
                &input,
                &Options {
                    solver,
                    ..Options::default()
                },
            )
            .unwrap();
            let p = &nm.parent;
            assert_eq!(p.point_group, group, "{name}");
            // same masses as PySCF was given
            let masses = numbers(&extras["harmonic"]["masses"]);
            let mut ours = p.masses.clone();
            ours.sort_by(f64::total_cmp);
            for (a, b) in ours.iter().zip(&masses) {
                assert!((a - b).abs() < 1e-9, "{name}: mass {a} vs {b}");
            }
            let w = members(p);
            assert_eq!(w.len(), pyscf.len(), "{name}");
            for (a, b) in w.iter().zip(&pyscf) {
                // Source: PySCF 2.14 pyscf.hessian.thermo.harmonic_analysis (stored in the fixture)
                assert!((a - b).abs() < 0.01, "{name} {solver:?}: {a} vs PySCF {b}");
            }
            let want: BTreeMap<String, usize> = species_expected
                .iter()
                .map(|(l, n)| (table_label(group, l), *n))
                .collect();
            assert_eq!(species(p), want, "{name} {solver:?}");
            for s in &p.sets {
                assert!(s.purity > 0.99 && s.flag.is_none(), "{name}: {s:?}");
                assert!(
                    s.members.iter().all(|m| (m - s.wavenumber).abs() < 0.01),
                    "{name}: {s:?}"
                );
            }
            // ν numbers are a permutation of 1..=sets
            let mut nus: Vec<usize> = p.sets.iter().map(|s| s.nu).collect();
            nus.sort();
            assert_eq!(nus, (1..=p.sets.len()).collect::<Vec<_>>());
        }
    }
}

#[test]
fn isotopologues_match_pyscf_and_obey_the_product_rule() {
    for name in [
        "water", "ammonia", "methane", "ethylene", "bf3", "co2", "benzene",
    ] {
        let (input, extras) = fixture(name);
        for iso in extras["isotopologues"].as_array().unwrap() {
            let spec = iso["isotopes"].as_str().unwrap();
            let nm: NormalModes = vib::normal_modes(
                &input,
                &Options {
                    isotopes: vec![vib::parse_isotope(spec).unwrap()],
                    ..Options::default()
                },
            )
            .unwrap();
            let i = nm.isotopologue.as_ref().unwrap();
            let pyscf = numbers(&iso["wavenumbers_cm"]);
            let w = members(&i.modes);
            assert_eq!(w.len(), pyscf.len());
            for (a, b) in w.iter().zip(&pyscf) {
                // Source: PySCF harmonic_analysis with the isotopologue's masses
                assert!((a - b).abs() < 0.01, "{name} {spec}: {a} vs PySCF {b}");
            }
            // Teller–Redlich product rule per species (Redlich 1935; Wilson, Decius & Cross)
            assert!(!i.product_rule.is_empty(), "{name} {spec}");
            let covered: usize = i.product_rule.iter().map(|p| p.sets).sum();
            assert!(covered > 0);
            for p in &i.product_rule {
                assert!(p.deviation.abs() < 1e-6, "{name} {spec}: {p:?}");
            }
            // a symmetry-breaking substitution lowers the group and correlates every set
            if spec.starts_with(|c: char| c.is_ascii_digit()) {
                assert!(i.lowered, "{name} {spec}: {}", i.modes.point_group);
                assert_eq!(i.correlation.len(), nm.parent.sets.len());
                for (c, s) in i.correlation.iter().zip(&nm.parent.sets) {
                    let dims: u64 = c
                        .becomes
                        .iter()
                        .map(|(l, n)| {
                            n * i
                                .modes
                                .sets
                                .iter()
                                .find(|x| &x.irrep == l)
                                .map_or(1, |x| x.dimension) as u64
                        })
                        .sum();
                    assert_eq!(dims, s.dimension as u64, "{name} {spec}: {c:?}");
                }
            }
        }
    }
}

/// Rotate and renumber: positions R·p[π(a)], Hessian blocks R H Rᵀ in the new order.
fn moved(
    input: &HessianInput,
    r: &Matrix3<f64>,
    order: &[usize],
    shift: Vector3<f64>,
) -> HessianInput {
    let n = order.len();
    let mut h = DMatrix::zeros(3 * n, 3 * n);
    for (a, &oa) in order.iter().enumerate() {
        for (b, &ob) in order.iter().enumerate() {
            let blk = r * input.hessian.fixed_view::<3, 3>(3 * oa, 3 * ob) * r.transpose();
            h.fixed_view_mut::<3, 3>(3 * a, 3 * b).copy_from(&blk);
        }
    }
    HessianInput {
        title: input.title.clone(),
        elements: order.iter().map(|&a| input.elements[a]).collect(),
        positions: order
            .iter()
            .map(|&a| r * input.positions[a] + shift)
            .collect(),
        hessian: h,
        asymmetry: 0.0,
        source: input.source.clone(),
    }
}

#[test]
fn rotating_and_renumbering_changes_no_label_or_wavenumber() {
    // Property: the harmonic problem is invariant under rigid motions and atom renumbering.
    let mut rng = StdRng::seed_from_u64(16);
    for (name, _, _) in textbook() {
        let (input, _) = fixture(name);
        let base = vib::normal_modes(&input, &Options::default()).unwrap();
        for _ in 0..3 {
            let axis = Vector3::new(
                rng.gen::<f64>() - 0.5,
                rng.gen::<f64>() - 0.5,
                rng.gen::<f64>() - 0.5,
            );
            let r = *Rotation3::new(axis.normalize() * rng.gen_range(0.1..3.1)).matrix();
            let mut order: Vec<usize> = (0..input.n_atoms()).collect();
            order.shuffle(&mut rng);
            let shift = Vector3::new(rng.gen_range(-5.0..5.0), rng.gen_range(-5.0..5.0), 1.0);
            let nm =
                vib::normal_modes(&moved(&input, &r, &order, shift), &Options::default()).unwrap();
            assert_eq!(nm.parent.point_group, base.parent.point_group, "{name}");
            assert_eq!(nm.parent.sets.len(), base.parent.sets.len(), "{name}");
            for (a, b) in nm.parent.sets.iter().zip(&base.parent.sets) {
                assert_eq!(
                    (&a.irrep, a.dimension, a.nu),
                    (&b.irrep, b.dimension, b.nu),
                    "{name}"
                );
                assert!(
                    (a.wavenumber - b.wavenumber).abs() < 1e-3,
                    "{name}: {a:?} {b:?}"
                );
            }
        }
    }
}
