#!/bin/sh
# Install Tauscope for the current user, into ~/.local (no administrator rights needed).
#
#   ./install.sh          run from the unpacked tauscope-<version> folder
#
# Puts the program in ~/.local/share/tauscope (or $XDG_DATA_HOME/tauscope), a command
# "tauscope" in ~/.local/bin, a menu entry, the icons and the .tauscope file type.
# Remove everything again with ~/.local/share/tauscope/uninstall.sh
set -eu

here=$(cd "$(dirname "$0")" && pwd)
data_home=${XDG_DATA_HOME:-"$HOME/.local/share"}
bin_dir="$HOME/.local/bin"
app_dir="$data_home/tauscope"
marker=".installed-by-tauscope-install.sh"

if [ ! -x "$here/tauscope/tauscope" ]; then
    echo "install.sh: $here/tauscope/tauscope is missing; run this script from the unpacked archive." >&2
    exit 1
fi
if [ -e "$app_dir" ] && [ ! -e "$app_dir/$marker" ]; then
    echo "install.sh: $app_dir exists but was not made by this installer; move it away first." >&2
    exit 1
fi

echo "Installing Tauscope into $app_dir"
if [ -e "$app_dir" ]; then
    rm -rf "$app_dir"  # an earlier installation of ours (it carries the marker)
fi
mkdir -p "$app_dir"
cp -RP "$here/tauscope/." "$app_dir/"
cp "$here/uninstall.sh" "$app_dir/uninstall.sh"
chmod +x "$app_dir/uninstall.sh" "$app_dir/tauscope"
echo "Installed by Tauscope's install.sh; uninstall.sh removes this folder." > "$app_dir/$marker"

mkdir -p "$bin_dir"
if [ -e "$bin_dir/tauscope" ] && [ ! -L "$bin_dir/tauscope" ]; then
    echo "install.sh: leaving $bin_dir/tauscope alone (it is not ours); start the program from the menu" >&2
    echo "            or with $app_dir/tauscope" >&2
else
    ln -sfn "$app_dir/tauscope" "$bin_dir/tauscope"
fi

mkdir -p "$data_home/applications"
# Exec gets the full path (quoted, with \ " ` $ escaped as the desktop entry format asks),
# so the menu entry works even when ~/.local/bin is not on the PATH.
quoted=$(printf '%s' "$app_dir/tauscope" | sed 's/[\\"`$]/\\\\&/g')
{
    sed '/^Exec=/d' "$here/tauscope.desktop"
    printf 'Exec="%s" %%F\n' "$quoted"
} > "$data_home/applications/tauscope.desktop"

for png in "$here"/icons/tauscope-*.png; do
    size=$(basename "$png" .png | sed 's/^tauscope-//')
    mkdir -p "$data_home/icons/hicolor/${size}x${size}/apps"
    cp "$png" "$data_home/icons/hicolor/${size}x${size}/apps/tauscope.png"
done
mkdir -p "$data_home/icons/hicolor/scalable/apps"
cp "$here/icons/tauscope.svg" "$data_home/icons/hicolor/scalable/apps/tauscope.svg"

mkdir -p "$data_home/mime/packages"
cp "$here/tauscope-mime.xml" "$data_home/mime/packages/tauscope.xml"

# Refresh the desktop's caches where the tools exist (harmless when they do not).
if command -v update-mime-database >/dev/null 2>&1; then
    update-mime-database "$data_home/mime" >/dev/null 2>&1 || true
fi
if command -v update-desktop-database >/dev/null 2>&1; then
    update-desktop-database "$data_home/applications" >/dev/null 2>&1 || true
fi
if command -v gtk-update-icon-cache >/dev/null 2>&1; then
    gtk-update-icon-cache -q -t "$data_home/icons/hicolor" >/dev/null 2>&1 || true
fi

echo "Done. Start Tauscope from your applications menu, or type: tauscope"
case ":$PATH:" in
    *":$bin_dir:"*) ;;
    *) echo "Note: $bin_dir is not on your PATH; the menu entry works regardless." ;;
esac
echo "To remove it: $app_dir/uninstall.sh"
