#!/usr/bin/python3
"""The demo scenario's antennas, from published closed-form models (see examples/README.md).

Everything here is invented for the demo: the tag, its three candidate antennas, their dimensions,
losses and couplings, and the range measurement. Only the formulas are published:

  dipole far field (sinusoidal current)   Balanis, Antenna Theory, sec. 4.5
  dipole input impedance (induced EMF)    Balanis sec. 8.5 (R_r, X_m at the current maximum;
                                          R_in = R_r / sin^2(kl/2), X_in likewise)
  equivalent radius of a thin strip       a = w / 4 (Balanis sec. 9.4, Table 9.3)
  small loop far field                    Balanis sec. 5.2 (E_phi ~ sin theta);
                                          radiation resistance ~ f^4 (Balanis eq. 5-24)
  short dipole far field                  Balanis sec. 4.2
  two-element array factor                Balanis sec. 6.2: 1 + rho exp(j beta) exp(+j k r.d)
  a source displaced by d                 exp(+j k r.d) with exp(+j w t) (docs/conventions.md)
  mismatch of a load Z to the radio       1 - |Gamma|^2, Gamma = (Z - Z0) / (Z + Z0)
  standing wave between two mismatches    1 / (1 - G_a G_b exp(-j 2 beta l)) (common practice)

The files hold realized gain (IEEE Std 145: gain reduced by the mismatch to the 50-ohm radio), so
|E_theta|^2 + |E_phi|^2 = directivity pattern * radiation efficiency * (1 - |Gamma|^2).

    scenario.py models OUTDIR [--step DEG]      the three candidates, 2.35-2.55 GHz
    scenario.py range OUT                       the loop "measured on a range", foreign layout
"""
import argparse
import math

import numpy as np

C0 = 299792458.0
ETA = 376.730313668  # free-space impedance, ohm
EULER = 0.5772156649015329
F0 = 2.45e9  # the band centre every candidate was tuned for
Z0 = 50.0  # the radio's port
MODEL_FREQS = np.arange(2350e6, 2550e6 + 1, 10e6)  # 21 frequencies
RANGE_FREQS = np.arange(2400e6, 2500e6 + 1, 10e6)  # 11 frequencies


# --- special functions and directions -------------------------------------------------------------

_GL_X, _GL_W = np.polynomial.legendre.leggauss(200)


def si_cin(x):
    """Si(x) = int_0^x sin t / t dt and Cin(x) = int_0^x (1 - cos t) / t dt (Gauss-Legendre)."""
    x = np.atleast_1d(np.asarray(x, dtype=float))
    t = 0.5 * x[:, None] * (_GL_X[None, :] + 1)
    w = 0.5 * x[:, None] * _GL_W[None, :]
    si = np.sum(w * np.sinc(t / np.pi), axis=1)
    cin = np.sum(w * np.where(t > 0, (1 - np.cos(t)) / np.where(t > 0, t, 1), 0.0), axis=1)
    return si, cin


def si(x):
    return si_cin(x)[0]


def ci(x):
    return EULER + np.log(x) - si_cin(x)[1]


def directions(theta_deg, phi_deg):
    """Unit vectors r, theta-hat, phi-hat (docs/conventions.md) on a theta x phi grid, flattened."""
    t, p = np.meshgrid(np.radians(theta_deg), np.radians(phi_deg), indexing="ij")
    t, p = t.ravel(), p.ravel()
    st, ct, sp, cp = np.sin(t), np.cos(t), np.sin(p), np.cos(p)
    r = np.stack([st * cp, st * sp, ct], axis=1)
    th = np.stack([ct * cp, ct * sp, -st], axis=1)
    ph = np.stack([-sp, cp, np.zeros_like(p)], axis=1)
    return r, th, ph


def rot_x(deg):
    c, s = math.cos(math.radians(deg)), math.sin(math.radians(deg))
    return np.array([[1, 0, 0], [0, c, -s], [0, s, c]])


# --- impedances -----------------------------------------------------------------------------------

