// Polarisation ellipse geometry: shape, tilt and sense against the definitions of IEEE Std
// 145-2013 and Balanis sec. 2.12 as written in conventions.md.
#include <catch2/catch.hpp>

#include <cmath>

#include "pattern/interpolate.hpp"
#include "pattern/polarisation.hpp"
#include "pattern/reference.hpp"
#include "viewer/scene/glyphs.hpp"
#include "viewer/scene/poincare.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

namespace {
const cplx j(0, 1);
double max_radius(const std::vector<PlanePoint>& p) {
    double r = 0;
    for (auto& q : p) r = std::max(r, std::hypot(q.x, q.y));
    return r;
}
double min_radius(const std::vector<PlanePoint>& p) {
    double r = 1e9;
    for (auto& q : p) r = std::min(r, std::hypot(q.x, q.y));
    return r;
}
}  // namespace

TEST_CASE("right-hand circular turns clockwise seen along propagation", "[scene][glyphs]") {
    // conventions.md: R-hat = (theta-hat - j phi-hat)/sqrt2 is right-hand (clockwise for an observer
    // looking along the propagation direction). In plane coordinates (phi-hat right, theta-hat up)
    // clockwise means a negative signed area.
    const cplx et = inv_sqrt2, ep = -j * inv_sqrt2;
    auto path = ellipse_path(et, ep, 64);
    REQUIRE(path.size() == 64);
    CHECK(signed_area2(path) < 0);
    CHECK(sense_of(stokes(et, ep)) == Sense::right);
    CHECK(max_radius(path) == Approx(inv_sqrt2).margin(1e-9));
    CHECK(min_radius(path) == Approx(inv_sqrt2).margin(1e-9));
    auto lp = ellipse_path(inv_sqrt2, j * inv_sqrt2, 64);
    CHECK(signed_area2(lp) > 0);
    CHECK(sense_of(stokes(inv_sqrt2, j * inv_sqrt2)) == Sense::left);
}

TEST_CASE("a current x + j y radiates a left-hand glyph toward +z", "[scene][glyphs]") {
    // conventions.md check: a current (x-hat + j y-hat) radiates left-hand circular toward +z.
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.phase_deg = 90;
    FarFieldSet s = synthesize(a, 2, 1e9);
    auto f = interpolate(s, 0, 0.0, 0.0);
    REQUIRE(f);
    CHECK(signed_area2(ellipse_path(f->e_theta, f->e_phi, 48)) > 0);
    a.phase_deg = -90;
    s = synthesize(a, 2, 1e9);
    f = interpolate(s, 0, 0.0, 0.0);
    CHECK(signed_area2(ellipse_path(f->e_theta, f->e_phi, 48)) < 0);
}

TEST_CASE("semi-axes give the axial ratio and the major axis the tilt", "[scene][glyphs]") {
    // Balanis sec. 2.12: major = (|E_R| + |E_L|)/sqrt2, minor = ||E_R| - |E_L||/sqrt2 (in units of |E|);
    // AR = major/minor; tilt of the major axis from theta-hat toward phi-hat.
    for (auto [et, ep] : {std::pair<cplx, cplx>{1.0, 0.5 * j}, {0.8, cplx(0.3, 0.4)}, {cplx(0.2, 0.1), cplx(-0.6, 0.3)}}) {
        EllipseAxes ax = ellipse_axes(et, ep);
        CHECK(ax.semi_major * ax.semi_major + ax.semi_minor * ax.semi_minor == Approx(1).margin(1e-12));
        CHECK(ax.semi_major / ax.semi_minor == Approx(axial_ratio(et, ep)).epsilon(1e-9));
        auto path = ellipse_path(et, ep, 3600);
        CHECK(max_radius(path) == Approx(ax.semi_major).epsilon(1e-5));
        CHECK(min_radius(path) == Approx(ax.semi_minor).epsilon(1e-4));
        // Direction of the farthest point: angle from theta-hat (y) toward phi-hat (x).
        PlanePoint far{};
        for (auto& q : path)
            if (std::hypot(q.x, q.y) > std::hypot(far.x, far.y)) far = q;
        double ang = std::atan2(far.x, far.y) / deg;
        if (ang > 90) ang -= 180;
        if (ang <= -90) ang += 180;
        CHECK(ang == Approx(tilt_deg(stokes(et, ep))).margin(0.2));
    }
}

