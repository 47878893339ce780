"""``python -m hwcat.cli``: the same as the ``hwcat`` command."""

import sys

from hwcat.cli import main

sys.exit(main())
