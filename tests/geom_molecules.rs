//! Reference molecules for the geometry tests: coordinates built from published or
//! handbook bond lengths and angles (each builder names its source; "from memory" marks
//! values typed from memory of the usual handbook tables, e.g. the CRC Handbook of
//! Chemistry and Physics, "Bond lengths and angles in gas-phase molecules"), plus a few
//! clearly labelled model clusters for groups with no common small molecule (O, I).
//! Included by the other `geom_*` test files with `#[path]`; it has no tests of its own.
#![allow(dead_code)]

use nalgebra::{Rotation3, Unit, Vector3};
use rand::{Rng, SeedableRng};
use salcdesk::geom::{atomic_number, Atom, Molecule};
use std::f64::consts::PI;

pub type V = Vector3<f64>;

pub fn v(x: f64, y: f64, z: f64) -> V {
    V::new(x, y, z)
}

fn z_of(sym: &str) -> u8 {
    atomic_number(sym).expect("known symbol")
}

pub fn mol(title: &str, atoms: &[(&str, V)]) -> Molecule {
    Molecule::new(
        title,
        atoms.iter().map(|(s, p)| Atom::new(z_of(s), *p)).collect(),
    )
}

fn rot(axis: V, deg: f64) -> Rotation3<f64> {
    Rotation3::from_axis_angle(&Unit::new_normalize(axis), deg.to_radians())
}

/// Point at distance r, polar angle theta (deg from +z), azimuth phi (deg from +x).
fn sph(r: f64, theta: f64, phi: f64) -> V {
    let (t, p) = (theta.to_radians(), phi.to_radians());
    v(r * t.sin() * p.cos(), r * t.sin() * p.sin(), r * t.cos())
}

