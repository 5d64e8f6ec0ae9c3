"""The reading: verdicts, notes and plain-language sentences from the numbers."""
