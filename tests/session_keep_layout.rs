//! Saving keeps what the user wrote: load → edit → save leaves every comment and every
//! untouched line of the file byte for byte, and reloading gives the edited session. Run on
//! every example session in `sessions/` with several kinds of edit, and on a hand-written file
//! with comments, odd spacing and its own key order.

use salcdesk::session::{self, parse, Band, Member, Session, Technique};
use std::path::{Path, PathBuf};

fn examples() -> Vec<PathBuf> {
    let mut v: Vec<PathBuf> =
        std::fs::read_dir(Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions"))
            .expect("sessions folder")
            .flatten()
            .map(|e| e.path())
            .filter(|p| p.extension().and_then(|e| e.to_str()) == Some("toml"))
            .collect();
    v.sort();
    assert!(v.len() >= 5, "the five example sessions");
    v
}

fn tmpdir(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("salcdesk-keep-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap();
    d
}

/// Lines holding a comment (a `#` outside any string is all these files have).
fn comment_lines(text: &str) -> Vec<&str> {
    text.lines()
        .filter(|l| {
            let t = l.trim_start();
            t.starts_with('#') || l.contains(" # ") || l.contains("  #")
        })
        .collect()
}

type Edit = (&'static str, fn(&mut Session));

/// Edits a user makes, each touching one part of the file.
fn edits() -> Vec<Edit> {
    vec![
        ("retitle", |s| s.title = "Edited & renamed: 50% done".into()),
        ("tick", |s| {
            let set = &mut s.sets[0];
            let m = &mut set.members[0];
            m.unmoved_by.push("i".into());
        }),
        ("add member", |s| {
            s.sets[0].members.push(Member::new("extra1"));
        }),
        ("drop last set", |s| {
            s.sets.pop();
        }),
        ("add band", |s| {
            s.bands.push(Band {
                position: 1234.5,
                technique: Technique::Ir,
                intensity: "w".into(),
                polarization: None,
                note: "added".into(),
            })
        }),
        ("notes", |s| s.notes.push_str("One more line of notes.\n")),
    ]
}

#[test]
fn saving_an_unchanged_session_gives_the_file_back_byte_for_byte() {
    let dir = tmpdir("same");
    for f in examples() {
        let text = std::fs::read_to_string(&f).unwrap();
        let s = session::load_file(&f).unwrap();
        let out = dir.join(f.file_name().unwrap());
        std::fs::write(&out, &text).unwrap();
        session::save(&s, &out).unwrap();
        assert_eq!(
            std::fs::read_to_string(&out).unwrap(),
            text,
            "{}",
            f.display()
        );
    }
}

#[test]
fn every_edit_of_every_example_keeps_comments_and_untouched_lines() {
    let dir = tmpdir("edits");
    for f in examples() {
        let text = std::fs::read_to_string(&f).unwrap();
        for (what, edit) in edits() {
            let mut s = session::load_file(&f).unwrap();
            edit(&mut s);
            let out = dir.join(f.file_name().unwrap());
            std::fs::write(&out, &text).unwrap();
            session::save(&s, &out).unwrap();
            let saved = std::fs::read_to_string(&out).unwrap();
            let again = parse("saved", &saved).unwrap_or_else(|e| panic!("{what}: {e}"));
            assert_eq!(again, s, "{} after '{what}'", f.display());
            for c in comment_lines(&text) {
                assert!(
                    saved.contains(c),
                    "{} after '{what}': lost comment line {c:?}\n{saved}",
                    f.display()
                );
            }
            // Everything outside the edited part stays as written.
            let kept = |line: &str| saved.lines().any(|l| l == line);
            let touched: &[&str] = match what {
                "retitle" => &["title ="],
                "tick" | "add member" => &["members =", "r1 =", "M =", "L1 ="],
                "drop last set" => &["*"],
                "notes" => &["*notes"],
                _ => &[],
            };
            if touched == ["*"] {
                continue;
            }
            let in_notes = notes_lines(&text);
            for line in text.lines() {
                let skip = touched.iter().any(|t| line.starts_with(t))
                    || (touched == ["*notes"] && in_notes.contains(&line));
                if !skip {
                    assert!(
                        kept(line),
                        "{} after '{what}': line {line:?} changed\n{saved}",
                        f.display()
                    );
                }
            }
        }
    }
}

/// The lines of the `notes = """…"""` value (and its closing line).
fn notes_lines(text: &str) -> Vec<&str> {
    let mut inside = false;
    let mut out = Vec::new();
    for l in text.lines() {
        if l.starts_with("notes = \"\"\"") {
            inside = true;
        }
        if inside {
            out.push(l);
            if l.trim_end().ends_with("\"\"\"")
                && !l.starts_with("notes = \"\"\"\"")
                && out.len() > 1
            {
                inside = false;
            }
        }
    }
    out
}

#[test]
fn retitling_changes_exactly_one_line() {
    for f in examples() {
        let text = std::fs::read_to_string(&f).unwrap();
        let mut s = parse("x", &text).unwrap();
        let old_line = text.lines().find(|l| l.starts_with("title =")).unwrap();
        s.title = "New \"quoted\" title".into();
        let saved = session::to_toml_keeping(Some(&text), &s);
        let before: Vec<&str> = text.lines().collect();
        let after: Vec<&str> = saved.lines().collect();
        assert_eq!(before.len(), after.len(), "{}", f.display());
        let differ: Vec<(&str, &str)> = before
            .iter()
            .zip(&after)
            .filter(|(a, b)| a != b)
            .map(|(a, b)| (*a, *b))
            .collect();
        assert_eq!(differ.len(), 1, "{}: {differ:?}", f.display());
        assert_eq!(differ[0].0, old_line);
        assert_eq!(parse("saved", &saved).unwrap(), s);
    }
}

const HAND_WRITTEN: &str = r#"# My PtCl4 work — written by hand
format   = 1
group = "D4h"     # square planar
title = 'Square-planar centre'

notes = """
First line.
Second line.
"""

# the two sets
[[set]]
kind = "stretch"   # bonds
name = "Pt-Cl"
members = [ "r1", "r2",
            "r3", "r4" ]   # four bonds

  [set.unmoved]    # indented header
  r1 = ["E", "C2'", "sh", "sv"]   # on the x axis
  r2 = ["E", "C2'", "sh", "sv"]
  r3 = ["E", "sh"]
  r4 = ["E", "sh"]

[[band]]
technique = "Raman"      # measured 2026
position = 330           # integer on purpose
"#;

#[test]
fn a_hand_written_file_keeps_its_order_spacing_quotes_and_comments() {
    let mut s = parse("hand", HAND_WRITTEN).unwrap();
    // Unchanged: the very same text.
    assert_eq!(
        session::to_toml_keeping(Some(HAND_WRITTEN), &s),
        HAND_WRITTEN
    );
    s.sets[0].members[3].unmoved_by.push("C2'".into());
    s.bands[0].position = 331.0;
    let saved = session::to_toml_keeping(Some(HAND_WRITTEN), &s);
    assert_eq!(parse("saved", &saved).unwrap(), s);
    let changed: Vec<&str> = HAND_WRITTEN
        .lines()
        .filter(|l| !saved.lines().any(|m| m == *l))
        .collect();
    assert_eq!(
        changed,
        vec![
            "  r4 = [\"E\", \"sh\"]",
            "position = 330           # integer on purpose"
        ],
        "{saved}"
    );
    assert!(
        saved.contains("  r4 = [\"E\", \"sh\", \"C2'\"]\n"),
        "{saved}"
    );
    assert!(
        saved.contains("position = 331.0           # integer on purpose"),
        "{saved}"
    );
}

#[test]
fn a_file_that_failed_to_load_is_never_overwritten() {
    let dir = tmpdir("broken");
    let p = dir.join("broken.toml");
    std::fs::write(&p, "format = 1\ngroup = \"Q9\"\n").unwrap();
    assert!(session::save(&session::demo(), &p).is_err());
    assert_eq!(
        std::fs::read_to_string(&p).unwrap(),
        "format = 1\ngroup = \"Q9\"\n"
    );
}

#[test]
fn save_as_keeps_the_layout_of_the_file_it_came_from() {
    let dir = tmpdir("saveas");
    let f = &examples()[0];
    let text = std::fs::read_to_string(f).unwrap();
    let mut s = session::load_file(f).unwrap();
    s.title = "copy".into();
    let to = dir.join("copy.toml");
    session::save_keeping(&s, f, &to).unwrap();
    let saved = std::fs::read_to_string(&to).unwrap();
    for c in comment_lines(&text) {
        assert!(saved.contains(c));
    }
    assert_eq!(session::load_file(&to).unwrap(), s);
}
