#!/usr/bin/python3
"""Generate the pgfplots part of the plotproof corpus (corpus/pgfplots/).
Writes a LaTeX document per PDF, runs pdflatex on it and records truth; the
plot box is measured by pdfTeX itself (\\pdfsavepos at the axis corners)."""

# How the bbox is obtained: inside every axis two zero-size \pgftext boxes
# sit at (rel axis cs:0,0) and (rel axis cs:1,1), the plot box corners.
# Each holds \pdfsavepos plus a delayed \write, so at shipout pdfTeX writes
# the page position of that corner (scaled points from the page's bottom-left
# corner) to <job>.pos. We convert sp -> bp (PDF points: 65536 sp = 1 TeX pt,
# 72.27 pt = 72 bp) and flip y with the page height. As a cross-check the
# axes use "scale only axis" with width/height in bp, so the measured box
# must have exactly that size (asserted below).

import math
import os
import random
import shutil
import subprocess
import sys
import tempfile

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import truth  # noqa: E402

ROOT = os.environ.get("PP_CORPUS_ROOT") or os.path.dirname(os.path.dirname(os.path.dirname(
    os.path.abspath(__file__))))
OUT = os.path.join(ROOT, "corpus", "pgfplots")
YEARS = [str(y) for y in range(2016, 2024)]
KILNS = ["Vellmoor", "Ashgrove", "Tarnwick", "Cobb Lane", "Hollin Ridge",
         "Quarrel End"]
SP_PER_BP = 65536.0 * 72.27 / 72.0
SMALL = (432.0, 288.0)  # 6 x 4 in, like the gnuplot pages
A4 = (595.0, 842.0)     # A4 rounded to whole bp so the page size is exact

PREAMBLE = r"""\documentclass{article}
\usepackage[paperwidth=%(w)gbp,paperheight=%(h)gbp,margin=%(m)gbp]{geometry}
\usepackage{pgfplots}
\pgfplotsset{compat=1.18}
\pagestyle{empty}
\pdftrailerid{}
\newwrite\pppos
\immediate\openout\pppos=\jobname.pos
\immediate\write\pppos{version \pgfplotsversion}
%% delayed \write: \pdflastxpos is expanded at shipout, after \pdfsavepos
\newcommand\ppsavepos[1]{\pdfsavepos
  \write\pppos{#1 \thepage\space\the\pdflastxpos\space\the\pdflastypos}}
%% \pgftext, not a tikz node: a "base west" node put the probe 0.5bp right
\newcommand\ppcorner[3]{\pgfplotsextra{%%
  \pgftext[at={\pgfplotspointrelaxisxy{#2}{#3}},left,base]{\ppsavepos{#1}}}}
\setlength\parindent{0pt}
\begin{document}
"""


def nice_floor(x):
    step = 10 ** (math.floor(math.log10(x)) - 1)
    return round(math.floor(x / step) * step, 9)  # 1.2, not 1.2000000000002


def nice_ceil(x):
    step = 10 ** (math.floor(math.log10(x)) - 1) * 5
    return round(math.ceil(x / step) * step, 9)


def make_values(rng, n, lo, hi, dec=0):
    start = rng.uniform(lo, lo + 0.25 * (hi - lo))
    end = rng.uniform(lo + 0.75 * (hi - lo), hi)
    out = [round(start + i / (n - 1) * (end - start)
                 + rng.uniform(-0.05, 0.05) * (hi - lo), dec)
           for i in range(n)]
    if out[0] == out[-1]:
        out[-1] = round(out[-1] * 1.1, dec)
    return [int(v) for v in out] if dec == 0 else out


def axis_floor(values, trunc):
    if trunc == "none":
        return 0
    return nice_floor({"mild": 0.5, "severe": 0.9}[trunc] * min(values))


def trunc_tags(trunc):
    return [] if trunc == "none" else ["truncated-axis", trunc]


def fmt_num(v):
    return repr(v) if isinstance(v, float) else str(v)


