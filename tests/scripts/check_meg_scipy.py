#!/usr/bin/python3
"""Independent cross-check of `ellipsa diversity --json` with scipy (Debian python3-scipy).

The reference never reads ellipsa's files: it evaluates the closed-form fields of the reference
antennas (short dipoles crossed in quadrature: E ~ -(p - (p.r) r), Balanis 4.2; half-wave dipole:
cos(pi/2 cos t)/sin t, Balanis 4.6), turns them as E'(r) = R E(R^T r) (conventions.md), and integrates
Taga's MEG (IEEE Trans. VT-39, 1990) and the XPR-weighted Vaughan-Andersen envelope correlation
(IEEE Trans. VT-36, 1987) over the sphere with scipy's adaptive quadrature (scipy.integrate.dblquad,
QUADPACK). ellipsa samples the same antennas on a 1-degree grid (`ellipsa synth`) and integrates with
its cell weights, so the two share no code and no quadrature.
Cases: a custom Gaussian (MEG and its V/H parts of crossed dipoles, a tilted half-wave dipole and a
tilted loop), the worst and best orientations of the sweep, the envelope correlation of two antennas,
the urban preset, and a per-elevation user table with XPR from its own totals.
Usage: check_meg_scipy.py ELLIPSA WORKDIR
"""
import json
import math
import os
import shutil
import subprocess
import sys

import numpy as np
from scipy.integrate import dblquad, quad
from scipy.special import j1

exe, work = sys.argv[1], sys.argv[2]
shutil.rmtree(work, ignore_errors=True)  # a fresh folder: writes never replace without --force
os.makedirs(work)
failures = 0


def check(label, got, want, tol):
    global failures
    ok = got is not None and abs(got - want) <= tol
    print(f"{'ok  ' if ok else 'FAIL'} {label}: ellipsa {got}, scipy {want:.6f} (tolerance {tol})")
    failures += 0 if ok else 1


def rx(a):
    c, s = math.cos(a), math.sin(a)
    return np.array([[1, 0, 0], [0, c, -s], [0, s, c]])


def ry(a):
    c, s = math.cos(a), math.sin(a)
    return np.array([[c, 0, s], [0, 1, 0], [-s, 0, c]])


def rz(a):
    c, s = math.cos(a), math.sin(a)
    return np.array([[c, -s, 0], [s, c, 0], [0, 0, 1]])


def basis(t, p):
    r = np.array([math.sin(t) * math.cos(p), math.sin(t) * math.sin(p), math.cos(t)])
    th = np.array([math.cos(t) * math.cos(p), math.cos(t) * math.sin(p), -math.sin(t)])
    ph = np.array([-math.sin(p), math.cos(p), 0.0])
    return r, th, ph


def crossed_local(u):
    # currents along x and y, y lagging by 90 deg (synth default --phase -90)
    pm = np.array([1.0, np.exp(-1j * math.pi / 2), 0.0])
    # |p_perp|^2 integrates to (8 pi / 3) |p|^2 = 16 pi / 3; scale so |E|^2 is directivity
    return -(pm - np.dot(pm, u) * u) * math.sqrt(4 * math.pi / (16 * math.pi / 3))


def halfwave_unscaled(u):
    ct = max(-1.0, min(1.0, u[2]))
    st = math.sqrt(max(0.0, 1 - ct * ct))
    if st < 1e-12:
        return np.zeros(3, dtype=complex)
    # theta-hat of the local frame times the pattern factor
    th = np.array([ct * u[0] / st, ct * u[1] / st, -st])
    return (math.cos(math.pi / 2 * ct) / st) * th.astype(complex)


def halfwave_norm():
    # integral of |f|^2 over the sphere, f = cos(pi/2 cos t)/sin t
    val = quad(lambda t: (math.cos(math.pi / 2 * math.cos(t)) / math.sin(t)) ** 2 * math.sin(t),
               1e-12, math.pi - 1e-12, epsabs=1e-13, epsrel=1e-12, limit=200)[0]
    return math.sqrt(4 * math.pi / (2 * math.pi * val))


HW = halfwave_norm()


def halfwave_local(u):
    return HW * halfwave_unscaled(u)


LOOP_C = 2.0  # circumference in wavelengths (= ka)


def loop_norm():
    val = quad(lambda t: j1(LOOP_C * math.sin(t)) ** 2 * math.sin(t), 0, math.pi, epsabs=1e-14, epsrel=1e-12,
               limit=200)[0]
    return math.sqrt(4 * math.pi / (2 * math.pi * val))


