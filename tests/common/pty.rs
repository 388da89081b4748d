//! The real binary in a pseudo-terminal: keys in, the screen (vt100) and the raw bytes out,
//! the exit seen without reaping first (so the CPU time of the finished process can still be
//! read from /proc), and a Drop that kills the process if a test fails half-way, so no test
//! ever leaves one behind.
//!
//! Only the master descriptor portable-pty opened is used: no reader or writer clones (their
//! copies would keep the master open, and portable-pty's writer sends "\n" + EOF when
//! dropped), so `close_master` really hangs the terminal up.

use portable_pty::{native_pty_system, Child, CommandBuilder, MasterPty, PtySize};
use std::os::fd::RawFd;
use std::path::Path;
use std::sync::atomic::{AtomicBool, Ordering};
use std::sync::{Arc, Mutex};
use std::thread::JoinHandle;
use std::time::{Duration, Instant};

pub const ROWS: u16 = 24;
pub const COLS: u16 = 80;

/// How the process ended.
#[derive(Debug, Clone)]
pub struct Exit {
    /// Exit status, or `None` when a signal killed it.
    pub code: Option<u32>,
    /// The signal that killed it, as portable-pty names it.
    pub signal: Option<String>,
    /// When the exit was seen.
    pub at: Instant,
    /// CPU time (user + system) of the whole run, read just before reaping.
    pub cpu: Duration,
}

pub struct Pty {
    master: Option<Box<dyn MasterPty + Send>>,
    fd: RawFd,
    child: Box<dyn Child + Send + Sync>,
    pub pid: i32,
    /// The local-mode flags (termios c_lflag) of the new pty, read before the program started.
    pub start_lflags: Option<u64>,
    screen: Arc<Mutex<vt100::Parser>>,
    raw: Arc<Mutex<Vec<u8>>>,
    stop: Arc<AtomicBool>,
    pause: Arc<AtomicBool>,
    done: Arc<AtomicBool>,
    reader: Option<JoinHandle<()>>,
    exit: Option<Exit>,
}

/// CPU time (utime + stime) of a process from /proc/PID/stat (also of a zombie).
pub fn cpu_time(pid: i32) -> Option<Duration> {
    let stat = std::fs::read_to_string(format!("/proc/{pid}/stat")).ok()?;
    // Fields after the command name in parentheses: state is field 3, utime 14, stime 15.
    let rest = &stat[stat.rfind(')')? + 1..];
    let f: Vec<&str> = rest.split_whitespace().collect();
    let ticks: u64 = f.get(11)?.parse::<u64>().ok()? + f.get(12)?.parse::<u64>().ok()?;
    // SAFETY: sysconf only reads a constant.
    let hz = unsafe { libc::sysconf(libc::_SC_CLK_TCK) }.max(1) as u64;
    Some(Duration::from_micros(ticks * 1_000_000 / hz))
}

/// Whether `pid` has exited (or is gone), without reaping it.
fn exited(pid: i32) -> bool {
    // SAFETY: waitid with WNOWAIT only reports; the siginfo is zeroed and owned here.
    unsafe {
        let mut info: libc::siginfo_t = std::mem::zeroed();
        let r = libc::waitid(
            libc::P_PID,
            pid as libc::id_t,
            &mut info,
            libc::WEXITED | libc::WNOHANG | libc::WNOWAIT,
        );
        r != 0 || info.si_pid() == pid
    }
}

impl Pty {
    /// Start the salcdesk binary in a new 80×24 pty, in folder `cwd`, with `args`; `env`
    /// is applied on top of this process's environment (TERM is xterm-256color, NO_COLOR is
    /// unset).
    pub fn spawn(cwd: &Path, args: &[&std::ffi::OsStr], env: &[(&str, &std::ffi::OsStr)]) -> Pty {
        Pty::spawn_with(cwd, args, |cmd| {
            for (k, v) in env {
                cmd.env(k, v);
            }
        })
    }

    /// As `spawn`, with full control over the command (e.g. to remove variables).
    pub fn spawn_with(
        cwd: &Path,
        args: &[&std::ffi::OsStr],
        configure: impl FnOnce(&mut CommandBuilder),
    ) -> Pty {
        let pty = native_pty_system()
            .openpty(PtySize {
                rows: ROWS,
                cols: COLS,
                pixel_width: 0,
                pixel_height: 0,
            })
            .expect("a pseudo-terminal");
        let mut cmd = CommandBuilder::new(env!("CARGO_BIN_EXE_salcdesk"));
        for a in args {
            cmd.arg(a);
        }
        cmd.cwd(cwd);
        cmd.env("TERM", "xterm-256color");
        cmd.env_remove("NO_COLOR");
        configure(&mut cmd);
        let start_lflags = pty
            .master
            .get_termios()
            .map(|t| t.local_flags.bits() as u64);
        let child = pty.slave.spawn_command(cmd).expect("spawn salcdesk");
        drop(pty.slave);
        let pid = child.process_id().expect("a process id") as i32;
        let fd = pty.master.as_raw_fd().expect("a master descriptor");
        let screen = Arc::new(Mutex::new(vt100::Parser::new(ROWS, COLS, 0)));
        let raw = Arc::new(Mutex::new(Vec::new()));
        let stop = Arc::new(AtomicBool::new(false));
        let done = Arc::new(AtomicBool::new(false));
        let pause = Arc::new(AtomicBool::new(false));
        let (s2, r2, st2, d2) = (screen.clone(), raw.clone(), stop.clone(), done.clone());
        let p2 = pause.clone();
        // The master stays open (owned by `Pty`) until this thread has been joined.
        let reader = std::thread::spawn(move || {
            let mut buf = [0u8; 4096];
            while !st2.load(Ordering::SeqCst) {
                if p2.load(Ordering::SeqCst) {
                    std::thread::sleep(Duration::from_millis(20));
                    continue;
                }
                let mut p = libc::pollfd {
                    fd,
                    events: libc::POLLIN,
                    revents: 0,
                };
                // SAFETY: one valid pollfd; `fd` stays open while this thread runs.
                let r = unsafe { libc::poll(&mut p, 1, 20) };
                if r <= 0 {
                    continue;
                }
                // SAFETY: reads at most buf.len() bytes into buf.
                let n = unsafe { libc::read(fd, buf.as_mut_ptr().cast(), buf.len()) };
                if n <= 0 {
                    break;
                }
                let n = n as usize;
                s2.lock().unwrap().process(&buf[..n]);
                r2.lock().unwrap().extend_from_slice(&buf[..n]);
            }
            d2.store(true, Ordering::SeqCst);
        });
        Pty {
            master: Some(pty.master),
            fd,
            child,
            pid,
            start_lflags,
            screen,
            raw,
            stop,
            pause,
            done,
            reader: Some(reader),
            exit: None,
        }
    }

