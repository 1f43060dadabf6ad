#!/usr/bin/python3
"""Generate the shape charts of the matplotlib corpus (corpus/matplotlib/shape_*):
3D bars with hand-drawn oblique faces and mplot3d bar3d, pyramids and funnels drawn with
fill, bubble charts drawn with scatter, and the honest lookalikes of each. Every misleading
chart has an honest twin. Truth: the values and the geometry chosen from them; expected
measures by scripts/corpus/truth_shapes.py. Run after gen_matplotlib.py (which empties
the folder)."""

import math
import os
import sys

import matplotlib

matplotlib.use("pdf")
import matplotlib.pyplot as plt  # noqa: E402

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import truth  # noqa: E402
import truth_shapes  # noqa: E402
from gen_matplotlib import (META, PRODUCER, ROOT, box_of, new_fig,  # noqa: E402
                            rng_of)

OUT = os.path.join(ROOT, "corpus", "matplotlib")
STAGES = ["Enquiries", "Site visits", "Proposals", "Shortlisted", "Signed"]
TIERS = ["Seedlings", "Saplings", "Young trees", "Mature trees"]
ORCHARDS = ["Kestrel", "Wrenmoor", "Fallow", "Ashby", "Corrin",
            "Tallow"]
HUES = [("#2b6c8f", "#5b9cbf", "#1b4c6f"), ("#d9822b", "#f0a85b", "#a9621b"),
        ("#5a9e4b", "#8ace7b", "#3a7e2b"), ("#8e5aa8", "#be8ad8", "#6e3a88")]


def values_between(rng, n, lo, hi):
    return [int(rng.uniform(lo, hi)) for _ in range(n)]


def with_spread(rng, v, low, high):
    """One value near the bottom of the range and another near the top, so that a
    misleading twin stays misleading whatever the seed (held-out corpora)."""
    i, k = rng.sample(range(len(v)), 2)
    v[i] = int(rng.uniform(*low))
    v[k] = int(rng.uniform(*high))
    return v


def save(name, seed, builder):
    path = os.path.join(OUT, name + ".pdf")
    with matplotlib.rc_context({"pdf.fonttype": 42}):
        fig, figures = builder()
        fig.savefig(path, metadata=META)
        plt.close(fig)
    for d in figures:
        d["page"] = 1
        d.setdefault("style", []).append("fonttype42")
    truth.write_truth(path, PRODUCER, seed, 1, figures, ROOT)
    for d in figures:  # the generator's intent must agree with the measure it implies
        lf = (d.get("expected") or {}).get("lie_factor_growth")
        if d["kind"] in truth_shapes.KINDS and lf is not None:
            if d["misleading"] == truth_shapes.faithful(d.get("expected")):
                raise SystemExit("%s: misleading=%s but lie factor %.3f" %
                                 (name, d["misleading"], lf))


# --- 3D bars with hand-drawn oblique faces ------------------------------------------

