#!/usr/bin/python3
"""Generate the matplotlib part of the plotproof corpus (corpus/matplotlib/).
Each chart is drawn by matplotlib itself; the truth (plot box, axis limits,
values) is read back from the matplotlib objects, not re-derived by hand."""

import io
import math
import os
import random
import sys

import matplotlib

matplotlib.use("pdf")
import matplotlib.pyplot as plt  # noqa: E402
from matplotlib.backends.backend_pdf import PdfPages  # noqa: E402
from matplotlib.ticker import FuncFormatter  # noqa: E402

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import truth  # noqa: E402

# PP_CORPUS_ROOT and PP_CORPUS_SEED_OFFSET make a held-out corpus elsewhere: the same
# kinds of charts with other invented data (scripts/holdout).
ROOT = os.environ.get("PP_CORPUS_ROOT") or os.path.dirname(os.path.dirname(
    os.path.dirname(os.path.abspath(__file__))))
SEED_OFFSET = int(os.environ.get("PP_CORPUS_SEED_OFFSET", "0"))


def rng_of(seed):
    return random.Random(seed + SEED_OFFSET)


OUT = os.path.join(ROOT, "corpus", "matplotlib")
PRODUCER = "matplotlib " + matplotlib.__version__
# Fixed metadata keeps reruns byte-stable apart from matplotlib internals.
META = {"CreationDate": None, "Creator": PRODUCER}

YEARS = [str(y) for y in range(2016, 2024)]
QUARTERS = ["Q1", "Q2", "Q3", "Q4", "Q1'", "Q2'"]
MONTHS = ["January", "February", "March", "April", "May", "June", "July",
          "August", "September", "October", "November", "December"]
ROUTES = ["Skjerholm", "Ravnvik", "Ostrand", "Lyngsetra", "Brevik Sound",
          "Hallaug"]
DEPOTS = ["North Quay", "Tern Pier", "Old Slip", "Gullwharf", "Eastmoor"]

FORMATS = {
    "plain": lambda v: "%g" % v,
    "thousands": lambda v: "{:,.0f}".format(v),
    "usd": lambda v: "${:,.0f}".format(v),
    # German-style grouping and decimal comma with a trailing euro sign.
    "eur": lambda v: "{:,.0f} €".format(v).replace(",", "."),
    "percent": lambda v: "%.0f%%" % v,
    "comma": lambda v: ("%.1f" % v).replace(".", ","),
}
# Decimals each format prints: a printed data label stands for the rounded number.
PRINTED_DECIMALS = {"thousands": 0, "usd": 0, "eur": 0, "percent": 0, "comma": 1}


def as_printed(fmt, v):
    d = PRINTED_DECIMALS.get(fmt)
    return v if d is None else round(v, d)


FORMAT_TAGS = {
    "plain": [], "thousands": ["thousands-sep"],
    "usd": ["currency", "thousands-sep"],
    "eur": ["currency", "thousands-sep", "decimal-comma"],
    "percent": ["percent"], "comma": ["decimal-comma"],
}
RANGES = {
    "plain": (300, 900, 0), "thousands": (12000, 48000, 0),
    "usd": (1200, 5400, 0), "eur": (2400, 9800, 0),
    "percent": (22, 64, 1), "comma": (1.2, 4.8, 1),
}


def make_values(rng, n, lo, hi, decimals):
    """Rising series with noise; first != last so Lie Factors are defined."""
    start = rng.uniform(lo, lo + 0.25 * (hi - lo))
    end = rng.uniform(lo + 0.75 * (hi - lo), hi)
    out = []
    for i in range(n):
        t = i / max(1, n - 1)
        v = start + t * (end - start) + rng.uniform(-0.06, 0.06) * (hi - lo)
        out.append(round(max(v, lo * 0.8), decimals))
    if out[0] == out[-1]:
        out[-1] = round(out[-1] * 1.1, decimals)
    if decimals == 0:
        out = [int(v) for v in out]
    return out


def nice_floor(x):
    step = 10 ** (math.floor(math.log10(x)) - 1)
    return math.floor(x / step) * step


def nice_ceil(x):
    step = 10 ** (math.floor(math.log10(x)) - 1) * 5
    return math.ceil(x / step) * step


def axis_floor(values, trunc):
    """Value-axis minimum: 0 honest, ~50% of min (mild), ~90% (severe)."""
    if trunc == "none":
        return 0
    frac = {"mild": 0.5, "severe": 0.9}[trunc]
    return nice_floor(frac * min(values))


def box_of(fig, ax):
    """Axes box in PDF points, origin top-left (fig.dpi is 72)."""
    fig.canvas.draw()
    e = ax.get_window_extent()
    scale = 72.0 / fig.dpi
    h = fig.get_figheight() * 72.0
    return [round(e.x0 * scale, 2), round(h - e.y1 * scale, 2),
            round(e.x1 * scale, 2), round(h - e.y0 * scale, 2)]


