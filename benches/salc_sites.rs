//! σ and Cartesian SALCs on every site type (all but the origin) of every finite group: a centre
//! at the origin and one orbit of H ligands on the site (`centre_and_site`, tests/salc_support.rs).
//! Target: each case ≤ 200 ms (release). Each timing is one run, in process; the irrep
//! matrices are cached per group, so the first case of a group (which builds them) is reported
//! apart from the rest ("first" below). A plain `main`, no criterion: one pass is the point.
//! Whole-process time and peak memory per case: benches/salc_sites_process.sh (see README).

#[path = "../tests/salc_support.rs"]
mod support;

use support::centre_and_site;

use salcdesk::basis;
use salcdesk::{geom, group, salc};
use std::time::{Duration, Instant};

/// One timed piece of work.
struct Timing {
    group: String,
    site: String,
    /// "σ" or "xyz" (basis and SALCs), "sym" (Cartesian symmetry coordinates), or
    /// "structure" (building the centre and ligands)
    what: &'static str,
    /// SALCs found (0 for the structure)
    count: usize,
    /// wall time
    time: Duration,
    /// CPU time of the process meanwhile
    cpu: Duration,
    /// the first case of its group (irrep matrices built here)
    first: bool,
}

/// CPU time used so far by the whole process (all threads), so that a shared machine's load
/// can be told apart from our own work.
fn cpu_now() -> Duration {
    let mut ts = libc::timespec {
        tv_sec: 0,
        tv_nsec: 0,
    };
    // SAFETY: clock_gettime writes one timespec into the valid pointer it is given.
    unsafe { libc::clock_gettime(libc::CLOCK_PROCESS_CPUTIME_ID, &mut ts) };
    Duration::new(ts.tv_sec as u64, ts.tv_nsec as u32)
}

/// The result of `f`, its wall time and its CPU time.
fn time<T>(f: impl FnOnce() -> T) -> (T, Duration, Duration) {
    let (t, c) = (Instant::now(), cpu_now());
    let out = f();
    (out, t.elapsed(), cpu_now() - c)
}

fn main() {
    // `cargo bench` passes flags such as `--bench`; a bare word filters the groups by name.
    let filter: Vec<String> = std::env::args()
        .skip(1)
        .filter(|a| !a.starts_with("--"))
        .collect();
    let over = Duration::from_millis(50);
    let mut timings: Vec<Timing> = Vec::new();
    let mut errors: Vec<String> = Vec::new();
    let mut cases = 0usize;
    let all = Instant::now();
    for name in group::names() {
        if !filter.is_empty() && !filter.iter().any(|f| f == name) {
            continue;
        }
        let (g, load, _) = time(|| group::load(name));
        let g = match g {
            Ok(g) => g,
            Err(e) => {
                errors.push(format!("{name}: {e}"));
                continue;
            }
        };
        if g.is_linear() {
            continue;
        }
        let ops: Vec<_> = g.ops.iter().map(|o| o.float).collect();
        let (types, site_time, _) = time(|| geom::site_types(&ops));
        let types = match types {
            Ok(t) => t,
            Err(e) => {
                errors.push(format!("{name}: site types: {e}"));
                continue;
            }
        };
        if load + site_time > over {
            eprintln!(
                "  over 50 ms: {name} table and site types: {:?}",
                load + site_time
            );
        }
        let mut first = true;
        for site in geom::site_names(&types) {
            if site == "origin" {
                continue;
            }
            cases += 1;
            let (s, t, c) = time(|| centre_and_site(&g, &site));
            let mut push = |what, count, (time, cpu): (Duration, Duration)| {
                if time > over {
                    let tag = if first { " (first of group)" } else { "" };
                    eprintln!("  over 50 ms: {name} {site} {what}: {time:?} (CPU {cpu:?}){tag}");
                }
                timings.push(Timing {
                    group: name.to_string(),
                    site: site.clone(),
                    what,
                    count,
                    time,
                    cpu,
                    first,
                });
            };
            push("structure", 0, (t, c));
            let s = match s {
                Ok(s) => s,
                Err(e) => {
                    errors.push(format!("{name} {site}: {e}"));
                    continue;
                }
            };
            let ligands: Vec<usize> = (1..s.len()).collect();
            let (r, t, c) = time(|| {
                basis::sigma(&s, 0, &ligands)
                    .map_err(|e| e.to_string())
                    .and_then(|b| salc::salcs(&b).map_err(|e| e.to_string()))
            });
            match r {
                Ok(set) => push("σ", set.salcs.len(), (t, c)),
                Err(e) => {
                    push("σ", 0, (t, c));
                    errors.push(format!("{name} {site} σ: {e}"));
                }
            }
            let (r, t, c) = time(|| salc::salcs(&basis::cartesian(&s).unwrap()));
            match r {
                Ok(set) => push("xyz", set.salcs.len(), (t, c)),
                Err(e) => {
                    push("xyz", 0, (t, c));
                    errors.push(format!("{name} {site} xyz: {e}"));
                }
            }
            // what `salcdesk salc … --basis cartesian` computes (translations, rotations and
            // vibrations apart); timed for comparison, not part of the case's sum
            let (r, t, c) = time(|| salc::symmetry_coordinates(&s));
            match r {
                Ok(set) => push("sym", set.salcs.len(), (t, c)),
                Err(e) => {
                    push("sym", 0, (t, c));
                    errors.push(format!("{name} {site} symmetry coordinates: {e}"));
                }
            }
            first = false;
        }
    }
    let wall = all.elapsed();
    report(&timings, &errors, cases, wall);
}

