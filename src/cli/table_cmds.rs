//! `groups`, `table`, `reduce`, `product`, `check-table`.

use super::{parse_format, CliError, CliResult};
use crate::group::{self, PointGroup};
use crate::rep::{self, Character, MemberKind};
use crate::report::{self, Format};
use clap::Args;
use std::sync::Arc;

fn load(name: &str) -> Result<Arc<PointGroup>, CliError> {
    group::load(name).map_err(|e| CliError::input(e.to_string()))
}

#[derive(Args, Debug)]
pub struct GroupsArgs {
    /// Only groups of this family (nonaxial, Cn, Cnv, Cnh, Dn, Dnh, Dnd, S2n, cubic, icosahedral, linear).
    #[arg(long)]
    pub family: Option<String>,
}

pub fn groups(a: &GroupsArgs, ascii: bool) -> CliResult {
    let mut rows = vec![vec![
        "name".to_string(),
        "symbol".into(),
        "order".into(),
        "family".into(),
    ]];
    for name in group::names() {
        let g = load(name)?;
        let fam = g.table.family.name();
        if let Some(f) = &a.family {
            if !fam.eq_ignore_ascii_case(f) {
                continue;
            }
        }
        rows.push(vec![
            name.to_string(),
            if ascii {
                name.to_string()
            } else {
                g.table.symbol.clone()
            },
            g.table
                .order
                .map(|o| o.to_string())
                .unwrap_or_else(|| "∞".replace('∞', if ascii { "inf" } else { "∞" })),
            fam.to_string(),
        ]);
    }
    print!("{}", report::grid::render(&rows, ascii));
    Ok(())
}

#[derive(Args, Debug)]
pub struct TableArgs {
    /// Point group, e.g. C3v, D4h, Td, Ih, Cinfv.
    pub group: String,
    /// Output format: text, md, latex, json.
    #[arg(long, short, default_value = "text", value_parser = parse_format)]
    pub format: Format,
}

pub fn table(a: &TableArgs, ascii: bool) -> CliResult {
    let g = load(&a.group)?;
    print!("{}", report::table::render(&g, a.format, ascii));
    Ok(())
}

#[derive(Args, Debug)]
pub struct ReduceArgs {
    /// Point group.
    pub group: String,
    /// Characters in the table's class order (exact notation: 2, -1, sqrt(2), 2cos(2pi/5) …).
    pub characters: Vec<String>,
    /// Give unmoved counts per class instead of characters.
    #[arg(long, num_args = 1.., conflicts_with = "characters", value_parser = parse_count)]
    pub unmoved: Option<Vec<i64>>,
    /// What each unmoved member is: stretch (also σ orbitals), cartesian, pi, axial.
    #[arg(long, default_value = "stretch")]
    pub kind: String,
    /// Output format: text, md, latex, json.
    #[arg(long, short, default_value = "text", value_parser = parse_format)]
    pub format: Format,
}

/// A whole number (a Unicode minus is accepted, as the number notation does).
fn parse_count(s: &str) -> Result<i64, String> {
    s.replace('−', "-")
        .trim()
        .parse()
        .map_err(|_| format!("'{s}' is not a whole number"))
}

pub fn reduce(a: &ReduceArgs, ascii: bool) -> CliResult {
    let g = load(&a.group)?;
    let kind = MemberKind::parse(&a.kind).ok_or_else(|| {
        CliError::input(format!("unknown member kind '{}'", a.kind))
            .with_hint("use stretch, cartesian, pi or axial")
    })?;
    if g.is_linear() {
        return reduce_linear(&g, a, kind, ascii);
    }
    let r = match &a.unmoved {
        Some(counts) => rep::reduce_unmoved(&g, counts, kind),
        None => Character::parse(&g, &a.characters).map(|chi| rep::reduce(&g, &chi)),
    }
    .map_err(|e| CliError::input(e.to_string()))?;
    print!("{}", report::reduction::render(&g, &r, a.format, ascii));
    if r.is_valid() {
        Ok(())
    } else {
        Err(CliError::input(format!(
            "the characters are not a representation of {}",
            g.name()
        )))
    }
}

fn reduce_linear(g: &PointGroup, a: &ReduceArgs, kind: MemberKind, ascii: bool) -> CliResult {
    let counts = a.unmoved.as_ref().ok_or_else(|| {
        CliError::input(format!(
            "{} is a linear group: give --unmoved counts per class ({})",
            g.name(),
            g.table
                .classes
                .iter()
                .map(|c| c.ascii.as_str())
                .collect::<Vec<_>>()
                .join(" ")
        ))
    })?;
    let lr = rep::reduce_linear_unmoved(g, counts, kind).map_err(CliError::input)?;
    let sub = load(&lr.subgroup)?;
    let labels: Vec<String> = g.table.irreps.iter().map(|i| i.label.clone()).collect();
    match a.format {
        Format::Json => {
            let mut mm = serde_json::Map::new();
            for (l, n) in labels.iter().zip(&lr.multiplicities) {
                mm.insert(l.clone(), serde_json::json!(n));
            }
            let v = serde_json::json!({
                "group": g.name(),
                "multiplicities": mm,
                "valid": true,
                "via": lr.subgroup,
                "via_multiplicities": rep::format_sum(&sub, &lr.sub_multiplicities, false),
                "note": lr.note,
            });
            println!("{}", serde_json::to_string_pretty(&v).unwrap_or_default());
        }
        _ => {
            let r = rep::reduce(&sub, &lr.sub_chi);
            print!("{}", report::reduction::render(&sub, &r, a.format, ascii));
            println!(
                "{} = {}\n{}",
                if ascii { "Gamma" } else { "Γ" },
                rep::format_sum(g, &lr.multiplicities, !ascii),
                lr.note
            );
        }
    }
    Ok(())
}

