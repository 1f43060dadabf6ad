#!/usr/bin/python3
"""Expected measures for the shape families of the corpus (docs/corpus.md): 3D bars,
pyramids and funnels, bubbles and scaled symbols. Computed from the values and the drawn
geometry the generator chose from them (in data units: every face of a figure shares one
affine map to the page, so area ratios are the same on paper), with textbook formulas.

Sources: Lie Factor, Tufte (1983) p.57; trapezoid area (a+b)h/2 and frustum volume
h/3(A1 + sqrt(A1 A2) + A2) (prismoid formula; from memory); pinhole perspective scale
f/(f+z) (textbook projective geometry); least squares on logs for the power law
size = c * value^k (textbook regression)."""

import math

KINDS = {"bar-3d", "pyramid", "bubble"}
RULES = {"bars-3d-ink", "slices-vs-values", "symbols-not-by-area"}


def _r(x):
    return None if x is None else float("%.9g" % x)


def _shoelace(pts):
    s = 0.0
    for i in range(len(pts)):
        x0, y0 = pts[i]
        x1, y1 = pts[(i + 1) % len(pts)]
        s += x0 * y1 - x1 * y0
    return abs(s) / 2


def _lie_largest_smallest(v, ink):
    """(ink of the largest value / ink of the smallest) / (largest / smallest)."""
    pairs = [(vi, gi) for vi, gi in zip(v, ink) if vi > 0 and gi > 0]
    if len(pairs) < 2:
        return None
    hi = max(pairs, key=lambda p: p[0])
    lo = min(pairs, key=lambda p: p[0])
    if hi[0] == lo[0]:
        return None
    return (hi[1] / lo[1]) / (hi[0] / lo[0])


def _max_pair(v, g):
    pos = [(vi, gi) for vi, gi in zip(v, g) if vi > 0 and gi > 0]
    if len(pos) < 2:
        return None
    worst = 1.0
    for i in range(len(pos)):
        for j in range(i + 1, len(pos)):
            r = (pos[i][1] / pos[j][1]) / (pos[i][0] / pos[j][0])
            worst = max(worst, r, 1 / r)
    return worst


def _clip_convex(subject, clip):
    """Sutherland-Hodgman: the part of polygon subject inside the convex polygon clip
    (either turn; textbook)."""
    if _signed(clip) < 0:
        clip = clip[::-1]
    out = list(subject)
    for i in range(len(clip)):
        a, b = clip[i], clip[(i + 1) % len(clip)]
        side = lambda p: (b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0])  # noqa
        src, out = out, []
        for k in range(len(src)):
            p, q = src[k], src[(k + 1) % len(src)]
            sp, sq = side(p), side(q)
            if sp >= 0:
                out.append(p)
            if (sp >= 0) != (sq >= 0):
                t = sp / (sp - sq)
                out.append((p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])))
        if not out:
            return []
    return out


def _signed(pts):
    s = 0.0
    for i in range(len(pts)):
        x0, y0 = pts[i]
        x1, y1 = pts[(i + 1) % len(pts)]
        s += x0 * y1 - x1 * y0
    return s / 2


def _hull(pts):
    """Convex hull, counter-clockwise (Andrew's monotone chain; textbook)."""
    pts = sorted(set(map(tuple, pts)))
    cross = lambda o, a, b: (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0])  # noqa
    lo, up = [], []
    for p in pts:
        while len(lo) >= 2 and cross(lo[-2], lo[-1], p) <= 0:
            lo.pop()
        lo.append(p)
    for p in reversed(pts):
        while len(up) >= 2 and cross(up[-2], up[-1], p) <= 0:
            up.pop()
        up.append(p)
    return lo[:-1] + up[:-1]


def _hidden(face, covers):
    """Area of face under the union of convex covers, by inclusion-exclusion over their
    intersections (each an intersection of convex polygons, so convex)."""
    from itertools import combinations
    total = 0.0
    for k in range(1, len(covers) + 1):
        for sub in combinations(covers, k):
            poly = face
            for c in sub:
                poly = _clip_convex(poly, c)
                if len(poly) < 3:
                    break
            if len(poly) >= 3:
                total += (-1) ** (k + 1) * abs(_signed(poly))
    return total