fn report(timings: &[Timing], errors: &[String], cases: usize, wall: Duration) {
    let sum = |f: &dyn Fn(&Timing) -> bool| -> Duration {
        timings.iter().filter(|t| f(t)).map(|t| t.time).sum()
    };
    let max = |f: &dyn Fn(&Timing) -> bool| -> Duration {
        timings
            .iter()
            .filter(|t| f(t))
            .map(|t| t.time)
            .max()
            .unwrap_or_default()
    };
    // A case is the structure and both bases of one (group, site).
    let mut per_case: Vec<(Duration, &str, &str, bool, Duration)> = Vec::new();
    for t in timings.iter().filter(|t| t.what != "sym") {
        match per_case.last_mut() {
            Some(c) if c.1 == t.group && c.2 == t.site => {
                c.0 += t.time;
                c.4 += t.cpu;
            }
            _ => per_case.push((t.time, &t.group, &t.site, t.first, t.cpu)),
        }
    }
    let groups = per_case.iter().filter(|c| c.3).count();
    eprintln!(
        "{cases} cases (site types) in {groups} groups; whole pass {wall:?}, cases (structure \
         + σ + xyz) {:?} (CPU {:?})",
        per_case.iter().map(|c| c.0).sum::<Duration>(),
        per_case.iter().map(|c| c.4).sum::<Duration>()
    );
    eprintln!(
        "  σ: total {:?}; xyz: total {:?}; sym (not in the cases): total {:?}; structures: \
         total {:?}, slowest {:?}",
        sum(&|t| t.what == "σ"),
        sum(&|t| t.what == "xyz"),
        sum(&|t| t.what == "sym"),
        sum(&|t| t.what == "structure"),
        max(&|t| t.what == "structure")
    );
    eprintln!(
        "  first case of each group (irrep matrices built): total {:?}, slowest basis {:?}",
        sum(&|t| t.first && t.what != "sym"),
        max(&|t| t.first && t.what != "structure")
    );
    eprintln!(
        "  later cases (irreps cached): total {:?}, slowest basis {:?}",
        sum(&|t| !t.first && t.what != "sym"),
        max(&|t| !t.first && t.what != "structure")
    );
    let mut bases: Vec<&Timing> = timings.iter().filter(|t| t.what != "structure").collect();
    bases.sort_by_key(|t| std::cmp::Reverse(t.time));
    eprintln!("10 slowest (basis + SALCs):");
    for t in bases.iter().take(10) {
        let tag = if t.first { ", first of group" } else { "" };
        eprintln!(
            "  {} {} {}: {:?} (CPU {:?}; {} SALCs{tag})",
            t.group, t.site, t.what, t.time, t.cpu, t.count
        );
    }
    per_case.sort_by_key(|c| std::cmp::Reverse(c.0));
    eprintln!("10 slowest cases (structure + σ + xyz):");
    for (t, g, s, first, cpu) in per_case.iter().take(10) {
        let tag = if *first { " (first of group)" } else { "" };
        eprintln!("  {g} {s}: {t:?} (CPU {cpu:?}){tag}");
    }
    let target = Duration::from_millis(200);
    let over: Vec<_> = per_case.iter().filter(|c| c.0 > target).collect();
    let over_cpu = per_case.iter().filter(|c| c.4 > target).count();
    eprintln!(
        "cases over 200 ms: {} by wall time, {over_cpu} by CPU time",
        over.len()
    );
    if errors.is_empty() {
        eprintln!("errors: none");
    } else {
        eprintln!("errors: {}", errors.len());
        for e in errors {
            eprintln!("  {e}");
        }
    }
}
