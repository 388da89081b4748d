//! The site builder as a picker (Molecule, `b`): the group's site types, each with its number
//! of equivalent sites and where they lie in plain words; choosing one asks only the element
//! and the distance (and the angles a plane or general site needs). Several site sets can be
//! added before the molecule is built; the build is one undoable edit. Esc cancels.

use super::app::{App, FieldPurpose};
use super::picker::{PickFor, Picker};
use crate::geom::{self, SiteKind, SiteType};
use nalgebra::{Matrix3, Vector3};

/// The builder's state between steps.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct SiteState {
    pub group: String,
    /// Site names in the syntax (`origin`, `axis2`, …) and what each asks for.
    pub names: Vec<String>,
    pub params: Vec<u8>,
    /// Site sets chosen so far, in the site syntax (`Cl@axis1:2.3`).
    pub pending: Vec<String>,
}

impl SiteState {
    /// Line index of the first site type (after the "build" line, when there is one).
    fn first(&self) -> usize {
        usize::from(!self.pending.is_empty())
    }
}

const EPS: f64 = 1e-4;

fn polygon(n: usize) -> String {
    match n {
        2 => "opposite pair".into(),
        3 => "triangle".into(),
        4 => "square".into(),
        5 => "pentagon".into(),
        6 => "hexagon".into(),
        8 => "octagon".into(),
        n => format!("ring of {n}"),
    }
}

/// A ray in the xy plane in words: `along +x`, `along −y`, `at 45° from +x`.
fn ray_words(v: &Vector3<f64>) -> String {
    let named = [
        (Vector3::x(), "+x"),
        (-Vector3::x(), "−x"),
        (Vector3::y(), "+y"),
        (-Vector3::y(), "−y"),
    ];
    if let Some((_, w)) = named.iter().find(|(u, _)| (u - v).norm() < EPS) {
        return format!("along {w}");
    }
    format!("at {:.0}° from +x", v.y.atan2(v.x).to_degrees())
}

/// Where a site type's atoms lie, in words, from the positions one atom on it generates.
pub fn describe(t: &SiteType, ops: &[Matrix3<f64>]) -> String {
    let n = t.multiplicity;
    let sites = if n == 1 {
        "1 site".to_string()
    } else {
        format!("{n} sites")
    };
    let sigma_h = ops
        .iter()
        .any(|m| (m - Matrix3::from_diagonal(&Vector3::new(1.0, 1.0, -1.0))).norm() < EPS);
    let probe = match t.kind {
        SiteKind::Origin => return "1 site: the centre of the molecule".into(),
        SiteKind::Axis => t.direction,
        SiteKind::Plane => (t.basis[0] * 0.8 + t.basis[1] * 0.6).normalize(),
        SiteKind::General => Vector3::new(0.3, 0.5, 0.81).normalize(),
    };
    let mut pts: Vec<Vector3<f64>> = Vec::new();
    for m in ops {
        let q = m * probe;
        if !pts.iter().any(|p| (p - q).norm() < 1e-5) {
            pts.push(q);
        }
    }
    let flat = pts.iter().all(|p| p.z.abs() < EPS);
    let on_z = pts.iter().all(|p| p.x.abs() < EPS && p.y.abs() < EPS);
    let plane_word = if sigma_h { "σh plane" } else { "xy plane" };
    let c_n = format!("C{}", t.axis_order);
    let where_ = match t.kind {
        SiteKind::Axis if on_z => {
            if n == 1 {
                let sign = if t.direction.z >= 0.0 { "+z" } else { "−z" };
                format!("on the principal axis ({sign})")
            } else {
                "pair on the principal axis (±z)".to_string()
            }
        }
        SiteKind::Axis
            if n == 6
                && pts
                    .iter()
                    .all(|p| p.iter().filter(|c| c.abs() > EPS).count() == 1) =>
        {
            "octahedron (±x, ±y, ±z)".to_string()
        }
        SiteKind::Axis
            if pts.iter().all(|p| {
                (p.x.abs() - p.y.abs()).abs() < EPS && (p.y.abs() - p.z.abs()).abs() < EPS
            }) && (n == 4 || n == 8) =>
        {
            if n == 4 {
                "tetrahedron (alternate corners of a cube)".to_string()
            } else {
                "corners of a cube".to_string()
            }
        }
        SiteKind::Axis if flat => format!(
            "{} in the {plane_word} on the {c_n} axes, one {}",
            polygon(n),
            ray_words(&t.direction)
        ),
        SiteKind::Axis => {
            let shape = match (n, t.axis_order) {
                (12, 5) => "icosahedron ",
                (20, 3) => "dodecahedron corners ",
                (30, 2) => "icosidodecahedron ",
                (12, 2) => "cuboctahedron ",
                _ => "",
            };
            format!("{shape}on the {c_n} axes")
        }
        SiteKind::Plane if flat => {
            format!(
                "{} in the {plane_word} between the axes (asks r and θ)",
                polygon(n)
            )
        }
        SiteKind::Plane if t.direction.z.abs() < EPS => {
            let which = if t.direction.x.abs() < EPS {
                " (the xz plane)".to_string()
            } else if t.direction.y.abs() < EPS {
                " (the yz plane)".to_string()
            } else {
                String::new()
            };
            format!("in a vertical mirror{which}, off the axes (asks r and θ)")
        }
        SiteKind::Plane => "in a mirror plane, off the axes (asks r and θ)".to_string(),
        SiteKind::General | SiteKind::Origin => {
            "general position, on no symmetry element (asks r, θ, φ)".to_string()
        }
    };
    format!("{sites}: {where_}")
}

