//! Terminal bytes → keys of our own key map and mouse actions.
//!
//! The workspace reads the terminal itself (`reader`) and decodes here: UTF-8 characters,
//! control keys, the CSI/SS3 sequences of cursor and editing keys (xterm, ECMA-48), and SGR
//! (1006) or X10 mouse reports. Pure: bytes in, inputs out, so every sequence is unit-tested.

use super::action::Action;
use super::keymap::{Code, Key};

/// What some input means to the workspace.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Input {
    Key(Key),
    Action(Action),
    Nothing,
}

/// Bytes of an escape sequence may arrive split over reads: they wait here.
#[derive(Debug, Default)]
pub struct Decoder {
    pending: Vec<u8>,
}

enum Parsed {
    /// An input and how many bytes it took.
    Done(Input, usize),
    /// The bytes so far start a sequence that is not complete yet.
    Incomplete,
}

/// Longest escape sequence waited for; anything longer is noise and dropped.
const MAX_SEQUENCE: usize = 64;

const ESC: u8 = 0x1b;

fn key(code: Code, ctrl: bool) -> Input {
    Input::Key(Key { code, ctrl })
}

impl Decoder {
    /// Take bytes read from the terminal; the inputs now complete.
    pub fn feed(&mut self, bytes: &[u8]) -> Vec<Input> {
        self.pending.extend_from_slice(bytes);
        let mut out = Vec::new();
        let mut at = 0;
        while at < self.pending.len() {
            match parse(&self.pending[at..]) {
                Parsed::Done(input, used) => {
                    if input != Input::Nothing {
                        out.push(input);
                    }
                    at += used;
                }
                Parsed::Incomplete if self.pending.len() - at > MAX_SEQUENCE => at += 1,
                Parsed::Incomplete => break,
            }
        }
        self.pending.drain(..at);
        out
    }

    /// Only a lone Escape is waiting (the Esc key, if nothing follows at once).
    pub fn lone_escape(&self) -> bool {
        self.pending == [ESC]
    }

    /// Nothing more came: a waiting lone Escape is the Esc key; other fragments are dropped.
    pub fn flush(&mut self) -> Vec<Input> {
        let out = if self.lone_escape() {
            vec![key(Code::Esc, false)]
        } else {
            Vec::new()
        };
        self.pending.clear();
        out
    }
}

fn parse(b: &[u8]) -> Parsed {
    let c = b[0];
    let done = |input, used| Parsed::Done(input, used);
    match c {
        ESC => parse_escape(b),
        b'\r' | b'\n' => done(key(Code::Enter, false), 1),
        b'\t' => done(key(Code::Tab, false), 1),
        0x7f | 0x08 => done(key(Code::Backspace, false), 1),
        0x00 => done(key(Code::Char(' '), true), 1),
        0x01..=0x1a => done(key(Code::Char((c - 1 + b'a') as char), true), 1),
        0x1c..=0x1f => done(key(Code::Char((c - 0x1c + b'4') as char), true), 1),
        _ => parse_utf8(b),
    }
}

fn parse_utf8(b: &[u8]) -> Parsed {
    let len = match b[0] {
        0x00..=0x7f => 1,
        0xc0..=0xdf => 2,
        0xe0..=0xef => 3,
        0xf0..=0xf7 => 4,
        _ => return Parsed::Done(Input::Nothing, 1),
    };
    if b.len() < len {
        // A continuation byte that is not one ends the character early: invalid.
        if b[1..].iter().any(|&x| x & 0xc0 != 0x80) {
            return Parsed::Done(Input::Nothing, 1);
        }
        return Parsed::Incomplete;
    }
    match std::str::from_utf8(&b[..len])
        .ok()
        .and_then(|s| s.chars().next())
    {
        Some(ch) => Parsed::Done(key(Code::Char(ch), false), len),
        None => Parsed::Done(Input::Nothing, 1),
    }
}

