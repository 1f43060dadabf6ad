#!/usr/bin/python3
"""Circle charts drawn straight with cairo (pycairo, PDF surface) for the corpus
(corpus/cairo/cc_*.pdf): exploded pies with leader-line labels, slices drawn in several
pieces and as subpaths of one path, a tilted pie with a rim, a perspective pie, radial
bars (equal ring width: misleading; equal area per unit: honest) and a cycle diagram made
of arcs (no chart). Angles: cairo's y-down frame, converted for the truth (y up)."""

import math
import os
import random
import sys

import cairo

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import truth  # noqa: E402
import truth_circles  # noqa: E402

ROOT = os.environ.get("PP_CORPUS_ROOT") or os.path.dirname(os.path.dirname(
    os.path.dirname(os.path.abspath(__file__))))
OUT = os.path.join(ROOT, "corpus", "cairo")
PRODUCER = "cairo " + cairo.cairo_version_string()
SEED = 4307
W, H = 420.0, 300.0
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


NAMES = ["Nordvik", "Eastmarch", "Solbakken", "Harrowgate", "Lowfield"]
RGB = [(0.23, 0.43, 0.65), (0.88, 0.54, 0.17), (0.35, 0.62, 0.29), (0.77, 0.27, 0.24),
       (0.54, 0.42, 0.71)]


class Doc:
    def __init__(self, name):
        self.path = os.path.join(OUT, name + ".pdf")
        self.surface = cairo.PDFSurface(self.path, W, H)
        self.surface.set_metadata(cairo.PDFMetadata.CREATOR, PRODUCER)
        self.surface.set_metadata(cairo.PDFMetadata.CREATE_DATE, "2031-03-01T00:00:00Z")
        self.cr = cairo.Context(self.surface)
        self.cr.select_font_face("DejaVu Sans")

    def text(self, s, x, y, size=9, colour=(0, 0, 0), anchor=0.5):
        cr = self.cr
        cr.set_font_size(size)
        cr.set_source_rgb(*colour)
        e = cr.text_extents(s)
        cr.move_to(x - anchor * e.x_advance, y + e.height / 2)
        cr.show_text(s)

    def finish(self, figures):
        self.surface.finish()
        for f in figures:
            f.setdefault("page", 1)
            f.setdefault("axis", None)
            f.setdefault("baseline", None)
            f.setdefault("style", [])
            f["misleading"] = f.get("rule") is not None
        truth.write_truth(self.path, PRODUCER, SEED + OFFSET, 1, figures, ROOT)


def pct(values):
    return [round(100.0 * v / sum(values)) for v in values]


