#!/usr/bin/env bash
# End-to-end benchmark of quantrun, in plain shell and the JDK: it generates synthetic runs with
# 'quantrun generate', processes them with 'quantrun process', and prints its figures.
#
#   mvn -B -q package -DskipTests && runner/src/bench/end-to-end.sh [quick]
#
# Figures (goals in brackets):
#   (a) a typical run, 150 injections x 30 lines x 3 readings: process wall time against
#       'quantrun --version' in the same script [ratio <= 1.5]
#   (b) a large run of 1,000,000 readings in a 512 MB heap: MB/s, readings/s, peak RSS
#   (c) an archive of 1,000 typical runs in one invocation, CSV and JSON outputs only [>= 100 runs/s]
#   growth: (b) at 0.25, 0.5, 1 and 2 million readings [each doubling costs at most 2.2x]
# 'quick' runs smaller sizes (for trying the script, not for the figures).
set -euo pipefail
cd "$(dirname "$0")/../../.."
q=./quantrun
[ -f runner/target/quantrun.jar ] || { echo "build first: mvn -B -q package -DskipTests" >&2; exit 2; }
work=$(mktemp -d "${TMPDIR:-/tmp}/quantrun-bench.XXXXXX")
trap 'rm -rf "$work"' EXIT
quick=${1:-}

# now: sets NOW_MS from bash's own clock (no process started for it; date where bash is older)
now() {
  if [ -n "${EPOCHREALTIME:-}" ]; then
    local t=${EPOCHREALTIME/[.,]/}
    NOW_MS=$(( t / 1000 ))
  else
    NOW_MS=$(date +%s%3N)
  fi
}

# check RC CMD...: stops the script unless the command ended with 0 or 1 (1 means "processed,
# with QC failures": the outputs are complete)
check() {
  local rc=$1
  shift
  if [ "$rc" -ne 0 ] && [ "$rc" -ne 1 ]; then echo "failed ($rc): $*" >&2; cat "$work/stderr" >&2; exit 1; fi
}

# timed CMD...: sets WALL_MS; nothing else runs beside the command
timed() {
  local start rc=0
  now; start=$NOW_MS
  "$@" >/dev/null 2>"$work/stderr" || rc=$?
  now
  check "$rc" "$@"
  WALL_MS=$(( NOW_MS - start ))
}

# run CMD...: sets WALL_MS and PEAK_KB, the process's peak resident set, which a watcher reads
# from /proc every 20 ms with shell built-ins only (it starts no processes that would take CPU
# from the one measured); the end time is taken as soon as the command ends
run() {
  local start pid watcher rc=0
  now; start=$NOW_MS
  "$@" >/dev/null 2>"$work/stderr" &
  pid=$!
  (
    exec 3<> <(:)  # a pipe no one writes to: 'read -t' on it waits without a process
    hwm=0
    while [ -e "/proc/$pid" ]; do
      while read -r key value _; do
        if [ "$key" = VmHWM: ]; then
          if [ "$value" -gt "$hwm" ]; then hwm=$value; echo "$hwm" > "$work/hwm"; fi
          break
        fi
      done 2>/dev/null < "/proc/$pid/status" || true
      read -r -t 0.02 -u 3 _ || true
    done
  ) &
  watcher=$!
  wait "$pid" || rc=$?
  now
  wait "$watcher" 2>/dev/null || true
  check "$rc" "$@"
  WALL_MS=$(( NOW_MS - start ))
  PEAK_KB=$(cat "$work/hwm" 2>/dev/null || echo 0)
  rm -f "$work/hwm"
}

# median of the arguments
median() { printf '%s\n' "$@" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }

echo "quantrun end-to-end benchmark"
echo "machine: $(nproc) cores, $(awk '/MemTotal/ {printf "%.0f GiB", $2/1048576}' /proc/meminfo), $(java -version 2>&1 | head -n 1)"
echo

