"""Emissions of a gas engine: unit conversions of emission values, dry exhaust volume, acid dew point."""
