#!/usr/bin/env python3
# SPDX-License-Identifier: MIT
"""Doxygen input filter for the Markdown pages (FILTER_PATTERNS in
docs/Doxyfile.in).

The pages link to each other the way a repository browser needs,
[ranges](docs/ranges.md). Doxygen 1.9.4 (Debian 12) turns such a link into
a reference to the page; Doxygen 1.9.8 (Debian 13) cannot resolve it when
the target page carries its own label ("# Input ranges {#ranges}") and
fails the warning-free build. This filter hands Doxygen the label instead,
[ranges](@ref ranges), which every Doxygen version resolves, and leaves the
files themselves as they are. Links to pages without a label, to anchors
and to anything else pass through unchanged; every line keeps its number,
so Doxygen's warnings still point at the right line.

Two more forms that a repository browser shows one way and Doxygen needs
written another:
- a link into a section of the header, [units](include/natremia.h#units),
  opens the header in a repository browser; here it becomes a link to the
  section's page, group__units.html (Doxygen's file for @defgroup units);
- equations in GitHub's math syntax, a fenced block ```math ... ``` and
  inline $`...`$, become Doxygen formulas \f[ ... \f] and \f$...\f$, which
  the manual typesets with Debian's MathJax (docs/Doxyfile.in), offline.
  Other fenced blocks pass through untouched.

    md_links_filter.py FILE.md     (the filtered text on standard output)
"""
import os
import re
import sys

LABEL = re.compile(r"^#\s.*\{#(?P<label>[A-Za-z_][\w-]*)\}\s*$")
# ](target.md) with a relative path and no anchor or title
LINK = re.compile(r"\]\((?P<target>[^()\s#:]+\.md)\)")
# ](path/include/natremia.h#group)
HEADER_LINK = re.compile(r"\]\((?P<target>[^()\s#:]*include/natremia\.h)#(?P<group>\w+)\)")
# $`tex`$, or a code span (left as it is: it may show the syntax itself)
INLINE_MATH = re.compile(r"\$`(?P<tex>[^`]+)`\$|(?P<code>``.*?``|`[^`]*`)")
FENCE = re.compile(r"^\s*```")


def page_label(path):
    """The explicit label on the page's first heading, or None."""
    try:
        with open(path, encoding="utf-8") as page:
            for line in page:
                if line.strip():
                    match = LABEL.match(line.strip())
                    return match.group("label") if match else None
    except OSError:
        return None
    return None


def main():
    source = sys.argv[1]
    here = os.path.dirname(os.path.abspath(source))
    labels = {}

    def replace(match):
        target = os.path.normpath(os.path.join(here, match.group("target")))
        if target not in labels:
            labels[target] = page_label(target)
        label = labels[target]
        return "](@ref %s)" % label if label else match.group(0)

    def header_section(match):
        target = os.path.normpath(os.path.join(here, match.group("target")))
        if target.endswith(os.path.join("include", "natremia.h")):
            # The section's own page, by file name: "@ref workup" would
            # reach the page labelled workup (docs/workup.md) instead.
            return "](group__%s.html)" % match.group("group").replace("_", "__")
        return match.group(0)

    block = None  # None outside fenced blocks, else "math" or "code"
    with open(source, encoding="utf-8") as text:
        for line in text:
            if block is None and FENCE.match(line):
                block = "math" if line.strip() == "```math" else "code"
                line = "\\f[\n" if block == "math" else line
            elif block is not None and line.strip() == "```":
                line = "\\f]\n" if block == "math" else line
                block = None
            elif block is None:
                line = INLINE_MATH.sub(
                    lambda m: m.group(0) if m.group("code") else "\\f$" + m.group("tex") + "\\f$",
                    line)
                line = HEADER_LINK.sub(header_section, LINK.sub(replace, line))
            sys.stdout.write(line)


if __name__ == "__main__":
    main()
