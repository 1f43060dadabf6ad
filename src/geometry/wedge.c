/* wedge.c — wedges read back from painted paths: each subpath is cut at its corners into
 * arcs (cubic Béziers or fine polylines) and straight edges, and the pieces say what it is:
 * a pie sector, an annular sector, a full ellipse, an open arc or a band (a tilted pie's
 * rim). Centres, radii and parametric angles come from conic.c's fits. */
#include "internal.h"

#include <math.h>

/* A turn sharper than this between two pieces is a corner. The radius of an ellipse of
 * axis ratio k meets the ellipse at no less than asin(2k/(1+k²)) (≈ 23° at k = 0.2, the
 * flattest tilted pie we expect), and polyline arcs turn by 1.8° per vertex in R's pie()
 * (edges = 200) and by less in the other producers: derived, with margin both ways. */
#define CORNER_TURN (12.0 * G_PI / 180)
/* A piece of lines is straight when no vertex leaves the chord by more than this fraction
 * of the chord's length: common practice, no source. */
#define STRAIGHT_DEVIATION 0.01
/* Control points this close to the chord (relative) make a straight cubic: common
 * practice, no source. */
#define CURVE_AS_LINE 1e-6
/* An arc shorter than this (about its centre) does not fix an ellipse's axes: it is read
 * as a circle and left for a shared fit (pp_path_wedges() with a shape): derived from the
 * conditioning of the three-term fit on exact cubic arcs (tests/geometry). */
#define MIN_SWEEP_FOR_AXES (30.0 * G_PI / 180)
/* Radial edges whose directions differ by less than this are parallel: their crossing
 * does not locate a centre. Common practice, no source. */
#define PARALLEL_TURN (2.0 * G_PI / 180)
/* Two straight lines longer than this fraction of the subpath's size meet at a corner
 * however slight their turn (a pie slice of nearly 180°): arcs drawn as polylines use
 * chords far shorter (R: 1.8° of arc, 3% of the radius). Common practice, no source. */
#define LONG_LINE 0.2
/* A line this long (fraction of the subpath's size) beside a curve is an edge. */
#define EDGE_LINE 0.01
#define SLIGHT_TURN (0.05 * G_PI / 180)
/* Points within this relative distance of one circle are a circle, whatever a free
 * ellipse fit makes of their noise (see PP_CIRCLE_AXIS_RATIO). */
#define CIRCLE_FIT_TOL 0.004
/* Pieces shorter than this fraction of the subpath's size are joints, not edges. */
#define TINY_PIECE 1e-6
/* Pieces of a wedge's outline at most: two arcs (an annular sector's) and two straight
 * edges (its radial sides); read_subpath() refuses more. */
#define MAX_WEDGE_PIECES 4

typedef struct {
  pp_seg_kind kind; /* LINE or CURVE */
  pp_point p[4];    /* p[0] start; lines use p[3] as end */
} seg;

typedef struct {
  int first, n; /* segments [first, first + n) of the ring, modulo its length */
  gboolean arc;
} piece;

static pp_point sub(pp_point a, pp_point b) {
  return (pp_point){a.x - b.x, a.y - b.y};
}

static gboolean nonzero(pp_point d, double eps) {
  return hypot(d.x, d.y) > eps;
}

static pp_point start_tangent(const seg *s, double eps) {
  if (s->kind == PP_SEG_CURVE) {
    for (int i = 1; i <= 3; i++)
      if (nonzero(sub(s->p[i], s->p[0]), eps))
        return sub(s->p[i], s->p[0]);
  }
  return sub(s->p[3], s->p[0]);
}

static pp_point end_tangent(const seg *s, double eps) {
  if (s->kind == PP_SEG_CURVE) {
    for (int i = 2; i >= 0; i--)
      if (nonzero(sub(s->p[3], s->p[i]), eps))
        return sub(s->p[3], s->p[i]);
  }
  return sub(s->p[3], s->p[0]);
}

static double turn(pp_point a, pp_point b) {
  return fabs(atan2(a.x * b.y - a.y * b.x, a.x * b.x + a.y * b.y));
}

/* Segments of one subpath [from, to) of the path, degenerate ones dropped; the closing
 * line is added when closed and it has length. */