def pie(name, values, drawn=None, rule=None, explode=(), pieces=False, one_path=False):
    """Clockwise from 12 o'clock. explode: indices pulled out by 14 pt; pieces: slices drawn
    as two paths each with white strokes between; one_path: every slice of one colour in a
    single path of subpaths (slices alternate two colours)."""
    drawn = drawn or values
    d = Doc(name)
    cr = d.cr
    cx, cy, r = 205, 160, 90
    printed = pct(values)
    a = -math.pi / 2
    spans = []
    for v in drawn:
        sw = 2 * math.pi * v / sum(drawn)
        spans.append((a, a + sw))
        a += sw
    groups = {}
    for i, (a0, a1) in enumerate(spans):
        off = 14 if i in explode else 0
        mid = (a0 + a1) / 2
        ox, oy = cx + off * math.cos(mid), cy + off * math.sin(mid)
        colour = RGB[i % 2] if one_path else RGB[i]
        cuts = [a0, a0 + 0.4 * (a1 - a0), a1] if pieces else [a0, a1]
        for j in range(len(cuts) - 1):
            groups.setdefault(len(groups) if not one_path else i % 2, (colour, []))[1].append(
                (ox, oy, cuts[j], cuts[j + 1]))
        # Label outside with a leader line.
        lx, ly = ox + (r + 8) * math.cos(mid), oy + (r + 8) * math.sin(mid)
        tx, ty = ox + (r + 26) * math.cos(mid), oy + (r + 26) * math.sin(mid)
        cr.set_source_rgb(0.3, 0.3, 0.3)
        cr.set_line_width(0.6)
        cr.move_to(ox + (r - 4) * math.cos(mid), oy + (r - 4) * math.sin(mid))
        cr.line_to(lx, ly)
        cr.line_to(tx, ty)
        cr.stroke()
        side = 0 if math.cos(mid) >= 0 else 1
        d.text("%s %d%%" % (NAMES[i], printed[i]), tx + (4 if side == 0 else -4), ty,
               anchor=side)
    for colour, parts in groups.values():
        cr.new_path()
        for ox, oy, a0, a1 in parts:
            cr.move_to(ox, oy)
            cr.arc(ox, oy, r, a0, a1)
            cr.close_path()
        cr.set_source_rgb(*colour)
        cr.fill_preserve() if pieces else cr.fill()
        if pieces:
            cr.set_source_rgb(1, 1, 1)
            cr.set_line_width(1.5)
            cr.stroke()
    d.text("Members by region, 2031", cx, 22, 11)
    ext = r + 14 * bool(explode)
    bb = [cx - ext, cy - ext, cx + ext, cy + ext]
    style = (["exploded"] if explode else []) + (["pieces", "white-strokes"] if pieces else
                                                 []) + (["subpaths"] if one_path else [])
    d.finish([{"bbox": bb, "kind": "pie", "rule": rule, "values": values,
               "labels": NAMES[:len(values)], "data_labels": printed,
               "style": style + ["leader-lines"],
               "circle": {"drawn_values": list(drawn), "printed": printed,
                          "printed_kind": "percent", "decimals": 0}}])


