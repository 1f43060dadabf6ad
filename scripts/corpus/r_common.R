# Shared by the R corpus generators (gen_r.R, gen_r_circles.R, gen_r_shapes.R), which
# source it after setting `here`: where the output goes, a small JSON writer (jsonlite is
# not part of r-base-core) and the truth file writer that hands each figure to truth.py.

root <- if (nzchar(Sys.getenv("PP_CORPUS_ROOT"))) Sys.getenv("PP_CORPUS_ROOT") else
  normalizePath(file.path(here, "..", ".."))
out_dir <- file.path(root, "corpus", "r")
truth_py <- file.path(here, "truth.py")
dir.create(out_dir, showWarnings = FALSE, recursive = TRUE)

# Vectors wrapped in I() are always arrays; bare length-1 values are scalars.
to_json <- function(x) {
  if (is.null(x)) return("null")
  if (is.list(x) && !is.null(names(x))) {
    items <- mapply(function(k, v) paste0("\"", k, "\": ", to_json(v)),
                    names(x), x)
    return(paste0("{", paste(items, collapse = ", "), "}"))
  }
  if (is.list(x))
    return(paste0("[", paste(vapply(x, to_json, ""), collapse = ", "), "]"))
  one <- function(v) {
    if (is.na(v)) return("null")
    if (is.logical(v)) return(if (v) "true" else "false")
    if (is.character(v))
      return(paste0("\"", gsub("\"", "\\\\\"", gsub("\\\\", "\\\\\\\\", v)),
                    "\""))
    format(v, digits = 15)
  }
  parts <- vapply(as.list(unclass(x)), one, "")
  if (inherits(x, "AsIs") || length(x) != 1)
    return(paste0("[", paste(parts, collapse = ", "), "]"))
  parts
}

# corpus/r/<name>.truth.json: the figures as drawn, completed by truth.py fill with the
# measures it computes from the data. Returns the number of figures.
write_truth_file <- function(name, dev, seed, pages, figs) {
  t <- list(file = paste0("corpus/r/", name, ".pdf"),
            producer = sprintf("R %s %s()", getRversion(), dev),
            seed = seed, pages = pages, figures = figs)
  tmp <- tempfile(fileext = ".json")
  writeLines(to_json(t), tmp, useBytes = TRUE)
  dst <- file.path(out_dir, paste0(name, ".truth.json"))
  rc <- system2("/usr/bin/python3", c(truth_py, "fill"), stdin = tmp,
                stdout = dst)
  unlink(tmp)
  if (rc != 0) stop("truth.py fill failed for ", name)
  length(figs)
}
