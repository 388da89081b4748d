//! Normal modes of Hessians built in the test from force constants, against closed formulas.

use nalgebra::{DMatrix, Vector3};
use salcdesk::vib::{self, HessianInput, Options};

/// CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)), typed here.
const EH: f64 = 4.359_744_722_207_1e-18;
const A0: f64 = 5.291_772_109_03e-11;
const U: f64 = 1.660_539_066_60e-27;
const C: f64 = 299_792_458.0;

/// (1/2πc)·√(k/m), cm⁻¹, for k in hartree/bohr² and m in u.
fn omega(k: f64, m: f64) -> f64 {
    (k * EH / (A0 * A0) / (m * U)).sqrt() / (2.0 * std::f64::consts::PI * C) / 100.0
}

/// Add a bond-stretch spring k between atoms a and b.
fn spring(h: &mut DMatrix<f64>, p: &[Vector3<f64>], a: usize, b: usize, k: f64) {
    let u = (p[b] - p[a]).normalize();
    let blk = u * u.transpose() * k;
    for (i, j, s) in [(a, a, 1.0), (b, b, 1.0), (a, b, -1.0), (b, a, -1.0)] {
        let mut v = h.fixed_view_mut::<3, 3>(3 * i, 3 * j);
        v += blk * s;
    }
}

fn input(
    elements: Vec<u8>,
    positions: Vec<Vector3<f64>>,
    bonds: &[(usize, usize, f64)],
) -> HessianInput {
    let mut h = DMatrix::zeros(3 * positions.len(), 3 * positions.len());
    for &(a, b, k) in bonds {
        spring(&mut h, &positions, a, b, k);
    }
    HessianInput {
        title: "force field".into(),
        elements,
        positions,
        hessian: h,
        asymmetry: 0.0,
        source: "test".into(),
    }
}

#[test]
fn diatomics_follow_the_reduced_mass_formula() {
    // Source: Herzberg, Spectra of Diatomic Molecules (1950), ch. III: ω = (1/2πc)√(k/μ).
    for (z1, z2, k) in [
        (1u8, 17u8, 0.33),
        (6, 8, 1.2),
        (1, 1, 0.37),
        (7, 7, 1.5),
        (53, 53, 0.1),
    ] {
        let inp = input(
            vec![z1, z2],
            vec![Vector3::zeros(), Vector3::new(0.3, -0.4, 1.1)],
            &[(0, 1, k)],
        );
        let nm = vib::normal_modes(&inp, &Options::default()).unwrap();
        let m = &nm.parent.masses;
        let mu = m[0] * m[1] / (m[0] + m[1]);
        assert_eq!(nm.parent.n_modes, 1);
        let w = nm.parent.sets[0].wavenumber;
        assert!(
            (w - omega(k, mu)).abs() < 1e-6 * w,
            "{z1}-{z2}: {w} vs {}",
            omega(k, mu)
        );
        let label = &nm.parent.sets[0].irrep;
        assert_eq!(label, if z1 == z2 { "Sigma+g" } else { "Sigma+" });
    }
}

#[test]
fn linear_xy2_stretches_follow_herzberg() {
    // Source: Herzberg, Infrared and Raman Spectra (1945), ch. II, §4 (valence force field of
    // linear XY2 without bending force): ν1 = (1/2πc)√(k/m_Y),
    // ν3 = (1/2πc)√(k(1 + 2m_Y/m_X)/m_Y); Wilson, Decius & Cross, §4-? (same result).
    for (x, y, k, r) in [
        (6u8, 8u8, 1.0, 2.2),
        (6, 16, 0.5, 2.9),
        (4, 9, 0.3, 2.7),
        (54, 9, 0.2, 3.8),
    ] {
        let p = vec![
            Vector3::zeros(),
            Vector3::new(0.0, 0.0, r),
            Vector3::new(0.0, 0.0, -r),
        ];
        let inp = input(vec![x, y, y], p, &[(0, 1, k), (0, 2, k)]);
        let nm = vib::normal_modes(&inp, &Options::default()).unwrap();
        let (mx, my) = (nm.parent.masses[0], nm.parent.masses[1]);
        let find = |l: &str| {
            nm.parent
                .sets
                .iter()
                .find(|s| s.irrep == l)
                .unwrap()
                .wavenumber
        };
        let (n1, n3) = (omega(k, my), omega(k * (1.0 + 2.0 * my / mx), my));
        assert!(
            (find("Sigma+g") - n1).abs() < 1e-6 * n1,
            "ν1 {} vs {n1}",
            find("Sigma+g")
        );
        assert!(
            (find("Sigma+u") - n3).abs() < 1e-6 * n3,
            "ν3 {} vs {n3}",
            find("Sigma+u")
        );
        // the bend has no force constant: a degenerate Πu pair at zero
        let bend = nm.parent.sets.iter().find(|s| s.irrep == "Piu").unwrap();
        assert_eq!(bend.dimension, 2);
        assert!(bend.wavenumber.abs() < 1.0, "{}", bend.wavenumber);
        assert_eq!(nm.parent.n_modes, 4);
    }
}
