"""The reviewer's outputs of the real binary, read back with parsers that are not
plotproof's: Python's csv module (RFC 4180), python3-jsonschema against the OASIS SARIF
2.1.0 schema, qpdf's JSON view of the annotated PDF (ISO 32000-1 §12.5), html.parser.

usage: test_review.py PLOTPROOF GEN_DEMO EMIT_REVIEW SARIF_SCHEMA

The demo report and its second draft are drawn at test time by gen-demo; what the second
draft changes (one page inserted after the letter, the fuel area chart fixed, a new
truncated operating-profit chart, the 2031 revenue restated) is the generator's own
design, so the expected comparison comes from the scenario, not from plotproof."""
import csv
import hashlib
import html.parser
import json
import os
import re
import shutil
import struct
import subprocess
import sys
import tempfile

import jsonschema

PLOTPROOF, GEN_DEMO, EMIT, SARIF_SCHEMA = map(os.path.abspath, sys.argv[1:5])
failures = []


def check(cond, what):
    if not cond:
        failures.append(what)
        print("FAIL:", what)


def run(*args, env=None, cwd=None):
    p = subprocess.run([PLOTPROOF, *args], capture_output=True, timeout=300, cwd=cwd,
                       env={**os.environ, "XDG_CONFIG_HOME": XDG, **(env or {})})
    check(0 <= p.returncode < 128, f"{args}: died by a signal")
    return p.returncode, p.stdout.decode(), p.stderr.decode()


def sha256(path):
    with open(path, "rb") as f:
        return hashlib.sha256(f.read()).hexdigest()


tmp = tempfile.mkdtemp(prefix="pp-review-")
XDG = os.path.join(tmp, "xdg")  # an empty config dir: no user configuration leaks in
os.makedirs(XDG)
os.chdir(tmp)
subprocess.run([GEN_DEMO, "drafts"], check=True, capture_output=True)
subprocess.run([GEN_DEMO, "drafts", "--draft2"], check=True, capture_output=True)
D1 = "drafts/fjordhaven-annual-report-2031.pdf"
D2 = "drafts/fjordhaven-annual-report-2031-draft2.pdf"
before = sha256(D1)

rc, out, err = run("scan", D1, "-o", "out", "--html", "pack", "--annotate",
                   "--csv", "all.csv", "--sarif", "all.sarif")
check(rc == 1, f"scan with findings exits 1, got {rc}: {err}")
doc = json.load(open("out/fjordhaven-annual-report-2031.findings.json", encoding="utf-8"))
findings = doc["findings"]
check(len(findings) >= 4, f"the demo's misleading charts are found ({len(findings)})")

# ---- reviewer language, against the demo generator's own numbers ----
# Revenue (gen_demo.c): 118.2 → 140.2 (EUR m) on bars cut at 100. Value growth
# 140.2/118.2 − 1 = 18.6%; drawn lengths 40.2/18.2 = 2.209×, i.e. 121% growth; Tufte's
# Lie Factor (2.209 − 1)/(0.186) = 6.49 (Tufte 1983 p. 57).
rev = [f for f in findings if f.get("figure_title") == "Revenue (EUR m)"]
check(len(rev) == 1, "the revenue finding carries its figure title")
if rev:
    r0 = rev[0]
    check(r0["headline"] == "shows 19% growth as 121% growth", f"headline: {r0['headline']}")
    lf = (40.2 / 18.2 - 1) / (140.2 / 118.2 - 1)
    check(abs(r0["measures"]["lie_factor"] - lf) <= 0.01 * lf, "lie_factor is Tufte's")
    check(abs(r0["measures"]["ink_growth_ratio"] - (40.2 / 18.2) / (140.2 / 118.2)) < 0.01,
          "the growth form has its own name")
    check("€100m" in r0["message"] and "€140.2m" in r0["message"],
          "values quoted as printed (the tick label and the data label)")
    check(r0["figure_id"] and r0["figure_id"] in [g["id"] for p in doc["pages"]
                                                  for g in p.get("figures", [])],
          "finding carries the figure id")
# One severity scale: sorted by distortion, the words never go down.
order = ["minor", "major", "severe"]
ranked = sorted(findings, key=lambda f: f["measures"]["distortion"])
check(all(order.index(a["severity"]) <= order.index(b["severity"])
          for a, b in zip(ranked, ranked[1:])), "severity follows the distortion")
