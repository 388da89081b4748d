//! Descent from C∞v and D∞h to every finite table group, checked against references computed
//! here from explicit 3×3 matrices: each operation of the subgroup, turned so that a chosen
//! axis of it lies along the molecular axis z, is classified by what it does to z, and the
//! character of a species (Λ, ±, g/u) is evaluated as a function of the matrix:
//! rotation by φ about z → 2cos Λφ (Σ: 1); reflection containing z → 0 (Σ±: ±1);
//! a proper operation reversing z (C2 across the axis) → 0 (Σ: p·(±1)); −1 → p·dim;
//! an improper operation reversing z is i·C(ψ) with C(ψ) = −M → p·2cos Λψ (Σ: p), where p = ±1
//! for g/u (Herzberg, *Infrared and Raman Spectra* (1945), ch. II, character tables of C∞v
//! and D∞h). Multiplicities follow from the reduction formula written out here in floating
//! point (Cotton, 3rd ed., eq. 4.3-11).

use nalgebra::{Matrix3, Vector3};
use salcdesk::group::{load, names, PointGroup};
use salcdesk::spectra::{
    descend, descend_names, linear_product, real_irreps, to_real, ProductKind,
};

#[derive(Clone, Copy, Debug, PartialEq)]
struct Sp {
    lambda: u32,
    minus: bool,
    parity: Option<bool>,
}

fn species(label: &str) -> Sp {
    let (base, parity) = match label.chars().last() {
        Some('g') => (&label[..label.len() - 1], Some(true)),
        Some('u') => (&label[..label.len() - 1], Some(false)),
        _ => (label, None),
    };
    let (lambda, minus) = match base {
        "Sigma+" => (0, false),
        "Sigma-" => (0, true),
        "Pi" => (1, false),
        "Delta" => (2, false),
        "Phi" => (3, false),
        "Gamma" => (4, false),
        l if l.starts_with("Lambda") => (l[6..].parse().unwrap(), false),
        _ => panic!("unexpected species {label}"),
    };
    Sp {
        lambda,
        minus,
        parity,
    }
}

/// The species' character at an operation standing with the molecular axis along z.
fn chi(s: Sp, m: &Matrix3<f64>) -> f64 {
    let p = if s.parity == Some(false) { -1.0 } else { 1.0 };
    let sv = if s.minus { -1.0 } else { 1.0 };
    let dim = if s.lambda == 0 { 1.0 } else { 2.0 };
    let l = s.lambda as f64;
    let det = m.determinant();
    let zz = m[(2, 2)];
    if (m + Matrix3::identity()).abs().max() < 1e-9 {
        return p * dim;
    }
    match (det > 0.0, zz > 0.0) {
        (true, true) => {
            let phi = m[(1, 0)].atan2(m[(0, 0)]);
            if s.lambda == 0 {
                1.0
            } else {
                2.0 * (l * phi).cos()
            }
        }
        (false, true) => {
            if s.lambda == 0 {
                sv
            } else {
                0.0
            }
        }
        (true, false) => {
            if s.lambda == 0 {
                p * sv
            } else {
                0.0
            }
        }
        (false, false) => {
            let c = -m;
            let psi = c[(1, 0)].atan2(c[(0, 0)]);
            if s.lambda == 0 {
                p
            } else {
                p * 2.0 * (l * psi).cos()
            }
        }
    }
}

/// A rotation taking H's axis `k` (0 x, 1 y, 2 z) to z: a quarter turn about another axis.
fn to_z(k: usize) -> Matrix3<f64> {
    match k {
        // a quarter turn about y: x → z
        0 => Matrix3::new(0.0, 0.0, -1.0, 0.0, 1.0, 0.0, 1.0, 0.0, 0.0),
        // quarter turn about x: y → z
        1 => Matrix3::new(1.0, 0.0, 0.0, 0.0, 0.0, -1.0, 0.0, 1.0, 0.0),
        _ => Matrix3::identity(),
    }
}

fn placed(h: &PointGroup, k: usize, polar: bool) -> Option<Vec<Matrix3<f64>>> {
    let q = to_z(k);
    assert!((q * Vector3::ith(k, 1.0) - Vector3::z()).norm() < 1e-12);
    let ms: Vec<Matrix3<f64>> = h.ops.iter().map(|o| q * o.float * q.transpose()).collect();
    ms.iter()
        .all(|m| {
            let mz = m * Vector3::z();
            (mz - Vector3::z()).norm() < 1e-9 || (!polar && (mz + Vector3::z()).norm() < 1e-9)
        })
        .then_some(ms)
}