def dipole_impedance(length_m, radius_m, f_hz):
    """Input impedance of a centre-fed thin dipole by the induced-EMF method (Balanis sec. 8.5)."""
    k = 2 * math.pi * f_hz / C0
    kl = k * length_m
    rr = ETA / (2 * math.pi) * (EULER + math.log(kl) - ci(kl) + 0.5 * math.sin(kl) * (si(2 * kl) - 2 * si(kl))
                                + 0.5 * math.cos(kl) * (EULER + math.log(kl / 2) + ci(2 * kl) - 2 * ci(kl)))
    xm = ETA / (4 * math.pi) * (2 * si(kl) + math.cos(kl) * (2 * si(kl) - si(2 * kl))
                                - math.sin(kl) * (2 * ci(kl) - ci(2 * kl) - ci(2 * k * radius_m ** 2 / length_m)))
    s2 = math.sin(kl / 2) ** 2
    return complex(rr[0] / s2, xm[0] / s2)


def solve_length(radius_m, f_hz, want_phase_deg, loss_ohm):
    """Dipole length whose input impedance (plus a series loss) has the wanted phase at f_hz."""
    lam = C0 / f_hz
    lo, hi = 0.40 * lam, 0.60 * lam
    for _ in range(80):
        mid = 0.5 * (lo + hi)
        z = dipole_impedance(mid, radius_m, f_hz) + loss_ohm
        if math.degrees(math.atan2(z.imag, z.real)) < want_phase_deg:
            lo = mid
        else:
            hi = mid
    return 0.5 * (lo + hi)


def mismatch(z):
    g = (z - Z0) / (z + Z0)
    return 1 - abs(g) ** 2


# --- far fields (unnormalised, Cartesian complex vectors) -----------------------------------------

def dipole_field(r, axis, length_m, f_hz, current_max):
    """Sinusoidal-current dipole along a unit axis (Balanis sec. 4.5): E ~ F(psi) along -(u - (u.r) r)."""
    k = 2 * math.pi * f_hz / C0
    c = r @ axis
    s2 = 1 - c ** 2
    num = np.cos(k * length_m / 2 * c) - math.cos(k * length_m / 2)
    scale = np.where(s2 > 1e-12, num / np.where(s2 > 1e-12, s2, 1), 0.0)
    transverse = axis[None, :] - c[:, None] * r
    return -current_max * scale[:, None] * transverse


def small_loop_field(r, normal):
    """Small loop (Balanis sec. 5.2): E_phi ~ sin theta about its normal, i.e. E ~ n x r."""
    return np.cross(np.broadcast_to(normal, r.shape), r).astype(complex)


def short_dipole_field(r, axis):
    """Short dipole (Balanis sec. 4.2): E ~ -(u - (u.r) r), sin theta along theta-hat for u = z."""
    c = r @ axis
    return -(axis[None, :] - c[:, None] * r).astype(complex)


def parasitic(r, f_hz, position_m, rho, beta_deg):
    """Two-element array factor (Balanis sec. 6.2): the driven element at the origin plus a passive
    one at position_m carrying rho exp(j beta) times its current."""
    k = 2 * math.pi * f_hz / C0
    return 1 + rho * np.exp(1j * math.radians(beta_deg)) * np.exp(1j * k * (r @ np.asarray(position_m)))


# --- the three candidates -------------------------------------------------------------------------

LAM0 = C0 / F0
STRIP_W = 1.5e-3  # printed trace width
STRIP_A = STRIP_W / 4  # equivalent radius (Balanis Table 9.3)
DIPOLE_LOSS = 8.0  # ohm, board and battery losses (invented)


class PrintedDipole:
    """Vertical printed dipole trimmed to resonance at 2.45 GHz, the coin cell 12 mm behind it (-x)
    acting as a parasitic reflector."""
    name = "printed dipole"
    note = ("invented: vertical printed half-wave dipole trimmed to resonance at 2.45 GHz, 1.5 mm trace, "
            "8 ohm loss; the coin cell 12 mm behind it (-x) is a parasitic element (0.4 at 150 deg); "
            "realized gain into 50 ohm")

    def __init__(self):
        self.length = solve_length(STRIP_A, F0, 0.0, DIPOLE_LOSS)

    def field(self, r, f):
        e = dipole_field(r, np.array([0.0, 0, 1]), self.length, f, 1.0)
        return e * parasitic(r, f, [-0.012, 0, 0], 0.4, 150.0)[:, None]

    def port(self, f):
        z = dipole_impedance(self.length, STRIP_A, f)
        return z.real / (z.real + DIPOLE_LOSS), mismatch(z + DIPOLE_LOSS)


