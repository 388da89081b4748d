//! Representation: χ of the current set class by class, the reduction formula worked out
//! irrep by irrep, and the result — or, for an impossible χ, which multiplicities fail and
//! the single-class changes that would make it a representation.

use super::super::app::App;
use super::super::text::{pad_left, width, wrap};
use super::super::theme::Theme;
use super::{block, fold, styled};
use crate::analysis::{Analysis, Outcome, SetAnalysis};
use crate::exact::Notation;
use crate::report::reduction::worked_lines;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::Paragraph;
use ratatui::Frame;

/// Aligned rows: classes, unmoved, per member, χ. When they are wider than `room`, the row
/// labels stay and the class columns start at column `skip` (←/→ move it), with a line
/// saying which classes are shown.
fn class_rows(
    a: &Analysis,
    s: &SetAnalysis,
    th: &Theme,
    nt: Notation,
    skip: usize,
    room: usize,
) -> Vec<Line<'static>> {
    let symbols = a.class_symbols(th.ascii);
    let chi: Vec<String> = match &*s.outcome {
        Outcome::Finite { chi, .. } => chi.0.iter().map(|v| v.text(nt)).collect(),
        _ => vec![String::new(); symbols.len()],
    };
    let each: Vec<String> = s.per_member.iter().map(|v| v.text(nt)).collect();
    let unmoved: Vec<String> = s.unmoved.iter().map(|v| v.to_string()).collect();
    let w: Vec<usize> = (0..symbols.len())
        .map(|c| {
            [
                width(&symbols[c]),
                width(chi.get(c).map(String::as_str).unwrap_or("")),
                width(each.get(c).map(String::as_str).unwrap_or("")),
                3,
            ]
            .into_iter()
            .max()
            .unwrap_or(3)
        })
        .collect();
    let n = symbols.len();
    let full: usize = 12 + w.iter().map(|x| x + 1).sum::<usize>();
    let skip = if full > room {
        skip.min(n.saturating_sub(1))
    } else {
        0
    };
    let row = |label: &str, vals: &[String], st| {
        let mut spans = vec![Span::styled(format!("{label:<12}"), st)];
        for (c, v) in vals.iter().enumerate().skip(skip) {
            spans.push(Span::styled(format!(" {}", pad_left(v, w[c])), st));
        }
        Line::from(spans)
    };
    let mut out = Vec::new();
    if full > room {
        // The last class column that fits after the fixed labels.
        let mut used = 12;
        let mut last = skip;
        for (c, x) in w.iter().enumerate().skip(skip) {
            if used + x + 1 > room {
                break;
            }
            used += x + 1;
            last = c + 1;
        }
        out.push(styled(
            &format!(
                "classes {}–{} of {n} shown; ←/→ scroll them sideways",
                skip + 1,
                last.max(skip + 1)
            ),
            th.dim(),
            th,
        ));
    }
    out.extend([
        row("", &symbols, th.heading()),
        row("unmoved", &unmoved, ratatui::style::Style::default()),
    ]);
    if !each.is_empty() {
        out.push(row("each", &each, th.dim()));
    }
    if !chi.iter().all(String::is_empty) {
        out.push(row(th.pick("χ", "chi"), &chi, th.heading()));
    }
    out
}

/// All the lines of the panel (also used by tests and the snapshot of a long reduction).
pub fn lines(app: &App, th: &Theme, width_cols: usize) -> Vec<Line<'static>> {
    let nt = if th.ascii {
        Notation::Ascii
    } else {
        Notation::Unicode
    };
    let a = match &app.analysis {
        Ok(a) => a,
        Err(e) => return vec![styled(&e.to_string(), th.warn(), th)],
    };
    let Some(s) = a.sets.get(app.members_ui.set) else {
        return vec![styled(
            "No member sets yet: start one in the Members panel (n).",
            th.warn(),
            th,
        )];
    };
    let mut out = vec![styled(
        &format!(
            "Set {}/{}: {} ({}, {} members) — ] next set",
            app.members_ui.set + 1,
            a.sets.len(),
            s.name,
            s.kind.name(),
            s.members.len()
        ),
        th.heading(),
        th,
    )];
    out.push(styled(
        &format!("χ = unmoved × each; each: {}", s.kind.contribution()),
        th.dim(),
        th,
    ));
    out.push(Line::raw(""));
    out.extend(class_rows(
        a,
        s,
        th,
        nt,
        app.rep_hscroll as usize,
        width_cols,
    ));
    out.push(Line::raw(""));
    let g = &a.group;
    match &*s.outcome {
        Outcome::Empty => out.push(styled("no members yet: nothing to reduce", th.dim(), th)),
        Outcome::Finite {
            reduction, result, ..
        } => {
            let summary = crate::report::session::set_result(a, s, th.ascii);
            match result {
                Ok(_) => out.push(styled(&summary, th.result(), th)),
                Err(inv) => {
                    let mut it = summary.lines();
                    if let Some(first) = it.next() {
                        for piece in wrap(first, width_cols) {
                            out.push(styled(&piece, th.error(), th));
                        }
                    }
                    if inv.suggestions.is_empty() && app.analysis_pending() {
                        out.push(styled(
                            "looking for single-class corrections…",
                            th.dim(),
                            th,
                        ));
                    } else if inv.suggestions.is_empty() {
                        out.push(styled(
                            "no single-class change makes this a representation: check several ticks",
                            th.warn(),
                            th,
                        ));
                    } else {
                        out.push(styled(
                            "single-class changes of χ that would give a representation:",
                            th.warn(),
                            th,
                        ));
                        for h in it {
                            out.push(styled(h, th.warn(), th));
                        }
                    }
                }
            }
            out.push(Line::raw(""));
            out.push(styled(
                &format!(
                    "Worked: n(i) = 1/h Σ g·χ(R)·χi(R)*, h = {}, terms in class order",
                    reduction.order
                ),
                th.dim(),
                th,
            ));
            for l in worked_lines(g, reduction, nt) {
                for (k, piece) in wrap(&l, width_cols.saturating_sub(4))
                    .into_iter()
                    .enumerate()
                {
                    let indent = if k == 0 { "" } else { "    " };
                    out.push(Line::raw(format!("{indent}{piece}")));
                }
            }
        }
        Outcome::Linear(r) => {
            let res = crate::report::session::set_result(a, s, th.ascii);
            let st = if r.is_ok() { th.result() } else { th.error() };
            for piece in wrap(&res, width_cols) {
                out.push(styled(&piece, st, th));
            }
        }
        Outcome::Failed(e) => out.push(styled(e, th.error(), th)),
    }
    let vib = crate::report::session::vibration_lines(a, s, th.ascii);
    if !vib.is_empty() {
        out.push(Line::raw(""));
        for l in vib {
            out.push(styled(&l, th.heading(), th));
        }
    }
    out
}

pub fn draw(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    let b = block("Representation", th);
    let inner = b.inner(area);
    f.render_widget(b, area);
    let ls: Vec<Line> = lines(app, th, inner.width as usize)
        .into_iter()
        .map(|l| {
            if th.ascii {
                Line::from(
                    l.spans
                        .into_iter()
                        .map(|s| Span::styled(fold(&s.content, th), s.style))
                        .collect::<Vec<_>>(),
                )
            } else {
                l
            }
        })
        .collect();
    let max = ls.len().saturating_sub(inner.height as usize) as u16;
    f.render_widget(
        Paragraph::new(ls).scroll((app.scroll_of(crate::tui::Panel::Representation).min(max), 0)),
        inner,
    );
}
