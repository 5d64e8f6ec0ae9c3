#!/bin/sh
# Remove Tauscope as installed by install.sh: the program folder, the "tauscope" command,
# the menu entry, the icons and the .tauscope file type.  Your workbooks, study files and
# reports are never touched.
set -eu

data_home=${XDG_DATA_HOME:-"$HOME/.local/share"}
bin_dir="$HOME/.local/bin"
app_dir="$data_home/tauscope"
marker=".installed-by-tauscope-install.sh"

if [ ! -e "$app_dir/$marker" ]; then
    echo "uninstall.sh: no installation of Tauscope found in $app_dir" >&2
    exit 1
fi

echo "Removing Tauscope from $app_dir"
if [ -L "$bin_dir/tauscope" ] && [ "$(readlink "$bin_dir/tauscope")" = "$app_dir/tauscope" ]; then
    rm -f "$bin_dir/tauscope"
fi
rm -f "$data_home/applications/tauscope.desktop"
for icon in "$data_home"/icons/hicolor/*/apps/tauscope.png "$data_home/icons/hicolor/scalable/apps/tauscope.svg"; do
    [ -e "$icon" ] && rm -f "$icon"
done
rm -f "$data_home/mime/packages/tauscope.xml"

if command -v update-mime-database >/dev/null 2>&1 && [ -d "$data_home/mime/packages" ]; then
    update-mime-database "$data_home/mime" >/dev/null 2>&1 || true
fi
if command -v update-desktop-database >/dev/null 2>&1 && [ -d "$data_home/applications" ]; then
    update-desktop-database "$data_home/applications" >/dev/null 2>&1 || true
fi
if command -v gtk-update-icon-cache >/dev/null 2>&1 && [ -d "$data_home/icons/hicolor" ]; then
    gtk-update-icon-cache -q -t "$data_home/icons/hicolor" >/dev/null 2>&1 || true
fi

rm -rf "$app_dir"
echo "Tauscope has been removed."
