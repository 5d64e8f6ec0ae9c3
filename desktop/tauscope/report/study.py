"""Study files (``.tauscope``): what was analysed and how, so it re-runs to the same numbers.

A study is JSON with ``"format": "tauscope-study"`` and an integer
``"version"``.  It lists the workbooks (absolute path, path relative to the
study file, SHA-256 of the bytes, sheets used), the selected series (by
``SeriesData.key`` plus their source and transformation chain and how gaps were
handled), the settings, and the findings (``SeriesResult.to_dict()``).

Saving writes a temporary file and renames it over the target, so a crash
never leaves half a study; loading only reads, and a damaged file gives a
:class:`StudyError` naming the file and what is wrong.  An autosave lives next
to the study as ``NAME.tauscope.autosave``.
"""

from __future__ import annotations

import datetime as dt
import json
import os
from collections.abc import Iterable
from dataclasses import dataclass, field, replace
from pathlib import Path
from typing import Any, Protocol

from tauscope import __version__
from tauscope.data import file_sha256
from tauscope.engine import SeriesResult, Settings
from tauscope.report import study_check as check
from tauscope.report.atomic import write_text_atomic
from tauscope.report.json_export import json_clean
from tauscope.report.run import RunRecord, SourceLike
from tauscope.report.study_text import compact_dumps as _dumps
from tauscope.report.study_text import ends_before_complete

STUDY_FORMAT = "tauscope-study"
STUDY_VERSION = 1
STUDY_SUFFIX = ".tauscope"
AUTOSAVE_SUFFIX = ".autosave"
UNTITLED = "untitled"
GAP_CHOICES = ("none", "longest", "interpolate")


class StudyError(Exception):
    """A study file could not be read or written; the message names the file and the problem."""


@dataclass(frozen=True)
class StudyWorkbook:
    path: str
    sha256: str
    sheets: tuple[str, ...] = ()
    relative: str | None = None


@dataclass(frozen=True)
class StudySeries:
    """A selected series: ``key`` (``SeriesData.key``), where it is read from, the
    transformation chain applied in order, and ``gaps``: ``"none"`` (as read),
    ``"longest"`` (longest stretch without gaps) or ``"interpolate"``."""

    key: str
    name: str
    file: str
    sheet: str
    column: str
    transforms: tuple[str, ...] = ()
    gaps: str = "none"


@dataclass(frozen=True)
class Study:
    settings: Settings
    workbooks: tuple[StudyWorkbook, ...] = ()
    series: tuple[StudySeries, ...] = ()
    findings: tuple[dict[str, Any], ...] = ()
    """Each: {"key": series key or None, "result": SeriesResult.to_dict()}."""
    program: str = __version__
    saved: str = ""
    extra: dict[str, Any] = field(default_factory=dict, compare=False)
    """Keys of a newer minor layout that this version does not use; written back unchanged."""

    @property
    def keys(self) -> tuple[str, ...]:
        return tuple(s.key for s in self.series)

    def results_by_key(self) -> dict[str, dict[str, Any]]:
        return {f["key"]: f["result"] for f in self.findings if f.get("key") is not None}


# ----------------------------------------------------------------------------- building


def finding_entry(result: SeriesResult, key: str | None) -> dict[str, Any]:
    return {"key": key, "result": json_clean(result.to_dict())}


def findings_from_run(run: RunRecord) -> tuple[dict[str, Any], ...]:
    return tuple(finding_entry(f.result, f.key) for f in run.findings)


class _SeriesLike(Protocol):
    @property
    def key(self) -> str: ...
    @property
    def name(self) -> str: ...
    @property
    def source(self) -> SourceLike: ...


def series_entry(series: _SeriesLike, gaps: str = "none") -> StudySeries:
    """A study entry for a ``tauscope.data.SeriesData`` (its transformation chain included)."""
    if gaps not in GAP_CHOICES:
        raise ValueError(f"gaps must be one of {', '.join(GAP_CHOICES)}")
    chain = getattr(series, "chain", None)
    if chain is None:  # the key ends in the comma-separated transformation chain
        tail = series.key.rsplit("|", 1)[-1]
        chain = tuple(t for t in tail.split(",") if t)
    return StudySeries(series.key, series.name, str(series.source.file), series.source.sheet,
                       series.source.column, tuple(chain), gaps)


