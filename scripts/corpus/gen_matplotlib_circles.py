#!/usr/bin/python3
"""Circle charts for the corpus, drawn by matplotlib (corpus/matplotlib/circ_*.pdf):
pies with printed percentages, donuts (wedgeprops width) with a colour-matched legend,
polar bars as radial bars and polar-area charts, a tilted pie drawn with affine-squeezed
wedges and a rim, and honest lookalikes (progress ring, gauge, circular logo).
Truth: scripts/corpus/truth_circles.py computes the expected measures from the data."""

import math
import os
import random
import sys

import matplotlib

matplotlib.use("pdf")
import matplotlib.pyplot as plt  # noqa: E402
from matplotlib.patches import PathPatch, Wedge, Circle  # noqa: E402
from matplotlib.path import Path  # noqa: E402
from matplotlib.transforms import Affine2D  # noqa: E402

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import truth  # noqa: E402

ROOT = os.environ.get("PP_CORPUS_ROOT") or os.path.dirname(os.path.dirname(
    os.path.dirname(os.path.abspath(__file__))))
OUT = os.path.join(ROOT, "corpus", "matplotlib")
PRODUCER = "matplotlib " + matplotlib.__version__
META = {"CreationDate": None, "Creator": PRODUCER}
SEED = 4107  # the data below is fixed, invented by hand for the Fjordhaven scenario
# scripts/holdout sets PP_CORPUS_SEED_OFFSET: the same charts with other invented data.
OFFSET = int(os.environ.get("PP_CORPUS_SEED_OFFSET", "0"))
RNG = random.Random(SEED + OFFSET)


def vary(values, decimals=0):
    """The values as given, or (held-out runs) other values of the same size order,
    largest first as in the originals."""
    if not OFFSET:
        return list(values)
    out = [max(3.0, round(v * RNG.uniform(0.6, 1.4), decimals)) for v in values]
    return sorted(out, reverse=True)


def mislead(values, given):
    """Angles for a pie that disagrees with its labels: the given ones, or (held-out
    runs) the values in reverse order, far from every label."""
    return list(given) if not OFFSET else list(reversed(values))

SEGMENTS = ["Ferries", "Freight", "Harbour", "Charter", "Other"]
FUNDS = ["Tern Bond", "Skarv Equity", "Lomvi Cash", "Alke Property"]
COLOURS = ["#3b6ea5", "#e08a2c", "#5a9e4b", "#c4453c", "#8a6bb5", "#7f7f7f"]


def new_fig(w=5.0, h=4.0):
    return plt.figure(figsize=(w, h), dpi=72)


def box(fig, artists):
    """Union of the artists' extents in PDF points, origin top-left (dpi 72)."""
    fig.canvas.draw()
    h = fig.get_figheight() * 72.0
    x0 = y0 = 1e9
    x1 = y1 = -1e9
    for a in artists:
        e = a.get_window_extent()
        x0, x1 = min(x0, e.x0), max(x1, e.x1)
        y0, y1 = min(y0, h - e.y1), max(y1, h - e.y0)
    return [round(x0, 2), round(y0, 2), round(x1, 2), round(y1, 2)]


def save(fig, name, figures):
    path = os.path.join(OUT, name + ".pdf")
    fig.savefig(path, metadata=META)
    plt.close(fig)
    truth.write_truth(path, PRODUCER, SEED + OFFSET, 1, figures, ROOT)


def figure(kind, bbox, values, labels, rule=None, circle=None, data_labels=None,
           style=(), notes=None):
    f = {"page": 1, "bbox": bbox, "kind": kind, "misleading": rule is not None,
         "rule": rule, "values": list(values), "labels": list(labels), "axis": None,
         "baseline": None, "data_labels": data_labels, "style": list(style)}
    if circle is not None:
        f["circle"] = circle
    if notes:
        f["notes"] = notes
    return f


def pct_labels(values, decimals=0):
    total = sum(values)
    return [round(100.0 * v / total, decimals) for v in values]


