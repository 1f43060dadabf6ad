"""Batch tests of the real plotproof binary: parallel workers, page budget, limits,
signals, resume after kill -9, shards through GNU parallel and merge, and one regression
check for each fault found by probing (issue 11).

usage: run_batch.py PLOTPROOF MAKE_PDF PAGE_FAULT_SO SCHEMA CORPUS CORRUPT SANITIZE

External references are named beside the checks. Every run is checked never to end by a
signal. Checks that need RLIMIT_AS are not run under AddressSanitizer (SANITIZE contains
"address"), and the test says so; they are not counted as passed."""
import glob
import hashlib
import importlib.machinery
import json
import os
import pty
import re
import shutil
import signal
import subprocess
import sys
import tempfile
import time

import jsonschema

PLOTPROOF, MAKE_PDF, PAGE_FAULT, SCHEMA, CORPUS, CORRUPT = map(os.path.abspath, sys.argv[1:7])
ASAN = "address" in sys.argv[7]
failures = []
corrupt = importlib.machinery.SourceFileLoader("corrupt", CORRUPT).load_module()


def check(cond, what):
    if not cond:
        failures.append(what)
        print("FAIL:", what)


def run(*args, env=None, timeout=300, stdin=None, stdout=subprocess.PIPE):
    p = subprocess.run([PLOTPROOF, *args], stdout=stdout, stderr=subprocess.PIPE, timeout=timeout,
                       env={**os.environ, **(env or {})}, input=stdin)
    check(0 <= p.returncode < 128, f"{args}: died by a signal / rc {p.returncode}")
    out = p.stdout.decode(errors="replace") if p.stdout is not None else ""
    return p.returncode, out, p.stderr.decode(errors="replace")


with open(SCHEMA, encoding="utf-8") as f:
    validator = jsonschema.Draft202012Validator(json.load(f))


def findings(path, what):
    text = open(path, encoding="utf-8").read()
    doc = json.loads(text)  # Python's json follows RFC 8259; "1e+20.0" is rejected
    errs = list(validator.iter_errors(doc))
    check(not errs, f"{what}: schema errors {[e.message for e in errs[:3]]}")
    return doc


def records(out_dir):
    lines = open(os.path.join(out_dir, "batch.jsonl"), encoding="utf-8").read().splitlines()
    objs = [json.loads(l) for l in lines]
    check(objs and "summary" in objs[-1], f"{out_dir}/batch.jsonl ends with a summary line")
    return {o["output"]: o for o in objs if "output" in o}, (objs[-1].get("summary") if objs else {})


def tree_files(d):
    return sorted(os.path.relpath(os.path.join(r, f), d) for r, _, fs in os.walk(d) for f in fs
                  if f.endswith(".findings.json"))


tmp = tempfile.mkdtemp(prefix="pp-batch-")
os.chdir(tmp)
good = os.path.join(tmp, "good.pdf")
subprocess.run([MAKE_PDF, good], check=True, capture_output=True)
good_data = open(good, "rb").read()
demo = sorted(glob.glob(os.path.join(CORPUS, "demo", "*.pdf")))[0]  # 20 pages


synthetic = dict(corrupt.synthetic(huge=False))


def write(name, data):
    os.makedirs(os.path.dirname(name) or ".", exist_ok=True)
    with open(name, "wb") as f:
        f.write(data)
    return name


# --- Fault: MediaBox 1e20 wrote "1e+20.0"; zero/negative boxes gave width 0 and exit 0.
write("box/huge.pdf", synthetic["box-1e20"])
rc, _, err = run("scan", "-q", "-o", "o-box", "box/huge.pdf")
doc = findings("o-box/huge.findings.json", "MediaBox 1e20")
# RFC 8259 §6: number = [ minus ] int [ frac ] [ exp ]; no fraction after the exponent.
text = open("o-box/huge.findings.json").read()
check(not re.search(r"[eE][+-]?\d+\.\d", text), "no number has a fraction after its exponent")
check(doc["pages"][0]["width"] > 9.9e19, f"the width stays 1e20 (within one ulp): {doc['pages'][0]['width']}")
# poppler replaces an empty MediaBox with Letter; a zero-height MediaBox and a CropBox
# outside or inverted against the MediaBox are what reach a page of width or height 0.
for name in ("line", "crop-outside", "crop-negative"):
    write(f"box/{name}.pdf", synthetic["box-" + name])
    rc, _, err = run("scan", "-q", "-o", "o-box", f"box/{name}.pdf")
    check(rc == 4 and not os.path.exists(f"o-box/{name}.findings.json"),
          f"{name} box: the document failed (exit 4, got {rc}) and left no findings file")
    check(f"{name}.pdf" in err and err.count("\n") == 1, f"{name} box: one stderr line: {err!r}")
