//! Bad input gives a typed error, never a panic: arbitrary text into every reader of the
//! spectroscopy layer.

use proptest::prelude::*;
use salcdesk::group::load;
use salcdesk::spectra::{descend_names, parse_bands, parse_fundamentals, parse_gamma};

fn texty() -> impl Strategy<Value = String> {
    // Mostly characters that occur in the formats, plus anything.
    prop_oneof!["[0-9A-Za-z ,;\t\n#+\\-.()'′″ΣΠΔσ₁⁺]{0,60}", any::<String>(),]
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(300))]

    #[test]
    fn band_reader_never_panics(text in texty()) {
        let _ = parse_bands("p", &text);
        let _ = parse_fundamentals("p", &text);
    }

    #[test]
    fn gamma_reader_never_panics(text in texty()) {
        for name in ["Td", "C3", "Dinfh"] {
            let g = load(name).unwrap();
            if let Ok(rows) = parse_gamma(&g, &text) {
                prop_assert_eq!(rows.len(), g.table.irreps.len());
            }
        }
    }

    #[test]
    fn via_never_panics(via in texty()) {
        let _ = descend_names("D4h", "C2v", Some(&via), None);
    }
}
