#include "pattern/sphere_map.hpp"

#include <algorithm>
#include <cmath>
#include <cstring>
#include <limits>

#include "pattern/sphere_coverage.hpp"

namespace ellipsa {

namespace {
constexpr MapQuantity all_quantities[] = {MapQuantity::component,      MapQuantity::axial_ratio,
                                          MapQuantity::circular_balance, MapQuantity::linear_balance,
                                          MapQuantity::tilt,           MapQuantity::difference};
constexpr MapProjection all_projections[] = {MapProjection::theta_phi, MapProjection::azimuth_elevation,
                                             MapProjection::hammer};
constexpr double sqrt2 = 1.41421356237309504880;

// 10 log10(a / b), NaN when both are zero.
double ratio_db(double a, double b) {
    if (!(a > 0) && !(b > 0)) return std::nan("");
    return to_db(a) - to_db(b);
}
double wrap180(double a) {
    double w = std::fmod(a + 180.0, 360.0);
    if (w < 0) w += 360.0;
    return w - 180.0;
}
}  // namespace

const char* to_string(MapQuantity q) {
    switch (q) {
        case MapQuantity::component: return "component";
        case MapQuantity::axial_ratio: return "axial-ratio";
        case MapQuantity::circular_balance: return "rhcp-minus-lhcp";
        case MapQuantity::linear_balance: return "v-minus-h";
        case MapQuantity::tilt: return "tilt";
        case MapQuantity::difference: return "difference";
    }
    return "?";
}
bool parse_map_quantity(const char* name, MapQuantity& out) {
    for (MapQuantity q : all_quantities)
        if (std::strcmp(name, to_string(q)) == 0) {
            out = q;
            return true;
        }
    return false;
}
bool map_quantity_needs_phase(MapQuantity q) {
    return q == MapQuantity::axial_ratio || q == MapQuantity::circular_balance || q == MapQuantity::tilt;
}

const char* to_string(MapProjection p) {
    switch (p) {
        case MapProjection::theta_phi: return "theta-phi";
        case MapProjection::azimuth_elevation: return "az-el";
        case MapProjection::hammer: return "hammer";
    }
    return "?";
}
bool parse_map_projection(const char* name, MapProjection& out) {
    for (MapProjection p : all_projections)
        if (std::strcmp(name, to_string(p)) == 0) {
            out = p;
            return true;
        }
    return false;
}

Result<std::vector<double>> map_values(const FarFieldSet& s, std::size_t fi, MapQuantity q, Component c,
                                       const FarFieldSet* b, std::size_t fb) {
    if (fi >= s.frequencies.size()) return Error{"", 0, 0, "no such frequency"};
    if ((map_quantity_needs_phase(q) || ((q == MapQuantity::component || q == MapQuantity::difference) && needs_phase(c))) &&
        !s.has_phase())
        return Error{"", 0, 0, std::string(to_string(q) == std::string("component") ? to_string(c) : to_string(q)) +
                                   " needs the phase between E_theta and E_phi; the data are " + to_string(s.content)};
    if ((q == MapQuantity::linear_balance || c != Component::total) && s.content == FieldContent::total_only)
        return Error{"", 0, 0, "the data hold the total power only: no separate E_theta and E_phi"};
    const Grid& g = s.grid;
    const FarField& f = s.frequencies[fi];
    std::vector<double> v(g.size());
    if (q == MapQuantity::component || q == MapQuantity::difference) {
        v = component_power_samples(s, fi, c);
        for (double& x : v) x = to_db(x);
        if (q == MapQuantity::component) return v;
        if (!b) return Error{"", 0, 0, "a difference map needs a second pattern (B)"};
        if (needs_phase(c) && !b->has_phase()) return Error{"", 0, 0, std::string(to_string(c)) + " of B needs phase"};
        const std::vector<double> vb = component_power_on_grid(*b, fb, c, g);
        for (std::size_t k = 0; k < v.size(); ++k) v[k] = v[k] - to_db(vb[k]);  // NaN where B has no data
        return v;
    }
    for (std::size_t n = 0; n < g.size(); ++n) {
        const cplx et = f.e_theta[n], ep = f.e_phi[n];
        switch (q) {
            case MapQuantity::axial_ratio: {
                const double ar = axial_ratio_from_circular(std::norm(rhcp(et, ep)), std::norm(lhcp(et, ep)));
                v[n] = std::isinf(ar) ? std::numeric_limits<double>::infinity() : 20 * std::log10(ar);
                break;
            }
            case MapQuantity::circular_balance: v[n] = ratio_db(std::norm(rhcp(et, ep)), std::norm(lhcp(et, ep))); break;
            case MapQuantity::linear_balance: v[n] = ratio_db(std::norm(et), std::norm(ep)); break;
            case MapQuantity::tilt: {
                const Stokes st = stokes(et, ep);
                v[n] = st.i > 0 ? tilt_deg(st) : std::nan("");
                break;
            }
            default: break;
        }
    }
    return v;
}

MapBounds map_bounds(MapProjection p) {
    switch (p) {
        case MapProjection::theta_phi: return {0, 360, -90, 90};
        case MapProjection::azimuth_elevation: return {-180, 180, -90, 90};
        case MapProjection::hammer: return {-2 * sqrt2, 2 * sqrt2, -sqrt2, sqrt2};
    }
    return {};
}

double map_x_angle(MapProjection p, double phi_deg) {
    return p == MapProjection::theta_phi ? wrap360(phi_deg) : wrap180(phi_deg);
}

MapPoint project(MapProjection p, double theta_deg, double phi_deg) {
    return project_unwrapped(p, theta_deg, map_x_angle(p, phi_deg));
}

MapPoint project_unwrapped(MapProjection p, double theta_deg, double x_angle_deg) {
    const double el = 90.0 - theta_deg;
    switch (p) {
        case MapProjection::theta_phi:
        case MapProjection::azimuth_elevation: return {x_angle_deg, el};
        case MapProjection::hammer: {
            const double l = x_angle_deg * deg, b = el * deg;
            const double d = std::sqrt(1 + std::cos(b) * std::cos(l / 2));
            return {2 * sqrt2 * std::cos(b) * std::sin(l / 2) / d, sqrt2 * std::sin(b) / d};
        }
    }
    return {};
}

std::optional<std::pair<double, double>> unproject(MapProjection p, double x, double y) {
    switch (p) {
        case MapProjection::theta_phi:
        case MapProjection::azimuth_elevation: {
            const MapBounds bd = map_bounds(p);
            if (x < bd.x_min || x > bd.x_max || y < -90 || y > 90) return std::nullopt;
            return std::make_pair(90.0 - y, wrap360(x));
        }
        case MapProjection::hammer: {
            const double e = (x * x) / 8 + (y * y) / 2;  // (x / 2 sqrt2)^2 + (y / sqrt2)^2
            if (e > 1) return std::nullopt;
            const double z = std::sqrt(std::max(0.0, 1 - (x / 4) * (x / 4) - (y / 2) * (y / 2)));
            const double l = 2 * std::atan2(z * x, 2 * (2 * z * z - 1));
            const double b = std::asin(std::clamp(z * y, -1.0, 1.0));
            return std::make_pair(90.0 - b / deg, wrap360(l / deg));
        }
    }
    return std::nullopt;
}

std::optional<std::size_t> sample_of(const Grid& g, double theta_deg, double phi_deg) {
    // The sampled region is the union of the cells, clipped to the sampled theta range.
    constexpr double tol = 1e-9;
    if (theta_deg < std::max(0.0, g.theta.start_deg) - tol || theta_deg > std::min(180.0, g.theta.last_deg()) + tol)
        return std::nullopt;
    const double ti = (theta_deg - g.theta.start_deg) / g.theta.step_deg;
    const long i = std::lround(ti);
    if (i < 0 || i >= g.theta.count) return std::nullopt;
    double pj = (phi_deg - g.phi.start_deg) / g.phi.step_deg;
    if (g.phi_wraps()) {
        pj = std::fmod(pj, double(g.phi.count));
        if (pj < 0) pj += g.phi.count;
        long j = std::lround(pj);
        if (j >= g.phi.count) j -= g.phi.count;
        return g.index(int(i), int(j));
    }
    // A partial phi range: phi taken modulo 360 into the range, within half a step of a sample.
    pj = std::fmod(phi_deg - g.phi.start_deg, 360.0);
    if (pj < -tol) pj += 360;
    if (pj > g.phi.last_deg() - g.phi.start_deg + tol) return std::nullopt;
    const long j = std::lround(pj / g.phi.step_deg);
    return g.index(int(i), int(j));
}

std::vector<ContourSegment> contour_segments(const Grid& g, const std::vector<double>& values, double level) {
    std::vector<ContourSegment> out;
    const int nt = g.theta.count, np = g.phi.count;
    const int jmax = g.phi_wraps() ? np : np - 1;
    auto val = [&](int i, int j) {
        const double v = values[g.index(i, j)];
        return std::isinf(v) && v > 0 ? 1e300 : v;  // +inf (a linear field's AR): above every level
    };
    struct P {
        double t, p;
    };
    for (int i = 0; i + 1 < nt; ++i) {
        const double t0 = g.theta.value_deg(i), t1 = g.theta.value_deg(i + 1);
        for (int j = 0; j < jmax; ++j) {
            const int j1 = (j + 1) % np;
            const double p0 = g.phi.value_deg(j), p1 = p0 + g.phi.step_deg;
            // Corners a (t0,p0), b (t0,p1), c (t1,p1), d (t1,p0); edges a-b, b-c, c-d, d-a.
            const double v[4] = {val(i, j), val(i, j1), val(i + 1, j1), val(i + 1, j)};
            if (std::isnan(v[0]) || std::isnan(v[1]) || std::isnan(v[2]) || std::isnan(v[3])) continue;
            const P c[4] = {{t0, p0}, {t0, p1}, {t1, p1}, {t1, p0}};
            P cross[4];
            int n = 0;
            for (int e = 0; e < 4; ++e) {
                const double u = v[e], w = v[(e + 1) % 4];
                if ((u >= level) == (w >= level)) continue;
                const double f = std::clamp((level - u) / (w - u), 0.0, 1.0);
                const P &a = c[e], &b = c[(e + 1) % 4];
                cross[n] = {a.t + f * (b.t - a.t), a.p + f * (b.p - a.p)};
                ++n;
            }
            if (n == 2) {
                out.push_back({cross[0].t, cross[0].p, cross[1].t, cross[1].p});
            } else if (n == 4) {
                // A saddle: the mean of the corners decides which corners the level joins.
                const bool centre_above = (v[0] + v[1] + v[2] + v[3]) / 4 >= level;
                if (centre_above == (v[0] >= level)) {
                    out.push_back({cross[0].t, cross[0].p, cross[1].t, cross[1].p});
                    out.push_back({cross[2].t, cross[2].p, cross[3].t, cross[3].p});
                } else {
                    out.push_back({cross[3].t, cross[3].p, cross[0].t, cross[0].p});
                    out.push_back({cross[1].t, cross[1].p, cross[2].t, cross[2].p});
                }
            }
        }
    }
    return out;
}

}  // namespace ellipsa