def box_faces_seen(solid):
    """mplot3d bar3d boxes: per bar, (vertical faces seen, top seen) in display units².
    A face is seen when its outline keeps its outward turn on the page (back-face test).
    mplot3d paints faces furthest first by the mean view depth of their corners (its
    painter's algorithm); a bar is painted over another when its nearest seen face is
    nearer than the other's, and what it covers is taken off."""
    corners, depth, faces = solid["corners"], solid["depth"], solid["faces"]
    hulls = [_hull(c) for c in corners]
    near = []
    for c, z in zip(corners, depth):
        seen = [idx for idx in faces.values() if _signed([tuple(c[k]) for k in idx]) > 0]
        near.append(min(sum(z[k] for k in idx) / 4 for idx in seen))
    out = []
    for i, c in enumerate(corners):
        covers = [hulls[j] for j in range(len(corners))
                  if j != i and near[j] < near[i]
                  and len(_clip_convex(hulls[i], hulls[j])) >= 3]
        vert = top = 0.0
        for name, idx in faces.items():
            poly = [tuple(c[k]) for k in idx]
            if _signed(poly) <= 0:
                continue
            seen = abs(_signed(poly)) - _hidden(poly, covers)
            if name == "top":
                top += seen
            elif name != "bottom":
                vert += seen
        out.append((vert, top))
    return out


def _minus_convex(pieces, cover):
    """Convex pieces less a convex cover: each piece split by the cover's edges into the
    parts outside it (textbook convex decomposition)."""
    if _signed(cover) < 0:
        cover = cover[::-1]
    out = []
    for rem in pieces:
        for i in range(len(cover)):
            a, b = cover[i], cover[(i + 1) % len(cover)]
            if len(rem) < 3:
                break
            part = _half(rem, b, a)  # right of a->b: outside this edge
            if len(part) >= 3 and abs(_signed(part)) > 1e-12:
                out.append(part)
            rem = _half(rem, a, b)
    return out


def _half(poly, a, b):
    """The part of a convex polygon left of a->b (counter-clockwise inside; textbook)."""
    side = lambda p: (b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0])  # noqa
    out = []
    for k in range(len(poly)):
        p, q = poly[k], poly[(k + 1) % len(poly)]
        sp, sq = side(p), side(q)
        if sp >= 0:
            out.append(p)
        if (sp >= 0) != (sq >= 0):
            t = sp / (sp - sq)
            out.append((p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])))
    return out


def drawn_faces_seen(solid, n):
    """Faces as painted (solid["faces"]: bar, part, corners, in painting order): what each
    shows after every face painted later, in display units²; per bar (vertical, top)."""
    faces = solid["faces"]
    vert, top = [0.0] * n, [0.0] * n
    for i, f in enumerate(faces):
        pieces = [[tuple(p) for p in f["corners"]]]
        for g in faces[i + 1:]:
            pieces = _minus_convex(pieces, [tuple(p) for p in g["corners"]])
        seen = sum(abs(_signed(p)) for p in pieces)
        if f["part"] == "top":
            top[f["bar"]] += seen
        else:  # the bottom too: whatever of it shows is ink (it never does from above)
            vert[f["bar"]] += seen
    return list(zip(vert, top))


def oblique_faces_seen(solid, v):
    """Oblique bars placed at solid["x"] (front left edges, data units, y up), painted in
    that order, each as front, side and cap: per bar (front, cap, total) seen. A face seen
    is its shoelace area less the union of the faces painted after it, by
    inclusion-exclusion over Sutherland-Hodgman clips (textbook)."""
    w, (dx, dy) = solid["front_width"], solid["depth"]
    b = solid.get("base", 0.0)
    bars = []
    for x0, vi in zip(solid["x"], v):
        x1 = x0 + w
        bars.append([[(x0, b), (x1, b), (x1, vi), (x0, vi)],
                     [(x1, b), (x1 + dx, b + dy), (x1 + dx, vi + dy), (x1, vi)],
                     [(x0, vi), (x1, vi), (x1 + dx, vi + dy), (x0 + dx, vi + dy)]])
    order = sorted(range(len(bars)), key=lambda k: solid["x"][k])
    out = [None] * len(bars)
    for rank, i in enumerate(order):
        later = [f for j in order[rank + 1:] for f in bars[j]]
        seen = []
        for face in bars[i]:
            covers = [c for c in later if len(_clip_convex(face, c)) >= 3]
            seen.append(abs(_signed(face)) - _hidden(face, covers))
        out[i] = (seen[0], seen[2], sum(seen))
    return out


