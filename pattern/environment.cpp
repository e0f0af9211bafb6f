#include "pattern/environment.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "pattern/integrate.hpp"

namespace ellipsa {

const char* to_string(EnvironmentModel m) {
    switch (m) {
        case EnvironmentModel::uniform: return "uniform";
        case EnvironmentModel::gaussian: return "gaussian";
        case EnvironmentModel::profile: return "profile";
    }
    return "?";
}

const char* to_string(ProfileMeasure m) {
    return m == ProfileMeasure::per_solid_angle ? "per-solid-angle" : "per-elevation";
}

double Environment::weight_vertical() const {
    if (std::isinf(xpr_db)) return xpr_db > 0 ? 1.0 : 0.0;
    const double x = std::pow(10.0, xpr_db / 10);
    return x / (1 + x);
}
double Environment::weight_horizontal() const {
    if (std::isinf(xpr_db)) return xpr_db > 0 ? 0.0 : 1.0;
    const double x = std::pow(10.0, xpr_db / 10);
    return 1 / (1 + x);
}

namespace {

Error env_error(std::string msg) { return Error{"", 0, 0, std::move(msg)}; }

// Linear interpolation of one profile column at an elevation; zero outside the table.
double profile_value(const std::vector<ProfilePoint>& t, bool vertical, double el_deg) {
    if (t.size() < 2 || el_deg < t.front().elevation_deg || el_deg > t.back().elevation_deg) return 0;
    auto it = std::upper_bound(t.begin(), t.end(), el_deg,
                               [](double v, const ProfilePoint& p) { return v < p.elevation_deg; });
    if (it == t.end()) return vertical ? t.back().p_v : t.back().p_h;
    if (it == t.begin()) return vertical ? t.front().p_v : t.front().p_h;
    const ProfilePoint& b = *it;
    const ProfilePoint& a = *(it - 1);
    const double f = (el_deg - a.elevation_deg) / (b.elevation_deg - a.elevation_deg);
    const double va = vertical ? a.p_v : a.p_h, vb = vertical ? b.p_v : b.p_h;
    return va + f * (vb - va);
}

// The integrand of the power share: density times sin(theta). For a per-elevation table this is
// the tabulated value itself (no division by sin theta, so no trouble at the poles).
double share_integrand(const Environment& e, bool vertical, double t) {
    if (e.model == EnvironmentModel::profile && e.profile_measure == ProfileMeasure::per_elevation)
        return profile_value(e.profile, vertical, 90.0 - t / deg);
    return raw_density(e, vertical, t) * std::sin(t);
}

// Composite Simpson on [a, b] with n (even) intervals.
template <class F>
double simpson(F&& f, double a, double b, int n) {
    if (!(b > a)) return 0;
    if (n % 2) ++n;
    const double h = (b - a) / n;
    double s = f(a) + f(b);
    for (int k = 1; k < n; ++k) s += (k % 2 ? 4.0 : 2.0) * f(a + k * h);
    return s * h / 3;
}

int intervals_for(double a, double b) { return std::max(200, int(std::ceil((b - a) / pi * 40000))); }

}  // namespace

double raw_density(const Environment& e, bool vertical, double t) {
    switch (e.model) {
        case EnvironmentModel::uniform: return 1.0;
        case EnvironmentModel::gaussian: {
            const double m = (vertical ? e.v_mean_deg : e.h_mean_deg) * deg;
            const double s = (vertical ? e.v_spread_deg : e.h_spread_deg) * deg;
            const double d = t - (pi / 2 - m);
            return std::exp(-d * d / (2 * s * s));
        }
        case EnvironmentModel::profile: {
            const double v = profile_value(e.profile, vertical, 90.0 - t / deg);
            if (e.profile_measure == ProfileMeasure::per_solid_angle) return v;
            const double st = std::sin(t);
            return st > 0 ? v / st : 0.0;  // callers use raw_density_cell_mean at the poles
        }
    }
    return 0;
}

double raw_density_cell_mean(const Environment& e, bool vertical, double a, double b) {
    const double area = std::cos(a) - std::cos(b);
    if (!(area > 0)) return raw_density(e, vertical, 0.5 * (a + b));
    const double mass = simpson([&](double t) { return share_integrand(e, vertical, t); }, a, b, 400);
    return mass / area;
}

double density_share(const Environment& e, bool vertical, double a, double b) {
    a = std::clamp(a, 0.0, pi);
    b = std::clamp(b, 0.0, pi);
    if (a <= 0 && b >= pi) return 1.0;
    auto f = [&](double t) { return share_integrand(e, vertical, t); };
    const double total = simpson(f, 0, pi, intervals_for(0, pi));
    if (!(total > 0)) return 0;
    return std::clamp(simpson(f, a, b, intervals_for(a, b)) / total, 0.0, 1.0);
}

Status validate(const Environment& e) {
    if (std::isnan(e.xpr_db)) return env_error("XPR must be a number of dB (or inf), found NaN");
    if (e.model == EnvironmentModel::gaussian) {
        const struct {
            const char* what;
            double v;
        } means[] = {{"vertical mean elevation", e.v_mean_deg}, {"horizontal mean elevation", e.h_mean_deg}};
        for (auto& m : means)
            if (!std::isfinite(m.v) || m.v < -90 || m.v > 90) {
                char buf[160];
                std::snprintf(buf, sizeof buf, "the %s must lie in [-90, 90] deg, found %g", m.what, m.v);
                return env_error(buf);
            }
        const struct {
            const char* what;
            double v;
        } spreads[] = {{"vertical spread", e.v_spread_deg}, {"horizontal spread", e.h_spread_deg}};
        for (auto& s : spreads)
            if (!std::isfinite(s.v) || s.v <= 0 || s.v > 1000) {
                char buf[160];
                std::snprintf(buf, sizeof buf, "the %s must be a positive angle up to 1000 deg, found %g", s.what,
                              s.v);
                return env_error(buf);
            }
    }
    if (e.model == EnvironmentModel::profile) {
        const auto& t = e.profile;
        if (t.size() < 2) return env_error("an elevation profile needs at least two rows");
        double sum_v = 0, sum_h = 0;
        for (std::size_t k = 0; k < t.size(); ++k) {
            const ProfilePoint& p = t[k];
            if (!std::isfinite(p.elevation_deg) || p.elevation_deg < -90 || p.elevation_deg > 90)
                return env_error("profile row " + std::to_string(k + 1) + ": elevation must lie in [-90, 90] deg");
            if (k > 0 && !(p.elevation_deg > t[k - 1].elevation_deg))
                return env_error("profile row " + std::to_string(k + 1) +
                                 ": elevations must increase strictly from row to row");
            if (!std::isfinite(p.p_v) || !std::isfinite(p.p_h) || p.p_v < 0 || p.p_h < 0)
                return env_error("profile row " + std::to_string(k + 1) +
                                 ": p_v and p_h must be finite and not negative");
            sum_v += p.p_v;
            sum_h += p.p_h;
        }
        if (e.weight_vertical() > 0 && !(sum_v > 0))
            return env_error("the profile's p_v column is zero everywhere but the vertical part has weight "
                             "(XPR is not -inf)");
        if (e.weight_horizontal() > 0 && !(sum_h > 0))
            return env_error("the profile's p_h column is zero everywhere but the horizontal part has weight "
                             "(XPR is not +inf)");
    }
    return Ok{};
}

const std::vector<EnvironmentPreset>& environment_presets() {
    static const std::vector<EnvironmentPreset> presets = [] {
        std::vector<EnvironmentPreset> v;
        Environment u;
        u.model = EnvironmentModel::uniform;
        u.name = "uniform";
        u.source = "isotropic reference environment, XPR 0 dB (Taga 1990: MEG = efficiency / 2)";
        v.push_back({"uniform", "power from every direction alike, equal V and H", u});

        Environment in;
        in.model = EnvironmentModel::gaussian;
        in.name = "indoor";
        in.xpr_db = 1;
        in.v_mean_deg = in.h_mean_deg = 0;
        in.v_spread_deg = in.h_spread_deg = 30;
        in.source = "illustrative values from memory (indoor studies report wide elevation spreads and XPR near "
                    "0-3 dB); not taken from a specific measurement";
        v.push_back({"indoor", "wide elevation spread around the horizon, nearly balanced V and H", in});

        Environment ur;
        ur.model = EnvironmentModel::gaussian;
        ur.name = "urban";
        ur.xpr_db = 6;
        ur.v_mean_deg = ur.h_mean_deg = 10;
        ur.v_spread_deg = ur.h_spread_deg = 15;
        ur.source = "values of the order Taga (IEEE Trans. VT-39, 1990) reports for urban areas, quoted from "
                    "memory and not checked against the paper: mean elevation 10 deg, spread 15 deg, XPR 6 dB";
        v.push_back({"urban", "street-level urban: power a little above the horizon, mostly vertical", ur});

        Environment ru;
        ru.model = EnvironmentModel::gaussian;
        ru.name = "rural";
        ru.xpr_db = 9;
        ru.v_mean_deg = ru.h_mean_deg = 3;
        ru.v_spread_deg = ru.h_spread_deg = 8;
        ru.source = "illustrative values from memory (open areas: little scattering, narrow elevation spread, "
                    "polarisation largely kept); not taken from a specific measurement";
        v.push_back({"rural", "open country: power close to the horizon, strongly vertical", ru});
        return v;
    }();
    return presets;
}

Result<Environment> environment_preset(const std::string& name) {
    std::string known;
    for (const EnvironmentPreset& p : environment_presets()) {
        if (name == p.name) return p.environment;
        known += (known.empty() ? "" : ", ") + std::string(p.name);
    }
    return env_error("unknown environment \"" + name + "\"; known: " + known);
}

Result<SampledEnvironment> sample_environment(const Environment& e, const Grid& g) {
    Status ok = validate(e);
    if (!ok) return ok.error();
    SampledEnvironment out;
    out.w_v = e.weight_vertical();
    out.w_h = e.weight_horizontal();
    out.p_theta.assign(g.size(), 0.0);
    out.p_phi.assign(g.size(), 0.0);

    const CellWeights w = cell_weights(g);
    double phi_sum = 0;
    for (double x : w.phi) phi_sum += x;
    const bool full = is_full_sphere(g);
    const double dt = g.theta.step_deg * deg;
    const double t_lo = std::max(0.0, g.theta.start_deg * deg), t_hi = std::min(pi, g.theta.last_deg() * deg);
    const bool per_elevation = e.model == EnvironmentModel::profile && e.profile_measure == ProfileMeasure::per_elevation;

    double share[2] = {1, 1};
    for (int part = 0; part < 2; ++part) {
        const bool vertical = part == 0;
        const double weight = vertical ? out.w_v : out.w_h;
        std::vector<double> row(std::size_t(g.theta.count));
        double sum = 0;
        for (int i = 0; i < g.theta.count; ++i) {
            const double t = g.theta.value_deg(i) * deg;
            double v;
            if (per_elevation && std::sin(t) < 1e-9) {
                const double a = std::clamp(t - dt / 2, t_lo, t_hi), b = std::clamp(t + dt / 2, t_lo, t_hi);
                v = raw_density_cell_mean(e, vertical, a, b);
            } else {
                v = raw_density(e, vertical, t);
            }
            row[std::size_t(i)] = v;
            sum += v * w.theta[std::size_t(i)];
        }
        sum *= phi_sum;
        // The share of this part's power that the sampled region should hold. On a full sphere it
        // is 1 and the grid sum is made exactly 1 (numerical normalisation).
        double target = 1.0;
        if (!full) target = density_share(e, vertical, t_lo, t_hi) * std::min(1.0, phi_sum / (2 * pi));
        share[part] = target;
        if (!(sum > 0)) {
            if (weight > 0 && target > 0)
                return env_error(std::string("the environment's ") + (vertical ? "vertical" : "horizontal") +
                                 " part has no power at any sample of this grid (it is too narrow for the grid "
                                 "step or lies outside the sampled region)");
            continue;
        }
        if (weight > 0 && !(target > 0) && !full)
            return env_error(std::string("none of the environment's ") + (vertical ? "vertical" : "horizontal") +
                             " power arrives inside the sampled region");
        const double scale = target / sum;
        std::vector<double>& dst = vertical ? out.p_theta : out.p_phi;
        for (int i = 0; i < g.theta.count; ++i) {
            const double v = row[std::size_t(i)] * scale;
            std::fill(dst.begin() + long(g.index(i, 0)), dst.begin() + long(g.index(i, 0)) + g.phi.count, v);
        }
    }
    out.sampled_share = full ? 1.0 : out.w_v * share[0] + out.w_h * share[1];
    return out;
}

std::string describe(const Environment& e) {
    char buf[512];
    char xpr[48];
    if (std::isinf(e.xpr_db))
        std::snprintf(xpr, sizeof xpr, "%s", e.xpr_db > 0 ? "XPR +inf (vertical only)" : "XPR -inf (horizontal only)");
    else
        std::snprintf(xpr, sizeof xpr, "XPR %g dB", e.xpr_db);
    switch (e.model) {
        case EnvironmentModel::uniform:
            std::snprintf(buf, sizeof buf, "uniform (isotropic) %s", xpr);
            break;
        case EnvironmentModel::gaussian:
            std::snprintf(buf, sizeof buf,
                          "Taga Gaussian (%s): V mean elevation %g deg, spread %g deg; H mean elevation %g deg, "
                          "spread %g deg; %s",
                          e.name.c_str(), e.v_mean_deg, e.v_spread_deg, e.h_mean_deg, e.h_spread_deg, xpr);
            break;
        case EnvironmentModel::profile:
            std::snprintf(buf, sizeof buf, "elevation profile (%s): %zu rows from %g to %g deg, %s, %s",
                          e.name.c_str(), e.profile.size(), e.profile.empty() ? 0.0 : e.profile.front().elevation_deg,
                          e.profile.empty() ? 0.0 : e.profile.back().elevation_deg, to_string(e.profile_measure), xpr);
            break;
    }
    return buf;
}

}  // namespace ellipsa

