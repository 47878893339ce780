"""Claims for the campaign tests: plain functions taking a BasicAlgebra."""

import os

import hwcat


def small_algebras_are_quasi_hereditary(A):
    """FALSE: every algebra with at most three simples is quasi-hereditary.

    Refuted by k[x]/(x^2): a local algebra is quasi-hereditary only if it is the
    field (Dlab, Ringel, Illinois J. Math. 33 (1989): the heredity chain ends
    with an idempotent ideal AeA, and e A e must be the field).
    """
    return A.n > 3 or hwcat.is_quasi_hereditary(A)


def ringel_global_dimension_bound(A):
    """TRUE: quasi-hereditary with n simples => global dimension <= 2n - 2.

    C. M. Ringel, J. Pure Appl. Algebra 214 (2010) 1687-1692.
    """
    if not hwcat.is_quasi_hereditary(A):
        return True
    g = hwcat.global_dimension(A)
    if g.case == "infinite":
        return False
    return g.value <= 2 * A.n - 2  # "finite", or "at_least" (a lower bound)


def kills_its_worker_once(A):
    """Holds, but the first call kills the worker process that runs it."""
    marker = os.environ.get("HWCAT_TEST_MARKER", "")
    if marker and not os.path.exists(marker):
        with open(marker, "w") as fh:
            fh.write("killed\n")
        os.kill(os.getppid(), 9)
    return True


def raises_type_error(A):
    """A broken claim: raises something other than AssertionError."""
    return A.no_such_attribute


def sleeps_on_loops(A):
    """Holds, slowly on algebras with a loop (for the time limit)."""
    import time

    if any(a.source == a.target for a in A.quiver.arrows):
        time.sleep(30)
    return True


def writes_to_the_real_stdout(A):
    """Holds on the field only; on the way it writes to descriptor 1 in three ways
    and runs a subprocess that reads standard input (none may reach the protocol)."""
    import subprocess
    import sys

    subprocess.run(["echo", "external tool says hi"], check=False)
    subprocess.run([sys.executable, "-c", "import sys; sys.stdin.read()"], check=False)
    os.write(1, b'{"status": "holds"}\n')
    print("printed to the real stdout", file=sys.__stdout__, flush=True)
    return A.dim <= 1


def fails_on_odd_dimension_with_a_loop(A):
    """FALSE on k[x]/(x^3): fails when the quiver has a loop and the dimension is odd
    (a claim whose failures are not closed under quotients, for shrinking)."""
    has_loop = any(a.source == a.target for a in A.quiver.arrows)
    return not (has_loop and A.dim % 2 == 1)
