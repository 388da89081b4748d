//! The SALC engine: for each irrep Γ of multiplicity n and dimension d, exactly n·d orthonormal
//! SALCs spanning Γ's part of a basis, partners transforming by Γ's matrices.
//!
//! Never projects every member: per set of equivalent sites only the members of one site m are
//! used, and P_1k·m (k = 1 … d) spans that set's share of partner 1 (because
//! P_11·R = Σ_k D(R)_1k P_1k). Independent vectors are picked and orthogonalized exactly; the
//! other partners follow from R·s₁ = Σᵢ sᵢ·D(R)ᵢ₁ for d operations with independent columns,
//! which costs d applications of R instead of a sum over the group.

use super::fast::{common_field, field_lcm, FastBasis, FastIrrep};
use super::irreps::{real_irreps, IrrepError, Matrix, RealIrrep};
use super::project::{inverses, partner_one_images, transfer};
use crate::basis::{Basis, Member};
use crate::exact::{field_candidates, gcd_of, solve_field, Cyclo, FieldSpec, KField, KInt, KVec};
use crate::group::PointGroup;
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::One;
use rayon::prelude::*;
use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};
use std::time::{Duration, Instant};

/// What a SALC is, beyond its symmetry.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Role {
    /// An ordinary SALC (a symmetry coordinate, an LGO …).
    Plain,
    /// A translation of the whole molecule.
    Translation,
    /// A rotation of the whole molecule.
    Rotation,
    /// A redundant combination of internal coordinates.
    Redundant,
}

/// One SALC: a normalized combination `coefficients / √norm2` of the members.
#[derive(Debug, Clone)]
pub struct Salc {
    /// Index into the group's real irreps.
    pub irrep: usize,
    pub label: String,
    /// Which copy of the irrep (1-based).
    pub copy: usize,
    /// Which partner (1-based), behaving like the irrep's `partner`-th function.
    pub partner: usize,
    /// Exact coefficients, cleared of common factors (the shortest form to print).
    pub coefficients: Vec<Cyclo>,
    /// Σ coefficient², exact and positive.
    pub norm2: Cyclo,
    pub role: Role,
}

impl Salc {
    /// Normalized coefficients as floats.
    pub fn floats(&self) -> Vec<f64> {
        let n = self.norm2.re_f64().sqrt();
        self.coefficients.iter().map(|c| c.re_f64() / n).collect()
    }
}

/// All SALCs of a basis.
#[derive(Debug, Clone)]
pub struct SalcSet {
    pub group: Arc<PointGroup>,
    pub irreps: Arc<Vec<RealIrrep>>,
    pub members: Vec<Member>,
    /// Copies of each real irrep.
    pub multiplicities: Vec<u64>,
    pub salcs: Vec<Salc>,
    pub notes: Vec<String>,
    /// For each irrep with SALCs (index), the arithmetic its SALCs were computed on.
    pub arithmetic: Vec<(usize, Arithmetic)>,
}

/// Vectors to place first in an irrep's span (translations, rotations), with their role.
#[derive(Debug, Clone)]
pub struct Preset {
    pub vector: Vec<Cyclo>,
    pub role: Role,
    /// Real irreps (indices) the preset's family has a part in, each listed once per copy.
    pub irreps: Vec<usize>,
}

/// Why SALCs could not be built.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum SalcError {
    #[error(transparent)]
    Irreps(#[from] IrrepError),
    #[error(transparent)]
    Basis(#[from] crate::basis::BasisError),
    #[error("{irrep}: found {found} independent SALCs where the reduction says {expected}")]
    Count {
        irrep: String,
        found: usize,
        expected: usize,
    },
    #[error("no irrep '{0}' in this group")]
    NoIrrep(String),
    #[error("{0}")]
    Other(String),
    #[error(
        "exact SALCs stopped after {seconds} s at {irrep}: the basis or its exact numbers are \
         too large to finish in time (the group, Γ and the multiplicities are not affected)"
    )]
    Ceiling { irrep: String, seconds: f64 },
    #[error(
        "exact SALCs stopped at {irrep} with the process using {megabytes} MB: the basis or its \
         exact numbers are too large to finish within memory (the group, Γ and the \
         multiplicities are not affected)"
    )]
    MemoryCeiling { irrep: String, megabytes: u64 },
}

/// How long one exact SALC computation may run before it stops with [`SalcError::Ceiling`]:
/// every command must answer within 2 s, so the exact engine gets 1.5 s of it. An unoptimized
/// (debug) build does the same work 10–30× slower, on test machines often under load: it gets
/// 10 minutes, so that tests of large cases check the mathematics, not the build profile.
pub const EXACT_CEILING: Duration = if cfg!(debug_assertions) {
    Duration::from_secs(600)
} else {
    Duration::from_millis(1500)
};

/// The resident memory (whole process, MB) at which exact SALC work stops with
/// [`SalcError::MemoryCeiling`]: every command must stay within 1 GB, and the irreps are
/// computed side by side, each growing its numbers until it is stopped, so the bound is the
/// process's, checked every few milliseconds (Linux: /proc/self/statm; elsewhere only the time
/// ceiling applies). Unoptimized (debug) builds run the test suite, many computations in one
/// process at once: there the bound is 8 GB, so that tests check the mathematics.
pub const MEMORY_CEILING_MB: u64 = if cfg!(debug_assertions) { 8192 } else { 640 };

