//! The screen as a pure function of the state: title bar, panel tabs, the panel, the status
//! line and the key footer; the help overlay and questions on top. The same layout functions
//! serve mouse clicks, so a click always lands on what is drawn there.

use super::action::Panel;
use super::app::{App, Mode, Question};
use super::keymap;
use super::layout;
use super::panels;
use super::text::{ascii_fold, trunc, width};
use super::theme::Theme;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Block, Clear, Paragraph, Wrap};
use ratatui::Frame;

/// The fixed parts of the screen.
#[derive(Debug, Clone, Copy)]
pub struct Areas {
    pub title: Rect,
    pub tabs: Rect,
    pub body: Rect,
    pub status: Rect,
    pub footer: Rect,
}

/// Split the screen.
pub fn areas(size: Rect) -> Areas {
    let h = size.height;
    let row = |y: u16, hh: u16| {
        Rect::new(
            size.x,
            size.y + y.min(h),
            size.width,
            hh.min(h.saturating_sub(y)),
        )
    };
    let body_h = h.saturating_sub(4);
    Areas {
        title: row(0, 1),
        tabs: row(1, 1),
        body: row(2, body_h),
        status: row(2 + body_h, 1),
        footer: row(3 + body_h, 1),
    }
}

/// The theme the state asks for.
pub fn theme(app: &App) -> Theme {
    Theme::new(app.color, app.ascii)
}

/// Text of each tab and where it sits: (panel, x from, x to).
pub fn tab_ranges(app: &App, area: Rect) -> Vec<(Panel, u16, u16)> {
    let mut x = area.x;
    let mut out = Vec::new();
    for p in app.panels() {
        let t = tab_text(p, area.width);
        let w = width(&t) as u16;
        out.push((p, x, x + w));
        x += w + 1;
    }
    out
}

/// A tab's text: padded when there is room.
fn tab_text(p: Panel, w: u16) -> String {
    if w >= 90 {
        format!(" {} {} ", p.index() + 1, p.title())
    } else {
        format!("{} {}", p.index() + 1, p.title())
    }
}

/// Draw everything.
pub fn draw(f: &mut Frame, app: &App) {
    let th = theme(app);
    let a = areas(f.area());
    title_bar(f, a.title, app, &th);
    tabs(f, a.tabs, app, &th);
    let tiles = layout::tiles(
        a.body,
        (f.area().width, f.area().height),
        app.panel,
        app.zoom,
        app.grid_rows(),
    );
    let several = tiles.len() > 1;
    for t in &tiles {
        let pth = th.with_focus(several && t.panel == app.panel);
        pane(f, t.panel, t.area, app, &pth);
    }
    status_line(f, a.status, app, &th);
    footer(f, a.footer, app, &th);
    match &app.mode {
        Mode::Help { scroll } => panels::help::draw(f, a.body, app, &th, *scroll),
        Mode::Ask(q) => question(f, a.body, app, q, &th),
        Mode::WhatIf(v) => super::whatif::draw(f, a.body, v, &th),
        Mode::Pick(p) => super::picker::draw(f, a.body, p, &th),
        _ => {}
    }
    if th.ascii {
        ascii_only(f);
    }
}

/// Draw one pane.
fn pane(f: &mut Frame, p: Panel, area: Rect, app: &App, th: &Theme) {
    match p {
        Panel::Group => panels::group::draw(f, area, app, th),
        Panel::Members => panels::members::draw(f, area, app, th),
        Panel::Representation => panels::representation::draw(f, area, app, th),
        Panel::Combinations => panels::combinations::draw(f, area, app, th),
        Panel::Spectra => panels::spectra::draw(f, area, app, th),
        Panel::Molecule => panels::molecule::draw(f, area, app, th),
        Panel::Vibrations => panels::vibrations::draw_app(f, area, app, th),
    }
}

/// The ASCII safety net: whatever slipped through (a member name in Greek, a title with a
/// dash) is shown as its one-character ASCII spelling or `?`.
/// A cut marked `…` becomes `...` over the last three cells before the cut.
fn ascii_only(f: &mut Frame) {
    let w = f.area().width.max(1) as usize;
    let buf = f.buffer_mut();
    for i in 0..buf.content.len() {
        if buf.content[i].symbol() == "…" {
            for k in i.saturating_sub(2)..=i {
                if k / w == i / w {
                    buf.content[k].set_char('.');
                }
            }
        }
    }
    for cell in buf.content.iter_mut() {
        if !cell.symbol().is_ascii() {
            let folded = ascii_fold(cell.symbol());
            let c = folded.chars().next().unwrap_or('?');
            cell.set_char(c);
        }
    }
}

