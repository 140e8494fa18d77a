#!/usr/bin/env bash
# One-command set-up on Debian 12 (run as root).
#   ./setup.sh demo   install packages, build (Release), run the bundled demo
#   ./setup.sh test   install packages, build, run the whole test suite with ctest, then the STEP and
#                     analysis unit tests again built with ASan+UBSan (what CI runs)
#   ./setup.sh asan   install packages, build with ASan+UBSan (preset asan), run the suite under them
#   ./setup.sh fuzz [SECONDS]  install clang too, build the libFuzzer targets (preset fuzz) and run
#                     each for SECONDS (default 60) on a corpus seeded from tests/data
set -euo pipefail
cd "$(dirname "$0")"

PACKAGES=(
  build-essential cmake pkg-config
  libocct-foundation-dev libocct-modeling-data-dev libocct-modeling-algorithms-dev
  libocct-ocaf-dev libocct-data-exchange-dev
  libvtk9-dev libegl-dev libegl-mesa0 libgl1-mesa-dri libglew-dev libeigen3-dev libsuitesparse-dev libopenblas-dev libspectra-dev
  libspdlog-dev libyaml-cpp-dev nlohmann-json3-dev libcli11-dev catch2 libssl-dev libre2-dev libboost-dev libpng-dev
  python3 python3-dev pybind11-dev python3-distributed
  chromium  # the browser test of report.html (headless)
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
    # The fast unit tests again under AddressSanitizer and UndefinedBehaviorSanitizer (preset asan): the
    # STEP reading and the analysis, where memory errors would hide. `./setup.sh asan` runs everything.
    echo "== building the STEP and analysis unit tests with ASan+UBSan (build-asan)"
    cmake --preset asan
    cmake --build build-asan -j "$JOBS" --target test_geometry test_analysis
    echo "== running them under the sanitizers"
    ctest --preset asan -R '^(geometry|analysis):'
    ;;
  asan)
    install_packages
    cmake --preset asan
    cmake --build build-asan -j "$JOBS"
    echo "== running the test suite under AddressSanitizer and UndefinedBehaviorSanitizer"
    ctest --preset asan
    ;;
  fuzz)
    PACKAGES+=(clang)
    install_packages
    seconds=${2:-60}
    cmake --preset fuzz
    cmake --build build-fuzz -j "$JOBS" --target fuzz_step_structure fuzz_step_import fuzz_step_split \
      fuzz_designation fuzz_project_reader fuzz_c_api_text
    tests/fuzz/seed_corpora.sh build-fuzz/corpus
    for target in step_structure:step step_import:step step_split:step designation:designation \
                  project_reader:project c_api_text:c_api; do
      name=${target%%:*}
      echo "== fuzz_$name for $seconds s"
      (cd build-fuzz && "tests/fuzz/fuzz_$name" "corpus/${target##*:}" -max_total_time="$seconds" -rss_limit_mb=4096 \
         -max_len=200000 -print_final_stats=1)
    done
    ;;
  *)
    echo "usage: $0 demo|test|asan|fuzz [seconds]" >&2
    exit 2
    ;;
esac
