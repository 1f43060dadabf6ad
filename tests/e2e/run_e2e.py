"""End-to-end tests of the real plotproof binary on PDFs made at test time by cairo
(make_pdf), qpdf-encrypted copies, truncations, empty and random files, directories.

usage: run_e2e.py PLOTPROOF MAKE_PDF FAULT_SO SCHEMA VERSION

External references for the expected values are named beside each check. Every run is
also checked never to end by a signal (returncode >= 0 and < 128)."""
import hashlib
import json
import os
import random
import shutil
import subprocess
import sys
import tempfile

try:
    import jsonschema
except ImportError:  # a visible skip (meson's exit code 77), never a silent pass
    print("SKIP: python3-jsonschema not installed")
    sys.exit(77)

# meson passes build-relative paths; the test changes directory, so make them absolute.
PLOTPROOF, MAKE_PDF, FAULT_SO, SCHEMA = map(os.path.abspath, sys.argv[1:5])
VERSION = sys.argv[5]
failures = []


def check(cond, what):
    if not cond:
        failures.append(what)
        print("FAIL:", what)


def run(*args, env=None, timeout=120):
    p = subprocess.run([PLOTPROOF, *args], capture_output=True, timeout=timeout,
                       env={**os.environ, **(env or {})})
    # subprocess gives -N for a death by signal N; a shell would show 128+N.
    check(0 <= p.returncode < 128, f"{args}: died by a signal / rc {p.returncode}")
    return p.returncode, p.stdout.decode(), p.stderr.decode()


def one_error_line(err, name, word, what):
    lines = [l for l in err.splitlines() if l.strip()]
    check(len(lines) == 1, f"{what}: expected one stderr line, got {lines!r}")
    if lines:
        check(lines[0].startswith(f"plotproof: {name}: "), f"{what}: line does not name {name}: {lines[0]!r}")
        check(word in lines[0], f"{what}: {word!r} not in {lines[0]!r}")


with open(SCHEMA, encoding="utf-8") as f:
    validator = jsonschema.Draft202012Validator(json.load(f))


def valid_findings(path_or_text, what, is_text=False):
    text = path_or_text if is_text else open(path_or_text, encoding="utf-8").read()
    doc = json.loads(text)
    errs = list(validator.iter_errors(doc))  # JSON Schema 2020-12 via python3-jsonschema
    check(not errs, f"{what}: schema errors {[e.message for e in errs[:3]]}")
    return doc


tmp = tempfile.mkdtemp(prefix="pp-e2e-")
os.chdir(tmp)
good = os.path.join(tmp, "good.pdf")
drawn = json.loads(subprocess.run([MAKE_PDF, good], check=True, capture_output=True).stdout)
data = open(good, "rb").read()

# --help and --version
rc, out, _ = run("--help")
check(rc == 0, "--help exits 0")
for code in ("0  clean", "1  findings", "2  usage", "3  some documents"):
    check(code in out, f"--help documents exit code '{code}'")
rc, out, _ = run("--version")
check(rc == 0 and out.strip() == f"plotproof {VERSION}", f"--version prints {VERSION}: {out!r}")
rc, _, err = run("scan")
check(rc == 2 and "PATH" in err, "scan without PATH is a usage error (2)")
rc, _, err = run("scan", "--lie-band", "1.2:0.9", good)
check(rc == 2, "an inverted --lie-band is a usage error (2)")
rc, _, err = run("frobnicate")
check(rc == 2, "an unknown command is a usage error (2)")