LN = loop_norm()


def loop_local(u):
    # uniform-current loop in the xy-plane: E_phi ~ J1(ka sin t) (Balanis 5.3)
    st = math.hypot(u[0], u[1])
    if st < 1e-12:
        return np.zeros(3, dtype=complex)
    ph = np.array([-u[1] / st, u[0] / st, 0.0])
    return (LN * j1(LOOP_C * st)) * ph.astype(complex)


def turned(local, R):
    return lambda u: R @ local(R.T @ u)


class Gaussian:
    """Taga's model: P ~ exp(-(theta - (pi/2 - m))^2 / (2 s^2)), normalised to 1 over the sphere."""

    def __init__(self, mv, sv, mh, sh, xpr_db):
        self.par = [(math.radians(mv), math.radians(sv)), (math.radians(mh), math.radians(sh))]
        x = 10 ** (xpr_db / 10)
        self.wv, self.wh = x / (1 + x), 1 / (1 + x)
        self.norm = []
        for m, s in self.par:
            f = lambda t, m=m, s=s: math.exp(-(t - (math.pi / 2 - m)) ** 2 / (2 * s * s)) * math.sin(t)
            self.norm.append(2 * math.pi * quad(f, 0, math.pi, epsabs=1e-14, epsrel=1e-12, limit=200)[0])

    def p(self, k, t):
        m, s = self.par[k]
        return math.exp(-(t - (math.pi / 2 - m)) ** 2 / (2 * s * s)) / self.norm[k]


def integrate(f):
    return dblquad(lambda t, p: f(t, p) * math.sin(t), 0, 2 * math.pi, 0, math.pi, epsabs=1e-10, epsrel=1e-9)[0]


def meg(field, env):
    def part(k):
        def g(t, p):
            u, th, ph = basis(t, p)
            e = field(u)
            comp = np.dot(e, th) if k == 0 else np.dot(e, ph)
            return abs(comp) ** 2 * env.p(k, t)
        return integrate(g)

    v = env.wv * part(0)
    h = env.wh * part(1)
    return v + h, v, h


def ecc(f1, f2, env):
    def term(fn):
        def g(t, p):
            u, th, ph = basis(t, p)
            a, b = f1(u), f2(u)
            return fn(env.wv * env.p(0, t) * np.dot(a, th) * np.conj(np.dot(b, th)) +
                      env.wh * env.p(1, t) * np.dot(a, ph) * np.conj(np.dot(b, ph)))
        return g

    def power(fx):
        def g(t, p):
            u, th, ph = basis(t, p)
            e = fx(u)
            return env.wv * env.p(0, t) * abs(np.dot(e, th)) ** 2 + env.wh * env.p(1, t) * abs(np.dot(e, ph)) ** 2
        return integrate(g)

    re = integrate(term(np.real))
    im = integrate(term(np.imag))
    return (re * re + im * im) / (power(f1) * power(f2))


def run(args):
    out = subprocess.run([exe] + args, capture_output=True, text=True)
    if out.returncode != 0:
        print("FAIL", " ".join(args), out.stderr)
        sys.exit(1)
    return out.stdout


db = lambda x: 10 * math.log10(x)

crossed = os.path.join(work, "crossed.csv")
dipole = os.path.join(work, "dipole.csv")
loop = os.path.join(work, "loop.csv")
run(["synth", "crossed-dipoles", "--rotate-x", "30", "--step", "1", "--out", crossed])
run(["synth", "dipole", "--length", "0.5", "--rotate-y", "40", "--step", "1", "--out", dipole])
run(["synth", "loop", "--circumference", str(LOOP_C), "--rotate-x", "50", "--step", "1", "--out", loop])
f_crossed = turned(crossed_local, rx(math.radians(30)))
f_loop = turned(loop_local, rx(math.radians(50)))
f_dipole = turned(halfwave_local, ry(math.radians(40)))

# 1. A custom Gaussian environment with different V and H parameters.
env = Gaussian(10, 15, 25, 30, 6)
gauss = ["--environment", "gaussian", "--v-mean", "10", "--v-spread", "15", "--h-mean", "25", "--h-spread", "30",
         "--xpr", "6"]