recs, _ = records("o-box")
check(recs["line.findings.json"]["status"] == "failed" and recs["line.findings.json"]["reason"],
      "zero-height box: a failed record with a reason")
write("box/two.pdf", synthetic["two-pages-one-zero"])  # two pages, the second of zero size
rc, _, err = run("scan", "-q", "-o", "o-box", "box/two.pdf")
check(rc == 3, f"a document with a failed page is partial: exit 3 (got {rc})")
check("partial" in err and "two.pdf" in err, f"partial document gets a stderr line: {err!r}")
doc = findings("o-box/two.findings.json", "two pages, one zero")
check(doc["totals"]["pages_failed"] == 1 and doc["pages"][1]["error"], "page 2 is listed as failed")
recs, _ = records("o-box")
check(recs["two.findings.json"]["status"] == "partial", "record: partial")

# --- Fault: a failed document left a findings file; a failing rerun left the old one.
shutil.copy(good, "rerun.pdf")
rc, _, _ = run("scan", "-q", "-o", "o-rerun", "rerun.pdf")
check(os.path.exists("o-rerun/rerun.findings.json"), "rerun: first run writes its file")
write("rerun.pdf", b"%PDF-1.7\n" + b"garbage " * 100)
rc, _, err = run("scan", "-q", "-o", "o-rerun", "rerun.pdf")
check(rc == 4 and not os.path.exists("o-rerun/rerun.findings.json"),
      f"rerun that fails removes the earlier file (rc {rc})")

# --- Fault: writes to a full or closed stdout went unnoticed.
with open("/dev/full", "wb") as full:
    rc, _, err = run("scan", "--json", good, stdout=full)
check(rc == 4 and "cannot write to standard output" in err, f"> /dev/full: exit 4 and a message ({rc}, {err!r})")
p = subprocess.Popen([PLOTPROOF, "scan", "--json", good, demo], stdout=subprocess.PIPE,
                     stderr=subprocess.PIPE)
p.stdout.close()  # the reader goes away before anything is written (like `| head -0`)
err = p.stderr.read().decode()
p.wait(timeout=120)
check(p.returncode == 4 and "cannot write to standard output" in err,
      f"closed pipe: exit 4 and a message ({p.returncode}, {err!r})")
with open("/dev/full", "wb") as full:
    rc, _, err = run("scene", good, stdout=full)
check(rc == 4 and "cannot write" in err, f"scene > /dev/full: exit 4 ({rc})")

# --- Fault: two runs with the same base name into one directory overwrote each other.
write("a/x.pdf", good_data)
write("b/x.pdf", good_data + b"\n% another document\n")
run("scan", "-q", "-o", "o-same", "a/x.pdf")
run("scan", "-q", "-o", "o-same", "b/x.pdf")
docs = {findings(os.path.join("o-same", f), f)["document"]["path"] for f in tree_files("o-same")}
check(docs == {"a/x.pdf", "b/x.pdf"}, f"both runs' findings files are kept: {docs}")

# --- Fault: library messages reached stderr; failed pages passed silently (exit 0).
env = {"LD_PRELOAD": PAGE_FAULT, "PP_TEST_PAGE_FAULT": "chatter", "PP_TEST_PAGE": "2"}
rc, _, err = run("scan", "-q", "-o", "o-chatter", demo, env=env)
check(err == "", f"library messages stay off stderr: {err[:200]!r}")
doc = findings("o-chatter/" + os.path.basename(demo)[:-4] + ".findings.json", "chatter")
w = doc["pages"][1]["warnings"]
check(any("a library message from page 2" in x for x in w) and len(w) < 50,
      f"page 2's warnings hold the message once: {w[:3]}")

