"""``python -m generators`` runs the hubwright command line."""

from generators.cli import main

raise SystemExit(main())
