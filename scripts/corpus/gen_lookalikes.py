#!/usr/bin/python3
"""Generate corpus/lookalikes/: honest pages that look like bar charts to a naive reader.

Two families, all drawn by matplotlib with invented data (fictional firms only):
  * non-charts that tile rectangles near numbers: tables with shaded rows and cells,
    code listings on shaded backgrounds with line numbers, version tags, calendars,
    element tiles, colour swatches and a colour bar, frames and thin rules, drop
    shadows, KPI cards, a logo, a map, a tree diagram;
  * honest charts that look like bars: waterfall, candlesticks, Gantt bars, box plots,
    histograms (count, density, cumulative), heatmap, treemap, mosaic, diverging bars,
    population pyramid, bullet chart, 100% stack, error bars, lollipop, dot plot,
    stacked bars with segment labels, outline-only bars; and one misleading twin: outline
    bars on a truncated axis (outlines are bars, their ink the outlined region).
Every page holds one figure and says so in its truth file: non-charts as `table`,
`text` or `other`, honest charts with misleading false. Plain bar charts are `column`
or `bar` with their values (so detection and the measures are checked too); chart
types the scanner has no family for are `other` (must raise nothing).
"""

import math
import os
import random
import sys

import matplotlib

matplotlib.use("pdf")
import matplotlib.pyplot as plt  # noqa: E402
from matplotlib.patches import FancyBboxPatch, Polygon, Rectangle  # noqa: E402

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import truth  # noqa: E402

ROOT = os.environ.get("PP_CORPUS_ROOT") or os.path.dirname(os.path.dirname(
    os.path.dirname(os.path.abspath(__file__))))
OUT = os.path.join(ROOT, "corpus", "lookalikes")
PRODUCER = "matplotlib " + matplotlib.__version__
META = {"CreationDate": None, "Creator": PRODUCER}
plt.rcParams["pdf.fonttype"] = 42

FIRMS = ["Kestrel Orchards", "Brannock Looms", "Fjordhaven Ferries", "Tallow & Quince",
         "Morrow Glassworks", "Pellam Rope Co."]
DEPOTS = ["North Quay", "Tern Pier", "Old Slip", "Gullwharf", "Eastmoor", "Sandhythe"]
CASES = []


def case(fn):
    CASES.append(fn)
    return fn


def box_of(fig, ax):
    """Axes box in PDF points, origin top-left (fig.dpi is 72)."""
    fig.canvas.draw()
    e = ax.get_window_extent()
    h = fig.get_figheight() * 72.0
    return [round(e.x0, 2), round(h - e.y1, 2), round(e.x1, 2), round(h - e.y0, 2)]


def canvas(w=7.0, h=4.5):
    """A page-like drawing area: axes in points, y down, no axis drawn."""
    fig = plt.figure(figsize=(w, h), dpi=72)
    ax = fig.add_axes([0.05, 0.05, 0.9, 0.9])
    W, H = 0.9 * w * 72, 0.9 * h * 72
    ax.set_xlim(0, W)
    ax.set_ylim(H, 0)
    ax.axis("off")
    return fig, ax, W, H


def nonchart(kind, bbox, notes, style=()):
    return {"page": 1, "bbox": bbox, "kind": kind, "misleading": False, "rule": None,
            "values": [], "labels": [], "axis": None, "baseline": None,
            "data_labels": None, "style": list(style), "notes": notes}


def honest(kind, bbox, notes, values=(), labels=(), axis=None, baseline=None,
           data_labels=None, style=(), series=None):
    f = {"page": 1, "bbox": bbox, "kind": kind, "misleading": False, "rule": None,
         "values": [float(v) for v in values], "labels": list(labels), "axis": axis,
         "baseline": baseline, "data_labels": data_labels, "style": list(style),
         "notes": notes}
    if series:
        f["series"] = series
    return f


def axis_of(ax, orientation):
    lo, hi = ax.get_ylim() if orientation == "y" else ax.get_xlim()
    scale = ax.get_yscale() if orientation == "y" else ax.get_xscale()
    return {"min": float(lo), "max": float(hi), "scale": scale, "orientation": orientation}


def bounds_of(fig, artists):
    """Union of artists' extents in PDF points, origin top-left."""
    fig.canvas.draw()
    h = fig.get_figheight() * 72.0
    es = [a.get_window_extent() for a in artists]
    return [round(min(e.x0 for e in es), 2), round(h - max(e.y1 for e in es), 2),
            round(max(e.x1 for e in es), 2), round(h - min(e.y0 for e in es), 2)]


# ---------------------------------------------------------------- non-charts


@case
def table_shaded_rows(rng):
    fig, ax, W, H = canvas()
    cols = ["Depot", "Q1", "Q2", "Q3", "Q4", "Total"]
    x = [10, 130, 190, 250, 310, 380]
    y0, rh = 20, 22
    ax.text(10, 12, "Table 3. Crossings per depot (invented)", fontsize=10)
    for j, c in enumerate(cols):
        ax.text(x[j] + (40 if j else 0), y0 + 15, c, fontsize=9, ha="right" if j else "left",
                weight="bold")
    for i, d in enumerate(DEPOTS):
        yy = y0 + rh * (i + 1)
        if i % 2 == 0:
            ax.add_patch(Rectangle((5, yy), 430, rh, color="#dddddd", lw=0))
        vals = [rng.randint(80, 420) for _ in range(4)]
        ax.text(x[0], yy + 15, d, fontsize=9)
        for j, v in enumerate(vals + [sum(vals)]):
            ax.text(x[j + 1] + 40, yy + 15, str(v), fontsize=9, ha="right")
    ax.plot([5, 435], [y0 + rh, y0 + rh], color="black", lw=0.8)
    bbox = box_of(fig, ax)
    return fig, [nonchart("table", bbox, "zebra-striped table: equal shaded rows with "
                          "numbers in every cell")]