class Turnstile:
    """Self-phased crossed printed dipoles on one feed: the x arm is cut short (capacitive) and the
    y arm long (inductive) so that at 2.45 GHz the y arm's far field toward +z lags the x arm's by
    90 deg at equal amplitude: right-hand circular toward +z (docs/conventions.md: x - j y radiates
    right-hand toward +z). Away from 2.45 GHz the two arms drift apart in amplitude and phase. The
    tag's ground plane 12 mm below (-z) acts as a parasitic reflector."""
    name = "turnstile"
    note = ("invented: crossed printed dipoles on one feed, arm lengths set for circular polarisation "
            "toward +z at 2.45 GHz (self-phased, right-hand), 1.5 mm traces, 8 ohm loss per arm; the "
            "ground plane 12 mm below is a parasitic element (0.4 at 150 deg); realized gain into 50 ohm")

    def __init__(self):
        self.lx, self.ly = self._circular_at(F0)

    def _axis_ratio(self, lx, ly, f):
        """E_y / E_x toward +z for arm lengths lx, ly: each arm gives I_in tan(kl/4) there."""
        k = 2 * math.pi * f / C0
        ex = math.tan(k * lx / 4) / (dipole_impedance(lx, STRIP_A, f) + DIPOLE_LOSS)
        ey = math.tan(k * ly / 4) / (dipole_impedance(ly, STRIP_A, f) + DIPOLE_LOSS)
        return ey / ex

    def _circular_at(self, f):
        """Newton's method on E_y / E_x = -j (equal amplitude, y lagging 90 deg), from the lengths that
        put the two input currents at +45 and -45 deg."""
        x = np.array([solve_length(STRIP_A, f, -45.0, DIPOLE_LOSS), solve_length(STRIP_A, f, 45.0, DIPOLE_LOSS)])
        for _ in range(30):
            g = self._axis_ratio(x[0], x[1], f) + 1j
            h = 1e-7
            j = np.empty((2, 2))
            for c in range(2):
                d = x.copy()
                d[c] += h
                gd = (self._axis_ratio(d[0], d[1], f) + 1j - g) / h
                j[:, c] = gd.real, gd.imag
            x = x - np.linalg.solve(j, np.array([g.real, g.imag]))
            if abs(g) < 1e-12:
                break
        return x[0], x[1]

    def currents(self, f):
        zx = dipole_impedance(self.lx, STRIP_A, f) + DIPOLE_LOSS
        zy = dipole_impedance(self.ly, STRIP_A, f) + DIPOLE_LOSS
        return zx, zy, 1 / zx, 1 / zy  # one voltage across both arms

    def field(self, r, f):
        k = 2 * math.pi * f / C0
        _, _, ix, iy = self.currents(f)
        e = (dipole_field(r, np.array([1.0, 0, 0]), self.lx, f, ix / math.sin(k * self.lx / 2))
             + dipole_field(r, np.array([0.0, 1, 0]), self.ly, f, iy / math.sin(k * self.ly / 2)))
        return e * parasitic(r, f, [0, 0, -0.012], 0.4, 150.0)[:, None]

    def port(self, f):
        zx, zy, ix, iy = self.currents(f)
        rad = abs(ix) ** 2 * (zx.real - DIPOLE_LOSS) + abs(iy) ** 2 * (zy.real - DIPOLE_LOSS)
        total = abs(ix) ** 2 * zx.real + abs(iy) ** 2 * zy.real
        return rad / total, mismatch(1 / (ix + iy))


