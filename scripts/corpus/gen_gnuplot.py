#!/usr/bin/python3
"""Generate the gnuplot part of the plotproof corpus (corpus/gnuplot/).
Writes a gnuplot script per chart, runs gnuplot (pdfcairo terminal) on it and
records truth; plot boxes are known because margins are set in screen units."""

import math
import os
import random
import subprocess
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import truth  # noqa: E402

# PP_CORPUS_ROOT and PP_CORPUS_SEED_OFFSET make a held-out corpus elsewhere: the same
# kinds of charts with other invented data (scripts/holdout).
ROOT = os.environ.get("PP_CORPUS_ROOT") or os.path.dirname(os.path.dirname(
    os.path.dirname(os.path.abspath(__file__))))
SEED_OFFSET = int(os.environ.get("PP_CORPUS_SEED_OFFSET", "0"))


def rng_of(seed):
    return random.Random(seed + SEED_OFFSET)


OUT = os.path.join(ROOT, "corpus", "gnuplot")
W_IN, H_IN = 6.0, 4.0
W, H = W_IN * 72.0, H_IN * 72.0
# plot box in screen fractions (origin bottom-left, as gnuplot uses)
L, R, B, T = 0.14, 0.95, 0.14, 0.88
YEARS = [str(y) for y in range(2016, 2024)]
PIERS = ["Harrowby", "Selkirk Bay", "Moss Point", "Quillan", "Dunmarra",
         "Wrenfield"]


def producer():
    out = subprocess.run(["gnuplot", "--version"], capture_output=True,
                         text=True).stdout.strip()
    return out or "gnuplot"


def bbox(l=L, r=R, b=B, t=T):
    """Screen-fraction margins to a top-left-origin box in points."""
    return [round(l * W, 2), round((1 - t) * H, 2), round(r * W, 2),
            round((1 - b) * H, 2)]


def margins(l=L, r=R, b=B, t=T):
    return ("set lmargin at screen %g\nset rmargin at screen %g\n"
            "set bmargin at screen %g\nset tmargin at screen %g\n"
            % (l, r, b, t))


def make_values(rng, n, lo, hi, dec=0):
    start = rng.uniform(lo, lo + 0.25 * (hi - lo))
    end = rng.uniform(lo + 0.75 * (hi - lo), hi)
    out = [round(start + i / (n - 1) * (end - start)
                 + rng.uniform(-0.05, 0.05) * (hi - lo), dec)
           for i in range(n)]
    if out[0] == out[-1]:
        out[-1] = round(out[-1] * 1.1, dec)
    return [int(v) for v in out] if dec == 0 else out


def nice_floor(x):
    step = 10 ** (math.floor(math.log10(x)) - 1)
    return math.floor(x / step) * step


def nice_ceil(x):
    step = 10 ** (math.floor(math.log10(x)) - 1) * 5
    return math.ceil(x / step) * step


def axis_floor(values, trunc):
    if trunc == "none":
        return 0
    return nice_floor({"mild": 0.5, "severe": 0.9}[trunc] * min(values))


def block(name, rows):
    lines = ["$%s << EOD" % name]
    for r in rows:
        lines.append(" ".join('"%s"' % c if isinstance(c, str) else repr(c)
                              for c in r))
    lines.append("EOD")
    return "\n".join(lines) + "\n"


def trunc_tags(trunc):
    return [] if trunc == "none" else ["truncated-axis", trunc]


def yfmt(fmt):
    return {"plain": 'set format y "%g"\n',
            "usd": 'set format y "$%.0f"\n',
            "percent": 'set format y "%.0f%%"\n',
            "comma": "set decimalsign ','\nset format y \"%.1f\"\n"}[fmt]


def eur_tics(lo, hi, axis="y"):
    """Explicit German-style tic labels, since gnuplot's own %'d needs a
    locale that may not be installed."""
    step = 10 ** math.floor(math.log10(hi - lo))
    if (hi - lo) / step < 4:
        step /= 2
    t = math.ceil(lo / step) * step
    tics = []
    while t <= hi + 1e-9:
        tics.append('"%s €" %g' % ("{:,.0f}".format(t).replace(",", "."), t))
        t += step
    return "set %stics (%s)\n" % (axis, ", ".join(tics))


