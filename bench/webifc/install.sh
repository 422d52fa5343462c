#!/usr/bin/env bash
# Installs web-ifc@0.0.78 (the reference parser of design §8) into a
# git-ignored folder, as a measuring tool only.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
dir="${WEBIFC_DIR:-$here/../out/webifc-0.0.78}"
if [ -f "$dir/node_modules/web-ifc/package.json" ]; then
  exit 0
fi
mkdir -p "$dir"
npm install --no-audit --no-fund --silent --prefix "$dir" web-ifc@0.0.78 >&2
