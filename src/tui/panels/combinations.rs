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

/// For each set: Γ and the number of combinations it promises per irrep.
pub fn promised(app: &App, th: &Theme) -> Vec<Line<'static>> {
    let mut out = Vec::new();
    let Ok(a) = &app.analysis else { return out };
    let g = &a.group;
    for s in &a.sets {
        out.push(styled(
            &format!("{} ({} members)", s.name, s.members.len()),
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
            match &a.geometry {
                Some(ga) => lines.extend(geometry_salcs(ga, th, inner.width as usize)),
                None => lines.extend(promised(app, th)),
            }
        }
        Err(e) => lines.push(styled(&e.to_string(), th.warn(), th)),
    }
    let max = lines.len().saturating_sub(inner.height as usize) as u16;
    f.render_widget(
        Paragraph::new(lines).scroll((app.scroll.min(max), 0)),
        inner,
    );
}

/// Exact normalized stretch SALCs per bond set of the geometry, grouped by irrep.
fn geometry_salcs(ga: &GeometryAnalysis, th: &Theme, width: usize) -> Vec<Line<'static>> {
    let mut out = Vec::new();
    let wrapped = |out: &mut Vec<Line<'static>>, s: &str, style| {
        for l in super::super::text::wrap(s, width) {
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
