#!/usr/bin/env python3
"""The peer of the `sweep`, `circle` and `tram` commands in the large-file benchmark
(tests/bench/cli-large.ts): the same least-squares figures written independently as a vectorised
numpy/scipy script on the same CSV, timed and measured (peak memory) beside the command, and its
figures compared with the command's. Usage:
  python3 line_fits_numpy.py sweep file.csv RADIUS_MM   (angle_deg,reading in um)
  python3 line_fits_numpy.py circle file.csv            (x,y,z in mm)
  python3 line_fits_numpy.py tram file.csv              (travel mm, reading um)
Prints JSON with the figures the command prints (the sweep's minimum-zone flatness is left out).
Models (ordinary least squares; e.g. NIST/SEMATECH e-Handbook section 4.1.4.1, from memory):
  sweep  reading = a + b cos(theta) + c sin(theta); tilt = sqrt(b^2 + c^2) / r
  tram   reading = a + b travel
  circle plane by SVD of the centred points, then the circle in that plane by geometric least
         squares (scipy.optimize.least_squares, Levenberg-Marquardt) from an algebraic start.
"""
import json
import sys

import numpy as np
from scipy.optimize import least_squares

ARCSEC = np.pi / 648000.0


def sweep(data, radius):
    theta = np.deg2rad(np.mod(data[:, 0], 360.0))
    y = data[:, 1]
    X = np.column_stack([np.ones_like(theta), np.cos(theta), np.sin(theta)])
    (a, b, c), *_ = np.linalg.lstsq(X, y, rcond=None)
    res = y - X @ np.array([a, b, c])
    amp = np.hypot(b, c)
    return {
        "tilt_um_per_m": amp / radius * 1000,
        "tilt_arcsec": np.arctan(amp / (radius * 1000)) / ARCSEC,
        "direction_deg": np.mod(np.degrees(np.arctan2(c, b)), 360.0),
        "tir_um": np.ptp(y),
        "flatness_ls_um": np.ptp(res),
    }


def tram(data):
    x, y = data[:, 0], data[:, 1]
    n = len(x)
    mx, my = x.mean(), y.mean()
    sxx = np.sum((x - mx) ** 2)
    b = np.sum((x - mx) * (y - my)) / sxx
    a = my - b * mx
    res = y - (a + b * x)
    s = np.sqrt(np.sum(res**2) / (n - 2))
    return {
        "slope_um_per_m": b * 1000,
        "slope_u_um_per_m": s / np.sqrt(sxx) * 1000,
        "angle_arcsec": np.arctan2(b, 1000) / ARCSEC,
        "straightness_um": np.ptp(res),
        "tir_um": np.ptp(y),
    }


def circle(p):
    c0 = p.mean(axis=0)
    d = p - c0
    _, _, vt = np.linalg.svd(d, full_matrices=False)
    u, v, w = vt[0], vt[1], vt[2]
    k = np.argmax(np.abs(w))
    if w[k] < 0:
        w = -w
    xi, eta, h = d @ u, d @ v, d @ w
    A = np.column_stack([xi, eta, np.ones_like(xi)])
    D, E, F = np.linalg.lstsq(A, -(xi**2 + eta**2), rcond=None)[0]
    start = [-D / 2, -E / 2, np.sqrt(max(D * D / 4 + E * E / 4 - F, 0.0))]

    def resid(q):
        return np.hypot(xi - q[0], eta - q[1]) - q[2]

    def jac(q):
        rho = np.hypot(xi - q[0], eta - q[1])
        return np.column_stack([-(xi - q[0]) / rho, -(eta - q[1]) / rho, -np.ones_like(rho)])

    fit = least_squares(resid, start, jac=jac, method="lm", xtol=1e-15, ftol=1e-15, gtol=1e-15)
    a, b, r = fit.x
    dr = resid(fit.x)
    dist2 = dr**2 + h**2
    centre = c0 + a * u + b * v
    return {
        "centre_mm": centre.tolist(),
        "normal": w.tolist(),
        "radius_mm": abs(r),
        "rms_um": np.sqrt(dist2.mean()) * 1000,
        "max_um": np.sqrt(dist2.max()) * 1000,
    }


def main():
    kind, path = sys.argv[1], sys.argv[2]
    data = np.loadtxt(path, delimiter=",", skiprows=1)
    if kind == "sweep":
        out = sweep(data, float(sys.argv[3]))
    elif kind == "tram":
        out = tram(data)
    else:
        out = circle(data)
    print(json.dumps({k: (float(x) if np.isscalar(x) else x) for k, x in out.items()}))


if __name__ == "__main__":
    main()
