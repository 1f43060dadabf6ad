#!/usr/bin/Rscript
# Shape charts drawn by R base graphics (corpus/r/rs_*.pdf), on pdf() and cairo_pdf():
# bubbles drawn with symbols(circles = ...) sized by radius (misleading) or by the square
# root of the value (area ∝ value, honest), each with its number printed on it; pyramids
# and funnels drawn with polygon(), cut at heights ∝ values (misleading) or at depths
# ∝ sqrt(cumulative share) (honest: areas ∝ values). Truth: scripts/corpus/truth.py fill,
# whose truth_shapes.py computes the expected measures from the data and the geometry
# chosen from it. Runs after gen_r.R, which empties corpus/r first.

argv <- commandArgs(trailingOnly = FALSE)
me <- sub("^--file=", "", argv[grep("^--file=", argv)])
here <- normalizePath(dirname(me))
source(file.path(here, "r_common.R"))
seed <- 4611
W <- 6; H <- 5  # inches

write_truth <- function(name, dev, fig) write_truth_file(name, dev, seed, 1, list(fig))

open_dev <- function(name, dev) {
  path <- file.path(out_dir, paste0(name, ".pdf"))
  if (dev == "pdf") pdf(path, width = W, height = H, useDingbats = FALSE)
  else cairo_pdf(path, width = W, height = H)
}

# Box of user coordinates [x0, x1] × [y0, y1] in points, origin top-left.
box_of <- function(x0, x1, y0, y1) {
  xs <- grconvertX(c(x0, x1), "user", "ndc") * W * 72
  ys <- (1 - grconvertY(c(y1, y0), "user", "ndc")) * H * 72
  I(round(c(xs[1], ys[1], xs[2], ys[2]), 2))
}

tiers <- c("Seedlings", "Saplings", "Young trees", "Mature trees")
stages <- c("Enquiries", "Site visits", "Proposals", "Shortlisted", "Signed")

# symbols() scales the radii so that the largest is `inches` wide; by = "radius" gives
# radius ∝ value (area ∝ value², misleading), by = "area" radius ∝ sqrt(value).
r_bubbles <- function(name, dev, values, by) {
  n <- length(values)
  xs <- ((seq_len(n) - 1) %% 4) * 2.5 + 1.5
  ys <- ((seq_len(n) - 1) %/% 4) * 3.2 + 2
  rad <- if (by == "radius") values else sqrt(values)
  open_dev(name, dev)
  par(mar = c(4, 4, 3, 1))
  plot(NA, xlim = c(0, 10.5), ylim = c(0, 8), xlab = "Yield per hectare (t)",
       ylab = "Sugar content (Brix)", main = "Orchard plots: bubble size = pickers employed")
  symbols(xs, ys, circles = rad, inches = 0.45, add = TRUE, bg = "#8e5aa8", fg = NA)
  text(xs, ys, labels = values, cex = 0.8)
  bb <- box_of(par("usr")[1], par("usr")[2], par("usr")[3], par("usr")[4])
  dev.off()
  write_truth(name, dev, list(
    page = 1, bbox = bb, kind = "bubble", misleading = by != "area",
    rule = if (by == "area") NA else "symbols-not-by-area", values = I(values),
    labels = I(sprintf("plot %d", seq_len(n))), axis = NULL, baseline = NA,
    data_labels = I(values), style = I(c("symbols", paste0("by-", by), "data-labels")),
    symbols = list(measure = "radius", sizes = I(rad), shape = "circle")))
}

