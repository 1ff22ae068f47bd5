#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# The reference manual builds warning-free, reads as the manual promises,
# and every computing function's documentation carries what it must (P5).
#
#   check_manual.sh <Doxyfile> <include/natremia.h> <mathjax-dir>
#
# 1. Builds the manual as `ninja docs` does (tests/lib/build-manual.sh:
#    Doxygen with the project's configuration, WARN_AS_ERROR =
#    FAIL_ON_WARNINGS, then Debian's MathJax copied in) into a scratch
#    directory; fails on a non-zero exit or on any output at all
#    (QUIET = YES), and checks the front page, the header's page and the
#    policy pages were written.
# 2. Reads the generated HTML (tests/check_manual_html.py):
#    - every "Return values" row names one status and gives its meaning
#      (a list such as "NTR_OK, NTR_ERR_NULL, ..." once rendered as one
#      run-together token);
#    - no script or style sheet is loaded over http(s); equations are
#      typeset by the local MathJax copy, which is there;
#    - the front page links to every section of the header;
#    - every page under docs/ is in the manual, and every page for users
#      comes before the contributor pages in the navigation.
# 3. Reads the public header: every NTR_API function returning int (a
#    computing function) must have a Doxygen block naming its statuses
#    (@retval), its published source ("Reference" or "Source") and the
#    NTR_METHOD_* id(s) it uses ("Method"), and a @param for every
#    parameter (Doxygen checks the names; this checks none is skipped).
set -euo pipefail

if [[ $# -ne 3 ]]; then
    echo "usage: $0 <Doxyfile> <natremia.h> <mathjax-dir>" >&2
    exit 1
fi
doxyfile=$1
header=$2
mathjax=$3
here=$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)
fail=0

work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT

# Same configuration, scratch output, so the test never races `ninja docs`.
rc=0
bash "$here/lib/build-manual.sh" "$doxyfile" "$mathjax" "$work" > "$work/doxygen.log" 2>&1 || rc=$?
# QUIET = YES: a clean run prints nothing, so any line fails, not only
# Doxygen's warnings (an input filter that cannot start, for instance, only
# says so on stderr and leaves the page empty).
if [[ $rc -ne 0 ]] || [[ -s $work/doxygen.log ]]; then
    echo "FAIL: building the manual: exit status $rc, output:"
    cat "$work/doxygen.log"
    fail=1
else
    echo "OK: the manual builds without a warning"
fi

for page in index.html natremia_8h.html abi.html safety.html adding_a_formula.html examples.html; do
    if [[ -s "$work/html/$page" ]]; then
        echo "OK: html/$page written"
    else
        echo "FAIL: html/$page missing"
        fail=1
    fi
done

srcroot=$(cd "$(dirname "$header")/.." && pwd)
/usr/bin/python3 "$here/check_manual_html.py" "$work/html" "$header" "$srcroot" || fail=1

if ! /usr/bin/python3 - "$header" <<'EOF'
import re, sys

text = open(sys.argv[1], encoding="utf-8").read()
# A Doxygen block followed by an NTR_API declaration returning int.
decl = re.compile(r"/\*\*(?P<doc>(?:(?!\*/).)*?)\*/\s*NTR_API\s+(?:NTR_MUST_CHECK\s+)?int\s+"
                  r"(?P<name>ntr_\w+)\s*\((?P<params>[^)]*)\)\s*;", re.S)
found = 0
bad = 0
for m in decl.finditer(text):
    found += 1
    doc, name = m.group("doc"), m.group("name")
    params = [p.strip() for p in m.group("params").split(",") if p.strip() != "void"]
    names = [re.findall(r"\w+", p)[-1] for p in params if p]
    missing = []
    if "@retval" not in doc and "@return" not in doc:
        missing.append("statuses (@retval)")
    if not re.search(r"\b(References?|Source)\b", doc):
        missing.append("source (Reference:)")
    if not re.search(r"\bMethods?\b", doc):
        missing.append("method id (Method:)")
    for p in names:
        if not re.search(r"@param(\[[a-z, ]+\])?\s+" + re.escape(p) + r"\b", doc):
            missing.append("@param " + p)
    if missing:
        bad += 1
        print("FAIL: %s lacks %s" % (name, ", ".join(missing)))
if found == 0:
    print("FAIL: no documented NTR_API int functions found in the header")
    sys.exit(1)
print("%s: %d computing functions checked, %d incomplete"
      % ("OK" if bad == 0 else "FAIL", found, bad))
sys.exit(1 if bad else 0)
EOF
then
    fail=1
fi

exit $fail
