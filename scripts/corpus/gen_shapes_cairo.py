#!/usr/bin/python3
"""Generate the shape charts of the cairo corpus (corpus/cairo/shape_*) with cairo's PDF
surface (pycairo): bars in one-point perspective (all at one depth, or receding), cylinders
with elliptical caps, and pictograms scaled by value or by its square root, each with an
honest twin. Geometry is chosen in a world frame (x in slots, y in value units, z depth)
and projected; scripts/corpus/truth_shapes.py recomputes the expected measures from it."""

import math
import os
import random
import sys

import cairo

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import truth  # noqa: E402
import truth_shapes  # noqa: E402

ROOT = os.environ.get("PP_CORPUS_ROOT") or os.path.dirname(os.path.dirname(
    os.path.dirname(os.path.abspath(__file__))))
SEED_OFFSET = int(os.environ.get("PP_CORPUS_SEED_OFFSET", "0"))
OUT = os.path.join(ROOT, "corpus", "cairo")
PRODUCER = "cairo %s" % cairo.cairo_version_string()
PAGE_W, PAGE_H = 480.0, 340.0
BOX = (60.0, 40.0, 450.0, 290.0)  # plot area x0, y0, x1, y1 (page points, y down)
MILLS = ["Corvel", "Dunstan", "Ebbridge", "Farrow", "Glenmere", "Hollin"]
BLUE = ((0.17, 0.42, 0.56), (0.36, 0.61, 0.75), (0.11, 0.30, 0.44))


def rng_of(seed):
    return random.Random(seed + SEED_OFFSET)


def with_spread(rng, v, low, high):
    """One value near the bottom of the range, another near the top: misleading twins stay
    misleading whatever the seed (held-out corpora)."""
    i, k = rng.sample(range(len(v)), 2)
    v[i], v[k] = rng.randint(*low), rng.randint(*high)
    return v


class Page:
    def __init__(self, name, title):
        self.path = os.path.join(OUT, name + ".pdf")
        self.surface = cairo.PDFSurface(self.path, PAGE_W, PAGE_H)
        for key, val in ((cairo.PDFMetadata.TITLE, title),
                         (cairo.PDFMetadata.CREATOR, PRODUCER),
                         (cairo.PDFMetadata.CREATE_DATE, "2026-01-01T00:00:00Z")):
            self.surface.set_metadata(key, val)
        self.cr = cairo.Context(self.surface)
        self.cr.select_font_face("DejaVu Sans")
        self.text(title, PAGE_W / 2, 22, 11, 0.5)

    def text(self, s, x, y, size, ax=0.0, ay=0.5, rgb=(0, 0, 0)):
        cr = self.cr
        cr.set_font_size(size)
        ext = cr.text_extents(s)
        cr.set_source_rgb(*rgb)
        cr.move_to(x - ax * ext.x_advance, y + ay * size * 0.7)
        cr.show_text(s)

    def poly(self, pts, rgb):
        cr = self.cr
        cr.move_to(*pts[0])
        for p in pts[1:]:
            cr.line_to(*p)
        cr.close_path()
        cr.set_source_rgb(*rgb)
        cr.fill()

    def finish(self, seed, fig):
        self.surface.finish()
        fig["page"] = 1
        fig["style"] = fig.get("style", []) + ["pycairo"]
        truth.write_truth(self.path, PRODUCER, seed, 1, [fig], ROOT)
        lf = (fig.get("expected") or {}).get("lie_factor_growth")
        if fig["kind"] in truth_shapes.KINDS and lf is not None and \
                fig["misleading"] == truth_shapes.faithful(fig.get("expected")):
            raise SystemExit("%s: misleading=%s but lie factor %.3f" %
                             (self.path, fig["misleading"], lf))


def value_axis(pg, top, to_page_y, step):
    """Tick labels and gridlines of a value axis at the front plane."""
    cr = pg.cr
    t = 0
    while t <= top + 1e-9:
        y = to_page_y(t)
        cr.set_source_rgb(0.75, 0.75, 0.75)
        cr.set_line_width(0.6)
        cr.move_to(BOX[0], y)
        cr.line_to(BOX[2], y)
        cr.stroke()
        pg.text("%g" % t, BOX[0] - 6, y, 8, 1.0)
        t += step


