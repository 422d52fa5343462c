#!/usr/bin/env bash
# Side-by-side figures of design §8 for the STEP reader, in one run:
#   1. `swaygate scan` of a generated 32 MiB model, whole process (hyperfine
#      if installed, else a loop of timed runs), against web-ifc 0.0.78
#      OpenModel of the same file (bench/webifc/open.js);
#   2. peak RSS (/usr/bin/time -v) of `swaygate scan` of a generated 300 MiB
#      model, and of `swaygate version` as the baseline;
#   3. `swaygate check --format json --trace summary` of the same models,
#      whole process after a warm-up run: time against web-ifc's open and
#      peak RSS against the file size (design §8).
# Models are generated into testdata/gen/ (git-ignored) on first use; web-ifc
# is installed into bench/out/ (git-ignored). Set SKIP_LARGE=1 to skip the
# 300 MiB model, RUNS to change the number of timed runs (default 10).
set -euo pipefail
cd "$(dirname "$0")/.."
runs="${RUNS:-10}"
out=bench/out
mkdir -p "$out" testdata/gen
go build -o "$out/swaygate" ./cmd/swaygate
sg="$out/swaygate"
m32=testdata/gen/bench-32mb.ifc
m300=testdata/gen/bench-300mb.ifc
[ -f "$m32" ] || "$sg" generate --target-mb 32 --out "$m32" >&2
if [ "${SKIP_LARGE:-0}" != 1 ] && [ ! -f "$m300" ]; then
  "$sg" generate --target-mb 300 --out "$m300" >&2
fi
bash bench/webifc/install.sh

echo "machine: $(nproc) cores, $(grep -m1 'model name' /proc/cpuinfo | cut -d: -f2 | sed 's/^ //'), $(go version | cut -d' ' -f3), node $(node --version)"
echo "model:   $m32 ($(stat -c %s "$m32") bytes)"

# ms of wall time of each run of a command, one per line
timed_runs() {
  local i t0 t1
  for ((i = 0; i < runs; i++)); do
    t0=$(date +%s%N)
    "$@" >/dev/null
    t1=$(date +%s%N)
    echo $(((t1 - t0) / 1000))
  done | sort -n | awk '{a[NR]=$1} END {printf "%.1f %.1f\n", a[1]/1000, a[int((NR+1)/2)]/1000}'
}

"$sg" scan "$m32" >/dev/null # warm the page cache
if command -v hyperfine >/dev/null; then
  hyperfine --warmup 2 --runs "$runs" --export-json "$out/scan32.json" "$sg scan $m32" >&2
  read -r scan_min scan_med < <(python3 -c "import json;r=json.load(open('$out/scan32.json'))['results'][0];t=sorted(r['times']);print('%.1f %.1f'%(t[0]*1e3,r['median']*1e3))")
else
  read -r scan_min scan_med < <(timed_runs "$sg" scan "$m32")
fi
echo "swaygate scan (whole process, $runs runs):   min ${scan_min} ms, median ${scan_med} ms"

webifc=$(node bench/webifc/open.js "$m32" "$runs")
echo "web-ifc 0.0.78 OpenModel ($runs opens in one process): $webifc"
read -r w_first w_min w_med < <(python3 -c "import json,sys;d=json.loads(sys.argv[1]);print(d['open_ms'][0],d['min_ms'],d['median_ms'])" "$webifc")
python3 -c "import sys
s=float(sys.argv[1]); f,m=float(sys.argv[2]),float(sys.argv[3])
print('ratio web-ifc open / swaygate scan (median): first open %.1fx, warm median %.1fx  (target >= 5x)'%(f/s, m/s))" "$scan_med" "$w_first" "$w_med"

rss() { { /usr/bin/time -v "$@" 2>&1 >/dev/null || true; } | awk -F: '/Maximum resident/ {gsub(/ /,"",$2); print $2}'; }
base=$(rss "$sg" version)
echo "peak RSS swaygate version: ${base} KiB"
if [ -f "$m300" ]; then
  size=$(stat -c %s "$m300")
  scan300=$(rss "$sg" scan "$m300")
  python3 -c "import sys
size,kib=int(sys.argv[1]),int(sys.argv[2])
print('peak RSS swaygate scan %s (%d bytes): %d KiB = %.2fx the file size (target <= 1.5x)'%(sys.argv[3],size,kib,kib*1024/size))" "$size" "$scan300" "$m300"
  read -r l_min l_med < <(runs=3 timed_runs "$sg" scan "$m300")
  echo "swaygate scan $m300 (whole process, 3 runs): min ${l_min} ms, median ${l_med} ms"
fi

# 3. The whole check, JSON report with the summary trace, to /dev/null.
chk() { "$sg" check "$1" --format json --trace summary -o /dev/null --progress never || [ $? -eq 1 ]; }
chk "$m32" # warm-up
read -r c_min c_med < <(timed_runs chk "$m32")
echo "swaygate check --format json --trace summary $m32 (whole process, $runs runs): min ${c_min} ms, median ${c_med} ms"
python3 -c "import sys
s=float(sys.argv[1]); f,m=float(sys.argv[2]),float(sys.argv[3])
print('ratio web-ifc open / swaygate check (median): first open %.1fx, warm median %.1fx  (target >= 4x)'%(f/s, m/s))" "$c_med" "$w_first" "$w_med"
size32=$(stat -c %s "$m32")
rss32=$(rss "$sg" check "$m32" --format json --trace summary -o /dev/null --progress never)
python3 -c "import sys
size,kib=int(sys.argv[1]),int(sys.argv[2])
print('peak RSS swaygate check (32 MiB): %d KiB = %.2fx the file size; target <= 2x file + 30 MB = %d KiB'%(kib,kib*1024/size,(2*size+30e6)/1024))" "$size32" "$rss32"
if [ -f "$m300" ]; then
  chk "$m300"
  read -r cl_min cl_med < <(runs=3 timed_runs chk "$m300")
  echo "swaygate check --format json --trace summary $m300 (whole process, 3 runs): min ${cl_min} ms, median ${cl_med} ms"
  rss300=$(rss "$sg" check "$m300" --format json --trace summary -o /dev/null --progress never)
  python3 -c "import sys
size,kib=int(sys.argv[1]),int(sys.argv[2])
print('peak RSS swaygate check (300 MiB): %d KiB = %.2fx the file size (target <= 1.5x)'%(kib,kib*1024/size))" "$size" "$rss300"
  if [ "${SKIP_WEBIFC_LARGE:-0}" != 1 ]; then
    wl=$(node bench/webifc/open.js "$m300" 1)
    echo "web-ifc 0.0.78 OpenModel $m300 (1 open): $wl"
  fi
fi
