#!/bin/sh
# chairwise-calc against bad input, one row per class: each must end with the documented exit code
# (1 file or analysis error, 2 usage error), no crash, and a message on stderr that names what was
# wrong and where. The expectations follow the format rules in cw-document.h and the exit codes in
# chairwise-calc --help, not stored outputs.
set -u
calc="$CHAIRWISE_CALC"
data="$CHAIRWISE_DATADIR"
tmp=$(mktemp -d "${TMPDIR:-/tmp}/cw-cli-bad.XXXXXX")
trap 'chmod -R u+rwx "$tmp" 2>/dev/null; rm -rf "$tmp"' EXIT
fail=0
n=0

# bad NAME WANT NEEDLE1 NEEDLE2 COMMAND...: exit code WANT, stderr contains both needles ("" = none),
# and no sanitizer, valgrind or GLib critical report.
bad () {
  name=$1; want=$2; n1=$3; n2=$4; shift 4
  n=$((n + 1))
  "$@" >"$tmp/out" 2>"$tmp/err"
  got=$?
  why=""
  [ "$got" -eq "$want" ] || why="exit $got, wanted $want"
  for needle in "$n1" "$n2"; do
    [ -z "$needle" ] || grep -q -F -- "$needle" "$tmp/err" || why="$why; stderr lacks '$needle'"
  done
  if grep -q -E "CRITICAL|runtime error|AddressSanitizer|LeakSanitizer|Segmentation" "$tmp/err"; then
    why="$why; crash report on stderr"
  fi
  if [ -z "$why" ]; then
    echo "ok $n - $name"
  else
    echo "not ok $n - $name: $why"
    sed 's/^/# /' "$tmp/err"
    fail=1
  fi
}

hdr='{"format":"chairwise-document","version":1,'
doc () { # FILE, JSON
  printf '%s' "$2" >"$tmp/$1"
}

# --- truncated and invalid JSON
head -c 200 "$data/demo.json" >"$tmp/truncated.json"
bad "truncated document" 1 "$tmp/truncated.json" "invalid JSON at line" "$calc" analyze "$tmp/truncated.json"
printf '{\n "format": "chairwise-document",\n "version": 1,\n "substituents": [}\n' >"$tmp/line4.json"
bad "invalid JSON names line 4" 1 "line 4" "$tmp/line4.json" "$calc" analyze "$tmp/line4.json"
doc empty.json ""
bad "empty file" 1 "$tmp/empty.json" "invalid JSON" "$calc" analyze "$tmp/empty.json"
doc nan.json "$hdr\"temperature_k\":NaN,\"substituents\":[]}"
bad "NaN literal" 1 "$tmp/nan.json" "NaN" "$calc" analyze "$tmp/nan.json"

# --- wrong types and missing fields
doc type.json "$hdr\"temperature_k\":\"hot\",\"substituents\":[]}"
bad "temperature is a string" 1 "$tmp/type.json" "“temperature_k”" "$calc" analyze "$tmp/type.json"
doc type2.json "$hdr\"substituents\":[{\"position\":\"2\",\"face\":\"up\",\"group\":\"methyl\"}]}"
bad "position is a string" 1 "substituent 1" "“position”" "$calc" analyze "$tmp/type2.json"
doc missing.json "$hdr\"substituents\":[{\"position\":2,\"group\":\"methyl\"}]}"
bad "face missing" 1 "substituent 1" "“face” is missing" "$calc" analyze "$tmp/missing.json"
doc nosubs.json "$hdr\"title\":\"x\"}"
bad "substituents missing" 1 "$tmp/nosubs.json" "“substituents”" "$calc" analyze "$tmp/nosubs.json"