/// Resident set size of this process in MB, where the system tells it.
pub(crate) fn resident_mb() -> Option<u64> {
    let statm = std::fs::read_to_string("/proc/self/statm").ok()?;
    let pages: u64 = statm.split_whitespace().nth(1)?.parse().ok()?;
    // SAFETY: sysconf only reads a system constant.
    let page = unsafe { libc::sysconf(libc::_SC_PAGESIZE) };
    let page = u64::try_from(page).ok().filter(|&p| p > 0)?;
    Some(pages * page / (1024 * 1024))
}

static COMMAND_START: std::sync::OnceLock<Instant> = std::sync::OnceLock::new();

/// Count the ceiling from this instant (a command-line run: its start) instead of from the
/// start of each SALC computation, so that a whole command stays within the limit.
pub fn count_ceiling_from(t: Instant) {
    let _ = COMMAND_START.set(t);
}

/// The running clock (and memory watch) of one SALC computation.
struct Ceiling {
    start: Instant,
    limit: Duration,
    /// When memory was last looked at (µs since `start`).
    memory_seen: std::sync::atomic::AtomicU64,
    /// The resident MB that stopped the work (0: not stopped): once one irrep sees the memory
    /// ceiling, the others running beside it stop at their next check, instead of growing
    /// until they look for themselves.
    memory_stop: std::sync::atomic::AtomicU64,
}

impl Ceiling {
    fn new() -> Self {
        Ceiling {
            start: COMMAND_START.get().copied().unwrap_or_else(Instant::now),
            limit: EXACT_CEILING,
            memory_seen: std::sync::atomic::AtomicU64::new(0),
            memory_stop: std::sync::atomic::AtomicU64::new(0),
        }
    }
    fn check(&self, irrep: &str) -> Result<(), SalcError> {
        use std::sync::atomic::Ordering;
        let elapsed = self.start.elapsed();
        if elapsed > self.limit {
            return Err(SalcError::Ceiling {
                irrep: irrep.to_string(),
                seconds: self.limit.as_secs_f64(),
            });
        }
        let stopped = |mb| SalcError::MemoryCeiling {
            irrep: irrep.to_string(),
            megabytes: mb,
        };
        let stop = self.memory_stop.load(Ordering::Relaxed);
        if stop != 0 {
            return Err(stopped(stop));
        }
        // memory every 2 ms at most (reading it costs a system call)
        let now = elapsed.as_micros() as u64;
        let seen = self.memory_seen.load(Ordering::Relaxed);
        if now.saturating_sub(seen) >= 2_000 {
            self.memory_seen.store(now, Ordering::Relaxed);
            if let Some(mb) = resident_mb().filter(|&mb| mb > MEMORY_CEILING_MB) {
                self.memory_stop.store(mb, Ordering::Relaxed);
                return Err(stopped(mb));
            }
        }
        Ok(())
    }
}

/// Copies of each real irrep in a basis.
pub fn real_multiplicities(b: &Basis, irreps: &[RealIrrep]) -> Result<Vec<u64>, SalcError> {
    let m = b.multiplicities()?;
    Ok(irreps.iter().map(|ir| m[ir.row]).collect())
}

/// Every SALC of a basis.
pub fn salcs(b: &Basis) -> Result<SalcSet, SalcError> {
    salcs_with_presets(b, &[], None)
}

/// SALCs with presets placed first, optionally for one real irrep only.
pub fn salcs_with_presets(
    b: &Basis,
    presets: &[Preset],
    only: Option<usize>,
) -> Result<SalcSet, SalcError> {
    salcs_on(b, presets, only, Arithmetic::Fastest)
}

/// Which arithmetic the SALC engine runs on. All give the same exact numbers; the choice is
/// there so tests can compare them, and `SalcSet::arithmetic` reports which one ran.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Arithmetic {
    /// Machine integers over one field per irrep; where those overflow, big integers over
    /// the same field; Cyclo numbers only where neither applies.
    Fastest,
    /// Big integers over one field with one denominator per vector (Cyclo numbers only
    /// where that does not apply).
    BigIntegers,
    /// [`Cyclo`] numbers throughout.
    General,
}

