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
            geometry: LayerStatus::Missing(
                "the geometry layer (XYZ files, point-group detection with near misses, \
                 symmetrizing) is in this build but not yet wired into sessions: use \
                 `salcdesk detect FILE.xyz` and `salcdesk analyze FILE.xyz` meanwhile",
            ),
            salc: LayerStatus::Missing(
                "the SALC layer is in this build but not yet wired into sessions, whose members \
                 carry ticks rather than positions: use `salcdesk salc` on an XYZ file or a \
                 group with sites meanwhile",
            ),
            spectra: LayerStatus::Present,
        }
    }
}
