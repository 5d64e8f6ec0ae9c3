"""The package list in pyproject.toml names every package folder, and the demo data ships."""

from __future__ import annotations

import tomllib
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]


def test_every_package_folder_is_listed_in_pyproject() -> None:
    config = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))
    listed = set(config["tool"]["setuptools"]["packages"])
    source = ROOT / "desktop"
    found = {
        ".".join(init.parent.relative_to(source).parts)
        for init in source.rglob("__init__.py")
        if "__pycache__" not in init.parts
    }
    assert found <= listed
    assert "tauscope.bundled" in listed
    assert config["tool"]["setuptools"]["package-dir"]["tauscope.bundled"] == "resources"


def test_demo_workbook_is_found_through_resources_path() -> None:
    from tauscope.resources_path import demo_workbook

    path = demo_workbook()
    assert path is not None and path.name == "harbourline_demo.xlsx"
