#include "pattern/fading.hpp"

#include <algorithm>
#include <array>
#include <atomic>
#include <cmath>
#include <cstdio>
#include <thread>

#include "pattern/diversity.hpp"
#include "pattern/integrate.hpp"
#include "pattern/interpolate.hpp"
#include "pattern/marcum.hpp"
#include "pattern/random.hpp"

namespace ellipsa {

namespace {

Error fail(std::string msg) { return Error{"", 0, 0, std::move(msg)}; }

constexpr std::size_t block_size = 4096;
constexpr int phase_count = 2048;  // phases drawn from the low 11 bits of a 64-bit word
constexpr std::size_t max_antennas = 16;

// What the simulation needs of the antennas, on the common grid.
struct Tables {
    const Grid* grid = nullptr;
    std::size_t antennas = 0;
    // Fixed orientation: the received amplitude per unit wave, per cell and antenna
    // ([cell * antennas + a]); the last cell stands for "outside the sampled region" (zero).
    std::vector<cplx> v_field, h_field;
    // Turning: the Cartesian field per grid sample and antenna ([sample * antennas + a]) and the
    // direction and polarisation vectors of every cell.
    std::vector<CVec3> cartesian;
    std::vector<Vec3> direction, v_hat, h_hat;
    std::vector<cplx> dominant;  // E_a(d0) . p per antenna (fixed orientation)
};

// The direction sampling. The environments are uniform in azimuth and the grid's cell weights
// are a product (theta row times phi column), so a cell is drawn as a row from the row weights
// (density times row weight, one alias table per polarisation, with a last entry for power
// arriving outside the sampled rows or columns) and a column from the column weights: the same
// distribution as drawing among all cells, from tables small enough to stay in cache.
struct Sampling {
    AliasTable v_rows, h_rows, columns;
    std::size_t outside_row = 0;  // index of the "outside" entry of the row tables
    int v_waves = 0, h_waves = 0;
    double v_amplitude = 0, h_amplitude = 0;  // sqrt(power per wave)
};

std::array<cplx, phase_count> phase_table() {
    std::array<cplx, phase_count> t;
    for (int k = 0; k < phase_count; ++k) t[std::size_t(k)] = std::polar(1.0, 2 * pi * k / phase_count);
    return t;
}

Status check_antenna(const FadingAntenna& a, const Environment& e, const FadingOptions& o) {
    const FarFieldSet& s = *a.set;
    if (a.freq_index >= s.frequencies.size()) return fail("no such frequency");
    if (s.content == FieldContent::total_only && !polarisation_blind(e))
        return fail("total-only data has no vertical/horizontal split; it can be simulated only in a "
                    "polarisation-blind environment (XPR 0 dB, the same V and H density)");
    if (!s.has_phase() && (o.dominant || o.random_tilt_max_deg))
        return fail(std::string(o.dominant ? "a dominant wave" : "turning the antenna") +
                    " needs the phase between E_theta and E_phi; this data has " + to_string(s.content) + " data");
    if (o.random_tilt_max_deg && !is_full_sphere(s.grid))
        return fail("turning the antenna needs the full sphere; this grid covers only part of it");
    return Ok{};
}

// The antennas' fields on the common grid, scaled to gain (pattern/diversity.hpp gain_scale).
Result<std::vector<FarField>> fields_on_grid(const std::vector<FadingAntenna>& ants, const Grid& g,
                                             std::vector<double>& factor) {
    std::vector<FarField> out;
    for (std::size_t a = 0; a < ants.size(); ++a) {
        const FarFieldSet& s = *ants[a].set;
        auto scale = gain_scale(s, ants[a].freq_index);
        if (!scale) return Error{"", 0, 0, "antenna " + std::to_string(a + 1) + ": " + scale.error().message};
        factor.push_back(scale->factor);
        FarField f;
        if (same_grid(s.grid, g)) {
            f = s.frequencies[ants[a].freq_index];
        } else {
            auto r = resample_field(s, ants[a].freq_index, g);
            if (!r) return Error{"", 0, 0, "antenna " + std::to_string(a + 1) + " " + r.error().message + " of antenna 1"};
            f = std::move(*r);
        }
        const double k = std::sqrt(scale->factor);
        for (cplx& v : f.e_theta) v *= k;
        for (cplx& v : f.e_phi) v *= k;
        out.push_back(std::move(f));
    }
    return out;
}

// Alias tables over rows and columns, weighted exactly as the MEG integral weights the cells.
Result<Sampling> direction_sampling(const Environment& e, const Grid& g, int waves) {
    auto env = sample_environment(e, g);
    if (!env) return env.error();
    const CellWeights cw = cell_weights(g);
    std::vector<double> wv(std::size_t(g.theta.count) + 1, 0.0), wh(wv.size(), 0.0);
    double col_sum = 0;
    for (double w : cw.phi) col_sum += w;
    double sv = 0, sh = 0;
    for (int i = 0; i < g.theta.count; ++i) {
        const std::size_t k = g.index(i, 0);  // the densities are the same along a row
        sv += wv[std::size_t(i)] = env->p_theta[k] * cw.theta[std::size_t(i)] * col_sum;
        sh += wh[std::size_t(i)] = env->p_phi[k] * cw.theta[std::size_t(i)] * col_sum;
    }
    // Power that arrives outside the sampled region meets no field.
    wv.back() = std::max(0.0, 1 - sv);
    wh.back() = std::max(0.0, 1 - sh);
    Sampling s{AliasTable(wv), AliasTable(wh), AliasTable(cw.phi)};
    s.outside_row = std::size_t(g.theta.count);
    const bool both = env->w_v > 0 && env->w_h > 0;
    if (both && waves < 2) return fail("with both polarisations in the environment, at least 2 waves per realisation");
    s.v_waves = env->w_v <= 0 ? 0 : env->w_h <= 0 ? waves : std::clamp(int(std::lround(waves * env->w_v)), 1, waves - 1);
    s.h_waves = waves - s.v_waves;
    if (s.v_waves > 0) s.v_amplitude = std::sqrt(env->w_v / s.v_waves);
    if (s.h_waves > 0) s.h_amplitude = std::sqrt(env->w_h / s.h_waves);
    return s;
}

// One wave's cell (grid index), or the grid size for "outside"; the low 11 bits of `phase_bits`
// are left for the phase.
std::size_t draw_cell(const Sampling& s, const AliasTable& rows, const Grid& g, std::uint64_t row_bits,
                      std::uint64_t column_bits) {
    const std::size_t i = rows.draw_bits(row_bits);
    if (i >= s.outside_row) return g.size();
    return g.index(int(i), int(s.columns.draw_bits(column_bits)));
}

Tables fixed_tables(const Grid& g, const std::vector<FarField>& f) {
    Tables t;
    t.grid = &g;
    t.antennas = f.size();
    const std::size_t n = g.size(), A = f.size();
    t.v_field.assign((n + 1) * A, cplx(0));
    t.h_field.assign((n + 1) * A, cplx(0));
    for (std::size_t k = 0; k < n; ++k)
        for (std::size_t a = 0; a < A; ++a) {
            t.v_field[k * A + a] = f[a].e_theta[k];
            t.h_field[k * A + a] = f[a].e_phi[k];
        }
    return t;
}

Tables turning_tables(const Grid& g, const std::vector<FarField>& f) {
    Tables t;
    t.grid = &g;
    t.antennas = f.size();
    const std::size_t A = f.size();
    t.cartesian.resize(g.size() * A);
    t.direction.resize(g.size());
    t.v_hat.resize(g.size());
    t.h_hat.resize(g.size());
    for (int i = 0; i < g.theta.count; ++i)
        for (int j = 0; j < g.phi.count; ++j) {
            const std::size_t k = g.index(i, j);
            const double th = g.theta.value_deg(i) * deg, ph = g.phi.value_deg(j) * deg;
            t.direction[k] = direction(th, ph);
            t.v_hat[k] = theta_hat(th, ph);
            t.h_hat[k] = phi_hat(ph);
            for (std::size_t a = 0; a < A; ++a) t.cartesian[k * A + a] = cartesian_at(g, f[a], i, j);
        }
    return t;
}

// Everything one block of realisations reads, and where it writes.
struct Run {
    const Tables& t;
    const Sampling& s;
    const FadingOptions& o;
    std::array<cplx, phase_count> phases;
    double diffuse_scale = 1, dominant_scale = 0;
    Vec3 dominant_dir;
    CVec3 dominant_field;
    cplx* amp;  // [a * realisations + n]
};

cplx dot_plain(const CVec3& a, const CVec3& b) { return a.x * b.x + a.y * b.y + a.z * b.z; }

// acc += c * v in plain arithmetic: std::complex's operator* checks for NaN and infinity through a
// library call (C99 Annex G), which costs more than the whole wave in the inner loop.
inline void add_product(cplx& acc, cplx c, cplx v) {
    acc = {acc.real() + c.real() * v.real() - c.imag() * v.imag(), acc.imag() + c.real() * v.imag() + c.imag() * v.real()};
}

CVec3 rotate_transposed(const Mat3& r, const CVec3& v) {
    return {r.m[0][0] * v.x + r.m[1][0] * v.y + r.m[2][0] * v.z, r.m[0][1] * v.x + r.m[1][1] * v.y + r.m[2][1] * v.z,
            r.m[0][2] * v.x + r.m[1][2] * v.y + r.m[2][2] * v.z};
}

// R = R_z(azimuth) R_x(tilt) R_z(roll) with cos(tilt) uniform in [cos(tilt_max), 1] and the two
// turns uniform: the up axis uniform over the cap, every roll alike (tilt_max 180: uniform over
// all rotations, the Haar measure in z-x-z Euler angles).
Mat3 random_rotation(Xoshiro256& rng, double tilt_max_deg) {
    const double c = 1 - rng.uniform() * (1 - std::cos(tilt_max_deg * deg));
    const double az = 2 * pi * rng.uniform(), roll = 2 * pi * rng.uniform();
    return rotation_z(az) * rotation_x(std::acos(std::clamp(c, -1.0, 1.0))) * rotation_z(roll);
}

void simulate_fixed(const Run& r, std::size_t block) {
    const std::size_t N = r.o.realisations, A = r.t.antennas;
    Xoshiro256 rng(r.o.seed, block);
    const std::size_t n1 = std::min(N, (block + 1) * block_size);
    for (std::size_t n = block * block_size; n < n1; ++n) {
        std::array<cplx, max_antennas> acc{};
        for (int pol = 0; pol < 2; ++pol) {
            const AliasTable& rows = pol == 0 ? r.s.v_rows : r.s.h_rows;
            const cplx* field = (pol == 0 ? r.t.v_field : r.t.h_field).data();
            const int count = pol == 0 ? r.s.v_waves : r.s.h_waves;
            const double amplitude = pol == 0 ? r.s.v_amplitude : r.s.h_amplitude;
            for (int w = 0; w < count; ++w) {
                const std::uint64_t bits = rng.next();
                const cplx c = amplitude * r.phases[bits & (phase_count - 1)];
                const cplx* row = field + draw_cell(r.s, rows, *r.t.grid, bits, rng.next()) * A;
                for (std::size_t a = 0; a < A; ++a) add_product(acc[a], c, row[a]);
            }
        }
        if (r.o.dominant) {
            const cplx c = r.dominant_scale * r.phases[rng.next() & (phase_count - 1)];
            for (std::size_t a = 0; a < A; ++a) {
                acc[a] *= r.diffuse_scale;
                add_product(acc[a], c, r.t.dominant[a]);
            }
        }
        for (std::size_t a = 0; a < A; ++a) r.amp[a * N + n] = acc[a];
    }
}

// The turned antennas' Cartesian fields toward antenna-frame direction u, added with weight c
// after projection on q (no conjugate): acc[a] += c * E_a(u) . q.
void add_turned(const Tables& t, Vec3 u, const CVec3& q, cplx c, std::array<cplx, max_antennas>& acc) {
    double th, ph;
    to_spherical(u, th, ph);
    GridStencil st;
    if (!grid_stencil(*t.grid, th / deg, ph / deg, st)) return;
    const std::size_t A = t.antennas;
    for (int i = 0; i < 2; ++i)
        for (int j = 0; j < 2; ++j) {
            const double w = st.w[i][j];
            if (w == 0) continue;
            const CVec3* e = t.cartesian.data() + t.grid->index(st.i_theta[i], st.i_phi[j]) * A;
            for (std::size_t a = 0; a < A; ++a) add_product(acc[a], c * w, dot_plain(e[a], q));
        }
}

void simulate_turned(const Run& r, std::size_t block) {
    const std::size_t N = r.o.realisations, A = r.t.antennas, outside = r.t.direction.size();
    Xoshiro256 rng(r.o.seed, block);
    const std::size_t n1 = std::min(N, (block + 1) * block_size);
    for (std::size_t n = block * block_size; n < n1; ++n) {
        const Mat3 rot = random_rotation(rng, *r.o.random_tilt_max_deg);
        std::array<cplx, max_antennas> acc{};
        for (int pol = 0; pol < 2; ++pol) {
            const AliasTable& rows = pol == 0 ? r.s.v_rows : r.s.h_rows;
            const std::vector<Vec3>& hat = pol == 0 ? r.t.v_hat : r.t.h_hat;
            const int count = pol == 0 ? r.s.v_waves : r.s.h_waves;
            const double amplitude = pol == 0 ? r.s.v_amplitude : r.s.h_amplitude;
            for (int w = 0; w < count; ++w) {
                const std::uint64_t bits = rng.next();
                const std::size_t k = draw_cell(r.s, rows, *r.t.grid, bits, rng.next());
                if (k >= outside) continue;
                const Vec3 p = apply_transposed(rot, hat[k]);
                add_turned(r.t, apply_transposed(rot, r.t.direction[k]), CVec3{p.x, p.y, p.z},
                           amplitude * r.phases[bits & (phase_count - 1)], acc);
            }
        }
        if (r.o.dominant) {
            for (std::size_t a = 0; a < A; ++a) acc[a] *= r.diffuse_scale;
            const cplx c = r.dominant_scale * r.phases[rng.next() & (phase_count - 1)];
            add_turned(r.t, apply_transposed(rot, r.dominant_dir), rotate_transposed(rot, r.dominant_field), c, acc);
        }
        for (std::size_t a = 0; a < A; ++a) r.amp[a * N + n] = acc[a];
    }
}

// Runs every block on `threads` threads; blocks are independent streams, so the result is the
// same for any thread count.
void run_blocks(const Run& r, bool turned) {
    const std::size_t blocks = (r.o.realisations + block_size - 1) / block_size;
    std::atomic<std::size_t> next{0};
    auto work = [&] {
        for (std::size_t b = next++; b < blocks; b = next++) (turned ? simulate_turned : simulate_fixed)(r, b);
    };
    std::vector<std::thread> pool;
    for (int k = 1; k < std::min<int>(r.o.threads, int(blocks)); ++k) pool.emplace_back(work);
    work();
    for (std::thread& th : pool) th.join();
}

// The p-quantile of sorted samples (the order statistic ceil(N p)) with its distribution-free 95 %
// interval: the order statistics N p -+ 1.96 sqrt(N p (1 - p)) (normal approximation of the binomial).
LevelEstimate quantile(const std::vector<double>& sorted, double p) {
    const double n = double(sorted.size());
    auto at = [&](double k) { return sorted[std::size_t(std::clamp(k, 1.0, n)) - 1]; };
    const double half = 1.96 * std::sqrt(n * p * (1 - p));
    LevelEstimate e;
    e.outage = p;
    e.level = at(std::ceil(n * p));
    e.ci95 = {at(std::floor(n * p - half)), at(std::ceil(n * p + half) + 1)};
    return e;
}

// The distribution as points at probabilities spaced evenly in log10 from max(10/N, 1e-6) to 1
// (below 10 samples the curve would be mostly noise).
std::vector<CdfPoint> cdf_curve(const std::vector<double>& sorted, int points) {
    const double n = double(sorted.size());
    const double lo = std::log10(std::max(10.0 / n, 1e-6));
    std::vector<CdfPoint> c;
    for (int k = 0; k < points; ++k) {
        const double p = std::pow(10.0, lo * (1 - double(k) / (points - 1)));
        c.push_back({quantile(sorted, p).level, p});
    }
    return c;
}

struct Summary {
    std::vector<LevelEstimate> levels;
    std::vector<CdfPoint> cdf;
};
Summary summarise(std::vector<double> values, const FadingOptions& o) {
    std::sort(values.begin(), values.end());
    Summary s;
    for (double p : o.outages) s.levels.push_back(quantile(values, p));
    s.cdf = cdf_curve(values, o.cdf_points);
    return s;
}

SimulatedAntenna antenna_statistics(const std::vector<double>& power, const FadingOptions& o) {
    SimulatedAntenna a;
    const double n = double(power.size());
    double sum = 0, sum2 = 0;
    for (double x : power) sum += x, sum2 += x * x;
    a.mean = sum / n;
    const double sd = std::sqrt(std::max(0.0, (sum2 - n * a.mean * a.mean) / (n - 1)));
    a.mean_ci95 = {a.mean - 1.96 * sd / std::sqrt(n), a.mean + 1.96 * sd / std::sqrt(n)};
    std::vector<double> sorted = power;
    std::sort(sorted.begin(), sorted.end());
    for (double p : o.outages) a.levels.push_back(quantile(sorted, p));
    a.level_1pct = quantile(sorted, 0.01);
    a.fade_depth_db = 10 * std::log10(a.mean / a.level_1pct.level);
    a.cdf = cdf_curve(sorted, o.cdf_points);
    return a;
}

double pearson(const double* x, const double* y, std::size_t n) {
    double mx = 0, my = 0;
    for (std::size_t k = 0; k < n; ++k) mx += x[k], my += y[k];
    mx /= double(n), my /= double(n);
    double sxy = 0, sxx = 0, syy = 0;
    for (std::size_t k = 0; k < n; ++k) {
        const double dx = x[k] - mx, dy = y[k] - my;
        sxy += dx * dy, sxx += dx * dx, syy += dy * dy;
    }
    return sxx > 0 && syy > 0 ? sxy / std::sqrt(sxx * syy) : 0.0;
}

SimulatedPair pair_statistics(const std::vector<double>& p1, const std::vector<double>& p2, const cplx* r1,
                              const cplx* r2, const FadingOptions& o) {
    SimulatedPair q;
    const std::size_t n = p1.size();
    q.power_correlation = pearson(p1.data(), p2.data(), n);
    // 20 batch means: Student's t with 19 degrees of freedom, 2.093 (statistical tables).
    constexpr int batches = 20;
    double sum = 0, sum2 = 0;
    for (int b = 0; b < batches; ++b) {
        const std::size_t a0 = n * std::size_t(b) / batches, a1 = n * std::size_t(b + 1) / batches;
        const double c = pearson(p1.data() + a0, p2.data() + a0, a1 - a0);
        sum += c, sum2 += c * c;
    }
    const double sd = std::sqrt(std::max(0.0, (sum2 - sum * sum / batches) / (batches - 1)));
    const double half = 2.093 * sd / std::sqrt(double(batches));
    q.power_correlation_ci95 = {q.power_correlation - half, q.power_correlation + half};
    cplx cross = 0;
    double e1 = 0, e2 = 0;
    for (std::size_t k = 0; k < n; ++k) cross += r1[k] * std::conj(r2[k]), e1 += p1[k], e2 += p2[k];
    q.complex_correlation_squared = e1 > 0 && e2 > 0 ? std::norm(cross) / (e1 * e2) : 0.0;
    std::vector<double> sel(n), sum_p(n);
    for (std::size_t k = 0; k < n; ++k) sel[k] = std::max(p1[k], p2[k]), sum_p[k] = p1[k] + p2[k];
    Summary s = summarise(std::move(sel), o), m = summarise(std::move(sum_p), o);
    q.selection = std::move(s.levels);
    q.selection_cdf = std::move(s.cdf);
    q.mrc = std::move(m.levels);
    q.mrc_cdf = std::move(m.cdf);
    return q;
}

}  // namespace

const char* to_string(WavePolarisation p) {
    switch (p) {
        case WavePolarisation::vertical: return "vertical";
        case WavePolarisation::horizontal: return "horizontal";
        case WavePolarisation::slant_plus: return "slant+45";
        case WavePolarisation::slant_minus: return "slant-45";
        case WavePolarisation::rhcp: return "rhcp";
        case WavePolarisation::lhcp: return "lhcp";
    }
    return "vertical";
}

bool parse_wave_polarisation(const std::string& name, WavePolarisation& out) {
    for (WavePolarisation p : {WavePolarisation::vertical, WavePolarisation::horizontal, WavePolarisation::slant_plus,
                               WavePolarisation::slant_minus, WavePolarisation::rhcp, WavePolarisation::lhcp})
        if (name == to_string(p)) return out = p, true;
    if (name == "slant") return out = WavePolarisation::slant_plus, true;
    return false;
}

CVec3 incoming_field(WavePolarisation p, double theta_deg, double phi_deg) {
    const double t = theta_deg * deg, f = phi_deg * deg;
    const Vec3 th = theta_hat(t, f), ph = phi_hat(f);
    const double r = 1 / std::sqrt(2.0);
    const cplx j(0, 1);
    switch (p) {
        case WavePolarisation::vertical: return cplx(1) * th;
        case WavePolarisation::horizontal: return cplx(1) * ph;
        case WavePolarisation::slant_plus: return cplx(r) * th + cplx(r) * ph;
        case WavePolarisation::slant_minus: return cplx(r) * th + cplx(-r) * ph;
        case WavePolarisation::rhcp: return cplx(r) * th + r * j * ph;
        case WavePolarisation::lhcp: return cplx(r) * th + -r * j * ph;
    }
    return cplx(1) * th;
}

Result<CVec3> partner_field(const FarFieldSet& partner, std::size_t fi, double theta_deg, double phi_deg) {
    if (!partner.has_phase()) return fail("the partner's pattern needs phase (its polarisation), found " +
                                         std::string(to_string(partner.content)) + " data");
    // The partner stands at d0 from us and sends toward -d0: its field in direction -d0.
    const Vec3 back = -1.0 * direction(theta_deg * deg, phi_deg * deg);
    auto v = interpolate(partner, fi, back);
    if (!v) return fail("the partner's pattern has no data toward us (the direction opposite to where it stands)");
    double t, f;
    to_spherical(back, t, f);
    const CVec3 e = v->e_theta * theta_hat(t, f) + v->e_phi * phi_hat(f);
    const double p = std::norm(e.x) + std::norm(e.y) + std::norm(e.z);
    if (!(p > 0)) return fail("the partner radiates nothing toward us (a null of its pattern)");
    return (1 / std::sqrt(p)) * e;
}

Status validate(const FadingOptions& o, std::size_t antennas) {
    if (antennas < 1 || antennas > max_antennas) return fail("between 1 and 16 antennas");
    if (o.realisations < 100 || o.realisations > 10000000)
        return fail("the number of realisations must lie between 100 and 10 000 000");
    if (double(o.realisations) * double(antennas) > 4e7)
        return fail("realisations times antennas must stay below 40 million (memory)");
    if (o.waves < 1 || o.waves > 10000) return fail("the number of waves per realisation must lie between 1 and 10 000");
    if (o.threads < 1 || o.threads > 64) return fail("threads must lie between 1 and 64");
    if (Status s = validate_outages(o.outages); !s) return s;
    if (o.cdf_points < 2 || o.cdf_points > 100000) return fail("the curves need 2 to 100 000 points");
    if (o.random_tilt_max_deg && !(*o.random_tilt_max_deg >= 0 && *o.random_tilt_max_deg <= 180))
        return fail("the largest tilt must lie in [0, 180] deg");
    if (o.dominant) {
        const DominantWave& d = *o.dominant;
        if (!(d.k_factor >= 0) || !std::isfinite(d.k_factor) || d.k_factor > max_k_factor)
            return fail("the K-factor must be a number from 0 to 1e6 (linear)");
        if (!std::isfinite(d.theta_deg) || d.theta_deg < 0 || d.theta_deg > 180 || !std::isfinite(d.phi_deg))
            return fail("the dominant wave's direction needs theta in [0, 180] deg and a finite phi");
        const CVec3& p = d.field;
        const double n = std::norm(p.x) + std::norm(p.y) + std::norm(p.z);
        const Vec3 r = direction(d.theta_deg * deg, d.phi_deg * deg);
        if (std::abs(n - 1) > 1e-9 || std::abs(dot(p, r)) > 1e-9)
            return fail("the dominant wave's field must be a unit vector across its direction");
    }
    return Ok{};
}

namespace {

// The closed-form references for fixed orientation: MEG (plus the dominant wave's power), the
// antenna's own K-factor, Rayleigh or Rician levels; for a pair without a dominant wave the ECC
// and the exact combining figures.
void add_analytic(FadingResult& res, const std::vector<FadingAntenna>& ants, const Environment& e,
                  const FadingOptions& o, const std::vector<cplx>& dominant) {
    std::vector<double> meg;
    for (std::size_t a = 0; a < ants.size(); ++a) {
        auto m = mean_effective_gain(*ants[a].set, ants[a].freq_index, e);
        if (!m) return;
        meg.push_back(m->meg);
        SimulatedAntenna& s = res.antennas[a];
        const double k = o.dominant ? o.dominant->k_factor : 0;
        const double direct = o.dominant ? std::norm(dominant[a]) : 0;
        const double omega = (k * direct + m->meg) / (k + 1);
        s.analytic_mean = omega;
        if (o.dominant && m->meg > 0) s.analytic_k = k * direct / m->meg;
        const double ka = s.analytic_k.value_or(0);
        auto level = [&](double p) {
            return ka > 0 ? level_at([&](double x) { return rician_power_cdf(x, ka, omega); }, p, omega * p)
                          : -omega * std::log1p(-p);
        };
        for (double p : o.outages) s.analytic_levels.push_back(level(p));
        for (const CdfPoint& c : s.cdf) s.analytic_cdf.push_back({level(c.probability), c.probability});
    }
    if (!res.pair || !*res.pair || o.dominant) return;
    auto c = envelope_correlation(*ants[0].set, ants[0].freq_index, *ants[1].set, ants[1].freq_index, e);
    if (!c) return;
    SimulatedPair& q = **res.pair;
    q.analytic_ecc = c->ecc;
    const BranchPair b{meg[0], meg[1], c->ecc};
    auto comb = combine_two_branches(b, o.outages);
    if (!comb) return;
    q.analytic = *comb;
    const double start = std::max(meg[0], meg[1]);
    for (const CdfPoint& c : q.selection_cdf)
        q.analytic_selection_cdf.push_back(
            {level_at([&](double x) { return selection_cdf(x, b); }, c.probability, -start * std::log1p(-c.probability)),
             c.probability});
    for (const CdfPoint& c : q.mrc_cdf)
        q.analytic_mrc_cdf.push_back(
            {level_at([&](double x) { return mrc_cdf(x, b); }, c.probability, -start * std::log1p(-c.probability)),
             c.probability});
}

// The power correlation that the simulation's own model has with its finite number of waves: the
// value the Pearson estimate of |r1|^2 against |r2|^2 tends to as the realisations grow (the
// estimate's own bias, O(1/realisations), is far smaller than this one's, O(1/waves)).
// Each realisation sums independent waves of type t (V or H), n_t of them, each with a uniform
// random phase, amplitude a_t and a direction drawn with the cell probabilities q_t (density times
// the exact cell weight). With x, y the two antennas' responses to one wave, m11 = E|x|^2,
// m22 = E|y|^2, m12 = E[x conj y], m4_12 = E[|x|^2 |y|^2] (per wave), only pairings of equal
// waves survive the phase average in E[|r1|^2 |r2|^2] (by hand):
//   cov  = |M12|^2 + sum_t n_t (m4_12 - m11 m22 - |m12|^2),   M12 = sum_t n_t m12,
//   var1 = M11^2   + sum_t n_t (m4_11 - 2 m11^2),              M11 = sum_t n_t m11 (= MEG),
// and rho = cov / sqrt(var1 var2). As n_t grows the sums fade and rho tends to |M12|^2 / (M11 M22),
// the Vaughan-Andersen ECC; for an uncorrelated pair what remains is O(1/waves), of either sign.
std::optional<double> finite_wave_correlation(const Grid& g, const FarField& f1, const FarField& f2, const Environment& e,
                                              const Sampling& s) {
    auto env = sample_environment(e, g);
    if (!env) return std::nullopt;
    const CellWeights cw = cell_weights(g);
    double M11 = 0, M22 = 0, cov = 0, var1 = 0, var2 = 0;
    cplx M12 = 0;
    for (int pol = 0; pol < 2; ++pol) {
        const int n = pol == 0 ? s.v_waves : s.h_waves;
        if (n == 0) continue;
        const double a2 = std::pow(pol == 0 ? s.v_amplitude : s.h_amplitude, 2);
        const std::vector<double>& density = pol == 0 ? env->p_theta : env->p_phi;
        const std::vector<cplx>&x = pol == 0 ? f1.e_theta : f1.e_phi, &y = pol == 0 ? f2.e_theta : f2.e_phi;
        double m11 = 0, m22 = 0, m4_11 = 0, m4_22 = 0, m4_12 = 0;
        cplx m12 = 0;
        for (int i = 0; i < g.theta.count; ++i)
            for (int j = 0; j < g.phi.count; ++j) {
                const std::size_t k = g.index(i, j);
                const double q = density[k] * cw.theta[std::size_t(i)] * cw.phi[std::size_t(j)];
                const double p1 = std::norm(x[k]), p2 = std::norm(y[k]);
                m11 += q * p1, m22 += q * p2, m12 += q * x[k] * std::conj(y[k]);
                m4_11 += q * p1 * p1, m4_22 += q * p2 * p2, m4_12 += q * p1 * p2;
            }
        m11 *= a2, m22 *= a2, m12 *= a2, m4_11 *= a2 * a2, m4_22 *= a2 * a2, m4_12 *= a2 * a2;
        M11 += n * m11, M22 += n * m22, M12 += double(n) * m12;
        cov += n * (m4_12 - m11 * m22 - std::norm(m12));
        var1 += n * (m4_11 - 2 * m11 * m11);
        var2 += n * (m4_22 - 2 * m22 * m22);
    }
    cov += std::norm(M12), var1 += M11 * M11, var2 += M22 * M22;
    if (!(var1 > 0 && var2 > 0)) return std::nullopt;
    return cov / std::sqrt(var1 * var2);
}

// E_a(d0) . p for each antenna (on its own grid, interpolated, scaled to gain).
Result<std::vector<cplx>> dominant_amplitudes(const std::vector<FadingAntenna>& ants, const std::vector<double>& factor,
                                              const DominantWave& d) {
    std::vector<cplx> out;
    const Vec3 dir = direction(d.theta_deg * deg, d.phi_deg * deg);
    for (std::size_t a = 0; a < ants.size(); ++a) {
        auto v = interpolate(*ants[a].set, ants[a].freq_index, dir);
        if (!v) return fail("antenna " + std::to_string(a + 1) + " has no data toward the dominant wave");
        const CVec3 e = v->e_theta * theta_hat(d.theta_deg * deg, d.phi_deg * deg) + v->e_phi * phi_hat(d.phi_deg * deg);
        out.push_back(std::sqrt(factor[a]) * dot_plain(e, d.field));
    }
    return out;
}

}  // namespace

Result<FadingResult> simulate_fading(const std::vector<FadingAntenna>& ants, const Environment& e,
                                     const FadingOptions& o) {
    if (Status v = validate(o, ants.size()); !v) return v.error();
    if (Status v = validate(e); !v) return v.error();
    for (std::size_t a = 0; a < ants.size(); ++a)
        if (Status c = check_antenna(ants[a], e, o); !c)
            return Error{"", 0, 0, "antenna " + std::to_string(a + 1) + ": " + c.error().message};
    const Grid& g = ants.front().set->grid;
    std::vector<double> factor;
    auto fields = fields_on_grid(ants, g, factor);
    if (!fields) return fields.error();
    auto sampling = direction_sampling(e, g, o.waves);
    if (!sampling) return sampling.error();
    const bool turned = o.random_tilt_max_deg.has_value();
    Tables t = turned ? turning_tables(g, *fields) : fixed_tables(g, *fields);
    if (o.dominant) {
        auto d = dominant_amplitudes(ants, factor, *o.dominant);
        if (!d) return d.error();
        t.dominant = *d;
    }
    const std::size_t N = o.realisations, A = ants.size();
    std::vector<cplx> amp(N * A);
    Run r{t, *sampling, o, phase_table(), 1, 0, Vec3{}, CVec3{}, amp.data()};
    if (o.dominant) {
        r.diffuse_scale = std::sqrt(1 / (o.dominant->k_factor + 1));
        r.dominant_scale = std::sqrt(o.dominant->k_factor / (o.dominant->k_factor + 1));
        r.dominant_dir = direction(o.dominant->theta_deg * deg, o.dominant->phi_deg * deg);
        r.dominant_field = o.dominant->field;
    }
    run_blocks(r, turned);

    FadingResult res;
    res.realisations = N;
    res.seed = o.seed;
    res.waves = o.waves;
    res.vertical_waves = sampling->v_waves;
    res.horizontal_waves = sampling->h_waves;
    std::vector<std::vector<double>> power(A, std::vector<double>(N));
    for (std::size_t a = 0; a < A; ++a) {
        for (std::size_t n = 0; n < N; ++n) power[a][n] = std::norm(amp[a * N + n]);
        res.antennas.push_back(antenna_statistics(power[a], o));
    }
    if (A == 2) {
        if (!ants[0].set->has_phase() || !ants[1].set->has_phase())
            res.pair = Result<SimulatedPair>(fail("the correlation of two antennas needs complex fields on a common phase reference"));
        else
            res.pair = pair_statistics(power[0], power[1], amp.data(), amp.data() + N, o);
    }
    if (!turned) add_analytic(res, ants, e, o, t.dominant);
    if (!turned && !o.dominant && res.pair && *res.pair)
        (**res.pair).expected_power_correlation = finite_wave_correlation(g, (*fields)[0], (*fields)[1], e, *sampling);
    return res;
}

}  // namespace ellipsa
