#!/usr/bin/python3
"""The demo scenario's files (examples/) are what examples/scenario.py makes, load as documented,
and agree with the published values the generator rests on.

Usage: check_examples.py ELLIPSA WORKDIR SOURCE_DIR
"""
import filecmp
import json
import math
import os
import subprocess
import sys

E, W, SRC = sys.argv[1], sys.argv[2], sys.argv[3]
X = os.path.join(SRC, "examples")
sys.dont_write_bytecode = True  # leave no __pycache__ in examples/
sys.path.insert(0, X)
import scenario  # noqa: E402  (examples/scenario.py)

fails = 0


def check(ok, label):
    global fails
    print(("ok   " if ok else "FAIL ") + label)
    fails += 0 if ok else 1


def info(*args):
    return json.loads(subprocess.run([E, "info", *args, "--json"], capture_output=True, text=True, check=True).stdout)


# Balanis sec. 8.5 (induced EMF): a thin half-wave dipole has Z_in = 73.1 + j42.5 ohm.
lam = scenario.C0 / scenario.F0
z = scenario.dipole_impedance(0.5 * lam, 1e-6 * lam, scenario.F0)
check(abs(z.real - 73.1) < 0.1 and abs(z.imag - 42.5) < 0.1, f"induced-EMF half-wave dipole: {z:.2f} ohm (Balanis 73.1 + j42.5)")

# The committed files are exactly what the generator writes (deterministic, fixed seed).
os.makedirs(W, exist_ok=True)
subprocess.run(["/usr/bin/python3", os.path.join(X, "scenario.py"), "models", W], check=True)
subprocess.run(["/usr/bin/python3", os.path.join(X, "scenario.py"), "range", os.path.join(W, "measured-loop-range.csv")],
               check=True)
for name in ("printed-dipole.csv", "turnstile.csv", "small-loop.csv", "measured-loop-range.csv"):
    check(filecmp.cmp(os.path.join(W, name), os.path.join(X, name), shallow=False),
          f"examples/{name} is what examples/make_examples.sh makes")

# Each model file: 21 frequencies on a full 5-degree sphere; the tool's efficiency (its own cell
# integration) equals the generator's radiation efficiency x (1 - |Gamma|^2) from a separate
# Gauss-Legendre quadrature (common practice: two quadratures agree to well under 0.1 %).
models = {"printed-dipole": scenario.PrintedDipole(), "turnstile": scenario.Turnstile(), "small-loop": scenario.SmallLoop()}
for name, antenna in models.items():
    j = info(os.path.join(X, name + ".csv"))
    res = j["results"]
    check(len(res) == 21 and j["grid"]["theta_step_deg"] == 5 and j["coverage"] == 1,
          f"{name}: 21 frequencies, 5-degree full sphere")
    worst = max(abs(r["radiation_efficiency"] - math.prod(antenna.port(r["frequency_hz"]))) for r in res)
    check(worst < 1e-3, f"{name}: total efficiency matches the circuit model within {worst:.1e}")

# The turnstile is exactly circular toward +z at 2.45 GHz and right-hand (docs/conventions.md:
# x - j y radiates right-hand toward +z), and its axial ratio grows away from the centre.
t = {round(r["frequency_hz"] / 1e6): r for r in info(os.path.join(X, "turnstile.csv"))["results"]}
check(t[2450]["axial_ratio_db"] < 0.01 and t[2450]["sense"] == "right", "turnstile: right-hand circular at 2.45 GHz")
check(t[2350]["axial_ratio_db"] > 3 and t[2550]["axial_ratio_db"] > 3, "turnstile: axial ratio above 3 dB at the band ends")

# The range file reads with its map: the upper hemisphere, 11 frequencies from 2.40 to 2.50 GHz.
r = info(os.path.join(X, "measured-loop-range.csv"), "--map-file", os.path.join(X, "measured-loop.map"))
check(abs(r["coverage"] - 0.5) < 1e-9 and len(r["results"]) == 11, "range file: half the sphere, 11 frequencies")
check(all(x["radiation_efficiency"] is None for x in r["results"]), "range file: no efficiency from half a sphere")

print(f"{fails} failure(s)")
sys.exit(1 if fails else 0)
