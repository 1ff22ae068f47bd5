#!/usr/bin/env python3
# SPDX-License-Identifier: MIT
"""Runs the Python binding tests (meson test 'python-binding').

Exit 77 (skipped) only when numpy or hypothesis is not installed
(apt-get install python3-numpy python3-hypothesis); any other failure,
including a library that cannot be loaded, is a test failure.
"""

import os
import sys
import unittest

try:
    import numpy  # noqa: F401
    import hypothesis  # noqa: F401
except ImportError as exc:
    print("skipped: %s (apt-get install python3-numpy python3-hypothesis)" % exc)
    sys.exit(77)

here = os.path.dirname(os.path.abspath(__file__))
suite = unittest.defaultTestLoader.discover(here, pattern="test_*.py",
                                            top_level_dir=here)
result = unittest.TextTestRunner(verbosity=2).run(suite)
sys.exit(0 if result.wasSuccessful() and result.testsRun > 0 else 1)
