#!/usr/bin/python3
"""Ground-truth helper for the plotproof corpus (format: docs/corpus.md).
Computes expected Lie Factor / GDI measures from the drawn data so that every
generator (Python, gnuplot, R, cairo via the CLI) uses the same formulas."""

import json
import math
import os
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import truth_shapes  # noqa: E402  (3D bars, pyramids, bubbles)

KINDS = {"column", "bar", "area", "line", "raster", "table", "text", "other"} | truth_shapes.KINDS
RULES = {"bars-off-zero", "area-off-zero", "bars-on-log", "bars-vs-labels",
         None} | truth_shapes.RULES
INK_KINDS = {"column", "bar", "area"}
# Circle charts (truth_circles.py): pies, tilted pies, radial bars, polar areas.
import truth_circles  # noqa: E402
KINDS |= truth_circles.KINDS
RULES |= truth_circles.RULES


def _graphic_sizes(fig):
    """Return (v, g): data values and the ink size of each mark.

    Linear: ink is proportional to value minus the baseline the mark starts
    from. Log axis: ink is proportional to log(v) - log(baseline), because the
    drawn length is measured in log space from where the bar starts (normally
    the bottom of the plot box, i.e. the axis minimum)."""
    v = list(fig["values"])
    drawn = list(fig.get("drawn_values") or v)
    base = fig["baseline"]
    axis = fig.get("axis") or fig.get("axis_hidden") or {}
    if axis.get("scale") == "log":
        lo = math.log10(base)
        g = [math.log10(d) - lo for d in drawn]
    else:
        g = [d - base for d in drawn]
    return v, g


def _ratio_or_none(a, b):
    if b == 0:
        return None
    return a / b


def expected_measures(fig):
    """Expected measures per docs/corpus.md, or None for non-ink figures.

    Lie Factor: Tufte (1983), The Visual Display of Quantitative Information,
    p.57. GDI = 100(a/b - 1): Steinbart (1989), Beattie & Jones (1992)."""
    if fig["kind"] in truth_shapes.KINDS:
        return truth_shapes.expected(fig)
    if fig["kind"] in truth_circles.KINDS:
        return truth_circles.expected(fig)
    if fig["kind"] not in INK_KINDS or fig.get("baseline") is None:
        return None
    if not fig["values"]:
        return None
    v, g = _graphic_sizes(fig)
    vf, vl, gf, gl = v[0], v[-1], g[0], g[-1]

    lf_change = None
    if vl != vf and vf != 0 and gf != 0:
        data_eff = (vl - vf) / vf
        graph_eff = (gl - gf) / gf
        lf_change = graph_eff / data_eff

    lf_growth = None
    if 0 not in (vf, vl, gf, gl):
        lf_growth = (gl / gf) / (vl / vf)

    gdi = None if lf_change is None else 100.0 * (lf_change - 1.0)

    pos = [(vi, gi) for vi, gi in zip(v, g) if vi > 0 and gi > 0]
    mpd = None
    if len(pos) >= 2:
        mpd = 1.0
        for i in range(len(pos)):
            for j in range(i + 1, len(pos)):
                r = (pos[i][1] / pos[j][1]) / (pos[i][0] / pos[j][0])
                mpd = max(mpd, r, 1.0 / r)

    return {
        "lie_factor_growth": _round(lf_growth),
        "lie_factor_change": _round(lf_change),
        "gdi": _round(gdi),
        "baseline": fig["baseline"],
        "max_pair_departure": _round(mpd),
    }


def _round(x):
    # 9 significant digits: enough for any tolerance, stable JSON diffs.
    if x is None:
        return None
    return float("%.9g" % x)