# --- unknown groups, three groups on a carbon, duplicate slots
doc unknown.json "$hdr\"substituents\":[{\"position\":1,\"face\":\"up\",\"group\":\"methyl\"},{\"position\":2,\"face\":\"up\",\"group\":\"zz\"}]}"
bad "unknown group in a document" 1 "substituent 2" "“zz”" "$calc" analyze "$tmp/unknown.json"
bad "unknown group in --ring" 2 "--ring" "“zz”" "$calc" analyze --ring "1u=methyl 2u=zz"
doc three.json "$hdr\"substituents\":[{\"position\":1,\"face\":\"up\",\"group\":\"methyl\"},{\"position\":1,\"face\":\"down\",\"group\":\"methyl\"},{\"position\":1,\"face\":\"up\",\"group\":\"ethyl\"}]}"
bad "three groups on C1 (document)" 1 "substituent 3" "position 1 already" "$calc" analyze "$tmp/three.json"
bad "three groups on C1 (--ring)" 2 "“1u=chloro”" "position 1 already" "$calc" analyze --ring "1u=methyl 1d=ethyl 1u=chloro"
bad "same slot twice (--ring)" 2 "“4d=methyl”" "down face" "$calc" analyze --ring "4d=methyl 4d=methyl"

# --- NaN, infinities, negative and huge numbers
doc inf.json "$hdr\"temperature_k\":1e999,\"substituents\":[]}"
bad "temperature 1e999 in a document" 1 "“temperature_k”" "finite" "$calc" analyze "$tmp/inf.json"
doc hugeA.json "$hdr\"custom_groups\":[{\"id\":\"q\",\"a_kcal_mol\":1e300,\"sigma_kcal_mol\":0}],\"substituents\":[]}"
bad "custom A-value 1e300" 1 "custom group 1" "A-value" "$calc" analyze "$tmp/hugeA.json"
doc negpos.json "$hdr\"substituents\":[{\"position\":-1,\"face\":\"up\",\"group\":\"methyl\"}]}"
bad "negative position" 1 "substituent 1" "“position”" "$calc" analyze "$tmp/negpos.json"
bad "--temperature nan" 2 "--temperature" "“nan”" "$calc" analyze --ring 1u=methyl -t nan
bad "--temperature inf" 2 "--temperature" "“inf”" "$calc" analyze --ring 1u=methyl -t inf
bad "--temperature 1e999K" 2 "--temperature" "“1e999K”" "$calc" analyze --ring 1u=methyl -t 1e999K
bad "scan step NaN" 2 "“nanK”" "step" "$calc" scan --ring 1u=methyl --step nanK
bad "scan step negative" 2 "“-5K”" "step" "$calc" scan --ring 1u=methyl --step -5K
bad "scan step zero" 2 "“0K”" "step" "$calc" scan --ring 1u=methyl --step 0K
bad "scan with a million steps" 2 "steps" "" "$calc" scan --ring 1u=methyl --from 1K --to 1000K --step 0.0001K

# --- temperatures at or below 0 K and above 1000 K
bad "0 K" 2 "“0K”" "absolute zero" "$calc" analyze --ring 1u=methyl -t 0K
bad "-273.15 °C" 2 "“-273.15 °C”" "absolute zero" "$calc" analyze --ring 1u=methyl -t "-273.15 °C"
bad "-500 C" 2 "“-500C”" "absolute zero" "$calc" analyze --ring 1u=methyl -t -500C
bad "1000.5 K" 2 "“1000.5K”" "1000 K" "$calc" analyze --ring 1u=methyl -t 1000.5K
bad "800 °C" 2 "“800C”" "1000 K" "$calc" analyze --ring 1u=methyl -t 800C
bad "scan up to 2000 K" 2 "2000K" "" "$calc" scan --ring 1u=methyl --to 2000K
doc cold.json "$hdr\"temperature_k\":-1,\"substituents\":[]}"
bad "document at -1 K" 1 "“temperature_k”" "absolute zero" "$calc" analyze "$tmp/cold.json"

