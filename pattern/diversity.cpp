#include "pattern/diversity.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "pattern/integrate.hpp"
#include "pattern/interpolate.hpp"

namespace ellipsa {

namespace {

Error fail(std::string msg) { return Error{"", 0, 0, std::move(msg)}; }

std::string percent(double x) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.1f %%", 100 * x);
    return buf;
}

// Figures over the sphere need samples that stand for some solid angle: a single cut (one phi
// or one theta value) has none, however strong its field.
Status check_solid_angle(const Grid& g) {
    if (g.phi.count < 2 || g.theta.count < 2) {
        char buf[240];
        if (g.phi.count < 2)
            std::snprintf(buf, sizeof buf,
                          "the data are a single cut (only phi = %g deg), not a sphere or a part of one: MEG and "
                          "correlation integrate over directions and need several phi and theta values",
                          g.phi.start_deg);
        else
            std::snprintf(buf, sizeof buf,
                          "the data are a single cut (only theta = %g deg), not a sphere or a part of one: MEG and "
                          "correlation integrate over directions and need several phi and theta values",
                          g.theta.start_deg);
        return fail(buf);
    }
    if (g.sampling == Sampling::cuts) return fail("MEG needs the whole sphere; " + sphere_shortfall(g));
    if (!(coverage(g) > 0)) return fail("the grid covers no solid angle (coverage 0): MEG needs part of the sphere");
    return Ok{};
}

}  // namespace

Result<FarField> resample_field(const FarFieldSet& s, std::size_t fi, const Grid& g) {
    FarField out;
    out.frequency_hz = s.frequencies[fi].frequency_hz;
    out.e_theta.resize(g.size());
    out.e_phi.resize(g.size());
    for (int i = 0; i < g.theta.count; ++i)
        for (int j = 0; j < g.phi.count; ++j) {
            const double td = g.theta.value_deg(i), pd = g.phi.value_deg(j);
            auto v = interpolate(s, fi, td, pd);
            if (!v) {
                char buf[200];
                std::snprintf(buf, sizeof buf, "does not cover the grid (no data at theta %g, phi %g deg)", td, pd);
                return fail(buf);
            }
            out.e_theta[g.index(i, j)] = v->e_theta;
            out.e_phi[g.index(i, j)] = v->e_phi;
        }
    return out;
}