def oblique_bars(seed, deep, wall=False, title="Cider pressed (t)"):
    """Front rectangle, cap and side parallelograms per bar (fill polygons), value axis
    on the front plane, or on a back wall with gridlines (wall=True): there a bar's value
    is where the back edge of its cap meets the wall gridline."""
    def build():
        rng = rng_of(seed)
        v = with_spread(rng, values_between(rng, 6, 15, 95), (12, 18), (88, 95)) if deep \
            else values_between(rng, 6, 70, 95)
        w = 0.6
        dx, dy = (0.3, 14.0) if deep else (0.05, 0.35)
        fig = new_fig()
        ax = fig.add_axes((0.13, 0.14, 0.8, 0.76))
        top = 110
        if wall:
            # the wall behind the bars: gridlines and ticks shifted by the depth
            ticks = list(range(0, top + 1, 20))
            for t in ticks:
                ax.plot([-0.5 + dx, len(v) - 0.5 + dx], [t + dy, t + dy], color="#bbbbbb",
                        linewidth=0.6, zorder=0)
                ax.plot([-0.5, -0.5 + dx], [t, t + dy], color="#bbbbbb", linewidth=0.6,
                        zorder=0)
            ax.set_yticks([t + dy for t in ticks])
            ax.set_yticklabels([str(t) for t in ticks])
            base_y = 0.0
        else:
            ax.grid(True, axis="y", color="#bbbbbb", linewidth=0.6)
            ax.set_axisbelow(True)
            base_y = 0.0
        for i, vi in enumerate(v):
            x0 = i - w / 2
            front_c, cap_c, side_c = HUES[0]
            h = vi - 0.0
            y0 = base_y
            ax.fill([x0, x0 + w, x0 + w, x0], [y0, y0, y0 + h, y0 + h], color=front_c,
                    linewidth=0, zorder=3)
            ax.fill([x0, x0 + w, x0 + w + dx, x0 + dx], [y0 + h, y0 + h, y0 + h + dy, y0 + h + dy],
                    color=cap_c, linewidth=0, zorder=3)
            ax.fill([x0 + w, x0 + w + dx, x0 + w + dx, x0 + w],
                    [y0, y0 + dy, y0 + h + dy, y0 + h], color=side_c, linewidth=0, zorder=3)
        ax.set_xlim(-0.7, len(v) - 0.3)
        ax.set_ylim(0, top + (dy if wall else 0))
        ax.set_xticks(range(len(v)))
        ax.set_xticklabels(ORCHARDS[:len(v)])
        ax.set_title(title, fontsize=11)
        d = {"kind": "bar-3d", "misleading": deep,
             "rule": "bars-3d-ink" if deep else None, "values": v,
             "labels": ORCHARDS[:len(v)],
             "axis": {"min": 0.0, "max": float(top), "scale": "linear", "orientation": "y"},
             "baseline": 0.0,
             "solid": {"projection": "oblique", "front_width": w, "depth": [dx, dy],
                       "base": 0.0},
             "style": ["oblique", "gridlines"] + (["wall"] if wall else [])}
        d["bbox"] = box_of(fig, ax)
        return fig, [d]
    return build


def stacked_oblique(seed):
    """Two-segment stacked oblique bars: only the top segment carries the cap, so the top
    segment's ink holds a constant the bottom one has not. Values: the segments, flattened
    category-major (bottom, top, bottom, top, ...)."""
    def build():
        rng = rng_of(seed)
        low = values_between(rng, 5, 20, 45)
        up = with_spread(rng, values_between(rng, 5, 15, 40), (4, 7), (36, 40))
        w, dx, dy = 0.6, 0.3, 12.0
        fig = new_fig()
        ax = fig.add_axes((0.13, 0.14, 0.8, 0.76))
        ax.grid(True, axis="y", color="#bbbbbb", linewidth=0.6)
        ax.set_axisbelow(True)
        for i, (a, b) in enumerate(zip(low, up)):
            x0 = i - w / 2
            for k, (y0, h) in enumerate(((0, a), (a, b))):
                fc, cc, sc = HUES[k]
                ax.fill([x0, x0 + w, x0 + w, x0], [y0, y0, y0 + h, y0 + h], color=fc,
                        linewidth=0, zorder=3)
                ax.fill([x0 + w, x0 + w + dx, x0 + w + dx, x0 + w],
                        [y0, y0 + dy, y0 + h + dy, y0 + h], color=sc, linewidth=0, zorder=3)
                if k == 1:
                    ax.fill([x0, x0 + w, x0 + w + dx, x0 + dx],
                            [y0 + h, y0 + h, y0 + h + dy, y0 + h + dy], color=cc,
                            linewidth=0, zorder=3)
        ax.set_xlim(-0.7, len(low) - 0.3)
        ax.set_ylim(0, 100)
        ax.set_xticks(range(len(low)))
        ax.set_xticklabels(ORCHARDS[:len(low)])
        ax.set_title("Cider and perry pressed (t)", fontsize=11)
        flat = [x for ab in zip(low, up) for x in ab]
        d = {"kind": "bar-3d", "misleading": True, "rule": "bars-3d-ink", "values": flat,
             "labels": ["%s/%s" % (o, s) for o in ORCHARDS[:len(low)]
                        for s in ("cider", "perry")],
             "axis": {"min": 0.0, "max": 100.0, "scale": "linear", "orientation": "y"},
             "baseline": 0.0,
             "series": [{"name": "cider", "values": low}, {"name": "perry", "values": up}],
             "solid": {"projection": "oblique", "front_width": w, "depth": [dx, dy],
                       "base": 0.0, "capped": [False, True] * len(low),
                       "segment_base": [y for a in low for y in (0, a)]},
             "style": ["oblique", "stacked", "gridlines"],
             "notes": "segments of oblique stacked bars; only the top segment has a cap"}
        d["bbox"] = box_of(fig, ax)
        return fig, [d]
    return build


# --- pyramids and funnels ------------------------------------------------------------

