#!/usr/bin/env python3
# SPDX-License-Identifier: MIT
"""The web page test (meson test 'web-page').

Stages examples/web with the JavaScript module and natremia.wasm in a
directory laid out as the repository, serves it on 127.0.0.1 (a port the
system picks; only this process talks to it), opens the page in headless
Chromium (Debian's chromium) and reads the DOM after its scripts ran. Every
number the page shows carries its full value in data-exact; each is compared
with the C library's result for the same invented scenario, computed here
through the Python binding (ctypes on the native libnatremia), exactly
(floats by their shortest repr, which round-trips). The caution must be on
the page. A screenshot is saved as BUILDDIR/web/web-page.png.

  check_page.py SOURCE_ROOT BUILDDIR

Exits 77 (skipped) only when chromium or clang is not installed.
"""

import base64
import fcntl
import functools
import html.parser
import http.server
import json
import os
import select
import shutil
import subprocess
import sys
import tempfile
import threading
import time

root, build = sys.argv[1], sys.argv[2]
sys.path.insert(0, os.path.join(root, "bindings", "python"))
import natremia  # noqa: E402

CHROMIUM = shutil.which("chromium") or shutil.which("chromium-browser")
if CHROMIUM is None or shutil.which("clang") is None or shutil.which("wasm-ld") is None:
    print("web-page: chromium, clang or wasm-ld not found (apt-get install chromium clang lld): skipped")
    sys.exit(77)

# Its own build of natremia.wasm (the js-binding test may run alongside).
out_dir = os.path.join(build, "web")
subprocess.run(["sh", os.path.join(root, "bindings", "js", "build.sh"), out_dir], check=True,
               env=dict(os.environ, NATREMIA_REFVECTORS="no"))
wasm = os.path.join(out_dir, "natremia.wasm")


def stage(where):
    web = os.path.join(where, "examples", "web")
    js = os.path.join(where, "bindings", "js")
    os.makedirs(web)
    os.makedirs(js)
    for name in os.listdir(os.path.join(root, "examples", "web")):
        shutil.copy(os.path.join(root, "examples", "web", name), web)
    for name in ("natremia.mjs", "natremia_api.mjs"):
        shutil.copy(os.path.join(root, "bindings", "js", name), js)
    shutil.copy(wasm, js)


class Quiet(http.server.SimpleHTTPRequestHandler):
    extensions_map = dict(http.server.SimpleHTTPRequestHandler.extensions_map,
                          **{".mjs": "text/javascript", ".js": "text/javascript",
                             ".wasm": "application/wasm", ".json": "application/json"})
    requests = []

    def log_message(self, fmt, *args):
        Quiet.requests.append(self.path)


class Cells(html.parser.HTMLParser):
    """data-key -> (data-exact, text) of every element with a data-key."""

    def __init__(self):
        super().__init__()
        self.cells = {}
        self.body = {}
        self.open = []
        self.text = []

    def handle_starttag(self, tag, attrs):
        a = dict(attrs)
        if tag == "body":
            self.body = a
        if "data-key" in a:
            self.open.append((a["data-key"], a.get("data-exact"), len(self.text)))
        self.text.append("")

    def handle_endtag(self, tag):
        if self.open and self.open[-1][2] == len(self.text) - 1:
            key, exact, _ = self.open.pop()
            self.cells[key] = (exact, self.text[-1].strip())
        if self.text:
            last = self.text.pop()
            if self.text:
                self.text[-1] += last

    def handle_data(self, data):
        if self.text:
            self.text[-1] += data