namespace {

// Per-sample partial gains of one frequency, already scaled to gain.
struct PartialGains {
    std::vector<double> gtt, gpp, gtp;  // |E_theta|^2, |E_phi|^2, Re(E_theta conj(E_phi))
};
PartialGains partial_gains(const FarField& f, double factor) {
    PartialGains p;
    const std::size_t n = f.e_theta.size();
    p.gtt.resize(n);
    p.gpp.resize(n);
    p.gtp.resize(n);
    for (std::size_t k = 0; k < n; ++k) {
        const cplx a = f.e_theta[k], b = f.e_phi[k];
        p.gtt[k] = factor * std::norm(a);
        p.gpp[k] = factor * std::norm(b);
        p.gtp[k] = factor * (a.real() * b.real() + a.imag() * b.imag());
    }
    return p;
}

// sin/cos of the grid's rows and columns, so per-sample unit vectors are products, not trig.
struct GridTrig {
    std::vector<double> st, ct, sp, cp;
};
GridTrig grid_trig(const Grid& g) {
    GridTrig t;
    for (int i = 0; i < g.theta.count; ++i) {
        const double a = g.theta.value_deg(i) * deg;
        t.st.push_back(std::sin(a));
        t.ct.push_back(std::cos(a));
    }
    // Exact zeros at the poles keep the pole samples on the axis.
    if (g.has_north_pole()) t.st.front() = 0, t.ct.front() = 1;
    if (g.has_south_pole()) t.st.back() = 0, t.ct.back() = -1;
    for (int j = 0; j < g.phi.count; ++j) {
        const double a = g.phi.value_deg(j) * deg;
        t.sp.push_back(std::sin(a));
        t.cp.push_back(std::cos(a));
    }
    return t;
}

// For one "up" direction n in the antenna frame: the environment's densities toward each grid
// sample, and the projections of n on the sample's theta-hat and phi-hat.
struct UpTables {
    std::vector<double> pv, ph;
    // |v.E|^2 = ca |E_theta|^2 + cb |E_phi|^2 + cab Re(E_theta conj(E_phi)), with v the environment's
    // vertical unit vector at the sample: ca = alpha^2 / rho^2, cb = beta^2 / rho^2, cab = 2 alpha beta / rho^2,
    // alpha = n . theta-hat, beta = n . phi-hat, rho^2 = alpha^2 + beta^2 = 1 - (n . u)^2.
    std::vector<double> ca, cb, cab;
};
void build_up_tables(const Grid& g, const GridTrig& tr, const Environment& e, Vec3 n, UpTables& t) {
    const std::size_t size = g.size();
    t.pv.resize(size);
    t.ph.resize(size);
    t.ca.resize(size);
    t.cb.resize(size);
    t.cab.resize(size);
    // The same density for V and H (uniform, or equal Gaussian parameters): evaluate it once.
    const bool same_vh = e.model == EnvironmentModel::uniform ||
                         (e.model == EnvironmentModel::gaussian && e.v_mean_deg == e.h_mean_deg &&
                          e.v_spread_deg == e.h_spread_deg);
    const bool per_elevation = e.model == EnvironmentModel::profile && e.profile_measure == ProfileMeasure::per_elevation;
    const double half_step = 0.5 * g.theta.step_deg * deg;
    for (int i = 0; i < g.theta.count; ++i) {
        const double st = tr.st[std::size_t(i)], ct = tr.ct[std::size_t(i)];
        for (int j = 0; j < g.phi.count; ++j) {
            const double sp = tr.sp[std::size_t(j)], cp = tr.cp[std::size_t(j)];
            const std::size_t k = g.index(i, j);
            // u = (st cp, st sp, ct); theta-hat = (ct cp, ct sp, -st); phi-hat = (-sp, cp, 0)
            const double c = std::clamp(n.x * st * cp + n.y * st * sp + n.z * ct, -1.0, 1.0);
            const double tp = std::acos(c);
            if (per_elevation && std::sin(tp) < std::sin(half_step)) {
                // Near the environment's poles such a table's per-steradian density diverges:
                // use its mean over a cell the size of a grid step.
                const double a = std::max(0.0, tp - half_step), b = std::min(pi, tp + half_step);
                t.pv[k] = raw_density_cell_mean(e, true, a, b);
                t.ph[k] = raw_density_cell_mean(e, false, a, b);
            } else {
                t.pv[k] = raw_density(e, true, tp);
                t.ph[k] = same_vh ? t.pv[k] : raw_density(e, false, tp);
            }
            const double a = n.x * ct * cp + n.y * ct * sp - n.z * st;
            const double b = -n.x * sp + n.y * cp;
            const double rho2 = a * a + b * b;
            if (rho2 > 1e-24) {
                t.ca[k] = a * a / rho2;
                t.cb[k] = b * b / rho2;
                t.cab[k] = 2 * a * b / rho2;
            } else {
                // On the environment's axis itself V/H is undefined (a set of zero measure): keep
                // the sample's own theta/phi basis, as the unturned computation does.
                t.ca[k] = 1;
                t.cb[k] = 0;
                t.cab[k] = 0;
            }
        }
    }
}

struct RotatedSums {
    double meg_v = 0, meg_h = 0;
};
// MEG for the tables of one up direction, once per entry of `shifts`: the tables are read
// `shift` phi columns further on (an exact roll of the antenna about its own z axis by
// shift * phi step). Rows are the outer loop so each row's data stay in cache for all shifts.
Result<std::vector<RotatedSums>> accumulate_rotated(const Grid& g, const std::vector<double>& wt,
                                                    const std::vector<double>& wp, const UpTables& t,
                                                    const PartialGains& pg, double w_v, double w_h,
                                                    const std::vector<int>& shifts) {
    const int np = g.phi.count;
    const std::size_t ns = shifts.size();
    // sv and sh (the normalising sums) do not depend on the shift: a shift only permutes a row.
    double sv = 0, sh = 0;
    std::vector<double> mv(ns, 0.0), mh(ns, 0.0);
    for (int i = 0; i < g.theta.count; ++i) {
        const std::size_t row = g.index(i, 0);
        const double* pv = t.pv.data() + row;
        const double* ph = t.ph.data() + row;
        const double* ca = t.ca.data() + row;
        const double* cb = t.cb.data() + row;
        const double* cab = t.cab.data() + row;
        const double* gtt = pg.gtt.data() + row;
        const double* gpp = pg.gpp.data() + row;
        const double* gtp = pg.gtp.data() + row;
        double rsv = 0, rsh = 0;
        for (int j = 0; j < np; ++j) {
            rsv += pv[j] * wp[std::size_t(j)];
            rsh += ph[j] * wp[std::size_t(j)];
        }
        const double wr = wt[std::size_t(i)];
        sv += rsv * wr;
        sh += rsh * wr;
        for (std::size_t m = 0; m < ns; ++m) {
            const int shift = shifts[m];
            double rmv = 0, rmh = 0;
            // Two runs so the inner loop has no wrap test: columns [0, np - shift) read
            // [shift, np), the rest read from column 0 on.
            for (int run = 0; run < 2; ++run) {
                const int j0 = run == 0 ? 0 : np - shift, j1 = run == 0 ? np - shift : np;
                const int off = run == 0 ? shift : shift - np;
                for (int j = j0; j < j1; ++j) {
                    const int q = j + off;
                    const double gv = ca[q] * gtt[j] + cb[q] * gpp[j] + cab[q] * gtp[j];
                    const double gh = gtt[j] + gpp[j] - gv;
                    const double w = wp[std::size_t(j)];
                    rmv += pv[q] * w * gv;
                    rmh += ph[q] * w * gh;
                }
            }
            mv[m] += rmv * wr;
            mh[m] += rmh * wr;
        }
    }
    if ((w_v > 0 && !(sv > 0)) || (w_h > 0 && !(sh > 0)))
        return fail("the turned environment has no power at any sample of this grid (it is too narrow for the grid step)");
    std::vector<RotatedSums> r(ns);
    for (std::size_t m = 0; m < ns; ++m) {
        r[m].meg_v = w_v > 0 ? w_v * mv[m] / sv : 0.0;
        r[m].meg_h = w_h > 0 ? w_h * std::max(0.0, mh[m]) / sh : 0.0;
    }
    return r;
}

Status check_rotatable(const FarFieldSet& s, const Environment& e) {
    Status area = check_solid_angle(s.grid);
    if (!area) return area;
    if (!is_full_sphere(s.grid))
        return fail("turning the antenna needs the full sphere; this grid covers " + percent(coverage(s.grid)) +
                    " of it");
    if (s.content == FieldContent::magnitude_only)
        return fail("turning the antenna needs the phase between E_theta and E_phi (the turned vertical/horizontal "
                    "split depends on it); this data has magnitudes only");
    if (s.content == FieldContent::total_only && !polarisation_blind(e))
        return fail("total-only data has no vertical/horizontal split; it can be scored only in a "
                    "polarisation-blind environment (XPR 0 dB, the same V and H density)");
    return Ok{};
}

}  // namespace