check("Severity: minor" in out and "severe" in out, "the summary explains the severity words")
check('"Revenue (EUR m)" [figure ' in out, "the summary line shows title and figure id")

# ---- CSV: RFC 4180 read back by Python's csv module ----
raw = open("all.csv", "rb").read()
check(raw.endswith(b"\r\n") and b"\n" not in raw.replace(b"\r\n", b""),
      "CSV lines end in CRLF (RFC 4180 §2.1)")
with open("all.csv", newline="", encoding="utf-8") as f:
    rows = list(csv.reader(f))
header, body = rows[0], rows[1:]
check(len(body) == len(findings), f"one CSV row per finding ({len(body)} vs {len(findings)})")
check(all(len(r) == len(header) for r in body), "every CSV row has as many cells as the header")
col = {name: i for i, name in enumerate(header)}
for r, f in zip(body, findings):
    check(r[col["finding_id"]] == f["id"] and int(r[col["page"]]) == f["page"]
          and r[col["rule"]] == f["rule"], f"CSV row matches finding {f['id']}")
    lf = f["measures"]["lie_factor"]
    check(abs(float(r[col["lie_factor"]]) - lf) <= 1e-5 * abs(lf),
          "CSV lie_factor is Tufte's ratio of relative changes")

# ---- SARIF 2.1.0: the OASIS schema (draft-04) via python3-jsonschema ----
schema = json.load(open(SARIF_SCHEMA, encoding="utf-8"))
validator = jsonschema.Draft4Validator(schema)
sarif = json.load(open("all.sarif", encoding="utf-8"))
errors = list(validator.iter_errors(sarif))
check(not errors, f"SARIF validates: {[e.message for e in errors[:3]]}")
broken = json.loads(json.dumps(sarif))
broken["runs"][0]["results"][0]["level"] = "severe"
check(list(validator.iter_errors(broken)), "the SARIF schema rejects an unknown level")
results = sarif["runs"][0]["results"]
check(len(results) == len(findings), "one SARIF result per finding")
for res, f in zip(results, findings):
    region = res["locations"][0]["physicalLocation"]["region"]
    check(region["properties"]["page"] == f["page"] and region["properties"]["bbox"] == f["bbox"],
          "SARIF region carries the finding's page and box")
    check(res["ruleId"] == f["rule"], "SARIF ruleId is the rule")
check(sarif["runs"][0]["artifacts"][0]["hashes"]["sha-256"] == before,
      "SARIF artifact hash is the PDF's SHA-256")

# ---- annotated copy: read back with qpdf, original untouched ----
check(sha256(D1) == before, "the original PDF is not modified")
ann = "out/fjordhaven-annual-report-2031.annotated.pdf"
check(os.path.exists(ann), "annotated copy written")
q = json.loads(subprocess.run(["qpdf", "--json=2", "--json-key=qpdf", "--json-key=pages", ann],
                              check=True, capture_output=True).stdout)
objs = q["qpdf"][1]
page_of = {p["object"]: i + 1 for i, p in enumerate(q["pages"])}
squares = [v["value"] for v in objs.values()
           if isinstance(v, dict) and isinstance(v.get("value"), dict)
           and v["value"].get("/Subtype") == "/Square"]
check(len(squares) == len(findings), f"one square annotation per finding ({len(squares)})")
for f in findings:
    hit = [s for s in squares if page_of.get(s.get("/P")) == f["page"]
           and all(abs(a - b) < 0.01 for a, b in zip(s["/Rect"], f["pdf_bbox"]))]
    check(len(hit) == 1, f"square annotation on page {f['page']} at the figure's PDF box")
    if hit:
        text = hit[0].get("/Contents", "")
        text = text[2:] if text.startswith("u:") else text
        check(f["message"] in text and f["rule"] in text and "Lie Factor" in text,
              "the annotation's note holds the headline, the rule and the measures")

# A page turned by /Rotate 90 and an encrypted copy (qpdf, AES-256): the square still sits
# at each finding's PDF box (ISO 32000-1 §8.3.2.3 user space), read back with the password.
subprocess.run(["qpdf", "--rotate=+90:5", D1, "rot.pdf"], check=True)
subprocess.run(["qpdf", "--encrypt", "pw", "pw", "256", "--", "rot.pdf", "enc.pdf"], check=True)
rc, out, err = run("scan", "enc.pdf", "-o", "enc", "--password", "pw", "--annotate",
                   "--html", "encpack", "-q")