def pyramid(seed, honest, inverted=False, percent=False, decimals=1):
    """Triangle cut into slices. Misleading: slice heights ∝ values, so areas follow
    h2² − h1². Honest: cut depths h_k = H·sqrt(cumulative share), so areas ∝ values.
    decimals=0: whole percentages with one thin slice, where rounding alone moves a share
    by up to a tenth (honest: must stay quiet); the misleading one then has values summing
    to 100, so its labels print them exactly."""
    def build():
        rng = rng_of(seed)
        v = values_between(rng, 4, 8, 40)
        if percent and decimals == 0 and not honest:
            v[rng.randrange(4)] = int(rng.uniform(3, 6))
            v[-1] = max(3, 100 - sum(v[:-1]))
        while percent and decimals == 0 and honest:
            # a thin slice whose share is a third of a point or more off its printed one
            v = values_between(rng, 4, 80, 400)
            k = rng.randrange(4)
            v[k] = int(rng.uniform(12, 20))
            off = abs(100 * v[k] / sum(v) - round(100 * v[k] / sum(v)))
            if off >= 0.3:
                break
        names = TIERS if not inverted else STAGES[:4]
        H, Wb = 10.0, 8.0
        tot = sum(v)
        cum, depths = 0, [0.0]
        order = v  # top to bottom as drawn
        for x in order:
            cum += x
            depths.append(H * (math.sqrt(cum / tot) if honest else cum / tot))
        fig = new_fig(6.0, 4.6)
        ax = fig.add_axes((0.08, 0.06, 0.6, 0.84))
        shape = []
        for i, x in enumerate(order):
            h1, h2 = depths[i], depths[i + 1]
            # half-width at depth h below the apex: Wb/2 · h/H
            a1, a2 = Wb / 2 * h1 / H, Wb / 2 * h2 / H
            ys = [H - h1, H - h1, H - h2, H - h2]  # inverted: the y axis is flipped below
            xs = [-a1, a1, a2, -a2]
            ax.fill(xs, ys, color=HUES[i % 4][0], edgecolor="white", linewidth=1.0)
            mid = H - (h1 + h2) / 2
            txt = ("%.*f%%" % (decimals, 100 * x / tot)) if percent else "%d" % x
            ax.text(0, mid, txt, ha="center", va="center", fontsize=9, color="white")
            ax.text(Wb / 2 + 0.3, mid, names[i], ha="left", va="center", fontsize=9)
            shape.append([2 * a1, 2 * a2, h2 - h1])
        if inverted:
            ax.invert_yaxis()  # apex down: widest slice on top
        ax.set_xlim(-Wb / 2, Wb / 2)
        ax.set_ylim(0, H) if not inverted else ax.set_ylim(H, 0)
        ax.axis("off")
        fig.suptitle("Orchard stock by tier" if not inverted else "Buyer funnel",
                     fontsize=11)
        d = {"kind": "pyramid", "misleading": not honest,
             "rule": None if honest else "slices-vs-values", "values": v, "labels": names,
             "axis": None, "baseline": None,
             "data_labels": [round(100 * x / tot, decimals) for x in v] if percent
             else list(v),
             "slices": {"shape": shape, "solid": "cone", "order": "top-to-bottom"},
             "style": ["triangle"] + (["inverted"] if inverted else []) +
                      (["percent"] if percent else []) +
                      (["whole-percent"] if percent and decimals == 0 else [])}
        d["bbox"] = box_of(fig, ax)
        return fig, [d]
    return build