Result<GainScale> gain_scale(const FarFieldSet& s, std::size_t fi) {
    Status area = check_solid_angle(s.grid);
    if (!area) return area.error();
    const double p = radiated_power(s.grid, s.frequencies[fi]);
    if (!(p > 0)) return fail("the pattern is zero everywhere at this frequency");
    GainScale g;
    switch (s.quantity) {
        case Quantity::gain: break;
        case Quantity::directivity:
            g.assumption = "directivity data: assumes a lossless antenna (gain = directivity)";
            break;
        case Quantity::relative:
            if (!is_full_sphere(s.grid))
                return fail("relative data have no known scale, and on a grid that covers only " +
                            percent(coverage(s.grid)) +
                            " of the sphere they cannot be scaled to directivity; MEG is unavailable");
            g.factor = 4 * pi / p;
            g.assumption = "relative data scaled to directivity over the full sphere: assumes a lossless antenna";
            break;
    }
    return g;
}

namespace {
// What every turned-antenna figure needs first: a grid and data that can be turned, a valid
// environment, and the gain scale.
Result<GainScale> rotatable_gain_scale(const FarFieldSet& s, std::size_t fi, const Environment& e) {
    Status ok = check_rotatable(s, e);
    if (!ok) return ok.error();
    Status ev = validate(e);
    if (!ev) return ev.error();
    return gain_scale(s, fi);
}
}  // namespace

