"""Input (TOML -> validated model objects) and output (JSON, CSV, text, files)."""
