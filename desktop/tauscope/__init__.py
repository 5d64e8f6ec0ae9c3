"""Tauscope: unit-root testing and order of integration for applied economists."""

__version__ = "0.1.0"