def tilted(name, values, ratio, depth, rule, persp=None, explode=()):
    """Parametric angles counter-clockwise (y up) from 30°. Orthographic: ellipse arcs by
    cairo_scale, rim of `depth` radii under the front half. Perspective: projected through
    truth_circles' pinhole, top faces only, as 180-point polylines per turn. explode: indices
    of slices pulled out by 0.12 radii along their middle, in the pie's plane (top face and
    rim move together; the offset changes no area)."""
    d = Doc(name)
    cr = d.cr
    cx0, cy0, r = 210, 140, 130
    start = math.radians(30)
    spans = truth_circles.slice_angles(values, start, 1)
    printed = pct(values)

    def centre(i):
        mid = (spans[i][0] + spans[i][1]) / 2
        e = 0.12 * r if i in explode else 0.0
        return cx0 + e * math.cos(mid), cy0 - e * ratio * math.sin(mid)

    for i, (t0, t1) in enumerate(spans):
        cx, cy = centre(i)
        if depth > 0 and persp:
            # Only the wall facing the camera: beyond it the band would fold over itself.
            for lo, hi in truth_circles._arc_overlap(t0, t1, *truth_circles.rim_range(persp)):
                cr.new_path()
                for k, (x, y) in enumerate(truth_circles.rim_polygon(lo, hi, persp, depth,
                                                                     180)):
                    (cr.line_to if k else cr.move_to)(cx + r * x, cy - r * y)
                cr.close_path()
                cr.set_source_rgb(*[0.7 * c for c in RGB[i]])
                cr.fill()
        elif depth > 0:
            for lo, hi in truth_circles._arc_overlap(t0, t1, math.pi, 2 * math.pi):
                cr.new_path()
                cr.save()
                cr.translate(cx, cy)
                cr.scale(r, r * ratio)
                cr.arc(0, 0, 1, -hi, -lo)  # y-up angles are negated in cairo's y-down frame
                cr.restore()
                cr.save()
                cr.translate(cx, cy + depth * r)
                cr.scale(r, r * ratio)
                cr.arc_negative(0, 0, 1, -lo, -hi)
                cr.restore()
                cr.close_path()
                cr.set_source_rgb(*[0.7 * c for c in RGB[i]])
                cr.fill()
    for i, (t0, t1) in enumerate(spans):
        cx, cy = centre(i)
        cr.new_path()
        if persp:
            cr.move_to(cx, cy)
            n = max(2, int(180 * (t1 - t0) / (2 * math.pi)))
            for j in range(n + 1):
                t = t0 + (t1 - t0) * j / n
                x, y = truth_circles._project(math.cos(t), math.sin(t), persp["tilt"],
                                              persp["distance"])
                cr.line_to(cx + r * x, cy - r * y)
            cr.close_path()
        else:
            cr.save()
            cr.translate(cx, cy)
            cr.scale(r, r * ratio)
            cr.move_to(0, 0)
            cr.arc_negative(0, 0, 1, -t0, -t1)
            cr.close_path()
            cr.restore()
        cr.set_source_rgb(*RGB[i])
        cr.fill()
    for i, (t0, t1) in enumerate(spans):
        cx, cy = centre(i)
        mid = (t0 + t1) / 2
        if persp:
            x, y = truth_circles._project(0.62 * math.cos(mid), 0.62 * math.sin(mid),
                                          persp["tilt"], persp["distance"])
        else:
            x, y = 0.62 * math.cos(mid), 0.62 * ratio * math.sin(mid)
        d.text("%d%%" % printed[i], cx + r * x, cy - r * y, 9, (1, 1, 1))
        if persp:
            x, y = truth_circles._project(1.15 * math.cos(mid), 1.15 * math.sin(mid),
                                          persp["tilt"], persp["distance"],
                                          -depth if math.sin(mid) < 0 else 0.0)
            d.text(NAMES[i], cx + r * x, cy - r * y, 8)
        else:
            d.text(NAMES[i], cx + 1.2 * r * math.cos(mid), cy - (1.25 * r * ratio + 6) *
                   math.sin(mid) + (depth * r if math.sin(mid) < 0 else 0), 8)
    cx, cy = cx0, cy0
    d.text("Ridership share by line, 2031", cx, 14, 11)
    if persp:
        pts = [truth_circles._project(math.cos(t / 90 * math.pi), math.sin(t / 90 * math.pi),
                                      persp["tilt"], persp["distance"], h)
               for t in range(180) for h in {0.0, -depth}]
        xs, ys = [cx + r * p[0] for p in pts], [cy - r * p[1] for p in pts]
        bb = [min(xs), min(ys), max(xs), max(ys)]
    else:
        e = 0.12 * r if explode else 0
        bb = [cx - r - e, cy - (r + e) * ratio, cx + r + e, cy + (r + e) * ratio + depth * r]
    circle = {"ratio": ratio if not persp else math.cos(persp["tilt"]), "depth": depth,
              "start": start, "direction": 1, "printed": printed, "printed_kind": "percent",
              "decimals": 0}
    if persp:
        circle["perspective"] = persp
    d.finish([{"bbox": [round(x, 2) for x in bb], "kind": "tilted-pie", "rule": rule,
               "values": values, "labels": NAMES[:len(values)], "data_labels": printed,
               "style": ["tilted", "names-outside"] + (["rim"] if depth else []) +
               (["exploded"] if explode else []) +
               (["perspective"] if persp else []), "circle": circle}])


def radial(name, values, full, equal_area, rule):
    """Rings clockwise from 12 o'clock, innermost first. Equal ring width (misleading) or
    widths chosen so every ring has the same area per unit of value (honest)."""
    d = Doc(name)
    cr = d.cr
    cx, cy = 210, 160
    rings, r_in, width, gap = [], 40.0, 16.0, 6.0
    target = (r_in + width) ** 2 - r_in ** 2
    for i, v in enumerate(values):
        r_out = math.sqrt(r_in * r_in + target) if equal_area else r_in + width
        rings.append([r_in, r_out])
        sweep = 2 * math.pi * v / full
        cr.new_path()
        cr.arc(cx, cy, r_out, -math.pi / 2, -math.pi / 2 + sweep)
        cr.arc_negative(cx, cy, r_in, -math.pi / 2 + sweep, -math.pi / 2)
        cr.close_path()
        cr.set_source_rgb(*RGB[i])
        cr.fill()
        d.text("%s %g" % (NAMES[i], v), cx - 6, cy - (r_in + r_out) / 2, 8, anchor=1)
        r_in = r_out + gap
    d.text("Share of trips on time, %% (full circle = %g)" % full, cx, 14, 11)
    ro = rings[-1][1]
    d.finish([{"bbox": [cx - ro, cy - ro, cx + ro, cy + ro], "kind": "radial-bar",
               "rule": rule, "values": values, "labels": NAMES[:len(values)],
               "data_labels": values, "style": ["equal-area"] if equal_area else [],
               "circle": {"rings": rings, "full_value": full, "start": math.pi / 2,
                          "direction": -1}}])


