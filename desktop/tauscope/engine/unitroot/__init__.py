"""The unit-root and stationarity tests, one module each: ADF, Φ, KPSS, Phillips-Perron,
DF-GLS, Zivot-Andrews, recursive τ."""
