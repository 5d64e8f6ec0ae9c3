"""Regressions: the ADF design, OLS, lag choice and the nested QR of every lag order."""
