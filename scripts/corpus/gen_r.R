#!/usr/bin/Rscript
# Generate the R part of the plotproof corpus (corpus/r/) with base graphics
# on both pdf() and cairo_pdf(). Plot boxes and axis limits are read back from
# R (grconvert*, par("usr")); expected measures come from truth.py fill.

argv <- commandArgs(trailingOnly = FALSE)
me <- sub("^--file=", "", argv[grep("^--file=", argv)])
here <- normalizePath(dirname(me))
source(file.path(here, "r_common.R"))
unlink(list.files(out_dir, pattern = "\\.(pdf|json)$", full.names = TRUE))

years <- as.character(2016:2023)
orchards <- c("Oakhollow", "Fenwick Rise", "Pellmoor", "Crane Hill",
              "Latchford", "Amberley Cross")

write_truth <- write_truth_file

# ---- helpers ----
nice_floor <- function(x) { s <- 10^(floor(log10(x)) - 1); floor(x / s) * s }
nice_ceil <- function(x) { s <- 5 * 10^(floor(log10(x)) - 1); ceiling(x / s) * s }
axis_floor <- function(v, trunc)
  switch(trunc, none = 0, mild = nice_floor(0.5 * min(v)),
         severe = nice_floor(0.9 * min(v)))
trunc_tags <- function(trunc) if (trunc == "none") character(0) else
  c("truncated-axis", trunc)

make_values <- function(n, lo, hi, dec = 0) {
  start <- runif(1, lo, lo + 0.25 * (hi - lo))
  end <- runif(1, lo + 0.75 * (hi - lo), hi)
  v <- round(start + (seq_len(n) - 1) / (n - 1) * (end - start) +
             runif(n, -0.05, 0.05) * (hi - lo), dec)
  if (v[1] == v[n]) v[n] <- round(v[n] * 1.1, dec)
  v
}

fmt_fun <- function(fmt) switch(fmt,
  plain = function(t) format(t, trim = TRUE),
  thousands = function(t) format(t, big.mark = ",", scientific = FALSE,
                                 trim = TRUE),
  usd = function(t) paste0("$", format(t, big.mark = ",", trim = TRUE,
                                       scientific = FALSE)),
  eur = function(t) paste0(format(t, big.mark = ".", decimal.mark = ",",
                                  trim = TRUE, scientific = FALSE),
                           " \u20ac"),
  percent = function(t) paste0(format(t, trim = TRUE), "%"),
  comma = function(t) format(t, nsmall = 1, decimal.mark = ",", trim = TRUE))
fmt_tags <- function(fmt) switch(fmt, plain = character(0),
  thousands = "thousands-sep", usd = c("currency", "thousands-sep"),
  eur = c("currency", "thousands-sep", "decimal-comma"),
  percent = "percent", comma = "decimal-comma")

W <- 6.5; H <- 4.5
open_dev <- function(dev, name, w = W, h = H) {
  path <- file.path(out_dir, paste0(name, ".pdf"))
  if (dev == "pdf") pdf(path, width = w, height = h, useDingbats = FALSE,
                        title = "Oakhollow Cider Co.")
  else cairo_pdf(path, width = w, height = h, onefile = TRUE)
}

# Current plot region in PDF points, origin top-left.
plot_box <- function(w = W, h = H) {
  x <- grconvertX(c(0, 1), "npc", "ndc")
  y <- grconvertY(c(0, 1), "npc", "ndc")
  round(c(x[1] * w * 72, (1 - y[2]) * h * 72, x[2] * w * 72,
          (1 - y[1]) * h * 72), 2)
}

axis_now <- function(orientation, log = FALSE) {
  u <- par("usr")
  r <- if (orientation == "y") u[3:4] else u[1:2]
  if (log) r <- 10^r
  list(min = r[1], max = r[2], scale = if (log) "log" else "linear",
       orientation = orientation)
}

ticks_in <- function(lo, hi) { t <- pretty(c(lo, hi)); t[t >= lo & t <= hi] }