def funnel(seed, honest):
    """Misleading: connected trapezoids of equal height, top width ∝ v_i and bottom width
    ∝ v_{i+1}, so a slice's area follows the mean of two values. Honest: centred bars of
    equal height and width ∝ value (area ∝ value)."""
    def build():
        rng = rng_of(seed)
        v = sorted(with_spread(rng, values_between(rng, 5, 80, 900), (80, 120), (800, 900)),
                   reverse=True)
        fig = new_fig(6.0, 4.6)
        ax = fig.add_axes((0.06, 0.06, 0.62, 0.84))
        k = 8.0 / max(v)
        hgt = 1.0
        shape = []
        for i, x in enumerate(v):
            top = k * x
            bot = k * v[i + 1] if (i + 1 < len(v) and not honest) else \
                (k * x if honest else k * x * 0.6)
            y0 = len(v) - i
            ax.fill([-top / 2, top / 2, bot / 2, -bot / 2], [y0, y0, y0 - hgt, y0 - hgt],
                    color=HUES[1][0] if honest else HUES[2][0], edgecolor="white",
                    linewidth=1.5)
            ax.text(0, y0 - hgt / 2, "{:,}".format(x), ha="center", va="center", fontsize=9,
                    color="white")
            ax.text(4.3, y0 - hgt / 2, STAGES[i], ha="left", va="center", fontsize=9)
            shape.append([top, bot, hgt])
        ax.set_xlim(-4.2, 4.2)
        ax.set_ylim(0, len(v))
        ax.axis("off")
        fig.suptitle("Wholesale buyers, Kestrel Orchards", fontsize=11)
        d = {"kind": "pyramid", "misleading": not honest,
             "rule": None if honest else "slices-vs-values", "values": v, "labels": STAGES,
             "axis": None, "baseline": None, "data_labels": list(v),
             "slices": {"shape": shape, "solid": "cone", "order": "top-to-bottom"},
             "style": ["funnel"] + (["centred-bars"] if honest else ["trapezoid"])}
        d["bbox"] = box_of(fig, ax)
        return fig, [d]
    return build


def population_pyramid(seed, cut=0):
    """Two-sided horizontal bars from a central zero: honest bars, not slices. With cut > 0
    the bars start from the value cut at the shared line (its tick label prints it), so
    their lengths stand for value - cut: bars off zero. Truth: the values drawn; the ink of
    each bar is proportional to value - cut (truth.py, the baseline)."""
    def build():
        rng = rng_of(seed)
        ages = ["0-9", "10-19", "20-29", "30-39", "40-49", "50-59", "60+"]
        left = values_between(rng, 7, 120, 480)
        right = values_between(rng, 7, 120, 480)
        fig = new_fig()
        ax = fig.add_axes((0.13, 0.12, 0.8, 0.78))
        y = list(range(len(ages)))
        ax.barh(y, [-(a - cut) for a in left], color=HUES[0][0], height=0.8)
        ax.barh(y, [b - cut for b in right], color=HUES[1][0], height=0.8)
        ax.set_yticks(y)
        ax.set_yticklabels(ages)
        if cut:
            ax.set_xlim(-(500 - cut), 500 - cut)
            ticks = [t for t in range(-400, 401, 100) if abs(t) <= 500 - cut]
            ax.set_xticks(ticks)
            ax.set_xticklabels(["%d" % (abs(t) + cut) for t in ticks])
        else:
            ax.set_xlim(-500, 500)
            ax.set_xticks([-400, -200, 0, 200, 400])
            ax.set_xticklabels(["400", "200", "0", "200", "400"])
        ax.set_title("Orchard workers by age (left: seasonal, right: permanent)", fontsize=10)
        d = {"kind": "bar", "misleading": cut > 0, "rule": "bars-off-zero" if cut else None,
             # magnitudes when judged (the scale reads them on both sides)
             "values": ([a for a in left] if cut else [-a for a in left]) + right,
             "labels": ["%s/seasonal" % a for a in ages] + ["%s/permanent" % a for a in ages],
             "axis": {"min": -500.0 if not cut else float(cut), "max": 500.0, "scale": "linear",
                      "orientation": "x"},
             "baseline": float(cut), "style": ["population-pyramid", "two-sided"] +
                                               (["truncated"] if cut else []),
             "notes": "tick labels print magnitudes on both sides" +
                      (", from %d at the shared line" % cut if cut else "")}
        d["bbox"] = box_of(fig, ax)
        return fig, [d]
    return build


def chevrons(seed):
    """A process flow of chevrons and an arrow: shapes without values."""
    def build():
        fig = new_fig(7.0, 2.6)
        ax = fig.add_axes((0.03, 0.1, 0.94, 0.7))
        steps = ["Harvest", "Sort", "Press", "Ferment", "Bottle"]
        for i, s in enumerate(steps):
            x = i * 2.0
            ax.fill([x, x + 1.6, x + 2.0, x + 1.6, x, x + 0.4], [0, 0, 0.5, 1, 1, 0.5],
                    color=HUES[i % 4][0], linewidth=0)
            ax.text(x + 1.0, 0.5, s, ha="center", va="center", color="white", fontsize=9)
        ax.fill([0, 8.6, 8.6, 10.0, 8.6, 8.6, 0], [-0.5, -0.5, -0.65, -0.35, -0.05, -0.2, -0.2],
                color="#999999", linewidth=0)
        ax.set_xlim(-0.2, 10.2)
        ax.set_ylim(-0.8, 1.1)
        ax.axis("off")
        fig.suptitle("How Tallow Brook cider is made", fontsize=11)
        d = {"kind": "other", "misleading": False, "rule": None, "values": [], "labels": [],
             "axis": None, "baseline": None, "style": ["chevrons", "arrow"]}
        d["bbox"] = box_of(fig, ax)
        return fig, [d]
    return build


