import os
import sys
from pathlib import Path

from hypothesis import settings

sys.path.insert(0, str(Path(__file__).parent))

# CI runs the property tests with a fixed seed (the same examples every run), so a red CI
# always points at a reproducible case; developers run them random, and longer with
# CELLFUNCS_FUZZ_EXAMPLES=2000 python -m pytest tests/test_reliability.py
settings.register_profile("ci", derandomize=True, deadline=None, print_blob=True)
settings.register_profile("dev", deadline=None, print_blob=True)
settings.load_profile("ci" if os.environ.get("CI") else "dev")
