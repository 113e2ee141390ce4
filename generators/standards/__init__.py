"""Standard tables and rules: threads, drills, tap drills, fasteners, mast sizes, materials.

Pure Python and stdlib only, so ``hubwright threads`` starts fast. Every value's
source sits beside it in the packaged CSV files under ``data/``.
"""
