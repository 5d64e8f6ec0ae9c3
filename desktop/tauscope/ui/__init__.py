"""Everything Qt: the main window, its panels, the analysis worker and dialogs."""
