#!/usr/bin/env python3
# SPDX-License-Identifier: MIT
"""Checks of the generated reference manual's HTML (tests/check_manual.sh).

    check_manual_html.py <html-dir> <include/natremia.h> <source-root>

- Return values: every row of every "Return values" table names exactly one
  status (NTR_OK or NTR_ERR_*) and gives a meaning. A Doxygen line such as
  "@retval NTR_OK, NTR_ERR_NULL, NTR_ERR_RANGE." renders as a row named
  "NTR_OK," whose meaning is the rest of the list run together; that fails.
- Offline: no <script src> or style sheet <link href> uses http(s) or a
  protocol-relative URL, and every local one exists. Pages with equations
  load MathJax from the manual's own copy (html/mathjax), which holds the
  input, output and extension files the pages' configuration asks for.
- Front page: index.html links to the page of every header section
  (every @defgroup in include/natremia.h).
- Navigation: every page under docs/ (and DEVELOPERS.md) is in the manual's
  navigation, and every page for users comes before the first page for
  contributors (CONTRIBUTOR_PAGES).
Prints OK/FAIL lines; exit status 1 on any failure.
"""
import glob
import html
import os
import re
import sys

# Pages for people working on natremia itself, listed last in
# docs/Doxyfile.in's INPUT; every other page is for its users.
CONTRIBUTOR_PAGES = ["DEVELOPERS.md", "docs/abi.md", "docs/adding-a-formula.md"]

STATUS = re.compile(r"^NTR_(OK|ERR_[A-Z]+)$")
TAGS = re.compile(r"<[^>]+>")


def text_of(fragment):
    return " ".join(html.unescape(TAGS.sub(" ", fragment)).split())


class Report:
    def __init__(self):
        self.failed = 0

    def check(self, good, ok_text, fail_text):
        if good:
            print("OK: " + ok_text)
        else:
            print("FAIL: " + fail_text)
            self.failed += 1


def check_retvals(pages, report):
    rows = bad = 0
    examples = []
    for path, text in pages.items():
        for table in re.findall(r'<table class="retval">(.*?)</table>', text, re.S):
            for name, meaning in re.findall(
                    r'<td class="paramname">(.*?)</td>\s*<td>(.*?)</td>', table, re.S):
                rows += 1
                name, meaning = text_of(name), text_of(meaning)
                if (not STATUS.match(name) or not meaning
                        or re.match(r"NTR_(OK|ERR_[A-Z]+)\s*[,.]?$", meaning)
                        or re.match(r"NTR_(OK|ERR_[A-Z]+)\s*,", meaning)):
                    bad += 1
                    if len(examples) < 8:
                        examples.append("%s: [%s] [%s]" % (os.path.basename(path), name, meaning))
    report.check(rows > 0 and bad == 0,
                 "%d return-value rows, each one status with its meaning" % rows,
                 "%d of %d return-value rows are not one status with its meaning "
                 "(a run-together @retval list?): %s" % (bad, rows, "; ".join(examples)))


