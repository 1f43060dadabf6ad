#!/usr/bin/Rscript
# Circle charts drawn by R base graphics (corpus/r/rc_*.pdf), on pdf() and cairo_pdf():
# pie() (slices are polygons with a vertex every 1/200 turn, labels outside with a short
# leader line) and radial bars drawn with polygon(). Truth: scripts/corpus/truth.py fill,
# whose truth_circles.py computes the expected measures from the data. Runs after
# gen_r.R, which empties corpus/r first.

argv <- commandArgs(trailingOnly = FALSE)
me <- sub("^--file=", "", argv[grep("^--file=", argv)])
here <- normalizePath(dirname(me))
source(file.path(here, "r_common.R"))
seed <- 4507
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

segments_ <- c("Ferries", "Freight", "Harbour", "Charter", "Other")
cols <- c("#3b6ea5", "#e08a2c", "#5a9e4b", "#c4453c", "#8a6bb5")

r_pie <- function(name, dev, values, drawn = values, rule = NULL) {
  printed <- round(100 * values / sum(values))
  open_dev(name, dev)
  par(mar = c(1, 1, 3, 1))
  pie(drawn, labels = sprintf("%s %d%%", segments_[seq_along(values)], printed),
      col = cols, clockwise = TRUE, radius = 0.8, main = "Revenue by segment, 2031")
  bb <- box_of(-0.8, 0.8, -0.8, 0.8)
  dev.off()
  write_truth(name, dev, list(
    page = 1, bbox = bb, kind = "pie", misleading = !is.null(rule),
    rule = if (is.null(rule)) NA else rule, values = I(values),
    labels = I(segments_[seq_along(values)]), axis = NULL, baseline = NA,
    data_labels = I(printed), style = I(c("polygon-arcs", "leader-lines")),
    circle = list(drawn_values = I(drawn), printed = I(printed),
                  printed_kind = "percent", decimals = 0)))
}

# Annular sector as a polygon: clockwise from 12 o'clock over `sweep` radians.
ring <- function(ri, ro, sweep, col) {
  t <- pi / 2 - seq(0, sweep, length.out = max(2, ceiling(sweep / (2 * pi) * 200)))
  polygon(c(ro * cos(t), rev(ri * cos(t))), c(ro * sin(t), rev(ri * sin(t))),
          col = col, border = NA)
}

r_radial <- function(name, dev, values, full, equal_area, rule = NULL) {
  open_dev(name, dev)
  par(mar = c(1, 1, 3, 1))
  plot.new()
  plot.window(xlim = c(-1, 1), ylim = c(-1, 1), asp = 1)
  title(sprintf("Fleet availability, %% (full circle = %g)", full))
  rings <- list()
  ri <- 0.3; width <- 0.12; gap <- 0.04
  target <- (ri + width)^2 - ri^2
  for (i in seq_along(values)) {
    ro <- if (equal_area) sqrt(ri^2 + target) else ri + width
    ring(ri, ro, 2 * pi * values[i] / full, cols[i])
    text(-0.03, (ri + ro) / 2, sprintf("%s %g", segments_[i], values[i]), adj = 1, cex = 0.7)
    rings[[i]] <- I(c(ri, ro))
    ri <- ro + gap
  }
  ro <- rings[[length(rings)]][2]
  bb <- box_of(-ro, ro, -ro, ro)
  dev.off()
  write_truth(name, dev, list(
    page = 1, bbox = bb, kind = "radial-bar", misleading = !is.null(rule),
    rule = if (is.null(rule)) NA else rule, values = I(values),
    labels = I(segments_[seq_along(values)]), axis = NULL, baseline = NA,
    data_labels = I(values), style = I(c("polygon-arcs", if (equal_area) "equal-area")),
    circle = list(rings = rings, full_value = full)))
}

v <- c(38, 27, 17, 11, 7)
r_pie("rc_pie_honest", "pdf", v)
r_pie("rc_pie_angles_wrong", "cairo_pdf", v, drawn = c(27, 27, 20, 14, 12),
      rule = "wedges-vs-labels")
r_radial("rc_radial_bars", "pdf", c(88, 74, 61, 45), 100, FALSE, "radial-ring-ink")
r_radial("rc_radial_equal_area_honest", "cairo_pdf", c(88, 74, 61, 45), 100, TRUE)
cat("gen_r_circles: 4 files\n")
