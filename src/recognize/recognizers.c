/* recognizers.c — the table of recognizers, in the order they run: the one place that
 * says which chart families exist and which gets first claim on a page's marks and
 * labels. A new family is one file with its run function and one line here. */
#include "internal.h"

/* Axis-bound families first (their labels are a scale, not data labels), then charts
 * read from their labels alone, then lines, which take what is left beside an axis.
 * The name is also the ledger owner and the figure's "recognizer". */
const pp_recognizer pp_recognizers[] = {
    /* Solids first: their front faces are rectangles the flat bar recognizers would read
     * without their caps and sides, on the wrong plane. */
    {{"solid-bars", "3D bars: front faces with caps and sides (oblique or perspective)",
      "two or more bars whose front rectangle shares edges with cap or side faces; a fitted "
      "vertical scale beside them (read on the front plane or the back wall), or a number "
      "above every bar"},
     pp_recognize_solid_bars},
    {{"cylinder-bars", "3D bars drawn as cylinders: a body and an elliptical cap",
      "two or more bodies with straight vertical sides on one floor, each with an ellipse of "
      "its width on its top edge; a fitted vertical scale beside them"},
     pp_recognize_cylinders},
    {{"box-bars", "3D bar charts of one value over two categories (boxes on a floor)",
      "two or more boxes of six (or three visible) faces with equal vertical edges, seen in "
      "orthographic projection, not holding other boxes; a fitted vertical scale beside "
      "them. Ink is the faces seen, less what nearer boxes hide"},
     pp_recognize_boxes},
    /* Circles first: their printed shares would otherwise look like a column of ticks. */
    {{"pies", "pies and donuts: slices of one circle whose angles tile the full turn",
      "two or more sectors (or donut slices) of one radius about one centre, pulled-out "
      "slices allowed, tiling 360°; judged when every slice has a printed share or value "
      "(inside, at a leader line, or in a legend matched by colour)"},
     pp_recognize_pies},
    {{"tilted-pies",
      "pies drawn tilted (ellipse top faces, with or without a rim) or in "
      "perspective",
      "two or more non-circular sectors sharing one apex whose angles (in the un-tilted "
      "circle, or apparent in perspective) tile 360°; judged when every slice has a printed "
      "share or value"},
     pp_recognize_tilted_pies},
    {{"radial",
      "radial bars (concentric rings with one start) and polar-area charts (equal "
      "angles, radius per value)",
      "rings: two or more annular sectors about one centre, one per ring, not overlapping, "
      "starting at one angle; polar area: three or more sectors of equal angle about one "
      "apex tiling 360° with different radii; judged when each has a printed value"},
     pp_recognize_radial},
    /* Before bars: a fit over part of a mirrored scale would read one side as a chart. */
    {{"two-sided", "two-sided bars (population pyramids) from one zero line",
      "three or more rows of a bar reaching left and one reaching right from one vertical "
      "line, under or over tick labels with a 0 on that line and equal numbers mirrored "
      "about it. Counted, not judged"},
     pp_recognize_two_sided},
    {{"bars", "bars and columns standing on a shared baseline beside a fitted value axis",
      "a fitted linear or log scale; two or more bars sharing a baseline edge, not legend "
      "keys, not overlapping across the axis, the longest at least a tenth of the tick span; "
      "judged only past the non-chart tests of evidence.c (thicker than a line, lengths that "
      "differ, one width per colour, near the scale, no words on the marks or body text)"},
     pp_recognize_bars},
    /* Before areas and lines: bubbles beside an axis are neither. */
    {{"symbols", "bubbles and scaled symbols: circles or copies of one icon sized by value",
      "three or more circles (or copies of one outline) of one colour whose sizes differ by "
      "at least 1.3x, each with a number on or under it, or a size key beside them"},
     pp_recognize_symbols},
    {{"pyramids", "pyramids and funnels: stacked triangle and trapezoid slices",
      "three or more slices stacked edge to edge on one centre line, widening or narrowing "
      "throughout, at least one with sloped sides, every one with a number on its row"},
     pp_recognize_pyramids},
    {{"areas", "filled areas under a series beside a fitted vertical value axis",
      "a fitted scale; a filled non-rectangular polygon beside its labels, within its reach; "
      "judged only when its top is not flat (a rounded box) and no body text lies on it"},
     pp_recognize_areas},
    {{"labelled-bars", "bars with no value axis, each carrying its own printed number",
      "two or more bars of one width sharing a baseline edge, every one with a data label at "
      "its tip, not legend keys; judged only past the non-chart tests of evidence.c, and with "
      "labels centred on their bars, not years, not a count 1, 2, 3…, of the signs the bars' "
      "directions show"},
     pp_recognize_labelled_bars},
    {{"lines", "unfilled lines and scatter markers beside a fitted vertical value axis",
      "a fitted scale that took no bars or areas; polylines or small markers beside its "
      "labels. Counted, never judged"},
     pp_recognize_lines},
    {{"dots", "dot plots and scatter plots of one marker size beside a value axis",
      "five or more free markers of one size and colour; a fitted scale of either "
      "orientation whose ticks cover them, its labels beside them. Counted, never judged"},
     pp_recognize_dots},
};

const guint pp_n_recognizers = G_N_ELEMENTS(pp_recognizers);

const pp_recognizer_info *pp_recognizers_list(guint *n) {
  static pp_recognizer_info infos[G_N_ELEMENTS(pp_recognizers)];
  for (guint i = 0; i < G_N_ELEMENTS(pp_recognizers); i++)
    infos[i] = pp_recognizers[i].info;
  *n = G_N_ELEMENTS(pp_recognizers);
  return infos;
}
