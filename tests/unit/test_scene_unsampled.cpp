// The "not measured" region of a partly sampled pattern (viewer/scene/surface_mesh.hpp,
// UnsampledRegion): present over exactly the directions the grid leaves out, absent for a full
// sphere, drawn in its own neutral grey, and never picked as data. The geometry is checked
// against the grid's own angles (common practice: a region is right when its directions are).
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/reference.hpp"
#include "viewer/scene/camera.hpp"
#include "viewer/scene/glyphs.hpp"
#include "viewer/scene/picking.hpp"
#include "viewer/scene/surface_mesh.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

namespace {

// A small loop (Balanis sec. 5.2: sin(theta) pattern, maximum in the horizon) on a grid that
// samples theta from t0 to t1 and phi from 0 over `phi_count` steps of `step` degrees.
FarFieldSet loop_on(double t0, double t1, double step, int phi_count) {
    Grid g;
    g.theta = {t0, step, int(std::lround((t1 - t0) / step)) + 1};
    g.phi = {0, step, phi_count};
    ReferenceAntenna a;
    a.kind = ReferenceKind::small_loop;
    return synthesize_on(a, g, 2.45e9);
}

double theta_of(double x, double y, double z) { return std::atan2(std::hypot(x, y), z) / deg; }

}  // namespace

TEST_CASE("a full sphere has no not-measured region", "[scene][unsampled]") {
    ReferenceAntenna a;
    a.kind = ReferenceKind::small_loop;
    const FarFieldSet s = synthesize(a, 5, 2.45e9);
    auto m = build_surface(s, 0, SurfaceOptions{});
    REQUIRE(m.ok());
    CHECK(m->unsampled.empty());
    CHECK(m->unsampled.outline.empty());
}

TEST_CASE("an upper hemisphere gets a grey cap below the horizon and its edge as a line", "[scene][unsampled]") {
    const FarFieldSet s = loop_on(0, 90, 5, 72);
    auto m = build_surface(s, 0, SurfaceOptions{});
    REQUIRE(m.ok());
    const UnsampledRegion& r = m->unsampled;
    REQUIRE_FALSE(r.empty());
    REQUIRE(r.vertices.size() % surface_floats_per_vertex == 0);
    double lowest = 1;
    for (std::size_t k = 0; k < r.vertices.size(); k += surface_floats_per_vertex) {
        const float* v = &r.vertices[k];
        // Nothing of the region stands in the sampled directions (above the horizon).
        CHECK(v[2] <= 1e-6f);
        lowest = std::min(lowest, double(v[2]));
        // Its own grey, never a colour-map colour.
        CHECK(v[6] == unsampled_colour.r);
        CHECK(v[7] == unsampled_colour.g);
        CHECK(v[8] == unsampled_colour.b);
    }
    // The cap reaches the nadir at its fixed radius.
    CHECK(lowest == Approx(-unsampled_radius).margin(1e-6));
    for (std::uint32_t i : r.triangles) CHECK(i < r.vertices.size() / surface_floats_per_vertex);
    // The data's edge, the theta = 90 row as built, one segment per phi step round the horizon.
    REQUIRE(r.outline.size() == std::size_t(72) * 2 * 6);
    for (std::size_t k = 0; k < r.outline.size(); k += 6) CHECK(r.outline[k + 2] == Approx(0).margin(1e-6));
}

TEST_CASE("a sector of phi and a band of theta leave out the rest of the sphere", "[scene][unsampled]") {
    // theta 30..150, phi 0..180: both caps and the sector phi 180..360.
    const FarFieldSet s = loop_on(30, 150, 5, 37);
    auto m = build_surface(s, 0, SurfaceOptions{});
    REQUIRE(m.ok());
    const UnsampledRegion& r = m->unsampled;
    REQUIRE_FALSE(r.empty());
    int caps = 0, sector = 0;
    for (std::size_t k = 0; k < r.vertices.size(); k += surface_floats_per_vertex) {
        const float* v = &r.vertices[k];
        // The cap's vertices (normal radial); the wall's (normal across the edge) join it to the data.
        const double radial = (v[0] * v[3] + v[1] * v[4] + v[2] * v[5]) / unsampled_radius;
        if (std::abs(radial - 1) > 1e-4) continue;
        const double t = theta_of(v[0], v[1], v[2]);
        if (t < 30 + 1e-3 || t > 150 - 1e-3) ++caps;  // the polar caps (their edge rows at 30 and 150 too)
        else {
            CHECK(v[1] <= 1e-6f);  // inside the band: only the unsampled sector (y <= 0)
            ++sector;
        }
    }
    CHECK(caps > 0);
    CHECK(sector > 0);
}

TEST_CASE("the not-measured region is never picked as data", "[scene][unsampled][picking]") {
    const FarFieldSet s = loop_on(0, 90, 5, 72);
    auto m = build_surface(s, 0, SurfaceOptions{});
    REQUIRE(m.ok());
    // From straight below, the cap; from straight above, the data.
    auto below = pick_direction(*m, Ray{{0.01, 0.02, -3}, {0, 0, 1}});
    REQUIRE(below);
    CHECK_FALSE(below->measured);
    auto above = pick_direction(*m, Ray{{0.01, 0.02, 3}, {0, 0, -1}});
    REQUIRE(above);
    CHECK(above->measured);
    CHECK(above->theta_deg < 90);
    // A sweep of the view from below the horizon: every pick that says "measured" lies in the
    // sampled directions (theta <= 90), and the region is met.
    OrbitCamera c;
    c.azimuth_deg = 30;
    c.elevation_deg = -35;
    int data = 0, none = 0;
    for (int py = 0; py < 60; ++py)
        for (int px = 0; px < 80; ++px) {
            auto p = pick_direction(*m, ray_through_pixel(c, px * 10 + 5, py * 10 + 5, 800, 600));
            if (!p) continue;
            if (p->measured) {
                ++data;
                CHECK(p->theta_deg <= 90 + 1e-6);
            } else {
                ++none;
            }
        }
    CHECK(data > 0);
    CHECK(none > 100);
}

TEST_CASE("the cut ring stops at the data's edge instead of crossing the not-measured region", "[scene][unsampled]") {
    const FarFieldSet s = loop_on(0, 90, 5, 72);
    auto m = build_surface(s, 0, SurfaceOptions{});
    REQUIRE(m.ok());
    // The great circle phi = 0 / 180 (an elevation cut), half of it below the horizon.
    std::vector<double> theta, phi;
    for (int a = 0; a < 360; ++a) {
        theta.push_back(a <= 180 ? a : 360 - a);
        phi.push_back(a <= 180 ? 0 : 180);
    }
    const LineSet ring = build_cut_ring(s, *m, theta, phi, Rgb{0, 0, 0});
    REQUIRE(ring.segments() > 100);  // the sampled half is drawn
    for (std::size_t k = 0; k < ring.vertices.size(); k += 6) CHECK(ring.vertices[k + 2] >= -1e-6f);
}
