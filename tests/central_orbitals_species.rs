//! Central-atom orbitals: named real orbitals up to g, their |m| about z, the irreps they are
//! matched to (checked with explicit operation matrices), linear molecules matched by species
//! along the axis, and the π frame stated for every ligand.

use nalgebra::{Matrix3, Vector3};
use salcdesk::basis::{self, Placed, Structure};
use salcdesk::group::{load, names, parse_tuple, PointGroup, Poly};

fn poly(text: &str) -> Poly {
    if text == "1" {
        return Poly::from([([0, 0, 0], salcdesk::exact::Cyclo::one())]);
    }
    parse_tuple(text).unwrap().parts.remove(0)
}

fn eval(p: &Poly, r: &Vector3<f64>) -> f64 {
    p.iter()
        .map(|(e, c)| {
            c.re_f64() * r.x.powi(e[0] as i32) * r.y.powi(e[1] as i32) * r.z.powi(e[2] as i32)
        })
        .sum()
}

fn points() -> Vec<Vector3<f64>> {
    vec![
        Vector3::new(0.31, -0.72, 0.55),
        Vector3::new(-1.1, 0.4, 0.23),
        Vector3::new(0.6, 0.9, -0.8),
        Vector3::new(0.05, 0.33, 1.2),
    ]
}

#[test]
fn every_named_orbital_has_its_m_about_z() {
    // A real orbital of definite |m| about z satisfies f(R(θ)r) + f(R(−θ)r) = 2cos(mθ)·f(r)
    // (the pair r^l·Y_lm ± Y_l,−m rotates by e^{±imθ}; Tinkham, §5-4): checked with explicit
    // rotation matrices for every named orbital s … g.
    let rz = |t: f64| {
        let (c, s) = (t.cos(), t.sin());
        Matrix3::new(c, -s, 0.0, s, c, 0.0, 0.0, 0.0, 1.0)
    };
    let mut total = 0;
    for l in 0..=4 {
        let list = basis::real_orbitals(l);
        assert_eq!(list.len(), 2 * l + 1, "shell l = {l}");
        for (name, text) in list {
            let m = basis::orbital_lambda(name).unwrap() as f64;
            let f = poly(text);
            for theta in [0.37, 1.3] {
                for r in points() {
                    let lhs = eval(&f, &(rz(theta) * r)) + eval(&f, &(rz(-theta) * r));
                    let rhs = 2.0 * (m * theta).cos() * eval(&f, &r);
                    assert!((lhs - rhs).abs() < 1e-9, "{name}: m = {m}");
                }
            }
            total += 1;
        }
    }
    assert_eq!(total, 25);
}

/// (1/h)·Σ_R d·χ*(R)·f(R⁻¹r) summed over the rows (one, or the two rows of a pair).
fn project(g: &PointGroup, rows: &[usize], f: &Poly, r: &Vector3<f64>) -> f64 {
    let h = g.ops.len() as f64;
    let mut acc = 0.0;
    for o in &g.ops {
        let rinv = o.float.transpose();
        let v = eval(f, &(rinv * r));
        for &row in rows {
            let ir = &g.table.irreps[row];
            let (re, _) = ir.chars[o.class].conj().to_c64();
            acc += ir.dim() as f64 * re * v / h;
        }
    }
    acc
}

#[test]
fn named_orbitals_lie_in_their_irreps_in_every_group() {
    // Projection operator with explicit matrices (Cotton, 3rd ed., §8.2): a named orbital of
    // irrep Γ is unchanged by P^Γ. For a complex pair the projector is the sum over both rows
    // (each of dimension 1). And px, py are named wherever p meets a pair (no "p (one set)").
    for name in names() {
        let g = load(name).unwrap();
        if g.is_linear() {
            continue;
        }
        for sh in basis::shells(&g, 4) {
            for (orb, row) in &sh.orbitals {
                let text = basis::real_orbitals(sh.l)
                    .into_iter()
                    .find(|(n, _)| n == orb)
                    .unwrap()
                    .1;
                let f = poly(text);
                let mut rows = vec![*row];
                rows.extend(g.table.irreps[*row].pair);
                for r in points() {
                    let p = project(&g, &rows, &f, &r);
                    assert!((p - eval(&f, &r)).abs() < 1e-8, "{name}: {orb}");
                }
            }
        }
        for (i, ir) in g.table.irreps.iter().enumerate() {
            let Some(p) = ir.pair else { continue };
            if p < i {
                continue;
            }
            let list = basis::central_orbitals(&g, 4, i, 2 * ir.dim(), None);
            assert!(!list
                .iter()
                .any(|x| x.contains("one set") && x.starts_with('p')));
            let p_shell = &basis::shells(&g, 1)[1];
            if p_shell.multiplicities[i] > 0 {
                assert!(
                    list.contains(&"px".to_string()) && list.contains(&"py".to_string()),
                    "{name} {}: {list:?}",
                    ir.label
                );
            }
        }
    }
}

