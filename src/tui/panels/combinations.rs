//! Combinations: symmetry-adapted linear combinations of each member set. The SALC layer is
//! not in this build yet, so the panel says so and shows what exists: for each set, how many
//! combinations of each symmetry the reduction promises.

use super::super::app::App;
use super::super::theme::Theme;
use super::{block, missing_layer, styled};
use crate::analysis::LayerStatus;
use ratatui::layout::Rect;
use ratatui::text::Line;
use ratatui::widgets::Paragraph;
use ratatui::Frame;

/// For each set: Γ and the number of combinations it promises per irrep.
pub fn promised(app: &App, th: &Theme) -> Vec<Line<'static>> {
    let mut out = Vec::new();
    let Ok(a) = &app.analysis else { return out };
    let g = &a.group;
    for s in &a.sets {
        out.push(styled(
            &format!("{} ({} members)", s.name, s.members.len()),
            th.heading(),
            th,
        ));
        match s.multiplicities() {
            Some(m) => {
                for (i, n) in m.iter().enumerate().filter(|(_, n)| **n > 0) {
                    let ir = &g.table.irreps[i];
                    let label = if th.ascii {
                        ir.label.clone()
                    } else {
                        ir.display()
                    };
                    let d = ir.dim();
                    let what = match d {
                        1 => "combination".to_string(),
                        2 => "pair of partner combinations".to_string(),
                        3 => "triple of partner combinations".to_string(),
                        k => format!("set of {k} partner combinations"),
                    };
                    let plural = if *n == 1 { "" } else { "s" };
                    out.push(styled(
                        &format!("  {n} {what}{plural} of {label} symmetry"),
                        th.dim(),
                        th,
                    ));
                }
            }
            None => out.push(styled(
                "  χ is not a representation yet: see the Representation panel",
                th.warn(),
                th,
            )),
        }
    }
    out
}

pub fn draw(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    let b = block("Combinations", th);
    let inner = b.inner(area);
    f.render_widget(b, area);
    let mut lines = Vec::new();
    match &app.analysis {
        Ok(a) => {
            if let LayerStatus::Missing(m) = &a.layers.salc {
                lines.extend(missing_layer(m, th, inner.width as usize));
                lines.push(Line::raw(""));
                lines.push(styled(
                    "What the reductions already tell:",
                    th.heading(),
                    th,
                ));
            }
            lines.extend(promised(app, th));
        }
        Err(e) => lines.push(styled(&e.to_string(), th.warn(), th)),
    }
    let max = lines.len().saturating_sub(inner.height as usize) as u16;
    f.render_widget(
        Paragraph::new(lines).scroll((app.scroll.min(max), 0)),
        inner,
    );
}
