#!/usr/bin/python3
"""The independent audit: ellipsa's command-line figures against conventions_reference.py.

conventions_reference.py is a second reading of docs/conventions.md (numpy/scipy from Debian only),
written from the conventions text and its published sources, not from the C++ core. This script
writes closed-form antennas of its own (never `ellipsa synth`) as far-field CSV files, runs the
commands with --json (or the cut's CSV), and compares every figure with the closed form:
  info      peak, directivity, efficiency, coverage, HPBW, front-to-back, axial ratio, sense
  probe     every component, axial ratio, tilt, sense, Stokes, Ludwig-3 (x and y), on and off the grid
  cut       the values along elevation and conical cuts
  diversity MEG per environment (uniform, the presets, a custom Gaussian, XPR), ECC, combining levels
  fading    the exact levels and the simulation's agreement with MEG, ECC and the exact distributions
  band      per-frequency figures of a three-frequency file
  coverage  the share of the sphere at or above a level
  examples  examples/*.csv through a separate reader
  mounting, phase_centre, per_file  --up/--rotate, FILE::up=/::rotate=/::phase-centre=, the sign
            of a moved phase reference
  honest    the documented thresholds (linear, circular tilt, null floor) on both sides, every output
  gain_transfer  IEEE Std 149 sec. 12 gain comparison, sample by sample
  rank      candidates against the reference dipole
  simulation_ci  the simulation's 95 % intervals hold the exact values about 95 % of the time
Tolerances, with their reasons, are beside each group (TOL_*). Usage:
  check_conventions_independent.py ELLIPSA WORKDIR SOURCE_DIR
"""
import json
import math
import os
import shutil
import subprocess
import sys
import time

import numpy as np
from scipy import optimize

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import conventions_reference as cr  # noqa: E402

EXE, WORK, SRC = sys.argv[1], sys.argv[2], sys.argv[3]
shutil.rmtree(WORK, ignore_errors=True)  # a fresh folder: writes never replace without --force
os.makedirs(WORK)
FAIL = []
PASSED = [0]

# Samples written with repr() are read back exactly; a figure at a grid point is arithmetic only.
TOL_EXACT_DB = 1e-9
# Integrals on a 2-degree grid against Gauss-Legendre quadrature of the closed form: conventions.md
# says smooth patterns converge to well under 0.01 dB at 2-degree steps.
TOL_INTEGRAL_DB = 0.01
# Interpolated values between 2-degree samples (probe off the grid, cut samples): the error of any
# second-order interpolation of a smooth pattern is about (step^2/8) |f''|, a few thousandths of a
# dB for these patterns well above their nulls (common practice); we allow 0.02 dB within 15 dB of
# the peak.
TOL_INTERP_DB = 0.02
# Half-power crossings interpolated between 2-degree samples: common practice, 0.1 deg.
TOL_HPBW_DEG = 0.1


def check(label, got, want, tol):
    ok = (got is None and want is None) or (
        got is not None and want is not None and (abs(got - want) <= tol or got == want))
    if ok:
        PASSED[0] += 1
    else:
        FAIL.append(label)
    print(f"{'ok  ' if ok else 'FAIL'} {label}: ellipsa {got}, reference {want} (tolerance {tol})")


def check_equal(label, got, want):
    ok = got == want
    PASSED[0] += ok
    if not ok:
        FAIL.append(label)
    print(f"{'ok  ' if ok else 'FAIL'} {label}: ellipsa {got!r}, reference {want!r}")


def run(*args, ok=True):
    res = subprocess.run([EXE, *args], capture_output=True, text=True, timeout=600)
    if ok and res.returncode != 0:
        raise SystemExit(f"ellipsa {' '.join(args)} failed: {res.stderr}")
    return res


def run_json(*args):
    return json.loads(run(*args, "--json").stdout)


# ---------------------------------------------------------------- the closed-form antennas
STEP = 2.0
T, P = cr.grid(STEP)
TT, PP = np.meshgrid(T, P, indexing="ij")
F0 = 2.45e9


D_SHIFT = (0.2, 0.1, 0.25)


def antennas():
    """name -> (antenna, quantity, efficiency). Efficiency < 1 makes gain files whose integral is
    4 pi eta (conventions.md: efficiency = P / 4 pi)."""
    z = [0, 0, 1]
    a = {
        "short_z": (cr.Antenna().dipole(z), 1.0),
        "half_z": (cr.Antenna().dipole(z, 0.5), 0.83),
        "half_x": (cr.Antenna().dipole([1, 0, 0], 0.5), 1.0),
        "half_y": (cr.Antenna().dipole([0, 1, 0], 0.5), 1.0),
        "wave_z": (cr.Antenna().dipole(z, 1.0), 1.0),
        "long_z": (cr.Antenna().dipole(z, 1.25), 1.0),
        "loop_z": (cr.Antenna().loop(z), 0.6),
        "bigloop_x": (cr.Antenna().loop([1, 0, 0], 1.0), 1.0),
        # x + j y radiates left-hand toward +z (conventions.md check); x - j y right-hand.
        "rhcp_z": (cr.Antenna().dipole([1, 0, 0]).dipole([0, 1, 0], amp=-1j), 1.0),
        "lhcp_z": (cr.Antenna().dipole([1, 0, 0]).dipole([0, 1, 0], amp=1j), 1.0),
        # end-fire pair of z dipoles a quarter wave apart along x, fed -90 deg: exact null toward
        # -x; placed 1.1 wavelengths off the origin so every phase carries exp(+j k r.d).
        "endfire": (cr.Antenna().dipole(z, pos=[1.1, 0.3, 0]).dipole(z, amp=-1j, pos=[1.35, 0.3, 0]), 1.0),
        # the short z dipole displaced by d = (0.2, 0.1, 0.25) wavelengths: exp(+j k r.d) on
        # every sample; against short_z it is spatial diversity (conventions.md, phase centre)
        "short_z_shift": (cr.Antenna().dipole(z, pos=D_SHIFT), 1.0),
        # a tilted turnstile: circular along n = (0, -sin 30, cos 30)
        "rhcp_tilt": (cr.Antenna().dipole([1, 0, 0]).dipole([0, math.cos(math.pi / 6), math.sin(math.pi / 6)], amp=-1j), 1.0),
    }
    for ant, eta in a.values():
        ant.normalise(4 * math.pi * eta)
    return a


ANT = antennas()


def clean(et, ep):
    """Closed-form zeros written as zeros: the projection leaves about 1e-17 of |E| where a
    component vanishes (a z dipole's E_phi), which a file should not carry as data."""
    floor = 1e-13 * max(abs(et).max(), abs(ep).max())
    et, ep = et.copy(), ep.copy()
    for c in (et, ep):
        c.real[abs(c.real) < floor] = 0
        c.imag[abs(c.imag) < floor] = 0
    return et, ep


def write(name, convention="+jwt", quantity="gain"):
    ant, _ = ANT[name]
    path = f"{WORK}/{name}{'_iwt' if convention == '-iwt' else ''}.csv"
    cr.write_csv(path, [F0], [clean(*ant.field_tp(TT, PP))], T, P, quantity=quantity, convention=convention, name=name)
    return path


FILES = {n: write(n) for n in ANT}


def field_at(name, t, p):
    et, ep = ANT[name][0].field_tp(np.array(t, float), np.array(p, float))
    return complex(et), complex(ep)


def power_at(name, t, p):
    et, ep = field_at(name, t, p)
    return abs(et) ** 2 + abs(ep) ** 2


def true_directivity(name):
    """4 pi U_max / P with P by Gauss-Legendre quadrature; U_max on a 0.25-degree search refined by
    Nelder-Mead (every antenna here peaks on the 2-degree grid, so the grid max is the truth)."""
    ant, _ = ANT[name]
    tt, pp, ww = cr.sphere_quadrature(300, 600)
    et, ep = ant.field_tp(tt, pp)
    power = float(((abs(et) ** 2 + abs(ep) ** 2) * ww).sum())
    return 4 * math.pi * power_at_grid_max(name) / power


def power_at_grid_max(name):
    et, ep = ANT[name][0].field_tp(TT, PP)
    return float((abs(et) ** 2 + abs(ep) ** 2).max())


def hpbw_closed_form(name, phi_deg, theta_peak):
    """Half-power width of the elevation cut at phi through the peak, from the closed form: the two
    crossings of U = U_peak / 2 either side of the peak (brentq); the cut runs through the poles."""
    up = power_at(name, theta_peak, phi_deg)

    def g(a):  # a is the signed cut angle: theta = |a|, phi or phi + 180 for a < 0
        return power_at(name, abs(a), phi_deg if a >= 0 else phi_deg + 180) - up / 2
    lo = hi = theta_peak
    while g(hi) > 0:
        hi += 0.5
    while g(lo) > 0:
        lo -= 0.5
    return optimize.brentq(g, hi - 0.5, hi, xtol=1e-12) - optimize.brentq(g, lo, lo + 0.5, xtol=1e-12)


def check_info():
    print("== info: peak, directivity, efficiency, HPBW, F/B, AR at the peak (conventions.md)")
    weights = cr.cell_solid_angles(T, len(P))
    for name, (ant, eta) in ANT.items():
        r = run_json("info", FILES[name])
        res = r["results"][0]
        et, ep = ant.field_tp(TT, PP)
        u = abs(et) ** 2 + abs(ep) ** 2
        d_grid, eta_grid = cr.directivity_and_efficiency(u, weights)
        check(f"info {name} coverage", r["coverage"], 1.0, 1e-12)
        check(f"info {name} peak dBi (grid maximum)", res["peak_db"], cr.db(u.max()), TOL_EXACT_DB)
        pt, pp_ = res["peak_theta_deg"], res["peak_phi_deg"]
        check(f"info {name} |E|^2 at the reported peak direction", cr.db(power_at(name, pt, pp_)), cr.db(u.max()), 1e-9)
        check(f"info {name} directivity dBi (cell rule on the grid)", res["directivity_dbi"], cr.db(d_grid), 1e-7)
        check(f"info {name} directivity dBi (closed form, quadrature)", res["directivity_dbi"], cr.db(true_directivity(name)), TOL_INTEGRAL_DB)
        check(f"info {name} radiation efficiency (P / 4 pi)", res["radiation_efficiency"], eta, eta * (10 ** (TOL_INTEGRAL_DB / 10) - 1))
        check_front_to_back(name, res, u.max())
        check_peak_polarisation(name, res)
    for name, phi, tpk, handbook in (("short_z", 0, 90, 90.0), ("half_z", 0, 90, 78.0), ("wave_z", 0, 90, 47.8),
                                     ("long_z", 0, 90, 32.0), ("loop_z", 0, 90, 90.0), ("endfire", 0, 90, None)):
        res = run_json("info", FILES[name])["results"][0]
        want = hpbw_closed_form(name, phi, tpk)
        if not far_reference_ok(name):
            print(f"info info {name} HPBW {res['hpbw_elevation_deg']} against {want} (known: findings.md)")
            continue
        check(f"info {name} HPBW elevation deg (closed form)", res["hpbw_elevation_deg"], want, TOL_HPBW_DEG)
        if handbook:  # Balanis sec. 4.2, 4.5, 5.2; Kraus (rounded handbook values)
            check(f"info {name} HPBW elevation against the handbook value", res["hpbw_elevation_deg"], handbook, 0.6)


