#!/bin/sh
# chairwise-calc draw and report: formats by extension, sizes, content, and clean failures.
# Reference: methylcyclohexane ΔG° = G(chair 2) − G(chair 1) = −1.74 kcal/mol (chair 1 has Me
# axial), A(Me) derived from Booth & Everett, J. Chem. Soc., Perkin Trans. 2 1980, 255.
set -u
calc="$CHAIRWISE_CALC"
demo="$CHAIRWISE_DATADIR/demo.json"
dir=$(mktemp -d)
trap 'rm -rf "$dir"' EXIT
fail=0
n=0
ok () { n=$((n + 1)); echo "ok $n - $1"; }
bad () { n=$((n + 1)); echo "not ok $n - $1"; fail=1; }
check () { # name, expected exit code, command...
  name=$1; want=$2; shift 2
  "$@" >"$dir/out" 2>"$dir/err"
  got=$?
  if [ "$got" -eq "$want" ]; then ok "$name"; else bad "$name (exit $got, wanted $want)"; cat "$dir/err"; fi
}
contains () { # name, file, text
  if grep -q -- "$3" "$2"; then ok "$1"; else bad "$1: no '$3'"; cat "$2"; fi
}

for fig in structure chairs profile scan; do
  for ext in png svg pdf; do
    check "draw $fig .$ext" 0 "$calc" draw "$demo" --figure "$fig" -o "$dir/$fig.$ext"
    if [ -s "$dir/$fig.$ext" ]; then ok "$fig.$ext written"; else bad "$fig.$ext written"; fi
  done
  if xmllint --noout "$dir/$fig.svg"; then ok "$fig.svg is well-formed XML"; else bad "$fig.svg is well-formed XML"; fi
  if pdftoppm -png -r 20 -singlefile "$dir/$fig.pdf" "$dir/$fig-ras" && [ -s "$dir/$fig-ras.png" ]; then
    ok "$fig.pdf rasterises"; else bad "$fig.pdf rasterises"; fi
done

# PNG size follows --dpi: pixels = points × dpi / 72, so 144 dpi is exactly twice 72 dpi.
check "chairs at 72 dpi" 0 "$calc" draw --ring "1u=methyl" -f chairs -o "$dir/c72.png" --dpi 72
check "chairs at 144 dpi" 0 "$calc" draw --ring "1u=methyl" -f chairs -o "$dir/c144.png" --dpi 144
w72=$(od -An -tu1 -j16 -N4 "$dir/c72.png" | awk '{print $1*16777216+$2*65536+$3*256+$4}')
w144=$(od -An -tu1 -j16 -N4 "$dir/c144.png" | awk '{print $1*16777216+$2*65536+$3*256+$4}')
if [ "$w72" -gt 100 ] && [ $((w72 * 2)) -eq "$w144" ]; then ok "PNG width doubles with dpi ($w72, $w144)"
else bad "PNG width doubles with dpi ($w72, $w144)"; fi

check "report" 0 "$calc" report --ring "1u=methyl" -t 25C -o "$dir/report.pdf"
pdftotext "$dir/report.pdf" "$dir/report.txt"
contains "report ΔG°" "$dir/report.txt" "−1.74"
contains "report caution" "$dir/report.txt" "confirm by experiment"
check "report letter" 0 "$calc" report "$demo" --paper letter -o "$dir/letter.pdf"
pdfinfo "$dir/letter.pdf" >"$dir/info"
contains "letter page" "$dir/info" "612 x 792"

# Failures: a clear message, the right exit code, and no file left behind.
before=$(ls "$dir" | wc -l)
check "unknown extension" 2 "$calc" draw "$demo" -f chairs -o "$dir/chairs.jpg"
contains "names the file" "$dir/err" "chairs.jpg"
check "unknown figure" 2 "$calc" draw "$demo" -f boat -o "$dir/x.png"
contains "names the figure" "$dir/err" "boat"
check "missing --figure" 2 "$calc" draw "$demo" -o "$dir/x.png"
check "unwritable path" 1 "$calc" draw "$demo" -f chairs -o "$dir/no/such/dir/chairs.png"
contains "says where" "$dir/err" "chairs.png"
check "report not pdf" 2 "$calc" report "$demo" -o "$dir/report.png"
check "bad paper" 2 "$calc" report "$demo" --paper a3 -o "$dir/r.pdf"
check "report unwritable" 1 "$calc" report "$demo" -o "$dir/no/r.pdf"
after=$(ls "$dir" | wc -l)
# out and err are rewritten, not added: the count must not grow.
if [ "$after" -eq "$before" ]; then ok "nothing left behind"; else bad "nothing left behind"; ls -la "$dir"; fi

echo "1..$n"
exit $fail