fn parse_escape(b: &[u8]) -> Parsed {
    match b.get(1) {
        None => Parsed::Incomplete,
        Some(b'[') => parse_csi(b),
        Some(b'O') => match b.get(2) {
            None => Parsed::Incomplete,
            Some(&f) => Parsed::Done(cursor_key(f, false).unwrap_or(Input::Nothing), 3),
        },
        Some(&ESC) => Parsed::Done(key(Code::Esc, false), 1),
        // Alt + key: read as the key itself.
        Some(_) => match parse(&b[1..]) {
            Parsed::Done(input, used) => Parsed::Done(input, used + 1),
            Parsed::Incomplete => Parsed::Incomplete,
        },
    }
}

/// Final byte of `ESC [ … F` or `ESC O F` for the cursor keys, Home, End, Shift+Tab.
fn cursor_key(f: u8, ctrl: bool) -> Option<Input> {
    let code = match f {
        b'A' => Code::Up,
        b'B' => Code::Down,
        b'C' => Code::Right,
        b'D' => Code::Left,
        b'H' => Code::Home,
        b'F' => Code::End,
        b'Z' => Code::BackTab,
        _ => return None,
    };
    Some(key(code, ctrl))
}

/// `ESC [` parameters (digits, `;`, `<`…) then one final byte in 0x40..=0x7e.
fn parse_csi(b: &[u8]) -> Parsed {
    if b.get(2) == Some(&b'M') {
        // X10 mouse: ESC [ M button x y, each byte offset by 32.
        if b.len() < 6 {
            return Parsed::Incomplete;
        }
        let (cb, x, y) = (b[3].wrapping_sub(32), b[4], b[5]);
        let input = mouse(
            cb as u16,
            x.saturating_sub(32) as u16,
            y.saturating_sub(32) as u16,
            true,
        );
        return Parsed::Done(input, 6);
    }
    let Some(end) = b[2..].iter().position(|x| !(0x20..=0x3f).contains(x)) else {
        return Parsed::Incomplete;
    };
    let end = end + 2;
    let f = b[end];
    if !(0x40..=0x7e).contains(&f) {
        // Not a well-formed sequence: drop the introducer and read on.
        return Parsed::Done(Input::Nothing, 2);
    }
    let params = std::str::from_utf8(&b[2..end]).unwrap_or("");
    let input = csi(params, f);
    Parsed::Done(input, end + 1)
}

fn numbers(params: &str) -> Vec<u16> {
    params
        .split(';')
        .map(|p| p.parse::<u16>().unwrap_or(0))
        .collect()
}

fn csi(params: &str, f: u8) -> Input {
    if let Some(sgr) = params.strip_prefix('<') {
        // SGR mouse (mode 1006): ESC [ < button ; x ; y M (press) or m (release).
        return match numbers(sgr)[..] {
            [cb, x, y] => mouse(cb, x, y, f == b'M'),
            _ => Input::Nothing,
        };
    }
    let n = numbers(params);
    // xterm modifier parameter: 1 + (shift 1, alt 2, ctrl 4).
    let ctrl = n.get(1).is_some_and(|&m| m >= 1 && (m - 1) & 4 != 0);
    if f == b'~' {
        let code = match n.first().copied().unwrap_or(0) {
            1 | 7 => Code::Home,
            4 | 8 => Code::End,
            3 => Code::Delete,
            5 => Code::PageUp,
            6 => Code::PageDown,
            _ => return Input::Nothing,
        };
        return key(code, ctrl);
    }
    if f == b'M' && n.len() == 3 {
        // urxvt mouse (mode 1015): ESC [ button ; x ; y M, button offset by 32.
        return mouse(n[0].saturating_sub(32), n[1], n[2], true);
    }
    cursor_key(f, ctrl).unwrap_or(Input::Nothing)
}

