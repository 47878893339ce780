"""Writing a spec (a dictionary in the format of ``specs/FORMAT.md``) as TOML text.

Quiver families, presentations, campaigns and the Ringel dual all write specs
that every hwcat command reads back; this is the one writer they share.
"""

from __future__ import annotations

import re
from typing import Any

from hwcat.errors import SpecError

__all__ = ["spec_to_toml"]


_BARE_KEY = re.compile(r"^[A-Za-z0-9_-]+$")
_ESCAPES = {
    '"': '\\"',
    "\\": "\\\\",
    "\b": "\\b",
    "\t": "\\t",
    "\n": "\\n",
    "\f": "\\f",
    "\r": "\\r",
}


def _key(k: Any) -> str:
    if not isinstance(k, str):
        raise SpecError(f"spec_to_toml: key {k!r} is not a string")
    return k if _BARE_KEY.match(k) else _string(k)


def _string(s: str) -> str:
    out = []
    for ch in s:
        if ch in _ESCAPES:
            out.append(_ESCAPES[ch])
        elif ord(ch) < 0x20 or ord(ch) == 0x7F:
            out.append(f"\\u{ord(ch):04X}")
        else:
            out.append(ch)
    return '"' + "".join(out) + '"'


def _value(v: Any, where: str) -> str:
    if isinstance(v, bool):
        return "true" if v else "false"
    if isinstance(v, int):
        return str(v)
    if isinstance(v, str):
        return _string(v)
    if isinstance(v, list | tuple):
        return "[" + ", ".join(_value(x, where) for x in v) + "]"
    raise SpecError(
        f"spec_to_toml: value {v!r} at {where!r} is not a string, integer, boolean or list of these"
    )


def _table(d: dict, prefix: str, lines: list[str]) -> None:
    subtables = []
    for k, v in d.items():
        if v is None:
            continue
        if isinstance(v, dict):
            subtables.append((k, v))
        else:
            lines.append(f"{_key(k)} = {_value(v, prefix + str(k))}")
    for k, v in subtables:
        name = f"{prefix}{_key(k)}"
        lines.append("")
        lines.append(f"[{name}]")
        _table(v, name + ".", lines)


def spec_to_toml(spec: dict) -> str:
    """Write a spec dict as TOML text that :mod:`tomllib` reads back to the same dict.

    Supported values: strings, integers, booleans, lists of these, and nested
    dicts (written as tables).  Keys whose value is ``None`` are left out.

    Raises
    ------
    SpecError
        For any other value (floats in particular: specs are exact).

    Examples
    --------
    >>> import tomllib
    >>> spec = {"name": 'say "hi"', "quiver": {"vertices": ["1"], "arrows": []}}
    >>> tomllib.loads(spec_to_toml(spec)) == spec
    True
    """
    if not isinstance(spec, dict):
        raise SpecError(f"spec_to_toml: expected a dict, got {type(spec).__name__}")
    lines: list[str] = []
    _table(spec, "", lines)
    if lines and lines[0] == "":
        lines.pop(0)
    return "\n".join(lines) + "\n"
