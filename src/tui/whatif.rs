//! The "What if" overlay: lower the session's symmetry (pick a subgroup and the way it sits,
//! described in words) or replace one atom of the geometry, and see Γ, activity and band counts
//! before and after side by side. Looking changes nothing; applying a lowering is its own key
//! (`a`) and one undoable edit, saved like any other. The chemistry is `analysis::whatif` and
//! `analysis::substitute`; this file only asks and draws.

use super::app::{App, FieldPurpose, Mode};
use super::keymap::{Code, Key};
use super::panels::{self, spectra::unicode_labels};
use super::text::{pad, width, wrap};
use super::theme::Theme;
use super::ui::centered;
use crate::analysis::substitute::{self, Substitution};
use crate::analysis::whatif::{self, Lowering, Way};
use crate::analysis::{self as an, Depth};
use crate::spectra::ModesReport;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Block, Clear, Paragraph};
use ratatui::Frame;

/// What the overlay shows.
#[derive(Debug, Clone, PartialEq)]
pub enum WhatIfView {
    /// The ways to lower the group, cursor on one.
    Pick { ways: Vec<Way>, cursor: usize },
    /// One lowering, before and after.
    Lowered {
        lowering: Box<Lowering>,
        scroll: u16,
    },
    /// One replaced atom, before and after.
    Replaced { sub: Box<Substitution>, scroll: u16 },
}

impl App {
    /// Open the list of ways to lower the session's group.
    pub(super) fn lower_symmetry_picker(&mut self) {
        let Ok(a) = self.analysis.clone() else {
            return self.error("choose a point group first (Point group panel, Enter)");
        };
        match whatif::ways(&a) {
            Ok(ways) if ways.is_empty() => {
                self.status(format!("{} has no smaller group to go to", a.group.name()))
            }
            Ok(ways) => self.mode = Mode::WhatIf(Box::new(WhatIfView::Pick { ways, cursor: 0 })),
            Err(e) => self.error(e),
        }
    }

    pub(super) fn replace_atom_prompt(&mut self) {
        if self.session.geometry.is_none() {
            return self.error("no geometry to change: build one in the Molecule panel (b)");
        }
        self.ask_field(
            FieldPurpose::ReplaceAtom,
            "Replace atom: number and new element (2 Br; isotope 2 37Cl)",
            String::new(),
        );
    }

    pub(super) fn replace_atom_done(&mut self, text: &str) {
        let result = substitute::parse_replacement(text)
            .and_then(|r| substitute::substitute(&self.session, self.base_dir().as_deref(), &r));
        match result {
            Ok(sub) => {
                self.mode = Mode::WhatIf(Box::new(WhatIfView::Replaced {
                    sub: Box::new(sub),
                    scroll: 0,
                }))
            }
            Err(e) => self.error(format!("not replaced: {e}")),
        }
    }

    /// A key while the overlay is open.
    pub(super) fn whatif_key(&mut self, view: WhatIfView, key: Key) {
        let step = |s: u16, d: i32| (s as i32 + d).clamp(0, 500) as u16;
        match (view, key.code) {
            (_, Code::Esc | Code::Char('q')) => {
                self.mode = Mode::Normal;
                self.status("what-if closed: the session is unchanged");
            }
            (WhatIfView::Pick { ways, cursor }, code) => {
                let n = ways.len();
                let cursor = match code {
                    Code::Down | Code::Char('j') => (cursor + 1).min(n - 1),
                    Code::Up | Code::Char('k') => cursor.saturating_sub(1),
                    Code::PageDown => (cursor + 5).min(n - 1),
                    Code::PageUp => cursor.saturating_sub(5),
                    Code::Home | Code::Char('g') => 0,
                    Code::End | Code::Char('G') => n - 1,
                    Code::Enter => return self.show_lowering(&ways[cursor]),
                    _ => cursor,
                };
                self.mode = Mode::WhatIf(Box::new(WhatIfView::Pick { ways, cursor }));
            }
            (WhatIfView::Lowered { lowering, .. }, Code::Char('a')) => {
                let l = *lowering;
                self.edit(|s| *s = whatif::lowered_session(s, &l));
                self.mode = Mode::Normal;
                self.status(format!(
                    "group lowered to {}: ticks carried (u undoes, s saves)",
                    l.subgroup
                ));
            }
            (WhatIfView::Lowered { lowering, scroll }, code) => {
                let scroll = scrolled(scroll, code, step);
                self.mode = Mode::WhatIf(Box::new(WhatIfView::Lowered { lowering, scroll }));
            }
            (WhatIfView::Replaced { sub, scroll }, code) => {
                let scroll = scrolled(scroll, code, step);
                self.mode = Mode::WhatIf(Box::new(WhatIfView::Replaced { sub, scroll }));
            }
        }
    }