# --- bubbles -----------------------------------------------------------------------

def bubbles(seed, by, key=False):
    """Scatter with marker sizes from a third value, printed beside each bubble
    (or read from a size key when key=True). matplotlib's s is the marker area in pt²:
    by='area' draws s ∝ v (honest), by='radius' s ∝ v² (radius ∝ v)."""
    def build():
        rng = rng_of(seed)
        n = 7
        v = with_spread(rng, values_between(rng, n, 5, 60), (5, 9), (50, 60))
        # one bubble per cell of a 4x3 grid, jittered: no two overlap, none is clipped
        cells = rng.sample([(c, r) for c in range(4) for r in range(3)], n)
        xs = [1.6 + 2.25 * c + rng.uniform(-0.3, 0.3) for c, _ in cells]
        ys = [2.0 + 3.0 * r + rng.uniform(-0.3, 0.3) for _, r in cells]
        fig = new_fig()
        ax = fig.add_axes((0.1, 0.12, 0.68 if key else 0.85, 0.78))
        if by == "area":
            s = [40.0 * x for x in v]
        else:
            s = [1.2 * x * x for x in v]
        ax.scatter(xs, ys, s=s, color=HUES[3][0], alpha=0.8, linewidths=0)
        if not key:
            for x, y, val in zip(xs, ys, v):
                ax.annotate("%d" % val, (x, y), ha="center", va="center", fontsize=8,
                            color="black")
        else:
            kv = [10, 30, 60]
            for j, k in enumerate(kv):
                sk = 40.0 * k if by == "area" else 1.2 * k * k
                fig_ax = ax.scatter([10.8], [8.5 - 2.5 * j], s=sk, color="#bbbbbb",
                                    clip_on=False, linewidths=0)
                ax.annotate("%d" % k, (11.6, 8.5 - 2.5 * j), ha="left", va="center",
                            fontsize=8, annotation_clip=False)
                del fig_ax
        ax.set_xlim(0, 10)
        ax.set_ylim(0, 10)
        ax.set_xlabel("Yield per hectare (t)")
        ax.set_ylabel("Sugar content (Brix)")
        ax.set_title("Orchard plots: bubble size = pickers employed", fontsize=10)
        d = {"kind": "bubble", "misleading": by != "area",
             "rule": "symbols-not-by-area" if by != "area" else None, "values": v,
             "labels": ["plot %d" % (i + 1) for i in range(n)], "axis": None,
             "baseline": None, "data_labels": None if key else list(v),
             "symbols": {"measure": "area", "sizes": s, "shape": "circle"},
             "style": ["scatter", "size-key" if key else "data-labels",
                       "by-" + by, "alpha"]}
        d["bbox"] = box_of(fig, ax)
        return fig, [d]
    return build


def constant_scatter(seed, dots=False):
    """Lookalikes: a scatter with one marker size, or a dot plot of categories."""
    def build():
        rng = rng_of(seed)
        fig = new_fig()
        ax = fig.add_axes((0.2 if dots else 0.1, 0.12, 0.75, 0.78))
        if dots:
            v = values_between(rng, 6, 20, 90)
            ax.scatter(v, range(6), s=60, color=HUES[0][0], zorder=3)
            ax.set_yticks(range(6))
            ax.set_yticklabels(ORCHARDS)
            ax.grid(True, axis="y", color="#dddddd")
            ax.set_xlim(0, 100)
            title = "Trees replanted per orchard"
        else:
            v = []
            ax.scatter([rng.uniform(1, 9) for _ in range(25)],
                       [rng.uniform(1, 9) for _ in range(25)], s=50, color=HUES[2][0])
            ax.set_xlim(0, 10)
            ax.set_ylim(0, 10)
            title = "Plots: yield against sugar content"
        ax.set_title(title, fontsize=10)
        d = {"kind": "line", "misleading": False, "rule": None, "values": v,
             "labels": ORCHARDS if dots else [], "axis": None, "baseline": None,
             "style": ["scatter", "dot-plot" if dots else "constant-size"]}
        d["bbox"] = box_of(fig, ax)
        return fig, [d]
    return build


