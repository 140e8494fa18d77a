#!/usr/bin/env bash
# One-command set-up on Debian 12 (run as root).
#   ./setup.sh demo   install packages, build (Release), run the bundled demo
#   ./setup.sh test   install packages, build, run the whole test suite with ctest
set -euo pipefail
cd "$(dirname "$0")"

PACKAGES=(
  build-essential cmake pkg-config
  libocct-foundation-dev libocct-modeling-data-dev libocct-modeling-algorithms-dev
  libocct-ocaf-dev libocct-data-exchange-dev
  libvtk9-dev libegl-dev libegl-mesa0 libgl1-mesa-dri libglew-dev libeigen3-dev libsuitesparse-dev libopenblas-dev libspectra-dev
  libspdlog-dev libyaml-cpp-dev nlohmann-json3-dev libcli11-dev catch2 libre2-dev
  python3 python3-dev pybind11-dev
)
BUILD_DIR=${BUILD_DIR:-build}
JOBS=${JOBS:-2}

install_packages() {
  local missing=()
  for p in "${PACKAGES[@]}"; do
    dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
  done
  if [ ${#missing[@]} -gt 0 ]; then
    echo "== installing ${missing[*]}"
    apt-get update
    DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends "${missing[@]}"
  fi
}

build() {
  echo "== building (Release) in $BUILD_DIR"
  cmake -S . -B "$BUILD_DIR" -DCMAKE_BUILD_TYPE=Release "$@"
  cmake --build "$BUILD_DIR" -j "$JOBS"
}

case "${1:-demo}" in
  demo)
    install_packages
    build -DSTEPFRAME_BUILD_TESTS=OFF
    echo "== running the demo: pump platform P2 (data/demo/platform.yaml)"
    status=0
    "$BUILD_DIR/plugin/stepframe" run data/demo/platform.yaml --out data/demo/platform-results || status=$?
    echo "== results are in $(pwd)/data/demo/platform-results (report.html, results.json, *.csv, frame.vtm, vtk/); exit status $status"
    ;;
  test)
    install_packages
    build -DSTEPFRAME_BUILD_TESTS=ON
    echo "== running the test suite"
    ctest --test-dir "$BUILD_DIR" --output-on-failure -j "$JOBS"
    ;;
  *)
    echo "usage: $0 demo|test" >&2
    exit 2
    ;;
esac
