"""An independent reading of /work/shared/conventions.md (docs/conventions.md) in numpy/scipy.

Written from the conventions text and the published sources it names, not from ellipsa's C++:
it shares no code and no numerical scheme with the core beyond what the conventions fix.
Closed-form antennas are built as Cartesian far-field vectors and projected onto theta-hat and
phi-hat; the figures are computed from those closed forms by fine quadrature (the "true" values)
and, where the conventions fix a discrete rule (the cell solid angles), on the file's own grid.

Sources, named beside each function:
  IEEE Std 145-2013 and Balanis, Antenna Theory, sec. 2.12 (polarisation, sense, AR, Stokes);
  A. C. Ludwig, IEEE Trans. AP-21, 1973 (third definition of co/cross);
  Balanis sec. 4.2, 4.5, 5.2, 5.3 (dipoles and loops);
  T. Taga, IEEE Trans. VT-39, 1990 (MEG, Gaussian environment);
  R. G. Vaughan, J. B. Andersen, IEEE Trans. VT-36, 1987 (envelope correlation);
  P.-S. Kildal, K. Rosengren, IEEE Commun. Mag. 42(12), 2004 (diversity gain, apparent/effective);
  Marcum's Q1 through scipy.stats.ncx2 (Q1(a, b) = P(chi'^2_2(a^2) > b^2), Marcum 1950 / Proakis,
  Digital Communications, sec. 2.1);
  Y. Y. Hu, J. Franklin Inst. 271, 1961 (phase centre by the linear-phase fit).
"""
import functools
import math

import numpy as np
from scipy import integrate, optimize, special, stats

DEG = math.pi / 180


# ---------------------------------------------------------------- coordinates (conventions.md)
def unit_vectors(theta_deg, phi_deg):
    """r-hat, theta-hat, phi-hat as arrays (..., 3); theta-hat x phi-hat = r-hat."""
    t = np.asarray(theta_deg, float) * DEG
    p = np.asarray(phi_deg, float) * DEG
    st, ct, sp, cp = np.sin(t), np.cos(t), np.sin(p), np.cos(p)
    r = np.stack([st * cp, st * sp, ct], -1)
    th = np.stack([ct * cp, ct * sp, -st], -1)
    ph = np.stack([-sp, cp, np.zeros_like(t)], -1)
    return r, th, ph


def project(field_xyz, theta_deg, phi_deg):
    """(E_theta, E_phi) of a Cartesian complex field (..., 3)."""
    _, th, ph = unit_vectors(theta_deg, phi_deg)
    return (field_xyz * th).sum(-1), (field_xyz * ph).sum(-1)


# ---------------------------------------------------------------- closed-form antennas (Cartesian)
class Antenna:
    """A sum of closed-form elements; field(r) gives the Cartesian complex far field at unit r.

    Elements (positions in wavelengths, so the phase is exp(+j 2 pi r.d), conventions.md phase
    centre, with exp(+j w t)):
      dipole(u, length): E = -(u - (u.r) r) f, f = [cos(pi L u.r) - cos(pi L)] / (1 - (u.r)^2)
        (Balanis sec. 4.5; length None is the short dipole, f = 1, Balanis sec. 4.2): a z dipole
        has E_theta = +sin(theta) (short) and no E_phi.
      loop(n, ka): E = (n x r) J1(ka |n x r|) / |n x r| (Balanis sec. 5.3; ka None is the small
        loop, E = n x r, E_phi = +sin(theta) for n = z, Balanis sec. 5.2).
    """

    def __init__(self):
        self.parts = []
        self.scale = 1.0

    def dipole(self, u, length=None, amp=1.0, pos=(0, 0, 0)):
        self.parts.append(("dipole", np.asarray(u, float), length, complex(amp), np.asarray(pos, float)))
        return self

    def loop(self, n, ka=None, amp=1.0, pos=(0, 0, 0)):
        self.parts.append(("loop", np.asarray(n, float), ka, complex(amp), np.asarray(pos, float)))
        return self

    def field(self, r):
        r = np.asarray(r, float)
        out = np.zeros(r.shape, complex)
        for kind, v, size, amp, pos in self.parts:
            phase = np.exp(1j * 2 * math.pi * (r @ pos))[..., None]
            out += self.scale * amp * phase * _element(kind, v, size, r)
        return out

    def field_tp(self, theta_deg, phi_deg):
        r, _, _ = unit_vectors(theta_deg, phi_deg)
        return project(self.field(r), theta_deg, phi_deg)

    def normalise(self, power=4 * math.pi):
        """Scale so that the radiated power (integral of |E|^2 over the sphere) is `power`:
        4 pi makes |E|^2 the directivity, 4 pi eta a gain of efficiency eta."""
        self.scale = 1.0
        self.scale = math.sqrt(power / fine_power(self))
        return self