def map_symbols(seed):
    """Towns on a sketch map as circles of three sizes by class, no numbers: symbols
    without values."""
    def build():
        rng = rng_of(seed)
        fig = new_fig(5.5, 5.0)
        ax = fig.add_axes((0.05, 0.05, 0.9, 0.85))
        ax.fill([0.5, 9.2, 9.6, 6.0, 1.0], [0.8, 0.4, 7.5, 9.5, 8.0], color="#e8efe0",
                edgecolor="#7a9a6a")
        towns = ["Wrenmoor", "Fallow Cross", "Ashby", "Corrin", "Tallow", "Ebbsfleet Hythe"]
        for i, t in enumerate(towns):
            x, y = rng.uniform(1.5, 8), rng.uniform(1.5, 7.5)
            ax.scatter([x], [y], s=[30, 90, 200][i % 3], color="#aa3333", zorder=3)
            ax.text(x + 0.3, y + 0.3, t, fontsize=8)
        ax.set_xlim(0, 10)
        ax.set_ylim(0, 10)
        ax.axis("off")
        fig.suptitle("Depots of the Tallow Brook co-operative", fontsize=11)
        d = {"kind": "other", "misleading": False, "rule": None, "values": [], "labels": [],
             "axis": None, "baseline": None, "style": ["map-symbols"]}
        d["bbox"] = box_of(fig, ax)
        return fig, [d]
    return build


# --- mplot3d bar3d: a value over two categorical dimensions ---------------------------

# Faces of a box (x0..x1, y0..y1, z0..z1) as corner indices, each counter-clockwise seen
# from outside (right-hand normal outward): a face is seen when its projected outline
# keeps that turn on the page (textbook back-face test).
BOX_FACES = {"bottom": (0, 3, 2, 1), "top": (4, 5, 6, 7), "y0": (0, 1, 5, 4),
             "x1": (1, 2, 6, 5), "y1": (2, 3, 7, 6), "x0": (3, 0, 4, 7)}


def box_corners(x0, y0, z0, dx, dy, dz):
    return [(x0, y0, z0), (x0 + dx, y0, z0), (x0 + dx, y0 + dy, z0), (x0, y0 + dy, z0),
            (x0, y0, z0 + dz), (x0 + dx, y0, z0 + dz), (x0 + dx, y0 + dy, z0 + dz),
            (x0, y0 + dy, z0 + dz)]


def bar3d_grid(seed, honest):
    """Axes3D.bar3d over years x orchards, orthographic view. Misleading: wide footprints
    seen from above (a top face of constant size on every bar) over values from 6 to 60,
    nearer bars hiding parts of those behind. Honest as a 3D chart can be: thin columns
    seen from low down, values within a narrow band, no bar hiding another. Truth: each
    bar's eight corners on the page (matplotlib's own projection of the data, display
    units) and view depths; scripts/corpus/truth_shapes.py takes the faces seen, less what
    bars drawn over them hide."""
    def build():
        from mpl_toolkits.mplot3d import proj3d
        rng = rng_of(seed)
        cols, rows = ORCHARDS[:4], ["2029", "2030"]
        n = len(cols) * len(rows)
        if honest:
            v = values_between(rng, n, 78, 96)
            fp, elev, azim, ry = 0.14, 6, -62, 1.6
        else:
            v = with_spread(rng, values_between(rng, n, 10, 60), (6, 9), (55, 60))
            fp, elev, azim, ry = 0.6, 32, -58, 1.0
        fig = new_fig(6.4, 4.8)
        ax = fig.add_axes((0.02, 0.04, 0.94, 0.9), projection="3d", proj_type="ortho")
        ax.view_init(elev=elev, azim=azim)
        xs = [c for r in range(len(rows)) for c in range(len(cols))]
        ys = [ry * r for r in range(len(rows)) for c in range(len(cols))]
        ax.bar3d([x - fp / 2 for x in xs], [y - fp / 2 for y in ys], [0] * n, fp, fp, v,
                 color=HUES[0][0], shade=True)
        top = 100 if honest else 70
        ax.set_zlim(0, top)
        ax.set_xlim(-0.5, len(cols) - 0.5)
        ax.set_ylim(-0.5, ry * (len(rows) - 1) + 0.5)
        ax.set_xticks(range(len(cols)))
        ax.set_xticklabels(cols)
        ax.set_yticks([ry * r for r in range(len(rows))])
        ax.set_yticklabels(rows)
        ax.set_title("Trees planted by orchard and year", fontsize=11)
        bbox = box_of(fig, ax)  # draws: the projection below is the one on the page
        M = ax.get_proj()
        corners, depth = [], []
        for x, y, h in zip(xs, ys, v):
            pts = box_corners(x - fp / 2, y - fp / 2, 0, fp, fp, h)
            px, py, pz = proj3d.proj_transform(*zip(*pts), M)
            scr = ax.transData.transform(list(zip(px, py)))
            corners.append([[round(float(a), 4), round(float(b), 4)] for a, b in scr])
            depth.append([round(float(z), 6) for z in pz])
        d = {"kind": "bar-3d", "misleading": not honest,
             "rule": None if honest else "bars-3d-ink", "values": v,
             "labels": ["%s/%s" % (c, r) for r in rows for c in cols],
             "axis": {"min": 0.0, "max": float(top), "scale": "linear", "orientation": "z"},
             "baseline": 0.0,
             "solid": {"projection": "box", "base": 0.0, "corners": corners,
                       "depth": depth, "faces": BOX_FACES, "footprint": [fp, fp],
                       "view": [elev, azim]},
             "style": ["bar3d", "ortho", "two-categories"] +
                      (["thin", "low-view"] if honest else ["occluded"])}
        d["bbox"] = bbox
        return fig, [d]
    return build


