//! Editing the molecule from the workspace: bonds added or removed (with their symmetry
//! images, so that bond sets stay whole), a what-if molecule built from the group's sites, and
//! the choice of generating member and irrep for the worked projection in Combinations.

use super::app::{App, FieldPurpose};
use crate::geom;
use crate::session::{Atom, Geometry, GeometrySource};
use std::collections::BTreeSet;

/// Which member's worked projection the Combinations panel shows, and onto which irrep.
#[derive(Debug, Clone, Default)]
pub struct CombosUi {
    /// Index over all members of all bond sets of the geometry, in panel order.
    pub member: usize,
    /// Index over the irreps present in that member's set.
    pub irrep: usize,
}

/// Bonds typed as `1-3 2-4` (spaces or `;` between bonds).
fn parse_bonds(text: &str) -> Result<Vec<[usize; 2]>, String> {
    text.split(|c: char| c.is_whitespace() || c == ';')
        .filter(|t| !t.is_empty())
        .map(geom::parse_bond)
        .collect()
}

impl App {
    pub(super) fn bond_prompt(&mut self, add: bool) {
        if self.session.geometry.is_none() {
            return self.error("no geometry: b builds one from sites");
        }
        let (purpose, label) = if add {
            (FieldPurpose::AddBonds, "Add bond(s), atom numbers i-j")
        } else {
            (
                FieldPurpose::RemoveBonds,
                "Remove bond(s), atom numbers i-j",
            )
        };
        self.ask_field(purpose, label, String::new());
    }

    /// The typed bonds and their images under the surveyed group (1-based pairs).
    fn with_images(&self, typed: &[[usize; 2]]) -> Vec<[usize; 2]> {
        let mut out: BTreeSet<[usize; 2]> = BTreeSet::new();
        let perms = self.analysis.as_ref().ok().and_then(|a| {
            a.geometry
                .as_ref()
                .and_then(|g| g.survey.as_ref().ok())
                .map(|s| s.permutations.clone())
        });
        for &[a, b] in typed {
            out.insert([a.min(b), a.max(b)]);
            if let Some(perms) = &perms {
                for p in perms {
                    if let (Some(&x), Some(&y)) =
                        (p.get(a.wrapping_sub(1)), p.get(b.wrapping_sub(1)))
                    {
                        out.insert([x.min(y) + 1, x.max(y) + 1]);
                    }
                }
            }
        }
        out.into_iter().collect()
    }

    pub(super) fn bonds_done(&mut self, add: bool, text: &str) {
        let typed = match parse_bonds(text) {
            Ok(t) => t,
            Err(e) => return self.error(e),
        };
        let all = self.with_images(&typed);
        let n = all.len();
        self.edit(|s| {
            let Some(g) = s.geometry.as_mut() else { return };
            for p in &all {
                let (undo, todo) = if add {
                    (&mut g.remove_bonds, &mut g.add_bonds)
                } else {
                    (&mut g.add_bonds, &mut g.remove_bonds)
                };
                let norm = |q: &[usize; 2]| [q[0].min(q[1]), q[0].max(q[1])];
                if let Some(k) = undo.iter().position(|q| norm(q) == *p) {
                    undo.remove(k);
                } else if !todo.iter().any(|q| norm(q) == *p) {
                    todo.push(*p);
                }
            }
        });
        let list: Vec<String> = all.iter().map(|p| format!("{}-{}", p[0], p[1])).collect();
        self.status(format!(
            "{} {n} bond{}: {} (u undoes)",
            if add { "added" } else { "removed" },
            if n == 1 { "" } else { "s" },
            list.join(" ")
        ));
    }

    pub(super) fn sites_done(&mut self, text: &str) {
        let Some(name) = self.session.group.clone() else {
            return;
        };
        let g = match crate::group::load(&name) {
            Ok(g) => g,
            Err(e) => return self.error(e.to_string()),
        };
        let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
        let atoms = match geom::build_from_sites(&ops, text) {
            Ok(a) => a,
            Err(e) => return self.error(e.to_string()),
        };
        let round = |x: f64| (x * 1e10).round() / 1e10 + 0.0;
        let atoms: Vec<Atom> = atoms
            .iter()
            .map(|a| Atom {
                element: a.symbol().to_string(),
                xyz: [
                    round(a.position.x),
                    round(a.position.y),
                    round(a.position.z),
                ],
            })
            .collect();
        let n = atoms.len();
        let replaced = self.session.geometry.is_some();
        let text = text.to_string();
        self.edit(|s| {
            let tol = s.geometry.as_ref().map(|g| g.tolerance).unwrap_or(0.01);
            let mut geo = Geometry::new(GeometrySource::Atoms(atoms));
            geo.tolerance = tol;
            s.geometry = Some(geo);
            let line = format!("Built with the site builder in {name}: {text}");
            if !s.notes.contains(&line) {
                if !s.notes.is_empty() && !s.notes.ends_with('\n') {
                    s.notes.push('\n');
                }
                s.notes.push_str(&line);
                s.notes.push('\n');
            }
        });
        self.status(format!(
            "built {n} atoms{} (u undoes)",
            if replaced {
                ", replacing the geometry"
            } else {
                ""
            }
        ));
    }

    /// Members of the geometry's bond sets, as (set index, member index) in panel order.
    pub fn generators(&self) -> Vec<(usize, usize)> {
        let Ok(a) = &self.analysis else {
            return Vec::new();
        };
        let Some(Some(res)) = a.geometry.as_ref().map(|g| g.salcs.as_ref()) else {
            return Vec::new();
        };
        let Ok(sets) = &**res else {
            return Vec::new();
        };
        sets.iter()
            .enumerate()
            .filter_map(|(k, s)| s.result.as_ref().ok().map(|set| (k, set.members.len())))
            .flat_map(|(k, n)| (0..n).map(move |m| (k, m)))
            .collect()
    }

    pub(super) fn next_generator(&mut self) {
        let n = self.generators().len();
        if n == 0 {
            return self.error("no SALCs of a geometry to project");
        }
        self.combos_ui.member = (self.combos_ui.member + 1) % n;
        self.combos_ui.irrep = 0;
    }

    pub(super) fn next_irrep(&mut self) {
        if self.generators().is_empty() {
            return self.error("no SALCs of a geometry to project");
        }
        self.combos_ui.irrep += 1;
    }
}