enc_doc = json.load(open("enc/enc.findings.json", encoding="utf-8"))
q = json.loads(subprocess.run(["qpdf", "--password=pw", "--json=2", "--json-key=qpdf",
                               "--json-key=pages", "enc/enc.annotated.pdf"],
                              check=True, capture_output=True).stdout)
enc_page_of = {p["object"]: i + 1 for i, p in enumerate(q["pages"])}
enc_squares = [(enc_page_of.get(v["value"].get("/P")), v["value"]["/Rect"])
               for v in q["qpdf"][1].values()
               if isinstance(v, dict) and isinstance(v.get("value"), dict)
               and v["value"].get("/Subtype") == "/Square"]
for f in enc_doc["findings"]:
    check(any(pg == f["page"] and all(abs(a - b) < 0.01 for a, b in zip(r, f["pdf_bbox"]))
              for pg, r in enc_squares),
          f"encrypted, rotated copy: square on page {f['page']} at the PDF box")
check(len([n for n in os.listdir("encpack/img") if re.match(r".*-\d+\.png$", n)])
      == len(enc_doc["findings"]), "crops of an encrypted PDF rendered with its password")

# ---- HTML pack: files, links, images, escaping ----
class Links(html.parser.HTMLParser):
    def __init__(self):
        super().__init__()
        self.refs, self.scripts = [], 0

    def handle_starttag(self, tag, attrs):
        a = dict(attrs)
        if tag == "script":
            self.scripts += 1
        for key in ("href", "src"):
            if key in a:
                self.refs.append(a[key])


pages = [os.path.join(dp, n) for dp, _, ns in os.walk("pack") for n in ns if n.endswith(".html")]
check(len(pages) >= 4 + 4, f"index pages, document page and rule pages ({len(pages)})")
for page in pages:
    p = Links()
    p.feed(open(page, encoding="utf-8").read())
    check(p.scripts == 0, f"{page}: no script")
    for ref in p.refs:
        check(not re.match(r"^[a-z]+://", ref), f"{page}: no network reference ({ref})")
        target = os.path.normpath(os.path.join(os.path.dirname(page), ref.split("#")[0]))
        check(os.path.exists(target), f"{page}: link target {ref} exists")
crops = [n for n in os.listdir("pack/img") if re.match(r".*-\d+\.png$", n)]
check(len(crops) == len(findings), "one crop per finding")
for n in crops:
    with open(os.path.join("pack/img", n), "rb") as f:
        head = f.read(24)
    check(head[:8] == b"\x89PNG\r\n\x1a\n", f"{n} is a PNG (PNG spec signature)")
    w, h = struct.unpack(">II", head[16:24])
    # 150 dpi: a plot area of at least 100 pt gives at least 208 pixels (100·150/72).
    check(w >= 208 and h >= 100, f"{n} rendered at 150 dpi ({w}x{h})")

# Nested input folders: same base names in two folders and names that differ only after
# a dot. Each document gets its own page below the pack, its own pictures, and links that
# climb back to the pack's shared files (the pack once failed with "No such file" here and
# still exited 0; "q1.2031" and "q1.2032" once shared their picture names).
os.makedirs("nested/a"), os.makedirs("nested/b")
shutil.copy(D1, "nested/a/q1.2031.pdf")
shutil.copy(D2, "nested/b/q1.2031.pdf")
with open(D1, "rb") as f:  # the same report with a comment after %%EOF: other bytes
    open("nested/a/q1.2032.pdf", "wb").write(f.read() + b"\n% another copy\n")
rc, out, err = run("scan", "nested", "-o", "nestout", "--html", "nestpack", "-q")
check(rc == 1, f"nested scan with findings exits 1, got {rc}: {err}")
check("output failed" not in err, f"nested scan writes every review page: {err}")
for name in ("a/q1.2031", "b/q1.2031", "a/q1.2032"):
    page = os.path.join("nestpack", name + ".html")
    check(os.path.exists(page), f"{page} written")
    if not os.path.exists(page):
        continue
    p = Links()
    p.feed(open(page, encoding="utf-8").read())
    imgs = [r for r in p.refs if r.endswith(".png")]
    nf = len(json.load(open(f"nestout/{name}.findings.json", encoding="utf-8"))["findings"])
    check(len(imgs) >= nf > 0, f"{page}: a picture per finding ({len(imgs)} for {nf})")
    check(all(os.path.basename(name) + "-" in r for r in imgs), f"{page}: pictures named for it")
    for ref in p.refs:
        target = os.path.normpath(os.path.join(os.path.dirname(page), ref.split("#")[0]))
        check(os.path.exists(target), f"{page}: link target {ref} exists")