def axis_info(ax, orientation):
    lo, hi = ax.get_ylim() if orientation == "y" else ax.get_xlim()
    scale = ax.get_yscale() if orientation == "y" else ax.get_xscale()
    return {"min": float(lo), "max": float(hi), "scale": scale,
            "orientation": orientation}


def new_fig(w=6.4, h=4.2):
    fig = plt.figure(figsize=(w, h), dpi=72)
    return fig


def apply_styles(ax, style, orientation):
    if "gridlines" in style:
        ax.grid(True, axis=orientation, color="#bbbbbb", linewidth=0.6)
        ax.set_axisbelow(True)


def bar_kwargs(style, i=0):
    kw = {"color": ["#2b6c8f", "#d9822b", "#5a9e4b", "#8e5aa8"][i % 4]}
    if "edge-strokes" in style:
        kw.update(edgecolor="black", linewidth=1.0)
    if "hatch" in style:
        kw.update(hatch=["//", "xx", "..", "\\\\"][i % 4], edgecolor="white")
    if "alpha" in style:
        kw["alpha"] = 0.55
    return kw


def trunc_tags(trunc):
    return [] if trunc == "none" else ["truncated-axis", trunc]


# --- chart drawers: each draws on ax and returns a partial figure dict ---

def draw_columns(fig, ax, spec):
    v, labels, fmt, style = spec["values"], spec["labels"], spec["fmt"], \
        list(spec["style"])
    lo = axis_floor(v, spec["trunc"])
    hi = nice_ceil(max(v) * 1.1)
    x = list(range(len(v)))
    width = 0.6 if len(v) < 30 else 0.7
    if "bottom-at-axis-min" in style:
        ax.bar(x, [d - lo for d in v], bottom=lo, width=width,
               **bar_kwargs(style))
    else:
        ax.bar(x, v, width=width, **bar_kwargs(style))
    ax.set_ylim(lo, hi)
    ax.set_xticks(x)
    rot = 45 if "rotated-labels" in style else 0
    if len(v) >= 30:
        ax.set_xticks(x[::6])
        ax.set_xticklabels(labels[::6], rotation=rot,
                           ha="right" if rot else "center")
    else:
        ax.set_xticklabels(labels, rotation=rot,
                           ha="right" if rot else "center")
    ax.yaxis.set_major_formatter(FuncFormatter(lambda t, p: FORMATS[fmt](t)))
    apply_styles(ax, style, "y")
    if "inverted-axis" in style:
        ax.invert_yaxis()  # bars hang from the top edge
    if "right-axis" in style:
        ax.yaxis.tick_right()
    if "twin-axis" in style:
        # A second value axis on the right for an unfilled line (load factor, %);
        # the bars belong to the left axis.
        ax2 = ax.twinx()
        ax2.plot(x, [55 + 3 * ((i * 7) % 5) for i in x], color="black",
                 linewidth=1.2)
        ax2.set_ylim(40, 80)
        ax2.yaxis.set_major_formatter(
            FuncFormatter(lambda t, p: "%d%%" % t))
    dl = None
    if "data-labels" in style:
        dl = list(v)
        for xi, vi in zip(x, v):
            ax.text(xi, vi, FORMATS[fmt](vi), ha="center", va="bottom",
                    fontsize=8)
    ax.set_title(spec["title"], fontsize=11)
    misleading = lo != 0
    return {"kind": "column", "misleading": misleading,
            "rule": "bars-off-zero" if misleading else None,
            "values": v, "labels": labels, "axis": axis_info(ax, "y"),
            "baseline": lo, "data_labels": dl,
            "style": style + FORMAT_TAGS[fmt] + trunc_tags(spec["trunc"])}


def draw_hbars(fig, ax, spec):
    v, labels, fmt, style = spec["values"], spec["labels"], spec["fmt"], \
        list(spec["style"])
    lo = axis_floor(v, spec["trunc"])
    hi = nice_ceil(max(v) * 1.1)
    y = list(range(len(v)))
    ax.barh(y, v, height=0.6, **bar_kwargs(style))
    ax.set_xlim(lo, hi)
    ax.set_yticks(y)
    ax.set_yticklabels(labels)
    ax.invert_yaxis()  # first category on top, as read
    ax.xaxis.set_major_formatter(FuncFormatter(lambda t, p: FORMATS[fmt](t)))
    apply_styles(ax, style, "x")
    ax.set_title(spec["title"], fontsize=11)
    misleading = lo != 0
    return {"kind": "bar", "misleading": misleading,
            "rule": "bars-off-zero" if misleading else None,
            "values": v, "labels": labels, "axis": axis_info(ax, "x"),
            "baseline": lo, "data_labels": None,
            "style": style + FORMAT_TAGS[fmt] + trunc_tags(spec["trunc"])}


