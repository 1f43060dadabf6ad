"""End-to-end test of the circle charts: pies, donuts, tilted and perspective pies, radial
bars and polar areas drawn at test time by matplotlib, gnuplot, cairo and R (the corpus
generators, into a temporary root), scanned by the real binary.

usage: run_circles.py PLOTPROOF SOURCE_ROOT

Expected values come from each chart's truth file, written by the generator from the data
it drew (scripts/corpus/truth_circles.py: sector areas r²θ/2 and (R² − r²)θ/2, ellipse
sectors ab(t2 − t1)/2, Tufte's Lie Factor). Every misleading chart must be flagged with its
rule and a lie factor within 2% of the truth; every honest twin or lookalike (progress ring,
gauge, logo, diagram of arcs) must give no finding. A producer that is not installed is
reported; with none installed the test is skipped (exit 77), never passed."""
import glob
import json
import os
import shutil
import subprocess
import sys
import tempfile

PLOTPROOF, SRC = map(os.path.abspath, sys.argv[1:3])
PY = "/usr/bin/python3"
TOLERANCE = 0.02  # the acceptance: within 2% of the value computed from the data
failures = []


def check(cond, what):
    if not cond:
        failures.append(what)
        print("FAIL:", what)


def available(gen):
    probe = {"matplotlib": [PY, "-c", "import matplotlib"],
             "gnuplot": ["gnuplot", "--version"],
             "cairo": [PY, "-c", "import cairo"],
             "r": ["Rscript", "--version"]}[gen]
    try:
        return subprocess.run(probe, capture_output=True).returncode == 0
    except OSError:
        return False


root = tempfile.mkdtemp(prefix="pp-circles-")
ran = 0
for gen in ("matplotlib", "gnuplot", "cairo", "r"):
    if not available(gen):
        print(f"not installed, not tested: {gen}")
        continue
    script = os.path.join(SRC, "scripts", "corpus", f"gen_{gen}_circles.py")
    cmd = [PY, script]
    if gen == "r":
        cmd = ["Rscript", script[:-len(".py")] + ".R"]
    p = subprocess.run(cmd, env={**os.environ, "PP_CORPUS_ROOT": root},
                       capture_output=True, text=True)
    check(p.returncode == 0, f"{gen} generator: {p.stderr[-300:]}")
    ran += 1
# LibreOffice and pgfplots/TikZ pies are asked for by the issue but not installed here (nor
# by .ci/run: their packages cost too much CI time): shown as not tested, never passed.
for tool, probe in (("libreoffice", "soffice"), ("pgfplots", "pdflatex")):
    if not shutil.which(probe):
        print(f"not installed, not tested: {tool} (circle charts)")
    else:
        print(f"installed but no circle generator yet, not tested: {tool}")
if not ran:
    print("SKIP: no producer installed")
    sys.exit(77)

truths = sorted(glob.glob(os.path.join(root, "corpus", "*", "*.truth.json")))
pdfs = [t[:-len(".truth.json")] + ".pdf" for t in truths]
out = os.path.join(root, "out")
subprocess.run([PLOTPROOF, "scan", "--quiet", "--output", out] + pdfs, check=False)
results = {}
for path in glob.glob(os.path.join(out, "*.findings.json")):
    with open(path) as fh:
        doc = json.load(fh)
    results[os.path.basename(doc["document"]["path"])] = doc

n_mis = n_honest = 0
for t in truths:
    with open(t) as fh:
        truth = json.load(fh)
    name = os.path.basename(truth["file"])
    doc = results.get(name)
    check(doc is not None, f"{name}: not scanned")
    if doc is None:
        continue
    for fig in truth["figures"]:
        found = [f for f in doc["findings"] if f["page"] == fig["page"]]
        if fig["misleading"]:
            n_mis += 1
            rules = [f["rule"] for f in found]
            check(fig["rule"] in rules, f"{name}: want {fig['rule']}, got {rules}")
            want = fig["expected"]["lie_factor_growth"]
            # Names printed beside the slices (outside, below a rim, around a perspective
            # face) are the generator's own: each slice's name goes with its printed number.
            named = "names-outside" in fig.get("style", [])
            pairs = set(zip(fig["labels"], fig.get("data_labels") or []))
            for f in found:
                if f["rule"] == fig["rule"] and named:
                    got_pairs = [(e.get("category"), e.get("value")) for e in f["elements"]]
                    check(all(p in pairs for p in got_pairs),
                          f"{name}: slice names {got_pairs}, truth {sorted(pairs)}")
                if f["rule"] == fig["rule"]:
                    got = f["measures"].get("ink_growth_ratio", f["measures"].get("lie_factor"))
                    check(got is not None and abs(got - want) <= TOLERANCE * abs(want),
                          f"{name}: lie factor {got}, truth {want}")
        else:
            n_honest += 1
            check(not found, f"{name}: honest {fig['kind']} flagged: "
                  f"{[f['message'] for f in found]}")
print(f"{n_mis} misleading and {n_honest} honest circle figures from {ran} producers")
check(n_mis > 0 and n_honest > 0, "both misleading and honest figures were generated")
if failures:
    print(f"{len(failures)} failures")
    sys.exit(1)
print("all circle checks passed")
