# Shared TAP helpers for the command-line tests; the caller sets $out and $err (file paths).
fail=0
n=0
check () { # name, expected exit code, command...
  name=$1; want=$2; shift 2
  n=$((n + 1))
  "$@" >"$out" 2>"$err"
  got=$?
  if [ "$got" -ne "$want" ]; then
    echo "not ok $n - $name (exit $got, wanted $want)"; cat "$err"; fail=1
  else
    echo "ok $n - $name"
  fi
}
contains () { # name, file, text
  n=$((n + 1))
  if grep -q -- "$3" "$2"; then echo "ok $n - $1"; else echo "not ok $n - $1: no '$3'"; cat "$2"; fail=1; fi
}