def check_front_to_back(name, res, umax):
    t, p = res["peak_theta_deg"], res["peak_phi_deg"]
    back = power_at(name, 180 - t, (p + 180) % 360)
    if back <= 1e-20 * umax:  # an exact null behind: no finite ratio may be printed
        check_equal(f"info {name} front-to-back against an exact null is not a number", res["front_to_back_db"], None)
        ok = res.get("front_to_back_above_db") is not None
        check_equal(f"info {name} front-to-back says 'above' a floor", ok, True)
    else:
        check(f"info {name} front-to-back dB", res["front_to_back_db"], cr.db(umax / back), 1e-7)


def check_peak_polarisation(name, res):
    et, ep = field_at(name, res["peak_theta_deg"], res["peak_phi_deg"])
    ar = cr.axial_ratio(et, ep)
    if ar > 100:  # linear (AR above 40 dB): null in JSON, conventions.md
        check_equal(f"info {name} axial ratio at the peak (linear)", res["axial_ratio_db"], None)
        check_equal(f"info {name} sense at the peak", res["sense"], "linear")
    else:
        check(f"info {name} axial ratio dB at the peak", res["axial_ratio_db"], 20 * math.log10(ar), 1e-7)
        v = cr.stokes(et, ep)[3]
        check_equal(f"info {name} sense at the peak (V > 0 right-hand)", res["sense"], "right" if v > 0 else "left")


PROBE_KEYS = ("total", "theta", "phi", "vertical", "horizontal", "rhcp", "lhcp", "co", "cross")


def reference_probe(et, ep, phi, ref):
    er, el = cr.circular(et, ep)
    co, cx = cr.ludwig3(et, ep, phi, ref)
    vals = {"total": abs(et) ** 2 + abs(ep) ** 2, "theta": abs(et) ** 2, "phi": abs(ep) ** 2,
            "vertical": abs(et) ** 2, "horizontal": abs(ep) ** 2, "rhcp": abs(er) ** 2,
            "lhcp": abs(el) ** 2, "co": abs(co) ** 2, "cross": abs(cx) ** 2}
    return vals


def check_probe_point(name, t, p, ref, on_grid):
    r = run_json("probe", FILES[name], "--theta", str(t), "--phi", str(p), "--ludwig3", ref)
    et, ep = field_at(name, t, p)
    vals = reference_probe(et, ep, p, ref)
    peak = power_at_grid_max(name)
    tag = f"probe {name} ({t}, {p}) {ref}-ref"
    for k in PROBE_KEYS:
        want = vals[k]
        if on_grid:
            if want <= 1e-24 * peak:
                check_equal(f"{tag} {k} of an exact zero is null", r[f"{k}_db"], None) if want == 0 else None
                continue
            check(f"{tag} {k} dB", r[f"{k}_db"], cr.db(want), TOL_EXACT_DB)
        elif want > peak * 10 ** -1.5 and far_reference_ok(name):
            check(f"{tag} {k} dB (interpolated)", r[f"{k}_db"], cr.db(want), TOL_INTERP_DB)
    ar = cr.axial_ratio(et, ep)
    i, q, u, v = cr.stokes(et, ep)
    if on_grid:
        for got, want, what in zip(r["stokes"], (i, q, u, v), "IQUV"):
            check(f"{tag} Stokes {what}", got, want, 1e-12 * max(i, 1e-300) + 1e-15)
    if ar < 50 and vals["total"] > peak * 0.03:
        tol = 1e-7 if on_grid else 0.05
        check(f"{tag} axial ratio dB", r["axial_ratio_db"], 20 * math.log10(ar), tol)
        check_equal(f"{tag} sense", r["sense"], "right" if v > 0 else "left")
        if ar > 1.05:
            dt = (r["tilt_deg"] - cr.tilt_deg(et, ep) + 90) % 180 - 90 if r["tilt_deg"] is not None else None
            check(f"{tag} tilt (deg, modulo 180)", dt, 0.0, 1e-6 if on_grid else 0.5)
    elif ar == math.inf and on_grid:
        check_equal(f"{tag} purely linear: axial ratio null", r["axial_ratio_db"], None)
        if vals["total"] > 1e-24 * peak:  # a linear field still has a tilt: atan2(E_phi, E_theta) mod 180
            dt = (r["tilt_deg"] - cr.tilt_deg(et, ep) + 90) % 180 - 90 if r["tilt_deg"] is not None else None
            check(f"{tag} purely linear: tilt (deg, modulo 180)", dt, 0.0, 1e-6)
        zero = vals["total"] <= 1e-24 * peak  # written as an exact zero (clean())
        check_equal(f"{tag} purely linear: sense", r["sense"], None if zero else "linear")


def check_probe():
    print("== probe: every basis at one direction (IEEE Std 145 sense, Ludwig 1973, Stokes)")
    on = [(0, 0), (30, 40), (90, 0), (90, 270), (124, 306), (180, 0), (46, 180)]
    off = [(31, 41), (57.3, 123.7), (89, 10), (133, 211.5)]
    for name in ("half_x", "half_y", "rhcp_z", "lhcp_z", "rhcp_tilt", "endfire", "bigloop_x", "short_z"):
        for ref in ("x", "y"):
            for t, p in on:
                check_probe_point(name, t, p, ref, True)
        for t, p in off:
            check_probe_point(name, t, p, "x", False)
    # the named sense checks of conventions.md: x + j y is left-hand toward +z, right-hand toward -z
    r = run_json("probe", FILES["lhcp_z"], "--theta", "0", "--phi", "0")
    check_equal("probe x + j y current toward +z is left-hand", r["sense"], "left")
    r = run_json("probe", FILES["lhcp_z"], "--theta", "180", "--phi", "0")
    check_equal("probe x + j y current toward -z is right-hand", r["sense"], "right")
    # exp(-i w t) files are conjugated on import: the physical sense must not change
    path = write("rhcp_tilt", convention="-iwt")
    for t, p in on:
        a = run_json("probe", path, "--theta", str(t), "--phi", str(p))
        b = run_json("probe", FILES["rhcp_tilt"], "--theta", str(t), "--phi", str(p))
        check_equal(f"probe -iwt file reads as the same field at ({t}, {p}) (rhcp dB)", a["rhcp_db"], b["rhcp_db"])
        check_equal(f"probe -iwt file reads as the same field at ({t}, {p}) (sense)", a["sense"], b["sense"])


def phase_centre_wired():
    """True once the commands interpolate with the phase centre's linear phase removed
    (conventions.md, phase centre): the install step is wired when --phase-centre exists."""
    return "--phase-centre" in run("probe", "--help").stdout


def far_reference_ok(name):
    """The end-fire pair sits 1.1 wavelengths off the origin: its values between samples are right
    only when interpolation removes the linear phase first (findings.md, audit 1). Until the
    commands do, those checks are reported but do not fail the test."""
    return name != "endfire" or phase_centre_wired()


def read_cut_csv(path):
    with open(path, encoding="utf-8") as f:
        lines = [ln.strip() for ln in f if ln.strip() and not ln.startswith("#")]
    head = lines[0].split(",")
    rows = np.array([[float(c) for c in ln.split(",")] for ln in lines[1:]])
    return {h: rows[:, i] for i, h in enumerate(head)}


def check_cut():
    print("== cut: values along elevation and conical cuts against the closed form")
    comps = ",".join(PROBE_KEYS)
    for name, how in (("rhcp_tilt", ("--phi", "30")), ("half_x", ("--phi", "90")), ("endfire", ("--theta", "60")),
                      ("bigloop_x", ("--theta", "90")), ("lhcp_z", ("--phi", "270"))):
        out = f"{WORK}/cut_{name}.csv"
        run("cut", FILES[name], *how, "--components", comps, "--step", "0.5", "--out", out)
        c = read_cut_csv(out)
        peak = power_at_grid_max(name)
        worst = {k: 0.0 for k in PROBE_KEYS}
        for i in range(len(c["angle_deg"])):
            a, t, p = c["angle_deg"][i], c["theta_deg"][i], c["phi_deg"][i]
            if how[0] == "--phi":  # angle = theta for a >= 0; the other half-plane at phi + 180
                want_t, want_p = abs(a), float(how[1]) + (180 if a < 0 else 0)
            else:
                want_t, want_p = float(how[1]), a
            geo = abs(t - want_t) < 1e-9 and abs((p - want_p + 180) % 360 - 180) < 1e-9
            if not geo:
                check_equal(f"cut {name} row {i}: angle {a} maps to theta/phi", (t, p), (want_t, want_p))
            et, ep = field_at(name, t, p)
            vals = reference_probe(et, ep, p, "x")
            for k in PROBE_KEYS:
                if vals[k] > peak * 10 ** -1.5:
                    unit = "dbic" if k in ("rhcp", "lhcp") else "dbi"
                    worst[k] = max(worst[k], abs(c[f"{k}_{unit}"][i] - cr.db(vals[k])))
        for k in PROBE_KEYS:
            label = f"cut {name} {' '.join(how)} {k}: largest error within 15 dB of the peak, dB"
            if far_reference_ok(name):
                check(label, worst[k], 0.0, TOL_INTERP_DB)
            else:
                print(f"info {label}: {worst[k]:.4f} (known: findings.md, interpolation keeps the offset phase)")


# Environments: (label, ellipsa options, reference). The preset values are the ones the JSON
# reports for the preset (checked below against what was asked), integrated here from Taga's
# formula; the custom one has different V and H angles so a swap of P_theta and P_phi shows.
ENVS = [
    ("uniform", ["--environment", "uniform"], cr.Environment(0.0)),
    ("uniform XPR 6 dB", ["--environment", "uniform", "--xpr", "6"], cr.Environment(6.0)),
    ("uniform XPR inf", ["--environment", "uniform", "--xpr", "inf"], cr.Environment(math.inf)),
    ("indoor", ["--environment", "indoor"], None),
    ("urban", ["--environment", "urban"], None),
    ("rural", ["--environment", "rural"], None),
    ("gaussian custom", ["--environment", "gaussian", "--v-mean", "20", "--v-spread", "10", "--h-mean", "-5",
                         "--h-spread", "25", "--xpr", "3"], cr.Environment(3.0, (20, 10), (-5, 25))),
]
# MEG on a 2-degree grid against quadrature of the closed form (conventions.md: < 0.01 dB at 2 deg).
TOL_MEG_DB = 0.01
# ECC on a 2-degree grid against quadrature: absolute; the grid sums of smooth closed forms agree
# to about 1e-8, so 2e-4 leaves room only for grid effects (a figure quoted to 3 decimals).
TOL_ECC = 2e-4
# Combining levels computed by both sides from the same MEG and ECC: both are exact formulas
# (conventions.md), so only root-finding and quadrature error remain.
TOL_COMBINING_DB = 1e-3


