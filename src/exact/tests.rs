//! Unit tests of exact arithmetic, parsing and printing.
use super::*;

fn p(s: &str) -> Cyclo {
    parse(s).unwrap_or_else(|e| panic!("{s}: {e}"))
}

#[test]
fn golden_ratio_identities() {
    // Source: textbook facts, 2cos(2π/5) = (√5 − 1)/2 and 2cos(4π/5) = −(1 + √5)/2.
    assert_eq!(p("2cos(2pi/5)"), p("(sqrt(5)-1)/2"));
    assert_eq!(p("2cos(4pi/5)"), p("-(1+sqrt(5))/2"));
    // φ² = φ + 1
    let phi = p("(1+sqrt(5))/2");
    assert_eq!(&phi * &phi, &phi + &Cyclo::one());
}

#[test]
fn cube_roots_of_unity() {
    // ε = exp(2πi/3): 1 + ε + ε² = 0, ε* = ε².
    let e = p("exp(2pi i/3)");
    assert!((Cyclo::one() + &e + &e * &e).is_zero());
    assert_eq!(e.conj(), &e * &e);
    assert_eq!(e.re(), Cyclo::frac(-1, 2));
    assert_eq!(&e.im() * &e.im(), Cyclo::frac(3, 4));
}

#[test]
fn square_roots_are_exact() {
    for q in [2i64, 3, 5, 6, 7, 8, 10, 12, 15, 18, 21, 50] {
        let r = sqrt_rational(&num_rational::BigRational::from_integer(q.into())).unwrap();
        assert_eq!(&r * &r, Cyclo::from_int(q), "√{q}");
        assert!(r.re_f64() > 0.0);
        assert!((r.re_f64() - (q as f64).sqrt()).abs() < 1e-12);
    }
    // sin(2π/5) = √(10+2√5)/4 — a nested root that is still cyclotomic. Source: textbook fact.
    let s = p("sin(2pi/5)");
    assert_eq!(p("sqrt(10+2sqrt(5))/4"), s);
}

#[test]
fn cos_of_seventh_and_sixteenth_turns() {
    // Σ_{k=1}^{3} 2cos(2πk/7) = −1 (sum of the nontrivial 7th roots of unity).
    let s = p("2cos(2pi/7)") + p("2cos(4pi/7)") + p("2cos(6pi/7)");
    assert_eq!(s, Cyclo::from_int(-1));
    // 2cos(π/8) = √(2+√2)
    assert_eq!(p("2cos(pi/8)"), p("sqrt(2+sqrt(2))"));
    assert!((p("cos(2pi/8)").re_f64() - 0.5f64.sqrt()).abs() < 1e-12);
}

#[test]
fn inverse_and_division() {
    let x = p("1+2cos(2pi/7)");
    let y = x.inv().unwrap();
    assert!((x * y).is_one());
    assert!(Cyclo::zero().inv().is_none());
    assert_eq!(p("1/sqrt(2)"), p("sqrt(2)/2"));
}

#[test]
fn integer_tests() {
    assert!(p("4/2").is_integer());
    assert!(!p("1/2").is_integer());
    assert!(p("2cos(2pi/3)*2").is_integer());
    assert!(!p("sqrt(2)").is_integer());
    assert_eq!(p("(sqrt(3))^2").to_i64(), Some(3));
    assert_eq!(p("0.25"), Cyclo::frac(1, 4));
}

#[test]
fn printing_is_readable() {
    let cases = [
        ("-1", "−1", "-1"),
        ("1/2", "1/2", "1/2"),
        ("(1+sqrt(5))/2", "(1+√5)/2", "(1+sqrt(5))/2"),
        ("2cos(4pi/5)", "(−1−√5)/2", "(-1-sqrt(5))/2"),
        ("sqrt(2)", "√2", "sqrt(2)"),
        ("-sqrt(3)/2", "−√3/2", "-sqrt(3)/2"),
        ("exp(2pi i/3)", "exp(2πi/3)", "exp(2pi i/3)"),
        ("exp(-2pi i/3)", "exp(−2πi/3)", "exp(-2pi i/3)"),
        ("-exp(2pi i/3)", "−exp(2πi/3)", "-exp(2pi i/3)"),
        ("i", "i", "i"),
        ("-i", "−i", "-i"),
        ("2cos(2pi/7)", "2cos(2π/7)", "2cos(2pi/7)"),
        ("sqrt(2+sqrt(2))", "2cos(π/8)", "2cos(pi/8)"),
    ];
    for (src, uni, ascii) in cases {
        let x = p(src);
        assert_eq!(x.text(Notation::Unicode), uni, "unicode of {src}");
        assert_eq!(x.text(Notation::Ascii), ascii, "ascii of {src}");
    }
}