def draw_area(fig, ax, spec):
    v, labels, fmt, style = spec["values"], spec["labels"], spec["fmt"], \
        list(spec["style"])
    lo = axis_floor(v, spec["trunc"])
    hi = nice_ceil(max(v) * 1.1)
    x = list(range(len(v)))
    floor = lo if "floor-at-axis-min" in style else 0
    kw = {"color": "#3f7f5f", "alpha": 0.5 if "alpha" in style else 1.0,
          "linewidth": 0}
    ax.fill_between(x, v, floor, **kw)
    ax.plot(x, v, color="#1f4f3f", linewidth=1.5)
    ax.set_ylim(lo, hi)
    ax.set_xlim(0, len(v) - 1)
    ax.set_xticks(x)
    ax.set_xticklabels(labels)
    ax.yaxis.set_major_formatter(FuncFormatter(lambda t, p: FORMATS[fmt](t)))
    apply_styles(ax, style, "y")
    ax.set_title(spec["title"], fontsize=11)
    misleading = lo != 0
    return {"kind": "area", "misleading": misleading,
            "rule": "area-off-zero" if misleading else None,
            "values": v, "labels": labels, "axis": axis_info(ax, "y"),
            "baseline": lo, "data_labels": None,
            "style": style + FORMAT_TAGS[fmt] + trunc_tags(spec["trunc"])}


def draw_band(fig, ax, spec):
    """Area between two series: encodes a spread, not a magnitude."""
    rng = rng_of(spec["seed"])
    v = spec["values"]
    low = [round(d * rng.uniform(0.6, 0.8)) for d in v]
    x = list(range(len(v)))
    ax.fill_between(x, low, v, color="#9fb8d8")
    ax.plot(x, v, color="#20406a")
    ax.plot(x, low, color="#20406a")
    lo = nice_floor(min(low) * 0.9)
    ax.set_ylim(lo, nice_ceil(max(v) * 1.1))
    ax.set_xlim(0, len(v) - 1)
    ax.set_xticks(x)
    ax.set_xticklabels(spec["labels"])
    ax.set_title(spec["title"], fontsize=11)
    return {"kind": "area", "misleading": False, "rule": None, "values": v,
            "labels": spec["labels"], "axis": axis_info(ax, "y"),
            "baseline": None, "data_labels": None,
            "series": [{"name": "high", "values": v},
                       {"name": "low", "values": low}],
            "style": list(spec["style"]) + ["between-series",
                                            "truncated-axis"],
            "notes": "band between two series on a truncated axis"}


def draw_log_columns(fig, ax, spec):
    v, labels, style = spec["values"], spec["labels"], list(spec["style"])
    lo = spec["log_min"]
    x = list(range(len(v)))
    if "bottom-at-axis-min" in style:
        ax.bar(x, [d - lo for d in v], bottom=lo, **bar_kwargs(style))
    else:
        ax.bar(x, v, **bar_kwargs(style))
    ax.set_yscale("log")
    ax.set_ylim(lo, 10 ** math.ceil(math.log10(max(v) * 1.2)))
    ax.set_xticks(x)
    ax.set_xticklabels(labels)
    apply_styles(ax, style, "y")
    ax.set_title(spec["title"], fontsize=11)
    return {"kind": "column", "misleading": True, "rule": "bars-on-log",
            "values": v, "labels": labels, "axis": axis_info(ax, "y"),
            "baseline": lo, "data_labels": None, "style": style + ["log"]}


def draw_log_hbars(fig, ax, spec):
    v, labels, style = spec["values"], spec["labels"], list(spec["style"])
    lo = spec["log_min"]
    y = list(range(len(v)))
    ax.barh(y, v, height=0.6, **bar_kwargs(style))
    ax.set_xscale("log")
    ax.set_xlim(lo, 10 ** math.ceil(math.log10(max(v) * 1.2)))
    ax.set_yticks(y)
    ax.set_yticklabels(labels)
    ax.invert_yaxis()
    ax.set_title(spec["title"], fontsize=11)
    return {"kind": "bar", "misleading": True, "rule": "bars-on-log",
            "values": v, "labels": labels, "axis": axis_info(ax, "x"),
            "baseline": lo, "data_labels": None, "style": style + ["log"]}


def draw_labelled(fig, ax, spec):
    """Bars with printed numbers; 'drawn' may differ from the labels."""
    labels_num, drawn = spec["values"], spec["drawn"]
    labels, fmt, style = spec["labels"], spec["fmt"], list(spec["style"])
    x = list(range(len(drawn)))
    ax.bar(x, drawn, **bar_kwargs(style))
    for xi, d, lab in zip(x, drawn, labels_num):
        ax.text(xi, d, FORMATS[fmt](lab), ha="center", va="bottom",
                fontsize=9)
    ax.set_ylim(0, nice_ceil(max(drawn) * 1.15))
    ax.set_xticks(x)
    ax.set_xticklabels(labels)
    info = axis_info(ax, "y")
    fig_axis = info
    extra = {}
    if "data-labels-only" in style:
        ax.yaxis.set_visible(False)
        for s in ("left", "right", "top"):
            ax.spines[s].set_visible(False)
        fig_axis = None
        extra["axis_hidden"] = info
    else:
        style.append("data-labels")
    ax.set_title(spec["title"], fontsize=11)
    liar = list(drawn) != list(labels_num)
    d = {"kind": "column", "misleading": liar,
         "rule": "bars-vs-labels" if liar else None,
         "values": labels_num, "labels": labels, "axis": fig_axis,
         "baseline": 0, "data_labels": labels_num,
         "style": style + FORMAT_TAGS[fmt]}
    if liar:
        d["drawn_values"] = drawn
    d.update(extra)
    return d


