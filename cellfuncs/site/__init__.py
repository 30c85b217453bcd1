"""Site conditions and an engine's declared tables: standard-atmosphere pressure, table interpolation."""