def pie(name, values, printed, drawn=None, rule=None, donut=False, legend=False,
        title="Revenue by segment, 2031", decimals=0, notes=None, min_label=None):
    """A pie (or donut) drawn from `drawn` (default values) with `printed` percentages;
    slices printed below `min_label` percent get no percentage (producers drop them)."""
    drawn = drawn or values
    fig = new_fig()
    ax = fig.add_axes([0.05, 0.08, 0.6, 0.8])
    ax.set_aspect("equal")
    wp = {"width": 0.38, "edgecolor": "white", "linewidth": 1.2} if donut else \
        {"edgecolor": "white", "linewidth": 1.0}
    labels = (SEGMENTS + ["Ferry bar", "Parking"])[:len(values)]
    fmt = "%%.%df%%%%" % decimals
    texts = [fmt % p if min_label is None or p >= min_label else "" for p in printed]
    wedges, *_ = ax.pie(drawn, colors=COLOURS, startangle=90, counterclock=False,
                        wedgeprops=wp, labels=None if legend else labels,
                        labeldistance=1.12)
    for w, t in zip(wedges, texts):
        mid = math.radians((w.theta1 + w.theta2) / 2)
        rr = 0.81 if donut else 0.62
        ax.text(rr * math.cos(mid), rr * math.sin(mid), t, ha="center", va="center",
                fontsize=9, color="white")
    if legend:
        fig.legend(wedges, ["%s %s" % (l, t) for l, t in zip(labels, texts)],
                   loc="center right", frameon=False, fontsize=9)
    ax.set_title(title, fontsize=11)
    bb = box(fig, wedges)
    circle = {"drawn_values": list(drawn), "printed": list(printed),
              "printed_kind": "percent", "decimals": decimals,
              "start": math.pi / 2, "direction": -1, "inner": 0.62 if donut else 0.0}
    style = ["donut"] if donut else []
    style += ["legend"] if legend else ["labels-inside"]
    if len(values) > len(COLOURS):
        style += ["colours-wrap"]  # the last slice takes the first one's colour, beside it
    if min_label is not None:
        style += ["small-slices-unlabelled"]
    save(fig, name, [figure("pie", bb, values, labels, rule, circle, list(printed), style,
                            notes)])


def radial_bars(name, values, full, rule="radial-ring-ink", width=0.8, gap=0.25, r0=1.0):
    """Concentric rings on polar axes, clockwise from the top; ring i's sweep stands for
    values[i] / full of a turn."""
    fig = new_fig(5.0, 5.0)
    ax = fig.add_axes([0.1, 0.1, 0.8, 0.78], projection="polar")
    ax.set_theta_zero_location("N")
    ax.set_theta_direction(-1)
    rings, bars = [], []
    for i, v in enumerate(values):
        ri = r0 + i * (width + gap)
        sweep = 2 * math.pi * v / full
        b = ax.bar(sweep / 2, width, width=sweep, bottom=ri, color=COLOURS[i],
                   align="center")
        bars.extend(b.patches)
        rings.append([ri, ri + width])
        ax.text(-0.02, ri + width / 2, "%s  %g" % (FUNDS[i], v), ha="right", va="center",
                fontsize=8)
    ax.set_ylim(0, r0 + len(values) * (width + gap))
    ax.set_xticks([])
    ax.set_yticks([])
    ax.spines["polar"].set_visible(False)
    ax.set_title("Assets under management, NOK bn (full circle = %g)" % full, fontsize=10)
    bb = box(fig, bars)
    circle = {"rings": rings, "full_value": full, "start": math.pi / 2, "direction": -1}
    save(fig, name, [figure("radial-bar", bb, values, FUNDS[:len(values)], rule, circle,
                            list(values), ["polar-axes", "data-labels"])])


