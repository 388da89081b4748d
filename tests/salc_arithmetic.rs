//! The SALC engine runs on machine integers over one cyclotomic field per irrep, on big
//! integers over that field where 128 bits overflow, and on [`Cyclo`] numbers only where
//! neither applies. All three arithmetics must give the very same
//! SALCs — same irreps, copies, partners, roles, exact coefficients and norms — on every site
//! type of every finite group (σ basis and Cartesian displacements), and on C60 stretches.
// Source: exactness of the projection/transfer-operator method, Cotton, Chemical Applications
// of Group Theory, 3rd ed., §4.5 and ch. 8; the comparison is between two exact paths, so any
// difference at all is a defect.

#[path = "salc_support.rs"]
mod support;

use salcdesk::basis::{self, Basis};
use salcdesk::salc::{self, Arithmetic, SalcSet};
use support::*;

fn same_salcs(b: &Basis, what: &str) {
    let fast = salc::salcs_on(b, &[], None, Arithmetic::Fastest)
        .unwrap_or_else(|e| panic!("{what} (integer form): {e}"));
    let big = salc::salcs_on(b, &[], None, Arithmetic::BigIntegers)
        .unwrap_or_else(|e| panic!("{what} (big integers): {e}"));
    let general = salc::salcs_on(b, &[], None, Arithmetic::General)
        .unwrap_or_else(|e| panic!("{what} (general): {e}"));
    // small cases never overflow 128 bits: every irrep ran on machine integers
    let ran = |s: &SalcSet, a: Arithmetic| s.arithmetic.iter().all(|(_, x)| *x == a);
    assert!(
        ran(&fast, Arithmetic::Fastest),
        "{what}: {:?}",
        fast.arithmetic
    );
    assert!(
        ran(&big, Arithmetic::BigIntegers),
        "{what}: {:?}",
        big.arithmetic
    );
    assert!(ran(&general, Arithmetic::General), "{what}");
    compare(&fast, &general, what);
    compare(&big, &general, &format!("{what}, big integers"));
}

fn compare(fast: &SalcSet, general: &SalcSet, what: &str) {
    assert_eq!(fast.multiplicities, general.multiplicities, "{what}");
    assert_eq!(fast.salcs.len(), general.salcs.len(), "{what}");
    for (x, y) in fast.salcs.iter().zip(&general.salcs) {
        let at = format!("{what} {} copy {} partner {}", x.label, x.copy, x.partner);
        assert_eq!(
            (x.irrep, x.copy, x.partner, x.role),
            (y.irrep, y.copy, y.partner, y.role),
            "{at}"
        );
        assert!(
            x.coefficients == y.coefficients,
            "{at}: coefficients differ"
        );
        assert!(x.norm2 == y.norm2, "{at}: norm² differs");
    }
}

#[test]
fn both_arithmetics_give_the_same_salcs_on_every_site_of_every_group() {
    let cases = for_every_site_case(|name, site, s| {
        let ligands: Vec<usize> = (1..s.len()).collect();
        let sigma = basis::sigma(s, 0, &ligands).unwrap();
        same_salcs(&sigma, &format!("{name} {site} σ"));
        same_salcs(&basis::cartesian(s).unwrap(), &format!("{name} {site} xyz"));
    });
    assert!(cases > 100, "only {cases} site cases");
}

#[test]
fn both_arithmetics_give_the_same_c60_stretch_salcs() {
    let s = c60();
    same_salcs(&basis::stretches(&s, &s.bonds).unwrap(), "C60 stretches");
}
