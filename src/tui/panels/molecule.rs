//! Molecule: atoms, bonds, the detected group and its near misses, and the site builder. The
//! geometry layer is not in this build yet, so the panel says so and shows what the session
//! holds: the atoms (or the XYZ file named) and the tolerance.

use super::super::app::App;
use super::super::text::pad;
use super::super::theme::Theme;
use super::{block, missing_layer, styled};
use crate::analysis::LayerStatus;
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
    if let Some(g) = &app.session.group {
        lines.push(Line::raw(""));
        lines.push(styled(&format!("Group chosen by hand: {g}"), th.dim(), th));
    }
    let max = lines.len().saturating_sub(inner.height as usize) as u16;
    f.render_widget(
        Paragraph::new(lines).scroll((app.scroll.min(max), 0)),
        inner,
    );
}