# --- Fault: control characters from names and PDF text reached the terminal raw.
evil = "evil\x1b]0;owned\x07\x1b[31m\nname.pdf"
write(evil, b"not a pdf at all")
shutil.copy(good, "ctl\x1b[2Jgood.pdf")
rc, out, err = run("scan", "--progress", "-o", "o-ctl", evil, "ctl\x1b[2Jgood.pdf")
for stream, s in (("stderr", err), ("stdout", out)):
    check(not re.search(r"[\x00-\x08\x0b-\x1f\x7f]", s), f"{stream} has no raw control characters: {s[:300]!r}")
check(len([l for l in err.splitlines() if "evil" in l]) == 2, f"the bad name is one line each: {err!r}")
check("\\x1B" in err, "the escape is shown as \\x1B")
write("ctl/text.pdf", synthetic["text-control-chars"])  # text with ESC, BEL, BS, NUL
rc, out, err = run("scan", "-o", "o-ctl", "ctl/text.pdf")
check(not re.search(r"[\x00-\x08\x0b-\x1f\x7f]", out + err), "PDF text is escaped on the terminal")

# --- Fault: base names over ~234 bytes failed (temporary-file suffix); FIFOs were silent.
long_name = "L" * 250 + ".pdf"
shutil.copy(good, long_name)
rc, _, err = run("scan", "-q", "-o", "o-long", long_name)
files = tree_files("o-long")
check(rc in (0, 1) and len(files) == 1 and len(files[0]) <= 255, f"a 250-byte name scans: {rc} {err!r} {files}")
os.makedirs("fifo-tree", exist_ok=True)
shutil.copy(good, "fifo-tree/ok.pdf")
os.mkfifo("fifo-tree/pipe.pdf")
os.mkfifo("fifo-tree/other")
rc, _, err = run("scan", "-q", "-o", "o-fifo", "fifo-tree", timeout=60)
check(rc in (0, 1), f"a tree with FIFOs scans its PDFs (rc {rc})")
check("pipe.pdf" in err and "other" in err and "FIFO" in err, f"each FIFO gets a line: {err!r}")

# --- Names from inputs never put output outside the output directory.
os.makedirs("deep/er", exist_ok=True)
shutil.copy(good, "outside.pdf")
write("deep/other.pdf", good_data + b"\n% other\n")
write("list.txt", b"../../outside.pdf\n../other.pdf\n" + os.path.join(tmp, "deep/er/../../outside.pdf").encode() + b"\n")
before = set(glob.glob(os.path.join(tmp, "**", "*.findings.json"), recursive=True))
subprocess.run([PLOTPROOF, "scan", "-q", "-o", "o-esc", "--from", "../../list.txt"], cwd="deep/er",
               capture_output=True, timeout=60)
after = set(glob.glob(os.path.join(tmp, "**", "*.findings.json"), recursive=True)) - before
check(len(after) == 2 and all(p.startswith(os.path.join(tmp, "deep/er/o-esc") + "/") for p in after),
      f"findings files stay in the output directory: {after}")

# --- Inputs: --from FILE and stdin; duplicates by SHA-256 scanned once, reported for each.
shutil.copy(good, "dup1.pdf")
shutil.copy(good, "dup2.pdf")
rc, out, err = run("scan", "-q", "-o", "o-from", "--from", "-", stdin=b"dup1.pdf\n\ndup2.pdf\r\n")
recs, summary = records("o-from")
check(recs.get("dup2.findings.json", {}).get("status") == "duplicate" and
      recs["dup2.findings.json"].get("duplicate_of") == "dup1.pdf", f"duplicate recorded: {recs}")
check(tree_files("o-from") == ["dup1.findings.json"], "the duplicate is scanned once")
check(summary["duplicates"] == 1, "summary counts the duplicate")
write("list2.txt", b"dup1.pdf\n")
rc, out, err = run("scan", "-q", "-o", "o-from2", "--from", "list2.txt")
check(rc in (0, 1) and tree_files("o-from2") == ["dup1.findings.json"], "--from FILE")

