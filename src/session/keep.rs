//! Saving over a file the user wrote: the new text is the old document edited where the
//! session changed, so comments, key order, spacing and quoting of everything untouched
//! survive byte for byte (toml_edit keeps each item's decoration).
//!
//! Generic over the TOML tree: [`to_toml`](super::write::to_toml) says what the session is,
//! and [`merge_table`] walks its document and the user's side by side — values that mean the
//! same are kept as written, changed values are replaced (keeping the comments around them),
//! new keys and tables are added, keys the session no longer has are removed. A new field or
//! table of the schema needs only its line in `to_toml` (and the loader).

use toml_edit::{ArrayOfTables, DocumentMut, Item, Table, Value};

/// The session's TOML written into `original` (the text it was loaded from, or the file it
/// replaces). Falls back to the fresh layout when `original` is not TOML.
pub fn edit_document(original: &str, fresh: &str) -> String {
    let (Ok(mut old), Ok(new)) = (
        original.parse::<DocumentMut>(),
        fresh.parse::<DocumentMut>(),
    ) else {
        return fresh.to_string();
    };
    merge_table(old.as_table_mut(), new.as_table());
    old.to_string()
}

/// Make `old` say what `new` says, keeping `old`'s layout wherever its content stays.
pub fn merge_table(old: &mut Table, new: &Table) {
    let gone: Vec<String> = old
        .iter()
        .map(|(k, _)| k.to_string())
        .filter(|k| !new.contains_key(k))
        .collect();
    for k in gone {
        old.remove(&k);
    }
    for (k, item) in new.iter() {
        match old.get_mut(k) {
            Some(o) => merge_item(o, item),
            None => {
                if let Some((key, _)) = new.get_key_value(k) {
                    old.insert_formatted(key, unplaced(item));
                }
            }
        }
    }
}

fn merge_item(old: &mut Item, new: &Item) {
    match (&mut *old, new) {
        (Item::Value(o), Item::Value(n)) => merge_value(o, n),
        (Item::Table(o), Item::Table(n)) => merge_table(o, n),
        (Item::ArrayOfTables(o), Item::ArrayOfTables(n)) => merge_tables(o, n),
        _ => *old = unplaced(new),
    }
}

/// A copy of an item of the fresh document without its document positions, so that a table
/// added to the user's file is written after the table it follows there.
fn unplaced(item: &Item) -> Item {
    match item {
        Item::Table(t) => Item::Table(unplaced_table(t)),
        Item::ArrayOfTables(a) => {
            let mut o = ArrayOfTables::new();
            for t in a.iter() {
                o.push(unplaced_table(t));
            }
            Item::ArrayOfTables(o)
        }
        other => other.clone(),
    }
}

fn unplaced_table(t: &Table) -> Table {
    let mut o = Table::new();
    o.set_implicit(t.is_implicit());
    o.set_dotted(t.is_dotted());
    *o.decor_mut() = t.decor().clone();
    for (k, _) in t.iter() {
        if let Some((key, item)) = t.get_key_value(k) {
            o.insert_formatted(key, unplaced(item));
        }
    }
    o
}

/// A value that means the same keeps its text; otherwise the new value takes the old one's
/// place and the comments beside it. Arrays of the same length are merged element by element,
/// so that one changed atom leaves the other lines of a multi-line list alone.
fn merge_value(old: &mut Value, new: &Value) {
    if same(old, new) {
        return;
    }
    if let (Value::Array(o), Value::Array(n)) = (&mut *old, new) {
        if o.len() == n.len() {
            for (i, nv) in n.iter().enumerate() {
                if let Some(ov) = o.get_mut(i) {
                    merge_value(ov, nv);
                }
            }
            return;
        }
    }
    if let (Value::InlineTable(o), Value::InlineTable(n)) = (&mut *old, new) {
        if o.len() == n.len() && n.iter().all(|(k, _)| o.contains_key(k)) {
            for (k, nv) in n.iter() {
                if let Some(ov) = o.get_mut(k) {
                    merge_value(ov, nv);
                }
            }
            return;
        }
    }
    let decor = old.decor().clone();
    *old = new.clone();
    *old.decor_mut() = decor;
}

/// `[[set]]`, `[[band]]`: each new table is matched with an old one that says the same, else
/// with the old one of the same `name`, else with the old one at its place; unmatched old
/// tables are dropped, unmatched new ones appended.
fn merge_tables(old: &mut ArrayOfTables, new: &ArrayOfTables) {
    let olds: Vec<Table> = old.iter().cloned().collect();
    let mut used = vec![false; olds.len()];
    let mut pick = vec![None; new.len()];
    let name = |t: &Table| t.get("name").and_then(|i| i.as_str()).map(str::to_string);
    for (j, n) in new.iter().enumerate() {
        if let Some(i) = (0..olds.len()).find(|&i| !used[i] && same_table(&olds[i], n)) {
            used[i] = true;
            pick[j] = Some(i);
        }
    }
    for (j, n) in new.iter().enumerate() {
        if pick[j].is_some() {
            continue;
        }
        let by_name = name(n).and_then(|nm| {
            (0..olds.len()).find(|&i| !used[i] && name(&olds[i]).as_deref() == Some(&nm))
        });
        let at_place = (j < olds.len() && !used[j] && name(n).is_none()).then_some(j);
        if let Some(i) = by_name.or(at_place) {
            used[i] = true;
            pick[j] = Some(i);
        }
    }
    let mut out = ArrayOfTables::new();
    for (j, n) in new.iter().enumerate() {
        match pick[j] {
            Some(i) => {
                let mut t = olds[i].clone();
                merge_table(&mut t, n);
                out.push(t);
            }
            None => out.push(unplaced_table(n)),
        }
    }
    *old = out;
}

fn same_table(a: &Table, b: &Table) -> bool {
    a.len() == b.len()
        && b.iter().all(|(k, bi)| match (a.get(k), bi) {
            (Some(Item::Value(x)), Item::Value(y)) => same(x, y),
            (Some(Item::Table(x)), Item::Table(y)) => same_table(x, y),
            (Some(Item::ArrayOfTables(x)), Item::ArrayOfTables(y)) => {
                x.len() == y.len() && x.iter().zip(y.iter()).all(|(p, q)| same_table(p, q))
            }
            _ => false,
        })
}

/// Equal as data: strings, booleans and datetimes by value, numbers by value (`0` and `0.0`
/// are the same coordinate), arrays and inline tables element by element.
fn same(a: &Value, b: &Value) -> bool {
    let num = |v: &Value| match v {
        Value::Integer(i) => Some(*i.value() as f64),
        Value::Float(f) => Some(*f.value()),
        _ => None,
    };
    match (a, b) {
        (Value::String(x), Value::String(y)) => x.value() == y.value(),
        (Value::Boolean(x), Value::Boolean(y)) => x.value() == y.value(),
        (Value::Datetime(x), Value::Datetime(y)) => x.value() == y.value(),
        (Value::Array(x), Value::Array(y)) => {
            x.len() == y.len() && x.iter().zip(y.iter()).all(|(p, q)| same(p, q))
        }
        (Value::InlineTable(x), Value::InlineTable(y)) => {
            x.len() == y.len()
                && y.iter()
                    .all(|(k, yv)| x.get(k).is_some_and(|xv| same(xv, yv)))
        }
        _ => match (num(a), num(b)) {
            (Some(p), Some(q)) => p == q || (p.is_nan() && q.is_nan()),
            _ => false,
        },
    }
}
