// The "not measured" region of a partly sampled grid (declared in surface_mesh.hpp).
//
// In (theta, phi) the grid samples the rectangle [theta first, theta last] x [phi first, phi last]
// (all of phi when it goes round). What lies outside is at most three rectangles: the polar caps
// above the first and below the last theta row, and the sector of phi past the last column. Each
// is covered by a coarse lat-long patch at unsampled_radius; a wall joins the data's edge (its
// boundary rows and columns as built) to that patch, so the surface is closed and the hole is gone.
#include <algorithm>
#include <cmath>

#include "viewer/scene/surface_mesh.hpp"

namespace ellipsa::viewer {

namespace {

constexpr double cap_cell_deg = 5;  // the cap's cells: it is flat grey, so a coarse grid is enough

Vec3 unit_toward(double theta_deg, double phi_deg) {
    const double t = theta_deg * deg, p = phi_deg * deg;
    return {std::sin(t) * std::cos(p), std::sin(t) * std::sin(p), std::cos(t)};
}

std::uint32_t add_vertex(UnsampledRegion& r, Vec3 p, Vec3 normal) {
    const std::uint32_t index = std::uint32_t(r.vertices.size() / surface_floats_per_vertex);
    r.vertices.insert(r.vertices.end(), {float(p.x), float(p.y), float(p.z), float(normal.x), float(normal.y), float(normal.z),
                                         unsampled_colour.r, unsampled_colour.g, unsampled_colour.b});
    return index;
}

// A lat-long patch over [t0, t1] x [p0, p1] degrees at unsampled_radius, wound like the surface
// (theta rows slow, phi columns fast, triangles a-c-b and b-c-d).
void add_cap(UnsampledRegion& r, double t0, double t1, double p0, double p1) {
    if (!(t1 > t0) || !(p1 > p0)) return;
    const int nt = std::max(1, int(std::ceil((t1 - t0) / cap_cell_deg - 1e-9)));
    const int np = std::max(1, int(std::ceil((p1 - p0) / cap_cell_deg - 1e-9)));
    const std::uint32_t first = std::uint32_t(r.vertices.size() / surface_floats_per_vertex);
    for (int i = 0; i <= nt; ++i)
        for (int j = 0; j <= np; ++j) {
            const Vec3 u = unit_toward(t0 + (t1 - t0) * i / nt, p0 + (p1 - p0) * j / np);
            add_vertex(r, unsampled_radius * u, u);
        }
    const std::uint32_t w = std::uint32_t(np + 1);
    for (int i = 0; i < nt; ++i)
        for (int j = 0; j < np; ++j) {
            const std::uint32_t a = first + std::uint32_t(i) * w + std::uint32_t(j), b = a + 1, c = a + w, d = c + 1;
            r.triangles.insert(r.triangles.end(), {a, c, b, b, c, d});
        }
}

// One edge of the data (a boundary row or column of the built surface, in order): a wall from the
// data's vertices down to the same directions at unsampled_radius, and the edge as a line lifted
// just off the surface. `normal(k)` is the wall's normal at edge point k (across the edge).
struct EdgePoint {
    Vec3 position;   // the data's vertex as built
    Vec3 direction;  // its unit direction (from the grid's angles: the vertex may be at the origin)
    Vec3 normal;     // across the edge
};

void add_edge(UnsampledRegion& r, const std::vector<EdgePoint>& edge) {
    if (edge.size() < 2) return;
    const std::uint32_t first = std::uint32_t(r.vertices.size() / surface_floats_per_vertex);
    for (const EdgePoint& e : edge) {
        add_vertex(r, e.position, e.normal);
        add_vertex(r, unsampled_radius * e.direction, e.normal);
    }
    for (std::uint32_t k = 0; k + 1 < edge.size(); ++k) {
        const std::uint32_t a = first + 2 * k, a_in = a + 1, b = a + 2, b_in = a + 3;
        r.triangles.insert(r.triangles.end(), {a, a_in, b, b, a_in, b_in});
    }
    constexpr double lift = 1.004;
    const Rgb c = unsampled_edge_colour;
    for (std::size_t k = 0; k + 1 < edge.size(); ++k)
        for (const EdgePoint* e : {&edge[k], &edge[k + 1]}) {
            const Vec3 p = lift * e->position;
            r.outline.insert(r.outline.end(), {float(p.x), float(p.y), float(p.z), c.r, c.g, c.b});
        }
}

struct EdgeSource {
    const Grid& g;
    const SurfaceMesh& m;
    Vec3 position(int i, int j) const {
        const float* v = &m.vertices[(std::size_t(i) * std::size_t(m.cols) + std::size_t(j)) * surface_floats_per_vertex];
        return {v[0], v[1], v[2]};
    }
    double phi_deg(int j) const { return g.phi.value_deg(j % g.phi.count); }
    // Row i from the first to the last column; `sign` +1 when the unsampled side lies toward higher theta.
    std::vector<EdgePoint> row(int i, double sign) const {
        std::vector<EdgePoint> e;
        const double t = g.theta.value_deg(i) * deg;
        for (int j = 0; j < m.cols; ++j) {
            const double p = phi_deg(j) * deg;
            const Vec3 theta_hat{std::cos(t) * std::cos(p), std::cos(t) * std::sin(p), -std::sin(t)};
            e.push_back({position(i, j), unit_toward(g.theta.value_deg(i), phi_deg(j)), sign * theta_hat});
        }
        return e;
    }
    // Column j from the first to the last row; `sign` +1 when the unsampled side lies toward higher phi.
    std::vector<EdgePoint> column(int j, double sign) const {
        std::vector<EdgePoint> e;
        const double p = phi_deg(j) * deg;
        const Vec3 phi_hat{-std::sin(p), std::cos(p), 0};
        for (int i = 0; i < m.rows; ++i) e.push_back({position(i, j), unit_toward(g.theta.value_deg(i), phi_deg(j)), sign * phi_hat});
        return e;
    }
};

}  // namespace

UnsampledRegion unsampled_region(const Grid& g, const SurfaceMesh& m) {
    UnsampledRegion r;
    const bool wraps = g.phi_wraps();
    if (g.sampling != Sampling::surface || g.theta.count < 2 || g.phi.count < 2 || m.rows != g.theta.count ||
        m.cols != g.phi.count + (wraps ? 1 : 0) || m.vertices.size() != std::size_t(m.rows) * std::size_t(m.cols) * surface_floats_per_vertex)
        return r;
    const double t0 = g.theta.start_deg, t1 = g.theta.last_deg();
    const double p0 = g.phi.start_deg, p1 = g.phi.last_deg();
    const EdgeSource src{g, m};
    if (!g.has_north_pole()) {
        add_cap(r, 0, t0, 0, 360);
        add_edge(r, src.row(0, -1));
    }
    if (!g.has_south_pole()) {
        add_cap(r, t1, 180, 0, 360);
        add_edge(r, src.row(m.rows - 1, +1));
    }
    if (!wraps) {
        add_cap(r, t0, t1, p1, p0 + 360);
        add_edge(r, src.column(0, -1));
        add_edge(r, src.column(m.cols - 1, +1));
    }
    return r;
}

}  // namespace ellipsa::viewer
