#!/usr/bin/python3
"""Writes tests/fixtures/network/scipy-reference.json: hydraulic networks and their node pressures and channel
flows solved by SciPy's sparse direct solver (scipy.sparse.linalg.spsolve, SuperLU), as the independent reference
for tests/unit/physics/network-scipy.test.ts. Run once with Debian's python3-scipy:

    /usr/bin/python3 scripts/bench/scipy_reference.py

The Kirchhoff system is built here from the channel list on its own (not from our assembly): for every unknown
node i, sum_k g_k (p_i - p_j - offset_k) = injected flow, fixed-pressure nodes moved to the right-hand side.
The networks are generated from a fixed seed, so rerunning gives the same file.
"""
import json
import os
import random

import numpy as np
import scipy
from scipy.sparse import coo_matrix
from scipy.sparse.linalg import spsolve


def ladder(rungs):
    channels = []
    for i in range(rungs):
        channels.append({"id": f"f{i}", "from": f"A{i}", "to": f"A{i + 1}", "resistance": 1e10 * (1 + (i % 3) * 0.1)})
        channels.append({"id": f"c{i}", "from": f"B{i}", "to": f"B{i + 1}", "resistance": 1e10})
        channels.append({"id": f"n{i}", "from": f"A{i + 1}", "to": f"B{i + 1}", "resistance": 1e13 * (1 + 0.01 * ((7 * i) % 11))})
    return {"channels": channels, "sources": [{"node": "A0", "flow": 1e-9}, {"node": f"B{rungs}", "pressure": 0}]}


def grid(n):
    channels = []
    for i in range(n):
        for j in range(n):
            if i + 1 < n:
                channels.append({"id": f"h{i}.{j}", "from": f"{i}.{j}", "to": f"{i + 1}.{j}", "resistance": 1e9 * (1 + (7 * i + 3 * j) % 5)})
            if j + 1 < n:
                channels.append({"id": f"v{i}.{j}", "from": f"{i}.{j}", "to": f"{i}.{j + 1}", "resistance": 1e9 * (1 + (3 * i + 5 * j) % 7)})
    return {"channels": channels, "sources": [{"node": "0.0", "pressure": 1000}, {"node": f"{n - 1}.{n - 1}", "pressure": 0}]}


def random_mesh(nodes, extra, rng):
    """A random spanning tree plus extra links, resistances over six decades, some capillary offsets, two
    pressure sources (one far from zero gauge) and two flow sources."""
    channels = []
    for i in range(1, nodes):
        j = rng.randrange(i)
        channels.append((f"m{i}", f"N{j}", f"N{i}"))
    for k in range(extra):
        a, b = rng.sample(range(nodes), 2)
        channels.append((f"x{k}", f"N{a}", f"N{b}"))
    out = []
    for cid, a, b in channels:
        ch = {"id": cid, "from": a, "to": b, "resistance": 10 ** rng.uniform(8, 14)}
        if rng.random() < 0.15:
            ch["offset"] = rng.uniform(-300, 300)
        out.append(ch)
    sources = [
        {"node": "N0", "pressure": 25_000.0},
        {"node": f"N{nodes - 1}", "pressure": -4_000.0},
        {"node": "N1", "flow": 2e-10},
        {"node": f"N{nodes // 2}", "flow": -5e-11},
    ]
    return {"channels": out, "sources": sources}


def solve(problem):
    ids = {}
    for ch in problem["channels"]:
        for node in (ch["from"], ch["to"]):
            ids.setdefault(node, len(ids))
    n = len(ids)
    fixed = np.full(n, np.nan)
    injected = np.zeros(n)
    for s in problem["sources"]:
        if "pressure" in s:
            fixed[ids[s["node"]]] = s["pressure"]
        else:
            injected[ids[s["node"]]] += s["flow"]
    unknown = np.isnan(fixed)
    number = np.cumsum(unknown) - 1
    rows, cols, vals = [], [], []
    rhs = injected[unknown].copy()
    for ch in problem["channels"]:
        a, b = ids[ch["from"]], ids[ch["to"]]
        g = 1.0 / ch["resistance"]
        d = ch.get("offset", 0.0)
        for i, j, sign in ((a, b, 1.0), (b, a, -1.0)):
            if not unknown[i]:
                continue
            ri = number[i]
            rows.append(ri); cols.append(ri); vals.append(g)
            rhs[ri] += sign * g * d
            if unknown[j]:
                rows.append(ri); cols.append(number[j]); vals.append(-g)
            else:
                rhs[ri] += g * fixed[j]
    m = int(unknown.sum())
    matrix = coo_matrix((vals, (rows, cols)), shape=(m, m)).tocsc()
    x = spsolve(matrix, rhs)
    pressure = fixed.copy()
    pressure[unknown] = x
    flows = [(pressure[ids[ch["from"]]] - pressure[ids[ch["to"]]] - ch.get("offset", 0.0)) / ch["resistance"] for ch in problem["channels"]]
    return {"pressure": {node: float(pressure[i]) for node, i in ids.items()}, "flow": [float(q) for q in flows]}


def main():
    rng = random.Random(20261202)
    cases = [
        ("ladder of 200 nozzles", ladder(200)),
        ("square grid 18 x 18", grid(18)),
        ("random mesh, 400 nodes, offsets, four sources", random_mesh(400, 250, rng)),
    ]
    out = {
        "generator": "scripts/bench/scipy_reference.py",
        "solver": f"scipy.sparse.linalg.spsolve (SuperLU), SciPy {scipy.__version__}, NumPy {np.__version__}",
        "cases": [{"name": name, "problem": problem, **solve(problem)} for name, problem in cases],
    }
    path = os.path.join(os.path.dirname(__file__), "..", "..", "tests", "fixtures", "network", "scipy-reference.json")
    with open(path, "w") as f:
        json.dump(out, f, separators=(",", ":"))
    print(f"wrote {os.path.normpath(path)}")


if __name__ == "__main__":
    main()
