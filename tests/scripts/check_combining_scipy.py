#!/usr/bin/python3
"""Independent cross-check of the exact combining and Rician figures with scipy.

Part 1, `ellipsa diversity A B --json`:

For pairs of antennas (closed-form dipoles and crossed dipoles from `ellipsa synth`, turned so their
envelope correlation runs from 0 to about 0.9) in two environments, the script takes the two MEG and the
ECC that ellipsa reports and recomputes every combining figure on its own:
  selection combining: the integral of conventions.md,
    F(x) = integral_0^x (1/G1) e^(-t/G1) [1 - Q1(sqrt(2 rho t/(G1(1-rho))), sqrt(2x/(G2(1-rho))))] dt,
    with 1 - Q1(a, b) = scipy.stats.ncx2.cdf(b^2, 2, a^2) and scipy.integrate.quad (QUADPACK);
  maximal ratio: numpy's eigenvalues of the branch covariance and the sum of two exponentials;
  levels by scipy.optimize.brentq; gains over the stronger branch and over an ideal lossless antenna in
  the isotropic environment (MEG 0.5; Kildal & Rosengren, IEEE Commun. Mag. 42(12), 2004).
ellipsa sums a series of its own (pattern/combining.hpp), so the two share no code.
Part 2, `ellipsa fading FILE --k-factor K --json`: the closed-form Rician levels of each antenna
(conventions.md: P(|a|^2 <= x) = 1 - Q1(sqrt(2K), sqrt(2(K+1)x/Omega)), with the antenna's own K and
mean Omega that ellipsa reports) against scipy: Q1(a, b) = scipy.stats.ncx2.sf(b^2, 2, a^2), levels by
brentq. ellipsa's Marcum Q1 is its own Poisson-mixture sum (pattern/marcum.hpp).
Usage: check_combining_scipy.py ELLIPSA WORKDIR
"""
import json
import math
import os
import shutil
import subprocess
import sys

import numpy as np
from scipy.integrate import quad
from scipy.optimize import brentq
from scipy.stats import ncx2

exe, work = sys.argv[1], sys.argv[2]
shutil.rmtree(work, ignore_errors=True)  # a fresh folder: writes never replace without --force
os.makedirs(work)
failures = 0
OUTAGES = [0.01, 0.1, 0.001]


def check(label, got, want, tol):
    global failures
    ok = got is not None and abs(got - want) <= tol
    print(f"{'ok  ' if ok else 'FAIL'} {label}: ellipsa {got}, scipy {want:.6f} (tolerance {tol})")
    failures += 0 if ok else 1


def run(*args):
    return subprocess.run([exe, *args], check=True, capture_output=True, text=True).stdout


def selection_cdf(x, g1, g2, rho):
    if rho < 1e-12:
        return (1 - math.exp(-x / g1)) * (1 - math.exp(-x / g2))
    b2 = 2 * x / (g2 * (1 - rho))
    f = lambda t: math.exp(-t / g1) / g1 * ncx2.cdf(b2, 2, 2 * rho * t / (g1 * (1 - rho)))
    return quad(f, 0, x, epsabs=0, epsrel=1e-12, limit=200)[0]


def mrc_cdf(x, g1, g2, rho):
    c = math.sqrt(rho * g1 * g2)
    l2, l1 = np.linalg.eigvalsh(np.array([[g1, c], [c, g2]]))
    if abs(l1 - l2) < 1e-9 * l1:
        return 1 - math.exp(-x / l1) * (1 + x / l1)
    return 1 - (l1 * math.exp(-x / l1) - l2 * math.exp(-x / l2)) / (l1 - l2)


def level(cdf, p, scale):
    return brentq(lambda x: cdf(x) - p, 1e-12 * scale, 100 * scale, xtol=1e-16, rtol=1e-13, maxiter=500)


db = lambda v: 10 * math.log10(v)

