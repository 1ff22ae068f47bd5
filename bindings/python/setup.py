# SPDX-License-Identifier: MIT
"""Build step of the natremia Python package: compile libnatremia.so.1
from the C sources and ship it inside the package (natremia/), so that
``pip install --no-build-isolation --no-index ./bindings/python`` gives a
package that imports without a separate C install.

Where the C sources are found (the first that has lib/ and include/):

1. the environment variable ``NATREMIA_SOURCE_ROOT`` (a natremia tree);
2. ``csrc/`` beside this file: the copy an sdist carries (see ``_Sdist``);
3. ``../..``: this file's place in the natremia repository
   (bindings/python is two levels below the root).

The compiler is ``$CC`` (default ``cc``), with the project's own flags:
C99, the warnings of meson.build, ``-ffp-contract=off`` (results must not
depend on fused multiply-adds), hidden visibility with the version script,
and SSE2 arithmetic on 32-bit x86. Warnings are not errors here (a user's
newer compiler must not stop an install); the project build keeps -Werror.

An optional CPython extension, natremia._speed (src/_speed.c), speeds up
the scalar calls; it is built only when Python's headers are installed.
"""

import os
import platform
import shutil
import subprocess
import sys

from setuptools import Distribution, Extension, setup
from setuptools.command.build_py import build_py
from setuptools.command.sdist import sdist

HERE = os.path.dirname(os.path.abspath(__file__))
SONAME = "libnatremia.so.1"


def _has_sources(root):
    return (os.path.isfile(os.path.join(root, "include", "natremia.h"))
            and os.path.isfile(os.path.join(root, "lib", "natremia.map")))


def source_root():
    """The directory holding the C sources (lib/ and include/)."""
    tried = []
    for root in (os.environ.get("NATREMIA_SOURCE_ROOT"),
                 os.path.join(HERE, "csrc"),
                 os.path.normpath(os.path.join(HERE, "..", ".."))):
        if not root:
            continue
        if _has_sources(root):
            return root
        tried.append(root)
    raise SystemExit("natremia: C sources not found (lib/ and include/); tried "
                     + ", ".join(tried) + ". Build from the natremia repository, "
                     "from its sdist, or set NATREMIA_SOURCE_ROOT.")


def c_flags():
    flags = ["-std=c99", "-O2", "-fPIC", "-fvisibility=hidden", "-DNTR_BUILDING",
             "-ffp-contract=off", "-Wall", "-Wextra", "-Wpedantic",
             "-Wconversion", "-Wshadow", "-Wdouble-promotion"]
    if platform.machine() in ("i386", "i486", "i586", "i686", "x86"):
        flags += ["-msse2", "-mfpmath=sse"]
    return flags


def build_library(root, out_dir, temp_dir):
    """Compile lib/*.c into out_dir/libnatremia.so.1; returns its path."""
    cc = os.environ.get("CC", "cc").split()
    lib_dir = os.path.join(root, "lib")
    sources = sorted(os.path.join(lib_dir, f) for f in os.listdir(lib_dir)
                     if f.endswith(".c"))
    os.makedirs(temp_dir, exist_ok=True)
    os.makedirs(out_dir, exist_ok=True)
    objects = []
    for src in sources:
        obj = os.path.join(temp_dir, os.path.basename(src)[:-2] + ".o")
        subprocess.run(cc + c_flags() + ["-I", os.path.join(root, "include"),
                                         "-I", lib_dir, "-c", src, "-o", obj],
                       check=True)
        objects.append(obj)
    target = os.path.join(out_dir, SONAME)
    subprocess.run(cc + ["-shared", "-Wl,-soname," + SONAME,
                         "-Wl,--version-script=" + os.path.join(lib_dir, "natremia.map"),
                         "-Wl,-z,defs", "-o", target] + objects + ["-lm"],
                   check=True)
    return target


class _BuildPy(build_py):
    """The Python files, plus the compiled library beside them."""

    def run(self):
        super().run()
        root = source_root()
        temp = os.path.join(self.get_finalized_command("build").build_temp,
                            "natremia-c")
        target = build_library(root, os.path.join(self.build_lib, "natremia"), temp)
        print("natremia: built %s from %s" % (target, root), file=sys.stderr)


class _Sdist(sdist):
    """An sdist that carries the C sources in csrc/ (lib/, include/,
    LICENSE), so it builds away from the repository."""

    def make_release_tree(self, base_dir, files):
        super().make_release_tree(base_dir, files)
        root = source_root()
        dest = os.path.join(base_dir, "csrc")
        for sub in ("lib", "include"):
            shutil.copytree(os.path.join(root, sub), os.path.join(dest, sub),
                            dirs_exist_ok=True)
        licence = os.path.join(root, "LICENSE")
        if os.path.isfile(licence):
            shutil.copy2(licence, dest)


class _BinaryDistribution(Distribution):
    """The wheel holds a compiled library: tag it for the platform."""

    def has_ext_modules(self):
        return True


# The optional accelerator of the scalar calls (src/_speed.c): built when
# Python's headers are there (Debian: python3-dev), skipped with a warning
# otherwise; the binding then runs on ctypes alone, with the same results.
SPEED = Extension("natremia._speed", ["src/_speed.c"], optional=True,
                  extra_compile_args=["-O2", "-Wall", "-Wextra"])

setup(cmdclass={"build_py": _BuildPy, "sdist": _Sdist},
      distclass=_BinaryDistribution, ext_modules=[SPEED])