def coords(xs, ys):
    return " ".join("(%s,%s)" % (fmt_num(x), fmt_num(y))
                    for x, y in zip(xs, ys))


class Doc:
    """One PDF: pages of tikzpictures; figures carry a corner-node id."""

    def __init__(self, name, seed, page=SMALL, margin=0):
        self.name, self.seed, self.page, self.margin = name, seed, page, margin
        self.pages = []
        self.figs = []

    def new_page(self):
        self.pages.append([])

    def add(self, tex):
        if not self.pages:
            self.new_page()
        self.pages[-1].append(tex)

    def axis(self, fig, opts, body, size=(320, 190)):
        """Axis environment with the two corner probes; returns its TeX."""
        fid = "f%d" % len(self.figs)
        fig["_id"], fig["_size"] = fid, size
        fig["page"] = len(self.pages) or 1
        self.figs.append(fig)
        o = ["scale only axis", "width=%gbp" % size[0],
             "height=%gbp" % size[1], "enlargelimits=false"] + opts
        return ("\\begin{axis}[\n  %s]\n%s\n\\ppcorner{%sa}{0}{0}\n"
                "\\ppcorner{%sb}{1}{1}\n\\end{axis}\n"
                % (",\n  ".join(o), body, fid, fid))

    def single(self, fig, opts, body, size=(320, 190)):
        """A page holding one centred chart."""
        self.new_page()
        self.add("\\null\\vfill\\begin{center}\\begin{tikzpicture}\n"
                 + self.axis(fig, opts, body, size)
                 + "\\end{tikzpicture}\\end{center}\\vfill\\null\n")

    def tex(self):
        head = PREAMBLE % {"w": self.page[0], "h": self.page[1],
                           "m": self.margin}
        body = "\n\\newpage\n".join("\n".join(p) for p in self.pages)
        return head + body + "\n\\end{document}\n"

    def build(self):
        tmp = tempfile.mkdtemp(prefix="pgfcorpus-")
        try:
            src = os.path.join(tmp, self.name + ".tex")
            with open(src, "w") as fh:
                fh.write(self.tex())
            env = dict(os.environ, SOURCE_DATE_EPOCH="1700000000",
                       FORCE_SOURCE_DATE="1")
            res = subprocess.run(
                ["pdflatex", "-interaction=nonstopmode", "-halt-on-error",
                 self.name + ".tex"], cwd=tmp, env=env,
                capture_output=True, text=True)
            if res.returncode != 0:
                sys.stderr.write(res.stdout[-3000:])
                raise RuntimeError("pdflatex failed on %s" % self.name)
            pos = read_pos(os.path.join(tmp, self.name + ".pos"))
            pdf = os.path.join(OUT, self.name + ".pdf")
            shutil.copyfile(os.path.join(tmp, self.name + ".pdf"), pdf)
        finally:
            shutil.rmtree(tmp)
        for fig in self.figs:
            self._place(fig, pos)
        prod = "pgfplots %s (%s)" % (pos["version"], PDFTEX)
        truth.write_truth(pdf, prod, self.seed, len(self.pages), self.figs,
                          ROOT)
        return len(self.figs)

    def _place(self, fig, pos):
        fid = fig.pop("_id")
        w, h = fig.pop("_size")
        (pa, xa, ya), (pb, xb, yb) = pos[fid + "a"], pos[fid + "b"]
        assert pa == pb == fig["page"], (self.name, fid, pa, pb)
        x0, x1 = sorted((xa / SP_PER_BP, xb / SP_PER_BP))
        y0, y1 = sorted((self.page[1] - ya / SP_PER_BP,
                         self.page[1] - yb / SP_PER_BP))
        # "scale only axis" makes the box exactly width x height
        assert abs((x1 - x0) - w) < 0.05 and abs((y1 - y0) - h) < 0.05, (
            self.name, fid, x1 - x0, y1 - y0)
        fig["bbox"] = [round(x0, 2), round(y0, 2), round(x1, 2),
                       round(y1, 2)]
        fig["style"] = fig.get("style", []) + ["pgfplots"]
        if fig["kind"] in ("column", "bar", "area") and fig["axis"] and \
                fig["axis"]["scale"] == "linear" and fig["axis"]["min"] > 0:
            # checked in the content streams: ybar/xbar rectangles and
            # \closedcycle polygons start at the lower axis limit when 0 is
            # outside the range, so nothing relies on clipping
            fig["style"].append("floor-at-axis-min" if fig["kind"] == "area"
                                else "bottom-at-axis-min")
            fig["notes"] = ("pgfplots starts the marks at the lower axis "
                            "limit (0 is outside the axis range)")