def draw_stacked(fig, ax, spec):
    rng = rng_of(spec["seed"])
    labels, style = spec["labels"], list(spec["style"])
    names = ["Passenger", "Freight", "Charter"]
    series = [make_values(rng, len(labels), a, b, 0)
              for a, b in ((200, 500), (80, 220), (30, 90))]
    totals = [sum(s[i] for s in series) for i in range(len(labels))]
    lo = axis_floor(totals, spec["trunc"])
    x = list(range(len(labels)))
    bottom = [0] * len(labels)
    for k, s in enumerate(series):
        ax.bar(x, s, bottom=bottom, label=names[k], **bar_kwargs(style, k))
        bottom = [b + d for b, d in zip(bottom, s)]
    ax.set_ylim(lo, nice_ceil(max(totals) * 1.15))
    ax.set_xticks(x)
    ax.set_xticklabels(labels)
    ax.legend(fontsize=8, loc="upper left")
    apply_styles(ax, style, "y")
    ax.set_title(spec["title"], fontsize=11)
    mis = lo != 0
    return {"kind": "column", "misleading": mis,
            "rule": "bars-off-zero" if mis else None, "values": totals,
            "labels": labels, "axis": axis_info(ax, "y"), "baseline": lo,
            "data_labels": None,
            "series": [{"name": n, "values": s}
                       for n, s in zip(names, series)],
            "style": style + ["stacked"] + trunc_tags(spec["trunc"]),
            "notes": "values are stack totals; bottom segment starts at 0 "
                     "and is clipped by the axes when truncated"}


def draw_grouped(fig, ax, spec):
    rng = rng_of(spec["seed"])
    cats, style = spec["labels"], list(spec["style"])
    names = ["Ferry", "Bus link"]
    series = [make_values(rng, len(cats), 400, 900, 0),
              make_values(rng, len(cats), 350, 800, 0)]
    flat, flat_labels = [], []
    for i, c in enumerate(cats):
        for n, s in zip(names, series):
            flat.append(s[i])
            flat_labels.append("%s/%s" % (c, n))
    lo = axis_floor(flat, spec["trunc"])
    w = 0.38
    for k, s in enumerate(series):
        ax.bar([i + (k - 0.5) * w for i in range(len(cats))], s, width=w,
               label=names[k], **bar_kwargs(style, k))
    ax.set_ylim(lo, nice_ceil(max(flat) * 1.15))
    ax.set_xticks(range(len(cats)))
    ax.set_xticklabels(cats)
    ax.legend(fontsize=8, loc="upper left")
    apply_styles(ax, style, "y")
    ax.set_title(spec["title"], fontsize=11)
    mis = lo != 0
    return {"kind": "column", "misleading": mis,
            "rule": "bars-off-zero" if mis else None, "values": flat,
            "labels": flat_labels, "axis": axis_info(ax, "y"),
            "baseline": lo, "data_labels": None,
            "series": [{"name": n, "values": s}
                       for n, s in zip(names, series)],
            "style": style + ["grouped"] + trunc_tags(spec["trunc"])}


def draw_negative(fig, ax, spec):
    v, labels, style = spec["values"], spec["labels"], list(spec["style"])
    x = list(range(len(v)))
    horiz = spec.get("horizontal", False)
    cols = ["#b03a2e" if d < 0 else "#2b6c8f" for d in v]
    lim = (nice_floor(-min(v) * 1.2) * -1 if min(v) < 0 else 0,
           nice_ceil(max(v) * 1.2))
    if horiz:
        ax.barh(x, v, color=cols)
        ax.set_xlim(*lim)
        ax.axvline(0, color="black", linewidth=0.8)
        ax.set_yticks(x)
        ax.set_yticklabels(labels)
        ax.invert_yaxis()
    else:
        ax.bar(x, v, color=cols)
        ax.set_ylim(*lim)
        ax.axhline(0, color="black", linewidth=0.8)
        ax.set_xticks(x)
        ax.set_xticklabels(labels)
    apply_styles(ax, style, "x" if horiz else "y")
    ax.set_title(spec["title"], fontsize=11)
    return {"kind": "bar" if horiz else "column", "misleading": False,
            "rule": None, "values": v, "labels": labels,
            "axis": axis_info(ax, "x" if horiz else "y"), "baseline": 0,
            "data_labels": None, "style": style + ["negative"]}


