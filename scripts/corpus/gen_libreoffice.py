#!/usr/bin/python3
"""Generate the LibreOffice part of the plotproof corpus (corpus/libreoffice/).
Writes flat OpenDocument spreadsheets (.fods) with inline chart objects, has
`soffice --headless --convert-to pdf` print them, and records truth; plot boxes
are read back from the PDF (the chart wall rectangle), not predicted."""

import math
import os
import random
import re
import shutil
import subprocess
import sys
import tempfile
import xml.etree.ElementTree as ET

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import truth  # noqa: E402

ROOT = os.environ.get("PP_CORPUS_ROOT") or os.path.dirname(os.path.dirname(os.path.dirname(
    os.path.abspath(__file__))))
OUT = os.path.join(ROOT, "corpus", "libreoffice")
YEARS = [str(y) for y in range(2016, 2024)]
PIERS = ["Harrowby", "Selkirk Bay", "Moss Point", "Quillan", "Dunmarra",
         "Wrenfield"]
COMPANY = "Fjordhaven Ferries"
# Each chart on a page gets its own wall colour so its rectangle can be found
# unambiguously in the PDF (see wall_boxes()).
WALLS = ["#f4f1ea", "#eaf1f4", "#f1eaf4"]

NS = ('xmlns:office="urn:oasis:names:tc:opendocument:xmlns:office:1.0" '
      'xmlns:style="urn:oasis:names:tc:opendocument:xmlns:style:1.0" '
      'xmlns:text="urn:oasis:names:tc:opendocument:xmlns:text:1.0" '
      'xmlns:table="urn:oasis:names:tc:opendocument:xmlns:table:1.0" '
      'xmlns:draw="urn:oasis:names:tc:opendocument:xmlns:drawing:1.0" '
      'xmlns:fo="urn:oasis:names:tc:opendocument:xmlns:'
      'xsl-fo-compatible:1.0" '
      'xmlns:xlink="http://www.w3.org/1999/xlink" '
      'xmlns:number="urn:oasis:names:tc:opendocument:xmlns:datastyle:1.0" '
      'xmlns:svg="urn:oasis:names:tc:opendocument:xmlns:'
      'svg-compatible:1.0" '
      'xmlns:chart="urn:oasis:names:tc:opendocument:xmlns:chart:1.0"')


def producer():
    out = subprocess.run(["soffice", "--version"], capture_output=True,
                         text=True).stdout.strip()
    m = re.match(r"LibreOffice (\d+\.\d+\.\d+)", out)
    return "LibreOffice %s" % m.group(1) if m else "LibreOffice"


def make_values(rng, n, lo, hi, dec=0):
    start = rng.uniform(lo, lo + 0.25 * (hi - lo))
    end = rng.uniform(lo + 0.75 * (hi - lo), hi)
    out = [round(start + i / (n - 1) * (end - start)
                 + rng.uniform(-0.05, 0.05) * (hi - lo), dec)
           for i in range(n)]
    if out[0] == out[-1]:
        out[-1] = round(out[-1] * 1.1, dec)
    return [int(v) for v in out] if dec == 0 else out


def nice_step(span):
    """Tick step giving 4-10 intervals over span (1-2-5 series)."""
    p = 10 ** math.floor(math.log10(span))
    for m in (0.1, 0.2, 0.5, 1, 2, 5, 10):
        if span / (m * p) <= 10:
            return m * p
    return 10 * p


def axis_range(values, trunc):
    """Axis limits as set in the chart: min from the truncation level, max a
    whole number of steps above it, so both ends carry a tick label."""
    top = max(values) * 1.08
    if trunc == "none":
        lo = 0
        step = nice_step(top)
    else:
        raw = {"mild": 0.5, "severe": 0.9}[trunc] * min(values)
        step = nice_step(top - raw)
        lo = math.floor(raw / step) * step
    hi = lo + math.ceil((top - lo) / step) * step
    return _num(lo), _num(hi), _num(step)


def _num(x):
    x = round(x, 6)
    return int(x) if x == int(x) else x


def trunc_tags(trunc):
    return [] if trunc == "none" else ["truncated-axis", trunc]


# ---------------------------------------------------------------- ODF text

def esc(s):
    return (s.replace("&", "&amp;").replace("<", "&lt;")
            .replace(">", "&gt;"))