def perspective_bars(name, seed, deep, receding=False, spacing=1.0):
    """Bars as boxes in one-point perspective, eye above the chart so caps show. All at
    depth 0 with a front-plane value axis, or receding (bar i at depth i·dz) with data
    labels and no axis; spacing under 1 slot packs receding bars so that nearer ones cover
    parts of those behind."""
    rng = rng_of(seed)
    n = 6
    v = with_spread(rng, [rng.randint(20, 95) for _ in range(n)], (15, 22), (88, 95))
    if receding:
        v = [rng.randint(55, 65)] * 2 + [rng.randint(30, 90) for _ in range(n - 2)]
    w = 0.55
    depth = 0.9 if deep else 0.02
    f = 6.0
    top = 100.0
    eye = (n / 2.0, 160.0)  # world: x in slots, y in value units
    xs = [spacing * i + 0.2 for i in range(n)]
    zs = [1.1 * i if receding else 0.0 for i in range(n)]
    sx = (BOX[2] - BOX[0]) / n
    sy = (BOX[3] - BOX[1]) / (top * 1.15)

    def page(p):
        return (BOX[0] + sx * p[0], BOX[3] - sy * p[1])

    def P(x, y, z):
        return page(truth_shapes.perspective_point((x, y, z), eye, f))

    pg = Page(name, "Flour milled per site (kt)")
    if not receding:
        value_axis(pg, top, lambda t: page((0, t))[1], 20)
    # far bars first, so nearer faces paint over them
    for i in sorted(range(n), key=lambda k: -zs[k]):
        x0, x1, z0, z1, h = xs[i], xs[i] + w, zs[i], zs[i] + depth, v[i]
        if h < eye[1]:
            pg.poly([P(x0, h, z0), P(x1, h, z0), P(x1, h, z1), P(x0, h, z1)], BLUE[1])
        xsd = x1 if x1 < eye[0] else (x0 if x0 > eye[0] else None)
        if xsd is not None:
            pg.poly([P(xsd, 0, z0), P(xsd, h, z0), P(xsd, h, z1), P(xsd, 0, z1)], BLUE[2])
        pg.poly([P(x0, 0, z0), P(x1, 0, z0), P(x1, h, z0), P(x0, h, z0)], BLUE[0])
        lx, ly = P((x0 + x1) / 2, 0, z0)
        pg.text(MILLS[i], lx, ly + 10, 8, 0.5)
        if receding:
            tx, ty = P((x0 + x1) / 2, h, z0)
            pg.text("%d" % h, tx, ty - 14, 8, 0.5)
    fig = {"kind": "bar-3d", "misleading": deep or receding,
           "rule": "bars-3d-ink" if (deep or receding) else None, "values": v,
           "labels": MILLS[:n], "axis": None if receding else
           {"min": 0.0, "max": top * 1.15, "scale": "linear", "orientation": "y"},
           "baseline": 0.0, "data_labels": list(v) if receding else None,
           "solid": {"projection": "perspective", "eye": list(eye), "focal": f,
                     "x": xs, "z": zs, "front_width": w, "depth": depth, "base": 0.0},
           "bbox": list(BOX),
           "style": ["perspective"] + (["receding", "data-labels-only"] if receding else
                                       ["gridlines"]) + (["overlapping"] if spacing < 1.0 else [])}
    if spacing < 1.0:  # nearer bars cover farther ones: the truth takes that off
        fig["solid"]["painted"] = True
    pg.finish(seed, fig)


