"""make_matplotlib.py — writes a two-chart PDF with matplotlib and, beside it, the expected
bar rectangles and tick-label positions in page points (top-left origin, y down) as computed
by matplotlib itself. Usage: make_matplotlib.py OUT.pdf OUT.json FONTTYPE (3 or 42)."""
import json
import sys

import matplotlib

matplotlib.use("Agg")
import matplotlib.pyplot as plt  # noqa: E402

out_pdf, out_json, fonttype = sys.argv[1], sys.argv[2], int(sys.argv[3])
matplotlib.rcParams["pdf.fonttype"] = fonttype
matplotlib.rcParams["pdf.compression"] = 0

# Invented scenario: Harbourlight Tea Co., yearly revenue (k€) and stores per region.
years = ["2019", "2020", "2021", "2022", "2023"]
revenue = [420, 445, 460, 480, 510]
regions = ["North", "East", "West"]
stores = [62, 71, 58]

# dpi 72: one display unit is one PDF point, so window extents are in points.
fig = plt.figure(figsize=(6, 4), dpi=72)
fig.subplots_adjust(left=0.1, right=0.95, bottom=0.12, top=0.92, wspace=0.35)
ax1 = fig.add_subplot(1, 2, 1)
ax2 = fig.add_subplot(1, 2, 2)
bars1 = ax1.bar(range(len(years)), revenue, width=0.6, color="#3a6ea5")
ax1.set_xticks(range(len(years)), years)
ax1.set_ylim(400, 520)  # truncated value axis: every bar is cut at the bottom
ax1.set_yticks([400, 440, 480, 520])
bars2 = ax2.barh(range(len(regions)), stores, height=0.5, color="#c0504d")
ax2.set_yticks(range(len(regions)), regions)
ax2.set_xlim(50, 80)  # truncated again, horizontally
ax2.set_xticks([50, 60, 70, 80])

fig.canvas.draw()
renderer = fig.canvas.get_renderer()
height = fig.bbox.height  # points at dpi 72


def page_rect(bbox):
    """Display bbox (origin bottom-left) → page rect [x0, y0, x1, y1] with y down."""
    return [bbox.x0, height - bbox.y1, bbox.x1, height - bbox.y0]


def clipped(rect, clip):
    return [max(rect[0], clip[0]), max(rect[1], clip[1]), min(rect[2], clip[2]), min(rect[3], clip[3])]


expected_bars = []
for ax, bars in ((ax1, bars1), (ax2, bars2)):
    clip = page_rect(ax.bbox)  # patches are clipped to the axes box (Artist.set_clip_box)
    for patch in bars:
        full = page_rect(patch.get_window_extent(renderer))
        expected_bars.append({"full": full, "visible": clipped(full, clip)})

ticks = []
for ax in (ax1, ax2):
    for label in ax.get_xticklabels() + ax.get_yticklabels():
        if not label.get_visible() or not label.get_text():
            continue
        ext = page_rect(label.get_window_extent(renderer))
        ticks.append({"text": label.get_text(), "centre": [(ext[0] + ext[2]) / 2, (ext[1] + ext[3]) / 2]})

# Filled patches drawn besides the bars: the figure background and each axes background.
others = [p for p in [fig.patch, ax1.patch, ax2.patch] if p.get_visible() and p.get_facecolor()[3] > 0]

fig.savefig(out_pdf, dpi=72)
with open(out_json, "w") as f:
    json.dump({"page": [fig.bbox.width, height], "bars": expected_bars, "ticks": ticks,
               "other_fills": len(others), "font_size": ax1.get_yticklabels()[0].get_fontsize()}, f, indent=1)
