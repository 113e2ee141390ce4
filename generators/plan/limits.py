"""Hard limits below which a design is refused as unbuildable (exit 2).

The design rules of ``hubwright check`` warn well before these; these only stop parts
that would break through or cannot be drilled.
"""

# Material left between two cuts (socket to socket, socket to bore, hole to hole)
# below which the part is refused: 1.5 mm (common practice: thinner webs tear out when
# drilled or printed).
MIN_WEB_MM = 1.5
# Wall from the bore to the nearest outer face: 3 mm (common practice).
MIN_BORE_WALL_MM = 3.0
# A hole's rim must stay at least half its diameter from any edge of the face it is
# drilled into, and never under 1 mm (common practice for drilling without breakout).
EDGE_FACTOR = 0.5
MIN_EDGE_MM = 1.0
# The cutter starts this far outside the entry and runs this far past a far face or
# into a void, so no cut ends exactly on another surface (tangent contacts leave
# seams in the exported mesh).
CUT_OVERRUN_MM = 1.0
# Size limits: anything beyond these is not a hub (and would make the kernel work for
# minutes).
MAX_BODY_MM = 1000.0
MIN_BODY_MM = 5.0
