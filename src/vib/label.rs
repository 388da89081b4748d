//! From raw eigen-solutions to labelled mode sets: degenerate partners grouped, each set's
//! irrep and purity, the pairing of Π components for linear molecules (worked in D2h/C2v,
//! correlated back as `rep::linear` does), activity (`spectra::activity_table`) and ν numbers
//! by the customary convention (species in table order, each by decreasing wavenumber:
//! Herzberg, *Infrared and Raman Spectra* (1945), ch. II; Mulliken, J. Chem. Phys. 23, 1997
//! (1955)).

use super::action::Action;
use super::constants::wavenumber_cm;
use super::solve::RawMode;
use crate::group::PointGroup;
use crate::spectra;

/// Purity below which a mode is flagged.
pub const PURITY_FLAG: f64 = 0.99;

/// One set of degenerate normal modes.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct ModeSet {
    /// Position in ascending order of wavenumber, from 1.
    pub index: usize,
    /// Harmonic wavenumber, cm⁻¹ (negative: imaginary); the mean of the members.
    pub wavenumber: f64,
    /// Every member's wavenumber (one per partner).
    pub members: Vec<f64>,
    pub irrep: String,
    pub dimension: usize,
    /// Share of the set in its irrep (0–1).
    pub purity: f64,
    pub ir: bool,
    pub raman: bool,
    /// ν number (customary numbering).
    pub nu: usize,
    /// Why the label is uncertain, when purity < 99 % or partners do not fit.
    pub flag: Option<String>,
    /// Working-group species of the members (D2h/C2v for linear molecules).
    #[serde(skip)]
    pub working: Vec<usize>,
}

/// A set before activity and numbering.
struct Draft {
    lambdas: Vec<f64>,
    purity: f64,
    working: Vec<usize>,
    label: String,
    dim: usize,
    flag: Option<String>,
}

/// Group raw solutions into labelled sets in `g` (worked in `action`'s group, which is `g`
/// itself or, for a linear `g`, its finite subgroup).
pub fn label_sets(
    g: &PointGroup,
    w: &PointGroup,
    action: &Action,
    raw: &[RawMode],
    blocked: bool,
    reason: &str,
) -> Result<Vec<ModeSet>, String> {
    // working-group sets
    let mut drafts: Vec<Draft> = Vec::new();
    if blocked {
        for r in raw {
            let i = r.irrep.unwrap_or(0);
            drafts.push(Draft {
                lambdas: vec![r.lambda; action.irreps[i].dim],
                purity: r.purity,
                working: vec![i],
                label: action.irreps[i].label.clone(),
                dim: action.irreps[i].dim,
                flag: None,
            });
        }
    } else {
        for (i, ir) in action.irreps.iter().enumerate() {
            let mine: Vec<&RawMode> = raw.iter().filter(|r| r.irrep == Some(i)).collect();
            for chunk in mine.chunks(ir.dim) {
                let flag = (chunk.len() < ir.dim).then(|| {
                    format!(
                        "only {} of {} partners found in {}: {reason}",
                        chunk.len(),
                        ir.dim,
                        ir.label
                    )
                });
                drafts.push(Draft {
                    lambdas: chunk.iter().map(|r| r.lambda).collect(),
                    purity: chunk.iter().map(|r| r.purity).fold(1.0, f64::min),
                    working: vec![i],
                    label: ir.label.clone(),
                    dim: ir.dim,
                    flag,
                });
            }
        }
    }
    if g.is_linear() {
        drafts = pair_linear(g, w, action, drafts)?;
    }
    let activity = spectra::activity_table(g);
    let mut sets: Vec<ModeSet> = drafts
        .into_iter()
        .map(|d| {
            let members: Vec<f64> = d.lambdas.iter().map(|&l| wavenumber_cm(l)).collect();
            let mean = members.iter().sum::<f64>() / members.len() as f64;
            let act = activity.iter().find(|a| a.irrep == d.label);
            let mut flag = d.flag;
            if flag.is_none() && d.purity < PURITY_FLAG {
                flag = Some(format!("{:.1} % pure: {reason}", 100.0 * d.purity));
            }
            ModeSet {
                index: 0,
                wavenumber: mean,
                members,
                irrep: d.label,
                dimension: d.dim,
                purity: d.purity,
                ir: act.is_some_and(|a| a.ir),
                raman: act.is_some_and(|a| a.raman),
                nu: 0,
                flag,
                working: d.working,
            }
        })
        .collect();
    sets.sort_by(|a, b| a.wavenumber.total_cmp(&b.wavenumber));
    for (k, s) in sets.iter_mut().enumerate() {
        s.index = k + 1;
    }
    number(
        &mut sets,
        &activity.iter().map(|a| a.irrep.clone()).collect::<Vec<_>>(),
    );
    Ok(sets)
}

