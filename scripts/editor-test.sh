#!/usr/bin/env bash
# `npm run test:editor`: the packaged extension inside real VS Code. Installs what it needs (Debian
# packages, code-server from npm), packages counterpoise.vsix, installs it into a fresh profile of
# code-server (the VS Code workbench and extension host, served on loopback) and runs
# test/editor/drive.mjs, which works the editor through Debian's Chromium with playwright-core and
# prints PASS/FAIL per check. Screenshots and logs go to test-artifacts/editor/.
#
# Exit status: 0 every check passed, 1 a check failed, 2 the set-up or the driver broke.
#
# Env: COUNTERPOISE_EDITOR_CACHE (where code-server is installed once, default
# ~/.cache/counterpoise-editor-host), CHROMIUM (/usr/bin/chromium), KEEP_RUN=1 (keep the profile
# and workspace in /tmp for a look afterwards).
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"

# code-server 4.100.3 carries VS Code 1.100.3 and is the last release whose `engines` accepts Node 20.
CS_VERSION=4.100.3
CACHE="${COUNTERPOISE_EDITOR_CACHE:-${XDG_CACHE_HOME:-$HOME/.cache}/counterpoise-editor-host}"
CS_HOME="$CACHE/code-server-$CS_VERSION"
CS="$CS_HOME/node_modules/code-server"
ART="$ROOT/test-artifacts/editor"
export CHROMIUM="${CHROMIUM:-/usr/bin/chromium}"
T0=$(date +%s)
say() { echo "[editor-test +$(($(date +%s) - T0))s] $*"; }
die() { echo "[editor-test] SET-UP FAILED: $*" >&2; exit 2; }

mkdir -p "$CACHE"
rm -rf "$ART"
mkdir -p "$ART"

# --- 1. Debian packages: compilers and headers for code-server's native modules (node-gyp builds
# them from source, as prebuilt-binary downloads are out of reach), ripgrep (VS Code's search
# binary, which @vscode/ripgrep would otherwise download), Chromium for the browser side.
need=()
for p in build-essential python3 pkg-config libkrb5-dev libxkbfile-dev libsecret-1-dev libx11-dev ripgrep chromium; do
  dpkg -s "$p" >/dev/null 2>&1 || need+=("$p")