# A clean cairo PDF: file identity checked against Python's own reading of the file.
rc, out, err = run("scan", "-o", "out1", good)
check(rc == 0, f"good PDF scans clean (rc {rc}, stderr {err!r})")
check(err == "", f"good PDF: stderr is empty: {err!r}")
doc = valid_findings("out1/good.findings.json", "good findings file")
d = doc["document"]
check(d["sha256"] == hashlib.sha256(data).hexdigest(), "sha256 equals hashlib's (FIPS 180-4)")
check(d["size"] == len(data), "size equals the file size")
check(d["pages"] == drawn["pages"] == len(doc["pages"]), "page count equals the pages cairo drew")
# ISO 32000-1 §7.5.2: the header line is %PDF-x.y; poppler reports the same version.
header_version = data[5:8].decode()
check(header_version in (d["pdf_version"] or ""), f"pdf_version {d['pdf_version']} vs header {header_version}")
check("cairo" in (d["producer"] or "").lower(), "producer names cairo (cairo sets /Producer)")
check(doc["pages"][0]["width"] == 400 and doc["pages"][0]["height"] == 300, "page size as created (400x300 pt)")
check(doc["pages"][0]["marks"]["fill"] >= 3, "at least the 3 filled columns are counted")
check("good.pdf" in out and "Total:" in out, "summary names the document and has a total line")
check("not an audit opinion" in out.splitlines()[-1], "summary ends with the disclaimer")
check((rc == 1) == (doc["totals"]["findings"] > 0), "exit code 1 iff findings")

# What it pins on the honest chart: exactly one figure, a column chart of the 3 columns
# cairo drew, on page 1; nothing on page 2; no finding, so exit 0.
check(rc == 0, f"honest chart: exit 0 (got {rc})")
figs = doc["pages"][0]["figures"]
check(len(figs) == 1, f"honest chart: exactly one figure, got {len(figs)}")
if figs:
    check(figs[0]["kind"] == "column" and figs[0]["elements"] == 3,
          f"honest chart: a column figure of 3 elements: {figs[0]}")
    check(figs[0]["scale"] and figs[0]["scale"]["kind"] == "linear", "honest chart: linear scale")
check(doc["pages"][1]["figures"] == [], "text page: no figure")
check(doc["findings"] == [], f"honest chart: no finding, got {[f['rule'] for f in doc['findings']]}")

# The misleading twin: the same values on an axis from 30, columns drawn from it. Their
# lengths are v − 30 (10, 25, 40), so by the growth-factor definition the lie factor is
# (40/10)/(70/40) = 2.2857…, and Tufte's (1983, p. 57) ratio of relative changes is
# ((40−10)/10)/((70−40)/40) = 4, GDI (Steinbart 1989) = 100·(4 − 1) = 300%. Ink is the
# drawn rectangles' area (cairo drew them: width 50 pt × length × 4 pt per unit).
bad = os.path.join(tmp, "truncated.pdf")
drawn_bad = json.loads(subprocess.run([MAKE_PDF, bad, "--truncated"], check=True,
                                      capture_output=True).stdout)
rc, out, err = run("scan", "-q", "-o", "out_bad", bad)
check(rc == 1, f"misleading chart: exit 1 (got {rc}, {err!r})")
bdoc = valid_findings("out_bad/truncated.findings.json", "misleading findings file")
check(len(bdoc["pages"][0]["figures"]) == 1, "misleading chart: exactly one figure")
check(len(bdoc["findings"]) == 1, f"misleading chart: exactly one finding, got {len(bdoc['findings'])}")
if bdoc["findings"]:
    f = bdoc["findings"][0]
    m = f["measures"]
    check(f["rule"] == "bars-off-zero", f"misleading chart: rule bars-off-zero, got {f['rule']}")
    check(f["page"] == 1, "misleading chart: finding on page 1")
    check(abs(m["ink_growth_ratio"] - (40 / 10) / (70 / 40)) < 1e-3,
          f"ink growth ratio 2.2857, got {m.get('ink_growth_ratio')}")
    check(abs(m["lie_factor"] - 4.0) < 2e-3, f"Tufte's lie factor 4, got {m['lie_factor']}")
    check(abs(m["gdi"] - 300.0) < 0.2, f"GDI 300%, got {m['gdi']}")
    check(abs(m["baseline_value"] - 30) < 0.05, f"baseline 30, got {m['baseline_value']}")
    # severe: ink off by a factor 2 or more (docs/rules.md; common practice, no source)
    check(f["severity"] == "severe", f"severity severe, got {f['severity']}")
    els = f["elements"]
    check([round(e["value"], 2) for e in els] == drawn_bad["values"], f"values {[e['value'] for e in els]}")
    for e, r in zip(els, drawn_bad["rects"]):
        check(abs(e["ink"] - (r[2] - r[0]) * (r[3] - r[1])) < 0.1, f"ink of {r}: {e['ink']}")
        check(all(abs(a - b) < 0.01 for a, b in zip(e["bbox"], r)), f"element box {e['bbox']} vs {r}")
        # ISO 32000-1 §8.3.2.3: on a 300 pt page, top-left y maps to 300 − y
        check(all(abs(a - b) < 0.01 for a, b in zip(e["pdf_bbox"], [r[0], 300 - r[3], r[2], 300 - r[1]])),
              f"element pdf box {e['pdf_bbox']}")
    # 40 → 70 is 75% growth; ink 10 → 40 (lengths above 30) is ×4, i.e. 300% growth
    check(f["message"] == "shows 75% growth as 300% growth: bars start at 30, not 0; 2021 (40) to "
                          "2023 (70): ink ×4 for value ×1.75 (Lie Factor 4.00, GDI +300%)",
          f"sentence: {f['message']!r}")

