#!/usr/bin/env python3
"""Writes the tricky-but-valid CSV corpus used by tests/unit/test_csv_corpus.cpp.

Every file holds a short dipole along z (Balanis sec. 4.2): E_theta = sqrt(1.5) sin(theta),
E_phi = 0, so |E|^2 is the directivity 1.5 sin^2(theta), unless the file says otherwise.
Run from this folder; the files are committed, this script documents how they were made.
"""
import math

A = math.sqrt(1.5)


def et(t_deg):
    return A * math.sin(math.radians(t_deg))


def db(p):
    return "-inf" if p <= 0 else repr(10 * math.log10(p))


def write(name, text):
    with open(name, "w", newline="") as f:
        f.write(text)


# 1. Seam duplicate phi = 0 and 360, 30-degree grid.
rows = ["# name: seam 0-360", "theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im"]
for t in range(0, 181, 30):
    for p in range(0, 361, 30):
        rows.append(f"{t},{p},{et(t)!r},0,0,0")
write("seam_0_360.csv", "\n".join(rows) + "\n")

# 2. phi in [-180, 180] with both ends, rows in descending order, polar family.
rows = ["theta,phi,e_theta_db,e_theta_phase,e_phi_db,e_phi_phase"]
for t in range(180, -1, -45):
    for p in range(180, -181, -45):
        rows.append(f"{t},{p},{db(et(t) ** 2)},{p},-inf,0")
write("phi_pm180_descending.csv", "\n".join(rows) + "\n")

# 3. One sample at each pole, full rings elsewhere; a field along x: E = x-hat, so
#    E_theta = cos t cos p, E_phi = -sin p (conventions.md unit vectors).
rows = ["theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im"]
for t in range(0, 181, 30):
    for p in range(0, 360, 30):
        if t in (0, 180) and p != 0:
            continue
        tr, pr = math.radians(t), math.radians(p)
        rows.append(f"{t},{p},{math.cos(tr) * math.cos(pr)!r},0,{-math.sin(pr)!r},0")
write("single_pole_samples.csv", "\n".join(rows) + "\n")

# 4. Upper hemisphere only, theta 0..90 step 15, magnitudes only.
rows = ["# quantity: directivity", "theta,phi,e_theta_db,e_phi_db"]
for t in range(0, 91, 15):
    for p in range(0, 360, 45):
        rows.append(f"{t},{p},{db(et(t) ** 2)},-inf")
write("upper_hemisphere.csv", "\n".join(rows) + "\n")

# 5. Semicolons, decimal commas, CRLF, a BOM, quoted header names, trailing delimiters.
rows = ["\ufeff# frequency: 2,45 GHz", '"Theta";"Phi";"E_Total_dB";']
for t in range(0, 181, 45):
    for p in range(0, 360, 90):
        rows.append(f"{t};{p};{db(et(t) ** 2).replace('.', ',')};")
write("decimal_comma_crlf.csv", "\r\n".join(rows) + "\r\n")

# 6. Azimuth/elevation, azimuth -180..180 with the seam, elevation -90..90.
rows = ["azimuth,elevation,e_theta_re,e_theta_im,e_phi_re,e_phi_im"]
for el in range(-90, 91, 30):
    for az in range(-180, 181, 60):
        rows.append(f"{az},{el},{et(90 - el)!r},0,0,0")
write("azimuth_elevation.csv", "\n".join(rows) + "\n")

# 7. exp(-iwt) circular family: a right-hand circular field toward every direction of the
#    upper hemisphere, written as the -iwt tool would (E_R with phase -30 deg in +jwt becomes
#    +30 deg in -iwt), in radians.
rows = ["# time-convention: -iwt", "# angle-unit: rad", "theta,phi,e_rhcp_db,e_rhcp_phase,e_lhcp_db,e_lhcp_phase"]
for t in range(0, 91, 30):
    for p in range(0, 360, 90):
        rows.append(f"{math.radians(t)!r},{math.radians(p)!r},0,{math.radians(30)!r},-inf,0")
write("minus_iwt_circular_rad.csv", "\n".join(rows) + "\n")

# 8. A phi cut (one phi, theta 0..180), Ludwig-3 y reference, tabs.
rows = ["# ludwig3-reference: y", "\t".join(["theta", "phi", "e_co_db", "e_co_phase", "e_cross_db", "e_cross_phase"])]
for t in range(0, 181, 10):
    # at phi = 90, y reference: co = Et sin p + Ep cos p = Et
    rows.append("\t".join([str(t), "90", db(et(t) ** 2), "0", "-inf", "0"]))
write("phi_cut_ludwig3_tabs.csv", "\n".join(rows) + "\n")

# 9. The worked example of docs/far-field-csv.md: an invented range export ("range 3") with
#    its own column names, semicolons and decimal commas, az/el, a sample index and a remark
#    column, levels in dB relative to a 7.5 dBi reference horn. The pattern is a lossless
#    cardioid toward +z, G = 3 ((1 + cos t)/2)^2, whose directivity is 3 (4.77 dBi):
#    the integral of ((1 + cos t)/2)^2 over the sphere is 4 pi / 3.
rows = ["Sample;Az/deg;El/deg;Level re horn/dB;Remark"]
n = 0
for el in range(-90, 91, 10):
    for az in range(0, 360, 10):
        n += 1
        t = math.radians(90 - el)
        g = 3 * ((1 + math.cos(t)) / 2) ** 2
        level = "-inf" if g <= 0 else f"{10 * math.log10(g) - 7.5:.4f}".replace(".", ",")
        rows.append(f"{n};{az};{el};{level};{'check cable' if n == 5 else ''}")
write("foreign/range3.csv", "\n".join(rows) + "\n")

# 10. The same range-3 export with the free-text preamble a lab writes before the header row
#     (issue 14): found by the mapped column names; the figures are those of range3.csv.
preamble = [
    "Antenna range 3 - far-field export",
    "Operator;A. N. Other",
    "AUT;cardioid demo antenna (invented)",
    "Frequency;5,8;GHz",
    "Reference;standard gain horn, 7,5 dBi",
    "",
    "Scan settings: az 0..350 step 10, el -90..90 step 10",
]
with open("foreign/range3.csv") as f:
    write("foreign/range3_preamble.csv", "\n".join(preamble) + "\n" + f.read())