# --- Passwords from a file or the environment; qpdf AES-256 user password "user".
subprocess.run(["qpdf", "--encrypt", "user", "owner", "256", "--", good, "enc.pdf"], check=True)
enc_sha = hashlib.sha256(open("enc.pdf", "rb").read()).hexdigest()
write("pw-glob.txt", b"# comment\nnothing*.pdf wrong\nenc*.pdf user\n")
write("pw-hash.txt", b"sha256:%s user\n" % enc_sha.encode())
for what, args, env in [("glob file", ["--password-file", "pw-glob.txt"], None),
                        ("hash file", ["--password-file", "pw-hash.txt"], None),
                        ("environment", [], {"PLOTPROOF_PASSWORD": "user"})]:
    rc, _, err = run("scan", "-q", "-o", "o-pw", "--force", *args, "enc.pdf", env=env)
    check(rc in (0, 1) and err == "", f"password from {what}: rc {rc} {err!r}")
rc, _, err = run("scan", "-q", "-o", "o-pw", "--force", "enc.pdf", env={"PLOTPROOF_PASSWORD": ""})
check(rc == 4 and "encrypted" in err, "no password: encrypted")

# --- Page budget: a page over its time or memory budget is "too complex", the rest goes on.
env = {"LD_PRELOAD": PAGE_FAULT, "PP_TEST_PAGE_FAULT": "hang", "PP_TEST_PAGE": "2"}
t0 = time.time()
rc, _, err = run("scan", "-q", "-o", "o-budget", "--page-seconds", "1", demo, env=env)
doc = findings(os.path.join("o-budget", tree_files("o-budget")[0]), "page budget")
n_pages = doc["document"]["pages"]
check(rc == 3 and doc["pages"][1]["error"].startswith("too complex: over the page budget of 1 s"),
      f"hanging page 2: too complex ({rc}, {doc['pages'][1]})")
check(doc["totals"]["pages_analysed"] == n_pages - 1, "the other pages are analysed")
check("partial" in err and "page 2" in err, f"stderr says partial and names page 2: {err!r}")
env["PP_TEST_PAGE_FAULT"] = "abort"
rc, _, err = run("scan", "-q", "-o", "o-budget2", demo, env=env)
doc = findings(os.path.join("o-budget2", tree_files("o-budget2")[0]), "aborting page")
check(rc == 3 and "signal 6" in doc["pages"][1]["error"], f"aborting page 2 (SIGABRT is 6): {doc['pages'][1]}")
if ASAN:
    print("not checked under AddressSanitizer: the memory budget (RLIMIT_AS is not applied)")
else:
    env["PP_TEST_PAGE_FAULT"] = "swell"
    rc, _, err = run("scan", "-q", "-o", "o-budget3", "--max-memory", "256", demo, env=env)
    doc = findings(os.path.join("o-budget3", tree_files("o-budget3")[0]), "swelling page")
    check(rc == 3 and doc["pages"][1]["error"] == "too complex: over the memory budget of 256 MiB",
          f"swelling page 2: over the memory budget ({doc['pages'][1]})")
    recs, _ = records("o-budget3")
    check(all(r["max_rss_mib"] <= 256 for r in recs.values()), "worker memory stayed within 256 MiB")

# --- Page processes: a whole document runs in one, and a page that leaves its process
# 96 MiB larger (over the 64 MiB bound of docworker.c; common practice, no source) sends
# the next page to a fresh one, with nothing lost.
def page_pids(out_dir, *extra, env=None):
    log = os.path.abspath(out_dir + ".pages")
    rc, _, _ = run("scan", "-q", "--force", "-o", out_dir, *extra, demo,
                   env={"LD_PRELOAD": PAGE_FAULT, "PP_TEST_PAGE_LOG": log, **(env or {})})
    pids = {}
    for line in open(log):
        page, pid = map(int, line.split())
        pids.setdefault(page, pid)
    doc = findings(os.path.join(out_dir, tree_files(out_dir)[0]), out_dir)
    return rc, pids, doc


rc, pids, doc_one = page_pids("o-proc")
n_pages = doc_one["document"]["pages"]
check(sorted(pids) == list(range(2, n_pages + 1)) and len(set(pids.values())) == 1,
      f"pages 2-{n_pages} run in one page process: {pids}")
