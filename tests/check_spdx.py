#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Every source file the project tracks names its licence in an SPDX line
near its top (issue 13: release hygiene). Files that cannot carry a comment
(JSON, the frozen ABI baselines, generated reference vectors, fixtures,
Markdown pages) are left out by extension or directory.

    check_spdx.py SOURCE_ROOT
"""
import os
import re
import subprocess
import sys

TAG = "SPDX-License-Identifier: MIT"
SOURCE = re.compile(r"\.(c|h|cpp|mjs|js|ts|map|css|sh|py|build|toml|ini|cmake|R|r|control|txt|in|sql)$")
NAMED = {"Makefile", "run", "CMakeLists.txt", ".gitignore", "NAMESPACE", "configure", "cleanup"}
SKIP = re.compile(r"(^|/)(abi|fixtures|data)/|expected\.txt$|\.json$|\.md$|\.Rd$")


def wanted(path):
    if SKIP.search(path):
        return False
    return bool(SOURCE.search(path)) or os.path.basename(path) in NAMED


def main(root):
    files = subprocess.run(["git", "-C", root, "ls-files"], capture_output=True,
                           text=True, check=True).stdout.split()
    missing = []
    checked = 0
    for rel in files:
        path = os.path.join(root, rel)
        if not wanted(rel) or not os.path.isfile(path):
            continue
        checked += 1
        with open(path, encoding="utf-8", errors="replace") as f:
            head = f.read(600)
        if TAG not in head:
            missing.append(rel)
    for rel in missing:
        print(f"no '{TAG}' line near the top: {rel}")
    print(f"check_spdx: {checked} files checked, {len(missing)} without the SPDX line")
    return 1 if missing or checked == 0 else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1] if len(sys.argv) > 1 else "."))