static GArray *subpath_segs(const pp_path *path, size_t from, size_t to, gboolean close,
                            gboolean *closed, double *size) {
  GArray *out = g_array_new(FALSE, FALSE, sizeof(seg));
  pp_point start = path->segs[from].pt[0], cur = start;
  pp_rect box = pp_rect_add_point(pp_rect_empty(), start);
  *closed = close;
  for (size_t i = from + 1; i < to; i++) {
    const pp_seg *s = &path->segs[i];
    seg g = {.kind = s->kind == PP_SEG_CURVE ? PP_SEG_CURVE : PP_SEG_LINE};
    g.p[0] = cur;
    if (s->kind == PP_SEG_CURVE) {
      g.p[1] = s->pt[0];
      g.p[2] = s->pt[1];
      g.p[3] = s->pt[2];
    } else if (s->kind == PP_SEG_LINE) {
      g.p[3] = s->pt[0];
    } else { /* CLOSE */
      g.p[3] = start;
      *closed = TRUE;
    }
    g.p[1] = g.kind == PP_SEG_LINE ? g.p[0] : g.p[1];
    g.p[2] = g.kind == PP_SEG_LINE ? g.p[3] : g.p[2];
    for (int k = 1; k < 4; k++)
      box = pp_rect_add_point(box, g.p[k]);
    cur = g.p[3];
    g_array_append_val(out, g);
    if (s->kind == PP_SEG_CLOSE)
      break;
  }
  if (*closed && (cur.x != start.x || cur.y != start.y)) {
    seg g = {.kind = PP_SEG_LINE, .p = {cur, cur, start, start}};
    g_array_append_val(out, g);
  }
  *size = fmax(pp_rect_width(box), pp_rect_height(box));
  /* Drop segments without length (repeated points, zero-length closes). */
  double eps = TINY_PIECE * fmax(*size, 1e-12);
  for (guint i = out->len; i-- > 0;) {
    seg *g = &g_array_index(out, seg, i);
    gboolean moves = FALSE;
    for (int k = 1; k < 4; k++)
      moves = moves || nonzero(sub(g->p[k], g->p[0]), eps);
    if (!moves)
      g_array_remove_index(out, i);
  }
  return out;
}

#define SEG(ring, i) (&g_array_index((ring), seg, ((i) % (int)(ring)->len)))

static gboolean piece_is_straight(GArray *ring, int first, int n) {
  pp_point a = SEG(ring, first)->p[0], b = SEG(ring, first + n - 1)->p[3];
  double len = hypot(b.x - a.x, b.y - a.y);
  if (!(len > 0))
    return FALSE;
  for (int k = 0; k < n; k++) {
    const seg *s = SEG(ring, first + k);
    if (s->kind == PP_SEG_CURVE) {
      /* A curve was drawn on purpose: an arc however short, unless it is a line in
       * disguise (control points on the chord). */
      for (int j = 1; j < 4; j++) {
        double d = fabs((b.x - a.x) * (s->p[j].y - a.y) - (b.y - a.y) * (s->p[j].x - a.x)) / len;
        if (d > CURVE_AS_LINE * len)
          return FALSE;
      }
    } else {
      pp_point p = s->p[3];
      double d = fabs((b.x - a.x) * (p.y - a.y) - (b.y - a.y) * (p.x - a.x)) / len;
      if (d > STRAIGHT_DEVIATION * len)
        return FALSE;
    }
  }
  return TRUE;
}

static gboolean is_long_line(const seg *s, double size, double fraction) {
  return s->kind == PP_SEG_LINE &&
         hypot(s->p[3].x - s->p[0].x, s->p[3].y - s->p[0].y) > fraction * size;
}