rc, pids, doc_grow = page_pids("o-grow", env={"PP_TEST_PAGE_FAULT": "grow", "PP_TEST_PAGE": "3"})
check(pids[2] == pids[3] and pids[4] != pids[3] and len(set(pids[p] for p in range(4, n_pages + 1))) == 1,
      f"after page 3 grew, page 4 on run in a fresh process: {pids}")
strip = lambda d: json.dumps([{k: v for k, v in e.items() if k not in ("seconds", "rss_kib")}
                              for e in d["pages"]], sort_keys=True)
check(doc_grow["totals"]["pages_analysed"] == n_pages and strip(doc_grow) == strip(doc_one),
      "the pages of the grown run equal those of the run in one process")

# --- A timed-out document keeps its finished pages (partial), and says where it stopped.
env = {"LD_PRELOAD": PAGE_FAULT, "PP_TEST_PAGE_FAULT": "hang", "PP_TEST_PAGE": "3"}
rc, _, err = run("scan", "-q", "-o", "o-timeout", "--timeout", "3", "--page-seconds", "100", demo, env=env)
doc = findings(os.path.join("o-timeout", tree_files("o-timeout")[0]), "timed-out document")
check(rc == 3 and doc["totals"]["pages_analysed"] == 2, f"timeout at page 3 keeps pages 1-2 ({rc}, {doc['totals']})")
check("timed out after 3 s" in doc["pages"][2]["error"], f"page 3 says timed out: {doc['pages'][2]}")
recs, _ = records("o-timeout")
r = next(iter(recs.values()))
check(r["status"] == "partial" and r["last_page"] == 3 and "timed out" in r["reason"], f"record: {r}")

