"""Hostile-input batch: one scan over the corrupted-PDF set that scripts/corrupt makes from
the corpus (truncations, bit flips, splices, broken xref/trailer, bad page boxes, extreme
coordinates, deep nesting, decompression bombs, page-tree loops, 100k and 1M path operators).

usage: run_corrupt.py PLOTPROOF CORRUPT SCHEMA [COUNT]

The batch must finish, never die by a signal, give every bad file a record with a reason,
leave no findings file for a failed document, write only schema-valid findings files, and
keep each worker within its memory limit (RLIMIT_AS; max RSS from getrusage)."""
import json
import os
import shutil
import subprocess
import sys
import tempfile
import time

import jsonschema

PLOTPROOF, CORRUPT, SCHEMA = map(os.path.abspath, sys.argv[1:4])
COUNT = int(sys.argv[4]) if len(sys.argv) > 4 else 1000
MEMORY_MIB = 1024
failures = []


def check(cond, what):
    if not cond:
        failures.append(what)
        print("FAIL:", what)


tmp = tempfile.mkdtemp(prefix="pp-corrupt-")
src, out = os.path.join(tmp, "in"), os.path.join(tmp, "out")
made = int(subprocess.run([CORRUPT, src, "--count", str(COUNT)], check=True,
                          capture_output=True).stdout)
t0 = time.time()
p = subprocess.run([PLOTPROOF, "scan", "-q", "-j", "2", "--page-seconds", "5", "--timeout", "60",
                    "--max-memory", str(MEMORY_MIB), "-o", out, src], capture_output=True, timeout=1800)
seconds = time.time() - t0
check(0 <= p.returncode < 128, f"the batch ended by itself (rc {p.returncode})")
check(p.returncode == 3, f"some documents failed, others were scanned: exit 3 (got {p.returncode})")
lines = open(os.path.join(out, "batch.jsonl"), encoding="utf-8").read().splitlines()
recs = [json.loads(l) for l in lines]
summary = recs[-1].get("summary", {})
recs = recs[:-1]
check(len(recs) == made, f"a record for each of the {made} files ({len(recs)})")
validator = jsonschema.Draft202012Validator(json.load(open(SCHEMA, encoding="utf-8")))
crashed = 0
for r in recs:
    path = os.path.join(out, r["output"])
    if r["status"] == "failed":
        check(r.get("reason") and r.get("word"), f"{r['path']}: failed with a reason")
        check(not os.path.exists(path), f"{r['path']}: a failed document leaves no findings file")
        crashed += "crashed (signal" in (r.get("reason") or "")
    elif r["status"] in ("ok", "partial"):
        doc = json.load(open(path, encoding="utf-8"))
        errs = list(validator.iter_errors(doc))
        check(not errs, f"{r['output']}: schema errors {[e.message for e in errs[:2]]}")
    check(r.get("max_rss_mib", 0) <= MEMORY_MIB, f"{r['path']}: {r.get('max_rss_mib')} MiB over the limit")
stderr_lines = p.stderr.decode(errors="replace").splitlines()
check(all(l.startswith("plotproof: ") for l in stderr_lines), "stderr has only plotproof's own lines")
failed = sum(r["status"] == "failed" for r in recs)
print(f"corrupted set: {made} files, {summary.get('ok')} ok, {summary.get('partial')} partial, "
      f"{failed} failed with a reason, {summary.get('duplicates')} duplicates, "
      f"{crashed} worker crashes caught, batch exit {p.returncode}, {seconds:.0f} s, "
      f"max worker RSS {max(r.get('max_rss_mib', 0) for r in recs)} MiB")
shutil.rmtree(tmp, ignore_errors=True)
print(f"{len(failures)} failure(s)")
sys.exit(1 if failures else 0)
