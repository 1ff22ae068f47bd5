#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Checks that the built library keeps the promises of the design card.

Usage: check_exports.py <libnatremia.so> <libnatremia.a>

1. Exports: `nm -D --defined-only` on the shared library lists only ntr_*
   code or read-only data: the 1.0.0 functions (read from the frozen ABI
   baseline tests/abi/1.0.0/natremia.abi) at version NATREMIA_1, every
   later one at NATREMIA_1.1, plus the two version nodes.
2. Imports: `nm -D --undefined-only` lists nothing but the allow-lists
   below. Allocator, stdio, locale and errno imports get a named failure.
3. No mutable state: the library's own object files (the members of the
   static archive) contain no writable data.

Why the static archive and not the .so for point 3: the shared object also
contains the C runtime's start-up objects (crtbeginS.o and friends), which
bring their own .data/.bss (`__dso_handle`, `completed.0`, `__TMC_END__`).
Those are the toolchain's, not ours, and are present in every shared
library. The archive members are exactly the objects compiled from lib/*.c
(meson builds them position-independent, as for the .so), so they show
our data and nothing else.

Exit status: 0 all good, 1 a check failed, 2 usage or tool error.
"""

import re
import subprocess
import sys

import os

VERSION_NODE = "NATREMIA_1"
VERSION_NODE_1_1 = "NATREMIA_1.1"
RELEASED_ABI = os.path.join(os.path.dirname(os.path.abspath(__file__)),
                            "abi", "1.0.0", "natremia.abi")


def released_functions():
    """Names of the functions exported by 1.0.0, from the frozen baseline."""
    with open(RELEASED_ABI, encoding="utf-8") as f:
        return frozenset(re.findall(r"<elf-symbol name='(ntr_[a-z0-9_]+)'", f.read()))

# libm functions the library may import. Keep this list short: add a
# function only when a formula truly needs it, and say which one.
# Currently none: every formula is plain arithmetic (sqrt, exp, log and
# pow are not used). A libm import that is not listed here fails the test.
LIBM_ALLOWED = frozenset()

# The compiler may emit calls to these for struct copies and zeroing even
# when the source never calls them. They touch only caller memory.
COMPILER_MEMORY_HELPERS = frozenset({"memcpy", "memmove", "memset", "memcmp"})

# Weak symbols the toolchain's start-up objects reference in every shared
# library (transactional-memory hooks, profiler hook, atexit for C++
# destructors). They are not calls made by our code.
LOADER_WEAK = frozenset({
    "_ITM_deregisterTMCloneTable",
    "_ITM_registerTMCloneTable",
    "__cxa_finalize",
    "__gmon_start__",
})

# Ubuntu's gcc enables -fstack-protector-strong by default; the guard calls
# this only when the stack has already been corrupted.
TOOLCHAIN_HARDENING = frozenset({"__stack_chk_fail"})

# Imports that break a promise, with the promise they break. These are
# reported by name; anything else outside the allow-lists fails too.
FORBIDDEN_PATTERNS = [
    ("allocator", re.compile(
        r"^(malloc|calloc|realloc|reallocarray|free|aligned_alloc|"
        r"posix_memalign|memalign|valloc|pvalloc|strdup|strndup|"
        r"__libc_malloc|__libc_free|mmap|mmap64|sbrk|brk|alloca|"
        r"_Znwm|_Znam|_ZdlPv|_ZdaPv|_ZdlPvm)$")),
    ("stdio", re.compile(
        r"^(_?_?v?[sfd]?n?printf|__[a-z]*printf_chk|puts|fputs|putchar|"
        r"fputc|putc|_IO_.*|f?open(64)?|fdopen|freopen|fclose|fwrite|fread|"
        r"fflush|fgets|gets|getchar|fgetc|getc|scanf|sscanf|fscanf|"
        r"__isoc99_.*scanf|perror|setvbuf|setbuf|stdin|stdout|stderr|"
        r"write|read|syslog)$")),
    ("locale", re.compile(
        r"^(setlocale|localeconv|newlocale|uselocale|freelocale|duplocale|"
        r"nl_langinfo|__ctype_.*|.*_l)$")),
    ("errno", re.compile(r"^(__errno_location|errno|__h_errno_location)$")),
    ("global state", re.compile(
        r"^(rand|srand|random|srandom|getenv|setenv|putenv|time|clock|"
        r"strtok|pthread_.*|atexit|signal)$")),
    ("process control", re.compile(r"^(abort|exit|_exit|raise|__assert_fail)$")),
]


def run(argv):
    try:
        done = subprocess.run(argv, check=True, capture_output=True, text=True)
    except FileNotFoundError:
        sys.exit(f"check_exports: {argv[0]} not found (apt-get install binutils)")
    except subprocess.CalledProcessError as err:
        sys.stderr.write(err.stderr)
        sys.exit(f"check_exports: {' '.join(argv)} failed ({err.returncode})")
    return done.stdout


def check_defined(so_path):
    """Every defined dynamic symbol is ntr_* at its node, or a version node."""
    problems = []
    exports = []
    released = released_functions()
    for line in run(["nm", "-D", "--defined-only", so_path]).splitlines():
        fields = line.split()
        if len(fields) < 2:
            continue
        kind, name = fields[-2], fields[-1]
        if kind == "A" and name in (VERSION_NODE, VERSION_NODE_1_1):
            continue
        base, _, version = name.partition("@@")
        if not base.startswith("ntr_"):
            problems.append(f"exported symbol without ntr_ prefix: {name}")
        elif version != (VERSION_NODE if base in released else VERSION_NODE_1_1):
            want = VERSION_NODE if base in released else VERSION_NODE_1_1
            problems.append(f"{base} is not at default version {want}: {name}")
        elif kind not in ("T", "R"):
            # Exported writable data (D, B) would be shared mutable state.
            problems.append(f"{base} is exported with nm type {kind}, not code or read-only data")
        exports.append(base)
    if not exports:
        problems.append("no ntr_* symbols exported at all")
    for gone in sorted(released - set(exports)):
        problems.append(f"{gone} was exported by 1.0.0 and is missing")
    return problems, sorted(exports)


def classify_import(name):
    """The broken promise's name, or None when the import is allowed."""
    for promise, pattern in FORBIDDEN_PATTERNS:
        if pattern.match(name):
            return promise
    allowed = LIBM_ALLOWED | COMPILER_MEMORY_HELPERS | LOADER_WEAK | TOOLCHAIN_HARDENING
    if name in allowed:
        return None
    return "not in the allow-lists; a needed libm function goes in LIBM_ALLOWED"


def check_undefined(so_path):
    problems = []
    imports = []
    for line in run(["nm", "-D", "--undefined-only", so_path]).splitlines():
        fields = line.split()
        if len(fields) < 2:
            continue
        kind, name = fields[-2], fields[-1]
        base = name.split("@")[0]
        imports.append(f"{kind} {base}")
        if base in LOADER_WEAK and kind not in ("w", "v"):
            problems.append(f"loader symbol {base} is imported strongly ({kind})")
            continue
        why = classify_import(base)
        if why is not None:
            problems.append(f"forbidden import ({why}): {name}")
    return problems, imports


# Sections that are writable in an object file but read-only at run time:
# tables of pointers (such as `static const char *const names[]`) need load
# relocations in position-independent code, so the compiler puts them in
# .data.rel.ro*, which the loader makes read-only after relocating (RELRO).
RELRO_SECTION = re.compile(r"^\.data\.rel\.ro(\..*)?$")


def writable_sections(archive_path):
    """(member, section, size) for every non-empty writable section we own."""
    found = []
    member = None
    header = re.compile(r"^File: .*\((.*)\)$")
    # readelf -S -W rows: [Nr] Name Type Address Off Size ES Flg Lk Inf Al
    row = re.compile(r"^\s*\[\s*\d+\]\s+(\S+)\s+(\S+)\s+\S+\s+\S+\s+(\S+)\s+\S+\s+(\S*)\s")
    for line in run(["readelf", "-S", "-W", archive_path]).splitlines():
        m = header.match(line)
        if m:
            member = m.group(1)
            continue
        m = row.match(line)
        if not m or member is None:
            continue
        name, sec_type, size_hex, flags = m.groups()
        size = int(size_hex, 16)
        if "W" not in flags or "A" not in flags or size == 0:
            continue
        if RELRO_SECTION.match(name):
            continue
        found.append((member, name, size, sec_type))
    return found


def check_no_mutable_state(archive_path):
    problems = []
    for member, name, size, sec_type in writable_sections(archive_path):
        problems.append(f"{member}: writable section {name} ({sec_type}, {size} bytes)")
    # Name the variables too, so the failure says what to make const.
    # nm types: D/d initialised data, B/b zero-initialised data, C common,
    # V/v weak objects, G/g/S/s small data. RELRO tables show as d/D as
    # well, so those are filtered by section first (objdump gives it).
    for line in run(["objdump", "-t", archive_path]).splitlines():
        fields = line.split()
        # value flags... section size name
        if len(fields) < 4 or not re.fullmatch(r"[0-9a-f]{8,16}", fields[0]):
            continue
        name = fields[-1]
        section = fields[-3]
        if section == "*COM*":
            problems.append(f"common (uninitialised global) variable: {name}")
        elif "O" in fields[1:-3] and (
                section in (".data", ".bss", ".tdata", ".tbss")
                or re.match(r"^\.(data|bss|tdata|tbss)\.", section)) and not RELRO_SECTION.match(section):
            problems.append(f"mutable variable {name} in {section}")
    return problems


def main(argv):
    if len(argv) != 3:
        sys.stderr.write(__doc__)
        return 2
    so_path, archive_path = argv[1], argv[2]

    defined_problems, exports = check_defined(so_path)
    undefined_problems, imports = check_undefined(so_path)
    state_problems = check_no_mutable_state(archive_path)

    released = released_functions()
    print(f"{len(exports)} exports ({len(released)} at {VERSION_NODE}, "
          f"{len(set(exports) - released)} at {VERSION_NODE_1_1}):")
    for name in exports:
        print(f"  {name}")
    print(f"{len(imports)} imports:" + ("" if imports else " none"))
    for name in imports:
        print(f"  {name}")
    print("libm allow-list: " + (", ".join(sorted(LIBM_ALLOWED)) or "(empty)"))

    problems = defined_problems + undefined_problems + state_problems
    for p in problems:
        print(f"FAIL: {p}")
    if problems:
        return 1
    print("OK: only ntr_* exports, no allocator/stdio/locale/errno imports, no mutable data")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
