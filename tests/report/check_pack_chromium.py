"""Opens every page of an HTML review pack in headless Chromium (Debian's package) and
checks that it loads with no console error, no uncaught exception and no failed request,
and that every image has loaded (complete, natural width > 0). Writes screenshots of the
index and of the first finding page. Talks to Chromium over the DevTools protocol on a
pipe (--remote-debugging-pipe: fd 3 in, fd 4 out, messages ended by NUL), so no network
port and no Python package beyond the standard library is needed.

usage: check_pack_chromium.py PACK_DIR SCREENSHOT_DIR [CHROMIUM]"""
import base64
import glob
import json
import os
import shutil
import subprocess
import sys
import tempfile
import time

PACK, SHOTS = map(os.path.abspath, sys.argv[1:3])
CHROMIUM = sys.argv[3] if len(sys.argv) > 3 else shutil.which("chromium")
failures = []


def check(cond, what):
    if not cond:
        failures.append(what)
        print("FAIL:", what)


class Browser:
    def __init__(self):
        self.profile = tempfile.mkdtemp(prefix="pp-chromium-")
        to_child_r, self.to_child = os.pipe()
        self.from_child, from_child_w = os.pipe()

        def fds():  # the child's fd 3 reads commands, fd 4 writes replies
            r, w = os.dup(to_child_r), os.dup(from_child_w)  # off 3 and 4 first
            os.dup2(r, 3)
            os.dup2(w, 4)

        self.proc = subprocess.Popen(
            [CHROMIUM, "--headless", "--no-sandbox", "--disable-gpu",
             "--disable-background-networking", "--disable-component-update", "--disable-sync",
             "--no-first-run", "--user-data-dir=" + self.profile, "--remote-debugging-pipe",
             "about:blank"],
            close_fds=False, preexec_fn=fds,  # only the inheritable 3 and 4 reach it
            stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
        os.close(to_child_r)
        os.close(from_child_w)
        self.buf, self.next_id, self.events, self.session = b"", 0, [], None

    def _read_message(self, deadline):
        while b"\0" not in self.buf:
            if time.time() > deadline:
                raise TimeoutError("no answer from Chromium")
            chunk = os.read(self.from_child, 65536)
            if not chunk:
                raise EOFError("Chromium closed the pipe")
            self.buf += chunk
        msg, self.buf = self.buf.split(b"\0", 1)
        return json.loads(msg)

    def send(self, method, params=None, session=True, timeout=30):
        self.next_id += 1
        msg = {"id": self.next_id, "method": method, "params": params or {}}
        if session and self.session:
            msg["sessionId"] = self.session
        os.write(self.to_child, json.dumps(msg).encode() + b"\0")
        deadline = time.time() + timeout
        while True:
            m = self._read_message(deadline)
            if m.get("id") == self.next_id:
                if "error" in m:
                    raise RuntimeError(f"{method}: {m['error']}")
                return m.get("result", {})
            self.events.append(m)

    def wait_event(self, name, timeout=30):
        deadline = time.time() + timeout
        while True:
            for i, e in enumerate(self.events):
                if e.get("method") == name:
                    return self.events.pop(i)
            self.events.append(self._read_message(deadline))

    def close(self):
        try:
            self.send("Browser.close", session=False, timeout=5)
        except Exception:
            pass
        try:
            self.proc.wait(timeout=10)
        except subprocess.TimeoutExpired:
            self.proc.kill()
            self.proc.wait()
        shutil.rmtree(self.profile, ignore_errors=True)


def problems(events):
    out = []
    for e in events:
        m, p = e.get("method"), e.get("params", {})
        if m == "Runtime.exceptionThrown":
            out.append("exception: " + json.dumps(p.get("exceptionDetails", {}))[:200])
        elif m == "Runtime.consoleAPICalled" and p.get("type") in ("error", "assert"):
            out.append("console error: " + json.dumps(p.get("args", []))[:200])
        elif m == "Log.entryAdded" and p.get("entry", {}).get("level") == "error":
            out.append("log error: " + p["entry"].get("text", "")[:200])
        elif m == "Network.loadingFailed":
            out.append("request failed: " + p.get("errorText", ""))
    return out


def main():
    if not CHROMIUM:
        print("FAIL: no chromium binary (scripts/bootstrap installs Debian's chromium)")
        return 1
    os.makedirs(SHOTS, exist_ok=True)
    pages = sorted(glob.glob(os.path.join(PACK, "**", "*.html"), recursive=True))
    check(pages, "the pack has pages")
    b = Browser()
    try:
        targets = b.send("Target.getTargets", session=False)["targetInfos"]
        page_target = next(t for t in targets if t["type"] == "page")
        b.session = b.send("Target.attachToTarget",
                           {"targetId": page_target["targetId"], "flatten": True},
                           session=False)["sessionId"]
        for domain in ("Page", "Runtime", "Log", "Network"):
            b.send(domain + ".enable")
        b.send("Emulation.setDeviceMetricsOverride",
               {"width": 1200, "height": 1500, "deviceScaleFactor": 1, "mobile": False})
        finding_page = next((p for p in pages if os.path.dirname(p) == PACK
                             and not os.path.basename(p).startswith("index")), None)
        for page in pages:
            b.events = [e for e in b.events if e.get("method") != "Page.loadEventFired"]
            b.send("Page.navigate", {"url": "file://" + page})
            b.wait_event("Page.loadEventFired")
            time.sleep(0.2)  # late console messages
            imgs = b.send("Runtime.evaluate", {
                "expression": "JSON.stringify(Array.from(document.images).map("
                              "i => [i.getAttribute('src'), i.complete, i.naturalWidth]))",
                "returnByValue": True})["result"]["value"]
            for src, complete, width in json.loads(imgs):
                check(complete and width > 0, f"{os.path.relpath(page, PACK)}: image {src} loads")
            for p in problems(b.events):
                check(False, f"{os.path.relpath(page, PACK)}: {p}")
            b.events = []
            name = None
            if os.path.basename(page) == "index.html" and os.path.dirname(page) == PACK:
                name = "index.png"
            elif page == finding_page:
                name = "finding.png"
            if name:
                shot = b.send("Page.captureScreenshot", {"format": "png"})["data"]
                with open(os.path.join(SHOTS, name), "wb") as f:
                    f.write(base64.b64decode(shot))
        print(f"checked {len(pages)} pages in {CHROMIUM}")
    finally:
        b.close()
    check(os.path.exists(os.path.join(SHOTS, "index.png")), "screenshot of the index")
    check(os.path.exists(os.path.join(SHOTS, "finding.png")), "screenshot of a finding page")
    print(f"{'FAILED' if failures else 'ok'}: review pack in headless Chromium "
          f"({len(failures)} failures); screenshots in {SHOTS}")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
