//! Placeholder; the owning change fills this module.