files = {
    "z": ["dipole"],
    "t30": ["dipole", "--rotate-x", "30"],
    "t60": ["dipole", "--rotate-x", "60"],
    "x": ["dipole", "--rotate-y", "90"],
    "c": ["crossed-dipoles", "--rotate-x", "30"],
    "loop": ["small-loop", "--rotate-y", "40"],
}
for name, args in files.items():
    path = os.path.join(work, name + ".csv")
    if os.path.exists(path):
        os.remove(path)
    run("synth", *args, "--step", "2", "--out", path)

pairs = [("z", "t30"), ("z", "t60"), ("z", "x"), ("z", "c"), ("c", "loop")]
for env in ["uniform", "urban"]:
    for a, b in pairs:
        out = json.loads(run("diversity", os.path.join(work, a + ".csv"), os.path.join(work, b + ".csv"),
                             "--environment", env, "--json", "--outage", ",".join(map(str, OUTAGES))))
        g1, g2, rho = out["patterns"][0]["meg"], out["patterns"][1]["meg"], out["ecc"]
        strong = max(g1, g2)
        tag = f"{env} {a}/{b} (ECC {rho:.3f}, MEG ratio {db(g1 / g2):.2f} dB)"
        for p in OUTAGES:
            c = out["combining"][repr(p)]
            sc = level(lambda x: selection_cdf(x, g1, g2, rho), p, strong)
            mr = level(lambda x: mrc_cdf(x, g1, g2, rho), p, strong)
            one = -math.log1p(-p)
            check(f"{tag} selection gain at {p}", c["selection_db"], db(sc / (strong * one)), 1e-4)
            check(f"{tag} maximal-ratio gain at {p}", c["mrc_db"], db(mr / (strong * one)), 1e-4)
            check(f"{tag} selection effective gain at {p}", c["selection_effective_db"], db(sc / (0.5 * one)), 1e-4)
            check(f"{tag} maximal-ratio effective gain at {p}", c["mrc_effective_db"], db(mr / (0.5 * one)), 1e-4)
            check(f"{tag} selection level at {p}", c["selection_level_db"], db(sc), 1e-4)
            check(f"{tag} maximal-ratio level at {p}", c["mrc_level_db"], db(mr), 1e-4)
        check(f"{tag} headline = selection gain at 1 %", out["diversity_gain_db"], out["combining"]["0.01"]["selection_db"], 1e-12)

# Part 2: Rician levels through Marcum's Q-function.
for k_arg, pol, where in [("10", "vertical", "90,20"), ("3dB", "slant+45", "60,0"), ("30dB", "rhcp", "10,0"),
                          ("0.5", "horizontal", "90,0")]:
    for name in ["z", "c"]:
        out = json.loads(run("fading", os.path.join(work, name + ".csv"), "--environment", "urban", "--samples", "2000",
                             "--k-factor", k_arg, "--polarisation", pol, "--dominant", where, "--json",
                             "--outage", "0.001,0.01,0.1,0.5"))
        p0 = out["patterns"][0]
        k, omega = p0["k_factor"], 10 ** (p0["analytic_mean_db"] / 10)
        for key, lv in p0["analytic_levels_db"].items():
            p = float(key)
            if k > 0:
                cdf = lambda x: ncx2.cdf(2 * (k + 1) * x / omega, 2, 2 * k)
                want = brentq(lambda x: cdf(x) - p, 1e-9 * omega, 3 * omega, xtol=1e-18, rtol=1e-13, maxiter=500)
            else:
                want = -omega * math.log1p(-p)
            check(f"Rician {name} K={k_arg} {pol} from {where}: own K {k:.4g}, level at {p}", lv, db(want), 1e-6)
        # Q1 itself at the level: 1 - Q1(sqrt(2K), sqrt(2(K+1)x/Omega)) = p, scipy's sf against ellipsa's level.
        if k > 0:
            x = 10 ** (p0["analytic_levels_db"]["0.01"] / 10)
            q1 = ncx2.sf(2 * (k + 1) * x / omega, 2, 2 * k)
            check(f"Rician {name} K={k_arg}: scipy Q1 at ellipsa's 1 % level", 1 - q1, 0.01, 1e-9)

print(f"{failures} failed")
sys.exit(1 if failures else 0)
