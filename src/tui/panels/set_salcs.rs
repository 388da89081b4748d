//! Pieces of the Members and Combinations panels about members tied to atoms: the legend of
//! what each member is (`r1 = Co1–Cl2`), and the SALCs of the current set whatever its kind —
//! or, when they cannot be had, what is missing and how to supply it.

use super::super::app::App;
use super::super::theme::Theme;
use super::styled;
use crate::analysis::{atom_sets, set_salcs, Analysis};
use crate::exact::Notation;
use ratatui::text::Line;

/// `r1 = Co1–Cl2 · r2 = Co1–Cl3 …` for the members of the current set that name their atoms
/// (empty when none does or there is no usable geometry).
pub fn legend(app: &App, a: &Analysis, th: &Theme, width: usize) -> Vec<Line<'static>> {
    let Some(set) = app.session.sets.get(app.members_ui.set) else {
        return Vec::new();
    };
    let Ok(sv) = atom_sets::usable(a.geometry.as_ref()) else {
        return Vec::new();
    };
    let parts: Vec<String> = set
        .members
        .iter()
        .filter_map(|m| {
            m.atoms
                .as_ref()
                .map(|at| format!("{} = {}", m.name, atom_sets::member_legend(sv, at)))
        })
        .collect();
    if parts.is_empty() {
        return Vec::new();
    }
    let sep = th.pick(" · ", " | ");
    super::wrap_folded(th, &format!("atoms: {}", parts.join(sep)), width)
        .into_iter()
        .map(|l| styled(&l, th.dim(), th))
        .collect()
}

/// The normalized SALCs of the current set, by irrep, with partners of degenerate irreps one
/// after the other; or why there are none yet.
pub fn current_set(app: &App, a: &Analysis, th: &Theme, width: usize) -> Vec<Line<'static>> {
    let mut out = Vec::new();
    let Some(set) = app.session.sets.get(app.members_ui.set) else {
        return out;
    };
    let wrapped = |out: &mut Vec<Line<'static>>, s: &str, style| {
        for l in super::wrap_folded(th, s, width) {
            out.push(styled(&l, style, th));
        }
    };
    wrapped(
        &mut out,
        &format!(
            "SALCs of set {}/{}: {} ({})",
            app.members_ui.set + 1,
            app.session.sets.len(),
            set.name,
            set.kind.name()
        ),
        th.heading(),
    );
    let r = set_salcs::set_salcs(set, a.geometry.as_ref(), false);
    let Some(r) = r else {
        out.push(styled("  working out the SALCs…", th.dim(), th));
        out.push(Line::raw(""));
        return out;
    };
    let ss = match &*r {
        Ok(ss) => ss,
        Err(why) => {
            wrapped(&mut out, &format!("  none shown: {why}"), th.warn());
            out.push(Line::raw(""));
            return out;
        }
    };
    let nt = if th.ascii {
        Notation::Ascii
    } else {
        Notation::Unicode
    };
    if ss.group != a.group.name() {
        wrapped(
            &mut out,
            &format!(
                "  in the geometry's group {} (the session's is {})",
                ss.group,
                a.group.name()
            ),
            th.dim(),
        );
    }
    let mut last = usize::MAX;
    for sc in &ss.salcs.salcs {
        if sc.irrep != last {
            last = sc.irrep;
            let label = if th.ascii {
                sc.label.clone()
            } else {
                crate::group::display_label(&sc.label)
            };
            out.push(styled(&format!(" {label}"), th.result(), th));
        }
        let text = crate::salc::salc_text(sc, &ss.salcs.members, nt);
        wrapped(&mut out, &format!("   {text}"), Default::default());
    }
    out.push(Line::raw(""));
    out
}