def run(name, script, seed, figures, pages=1):
    path = os.path.join(OUT, name + ".pdf")
    head = ('set terminal pdfcairo size %gin,%gin font "Sans,9"\n'
            "set output '%s'\n" % (W_IN, H_IN, path))
    gp = os.path.join(OUT, name + ".gp")
    with open(gp, "w") as fh:
        fh.write(head + script + "unset output\n")
    subprocess.run(["gnuplot", gp], check=True)
    os.remove(gp)  # the script is reproducible from this generator
    for f in figures:
        f.setdefault("page", 1)
        f["style"] = f.get("style", []) + ["gnuplot"]
    truth.write_truth(path, PRODUCER, seed, pages, figures, ROOT)
    return len(figures)


def columns(name, seed, vals, labels, trunc, fmt, style):
    lo = axis_floor(vals, trunc)
    hi = nice_ceil(max(vals) * 1.1)
    n = len(vals)
    s = margins() + block("d", list(zip(labels, vals)))
    s += 'set title "Selkirk Tramways - boardings"\n'
    s += "set boxwidth %g\n" % (0.6 if n < 30 else 0.75)
    if "hatch" in style:
        s += "set style fill pattern 2 border -1\n"
    elif "alpha" in style:
        s += "set style fill transparent solid 0.5 noborder\n"
    elif "edge-strokes" in style:
        s += "set style fill solid 0.8 border rgb 'black'\n"
    else:
        s += "set style fill solid 1.0 noborder\n"
    if "gridlines" in style:
        s += "set grid ytics lc rgb '#bbbbbb'\n"
    s += "set xrange [-0.6:%g]\nset yrange [%g:%g]\n" % (n - 0.4, lo, hi)
    if fmt == "eur":
        s += eur_tics(lo, hi)
    else:
        s += yfmt(fmt)
    if "rotated-labels" in style:
        s += "set xtics rotate by 45 right\n"
    if n >= 30:
        s += "set xtics 6\n"
        s += "plot $d using 0:2 with boxes lc rgb '#2b6c8f' notitle\n"
    else:
        s += ("plot $d using 0:2:xtic(1) with boxes lc rgb '#2b6c8f' "
              "notitle\n")
    tags = {"plain": [], "usd": ["currency"], "percent": ["percent"],
            "comma": ["decimal-comma"],
            "eur": ["currency", "thousands-sep", "decimal-comma"]}[fmt]
    mis = lo != 0
    fig = {"bbox": bbox(), "kind": "column", "misleading": mis,
           "rule": "bars-off-zero" if mis else None, "values": vals,
           "labels": labels, "axis": {"min": lo, "max": hi,
                                      "scale": "linear", "orientation": "y"},
           "baseline": lo, "style": style + tags + trunc_tags(trunc)}
    return run(name, s, seed, [fig])


def hbars(name, seed, vals, labels, trunc):
    lo = axis_floor(vals, trunc)
    hi = nice_ceil(max(vals) * 1.1)
    n = len(vals)
    l = 0.2
    s = margins(l=l) + block("d", list(zip(labels, vals)))
    s += 'set title "Wrenfield Pier - landings"\n'
    s += "set style fill solid 0.9 border -1\n"
    s += "set yrange [%g:-0.6]\nset xrange [%g:%g]\n" % (n - 0.4, lo, hi)
    s += ("plot $d using (0):0:(0):2:($0-0.3):($0+0.3):ytic(1) "
          "with boxxyerror lc rgb '#d9822b' notitle\n")
    mis = lo != 0
    fig = {"bbox": bbox(l=l), "kind": "bar", "misleading": mis,
           "rule": "bars-off-zero" if mis else None, "values": vals,
           "labels": labels, "axis": {"min": lo, "max": hi,
                                      "scale": "linear", "orientation": "x"},
           "baseline": lo, "style": ["edge-strokes"] + trunc_tags(trunc)}
    return run(name, s, seed, [fig])


