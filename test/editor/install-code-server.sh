#!/usr/bin/env bash
# install-code-server.sh DIR — install code-server (VS Code 1.100 in the browser) into DIR using only
# the npm registry, for the editor end-to-end test (test/editor/codeserver.e2e.ts).
#
# Idempotent and cached:
#   * DIR already holds a working install of the same version -> nothing to do (~1.5 s)
#   * a built snapshot is in the cache                         -> unpack it, no network (~3 s)
#   * otherwise                                                 -> full build (~160 s on 2 cores), then
#                                                                  save a built snapshot in the cache.
# Native modules are compiled locally by node-gyp against the system Node headers.
#
# Env:
#   CODE_SERVER_VERSION    default 4.100.3 (VS Code 1.100; the last release that runs on Node 20)
#   STUBWRIGHT_EDITOR_CACHE default ${XDG_CACHE_HOME:-$HOME/.cache}/stubwright-editor
#   CODE_SERVER_REBUILD=1  ignore the marker and the snapshot, build from scratch
#
# Debian prerequisites (.ci/run installs them): build-essential python3 ripgrep libkrb5-dev
#   libsecret-1-dev libx11-dev libxkbfile-dev zstd
# Prints DIR/bin/code-server on stdout; progress goes to stderr.
set -euo pipefail

if [ $# -lt 1 ] || [ "${1:-}" = "-h" ] || [ "${1:-}" = "--help" ]; then
  sed -n '2,19p' "$0"; exit 2
fi

DIR=$(mkdir -p "$1" && cd "$1" && pwd)
VERSION=${CODE_SERVER_VERSION:-4.100.3}
CACHE=${STUBWRIGHT_EDITOR_CACHE:-${XDG_CACHE_HOME:-$HOME/.cache}/stubwright-editor}
NODE_MAJOR=$(node -p 'process.versions.node.split(".")[0]')
ARCH=$(node -p 'process.arch')
SNAP_BASE="$CACHE/code-server-$VERSION-node$NODE_MAJOR-linux-$ARCH-built"
MARKER="$DIR/.code-server-installed"
CS="$DIR/node_modules/code-server"
ENTRY="$CS/out/node/entry.js"
LOG="$DIR/install.log"
mkdir -p "$CACHE"

say() { printf '[code-server install %s] %s\n' "$(date +%H:%M:%S)" "$*" >&2; }
t0=$(date +%s)

# A half-built tree fails when its native modules are loaded, so load them.
verify() {
  [ -f "$ENTRY" ] || return 1
  [ -e "$CS/lib/vscode/node_modules/@vscode/ripgrep/bin/rg" ] || return 1
  [ -e "$CS/lib/vscode/node_modules.asar" ] || return 1
  (cd "$CS/lib/vscode" && node -e '
    for (const m of ["node-pty", "@vscode/spdlog", "native-watchdog", "kerberos"]) require("./node_modules/" + m);
  ') >/dev/null 2>&1 || return 1
  (cd "$DIR" && node -e 'require("argon2")') >/dev/null 2>&1 || return 1
  node "$ENTRY" --version >/dev/null 2>&1 || return 1
}

finish() {
  mkdir -p "$DIR/bin"
  printf '#!/usr/bin/env sh\nexec node "%s" "$@"\n' "$ENTRY" > "$DIR/bin/code-server"
  chmod +x "$DIR/bin/code-server"
  echo "$VERSION" > "$MARKER"
  echo "$DIR/bin/code-server"
}

if [ "${CODE_SERVER_REBUILD:-0}" != 1 ] && [ -f "$MARKER" ] && [ "$(cat "$MARKER")" = "$VERSION" ] && verify; then
  say "code-server $VERSION already installed in $DIR"
  finish; exit 0
fi

# ---- fast path: a cached built snapshot ------------------------------------------------------
SNAP=""
for ext in tar.zst tar.gz; do [ -f "$SNAP_BASE.$ext" ] && { SNAP="$SNAP_BASE.$ext"; break; }; done
if [ "${CODE_SERVER_REBUILD:-0}" != 1 ] && [ -n "$SNAP" ]; then
  say "unpacking cached snapshot $SNAP"
  rm -rf "$DIR/node_modules"
  case "$SNAP" in
    *.zst) tar -C "$DIR" -I zstd -xf "$SNAP" ;;
    *)     tar -C "$DIR" -xzf "$SNAP" ;;
  esac
  if verify; then
    say "ready from snapshot in $(( $(date +%s) - t0 ))s"
    finish; exit 0
  fi
  say "snapshot did not verify; building from scratch"
