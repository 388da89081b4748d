//! Combinations: symmetry-adapted linear combinations. With a geometry, the exact normalized
//! stretch SALCs of each of its bond sets (computed by the full analysis, cached by geometry);
//! without one, how many combinations of each symmetry each set's reduction promises.

use super::super::app::App;
use super::super::theme::Theme;
use super::{block, missing_layer, styled};
use crate::analysis::{GeometryAnalysis, LayerStatus};
use crate::exact::Notation;
use ratatui::layout::Rect;
use ratatui::text::Line;
use ratatui::widgets::Paragraph;
use ratatui::Frame;

/// For the current set (the one the tick grid shows): the number of combinations its
/// reduction promises per irrep.
pub fn promised(app: &App, th: &Theme) -> Vec<Line<'static>> {
    let mut out = Vec::new();
    let Ok(a) = &app.analysis else { return out };
    let g = &a.group;
    let n = a.sets.len();
    if n == 0 {
        out.push(styled(
            "No member sets yet: n in Members starts one.",
            th.dim(),
            th,
        ));
    }
    let k = app.members_ui.set.min(n.saturating_sub(1));
    for s in a.sets.iter().skip(k).take(1) {
        out.push(styled(
            &format!(
                "Set {}/{n}: {} ({} members; ] next set)",
                k + 1,
                s.name,
                s.members.len()
            ),
            th.heading(),
            th,
        ));
        match s.multiplicities() {
            Some(m) => {
                for (i, n) in m.iter().enumerate().filter(|(_, n)| **n > 0) {
                    let ir = &g.table.irreps[i];
                    let label = if th.ascii {
                        ir.label.clone()
                    } else {
                        ir.display()
                    };
                    let d = ir.dim();
                    let what = match d {
                        1 => "combination".to_string(),
                        2 => "pair of partner combinations".to_string(),
                        3 => "triple of partner combinations".to_string(),
                        k => format!("set of {k} partner combinations"),
                    };
                    let plural = if *n == 1 { "" } else { "s" };
                    out.push(styled(
                        &format!("  {n} {what}{plural} of {label} symmetry"),
                        th.dim(),
                        th,
                    ));
                }
            }
            None => out.push(styled(
                "  χ is not a representation yet: see the Representation panel",
                th.warn(),
                th,
            )),
        }
    }
    out
}

pub fn draw(f: &mut Frame, area: Rect, app: &App, th: &Theme) {
    let b = block("Combinations", th);
    let inner = b.inner(area);
    f.render_widget(b, area);
    let mut lines = Vec::new();
    match &app.analysis {
        Ok(a) => {
            if let LayerStatus::Missing(m) = &a.layers.salc {
                lines.extend(missing_layer(m, th, inner.width as usize));
                lines.push(Line::raw(""));
                lines.push(styled(
                    "What the reductions already tell:",
                    th.heading(),
                    th,
                ));
            }
            lines.extend(super::set_salcs::current_set(
                app,
                a,
                th,
                inner.width as usize,
            ));
            match &a.geometry {
                Some(ga) => {
                    lines.extend(worked(app, ga, th, inner.width as usize));
                    lines.extend(geometry_salcs(ga, th, inner.width as usize));
                }
                None => {
                    lines.extend(promised(app, th));
                }
            }
        }
        Err(e) => lines.push(styled(&e.to_string(), th.warn(), th)),
    }
    let max = lines.len().saturating_sub(inner.height as usize) as u16;
    f.render_widget(
        Paragraph::new(lines).scroll((app.scroll_of(crate::tui::Panel::Combinations).min(max), 0)),
        inner,
    );
}

/// Exact normalized stretch SALCs per bond set of the geometry, grouped by irrep.
fn geometry_salcs(ga: &GeometryAnalysis, th: &Theme, width: usize) -> Vec<Line<'static>> {
    let mut out = Vec::new();
    let wrapped = |out: &mut Vec<Line<'static>>, s: &str, style| {
        for l in super::wrap_folded(th, s, width) {
            out.push(styled(&l, style, th));
        }
    };
    if let Err(e) = &ga.survey {
        wrapped(&mut out, e, th.warn());
        return out;
    }
    let Some(res) = &ga.salcs else {
        out.push(styled(
            "Working out the stretch SALCs of the geometry…",
            th.dim(),
            th,
        ));
        return out;
    };
    let sets = match &**res {
        Ok(s) => s,
        Err(e) => {
            wrapped(&mut out, &format!("No SALCs: {e}"), th.warn());
            return out;
        }
    };
    if sets.is_empty() {
        out.push(styled(
            "The geometry has no bonds: no stretch SALCs.",
            th.dim(),
            th,
        ));
        return out;
    }
    let nt = if th.ascii {
        Notation::Ascii
    } else {
        Notation::Unicode
    };
    out.push(styled(
        &format!(
            "Stretch SALCs of the geometry's bonds (group {})",
            ga.survey
                .as_ref()
                .map(|s| s.working.name().to_string())
                .unwrap_or_default()
        ),
        th.heading(),
        th,
    ));
    for bs in sets {
        out.push(Line::raw(""));
        match &bs.result {
            Err(e) => wrapped(&mut out, &format!("{}: {e}", bs.name), th.warn()),
            Ok(set) => {
                out.push(styled(
                    &format!("{} ({} members)", bs.name, set.members.len()),
                    th.heading(),
                    th,
                ));
                let mut last = usize::MAX;
                for sc in &set.salcs {
                    if sc.irrep != last {
                        last = sc.irrep;
                        let label = if th.ascii {
                            sc.label.clone()
                        } else {
                            crate::group::display_label(&sc.label)
                        };
                        out.push(styled(&format!(" {label}"), th.result(), th));
                    }
                    let text = crate::salc::salc_text(sc, &set.members, nt);
                    wrapped(&mut out, &format!("   {text}"), Default::default());
                }
            }
        }
    }
    out
}