/// ν numbers: species in table order, within a species by decreasing wavenumber.
pub fn number(sets: &mut [ModeSet], order: &[String]) {
    let mut keys: Vec<(usize, f64, usize)> = sets
        .iter()
        .enumerate()
        .map(|(k, s)| {
            let pos = order
                .iter()
                .position(|l| *l == s.irrep)
                .unwrap_or(order.len());
            (pos, -s.wavenumber, k)
        })
        .collect();
    keys.sort_by(|a, b| a.0.cmp(&b.0).then(a.1.total_cmp(&b.1)));
    for (nu, (_, _, k)) in keys.into_iter().enumerate() {
        sets[k].nu = nu + 1;
    }
}

/// Linear molecules: Π = the two subgroup species of a Π restriction, paired in order of
/// wavenumber; Σ from the one-dimensional restrictions.
fn pair_linear(
    g: &PointGroup,
    w: &PointGroup,
    action: &Action,
    drafts: Vec<Draft>,
) -> Result<Vec<Draft>, String> {
    let restr = crate::rep::restrictions(g, w)?;
    // working real irreps of D2h/C2v are the table rows
    let row_of = |i: usize| {
        w.table
            .irreps
            .iter()
            .position(|r| r.label == action.irreps[i].label)
            .unwrap_or(usize::MAX)
    };
    let mut left: Vec<Option<Draft>> = drafts.into_iter().map(Some).collect();
    let mut out = Vec::new();
    for (li, ir) in g.table.irreps.iter().enumerate() {
        let parts: Vec<usize> = (0..restr[li].len()).filter(|&r| restr[li][r] > 0).collect();
        if ir.dim() == 2 && ir.label.starts_with("Pi") && parts.len() == 2 {
            let take = |row: usize| -> Vec<usize> {
                let mut v: Vec<usize> = (0..left.len())
                    .filter(|&k| {
                        left[k]
                            .as_ref()
                            .is_some_and(|d| row_of(d.working[0]) == row)
                    })
                    .collect();
                v.sort_by(|&a, &b| {
                    left[a].as_ref().unwrap().lambdas[0]
                        .total_cmp(&left[b].as_ref().unwrap().lambdas[0])
                });
                v
            };
            let (xs, ys) = (take(parts[0]), take(parts[1]));
            for (&x, &y) in xs.iter().zip(&ys) {
                let (a, b) = (left[x].take().unwrap(), left[y].take().unwrap());
                out.push(Draft {
                    lambdas: vec![a.lambdas[0], b.lambdas[0]],
                    purity: a.purity.min(b.purity),
                    working: vec![a.working[0], b.working[0]],
                    label: ir.label.clone(),
                    dim: 2,
                    flag: a.flag.or(b.flag),
                });
            }
        }
    }
    for d in left.into_iter().flatten() {
        let row = row_of(d.working[0]);
        let li = (0..g.table.irreps.len()).find(|&li| {
            g.table.irreps[li].dim() == 1
                && restr[li]
                    .iter()
                    .enumerate()
                    .all(|(r, &m)| m == u64::from(r == row))
        });
        match li {
            Some(li) => out.push(Draft {
                label: g.table.irreps[li].label.clone(),
                ..d
            }),
            None => out.push(Draft {
                flag: Some(format!(
                    "{} component without its Π partner (labelled in {})",
                    d.label,
                    w.name()
                )),
                ..d
            }),
        }
    }
    Ok(out)
}