def chart_xml(c, sheet, first_row, wall):
    """One draw:frame holding an inline chart document.

    The axis limits go in the value axis style as chart:minimum /
    chart:maximum / chart:interval-major; LibreOffice 7.4 honours them on
    import (checked by rendering, and by fitting the printed tick labels in
    check_ticks())."""
    last = first_row + len(c["rows"]) - 1
    a = "%s.A%d:%s.A%d" % (sheet, first_row, sheet, last)
    b = "%s.B%d:%s.B%d" % (sheet, first_row, sheet, last)
    cls = {"column": "bar", "bar": "bar", "area": "area",
           "line": "line"}[c["kind"]]
    fill = c.get("color", "#2b6c8f")
    if c["kind"] == "line":
        ser_gfx = ('draw:stroke="solid" svg:stroke-color="%s" '
                   'svg:stroke-width="0.06cm" draw:fill="none"' % fill)
    elif "edge-strokes" in c["style"]:
        ser_gfx = ('draw:fill="solid" draw:fill-color="%s" draw:stroke='
                   '"solid" svg:stroke-color="#000000" '
                   'svg:stroke-width="0.03cm"' % fill)
    else:
        ser_gfx = 'draw:fill="solid" draw:fill-color="%s" draw:stroke="none"' \
            % fill
    ser_props = 'chart:data-label-number="%s"' % (
        "value" if c.get("data_labels") else "none")
    if c["kind"] == "line":
        ser_props += ' chart:symbol-type="%s"' % (
            "automatic" if "markers" in c["style"] else "none")
    numfmt, axy_extra = "", ""
    if "thousands-sep" in c["style"]:
        numfmt = ('<number:number-style style:name="N1"><number:number '
                  'number:decimal-places="0" number:min-integer-digits="1" '
                  'number:grouping="true"/></number:number-style>')
        axy_extra = ' style:data-style-name="N1"'
        axy_link = ' chart:link-data-style-to-source="false"'
    else:
        axy_link = ""
    axx_props = ""
    if c.get("reverse"):
        axx_props = ' chart:reverse-direction="true"'
    grid = ('<chart:grid chart:class="major" chart:style-name="grid"/>'
            if "gridlines" in c["style"] else "")
    w, h = c.get("size", (15.5, 10.0))
    x, y = c.get("pos", (0, 4.8))
    return f'''<draw:frame draw:style-name="gr1" draw:z-index="0" \
draw:name="{c['name']}" svg:width="{w}cm" svg:height="{h}cm" svg:x="{x}cm" \
svg:y="{y}cm">
<draw:object draw:notify-on-update-of-ranges="{a} {b}">
<office:document office:mimetype="application/vnd.oasis.opendocument.chart" \
office:version="1.3">
<office:automatic-styles>{numfmt}
<style:style style:name="ch" style:family="chart"><style:graphic-properties \
draw:stroke="none" draw:fill="solid" draw:fill-color="#ffffff"/></style:style>
<style:style style:name="pa" style:family="chart"><style:chart-properties \
chart:vertical="{'true' if c['kind'] == 'bar' else 'false'}"/></style:style>
<style:style style:name="axy" style:family="chart"{axy_extra}>\
<style:chart-properties chart:display-label="true"{axy_link} \
chart:minimum="{c['lo']}" chart:maximum="{c['hi']}" \
chart:interval-major="{c['step']}" chart:interval-minor-divisor="1"/>\
<style:graphic-properties draw:stroke="solid" svg:stroke-color="#808080"/>\
<style:text-properties fo:font-size="9pt"/></style:style>
<style:style style:name="axx" style:family="chart"><style:chart-properties \
chart:display-label="true"{axx_props}/><style:graphic-properties \
draw:stroke="solid" svg:stroke-color="#808080"/><style:text-properties \
fo:font-size="9pt"/></style:style>
<style:style style:name="ser" style:family="chart"><style:chart-properties \
{ser_props}/><style:graphic-properties {ser_gfx}/><style:text-properties \
fo:font-size="8pt"/></style:style>
<style:style style:name="wall" style:family="chart"><style:graphic-properties \
draw:stroke="none" draw:fill="solid" draw:fill-color="{wall}"/></style:style>
<style:style style:name="grid" style:family="chart"><style:graphic-properties \
draw:stroke="solid" svg:stroke-color="#d0d0d0"/></style:style>
<style:style style:name="ttl" style:family="chart"><style:text-properties \
fo:font-size="12pt"/></style:style>
</office:automatic-styles>
<office:body><office:chart>
<chart:chart svg:width="{w}cm" svg:height="{h}cm" chart:class="chart:{cls}" \
chart:style-name="ch">
<chart:title chart:style-name="ttl"><text:p>{esc(c['title'])}</text:p>\
</chart:title>
<chart:plot-area chart:style-name="pa" table:cell-range-address="{a} {b}" \
chart:data-source-has-labels="none">
<chart:axis chart:dimension="x" chart:name="primary-x" \
chart:style-name="axx"><chart:categories table:cell-range-address="{a}"/>\
</chart:axis>
<chart:axis chart:dimension="y" chart:name="primary-y" \
chart:style-name="axy">{grid}</chart:axis>
<chart:series chart:style-name="ser" chart:values-cell-range-address="{b}" \
chart:class="chart:{cls}"/>
<chart:wall chart:style-name="wall"/>
</chart:plot-area>
</chart:chart>
</office:chart></office:body>
</office:document>
</draw:object>
</draw:frame>'''


