"""The analysis as a path from data to verdict: its stages, analyse_series and analyse_many."""
