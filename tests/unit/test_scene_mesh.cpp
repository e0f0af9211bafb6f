// The gain surface mesh: radius mapping, geometry against closed-form patterns, colours and the
// messages for data that cannot give a component.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <limits>

#include "pattern/reference.hpp"
#include "viewer/scene/surface_mesh.hpp"

using namespace ellipsa;
using namespace ellipsa::viewer;

namespace {
FarFieldSet short_dipole(double step) {
    ReferenceAntenna a;
    a.kind = ReferenceKind::short_dipole;
    return synthesize(a, step, 1e9);
}
// The vertex position of grid sample (i, j).
Vec3 vertex(const SurfaceMesh& m, int i, int j) {
    const float* v = &m.vertices[(std::size_t(i) * m.cols + j) * surface_floats_per_vertex];
    return {v[0], v[1], v[2]};
}
Vec3 normal(const SurfaceMesh& m, int i, int j) {
    const float* v = &m.vertices[(std::size_t(i) * m.cols + j) * surface_floats_per_vertex];
    return {v[3], v[4], v[5]};
}
Rgb colour(const SurfaceMesh& m, int i, int j) {
    const float* v = &m.vertices[(std::size_t(i) * m.cols + j) * surface_floats_per_vertex];
    return {v[6], v[7], v[8]};
}
}  // namespace

TEST_CASE("radius from dB spans the dynamic range linearly", "[scene][mesh]") {
    CHECK(radius_from_db(10, 10, 30) == Approx(1));
    CHECK(radius_from_db(-20, 10, 30) == Approx(0));
    CHECK(radius_from_db(-5, 10, 30) == Approx(0.5));
    CHECK(radius_from_db(-50, 10, 30) == 0);
    CHECK(radius_from_db(-INFINITY, 10, 30) == 0);
    CHECK(radius_from_db(NAN, 10, 30) == 0);
}

TEST_CASE("short dipole surface: peak 1.76 dBi at the equator, null on the axis", "[scene][mesh]") {
    // Balanis, Antenna Theory, sec. 4.2: U ~ sin^2(theta), D = 1.5 (1.76 dBi).
    FarFieldSet s = short_dipole(2);
    SurfaceOptions o;
    o.range_db = 30;
    auto m = build_surface(s, 0, o);
    REQUIRE(m);
    CHECK(m->peak_db == Approx(10 * std::log10(1.5)).margin(0.01));
    CHECK(m->unit == "dBi");
    CHECK(m->rows == 91);
    CHECK(m->cols == 181);  // 180 phi samples plus the seam column
    CHECK(m->vertices.size() == std::size_t(91 * 181 * surface_floats_per_vertex));
    CHECK(m->triangles.size() == std::size_t(90 * 180 * 6));
    // theta = 90 deg (row 45): radius 1, pointing along phi.
    Vec3 p = vertex(*m, 45, 0);
    CHECK(norm(p) == Approx(1).margin(1e-6));
    CHECK(p.x == Approx(1).margin(1e-6));
    // theta = 45 deg (row 22.5 -> use theta = 44 deg, row 22): sin^2 -> dB below the peak.
    const double below = 10 * std::log10(std::pow(std::sin(44 * deg), 2));
    CHECK(norm(vertex(*m, 22, 7)) == Approx(1 + below / 30).margin(1e-5));
    // On the axis the field is zero: the surface closes at the origin.
    CHECK(norm(vertex(*m, 0, 3)) == Approx(0).margin(1e-6));
    // The seam column repeats phi = 0.
    Vec3 a = vertex(*m, 30, 0), b = vertex(*m, 30, 180);
    CHECK(a.x == Approx(b.x));
    CHECK(a.y == Approx(b.y));
    // Peak colour is the top of the gain map.
    Rgb top = map_color(ColorMap::viridis, 1), c = colour(*m, 45, 10);
    CHECK(c.r == Approx(top.r).margin(1e-4));
    CHECK(c.g == Approx(top.g).margin(1e-4));
    CHECK(m->bar.min == Approx(m->peak_db - 30));
    CHECK(m->bar.max == Approx(m->peak_db));
}