def cell(v):
    if isinstance(v, str):
        return ('<table:table-cell office:value-type="string"><text:p>%s'
                '</text:p></table:table-cell>' % esc(v))
    return ('<table:table-cell office:value-type="float" office:value="%r">'
            '<text:p>%r</text:p></table:table-cell>' % (v, v))


def sheet_xml(name, charts):
    """A sheet: each chart's data in two columns (stacked blocks), charts
    anchored to the page below/beside them."""
    frames, rows = [], []
    for i, c in enumerate(charts):
        first = len(rows) + 2
        rows.append((c["cat_head"], c["val_head"]))
        rows.extend(c["rows"])
        frames.append(chart_xml(c, name, first, c["wall"]))
    s = ('<table:table table:name="%s"><table:shapes>%s</table:shapes>'
         '<table:table-column table:style-name="co1" '
         'table:number-columns-repeated="8"/>\n' % (name, "".join(frames)))
    for r in rows:
        s += "<table:table-row>%s%s</table:table-row>\n" % (cell(r[0]),
                                                            cell(r[1]))
    return s + "</table:table>\n"


def fods(sheets, landscape=False):
    pw, ph = ("29.7cm", "21cm") if landscape else ("21cm", "29.7cm")
    colw = "3.2cm" if landscape else "2cm"
    body = "".join(sheet_xml(n, cs) for n, cs in sheets)
    # Column width 2 cm x 8 columns = 16 cm fits the 17 cm printable width
    # (3.2 cm x 8 in landscape: 25.6 of 25.7 cm), so Calc does not split a
    # chart across a column page break.
    return f'''<?xml version="1.0" encoding="UTF-8"?>
<office:document {NS} office:version="1.3" \
office:mimetype="application/vnd.oasis.opendocument.spreadsheet">
<office:automatic-styles>
<style:style style:name="co1" style:family="table-column">\
<style:table-column-properties style:column-width="{colw}"/></style:style>
<style:style style:name="gr1" style:family="graphic">\
<style:graphic-properties draw:stroke="none" draw:fill="none"/></style:style>
<style:page-layout style:name="pm1"><style:page-layout-properties \
fo:page-width="{pw}" fo:page-height="{ph}" fo:margin-top="2cm" \
fo:margin-bottom="2cm" fo:margin-left="2cm" fo:margin-right="2cm"/>\
<style:header-style/><style:footer-style/></style:page-layout>
</office:automatic-styles>
<office:master-styles><style:master-page style:name="Default" \
style:page-layout-name="pm1"><style:header style:display="false"/>\
<style:footer style:display="false"/></style:master-page>\
</office:master-styles>
<office:body><office:spreadsheet>
{body}</office:spreadsheet></office:body></office:document>
'''


# ------------------------------------------------------ reading the PDF back

def _matrix(t):
    """SVG transform attribute (matrix/translate/scale as pdftocairo writes
    them) to an affine (a, b, c, d, e, f)."""
    m = (1, 0, 0, 1, 0, 0)
    for op, args in re.findall(r"(\w+)\(([^)]*)\)", t or ""):
        n = [float(v) for v in re.split(r"[ ,]+", args.strip())]
        if op == "matrix":
            k = tuple(n)
        elif op == "translate":
            k = (1, 0, 0, 1, n[0], n[1] if len(n) > 1 else 0)
        elif op == "scale":
            k = (n[0], 0, 0, n[1] if len(n) > 1 else n[0], 0, 0)
        else:
            raise ValueError("unhandled transform %s" % op)
        m = _mul(m, k)
    return m


