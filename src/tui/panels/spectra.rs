//! Spectra: for the session's Γvib (geometry, else a Cartesian set) the IR/Raman activity and
//! band counts, the check of the observed bands, and the overtones and binary combinations;
//! the activity of each stretch/bend set's Γ; the observed bands as recorded.

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
        let width = inner.width as usize;
        let text_lines = |lines: &mut Vec<Line<'static>>, md: &str| {
            for l in super::super::text::align_md_tables(md).lines() {
                for piece in super::wrap_folded(th, l, width) {
                    lines.push(styled(&piece, ratatui::style::Style::default(), th));
                }
            }
        };
        match &a.spectra {
            Some(sp) => {
                lines.push(styled(
                    &format!("Fundamentals: Γvib of {}", sp.source),
                    th.heading(),
                    th,
                ));
                match &sp.modes {
                    Ok(r) => text_lines(
                        &mut lines,
                        &crate::spectra::render::modes_markdown(r).replacen("Γ =", "Γvib =", 1),
                    ),
                    Err(e) => lines.push(styled(e, th.warn(), th)),
                }
                lines.push(Line::raw(""));
                match &sp.check {
                    None => lines.push(styled(
                        "Band-list check: no observed bands in the session ([[band]] entries)",
                        th.dim(),
                        th,
                    )),
                    Some(Ok(c)) => {
                        lines.push(styled(
                            "Band-list check (candidates, not assignments)",
                            th.heading(),
                            th,
                        ));
                        text_lines(&mut lines, &crate::spectra::render::check_markdown(c));
                    }
                    Some(Err(e)) => lines.push(styled(e, th.warn(), th)),
                }
                lines.push(Line::raw(""));
                match &sp.combinations {
                    Ok(c) => {
                        lines.push(styled(
                            &format!(
                                "Overtones and binary combinations ({} levels)",
                                c.levels.len()
                            ),
                            th.heading(),
                            th,
                        ));
                        text_lines(
                            &mut lines,
                            &crate::spectra::render::combinations_markdown(c),
                        );
                    }
                    Err(e) => lines.push(styled(e, th.warn(), th)),
                }
                lines.push(Line::raw(""));
            }
            None if a.depth == crate::analysis::Depth::Quick => {
                lines.push(styled("Working out the spectra…", th.dim(), th));
                lines.push(Line::raw(""));
            }
            None => {
                for l in super::wrap_folded(
                    th,
                    "No Γvib yet: give the session a geometry, or a Cartesian set of all the \
                     atoms, to predict activity, overtones and combinations and to check the \
                     observed bands.",
                    width,
                ) {
                    lines.push(styled(&l, th.dim(), th));
                }
                lines.push(Line::raw(""));
            }
        }
        for set in &a.sets {
            let Some(Ok(r)) = &set.modes else { continue };
            if set.vibrations.is_some() && a.spectra.is_some() {
                continue;
            }
            lines.push(styled(
                &format!("{} ({}): activity of its Γ", set.name, set.kind.name()),
                th.heading(),
                th,
            ));
            text_lines(&mut lines, &crate::spectra::render::modes_markdown(r));
            lines.push(Line::raw(""));
        }
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
        Paragraph::new(lines).scroll((app.scroll_of(crate::tui::Panel::Spectra).min(max), 0)),
        inner,
    );
}
