//! Point group: the list of groups (browse by family, or type to find by name, family or
//! order) beside the character table of the highlighted group, with its function columns and
//! the axis convention the table uses.

use super::super::app::App;
use super::super::text::{pad, pad_left, trunc, width, wrap};
use super::super::theme::Theme;
use super::{block, fold, styled};
use crate::exact::Notation;
use crate::group::{self, PointGroup};
use crate::report::table::pretty_function;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::Paragraph;
use ratatui::Frame;

/// Width of the list column.
fn list_width(area: Rect) -> u16 {
    if area.width >= 110 {
        26
    } else {
        20
    }
}

/// The list rows as drawn: a family heading (`None`) or a group (index into the matches).
fn rows(app: &App) -> Vec<(Option<usize>, String)> {
    let matches = app.group_matches();
    let mut out = Vec::new();
    let mut last_family = String::new();
    let browsing = app.group_ui.query.trim().is_empty();
    for (i, e) in matches.iter().enumerate() {
        if browsing && e.family != last_family {
            out.push((None, e.family.clone()));
            last_family = e.family.clone();
        }
        let order = e
            .order
            .map(|o| o.to_string())
            .unwrap_or_else(|| "inf".into());
        let name = if app.ascii {
            e.name.clone()
        } else {
            e.symbol.clone()
        };
        out.push((Some(i), format!("{name} {order}")));
    }
    out
}

/// First list row shown so that the cursor is visible.
fn first_row(app: &App, rows: &[(Option<usize>, String)], visible: usize) -> usize {
    let pos = rows
        .iter()
        .position(|(i, _)| *i == Some(app.group_ui.cursor))
        .unwrap_or(0);
    if pos < visible {
        0
    } else {
        pos + 1 - visible
    }
}

pub fn draw(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    let lw = list_width(area).min(area.width);
    let left = Rect::new(area.x, area.y, lw, area.height);
    let right = Rect::new(area.x + lw, area.y, area.width - lw, area.height);
    draw_list(f, left, app, th);
    let matches = app.group_matches();
    let chosen = matches.get(app.group_ui.cursor).map(|e| e.name.clone());
    let b = block("Character table", &th.with_focus(false));
    let inner = b.inner(right);
    f.render_widget(b, right);
    let lines = match chosen.as_deref().map(group::load) {
        Some(Ok(g)) => table_lines(&g, app, th, inner.width as usize),
        Some(Err(e)) => vec![styled(&e.to_string(), th.error(), th)],
        None if app.catalogue.is_empty() => vec![styled("loading the tables…", th.dim(), th)],
        None => vec![styled("no group matches the search", th.warn(), th)],
    };
    let max = lines.len().saturating_sub(inner.height as usize) as u16;
    f.render_widget(
        Paragraph::new(lines).scroll((
            app.scroll_of(crate::tui::Panel::Group).min(max),
            app.group_ui.table_scroll,
        )),
        inner,
    );
}

fn draw_list(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    let b = block("Point group", th);
    let inner = b.inner(area);
    f.render_widget(b, area);
    let w = inner.width as usize;
    let mut lines = Vec::new();
    let q = &app.group_ui.query;
    if app.group_ui.typing || !q.is_empty() {
        let cursor = if app.group_ui.typing {
            th.pick("█", "_")
        } else {
            ""
        };
        lines.push(Line::from(vec![
            Span::styled("/", th.key()),
            Span::raw(trunc(q, w.saturating_sub(2))),
            Span::styled(cursor, th.key()),
        ]));
    } else {
        lines.push(styled(&trunc("/ to find", w), th.dim(), th));
    }
    let current = app.session.group.clone().unwrap_or_default();
    let rs = rows(app);
    let visible = (inner.height as usize).saturating_sub(1);
    let first = first_row(app, &rs, visible);
    let matches = app.group_matches();
    for (i, text) in rs.iter().skip(first).take(visible) {
        match i {
            None => lines.push(styled(&trunc(text, w), th.heading(), th)),
            Some(i) => {
                let is_current = matches.get(*i).map(|e| e.name == current).unwrap_or(false);
                let mark = if is_current { th.pick("▸", ">") } else { " " };
                let t = pad(&format!("{mark}{text}"), w);
                let st = if *i == app.group_ui.cursor {
                    th.cursor()
                } else if is_current {
                    th.result()
                } else {
                    ratatui::style::Style::default()
                };
                lines.push(Line::from(Span::styled(t, st)));
            }
        }
    }
    if rs.is_empty() && !app.catalogue.is_empty() {
        lines.push(styled("no match", th.warn(), th));
    }
    f.render_widget(Paragraph::new(lines), inner);
}

