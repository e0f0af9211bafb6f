#!/usr/bin/python3
"""Independent cross-check of `ellipsa info --json` with numpy/scipy (Debian python3-numpy,
python3-scipy): a separate reading of the CSV, Simpson integration in theta with the sin weight
(scipy.integrate.simpson), the periodic trapezoid in phi, and the half-power crossings of the
elevation cut found with numpy interpolation. Usage: check_info_numpy.py ELLIPSA WORKDIR
"""
import json
import math
import os
import shutil
import subprocess
import sys

import numpy as np
from scipy.integrate import simpson

exe, work = sys.argv[1], sys.argv[2]
shutil.rmtree(work, ignore_errors=True)  # a fresh folder: writes never replace without --force
os.makedirs(work)
failures = 0


def check(label, got, want, tol):
    global failures
    ok = got is not None and abs(got - want) <= tol
    print(f"{'ok  ' if ok else 'FAIL'} {label}: ellipsa {got}, reference {want:.4f} (tolerance {tol})")
    failures += 0 if ok else 1


def reference(path):
    with open(path, encoding="utf-8") as f:
        lines = [ln for ln in f if not ln.startswith("#") and ln.strip()]
    names = lines[0].strip().split(",")
    values = np.loadtxt(lines[1:], delimiter=",")
    data = {n: values[:, i] for i, n in enumerate(names)}
    t = np.unique(data["theta"])
    p = np.unique(data["phi"])
    u = (data["e_theta_re"] ** 2 + data["e_theta_im"] ** 2 + data["e_phi_re"] ** 2 + data["e_phi_im"] ** 2)
    # rows are theta-major as written by synth; sort to be sure
    order = np.lexsort((data["phi"], data["theta"]))
    u = u[order].reshape(len(t), len(p))
    tr = np.radians(t)
    ring = u.mean(axis=1) * 2 * math.pi  # periodic trapezoid in phi
    power = simpson(ring * np.sin(tr), x=tr)
    d = 4 * math.pi * u.max() / power
    # elevation cut through the peak's phi column, theta 0..180 on one side
    i, j = np.unravel_index(np.argmax(u), u.shape)
    cut = u[:, j] / u[i, j]
    half = 0.5
    # walk out from the peak to the half-power crossings, interpolating in dB
    def cross(step):
        k = i
        while 0 <= k + step < len(t) and cut[k + step] > half:
            k += step
        a, b = 10 * np.log10(cut[k]), 10 * np.log10(max(cut[k + step], 1e-300))
        return t[k] + step * (t[1] - t[0]) * (a - 10 * np.log10(half)) / (a - b)
    return d, cross(+1) - cross(-1)


cases = [("dipole", ["--length", "0.5"], 0.01, 0.3),
         ("dipole", ["--length", "1.0"], 0.01, 0.3),
         ("dipole", ["--length", "1.25"], 0.01, 0.3),
         ("short-dipole", [], 0.01, 0.3),
         ("loop", ["--circumference", "3.0"], 0.01, 0.3)]
for kind, args, tol_db, tol_deg in cases:
    path = f"{work}/{kind}{''.join(args)}.csv"
    subprocess.run([exe, "synth", kind, *args, "--step", "1", "--out", path], check=True)
    info = json.loads(subprocess.run([exe, "info", path, "--json"], check=True, capture_output=True,
                                     text=True).stdout)["results"][0]
    d, hpbw = reference(path)
    check(f"{kind} {' '.join(args)} directivity dBi", info["directivity_dbi"], 10 * math.log10(d), tol_db)
    check(f"{kind} {' '.join(args)} HPBW elevation deg", info["hpbw_elevation_deg"], hpbw, tol_deg)

print(f"{len(cases) * 2 - failures} passed, {failures} failed")
sys.exit(1 if failures else 0)
