#!/bin/sh
# Runs a libFuzzer harness once over every file in the given directories (seeds and past crash
# inputs). Files, not directories, are passed, so libFuzzer writes nothing into the tree.
set -u
exe=$1
shift
list=$(mktemp)
trap 'rm -f "$list"' EXIT
for dir in "$@"; do
  [ -d "$dir" ] && find "$dir" -type f ! -name '*.md' ! -name 'README*' | sort >>"$list"
done
count=$(wc -l <"$list")
if [ "$count" -eq 0 ]; then
  echo "no inputs in $*" >&2
  exit 1
fi
# One process for all inputs; xargs would split a very long list, which is fine too.
tr '\n' '\0' <"$list" | xargs -0 "$exe" -runs=1 >/dev/null 2>"$list.err"
status=$?
if [ "$status" -ne 0 ]; then
  cat "$list.err" >&2
fi
echo "$count inputs, exit $status"
rm -f "$list.err"
exit "$status"
