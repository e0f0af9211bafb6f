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

// The picking boxes only skip triangles the ray cannot reach: the hit is the one that testing
// every triangle finds (common practice for bounding-volume culling: same triangles, same test).
TEST_CASE("picking through the boxes finds the same hit as testing every triangle", "[scene][picking]") {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    const FarFieldSet s = synthesize(a, 1, 2.45e9);
    const SurfaceMesh m = *build_surface(s, 0, SurfaceOptions{});
    REQUIRE(m.pick_block_rows > 0);
    SurfaceMesh unboxed = m;
    unboxed.pick_boxes.clear();
    OrbitCamera c;
    int hits = 0;
    for (double az : {0.0, 35.0, 130.0, 250.0})
        for (double el : {-60.0, 0.0, 20.0, 75.0}) {
            c.azimuth_deg = az;
            c.elevation_deg = el;
            for (int y = 0; y <= 600; y += 50)
                for (int x = 0; x <= 800; x += 50) {
                    const Ray r = ray_through_pixel(c, x, y, 800, 600);
                    const auto fast = pick_direction(m, r), all = pick_direction(unboxed, r);
                    REQUIRE(fast.has_value() == all.has_value());
                    if (!fast) continue;
                    ++hits;
                    CHECK(fast->distance == all->distance);
                    CHECK(fast->theta_deg == all->theta_deg);
                    CHECK(fast->phi_deg == all->phi_deg);
                }
        }
    CHECK(hits > 100);
}

// A mesh rebuilt into the arrays of the one shown before is the mesh built from nothing.
TEST_CASE("a surface rebuilt over the previous one equals one built from nothing", "[scene][surface]") {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    FarFieldSet s = synthesize(a, 2, 2.45e9);
    s.frequencies.push_back(synthesize(a, 2, 2.6e9).frequencies[0]);
    SurfaceOptions rhcp;
    rhcp.component = Component::rhcp;
    rhcp.color_by = ColorBy::axial_ratio;
    SurfaceMesh shown = *build_surface(s, 0, SurfaceOptions{});
    for (auto [k, o] : {std::pair{std::size_t(1), rhcp}, std::pair{std::size_t(0), SurfaceOptions{}}, std::pair{std::size_t(1), SurfaceOptions{}}}) {
        const SurfaceMesh fresh = *build_surface(s, k, o);
        shown = std::move(*build_surface(s, k, o, nullptr, 0, std::move(shown)));
        CHECK(shown.vertices == fresh.vertices);
        CHECK(shown.triangles == fresh.triangles);
        CHECK(shown.triangles_stride2 == fresh.triangles_stride2);
        CHECK(shown.wire_lines == fresh.wire_lines);
        CHECK(shown.radius == fresh.radius);
        CHECK(shown.pick_boxes == fresh.pick_boxes);
        CHECK(shown.peak_db == fresh.peak_db);
        CHECK(shown.bar.title == fresh.bar.title);
    }
    // A different grid replaces the index lists.
    const FarFieldSet fine = synthesize(a, 1, 2.45e9);
    shown = std::move(*build_surface(fine, 0, SurfaceOptions{}, nullptr, 0, std::move(shown)));
    CHECK(shown.triangles == build_surface(fine, 0, SurfaceOptions{})->triangles);
}
