"""End-to-end: each stack segment's reading in `plotproof charts`, checked against the
data the matplotlib generator drew (corpus/lookalikes/stacked_labels_stretched: its
truth file holds the printed numbers as "values" and the drawn thicknesses as
"drawn_values", stack by stack from the baseline), never against plotproof's own output;
and its bars-vs-labels finding, one element per segment, valid against the findings
schema (python3-jsonschema, draft 2020-12).

usage: run_segments.py PLOTPROOF SOURCE_ROOT"""
import json
import os
import subprocess
import sys
import tempfile

try:
    import jsonschema
except ImportError:  # a visible skip (meson's exit code 77), never a silent pass
    print("SKIP: python3-jsonschema not installed")
    sys.exit(77)

PLOTPROOF, ROOT = os.path.abspath(sys.argv[1]), sys.argv[2]
PDF = os.path.join(ROOT, "corpus", "lookalikes", "stacked_labels_stretched.pdf")
# A reading is within half a percent of the axis span of what was drawn (under a pixel
# at 100 dpi on this chart; common practice, no source).
READ_TOL = 0.005
failures = []


def check(cond, what):
    if not cond:
        failures.append(what)
        print("FAIL:", what)


with open(PDF[:-4] + ".truth.json") as fh:
    truth = json.load(fh)["figures"][0]
out = subprocess.run([PLOTPROOF, "charts", PDF, "--page", "1"], capture_output=True,
                     text=True, check=True).stdout
figures = [f for f in json.loads(out)["figures"] if f["kind"] == "column"]
check(len(figures) == 1, f"one column figure, got {len(figures)}")
parts = [p for e in figures[0]["elements"] for p in e["parts"]] if figures else []
check(len(parts) == len(truth["values"]), f"{len(truth['values'])} segments, got {len(parts)}")
span = truth["axis"]["max"] - truth["axis"]["min"]
prev_top = {}
for i, (p, printed, drawn) in enumerate(zip(parts, truth["values"], truth["drawn_values"])):
    name = truth["labels"][i]
    check(p["role"] == "segment", f"{name}: role segment, got {p['role']}")
    check(p["label_value"] == printed, f"{name}: label {printed}, got {p['label_value']}")
    check(abs(p["scale_value"] - drawn) <= READ_TOL * span,
          f"{name}: scale value {drawn}, got {p['scale_value']}")
    check(abs(p["end"] - p["start"] - drawn) <= READ_TOL * span,
          f"{name}: end - start {drawn}, got {p['end'] - p['start']}")
    x0, y0, x1, y1 = p["box"]
    check(x0 < x1 and y0 < y1, f"{name}: a box with area")
    # segments of a stack touch: each one's bottom is the previous one's top
    stack = name.split(" of ")[1]
    if stack in prev_top:
        check(abs(y1 - prev_top[stack]) < 0.5, f"{name}: stands on the segment below it")
    prev_top[stack] = y0
    px0, py0, px1, py1 = p["pdf_box"]
    check(abs((py1 - py0) - (y1 - y0)) < 1e-6, f"{name}: pdf_box has the box's height")

# The finding: the top series is drawn 1.4 times its labels, so bars-vs-labels, one
# element per labelled segment, in a findings file the schema accepts.
with tempfile.TemporaryDirectory() as tmp:
    subprocess.run([PLOTPROOF, "scan", "-q", "-o", tmp, PDF], capture_output=True)
    with open(os.path.join(tmp, "stacked_labels_stretched.findings.json")) as fh:
        doc = json.load(fh)
findings = doc["findings"]
check([f["rule"] for f in findings] == ["bars-vs-labels"],
      f"one bars-vs-labels finding, got {[f['rule'] for f in findings]}")
if findings:
    check(len(findings[0]["elements"]) == len(truth["values"]),
          f"{len(truth['values'])} segment elements, got {len(findings[0]['elements'])}")
    check([e["value"] for e in findings[0]["elements"]] == truth["values"],
          "the finding's values are the printed numbers")
with open(os.path.join(ROOT, "docs", "findings.schema.json")) as fh:
    validator = jsonschema.Draft202012Validator(json.load(fh))
for e in validator.iter_errors(doc):
    check(False, "schema: " + "/".join(map(str, e.absolute_path)) + " " + e.message)

print(f"{len(parts)} segments checked, {len(failures)} failures")
sys.exit(1 if failures else 0)
