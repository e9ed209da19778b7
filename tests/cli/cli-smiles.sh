#!/bin/sh
# chairwise-calc isomers and batch, end to end.
# Reference: the cis/trans dimethylcyclohexanes: trans-1,4 is the more stable isomer by about
# 1.9 kcal/mol in enthalpy (Beckett, Pitzer & Spitzer, J. Am. Chem. Soc. 1947, 69, 2488; from
# memory, unverified), so the trans isomer must come first and hold most of the equilibrium.
set -u
calc="$CHAIRWISE_CALC"
tmp=${TMPDIR:-/tmp}/cw-cli-smiles.$$
mkdir -p "$tmp"
trap 'rm -rf "$tmp"' EXIT
if ! "$calc" --help | grep -q "^  isomers" || ! "$calc" --help | grep -q "^  batch"; then
  echo "Bail out! isomers/batch are missing from the chairwise-calc command list"
  exit 1
fi
out="$tmp/out"
err="$tmp/err"
. "$(dirname "$0")/tap.sh"
check "isomers 1,4-dimethyl" 0 "$calc" isomers --smiles 'CC1CCC(C)CC1'
contains "trans first" "$tmp/out" "^1 *trans"
contains "method stated" "$tmp/out" "Rotational symmetry numbers are not included"
contains "caution" "$tmp/out" "confirm by experiment"
check "isomers --json" 0 "$calc" isomers --smiles 'CC1CCCCC1C' --json
contains "json isomers" "$tmp/out" '"configuration":	"trans"'
check "isomers bad SMILES" 1 "$calc" isomers --smiles 'C1CCCC'
contains "names the position" "$tmp/err" "character 2"
printf 'CC1CCCCC1 methylcyclohexane\nC1CC(CCCC1 broken\nC[C@H]1CC[C@H](C)CC1 trans\n' >"$tmp/in.smi"
check "batch with a bad line" 1 "$calc" batch "$tmp/in.smi" -o "$tmp/out.csv"
contains "bad line named" "$tmp/err" "line 2:"
contains "summary" "$tmp/err" "3 compounds in 3 lines"
n=$((n + 1))
if [ "$(wc -l <"$tmp/out.csv")" -eq 4 ]; then echo "ok $n - batch rows"; else echo "not ok $n - batch rows"; cat "$tmp/out.csv"; fail=1; fi
contains "trans row" "$tmp/out.csv" '^3,trans,C\[C@H\]1CC\[C@H\](C)CC1,trans,2,-3.48'
check "batch json from stdin" 0 sh -c "printf 'OC1CCCCC1\n' | '$calc' batch - --json -q"
contains "json results" "$tmp/out" '"results"'
check "batch missing file" 1 "$calc" batch "$tmp/none.smi"
check "batch no argument" 2 "$calc" batch
echo "1..$n"
exit $fail