#[test]
fn print_parse_round_trip() {
    let srcs = [
        "0",
        "7",
        "-3/4",
        "sqrt(6)",
        "(1-sqrt(5))/4",
        "exp(2pi i/5)",
        "exp(4pi i/5)",
        "exp(2pi i/7)",
        "2cos(2pi/7)-1",
        "sqrt(2)+sqrt(3)",
        "1+i",
        "sqrt(3)/2*i + 1/2",
        "2cos(pi/8)+1",
        "exp(2pi i/8)",
        "-exp(2pi i/5)",
        "3*2cos(6pi/7)",
        "sqrt(5)*i",
        "sin(pi/12)",
        "cos(2pi/16)",
        "exp(pi i/6)",
    ];
    for s in srcs {
        let x = p(s);
        for nt in [Notation::Unicode, Notation::Ascii] {
            let t = x.text(nt);
            let back = parse(&t).unwrap_or_else(|e| panic!("{s} printed as {t}: {e}"));
            assert_eq!(back, x, "{s} printed as {t}");
        }
    }
}

#[test]
fn parse_errors_have_columns() {
    let e = parse("1 + ").unwrap_err();
    assert_eq!(e.column, 5);
    let e = parse("cos(2)").unwrap_err();
    assert!(e.message.contains("multiple of pi"), "{e}");
    assert!(parse("2 pi").is_err());
    assert!(parse("phi").is_err());
    assert!(parse("1/0").is_err());
    assert!(parse("abc").is_err());
    assert!(parse("").is_err());
    assert!(parse("(1").is_err());
    assert!(parse("2^99999999999999999999").is_err());
}

#[test]
fn phi_in_linear_groups() {
    let q = num_rational::BigRational::new(1.into(), 2.into());
    assert_eq!(
        parse_with_phi("2cos(phi)", Some(&q)).unwrap(),
        Cyclo::from_int(-2)
    );
    assert_eq!(
        parse_with_phi("2cos(2phi)", Some(&q)).unwrap(),
        Cyclo::from_int(2)
    );
}

#[test]
fn decimals() {
    assert_eq!(p("(sqrt(5)-1)/2").decimal(), "0.618034");
    assert_eq!(p("exp(2pi i/3)").decimal(), "-0.5+0.866025i");
}

#[test]
fn typed_numbers_stay_in_fields_we_can_print() {
    // Found by fuzzing: √623 needs Q(ζ₂₄₉₂) and printing it took minutes; products of far
    // roots of unity asked for gigabytes. Both are refused with the field they would need.
    for (s, n) in [
        ("sqrt(623)", "2492"),
        ("sqrt(1999)", "7996"),
        ("exp(2pi i/7)*exp(2pi i/31)", "217"),
        ("2cos(2pi/13) + 2cos(2pi/17)", "221"),
    ] {
        let e = crate::exact::parse(s).unwrap_err().to_string();
        assert!(e.contains(&format!("{n}th roots")), "{s}: {e}");
    }
    assert!(crate::exact::parse("2cos(2pi/997)").is_err());
    // What the tables and SALC norms need still reads: √5, √77 (in Q(ζ₇₇)), ζ₁₂₀·√3.
    for s in [
        "sqrt(5)",
        "sqrt(77)",
        "exp(2pi i/120)*sqrt(3)",
        "2cos(2pi/179)",
    ] {
        let x = p(s);
        assert_eq!(
            crate::exact::parse(&x.text(crate::exact::Notation::Ascii)).unwrap(),
            x
        );
    }
}

