"""Fluid properties computed from published formulations with plain ``math``.

:mod:`cellfuncs.props.if97` holds the IAPWS-IF97 water and steam equations
(regions 1, 2 and 4) used by the hot-water and steam functions.
"""
