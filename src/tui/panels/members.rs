//! Members: the tick grid of the current member set — one row per member, one column per
//! class, a mark where the class's chosen operation leaves the member in place — with the
//! unmoved counts, χ and the result underneath, updated on every tick. Where the session has a
//! geometry and a member names its atoms, a cell whose tick the geometry contradicts is marked
//! with `!` before its mark (in the warning style), and a line under the grid counts them.

use super::super::action::Action;
use super::super::app::App;
use super::super::keymap;
use super::super::text::{pad, pad_left, trunc, width};
use super::super::theme::Theme;
use super::{block, fold, styled};
use crate::analysis::{Analysis, Outcome, SetAnalysis};
use crate::exact::Notation;
use ratatui::layout::Rect;
use ratatui::style::Modifier;
use ratatui::text::{Line, Span};
use ratatui::widgets::Paragraph;
use ratatui::Frame;

/// Where the grid's rows and columns sit inside the panel.
#[derive(Debug, Clone)]
pub struct Grid {
    /// Inner area of the panel.
    pub inner: Rect,
    pub name_w: u16,
    /// (class index, x offset from inner.x, width) of the columns shown.
    pub cols: Vec<(usize, u16, u16)>,
    /// y offset (from inner.y) of the first member row.
    pub row_y: u16,
    /// First member shown, and how many fit.
    pub first_row: usize,
    pub visible_rows: usize,
}

/// Lines above the grid rows (set line, header) and below (counts, χ, result).
const ABOVE: u16 = 2;
const BELOW: u16 = 4;

/// Marks of a cell the geometry contradicts: ticked but moved, unticked but left in place.
fn contradicted_marks(th: &Theme) -> (&'static str, &'static str) {
    if th.ascii {
        ("!x", "!.")
    } else {
        ("!●", "!·")
    }
}

/// The key that takes the geometry's ticks, as the key map has it.
fn take_key(ascii: bool) -> String {
    keymap::BINDINGS
        .iter()
        .find(|b| b.action == Action::TakeGeometryTicks)
        .map(|b| keymap::keys_label(b, ascii))
        .unwrap_or_default()
}

/// The line under the grid about the geometry (only when the session has one), and whether it
/// reports contradicted cells.
fn geometry_line(a: &Analysis, s: &SetAnalysis, ascii: bool) -> Option<(String, bool)> {
    a.geometry.as_ref()?;
    let gt = &s.geometry_ticks;
    let n = gt.disagreements.len();
    let checked = gt.compared();
    let text = if n > 0 {
        format!(
            "{n} cell{} disagree{} with the geometry (marked !): {} takes the geometry's ticks",
            if n == 1 { "" } else { "s" },
            if n == 1 { "s" } else { "" },
            take_key(ascii)
        )
    } else if checked > 0 {
        let mut t = format!(
            "ticks agree with the geometry ({checked} member{} checked)",
            if checked == 1 { "" } else { "s" }
        );
        if let Some(r) = &gt.reason {
            t.push_str(&format!("; {r}"));
        }
        t
    } else {
        format!(
            "geometry: {}",
            gt.reason.as_deref().unwrap_or("ticks not checked")
        )
    };
    Some((text, n > 0))
}

fn chi_texts(s: &SetAnalysis, nt: Notation) -> Vec<String> {
    match &*s.outcome {
        Outcome::Finite { chi, .. } => chi.0.iter().map(|v| v.text(nt)).collect(),
        _ => s.unmoved.iter().map(|_| String::new()).collect(),
    }
}

