//! `salc`: SALCs of a basis on a molecule read from an XYZ file, or on a what-if molecule built
//! from sites of a group's standard orientation.
//!
//! Site syntax (ours): items separated by spaces or `;`, each `ELEMENT@SITE[:r[,θ[,φ]]]` with
//! SITE one of `origin`, `axisN`, `planeN`, `generalN` (N-th site type of that kind, from 1;
//! `salcdesk salc G --sites list` lists them), r in Å, θ and φ in degrees. Example: an
//! octahedral complex `salcdesk salc Oh --sites "Co@origin Cl@axis1:2.3" --basis sigma`.

use super::{parse_format, CliError, CliResult};
use crate::basis::{self, Basis, Placed, Structure};
use crate::geom;
use crate::group::{self, PointGroup};
use crate::report::Format;
use crate::salc::{self, View};
use clap::Args;
use std::sync::Arc;

#[derive(Args, Debug)]
pub struct SalcArgs {
    /// A point group (with --sites) or an XYZ file.
    pub target: String,
    /// What-if molecule for a group: "Co@origin Cl@axis1:2.3" (`--sites list` shows the site types).
    #[arg(long)]
    pub sites: Option<String>,
    /// Basis: stretch, bend, internal (stretches + bends), cartesian (symmetry coordinates),
    /// sigma, pi, pperp.
    #[arg(long, default_value = "stretch")]
    pub basis: String,
    /// Only one set of symmetry-equivalent bonds or angles, e.g. C-H, H-C-H, C-C(2).
    #[arg(long)]
    pub set: Option<String>,
    /// Only this irrep, e.g. E, T2g, E' (a ¹E/²E pair is named E).
    #[arg(long)]
    pub irrep: Option<String>,
    /// Central atom (1-based) for sigma and pi; default: the atom at the centre.
    #[arg(long)]
    pub centre: Option<usize>,
    /// Show the worked projection of this member (e.g. r1) onto --irrep.
    #[arg(long)]
    pub worked: Option<String>,
    /// Geometry tolerance in Å.
    #[arg(long, default_value_t = 0.01)]
    pub tol: f64,
    /// Central-atom shells matched with σ/π SALCs, e.g. s,p,d or s,p,d,f,g (up to g).
    #[arg(long, default_value = "s,p,d,f")]
    pub orbitals: String,
    /// Output format: text, md, latex, json.
    #[arg(long, short, default_value = "text", value_parser = parse_format)]
    pub format: Format,
}

fn input(e: impl ToString) -> CliError {
    CliError::input(e.to_string())
}

fn load(name: &str) -> Result<Arc<PointGroup>, CliError> {
    group::load(name).map_err(input)
}

/// Parse `--sites` into atoms for group `g`.
fn sites_molecule(g: &PointGroup, text: &str) -> Result<Vec<Placed>, CliError> {
    let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
    let atoms = geom::build_from_sites(&ops, text).map_err(|e| {
        let list = geom::site_types(&ops)
            .map(|t| geom::site_list(&t).join("; "))
            .unwrap_or_default();
        CliError::input(format!("--sites: {e}")).with_hint(format!("sites of {}: {list}", g.name()))
    })?;
    Ok(atoms
        .into_iter()
        .map(|a| Placed {
            symbol: a.symbol().to_string(),
            position: a.position,
        })
        .collect())
}

/// Bonds of a what-if molecule: the central atom to every other atom, else by distance.
fn what_if_bonds(atoms: &[Placed]) -> Result<Vec<(usize, usize)>, CliError> {
    if let Some(c) = atoms.iter().position(|a| a.position.norm() < 1e-6) {
        return Ok((0..atoms.len())
            .filter(|&a| a != c)
            .map(|a| (c.min(a), c.max(a)))
            .collect());
    }
    let mol = to_molecule(atoms)?;
    geom::perceive_bonds(&mol, geom::DEFAULT_BOND_FACTOR).map_err(input)
}

fn to_molecule(atoms: &[Placed]) -> Result<geom::Molecule, CliError> {
    let list = atoms
        .iter()
        .map(|a| {
            geom::atomic_number(&a.symbol)
                .map(|z| geom::Atom::new(z, a.position))
                .ok_or_else(|| input(format!("unknown element {}", a.symbol)))
        })
        .collect::<Result<Vec<_>, _>>()?;
    Ok(geom::Molecule::new("what-if", list))
}