def workbook_entry(path: Path | str, sha256: str | None = None,
                   sheets: Iterable[str] = ()) -> StudyWorkbook:
    """A study entry for a workbook; the SHA-256 is computed when not given."""
    resolved = Path(path).resolve()
    return StudyWorkbook(str(resolved), sha256 or file_sha256(resolved), tuple(sheets))


# ----------------------------------------------------------------------------- JSON


def study_to_json(study: Study, study_path: Path | None = None,
                  clean: bool = True) -> dict[str, Any]:
    """The study as JSON data; ``clean=False`` takes the findings as they are (they are
    clean when made by :func:`finding_entry` or read from a file)."""
    folder = study_path.resolve().parent if study_path is not None else None
    workbooks = []
    for wb in study.workbooks:
        relative = wb.relative
        if folder is not None:
            try:
                relative = os.path.relpath(wb.path, folder)
            except ValueError:  # another drive on Windows
                relative = None
        workbooks.append({"path": wb.path, "relative": relative, "sha256": wb.sha256,
                          "sheets": list(wb.sheets)})
    data = dict(study.extra)
    data.update({
        "format": STUDY_FORMAT,
        "version": STUDY_VERSION,
        "tauscope": study.program,
        "saved": study.saved or _now(),
        "settings": study.settings.to_dict(),
        "workbooks": workbooks,
        "series": [{"key": s.key, "name": s.name, "file": s.file, "sheet": s.sheet,
                    "column": s.column, "transforms": list(s.transforms), "gaps": s.gaps}
                   for s in study.series],
        "findings": [json_clean(f) for f in study.findings] if clean else list(study.findings),
    })
    return data


def _now() -> str:
    return dt.datetime.now(dt.UTC).replace(microsecond=0).isoformat()


def study_from_json(data: Any) -> Study:
    """Check and convert parsed JSON; ValueError with a short reason when it does not fit
    (every entry used is type- and size-checked first, :mod:`.study_check`)."""
    if not isinstance(data, dict):
        raise ValueError("it is not a Tauscope study (the file holds no JSON object)")
    if data.get("format") != STUDY_FORMAT:
        raise ValueError("it is not a Tauscope study (no “format”: “tauscope-study” entry)")
    version = data.get("version")
    if not isinstance(version, int) or isinstance(version, bool) or version < 1:
        raise ValueError("its “version” entry is missing or not a whole number")
    if version > STUDY_VERSION:
        raise ValueError(f"it was saved by a newer Tauscope (study version {version}; this "
                         f"version reads up to {STUDY_VERSION}); please update Tauscope")
    try:
        raw_settings = check.require(data, "settings", dict, "the study")
        settings = Settings.from_dict(check.check_settings(raw_settings))
    except (TypeError, ValueError) as exc:
        raise ValueError(f"its settings are not valid ({exc})") from exc
    workbooks = []
    for i, wb in enumerate(check.require(data, "workbooks", list, "the study"), start=1):
        if not isinstance(wb, dict):
            raise ValueError(f"workbook entry {i} is not an object")
        where = f"workbook entry {i}"
        relative = wb.get("relative")
        workbooks.append(StudyWorkbook(
            check.check_path(check.require(wb, "path", str, where), where),
            check.check_text(check.require(wb, "sha256", str, where), where),
            tuple(check.check_string_list(wb.get("sheets", []), f"{where}: “sheets”")),
            None if relative is None else check.check_path(relative, where)))
    series = []
    for i, s in enumerate(check.require(data, "series", list, "the study"), start=1):
        if not isinstance(s, dict):
            raise ValueError(f"series entry {i} is not an object")
        where = f"series entry {i}"
        gaps = s.get("gaps", "none")
        if not isinstance(gaps, str) or gaps not in GAP_CHOICES:
            raise ValueError(f"{where}: unknown gap handling")
        key, name, sheet, column = (check.check_text(check.require(s, k, str, where), where)
                                    for k in ("key", "name", "sheet", "column"))
        series.append(StudySeries(
            key, name, check.check_path(check.require(s, "file", str, where), where), sheet, column,
            tuple(check.check_string_list(check.require(s, "transforms", list, where), where)), gaps))
    findings = []
    entries = check.require(data, "findings", list, "the study") if "findings" in data else []
    for i, f in enumerate(entries, start=1):
        if not isinstance(f, dict) or not isinstance(f.get("result"), dict):
            raise ValueError(f"finding {i} is not an object with a “result”")
        findings.append(f)
    known = {"format", "version", "tauscope", "saved", "settings", "workbooks", "series",
             "findings"}
    return Study(settings, tuple(workbooks), tuple(series), tuple(findings),
                 str(data.get("tauscope", ""))[:100], str(data.get("saved", ""))[:100],
                 {k: v for k, v in data.items() if k not in known})


