#!/usr/bin/env bash
# The one scripted entry point for clearspan: installs what is missing, then
# serves the app or runs every check. README.md and .ci/run call it.
#   ./dev.sh serve   build the app and serve it on http://127.0.0.1:8080
#   ./dev.sh test    formatting, clippy (native and wasm32), native tests,
#                    the release wasm build and the browser journeys
#   ./dev.sh size    print the release wasm size, raw and gzip-compressed
#   ./dev.sh measure build, then print the browser figures (download, edit,
#                    first plan) measured in headless Chromium
#   ./dev.sh bench   run the native benchmarks
set -euo pipefail
cd "$(dirname "$0")"

TRUNK_VERSION=0.21.14
BROWSER_DIR=tests/browser

say() { printf '\n== %s\n' "$*"; }

# The wasm-bindgen version the lock file resolved; the CLI must match it exactly.
locked_wasm_bindgen() {
  awk '/^name = "wasm-bindgen"$/ { getline; gsub(/version = |"/, ""); print; exit }' Cargo.lock
}

ensure_rust_tools() {
  if ! rustup target list --installed | grep -qx wasm32-unknown-unknown; then
    say "adding the wasm32 target"
    rustup target add wasm32-unknown-unknown
  fi
  if ! trunk --version 2>/dev/null | grep -q "$TRUNK_VERSION"; then
    say "installing trunk $TRUNK_VERSION"
    cargo install trunk --version "$TRUNK_VERSION" --locked
  fi
  local wbg
  wbg=$(locked_wasm_bindgen)
  if ! wasm-bindgen --version 2>/dev/null | grep -q "$wbg"; then
    say "installing wasm-bindgen-cli $wbg"
    # Not --locked: one of its locked dependencies is missing from the registry here.
    cargo install wasm-bindgen-cli --version "$wbg" --force
  fi
}

ensure_node_tools() {
  if [ ! -x "$BROWSER_DIR/node_modules/.bin/wasm-opt" ] || [ ! -d "$BROWSER_DIR/node_modules/playwright-core" ]; then
    say "installing node packages (wasm-opt, playwright-core)"
    (cd "$BROWSER_DIR" && npm ci --no-audit --no-fund)
  fi
  # trunk's release build calls wasm-opt; the npm build works where Debian's does not.
  export PATH="$PWD/$BROWSER_DIR/node_modules/.bin:$PATH"
}

ensure_chromium() {
  if ! command -v chromium >/dev/null 2>&1; then
    say "installing Chromium from the system packages"
    apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium chromium-driver
  fi
}

build_app() {
  say "building the app (release wasm)"
  trunk build --release --offline
}

wasm_size() {
  local wasm
  wasm=$(ls dist/*_bg.wasm)
  printf 'wasm: %s bytes raw, %s bytes gzip -9\n' "$(stat -c %s "$wasm")" "$(gzip -9c "$wasm" | wc -c)"
}

case "${1:-}" in
  serve)
    ensure_rust_tools
    ensure_node_tools
    say "serving on http://127.0.0.1:8080 (Ctrl-C stops)"
    # No auto-reload: its inline script would be refused by the Content-Security-Policy.
    exec trunk serve --release --offline --no-autoreload --address 127.0.0.1 --port 8080
    ;;
  test)
    ensure_rust_tools
    ensure_node_tools
    ensure_chromium
    say "formatting"
    cargo fmt --all -- --check
    say "clippy, native"
    cargo clippy --all-targets -- -D warnings
    say "clippy, wasm32 with the web app"
    cargo clippy --target wasm32-unknown-unknown --features web --lib --bins -- -D warnings
    say "native tests"
    cargo test
    build_app
    wasm_size
    say "browser journeys in headless Chromium"
    (cd "$BROWSER_DIR" && npm test)
    ;;
  size)
    ensure_rust_tools
    ensure_node_tools
    build_app
    wasm_size
    ;;
  measure)
    ensure_rust_tools
    ensure_node_tools
    ensure_chromium
    build_app
    wasm_size
    (cd "$BROWSER_DIR" && npm run measure)
    ;;
  bench)
    cargo bench
    ;;
  *)
    echo "usage: ./dev.sh serve | test | size | measure | bench" >&2
    exit 2
    ;;
esac
