#!/usr/bin/env bash
# The whole test suite: formatting, vet, every package's tests, and a bounded
# fuzz smoke run of the STEP reader. README.md gives this as the test command;
# CI (.ci/run) runs exactly this.
set -euo pipefail
cd "$(dirname "$0")/.."

FUZZTIME="${SWAYGATE_FUZZTIME:-45s}"

echo "== gofmt"
unformatted=$(gofmt -l $(git ls-files '*.go' 2>/dev/null || find . -name '*.go' -not -path './bench/*'))
if [ -n "$unformatted" ]; then
  echo "gofmt would change:"; echo "$unformatted"; exit 1
fi

echo "== go vet"
go vet ./...

echo "== go test"
go test -count=1 ./...

echo "== fuzz smoke (${FUZZTIME})"
if grep -q 'func FuzzParse' ifcstep/*_test.go 2>/dev/null; then
  go test ./ifcstep -run '^$' -fuzz '^FuzzParse$' -fuzztime "$FUZZTIME"
fi

echo "== all tests passed"