@case
def table_shaded_cells(rng):
    fig, ax, W, H = canvas()
    ax.text(10, 14, "Loom hours by shift (shaded: above plan)", fontsize=10)
    for i in range(6):
        for j in range(7):
            v = rng.randint(2, 98)
            xx, yy = 60 + 50 * j, 30 + 26 * i
            if v > 60:
                ax.add_patch(Rectangle((xx, yy), 50, 26, color="#f4c27a", lw=0))
            ax.add_patch(Rectangle((xx, yy), 50, 26, fill=False, lw=0.5))
            ax.text(xx + 25, yy + 17, str(v), ha="center", fontsize=9)
        ax.text(10, 30 + 26 * i + 17, "Shift %d" % (i + 1), fontsize=9)
    bbox = box_of(fig, ax)
    return fig, [nonchart("table", bbox, "grid of ruled cells, some shaded, a number in "
                          "each cell")]


@case
def code_listing(rng):
    fig, ax, W, H = canvas()
    lines = ["def crossings(depot, year=2031):", "    total = 0",
             "    for week in range(1, 53):", "        total += ledger[depot][week]",
             "    if total > 12000:", "        flag(depot, level=2)",
             "    return round(total / 52, 1)", "", "print(crossings('Tern Pier'))",
             "# 1840.5", "x = [10, 20, 30, 40]", "y = x[3] - x[0]"]
    ax.add_patch(Rectangle((30, 20), 400, 16 * len(lines) + 10, color="#f3f1e6", lw=0))
    ax.add_patch(Rectangle((30, 20), 2.0, 16 * len(lines) + 10, color="#c0392b", lw=0))
    ax.add_patch(Rectangle((34, 20 + 16 * 3 + 3), 396, 16, color="#ffe08a", lw=0))
    for i, l in enumerate(lines):
        ax.text(24, 36 + 16 * i, str(i + 1), fontsize=7, ha="right", color="#888888",
                family="monospace")
        ax.text(40, 36 + 16 * i, l, fontsize=9, family="monospace")
    bbox = box_of(fig, ax)
    return fig, [nonchart("text", bbox, "code listing: shaded background, highlighted "
                          "line, thin coloured rule and a line-number column")]


@case
def version_tags(rng):
    fig, ax, W, H = canvas()
    words = ("The ferry ledger keeps one row per crossing and one column per fare "
             "class; totals are recomputed at every change of timetable.").split()
    for k in range(6):
        yy = 30 + 50 * k
        tag = "New %d.%d" % (3, rng.randint(10, 99))
        ax.add_patch(Rectangle((10, yy - 11), 44, 14, color="#f6e3b4", lw=0))
        ax.text(12, yy, tag, fontsize=8)
        line = " ".join(rng.sample(words, 12))
        ax.text(62, yy, line, fontsize=9)
        ax.text(62, yy + 14, " ".join(rng.sample(words, 12)), fontsize=9)
    bbox = box_of(fig, ax)
    return fig, [nonchart("text", bbox, "manual text with shaded version tags of one width "
                          "in the margin, each holding a number")]


@case
def calendar(rng):
    fig, ax, W, H = canvas()
    ax.text(10, 14, "Kestrel Orchards - picking rota, month 7", fontsize=10)
    names = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"]
    for j, n in enumerate(names):
        ax.text(20 + 60 * j + 30, 32, n, ha="center", fontsize=9)
    day = 1
    for i in range(5):
        for j in range(7):
            if i == 0 and j < 2 or day > 31:
                continue
            xx, yy = 20 + 60 * j, 40 + 44 * i
            if rng.random() < 0.3:
                ax.add_patch(Rectangle((xx, yy), 60, 44, color="#cfe8cf", lw=0))
            ax.add_patch(Rectangle((xx, yy), 60, 44, fill=False, lw=0.6))
            ax.text(xx + 56, yy + 12, str(day), ha="right", fontsize=9)
            day += 1
    bbox = box_of(fig, ax)
    return fig, [nonchart("table", bbox, "month calendar: equal day cells, some shaded, "
                          "day numbers in the corners")]


@case
def element_tiles(rng):
    fig, ax, W, H = canvas()
    syms = ["Kt", "Br", "Fj", "Tq", "Mg", "Pl", "Ov", "Sd", "Ea", "Gw", "Te", "Ns"]
    colours = ["#f7c6c7", "#c6dbf7", "#d4f7c6", "#f7efc6"]
    n = 1
    for i in range(4):
        for j in range(9):
            if i == 0 and 1 <= j <= 7:
                continue
            xx, yy = 15 + 48 * j, 20 + 56 * i
            ax.add_patch(Rectangle((xx, yy), 44, 52, color=colours[(i + j) % 4], lw=0))
            ax.text(xx + 3, yy + 11, str(n), fontsize=7)
            ax.text(xx + 22, yy + 34, syms[n % len(syms)], ha="center", fontsize=12)
            ax.text(xx + 22, yy + 48, "%.2f" % (n * 2.013 + 1), ha="center", fontsize=6)
            n += 1
    bbox = box_of(fig, ax)
    return fig, [nonchart("table", bbox, "element tiles in a periodic-table layout: equal "
                          "coloured tiles with a number and a symbol each")]


