"""``hubwright size``: search the hub dimensions for the lightest (or smallest-stock) design
that passes every rule of ``hubwright check``.

The search rebuilds the config from its raw TOML data with new values, validates it again
and runs ``design()`` on it, so it judges each candidate with exactly the rules ``check``
runs. No CAD import (see tests/design/test_imports.py).
"""

from generators.sizing.search import SizingResult, size  # noqa: F401
