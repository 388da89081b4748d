//! `build`: a what-if molecule from the sites of a group, written as an XYZ file or as a new
//! session (group, inline atoms, and how it was built, in the notes).

use super::{CliError, CliResult};
use crate::geom::{self, Molecule};
use crate::group;
use crate::session::{self, Atom, Geometry, GeometrySource, Session};
use clap::Args;
use std::path::PathBuf;

#[derive(Args, Debug)]
pub struct BuildArgs {
    /// The point group whose sites are used (its standard orientation).
    pub group: String,
    /// Atoms on sites: "Co@origin Cl@axis1:2.3" (ELEMENT@SITE[:r[,theta[,phi]]], r in Å,
    /// angles in degrees); `list` shows the group's site types.
    #[arg(long)]
    pub sites: String,
    /// Write here: a .toml name writes a session, anything else an XYZ file; default: XYZ on
    /// standard output.
    #[arg(long, short)]
    pub output: Option<PathBuf>,
    /// Title (XYZ comment line, session title).
    #[arg(long)]
    pub title: Option<String>,
    /// Replace an existing output file.
    #[arg(long)]
    pub force: bool,
}

fn input(e: impl ToString) -> CliError {
    CliError::input(e.to_string())
}

/// `salcdesk build`.
pub fn build(a: &BuildArgs) -> CliResult {
    let g = group::load(&a.group).map_err(input)?;
    if g.is_linear() {
        return Err(input(format!(
            "{} is linear: build in a finite group (e.g. its subgroup {})",
            g.name(),
            g.table.descent.as_deref().unwrap_or("C2v")
        )));
    }
    let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
    let types = geom::site_types(&ops).map_err(input)?;
    if a.sites.trim().eq_ignore_ascii_case("list") {
        println!("{}", geom::site_list(&types).join("\n"));
        return Ok(());
    }
    let atoms = geom::build_from_sites(&ops, &a.sites).map_err(|e| {
        CliError::input(format!("--sites: {e}")).with_hint(format!(
            "sites of {}: {}",
            g.name(),
            geom::site_list(&types).join("; ")
        ))
    })?;
    let title = a
        .title
        .clone()
        .unwrap_or_else(|| format!("built in {} from: {}", g.name(), a.sites.trim()));
    let mol = Molecule::new(title.clone(), atoms);
    // Atoms only on special positions can have more symmetry than the group asked for.
    match geom::detect(&mol, geom::DEFAULT_TOLERANCE) {
        Ok(d) if d.group != g.name() => eprintln!(
            "note: the molecule built has {} symmetry (the chosen group is {}): atoms on \
             special positions only",
            d.group,
            g.name()
        ),
        _ => {}
    }
    let Some(path) = &a.output else {
        print!("{}", geom::write_xyz(&mol));
        return Ok(());
    };
    if path.exists() && !a.force {
        return Err(CliError::input(format!("{} exists", path.display()))
            .with_hint("give --force to replace it, or another name"));
    }
    let is_session = path
        .extension()
        .is_some_and(|e| e.eq_ignore_ascii_case("toml"));
    let text = if is_session {
        let atoms = mol
            .atoms
            .iter()
            .map(|at| Atom {
                element: at.symbol().to_string(),
                xyz: [at.position.x, at.position.y, at.position.z],
            })
            .collect();
        let s = Session {
            title,
            group: Some(g.name().to_string()),
            orientation: format!("standard orientation of {} (site builder)", g.name()),
            geometry: Some(Geometry::new(GeometrySource::Atoms(atoms))),
            notes: format!(
                "Built with: salcdesk build {} --sites \"{}\"",
                g.name(),
                a.sites.trim()
            ),
            ..Session::default()
        };
        session::to_toml(&s)
    } else {
        geom::write_xyz(&mol)
    };
    session::write_atomic(path, &text).map_err(|e| CliError {
        message: e.to_string(),
        hint: None,
        code: 1,
    })?;
    eprintln!(
        "wrote {} ({} atoms{})",
        path.display(),
        mol.atoms.len(),
        if is_session { ", session" } else { "" }
    );
    Ok(())
}
