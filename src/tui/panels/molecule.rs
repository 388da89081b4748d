//! Molecule: the atoms of the session's geometry, and what the survey of them found: the
//! detected group and its near misses, bonds, bond sets with Γ, Γ3N and Γvib, redundancies.

use super::super::app::App;
use super::super::text::pad;
use super::super::theme::Theme;
use super::{block, fold, missing_layer, styled};
use crate::analysis::{GeometryAnalysis, LayerStatus};
use crate::rep::format_sum;
use crate::session::GeometrySource;
use ratatui::layout::Rect;
use ratatui::text::Line;
use ratatui::widgets::Paragraph;
use ratatui::Frame;

pub fn draw(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    let b = block("Molecule", th);
    let inner = b.inner(area);
    f.render_widget(b, area);
    let mut lines = Vec::new();
    if let Ok(a) = &app.analysis {
        if let LayerStatus::Missing(m) = &a.layers.geometry {
            lines.extend(missing_layer(m, th, inner.width as usize));
            lines.push(Line::raw(""));
        }
    }
    match &app.session.geometry {
        None => lines.push(styled(
            "No geometry in this session: the group and the ticks were entered by hand.",
            th.dim(),
            th,
        )),
        Some(g) => {
            lines.push(styled(
                &format!("Geometry (tolerance {} Å)", g.tolerance),
                th.heading(),
                th,
            ));
            match &g.source {
                GeometrySource::File(p) => lines.push(styled(
                    &format!("XYZ file: {p}"),
                    ratatui::style::Style::default(),
                    th,
                )),
                GeometrySource::Atoms(atoms) => {
                    lines.push(styled(
                        &format!(
                            "{}{}{}{}",
                            pad("atom", 8),
                            pad("x/Å", 12),
                            pad("y/Å", 12),
                            "z/Å"
                        ),
                        th.dim(),
                        th,
                    ));
                    for (k, at) in atoms.iter().enumerate() {
                        lines.push(Line::raw(format!(
                            "{}{}{}{:>10.4}",
                            pad(&format!("{}{}", at.element, k + 1), 8),
                            pad(&format!("{:>10.4}", at.xyz[0]), 12),
                            pad(&format!("{:>10.4}", at.xyz[1]), 12),
                            at.xyz[2]
                        )));
                    }
                }
            }
        }
    }
    if let Ok(a) = &app.analysis {
        if let Some(ga) = &a.geometry {
            lines.push(Line::raw(""));
            lines.extend(survey_lines(ga, th, inner.width as usize));
        }
        for n in &a.notes {
            lines.push(Line::raw(""));
            for l in super::wrap_folded(th, &format!("Note: {n}."), inner.width as usize) {
                lines.push(styled(&l, th.warn(), th));
            }
        }
    }
    if let Some(g) = &app.session.group {
        lines.push(Line::raw(""));
        lines.push(styled(&format!("Group chosen by hand: {g}"), th.dim(), th));
    }
    let max = lines.len().saturating_sub(inner.height as usize) as u16;
    f.render_widget(
        Paragraph::new(lines).scroll((app.scroll_of(crate::tui::Panel::Molecule).min(max), 0)),
        inner,
    );
}

/// What the survey of the geometry found (or why there is none).
fn survey_lines(ga: &GeometryAnalysis, th: &Theme, width: usize) -> Vec<Line<'static>> {
    let mut out = Vec::new();
    let sv = match &ga.survey {
        Ok(s) => s,
        Err(e) => {
            for l in super::wrap_folded(th, e, width) {
                out.push(styled(&l, th.warn(), th));
            }
            return out;
        }
    };
    let g = &sv.group;
    let sum = |m: &[u64]| fold(&format_sum(g, m, !th.ascii), th);
    let gname = if th.ascii {
        g.table.name.clone()
    } else {
        g.table.symbol.clone()
    };
    out.push(styled(
        &format!(
            "Detected group {gname}: largest deviation {:.4} Å at tolerance {} Å",
            sv.detection.max_deviation, ga.tolerance
        ),
        th.heading(),
        th,
    ));
    let mut nm = crate::report::survey::near_miss_line(sv, th.ascii);
    if sv.near_misses.iter().all(|n| n.group == g.name()) {
        if let Some(top) = sv.near_misses.last() {
            nm.push_str(&format!("; no higher symmetry up to {} Å", top.tolerance));
        }
    }
    for l in super::wrap_folded(th, &format!("Looser tolerances: {nm}"), width) {
        out.push(styled(&l, th.dim(), th));
    }
    let atoms = &sv.oriented.molecule.atoms;
    let label = |i: usize| format!("{}{}", atoms[i].symbol(), i + 1);
    let bonds: Vec<String> = sv
        .bonds
        .iter()
        .map(|&(a, b)| {
            let d = (atoms[a].position - atoms[b].position).norm();
            format!("{}-{} {:.3} Å", label(a), label(b), d)
        })
        .collect();
    out.push(styled(
        &format!("Bonds ({})", bonds.len()),
        th.heading(),
        th,
    ));
    for l in super::wrap_folded(th, &bonds.join(", "), width) {
        out.push(styled(&l, Default::default(), th));
    }
    out.push(styled(
        &format!("Γ3N = {}", sum(&sv.vibrations.gamma_3n)),
        Default::default(),
        th,
    ));
    out.push(styled(
        &format!(
            "Γvib = {}  ({} modes)",
            sum(&sv.vibrations.vibrations),
            sv.vibrations.n_modes
        ),
        th.heading(),
        th,
    ));
    for bs in &sv.bond_sets {
        out.push(styled(
            &format!(
                "Bond set {} ({} bonds): Γ = {}",
                bs.set.label,
                bs.set.bonds.len(),
                sum(&bs.gamma)
            ),
            Default::default(),
            th,
        ));
    }
    for s in &sv.angle_sets {
        out.push(styled(
            &format!(
                "Angle set {} ({} angles): Γ = {}",
                s.set.label,
                s.set.angles.len(),
                sum(&s.gamma)
            ),
            Default::default(),
            th,
        ));
    }
    if sv.redundant.iter().any(|n| *n > 0) {
        out.push(styled(
            &format!("Redundant internal combinations: {}", sum(&sv.redundant)),
            th.dim(),
            th,
        ));
    }
    if sv.uncovered.iter().any(|n| *n > 0) {
        out.push(styled(
            &format!(
                "Not covered by these stretches and bends: {}",
                sum(&sv.uncovered)
            ),
            th.dim(),
            th,
        ));
    }
    for n in &sv.notes {
        for l in super::wrap_folded(th, n, width) {
            out.push(styled(&l, th.dim(), th));
        }
    }
    out
}