done
# node-gyp reads Node's headers from /usr/include/node (npm_config_nodedir=/usr) rather than
# downloading them.
[ -f /usr/include/node/node_api.h ] || need+=(libnode-dev)
if [ ${#need[@]} -gt 0 ]; then
  if [ "$(id -u)" != 0 ] || ! command -v apt-get >/dev/null; then
    die "missing Debian packages: ${need[*]} (as root: apt-get install ${need[*]})"
  fi
  say "apt-get install ${need[*]}"
  apt-get update -qq >/dev/null
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${need[@]}" >"$ART/apt.log" 2>&1 \
    || { tail -20 "$ART/apt.log" >&2; die "apt-get install failed"; }
fi
[ -x "$CHROMIUM" ] || die "no Chromium at $CHROMIUM"

# --- 2. code-server from npm, installed once into the cache. Its own postinstall runs `npm install`
# in lib/vscode, where @vscode/ripgrep downloads a binary from outside the registries and fails, so:
# install with --ignore-scripts, link Debian's rg where @vscode/ripgrep looks (its postinstall then
# downloads nothing), and rebuild the native modules from source. Built in a scratch folder and
# moved into place only when complete; a lock keeps two runs from installing at once.
install_code_server() {
  local tmp="$CS_HOME.partial"
  local log="$CACHE/install-code-server.log"
  rm -rf "$tmp"
  mkdir -p "$tmp"
  say "installing code-server@$CS_VERSION into $CS_HOME (once; log: $log)"
  (
    set -e
    # node-gyp: Node's headers from /usr/include/node; node-pty's postinstall runs `npx node-gyp`.
    export npm_config_nodedir=/usr npm_config_yes=true npm_config_unsafe_perm=true
    export npm_config_audit=false npm_config_fund=false npm_config_update_notifier=false
    cd "$tmp"
    echo '{"name":"counterpoise-editor-host","private":true}' >package.json
    npm install --ignore-scripts --no-save "code-server@$CS_VERSION"
    npm rebuild argon2
    cd node_modules/code-server/lib/vscode
    npm install --omit=dev --ignore-scripts
    mkdir -p node_modules/@vscode/ripgrep/bin
    ln -sf "$(command -v rg)" node_modules/@vscode/ripgrep/bin/rg
    npm rebuild --foreground-scripts
    # What code-server's postinstall would have laid out: the asar alias and the CLI helpers.
    ln -sfn node_modules node_modules.asar
    (cd bin/remote-cli && ln -sf code-linux.sh code-server)
    (cd bin/helpers && ln -sf browser-linux.sh browser.sh)
    cd extensions && npm install --omit=dev
  ) >"$log" 2>&1 || { tail -30 "$log" >&2; die "code-server install failed (see $log)"; }
  rm -rf "$CS_HOME"
  mv "$tmp" "$CS_HOME"
}
exec 9>"$CACHE/.lock"
flock 9
if [ ! -f "$CS_HOME/.complete" ]; then
  install_code_server
  touch "$CS_HOME/.complete"
fi
flock -u 9
[ -f "$CS/out/node/entry.js" ] || die "code-server is not where it should be: $CS"
[ -d "$ROOT/node_modules/playwright-core" ] || die "playwright-core is missing: run npm ci"
T_INSTALLED=$(date +%s)

# --- 3. the extension, packaged from this checkout (also builds dist/, whose CLI the checks use).
say "npm run package"
npm run package >"$ART/package.log" 2>&1 || { tail -30 "$ART/package.log" >&2; die "npm run package failed"; }

# --- 4. a fresh profile and workspace, the vsix installed into them, code-server on loopback.
RUN="$(mktemp -d /tmp/counterpoise-editor-XXXXXX)"
WS="$RUN/workspace"
mkdir -p "$RUN/data/User" "$RUN/xdg/config" "$RUN/xdg/data" "$RUN/xdg/cache" "$WS"
# code-server keeps its config, logs and heartbeat under the XDG folders: all inside $RUN.
export XDG_CONFIG_HOME="$RUN/xdg/config" XDG_DATA_HOME="$RUN/xdg/data" XDG_CACHE_HOME="$RUN/xdg/cache"
node test/editor/workspace.mjs "$WS" || die "could not lay out the workspace"
# Auto-save off: the checks decide when a file is saved. No network lookups (schemas, updates).
cat >"$RUN/data/User/settings.json" <<'EOF'
{
  "workbench.startupEditor": "none",
  "files.autoSave": "off",
  "security.workspace.trust.enabled": false,
  "telemetry.telemetryLevel": "off",
  "workbench.tips.enabled": false,
  "update.mode": "none",
  "extensions.autoCheckUpdates": false,
  "extensions.autoUpdate": false,
  "extensions.ignoreRecommendations": true,
  "workbench.enableExperiments": false,
  "json.schemaDownload.enable": false,
  "window.commandCenter": false,
  "chat.commandCenter.enabled": false,
  "git.enabled": false,
  "editor.hover.delay": 200
}
EOF
PORT="$(node -e 'const s=require("net").createServer().listen(0,"127.0.0.1",()=>{console.log(s.address().port);s.close()})')"
printf 'bind-addr: 127.0.0.1:%s\nauth: none\ncert: false\n' "$PORT" >"$RUN/config.yaml"
CSFLAGS=(--config "$RUN/config.yaml" --user-data-dir "$RUN/data" --extensions-dir "$RUN/extensions")
say "installing counterpoise.vsix into a fresh profile"
node "$CS/out/node/entry.js" "${CSFLAGS[@]}" --install-extension "$ROOT/counterpoise.vsix" >"$ART/install-vsix.log" 2>&1 || true

CS_PID=
cleanup() {
  # code-server and all it started (extension hosts, our language server) share its process group.
  if [ -n "$CS_PID" ]; then
    kill -TERM -- "-$CS_PID" 2>/dev/null || true
    for _ in 1 2 3 4 5; do kill -0 -- "-$CS_PID" 2>/dev/null || break; sleep 1; done
    kill -KILL -- "-$CS_PID" 2>/dev/null || true
  fi
  [ -f "$RUN/code-server.log" ] && cp "$RUN/code-server.log" "$ART/" || true
  [ -d "$RUN/data/logs" ] && cp -r "$RUN/data/logs" "$ART/vscode-logs" || true
  if [ "${KEEP_RUN:-}" = 1 ]; then say "kept $RUN"; else rm -rf "$RUN"; fi
}
trap cleanup EXIT

say "starting code-server on 127.0.0.1:$PORT"
setsid node "$CS/out/node/entry.js" "${CSFLAGS[@]}" --disable-telemetry --disable-update-check \
  --disable-workspace-trust --disable-getting-started-override "$WS" >"$RUN/code-server.log" 2>&1 &
CS_PID=$!
up=
for _ in $(seq 1 60); do
  if curl -s -o /dev/null "http://127.0.0.1:$PORT/healthz"; then up=1; break; fi
  kill -0 "$CS_PID" 2>/dev/null || break
  sleep 1
done
[ -n "$up" ] || { tail -20 "$RUN/code-server.log" >&2; die "code-server did not start"; }

# --- 5. the checks (bounded: the driver's own waits are bounded, and so is the whole run).
say "driving the editor in $CHROMIUM"
set +e
timeout --kill-after=10 900 node test/editor/drive.mjs \
  --url "http://127.0.0.1:$PORT/?folder=$WS" --workspace "$WS" --extensions "$RUN/extensions" \
  --logs "$RUN/data/logs" --artifacts "$ART" 2>&1 | tee "$ART/results.txt"
rc=${PIPESTATUS[0]}
set -e
[ "$rc" = 124 ] && { echo "[editor-test] the driver ran out of time" >&2; rc=2; }
say "install $((T_INSTALLED - T0)) s, package and checks $(($(date +%s) - T_INSTALLED)) s; artefacts in $ART"
exit "$rc"
