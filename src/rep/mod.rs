//! rep