TEST_CASE("a linear field at 30 degrees draws a line at 30 degrees", "[scene][glyphs]") {
    const cplx et = std::cos(30 * deg), ep = std::sin(30 * deg);
    EllipseAxes ax = ellipse_axes(et, ep);
    CHECK(ax.semi_major == Approx(1));
    CHECK(ax.semi_minor == Approx(0).margin(1e-12));
    auto path = ellipse_path(et, ep, 8);
    CHECK(path[0].x == Approx(0.5));
    CHECK(path[0].y == Approx(std::sqrt(3) / 2));
    CHECK(signed_area2(path) == Approx(0).margin(1e-12));
    CHECK(ellipse_path(0, 0, 8).empty());
}

TEST_CASE("glyphs sit on the surface with sense colours", "[scene][glyphs]") {
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    a.phase_deg = -90;  // right-hand toward +z, left-hand toward -z
    FarFieldSet s = synthesize(a, 2, 1e9);
    auto m = build_surface(s, 0, SurfaceOptions{});
    REQUIRE(m);
    GlyphOptions o;
    LineSet g = build_glyphs(s, 0, *m, o);
    REQUIRE(g.segments() > 100);
    int right_up = 0, left_down = 0;
    for (std::size_t k = 0; k < g.vertices.size(); k += 6) {
        const float* v = &g.vertices[k];
        const bool is_right = v[3] == o.right.r && v[4] == o.right.g;
        const bool is_left = v[3] == o.left.r && v[4] == o.left.g;
        if (v[2] > 0.5f) {
            right_up += is_right;
            CHECK_FALSE(is_left);
        }
        if (v[2] < -0.5f) {
            left_down += is_left;
            CHECK_FALSE(is_right);
        }
        // Every glyph point lies near the surface (radius <= 1 plus the lift and the glyph size).
        CHECK(std::sqrt(v[0] * v[0] + v[1] * v[1] + v[2] * v[2]) < 1.1f);
    }
    CHECK(right_up > 0);
    CHECK(left_down > 0);
    // Without phase there is nothing to draw.
    s.content = FieldContent::magnitude_only;
    CHECK(build_glyphs(s, 0, *m, o).segments() == 0);
}

TEST_CASE("Poincare points: circular at the poles, linear on the equator", "[scene][poincare]") {
    // Stokes with V > 0 right-hand (conventions.md): RHCP at s3 = +1.
    PoincarePoint r = poincare_point(stokes(inv_sqrt2, -j * inv_sqrt2));
    CHECK(r.s3 == Approx(1));
    PoincarePoint l = poincare_point(stokes(inv_sqrt2, j * inv_sqrt2));
    CHECK(l.s3 == Approx(-1));
    PoincarePoint h = poincare_point(stokes(1.0, 0.0));
    CHECK(h.s1 == Approx(1));
    PoincarePoint d = poincare_point(stokes(inv_sqrt2, inv_sqrt2));
    CHECK(d.s2 == Approx(1));
    CHECK(d.s1 == Approx(0).margin(1e-12));
}

TEST_CASE("the Poincare cloud of a z dipole is one point: theta-linear", "[scene][poincare]") {
    ReferenceAntenna a;
    a.kind = ReferenceKind::dipole;
    FarFieldSet s = synthesize(a, 2, 1e9);
    auto cloud = poincare_cloud(s, 0, 3.0, 100000);
    REQUIRE(!cloud.empty());
    for (const PoincarePoint& p : cloud) {
        CHECK(p.s1 == Approx(1).margin(1e-9));
        CHECK(p.below_peak_db >= -3.0 - 1e-9);
    }
    // Half-wave dipole HPBW 78 deg (Balanis sec. 4.5): within 3 dB lies theta in about 51..129 deg,
    // i.e. 40 of the 91 theta rows (2-degree grid), all 180 phi columns.
    CHECK(cloud.size() == Approx(40 * 180).epsilon(0.06));
    CHECK(poincare_cloud(s, 0, 3.0, 500).size() <= 500);
}

TEST_CASE("the Poincare sphere view puts s3 up", "[scene][poincare]") {
    SpherePoint2 top = view_sphere_point(0, 0, 1, 30, 20);
    CHECK(top.y == Approx(std::cos(20 * deg)));
    CHECK(top.x == Approx(0).margin(1e-12));
    SpherePoint2 eye = view_sphere_point(std::cos(20 * deg) * std::cos(30 * deg), std::cos(20 * deg) * std::sin(30 * deg),
                                         std::sin(20 * deg), 30, 20);
    CHECK(eye.depth == Approx(1));
}