# ----------------------------------------------------------------------------- files


def save_study(path: Path | str, study: Study) -> Study:
    """Write ``study`` to ``path`` atomically; returns the study as saved (time stamped)."""
    target = Path(path)
    stamped = replace(study, saved=_now(), program=__version__)
    # Compact, so that json uses its C encoder, and the findings cleaned again only when they
    # need it: with 500 findings the indented text took seconds, and the window waits for it.
    try:
        text = _dumps(study_to_json(stamped, target, clean=False))
    except (ValueError, TypeError):  # a non-finite number or a tuple key: clean, then write
        text = _dumps(study_to_json(stamped, target))
    try:
        write_text_atomic(target, text)
    except OSError as exc:
        raise StudyError(f"The study {target.name} could not be saved in {target.parent} "
                         f"({exc.strerror or exc}); the previous version is unchanged.") from exc
    return stamped


_CUT_SHORT = "it ends too early, as if it had been cut short"
_NOTHING_CHANGED = "Nothing was changed; an autosave or a backup copy may still hold the study."


def load_study(path: Path | str) -> Study:
    """Read a study; :class:`StudyError` with one clear sentence when it cannot be used."""
    source = Path(path)
    try:
        if source.is_file() and source.stat().st_size > check.MAX_STUDY_BYTES:
            raise StudyError(f"The study {source.name} is larger than a study can be "
                             f"({source.stat().st_size >> 20:,} MB). Nothing was changed.")
        raw = source.read_bytes()
    except FileNotFoundError as exc:
        raise StudyError(f"The study {source} does not exist.") from exc
    except OSError as exc:
        raise StudyError(f"The study {source} could not be read ({exc.strerror or exc}).") from exc
    if not raw.strip():
        raise StudyError(f"The study {source.name} is empty; it may have been cut short while "
                         "being copied. Nothing was changed.")
    try:
        text = raw.decode("utf-8-sig")
    except UnicodeDecodeError as exc:
        if exc.reason == "unexpected end of data" and exc.end >= len(raw):
            # The last character was cut in the middle of its bytes.
            raise StudyError(f"The study {source.name} cannot be opened: {_CUT_SHORT}. "
                             f"{_NOTHING_CHANGED}") from exc
        raise StudyError(f"The study {source.name} is not a text file (byte {exc.start} is not "
                         "UTF-8); it may be damaged. Nothing was changed.") from exc
    try:
        data = check.decode(text)
    except json.JSONDecodeError as exc:
        if ends_before_complete(text, exc):
            problem = _CUT_SHORT
        else:
            problem = f"it is not valid JSON at line {exc.lineno}, column {exc.colno} ({exc.msg})"
        raise StudyError(f"The study {source.name} cannot be opened: {problem}. "
                         f"{_NOTHING_CHANGED}") from exc
    except ValueError as exc:  # too large, too deep or a number too long (study_check)
        raise StudyError(f"The study {source.name} cannot be opened: {exc}. "
                         "Nothing was changed.") from exc
    try:
        return study_from_json(data)
    except ValueError as exc:
        raise StudyError(f"The study {source.name} cannot be opened: {exc}. "
                         "Nothing was changed.") from exc