/// [`salcs_with_presets`] on a chosen arithmetic.
pub fn salcs_on(
    b: &Basis,
    presets: &[Preset],
    only: Option<usize>,
    arithmetic: Arithmetic,
) -> Result<SalcSet, SalcError> {
    let irreps = real_irreps(&b.group)?;
    let mult = real_multiplicities(b, &irreps)?;
    let inv = inverses(b);
    let reps: Vec<usize> = b.site_orbits().iter().map(|o| o[0]).collect();
    let clock = Ceiling::new();
    // the storage field Q(ζₙ) of the basis images and presets; per irrep, with its matrices
    let base_field = (arithmetic != Arithmetic::General)
        .then_some(())
        .and_then(|()| {
            common_field(
                b.images
                    .numbers()
                    .iter()
                    .chain(presets.iter().flat_map(|s| s.vector.iter())),
            )
        });
    let mut fast_bases: HashMap<FieldSpec, Option<FastBasis>> = HashMap::new();
    let mut fast_presets: HashMap<FieldSpec, Option<Vec<KVec>>> = HashMap::new();
    // First, per irrep, the smallest field holding the basis images, the irrep's matrices and
    // the presets (a real subfield where they are all real: Q(√3, √5) instead of Q(ζ₆₀)) …
    struct Plan {
        x: usize,
        spec: Option<(FieldSpec, Arc<FastIrrep>)>,
    }
    // (the partner recipes, built once per process, first side by side)
    irreps
        .par_iter()
        .enumerate()
        .filter(|(x, _)| mult[*x] > 0)
        .for_each(|(_, ir)| {
            PartnerRecipe::of(&b.group, ir);
        });
    let mut plans: Vec<Plan> = Vec::new();
    for (x, ir) in irreps.iter().enumerate() {
        if mult[x] == 0 || only.is_some_and(|o| o != x) {
            continue;
        }
        let recipe = PartnerRecipe::of(&b.group, ir);
        let home = base_field
            .and_then(|nb| field_lcm(nb, common_field(ir.mats.iter().flatten().flatten())?));
        let mut spec = None;
        for candidate in home.map(field_candidates).unwrap_or_default() {
            let fb = fast_bases
                .entry(candidate.clone())
                .or_insert_with(|| FastBasis::new(&b.images, &candidate));
            let Some(fb) = fb.as_ref() else { continue };
            let Some(fi) = FastIrrep::cached(&b.group, ir, &recipe.minv, &candidate) else {
                continue;
            };
            let pre = fast_presets.entry(candidate.clone()).or_insert_with(|| {
                presets
                    .iter()
                    .map(|p| KVec::from_cyclos(&fb.f, &p.vector))
                    .collect()
            });
            if pre.is_some() {
                spec = Some((candidate, fi));
                break;
            }
        }
        plans.push(Plan { x, spec });
    }
    // … then the irreps side by side (they share nothing but read-only tables and caches).
    let one = |plan: &Plan| -> Result<(Vec<Salc>, Arithmetic), SalcError> {
        let x = plan.x;
        let ir = &irreps[x];
        let recipe = PartnerRecipe::of(&b.group, ir);
        let job = Job {
            b,
            ir,
            x,
            n: mult[x] as usize,
            inv: &inv,
            reps: &reps,
            presets,
            clock: &clock,
        };
        let mut quick = None;
        let mut ran = Arithmetic::Fastest;
        if let Some((spec, fi)) = &plan.spec {
            if arithmetic == Arithmetic::Fastest {
                let fb = fast_bases[spec].as_ref().expect("planned field");
                let pre = fast_presets[spec].as_ref().expect("planned field");
                quick = fast_tuples(&job, fb, fi, pre, &recipe)?;
            }
            if quick.is_none() {
                // 128 bits overflowed: the same steps on big integers over the same field
                // (unless the ceiling has passed meanwhile)
                clock.check(&ir.label)?;
                let fb = FastBasis::<BigInt>::new(&b.images, spec);
                let fi = fb
                    .as_ref()
                    .and_then(|fb| FastIrrep::<BigInt>::new(&fb.f, ir, &recipe.minv));
                let pre: Option<Vec<KVec<BigInt>>> = fb.as_ref().and_then(|fb| {
                    presets
                        .iter()
                        .map(|p| KVec::from_cyclos(&fb.f, &p.vector))
                        .collect()
                });
                if let (Some(fb), Some(fi), Some(pre)) = (fb, fi, pre) {
                    quick = fast_tuples(&job, &fb, &fi, &pre, &recipe)?;
                    ran = Arithmetic::BigIntegers;
                }
            }
        }
        if quick.is_none() {
            ran = Arithmetic::General;
        }
        let tuples = match quick {
            Some(t) => t,
            None => {
                let firsts = partner_ones(&job)?;
                let mut t = Vec::with_capacity(firsts.len());
                for (s1, role) in firsts {
                    clock.check(&ir.label)?;
                    let tuple = recipe.partners(b, s1);
                    let sign = tuple_sign(&tuple);
                    let shown: Shown = tuple.into_iter().map(|v| shown(v, sign, None)).collect();
                    t.push((shown, role));
                }
                t
            }
        };
        let mut out = Vec::new();
        for (c, (tuple, role)) in tuples.into_iter().enumerate() {
            for (p, (coefficients, norm2)) in tuple.into_iter().enumerate() {
                out.push(Salc {
                    irrep: x,
                    label: ir.label.clone(),
                    copy: c + 1,
                    partner: p + 1,
                    coefficients,
                    norm2,
                    role,
                });
            }
        }
        Ok((out, ran))
    };
    let done: Vec<Result<(Vec<Salc>, Arithmetic), SalcError>> = plans.par_iter().map(one).collect();
    let mut out = Vec::new();
    let mut arith = Vec::new();
    for (plan, r) in plans.iter().zip(done) {
        let (salcs, ran) = r?;
        out.extend(salcs);
        arith.push((plan.x, ran));
    }
    let mut notes = b.notes.clone();
    for (x, ir) in irreps.iter().enumerate() {
        if mult[x] > 0 && ir.dim > 1 {
            notes.push(format!("{}: {}", ir.label, ir.source.describe()));
        }
    }
    Ok(SalcSet {
        group: b.group.clone(),
        irreps: irreps.clone(),
        members: b.members.clone(),
        multiplicities: mult,
        salcs: out,
        notes,
        arithmetic: arith,
    })
}

