"""gas subpackage."""