def read_pos(path):
    pos = {}
    with open(path) as fh:
        for line in fh:
            parts = line.split()
            if parts[0] == "version":
                pos["version"] = parts[1]
                continue
            if parts[0] in pos:
                raise RuntimeError("corner %s written twice" % parts[0])
            pos[parts[0]] = (int(parts[1]), int(parts[2]), int(parts[3]))
    return pos


def cat_x_opts(labels, n=None):
    n = len(labels) if n is None else n
    return ["xmin=-0.6", "xmax=%g" % (n - 0.4),
            "xtick={0,...,%d}" % (n - 1),
            "xticklabels={%s}" % ",".join(labels)]


def yrange(lo, hi, extra=()):
    return ["ymin=%g" % lo, "ymax=%g" % hi, "scaled y ticks=false",
            "yticklabel style={/pgf/number format/fixed}"] + list(extra)


def fig_entry(kind, vals, labels, lo, hi, rule, style, orient="y",
              scale="linear", baseline="axis"):
    mis = rule is not None
    if scale == "linear" and hi >= 1000 and "thousands-sep" not in style \
            and "decimal-comma" not in style:
        style = style + ["thousands-sep"]  # pgf's default 1000 sep is ","
    return {"kind": kind, "misleading": mis, "rule": rule, "values": vals,
            "labels": labels,
            "axis": {"min": lo, "max": hi, "scale": scale,
                     "orientation": orient},
            "baseline": lo if baseline == "axis" else baseline,
            "style": style}


NUMFMT = {
    "plain": ([], []),
    "thousands": (["yticklabel style={/pgf/number format/1000 sep={,}}"],
                  ["thousands-sep"]),
    "comma": (["yticklabel style={/pgf/number format/use comma,"
               "/pgf/number format/fixed zerofill,"
               "/pgf/number format/precision=1}"], ["decimal-comma"]),
}


def column_chart(doc, vals, labels, trunc, fmt="plain", title="", style=(),
                 size=(320, 190)):
    lo = axis_floor(vals, trunc)
    hi = nice_ceil(max(vals) * 1.1)
    opts, tags = NUMFMT[fmt]
    o = ["ybar", "bar width=0.6", "title={%s}" % title] + cat_x_opts(labels)
    o += yrange(lo, hi, opts)
    if "gridlines" in style:
        o.append("ymajorgrids")
    body = ("\\addplot[fill=teal!70!black, draw=none] coordinates {%s};"
            % coords(range(len(vals)), vals))
    fig = fig_entry("column", vals, labels, lo, hi,
                    "bars-off-zero" if lo != 0 else None,
                    list(style) + tags + trunc_tags(trunc))
    return fig, o, body


def columns(name, seed, vals, labels, trunc, fmt="plain", style=()):
    doc = Doc(name, seed)
    fig, o, body = column_chart(doc, vals, labels, trunc, fmt,
                                "Vellmoor Kilns -- bricks fired", style)
    doc.single(fig, o, body)
    return doc.build()