def _element(kind, v, size, r):
    if kind == "dipole":
        c = r @ v
        perp = v - c[..., None] * r
        if size is None:
            return -perp
        s2 = 1 - c * c
        safe = np.where(s2 > 1e-24, s2, 1.0)
        f = np.where(s2 > 1e-24, (np.cos(math.pi * size * c) - math.cos(math.pi * size)) / safe, 0.0)
        return -perp * f[..., None]
    cross = np.cross(np.broadcast_to(v, r.shape), r)
    if size is None:
        return cross.astype(complex)
    s = np.linalg.norm(cross, axis=-1)
    safe = np.where(s > 1e-15, s, 1.0)
    return cross * (np.where(s > 1e-15, special.j1(size * s) / safe, 0.0))[..., None]


# ---------------------------------------------------------------- fine quadrature (the "truth")
@functools.lru_cache(maxsize=8)
def sphere_quadrature(n_theta=400, n_phi=720):
    """Gauss-Legendre in cos(theta) and the periodic trapezoid in phi: nodes (theta, phi deg) and
    solid-angle weights summing to 4 pi. Exact for smooth band-limited fields to far below 1e-9."""
    x, w = np.polynomial.legendre.leggauss(n_theta)
    t = np.degrees(np.arccos(x))
    p = np.arange(n_phi) * 360.0 / n_phi
    tt, pp = np.meshgrid(t, p, indexing="ij")
    ww = np.repeat(w[:, None], n_phi, 1) * (2 * math.pi / n_phi)
    return tt, pp, ww


def fine_power(ant):
    tt, pp, ww = sphere_quadrature(200, 360)
    et, ep = ant.field_tp(tt, pp)
    return float(((abs(et) ** 2 + abs(ep) ** 2) * ww).sum())


# ---------------------------------------------------------------- the grid and the CSV schema
def grid(step_deg, theta=(0.0, 180.0)):
    t = np.arange(theta[0], theta[1] + step_deg / 2, step_deg)
    p = np.arange(0.0, 360.0 - step_deg / 2, step_deg)
    return t, p


def write_csv(path, freqs_hz, fields, t, p, quantity="gain", convention="+jwt", name="audit"):
    """fields: one (E_theta, E_phi) pair of (theta, phi) arrays per frequency, written in the
    complex family (docs/far-field-csv.md). With convention -iwt the imaginary parts are negated,
    which is what a file in the exp(-i w t) convention holds for the same physical field."""
    sign = -1.0 if convention == "-iwt" else 1.0
    tt, pp = np.meshgrid(t, p, indexing="ij")
    with open(path, "w", encoding="utf-8") as f:
        f.write(f"# quantity: {quantity}\n# time-convention: {convention}\n# name: {name}\n")
        f.write("frequency,theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n")
        for fr, (et, ep) in zip(freqs_hz, fields):
            rows = np.column_stack([np.full(tt.size, fr), tt.ravel(), pp.ravel(), et.real.ravel(),
                                    sign * et.imag.ravel(), ep.real.ravel(), sign * ep.imag.ravel()])
            for row in rows:
                f.write(",".join(repr(float(v)) for v in row) + "\n")


