#!/usr/bin/python3
"""Pies drawn by gnuplot (`with circles` and start/end angles, pdfcairo terminal) for the
corpus (corpus/gnuplot/gpc_*.pdf): honest, angles that disagree with the printed
percentages, percentages that do not sum to 100, and a donut whose hole is a white disc
painted on top. Runs after gen_gnuplot.py, which empties the directory."""

import math
import os
import random
import subprocess
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import truth  # noqa: E402

ROOT = os.environ.get("PP_CORPUS_ROOT") or os.path.dirname(os.path.dirname(
    os.path.dirname(os.path.abspath(__file__))))
OUT = os.path.join(ROOT, "corpus", "gnuplot")
W_IN, H_IN = 5.0, 4.0
W, H = W_IN * 72.0, H_IN * 72.0
L, R, B, T = 0.1, 0.9, 0.1, 0.9
# Ranges with equal scale on both axes: 0.8·360 pt over 3 units, 0.8·288 pt over 2.4.
XR, YR = 1.5, 1.2
SEED = 4207
NAMES = ["Quay fees", "Tickets", "Cargo", "Catering", "Other"]
# scripts/holdout sets PP_CORPUS_SEED_OFFSET: the same charts with other invented data.
OFFSET = int(os.environ.get("PP_CORPUS_SEED_OFFSET", "0"))
RNG = random.Random(SEED + OFFSET)


def vary(values):
    """The values as given, or (held-out runs) others of the same size order."""
    if not OFFSET:
        return list(values)
    return sorted((max(3.0, float(round(v * RNG.uniform(0.6, 1.4)))) for v in values),
                  reverse=True)


def mislead(values, given):
    """Angles that disagree with the labels: the given ones, or the values reversed."""
    return list(given) if not OFFSET else list(reversed(values))


COLOURS = ["0x3b6ea5", "0xe08a2c", "0x5a9e4b", "0xc4453c", "0x8a6bb5"]


def producer():
    out = subprocess.run(["gnuplot", "--version"], capture_output=True,
                         text=True).stdout.strip()
    return out or "gnuplot"


def pie_box(r=1.0):
    """The pie's box in points, top-left origin: centre of the plot box ± r units."""
    unit = (R - L) * W / (2 * XR)
    cx, cy = (L + R) / 2 * W, (1 - (B + T) / 2) * H
    return [round(cx - r * unit, 2), round(cy - r * unit, 2), round(cx + r * unit, 2),
            round(cy + r * unit, 2)]


def pie(name, values, printed, drawn=None, rule=None, hole=0.0, decimals=0, notes=None):
    drawn = drawn or values
    total = sum(drawn)
    rows, labels = [], []
    a = 90.0
    for i, d in enumerate(drawn):
        sweep = 360.0 * d / total
        rows.append("0 0 1 %.6f %.6f %s" % (a - sweep, a, COLOURS[i]))
        mid = math.radians(a - sweep / 2)
        rl = 0.78 if hole else 0.62
        fmt = "%%.%df%%%%" % decimals
        labels.append('set label %d "%s" at %.4f,%.4f center front textcolor rgb "white"'
                      % (i + 1, fmt % printed[i], rl * math.cos(mid), rl * math.sin(mid)))
        labels.append('set label %d "%s" at %.4f,%.4f center' % (
            i + 20, NAMES[i], 1.22 * math.cos(mid), 1.12 * math.sin(mid)))
        a -= sweep
    data = "\n".join(rows)
    script = ('set terminal pdfcairo size %gin,%gin font "Sans,9"\n'
              "set output '%s'\n" % (W_IN, H_IN, os.path.join(OUT, name + ".pdf")))
    script += ("set lmargin at screen %g\nset rmargin at screen %g\n"
               "set bmargin at screen %g\nset tmargin at screen %g\n" % (L, R, B, T))
    script += ("unset border\nunset tics\nunset key\nset xrange [%g:%g]\nset yrange [%g:%g]\n"
               % (-XR, XR, -YR, YR))
    script += 'set title "Port revenue by source, 2031"\n'
    script += "set style fill solid 1.0 border lc rgb 'white'\n"
    script += "\n".join(labels) + "\n"
    if hole:
        script += ("set object 1 circle at 0,0 size %g fillcolor rgb 'white' "
                   "fillstyle solid 1.0 noborder front\n" % hole)
    script += "$pie << EOD\n%s\nEOD\n" % data
    script += "plot $pie using 1:2:3:4:5:6 with circles lc rgb variable\nunset output\n"
    gp = os.path.join(OUT, name + ".gp")
    with open(gp, "w") as fh:
        fh.write(script)
    subprocess.run(["gnuplot", gp], check=True)
    os.remove(gp)
    circle = {"drawn_values": list(drawn), "printed": list(printed),
              "printed_kind": "percent", "decimals": decimals, "start": math.pi / 2,
              "direction": -1, "inner": hole}
    fig = {"page": 1, "bbox": pie_box(), "kind": "pie", "misleading": rule is not None,
           "rule": rule, "values": list(values), "labels": NAMES[:len(values)],
           "axis": None, "baseline": None, "data_labels": list(printed),
           "style": ["gnuplot", "labels-inside"] + (["donut", "white-hole"] if hole else []),
           "circle": circle}
    if notes:
        fig["notes"] = notes
    truth.write_truth(os.path.join(OUT, name + ".pdf"), producer(), SEED + OFFSET, 1, [fig],
                      ROOT)


def pct(values, decimals=0):
    return [round(100.0 * v / sum(values), decimals) for v in values]


def main():
    os.makedirs(OUT, exist_ok=True)
    v = vary([36.0, 28.0, 19.0, 11.0, 6.0])
    pie("gpc_pie_honest", v, pct(v))
    pie("gpc_pie_angles_wrong", v, pct(v), drawn=mislead(v, [26.0, 26.0, 22.0, 15.0, 11.0]),
        rule="wedges-vs-labels")
    off = pct(v)[:-1] + [pct(v)[-1] + 9]
    pie("gpc_pie_sum_off", v, off, rule="shares-not-100",
        notes="the last label is 9 points too high; the labels sum to %g" % sum(off))
    v2 = vary([44.0, 30.0, 18.0, 8.0])
    pie("gpc_donut_hole_honest", v2, pct(v2), hole=0.55)


if __name__ == "__main__":
    main()
