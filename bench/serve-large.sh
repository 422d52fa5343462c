#!/usr/bin/env bash
# Upload-to-report time of a large generated model through `swaygate serve`,
# and the peak RSS of the server process (GNU time -v).
#
#   bench/serve-large.sh [TARGET_MB]      (default 300)
#
# SWAYGATE_BIN=path uses a built binary instead of building one.
# Writes bench/out/serve-large/ (ignored by git): the model, the data
# directory, the server's log and time -v output, and the report.
set -euo pipefail
cd "$(dirname "$0")/.."

MB="${1:-300}"
OUT=bench/out/serve-large
MODEL="$OUT/model-${MB}mb.ifc"
DATA="$OUT/data"
mkdir -p "$OUT"
BIN="${SWAYGATE_BIN:-}"
if [ -z "$BIN" ]; then
  BIN="$OUT/swaygate"
  go build -o "$BIN" ./cmd/swaygate
fi
if [ ! -f "$MODEL" ]; then
  "$BIN" generate --target-mb "$MB" --out "$MODEL"
fi
rm -rf "$DATA"

PORT=$(( 20000 + RANDOM % 20000 ))
/usr/bin/time -v -o "$OUT/time.txt" "$BIN" serve --addr "127.0.0.1:$PORT" --data "$DATA" \
  --max-upload 4GiB --check-timeout 30m 2> "$OUT/server.log" &
TIME_PID=$!
trap 'kill $TIME_PID 2>/dev/null || true' EXIT

for _ in $(seq 1 100); do
  curl -fs "http://127.0.0.1:$PORT/readyz" >/dev/null 2>&1 && break
  sleep 0.1
done

SIZE=$(stat -c %s "$MODEL")
echo "model: $MODEL ($SIZE bytes)"
for run in 1 2; do
  curl -s -o "$OUT/report.json" -w "run $run: HTTP %{http_code}, upload-to-report %{time_total} s (upload %{size_upload} bytes, report %{size_download} bytes)\n" \
    -H 'Content-Type: application/x-step' --data-binary "@$MODEL" \
    "http://127.0.0.1:$PORT/v1/checks?project=bench&trace=summary&name=$(basename "$MODEL")"
done
grep -o '"summary":{[^}]*}' "$OUT/report.json" || true

# Stop the server (the child of time) and let time report.
SERVER_PID=$(pgrep -P "$TIME_PID" || true)
[ -n "$SERVER_PID" ] && kill -TERM "$SERVER_PID"
wait "$TIME_PID" || true
trap - EXIT
grep -E 'Maximum resident set size|Elapsed \(wall clock\)' "$OUT/time.txt"
awk -v size="$SIZE" '/Maximum resident set size/ { printf "peak RSS / model size: %.2f\n", $NF * 1024 / size }' "$OUT/time.txt"
