"""Null distributions: published critical values and p-values, simulation, power."""