class SmallLoop:
    """Small loop on a board tipped 30 deg about x, close to the tag's ground plane: its own field
    plus a vertical ground-plane current it drives (far field 0.9 times as strong, 60 deg ahead).
    Tuned with a capacitor and matched to 50 ohm at 2.45 GHz: a series RLC with L = 6.5 nH,
    radiation resistance 1.1 ohm at 2.45 GHz growing as f^4 (Balanis eq. 5-24) and 0.9 ohm loss."""
    name = "small loop"
    note = ("invented: small loop tipped 30 deg about x near the ground plane, plus the vertical "
            "ground-plane current it drives (0.9 at 60 deg); capacitor-tuned series RLC, L 6.5 nH, "
            "R_rad 1.1 ohm (x f^4), loss 0.9 ohm, matched at 2.45 GHz; realized gain into 50 ohm")
    L_H, R_RAD0, R_LOSS = 6.5e-9, 1.1, 0.9

    def __init__(self, f_tuned=F0):
        self.c_f = 1 / ((2 * math.pi * f_tuned) ** 2 * self.L_H)  # resonates at f_tuned
        self.f_tuned = f_tuned

    def field(self, r, f):
        n = rot_x(30) @ np.array([0.0, 0, 1])
        return small_loop_field(r, n) + 0.9 * np.exp(1j * math.radians(60)) * short_dipole_field(r, np.array([0.0, 0, 1]))

    def port(self, f):
        w = 2 * math.pi * f
        r_rad = self.R_RAD0 * (f / F0) ** 4
        r_tot0 = self.R_RAD0 * (self.f_tuned / F0) ** 4 + self.R_LOSS
        z = r_rad + self.R_LOSS + 1j * (w * self.L_H - 1 / (w * self.c_f))
        # An ideal transformer matches the tuned loop's resistance at its resonance to 50 ohm.
        return r_rad / (r_rad + self.R_LOSS), mismatch(z * Z0 / r_tot0)


# --- realized gain on a grid ----------------------------------------------------------------------

def _fine_power(antenna, f):
    """Integral of |E|^2 over the sphere (Gauss-Legendre in cos theta, 720 phi), grid-independent."""
    x, w = np.polynomial.legendre.leggauss(181)
    phi = np.arange(720) * 0.5
    r, _, _ = directions(np.degrees(np.arccos(x)), phi)
    e = antenna.field(r, f)
    p = np.sum(np.abs(e) ** 2, axis=1).reshape(len(x), len(phi))
    return float(np.sum(p * w[:, None]) * (2 * math.pi / len(phi)))


def realized_gain_fields(antenna, f, theta_deg, phi_deg):
    """E_theta, E_phi with |E|^2 = realized gain (flattened, theta the slow index)."""
    r, th, ph = directions(theta_deg, phi_deg)
    e = antenna.field(r, f)
    eff, mm = antenna.port(f)
    e = e * math.sqrt(4 * math.pi * eff * mm / _fine_power(antenna, f))
    et, ep = np.sum(e * th, axis=1), np.sum(e * ph, axis=1)
    # Closed-form zeros stay zero (no rounding residue standing in for a polarisation).
    floor = 1e-12 * np.max(np.abs(e))
    for a in (et, ep):
        a.real[np.abs(a.real) < floor] = 0
        a.imag[np.abs(a.imag) < floor] = 0
    return et, ep


def fmt(x):
    s = "%.6g" % x
    return "0" if s in ("0", "-0") else s


def write_model(path, antenna, step):
    theta = np.arange(0, 180 + step / 2, step)
    phi = np.arange(0, 360 - step / 2, step)
    with open(path, "w", encoding="utf-8") as out:
        out.write("# ellipsa far-field CSV, schema version 1\n")
        out.write("# quantity: gain\n# time-convention: +jwt\n# angle-unit: deg\n# frequency-unit: MHz\n")
        out.write(f"# name: {antenna.name}\n# source: invented demo data, examples/make_examples.sh\n")
        out.write(f"# note: {antenna.note}\n")
        out.write("frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n")
        tt, pp = np.meshgrid(theta, phi, indexing="ij")
        tt, pp = tt.ravel(), pp.ravel()
        for f in MODEL_FREQS:
            et, ep = realized_gain_fields(antenna, f, theta, phi)
            fm = "%g" % (f / 1e6)
            out.write("".join(f"{fm},{t:g},{p:g},{fmt(a.real)},{fmt(a.imag)},{fmt(b.real)},{fmt(b.imag)}\n"
                              for t, p, a, b in zip(tt, pp, et, ep)))


# --- the range measurement ------------------------------------------------------------------------