namespace ellipsa {

double profile_xpr_db(const Environment& e) {
    if (e.model != EnvironmentModel::profile) return e.xpr_db;
    auto total = [&](bool vertical) {
        return simpson([&](double t) { return share_integrand(e, vertical, t); }, 0, pi, intervals_for(0, pi));
    };
    const double v = total(true), h = total(false);
    if (!(h > 0)) return v > 0 ? INFINITY : 0.0;
    if (!(v > 0)) return -INFINITY;
    return 10 * std::log10(v / h);
}

ElevationCurve elevation_curve(const Environment& e, int count) {
    ElevationCurve c;
    if (count < 1) return c;
    double total[2];
    for (int part = 0; part < 2; ++part)
        total[part] = 2 * pi * simpson([&](double t) { return share_integrand(e, part == 0, t); }, 0, pi,
                                       intervals_for(0, pi));
    for (int k = 0; k < count; ++k) {
        const double el = -90 + (k + 0.5) * 180.0 / count;
        const double t = (90 - el) * deg;
        c.elevation_deg.push_back(el);
        c.p_v.push_back(total[0] > 0 ? raw_density(e, true, t) / total[0] : 0.0);
        c.p_h.push_back(total[1] > 0 ? raw_density(e, false, t) / total[1] : 0.0);
    }
    return c;
}

bool polarisation_blind(const Environment& e) {
    if (e.xpr_db != 0) return false;
    switch (e.model) {
        case EnvironmentModel::uniform: return true;
        case EnvironmentModel::gaussian: return e.v_mean_deg == e.h_mean_deg && e.v_spread_deg == e.h_spread_deg;
        case EnvironmentModel::profile: {
            // Same shape up to a constant factor.
            double sv = 0, sh = 0;
            for (const ProfilePoint& p : e.profile) sv += p.p_v, sh += p.p_h;
            if (!(sv > 0) || !(sh > 0)) return false;
            for (const ProfilePoint& p : e.profile)
                if (std::abs(p.p_v / sv - p.p_h / sh) > 1e-12 * (p.p_v / sv + p.p_h / sh)) return false;
            return true;
        }
    }
    return false;
}

}  // namespace ellipsa
