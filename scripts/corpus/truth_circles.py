"""Ground truth for circle charts: pies, donuts, tilted pies, radial bars, polar areas.

Every expected measure is computed from the data the generator drew and the geometry it
asked for (radii, tilt, rim depth), never from plotproof. Each figure of these kinds
carries a "circle" object (docs/corpus.md, "Circle charts"). Formulas:

* sector area r^2 theta/2, annular sector (R^2 - r^2) theta/2 (elementary geometry);
* an ellipse sector between parametric angles t1, t2 has area ab(t2 - t1)/2 (the affine
  image of a circle's sector under a map of determinant b/a), so an orthographic tilt
  keeps every slice's share of the top face;
* a rim (side wall) of depth d seen below the front half of an ellipse of semi-axis a
  has, between parametric angles t1 < t2 in [pi, 2pi], the area d * a * |cos t2 - cos t1|
  (a vertical band over the x-interval the arc spans);
* perspective: top faces and rims (the edge and the same edge lowered by the depth) are
  projected through a pinhole and measured by the shoelace formula over 720 points per
  turn (numerical, independent of plotproof's geometry);
* Lie Factor: Tufte (1983), p. 57, in its growth form (g2/g1)/(v2/v1).
"""

import math

KINDS = {"pie", "tilted-pie", "radial-bar", "polar-area"}
RULES = {"wedges-vs-labels", "shares-not-100", "tilted-pie-ink", "radial-ring-ink",
         "polar-radius"}


def _r(x):
    return None if x is None else float("%.9g" % x)


def _worst_ratio(ratios):
    """Index and value of the ratio farthest from 1 on a log scale."""
    best = max(range(len(ratios)), key=lambda i: abs(math.log(ratios[i])))
    return best, ratios[best]


def _pairs(g, v):
    """Largest (g_i/g_j)/(v_i/v_j) over pairs, as max(r, 1/r) >= 1."""
    worst = 1.0
    for i in range(len(v)):
        for j in range(i + 1, len(v)):
            if min(g[i], g[j], v[i], v[j]) <= 0:
                continue
            r = (g[i] / g[j]) / (v[i] / v[j])
            worst = max(worst, r, 1 / r)
    return worst


def _pie(fig, c):
    v = fig["values"]
    drawn = c.get("drawn_values") or v
    d = [x / sum(drawn) for x in drawn]
    printed, pk = c.get("printed"), c.get("printed_kind")
    if pk == "percent":
        p = [x / 100.0 for x in printed]
    elif pk == "value":
        p = [x / sum(printed) for x in printed]
    else:
        p = [x / sum(v) for x in v]
    i, lf = _worst_ratio([a / b for a, b in zip(d, p)])
    out = {"lie_factor_growth": _r(lf), "worst_wedge": fig["labels"][i],
           "worst_drawn_share": _r(d[i]), "worst_printed_share": _r(p[i]),
           "max_pair_departure": _r(_pairs(d, p))}
    if pk == "percent":
        # Each printed percentage may be off by half a unit of its last decimal.
        dec = c.get("decimals", 0)
        out["percent_sum"] = _r(sum(printed))
        out["percent_allowance"] = _r(len(printed) * 0.5 * 10 ** -dec)
        if fig.get("rule") == "shares-not-100":
            # The headline of that rule: the whole the labels claim over the 100% drawn.
            out["lie_factor_growth"] = _r(sum(printed) / 100.0)
    return out


def _arc_overlap(a0, a1, lo, hi):
    """Parts of [a0, a1] (any real angles, a1 > a0) inside [lo, hi] + 2k pi."""
    parts = []
    for k in range(-2, 3):
        s, e = max(a0, lo + 2 * math.pi * k), min(a1, hi + 2 * math.pi * k)
        if e > s:
            parts.append((s - 2 * math.pi * k, e - 2 * math.pi * k))
    return parts


def slice_angles(values, start, direction):
    """Parametric [t0, t1] of each slice: from start, counter-clockwise (+1) or clockwise
    (-1) as seen on the page, y up."""
    total, t, out = sum(values), start, []
    for x in values:
        sweep = 2 * math.pi * x / total
        nt = t + direction * sweep
        out.append((min(t, nt), max(t, nt)))
        t = nt
    return out


def _project(x, y, tilt, dist, h=0.0):
    """A point of the unit pie plane (raised by h radii) seen through a pinhole: tilt about
    the x axis, camera at dist radii, focal length dist (so the centre keeps its scale);
    (y, h) turn by the tilt."""
    z = dist + y * math.sin(tilt) - h * math.cos(tilt)
    return dist * x / z, dist * (y * math.cos(tilt) + h * math.sin(tilt)) / z


def rim_range(persp):
    """The parametric angles of the side wall facing the camera: the wall's normal
    (cos t, sin t, 0) towards the camera at (0, -dist sin(tilt), dist cos(tilt)) in the
    pie's frame, i.e. sin t < -1/(dist sin(tilt)); orthographic (no persp): the front half."""
    if not persp:
        return math.pi, 2 * math.pi
    k = math.asin(1.0 / (persp["distance"] * math.sin(persp["tilt"])))
    return math.pi + k, 2 * math.pi - k


