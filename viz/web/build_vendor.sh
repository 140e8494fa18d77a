#!/usr/bin/env bash
# Regenerates vendor/three.bundle.min.js (three.js, MIT licence, from the npm
# registry at the versions package.json pins) and its licence file. Run by a
# developer when the pinned version changes; the build itself never needs a
# network: the bundle is committed and compiled into the program.
set -euo pipefail
cd "$(dirname "$0")"
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cp package.json three_entry.js "$work"
(cd "$work" && npm install --silent --no-audit --no-fund &&
  npx esbuild three_entry.js --bundle --minify --format=iife --global-name=THREE --legal-comments=none \
    --outfile=three.bundle.min.js)
mkdir -p vendor
{ echo "/* three.js $(node -p "require('$work/node_modules/three/package.json').version" 2>/dev/null || grep -o '"version": "[^"]*"' "$work/node_modules/three/package.json"), MIT licence: see three.LICENSE */"; cat "$work/three.bundle.min.js"; } > vendor/three.bundle.min.js
cp "$work/node_modules/three/LICENSE" vendor/three.LICENSE
echo "vendor/three.bundle.min.js: $(wc -c < vendor/three.bundle.min.js) bytes"