fi

# ---- full build --------------------------------------------------------------------------------
command -v rg >/dev/null || { echo "ripgrep missing: apt-get install ripgrep" >&2; exit 1; }
command -v make >/dev/null && command -v g++ >/dev/null && command -v python3 >/dev/null \
  || { echo "need make g++ python3: apt-get install build-essential python3" >&2; exit 1; }
[ -f /usr/include/krb5.h ] || [ -f /usr/include/krb5/krb5.h ] \
  || { echo "need libkrb5-dev (kerberos native module)" >&2; exit 1; }
[ "$NODE_MAJOR" = 20 ] || say "WARNING: code-server $VERSION expects Node 20, found $NODE_MAJOR"

export npm_config_yes=true                 # node-pty's post-install runs `npx node-gyp`
export npm_config_build_from_source=true   # kerberos/argon2: no prebuilt downloads from GitHub
export npm_config_update_notifier=false npm_config_fund=false npm_config_audit=false
export npm_config_prefer_offline=true
export JOBS=${JOBS:-$(nproc)}
NPM_FLAGS=(--no-audit --no-fund --loglevel=warn)

TGZ="$CACHE/code-server-$VERSION.tgz"
if [ ! -f "$TGZ" ]; then
  say "fetching code-server@$VERSION from the npm registry"
  (cd "$CACHE" && npm pack "code-server@$VERSION" --pack-destination "$CACHE" "${NPM_FLAGS[@]}" >/dev/null)
fi

: > "$LOG"
say "build log: $LOG"
cd "$DIR"
[ -f package.json ] || echo '{ "name": "stubwright-code-server", "private": true }' > package.json
rm -rf node_modules package-lock.json

say "1/6 code-server package (install scripts off)"
npm install --ignore-scripts "${NPM_FLAGS[@]}" "$TGZ" >>"$LOG" 2>&1
say "2/6 argon2 from source"
npm rebuild argon2 --foreground-scripts "${NPM_FLAGS[@]}" >>"$LOG" 2>&1

cd "$CS/lib/vscode"
say "3/6 VS Code server dependencies (install scripts off)"
npm install --omit=dev --ignore-scripts "${NPM_FLAGS[@]}" >>"$LOG" 2>&1
say "4/6 ripgrep -> system rg, then native modules"
mkdir -p node_modules/@vscode/ripgrep/bin
ln -sf "$(command -v rg)" node_modules/@vscode/ripgrep/bin/rg
npm rebuild --foreground-scripts "${NPM_FLAGS[@]}" >>"$LOG" 2>&1
say "5/6 the links code-server's own post-install would make"
ln -sfn node_modules node_modules.asar
(cd bin/remote-cli && ln -sfn code-linux.sh code-server)
(cd bin/helpers && ln -sfn browser-linux.sh browser.sh)
say "6/6 built-in extensions' shared dependencies"
(cd extensions && npm install --omit=dev "${NPM_FLAGS[@]}" >>"$LOG" 2>&1)

cd "$DIR"
verify || { echo "code-server built but does not verify; see $LOG" >&2; exit 1; }
say "built in $(( $(date +%s) - t0 ))s; saving a snapshot in $CACHE"
if command -v zstd >/dev/null; then
  tar -C "$DIR" -I 'zstd -T0 -3' -cf "$SNAP_BASE.tar.zst.tmp" node_modules && mv "$SNAP_BASE.tar.zst.tmp" "$SNAP_BASE.tar.zst"
else
  tar -C "$DIR" -czf "$SNAP_BASE.tar.gz.tmp" node_modules && mv "$SNAP_BASE.tar.gz.tmp" "$SNAP_BASE.tar.gz"
fi
say "done in $(( $(date +%s) - t0 ))s"
finish
