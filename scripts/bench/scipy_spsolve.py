#!/usr/bin/python3
"""Times SciPy's sparse direct solve (scipy.sparse.linalg.spsolve, SuperLU with COLAMD) of a system written by
scripts/bench/physics.ts, for the side-by-side line of `npm run bench`. Not a test.

    /usr/bin/python3 scripts/bench/scipy_spsolve.py SYSTEM.bin REPEATS

SYSTEM.bin: int32 n, int32 nnz, then int32 indptr[n+1], int32 indices[nnz], float64 data[nnz], float64 rhs[n]
(the full symmetric matrix, CSR). Prints one JSON line: median and fastest ms of REPEATS solves, and the
max-norm relative difference between its answer and the answer stored after the system (float64 x[n]).
"""
import json
import sys
import time

import numpy as np
from scipy.sparse import csr_matrix
from scipy.sparse.linalg import spsolve


def main():
    path, repeats = sys.argv[1], int(sys.argv[2])
    raw = open(path, "rb").read()
    n, nnz = np.frombuffer(raw, dtype=np.int32, count=2)
    offset = 8
    indptr = np.frombuffer(raw, dtype=np.int32, count=n + 1, offset=offset); offset += 4 * (n + 1)
    indices = np.frombuffer(raw, dtype=np.int32, count=nnz, offset=offset); offset += 4 * nnz
    if offset % 8:
        offset += 8 - offset % 8
    data = np.frombuffer(raw, dtype=np.float64, count=nnz, offset=offset); offset += 8 * nnz
    rhs = np.frombuffer(raw, dtype=np.float64, count=n, offset=offset); offset += 8 * n
    ours = np.frombuffer(raw, dtype=np.float64, count=n, offset=offset)
    matrix = csr_matrix((data, indices, indptr), shape=(n, n)).tocsc()
    times = []
    x = None
    for _ in range(repeats + 1):  # the first is a warm-up, not counted
        start = time.perf_counter()
        x = spsolve(matrix, rhs)
        times.append((time.perf_counter() - start) * 1000)
    times = sorted(times[1:])
    scale = max(float(np.max(np.abs(x))), 1e-300)
    print(json.dumps({"median": times[len(times) // 2], "fastest": times[0], "difference": float(np.max(np.abs(x - ours))) / scale}))


if __name__ == "__main__":
    main()