fig_entry <- function(kind, mis, rule, vals, labels, axis, baseline, style,
                      page = 1, extra = list()) {
  f <- list(page = page, bbox = I(plot_box()), kind = kind,
            misleading = mis, rule = if (is.null(rule)) NA else rule,
            values = I(vals), labels = I(labels), axis = axis,
            baseline = if (is.null(baseline)) NA else baseline,
            data_labels = NULL, style = I(c(style, "base-graphics")))
  for (k in names(extra)) f[[k]] <- extra[[k]]
  f
}

# ---- chart drawers (draw on the current device, return a figure entry) ----
draw_columns <- function(vals, labels, trunc, fmt, style, yaxs = "r",
                         title = "Oakhollow Cider Co. - barrels", page = 1) {
  lo <- axis_floor(vals, trunc); hi <- nice_ceil(max(vals) * 1.1)
  n <- length(vals)
  las <- if ("rotated-labels" %in% style) 2 else 1
  par(mar = c(if (las == 2) 7 else 4, 5.5, 3, 1))
  col <- if ("alpha" %in% style) adjustcolor("#2b6c8f", 0.5) else "#2b6c8f"
  border <- if ("edge-strokes" %in% style) "black" else NA
  density <- if ("hatch" %in% style) 18 else NULL
  add <- FALSE
  if ("gridlines" %in% style) {
    plot.new()
    plot.window(xlim = c(0.2, 1.2 * n), ylim = c(lo, hi), yaxs = yaxs)
    abline(h = ticks_in(lo, hi), col = "grey80")
    add <- TRUE
  }
  nm <- if (n >= 30) ifelse(seq_len(n) %% 6 == 1, labels, "") else labels
  barplot(vals, names.arg = nm, ylim = c(lo, hi), xpd = FALSE, col = col,
          border = border, density = density, angle = 45, yaxt = "n",
          yaxs = yaxs, las = las, add = add, main = title,
          space = if (n >= 30) 0.3 else 0.2, cex.names = 0.8)
  if (add) title(main = title)  # barplot(add = TRUE) skips the title
  tk <- ticks_in(lo, hi)
  axis(2, at = tk, labels = fmt_fun(fmt)(tk), las = 1)
  if (yaxs == "i") box()
  u <- par("usr")[3]
  base <- if (lo == 0) 0 else u  # truncated bars are clipped at the box
  mis <- lo != 0
  fig_entry("column", mis, if (mis) "bars-off-zero" else NULL, vals, labels,
            axis_now("y"), base,
            c(style, fmt_tags(fmt), trunc_tags(trunc), if (mis) "clipped"),
            page)
}

draw_hbars <- function(vals, labels, trunc, style) {
  lo <- axis_floor(vals, trunc); hi <- nice_ceil(max(vals) * 1.1)
  par(mar = c(4, 8, 3, 1))
  border <- if ("edge-strokes" %in% style) "black" else NA
  # barplot stacks horizontal bars bottom-up; reverse so the first is on top
  barplot(rev(vals), names.arg = rev(labels), horiz = TRUE, xlim = c(lo, hi),
          xpd = FALSE, col = "#d9822b", border = border, las = 1,
          main = "Pellmoor Orchards - crates", cex.names = 0.8)
  if (lo != 0) box()
  base <- if (lo == 0) 0 else par("usr")[1]
  mis <- lo != 0
  fig_entry("bar", mis, if (mis) "bars-off-zero" else NULL, vals, labels,
            axis_now("x"), base,
            c(style, trunc_tags(trunc), if (mis) "clipped"))
}

draw_area <- function(vals, labels, trunc, floor_at_min, style) {
  lo <- axis_floor(vals, trunc); hi <- nice_ceil(max(vals) * 1.1)
  n <- length(vals); x <- seq_len(n)
  par(mar = c(4, 5, 3, 1))
  plot(x, vals, type = "n", ylim = c(lo, hi), xaxt = "n", xlab = "",
       ylab = "Litres", yaxs = "i", xaxs = "i", las = 1,
       main = "Fenwick Rise Press - juice")
  fl <- if (floor_at_min) lo else 0
  col <- if ("alpha" %in% style) adjustcolor("#3f7f5f", 0.45) else "#3f7f5f"
  polygon(c(x[1], x, x[n]), c(fl, vals, fl), col = col, border = NA)
  lines(x, vals, lwd = 1.5)
  axis(1, at = x, labels = labels)
  mis <- lo != 0
  fig_entry("area", mis, if (mis) "area-off-zero" else NULL, vals, labels,
            axis_now("y"), lo,
            c(style, trunc_tags(trunc), if (floor_at_min) "floor-at-axis-min"))
}