# A triangle (apex up) cut into slices, top to bottom, drawn with polygon().
r_pyramid <- function(name, dev, values, honest, funnel = FALSE) {
  Hh <- 10; Wb <- 8
  # cut from the apex: the top slice first for a pyramid, the bottom one for a funnel
  # (apex down, widest and first value on top)
  from_apex <- if (funnel) rev(values) else values
  share <- cumsum(from_apex) / sum(from_apex)
  depth <- c(0, Hh * (if (honest) sqrt(share) else share))
  open_dev(name, dev)
  par(mar = c(1, 1, 3, 1))
  plot.new()
  plot.window(xlim = c(-Wb / 2, Wb / 2 + 4), ylim = c(0, Hh))
  title(if (funnel) "Buyer funnel, Kestrel Orchards" else "Orchard stock by tier")
  shape <- list()
  names_ <- if (funnel) rev(stages[seq_along(values)]) else tiers[seq_along(values)]
  cols <- c("#2b6c8f", "#d9822b", "#5a9e4b", "#8e5aa8", "#c4453c")
  for (i in seq_along(from_apex)) {
    h1 <- depth[i]; h2 <- depth[i + 1]
    a1 <- Wb / 2 * h1 / Hh; a2 <- Wb / 2 * h2 / Hh
    y <- if (funnel) c(h1, h1, h2, h2) else Hh - c(h1, h1, h2, h2)
    polygon(c(-a1, a1, a2, -a2), y, col = cols[i], border = "white")
    mid <- mean(y)
    text(0, mid, from_apex[i], col = "white", cex = 0.8)
    text(Wb / 2 + 0.3, mid, names_[i], adj = 0, cex = 0.8)
    # [top width, bottom width, height] as drawn
    shape[[i]] <- I(if (funnel) c(2 * a2, 2 * a1, h2 - h1) else c(2 * a1, 2 * a2, h2 - h1))
  }
  if (funnel) shape <- rev(shape)  # top to bottom, the order of values
  names_ <- if (funnel) stages else tiers
  bb <- box_of(-Wb / 2, Wb / 2, 0, Hh)
  dev.off()
  write_truth(name, dev, list(
    page = 1, bbox = bb, kind = "pyramid", misleading = !honest,
    rule = if (honest) NA else "slices-vs-values", values = I(values),
    labels = I(names_[seq_along(values)]), axis = NULL, baseline = NA,
    data_labels = I(values),
    style = I(c("polygon", if (funnel) "funnel" else "triangle")),
    slices = list(shape = shape, solid = "cone", order = "top-to-bottom")))
}

bub <- c(6, 14, 23, 31, 40, 52, 58)
# cairo draws a circle under about 4 pt of radius with two Bézier curves, ink about 2%
# over πr² (seen here): the cairo twins keep every radius above that.
bub_c <- c(11, 14, 23, 31, 40, 52, 58)
tiers_v <- c(12, 21, 30, 37)
funnel_v <- c(41, 27, 16, 10, 6)
# Held-out corpora (scripts/holdout sets PP_CORPUS_SEED_OFFSET): other invented values of
# the same shapes, each set spanning a wide range so that the misleading twins stay
# misleading (the committed corpus keeps the values above).
offset <- as.integer(Sys.getenv("PP_CORPUS_SEED_OFFSET", "0"))
if (!is.na(offset) && offset != 0) {
  set.seed(seed + offset)
  spread <- function(n, lo, hi) sort(c(lo + sample(0:3, 1), hi - sample(0:3, 1),
                                       sample((lo + 5):(hi - 5), n - 2)))
  bub <- spread(7, 6, 60)
  bub_c <- spread(7, 11, 60)
  tiers_v <- spread(4, 8, 40)
  funnel_v <- rev(spread(5, 5, 45))
}
r_bubbles("rs_bubbles_radius", "pdf", bub, "radius")
r_bubbles("rs_bubbles_area", "pdf", bub, "area")
r_bubbles("rs_bubbles_radius_cairo", "cairo_pdf", rev(bub_c), "radius")
r_bubbles("rs_bubbles_area_cairo", "cairo_pdf", rev(bub_c), "area")
r_pyramid("rs_pyramid_heights", "pdf", tiers_v, FALSE)
r_pyramid("rs_pyramid_areas", "pdf", tiers_v, TRUE)
r_pyramid("rs_funnel_heights", "cairo_pdf", funnel_v, FALSE, funnel = TRUE)
r_pyramid("rs_funnel_areas", "cairo_pdf", funnel_v, TRUE, funnel = TRUE)
cat("gen_r_shapes: 8 files\n")
