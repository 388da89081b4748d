//! A small list to choose from, drawn over the body: the member sets the geometry offers
//! (Members, `A`) and the group's site types for the site builder (Molecule, `b`). Up/Down (or
//! j/k) move, Enter takes the highlighted line, Esc cancels. What a choice does is in
//! `atoms_edit` and `site_picker`.

use super::app::{App, Mode};
use super::keymap::{Code, Key};
use super::panels::{fold, styled};
use super::text::{trunc, wrap};
use super::theme::Theme;
use crate::session::MemberSet;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Block, Clear, Paragraph};
use ratatui::Frame;

/// What the chosen line is for.
#[derive(Debug, Clone, PartialEq)]
pub enum PickFor {
    /// Member sets offered by the geometry, one per line.
    MemberSet(Vec<MemberSet>),
    /// Site types of a group (line k ↔ `names[k - first]`); with site sets already chosen
    /// (`pending`, in the site syntax), the first line builds them.
    Sites(super::site_picker::SiteState),
}

/// A list on screen.
#[derive(Debug, Clone, PartialEq)]
pub struct Picker {
    pub title: String,
    /// Lines above the list (what is chosen so far, a hint).
    pub notes: Vec<String>,
    pub items: Vec<String>,
    pub cursor: usize,
    pub purpose: PickFor,
}

impl App {
    /// Show a picker.
    pub(super) fn open_picker(&mut self, p: Picker) {
        self.mode = Mode::Pick(p);
    }

    /// A key while a picker is up.
    pub(super) fn pick_key(&mut self, mut p: Picker, key: Key) {
        let n = p.items.len();
        match key.code {
            Code::Esc => {
                self.mode = Mode::Normal;
                return self.status("cancelled: nothing changed");
            }
            Code::Up | Code::Char('k') if !key.ctrl => p.cursor = p.cursor.saturating_sub(1),
            Code::Down | Code::Char('j') if !key.ctrl => {
                p.cursor = (p.cursor + 1).min(n.saturating_sub(1))
            }
            Code::Home | Code::Char('g') => p.cursor = 0,
            Code::End | Code::Char('G') => p.cursor = n.saturating_sub(1),
            Code::PageUp => p.cursor = p.cursor.saturating_sub(10),
            Code::PageDown => p.cursor = (p.cursor + 10).min(n.saturating_sub(1)),
            Code::Enter | Code::Char(' ') => {
                self.mode = Mode::Normal;
                let k = p.cursor;
                return match p.purpose {
                    PickFor::MemberSet(sets) => self.member_set_chosen(sets, k),
                    PickFor::Sites(st) => self.site_chosen(st, k),
                };
            }
            _ => {}
        }
        self.mode = Mode::Pick(p);
    }
}

/// Footer words while a picker is up.
pub fn footer_line(th: &Theme) -> Line<'static> {
    Line::from(vec![
        Span::styled(th.pick(" ↑↓", " Up/Down").to_string(), th.key()),
        Span::raw(" choose "),
        Span::styled(" Enter", th.key()),
        Span::raw(" take "),
        Span::styled(" Esc", th.key()),
        Span::raw(" cancel "),
    ])
}

/// Draw the picker over `area` (the body), its lines wrapped to the box.
pub fn draw(f: &mut Frame, area: Rect, p: &Picker, th: &Theme) {
    let w = area.width.clamp(20, 78);
    let inner_w = w.saturating_sub(2) as usize;
    let mut lines: Vec<Line> = Vec::new();
    for n in &p.notes {
        for l in wrap(&fold(n, th), inner_w) {
            lines.push(styled(&l, th.dim(), th));
        }
    }
    if !p.notes.is_empty() {
        lines.push(Line::raw(""));
    }
    let top = lines.len();
    let room = (area.height as usize).saturating_sub(2 + top).max(1);
    // Scroll so that the cursor's line is in view.
    let first = if p.cursor < room {
        0
    } else {
        p.cursor + 1 - room
    };
    for (k, item) in p.items.iter().enumerate().skip(first).take(room) {
        let mark = if k == p.cursor {
            th.pick("▸ ", "> ")
        } else {
            "  "
        };
        let text = trunc(&fold(&format!("{mark}{item}"), th), inner_w);
        let st = if k == p.cursor {
            th.cursor()
        } else {
            Default::default()
        };
        lines.push(Line::from(Span::styled(text, st)));
    }
    let h = (lines.len() as u16 + 2).min(area.height);
    let r = super::ui::centered(area, w, h);
    f.render_widget(Clear, r);
    let block = Block::bordered()
        .border_set(th.border_set())
        .border_style(th.border_focus())
        .title(Span::styled(
            format!(" {} ", fold(&p.title, th)),
            th.heading(),
        ));
    f.render_widget(Paragraph::new(lines).block(block), r);
}