/// Σ aᵢbᵢ. SALC vectors are real (real irreps acting on real bases), so no conjugation.
fn dot(a: &[Cyclo], b: &[Cyclo]) -> Cyclo {
    let mut acc = Cyclo::zero();
    for (x, y) in a.iter().zip(b) {
        if !x.is_zero() && !y.is_zero() {
            acc += &(x * y);
        }
    }
    acc
}

/// What the SALCs of one irrep are computed from.
struct Job<'a> {
    b: &'a Basis,
    ir: &'a RealIrrep,
    /// Index of each irrep in the group's real irreps.
    x: usize,
    /// Copies wanted.
    n: usize,
    inv: &'a [usize],
    /// One representative site per orbit.
    reps: &'a [usize],
    presets: &'a [Preset],
    clock: &'a Ceiling,
}

impl Job<'_> {
    /// Is this preset still wanted, given the roles of the copies found so far? A preset family
    /// (e.g. Tx, Ty, Tz) holds as many copies of the irrep as it lists it.
    fn wants(&self, preset: &Preset, found: impl Iterator<Item = Role> + Clone) -> bool {
        let allowed = preset.irreps.iter().filter(|&&i| i == self.x).count();
        let have = found.clone().filter(|r| *r == preset.role).count();
        allowed > 0 && found.count() < self.n && have < allowed
    }
}

/// Exactly n orthogonal partner-1 vectors, presets first.
fn partner_ones(job: &Job) -> Result<Vec<(Vec<Cyclo>, Role)>, SalcError> {
    let (b, ir, n, inv, reps, clock) = (job.b, job.ir, job.n, job.inv, job.reps, job.clock);
    let mut found: Vec<(Vec<Cyclo>, Role)> = Vec::new();
    // Everything new vectors must be orthogonal to. For a complex pair (¹E + ²E taken as one
    // real irrep) the commutant is C, not R: P₁₁ is the identity on the whole isotypic part,
    // any vector u there is a first partner, and u must be orthogonal to both partners of the
    // copies already found. Each is kept with 1/(its length²), computed once.
    let mut ortho: Vec<(Vec<Cyclo>, Cyclo)> = Vec::new();
    let inv_len2 = |v: &[Cyclo]| {
        dot(v, v)
            .inv()
            .expect("a nonzero real vector has length² > 0")
    };
    let complex_type = ir.pair.is_some();
    let recipe = PartnerRecipe::of(&b.group, ir);
    let mut offer =
        |v: Vec<Cyclo>, role: Role, found: &mut Vec<(Vec<Cyclo>, Role)>| -> Result<(), SalcError> {
            let mut v = v;
            for (i, (c, nc)) in ortho.iter().enumerate() {
                if i % 16 == 15 || v.len() > LONG {
                    clock.check(&ir.label)?;
                }
                // nc = 1/(c·c)
                let f = &dot(&v, c) * nc;
                if !f.is_zero() {
                    for (vi, ci) in v.iter_mut().zip(c) {
                        if !ci.is_zero() {
                            *vi -= &(&f * ci);
                        }
                    }
                }
            }
            if v.iter().all(Cyclo::is_zero) {
                return Ok(());
            }
            let v = tidy(v);
            if complex_type {
                for p in recipe.partners(b, v.clone()).into_iter().skip(1) {
                    let n = inv_len2(&p);
                    ortho.push((p, n));
                }
            }
            ortho.push((v.clone(), inv_len2(&v)));
            found.push((v, role));
            Ok(())
        };
    for preset in job.presets {
        if !job.wants(preset, found.iter().map(|f| f.1)) {
            continue;
        }
        let v = transfer(b, ir, inv, 0, 0, &preset.vector);
        offer(v, preset.role, &mut found)?;
    }
    'outer: for &site in reps {
        for m in b.members_of(site) {
            for v in partner_one_images(b, ir, inv, m) {
                if found.len() == n {
                    break 'outer;
                }
                clock.check(&ir.label)?;
                offer(v, Role::Plain, &mut found)?;
            }
        }
    }
    if found.len() != n {
        return Err(SalcError::Count {
            irrep: ir.label.clone(),
            found: found.len(),
            expected: n,
        });
    }
    Ok(found)
}

/// The partner tuples of an irrep, in their shown form, with their role.
type Tuples = Vec<(Shown, Role)>;

/// One SALC's partners in their shown form, each with its length².
type Shown = Vec<(Vec<Cyclo>, Cyclo)>;

/// Vector length (entries; integers in the fast engine) from which the ceiling is looked at
/// before every Gram–Schmidt step.
const LONG: usize = 4096;

