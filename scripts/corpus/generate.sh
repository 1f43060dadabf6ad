#!/bin/sh
# Regenerate the plotproof test corpus (corpus/<producer>/) from real plotting
# software; each producer is skipped with a message when it is not installed.
# With PP_CORPUS_ROOT=DIR everything is written under DIR/corpus/ instead, leaving the
# checkout alone (scripts/test compares that copy with the committed one).
# usage: generate.sh [MESON_BUILD_DIR]
set -u
here=$(cd "$(dirname "$0")" && pwd)
root=${PP_CORPUS_ROOT:-$(cd "$here/../.." && pwd)}
export PP_CORPUS_ROOT="$root"
build=""
[ $# -ge 1 ] && build=$(cd "$1" && pwd)
py=/usr/bin/python3
status=0

if [ -x "$py" ] && "$py" -c 'import matplotlib' 2>/dev/null; then
	"$py" "$here/gen_matplotlib.py" || status=1
	"$py" "$here/gen_shapes_matplotlib.py" || status=1
	"$py" "$here/gen_size_keys_matplotlib.py" || status=1
else
	echo "skip matplotlib: /usr/bin/python3 with matplotlib not found" >&2
fi

if [ -x "$py" ] && "$py" -c 'import matplotlib' 2>/dev/null; then
	"$py" "$here/gen_lookalikes.py" || status=1
else
	echo "skip lookalikes: /usr/bin/python3 with matplotlib not found" >&2
fi

if command -v gnuplot >/dev/null 2>&1 && [ -x "$py" ]; then
	"$py" "$here/gen_gnuplot.py" || status=1
	"$py" "$here/gen_shapes_gnuplot.py" || status=1
else
	echo "skip gnuplot: gnuplot not installed" >&2
fi

if command -v Rscript >/dev/null 2>&1 && [ -x "$py" ]; then
	Rscript "$here/gen_r.R" || status=1
else
	echo "skip R: Rscript not installed" >&2
fi

if command -v soffice >/dev/null 2>&1 && command -v pdftocairo >/dev/null 2>&1 && [ -x "$py" ]; then
	"$py" "$here/gen_libreoffice.py" || status=1
else
	echo "skip libreoffice: soffice (or pdftocairo) not installed" >&2
fi

if command -v pdflatex >/dev/null 2>&1 && kpsewhich pgfplots.sty >/dev/null 2>&1 && [ -x "$py" ]; then
	"$py" "$here/gen_pgfplots.py" || status=1
else
	echo "skip pgfplots: pdflatex or pgfplots.sty not found" >&2
fi

# The cairo generator is a C program built by meson; pass the build dir.
if [ -n "$build" ] && [ -x "$build/scripts/gen-corpus-cairo" ]; then
	mkdir -p "$root/corpus/cairo"
	(cd "$root" && "$build/scripts/gen-corpus-cairo" corpus/cairo) || status=1
else
	echo "skip cairo: pass a meson build dir containing scripts/gen-corpus-cairo" >&2
fi
if [ -x "$py" ] && "$py" -c 'import cairo' 2>/dev/null; then
	"$py" "$here/gen_shapes_cairo.py" || status=1
else
	echo "skip cairo shapes: /usr/bin/python3 with pycairo (python3-cairo) not found" >&2
fi

# Circle charts (pies, donuts, tilted pies, radial bars, lookalikes): last, because the
# generators above empty their directories first.
if [ -x "$py" ] && "$py" -c 'import matplotlib' 2>/dev/null; then
	"$py" "$here/gen_matplotlib_circles.py" || status=1
fi
if command -v gnuplot >/dev/null 2>&1 && [ -x "$py" ]; then
	"$py" "$here/gen_gnuplot_circles.py" || status=1
fi
if command -v Rscript >/dev/null 2>&1 && [ -x "$py" ]; then
	Rscript "$here/gen_r_circles.R" || status=1
	Rscript "$here/gen_r_shapes.R" || status=1
fi
if [ -x "$py" ] && "$py" -c 'import cairo' 2>/dev/null; then
	"$py" "$here/gen_cairo_circles.py" || status=1
else
	echo "skip cairo circles: python3-cairo not installed" >&2
fi

for d in matplotlib gnuplot r libreoffice pgfplots cairo lookalikes; do
	if [ -d "$root/corpus/$d" ]; then
		"$py" "$here/truth.py" check "$root/corpus/$d" || status=1
	fi
done
exit $status
