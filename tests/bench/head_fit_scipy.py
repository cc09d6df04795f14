#!/usr/bin/env python3
"""The peer of `fit-head` in the head-fit benchmark (tests/bench/head-fit.ts): the same head model
and sphere-probe fit written as a vectorised numpy script and solved by scipy.optimize.least_squares
(Levenberg-Marquardt, MINPACK, forward-difference Jacobian, columns scaled by the Jacobian). Reads
the same CSV and head file, prints the estimates as JSON. End to end (interpreter start, imports,
reading the CSV, the fit) it is timed beside `node lib/cli/run.mjs fit-head` on the same file.

Model (as geometry/head/kernel.ts, written independently here): with p, s the primary and secondary
axis vectors, n = p x s, t the tool direction, all angles in rad and lengths in mm,
  q = (L + tool) t + ds s + dn n,  o = e n
  s' = R(n, st) R(p, sy) s,  p' = R(s, pts) R(n, ptn) p
  tip(P, S) = R(p', P + pz) (o + R(s', S + sz) (q - o))
and the measured centre m = c - (tip - tip0). secondary_yaw is held at 0 (inseparable from
primary_zero), as fit-head does by default. Usage: python3 head_fit_scipy.py sphere.csv head.json
"""
import json
import sys

import numpy as np
from scipy.optimize import least_squares

ARCSEC = np.pi / 648000.0
AXIS = {"A": np.array([1.0, 0, 0]), "B": np.array([0, 1.0, 0]), "C": np.array([0, 0, 1.0])}
KEYS = [
    "pivot_length_error_um",
    "tip_offset_s_um",
    "tip_offset_n_um",
    "secondary_offset_um",
    "primary_zero_arcsec",
    "secondary_zero_arcsec",
    "secondary_tilt_arcsec",
    "primary_tilt_s_arcsec",
    "primary_tilt_n_arcsec",
]


def rotate(a, phi, x):
    """Rodrigues: R(a, phi) x for a unit vector a (3,) and arrays phi (N,), x (N, 3) or (3,)."""
    c = np.cos(phi)[:, None] if np.ndim(phi) else np.cos(phi)
    s = np.sin(phi)[:, None] if np.ndim(phi) else np.sin(phi)
    return x * c + np.cross(a, x) * s + np.outer(x @ a, a) * (1 - c) if np.ndim(x) == 2 else (
        x * c + np.cross(a, x) * s + a * (a @ x) * (1 - c)
    )


def main():
    data = np.loadtxt(sys.argv[1], delimiter=",", skiprows=1)
    with open(sys.argv[2]) as f:
        head = json.load(f)
    p, s = AXIS[head["primary"]], AXIS[head["secondary"]]
    n = np.cross(p, s)
    t = np.array(head.get("tool_direction", [0, 0, -1.0]), dtype=float)
    t /= np.linalg.norm(t)
    L0 = float(head["pivot_length_mm"])
    P = np.radians(data[:, 0])
    S = np.radians(data[:, 1])
    meas = data[:, 2:5] * 1000.0  # um
    tool = data[:, 5] if data.shape[1] > 5 else np.zeros(len(data))

    def tips(e):
        dl, ds, dn, off = e[0:4] / 1000.0
        pz, sz, st, pts, ptn = e[4:9] * ARCSEC
        sp = rotate(n, st, s)
        pp = rotate(s, pts, rotate(n, ptn, p))
        q = np.outer(L0 + dl + tool, t) + ds * s + dn * n
        o = off * n
        v = o + rotate(sp, S + sz, q - o)
        return rotate(pp, P + pz, v)

    tip0 = tips(np.zeros(9))
    c0 = meas.mean(axis=0)

    def residuals(x):
        return (meas - (x[0:3] - 1000.0 * (tips(x[3:]) - tip0))).ravel()

    fit = least_squares(residuals, np.concatenate([c0, np.zeros(9)]), method="lm", x_scale="jac", xtol=1e-12, ftol=1e-12)
    print(
        json.dumps(
            {
                "parameters": {k: float(v) for k, v in zip(KEYS, fit.x[3:])},
                "sphere_centre_mm": [float(v) / 1000.0 for v in fit.x[0:3]],
                "evaluations": int(fit.nfev),
                "status": int(fit.status),
            }
        )
    )


main()