Result<MegFigures> mean_effective_gain(const FarFieldSet& s, std::size_t fi, const Environment& e) {
    auto scale = gain_scale(s, fi);
    if (!scale) return scale.error();
    const bool total_only = s.content == FieldContent::total_only;
    if (total_only && !polarisation_blind(e))
        return fail("total-only data has no vertical/horizontal split; MEG needs it in this environment "
                    "(XPR or the V/H densities differ). Only a polarisation-blind environment (XPR 0 dB, the "
                    "same V and H density) can score it");
    auto env = sample_environment(e, s.grid);
    if (!env) return env.error();
    const Grid& g = s.grid;
    const CellWeights w = cell_weights(g);
    const FarField& f = s.frequencies[fi];
    const double factor = scale->factor;
    double mv = 0, mh = 0, bal = 0, incoming = 0;
    for (int i = 0; i < g.theta.count; ++i) {
        double rmv = 0, rmh = 0, rbal = 0, rin = 0;
        for (int j = 0; j < g.phi.count; ++j) {
            const std::size_t k = g.index(i, j);
            const double gt = factor * std::norm(f.e_theta[k]), gp = factor * std::norm(f.e_phi[k]);
            const double pt = env->p_theta[k], pp = env->p_phi[k];
            const double wj = w.phi[std::size_t(j)];
            rmv += wj * pt * gt;
            rmh += wj * pp * gp;
            const double q = wj * (env->w_v * pt + env->w_h * pp);
            rin += q;
            const double hi = std::max(gt, gp), lo = std::min(gt, gp);
            if (hi > 0 && lo * balance_ratio_3db >= hi) rbal += q;
        }
        const double wi = w.theta[std::size_t(i)];
        mv += rmv * wi;
        mh += rmh * wi;
        bal += rbal * wi;
        incoming += rin * wi;
    }
    MegFigures m;
    m.assumption = scale->assumption;
    m.sampled_share = env->sampled_share;
    const double v = env->w_v * mv, h = env->w_h * mh;
    m.meg = v + h;
    if (!total_only) {
        m.meg_vertical = v;
        m.meg_horizontal = h;
        if (m.meg > 0) {
            m.vertical_share = v / m.meg;
            m.horizontal_share = h / m.meg;
        }
        if (incoming > 0) m.balanced_share = bal / incoming;
    } else {
        m.notes.push_back("total-only data: no vertical/horizontal split or balance figures");
    }
    if (env->sampled_share < 1 - 1e-9)
        m.notes.push_back("the grid holds only " + percent(env->sampled_share) +
                          " of the incoming power: MEG counts only what arrives inside the sampled region (a lower "
                          "bound)");
    return m;
}

Result<MegFigures> mean_effective_gain_rotated(const FarFieldSet& s, std::size_t fi, const Environment& e,
                                               const Mat3& r) {
    auto scale = rotatable_gain_scale(s, fi, e);
    if (!scale) return scale.error();
    const Grid& g = s.grid;
    const CellWeights w = cell_weights(g);
    const GridTrig tr = grid_trig(g);
    const PartialGains pg = partial_gains(s.frequencies[fi], scale->factor);
    UpTables t;
    build_up_tables(g, tr, e, apply_transposed(r, Vec3{0, 0, 1}), t);
    auto all = accumulate_rotated(g, w.theta, w.phi, t, pg, e.weight_vertical(), e.weight_horizontal(), {0});
    if (!all) return all.error();
    const RotatedSums* sums = &all->front();
    MegFigures m;
    m.assumption = scale->assumption;
    m.meg = sums->meg_v + sums->meg_h;
    if (s.content != FieldContent::total_only) {
        m.meg_vertical = sums->meg_v;
        m.meg_horizontal = sums->meg_h;
        if (m.meg > 0) {
            m.vertical_share = sums->meg_v / m.meg;
            m.horizontal_share = sums->meg_h / m.meg;
        }
    }
    return m;
}

