//! The What-if overlay driven through `App` (no terminal): the picker's cursor, the lowering
//! shown and scrolled, applied only by `a`, undone by `u`; Esc leaves the session as it was.
//! Session: the shipped tetrahedral MX4 example (Td), whose stretches are A1 + T2; Td holds
//! C3v one way (Cotton, ch. 9: the stretches go to 2A1 + E).

use salcdesk::session;
use salcdesk::tui::app::Mode;
use salcdesk::tui::keymap::{Code, Key};
use salcdesk::tui::whatif::WhatIfView;
use salcdesk::tui::App;
use std::path::Path;

fn app() -> App {
    let p = Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions/tetrahedral-mx4.toml");
    let s = session::load_file(&p).expect("example session");
    App::new(s, None, false, false)
}

fn view(a: &App) -> WhatIfView {
    match &a.mode {
        Mode::WhatIf(v) => (**v).clone(),
        m => panic!("no What-if overlay: {m:?}"),
    }
}

#[test]
fn lowering_is_looked_at_then_applied_and_undone() {
    let mut a = app();
    let before = a.session.clone();
    a.handle_key(Key::ch('L'));
    let WhatIfView::Pick { ways, cursor } = view(&a) else {
        panic!("the picker first")
    };
    assert_eq!(cursor, 0);
    let c3v = ways
        .iter()
        .position(|w| w.subgroup == "C3v")
        .expect("Td holds C3v");
    for _ in 0..c3v {
        a.handle_key(Key::plain(Code::Down));
    }
    a.handle_key(Key::plain(Code::Enter));
    let WhatIfView::Lowered { lowering, scroll } = view(&a) else {
        panic!("the lowering after Enter")
    };
    assert_eq!((lowering.subgroup.as_str(), scroll), ("C3v", 0));
    let st = lowering
        .sets
        .iter()
        .find(|s| s.name == "M-X stretches")
        .unwrap();
    assert_eq!(st.before.as_deref(), Some("A1 + T2"));
    assert_eq!(st.after.as_deref(), Some("2A1 + E"));
    a.handle_key(Key::ch('j'));
    let WhatIfView::Lowered { scroll, .. } = view(&a) else {
        panic!()
    };
    assert_eq!(scroll, 1);
    // Looking changed nothing.
    assert_eq!(a.session, before);
    a.handle_key(Key::ch('a'));
    assert!(matches!(a.mode, Mode::Normal));
    assert_eq!(a.session.group.as_deref(), Some("C3v"));
    assert!(a.dirty());
    a.handle_key(Key::ch('u'));
    assert_eq!(a.session, before);

    // Esc closes without a change.
    a.handle_key(Key::ch('L'));
    a.handle_key(Key::plain(Code::Esc));
    assert!(matches!(a.mode, Mode::Normal));
    assert_eq!(a.session, before);
}

#[test]
fn replacing_an_atom_without_a_geometry_says_so() {
    let mut a = app();
    a.handle_key(Key::ch('R'));
    assert!(matches!(a.mode, Mode::Normal));
    let st = a.status.clone().expect("a message");
    assert!(st.error && st.text.contains("no geometry"), "{}", st.text);
}