def oblique_bars(name, seed, deep, wall=False):
    """Bars with oblique faces painted left to right, each as front, side and cap, so a
    bar's side and cap go under the next bar where the depth reaches past the gap (deep).
    Value axis on the front plane (gridlines behind), or on a back wall (wall=True) three
    times as deep as the caps: gridlines at the wall's height, joined to the front plane by
    slanted gridlines on the floor's side, tick labels at the wall's gridlines; a bar's
    value is where its top meets the wall's plane."""
    rng = rng_of(seed)
    n = 6
    v = with_spread(rng, [rng.randint(20, 95) for _ in range(n)], (15, 22), (88, 95)) \
        if deep else [rng.randint(70, 95) for _ in range(n)]
    w = 0.6
    # depths off the integers: a cap's back edge never lines up with the next bar's top
    # (integer values), which would join the two bars' faces by a shared edge
    dx, dy = ((0.3, 6.0) if wall else (0.7, 9.5)) if deep else (0.05, 0.35)
    wx, wy = (3 * dx, 3 * dy) if wall else (0.0, 0.0)  # the wall's offset from the front
    top = 100.0
    xs = [0.3 + i for i in range(n)]
    sx = (BOX[2] - BOX[0]) / (n + 0.3 + max(wx, dx))
    sy = (BOX[3] - BOX[1]) / (top + wy + dy + 5)

    def page(x, y):
        return (BOX[0] + sx * x, BOX[3] - sy * y)

    pg = Page(name, "Cider pressed per orchard (t)")
    cr = pg.cr
    if wall:
        for t in range(0, int(top) + 1, 20):
            cr.set_source_rgb(0.75, 0.75, 0.75)
            cr.set_line_width(0.6)
            cr.move_to(*page(0, t))  # on the floor's side, front to back
            cr.line_to(*page(wx, t + wy))
            cr.stroke()
            cr.move_to(*page(wx, t + wy))  # across the wall
            cr.line_to(*page(n + 0.3 + wx, t + wy))
            cr.stroke()
            pg.text("%d" % t, BOX[0] - 6, page(0, t + wy)[1], 8, 1.0)
    else:
        value_axis(pg, top, lambda t: page(0, t)[1], 20)
    for i in range(n):
        x0, x1, h = xs[i], xs[i] + w, v[i]
        pg.poly([page(x0, 0), page(x1, 0), page(x1, h), page(x0, h)], BLUE[0])
        pg.poly([page(x1, 0), page(x1 + dx, dy), page(x1 + dx, h + dy), page(x1, h)], BLUE[2])
        pg.poly([page(x0, h), page(x1, h), page(x1 + dx, h + dy), page(x0 + dx, h + dy)],
                BLUE[1])
        lx, ly = page((x0 + x1) / 2, 0)
        pg.text(MILLS[i], lx, ly + 10, 8, 0.5)
    fig = {"kind": "bar-3d", "misleading": deep, "rule": "bars-3d-ink" if deep else None,
           "values": v, "labels": MILLS[:n],
           "axis": {"min": 0.0, "max": top, "scale": "linear", "orientation": "y"},
           "baseline": 0.0,
           "solid": {"projection": "oblique", "front_width": w, "depth": [dx, dy],
                     "base": 0.0, "x": xs},
           "bbox": list(BOX),
           "style": ["oblique", "gridlines"] + (["wall"] if wall else []) +
           (["overlapping"] if dx > 1 - w else [])}
    pg.finish(seed, fig)


def cylinders(name, seed, deep):
    """Cylinders: a body w×h, the lower half of the base ellipse and a whole top ellipse
    of vertical semi-axis e (both constant ink)."""
    rng = rng_of(seed)
    n = 5
    v = with_spread(rng, [rng.randint(15, 90) for _ in range(n)], (12, 18), (85, 92))
    top = 100.0
    sx = (BOX[2] - BOX[0]) / n
    sy = (BOX[3] - BOX[1]) / (top * 1.15)
    w = 0.6
    e = 7.0 if deep else 0.15  # value units

    def page(x, y):
        return (BOX[0] + sx * x, BOX[3] - sy * y)

    pg = Page(name, "Grain stored per silo (kt)")
    value_axis(pg, top, lambda t: page(0, t)[1], 20)
    cr = pg.cr
    for i, h in enumerate(v):
        cx = i + 0.5
        # body with the lower half-ellipse: one path
        cr.save()
        x0, yb = page(cx - w / 2, 0)
        x1, yt = page(cx + w / 2, h)
        rx, ry = sx * w / 2, sy * e
        cr.move_to(x0, yt)
        cr.line_to(x0, yb)
        cr.save()
        cr.translate((x0 + x1) / 2, yb)
        cr.scale(rx, ry)
        cr.arc_negative(0, 0, 1, math.pi, 0)
        cr.restore()
        cr.line_to(x1, yt)
        cr.close_path()
        cr.set_source_rgb(*BLUE[0])
        cr.fill()
        cr.translate((x0 + x1) / 2, yt)
        cr.scale(rx, ry)
        cr.arc(0, 0, 1, 0, 2 * math.pi)
        cr.close_path()
        cr.set_source_rgb(*BLUE[1])
        cr.fill()
        cr.restore()
        pg.text(MILLS[i], (x0 + x1) / 2, yb + ry + 10, 8, 0.5)
    fig = {"kind": "bar-3d", "misleading": deep, "rule": "bars-3d-ink" if deep else None,
           "values": v, "labels": MILLS[:n],
           "axis": {"min": 0.0, "max": top * 1.15, "scale": "linear", "orientation": "y"},
           "baseline": 0.0,
           "solid": {"projection": "cylinder", "front_width": w, "ellipse": e, "base": 0.0},
           "bbox": list(BOX), "style": ["cylinder", "gridlines"]}
    pg.finish(seed, fig)