/// Lay out the grid for the current set (pure: the same for drawing and clicking).
pub fn grid(area: Rect, app: &App, a: &Analysis, s: &SetAnalysis) -> Grid {
    let inner = block("", &Theme::new(false, app.ascii)).inner(area);
    let nt = if app.ascii {
        Notation::Ascii
    } else {
        Notation::Unicode
    };
    let names_w = s.members.iter().map(|m| width(m)).max().unwrap_or(0);
    let name_w = (names_w.max(8) + 1).min(16) as u16;
    let symbols = a.class_symbols(app.ascii);
    let chis = chi_texts(s, nt);
    let widths: Vec<u16> = symbols
        .iter()
        .zip(&chis)
        .map(|(sym, c)| (width(sym).max(width(c)).max(3) + 1) as u16)
        .collect();
    // Columns shown: scroll sideways so that the cursor's column is visible.
    let room = inner.width.saturating_sub(name_w);
    let cur = app.members_ui.col.min(widths.len().saturating_sub(1));
    let mut first = 0usize;
    loop {
        let used: u16 = widths[first..=cur].iter().sum();
        if used <= room || first == cur {
            break;
        }
        first += 1;
    }
    let mut cols = Vec::new();
    let mut x = name_w;
    for (c, w) in widths.iter().enumerate().skip(first) {
        if x + w > inner.width {
            break;
        }
        cols.push((c, x, *w));
        x += w;
    }
    let below = BELOW + u16::from(a.geometry.is_some());
    let visible_rows = inner.height.saturating_sub(ABOVE + below).max(1) as usize;
    let row = app.members_ui.row;
    let first_row = if row < visible_rows {
        0
    } else {
        row + 1 - visible_rows
    };
    Grid {
        inner,
        name_w,
        cols,
        row_y: ABOVE,
        first_row,
        visible_rows,
    }
}

