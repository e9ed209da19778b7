#!/bin/sh
# Benchmark: wall time of chairwise-calc answering one document (target < 10 ms), median of 50 runs.
calc="$CHAIRWISE_CALC"
demo="$CHAIRWISE_DATADIR/demo.json"
times=""
for i in $(seq 1 50); do
  s=$(date +%s%N)
  "$calc" analyze "$demo" >/dev/null || { echo "not ok 1 - analyze failed"; exit 1; }
  e=$(date +%s%N)
  times="$times $(( (e - s) / 1000 ))"
done
median=$(echo $times | tr ' ' '\n' | sort -n | sed -n 25p)
echo "1..1"
if [ "$median" -lt 10000 ]; then ok=ok; else ok="not ok"; fi
echo "$ok 1 - chairwise-calc analyze DOC: median $median µs wall over 50 runs; target 10000 µs"
