"""The window's jobs, one controller each: files (workbooks in), runs (the analysis),
studies (save, open, recover, autosave) and export (findings out).  Each holds the
panels, the session and the prompts it needs, so it can be tested without the window."""