# ---------------------------------------------------------------- (a) a typical run
$q generate --out "$work/a" --name TYP --injections 150 --analytes 30 --replicates 3 >/dev/null
times=(); vtimes=()
for i in 1 2 3 4 5; do
  timed $q --version; vtimes+=("$WALL_MS")
  timed $q process "$work/a/TYP.csv" --method "$work/a/TYP-method.yaml" --out "$work/a/out$i"; times+=("$WALL_MS")
done
tv=$(median "${vtimes[@]}"); tp=$(median "${times[@]}")
echo "(a) typical run (150 x 30 x 3 = 13,500 readings), median of 5:"
echo "    quantrun --version   ${tv} ms"
echo "    quantrun process     ${tp} ms (all outputs, HTML report included)"
awk -v p="$tp" -v v="$tv" 'BEGIN {printf "    ratio                %.2f (goal <= 1.5)\n", p / v}'
echo "    where one such run spends its time (QUANTRUN_TRACE_STARTUP=1):"
{ QUANTRUN_TRACE_STARTUP=1 $q process "$work/a/TYP.csv" --method "$work/a/TYP-method.yaml" --out "$work/a/trace" \
  2>&1 >/dev/null || true; } | sed 's/^/    /'
echo

# ---------------------------------------------------------------- (b) and growth
if [ "$quick" = quick ]; then sizes="50000 100000 200000 400000"; else sizes="250000 500000 1000000 2000000"; fi
echo "(b) large runs, 70 lines x 3 readings, -Xmx512m, CSV and JSON outputs, full optimiser at every size:"
printf '    %10s %10s %9s %10s %13s %10s %8s\n' readings injections MB wall_ms "readings/s" MB/s peak_MB
prev=""
growth=()
for n in $sizes; do
  inj=$(( n / 210 ))
  $q generate --out "$work/b$n" --name BIG --injections "$inj" --analytes 70 --replicates 3 >/dev/null
  bytes=$(stat -c %s "$work/b$n/BIG.csv")
  QUANTRUN_JIT=full QUANTRUN_JAVA_OPTS=-Xmx512m run $q process "$work/b$n/BIG.csv" --method "$work/b$n/BIG-method.yaml" \
    --out "$work/b$n/out" --formats csv,json
  readings=$(( inj * 210 ))
  awk -v r="$readings" -v i="$inj" -v b="$bytes" -v t="$WALL_MS" -v k="$PEAK_KB" \
    'BEGIN {printf "    %10d %10d %9.1f %10d %13.0f %10.1f %8.0f\n", r, i, b/1e6, t, r/(t/1000), b/1e6/(t/1000), k/1024}'
  if [ -n "$prev" ]; then growth+=("$(awk -v a="$prev" -v b="$WALL_MS" 'BEGIN {printf "%.2f", b / a}')"); fi
  prev=$WALL_MS
  rm -rf "$work/b$n"
done
echo "    time per doubling: ${growth[*]} (goal: each <= 2.2)"
echo

# ---------------------------------------------------------------- (c) an archive
if [ "$quick" = quick ]; then count=100; else count=1000; fi
mkdir -p "$work/c/in"
$q generate --out "$work/c" --name ARC --injections 150 --analytes 30 --replicates 3 >/dev/null
for i in $(seq -w 1 "$count"); do
  # each a file of its own (the run id comes from the file name)
  cp "$work/c/ARC.csv" "$work/c/in/ARC$i.csv"
done
run $q process "$work/c/in"/*.csv --method "$work/c/ARC-method.yaml" --out "$work/c/out" --formats csv,json
echo "(c) archive of $count typical runs in one invocation, CSV and JSON outputs:"
awk -v n="$count" -v t="$WALL_MS" -v k="$PEAK_KB" \
  'BEGIN {printf "    %d ms, %.1f runs/s (goal >= 100 on 2 cores), peak %.0f MB\n", t, n/(t/1000), k/1024}'
