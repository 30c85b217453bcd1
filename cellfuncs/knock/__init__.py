"""knock subpackage."""
