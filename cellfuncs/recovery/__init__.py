"""recovery subpackage."""