@case
def swatches_colour_bar(rng):
    fig = plt.figure(figsize=(7, 4.5), dpi=72)
    ax = fig.add_axes([0.05, 0.45, 0.9, 0.45])
    ax.set_xlim(0, 8)
    ax.set_ylim(0, 1)
    ax.axis("off")
    for k in range(8):
        g = k / 8
        ax.add_patch(Rectangle((k + 0.1, 0.3), 0.8, 0.6, color=(0.9 - 0.6 * g, 0.4, 0.2 + 0.7 * g)))
        ax.text(k + 0.5, 0.15, "%d" % (100 + 25 * k), ha="center", fontsize=9)
    cax = fig.add_axes([0.1, 0.15, 0.8, 0.08])
    grad = [[i / 255 for i in range(256)]]
    cax.imshow(grad, aspect="auto", cmap="viridis", extent=(0, 100, 0, 1))
    cax.set_yticks([])
    cax.set_xticks([0, 20, 40, 60, 80, 100])
    fig.canvas.draw()
    bbox = bounds_of(fig, [ax, cax])
    return fig, [nonchart("other", bbox, "colour swatches with their codes beneath, and a "
                          "colour bar with a numeric scale")]


@case
def frames_and_rules(rng):
    fig, ax, W, H = canvas()
    for k in range(3):
        xx = 15 + 150 * k
        # frame sides drawn as thin filled rectangles, as some layout tools do
        for r in [(xx, 30, 130, 0.6), (xx, 180, 130, 0.6), (xx, 30, 0.6, 150.6),
                  (xx + 129.4, 30, 0.6, 150.6)]:
            ax.add_patch(Rectangle(r[:2], r[2], r[3], color="black", lw=0))
        ax.text(xx + 65, 60, "Section %d" % (k + 1), ha="center", fontsize=10)
        ax.text(xx + 65, 100, "%d pages" % rng.randint(12, 90), ha="center", fontsize=9)
        ax.text(xx + 65, 130, "rev. %d" % rng.randint(2, 9), ha="center", fontsize=9)
    for k in range(4):
        ax.add_patch(Rectangle((15, 200 + 18 * k), 430 - 60 * k, 0.8, color="#444444", lw=0))
        ax.text(450, 203 + 18 * k, str(10 * (k + 1)), fontsize=8)
    bbox = box_of(fig, ax)
    return fig, [nonchart("text", bbox, "frames whose sides are thin filled rectangles and "
                          "horizontal rules of different lengths beside numbers")]


@case
def drop_shadows(rng):
    fig, ax, W, H = canvas()
    for k in range(4):
        xx = 20 + 110 * k
        hgt = 60 + 30 * k
        ax.add_patch(Rectangle((xx + 5, 60 + 5), 90, hgt, color="#999999", lw=0))
        ax.add_patch(Rectangle((xx, 60), 90, hgt, facecolor="#e8f0ff", edgecolor="black",
                               lw=0.8))
        ax.text(xx + 45, 80, "Module %d" % (k + 1), ha="center", fontsize=9)
        ax.text(xx + 45, 100, "%d units" % rng.randint(3, 40), ha="center", fontsize=9)
    bbox = box_of(fig, ax)
    return fig, [nonchart("other", bbox, "boxes of growing height with offset grey drop "
                          "shadows and numbers inside")]


@case
def kpi_cards(rng):
    fig, ax, W, H = canvas()
    items = [("Crossings", "18,402"), ("On time", "96.1%"), ("Revenue", "$4.2m"),
             ("Complaints", "37")]
    for k, (name, val) in enumerate(items):
        xx = 15 + 112 * k
        ax.add_patch(FancyBboxPatch((xx, 40), 100, 90, boxstyle="round,pad=2",
                                    facecolor="#2b5d8a", lw=0))
        ax.add_patch(Rectangle((xx, 120), 100 * (0.3 + 0.15 * k), 10, color="#9cc3e6", lw=0))
        ax.text(xx + 50, 65, name, ha="center", color="white", fontsize=9)
        ax.text(xx + 50, 100, val, ha="center", color="white", fontsize=18, weight="bold")
    bbox = box_of(fig, ax)
    return fig, [nonchart("other", bbox, "KPI cards with big numbers and a progress strip")]


@case
def logo(rng):
    fig, ax, W, H = canvas()
    for k, h in enumerate([30, 55, 80, 105]):
        ax.add_patch(Rectangle((40 + 22 * k, 150 - h), 16, h, color="#1d6f42", lw=0))
    ax.text(140, 140, "Brannock Looms", fontsize=22, weight="bold")
    ax.text(140, 160, "since 1884 - 4 mills", fontsize=10)
    bbox = box_of(fig, ax)
    return fig, [nonchart("other", bbox, "logo of four rising bars beside a name and a year")]


@case
def region_map(rng):
    fig, ax, W, H = canvas()
    regions = [[(20, 20), (150, 30), (140, 120), (30, 110)],
               [(150, 30), (280, 20), (300, 130), (140, 120)],
               [(30, 110), (140, 120), (150, 250), (40, 240)],
               [(140, 120), (300, 130), (290, 260), (150, 250)]]
    for k, pts in enumerate(regions):
        ax.add_patch(Polygon(pts, closed=True, facecolor=["#e5f5e0", "#a1d99b", "#41ab5d",
                                                          "#c7e9c0"][k], edgecolor="white"))
        cx = sum(p[0] for p in pts) / 4
        cy = sum(p[1] for p in pts) / 4
        ax.text(cx, cy, "%d" % rng.randint(100, 900), ha="center", fontsize=10)
    for k in range(4):
        ax.add_patch(Rectangle((340, 40 + 22 * k), 16, 16, color=["#e5f5e0", "#c7e9c0",
                                                                  "#a1d99b", "#41ab5d"][k]))
        ax.text(362, 52 + 22 * k, "%d-%d" % (200 * k, 200 * k + 199), fontsize=9)
    bbox = box_of(fig, ax)
    return fig, [nonchart("other", bbox, "choropleth map of four invented districts with a "
                          "legend of class ranges")]