# A review page that cannot be written makes the run partial (exit 3, cli.h): a plain file
# where its folder should be stops it even for root.
shutil.rmtree("nestpack"), shutil.rmtree("nestout")
os.makedirs("nestpack")
open("nestpack/a", "w").close()
rc, out, err = run("scan", "nested", "-o", "nestout", "--html", "nestpack", "-q")
check(rc == 3 and "output failed" in err, f"unwritable review page: exit 3, got {rc}: {err}")

# Hostile text in a findings file: formulas for spreadsheets, markup for browsers.
hostile = json.loads(json.dumps(doc))
evil = ["=HYPERLINK(\"http://x\")", "+1+2", "-3", "@SUM(A1)", "<script>alert(1)</script>",
        "a,b \"q\"\nnext"]
hostile["findings"] = hostile["findings"][:1] * len(evil)
for i, (f, e) in enumerate(zip(hostile["findings"], evil)):
    f = hostile["findings"][i] = json.loads(json.dumps(f))
    f["message"] = e
    f["headline"] = e
    f["figure_title"] = e
    f["id"] = f"id{i}"
json.dump(hostile, open("hostile.json", "w", encoding="utf-8"))
subprocess.run([EMIT, "hostile.json", "h.csv", "h.sarif", "hpack"], check=True)
with open("h.csv", newline="", encoding="utf-8") as f:
    hrows = list(csv.reader(f))
hcol = {name: i for i, name in enumerate(hrows[0])}
for r, e in zip(hrows[1:], evil):
    cell = r[hcol["headline"]]
    # OWASP CSV injection: formula-like cells get a leading apostrophe, the rest intact.
    expect = "'" + e if e[0] in "=+-@" else e
    check(cell == expect, f"CSV round trip of {e!r} gives {expect!r}, got {cell!r}")
    check(r[hcol["figure_title"]] == expect, "figure title neutralised the same way")
page = open("hpack/doc.html", encoding="utf-8").read()
check("<script>" not in page and "&lt;script&gt;alert(1)&lt;/script&gt;" in page,
      "PDF text is escaped in the HTML")
check(not list(validator.iter_errors(json.load(open("h.sarif", encoding="utf-8")))),
      "SARIF with hostile text still validates")

# ---- explain and rules: every rule of --help has its page with the six sections ----
rc, help_text, _ = run("--help")
rule_ids = re.findall(r"^  ([a-z0-9-]+) +", help_text.split("Rules:")[1].split("Exit codes")[0],
                      re.M)
check(rule_ids, "--help lists rules")
rc, listed, _ = run("rules")
for rid in rule_ids:
    rc, page_md, _ = run("explain", rid)
    check(rc == 0, f"explain {rid}")
    for section in ("What it detects", "How it measures", "Published source",
                    "Typical false alarms", "What a reviewer should check", "How to fix"):
        check(section in page_md, f"explain {rid}: section {section!r}")
    check(rid in listed, f"rules lists {rid}")
    with open(os.path.join(os.path.dirname(SARIF_SCHEMA), "..", "..", "..", "docs", "rules",
                           rid + ".md"), encoding="utf-8") as f:
        check(f.read() == page_md, f"explain {rid} prints docs/rules/{rid}.md")
rc, _, err = run("explain", "no-such-rule")
check(rc == 2 and "no rule" in err, "explain of an unknown rule is a usage error")

# ---- baseline: accept two findings, scan again ----
ids = [findings[0]["id"], findings[-1]["id"]]
rc, out, err = run("accept", "out/fjordhaven-annual-report-2031.findings.json", *ids,
                   "--baseline", "accepted.ini", "--who", "R. Example", "--why", "disclosed in note 4")
