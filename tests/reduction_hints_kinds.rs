//! Hints for impossible characters respect the kind of set they came from: a set of n members
//! leaves 0 … n of them in place (all n under E), each unmoved member contributing 1
//! (permutation sets: stretches, bends, scalars), the trace of R (Cartesian triples),
//! trace − 1 (π pairs) or det·trace (axial triples) (Cotton, 3rd ed., §10.2). Checked for
//! every finite group and every kind, with the per-member values computed here from the
//! operation matrices.

use salcdesk::exact::Cyclo;
use salcdesk::group::{load, mat_det, mat_trace, names, PointGroup};
use salcdesk::rep::{self, Character, MemberKind};

fn per_member(g: &PointGroup, class: usize, kind: MemberKind) -> Cyclo {
    let op = g.ops.iter().find(|o| o.class == class).unwrap();
    let tr = mat_trace(&op.matrix);
    let det = mat_det(&op.matrix);
    match kind {
        MemberKind::Stretch => Cyclo::one(),
        MemberKind::Cartesian => tr,
        MemberKind::Pi => &tr - &Cyclo::one(),
        MemberKind::Axial => &det * &tr,
    }
}

fn chi_of(g: &PointGroup, m: &[u64]) -> Vec<Cyclo> {
    rep::from_multiplicities(g, m).0
}

#[test]
fn hints_stay_within_what_the_set_can_give() {
    let kinds = [
        MemberKind::Stretch,
        MemberKind::Cartesian,
        MemberKind::Pi,
        MemberKind::Axial,
    ];
    let mut checked = 0;
    for name in names() {
        let g = load(name).unwrap();
        if g.is_linear() {
            continue;
        }
        let h = g.order() as i64;
        for kind in kinds {
            // n = h members, none left in place except under E (a regular set), then one
            // class made to leave one member in place: mostly not a representation.
            for c in 1..g.n_classes() {
                let mut counts = vec![0i64; g.n_classes()];
                counts[0] = h;
                counts[c] = 1;
                let err = match rep::decompose_unmoved(&g, &counts, kind) {
                    Ok(_) => continue,
                    Err(e) => e,
                };
                let from = Character::from_unmoved(&g, &counts, kind).unwrap();
                for s in &err.suggestions {
                    let (was, now) = s.unmoved.expect("a count-based hint");
                    assert_eq!(was, counts[s.class]);
                    assert!(s.class != 0, "{name}: E must keep all members");
                    assert!((0..=h).contains(&now), "{name} {kind:?}: count {now}");
                    let want = &per_member(&g, s.class, kind) * &Cyclo::from_int(now);
                    assert_eq!(s.to, want, "{name} {kind:?}");
                    assert_eq!(s.from, from.0[s.class]);
                    if kind == MemberKind::Stretch {
                        let v = s.to.to_integer().expect("a count is an integer");
                        assert!(v >= 0.into() && v <= h.into(), "{name}: χ = {v}");
                    }
                    let (re, im) = s.to.to_c64();
                    assert!(re.hypot(im) <= from.0[0].re_f64() + 1e-9);
                    // The multiplicities reproduce the suggested character.
                    let mut trial = from.0.clone();
                    trial[s.class] = s.to.clone();
                    assert_eq!(chi_of(&g, &s.multiplicities), trial, "{name} {kind:?}");
                }
                checked += 1;
                break;
            }
        }
    }
    assert!(checked > 150, "{checked}");
}

#[test]
fn the_stretch_example_gets_no_negative_count() {
    // C3v, three stretches (Cotton, 3rd ed., §10.2: χ = 3, 0, 1 for NH3's N–H stretches):
    // ticks giving 3, 0, 0 are impossible; the hint is one stretch unmoved by σv (χ = 1,
    // A1 + E), never χ(σv) = −1.
    let g = load("C3v").unwrap();
    let err = rep::decompose_unmoved(&g, &[3, 0, 0], MemberKind::Stretch).unwrap_err();
    assert!(!err.suggestions.is_empty());
    for s in &err.suggestions {
        assert!(!s.to.to_integer().unwrap().lt(&0.into()), "{:?}", s.to);
    }
    let a1 = g.table.irrep_index("A1").unwrap();
    let e = g.table.irrep_index("E").unwrap();
    assert!(err
        .suggestions
        .iter()
        .any(|s| s.to == Cyclo::one() && s.multiplicities[a1] == 1 && s.multiplicities[e] == 1));
    // The command line with --unmoved says the same.
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_salcdesk"))
        .args([
            "reduce",
            "C3v",
            "--unmoved",
            "3",
            "0",
            "0",
            "--kind",
            "stretch",
            "--ascii",
        ])
        .output()
        .unwrap();
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains("hint: chi(3sv) = 1 instead of 0"), "{text}");
    assert!(!text.contains("= -1 instead"), "{text}");
}

#[test]
fn plain_character_hints_stay_within_the_dimension() {
    // |χ(R)| ≤ χ(E) for any representation (χ(R) is a sum of χ(E) roots of unity).
    for name in names() {
        let g = load(name).unwrap();
        if g.is_linear() {
            continue;
        }
        let mut chi = vec![Cyclo::zero(); g.n_classes()];
        chi[0] = Cyclo::from_int(2);
        if g.n_classes() > 1 {
            chi[1] = Cyclo::one();
        }
        for s in rep::suggest(&g, &Character(chi.clone())) {
            let (re, im) = s.to.to_c64();
            if s.class != 0 {
                assert!(re.hypot(im) <= 2.0 + 1e-9, "{name}: {:?}", s.to);
            }
        }
    }
}
