"""End-to-end checks of the real plotproof binary on PDFs written byte by byte
here, so that every coordinate is what this file says (cairo's PDF surface rounds paths
to 1/256 pt and cannot draw the first case below; pgfplots writes 5-decimal coordinates).

usage: run_measures.py PLOTPROOF

Expected values are computed by hand from the published formula named beside each
check, never taken from plotproof's output."""
import json
import os
import subprocess
import sys
import tempfile

PLOTPROOF = os.path.abspath(sys.argv[1])
failures = []


def check(cond, what):
    if not cond:
        failures.append(what)
        print("FAIL:", what)


def pdf(content):
    """A one-page PDF (400 × 300 pt) with Helvetica as /F1 and a correct xref table."""
    stream = content.encode("latin-1")
    objs = [b"<< /Type /Catalog /Pages 2 0 R >>",
            b"<< /Type /Pages /Kids [3 0 R] /Count 1 >>",
            b"<< /Type /Page /Parent 2 0 R /MediaBox [0 0 400 300] "
            b"/Resources << /Font << /F1 5 0 R >> >> /Contents 4 0 R >>",
            b"<< /Length %d >>\nstream\n" % len(stream) + stream + b"\nendstream",
            b"<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>"]
    out = bytearray(b"%PDF-1.4\n")
    offsets = []
    for i, body in enumerate(objs, 1):
        offsets.append(len(out))
        out += b"%d 0 obj\n" % i + body + b"\nendobj\n"
    xref = len(out)
    out += b"xref\n0 %d\n0000000000 65535 f \n" % (len(objs) + 1)
    for off in offsets:
        out += b"%010d 00000 n \n" % off
    out += b"trailer\n<< /Size %d /Root 1 0 R >>\nstartxref\n%d\n%%%%EOF\n" % (len(objs) + 1,
                                                                              xref)
    return bytes(out)


def value_axis(lo, hi, step, y_of):
    """Ticks and right-aligned-by-width labels (all three digits) left of x = 60."""
    ops = ["0 0 0 RG 0.5 w 60 %g m 60 %g l S" % (y_of(lo), y_of(hi))]
    v = lo
    while v <= hi:
        y = y_of(v)
        ops.append("56 %g m 60 %g l S" % (y, y))
        ops.append("BT /F1 8 Tf 38 %g Td (%d) Tj ET" % (y - 2.8, v))
        v += step
    return ops


def scan(tmp, name, content):
    path = os.path.join(tmp, name + ".pdf")
    with open(path, "wb") as fh:
        fh.write(pdf(content))
    out = os.path.join(tmp, name + "-out")
    p = subprocess.run([PLOTPROOF, "scan", "--quiet", "--no-config", "--output", out, path],
                       capture_output=True, timeout=120)
    check(0 <= p.returncode < 128, f"{name}: rc {p.returncode}")
    with open(os.path.join(out, name + ".findings.json"), encoding="utf-8") as fh:
        return json.load(fh)


with tempfile.TemporaryDirectory() as tmp:
    # Five bars of one width (30.000488 pt) for 346, 280, 390, 320, 345 on an axis from
    # 100, 1 unit = 0.5 pt. The first bar's left edge is 0.1/1024 pt past the capture's
    # 1/1024 pt grid and the last's 0.6/1024, so their widths round 1/1024 pt apart;
    # between the first and last values, nearly equal, that difference would move the GDI
    # by about 3%. By hand (Steinbart
    # 1989, GDI = 100·(a/b − 1), a the graphic's change, b the data's): a = (245 − 246)/246,
    # b = (345 − 346)/346, GDI = 100·(346/246 − 1) = 40.65; the Lie Factor's growth form
    # (Tufte 1983, p. 57) is (245/246)/(345/346) = 0.99883.
    y_of = lambda v: 50 + (v - 100) * 0.5
    ops = value_axis(100, 400, 50, y_of)
    ops.append("0.3 0.5 0.7 rg")
    for x, v in ((70.0000977, 346), (130, 280), (190, 390), (250, 320), (310.0005859, 345)):
        ops.append("%.7f %g 30.0004882 %g re f" % (x, y_of(100), y_of(v) - y_of(100)))
    doc = scan(tmp, "equal_widths", "\n".join(ops))
    found = [f for f in doc["findings"] if f["rule"] == "bars-off-zero"]
    check(len(found) == 1, f"equal widths: one bars-off-zero finding, got {len(found)}")
    if found:
        m = found[0]["measures"]
        gdi, want = m["gdi"], 100 * (346 / 246 - 1)
        # within 1%: the accuracy gate's limit on GDI error (scripts/accuracy-thresholds.json)
        check(abs(gdi - want) <= 0.01 * want, f"equal widths: GDI {gdi:.3f}, expected {want:.3f}")
        growth, gwant = m["ink_growth_ratio"], (245 / 246) / (345 / 346)
        check(abs(growth - gwant) <= 1e-4 * gwant,
              f"equal widths: ink growth ratio {growth:.6f}, expected {gwant:.6f}")

    # A scatter plot whose nearest point sits 85 pt right of its tick labels (the axis is
    # 200 pt tall): still one chart, read as lines/scatter and never judged by ink.
    y_of = lambda v: 50 + (v - 100) * 0.5
    ops = value_axis(100, 500, 100, y_of)
    ops.append("0.3 0.6 0.3 rg")
    k = 0.5523 * 3  # a circle of radius 3 from four Béziers (the usual kappa)
    for i, (x, v) in enumerate(((140, 180), (200, 420), (240, 300), (300, 250), (350, 470))):
        y = y_of(v)
        ops.append(f"{x + 3} {y} m {x + 3} {y + k} {x + k} {y + 3} {x} {y + 3} c "
                   f"{x - k} {y + 3} {x - 3} {y + k} {x - 3} {y} c "
                   f"{x - 3} {y - k} {x - k} {y - 3} {x} {y - 3} c "
                   f"{x + k} {y - 3} {x + 3} {y - k} {x + 3} {y} c f")
    doc = scan(tmp, "far_scatter", "\n".join(ops))
    figs = [f for p in doc["pages"] for f in p["figures"]]
    check([f["kind"] for f in figs] == ["line"],
          f"far scatter: one line figure, got {[f['kind'] for f in figs]}")
    check(not doc["findings"], f"far scatter: no finding, got {len(doc['findings'])}")

if failures:
    print(f"{len(failures)} failure(s)")
    sys.exit(1)
print("all measurement checks passed")
