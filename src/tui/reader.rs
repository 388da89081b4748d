//! Reading the terminal: poll(2) with a timeout, then read(2), decoded by `input`.
//!
//! Why not crossterm's event reader: in crossterm 0.28 a read of 0 bytes (end of input: the
//! terminal or the SSH link went away) or an error other than EAGAIN/EINTR is retried at once,
//! for ever, inside `event::read`/`event::poll`, so the caller never gets control back — the
//! workspace spun on `read(0) = 0` and never looked at its signal flag again. Here every
//! wait returns within its timeout, a signal interrupts it, and end of input, a read error or
//! a hang-up is reported as the end of the terminal.

use super::input::{Decoder, Input};
use std::io;
use std::os::fd::{AsRawFd, OwnedFd, RawFd};
use std::time::Duration;

/// What one wait on the terminal gave.
#[derive(Debug)]
pub enum Wait {
    /// Keys and mouse actions (possibly none: half an escape sequence arrived).
    Input(Vec<Input>),
    /// Nothing within the timeout.
    Idle,
    /// A signal arrived while waiting.
    Interrupted,
    /// The terminal is gone (end of input, read error, hang-up), with the reason.
    End(String),
}

/// The terminal's input side: standard input when it is a terminal, else `/dev/tty`
/// (the same choice crossterm makes for raw mode).
pub struct Reader {
    fd: RawFd,
    _owned: Option<OwnedFd>,
    decoder: Decoder,
}

const BUF: usize = 1024;

impl Reader {
    pub fn open() -> io::Result<Reader> {
        // SAFETY: isatty only inspects the descriptor number.
        if unsafe { libc::isatty(libc::STDIN_FILENO) } == 1 {
            return Ok(Reader {
                fd: libc::STDIN_FILENO,
                _owned: None,
                decoder: Decoder::default(),
            });
        }
        let f = std::fs::OpenOptions::new()
            .read(true)
            .write(true)
            .open("/dev/tty")?;
        let owned = OwnedFd::from(f);
        Ok(Reader {
            fd: owned.as_raw_fd(),
            _owned: Some(owned),
            decoder: Decoder::default(),
        })
    }

    /// Wait at most `timeout` for input.
    pub fn wait(&mut self, timeout: Duration) -> Wait {
        let mut p = libc::pollfd {
            fd: self.fd,
            events: libc::POLLIN,
            revents: 0,
        };
        let ms = timeout.as_millis().min(i32::MAX as u128) as i32;
        // SAFETY: one valid pollfd, count 1.
        let r = unsafe { libc::poll(&mut p, 1, ms) };
        if r < 0 {
            let e = io::Error::last_os_error();
            return match e.kind() {
                io::ErrorKind::Interrupted => Wait::Interrupted,
                _ => Wait::End(format!("waiting for it: {e}")),
            };
        }
        if r == 0 {
            let keys = self.decoder.flush();
            return if keys.is_empty() {
                Wait::Idle
            } else {
                Wait::Input(keys)
            };
        }
        if p.revents & libc::POLLIN != 0 {
            let mut buf = [0u8; BUF];
            // SAFETY: reads at most BUF bytes into a buffer of BUF bytes.
            let n = unsafe { libc::read(self.fd, buf.as_mut_ptr().cast(), BUF) };
            if n < 0 {
                let e = io::Error::last_os_error();
                return match e.kind() {
                    io::ErrorKind::Interrupted | io::ErrorKind::WouldBlock => Wait::Interrupted,
                    _ => Wait::End(format!("reading it: {e}")),
                };
            }
            if n == 0 {
                return Wait::End("end of input".into());
            }
            let n = n as usize;
            let mut keys = self.decoder.feed(&buf[..n]);
            // Esc alone at the end of a short read is the Esc key, not the start of a sequence
            // (terminals send a sequence in one write).
            if n < BUF && self.decoder.lone_escape() {
                keys.extend(self.decoder.flush());
            }
            return Wait::Input(keys);
        }
        if p.revents & (libc::POLLHUP | libc::POLLERR | libc::POLLNVAL) != 0 {
            return Wait::End("hang-up".into());
        }
        Wait::Idle
    }
}