/* Cuts the ring of segments at its corners. */
static GArray *pieces_of(GArray *ring, gboolean closed, double eps, double size) {
  GArray *out = g_array_new(FALSE, FALSE, sizeof(piece));
  int n = (int)ring->len;
  if (n == 0)
    return out;
  gboolean *corner = g_new0(gboolean, n); /* corner[i]: a corner before segment i */
  int n_corners = 0;
  for (int i = 0; i < n; i++) {
    /* Each corner starts a piece, and a wedge has at most MAX_WEDGE_PIECES: an outline of
     * more is none, and its remaining joints need no angles (a random walk of a million
     * points spent 7% of its page here). */
    if (n_corners > MAX_WEDGE_PIECES) {
      g_free(corner);
      g_array_set_size(out, 0);
      return out;
    }
    if (i == 0 && !closed) {
      corner[i] = TRUE;
    } else {
      const seg *prev = SEG(ring, i + n - 1), *cur = SEG(ring, i);
      double t = turn(end_tangent(prev, eps), start_tangent(cur, eps));
      /* A line meeting a curve ends the arc even when tangent to it (a tilted pie's rim
       * wall meets the top arc at the ellipse's vertex): arcs are cubics throughout. */
      gboolean line_curve = prev->kind != cur->kind && (is_long_line(prev, size, EDGE_LINE) ||
                                                        is_long_line(cur, size, EDGE_LINE));
      corner[i] = t > CORNER_TURN || line_curve ||
                  (t > SLIGHT_TURN && is_long_line(prev, size, LONG_LINE) &&
                   is_long_line(cur, size, LONG_LINE));
    }
    n_corners += corner[i];
  }
  if (n_corners == 0) {
    piece p = {0, n, TRUE};
    if (piece_is_straight(ring, 0, n))
      p.arc = FALSE;
    g_array_append_val(out, p);
  } else {
    int s0 = 0;
    while (!corner[s0])
      s0++;
    int limit = closed ? n : n - s0;
    for (int k = 0; k < limit;) {
      int len = 1;
      while (k + len < limit && !corner[(s0 + k + len) % n])
        len++;
      piece p = {s0 + k, len, FALSE};
      p.arc = !piece_is_straight(ring, p.first, len);
      g_array_append_val(out, p);
      k += len;
    }
  }
  g_free(corner);
  return out;
}

/* Points along a piece: five per cubic, every vertex of a polyline. */
static GArray *piece_points(GArray *ring, const piece *p) {
  GArray *pts = g_array_new(FALSE, FALSE, sizeof(pp_point));
  g_array_append_val(pts, SEG(ring, p->first)->p[0]);
  for (int k = 0; k < p->n; k++) {
    const seg *s = SEG(ring, p->first + k);
    if (s->kind == PP_SEG_CURVE)
      for (int j = 1; j < 4; j++) {
        pp_point q = pp_cubic_point(s->p, j / 4.0);
        g_array_append_val(pts, q);
      }
    g_array_append_val(pts, s->p[3]);
  }
  return pts;
}

/* Unwrapped angles of pts about c (y up); returns the signed total. */
static double sweep_about(GArray *pts, pp_point c) {
  double total = 0, prev = 0;
  for (guint i = 0; i < pts->len; i++) {
    pp_point p = g_array_index(pts, pp_point, i);
    double a = atan2(-(p.y - c.y), p.x - c.x);
    if (i > 0)
      total += remainder(a - prev, 2 * G_PI);
    prev = a;
  }
  return total;
}

static double param_sweep(GArray *pts, const pp_ellipse *e, double *first) {
  double total = 0, prev = 0;
  for (guint i = 0; i < pts->len; i++) {
    double a = pp_ellipse_param(e, g_array_index(pts, pp_point, i));
    if (i == 0)
      *first = a;
    else
      total += remainder(a - prev, 2 * G_PI);
    prev = a;
  }
  return total;
}

static double mean_scale(GArray *pts, const pp_ellipse *e) {
  double s = 0;
  for (guint i = 0; i < pts->len; i++)
    s += pp_ellipse_scale(e, g_array_index(pts, pp_point, i)) / pts->len;
  return s;
}

static double max_scale_error(GArray *pts, const pp_ellipse *e) {
  double worst = 0;
  for (guint i = 0; i < pts->len; i++)
    worst = fmax(worst, fabs(pp_ellipse_scale(e, g_array_index(pts, pp_point, i)) - 1));
  return worst;
}

static gboolean line_cross(pp_point a0, pp_point a1, pp_point b0, pp_point b1, pp_point *x) {
  pp_point da = sub(a1, a0), db = sub(b1, b0);
  if (turn(da, db) < PARALLEL_TURN || fabs(G_PI - turn(da, db)) < PARALLEL_TURN)
    return FALSE;
  double den = da.x * db.y - da.y * db.x;
  double t = ((b0.x - a0.x) * db.y - (b0.y - a0.y) * db.x) / den;
  *x = (pp_point){a0.x + t * da.x, a0.y + t * da.y};
  return TRUE;
}

