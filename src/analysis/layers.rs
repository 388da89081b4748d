//! Which layers of the pipeline this build has. Panels backed by a missing layer say so in
//! plain words instead of showing anything made up.

/// Whether a layer is in this build.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum LayerStatus {
    Present,
    /// Not in this build yet; the text says what will come with it.
    Missing(&'static str),
}

/// The layers after reduction.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Layers {
    pub geometry: LayerStatus,
    pub salc: LayerStatus,
    pub spectra: LayerStatus,
}

impl Layers {
    pub fn of_this_build() -> Self {
        Layers {
            geometry: LayerStatus::Missing(
                "reading XYZ files, bonds, point-group detection with near misses, standard \
                 orientation and the site builder come with the geometry layer, which is not \
                 in this build yet",
            ),
            salc: LayerStatus::Missing(
                "symmetry-adapted linear combinations (projection, normalization, degenerate \
                 partners) come with the SALC layer, which is not in this build yet",
            ),
            spectra: LayerStatus::Missing(
                "IR/Raman activity, polarization, band counts, overtones and combinations, the \
                 band-list check and descent in symmetry come with the spectra layer, which is \
                 not in this build yet",
            ),
        }
    }
}
