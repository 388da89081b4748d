//! The one place `vib` touches files: a QCSchema JSON result, or an XYZ geometry with a
//! plain-text Hessian beside it (the faces and the session analysis call this).

use super::constants::HessianUnits;
use super::error::VibError;
use super::input::{looks_like_json, read_qcschema, read_text_hessian, HessianInput};
use crate::geom::{read_xyz, XyzOptions};
use std::path::Path;

/// Largest file read (a 3,000-atom Hessian in text is ~2 GB; refuse well before).
pub const MAX_FILE_BYTES: u64 = 512 * 1024 * 1024;

fn read(path: &Path) -> Result<String, VibError> {
    let name = path.display().to_string();
    let meta = std::fs::metadata(path).map_err(|e| VibError::read(&name, e.to_string()))?;
    if meta.len() > MAX_FILE_BYTES {
        return Err(VibError::read(
            &name,
            format!(
                "{} bytes: larger than the {MAX_FILE_BYTES} read",
                meta.len()
            ),
        ));
    }
    let bytes = std::fs::read(path).map_err(|e| VibError::read(&name, e.to_string()))?;
    String::from_utf8(bytes).map_err(|e| {
        VibError::read(
            &name,
            format!("not UTF-8 text (byte {})", e.utf8_error().valid_up_to()),
        )
    })
}

/// Read `main` (QCSchema JSON, or XYZ when `hessian` is given) and the Hessian.
pub fn load(
    main: &Path,
    hessian: Option<&Path>,
    units: Option<HessianUnits>,
) -> Result<HessianInput, VibError> {
    let name = main.display().to_string();
    let text = read(main)?;
    match hessian {
        None if looks_like_json(&text) => read_qcschema(&name, &text),
        None => Err(VibError::read(
            &name,
            "not a QCSchema JSON result; for an XYZ geometry give its Hessian with --hessian FILE",
        )),
        Some(h) => {
            if looks_like_json(&text) {
                return Err(VibError::read(
                    &name,
                    "a QCSchema result carries its own Hessian; drop --hessian",
                ));
            }
            let mol = read_xyz(text.as_bytes(), &XyzOptions::default())
                .map_err(|e| VibError::read(&name, e.to_string()))?;
            let hname = h.display().to_string();
            let htext = read(h)?;
            read_text_hessian(&hname, &htext, &mol, units)
        }
    }
}