def _mul(p, q):
    a, b, c, d, e, f = p
    A, B, C, D, E, F = q
    return (a * A + c * B, b * A + d * B, a * C + c * D, b * C + d * D,
            a * E + c * F + e, b * E + d * F + f)


def _fill_rgb(style):
    m = re.search(r"fill:rgb\(([\d.]+)%,([\d.]+)%,([\d.]+)%\)", style or "")
    if not m:
        return None
    return tuple(round(float(v) * 2.55) for v in m.groups())


def wall_boxes(pdf, page, colors):
    """Plot boxes of one page: bounding box of the path filled with each
    chart's wall colour, from `pdftocairo -svg` (which writes PDF points,
    origin top-left, y down, applying the page's transform). The wall is
    the plot area LibreOffice fills behind the data; its edges agree with
    the axis lines and outermost gridlines to about 0.05 pt (LibreOffice
    rounds chart geometry to 1/100 mm = 0.028 pt, so bars may start up to
    that far outside the wall)."""
    with tempfile.TemporaryDirectory() as td:
        svg = os.path.join(td, "p.svg")
        subprocess.run(["pdftocairo", "-svg", "-f", str(page), "-l",
                        str(page), pdf, svg], check=True)
        root = ET.parse(svg).getroot()
    want = {tuple(int(h[i:i + 2], 16) for i in (1, 3, 5)): h for h in colors}
    found = {}

    def walk(el, m):
        m = _mul(m, _matrix(el.get("transform")))
        if el.tag.endswith("}path"):
            rgb = _fill_rgb(el.get("style"))
            if rgb in want:
                nums = [float(v) for v in re.findall(
                    r"-?\d+(?:\.\d+)?", el.get("d"))]
                pts = [(m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5])
                       for x, y in zip(nums[0::2], nums[1::2])]
                xs = [p[0] for p in pts]
                ys = [p[1] for p in pts]
                box = [min(xs), min(ys), max(xs), max(ys)]
                old = found.get(want[rgb])
                if old:  # wall split in several paths: take the union
                    box = [min(old[0], box[0]), min(old[1], box[1]),
                           max(old[2], box[2]), max(old[3], box[3])]
                found[want[rgb]] = box
        for ch in el:
            if not ch.tag.endswith("}defs"):
                walk(ch, m)

    walk(root, (1, 0, 0, 1, 0, 0))
    missing = [c for c in colors if c not in found]
    if missing:
        raise RuntimeError("%s p%d: no wall path for %s"
                           % (pdf, page, missing))
    return {c: [round(v, 2) for v in found[c]] for c in colors}


def page_words(pdf, page):
    out = subprocess.run(["pdftotext", "-f", str(page), "-l", str(page),
                          "-bbox", pdf, "-"], capture_output=True, text=True,
                         check=True).stdout
    words = []
    for m in re.finditer(r'<word xMin="([\d.]+)" yMin="([\d.]+)" '
                         r'xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)</word>',
                         out):
        words.append(([float(v) for v in m.groups()[:4]], m.group(5)))
    return words


def check_ticks(pdf, fig, c):
    """Independent check of the recorded axis limits and plot box: the value
    tick labels that pdftotext reports beside the box, fitted linearly against
    their centre positions, must give axis.min/max at the box edges within 1%
    of the range (the acceptance check docs/corpus.md reports for the other
    producers)."""
    x0, y0, x1, y1 = fig["bbox"]
    horiz = fig["kind"] == "bar"
    ticks = []
    for (a, b, cc, d), t in page_words(pdf, fig["page"]):
        t = t.replace(",", "")
        if not re.fullmatch(r"-?\d+(\.\d+)?", t):
            continue
        v = float(t)
        if not horiz and cc <= x0 + 1 and a > x0 - 60 and y0 - 8 < b < y1 + 8:
            ticks.append(((b + d) / 2, v))
        # horizontal bars: value labels below the box, or above it when the
        # category axis is reversed (the value axis then crosses at the top)
        near = (y1 - 1 <= b < y1 + 20) if not c.get("reverse") else \
            (y0 - 20 < d <= y0 + 1)
        if horiz and near and x0 - 20 < a < x1 + 20:
            ticks.append(((a + cc) / 2, v))
    expect = set()
    t = c["lo"]
    while t <= c["hi"] + 1e-9:
        expect.add(round(t, 6))
        t += c["step"]
    got = {round(v, 6) for _, v in ticks}
    if got != expect:
        raise RuntimeError("%s: tick labels %s, expected %s"
                           % (pdf, sorted(got), sorted(expect)))
    n = len(ticks)
    mx = sum(p for p, _ in ticks) / n
    mv = sum(v for _, v in ticks) / n
    k = (sum((p - mx) * (v - mv) for p, v in ticks)
         / sum((p - mx) ** 2 for p, _ in ticks))
    at = (lambda p: mv + k * (p - mx))
    lo, hi = (at(x0), at(x1)) if horiz else (at(y1), at(y0))
    tol = 0.01 * (c["hi"] - c["lo"])
    if abs(lo - c["lo"]) > tol or abs(hi - c["hi"]) > tol:
        raise RuntimeError("%s: ticks fit %.3f..%.3f, axis %s..%s"
                           % (pdf, lo, hi, c["lo"], c["hi"]))