/// Read, detect, orient: a structure in the detected group's standard orientation.
fn file_structure(path: &str, tol: f64) -> Result<(Structure, Vec<String>), CliError> {
    let bytes = std::fs::read(path).map_err(|e| {
        CliError::input(format!("cannot read '{path}': {e}"))
            .with_hint("give a point group with --sites, or an XYZ file")
    })?;
    let mol = geom::read_xyz(&bytes, &geom::XyzOptions::default())
        .map_err(|e| input(format!("{path}: {}", e.message())))?;
    let bonds = geom::perceive_bonds(&mol, geom::DEFAULT_BOND_FACTOR).map_err(input)?;
    let det = geom::detect(&mol, tol).map_err(|e| input(format!("{path}: {e}")))?;
    let table = load(&det.group)?;
    let mut notes = det.notes.clone();
    let g = if table.is_linear() {
        let d = table.table.descent.clone().unwrap_or_else(|| "C2v".into());
        notes.push(format!(
            "{} is linear: SALCs are built in its subgroup {d}",
            table.name()
        ));
        load(&d)?
    } else {
        table
    };
    let reps: Vec<(usize, nalgebra::Matrix3<f64>)> = basis::class_representatives(&g)
        .into_iter()
        .enumerate()
        .map(|(c, o)| (c, g.ops[o].float))
        .collect();
    let oriented = geom::orient(&mol, &det, &reps).map_err(|e| input(format!("{path}: {e}")))?;
    let s = Structure::from_oriented(g, &oriented.molecule, bonds, tol, det.max_deviation)
        .map_err(|e| input(format!("{path}: {e}")))?;
    Ok((s, notes))
}

fn centre_of(s: &Structure, a: &SalcArgs) -> Result<usize, CliError> {
    match a.centre {
        Some(c) if c >= 1 && c <= s.len() => Ok(c - 1),
        Some(c) => Err(input(format!("--centre {c}: there are {} atoms", s.len()))),
        None => s.atom_at_origin().ok_or_else(|| {
            CliError::input("no atom at the centre of symmetry for sigma/pi")
                .with_hint("name the central atom with --centre N")
        }),
    }
}

/// Pick one named set of equivalent sites, if asked.
fn pick_set(b: Basis, sets: &[basis::SiteSet], name: &Option<String>) -> Result<Basis, CliError> {
    let Some(n) = name else { return Ok(b) };
    let set = sets
        .iter()
        .find(|s| s.name.eq_ignore_ascii_case(n))
        .ok_or_else(|| {
            let names: Vec<&str> = sets.iter().map(|s| s.name.as_str()).collect();
            CliError::input(format!("no set '{n}'"))
                .with_hint(format!("sets: {}", names.join(", ")))
        })?;
    Ok(b.restricted(&set.items))
}