/// Orbit of `atoms` under `ops` (duplicates within 1e-6 Å removed).
fn orbit(ops: &[nalgebra::Matrix3<f64>], atoms: &[(&'static str, V)]) -> Vec<(&'static str, V)> {
    let mut out: Vec<(&'static str, V)> = Vec::new();
    for (s, p) in atoms {
        for g in ops {
            let q = g * p;
            if !out.iter().any(|(_, r)| (r - q).norm() < 1e-6) {
                out.push((s, q));
            }
        }
    }
    out
}

/// The 12 rotations of T: cyclic permutations of the axes times sign changes with an
/// even number of minus signs.
fn t_rotations() -> Vec<nalgebra::Matrix3<f64>> {
    let mut out = Vec::new();
    for shift in 0..3 {
        for signs in [
            [1.0, 1.0, 1.0],
            [1.0, -1.0, -1.0],
            [-1.0, 1.0, -1.0],
            [-1.0, -1.0, 1.0],
        ] {
            let mut m = nalgebra::Matrix3::zeros();
            for r in 0..3 {
                m[(r, (r + shift) % 3)] = signs[r];
            }
            out.push(m);
        }
    }
    out
}

/// The 24 rotations of O: all signed permutation matrices with determinant +1.
fn o_rotations() -> Vec<nalgebra::Matrix3<f64>> {
    let perms = [
        [0, 1, 2],
        [1, 2, 0],
        [2, 0, 1],
        [1, 0, 2],
        [0, 2, 1],
        [2, 1, 0],
    ];
    let mut out = Vec::new();
    for p in perms {
        for s in 0..8 {
            let mut m = nalgebra::Matrix3::zeros();
            for r in 0..3 {
                m[(r, p[r])] = if (s >> r) & 1 == 1 { -1.0 } else { 1.0 };
            }
            if m.determinant() > 0.0 {
                out.push(m);
            }
        }
    }
    out
}

const PHI: f64 = 1.618_033_988_749_895;

/// The 12 vertices of an icosahedron (0, ±1, ±φ) and cyclic permutations (edge 2).
fn icosahedron() -> Vec<V> {
    let mut out = Vec::new();
    for a in [-1.0, 1.0] {
        for b in [-PHI, PHI] {
            out.push(v(0.0, a, b));
            out.push(v(a, b, 0.0));
            out.push(v(b, 0.0, a));
        }
    }
    out
}

/// The 60 rotations of I generated from the icosahedron's symmetries.
fn i_rotations() -> Vec<nalgebra::Matrix3<f64>> {
    let c5 = rot(v(0.0, 1.0, PHI), 72.0).into_inner();
    let c3 = rot(v(1.0, 1.0, 1.0), 120.0).into_inner();
    let mut ops = vec![nalgebra::Matrix3::identity()];
    let mut i = 0;
    while i < ops.len() {
        for g in [c5, c3] {
            let m = g * ops[i];
            if !ops.iter().any(|o| (o - m).norm() < 1e-9) {
                ops.push(m);
            }
        }
        i += 1;
    }
    assert_eq!(ops.len(), 60);
    ops
}

/// Regular n-gon of radius r in the plane z, starting at azimuth phi0 (deg).
fn ring(sym: &'static str, n: usize, r: f64, z: f64, phi0: f64) -> Vec<(&'static str, V)> {
    (0..n)
        .map(|k| {
            let a = (phi0 + 360.0 * k as f64 / n as f64).to_radians();
            (sym, v(r * a.cos(), r * a.sin(), z))
        })
        .collect()
}

/// A central atom with n equivalent ligands at `bond`, ligand–centre–ligand angle
/// `angle` between neighbours, ligands below the xy plane (C_nv pyramid).
fn pyramid(sym: &'static str, n: usize, bond: f64, angle: f64) -> Vec<(&'static str, V)> {
    // Chord between neighbouring ligands = 2·bond·sin(angle/2) = 2ρ·sin(π/n).
    let chord = 2.0 * bond * (angle.to_radians() / 2.0).sin();
    let rho = chord / (2.0 * (PI / n as f64).sin());
    let h = (bond * bond - rho * rho).sqrt();
    ring(sym, n, rho, -h, 0.0)
}

pub struct Case {
    pub name: &'static str,
    pub mol: Molecule,
    pub group: &'static str,
}

fn case(name: &'static str, group: &'static str, atoms: Vec<(&str, V)>) -> Case {
    Case {
        name,
        mol: mol(name, &atoms),
        group,
    }
}

pub fn water() -> Molecule {
    // Source: r(O–H) 0.9572 Å, HOH 104.52° (equilibrium structure), from memory.
    let a = (104.52f64 / 2.0).to_radians();
    let r = 0.9572;
    mol(
        "H2O",
        &[
            ("O", v(0.0, 0.0, 0.0)),
            ("H", v(r * a.sin(), 0.0, r * a.cos())),
            ("H", v(-r * a.sin(), 0.0, r * a.cos())),
        ],
    )
}

pub fn benzene() -> Molecule {
    // Source: C–C 1.397 Å, C–H 1.084 Å (gas-phase benzene), from memory.
    let mut a = ring("C", 6, 1.397, 0.0, 0.0);
    a.extend(ring("H", 6, 1.397 + 1.084, 0.0, 0.0));
    mol("benzene", &a)
}

pub fn c60() -> Molecule {
    // Source: C60 bond lengths 1.40 Å (6:6) and 1.45 Å (5:6) (gas electron diffraction,
    // Hedberg et al., Science 254, 410 (1991)), from memory. Atoms sit on the edges of an
    // icosahedron of edge L at fraction t from each end: t·L = 1.45, (1 − 2t)·L = 1.40.
    let l = 1.40 + 2.0 * 1.45;
    let t = 1.45 / l;
    let ico: Vec<V> = icosahedron().into_iter().map(|p| p * (l / 2.0)).collect();
    let mut atoms = Vec::new();
    for i in 0..12 {
        for j in 0..12 {
            if i != j && ((ico[i] - ico[j]).norm() - l).abs() < 1e-6 {
                atoms.push(("C", ico[i] + (ico[j] - ico[i]) * t));
            }
        }
    }
    assert_eq!(atoms.len(), 60);
    mol("C60", &atoms)
}

pub fn ferrocene(staggered: bool) -> Molecule {
    // Source: Fe–Cp(centroid) 1.66 Å, C–C 1.43 Å, C–H 1.08 Å (gas-phase ferrocene), from
    // memory; H kept in the ring planes (simplification).
    let r = 1.43 / (2.0 * (PI / 5.0).sin());
    let off = if staggered { 36.0 } else { 0.0 };
    let mut a = vec![("Fe", v(0.0, 0.0, 0.0))];
    a.extend(ring("C", 5, r, 1.66, 0.0));
    a.extend(ring("H", 5, r + 1.08, 1.66, 0.0));
    a.extend(ring("C", 5, r, -1.66, off));
    a.extend(ring("H", 5, r + 1.08, -1.66, off));
    mol(
        if staggered {
            "ferrocene D5d"
        } else {
            "ferrocene D5h"
        },
        &a,
    )
}

fn cyclohexane_chair() -> Vec<(&'static str, V)> {
    // Source: C–C 1.536 Å, CCC 111.4°, C–H 1.10 Å (gas-phase cyclohexane), from memory.
    let d: f64 = 1.536;
    let cos_t = 111.4f64.to_radians().cos();
    let four_h2 = (cos_t + 0.5) * d * d / 1.5;
    let rho = (d * d - four_h2).sqrt();
    let h = four_h2.sqrt() / 2.0;
    let c: Vec<V> = (0..6)
        .map(|k| {
            let a = (60.0 * k as f64).to_radians();
            let s = if k % 2 == 0 { 1.0 } else { -1.0 };
            v(rho * a.cos(), rho * a.sin(), s * h)
        })
        .collect();
    let mut atoms: Vec<(&'static str, V)> = c.iter().map(|p| ("C", *p)).collect();
    for k in 0..6 {
        let s = if k % 2 == 0 { 1.0 } else { -1.0 };
        let ax = v(0.0, 0.0, s);
        let b1 = (c[(k + 1) % 6] - c[k]).normalize();
        let b2 = (c[(k + 5) % 6] - c[k]).normalize();
        let eq = -(b1 + b2 + ax).normalize();
        atoms.push(("H", c[k] + ax * 1.10));
        atoms.push(("H", c[k] + eq * 1.10));
    }
    atoms
}

fn cot_tub() -> (Vec<(&'static str, V)>, Vec<V>) {
    // Source: tub cyclooctatetraene C=C 1.34 Å, C–C 1.47 Å, C=C–C 126.1°, C–H 1.09 Å,
    // from memory. Double bonds along x at z = +h, along y at z = −h (S4 about z).
    let d = 1.34;
    let single = 1.47;
    let u = -single * 126.1f64.to_radians().cos();
    let h = ((single * single - 2.0 * u * u) / 4.0).sqrt();
    let y = u + d / 2.0;
    let top = [
        v(d / 2.0, y, h),
        v(-d / 2.0, y, h),
        v(-d / 2.0, -y, h),
        v(d / 2.0, -y, h),
    ];
    let s4 = |p: V| v(-p.y, p.x, -p.z);
    let mut c: Vec<V> = Vec::new();
    for p in top {
        c.push(p);
        c.push(s4(p));
    }
    // Ring neighbours: double-bond partner (same z, differ in x sign) and single-bond partner.
    let mut dirs = Vec::new();
    for p in &c {
        let mut near: Vec<V> = c
            .iter()
            .filter(|q| (*q - p).norm() > 1e-6 && (*q - p).norm() < 1.6)
            .copied()
            .collect();
        near.sort_by(|a, b| (a - p).norm().total_cmp(&(b - p).norm()));
        let b1 = (near[0] - p).normalize();
        let b2 = (near[1] - p).normalize();
        dirs.push(-(b1 + b2).normalize());
    }
    let mut atoms: Vec<(&'static str, V)> = c.iter().map(|p| ("C", *p)).collect();
    for (p, dvec) in c.iter().zip(&dirs) {
        atoms.push(("H", p + dvec * 1.09));
    }
    (atoms, c)
}

/// All reference cases with their expected point groups.
pub fn all() -> Vec<Case> {
    let mut cases = Vec::new();
    cases.push(Case {
        name: "H2O",
        mol: water(),
        group: "C2v",
    });
    {
        // Source: N–H 1.012 Å, HNH 106.7°, from memory.
        let mut a = vec![("N", v(0.0, 0.0, 0.0))];
        a.extend(pyramid("H", 3, 1.012, 106.7));
        cases.push(case("NH3", "C3v", a));
    }
    {
        // Source: C–Cl 1.781 Å, C–H 1.086 Å, HCH 110.5°, from memory.
        let mut a = vec![("C", v(0.0, 0.0, 0.0)), ("Cl", v(0.0, 0.0, 1.781))];
        a.extend(pyramid("H", 3, 1.086, 110.5));
        cases.push(case("CH3Cl", "C3v", a));
    }
    {
        // Source: C–H 1.087 Å, C–Cl 1.765 Å, HCH 112.0°, ClCCl 111.8°, from memory.
        let (h, cl) = (112.0f64.to_radians() / 2.0, 111.8f64.to_radians() / 2.0);
        let a = vec![
            ("C", v(0.0, 0.0, 0.0)),
            ("H", v(1.087 * h.sin(), 0.0, 1.087 * h.cos())),
            ("H", v(-1.087 * h.sin(), 0.0, 1.087 * h.cos())),
            ("Cl", v(0.0, 1.765 * cl.sin(), -1.765 * cl.cos())),
            ("Cl", v(0.0, -1.765 * cl.sin(), -1.765 * cl.cos())),
        ];
        cases.push(case("CH2Cl2", "C2v", a));
    }
    {
        // Source: B–F 1.307 Å, planar, from memory.
        let mut a = vec![("B", v(0.0, 0.0, 0.0))];
        a.extend(ring("F", 3, 1.307, 0.0, 0.0));
        cases.push(case("BF3", "D3h", a));
    }
    {
        // Source: C–H 1.087 Å, tetrahedral, from memory.
        let k = 1.087 / 3f64.sqrt();
        let a = vec![
            ("C", v(0.0, 0.0, 0.0)),
            ("H", v(k, k, k)),
            ("H", v(k, -k, -k)),
            ("H", v(-k, k, -k)),
            ("H", v(-k, -k, k)),
        ];
        cases.push(case("CH4", "Td", a));
    }
    {
        // Source: S–F 1.561 Å, from memory.
        let r = 1.561;
        let mut a = vec![("S", v(0.0, 0.0, 0.0))];
        for e in [V::x(), V::y(), V::z()] {
            a.push(("F", e * r));
            a.push(("F", -e * r));
        }
        cases.push(case("SF6", "Oh", a));
    }
    {
        // Source: P–F axial 1.577 Å, equatorial 1.534 Å, from memory.
        let mut a = vec![
            ("P", v(0.0, 0.0, 0.0)),
            ("F", v(0.0, 0.0, 1.577)),
            ("F", v(0.0, 0.0, -1.577)),
        ];
        a.extend(ring("F", 3, 1.534, 0.0, 0.0));
        cases.push(case("PF5", "D3h", a));
    }
    {
        // Source: Xe–F 1.95 Å, square planar, from memory.
        let mut a = vec![("Xe", v(0.0, 0.0, 0.0))];
        a.extend(ring("F", 4, 1.95, 0.0, 0.0));
        cases.push(case("XeF4", "D4h", a));
    }
    {
        // Source: [PtCl4]2- Pt–Cl 2.31 Å, square planar, from memory.
        let mut a = vec![("Pt", v(0.0, 0.0, 0.0))];
        a.extend(ring("Cl", 4, 2.31, 0.0, 45.0));
        cases.push(case("PtCl4 2-", "D4h", a));
    }
    // Source: C=O 1.160 Å, from memory.
    cases.push(case(
        "CO2",
        "Dinfh",
        vec![
            ("C", v(0.0, 0.0, 0.0)),
            ("O", v(0.0, 0.0, 1.160)),
            ("O", v(0.0, 0.0, -1.160)),
        ],
    ));
    // Source: C≡C 1.203 Å, C–H 1.063 Å, from memory.
    cases.push(case(
        "C2H2",
        "Dinfh",
        vec![
            ("C", v(0.0, 0.0, 0.6015)),
            ("C", v(0.0, 0.0, -0.6015)),
            ("H", v(0.0, 0.0, 1.6645)),
            ("H", v(0.0, 0.0, -1.6645)),
        ],
    ));
    // Source: H–C 1.066 Å, C≡N 1.153 Å, from memory.
    cases.push(case(
        "HCN",
        "Cinfv",
        vec![
            ("H", v(0.0, 0.0, -1.066)),
            ("C", v(0.0, 0.0, 0.0)),
            ("N", v(0.0, 0.0, 1.153)),
        ],
    ));
    {
        // Source: C=C 1.339 Å, C–H 1.086 Å, HCH 117.6°, from memory.
        let a = (117.6f64 / 2.0).to_radians();
        let (cx, r) = (1.339 / 2.0, 1.086);
        let mut at = Vec::new();
        for s in [1.0, -1.0] {
            at.push(("C", v(s * cx, 0.0, 0.0)));
            for t in [1.0, -1.0] {
                at.push(("H", v(s * (cx + r * a.cos()), t * r * a.sin(), 0.0)));
            }
        }
        cases.push(case("C2H4", "D2h", at));
    }
    cases.push(Case {
        name: "benzene",
        mol: benzene(),
        group: "D6h",
    });
    cases.push(Case {
        name: "ferrocene eclipsed",
        mol: ferrocene(false),
        group: "D5h",
    });
    cases.push(Case {
        name: "ferrocene staggered",
        mol: ferrocene(true),
        group: "D5d",
    });
    cases.push(Case {
        name: "C60",
        mol: c60(),
        group: "Ih",
    });
    {
        // Source: allene C=C 1.308 Å, C–H 1.087 Å, HCH 118.2°, from memory.
        let a = (118.2f64 / 2.0).to_radians();
        let (c, r) = (1.308, 1.087);
        let at = vec![
            ("C", v(0.0, 0.0, 0.0)),
            ("C", v(0.0, 0.0, c)),
            ("C", v(0.0, 0.0, -c)),
            ("H", v(r * a.sin(), 0.0, c + r * a.cos())),
            ("H", v(-r * a.sin(), 0.0, c + r * a.cos())),
            ("H", v(0.0, r * a.sin(), -c - r * a.cos())),
            ("H", v(0.0, -r * a.sin(), -c - r * a.cos())),
        ];
        cases.push(case("allene", "D2d", at));
    }
    for (name, group, off) in [
        ("ethane staggered", "D3d", 60.0),
        ("ethane eclipsed", "D3h", 0.0),
    ] {
        // Source: ethane C–C 1.536 Å, C–H 1.091 Å, HCC 111.2°, from memory.
        let (cc, ch, ang) = (1.536 / 2.0, 1.091, 180.0 - 111.2);
        let mut at = vec![("C", v(0.0, 0.0, cc)), ("C", v(0.0, 0.0, -cc))];
        for k in 0..3 {
            let p = sph(ch, ang, 120.0 * k as f64);
            at.push(("H", v(p.x, p.y, cc + p.z)));
            let q = sph(ch, ang, 120.0 * k as f64 + off);
            at.push(("H", v(q.x, q.y, -cc - q.z)));
        }
        cases.push(case(name, group, at));
    }
    cases.push(case("cyclohexane chair", "D3d", cyclohexane_chair()));
    {
        // Source: H2O2 O–O 1.475 Å, O–H 0.950 Å, OOH 94.8°, dihedral 111.5°, from memory.
        let (oo, oh, a, dih) = (
            1.475 / 2.0,
            0.950,
            94.8f64.to_radians(),
            (111.5f64 / 2.0).to_radians(),
        );
        let at = vec![
            ("O", v(oo, 0.0, 0.0)),
            ("O", v(-oo, 0.0, 0.0)),
            (
                "H",
                v(
                    oo - oh * a.cos(),
                    oh * a.sin() * dih.cos(),
                    oh * a.sin() * dih.sin(),
                ),
            ),
            (
                "H",
                v(
                    -oo + oh * a.cos(),
                    oh * a.sin() * dih.cos(),
                    -oh * a.sin() * dih.sin(),
                ),
            ),
        ];
        cases.push(case("H2O2", "C2", at));
    }
    {
        // Source: C–H 1.09, C–F 1.35, C–Cl 1.77, C–Br 1.94 Å, tetrahedral angles, from memory.
        let k = 1.0 / 3f64.sqrt();
        let at = vec![
            ("C", v(0.0, 0.0, 0.0)),
            ("H", v(k, k, k) * 1.09),
            ("F", v(k, -k, -k) * 1.35),
            ("Cl", v(-k, k, -k) * 1.77),
            ("Br", v(-k, -k, k) * 1.94),
        ];
        cases.push(case("CHFClBr", "C1", at));
    }
    {
        // Source: HOCl O–H 0.964 Å, O–Cl 1.690 Å, HOCl 102.5°, from memory.
        let a = 102.5f64.to_radians();
        let at = vec![
            ("O", v(0.0, 0.0, 0.0)),
            ("Cl", v(1.690, 0.0, 0.0)),
            ("H", v(0.964 * a.cos(), 0.964 * a.sin(), 0.0)),
        ];
        cases.push(case("HOCl", "Cs", at));
    }
    {
        // Source: meso-1,2-dichloro-1,2-difluoroethane, anti conformer; C–C 1.54, C–H 1.09,
        // C–F 1.36, C–Cl 1.77 Å, tetrahedral angles, from memory. Second carbon = inversion
        // image of the first.
        let ang = 180.0 - 109.47;
        let c1 = v(0.0, 0.0, 0.77);
        let subs = [("H", 1.09, 0.0), ("F", 1.36, 120.0), ("Cl", 1.77, 240.0)];
        let mut at = vec![("C", c1), ("C", -c1)];
        for (s, r, phi) in subs {
            let p = c1 + sph(r, ang, phi);
            at.push((s, p));
            at.push((s, -p));
        }
        cases.push(case("meso-CHFCl-CHFCl anti", "Ci", at));
    }
    {
        // Source: trans-N2F2 N=N 1.214 Å, N–F 1.396 Å, NNF 105.5°, from memory.
        let a = 105.5f64.to_radians();
        let n1 = v(0.607, 0.0, 0.0);
        let f1 = n1 + v(-a.cos(), a.sin(), 0.0) * 1.396;
        let at = vec![("N", n1), ("N", -n1), ("F", f1), ("F", -f1)];
        cases.push(case("trans-N2F2", "C2h", at));
    }
    {
        // Source: B(OH)3 B–O 1.361 Å, O–H 0.97 Å, BOH 114°, planar, from memory.
        let mut at = vec![("B", v(0.0, 0.0, 0.0))];
        for k in 0..3 {
            let e = rot(V::z(), 120.0 * k as f64) * V::x();
            let o = e * 1.361;
            let h = o + (rot(V::z(), 114.0) * -e) * 0.97;
            at.push(("O", o));
            at.push(("H", h));
        }
        cases.push(case("B(OH)3", "C3h", at));
    }
    {
        // Source: S8 S–S 2.05 Å, SSS 108°, from memory. Crown: alternate atoms at z = ±h on
        // a circle of radius ρ, 45° apart; ρ² = d²(1 − cos 108°).
        let d: f64 = 2.05;
        let rho = d * (1.0 - 108f64.to_radians().cos()).sqrt();
        let h = ((d * d - rho * rho * (2.0 - 2.0 * 45f64.to_radians().cos())) / 4.0).sqrt();
        let at: Vec<(&str, V)> = (0..8)
            .map(|k| {
                let a = (45.0 * k as f64).to_radians();
                let z = if k % 2 == 0 { h } else { -h };
                ("S", v(rho * a.cos(), rho * a.sin(), z))
            })
            .collect();
        cases.push(case("S8 crown", "D4d", at));
    }
    {
        // Source: adamantane as a diamond-lattice fragment, C–C 1.54 Å, C–H 1.10 Å, from
        // memory.
        let s = 1.54 / 3f64.sqrt();
        let mut at = Vec::new();
        let ch = [
            v(1.0, 1.0, 1.0),
            v(1.0, -1.0, -1.0),
            v(-1.0, 1.0, -1.0),
            v(-1.0, -1.0, 1.0),
        ];
        for p in ch {
            at.push(("C", p * s));
            at.push(("H", p * s + p.normalize() * 1.10));
        }
        for axis in [V::x(), V::y(), V::z()] {
            for sign in [1.0, -1.0] {
                let c = axis * (2.0 * sign);
                at.push(("C", c * s));
                // Tetrahedral directions at c: bonds point to the CH carbons (norm √3);
                // the remaining two point away.
                let bonded: Vec<V> = ch
                    .iter()
                    .filter(|q| ((**q - c).norm() - 3f64.sqrt()).abs() < 1e-9)
                    .map(|q| q - c)
                    .collect();
                let out = -(bonded[0] + bonded[1]).normalize();
                let perp = bonded[0].cross(&bonded[1]).normalize();
                let half = (109.47f64 / 2.0).to_radians();
                for t in [1.0, -1.0] {
                    let dir = out * half.cos() + perp * (t * half.sin());
                    at.push(("H", c * s + dir * 1.10));
                }
            }
        }
        cases.push(case("adamantane", "Td", at));
    }
    {
        // Source: closo-B12H12(2-) B–B 1.78 Å, B–H 1.20 Å, from memory.
        let mut at = Vec::new();
        for p in icosahedron() {
            let b = p * (1.78 / 2.0);
            at.push(("B", b));
            at.push(("H", b + p.normalize() * 1.20));
        }
        cases.push(case("B12H12 2-", "Ih", at));
    }
    {
        // Source: cubane C–C 1.571 Å, C–H 1.09 Å (cube), from memory.
        let c = 1.571 / 2.0;
        let mut at = Vec::new();
        for sx in [1.0, -1.0] {
            for sy in [1.0, -1.0] {
                for sz in [1.0, -1.0] {
                    let p = v(sx, sy, sz) * c;
                    at.push(("C", p));
                    at.push(("H", p + p.normalize() * 1.09));
                }
            }
        }
        cases.push(case("cubane", "Oh", at));
    }
    {
        // Source: P4 P–P 2.21 Å, from memory.
        let s = 2.21 / (2.0 * 2f64.sqrt());
        let at = vec![
            ("P", v(1.0, 1.0, 1.0) * s),
            ("P", v(1.0, -1.0, -1.0) * s),
            ("P", v(-1.0, 1.0, -1.0) * s),
            ("P", v(-1.0, -1.0, 1.0) * s),
        ];
        cases.push(case("P4", "Td", at));
    }
    {
        // Source: IF7 I–F axial 1.79 Å, equatorial 1.86 Å (pentagonal bipyramid), from
        // memory.
        let mut at = vec![
            ("I", v(0.0, 0.0, 0.0)),
            ("F", v(0.0, 0.0, 1.79)),
            ("F", v(0.0, 0.0, -1.79)),
        ];
        at.extend(ring("F", 5, 1.86, 0.0, 0.0));
        cases.push(case("IF7", "D5h", at));
    }
    cases.push(case("cyclooctatetraene tub", "D2d", cot_tub().0));
    {
        // 1,3,5,7-tetramethylcyclooctatetraene: COT tub (above) with one H of each double
        // bond (an S4 orbit) replaced by CH3 (C–C 1.50 Å, C–H 1.09 Å, tetrahedral, from
        // memory), methyl groups at a generic torsion.
        let (atoms, c) = cot_tub();
        let s4 = |p: V| v(-p.y, p.x, -p.z);
        let first = c[0];
        let orbit4 = [first, s4(first), s4(s4(first)), s4(s4(s4(first)))];
        let mut at: Vec<(&str, V)> = atoms
            .iter()
            .filter(|(s, p)| !(*s == "H" && orbit4.iter().any(|q| (p - q).norm() < 1.2)))
            .copied()
            .collect();
        // Methyl on c[0] along its former H direction, built once and carried by S4.
        let hdir = atoms
            .iter()
            .find(|(s, p)| *s == "H" && (p - first).norm() < 1.2)
            .map(|(_, p)| (p - first).normalize())
            .unwrap();
        let cm = first + hdir * 1.50;
        let e1 = hdir.cross(&V::z()).normalize();
        let e2 = hdir.cross(&e1);
        let mut methyl = vec![cm];
        for k in 0..3 {
            let a = (20.0 + 120.0 * k as f64).to_radians();
            let dir = hdir * (70.53f64.to_radians().cos())
                + (e1 * a.cos() + e2 * a.sin()) * 70.53f64.to_radians().sin();
            methyl.push(cm + dir * 1.09);
        }
        for (k, p) in methyl.iter().enumerate() {
            let sym = if k == 0 { "C" } else { "H" };
            let mut q = *p;
            for _ in 0..4 {
                at.push((sym, q));
                q = s4(q);
            }
        }
        cases.push(case("1,3,5,7-tetramethylcyclooctatetraene", "S4", at));
    }
    {
        // [Co(en)3]3+ heavy-atom skeleton (Co, 6 N, 6 C), approximate coordinates: Co–N
        // 1.97 Å, N–C ≈ 1.5 Å, C–C ≈ 1.5 Å (from memory), gauche chelate rings; the C2 axes
        // run along x and its 120° images.
        let rn = sph(1.97, 54.74, 30.0);
        let na = rn;
        let ca = v(2.75, 0.62, 0.45);
        let c2x = |p: V| v(p.x, -p.y, -p.z);
        let mut at = vec![("Co", v(0.0, 0.0, 0.0))];
        for k in 0..3 {
            let r = rot(V::z(), 120.0 * k as f64);
            for p in [na, c2x(na)] {
                at.push(("N", r * p));
            }
            for p in [ca, c2x(ca)] {
                at.push(("C", r * p));
            }
        }
        cases.push(case("[Co(en)3] skeleton", "D3", at));
    }
    {
        // Source: biphenyl C–C (ring) 1.39 Å, inter-ring C–C 1.49 Å, C–H 1.08 Å, twist 44.4°
        // (gas phase), from memory. Long axis z.
        let mut at = Vec::new();
        let r = 1.39;
        for (sign, twist) in [(1.0, 0.0), (-1.0, 44.4)] {
            let centre = sign * (1.49 / 2.0 + r);
            let rr = rot(V::z(), twist);
            for k in 0..6 {
                let a = (60.0 * k as f64).to_radians();
                // Ring in the xz plane, atom k = 0 pointing towards the other ring.
                let p = v(r * a.sin(), 0.0, -sign * r * a.cos());
                let c = rr * p + v(0.0, 0.0, centre);
                at.push(("C", c));
                if k != 0 {
                    let h = rr * (p * ((r + 1.08) / r)) + v(0.0, 0.0, centre);
                    at.push(("H", h));
                }
            }
        }
        cases.push(case("biphenyl twisted", "D2", at));
    }
    {
        // Source: tropylium C7H7+ C–C 1.40 Å, C–H 1.08 Å (regular heptagon), from memory.
        let r = 1.40 / (2.0 * (PI / 7.0).sin());
        let mut at = ring("C", 7, r, 0.0, 0.0);
        at.extend(ring("H", 7, r + 1.08, 0.0, 0.0));
        cases.push(case("tropylium", "D7h", at));
    }
    for (name, group, off) in [
        ("uranocene eclipsed", "D8h", 0.0),
        ("uranocene staggered", "D8d", 22.5),
    ] {
        // Source: U(C8H8)2 U–ring centroid 1.92 Å, C–C 1.40 Å, C–H 1.08 Å, from memory.
        let r = 1.40 / (2.0 * (PI / 8.0).sin());
        let mut at = vec![("U", v(0.0, 0.0, 0.0))];
        at.extend(ring("C", 8, r, 1.92, 0.0));
        at.extend(ring("H", 8, r + 1.08, 1.92, 0.0));
        at.extend(ring("C", 8, r, -1.92, off));
        at.extend(ring("H", 8, r + 1.08, -1.92, off));
        cases.push(case(name, group, at));
    }
    {
        // Source: SF5Cl S–F 1.57 Å, S–Cl 2.03 Å, octahedral angles, from memory.
        let mut at = vec![
            ("S", v(0.0, 0.0, 0.0)),
            ("Cl", v(0.0, 0.0, 2.03)),
            ("F", v(0.0, 0.0, -1.57)),
        ];
        at.extend(ring("F", 4, 1.57, 0.0, 0.0));
        cases.push(case("SF5Cl", "C4v", at));
    }
    {
        // Source: CpNiNO: Ni–Cp(centroid) 1.74 Å, Ni–N 1.63 Å, N–O 1.17 Å, ring C–C 1.42 Å,
        // C–H 1.08 Å, from memory (approximate).
        let r = 1.42 / (2.0 * (PI / 5.0).sin());
        let mut at = ring("C", 5, r, 0.0, 0.0);
        at.extend(ring("H", 5, r + 1.08, 0.0, 0.0));
        at.push(("Ni", v(0.0, 0.0, -1.74)));
        at.push(("N", v(0.0, 0.0, -1.74 - 1.63)));
        at.push(("O", v(0.0, 0.0, -1.74 - 1.63 - 1.17)));
        cases.push(case("CpNiNO", "C5v", at));
    }
    {
        // Source: benzene–argon van der Waals complex, Ar on the C6 axis 3.58 Å from the
        // ring centre (rotational spectroscopy), from memory; benzene as above.
        let mut m = benzene();
        m.atoms.push(Atom::new(18, v(0.0, 0.0, 3.58)));
        cases.push(Case {
            name: "benzene-Ar",
            mol: m,
            group: "C6v",
        });
    }
    {
        // [Co(NO2)6]3- (pyritohedral Th): Co–N 1.95 Å, N–O 1.24 Å, ONO 120°, from memory.
        // Each NO2 plane contains its Co–N axis and the next axis in cyclic order.
        let mut at = vec![("Co", v(0.0, 0.0, 0.0))];
        let axes = [V::x(), V::y(), V::z()];
        let half = 60f64.to_radians();
        for k in 0..3 {
            let (e, f) = (axes[k], axes[(k + 1) % 3]);
            for s in [1.0, -1.0] {
                let n = e * (1.95 * s);
                at.push(("N", n));
                for t in [1.0, -1.0] {
                    at.push((
                        "O",
                        n + (e * (s * half.cos()) + f * (t * half.sin())) * 1.24,
                    ));
                }
            }
        }
        cases.push(case("[Co(NO2)6] 3-", "Th", at));
    }
    {
        // Neopentane skeleton C(CH3)4 with every methyl twisted 17° from staggered: a model
        // of group T. C–C 1.54 Å, C–H 1.09 Å, tetrahedral angles, from memory.
        let d = v(1.0, 1.0, 1.0).normalize();
        let cm = d * 1.54;
        let e1 = d.cross(&V::z()).normalize();
        let e2 = d.cross(&e1);
        let t = 70.53f64.to_radians();
        let mut unit = vec![("C", v(0.0, 0.0, 0.0)), ("C", cm)];
        for k in 0..3 {
            let a = (17.0 + 120.0 * k as f64).to_radians();
            unit.push((
                "H",
                cm + (d * t.cos() + (e1 * a.cos() + e2 * a.sin()) * t.sin()) * 1.09,
            ));
        }
        cases.push(case(
            "neopentane twisted (model)",
            "T",
            orbit(&t_rotations(), &unit),
        ));
    }
    {
        // Model cluster of group O (no common molecule has it): a centre, six atoms on the
        // axes and a 24-atom chiral shell at a general position.
        let unit = [
            ("W", v(0.0, 0.0, 0.0)),
            ("O", v(0.0, 0.0, 2.0)),
            ("C", v(1.0, 0.4, 2.6)),
        ];
        cases.push(case(
            "chiral octahedral cluster (model)",
            "O",
            orbit(&o_rotations(), &unit),
        ));
    }
    {
        // Model cluster of group I: an icosahedral B12 core (B–B 1.78 Å) with a 60-atom
        // chiral shell at a general position.
        let mut unit = vec![("H", v(1.2, 0.55, 2.8))]; // ≥ 0.17 Å off every mirror plane of Ih
        for p in icosahedron() {
            unit.push(("B", p * 0.89));
        }
        let unit: Vec<(&'static str, V)> = unit;
        cases.push(case(
            "chiral icosahedral cluster (model)",
            "I",
            orbit(&i_rotations(), &unit),
        ));
    }
    {
        // all-equatorial 1,2,3,4,5,6-hexamethylcyclohexane, chair (data as cyclohexane,
        // C–CH3 1.53 Å, C–H 1.09 Å from memory), methyl groups twisted 25° off the mirror
        // planes: S6. Built as the S6 orbit of one CH(CH3) unit.
        let chair = cyclohexane_chair();
        let c0 = chair[0].1;
        let ax = chair[6].1 - c0; // axial H direction (x 1.10)
        let eq = (chair[7].1 - c0).normalize();
        let cm = c0 + eq * 1.53;
        let e1 = eq.cross(&V::z()).normalize();
        let e2 = eq.cross(&e1);
        let t = 70.53f64.to_radians();
        let mut unit = vec![("C", c0), ("H", c0 + ax), ("C", cm)];
        for k in 0..3 {
            let a = (25.0 + 120.0 * k as f64).to_radians();
            unit.push((
                "H",
                cm + (eq * t.cos() + (e1 * a.cos() + e2 * a.sin()) * t.sin()) * 1.09,
            ));
        }
        let s6: Vec<nalgebra::Matrix3<f64>> = (0..6)
            .map(|k| {
                let r = rot(V::z(), 60.0 * k as f64).into_inner();
                if k % 2 == 1 {
                    nalgebra::Matrix3::from_diagonal(&v(1.0, 1.0, -1.0)) * r
                } else {
                    r
                }
            })
            .collect();
        cases.push(case(
            "hexamethylcyclohexane twisted (model)",
            "S6",
            orbit(&s6, &unit),
        ));
    }
    {
        // Tris(fluoromethyl)amine-like propeller: pyramidal N (N–C 1.47 Å, CNC 110°),
        // CH2F groups at a generic torsion (C–F 1.39, C–H 1.09 Å, from memory): C3.
        let ncs = pyramid("C", 3, 1.47, 110.0);
        let c = ncs[0].1;
        let d = c.normalize();
        let e1 = d.cross(&V::z()).normalize();
        let e2 = d.cross(&e1);
        let t = 70.53f64.to_radians();
        let sub = |a: f64, r: f64| {
            c + (d * t.cos() + (e1 * a.to_radians().cos() + e2 * a.to_radians().sin()) * t.sin())
                * r
        };
        let unit = vec![
            ("N", v(0.0, 0.0, 0.0)),
            ("C", c),
            ("F", sub(35.0, 1.39)),
            ("H", sub(155.0, 1.09)),
            ("H", sub(275.0, 1.09)),
        ];
        let c3: Vec<nalgebra::Matrix3<f64>> = (0..3)
            .map(|k| rot(V::z(), 120.0 * k as f64).into_inner())
            .collect();
        cases.push(case("N(CH2F)3 propeller (model)", "C3", orbit(&c3, &unit)));
    }
    cases
}

/// Random proper rotation + translation, then Gaussian noise of `sigma` Å per coordinate.
pub fn scramble(m: &Molecule, seed: u64, sigma: f64) -> Molecule {
    let mut rng = rand::rngs::StdRng::seed_from_u64(seed);
    let axis = v(
        rng.gen_range(-1.0..1.0),
        rng.gen_range(-1.0..1.0),
        rng.gen_range(-1.0..1.0),
    );
    let axis = if axis.norm() < 1e-3 { V::z() } else { axis };
    let r = rot(axis, rng.gen_range(0.0..360.0));
    let t = v(
        rng.gen_range(-10.0..10.0),
        rng.gen_range(-10.0..10.0),
        rng.gen_range(-10.0..10.0),
    );
    let mut out = m.clone();
    for a in &mut out.atoms {
        let mut gauss = || {
            // Box–Muller.
            let u1: f64 = rng.gen_range(f64::EPSILON..1.0);
            let u2: f64 = rng.gen_range(0.0..1.0);
            (-2.0 * u1.ln()).sqrt() * (2.0 * PI * u2).cos()
        };
        let noise = v(gauss(), gauss(), gauss()) * sigma;
        a.position = r * a.position + t + noise;
    }
    out
}

/// Mackay icosahedron (group Ih) with `shells` shells around a central atom: shell k holds
/// 10k² + 2 atoms (A. L. Mackay, Acta Cryst. 15, 916 (1962)); 7 shells give 1415 atoms.
/// Nearest-neighbour distance along the radial direction `d` Å.
pub fn mackay_icosahedron(shells: usize, d: f64) -> Molecule {
    let unit: Vec<V> = icosahedron().into_iter().map(|p| p * (d / 2.0)).collect();
    let edge = d;
    // Faces: triples of mutually adjacent vertices.
    let mut faces = Vec::new();
    for i in 0..12 {
        for j in i + 1..12 {
            for k in j + 1..12 {
                let adj = |a: usize, b: usize| ((unit[a] - unit[b]).norm() - edge).abs() < 1e-9;
                if adj(i, j) && adj(j, k) && adj(i, k) {
                    faces.push((unit[i], unit[j], unit[k]));
                }
            }
        }
    }
    assert_eq!(faces.len(), 20);
    let mut pts: Vec<V> = vec![V::zeros()];
    for k in 1..=shells {
        let mut shell: Vec<V> = Vec::new();
        for (a, b, c) in &faces {
            for i in 0..=k {
                for j in 0..=k - i {
                    let l = k - i - j;
                    let p = a * i as f64 + b * j as f64 + c * l as f64;
                    if !shell.iter().any(|q| (q - p).norm() < 1e-6) {
                        shell.push(p);
                    }
                }
            }
        }
        assert_eq!(shell.len(), 10 * k * k + 2);
        pts.extend(shell);
    }
    Molecule::new(
        "Mackay icosahedron",
        pts.into_iter().map(|p| Atom::new(79, p)).collect(),
    )
}

/// fcc cuboctahedron (group Oh) with `shells` shells: lattice points (x, y, z)·a/2 with
/// x + y + z even, max(|x|, |y|, |z|) ≤ shells and |x| + |y| + |z| ≤ 2·shells; shell k
/// holds 10k² + 2 atoms, so 7 shells give 1415 atoms.
pub fn fcc_cuboctahedron(shells: i64, a: f64) -> Molecule {
    let n = shells;
    let mut atoms = Vec::new();
    for x in -n..=n {
        for y in -n..=n {
            for z in -n..=n {
                let m = x.abs().max(y.abs()).max(z.abs());
                let sum = x.abs() + y.abs() + z.abs();
                if (x + y + z).rem_euclid(2) == 0 && m <= n && sum <= 2 * n {
                    atoms.push(Atom::new(29, v(x as f64, y as f64, z as f64) * (a / 2.0)));
                }
            }
        }
    }
    Molecule::new("fcc cuboctahedron", atoms)
}

/// fcc truncated octahedron (group Oh): lattice points (x, y, z)·a/2 with x + y + z even,
/// max(|x|, |y|, |z|) ≤ `cube` (the square faces) and |x| + |y| + |z| ≤ `octa` (the
/// hexagonal faces); cube 7, octa 12 give 1139 atoms.
pub fn fcc_truncated_octahedron(cube: i64, octa: i64, a: f64) -> Molecule {
    let mut atoms = Vec::new();
    for x in -cube..=cube {
        for y in -cube..=cube {
            for z in -cube..=cube {
                let sum = x.abs() + y.abs() + z.abs();
                if (x + y + z).rem_euclid(2) == 0 && sum <= octa {
                    atoms.push(Atom::new(29, v(x as f64, y as f64, z as f64) * (a / 2.0)));
                }
            }
        }
    }
    Molecule::new("fcc truncated octahedron", atoms)
}

/// The clusters of the timing runs (benches and README), with their groups. Source:
/// Au–Au 2.88 Å and the Cu lattice constant 3.615 Å, from memory.
pub fn timing_clusters() -> Vec<(&'static str, Molecule, &'static str)> {
    vec![
        ("oh_1139", fcc_truncated_octahedron(7, 12, 3.615), "Oh"),
        ("ih_1415", mackay_icosahedron(7, 2.88), "Ih"),
        ("ih_147", mackay_icosahedron(3, 2.88), "Ih"),
        ("oh_1415", fcc_cuboctahedron(7, 3.615), "Oh"),
    ]
}

/// fcc cube (group Oh): lattice points (x, y, z)·a/2 with x + y + z even, |x|,|y|,|z| ≤ n.
pub fn fcc_cube(n: i64, a: f64) -> Molecule {
    let mut atoms = Vec::new();
    for x in -n..=n {
        for y in -n..=n {
            for z in -n..=n {
                if (x + y + z).rem_euclid(2) == 0 {
                    atoms.push(Atom::new(29, v(x as f64, y as f64, z as f64) * (a / 2.0)));
                }
            }
        }
    }
    Molecule::new("fcc cube", atoms)
}
