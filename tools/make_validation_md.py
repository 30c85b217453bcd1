"""Regenerate docs/validation.md from the test vectors (run from the repository root)."""

from pathlib import Path

from cellfuncs.validation import validation_markdown

ROOT = Path(__file__).resolve().parent.parent
(ROOT / "docs" / "validation.md").write_text(validation_markdown(ROOT), encoding="utf-8")
print("wrote docs/validation.md")