Status validate(const OrientationSweep& sw) {
    if (!std::isfinite(sw.tilt_max_deg) || sw.tilt_max_deg < 0 || sw.tilt_max_deg > 180)
        return fail("the largest tilt must lie in [0, 180] deg");
    if (!std::isfinite(sw.tilt_step_deg) || sw.tilt_step_deg < 0.1 || sw.tilt_step_deg > 180)
        return fail("the tilt step must lie in [0.1, 180] deg");
    if (!std::isfinite(sw.roll_step_deg) || sw.roll_step_deg < 0.1 || sw.roll_step_deg > 360)
        return fail("the roll step must lie in [0.1, 360] deg");
    if (const double n = sweep_orientation_count(sw); n > max_sweep_orientations) {
        char buf[160];
        std::snprintf(buf, sizeof buf, "the orientation sweep would hold %.0f orientations, more than %.0f: use larger "
                      "tilt or roll steps", n, max_sweep_orientations);
        return fail(buf);
    }
    return Ok{};
}

double sweep_orientation_count(const OrientationSweep& sw) {
    // as orientation_robustness builds the set: tilts k step up to tilt_max plus tilt_max itself,
    // rolls k step below 360 (tilts 0 and 180 are then counted once, which only lowers the count)
    const double tilts = std::floor(sw.tilt_max_deg / sw.tilt_step_deg + 1e-9) + 2;
    const double rolls = std::ceil(360 / sw.roll_step_deg - 1e-9);
    return tilts * rolls;
}

