"""heat_transfer subpackage."""