/// A mouse report: button code (xterm), column and row counted from 1.
fn mouse(cb: u16, x: u16, y: u16, press: bool) -> Input {
    if x == 0 || y == 0 {
        return Input::Nothing;
    }
    let (x, y) = (x - 1, y - 1);
    // Shift, Alt and Ctrl (4, 8, 16) do not change what a button does here.
    let button = cb & !(4 | 8 | 16);
    match button {
        0 if press => Input::Action(Action::Click { x, y }),
        64 => Input::Action(Action::ScrollUp),
        65 => Input::Action(Action::ScrollDown),
        _ => Input::Nothing,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn all(bytes: &[u8]) -> Vec<Input> {
        let mut d = Decoder::default();
        let mut v = d.feed(bytes);
        v.extend(d.flush());
        v
    }
    fn k(code: Code) -> Input {
        key(code, false)
    }

    #[test]
    fn characters_and_control_keys() {
        assert_eq!(
            all("aé€😀".as_bytes()),
            ['a', 'é', '€', '😀'].map(|c| k(Code::Char(c)))
        );
        assert_eq!(all(b"\r\n\t\x7f\x08"), {
            use Code::*;
            [Enter, Enter, Tab, Backspace, Backspace].map(k)
        });
        assert_eq!(
            all(b"\x03\x1a"),
            [key(Code::Char('c'), true), key(Code::Char('z'), true)]
        );
        assert_eq!(all(b"\xff"), []);
    }

    #[test]
    fn cursor_and_editing_keys_in_both_encodings() {
        use Code::*;
        let cases: [(&[u8], Code); 17] = [
            (b"\x1b[A", Up),
            (b"\x1b[B", Down),
            (b"\x1b[C", Right),
            (b"\x1b[D", Left),
            (b"\x1bOA", Up),
            (b"\x1bOD", Left),
            (b"\x1b[H", Home),
            (b"\x1b[F", End),
            (b"\x1bOH", Home),
            (b"\x1b[1~", Home),
            (b"\x1b[7~", Home),
            (b"\x1b[4~", End),
            (b"\x1b[8~", End),
            (b"\x1b[3~", Delete),
            (b"\x1b[5~", PageUp),
            (b"\x1b[6~", PageDown),
            (b"\x1b[Z", BackTab),
        ];
        for (bytes, code) in cases {
            assert_eq!(all(bytes), [k(code)], "{bytes:?}");
        }
        assert_eq!(all(b"\x1b[1;5A"), [key(Up, true)]);
        assert_eq!(all(b"\x1b[1;2A"), [k(Up)]);
        // Function keys and Insert mean nothing here, and do not leak characters.
        assert_eq!(all(b"\x1bOP\x1b[15~\x1b[2~"), []);
    }

    #[test]
    fn escape_alone_and_split_sequences() {
        let mut d = Decoder::default();
        assert_eq!(d.feed(b"\x1b"), []);
        assert!(d.lone_escape());
        assert_eq!(d.flush(), [k(Code::Esc)]);
        // A sequence split over two reads is one key.
        assert_eq!(d.feed(b"\x1b["), []);
        assert_eq!(d.feed(b"5~x"), [k(Code::PageUp), k(Code::Char('x'))]);
        // So is a character split over reads.
        let e = "é".as_bytes();
        assert_eq!(d.feed(&e[..1]), []);
        assert_eq!(d.feed(&e[1..]), [k(Code::Char('é'))]);
        // Esc Esc, and Alt+key read as the key.
        assert_eq!(all(b"\x1b\x1b"), [k(Code::Esc), k(Code::Esc)]);
        assert_eq!(all(b"\x1bq"), [k(Code::Char('q'))]);
        // An unfinished sequence that never completes is dropped.
        assert_eq!(all(b"\x1b[12;"), []);
        // Noise longer than any sequence does not grow the buffer without end.
        let mut d = Decoder::default();
        let mut noise = b"\x1b[".to_vec();
        noise.extend(std::iter::repeat_n(b'1', 200));
        let _ = d.feed(&noise);
        assert!(d.pending.len() <= MAX_SEQUENCE + 1);
    }

    #[test]
    fn mouse_reports() {
        let click = |x, y| Input::Action(Action::Click { x, y });
        assert_eq!(all(b"\x1b[<0;10;5M"), [click(9, 4)]);
        assert_eq!(all(b"\x1b[<0;10;5m"), []);
        assert_eq!(all(b"\x1b[<64;1;1M"), [Input::Action(Action::ScrollUp)]);
        assert_eq!(all(b"\x1b[<65;1;1M"), [Input::Action(Action::ScrollDown)]);
        assert_eq!(all(b"\x1b[<2;3;3M"), []);
        assert_eq!(all(b"\x1b[<32;3;3M"), []);
        assert_eq!(all(&[0x1b, b'[', b'M', 32, 33 + 2, 33 + 7]), [click(2, 7)]);
        assert_eq!(all(b"\x1b[32;4;6M"), [click(3, 5)]);
    }
}
