//! Which panes the body of the screen shows, and where, chosen from its size alone.
//!
//! Below [`TILED`] the workspace shows one pane (the focused one). From there up it tiles: the
//! tick grid (Members) over the worked reduction (Representation) on the left, the current
//! set's combinations on the right; from [`WIDE`] up a third column shows Spectra. A focused
//! pane that is not among the tiles (Point group, Molecule, Normal modes, Spectra on a medium
//! screen) takes the place of the last column, so the focus is always on screen. Zoom shows
//! the focused pane alone at any size. Pure functions: drawing and mouse clicks use the same tiles.

use super::action::Panel;
use ratatui::layout::Rect;

/// Smallest screen (columns, rows) that tiles.
pub const TILED: (u16, u16) = (120, 32);
/// Smallest screen that shows three columns.
pub const WIDE: (u16, u16) = (180, 44);

/// How the body is arranged.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Arrangement {
    /// One pane fills the body (small screens, or zoomed).
    Single,
    /// Two columns: Members over Representation, and one more pane.
    Two,
    /// Three columns: Members over Representation, Combinations, and one more pane.
    Three,
}

/// The arrangement for a screen of `w`×`h` cells.
pub fn arrangement(w: u16, h: u16) -> Arrangement {
    if w >= WIDE.0 && h >= WIDE.1 {
        Arrangement::Three
    } else if w >= TILED.0 && h >= TILED.1 {
        Arrangement::Two
    } else {
        Arrangement::Single
    }
}

/// One pane and its rectangle.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Tile {
    pub panel: Panel,
    pub area: Rect,
}

/// The panes of `body` (the screen minus title, tabs, status and footer) for a screen of
/// `screen` cells, with `focus` focused; `zoom` shows the focused pane alone. `grid_rows` is
/// how many rows the tick grid would like (its members plus the lines around them).
pub fn tiles(
    body: Rect,
    screen: (u16, u16),
    focus: Panel,
    zoom: bool,
    grid_rows: u16,
) -> Vec<Tile> {
    let single = vec![Tile {
        panel: focus,
        area: body,
    }];
    if zoom {
        return single;
    }
    match arrangement(screen.0, screen.1) {
        Arrangement::Single => single,
        Arrangement::Two => {
            let last = match focus {
                Panel::Members | Panel::Representation => Panel::Combinations,
                p => p,
            };
            // the mode table is wide: Normal modes gets three fifths
            let share = if last == Panel::Vibrations { 8 } else { 11 };
            let (left, right) = split_h(body, body.width * share / 20);
            let mut v = stacked(left, grid_rows);
            v.push(Tile {
                panel: last,
                area: right,
            });
            v
        }
        Arrangement::Three => {
            let (left, rest) = split_h(body, body.width * 2 / 5);
            let (mid, right) = split_h(rest, rest.width / 2);
            let last = match focus {
                Panel::Group | Panel::Molecule | Panel::Vibrations => focus,
                _ => Panel::Spectra,
            };
            let mut v = stacked(left, grid_rows);
            v.push(Tile {
                panel: Panel::Combinations,
                area: mid,
            });
            v.push(Tile {
                panel: last,
                area: right,
            });
            v
        }
    }
}

/// Members over Representation: the grid gets the rows it asks for (at least 10), the
/// reduction the rest (at least 8 while the grid gets 10).
fn stacked(area: Rect, grid_rows: u16) -> Vec<Tile> {
    let most = area.height.saturating_sub(8).max(10);
    let top = grid_rows.clamp(10, most).min(area.height);
    let (a, b) = split_v(area, top);
    vec![
        Tile {
            panel: Panel::Members,
            area: a,
        },
        Tile {
            panel: Panel::Representation,
            area: b,
        },
    ]
}

fn split_h(r: Rect, left: u16) -> (Rect, Rect) {
    let left = left.min(r.width);
    (
        Rect::new(r.x, r.y, left, r.height),
        Rect::new(r.x + left, r.y, r.width - left, r.height),
    )
}

fn split_v(r: Rect, top: u16) -> (Rect, Rect) {
    let top = top.min(r.height);
    (
        Rect::new(r.x, r.y, r.width, top),
        Rect::new(r.x, r.y + top, r.width, r.height - top),
    )
}

/// The tile under the cell (x, y), if any.
pub fn hit(tiles: &[Tile], x: u16, y: u16) -> Option<Tile> {
    tiles.iter().copied().find(|t| {
        x >= t.area.x
            && x < t.area.x + t.area.width
            && y >= t.area.y
            && y < t.area.y + t.area.height
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Every size from 20×8 to 260×80 and every focus: the tiles lie inside the body, do not
    /// overlap, cover it, and the focused pane is among them.
    #[test]
    fn tiles_cover_the_body_without_overlap_and_show_the_focus() {
        for w in (20..=260).step_by(7) {
            for h in (8..=80).step_by(3) {
                let body = Rect::new(0, 2, w, h - 4);
                for focus in Panel::ALL {
                    for zoom in [false, true] {
                        let t = tiles(body, (w, h), focus, zoom, (w + h) % 40);
                        assert!(t.iter().any(|x| x.panel == focus), "{w}x{h} {focus:?}");
                        let area: u32 = t
                            .iter()
                            .map(|x| x.area.width as u32 * x.area.height as u32)
                            .sum();
                        assert_eq!(area, body.width as u32 * body.height as u32);
                        for (i, a) in t.iter().enumerate() {
                            assert!(body.union(a.area) == body);
                            for b in &t[i + 1..] {
                                assert!(!a.area.intersects(b.area), "{w}x{h}");
                                assert_ne!(a.panel, b.panel);
                            }
                        }
                        let n = match (zoom, arrangement(w, h)) {
                            (true, _) | (_, Arrangement::Single) => 1,
                            (_, Arrangement::Two) => 3,
                            (_, Arrangement::Three) => 4,
                        };
                        assert_eq!(t.len(), n, "{w}x{h}");
                    }
                }
            }
        }
    }
}