/* The ellipse through pts about a known centre: the given shape scaled when there is one,
 * the centred fit when the arc is long enough to fix the axes, else a circle. */
static gboolean ellipse_about(GArray *pts, pp_point c, const pp_ellipse *shape, pp_ellipse *e,
                              gboolean *fitted) {
  *fitted = FALSE;
  if (shape) {
    *e = *shape;
    e->centre = c;
    double k = shape->ry / shape->rx;
    e->rx = 1;
    e->ry = k;
    double s = mean_scale(pts, e);
    if (!(s > 0))
      return FALSE;
    e->rx = s;
    e->ry = k * s;
    return TRUE;
  }
  double r = 0;
  for (guint i = 0; i < pts->len; i++) {
    pp_point p = g_array_index(pts, pp_point, i);
    r += hypot(p.x - c.x, p.y - c.y) / pts->len;
  }
  if (!(r > 0))
    return FALSE;
  pp_ellipse circle = {c, r, r, 0};
  gboolean long_arc = fabs(sweep_about(pts, c)) >= MIN_SWEEP_FOR_AXES;
  if (long_arc && max_scale_error(pts, &circle) <= CIRCLE_FIT_TOL) {
    *e = circle;
    *fitted = TRUE;
    return TRUE;
  }
  if (long_arc && pp_ellipse_fit_centred((const pp_point *)pts->data, pts->len, c, e)) {
    *fitted = TRUE;
    return TRUE;
  }
  *e = circle;
  return TRUE;
}

/* The ellipse through pts with its centre unknown: the general fit, or a circle. */
/* With the shape known, un-squeezing the points makes them a circle: its centre is the
 * ellipse's, whatever short arc they span. */
static gboolean centre_for_shape(GArray *pts, const pp_ellipse *shape, pp_point *centre) {
  double c = cos(shape->rot), s = sin(shape->rot), k = shape->ry / shape->rx;
  g_autoptr(GArray) u = g_array_sized_new(FALSE, FALSE, sizeof(pp_point), pts->len);
  for (guint i = 0; i < pts->len; i++) {
    pp_point p = g_array_index(pts, pp_point, i);
    double x = p.x, y = -p.y; /* y up */
    pp_point q = {c * x + s * y, (-s * x + c * y) / k};
    g_array_append_val(u, q);
  }
  pp_point qc;
  double r;
  if (!pp_circle_fit((const pp_point *)u->data, u->len, &qc, &r))
    return FALSE;
  double x = qc.x, y = qc.y * k; /* back to the rotated y-up frame, then to the page */
  *centre = (pp_point){c * x - s * y, -(s * x + c * y)};
  return TRUE;
}

static gboolean ellipse_free(GArray *pts, const pp_ellipse *shape, pp_ellipse *e,
                             gboolean *fitted) {
  pp_point sc;
  if (shape && centre_for_shape(pts, shape, &sc))
    return ellipse_about(pts, sc, shape, e, fitted);
  pp_point cc;
  double cr;
  if (pp_circle_fit((const pp_point *)pts->data, pts->len, &cc, &cr)) {
    pp_ellipse circle = {cc, cr, cr, 0};
    if (max_scale_error(pts, &circle) <= CIRCLE_FIT_TOL)
      return ellipse_about(pts, cc, shape, e, fitted);
  }
  pp_ellipse g;
  gboolean ok = pp_ellipse_fit((const pp_point *)pts->data, pts->len, &g);
  if (ok && fabs(sweep_about(pts, g.centre)) >= MIN_SWEEP_FOR_AXES &&
      max_scale_error(pts, &g) < 0.01) {
    if (shape)
      return ellipse_about(pts, g.centre, shape, e, fitted);
    *e = g;
    *fitted = TRUE;
    return TRUE;
  }
  pp_point c;
  double r;
  if (!pp_circle_fit((const pp_point *)pts->data, pts->len, &c, &r))
    return FALSE;
  return ellipse_about(pts, c, shape, e, fitted);
}

static void set_angles(pp_wedge *w, GArray *outer) {
  double first = 0, sweep = param_sweep(outer, &w->outer, &first);
  double a0 = sweep >= 0 ? first : first + sweep;
  a0 = fmod(a0, 2 * G_PI);
  if (a0 < 0)
    a0 += 2 * G_PI;
  w->a0 = a0;
  w->a1 = a0 + fmin(fabs(sweep), 2 * G_PI);
  w->clockwise = sweep < 0; /* as seen on the page */
}