# ------------------------------------------------------------ chart specs

def spec(name, kind, labels, vals, trunc, title, style=(), seed=0, **kw):
    lo, hi, step = axis_range(vals, trunc)
    c = {"name": name, "kind": kind, "rows": list(zip(labels, vals)),
         "lo": lo, "hi": hi, "step": step, "title": title, "trunc": trunc,
         "style": list(style) + trunc_tags(trunc), "seed": seed,
         "cat_head": "Pier" if kind == "bar" else "Year",
         "val_head": kw.pop("val_head", "Value")}
    c.update(kw)
    return c


def figure_of(c, page, box):
    labels = [r[0] for r in c["rows"]]
    vals = [r[1] for r in c["rows"]]
    if c["kind"] == "bar" and not c.get("reverse"):
        # Calc draws the first category at the bottom; truth lists top first.
        labels, vals = labels[::-1], vals[::-1]
    ink = c["kind"] in ("column", "bar", "area")
    off = c["lo"] != 0
    fig = {"page": page, "bbox": box, "kind": c["kind"],
           "misleading": ink and off,
           "rule": ({"area": "area-off-zero"}.get(c["kind"], "bars-off-zero")
                    if ink and off else None),
           "values": vals, "labels": labels,
           "axis": {"min": c["lo"], "max": c["hi"], "scale": "linear",
                    "orientation": "x" if c["kind"] == "bar" else "y"},
           "baseline": c["lo"] if ink else None,
           "data_labels": vals if c.get("data_labels") else None,
           "style": c["style"] + ["libreoffice"]}
    if c.get("notes"):
        fig["notes"] = c["notes"]
    return fig


