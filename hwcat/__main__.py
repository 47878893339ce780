"""``python -m hwcat``: the same as the ``hwcat`` command."""

import sys

from hwcat.cli import main

sys.exit(main())