/// Partner tuples of one irrep on the integer-form engine: the same steps as [`partner_ones`]
/// and [`PartnerRecipe::partners`], so the same vectors up to positive rational factors (which
/// `shown` removes). `Ok(None)` when a number outgrew the integers `I` (i128).
fn fast_tuples<I: KInt>(
    job: &Job,
    fb: &FastBasis<I>,
    fi: &FastIrrep<I>,
    presets: &[KVec<I>],
    recipe: &PartnerRecipe,
) -> Result<Option<Tuples>, SalcError> {
    let (b, ir, n, inv, reps, clock) = (job.b, job.ir, job.n, job.inv, job.reps, job.clock);
    let f = &fb.f;
    let complex_type = ir.pair.is_some();
    // each vector new ones must be orthogonal to, with 1/(its length²) as a field number
    type Scalar<I> = (Vec<I>, I);
    let mut found: Vec<(KVec<I>, Role)> = Vec::new();
    let mut ortho: Vec<(KVec<I>, Scalar<I>)> = Vec::new();
    let inv_len2 = |v: &KVec<I>| -> Option<Scalar<I>> {
        let (nn, dd) = v.dot_in(v, f)?;
        f.inverse(&nn, &dd)
    };
    // a new vector (and, for a complex pair, its partners) joins those to be orthogonal to
    let keep = |v: KVec<I>,
                role: Role,
                found: &mut Vec<(KVec<I>, Role)>,
                ortho: &mut Vec<(KVec<I>, Scalar<I>)>|
     -> Option<()> {
        if complex_type {
            for p in super::fast::partners(fb, &recipe.ops, fi, &v)?
                .into_iter()
                .skip(1)
            {
                let n = inv_len2(&p)?;
                ortho.push((p, n));
            }
        }
        let n = inv_len2(&v)?;
        ortho.push((v.clone(), n));
        found.push((v, role));
        Some(())
    };
    // v − (v·c)/(c·c)·c; None = overflow
    let project_out = |v: &mut KVec<I>, c: &KVec<I>, nn: &[I], nd: &I| -> Option<()> {
        let (dn, dd) = v.dot_in(c, f)?;
        if dn.iter().all(I::is_zero) {
            return Some(());
        }
        let (sn, sd) = f.mul(&dn, &dd, nn, nd)?;
        v.sub_scaled_in(&sn, &sd, c, f)
    };
    // Ok(Some(())) = done (kept or rejected); Ok(None) = overflow; Err = a ceiling (looked at
    // every 16 vectors, every vector for long ones: one offer can take seconds)
    let offer = |mut v: KVec<I>,
                 role: Role,
                 found: &mut Vec<(KVec<I>, Role)>,
                 ortho: &mut Vec<(KVec<I>, Scalar<I>)>|
     -> Result<Option<()>, SalcError> {
        for (i, (c, (nn, nd))) in ortho.iter().enumerate() {
            if i % 16 == 15 || v.num.len() > LONG {
                clock.check(&ir.label)?;
            }
            if project_out(&mut v, c, nn, nd).is_none() {
                return Ok(None);
            }
        }
        if v.is_zero() {
            return Ok(Some(()));
        }
        Ok(keep(v, role, found, ortho))
    };

    for (preset, pv) in job.presets.iter().zip(presets) {
        if !job.wants(preset, found.iter().map(|f| f.1)) {
            continue;
        }
        let Some(v) = fi.transfer_11(fb, inv, pv) else {
            return Ok(None);
        };
        if offer(v, preset.role, &mut found, &mut ortho)?.is_none() {
            return Ok(None);
        }
    }
    'outer: for &site in reps {
        for m in b.members_of(site) {
            let Some(images) = fi.partner_one_images(fb, inv, m) else {
                return Ok(None);
            };
            for v in images {
                if found.len() == n {
                    break 'outer;
                }
                clock.check(&ir.label)?;
                if offer(v, Role::Plain, &mut found, &mut ortho)?.is_none() {
                    return Ok(None);
                }
            }
        }
    }
    if found.len() != n {
        return Err(SalcError::Count {
            irrep: ir.label.clone(),
            found: found.len(),
            expected: n,
        });
    }
    // the copies' partners are independent of one another: side by side
    type Done = Result<Option<Shown>, SalcError>;
    let tuples: Vec<Done> = found
        .par_iter()
        .map(|(s1, _)| {
            clock.check(&ir.label)?;
            let Some(tuple) = super::fast::partners(fb, &recipe.ops, fi, s1) else {
                return Ok(None);
            };
            // the sign that makes the first partner start positive (as `tuple_sign`)
            let sign = tuple
                .first()
                .and_then(|v| {
                    v.num
                        .chunks(f.phi())
                        .find(|c| c.iter().any(|t| !t.is_zero()))
                })
                .map_or(1, |c| {
                    if f.cyclo_of(c, &I::from_i128(1)).signum_real() < 0 {
                        -1
                    } else {
                        1
                    }
                });
            // the partners' lengths² come cheaply here, in the field
            let mut shown_tuple = Vec::with_capacity(tuple.len());
            for v in &tuple {
                let Some((nn, nd)) = v.dot_in(v, f) else {
                    return Ok(None);
                };
                match shown_in_field(v, f, sign, (&nn, &nd)) {
                    Some(done) => shown_tuple.push(done),
                    None => {
                        shown_tuple.push(shown(v.to_cyclos(f), sign, Some(f.cyclo_of(&nn, &nd))))
                    }
                }
            }
            Ok(Some(shown_tuple))
        })
        .collect();
    let mut out = Vec::with_capacity(found.len());
    for ((_, role), t) in found.iter().zip(tuples) {
        let Some(shown) = t? else {
            return Ok(None);
        };
        out.push((shown, *role));
    }
    Ok(Some(out))
}