def radial_bars_scale(name, values, full, rule, step):
    """Radial bars read from their angular scale alone: value tick labels printed around
    the circle (every `step` from 0 at the top, clockwise), no data labels; ring names
    sit at the rings' start. Honest rings keep (R² − r²) equal, so equal sweeps take equal
    ink; misleading rings are of equal width, so outer rings take more ink per unit."""
    fig = new_fig(5.0, 5.0)
    ax = fig.add_axes([0.12, 0.1, 0.76, 0.76], projection="polar")
    ax.set_theta_zero_location("N")
    ax.set_theta_direction(-1)
    n, r0, width, gap = len(values), 1.0, 0.8, 0.25
    rings, bars = [], []
    for i, v in enumerate(values):
        if rule is None:
            # Equal ring areas: ri² − r(i−1)² constant from the innermost ring's area.
            area = (r0 + width) ** 2 - r0 ** 2
            ri = r0 if i == 0 else math.sqrt(rings[-1][1] ** 2 + 2 * gap * rings[-1][1])
            ro = math.sqrt(ri * ri + area)
        else:
            ri = r0 + i * (width + gap)
            ro = ri + width
        sweep = 2 * math.pi * v / full
        b = ax.bar(sweep / 2, ro - ri, width=sweep, bottom=ri, color=COLOURS[i],
                   align="center")
        bars.extend(b.patches)
        rings.append([ri, ro])
        ax.text(-0.03, (ri + ro) / 2, FUNDS[i], ha="right", va="center", fontsize=7)
    ticks = [k * step for k in range(int(round(full / step)))]
    ax.set_xticks([2 * math.pi * t / full for t in ticks])
    ax.set_xticklabels(["%g" % t for t in ticks], fontsize=8)
    ax.set_ylim(0, rings[-1][1] + 0.1)
    ax.set_yticks([])
    ax.grid(False)
    ax.spines["polar"].set_visible(False)
    ax.set_title("Assets under management, NOK bn", fontsize=10)
    bb = box(fig, bars)
    circle = {"rings": rings, "full_value": full, "start": math.pi / 2, "direction": -1}
    save(fig, name, [figure("radial-bar", bb, values, FUNDS[:n], rule, circle, None,
                            ["polar-axes", "angular-scale"])])


def polar_area(name, values, by_radius):
    """Equal-angle wedges; radius ∝ value (misleading) or ∝ √value (honest)."""
    fig = new_fig(5.0, 5.0)
    ax = fig.add_axes([0.1, 0.1, 0.8, 0.78], projection="polar")
    n = len(values)
    top = max(values)
    radii = [v / top if by_radius else math.sqrt(v / top) for v in values]
    bars = ax.bar([2 * math.pi * (i + 0.5) / n for i in range(n)], radii,
                  width=2 * math.pi / n, bottom=0, color=COLOURS[:n], edgecolor="white")
    for i, (v, r) in enumerate(zip(values, radii)):
        th = 2 * math.pi * (i + 0.5) / n
        ax.text(th, r + 0.08, "%g" % v, ha="center", va="center", fontsize=9)
    ax.set_ylim(0, 1.15)
    ax.set_yticks([])
    ax.set_xticks([2 * math.pi * (i + 0.5) / n for i in range(n)])
    ax.set_xticklabels(SEGMENTS[:n], fontsize=8)
    ax.set_title("Passengers by route, thousands", fontsize=10)
    bb = box(fig, bars.patches)
    rule = "polar-radius" if by_radius else None
    save(fig, name, [figure("polar-area", bb, values, SEGMENTS[:n], rule,
                            {"radii": radii}, list(values),
                            ["polar-axes", "radius" if by_radius else "sqrt-radius"])])


