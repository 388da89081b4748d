//! Spectra: IR/Raman activity, band counts, overtones and the check of the observed band list.
//! The spectra layer is not in this build yet, so the panel says so and shows what exists:
//! the observed bands recorded in the session.

use super::super::app::App;
use super::super::text::pad;
use super::super::theme::Theme;
use super::{block, missing_layer, styled};
use crate::analysis::LayerStatus;
use ratatui::layout::Rect;
use ratatui::text::Line;
use ratatui::widgets::Paragraph;
use ratatui::Frame;

pub fn draw(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    let b = block("Spectra", th);
    let inner = b.inner(area);
    f.render_widget(b, area);
    let mut lines = Vec::new();
    if let Ok(a) = &app.analysis {
        if let LayerStatus::Missing(m) = &a.layers.spectra {
            lines.extend(missing_layer(m, th, inner.width as usize));
            lines.push(Line::raw(""));
        }
    }
    if let Ok(a) = &app.analysis {
        for set in &a.sets {
            let Some(m) = &set.modes else { continue };
            lines.push(styled(
                &format!("{} ({})", set.name, set.kind.name()),
                th.heading(),
                th,
            ));
            match m {
                Ok(r) => {
                    let what = if set.vibrations.is_some() {
                        "Γvib"
                    } else {
                        "Γ"
                    };
                    for l in crate::spectra::render::modes_markdown(r).lines() {
                        let l = l.replacen("Γ =", &format!("{what} ="), 1);
                        if l.starts_with("|---") {
                            continue;
                        }
                        for piece in super::super::text::wrap(&l, inner.width as usize) {
                            lines.push(styled(&piece, ratatui::style::Style::default(), th));
                        }
                    }
                }
                Err(e) => lines.push(styled(e, th.warn(), th)),
            }
            lines.push(Line::raw(""));
        }
        lines.push(styled(
            "Band-list check, overtones and descent: `salcdesk bands`, `combos`, `descend` (not yet in the workspace).",
            th.dim(),
            th,
        ));
        lines.push(Line::raw(""));
    }
    let bands = &app.session.bands;
    lines.push(styled(
        &format!("Observed bands ({})", bands.len()),
        th.heading(),
        th,
    ));
    if bands.is_empty() {
        lines.push(styled(
            "none recorded: add [[band]] entries to the session file",
            th.dim(),
            th,
        ));
    } else {
        lines.push(styled(
            &format!(
                "{}{}{}{}{}",
                pad(th.pick("cm⁻¹", "cm-1"), 10),
                pad("technique", 11),
                pad("intensity", 11),
                pad("pol.", 6),
                "note"
            ),
            th.dim(),
            th,
        ));
        for b in bands {
            lines.push(styled(
                &format!(
                    "{}{}{}{}{}",
                    pad(&format!("{}", b.position), 10),
                    pad(b.technique.name(), 11),
                    pad(&b.intensity, 11),
                    pad(b.polarization.map(|p| p.name()).unwrap_or(""), 6),
                    b.note
                ),
                ratatui::style::Style::default(),
                th,
            ));
        }
    }
    let max = lines.len().saturating_sub(inner.height as usize) as u16;
    f.render_widget(
        Paragraph::new(lines).scroll((app.scroll.min(max), 0)),
        inner,
    );
}