#[test]
fn nested_roots_without_cyclotomic_value_are_refused_by_proof() {
    // 3 ± √2 multiply to 7 and √7 ∉ Q(ζ₈), so √(3+√2) is not cyclotomic (Kummer theory,
    // Lang, Algebra, VI §8); likewise (1+√5)·(1−√5) = −4 is no square in Q(ζ₅) (needs i).
    for s in [
        "sqrt(3+sqrt(2))",
        "sqrt(1+sqrt(5))",
        "sqrt(5+sqrt(3))",
        "sqrt(2+sqrt(7))",
    ] {
        assert!(parse(s).is_err(), "{s} has no cyclotomic value");
    }
    // The nested roots that are cyclotomic still come out (textbook values of cos and sin).
    assert_eq!(p("sqrt(2+sqrt(2))"), p("2cos(pi/8)"));
    assert_eq!(p("sqrt(10+2sqrt(5))"), p("4sin(2pi/5)"));
    assert_eq!(p("sqrt((5+sqrt(5))/2)"), p("2sin(2pi/5)"));
}

#[test]
fn square_roots_of_many_small_primes_are_refused_quickly() {
    // 2·3·5·7·11·13 = 30030: each prime is small, the field of the root is not.
    let q = num_rational::BigRational::from_integer(30030.into());
    assert!(matches!(sqrt_rational(&q), Err(SqrtError::TooLarge(_))));
    assert!(sqrt_rational(&num_rational::BigRational::from_integer(36.into())).is_ok());
}

mod fast_path_props {
    // The 64-bit fast paths of rational arithmetic must give exactly what big rationals give
    // (num-rational is the general path), and the coefficient-proportionality test of
    // `rational_ratio` must agree with division and a rationality check.
    use super::super::rat::Rat;
    use super::*;
    use num_bigint::BigInt;
    use num_rational::BigRational;
    use proptest::prelude::*;

    fn big(n: i64, d: i64) -> BigRational {
        BigRational::new(BigInt::from(n), BigInt::from(d))
    }

    proptest! {
        #[test]
        fn rat_ops_match_big_rationals(a in any::<i64>(), b in 1i64..i64::MAX, c in any::<i64>(), d in 1i64..i64::MAX) {
            let (x, y) = (Rat::from_big(big(a, b)), Rat::from_big(big(c, d)));
            prop_assert_eq!((&x * &y).to_big(), big(a, b) * big(c, d));
            prop_assert_eq!((&x + &y).to_big(), big(a, b) + big(c, d));
            prop_assert_eq!((&x - &y).to_big(), big(a, b) - big(c, d));
            if a != 0 {
                prop_assert_eq!(x.recip().to_big(), big(b, a));
            }
        }

        #[test]
        fn rational_ratio_matches_division(n in prop::sample::select(vec![1u32, 3, 4, 5, 7, 8, 12]),
                                           k in 0i64..12, j in 0i64..12, p in -9i64..9, q in 1i64..9) {
            let f = Cyclo::zeta(n, k) + Cyclo::from_int(2);
            let v = &(&f * &Cyclo::frac(p, q)) + &(Cyclo::zeta(n, j) * Cyclo::from_int(j % 2));
            let by_division = (&v / &f).to_rational();
            prop_assert_eq!(v.rational_ratio(&f), by_division);
        }
    }
}

/// The fast integer-form paths (one denominator per number, checked 128-bit integers) give the
/// very same coefficients as the general coefficient-by-coefficient path, on random numbers of
/// the fields point groups use, including parts too large for the fast path (which must then
/// decline, never wrap).
mod fast_path_agrees {
    use super::super::cyclo::{multiply_general, multiply_small};
    use super::super::poly::{reduce, reduce_general, totient};
    use super::super::rat::Rat;
    use proptest::prelude::*;

    const FIELDS: [u32; 12] = [3, 4, 5, 7, 8, 9, 12, 15, 16, 20, 24, 28];

    fn rat() -> impl Strategy<Value = Rat> {
        prop_oneof![
            4 => (-60i64..=60, 1i64..=12).prop_map(|(n, d)| Rat::from_i128(n as i128, d as i128)),
            1 => (any::<i64>(), 1i64..=i64::MAX).prop_map(|(n, d)| Rat::from_i128(n as i128, d as i128)),
            1 => Just(Rat::ZERO),
        ]
    }

    fn element() -> impl Strategy<Value = (u32, Vec<Rat>, Vec<Rat>)> {
        proptest::sample::select(FIELDS.to_vec()).prop_flat_map(|n| {
            let k = totient(n);
            (
                Just(n),
                proptest::collection::vec(rat(), k),
                proptest::collection::vec(rat(), k),
            )
        })
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(400))]
        #[test]
        fn products((n, a, b) in element()) {
            let general = multiply_general(&a, &b, n);
            if let Some(fast) = multiply_small(&a, &b, n) {
                prop_assert_eq!(fast.to_vec(), general.to_vec());
            }
        }

        #[test]
        fn reductions(n in proptest::sample::select(FIELDS.to_vec()),
                      dense in proptest::collection::vec(rat(), 1..60)) {
            let fast = reduce(dense.clone(), n);
            let general = reduce_general(dense, n);
            prop_assert_eq!(fast.to_vec(), general);
        }
    }
}