def polar_area_axis(name, values, by_radius, step):
    """Equal-angle wedges read from a radial axis alone (value tick labels along a radius,
    no data labels). Misleading: radius ∝ value and the axis linear in the radius. Honest:
    radius ∝ √value, the axis' ticks placed at √(tick / top) so that area follows value."""
    fig = new_fig(5.0, 5.0)
    ax = fig.add_axes([0.1, 0.1, 0.8, 0.78], projection="polar")
    n, top = len(values), (math.floor(max(values) / step) + 1) * step
    pos = (lambda v: v / top) if by_radius else (lambda v: math.sqrt(v / top))
    radii = [pos(v) for v in values]
    bars = ax.bar([2 * math.pi * (i + 0.5) / n for i in range(n)], radii,
                  width=2 * math.pi / n, bottom=0, color=COLOURS[:n], edgecolor="white")
    ticks = [step * k for k in range(1, int(round(top / step)) + 1)]
    ax.set_yticks([pos(t) for t in ticks])
    ax.set_yticklabels(["%g" % t for t in ticks], fontsize=8)
    ax.set_rlabel_position(0.5 * 360.0 / n)
    ax.set_ylim(0, 1.02)
    ax.set_xticks([2 * math.pi * (i + 0.5) / n for i in range(n)])
    ax.set_xticklabels(SEGMENTS[:n], fontsize=8)
    ax.set_title("Passengers by route, thousands", fontsize=10)
    bb = box(fig, bars.patches)
    rule = "polar-radius" if by_radius else None
    save(fig, name, [figure("polar-area", bb, values, SEGMENTS[:n], rule,
                            {"radii": radii}, None,
                            ["polar-axes", "radial-axis",
                             "radius" if by_radius else "sqrt-radius"])])


def arc_path(t0, t1, rx, ry, cx, cy):
    """Ellipse arc between parametric angles (degrees) as matplotlib Béziers."""
    p = Path.arc(t0, t1)
    return [(cx + rx * x, cy + ry * y) for x, y in p.vertices], list(p.codes)


def tilted_pie(name, values, ratio, depth, rule, explode=()):
    """A '3D' pie: wedges squeezed by `ratio`, plus a rim of `depth` (radii) under the
    front half. Parametric angles run counter-clockwise from `start`. explode: indices of
    slices pulled out by 0.12 radii along their middle (top face and rim move together)."""
    fig = new_fig(6.0, 4.0)
    ax = fig.add_axes([0.05, 0.05, 0.9, 0.8])
    ax.set_aspect("equal")
    ax.set_xlim(-1.3, 1.3)
    ax.set_ylim(-1.0, 0.8)
    ax.axis("off")
    start = 20.0
    spans = truth.truth_circles.slice_angles(values, math.radians(start), 1)
    squeeze = Affine2D().scale(1, ratio) + ax.transData
    artists = []
    for i, (t0, t1) in enumerate(spans):
        a0, a1 = math.degrees(t0), math.degrees(t1)
        mid = (t0 + t1) / 2
        e = 0.12 if i in explode else 0.0
        ox, oy = e * math.cos(mid), e * math.sin(mid)  # in the un-squeezed pie
        if depth > 0:
            for lo, hi in truth.truth_circles._arc_overlap(t0, t1, math.pi, 2 * math.pi):
                top_v, top_c = arc_path(math.degrees(lo), math.degrees(hi), 1, ratio, ox,
                                        oy * ratio)
                bot_v, _ = arc_path(math.degrees(lo), math.degrees(hi), 1, ratio, ox,
                                    oy * ratio - depth)
                verts = top_v + bot_v[::-1] + [top_v[0]]
                codes = top_c + [Path.LINETO] + [Path.CURVE4] * (len(bot_v) - 1) + \
                    [Path.CLOSEPOLY]
                shade = tuple(0.7 * int(COLOURS[i][k:k + 2], 16) / 255 for k in (1, 3, 5))
                rim = PathPatch(Path(verts, codes), facecolor=shade, edgecolor="none")
                ax.add_patch(rim)
                artists.append(rim)
        w = Wedge((ox, oy), 1.0, a0, a1, facecolor=COLOURS[i], edgecolor="none",
                  transform=squeeze)
        ax.add_patch(w)
        artists.append(w)
        ax.text(ox + 0.65 * math.cos(mid), (oy + 0.65 * math.sin(mid)) * ratio,
                "%.0f%%" % (100.0 * values[i] / sum(values)), ha="center", va="center",
                fontsize=9, color="white")
    ax.set_title("Fleet hours by service, 2031", fontsize=11)
    bb = box(fig, artists)
    circle = {"ratio": ratio, "depth": depth, "start": math.radians(start), "direction": 1,
              "printed": pct_labels(values), "printed_kind": "percent", "decimals": 0}
    style = ["tilted"] + (["rim"] if depth > 0 else []) + (["exploded"] if explode else [])
    save(fig, name, [figure("tilted-pie", bb, values, SEGMENTS[:len(values)], rule, circle,
                            pct_labels(values), style)])