static void swap(GArray **a, GArray **b) {
  GArray *t = *a;
  *a = *b;
  *b = t;
}

/* Interprets the pieces: arc *a (and *b, the second arc, when there is one) with the edges'
 * end points. Swaps *a and *b so that *a is the outer (or top) arc. */
static gboolean classify(GArray **a, GArray **b, int n_edges, const pp_point e[4], gboolean closed,
                         double eps, const pp_ellipse *shape, pp_wedge *w) {
  gboolean fitted = FALSE;
  if (!*b && n_edges == 2) {
    /* A pie sector: the two radial edges meet at the apex, its centre. */
    pp_point apex;
    if (hypot(e[1].x - e[2].x, e[1].y - e[2].y) <= eps)
      apex = e[1];
    else if (hypot(e[3].x - e[0].x, e[3].y - e[0].y) <= eps)
      apex = e[3];
    else
      return FALSE;
    if (!ellipse_about(*a, apex, shape, &w->outer, &fitted))
      return FALSE;
    w->kind = PP_WEDGE_SECTOR;
  } else if (!*b) {
    /* A full ellipse, an open arc, or a half pie whose diameter is one straight edge. */
    if (!ellipse_free(*a, shape, &w->outer, &fitted))
      return FALSE;
    w->kind = n_edges == 1 ? PP_WEDGE_SECTOR : closed ? PP_WEDGE_FULL : PP_WEDGE_ARC;
    if (n_edges == 1) {
      /* Only a sector when the edge passes through the centre (a half pie), not a chord. */
      pp_point c = w->outer.centre, d = sub(e[1], e[0]);
      double off = fabs(d.x * (c.y - e[0].y) - d.y * (c.x - e[0].x)) / hypot(d.x, d.y);
      if (off > 0.02 * w->outer.rx)
        return FALSE;
    }
  } else if (n_edges == 2) {
    pp_point c;
    pp_ellipse ea, eb;
    gboolean fa, fb;
    if (line_cross(e[0], e[1], e[2], e[3], &c)) {
      /* An annular sector: the edges are radial and cross at the centre. */
      if (!ellipse_about(*a, c, shape, &ea, &fa) || !ellipse_about(*b, c, shape, &eb, &fb))
        return FALSE;
      w->kind = PP_WEDGE_ANNULAR;
    } else {
      /* Parallel edges: a half ring, or a band between two equal arcs (the rim of a tilted
       * pie: its bottom arc is the top one moved down by the rim's depth). */
      if (!ellipse_free(*a, shape, &ea, &fa) || !ellipse_free(*b, shape, &eb, &fb))
        return FALSE;
      double dc = hypot(ea.centre.x - eb.centre.x, ea.centre.y - eb.centre.y);
      if (dc > 0.02 * fmax(ea.rx, eb.rx)) {
        gboolean a_top = ea.centre.y <= eb.centre.y;
        w->outer = a_top ? ea : eb;
        fitted = a_top ? fa : fb;
        pp_point other = a_top ? eb.centre : ea.centre;
        w->depth = sub(other, w->outer.centre);
        if (!a_top)
          swap(a, b);
        w->kind = PP_WEDGE_BAND;
        w->shape_fitted = fitted;
        return TRUE;
      }
      w->kind = PP_WEDGE_ANNULAR;
    }
    gboolean a_outer = ea.rx * ea.ry >= eb.rx * eb.ry;
    w->outer = a_outer ? ea : eb;
    fitted = a_outer ? fa : fb;
    if (!a_outer)
      swap(a, b);
  } else {
    return FALSE;
  }
  w->shape_fitted = fitted;
  return TRUE;
}

