#!/usr/bin/python3
"""compare.py — is a freshly generated corpus the committed one?

usage: compare.py FRESH_ROOT REPO_ROOT

Every file under FRESH_ROOT/corpus/<producer>/ must equal its committed twin under
REPO_ROOT/corpus/<producer>/. Truth files compare byte for byte. PDFs compare byte for
byte after one stated normalisation: the values of /CreationDate and /ModDate are
blanked (cairo 1.16, under gnuplot's pdfcairo terminal, stamps the wall-clock time and
ignores SOURCE_DATE_EPOCH); the stamps have a fixed length, so nothing else moves.
Producers that were not regenerated (not installed) are listed as skipped. Exit 1 on
any difference or on a generated file that is not committed."""
import os
import re
import sys

DATE = re.compile(rb"/(CreationDate|ModDate)\s*\((D:[^)]*)\)")


def normalised(path):
    with open(path, "rb") as fh:
        data = fh.read()
    if path.endswith(".pdf"):
        data = DATE.sub(lambda m: b"/" + m.group(1) + b" (" + b"-" * len(m.group(2)) + b")", data)
    return data


def main():
    fresh, repo = (os.path.abspath(p) for p in sys.argv[1:3])
    differ, missing, same = [], [], 0
    # a producer counts as regenerated only when it wrote something
    producers = sorted(d for d in os.listdir(os.path.join(fresh, "corpus"))
                       if os.listdir(os.path.join(fresh, "corpus", d)))
    for prod in producers:
        for name in sorted(os.listdir(os.path.join(fresh, "corpus", prod))):
            got = os.path.join(fresh, "corpus", prod, name)
            want = os.path.join(repo, "corpus", prod, name)
            if not os.path.exists(want):
                missing.append(f"corpus/{prod}/{name}")
            elif normalised(got) != normalised(want):
                differ.append(f"corpus/{prod}/{name}")
            else:
                same += 1
    committed = sorted(d for d in os.listdir(os.path.join(repo, "corpus"))
                       if os.path.isdir(os.path.join(repo, "corpus", d)))
    skipped = [d for d in committed if d not in producers and d != "demo"]
    print(f"corpus: {same} files identical (dates blanked in PDFs); regenerated "
          f"{', '.join(producers) or 'nothing'}")
    for d in skipped:
        print(f"SKIP: corpus/{d} not regenerated here (its producer is not installed)")
    for title, rows in (("differ from the committed file", differ),
                        ("generated but not committed", missing)):
        if rows:
            print(f"{title} ({len(rows)}):")
            for r in rows[:20]:
                print("  " + r)
    return 1 if differ or missing else 0


if __name__ == "__main__":
    sys.exit(main())
