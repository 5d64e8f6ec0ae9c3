#!/bin/sh
# Wrap dist/Tauscope.app (made by `python installer/build.py` on macOS) in a .dmg.
#
#   installer/macos/make_dmg.sh                      ad-hoc signature (your own Macs)
#   SIGN_IDENTITY="Developer ID Application: NAME (TEAMID)" \
#   NOTARY_PROFILE=tauscope-notary installer/macos/make_dmg.sh    signed and notarised
#
# Output: dist/tauscope-<version>-macos-<arch>.dmg, holding Tauscope.app and a link to
# /Applications, so the user drags one onto the other.
set -eu

cd "$(dirname "$0")/../.."
app="dist/Tauscope.app"
version=$(python3 -c 'import sys; sys.path.insert(0, "installer"); import bundle_config as c; print(c.package_version())')
arch=$(uname -m)
dmg="dist/tauscope-${version}-macos-${arch}.dmg"
staging="build/dmg"

if [ ! -d "$app" ]; then
    echo "make_dmg.sh: $app is missing; run python installer/build.py first" >&2
    exit 1
fi

# 1. Sign.  Apple silicon refuses to run unsigned code, so sign at least ad hoc ("-").
if [ -n "${SIGN_IDENTITY:-}" ]; then
    codesign --force --deep --options runtime --timestamp --sign "$SIGN_IDENTITY" "$app"
else
    codesign --force --deep --sign - "$app"
fi
codesign --verify --deep --strict --verbose=2 "$app"

# 2. Stage the disk image's contents: the app and a link to /Applications.
rm -rf "$staging"
mkdir -p "$staging"
cp -R "$app" "$staging/"
ln -s /Applications "$staging/Applications"

# 3. Make a compressed, read-only image (UDZO).
rm -f "$dmg"
hdiutil create -volname "Tauscope ${version}" -srcfolder "$staging" -ov -format UDZO "$dmg"
hdiutil verify "$dmg"

# 4. Notarise and staple (only with a Developer ID and a stored notary profile, made once
#    with: xcrun notarytool store-credentials tauscope-notary --apple-id ... --team-id ...).
if [ -n "${SIGN_IDENTITY:-}" ] && [ -n "${NOTARY_PROFILE:-}" ]; then
    codesign --force --timestamp --sign "$SIGN_IDENTITY" "$dmg"
    xcrun notarytool submit "$dmg" --keychain-profile "$NOTARY_PROFILE" --wait
    xcrun stapler staple "$dmg"
fi

rm -rf "$staging"
echo "wrote $dmg"
