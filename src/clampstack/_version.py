"""The version of clampstack (one place; imported by every layer that prints it)."""

__version__ = "0.1.0"

#: version of the JSON documents (``schema_version``): raised when a key changes meaning
#: or goes away; new keys may appear within a version
SCHEMA_VERSION = 1
