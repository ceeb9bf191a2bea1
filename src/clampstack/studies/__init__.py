"""Studies over many states: temperature sweeps (and, later, scatter and sizing)."""