def chromium_page(url, profile, start_server, width=1240, height=1800, timeout_s=90.0):
    """Open url in headless Chromium, wait until the page says it finished,
    and return (serialised DOM, PNG bytes, console lines).

    Driven over the DevTools protocol on a pipe (--remote-debugging-pipe:
    Chromium reads JSON commands on fd 3 and answers on fd 4, each message
    ending in a NUL byte), so the wait is for the page's own signal
    (body data-ready set to '1' or 'error') in real time. A virtual-time
    budget is not used: WebAssembly compiles off the page's clock, so the
    budget may run out before the module is ready (a CI run once read the
    page unfinished, with no numbers). start_server() is called once
    Chromium is started: the fork happens before any thread exists."""
    to_chrome_r, to_chrome_w = os.pipe()
    from_chrome_r, from_chrome_w = os.pipe()
    cmd = [CHROMIUM, "--headless", "--no-sandbox", "--disable-gpu",
           "--no-first-run", "--disable-extensions", "--disable-background-networking",
           "--disable-component-update", "--disable-sync", "--user-data-dir=" + profile,
           "--hide-scrollbars", "--remote-debugging-pipe", "about:blank"]

    def child_fds():
        # Move both ends above 9 first, so neither is overwritten by the other.
        high_r = fcntl.fcntl(to_chrome_r, fcntl.F_DUPFD, 10)
        high_w = fcntl.fcntl(from_chrome_w, fcntl.F_DUPFD, 10)
        os.dup2(high_r, 3)
        os.dup2(high_w, 4)

    proc = subprocess.Popen(cmd, stdin=subprocess.DEVNULL, stdout=subprocess.DEVNULL,
                            stderr=subprocess.DEVNULL, pass_fds=(3, 4), preexec_fn=child_fds)
    start_server()
    os.close(to_chrome_r)
    os.close(from_chrome_w)
    writer = os.fdopen(to_chrome_w, "wb", buffering=0)
    reader = os.fdopen(from_chrome_r, "rb", buffering=0)
    deadline = time.monotonic() + timeout_s
    pending = b""
    console = []
    ids = iter(range(1, 1 << 30))

    def read_message():
        nonlocal pending
        while b"\0" not in pending:
            left = deadline - time.monotonic()
            if left <= 0 or not select.select([reader], [], [], left)[0]:
                raise TimeoutError("Chromium did not answer within %.0f s" % timeout_s)
            chunk = reader.read(65536)
            if not chunk:
                raise RuntimeError("Chromium closed the pipe")
            pending += chunk
        raw, pending = pending.split(b"\0", 1)
        return json.loads(raw)

    def call(method, session=None, **params):
        mid = next(ids)
        msg = {"id": mid, "method": method, "params": params}
        if session:
            msg["sessionId"] = session
        writer.write(json.dumps(msg).encode() + b"\0")
        while True:
            m = read_message()
            if m.get("method") == "Runtime.consoleAPICalled":
                console.append(" ".join(str(a.get("value", a.get("description", "")))
                                        for a in m["params"].get("args", [])))
            elif m.get("method") == "Runtime.exceptionThrown":
                d = m["params"]["exceptionDetails"]
                console.append("exception: %s" % d.get("exception", {}).get("description", d.get("text")))
            if m.get("id") == mid:
                if "error" in m:
                    raise RuntimeError("%s: %s" % (method, m["error"]))
                return m.get("result", {})

    try:
        target = call("Target.createTarget", url="about:blank")["targetId"]
        session = call("Target.attachToTarget", targetId=target, flatten=True)["sessionId"]
        call("Runtime.enable", session)
        call("Page.enable", session)
        call("Emulation.setDeviceMetricsOverride", session, width=width, height=height,
             deviceScaleFactor=1, mobile=False)
        call("Page.navigate", session, url=url)
        state = None
        while time.monotonic() < deadline:
            state = call("Runtime.evaluate", session, returnByValue=True,
                         expression="document.body ? document.body.dataset.ready || '' : ''")
            state = state.get("result", {}).get("value")
            if state in ("1", "error"):
                break
            time.sleep(0.1)
        dom = call("Runtime.evaluate", session, returnByValue=True,
                   expression="'<!DOCTYPE html>' + document.documentElement.outerHTML")["result"]["value"]
        shot = base64.b64decode(call("Page.captureScreenshot", session, format="png")["data"])
        try:
            call("Browser.close")
        except (RuntimeError, TimeoutError):
            pass
        return dom, shot, console
    finally:
        writer.close()
        reader.close()
        try:
            proc.wait(timeout=15)
        except subprocess.TimeoutExpired:
            proc.kill()
            proc.wait()