def read_csv_simple(path, delimiter=",", decimal_comma=False):
    """Rows of a CSV as a dict of float columns keyed by lower-case header name (comment lines,
    blank lines and trailing empty cells skipped)."""
    with open(path, encoding="utf-8-sig") as f:
        lines = [ln.rstrip("\r\n") for ln in f if ln.strip() and not ln.startswith("#")]
    head = [h.strip().strip('"').lower() for h in lines[0].split(delimiter)]
    while head and head[-1] == "":
        head.pop()
    cols = [[] for _ in head]
    for ln in lines[1:]:
        cells = ln.split(delimiter)
        for i in range(len(head)):
            cell = cells[i].strip()
            cols[i].append(float(cell.replace(",", ".") if decimal_comma else cell))
    return {h: np.array(c) for h, c in zip(head, cols)}


# ---------------------------------------------------------------- polarisation (IEEE Std 145)
def circular(et, ep):
    """E_R = (E_theta + j E_phi)/sqrt2, E_L = (E_theta - j E_phi)/sqrt2 (exp(+jwt), outward)."""
    return (et + 1j * ep) / math.sqrt(2), (et - 1j * ep) / math.sqrt(2)


def axial_ratio(et, ep):
    """AR = (|E_R| + |E_L|) / ||E_R| - |E_L||, inf for linear (conventions.md)."""
    er, el = circular(et, ep)
    a, b = abs(er), abs(el)
    return math.inf if a == b else (a + b) / abs(a - b)


def tilt_deg(et, ep):
    """Major axis from theta-hat toward phi-hat, (-90, 90]: arg(E_R conj(E_L)) / 2."""
    er, el = circular(et, ep)
    tau = math.degrees(np.angle(er * np.conj(el))) / 2
    return tau + 180 if tau <= -90 else tau


def stokes(et, ep):
    """I, Q, U, V with V = 2 Im(E_t conj(E_p)) = |E_R|^2 - |E_L|^2 (> 0 right-hand, IEEE sense)."""
    c = et * np.conj(ep)
    return (abs(et) ** 2 + abs(ep) ** 2, abs(et) ** 2 - abs(ep) ** 2, 2 * c.real, 2 * c.imag)


def ludwig3(et, ep, phi_deg, reference="x"):
    """(co, cross) by Ludwig's third definition (IEEE Trans. AP-21, 1973)."""
    s, c = math.sin(phi_deg * DEG), math.cos(phi_deg * DEG)
    if reference == "x":
        return et * c - ep * s, et * s + ep * c
    return et * s + ep * c, et * c - ep * s


def db(x):
    return 10 * math.log10(x) if x > 0 else -math.inf


# ---------------------------------------------------------------- integration (conventions.md)
def cell_solid_angles(t_deg, p_count, full_sphere=True):
    """Exact cell solid angles dphi (cos(t - dt/2) - cos(t + dt/2)), clipped at the poles and at
    the edge of the sampled theta range (docs/conventions.md: a hemisphere covers exactly 2 pi)."""
    dt = (t_deg[1] - t_deg[0]) * DEG
    t = t_deg * DEG
    lo = np.clip(t - dt / 2, max(0.0, t[0]), min(math.pi, t[-1]))
    hi = np.clip(t + dt / 2, max(0.0, t[0]), min(math.pi, t[-1]))
    ring = (np.cos(lo) - np.cos(hi)) * (2 * math.pi / p_count)
    return np.repeat(ring[:, None], p_count, 1)


def directivity_and_efficiency(u_grid, weights):
    """D = 4 pi U_max / P and eta = P / (4 pi) from absolute gain samples."""
    power = float((u_grid * weights).sum())
    return 4 * math.pi * u_grid.max() / power, power / (4 * math.pi)


