#!/usr/bin/env bash
# npm run bench — end-to-end speed and memory of the analyze CLI (not part of npm test).
#  1. writes a float32 interleaved IQ capture of 10^7 samples at 10 MHz with the project's synthetic
#     generator (tests/bench/make-capture.ts) and times, in the same run and alternating, the analyze
#     command of package.json against a numpy/scipy pipeline in python3 (np.fromfile, angle, unwrap,
#     diff, scipy.signal.welch with nperseg 2^16); prints both times and the ratio project/scipy
#     (target <= 1.0);
#  2. writes 10^8 samples and reports the CLI's peak resident memory (target <= 400 MB);
#  3. removes the big files, then runs the server benchmark (tests/bench/upload-bench.ts): RSS rise
#     during a 1 GiB upload, upload-to-result against the CLI, GET spectrum p95 with 50 clients.
# Where python3 or scipy is missing it says so and reports the project alone.
# Environment: BENCH_RUNS (timed runs of each side, default 3), BENCH_SKIP_LARGE=1 skips step 2,
# BENCH_ANALYZE_CMD replaces the analyze command of package.json (to compare a proposed one).
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

OUT="$ROOT/tests/bench/out"
mkdir -p "$OUT"
SMALL="$OUT/bench-iq-1e7.f32"
LARGE="$OUT/bench-iq-1e8.f32"
PY="$OUT/scipy-pipeline.py"
cleanup() { rm -f "$SMALL" "$LARGE" "$PY" "$OUT"/analyze-*.json; }
trap cleanup EXIT

RUNS="${BENCH_RUNS:-3}"
FS=10000000
ARGS=(--format raw --dtype float32 --channels 2 --sample-rate "$FS" --segment 65536)

# the analyze command exactly as package.json states it (BENCH_ANALYZE_CMD tries another);
# npm appends the arguments to it
ANALYZE_CMD="${BENCH_ANALYZE_CMD:-$(node -p "require('./package.json').scripts.analyze")}"
analyze() { bash -c "$ANALYZE_CMD \"\$@\"" analyze "$@"; }

now() { date +%s.%N; }
elapsed() { awk -v a="$1" -v b="$2" 'BEGIN { printf "%.3f", b - a }'; }
median() { printf '%s\n' "$@" | sort -g | awk '{ v[NR] = $1 } END { print (NR % 2) ? v[(NR + 1) / 2] : (v[NR / 2] + v[NR / 2 + 1]) / 2 }'; }
minimum() { printf '%s\n' "$@" | sort -g | head -n 1; }

say "analyze command: $ANALYZE_CMD"
say "writing 10^7 IQ samples (float32, 10 MHz) with the synthetic generator…"
node --import tsx tests/bench/make-capture.ts "$SMALL" 10000000 "$FS"

have_scipy=0
if command -v python3 >/dev/null 2>&1; then
  if python3 -c 'import numpy, scipy.signal' >/dev/null 2>&1; then
    have_scipy=1
  else
    say "python3 is here but numpy or scipy is missing: timing the project alone"
  fi
else
  say "python3 is missing: timing the project alone"
fi

cat >"$PY" <<'EOF'
import sys
import numpy as np
from scipy import signal

fs = float(sys.argv[2])
x = np.fromfile(sys.argv[1], dtype='<f4')
z = x[0::2] + 1j * x[1::2]
phi = np.unwrap(np.angle(z))
nu = np.diff(phi) * (fs / (2 * np.pi))
f, p = signal.welch(nu, fs=fs, nperseg=2**16)
print(float(np.mean(p[(f > 1e5) & (f < 1e6)])))
EOF

# one untimed run of each to warm the file cache and the build
analyze "$SMALL" "${ARGS[@]}" >"$OUT/analyze-warm.json"
[ "$have_scipy" = 1 ] && python3 "$PY" "$SMALL" "$FS" >/dev/null

project_times=()
scipy_times=()
for ((i = 1; i <= RUNS; i++)); do
  t0=$(now)
  analyze "$SMALL" "${ARGS[@]}" >"$OUT/analyze-$i.json"
  t1=$(now)
  project_times+=("$(elapsed "$t0" "$t1")")
  if [ "$have_scipy" = 1 ]; then
    t0=$(now)
    python3 "$PY" "$SMALL" "$FS" >/dev/null
    t1=$(now)
    scipy_times+=("$(elapsed "$t0" "$t1")")
  fi