/// The integer-form vectors ([`super::KVec`], on i128 and on big integers) give the same
/// numbers as [`Cyclo`] arithmetic:
/// products, dot products, v − s·w and the lift from a subfield, on random vectors of the
/// fields point groups use (their composita too: Q(ζ₆₀) holds √3 and √5), with parts large
/// enough that 128-bit arithmetic must sometimes decline (then `None`, never a wrong number).
// Reference: the crate's Cyclo arithmetic (the general path above), compared exactly —
// differential testing of two exact implementations, common practice.
mod vectors_agree {
    use super::super::poly::totient;
    use super::super::{Cyclo, KField, KInt, KVec};
    use num_bigint::BigInt;
    use num_rational::BigRational;
    use proptest::prelude::*;

    const FIELDS: [u32; 14] = [1, 3, 4, 5, 7, 8, 9, 12, 15, 16, 20, 24, 28, 60];

    /// A random element of Q(ζₘ); with `big`, now and then a part of 64-bit size.
    fn number(m: u32, big: bool) -> impl Strategy<Value = Cyclo> {
        let k = totient(m);
        let part = prop_oneof![
            40 => (-40i64..=40, 1i64..=12),
            if big { 1 } else { 0 } => (any::<i64>(), 1i64..=i64::MAX),
            15 => Just((0, 1)),
        ];
        proptest::collection::vec(part, k).prop_map(move |ps| {
            // Σ cⱼ ζₘʲ built with the public operations
            ps.iter()
                .enumerate()
                .map(|(j, (p, q))| {
                    Cyclo::from_rational(BigRational::new(BigInt::from(*p), BigInt::from(*q)))
                        * Cyclo::zeta(m, j as i64)
                })
                .sum()
        })
    }

    /// A field n and vectors whose entries lie in subfields of it.
    fn vectors(big: bool) -> impl Strategy<Value = (u32, Vec<Cyclo>, Vec<Cyclo>, Cyclo)> {
        proptest::sample::select(FIELDS.to_vec()).prop_flat_map(move |n| {
            let subs: Vec<u32> = (1..=n).filter(|m| n % m == 0 && m % 4 != 2).collect();
            let entry = proptest::sample::select(subs).prop_flat_map(move |m| number(m, big));
            (
                Just(n),
                proptest::collection::vec(entry.clone(), 1..6),
                proptest::collection::vec(entry.clone(), 6),
                entry,
            )
        })
    }

    /// Same numbers as Cyclo arithmetic on integers `I`; with `never_declines` (small parts
    /// on i128, or big integers) every step must succeed.
    fn agree<I: KInt>(
        n: u32,
        a: &[Cyclo],
        b: &[Cyclo],
        s: &Cyclo,
        never_declines: bool,
    ) -> Result<(), TestCaseError> {
        let f = KField::get(n);
        let b = &b[..a.len()];
        let (Some(ka), Some(kb)) = (KVec::<I>::from_cyclos(&f, a), KVec::<I>::from_cyclos(&f, b))
        else {
            prop_assert!(!never_declines, "declined");
            return Ok(()); // declined: parts beyond 128 bits
        };
        prop_assert!(ka.to_cyclos(&f) == a);
        let d = ka.dot(&kb, &f);
        prop_assert!(d.is_some() || !never_declines, "dot declined");
        if let Some((dn, dd)) = ka.dot_in(&kb, &f) {
            // in lowest terms: the next product (Gram–Schmidt's scalar) stays within 128 bits
            let g = super::super::gcd_of(std::iter::once(&dd).chain(&dn));
            prop_assert!(
                g.is_one(),
                "dot product not in lowest terms: {dn:?} / {dd:?}"
            );
        }
        if let Some(d) = d {
            let exact: Cyclo = a.iter().zip(b).map(|(x, y)| x * y).sum();
            prop_assert!(d == exact);
        }
        let mut kc = ka.clone();
        let done = kc.sub_scaled(s, &kb, &f);
        prop_assert!(done.is_some() || !never_declines, "update declined");
        if done.is_some() {
            let exact: Vec<Cyclo> = a.iter().zip(b).map(|(x, y)| x - &(s * y)).collect();
            prop_assert!(kc.to_cyclos(&f) == exact);
        }
        Ok(())
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(300))]
        #[test]
        fn small_numbers((n, a, b, s) in vectors(false)) {
            agree::<i128>(n, &a, &b, &s, true)?;
            agree::<BigInt>(n, &a, &b, &s, true)?;
        }

        #[test]
        fn with_64_bit_parts((n, a, b, s) in vectors(true)) {
            agree::<i128>(n, &a, &b, &s, false)?;
            agree::<BigInt>(n, &a, &b, &s, true)?;
        }
    }
}