# scene: the filled rectangles cairo drew come back with the same corners (page points,
# top-left origin, y down; cairo's PDF surface uses that user space too).
rc, out, err = run("scene", good, "--page", "1")
check(rc == 0, f"scene page 1 (rc {rc}, {err!r})")
scene = json.loads(out)
fills = []
for m in scene["marks"]:
    if m["kind"] == "fill":
        pts = [p for seg in m["path"] for p in seg["points"]]
        xs, ys = [p[0] for p in pts], [p[1] for p in pts]
        fills.append([min(xs), min(ys), max(xs), max(ys)])
for r in drawn["rects"]:
    check(any(all(abs(a - b) < 0.01 for a, b in zip(r, f)) for f in fills), f"scene has the fill {r}")
words = [w["text"] for w in scene["words"]]
for w in drawn["words"]:
    check(w in words, f"scene has the word {w!r}")
rc, out, err = run("scene", good, "--page", "3")
check(rc == 4 and out == "", "scene of a page that does not exist fails with 4 (input failed)")
one_error_line(err, good, "page", "scene --page 3")
# Debug output goes to stderr only: stdout stays one JSON document.
rc, out, err = run("charts", good, "--page", "1", env={"G_MESSAGES_DEBUG": "all"})
try:
    json.loads(out)
    check("plotproof-recognize" in err, "debug output is on stderr")
except ValueError:
    check(False, "charts with debug output on: stdout is not JSON")
rc, out, err = run("charts", good, "--page", "2")
check(rc == 0 and "figures" in json.loads(out), "charts prints JSON with a figures list")

# --json: one JSON object per line (JSON Lines), no files unless --output.
os.makedirs("copy", exist_ok=True)
# A different file of the same name: bytes after %%EOF are ignored by readers (ISO 32000-1
# §7.5.5 puts the trailer at the end; poppler accepts trailing data), so it scans the same
# but has another SHA-256 and is not taken as a duplicate.
with open("copy/good.pdf", "wb") as f:
    f.write(data + b"\n% a second copy\n")
rc, out, err = run("scan", "--json", good, "copy/good.pdf")
lines = out.splitlines()
check(len(lines) == 2, f"--json with 2 documents prints 2 lines, got {len(lines)}")
for i, line in enumerate(lines):
    valid_findings(line, f"--json line {i}", is_text=True)
check(not os.path.exists("good.findings.json"), "--json without --output writes no file")

# Same-named files from different directories do not overwrite each other.
rc, out, err = run("scan", "-q", "-o", "out2", good, "copy/good.pdf")
check(out == "", "--quiet prints nothing on stdout")
names = sorted(n for n in os.listdir("out2") if n != "batch.jsonl")
check(len(names) == 2 and all(n.startswith("good-") and n.endswith(".findings.json") for n in names),
      f"two distinct findings files: {names}")

# Broken inputs: each is one stderr line naming the file, exit 2 on its own.
open("empty.pdf", "wb").close()
rc, _, err = run("scan", "-o", "out3", "empty.pdf")
check(rc == 4, "empty file: exit 4 (every input failed)")
one_error_line(err, "empty.pdf", "empty", "empty file")

rng = random.Random(20240611)  # fixed seed
with open("random.pdf", "wb") as f:
    f.write(bytes(rng.randrange(256) for _ in range(4096)))
