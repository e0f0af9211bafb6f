// Picking a direction from a ray, and the orbit camera's projection it relies on.
#include <catch2/catch.hpp>

#include "pattern/reference.hpp"
#include "viewer/scene/camera.hpp"
#include "viewer/scene/picking.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

namespace {
SurfaceMesh unit_sphere(FarFieldSet& s) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;
    s = synthesize(a, 2, 1e9);
    for (auto& e : s.frequencies[0].e_theta) e = 1;
    for (auto& e : s.frequencies[0].e_phi) e = 0;
    return *build_surface(s, 0, SurfaceOptions{});
}
}  // namespace

TEST_CASE("the centre pixel looks at the origin from the eye", "[scene][picking]") {
    OrbitCamera c;
    c.azimuth_deg = 0;
    c.elevation_deg = 0;
    Ray r = ray_through_pixel(c, 400, 300, 800, 600);
    CHECK(r.dir.x == Approx(-1).margin(1e-6));
    CHECK(r.dir.y == Approx(0).margin(1e-6));
    CHECK(r.dir.z == Approx(0).margin(1e-6));
    // With +z up on screen: the top of the view is toward +z.
    Projected top = project(c, {0, 0, 1}, 800, 600), mid = project(c, {0, 0, 0}, 800, 600);
    CHECK(top.y < mid.y);
    CHECK(mid.x == Approx(400).margin(1e-6));
    // Looking from +x, +y is to the right (right-handed axes seen from outside).
    Projected y = project(c, {0, 1, 0}, 800, 600);
    CHECK(y.x > 400);
}

TEST_CASE("picking the unit sphere returns the direction under the cursor", "[scene][picking]") {
    FarFieldSet s;
    SurfaceMesh m = unit_sphere(s);
    OrbitCamera c;
    c.azimuth_deg = 0, c.elevation_deg = 0;
    auto p = pick_direction(m, ray_through_pixel(c, 400, 300, 800, 600));
    REQUIRE(p);
    CHECK(p->theta_deg == Approx(90).margin(0.05));
    CHECK(std::min(p->phi_deg, 360 - p->phi_deg) == Approx(0).margin(0.05));
    CHECK(p->distance == Approx(c.distance - 1 - 0.05).margin(0.01));  // the ray starts on the near plane
    c.look_from(OrbitCamera::Preset::pz);
    p = pick_direction(m, ray_through_pixel(c, 400, 300, 800, 600));
    REQUIRE(p);
    CHECK(p->theta_deg == Approx(0.5).margin(0.6));  // the eye sits 0.5 deg off the pole
}

TEST_CASE("project then pick recovers a direction on the surface", "[scene][picking]") {
    FarFieldSet s;
    SurfaceMesh m = unit_sphere(s);
    OrbitCamera c;  // default oblique view
    for (auto [th, ph] : {std::pair{60.0, 30.0}, {80.0, 10.0}, {45.0, 50.0}}) {
        const Vec3 d = direction(th * deg, ph * deg);
        Projected q = project(c, {d.x, d.y, d.z}, 1000, 700);
        REQUIRE(q.visible);
        auto p = pick_direction(m, ray_through_pixel(c, q.x, q.y, 1000, 700));
        REQUIRE(p);
        // Flat triangles sit inside the sphere by at most 1 - cos(1.4 deg), so the hit lies
        // within about a degree of the true direction.
        CHECK(p->theta_deg == Approx(th).margin(1.0));
        CHECK(p->phi_deg == Approx(ph).margin(1.0));
    }
}

TEST_CASE("a ray that misses the surface picks nothing", "[scene][picking]") {
    FarFieldSet s;
    SurfaceMesh m = unit_sphere(s);
    OrbitCamera c;
    c.azimuth_deg = 0, c.elevation_deg = 0;
    CHECK_FALSE(pick_direction(m, ray_through_pixel(c, 2, 2, 800, 600)));
    CHECK_FALSE(pick_direction(m, Ray{{5, 0, 0}, {1, 0, 0}}));
}

TEST_CASE("the orbit camera keeps its elevation off the poles and its zoom bounded", "[scene][picking]") {
    OrbitCamera c;
    c.orbit(0, 10000);
    CHECK(c.elevation_deg == Approx(89.5));
    c.orbit(0, -100000);
    CHECK(c.elevation_deg == Approx(-89.5));
    c.zoom(1000);
    CHECK(c.distance >= 1.2);
    c.reset();
    CHECK(c.distance == OrbitCamera{}.distance);
}