@case
def tree_diagram(rng):
    fig, ax, W, H = canvas()
    nodes = {"A": (220, 30), "B": (100, 110), "C": (340, 110), "D": (40, 200),
             "E": (160, 200), "F": (280, 200), "G": (400, 200)}
    for parent, kids in (("A", "BC"), ("B", "DE"), ("C", "FG")):
        for kid in kids:
            ax.plot([nodes[parent][0], nodes[kid][0]], [nodes[parent][1] + 30,
                                                        nodes[kid][1]], color="black", lw=0.8)
    for k, (n, (x, y)) in enumerate(nodes.items()):
        ax.add_patch(Rectangle((x - 40, y), 80, 30, facecolor="#dfe7f2", edgecolor="black",
                               lw=0.8))
        ax.text(x, y + 19, "Unit %s-%d" % (n, 10 + k), ha="center", fontsize=9)
    bbox = box_of(fig, ax)
    return fig, [nonchart("other", bbox, "organisation tree: equal boxes joined by connectors")]


# ---------------------------------------------------------------- honest charts


def chart(w=6.0, h=4.0):
    fig = plt.figure(figsize=(w, h), dpi=72)
    ax = fig.add_axes([0.13, 0.14, 0.82, 0.76])
    return fig, ax


@case
def waterfall(rng):
    fig, ax = chart()
    steps = [("Opening", 120), ("Fares", 45), ("Freight", 30), ("Fuel", -38),
             ("Crew", -22), ("Repairs", -15)]
    level = 0
    for k, (name, d) in enumerate(steps):
        bottom = level if k else 0
        top = level + d if k else d
        ax.bar(k, abs(top - bottom), bottom=min(bottom, top),
               color="#5b8db8" if d >= 0 else "#d9534f")
        ax.text(k, max(top, bottom) + 2, "%+d" % d if k else str(d), ha="center", fontsize=8)
        level = top
    ax.bar(len(steps), level, color="#444444")
    ax.set_xticks(range(len(steps) + 1))
    ax.set_xticklabels([s[0] for s in steps] + ["Closing"], fontsize=8)
    ax.set_title("Fjordhaven Ferries - result bridge")
    return fig, [honest("other", box_of(fig, ax), "waterfall: floating bars, each starting "
                        "where the previous ended")]


@case
def candlesticks(rng):
    fig, ax = chart()
    price = 52.0
    for k in range(14):
        o = price
        c = o + rng.uniform(-3, 3)
        hi, lo = max(o, c) + rng.uniform(0.3, 2), min(o, c) - rng.uniform(0.3, 2)
        ax.plot([k, k], [lo, hi], color="black", lw=0.8)
        ax.add_patch(Rectangle((k - 0.3, min(o, c)), 0.6, abs(c - o) + 0.05,
                               facecolor="#2e8b57" if c >= o else "#c0392b"))
        price = c
    ax.set_xlim(-1, 14)
    ax.set_ylim(40, 64)
    ax.set_title("Tallow & Quince share price (invented)")
    return fig, [honest("other", box_of(fig, ax), "candlesticks on a price axis that does "
                        "not start at zero: range bars, honest")]


@case
def gantt(rng):
    fig, ax = chart()
    tasks = ["Survey", "Design", "Keel", "Hull", "Fit-out", "Trials"]
    start = 0
    for k, t in enumerate(tasks):
        d = rng.randint(3, 9)
        ax.barh(k, d, left=start, color="#7fa7d1")
        start += d - rng.randint(0, 2)
    ax.set_yticks(range(len(tasks)))
    ax.set_yticklabels(tasks)
    ax.invert_yaxis()
    ax.set_xlabel("week")
    ax.set_title("Morrow Glassworks - new kiln plan")
    return fig, [honest("other", box_of(fig, ax), "Gantt chart: bars from start to end week")]


@case
def box_plots(rng):
    fig, ax = chart()
    data = [[rng.gauss(60 + 5 * k, 6) for _ in range(40)] for k in range(5)]
    ax.boxplot(data, patch_artist=True)
    ax.set_xticks(range(1, 6))
    ax.set_xticklabels(DEPOTS[:5], fontsize=8)
    ax.set_title("Turnaround minutes per depot")
    return fig, [honest("other", box_of(fig, ax), "box plots on an axis not starting at zero")]


def hist_case(rng, density=False, cumulative=False):
    fig, ax = chart()
    data = [rng.gauss(40, 9) for _ in range(400)]
    edges = list(range(10, 75, 5))
    n, _, _ = ax.hist(data, bins=edges, density=density, cumulative=cumulative,
                      color="#6a9fb5", edgecolor="white")
    ax.set_title("Kestrel Orchards - apple mass (g), %s" %
                 ("cumulative" if cumulative else "density" if density else "count"))
    labels = ["%d-%d" % (a, a + 5) for a in edges[:-1]]
    return fig, [honest("column", box_of(fig, ax), "histogram: touching bars on a zero "
                        "baseline", values=[float(v) for v in n], labels=labels,
                        axis=axis_of(ax, "y"), baseline=0, style=["histogram"])]