    /// The master side (e.g. for its termios), while it is open.
    pub fn master(&self) -> &dyn MasterPty {
        self.master.as_deref().expect("the master is open")
    }

    /// The screen as text.
    pub fn text(&self) -> String {
        self.screen.lock().unwrap().screen().contents()
    }

    /// The vt100 parser (screen state: alternate screen, cursor, rows).
    pub fn screen(&self) -> std::sync::MutexGuard<'_, vt100::Parser> {
        self.screen.lock().unwrap()
    }

    /// Wait until `what` is on screen and `gone` is not (an edit has been drawn).
    pub fn wait_for_without(&self, what: &str, gone: &str) {
        let t0 = Instant::now();
        while t0.elapsed() < Duration::from_secs(30) {
            let text = self.text();
            if text.contains(what) && (gone.is_empty() || !text.contains(gone)) {
                return;
            }
            std::thread::sleep(Duration::from_millis(10));
        }
        panic!("no '{what}' without '{gone}'; the screen:\n{}", self.text());
    }

    pub fn wait_for(&self, what: &str) {
        self.wait_for_without(what, "")
    }

    /// Type `s` (bytes as a terminal sends them).
    pub fn keys(&mut self, s: &str) {
        let mut b = s.as_bytes();
        while !b.is_empty() {
            // SAFETY: writes from a valid slice to the open master.
            let n = unsafe { libc::write(self.fd, b.as_ptr().cast(), b.len()) };
            assert!(n > 0, "writing to the pty failed");
            b = &b[n as usize..];
        }
    }

    /// The terminal goes away (a dropped SSH link, a killed multiplexer): every descriptor
    /// of the master is closed.
    pub fn close_master(&mut self) {
        self.stop_reader();
        self.master = None;
    }

    fn stop_reader(&mut self) {
        self.stop.store(true, Ordering::SeqCst);
        if let Some(h) = self.reader.take() {
            let _ = h.join();
        }
    }

    /// Stop reading the terminal's output (a frozen terminal: the program's writes block once
    /// the pty's buffer is full), or read on again.
    pub fn pause_reading(&self, paused: bool) {
        self.pause.store(paused, Ordering::SeqCst);
    }

    /// Send a signal to the process.
    pub fn signal(&self, sig: i32) {
        if self.exit.is_none() {
            // SAFETY: the child is not reaped yet, so `pid` is still ours.
            unsafe {
                libc::kill(self.pid, sig);
            }
        }
    }

    /// CPU time used so far.
    pub fn cpu(&self) -> Duration {
        cpu_time(self.pid).expect("/proc/PID/stat of the running process")
    }

    /// Wait up to `limit` for the exit; `None` if the process is still there.
    pub fn wait_exit(&mut self, limit: Duration) -> Option<Exit> {
        if let Some(e) = &self.exit {
            return Some(e.clone());
        }
        let t0 = Instant::now();
        loop {
            if exited(self.pid) {
                let at = Instant::now();
                let cpu = cpu_time(self.pid).unwrap_or_default();
                let st = self.child.wait().expect("the exit status");
                let e = Exit {
                    code: st.signal().is_none().then(|| st.exit_code()),
                    signal: st.signal().map(str::to_string),
                    at,
                    cpu,
                };
                self.exit = Some(e.clone());
                return Some(e);
            }
            if t0.elapsed() >= limit {
                return None;
            }
            std::thread::sleep(Duration::from_millis(5));
        }
    }

    /// Everything the program wrote, once the pty has been read to the end (or 5 s).
    pub fn all_output(&self) -> Vec<u8> {
        let t0 = Instant::now();
        while !self.done.load(Ordering::SeqCst) && t0.elapsed() < Duration::from_secs(5) {
            std::thread::sleep(Duration::from_millis(10));
        }
        self.raw.lock().unwrap().clone()
    }

    /// What was written so far.
    pub fn raw(&self) -> Vec<u8> {
        self.raw.lock().unwrap().clone()
    }
}

impl Drop for Pty {
    fn drop(&mut self) {
        if self.exit.is_none() {
            // SAFETY: not reaped, so the pid is still this child's.
            unsafe {
                libc::kill(self.pid, libc::SIGKILL);
            }
            let _ = self.child.wait();
        }
        self.stop_reader();
    }
}

/// Position of the last `needle` in `hay`.
pub fn rfind(hay: &[u8], needle: &[u8]) -> Option<usize> {
    hay.windows(needle.len()).rposition(|w| w == needle)
}
