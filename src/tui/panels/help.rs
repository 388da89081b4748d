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

/// The overlay's lines.
pub fn lines(th: &Theme) -> Vec<Line<'static>> {
    let mut out = Vec::new();
    for (heading, entries) in keymap::help(th.ascii) {
        out.push(Line::from(Span::styled(heading, th.heading())));
        for (k, d) in entries {
            out.push(Line::from(vec![
                Span::styled(format!("  {}", pad(&k, 18)), th.key()),
                Span::raw(fold(d, th)),
            ]));
        }
        out.push(Line::raw(""));
    }
    out
}

pub fn draw(f: &mut Frame, area: Rect, _app: &App, th: &Theme, scroll: u16) {
    let r = centered(area, 96, area.height);
    f.render_widget(Clear, r);
    let b = Block::bordered()
        .border_set(th.border_set())
        .border_style(th.border_focus())
        .title(Span::styled(
            " Keys (j/k scroll, any other key closes) ",
            th.heading(),
        ));
    let ls = lines(th);
    let inner_h = r.height.saturating_sub(2) as usize;
    let max = ls.len().saturating_sub(inner_h) as u16;
    f.render_widget(Paragraph::new(ls).block(b).scroll((scroll.min(max), 0)), r);
}
