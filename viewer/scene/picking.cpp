#include "viewer/scene/picking.hpp"

#include <cmath>

#include "pattern/vec3.hpp"

namespace ellipsa::viewer {

std::optional<Pick> pick_direction(const SurfaceMesh& m, const Ray& ray) {
    // The surface lies inside the unit ball: skip everything when the ray misses it.
    const double b = glm::dot(ray.origin, ray.dir);
    const double c = glm::dot(ray.origin, ray.origin) - 1.0001;
    if (b * b - c < 0) return std::nullopt;

    const float* v = m.vertices.data();
    auto at = [&](std::uint32_t i) {
        const float* p = v + std::size_t(i) * surface_floats_per_vertex;
        return glm::dvec3(p[0], p[1], p[2]);
    };
    double best = 1e300;
    glm::dvec3 hit{0};
    for (std::size_t k = 0; k + 2 < m.triangles.size(); k += 3) {
        const glm::dvec3 p0 = at(m.triangles[k]), p1 = at(m.triangles[k + 1]), p2 = at(m.triangles[k + 2]);
        const glm::dvec3 e1 = p1 - p0, e2 = p2 - p0;
        const glm::dvec3 pv = glm::cross(ray.dir, e2);
        const double det = glm::dot(e1, pv);
        if (std::abs(det) < 1e-14) continue;
        const double inv = 1.0 / det;
        const glm::dvec3 tv = ray.origin - p0;
        const double u = glm::dot(tv, pv) * inv;
        if (u < 0 || u > 1) continue;
        const glm::dvec3 qv = glm::cross(tv, e1);
        const double w = glm::dot(ray.dir, qv) * inv;
        if (w < 0 || u + w > 1) continue;
        const double t = glm::dot(e2, qv) * inv;
        if (t > 0 && t < best) {
            best = t;
            hit = ray.origin + t * ray.dir;
        }
    }
    if (best == 1e300 || glm::length(hit) < 1e-6) return std::nullopt;
    Pick p;
    p.point = hit;
    p.distance = best;
    double th, ph;
    to_spherical(Vec3{hit.x, hit.y, hit.z}, th, ph);
    p.theta_deg = th / deg;
    p.phi_deg = ph / deg;
    return p;
}

}  // namespace ellipsa::viewer