def draw_line(fig, ax, spec):
    v, labels, fmt, style = spec["values"], spec["labels"], spec["fmt"], \
        list(spec["style"])
    lo = axis_floor(v, spec["trunc"])
    x = list(range(len(v)))
    if "scatter" in style:
        rng = rng_of(spec["seed"])
        xs = [rng.uniform(0, 10) for _ in v]
        ax.scatter(xs, v, s=14, color="#2b6c8f")
        ax.set_xlim(0, 10)
        ax.set_xlabel("Crossing time (min)")
    else:
        ax.plot(x, v, marker="o" if "markers" in style else None,
                color="#2b6c8f", linewidth=1.8)
        ax.set_xticks(x)
        ax.set_xticklabels(labels)
    ax.set_ylim(lo, nice_ceil(max(v) * 1.1))
    ax.yaxis.set_major_formatter(FuncFormatter(lambda t, p: FORMATS[fmt](t)))
    apply_styles(ax, style, "y")
    ax.set_title(spec["title"], fontsize=11)
    return {"kind": "line", "misleading": False, "rule": None, "values": v,
            "labels": labels if "scatter" not in style else
            ["p%d" % i for i in range(len(v))],
            "axis": axis_info(ax, "y"), "baseline": None,
            "data_labels": None,
            "style": style + FORMAT_TAGS[fmt] + trunc_tags(spec["trunc"])}


DRAWERS = {"column": draw_columns, "bar": draw_hbars, "area": draw_area,
           "band": draw_band, "logcol": draw_log_columns,
           "logbar": draw_log_hbars, "labelled": draw_labelled,
           "stacked": draw_stacked, "grouped": draw_grouped,
           "negative": draw_negative, "line": draw_line}


def one_chart_page(spec, w=6.4, h=4.2, rect=None):
    if rect is None:
        rect = (0.13, 0.14, 0.82, 0.76)
        if spec["draw"] in ("bar", "logbar") or spec.get("horizontal"):
            rect = (0.2, 0.12, 0.76, 0.78)  # room for route names
        elif "rotated-labels" in spec.get("style", []):
            rect = (0.13, 0.25, 0.82, 0.65)

    def build():
        fig = new_fig(w, h)
        ax = fig.add_axes(rect)
        d = DRAWERS[spec["draw"]](fig, ax, spec)
        d["bbox"] = box_of(fig, ax)
        return fig, [d]
    return build


def save(name, seed, fonttype, builders):
    """Render pages with the given pdf.fonttype, then write the truth."""
    path = os.path.join(OUT, name + ".pdf")
    tag = "fonttype%d" % fonttype
    figs = []
    with matplotlib.rc_context({"pdf.fonttype": fonttype}):
        if len(builders) == 1:
            fig, ds = builders[0]()
            fig.savefig(path, metadata=META)
            plt.close(fig)
            figs = [(1, ds)]
        else:
            with PdfPages(path, metadata=META) as pdf:
                for n, b in enumerate(builders, 1):
                    fig, ds = b()
                    pdf.savefig(fig)
                    plt.close(fig)
                    figs.append((n, ds))
    flat = []
    for page, ds in figs:
        for d in ds:
            d["page"] = page
            if tag not in d.setdefault("style", []):
                d["style"].append(tag)
            if len(builders) > 1:
                d["style"].append("multi-page")
            if d.get("misleading") and d["rule"] != "bars-vs-labels" and \
                    "bottom-at-axis-min" not in d["style"] and \
                    "floor-at-axis-min" not in d["style"]:
                d["style"].append("clipped")  # drawn from 0, cut by axes
            flat.append(d)
    truth.write_truth(path, PRODUCER, seed, len(builders), flat, ROOT)
    return len(flat)


# --- corpus plan ---

def twin_families():
    """(name, draw, fmt, style, labels, n, fonttype) honest/mild/severe."""
    return [
        ("col_plain", "column", "plain", [], YEARS, 8, 42),
        ("col_plain_t3", "column", "plain", [], YEARS, 6, 3),
        ("col_grid_edges", "column", "plain", ["gridlines", "edge-strokes"],
         YEARS, 7, 42),
        ("col_hatch_alpha", "column", "plain", ["hatch", "alpha"],
         QUARTERS, 6, 3),
        ("col_thousands", "column", "thousands", ["gridlines"], YEARS, 8, 42),
        ("col_usd", "column", "usd", [], YEARS, 6, 42),
        ("col_eur", "column", "eur", ["edge-strokes"], YEARS, 6, 3),
        ("col_percent", "column", "percent", ["data-labels"], QUARTERS, 6,
         42),
        ("col_comma", "column", "comma", ["gridlines"], YEARS, 7, 3),
        ("col_rotated", "column", "plain", ["rotated-labels"], MONTHS, 12,
         42),
        ("col_many", "column", "thousands", ["many-bars"], None, 48, 42),
        ("col_bottom", "column", "plain", ["bottom-at-axis-min"], YEARS, 6,
         3),
        ("bar_plain", "bar", "plain", [], ROUTES, 6, 42),
        ("bar_usd_grid", "bar", "usd", ["gridlines", "edge-strokes"], DEPOTS,
         5, 42),
        ("bar_t3_percent", "bar", "percent", ["alpha"], ROUTES, 6, 3),
        ("area_plain", "area", "plain", [], YEARS, 8, 42),
        ("area_alpha_grid", "area", "thousands", ["alpha", "gridlines"],
         YEARS, 8, 3),
        ("area_floor", "area", "percent", ["floor-at-axis-min"], QUARTERS, 6,
         42),
        ("stacked", "stacked", None, [], YEARS, 6, 42),
        ("grouped", "grouped", None, ["edge-strokes"], YEARS[:5], 5, 3),
    ]


