#!/usr/bin/env bash
# The large-input measurements of docs/reliability.md "Large inputs", one run at a time.
# Usage: tests/Parity.Benchmarks/Large/run.sh ROWS DIR   (e.g. 20000000 /tmp/large; 2000000 for a quick look)
# Makes DIR/wide.csv (seeded, about 150 bytes a row) and its Arrow IPC and Parquet copies unless they exist,
# then runs load_only.parity and ten_steps.parity on each file under legacy and modern with the Release CLI,
# one line per run: what, mode, wall clock, peak resident set size (KiB), exit status.
# Needs about 13 GiB free for 20M rows; run nothing else memory-hungry meanwhile.
set -euo pipefail
rows=${1:?rows}
dir=${2:?dir}
here=$(cd "$(dirname "$0")" && pwd)
repo=$(cd "$here/../../.." && pwd)
dotnet build -c Release "$repo/src/Parity.Cli" >/dev/null
dotnet build -c Release "$repo/tests/Parity.Benchmarks" >/dev/null
cli="$repo/src/Parity.Cli/bin/Release/net10.0/parity"
bench="$repo/tests/Parity.Benchmarks/bin/Release/net10.0/Parity.Benchmarks.dll"
mkdir -p "$dir"
cd "$dir"
[ -f wide.csv ] || dotnet "$bench" wide "$rows" wide.csv
[ -f wide.parquet ] && [ -f wide.arrow ] || dotnet "$bench" convert wide.csv
for f in csv parquet arrow; do
  sed "s/'wide.csv'/'wide.$f'/" "$here/load_only.parity" > "load_$f.parity"
  sed "s/'wide.csv'/'wide.$f'/" "$here/ten_steps.parity" > "ten_$f.parity"
done
run() { # script checkpoint mode
  /usr/bin/time -v "$cli" show "$1" --checkpoint "$2" --mode "$3" > "${1%.parity}_$3.out" 2> "${1%.parity}_$3.err" || true
  echo "${1%.parity} $3 $(grep -E 'Elapsed|Maximum resident|Exit status' "${1%.parity}_$3.err" | awk '{print $NF}' | tr '\n' ' ')"
}
for f in csv parquet arrow; do
  for m in legacy modern; do
    run "load_$f.parity" vessels $m
    run "ten_$f.parity" final $m
  done
done
