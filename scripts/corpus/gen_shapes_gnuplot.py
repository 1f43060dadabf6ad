#!/usr/bin/python3
"""Generate the bubble charts of the gnuplot corpus (corpus/gnuplot/shape_*): `with
circles` (radius in x-axis units) scaled by value (radius ∝ v, misleading) or by its
square root (area ∝ v, honest), values printed `with labels` or on a size key, and a
constant-size circle scatter. Run after gen_gnuplot.py (which empties the folder)."""

import math
import os
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import gen_gnuplot as gg  # noqa: E402
import truth_shapes  # noqa: E402

PLOTS = ["Harrowby", "Selkirk Bay", "Moss Point", "Quillan", "Dunmarra", "Wrenfield",
         "Ostry"]


def bubbles(name, seed, by, labels=True):
    rng = gg.rng_of(seed)
    n = 6
    v = [int(rng.uniform(4, 80)) for _ in range(n)]
    i, k = rng.sample(range(n), 2)  # a wide spread whatever the seed (held-out corpora)
    v[i], v[k] = int(rng.uniform(4, 10)), int(rng.uniform(70, 80))
    xs = [round(rng.uniform(16, 84), 1) for _ in range(n)]  # inside the frame: none clipped
    ys = [round(rng.uniform(25, 75), 1) for _ in range(n)]
    if by == "radius":
        r = [round(0.16 * x, 3) for x in v]
    elif by == "area":
        r = [round(1.4 * math.sqrt(x), 3) for x in v]
    else:
        r = [3.0] * n
    s = gg.margins() + gg.block("d", list(zip(xs, ys, r, v)))
    s += 'set title "Selkirk Tramways - depots (circle size: staff)"\n'
    s += "set xrange [0:100]\nset yrange [0:100]\n"
    s += "set xlabel 'Distance from centre (km)'\nset ylabel 'Punctuality (%)'\n"
    s += "set style fill solid 0.75 noborder\n"
    s += "unset key\n"
    plot = "plot $d using 1:2:3 with circles lc rgb '#8e5aa8'"
    if labels and by != "constant":
        plot += ", $d using 1:2:(sprintf('%d', $4)) with labels font 'Sans,8'"
    s += plot + "\n"
    fig = {"bbox": gg.bbox(), "style": ["scatter", "by-" + by]}
    if by == "constant":
        fig.update({"kind": "line", "misleading": False, "rule": None, "values": [],
                    "labels": [], "axis": None, "baseline": None})
        fig["style"].append("constant-size")
    else:
        fig.update({"kind": "bubble", "misleading": by == "radius",
                    "rule": "symbols-not-by-area" if by == "radius" else None,
                    "values": v, "labels": PLOTS[:n], "axis": None, "baseline": None,
                    "data_labels": list(v) if labels else None,
                    "symbols": {"measure": "radius", "sizes": r, "shape": "circle"}})
        fig["style"].append("data-labels")
    gg.run(name, s, seed, [fig])
    lf = (fig.get("expected") or {}).get("lie_factor_growth")
    if fig["kind"] == "bubble" and fig["misleading"] == truth_shapes.faithful(fig.get("expected")):
        raise SystemExit("%s: misleading=%s but lie factor %s" % (name, fig["misleading"], lf))


def main():
    gg.PRODUCER = gg.producer()
    os.makedirs(gg.OUT, exist_ok=True)
    bubbles("shape_circles_radius", 931, "radius")
    bubbles("shape_circles_area", 931, "area")
    bubbles("shape_circles_radius_b", 932, "radius")
    bubbles("shape_circles_area_b", 932, "area")
    bubbles("shape_circles_constant", 933, "constant")
    print("gnuplot shapes: 5 charts")


if __name__ == "__main__":
    main()
