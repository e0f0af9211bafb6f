#!/usr/bin/python3
"""Rewrite a complex-family far-field CSV as an invented "range export" in a foreign layout:
upper hemisphere only, azimuth/elevation angles (elevation from the horizon), semicolon
delimiter with decimal commas, magnitude in dB and phase in degrees per component, and column
names of its own. The layout is made up for the demo; examples/measured-loop.map maps it onto
ellipsa's schema."""
import argparse
import math

import numpy as np

from perturb import fields, read


def main():
    p = argparse.ArgumentParser(description=__doc__)
    p.add_argument("input")
    p.add_argument("output")
    a = p.parse_args()
    meta, d = read(a.input)
    et, ep = fields(d)
    theta, phi = d["theta"], d["phi"]
    keep = theta <= 90.0 + 1e-9
    rows = []
    for i in np.nonzero(keep)[0]:
        el = 90.0 - theta[i]
        az = phi[i] if phi[i] <= 180.0 else phi[i] - 360.0
        rows.append((el, az, et[i], ep[i]))
        if abs(az + 180.0) < 1e-9 or abs(az - 180.0) < 1e-9:
            rows.append((el, 180.0 if az < 0 else -180.0, et[i], ep[i]))  # the range repeats the seam
    rows.sort(key=lambda r: (r[1], -r[0]))

    def db(x):
        m = abs(x)
        return "-200" if m == 0 else ("%.3f" % (20 * math.log10(m))).replace(".", ",")

    def deg(x):
        return ("%.2f" % math.degrees(math.atan2(x.imag, x.real))).replace(".", ",")

    with open(a.output, "w", encoding="utf-8", newline="\r\n") as f:
        f.write("# Invented range export for the ellipsa demo (not a real measurement)\n")
        f.write("# quantity: gain\n# name: small loop (range, upper hemisphere)\n")
        f.write("# frequency: 2.45\n# frequency-unit: GHz\n")
        f.write("Azim [deg];Elev [deg];Vert gain [dBi];Vert phase [deg];Horiz gain [dBi];Horiz phase [deg];\n")
        for el, az, t, p_ in rows:
            f.write("%s;%s;%s;%s;%s;%s;\n" % (("%g" % az).replace(".", ","), ("%g" % el).replace(".", ","),
                                                db(t), deg(t), db(p_), deg(p_)))


if __name__ == "__main__":
    main()
