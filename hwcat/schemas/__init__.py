"""JSON Schemas (draft 2020-12) of the ``--json`` outputs of describe, check, orders,
family and verify, and of certificates (module, fuzz and survey have none).

>>> sorted(SCHEMAS)
['certificate', 'check', 'describe', 'family', 'orders', 'verify']
>>> schema("certificate")["properties"]["format"]
{'const': 'hwcat-certificate'}
"""

from __future__ import annotations

import json
from importlib import resources
from typing import Any

__all__ = ["SCHEMAS", "schema"]

SCHEMAS = ("certificate", "check", "describe", "family", "orders", "verify")
"""Names of the shipped schemas: ``hwcat/schemas/<name>.schema.json``."""


def schema(name: str) -> dict[str, Any]:
    """The schema of ``hwcat <name> --json`` (or of a certificate) as a dictionary."""
    if name not in SCHEMAS:
        raise KeyError(f"no schema {name!r}; known: {', '.join(SCHEMAS)}")
    text = resources.files(__package__).joinpath(f"{name}.schema.json").read_text("utf-8")
    return json.loads(text)
