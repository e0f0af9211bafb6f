#include "pattern/phase_centre.hpp"

#include <algorithm>
#include <atomic>
#include <cmath>
#include <cstdint>
#include <cstring>
#include <mutex>
#include <optional>
#include <utility>
#include <vector>

#include "pattern/integrate.hpp"
#include "pattern/interpolate.hpp"
#include "pattern/parallel.hpp"
#include "pattern/power_queue.hpp"

namespace ellipsa {

namespace {

// sin and cos of every theta and phi of a grid, so a pass over the samples does not call them per
// sample (the same values, so the same results as direction(), theta_hat() and phi_hat()).
struct GridTrig {
    std::vector<double> st, ct, sp, cp;
    explicit GridTrig(const Grid& g) {
        for (int i = 0; i < g.theta.count; ++i) {
            const double t = g.theta.value_deg(i) * deg;
            st.push_back(std::sin(t));
            ct.push_back(std::cos(t));
        }
        for (int j = 0; j < g.phi.count; ++j) {
            const double p = g.phi.value_deg(j) * deg;
            sp.push_back(std::sin(p));
            cp.push_back(std::cos(p));
        }
    }
    Vec3 dir(int i, int j) const { return {st[i] * cp[j], st[i] * sp[j], ct[i]}; }
    Vec3 theta_hat(int i, int j) const { return {ct[i] * cp[j], ct[i] * sp[j], -st[i]}; }
    Vec3 phi_hat(int j) const { return {-sp[j], cp[j], 0.0}; }
};

// One row (sines and cosines st, ct of its theta) of the co-polar field below, in real arithmetic
// (no complex multiply's checks for infinities): the operations of the complex expressions there
// (dot, projection, conj(u) . e / |u|) in the same order, so the same values bit for bit while no
// product overflows (fields below 1e100, see copolar_field). g++ 12 does not vectorise the loop
// (sqrt may set errno, and the division is conditional); -fno-math-errno alone did not change that.
void copolar_row(const CVec3& p, double st, double ct, const GridTrig& tr, const double* et, const double* ep, double* co,
                 double* power) {
    const double pxr = p.x.real(), pxi = p.x.imag(), pyr = p.y.real(), pyi = p.y.imag(), pzr = p.z.real(), pzi = p.z.imag();
    const std::size_t n = tr.sp.size();
    for (std::size_t j = 0; j < n; ++j) {
        const double sp = tr.sp[j], cp = tr.cp[j];
        const double rx = st * cp, ry = st * sp, rz = ct;                                   // tr.dir
        const double prr = pxr * rx + pyr * ry + pzr * rz, pri = pxi * rx + pyi * ry + pzi * rz;  // dot(p, r)
        const double uxr = pxr - prr * rx, uxi = pxi - pri * rx, uyr = pyr - prr * ry, uyi = pyi - pri * ry;
        const double uzr = pzr - prr * rz, uzi = pzi - pri * rz;
        const double nu = std::sqrt((uxr * uxr + uxi * uxi) + (uyr * uyr + uyi * uyi) + (uzr * uzr + uzi * uzi));
        const double thx = ct * cp, thy = ct * sp, thz = -st, phx = -sp, phy = cp, phz = 0.0;  // theta_hat, phi_hat
        const double etr = et[2 * j], eti = et[2 * j + 1], epr = ep[2 * j], epi = ep[2 * j + 1];
        const double exr = etr * thx + epr * phx, exi = eti * thx + epi * phx, eyr = etr * thy + epr * phy;
        const double eyi = eti * thy + epi * phy, ezr = etr * thz + epr * phz, ezi = eti * thz + epi * phz;
        const double sr = (uxr * exr - (-uxi) * exi) + (uyr * eyr - (-uyi) * eyi) + (uzr * ezr - (-uzi) * ezi);
        const double si = (uxr * exi + (-uxi) * exr) + (uyr * eyi + (-uyi) * eyr) + (uzr * ezi + (-uzi) * ezr);
        const bool has = nu > 1e-9;  // else the reference polarisation points along r: no co-polar part
        const double cr = has ? sr / nu : 0.0, ci = has ? si / nu : 0.0;
        co[2 * j] = cr;
        co[2 * j + 1] = ci;
        power[j] = cr * cr + ci * ci;  // std::norm's arithmetic
    }
}

// Co-polar field u(r)^H E(r) at every sample (u: the peak's polarisation carried to r), and its
// power |co|^2 (power). A row whose every sample's total power lies below the region's level
// (phase_centre_region_db under the peak's) cannot join the region, since |co| <= |E|: its co-polar
// field is left zero instead of computed, which changes nothing the estimate reads.
void copolar_field(const Grid& g, const GridTrig& tr, const FarField& f, std::vector<cplx>& co, std::vector<double>& power) {
    std::size_t best = 0;
    double best_p = -1;
    bool moderate = true;  // every |E|^2 below 1e200 (no NaN): copolar_row's condition
    const int pc = g.phi.count;
    std::vector<double> row_top(std::size_t(g.theta.count), 0.0);  // each row's largest power
    for (int i = 0; i < g.theta.count; ++i) {
        double top = 0;
        for (std::size_t k = g.index(i, 0), e = k + std::size_t(pc); k < e; ++k) {
            const double p = ellipsa::power(f.e_theta[k], f.e_phi[k]);
            moderate &= p < 1e200;
            top = std::max(top, p);
            if (p > best_p) best_p = p, best = k;
        }
        row_top[std::size_t(i)] = top;
    }
    const CVec3 e0 = cartesian_at(g, f, int(best / std::size_t(pc)), int(best % std::size_t(pc)));
    const double n0 = std::sqrt(std::norm(e0.x) + std::norm(e0.y) + std::norm(e0.z));
    co.assign(g.size(), cplx(0, 0));
    power.assign(g.size(), 0.0);
    if (!(n0 > 0)) return;
    const CVec3 p = (1.0 / n0) * e0;
    // Below this, a sample's co-polar power is under the region's level whatever rounding does
    // (the co-polar peak is the total peak, to rounding; the margin is a millionth).
    const double below = best_p * std::pow(10.0, -phase_centre_region_db / 10) * (1 - 1e-6);
    for (int i = 0; i < g.theta.count; ++i) {
        const std::size_t row = g.index(i, 0);
        if (moderate) {  // std::complex's layout: re, im
            if (row_top[std::size_t(i)] < below) continue;
            copolar_row(p, tr.st[i], tr.ct[i], tr, reinterpret_cast<const double*>(f.e_theta.data() + row),
                        reinterpret_cast<const double*>(f.e_phi.data() + row), reinterpret_cast<double*>(co.data() + row),
                        power.data() + row);
            continue;
        }
        for (int j = 0; j < pc; ++j) {
            const Vec3 r = tr.dir(i, j);
            const cplx pr = dot(p, r);
            const CVec3 u{p.x - pr * r.x, p.y - pr * r.y, p.z - pr * r.z};
            const double nu = std::sqrt(std::norm(u.x) + std::norm(u.y) + std::norm(u.z));
            if (!(nu > 1e-9)) continue;  // the reference polarisation points along r: no co-polar part
            const std::size_t k = g.index(i, j);
            const CVec3 e = f.e_theta[k] * tr.theta_hat(i, j) + f.e_phi[k] * tr.phi_hat(j);  // cartesian_at
            co[k] = (std::conj(u.x) * e.x + std::conj(u.y) * e.y + std::conj(u.z) * e.z) / nu;
            power[k] = std::norm(co[k]);
        }
    }
}

// std::round (halves away from zero, the sign kept) without the library call it costs on the
// baseline x86-64 instruction set; the same result for every double.
double round_half_away(double x) {
    if (!(std::abs(x) < 0x1p52)) return std::round(x);  // integral already, or NaN
    const auto n = static_cast<std::int64_t>(x);  // toward zero, exact here
    const double f = x - double(n);               // exact: |x| < 2^52
    const double r = double(n + (f >= 0.5) - (f <= -0.5));
    return std::copysign(r, x);
}

// What unwrap_region finds of a sample.
enum RegionState : unsigned char { below_level, candidate, in_region };

// a - 2 pi round(a / 2 pi). Within +-3 radians the rounding gives (signed) zero, so the result is
// a + 0.0 (a, with -0 made +0, as a - 2 pi * (-0) makes it): the same bits, without the divide.
double wrap_pi(double a) {
    if (std::abs(a) < 3.0) return a + 0.0;
    return a - 2 * pi * round_half_away(a / (2 * pi));
}

// Quality-guided unwrapping from the co-polar peak over the samples within the region's level.
// power: |co|^2 of every sample (copolar_field); psi: unwrapped phase (rad) where region is
// in_region (elsewhere unset); region: of every sample, whether it is in the region (in_region), at
// or above the level but not reached from the peak (a candidate, ruled out), or below the level.
// The phases of the samples that may join (at or above the level) are taken in one pass over the
// grid first: the walk then reads 16 bytes a sample (power and phase) in the order it finds
// them, instead of the 16-byte complex value and an atan2 waiting on it.
void unwrap_region(const Grid& g, const std::vector<cplx>& co, const std::vector<double>& power, std::vector<double>& psi,
                   std::vector<unsigned char>& region, PowerQueue& heap) {
    std::size_t peak = 0;
    for (std::size_t k = 0; k < co.size(); ++k)
        if (power[k] > power[peak]) peak = k;
    const double floor = power[peak] * std::pow(10.0, -phase_centre_region_db / 10);
    psi.resize(co.size());
    region.assign(co.size(), below_level);
    if (!(power[peak] > 0)) return;
    for (std::size_t k = 0; k < co.size(); ++k)  // the phase of each sample that may join; psi once it has
        if (power[k] >= floor) {
            psi[k] = std::arg(co[k]);
            region[k] = candidate;
        }
    const int nt = g.theta.count, np = g.phi.count;
    const bool wraps = g.phi_wraps();
    heap.reset(floor, power[peak]);
    region[peak] = in_region;
    heap.push({power[peak], std::uint32_t(peak / std::size_t(np)), std::uint32_t(peak % std::size_t(np))});
    while (!heap.empty()) {
        const PowerQueue::Entry e = heap.pop();
        const int i = int(e.i), j = int(e.j);
        const double here = psi[g.index(i, j)];
        const int di[4] = {-1, 1, 0, 0}, dj[4] = {0, 0, -1, 1};
        for (int n = 0; n < 4; ++n) {
            const int a = i + di[n];
            int b = j + dj[n];
            if (a < 0 || a >= nt) continue;
            if (b < 0 || b >= np) {
                if (!wraps) continue;
                b = (b + np) % np;
            }
            const std::size_t m = g.index(a, b);
            if (region[m] != candidate) continue;
            psi[m] = here + wrap_pi(psi[m] - here);
            region[m] = in_region;
            heap.push({power[m], std::uint32_t(a), std::uint32_t(b)});
        }
    }
}

// Symmetric 3x3 eigen-decomposition by Jacobi rotations: a = V diag(w) V^T.
void eigen_symmetric(double a[3][3], double w[3], double v[3][3]) {
    for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j) v[i][j] = i == j ? 1 : 0;
    for (int sweep = 0; sweep < 50; ++sweep) {
        const double off = a[0][1] * a[0][1] + a[0][2] * a[0][2] + a[1][2] * a[1][2];
        if (off < 1e-30 * (a[0][0] * a[0][0] + a[1][1] * a[1][1] + a[2][2] * a[2][2]) || off == 0) break;
        for (int p = 0; p < 2; ++p)
            for (int q = p + 1; q < 3; ++q) {
                if (a[p][q] == 0) continue;
                const double theta = (a[q][q] - a[p][p]) / (2 * a[p][q]);
                const double t = (theta >= 0 ? 1 : -1) / (std::abs(theta) + std::sqrt(theta * theta + 1));
                const double c = 1 / std::sqrt(t * t + 1), s = t * c;
                for (int k = 0; k < 3; ++k) {  // columns p, q
                    const double akp = a[k][p], akq = a[k][q];
                    a[k][p] = c * akp - s * akq;
                    a[k][q] = s * akp + c * akq;
                }
                for (int k = 0; k < 3; ++k) {  // rows p, q
                    const double apk = a[p][k], aqk = a[q][k];
                    a[p][k] = c * apk - s * aqk;
                    a[q][k] = s * apk + c * aqk;
                }
                for (int k = 0; k < 3; ++k) {
                    const double vkp = v[k][p], vkq = v[k][q];
                    v[k][p] = c * vkp - s * vkq;
                    v[k][q] = s * vkp + c * vkq;
                }
            }
    }
    for (int i = 0; i < 3; ++i) w[i] = a[i][i];
}

// Weighted least squares psi ~ psi0 + a . r over the region, centred on the weighted mean
// direction so that psi0 and a separate; a = 2 pi d / lambda. Every sum runs over the region's
// samples in index order (row by row).
PhaseCentre fit_linear_phase(const Grid& g, const GridTrig& tr, const std::vector<double>& power, const std::vector<double>& psi,
                             const std::vector<unsigned char>& region) {
    const CellWeights cw = cell_weights(g);
    const int nt = g.theta.count, np = g.phi.count;
    auto each = [&](auto&& f) {  // f(sample, its direction, its weight) over the region
        for (int i = 0; i < nt; ++i)
            for (int j = 0; j < np; ++j) {
                const std::size_t k = g.index(i, j);
                if (region[k] == in_region) f(k, tr.dir(i, j), power[k] * cw.theta[std::size_t(i)] * cw.phi[std::size_t(j)]);
            }
    };
    double sw = 0, spsi = 0;
    Vec3 sr{};
    PhaseCentre out;
    each([&](std::size_t k, const Vec3& r, double w) {
        ++out.samples;
        sw += w;
        spsi += w * psi[k];
        sr = sr + w * r;
    });
    if (!(sw > 0)) return out;
    const Vec3 rm = (1 / sw) * sr;
    const double pm = spsi / sw;
    double c[3][3] = {}, b[3] = {};
    each([&](std::size_t k, const Vec3& r, double w) {
        const Vec3 d = r - rm;
        const double x[3] = {d.x, d.y, d.z};
        for (int u = 0; u < 3; ++u) {
            b[u] += w * x[u] * (psi[k] - pm);
            for (int v = 0; v < 3; ++v) c[u][v] += w * x[u] * x[v];
        }
    });
    double ev[3], v[3][3];
    eigen_symmetric(c, ev, v);
    const double top = std::max({ev[0], ev[1], ev[2]});
    double a[3] = {0, 0, 0};
    for (int e = 0; e < 3; ++e) {
        if (!(ev[e] > 1e-9 * top)) {
            ++out.unresolved_axes;
            continue;
        }
        const double proj = (v[0][e] * b[0] + v[1][e] * b[1] + v[2][e] * b[2]) / ev[e];
        for (int i = 0; i < 3; ++i) a[i] += proj * v[i][e];
    }
    const Vec3 av{a[0], a[1], a[2]};
    const double psi0 = pm - dot(av, rm);
    double ss = 0;
    each([&](std::size_t k, const Vec3& r, double w) {
        const double e = psi[k] - psi0 - dot(av, r);
        ss += w * e * e;
    });
    out.centre_wl = (1 / (2 * pi)) * av;
    out.constant_deg = wrap_pi(psi0) / deg;
    out.residual_deg = std::sqrt(ss / sw) / deg;
    return out;
}

// ---- Estimates already made ----
// Loading a pattern estimates each frequency's phase centre for interpolation, and `info` then
// prints the same estimates: a second call for the same samples finds the first one's result.
// The key is a 128-bit fingerprint of all that the estimate reads (the grid and every sample's
// bytes), one pass over the samples at a tenth of the estimate's cost.
struct Fingerprint {
    std::uint64_t a = 0, b = 0;
    bool operator==(const Fingerprint& o) const { return a == o.a && b == o.b; }
};

// Four independent lanes of two mixing chains each, so that the multiplies overlap (one chain
// over every word waited on each multiply in turn); the lanes are folded at the end.
class FingerprintLanes {
public:
    void add(std::uint64_t w, int lane) {
        std::uint64_t& x = a_[lane];
        std::uint64_t& y = b_[lane];
        x = (x ^ w) * 0x9E3779B97F4A7C15ull;
        x ^= x >> 29;
        y = (y + w) * 0xC2B2AE3D27D4EB4Full;
        y ^= y >> 31;
    }
    void add(double x) { add(bits(x), 0); }
    void add(const std::vector<cplx>& v) {
        add(std::uint64_t(v.size()), 0);
        const double* d = reinterpret_cast<const double*>(v.data());  // re, im of each (std::complex's layout)
        const std::size_t n = 2 * v.size(), four = n - n % 4;
        for (std::size_t k = 0; k < four; k += 4)
            for (int lane = 0; lane < 4; ++lane) add(bits(d[k + std::size_t(lane)]), lane);
        for (std::size_t k = four; k < n; ++k) add(bits(d[k]), 0);
    }
    Fingerprint fold() {
        for (int lane = 1; lane < 4; ++lane) {
            add(a_[lane], 0);
            add(b_[lane], 0);
        }
        return {a_[0], b_[0]};
    }

private:
    static std::uint64_t bits(double x) {
        std::uint64_t w;
        std::memcpy(&w, &x, sizeof w);
        return w;
    }
    std::uint64_t a_[4] = {0x243F6A8885A308D3ull, 0xA4093822299F31D0ull, 0x082EFA98EC4E6C89ull, 0x452821E638D01377ull};
    std::uint64_t b_[4] = {0x13198A2E03707344ull, 0xBE5466CF34E90C6Cull, 0xC0AC29B7C97C50DDull, 0x3F84D5B5B5470917ull};
};

Fingerprint fingerprint(const Grid& g, const FarField& f) {
    FingerprintLanes h;
    for (const AngleAxis* x : {&g.theta, &g.phi}) {
        h.add(x->start_deg);
        h.add(x->step_deg);
        h.add(std::uint64_t(x->count), 0);
    }
    h.add(std::uint64_t(g.sampling), 0);
    h.add(f.e_theta);
    h.add(f.e_phi);
    return h.fold();
}

// The last estimates (at most 64; the oldest half dropped when full), shared by all threads.
struct EstimateMemo {
    std::mutex lock;
    std::vector<std::pair<Fingerprint, Result<PhaseCentre>>> items;
};
EstimateMemo& estimate_memo() {
    static EstimateMemo m;
    return m;
}

std::optional<Result<PhaseCentre>> remembered(const Fingerprint& key) {
    EstimateMemo& m = estimate_memo();
    const std::lock_guard<std::mutex> hold(m.lock);
    for (const auto& [k, r] : m.items)
        if (k == key) return r;
    return std::nullopt;
}

void remember(const Fingerprint& key, const Result<PhaseCentre>& r) {
    EstimateMemo& m = estimate_memo();
    const std::lock_guard<std::mutex> hold(m.lock);
    if (m.items.size() >= 64) m.items.erase(m.items.begin(), m.items.begin() + 32);
    m.items.emplace_back(key, r);
}

// The arrays of one estimate, kept by a caller that makes several in turn (set_interpolation_centres:
// one for each of its threads) so that the next estimate finds them allocated.
struct EstimateScratch {
    std::vector<cplx> co;
    std::vector<double> power, psi;
    std::vector<unsigned char> region;
    PowerQueue queue;
};

Result<PhaseCentre> estimate_afresh(const Grid& g, const FarField& f, EstimateScratch& w) {
    const GridTrig tr(g);
    copolar_field(g, tr, f, w.co, w.power);
    unwrap_region(g, w.co, w.power, w.psi, w.region, w.queue);
    PhaseCentre pc = fit_linear_phase(g, tr, w.power, w.psi, w.region);
    if (pc.samples < 4)
        return Error{"", 0, 0, "the main beam holds fewer than 4 samples (or the field is zero): too few to fit a phase centre"};
    if (pc.unresolved_axes == 3) return Error{"", 0, 0, "the main beam's samples do not resolve any direction"};
    return pc;
}

Result<PhaseCentre> estimate_with(const FarFieldSet& s, std::size_t fi, EstimateScratch& scratch) {
    if (!s.has_phase())
        return Error{"", 0, 0, std::string("the phase centre needs the phase of the field; the data are ") +
                                   to_string(s.content)};
    if (fi >= s.frequencies.size() || s.grid.size() == 0) return Error{"", 0, 0, "no samples at this frequency"};
    const Fingerprint key = fingerprint(s.grid, s.frequencies[fi]);
    if (auto r = remembered(key)) return *r;
    Result<PhaseCentre> r = estimate_afresh(s.grid, s.frequencies[fi], scratch);
    remember(key, r);
    return r;
}

}  // namespace