def env_from_json(e):
    """The reference environment for what ellipsa says it used (model, angles, XPR)."""
    xpr = math.inf if e["xpr_db"] is None or e["xpr_db"] == "inf" else e["xpr_db"]
    if e["model"] == "uniform":
        return cr.Environment(xpr)
    return cr.Environment(xpr, (e["v_mean_deg"], e["v_spread_deg"]), (e["h_mean_deg"], e["h_spread_deg"]))


def check_environment_echo(label, e, env):
    """The preset table (docs/diversity.md) against what the JSON reports."""
    table = {"indoor": (0, 30, 1), "urban": (10, 15, 6), "rural": (3, 8, 9)}
    if label in table:
        m, s, x = table[label]
        got = (e["v_mean_deg"], e["v_spread_deg"], e["h_mean_deg"], e["h_spread_deg"], e["xpr_db"])
        check_equal(f"diversity preset {label} parameters as documented", got, (m, s, m, s, x))
    wv, wh = env.weights()
    check(f"diversity {label} weight vertical XPR/(1+XPR)", e["weight_vertical"], wv, 1e-12)
    check(f"diversity {label} weight horizontal 1/(1+XPR)", e["weight_horizontal"], wh, 1e-12)


PAIRS = [("half_z", "half_x"), ("rhcp_tilt", "half_x"), ("endfire", "short_z"), ("bigloop_x", "rhcp_tilt"),
         ("half_z", "long_z"), ("rhcp_z", "lhcp_z"), ("loop_z", "half_z"), ("short_z", "short_z_shift")]


MEG_CACHE = {}


def meg_of(label, name, env):
    if (label, name) not in MEG_CACHE:
        MEG_CACHE[(label, name)] = cr.meg(ANT[name][0], env)
    return MEG_CACHE[(label, name)]


def check_meg_figures(label, pat, name, env):
    m, pv, ph = meg_of(label, name, env)
    wv, wh = env.weights()
    if m < 1e-12:  # nothing received (a loop in a vertical-only environment)
        check_equal(f"diversity {label} {name} MEG of a blind antenna is null", pat["meg_db"], None)
        return m
    check(f"diversity {label} {name} MEG dB", pat["meg_db"], cr.db(m), TOL_MEG_DB)
    for key, part in (("meg_vertical_db", wv * pv), ("meg_horizontal_db", wh * ph)):
        if part > 1e-6 * m:
            check(f"diversity {label} {name} {key}", pat[key], cr.db(part), TOL_MEG_DB)
    check(f"diversity {label} {name} vertical share of MEG", pat["vertical_share"], wv * pv / m, 2e-3)
    return m


def check_combining(label, comb, g1, g2, rho):
    for key, c in comb.items():
        p = c["outage"]
        ls1 = cr.level(lambda x: cr.cdf_single(x, g1), p, g1)
        ls2 = cr.level(lambda x: cr.cdf_single(x, g2), p, g2)
        sc = cr.level(lambda x: cr.cdf_selection(x, g1, g2, rho), p, max(g1, g2))
        mrc = cr.level(lambda x: cr.cdf_mrc(x, g1, g2, rho), p, max(g1, g2))
        ideal = cr.level(lambda x: cr.cdf_single(x, 0.5), p, 0.5)
        tag = f"diversity {label} combining at {p}"
        check(f"{tag}: branch 1 level", c["branch1_level_db"], cr.db(ls1), TOL_COMBINING_DB)
        check(f"{tag}: branch 2 level", c["branch2_level_db"], cr.db(ls2), TOL_COMBINING_DB)
        check(f"{tag}: selection level", c["selection_level_db"], cr.db(sc), TOL_COMBINING_DB)
        check(f"{tag}: MRC level", c["mrc_level_db"], cr.db(mrc), TOL_COMBINING_DB)
        check(f"{tag}: ideal antenna level (MEG 0.5)", c["ideal_level_db"], cr.db(ideal), TOL_COMBINING_DB)
        check(f"{tag}: apparent selection gain", c["selection_db"], cr.db(sc / max(ls1, ls2)), TOL_COMBINING_DB)
        check(f"{tag}: apparent MRC gain", c["mrc_db"], cr.db(mrc / max(ls1, ls2)), TOL_COMBINING_DB)
        check(f"{tag}: effective selection gain", c["selection_effective_db"], cr.db(sc / ideal), TOL_COMBINING_DB)
        check(f"{tag}: effective MRC gain", c["mrc_effective_db"], cr.db(mrc / ideal), TOL_COMBINING_DB)


def check_diversity():
    print("== diversity: MEG (Taga 1990), ECC (Vaughan-Andersen 1987), exact combining")
    for label, opts, env in ENVS:
        for a, b in PAIRS:
            r = run_json("diversity", FILES[a], FILES[b], *opts, "--outage", "0.01,0.1,0.001")
            e = r["environment"]
            ref_env = env or env_from_json(e)
            if (a, b) == PAIRS[0]:
                check_environment_echo(label, e, ref_env)
            g1 = check_meg_figures(label, r["patterns"][0], a, ref_env)
            g2 = check_meg_figures(label, r["patterns"][1], b, ref_env)
            if min(g1, g2) < 1e-12:  # one antenna receives nothing: no correlation to speak of
                check_equal(f"diversity {label} ECC {a} / {b} with a blind antenna is null", r["ecc"], None)
                continue
            rho, _ = cr.ecc(ANT[a][0], ANT[b][0], ref_env)
            check(f"diversity {label} ECC {a} / {b}", r["ecc"], rho, TOL_ECC)
            # the combining from ellipsa's own MEG and ECC: isolates the fading formulas
            check_combining(f"{label} {a}/{b}", r["combining"], r["patterns"][0]["meg"],
                            r["patterns"][1]["meg"], r["ecc"])
            # end to end: the headline (selection gain at 1 %) from the closed-form MEG and ECC
            sc = cr.level(lambda x: cr.cdf_selection(x, g1, g2, rho), 0.01, max(g1, g2))
            best = max(g1, g2) * -math.log1p(-0.01)
            check(f"diversity {label} {a}/{b} diversity gain at 1 % (closed form end to end)",
                  r["diversity_gain_db"], cr.db(sc / best), 0.02)


# Incoming polarisation of a dominant wave in the theta/phi basis at its arrival direction r-hat
# (it travels along -r-hat): the received amplitude is E_theta a_theta + E_phi a_phi, the same
# coupling as the random-field simulation's (conventions.md). An incoming right-hand wave is
# (theta-hat + j phi-hat)/sqrt2: right-handed about its own direction of travel, -r-hat, whose
# right-handed basis is (theta-hat, -phi-hat) (IEEE Std 145 sense); it meets an RHCP antenna's
# (theta-hat - j phi-hat)/sqrt2 with amplitude 1.
INCOMING = {"vertical": (1, 0), "horizontal": (0, 1), "rhcp": (1 / math.sqrt(2), 1j / math.sqrt(2)),
            "lhcp": (1 / math.sqrt(2), -1j / math.sqrt(2))}


def within_ci(label, want, ci):
    """A fixed-seed simulation against the exact value: inside the reported 95 % interval widened
    to about 4 standard errors (1.96 -> 3.9), so the check is strict but not a coin toss."""
    lo, hi = ci
    mid, half = (lo + hi) / 2, (hi - lo) / 2
    check(label, mid, want, 2 * half)


def check_fading_rayleigh():
    label, opts, env = ENVS[-1]
    for a, b in (("rhcp_tilt", "half_x"), ("endfire", "half_y")):
        r = run_json("fading", FILES[a], FILES[b], *opts, "--samples", "40000", "--outage", "0.01,0.1,0.5")
        gs = []
        for pat, name in zip(r["patterns"], (a, b)):
            g = meg_of(label, name, env)[0]
            gs.append(g)
            check(f"fading {label} {name} analytic mean = MEG", pat["analytic_mean_db"], cr.db(g), TOL_MEG_DB)
            within_ci(f"fading {label} {name} simulated mean power against MEG", cr.db(g), pat["mean_ci95_db"])
            for key, lv in pat["analytic_levels_db"].items():
                want = g * -math.log1p(-float(key))
                check(f"fading {label} {name} Rayleigh level at {key}", lv, cr.db(want), TOL_MEG_DB)
                within_ci(f"fading {label} {name} simulated level at {key}", cr.db(want), pat["levels_ci95_db"][key])
        rho, _ = cr.ecc(ANT[a][0], ANT[b][0], env)
        pair = r["pair"]
        check(f"fading {label} {a}/{b} ECC", pair["ecc"], rho, TOL_ECC)
        within_ci(f"fading {label} {a}/{b} simulated power correlation against ECC", rho, pair["power_correlation_ci95"])
        for key, lv in pair["analytic_selection_levels_db"].items():
            sc = cr.level(lambda x: cr.cdf_selection(x, gs[0], gs[1], rho), float(key), max(gs))
            mrc = cr.level(lambda x: cr.cdf_mrc(x, gs[0], gs[1], rho), float(key), max(gs))
            check(f"fading {label} {a}/{b} exact selection level at {key}", lv, cr.db(sc), 0.01)
            check(f"fading {label} {a}/{b} exact MRC level at {key}", pair["analytic_mrc_levels_db"][key], cr.db(mrc), 0.01)
            within_ci(f"fading {label} {a}/{b} simulated selection level at {key}", cr.db(sc), pair["selection_levels_ci95_db"][key])
            within_ci(f"fading {label} {a}/{b} simulated MRC level at {key}", cr.db(mrc), pair["mrc_levels_ci95_db"][key])


def check_fading_rician():
    env = cr.Environment(0.0)
    for pol, (at, ap) in INCOMING.items():
        for t, p in ((10, 0), (90, 45), (60, 200)):
            r = run_json("fading", FILES["rhcp_z"], FILES["half_x"], FILES["rhcp_tilt"], "--dominant", f"{t},{p}",
                         "--k-factor", "10dB", "--polarisation", pol, "--samples", "20000", "--outage", "0.01,0.1,0.5")
            for pat, name in zip(r["patterns"], ("rhcp_z", "half_x", "rhcp_tilt")):
                check_rician_pattern(pat, name, env, 10.0, (t, p), pol, (at, ap))


def check_rician_pattern(pat, name, env, k_env, direction, pol, incoming):
    et, ep = field_at(name, *direction)
    det = k_env / (k_env + 1) * abs(et * incoming[0] + ep * incoming[1]) ** 2
    diffuse = meg_of("uniform", name, env)[0] / (k_env + 1)
    omega = det + diffuse
    tag = f"fading Rician {name} from {direction} {pol}"
    check(f"{tag}: mean power", pat["analytic_mean_db"], cr.db(omega), TOL_MEG_DB)
    if det > 1e-12 * diffuse:  # below: the antenna is blind to the dominant wave (K = 0)
        check(f"{tag}: the antenna's K-factor, dB", cr.db(pat["k_factor"]) if pat["k_factor"] is not None else None, cr.db(det / diffuse), TOL_MEG_DB)
    else:
        check(f"{tag}: the antenna's K-factor of a blind antenna (linear, 0 up to rounding)", pat["k_factor"], 0.0, 1e-12)
    for key, lv in pat["analytic_levels_db"].items():
        x = cr.level(lambda x: cr.cdf_rician(x, det / diffuse, omega), float(key), omega)
        check(f"{tag}: level at {key}", lv, cr.db(x), 0.01)