/// Multiplicities per table row of H of the species restricted to the placed operations.
fn restrict(h: &PointGroup, ms: &[Matrix3<f64>], s: Sp) -> Vec<u64> {
    let order = h.ops.len() as f64;
    h.table
        .irreps
        .iter()
        .map(|ir| {
            let (mut re, mut im) = (0.0, 0.0);
            for (o, m) in h.ops.iter().zip(ms) {
                let (a, b) = ir.chars[o.class].to_c64();
                let x = chi(s, m);
                re += x * a;
                im -= x * b;
            }
            let n = re / order;
            assert!(
                (n - n.round()).abs() < 1e-6 && (im / order).abs() < 1e-6,
                "{}: {n}",
                h.name()
            );
            n.round() as u64
        })
        .collect()
}

/// Invariant of a placement under rotations about z: sorted (kind, |cos|) of its operations.
fn invariant(ms: &[Matrix3<f64>]) -> Vec<(i32, i64)> {
    let mut v: Vec<(i32, i64)> = ms
        .iter()
        .map(|m| {
            let kind = (m.determinant() > 0.0) as i32 * 2 + (m[(2, 2)] > 0.0) as i32;
            (kind, (m.trace() * 1e6).round() as i64)
        })
        .collect();
    v.sort();
    v
}

fn rows_of(h: &PointGroup, terms: &[salcdesk::spectra::SymTerm]) -> Vec<u64> {
    let mut rows = vec![0u64; h.table.irreps.len()];
    for t in terms {
        for r in salcdesk::rep::label_rows(h, &t.irrep).unwrap() {
            rows[r] += t.multiplicity;
        }
    }
    rows
}

#[test]
fn every_finite_subgroup_of_the_linear_groups() {
    let mut reached = 0;
    for lin in ["Cinfv", "Dinfh"] {
        let g = load(lin).unwrap();
        let polar = lin == "Cinfv";
        for name in names() {
            let h = load(name).unwrap();
            if h.is_linear() {
                continue;
            }
            let valid: Vec<(usize, Vec<Matrix3<f64>>)> = (0..3)
                .filter_map(|k| placed(&h, k, polar).map(|m| (k, m)))
                .collect();
            let r = descend(&g, &h, None, None);
            if valid.is_empty() {
                assert!(r.is_err(), "{lin} → {name} should be refused");
                continue;
            }
            let r = r.unwrap_or_else(|e| panic!("{lin} → {name}: {e}"));
            reached += 1;
            // Each embedding: its correlation equals the reference for its molecular axis.
            for e in &r.embeddings {
                let axis = match e.molecular_axis.as_deref() {
                    Some("x") => 0,
                    Some("y") => 1,
                    Some("z") => 2,
                    a => panic!("{lin} → {name}: axis {a:?}"),
                };
                let ms = &valid
                    .iter()
                    .find(|(k, _)| *k == axis)
                    .unwrap_or_else(|| panic!("{lin} → {name}: axis {axis} is not valid"))
                    .1;
                assert!(e
                    .description
                    .as_deref()
                    .is_some_and(|d| d.contains("molecular axis")));
                for row in &e.correlation {
                    let want = restrict(&h, ms, species(&row.irrep));
                    assert_eq!(
                        rows_of(&h, &row.becomes.terms),
                        want,
                        "{lin} → {name} (axis {axis}): {}",
                        row.irrep
                    );
                }
                // Σ±, Π, Δ, Φ and Γ are all correlated.
                let labels: Vec<&str> = e.correlation.iter().map(|c| c.irrep.as_str()).collect();
                assert!(labels.iter().any(|l| l.starts_with("Gamma")), "{labels:?}");
                assert_eq!(
                    e.correlation.len(),
                    real_irreps(&g).len() + 1 + !polar as usize
                );
            }
            // Every valid placement is one of the embeddings (same operations up to a
            // rotation about z), and no two embeddings are the same.
            let code_inv: Vec<Vec<(i32, i64)>> = r
                .embeddings
                .iter()
                .map(|e| {
                    let k = ["x", "y", "z"]
                        .iter()
                        .position(|a| Some(*a) == e.molecular_axis.as_deref())
                        .unwrap();
                    invariant(&valid.iter().find(|(j, _)| *j == k).unwrap().1)
                })
                .collect();
            for (k, ms) in &valid {
                assert!(
                    code_inv.contains(&invariant(ms)),
                    "{lin} → {name}: placement along axis {k} missing"
                );
            }
            let mut dedup = code_inv.clone();
            dedup.sort();
            dedup.dedup();
            assert_eq!(dedup.len(), code_inv.len(), "{lin} → {name}");
        }
    }
    // C∞v: C1, Cs, C2, C2v, Cn, Cnv (n = 3…8) = 16; D∞h: 50 of the finite tables minus the
    // cubic and icosahedral ones.
    assert!(reached >= 16 + 40, "{reached}");
}