def main():
    os.makedirs(OUT, exist_ok=True)
    for f in os.listdir(OUT):
        if f.endswith(".pdf") or f.endswith(".truth.json"):
            os.remove(os.path.join(OUT, f))
    total = 0
    seed = 100
    for name, draw, fmt, style, labels, n, ft in twin_families():
        seed += 1
        rng = rng_of(seed)
        fmt = fmt or "plain"
        lo, hi, dec = RANGES[fmt]
        vals = make_values(rng, n, lo, hi, dec)
        labs = labels[:n] if labels else ["W%02d" % (i + 1) for i in range(n)]
        for trunc in ("none", "mild", "severe"):
            spec = {"draw": draw, "fmt": fmt, "style": style, "values": vals,
                    "labels": labs, "trunc": trunc, "seed": seed,
                    "title": "Fjordhaven Ferries - %s" % name.replace("_", " ")}
            suffix = {"none": "honest", "mild": "trunc_mild",
                      "severe": "trunc_severe"}[trunc]
            total += save("%s_%s" % (name, suffix), seed, ft,
                          [one_chart_page(spec)])

    # log-scale bars (misleading) with honest linear twins
    for k, (draw, ft, style) in enumerate((
            ("logcol", 42, []), ("logcol", 3, ["gridlines"]),
            ("logbar", 42, []), ("logcol", 42, ["bottom-at-axis-min"]))):
        seed += 1
        rng = rng_of(seed)
        vals = [int(10 ** rng.uniform(1.6, 3.6)) for _ in range(6)]
        vals.sort()
        labs = ROUTES if draw == "logbar" else YEARS[:6]
        spec = {"draw": draw, "values": vals, "labels": labs[:6],
                "style": style, "log_min": 10, "seed": seed,
                "title": "Kestrel Orchards - crates shipped (log)"}
        total += save("log_%s_%d" % (draw, k), seed, ft,
                      [one_chart_page(spec)])
        twin = {"draw": "column" if draw != "logbar" else "bar",
                "fmt": "thousands", "style": [], "values": vals,
                "labels": labs[:6], "trunc": "none", "seed": seed,
                "title": "Kestrel Orchards - crates shipped"}
        total += save("log_%s_%d_honest_linear" % (draw, k), seed, ft,
                      [one_chart_page(twin)])
        line = {"draw": "line", "fmt": "plain", "style": ["log", "markers"],
                "values": vals, "labels": labs[:6], "trunc": "none",
                "seed": seed, "title": "Kestrel Orchards - log line"}

        def build_logline(spec=line):
            fig = new_fig()
            ax = fig.add_axes((0.13, 0.14, 0.82, 0.76))
            ax.set_yscale("log")
            ax.plot(range(6), spec["values"], marker="o")
            ax.set_ylim(10, 10 ** math.ceil(math.log10(max(vals) * 1.2)))
            ax.set_xticks(range(6))
            ax.set_xticklabels(spec["labels"])
            ax.set_title(spec["title"], fontsize=11)
            d = {"kind": "line", "misleading": False, "rule": None,
                 "values": spec["values"], "labels": spec["labels"],
                 "axis": axis_info(ax, "y"), "baseline": None,
                 "style": ["log", "markers"], "bbox": box_of(fig, ax)}
            return fig, [d]
        if k < 2:
            total += save("log_line_%d" % k, seed, ft, [build_logline])

    # bars that disagree with their own data labels, and honest twins
    for k, (fmt, style, ft) in enumerate((
            ("plain", ["data-labels-only"], 42),
            ("usd", [], 42),
            ("percent", ["data-labels-only", "edge-strokes"], 3),
            ("thousands", [], 3))):
        seed += 1
        rng = rng_of(seed)
        lo, hi, dec = RANGES[fmt]
        lab = [as_printed(fmt, v) for v in make_values(rng, 5, lo, hi, dec)]
        # Exaggerate growth: drawn = first label scaled down, last kept.
        drawn = [round(lab[0] * 0.45 + (d - lab[0]) * 1.6, dec) for d in lab]
        drawn = [d if dec else int(d) for d in drawn]
        for liar in (True, False):
            spec = {"draw": "labelled", "fmt": fmt, "style": style,
                    "values": lab, "drawn": drawn if liar else lab,
                    "labels": YEARS[:5], "seed": seed,
                    "title": "Brannock Looms - orders"}
            total += save("labels_%d_%s" % (k, "liar" if liar else "honest"),
                          seed, ft, [one_chart_page(spec)])

    # negative values (honest)
    for k, horiz in enumerate((False, True, False)):
        seed += 1
        rng = rng_of(seed)
        vals = [round(rng.uniform(-40, 60)) for _ in range(7)]
        vals[0] = vals[0] or 5
        spec = {"draw": "negative", "values": vals, "horizontal": horiz,
                "labels": (ROUTES + ["Vesle"])[:7] if horiz else YEARS[:7],
                "style": ["gridlines"] if k == 2 else [], "seed": seed,
                "title": "Thistlewick Rail - net margin"}
        total += save("negative_%d" % k, seed, 42 if k != 1 else 3,
                      [one_chart_page(spec)])

    # bands between two series
    for k in range(2):
        seed += 1
        rng = rng_of(seed)
        vals = make_values(rng, 8, 300, 900, 0)
        spec = {"draw": "band", "values": vals, "labels": YEARS, "style": [],
                "seed": seed, "title": "Marrowgate Water - daily range"}
        total += save("band_%d" % k, seed, 42, [one_chart_page(spec)])

    # unfilled lines and scatter on truncated axes (honest)
    for k, (style, fmt, trunc) in enumerate((
            ([], "plain", "severe"), (["markers", "gridlines"], "usd", "mild"),
            ([], "percent", "severe"), (["scatter"], "plain", "severe"),
            (["scatter", "gridlines"], "thousands", "mild"))):
        seed += 1
        rng = rng_of(seed)
        lo, hi, dec = RANGES[fmt]
        n = 30 if "scatter" in style else 8
        vals = make_values(rng, n, lo, hi, dec)
        spec = {"draw": "line", "fmt": fmt, "style": style, "values": vals,
                "labels": YEARS[:n], "trunc": trunc, "seed": seed,
                "title": "Fjordhaven Ferries - punctuality"}
        total += save("line_%d" % k, seed, 3 if k % 2 else 42,
                      [one_chart_page(spec)])

    seed += 1
    total += save("multi_2x2_a", seed, 42, [grid_page(seed, 0)])
    seed += 1
    total += save("multi_2x2_b", seed, 3, [grid_page(seed, 1)])
    seed += 1
    total += save("report_pages", seed, 42, report_pages(seed))
    seed += 1
    total += save("text_only", seed, 42, [text_page(seed)])
    seed += 1
    total += save("table_page", seed, 3, [table_page(seed)])
    seed += 1
    total += save("raster_chart", seed, 42, [raster_page(seed)])
    seed += 1
    total += save("raster_report", seed, 3, [raster_page(seed, True)])

    # value axes on the other side, upside down, or paired with a second axis
    for k, (extra, trunc) in enumerate((
            (["inverted-axis"], "none"), (["inverted-axis"], "severe"),
            (["right-axis"], "none"), (["right-axis"], "mild"),
            (["twin-axis"], "none"), (["twin-axis"], "severe"))):
        seed = 9100 + k  # own seeds: the cases above keep theirs
        rng = rng_of(seed)
        lo, hi, dec = RANGES["plain"]
        spec = {"draw": "column", "fmt": "plain", "style": extra,
                "values": make_values(rng, 6, lo, hi, dec), "labels": YEARS[:6],
                "trunc": trunc, "seed": seed,
                "title": "Fjordhaven Ferries - sailings"}
        total += save("axes_%s_%s" % (extra[0].split("-")[0], trunc), seed,
                      3 if k % 2 else 42, [one_chart_page(spec)])

    print("matplotlib: %d figures" % total)