/// The real subfields ([`super::FieldSpec::RealPart`], [`super::FieldSpec::Roots`]) as fields
/// of their own give the same numbers as [`Cyclo`] arithmetic: round trip, dot products,
/// v − s·w, products and inverses, on random real numbers of Q(ζₙ + ζₙ⁻¹) (x + x̄ for random x)
/// and of Q(√d₁, √d₂) (rational combinations of the roots), on i128 and on big integers; and a
/// number outside the subfield is refused, never misread.
// Reference: the crate's Cyclo arithmetic, compared exactly (differential testing, common
// practice); membership facts: ζₙ is not real; 2cos(2π/60) ∉ Q(√3, √5) (it has degree 8 over
// Q, the degree φ(60)/2 of the real subfield it generates — Washington, *Introduction to
// Cyclotomic Fields*, Prop. 2.16).
mod subfields_agree {
    use super::super::poly::totient;
    use super::super::subfield::{candidates, FieldSpec};
    use super::super::{sqrt_rational, Cyclo, KField, KInt, KVec};
    use num_bigint::BigInt;
    use num_rational::BigRational;
    use proptest::prelude::*;

    const HOMES: [u32; 10] = [5, 7, 8, 9, 12, 16, 20, 24, 28, 60];

    fn rational() -> impl Strategy<Value = Cyclo> {
        prop_oneof![
            3 => (-30i64..=30, 1i64..=9).prop_map(|(p, q)| Cyclo::frac(p, q)),
            1 => Just(Cyclo::zero()),
        ]
    }

    /// A random real number of the subfield `spec`.
    fn number(spec: FieldSpec) -> BoxedStrategy<Cyclo> {
        match spec {
            FieldSpec::Roots(_, ds) => {
                // Σ q_S·√(Π_{d∈S} d) over the subsets S of the generators
                let terms: Vec<Cyclo> = (0..1u32 << ds.len())
                    .map(|mask| {
                        ds.iter()
                            .enumerate()
                            .filter(|(i, _)| mask & (1 << i) != 0)
                            .map(|(_, &d)| {
                                sqrt_rational(&BigRational::from_integer(BigInt::from(d)))
                                    .expect("small roots are cyclotomic")
                            })
                            .fold(Cyclo::one(), |a, b| &a * &b)
                    })
                    .collect();
                proptest::collection::vec(rational(), terms.len())
                    .prop_map(move |qs| qs.iter().zip(&terms).map(|(q, t)| q * t).sum())
                    .boxed()
            }
            spec => {
                let n = spec.home();
                proptest::collection::vec(rational(), totient(n))
                    .prop_map(move |qs| {
                        let x: Cyclo = qs
                            .iter()
                            .enumerate()
                            .map(|(j, q)| q * &Cyclo::zeta(n, j as i64))
                            .sum();
                        &x + &x.conj()
                    })
                    .boxed()
            }
        }
    }

    fn specs() -> Vec<FieldSpec> {
        HOMES
            .iter()
            .flat_map(|&n| candidates(n))
            .filter(|s| !matches!(s, FieldSpec::Cyclotomic(_)))
            .collect()
    }

    #[allow(clippy::type_complexity)]
    fn cases() -> impl Strategy<Value = (FieldSpec, Vec<Cyclo>, Vec<Cyclo>, Cyclo)> {
        proptest::sample::select(specs()).prop_flat_map(|spec| {
            let x = number(spec.clone());
            (
                Just(spec),
                proptest::collection::vec(x.clone(), 1..5),
                proptest::collection::vec(x.clone(), 5),
                x,
            )
        })
    }

