//! One file per panel (and the help overlay). Each `draw` is a pure function of the state.

pub mod combinations;
pub mod group;
pub mod help;
pub mod members;
pub mod molecule;
pub mod representation;
pub mod set_salcs;
pub mod spectra;
pub mod vibrations;

use super::text::ascii_fold;
use super::theme::Theme;
use ratatui::text::{Line, Span};
use ratatui::widgets::Block;

/// The frame around a panel; the focused one of several tiles is marked by its frame's style
/// and a mark before its title (a glyph, so monochrome shows it too).
pub fn block<'a>(title: &str, th: &Theme) -> Block<'a> {
    let (border, mark, set) = if th.focused {
        (
            th.border_focus(),
            th.pick("▸ ", "> "),
            th.focus_border_set(),
        )
    } else {
        (th.border(), "", th.border_set())
    };
    Block::bordered()
        .border_set(set)
        .border_style(border)
        .title(Span::styled(format!(" {mark}{title} "), th.title()))
}

/// A line of text in a style, folded to ASCII when the theme asks for it.
pub fn styled(s: &str, style: ratatui::style::Style, th: &Theme) -> Line<'static> {
    Line::from(Span::styled(fold(s, th), style))
}

/// ASCII-fold our own wording in ASCII mode.
pub fn fold(s: &str, th: &Theme) -> String {
    if th.ascii {
        ascii_fold(s)
    } else {
        s.to_string()
    }
}

/// Wrap our own wording after folding it to ASCII (ASCII mode), so widths stay right.
pub fn wrap_folded(th: &Theme, s: &str, width: usize) -> Vec<String> {
    super::text::wrap(&fold(s, th), width)
}

/// Lines saying plainly that a layer is not in this build.
pub fn missing_layer(what: &str, th: &Theme, width: usize) -> Vec<Line<'static>> {
    let mut out = vec![styled("Not in this build yet", th.missing(), th)];
    for l in wrap_folded(th, &format!("{what}."), width) {
        out.push(styled(&l, th.missing(), th));
    }
    out
}
