//! Styles and symbols in one place: colour (the 16 basic terminal colours only, never true
//! colour), monochrome (NO_COLOR or `--mono`: bold, reverse and underline only) and ASCII
//! (`--ascii`: no box drawing, subscripts or Greek).

use ratatui::style::{Color, Modifier, Style};
use ratatui::symbols::border;

/// How the screen may look on this terminal.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Theme {
    pub color: bool,
    pub ascii: bool,
    /// Draw the pane as the focused one among several (tiled layout only).
    pub focused: bool,
}

/// Box-drawing made of plain ASCII.
pub const ASCII_BORDER: border::Set = border::Set {
    top_left: "+",
    top_right: "+",
    bottom_left: "+",
    bottom_right: "+",
    vertical_left: "|",
    vertical_right: "|",
    horizontal_top: "-",
    horizontal_bottom: "-",
};

/// The focused pane's frame in plain ASCII.
pub const ASCII_FOCUS_BORDER: border::Set = border::Set {
    top_left: "#",
    top_right: "#",
    bottom_left: "#",
    bottom_right: "#",
    vertical_left: "#",
    vertical_right: "#",
    horizontal_top: "=",
    horizontal_bottom: "=",
};

impl Theme {
    pub fn new(color: bool, ascii: bool) -> Self {
        Theme {
            color,
            ascii,
            focused: false,
        }
    }
    /// The same theme for a pane that is (or is not) the focused one of several.
    pub fn with_focus(self, focused: bool) -> Self {
        Theme { focused, ..self }
    }
    fn fg(&self, c: Color) -> Style {
        if self.color {
            Style::default().fg(c)
        } else {
            Style::default()
        }
    }
    pub fn border_set(&self) -> border::Set {
        if self.ascii {
            ASCII_BORDER
        } else {
            border::ROUNDED
        }
    }
    /// The frame of the focused pane among several: heavier lines (ASCII: `=` and `#`).
    pub fn focus_border_set(&self) -> border::Set {
        if self.ascii {
            ASCII_FOCUS_BORDER
        } else {
            border::THICK
        }
    }
    pub fn border(&self) -> Style {
        self.fg(Color::DarkGray)
    }
    pub fn border_focus(&self) -> Style {
        self.fg(Color::Cyan)
    }
    pub fn title(&self) -> Style {
        self.fg(Color::Cyan).add_modifier(Modifier::BOLD)
    }
    pub fn tab(&self) -> Style {
        Style::default()
    }
    pub fn tab_active(&self) -> Style {
        if self.color {
            Style::default()
                .fg(Color::Black)
                .bg(Color::Cyan)
                .add_modifier(Modifier::BOLD)
        } else {
            Style::default().add_modifier(Modifier::REVERSED | Modifier::BOLD)
        }
    }
    pub fn heading(&self) -> Style {
        self.fg(Color::Yellow).add_modifier(Modifier::BOLD)
    }
    pub fn dim(&self) -> Style {
        if self.color {
            Style::default().fg(Color::DarkGray)
        } else {
            Style::default()
        }
    }
    pub fn tick(&self) -> Style {
        self.fg(Color::Green).add_modifier(Modifier::BOLD)
    }
    pub fn cursor(&self) -> Style {
        Style::default().add_modifier(Modifier::REVERSED)
    }
    pub fn result(&self) -> Style {
        self.fg(Color::Green).add_modifier(Modifier::BOLD)
    }
    pub fn error(&self) -> Style {
        self.fg(Color::Red).add_modifier(Modifier::BOLD)
    }
    pub fn warn(&self) -> Style {
        self.fg(Color::Yellow)
    }
    pub fn key(&self) -> Style {
        self.fg(Color::Cyan).add_modifier(Modifier::BOLD)
    }
    pub fn missing(&self) -> Style {
        self.fg(Color::Magenta)
    }
    /// Pick the Unicode or the ASCII spelling.
    pub fn pick<'a>(&self, unicode: &'a str, ascii: &'a str) -> &'a str {
        if self.ascii {
            ascii
        } else {
            unicode
        }
    }
    /// The mark of a ticked cell and of an empty one.
    pub fn marks(&self) -> (&'static str, &'static str) {
        if self.ascii {
            ("x", ".")
        } else {
            ("●", "·")
        }
    }
}