draw_matrix <- function(m, cats, trunc, beside) {
  vals <- if (beside) as.vector(m) else colSums(m)
  labs <- if (beside) as.vector(outer(rownames(m), cats,
                                      function(s, c) paste0(c, "/", s)))
          else cats
  lo <- axis_floor(vals, trunc); hi <- nice_ceil(max(vals) * 1.2)
  par(mar = c(4, 5, 3, 1))
  barplot(m, beside = beside, names.arg = cats, ylim = c(lo, hi),
          xpd = FALSE, col = c("#2b6c8f", "#d9822b", "#5a9e4b")[seq_len(nrow(m))],
          legend.text = rownames(m), args.legend = list(x = "topleft",
                                                        cex = 0.8),
          las = 1, main = "Crane Hill Growers - sales")
  if (lo != 0) box()
  base <- if (lo == 0) 0 else par("usr")[3]
  mis <- lo != 0
  series <- lapply(rownames(m), function(s) list(name = s, values = I(m[s, ])))
  fig_entry("column", mis, if (mis) "bars-off-zero" else NULL, vals, labs,
            axis_now("y"), base,
            c(if (beside) "grouped" else "stacked", "edge-strokes",
              trunc_tags(trunc), if (mis) "clipped"),
            extra = list(series = series))
}

draw_log <- function(vals, labels, yaxs) {
  hi <- 10^ceiling(log10(max(vals) * 1.2))
  par(mar = c(4, 5, 3, 1))
  # barplot starts log bars at ylim[1] (its rectbase), not at the axis edge
  barplot(vals, names.arg = labels, log = "y", ylim = c(10, hi), yaxs = yaxs,
          col = "#8e5aa8", las = 1, main = "Latchford Seeds - packets (log)")
  box()
  fig_entry("column", TRUE, "bars-on-log", vals, labels,
            axis_now("y", log = TRUE), 10, c("log", "edge-strokes"))
}

draw_labelled <- function(labs, drawn, labels, hidden) {
  hi <- nice_ceil(max(drawn) * 1.15)
  par(mar = c(4, 5, 3, 1))
  bp <- barplot(drawn, names.arg = labels, ylim = c(0, hi), col = "#2b6c8f",
                border = NA, axes = !hidden, las = 1,
                main = "Amberley Mill - sacks")
  text(bp, drawn, labels = format(labs, big.mark = ","), pos = 3, cex = 0.9)
  liar <- any(drawn != labs)
  ax <- axis_now("y")
  extra <- list(data_labels = I(labs))
  if (liar) extra$drawn_values <- I(drawn)
  if (hidden) extra$axis_hidden <- ax
  f <- fig_entry("column", liar, if (liar) "bars-vs-labels" else NULL, labs,
                 labels, if (hidden) NULL else ax, 0,
                 if (hidden) "data-labels-only" else "data-labels",
                 extra = extra)
  f
}

draw_negative <- function(vals, labels, horiz) {
  par(mar = c(4, if (horiz) 8 else 5, 3, 1))
  col <- ifelse(vals < 0, "#b03a2e", "#2b6c8f")
  if (horiz) {
    barplot(rev(vals), names.arg = rev(labels), horiz = TRUE, col = rev(col),
            las = 1, main = "Oakhollow Cider Co. - margin", cex.names = 0.8)
    abline(v = 0)
  } else {
    barplot(vals, names.arg = labels, col = col, las = 1,
            main = "Oakhollow Cider Co. - margin")
    abline(h = 0)
  }
  fig_entry(if (horiz) "bar" else "column", FALSE, NULL, vals, labels,
            axis_now(if (horiz) "x" else "y"), 0, "negative")
}

