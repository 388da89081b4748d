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
        let labels: Vec<String> = a
            .group
            .table
            .irreps
            .iter()
            .map(|i| i.label.clone())
            .collect();
        let text_lines = |lines: &mut Vec<Line<'static>>, md: &str| {
            let md = if th.ascii {
                md.to_string()
            } else {
                unicode_labels(md, &labels)
            };
            for l in super::super::text::align_md_tables(&md).lines() {
                let rule = l.len() > 3 && l.chars().all(|c| c == '-');
                let l = if rule && !th.ascii {
                    "─".repeat(l.len())
                } else {
                    l.to_string()
                };
                let l = l.as_str();
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
                        let placed = c.fundamentals.iter().any(|f| f.position_cm.is_some());
                        if !placed {
                            for l in super::wrap_folded(
                                th,
                                "v gives a fundamental its position (ν number and cm⁻¹); the \
                                 harmonic positions of its overtones and combinations fill in.",
                                width,
                            ) {
                                lines.push(styled(&l, th.dim(), th));
                            }
                        }
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
    notes_lines(&mut lines, app, th, inner.width as usize);
    let bands = &app.session.bands;
    lines.push(styled(
        &format!("Observed bands ({})", bands.len()),
        th.heading(),
        th,
    ));
    if bands.is_empty() {
        lines.push(styled(
            "none recorded: + adds one (position technique [intensity] [p|dp] [note])",
            th.dim(),
            th,
        ));
    } else {
        lines.push(styled(
            &format!(
                "{}{}{}{}{}{}",
                pad("#", 4),
                pad(th.pick("cm⁻¹", "cm-1"), 10),
                pad("technique", 11),
                pad("intensity", 11),
                pad("pol.", 6),
                "note"
            ),
            th.dim(),
            th,
        ));
        for (k, b) in bands.iter().enumerate() {
            lines.push(styled(
                &format!(
                    "{}{}{}{}{}{}",
                    pad(&format!("{}", k + 1), 4),
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

/// The session's notes, numbered (W edits them).
fn notes_lines(lines: &mut Vec<Line<'static>>, app: &App, th: &Theme, width: usize) {
    let notes = super::super::session_edit::note_lines(&app.session.notes);
    lines.push(styled(
        &format!("Notes ({} lines)", notes.len()),
        th.heading(),
        th,
    ));
    if notes.is_empty() {
        lines.push(styled("none: W writes a line", th.dim(), th));
    }
    for (k, n) in notes.iter().enumerate() {
        let lead = format!("{:<4}", k + 1);
        for (i, piece) in super::wrap_folded(th, n, width.saturating_sub(4))
            .into_iter()
            .enumerate()
        {
            let l = if i == 0 { lead.clone() } else { "    ".into() };
            lines.push(Line::raw(format!("{l}{piece}")));
        }
    }
    lines.push(Line::raw(""));
}

/// The report's ASCII irrep labels (`A1'`, `E2g`) in the workspace's Unicode style (A₁′, E₂g):
/// only whole words that are labels of the group's own irreps are changed.
pub fn unicode_labels(text: &str, labels: &[String]) -> String {
    let is_word = |c: char| c.is_ascii_alphanumeric() || c == '\'' || c == '"';
    let mut out = String::with_capacity(text.len());
    let mut word = String::new();
    let flush = |word: &mut String, out: &mut String| {
        // A multiplicity written against the label (`2E'`) stays in front of it.
        let label = word.trim_start_matches(|c: char| c.is_ascii_digit());
        if labels.iter().any(|l| l == label) {
            out.push_str(&word[..word.len() - label.len()]);
            out.push_str(&crate::group::display_label(label));
        } else {
            out.push_str(word);
        }
        word.clear();
    };
    for c in text.chars() {
        if is_word(c) {
            word.push(c);
        } else {
            flush(&mut word, &mut out);
            out.push(c);
        }
    }
    flush(&mut word, &mut out);
    out
}

#[cfg(test)]
mod tests {
    use super::unicode_labels;

    /// D3h labels (Cotton, Appendix IIA) inside a report line; other words untouched.
    #[test]
    fn labels_of_the_group_and_only_they_change() {
        let labels: Vec<String> = ["A1'", "A2'", "E'", "A1''", "A2''", "E''"]
            .iter()
            .map(|s| s.to_string())
            .collect();
        let out = unicode_labels("| A1' | E'' | x, y | A1g Eq |", &labels);
        assert_eq!(out, "| A₁′ | E″ | x, y | A1g Eq |");
        // A multiplicity in front of a label (Γ = A1' + 2E'), and a ν name that is no label.
        let out = unicode_labels("Γ = A1' + 2E' + A2'' ; 2ν1 12", &labels);
        assert_eq!(out, "Γ = A₁′ + 2E′ + A₂″ ; 2ν1 12");
    }
}
