#include "viewer/scene/poincare.hpp"

#include <algorithm>
#include <cmath>

namespace ellipsa::viewer {

std::vector<PoincarePoint> poincare_cloud(const FarFieldSet& s, std::size_t k, double within_db, std::size_t max_points) {
    std::vector<PoincarePoint> out;
    if (!s.has_phase() || k >= s.frequencies.size()) return out;
    const FarField& f = s.frequencies[k];
    const std::size_t n = s.grid.size();
    double peak = 0;
    for (std::size_t i = 0; i < n; ++i) peak = std::max(peak, power(f.e_theta[i], f.e_phi[i]));
    if (!(peak > 0)) return out;
    const double threshold = peak * std::pow(10.0, -std::abs(within_db) / 10);
    std::size_t qualifying = 0;
    for (std::size_t i = 0; i < n; ++i) qualifying += power(f.e_theta[i], f.e_phi[i]) >= threshold;
    const std::size_t stride = std::max<std::size_t>(1, (qualifying + max_points - 1) / std::max<std::size_t>(max_points, 1));
    std::size_t seen = 0;
    for (std::size_t i = 0; i < n; ++i) {
        const double p = power(f.e_theta[i], f.e_phi[i]);
        if (p < threshold) continue;
        if (seen++ % stride) continue;
        PoincarePoint q = poincare_point(stokes(f.e_theta[i], f.e_phi[i]));
        q.below_peak_db = 10 * std::log10(p / peak);
        out.push_back(q);
    }
    return out;
}

SpherePoint2 view_sphere_point(double s1, double s2, double s3, double az_deg, double el_deg) {
    const double a = az_deg * pi / 180, e = el_deg * pi / 180;
    // Eye direction and a right/up frame around it.
    const double ex = std::cos(e) * std::cos(a), ey = std::cos(e) * std::sin(a), ez = std::sin(e);
    const double rx = -std::sin(a), ry = std::cos(a), rz = 0;
    const double ux = -std::sin(e) * std::cos(a), uy = -std::sin(e) * std::sin(a), uz = std::cos(e);
    return {s1 * rx + s2 * ry + s3 * rz, s1 * ux + s2 * uy + s3 * uz, s1 * ex + s2 * ey + s3 * ez};
}

}  // namespace ellipsa::viewer