def filled(name, seed, vals, labels, trunc, mode, style):
    """mode y0: fill to y=0 (clipped when truncated); x1: fill to the
    bottom axis, i.e. to the axis minimum."""
    lo = axis_floor(vals, trunc)
    hi = nice_ceil(max(vals) * 1.1)
    n = len(vals)
    s = margins() + block("d", list(zip(labels, vals)))
    s += 'set title "Moss Point Dairy - litres"\n'
    s += "set xrange [0:%d]\nset yrange [%g:%g]\n" % (n - 1, lo, hi)
    if "alpha" in style:
        s += "set style fill transparent solid 0.45 noborder\n"
    else:
        s += "set style fill solid 1.0 noborder\n"
    if "gridlines" in style:
        s += "set grid ytics\n"
    s += yfmt("plain")
    how = "filledcurves y1=0" if mode == "y0" else "filledcurves x1"
    s += ("plot $d using 0:2:xtic(1) with %s lc rgb '#3f7f5f' notitle, "
          "$d using 0:2 with lines lw 1.5 lc rgb '#1f4f3f' notitle\n" % how)
    mis = lo != 0
    tags = ["floor-at-axis-min"] if mode == "x1" else []
    fig = {"bbox": bbox(), "kind": "area", "misleading": mis,
           "rule": "area-off-zero" if mis else None, "values": vals,
           "labels": labels, "axis": {"min": lo, "max": hi,
                                      "scale": "linear", "orientation": "y"},
           "baseline": lo, "style": style + tags + trunc_tags(trunc)}
    return run(name, s, seed, [fig])


def histo(name, seed, rng, labels, trunc, mode):
    names = ["Dairy", "Cheese", "Whey"]
    series = [make_values(rng, len(labels), a, b)
              for a, b in ((300, 600), (100, 250), (40, 90))]
    if mode == "clustered":
        series = series[:2]
    rows = [[lab] + [s[i] for s in series] for i, lab in enumerate(labels)]
    if mode == "rowstacked":
        vals = [sum(r[1:]) for r in rows]
        flat_labels = list(labels)
    else:
        vals = [v for r in rows for v in r[1:]]
        flat_labels = ["%s/%s" % (r[0], names[k]) for r in rows
                       for k in range(len(series))]
    lo = axis_floor(vals, trunc)
    hi = nice_ceil(max(vals) * 1.2)
    s = margins() + block("d", rows)
    s += 'set title "Moss Point Dairy - output"\n'
    s += "set style data histograms\n"
    s += ("set style histogram rowstacked\n" if mode == "rowstacked" else
          "set style histogram clustered gap 1\n")
    s += "set style fill solid 0.9 border -1\nset boxwidth 0.7\n"
    s += "set yrange [%g:%g]\nset key top left\n" % (lo, hi)
    cols = ", ".join("$d using %d%s title '%s'" % (
        k + 2, ":xtic(1)" if k == 0 else "", names[k])
        for k in range(len(series)))
    s += "plot " + cols + "\n"
    mis = lo != 0
    fig = {"bbox": bbox(), "kind": "column", "misleading": mis,
           "rule": "bars-off-zero" if mis else None, "values": vals,
           "labels": flat_labels,
           "axis": {"min": lo, "max": hi, "scale": "linear",
                    "orientation": "y"}, "baseline": lo,
           "series": [{"name": names[k], "values": series[k]}
                      for k in range(len(series))],
           "style": ["stacked" if mode == "rowstacked" else "grouped",
                     "edge-strokes"] + trunc_tags(trunc)}
    return run(name, s, seed, [fig])


def log_boxes(name, seed, vals, labels):
    hi = 10 ** math.ceil(math.log10(max(vals) * 1.2))
    s = margins() + block("d", list(zip(labels, vals)))
    s += 'set title "Quillan Seed Co - packets (log)"\n'
    s += "set logscale y\nset yrange [10:%g]\nset format y '%%g'\n" % hi
    s += "set boxwidth 0.6\nset style fill solid 1.0 noborder\n"
    s += "set xrange [-0.6:%g]\n" % (len(vals) - 0.4)
    s += "plot $d using 0:2:xtic(1) with boxes lc rgb '#8e5aa8' notitle\n"
    fig = {"bbox": bbox(), "kind": "column", "misleading": True,
           "rule": "bars-on-log", "values": vals, "labels": labels,
           "axis": {"min": 10, "max": hi, "scale": "log",
                    "orientation": "y"}, "baseline": 10, "style": ["log"]}
    return run(name, s, seed, [fig])