def check_selection_quadrature():
    """The reference's fixed 400-node Gauss-Legendre rule for the selection integral against
    adaptive QUADPACK on the same integrand, and the conventions' named checks: independent equal
    branches gain 10.2 dB (selection) and 11.7 dB (MRC) at 1 % outage over one branch."""
    for g1, g2, rho in ((1, 0.5, 0.3), (0.2, 0.9, 0.95), (1, 1, 0.999)):
        for x in (1e-4, 0.01, 0.3):
            a, b = cr.cdf_selection(x, g1, g2, rho), cr.cdf_selection_adaptive(x, g1, g2, rho)
            check(f"reference selection CDF, fixed rule against adaptive ({g1}, {g2}, {rho}, {x}), relative", a / b - 1, 0.0, 1e-10)
    one = cr.level(lambda x: cr.cdf_single(x, 1), 0.01, 1)
    check("reference selection gain, independent equal branches, 1 %", cr.db(cr.level(lambda x: cr.cdf_selection(x, 1, 1, 0), 0.01, 1) / one), 10.2, 0.05)
    check("reference MRC gain, independent equal branches, 1 %", cr.db(cr.level(lambda x: cr.cdf_mrc(x, 1, 1, 0), 0.01, 1) / one), 11.7, 0.05)


def check_simulation_reference():
    """The reference's own random-field simulation (continuous directions, closed-form fields)
    against its MEG and ECC: checks conventions_reference.py itself, as conventions.md asks."""
    label, _, env = ENVS[-1]
    amps = cr.simulate([ANT["rhcp_tilt"][0], ANT["half_x"][0]], env, n_real=20000, n_waves=60)
    p1, p2 = (abs(amps) ** 2).mean(1)
    c = (amps[0] * np.conj(amps[1])).mean() / math.sqrt(p1 * p2)
    g1, g2 = meg_of(label, "rhcp_tilt", env)[0], meg_of(label, "half_x", env)[0]
    # mean of an exponential power over N draws: relative standard error 1/sqrt(N) = 0.7 %
    check("reference simulation: mean power of rhcp_tilt = MEG (dB)", cr.db(p1), cr.db(g1), 0.15)
    check("reference simulation: mean power of half_x = MEG (dB)", cr.db(p2), cr.db(g2), 0.15)
    check("reference simulation: |complex correlation|^2 = ECC", abs(c) ** 2, cr.ecc(ANT["rhcp_tilt"][0], ANT["half_x"][0], env)[0], 0.03)


def check_fading_random_orientation():
    """Over uniformly random orientations each direction sees the polarisation-averaged gain, so
    the mean received power is efficiency / 2 in any environment (Taga 1990's isotropic result)."""
    r = run_json("fading", FILES["rhcp_tilt"], FILES["loop_z"], "--environment", "urban", "--random-orientation",
                 "--samples", "20000")
    for pat, name in zip(r["patterns"], ("rhcp_tilt", "loop_z")):
        within_ci(f"fading {name} random orientation: mean power = efficiency / 2", cr.db(ANT[name][1] / 2), pat["mean_ci95_db"])


def check_fading():
    print("== fading: exact Rayleigh/Rician levels, combining, and the simulation against them")
    check_selection_quadrature()
    check_simulation_reference()
    check_fading_random_orientation()
    check_fading_rayleigh()
    check_fading_rician()


BAND_FREQS = [2.40e9, 2.45e9, 2.50e9]
BAND_A = ["half_z", "wave_z", "long_z"]      # one file, a different closed form per frequency
BAND_B = ["half_x", "rhcp_tilt", "endfire"]


def write_band(names, tag):
    path = f"{WORK}/band_{tag}.csv"
    cr.write_csv(path, BAND_FREQS, [clean(*ANT[n][0].field_tp(TT, PP)) for n in names], T, P, name=tag)
    return path


def check_band():
    print("== band: figures per frequency of a three-frequency file and of a pair")
    a, b = write_band(BAND_A, "A"), write_band(BAND_B, "B")
    out = f"{WORK}/band.json"
    run("band", a, b, "--pair", "--environment", "uniform,indoor", "--out", out,
        "--show", "gain,efficiency,meg,axial-ratio,hpbw,front-to-back,ecc,diversity-gain")
    with open(out, encoding="utf-8") as f:
        r = json.load(f)
    weights = cr.cell_solid_angles(T, len(P))
    envs = {"uniform": cr.Environment(0.0)}
    for pat, names in zip(r["patterns"], (BAND_A, BAND_B)):
        for fr, name in zip(pat["frequencies"], names):
            et, ep = clean(*ANT[name][0].field_tp(TT, PP))
            u = abs(et) ** 2 + abs(ep) ** 2
            d, eta = cr.directivity_and_efficiency(u, weights)
            tag = f"band {pat['label']} {fr['frequency_hz'] / 1e9:.2f} GHz ({name})"
            check(f"{tag} peak dBi", fr["peak_db"], cr.db(u.max()), TOL_EXACT_DB)
            check(f"{tag} directivity dBi (cell rule)", fr["directivity_dbi"], cr.db(d), 1e-7)
            check(f"{tag} directivity dBi (closed form)", fr["directivity_dbi"], cr.db(true_directivity(name)), TOL_INTEGRAL_DB)
            check(f"{tag} efficiency", fr["radiation_efficiency"], eta, 1e-9)
            check(f"{tag} MEG uniform", fr["meg_db"]["uniform"], cr.db(meg_of("uniform", name, envs["uniform"])[0]), TOL_MEG_DB)
            indoor = cr.Environment(1.0, (0, 30), (0, 30))  # the preset, checked against the docs above
            check(f"{tag} MEG indoor", fr["meg_db"]["indoor"], cr.db(meg_of("indoor", name, indoor)[0]), TOL_MEG_DB)
            info = run_json("info", FILES[name])["results"][0]
            for key in ("hpbw_elevation_deg", "hpbw_azimuth_deg", "front_to_back_db", "axial_ratio_db"):
                check(f"{tag} {key} as info says for the same pattern", fr[key], info[key], 1e-9)
    for fr, na, nb in zip(r["pairs"][0]["frequencies"], BAND_A, BAND_B):
        for label, env in (("uniform", cr.Environment(0.0)), ("indoor", cr.Environment(1.0, (0, 30), (0, 30)))):
            rho, _ = cr.ecc(ANT[na][0], ANT[nb][0], env)
            check(f"band pair {fr['frequency_hz'] / 1e9:.2f} GHz {na}/{nb} ECC {label}", fr["ecc"][label], rho, TOL_ECC)
            g1, g2 = meg_of(label, na, env)[0], meg_of(label, nb, env)[0]
            sc = cr.level(lambda x: cr.cdf_selection(x, g1, g2, rho), 0.01, max(g1, g2))
            check(f"band pair {fr['frequency_hz'] / 1e9:.2f} GHz diversity gain {label} (selection, 1 %)",
                  fr["diversity_gain_db"][label], cr.db(sc / (max(g1, g2) * -math.log1p(-0.01))), 0.02)


def component_power(name, which, t, p):
    et, ep = ANT[name][0].field_tp(t, p)
    er, el = cr.circular(et, ep)
    return {"total": abs(et) ** 2 + abs(ep) ** 2, "vertical": abs(et) ** 2, "horizontal": abs(ep) ** 2,
            "rhcp": abs(er) ** 2, "lhcp": abs(el) ** 2}[which]


def boundary_share(state, weights):
    """Solid-angle share of the cells whose state differs from a neighbour's: the most a cell
    rule can differ from the exact share."""
    edge = np.zeros_like(state)
    edge[1:, :] |= state[1:, :] != state[:-1, :]
    edge[:-1, :] |= state[1:, :] != state[:-1, :]
    edge |= state != np.roll(state, 1, 1)
    edge |= state != np.roll(state, -1, 1)
    return float((weights * edge).sum() / weights.sum())


def check_coverage():
    print("== coverage: share of the sphere at or above a level")
    tt, pp, ww = cr.sphere_quadrature(300, 720)
    weights = cr.cell_solid_angles(T, len(P))
    for name in ("rhcp_tilt", "endfire", "bigloop_x", "half_x"):
        out = f"{WORK}/coverage_{name}.json"
        run("coverage", FILES[name], "--levels", "3,0,-3,-6,-10,-20", "--out", out)
        with open(out, encoding="utf-8") as f:
            r = json.load(f)
        for ser in r["series"]:
            comp = ser["component"]
            fine = component_power(name, comp, tt, pp)
            coarse = component_power(name, comp, TT, PP)
            for lv in ser["at_levels"]:
                x = 10 ** (lv["level_db"] / 10)
                exact = float((ww * (fine >= x)).sum() / (4 * math.pi))
                state = coarse >= x
                tag = f"coverage {name} {comp} >= {lv['level_db']} dB"
                # Counting whole cells may miss by every cell on the contour (boundary_share); with
                # the power interpolated inside the cells (docs/views.md) the miss is at most a
                # tenth of that (measured: under 5 %, the fine reference's own error included).
                check(f"{tag} (closed form; tolerance: a tenth of the cells on the contour)", lv["share"], exact,
                      boundary_share(state, weights) / 10 + 1e-9)
    check_coverage_band_pair()


def read_examples_csv(path):
    """The schema's complex family with a frequency column (MHz), by a reader of our own."""
    with open(path, encoding="utf-8") as f:
        meta = [ln for ln in f if ln.startswith("#")]
    unit = [m.split(":", 1)[1].strip() for m in meta if m.lower().startswith("# frequency-unit")]
    scale = {"Hz": 1, "kHz": 1e3, "MHz": 1e6, "GHz": 1e9}[unit[0] if unit else "Hz"]
    d = cr.read_csv_simple(path)
    return d, scale


def examples_grid(d, fcol, scale):
    """{frequency Hz: (theta list, phi list, E_theta grid, E_phi grid)}, rows sorted by theta, phi."""
    out = {}
    for f in np.unique(d[fcol]):
        m = d[fcol] == f
        t, p = d["theta"][m], d["phi"][m] % 360
        order = np.lexsort((p, t))
        ut, up = np.unique(t), np.unique(p)
        et = d["et"][m][order].reshape(len(ut), len(up))
        ep = d["ep"][m][order].reshape(len(ut), len(up))
        out[f * scale] = (ut, up, et, ep)
    return out


