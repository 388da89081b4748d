//! Terminal events (crossterm) → keys of our own key map and mouse actions.

use super::action::Action;
use super::keymap::{Code, Key};
use crossterm::event::{
    Event, KeyCode, KeyEvent, KeyEventKind, KeyModifiers, MouseButton, MouseEventKind,
};

/// What an event means to the workspace.
pub enum Input {
    Key(Key),
    Action(Action),
    Resize,
    Nothing,
}

fn key(k: KeyEvent) -> Option<Key> {
    let code = match k.code {
        KeyCode::Char(c) => Code::Char(c),
        KeyCode::Tab if k.modifiers.contains(KeyModifiers::SHIFT) => Code::BackTab,
        KeyCode::Tab => Code::Tab,
        KeyCode::BackTab => Code::BackTab,
        KeyCode::Enter => Code::Enter,
        KeyCode::Esc => Code::Esc,
        KeyCode::Up => Code::Up,
        KeyCode::Down => Code::Down,
        KeyCode::Left => Code::Left,
        KeyCode::Right => Code::Right,
        KeyCode::PageUp => Code::PageUp,
        KeyCode::PageDown => Code::PageDown,
        KeyCode::Home => Code::Home,
        KeyCode::End => Code::End,
        KeyCode::Backspace => Code::Backspace,
        KeyCode::Delete => Code::Delete,
        _ => return None,
    };
    Some(Key {
        code,
        ctrl: k.modifiers.contains(KeyModifiers::CONTROL),
    })
}

/// Translate one event.
pub fn translate(e: Event) -> Input {
    match e {
        Event::Key(k) if k.kind != KeyEventKind::Release => match key(k) {
            Some(k) => Input::Key(k),
            None => Input::Nothing,
        },
        Event::Mouse(m) => match m.kind {
            MouseEventKind::Down(MouseButton::Left) => Input::Action(Action::Click {
                x: m.column,
                y: m.row,
            }),
            MouseEventKind::ScrollUp => Input::Action(Action::ScrollUp),
            MouseEventKind::ScrollDown => Input::Action(Action::ScrollDown),
            _ => Input::Nothing,
        },
        Event::Resize(_, _) => Input::Resize,
        _ => Input::Nothing,
    }
}