    fn agree<I: KInt>(
        f: &KField,
        a: &[Cyclo],
        b: &[Cyclo],
        s: &Cyclo,
        never_declines: bool,
    ) -> Result<(), TestCaseError> {
        let b = &b[..a.len()];
        let ka = KVec::<I>::from_cyclos(f, a).expect("small numbers of the field");
        let kb = KVec::<I>::from_cyclos(f, b).expect("small numbers of the field");
        prop_assert!(ka.to_cyclos(f) == a);
        let exact: Cyclo = a.iter().zip(b).map(|(x, y)| x * y).sum();
        prop_assert!(ka.dot(&kb, f).expect("small") == exact);
        let mut kc = ka.clone();
        kc.sub_scaled(s, &kb, f).expect("small");
        let exact: Vec<Cyclo> = a.iter().zip(b).map(|(x, y)| x - &(s * y)).collect();
        prop_assert!(kc.to_cyclos(f) == exact);
        // products and inverses of single numbers
        let mut sn = vec![I::zero(); f.phi()];
        let sd = f.elem_of(s, &mut sn).expect("in the field");
        let an = ka.entry(0, f.phi()).to_vec();
        let (pn, pd) = f.mul(&an, &ka.den, &sn, &sd).expect("small");
        prop_assert!(f.cyclo_of(&pn, &pd) == &a[0] * s);
        if !s.is_zero() {
            // the inverse of a number of degree 8 may outgrow 128 bits (declined, never wrong)
            match f.inverse(&sn, &sd) {
                Some((inn, ind)) => {
                    prop_assert!(f.cyclo_of(&inn, &ind) == s.inv().expect("nonzero"))
                }
                None => prop_assert!(!never_declines, "inverse declined"),
            }
        }
        Ok(())
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(200))]
        #[test]
        fn same_numbers_as_cyclo((spec, a, b, s) in cases()) {
            let f = KField::of(&spec).expect("the candidate fields can be built");
            prop_assert!(f.phi() < totient(spec.home()));
            agree::<i128>(&f, &a, &b, &s, f.phi() <= 4)?;
            agree::<BigInt>(&f, &a, &b, &s, true)?;
        }
    }

    #[test]
    fn numbers_outside_are_refused() {
        for spec in specs() {
            let f = KField::of(&spec).unwrap();
            let n = spec.home();
            // ζₙ is not real (n > 2)
            assert!(f.elem(&Cyclo::zeta(n, 1)).is_none(), "{spec:?}");
            let mut out = vec![BigInt::from(0); f.phi()];
            assert!(
                f.elem_of(&Cyclo::zeta(n, 1), &mut out).is_none(),
                "{spec:?}"
            );
        }
        let f = KField::of(&FieldSpec::Roots(60, vec![3, 5])).unwrap();
        let c = &Cyclo::zeta(60, 1) + &Cyclo::zeta(60, -1);
        assert!(f.elem(&c).is_none());
        // and what lies inside is taken: √15 = √3·√5
        let r15 = sqrt_rational(&BigRational::from_integer(BigInt::from(15))).unwrap();
        assert!(f.elem(&r15).is_some());
    }
}

/// Exact division by multiplication with the inverse of the odd part (machine integers) gives
/// the quotients plain division gives, for multiples of g of either sign up to the 64-bit range,
/// and for numbers beyond it (plain division then).
// Reference: integer division in the standard library (differential testing, common practice).
mod exact_division_agrees {
    use super::super::KInt;
    use proptest::prelude::*;

    proptest! {
        #[test]
        fn div_exact_all_matches_division(
            g in prop_oneof![1i128..=40, 1i128..=(1 << 40), Just(1i128 << 62), Just(i64::MAX as i128)],
            qs in proptest::collection::vec(prop_oneof![-1000i128..=1000, i64::MIN as i128..=i64::MAX as i128], 1..20),
            wide in any::<bool>(),
        ) {
            // x = q·g, kept within 64 bits unless `wide`
            let mut xs: Vec<i128> = qs
                .iter()
                .map(|&q| if wide { q * g } else { (q % (i64::MAX as i128 / g).max(1)) * g })
                .collect();
            let want: Vec<i128> = xs.iter().map(|x| x / g).collect();
            <i128 as KInt>::div_exact_all(&mut xs, &g);
            prop_assert_eq!(xs, want);
        }
    }
}
