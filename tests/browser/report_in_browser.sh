#!/usr/bin/env bash
# report.html in a real browser (headless Chromium, Debian's `chromium`, which
# setup.sh installs): the page runs its own self-test (address "#selftest",
# viz/web/frame_view.js) and this script reads the outcome from the DOM:
# no script or console errors, every image decodes, the 3D view draws
# non-blank pixels, and a click on the governing member shows its checks.
# Exit 77 (ctest: skipped) only where no Chromium is installed.
#   report_in_browser.sh STEPFRAME_EXE PROJECT_FILE
set -euo pipefail
exe=$1 project=$2
browser=$(command -v chromium || command -v chromium-browser || true)
if [ -z "$browser" ]; then
  echo "SKIPPED: no chromium on this machine (setup.sh installs Debian's chromium package)" >&2
  exit 77
fi
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
status=0
"$exe" run "$project" --out "$work/out" > "$work/run.log" 2>&1 || status=$?
if [ "$status" -ne 0 ] && [ "$status" -ne 1 ]; then  # 1: checks failed, the files are still written
  cat "$work/run.log" >&2; echo "stepframe run failed with status $status" >&2; exit 1
fi
# SwiftShader: WebGL in software, as on a machine without a GPU.
timeout 120 "$browser" --headless=new --no-sandbox --enable-unsafe-swiftshader --use-angle=swiftshader \
  --user-data-dir="$work/profile" --enable-logging=stderr --v=0 --virtual-time-budget=20000 --window-size=1280,1000 \
  --dump-dom "file://$work/out/report.html#selftest" > "$work/dom.html" 2> "$work/browser.log" || true
python3 - "$work/dom.html" "$work/browser.log" <<'PY'
import json, re, sys
dom = open(sys.argv[1], encoding="utf-8").read()
log = open(sys.argv[2], encoding="utf-8", errors="replace").read()
found = re.search(r'<pre id="sf-selftest">([^<]*)</pre>', dom)
if not found:
    sys.exit("the page's self-test did not report (script error or timeout); browser log:\n" + log[-3000:])
r = json.loads(found.group(1).replace("&quot;", '"').replace("&amp;", "&"))
print("self-test:", r)
problems = []
if r["errors"]: problems.append("script errors: %s" % r["errors"])
uncaught = [l for l in log.splitlines() if "Uncaught" in l or ("CONSOLE" in l and "ERROR" in l)]
if uncaught: problems.append("console errors: %s" % uncaught)
if r["images"] < 3 or r["images_decoded"] != r["images"]: problems.append("images: %d of %d decode" % (r["images_decoded"], r["images"]))
if r["view_pixels"] < 500: problems.append("the 3D view drew only %d non-white pixels" % r["view_pixels"])
if r["picked_member"] != r["target_member"]: problems.append("clicked member %d, the panel shows %d" % (r["target_member"], r["picked_member"]))
if r["picked_checks_expected"] < 1 or r["picked_check_rows"] != r["picked_checks_expected"]:
    problems.append("the panel shows %d check rows, the member has %d" % (r["picked_check_rows"], r["picked_checks_expected"]))
if problems: sys.exit("\n".join(problems))
PY
