"""Shared pytest setup: hypothesis profiles (short in CI, long on demand)."""

import os

from hypothesis import HealthCheck, settings

# HYPOTHESIS_PROFILE=long python -m pytest tests/reliability  -> the long run
settings.register_profile("ci", max_examples=6, deadline=None, derandomize=True,
                          suppress_health_check=[HealthCheck.too_slow])
settings.register_profile("long", max_examples=300, deadline=None,
                          suppress_health_check=[HealthCheck.too_slow])
settings.load_profile(os.environ.get("HYPOTHESIS_PROFILE", "ci"))
