#!/bin/sh
# Writes this build's file list and version into sw.js, so the service
# worker precaches exactly this build's files when it installs and a new
# build (new file names, new contents) gives a new service worker. trunk runs
# it after each build (a post_build hook in Trunk.toml), in the staging
# directory it names in TRUNK_STAGING_DIR; it reads only that directory and
# needs no network. Running it again on a finished build rewrites the same line.
set -eu
dir="${TRUNK_STAGING_DIR:?set TRUNK_STAGING_DIR to the built app (trunk sets it for hooks)}"
cd "$dir"
test -f sw.js || { echo "precache: no sw.js in $dir" >&2; exit 1; }

# Every file of the app except the service worker itself, sorted, as
# addresses relative to sw.js.
files=$(find . -type f ! -name sw.js | sed 's|^\./||' | LC_ALL=C sort)
# The version changes with any name or content.
version=$(printf '%s\n' "$files" | while IFS= read -r f; do sha256sum "$f"; done | sha256sum | cut -c1-16)
list=$(printf '%s\n' "$files" | sed 's/.*/"&"/' | paste -sd, -)

line="const BUILD = { version: \"$version\", files: [$list] };"
grep -q '^const BUILD = ' sw.js || { echo "precache: sw.js has no 'const BUILD = ' line" >&2; exit 1; }
tmp=$(mktemp)
awk -v line="$line" '/^const BUILD = / { print line; next } { print }' sw.js > "$tmp"
cat "$tmp" > sw.js
rm -f "$tmp"
echo "precache: $(printf '%s\n' "$files" | wc -l) files, build $version"