def read_range_example(path):
    """examples/measured-loop-range.csv in its own layout (semicolons, decimal commas, azimuth
    -180..180 with the seam repeated, elevation from the horizon, dB and degrees per part):
    theta = 90 - elevation, phi = azimuth mod 360 (conventions.md), E = 10^(dB/20) exp(j phase)."""
    raw = cr.read_csv_simple(path, delimiter=";", decimal_comma=True)
    d = {"frequency": raw["freq [mhz]"], "theta": 90 - raw["elev [deg]"], "phi": raw["azim [deg]"] % 360}
    d["et"] = 10 ** (raw["vert gain [dbi]"] / 20) * np.exp(1j * np.radians(raw["vert phase [deg]"]))
    d["ep"] = 10 ** (raw["horiz gain [dbi]"] / 20) * np.exp(1j * np.radians(raw["horiz phase [deg]"]))
    keep = raw["azim [deg]"] < 180  # the seam column repeats -180
    return {k: v[keep] for k, v in d.items()}


def grid_meg(t, p, et, ep, env):
    """MEG on the file's grid: the cell rule with the densities normalised analytically
    (taga_norm), so this does not share ellipsa's numerical normalisation."""
    w = cr.cell_solid_angles(t, len(p))
    tt = np.repeat(t[:, None], len(p), 1)
    wv, wh = env.weights()
    return float((w * (wv * abs(et) ** 2 * env.density("v", tt) + wh * abs(ep) ** 2 * env.density("h", tt))).sum())


def check_example_file(path, grids, partial=False):
    base = os.path.basename(path)
    args = [path] + (["--map-file", f"{SRC}/examples/measured-loop.map"] if partial else [])
    info = run_json("info", *args)
    envs = {"uniform": cr.Environment(0.0), "indoor": cr.Environment(1.0, (0, 30), (0, 30))}
    megs = {k: run_json("diversity", *args, "--environment", k) for k in envs} if not partial else {}
    for res in info["results"]:
        f = res["frequency_hz"]
        t, p, et, ep = grids[min(grids, key=lambda g: abs(g - f))]
        u = abs(et) ** 2 + abs(ep) ** 2
        w = cr.cell_solid_angles(t, len(p))
        tag = f"example {base} {f / 1e9:.3f} GHz"
        # the peak is refined between samples (pattern/peak.hpp, a parabola in dB): never below the
        # largest sample, and above it by at most what noise on a 5-degree grid can add
        check(f"{tag} peak dBi: the largest sample or a little above", res["peak_db"],
              min(max(res["peak_db"], cr.db(u.max())), cr.db(u.max()) + 0.05), 1e-9)
        i, j = np.unravel_index(np.argmax(u), u.shape)
        ar = cr.axial_ratio(et[i, j], ep[i, j])
        if partial:
            check(f"{tag} coverage (half sphere: cells clipped at the horizon)", info["coverage"], float(w.sum() / (4 * math.pi)), 1e-9)
            check_equal(f"{tag} directivity unavailable from half a sphere", res["directivity_dbi"], None)
            # with the refined peak (above): this checks the integral over the half sphere
            check(f"{tag} directivity assuming nothing outside", res["directivity_sampled_region_only_dbi"],
                  cr.db(4 * math.pi * 10 ** (res["peak_db"] / 10) / (u * w).sum()), 1e-6)
            continue
        d, eta = cr.directivity_and_efficiency(u, w)
        check(f"{tag} directivity dBi (cell rule)", res["directivity_dbi"], cr.db(d), 1e-6)
        check(f"{tag} radiation efficiency", res["radiation_efficiency"], eta, 1e-7)
        if ar < 1e2:
            check(f"{tag} axial ratio at the peak", res["axial_ratio_db"], 20 * math.log10(ar), 1e-4)
        for k, env in envs.items():
            r = [x for x in megs[k]["patterns"][0]["results"] if abs(x["frequency_hz"] - f) < 1][0]
            check(f"{tag} MEG {k} (cell rule, analytic normalisation)", r["meg_db"], cr.db(grid_meg(t, p, et, ep, env)), 0.005)


def check_examples():
    print("== examples: the bundled files through a reader of our own")
    for name in ("printed-dipole.csv", "turnstile.csv", "small-loop.csv"):
        path = f"{SRC}/examples/{name}"
        d, scale = read_examples_csv(path)
        d["et"] = d["e_theta_re"] + 1j * d["e_theta_im"]
        d["ep"] = d["e_phi_re"] + 1j * d["e_phi_im"]
        check_example_file(path, examples_grid(d, "frequency", scale))
    # the README's claims: the turnstile is right-hand circular toward the ceiling at 2.45 GHz
    r = run_json("probe", f"{SRC}/examples/turnstile.csv", "--theta", "0", "--phi", "0", "--frequency", "2.45e9")
    check_equal("example turnstile.csv right-hand toward +z at 2.45 GHz (README)", r["sense"], "right")
    path = f"{SRC}/examples/measured-loop-range.csv"
    grids = examples_grid(read_range_example(path), "frequency", 1e6)
    check_example_file(path, grids, partial=True)
    t, p, et, ep = grids[2.45e9]
    for ti, pi in ((3, 10), (10, 60), (17, 37)):
        r = run_json("probe", path, "--map-file", f"{SRC}/examples/measured-loop.map", "--theta", str(t[ti]),
                     "--phi", str(p[pi]), "--frequency", "2.45e9")
        er, el = cr.circular(et[ti, pi], ep[ti, pi])
        tag = f"example range file probe ({t[ti]}, {p[pi]})"
        check(f"{tag} vertical dBi", r["vertical_db"], cr.db(abs(et[ti, pi]) ** 2), 1e-9)
        check(f"{tag} horizontal dBi", r["horizontal_db"], cr.db(abs(ep[ti, pi]) ** 2), 1e-9)
        check(f"{tag} rhcp dBic", r["rhcp_db"], cr.db(abs(er) ** 2), 1e-9)
        check(f"{tag} lhcp dBic", r["lhcp_db"], cr.db(abs(el) ** 2), 1e-9)