TEST_CASE("surface normals point outward", "[scene][mesh]") {
    // An isotropic field (|E| = 1 everywhere) gives the unit sphere, whose normals are radial.
    FarFieldSet s = short_dipole(5);
    for (auto& e : s.frequencies[0].e_theta) e = 1;
    for (auto& e : s.frequencies[0].e_phi) e = 0;
    auto m = build_surface(s, 0, SurfaceOptions{});
    REQUIRE(m);
    for (int i = 1; i + 1 < m->rows; i += 3)
        for (int j = 0; j < m->cols; j += 7) {
            Vec3 p = vertex(*m, i, j), n = normal(*m, i, j);
            CHECK(norm(p) == Approx(1).margin(1e-6));
            CHECK(dot(normalized(p), n) > 0.999);
        }
    // Triangles wind counter-clockwise seen from outside (needed for back-face culling).
    for (std::size_t k = 0; k < m->triangles.size(); k += 3 * 97) {
        auto at = [&](std::uint32_t v) {
            const float* f = &m->vertices[std::size_t(v) * surface_floats_per_vertex];
            return Vec3{f[0], f[1], f[2]};
        };
        Vec3 a = at(m->triangles[k]), b = at(m->triangles[k + 1]), c = at(m->triangles[k + 2]);
        Vec3 n = cross(b - a, c - a);
        if (norm(n) < 1e-9) continue;  // degenerate at the poles
        CHECK(dot(n, a + b + c) > 0);
    }
}

TEST_CASE("colour by axial ratio follows AR = 1/|cos t| of crossed dipoles", "[scene][mesh]") {
    // conventions.md, closed-form references: two short dipoles in quadrature are circular along
    // their common normal and AR = 1/|cos t| at angle t from it.
    ReferenceAntenna a;
    a.kind = ReferenceKind::crossed_dipoles;
    FarFieldSet s = synthesize(a, 2, 1e9);
    SurfaceOptions o;
    o.color_by = ColorBy::axial_ratio;
    o.axial_ratio_max_db = 20;
    auto m = build_surface(s, 0, o);
    REQUIRE(m);
    CHECK(m->bar.unit == "dB");
    // theta = 60 deg: AR = 2 -> 6.02 dB -> t = 6.02 / 20.
    Rgb want = map_color(ColorMap::viridis, 20 * std::log10(2.0) / 20), got = colour(*m, 30, 11);
    CHECK(got.r == Approx(want.r).margin(2e-3));
    CHECK(got.g == Approx(want.g).margin(2e-3));
    CHECK(got.b == Approx(want.b).margin(2e-3));
    // theta = 0: circular, bottom of the bar.
    Rgb c0 = colour(*m, 0, 0), w0 = map_color(ColorMap::viridis, 0);
    CHECK(c0.r == Approx(w0.r).margin(2e-3));
}

TEST_CASE("polarisation colourings agree with the core's figures of each sample", "[scene][mesh]") {
    // The colours are made in single precision (pattern/colour_math.hpp); the figures they show
    // are the core's decompose() (axial ratio, RHCP and LHCP powers, tilt: IEEE Std 145 terms,
    // conventions.md). Crossed dipoles in quadrature (circular on their axis: no tilt there, grey)
    // and 60 deg out of quadrature, turned (elliptical and tilted everywhere).
    for (double phase : {-90.0, -60.0}) {
        ReferenceAntenna a;
        a.kind = ReferenceKind::crossed_dipoles;
        a.phase_deg = phase;
        if (phase != -90) a.orientation = rotation_xyz_deg(17, 29, 11);
        const FarFieldSet s = synthesize(a, 3, 1e9);
        struct Case {
            ColorBy by;
            ColorMap map;
        };
        for (auto [by, map] : {Case{ColorBy::axial_ratio, ColorMap::viridis}, Case{ColorBy::circular_balance, ColorMap::diverging},
                               Case{ColorBy::tilt, ColorMap::cyclic}}) {
            SurfaceOptions o;
            o.color_by = by;
            auto m = build_surface(s, 0, o);
            REQUIRE(m);
            double worst = 0;
            int grey = 0;
            for (int i = 0; i < s.grid.theta.count; ++i)
                for (int j = 0; j < s.grid.phi.count; ++j) {
                    const std::size_t n = s.grid.index(i, j);
                    const PolarisationState p = decompose(s.frequencies[0].e_theta[n], s.frequencies[0].e_phi[n],
                                                          s.grid.phi.value_deg(j) * deg, s.ludwig3_reference);
                    double t = std::numeric_limits<double>::quiet_NaN();
                    if (by == ColorBy::axial_ratio && !std::isnan(p.axial_ratio))
                        t = std::min(20 * std::log10(p.axial_ratio), o.axial_ratio_max_db) / o.axial_ratio_max_db;
                    if (by == ColorBy::circular_balance)
                        t = 0.5 + 0.5 * std::clamp(10 * std::log10(p.rhcp / p.lhcp) / o.balance_range_db, -1.0, 1.0);
                    if (by == ColorBy::tilt) t = (p.tilt_deg + 90) / 180;
                    grey += std::isnan(t);
                    const Rgb want = map_color(map, t), got = colour(*m, i, j);
                    worst = std::max({worst, double(std::abs(got.r - want.r)), double(std::abs(got.g - want.g)), double(std::abs(got.b - want.b))});
                }
            CHECK(worst < 1e-5);  // a 1/255 colour step is 3.9e-3
            if (by == ColorBy::tilt) CHECK((grey > 0) == (phase == -90));
        }
    }
}