@case
def histogram_count(rng):
    return hist_case(rng)


@case
def histogram_density(rng):
    return hist_case(rng, density=True)


@case
def histogram_cumulative(rng):
    return hist_case(rng, cumulative=True)


@case
def heatmap(rng):
    fig, ax = chart()
    grid = [[rng.randint(0, 99) for _ in range(8)] for _ in range(6)]
    ax.imshow(grid, cmap="YlOrRd", aspect="auto")
    for i in range(6):
        for j in range(8):
            ax.text(j, i, str(grid[i][j]), ha="center", va="center", fontsize=8)
    ax.set_yticks(range(6))
    ax.set_yticklabels(DEPOTS, fontsize=8)
    ax.set_title("Delays by depot and week")
    return fig, [honest("other", box_of(fig, ax), "heatmap (image) with numbers in cells")]


@case
def heatmap_vector(rng):
    fig, ax = chart()
    for i in range(6):
        for j in range(8):
            v = rng.randint(0, 99)
            ax.add_patch(Rectangle((j, i), 1, 1, color=plt.cm.Blues(v / 100)))
            ax.text(j + 0.5, i + 0.5, str(v), ha="center", va="center", fontsize=8)
    ax.set_xlim(0, 8)
    ax.set_ylim(6, 0)
    ax.set_xticks([k + 0.5 for k in range(8)])
    ax.set_xticklabels(["W%d" % (k + 1) for k in range(8)])
    ax.set_yticks([k + 0.5 for k in range(6)])
    ax.set_yticklabels(DEPOTS, fontsize=8)
    ax.set_title("Delays by depot and week (cells)")
    return fig, [honest("other", box_of(fig, ax), "heatmap drawn as filled cells with "
                        "numbers: a matrix, not bars")]


def squarify(vals, x, y, w, h):
    """Slice-and-dice layout: alternating direction, areas proportional to values."""
    out = []
    total = sum(vals)
    horizontal = w >= h
    pos = x if horizontal else y
    for v in vals:
        f = v / total
        if horizontal:
            out.append((pos, y, w * f, h))
            pos += w * f
        else:
            out.append((x, pos, w, h * f))
            pos += h * f
    return out


@case
def treemap(rng):
    fig, ax = chart()
    vals = sorted([rng.randint(5, 60) for _ in range(7)], reverse=True)
    rects = squarify(vals[:3], 0, 0, 60, 100) + squarify(vals[3:], 60, 0, 40, 100)
    for k, (x, y, w, h) in enumerate(rects):
        ax.add_patch(Rectangle((x, y), w, h, facecolor=plt.cm.Set3(k), edgecolor="white"))
        ax.text(x + w / 2, y + h / 2, "%s\n%d" % (FIRMS[k % 6].split()[0], vals[k]),
                ha="center", va="center", fontsize=8)
    ax.set_xlim(0, 100)
    ax.set_ylim(0, 100)
    ax.axis("off")
    return fig, [honest("other", box_of(fig, ax), "treemap: tiles sized by value")]


@case
def mosaic(rng):
    fig, ax = chart()
    x = 0
    for k in range(4):
        w = rng.uniform(0.15, 0.35)
        y = 0
        shares = [rng.uniform(0.2, 0.5), rng.uniform(0.2, 0.4)]
        shares.append(1 - sum(shares))
        for s, share in enumerate(shares):
            ax.add_patch(Rectangle((x, y), w - 0.01, share - 0.01,
                                   color=["#8dd3c7", "#ffffb3", "#bebada"][s]))
            ax.text(x + w / 2, y + share / 2, "%d%%" % round(100 * share), ha="center",
                    fontsize=8)
            y += share
        x += w
    ax.set_xlim(0, x)
    ax.set_ylim(0, 1)
    ax.set_title("Fare class by route (mosaic)")
    return fig, [honest("other", box_of(fig, ax), "mosaic: widths and heights both encode "
                        "shares")]


@case
def diverging_bars(rng):
    fig, ax = chart()
    vals = [rng.choice([-1, 1]) * rng.randint(5, 40) for _ in range(6)]
    ax.barh(range(6), vals, color=["#c0392b" if v < 0 else "#2e86c1" for v in vals])
    ax.axvline(0, color="black", lw=0.8)
    ax.set_yticks(range(6))
    ax.set_yticklabels(DEPOTS)
    ax.invert_yaxis()
    ax.set_xlim(-50, 50)
    ax.set_title("Change in bookings (%)")
    return fig, [honest("bar", box_of(fig, ax), "diverging bars around zero", values=vals,
                        labels=DEPOTS, axis=axis_of(ax, "x"), baseline=0,
                        style=["negative"])]


@case
def population_pyramid(rng):
    fig, ax = chart()
    ages = ["0-9", "10-19", "20-29", "30-39", "40-49", "50-59", "60+"]
    left = [rng.randint(20, 60) for _ in ages]
    right = [rng.randint(20, 60) for _ in ages]
    ax.barh(range(7), [-v for v in left], color="#7fa7d1")
    ax.barh(range(7), right, color="#e39a8c")
    ax.set_yticks(range(7))
    ax.set_yticklabels(ages)
    ax.set_xticks([-60, -40, -20, 0, 20, 40, 60])
    ax.set_xticklabels(["60", "40", "20", "0", "20", "40", "60"])
    ax.set_title("Staff by age band, two sites")
    return fig, [honest("other", box_of(fig, ax), "population pyramid: bars both ways from "
                        "a zero in the middle, labels without sign")]


