"""The one list of figure kinds (PP_FIGURE_KINDS, printed by emit_kinds) against every
other place that names kinds: the corpus truth tools (scripts/corpus/truth.py KINDS must
hold every figure kind), the accuracy script (its chart kinds and the thresholds'
not_gated_kinds must be figure kinds). The schema's list is checked in test_report.c.

usage: check_kinds.py EMIT_KINDS SOURCE_ROOT"""
import importlib.machinery
import importlib.util
import json
import os
import subprocess
import sys

emit, root = sys.argv[1], sys.argv[2]
kinds = subprocess.run([emit], check=True, capture_output=True, text=True).stdout.split()
failures = []
sys.path.insert(0, os.path.join(root, "scripts", "corpus"))
import truth  # noqa: E402

missing = set(kinds) - truth.KINDS
if missing:
    failures.append(f"truth.py KINDS lacks figure kinds {sorted(missing)}")
loader = importlib.machinery.SourceFileLoader("accuracy", os.path.join(root, "scripts", "accuracy"))
spec = importlib.util.spec_from_loader("accuracy", loader)
accuracy = importlib.util.module_from_spec(spec)
loader.exec_module(accuracy)
if not accuracy.CHART_KINDS <= set(kinds):
    failures.append(f"accuracy CHART_KINDS not figure kinds: {accuracy.CHART_KINDS - set(kinds)}")
with open(os.path.join(root, "scripts", "accuracy-thresholds.json")) as fh:
    ungated = set(json.load(fh).get("not_gated_kinds", []))
if not ungated <= set(kinds):
    failures.append(f"not_gated_kinds not figure kinds: {sorted(ungated - set(kinds))}")
for f in failures:
    print("FAIL:", f)
print(f"{len(kinds)} figure kinds checked")
sys.exit(1 if failures else 0)