    fn show_lowering(&mut self, way: &Way) {
        // The full analysis, for Γvib and the band counts.
        let a = match an::analyze_in(&self.session, Depth::Full, self.base_dir().as_deref()) {
            Ok(a) => a,
            Err(e) => return self.error(e.to_string()),
        };
        match whatif::lower(&self.session, &a, way) {
            Ok(l) => {
                self.mode = Mode::WhatIf(Box::new(WhatIfView::Lowered {
                    lowering: Box::new(l),
                    scroll: 0,
                }))
            }
            Err(e) => self.error(e),
        }
    }
}

fn scrolled(s: u16, code: Code, step: impl Fn(u16, i32) -> u16) -> u16 {
    match code {
        Code::Down | Code::Char('j') => step(s, 1),
        Code::Up | Code::Char('k') => step(s, -1),
        Code::PageDown | Code::Char(' ') => step(s, 10),
        Code::PageUp => step(s, -10),
        Code::Home | Code::Char('g') => 0,
        _ => s,
    }
}

/// Irrep labels of a Γ (`4A1 + 2Eu`) in the workspace's style (Unicode unless ASCII).
fn labels(text: &str, group: &str, th: &Theme) -> String {
    if th.ascii {
        return text.to_string();
    }
    let Ok(g) = crate::group::load(group) else {
        return text.to_string();
    };
    let ls: Vec<String> = g.table.irreps.iter().map(|r| r.label.clone()).collect();
    text.split(" + ")
        .map(|term| {
            let n: String = term.chars().take_while(|c| c.is_ascii_digit()).collect();
            format!("{n}{}", unicode_labels(&term[n.len()..], &ls))
        })
        .collect::<Vec<_>>()
        .join(" + ")
}

/// Rows `label | before | after`, each cell wrapped in its column.
fn side_by_side(rows: &[(String, String, String)], w: usize, th: &Theme) -> Vec<Line<'static>> {
    let lw = 12usize;
    let cw = w.saturating_sub(lw + 3) / 2;
    let bar = th.pick("│", "|");
    let mut out = Vec::new();
    for (label, before, after) in rows {
        let b = wrap(&panels::fold(before, th), cw.max(4));
        let a = wrap(&panels::fold(after, th), cw.max(4));
        for k in 0..b.len().max(a.len()).max(1) {
            let l = if k == 0 { label.as_str() } else { "" };
            out.push(Line::from(vec![
                Span::styled(pad(&panels::fold(l, th), lw), th.dim()),
                Span::raw(pad(b.get(k).map(|s| s.as_str()).unwrap_or(""), cw)),
                Span::styled(format!(" {bar} "), th.dim()),
                Span::raw(a.get(k).cloned().unwrap_or_default()),
            ]));
        }
    }
    out
}

/// IR, Raman, coincident and silent band counts of two activity reports.
fn mode_rows(b: Option<&ModesReport>, a: Option<&ModesReport>) -> Vec<(String, String, String)> {
    let n = |m: Option<&ModesReport>, f: fn(&ModesReport) -> u64| {
        m.map_or("-".to_string(), |m| f(m).to_string())
    };
    let row = |label: &str, f: fn(&ModesReport) -> u64| (label.to_string(), n(b, f), n(a, f));
    vec![
        row("IR bands", |m| m.ir_bands),
        row("Raman bands", |m| m.raman_bands),
        row("in both", |m| m.coincident_bands),
        row("silent", |m| m.silent_fundamentals),
    ]
}

fn lowering_lines(l: &Lowering, w: usize, th: &Theme) -> Vec<Line<'static>> {
    let (g, h) = (l.group.as_str(), l.subgroup.as_str());
    let mut out = vec![panels::styled(
        &format!("Lowering {g} to {h}, the way that keeps:"),
        th.heading(),
        th,
    )];
    for s in wrap(&panels::fold(&l.description, th), w.saturating_sub(2)) {
        out.push(Line::raw(format!("  {s}")));
    }
    out.push(Line::raw(""));
    out.extend(side_by_side(
        &[(
            String::new(),
            format!("Before ({g})"),
            format!("After ({h})"),
        )],
        w,
        th,
    ));
    if let (Some((vb, va)), Some(from)) = (&l.vibrations, &l.vibrations_from) {
        out.push(panels::styled(
            &format!("Vibrations of {from}"),
            th.heading(),
            th,
        ));
        let mut rows = vec![(
            "Γvib".to_string(),
            labels(&vb.gamma, g, th),
            labels(&va.gamma, h, th),
        )];
        rows.extend(mode_rows(Some(vb), Some(va)));
        out.extend(side_by_side(&rows, w, th));
    }
    for s in &l.sets {
        out.push(panels::styled(
            &format!("Set '{}' ({})", s.name, s.kind.name()),
            th.heading(),
            th,
        ));
        let none = "not reduced".to_string();
        let mut rows = vec![(
            "Γ".to_string(),
            labels(s.before.as_ref().unwrap_or(&none), g, th),
            labels(s.after.as_ref().unwrap_or(&none), h, th),
        )];
        if s.modes_before.is_some() || s.modes_after.is_some() {
            rows.extend(mode_rows(s.modes_before.as_ref(), s.modes_after.as_ref()));
        }
        out.extend(side_by_side(&rows, w, th));
        for t in wrap(
            &panels::fold(&format!("ticks in {h}: {}", s.ticks_from), th),
            w,
        ) {
            out.push(Line::from(Span::styled(t, th.dim())));
        }
    }
    out
}