/// [`shown`] of sign·v for a vector of the field `f`, worked on its integer numerators in the
/// power basis of the storage field Q(ζₙ): there the exact numbers' coefficients are those
/// numerators over v's denominator, so the primitive factor is den/g (g their gcd) and the shown
/// coefficients are ±numerators/g, with no rational arithmetic per coefficient. Same result as
/// [`shown`]; `None` where that must decide (storage n ≡ 2 mod 4 is renormalized; overflow).
fn shown_in_field<I: KInt>(
    v: &KVec<I>,
    f: &KField,
    sign: i64,
    len2: (&[I], &I),
) -> Option<(Vec<Cyclo>, Cyclo)> {
    if f.home_order() % 4 == 2 {
        return None;
    }
    let (k, hk) = (f.phi(), f.home_degree());
    let len = v.num.len() / k;
    let nonzero = |c: &[I]| c.iter().any(|t| !t.is_zero());
    let Some(yf) = v.num.chunks(k).find(|c| nonzero(c)) else {
        return Some((vec![Cyclo::zero(); len], Cyclo::zero()));
    };
    let piv = yf.iter().position(|t| !t.is_zero())?;
    // all entries rational multiples of the first nonzero one: yᵢ·y_f[p] = y_f·yᵢ[p] (on the
    // field's own coordinates: proportional there exactly when proportional in Q(ζₙ))
    let mut proportional = true;
    'scan: for c in v.num.chunks(k) {
        for (a, b) in c.iter().zip(yf) {
            if a.mul(&yf[piv])? != b.mul(&c[piv])? {
                proportional = false;
                break 'scan;
            }
        }
    }
    let int_cyclo = |t: &I| -> Cyclo {
        match t.to_i64() {
            Some(small) => Cyclo::from_int(small),
            None => Cyclo::from_rational(BigRational::from_integer(t.to_big())),
        }
    };
    if proportional {
        // a primitive integer vector along sign·v (the same from either coordinates: the
        // ratios are the same rationals)
        let negative = (f.cyclo_of(yf, &v.den).signum_real() < 0) != (sign < 0);
        let flip = yf[piv].is_negative() != negative;
        let g = gcd_of(v.num.chunks(k).map(|c| &c[piv]));
        let mut n2 = I::zero();
        let mut w = Vec::with_capacity(len);
        for c in v.num.chunks(k) {
            let t = c[piv].div_exact(&g);
            let t = if flip { I::zero().sub(&t)? } else { t };
            n2 = n2.add(&t.mul(&t)?)?;
            w.push(int_cyclo(&t));
        }
        return Some((w, int_cyclo(&n2)));
    }
    let mut x = vec![I::zero(); len * hk];
    for (src, dst) in v.num.chunks(k).zip(x.chunks_mut(hk)) {
        if nonzero(src) {
            f.home_nums(src, dst)?;
        }
    }
    let g = gcd_of(x.iter());
    let one = I::from_i128(1);
    let mut w = Vec::with_capacity(len);
    let mut buf = vec![I::zero(); hk];
    for c in x.chunks(hk) {
        if !nonzero(c) {
            w.push(Cyclo::zero());
            continue;
        }
        for (b, t) in buf.iter_mut().zip(c) {
            let q = t.div_exact(&g);
            *b = if sign < 0 { I::zero().sub(&q)? } else { q };
        }
        w.push(f.home_cyclo(&buf, &one));
    }
    // lengths² scale by r² with r = den/g
    let r = BigRational::new(v.den.to_big(), g.to_big());
    let n2 = f.cyclo_of(len2.0, len2.1).scale(&(&r * &r));
    Some((w, n2))
}

/// d operations whose first matrix columns are independent, and the inverse of that d×d
/// matrix: sᵢ = Σ_k Minv[i][k]·R_k·s₁.
struct PartnerRecipe {
    ops: Vec<usize>,
    minv: Matrix,
}

impl PartnerRecipe {
    /// The recipe of an irrep, built once per process.
    fn of(g: &PointGroup, ir: &RealIrrep) -> Arc<PartnerRecipe> {
        type Cache = Mutex<HashMap<(String, usize), Arc<PartnerRecipe>>>;
        static C: OnceLock<Cache> = OnceLock::new();
        let c = C.get_or_init(|| Mutex::new(HashMap::new()));
        let key = (g.name().to_string(), ir.row);
        if let Some(r) = c.lock().expect("recipe cache").get(&key) {
            return r.clone();
        }
        let r = Arc::new(PartnerRecipe::new(ir));
        c.lock().expect("recipe cache").insert(key, r.clone());
        r
    }

    fn new(ir: &RealIrrep) -> Self {
        // d operations with independent first columns, picked on floats (Gram–Schmidt: a
        // column keeps a part above 10⁻⁶ of its length; the entries are O(1), so such columns
        // are independent exactly too); the exact inverse below checks it, and where it does
        // not hold the operations are picked on exact numbers instead.
        let on_floats =
            Self::pick_float(ir).and_then(|ops| Self::inverse_of(ir, &ops).map(|minv| (ops, minv)));
        let (ops, minv) = on_floats.unwrap_or_else(|| {
            let ops = Self::pick_exact(ir);
            let minv = Self::inverse_of(ir, &ops).expect("chosen columns are independent");
            (ops, minv)
        });
        PartnerRecipe { ops, minv }
    }

    /// The first d operations that `keep` accepts (it sees each operation in turn, in order,
    /// until d are kept).
    fn pick(ir: &RealIrrep, mut keep: impl FnMut(usize) -> bool) -> Vec<usize> {
        let mut ops = Vec::new();
        for o in 0..ir.mats.len() {
            if ops.len() == ir.dim {
                break;
            }
            if keep(o) {
                ops.push(o);
            }
        }
        ops
    }