# --- Workers die with their parent (PR_SET_PDEATHSIG).
env = {**os.environ, "LD_PRELOAD": PAGE_FAULT, "PP_TEST_PAGE_FAULT": "hang", "PP_TEST_PAGE": "2"}
p = subprocess.Popen([PLOTPROOF, "scan", "-q", "-o", "o-orphan", "--page-seconds", "100", demo, good],
                     env=env, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
time.sleep(3)


def children(pid):
    out = []
    for st in glob.glob("/proc/[0-9]*/stat"):
        try:
            f = open(st).read().rsplit(")", 1)[1].split()
        except OSError:
            continue
        if int(f[1]) == pid:
            c = int(st.split("/")[2])
            out += [c] + children(c)
    return out


kids = children(p.pid)
check(len(kids) >= 2, f"a worker and its page process run: {kids}")
p.kill()
p.wait()
time.sleep(1)
alive = [k for k in kids if os.path.exists(f"/proc/{k}") and "Z" not in open(f"/proc/{k}/stat").read().rsplit(")", 1)[1].split()[0]]
check(not alive, f"workers are gone after kill -9 of the batch: {alive}")

# --- A launcher killed from outside takes its workers with it; the batch stops as if
# interrupted (exit 5, "rerun"), keeps what finished, and leaves no process behind.
def direct_children(pid):
    return [c for c in children(pid) if int(open(f"/proc/{c}/stat").read().rsplit(")", 1)[1].split()[1]) == pid]


env = {**os.environ, "LD_PRELOAD": PAGE_FAULT, "PP_TEST_PAGE_FAULT": "hang", "PP_TEST_PAGE": "2"}
third = sorted(glob.glob(os.path.join(CORPUS, "gnuplot", "*.pdf")))[0]
p = subprocess.Popen([PLOTPROOF, "scan", "-q", "-j", "1", "-o", "o-launcher", "--page-seconds", "100",
                      good, demo, third], env=env, stdout=subprocess.PIPE, stderr=subprocess.PIPE)
time.sleep(3)
kids = children(p.pid)
launcher = direct_children(p.pid)
check(len(launcher) == 1 and len(kids) >= 3, f"one launcher, a worker and a page process: {kids}")
if launcher:
    os.kill(launcher[0], signal.SIGKILL)
out, err = p.communicate(timeout=60)
check(p.returncode == 5 and b"rerun" in err, f"launcher killed: exit 5, rerun ({p.returncode}, {err[-200:]!r})")
time.sleep(1)
alive = [k for k in kids if os.path.exists(f"/proc/{k}") and "Z" not in open(f"/proc/{k}/stat").read().rsplit(")", 1)[1].split()[0]]
check(not alive, f"no worker outlives the launcher: {alive}")
recs, summary = records("o-launcher")
check(summary.get("interrupted") is True and summary.get("interrupted_documents", 0) >= 1,
      f"the summary says interrupted: {summary}")

# --- SIGINT stops the workers, keeps finished results, says how far it got (exit 5).
many = sorted(glob.glob(os.path.join(CORPUS, "gnuplot", "*.pdf")))
env = {**os.environ, "LD_PRELOAD": PAGE_FAULT, "PP_TEST_PAGE_FAULT": "hang", "PP_TEST_PAGE": "2"}
p = subprocess.Popen([PLOTPROOF, "scan", "-q", "-j", "2", "-o", "o-int", "--page-seconds", "100",
                      *many[:6], demo], env=env, stdout=subprocess.PIPE, stderr=subprocess.PIPE)
time.sleep(4)
p.send_signal(signal.SIGINT)
out, err = p.communicate(timeout=60)
check(p.returncode == 5, f"SIGINT: exit 5 (got {p.returncode})")
check(b"interrupted:" in err and b"rerun" in err, f"SIGINT: says how far it got: {err[-200:]!r}")
recs, summary = records("o-int")
check(summary.get("interrupted") is True, "the summary line says interrupted")
done = [r for r in recs.values() if r["status"] in ("ok", "partial")]
check(done and all(os.path.exists(os.path.join("o-int", r["output"])) for r in done),
      f"finished documents keep their files ({len(done)})")

# --- Progress: on a terminal, in place; not otherwise; --progress: one line per document.
master, slave = pty.openpty()
p = subprocess.Popen([PLOTPROOF, "scan", "-q", "-o", "o-tty", *many[:4]], stdout=subprocess.DEVNULL,
                     stderr=slave)
os.close(slave)
buf = b""
while True:
    try:
        chunk = os.read(master, 4096)
    except OSError:
        break
    if not chunk:
        break
    buf += chunk
p.wait()
os.close(master)
# quiet hides the progress line; a plain run shows it
master, slave = pty.openpty()
p = subprocess.Popen([PLOTPROOF, "scan", "-o", "o-tty", "--force", *many[:4]],
                     stdout=subprocess.DEVNULL, stderr=slave)
os.close(slave)
buf = b""
while True:
    try:
        chunk = os.read(master, 4096)
    except OSError:
        break
    if not chunk:
        break
    buf += chunk
p.wait()
os.close(master)
check(b"\r\x1b[K" in buf and b"documents" in buf and b"left" in buf, f"a terminal gets the progress line: {buf[:200]!r}")
rc, out, err = run("scan", "-o", "o-tty", "--force", *many[:4])
check("\r" not in err and "documents," not in err, "no progress when stderr is not a terminal")
rc, out, err = run("scan", "-q", "--progress", "-o", "o-tty", "--force", *many[:4])
check(len([l for l in err.splitlines() if "[" in l and "/4]" in l]) == 4, f"--progress: 4 lines: {err!r}")

# --- Records and --json carry failures; exit codes tell a usage error from all inputs failing.
write("empty.pdf", b"")
rc, out, err = run("scan", "--json", good, "empty.pdf")
lines = [json.loads(l) for l in out.splitlines()]
check(len(lines) == 2 and any(l.get("status") == "failed" and l.get("reason") for l in lines),
      f"--json has a failure line: {out[-300:]!r}")
rc, _, _ = run("scan", "--jobs", "0", good)
check(rc == 2, "--jobs 0 is a usage error (2)")
rc, _, _ = run("scan", "--shard", "4/3", good)
check(rc == 2, "--shard 4/3 is a usage error (2)")
rc, _, _ = run("scan", "-q", "-o", "o-empty", "empty.pdf")
check(rc == 4, "every input failed: exit 4")

# --- kill -9 in the middle, then a rerun: byte-identical to an uninterrupted run.
subset = sorted(glob.glob(os.path.join(CORPUS, "gnuplot", "*.pdf")) +
                glob.glob(os.path.join(CORPUS, "pgfplots", "*.pdf")) + [demo])
write("subset.txt", "\n".join(subset).encode() + b"\n")
rc, _, err = run("scan", "-q", "-j", "2", "-o", "o-full", "--from", "subset.txt", timeout=900)
check(rc in (0, 1, 3), f"uninterrupted run (rc {rc})")
p = subprocess.Popen([PLOTPROOF, "scan", "-q", "-j", "2", "-o", "o-killed", "--from", "subset.txt"],
                     stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
deadline = time.time() + 300
while time.time() < deadline:
    try:
        n = sum(1 for _ in open("o-killed/batch.jsonl"))
    except OSError:
        n = 0
    if n >= len(subset) // 3 or p.poll() is not None:
        break
    time.sleep(0.05)
p.kill()
p.wait()
killed_at = n
rc, _, err = run("scan", "-q", "-j", "2", "-o", "o-killed", "--from", "subset.txt", timeout=900)
recs, summary = records("o-killed")
full, _ = records("o-full")
check(0 < summary["resumed"] < len(subset), f"the rerun resumed {summary['resumed']} of {len(subset)} (killed after {killed_at})")
a, b = tree_files("o-full"), tree_files("o-killed")
same = a == b and all(open(os.path.join("o-full", f), "rb").read() == open(os.path.join("o-killed", f), "rb").read() for f in a)
check(same, f"kill -9 + rerun gives byte-identical findings files ({len(a)} vs {len(b)})")
check({k: v["status"] for k, v in recs.items()} == {k: v["status"] for k, v in full.items()}, "same statuses")
print(f"kill -9 resume: killed after {killed_at} records, rerun resumed {summary['resumed']}, "
      f"{len(a)} findings files byte-identical: {same}")
rc, _, _ = run("scan", "-q", "-j", "2", "-o", "o-killed", "--force", "--from", "subset.txt", timeout=900)
recs, summary = records("o-killed")
check(summary["resumed"] == 0, "--force rescans everything")
rc, _, _ = run("scan", "-q", "-o", "o-killed", "--lie-band", "0.9:1.1", "--from", "subset.txt", timeout=900)
recs, summary = records("o-killed")
check(summary["resumed"] == 0, "other settings rescan everything")

# --- Shards through GNU parallel, merged, equal to the single run.
# docs/scaling.md's command line, with this machine as the three "hosts" (":" is local).
p = subprocess.run(["parallel", "--will-cite", "--sshlogin", "3/:", PLOTPROOF, "scan", "-q", "-j", "1",
                    "--shard", "{}/3", "-o", "o-shard{}", "--from", "subset.txt", ":::", "1", "2", "3"],
                   capture_output=True, timeout=900)
check(p.returncode in (0, 1, 3), f"GNU parallel ran 3 shards (rc {p.returncode} {p.stderr[-300:]!r})")
sizes = [len(records(f"o-shard{k}")[0]) for k in (1, 2, 3)]
check(sum(sizes) == len(subset) and min(sizes) > 0, f"the shards split the inputs: {sizes}")
rc, out, err = run("merge", "-o", "o-merged", "o-shard1", "o-shard2", "o-shard3")
check(rc == 0, f"merge of 3 shards: exit 0 ({rc}, {err!r})")
a, b = tree_files("o-full"), tree_files("o-merged")
check(a == b and all(open(os.path.join("o-full", f), "rb").read() == open(os.path.join("o-merged", f), "rb").read() for f in a),
      "merged shards give the same findings files as one run")
merged, _ = records("o-merged")
check({k: (v["sha256"], v["status"], v["findings"]) for k, v in merged.items()} ==
      {k: (v["sha256"], v["status"], v["findings"]) for k, v in full.items()}, "merged records equal the single run's")
rc, out, err = run("merge", "-o", "o-merged2", "o-shard1", "o-shard3")
check(rc == 3 and "shard 2/3 is missing" in err, f"merge notices a missing shard ({rc}, {err!r})")
rc, out, err = run("merge", "-o", "o-merged3", "o-shard1", "o-shard1", "o-shard2", "o-shard3")
check("given twice" in err, f"merge notices a shard given twice: {err!r}")

shutil.rmtree(tmp, ignore_errors=True)
print(f"{len(failures)} failure(s)")
sys.exit(1 if failures else 0)
