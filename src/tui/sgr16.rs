//! Only the 16 basic terminal colours on the wire. crossterm writes even the named colours in
//! the 256-colour form (`ESC[38;5;9m`), which some terminals and multiplexers do not know;
//! this writer rewrites each such colour below 16 into its basic SGR code (foreground 30–37 and
//! 90–97, background 40–47 and 100–107) when the frame is flushed. Nothing else is touched.

use std::io::{self, Write};

/// A writer that keeps what is written until `flush` and then sends it with basic colour codes.
pub struct BasicColours<W: Write> {
    inner: W,
    pending: Vec<u8>,
}

impl<W: Write> BasicColours<W> {
    pub fn new(inner: W) -> Self {
        BasicColours {
            inner,
            pending: Vec::new(),
        }
    }
}

impl<W: Write> Write for BasicColours<W> {
    fn write(&mut self, buf: &[u8]) -> io::Result<usize> {
        self.pending.extend_from_slice(buf);
        Ok(buf.len())
    }
    fn flush(&mut self) -> io::Result<()> {
        let out = basic_colours(&self.pending);
        self.pending.clear();
        self.inner.write_all(&out)?;
        self.inner.flush()
    }
}

/// In every SGR sequence (`ESC[…m`), the parameters `38;5;N` / `48;5;N` with N < 16 are
/// rewritten to the basic code (crossterm also joins the two: `ESC[38;5;9;48;5;0m`); every
/// other byte is unchanged.
pub fn basic_colours(bytes: &[u8]) -> Vec<u8> {
    let mut out = Vec::with_capacity(bytes.len());
    let mut i = 0;
    while i < bytes.len() {
        if let Some((text, len)) = sgr(&bytes[i..]) {
            out.extend_from_slice(text.as_bytes());
            i += len;
        } else {
            out.push(bytes[i]);
            i += 1;
        }
    }
    out
}

/// An SGR sequence at the start of `b` with its indexed colours made basic, and its length;
/// `None` when `b` does not start with one.
fn sgr(b: &[u8]) -> Option<(String, usize)> {
    if !b.starts_with(b"\x1b[") {
        return None;
    }
    let body = &b[2..];
    let n = body
        .iter()
        .take_while(|c| c.is_ascii_digit() || **c == b';')
        .count();
    if body.get(n) != Some(&b'm') {
        return None;
    }
    let params: Vec<&str> = std::str::from_utf8(&body[..n]).ok()?.split(';').collect();
    let mut out: Vec<String> = Vec::with_capacity(params.len());
    let mut k = 0;
    while k < params.len() {
        let p = params[k];
        if (p == "38" || p == "48") && params.get(k + 1) == Some(&"5") {
            if let Some(idx) = params.get(k + 2).and_then(|x| x.parse::<u32>().ok()) {
                if idx < 16 {
                    let base = match (p == "38", idx < 8) {
                        (true, true) => 30,
                        (true, false) => 90 - 8,
                        (false, true) => 40,
                        (false, false) => 100 - 8,
                    };
                    out.push((base + idx).to_string());
                } else {
                    out.extend(params[k..k + 3].iter().map(|s| s.to_string()));
                }
                k += 3;
                continue;
            }
        }
        if (p == "38" || p == "48") && params.get(k + 1) == Some(&"2") {
            let end = (k + 5).min(params.len());
            out.extend(params[k..end].iter().map(|s| s.to_string()));
            k = end;
            continue;
        }
        out.push(p.to_string());
        k += 1;
    }
    Some((format!("\x1b[{}m", out.join(";")), 2 + n + 1))
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Every one of the 16 colours, in front and behind: the ECMA-48 / aixterm codes
    /// (30–37, 90–97, 40–47, 100–107; common practice for the bright ones).
    #[test]
    fn the_sixteen_colours_become_basic_codes() {
        for n in 0..16u32 {
            let fg = basic_colours(format!("a\x1b[38;5;{n}mb").as_bytes());
            let want = if n < 8 { 30 + n } else { 90 + n - 8 };
            assert_eq!(fg, format!("a\x1b[{want}mb").into_bytes());
            let bg = basic_colours(format!("\x1b[48;5;{n}m").as_bytes());
            let want = if n < 8 { 40 + n } else { 100 + n - 8 };
            assert_eq!(bg, format!("\x1b[{want}m").into_bytes());
        }
    }

    /// crossterm's joined form, with a reset on either side.
    #[test]
    fn joined_foreground_and_background_are_both_rewritten() {
        assert_eq!(basic_colours(b"\x1b[38;5;0;48;5;6m"), b"\x1b[30;46m");
        assert_eq!(basic_colours(b"\x1b[38;5;8;49m"), b"\x1b[90;49m");
        assert_eq!(basic_colours(b"\x1b[39;48;5;14m"), b"\x1b[39;106m");
        assert_eq!(
            basic_colours(b"\x1b[38;2;1;5;3;48;5;1m"),
            b"\x1b[38;2;1;5;3;41m"
        );
    }

    #[test]
    fn other_sequences_and_text_are_left_alone() {
        for s in [
            "\x1b[38;5;16m",
            "\x1b[38;5;255m",
            "\x1b[38;2;1;2;3m",
            "\x1b[39m",
            "\x1b[1m",
            "38;5;9m",
            "\x1b[2J",
            "\x1b[10;20H",
            "A₁g ● · é",
        ] {
            assert_eq!(basic_colours(s.as_bytes()), s.as_bytes(), "{s:?}");
        }
    }

    #[test]
    fn writes_are_held_until_flush_and_may_split_a_sequence() {
        let mut w = BasicColours::new(Vec::new());
        w.write_all(b"\x1b[38;").unwrap();
        w.write_all(b"5;12mX").unwrap();
        assert!(w.inner.is_empty());
        w.flush().unwrap();
        assert_eq!(w.inner, b"\x1b[94mX");
    }
}
