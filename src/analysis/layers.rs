//! Which layers of the pipeline sessions use so far. Panels backed by a missing layer say so in
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
            geometry: LayerStatus::Present,
            salc: LayerStatus::Present,
            spectra: LayerStatus::Present,
        }
    }
}
