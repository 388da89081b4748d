//! Workspace speed for a C60-sized session (Ih, 60 atoms as a Cartesian set, 180 dimensions):
//! start to first frame, and one keystroke (a tick) to the redrawn frame. Targets: ≤ 100 ms
//! and ≤ 16 ms.

use criterion::{criterion_group, criterion_main, Criterion};
use ratatui::backend::TestBackend;
use ratatui::Terminal;
use salcdesk::analysis::{self, Depth};
use salcdesk::session::{Member, MemberSet, Session, SetKind};
use salcdesk::tui::keymap::Key;
use salcdesk::tui::{ui, App};

/// 60 carbon atoms; four lie in the chosen mirror plane (from memory: each of the 15 planes
/// of C60 holds 4 atoms, and no atom lies on a rotation axis), so Γ3N has χ(E) = 180 and
/// χ(σ) = 4.
fn c60_session() -> Session {
    let members = (1..=60)
        .map(|k| {
            let mut m = Member::new(format!("C{k}"));
            if k <= 4 {
                m.unmoved_by.push("15s".into());
            }
            m
        })
        .collect();
    Session {
        title: "C60-sized benchmark".into(),
        group: Some("Ih".into()),
        sets: vec![MemberSet {
            name: "Cartesian displacements".into(),
            kind: SetKind::Cartesian,
            members,
        }],
        ..Session::default()
    }
}

fn bench(c: &mut Criterion) {
    let s = c60_session();
    c.bench_function("c60: start to first frame (120x40)", |b| {
        b.iter(|| {
            let app = App::new(s.clone(), None, false, true);
            let mut t = Terminal::new(TestBackend::new(120, 40)).unwrap();
            t.draw(|f| ui::draw(f, &app)).unwrap();
        })
    });
    let mut app = App::new(s.clone(), None, false, true);
    app.members_ui.col = 9;
    let mut t = Terminal::new(TestBackend::new(120, 40)).unwrap();
    let mut row = 0usize;
    c.bench_function("c60: tick a cell and redraw (120x40)", |b| {
        b.iter(|| {
            app.members_ui.row = row % 60;
            row += 7;
            app.handle_key(Key::ch(' '));
            t.draw(|f| ui::draw(f, &app)).unwrap();
        })
    });
    let mut broken = s.clone();
    broken.sets[0].members[10].unmoved_by.push("15s".into());
    c.bench_function(
        "c60: full analysis of an impossible chi (background)",
        |b| {
            b.iter(|| {
                // A fresh count vector each time would defeat the cache; this measures the cached
                // path after the first run, and the first run shows in the warm-up.
                analysis::analyze_to(&broken, Depth::Full).unwrap()
            })
        },
    );
    let g = salcdesk::group::load("Ih").unwrap();
    let chi = match &*analysis::analyze_to(&broken, Depth::Quick).unwrap().sets[0].outcome {
        analysis::Outcome::Finite { chi, .. } => chi.clone(),
        _ => unreachable!(),
    };
    c.bench_function("c60: search for single-class corrections (uncached)", |b| {
        b.iter(|| salcdesk::rep::suggest(&g, &chi))
    });
}

criterion_group! {
    name = benches;
    config = Criterion::default().sample_size(20).measurement_time(std::time::Duration::from_secs(3));
    targets = bench
}
criterion_main!(benches);
