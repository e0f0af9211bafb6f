#!/usr/bin/env python3
"""Writes the angle-layout fixtures used by tests/unit/test_csv_layouts.cpp (issue 14).

One invented antenna in every file: a short electric dipole tilted 30 deg from +z toward +x and
a small loop (magnetic dipole) tilted 20 deg from +z toward +y, fed in quadrature, so the
polarisation is elliptical and changes over the sphere. Closed form (Balanis sec. 4.2 and 5.2,
far fields of the short dipole and the small loop):

    E(r) = S [ A (d - (d.r) r) + j B (m x r) ],  A = 1, B = 0.8,

where d and m are the unit dipole axes. The cross term of |E|^2 is A B r.(d x m), odd in r, so
the radiated power is (A^2 + B^2) 8 pi / 3 and S = sqrt(3 / (2 (A^2 + B^2))) makes |E|^2 the
directivity. Every file samples the same field at 5 deg; only the angle layout differs:

    reference.csv              the schema: theta 0..180, phi 0..355, complex E_theta, E_phi
    range_theta_pm180.csv      a range export: theta -180..180, phi 0..175 (each cut through the
                               pole in one sweep), dB and phase, semicolons and decimal commas
    range_az_over_el.csv       azimuth over elevation: el -90..90, az -180..175, in the grid's
                               own unit vectors (E_az, E_el), dB and phase
    range_el_over_az.csv       elevation over azimuth: az -90..90, el -180..175, the same
                               (pattern/positioner.hpp and docs/conventions.md give the formulas)

with a map file beside each range file. Run from this folder with /usr/bin/python3; the files
are committed, this script documents how they were made.
"""
import cmath
import math

A, B = 1.0, 0.8
S = math.sqrt(3 / (2 * (A * A + B * B)))
D = (math.sin(math.radians(30)), 0.0, math.cos(math.radians(30)))
M = (0.0, math.sin(math.radians(20)), math.cos(math.radians(20)))


def dot(u, v):
    return sum(a * b for a, b in zip(u, v))


def cross(u, v):
    return (u[1] * v[2] - u[2] * v[1], u[2] * v[0] - u[0] * v[2], u[0] * v[1] - u[1] * v[0])


def field(r):
    """Cartesian complex far field at unit direction r."""
    dr = dot(D, r)
    mr = cross(M, r)
    return [S * (A * (D[i] - dr * r[i]) + 1j * B * mr[i]) for i in range(3)]


def sph(t, p):
    t, p = math.radians(t), math.radians(p)
    r = (math.sin(t) * math.cos(p), math.sin(t) * math.sin(p), math.cos(t))
    th = (math.cos(t) * math.cos(p), math.cos(t) * math.sin(p), -math.sin(t))
    ph = (-math.sin(p), math.cos(p), 0.0)
    return r, th, ph


def az_over_el(az, el):
    a, e = math.radians(az), math.radians(el)
    r = (math.sin(a) * math.cos(e), math.sin(e), math.cos(a) * math.cos(e))
    ahat = (math.cos(a), 0.0, -math.sin(a))
    ehat = (-math.sin(a) * math.sin(e), math.cos(e), -math.cos(a) * math.sin(e))
    return r, ahat, ehat


def el_over_az(az, el):
    a, e = math.radians(az), math.radians(el)
    r = (math.sin(a), math.cos(a) * math.sin(e), math.cos(a) * math.cos(e))
    ahat = (math.cos(a), -math.sin(a) * math.sin(e), -math.sin(a) * math.cos(e))
    ehat = (0.0, math.cos(e), -math.sin(e))
    return r, ahat, ehat


def comp(e, u):
    return sum(e[i] * u[i] for i in range(3))


def db_phase(c, comma=False):
    a = abs(c)
    d = "-inf" if a == 0 else f"{20 * math.log10(a):.5f}"
    p = f"{math.degrees(cmath.phase(c)):.4f}"
    if comma:
        d, p = d.replace(".", ","), p.replace(".", ",")
    return d, p


def write(name, lines):
    with open(name, "w", newline="") as f:
        f.write("\n".join(lines) + "\n")


# The schema reference.
rows = ["# name: layouts reference (tilted dipole and loop)", "# quantity: directivity", "# frequency: 3.5 GHz",
        "theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im"]
for t in range(0, 181, 5):
    for p in range(0, 360, 5):
        r, th, ph = sph(t, p)
        e = field(r)
        a, b = comp(e, th), comp(e, ph)
        rows.append(f"{t},{p},{a.real:.9g},{a.imag:.9g},{b.real:.9g},{b.imag:.9g}")
write("reference.csv", rows)

# theta -180..180: the formal unit vectors at negative theta are those of (|theta|, phi + 180)
# negated, so the file holds E . theta-hat(theta, phi) as a range's polar sweep reports it.
rows = ["Far-field polar sweeps, exported by range 2 (invented)", "AUT;tilted dipole + loop demo",
        "Frequency;3,5 GHz", "", "Phi(deg);Theta(deg);Eth Ampl(dB);Eth Phase(deg);Eph Ampl(dB);Eph Phase(deg)"]
for p in range(0, 180, 5):
    for t in range(-180, 181, 5):
        r, th, ph = sph(t, p)
        e = field(r)
        a, b = db_phase(comp(e, th), True), db_phase(comp(e, ph), True)
        rows.append(f"{p};{t};{a[0]};{a[1]};{b[0]};{b[1]}")
write("range_theta_pm180.csv", rows)

rows = ["Positioner: azimuth over elevation (invented export)", "Freq [GHz],3.5",
        "EL [deg],AZ [deg],Az-pol [dB],Az-pol phase [deg],El-pol [dB],El-pol phase [deg]"]
for el in range(-90, 91, 5):
    for az in range(-180, 180, 5):
        r, ah, eh = az_over_el(az, el)
        e = field(r)
        a, b = db_phase(comp(e, ah)), db_phase(comp(e, eh))
        rows.append(f"{el},{az},{a[0]},{a[1]},{b[0]},{b[1]}")
write("range_az_over_el.csv", rows)

rows = ["Positioner: elevation over azimuth (invented export)",
        "AZ\tEL\tE_az re\tE_az im\tE_el re\tE_el im"]
for az in range(-90, 91, 5):
    for el in range(-180, 180, 5):
        r, ah, eh = el_over_az(az, el)
        e = field(r)
        a, b = comp(e, ah), comp(e, eh)
        rows.append(f"{az}\t{el}\t{a.real:.7g}\t{a.imag:.7g}\t{b.real:.7g}\t{b.imag:.7g}")
write("range_el_over_az.csv", rows)