def grid_page(seed, variant):
    """2x2 subplots on one page, one truth entry per axes."""
    def build():
        rng = rng_of(seed)
        fig = new_fig(8.27, 6.5)
        axs = fig.subplots(2, 2)
        fig.subplots_adjust(left=0.14 if variant else 0.09, right=0.97, bottom=0.08, top=0.93,
                            wspace=0.28, hspace=0.35)
        plans = [("column", "none"), ("column", "severe"),
                 ("line", "severe"), ("area", "mild")]
        if variant:
            plans = [("bar", "mild"), ("area", "none"),
                     ("column", "mild"), ("negative", "none")]
        out = []
        for ax, (draw, trunc) in zip(axs.flat, plans):
            vals = make_values(rng, 6, 300, 900, 0)
            if draw == "negative":
                vals = [round(rng.uniform(-30, 50)) for _ in range(6)]
            spec = {"draw": draw, "fmt": "plain", "style": [], "values": vals,
                    "labels": YEARS[:6] if draw != "bar" else ROUTES,
                    "trunc": trunc, "seed": seed,
                    "title": "%s (%s)" % (draw, trunc)}
            d = DRAWERS[draw](fig, ax, spec)
            d["style"].append("multi-chart-page")
            out.append((ax, d))
        for ax, d in out:
            d["bbox"] = box_of(fig, ax)
        return fig, [d for _, d in out]
    return build