fn term(r: &salcdesk::spectra::DescentReport, e: usize, irrep: &str) -> String {
    r.embeddings[e]
        .correlation
        .iter()
        .find(|c| c.irrep == irrep)
        .unwrap()
        .becomes
        .text
        .clone()
}

#[test]
fn bent_and_trans_bent_correlations() {
    // Source: Herzberg, Infrared and Raman Spectra (1945), ch. II (from memory): a linear
    // symmetric XY2 bent with the C2 across the axis (molecule in the yz plane, axis along y):
    // Σg+ → A1, Σu+ → B2, Πu → A1 + B1, Πg → A2 + B2; trans-bent X2Y2 (C2h): Σg+ → Ag,
    // Σu+ → Bu, Πu → Au + Bu, Πg → Ag + Bg; bent HCN (Cs): Σ+ → A', Π → A' + A''.
    let r = descend_names("Dinfh", "C2v", None, None).unwrap();
    let across = r
        .embeddings
        .iter()
        .position(|e| e.molecular_axis.as_deref() == Some("y"))
        .expect("C2 across the axis");
    assert!(r.embeddings[across]
        .description
        .as_deref()
        .unwrap()
        .contains("across"));
    for (a, b) in [
        ("Sigma+g", "A1"),
        ("Sigma+u", "B2"),
        ("Piu", "A1 + B1"),
        ("Pig", "A2 + B2"),
    ] {
        assert_eq!(term(&r, across, a), b, "{a}");
    }
    let r = descend_names("Dinfh", "C2h", None, None).unwrap();
    let trans = r
        .embeddings
        .iter()
        .position(|e| e.description.as_deref().unwrap().contains("across"))
        .unwrap();
    for (a, b) in [
        ("Sigma+g", "Ag"),
        ("Sigma+u", "Bu"),
        ("Piu", "Au + Bu"),
        ("Pig", "Ag + Bg"),
    ] {
        assert_eq!(term(&r, trans, a), b, "{a}");
    }
    let r = descend_names("Cinfv", "Cs", None, None).unwrap();
    assert_eq!(r.embeddings.len(), 1);
    assert_eq!(term(&r, 0, "Sigma+"), "A'");
    assert_eq!(term(&r, 0, "Pi"), "A' + A''");
    // Principal axis along the molecular axis: Π → E, Δ → B1 + B2 in C4v (2cos 2φ at
    // φ = 90° is −2, at 180° is 2: B1 + B2).
    let r = descend_names("Cinfv", "C4v", None, None).unwrap();
    assert_eq!(term(&r, 0, "Pi"), "E");
    assert_eq!(term(&r, 0, "Delta"), "B1 + B2");
}

/// The test's character of a list of species at a matrix.
fn chi_sum(list: &[(Sp, u64)], m: &Matrix3<f64>) -> f64 {
    list.iter().map(|(s, n)| *n as f64 * chi(*s, m)).sum()
}

fn rot(axis: Vector3<f64>, angle: f64) -> Matrix3<f64> {
    *nalgebra::Rotation3::from_axis_angle(&nalgebra::Unit::new_normalize(axis), angle).matrix()
}