@case
def bullet_chart(rng):
    fig, ax = chart(6, 3)
    for k in range(3):
        for band, c in ((100, "#dddddd"), (75, "#bbbbbb"), (50, "#999999")):
            ax.barh(k, band, height=0.7, color=c)
        ax.barh(k, rng.randint(40, 95), height=0.25, color="black")
        ax.plot([rng.randint(60, 90)] * 2, [k - 0.3, k + 0.3], color="#c0392b", lw=2)
    ax.set_yticks(range(3))
    ax.set_yticklabels(["Fares", "Freight", "Charter"])
    ax.set_xlim(0, 100)
    ax.set_title("Targets (bullet chart)")
    return fig, [honest("other", box_of(fig, ax), "bullet chart: qualitative bands, a bar "
                        "and a target mark per row")]


@case
def stacked_100(rng):
    fig, ax = chart()
    cats = DEPOTS[:5]
    parts = [[rng.randint(10, 50) for _ in cats] for _ in range(3)]
    tot = [sum(p[k] for p in parts) for k in range(5)]
    bottom = [0] * 5
    for s in range(3):
        share = [100 * parts[s][k] / tot[k] for k in range(5)]
        ax.bar(range(5), share, bottom=bottom, color=["#66c2a5", "#fc8d62", "#8da0cb"][s])
        bottom = [bottom[k] + share[k] for k in range(5)]
    ax.set_xticks(range(5))
    ax.set_xticklabels(cats, fontsize=8)
    ax.set_ylim(0, 100)
    ax.set_title("Share of fare classes (100% stacked)")
    return fig, [honest("column", box_of(fig, ax), "100% stacked columns", values=[100.0] * 5,
                        labels=cats, axis=axis_of(ax, "y"), baseline=0, style=["stacked"])]


@case
def error_bars(rng):
    fig, ax = chart()
    vals = [rng.randint(30, 90) for _ in range(5)]
    ax.bar(range(5), vals, yerr=[rng.randint(3, 10) for _ in vals], capsize=4,
           color="#9ecae1")
    ax.set_xticks(range(5))
    ax.set_xticklabels(DEPOTS[:5], fontsize=8)
    ax.set_title("Mean boarding time (s) with spread")
    return fig, [honest("column", box_of(fig, ax), "bars with error bars on a zero axis",
                        values=vals, labels=DEPOTS[:5], axis=axis_of(ax, "y"), baseline=0)]


@case
def lollipop(rng):
    fig, ax = chart()
    vals = [rng.randint(120, 180) for _ in range(6)]
    ax.vlines(range(6), 100, vals, color="#555555")
    ax.plot(range(6), vals, "o", color="#d35400")
    ax.set_ylim(100, 190)
    ax.set_xticks(range(6))
    ax.set_xticklabels(DEPOTS, fontsize=8)
    ax.set_title("Crossings per day (lollipop)")
    return fig, [honest("other", box_of(fig, ax), "lollipop chart on a truncated axis: "
                        "stems and dots carry no area")]


@case
def dot_plot(rng):
    fig, ax = chart()
    vals = [rng.uniform(60, 95) for _ in range(6)]
    ax.plot(vals, range(6), "o", color="#2c7fb8")
    ax.set_yticks(range(6))
    ax.set_yticklabels(FIRMS, fontsize=8)
    ax.set_xlim(50, 100)
    ax.grid(axis="y", color="#dddddd")
    ax.set_title("Satisfaction score (dot plot)")
    return fig, [honest("other", box_of(fig, ax), "dot plot on a truncated axis")]


@case
def stacked_segment_labels(rng):
    fig, ax = chart()
    cats = ["2031", "2032", "2033", "2034"]
    parts = [[rng.randint(20, 60) for _ in cats] for _ in range(3)]
    bottom = [0] * 4
    for s in range(3):
        ax.bar(range(4), parts[s], bottom=bottom, color=["#1b9e77", "#d95f02", "#7570b3"][s])
        for k in range(4):
            ax.text(k, bottom[k] + parts[s][k] / 2, str(parts[s][k]), ha="center",
                    va="center", fontsize=8, color="white")
        bottom = [bottom[k] + parts[s][k] for k in range(4)]
    ax.set_xticks(range(4))
    ax.set_xticklabels(cats)
    ax.set_title("Freight by class (stacked, labels per segment)")
    series = [{"name": "class %d" % (s + 1), "values": parts[s]} for s in range(3)]
    return fig, [honest("column", box_of(fig, ax), "stacked columns on zero, each segment "
                        "labelled at its centre", values=bottom, labels=cats,
                        axis=axis_of(ax, "y"), baseline=0, style=["stacked", "data-labels"],
                        series=series)]


@case
def outline_bars(rng):
    fig, ax = chart()
    vals = [rng.randint(20, 80) for _ in range(5)]
    ax.bar(range(5), vals, fill=False, edgecolor="black")
    ax.set_xticks(range(5))
    ax.set_xticklabels(DEPOTS[:5], fontsize=8)
    ax.set_title("Outline-only bars on zero")
    return fig, [honest("column", box_of(fig, ax), "unfilled bars (outlines only) on a zero "
                        "axis", values=vals, labels=DEPOTS[:5], axis=axis_of(ax, "y"),
                        baseline=0, style=["outline"])]