def labelled(name, seed, labs, drawn, labels, hidden):
    hi = nice_ceil(max(drawn) * 1.15)
    rows = [[l, d, str(v)] for l, d, v in zip(labels, drawn, labs)]
    s = margins() + block("d", rows)
    s += 'set title "Dunmarra Bakery - loaves"\n'
    s += "set boxwidth 0.6\nset style fill solid 1.0 noborder\n"
    s += "set xrange [-0.6:%g]\nset yrange [0:%g]\n" % (len(drawn) - 0.4, hi)
    if hidden:
        s += "unset ytics\nset border 1\n"
    s += ("plot $d using 0:2:xtic(1) with boxes lc rgb '#2b6c8f' notitle, "
          "$d using 0:2:3 with labels offset 0,0.7 notitle\n")
    liar = drawn != labs
    axis = {"min": 0, "max": hi, "scale": "linear", "orientation": "y"}
    fig = {"bbox": bbox(), "kind": "column", "misleading": liar,
           "rule": "bars-vs-labels" if liar else None, "values": labs,
           "labels": labels, "axis": None if hidden else axis,
           "baseline": 0, "data_labels": labs,
           "style": ["data-labels-only" if hidden else "data-labels"]}
    if hidden:
        fig["axis_hidden"] = axis
    if liar:
        fig["drawn_values"] = drawn
    return run(name, s, seed, [fig])


def line(name, seed, vals, labels, trunc, points):
    lo = axis_floor(vals, trunc)
    hi = nice_ceil(max(vals) * 1.1)
    s = margins() + block("d", list(zip(labels, vals)))
    s += 'set title "Harrowby Lifts - uptime"\n'
    s += "set xrange [0:%d]\nset yrange [%g:%g]\nset grid\n" % (
        len(vals) - 1, lo, hi)
    s += ("plot $d using 0:2:xtic(1) with %s lw 2 notitle\n"
          % ("linespoints pt 7" if points else "lines"))
    fig = {"bbox": bbox(), "kind": "line", "misleading": False, "rule": None,
           "values": vals, "labels": labels,
           "axis": {"min": lo, "max": hi, "scale": "linear",
                    "orientation": "y"}, "baseline": None,
           "style": ["gridlines"] + (["markers"] if points else [])
           + trunc_tags(trunc)}
    return run(name, s, seed, [fig])


def band(name, seed, rng, labels):
    hi_v = make_values(rng, len(labels), 500, 900)
    lo_v = [int(v * rng.uniform(0.6, 0.8)) for v in hi_v]
    lo = nice_floor(min(lo_v) * 0.9)
    hi = nice_ceil(max(hi_v) * 1.1)
    s = margins() + block("d", list(zip(labels, lo_v, hi_v)))
    s += 'set title "Harrowby Lifts - daily range"\n'
    s += "set xrange [0:%d]\nset yrange [%g:%g]\n" % (len(labels) - 1, lo, hi)
    s += "set style fill solid 0.5 noborder\n"
    s += ("plot $d using 0:2:3:xtic(1) with filledcurves lc rgb '#9fb8d8' "
          "notitle\n")
    fig = {"bbox": bbox(), "kind": "area", "misleading": False, "rule": None,
           "values": hi_v, "labels": labels,
           "axis": {"min": lo, "max": hi, "scale": "linear",
                    "orientation": "y"}, "baseline": None,
           "series": [{"name": "high", "values": hi_v},
                      {"name": "low", "values": lo_v}],
           "style": ["between-series", "truncated-axis"]}
    return run(name, s, seed, [fig])


def multiplot(name, seed, rng):
    """Two charts on one page: truncated boxes left, honest boxes right."""
    v1 = make_values(rng, 5, 300, 800)
    v2 = make_values(rng, 5, 300, 800)
    labels = YEARS[:5]
    lo1 = axis_floor(v1, "severe")
    hi1, hi2 = nice_ceil(max(v1) * 1.1), nice_ceil(max(v2) * 1.1)
    boxes = [(0.08, 0.48), (0.57, 0.97)]
    s = block("a", list(zip(labels, v1))) + block("b", list(zip(labels, v2)))
    s += "set multiplot\nset boxwidth 0.6\nset style fill solid 1 noborder\n"
    s += "set xrange [-0.6:4.6]\n"
    figs = []
    for (l, r), (d, lo, hi, v) in zip(boxes, (("a", lo1, hi1, v1),
                                              ("b", 0, hi2, v2))):
        s += margins(l=l, r=r)
        s += "set yrange [%g:%g]\n" % (lo, hi)
        s += "plot $%s using 0:2:xtic(1) with boxes notitle\n" % d
        mis = lo != 0
        figs.append({"bbox": bbox(l=l, r=r), "kind": "column",
                     "misleading": mis,
                     "rule": "bars-off-zero" if mis else None, "values": v,
                     "labels": labels,
                     "axis": {"min": lo, "max": hi, "scale": "linear",
                              "orientation": "y"}, "baseline": lo,
                     "style": ["multi-chart-page"]
                     + (trunc_tags("severe") if mis else [])})
    s += "unset multiplot\n"
    return run(name, s, seed, figs)


