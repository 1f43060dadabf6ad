/* sweep_edges.h — geometry-internal: the y-monotone edge pieces of the area sweep
 * (clip_area.c), built from a path's lines and cubics by sweep_edges.c. */
#pragma once

#include "internal.h"

typedef struct pp_sweep_edge pp_sweep_edge;
struct pp_sweep_edge {
  double ya, yb; /* ya < yb */
  pp_point p[4]; /* line: p[0] → p[1]; cubic: control points with y(t) non-decreasing */
  union {
    double t_hint; /* cubic: where Newton starts (the last parameter solved) */
    double slope;  /* line: dx/dy */
  };
  double kx[3], ky[3]; /* cubic: x(t) − x0 = ((kx0·t + kx1)·t + kx2)·t, likewise y */
  /* sweep state */
  size_t pos;           /* index in the active list */
  size_t hpos;          /* index in the crossing heap */
  pp_sweep_edge *right; /* the right neighbour cross_y was found with */
  double cross_y;       /* next crossing with that neighbour, +∞ if none */
  double window;        /* height of the window searched so far (see set_key) */
  double y_from;        /* ∫ c·x dy is accounted up to here */
  double end_y, end_t;  /* the last search window end solved, its parameter (NaN: none) */
  guint region;
  gint8 dir;      /* +1 when the original edge ran towards larger y */
  gint8 c;        /* +1 right end of an inside run, −1 left end, 0 neither */
  guint8 curve;   /* a cubic piece (else a line) */
  guint8 recheck; /* cross_y only ends the window searched so far */
};

/* de Casteljau split at t: left half into l, right half into r (either may be NULL). */
void pp_bez_split(const pp_point *p, double t, pp_point *l, pp_point *r);
/* Appends the path's edges, each subpath closed as a fill closes it, cut into y-monotone
 * pieces (horizontal ones dropped: they bound no area), to edges (of pp_sweep_edge). */
void pp_sweep_edges_add_path(GArray *edges, const pp_path *path, guint region);
/* Sorts n pieces by their bottom y (ya), or top y (yb) when by_top, and lists those y in
 * keys (n of them): stable, in O(n). */
void pp_sweep_edges_sort(pp_sweep_edge **v, double *keys, size_t n, gboolean by_top);

/* Resolution of the sweep: heights closer than eps_y are one; x closer than tol_x ties. */
typedef struct {
  double eps_y, tol_x;
} pp_sweep_tol;

/* x of a piece at height y (clamped to its ends); Newton from the piece's last answer. */
double pp_sweep_edge_x(pp_sweep_edge *e, double y);
/* ∫ (x − xref) dy along the piece over [y0, y1] within its y-range, in closed form. */
double pp_sweep_edge_integral(pp_sweep_edge *e, double y0, double y1, double xref);
/* First y ≥ y0 (up to y1) where r passes to the left of its left neighbour l, +∞ if none;
 * just: they have just changed places, so rounding at that crossing is no new one
 * (sweep_cross.c). */
double pp_sweep_next_flip(const pp_sweep_tol *tol, pp_sweep_edge *l, pp_sweep_edge *r, double y0,
                          double y1, gboolean just);