def check_orientations():
    """The orientation sweep against MEG of the turned closed form, R = R_x(tilt) R_z(roll) and
    E'(r) = R E(R^T r) (conventions.md, the mounting frame; docs/diversity.md for the set)."""
    print("== orientations: MEG of the turned antenna, and the mean over all orientations")
    label, opts, env = ENVS[-1]
    for name in ("rhcp_tilt", "endfire", "bigloop_x"):
        r = run_json("diversity", FILES[name], *opts, "--orientations", "--tilt-step", "30", "--roll-step", "60")
        o = r["patterns"][0]["orientations"]
        for tilt, roll, got in o["samples"][:: max(1, len(o["samples"]) // 8)]:
            rot = cr.rotation_about("x", tilt) @ cr.rotation_about("z", roll)
            want = cr.meg(cr.Rotated(ANT[name][0], rot), env)[0]
            check(f"orientation {name} tilt {tilt} roll {roll} MEG dB", got, cr.db(want), TOL_MEG_DB)
        # averaged over every orientation, each direction sees the polarisation-averaged gain, so
        # the mean MEG is efficiency / 2 in any environment (Taga 1990's isotropic result)
        r = run_json("diversity", FILES[name], *opts, "--orientations", "--tilt-step", "5", "--tilt-max", "180",
                     "--roll-step", "10")
        eta = ANT[name][1]
        check(f"orientation {name} mean over all orientations = efficiency / 2 (dB)",
              r["patterns"][0]["orientations"]["random_orientation_mean_db"], cr.db(eta / 2), 0.002)


def profile_environment(measure):
    """A user elevation table (docs/diversity.md): p_v a raised cosine around 15 deg elevation,
    p_h a broader one around 0 deg, every 1 deg from -90 to 90."""
    el = np.arange(-90, 91, 1.0)
    pv = np.where(abs(el - 15) < 40, np.cos((el - 15) / 40 * math.pi / 2) ** 2, 0.0)
    ph = np.where(abs(el) < 70, np.cos(el / 70 * math.pi / 2) ** 2, 0.0) * 0.5
    path = f"{WORK}/profile_{measure}.csv"
    with open(path, "w", encoding="utf-8") as f:
        f.write("elevation_deg,p_v,p_h\n")
        for row in zip(el, pv, ph):
            f.write(",".join(repr(float(v)) for v in row) + "\n")
    return path, el, pv, ph


def check_profile():
    """MEG in a tabulated environment: per steradian ('solid-angle') the table is the density;
    per unit elevation summed over azimuth ('elevation') the density per steradian is the table
    over cos(elevation). XPR is the ratio of the two columns' integrated power."""
    print("== profile environments: tables per steradian and per elevation")
    tt, pp, ww = cr.sphere_quadrature(400, 360)
    elev = 90 - tt
    for measure in ("solid-angle", "elevation"):
        path, el, pv, ph = profile_environment(measure)
        fv = np.interp(elev, el, pv)
        fh = np.interp(elev, el, ph)
        if measure == "elevation":
            fv, fh = fv / np.cos(np.radians(elev)), fh / np.cos(np.radians(elev))
        sv, sh = (fv * ww).sum(), (fh * ww).sum()
        for name in ("rhcp_tilt", "half_x", "loop_z"):
            r = run_json("diversity", FILES[name], "--environment", "profile", "--profile", path,
                         "--profile-measure", measure)
            et, ep = ANT[name][0].field_tp(tt, pp)
            xpr = sv / sh
            wv, wh = xpr / (1 + xpr), 1 / (1 + xpr)
            m = wv * (abs(et) ** 2 * fv / sv * ww).sum() + wh * (abs(ep) ** 2 * fh / sh * ww).sum()
            check(f"profile {measure} XPR dB from the column totals", r["environment"]["xpr_db"], cr.db(xpr), 0.01)
            check(f"profile {measure} {name} MEG dB", r["patterns"][0]["meg_db"], cr.db(float(m)), TOL_MEG_DB)



def write_family(name, family, convention="+jwt", ref="x", angles="theta"):
    """The same closed form in another field family of docs/far-field-csv.md, converted here with
    conventions.md's own formulas: circular E_R, E_L; Ludwig-3 co/cross; dB = 10 log10 of the
    partial power and the phase in degrees. With -iwt every phase is written negated."""
    et, ep = clean(*ANT[name][0].field_tp(TT, PP))
    sign = -1 if convention == "-iwt" else 1
    if family == "circular":
        a, b = cr.circular(et, ep)
        cols = ("e_rhcp_db", "e_rhcp_phase", "e_lhcp_db", "e_lhcp_phase")
    elif family == "ludwig3":
        a, b = cr.ludwig3(et, ep, PP, ref) if False else _ludwig3_grid(et, ep, ref)
        cols = ("e_co_db", "e_co_phase", "e_cross_db", "e_cross_phase")
    else:
        a, b = et, ep
        cols = ("e_theta_db", "e_theta_phase", "e_phi_db", "e_phi_phase")
    if angles == "theta":
        head, ang = "theta,phi", (TT, np.where(PP >= 180, PP - 360, PP))  # phi written in [-180, 180)
    else:
        head, ang = "azimuth,elevation", (PP, 90 - TT)
    path = f"{WORK}/{name}_{family}_{convention[1:]}_{ref}_{angles}.csv"
    with open(path, "w", encoding="utf-8") as f:
        f.write(f"# quantity: gain\n# time-convention: {convention}\n# ludwig3-reference: {ref}\n")
        f.write(f"{head},{','.join(cols)}\n")
        with np.errstate(divide="ignore"):
            vals = [ang[0], ang[1], 20 * np.log10(abs(a)), sign * np.degrees(np.angle(a)),
                    20 * np.log10(abs(b)), sign * np.degrees(np.angle(b))]
        for row in zip(*(v.ravel() for v in vals)):
            f.write(",".join("-inf" if v == -math.inf else repr(float(v)) for v in row) + "\n")
    return path


def _ludwig3_grid(et, ep, ref):
    s, c = np.sin(np.radians(PP)), np.cos(np.radians(PP))
    if ref == "x":
        return et * c - ep * s, et * s + ep * c
    return et * s + ep * c, et * c - ep * s


def check_families():
    """Every field family and angle layout of the schema reads as the same physical field."""
    print("== field families: circular, Ludwig-3, dB/phase, -iwt, azimuth/elevation")
    variants = [("circular", "+jwt", "x", "theta"), ("circular", "-iwt", "x", "theta"),
                ("ludwig3", "+jwt", "x", "theta"), ("ludwig3", "-iwt", "y", "theta"),
                ("thetaphi", "+jwt", "x", "azel"), ("thetaphi", "-iwt", "x", "theta")]
    keys = [f"{k}_db" for k in PROBE_KEYS] + ["axial_ratio_db", "tilt_deg"]
    for name in ("rhcp_tilt", "endfire"):
        for fam, conv, ref, ang in variants:
            path = write_family(name, fam, conv, ref, ang)
            for t, p in ((0, 0), (30, 270), (90, 0), (124, 306), (150, 92)):
                a = run_json("probe", path, "--theta", str(t), "--phi", str(p), "--ludwig3", "x")
                b = run_json("probe", FILES[name], "--theta", str(t), "--phi", str(p), "--ludwig3", "x")
                for k in keys:
                    tag = f"family {fam} {conv} {ref}-ref {ang} {name} ({t}, {p}) {k}"
                    if a[k] is None or b[k] is None:  # an exact zero on one side: at most residue on the other
                        other = a[k] if b[k] is None else b[k]
                        zero_like = other is None or (k.endswith("_db") and k != "axial_ratio_db" and other < -200)
                        check_equal(f"{tag}: zero on both sides (or below -200 dB)", zero_like, True)
                    elif b[k] > -100:
                        check(tag, a[k], b[k], 1e-6)
                check_equal(f"family {fam} {conv} {ref}-ref {ang} {name} ({t}, {p}) sense", a["sense"], b["sense"])



def sidelobe_closed_form(name, phi_deg):
    """Highest local maximum of the elevation cut outside the main lobe's first nulls, relative to
    the peak (conventions.md), on a 0.01-degree sampling of the closed form. The antenna is
    omnidirectional in azimuth, so the cut's other half-plane crosses the same (toroidal) main beam
    again: only the half-plane theta 0..180 is searched."""
    a = np.linspace(0, 180, 18001)
    u = np.array([power_at(name, x, phi_deg) for x in a])
    i = int(np.argmax(u))
    lo, hi = i, i
    while lo > 0 and u[lo - 1] <= u[lo]:
        lo -= 1
    while hi < len(u) - 1 and u[hi + 1] <= u[hi]:
        hi += 1
    inner = [k for k in range(1, len(u) - 1) if (k < lo or k > hi) and u[k] >= u[k - 1] and u[k] >= u[k + 1]]
    return max(u[k] for k in inner) / u[i] if inner else None


def check_beam_extras():
    """Side lobes (Kraus: the 1.25-wavelength dipole's minor lobes near 31 deg, about -10.3 dB)
    and the axial-ratio beamwidth of crossed dipoles: AR = 1/|cos t| (conventions.md), so
    AR <= 3 dB within t0 = acos(10^(-3/20)) = 44.93 deg of the axis, a 89.86-degree beam, and over
    the solid-angle share 1 - cos t0 of the sphere (both lobes)."""
    print("== beam extras: side-lobe level, axial-ratio beamwidth and solid angle")
    res = run_json("info", FILES["long_z"])["results"][0]
    sll = sidelobe_closed_form("long_z", 0)
    # the lobe top lies between 2-degree samples: refinement or not, within 0.05 dB (common practice)
    check("info long_z side-lobe level dB (closed form)", res["sidelobe_elevation_db"], cr.db(sll), 0.05)
    t0 = math.degrees(math.acos(10 ** (-3 / 20)))
    for name in ("rhcp_z", "rhcp_tilt", "lhcp_z"):
        res = run_json("info", FILES[name])["results"][0]
        check(f"info {name} AR beamwidth, elevation plane (deg)", res["ar_beamwidth_deg"], 2 * t0, TOL_HPBW_DEG)
        check(f"info {name} AR beamwidth, azimuth plane (deg)", res["ar_beamwidth_azimuth_deg"], 2 * t0, TOL_HPBW_DEG)
        ant = ANT[name][0]
        et, ep = ant.field_tp(TT, PP)
        ar = np.vectorize(cr.axial_ratio)(et, ep)
        state = ar <= 10 ** (3 / 20)
        check(f"info {name} AR <= 3 dB solid-angle share (tolerance: the cells on the contour)",
              res["ar_solid_angle_share"], 1 - math.cos(math.radians(t0)),
              boundary_share(state, cr.cell_solid_angles(T, len(P))))



def has_option(command, option):
    return option in run(command, "--help").stdout


def turned(name, up=None, turns=()):
    """The antenna as installed: the smallest rotation taking `up` to +z, then each turn about a
    world axis in the order given (conventions.md, the mounting frame)."""
    rot = np.eye(3)
    if up is not None:
        a = up if not isinstance(up, str) else {"+x": (1, 0, 0), "-x": (-1, 0, 0), "+y": (0, 1, 0), "-y": (0, -1, 0),
                                                "+z": (0, 0, 1), "-z": (0, 0, -1)}[up]
        rot = cr.rotation_up(a)
    for axis, deg in turns:
        rot = cr.rotation_about(axis, deg) @ rot
    return cr.Rotated(ANT[name][0], rot)


MOUNTINGS = [("+x", []), ("-z", []), ("-y", [("z", 30)]), ("+z", [("y", 90)]), ("+z", [("z", 40)]),
             ((60.0, 120.0), [("x", 20), ("z", -45)])]


def up_text(up):
    return up if isinstance(up, str) else f"{up[0]},{up[1]}"


def up_vector(up):
    if isinstance(up, str):
        return up
    r, _, _ = cr.unit_vectors(up[0], up[1])
    return tuple(r)


def check_mounting():
    """--up and --rotate: probe values of the installed antenna against E'(r) = R E(R^T r) of the
    closed form, and the conventions' own check (a dipole along x read with up +x is a vertical
    dipole: same vertical gain and MEG as a z dipole)."""
    print("== mounting: --up and --rotate against E'(r) = R E(R^T r)")
    if not has_option("probe", "--up"):
        print("info mounting options not on main yet: nothing to check")
        return
    for up, turns in MOUNTINGS:
        opts = ["--up", up_text(up)] + (["--rotate", ",".join(f"{a}:{d}" for a, d in turns)] if turns else [])
        for name in ("rhcp_tilt", "half_x", "endfire"):
            ant = turned(name, up_vector(up), turns)
            peak = power_at_grid_max(name)
            for t, p in ((0, 0), (30, 40), (90, 0), (124, 306), (57.3, 123.7)):
                r = run_json("probe", FILES[name], "--theta", str(t), "--phi", str(p), *opts)
                et, ep = (complex(v) for v in ant.field_tp(np.array(t, float), np.array(p, float)))
                vals = reference_probe(et, ep, p, "x")
                for k in ("total", "vertical", "horizontal", "rhcp", "lhcp"):
                    if vals[k] > peak * 10 ** -1.5:
                        check(f"mounting {name} up {up_text(up)} turns {turns} ({t}, {p}) {k} dB", r[f"{k}_db"],
                              cr.db(vals[k]), TOL_INTERP_DB)
    label, opts, env = ENVS[3][0], ENVS[3][1], cr.Environment(1.0, (0, 30), (0, 30))
    a = run_json("diversity", FILES["half_x"], "--up", "+x", *opts)["patterns"][0]
    b = run_json("diversity", FILES["half_z"], *opts)["patterns"][0]
    want = cr.meg(turned("half_x", "+x"), env)[0]
    check("mounting half_x read with up +x: MEG (indoor) of the turned closed form", a["meg_db"], cr.db(want), TOL_MEG_DB)
    check("mounting half_x read with up +x: MEG equals a z dipole's (efficiency aside)", a["meg_db"] - b["meg_db"],
          -cr.db(ANT["half_z"][1]), TOL_MEG_DB)


def check_phase_centre():
    """The phase centre of a displaced short dipole is its displacement (conventions.md: fields
    times exp(+j k r.d)); --phase-centre auto on both files of a pair gives one common reference,
    so the displaced dipole then correlates fully with the centred one."""
    print("== phase centre: estimate and moved reference")
    if not has_option("info", "--phase-centre"):
        print("info --phase-centre not on main yet: nothing to check")
        return
    r = run_json("info", FILES["short_z_shift"])
    pc = r["results"][0].get("phase_centre") or r.get("phase_centre")
    got = pc.get("position_wavelengths") if isinstance(pc, dict) else None
    for i, axis in enumerate("xyz"):
        # a short dipole's co-polar phase is exactly 2 pi r.d + const: the fit is exact up to
        # rounding; 1e-3 wavelength (common practice for a fit on a 2-degree grid)
        check(f"phase centre of the displaced dipole, {axis} (wavelengths)", got[i] if got else None, D_SHIFT[i], 1e-3)
    lam = 299792458.0 / F0
    spec = ",".join(repr(v * lam) for v in D_SHIFT)
    # auto moves each file's reference to its own estimate: the copy then is the dipole itself
    d = run_json("diversity", FILES["short_z"], FILES["short_z_shift"], "--phase-centre", "auto")
    check("ECC of a dipole and its displaced copy with --phase-centre auto", d["ecc"], 1.0, 1e-6)
    d = run_json("diversity", FILES["short_z"], FILES["short_z_shift"])
    want = cr.ecc(ANT["short_z"][0], ANT["short_z_shift"][0], cr.Environment(0.0))[0]
    check("ECC of a dipole and its displaced copy as given (spatial diversity)", d["ecc"], want, TOL_ECC)
    # one explicit reference for both files multiplies both fields by the same exp(-j k r.c): the
    # phase factor cancels in the correlation integrand E_A . E_B*, so the ECC is the one as given
    d = run_json("diversity", FILES["short_z"], FILES["short_z_shift"], "--phase-centre", spec)
    check("ECC with one explicit reference for both files equals the ECC as given", d["ecc"], want, TOL_ECC)



def check_coverage_band_pair():
    """An elevation band (its solid angle 2 pi (sin e2 - sin e1)) and the best of two patterns in
    every direction: shares against the closed form over the band, tolerance the contour cells."""
    out = f"{WORK}/coverage_pair.json"
    run("coverage", FILES["half_x"], FILES["rhcp_tilt"], "--levels", "0,-3,-6", "--elevation", "-30,30", "--out", out)
    with open(out, encoding="utf-8") as f:
        r = json.load(f)
    check("coverage band solid angle, elevation -30..30 (sr)", r["band"]["solid_angle_sr"], 2 * math.pi, 1e-9)
    tt, pp, ww = cr.sphere_quadrature(600, 720)
    inband = abs(90 - tt) <= 30
    ga = [component_power(n, "total", tt, pp) for n in ("half_x", "rhcp_tilt")]
    gc = [component_power(n, "total", TT, PP) for n in ("half_x", "rhcp_tilt")]
    weights = cr.cell_solid_angles(T, len(P)) * (abs(90 - TT) <= 30)
    for ser in r["series"]:
        pick = {"A": [0], "B": [1]}.get(ser["pattern"], [0, 1])
        fine = np.max([ga[i] for i in pick], axis=0)
        coarse = np.max([gc[i] for i in pick], axis=0)
        for lv in ser["at_levels"]:
            x = 10 ** (lv["level_db"] / 10)
            exact = float((ww * (fine >= x) * inband).sum() / (ww * inband).sum())
            tol = boundary_share(coarse >= x, weights) * 4 * math.pi / (2 * math.pi) + 0.01
            check(f"coverage band -30..30 {ser['label']} >= {lv['level_db']} dB (closed form; contour and band-edge cells)",
                  lv["share"], exact, tol)



def orientation_set(tilt_step, tilt_max, roll_step):
    """The sweep's orientations R = R_x(tilt) R_z(roll) (docs/diversity.md), tilts 0 and 180 once."""
    out = []
    for tilt in np.arange(0, tilt_max + 1e-9, tilt_step):
        rolls = [0.0] if tilt in (0, 180) else np.arange(0, 360 - 1e-9, roll_step)
        out += [cr.rotation_about("x", tilt) @ cr.rotation_about("z", roll) for roll in rolls]
    return out


def random_orientation_level(name, env, p, n_tilt=16, n_roll=24):
    """The p-quantile of the received power over Rayleigh fading and a uniformly random
    orientation: solve sum_i w_i (1 - exp(-x / MEG_i)) = p over orientations drawn on a product
    rule for the Haar measure (Gauss-Legendre in cos(tilt), uniform roll and azimuth; the
    environments are uniform in azimuth, so the azimuth need not be sampled)."""
    u, w = np.polynomial.legendre.leggauss(n_tilt)
    megs, weights = [], []
    for ui, wi in zip(u, w):
        for roll in np.arange(n_roll) * 360.0 / n_roll:
            rot = cr.rotation_about("x", math.degrees(math.acos(ui))) @ cr.rotation_about("z", roll)
            megs.append(cr.meg(cr.Rotated(ANT[name][0], rot), env, 120, 180)[0])
            weights.append(wi / 2 / n_roll)
    megs, weights = np.array(megs), np.array(weights)
    f = lambda lx: float((weights * -np.expm1(-math.exp(lx) / megs)).sum()) - p
    return math.exp(optimize.brentq(f, math.log(megs.max()) - 40, math.log(megs.max()) + 5, xtol=1e-12))


def check_rank():
    """ellipsa rank: MEG and advantages over a lossless vertical half-wave dipole (Balanis sec. 4.5)
    in each environment, the Rayleigh level at the outage (MEG (-ln(1 - p)), conventions.md), the
    worst orientation of the sweep, the level with a random orientation, the score and the order."""
    print("== rank: candidates against the reference dipole")
    if " rank " not in run("--help").stdout.replace("\n", " "):
        print("info rank not on main yet: nothing to check")
        return
    names = ["rhcp_tilt", "half_x", "loop_z"]
    envs = {"uniform": cr.Environment(0.0), "indoor": cr.Environment(1.0, (0, 30), (0, 30)),
            "urban": cr.Environment(6.0, (10, 15), (10, 15))}
    r = run_json("rank", *(FILES[n] for n in names), "--environment", ",".join(envs))
    ref = cr.Antenna().dipole([0, 0, 1], 0.5).normalise()
    ref_meg = {k: cr.meg(ref, e)[0] for k, e in envs.items()}
    for k in envs:
        check(f"rank reference dipole MEG {k}", r["reference"]["environments"][k]["meg_db"], cr.db(ref_meg[k]), TOL_MEG_DB)
    p = r["outage"]
    scores = []
    for row in r["rows"]:
        name = os.path.splitext(os.path.basename(row["file"]))[0]
        parts = []
        for k, env in envs.items():
            f = row["environments"][k]
            m = meg_of(k if k != "urban" else "urban", name, env)[0]
            tag = f"rank {name} {k}"
            check(f"{tag} MEG", f["meg_db"], cr.db(m), TOL_MEG_DB)
            check(f"{tag} advantage over the dipole", f["advantage_db"], cr.db(m / ref_meg[k]), 2 * TOL_MEG_DB)
            check(f"{tag} Rayleigh level at {p}", f["fading_levels_db"][format(p, "g")], cr.db(m * -math.log1p(-p)), TOL_MEG_DB)
            if k == "indoor":  # one environment for the orientation figures keeps the run short
                worst = min(cr.meg(cr.Rotated(ANT[name][0], rot), env, 120, 180)[0] for rot in orientation_set(15, 180, 15))
                check(f"{tag} worst orientation of the 15-degree sweep", f["orientation_worst_db"], cr.db(worst), 0.02)
            if (name, k) in (("rhcp_tilt", "indoor"), ("half_x", "urban")):
                want = random_orientation_level(name, env, p)
                # the sweep's 15-degree steps against a fine product rule: 0.1 dB (common practice)
                check(f"{tag} level at {p} with a random orientation", f["fading_levels_random_db"][format(p, "g")], cr.db(want), 0.1)
            parts.append(f["score_part_db"])
        check(f"rank {name} score = mean of the environments' parts", row["score_db"], float(np.mean(parts)), 1e-9)
        scores.append(row["score_db"])
    check_equal("rank rows sorted by score, best first", scores, sorted(scores, reverse=True))



# ---------------------------------------------------------------- honest thresholds
def header_constant(rel, name):
    """A threshold as the core defines it (conventions.md: defined once, in the headers of pattern/);
    the audit checks that every output applies that one value on both sides of it."""
    import re
    with open(os.path.join(SRC, rel), encoding="utf-8") as f:
        m = re.search(r"constexpr double " + name + r" = ([0-9.eE+-]+);", f.read())
    return float(m.group(1))


def field_of_ar(ar_db, tilt_deg):
    """E_theta, E_phi of a right-hand ellipse of axial ratio ar_db and tilt tilt_deg, from
    E_R = r, E_L = l exp(-j 2 tau) (tau = arg(E_R conj(E_L)) / 2, AR = (r + l) / (r - l))."""
    ar = 10 ** (ar_db / 20)
    r, l = 1.0, (ar - 1) / (ar + 1)
    el = l * complex(math.cos(2 * math.radians(tilt_deg)), -math.sin(2 * math.radians(tilt_deg)))
    s = math.sqrt(2)
    return (r + el) / s, (r - el) / (1j * s)


def check_honest():
    """The thresholds that decide a state (conventions.md, honest figures): a field just inside and
    just outside the linear bound and the circular (tilt) bound, read by probe (JSON and text) and
    info (JSON, at the peak); the same state everywhere, and the axial ratio and tilt, where
    reported, equal the closed form (Balanis sec. 2.12)."""
    print("== honest thresholds: one value, every output")
    lin = header_constant("pattern/polarisation.hpp", "linear_axial_ratio_db")
    circ = header_constant("pattern/polarisation.hpp", "circular_axial_ratio_db")
    bound = header_constant("pattern/cut.hpp", "null_ratio_bound_db")
    cases = [(lin - 0.1, 25.0), (lin + 0.1, 25.0), (circ - 0.02, 30.0), (circ + 0.02, 30.0), (3.0, -70.0)]
    fbs = [bound - 0.1, bound + 0.1, bound - 0.1, bound + 0.1, math.inf]
    freqs = [1e9 * (k + 1) for k in range(len(cases))]
    fields = []
    for (ar_db, tilt), fb in zip(cases, fbs):
        et, ep = field_of_ar(ar_db, tilt)
        # one polarisation on the whole grid, its amplitude (1 + cos(theta)) / 2 + e peaking at
        # the pole: front-to-back 20 log10((1 + e) / e), an exact null behind for e = 0
        e = 0.0 if fb == math.inf else 1 / (10 ** (fb / 20) - 1)
        scale = (1 + np.cos(np.radians(TT))) / 2 + e
        fields.append((et * scale, ep * scale))
    path = f"{WORK}/honest.csv"
    cr.write_csv(path, freqs, fields, T, P, name="honest")
    info = run_json("info", path)["results"]
    for k, (ar_db, tilt) in enumerate(cases):
        tag = f"honest AR {ar_db:.2f} dB, tilt {tilt} deg"
        pr = run_json("probe", path, "--theta", "0", "--phi", "0", "--frequency", repr(freqs[k]))
        text = run("probe", path, "--theta", "0", "--phi", "0", "--frequency", repr(freqs[k])).stdout
        linear = ar_db >= lin
        want_ar = None if linear else ar_db
        for label, got in (("probe", pr["axial_ratio_db"]), ("info at the peak", info[k]["axial_ratio_db"])):
            check(f"{tag}: {label} axial ratio (null when linear)", got, want_ar, 1e-6)
        for label, got in (("probe", pr["sense"]), ("info at the peak", info[k]["sense"])):
            check_equal(f"{tag}: {label} sense", got, "linear" if linear else "right")
        check_equal(f"{tag}: probe text says the same sense", "right-hand" in text, not linear)
        want_tilt = None if ar_db < circ else tilt
        got_tilt = pr["tilt_deg"]
        if got_tilt is not None and want_tilt is not None:
            got_tilt = (got_tilt - want_tilt + 90) % 180 - 90 + want_tilt
        check(f"{tag}: probe tilt (null below the circular bound)", got_tilt, want_tilt, 1e-6)
        fb = fbs[k]
        check(f"honest front-to-back {fb} dB: the number, only within the floor", info[k]["front_to_back_db"],
              fb if fb <= bound else None, 1e-6)
        check(f"honest front-to-back {fb} dB: 'above' the documented floor beyond it", info[k]["front_to_back_above_db"],
              bound if fb > bound else None, 0)


# ---------------------------------------------------------------- gain transfer (IEEE Std 149)
def relative_file(names, losses_db, tag):
    """Range data in relative levels: each antenna's gain field times a chain loss per frequency."""
    path = f"{WORK}/rel_{tag}.csv"
    fields = []
    for n, loss in zip(names, losses_db):
        et, ep = clean(*ANT[n][0].field_tp(TT, PP))
        k = 10 ** (-loss / 20)
        fields.append((et * k, ep * k))
    cr.write_csv(path, BAND_FREQS[:len(names)], fields, T, P, quantity="relative", name=tag)
    return path


def check_gain_transfer():
    """IEEE Std 149-1979 sec. 12: G_AUT = G_ref + P_AUT - P_ref per frequency. Antenna under test
    and reference measured through the same (per-frequency) chain loss; the reference's known gain
    is its closed-form peak gain (Balanis sec. 4.5, efficiency 0.83). The written gain file must be
    the AUT's gain pattern at every sample, whatever the chain loss."""
    print("== gain transfer: relative levels to dBi by comparison (IEEE Std 149 sec. 12)")
    if " gain-transfer " not in run("--help").stdout.replace("\n", " "):
        print("info gain-transfer not on main yet: nothing to check")
        return
    aut_names, losses = ["rhcp_tilt", "endfire", "loop_z"], [37.25, 41.5, 44.0]
    aut = relative_file(aut_names, losses, "aut")
    ref = relative_file(["half_z"] * 3, losses, "ref")
    g_ref = cr.db(power_at_grid_max("half_z"))  # on the grid: theta = 90 is a sample
    gains = ",".join(f"{f / 1e9!r}GHz={g_ref!r}" for f in BAND_FREQS)
    for label, opts in (("--reference FILE", ["--reference", ref]),):
        out = f"{WORK}/gt_file.csv"
        run("gain-transfer", aut, *opts, "--reference-gain", gains, "--out", out)
        compare_gain_file(label, out, aut_names)
    # one measured level for every frequency: P_ref given, so one chain loss for all
    aut1 = relative_file(["rhcp_tilt"], [30.0], "aut1")
    out = f"{WORK}/gt_level.csv"
    run("gain-transfer", aut1, "--reference-level", repr(g_ref - 30.0), "--reference-gain", repr(g_ref), "--out", out)
    compare_gain_file("--reference-level", out, ["rhcp_tilt"])
    res = run("gain-transfer", aut1, "--reference-level", "0", "--reference-gain", "2", "--out", out, ok=False)
    check_equal("gain transfer refuses to replace its output without --force", res.returncode != 0 and "exists" in res.stderr, True)
    res = run("gain-transfer", FILES["half_z"], "--reference-level", "0", "--reference-gain", "2", "--out", f"{WORK}/gt_x.csv", ok=False)
    check_equal("gain transfer refuses data already in gain", res.returncode != 0 and "relative" in res.stderr, True)


def compare_gain_file(label, out, names):
    d = cr.read_csv_simple(out)
    for k, name in enumerate(names):
        sel = np.isclose(d["frequency"], BAND_FREQS[k])
        et = d["e_theta_re"][sel] + 1j * d["e_theta_im"][sel]
        ep = d["e_phi_re"][sel] + 1j * d["e_phi_im"][sel]
        want_t, want_p = clean(*ANT[name][0].field_tp(d["theta"][sel], d["phi"][sel]))
        got_u, want_u = abs(et) ** 2 + abs(ep) ** 2, abs(want_t) ** 2 + abs(want_p) ** 2
        top = want_u.max()
        keep = want_u > top * 1e-4
        err = float(np.max(np.abs(10 * np.log10(got_u[keep] / want_u[keep]))))
        # the reference level is its refined peak, which for a peak on a sample is the sample:
        # only the CSV's printed digits remain
        check(f"gain transfer {label} {name}: largest error of |E|^2 over the sphere (dB)", err, 0.0, 1e-6)
        phase = float(np.max(np.abs(np.angle(et[keep] * np.conj(want_t[keep]) + ep[keep] * np.conj(want_p[keep])))))
        check(f"gain transfer {label} {name}: phases unchanged (rad)", phase, 0.0, 1e-6)


# ---------------------------------------------------------------- per-file keys
def check_per_file():
    """FILE::up=, ::rotate= and ::phase-centre= apply to that file only and give what the global
    options give (docs/far-field-csv.md); a moved phase reference c multiplies by exp(-j k r.c)
    (conventions.md, phase centre), so the displaced dipole read with ::phase-centre=d has its
    phase centre at the origin, and the centred one read with c has it at -c."""
    print("== per-file keys and the sign of a moved phase reference")
    a = run_json("diversity", FILES["half_x"] + "::up=+x", FILES["half_y"] + "::rotate=z:90,x:90", "--environment", "indoor")
    env = cr.Environment(1.0, (0, 30), (0, 30))
    want_a = cr.meg(turned("half_x", "+x"), env)[0]
    want_b = cr.meg(turned("half_y", None, [("z", 90), ("x", 90)]), env)[0]
    check("per-file ::up=+x MEG (indoor) of the turned closed form", a["patterns"][0]["meg_db"], cr.db(want_a), TOL_MEG_DB)
    check("per-file ::rotate=z:90,x:90 MEG (indoor) of the turned closed form", a["patterns"][1]["meg_db"], cr.db(want_b), TOL_MEG_DB)
    rho = cr.ecc(turned("half_x", "+x"), turned("half_y", None, [("z", 90), ("x", 90)]), env)[0]
    check("per-file keys: ECC of the two installed antennas", a["ecc"], rho, TOL_ECC)
    b = run_json("diversity", FILES["half_x"], FILES["half_y"], "--up", "+x", "--environment", "indoor")
    c = run_json("diversity", FILES["half_x"] + "::up=+x", FILES["half_y"] + "::up=+x", "--environment", "indoor")
    check("per-file ::up on both files equals --up (ECC)", c["ecc"], b["ecc"], 1e-12)
    # one antenna against itself turned, the same file named twice: only the turned mention turns
    # (each mention carries its own options)
    d = run_json("diversity", FILES["half_y"], FILES["half_y"] + "::rotate=x:45", "--environment", "indoor")
    rho = cr.ecc(ANT["half_y"][0], turned("half_y", None, [("x", 45)]), env)[0]
    check("per-file ::rotate=x:45 on a second mention: ECC of a y dipole and the same turned 45 deg about x", d["ecc"], rho, TOL_ECC)
    check("... the unturned one keeps its own MEG", d["patterns"][0]["meg_db"], cr.db(cr.meg(ANT["half_y"][0], env)[0]), TOL_MEG_DB)
    # the file's own mounting metadata (docs/far-field-csv.md) turns it the same way, and a
    # per-file key replaces it
    meta = f"{WORK}/half_x_mounted.csv"
    with open(FILES["half_x"], encoding="utf-8") as f, open(meta, "w", encoding="utf-8") as g:
        g.write("# mounting-up: 60,120\n# mounting-turns: x:20,z:-45\n" + f.read())
    want = cr.meg(turned("half_x", up_vector((60.0, 120.0)), [("x", 20), ("z", -45)]), env)[0]
    d = run_json("diversity", meta, "--environment", "indoor")["patterns"][0]
    check("file metadata mounting-up 60,120 and mounting-turns x:20,z:-45: MEG of the turned closed form", d["meg_db"], cr.db(want), TOL_MEG_DB)
    d = run_json("diversity", meta + "::up=+x", "--environment", "indoor")["patterns"][0]
    check("a per-file ::up=+x replaces the file's mounting: MEG", d["meg_db"], cr.db(want_a), TOL_MEG_DB)
    lam = 299792458.0 / F0
    spec = ",".join(repr(v * lam) for v in D_SHIFT)
    for label, path, want in (("displaced dipole with ::phase-centre=d", FILES["short_z_shift"] + "::phase-centre=" + spec, (0, 0, 0)),
                              ("centred dipole with ::phase-centre=d", FILES["short_z"] + "::phase-centre=" + spec,
                               tuple(-v for v in D_SHIFT))):
        pc = run_json("info", path)["results"][0]["phase_centre"]["position_wavelengths"]
        for i, axis in enumerate("xyz"):
            check(f"phase centre of the {label}, {axis} (wavelengths)", pc[i], want[i], 1e-3)


# ---------------------------------------------------------------- the simulation's intervals
def check_simulation_ci():
    """The random-field simulation's 95 % intervals are honest: over 40 seeds, the exact values
    (MEG and ECC from the reference's quadrature, the exact selection and MRC levels) fall inside
    them about 38 times. Binomial(40, 0.95): 34 or more with probability 0.99 (common practice for
    a coverage check); the seeds are fixed, so the check is repeatable."""
    print("== fading simulation: coverage of its 95 % intervals over 40 seeds")
    label, opts, env = ENVS[-1]
    a, b = "rhcp_tilt", "half_x"
    g1, g2 = meg_of(label, a, env)[0], meg_of(label, b, env)[0]
    rho = cr.ecc(ANT[a][0], ANT[b][0], env)[0]
    want = {"mean A": cr.db(g1), "mean B": cr.db(g2), "ECC": rho,
            "selection 0.1": cr.db(cr.level(lambda x: cr.cdf_selection(x, g1, g2, rho), 0.1, max(g1, g2))),
            "MRC 0.1": cr.db(cr.level(lambda x: cr.cdf_mrc(x, g1, g2, rho), 0.1, max(g1, g2)))}
    inside = {k: 0 for k in want}
    widths = []
    seeds = range(1, 41)
    for seed in seeds:
        r = run_json("fading", FILES[a], FILES[b], *opts, "--samples", "2000", "--seed", str(seed), "--outage", "0.1")
        got = {"mean A": r["patterns"][0]["mean_ci95_db"], "mean B": r["patterns"][1]["mean_ci95_db"],
               "ECC": r["pair"]["power_correlation_ci95"], "selection 0.1": r["pair"]["selection_levels_ci95_db"]["0.1"],
               "MRC 0.1": r["pair"]["mrc_levels_ci95_db"]["0.1"]}
        for k, (lo, hi) in got.items():
            inside[k] += lo <= want[k] <= hi
        widths.append(got["mean A"][1] - got["mean A"][0])
    # and not wider than they need be: the mean of N exponential powers has a relative standard
    # error of 1/sqrt(N), so the interval spans about 2 * 1.96 / sqrt(N) in linear terms
    half = 1.96 / math.sqrt(2000)
    check("simulation 95 % interval of the mean: median width against 1.96/sqrt(N) either side (dB)",
          float(np.median(widths)), cr.db((1 + half) / (1 - half)), 0.25 * cr.db((1 + half) / (1 - half)))
    for k, n in inside.items():
        ok = 34 <= n
        PASSED[0] += ok
        if not ok:
            FAIL.append(f"simulation interval coverage {k}")
        print(f"{'ok  ' if ok else 'FAIL'} simulation 95 % interval of {k} holds the exact value in {n} of {len(seeds)} seeds (at least 34)")

if __name__ == "__main__":
    ONLY = sys.argv[4:]  # optional: run only these groups (while iterating)
    for group in ("info", "probe", "cut", "diversity", "fading", "band", "coverage", "examples", "orientations", "profile", "families", "beam_extras", "mounting", "phase_centre", "rank", "honest", "gain_transfer", "per_file", "simulation_ci"):
        if not ONLY or group in ONLY:
            start = time.monotonic()
            globals()["check_" + group]()
            print(f"   ({group}: {time.monotonic() - start:.1f} s)")
    print(f"{PASSED[0]} passed, {len(FAIL)} failed")
    for f in FAIL:
        print("FAILED:", f)
    sys.exit(1 if FAIL else 0)