fn title_bar(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    let title = if app.session.title.is_empty() {
        "untitled session".to_string()
    } else {
        app.session.title.clone()
    };
    let group = app
        .session
        .group
        .clone()
        .unwrap_or_else(|| "no group".into());
    let modified = if app.dirty() { " [modified]" } else { "" };
    let file = match &app.path {
        Some(p) => p
            .file_name()
            .map(|n| n.to_string_lossy().to_string())
            .unwrap_or_default(),
        None if app.saved.group.is_none() && app.saved.sets.is_empty() => "new, not saved".into(),
        None => "demo, not saved".into(),
    };
    let right = format!(" {group} {} {file}{modified} ", th.pick("·", "|"));
    let right = if th.ascii { ascii_fold(&right) } else { right };
    let left = " salcdesk ";
    let room = (area.width as usize).saturating_sub(width(left) + width(&right) + 1);
    let title = if th.ascii { ascii_fold(&title) } else { title };
    let mid = trunc(&title, room);
    let gap = (area.width as usize).saturating_sub(width(left) + width(&mid) + width(&right));
    let line = Line::from(vec![
        Span::styled(left, th.title()),
        Span::raw(mid),
        Span::raw(" ".repeat(gap)),
        Span::styled(trunc(&right, area.width as usize), th.dim()),
    ]);
    f.render_widget(Paragraph::new(line), area);
}

fn tabs(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    let mut spans = Vec::new();
    for (i, (p, _, _)) in tab_ranges(app, area).into_iter().enumerate() {
        if i > 0 {
            spans.push(Span::styled(th.pick("│", "|"), th.dim()));
        }
        let t = tab_text(p, area.width);
        let st = if p == app.panel {
            th.tab_active()
        } else {
            th.tab()
        };
        spans.push(Span::styled(t, st));
    }
    f.render_widget(Paragraph::new(Line::from(spans)), area);
}

fn status_line(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    let (text, style) = match &app.mode {
        // A field's question takes the status line and its text the footer's, so that what is
        // typed is always in view, whatever the width.
        Mode::Field(fl) => (panels::fold(&format!("{}:", fl.label), th), th.key()),
        _ => match &app.status {
            Some(s) => (
                panels::fold(&s.text, th),
                if s.error { th.error() } else { th.warn() },
            ),
            None if app.analysis_pending() => {
                (th.pick(" working…", " working...").to_string(), th.dim())
            }
            None => (String::new(), th.dim()),
        },
    };
    // A long question or message wraps upwards over the bottom of the panes (never cut).
    let w = area.width as usize;
    let mut pieces = if width(&text) <= w {
        vec![text]
    } else {
        super::text::wrap(&text, w)
    };
    let most = (area.y as usize).saturating_sub(3).max(1);
    if pieces.len() > most {
        pieces.truncate(most);
        if let Some(last) = pieces.last_mut() {
            *last = trunc(&format!("{last} …"), w);
        }
    }
    let n = pieces.len() as u16;
    let r = Rect::new(area.x, area.y + 1 - n, area.width, n);
    if n > 1 {
        f.render_widget(Clear, r);
    }
    let lines: Vec<Line> = pieces
        .into_iter()
        .map(|p| Line::from(Span::styled(trunc(&p, w), style)))
        .collect();
    f.render_widget(Paragraph::new(lines), r);
}

/// Footer entries shown whatever else has to give way.
const ALWAYS_IN_FOOTER: [&str; 3] = ["report", "quit", "help"];

fn footer(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    if let Mode::Field(fl) = &app.mode {
        return f.render_widget(Paragraph::new(field_line(fl, area.width, th)), area);
    }
    if let Mode::Pick(_) = &app.mode {
        return f.render_widget(Paragraph::new(super::picker::footer_line(th)), area);
    }
    let mut spans = Vec::new();
    let mut used = 0usize;
    let entries: Vec<(String, &str)> = if app.panel == Panel::Group && app.group_ui.typing {
        vec![
            ("type".into(), "find"),
            ("Enter".into(), "use group"),
            ("Esc".into(), "stop"),
        ]
    } else {
        keymap::footer(app.panel, th.ascii)
    };
    // Report, quit and the way to the help overlay always show (at the end); the rest fill the
    // line in key-map order, skipping what does not fit.
    let (help, rest): (Vec<_>, Vec<_>) = entries
        .into_iter()
        .partition(|(_, w)| ALWAYS_IN_FOOTER.contains(w));
    let piece_w = |k: &str, words: &str| width(&format!(" {k} {words} "));
    let reserve: usize = help.iter().map(|(k, w)| piece_w(k, w)).sum();
    let room = (area.width as usize).saturating_sub(reserve);
    let mut shown = Vec::new();
    for (k, words) in rest {
        let w = piece_w(&k, words);
        if used + w <= room {
            used += w;
            shown.push((k, words));
        }
    }
    shown.extend(help);
    for (k, words) in shown {
        spans.push(Span::styled(format!(" {k}"), th.key()));
        spans.push(Span::raw(format!(" {words} ")));
    }
    f.render_widget(Paragraph::new(Line::from(spans)), area);
}

