#!/usr/bin/python3
"""The pandas + matplotlib counterpart of two `ellipsa cut` runs for the benchmark (run.sh): the
elevation cut at phi = 0 of one frequency, RHCP and LHCP gain in dB on a polar plot (dB scale, 40 dB
range), written as SVG and as PNG at 1200x900 pixels, 150 dpi. Circular parts by
E_R = (E_theta + j E_phi)/sqrt2, E_L = (E_theta - j E_phi)/sqrt2 (docs/conventions.md; the file
must use the +jwt convention, as the bundled examples do).
Usage: matplotlib_cut.py FILE FREQUENCY_IN_FILE_UNITS OUT_STEM   (writes OUT_STEM.svg, OUT_STEM.png)
"""
import sys

import matplotlib

matplotlib.use("Agg")
import matplotlib.pyplot as plt
import numpy as np
import pandas as pd


def main(path, freq, stem):
    df = pd.read_csv(path, comment="#", skipinitialspace=True)
    df = df[np.isclose(df["frequency"], freq)]
    et = df["e_theta_re"].to_numpy() + 1j * df["e_theta_im"].to_numpy()
    ep = df["e_phi_re"].to_numpy() + 1j * df["e_phi_im"].to_numpy()
    theta, phi = df["theta"].to_numpy(), df["phi"].to_numpy()
    # theta from -180 to 180 through the phi = 0 half-plane (positive) and phi = 180 (negative).
    front, back = np.isclose(phi, 0), np.isclose(phi, 180)
    ang = np.concatenate([-theta[back][::-1], theta[front]])
    fig = plt.figure(figsize=(8, 6), dpi=150)
    ax = fig.add_subplot(projection="polar")
    ax.set_theta_zero_location("N")
    ax.set_theta_direction(-1)
    for name, e in (("RHCP", (et + 1j * ep) / np.sqrt(2)), ("LHCP", (et - 1j * ep) / np.sqrt(2))):
        g = 10 * np.log10(np.maximum(np.abs(e) ** 2, 1e-30))
        vals = np.concatenate([g[back][::-1], g[front]])
        ax.plot(np.radians(ang), vals, label=f"{name} (dBic)")
    top = 5 * np.ceil(max(max(line.get_ydata()) for line in ax.get_lines()) / 5)
    ax.set_ylim(top - 40, top)
    ax.set_title(f"{df.attrs.get('name', path)}: cut at phi = 0 deg, {freq:g}")
    ax.legend(loc="lower right")
    fig.savefig(stem + ".svg")
    fig.savefig(stem + ".png", dpi=150)


if __name__ == "__main__":
    main(sys.argv[1], float(sys.argv[2]), sys.argv[3])