/// `salcdesk salc`.
pub fn salc(a: &SalcArgs, ascii: bool) -> CliResult {
    let (s, mut notes) = match &a.sites {
        Some(text) => {
            let g = load(&a.target)?;
            if g.is_linear() {
                return Err(CliError::input(format!(
                    "{} is linear: give a finite group for --sites",
                    g.name()
                )));
            }
            if text.trim() == "list" {
                let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
                let types = geom::site_types(&ops).map_err(input)?;
                println!("{}", geom::site_list(&types).join("\n"));
                return Ok(());
            }
            let atoms = sites_molecule(&g, text)?;
            let bonds = what_if_bonds(&atoms)?;
            (
                Structure::new(g, atoms, bonds, a.tol).map_err(input)?,
                Vec::new(),
            )
        }
        None => file_structure(&a.target, a.tol)?,
    };
    let kind = a.basis.to_ascii_lowercase();
    let (set, b_sites, central) = match kind.as_str() {
        "stretch" | "stretches" => {
            let b = basis::stretches(&s, &s.bonds).map_err(input)?;
            let b = pick_set(b, &basis::bond_sets(&s), &a.set)?;
            (salc::salcs(&b).map_err(input)?, b.sites.clone(), false)
        }
        "bend" | "bends" => {
            let angles = basis::all_angles(&s);
            let b = basis::bends(&s, &angles).map_err(input)?;
            let b = pick_set(b, &basis::angle_sets(&s, &angles), &a.set)?;
            (salc::salcs(&b).map_err(input)?, b.sites.clone(), false)
        }
        "internal" => {
            let st = basis::stretches(&s, &s.bonds).map_err(input)?;
            let be = basis::bends(&s, &basis::all_angles(&s)).map_err(input)?;
            let set = salc::internal_coordinates(&s, &st, &be).map_err(input)?;
            let sites = st.joined(&be).sites;
            (set, sites, false)
        }
        "cartesian" | "symmetry" => {
            let set = salc::symmetry_coordinates(&s).map_err(input)?;
            let sites: Vec<String> = (0..s.len()).map(|a| s.label(a)).collect();
            let per_member = set.members.iter().map(|m| sites[m.site].clone()).collect();
            (set, per_member, false)
        }
        "sigma" | "pi" => {
            let c = centre_of(&s, a)?;
            let ligands = basis::default_ligands(&s, c);
            let b = if kind == "sigma" {
                basis::sigma(&s, c, &ligands)
            } else {
                basis::pi(&s, c, &ligands)
            }
            .map_err(input)?;
            let sites = b.members.iter().map(|m| b.sites[m.site].clone()).collect();
            (salc::salcs(&b).map_err(input)?, sites, true)
        }
        "pperp" => {
            let atoms: Vec<usize> = (0..s.len()).filter(|&i| s.atoms[i].symbol != "H").collect();
            let b = basis::p_perp(&s, &atoms).map_err(input)?;
            (salc::salcs(&b).map_err(input)?, b.sites.clone(), false)
        }
        other => {
            return Err(CliError::input(format!("unknown basis '{other}'"))
                .with_hint("use stretch, bend, internal, cartesian, sigma, pi or pperp"))
        }
    };
    let only = match &a.irrep {
        Some(l) => Some(
            set.irreps
                .iter()
                .position(|ir| {
                    ir.label.eq_ignore_ascii_case(l) || group::display_label(&ir.label) == *l
                })
                .ok_or_else(|| {
                    let labels: Vec<&str> = set.irreps.iter().map(|i| i.label.as_str()).collect();
                    CliError::input(format!("no irrep '{l}' in {}", set.group.name()))
                        .with_hint(format!("irreps: {}", labels.join(", ")))
                })?,
        ),
        None => None,
    };
    let worked = match (&a.worked, only) {
        (Some(_), Some(_)) if a.set.is_some() || kind == "internal" => {
            return Err(CliError::input(
                "--worked works on a whole basis: drop --set (internal: use stretch or bend)",
            ))
        }
        (Some(m), Some(x)) => {
            let k = set
                .members
                .iter()
                .position(|mm| {
                    mm.name == *m || salc::member_name(mm, crate::exact::Notation::Ascii) == *m
                })
                .ok_or_else(|| input(format!("no member '{m}'")))?;
            let b = rebuild_for_worked(&s, &kind)?;
            Some(salc::worked_projection(&b, &set.irreps[x], k))
        }
        (Some(_), None) => return Err(CliError::input("--worked needs --irrep")),
        _ => None,
    };
    let central = if central {
        let l_max = orbital_shells(&a.orbitals)?;
        // Linear molecule (axis z): match by species along the axis, σ ligands Λ = 0, π Λ = 1.
        let axial = s.is_linear_molecule().then_some(u32::from(kind == "pi"));
        salc::central_orbital_matches(&set, l_max, axial)
    } else {
        Vec::new()
    };
    notes.retain(|n| !n.is_empty());
    let view = View {
        set: &set,
        basis: &kind,
        sites: b_sites,
        only,
        central,
        worked,
        notes,
    };
    print!("{}", salc::render(&view, a.format, ascii));
    Ok(())
}

/// The basis again, for a worked projection (stretches and bends only need the structure).
fn rebuild_for_worked(s: &Structure, kind: &str) -> Result<Basis, CliError> {
    match kind {
        "stretch" | "stretches" => basis::stretches(s, &s.bonds).map_err(input),
        "bend" | "bends" => basis::bends(s, &basis::all_angles(s)).map_err(input),
        "cartesian" | "symmetry" => basis::cartesian(s).map_err(input),
        _ => {
            let c = s.atom_at_origin().ok_or_else(|| input("no central atom"))?;
            let l = basis::default_ligands(s, c);
            match kind {
                "sigma" => basis::sigma(s, c, &l).map_err(input),
                "pi" => basis::pi(s, c, &l).map_err(input),
                _ => Err(input(
                    "--worked is available for stretch, bend, cartesian, sigma and pi",
                )),
            }
        }
    }
}

/// `s,p,d,f,g` → the highest l asked for (shells are listed from s up to it).
fn orbital_shells(text: &str) -> Result<usize, CliError> {
    text.split([',', ' '])
        .map(str::trim)
        .filter(|t| !t.is_empty())
        .map(|t| {
            basis::LETTERS
                .iter()
                .position(|c| t.len() == 1 && t.starts_with(*c))
                .ok_or_else(|| {
                    CliError::input(format!("--orbitals: unknown shell '{t}'"))
                        .with_hint("use letters from s,p,d,f,g")
                })
        })
        .try_fold(None, |m: Option<usize>, l| {
            l.map(|l| Some(m.map_or(l, |m| m.max(l))))
        })?
        .ok_or_else(|| CliError::input("--orbitals: no shell given"))
}
