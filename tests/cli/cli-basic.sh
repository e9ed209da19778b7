#!/bin/sh
# chairwise-calc end to end: outputs, exit codes and error messages.
# Reference values: methylcyclohexane ΔG° = −1.74 kcal/mol, A(Me) from Booth & Everett,
# J. Chem. Soc., Perkin Trans. 2 1980, 255 (published, read).
set -u
calc="$CHAIRWISE_CALC"
demo="$CHAIRWISE_DATADIR/demo.json"
out=/tmp/cw-cli-out.$$
err=/tmp/cw-cli-err.$$
. "$(dirname "$0")/tap.sh"
check "analyze demo" 0 "$calc" analyze "$demo"
contains "caution in text output" /tmp/cw-cli-out.$$ "confirm by experiment"
check "analyze --json" 0 "$calc" analyze --ring "1u=methyl" --json
contains "json delta_g" /tmp/cw-cli-out.$$ '"delta_g_kcal_mol":	-1.74'
contains "json caution" /tmp/cw-cli-out.$$ '"caution"'
check "analyze --csv kJ" 0 "$calc" analyze --ring "1u=methyl" --csv --units kJ
contains "csv header" /tmp/cw-cli-out.$$ "delta_g_kcal_mol"
check "temperature in C" 0 "$calc" analyze --ring "1u=isopropyl" -t "-78 °C"
contains "shows -78" /tmp/cw-cli-out.$$ "-78.0 °C"
check "scan" 0 "$calc" scan "$demo" --from -100C --to 0C --step 50C
n=$((n + 1))
if [ "$(grep -c '^[0-9]' /tmp/cw-cli-out.$$)" -eq 3 ]; then echo "ok $n - scan rows"; else echo "not ok $n - scan rows"; fail=1; fi
check "groups" 0 "$calc" groups
contains "groups list tBu" /tmp/cw-cli-out.$$ "tert-butyl"
check "bad temperature" 2 "$calc" analyze "$demo" -t "-300C"
contains "names the temperature" /tmp/cw-cli-err.$$ "-300C"
check "missing file" 1 "$calc" analyze /nonexistent/x.json
contains "names the file" /tmp/cw-cli-err.$$ "/nonexistent/x.json"
check "unknown group" 2 "$calc" analyze --ring "1u=unobtainium"
contains "names the group" /tmp/cw-cli-err.$$ "unobtainium"
check "two sources" 2 "$calc" analyze "$demo" --ring "1u=methyl"
check "unknown command" 2 "$calc" frobnicate
check "unknown option" 2 "$calc" analyze --frob
check "help" 0 "$calc" --help
rm -f /tmp/cw-cli-out.$$ /tmp/cw-cli-err.$$
echo "1..$n"
exit $fail
