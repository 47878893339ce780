"""See :mod:`hwcat.algebras` for what this room holds."""