def lookalikes():
    # A progress ring for one value: a full grey track and one arc (honest).
    fig = new_fig(4.0, 4.0)
    ax = fig.add_axes([0.1, 0.1, 0.8, 0.8])
    ax.set_aspect("equal")
    ax.axis("off")
    track = Wedge((0, 0), 1, 0, 360, width=0.2, facecolor="#dddddd")
    done = Wedge((0, 0), 1, 90 - 0.68 * 360, 90, width=0.2, facecolor="#3b6ea5")
    ax.add_patch(track)
    ax.add_patch(done)
    ax.text(0, 0, "68%", ha="center", va="center", fontsize=22)
    ax.text(0, -0.35, "of 2031 emissions target", ha="center", fontsize=8)
    ax.set_xlim(-1.1, 1.1)
    ax.set_ylim(-1.1, 1.1)
    bb = box(fig, [track])
    save(fig, "circ_progress_ring", [figure("other", bb, [], [], None,
                                            style=["progress-ring"])])
    # A gauge: half ring in three bands and a needle (honest).
    fig = new_fig(5.0, 3.2)
    ax = fig.add_axes([0.05, 0.05, 0.9, 0.85])
    ax.set_aspect("equal")
    ax.axis("off")
    parts = []
    for a0, a1, c in ((120, 180, "#c4453c"), (60, 120, "#e0c02c"), (0, 60, "#5a9e4b")):
        w = Wedge((0, 0), 1, a0, a1, width=0.3, facecolor=c, edgecolor="white")
        ax.add_patch(w)
        parts.append(w)
    ax.plot([0, 0.7 * math.cos(math.radians(47))], [0, 0.7 * math.sin(math.radians(47))],
            color="black", linewidth=3)
    ax.add_patch(Circle((0, 0), 0.06, color="black"))
    ax.text(0, -0.2, "Customer satisfaction 74 / 100", ha="center", fontsize=10)
    ax.set_xlim(-1.2, 1.2)
    ax.set_ylim(-0.35, 1.1)
    bb = box(fig, parts)
    save(fig, "circ_gauge", [figure("other", bb, [], [], None, style=["gauge"])])
    # A circular logo (three ring segments and a dot) beside a letterhead.
    fig = new_fig(6.0, 2.0)
    ax = fig.add_axes([0.02, 0.05, 0.3, 0.9])
    ax.set_aspect("equal")
    ax.axis("off")
    parts = []
    for k, c in enumerate(("#3b6ea5", "#5a9e4b", "#e08a2c")):
        w = Wedge((0, 0), 1, 120 * k + 10, 120 * k + 110, width=0.35, facecolor=c)
        ax.add_patch(w)
        parts.append(w)
    ax.add_patch(Circle((0, 0), 0.3, color="#3b6ea5"))
    ax.set_xlim(-1.1, 1.1)
    ax.set_ylim(-1.1, 1.1)
    fig.text(0.38, 0.55, "Fjordhaven Ferries ASA", fontsize=16)
    fig.text(0.38, 0.35, "Annual report 2031 · Sustainability supplement", fontsize=9)
    bb = box(fig, parts)
    save(fig, "circ_logo", [figure("other", bb, [], [], None, style=["logo"])])