@case
def outline_bars_truncated(rng):
    """The one misleading page here: outline-only bars are bars, their ink the outlined
    region, so a truncated axis under them distorts like under filled ones."""
    fig, ax = chart()
    vals = [rng.randint(40, 80) for _ in range(5)]
    ax.bar(range(5), vals, fill=False, edgecolor="black")
    ax.set_ylim(30, 85)
    ax.set_xticks(range(5))
    ax.set_xticklabels(DEPOTS[:5], fontsize=8)
    ax.set_title("Outline-only bars on an axis from 30")
    axis = axis_of(ax, "y")
    f = honest("column", box_of(fig, ax), "unfilled bars clipped at a truncated axis",
               values=vals, labels=DEPOTS[:5], axis=axis, baseline=axis["min"],
               style=["outline", "truncated-axis", "clipped"])
    f["misleading"], f["rule"] = True, "bars-off-zero"
    return fig, [f]


@case
def manual_step_arrows(rng):
    """A manual's how-to page: step arrows drawn at whatever size the layout gives them,
    each holding its step number, with a rounded box of notes beside each. Their sizes
    do not grow with their numbers, so they are not a symbol chart."""
    fig, ax, W, H = canvas()
    outline = [(0, 8), (26, 8), (26, 0), (44, 16), (26, 32), (26, 24), (0, 24)]
    sizes = [1.0, 1.7, 1.2, 1.5, 0.8]  # log-log fit of size on step: R² 0.01
    notes = ["Unpack the crate", "Fit the hinge", "Oil the rope", "Tighten bolts",
             "Check the seal"]
    for k, s in enumerate(sizes):
        n, x, y = k + 1, 20 + 88 * k, 60
        ax.add_patch(Polygon([(x + s * px, y + s * py) for px, py in outline], closed=True,
                             facecolor="#3a6fb0", lw=0))
        ax.text(x + 10 * s, y + 19 * s, str(n), color="white", fontsize=9, weight="bold")
        ax.add_patch(FancyBboxPatch((x, 170), 76, 40, boxstyle="round,pad=2",
                                    facecolor="#eef2f7", edgecolor="#3a6fb0", lw=0.8))
        ax.text(x + 4, 186, "Step %d" % n, fontsize=8)
        ax.text(x + 4, 200, notes[k], fontsize=7)
    ax.text(20, 250, "Kestrel Orchards press, assembly guide, page %d" % rng.randint(4, 40),
            fontsize=8)
    bbox = box_of(fig, ax)
    return fig, [nonchart("other", bbox, "step arrows of several sizes with step numbers "
                          "inside and note boxes: sizes do not follow the numbers")]


STACK_BOTTOM = [80, 90, 100, 110]
STACK_MIDDLE = [300, 320, 330, 350]
STACK_TOP = [220, 230, 250, 260]


def stacked_twin(floor):
    """Stacked columns with a label centred in each visible segment, on an axis from
    floor. Totals 600-720: from 40 their ink stays within Tufte's band (growth ratio 1.012,
    GDI +7%), while the bottom segments (80-110) lose the part under 40 (growth ratio
    1.27): only the bottom segments show the distortion."""
    fig, ax = chart()
    cats = ["2031", "2032", "2033", "2034"]
    parts = [STACK_BOTTOM, STACK_MIDDLE, STACK_TOP]
    bottom = [0] * 4
    for s in range(3):
        ax.bar(range(4), parts[s], bottom=bottom, width=0.6,
               color=["#1b9e77", "#d95f02", "#7570b3"][s])
        for k in range(4):
            lo = max(bottom[k], floor)
            ax.text(k, (lo + bottom[k] + parts[s][k]) / 2, str(parts[s][k]), ha="center",
                    va="center", fontsize=8, color="white")
        bottom = [bottom[k] + parts[s][k] for k in range(4)]
    ax.set_ylim(floor, 800)
    ax.set_xticks(range(4))
    ax.set_xticklabels(cats)
    ax.set_title("Tern Pier freight by class, kt")
    series = [{"name": "class %d" % (s + 1), "values": parts[s]} for s in range(3)]
    return fig, ax, cats, bottom, series


@case
def stacked_bottom_zero(rng):
    """Honest twin of stacked_bottom_cut: the same stacks on an axis from 0."""
    fig, ax, cats, totals, series = stacked_twin(0)
    return fig, [honest("column", box_of(fig, ax), "stacked columns on zero, a label centred "
                        "in each segment", values=totals, labels=cats, axis=axis_of(ax, "y"),
                        baseline=0, style=["stacked", "segment-labels"], series=series)]


@case
def stacked_bottom_cut(rng):
    """Misleading: the axis starts at 40. The totals stay near proportion; the bottom
    segments do not, so the truth's values are the bottom segments (read from 0), the
    layer standing on the floor, as for stacked areas."""
    fig, ax, cats, totals, series = stacked_twin(40)
    axis = axis_of(ax, "y")
    f = honest("column", box_of(fig, ax), "values are the bottom segments: the stack totals "
               "(600-720) stay within the Lie Factor band on an axis from 40, the bottom "
               "segments (80-110) do not", values=STACK_BOTTOM, labels=cats, axis=axis,
               baseline=axis["min"], style=["stacked", "segment-labels", "truncated-axis",
                                            "clipped"], series=series)
    f["misleading"], f["rule"] = True, "bars-off-zero"
    return fig, [f]


# Segment values with one decimal, printed rounded to whole numbers: the smallest (8.4,
# printed 8) is 5% off its label, so only the labels' rounding keeps the twin honest.
LABEL_STACKS = [[8.4, 31.6, 22.7], [12.3, 28.4, 17.6], [9.6, 35.2, 20.4], [14.6, 30.3, 24.6]]


