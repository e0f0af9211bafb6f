#include "pattern/circular.hpp"

#include <cmath>
#include <cstdio>

#include "pattern/components.hpp"
#include "pattern/integrate.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/sphere_coverage.hpp"

namespace ellipsa {

double circularity_at_ar_db(double threshold_db) {
    const double t = std::pow(10.0, threshold_db / 20);
    return 2 * t / (1 + t * t);
}

double circularity(cplx et, cplx ep) {
    const Stokes st = stokes(et, ep);
    if (!(st.i > 0)) return std::nan("");
    return std::abs(st.v) / st.i;
}

namespace {

std::string db_text(double v) {
    char b[48];
    std::snprintf(b, sizeof b, "%g dB", v);
    return b;
}

// Walk from k0 in direction `dir` (+1 or -1) while m >= limit; the crossing angle (interpolated
// linearly in m), or a reason.
struct Crossing {
    std::optional<double> angle_deg;
    std::string reason;
};
Crossing walk(const CutSamples& c, const std::vector<double>& m, int k0, int dir, double limit) {
    const int n = int(m.size());
    auto at = [&](int k) { return std::size_t(((k % n) + n) % n); };
    for (int step = 1; step < n; ++step) {
        const std::size_t a = at(k0 + dir * (step - 1)), b = at(k0 + dir * step);
        if (!c.valid[b] || std::isnan(m[b]))
            return {std::nullopt, "the cut leaves the sampled region (or meets a zero field) before the axial ratio exceeds the threshold"};
        if (m[b] < limit) {
            const double f = (m[a] - limit) / (m[a] - m[b]);
            return {c.angle_deg[a] + dir * f * c.step_deg, ""};
        }
    }
    return {std::nullopt, "the axial ratio stays within the threshold along the whole cut"};
}

}  // namespace

ArBeamwidth ar_beamwidth(const FarFieldSet& s, const CutSamples& c, int k0, double threshold_db) {
    ArBeamwidth r;
    r.threshold_db = threshold_db;
    if (auto why = polarisation_unavailable(s)) {
        r.unavailable_reason = *why;
        return r;
    }
    const int n = int(c.angle_deg.size());
    if (k0 < 0 || k0 >= n || !c.valid[std::size_t(k0)]) {
        r.unavailable_reason = "the chosen direction lies outside the sampled region";
        return r;
    }
    std::vector<double> m(static_cast<std::size_t>(n));
    for (std::size_t k = 0; k < m.size(); ++k) m[k] = c.valid[k] ? circularity(c.e_theta[k], c.e_phi[k]) : std::nan("");
    const double limit = circularity_at_ar_db(threshold_db);
    if (!(m[std::size_t(k0)] >= limit)) {
        r.unavailable_reason = std::isnan(m[std::size_t(k0)])
                                   ? "the field is zero in the chosen direction"
                                   : "the axial ratio in the chosen direction exceeds " + db_text(threshold_db);
        return r;
    }
    const Crossing right = walk(c, m, k0, +1, limit);
    const Crossing left = walk(c, m, k0, -1, limit);
    if (!right.angle_deg || !left.angle_deg) {
        r.unavailable_reason = right.angle_deg ? left.reason : right.reason;
        return r;
    }
    // Angles of the loop: the right crossing may lie past the end of the angle range.
    double lo = *left.angle_deg, hi = *right.angle_deg;
    const double a0 = c.angle_deg[std::size_t(k0)];
    while (hi < a0) hi += 360;
    while (lo > a0) lo -= 360;
    r.left_deg = lo;
    r.right_deg = hi;
    r.width_deg = hi - lo;
    return r;
}

ArBeamwidth ar_beamwidth_through(const FarFieldSet& s, std::size_t fi, double theta_deg, double phi_deg, bool along_phi,
                                 double threshold_db) {
    // ar_beamwidth decides on the chosen sample alone when the polarisation is unavailable, or
    // the sample lies outside the data, has a zero field or an axial ratio above the threshold:
    // then only that sample is interpolated (the rest, left invalid, are not read). Otherwise
    // the whole cut, as sample_cut gives it.
    CutSamples c = cut_positions(CutSpec::through(theta_deg, phi_deg, along_phi), default_cut_step(s.grid));
    const int k0 = nearest_cut_sample(c, direction(theta_deg * deg, phi_deg * deg));
    if (polarisation_unavailable(s) || k0 < 0) return ar_beamwidth(s, c, k0, threshold_db);
    sample_cut_at(s, fi, c, std::size_t(k0));
    const std::size_t at = std::size_t(k0);
    if (!c.valid[at] || !(circularity(c.e_theta[at], c.e_phi[at]) >= circularity_at_ar_db(threshold_db)))
        return ar_beamwidth(s, c, k0, threshold_db);
    for (std::size_t k = 0; k < c.angle_deg.size(); ++k)
        if (k != at) sample_cut_at(s, fi, c, k);
    return ar_beamwidth(s, c, k0, threshold_db);
}

std::optional<ArSolidAngle> ar_solid_angle(const FarFieldSet& s, std::size_t fi, double threshold_db) {
    if (!s.has_phase() || s.grid.sampling == Sampling::cuts) return std::nullopt;
    const Grid& g = s.grid;
    const FarField& f = s.frequencies.at(fi);
    std::vector<double> c(g.size());
    for (std::size_t n = 0; n < c.size(); ++n) c[n] = circularity(f.e_theta[n], f.e_phi[n]);
    ArSolidAngle r;
    r.threshold_db = threshold_db;
    r.solid_angle_sr = solid_angle_at_or_above(g, c, circularity_at_ar_db(threshold_db));
    r.share = r.solid_angle_sr / (4 * pi);
    return r;
}

}  // namespace ellipsa
