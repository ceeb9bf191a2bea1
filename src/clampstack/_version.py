"""The version of clampstack (one place; imported by every layer that prints it)."""

__version__ = "0.1.0"
