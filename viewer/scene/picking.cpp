#include "viewer/scene/picking.hpp"

#include <algorithm>
#include <cmath>
#include <utility>
#include <vector>

#include "pattern/vec3.hpp"

namespace ellipsa::viewer {

namespace {

struct Hit {
    double best = 1e300;
    glm::dvec3 point{0};
};

// Moller-Trumbore on triangles [k0, k1) of a list (indices into it, steps of 3) over interleaved
// vertices (surface_floats_per_vertex each).
void test_triangles(const std::vector<float>& vertices, const std::vector<std::uint32_t>& triangles, const Ray& ray, std::size_t k0,
                    std::size_t k1, Hit& h) {
    const float* v = vertices.data();
    auto at = [&](std::uint32_t i) {
        const float* p = v + std::size_t(i) * surface_floats_per_vertex;
        return glm::dvec3(p[0], p[1], p[2]);
    };
    for (std::size_t k = k0; k + 2 < k1; k += 3) {
        const glm::dvec3 p0 = at(triangles[k]), p1 = at(triangles[k + 1]), p2 = at(triangles[k + 2]);
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
        if (t > 0 && t < h.best) {
            h.best = t;
            h.point = ray.origin + t * ray.dir;
        }
    }
}

// Where the ray enters a box (slab test, padded against rounding), or nothing when it misses.
bool enters_box(const Ray& ray, const float* box, double& t_enter) {
    constexpr double pad = 1e-6;
    double t0 = 0, t1 = 1e300;
    for (int a = 0; a < 3; ++a) {
        const double lo = box[a] - pad, hi = box[3 + a] + pad, o = ray.origin[a], d = ray.dir[a];
        if (std::abs(d) < 1e-300) {
            if (o < lo || o > hi) return false;
            continue;
        }
        double ta = (lo - o) / d, tb = (hi - o) / d;
        if (ta > tb) std::swap(ta, tb);
        t0 = std::max(t0, ta);
        t1 = std::min(t1, tb);
        if (t0 > t1) return false;
    }
    t_enter = t0;
    return true;
}

// Only the triangles of the blocks the ray crosses, nearest block first, stopping once the
// nearest hit lies before the next block.
void test_blocks(const SurfaceMesh& m, const Ray& ray, Hit& h) {
    std::vector<std::pair<double, std::size_t>> crossed;
    const std::size_t nb = std::size_t(m.pick_block_rows) * std::size_t(m.pick_block_cols);
    for (std::size_t b = 0; b < nb; ++b) {
        double t;
        if (enters_box(ray, &m.pick_boxes[b * 6], t)) crossed.emplace_back(t, b);
    }
    std::sort(crossed.begin(), crossed.end());
    const std::size_t cells_c = std::size_t(m.cols - 1), rows_c = std::size_t(m.rows - 1);
    for (const auto& [t, b] : crossed) {
        if (t > h.best) break;
        const std::size_t br = b / std::size_t(m.pick_block_cols), bc = b % std::size_t(m.pick_block_cols);
        const std::size_t j0 = bc * pick_block, j1 = std::min(cells_c, j0 + pick_block);
        for (std::size_t i = br * pick_block; i < std::min(rows_c, (br + 1) * pick_block); ++i)
            test_triangles(m.vertices, m.triangles, ray, (i * cells_c + j0) * 6, (i * cells_c + j1) * 6, h);
    }
}

}  // namespace

std::optional<Pick> pick_direction(const SurfaceMesh& m, const Ray& ray) {
    // The surface lies inside the unit ball: skip everything when the ray misses it.
    const double b = glm::dot(ray.origin, ray.dir);
    const double c = glm::dot(ray.origin, ray.origin) - 1.0001;
    if (b * b - c < 0) return std::nullopt;

    Hit h;
    const bool blocked = m.rows > 1 && m.cols > 1 && m.pick_block_rows > 0 &&
                         m.pick_boxes.size() == std::size_t(m.pick_block_rows) * std::size_t(m.pick_block_cols) * 6 &&
                         m.triangles.size() == std::size_t(m.rows - 1) * std::size_t(m.cols - 1) * 6;
    if (blocked) test_blocks(m, ray, h);
    else test_triangles(m.vertices, m.triangles, ray, 0, m.triangles.size(), h);
    Hit none;
    test_triangles(m.unsampled.vertices, m.unsampled.triangles, ray, 0, m.unsampled.triangles.size(), none);
    const bool measured = !(none.best < h.best);
    if (!measured) h = none;
    if (h.best == 1e300 || glm::length(h.point) < 1e-6) return std::nullopt;
    Pick p;
    p.point = h.point;
    p.distance = h.best;
    p.measured = measured;
    double th, ph;
    to_spherical(Vec3{h.point.x, h.point.y, h.point.z}, th, ph);
    p.theta_deg = th / deg;
    p.phi_deg = ph / deg;
    return p;
}

}  // namespace ellipsa::viewer