def build_specs():
    """[(file name, seed, [(sheet name, [chart spec])], landscape)]."""
    files = []

    def one(name, seed, kind, labels, lo, hi, trunc, title, style=(), dec=0,
            **kw):
        rng = random.Random(seed)
        vals = make_values(rng, len(labels), lo, hi, dec)
        c = spec(name, kind, labels, vals, trunc, title, style, seed, **kw)
        c["wall"] = WALLS[0]
        files.append((name, seed, [("Data", [c])], False))

    rev = "%s - revenue (NOK m)" % COMPANY
    for trunc, seed in (("none", 701), ("mild", 702), ("severe", 703)):
        one("lo_col_%s" % trunc, seed, "column", YEARS, 380, 620, trunc,
            rev, ["gridlines"], val_head="Revenue")
    one("lo_col_edges_severe", 704, "column", YEARS, 50, 90, "severe",
        "%s - on-time departures (%%)" % COMPANY, ["edge-strokes"],
        dec=1, val_head="On time")
    one("lo_col_thousands_mild", 705, "column", YEARS, 180000, 260000,
        "mild", "%s - passengers" % COMPANY, ["gridlines", "thousands-sep"],
        val_head="Passengers")
    pas = "%s - passengers by pier (thousands)" % COMPANY
    for trunc, seed in (("none", 711), ("severe", 712)):
        one("lo_hbar_%s" % trunc, seed, "bar", PIERS, 40, 95, trunc, pas,
            ["gridlines"], val_head="Passengers")
    one("lo_hbar_reversed_mild", 713, "bar", PIERS, 40, 95, "mild", pas,
        ["gridlines"], val_head="Passengers", reverse=True,
        notes="category axis reversed: first row of the sheet drawn on top")
    fuel = "%s - fuel bought (kt)" % COMPANY
    for trunc, seed in (("none", 721), ("mild", 722), ("severe", 723)):
        one("lo_area_%s" % trunc, seed, "area", YEARS, 120, 210, trunc, fuel,
            ["gridlines"], dec=1, val_head="Fuel")
    one("lo_line_severe", 731, "line", YEARS, 300, 360, "severe",
        "%s - average fare (NOK)" % COMPANY, ["gridlines"], val_head="Fare")
    one("lo_line_markers_mild", 732, "line", YEARS, 60, 80, "mild",
        "%s - load factor (%%)" % COMPANY, ["gridlines", "markers"], dec=1,
        val_head="Load")
    one("lo_col_datalabels_honest", 741, "column", YEARS[2:], 30, 55, "none",
        "%s - cabins sold (thousands)" % COMPANY, ["data-labels"],
        val_head="Cabins", data_labels=True)
    one("lo_col_datalabels_severe", 742, "column", YEARS[2:], 30, 55,
        "severe", "%s - cabins sold (thousands)" % COMPANY, ["data-labels"],
        val_head="Cabins", data_labels=True)

    # Multi-page report: one chart per sheet, Calc prints sheets in order.
    rng = random.Random(751)
    sheets = []
    for i, (kind, trunc, lo, hi, what) in enumerate((
            ("column", "mild", 90, 140, "freight (kt)"),
            ("area", "none", 20, 45, "car deck use (%)"),
            ("line", "mild", 8, 14, "delay minutes"))):
        vals = make_values(rng, 8, lo, hi, 1)
        c = spec("report_%d" % i, kind, YEARS, vals, trunc,
                 "%s - %s" % (COMPANY, what), ["gridlines", "multi-page"],
                 751, val_head="Value")
        c["wall"] = WALLS[0]
        sheets.append(("Sheet%d" % (i + 1), [c]))
    files.append(("lo_report_multipage", 751, sheets, False))

    # Two charts side by side on one landscape page: honest and truncated
    # twins of the same data.
    rng = random.Random(761)
    vals = make_values(rng, 6, 500, 700)
    pair = []
    for i, trunc in enumerate(("none", "severe")):
        c = spec("pair_%d" % i, "column", YEARS[:6], vals, trunc,
                 "Ticket income (NOK k)", ["multi-chart-page"], 761,
                 val_head="Income", size=(12.0, 9.0),
                 pos=(12.6 * i, 7.0))
        c["wall"] = WALLS[i]
        pair.append(c)
    files.append(("lo_twin_page", 761, [("Data", pair)], True))
    return files


def main():
    if shutil.which("soffice") is None:
        sys.stderr.write("gen_libreoffice: soffice not found\n")
        return 1
    os.makedirs(OUT, exist_ok=True)
    for f in os.listdir(OUT):
        if f.endswith((".pdf", ".truth.json")):
            os.remove(os.path.join(OUT, f))
    prod = producer()
    files = build_specs()
    with tempfile.TemporaryDirectory(prefix="lo-gen-") as td:
        paths = []
        for name, _, sheets, land in files:
            p = os.path.join(td, name + ".fods")
            with open(p, "w") as fh:
                fh.write(fods(sheets, land))
            paths.append(p)
        # Own profile dir: avoids the lock of any running soffice instance.
        subprocess.run(["soffice", "-env:UserInstallation=file://%s/profile"
                        % td, "--headless", "--convert-to", "pdf",
                        "--outdir", OUT] + paths, check=True,
                       stdout=subprocess.DEVNULL, timeout=300)
    nfig = 0
    for name, seed, sheets, _ in files:
        pdf = os.path.join(OUT, name + ".pdf")
        info = subprocess.run(["pdfinfo", pdf], capture_output=True,
                              text=True, check=True).stdout
        pages = int(re.search(r"Pages:\s+(\d+)", info).group(1))
        if pages != len(sheets):
            raise RuntimeError("%s: %d pages for %d sheets"
                               % (pdf, pages, len(sheets)))
        figures = []
        for page, (_, charts) in enumerate(sheets, 1):
            boxes = wall_boxes(pdf, page, [c["wall"] for c in charts])
            for c in charts:
                fig = figure_of(c, page, boxes[c["wall"]])
                check_ticks(pdf, fig, c)
                figures.append(fig)
        truth.write_truth(pdf, prod, seed, pages, figures, ROOT)
        nfig += len(figures)
    print("libreoffice: %d files, %d figures" % (len(files), nfig))
    return 0


if __name__ == "__main__":
    sys.exit(main())
