"""Past-performance bar charts of an invented fund, drawn by matplotlib at test time: one that
meets every check of the fund-past-performance profile and twins that each break exactly one.

usage: make_fund.py OUTDIR     writes <case>.pdf and cases.json (case -> the expected rule id)

The fund ("Aurelian Meadow Balanced Fund"), its benchmark and their returns are invented. Each
PDF is one A4-ish page: a heading, the bar chart (fund and benchmark per year, each bar labelled
with its return), a footnote. What each twin breaks is written beside it; the requirement is
Commission Regulation (EU) No 583/2010, Annex III (points quoted in docs/rules/fund-*.md)."""
import json
import os
import sys

import matplotlib

matplotlib.use("pdf")
import matplotlib.pyplot as plt  # noqa: E402
from matplotlib.ticker import FuncFormatter  # noqa: E402

YEARS = list(range(2021, 2031))  # ten calendar years, as Article 15 asks (from memory)
FUND = [6.4, -3.2, 11.8, 4.1, -7.5, 9.3, 2.6, 13.1, -1.9, 5.7]
BENCH = [5.9, -2.1, 10.4, 4.8, -6.2, 8.1, 3.3, 11.6, -0.8, 6.0]


def pct(v, decimals=1):
    return f"{v:.{decimals}f}%"


def draw(path, fund=FUND, bench=BENCH, labels=None, decimals=1, log=False, floor=None,
         ylim=None, drop_label=None, years=YEARS, slots=None, apart=0.0):
    """slots: the x slot of each year (default 0, 1, 2, ...); years: the printed years;
    apart: a gap between the fund and the benchmark bar of a year, in slots."""
    fig = plt.figure(figsize=(9.5, 5.2))
    fig.text(0.08, 0.95, "Past performance", fontsize=14, weight="bold")
    fig.text(0.08, 0.91, "Aurelian Meadow Balanced Fund, class A (invented)", fontsize=8)
    ax = fig.add_axes([0.09, 0.2, 0.86, 0.65])
    xs = slots if slots is not None else list(range(len(years)))
    w = 0.38 - apart / 2
    base = floor if floor is not None else 0
    hf = [v - base for v in fund]
    hb = [v - base for v in bench]
    off = w / 2 + apart / 2
    bars_f = ax.bar([x - off for x in xs], hf, w, bottom=base, color="#1f4e79", label="Fund")
    bars_b = ax.bar([x + off for x in xs], hb, w, bottom=base, color="#9dc3e6",
                    label="Benchmark")
    if log:
        ax.set_yscale("log")
        ax.yaxis.set_major_formatter(FuncFormatter(lambda v, _: f"{v:g}%"))
        ax.yaxis.set_minor_formatter(FuncFormatter(lambda v, _: ""))
    else:
        ax.yaxis.set_major_formatter(FuncFormatter(lambda v, _: f"{v:g}%"))
    if ylim:
        ax.set_ylim(*ylim)
    lo, hi = ax.get_ylim()
    printed = labels if labels is not None else fund
    for series, bars, vals in ((0, bars_f, printed), (1, bars_b, bench)):
        for i, (b, v) in enumerate(zip(bars, vals)):
            if series == 0 and drop_label == i:
                continue
            top = fund[i] if series == 0 else bench[i]
            y = min(max(top, lo), hi)
            off = 3 if top >= 0 else -3
            ax.annotate(pct(v, decimals), (b.get_x() + b.get_width() / 2, y),
                        xytext=(0, off), textcoords="offset points", ha="center",
                        va="bottom" if top >= 0 else "top", fontsize=6)
    # Every slot gets its year; an empty slot the year after its left neighbour's.
    ticks = list(range(min(xs), max(xs) + 1))
    names = {x: y for x, y in zip(xs, years)}
    for t in ticks:
        if t not in names:
            names[t] = names[t - 1] + 1
    ax.set_xticks(ticks)
    ax.set_xticklabels([str(names[t]) for t in ticks], fontsize=7)
    ax.tick_params(axis="y", labelsize=7)
    if not log:
        ax.axhline(0 if floor is None else floor, color="black", linewidth=0.8)
    ax.legend(loc="upper left", fontsize=7, frameon=False)
    fig.text(0.08, 0.06, "Past performance is not a reliable guide to future performance. "
             "Invented figures for a test.", fontsize=6)
    fig.savefig(path)
    plt.close(fig)