def expected(sc):
    """The page's numbers, computed by the C library (Python binding)."""
    labs, pt, risk, plan = sc["labs"], sc["patient"], sc["risk"], sc["plan"]
    tri = {"yes": True, "no": False, "unknown": None}
    want = {}
    want["osm_effective"] = natremia.osm_effective(
        na_mmol_l=labs["na_mmol_l"], glucose_mmol_l=labs["glucose_mmol_l"])
    calc = natremia.osm_calculated(
        na_mmol_l=labs["na_mmol_l"], glucose_mmol_l=labs["glucose_mmol_l"],
        urea_mmol_l=labs["urea_mmol_l"], ethanol_mmol_l=labs["ethanol_mmol_l"])
    want["osm_calculated"] = calc
    want["osm_gap"] = natremia.osm_gap(measured_mosm_kg=labs["measured_osm_mosm_kg"],
                                       calculated_mosm_kg=calc)
    want["na_corrected"] = natremia.na_corrected_glucose(
        na_mmol_l=labs["na_mmol_l"], glucose_mmol_l=labs["glucose_mmol_l"],
        method=natremia.GlucoseMethod.HILLIER)
    want["severity"] = int(natremia.na_severity(na_mmol_l=labs["na_mmol_l"]))
    ton = natremia.low_na_effective_tonicity(
        na_mmol_l=labs["na_mmol_l"], glucose_mmol_l=labs["glucose_mmol_l"],
        urea_mmol_l=labs["urea_mmol_l"], ethanol_mmol_l=labs["ethanol_mmol_l"],
        measured_osm_mosm_kg=labs["measured_osm_mosm_kg"],
        glucose_method=natremia.GlucoseMethod.HILLIER)
    want["tonicity"] = int(ton.tonicity)
    sex = natremia.Sex.FEMALE if pt["sex"] == "female" else natremia.Sex.MALE
    tbw = natremia.tbw_fraction(sex=sex, age_years=pt["age_years"], weight_kg=pt["weight_kg"])
    want["tbw"] = tbw
    want["urine_dilute"] = int(bool(natremia.urine_maximally_dilute(urine_osm_mosm_kg=labs["urine_osm_mosm_kg"])))
    want["urine_na_high"] = int(bool(natremia.urine_na_high(urine_na_mmol_l=labs["urine_na_mmol_l"])))
    want["furst_ratio"] = natremia.furst_ratio(
        urine_na_mmol_l=labs["urine_na_mmol_l"], urine_k_mmol_l=labs["urine_k_mmol_l"],
        serum_na_mmol_l=labs["na_mmol_l"])
    ods = natremia.ods_risk(baseline_na_mmol_l=labs["na_mmol_l"],
                            low_potassium=tri[risk["low_potassium"]],
                            alcohol_use_disorder=tri[risk["alcohol_use_disorder"]],
                            malnutrition=tri[risk["malnutrition"]],
                            advanced_liver_disease=tri[risk["advanced_liver_disease"]])
    want["ods_preset"] = int(ods.preset)
    high = int(ods.preset) == int(natremia.LimitsPreset.HIGH_RISK)
    lim = natremia.course_limits_preset("hypo_high_risk" if high else "hypo_standard")
    flows = [natremia.TimedFlow(f["start_h"], f["end_h"], f["rate_ml_h"], f["na_mmol_l"],
                                f["k_mmol_l"]) for f in plan["flows"]]
    r = natremia.course_plan_check(
        history_hours=[h for h, _ in plan["history"]],
        history_na_mmol_l=[v for _, v in plan["history"]], tbw_l=tbw, flows=flows,
        duration_h=plan["duration_h"], step_h=plan["step_h"], limits=lim)
    want["plan_final_na"] = r.final_na_mmol_l
    want["plan_final_tbw"] = r.final_tbw_l
    want["plan_max_rise_24h"] = r.course.max_rise_24h
    # The binding gives None for "no breach"; the C value is NTR_PLAN_NO_BREACH (-1).
    want["plan_first_breach_h"] = -1.0 if r.first_breach_h is None else r.first_breach_h
    w = natremia.CourseWatch(lim)
    rep = None
    for hours, na in sc["series"]:
        rep = w.push(hours=hours, na_mmol_l=na)
        want["watch_max_rise_24h_%s" % hours] = rep.max_rise_24h
        want["watch_flags_%s" % hours] = int(rep.flags)
    fin = w.result()
    want["watch_final_max_rise_24h"] = fin.max_rise_24h
    want["watch_final_max_rise_48h"] = fin.max_rise_48h
    want["watch_final_excess"] = fin.excess_mmol_l
    return want