def check_offline(htmldir, pages, report):
    remote, missing = [], []
    formula_pages = without_mathjax = 0
    for path, text in pages.items():
        refs = re.findall(r'<script\b[^>]*\bsrc="([^"]*)"', text)
        refs += [m for tag in re.findall(r"<link\b[^>]*>", text)
                 if "stylesheet" in tag for m in re.findall(r'\bhref="([^"]*)"', tag)]
        for ref in refs:
            if re.match(r"^(https?:)?//", ref, re.I):
                remote.append("%s: %s" % (os.path.basename(path), ref))
                continue
            local = os.path.join(os.path.dirname(path), ref.split("?")[0].split("#")[0])
            if not os.path.exists(local):
                missing.append("%s: %s" % (os.path.basename(path), ref))
        if 'class="formulaDsp"' in text or "\\(" in text:
            formula_pages += 1
            if "mathjax/MathJax.js" not in refs:
                without_mathjax += 1
    report.check(not remote, "no script or style sheet loaded over the network",
                 "loaded over the network: " + "; ".join(sorted(set(remote))[:8]))
    report.check(not missing, "every script and style sheet the pages load is in the manual",
                 "missing: " + "; ".join(sorted(set(missing))[:8]))
    report.check(formula_pages > 0 and without_mathjax == 0,
                 "%d pages with equations, each loading mathjax/MathJax.js" % formula_pages,
                 "%d pages with equations, %d not loading the local MathJax"
                 % (formula_pages, without_mathjax))
    # What the pages' MathJax configuration asks for must be in the copy.
    # An extension named without its directory ("AMSmath.js" in a TeX
    # block) lives under extensions/TeX/.
    wanted = set()
    for text in pages.values():
        for config in re.findall(r"MathJax\.Hub\.Config\((.*?)\);", text, re.S):
            lists = " ".join(re.findall(r"\b(?:extensions|jax)\s*:\s*\[([^\]]*)\]", config))
            for ext in re.findall(r'"([\w/-]+?)(?:\.js)?"', lists):
                if ext.startswith(("input/", "output/")):
                    wanted.add("jax/%s/config.js" % ext)
                else:
                    wanted.add("extensions/%s.js" % ext)
    def present(w):
        base = os.path.join(htmldir, "mathjax")
        alt = w.replace("extensions/", "extensions/TeX/", 1)
        return os.path.isfile(os.path.join(base, w)) or os.path.isfile(os.path.join(base, alt))
    lacking = [w for w in sorted(wanted) if not present(w)]
    report.check(wanted and not lacking,
                 "the local MathJax holds what the pages ask for (%s)" % ", ".join(sorted(wanted)),
                 "html/mathjax lacks %s" % (", ".join(lacking) or "a configuration to check"))


def check_front_page(htmldir, header, report):
    groups = re.findall(r"@defgroup\s+(\w+)", open(header, encoding="utf-8").read())
    index = open(os.path.join(htmldir, "index.html"), encoding="utf-8").read()
    files = ["group__%s.html" % g.replace("_", "__") for g in groups]
    unlinked = [g for g, f in zip(groups, files)
                if 'href="%s"' % f not in index
                or not os.path.isfile(os.path.join(htmldir, f))]
    report.check(groups and not unlinked,
                 "the front page links to all %d header sections" % len(groups),
                 "the front page does not link to the header section(s) %s "
                 "(README.md: [name](include/natremia.h#name))" % ", ".join(unlinked))


def page_title(path):
    with open(path, encoding="utf-8") as page:
        for line in page:
            if line.strip():
                return re.sub(r"\s*\{#[\w-]+\}\s*$", "", line.strip().lstrip("#").strip())
    return ""


def check_navigation(htmldir, srcroot, report):
    nav = open(os.path.join(htmldir, "navtreedata.js"), encoding="utf-8").read()
    # Top-level entries under the front page: four spaces in.
    titles = [html.unescape(t) for t in re.findall(r'^    \[ "((?:[^"\\]|\\.)*)", ', nav, re.M)]
    sources = sorted(os.path.relpath(p, srcroot)
                     for p in glob.glob(os.path.join(srcroot, "docs", "*.md")))
    sources.append("DEVELOPERS.md")
    position, absent = {}, []
    for source in sources:
        title = page_title(os.path.join(srcroot, source))
        if title in titles:
            position[source] = titles.index(title)
        else:
            absent.append("%s (%s)" % (source, title))
    report.check(not absent, "all %d pages are in the navigation" % len(sources),
                 "not in the manual (add to INPUT in docs/Doxyfile.in): " + ", ".join(absent))
    first_contributor = min(position.get(p, len(titles)) for p in CONTRIBUTOR_PAGES)
    late = [s for s in sources
            if s not in CONTRIBUTOR_PAGES and position.get(s, -1) > first_contributor]
    report.check(not late, "every user page comes before the contributor pages",
                 "user pages after the contributor pages in the navigation: " + ", ".join(late))


def main():
    htmldir, header, srcroot = sys.argv[1:4]
    pages = {}
    for path in glob.glob(os.path.join(htmldir, "*.html")):
        with open(path, encoding="utf-8") as f:
            pages[path] = f.read()
    report = Report()
    if not pages:
        print("FAIL: no HTML pages in " + htmldir)
        return 1
    check_retvals(pages, report)
    check_offline(htmldir, pages, report)
    check_front_page(htmldir, header, report)
    check_navigation(htmldir, srcroot, report)
    return 1 if report.failed else 0


if __name__ == "__main__":
    sys.exit(main())