def hbars(name, seed, vals, labels, trunc):
    lo = axis_floor(vals, trunc)
    hi = nice_ceil(max(vals) * 1.1)
    n = len(vals)
    doc = Doc(name, seed)
    o = ["xbar", "bar width=0.6", "y dir=reverse",
         "title={Vellmoor Kilns -- output by site}",
         "ymin=-0.6", "ymax=%g" % (n - 0.4), "ytick={0,...,%d}" % (n - 1),
         "yticklabels={%s}" % ",".join(labels), "xmin=%g" % lo,
         "xmax=%g" % hi, "scaled x ticks=false"]
    body = ("\\addplot[fill=orange!80!black, draw=black] coordinates {%s};"
            % coords(vals, range(n)))
    fig = fig_entry("bar", vals, labels, lo, hi,
                    "bars-off-zero" if lo != 0 else None,
                    ["edge-strokes"] + trunc_tags(trunc), orient="x")
    doc.single(fig, o, body, size=(290, 190))
    return doc.build()


def labelled(name, seed, labs, drawn, labels, hidden):
    """Bars drawn from `drawn`, numbers printed from `labs` (point meta)."""
    hi = nice_ceil(max(drawn + labs) * 1.15)
    doc = Doc(name, seed)
    o = ["ybar", "bar width=0.6", "title={Ashgrove Pottery -- kilns sold}",
         "nodes near coords", "point meta=explicit symbolic",
         "ymin=0", "ymax=%g" % hi] + cat_x_opts(labels)
    if hidden:
        o += ["axis x line*=bottom", "axis y line=none", "ytick=\\empty"]
    rows = "\n".join("%d %s %s" % (i, d, v)
                     for i, (d, v) in enumerate(zip(drawn, labs)))
    body = ("\\addplot[fill=blue!60!black, draw=none] table[x=x, y=h, "
            "meta=lab] {\nx h lab\n%s\n};" % rows)
    liar = drawn != labs
    axis = {"min": 0, "max": hi, "scale": "linear", "orientation": "y"}
    fig = {"kind": "column", "misleading": liar,
           "rule": "bars-vs-labels" if liar else None, "values": labs,
           "labels": labels, "axis": None if hidden else axis,
           "baseline": 0, "data_labels": labs,
           "style": ["data-labels-only" if hidden else "data-labels"]}
    if hidden:
        fig["axis_hidden"] = axis
    if liar:
        fig["drawn_values"] = drawn
    doc.single(fig, o, body)
    return doc.build()


def area(name, seed, vals, labels, trunc, style=()):
    lo = axis_floor(vals, trunc)
    hi = nice_ceil(max(vals) * 1.1)
    n = len(vals)
    doc = Doc(name, seed)
    o = ["title={Tarnwick Cider -- barrels pressed}", "xmin=0",
         "xmax=%d" % (n - 1), "xtick={0,...,%d}" % (n - 1),
         "xticklabels={%s}" % ",".join(labels)] + yrange(lo, hi)
    if "gridlines" in style:
        o.append("ymajorgrids")
    fill = "green!50!black, fill opacity=0.5" if "alpha" in style \
        else "green!50!black"
    body = ("\\addplot[fill=%s, draw=green!30!black, thick] coordinates "
            "{%s} \\closedcycle;" % (fill, coords(range(n), vals)))
    fig = fig_entry("area", vals, labels, lo, hi,
                    "area-off-zero" if lo != 0 else None,
                    list(style) + trunc_tags(trunc))
    doc.single(fig, o, body)
    return doc.build()


def log_columns(name, seed, vals, labels):
    hi = 10 ** math.ceil(math.log10(max(vals) * 1.2))
    doc = Doc(name, seed)
    o = ["ybar", "bar width=0.6", "ymode=log", "ymin=10", "ymax=%g" % hi,
         "title={Cobb Lane Seeds -- packets (log scale)}"] + \
        cat_x_opts(labels)
    body = ("\\addplot[fill=violet!70!black, draw=none] coordinates {%s};"
            % coords(range(len(vals)), vals))
    fig = fig_entry("column", vals, labels, 10, hi, "bars-on-log", ["log"],
                    scale="log")
    doc.single(fig, o, body)
    return doc.build()


