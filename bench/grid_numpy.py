"""Reference evaluation of the drydig benchmark grid with numpy / scipy (vectorised, one thread).

Reads the source list and grid written by bench/run.ts (JSON), evaluates the Theis
superposition s = sum_k amp_k * E1(r^2 * coef_k) with r^2 clamped to r_w^2, using
scipy.special.exp1, and writes the drawdown grid as little-endian float64 plus a JSON line of
timings on stdout. Run with OMP_NUM_THREADS=OPENBLAS_NUM_THREADS=1 (run.ts sets them).

Usage: python3 bench/grid_numpy.py INPUT.json OUTPUT.f64 [--once]
  --once   evaluate once (the whole-process comparison: start-up, reading and writing count)
"""
import json
import sys
import time

import numpy as np
import scipy
import scipy.special


def main() -> None:
    src_path, out_path = sys.argv[1], sys.argv[2]
    with open(src_path, encoding="utf-8") as f:
        data = json.load(f)
    ox, oy = data["origin"]
    hx, hy = data["spacing_m"]
    nx, ny = data["counts"]
    sx = np.asarray(data["x"], dtype=np.float64)
    sy = np.asarray(data["y"], dtype=np.float64)
    amp = np.asarray(data["amp"], dtype=np.float64)
    coef = np.asarray(data["coef"], dtype=np.float64)
    r2min = np.asarray(data["r2min"], dtype=np.float64)

    def evaluate() -> np.ndarray:
        xs = ox + hx * np.arange(nx, dtype=np.float64)
        ys = oy + hy * np.arange(ny, dtype=np.float64)
        gx, gy = np.meshgrid(xs, ys)  # row-major j * nx + i, like the engine
        gx = gx.ravel()
        gy = gy.ravel()
        total = np.zeros(nx * ny, dtype=np.float64)
        chunk = 16  # sources per vectorised block: ~1M doubles per temporary
        for k0 in range(0, sx.size, chunk):
            k1 = min(k0 + chunk, sx.size)
            dx = gx[None, :] - sx[k0:k1, None]
            dy = gy[None, :] - sy[k0:k1, None]
            r2 = np.maximum(dx * dx + dy * dy, r2min[k0:k1, None])
            total += (amp[k0:k1, None] * scipy.special.exp1(r2 * coef[k0:k1, None])).sum(axis=0)
        return total

    # Best of three, like the TypeScript side: the machine is shared, the minimum is the fair figure.
    elapsed = float("inf")
    cpu = float("inf")
    for _ in range(1 if "--once" in sys.argv[3:] else 3):
        start, cpu_start = time.perf_counter(), time.process_time()
        total = evaluate()
        elapsed = min(elapsed, time.perf_counter() - start)
        cpu = min(cpu, time.process_time() - cpu_start)

    total.astype("<f8").tofile(out_path)
    print(json.dumps({"seconds": elapsed, "cpuSeconds": cpu, "numpy": np.__version__, "scipy": scipy.__version__, "evaluations": int(sx.size * nx * ny)}))


if __name__ == "__main__":
    main()
