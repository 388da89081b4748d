//! The help overlay: every key, generated from the one key map.

use super::super::app::App;
use super::super::keymap;
use super::super::text::pad;
use super::super::theme::Theme;
use super::super::ui::centered;
use super::fold;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Block, Clear, Paragraph};
use ratatui::Frame;

/// The overlay's lines for an inner width of `width` columns: descriptions wrap under
/// themselves, never cut.
pub fn lines(th: &Theme, width: usize) -> Vec<Line<'static>> {
    let mut out = Vec::new();
    let key_w = 20usize;
    let room = width.saturating_sub(key_w).max(16);
    for (heading, entries) in keymap::help(th.ascii) {
        out.push(Line::from(Span::styled(heading, th.heading())));
        for (k, d) in entries {
            let key = format!("  {k}");
            let mut first = true;
            let pieces = super::wrap_folded(th, d, room);
            // A key label wider than its column gets a line of its own.
            if super::super::text::width(&key) + 1 > key_w {
                out.push(Line::from(Span::styled(key.clone(), th.key())));
                first = false;
            }
            for piece in pieces {
                let lead = if first {
                    Span::styled(pad(&key, key_w), th.key())
                } else {
                    Span::raw(" ".repeat(key_w))
                };
                first = false;
                out.push(Line::from(vec![lead, Span::raw(piece)]));
            }
        }
        out.push(Line::raw(""));
    }
    out
}

/// The overlay's rectangle on a body area.
pub fn rect(area: Rect) -> Rect {
    centered(area, 96, area.height)
}

/// The furthest the overlay scrolls on a body area.
pub fn max_scroll(area: Rect, th: &Theme) -> u16 {
    let r = rect(area);
    let n = lines(th, r.width.saturating_sub(2) as usize).len();
    n.saturating_sub(r.height.saturating_sub(2) as usize) as u16
}

pub fn draw(f: &mut Frame, area: Rect, _app: &App, th: &Theme, scroll: u16) {
    let r = rect(area);
    f.render_widget(Clear, r);
    let b = Block::bordered()
        .border_set(th.border_set())
        .border_style(th.border_focus())
        .title(Span::styled(
            fold(" Keys (j/k, PgUp/PgDn, g/G scroll; other keys close) ", th),
            th.heading(),
        ));
    let ls = lines(th, r.width.saturating_sub(2) as usize);
    let max = max_scroll(area, th);
    f.render_widget(Paragraph::new(ls).block(b).scroll((scroll.min(max), 0)), r);
}