def line(name, seed, vals, labels, trunc):
    lo = axis_floor(vals, trunc)
    hi = 100  # uptime in percent
    n = len(vals)
    doc = Doc(name, seed)
    o = ["title={Hollin Ridge Lifts -- uptime (\\%)}", "xmin=0",
         "xmax=%d" % (n - 1), "xtick={0,...,%d}" % (n - 1),
         "xticklabels={%s}" % ",".join(labels), "grid=major"] + \
        yrange(lo, hi)
    body = ("\\addplot[red!70!black, thick, mark=*] coordinates {%s};"
            % coords(range(n), vals))
    fig = fig_entry("line", vals, labels, lo, hi, None,
                    ["gridlines", "markers"] + trunc_tags(trunc),
                    baseline=None)
    doc.single(fig, o, body)
    return doc.build()


def grouped(name, seed, rng, labels, trunc):
    names = ["Glazed", "Plain"]
    series = [make_values(rng, len(labels), 300, 700),
              make_values(rng, len(labels), 150, 400)]
    vals = [s[i] for i in range(len(labels)) for s in series]
    flat = ["%s/%s" % (lab, nm) for lab in labels for nm in names]
    lo = axis_floor(vals, trunc)
    hi = nice_ceil(max(vals) * 1.2)
    doc = Doc(name, seed)
    o = ["ybar", "bar width=0.3", "title={Quarrel End Tiles -- orders}",
         "legend pos=north west"] + cat_x_opts(labels) + yrange(lo, hi)
    body = "\n".join(
        "\\addplot[fill=%s, draw=black] coordinates {%s};"
        % (col, coords(range(len(labels)), s))
        for col, s in zip(("brown!70!black", "gray!50"), series))
    body += "\n\\legend{%s}" % ",".join(names)
    fig = fig_entry("column", vals, flat, lo, hi,
                    "bars-off-zero" if lo != 0 else None,
                    ["grouped", "edge-strokes"] + trunc_tags(trunc))
    fig["series"] = [{"name": nm, "values": s}
                     for nm, s in zip(names, series)]
    doc.single(fig, o, body)
    return doc.build()


def side_by_side(name, seed, rng):
    """Two axes in one tikzpicture: truncated columns left, honest right."""
    labels = YEARS[:5]
    v1, v2 = make_values(rng, 5, 300, 800), make_values(rng, 5, 300, 800)
    doc = Doc(name, seed)
    doc.new_page()
    parts = []
    for k, (v, trunc) in enumerate(((v1, "severe"), (v2, "none"))):
        fig, o, body = column_chart(doc, v, labels, trunc,
                                    title=("Vellmoor" if k == 0 else
                                           "Ashgrove") + " -- crates")
        fig["style"].append("multi-chart-page")
        o = ["name=ax%d" % k] + (["at={(ax0.east)}", "anchor=west",
                                  "xshift=45bp"] if k else []) + o
        parts.append(doc.axis(fig, o, body, size=(160, 180)))
    doc.add("\\null\\vfill\\begin{center}\\begin{tikzpicture}\n"
            + "".join(parts) + "\\end{tikzpicture}\\end{center}\\vfill\\null")
    return doc.build()


PROSE = ("Hollin Ridge Holdings is an invented company used only in this "
         "test corpus. Its brickworks, cider press and tile shop report "
         "figures that were drawn from a seeded random generator. ")


