//! Writing sessions back as TOML in a stable, readable layout: the same session always gives
//! the same text, and reading that text gives the same session.

use super::model::*;

/// A TOML basic string with every needed escape.
fn q(s: &str) -> String {
    toml::Value::String(s.to_string()).to_string()
}

/// A string as a multi-line basic string when it holds line breaks (notes stay readable in
/// the file), else as [`q`].
fn text(s: &str) -> String {
    if !s.contains('\n') {
        return q(s);
    }
    let mut o = String::from("\"\"\"\n");
    for c in s.chars() {
        match c {
            '\\' => o.push_str("\\\\"),
            '"' => o.push_str("\\\""),
            '\n' | '\t' => o.push(c),
            '\r' => o.push_str("\\r"),
            c if c.is_control() => o.push_str(&format!("\\u{:04X}", c as u32)),
            c => o.push(c),
        }
    }
    o.push_str("\"\"\"");
    o
}

/// A TOML key: bare when it can be, quoted otherwise.
fn key(s: &str) -> String {
    if !s.is_empty()
        && s.chars()
            .all(|c| c.is_ascii_alphanumeric() || c == '_' || c == '-')
    {
        s.to_string()
    } else {
        q(s)
    }
}

/// A float that reads back to the same value.
fn num(v: f64) -> String {
    let s = format!("{v:?}");
    if s.contains(['.', 'e', 'E']) || s.contains("inf") || s.contains("NaN") {
        s
    } else {
        format!("{s}.0")
    }
}

fn list(items: &[String]) -> String {
    format!(
        "[{}]",
        items.iter().map(|s| q(s)).collect::<Vec<_>>().join(", ")
    )
}

/// The session as TOML text (format [`FORMAT`]), in the fresh layout. Every field of the model
/// is written here and only here; saving over a file the user wrote edits that file into this
/// text (`keep::edit_document`), so a new field or table needs its lines here and in the
/// loader, nothing else.
pub fn to_toml(s: &Session) -> String {
    let mut o = String::new();
    o.push_str(&format!("format = {FORMAT}\n"));
    if !s.title.is_empty() {
        o.push_str(&format!("title = {}\n", q(&s.title)));
    }
    if let Some(g) = &s.group {
        o.push_str(&format!("group = {}\n", q(g)));
    }
    if !s.orientation.is_empty() {
        o.push_str(&format!("orientation = {}\n", q(&s.orientation)));
    }
    if !s.notes.is_empty() {
        o.push_str(&format!("notes = {}\n", text(&s.notes)));
    }
    if let Some(g) = &s.geometry {
        o.push_str("\n[geometry]\n");
        o.push_str(&format!("tolerance = {}\n", num(g.tolerance)));
        match &g.source {
            GeometrySource::File(f) => o.push_str(&format!("file = {}\n", q(f))),
            GeometrySource::Atoms(atoms) => {
                o.push_str("atoms = [\n");
                for a in atoms {
                    o.push_str(&format!(
                        "  {{ element = {}, xyz = [{}, {}, {}] }},\n",
                        q(&a.element),
                        num(a.xyz[0]),
                        num(a.xyz[1]),
                        num(a.xyz[2])
                    ));
                }
                o.push_str("]\n");
            }
        }
        for (key, pairs) in [
            ("add_bonds", &g.add_bonds),
            ("remove_bonds", &g.remove_bonds),
        ] {
            if !pairs.is_empty() {
                let list: Vec<String> = pairs
                    .iter()
                    .map(|p| format!("[{}, {}]", p[0], p[1]))
                    .collect();
                o.push_str(&format!("{key} = [{}]\n", list.join(", ")));
            }
        }
    }
    for set in &s.sets {
        o.push_str("\n[[set]]\n");
        o.push_str(&format!("name = {}\n", q(&set.name)));
        o.push_str(&format!("kind = {}\n", q(set.kind.name())));
        let names: Vec<String> = set.members.iter().map(|m| m.name.clone()).collect();
        o.push_str(&format!("members = {}\n", list(&names)));
        if !set.members.is_empty() {
            o.push_str("\n[set.unmoved]\n");
            for m in &set.members {
                o.push_str(&format!("{} = {}\n", key(&m.name), list(&m.unmoved_by)));
            }
        }
        // Atoms that do not fit the kind (e.g. after the kind was changed) are left out: the
        // file must load again, and the loader refuses them.
        let placed: Vec<(&str, &[usize])> = set
            .members
            .iter()
            .filter(|m| m.atoms_fit(set.kind))
            .filter_map(|m| m.atoms.as_deref().map(|a| (m.name.as_str(), a)))
            .collect();
        if !placed.is_empty() {
            o.push_str("\n[set.atoms]\n");
            for (name, atoms) in placed {
                let nums: Vec<String> = atoms.iter().map(|n| n.to_string()).collect();
                o.push_str(&format!("{} = [{}]\n", key(name), nums.join(", ")));
            }
        }
    }
    for b in &s.bands {
        o.push_str("\n[[band]]\n");
        o.push_str(&format!("position = {}\n", num(b.position)));
        o.push_str(&format!("technique = {}\n", q(b.technique.name())));
        if !b.intensity.is_empty() {
            o.push_str(&format!("intensity = {}\n", q(&b.intensity)));
        }
        if let Some(p) = b.polarization {
            o.push_str(&format!("polarization = {}\n", q(p.name())));
        }
        if !b.note.is_empty() {
            o.push_str(&format!("note = {}\n", q(&b.note)));
        }
    }
    if !s.nu_positions.is_empty() {
        o.push_str("\n[fundamentals]\n");
        let mut nu = s.nu_positions.clone();
        nu.sort_by_key(|(n, _)| *n);
        for (n, p) in nu {
            o.push_str(&format!("nu{n} = {}\n", num(p)));
        }
    }
    if let Some(v) = &s.vibrations {
        o.push_str(&super::vib_section::to_toml(v, q, num));
    }
    o
}