/// The text being typed, its end always in view (the start gives way, marked `…`), and the
/// field keys when there is room.
pub fn field_line(fl: &super::app::Field, w: u16, th: &Theme) -> Line<'static> {
    let w = w as usize;
    let hint = th.pick(
        "   Enter accepts · Esc leaves · Ctrl-u clears",
        "   Enter accepts | Esc leaves | Ctrl-u clears",
    );
    let cursor = th.pick("█", "_");
    let text = panels::fold(&fl.text, th);
    let room = w.saturating_sub(3);
    let shown = if width(&text) <= room {
        text
    } else {
        // Keep the tail that fits after the mark.
        let chars: Vec<char> = text.chars().collect();
        let mut k = chars.len();
        let mut tail = String::new();
        while k > 0 {
            let next: String = chars[k - 1..].iter().collect();
            if width(&next) + width(th.pick("…", "...")) > room {
                break;
            }
            tail = next;
            k -= 1;
        }
        format!("{}{tail}", th.pick("…", "..."))
    };
    let mut spans = vec![
        Span::styled("> ", th.key()),
        Span::raw(shown.clone()),
        Span::styled(cursor, th.key()),
    ];
    if width(&shown) + 3 + width(hint) <= w {
        spans.push(Span::styled(hint, th.dim()));
    }
    Line::from(spans)
}

/// A rectangle of at most `w`×`h` centred in `area`.
pub fn centered(area: Rect, w: u16, h: u16) -> Rect {
    let w = w.min(area.width);
    let h = h.min(area.height);
    Rect::new(
        area.x + (area.width - w) / 2,
        area.y + (area.height - h) / 2,
        w,
        h,
    )
}

fn question(f: &mut Frame, area: Rect, app: &App, q: &Question, th: &Theme) {
    let (title, body, keys): (&str, String, &str) = match q {
        Question::Quit => (
            "Unsaved edits",
            "This session has edits that are not saved.".into(),
            "s save and quit · d discard and quit · Esc stay",
        ),
        Question::Recover(_) => (
            "Unsaved edits found",
            format!(
                "An earlier run left unsaved edits of this session in {}.",
                app.recovery.path.display()
            ),
            "r restore them · d discard them · Esc decide later",
        ),
        Question::OverwriteSession(p) => (
            "Replace?",
            format!(
                "{} is another session. Replace it with this one?",
                p.display()
            ),
            "y replace · n keep it",
        ),
        Question::OverwriteExport(p) => (
            "Replace?",
            format!("{} exists. Replace it with the new report?", p.display()),
            "y replace · n keep it",
        ),
        Question::NewSession => super::session_edit::new_session_question(),
    };
    let keys = if th.ascii {
        ascii_fold(keys).replace('*', "|")
    } else {
        keys.to_string()
    };
    let r = centered(area, 64, 7);
    f.render_widget(Clear, r);
    let block = Block::bordered()
        .border_set(th.border_set())
        .border_style(th.border_focus())
        .title(Span::styled(format!(" {title} "), th.heading()));
    let text = vec![
        Line::raw(body),
        Line::raw(""),
        Line::from(Span::styled(keys, th.key())),
    ];
    f.render_widget(
        Paragraph::new(text).block(block).wrap(Wrap { trim: true }),
        r,
    );
}

/// What a click at (x, y) does: switch tab, move the cursor, tick a cell, pick a group.
pub fn click(app: &mut App, x: u16, y: u16) {
    if !matches!(app.mode, Mode::Normal) {
        return;
    }
    let size = Rect::new(0, 0, app.screen.0, app.screen.1);
    let a = areas(size);
    if y == a.tabs.y {
        if let Some((p, _, _)) = tab_ranges(app, a.tabs)
            .into_iter()
            .find(|(_, x0, x1)| x >= *x0 && x < *x1)
        {
            app.apply(super::action::Action::GoPanel(p));
        }
        return;
    }
    // A click in a pane focuses it and acts there (a tick in the grid ticks at once).
    if let Some(t) = layout::hit(&app.tiles(), x, y) {
        if t.panel != app.panel {
            app.apply(super::action::Action::GoPanel(t.panel));
        }
        match t.panel {
            Panel::Members => panels::members::click(app, t.area, x, y),
            Panel::Group => panels::group::click(app, t.area, x, y),
            _ => {}
        }
    }
}
