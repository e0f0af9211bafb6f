#!/usr/bin/env python3
"""Writes the split-data fixtures that tests/unit/test_split_data.cpp reads (issue 14).

One invented antenna in every file: a Huygens source (crossed electric and magnetic dipoles)
polarised along x, beam toward +z, with a weak cross-polar lobe, at 2.40, 2.45 and 2.50 GHz.
In Ludwig's third definition with the x reference (A. C. Ludwig, IEEE Trans. AP-21, 1973):
    co    = a(f) sqrt(3) (1 + cos t) / 2
    cross = a(f) 0.1 sqrt(3) sin t sin 2p (1 + cos t) / 2 * exp(j 90 deg)
so E_theta = co cos p + cross sin p and E_phi = -co sin p + cross cos p (the inverse of
co = Et cos p - Ep sin p, cross = Et sin p + Ep cos p). With a(f) = 1 the co-polar part alone is a
lossless antenna of directivity 3 (4.77 dBi; the integral of ((1 + cos t)/2)^2 over the sphere
is 4 pi / 3); the cross-polar part adds 0.3 % of that power (0.01 * 3 * 1/2 * 0.2, by hand), so
the whole antenna's directivity is 3 / 1.003 (4.76 dBi). a(f)^2 is 0.9, 0.95, 0.92: the radiation
efficiency is about a(f)^2 * 1.003 and the peak gain 3 a(f)^2. The E- and H-plane HPBW of
the co-polar part is 2 acos(2 sqrt(1/2) - 1) = 131.1 deg (half power where (1 + cos t)/2 = sqrt(1/2)).

Files (all gain, the same 10-degree grid unless said):
  sphere.csv              the whole pattern in one schema file (complex family): the reference
  f2400.csv f2450.csv f2500.csv   one file per frequency (complex family, a range's style)
  co.csv  cross.csv       one file per polarisation: Ludwig-3 co (dB, phase) and cross, all frequencies
  e_theta.csv e_phi.csv   one file per component: E_theta (dB, phase) and E_phi (dB, phase)
  cuts.csv                principal cuts only: phi = 0, 90, 180, 270 over theta 0..180 step 2
  azimuth_cut.csv         one azimuth cut, theta = 90, phi 0..358 step 2
  swapped_pair.csv        sphere.csv's pattern with the co- and cross-polar parts exchanged
  flipping_sense.csv      a circular pattern whose sense flips between neighbouring frequencies
Run from this folder; the files are committed, this script documents how they were made.
"""
import cmath
import math

FREQS = [2.40e9, 2.45e9, 2.50e9]
A2 = {2.40e9: 0.9, 2.45e9: 0.95, 2.50e9: 0.92}


def co_cross(t_deg, p_deg, f):
    t, p = math.radians(t_deg), math.radians(p_deg)
    a = math.sqrt(A2[f]) * math.sqrt(3) * (1 + math.cos(t)) / 2
    co = complex(a, 0)
    cross = a * 0.1 * math.sin(t) * math.sin(2 * p) * 1j
    return co, cross


def theta_phi(co, cross, p_deg):
    p = math.radians(p_deg)
    return co * math.cos(p) + cross * math.sin(p), -co * math.sin(p) + cross * math.cos(p)


def num(x):
    return f"{x:.12g}"


def db(z):
    return "-inf" if abs(z) == 0 else num(20 * math.log10(abs(z)))


def deg(z):
    return num(math.degrees(cmath.phase(z))) if abs(z) > 0 else "0"


def write(name, lines):
    with open(name, "w", newline="") as f:
        f.write("\n".join(lines) + "\n")


def grid(step_t=10, step_p=10):
    for t in range(0, 181, step_t):
        for p in range(0, 360, step_p):
            yield t, p


head = ["# quantity: gain", "# frequency-unit: GHz"]

# The reference: the whole pattern, one schema file.
rows = head + ["# name: Huygens source (invented)", "frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im"]
for f in FREQS:
    for t, p in grid():
        et, ep = theta_phi(*co_cross(t, p, f), p)
        rows.append(f"{f / 1e9:g},{t},{p},{num(et.real)},{num(et.imag)},{num(ep.real)},{num(ep.imag)}")
