"""The certificate commands: certify (write one) and verify (check one)."""

from __future__ import annotations

import argparse
import json
import sys

from hwcat.errors import CertificateError, OrderError, SpecError

__all__ = ["register"]


def _cmd_certify(args: argparse.Namespace) -> int:
    from hwcat.io.spec import build_algebra, read_spec
    from hwcat.theory.certificate import certify
    from hwcat.theory.orders import parse_order

    spec = read_spec(args.spec)
    A = build_algebra(spec)
    text, source = (args.order, "command line") if args.order else (spec.order, "spec file")
    order = None
    if text:
        try:
            order = parse_order(text, A.vertices)
        except OrderError as exc:
            where = "--order" if source == "command line" else f"{spec.source}: order"
            raise OrderError(f"{where}: {exc}") from None
    cert = certify(A, order, order_source=source)
    out = json.dumps(cert.data, indent=1) + "\n"
    if args.output:
        try:
            with open(args.output, "w", encoding="utf-8") as fh:
                fh.write(out)
        except OSError as exc:
            raise SpecError(f"{args.output}: cannot write: {exc.strerror or exc}") from None
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
        print(json.dumps(v.to_dict(), indent=2))
    else:
        print(("ACCEPTED: " if v.accepted else "REJECTED: ") + v.reason)
    return 0 if v.accepted else 1


def register(sub: argparse._SubParsersAction) -> None:
    """Add this module's commands to the parser."""
    c = sub.add_parser(
        "certify",
        help="write a certificate that the algebra is (or is not) quasi-hereditary for an order",
    )
    c.add_argument("spec", help="algebra spec file")
    c.add_argument("--order", help="the order (default: the spec's, else the one the search finds)")
    c.add_argument("-o", "--output", help="write the certificate (JSON) to this file")
    c.set_defaults(func=_cmd_certify)
    v = sub.add_parser("verify", help="check a certificate independently of the rest of hwcat")
    v.add_argument("certificate", help="certificate file (JSON) written by hwcat certify")
    v.add_argument("--json", action="store_true", help="print one JSON object")
    v.set_defaults(func=_cmd_verify)