fn substitution_lines(s: &Substitution, w: usize, th: &Theme) -> Vec<Line<'static>> {
    let (b, a) = (&s.before, &s.after);
    let mut out = vec![panels::styled(
        &format!("Replacing {}", s.change),
        th.heading(),
        th,
    )];
    out.push(Line::raw(""));
    let gamma = |x: &substitute::Side| match &x.vibrations {
        Ok(m) => labels(&m.gamma, &x.group, th),
        Err(e) => e.clone(),
    };
    let mut rows = vec![
        (String::new(), "Before".into(), "After".into()),
        ("molecule".into(), b.formula.clone(), a.formula.clone()),
        ("group".into(), b.group.clone(), a.group.clone()),
        (
            "off by".into(),
            format!("{:.3} Å", b.deviation),
            format!("{:.3} Å", a.deviation),
        ),
        ("Γvib".into(), gamma(b), gamma(a)),
    ];
    rows.extend(mode_rows(
        b.vibrations.as_ref().ok(),
        a.vibrations.as_ref().ok(),
    ));
    out.extend(side_by_side(&rows, w, th));
    out.push(Line::raw(""));
    let mut notes = s.notes.clone();
    notes.push(format!(
        "detected with the session's tolerance, {} Å; the session itself is unchanged",
        s.tolerance
    ));
    for n in notes {
        for t in wrap(&panels::fold(&n, th), w) {
            out.push(Line::from(Span::styled(t, th.dim())));
        }
    }
    out
}

fn picker_lines(ways: &[Way], cursor: usize, w: usize, th: &Theme) -> (Vec<Line<'static>>, usize) {
    let mut out = Vec::new();
    let mut at = 0;
    let mark = th.pick("▶ ", "> ");
    for (i, way) in ways.iter().enumerate() {
        if i == cursor {
            at = out.len();
        }
        let head = format!("{:<5}", way.subgroup);
        let text = wrap(
            &panels::fold(&way.description, th),
            w.saturating_sub(width(&head) + 3),
        );
        for (k, t) in text.iter().enumerate() {
            let lead = if k > 0 {
                " ".repeat(width(&head) + 2)
            } else if i == cursor {
                format!("{mark}{head}")
            } else {
                format!("  {head}")
            };
            let style = if i == cursor { th.cursor() } else { th.dim() };
            out.push(Line::from(vec![
                Span::styled(lead, style),
                Span::raw(format!(" {t}")),
            ]));
        }
    }
    (out, at)
}

/// Draw the overlay over the panes.
pub fn draw(f: &mut Frame, area: Rect, v: &WhatIfView, th: &Theme) {
    let r = centered(area, area.width.min(100), area.height);
    f.render_widget(Clear, r);
    let (title, keys) = match v {
        WhatIfView::Pick { .. } => (
            "What if: lower the symmetry",
            th.pick(
                "↑/↓ choose · Enter show · Esc close",
                "Up/Down choose | Enter show | Esc close",
            ),
        ),
        WhatIfView::Lowered { .. } => (
            "What if",
            th.pick(
                "a apply to the session (u undoes) · ↑/↓ scroll · Esc close",
                "a apply to the session (u undoes) | Up/Down scroll | Esc close",
            ),
        ),
        WhatIfView::Replaced { .. } => (
            "What if: replace an atom",
            th.pick("↑/↓ scroll · Esc close", "Up/Down scroll | Esc close"),
        ),
    };
    let block = Block::bordered()
        .border_set(th.border_set())
        .border_style(th.border_focus())
        .title(Span::styled(format!(" {title} "), th.heading()));
    let inner = block.inner(r);
    f.render_widget(block, r);
    if inner.height < 2 {
        return;
    }
    let w = inner.width as usize;
    let body = Rect::new(inner.x, inner.y, inner.width, inner.height - 1);
    let (lines, scroll) = match v {
        WhatIfView::Pick { ways, cursor } => {
            let (lines, at) = picker_lines(ways, *cursor, w, th);
            let h = body.height as usize;
            let s = (at + 3).saturating_sub(h);
            (lines, s as u16)
        }
        WhatIfView::Lowered { lowering, scroll } => (lowering_lines(lowering, w, th), *scroll),
        WhatIfView::Replaced { sub, scroll } => (substitution_lines(sub, w, th), *scroll),
    };
    let max = lines.len().saturating_sub(body.height as usize) as u16;
    f.render_widget(Paragraph::new(lines).scroll((scroll.min(max), 0)), body);
    let foot = Rect::new(inner.x, inner.y + inner.height - 1, inner.width, 1);
    f.render_widget(
        Paragraph::new(Line::from(Span::styled(keys.to_string(), th.key()))),
        foot,
    );
}
