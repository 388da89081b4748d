//! The full analysis on a background thread, so that slow work (the single-class corrections
//! for an impossible χ of a large set) never holds up the keyboard. Requests are coalesced:
//! only the newest session is analysed.

use crate::analysis::{self, Analysis, Depth, Error};
use crate::session::Session;
use std::path::PathBuf;
use std::sync::mpsc::{channel, Receiver, Sender};
use std::thread;

/// (generation, session, directory of the session file).
type Job = (u64, Session, Option<PathBuf>);

/// A finished analysis for the session of generation `gen`.
pub struct Done {
    pub gen: u64,
    pub result: Result<Analysis, Error>,
}

/// Handle on the background analyser.
pub struct Worker {
    tx: Sender<Job>,
    rx: Receiver<Done>,
}

impl Worker {
    pub fn start() -> Self {
        let (tx, req) = channel::<Job>();
        let (done, rx) = channel::<Done>();
        thread::spawn(move || {
            while let Ok(mut job) = req.recv() {
                while let Ok(newer) = req.try_recv() {
                    job = newer;
                }
                let result = analysis::analyze_in(&job.1, Depth::Full, job.2.as_deref());
                if done.send(Done { gen: job.0, result }).is_err() {
                    break;
                }
            }
        });
        Worker { tx, rx }
    }
    pub fn request(&self, gen: u64, session: Session, base: Option<PathBuf>) {
        let _ = self.tx.send((gen, session, base));
    }
    pub fn poll(&self) -> Option<Done> {
        let mut last = None;
        while let Ok(d) = self.rx.try_recv() {
            last = Some(d);
        }
        last
    }
}
