#!/bin/sh
# The "before" count of the new-wearer journey (journeys/new-wearer.test.js):
# builds an earlier commit (a0c8269, before the dispenser's-workflow work, or
# the commit given) from `git archive` in a temporary directory and runs the
# same journey against that build; the journey prints its count. The earlier
# build gets this build's web-sys bindings (features only add bindings) and
# this worktree's target/, so only clearspan itself is compiled again.
# Run from anywhere in the worktree: tests/browser/tools/count-before.sh [COMMIT]
set -eu
COMMIT=${1:-a0c8269}
ROOT=$(cd "$(dirname "$0")/../../.." && pwd)
WORK=$(mktemp -d)
trap 'rm -rf "$WORK"' EXIT
mkdir "$WORK/src"
git -C "$ROOT" archive "$COMMIT" | tar -x -C "$WORK/src"
# This build's web-sys line in place of the earlier one.
grep '^web-sys = ' "$ROOT/Cargo.toml" > "$WORK/web-sys"
awk -v line="$(cat "$WORK/web-sys")" '/^web-sys = /{print line; next} {print}' \
  "$WORK/src/Cargo.toml" > "$WORK/Cargo.toml"
mv "$WORK/Cargo.toml" "$WORK/src/Cargo.toml"
ln -s "$ROOT/tests/browser/node_modules" "$WORK/src/tests/browser/node_modules"
(cd "$WORK/src" && CARGO_TARGET_DIR="$ROOT/target" \
  PATH="$ROOT/tests/browser/node_modules/.bin:$PATH" \
  trunk build --release --offline --dist "$WORK/dist")
cd "$ROOT/tests/browser"
CLEARSPAN_DIST="$WORK/dist" CLEARSPAN_BEFORE=1 node --test journeys/new-wearer.test.js