def report_pages(seed):
    """A4 report: prose page, then chart pages with text around them."""
    rng = rng_of(seed)

    def prose():
        fig = new_fig(8.27, 11.69)
        lines = ["Fjordhaven Ferries - Annual Review (invented data)", "",
                 "Passenger numbers rose on every route this year.",
                 "Crossings per day: 42; average load factor 71%.",
                 "Fleet: 9 vessels, 2 on order for 2025."]
        texts = [fig.text(0.1, 0.9 - 0.03 * i, s, fontsize=12 if i else 16)
                 for i, s in enumerate(lines) if s]
        fig.canvas.draw()
        return fig, [text_truth(fig, texts)]

    def chart(draw, trunc, vals):
        def build():
            fig = new_fig(8.27, 11.69)
            fig.text(0.1, 0.92, "Section %s: %s" % (draw, trunc), fontsize=14)
            fig.text(0.1, 0.35, "Figures are invented for testing.",
                     fontsize=10)
            ax = fig.add_axes((0.15, 0.45, 0.7, 0.4))
            spec = {"draw": draw, "fmt": "thousands", "style": [],
                    "values": vals, "labels": YEARS[:len(vals)],
                    "trunc": trunc, "seed": seed,
                    "title": "Passengers by year"}
            d = DRAWERS[draw](fig, ax, spec)
            d["bbox"] = box_of(fig, ax)
            return fig, [d]
        return build
    v1 = make_values(rng, 7, 12000, 48000, 0)
    v2 = make_values(rng, 7, 12000, 48000, 0)
    return [prose, chart("column", "severe", v1), chart("column", "none", v1),
            chart("area", "severe", v2)]


def text_truth(fig, texts):
    fig.canvas.draw()
    # The pdf canvas has no public renderer getter; text metrics match.
    r = fig._get_renderer()
    es = [t.get_window_extent(r) for t in texts]
    h = fig.get_figheight() * 72.0
    s = 72.0 / fig.dpi
    x0 = min(e.x0 for e in es) * s
    x1 = max(e.x1 for e in es) * s
    y0 = h - max(e.y1 for e in es) * s
    y1 = h - min(e.y0 for e in es) * s
    return {"kind": "text", "misleading": False, "rule": None,
            "bbox": [round(x0, 2), round(y0, 2), round(x1, 2), round(y1, 2)],
            "style": []}


def text_page(seed):
    def build():
        fig = new_fig(8.27, 11.69)
        rng = rng_of(seed)
        texts = [fig.text(0.1, 0.9, "Kestrel Orchards - Harvest Notes",
                          fontsize=16)]
        for i in range(12):
            texts.append(fig.text(
                0.1, 0.85 - 0.03 * i,
                "Block %d yielded %d crates, up %d%% on last season."
                % (i + 1, rng.randint(200, 900), rng.randint(2, 40)),
                fontsize=11))
        return fig, [text_truth(fig, texts)]
    return build


def table_page(seed):
    def build():
        rng = rng_of(seed)
        fig = new_fig(8.27, 5.0)
        ax = fig.add_axes((0.1, 0.15, 0.8, 0.7))
        rows = [["Route", "2021", "2022", "2023"]] + [
            [r] + ["{:,}".format(rng.randint(1000, 90000)) for _ in range(3)]
            for r in ROUTES]
        nr, nc = len(rows), 4
        ax.set_xlim(0, nc)
        ax.set_ylim(nr, 0)
        for i in range(nr + 1):
            ax.plot([0, nc], [i, i], color="black", linewidth=0.8)
        for j in range(nc + 1):
            ax.plot([j, j], [0, nr], color="black", linewidth=0.8)
        for i, row in enumerate(rows):
            for j, cell in enumerate(row):
                ax.text(j + 0.5, i + 0.5, cell, ha="center", va="center",
                        fontsize=10)
        ax.axis("off")
        d = {"kind": "table", "misleading": False, "rule": None,
             "bbox": box_of(fig, ax), "style": []}
        return fig, [d]
    return build


def raster_page(seed, report=False):
    """A truncated column chart rendered to PNG and placed as an image;
    report=True puts it on an A4 page between paragraphs of text."""
    def build():
        rng = rng_of(seed)
        vals = make_values(rng, 6, 300, 900, 0)
        src = plt.figure(figsize=(5, 3.5), dpi=100)
        ax = src.add_axes((0.13, 0.14, 0.82, 0.76))
        ax.bar(range(6), vals)
        ax.set_ylim(nice_floor(min(vals) * 0.9), nice_ceil(max(vals) * 1.1))
        buf = io.BytesIO()
        src.savefig(buf, format="png")
        plt.close(src)
        buf.seek(0)
        img = plt.imread(buf)
        if report:
            fig = new_fig(8.27, 11.69)
            fig.text(0.1, 0.92, "Fjordhaven Ferries - Route review",
                     fontsize=16)
            fig.text(0.1, 0.33, "Figure 3: boardings (image supplied by "
                     "the route office).", fontsize=10)
            iax = fig.add_axes((0.15, 0.4, 0.7, 0.45))
        else:
            fig = new_fig(6.4, 4.8)
            iax = fig.add_axes((0.1, 0.1, 0.8, 0.8))
        iax.imshow(img, aspect="auto", interpolation="nearest")
        iax.axis("off")
        d = {"kind": "raster", "misleading": False, "rule": None,
             "bbox": box_of(fig, iax), "style": [],
             "notes": "PNG of a truncated column chart embedded as an "
                      "image; expect a coverage note, no finding"}
        return fig, [d]
    return build


if __name__ == "__main__":
    main()