draw_line <- function(vals, labels, trunc, type, scatter = FALSE) {
  lo <- axis_floor(vals, trunc); hi <- nice_ceil(max(vals) * 1.1)
  par(mar = c(4, 5, 3, 1))
  if (scatter) {
    x <- runif(length(vals), 0, 10)
    plot(x, vals, ylim = c(lo, hi), pch = 19, cex = 0.6, las = 1,
         xlab = "Hours of sun", ylab = "Yield", main = "Crane Hill - yield")
    labels <- paste0("p", seq_along(vals))
  } else {
    plot(seq_along(vals), vals, type = type, ylim = c(lo, hi), xaxt = "n",
         las = 1, xlab = "", ylab = "Index", lwd = 2,
         main = "Fenwick Rise - index")
    axis(1, at = seq_along(vals), labels = labels)
  }
  fig_entry("line", FALSE, NULL, vals, labels, axis_now("y"), NULL,
            c(trunc_tags(trunc), if (scatter) "scatter",
              if (type == "b") "markers"))
}

# ---- corpus plan ----
total <- 0
seed <- 900
one <- function(name, dev, seed, draw) {
  open_dev(dev, name)
  f <- draw()
  dev.off()
  write_truth(name, dev, seed, 1, list(f))
}

families <- list(
  list("r_col_plain", "plain", character(0), "r", 400, 900, 0, "pdf"),
  list("r_col_plain_cairo", "plain", character(0), "r", 400, 900, 0, "cairo"),
  list("r_col_thousands_grid", "thousands", c("gridlines", "edge-strokes"),
       "r", 12000, 48000, 0, "pdf"),
  list("r_col_eur", "eur", "edge-strokes", "i", 2400, 9800, 0, "cairo"),
  list("r_col_percent_hatch", "percent", c("hatch", "edge-strokes"), "r",
       22, 64, 0, "pdf"),
  list("r_col_comma_alpha", "comma", "alpha", "r", 1.2, 4.8, 1, "cairo"),
  list("r_col_usd_box", "usd", character(0), "i", 1200, 5400, 0, "pdf"),
  list("r_col_rotated", "plain", "rotated-labels", "r", 300, 800, 0, "cairo"))
for (fam in families) {
  seed <- seed + 1
  set.seed(seed)
  labels <- if ("rotated-labels" %in% fam[[3]]) month.name else years[1:7]
  vals <- make_values(length(labels), fam[[5]], fam[[6]], fam[[7]])
  for (tr in c("none", "mild", "severe")) {
    suf <- c(none = "honest", mild = "trunc_mild", severe = "trunc_severe")[tr]
    nm <- paste0(fam[[1]], "_", suf)
    total <- total + one(nm, fam[[8]], seed, function()
      draw_columns(vals, labels, tr, fam[[2]], fam[[3]], fam[[4]]))
  }
}

seed <- seed + 1; set.seed(seed)
vals <- make_values(45, 500, 1500)
labs <- sprintf("W%02d", 1:45)
for (tr in c("none", "severe"))
  total <- total + one(paste0("r_col_many_", tr), "pdf", seed, function()
    draw_columns(vals, labs, tr, "plain", "many-bars"))

for (dev in c("pdf", "cairo")) {
  seed <- seed + 1; set.seed(seed)
  vals <- make_values(6, 200, 700)
  st <- if (dev == "pdf") "edge-strokes" else character(0)
  for (tr in c("none", "mild", "severe"))
    total <- total + one(sprintf("r_hbar_%s_%s", dev, tr), dev, seed,
                         function() draw_hbars(vals, orchards, tr, st))
}

seed <- seed + 1; set.seed(seed)
vals <- make_values(8, 300, 900)
for (tr in c("none", "mild", "severe"))
  total <- total + one(paste0("r_area_", tr), "pdf", seed, function()
    draw_area(vals, years, tr, FALSE, character(0)))
seed <- seed + 1; set.seed(seed)
vals <- make_values(8, 300, 900)
for (tr in c("mild", "severe"))
  total <- total + one(paste0("r_area_floor_", tr), "cairo", seed, function()
    draw_area(vals, years, tr, TRUE, "alpha"))