# ---------------------------------------------------------------- environments (Taga 1990)
def taga_density(theta_deg, mean_elev_deg, spread_deg):
    """Unnormalised Gaussian density in theta: exp(-(t - (pi/2 - m))^2 / (2 s^2)), uniform in phi."""
    t = np.asarray(theta_deg, float) * DEG
    return np.exp(-(t - (math.pi / 2 - mean_elev_deg * DEG)) ** 2 / (2 * (spread_deg * DEG) ** 2))


def taga_norm(mean_elev_deg, spread_deg):
    """The constant A with A * 2 pi * integral of density sin(t) dt over [0, pi] = 1 (adaptive
    quadrature, independent of any grid)."""
    val, _ = integrate.quad(lambda t: math.exp(-(t - (math.pi / 2 - mean_elev_deg * DEG)) ** 2
                                               / (2 * (spread_deg * DEG) ** 2)) * math.sin(t),
                            0, math.pi, epsabs=1e-14, epsrel=1e-12, limit=400)
    return 1 / (2 * math.pi * val)


class Environment:
    """P_theta, P_phi each integrating to 1, and XPR (linear). gauss=None is uniform: 1/(4 pi)."""

    def __init__(self, xpr_db=0.0, v=None, h=None):
        self.xpr = math.inf if xpr_db == math.inf else 10 ** (xpr_db / 10)
        self.v, self.h = v, h

    def weights(self):
        if self.xpr == math.inf:
            return 1.0, 0.0
        return self.xpr / (1 + self.xpr), 1 / (1 + self.xpr)

    def density(self, which, theta_deg):
        g = self.v if which == "v" else self.h
        if g is None:
            return np.full(np.shape(theta_deg), 1 / (4 * math.pi))
        return taga_norm(*g) * taga_density(theta_deg, *g)


def fields_on_quadrature(ant, n_theta, n_phi):
    """(theta, phi, weights, E_theta, E_phi) on the quadrature, kept on the antenna object."""
    cache = ant.__dict__.setdefault("_quad_fields", {})
    if (n_theta, n_phi) not in cache:
        tt, pp, ww = sphere_quadrature(n_theta, n_phi)
        cache[(n_theta, n_phi)] = (tt, pp, ww) + tuple(ant.field_tp(tt, pp))
    return cache[(n_theta, n_phi)]


def meg(ant, env, n_theta=300, n_phi=360):
    """Taga's MEG = integral [w_v G_theta P_theta + w_h G_phi P_phi] dOmega, by fine quadrature of
    the closed form. Returns (MEG, vertical part, horizontal part) as integrals of G_x P_x (the
    parts are unweighted, so MEG = w_v Pv + w_h Ph)."""
    tt, pp, ww, et, ep = fields_on_quadrature(ant, n_theta, n_phi)
    pv = float((abs(et) ** 2 * env.density("v", tt) * ww).sum())
    ph = float((abs(ep) ** 2 * env.density("h", tt) * ww).sum())
    wv, wh = env.weights()
    return wv * pv + wh * ph, pv, ph


def ecc(ant1, ant2, env, n_theta=300, n_phi=360):
    """Vaughan-Andersen envelope correlation with Taga's XPR weighting (conventions.md)."""
    tt, pp, ww, t1, p1 = fields_on_quadrature(ant1, n_theta, n_phi)
    _, _, _, t2, p2 = fields_on_quadrature(ant2, n_theta, n_phi)
    wv, wh = env.weights()
    dv, dh = env.density("v", tt) * ww * wv, env.density("h", tt) * ww * wh
    cross = (t1 * np.conj(t2) * dv + p1 * np.conj(p2) * dh).sum()
    a = ((abs(t1) ** 2) * dv + (abs(p1) ** 2) * dh).sum()
    b = ((abs(t2) ** 2) * dv + (abs(p2) ** 2) * dh).sum()
    return float(abs(cross) ** 2 / (a * b)), complex(cross / math.sqrt(a * b))


