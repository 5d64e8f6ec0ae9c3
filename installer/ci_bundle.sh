#!/usr/bin/env bash
# CI step (called by .ci/run after the test suite, inside its virtual environment):
# build the Linux bundle from this checkout, run the bundle's self-test (build.py does that,
# with no network), then install the .tar.gz into a throw-away HOME, run the installed
# program's self-test, and uninstall it again.
set -euo pipefail
cd "$(dirname "$0")/.."
export QT_QPA_PLATFORM=offscreen
started=$(date +%s)

# PyInstaller comes from the project's own "bundle" extra.
python -m pip install --quiet -e ".[bundle]"
python installer/build.py

version=$(python -c 'import sys; sys.path.insert(0, "installer"); import bundle_config as c; print(c.package_version())')
archive="dist/tauscope-${version}-$(python -c 'import sys; sys.path.insert(0, "installer"); import bundle_config as c; print(c.platform_tag())').tar.gz"
scratch=$(mktemp -d)
trap 'rm -rf "$scratch"' EXIT
tar -xzf "$archive" -C "$scratch"
mkdir -p "$scratch/home"
env -u XDG_DATA_HOME HOME="$scratch/home" sh "$scratch/tauscope-${version}/install.sh"
env -u XDG_DATA_HOME HOME="$scratch/home" "$scratch/home/.local/bin/tauscope" self-test --quiet
env -u XDG_DATA_HOME HOME="$scratch/home" sh "$scratch/home/.local/share/tauscope/uninstall.sh"
test ! -e "$scratch/home/.local/share/tauscope"

echo "ci_bundle.sh: bundle built, installed, self-tested and removed in $(( $(date +%s) - started )) s"