#[derive(Args, Debug)]
pub struct ProductArgs {
    /// Point group.
    pub group: String,
    /// First representation, e.g. E or "A1 + E".
    pub first: String,
    /// Second representation (omit with --sym, --antisym or --cube).
    pub second: Option<String>,
    /// Symmetric square [Γ²] (first overtone of a degenerate mode).
    #[arg(long, conflicts_with_all = ["antisym", "cube"])]
    pub sym: bool,
    /// Antisymmetric square {Γ²}.
    #[arg(long, conflicts_with = "cube")]
    pub antisym: bool,
    /// Symmetric cube [Γ³] (second overtone).
    #[arg(long)]
    pub cube: bool,
    /// Output format: text, md, latex, json.
    #[arg(long, short, default_value = "text", value_parser = parse_format)]
    pub format: Format,
}

pub fn product(a: &ProductArgs, ascii: bool) -> CliResult {
    let g = load(&a.group)?;
    if g.is_linear() {
        return product_linear(&g, a, ascii);
    }
    let gamma = |t: &str| -> Result<Character, CliError> {
        let m = rep::parse_gamma(&g, t).map_err(CliError::input)?;
        Ok(rep::from_multiplicities(&g, &m))
    };
    let x = gamma(&a.first)?;
    let chi = if a.sym {
        rep::symmetric_square(&g, &x)
    } else if a.antisym {
        rep::antisymmetric_square(&g, &x)
    } else if a.cube {
        rep::symmetric_cube(&g, &x)
    } else {
        let second = a.second.as_ref().ok_or_else(|| {
            CliError::input("give two representations, or one with --sym, --antisym or --cube")
        })?;
        rep::direct_product(&x, &gamma(second)?)
    };
    let r = rep::reduce(&g, &chi);
    print!("{}", report::reduction::render(&g, &r, a.format, ascii));
    Ok(())
}

/// Products in C∞v/D∞h by the species rules (Herzberg 1945, ch. II): no finite class list.
fn product_linear(g: &PointGroup, a: &ProductArgs, ascii: bool) -> CliResult {
    use crate::spectra::{self, ProductKind};
    let real = |t: &str| -> Result<Vec<u64>, CliError> {
        let rows = spectra::parse_gamma(g, t).map_err(|e| CliError::input(e.to_string()))?;
        spectra::to_real(g, &rows).map_err(|e| CliError::input(e.to_string()))
    };
    let x = real(&a.first)?;
    let (kind, y) = if a.sym {
        (ProductKind::Symmetric, None)
    } else if a.antisym {
        (ProductKind::Antisymmetric, None)
    } else if a.cube {
        (ProductKind::Cube, None)
    } else {
        let second = a.second.as_ref().ok_or_else(|| {
            CliError::input("give two representations, or one with --sym, --antisym or --cube")
        })?;
        (ProductKind::Direct, Some(real(second)?))
    };
    let s = spectra::linear_product(g, &x, y.as_deref(), kind)
        .map_err(|e| CliError::input(e.to_string()))?;
    let note = "species rules of the linear groups (Herzberg 1945, ch. II): Λ⊗Λ' = |Λ−Λ'| + \
                (Λ+Λ'), Λ⊗Λ = Σ⁺ + Σ⁻ + (2Λ); g⊗g = u⊗u = g";
    match a.format {
        Format::Json => {
            let v = serde_json::json!({
                "group": g.name(),
                "result": s,
                "note": note,
            });
            println!("{}", serde_json::to_string_pretty(&v).unwrap_or_default());
        }
        _ => {
            let text = if ascii {
                s.text.clone()
            } else {
                s.terms
                    .iter()
                    .map(|t| rep::write_term(g, t.multiplicity, &group::display_label(&t.irrep)))
                    .collect::<Vec<_>>()
                    .join(" + ")
            };
            let line = format!(
                "Γ = {}\n{note}\n",
                if text.is_empty() { "0" } else { &text }
            );
            print!(
                "{}",
                if ascii {
                    report::ascii_prose(&line)
                } else {
                    line
                }
            );
        }
    }
    Ok(())
}

#[derive(Args, Debug)]
pub struct CheckTableArgs {
    /// A table file in salcdesk's format.
    pub file: std::path::PathBuf,
}

pub fn check_table(a: &CheckTableArgs) -> CliResult {
    let text = std::fs::read_to_string(&a.file)
        .map_err(|e| CliError::input(format!("{}: {e}", a.file.display())))?;
    let g = PointGroup::from_toml(&a.file.display().to_string(), &text)
        .map_err(|e| CliError::input(e.to_string()))?;
    let problems = group::validate::validate(&g);
    if problems.is_empty() {
        println!(
            "{}: {} passes every check ({} operations, {} classes)",
            a.file.display(),
            g.name(),
            g.order(),
            g.n_classes()
        );
        Ok(())
    } else {
        for p in &problems {
            eprintln!("{}: {p}", a.file.display());
        }
        Err(CliError::input(format!(
            "{} problem(s) in {}",
            problems.len(),
            a.file.display()
        )))
    }
}