def diagram(name):
    """A cycle diagram: four boxes joined by curved arrows (arcs), no numbers."""
    d = Doc(name)
    cr = d.cr
    cx, cy, r = 210, 160, 90
    steps = ["Plan", "Build", "Operate", "Review"]
    for k, s in enumerate(steps):
        a = -math.pi / 2 + k * math.pi / 2
        cr.set_source_rgb(0.3, 0.45, 0.6)
        cr.set_line_width(3)
        cr.new_path()
        cr.arc(cx, cy, r, a + 0.3, a + math.pi / 2 - 0.3)
        cr.stroke()
        e = a + math.pi / 2 - 0.3
        hx, hy = cx + r * math.cos(e), cy + r * math.sin(e)
        cr.move_to(hx, hy)
        cr.rel_line_to(-8 * math.cos(e - 0.4) - 3, -8 * math.sin(e - 0.4))
        cr.rel_line_to(6, 6)
        cr.close_path()
        cr.fill()
        bx, by = cx + r * math.cos(a), cy + r * math.sin(a)
        cr.set_source_rgb(0.9, 0.93, 0.97)
        cr.arc(bx, by, 26, 0, 2 * math.pi)
        cr.fill()
        d.text(s, bx, by, 10)
    d.text("Asset management cycle", cx, 20, 11)
    d.finish([{"bbox": [cx - r - 26, cy - r - 26, cx + r + 26, cy + r + 26], "kind": "other",
               "rule": None, "values": [], "labels": [], "data_labels": None,
               "style": ["diagram"]}])


def main():
    os.makedirs(OUT, exist_ok=True)
    v = vary([31.0, 24.0, 20.0, 15.0, 10.0])
    pie("cc_pie_exploded_honest", v, explode=(1,))
    pie("cc_pie_exploded_angles_wrong", v, drawn=mislead(v, [22.0, 33.0, 20.0, 15.0, 10.0]),
        rule="wedges-vs-labels", explode=(1,))
    pie("cc_pie_pieces_honest", v, pieces=True)
    pie("cc_pie_subpaths_honest", vary([28.0, 22.0, 19.0, 17.0, 14.0]), one_path=True)
    v2 = vary([30.0, 25.0, 20.0, 15.0, 10.0])
    tilted("cc_tilted_rim", v2, 0.35, 0.18, "tilted-pie-ink")
    tilted("cc_tilted_flat_honest", v2, 0.35, 0.0, None)
    tilted("cc_perspective", v2, 0.0, 0.0, "tilted-pie-ink",
           persp={"tilt": math.radians(62), "distance": 2.6})
    tilted("cc_perspective_rim", v2, 0.0, 0.14, "tilted-pie-ink",
           persp={"tilt": math.radians(62), "distance": 2.6})
    tilted("cc_tilted_exploded_rim", v2, 0.35, 0.18, "tilted-pie-ink", explode=(0, 3))
    tilted("cc_tilted_exploded_flat_honest", v2, 0.35, 0.0, None, explode=(0, 3))
    vr = vary([72.0, 58.0, 44.0, 30.0])
    radial("cc_radial_equal_width", vr, 100.0, False, "radial-ring-ink")
    radial("cc_radial_equal_area_honest", vr, 100.0, True, None)
    diagram("cc_cycle_diagram")


if __name__ == "__main__":
    main()