def main():
    with open(os.path.join(root, "examples", "web", "scenario.json"), encoding="utf-8") as f:
        sc = json.load(f)
    want = expected(sc)
    tmp = tempfile.mkdtemp(prefix="natremia-web-")
    try:
        site = os.path.join(tmp, "site")
        stage(site)
        handler = functools.partial(Quiet, directory=site)
        server = http.server.ThreadingHTTPServer(("127.0.0.1", 0), handler)
        url = "http://127.0.0.1:%d/examples/web/index.html" % server.server_address[1]
        shot = os.path.join(out_dir, "web-page.png")
        if os.path.exists(shot):
            os.remove(shot)

        def start_server():
            threading.Thread(target=server.serve_forever, daemon=True).start()

        try:
            dom, png, console = chromium_page(url, os.path.join(tmp, "profile"), start_server)
        finally:
            server.shutdown()
        with open(shot, "wb") as f:
            f.write(png)
        for line in console:
            print("page console: %s" % line)
        parser = Cells()
        parser.feed(dom)
        failures = []
        if parser.body.get("data-ready") != "1":
            failures.append("page did not finish (body data-ready=%r)" % parser.body.get("data-ready"))
        text = " ".join(dom.split())
        for phrase in ("Estimates for decision support, not orders.",
                       "Verify with measured values; follow local protocols and licensed clinical judgement.",
                       "Invented example."):
            if phrase not in text:
                failures.append("page lacks: %s" % phrase)
        for key, value in want.items():
            if key not in parser.cells:
                failures.append("%s: not on the page" % key)
                continue
            exact, shown = parser.cells[key]
            ok = float(exact) == float(value) if isinstance(value, float) else int(exact) == value
            print("%-28s page %-22s C %-22r %s" % (key, exact, value, "ok" if ok else "DIFFERS"))
            if not ok:
                failures.append("%s: page %s, C %r" % (key, exact, value))
            if isinstance(value, float) and value != -1.0 and "." in shown:
                digits = len(shown.split()[0].split(".")[1])
                if shown.split()[0] != "%.*f" % (digits, value):
                    failures.append("%s: shown %r, C rounds to %.*f" % (key, shown, digits, value))
        extra = sorted(set(parser.cells) - set(want))
        if extra:
            failures.append("numbers on the page the test does not check: %s" % ", ".join(extra))
        outside = [p for p in Quiet.requests if not p.startswith(("/examples/web/", "/bindings/js/"))]
        if outside:
            failures.append("unexpected requests: %s" % outside)
        if not os.path.exists(shot) or os.path.getsize(shot) < 10000:
            failures.append("no screenshot written")
        print("requests: %s" % " ".join(sorted(set(Quiet.requests))))
        print("screenshot: %s" % shot)
        for f in failures:
            print("FAIL: " + f)
        print("web-page: %d numbers compared, %d failures" % (len(want), len(failures)))
        return 1 if failures else 0
    finally:
        shutil.rmtree(tmp, ignore_errors=True)


sys.exit(main())