/* Reads one subpath; FALSE when it is not made of arcs and radial edges. */
static gboolean read_subpath(GArray *ring, gboolean closed, double size, const pp_ellipse *shape,
                             pp_wedge *w) {
  double eps = TINY_PIECE * fmax(size, 1e-12);
  g_autoptr(GArray) pieces = pieces_of(ring, closed, eps, size);
  if (pieces->len == 0)
    return FALSE;
  int arcs[2] = {-1, -1}, n_arcs = 0, n_edges = 0;
  pp_point e[4] = {{0, 0}, {0, 0}, {0, 0}, {0, 0}}; /* start and end of each edge */
  for (guint i = 0; i < pieces->len; i++) {
    piece *p = &g_array_index(pieces, piece, i);
    if (p->arc) {
      if (n_arcs < 2)
        arcs[n_arcs] = (int)i;
      n_arcs++;
    } else {
      if (n_edges < 2) {
        e[2 * n_edges] = SEG(ring, p->first)->p[0];
        e[2 * n_edges + 1] = SEG(ring, p->first + p->n - 1)->p[3];
      }
      n_edges++;
    }
  }
  if (n_arcs < 1 || n_arcs > 2 || n_edges > 2)
    return FALSE;
  *w = (pp_wedge){0};
  GArray *a = piece_points(ring, &g_array_index(pieces, piece, arcs[0]));
  GArray *b = n_arcs > 1 ? piece_points(ring, &g_array_index(pieces, piece, arcs[1])) : NULL;
  gboolean ok = classify(&a, &b, n_edges, e, closed, eps, shape, w);
  if (ok) {
    w->fit_error = max_scale_error(a, &w->outer);
    set_angles(w, a);
    if (w->kind == PP_WEDGE_ANNULAR)
      w->inner = mean_scale(b, &w->outer);
    if (w->kind == PP_WEDGE_FULL)
      w->a1 = w->a0 + 2 * G_PI;
  }
  g_array_unref(a);
  if (b)
    g_array_unref(b);
  return ok;
}

GArray *pp_path_wedges(const pp_path *path, gboolean filled, const pp_ellipse *shape) {
  GArray *out = g_array_new(FALSE, FALSE, sizeof(pp_wedge));
  if (!path || !pp_path_is_finite(path))
    return out;
  guint subpath = 0;
  for (size_t i = 0; i < path->n_segs;) {
    if (path->segs[i].kind != PP_SEG_MOVE) {
      i++;
      continue;
    }
    size_t j = i + 1;
    while (j < path->n_segs && path->segs[j].kind != PP_SEG_MOVE)
      j++;
    gboolean closed;
    double size;
    g_autoptr(GArray) ring = subpath_segs(path, i, j, filled, &closed, &size);
    pp_wedge w;
    if (ring->len > 0 && read_subpath(ring, closed, size, shape, &w)) {
      w.subpath = subpath;
      g_array_append_val(out, w);
    }
    subpath++;
    i = j;
  }
  return out;
}

double pp_wedge_area(const pp_wedge *w) {
  double sweep = w->a1 - w->a0;
  if (w->kind == PP_WEDGE_ARC || w->kind == PP_WEDGE_BAND)
    return 0;
  return pp_ellipse_sector_area(w->outer.rx, w->outer.ry, 0, sweep) * (1 - w->inner * w->inner);
}

gboolean pp_wedge_join(const pp_wedge *a, const pp_wedge *b, double tol, pp_wedge *out) {
  if (a->kind != b->kind || (a->kind != PP_WEDGE_SECTOR && a->kind != PP_WEDGE_ANNULAR))
    return FALSE;
  double r = fmax(a->outer.rx, b->outer.rx);
  if (hypot(a->outer.centre.x - b->outer.centre.x, a->outer.centre.y - b->outer.centre.y) >
          tol * r ||
      fabs(a->outer.rx - b->outer.rx) > tol * r || fabs(a->outer.ry - b->outer.ry) > tol * r ||
      fabs(a->inner - b->inner) > tol)
    return FALSE;
  const pp_wedge *lo = a, *hi = b;
  double gap = remainder(b->a0 - a->a1, 2 * G_PI);
  if (fabs(gap) > tol) {
    lo = b;
    hi = a;
    gap = remainder(a->a0 - b->a1, 2 * G_PI);
    if (fabs(gap) > tol)
      return FALSE;
  }
  double sweep = (lo->a1 - lo->a0) + (hi->a1 - hi->a0);
  if (sweep > 2 * G_PI + tol)
    return FALSE;
  *out = *lo;
  out->a1 = lo->a0 + fmin(sweep, 2 * G_PI);
  out->fit_error = fmax(a->fit_error, b->fit_error);
  out->shape_fitted = a->shape_fitted || b->shape_fitted;
  return TRUE;
}