def drawn_faces(ax, coll, corners):
    """The faces of a bar3d collection in the order matplotlib painted them (its own depth
    sort, read back after drawing), each as (bar, part, corners in display units): matched
    to the bars by their projected corners."""
    out = []
    for path in coll.get_paths():
        pts = ax.transData.transform(path.vertices[:4])
        best = None
        for i, c in enumerate(corners):
            for name, idx in BOX_FACES.items():
                d = sum(min(math.hypot(px - c[k][0], py - c[k][1]) for k in idx)
                        for px, py in pts)
                if best is None or d < best[0]:
                    best = (d, i, name)
        if best[0] > 0.05:
            raise SystemExit("bar3d face not matched to a bar (%.3f)" % best[0])
        out.append({"bar": best[1], "part": best[2],
                    "corners": [[round(float(a), 4), round(float(b), 4)] for a, b in pts]})
    return out


def bar3d_persp(seed, honest, auto=False):
    """Axes3D.bar3d in matplotlib's default perspective view. Misleading: two rows of wide
    bars seen from above (tops of constant size, fronts shrinking with depth, nearer bars
    hiding parts of those behind) over values from 6 to 60. Honest as a 3D chart can be: one
    row of thin slabs seen face on from low down (fronts all at one depth, so in proportion),
    values from 40 to 96. Truth: every face matplotlib painted, in its painting order
    and at its page corners (its own projection and depth sort, read back after drawing);
    scripts/corpus/truth_shapes.py takes what each face shows after the faces painted over
    it. auto: matplotlib's own view and value limits, three columns of narrower bars whose
    columns line up on the page."""
    def build():
        from mpl_toolkits.mplot3d import proj3d
        rng = rng_of(seed)
        if auto:
            cols, rows = ORCHARDS[:3], ["2029", "2030"]
            v = sorted(with_spread(rng, values_between(rng, 6, 10, 45), (5, 8), (40, 45)))
            front, back = v[:3], v[3:]
            rng.shuffle(front)
            rng.shuffle(back)
            v = front + back
            fw, fd, elev, azim, top = 0.5, 0.5, 30, -60, None
        elif honest:
            cols, rows = ORCHARDS[:5], ["2030"]
            v = with_spread(rng, values_between(rng, len(cols), 40, 96), (40, 45), (90, 96))
            fw, fd, elev, azim, top = 0.5, 0.05, 5, -90, 100
        else:
            cols, rows = ORCHARDS[:4], ["2029", "2030"]
            v = sorted(with_spread(rng, values_between(rng, 8, 10, 60), (6, 9), (55, 60)))
            front, back = v[:4], v[4:]
            rng.shuffle(front)
            rng.shuffle(back)
            v = front + back  # the taller row behind, so that every bar shows
            fw, fd, elev, azim, top = 0.6, 0.6, 30, -60, 70
        n = len(v)
        fig = new_fig(6.4, 4.8)
        ax = fig.add_axes((0.02, 0.04, 0.94, 0.9), projection="3d")
        ax.view_init(elev=elev, azim=azim)
        xs = [c for r in range(len(rows)) for c in range(len(cols))]
        ys = [r for r in range(len(rows)) for c in range(len(cols))]
        coll = ax.bar3d([x - fw / 2 for x in xs], [y - fd / 2 for y in ys], [0] * n, fw, fd,
                        v, color=HUES[1][0] if honest else HUES[0][0], shade=True)
        if top is not None:
            ax.set_zlim(0, top)
            ax.set_xlim(-0.5, len(cols) - 0.5)
            ax.set_ylim(-0.5, len(rows) - 0.5)
        ax.set_xticks(range(len(cols)))
        ax.set_xticklabels(cols)
        ax.set_yticks(range(len(rows)))
        ax.set_yticklabels(rows)
        ax.set_title("Trees planted by orchard and year", fontsize=11)
        bbox = box_of(fig, ax)  # draws: the projection and order below are the page's
        M = ax.get_proj()
        corners = []
        for x, y, h in zip(xs, ys, v):
            pts = box_corners(x - fw / 2, y - fd / 2, 0, fw, fd, h)
            px, py, _ = proj3d.proj_transform(*zip(*pts), M)
            corners.append([tuple(p) for p in ax.transData.transform(list(zip(px, py)))])
        d = {"kind": "bar-3d", "misleading": not honest,
             "rule": None if honest else "bars-3d-ink", "values": v,
             "labels": ["%s/%s" % (c, r) for r in rows for c in cols],
             "axis": {"min": 0.0, "max": float(top if top else ax.get_zlim()[1]),
                      "scale": "linear", "orientation": "z"},
             "baseline": 0.0,
             "solid": {"projection": "drawn", "base": 0.0,
                       "faces": drawn_faces(ax, coll, corners),
                       "footprint": [fw, fd], "view": [elev, azim]},
             "style": ["bar3d", "perspective"] +
                      (["one-row", "low-view"] if honest else ["two-categories", "occluded"]) +
                      (["default-view"] if auto else [])}
        d["bbox"] = bbox
        return fig, [d]
    return build


