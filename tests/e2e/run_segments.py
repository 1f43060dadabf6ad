"""End-to-end: each stack segment's reading in `plotproof charts`, checked against the
data the matplotlib generator drew (corpus/lookalikes/stacked_labels_stretched: its
truth file holds the printed numbers as "values" and the drawn thicknesses as
"drawn_values", stack by stack from the baseline), never against plotproof's own output.

usage: run_segments.py PLOTPROOF SOURCE_ROOT"""
import json
import os
import subprocess
import sys

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

print(f"{len(parts)} segments checked, {len(failures)} failures")
sys.exit(1 if failures else 0)