done

floor=$(node -p "JSON.parse(require('fs').readFileSync('$OUT/analyze-1.json', 'utf8')).whiteFloor.valueHz2PerHz.toPrecision(5)")
printf '\n10^7 float32 IQ samples at 10 MHz, %d runs each (wall-clock seconds, end to end)\n' "$RUNS"
printf '  project CLI : median %s s, best %s s   (runs: %s)   white floor %s Hz²/Hz (set 1e4)\n' \
  "$(median "${project_times[@]}")" "$(minimum "${project_times[@]}")" "${project_times[*]}" "$floor"
if [ "$have_scipy" = 1 ]; then
  printf '  numpy/scipy : median %s s, best %s s   (runs: %s)\n' \
    "$(median "${scipy_times[@]}")" "$(minimum "${scipy_times[@]}")" "${scipy_times[*]}"
  printf '  ratio project/scipy: %s (medians), %s (best runs)   target <= 1.0\n' \
    "$(awk -v a="$(median "${project_times[@]}")" -v b="$(median "${scipy_times[@]}")" 'BEGIN { printf "%.2f", a / b }')" \
    "$(awk -v a="$(minimum "${project_times[@]}")" -v b="$(minimum "${scipy_times[@]}")" 'BEGIN { printf "%.2f", a / b }')"
else
  printf '  numpy/scipy : not run (python3 with numpy and scipy is needed)\n'
fi
rm -f "$SMALL"

if [ "${BENCH_SKIP_LARGE:-0}" = 1 ]; then
  printf '\n10^8 samples: skipped (BENCH_SKIP_LARGE=1)\n'
  exit 0
fi

say "writing 10^8 IQ samples (800 MB)…"
node --import tsx tests/bench/make-capture.ts "$LARGE" 100000000 "$FS"

peak_kb=""
t0=$(now)
if [ -x /usr/bin/time ]; then
  # -v reports the largest resident set of the command and the processes it waited for
  /usr/bin/time -v -o "$OUT/time-large.txt" bash -c "$ANALYZE_CMD \"\$@\"" analyze "$LARGE" "${ARGS[@]}" >"$OUT/analyze-large.json"
  peak_kb=$(awk -F: '/Maximum resident set size/ { gsub(/ /, "", $2); print $2 }' "$OUT/time-large.txt")
  rm -f "$OUT/time-large.txt"
else
  # poll VmHWM (peak resident set) of the command and its children
  analyze "$LARGE" "${ARGS[@]}" >"$OUT/analyze-large.json" &
  pid=$!
  peak_kb=0
  while kill -0 "$pid" 2>/dev/null; do
    for p in $pid $(pgrep -P "$pid" 2>/dev/null) $(pgrep -P "$(pgrep -P "$pid" 2>/dev/null | tr '\n' ',' | sed 's/,$//')" 2>/dev/null); do
      hwm=$(awk '/VmHWM/ { print $2 }' "/proc/$p/status" 2>/dev/null || true)
      [ -n "$hwm" ] && [ "$hwm" -gt "$peak_kb" ] && peak_kb=$hwm
    done
    sleep 0.2
  done
  wait "$pid"
fi
t1=$(now)
samples=$(node -p "JSON.parse(require('fs').readFileSync('$OUT/analyze-large.json', 'utf8')).input.samples")
printf '\n10^8 float32 IQ samples (800 MB file): %s samples analysed in %s s\n' "$samples" "$(elapsed "$t0" "$t1")"
printf '  peak resident memory of the CLI: %s MB   target <= 400 MB\n' "$(awk -v k="$peak_kb" 'BEGIN { printf "%.0f", k / 1024 }')"
rm -f "$LARGE"

# 3. the server: upload memory, upload-to-result against the CLI, GET spectrum under load.
#    Needs the project-local MariaDB (started here when it is not running) and uses its own database.
if [ "${BENCH_SKIP_SERVER:-0}" = 1 ]; then
  printf '\nserver benchmark: skipped (BENCH_SKIP_SERVER=1)\n'
  exit 0
fi
bash scripts/db.sh up
node --import tsx tests/bench/upload-bench.ts