j = json.loads(run(["diversity", crossed, dipole, "--json"] + gauss))
m, v, h = meg(f_crossed, env)
r = j["patterns"][0]["results"][0]
check("crossed dipoles MEG dB", r["meg_db"], db(m), 0.005)
check("crossed dipoles vertical part dB", r["meg_vertical_db"], db(v), 0.005)
check("crossed dipoles horizontal part dB", r["meg_horizontal_db"], db(h), 0.005)

md, _, _ = meg(f_dipole, env)
check("tilted half-wave dipole MEG dB", j["patterns"][1]["results"][0]["meg_db"], db(md), 0.005)

# 2. A tilted loop (both polarisations, each depending on elevation), and its orientation sweep:
# the worst and best orientations, turned again here by R_x(tilt) R_z(roll).
jl = json.loads(run(["diversity", loop, "--json", "--orientations", "--tilt-step", "30", "--roll-step", "45"] + gauss))
rl = jl["patterns"][0]["results"][0]
ml, vl, hl = meg(f_loop, env)
check("tilted loop MEG dB", rl["meg_db"], db(ml), 0.005)
check("tilted loop vertical part dB", rl["meg_vertical_db"], db(vl), 0.005)
check("tilted loop horizontal part dB", rl["meg_horizontal_db"], db(hl), 0.005)
for which in ("worst", "best"):
    o = rl["orientations"][which]
    R = rx(math.radians(o["tilt_deg"])) @ rz(math.radians(o["roll_deg"]))
    mo, _, _ = meg(turned(f_loop, R), env)
    check(f"tilted loop, {which} orientation (tilt {o['tilt_deg']}, roll {o['roll_deg']}) MEG dB", o["meg_db"],
          db(mo), 0.005)

# 3. Envelope correlation of the two antennas.
check("envelope correlation", j["ecc"], ecc(f_crossed, f_dipole, env), 1e-3)

# 4. A named preset (its values are echoed in the JSON and used here).
ju = json.loads(run(["diversity", dipole, "--environment", "urban", "--json"]))
e = ju["environment"]
envu = Gaussian(e["v_mean_deg"], e["v_spread_deg"], e["h_mean_deg"], e["h_spread_deg"], e["xpr_db"])
mu, _, _ = meg(f_dipole, envu)
check("tilted half-wave dipole, urban preset, MEG dB", ju["patterns"][0]["results"][0]["meg_db"], db(mu), 0.005)

# 5. A user elevation table (linear interpolation, zero outside), read per unit elevation angle,
# with XPR from the table's own column totals.
table = [(-10, 0.0, 0.0), (0, 1.0, 0.2), (20, 0.6, 0.5), (45, 0.0, 0.3), (60, 0.0, 0.0)]
prof = os.path.join(work, "profile.csv")
with open(prof, "w", encoding="utf-8") as f:
    f.write("# test table\nelevation_deg,p_v,p_h\n")
    for el, v, h in table:
        f.write(f"{el},{v},{h}\n")
els = np.array([t[0] for t in table], dtype=float)


class Table:
    """Per-elevation table: P(theta) = p(el) / cos(el) per steradian, each column normalised to 1 over
    the sphere (integral of P dOmega = 2 pi * integral of p d(el)); XPR from the two totals."""

    def __init__(self):
        self.cols = [np.array([t[1] for t in table]), np.array([t[2] for t in table])]
        self.tot = []
        for c in self.cols:
            f = lambda e, c=c: np.interp(math.degrees(e), els, c, left=0, right=0)
            self.tot.append(2 * math.pi * quad(f, -math.pi / 2, math.pi / 2, points=list(np.radians(els)), limit=200,
                                               epsabs=1e-13)[0])
        x = self.tot[0] / self.tot[1]
        self.wv, self.wh = x / (1 + x), 1 / (1 + x)

    def p(self, k, t):
        el = math.degrees(math.pi / 2 - t)
        v = np.interp(el, els, self.cols[k], left=0, right=0)
        return v / max(math.cos(math.radians(el)), 1e-300) / self.tot[k]


envt = Table()
jt = json.loads(run(["diversity", dipole, "--profile", prof, "--profile-measure", "elevation", "--json"]))
mt, _, _ = meg(f_dipole, envt)
check("tilted half-wave dipole, per-elevation table, MEG dB", jt["patterns"][0]["results"][0]["meg_db"], db(mt), 0.01)
check("XPR from the table's totals, dB", jt["environment"]["xpr_db"], db(envt.tot[0] / envt.tot[1]), 1e-6)

sys.exit(1 if failures else 0)
