//! A fast hasher for program-internal keys (memo tables keyed by exact numbers, bond and angle
//! sets keyed by atom numbers): the multiply–rotate scheme popularised by Firefox's FxHash and
//! used by the Rust compiler's own maps (common practice). The keys are values salcdesk
//! computed, not text an adversary chooses, so SipHash's protection against collision flooding
//! is not needed, and its cost showed up in profiles of large bases.

use std::collections::{HashMap, HashSet};
use std::hash::{BuildHasherDefault, Hasher};

const K: u64 = 0x51_7c_c1_b7_27_22_0a_95;

#[derive(Default, Clone, Copy)]
pub struct QuickHasher(u64);

impl QuickHasher {
    #[inline]
    fn add(&mut self, w: u64) {
        self.0 = (self.0.rotate_left(5) ^ w).wrapping_mul(K);
    }
}

impl Hasher for QuickHasher {
    #[inline]
    fn write(&mut self, bytes: &[u8]) {
        for chunk in bytes.chunks(8) {
            let mut b = [0u8; 8];
            b[..chunk.len()].copy_from_slice(chunk);
            self.add(u64::from_le_bytes(b));
        }
    }
    #[inline]
    fn write_u8(&mut self, i: u8) {
        self.add(i as u64);
    }
    #[inline]
    fn write_u32(&mut self, i: u32) {
        self.add(i as u64);
    }
    #[inline]
    fn write_u64(&mut self, i: u64) {
        self.add(i);
    }
    #[inline]
    fn write_i64(&mut self, i: i64) {
        self.add(i as u64);
    }
    #[inline]
    fn write_usize(&mut self, i: usize) {
        self.add(i as u64);
    }
    #[inline]
    fn finish(&self) -> u64 {
        self.0
    }
}

/// A hash map with [`QuickHasher`].
pub type QuickMap<K, V> = HashMap<K, V, BuildHasherDefault<QuickHasher>>;
/// A hash set with [`QuickHasher`].
pub type QuickSet<K> = HashSet<K, BuildHasherDefault<QuickHasher>>;