check(rc == 0, f"accept: {err}")
with open("accepted.ini", "a", encoding="utf-8") as f:
    f.write("\n[0000000000000000]\nwho=R. Example\nwhy=an old chart\nwhen=2031-01-01\n")
rc, out, err = run("scan", D1, "-o", "out2", "--baseline", "accepted.ini", "--csv", "b.csv")
n_new = len(findings) - 2
check(f"{n_new} findings" in out or f"{n_new} finding " in out, f"only new findings counted: {out}")
check("2 accepted findings listed apart" in out, "accepted findings listed apart")
check(out.count("accepted by R. Example on ") == 2 and "disclosed in note 4" in out,
      "each accepted finding listed with who, when and why")
check("0000000000000000" in err and "matches no finding" in err, "stale baseline entry warned")
with open("b.csv", newline="", encoding="utf-8") as f:
    brows = list(csv.DictReader(f))
acc = [r for r in brows if r["status"] == "accepted"]
check(sorted(r["finding_id"] for r in acc) == sorted(ids)
      and all(r["accepted_by"] == "R. Example" for r in acc), "CSV marks accepted findings")

# ---- compare two drafts ----
rc, out, err = run("compare", D1, D2, "--json", "--html", "compare.html")
check(rc == 1, f"compare with a new finding exits 1 ({rc}, {err})")
c = json.loads(out)
titles = lambda key: sorted(x["figure_title"] for x in c[key])
check(titles("new_findings") == ["Operating profit"], f"new: {titles('new_findings')}")
check(titles("resolved") == ["Fleet fuel use (kilotonnes)"], f"resolved: {titles('resolved')}")
unchanged = c["unchanged"]
check(len(unchanged) == len(findings) - 1, f"unchanged: {len(unchanged)}")
# Draft 2 has one page more before every chart: each still-open finding moves one page.
check(all(u["new"]["page"] == u["old"]["page"] + 1 for u in unchanged),
      "unchanged findings moved one page down")
rev = [u for u in unchanged if u["new"]["figure_title"] == "Revenue (EUR m)"]
check(len(rev) == 1 and rev[0]["matched_by"] == "rule and figure title",
      "the restated revenue chart is the same finding")
check(os.path.exists("compare.html"), "compare writes HTML")
rc, out, _ = run("compare", "out/fjordhaven-annual-report-2031.findings.json", D1)
check(rc == 0 and "New (0)" in out and "Resolved (0)" in out, "a draft compared to itself")

# ---- configuration: key file, command line wins ----
with open("pp.conf", "w", encoding="utf-8") as f:
    f.write("[output]\ncsv=from-config.csv\nquiet=true\n[rules]\nbars-on-log=false\n"
            "[rule bars-off-zero]\nmin-severity=severe\n")
rc, out, err = run("scan", D1, "-o", "out3", "--config", "pp.conf")
check(out == "" and os.path.exists("from-config.csv"), f"config sets quiet and csv ({err})")
cfg = json.load(open("out3/fjordhaven-annual-report-2031.findings.json", encoding="utf-8"))
rules = [(f["rule"], f["severity"]) for f in cfg["findings"]]
check(not any(r == "bars-on-log" for r, _ in rules), "a rule switched off in the config")
check(not any(r == "bars-off-zero" and s != "severe" for r, s in rules),
      "per-rule minimum severity from the config")
rc, out, err = run("scan", D1, "-o", "out4", "--config", "pp.conf", "--csv", "cli.csv")
check(os.path.exists("cli.csv"), "the command line wins over the config")
os.makedirs(os.path.join(XDG, "plotproof"))
shutil.copy("pp.conf", os.path.join(XDG, "plotproof", "config"))
rc, out, err = run("scan", D1, "-o", "out5")
check(out == "", "the default config in $XDG_CONFIG_HOME/plotproof/config is read")
rc, out, err = run("scan", D1, "-o", "out6", "--no-config")
check(out != "", "--no-config ignores it")
with open("bad.conf", "w") as f:
    f.write("[thresholds]\ngdi-limit=-5\n")
rc, out, err = run("scan", D1, "--config", "bad.conf")
check(rc == 2 and "gdi-limit" in err, "a bad value in the config is a usage error")

shutil.rmtree(tmp, ignore_errors=True)
print(f"{'FAILED' if failures else 'ok'}: reviewer outputs ({len(failures)} failures)")
sys.exit(1 if failures else 0)
