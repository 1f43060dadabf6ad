"""End-to-end test of the profiles and the fund past-performance checks: a compliant
past-performance chart of an invented fund and twins that each break one requirement,
drawn by matplotlib at test time (make_fund.py), scanned by the real binary.

usage: run_fund.py PLOTPROOF SOURCE_ROOT

Each twin must give exactly its one expected finding under --profile fund-past-performance,
the compliant charts none. The requirements are those of Commission Regulation (EU)
No 583/2010, Annex III, points 1-5 (wording checked against the published text) and
Article 15 (from memory), named beside each case below. Without matplotlib the test is
skipped (exit 77), never passed."""
import json
import os
import subprocess
import sys
import tempfile

PLOTPROOF, SRC = map(os.path.abspath, sys.argv[1:3])
PY = "/usr/bin/python3"
PROFILE = "fund-past-performance"
# case -> the requirement it breaks (None: meets every check)
SOURCES = {
    "fund-compliant": None,
    "fund-gap-shown": "Article 15 (from memory): a year without data left blank is fine",
    "fund-log": "Annex III point 1: the scale of the Y-axis shall be linear, not logarithmic",
    "fund-floor": "Annex III point 3: the X-axis shall be set at the level of 0% performance",
    "fund-nolabel": "Annex III point 4: a label shall be added to each bar",
    "fund-decimals": "Annex III point 5: figures rounded to one decimal place",
    "fund-wronglabel": "Annex III point 4: the label indicates the return achieved",
    "fund-clipped": "Annex III point 2: the scale adapted to the span of the bars",
    "fund-squeezed": "Annex III point 2: the scale shall not compress the bars",
    "fund-gap-dropped": "Article 15 (from memory): years without data shown as gaps",
    "fund-apart": "Article 15 (from memory): years read under fund and benchmark bars set apart",
    "fund-apart-gap-dropped": "Article 15 (from memory): years without data shown as gaps, "
    "bars set apart",
}
failures = []


def check(cond, what):
    if not cond:
        failures.append(what)
        print("FAIL:", what)


def scan(pdf, *args, env=None):
    p = subprocess.run([PLOTPROOF, "scan", "--json", *args, pdf], capture_output=True,
                       text=True, env=env)
    if p.returncode not in (0, 1):
        return p.returncode, None
    return p.returncode, json.loads(p.stdout.splitlines()[0])


def rules(doc):
    return sorted(f["rule"] for f in doc["findings"]) if doc else None


if subprocess.run([PY, "-c", "import matplotlib"], capture_output=True).returncode != 0:
    print("SKIP: matplotlib not installed")
    sys.exit(77)

root = tempfile.mkdtemp(prefix="pp-fund-")
subprocess.run([PY, os.path.join(SRC, "tests", "e2e", "make_fund.py"), root], check=True)
with open(os.path.join(root, "cases.json")) as f:
    cases = json.load(f)
check(sorted(cases) == sorted(SOURCES), f"generator cases {sorted(cases)}")

# No configuration file of the user's: an empty XDG config home.
home = os.path.join(root, "xdg")
os.makedirs(home)
env = {**os.environ, "XDG_CONFIG_HOME": home}

for case, rule in cases.items():
    pdf = os.path.join(root, case + ".pdf")
    rc, doc = scan(pdf, "--profile", PROFILE, env=env)
    want = [rule] if rule else []
    got = rules(doc)
    check(got == want, f"{case} ({SOURCES[case]}): want {want}, got {got}")
    check(rc == (1 if rule else 0), f"{case}: exit code {rc}")
    if doc and rule:
        msg = doc["findings"][0]["message"]
        cite = "Article 15" if rule == "fund-years" else "Annex III point"
        check("Regulation (EU) No 583/2010" in msg and cite in msg,
              f"{case}: the sentence names its source: {msg}")
    # Without the profile the fund checks are off (opt-in).
    rc, doc = scan(pdf, env=env)
    check(doc is not None and not any(r.startswith("fund-") for r in rules(doc)),
          f"{case} without a profile: {rules(doc)}")

# The profiles and where they come from.
p = subprocess.run([PLOTPROOF, "profiles"], capture_output=True, text=True, env=env)
for name in ("default", "strict", PROFILE):
    check(any(line.startswith(name + " ") for line in p.stdout.splitlines()),
          f"profiles lists {name}: {p.stdout}")
check("source tree:" in p.stdout or "installed:" in p.stdout, f"profiles sources: {p.stdout}")

# strict: the band and limit of data/profiles/strict.ini reach the findings file.
rc, doc = scan(os.path.join(root, "fund-compliant.pdf"), "--profile", "strict", env=env)
check(doc and doc["thresholds"]["lie_band"] == [0.98, 1.02]
      and doc["thresholds"]["gdi_limit_percent"] == 5, f"strict thresholds: {doc and doc['thresholds']}")
# ... and the command line wins over the profile.
rc, doc = scan(os.path.join(root, "fund-compliant.pdf"), "--profile", "strict", "--lie-band",
               "0.9:1.1", env=env)
check(doc and doc["thresholds"]["lie_band"] == [0.9, 1.1], "--lie-band after --profile wins")

# A user's profile of the same name hides the shipped one: fund checks without decimals.
os.makedirs(os.path.join(home, "plotproof", "profiles"))
with open(os.path.join(SRC, "data", "profiles", PROFILE + ".ini")) as f:
    text = f.read().replace("fund-label-decimals=true", "fund-label-decimals=false")
with open(os.path.join(home, "plotproof", "profiles", PROFILE + ".ini"), "w") as f:
    f.write(text)
p = subprocess.run([PLOTPROOF, "profiles"], capture_output=True, text=True, env=env)
check(f"user: {home}/plotproof/profiles/{PROFILE}.ini" in p.stdout, f"user profile: {p.stdout}")
rc, doc = scan(os.path.join(root, "fund-decimals.pdf"), "--profile", PROFILE, env=env)
check(rules(doc) == [], f"user profile without fund-label-decimals: {rules(doc)}")
os.remove(os.path.join(home, "plotproof", "profiles", PROFILE + ".ini"))

# The configuration file names the profile; the command line's --profile wins.
with open(os.path.join(home, "plotproof", "config"), "w") as f:
    f.write(f"[scan]\nprofile={PROFILE}\n")
rc, doc = scan(os.path.join(root, "fund-log.pdf"), env=env)
check(rules(doc) == ["fund-log-axis"], f"profile from the configuration: {rules(doc)}")
rc, doc = scan(os.path.join(root, "fund-log.pdf"), "--profile", "default", env=env)
check(rules(doc) == ["bars-on-log"], f"--profile default over the configuration: {rules(doc)}")

# Unknown profile, unknown rule: usage errors.
rc, _ = scan(os.path.join(root, "fund-log.pdf"), "--profile", "no-such-profile", env=env)
check(rc == 2, f"unknown profile: exit {rc}")
rc, _ = scan(os.path.join(root, "fund-log.pdf"), "--enable-rule", "no-such-rule", env=env)
check(rc == 2, f"unknown rule: exit {rc}")

print(f"{len(cases)} fund charts; {len(failures)} failures")
sys.exit(1 if failures else 0)
