//! Site builder: the kinds of positions (orbits) of a point group given as its list of
//! operations (float matrices in standard orientation), and generation of all equivalent
//! atoms for one position.
//!
//! Site types, in order: the origin; each orbit of rotation-axis rays (a ray is a
//! half-line from the origin along an axis; +u and −u are different types when no
//! operation exchanges them, as for the C3 axes of Td); each orbit of mirror planes
//! (points in the plane, off every axis); the general position. Multiplicity = orbit size
//! = |G| / site-symmetry order.
//!
//! Parameterisation ([`SiteParams`], angles in degrees):
//! * origin — none;
//! * axis — `distance` r > 0 along the representative ray [`SiteType::direction`];
//! * plane — `distance` r and in-plane angle `theta_deg` θ: r·(cos θ·e₁ + sin θ·e₂) with
//!   [`SiteType::basis`] = (e₁, e₂); e₁ is the first axis ray lying in the plane (else the
//!   projection of z, else of x) and e₂ = n × e₁;
//! * general — spherical polar coordinates: `distance` r, polar angle `theta_deg` from +z,
//!   azimuth `phi_deg` from +x towards +y.

use nalgebra::{Matrix3, Vector3};
use serde::{Deserialize, Serialize};

use super::linalg::{rotation_axis, M3, V3};
use super::molecule::Atom;
use super::permute::check_group;
use super::GeomError;

/// What kind of position a site type is.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum SiteKind {
    /// The fixed point.
    Origin,
    /// On a rotation axis (one ray of it).
    Axis,
    /// In a mirror plane, off the axes.
    Plane,
    /// No symmetry element through the point.
    General,
}

/// One kind of position of a point group.
#[derive(Debug, Clone, PartialEq)]
pub struct SiteType {
    /// Kind of position.
    pub kind: SiteKind,
    /// Human-readable label, e.g. `"C3 axis along +z"`.
    pub label: String,
    /// Number of equivalent atoms one such atom generates.
    pub multiplicity: usize,
    /// Order of the site-symmetry group.
    pub site_order: usize,
    /// Axis: order of the rotation axis through the site (1 otherwise).
    pub axis_order: usize,
    /// Axis: the representative unit ray; plane: the unit normal; else zero.
    pub direction: Vector3<f64>,
    /// Plane: in-plane unit vectors (e₁, e₂); else zero.
    pub basis: [Vector3<f64>; 2],
    /// One operation per equivalent position (coset representatives).
    pub coset_reps: Vec<Matrix3<f64>>,
}

/// Position parameters for [`place`] (see the module docs).
#[derive(Debug, Clone, Copy, PartialEq, Default, Serialize, Deserialize)]
pub struct SiteParams {
    /// Distance from the origin, Å.
    pub distance: f64,
    /// Plane: in-plane angle; general: polar angle from +z. Degrees.
    pub theta_deg: f64,
    /// General: azimuth from +x. Degrees.
    pub phi_deg: f64,
}

const EPS: f64 = 1e-6;

fn same(a: &V3, b: &V3) -> bool {
    (a - b).norm() < 1e-5
}

/// Unique images of `p` under `ops`, each with the first operation producing it.
fn orbit(ops: &[M3], p: &V3) -> Vec<(V3, M3)> {
    let mut out: Vec<(V3, M3)> = Vec::new();
    for g in ops {
        let q = g * p;
        if !out.iter().any(|(r, _)| same(r, &q)) {
            out.push((q, *g));
        }
    }
    out
}

/// Sort key putting +z first, then +x, then +y.
fn ray_key(v: &V3) -> (i64, i64, i64) {
    let r = |x: f64| -(x * 1e6).round() as i64;
    (r(v.z), r(v.x), r(v.y))
}

fn fmt_v(v: &V3) -> String {
    let c = |x: f64| if x.abs() < 5e-4 { 0.0 } else { x };
    format!("({:.3}, {:.3}, {:.3})", c(v.x), c(v.y), c(v.z))
}