Result<PhaseCentre> estimate_phase_centre(const FarFieldSet& s, std::size_t fi) {
    EstimateScratch scratch;
    return estimate_with(s, fi, scratch);
}

void move_phase_reference(const Grid& g, FarField& f, Vec3 c_wl) {
    for (int i = 0; i < g.theta.count; ++i) {
        const double t = g.theta.value_deg(i) * deg;
        for (int j = 0; j < g.phi.count; ++j) {
            const cplx turn = std::polar(1.0, -2 * pi * dot(direction(t, g.phi.value_deg(j) * deg), c_wl));
            const std::size_t k = g.index(i, j);
            f.e_theta[k] *= turn;
            f.e_phi[k] *= turn;
        }
    }
    f.interpolation_centre_wl = f.interpolation_centre_wl - c_wl;
    f.reference_shift_wl = f.reference_shift_wl + c_wl;
}

void set_interpolation_centres(FarFieldSet& s) {
    if (!s.has_phase()) return;
    // One frequency a task: each estimate reads only its own frequency and writes only its own
    // centre. Each thread takes the next frequency in turn and keeps its arrays from one to the next.
    const std::size_t n = s.frequencies.size(), threads = std::min(parallel_threads(), n);
    std::atomic<std::size_t> next{0};
    parallel_blocks(threads, 1, [&](std::size_t a, std::size_t b) {
        EstimateScratch scratch;
        for (std::size_t t = a; t < b; ++t)  // one block of one thread each
            for (std::size_t k = next++; k < n; k = next++) {
                auto pc = estimate_with(s, k, scratch);
                s.frequencies[k].interpolation_centre_wl = pc ? pc->centre_wl : Vec3{};
            }
    });
}

}  // namespace ellipsa