# ---------------------------------------------------------------- fading and combining
def marcum_q1(a, b):
    """Q1(a, b) = P(X > b^2), X non-central chi-square, 2 degrees of freedom, non-centrality a^2."""
    return float(stats.ncx2.sf(b * b, 2, a * a)) if a > 0 else math.exp(-b * b / 2)


def marcum_p1(a, b):
    """1 - Q1(a, b) without cancellation (the lower tail, for small levels)."""
    return float(stats.ncx2.cdf(b * b, 2, a * a)) if a > 0 else -math.expm1(-b * b / 2)


def cdf_single(x, g):
    return -math.expm1(-x / g)


_GL400 = np.polynomial.legendre.leggauss(400)


def cdf_selection(x, g1, g2, rho, nodes=None):
    """Exact selection combining CDF: the conventions' integral over t in [0, x], by Gauss-Legendre
    quadrature with vectorised 1 - Q1 (the integrand is smooth on the interval; 400 nodes agree
    with adaptive QUADPACK to 1e-10 relative, checked in check_selection_quadrature)."""
    if rho < 1e-14:
        return cdf_single(x, g1) * cdf_single(x, g2)
    b2 = 2 * x / (g2 * (1 - rho))
    u, w = nodes if nodes is not None else _GL400
    t = (u + 1) * x / 2
    a2 = 2 * rho * t / (g1 * (1 - rho))
    try:
        p1 = stats.ncx2.cdf(b2, 2, a2)
    except OverflowError:  # boost's series for a far tail: cephes' chndtr there (values ~0)
        p1 = special.chndtr(b2, 2, a2)
    f = np.exp(-t / g1) / g1 * p1
    return float((w * f).sum() * x / 2)


def cdf_selection_adaptive(x, g1, g2, rho):
    """The same integral by adaptive quadrature (QUADPACK), to check the fixed rule."""
    b = math.sqrt(2 * x / (g2 * (1 - rho)))

    def f(t):
        return math.exp(-t / g1) / g1 * marcum_p1(math.sqrt(2 * rho * t / (g1 * (1 - rho))), b)
    return integrate.quad(f, 0, x, epsabs=0, epsrel=1e-12, limit=200)[0]


@functools.lru_cache(maxsize=256)
def _eigen(g1, g2, rho):
    c = math.sqrt(rho * g1 * g2)
    l1, l2 = np.linalg.eigvalsh(np.array([[g1, c], [c, g2]]))
    return max(l1, l2), min(l1, l2)


def cdf_mrc(x, g1, g2, rho):
    """Exact MRC CDF from the covariance eigenvalues."""
    l1, l2 = _eigen(g1, g2, rho)
    if abs(l1 - l2) <= 1e-9 * l1:
        return 1 - math.exp(-x / l1) * (1 + x / l1)
    return 1 - (l1 * math.exp(-x / l1) - l2 * math.exp(-x / l2)) / (l1 - l2)


def level(cdf, p, scale):
    """x with cdf(x) = p, by Brent's method on log x."""
    f = lambda lx: cdf(math.exp(lx)) - p
    return math.exp(optimize.brentq(f, math.log(scale) - 40, math.log(scale) + 4, xtol=1e-12))


def cdf_rician(x, k, omega):
    """1 - Q1(sqrt(2K), sqrt(2 (K+1) x / Omega))."""
    return 1 - marcum_q1(math.sqrt(2 * k), math.sqrt(2 * (k + 1) * x / omega))


# ---------------------------------------------------------------- mounting (conventions.md)
def rotation_up(a):
    """Smallest rotation taking unit a to +z (for a = -z, the half turn about x)."""
    a = np.asarray(a, float) / np.linalg.norm(a)
    z = np.array([0.0, 0.0, 1.0])
    if np.allclose(a, -z):
        return np.diag([1.0, -1.0, -1.0])
    v, c = np.cross(a, z), float(a @ z)
    vx = np.array([[0, -v[2], v[1]], [v[2], 0, -v[0]], [-v[1], v[0], 0]])
    return np.eye(3) + vx + vx @ vx / (1 + c)


