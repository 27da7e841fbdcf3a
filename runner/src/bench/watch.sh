#!/usr/bin/env bash
# Benchmark of 'quantrun watch', in plain shell and the JDK: it generates a typical run with
# 'quantrun generate', starts the watch service on an empty inbox, drops copies of the run into it
# (each with its own content: a line after the export's footer), and prints its figures.
#
#   mvn -B -q package -DskipTests && runner/src/bench/watch.sh [quick]
#
# Figures (goals in brackets), every output written, HTML report included:
#   (a) latency: from the end of a file's last write to its results folder appearing, one file at
#       a time, after a warm-up [<= quiet period + 1 s]
#   (b) throughput: N files dropped at once; files per second from the first results folder to
#       the last [>= 10 files/s on 2 cores]
# 'quick' drops fewer files (for trying the script, not for the figures).
set -euo pipefail
cd "$(dirname "$0")/../../.."
q=./quantrun
[ -f runner/target/quantrun.jar ] || { echo "build first: mvn -B -q package -DskipTests" >&2; exit 2; }
work=$(mktemp -d "${TMPDIR:-/tmp}/quantrun-watch-bench.XXXXXX")
pid=""
cleanup() { if [ -n "$pid" ]; then kill -TERM "$pid" 2>/dev/null || true; wait "$pid" 2>/dev/null || true; fi; rm -rf "$work"; }
trap cleanup EXIT
quick=${1:-}
quiet=${QUIET:-2s}
if [ "$quick" = quick ]; then count=40; latencies=3; else count=300; latencies=7; fi
export QUANTRUN_LOG_DIR="$work/logs"

now_ms() { date +%s%3N; }
# CPU time (user + system) the watch process has used, in ms
cpu_ms() { awk -v hz="$(getconf CLK_TCK)" '{print int(($14 + $15) * 1000 / hz)}' "/proc/$pid/stat"; }
median() { printf '%s\n' "$@" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
done_count() { find "$work/out" -mindepth 1 -maxdepth 1 -type d ! -name '.*' | wc -l; }
# make NAME: a copy of the typical run with its own content, in the staging folder (same file system)
make() { { cat "$work/g/TYP.csv"; echo "copy $1"; } > "$work/stage/$1.csv"; }

echo "quantrun watch benchmark"
echo "machine: $(nproc) cores, $(awk '/MemTotal/ {printf "%.0f GiB", $2/1048576}' /proc/meminfo), $(java -version 2>&1 | head -n 1)"
$q generate --out "$work/g" --name TYP --injections 150 --analytes 30 --replicates 3 >/dev/null
echo "typical run: 150 injections x 30 lines x 3 readings, $(stat -c %s "$work/g/TYP.csv") bytes; quiet period $quiet"
mkdir -p "$work/inbox" "$work/stage" "$work/out"
$q watch "$work/inbox" --method "$work/g/TYP-method.yaml" --out "$work/out" --quiet-period "$quiet" \
  > "$work/watch.out" 2>&1 &
pid=$!
until grep -q "watching" "$work/watch.out" 2>/dev/null; do sleep 0.05; done

# warm-up: the JIT compiles the pipeline (its optimising compiler keeps working for a few hundred
# files; WARMUP sets how many files go through first)
warmup=${WARMUP:-200}
if [ "$quick" = quick ]; then warmup=${WARMUP:-20}; fi
for i in $(seq 1 "$warmup"); do make "W$i"; done
mv "$work/stage/"W*.csv "$work/inbox/"
until [ "$(done_count)" -ge "$warmup" ]; do sleep 0.05; done
echo "warm-up: $warmup files"

# ---------------------------------------------------------------- (a) latency
lat=()
for i in $(seq 1 "$latencies"); do
  # written straight into the inbox, as an instrument PC would; the clock starts when the write ends
  { cat "$work/g/TYP.csv"; echo "latency $i"; } > "$work/inbox/L$i.csv"
  t0=$(now_ms)
  until [ -d "$work/out/L$i" ]; do sleep 0.01; done
  lat+=($(( $(now_ms) - t0 )))
  sleep 0.3
done
echo "(a) latency, last write to results folder, ${#lat[@]} files one at a time:"
echo "    each: ${lat[*]} ms"
qms=$(awk -v q="$quiet" 'BEGIN { if (q ~ /ms$/) { sub(/ms$/, "", q); print q } else { sub(/s$/, "", q); print q * 1000 } }')
echo "    median $(median "${lat[@]}") ms, max $(printf '%s\n' "${lat[@]}" | sort -n | tail -1) ms (goal <= quiet period + 1 s = $(( qms + 1000 )) ms)"

# ---------------------------------------------------------------- (b) throughput
before=$(done_count)
for i in $(seq 1 "$count"); do make "T$i"; done
c0=$(cpu_ms)
t0=$(now_ms)
mv "$work/stage/"T*.csv "$work/inbox/"
first=""
while true; do
  n=$(( $(done_count) - before ))
  if [ -z "$first" ] && [ "$n" -ge 1 ]; then first=$(now_ms); fn=$n; fi
  if [ "$n" -ge "$count" ]; then last=$(now_ms); c1=$(cpu_ms); break; fi
  sleep 0.02
done
echo "(b) $count files dropped at once, every output (CSV, JSON, HTML report, audit):"
awk -v n="$count" -v fn="$fn" -v a="$first" -v b="$last" -v t0="$t0" 'BEGIN {
  printf "    first results after %d ms (quiet period included), all after %d ms\n", a - t0, b - t0
  printf "    sustained %.1f files/s from the first results folder to the last (goal >= 10 on 2 cores)\n", (n - fn) / ((b - a) / 1000) }'
awk -v n="$count" -v c="$(( c1 - c0 ))" -v l="$(awk '{print $1}' /proc/loadavg)" -v k="$(nproc)" 'BEGIN {
  printf "    CPU time of the service: %.0f ms per file, so %.1f files/s on 2 idle cores (load average now %s on %d cores)\n", c / n, 2000 / (c / n), l, k }'
kill -TERM "$pid"; wait "$pid" || true; pid=""
{ grep -c "failed:" "$work/watch.out" || true; } | awk '{ if ($1 > 0) print "    (" $1 " files failed: see the watch output)" }'