# ----------------------------------------------------------------------------- sources


def resolve_workbook(workbook: StudyWorkbook, study_path: Path | str | None = None) -> Path | None:
    """Where the workbook is now: its saved path, else the same relative place next to the study."""
    try:  # a path this system cannot even look up (too long, bad characters) is missing
        path = Path(workbook.path)
        if path.is_file():
            return path
        if study_path is not None and workbook.relative:
            moved = (Path(study_path).resolve().parent / workbook.relative).resolve()
            if moved.is_file():
                return moved
    except (OSError, ValueError):
        return None
    return None


def check_sources(study: Study, study_path: Path | str | None = None) -> list[tuple[str, str]]:
    """Each workbook's path with ``"ok"``, ``"changed"`` (different SHA-256) or ``"missing"``."""
    status = []
    for wb in study.workbooks:
        found = resolve_workbook(wb, study_path)
        if found is None:
            status.append((wb.path, "missing"))
            continue
        try:
            same = file_sha256(found) == wb.sha256
        except OSError:
            status.append((wb.path, "missing"))
            continue
        status.append((wb.path, "ok" if same else "changed"))
    return status


def relocate(study: Study, old_path: str, new_path: Path | str) -> Study:
    """The study with workbook ``old_path`` found at ``new_path`` (the user located it).

    Series read from it follow; their keys hold only the file name, so they change only
    when the name does.  The stored SHA-256 is kept so a changed file is still reported.
    """
    new = str(Path(new_path).resolve())
    old_name, new_name = Path(old_path).name, Path(new).name
    workbooks = tuple(replace(wb, path=new, relative=None) if wb.path == old_path else wb
                      for wb in study.workbooks)

    def moved(s: StudySeries) -> StudySeries:
        if s.file != old_path:
            return s
        key = s.key
        if key.startswith(old_name + "|"):
            key = new_name + key[len(old_name):]
        return replace(s, file=new, key=key)

    return replace(study, workbooks=workbooks, series=tuple(moved(s) for s in study.series))


# ----------------------------------------------------------------------------- autosave


def autosave_path(study_path: Path | str | None, fallback_folder: Path | str) -> Path:
    """``NAME.tauscope.autosave`` next to the study; ``untitled.tauscope.autosave`` in
    ``fallback_folder`` (e.g. the user's data folder) for a study never saved."""
    if study_path is None:
        return Path(fallback_folder) / f"{UNTITLED}{STUDY_SUFFIX}{AUTOSAVE_SUFFIX}"
    path = Path(study_path)
    return path.with_name(path.name + AUTOSAVE_SUFFIX)


def write_autosave(study_path: Path | str | None, fallback_folder: Path | str,
                   study: Study) -> Path:
    """Save the open study to its autosave file (atomic, like a normal save)."""
    target = autosave_path(study_path, fallback_folder)
    save_study(target, study)
    return target


def discard_autosave(study_path: Path | str | None, fallback_folder: Path | str) -> None:
    """Remove the autosave after a normal save or a clean exit."""
    autosave_path(study_path, fallback_folder).unlink(missing_ok=True)


def recoverable_autosave(study_path: Path | str | None,
                         fallback_folder: Path | str) -> Path | None:
    """The autosave to offer back after an abnormal exit, or None.

    Offered when it exists, can be read as a study, and is newer than the study
    file (or the study was never saved).
    """
    candidate = autosave_path(study_path, fallback_folder)
    if not candidate.is_file():
        return None
    if study_path is not None:
        saved = Path(study_path)
        if saved.is_file() and saved.stat().st_mtime > candidate.stat().st_mtime:
            return None
    try:
        load_study(candidate)
    except StudyError:
        return None
    return candidate


def recover(study_path: Path | str | None, fallback_folder: Path | str) -> Study | None:
    """The autosaved study if one should be offered back, else None (nothing is deleted)."""
    candidate = recoverable_autosave(study_path, fallback_folder)
    return load_study(candidate) if candidate is not None else None