def rotation_about(axis, deg):
    c, s = math.cos(deg * DEG), math.sin(deg * DEG)
    i = "xyz".index(axis)
    m = np.eye(3)
    j, k = (i + 1) % 3, (i + 2) % 3
    m[j, j], m[j, k], m[k, j], m[k, k] = c, -s, s, c
    return m


class Rotated:
    """E'(r) = R E(R^T r) of an antenna (conventions.md, the mounting frame)."""

    def __init__(self, ant, rot):
        self.ant, self.rot = ant, np.asarray(rot, float)

    def field(self, r):
        return self.ant.field(np.asarray(r) @ self.rot) @ self.rot.T

    def field_tp(self, theta_deg, phi_deg):
        r, _, _ = unit_vectors(theta_deg, phi_deg)
        return project(self.field(r), theta_deg, phi_deg)


# ---------------------------------------------------------------- random-field simulation
def simulate(ants, env, n_real=20000, n_waves=100, seed=7):
    """Received amplitudes of each antenna in n_real realisations of n_waves plane waves: V waves
    (share w_v of the power, directions from P_theta) couple to E_theta, H waves (w_h, P_phi) to
    E_phi, random phases, world frame (conventions.md). Directions are drawn from the continuous
    densities by rejection from the uniform sphere and the field is the closed form (no grid)."""
    rng = np.random.default_rng(seed)
    wv, wh = env.weights()
    nv = int(round(n_waves * wv)) if wh > 0 else n_waves
    nv = min(max(nv, 1 if wv > 0 else 0), n_waves - (1 if wh > 0 else 0))
    out = np.zeros((len(ants), n_real), complex)
    for which, count, share in (("v", nv, wv), ("h", n_waves - nv, wh)):
        if count == 0:
            continue
        t, p = _draw_directions(rng, env, which, n_real * count)
        amp = math.sqrt(share / count) * np.exp(2j * math.pi * rng.random(t.size))
        for i, ant in enumerate(ants):
            et, ep = ant.field_tp(t, p)
            comp = et if which == "v" else ep
            out[i] += (amp * comp).reshape(n_real, count).sum(1)
    return out


def _draw_directions(rng, env, which, n):
    peak = float(env.density(which, np.linspace(0, 180, 3601)).max())
    t_out, p_out, have = [], [], 0
    while have < n:
        m = 2 * (n - have) + 1000
        t = np.degrees(np.arccos(rng.uniform(-1, 1, m)))
        keep = rng.random(m) * peak < env.density(which, t)
        t_out.append(t[keep])
        p_out.append(rng.uniform(0, 360, keep.sum()))
        have += int(keep.sum())
    return np.concatenate(t_out)[:n], np.concatenate(p_out)[:n]


# ---------------------------------------------------------------- phase centre (Hu 1961)
def fit_phase_centre(theta_deg, phi_deg, e_co, weight):
    """Power-weighted least squares of psi = psi0 + 2 pi r.d (d in wavelengths) on the unwrapped
    co-polar phase; the phase is unwrapped against a first guess of zero displacement."""
    r, _, _ = unit_vectors(theta_deg, phi_deg)
    psi = np.angle(e_co)
    ref = psi.ravel()[np.argmax(weight)]
    psi = ref + np.angle(np.exp(1j * (psi - ref)))
    a = np.column_stack([np.ones(psi.size), 2 * math.pi * r.reshape(-1, 3)])
    w = np.sqrt(np.asarray(weight, float).ravel())
    sol, *_ = np.linalg.lstsq(a * w[:, None], psi.ravel() * w, rcond=None)
    return sol[1:]
