"""chargeair subpackage."""