PLAN = [
    ("shape_oblique_deep", 901, oblique_bars(901, True)),
    ("shape_oblique_shallow", 901, oblique_bars(901, False)),
    ("shape_oblique_wall", 902, oblique_bars(902, True, wall=True)),
    ("shape_oblique_stacked", 903, stacked_oblique(903)),
    ("shape_bar3d_grid", 904, bar3d_grid(904, False)),
    ("shape_bar3d_thin", 905, bar3d_grid(905, True)),
    ("shape_bar3d_persp", 906, bar3d_persp(906, False)),
    ("shape_bar3d_persp_honest", 907, bar3d_persp(907, True)),
    ("shape_bar3d_persp_auto", 908, bar3d_persp(908, False, auto=True)),
    ("shape_pyramid_heights", 911, pyramid(911, False)),
    ("shape_pyramid_areas", 911, pyramid(911, True)),
    ("shape_pyramid_pct", 912, pyramid(912, False, percent=True)),
    ("shape_pyramid_pct_honest", 912, pyramid(912, True, percent=True)),
    ("shape_pyramid_pct0", 916, pyramid(916, False, percent=True, decimals=0)),
    ("shape_pyramid_pct0_honest", 917, pyramid(917, True, percent=True, decimals=0)),
    ("shape_funnel_trapezoids", 913, funnel(913, False)),
    ("shape_funnel_bars", 913, funnel(913, True)),
    ("shape_population_pyramid", 914, population_pyramid(914)),
    ("shape_population_pyramid_cut", 918, population_pyramid(918, cut=100)),
    ("shape_chevrons", 915, chevrons(915)),
    ("shape_bubbles_radius", 921, bubbles(921, "radius")),
    ("shape_bubbles_area", 921, bubbles(921, "area")),
    ("shape_bubbles_radius_key", 922, bubbles(922, "radius", key=True)),
    ("shape_bubbles_area_key", 922, bubbles(922, "area", key=True)),
    ("shape_scatter_constant", 923, constant_scatter(923)),
    ("shape_dot_plot", 924, constant_scatter(924, dots=True)),
    ("shape_map_symbols", 925, map_symbols(925)),
]


def main():
    os.makedirs(OUT, exist_ok=True)
    for name, seed, builder in PLAN:
        save(name, seed, builder)
    print("matplotlib shapes: %d charts" % len(PLAN))


if __name__ == "__main__":
    main()