    fn pick_float(ir: &RealIrrep) -> Option<Vec<usize>> {
        let d = ir.dim;
        let mut basis: Vec<Vec<f64>> = Vec::new();
        let ops = Self::pick(ir, |o| {
            let col: Vec<f64> = (0..d).map(|i| ir.mats[o][i][0].re_f64()).collect();
            let len = col.iter().map(|x| x * x).sum::<f64>().sqrt();
            let mut rest = col;
            for b in &basis {
                let t: f64 = rest.iter().zip(b).map(|(x, y)| x * y).sum();
                rest.iter_mut().zip(b).for_each(|(x, y)| *x -= t * y);
            }
            let left = rest.iter().map(|x| x * x).sum::<f64>().sqrt();
            let kept = len > 0.0 && left > 1e-6 * len;
            if kept {
                rest.iter_mut().for_each(|x| *x /= left);
                basis.push(rest);
            }
            kept
        });
        (ops.len() == d).then_some(ops)
    }

    fn pick_exact(ir: &RealIrrep) -> Vec<usize> {
        let d = ir.dim;
        let mut cols: Vec<Vec<Cyclo>> = Vec::new();
        Self::pick(ir, |o| {
            let col: Vec<Cyclo> = (0..d).map(|i| ir.mats[o][i][0].clone()).collect();
            let dependent = !cols.is_empty() && solve_field(&cols, &col).is_some();
            let kept = !dependent && col.iter().any(|c| !c.is_zero());
            if kept {
                cols.push(col);
            }
            kept
        })
    }

    /// M⁻¹ for the chosen operations; `None` when their first columns are dependent.
    fn inverse_of(ir: &RealIrrep, ops: &[usize]) -> Option<Matrix> {
        let d = ir.dim;
        if ops.len() != d {
            return None;
        }
        let cols: Vec<Vec<Cyclo>> = ops
            .iter()
            .map(|&o| (0..d).map(|i| ir.mats[o][i][0].clone()).collect())
            .collect();
        // M[k][i] = D(R_k)ᵢ₁ and R_k·s₁ = Σᵢ M[k][i]·sᵢ, so sᵢ = Σ_k (M⁻¹)[i][k]·R_k·s₁.
        // Column j of M⁻¹ solves M·y = e_j.
        let m_cols: Vec<Vec<Cyclo>> = (0..d)
            .map(|i| (0..d).map(|k| cols[k][i].clone()).collect())
            .collect();
        let inv_cols: Vec<Vec<Cyclo>> = (0..d)
            .map(|j| {
                let e: Vec<Cyclo> = (0..d).map(|k| Cyclo::from_int((k == j) as i64)).collect();
                solve_field(&m_cols, &e)
            })
            .collect::<Option<_>>()?;
        Some(
            (0..d)
                .map(|i| (0..d).map(|k| inv_cols[k][i].clone()).collect())
                .collect(),
        )
    }

    fn partners(&self, b: &Basis, s1: Vec<Cyclo>) -> Vec<Vec<Cyclo>> {
        let d = self.ops.len();
        if d == 1 {
            return vec![s1];
        }
        let images: Vec<Vec<Cyclo>> = self.ops.iter().map(|&o| b.apply(o, &s1)).collect();
        let mut out = Vec::with_capacity(d);
        for i in 0..d {
            let mut v = vec![Cyclo::zero(); s1.len()];
            for (k, img) in images.iter().enumerate() {
                let f = &self.minv[i][k];
                if f.is_zero() {
                    continue;
                }
                for (vi, x) in v.iter_mut().zip(img) {
                    if !x.is_zero() {
                        *vi += &(f * x);
                    }
                }
            }
            out.push(v);
        }
        out
    }
}

fn scale_rational(v: Vec<Cyclo>, r: &BigRational) -> Vec<Cyclo> {
    v.into_iter().map(|c| c.scale(r)).collect()
}

/// Clear common denominators and content by a positive rational factor.
fn tidy(v: Vec<Cyclo>) -> Vec<Cyclo> {
    match Cyclo::primitive_factor(&v) {
        Some(r) if !r.is_one() => scale_rational(v, &r),
        _ => v,
    }
}

/// The sign that makes a partner tuple's first partner start with a positive coefficient: the
/// whole tuple is multiplied by it (keeps R·sⱼ = Σ sᵢ Dᵢⱼ).
fn tuple_sign(t: &[Vec<Cyclo>]) -> i64 {
    let first = t.first().and_then(|v| v.iter().find(|c| !c.is_zero()));
    if first.is_some_and(|c| c.signum_real() < 0) {
        -1
    } else {
        1
    }
}

/// The shortest form of one SALC to print: when all coefficients are rational multiples of one
/// another, a primitive integer vector with the same direction and sign; else the vector cleared
/// of common denominators and content by a positive rational factor.
pub fn display_form(v: Vec<Cyclo>) -> (Vec<Cyclo>, Cyclo) {
    shown(v, 1, None)
}

