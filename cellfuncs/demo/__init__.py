"""demo subpackage."""
