"""The certificate commands: certify (write one) and verify (check one)."""

from __future__ import annotations

import argparse
import sys

from hwcat.cli.common import (
    add_algebra_source,
    load_algebra,
    order_argument,
    with_order_context,
    write_text,
)
from hwcat.errors import CertificateError
from hwcat.io.render import json_text, to_json

__all__ = ["register"]


def _cmd_certify(args: argparse.Namespace) -> int:
    from hwcat.theory.certificate import certify
    from hwcat.theory.check import as_order

    spec, A = load_algebra(args)
    text, source = order_argument(spec, args.order)
    order = None if text is None else with_order_context(spec, source, lambda: as_order(A, text))
    cert = certify(A, order, order_source=source)
    out = json_text(cert.data) + "\n"
    if args.output:
        write_text(args.output, out)
    else:
        sys.stdout.write(out)
    verdict = "quasi-hereditary" if cert.quasi_hereditary else "NOT quasi-hereditary"
    where = f"wrote {args.output}: " if args.output else ""
    print(f"{where}{verdict} for {cert.order.chain_text()} ({cert.order_source})", file=sys.stderr)
    return 0 if cert.quasi_hereditary else 1


def _cmd_verify(args: argparse.Namespace) -> int:
    from hwcat.verify import Malformed, verify_file

    try:
        v = verify_file(args.certificate)
    except Malformed as exc:
        raise CertificateError(f"{args.certificate}: {exc}") from None
    if args.json:
        print(to_json(v))
    else:
        print(("ACCEPTED: " if v.accepted else "REJECTED: ") + v.reason)
    return 0 if v.accepted else 1


def register(sub: argparse._SubParsersAction) -> None:
    """Add this module's commands to the parser."""
    c = sub.add_parser(
        "certify",
        help="write a certificate that the algebra is (or is not) quasi-hereditary for an order",
    )
    add_algebra_source(c)
    c.add_argument("--order", help="the order (default: the spec's, else the one the search finds)")
    c.add_argument("-o", "--output", help="write the certificate (JSON) to this file")
    c.set_defaults(func=_cmd_certify)
    v = sub.add_parser("verify", help="check a certificate independently of the rest of hwcat")
    v.add_argument("certificate", help="certificate file (JSON) written by hwcat certify")
    v.add_argument("--json", action="store_true", help="print one JSON object")
    v.set_defaults(func=_cmd_verify)