/// The table as lines: header, one row per irrep, function columns, then the convention.
pub fn table_lines(g: &PointGroup, app: &App, th: &Theme, w: usize) -> Vec<Line<'static>> {
    let t = &g.table;
    let nt = if th.ascii {
        Notation::Ascii
    } else {
        Notation::Unicode
    };
    let name = if th.ascii {
        t.name.clone()
    } else {
        t.symbol.clone()
    };
    let order = t
        .order
        .map(|o| format!("order {o}"))
        .unwrap_or_else(|| "infinite order".into());
    let in_use = app.session.group.as_deref() == Some(t.name.as_str());
    let mut out = vec![Line::from(vec![
        Span::styled(format!("{name}  "), th.heading()),
        Span::styled(
            format!(
                "{} family, {order}, {} class{}",
                t.family.name(),
                t.classes.len(),
                if t.classes.len() == 1 { "" } else { "es" }
            ),
            th.dim(),
        ),
        Span::styled(
            if in_use {
                "  (this session's group)".to_string()
            } else {
                "  (Enter uses it)".to_string()
            },
            if in_use { th.result() } else { th.key() },
        ),
    ])];
    out.push(Line::raw(""));
    let labels: Vec<String> = t
        .irreps
        .iter()
        .map(|i| {
            if th.ascii {
                i.label.clone()
            } else {
                i.display()
            }
        })
        .collect();
    let chars: Vec<Vec<String>> = t
        .irreps
        .iter()
        .map(|ir| {
            (0..t.classes.len())
                .map(|c| match ir.chars.get(c) {
                    Some(v) => v.text(nt),
                    None => {
                        let s = ir.char_text[c].clone();
                        if th.ascii {
                            s
                        } else {
                            s.replace("phi", "φ").replace('-', "−")
                        }
                    }
                })
                .collect()
        })
        .collect();
    let symbols: Vec<String> = t
        .classes
        .iter()
        .map(|c| {
            if th.ascii {
                c.ascii.clone()
            } else {
                c.symbol.clone()
            }
        })
        .collect();
    let lab_w = labels
        .iter()
        .map(|l| width(l))
        .max()
        .unwrap_or(2)
        .max(width(&name))
        + 1;
    let col_w: Vec<usize> = (0..t.classes.len())
        .map(|c| {
            chars
                .iter()
                .map(|r| width(&r[c]))
                .chain([width(&symbols[c])])
                .max()
                .unwrap_or(1)
                + 1
        })
        .collect();
    let fn_w = w
        .saturating_sub(lab_w + col_w.iter().sum::<usize>() + 2)
        .max(12);
    let mut head = vec![Span::styled(pad("", lab_w), th.heading())];
    for (c, s) in symbols.iter().enumerate() {
        head.push(Span::styled(pad_left(s, col_w[c]), th.heading()));
    }
    head.push(Span::styled("  functions", th.heading()));
    out.push(Line::from(head));
    for (i, ir) in t.irreps.iter().enumerate() {
        let mut spans = vec![Span::styled(pad(&labels[i], lab_w), th.key())];
        for (c, v) in chars[i].iter().enumerate() {
            spans.push(Span::raw(pad_left(v, col_w[c])));
        }
        let funcs: Vec<String> = ir
            .functions
            .all()
            .map(|f| {
                if th.ascii {
                    f.text.clone()
                } else {
                    pretty_function(&f.text)
                }
            })
            .collect();
        spans.push(Span::styled(
            format!("  {}", trunc(&funcs.join("; "), fn_w)),
            th.dim(),
        ));
        out.push(Line::from(spans));
    }
    out.push(Line::raw(""));
    out.push(styled("Axes in this table:", th.heading(), th));
    for l in wrap(t.orientation.trim(), w.saturating_sub(1)) {
        out.push(Line::raw(fold(&l, th)));
    }
    if in_use && !app.session.orientation.is_empty() {
        out.push(styled("This molecule:", th.heading(), th));
        for l in wrap(&app.session.orientation, w.saturating_sub(1)) {
            out.push(Line::raw(fold(&l, th)));
        }
    }
    out
}

/// A click on a group in the list highlights it.
pub fn click(app: &mut App, area: Rect, x: u16, y: u16) {
    let lw = list_width(area).min(area.width);
    if x >= area.x + lw || y <= area.y + 1 {
        return;
    }
    let visible = (area.height as usize).saturating_sub(3);
    let rs = rows(app);
    let first = first_row(app, &rs, visible);
    let k = first + (y - area.y - 2) as usize;
    if let Some((Some(i), _)) = rs.get(k) {
        app.group_ui.cursor = *i;
    }
}
