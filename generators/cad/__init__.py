"""Solids from the plan. The only layer that imports cadquery."""
