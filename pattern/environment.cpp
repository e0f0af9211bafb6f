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

// 1/(1 + 10^(-XPR/10)) and 1/(1 + 10^(XPR/10)): no inf/inf for a huge finite XPR, exact limits for +-inf.
double Environment::weight_vertical() const { return 1 / (1 + std::pow(10.0, -xpr_db / 10)); }
double Environment::weight_horizontal() const { return 1 / (1 + std::pow(10.0, xpr_db / 10)); }

const char* to_string(XprOrigin o) {
    switch (o) {
        case XprOrigin::model_default: return "default";
        case XprOrigin::user: return "option";
        case XprOrigin::preset: return "preset";
        case XprOrigin::profile_table: return "profile table";
    }
    return "default";
}

namespace {

Error env_error(std::string msg) { return Error{"", 0, 0, std::move(msg)}; }

double column_max(const std::vector<ProfilePoint>& t, bool vertical) {
    double m = 0;
    for (const ProfilePoint& p : t) m = std::max(m, vertical ? p.p_v : p.p_h);
    return m;
}

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
        for (bool vertical : {true, false}) {
            const double m = column_max(t, vertical);
            if (m > 0 && (m < 1e-290 || m > 1e290)) {
                char buf[200];
                std::snprintf(buf, sizeof buf,
                              "the profile's %s column has its largest value %g outside [1e-290, 1e290]: rescale the "
                              "column (only its shape matters)",
                              vertical ? "p_v" : "p_h", m);
                return env_error(buf);
            }
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

namespace {
// The presets. Only "uniform" is a definition; the Gaussian rows are from memory, and say so.
constexpr EnvironmentPreset preset_table[] = {
    {"uniform", "power from every direction alike, equal V and H", EnvironmentModel::uniform, 0, 0, 0, 0, 0,
     "isotropic reference environment, XPR 0 dB (a definition: Taga 1990, MEG = efficiency / 2)"},
    {"indoor", "wide elevation spread around the horizon, nearly balanced V and H", EnvironmentModel::gaussian, 1,
     0, 30, 0, 30,
     "from memory: illustrative values (indoor studies report wide elevation spreads and XPR near 0-3 dB); not "
     "taken from a specific measurement or table"},
    {"urban", "street-level urban: power a little above the horizon, mostly vertical", EnvironmentModel::gaussian, 6,
     10, 15, 10, 15,
     "from memory: of the order of the urban parameters T. Taga reports (IEEE Trans. VT-39, 1990, 900 MHz "
     "measurements in Tokyo), not checked against the paper's table: mean elevation 10 deg, spread 15 deg, XPR 6 dB"},
    {"rural", "open country: power close to the horizon, strongly vertical", EnvironmentModel::gaussian, 9, 3, 8, 3, 8,
     "from memory: illustrative values (open areas: little scattering, narrow elevation spread, polarisation "
     "largely kept); not taken from a specific measurement or table"},
};

Environment environment_of(const EnvironmentPreset& p) {
    Environment e;
    e.model = p.model;
    e.name = p.name;
    e.source = p.source;
    e.xpr_db = p.xpr_db;
    e.v_mean_deg = p.v_mean_deg;
    e.v_spread_deg = p.v_spread_deg;
    e.h_mean_deg = p.h_mean_deg;
    e.h_spread_deg = p.h_spread_deg;
    return e;
}
}  // namespace

std::span<const EnvironmentPreset> environment_presets() { return preset_table; }

Result<Environment> environment_preset(const std::string& name) {
    std::string known;
    for (const EnvironmentPreset& p : environment_presets()) {
        if (name == p.name) return environment_of(p);
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
        // A sum so small (subnormal samples) that target / sum overflows counts as no power at all.
        if (!(sum > 0) || !std::isfinite(target / sum)) {
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
    const double mv = column_max(e.profile, true), mh = column_max(e.profile, false);
    if (!(mh > 0)) return mv > 0 ? INFINITY : 0.0;
    if (!(mv > 0)) return -INFINITY;
    Environment scaled = e;
    for (ProfilePoint& p : scaled.profile) p.p_v /= mv, p.p_h /= mh;
    auto total = [&](bool vertical) {
        return simpson([&](double t) { return share_integrand(scaled, vertical, t); }, 0, pi, intervals_for(0, pi));
    };
    const double v = total(true), h = total(false);
    if (!(h > 0)) return v > 0 ? INFINITY : 0.0;
    if (!(v > 0)) return -INFINITY;
    return 10 * (std::log10(v / h) + std::log10(mv) - std::log10(mh));
}

namespace {
// The Gaussian angles a choice gives, over the ones the environment has.
bool apply_angles(const EnvironmentChoice& c, Environment& e) {
    const std::optional<double>* from[] = {&c.v_mean_deg, &c.v_spread_deg, &c.h_mean_deg, &c.h_spread_deg};
    double* to[] = {&e.v_mean_deg, &e.v_spread_deg, &e.h_mean_deg, &e.h_spread_deg};
    bool changed = false;
    for (int k = 0; k < 4; ++k)
        if (*from[k]) {
            changed = changed || **from[k] != *to[k];
            *to[k] = **from[k];
        }
    return changed;
}

Result<ChosenEnvironment> choose_profile(const EnvironmentChoice& c) {
    if (!c.profile) return env_error("a profile environment needs an elevation table (elevation_deg, p_v, p_h)");
    ChosenEnvironment out;
    Environment& e = out.environment;
    e.model = EnvironmentModel::profile;
    e.name = "user profile";
    e.source = "user table " + c.profile_name;
    e.profile = *c.profile;
    e.profile_measure = c.profile_measure;
    e.xpr_db = profile_xpr_db(e);  // from the columns on their own scales (needs a finite table: checked below)
    out.xpr_from = XprOrigin::profile_table;
    // Each column on its own scale: only their shapes matter once XPR is known.
    const double mv = column_max(e.profile, true), mh = column_max(e.profile, false);
    for (ProfilePoint& p : e.profile) {
        if (mv > 0 && std::isfinite(mv)) p.p_v /= mv;
        if (mh > 0 && std::isfinite(mh)) p.p_h /= mh;
    }
    return out;
}
}  // namespace

Result<ChosenEnvironment> choose_environment(const EnvironmentChoice& c) {
    const bool any_angle = c.v_mean_deg || c.v_spread_deg || c.h_mean_deg || c.h_spread_deg;
    std::string model = c.model;
    if (model.empty()) model = c.profile ? "profile" : any_angle ? "gaussian" : "uniform";
    if (c.profile && model != "profile")
        return env_error("an elevation table gives a user environment; it cannot be combined with the " + model +
                         " environment");
    if (model == "profile" && any_angle)
        return env_error("mean elevations and spreads belong to Gaussian environments, not to a profile table");
    ChosenEnvironment out;
    Environment& e = out.environment;
    if (model == "profile") {
        auto p = choose_profile(c);
        if (!p) return p.error();
        out = std::move(*p);
    } else if (model == "gaussian") {
        const char* missing = !c.v_mean_deg     ? "the vertical mean elevation"
                              : !c.v_spread_deg ? "the vertical spread"
                              : !c.h_mean_deg   ? "the horizontal mean elevation"
                              : !c.h_spread_deg ? "the horizontal spread"
                                                : nullptr;
        if (missing)
            return env_error(std::string("a custom Gaussian environment needs both mean elevations and both spreads "
                                         "(deg); ") + missing + " is missing (or start from a preset: indoor, urban, rural)");
        e.model = EnvironmentModel::gaussian;
        e.name = "custom";
        e.source = "user parameters";
        apply_angles(c, e);
    } else {
        auto p = environment_preset(model);
        if (!p) return env_error(p.error().message + ", gaussian, profile");
        e = *p;
        out.xpr_from = XprOrigin::preset;
        if (any_angle && e.model != EnvironmentModel::gaussian)
            return env_error("mean elevations and spreads need a Gaussian environment (gaussian, indoor, urban, rural)");
        if (apply_angles(c, e)) {
            e.name += " (modified)";
            e.source += "; changed by the user";
        }
    }
    if (c.xpr_db) {
        e.xpr_db = *c.xpr_db;
        out.xpr_from = XprOrigin::user;
    }
    Status ok = validate(e);
    if (!ok) return ok.error();
    return out;
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