def main():
    os.makedirs(OUT, exist_ok=True)
    v = vary([41.0, 27.0, 16.0, 10.0, 6.0])
    pie("circ_pie_honest", v, pct_labels(v))
    # Labels from the true values, angles drawn from other numbers.
    pie("circ_pie_angles_wrong", v, pct_labels(v),
        drawn=mislead(v, [30.0, 30.0, 18.0, 12.0, 10.0]), rule="wedges-vs-labels")
    # Honest angles, printed percentages that sum to 108 (held out: 100 + 8 as well).
    off = [44.0, 29.0, 17.0, 11.0, 7.0] if not OFFSET else \
        [p + a for p, a in zip(pct_labels(v), (3, 2, 1, 1, 1))]
    pie("circ_pie_sum_off", v, off, drawn=v, rule="shares-not-100",
        notes="percentages printed sum to %g" % sum(off))
    # One decimal, honest: the sum is 100.0 within 5 x 0.05.
    v2 = vary([38.4, 25.1, 17.7, 11.2, 7.6], 1)
    pie("circ_pie_decimals_honest", v2, pct_labels(v2, 1), decimals=1)
    # Seven slices on six colours: the last (smallest) slice is painted like the first,
    # beside it. Honest: it has no percentage of its own (below 5%), the first slice's
    # label fits the first slice alone. Misleading: every slice labelled, angles wrong
    # (held out: the two largest swapped and the third widened, so labels stay readable).
    v7 = vary([27.0, 21.0, 16.0, 13.0, 10.0, 9.0, 4.0])
    pie("circ_pie_colour_wrap_honest", v7, pct_labels(v7), min_label=5)
    pie("circ_pie_colour_wrap_angles_wrong", v7, pct_labels(v7),
        drawn=[21.0, 27.0, 16.0, 13.0, 10.0, 6.0, 7.0] if not OFFSET else
        [v7[1], v7[0], 1.25 * v7[2]] + v7[3:], rule="wedges-vs-labels")
    v3 = vary([46.0, 31.0, 15.0, 8.0])
    pie("circ_donut_honest", v3, pct_labels(v3), donut=True, legend=True,
        title="Fund mix, 2031")
    pie("circ_donut_angles_wrong", v3, pct_labels(v3),
        drawn=mislead(v3, [34.0, 33.0, 20.0, 13.0]), donut=True, legend=True,
        rule="wedges-vs-labels", title="Fund mix, 2031")
    radial_bars("circ_radial_bars", vary([62.0, 48.0, 35.0, 21.0]), 80.0 if not OFFSET else 100.0)
    vs = vary([57.0, 44.0, 31.0, 18.0])
    # The full turn: two tens above the largest value's (70 for the fixed data).
    full = 10.0 * (math.floor(max(vs) / 10.0) + 2)
    radial_bars_scale("circ_radial_scale", vs, full, "radial-ring-ink", 10.0)
    radial_bars_scale("circ_radial_scale_honest", vs, full, None, 10.0)
    vp = vary([120.0, 80.0, 60.0, 35.0, 25.0])
    polar_area("circ_polar_radius", vp, True)
    polar_area("circ_polar_sqrt_honest", vp, False)
    polar_area_axis("circ_polar_axis_radius", vp, True, 20.0)
    polar_area_axis("circ_polar_axis_sqrt_honest", vp, False, 20.0)
    v4 = vary([34.0, 26.0, 18.0, 14.0, 8.0])
    tilted_pie("circ_tilted_rim", v4, 0.42, 0.16, "tilted-pie-ink")
    tilted_pie("circ_tilted_flat_honest", v4, 0.42, 0.0, None)
    tilted_pie("circ_tilted_exploded_rim", v4, 0.42, 0.16, "tilted-pie-ink", explode=(1,))
    tilted_pie("circ_tilted_exploded_flat_honest", v4, 0.42, 0.0, None, explode=(1,))
    lookalikes()


if __name__ == "__main__":
    main()