/// The question for one site set: only what the site type needs.
fn site_label(name: &str, p: u8) -> String {
    let what = match p {
        0 => "element, e.g. Co",
        1 => "element and r in Å, e.g. Cl 2.3",
        2 => "element, r in Å and θ in degrees, e.g. H 1.1 30",
        _ => "element, r in Å, θ and φ in degrees, e.g. H 1.1 30 20",
    };
    format!("{name}: {what}")
}

impl App {
    /// `b` in Molecule: open the site-type picker.
    pub(super) fn site_picker(&mut self, pending: Vec<String>) {
        let Some(g) = self.session.group.clone() else {
            return self.error("choose a point group first (panel 1)");
        };
        let pg = match crate::group::load(&g) {
            Ok(pg) if !pg.is_linear() => pg,
            Ok(_) => return self.error(format!("{g} is linear: build in a finite group")),
            Err(e) => return self.error(e.to_string()),
        };
        let ops: Vec<Matrix3<f64>> = pg.ops.iter().map(|o| o.float).collect();
        let types = match geom::site_types(&ops) {
            Ok(t) => t,
            Err(e) => return self.error(e.to_string()),
        };
        let names = geom::site_names(&types);
        let params = types
            .iter()
            .map(|t| match t.kind {
                SiteKind::Origin => 0,
                SiteKind::Axis => 1,
                SiteKind::Plane => 2,
                SiteKind::General => 3,
            })
            .collect();
        let st = SiteState {
            group: g.clone(),
            names: names.clone(),
            params,
            pending,
        };
        let mut items = Vec::new();
        if !st.pending.is_empty() {
            items.push(format!(
                "build the molecule now ({} site set{}; replaces the geometry)",
                st.pending.len(),
                if st.pending.len() == 1 { "" } else { "s" }
            ));
        }
        for (name, t) in names.iter().zip(&types) {
            items.push(format!("{name} — {}", describe(t, &ops)));
        }
        let notes = if st.pending.is_empty() {
            vec![format!(
                "Sites of {g}: choose where the next set of equivalent atoms goes, then type \
                 its element and distance."
            )]
        } else {
            vec![format!("Chosen so far: {}", st.pending.join("  "))]
        };
        self.open_picker(Picker {
            title: format!("Build a molecule in {g}"),
            notes,
            items,
            cursor: 0,
            purpose: PickFor::Sites(st),
        });
    }

    pub(super) fn site_chosen(&mut self, st: SiteState, k: usize) {
        if k < st.first() {
            let text = st.pending.join(" ");
            return self.sites_done(&text);
        }
        let i = k - st.first();
        let (Some(name), Some(&p)) = (st.names.get(i), st.params.get(i)) else {
            return;
        };
        let label = site_label(name, p);
        self.ask_field(FieldPurpose::SiteItem(i, st), &label, String::new());
    }

    /// The element and numbers typed for one site set: add it and go back to the picker.
    pub(super) fn site_item_done(&mut self, i: usize, st: SiteState, text: &str) {
        let name = st.names[i].clone();
        let p = st.params[i] as usize;
        let parts: Vec<&str> = text
            .split(|c: char| c.is_whitespace() || c == ',')
            .filter(|t| !t.is_empty())
            .collect();
        let retry = |app: &mut App, msg: String| {
            app.error(msg);
            let label = site_label(&name, p as u8);
            app.ask_field(
                FieldPurpose::SiteItem(i, st.clone()),
                &label,
                text.to_string(),
            );
        };
        let Some((el, nums)) = parts.split_first() else {
            return retry(self, "type an element first".into());
        };
        if geom::atomic_number(el).is_none() {
            return retry(self, format!("'{el}' is not an element symbol"));
        }
        if nums.len() > p || (p > 0 && nums.is_empty()) {
            return retry(
                self,
                format!(
                    "{name} takes {}",
                    ["no numbers", "one number (r)", "r and θ", "r, θ and φ"][p]
                ),
            );
        }
        for n in nums {
            if n.parse::<f64>().map_or(true, |v| !v.is_finite()) {
                return retry(self, format!("'{n}' is not a number"));
            }
        }
        let item = if nums.is_empty() {
            format!("{el}@{name}")
        } else {
            format!("{el}@{name}:{}", nums.join(","))
        };
        // Check the whole list now, so that a clash shows before building.
        let mut pending = st.pending.clone();
        pending.push(item.clone());
        let g = match crate::group::load(&st.group) {
            Ok(g) => g,
            Err(e) => return self.error(e.to_string()),
        };
        let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
        match geom::build_from_sites(&ops, &pending.join(" ")) {
            Ok(atoms) => {
                self.site_picker(pending);
                self.status(format!(
                    "added {item}: {} atoms so far; add another site set or build",
                    atoms.len()
                ));
            }
            Err(e) => retry(self, e.to_string()),
        }
    }
}
