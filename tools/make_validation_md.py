"""Regenerate docs/validation.md from the test vectors (run from the repository root)."""

import sys
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parent))

from validation_md import validation_markdown  # noqa: E402

ROOT = Path(__file__).resolve().parent.parent
(ROOT / "docs" / "validation.md").write_text(validation_markdown(ROOT), encoding="utf-8")
print("wrote docs/validation.md")