RANGE_SEED = 2024
PHASE_CENTRE_M = 0.8 * LAM0 * np.array([0.6, 0.48, 0.64])  # the tag's fixture, off the turntable axis
HOUSING_SHIFT = 0.99  # the prototype in its housing resonates 1 % low
CABLE_M, CABLE_VF, CABLE_GG = 3.0, 0.70, 0.03  # cable length, velocity factor, |Gamma_a Gamma_b|
NOISE_DB = -40.0  # noise floor relative to the peak realized gain at each frequency


def range_fields(f, theta, phi, rng):
    """The loop prototype as the range sees it (see examples/README.md)."""
    proto = SmallLoop(f_tuned=F0 * HOUSING_SHIFT)
    r, _, _ = directions(theta, phi)
    et, ep = realized_gain_fields(proto, f, theta, phi)
    k = 2 * math.pi * f / C0
    shift = np.exp(1j * k * (r @ PHASE_CENTRE_M))
    beta_l = 2 * math.pi * f / (CABLE_VF * C0) * CABLE_M
    cable = 1 / (1 - CABLE_GG * np.exp(-2j * beta_l))
    et, ep = et * shift * cable, ep * shift * cable
    peak = np.max(np.abs(et) ** 2 + np.abs(ep) ** 2)
    sigma = math.sqrt(peak * 10 ** (NOISE_DB / 10) / 2)  # per component, per real part
    n = len(et)
    et = et + sigma * (rng.standard_normal(n) + 1j * rng.standard_normal(n))
    ep = ep + sigma * (rng.standard_normal(n) + 1j * rng.standard_normal(n))
    return et, ep


def write_range(path, step):
    """Upper hemisphere, azimuth -180..180 (the seam repeated) and elevation from the horizon, in the
    range software's own layout: semicolons, decimal commas, dB and degrees, CRLF line ends."""
    rng = np.random.default_rng(RANGE_SEED)
    el = np.arange(90, -step / 2, -step)  # 90 .. 0
    az = np.arange(-180, 180 + step / 2, step)  # -180 .. 180
    theta = 90 - el
    phi = np.mod(az, 360)

    def comma(s):
        return s.replace(".", ",")

    def db(x):
        return "-200" if x == 0 else comma("%.2f" % (20 * math.log10(abs(x))))

    def deg(x):
        return comma("%.1f" % math.degrees(math.atan2(x.imag, x.real)))

    with open(path, "w", encoding="utf-8", newline="\r\n") as out:
        out.write("# Invented range export for the ellipsa demo (not a real measurement)\n")
        out.write("# Chamber: far-field range B, roll-over-azimuth positioner\n")
        out.write("# AUT: pallet tag, small-loop prototype in its housing\n")
        out.write("# Gain by substitution against the reference horn\n")
        out.write("Freq [MHz];Azim [deg];Elev [deg];Vert gain [dBi];Vert phase [deg];"
                  "Horiz gain [dBi];Horiz phase [deg];Scan;\n")
        for scan, f in enumerate(RANGE_FREQS, start=1):
            et, ep = range_fields(f, theta, phi, rng)
            et, ep = et.reshape(len(el), len(az)), ep.reshape(len(el), len(az))
            et[:, -1], ep[:, -1] = et[:, 0], ep[:, 0]  # +180 is the same direction as -180
            for j in range(len(az)):
                for i in range(len(el)):
                    out.write("%g;%g;%g;%s;%s;%s;%s;%d;\n" % (f / 1e6, az[j], el[i], db(et[i, j]), deg(et[i, j]),
                                                               db(ep[i, j]), deg(ep[i, j]), scan))


def main():
    p = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    sub = p.add_subparsers(dest="what", required=True)
    m = sub.add_parser("models")
    m.add_argument("outdir")
    m.add_argument("--step", type=float, default=5.0)
    r = sub.add_parser("range")
    r.add_argument("out")
    r.add_argument("--step", type=float, default=5.0)
    a = p.parse_args()
    if a.what == "models":
        for ant, name in ((PrintedDipole(), "printed-dipole"), (Turnstile(), "turnstile"), (SmallLoop(), "small-loop")):
            write_model(f"{a.outdir}/{name}.csv", ant, a.step)
    else:
        write_range(a.out, a.step)


if __name__ == "__main__":
    main()