fn run(args: &[&str]) -> String {
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_salcdesk"))
        .args(args)
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8_lossy(&out.stdout).into_owned()
}

#[test]
fn linear_molecules_match_by_species_along_the_axis() {
    // D∞h / C∞v (Herzberg 1945, character tables; the table's functions): s, pz, dz², fz³,
    // gz⁴ are σ; (px, py), (dxz, dyz), (fxz², fyz²) π; the others δ, φ, γ. Ligand σ
    // combinations are Σ, ligand π combinations Π: every orbital listed has that |m|, and every
    // orbital of that |m| in the same finite-subgroup irrep is listed.
    let dir = std::env::temp_dir().join(format!("salcdesk-linear-orb-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let molecules = [
        ("co2.xyz", "3\nCO2\nC 0 0 0\nO 0 0 1.16\nO 0 0 -1.16\n"),
        (
            "xef2.xyz",
            "3\nXeF2 along x\nXe 0 0 0\nF 2.0 0 0\nF -2.0 0 0\n",
        ),
    ];
    for (file, text) in molecules {
        let path = dir.join(file);
        std::fs::write(&path, text).unwrap();
        for (basis_kind, lambda) in [("sigma", 0u32), ("pi", 1)] {
            let out = run(&[
                "salc",
                path.to_str().unwrap(),
                "--basis",
                basis_kind,
                "--orbitals",
                "s,p,d,f,g",
                "--ascii",
            ]);
            let mut lines = 0;
            for line in out.lines().filter(|l| l.contains("(central atom:")) {
                let list = line.split("(central atom:").nth(1).unwrap();
                let list = list.trim().trim_end_matches(')');
                for orb in list.split(", ").filter(|s| !s.is_empty()) {
                    assert_eq!(
                        basis::orbital_lambda(orb),
                        Some(lambda),
                        "{file} {basis_kind}: {line}"
                    );
                }
                lines += 1;
            }
            assert!(lines >= 1, "{out}");
            let want: &[&str] = if lambda == 0 {
                &["s", "pz", "dz2", "fz3", "gz4"]
            } else {
                &["px", "py", "dxz", "dyz", "fxz2", "fyz2", "gxz3", "gyz3"]
            };
            for w in want {
                assert!(
                    out.contains(&format!(" {w},")) || out.contains(&format!(" {w})")),
                    "{file} {basis_kind}: {w} missing\n{out}"
                );
            }
        }
    }
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn pi_frame_is_stated_for_every_ligand_in_every_group() {
    // For each finite group and each ligand site type (one orbit of ligands around a central
    // atom): one frame line per ligand, a and b unit vectors ⟂ to each other and to the bond.
    let mut checked = 0;
    for name in names() {
        let g = load(name).unwrap();
        if g.is_linear() {
            continue;
        }
        let ops: Vec<Matrix3<f64>> = g.ops.iter().map(|o| o.float).collect();
        let types = salcdesk::geom::site_types(&ops).unwrap();
        for site in salcdesk::geom::site_names(&types).into_iter().skip(1) {
            let atoms = match salcdesk::geom::build_from_sites(&ops, &format!("Co@origin H@{site}"))
            {
                Ok(a) => a,
                Err(_) => continue,
            };
            let placed: Vec<Placed> = atoms
                .iter()
                .map(|a| Placed {
                    symbol: a.symbol().to_string(),
                    position: a.position,
                })
                .collect();
            let c = placed
                .iter()
                .position(|a| a.position.norm() < 1e-9)
                .unwrap();
            let bonds: Vec<(usize, usize)> = (0..placed.len())
                .filter(|&k| k != c)
                .map(|k| (c.min(k), c.max(k)))
                .collect();
            let s = Structure::new(g.clone(), placed.clone(), bonds, 0.01).unwrap();
            let ligands = basis::default_ligands(&s, c);
            let b = basis::pi(&s, c, &ligands).unwrap();
            let frames: Vec<&String> = b.notes.iter().filter(|n| n.contains(" a = (")).collect();
            assert_eq!(frames.len(), ligands.len(), "{name} {site}");
            for (k, line) in frames.iter().enumerate() {
                let nums: Vec<f64> = line
                    .split(['(', ')', ','])
                    .filter_map(|t| t.trim().parse::<f64>().ok())
                    .collect();
                assert_eq!(nums.len(), 6, "{line}");
                let a = Vector3::new(nums[0], nums[1], nums[2]);
                let bb = Vector3::new(nums[3], nums[4], nums[5]);
                let d = placed[ligands[k]].position.normalize();
                for (x, what) in [
                    (a.dot(&bb), "a·b"),
                    (a.dot(&d), "a·bond"),
                    (bb.dot(&d), "b·bond"),
                ] {
                    assert!(x.abs() < 5e-3, "{name} {site} ligand {k}: {what} = {x}");
                }
                assert!((a.norm() - 1.0).abs() < 5e-3 && (bb.norm() - 1.0).abs() < 5e-3);
            }
            checked += 1;
        }
    }
    assert!(checked > 100, "{checked}");
}