/// All site types of the group with operations `ops` (standard orientation).
pub fn site_types(ops: &[Matrix3<f64>]) -> Result<Vec<SiteType>, GeomError> {
    check_group(ops)?;
    let order = ops.len();
    let zero = V3::zeros();
    let mut out = vec![SiteType {
        kind: SiteKind::Origin,
        label: "origin".into(),
        multiplicity: 1,
        site_order: order,
        axis_order: 1,
        direction: zero,
        basis: [zero; 2],
        coset_reps: vec![M3::identity()],
    }];
    // Axis rays.
    let mut rays: Vec<V3> = Vec::new();
    for g in ops {
        if g.determinant() > 0.0 && (g - M3::identity()).norm() > EPS {
            let u = rotation_axis(g, &V3::new(0.3, 0.2, 1.0));
            for r in [u, -u] {
                if !rays.iter().any(|q| same(q, &r)) {
                    rays.push(r);
                }
            }
        }
    }
    rays.sort_by_key(ray_key);
    let mut used = vec![false; rays.len()];
    let mut axis_sites = Vec::new();
    for k in 0..rays.len() {
        if used[k] {
            continue;
        }
        let r = rays[k];
        let orb = orbit(ops, &r);
        for (img, _) in &orb {
            if let Some(j) = rays.iter().position(|q| same(q, img)) {
                used[j] = true;
            }
        }
        let stab: Vec<&M3> = ops.iter().filter(|g| same(&(*g * r), &r)).collect();
        let axis_order = stab.iter().filter(|g| g.determinant() > 0.0).count();
        let has_opposite = orb.iter().any(|(img, _)| same(img, &-r));
        let label = if r.z > 1.0 - 1e-6 || r.z < -1.0 + 1e-6 {
            let sign = if has_opposite {
                "±"
            } else if r.z > 0.0 {
                "+"
            } else {
                "-"
            };
            format!("C{axis_order} axis along {sign}z")
        } else {
            format!("C{axis_order} axis, ray {}", fmt_v(&r))
        };
        axis_sites.push(SiteType {
            kind: SiteKind::Axis,
            label,
            multiplicity: orb.len(),
            site_order: stab.len(),
            axis_order,
            direction: r,
            basis: [zero; 2],
            coset_reps: orb.into_iter().map(|(_, g)| g).collect(),
        });
    }
    // Mirror planes: improper, trace 1.
    let mut normals: Vec<V3> = Vec::new();
    for g in ops {
        if g.determinant() < 0.0 && (g.trace() - 1.0).abs() < 1e-6 {
            let mut n = rotation_axis(&(-g), &V3::new(0.1, 0.2, 1.0));
            if ray_key(&-n) < ray_key(&n) {
                n = -n;
            }
            if !normals.iter().any(|m| same(m, &n) || same(m, &-n)) {
                normals.push(n);
            }
        }
    }
    normals.sort_by_key(ray_key);
    let mut used = vec![false; normals.len()];
    let mut plane_sites = Vec::new();
    for k in 0..normals.len() {
        if used[k] {
            continue;
        }
        let n = normals[k];
        for (img, _) in orbit(ops, &n) {
            if let Some(j) = normals.iter().position(|q| same(q, &img) || same(q, &-img)) {
                used[j] = true;
            }
        }
        let e1 = rays
            .iter()
            .find(|r| r.dot(&n).abs() < 1e-6)
            .copied()
            .or_else(|| {
                [V3::z(), V3::x(), V3::y()]
                    .into_iter()
                    .map(|v| v - n * n.dot(&v))
                    .find(|v| v.norm() > 0.1)
                    .map(|v| v.normalize())
            })
            .unwrap_or(V3::x());
        let e2 = n.cross(&e1);
        // Coset representatives from a generic point of the plane.
        let mut reps = Vec::new();
        for t in [0.3719f64, 0.8123, 1.2901] {
            let orb = orbit(ops, &(e1 * t.cos() + e2 * t.sin()));
            if orb.len() * 2 == order {
                reps = orb.into_iter().map(|(_, g)| g).collect();
                break;
            }
        }
        let label = if n.z.abs() > 1.0 - 1e-6 {
            "horizontal mirror plane (xy)".to_string()
        } else if n.z.abs() < 1e-6 {
            format!("vertical mirror plane, normal {}", fmt_v(&n))
        } else {
            format!("mirror plane, normal {}", fmt_v(&n))
        };
        plane_sites.push(SiteType {
            kind: SiteKind::Plane,
            label,
            multiplicity: order / 2,
            site_order: 2,
            axis_order: 1,
            direction: n,
            basis: [e1, e2],
            coset_reps: reps,
        });
    }
    out.extend(axis_sites);
    out.extend(plane_sites);
    if order > 1 {
        out.push(SiteType {
            kind: SiteKind::General,
            label: "general position".into(),
            multiplicity: order,
            site_order: 1,
            axis_order: 1,
            direction: zero,
            basis: [zero; 2],
            coset_reps: ops.to_vec(),
        });
    }
    disambiguate(&mut out);
    Ok(out)
}

/// Appends " (2)", " (3)", … to repeated labels.
fn disambiguate(sites: &mut [SiteType]) {
    for k in 0..sites.len() {
        let earlier = sites[..k]
            .iter()
            .filter(|s| {
                s.label == sites[k].label || s.label.starts_with(&format!("{} (", sites[k].label))
            })
            .count();
        if earlier > 0 {
            let l = format!("{} ({})", sites[k].label, earlier + 1);
            sites[k].label = l;
        }
    }
}

/// All atoms of element `element` equivalent to the position given by `params` on
/// `site` (see the module docs for the parameterisation).
pub fn place(element: u8, site: &SiteType, params: &SiteParams) -> Result<Vec<Atom>, GeomError> {
    if super::elements::symbol(element).is_none() {
        return Err(GeomError::InvalidSite(format!(
            "atomic number {element} is outside 1..=118"
        )));
    }
    let r = params.distance;
    let (t, f) = (params.theta_deg.to_radians(), params.phi_deg.to_radians());
    if ![r, t, f].iter().all(|x| x.is_finite()) {
        return Err(GeomError::InvalidSite("parameters must be finite".into()));
    }
    if site.kind != SiteKind::Origin && r <= 0.0 {
        return Err(GeomError::InvalidSite(format!(
            "distance must be positive for a {} site, got {r}",
            site.label
        )));
    }
    let p = match site.kind {
        SiteKind::Origin => V3::zeros(),
        SiteKind::Axis => site.direction * r,
        SiteKind::Plane => (site.basis[0] * t.cos() + site.basis[1] * t.sin()) * r,
        SiteKind::General => V3::new(t.sin() * f.cos(), t.sin() * f.sin(), t.cos()) * r,
    };
    let pts: Vec<V3> = site.coset_reps.iter().map(|g| g * p).collect();
    let tol = 1e-6 * r.max(1.0);
    for i in 0..pts.len() {
        for j in 0..i {
            if (pts[i] - pts[j]).norm() < tol {
                return Err(GeomError::InvalidSite(format!(
                    "these parameters put the atom on a more symmetric position than the {} \
                     (images {j} and {i} coincide)",
                    site.label
                )));
            }
        }
    }
    Ok(pts.into_iter().map(|q| Atom::new(element, q)).collect())
}
