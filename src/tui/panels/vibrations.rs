//! Normal modes: the pane shown when the session names a Hessian (`[vibrations]`). A pure
//! function of the analysis: the mode table (ν, wavenumber, irrep, dimension, purity,
//! activity), flags for impure modes, the isotopologue with its correlation and product rule,
//! and the assignment of the session's bands. The rendering is the report's
//! (`report::vibrations`), so the pane and the exported report never disagree.

use super::super::action::Panel;
use super::super::app::App;
use super::super::theme::Theme;
use super::{block, styled, wrap_folded};
use crate::analysis::Analysis;
use ratatui::layout::Rect;
use ratatui::text::Line;
use ratatui::widgets::Paragraph;
use ratatui::Frame;

/// Does this analysis have something for the pane?
pub fn wanted(a: &Analysis) -> bool {
    a.vibrations.is_some()
}

/// The pane's lines for a given width.
pub fn lines(a: &Analysis, th: &Theme, width: usize) -> Vec<Line<'static>> {
    let mut out = Vec::new();
    match &a.vibrations {
        None => out.push(styled(
            "No Hessian: add [vibrations] hessian = \"job.json\" to the session",
            th.dim(),
            th,
        )),
        Some(Err(e)) => {
            for l in wrap_folded(th, e, width) {
                out.push(styled(&l, th.warn(), th));
            }
        }
        Some(Ok(v)) => {
            let text = crate::report::vibrations::render(
                &v.modes,
                &v.assignments,
                v.scale,
                false,
                th.ascii,
            );
            for (k, l) in text.lines().enumerate() {
                let style = if l.starts_with('!') {
                    th.warn()
                } else if k == 0 || l.starts_with("Isotopologue") || l.starts_with("Observed") {
                    th.heading()
                } else if l.starts_with("note:") {
                    th.dim()
                } else {
                    ratatui::style::Style::default()
                };
                if l.chars().count() > width && (l.starts_with('!') || l.starts_with("note:")) {
                    for piece in wrap_folded(th, l, width) {
                        out.push(styled(&piece, style, th));
                    }
                } else {
                    out.push(styled(l, style, th));
                }
            }
        }
    }
    out
}

/// Draw the pane for the workspace: the analysis's modes, or why there are none yet.
pub fn draw_app(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    match &app.analysis {
        Ok(a) => draw(f, area, a, app.scroll_of(Panel::Vibrations), th),
        Err(e) => {
            let b = block("Normal modes", th);
            let inner = b.inner(area);
            f.render_widget(b, area);
            let ls: Vec<Line<'static>> = wrap_folded(th, &e.to_string(), inner.width as usize)
                .iter()
                .map(|l| styled(l, th.warn(), th))
                .collect();
            f.render_widget(Paragraph::new(ls), inner);
        }
    }
}

/// Draw the pane, scrolled by `scroll` lines.
pub fn draw(f: &mut Frame, area: Rect, a: &Analysis, scroll: u16, th: &Theme) {
    let b = block("Normal modes", th);
    let inner = b.inner(area);
    f.render_widget(b, area);
    let ls = lines(a, th, inner.width as usize);
    f.render_widget(Paragraph::new(ls).scroll((scroll, 0)), inner);
}
