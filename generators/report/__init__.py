"""Manifest, summaries and reports built from the plan and the build results."""