def main():
    out = sys.argv[1]
    os.makedirs(out, exist_ok=True)
    cases = {}
    draw(os.path.join(out, "fund-compliant.pdf"))
    cases["fund-compliant"] = None
    # Annex III point 1: a log axis (all returns positive, so a log scale can be drawn at all).
    pos_f = [6.4, 3.2, 11.8, 4.1, 7.5, 9.3, 2.6, 13.1, 1.9, 5.7]
    pos_b = [5.9, 2.1, 10.4, 4.8, 6.2, 8.1, 3.3, 11.6, 1.8, 6.0]
    draw(os.path.join(out, "fund-log.pdf"), fund=pos_f, bench=pos_b, log=True, ylim=(1, 100))
    cases["fund-log"] = "fund-log-axis"
    # Annex III point 3: the bars rise from -10%, not from the 0% level.
    draw(os.path.join(out, "fund-floor.pdf"), floor=-10, ylim=(-10, 16))
    cases["fund-floor"] = "fund-axis-off-zero"
    # Annex III point 4: the 2025 fund bar has no label.
    draw(os.path.join(out, "fund-nolabel.pdf"), drop_label=4)
    cases["fund-nolabel"] = "fund-label-missing"
    # Annex III point 5: two decimals (the bars are drawn at the two-decimal values).
    f2 = [6.43, -3.21, 11.78, 4.12, -7.46, 9.33, 2.61, 13.08, -1.94, 5.72]
    b2 = [5.91, -2.13, 10.37, 4.84, -6.18, 8.06, 3.29, 11.63, -0.82, 6.04]
    draw(os.path.join(out, "fund-decimals.pdf"), fund=f2, bench=b2, decimals=2)
    cases["fund-decimals"] = "fund-label-decimals"
    # Annex III point 4: the 2028 label says 18.1% where the bar is drawn at 13.1%.
    wrong = list(FUND)
    wrong[7] = 18.1
    draw(os.path.join(out, "fund-wronglabel.pdf"), labels=wrong)
    cases["fund-wronglabel"] = "fund-label-vs-bar"
    # Annex III point 2: the axis stops at -5%, so the -7.5% year (and its benchmark -6.2%)
    # are cut by the plot frame; their labels still say the loss.
    draw(os.path.join(out, "fund-clipped.pdf"), ylim=(-5, 16))
    cases["fund-clipped"] = "fund-bar-clipped"
    # Annex III point 2: an axis from -60% to 60% squeezes returns of -7.5% to 13.1% into a
    # sixth of the plot.
    draw(os.path.join(out, "fund-squeezed.pdf"), ylim=(-60, 60))
    cases["fund-squeezed"] = "fund-scale-compressed"
    # Article 15 (from memory): a year without data stays on the axis as a blank slot. 2024
    # is blank here: compliant.
    keep = [i for i, y in enumerate(YEARS) if y != 2024]
    sub = dict(fund=[FUND[i] for i in keep], bench=[BENCH[i] for i in keep],
               years=[YEARS[i] for i in keep])
    draw(os.path.join(out, "fund-gap-shown.pdf"), slots=keep, **sub)
    cases["fund-gap-shown"] = None
    # The same data with 2024 dropped from the axis: 2023 and 2025 read as neighbours.
    draw(os.path.join(out, "fund-gap-dropped.pdf"), slots=list(range(len(keep))), **sub)
    cases["fund-gap-dropped"] = "fund-years"
    # The fund and benchmark bars of each year stand apart, the year centred under the gap
    # between them: compliant, and with 2024 dropped the years are still read.
    draw(os.path.join(out, "fund-apart.pdf"), apart=0.1)
    cases["fund-apart"] = None
    draw(os.path.join(out, "fund-apart-gap-dropped.pdf"), slots=list(range(len(keep))),
         apart=0.1, **sub)
    cases["fund-apart-gap-dropped"] = "fund-years"
    with open(os.path.join(out, "cases.json"), "w") as f:
        json.dump(cases, f, indent=1)


if __name__ == "__main__":
    main()