/// The worked projection Σ χ(R)·R m of the chosen generating member m onto the chosen
/// irrep, then the normalized result (keys: m next member, i next irrep).
fn worked(app: &App, ga: &GeometryAnalysis, th: &Theme, width: usize) -> Vec<Line<'static>> {
    let mut out = Vec::new();
    let gens = app.generators();
    if gens.is_empty() {
        return out;
    }
    let Some(Ok(sets)) = ga.salcs.as_deref() else {
        return out;
    };
    let (k, m) = gens[app.combos_ui.member % gens.len()];
    let bs = &sets[k];
    let (Ok(set), Some(basis)) = (&bs.result, &bs.basis) else {
        return out;
    };
    let present: Vec<usize> = (0..set.irreps.len())
        .filter(|&x| set.multiplicities[x] > 0)
        .collect();
    if present.is_empty() {
        return out;
    }
    let x = present[app.combos_ui.irrep % present.len()];
    let nt = if th.ascii {
        Notation::Ascii
    } else {
        Notation::Unicode
    };
    let w = crate::salc::worked_projection(basis, &set.irreps[x], m);
    let names: Vec<String> = set
        .members
        .iter()
        .map(|mm| crate::salc::member_name(mm, nt))
        .collect();
    out.push(styled(
        &format!(
            "Worked projection in {} ({} members; m next member, i next irrep)",
            bs.name,
            set.members.len()
        ),
        th.heading(),
        th,
    ));
    // One line per class: the images of the member under the class's operations, and χ.
    let g = &basis.group;
    let ir = &set.irreps[x];
    out.push(styled(
        &format!(
            "  {} onto {}: Σ χ(R)·R{}, class by class",
            names[m],
            if th.ascii {
                ir.label.clone()
            } else {
                crate::group::display_label(&ir.label)
            },
            names[m]
        ),
        Default::default(),
        th,
    ));
    for c in 0..g.n_classes() {
        let images: Vec<String> = w
            .lines
            .iter()
            .zip(&g.ops)
            .filter(|(_, op)| op.class == c)
            .map(|(l, _)| crate::salc::column_text(&l.image, &names, nt))
            .collect();
        let chi = w
            .lines
            .iter()
            .zip(&g.ops)
            .find(|(_, op)| op.class == c)
            .map(|(l, _)| l.chi.text(nt))
            .unwrap_or_default();
        let class = crate::analysis::class_label(&g.table.classes[c], th.ascii);
        for piece in super::wrap_folded(
            th,
            &format!("    {class}: {}   χ = {chi}", images.join(", ")),
            width,
        ) {
            out.push(styled(&piece, Default::default(), th));
        }
    }
    let sum: Vec<(usize, crate::exact::Cyclo)> = w
        .sum
        .iter()
        .enumerate()
        .filter(|(_, c)| !c.is_zero())
        .map(|(k, c)| (k, c.clone()))
        .collect();
    for piece in super::wrap_folded(
        th,
        &format!("  sum: {}", crate::salc::column_text(&sum, &names, nt)),
        width,
    ) {
        out.push(styled(&piece, Default::default(), th));
    }
    // Normalized: the same shortest form the SALC list uses, over its length.
    if w.sum.iter().any(|c| !c.is_zero()) {
        let (coefficients, norm2) = crate::salc::display_form(w.sum.clone());
        let sc = crate::salc::Salc {
            irrep: x,
            label: set.irreps[x].label.clone(),
            copy: 1,
            partner: 1,
            coefficients,
            norm2,
            role: crate::salc::Role::Plain,
        };
        for piece in super::wrap_folded(
            th,
            &format!(
                "  normalized: {}",
                crate::salc::salc_text(&sc, &set.members, nt)
            ),
            width,
        ) {
            out.push(styled(&piece, th.result(), th));
        }
    } else {
        out.push(styled(
            "  the sum is zero: this member generates nothing of this irrep; try another (m)",
            th.dim(),
            th,
        ));
    }
    out.push(Line::raw(""));
    out
}