def report(name, seed, rng):
    """A4 two-page report: prose + chart, then two stacked charts."""
    doc = Doc(name, seed, page=A4, margin=72)
    vals = make_values(rng, 6, 2400, 8600)
    fig, o, body = column_chart(doc, vals, YEARS[:6], "mild", "thousands",
                                "Revenue (thousand crowns)")
    fig["style"] += ["multi-page"]
    doc.new_page()
    doc.add("\\section*{Annual review}\n%s\n\n\\medskip\\begin{center}"
            "\\begin{tikzpicture}\n%s\\end{tikzpicture}\\end{center}\n"
            "\\medskip %s\n" % (PROSE * 3, doc.axis(fig, o, body,
                                                    size=(340, 200)),
                                PROSE * 2))
    doc.new_page()
    labels = KILNS[:5]
    for k, trunc in enumerate(("none", "severe")):
        v = make_values(rng, 5, 1.2, 4.8, 1)
        fig, o, body = column_chart(doc, v, labels, trunc, "comma",
                                    "Tonnes per day, site %d" % (k + 1),
                                    size=(340, 200))
        fig["style"] += ["multi-page", "multi-chart-page"]
        doc.add("\\begin{center}\\begin{tikzpicture}\n%s\\end{tikzpicture}"
                "\\end{center}\n\\bigskip\n"
                % doc.axis(fig, o, body, size=(340, 200)))
    return doc.build()


PDFTEX = None


def main():
    global PDFTEX
    PDFTEX = subprocess.run(["pdflatex", "--version"], capture_output=True,
                            text=True).stdout.splitlines()[0].strip()
    os.makedirs(OUT, exist_ok=True)
    for f in os.listdir(OUT):
        if f.endswith((".pdf", ".truth.json")):
            os.remove(os.path.join(OUT, f))
    total = 0
    seed = 700
    families = [("pgf_col_plain", "plain", [], YEARS, 400, 900, 0),
                ("pgf_col_thousands", "thousands", ["gridlines"], YEARS[:6],
                 2400, 8600, 0),
                ("pgf_col_comma", "comma", [], YEARS[:7], 1.2, 4.8, 1)]
    for name, fmt, style, labels, lo, hi, dec in families:
        seed += 1
        vals = make_values(random.Random(seed), len(labels), lo, hi, dec)
        truncs = ("none", "mild", "severe") if fmt == "plain" else \
            ("none", "severe")
        for trunc in truncs:
            total += columns("%s_%s" % (name, trunc), seed, vals, labels,
                             trunc, fmt, style)
    seed += 1
    vals = make_values(random.Random(seed), 6, 200, 700)
    for trunc in ("none", "severe"):
        total += hbars("pgf_xbar_%s" % trunc, seed, vals, KILNS, trunc)
    for k, hidden in enumerate((False, True)):
        seed += 1
        labs = make_values(random.Random(seed), 5, 400, 900)
        drawn = [int(labs[0] * 0.45 + (d - labs[0]) * 1.6) for d in labs]
        total += labelled("pgf_labels_%d_liar" % k, seed, labs, drawn,
                          YEARS[:5], hidden)
        total += labelled("pgf_labels_%d_honest" % k, seed, labs, labs,
                          YEARS[:5], hidden)
    seed += 1
    vals = make_values(random.Random(seed), 8, 300, 900)
    for trunc in ("none", "mild", "severe"):
        total += area("pgf_area_%s" % trunc, seed, vals, YEARS, trunc,
                      ["alpha", "gridlines"] if trunc == "mild" else [])
    seed += 1
    rng = random.Random(seed)
    vals = sorted(int(10 ** rng.uniform(1.6, 3.6)) for _ in range(6))
    total += log_columns("pgf_log_col", seed, vals, YEARS[:6])
    seed += 1
    total += line("pgf_line_trunc", seed,
                  make_values(random.Random(seed), 8, 90, 99, 1), YEARS,
                  "severe")
    seed += 1
    for trunc in ("none", "severe"):
        total += grouped("pgf_grouped_%s" % trunc, seed, random.Random(seed),
                         YEARS[:5], trunc)
    seed += 1
    total += side_by_side("pgf_side_by_side", seed, random.Random(seed))
    seed += 1
    total += report("pgf_report", seed, random.Random(seed))
    print("pgfplots: %d figures" % total)


if __name__ == "__main__":
    main()