def validate(truth):
    """Return a list of problems (empty if the truth object is well-formed)."""
    errs = []
    for key in ("file", "producer", "seed", "pages", "figures"):
        if key not in truth:
            errs.append("missing top-level key %s" % key)
    if errs:
        return errs
    for n, fig in enumerate(truth["figures"]):
        where = "%s figure %d" % (truth["file"], n)
        for key in ("page", "bbox", "kind", "misleading", "rule", "values",
                    "labels", "axis", "baseline", "data_labels", "expected",
                    "style"):
            if key not in fig:
                errs.append("%s: missing %s" % (where, key))
        if any(k not in fig for k in ("kind", "bbox", "page", "rule")):
            continue
        if fig["kind"] not in KINDS:
            errs.append("%s: bad kind %r" % (where, fig["kind"]))
        if fig["rule"] not in RULES:
            errs.append("%s: bad rule %r" % (where, fig["rule"]))
        if bool(fig["rule"]) != bool(fig["misleading"]):
            errs.append("%s: rule and misleading disagree" % where)
        b = fig["bbox"]
        if len(b) != 4 or not (b[0] < b[2] and b[1] < b[3]):
            errs.append("%s: bad bbox %r" % (where, b))
        if not 1 <= fig["page"] <= truth["pages"]:
            errs.append("%s: page out of range" % where)
        if len(fig["values"]) != len(fig["labels"]):
            errs.append("%s: values/labels length differ" % where)
        if fig["rule"] == "bars-vs-labels" and "drawn_values" not in fig:
            errs.append("%s: bars-vs-labels needs drawn_values" % where)
        errs.extend(truth_circles.validate(fig, where))
        ax = fig.get("axis")
        if ax is not None:
            for k in ("min", "max", "scale", "orientation"):
                if k not in ax:
                    errs.append("%s: axis lacks %s" % (where, k))
    return errs


def finish_figure(fig):
    """Fill defaults and expected measures in place; return fig."""
    fig.setdefault("data_labels", None)
    fig.setdefault("style", [])
    fig.setdefault("axis", None)
    fig.setdefault("baseline", None)
    fig.setdefault("values", [])
    fig.setdefault("labels", [])
    fig["expected"] = expected_measures(fig)
    return fig


def write_truth(pdf_path, producer, seed, pages, figures, repo_root=None):
    """Write <name>.truth.json beside pdf_path; 'file' is repo-relative."""
    if repo_root is None:
        repo_root = os.path.dirname(os.path.dirname(os.path.dirname(
            os.path.abspath(__file__))))
    rel = os.path.relpath(os.path.abspath(pdf_path), repo_root)
    truth = {"file": rel, "producer": producer, "seed": seed, "pages": pages,
             "figures": [finish_figure(f) for f in figures]}
    errs = validate(truth)
    if errs:
        raise ValueError("; ".join(errs))
    out = pdf_path[:-4] + ".truth.json"
    with open(out, "w") as fh:
        json.dump(truth, fh, indent=1)
        fh.write("\n")
    return out


def _cli_fill():
    truth = json.load(sys.stdin)
    for fig in truth.get("figures", []):
        finish_figure(fig)
    errs = validate(truth)
    if errs:
        sys.stderr.write("\n".join(errs) + "\n")
        return 1
    json.dump(truth, sys.stdout, indent=1)
    sys.stdout.write("\n")
    return 0


def _cli_check(root):
    bad = 0
    count = 0
    for dirpath, _, files in os.walk(root):
        for name in sorted(files):
            if not name.endswith(".truth.json"):
                continue
            path = os.path.join(dirpath, name)
            with open(path) as fh:
                truth = json.load(fh)
            errs = validate(truth)
            pdf = path[:-len(".truth.json")] + ".pdf"
            if not os.path.exists(pdf):
                errs.append("%s: PDF missing" % path)
            for fig in truth.get("figures", []):
                want = expected_measures(fig)
                if want != fig.get("expected"):
                    errs.append("%s: expected measures stale" % path)
                    break
            count += 1
            for e in errs:
                bad += 1
                sys.stderr.write(e + "\n")
    print("%d truth files, %d problems" % (count, bad))
    return 1 if bad else 0


if __name__ == "__main__":
    if len(sys.argv) >= 2 and sys.argv[1] == "fill":
        sys.exit(_cli_fill())
    if len(sys.argv) >= 3 and sys.argv[1] == "check":
        sys.exit(_cli_check(sys.argv[2]))
    sys.stderr.write("usage: truth.py fill < in.json > out.json | "
                     "truth.py check DIR\n")
    sys.exit(2)