/// [`display_form`] of sign·v, given v's length² when already known (scaling by the rational
/// factor r multiplies it by r²).
fn shown(v: Vec<Cyclo>, sign: i64, norm2: Option<Cyclo>) -> (Vec<Cyclo>, Cyclo) {
    let Some(f) = v.iter().find(|c| !c.is_zero()) else {
        return (v, Cyclo::zero());
    };
    let ratios: Option<Vec<Cyclo>> = v
        .iter()
        .map(|c| c.rational_ratio(f).map(Cyclo::from_rational))
        .collect();
    if let Some(ratios) = ratios {
        let negative = (f.signum_real() < 0) != (sign < 0);
        let w = tidy(ratios);
        let w: Vec<Cyclo> = if negative {
            w.into_iter().map(|c| -c).collect()
        } else {
            w
        };
        let n2 = super::fast::self_dot(&w).unwrap_or_else(|| dot(&w, &w));
        return (w, n2);
    }
    let mut r = Cyclo::primitive_factor(&v).unwrap_or_else(BigRational::one);
    if sign < 0 {
        r = -r;
    }
    let n2 = match norm2 {
        Some(n) => n.scale(&(&r * &r)),
        None => {
            let w = scale_rational(v.clone(), &r);
            super::fast::self_dot(&w).unwrap_or_else(|| dot(&w, &w))
        }
    };
    let w = if r.is_one() { v } else { scale_rational(v, &r) };
    (w, n2)
}

#[cfg(test)]
mod tests {
    use super::{shown, shown_in_field};
    use crate::exact::{field_candidates, KField, KVec};
    use num_bigint::BigInt;
    use proptest::prelude::*;

    /// Every field the engine may pick: each candidate of these storage fields (Q(ζₙ), its
    /// real subfield, the real root fields), n ≡ 2 (mod 4) excluded as storage.
    fn specs() -> Vec<crate::exact::FieldSpec> {
        [1u32, 3, 4, 5, 7, 8, 9, 12, 15, 16, 20, 24, 60]
            .iter()
            .flat_map(|&n| field_candidates(n))
            .collect()
    }

    proptest! {
        /// The shown form worked on integer numerators equals the one worked on exact numbers
        /// (coefficients stored identically, same length²), for random vectors of every field,
        /// both signs, and vectors whose entries are rational multiples of one another (the
        /// primitive-integer branch). Reference: the crate's Cyclo path (differential testing,
        /// common practice).
        #[test]
        fn shown_on_integers_matches_exact_numbers(
            pick in 0usize..1000,
            raw in proptest::collection::vec(proptest::collection::vec(-40i64..=40, 16), 1..7),
            den in 1i64..=36,
            ratios in proptest::collection::vec(-6i64..=6, 7),
            proportional in any::<bool>(),
            negative in any::<bool>(),
        ) {
            let all = specs();
            let spec = &all[pick % all.len()];
            let f = KField::of(spec).expect("small fields are built");
            let k = f.phi();
            let mut num = Vec::new();
            for (i, entry) in raw.iter().enumerate() {
                for j in 0..k {
                    let x = if proportional { raw[0][j] * ratios[i] } else { entry[j] };
                    num.push(x as i128);
                }
            }
            let v = KVec { num, den: den as i128 };
            let sign = if negative { -1 } else { 1 };
            let (nn, nd) = v.dot_in(&v, &f).expect("small");
            let fast = shown_in_field(&v, &f, sign, (&nn, &nd));
            let big = KVec { num: v.num.iter().map(|&x| BigInt::from(x)).collect(), den: BigInt::from(v.den) };
            let (bn, bd) = big.dot_in(&big, &f).expect("big integers do not overflow");
            let fast_big = shown_in_field(&big, &f, sign, (&bn, &bd));
            let general = shown(v.to_cyclos(&f), sign, Some(f.cyclo_of(&nn, &nd)));
            for got in [fast, fast_big] {
                let (w, n2) = got.expect("storage fields here are not 2 mod 4; small numbers");
                prop_assert_eq!(w.len(), general.0.len());
                for (a, b) in w.iter().zip(&general.0) {
                    prop_assert!(a.same_form(b), "{} vs {}", a, b);
                }
                prop_assert!(n2 == general.1);
            }
        }
    }

    /// The partner recipe's operations picked on floats are those picked on exact numbers
    /// (the first d operations whose first matrix columns are independent), for every irrep of
    /// dimension > 1 of every finite group in the tables, and their exact inverse exists.
    // Reference: the crate's exact linear solve (differential testing, common practice).
    #[test]
    fn recipe_operations_picked_on_floats_match_exact() {
        let mut compared = 0;
        for name in crate::group::names() {
            let g = crate::group::load(name).unwrap();
            if g.is_linear() {
                continue;
            }
            for ir in crate::salc::real_irreps(&g).unwrap().iter() {
                let exact = super::PartnerRecipe::pick_exact(ir);
                assert_eq!(exact.len(), ir.dim, "{name} {}", ir.label);
                let float = super::PartnerRecipe::pick_float(ir);
                assert_eq!(float.as_ref(), Some(&exact), "{name} {}", ir.label);
                assert!(super::PartnerRecipe::inverse_of(ir, &exact).is_some());
                compared += 1;
            }
        }
        assert!(compared > 300, "{compared} irreps compared");
    }

    /// The memory watch reads this process's resident size (Linux /proc/self/statm, field 2 =
    /// resident pages, proc(5)): while 64 MB are held and written, it reports at least that.
    #[test]
    fn resident_memory_is_read() {
        if !std::path::Path::new("/proc/self/statm").exists() {
            return; // not Linux: only the time ceiling applies
        }
        let block = vec![1u8; 64 << 20];
        let mb = super::resident_mb().expect("statm is readable");
        assert!(std::hint::black_box(&block)
            .iter()
            .step_by(4096)
            .all(|&b| b == 1));
        assert!((64..1_000_000).contains(&mb), "{mb} MB");
    }
}
