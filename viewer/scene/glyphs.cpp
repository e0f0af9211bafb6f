#include "viewer/scene/glyphs.hpp"

#include <algorithm>
#include <cmath>

#include "pattern/interpolate.hpp"

namespace ellipsa::viewer {

std::vector<PlanePoint> ellipse_path(cplx et, cplx ep, int n) {
    const double mag = std::sqrt(std::norm(et) + std::norm(ep));
    std::vector<PlanePoint> out;
    if (!(mag > 0) || n <= 0) return out;
    out.reserve(std::size_t(n));
    for (int k = 0; k < n; ++k) {
        const double wt = 2 * pi * k / n;
        const cplx rot(std::cos(wt), std::sin(wt));
        out.push_back({(ep * rot).real() / mag, (et * rot).real() / mag});
    }
    return out;
}

EllipseAxes ellipse_axes(cplx et, cplx ep) {
    // |E_R| + |E_L| and ||E_R| - |E_L|| are the semi-axes times sqrt2 (Balanis sec. 2.12).
    const double mag2 = std::norm(et) + std::norm(ep);
    if (!(mag2 > 0)) return {};
    const double r = std::abs(rhcp(et, ep)), l = std::abs(lhcp(et, ep));
    const double s = 1 / std::sqrt(mag2);
    return {(r + l) * inv_sqrt2 * s, std::abs(r - l) * inv_sqrt2 * s};
}

double signed_area2(const std::vector<PlanePoint>& p) {
    double a = 0;
    for (std::size_t k = 0; k < p.size(); ++k) {
        const PlanePoint &u = p[k], &v = p[(k + 1) % p.size()];
        a += u.x * v.y - v.x * u.y;
    }
    return a;
}

void LineSet::add(const Vec3& a, const Vec3& b, Rgb c) {
    vertices.insert(vertices.end(), {float(a.x), float(a.y), float(a.z), c.r, c.g, c.b, float(b.x), float(b.y),
                                     float(b.z), c.r, c.g, c.b});
}

LineSet build_glyphs(const FarFieldSet& s, std::size_t k, const SurfaceMesh& m, const GlyphOptions& o) {
    LineSet out;
    if (!s.has_phase() || k >= s.frequencies.size()) return out;
    const int rows = std::max(1, int(std::lround(180.0 / o.spacing_deg)));
    for (int r = 0; r < rows; ++r) {
        const double th = (r + 0.5) * 180.0 / rows;
        const int count = std::max(1, int(std::lround(360.0 * std::sin(th * deg) / o.spacing_deg)));
        for (int c = 0; c < count; ++c) {
            const double ph = (c + 0.5 * (r % 2)) * 360.0 / count;
            const double radius = surface_radius(s, m, th, ph);
            if (radius < 0.02) continue;  // below the floor: nothing to sit on
            auto f = interpolate(s, k, th, ph);
            if (!f) continue;
            const std::vector<PlanePoint> path = ellipse_path(f->e_theta, f->e_phi, o.points);
            if (path.empty()) continue;
            const Sense sense = sense_of(stokes(f->e_theta, f->e_phi));  // the core's thresholds
            const bool linear = sense != Sense::right && sense != Sense::left;
            const Rgb col = linear ? o.linear : (sense == Sense::right ? o.right : o.left);
            const Vec3 d = direction(th * deg, ph * deg);
            const Vec3 c0 = (radius + 0.015) * d;
            const Vec3 tx = phi_hat(ph * deg), ty = theta_hat(th * deg, ph * deg);
            auto place = [&](const PlanePoint& q) { return c0 + (o.size * q.x) * tx + (o.size * q.y) * ty; };
            for (std::size_t i = 0; i < path.size(); ++i) out.add(place(path[i]), place(path[(i + 1) % path.size()]), col);
            if (!linear) {
                // Arrowhead at w t = 0 pointing along the direction of travel.
                const PlanePoint a = path[0], b = path[1];
                double vx = b.x - a.x, vy = b.y - a.y;
                const double len = std::hypot(vx, vy);
                if (len > 0) {
                    vx /= len, vy /= len;
                    const double h = 0.45;  // arrowhead length relative to the semi-axis
                    const PlanePoint tip{a.x + 0.5 * h * vx, a.y + 0.5 * h * vy};
                    const PlanePoint l{tip.x - h * (vx * 0.8 - vy * 0.5), tip.y - h * (vy * 0.8 + vx * 0.5)};
                    const PlanePoint rr{tip.x - h * (vx * 0.8 + vy * 0.5), tip.y - h * (vy * 0.8 - vx * 0.5)};
                    out.add(place(tip), place(l), col);
                    out.add(place(tip), place(rr), col);
                }
            }
        }
    }
    return out;
}

LineSet build_cut_ring(const FarFieldSet& s, const SurfaceMesh& m, const std::vector<double>& theta_deg,
                       const std::vector<double>& phi_deg, Rgb colour) {
    LineSet out;
    const std::size_t n = std::min(theta_deg.size(), phi_deg.size());
    auto point = [&](std::size_t i) {
        const double r = surface_radius(s, m, theta_deg[i], phi_deg[i]);
        return (r + 0.008) * direction(theta_deg[i] * deg, phi_deg[i] * deg);
    };
    // The ring stops at the data's edge: no segment runs into the "not measured" region.
    auto sampled = [&](std::size_t i) {
        GridStencil st;
        return grid_stencil(s.grid, theta_deg[i], phi_deg[i], st);
    };
    for (std::size_t i = 0; i + 1 < n + 1 && n > 1; ++i)
        if (sampled(i) && sampled((i + 1) % n)) out.add(point(i), point((i + 1) % n), colour);
    return out;
}

LineSet build_axes(double length) {
    LineSet out;
    out.add({0, 0, 0}, {length, 0, 0}, {0.70f, 0.22f, 0.18f});
    out.add({0, 0, 0}, {0, length, 0}, {0.20f, 0.55f, 0.25f});
    out.add({0, 0, 0}, {0, 0, length}, {0.20f, 0.35f, 0.70f});
    return out;
}

}  // namespace ellipsa::viewer
