#!/usr/bin/env bash
# terzo set-up: installs what is missing (Debian 12, as root), builds, then runs or tests.
#   ./build.sh run    build, then open the demo (GUI when a display exists, else the terminal analysis)
#   ./build.sh test   build, then run every test through ctest (Release build)
#   ./build.sh check  the longer checks: the suite under ASan+UBSan (clang), then each fuzz target
#   ./build.sh build  build only
#   ./build.sh fuzz [SECONDS]  build the check tree (clang, sanitizers) and run each fuzz target for SECONDS (60)
# Environment: BUILD_DIR (default build), BUILD_TYPE (default Release), JOBS (default: all cores).
set -euo pipefail
cd "$(dirname "$0")"

BUILD_DIR=${BUILD_DIR:-build}
BUILD_TYPE=${BUILD_TYPE:-Release}
JOBS=${JOBS:-$(nproc 2>/dev/null || echo 2)}
ACTION=${1:-run}
export CCACHE_BASEDIR=${CCACHE_BASEDIR:-$(cd .. && pwd)}

# Every Debian package the project builds, tests or runs with. Keep this the only list.
PACKAGES=(
  cmake ninja-build g++ pkg-config python3
  libboost-dev libsfml-dev libimgui-dev catch2 libcli11-dev libfmt-dev nlohmann-json3-dev
  libbenchmark-dev libfftw3-dev libsndfile1-dev sox
  xvfb xauth xdotool libgl1-mesa-dri
  strace ccache libstb-dev help2man
  clang libclang-rt-14-dev
)

missing_packages() {
  local p
  for p in "${PACKAGES[@]}"; do
    dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || echo "$p"
  done
}

install_missing() {
  local missing
  missing=$(missing_packages | tr '\n' ' ')
  [ -z "${missing// /}" ] && return 0
  if [ "$(id -u)" != 0 ] || ! command -v apt-get >/dev/null 2>&1; then
    echo "build.sh: these Debian packages are missing and cannot be installed here (needs apt-get as root):" >&2
    echo "  apt-get install -y --no-install-recommends $missing" >&2
    exit 1
  fi
  echo "build.sh: installing $missing"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  # shellcheck disable=SC2086
  apt-get install -y -qq --no-install-recommends $missing
}

configure_and_build() {
  local dir=$1; shift
  if [ ! -f "$dir/CMakeCache.txt" ]; then
    local launcher=()
    # A compiler cache shared by every checkout of the project (CCACHE_BASEDIR makes paths
    # relative, so a second worktree reuses the first one's objects).
    if command -v ccache >/dev/null 2>&1; then launcher=(-DCMAKE_CXX_COMPILER_LAUNCHER=ccache); fi
    cmake -S . -B "$dir" -G Ninja -DCMAKE_BUILD_TYPE="$BUILD_TYPE" "${launcher[@]}" "$@"
  fi
  cmake --build "$dir" -j "$JOBS"
}

# The check tree: clang with ASan+UBSan at -O1 and assertions on (CMAKE_BUILD_TYPE None uses
# CMAKE_CXX_FLAGS alone), tests and libFuzzer programs together, so core is compiled once for
# both. -O1 is what the sanitizer documentation recommends; it compiles about 3x faster than
# the Release flags under the sanitizers.
configure_check_build() {
  CXX=clang++ BUILD_TYPE=None configure_and_build "$BUILD_DIR-check" -DCMAKE_CXX_COMPILER=clang++ \
    -DCMAKE_CXX_FLAGS="-O1 -g0" -DTERZO_FUZZ=ON -DTERZO_BUILD_GUI=OFF -DTERZO_BUILD_BENCH=OFF
}

# Runs every libFuzzer program of the check tree for $1 seconds over its corpus and seeds.
run_fuzzers() {
  local seconds=$1 exe name work dir="$BUILD_DIR-check"
  for exe in "$dir"/fuzz/fuzz_*; do
    name=$(basename "$exe"); name=${name#fuzz_}
    work="$dir/corpus/$name"; mkdir -p "$work" "$dir/crashes"
    echo "build.sh: fuzzing $name for $seconds s"
    # A fixed seed makes a CI run repeatable; set TERZO_FUZZ_SEED=0 for a new one each run.
    "$exe" -seed="${TERZO_FUZZ_SEED:-1}" -max_total_time="$seconds" -max_len=4096 -timeout=10 -rss_limit_mb=2048 \
      -artifact_prefix="$dir/crashes/$name-" -print_final_stats=1 \
      "$work" "tests/fuzz/$name" 2>&1 | grep -E "DONE|stat::number_of_executed_units|stat::new_units_added|==[0-9]+==|SUMMARY|ERROR" || true
    if ls "$dir/crashes/$name-"* >/dev/null 2>&1; then
      echo "build.sh: the fuzzer found a failing input for $name; it is in $dir/crashes" >&2
      exit 1
    fi
  done
}

case "$ACTION" in
  build)
    install_missing
    configure_and_build "$BUILD_DIR"
    ;;
  run)
    install_missing
    configure_and_build "$BUILD_DIR"
    if [ -n "${DISPLAY:-}" ] && [ -x "$BUILD_DIR/gui/terzo-gui" ]; then
      exec "$BUILD_DIR/gui/terzo-gui" assets/demo.scl
    fi
    # No display: the terminal analysis of the demo, its degrees and the resultants of its
    # major triad (degrees 0, 2 and 4).
    "$BUILD_DIR/cli/terzo" inspect assets/demo.scl
    echo
    exec "$BUILD_DIR/cli/terzo" resultants assets/demo.scl --chord 0,2,4 --order 3
    ;;
  test)
    install_missing
    configure_and_build "$BUILD_DIR"
    (cd "$BUILD_DIR" && ctest --output-on-failure -j "$JOBS")
    ;;
  check)
    # The longer checks CI runs after the test command: the suite for core and the CLI under
    # AddressSanitizer and UBSan (clang, -O1, assertions on; no GUI, no benchmarks), then each
    # fuzz target, built in the same tree.
    install_missing
    configure_check_build
    (cd "$BUILD_DIR-check" && ctest --output-on-failure -j "$JOBS")
    run_fuzzers "${TERZO_FUZZ_SECONDS:-${2:-30}}"
    ;;
  fuzz)
    install_missing
    configure_check_build
    run_fuzzers "${2:-60}"
    ;;
  *)
    echo "usage: ./build.sh run|test|check|build|fuzz [SECONDS]" >&2
    exit 2
    ;;
esac