def rim_polygon(lo, hi, persp, depth, n_turn):
    """A perspective rim between parametric angles lo < hi of the front half: the top
    face's edge, then the same edge `depth` radii lower, backwards (n_turn points a turn)."""
    n = max(2, int(n_turn * (hi - lo) / (2 * math.pi)))
    ts = [lo + (hi - lo) * j / n for j in range(n + 1)]
    top = [_project(math.cos(t), math.sin(t), persp["tilt"], persp["distance"]) for t in ts]
    bot = [_project(math.cos(t), math.sin(t), persp["tilt"], persp["distance"], -depth)
           for t in reversed(ts)]
    return top + bot


def _shoelace(pts):
    return 0.5 * abs(sum(pts[i][0] * pts[i - 1][1] - pts[i - 1][0] * pts[i][1]
                         for i in range(len(pts))))


def _tilted(fig, c):
    v = fig["values"]
    s = [x / sum(v) for x in v]
    if c.get("printed_kind") == "percent":
        # The reader's shares are the printed ones; the ink is compared with them.
        s = [x / 100.0 for x in c["printed"]]
    k, depth = c["ratio"], c.get("depth", 0.0)
    spans = slice_angles(v, c["start"], c["direction"])
    persp = c.get("perspective")
    top, rim = [], []
    for t0, t1 in spans:
        if persp:
            n = max(2, int(720 * (t1 - t0) / (2 * math.pi)))
            pts = [(0.0, 0.0)] + [_project(math.cos(t0 + (t1 - t0) * j / n),
                                           math.sin(t0 + (t1 - t0) * j / n),
                                           persp["tilt"], persp["distance"])
                                  for j in range(n + 1)]
            top.append(_shoelace(pts))
        else:
            top.append(k * (t1 - t0) / 2)
        if persp:
            # Drawn in units of the radius: the shoelace over 720 points a turn.
            rim.append(sum(_shoelace(rim_polygon(b, e, persp, depth, 720))
                           for b, e in _arc_overlap(t0, t1, *rim_range(persp))))
        else:
            rim.append(sum(depth * abs(math.cos(e) - math.cos(b))
                           for b, e in _arc_overlap(t0, t1, math.pi, 2 * math.pi)))
    tt, ta = sum(top), sum(top) + sum(rim)
    ex_top = [top[i] / tt / s[i] for i in range(len(v))]
    ex_all = [(top[i] + rim[i]) / ta / s[i] for i in range(len(v))]
    i = max(range(len(v)), key=lambda j: ex_all[j])
    return {"lie_factor_growth": _r(ex_all[i]), "worst_wedge": fig["labels"][i],
            "top_exaggeration": _r(max(ex_top)),
            "top_share": [_r(t / tt) for t in top],
            "ink_share": [_r((top[j] + rim[j]) / ta) for j in range(len(v))],
            "max_pair_departure": _r(_pairs([top[j] + rim[j] for j in range(len(v))], v))}


def _radial(fig, c):
    v = fig["values"]
    rings, full = c["rings"], c["full_value"]
    ink = [(ro * ro - ri * ri) * math.pi * x / full for (ri, ro), x in zip(rings, v)]
    per_unit = [g / x for g, x in zip(ink, v)]
    o = max(range(len(v)), key=lambda j: rings[j][1])
    n = min(range(len(v)), key=lambda j: rings[j][1])
    ratio = per_unit[o] / per_unit[n]
    return {"lie_factor_growth": _r(ratio), "outer_to_inner": _r(ratio),
            "max_pair_departure": _r(_pairs(ink, v))}


def _polar(fig, c):
    v = fig["values"]
    ink = [r * r for r in c["radii"]]
    hi = max(range(len(v)), key=lambda j: v[j])
    lo = min(range(len(v)), key=lambda j: v[j])
    lf = (ink[hi] / ink[lo]) / (v[hi] / v[lo])
    return {"lie_factor_growth": _r(lf), "area_ratio": _r(ink[hi] / ink[lo]),
            "value_ratio": _r(v[hi] / v[lo]), "max_pair_departure": _r(_pairs(ink, v))}


def expected(fig):
    c = fig.get("circle")
    if not c or not fig.get("values"):
        return None
    return {"pie": _pie, "tilted-pie": _tilted, "radial-bar": _radial,
            "polar-area": _polar}[fig["kind"]](fig, c)


def validate(fig, where):
    errs = []
    if fig.get("kind") in KINDS:
        c = fig.get("circle")
        if not isinstance(c, dict):
            return ["%s: circle charts need a circle object" % where]
        need = {"pie": (), "tilted-pie": ("ratio", "start", "direction"),
                "radial-bar": ("rings", "full_value"), "polar-area": ("radii",)}
        for k in need[fig["kind"]]:
            if k not in c:
                errs.append("%s: circle lacks %s" % (where, k))
        if c.get("printed_kind") and len(c.get("printed") or []) != len(fig["values"]):
            errs.append("%s: printed and values differ in length" % where)
    return errs
