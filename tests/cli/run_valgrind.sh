#!/bin/sh
# run_valgrind.sh — valgrind memcheck over the batch path of the real binary: a scan with
# one worker and a scan with two, every worker and page process followed, on a small sample
# of corpus documents (four producers, the two-page demo report, a truncated file that must
# fail with a reason). Fails on any memcheck error or leak (definite or possible) in
# any process; tests/valgrind.supp names the only suppressions, all third-party.
#   tests/cli/run_valgrind.sh PLOTPROOF
set -u
bin="$1"
cd "$(dirname "$0")/../.."
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
supp="--suppressions=$PWD/tests/valgrind.supp"
# GLib's own suppression file (libglib2.0-dev): its type system and caches, third-party too.
[ -f /usr/share/glib-2.0/valgrind/glib.supp ] &&
  supp="$supp --suppressions=/usr/share/glib-2.0/valgrind/glib.supp"
head -c 3000 corpus/gnuplot/gp_multiplot.pdf >"$tmp/truncated.pdf"
start=$(date +%s)
status=0

run() { # $1 = name, $2 = jobs, $3 = exit codes allowed (regex), rest = documents
  name=$1 jobs=$2 allowed=$3
  shift 3
  mkdir -p "$tmp/$name"
  # --page-seconds: valgrind runs code 20-50 times slower; the page budget must not fire.
  valgrind --trace-children=yes --error-exitcode=99 --leak-check=full \
    --errors-for-leak-kinds=definite,possible $supp --log-file="$tmp/$name/vg.%p.log" \
    "$bin" scan -q --no-config --jobs "$jobs" --page-seconds 600 --timeout 1200 \
    -o "$tmp/$name/out" "$@" 2>"$tmp/$name/stderr"
  rc=$?
  logs=$(ls "$tmp/$name"/vg.*.log | wc -l)
  # every process must end with a clean summary (one that never got there also fails)
  bad=$(grep -L "ERROR SUMMARY: 0 errors" "$tmp/$name"/vg.*.log)
  if [ -n "$bad" ] || ! echo "$rc" | grep -qx "$allowed"; then
    echo "valgrind: $name: FAILED (exit $rc, $logs processes)"
    cat "$tmp/$name/stderr"
    for f in $bad; do grep -v "^==[0-9]*== *$" "$f" | head -100; done
    status=1
  else
    echo "valgrind: $name: $# documents, $logs processes, no memcheck error, exit $rc"
  fi
}

run one-worker 1 "[01]" corpus/r/r_labels_1_liar.pdf corpus/libreoffice/lo_col_thousands_mild.pdf \
  corpus/demo/larchwood-horizon-kid-2031.pdf
# exit 3: the truncated file fails with a reason, the others are scanned
run two-workers 2 3 corpus/matplotlib/circ_gauge.pdf corpus/cairo/cc_cycle_diagram.pdf \
  "$tmp/truncated.pdf"
grep -q '"status":"failed"' "$tmp/two-workers/out/batch.jsonl" ||
  { echo "valgrind: the truncated file has no failure record"; status=1; }
echo "valgrind: $(($(date +%s) - start)) s"
exit $status