namespace {

// The sweep's tilts (k step up to tilt_max, then tilt_max itself) and rolls (k step below 360).
void sweep_angles(const OrientationSweep& sw, std::vector<double>& tilts, std::vector<double>& rolls) {
    for (int k = 0;; ++k) {
        const double t = k * sw.tilt_step_deg;
        if (t > sw.tilt_max_deg + 1e-9) break;
        tilts.push_back(std::min(t, sw.tilt_max_deg));
    }
    if (tilts.back() < sw.tilt_max_deg - 1e-9) tilts.push_back(sw.tilt_max_deg);
    for (int k = 0; k * sw.roll_step_deg < 360 - 1e-9; ++k) rolls.push_back(k * sw.roll_step_deg);
}

// What every orientation of the sweep shares: the grid's weights and trigonometry, the partial
// gains, the environment's weights, and whether a roll is an exact column shift.
struct SweepContext {
    const Grid& g;
    const Environment& e;
    CellWeights w;
    GridTrig tr;
    PartialGains pg;
    double w_v, w_h;
    bool exact_shift;
};

// The MEG sums of one tilt at each of its rolls.
Result<std::vector<RotatedSums>> tilt_sums(const SweepContext& c, double tilt, const std::vector<double>& these, UpTables& t) {
    const Grid& g = c.g;
    const double ta = tilt * deg;
    std::vector<RotatedSums> sums;
    if (c.exact_shift) {
        build_up_tables(g, c.tr, c.e, Vec3{0, std::sin(ta), std::cos(ta)}, t);
        std::vector<int> shifts;
        for (double roll : these) shifts.push_back(int(std::lround(roll / g.phi.step_deg)) % g.phi.count);
        return accumulate_rotated(g, c.w.theta, c.w.phi, t, c.pg, c.w_v, c.w_h, shifts);
    }
    for (double roll : these) {
        const double ra = roll * deg;
        // n = R^T z for R = R_x(tilt) R_z(roll)
        build_up_tables(g, c.tr, c.e, Vec3{std::sin(ta) * std::sin(ra), std::sin(ta) * std::cos(ra), std::cos(ta)}, t);
        auto r = accumulate_rotated(g, c.w.theta, c.w.phi, t, c.pg, c.w_v, c.w_h, {0});
        if (!r) return r.error();
        sums.push_back(r->front());
    }
    return sums;
}

// Smallest, median, largest, worst and best over all samples.
void order_figures(OrientationFigures& out) {
    std::vector<double> v;
    for (const OrientationSample& o : out.samples) v.push_back(o.meg);
    std::sort(v.begin(), v.end());
    out.min = v.front();
    out.max = v.back();
    const std::size_t n = v.size();
    out.median = n % 2 ? v[n / 2] : 0.5 * (v[n / 2 - 1] + v[n / 2]);
    out.worst = out.best = out.samples.front();
    for (const OrientationSample& o : out.samples) {
        if (o.meg < out.worst.meg) out.worst = o;
        if (o.meg > out.best.meg) out.best = o;
    }
}

// Random orientation with the axis within tilt_max: weight each tilt row by its band of axis
// directions, shared equally among the row's rolls; the mean, the 10th percentile and the weights.
void random_orientation_figures(OrientationFigures& out, const std::vector<double>& tilts, double tilt_max_deg) {
    std::vector<double> band(tilts.size());
    double wsum = 0;
    for (std::size_t k = 0; k < tilts.size(); ++k) {
        const double a = k == 0 ? 0.0 : 0.5 * (tilts[k - 1] + tilts[k]) * deg;
        const double b = k + 1 == tilts.size() ? tilt_max_deg * deg : 0.5 * (tilts[k] + tilts[k + 1]) * deg;
        band[k] = std::cos(a) - std::cos(b);
        wsum += band[k];
    }
    if (!(wsum > 0)) {  // tilt_max 0: one orientation
        std::fill(band.begin(), band.end(), 1.0);
        wsum = double(band.size());
    }
    double sum = 0;
    for (std::size_t k = 0; k < tilts.size(); ++k) sum += band[k] * out.by_tilt[k].mean;
    out.random_mean = sum / wsum;
    // The 10th percentile of that distribution: sort the samples, walk up the cumulative weight.
    std::vector<std::pair<double, double>> weighted;  // (meg, weight)
    std::size_t k = 0, first = 0;
    for (std::size_t q = 0; q <= out.samples.size(); ++q) {
        if (q == out.samples.size() || out.samples[q].tilt_deg != out.samples[first].tilt_deg) {
            const double each = band[k] / double(q - first);
            for (std::size_t r = first; r < q; ++r) {
                weighted.push_back({out.samples[r].meg, each});
                out.random_weights.push_back(each / wsum);
            }
            ++k;
            first = q;
        }
    }
    std::sort(weighted.begin(), weighted.end());
    double acc = 0;
    out.random_p10 = weighted.front().first;
    for (const auto& [m, wq] : weighted) {
        acc += wq;
        out.random_p10 = m;
        if (acc >= 0.1 * wsum) break;
    }
}

}  // namespace