def labelled_stacks(stretch):
    """Stacked columns on a zero axis, each segment's value printed (rounded) at its
    centre; the top series drawn `stretch` times its value."""
    fig, ax = chart()
    cats = ["2031", "2032", "2033", "2034"]
    bottom = [0.0] * 4
    drawn = [[v * (stretch if s == 2 else 1) for s, v in enumerate(st)] for st in LABEL_STACKS]
    for s in range(3):
        h = [drawn[k][s] for k in range(4)]
        ax.bar(range(4), h, bottom=bottom, width=0.6, color=["#1b9e77", "#d95f02", "#7570b3"][s])
        for k in range(4):
            ax.text(k, bottom[k] + h[k] / 2, "%.0f" % LABEL_STACKS[k][s], ha="center",
                    va="center", fontsize=8, color="white")
        bottom = [bottom[k] + h[k] for k in range(4)]
    ax.set_ylim(0, 110)
    ax.set_xticks(range(4))
    ax.set_xticklabels(cats)
    ax.set_title("Gullwharf cargo by class, kt")
    # the judged values: every segment's printed number, stack by stack from the base
    values = [round(v) for st in LABEL_STACKS for v in st]
    names = ["segment %d of %s" % (s + 1, c) for c in cats for s in range(3)]
    return fig, ax, values, names, [d for st in drawn for d in st]


@case
def stacked_labels_rounded(rng):
    """Honest twin of stacked_labels_stretched: segments drawn to their values, labels
    rounded to whole numbers."""
    fig, ax, values, names, drawn = labelled_stacks(1.0)
    return fig, [honest("column", box_of(fig, ax), "stacked columns on zero, each segment "
                        "labelled with its value rounded to a whole number", values=[],
                        labels=[], axis=axis_of(ax, "y"), baseline=0,
                        style=["stacked", "segment-labels"])]


@case
def stacked_labels_stretched(rng):
    """Misleading: the printed numbers are the data, but the top series is drawn 1.4 times
    its value, so its segments' lengths disagree with their own labels."""
    fig, ax, values, names, drawn = labelled_stacks(1.4)
    f = honest("column", box_of(fig, ax), "values are the segments' printed numbers, drawn "
               "values their drawn thicknesses (top series 1.4 times its value)",
               values=values, labels=names, axis=axis_of(ax, "y"), baseline=0,
               style=["stacked", "segment-labels"])
    f["drawn_values"] = drawn
    f["misleading"], f["rule"] = True, "bars-vs-labels"
    return fig, [f]


FULL_COUNTS = [[34, 12, 21], [8, 40, 17], [25, 25, 9], [14, 19, 38]]


def full_stacks(horizontal, label):
    """100% stacks: each column (or row) the shares of its own total, each segment
    labelled by label(count, share)."""
    fig, ax = chart()
    cats = ["North Quay", "Tern Pier", "Old Slip", "Gullwharf"]
    base = [0.0] * 4
    for s in range(3):
        share = [100.0 * FULL_COUNTS[k][s] / sum(FULL_COUNTS[k]) for k in range(4)]
        colour = ["#66c2a5", "#fc8d62", "#8da0cb"][s]
        if horizontal:
            ax.barh(range(4), share, left=base, height=0.6, color=colour)
        else:
            ax.bar(range(4), share, bottom=base, width=0.6, color=colour)
        for k in range(4):
            mid = base[k] + share[k] / 2
            xy = (mid, k) if horizontal else (k, mid)
            ax.text(*xy, label(FULL_COUNTS[k][s], share[k]), ha="center", va="center",
                    fontsize=8)
        base = [base[k] + share[k] for k in range(4)]
    if horizontal:
        ax.set_xlim(0, 100)
        ax.set_yticks(range(4))
        ax.set_yticklabels(cats, fontsize=8)
        ax.invert_yaxis()
    else:
        ax.set_ylim(0, 100)
        ax.set_xticks(range(4))
        ax.set_xticklabels(cats, fontsize=8)
    return fig, ax


@case
def stacked_100_counts(rng):
    """Honest: 100% stacked columns labelled with the counts, not the shares drawn."""
    fig, ax = full_stacks(False, lambda n, share: "%d" % n)
    ax.set_title("Crossings by fare class (100% stacked, counts printed)")
    return fig, [honest("column", box_of(fig, ax), "100% stacked columns, each segment "
                        "labelled with its count: ink follows the counts within each "
                        "column, not across columns", axis=axis_of(ax, "y"), baseline=0,
                        style=["stacked", "segment-labels", "100-percent"])]


@case
def stacked_100_shares(rng):
    """Honest: 100% stacked horizontal bars labelled with their shares, rounded."""
    fig, ax = full_stacks(True, lambda n, share: "%.0f%%" % share)
    ax.set_title("Crossings by fare class (100% stacked, shares printed)")
    return fig, [honest("bar", box_of(fig, ax), "100% stacked horizontal bars, each "
                        "segment labelled with its share rounded to a whole percent",
                        axis=axis_of(ax, "x"), baseline=0,
                        style=["stacked", "segment-labels", "100-percent"])]


def main():
    os.makedirs(OUT, exist_ok=True)
    for n, fn in enumerate(CASES):
        seed = 1300 + n
        rng = random.Random(seed)
        fig, figures = fn(rng)
        path = os.path.join(OUT, fn.__name__ + ".pdf")
        fig.savefig(path, metadata=META)
        plt.close(fig)
        truth.write_truth(path, PRODUCER, seed, 1, figures, repo_root=ROOT)
    print("lookalikes: %d pages in %s" % (len(CASES), OUT))


if __name__ == "__main__":
    main()