PRODUCER = None


def main():
    global PRODUCER
    PRODUCER = producer()
    os.makedirs(OUT, exist_ok=True)
    for f in os.listdir(OUT):
        if f.endswith((".pdf", ".truth.json", ".gp")):
            os.remove(os.path.join(OUT, f))
    total = 0
    seed = 500
    families = [
        ("gp_boxes_plain", "plain", [], YEARS, 400, 900, 0),
        ("gp_boxes_hatch", "plain", ["hatch"], YEARS[:6], 300, 800, 0),
        ("gp_boxes_usd_grid", "usd", ["gridlines", "edge-strokes"],
         YEARS[:6], 1200, 5400, 0),
        ("gp_boxes_alpha_pct", "percent", ["alpha"], YEARS[:6], 22, 64, 1),
        ("gp_boxes_comma", "comma", ["gridlines"], YEARS[:7], 1.2, 4.8, 1),
        ("gp_boxes_eur", "eur", [], YEARS[:6], 2400, 9800, 0),
        ("gp_boxes_rotated", "plain", ["rotated-labels"],
         ["Week %d" % i for i in range(1, 11)], 300, 700, 0),
    ]
    for name, fmt, style, labels, lo, hi, dec in families:
        seed += 1
        vals = make_values(rng_of(seed), len(labels), lo, hi, dec)
        for trunc, suf in (("none", "honest"), ("mild", "trunc_mild"),
                           ("severe", "trunc_severe")):
            total += columns("%s_%s" % (name, suf), seed, vals, labels, trunc,
                             fmt, style)
    seed += 1
    vals = make_values(rng_of(seed), 44, 500, 1500)
    labs = ["%d" % i for i in range(44)]
    for trunc in ("none", "severe"):
        total += columns("gp_boxes_many_%s" % trunc, seed, vals, labs, trunc,
                         "plain", ["many-bars"])
    seed += 1
    vals = make_values(rng_of(seed), 6, 200, 700)
    for trunc in ("none", "mild", "severe"):
        total += hbars("gp_hbars_%s" % trunc, seed, vals, PIERS, trunc)
    for mode, style in (("y0", []), ("x1", ["alpha", "gridlines"])):
        seed += 1
        vals = make_values(rng_of(seed), 8, 300, 900)
        for trunc in ("none", "mild", "severe"):
            if mode == "x1" and trunc == "none":
                continue  # x1 on a zero-based axis is the y0 honest case
            total += filled("gp_filled_%s_%s" % (mode, trunc), seed, vals,
                            YEARS, trunc, mode, style)
    for mode in ("rowstacked", "clustered"):
        seed += 1
        for trunc in ("none", "severe"):
            total += histo("gp_histo_%s_%s" % (mode, trunc), seed,
                           rng_of(seed), YEARS[:6], trunc, mode)
    for k in range(2):
        seed += 1
        rng = rng_of(seed)
        vals = sorted(int(10 ** rng.uniform(1.6, 3.6)) for _ in range(6))
        total += log_boxes("gp_log_boxes_%d" % k, seed, vals, YEARS[:6])
        total += columns("gp_log_boxes_%d_honest_linear" % k, seed, vals,
                         YEARS[:6], "none", "plain", [])
    for k, hidden in enumerate((True, False)):
        seed += 1
        labs = make_values(rng_of(seed), 5, 400, 900)
        drawn = [int(labs[0] * 0.45 + (d - labs[0]) * 1.6) for d in labs]
        total += labelled("gp_labels_%d_liar" % k, seed, labs, drawn,
                          YEARS[:5], hidden)
        total += labelled("gp_labels_%d_honest" % k, seed, labs, labs,
                          YEARS[:5], hidden)
    for k, (trunc, pts) in enumerate((("severe", False), ("mild", True))):
        seed += 1
        vals = make_values(rng_of(seed), 8, 90, 99, 1)
        total += line("gp_line_%d" % k, seed, vals, YEARS, trunc, pts)
    seed += 1
    total += band("gp_band", seed, rng_of(seed), YEARS)
    seed += 1
    total += multiplot("gp_multiplot", seed, rng_of(seed))
    print("gnuplot: %d figures" % total)


if __name__ == "__main__":
    main()
