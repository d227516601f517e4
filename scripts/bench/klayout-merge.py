# KLayout batch script for the geometry benchmark (run as `klayout -b -r klayout-merge.py -rd input=F -rd output=G`).
# Reads raw pieces (one line per piece: "layer x0 y0 x1 y1 ..." in integer database units, 1 nm), builds one
# Region per layer (load, not timed), then times Region.merged() — KLayout's C++ merge — median of three runs
# per layer set, and writes "layer area_dbu2 polygons" per layer plus "merge_ms M" to the output file.
import time

import pya  # noqa: F401 (provided by klayout -b)

regions = {}
with open(input, encoding="ascii") as f:  # noqa: F821 (set by -rd)
    for line in f:
        parts = line.split()
        if not parts:
            continue
        layer = parts[0]
        xy = [int(v) for v in parts[1:]]
        pts = [pya.Point(xy[i], xy[i + 1]) for i in range(0, len(xy), 2)]
        regions.setdefault(layer, pya.Region()).insert(pya.Polygon(pts))

times = []
merged = {}
for _ in range(3):
    t = time.perf_counter()
    merged = {name: r.merged() for name, r in regions.items()}
    times.append((time.perf_counter() - t) * 1000)
times.sort()

with open(output, "w", encoding="ascii") as out:  # noqa: F821 (set by -rd)
    for name, r in merged.items():
        out.write("%s %d %d\n" % (name, r.area(), r.count()))
    out.write("merge_ms %.3f\n" % times[1])
