# SPDX-License-Identifier: MIT
"""Finding and loading libnatremia.so.1.

Search order (the first that loads wins):

1. the environment variable ``NATREMIA_LIBRARY``: a path to the shared
   object (used by the test suite to point at a fresh build); when set,
   nothing else is tried;
2. the copy bundled in the package (``natremia/libnatremia.so.1``), which
   the package build compiles from the C sources (bindings/python/setup.py);
3. ``pkg-config --variable=libdir natremia``: the library installed with
   its pkg-config file (``libnatremia.so.1`` in that directory);
4. the system loader: ``libnatremia.so.1`` by soname, then whatever
   ``ctypes.util.find_library("natremia")`` reports.

``natremia.library_path()`` says which one was loaded.
"""

import ctypes
import ctypes.util
import os
import shutil
import subprocess

SONAME = "libnatremia.so.1"
ENV_VAR = "NATREMIA_LIBRARY"
EXPECTED_MAJOR = 1
BUNDLED = os.path.join(os.path.dirname(os.path.abspath(__file__)), SONAME)


class LibraryNotFound(OSError):
    """No usable libnatremia was found; the message lists what was tried."""


def _from_pkg_config():
    if shutil.which("pkg-config") is None:
        return None
    try:
        done = subprocess.run(
            ["pkg-config", "--variable=libdir", "natremia"],
            check=False, capture_output=True, text=True, timeout=10)
    except (OSError, subprocess.SubprocessError):
        return None
    libdir = done.stdout.strip()
    if done.returncode != 0 or not libdir:
        return None
    return os.path.join(libdir, SONAME)


def _candidates():
    path = os.environ.get(ENV_VAR)
    if path:
        # An explicit choice is not second-guessed: no fallback when it fails.
        yield ENV_VAR, path
        return
    if os.path.isfile(BUNDLED):
        yield "bundled", BUNDLED
    found = _from_pkg_config()
    if found:
        yield "pkg-config", found
    yield "loader", SONAME
    found = ctypes.util.find_library("natremia")
    if found:
        yield "find_library", found


def load():
    """Load the library and check its major version; return the CDLL."""
    tried = []
    for how, path in _candidates():
        try:
            lib = ctypes.CDLL(path)
        except OSError as exc:
            tried.append("%s: %s (%s)" % (how, path, exc))
            continue
        lib.ntr_version_number.restype = ctypes.c_ulong
        lib.ntr_version_number.argtypes = []
        major = lib.ntr_version_number() // 10000
        if major != EXPECTED_MAJOR:
            tried.append("%s: %s has major version %d, this binding needs %d"
                         % (how, path, major, EXPECTED_MAJOR))
            continue
        lib.natremia_found_by = how
        return lib
    raise LibraryNotFound(
        "libnatremia not found; set %s to the path of %s. Tried: %s"
        % (ENV_VAR, SONAME, "; ".join(tried) or "nothing"))