Result<OrientationFigures> orientation_robustness(const FarFieldSet& s, std::size_t fi, const Environment& e,
                                                  const OrientationSweep& sw) {
    Status sv = validate(sw);
    if (!sv) return sv.error();
    auto scale = rotatable_gain_scale(s, fi, e);
    if (!scale) return scale.error();
    std::vector<double> tilts, rolls;
    sweep_angles(sw, tilts, rolls);

    const Grid& g = s.grid;
    const double shift_ratio = sw.roll_step_deg / g.phi.step_deg;
    const SweepContext c{g, e, cell_weights(g), grid_trig(g), partial_gains(s.frequencies[fi], scale->factor),
                         e.weight_vertical(), e.weight_horizontal(),
                         g.phi_wraps() && std::abs(shift_ratio - std::round(shift_ratio)) < 1e-9};
    OrientationFigures out;
    out.exact_roll_shift = c.exact_shift;
    UpTables t;
    for (double tilt : tilts) {
        const bool vertical_axis = std::abs(tilt) < 1e-12 || std::abs(tilt - 180) < 1e-12;
        TiltRow row{tilt, 1e300, 0, -1e300};
        int count = 0;
        // The rolls of this tilt (tilt 0 and 180 once: every roll is the same orientation up to azimuth).
        std::vector<double> these = vertical_axis ? std::vector<double>{0.0} : rolls;
        auto sums = tilt_sums(c, tilt, these, t);
        if (!sums) return sums.error();
        for (std::size_t m = 0; m < these.size(); ++m) {
            const RotatedSums& q = (*sums)[m];
            OrientationSample o{tilt, these[m], q.meg_v + q.meg_h, q.meg_v, q.meg_h};
            out.samples.push_back(o);
            row.min = std::min(row.min, o.meg);
            row.max = std::max(row.max, o.meg);
            row.mean += o.meg;
            ++count;
        }
        row.mean /= count;
        out.by_tilt.push_back(row);
    }
    order_figures(out);
    random_orientation_figures(out, tilts, sw.tilt_max_deg);
    return out;
}

double approximate_selection_gain_db(double ecc) { return 10.0 * std::sqrt(1.0 - std::clamp(ecc, 0.0, 1.0)); }

Result<CorrelationFigures> envelope_correlation(const FarFieldSet& a, std::size_t fa, const FarFieldSet& b,
                                                std::size_t fb, const Environment& e) {
    for (const FarFieldSet* p : {&a, &b})
        if (p->content != FieldContent::complex)
            return fail("envelope correlation needs complex fields on a common phase reference; " +
                        (p->name.empty() ? std::string("one pattern") : "\"" + p->name + "\"") + " has " +
                        to_string(p->content) + " data");
    Status area = check_solid_angle(a.grid);
    if (!area) return area.error();
    auto env = sample_environment(e, a.grid);
    if (!env) return env.error();
    const Grid& g = a.grid;
    CorrelationFigures out;
    out.sampled_share = env->sampled_share;
    const FarField& f1 = a.frequencies[fa];
    FarField resampled;
    const cplx* et2 = b.frequencies[fb].e_theta.data();
    const cplx* ep2 = b.frequencies[fb].e_phi.data();
    if (!same_grid(a.grid, b.grid)) {
        auto r = resample_field(b, fb, g);
        if (!r) return Error{"", 0, 0, "the second pattern " + r.error().message};
        resampled = std::move(*r);
        out.resampled = true;
        et2 = resampled.e_theta.data();
        ep2 = resampled.e_phi.data();
    }
    const CellWeights w = cell_weights(g);
    cplx num = 0;
    double d1 = 0, d2 = 0;
    for (int i = 0; i < g.theta.count; ++i) {
        cplx rn = 0;
        double r1 = 0, r2 = 0;
        for (int j = 0; j < g.phi.count; ++j) {
            const std::size_t k = g.index(i, j);
            const double qt = env->w_v * env->p_theta[k] * w.phi[std::size_t(j)];
            const double qp = env->w_h * env->p_phi[k] * w.phi[std::size_t(j)];
            rn += qt * f1.e_theta[k] * std::conj(et2[k]) + qp * f1.e_phi[k] * std::conj(ep2[k]);
            r1 += qt * std::norm(f1.e_theta[k]) + qp * std::norm(f1.e_phi[k]);
            r2 += qt * std::norm(et2[k]) + qp * std::norm(ep2[k]);
        }
        const double wi = w.theta[std::size_t(i)];
        num += wi * rn;
        d1 += wi * r1;
        d2 += wi * r2;
    }
    if (!(d1 > 0) || !(d2 > 0))
        return fail(std::string("the ") + (d1 > 0 ? "second" : "first") +
                    " pattern receives no power in this environment, so the correlation is undefined");
    out.ecc = std::clamp(std::norm(num) / (d1 * d2), 0.0, 1.0);
    out.approximate_gain_db = approximate_selection_gain_db(out.ecc);
    return out;
}

}  // namespace ellipsa