def perspective_faces_seen(solid, v):
    """Perspective bars painted furthest first (each as cap, side, front): per bar (front,
    cap + side, total) seen, each face less the union of the faces painted after it
    (inclusion-exclusion over Sutherland-Hodgman clips, textbook)."""
    eye, f, w, d = solid["eye"], solid["focal"], solid["front_width"], solid["depth"]
    b = solid.get("base", 0.0)
    P = lambda x, y, z: perspective_point((x, y, z), eye, f)  # noqa: E731
    bars = []
    for i, vi in enumerate(v):
        x0, z0 = solid["x"][i], solid["z"][i]
        x1, z1 = x0 + w, z0 + d
        faces = []
        if vi < eye[1]:
            faces.append(("cap", [P(x0, vi, z0), P(x1, vi, z0), P(x1, vi, z1), P(x0, vi, z1)]))
        xs = x1 if x1 < eye[0] else (x0 if x0 > eye[0] else None)
        if xs is not None:
            faces.append(("side", [P(xs, b, z0), P(xs, vi, z0), P(xs, vi, z1), P(xs, b, z1)]))
        faces.append(("front", [P(x0, b, z0), P(x1, b, z0), P(x1, vi, z0), P(x0, vi, z0)]))
        bars.append(faces)
    order = sorted(range(len(v)), key=lambda k: -solid["z"][k])
    painted = [(i, name, poly) for i in order for name, poly in bars[i]]
    seen = [[0.0, 0.0] for _ in v]
    for k, (i, name, poly) in enumerate(painted):
        covers = [c for _, _, c in painted[k + 1:] if len(_clip_convex(poly, c)) >= 3]
        a = abs(_signed(poly)) - _hidden(poly, covers)
        seen[i][0 if name == "front" else 1] += a
    return [(fr, co, fr + co) for fr, co in seen]


def perspective_point(p, eye, f):
    """One-point perspective of (x, y, z): scale f/(f+z) towards the eye point."""
    s = f / (f + p[2])
    return (eye[0] + (p[0] - eye[0]) * s, eye[1] + (p[1] - eye[1]) * s)


def bar3d_faces(solid, v):
    """Per bar: (front, constant, total) ink in data units².

    oblique: front w*(v-b); side |dx|*(v-b) (a parallelogram of base v-b and width |dx|);
    cap w*|dy| (base w, height |dy|): the cap is the same on every bar. Stacked segments
    (solid["segment_base"] given): height v, and the cap only where solid["capped"].
    cylinder: body w*(v-b) plus the lower half ellipse pi*(w/2)*e/2 and the top ellipse
    pi*(w/2)*e (e = the ellipse's vertical semi-axis): both ellipse parts are constant; the
    top ellipse is painted over the body's top edge, so the front shows w*(v-b) less half
    the ellipse (ellipse area pi*a*b, textbook).
    perspective: the box x0..x1, y from base to value, z 0..depth projected towards the eye
    point; the front at depth z0 (each bar's own), the cap when the top is below the eye
    (y up here: top < eye y), the side facing the eye; faces by the shoelace formula."""
    proj = solid["projection"]
    b = solid.get("base", 0.0)
    if proj == "box":  # the top is the constant; what is hidden is off both
        return [(vt, tp, vt + tp) for vt, tp in box_faces_seen(solid)]
    if proj == "drawn":  # faces as painted, each less what is painted over it
        return [(vt, tp, vt + tp) for vt, tp in drawn_faces_seen(solid, len(v))]
    out = []
    for i, vi in enumerate(v):
        h = vi - b if "segment_base" not in solid else vi  # a segment's own height
        if proj == "oblique" and "x" in solid:  # placed bars: what later bars hide is off
            out.append(oblique_faces_seen(solid, v)[i])
        elif proj == "oblique":
            w, (dx, dy) = solid["front_width"], solid["depth"]
            front = w * h
            side = abs(dx) * h
            # stacked: only the top segment shows a cap (the others' are covered)
            const = w * abs(dy) if solid.get("capped", [True] * len(v))[i] else 0.0
            out.append((front, const, front + side + const))
        elif proj == "cylinder":
            w, e = solid["front_width"], solid["ellipse"]
            # the top ellipse, painted over the body, covers the body's rectangle with its
            # lower half: the front shows w*h less that half
            front = w * h - math.pi * (w / 2) * e / 2
            const = math.pi * (w / 2) * e + math.pi * (w / 2) * e / 2
            out.append((front, const, front + const))
        elif proj == "perspective" and solid.get("painted"):
            out.append(perspective_faces_seen(solid, v)[i])
        elif proj == "perspective":
            eye, f = solid["eye"], solid["focal"]
            x0 = solid["x"][i]
            x1 = x0 + solid["front_width"]
            z0 = solid["z"][i]
            z1 = z0 + solid["depth"]
            P = lambda x, y, z: perspective_point((x, y, z), eye, f)  # noqa: E731
            front = _shoelace([P(x0, b, z0), P(x1, b, z0), P(x1, vi, z0), P(x0, vi, z0)])
            const = 0.0
            if vi < eye[1]:  # y up: a top below the eye is seen from above
                const += _shoelace([P(x0, vi, z0), P(x1, vi, z0), P(x1, vi, z1), P(x0, vi, z1)])
            xs = x1 if x1 < eye[0] else (x0 if x0 > eye[0] else None)
            side = 0.0
            if xs is not None:
                side = _shoelace([P(xs, b, z0), P(xs, vi, z0), P(xs, vi, z1), P(xs, b, z1)])
            # A side face in perspective is a trapezoid whose size depends on the bar's place
            # relative to the eye, not on its value alone: counted as not proportional.
            out.append((front, const + side, front + const + side))
        else:
            raise ValueError("unknown projection %r" % proj)
    return out


