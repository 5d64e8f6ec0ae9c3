"""Seasonal unit roots: HEGY (Hylleberg, Engle, Granger & Yoo 1990) for quarterly series and
Beaulieu & Miron (1993) for monthly ones, with critical values simulated at the series' length."""
