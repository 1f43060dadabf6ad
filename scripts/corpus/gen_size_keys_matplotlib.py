#!/usr/bin/python3
"""Generate bubble charts read from a size key in the layouts keys come in
(corpus/matplotlib/key_*): symbols stacked in a column or lined up in a row, with the
values beside, above or below each; nested circles sharing a bottom point with the values
at their tops, beside them or at the end of leader lines; keys inside or outside the plot.
Each layout has a misleading twin (radius ∝ value) and an honest one (area ∝ value).
Truth: the data values and the marker sizes drawn from them; expected measures by
scripts/corpus/truth_shapes.py. Run after gen_matplotlib.py (which empties the folder)."""

import math
import os
import sys

import matplotlib

matplotlib.use("pdf")
import matplotlib.pyplot as plt  # noqa: E402
from matplotlib.lines import Line2D  # noqa: E402
from matplotlib.patches import Circle  # noqa: E402
from matplotlib.transforms import IdentityTransform  # noqa: E402

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from gen_matplotlib import box_of, new_fig, rng_of  # noqa: E402
from gen_shapes_matplotlib import (HUES, OUT, save, values_between,  # noqa: E402
                                   with_spread)

KEY_VALUES = [10, 30, 60]
KEY_GREY = "#9a9a9a"


def marker_size(v, by):
    """matplotlib's s (pt², the square of the marker's diameter): ∝ v is honest,
    ∝ v² draws the radius ∝ v."""
    return 30.0 * v if by == "area" else 0.6 * v * v


def radius_pt(s):
    return math.sqrt(s) / 2


def key_circle(fig, x, y, r, filled):
    """A circle centred at (x, y) in points from the figure's bottom-left (dpi 72)."""
    c = Circle((x, y), r, transform=IdentityTransform(), clip_on=False,
               facecolor=KEY_GREY if filled else "none",
               edgecolor="none" if filled else "#555555", linewidth=0 if filled else 0.8)
    fig.add_artist(c)


def key_text(fig, x, y, text, ha, va):
    w, h = fig.get_figwidth() * 72, fig.get_figheight() * 72
    fig.text(x / w, y / h, text, ha=ha, va=va, fontsize=8)


def draw_key(fig, layout, by, x0, y0):
    """The key with its anchor (x0, y0) in points: a column's top-left, a row's
    left end of its centre line, nested circles' common bottom point."""
    rs = [radius_pt(marker_size(k, by)) for k in KEY_VALUES]
    if layout == "column":
        y = y0
        for k, r in zip(KEY_VALUES, rs):
            y -= r
            key_circle(fig, x0 + rs[-1], y, r, True)
            key_text(fig, x0 + 2 * rs[-1] + 6, y, "%d" % k, "left", "center")
            y -= r + 6
    elif layout in ("row-below", "row-above"):
        x = x0
        for k, r in zip(KEY_VALUES, rs):
            x += r
            key_circle(fig, x, y0, r, True)
            if layout == "row-below":
                key_text(fig, x, y0 - r - 2, "%d" % k, "center", "top")
            else:
                key_text(fig, x, y0 + r + 2, "%d" % k, "center", "bottom")
            x += r + 14
    else:  # nested circles on one bottom point; values at their tops
        cx = x0 + rs[-1]
        for k, r in sorted(zip(KEY_VALUES, rs), key=lambda t: -t[1]):
            key_circle(fig, cx, y0 + r, r, False)
            top = y0 + 2 * r
            if layout == "nested-leader":
                end = cx + rs[-1] + 10
                fig.add_artist(Line2D([cx, end], [top, top], transform=IdentityTransform(),
                                      color="#555555", linewidth=0.6, clip_on=False))
                key_text(fig, end + 2, top, "%d" % k, "left", "center")
            else:
                key_text(fig, cx + rs[-1] + 4, top, "%d" % k, "left", "center")


# where each layout puts its key: (axes rectangle, key anchor in figure fractions, data
# x and y ranges the bubbles keep to, so none sits under an inside key)
LAYOUTS = {
    "column-inside": ((0.1, 0.12, 0.85, 0.78), (0.80, 0.87), (0, 7.2), (0, 10)),
    "row-below-inside": ((0.1, 0.12, 0.85, 0.78), (0.14, 0.80), (0, 10), (0, 6.6)),
    "row-above-outside": ((0.1, 0.1, 0.85, 0.6), (0.14, 0.80), (0, 10), (0, 10)),
    "nested-outside": ((0.1, 0.12, 0.68, 0.78), (0.80, 0.40), (0, 10), (0, 10)),
    "nested-leader-inside": ((0.1, 0.12, 0.85, 0.78), (0.76, 0.62), (0, 7.2), (0, 10)),
}


def keyed_bubbles(seed, by, layout):
    def build():
        rng = rng_of(seed)
        n = 7
        v = with_spread(rng, values_between(rng, n, 5, 60), (5, 9), (50, 60))
        rect, anchor, xr, yr = LAYOUTS[layout]
        # one bubble per cell of a grid over the data ranges, jittered: no two overlap
        cols = 3 if xr[1] - xr[0] < 9 else 4
        rows = 2 if yr[1] - yr[0] < 9 else 3
        cells = rng.sample([(c, r) for c in range(cols) for r in range(rows)], min(n, cols * rows))
        n = len(cells)
        v = v[:n]
        cw, ch = (xr[1] - xr[0]) / cols, (yr[1] - yr[0]) / rows
        xs = [xr[0] + cw * (c + 0.5) + rng.uniform(-0.1, 0.1) * cw for c, _ in cells]
        ys = [yr[0] + ch * (r + 0.5) + rng.uniform(-0.1, 0.1) * ch for _, r in cells]
        fig = new_fig(6.4, 5.2 if layout == "row-above-outside" else 4.2)
        ax = fig.add_axes(rect)
        s = [marker_size(x, by) for x in v]
        ax.scatter(xs, ys, s=s, color=HUES[0][0], alpha=0.85, linewidths=0)
        ax.set_xlim(0, 10)
        ax.set_ylim(0, 10)
        ax.set_xlabel("Rainfall (mm per week)")
        ax.set_ylabel("Hive weight gain (kg)")
        fig.suptitle("Apiaries of Fernhollow: bubble size = colonies kept", fontsize=10,
                     x=0.1, y=0.98, ha="left", va="top")
        w, h = fig.get_figwidth() * 72, fig.get_figheight() * 72
        layout_kind = layout.rsplit("-", 1)[0]
        draw_key(fig, layout_kind, by, anchor[0] * w, anchor[1] * h)
        d = {"kind": "bubble", "misleading": by != "area",
             "rule": "symbols-not-by-area" if by != "area" else None, "values": v,
             "labels": ["apiary %d" % (i + 1) for i in range(n)], "axis": None,
             "baseline": None, "data_labels": None,
             "symbols": {"measure": "area", "sizes": s, "shape": "circle"},
             "style": ["scatter", "size-key", "key-" + layout, "by-" + by, "alpha"]}
        d["bbox"] = box_of(fig, ax)
        return fig, [d]
    return build


PLAN = []
for i, layout in enumerate(LAYOUTS):
    for by in ("radius", "area"):
        PLAN.append(("key_%s_%s" % (layout.replace("-", "_"), by), 941 + i,
                     keyed_bubbles(941 + i, by, layout)))


def main():
    os.makedirs(OUT, exist_ok=True)
    for name, seed, builder in PLAN:
        save(name, seed, builder)
    print("matplotlib size keys: %d charts" % len(PLAN))


if __name__ == "__main__":
    main()