def icon(cr, x, y, s, rgb):
    """A sack of flour as one path: bottom-left corner (x, y), height s·30, width s·20."""
    u = s
    cr.move_to(x, y)
    cr.line_to(x + 20 * u, y)
    cr.curve_to(x + 22 * u, y - 12 * u, x + 19 * u, y - 22 * u, x + 14 * u, y - 25 * u)
    cr.line_to(x + 16 * u, y - 30 * u)
    cr.line_to(x + 4 * u, y - 30 * u)
    cr.line_to(x + 6 * u, y - 25 * u)
    cr.curve_to(x + 1 * u, y - 22 * u, x - 2 * u, y - 12 * u, x, y)
    cr.close_path()
    cr.set_source_rgb(*rgb)
    cr.fill()


def pictograms(name, seed, by):
    """One sack per mill scaled in width and height by value (by='side': area ∝ v²,
    misleading) or by its square root (by='area': honest), values printed below."""
    rng = rng_of(seed)
    n = 5
    v = with_spread(rng, [rng.randint(10, 80) for _ in range(n)], (8, 14), (70, 80))
    pg = Page(name, "Sacks shipped per mill (thousands)")
    sizes = []
    box = [BOX[2], BOX[3], BOX[0], BOX[1]]  # no frame: the figure is where the icons are
    for i, x in enumerate(v):
        s = 0.035 * x if by == "side" else 0.3 * math.sqrt(x)
        sizes.append(s)
        cx = BOX[0] + (i + 0.5) * (BOX[2] - BOX[0]) / n
        icon(pg.cr, cx - 10 * s, BOX[3] - 20, s, BLUE[0])
        box = [min(box[0], cx - 10 * s), min(box[1], BOX[3] - 20 - 30 * s),
               max(box[2], cx + 10 * s), max(box[3], BOX[3] - 20)]
        pg.text("%d" % x, cx, BOX[3] - 8, 9, 0.5)
        pg.text(MILLS[i], cx, BOX[3] + 6, 8, 0.5)
    fig = {"kind": "bubble", "misleading": by == "side",
           "rule": "symbols-not-by-area" if by == "side" else None, "values": v,
           "labels": MILLS[:n], "axis": None, "baseline": None, "data_labels": list(v),
           "symbols": {"measure": "side", "sizes": sizes, "shape": "icon"},
           "bbox": [round(c, 2) for c in box], "style": ["pictogram", "by-" + by]}
    pg.finish(seed, fig)


def repeated_icons(name, seed):
    """Honest lookalike: a row of equal sacks per mill, one sack per 10 thousand."""
    rng = rng_of(seed)
    v = [rng.randint(2, 9) * 10 for _ in range(4)]
    pg = Page(name, "Sacks shipped per mill (one sack = 10 thousand)")
    for i, x in enumerate(v):
        y = BOX[1] + 30 + i * 55
        pg.text(MILLS[i], BOX[0] - 4, y - 12, 9, 1.0)
        for k in range(x // 10):
            icon(pg.cr, BOX[0] + 10 + k * 26, y, 0.7, BLUE[0])
    fig = {"kind": "other", "misleading": False, "rule": None, "values": [], "labels": [],
           "axis": None, "baseline": None, "bbox": list(BOX), "style": ["repeated-icons"]}
    pg.finish(seed, fig)


def main():
    os.makedirs(OUT, exist_ok=True)
    perspective_bars("shape_persp_deep", 941, True)
    perspective_bars("shape_persp_shallow", 941, False)
    perspective_bars("shape_persp_receding", 942, True, receding=True)
    perspective_bars("shape_persp_receding_overlap", 948, True, receding=True, spacing=0.5)
    oblique_bars("shape_oblique_overlap", 946, True)
    oblique_bars("shape_oblique_overlap_shallow", 946, False)
    oblique_bars("shape_oblique_wall_deep", 947, True, wall=True)
    cylinders("shape_cylinders", 943, True)
    cylinders("shape_cylinders_flat", 943, False)
    pictograms("shape_icons_side", 944, "side")
    pictograms("shape_icons_area", 944, "area")
    repeated_icons("shape_icons_repeated", 945)
    print("cairo shapes: 12 charts")


if __name__ == "__main__":
    main()
