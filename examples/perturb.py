#!/usr/bin/python3
"""Invented perturbations for the demo scenario (see examples/README.md).

Reads far-field CSV files in ellipsa's complex family (as written by `ellipsa synth`), combines
and perturbs them, and writes the result in the same schema. Every perturbation here is made up
for the demo and documented in examples/README.md; none is a measurement.
"""
import argparse
import math
import sys

import numpy as np


def read(path):
    meta, rows, header = {}, [], None
    with open(path, encoding="utf-8") as f:
        for line in f:
            line = line.rstrip("\n")
            if not line:
                continue
            if line.startswith("#"):
                if ":" in line:
                    k, v = line[1:].split(":", 1)
                    meta[k.strip()] = v.strip()
                continue
            if header is None:
                header = line.split(",")
                continue
            rows.append([float(x) for x in line.split(",")])
    a = np.array(rows)
    col = {n: i for i, n in enumerate(header)}
    return meta, {n: a[:, i] for n, i in col.items()}


def fields(d):
    return d["e_theta_re"] + 1j * d["e_theta_im"], d["e_phi_re"] + 1j * d["e_phi_im"]


def write(path, name, source, note, f_hz, theta, phi, et, ep):
    with open(path, "w", encoding="utf-8") as f:
        f.write("# ellipsa far-field CSV, schema version 1\n")
        f.write("# quantity: gain\n# time-convention: +jwt\n# angle-unit: deg\n# frequency-unit: Hz\n")
        f.write(f"# name: {name}\n# source: {source}\n# note: {note}\n")
        f.write("frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n")
        for i in range(len(theta)):
            f.write("%r,%r,%r,%.10g,%.10g,%.10g,%.10g\n" % (f_hz[i], theta[i], phi[i], et[i].real, et[i].imag,
                                                             ep[i].real, ep[i].imag))


def main():
    p = argparse.ArgumentParser(description=__doc__)
    p.add_argument("--out", required=True)
    p.add_argument("--name", required=True)
    p.add_argument("--note", default="")
    p.add_argument("--add", nargs=2, action="append", default=[], metavar=("FILE", "WEIGHT"),
                   help="add FILE's field times a complex WEIGHT written as magnitude@phase_deg")
    p.add_argument("--ground-tilt", type=float, default=0.0,
                   help="ground-plane asymmetry: multiply the field by 1 + g sin(theta) cos(phi)")
    p.add_argument("--efficiency", type=float, default=1.0, help="scale power by this radiation efficiency")
    p.add_argument("--noise-db", type=float, default=0.0, help="random gain ripple, dB rms")
    p.add_argument("--noise-deg", type=float, default=0.0, help="random phase ripple, deg rms")
    p.add_argument("--seed", type=int, default=1)
    a = p.parse_args()

    total_et = total_ep = None
    base = None
    for path, w in a.add:
        mag, ph = (float(x) for x in w.split("@"))
        meta, d = read(path)
        et, ep = fields(d)
        c = mag * np.exp(1j * math.radians(ph))
        if total_et is None:
            base, total_et, total_ep = d, c * et, c * ep
        else:
            total_et, total_ep = total_et + c * et, total_ep + c * ep
    if base is None:
        sys.exit("perturb.py: give at least one --add FILE WEIGHT")
    t, ph = np.radians(base["theta"]), np.radians(base["phi"])
    g = 1 + a.ground_tilt * np.sin(t) * np.cos(ph)
    total_et, total_ep = total_et * g, total_ep * g
    # Renormalise to the asked efficiency with the exact cell areas of the 0..180 grid.
    theta_deg = np.unique(base["theta"])
    dt = math.radians(theta_deg[1] - theta_deg[0])
    lo = np.clip(t - dt / 2, 0, math.pi)
    hi = np.clip(t + dt / 2, 0, math.pi)
    nphi = len(np.unique(base["phi"]))
    w = (np.cos(lo) - np.cos(hi)) * (2 * math.pi / nphi)
    nf = len(np.unique(base["frequency"]))
    power = np.sum((np.abs(total_et) ** 2 + np.abs(total_ep) ** 2) * w) / nf
    s = math.sqrt(4 * math.pi * a.efficiency / power)
    total_et, total_ep = s * total_et, s * total_ep
    rng = np.random.default_rng(a.seed)
    n = len(t)
    if a.noise_db > 0 or a.noise_deg > 0:
        for arr in (total_et, total_ep):
            arr *= 10 ** (rng.normal(0, a.noise_db, n) / 20) * np.exp(1j * np.radians(rng.normal(0, a.noise_deg, n)))
    write(a.out, a.name, "invented demo data, examples/make_examples.sh", a.note, base["frequency"], base["theta"],
          base["phi"], total_et, total_ep)


if __name__ == "__main__":
    main()