pub fn draw(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    let b = block("Members", th);
    let inner = b.inner(area);
    f.render_widget(b, area);
    let a = match &app.analysis {
        Ok(a) => a,
        Err(e) => {
            let lines = vec![
                styled(&e.to_string(), th.warn(), th),
                Line::raw(""),
                styled(
                    "The tick grid needs the classes of a point group: press 1 or / to choose one.",
                    th.dim(),
                    th,
                ),
            ];
            f.render_widget(
                Paragraph::new(lines).wrap(ratatui::widgets::Wrap { trim: true }),
                inner,
            );
            return;
        }
    };
    let Some(s) = a.sets.get(app.members_ui.set) else {
        let lines = vec![
            styled("No member sets yet.", th.warn(), th),
            Line::raw(""),
            styled(
                "n starts a set (bond stretches, Cartesian displacements, ligand π orbitals …);",
                th.dim(),
                th,
            ),
            styled(
                "a adds members; Space ticks the classes that leave a member in place.",
                th.dim(),
                th,
            ),
        ];
        f.render_widget(Paragraph::new(lines), inner);
        return;
    };
    let g = grid(area, app, a, s);
    let nt = if app.ascii {
        Notation::Ascii
    } else {
        Notation::Unicode
    };
    let (tick, blank) = th.marks();
    let (bad_tick, bad_blank) = contradicted_marks(th);
    let mut lines: Vec<Line> = Vec::new();
    // Set line.
    let nsets = a.sets.len();
    let set_line = format!(
        "Set {}/{}: {} — {}: {}",
        app.members_ui.set + 1,
        nsets,
        s.name,
        s.kind.name(),
        s.kind.contribution()
    );
    lines.push(styled(
        &trunc(&fold(&set_line, th), inner.width as usize),
        th.heading(),
        th,
    ));
    // Header.
    let symbols = a.class_symbols(app.ascii);
    let mut head = vec![Span::raw(pad("", g.name_w as usize))];
    for (c, _, w) in &g.cols {
        let st = if *c == app.members_ui.col {
            th.key()
        } else {
            th.heading()
        };
        head.push(Span::styled(
            pad_left(&symbols[*c], *w as usize - 1) + " ",
            st,
        ));
    }
    lines.push(Line::from(head));
    // Member rows.
    for (mi, m) in s
        .members
        .iter()
        .enumerate()
        .skip(g.first_row)
        .take(g.visible_rows)
    {
        let name_st = if mi == app.members_ui.row {
            th.key()
        } else {
            ratatui::style::Style::default()
        };
        let mut spans = vec![Span::styled(pad(m, g.name_w as usize), name_st)];
        for (c, _, w) in &g.cols {
            let on = s.grid[mi][*c];
            let contradicted = s.geometry_ticks.disagrees(mi, *c);
            let mark = match (on, contradicted) {
                (true, false) => tick,
                (false, false) => blank,
                (true, true) => bad_tick,
                (false, true) => bad_blank,
            };
            let mut st = match (on, contradicted) {
                (_, true) => th.warn().add_modifier(Modifier::BOLD),
                (true, false) => th.tick(),
                (false, false) => th.dim(),
            };
            if mi == app.members_ui.row && *c == app.members_ui.col {
                st = th.cursor();
            }
            spans.push(Span::styled(pad_left(mark, *w as usize - 1), st));
            spans.push(Span::raw(" "));
        }
        lines.push(Line::from(spans));
    }
    if s.members.is_empty() {
        lines.push(styled("  (no members yet: a adds one)", th.dim(), th));
    }
    // Counts and χ.
    let chis = chi_texts(s, nt);
    let mut unmoved = vec![Span::styled(pad("unmoved", g.name_w as usize), th.dim())];
    let mut chi = vec![Span::styled(
        pad(th.pick("χ", "chi"), g.name_w as usize),
        th.heading(),
    )];
    for (c, _, w) in &g.cols {
        unmoved.push(Span::raw(
            pad_left(&s.unmoved[*c].to_string(), *w as usize - 1) + " ",
        ));
        chi.push(Span::styled(
            pad_left(&chis[*c], *w as usize - 1) + " ",
            th.heading(),
        ));
    }
    lines.push(Line::from(unmoved));
    lines.push(Line::from(chi));
    // Result.
    let result = crate::report::session::set_result(a, s, app.ascii);
    let first = result.lines().next().unwrap_or("").to_string();
    let st = if s.multiplicities().is_some() {
        th.result()
    } else {
        th.error()
    };
    lines.push(Line::from(Span::styled(
        trunc(&fold(&first, th), inner.width as usize),
        st,
    )));
    let geo = geometry_line(a, s, app.ascii);
    if let Some((text, bad)) = &geo {
        let st = if *bad { th.warn() } else { th.dim() };
        for l in super::wrap_folded(th, text, inner.width as usize) {
            lines.push(styled(&l, st, th));
        }
    }
    let legend = if geo.as_ref().is_some_and(|(_, bad)| *bad) {
        format!(
            "{bad_tick} ticked but the geometry moves it; {bad_blank} unticked but the geometry \
             leaves it in place"
        )
    } else if s.multiplicities().is_none() && !s.members.is_empty() {
        "3 Representation shows the worked sum and single-class fixes".to_string()
    } else {
        format!(
            "{tick} = one operation of that class (the same for every row) leaves the member in place"
        )
    };
    for l in super::wrap_folded(th, &legend, inner.width as usize) {
        lines.push(styled(&l, th.dim(), th));
    }
    lines.extend(super::set_salcs::legend(app, a, th, inner.width as usize));
    if !s.unknown_ticks.is_empty() {
        let names: Vec<String> = s
            .unknown_ticks
            .iter()
            .map(|(m, c)| format!("{}:{c}", s.members[*m]))
            .collect();
        lines.push(styled(
            &trunc(
                &format!(
                    "ticks naming no class of {}: {}",
                    a.group.name(),
                    names.join(" ")
                ),
                inner.width as usize,
            ),
            th.warn(),
            th,
        ));
    } else if g.cols.len() < symbols.len() {
        let hidden = symbols.len() - g.cols.len();
        lines.push(styled(
            &format!("{hidden} more class column(s): ← → scroll sideways"),
            th.dim(),
            th,
        ));
    }
    f.render_widget(Paragraph::new(lines), inner);
}

/// A click in the panel: on a cell moves there and ticks it; on a name selects the row.
pub fn click(app: &mut App, area: Rect, x: u16, y: u16) {
    let Ok(a) = app.analysis.clone() else { return };
    let Some(s) = a.sets.get(app.members_ui.set) else {
        return;
    };
    let g = grid(area, app, &a, s);
    if y < g.inner.y + g.row_y || x < g.inner.x {
        return;
    }
    let row = g.first_row + (y - g.inner.y - g.row_y) as usize;
    if row >= s.members.len() || row >= g.first_row + g.visible_rows {
        return;
    }
    let dx = x - g.inner.x;
    app.members_ui.row = row;
    if dx < g.name_w {
        return;
    }
    if let Some((c, _, _)) = g.cols.iter().find(|(_, x0, w)| dx >= *x0 && dx < x0 + w) {
        app.members_ui.col = *c;
        app.toggle();
    }
}