# --- a 50 MB document, non-UTF-8 text
truncate -s 50000000 "$tmp/big.json"
bad "50 MB document" 1 "$tmp/big.json" "50.0 MB" "$calc" analyze "$tmp/big.json"
printf '%s"title":"caf\351","substituents":[]}' "$hdr" >"$tmp/latin1.json"
bad "Latin-1 title" 1 "$tmp/latin1.json" "not valid UTF-8 text (at byte 55)" "$calc" analyze "$tmp/latin1.json"
printf '\377\376{\000}\000' >"$tmp/utf16.json"
bad "UTF-16 document" 1 "$tmp/utf16.json" "UTF-8" "$calc" analyze "$tmp/utf16.json"
bad "Latin-1 in --ring" 2 "the value of --ring is not valid UTF-8" "" "$calc" analyze --ring "$(printf '1u=caf\351')"
bad "Latin-1 in --smiles=" 2 "the value of --smiles is not valid UTF-8" "" "$calc" isomers --smiles="$(printf 'CC1CCC(C\351)CC1')"
# a drawing goes to its file: output formats of the text commands are not offered
bad "--json on draw" 2 "--json" "draw --help" "$calc" draw --ring 1u=methyl --figure chairs --json -o "$tmp/x.png"
bad "--csv on report" 2 "--csv" "report --help" "$calc" report --ring 1u=methyl --csv -o "$tmp/x.pdf"

# --- files that are not documents, or cannot be read
bad "a folder" 1 "$tmp" "directory" "$calc" analyze "$tmp"
bad "a missing file" 1 "$tmp/none.json" "" "$calc" analyze "$tmp/none.json"
mkdir "$tmp/locked"
cp "$data/demo.json" "$tmp/locked/demo.json"
chmod 000 "$tmp/locked"
if [ "$(id -u)" -ne 0 ]; then
  bad "a folder without permission" 1 "$tmp/locked/demo.json" "ermission denied" "$calc" analyze "$tmp/locked/demo.json"
elif command -v setpriv >/dev/null && setpriv --reuid=65534 --regid=65534 --clear-groups "$calc" --version >/dev/null 2>&1; then
  # root ignores permissions: read as the unprivileged user nobody
  bad "a folder without permission" 1 "$tmp/locked/demo.json" "ermission denied" \
    setpriv --reuid=65534 --regid=65534 --clear-groups "$calc" analyze "$tmp/locked/demo.json"
else
  n=$((n + 1)); echo "ok $n - a folder without permission # SKIP root and no setpriv"
fi
chmod 700 "$tmp/locked"

# --- broken data tables: the message names the table file
mkdir "$tmp/data"
cp "$data/interactions.json" "$tmp/data/"
head -c 500 "$data/groups.json" >"$tmp/data/groups.json"
bad "truncated groups table" 1 "$tmp/data/groups.json" "invalid JSON at line" "$calc" analyze --data-dir "$tmp/data" --ring 1u=methyl
sed 's/"version": 1/"version": 9/' "$data/groups.json" >"$tmp/data/groups.json"
bad "groups table from a newer version" 1 "$tmp/data/groups.json" "newer" "$calc" analyze --data-dir "$tmp/data" --ring 1u=methyl

# --- a document from a newer format version
doc newer.json '{"format":"chairwise-document","version":2,"substituents":[],"rings":[]}'
bad "newer document" 1 "$tmp/newer.json" "format version 2 is newer" "$calc" analyze "$tmp/newer.json"

# --- output that cannot be written, and files that are not regular files
n=$((n + 1))
"$calc" analyze --ring 1u=methyl >/dev/full 2>"$tmp/err"
got=$?
if [ "$got" -ne 0 ] && [ -s "$tmp/err" ]; then
  echo "ok $n - output to a full disk (/dev/full) fails with a message"
else
  echo "not ok $n - output to a full disk (/dev/full) fails with a message (exit $got)"; fail=1
fi
n=$((n + 1))
mkfifo "$tmp/pipe.json"
timeout 5 "$calc" analyze "$tmp/pipe.json" >/dev/null 2>"$tmp/err"
got=$?
if [ "$got" -eq 1 ] && grep -q -F "$tmp/pipe.json" "$tmp/err"; then
  echo "ok $n - a named pipe is refused"
else
  echo "not ok $n - a named pipe is refused (exit $got)"; fail=1
fi

echo "1..$n"
exit $fail