write("sphere.csv", rows)

# One file per frequency, as a range writes one scan per file.
for f in FREQS:
    rows = ["# quantity: gain", f"# frequency: {f / 1e6:g} MHz", "theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im"]
    for t, p in grid():
        et, ep = theta_phi(*co_cross(t, p, f), p)
        rows.append(f"{t},{p},{num(et.real)},{num(et.imag)},{num(ep.real)},{num(ep.imag)}")
    write(f"f{f / 1e6:g}.csv", rows)

# One file per polarisation (Ludwig-3 co and cross, dB and phase) and one per component.
for name, cols, pick in [
    ("co.csv", "e_co_db,e_co_phase", lambda co, cr, et, ep: co),
    ("cross.csv", "e_cross_db,e_cross_phase", lambda co, cr, et, ep: cr),
    ("e_theta.csv", "e_theta_db,e_theta_phase", lambda co, cr, et, ep: et),
    ("e_phi.csv", "e_phi_db,e_phi_phase", lambda co, cr, et, ep: ep),
]:
    rows = head + (["# ludwig3-reference: x"] if "co" in cols or "cross" in cols else [])
    rows.append("frequency,theta,phi," + cols)
    for f in FREQS:
        for t, p in grid():
            co, cr = co_cross(t, p, f)
            et, ep = theta_phi(co, cr, p)
            z = pick(co, cr, et, ep)
            rows.append(f"{f / 1e9:g},{t},{p},{db(z)},{deg(z)}")
    write(name, rows)

# Principal cuts only: the phi = 0 and phi = 90 planes as four half-planes, theta step 2.
rows = head + ["frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im"]
for f in FREQS:
    for t in range(0, 181, 2):
        for p in (0, 90, 180, 270):
            et, ep = theta_phi(*co_cross(t, p, f), p)
            rows.append(f"{f / 1e9:g},{t},{p},{num(et.real)},{num(et.imag)},{num(ep.real)},{num(ep.imag)}")
write("cuts.csv", rows)

# One azimuth cut, theta = 90.
rows = head + ["frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im"]
for f in FREQS:
    for p in range(0, 360, 2):
        et, ep = theta_phi(*co_cross(90, p, f), p)
        rows.append(f"{f / 1e9:g},90,{p},{num(et.real)},{num(et.imag)},{num(ep.real)},{num(ep.imag)}")
write("azimuth_cut.csv", rows)

# The co- and cross-polar columns exchanged (a swapped pair), in the Ludwig-3 family.
rows = head + ["# ludwig3-reference: x", "frequency,theta,phi,e_co_db,e_co_phase,e_cross_db,e_cross_phase"]
for f in FREQS:
    for t, p in grid():
        co, cr = co_cross(t, p, f)
        rows.append(f"{f / 1e9:g},{t},{p},{db(cr)},{deg(cr)},{db(co)},{deg(co)}")
write("swapped_pair.csv", rows)

# A right-hand circular Huygens pattern (crossed pair fed in quadrature) whose middle frequency
# has its phases conjugated, as a file with one scan in the other time convention would: the
# sense flips from right to left and back between neighbouring frequencies.
rows = head + ["frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im"]
for f in FREQS:
    for t, p in grid():
        a = math.sqrt(A2[f] * 3 / 2) * (1 + math.cos(math.radians(t))) / 2
        # E_R = a sqrt2 exp(-j p), E_L = 0: Et = E_R / sqrt2, Ep = -j E_R / sqrt2 (inverse of conventions.md).
        er = a * math.sqrt(2) * cmath.exp(-1j * math.radians(p))
        et, ep = er / math.sqrt(2), -1j * er / math.sqrt(2)
        if f == 2.45e9:
            et, ep = et.conjugate(), ep.conjugate()
        rows.append(f"{f / 1e9:g},{t},{p},{num(et.real)},{num(et.imag)},{num(ep.real)},{num(ep.imag)}")
write("flipping_sense.csv", rows)
