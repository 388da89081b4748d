//! Where recovery files go (XDG base-directory specification: `$XDG_STATE_HOME`, default
//! `~/.local/state`, for state that should survive a restart): the demo's in the state folder,
//! a session's beside it, and — when its folder cannot be written — in the state folder under
//! a name that the next start of the same session finds again. One test, because it changes
//! this process's environment.

mod common;

use common::TempDir;
use salcdesk::session::{self, Recovery};

#[test]
fn recovery_files_go_to_the_state_folder_when_they_cannot_go_beside_the_session() {
    let dir = TempDir::new("recovery-places");
    let home = dir.join("home");
    let xdg = dir.join("xdg-state");
    std::env::remove_var("SALCDESK_STATE_DIR");
    std::env::remove_var("SALCDESK_CACHE_DIR");
    std::env::set_var("HOME", &home);

    // $XDG_STATE_HOME/salcdesk, else ~/.local/state/salcdesk; a relative XDG_STATE_HOME is
    // ignored, as the specification says.
    std::env::set_var("XDG_STATE_HOME", &xdg);
    assert_eq!(session::state_dir(), xdg.join("salcdesk"));
    assert_eq!(
        session::demo_recovery_path(),
        xdg.join("salcdesk").join("demo.recovery")
    );
    std::env::set_var("XDG_STATE_HOME", "relative/state");
    assert_eq!(
        session::state_dir(),
        home.join(".local").join("state").join("salcdesk")
    );
    std::env::remove_var("XDG_STATE_HOME");
    assert_eq!(
        session::state_dir(),
        home.join(".local").join("state").join("salcdesk")
    );
    std::env::set_var("XDG_STATE_HOME", &xdg);

    // The demo: written into the state folder, created as needed.
    let demo = session::demo();
    let mut edited = demo.clone();
    edited.title.push_str(" (edited)");
    let mut r = Recovery::for_session(None);
    r.write(&edited).unwrap();
    assert_eq!(r.path, xdg.join("salcdesk").join("demo.recovery"));
    assert_eq!(
        Recovery::for_session(None).pending(&demo),
        Some(edited.clone())
    );

    // A session in a folder that cannot be written (here: "inside" a regular file, which
    // fails even for root): the edits go to the state folder, and are found from there.
    let blocker = dir.join("not-a-folder");
    std::fs::write(&blocker, "a file").unwrap();
    let p = blocker.join("x.toml");
    let mut r = Recovery::for_session(Some(&p));
    assert_eq!(r.path, blocker.join(".x.toml.recovery"));
    r.write(&edited).unwrap();
    assert_eq!(r.path, session::fallback_recovery_path(&p));
    assert!(r.path.starts_with(xdg.join("salcdesk")));
    let again = Recovery::for_session(Some(&p));
    assert_eq!(again.path, r.path);
    assert_eq!(again.pending(&demo), Some(edited.clone()));

    // Two sessions of the same name in different folders do not share a fallback file.
    let other = dir.join("elsewhere").join("x.toml");
    assert_ne!(session::fallback_recovery_path(&other), r.path);

    // When the state folder cannot be written either, the error says both, and nothing
    // panics.
    std::env::set_var("XDG_STATE_HOME", blocker.join("state"));
    let mut r = Recovery::for_session(Some(&blocker.join("y.toml")));
    let e = r.write(&edited).unwrap_err();
    assert!(e.contains("not-a-folder"), "{e}");
    let mut d = Recovery::for_session(None);
    assert!(d.write(&edited).is_err());
}