rc, _, err = run("scan", "-o", "out3", "random.pdf")
check(rc == 4, "random bytes: exit 4")
one_error_line(err, "random.pdf", "not a PDF", "random bytes")

for pct in (10, 50, 90):
    name = f"trunc{pct}.pdf"
    with open(name, "wb") as f:
        f.write(data[: len(data) * pct // 100])
    rc, _, err = run("scan", "-o", "out3", name)
    # poppler may rebuild a truncated file's xref, so a scan can succeed (0/1) or the
    # file is reported damaged (4), or partial (3) with a page lost; all are documented,
    # a crash or silence is not.
    check(rc in (0, 1, 3, 4), f"{name}: rc {rc}")
    if rc == 4:
        one_error_line(err, name, "damaged", name)
    else:
        valid_findings(f"out3/trunc{pct}.findings.json", name)

# qpdf: AES-256 encryption with user password "user" (qpdf manual, --encrypt).
subprocess.run(["qpdf", "--encrypt", "user", "owner", "256", "--", good, "enc.pdf"], check=True)
rc, _, err = run("scan", "-o", "out3", "enc.pdf")
check(rc == 4, "encrypted, no password: exit 4")
one_error_line(err, "enc.pdf", "encrypted", "encrypted without password")
rc, _, err = run("scan", "-o", "out3", "--password", "wrong", "enc.pdf")
check(rc == 4, "encrypted, wrong password: exit 4")
one_error_line(err, "enc.pdf", "wrong", "encrypted with a wrong password")
rc, _, err = run("scan", "-q", "-o", "out3", "--password", "user", "enc.pdf")
check(rc in (0, 1) and err == "", f"encrypted with the right password scans (rc {rc}, {err!r})")

os.makedirs("nopdfs/sub", exist_ok=True)
open("nopdfs/sub/readme.txt", "w").write("no PDFs here\n")
rc, _, err = run("scan", "-o", "out3", "nopdfs")
check(rc == 4, "directory without PDFs: exit 4")
one_error_line(err, "nopdfs", "no PDF", "directory without PDFs")

rc, _, err = run("scan", "-o", "out3", "does-not-exist.pdf")
check(rc == 4, "nonexistent path: exit 4")
one_error_line(err, "does-not-exist.pdf", "unreadable", "nonexistent path")

# A batch with good and bad documents: exit 3, the good one still scanned.
rc, out, err = run("scan", "-o", "out4", good, "empty.pdf")
check(rc == 3, f"mixed batch: exit 3 (got {rc})")
check(os.path.exists("out4/good.findings.json"), "mixed batch: the good document was scanned")

# Recursion with a symlink loop and upper-case extension: terminates, each PDF once.
os.makedirs("tree/a/b", exist_ok=True)
shutil.copy(good, "tree/a/b/DEEP.PDF")
os.symlink("..", "tree/a/b/loop")
rc, out, err = run("scan", "-o", "out5", "tree", timeout=60)
check(rc in (0, 1), f"tree with a symlink loop scans (rc {rc}, {err!r})")
found = sorted(os.path.relpath(os.path.join(d, f), "out5") for d, _, fs in os.walk("out5") for f in fs)
check(found == ["a/b/DEEP.findings.json", "batch.jsonl"], f"tree: the output mirrors the input folders: {found}")

# Worker isolation: poppler made to abort() or hang via LD_PRELOAD (fault.c).
env = {"LD_PRELOAD": FAULT_SO, "PP_TEST_FAULT": "abort"}
rc, _, err = run("scan", "-o", "out6", good, env=env)
check(rc == 4, f"aborting capture: exit 4 (got {rc})")
one_error_line(err, good, "crashed (signal 6)", "aborting capture")  # SIGABRT is 6 on Linux
env["PP_TEST_FAULT"] = "hang"
rc, _, err = run("scan", "-o", "out6", "--timeout", "1", good, env=env, timeout=30)
check(rc == 4, f"hanging capture: exit 4 (got {rc})")
one_error_line(err, good, "timed out after 1 s", "hanging capture")

shutil.rmtree(tmp, ignore_errors=True)
print(f"{len(failures)} failure(s)")
sys.exit(1 if failures else 0)