#[test]
fn products_of_linear_species_match_explicit_characters() {
    // χ_{a⊗b} = χa·χb at every operation, and [Γ²], {Γ²} = (χ(R)² ± χ(R²))/2 (Wilson,
    // Decius & Cross §7-3), at sample operations of each kind, for every pair of table
    // species of both linear groups. Herzberg (1945), ch. II (from memory): Σ+ × Π = Π,
    // Π × Π = Σ+ + Σ− + Δ, Δ × Δ = Σ+ + Σ− + Γ.
    let sigma_v = Matrix3::new(1.0, 0.0, 0.0, 0.0, -1.0, 0.0, 0.0, 0.0, 1.0);
    let c2x = rot(Vector3::x(), std::f64::consts::PI);
    let sample = [
        rot(Vector3::z(), 0.37),
        rot(Vector3::z(), 2.1),
        sigma_v,
        -Matrix3::identity(),
        -rot(Vector3::z(), 0.81),
        c2x,
        Matrix3::identity(),
    ];
    for lin in ["Cinfv", "Dinfh"] {
        let g = load(lin).unwrap();
        let reals = real_irreps(&g);
        let n = reals.len();
        let ops: Vec<&Matrix3<f64>> = sample
            .iter()
            .filter(|m| lin == "Dinfh" || m[(2, 2)] > 0.0)
            .collect();
        let result_list = |s: &salcdesk::spectra::Symmetry| -> Vec<(Sp, u64)> {
            s.terms
                .iter()
                .map(|t| (species(&t.irrep), t.multiplicity))
                .collect()
        };
        for a in 0..n {
            let mut ma = vec![0u64; n];
            ma[a] = 1;
            let sa = species(&reals[a].label);
            for b in 0..n {
                let mut mb = vec![0u64; n];
                mb[b] = 1;
                let sb = species(&reals[b].label);
                let s = linear_product(&g, &ma, Some(&mb), ProductKind::Direct).unwrap();
                for m in &ops {
                    let want = chi(sa, m) * chi(sb, m);
                    let got = chi_sum(&result_list(&s), m);
                    assert!((want - got).abs() < 1e-9, "{lin}: {sa:?} x {sb:?}");
                }
            }
            for (kind, sign) in [
                (ProductKind::Symmetric, 1.0),
                (ProductKind::Antisymmetric, -1.0),
            ] {
                let s = linear_product(&g, &ma, None, kind).unwrap();
                for m in &ops {
                    let want = (chi(sa, m).powi(2) + sign * chi(sa, &(*m * *m))) / 2.0;
                    let got = chi_sum(&result_list(&s), m);
                    assert!((want - got).abs() < 1e-9, "{lin}: {kind:?} {sa:?}");
                }
            }
            // A multiplicity 2 in the symmetric square: [(2Γ)²] = 2[Γ²] + Γ⊗Γ.
            let mut m2 = ma.clone();
            m2[a] = 2;
            let s = linear_product(&g, &m2, None, ProductKind::Symmetric).unwrap();
            for m in &ops {
                let x = 2.0 * chi(sa, m);
                let want = (x * x + 2.0 * chi(sa, &(*m * *m))) / 2.0;
                assert!((want - chi_sum(&result_list(&s), m)).abs() < 1e-9);
            }
        }
        let _ = to_real(&g, &vec![0; g.table.irreps.len()]).unwrap();
    }
}

#[test]
fn cli_product_in_the_linear_groups() {
    // Herzberg (1945), ch. II (from memory): Σ+ × Π = Π, Π × Π = Σ+ + Σ− + Δ,
    // Δ × Δ = Σ+ + Σ− + Γ, Πu × Πu = Σg+ + Σg− + Δg.
    for (g, a, b, want) in [
        ("Cinfv", "Sigma+", "Pi", "Pi"),
        ("Cinfv", "Pi", "Pi", "Sigma+ + Sigma- + Delta"),
        ("Cinfv", "Delta", "Delta", "Sigma+ + Sigma- + Gamma"),
        ("Cinfv", "Pi", "Delta", "Pi + Phi"),
        ("Dinfh", "Piu", "Piu", "Sigma+g + Sigma-g + Deltag"),
        ("Dinfh", "Σg⁺", "Πu", "Piu"),
    ] {
        let out = std::process::Command::new(env!("CARGO_BIN_EXE_salcdesk"))
            .args(["product", g, a, b, "--ascii"])
            .output()
            .unwrap();
        assert!(out.status.success(), "{g} {a} {b}");
        let text = String::from_utf8_lossy(&out.stdout);
        let line = text.lines().find(|l| l.starts_with("Gamma =")).unwrap();
        assert_eq!(line, format!("Gamma = {want}"), "{g} {a} x {b}");
    }
}
