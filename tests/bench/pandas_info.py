#!/usr/bin/python3
"""The pandas + numpy counterpart of `ellipsa info` for the CSV benchmark (tests/bench/run.sh).

Reads a complex-family schema file with pandas, puts it on the theta/phi grid per frequency and
integrates |E|^2 over the sphere with the exact cell solid angles of conventions.md
(dphi * (cos(t - dt/2) - cos(t + dt/2)), clipped at the poles), then prints the peak and the
directivity 4 pi U_max / P per frequency. Usage: pandas_info.py FILE
Prints "read_s=... total_s=..." on the last line for the benchmark table.
"""
import sys
import time

t0 = time.perf_counter()
import numpy as np
import pandas as pd


def main(path):
    t_start = time.perf_counter()
    df = pd.read_csv(path, comment="#", skipinitialspace=True)
    df.columns = [c.strip().strip('"').lower() for c in df.columns]
    t_read = time.perf_counter()
    out = []
    for f, g in df.groupby("frequency", sort=True):
        theta = np.sort(g["theta"].unique())
        phi = np.sort(g["phi"].unique())
        nt, nph = len(theta), len(phi)
        it = np.searchsorted(theta, g["theta"].to_numpy())
        ip = np.searchsorted(phi, g["phi"].to_numpy())
        u = np.full((nt, nph), np.nan)
        u[it, ip] = (g["e_theta_re"].to_numpy() ** 2 + g["e_theta_im"].to_numpy() ** 2 +
                     g["e_phi_re"].to_numpy() ** 2 + g["e_phi_im"].to_numpy() ** 2)
        if np.isnan(u).any():
            raise SystemExit(f"{path}: missing grid points at {f} Hz")
        t = np.radians(theta)
        dt = t[1] - t[0]
        a = np.clip(t - dt / 2, 0, np.pi)
        b = np.clip(t + dt / 2, 0, np.pi)
        w_theta = np.cos(a) - np.cos(b)
        dphi = 2 * np.pi / nph
        p = dphi * np.sum(w_theta[:, None] * u)
        k = np.unravel_index(np.argmax(u), u.shape)
        d = 4 * np.pi * u[k] / p
        out.append((f, 10 * np.log10(u[k]), theta[k[0]], phi[k[1]], 10 * np.log10(d)))
    t_end = time.perf_counter()
    for f, peak_db, th, ph, d_db in out:
        print(f"{f / 1e9:.4f} GHz  peak {peak_db:.2f} dBi at theta {th:g}, phi {ph:g}  directivity {d_db:.2f} dBi")
    print(f"read_s={t_read - t_start:.3f} work_s={t_end - t_read:.3f} total_s={t_end - t0:.3f}")


if __name__ == "__main__":
    main(sys.argv[1])