for (beside in c(FALSE, TRUE)) {
  seed <- seed + 1; set.seed(seed)
  k <- if (beside) 2 else 3
  m <- rbind(Cider = make_values(6, 300, 600), Perry = make_values(6, 100, 250),
             Vinegar = make_values(6, 40, 90))[1:k, ]
  dev <- if (beside) "cairo" else "pdf"
  for (tr in c("none", "severe"))
    total <- total + one(sprintf("r_%s_%s", if (beside) "grouped" else
                                 "stacked", tr), dev, seed,
                         function() draw_matrix(m, years[1:6], tr, beside))
}

for (k in 1:2) {
  seed <- seed + 1; set.seed(seed)
  vals <- sort(round(10^runif(6, 1.6, 3.6)))
  dev <- c("pdf", "cairo")[k]
  total <- total + one(sprintf("r_log_%d", k), dev, seed, function()
    draw_log(vals, years[1:6], c("i", "r")[k]))
  total <- total + one(sprintf("r_log_%d_honest_linear", k), dev, seed,
                       function() draw_columns(vals, years[1:6], "none",
                                               "thousands", character(0)))
}

for (k in 1:2) {
  seed <- seed + 1; set.seed(seed)
  labs <- make_values(5, 400, 900)
  drawn <- round(labs[1] * 0.45 + (labs - labs[1]) * 1.6)
  dev <- c("pdf", "cairo")[k]
  hidden <- k == 1
  total <- total + one(sprintf("r_labels_%d_liar", k), dev, seed, function()
    draw_labelled(labs, drawn, years[1:5], hidden))
  total <- total + one(sprintf("r_labels_%d_honest", k), dev, seed,
                       function() draw_labelled(labs, labs, years[1:5],
                                                hidden))
}

for (k in 1:2) {
  seed <- seed + 1; set.seed(seed)
  vals <- round(runif(6, -40, 60))
  if (vals[1] == 0) vals[1] <- 5
  total <- total + one(sprintf("r_negative_%d", k), c("pdf", "cairo")[k],
                       seed, function() draw_negative(vals, orchards, k == 2))
}

seed <- seed + 1; set.seed(seed)
vals <- make_values(8, 90, 99, 1)
total <- total + one("r_line_severe", "pdf", seed, function()
  draw_line(vals, years, "severe", "l"))
total <- total + one("r_line_mild_markers", "cairo", seed, function()
  draw_line(vals, years, "mild", "b"))
seed <- seed + 1; set.seed(seed)
vals <- make_values(40, 300, 900)
total <- total + one("r_scatter", "pdf", seed, function()
  draw_line(vals, NULL, "severe", "p", scatter = TRUE))

# 2x2 on one page, both devices
for (dev in c("pdf", "cairo")) {
  seed <- seed + 1; set.seed(seed)
  nm <- paste0("r_multi_2x2_", dev)
  open_dev(dev, nm, 8.27, 6.5)
  W <- 8.27; H <- 6.5
  par(mfrow = c(2, 2))
  figs <- list(
    draw_columns(make_values(6, 300, 900), years[1:6], "none", "plain",
                 character(0)),
    draw_columns(make_values(6, 300, 900), years[1:6], "severe", "plain",
                 character(0)),
    draw_area(make_values(6, 300, 900), years[1:6], "mild", FALSE,
              character(0)),
    draw_line(make_values(6, 300, 900), years[1:6], "severe", "l"))
  figs <- lapply(figs, function(f) {
    f$style <- I(c(f$style, "multi-chart-page")); f })
  dev.off()
  W <- 6.5; H <- 4.5
  total <- total + write_truth(nm, dev, seed, 1, figs)
}

# multi-page pdf(): honest, truncated, area
seed <- seed + 1; set.seed(seed)
open_dev("pdf", "r_multipage")
v <- make_values(6, 12000, 48000)
figs <- list()
figs[[1]] <- draw_columns(v, years[1:6], "none", "thousands", "multi-page", page = 1)
figs[[2]] <- draw_columns(v, years[1:6], "severe", "thousands", "multi-page", page = 2)
f3 <- draw_area(make_values(6, 300, 900), years[1:6], "severe", FALSE,
                "multi-page")
f3$page <- 3
figs[[3]] <- f3
invisible(dev.off())
total <- total + write_truth("r_multipage", "pdf", seed, 3, figs)

cat(sprintf("R: %d figures\n", total))
