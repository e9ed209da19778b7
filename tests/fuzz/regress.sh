#!/bin/sh
# TAP: runs a libFuzzer harness once on each file of its seed corpus, of regress-NAME/ (inputs that
# once broke it and must not again) and of pending-NAME/ (inputs that still break it, reported and
# awaiting a fix: TAP TODO, so a fix shows up as an unexpected pass; then move the file to
# regress-NAME/). Files, not directories, are passed, so libFuzzer writes nothing into the tree.
# Usage: regress.sh HARNESS SOURCE_DIR NAME
set -u
exe=$1
src=$2
name=$3
n=0
fail=0
err=$(mktemp)
trap 'rm -f "$err"' EXIT
for kind in corpus regress pending; do
  dir="$src/$kind-$name"
  [ -d "$dir" ] || continue
  for f in $(find "$dir" -type f ! -name 'README*' | sort); do
    n=$((n + 1))
    "$exe" -runs=1 "$f" >/dev/null 2>"$err"
    status=$?
    label="$kind-$name/$(basename "$f")"
    if [ "$kind" = pending ]; then
      if [ "$status" -eq 0 ]; then
        echo "ok $n - $label # TODO fixed? move it to regress-$name/"
      else
        echo "not ok $n - $label # TODO known problem, reported (exit $status)"
      fi
    elif [ "$status" -eq 0 ]; then
      echo "ok $n - $label"
    else
      echo "not ok $n - $label (exit $status)"
      grep -a -m 20 "fuzz check failed\|ERROR\|runtime error\|#[0-9] " "$err" | sed 's/^/# /'
      fail=1
    fi
  done
done
if [ "$n" -eq 0 ]; then
  echo "1..0 # SKIP no inputs for $name"
  exit 0
fi
echo "1..$n"
exit $fail
