//! Inputs far larger than a molecule a chemist reads one term at a time: each must give a
//! correct (or clearly refused) answer. Timing lives in README (Performance) and benches; these
//! checks are about what comes back. Every geometry here is generated in code (a random cloud,
//! an irregular chain): no symmetry by construction, so the expected group C1 is a fact of the
//! construction, not a recalled value.

use nalgebra::Vector3;
use salcdesk::basis::{self, BasisError, Placed, Structure};
use salcdesk::geom::{detect, read_xyz, XyzOptions};
use salcdesk::survey::{survey, SurveyOptions, MAX_BOND_SETS};

/// A deterministic pseudo-random number in [0, 1) (64-bit LCG, Knuth's MMIX constants).
fn lcg(seed: &mut u64) -> f64 {
    *seed = seed
        .wrapping_mul(6364136223846793005)
        .wrapping_add(1442695040888963407);
    (*seed >> 11) as f64 / (1u64 << 53) as f64
}

fn xyz(atoms: &[(&str, [f64; 3])]) -> String {
    let mut t = format!("{}\ngenerated\n", atoms.len());
    for (e, p) in atoms {
        t.push_str(&format!("{e} {:.6} {:.6} {:.6}\n", p[0], p[1], p[2]));
    }
    t
}

#[test]
fn dense_random_cloud_is_c1_at_every_tolerance() {
    // 30,000 atoms in a 150 Å box: their distances from the centre form one long chain of
    // nearly equal radii, which once made the element search try 60,000 directions against
    // every atom (minutes). It must still come out C1.
    let mut seed = 11u64;
    let atoms: Vec<(&str, [f64; 3])> = (0..30_000)
        .map(|_| {
            (
                "C",
                [
                    150.0 * lcg(&mut seed),
                    150.0 * lcg(&mut seed),
                    150.0 * lcg(&mut seed),
                ],
            )
        })
        .collect();
    let mol = read_xyz(xyz(&atoms).as_bytes(), &XyzOptions::default()).unwrap();
    for tol in [0.01, 0.1, 0.3] {
        assert_eq!(detect(&mol, tol).unwrap().group, "C1", "tolerance {tol}");
    }
}

#[test]
fn thousands_of_bond_sets_give_gamma_stretch_without_the_list() {
    // An irregular zigzag chain of 6,001 carbon atoms (1.3–1.4 Å steps, next-nearest 2.5 Å:
    // 6,000 bonds by perception), no symmetry: every bond is its own set, more than the
    // listed maximum, so the sets are left out with a note, and Γstretch = 6000 A still holds
    // (in C1 each bond is its own representation A).
    let mut seed = 5u64;
    let atoms: Vec<(&str, [f64; 3])> = (0..6_001)
        .map(|i| {
            let j = |s: &mut u64| 0.05 * (lcg(s) - 0.5);
            (
                "C",
                [
                    1.25 * i as f64 + j(&mut seed),
                    0.45 * (i % 2) as f64 + j(&mut seed),
                    j(&mut seed),
                ],
            )
        })
        .collect();
    let mol = read_xyz(xyz(&atoms).as_bytes(), &XyzOptions::default()).unwrap();
    let s = survey(&mol, &SurveyOptions::default()).unwrap();
    assert_eq!(s.group.name(), "C1");
    assert_eq!(s.bonds.len(), 6_000);
    const { assert!(6_000 > MAX_BOND_SETS) };
    assert!(s.bond_sets.is_empty());
    assert!(
        s.notes.iter().any(|n| n.contains("6000 bond sets")),
        "{:?}",
        s.notes
    );
    assert_eq!(s.stretches, vec![6_000]);
}

#[test]
fn bases_beyond_the_size_limits_are_refused_before_they_are_built() {
    // Three atoms in C1; an angle list of MAX_MEMBERS + 1 entries (the same angle repeated:
    // the refusal must come before anything looks at them).
    let g = salcdesk::group::load("C1").unwrap();
    let at = |x: f64, y: f64| Placed {
        symbol: "O".into(),
        position: Vector3::new(x, y, 0.0),
    };
    let s = Structure::new(
        g,
        vec![at(0.0, 0.0), at(1.0, 0.0), at(0.0, 1.0)],
        vec![(0, 1), (0, 2)],
        0.01,
    )
    .unwrap();
    let many = vec![(1, 0, 2); basis::MAX_MEMBERS + 1];
    match basis::bends(&s, &many) {
        Err(BasisError::TooLarge { members, ops, .. }) => {
            assert_eq!((members, ops), (basis::MAX_MEMBERS + 1, 1));
        }
        other => panic!("expected a size refusal, got {other:?}"),
    }
    // images = members × operations: Ih's 120 operations reach the limit with fewer members
    assert!(basis::check_size(basis::BasisKind::Stretch, 66_666, 120).is_ok());
    let e = basis::check_size(basis::BasisKind::Stretch, 66_667, 120).unwrap_err();
    assert!(e.to_string().contains("8000040 images"), "{e}");
    // the small case is untouched
    assert_eq!(basis::bends(&s, &[(1, 0, 2)]).unwrap().dim(), 1);
}