TEST_CASE("A minus B colours a 3 dB drop on the diverging map", "[scene][mesh]") {
    FarFieldSet a = short_dipole(3), b = a;
    for (auto& e : b.frequencies[0].e_theta) e *= std::sqrt(0.5);  // B is 3.01 dB below A everywhere
    SurfaceOptions o;
    o.color_by = ColorBy::difference;
    o.difference_range_db = 6;
    auto m = build_surface(a, 0, o, &b, 0);
    REQUIRE(m);
    const double d = 10 * std::log10(2.0);
    Rgb want = map_color(ColorMap::diverging, 0.5 + 0.5 * d / 6), got = colour(*m, 30, 5);
    CHECK(got.r == Approx(want.r).margin(1e-3));
    CHECK(got.b == Approx(want.b).margin(1e-3));
    CHECK(m->bar.map == ColorMap::diverging);
    // Without B the difference view is refused with a reason.
    auto none = build_surface(a, 0, o);
    REQUIRE_FALSE(none);
    CHECK(none.error().message.find("second pattern") != std::string::npos);
}

TEST_CASE("components that need phase are refused for magnitude-only data", "[scene][mesh]") {
    FarFieldSet s = short_dipole(5);
    s.content = FieldContent::magnitude_only;
    SurfaceOptions o;
    o.component = Component::rhcp;
    auto m = build_surface(s, 0, o);
    REQUIRE_FALSE(m);
    CHECK(m.error().message.find("phase") != std::string::npos);
    o.component = Component::theta;
    o.color_by = ColorBy::tilt;
    auto t = build_surface(s, 0, o);
    REQUIRE_FALSE(t);
    CHECK(t.error().message.find("phase") != std::string::npos);
    o.color_by = ColorBy::component;
    CHECK(build_surface(s, 0, o));
}

TEST_CASE("surface radius between samples is bilinear", "[scene][mesh]") {
    FarFieldSet s = short_dipole(2);
    auto m = build_surface(s, 0, SurfaceOptions{});
    REQUIRE(m);
    CHECK(surface_radius(s, *m, 90, 17) == Approx(1).margin(1e-6));
    const double r44 = norm(vertex(*m, 22, 0)), r46 = norm(vertex(*m, 23, 0));
    CHECK(surface_radius(s, *m, 45, 0) == Approx(0.5 * (r44 + r46)).margin(1e-6));
}

TEST_CASE("level of detail keeps cells a few pixels wide", "[scene][mesh]") {
    // Unit radius at distance 5.4, fov 30 deg, 470 px high: 470 / (2 tan 15 deg 5.4) = 162 px.
    CHECK(lod_stride(1.0, 470, 30, 5.4) == 1);   // 2.8 px cells
    CHECK(lod_stride(0.5, 470, 30, 5.4) == 2);   // 1.4 px -> every 2nd line
    CHECK(lod_stride(0.25, 470, 30, 5.4) == 4);
    CHECK(lod_stride(0.5, 470, 30, 2.0) == 1);   // zoomed in: full detail
    // The coarse lists cover the same surface: same corners, fewer triangles.
    FarFieldSet s = short_dipole(1);
    auto m = build_surface(s, 0, SurfaceOptions{});
    REQUIRE(m);
    CHECK(m->triangles_stride2.size() == std::size_t(90 * 180 * 6));
    CHECK(m->triangles_stride4.size() == std::size_t(45 * 90 * 6));
    std::uint32_t max2 = 0;
    for (std::uint32_t v : m->triangles_stride2) max2 = std::max(max2, v);
    CHECK(max2 == std::uint32_t(m->rows * m->cols - 1));
}
