//! π SALCs (p⊥ orbitals) of the cyclic polyenes CnHn, n = 3 … 8.

#[path = "salc_support.rs"]
mod support;

use salcdesk::basis;
use salcdesk::exact::Notation;
use salcdesk::rep::format_sum;
use salcdesk::salc;
use support::*;

fn ring(n: usize) -> basis::Structure {
    let group = format!("D{n}h");
    // carbon atoms on the x axis ray and its images (regular n-gon in the xy plane)
    orbit_molecule(&group, &[("C", [1.4, 0.0, 0.0]), ("H", [2.5, 0.0, 0.0])])
}

#[test]
fn cyclic_polyenes() {
    for n in 3..=8 {
        let s = ring(n);
        let carbons: Vec<usize> = (0..s.len()).filter(|&a| s.atoms[a].symbol == "C").collect();
        assert_eq!(carbons.len(), n);
        let b = basis::p_perp(&s, &carbons).unwrap();
        let set = salc::salcs(&b).unwrap();
        check_laws(&b, &set);
        // Source: Cotton, 3rd ed., §10.4 (Hückel π of CnHn), from memory: the all-in-phase
        // combination 1/√n Σ pᵢ belongs to A2u (A2'' for odd n), and one SALC per carbon.
        let a2 = if n % 2 == 0 { "A2u" } else { "A2''" };
        let all: Vec<String> = set
            .salcs
            .iter()
            .filter(|c| c.label == a2)
            .map(|c| salc::salc_text(c, &set.members, Notation::Ascii))
            .collect();
        let sum: Vec<String> = (1..=n).map(|k| format!("p{k}")).collect();
        let factor = match n {
            4 => "1/2".to_string(),
            _ => format!("1/sqrt({n})"),
        };
        assert_eq!(all, [format!("{factor} ({})", sum.join(" + "))], "n = {n}");
        assert_eq!(set.salcs.len(), n);
    }
}

#[test]
fn benzene_pi() {
    // Source: Cotton, 3rd ed., §10.4: Γπ(C6H6) = A2u + B2g + E1g + E2u (from memory).
    let s = ring(6);
    let carbons: Vec<usize> = (0..s.len()).filter(|&a| s.atoms[a].symbol == "C").collect();
    let b = basis::p_perp(&s, &carbons).unwrap();
    let m = b.multiplicities().unwrap();
    let text = format_sum(&s.group, &m, false);
    // the B label depends on whether C2' or C2'' passes through the atoms
    assert!(
        [
            "A2u + B2g + E1g + E2u",
            "B2g + E1g + A2u + E2u",
            "B1g + E1g + A2u + E2u"
        ]
        .contains(&text.as_str()),
        "{text}"
    );
}