def _bar3d(fig):
    v = fig["values"]
    faces = bar3d_faces(fig["solid"], v)
    total = [t for _, _, t in faces]
    front = [f for f, _, _ in faces]
    return {
        "lie_factor_growth": _r(_lie_largest_smallest(v, total)),
        "nonprop_share": _r(max(c / t for _, c, t in faces if t > 0)),
        "front_departure": _r(_max_pair(v, front)),
        "max_pair_departure": _r(_max_pair(v, total)),
        "baseline": fig["solid"].get("base", 0.0),
    }


def slice_areas(slices):
    """Trapezoid slices [top_width, bottom_width, height]: area (a+b)h/2."""
    return [(a + b) * h / 2 for a, b, h in slices]


def slice_volumes(slices, solid):
    """The same slices read as a solid of revolution (cone: half-widths are radii) or a
    square pyramid (half-widths are half-sides): frustum volumes h/3(A1 + sqrt(A1A2) + A2)."""
    out = []
    for a, b, h in slices:
        r1, r2 = a / 2, b / 2
        base = h / 3 * (r1 * r1 + r1 * r2 + r2 * r2)
        out.append(math.pi * base if solid == "cone" else 4 * base)
    return out


def _inflation(v, sizes):
    tv, ts = sum(v), sum(sizes)
    return [(s / ts) / (x / tv) for x, s in zip(v, sizes)]


def _pyramid(fig):
    v = fig["values"]
    sl = fig["slices"]
    areas = slice_areas(sl["shape"])
    infl = _inflation(v, areas)
    most = max(range(len(v)), key=lambda i: infl[i])
    least = min(range(len(v)), key=lambda i: infl[i])
    vols = slice_volumes(sl["shape"], sl.get("solid", "cone"))
    vinfl = _inflation(v, vols)
    tv, ta, tvol = sum(v), sum(areas), sum(vols)
    return {
        "lie_factor_growth": _r(infl[most] / infl[least]),
        "most_inflated": most,
        "least_inflated": least,
        "area_share": [_r(a / ta) for a in areas],
        "value_share": [_r(x / tv) for x in v],
        "solid": sl.get("solid", "cone"),
        "volume_share": [_r(x / tvol) for x in vols],
        "volume_ratio": _r(max(vinfl) / min(vinfl)),
        "baseline": None,
    }


def symbol_areas(sym):
    """Drawn size → area: 'area' sizes are areas (matplotlib's s, pt²), 'radius' or 'side'
    sizes give areas ∝ size² (pi r², s²: textbook)."""
    m = sym["measure"]
    if m == "area":
        return list(sym["sizes"])
    if m in ("radius", "side"):
        return [s * s for s in sym["sizes"]]
    raise ValueError("unknown symbol measure %r" % m)


def power_fit(x, y):
    """Least squares of log y on log x: (exponent, r2)."""
    lx = [math.log(a) for a in x]
    ly = [math.log(b) for b in y]
    n = len(lx)
    mx, my = sum(lx) / n, sum(ly) / n
    sxx = sum((a - mx) ** 2 for a in lx)
    sxy = sum((a - mx) * (b - my) for a, b in zip(lx, ly))
    syy = sum((b - my) ** 2 for b in ly)
    k = sxy / sxx
    r2 = 1.0 if syy == 0 else sxy * sxy / (sxx * syy)
    return k, r2


def _bubble(fig):
    v = fig["values"]
    areas = symbol_areas(fig["symbols"])
    k, r2 = power_fit(v, areas)
    return {
        "lie_factor_growth": _r(_lie_largest_smallest(v, areas)),
        "size_exponent": _r(k),
        "size_r2": _r(r2),
        "max_pair_departure": _r(_max_pair(v, areas)),
        "baseline": None,
    }


def expected(fig):
    if not fig.get("values"):
        return None
    if fig["kind"] == "bar-3d":
        return _bar3d(fig)
    if fig["kind"] == "pyramid":
        return _pyramid(fig)
    if fig["kind"] == "bubble":
        return _bubble(fig)
    return None


def in_band(lie_factor, low=0.95, high=1.05):
    """Tufte's faithful band (1983, p.57)."""
    return lie_factor is not None and low <= lie_factor <= high


def faithful(expected, low=0.95, high=1.05):
    """No finding expected: the Lie Factor in the band and no pair departing beyond it
    (the same test as docs/rules.md, Thresholds)."""
    e = expected or {}
    mpd = e.get("max_pair_departure")
    return in_band(e.get("lie_factor_growth"), low, high) and (mpd is None or mpd <= high)
